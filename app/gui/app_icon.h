#pragma once
// The app icon, drawn from the same design as resources/gramline.svg (a Gram matrix grid
// crossed by a polarization ellipse), so no image plugin is needed at run time.
#include <QIcon>

namespace gramline::gui {

QIcon app_icon();

}  // namespace gramline::gui
