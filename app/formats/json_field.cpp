#include "formats/json_field.h"

#include <QJsonDocument>
#include <QJsonParseError>
#include <cmath>
#include <cstdlib>
#include <set>
#include <vector>

namespace gramline::formats {

void JsonField::fail(const std::string& message) const {
  throw InputError(file_ + ": " + (path_.empty() ? std::string("(top level)") : path_) + ": " +
                   message);
}

std::string JsonField::kind() const {
  switch (value_.type()) {
    case QJsonValue::Null:
      return "null";
    case QJsonValue::Bool:
      return "a boolean";
    case QJsonValue::Double:
      return "a number";
    case QJsonValue::String:
      return "a string";
    case QJsonValue::Array:
      return "an array";
    case QJsonValue::Object:
      return "an object";
    case QJsonValue::Undefined:
      break;
  }
  return "nothing";
}

void JsonField::expected(const char* what) const {
  fail(std::string("expected ") + what + " (found " + kind() + ")");
}

JsonField JsonField::operator[](const char* key) const {
  if (!value_.isObject()) expected("an object");
  const std::string child = path_.empty() ? std::string(key) : path_ + "." + key;
  const QJsonObject object = value_.toObject();
  const auto it = object.constFind(QString::fromUtf8(key));
  if (it == object.constEnd()) JsonField(QJsonValue(), child, file_).fail("missing (required)");
  read_->insert(child);
  return JsonField(*it, child, file_, read_);
}

bool JsonField::has(const char* key) const {
  read_->insert(path_.empty() ? std::string(key) : path_ + "." + key);
  return value_.isObject() && value_.toObject().contains(QString::fromUtf8(key));
}

void JsonField::refuse_unread_keys() const { refuse_unread_below(value_, path_); }

void JsonField::refuse_unread_below(const QJsonValue& value, const std::string& path) const {
  if (value.isObject()) {
    const QJsonObject object = value.toObject();
    for (auto it = object.constBegin(); it != object.constEnd(); ++it) {
      const std::string key = it.key().toStdString();
      const std::string child = path.empty() ? key : path + "." + key;
      if (!read_->count(child))
        JsonField(it.value(), child, file_).fail("unknown key (not part of the format)");
      refuse_unread_below(it.value(), child);
    }
  } else if (value.isArray()) {
    const QJsonArray array = value.toArray();
    for (qsizetype i = 0; i < array.size(); ++i) {
      const std::string child = path + "[" + std::to_string(i) + "]";
      if (read_->count(child)) refuse_unread_below(array.at(i), child);
    }
  }
}

std::vector<JsonField> JsonField::items() const {
  if (!value_.isArray()) expected("an array");
  std::vector<JsonField> out;
  const QJsonArray array = value_.toArray();
  out.reserve(static_cast<size_t>(array.size()));
  for (qsizetype i = 0; i < array.size(); ++i) {
    const std::string child = path_ + "[" + std::to_string(i) + "]";
    read_->insert(child);
    out.push_back(JsonField(array.at(i), child, file_, read_));
  }
  return out;
}

double JsonField::number() const {
  if (!value_.isDouble()) expected("a number");
  const double v = value_.toDouble();
  if (!std::isfinite(v)) fail("expected a finite number");
  return v;
}

long long JsonField::integer(long long low, long long high) const {
  if (!value_.isDouble()) expected("an integer");
  const double v = value_.toDouble();
  if (!std::isfinite(v) || v != std::floor(v)) fail("expected an integer");
  if (v < static_cast<double>(low) || v > static_cast<double>(high)) {
    fail("expected an integer from " + std::to_string(low) + " to " + std::to_string(high));
  }
  return static_cast<long long>(v);
}

std::string JsonField::text() const {
  if (!value_.isString()) expected("a string");
  return value_.toString().toStdString();
}

bool JsonField::boolean() const {
  if (!value_.isBool()) expected("true or false");
  return value_.toBool();
}

std::vector<double> JsonField::numbers(long length) const {
  const std::vector<JsonField> elements = items();
  if (length >= 0 && static_cast<long>(elements.size()) != length) {
    fail("expected " + std::to_string(length) + " numbers (found " +
         std::to_string(elements.size()) + ")");
  }
  std::vector<double> out;
  out.reserve(elements.size());
  for (const JsonField& e : elements) out.push_back(e.number());
  return out;
}

namespace {

/// What QJsonDocument lets through and a Gramline file must not hold: a key given twice in one
/// object (QJsonDocument keeps the last silently) and a raw control character (a NUL, say)
/// inside a string. One pass over text QJsonDocument has accepted as JSON.
class StrictJsonScan {
 public:
  StrictJsonScan(const std::string& text, const std::string& file) : text_(text), file_(file) {}

