<?xml version="1.0" encoding="utf-8"?>
<!DOCTYPE TS>
<TS version="2.1" language="de_DE">
<context>
    <name>gramline::gui</name>
    <message>
        <location filename="../app/formats/cautions_text.cpp" line="+9"/>
        <source>Before you run a plan</source>
        <translation>Bevor Sie einen Plan ausführen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gramline plans where waveplates turn and how long detectors count. It knows nothing about your laser, your enclosure or your building. A plan is a list of motor positions and times, not a permission to run it.</source>
        <translation>Gramline plant, wohin sich Wellenplatten drehen und wie lange Detektoren zählen. Es weiß nichts über Ihren Laser, Ihre Einhausung oder Ihr Gebäude. Ein Plan ist eine Liste von Motorpositionen und Zeiten, keine Erlaubnis, ihn auszuführen.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Laser safety</source>
        <translation>Lasersicherheit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>The pump laser that makes the photon pairs is usually far more powerful than the pairs themselves. Its class, its beam path and the eyewear it requires are set by your local laser rules, not by this program.</source>
        <translation>Der Pumplaser, der die Photonenpaare erzeugt, ist meist weit stärker als die Paare selbst. Seine Klasse, sein Strahlengang und die nötige Schutzbrille richten sich nach Ihren örtlichen Laserschutzregeln, nicht nach diesem Programm.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Keep beam enclosures closed and interlocks working while motors turn; a rotating optic can send a stray reflection where none was before.</source>
        <translation>Halten Sie Strahleinhausungen geschlossen und Interlocks wirksam, solange Motoren drehen; eine drehende Optik kann einen Streureflex dorthin lenken, wo vorher keiner war.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Never defeat or bypass an interlock to let a plan run through.</source>
        <translation>Setzen Sie niemals ein Interlock außer Kraft und überbrücken Sie es nie, damit ein Plan durchläuft.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Ask your laser safety officer before changing the optical set-up to match a plan.</source>
        <translation>Fragen Sie Ihren Laserschutzbeauftragten, bevor Sie den optischen Aufbau an einen Plan anpassen.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Unattended overnight operation</source>
        <translation>Unbeaufsichtigter Betrieb über Nacht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Running overnight without a person in the lab needs the approval your institution requires; many labs require a written procedure and a sign on the door.</source>
        <translation>Ein Nachtbetrieb ohne Person im Labor braucht die Genehmigung, die Ihre Einrichtung verlangt; viele Labore verlangen eine schriftliche Arbeitsanweisung und ein Schild an der Tür.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Check that the motors, controller and counting electronics stop safely on a power cut, a computer crash or an interlock trip, and that the laser shuts off with them.</source>
        <translation>Prüfen Sie, dass Motoren, Steuerung und Zählelektronik bei Stromausfall, Rechnerabsturz oder Auslösen eines Interlocks sicher anhalten und dass der Laser mit ihnen abschaltet.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Check the window end: the plan stops at the time you entered, but the laser does not stop by itself.</source>
        <translation>Prüfen Sie das Fensterende: Der Plan endet zur eingegebenen Zeit, der Laser aber schaltet sich nicht von selbst ab.</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Leave contact details of the person responsible for the run where the night staff can see them.</source>
        <translation>Hinterlassen Sie die Kontaktdaten der für den Lauf verantwortlichen Person so, dass das Nachtpersonal sie sieht.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Local rules come first</source>
        <translation>Örtliche Regeln gehen vor</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Where these notes and your local rules differ, follow your local rules and your laser safety officer.</source>
        <translation>Wo diese Hinweise und Ihre örtlichen Regeln voneinander abweichen, folgen Sie Ihren örtlichen Regeln und Ihrem Laserschutzbeauftragten.</translation>
    </message>
    <message>
        <location filename="../app/gui/cautions.cpp" line="+36"/>
        <source>Cautions</source>
        <translation>Sicherheitshinweise</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Before the first export</source>
        <translation>Vor dem ersten Export</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>I have read this</source>
        <translation>Ich habe das gelesen</translation>
    </message>
    <message>
        <location filename="../app/gui/gui_text.cpp" line="+18"/>
        <source>%1 s</source>
        <translation>%1 s</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>%1 min %2 s</source>
        <translation>%1 min %2 s</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>%1 h %2 min</source>
        <translation>%1 h %2 min</translation>
    </message>
    <message>
        <location line="+40"/>
        <source>measure</source>
        <translation>Messung</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>reference</source>
        <translation>Referenz</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>dark</source>
        <translation>Dunkel</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>park</source>
        <translation>Parken</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>train × train</source>
        <translation>Training × Training</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>test × train</source>
        <translation>Test × Training</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>–</source>
        <translation>–</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>preparation</source>
        <translation>Präparation</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>analysis</source>
        <translation>Analyse</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>HWP</source>
        <translation>HWP</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>QWP</source>
        <translation>QWP</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>shortest way</source>
        <translation>kürzester Weg</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>approach from below</source>
        <translation>von unten anfahren</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>all motors at once</source>
        <translation>alle Motoren gleichzeitig</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>one motor at a time</source>
        <translation>ein Motor nach dem anderen</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>pass port only (Poisson)</source>
        <translation>nur Durchlassausgang (Poisson)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>both ports (binomial)</source>
        <translation>beide Ausgänge (binomial)</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>normal approximation</source>
        <translation>Normalapproximation</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Wilson score interval</source>
        <translation>Wilson-Score-Intervall</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Hoeffding (distribution-free)</source>
        <translation>Hoeffding (verteilungsfrei)</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>uniform (same pairs; every entry meets ε)</source>
        <translation>gleichmäßig (gleiche Paare; jeder Eintrag erreicht ε)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Neyman (pairs where variance is)</source>
        <translation>Neyman (Paare, wo die Varianz ist)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>margin-aware (pairs where the decision is)</source>
        <translation>margin-bewusst (Paare, wo die Entscheidung fällt)</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>one feature per photon, linear polarization</source>
        <translation>ein Merkmal pro Photon, lineare Polarisation</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>two features per photon, polar and azimuth</source>
        <translation>zwei Merkmale je Photon, Polar- und Azimutwinkel</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>features spread over the photons</source>
        <translation>Merkmale über die Photonen verteilt</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>custom weights</source>
        <translation>eigene Gewichte</translation>
    </message>
    <message>
        <location filename="../app/gui/campaign_files.cpp" line="+29"/>
        <source>Gramline campaign (*.json);;All files (*)</source>
        <translation>Gramline-Kampagne (*.json);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location filename="../app/gui/margin_view.cpp" line="+35"/>
        <source>%1 %</source>
        <translation>%1 %</translation>
    </message>
    <message>
        <location filename="../app/gui/hand_off.cpp" line="+38"/>
        <source>Gramline bundle (*.zip);;All files (*)</source>
        <translation>Gramline-Bündel (*.zip);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Counts file (*.csv);;All files (*)</source>
        <translation>Zähldatei (*.csv);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location line="+19"/>
        <source>%1: unexpected error while ingesting</source>
        <translation>%1: unerwarteter Fehler beim Einlesen</translation>
    </message>
    <message>
        <location line="+24"/>
        <source>%1: unexpected error while planning the rest</source>
        <translation>%1: unerwarteter Fehler beim Planen des Rests</translation>
    </message>
</context>
<context>
    <name>gramline::gui::CampaignDocument</name>
    <message>
        <location filename="../app/gui/campaign_document.cpp" line="+83"/>
        <source>Untitled</source>
        <translation>Unbenannt</translation>
    </message>
</context>
<context>
    <name>gramline::gui::CampaignFiles</name>
    <message>
        <location filename="../app/gui/campaign_files.cpp" line="+26"/>
        <source>Unsaved changes</source>
        <translation>Ungespeicherte Änderungen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>“%1” has changes that are not saved. Save them first?</source>
        <translation>„%1“ hat ungespeicherte Änderungen. Zuerst speichern?</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>untitled</source>
        <translation>unbenannt</translation>
    </message>
    <message>
        <location line="+21"/>
        <source>Cannot open campaign</source>
        <translation>Kampagne kann nicht geöffnet werden</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Open Campaign</source>
        <translation>Kampagne öffnen</translation>
    </message>
    <message>
        <location line="+12"/>
        <source>Saved %1</source>
        <translation>%1 gespeichert</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Cannot save campaign</source>
        <translation>Kampagne kann nicht gespeichert werden</translation>
    </message>
    <message>
        <location line="+17"/>
        <source>Save Campaign</source>
        <translation>Kampagne speichern</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Import Data</source>
        <translation>Daten importieren</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>CSV files (*.csv);;All files (*)</source>
        <translation>CSV-Dateien (*.csv);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Import data</source>
        <translation>Daten importieren</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>The encoding was rebuilt for %1 features on the rig&apos;s %2 photon(s).</source>
        <translation>Die Kodierung wurde für %1 Merkmale auf den %2 Photon(en) des Aufbaus neu erstellt.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Cannot import data</source>
        <translation>Daten können nicht importiert werden</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>No current plan</source>
        <translation>Kein aktueller Plan</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Wait until the plan is up to date, then export it.</source>
        <translation>Warten Sie, bis der Plan aktuell ist, und exportieren Sie ihn dann.</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Export Plan Files To</source>
        <translation>Plandateien exportieren nach</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Wrote steps.json, steps.csv, summary.json and kernel.csv to %1</source>
        <translation>steps.json, steps.csv, summary.json und kernel.csv nach %1 geschrieben</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Cannot export</source>
        <translation>Export nicht möglich</translation>
    </message>
</context>
<context>
    <name>gramline::gui::CompareView</name>
    <message>
        <location filename="../app/gui/compare_view.cpp" line="+33"/>
        <source>Nights</source>
        <translation>Nächte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Calendar span</source>
        <translation>Kalenderspanne</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Busy time</source>
        <translation>Belegte Zeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Move time</source>
        <translation>Fahrzeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Counting time</source>
        <translation>Zählzeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Reference, dark and park time</source>
        <translation>Zeit für Referenz, Dunkel und Parken</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Worst half-width</source>
        <translation>Größte Halbbreite</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gram error (Frobenius σ)</source>
        <translation>Gram-Fehler (Frobenius-σ)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Detected pairs</source>
        <translation>Detektierte Paare</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Settings</source>
        <translation>Einstellungen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Steps</source>
        <translation>Schritte</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Pin the current plan, change the campaign (precision, sharing of pairs, rig speed, nights…), and both plans stand side by side here with their differences.</source>
        <translation>Heften Sie den aktuellen Plan an, ändern Sie die Kampagne (Präzision, Verteilung der Paare, Geschwindigkeit des Aufbaus, Nächte …), und beide Pläne stehen hier nebeneinander, mit ihren Unterschieden.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Plans compared</source>
        <translation>Verglichene Pläne</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Pin the Current Plan</source>
        <translation>Aktuellen Plan &amp;anheften</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Clear the Pin</source>
        <translation>Angehefteten Plan lösen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Use the Minimum Budget That Passes</source>
        <translation>Kleinstes bestehendes Budget verwenden</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Pins the current plan, then sets fixed pairs per entry to the smallest budget the margin check found passing; the comparison shows the nights it then needs.</source>
        <translation>Heftet den aktuellen Plan an und setzt dann feste Paare pro Eintrag auf das kleinste Budget, das die Margin-Prüfung bestehen sah; der Vergleich zeigt die Nächte, die es dann braucht.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Use Margin-Aware Sharing</source>
        <translation>Margin-bewusst verteilen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Pins the current plan, then shares pairs where the decision is (margin-aware allocation).</source>
        <translation>Heftet den aktuellen Plan an und verteilt dann die Paare dorthin, wo die Entscheidung fällt (margin-bewusste Verteilung).</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Pinned and current plan</source>
        <translation>Angehefteter und aktueller Plan</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Pinned</source>
        <translation>Angeheftet</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Current</source>
        <translation>Aktuell</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Current − pinned</source>
        <translation>Aktuell − angeheftet</translation>
    </message>
    <message>
        <location line="+63"/>
        <source>%1 pairs per entry</source>
        <translation>%1 Paare pro Eintrag</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>ε %1</source>
        <translation>ε %1</translation>
    </message>
    <message numerus="yes">
        <location line="+1"/>
        <source>%1: %2, %3, up to %n night(s)</source>
        <translation>
            <numerusform>%1: %2, %3, bis zu %n Nacht</numerusform>
            <numerusform>%1: %2, %3, bis zu %n Nächte</numerusform>
        </translation>
    </message>
    <message>
        <location line="+7"/>
        <source>not checked yet</source>
        <translation>noch nicht geprüft</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>pass</source>
        <translation>bestanden</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>fail</source>
        <translation>nicht bestanden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>%1 (largest flip %2 %)</source>
        <translation>%1 (größte Kipp-Wahrscheinlichkeit %2 %)</translation>
    </message>
    <message>
        <location line="+24"/>
        <source>The margin check&apos;s advice: %1 pairs per entry pass (%2 of counting); the current plan counts %3.</source>
        <translation>Rat der Margin-Prüfung: %1 Paare pro Eintrag bestehen (%2 Zählzeit); der aktuelle Plan zählt %3.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>The margin check found no smaller passing budget.</source>
        <translation>Die Margin-Prüfung fand kein kleineres bestehendes Budget.</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>The margin check&apos;s advice appears when it is done.</source>
        <translation>Der Rat der Margin-Prüfung erscheint, sobald sie fertig ist.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>&lt;b&gt;Pinned&lt;/b&gt; %1</source>
        <translation>&lt;b&gt;Angeheftet&lt;/b&gt; %1</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;b&gt;Pinned&lt;/b&gt;: nothing yet.</source>
        <translation>&lt;b&gt;Angeheftet&lt;/b&gt;: noch nichts.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;b&gt;Current&lt;/b&gt; %1</source>
        <translation>&lt;b&gt;Aktuell&lt;/b&gt; %1</translation>
    </message>
    <message>
        <location line="+30"/>
        <source>better than the pinned plan</source>
        <translation>besser als der angeheftete Plan</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>worse than the pinned plan</source>
        <translation>schlechter als der angeheftete Plan</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Fits its nights</source>
        <translation>Passt in seine Nächte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>yes</source>
        <translation>ja</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>no</source>
        <translation>nein</translation>
    </message>
    <message>
        <location line="+6"/>
        <location line="+9"/>
        <source>same</source>
        <translation>gleich</translation>
    </message>
    <message>
        <location line="-8"/>
        <location line="+8"/>
        <source>changed</source>
        <translation>geändert</translation>
    </message>
    <message>
        <location line="-6"/>
        <source>Margin verdict</source>
        <translation>Margin-Urteil</translation>
    </message>
