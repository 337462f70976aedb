#pragma once
// The campaign editor: one page each for data, encoding, rig, precision and nights (see
// editor_pages.h). Every control writes through CampaignDocument::edit (undoable) and is
// refreshed from the document after any change.
#include <QWidget>
#include <vector>

#include "gramline/margin.h"

class QTabWidget;

namespace gramline::gui {

class CampaignDocument;
class DataPage;
class EditorPage;
class EncodingPage;
class MotorsModel;
class RigPage;

class EditorPanel : public QWidget {
  Q_OBJECT

 public:
  explicit EditorPanel(CampaignDocument* document, QWidget* parent = nullptr);

  QTabWidget* pages() const { return pages_; }
  MotorsModel* motors_model() const;
  EncodingPage* encoding_page() const { return encoding_; }
  RigPage* rig_page() const { return rig_; }
  /// Reads every control back from the document's campaign.
  void refresh();
  /// Shows the encoding-scale scan of the latest margin check.
  void set_scale_scan(const std::vector<ScalePoint>& scan, double advised);
  void clear_scale_scan();

 signals:
  void import_requested();
  void demo_requested();

 private:
  QTabWidget* pages_;
  std::vector<EditorPage*> editors_;  ///< in page order
  EncodingPage* encoding_;
  RigPage* rig_;
};

}  // namespace gramline::gui
