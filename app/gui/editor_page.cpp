#include "editor_page.h"

#include <QCheckBox>
#include <QComboBox>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QSpinBox>
#include <utility>

#include "campaign_document.h"

namespace gramline::gui {

EditorPage::EditorPage(CampaignDocument* document, QWidget* parent)
    : QWidget(parent), document_(document) {}

void EditorPage::refresh() {
  for (const auto& r : refreshers_) r();
}

QFormLayout* EditorPage::new_form(QWidget* parent) {
  auto* form = new QFormLayout(parent);
  form->setFieldGrowthPolicy(QFormLayout::AllNonFixedFieldsGrow);
  form->setRowWrapPolicy(QFormLayout::DontWrapRows);
  return form;
}

template <typename Box, typename Value>
Box* EditorPage::bind_spin(Box* box, QFormLayout* form, const QString& key, const QString& label,
                           const QString& help, std::function<Value(const Campaign&)> get,
                           std::function<void(Campaign&, Value)> set) {
  box->setKeyboardTracking(false);  // one edit per finished value, not per keystroke
  box->setAccessibleName(label);
  box->setToolTip(help);
  box->setObjectName(key);
  form->addRow(label, box);
  connect(box, &Box::valueChanged, this, [this, key, label, set](Value v) {
    document_->edit(
        tr("Change %1").arg(label), [set, v](Campaign& c) { set(c, v); }, key);
  });
  on_refresh([this, box, get] {
    const QSignalBlocker block(box);
    box->setValue(get(document_->campaign()));
  });
  return box;
}

QDoubleSpinBox* EditorPage::number(QFormLayout* form, const QString& key, const QString& label,
                                   const QString& help, double min, double max, int decimals,
                                   const QString& suffix,
                                   std::function<double(const Campaign&)> get,
                                   std::function<void(Campaign&, double)> set) {
  auto* box = new QDoubleSpinBox;
  box->setRange(min, max);
  box->setDecimals(decimals);
  box->setSuffix(suffix);
  return bind_spin(box, form, key, label, help, std::move(get), std::move(set));
}

QSpinBox* EditorPage::integer(QFormLayout* form, const QString& key, const QString& label,
                              const QString& help, int min, int max,
                              std::function<int(const Campaign&)> get,
                              std::function<void(Campaign&, int)> set) {
  auto* box = new QSpinBox;
  box->setRange(min, max);
  return bind_spin(box, form, key, label, help, std::move(get), std::move(set));
}

QCheckBox* EditorPage::flag(QFormLayout* form, const QString& key, const QString& label,
                            const QString& help, std::function<bool(const Campaign&)> get,
                            std::function<void(Campaign&, bool)> set) {
  auto* box = new QCheckBox(label);
  box->setAccessibleName(label);
  box->setToolTip(help);
  box->setObjectName(key);
  form->addRow(QString(), box);
  connect(box, &QCheckBox::toggled, this, [this, label, set](bool v) {
    document_->edit(v ? tr("Turn on %1").arg(label) : tr("Turn off %1").arg(label),
                    [set, v](Campaign& c) { set(c, v); });
  });
  on_refresh([this, box, get] {
    const QSignalBlocker block(box);
    box->setChecked(get(document_->campaign()));
  });
  return box;
}

QComboBox* EditorPage::choice(QFormLayout* form, const QString& key, const QString& label,
                              const QString& help, const QStringList& items,
                              std::function<int(const Campaign&)> get,
                              std::function<void(Campaign&, int)> set) {
  auto* box = new QComboBox;
  box->addItems(items);
  box->setAccessibleName(label);
  box->setToolTip(help);
  box->setObjectName(key);
  form->addRow(label, box);
  connect(box, &QComboBox::activated, this, [this, label, set, get](int v) {
    if (v == get(document_->campaign())) return;
    document_->edit(tr("Change %1").arg(label), [set, v](Campaign& c) { set(c, v); });
  });
  on_refresh([this, box, get] {
    const QSignalBlocker block(box);
    box->setCurrentIndex(get(document_->campaign()));
  });
  return box;
}

}  // namespace gramline::gui
