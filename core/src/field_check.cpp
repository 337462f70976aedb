#include "gramline/field_check.h"

#include <cmath>
#include <sstream>
#include <stdexcept>

namespace gramline {

void FieldCheck::fail(const char* field, const std::string& requirement, double value) {
  if (!ok()) return;  // the first failing rule is the one reported
  std::ostringstream out;
  out << owner_ << "." << field << ": " << requirement << " (got " << value << ")";
  message_ = out.str();
}

FieldCheck& FieldCheck::positive(const char* field, double value) {
  if (!(value > 0) || !std::isfinite(value)) fail(field, "must be positive", value);
  return *this;
}

FieldCheck& FieldCheck::at_least(const char* field, double value, double low) {
  if (!(value >= low) || !std::isfinite(value)) {
    std::ostringstream rule;
    rule << "must be at least " << low;
    fail(field, rule.str(), value);
  }
  return *this;
}

FieldCheck& FieldCheck::inside(const char* field, double value, double low, double high) {
  if (!(value > low && value < high)) {
    std::ostringstream rule;
    rule << "must lie strictly between " << low << " and " << high;
    fail(field, rule.str(), value);
  }
  return *this;
}

FieldCheck& FieldCheck::within(const char* field, double value, const SaneRange& range) {
  if (!(value >= range.low && value <= range.high)) {
    std::ostringstream rule;
    rule << "must lie in [" << range.low << ", " << range.high << "]";
    if (*range.unit) rule << " " << range.unit;
    fail(field, rule.str(), value);
  }
  return *this;
}

FieldCheck& FieldCheck::require(bool holds, const char* field, const std::string& requirement) {
  if (!holds && ok()) message_ = owner_ + "." + field + ": " + requirement;
  return *this;
}

void FieldCheck::throw_if_failed() const {
  if (!ok()) throw std::invalid_argument(message_);
}

}  // namespace gramline