</context>
<context>
    <name>gramline::gui::DataModel</name>
    <message>
        <location filename="../app/gui/rig_tables.cpp" line="+40"/>
        <source>train</source>
        <translation>Training</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>test</source>
        <translation>Test</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>Point</source>
        <translation>Punkt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Set</source>
        <translation>Menge</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Class</source>
        <translation>Klasse</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>feature %1</source>
        <translation>Merkmal %1</translation>
    </message>
</context>
<context>
    <name>gramline::gui::DataPage</name>
    <message>
        <location filename="../app/gui/data_page.cpp" line="+21"/>
        <location line="+1"/>
        <source>Campaign name</source>
        <translation>Kampagnenname</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Rename campaign</source>
        <translation>Kampagne umbenennen</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Import CSV…</source>
        <translation>CSV importieren…</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Import data from a CSV file</source>
        <translation>Daten aus einer CSV-Datei importieren</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Replace the points with a CSV file: numeric feature columns, a “label” column with two classes, an optional “set” column (train or test)</source>
        <translation>Die Punkte durch eine CSV-Datei ersetzen: numerische Merkmalsspalten, eine Spalte „label“ mit zwei Klassen, optional eine Spalte „set“ (train oder test)</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Use demo data</source>
        <translation>Demodaten verwenden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Load the demo campaign</source>
        <translation>Die Demokampagne laden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Replace the whole campaign with the bundled demo</source>
        <translation>Die ganze Kampagne durch die mitgelieferte Demo ersetzen</translation>
    </message>
    <message>
        <location line="+15"/>
        <source>Points of the data set</source>
        <translation>Punkte des Datensatzes</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>%1 training points (%2 “%3”, %4 “%5”), %6 test points, %7 features.</source>
        <translation>%1 Trainingspunkte (%2 „%3“, %4 „%5“), %6 Testpunkte, %7 Merkmale.</translation>
    </message>
</context>
<context>
    <name>gramline::gui::DecisionMap</name>
    <message>
        <location filename="../app/gui/margin_view.cpp" line="+38"/>
        <source>Data and decision boundary</source>
        <translation>Daten und Entscheidungsgrenze</translation>
    </message>
    <message>
        <location line="+119"/>
        <source>feature %1</source>
        <translation>Merkmal %1</translation>
    </message>
    <message numerus="yes">
        <location line="+41"/>
        <source>With %n feature(s) the boundary is not a line in a plane. Each point will be placed at its decision value once the margin check is done.</source>
        <translation>
            <numerusform>Mit %n Merkmal ist die Grenze keine Linie in einer Ebene. Jeder Punkt wird an seinen Entscheidungswert gesetzt, sobald die Margin-Prüfung fertig ist.</numerusform>
            <numerusform>Mit %n Merkmalen ist die Grenze keine Linie in einer Ebene. Jeder Punkt wird an seinen Entscheidungswert gesetzt, sobald die Margin-Prüfung fertig ist.</numerusform>
        </translation>
    </message>
    <message>
        <location line="+40"/>
        <location line="+2"/>
        <source>%1, training</source>
        <translation>%1, Training</translation>
    </message>
    <message>
        <location line="-1"/>
        <source>%1, test</source>
        <translation>%1, Test</translation>
    </message>
    <message>
        <location line="+36"/>
        <source>noiseless decision value f</source>
        <translation>rauschfreier Entscheidungswert f</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>&lt;b&gt;Test point %1&lt;/b&gt; (point %2), class %3</source>
        <translation>&lt;b&gt;Testpunkt %1&lt;/b&gt; (Punkt %2), Klasse %3</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>&lt;br&gt;noiseless f = %1&lt;br&gt;flip probability %2 (%3 – %4)</source>
        <translation>&lt;br&gt;rauschfrei f = %1&lt;br&gt;Kippwahrscheinlichkeit %2 (%3 – %4)</translation>
    </message>
</context>
<context>
    <name>gramline::gui::EditorPage</name>
    <message>
        <location filename="../app/gui/editor_page.cpp" line="+39"/>
        <location line="+61"/>
        <source>Change %1</source>
        <translation>%1 ändern</translation>
    </message>
    <message>
        <location line="-22"/>
        <source>Turn on %1</source>
        <translation>%1 einschalten</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Turn off %1</source>
        <translation>%1 ausschalten</translation>
    </message>
</context>
<context>
    <name>gramline::gui::EditorPanel</name>
    <message>
        <location filename="../app/gui/editor_panel.cpp" line="+36"/>
        <source>Campaign editor pages</source>
        <translation>Seiten des Kampagnen-Editors</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Data</source>
        <translation>&amp;Daten</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Encoding</source>
        <translation>&amp;Kodierung</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Rig</source>
        <translation>&amp;Aufbau</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Precision</source>
        <translation>&amp;Präzision</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Nights</source>
        <translation>&amp;Nächte</translation>
    </message>
</context>
<context>
    <name>gramline::gui::EncodingPage</name>
    <message>
        <location filename="../app/gui/encoding_page.cpp" line="+27"/>
        <source>Each photon&apos;s polarization state is set by the features: the polar angle θ and the azimuth φ on the Bloch sphere are affine in the features.</source>
        <translation>Der Polarisationszustand jedes Photons wird von den Merkmalen eingestellt: Polarwinkel θ und Azimut φ auf der Bloch-Kugel hängen affin von den Merkmalen ab.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Build from a preset</source>
        <translation>Aus einer Vorlage erstellen</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Encoding preset</source>
        <translation>Kodierungsvorlage</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Preset</source>
        <translation>Vorlage</translation>
    </message>
    <message>
        <location line="+12"/>
        <source> from</source>
        <translation> von</translation>
    </message>
    <message>
        <location line="+1"/>
        <source> to</source>
        <translation> bis</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>to</source>
        <translation>bis</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Polar angle θ spans</source>
        <translation>Polarwinkel θ überstreicht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Azimuth φ spans</source>
        <translation>Azimut φ überstreicht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Apply preset to the training ranges</source>
        <translation>Vorlage auf die Trainingsbereiche anwenden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Maps each feature&apos;s training range onto the chosen angle span</source>
        <translation>Bildet den Trainingsbereich jedes Merkmals auf die gewählte Winkelspanne ab</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Scale</source>
        <translation>Skalierung</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Scale factor</source>
        <translation>Skalierungsfaktor</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Scale all weights</source>
        <translation>Alle Gewichte skalieren</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Multiply weights by</source>
        <translation>Gewichte multiplizieren mit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Use the suggested scale</source>
        <translation>Vorgeschlagene Skalierung übernehmen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>The margin check scans scale factors: a scale too small makes every state alike, too large makes every pair of points look unrelated</source>
        <translation>Die Margin-Prüfung durchsucht Skalierungsfaktoren: Ist die Skalierung zu klein, gleichen sich alle Zustände; ist sie zu groß, wirkt jedes Punktepaar unabhängig</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>Current map (degrees per feature unit)</source>
        <translation>Aktuelle Abbildung (Grad pro Merkmalseinheit)</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Double-click a cell to edit it: weights are one number per feature, separated by semicolons; offsets are in degrees.</source>
        <translation>Doppelklicken Sie eine Zelle, um sie zu bearbeiten: Gewichte sind eine Zahl je Merkmal, durch Semikolons getrennt; Versätze sind in Grad.</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>Encoding weights</source>
        <translation>Kodierungsgewichte</translation>
    </message>
    <message>
        <location line="+24"/>
        <source>Photon</source>
        <translation>Photon</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>θ weights</source>
        <translation>θ-Gewichte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>θ offset</source>
        <translation>θ-Versatz</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>φ weights</source>
        <translation>φ-Gewichte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>φ offset</source>
        <translation>φ-Versatz</translation>
    </message>
    <message>
        <location line="+42"/>
        <source>%1: &apos;%2&apos; is not a list of finite numbers</source>
        <translation>%1: „%2“ ist keine Liste endlicher Zahlen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>%1: %2 number(s) given, %3 expected (one per feature)</source>
        <translation>%1: %2 Zahl(en) angegeben, %3 erwartet (eine je Merkmal)</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>Edit %1</source>
        <translation>%1 bearbeiten</translation>
    </message>
    <message>
        <location line="+16"/>
        <source>No data</source>
        <translation>Keine Daten</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Import or load data before encoding it.</source>
        <translation>Importieren oder laden Sie Daten, bevor Sie sie kodieren.</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>Apply encoding preset</source>
        <translation>Kodierungsvorlage anwenden</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Preset does not fit</source>
        <translation>Vorlage passt nicht</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Scale encoding by %1</source>
        <translation>Kodierung mit %1 skalieren</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>The margin check found no scale to suggest.</source>
        <translation>Die Margin-Prüfung hat keine Skalierung vorzuschlagen gefunden.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>&lt;tr&gt;&lt;td align=right&gt;× %1&lt;/td&gt;&lt;td align=right&gt;%2&lt;/td&gt;&lt;td align=right&gt;%3 %&lt;/td&gt;&lt;/tr&gt;</source>
        <translation>&lt;tr&gt;&lt;td align=right&gt;× %1&lt;/td&gt;&lt;td align=right&gt;%2&lt;/td&gt;&lt;td align=right&gt;%3 %&lt;/td&gt;&lt;/tr&gt;</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>&lt;p&gt;From the last margin check: the suggested scale is &lt;b&gt;× %1&lt;/b&gt; of the current weights.&lt;/p&gt;&lt;table cellspacing=6&gt;&lt;tr&gt;&lt;th&gt;scale&lt;/th&gt;&lt;th&gt;alignment&lt;/th&gt;&lt;th&gt;held-out accuracy&lt;/th&gt;&lt;/tr&gt;%2&lt;/table&gt;</source>
        <translation>&lt;p&gt;Aus der letzten Margin-Prüfung: Die vorgeschlagene Skalierung ist &lt;b&gt;× %1&lt;/b&gt; der aktuellen Gewichte.&lt;/p&gt;&lt;table cellspacing=6&gt;&lt;tr&gt;&lt;th&gt;Skalierung&lt;/th&gt;&lt;th&gt;Ausrichtung&lt;/th&gt;&lt;th&gt;Genauigkeit auf zurückgehaltenen Daten&lt;/th&gt;&lt;/tr&gt;%2&lt;/table&gt;</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>The scale advice appears when the margin check of the current plan is done.</source>
        <translation>Der Skalierungsvorschlag erscheint, sobald die Margin-Prüfung des aktuellen Plans fertig ist.</translation>
    </message>
