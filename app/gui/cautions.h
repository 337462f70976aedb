#pragma once
// Cautions: laser safety and unattended overnight operation. Always one click away, and shown
// before the first export of a session.
#include <QString>

class QWidget;

namespace gramline::gui {

/// The cautions as rich text (our own wording).
QString cautions_html();
/// A read-only page showing the cautions.
QWidget* make_cautions_page();
/// Shows the cautions in a modal dialog over `parent`; true when the user confirms having read
/// them.
bool acknowledge_cautions(QWidget* parent);

}  // namespace gramline::gui
