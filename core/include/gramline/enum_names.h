#pragma once
// One table per enum: each value beside the text that names it in files, on screen and on the
// command line. The to_string / from_string pair of every engine enum is derived from its table
// by the two helpers below, so a name is written exactly once.
#include <array>
#include <cstddef>
#include <string>
#include <string_view>

namespace gramline {

/// A value of enum E and its text.
template <typename E>
struct EnumName {
  E value;
  std::string_view text;
};

/// The table of an enum with K values.
template <typename E, std::size_t K>
using EnumNames = std::array<EnumName<E>, K>;

/// Text of `value` in `names`; a value missing from the table (only reachable by casting an
/// integer) gets the first entry's text.
template <typename E, std::size_t K>
std::string enum_text(const EnumNames<E, K>& names, E value) {
  for (const EnumName<E>& n : names)
    if (n.value == value) return std::string(n.text);
  return std::string(names.front().text);
}

/// Value whose text is exactly `text` (case-sensitive); false, and `out` untouched, when none is.
template <typename E, std::size_t K>
bool enum_from_text(const EnumNames<E, K>& names, std::string_view text, E& out) {
  for (const EnumName<E>& n : names) {
    if (n.text == text) {
      out = n.value;
      return true;
    }
  }
  return false;
}

}  // namespace gramline