</context>
<context>
    <name>gramline::gui::GramView</name>
    <message>
        <location filename="../app/gui/gram_view.cpp" line="+141"/>
        <source>Training × training (the Gram matrix)</source>
        <translation>Training × Training (die Gram-Matrix)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Test × training (for predictions)</source>
        <translation>Test × Training (für Vorhersagen)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Block of the kernel shown</source>
        <translation>Angezeigter Block des Kernels</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Ideal kernel</source>
        <translation>Idealer Kernel</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Predicted σ per entry</source>
        <translation>Vorhergesagtes σ pro Eintrag</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Planned pairs per entry</source>
        <translation>Geplante Paare pro Eintrag</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>file order</source>
        <translation>Dateireihenfolge</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>grouped by class</source>
        <translation>nach Klasse gruppiert</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Order of the points in the maps</source>
        <translation>Reihenfolge der Punkte in den Karten</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Rows: the point prepared; columns: the training point analysed. “Grouped by class” puts all points of one class first, a line between the classes; the pale diagonal of σ and pairs is not measured (it is 1 by construction). Darker is larger on every map.</source>
        <translation>Zeilen: der präparierte Punkt; Spalten: der analysierte Trainingspunkt. „Nach Klasse gruppiert“ stellt alle Punkte einer Klasse voran, mit einer Linie zwischen den Klassen; die helle Diagonale von σ und Paaren wird nicht gemessen (sie ist per Konstruktion 1). Dunkler heißt auf jeder Karte größer.</translation>
    </message>
    <message>
        <location line="+36"/>
        <source>Hover over an entry to see its values, the step that measures it and when.</source>
        <translation>Zeigen Sie auf einen Eintrag, um seine Werte, den Schritt, der ihn misst, und dessen Zeitpunkt zu sehen.</translation>
    </message>
    <message>
        <location line="-38"/>
        <source>Entry under the pointer</source>
        <translation>Eintrag unter dem Zeiger</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>Show</source>
        <translation>Anzeigen</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Points in</source>
        <translation>Punkte in</translation>
    </message>
    <message>
        <location line="+60"/>
        <source>&lt;b&gt;Entry (%1, %2)&lt;/b&gt;&lt;br&gt;kernel %3&lt;br&gt;σ %4&lt;br&gt;%5 pairs</source>
        <translation>&lt;b&gt;Eintrag (%1, %2)&lt;/b&gt;&lt;br&gt;Kernel %3&lt;br&gt;σ %4&lt;br&gt;%5 Paare</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+1"/>
        <source>train %1</source>
        <translation>Training %1</translation>
    </message>
    <message>
        <location line="-1"/>
        <source>test %1</source>
        <translation>Test %1</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>&lt;br&gt;step %1, night %2, %3</source>
        <translation>&lt;br&gt;Schritt %1, Nacht %2, %3</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>&lt;br&gt;diagonal: 1 by construction (reference steps)</source>
        <translation>&lt;br&gt;Diagonale: per Konstruktion 1 (Referenzschritte)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;br&gt;not measured</source>
        <translation>&lt;br&gt;nicht gemessen</translation>
    </message>
</context>
<context>
    <name>gramline::gui::HandOff</name>
    <message>
        <location filename="../app/gui/hand_off.cpp" line="+21"/>
        <source>Hand-off status</source>
        <translation>Übergabestatus</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Working on the counts</source>
        <translation>Zähldaten werden verarbeitet</translation>
    </message>
    <message>
        <location line="+33"/>
        <source>Export &amp;Bundle…</source>
        <translation>&amp;Bündel exportieren…</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Write one zip file for the rig: steps, campaign, data, checksums and a printable summary</source>
        <translation>Eine ZIP-Datei für den Aufbau schreiben: Schritte, Kampagne, Daten, Prüfsummen und eine druckbare Zusammenfassung</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Ingest &amp;Counts…</source>
        <translation>Zähldaten ein&amp;lesen…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Compare the counts a rig wrote for a bundle with the prediction</source>
        <translation>Die Zähldaten, die ein Aufbau für ein Bündel geschrieben hat, mit der Vorhersage vergleichen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Res&amp;ume from Counts…</source>
        <translation>Aus Zähldaten for&amp;tsetzen…</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Plan the steps a partial night did not count, as a new bundle</source>
        <translation>Die Schritte, die eine unvollständige Nacht nicht gezählt hat, als neues Bündel planen</translation>
    </message>
    <message>
        <location line="+47"/>
        <source>No current plan</source>
        <translation>Kein aktueller Plan</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Wait until the plan is up to date, then export it.</source>
        <translation>Warten Sie, bis der Plan aktuell ist, und exportieren Sie ihn dann.</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Export Bundle</source>
        <translation>Bündel exportieren</translation>
    </message>
    <message>
        <location line="+10"/>
        <location line="+22"/>
        <source>Cannot export the bundle</source>
        <translation>Das Bündel kann nicht exportiert werden</translation>
    </message>
    <message>
        <location line="-21"/>
        <source>%1: the plan is not up to date yet; nothing was written.</source>
        <translation>%1: Der Plan ist noch nicht aktuell; es wurde nichts geschrieben.</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>Wrote the bundle %1 (%2 files, manifest SHA-256 %3…)</source>
        <translation>Bündel %1 geschrieben (%2 Dateien, Manifest SHA-256 %3…)</translation>
    </message>
    <message>
        <location line="+9"/>
        <location line="+201"/>
        <source>The bundle %1 was not written.

%2</source>
        <translation>Das Bündel %1 wurde nicht geschrieben.

%2</translation>
    </message>
    <message>
        <location line="-182"/>
        <source>Ingest Counts: Choose the Bundle the Rig Ran</source>
        <translation>Zähldaten einlesen: Bündel wählen, das der Aufbau ausgeführt hat</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Ingest Counts: Choose the Counts File for %1</source>
        <translation>Zähldaten einlesen: Zähldatei für %1 wählen</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Ingesting %1…</source>
        <translation>%1 wird eingelesen…</translation>
    </message>
    <message>
        <location line="-142"/>
        <source>Cannot ingest the counts</source>
        <translation>Die Zähldaten können nicht eingelesen werden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Nothing was ingested; your campaign and the Measured view are unchanged.

%1</source>
        <translation>Es wurde nichts eingelesen; Ihre Kampagne und die Ansicht „Gemessen“ sind unverändert.

%1</translation>
    </message>
    <message>
        <location line="+153"/>
        <source>Ingested %1: %2 of %3 entries measured.</source>
        <translation>%1 eingelesen: %2 von %3 Einträgen gemessen.</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Resume: Choose the Bundle the Rig Ran</source>
        <translation>Fortsetzen: Bündel wählen, das der Aufbau ausgeführt hat</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Resume: Choose the Partial Counts File for %1</source>
        <translation>Fortsetzen: unvollständige Zähldatei für %1 wählen</translation>
    </message>
    <message>
        <location line="+72"/>
        <source>Planning the rest after %1…</source>
        <translation>Der Rest nach %1 wird geplant…</translation>
    </message>
    <message>
        <location line="-229"/>
        <source>Cannot resume</source>
        <translation>Fortsetzen nicht möglich</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Nothing was planned; your campaign is unchanged.

%1</source>
        <translation>Es wurde nichts geplant; Ihre Kampagne ist unverändert.

%1</translation>
    </message>
    <message>
        <location line="+20"/>
        <source>Rehearse with a Simulated &amp;Rig…</source>
        <translation>&amp;Probelauf mit simuliertem Aufbau…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Play a bundle against the rig model, save the counts it would record (marked as simulated) and ingest them, to try the hand-off before booking the laser</source>
        <translation>Ein Bündel gegen das Modell des Aufbaus abspielen, die Zähldaten speichern, die er aufzeichnen würde (als simuliert markiert), und sie einlesen, um die Übergabe vor der Buchung des Lasers zu erproben</translation>
    </message>
    <message>
        <location line="+144"/>
        <source>Rehearse: Choose the Bundle to Play</source>
        <translation>Probelauf: Bündel zum Abspielen wählen</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Rehearse: Save the Simulated Counts</source>
        <translation>Probelauf: Simulierte Zähldaten speichern</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>-simulated</source>
        <translation>-simuliert</translation>
    </message>
    <message>
        <location line="+15"/>
        <source>Cannot rehearse</source>
        <translation>Probelauf nicht möglich</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>No counts file was written.

%1</source>
        <translation>Es wurde keine Zähldatei geschrieben.

%1</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>Resume: First Night of the Rest</source>
        <translation>Fortsetzen: erste Nacht des Rests</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>When can the rig measure again? The rest is laid on the nights from that date, leaving out the campaign&apos;s nights to skip.</source>
        <translation>Wann kann der Aufbau wieder messen? Der Rest wird auf die Nächte ab diesem Datum gelegt, ohne die auszulassenden Nächte der Kampagne.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>The day after the last night counted</source>
        <translation>Der Tag nach der letzten gezählten Nacht</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>First night of the rest</source>
        <translation>Erste Nacht des Rests</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>First night</source>
        <translation>Erste Nacht</translation>
    </message>
    <message>
        <location line="+26"/>
        <source>Resume from Counts</source>
        <translation>Aus Zähldaten fortsetzen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;b&gt;%1 entries are measured; %2 remain.&lt;/b&gt; The remaining entries are planned from where the motors stopped. Save the new bundle and run it on the rig; it names %3 as its parent and carries the counts measured so far.</source>
        <translation>&lt;b&gt;%1 Einträge sind gemessen; %2 bleiben.&lt;/b&gt; Die übrigen Einträge werden ab der Stelle geplant, an der die Motoren stehen geblieben sind. Speichern Sie das neue Bündel und führen Sie es auf dem Aufbau aus; es nennt %3 als Vorgänger und enthält die bisher gemessenen Zähldaten.</translation>
    </message>
    <message>
        <location line="+16"/>
        <source>Steps to run</source>
        <translation>Auszuführende Schritte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Nights</source>
        <translation>Nächte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>%1 of %2 allowed</source>
        <translation>%1 von %2 erlaubten</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Total time</source>
        <translation>Gesamtzeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Counting time</source>
        <translation>Zählzeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Moving time</source>
        <translation>Fahrzeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gram error of the new plan (Frobenius σ)</source>
        <translation>Gram-Fehler des neuen Plans (Frobenius-σ)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>The same report as the command line prints:</source>
        <translation>Derselbe Bericht, den die Kommandozeile ausgibt:</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Resume report</source>
        <translation>Fortsetzungsbericht</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Save New Bundle…</source>
        <translation>Neues Bündel speichern…</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Save the new bundle</source>
        <translation>Das neue Bündel speichern</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Save the Resumed Bundle</source>
        <translation>Fortgesetztes Bündel speichern</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>-resumed</source>
        <translation>-fortgesetzt</translation>
    </message>
    <message>
        <location line="+20"/>
        <source>Wrote the resumed bundle %1 (%2 files)</source>
        <translation>Fortgesetztes Bündel %1 geschrieben (%2 Dateien)</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Cannot save the resumed bundle</source>
        <translation>Das fortgesetzte Bündel kann nicht gespeichert werden</translation>
    </message>
