#pragma once
// Reading JSON with errors that name the file and the field path, e.g.
// `demo.json: rig.motors[3].speed_deg_per_s: expected a number (found a string)`.
#include <QJsonArray>
#include <QJsonObject>
#include <QJsonValue>
#include <cstdint>
#include <initializer_list>
#include <memory>
#include <set>
#include <string>
#include <vector>

#include "formats/input_error.h"

namespace gramline::formats {

/// A value inside a parsed JSON document together with its path, for typed reads.
class JsonField {
 public:
  JsonField(QJsonValue value, std::string path, std::string file)
      : value_(std::move(value)),
        path_(std::move(path)),
        file_(std::move(file)),
        read_(std::make_shared<std::set<std::string>>()) {}

  /// Member `key` of this object; throws when this is not an object or the member is absent.
  JsonField operator[](const char* key) const;
  /// True when this is an object holding `key` (null counts as present).
  bool has(const char* key) const;
  /// Elements of this array; throws when this is not an array.
  std::vector<JsonField> items() const;

  bool is_null() const { return value_.isNull(); }
  /// A finite number.
  double number() const;
  /// An integer in [low, high].
  long long integer(long long low, long long high) const;
  std::string text() const;
  bool boolean() const;
  /// An array of numbers; with `length` >= 0 it must have exactly that many.
  std::vector<double> numbers(long length = -1) const;

  /// One of the texts produced by `to_string` for `choices`.
  template <class E>
  E choice(std::initializer_list<E> choices) const {
    const std::string got = text();
    std::string allowed;
    for (E c : choices) {
      if (to_string(c) == got) return c;
      allowed += (allowed.empty() ? "'" : ", '") + to_string(c) + "'";
    }
    fail("'" + got + "' is not one of " + allowed);
  }

  const std::string& path() const { return path_; }
  const std::string& file() const { return file_; }
  const QJsonValue& value() const { return value_; }

  /// Throws InputError "FILE: PATH: message".
  [[noreturn]] void fail(const std::string& message) const;

  /// Refuses the first object member, at any depth below this field, that no reader asked for
  /// (operator[] or has() on it, or items() on its array), naming its path: a misspelt or
  /// unknown key is an error, not silently ignored. Fields made from this one share the record.
  void refuse_unread_keys() const;

 private:
  std::string kind() const;
  [[noreturn]] void expected(const char* what) const;

  JsonField(QJsonValue value, std::string path, std::string file,
            std::shared_ptr<std::set<std::string>> read)
      : value_(std::move(value)),
        path_(std::move(path)),
        file_(std::move(file)),
        read_(std::move(read)) {}
  void refuse_unread_below(const QJsonValue& value, const std::string& path) const;

  QJsonValue value_;
  std::string path_;
  std::string file_;
  std::shared_ptr<std::set<std::string>> read_;  ///< paths asked for, shared with children
};

/// Parses JSON text whose top level must be an object; errors name the line and column.
JsonField parse_json_document(const std::string& bytes, const std::string& file);

}  // namespace gramline::formats
