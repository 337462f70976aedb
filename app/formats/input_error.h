#pragma once
// Errors in what the user gave us (a file, a field in a file, or a command-line argument), and
// failures of the system underneath (a full disk). Both keep their messages printable.
#include <stdexcept>
#include <string>

namespace gramline::formats {

/// `message` with every control character but the line break shown as `\xNN`, so that a NUL,
/// an escape sequence or a carriage return from a file or a path cannot cut or garble it.
inline std::string printable_message(const std::string& message) {
  static const char* const kHex = "0123456789abcdef";
  std::string out;
  out.reserve(message.size());
  for (char c : message) {
    const auto u = static_cast<unsigned char>(c);
    if ((u < 0x20 && c != '\n') || u == 0x7f) {
      out += "\\x";
      out += kHex[u >> 4];
      out += kHex[u & 15];
    } else {
      out += c;
    }
  }
  return out;
}

/// Bad input. what() is the complete message and names the file with its line and column,
/// or the file with the field path (e.g. `rig.motors[3].speed_deg_per_s`). The command line
/// maps it to exit status 2.
class InputError : public std::runtime_error {
 public:
  explicit InputError(const std::string& message)
      : std::runtime_error(printable_message(message)) {}
};

/// The system refused what a correct input needed: a write failed (a full disk, a lost
/// device), a rename failed. what() names the file and the system's own error text. The
/// command line maps it to exit status 1.
class SystemError : public std::runtime_error {
 public:
  explicit SystemError(const std::string& message)
      : std::runtime_error(printable_message(message)) {}
};

}  // namespace gramline::formats
