#pragma once
// Errors in what the user gave us: a file, a field in a file, or a command-line argument.
#include <stdexcept>
#include <string>

namespace gramline::formats {

/// Bad input. what() is the complete message and names the file with its line and column,
/// or the file with the field path (e.g. `rig.motors[3].speed_deg_per_s`). The command line
/// maps it to exit status 2.
class InputError : public std::runtime_error {
 public:
  explicit InputError(const std::string& message) : std::runtime_error(message) {}
};

}  // namespace gramline::formats
