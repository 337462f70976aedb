#pragma once
// The files `plan --out DIR` writes (docs/plan-files.md): steps.json, steps.csv, summary.json and
// kernel.csv; and a reader for steps.json (a rig controller, a resumed campaign or a test can
// take the schedule back from it).
#include <QString>
#include <map>
#include <functional>
#include <string>
#include <string_view>
#include <vector>

#include "formats/atomic_file.h"
#include "gramline/campaign.h"
#include "gramline/plan.h"

namespace gramline::formats {

inline constexpr const char* kStepsFormat = "gramline-steps";
inline constexpr int kStepsVersion = 1;

/// docs/conventions.md and docs/motion-model.md in brief: what the positions mean and how
/// move_s follows from them.
std::string steps_conventions_text();

/// Receives formatted text piece by piece, in order.
using TextSink = std::function<void(std::string_view)>;

/// steps.json text: conventions, motors with their model parameters, controller, steps; with a
/// `set_id`, the id of the plan folder's save it belongs to (docs/plan-files.md).
std::string format_steps_json(const Rig& rig, const std::vector<Step>& steps,
                              const std::string& set_id = {});
/// The same text handed to `sink` in pieces as it is formatted.
void write_steps_json(const Rig& rig, const std::vector<Step>& steps, const TextSink& sink,
                      const std::string& set_id = {});
/// steps.csv text: one row per step, one column per motor (`<motor name>_deg`), units in the
/// header; empty fields where steps.json has null.
std::string format_steps_csv(const Rig& rig, const std::vector<Step>& steps);
/// The same text handed to `sink` in pieces as it is formatted.
void write_steps_csv(const Rig& rig, const std::vector<Step>& steps, const TextSink& sink);
/// summary.json text: the core keys plus night use, the Gram error figures and the counts
/// (docs/plan-files.md).
/// With a `set_id`, also the save's id and the SHA-256 of each other file of the plan folder
/// (`set_files`: name -> bytes).
std::string format_summary_json(const Campaign& campaign, const Plan& plan,
                                const std::string& set_id = {},
                                const std::map<std::string, std::string>& set_files = {});
/// kernel.csv text: the N x N matrix, no header, 17 significant digits.
std::string format_kernel_csv(const Eigen::MatrixXd& kernel);

/// What steps.json gives back. `rig` holds the motors and the controller (the source and the
/// detectors are not in the file and keep their defaults).
struct StepsFile {
  std::string conventions;
  std::string set_id;  ///< empty when the file names no save (a bundle's steps.json)
  Rig rig;
  std::vector<Step> steps;
};

/// Parses steps.json text. Throws InputError naming the file and field path for a wrong type,
/// a missing field, an unknown motor in position_deg, a motor without a position, a step whose
/// index is not its place in the list, or a newer version.
StepsFile parse_steps_json(const std::string& bytes, const std::string& file);
StepsFile read_steps_json(const QString& path);

/// The files write_plan_files writes, summary.json (the set's index) last.
std::vector<std::string> plan_file_names();

/// Creates `dir` if needed and saves the four files as one set (save_file_set, file_set.h):
/// nothing changes unless all four are complete. Only these four files of `dir` are replaced.
/// Throws InputError naming the file or folder that cannot be used, SystemError when the disk
/// refuses the bytes.
void write_plan_files(const Campaign& campaign, const Plan& plan, const QString& dir,
                      Overwrite overwrite = Overwrite::allow);

/// Reads steps.json of a plan folder after checking that the four files come from one save
/// (verify_file_set with summary.json as the index). Throws InputError naming the file that
/// belongs to another save.
StepsFile read_plan_folder(const QString& dir);

}  // namespace gramline::formats
