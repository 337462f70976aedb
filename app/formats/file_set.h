#pragma once
// Saving files so that nothing the user has is lost (docs/limits.md, "Saving"): every file is
// written to a temporary file beside its target, flushed to the disk and checked, and renamed
// over the target only when every file of the save is complete. A failure or a kill before the
// renames changes nothing; the temporaries are removed (a killed process's ones by the next
// save into the same folder). Outputs that exist and are neither regular files nor folders
// (device nodes, FIFOs, sockets) are refused.
#include <QString>
#include <string>
#include <vector>

#include "formats/atomic_file.h"

namespace gramline::formats {

/// Throws InputError naming `path` when it exists and is not a regular file: a folder, a device
/// node, a FIFO or a socket. A symbolic link is judged by what it points to.
void refuse_unusable_output_file(const QString& path);
/// Throws InputError naming `path` when it exists and is not a folder.
void refuse_unusable_output_folder(const QString& path);

/// One file of a set: its name inside the set's folder and its bytes.
struct SetFile {
  std::string name;
  std::string bytes;
};

/// Saves `files` into `dir` (created if needed) as one set: all are written to temporaries
/// first, renamed over their targets only when every one is complete. Files in `dir` that are
/// not in `files` are never touched. Throws InputError (an existing target with
/// Overwrite::refuse, an unusable target) before anything is written, SystemError (naming the
/// file and the system's error, e.g. "No space left on device") when the disk refuses; the old
/// files then stay as they were.
void save_file_set(const QString& dir, const std::vector<SetFile>& files, Overwrite overwrite);

/// The identifier of a set by its content: the first 32 hexadecimal digits of the SHA-256 over
/// `parts` (the set's files other than the one that will carry the id, in a fixed order). Two
/// saves of the same content get the same id, so a plan stays byte for byte the same for a
/// seed; two saves of different content get different ids.
std::string content_set_id(const std::vector<std::string>& parts);

/// The key under which a set's index file lists the other files' SHA-256 (docs/plan-files.md).
inline constexpr const char* kSetIdKey = "set_id";
inline constexpr const char* kSetFilesKey = "set_sha256";

/// Checks that the files of a set in `dir` all come from one save: `index` (a JSON file of the
/// set) names the set id and the SHA-256 of every other file of the set; each must exist and
/// match. Throws InputError naming the file that belongs to another save (a mixed set) or is
/// missing. Returns the set id.
std::string verify_file_set(const QString& dir, const std::string& index);

/// Removes the temporaries of saves still in progress when SIGINT, SIGTERM or SIGHUP arrives,
/// then lets the signal end the process as it would have. For programs (the command line).
void remove_temporaries_on_signals();

}  // namespace gramline::formats
