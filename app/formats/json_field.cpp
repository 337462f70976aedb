#include "formats/json_field.h"

#include <QJsonDocument>
#include <QJsonParseError>
#include <cmath>

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

JsonField parse_json_document(const std::string& bytes, const std::string& file) {
  QJsonParseError error{};
  const QByteArray data(bytes.data(), static_cast<qsizetype>(bytes.size()));
  const QJsonDocument document = QJsonDocument::fromJson(data, &error);
  if (error.error != QJsonParseError::NoError) {
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
  return JsonField(document.object(), "", file);
}

}  // namespace gramline::formats