</context>
<context>
    <name>gramline::gui::HelpView</name>
    <message>
        <location filename="../app/gui/help_view.cpp" line="+66"/>
        <source>Guide pages</source>
        <translation>Seiten der Anleitung</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>User guide text</source>
        <translation>Text des Benutzerhandbuchs</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Find in this page</source>
        <translation>Auf dieser Seite suchen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Find in the user guide</source>
        <translation>Im Benutzerhandbuch suchen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>About this guide</source>
        <translation>Über diese Anleitung</translation>
    </message>
    <message>
        <location line="+12"/>
        <source>&amp;Find:</source>
        <translation>&amp;Suchen:</translation>
    </message>
    <message>
        <location line="+16"/>
        <source>Gramline user guide</source>
        <translation>Gramline-Benutzerhandbuch</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gramline plans the measurement of a quantum kernel with polarization-encoded photon pairs: the waveplate angles of every setting, the order of the settings, the pairs per Gram matrix entry, the nights, the predicted error and the margin check.</source>
        <translation>Gramline plant die Messung eines Quantenkernels mit polarisationskodierten Photonenpaaren: die Wellenplattenwinkel jeder Einstellung, die Reihenfolge der Einstellungen, die Paare pro Eintrag der Gram-Matrix, die Nächte, den vorhergesagten Fehler und die Margin-Prüfung.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>The pages on the left are the project&apos;s README: the job step by step with the formulas used and their published sources, the file formats, the command line and the cautions. They are written in English whatever the interface language.</source>
        <translation>Die Seiten links sind die README des Projekts: die Aufgabe Schritt für Schritt mit den verwendeten Formeln und ihren veröffentlichten Quellen, die Dateiformate, die Kommandozeile und die Sicherheitshinweise. Sie sind unabhängig von der Sprache der Oberfläche auf Englisch geschrieben.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>The cautions on laser safety and unattended operation are also in the Cautions view of the main window (Help &gt; Cautions). Read them before the first run.</source>
        <translation>Die Sicherheitshinweise zu Lasersicherheit und unbeaufsichtigtem Betrieb stehen auch in der Ansicht „Sicherheitshinweise“ des Hauptfensters (Hilfe &gt; Sicherheitshinweise). Lesen Sie sie vor dem ersten Lauf.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>The guide text is missing from this build of Gramline.</source>
        <translation>Der Text der Anleitung fehlt in diesem Build von Gramline.</translation>
    </message>
    <message>
        <location line="+36"/>
        <source>Gramline User Guide</source>
        <translation>Gramline-Benutzerhandbuch</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>About Gramline</source>
        <translation>Über Gramline</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&lt;p&gt;&lt;b&gt;Gramline %1&lt;/b&gt;&lt;/p&gt;&lt;p&gt;Plans polarization-encoded quantum-kernel measurements with photon pairs: which settings, in which order, how long each, and how precise the Gram matrix will be.&lt;/p&gt;&lt;p&gt;Released under the MIT licence.&lt;/p&gt;&lt;p&gt;Built with Qt %2, running on Qt %3.&lt;/p&gt;</source>
        <translation>&lt;p&gt;&lt;b&gt;Gramline %1&lt;/b&gt;&lt;/p&gt;&lt;p&gt;Plant polarisationskodierte Quantenkernel-Messungen mit Photonenpaaren: welche Einstellungen, in welcher Reihenfolge, wie lange jede und wie genau die Gram-Matrix wird.&lt;/p&gt;&lt;p&gt;Veröffentlicht unter der MIT-Lizenz.&lt;/p&gt;&lt;p&gt;Erstellt mit Qt %2, läuft mit Qt %3.&lt;/p&gt;</translation>
    </message>
</context>
<context>
    <name>gramline::gui::JobRunnerBase</name>
    <message>
        <location filename="../app/gui/job_runner.cpp" line="+56"/>
        <source>The background job stopped with an unexpected error.</source>
        <translation>Die Hintergrundarbeit endete mit einem unerwarteten Fehler.</translation>
    </message>
</context>
<context>
    <name>gramline::gui::MainWindow</name>
    <message>
        <location filename="../app/gui/main_window.cpp" line="+122"/>
        <source>Views of the plan</source>
        <translation>Ansichten des Plans</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Summary</source>
        <translation>Übersicht</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>The figures to check before booking the lab</source>
        <translation>Die Zahlen, die Sie prüfen sollten, bevor Sie das Labor buchen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Steps</source>
        <translation>Schritte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Every step of the plan, in order</source>
        <translation>Jeder Schritt des Plans, in Reihenfolge</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Timeline</source>
        <translation>Zeitleiste</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Where each night&apos;s time goes</source>
        <translation>Wofür die Zeit jeder Nacht verwendet wird</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gram error</source>
        <translation>Gram-Fehler</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Kernel, predicted error and pairs per entry</source>
        <translation>Kernel, vorhergesagter Fehler und Paare pro Eintrag</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Margin</source>
        <translation>Margin</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Whether the classifier survives the noise</source>
        <translation>Ob der Klassifikator das Rauschen übersteht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Measured</source>
        <translation>Gemessen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>A night&apos;s counts against the prediction, and the drift of the night</source>
        <translation>Die Zähldaten einer Nacht gegen die Vorhersage und die Drift der Nacht</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Cautions</source>
        <translation>Sicherheitshinweise</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Laser safety and unattended operation</source>
        <translation>Lasersicherheit und unbeaufsichtigter Betrieb</translation>
    </message>
    <message>
        <location line="-84"/>
        <source>Campaign</source>
        <translation>Kampagne</translation>
    </message>
    <message>
        <location line="+20"/>
        <source>Show &amp;Campaign Editor</source>
        <translation>&amp;Kampagnen-Editor anzeigen</translation>
    </message>
    <message>
        <location line="+175"/>
        <source>Recomputing: the figures below belong to the campaign before your last edit.</source>
        <translation>Neuberechnung: Die Zahlen unten gehören zur Kampagne vor Ihrer letzten Änderung.</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Planning…</source>
        <translation>Planung…</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Planning cancelled. Edit anything, or press F5, to plan again.</source>
        <translation>Planung abgebrochen. Ändern Sie etwas oder drücken Sie F5, um neu zu planen.</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Planning was cancelled: the figures below belong to an older campaign. Press F5 to plan again.</source>
        <translation>Die Planung wurde abgebrochen: Die Zahlen unten gehören zu einer älteren Kampagne. Drücken Sie F5, um neu zu planen.</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Margin check…</source>
        <translation>Margin-Prüfung…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;b&gt;Margin check running…&lt;/b&gt; Simulating the measurement many times with the planned pairs; progress is shown at the bottom right.</source>
        <translation>&lt;b&gt;Margin-Prüfung läuft…&lt;/b&gt; Die Messung wird mit den geplanten Paaren viele Male simuliert; der Fortschritt steht unten rechts.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Margin check: running…</source>
        <translation>Margin-Prüfung: läuft…</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>&lt;b&gt;Margin check failed:&lt;/b&gt; %1</source>
        <translation>&lt;b&gt;Margin-Prüfung fehlgeschlagen:&lt;/b&gt; %1</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Margin check failed: %1</source>
        <translation>Margin-Prüfung fehlgeschlagen: %1</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>&lt;b&gt;Margin check cancelled.&lt;/b&gt; Press F5 to plan and check again.</source>
        <translation>&lt;b&gt;Margin-Prüfung abgebrochen.&lt;/b&gt; Drücken Sie F5, um erneut zu planen und zu prüfen.</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Margin check: cancelled.</source>
        <translation>Margin-Prüfung: abgebrochen.</translation>
    </message>
    <message>
        <location line="-137"/>
        <source>&amp;File</source>
        <translation>&amp;Datei</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Edit</source>
        <translation>&amp;Bearbeiten</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;View</source>
        <translation>&amp;Ansicht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Help</source>
        <translation>&amp;Hilfe</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Main</source>
        <translation>Haupt</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>&amp;New</source>
        <translation>&amp;Neu</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>Open &amp;Demo</source>
        <translation>&amp;Demo öffnen</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>&amp;Open…</source>
        <translation>Ö&amp;ffnen…</translation>
    </message>
    <message>
        <location line="-106"/>
        <source>Open &amp;Recent</source>
        <translation>&amp;Zuletzt geöffnet</translation>
    </message>
    <message>
        <location line="+97"/>
        <source>New Campaign from &amp;CSV…</source>
        <translation>Neue Kampagne aus &amp;CSV…</translation>
    </message>
    <message>
        <location line="+12"/>
        <source>&amp;Save</source>
        <translation>&amp;Speichern</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Save &amp;As…</source>
        <translation>Speichern &amp;unter…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&amp;Import Data CSV…</source>
        <translation>Daten-CSV &amp;importieren…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&amp;Export Plan Files…</source>
        <translation>Plandateien e&amp;xportieren…</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>&amp;Quit</source>
        <translation>B&amp;eenden</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&amp;Undo</source>
        <translation>&amp;Rückgängig</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&amp;Redo</source>
        <translation>&amp;Wiederholen</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Plan &amp;Again</source>
        <translation>&amp;Neu planen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&amp;Cancel Planning</source>
        <translation>Planung a&amp;bbrechen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&amp;Preferences…</source>
        <translation>&amp;Einstellungen…</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>&amp;Summary</source>
        <translation>Ü&amp;bersicht</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>S&amp;teps</source>
        <translation>&amp;Schritte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>T&amp;imeline</source>
        <translation>&amp;Zeitleiste</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>&amp;Gram Error</source>
        <translation>&amp;Gram-Fehler</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&amp;Margin</source>
        <translation>&amp;Margin</translation>
    </message>
    <message>
        <location line="+0"/>
        <location line="+9"/>
        <source>&amp;Cautions</source>
        <translation>Sicherheits&amp;hinweise</translation>
    </message>
    <message>
        <location line="-9"/>
        <source>M&amp;easured</source>
        <translation>Gem&amp;essen</translation>
    </message>
    <message>
        <location line="-113"/>
        <source>Use the minimum budget that passes</source>
        <translation>Kleinstes bestehendes Budget verwenden</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Use margin-aware sharing</source>
        <translation>Margin-bewusst verteilen</translation>
    </message>
    <message>
        <location line="+42"/>
        <source>Compare</source>
        <translation>Vergleich</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>A pinned plan beside the current one: what a change costs or gains</source>
        <translation>Ein angehefteter Plan neben dem aktuellen: was eine Änderung kostet oder bringt</translation>
    </message>
    <message>
        <location line="+64"/>
        <source>C&amp;ompare</source>
        <translation>&amp;Vergleich</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>&amp;User Guide</source>
        <translation>&amp;Benutzerhandbuch</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>&amp;About Gramline</source>
        <translation>&amp;Über Gramline</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>About &amp;Qt</source>
        <translation>Über &amp;Qt</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>Planning status</source>
        <translation>Planungsstatus</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Planning progress</source>
        <translation>Planungsfortschritt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Cancel</source>
        <translation>Abbrechen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Cancel planning</source>
        <translation>Planung abbrechen</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Margin check progress</source>
        <translation>Fortschritt der Margin-Prüfung</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Stop Check</source>
        <translation>Prüfung stoppen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Cancel the margin check</source>
        <translation>Die Margin-Prüfung abbrechen</translation>
    </message>
    <message>
        <location line="+55"/>
        <source>No data yet: import a CSV (Ctrl+I) or open the demo to plan.</source>
        <translation>Noch keine Daten: Importieren Sie eine CSV-Datei (Strg+I) oder öffnen Sie die Demo, um zu planen.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>This campaign has no points yet, so nothing is planned. The figures of the previous campaign are not shown.</source>
        <translation>Diese Kampagne hat noch keine Punkte, daher ist nichts geplant. Die Zahlen der vorigen Kampagne werden nicht gezeigt.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>No data.</source>
        <translation>Keine Daten.</translation>
    </message>
    <message>
        <location line="+17"/>
        <source>The plan needs more nights than allowed (%1). Allow more nights, loosen ε, or turn on “Scale pairs to fit”.</source>
        <translation>Der Plan braucht mehr Nächte als erlaubt (%1). Erlauben Sie mehr Nächte, lockern Sie ε oder schalten Sie „Paare an die erlaubten Nächte anpassen“ ein.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Planned %1 steps in %2 ms.</source>
        <translation>%1 Schritte in %2 ms geplant.</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>Margin check: pass</source>
        <translation>Margin-Prüfung: bestanden</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Margin check: fail</source>
        <translation>Margin-Prüfung: nicht bestanden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source> (largest flip probability %1 %, median margin ratio %2)</source>
        <translation> (größte Kippwahrscheinlichkeit %1 %, Median des Margin-Verhältnisses %2)</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>; the minimum budget needs %1 of counting</source>
        <translation>; das Mindestbudget braucht %1 Zählzeit</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Cannot plan this campaign.</source>
        <translation>Diese Kampagne kann nicht geplant werden.</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+3"/>
        <source>Cannot plan this campaign: %1</source>
        <translation>Diese Kampagne kann nicht geplant werden: %1</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>There is no plan for this campaign, so there is nothing to show here. Correct the campaign as the message above says; the figures of the previous campaign are not shown.</source>
        <translation>Für diese Kampagne gibt es keinen Plan, daher ist hier nichts zu zeigen. Korrigieren Sie die Kampagne, wie die Meldung oben sagt; die Zahlen der vorigen Kampagne werden nicht gezeigt.</translation>
    </message>
    <message>
        <location line="+21"/>
        <source>%1[*] — Gramline</source>
        <translation>%1[*] — Gramline</translation>
    </message>
