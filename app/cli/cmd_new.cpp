// gramline-cli new: a campaign for one's own data CSV, with an encoding for any number of
// features and a rig for the photons (docs/conventions.md, "New campaigns").
#include <QFileInfo>
#include <QString>
#include <iostream>
#include <stdexcept>

#include "cli/commands.h"
#include "formats/atomic_file.h"
#include "formats/campaign_json.h"
#include "formats/data_csv.h"
#include "formats/input_error.h"
#include "formats/rig_json.h"
#include "gramline/new_campaign.h"

namespace gramline::cli {

namespace {

struct PresetWord {
  const char* word;
  EncodingPreset preset;
};
/// The words of --encoding and the presets they name.
constexpr PresetWord kPresetWords[] = {
    {"linear", EncodingPreset::one_feature_per_photon_linear},
    {"polar-azimuth", EncodingPreset::two_features_polar_azimuth},
    {"spread", EncodingPreset::spread},
};

}  // namespace

EncodingPreset preset_from_word(const std::string& word) {
  std::string words;
  for (const PresetWord& p : kPresetWords) {
    if (word == p.word) return p.preset;
    words += (words.empty() ? "" : ", ") + std::string(p.word);
  }
  throw formats::InputError("gramline-cli new: option --encoding: '" + word + "' is not one of " +
                            words);
}

int run_new(const NewRequest& request) {
  const QString out = QString::fromStdString(request.out_path);
  formats::refuse_existing(out,
                           request.force ? formats::Overwrite::allow : formats::Overwrite::refuse);
  const DataSet data = formats::read_data_csv(QString::fromStdString(request.data_path));
  NewCampaignOptions options;
  options.photons = request.photons.value_or(0);
  if (request.preset) options.preset = preset_from_word(*request.preset);
  if (request.rig_path) options.rig = formats::load_rig(QString::fromStdString(*request.rig_path));
  Campaign campaign;
  try {
    campaign = make_campaign_for_data(data, options);
  } catch (const std::invalid_argument& e) {
    std::string inputs = request.data_path;
    if (request.rig_path) inputs += " with " + *request.rig_path;
    throw formats::InputError("gramline-cli new: " + inputs + ": " + e.what());
  }
  campaign.name =
      QFileInfo(QString::fromStdString(request.data_path)).completeBaseName().toStdString();
  campaign.notes = "Made by gramline-cli new from " +
                   QFileInfo(QString::fromStdString(request.data_path)).fileName().toStdString() +
                   ".";
  formats::save_campaign(campaign, out);
  std::cout << "wrote the campaign '" << campaign.name << "' to " << request.out_path << ": "
            << campaign.data.train_count() << " training and " << campaign.data.test_count()
            << " test points, " << campaign.data.feature_count() << " feature(s) on "
            << campaign.encoding.photon_count() << " photon(s) ('"
            << to_string(campaign.encoding.preset) << "' encoding), " << campaign.rig.motors.size()
            << " motors" << (request.rig_path ? " from " + *request.rig_path : std::string())
            << "\n";
  return 0;
}

}  // namespace gramline::cli
