#include "formats/bundle.h"

#include <quazip/quazip.h>
#include <quazip/quazipfile.h>
#include <quazip/quazipfileinfo.h>
#include <quazip/quazipnewinfo.h>

#include <QBuffer>
#include <QCryptographicHash>
#include <QFileDevice>
#include <QFileInfo>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QRandomGenerator>
#include <algorithm>
#include <cmath>
#include <set>
#include <stdexcept>

#include "formats/campaign_json.h"
#include "formats/cautions_text.h"
#include "formats/data_csv.h"
#include "formats/input_error.h"
#include "formats/json_field.h"
#include "formats/report_html.h"
#include "formats/signature.h"
#include "formats/text_io.h"
#include "gramline/detection.h"
#include "gramline/jones.h"
#include "gramline/kernel.h"

namespace gramline::formats {
namespace {

QString q(const std::string& text) { return QString::fromStdString(text); }

std::string utc_text(const QDateTime& t) { return t.toUTC().toString(Qt::ISODate).toStdString(); }

}  // namespace

std::string sha256_hex(std::string_view bytes) {
  const QByteArray digest =
      QCryptographicHash::hash(QByteArrayView(bytes.data(), static_cast<qsizetype>(bytes.size())),
                               QCryptographicHash::Sha256);
  return digest.toHex().toStdString();
}

std::string new_bundle_id() {
  static const char kHex[] = "0123456789abcdef";
  std::string id;
  for (int word = 0; word < 4; ++word) {
    const quint32 bits = QRandomGenerator::system()->generate();
    for (int nibble = 7; nibble >= 0; --nibble) id += kHex[(bits >> (4 * nibble)) & 0xF];
  }
  return id;
}

std::map<std::string, std::string> bundle_entries(const Campaign& campaign, const Plan& plan,
                                                  const ResumeSummary* resume) {
  std::map<std::string, std::string> e;
  e[kCampaignEntry] = format_campaign(campaign);
  e[kDataEntry] = format_data_csv(campaign.data);
  e[kStepsJsonEntry] = format_steps_json(campaign.rig, plan.steps);
  e[kStepsCsvEntry] = format_steps_csv(campaign.rig, plan.steps);
  e[kSummaryJsonEntry] = format_summary_json(campaign, plan);
  e[kKernelEntry] = format_kernel_csv(plan.kernel_train);
  e[kSummaryHtmlEntry] = format_summary_html(campaign, plan, resume);
  e[kCautionsEntry] = cautions_plain_text();
  return e;
}

std::string format_manifest(const std::map<std::string, std::string>& entries, std::uint64_t seed,
                            const BundleWriteOptions& options) {
  QJsonArray files;
  for (const auto& [name, bytes] : entries) {
    files.append(QJsonObject{{"name", q(name)},
                             {"bytes", static_cast<qint64>(bytes.size())},
                             {"sha256", q(sha256_hex(bytes))}});
  }
  const QDateTime created =
      options.created_utc.isValid() ? options.created_utc : QDateTime::currentDateTimeUtc();
  QJsonValue parent(QJsonValue::Null);
  if (options.parent) {
    parent = QJsonObject{{"file", q(options.parent->file_name)},
                         {"manifest_sha256", q(options.parent->manifest_sha256)}};
  }
  // The seed is text: a 64-bit seed does not fit a JSON number exactly.
  const QJsonObject o{
      {"format", kBundleFormat},
      {"version", kBundleVersion},
      {"bundle_id", q(options.bundle_id.empty() ? new_bundle_id() : options.bundle_id)},
      {"tool", "gramline"},
      {"tool_version", GRAMLINE_VERSION},
      {"created_utc", q(utc_text(created))},
      {"conventions", q(steps_conventions_text())},
      {"seed", q(std::to_string(seed))},
      {"parent", parent},
      {"files", files}};
  const QByteArray text = QJsonDocument(o).toJson(QJsonDocument::Indented);
  return std::string(text.constData(), static_cast<size_t>(text.size()));
}

std::string zip_entries(const std::map<std::string, std::string>& entries, const QDateTime& stamp) {
  QBuffer buffer;
  QuaZip zip(&buffer);
  zip.setUtf8Enabled(true);
  if (!zip.open(QuaZip::mdCreate))
    throw std::runtime_error("cannot start the zip archive (QuaZip error " +
                             std::to_string(zip.getZipError()) + ")");
  for (const auto& [name, bytes] : entries) {
    QuaZipFile file(&zip);
    QuaZipNewInfo info(q(name));
    info.dateTime = stamp.toLocalTime();
    info.setPermissions(QFileDevice::ReadOwner | QFileDevice::WriteOwner | QFileDevice::ReadGroup |
                        QFileDevice::ReadOther);
    if (!file.open(QIODevice::WriteOnly, info) ||
        file.write(bytes.data(), static_cast<qint64>(bytes.size())) !=
            static_cast<qint64>(bytes.size())) {
      throw std::runtime_error("cannot add " + name + " to the zip archive");
    }
    file.close();
    if (file.getZipError() != 0) throw std::runtime_error("cannot add " + name + " to the zip");
  }
  zip.close();
  if (zip.getZipError() != 0) throw std::runtime_error("cannot finish the zip archive");
  const QByteArray& data = buffer.data();
  return std::string(data.constData(), static_cast<size_t>(data.size()));
}

BundleWritten write_bundle(const Campaign& campaign, const Plan& plan, const QString& path,
                           const BundleWriteOptions& options) {
  // Refuse before any work, so a refused export costs nothing.
  refuse_existing(path, options.overwrite);
  std::map<std::string, std::string> entries =
      bundle_entries(campaign, plan, options.resume ? &*options.resume : nullptr);
  for (const auto& [name, bytes] : options.extra_entries) {
    if (!is_safe_entry_name(name) || name == kManifestEntry || bundle_entry_limit(name) < 0)
      throw std::invalid_argument("write_bundle: unusable entry name " + name);
    entries[name] = bytes;
  }
  BundleWriteOptions o = options;
  if (!o.created_utc.isValid()) o.created_utc = QDateTime::currentDateTimeUtc();
  if (o.bundle_id.empty()) o.bundle_id = new_bundle_id();
  const std::string manifest = format_manifest(entries, campaign.seed, o);
  entries[kManifestEntry] = manifest;
  if (o.lab_key) entries[kSignatureEntry] = format_signature(manifest, *o.lab_key);
  const std::string zip = zip_entries(entries, o.created_utc);
  save_atomically(path, zip, options.overwrite);
  BundleWritten w;
  w.bundle_id = o.bundle_id;
  w.manifest_sha256 = sha256_hex(manifest);
  for (const auto& [name, bytes] : entries) w.entries.push_back(name);
  w.zip_bytes = static_cast<std::int64_t>(zip.size());
  return w;
}

bool is_safe_entry_name(std::string_view name) {
  if (name.empty() || name.size() > 255) return false;
  if (name.front() == '/' || name.back() == '/') return false;
  if (name.size() >= 2 && name[1] == ':') return false;  // drive letter
  for (char c : name)
    if (c == '\\' || static_cast<unsigned char>(c) < 32 || c == 127) return false;
  size_t begin = 0;
  while (begin <= name.size()) {
    size_t end = name.find('/', begin);
    if (end == std::string_view::npos) end = name.size();
    const std::string_view part = name.substr(begin, end - begin);
    if (part.empty() || part == "." || part == "..") return false;
    begin = end + 1;
  }
  return true;
}

std::int64_t bundle_entry_limit(std::string_view name) {
  using namespace limits;
  static const std::map<std::string_view, std::int64_t> known = {
      {kManifestEntry, kSmallJsonBytes},
      {kCampaignEntry, kCampaignBytes},
      {kDataEntry, kDataCsvBytes},
      {kStepsJsonEntry, kStepsJsonBytes},
      {kStepsCsvEntry, kStepsCsvBytes},
      {kSummaryJsonEntry, kSmallJsonBytes},
      {kKernelEntry, kKernelCsvBytes},
      {kSummaryHtmlEntry, kSummaryHtmlBytes},
      {kMeasuredStepsEntry, kStepsJsonBytes},
      {kMeasuredCountsEntry, kCountsBytes},
      {kResumeEntry, kSmallJsonBytes},
      {kCautionsEntry, kSmallJsonBytes},
      {kSignatureEntry, kSmallJsonBytes}};
  const auto it = known.find(name);
  return it == known.end() ? -1 : it->second;
}

std::map<std::string, std::string> unzip_entries(const std::string& zip_bytes,
                                                 const std::string& source,
                                                 const BundleReadLimits& limits) {
  QByteArray data(zip_bytes.data(), static_cast<qsizetype>(zip_bytes.size()));
  QBuffer buffer(&data);
  QuaZip zip(&buffer);
  if (!zip.open(QuaZip::mdUnzip))
    throw InputError(source + ": not a readable zip archive (QuaZip error " +
                     std::to_string(zip.getZipError()) + ")");
  if (zip.getEntriesCount() > limits.entries)
    throw InputError(source + ": " + std::to_string(zip.getEntriesCount()) +
                     " entries, more than the " + std::to_string(limits.entries) +
                     " a bundle may hold");
  // First the directory alone: names and declared sizes are judged before anything inflates.
  std::map<std::string, std::int64_t> limit_of;
  std::int64_t declared_total = 0;
  int count = 0;
  for (bool more = zip.goToFirstFile(); more; more = zip.goToNextFile()) {
    if (++count > limits.entries)
      throw InputError(source + ": more than " + std::to_string(limits.entries) + " entries");
    QuaZipFileInfo64 info;
    if (!zip.getCurrentFileInfo(&info))
      throw InputError(source + ": entry " + std::to_string(count) + ": unreadable header");
    const std::string name = info.name.toStdString();
    const std::string where = source + ": entry '" + name + "'";
    if (!is_safe_entry_name(name))
      throw InputError(where + ": refused, the name would escape the folder it is unpacked into");
    std::int64_t limit = bundle_entry_limit(name);
    if (limit < 0) throw InputError(where + ": not an entry the bundle format defines; refused");
    if (limits.entry_bytes > 0) limit = std::min(limit, limits.entry_bytes);
    if (!limit_of.emplace(name, limit).second) throw InputError(where + ": appears twice");
    if (info.uncompressedSize > static_cast<quint64>(limit))
      throw InputError(where + ": declares " + std::to_string(info.uncompressedSize) +
                       " bytes, more than the limit of " + std::to_string(limit) +
                       " for this entry (docs/limits.md)");
    declared_total += static_cast<std::int64_t>(info.uncompressedSize);
    if (declared_total > limits.total_bytes)
      throw InputError(source + ": the entries declare more than the limit of " +
                       std::to_string(limits.total_bytes) + " bytes together (docs/limits.md)");
  }
  if (zip.getZipError() != 0)
    throw InputError(source + ": damaged zip directory (QuaZip error " +
                     std::to_string(zip.getZipError()) + ")");
  std::map<std::string, std::string> out;
  std::int64_t total = 0;
  for (bool more = zip.goToFirstFile(); more; more = zip.goToNextFile()) {
    QuaZipFileInfo64 info;
    if (!zip.getCurrentFileInfo(&info)) throw InputError(source + ": unreadable entry header");
    const std::string name = info.name.toStdString();
    const std::string where = source + ": entry '" + name + "'";
    const std::int64_t limit = limit_of.at(name);
    QuaZipFile file(&zip);
    if (!file.open(QIODevice::ReadOnly))
      throw InputError(where + ": cannot be read (QuaZip error " +
                       std::to_string(file.getZipError()) + ")");
    std::string bytes;
    bytes.reserve(static_cast<size_t>(info.uncompressedSize));
    char chunk[65536];
    while (true) {
      const qint64 got = file.read(chunk, sizeof chunk);
      if (got < 0) {
        file.close();
        throw InputError(where + ": damaged (cannot be decompressed)");
      }
      if (got == 0) break;
      bytes.append(chunk, static_cast<size_t>(got));
      // The declared size may lie: the inflated bytes are held to the limits too.
      if (static_cast<std::int64_t>(bytes.size()) > limit) {
        file.close();
        throw InputError(where + ": larger than the limit of " + std::to_string(limit) +
                         " bytes for this entry");
      }
      if (total + static_cast<std::int64_t>(bytes.size()) > limits.total_bytes) {
        file.close();
        throw InputError(source + ": the entries together exceed the limit of " +
                         std::to_string(limits.total_bytes) + " bytes");
      }
    }
    file.close();
    if (file.getZipError() != 0)
      throw InputError(where + ": damaged (checksum error " + std::to_string(file.getZipError()) +
                       ")");
    if (bytes.size() != info.uncompressedSize)
      throw InputError(where + ": holds " + std::to_string(bytes.size()) + " bytes, declares " +
                       std::to_string(info.uncompressedSize));
    total += static_cast<std::int64_t>(bytes.size());
    out.emplace(name, std::move(bytes));
  }
  if (zip.getZipError() != 0)
    throw InputError(source + ": damaged zip directory (QuaZip error " +
                     std::to_string(zip.getZipError()) + ")");
  zip.close();
  return out;
}

namespace {

BundleManifest parse_manifest(const std::string& bytes, const std::string& file) {
  const JsonField root = parse_json_document(bytes, file);
  BundleManifest m;
  if (root["format"].text() != kBundleFormat)
    root["format"].fail("not a Gramline bundle manifest (expected '" + std::string(kBundleFormat) +
                        "')");
  const long long version = root["version"].integer(1, 1000000);
  if (version > kBundleVersion)
    root["version"].fail("version " + std::to_string(version) +
                         " is newer than this Gramline reads (" + std::to_string(kBundleVersion) +
                         ")");
  if (root.has("bundle_id")) {
    m.bundle_id = root["bundle_id"].text();
    const bool hex =
        m.bundle_id.size() == 32 && std::all_of(m.bundle_id.begin(), m.bundle_id.end(), [](char c) {
          return (c >= '0' && c <= '9') || (c >= 'a' && c <= 'f');
        });
    if (!hex) root["bundle_id"].fail("'" + m.bundle_id.substr(0, 40) + "' is not 32 hex digits");
  }
  m.tool_version = root["tool_version"].text();
  m.created_utc = root["created_utc"].text();
  m.conventions = root["conventions"].text();
  const std::string seed = root["seed"].text();
  try {
    size_t used = 0;
    if (seed.empty() || seed[0] == '-') throw std::invalid_argument("sign");
    m.seed = std::stoull(seed, &used);
    if (used != seed.size()) throw std::invalid_argument("tail");
  } catch (const std::exception&) {
    root["seed"].fail("'" + seed.substr(0, 30) + "' is not a whole number");
  }
  if (root.has("parent") && !root["parent"].is_null()) {
    BundleParent p;
    p.file_name = root["parent"]["file"].text();
    p.manifest_sha256 = root["parent"]["manifest_sha256"].text();
    m.parent = p;
  }
  for (const JsonField& f : root["files"].items()) {
    ManifestFile mf;
    mf.name = f["name"].text();
    mf.bytes = f["bytes"].integer(0, std::int64_t{1} << 50);
    mf.sha256 = f["sha256"].text();
    m.files.push_back(mf);
  }
  return m;
}

// Steps the ingest engine will index by must fit the campaign's points and motors.
void check_steps_fit(const StepsFile& steps, const Campaign& c, const std::string& where) {
  const int n = c.data.train_count();
  const int m = c.data.test_count();
  if (steps.rig.motors.size() != c.rig.motors.size())
    throw InputError(where + ": " + std::to_string(steps.rig.motors.size()) +
                     " motors, the campaign has " + std::to_string(c.rig.motors.size()));
  for (size_t k = 0; k < c.rig.motors.size(); ++k)
    if (steps.rig.motors[k].name != c.rig.motors[k].name)
      throw InputError(where + ": motors[" + std::to_string(k) + "] is '" +
                       steps.rig.motors[k].name + "', the campaign's is '" + c.rig.motors[k].name +
                       "'");
  for (size_t k = 0; k < steps.steps.size(); ++k) {
    const Step& s = steps.steps[k];
    const std::string at = where + ": steps[" + std::to_string(k) + "]";
    if (s.position_deg.size() != c.rig.motors.size())
      throw InputError(at + ".position_deg: one position per motor is needed");
    // Any step naming points (a reference step may) must name existing ones: the ingest
    // engine looks them up.
    for (int point : {s.prep_point, s.analysis_point})
      if (point >= n + m)
        throw InputError(at + ": point " + std::to_string(point) + " does not exist (" +
                         std::to_string(n + m) + " points)");
    if (s.kind != StepKind::measure) continue;
    const int a = std::min(s.prep_point, s.analysis_point);
    const int b = std::max(s.prep_point, s.analysis_point);
    const bool train = s.block == Block::train && a >= 0 && a != b && b < n;
    const bool test = s.block == Block::test && a >= 0 && a < n && b >= n && b < n + m;
    if (!train && !test)
      throw InputError(at + ": a measure step of block '" + to_string(s.block) +
                       "' cannot join points " + std::to_string(s.prep_point) + " and " +
                       std::to_string(s.analysis_point) + " (" + std::to_string(n) +
                       " training and " + std::to_string(m) + " test points)");
    if (!std::isfinite(s.kernel_ideal) || !std::isfinite(s.pairs) || !std::isfinite(s.dwell_s))
      throw InputError(at + ": kernel_ideal, pairs and dwell_s must be finite");
  }
}

}  // namespace

Bundle parse_bundle(const std::string& zip_bytes, const std::string& source,
                    const BundleReadLimits& limits) {
  Bundle b;
  b.source = source;
  b.entries = unzip_entries(zip_bytes, source, limits);
  const auto manifest = b.entries.find(kManifestEntry);
  if (manifest == b.entries.end())
    throw InputError(source + ": no manifest.json (not a Gramline bundle)");
  b.manifest = parse_manifest(manifest->second, source + ": manifest.json");
  b.manifest_sha256 = sha256_hex(manifest->second);
  std::set<std::string> listed;
  for (const ManifestFile& f : b.manifest.files) {
    const std::string where = source + ": " + f.name;
    if (f.name == kManifestEntry || f.name == kSignatureEntry || !listed.insert(f.name).second)
      throw InputError(source + ": manifest.json lists '" + f.name +
                       "' twice, lists itself or lists " + kSignatureEntry);
    const auto it = b.entries.find(f.name);
    if (it == b.entries.end()) throw InputError(where + ": listed in the manifest but missing");
    if (static_cast<std::int64_t>(it->second.size()) != f.bytes ||
        sha256_hex(it->second) != f.sha256)
      throw InputError(where +
                       ": does not match its SHA-256 in the manifest; the file was "
                       "changed after export, the bundle is refused");
  }
  for (const auto& [name, bytes] : b.entries)
    if (name != kManifestEntry && name != kSignatureEntry && !listed.count(name))
      throw InputError(source + ": " + name + ": not listed in the manifest; refused");
  for (const char* needed : {kCampaignEntry, kStepsJsonEntry})
    if (!b.entries.count(needed))
      throw InputError(source + ": " + needed + ": missing from the bundle");
  b.campaign = parse_campaign(b.entries.at(kCampaignEntry), source + ": campaign.json");
  if (const std::string problem = b.campaign.check_consistency(); !problem.empty())
    throw InputError(source + ": campaign.json: " + problem);
  b.steps = parse_steps_json(b.entries.at(kStepsJsonEntry), source + ": steps.json");
  check_steps_fit(b.steps, b.campaign, source + ": steps.json");
  const bool has_steps = b.entries.count(kMeasuredStepsEntry) != 0;
  const bool has_counts = b.entries.count(kMeasuredCountsEntry) != 0;
  if (has_steps != has_counts)
    throw InputError(source + ": " + kMeasuredStepsEntry + " and " + kMeasuredCountsEntry +
                     " come together; one of them is missing");
  if (has_steps) {
    const std::string steps_where = source + ": " + kMeasuredStepsEntry;
    StepsFile measured = parse_steps_json(b.entries.at(kMeasuredStepsEntry), steps_where);
    check_steps_fit(measured, b.campaign, steps_where);
    const CountsFile counts =
        parse_counts_csv(b.entries.at(kMeasuredCountsEntry), source + ": " + kMeasuredCountsEntry,
                         counts_layout(b.campaign));
    CountsCheck check = check_counts(counts, measured.steps);
    if (!check.consistent())
      throw InputError(check.report() + source + ": " + kMeasuredCountsEntry + " does not fit " +
                       kMeasuredStepsEntry);
    b.measured_steps = std::move(measured.steps);
    b.measured_records = std::move(check.records);
    b.measured_simulated_note = counts.simulated_note;
  }
  return b;
}

Bundle read_bundle(const QString& path, const BundleReadLimits& limits) {
  return parse_bundle(read_whole_file(path, limits.file_bytes), path_text(path), limits);
}

std::string check_counts_bundle(const Bundle& bundle, const CountsFile& counts) {
  const std::string& ours = bundle.manifest.bundle_id;
  if (counts.bundle_id.empty()) {
    return counts.source + ": the file names no bundle (no first line '# bundle: <id>'); it is " +
           "read as counts of " + bundle.source +
           (ours.empty() ? std::string() : " (bundle " + ours + ")");
  }
  if (ours.empty()) {
    return bundle.source + ": the bundle carries no bundle_id (written by an older Gramline); " +
           "the counts file's '# bundle: " + counts.bundle_id + "' cannot be checked";
  }
  if (counts.bundle_id != ours)
    throw InputError(counts.source + ": line 1: the counts answer bundle " + counts.bundle_id +
                     ", but " + bundle.source + " is bundle " + ours +
                     "; counts of another bundle are refused");
  return {};
}

Bundle read_bundle_checked(const QString& path, const std::optional<std::string>& lab_key) {
  Bundle bundle = read_bundle(path);
  if (lab_key) verify_signature(bundle.entries, *lab_key, bundle.source);
  return bundle;
}

Plan plan_from_bundle(const Bundle& bundle) {
  return plan_from_steps(bundle.campaign, bundle.steps.steps);
}

}  // namespace gramline::formats