</context>
<context>
    <name>gramline::gui::MarginView</name>
    <message>
        <location filename="../app/gui/margin_view.cpp" line="+17"/>
        <source>Margin verdict</source>
        <translation>Margin-Urteil</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Pairs shared by strategy</source>
        <translation>Paarverteilung nach Strategie</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>Legend of the margin plot</source>
        <translation>Legende des Margin-Diagramms</translation>
    </message>
    <message>
        <location line="+30"/>
        <source>The margin check runs after each plan.</source>
        <translation>Die Margin-Prüfung läuft nach jedem Plan.</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>%1 %2 and %3 %4: training points of each class. %5 Test points, outlined by their class, filled pale when they keep their side and dark when noise flips them.</source>
        <translation>%1 %2 und %3 %4: Trainingspunkte jeder Klasse. %5 Testpunkte, umrandet in der Farbe ihrer Klasse, hell gefüllt, wenn sie ihre Seite behalten, und dunkel, wenn das Rauschen sie kippt.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Solid line: the noiseless decision boundary f = 0; dashed: the margin f = ±1; the faint wash shows each class&apos;s side.</source>
        <translation>Durchgezogene Linie: die rauschfreie Entscheidungsgrenze f = 0; gestrichelt: die Margin f = ±1; die blasse Tönung zeigt die Seite jeder Klasse.</translation>
    </message>
    <message numerus="yes">
        <location line="+4"/>
        <source>With %n feature(s) no plane shows the boundary honestly: every point sits at its noiseless decision value f, the boundary is f = 0 (solid) and the margin f = ±1 (dashed); bars on test points span ± 2 noise sd of f.</source>
        <translation>
            <numerusform>Mit %n Merkmal zeigt keine Ebene die Grenze ehrlich: Jeder Punkt sitzt an seinem rauschfreien Entscheidungswert f, die Grenze ist f = 0 (durchgezogen) und die Margin f = ±1 (gestrichelt); Balken an Testpunkten umfassen ± 2 Rausch-Standardabweichungen von f.</numerusform>
            <numerusform>Mit %n Merkmalen zeigt keine Ebene die Grenze ehrlich: Jeder Punkt sitzt an seinem rauschfreien Entscheidungswert f, die Grenze ist f = 0 (durchgezogen) und die Margin f = ±1 (gestrichelt); Balken an Testpunkten umfassen ± 2 Rausch-Standardabweichungen von f.</numerusform>
        </translation>
    </message>
    <message>
        <location line="+38"/>
        <source>&lt;h3&gt;Pass: the measured kernel keeps every decision.&lt;/h3&gt;</source>
        <translation>&lt;h3&gt;Bestanden: Der gemessene Kernel behält jede Entscheidung.&lt;/h3&gt;</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>&lt;h3&gt;Fail: noise would change decisions.&lt;/h3&gt;</source>
        <translation>&lt;h3&gt;Nicht bestanden: Das Rauschen würde Entscheidungen ändern.&lt;/h3&gt;</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>Over %1 simulated runs with the planned pairs: largest flip probability of a test point %2 (allowed %3); median accuracy %4; median margin ratio %5 (required %6); PSD repair needed in %7 of runs. Classifier C = %8%9.</source>
        <translation>Über %1 simulierte Läufe mit den geplanten Paaren: größte Kippwahrscheinlichkeit eines Testpunkts %2 (erlaubt %3); Median der Genauigkeit %4; Median des Margin-Verhältnisses %5 (verlangt %6); PSD-Reparatur nötig in %7 der Läufe. Klassifikator C = %8%9.</translation>
    </message>
    <message>
        <location line="+11"/>
        <source> (chosen by cross-validation)</source>
        <translation> (durch Kreuzvalidierung gewählt)</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>&lt;b&gt;Minimum budget:&lt;/b&gt; %1 pairs per entry, %2 of counting (the plan counts %3).</source>
        <translation>&lt;b&gt;Mindestbudget:&lt;/b&gt; %1 Paare pro Eintrag, %2 Zählzeit (der Plan zählt %3).</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>&lt;b&gt;Minimum budget:&lt;/b&gt; no budget in the searched range passes.</source>
        <translation>&lt;b&gt;Mindestbudget:&lt;/b&gt; Kein Budget im durchsuchten Bereich besteht.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;b&gt;Minimum budget:&lt;/b&gt; not searched.</source>
        <translation>&lt;b&gt;Mindestbudget:&lt;/b&gt; nicht gesucht.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Share pairs</source>
        <translation>Paare verteilen</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>At the planned time</source>
        <translation>Zur geplanten Zeit</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Largest flip</source>
        <translation>Größtes Kippen</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Counting needed</source>
        <translation>Nötige Zählzeit</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>uniform</source>
        <translation>gleichmäßig</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Neyman</source>
        <translation>Neyman</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>margin-aware</source>
        <translation>margin-bewusst</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>pass</source>
        <translation>bestanden</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>fail</source>
        <translation>nicht bestanden</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>not found</source>
        <translation>nicht gefunden</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>test point %1 (point %2): the label flips in %3 of runs (%4 – %5), above %6; noiseless f = %7, noise sd of f = %8</source>
        <translation>Testpunkt %1 (Punkt %2): Das Label kippt in %3 der Läufe (%4 – %5), mehr als %6; rauschfreies f = %7, Rausch-Standardabweichung von f = %8</translation>
    </message>
    <message>
        <location line="+11"/>
        <source> (%1 sd from the boundary)</source>
        <translation> (%1 Standardabweichungen von der Grenze)</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>median margin ratio %1 is below %2: the measured Gram matrix shrinks the margin</source>
        <translation>Median des Margin-Verhältnisses %1 liegt unter %2: Die gemessene Gram-Matrix verkleinert die Margin</translation>
    </message>
</context>
<context>
    <name>gramline::gui::MeasuredView</name>
    <message>
        <location filename="../app/gui/measured_view.cpp" line="+71"/>
        <source>&lt;h3&gt;No counts ingested yet&lt;/h3&gt;</source>
        <translation>&lt;h3&gt;Noch keine Zähldaten eingelesen&lt;/h3&gt;</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>After a night on the rig, bring its counts back here. Choose the bundle you exported for that night and the counts file the rig controller wrote. Gramline checks that the bundle is unchanged and that the counts fit its steps, builds the measured Gram matrix, compares every entry with the predicted error and follows the pair rate and visibility of the reference steps through the night. Your campaign is not changed.</source>
        <translation>Bringen Sie nach einer Nacht am Aufbau dessen Zähldaten hierher zurück. Wählen Sie das Bündel, das Sie für diese Nacht exportiert haben, und die Zähldatei, die die Steuerung des Aufbaus geschrieben hat. Gramline prüft, dass das Bündel unverändert ist und die Zähldaten zu seinen Schritten passen, bildet die gemessene Gram-Matrix, vergleicht jeden Eintrag mit dem vorhergesagten Fehler und verfolgt Paarrate und Sichtbarkeit der Referenzschritte durch die Nacht. Ihre Kampagne wird nicht verändert.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Ingest Counts…</source>
        <translation>Zähldaten einlesen…</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Ingest counts</source>
        <translation>Zähldaten einlesen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Choose a bundle and the counts file the rig wrote for it</source>
        <translation>Ein Bündel und die Zähldatei wählen, die der Aufbau dafür geschrieben hat</translation>
    </message>
    <message>
        <location line="+16"/>
        <source>Measured verdict</source>
        <translation>Urteil der Messung</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Ingested files</source>
        <translation>Eingelesene Dateien</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Entries measured</source>
        <translation>Gemessene Einträge</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Kernel entries with counts, out of those the bundle plans</source>
        <translation>Kernel-Einträge mit Zähldaten, von denen, die das Bündel plant</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Steps without counts</source>
        <translation>Schritte ohne Zähldaten</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Measure and reference steps of the bundle that have no row in the counts file</source>
        <translation>Mess- und Referenzschritte des Bündels ohne Zeile in der Zähldatei</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Mean z-score</source>
        <translation>Mittlerer z-Wert</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Mean of (measured − predicted) ÷ predicted σ over the measured entries</source>
        <translation>Mittel von (gemessen − vorhergesagt) ÷ vorhergesagtes σ über die gemessenen Einträge</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Standard deviation of z-scores</source>
        <translation>Standardabweichung der z-Werte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Standard deviation of the z-scores; the predicted errors are right when it is near 1</source>
        <translation>Standardabweichung der z-Werte; die vorhergesagten Fehler stimmen, wenn sie nahe 1 liegt</translation>
    </message>
    <message>
        <location line="+2"/>
        <location line="+19"/>
        <source>Outlier entries</source>
        <translation>Ausreißer-Einträge</translation>
    </message>
    <message>
        <location line="-18"/>
        <source>Entries whose z-score is beyond the outlier limit</source>
        <translation>Einträge, deren z-Wert jenseits der Ausreißergrenze liegt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Drifted reference steps</source>
        <translation>Gedriftete Referenzschritte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Reference steps whose pair rate or visibility differs from the first reference by more than 3 combined σ</source>
        <translation>Referenzschritte, deren Paarrate oder Sichtbarkeit um mehr als 3 kombinierte σ von der ersten Referenz abweicht</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Test accuracy (measured kernel)</source>
        <translation>Testgenauigkeit (gemessener Kernel)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>The classifier trained on the measured Gram matrix, scored on the test points</source>
        <translation>Der auf der gemessenen Gram-Matrix trainierte Klassifikator, bewertet auf den Testpunkten</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Histogram of the z-scores against the standard normal curve</source>
        <translation>Histogramm der z-Werte gegen die Standardnormalverteilung</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Pair rate of the reference steps over the night</source>
        <translation>Paarrate der Referenzschritte über die Nacht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Visibility of the reference steps over the night</source>
        <translation>Sichtbarkeit der Referenzschritte über die Nacht</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>Block</source>
        <translation>Block</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Entry (row, column)</source>
        <translation>Eintrag (Zeile, Spalte)</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Step</source>
        <translation>Schritt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Measured</source>
        <translation>Gemessen</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Predicted</source>
        <translation>Vorhergesagt</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>z</source>
        <translation>z</translation>
    </message>
    <message>
        <location line="+70"/>
        <source>Measured %1 of %2 entries. The z-scores have mean %3 and standard deviation %4; when the predicted errors are right they are near 0 and 1.</source>
        <translation>%1 von %2 Einträgen gemessen. Die z-Werte haben den Mittelwert %3 und die Standardabweichung %4; wenn die vorhergesagten Fehler stimmen, liegen sie nahe 0 und 1.</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Counts file %1 for the bundle %2 (checksums verified; manifest SHA-256 %3…).</source>
        <translation>Zähldatei %1 für das Bündel %2 (Prüfsummen bestätigt; Manifest SHA-256 %3…).</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Counts: %1
Bundle: %2</source>
        <translation>Zähldaten: %1
