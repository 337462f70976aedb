// check_translations: fails when a translation is not complete.
//
//   check_translations --lupdate LUPDATE --sources DIR FILE.ts...
//
// For every .ts file it reports (1) entries marked unfinished, obsolete or vanished, empty
// translations, and translations whose place markers (%1..%99), accelerator ampersand or outer
// whitespace differ from the source text; then (2) it runs lupdate on the sources into a copy
// of the file and reports every text of the code that the file lacks (lupdate adds it as
// unfinished) and every entry the code no longer has (lupdate marks it vanished or obsolete).
// Exit status 0 when everything is complete, 1 on any finding, 2 on bad use.
#include <QCoreApplication>
#include <QFile>
#include <QFileInfo>
#include <QProcess>
#include <QRegularExpression>
#include <QSet>
#include <QStringList>
#include <QTemporaryDir>
#include <QTextStream>
#include <QXmlStreamReader>
#include <cstdio>

namespace {

struct Message {
  QString context;
  QString source;
  QString type;              // "", "unfinished", "obsolete" or "vanished"
  QStringList translations;  // one, or one per numerus form
  qint64 line = 0;           // line of the <message> in the .ts file
};

struct TsFile {
  QString language;
  QList<Message> messages;
  QString error;
};

TsFile read_ts(const QString& path) {
  TsFile ts;
  QFile file(path);
  if (!file.open(QIODevice::ReadOnly)) {
    ts.error = QStringLiteral("cannot open the file");
    return ts;
  }
  QXmlStreamReader xml(&file);
  QString context;
  Message message;
  bool in_message = false;
  bool numerus = false;
  while (!xml.atEnd() && !xml.hasError()) {
    xml.readNext();
    if (xml.isStartElement()) {
      const QStringView name = xml.name();
      if (name == QLatin1String("TS")) {
        ts.language = xml.attributes().value(QLatin1String("language")).toString();
      } else if (name == QLatin1String("name") && !in_message) {
        context = xml.readElementText();
      } else if (name == QLatin1String("message")) {
        in_message = true;
        // Plural forms: Qt's .ts format marks the message, not its translation, as numerus.
        numerus = xml.attributes().value(QLatin1String("numerus")) == QLatin1String("yes");
        message = Message{context, {}, {}, {}, xml.lineNumber()};
      } else if (in_message && name == QLatin1String("source")) {
        message.source = xml.readElementText();
      } else if (in_message && name == QLatin1String("translation")) {
        message.type = xml.attributes().value(QLatin1String("type")).toString();
        if (numerus || xml.attributes().value(QLatin1String("numerus")) == QLatin1String("yes")) {
          while (xml.readNextStartElement()) {
            if (xml.name() == QLatin1String("numerusform"))
              message.translations.append(xml.readElementText());
            else
              xml.skipCurrentElement();
          }
        } else {
          message.translations.append(xml.readElementText());
        }
      }
    } else if (xml.isEndElement() && xml.name() == QLatin1String("message")) {
      in_message = false;
      ts.messages.append(message);
    }
  }
  if (xml.hasError())
    ts.error = QStringLiteral("line %1: %2").arg(xml.lineNumber()).arg(xml.errorString());
  return ts;
}

// The place markers of a text as a sorted list, so "%1 of %2" and "%2 von %1" agree.
QStringList markers(const QString& text) {
  static const QRegularExpression marker(QStringLiteral("%L?(\\d{1,2})"));
  QStringList found;
  for (auto it = marker.globalMatch(text); it.hasNext();) found.append(it.next().captured(0));
  found.sort();
  return found;
}

// An accelerator: '&' before a letter or digit that is not an HTML entity ("&amp;", "&lt;").
bool has_accelerator(const QString& text) {
  static const QRegularExpression accel(QStringLiteral("&(?![a-zA-Z]+;|#\\d+;)[^&\\s]"));
  return accel.match(text).hasMatch();
}

QString leading_space(const QString& t) {
  qsizetype i = 0;
  while (i < t.size() && t[i].isSpace()) ++i;
  return t.left(i);
}

QString trailing_space(const QString& t) {
  qsizetype i = t.size();
  while (i > 0 && t[i - 1].isSpace()) --i;
  return t.mid(i);
}

QString excerpt(const QString& text) {
  QString one_line = QString(text).replace(QLatin1Char('\n'), QLatin1Char(' '));
  if (one_line.size() > 70) one_line = one_line.left(67) + QStringLiteral("...");
  return QLatin1Char('"') + one_line + QLatin1Char('"');
}

class Report {
 public:
  void finding(const QString& where, const QString& what) {
    std::fprintf(stderr, "%s: %s\n", qPrintable(where), qPrintable(what));
    ++count_;
  }
  int count() const { return count_; }

