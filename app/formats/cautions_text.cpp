#include "formats/cautions_text.h"

#include <QtGlobal>

namespace gramline::formats {

const std::vector<CautionSection>& caution_sections() {
  static const std::vector<CautionSection> sections = {
      {QT_TRANSLATE_NOOP("gramline::gui", "Before you run a plan"),
       {QT_TRANSLATE_NOOP(
           "gramline::gui",
           "Gramline plans where waveplates turn and how long detectors count. It knows "
           "nothing about your laser, your enclosure or your building. A plan is a list of "
           "motor positions and times, not a permission to run it.")},
       false},
      {QT_TRANSLATE_NOOP("gramline::gui", "Laser safety"),
       {QT_TRANSLATE_NOOP(
            "gramline::gui",
            "The pump laser that makes the photon pairs is usually far more powerful than the "
            "pairs themselves. Its class, its beam path and the eyewear it requires are set "
            "by your local laser rules, not by this program."),
        QT_TRANSLATE_NOOP(
            "gramline::gui",
            "Keep beam enclosures closed and interlocks working while motors turn; a rotating "
            "optic can send a stray reflection where none was before."),
        QT_TRANSLATE_NOOP("gramline::gui",
                          "Never defeat or bypass an interlock to let a plan run through."),
        QT_TRANSLATE_NOOP("gramline::gui",
                          "Ask your laser safety officer before changing the optical set-up to "
                          "match a plan.")},
       true},
      {QT_TRANSLATE_NOOP("gramline::gui", "Unattended overnight operation"),
       {QT_TRANSLATE_NOOP(
            "gramline::gui",
            "Running overnight without a person in the lab needs the approval your institution "
            "requires; many labs require a written procedure and a sign on the door."),
        QT_TRANSLATE_NOOP(
            "gramline::gui",
            "Check that the motors, controller and counting electronics stop safely on a "
            "power cut, a computer crash or an interlock trip, and that the laser shuts off "
            "with them."),
        QT_TRANSLATE_NOOP("gramline::gui",
                          "Check the window end: the plan stops at the time you entered, but "
                          "the laser does not stop by itself."),
        QT_TRANSLATE_NOOP(
            "gramline::gui",
            "Leave contact details of the person responsible for the run where the night "
            "staff can see them.")},
       true},
      {QT_TRANSLATE_NOOP("gramline::gui", "Local rules come first"),
       {QT_TRANSLATE_NOOP("gramline::gui",
                          "Where these notes and your local rules differ, follow your local "
                          "rules and your laser safety officer.")},
       false},
  };
  return sections;
}

std::string cautions_plain_text() {
  std::string out = "CAUTIONS\n========\n\n";
  for (const CautionSection& s : caution_sections()) {
    const std::string heading = s.heading;
    out += heading + "\n" + std::string(heading.size(), '-') + "\n";
    for (const char* p : s.paragraphs) out += std::string(s.listed ? "- " : "") + p + "\n";
    out += "\n";
  }
  return out;
}

std::string cautions_terminal_notice() {
  return "CAUTIONS (full text in the bundle's CAUTIONS.txt):\n"
         "  - Laser safety: the pump laser's class, beam path and eyewear follow your local laser "
         "rules.\n"
         "  - Interlocks: keep enclosures closed and interlocks working; never bypass one to let "
         "a plan run.\n"
         "  - Unattended operation: running overnight alone needs your institution's approval; "
         "the laser does not stop by itself when the plan ends.\n"
         "  - Local rules and your laser safety officer come first.\n";
}

}  // namespace gramline::formats