Bündel: %2</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>These are simulated counts, drawn from the rig model, not a rig&apos;s.</source>
        <translation>Dies sind simulierte Zähldaten aus dem Modell des Aufbaus, keine gemessenen.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>not measured: %1 training, %2 test</source>
        <translation>nicht gemessen: %1 Training, %2 Test</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>every planned entry has counts</source>
        <translation>jeder geplante Eintrag hat Zähldaten</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>; %1 steps from earlier bundles included</source>
        <translation>; %1 Schritte aus früheren Bündeln einbezogen</translation>
    </message>
    <message>
        <location line="+2"/>
        <location line="+15"/>
        <source>%1 of %2</source>
        <translation>%1 von %2</translation>
    </message>
    <message>
        <location line="-9"/>
        <source>the night is complete</source>
        <translation>die Nacht ist vollständig</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>steps %1; File ▸ Resume from Counts plans them</source>
        <translation>Schritte %1; Datei ▸ Aus Zähldaten fortsetzen plant sie</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>expected near 0</source>
        <translation>erwartet nahe 0</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>expected near 1</source>
        <translation>erwartet nahe 1</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>|z| above %1</source>
        <translation>|z| über %1</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>no reference steps were counted</source>
        <translation>es wurden keine Referenzschritte gezählt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>compared with the first reference step</source>
        <translation>verglichen mit dem ersten Referenzschritt</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>%1 with the ideal kernel</source>
        <translation>%1 mit dem idealen Kernel</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+5"/>
        <source>%1 %</source>
        <translation>%1 %</translation>
    </message>
    <message>
        <location line="-2"/>
        <source>; the measured Gram matrix had negative eigenvalues, set to zero before training</source>
        <translation>; die gemessene Gram-Matrix hatte negative Eigenwerte, die vor dem Training auf null gesetzt wurden</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>trained, but the test block is incomplete</source>
        <translation>trainiert, aber der Testblock ist unvollständig</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>trained; the campaign has no test points</source>
        <translation>trainiert; die Kampagne hat keine Testpunkte</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>not trained: %1</source>
        <translation>nicht trainiert: %1</translation>
    </message>
    <message>
        <location line="+30"/>
        <source>z-scores of the measured entries</source>
        <translation>z-Werte der gemessenen Einträge</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>measured entries per bin</source>
        <translation>gemessene Einträge pro Intervall</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>standard normal curve</source>
        <translation>Standardnormalverteilung</translation>
    </message>
    <message>
        <location line="+15"/>
        <source>z = (measured − predicted) ÷ predicted σ; %1 beyond ±%2 not drawn</source>
        <translation>z = (gemessen − vorhergesagt) ÷ vorhergesagtes σ; %1 jenseits von ±%2 nicht gezeichnet</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>z = (measured − predicted) ÷ predicted σ</source>
        <translation>z = (gemessen − vorhergesagt) ÷ vorhergesagtes σ</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>entries</source>
        <translation>Einträge</translation>
    </message>
    <message>
        <location line="+29"/>
        <source>reference, ±1 σ</source>
        <translation>Referenz, ±1 σ</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>drifted</source>
        <translation>gedriftet</translation>
    </message>
    <message>
        <location line="+28"/>
        <source>first reference</source>
        <translation>erste Referenz</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>hours since the start of night 1</source>
        <translation>Stunden seit Beginn von Nacht 1</translation>
    </message>
    <message>
        <location line="+25"/>
        <source>Detected pair rate (pairs/s)</source>
        <translation>Detektierte Paarrate (Paare/s)</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>pairs/s</source>
        <translation>Paare/s</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Visibility (%)</source>
        <translation>Sichtbarkeit (%)</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>%</source>
        <translation>%</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>No reference step was counted, so the rig model&apos;s pair rate and visibility were used for every entry.</source>
        <translation>Es wurde kein Referenzschritt gezählt; deshalb wurden Paarrate und Sichtbarkeit des Aufbaumodells für jeden Eintrag verwendet.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Squares mark drifted reference steps: their pair rate or their visibility differs from the first reference step&apos;s by more than 3 combined σ, so the same steps are marked in both charts. Between reference steps both are interpolated in time to calibrate each entry.</source>
        <translation>Quadrate markieren gedriftete Referenzschritte: Ihre Paarrate oder Sichtbarkeit weicht um mehr als 3 kombinierte σ von der des ersten Referenzschritts ab, daher sind in beiden Diagrammen dieselben Schritte markiert. Zwischen Referenzschritten werden beide zeitlich interpoliert, um jeden Eintrag zu kalibrieren.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>This detection scheme cannot separate the visibility from the pair rate: its values come from the rig model and carry no error bar.</source>
        <translation>Dieses Detektionsschema kann die Sichtbarkeit nicht von der Paarrate trennen: Ihre Werte stammen aus dem Aufbaumodell und haben keinen Fehlerbalken.</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Too many reference steps to draw error bars.</source>
        <translation>Zu viele Referenzschritte, um Fehlerbalken zu zeichnen.</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>%1, %2</source>
        <translation>%1, %2</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>&lt;b&gt;Outliers:&lt;/b&gt; no entry has |z| above %1.</source>
        <translation>&lt;b&gt;Ausreißer:&lt;/b&gt; Kein Eintrag hat |z| über %1.</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>&lt;b&gt;Outliers:&lt;/b&gt; entries with |z| above %1, in the order they were measured. Row and column are training points; in the test block the row is a test point.</source>
        <translation>&lt;b&gt;Ausreißer:&lt;/b&gt; Einträge mit |z| über %1, in der Reihenfolge ihrer Messung. Zeile und Spalte sind Trainingspunkte; im Testblock ist die Zeile ein Testpunkt.</translation>
    </message>
</context>
<context>
    <name>gramline::gui::MotorDelegate</name>
    <message>
        <location filename="../app/gui/rig_tables.cpp" line="+276"/>
        <source> °/s</source>
        <translation> °/s</translation>
    </message>
    <message>
        <location line="+2"/>
        <source> °/s²</source>
        <translation> °/s²</translation>
    </message>
    <message>
        <location line="+2"/>
        <location line="+2"/>
        <location line="+2"/>
        <location line="+2"/>
        <location line="+2"/>
        <source> °</source>
        <translation> °</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>continuous, or e.g. -10 .. 370</source>
        <translation>endlos, oder z. B. -10 .. 370</translation>
    </message>
</context>
<context>
    <name>gramline::gui::MotorsModel</name>
    <message>
        <location line="-266"/>
        <location line="+6"/>
        <source>continuous</source>
        <translation>endlos</translation>
    </message>
    <message>
        <location line="-5"/>
        <source>%1 … %2</source>
        <translation>%1 … %2</translation>
    </message>
    <message>
        <location line="+73"/>
        <source>prep.</source>
        <translation>Präp.</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>analysis</source>
        <translation>Analyse</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>shortest</source>
        <translation>kürzester</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>from below</source>
        <translation>von unten</translation>
    </message>
    <message>
        <location line="+74"/>
        <source>Largest angular speed of the mount</source>
        <translation>Höchste Winkelgeschwindigkeit der Halterung</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Angular acceleration, used to ramp up and down</source>
        <translation>Winkelbeschleunigung, zum Hoch- und Herunterfahren</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Travel limits in degrees, or continuous rotation. Type e.g. “-10 .. 370”, or leave empty for continuous.</source>
        <translation>Verfahrgrenzen in Grad, oder endlose Drehung. Geben Sie z. B. „-10 .. 370“ ein, oder lassen Sie das Feld für endlos leer.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>How a target is approached: the shortest way, or always from below after going past by the overshoot</source>
        <translation>Wie ein Ziel angefahren wird: auf dem kürzesten Weg, oder immer von unten, nachdem um den Überfahrweg darüber hinaus gefahren wurde</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Physical position at the start of the campaign</source>
        <translation>Physische Position zu Beginn der Kampagne</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Actual minus nominal retardance of the plate (nominal 180° for an HWP, 90° for a QWP)</source>
        <translation>Tatsächliche minus nominelle Verzögerung der Platte (nominell 180° bei einer HWP, 90° bei einer QWP)</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Uncertainty (standard deviation) of the calibrated fast-axis zero</source>
        <translation>Unsicherheit (Standardabweichung) des kalibrierten Nullpunkts der schnellen Achse</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Scatter (standard deviation) of the reached position from move to move</source>
        <translation>Streuung (Standardabweichung) der erreichten Position von Fahrt zu Fahrt</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Motor</source>
        <translation>Motor</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Photon</source>
        <translation>Photon</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Stage</source>
        <translation>Stufe</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Plate</source>
        <translation>Platte</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Speed
°/s</source>
        <translation>Geschw.
°/s</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Accel.
°/s²</source>
        <translation>Beschl.
°/s²</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Range
°</source>
        <translation>Bereich
°</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Over-
shoot °</source>
        <translation>Über-
fahrt °</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Initial
°</source>
        <translation>Start
°</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Ret. err.
°</source>
        <translation>Ret.-fehler
°</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Zero sd
°</source>
        <translation>Null-sd
°</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Repeat sd
°</source>
        <translation>Wiederh.-sd
°</translation>
    </message>
    <message>
        <location line="-10"/>
        <source>Approach</source>
        <translation>Anfahrt</translation>
    </message>
</context>
<context>
    <name>gramline::gui::NewCampaignDialog</name>
    <message>
        <location filename="../app/gui/new_campaign_dialog.cpp" line="+25"/>
        <source>New Campaign from CSV</source>
        <translation>Neue Kampagne aus CSV</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>A campaign for your own data: the encoding puts any number of features on 1 to 4 photons, and the rig has four motors and one detector per photon, or comes from a rig file.</source>
        <translation>Eine Kampagne für Ihre eigenen Daten: Die Kodierung legt beliebig viele Merkmale auf 1 bis 4 Photonen, und der Aufbau hat vier Motoren und einen Detektor je Photon oder kommt aus einer Aufbaudatei.</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>none: a rig for the photons</source>
        <translation>keine: ein Aufbau für die Photonen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Browse…</source>
        <translation>Durchsuchen…</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>Data CSV</source>
        <translation>Daten-CSV</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>CSV files (*.csv);;All files (*)</source>
        <translation>CSV-Dateien (*.csv);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Rig file</source>
        <translation>Aufbaudatei</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Rig files (*.rig.json *.json);;All files (*)</source>
        <translation>Aufbaudateien (*.rig.json *.json);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>the rig file&apos;s, else 2</source>
        <translation>die der Aufbaudatei, sonst 2</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+1"/>
        <source>Photons</source>
        <translation>Photonen</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Encoding preset</source>
        <translation>Kodierungsvorlage</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>automatic (by features and photons)</source>
        <translation>automatisch (nach Merkmalen und Photonen)</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Encoding</source>
        <translation>Kodierung</translation>
    </message>
    <message>
        <location line="+27"/>
        <source>Choose the data CSV.</source>
        <translation>Wählen Sie die Daten-CSV.</translation>
    </message>
</context>
<context>
    <name>gramline::gui::NightStrips</name>
    <message>
        <location filename="../app/gui/timeline_view.cpp" line="+119"/>
        <source>Each night as it runs</source>
        <translation>Jede Nacht in ihrem Ablauf</translation>
    </message>
    <message>
        <location line="+11"/>
        <location line="+147"/>
        <source>Night %1</source>
        <translation>Nacht %1</translation>
    </message>
    <message>
        <location line="-131"/>
        <location line="+142"/>
        <source>%1 % busy</source>
        <translation>%1 % belegt</translation>
    </message>
    <message>
        <location line="-56"/>
        <source>Each night as it runs: every step at its time, coloured by what the rig does</source>
        <translation>Jede Nacht in ihrem Ablauf: jeder Schritt zu seiner Zeit, gefärbt nach dem, was der Aufbau tut</translation>
    </message>
    <message>
        <location line="+73"/>
        <source>%1 %2 %</source>
        <translation>%1 %2 %</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>Shares of the busy time; the strips span the window from %1 to %2.</source>
        <translation>Anteile an der belegten Zeit; die Streifen umfassen das Fenster von %1 bis %2.</translation>
    </message>
    <message>
        <location line="+20"/>
        <source>Night %1, %2: %3</source>
        <translation>Nacht %1, %2: %3</translation>
    </message>
</context>
<context>
    <name>gramline::gui::NightsPage</name>
    <message>
        <location filename="../app/gui/nights_page.cpp" line="+24"/>
        <source>When the lab is yours</source>
        <translation>Wann das Labor Ihnen gehört</translation>
    </message>
    <message>
        <location line="+6"/>
        <location line="+1"/>
        <source>First night</source>
        <translation>Erste Nacht</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Change first night</source>
        <translation>Erste Nacht ändern</translation>
    </message>
    <message>
        <location line="+12"/>
        <source>Change %1</source>
        <translation>%1 ändern</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Window opens</source>
        <translation>Fenster öffnet</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Window closes</source>
        <translation>Fenster schließt</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Nights allowed</source>
        <translation>Erlaubte Nächte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Most nights the campaign may take</source>
        <translation>Höchstzahl der Nächte, die die Kampagne dauern darf</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Skip %1</source>
        <translation>%1 auslassen</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Skip weekday</source>
        <translation>Wochentag auslassen</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Weekdays to skip</source>
        <translation>Auszulassende Wochentage</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>e.g. 2026-12-24, 2026-12-25</source>
        <translation>z. B. 2026-12-24, 2026-12-25</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+1"/>
        <source>Dates to skip</source>
        <translation>Auszulassende Daten</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>nights.skip_dates: &apos;%1&apos; is not a date YYYY-MM-DD</source>
        <translation>nights.skip_dates: „%1“ ist kein Datum JJJJ-MM-TT</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Change dates to skip</source>
        <translation>Auszulassende Daten ändern</translation>
    </message>
    <message>
        <location line="+22"/>
        <source>Each night&apos;s window lasts %1 of local wall-clock time; a window whose close is not after its opening ends the next morning. Every night opens at the same clock time, also across a daylight-saving change.</source>
        <translation>Das Fenster jeder Nacht dauert %1 örtlicher Uhrzeit; ein Fenster, dessen Ende nicht nach seinem Beginn liegt, endet am nächsten Morgen. Jede Nacht beginnt zur selben Uhrzeit, auch über eine Zeitumstellung hinweg.</translation>
    </message>
