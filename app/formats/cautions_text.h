#pragma once
// The cautions (laser safety, interlocks, unattended operation, local rules first), written
// once: the app shows them translated, the bundle carries them as CAUTIONS.txt and in
// summary.html, and `gramline-cli export` prints a short notice on the terminal.
#include <string>
#include <vector>

namespace gramline::formats {

/// One part of the cautions: a heading, then paragraphs (list items when `listed`). The texts
/// are English and marked for translation in the context "gramline::gui".
struct CautionSection {
  const char* heading;
  std::vector<const char*> paragraphs;
  bool listed = false;
};

/// Every part, in reading order.
const std::vector<CautionSection>& caution_sections();

/// CAUTIONS.txt: every part as plain text, headings underlined, list items with "- ".
std::string cautions_plain_text();

/// The few lines `export` prints on the terminal: laser safety, interlocks, unattended
/// operation, local rules and the laser safety officer first, and where the full text is.
std::string cautions_terminal_notice();

}  // namespace gramline::formats
