// The texts of the engine's enums: each enum has one table and both directions come from it.
// The texts are the spellings campaign and steps files use (README user guide,
// docs/counts-format.md): files written earlier must read back, so they must not change.
#include <gtest/gtest.h>

#include <string>

#include "gramline/budget.h"
#include "gramline/campaign.h"
#include "gramline/encoding.h"
#include "gramline/plan.h"
#include "gramline/rig.h"

namespace gramline {
namespace {

template <class E>
void expect_names(std::initializer_list<std::pair<E, const char*>> names) {
  for (const auto& [value, text] : names) {
    EXPECT_EQ(to_string(value), text);
    E back{};
    if constexpr (std::is_same_v<E, EncodingPreset>) {
      ASSERT_TRUE(encoding_preset_from_string(text, back)) << text;
    } else {
      ASSERT_TRUE(from_string(std::string(text), back)) << text;
    }
    EXPECT_EQ(back, value) << text;
  }
  E untouched = names.begin()->first;
  if constexpr (std::is_same_v<E, EncodingPreset>) {
    EXPECT_FALSE(encoding_preset_from_string("no-such-name", untouched));
  } else {
    EXPECT_FALSE(from_string(std::string("no-such-name"), untouched));
    // Case matters: files are written in one spelling.
    EXPECT_FALSE(from_string(std::string("NO-SUCH-NAME"), untouched));
  }
  EXPECT_EQ(untouched, names.begin()->first);
}

TEST(EnumNames, EveryEngineEnumKeepsItsFileText) {
  expect_names<Stage>({{Stage::prep, "prep"}, {Stage::analysis, "analysis"}});
  expect_names<Plate>({{Plate::HWP, "HWP"}, {Plate::QWP, "QWP"}});
  expect_names<Backlash>({{Backlash::shortest, "shortest"}, {Backlash::from_below, "from-below"}});
  expect_names<MoveMode>(
      {{MoveMode::simultaneous, "simultaneous"}, {MoveMode::sequential, "sequential"}});
  expect_names<DetectionScheme>(
      {{DetectionScheme::pass_only, "pass-only"}, {DetectionScheme::both_ports, "both-ports"}});
  expect_names<BudgetMethod>({{BudgetMethod::normal, "normal"},
                              {BudgetMethod::wilson, "wilson"},
                              {BudgetMethod::hoeffding, "hoeffding"}});
  expect_names<Allocation>({{Allocation::uniform, "uniform"},
                            {Allocation::neyman, "neyman"},
                            {Allocation::margin_aware, "margin-aware"}});
  expect_names<StepKind>({{StepKind::measure, "measure"},
                          {StepKind::reference, "reference"},
                          {StepKind::dark, "dark"},
                          {StepKind::park, "park"}});
  expect_names<Block>({{Block::train, "train"}, {Block::test, "test"}, {Block::none, "none"}});
  expect_names<EncodingPreset>(
      {{EncodingPreset::one_feature_per_photon_linear, "one-feature-per-photon-linear"},
       {EncodingPreset::two_features_polar_azimuth, "two-features-polar-azimuth"},
       {EncodingPreset::spread, "spread"},
       {EncodingPreset::custom, "custom"}});
}

}  // namespace
}  // namespace gramline