  void run() {
    while (at_ < text_.size()) {
      const char c = text_[at_];
      if (c == '{' || c == '[') {
        frames_.push_back({c == '{', {}, child_path(), 0, c == '{', {}});
        ++at_;
      } else if (c == '}' || c == ']') {
        if (!frames_.empty()) frames_.pop_back();
        ++at_;
      } else if (c == ',') {
        if (!frames_.empty()) {
          Frame& f = frames_.back();
          if (f.object) {
            f.want_key = true;
          } else {
            ++f.index;
          }
        }
        ++at_;
      } else if (c == '"') {
        const size_t start = at_;
        const std::string value = string_token();
        if (!frames_.empty() && frames_.back().object && frames_.back().want_key) {
          Frame& f = frames_.back();
          f.want_key = false;
          f.key = value;
          if (!f.keys.insert(value).second)
            fail(start, child_path() +
                            ": the key appears twice in one object (only one value "
                            "may be given)");
        }
      } else {
        ++at_;
      }
    }
  }

 private:
  struct Frame {
    bool object;
    std::set<std::string> keys;
    std::string path;
    long index;
    bool want_key;
    std::string key;
  };

  std::string child_path() const {
    if (frames_.empty()) return {};
    const Frame& f = frames_.back();
    if (f.object) return f.path.empty() ? f.key : f.path + "." + f.key;
    return f.path + "[" + std::to_string(f.index) + "]";
  }

  [[noreturn]] void fail(size_t offset, const std::string& message) const {
    int line = 1;
    for (size_t i = 0; i < offset && i < text_.size(); ++i) line += text_[i] == '\n' ? 1 : 0;
    throw InputError(file_ + ":" + std::to_string(line) + ": " + message);
  }

  /// The string starting at at_ (a quote), decoded enough to compare keys; at_ moves past it.
  std::string string_token() {
    std::string out;
    const size_t start = at_;
    ++at_;
    while (at_ < text_.size()) {
      const auto c = static_cast<unsigned char>(text_[at_]);
      if (c == '"') {
        ++at_;
        return out;
      }
      if (c < 0x20) {
        const bool is_key = !frames_.empty() && frames_.back().object && frames_.back().want_key;
        const std::string where =
            is_key ? (frames_.back().path.empty() ? std::string("(a key)")
                                                  : frames_.back().path + ".(a key)")
                   : child_path();
        fail(start, (where.empty() ? std::string("(top level)") : where) +
                        ": a raw control character (byte " + std::to_string(c) +
                        ") inside a string; write it escaped, e.g. \\u0000");
      }
      if (c == '\\' && at_ + 1 < text_.size()) {
        const char e = text_[at_ + 1];
        if (e == 'u' && at_ + 5 < text_.size()) {
          // "\u0061" and "a" name the same key.
          const std::string hex = text_.substr(at_ + 2, 4);
          const unsigned long code = std::strtoul(hex.c_str(), nullptr, 16);
          if (code < 0x80) {
            out += static_cast<char>(code);
          } else if (code < 0x800) {
            out += static_cast<char>(0xC0 | (code >> 6));
            out += static_cast<char>(0x80 | (code & 0x3F));
          } else if (code < 0xD800 || code > 0xDFFF) {
            out += static_cast<char>(0xE0 | (code >> 12));
            out += static_cast<char>(0x80 | ((code >> 6) & 0x3F));
            out += static_cast<char>(0x80 | (code & 0x3F));
          } else {
            out += "\\u" + hex;  // half of a surrogate pair: compared as written
          }
          at_ += 6;
          continue;
        }
        out += e;
        at_ += 2;
        continue;
      }
      out += static_cast<char>(c);
      ++at_;
    }
    return out;
  }

  const std::string& text_;
  const std::string& file_;
  size_t at_ = 0;
  std::vector<Frame> frames_;
};

}  // namespace

JsonField parse_json_document(const std::string& bytes, const std::string& file) {
  QJsonParseError error{};
  const QByteArray data(bytes.data(), static_cast<qsizetype>(bytes.size()));
  const QJsonDocument document = QJsonDocument::fromJson(data, &error);
  if (error.error != QJsonParseError::NoError) {
    // A raw control character or a repeated key gets its own message naming the key.
    StrictJsonScan(bytes, file).run();
    int line = 1;
    int column = 1;
    for (qsizetype i = 0; i < error.offset && i < data.size(); ++i) {
      if (data[i] == '\n') {
        ++line;
        column = 1;
      } else {
        ++column;
      }
    }
    throw InputError(file + ":" + std::to_string(line) + ":" + std::to_string(column) +
                     ": not valid JSON (" + error.errorString().toStdString() + ")");
  }
  if (!document.isObject()) {
    throw InputError(file + ": (top level): expected an object");
  }
  StrictJsonScan(bytes, file).run();
  return JsonField(document.object(), "", file);
}

}  // namespace gramline::formats