</context>
<context>
    <name>gramline::gui::PrecisionPage</name>
    <message>
        <location filename="../app/gui/precision_page.cpp" line="+18"/>
        <source>Precision of each kernel entry</source>
        <translation>Präzision jedes Kernel-Eintrags</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Half-width ε</source>
        <translation>Halbbreite ε</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Each kernel entry is known to within ± ε at the confidence below</source>
        <translation>Jeder Kernel-Eintrag ist bei der unten angegebenen Konfidenz auf ± ε genau bekannt</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Confidence</source>
        <translation>Konfidenz</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>1 − δ</source>
        <translation>1 − δ</translation>
    </message>
    <message>
        <location line="+0"/>
        <source> %</source>
        <translation> %</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Interval</source>
        <translation>Intervall</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>How pairs per entry follow from ε and δ</source>
        <translation>Wie sich die Paare pro Eintrag aus ε und δ ergeben</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Plan for the worst pass probability</source>
        <translation>Für die ungünstigste Durchlasswahrscheinlichkeit planen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Ignore the predicted pass probability; plan every entry for the least favourable one the detection scheme can produce</source>
        <translation>Vorhergesagte Durchlasswahrscheinlichkeit nicht berücksichtigen; jeden Eintrag für die ungünstigste planen, die das Nachweisschema ergeben kann</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Fixed pairs per entry</source>
        <translation>Feste Paarzahl pro Eintrag</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>When set, every entry gets this many pairs instead of the target above</source>
        <translation>Wenn gesetzt, erhält jeder Eintrag so viele Paare statt des Ziels oben</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>off: use the target</source>
        <translation>aus: Ziel verwenden</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Share pairs</source>
        <translation>Paare verteilen</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>How pairs are shared among entries</source>
        <translation>Wie die Paare auf die Einträge verteilt werden</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Schedule</source>
        <translation>Zeitplan</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Reference every</source>
        <translation>Referenz alle</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>A reference step at least this often; 0 for none</source>
        <translation>Ein Referenzschritt mindestens so oft; 0 für keinen</translation>
    </message>
    <message>
        <location line="+0"/>
        <source> min</source>
        <translation> min</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>never</source>
        <translation>nie</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Pairs per reference</source>
        <translation>Paare pro Referenz</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>0: as many as a measure step</source>
        <translation>0: so viele wie ein Messschritt</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>as a measure step</source>
        <translation>wie ein Messschritt</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Dark steps at night start and end</source>
        <translation>Dunkelschritte zu Beginn und Ende der Nacht</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Shutter closed, to measure the background</source>
        <translation>Verschluss zu, um den Untergrund zu messen</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Dark step length</source>
        <translation>Dauer eines Dunkelschritts</translation>
    </message>
    <message>
        <location line="+0"/>
        <location line="+20"/>
        <source> s</source>
        <translation> s</translation>
    </message>
    <message>
        <location line="-16"/>
        <source>Park the motors at the end of each night</source>
        <translation>Motoren am Ende jeder Nacht parken</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Return every motor to its initial position</source>
        <translation>Jeden Motor in seine Anfangsposition zurückfahren</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Scale pairs to fit the allowed nights</source>
        <translation>Paare an die erlaubten Nächte anpassen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Lower the pairs per entry so the campaign ends within the night limit</source>
        <translation>Die Paare pro Eintrag senken, damit die Kampagne innerhalb der erlaubten Nächte endet</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Finish small sub-matrices early</source>
        <translation>Kleine Teilmatrizen früh abschließen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Order steps so the Gram matrix of the first points is complete early, in case the run is cut short</source>
        <translation>Schritte so ordnen, dass die Gram-Matrix der ersten Punkte früh vollständig ist, falls der Lauf abbricht</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Optimizer time limit</source>
        <translation>Zeitlimit des Optimierers</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>0: no limit</source>
        <translation>0: kein Limit</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>no limit</source>
        <translation>kein Limit</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Random seed</source>
        <translation>Zufallsstartwert</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Same seed, same plan</source>
        <translation>Gleicher Startwert, gleicher Plan</translation>
    </message>
</context>
<context>
    <name>gramline::gui::PreferencesDialog</name>
    <message>
        <location filename="../app/gui/preferences.cpp" line="+100"/>
        <source>Preferences</source>
        <translation>Einstellungen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>System language</source>
        <translation>Systemsprache</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Interface language</source>
        <translation>Sprache der Oberfläche</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>A new language applies the next time Gramline starts.</source>
        <translation>Eine neue Sprache gilt ab dem nächsten Start von Gramline.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>&amp;Language:</source>
        <translation>&amp;Sprache:</translation>
    </message>
</context>
<context>
    <name>gramline::gui::RatioHistogram</name>
    <message>
        <location filename="../app/gui/margin_view.cpp" line="+12"/>
        <source>Distribution of the margin ratio</source>
        <translation>Verteilung des Margin-Verhältnisses</translation>
    </message>
    <message>
        <location line="+19"/>
        <source>Margin ratio per simulated run (noisy margin ÷ noiseless)</source>
        <translation>Margin-Verhältnis pro simuliertem Lauf (verrauschte Margin ÷ rauschfreie)</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>No runs yet</source>
        <translation>Noch keine Läufe</translation>
    </message>
    <message>
        <location line="+28"/>
        <source>required %1</source>
        <translation>verlangt %1</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>%1 runs; tallest bar %2</source>
        <translation>%1 Läufe; höchster Balken %2</translation>
    </message>
</context>
<context>
    <name>gramline::gui::RecentFiles</name>
    <message>
        <location filename="../app/gui/recent_files.cpp" line="+33"/>
        <source>&amp;%1 %2</source>
        <translation>&amp;%1 %2</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Clear List</source>
        <translation>Liste leeren</translation>
    </message>
</context>
<context>
    <name>gramline::gui::RigPage</name>
    <message>
        <location filename="../app/gui/rig_page.cpp" line="+31"/>
        <location line="+3"/>
        <source>Photons</source>
        <translation>Photonen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Photons of the rig (numbered from 0, letters A to D in the motor names); adding one adds its four motors and its detector</source>
        <translation>Photonen des Aufbaus (ab 0 gezählt, Buchstaben A bis D in den Motornamen); ein neues Photon bringt seine vier Motoren und seinen Detektor mit</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Save Rig…</source>
        <translation>Aufbau speichern…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Save the motors, controller, source and detectors as a rig file</source>
        <translation>Motoren, Steuerung, Quelle und Detektoren als Aufbaudatei speichern</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Load Rig…</source>
        <translation>Aufbau laden…</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Replace the rig by a rig file; the encoding follows its photons</source>
        <translation>Den Aufbau durch eine Aufbaudatei ersetzen; die Kodierung folgt ihren Photonen</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Save Rig</source>
        <translation>Aufbau speichern</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+11"/>
        <source>Rig files (*.rig.json *.json);;All files (*)</source>
        <translation>Aufbaudateien (*.rig.json *.json);;Alle Dateien (*)</translation>
    </message>
    <message>
        <location line="-5"/>
        <source>Cannot save the rig</source>
        <translation>Der Aufbau kann nicht gespeichert werden</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Load Rig</source>
        <translation>Aufbau laden</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Motorized waveplates</source>
        <translation>Motorisierte Wellenplatten</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Edit motor %1</source>
        <translation>Motor %1 bearbeiten</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>Motors</source>
        <translation>Motoren</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Double-click a cell to edit it.</source>
        <translation>Doppelklicken Sie auf eine Zelle, um sie zu bearbeiten.</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Compensate the plates</source>
        <translation>Platten kompensieren</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Solve the plate angles for the actual retardances, so the kernel the rig realises is the ideal one; off shows the bias of uncompensated plates</source>
        <translation>Plattenwinkel für die tatsächlichen Verzögerungen berechnen, sodass der Aufbau den idealen Kernel erzeugt; aus zeigt den Fehler unkompensierter Platten</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>Controller</source>
        <translation>Steuerung</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Moves</source>
        <translation>Bewegungen</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Whether the controller drives all motors at once</source>
        <translation>Ob die Steuerung alle Motoren gleichzeitig fährt</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Settle time</source>
        <translation>Einschwingzeit</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Wait after any motor moved, once per step</source>
        <translation>Wartezeit nach jeder Motorbewegung, einmal pro Schritt</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+4"/>
        <source> s</source>
        <translation> s</translation>
    </message>
    <message>
        <location line="-1"/>
        <source>Overhead per step</source>
        <translation>Zusatzzeit pro Schritt</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Command and readout time of every step</source>
        <translation>Befehls- und Auslesezeit jedes Schritts</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Source and detectors</source>
        <translation>Quelle und Detektoren</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Pair rate</source>
        <translation>Paarrate</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Photon pairs emitted per second</source>
        <translation>Pro Sekunde emittierte Photonenpaare</translation>
    </message>
    <message>
        <location line="+1"/>
        <source> /s</source>
        <translation> /s</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Visibility</source>
        <translation>Sichtbarkeit</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>V in p = V·κ + (1 − V)/2^P</source>
        <translation>V in p = V·κ + (1 − V)/2^P</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Coincidence window</source>
        <translation>Koinzidenzfenster</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Full coincidence window τ</source>
        <translation>Volles Koinzidenzfenster τ</translation>
    </message>
    <message>
        <location line="+1"/>
        <source> ns</source>
        <translation> ns</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Detection</source>
        <translation>Detektion</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Which PBS outputs carry detectors</source>
        <translation>Welche PBS-Ausgänge Detektoren tragen</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Efficiency (0–1)</source>
        <translation>Effizienz (0–1)</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Dark counts (/s)</source>
        <translation>Dunkelzählrate (/s)</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>PBS leakage (0–0.5)</source>
        <translation>PBS-Leckage (0–0,5)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Fraction of the orthogonal polarization that leaves by the pass port</source>
        <translation>Anteil der orthogonalen Polarisation, der den Durchlassausgang verlässt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Detectors, one per photon</source>
        <translation>Detektoren, einer pro Photon</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Detectors</source>
        <translation>Detektoren</translation>
    </message>
    <message>
        <location line="+10"/>
        <source>Edit detector %1</source>
        <translation>Detektor %1 bearbeiten</translation>
    </message>
    <message>
        <location line="+13"/>
        <source>Load rig %1</source>
        <translation>Aufbau %1 laden</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Cannot load the rig</source>
        <translation>Der Aufbau kann nicht geladen werden</translation>
    </message>
    <message>
        <location line="+12"/>
        <source>Photon %1 (%2)</source>
        <translation>Photon %1 (%2)</translation>
    </message>
</context>
<context>
    <name>gramline::gui::SessionAutosave</name>
    <message>
        <location filename="../app/gui/session_autosave.cpp" line="+84"/>
        <source>Recover unsaved work?</source>
        <translation>Ungespeicherte Arbeit wiederherstellen?</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gramline found unsaved changes from a session that did not close properly (%1, saved %2). Recover them?</source>
        <translation>Gramline hat ungespeicherte Änderungen aus einer Sitzung gefunden, die nicht ordnungsgemäß beendet wurde (%1, gespeichert %2). Wiederherstellen?</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>untitled campaign</source>
        <translation>unbenannte Kampagne</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>Cannot recover</source>
        <translation>Wiederherstellen nicht möglich</translation>
    </message>
</context>
<context>
    <name>gramline::gui::StepsModel</name>
    <message>
        <location filename="../app/gui/steps_view.cpp" line="+114"/>
        <source>Local clock time at which the step&apos;s move begins</source>
        <translation>Lokale Uhrzeit, zu der die Bewegung des Schritts beginnt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Point whose state is prepared (training first, then test)</source>
        <translation>Punkt, dessen Zustand präpariert wird (zuerst Training, dann Test)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Point whose state is analysed</source>
        <translation>Punkt, dessen Zustand analysiert wird</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Detected photon pairs planned for this step</source>
        <translation>Für diesen Schritt geplante detektierte Photonenpaare</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Physical position commanded to this motor</source>
        <translation>Diesem Motor befohlene physische Position</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Step</source>
        <translation>Schritt</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Kind</source>
        <translation>Art</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Block</source>
        <translation>Block</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Night</source>
        <translation>Nacht</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Clock</source>
        <translation>Uhrzeit</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Prepare</source>
        <translation>Präparieren</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Analyse</source>
        <translation>Analysieren</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Kernel</source>
        <translation>Kernel</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Pairs</source>
        <translation>Paare</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Dwell (s)</source>
        <translation>Verweilzeit (s)</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Move (s)</source>
        <translation>Bewegung (s)</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>%1 (°)</source>
        <translation>%1 (°)</translation>
    </message>