 private:
  int count_ = 0;
};

// Part (1): the file as it stands.
void check_entries(const QString& path, const TsFile& ts, Report& report) {
  const QString base = QFileInfo(path).completeBaseName();  // gramline_de
  const QString lang = base.section(QLatin1Char('_'), 1);
  if (!ts.language.startsWith(lang))
    report.finding(path,
                   QStringLiteral("language \"%1\" does not match the file name").arg(ts.language));
  if (ts.messages.isEmpty()) report.finding(path, QStringLiteral("holds no messages"));
  for (const Message& m : ts.messages) {
    const QString where =
        QStringLiteral("%1:%2 [%3] %4").arg(path).arg(m.line).arg(m.context, excerpt(m.source));
    if (!m.type.isEmpty()) {
      report.finding(where, QStringLiteral("marked %1").arg(m.type));
      continue;
    }
    if (m.translations.isEmpty()) {
      report.finding(where, QStringLiteral("has no translation"));
      continue;
    }
    for (const QString& t : m.translations) {
      if (t.trimmed().isEmpty()) {
        report.finding(where, QStringLiteral("empty translation"));
        continue;
      }
      if (markers(t) != markers(m.source))
        report.finding(where, QStringLiteral("place markers differ: %1 in the source, %2 in %3")
                                  .arg(markers(m.source).join(QLatin1Char(' ')),
                                       markers(t).join(QLatin1Char(' ')), excerpt(t)));
      if (has_accelerator(m.source) != has_accelerator(t))
        report.finding(
            where, QStringLiteral("accelerator '&' in only one of source and %1").arg(excerpt(t)));
      if (leading_space(m.source) != leading_space(t) ||
          trailing_space(m.source) != trailing_space(t))
        report.finding(
            where, QStringLiteral("leading or trailing white space differs in %1").arg(excerpt(t)));
    }
  }
}

// Part (2): what lupdate finds in the code against what the file holds.
void check_against_code(const QString& path, const QString& lupdate, const QStringList& sources,
                        Report& report) {
  QTemporaryDir dir;
  const QString copy = dir.filePath(QFileInfo(path).fileName());
  if (!dir.isValid() || !QFile::copy(path, copy)) {
    report.finding(path, QStringLiteral("cannot copy into a temporary folder"));
    return;
  }
  QProcess run;
  run.setProcessChannelMode(QProcess::MergedChannels);
  run.start(lupdate, QStringList{QStringLiteral("-locations"), QStringLiteral("none")} + sources +
                         QStringList{QStringLiteral("-ts"), copy});
  if (!run.waitForFinished(300000) || run.exitStatus() != QProcess::NormalExit ||
      run.exitCode() != 0) {
    report.finding(path,
                   QStringLiteral("lupdate failed: %1").arg(QString::fromLocal8Bit(run.readAll())));
    return;
  }
  const TsFile updated = read_ts(copy);
  if (!updated.error.isEmpty()) {
    report.finding(copy, updated.error);
    return;
  }
  for (const Message& m : updated.messages) {
    const QString where = QStringLiteral("%1 [%2] %3").arg(path, m.context, excerpt(m.source));
    if (m.type == QLatin1String("vanished") || m.type == QLatin1String("obsolete"))
      report.finding(where,
                     QStringLiteral("no longer in the code (lupdate marks it %1)").arg(m.type));
  }
  // A text lupdate added is unfinished in the copy but absent from the original.
  QSet<QString> known;
  for (const Message& m : read_ts(path).messages) known.insert(m.context + QChar(0) + m.source);
  for (const Message& m : updated.messages) {
    if (!known.contains(m.context + QChar(0) + m.source))
      report.finding(QStringLiteral("%1 [%2] %3").arg(path, m.context, excerpt(m.source)),
                     QStringLiteral("text of the code missing from the .ts file"));
  }
}

}  // namespace

int main(int argc, char** argv) {
  QCoreApplication app(argc, argv);
  QStringList args = app.arguments().mid(1);
  QString lupdate;
  QStringList sources;  // folders or files lupdate scans; --sources may be given more than once
  QStringList ts_files;
  while (!args.isEmpty()) {
    const QString a = args.takeFirst();
    if (a == QLatin1String("--lupdate") && !args.isEmpty())
      lupdate = args.takeFirst();
    else if (a == QLatin1String("--sources") && !args.isEmpty())
      sources << args.takeFirst();
    else
      ts_files.append(a);
  }
  if (lupdate.isEmpty() || sources.isEmpty() || ts_files.isEmpty()) {
    std::fprintf(stderr, "usage: check_translations --lupdate LUPDATE --sources DIR FILE.ts...\n");
    return 2;
  }
  Report report;
  int messages = 0;
  for (const QString& path : ts_files) {
    const TsFile ts = read_ts(path);
    if (!ts.error.isEmpty()) {
      report.finding(path, ts.error);
      continue;
    }
    messages += static_cast<int>(ts.messages.size());
    check_entries(path, ts, report);
    check_against_code(path, lupdate, sources, report);
  }
  std::printf("%lld translation file(s), %d messages, %d finding(s)\n",
              static_cast<long long>(ts_files.size()), messages, report.count());
  return report.count() == 0 ? 0 : 1;
}
