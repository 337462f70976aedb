#pragma once
// Renders every view of the main window and every page of the campaign editor into PNG files,
// for looking at the app without a display (app/gui/tools/screenshot_views.sh).
#include <QString>
#include <functional>

namespace gramline::gui {

class MainWindow;

/// Waits until the plan, its margin check and any ingest are done, then saves one PNG a view
/// and a page into `dir` and calls `done` (false when a file could not be written). The
/// Measured view shows the counts named by GRAMLINE_SCREENSHOT_BUNDLE and
/// GRAMLINE_SCREENSHOT_COUNTS when both are set.
void take_screenshots(MainWindow& window, const QString& dir,
                      const std::function<void(bool ok)>& done);

}  // namespace gramline::gui
