#pragma once
// Keyed signature of a bundle (docs/bundle-integrity.md). The manifest's SHA-256 sums show that
// no entry changed by accident, but anyone can recompute them after editing a file. A lab key
// shared by the planner and the rig makes a signature that cannot be recomputed without the
// key: HMAC-SHA-256 over the manifest's bytes, which in turn fix every other entry.
#include <QString>
#include <map>
#include <string>
#include <string_view>

namespace gramline::formats {

inline constexpr const char* kSignatureEntry = "signature.json";
inline constexpr const char* kSignatureFormat = "gramline-signature";
/// Shortest usable lab key, bytes: a shorter secret is guessed too easily.
inline constexpr std::size_t kLabKeyMinBytes = 16;
/// Largest lab key file read, bytes.
inline constexpr std::size_t kLabKeyMaxBytes = 4096;

/// HMAC-SHA-256 of `message` under `key` (QMessageAuthenticationCode), lowercase hexadecimal.
std::string hmac_sha256_hex(std::string_view key, std::string_view message);

/// The lab key held in the file at `path`: its bytes with trailing line breaks and spaces
/// removed. Throws InputError naming the file when it cannot be read, is not a regular file,
/// is larger than kLabKeyMaxBytes or yields fewer than kLabKeyMinBytes bytes.
std::string read_lab_key(const QString& path);

/// Short public name of a key (the first 16 hex digits of its SHA-256), written beside the
/// signature so that a check with another key can say so.
std::string lab_key_id(std::string_view key);

/// signature.json text signing `manifest_bytes` with `key`.
std::string format_signature(std::string_view manifest_bytes, std::string_view key);

/// Checks that `entries` (a bundle's, manifest included) carry a signature.json made with `key`
/// over their manifest.json. Throws InputError naming `source` when the signature is missing,
/// malformed, made with another key or does not match.
void verify_signature(const std::map<std::string, std::string>& entries, std::string_view key,
                      const std::string& source);

}  // namespace gramline::formats
