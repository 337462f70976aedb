#include "cautions.h"

#include <QCoreApplication>
#include <QDialog>
#include <QDialogButtonBox>
#include <QTextBrowser>
#include <QVBoxLayout>

namespace gramline::gui {

QString cautions_html() {
  const auto tr = [](const char* t) { return QCoreApplication::translate("gramline::gui", t); };
  return QStringLiteral(
             "<h2>%1</h2><p>%2</p><h3>%3</h3><ul><li>%4</li><li>%5</li><li>%6</li>"
             "<li>%7</li></ul><h3>%8</h3><ul><li>%9</li><li>%10</li><li>%11</li>"
             "<li>%12</li></ul><h3>%13</h3><p>%14</p>")
      .arg(tr("Before you run a plan"),
           tr("Gramline plans where waveplates turn and how long detectors count. It knows "
              "nothing about your laser, your enclosure or your building. A plan is a list of "
              "motor positions and times, not a permission to run it."),
           tr("Laser safety"),
           tr("The pump laser that makes the photon pairs is usually far more powerful than the "
              "pairs themselves. Its class, its beam path and the eyewear it requires are set "
              "by your local laser rules, not by this program."),
           tr("Keep beam enclosures closed and interlocks working while motors turn; a rotating "
              "optic can send a stray reflection where none was before."),
           tr("Never defeat or bypass an interlock to let a plan run through."),
           tr("Ask your laser safety officer before changing the optical set-up to match a "
              "plan."),
           tr("Unattended overnight operation"),
           tr("Running overnight without a person in the lab needs the approval your institution "
              "requires; many labs require a written procedure and a sign on the door."),
           tr("Check that the motors, controller and counting electronics stop safely on a "
              "power cut, a computer crash or an interlock trip, and that the laser shuts off "
              "with them."),
           tr("Check the window end: the plan stops at the time you entered, but the laser "
              "does not stop by itself."),
           tr("Leave contact details of the person responsible for the run where the night "
              "staff can see them."))
      .arg(tr("Local rules come first"),
           tr("Where these notes and your local rules differ, follow your local rules and your "
              "laser safety officer."));
}

QWidget* make_cautions_page() {
  auto* browser = new QTextBrowser;
  browser->setHtml(cautions_html());
  browser->setOpenExternalLinks(false);
  browser->setAccessibleName(QCoreApplication::translate("gramline::gui", "Cautions"));
  return browser;
}

bool acknowledge_cautions(QWidget* parent) {
  const auto tr = [](const char* t) { return QCoreApplication::translate("gramline::gui", t); };
  QDialog dialog(parent);
  dialog.setWindowTitle(tr("Before the first export"));
  auto* layout = new QVBoxLayout(&dialog);
  auto* text = new QTextBrowser;
  text->setHtml(cautions_html());
  layout->addWidget(text);
  auto* buttons = new QDialogButtonBox;
  buttons->addButton(tr("I have read this"), QDialogButtonBox::AcceptRole);
  buttons->addButton(QDialogButtonBox::Cancel);
  QObject::connect(buttons, &QDialogButtonBox::accepted, &dialog, &QDialog::accept);
  QObject::connect(buttons, &QDialogButtonBox::rejected, &dialog, &QDialog::reject);
  layout->addWidget(buttons);
  dialog.resize(640, 560);
  return dialog.exec() == QDialog::Accepted;
}

}  // namespace gramline::gui
