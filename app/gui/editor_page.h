#pragma once
// What every page of the campaign editor shares: the controls bound to the campaign. Each bound
// control writes through CampaignDocument::edit (undoable, named after its label) and is read
// back from the document by refresh().
#include <QWidget>
#include <functional>
#include <vector>

#include "gramline/campaign.h"

class QCheckBox;
class QComboBox;
class QDoubleSpinBox;
class QFormLayout;
class QSpinBox;

namespace gramline::gui {

class CampaignDocument;

class EditorPage : public QWidget {
  Q_OBJECT

 public:
  /// Reads every control of the page back from the document's campaign.
  void refresh();

 protected:
  explicit EditorPage(CampaignDocument* document, QWidget* parent = nullptr);

  /// Adds a step of refresh(): `read` sets a control from document()->campaign().
  void on_refresh(std::function<void()> read) { refreshers_.push_back(std::move(read)); }
  CampaignDocument* document() const { return document_; }

  /// A form whose fields take the free width and whose rows never wrap.
  static QFormLayout* new_form(QWidget* parent);

  /// Rows bound to a value of the campaign: `key` names the control (tests find it by this
  /// name) and merges consecutive edits of a spin box into one undo step; `label` names the
  /// row, its undo step and, for screen readers, the control; `help` is its tool tip.
  QDoubleSpinBox* number(QFormLayout* form, const QString& key, const QString& label,
                         const QString& help, double min, double max, int decimals,
                         const QString& suffix, std::function<double(const Campaign&)> get,
                         std::function<void(Campaign&, double)> set);
  QSpinBox* integer(QFormLayout* form, const QString& key, const QString& label,
                    const QString& help, int min, int max, std::function<int(const Campaign&)> get,
                    std::function<void(Campaign&, int)> set);
  QCheckBox* flag(QFormLayout* form, const QString& key, const QString& label, const QString& help,
                  std::function<bool(const Campaign&)> get,
                  std::function<void(Campaign&, bool)> set);
  QComboBox* choice(QFormLayout* form, const QString& key, const QString& label,
                    const QString& help, const QStringList& items,
                    std::function<int(const Campaign&)> get,
                    std::function<void(Campaign&, int)> set);

 private:
  /// The wiring shared by number() and integer().
  template <typename Box, typename Value>
  Box* bind_spin(Box* box, QFormLayout* form, const QString& key, const QString& label,
                 const QString& help, std::function<Value(const Campaign&)> get,
                 std::function<void(Campaign&, Value)> set);

  CampaignDocument* document_;
  std::vector<std::function<void()>> refreshers_;
};

}  // namespace gramline::gui
