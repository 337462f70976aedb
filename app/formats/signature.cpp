#include "formats/signature.h"

#include <QByteArray>
#include <QCryptographicHash>
#include <QFile>
#include <QFileInfo>
#include <QJsonDocument>
#include <QJsonObject>
#include <QMessageAuthenticationCode>

#include "formats/input_error.h"
#include "formats/json_field.h"
#include "formats/text_io.h"

namespace gramline::formats {
namespace {

QByteArrayView view(std::string_view bytes) {
  return QByteArrayView(bytes.data(), static_cast<qsizetype>(bytes.size()));
}

/// Equal texts, compared in time that does not depend on where they differ.
bool same_text(const std::string& a, const std::string& b) {
  if (a.size() != b.size()) return false;
  unsigned char diff = 0;
  for (size_t i = 0; i < a.size(); ++i) diff |= static_cast<unsigned char>(a[i] ^ b[i]);
  return diff == 0;
}

}  // namespace

std::string hmac_sha256_hex(std::string_view key, std::string_view message) {
  // QByteArray copies: the QByteArrayView overload needs a newer Qt than 6.4.
  const QByteArray m(message.data(), static_cast<qsizetype>(message.size()));
  const QByteArray k(key.data(), static_cast<qsizetype>(key.size()));
  return QMessageAuthenticationCode::hash(m, k, QCryptographicHash::Sha256).toHex().toStdString();
}

std::string read_lab_key(const QString& path) {
  const std::string name = path_text(path);
  const QFileInfo info(path);
  if (!info.exists()) throw InputError(name + ": the lab key file does not exist");
  if (!info.isFile()) throw InputError(name + ": the lab key must be a regular file");
  if (info.size() > static_cast<qint64>(kLabKeyMaxBytes))
    throw InputError(name + ": larger than " + std::to_string(kLabKeyMaxBytes) +
                     " bytes; a lab key file holds only the key");
  std::string key = read_whole_file(path, static_cast<std::int64_t>(kLabKeyMaxBytes));
  while (!key.empty() && (key.back() == '\n' || key.back() == '\r' || key.back() == ' '))
    key.pop_back();
  if (key.size() < kLabKeyMinBytes)
    throw InputError(name + ": the lab key has " + std::to_string(key.size()) +
                     " bytes; at least " + std::to_string(kLabKeyMinBytes) + " are needed");
  return key;
}

std::string lab_key_id(std::string_view key) {
  return QCryptographicHash::hash(view(key), QCryptographicHash::Sha256)
      .toHex()
      .left(16)
      .toStdString();
}

std::string format_signature(std::string_view manifest_bytes, std::string_view key) {
  const QJsonObject o{{"format", kSignatureFormat},
                      {"version", 1},
                      {"algorithm", "HMAC-SHA-256"},
                      {"signs", "manifest.json"},
                      {"key_id", QString::fromStdString(lab_key_id(key))},
                      {"hmac", QString::fromStdString(hmac_sha256_hex(key, manifest_bytes))}};
  return QJsonDocument(o).toJson(QJsonDocument::Indented).toStdString();
}

void verify_signature(const std::map<std::string, std::string>& entries, std::string_view key,
                      const std::string& source) {
  const auto signature = entries.find(kSignatureEntry);
  if (signature == entries.end())
    throw InputError(source + ": " + kSignatureEntry +
                     ": missing; a lab key was given, so only a signed bundle is accepted");
  const auto manifest = entries.find("manifest.json");
  if (manifest == entries.end()) throw InputError(source + ": no manifest.json to check");
  const JsonField root = parse_json_document(signature->second, source + ": " + kSignatureEntry);
  if (root["format"].text() != kSignatureFormat)
    root["format"].fail("not a Gramline signature (expected '" + std::string(kSignatureFormat) +
                        "')");
  root["version"].integer(1, 1);
  if (root["algorithm"].text() != "HMAC-SHA-256")
    root["algorithm"].fail("only HMAC-SHA-256 is read");
  if (root["signs"].text() != "manifest.json") root["signs"].fail("must be 'manifest.json'");
  if (!same_text(root["key_id"].text(), lab_key_id(key)))
    root["key_id"].fail("the bundle was signed with another lab key; refused");
  if (!same_text(root["hmac"].text(), hmac_sha256_hex(key, manifest->second)))
    root["hmac"].fail(
        "does not match manifest.json under the lab key: the bundle was changed "
        "after it was signed; refused");
}

}  // namespace gramline::formats