</context>
<context>
    <name>gramline::gui::StepsView</name>
    <message>
        <location line="+10"/>
        <source>All kinds</source>
        <translation>Alle Arten</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Measure</source>
        <translation>Messung</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Reference</source>
        <translation>Referenz</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Dark</source>
        <translation>Dunkel</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Park</source>
        <translation>Parken</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Filter by step kind</source>
        <translation>Nach Schrittart filtern</translation>
    </message>
    <message>
        <location line="+3"/>
        <location line="+63"/>
        <source>All nights</source>
        <translation>Alle Nächte</translation>
    </message>
    <message>
        <location line="-62"/>
        <source>Filter by night</source>
        <translation>Nach Nacht filtern</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Any point</source>
        <translation>Beliebiger Punkt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Point </source>
        <translation>Punkt </translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Filter by point</source>
        <translation>Nach Punkt filtern</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Show only the steps that prepare or analyse this point</source>
        <translation>Nur die Schritte zeigen, die diesen Punkt präparieren oder analysieren</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Step </source>
        <translation>Schritt </translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Step to go to</source>
        <translation>Schritt, zu dem gesprungen wird</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Go</source>
        <translation>Los</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Go to step</source>
        <translation>Zu Schritt springen</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Show:</source>
        <translation>Anzeigen:</translation>
    </message>
    <message>
        <location line="+12"/>
        <source>Steps of the plan</source>
        <translation>Schritte des Plans</translation>
    </message>
    <message>
        <location line="+31"/>
        <source>Night %1</source>
        <translation>Nacht %1</translation>
    </message>
    <message>
        <location line="+35"/>
        <source>%1 of %2 steps</source>
        <translation>%1 von %2 Schritten</translation>
    </message>
</context>
<context>
    <name>gramline::gui::SummaryView</name>
    <message>
        <location filename="../app/gui/summary_view.cpp" line="+27"/>
        <source>Plan verdict</source>
        <translation>Urteil zum Plan</translation>
    </message>
    <message>
        <location line="+1"/>
        <location line="+144"/>
        <source>Margin check: not computed yet.</source>
        <translation>Margin-Prüfung: noch nicht berechnet.</translation>
    </message>
    <message>
        <location line="-142"/>
        <source>Margin verdict</source>
        <translation>Margin-Urteil</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Plate warning</source>
        <translation>Plattenwarnung</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>Nights</source>
        <translation>Nächte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Nights the plan needs, out of the nights allowed</source>
        <translation>Nächte, die der Plan braucht, von den erlaubten Nächten</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Calendar span</source>
        <translation>Kalenderspanne</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>From the start of night 1 to the end of the last step, days between the nights included</source>
        <translation>Vom Beginn der ersten Nacht bis zum Ende des letzten Schritts, die Tage zwischen den Nächten eingeschlossen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Busy time</source>
        <translation>Belegte Zeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Time the rig works: moving, counting and reference steps, over all nights</source>
        <translation>Zeit, in der der Aufbau arbeitet: Bewegen, Zählen und Referenzschritte, über alle Nächte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Settings to measure</source>
        <translation>Zu messende Einstellungen</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Kernel entries measured (training pairs and test × training)</source>
        <translation>Gemessene Kernel-Einträge (Trainingspaare und Test × Training)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Motor share</source>
        <translation>Motoranteil</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Share of the busy time spent moving plates</source>
        <translation>Anteil der belegten Zeit, in dem Platten bewegt werden</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gain over naive order</source>
        <translation>Gewinn gegenüber naiver Reihenfolge</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Motor time of the row-by-row order divided by that of this plan</source>
        <translation>Motorzeit der zeilenweisen Reihenfolge geteilt durch die dieses Plans</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gap to lower bound</source>
        <translation>Abstand zur unteren Schranke</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>How far the measure steps&apos; motor time is above a proven lower bound</source>
        <translation>Wie weit die Motorzeit der Messschritte über einer bewiesenen unteren Schranke liegt</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Gram error (Frobenius σ)</source>
        <translation>Gram-Fehler (Frobenius-σ)</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Predicted standard deviation of the whole training Gram matrix</source>
        <translation>Vorhergesagte Standardabweichung der ganzen Trainings-Gram-Matrix</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Chance of a negative eigenvalue</source>
        <translation>Wahrscheinlichkeit eines negativen Eigenwerts</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Probability the measured Gram matrix is not positive semidefinite</source>
        <translation>Wahrscheinlichkeit, dass die gemessene Gram-Matrix nicht positiv semidefinit ist</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Detected pairs</source>
        <translation>Detektierte Paare</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Pairs over all steps</source>
        <translation>Paare über alle Schritte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Plate bias</source>
        <translation>Plattenfehler</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Largest difference between the kernel the real plates realise and the ideal one; more pairs do not reduce it</source>
        <translation>Größte Abweichung zwischen dem Kernel der realen Platten und dem idealen; mehr Paare verringern sie nicht</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>Counting time</source>
        <translation>Zählzeit</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Dwell of the measure steps</source>
        <translation>Verweilzeit der Messschritte</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Moving time</source>
        <translation>Fahrzeit</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Motor time of all steps, settle and overhead</source>
        <translation>Motorzeit aller Schritte, Einschwingen und Zusatzzeit</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>Planning took</source>
        <translation>Planung dauerte</translation>
    </message>
    <message>
        <location line="+0"/>
        <source>Wall time of the last planning run</source>
        <translation>Laufzeit der letzten Planung</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Engine report</source>
        <translation>Bericht des Rechenkerns</translation>
    </message>
    <message>
        <location line="+14"/>
        <source>The same report as the command line prints:</source>
        <translation>Derselbe Bericht, den die Kommandozeile ausgibt:</translation>
    </message>
    <message>
        <location line="+16"/>
        <source>No plan yet.</source>
        <translation>Noch kein Plan.</translation>
    </message>
    <message numerus="yes">
        <location line="+11"/>
        <source>Fits in %n night(s) (of %1 allowed), done by %2.</source>
        <translation>
            <numerusform>Passt in %n Nacht (von %1 erlaubten), fertig bis %2.</numerusform>
            <numerusform>Passt in %n Nächten (von %1 erlaubten), fertig bis %2.</numerusform>
        </translation>
    </message>
    <message numerus="yes">
        <location line="+5"/>
        <source>Does not fit in %n night(s): more nights, fewer pairs or a looser precision are needed.</source>
        <translation>
            <numerusform>Passt nicht in %n Nacht: Mehr Nächte, weniger Paare oder eine gröbere Präzision sind nötig.</numerusform>
            <numerusform>Passt nicht in %n Nächte: Mehr Nächte, weniger Paare oder eine gröbere Präzision sind nötig.</numerusform>
        </translation>
    </message>
    <message>
        <location line="+6"/>
        <source>calendar time from the first night&apos;s start; ends %1</source>
        <translation>Kalenderzeit ab Beginn der ersten Nacht; endet %1</translation>
    </message>
    <message>
        <location line="-2"/>
        <source>%1 of %2</source>
        <translation>%1 von %2</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>%1 steps in all</source>
        <translation>%1 Schritte insgesamt</translation>
    </message>
    <message numerus="yes">
        <location line="+3"/>
        <source>%n night(s) at work</source>
        <translation>
            <numerusform>%n Nacht in Betrieb</numerusform>
            <numerusform>%n Nächte in Betrieb</numerusform>
        </translation>
    </message>
    <message>
        <location line="+2"/>
        <location line="+10"/>
        <location line="+10"/>
        <source>%1 %</source>
        <translation>%1 %</translation>
    </message>
    <message>
        <location line="-19"/>
        <source>%1 moving of %2 busy</source>
        <translation>%1 Bewegung von %2 belegt</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>%1 ×</source>
        <translation>%1 ×</translation>
    </message>
    <message>
        <location line="+1"/>
        <source>saves %1 of motor time</source>
        <translation>spart %1 Motorzeit</translation>
    </message>
    <message>
        <location line="+7"/>
        <source>bound %1, plan %2</source>
        <translation>Schranke %1, Plan %2</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>largest entry σ %1, spectral ≈ %2</source>
        <translation>größtes Eintrags-σ %1, spektral ≈ %2</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>the ideal matrix is nearly singular (smallest eigenvalue %1), so noise almost surely makes one negative; the margin check repairs this</source>
        <translation>die ideale Matrix ist fast singulär (kleinster Eigenwert %1), daher macht das Rauschen fast sicher einen negativ; die Margin-Prüfung repariert das</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>smallest ideal eigenvalue %1</source>
        <translation>kleinster idealer Eigenwert %1</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>kernel half-width reached ±%1</source>
        <translation>erreichte Kernel-Halbbreite ±%1</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>shot noise ±%1; random offsets add σ %2</source>
        <translation>Schrotrauschen ±%1; zufällige Abweichungen fügen σ %2 hinzu</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>The plate bias %1 exceeds the target precision ±%2: more pairs will not help; calibrate the plates.</source>
        <translation>Der Plattenfehler %1 übersteigt die Zielgenauigkeit ±%2: Mehr Paare helfen nicht; kalibrieren Sie die Platten.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>%1 ms</source>
        <translation>%1 ms</translation>
    </message>
</context>
<context>
    <name>gramline::gui::TimelineView</name>
    <message>
        <location filename="../app/gui/timeline_view.cpp" line="+15"/>
        <source>Gram matrix progress over the night</source>
        <translation>Fortschritt der Gram-Matrix über die Nacht</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>Night shown in the progress chart</source>
        <translation>Im Fortschrittsdiagramm gezeigte Nacht</translation>
    </message>
    <message>
        <location line="+9"/>
        <source>Progress during</source>
        <translation>Fortschritt während</translation>
    </message>
    <message>
        <location line="+27"/>
        <source>night %1 (%2)</source>
        <translation>Nacht %1 (%2)</translation>
    </message>
    <message>
        <location line="-306"/>
        <source>moving</source>
        <translation>Bewegung</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>counting</source>
        <translation>Zählen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>references</source>
        <translation>Referenzen</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>dark</source>
        <translation>Dunkel</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>park</source>
        <translation>Parken</translation>
    </message>
    <message>
        <location line="+2"/>
        <source>unused window</source>
        <translation>ungenutztes Fenster</translation>
    </message>
    <message>
        <location line="+333"/>
        <source>Night %1: share of the training Gram matrix measured, and its predicted error</source>
        <translation>Nacht %1: gemessener Anteil der Trainings-Gram-Matrix und ihr vorhergesagter Fehler</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>entries measured (%, left)</source>
        <translation>gemessene Einträge (%, links)</translation>
    </message>
    <message>
        <location line="+3"/>
        <source>predicted Gram error σ_F (right)</source>
        <translation>vorhergesagter Gram-Fehler σ_F (rechts)</translation>
    </message>
    <message>
        <location line="+23"/>
        <source>window closes</source>
        <translation>Fenster schließt</translation>
    </message>
    <message>
        <location line="+20"/>
        <source>hours after the window opens (%1); dashed: the window closes</source>
        <translation>Stunden nach Öffnen des Fensters (%1); gestrichelt: das Fenster schließt</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>measured</source>
        <translation>gemessen</translation>
    </message>
    <message>
        <location line="+6"/>
        <source>σ_F (log scale)</source>
        <translation>σ_F (logarithmisch)</translation>
    </message>
    <message>
        <location line="+11"/>
        <source>σ_F is the Frobenius norm of the per-entry standard deviation of the training Gram matrix if the run stopped at that moment; an entry not yet measured counts as ± 0.5. At the end it equals the Summary&apos;s Gram error (%1).</source>
        <translation>σ_F ist die Frobenius-Norm der Standardabweichung pro Eintrag der Trainings-Gram-Matrix, wenn der Lauf in diesem Moment endete; ein noch nicht gemessener Eintrag zählt als ± 0,5. Am Ende entspricht sie dem Gram-Fehler der Übersicht (%1).</translation>
    </message>
</context>
<context>
    <name>gramline::gui::Veil</name>
    <message>
        <location filename="../app/gui/view_frame.cpp" line="+22"/>
        <source>Out of date</source>
        <translation>Veraltet</translation>
    </message>
</context>
<context>
    <name>gramline::gui::ViewFrame</name>
    <message>
        <location line="+25"/>
        <source>View status</source>
        <translation>Ansichtsstatus</translation>
    </message>
    <message>
        <location line="+8"/>
        <source>No figures for this campaign</source>
        <translation>Keine Zahlen für diese Kampagne</translation>
    </message>
</context>
<context>
    <name>main</name>
    <message>
        <location filename="../app/gui/main.cpp" line="+27"/>
        <source>Plans polarization-encoded quantum-kernel measurements with photon pairs.</source>
        <translation>Plant polarisationskodierte Quantenkernel-Messungen mit Photonenpaaren.</translation>
    </message>
    <message>
        <location line="+5"/>
        <source>Campaign file to open.</source>
        <translation>Zu öffnende Kampagnendatei.</translation>
    </message>
    <message>
        <location line="+4"/>
        <source>Render every view into DIR as PNG files, then exit.</source>
        <translation>Rendert jede Ansicht als PNG-Datei in DIR und beendet sich dann.</translation>
    </message>
</context>
</TS>
