#pragma once
// Validation of options structs. Each rule names the field it checks; the first rule that fails
// becomes the message "Owner.field: must be ... (got value)", so an error always says which
// field of which struct to change.
#include <string>
#include <utility>

#include "gramline/sane_ranges.h"

namespace gramline {

class FieldCheck {
 public:
  /// `owner` prefixes every field name: a struct name ("TrialOptions") or a field path
  /// ("check").
  explicit FieldCheck(std::string owner) : owner_(std::move(owner)) {}

  /// value > 0 and finite.
  FieldCheck& positive(const char* field, double value);
  /// value >= low and finite.
  FieldCheck& at_least(const char* field, double value, double low);
  /// low < value < high.
  FieldCheck& inside(const char* field, double value, double low, double high);
  /// range.low <= value <= range.high (docs/parameter-ranges.md); NaN fails.
  FieldCheck& within(const char* field, double value, const SaneRange& range);
  /// Any other rule: `holds` false fails with "Owner.field: `requirement`".
  FieldCheck& require(bool holds, const char* field, const std::string& requirement);

  bool ok() const { return message_.empty(); }
  /// Empty while every rule held; else the message of the first rule that failed.
  const std::string& message() const { return message_; }
  /// Throws std::invalid_argument with message() when a rule failed.
  void throw_if_failed() const;

 private:
  void fail(const char* field, const std::string& requirement, double value);

  std::string owner_;
  std::string message_;
};

}  // namespace gramline
