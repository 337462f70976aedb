// Data safety under faults (docs/limits.md): a full disk never destroys a file or says "wrote",
// sets of files change together or not at all, outputs and inputs that are not regular files
// are refused, and every size is bounded by the largest supported campaign.
//
// The full disk is simulated for the gramline-cli process alone by a preloaded library
// (tests/fault/disk_full_shim.cpp) that fails writes to regular files with ENOSPC once a byte
// budget is spent; no test ever writes to a device node.
#include <gtest/gtest.h>
#include <sys/stat.h>
#include <sys/types.h>

#include <QDir>
#include <QFile>
#include <QProcessEnvironment>
#include <QTemporaryDir>
#include <map>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "formats/input_error.h"
#include "formats/limits.h"
#include "formats/plan_files.h"
#include "handoff_fixtures.h"

namespace {

using cli_test::CliRun;
using cli_test::run_cli;
namespace limits = gramline::formats::limits;

// glibc's strerror(ENOSPC) (common practice: the text every Linux tool prints for it).
const std::string kNoSpace = "No space left on device";

QString data_file(const char* name) { return QString(GRAMLINE_TEST_DATA) + "/" + name; }

using cli_test::read_text;

void write_text(const QString& path, const std::string& text) {
  ASSERT_TRUE(cli_test::write_text(path, text)) << path.toStdString();
}

/// gramline-cli on a "disk" with `free_bytes` bytes left (none taken away when negative);
/// `timeout_ms` bounds a run that must not hang.
CliRun run_cli_with(const QStringList& arguments, long long free_bytes, int timeout_ms = 300000) {
  QProcessEnvironment env = QProcessEnvironment::systemEnvironment();
  if (free_bytes >= 0) {
    env.insert("LD_PRELOAD", GRAMLINE_DISK_FULL_SHIM);
    env.insert("GRAMLINE_TEST_DISK_BYTES", QString::number(free_bytes));
  }
  return cli_test::run_cli_in(arguments, env, timeout_ms);
}

/// Every file in `dir` with its bytes (hidden ones included: a temporary would show).
std::map<QString, std::string> snapshot(const QString& dir) {
  std::map<QString, std::string> out;
  const QDir d(dir);
  for (const QString& name : d.entryList(QDir::Files | QDir::Hidden | QDir::System))
    out[name] = read_text(d.filePath(name));
  return out;
}

class DataSafety : public cli_test::DemoCampaignTest {};

// --- A full disk ----------------------------------------------------------------------------

TEST_F(DataSafety, AFullDiskKeepsTheOldCheckFileAndNamesTheSystemError) {
  const QString folder = dir_.filePath("out");
  ASSERT_TRUE(QDir().mkpath(folder));
  const QString path = QDir(folder).filePath("check.json");
  write_text(path, "the previous check\n");
  const auto before = snapshot(folder);
  const CliRun run =
      run_cli_with({"check", campaign_, "--data", data_file("small_two_features.csv"), "--trials",
                    "20", "--out", path, "--force"},
                   0);
  EXPECT_EQ(run.status, 1) << run.err;
  EXPECT_NE(run.err.find(kNoSpace), std::string::npos) << run.err;
  EXPECT_NE(run.err.find("check.json"), std::string::npos) << run.err;
  EXPECT_EQ(run.out.find("wrote"), std::string::npos) << run.out;
  EXPECT_EQ(snapshot(folder), before);  // old bytes, no temporary left
}

TEST_F(DataSafety, AFullDiskHalfWayThroughAPlanChangesNoneOfItsFiles) {
  const QString out = dir_.filePath("plan");
  ASSERT_EQ(run_cli({"plan", campaign_, "--out", out}).status, 0);
  write_text(QDir(out).filePath("notes.txt"), "the user's own notes\n");
  const auto before = snapshot(out);
  // Room for the first file of the set and a little more: the second one fails.
  const long long room = static_cast<long long>(before.at("steps.json").size()) + 4096;
  const QString other = dir_.filePath("other.json");
  ASSERT_EQ(run_cli({"demo", "--seed", "11", "--out", other}).status, 0);
  const CliRun run = run_cli_with({"plan", other, "--out", out, "--force"}, room);
  EXPECT_EQ(run.status, 1) << run.err;
  EXPECT_NE(run.err.find(kNoSpace), std::string::npos) << run.err;
  EXPECT_EQ(run.out.find("wrote"), std::string::npos) << run.out;
  EXPECT_EQ(snapshot(out), before);
  // The folder still reads back as one set.
  EXPECT_NO_THROW(gramline::formats::read_plan_folder(out));
}

TEST_F(DataSafety, AFullDiskDuringIngestKeepsTheEarlierResults) {
  const QString bundle = dir_.filePath("night.zip");
  ASSERT_EQ(run_cli({"export", campaign_, "--out", bundle}).status, 0);
  const gramline::formats::Bundle b = gramline::formats::read_bundle(bundle);
  const QString counts = dir_.filePath("counts.csv");
  write_text(counts, gramline::formats::format_counts_csv(
                         handoff_test::simulate_counts(b.campaign, b.steps.steps, 5), b.steps.steps,
                         gramline::formats::counts_layout(b.campaign)));
  const QString out = dir_.filePath("measured");
  ASSERT_EQ(run_cli({"ingest", bundle, counts, "--out", out}).status, 0);
  const auto before = snapshot(out);
  ASSERT_EQ(before.size(), 7u);
  for (long long room : {0LL, 3000LL, 60000LL}) {
    const CliRun run = run_cli_with({"ingest", bundle, counts, "--out", out, "--force"}, room);
    EXPECT_EQ(run.status, 1) << room << ": " << run.err;
    EXPECT_NE(run.err.find(kNoSpace), std::string::npos) << run.err;
    EXPECT_EQ(snapshot(out), before) << room;
  }
}

// --- Outputs and inputs that are not regular files -------------------------------------------

TEST_F(DataSafety, OutputsOntoAFifoAreRefusedEvenWithForce) {
  const QString fifo = dir_.filePath("pipe");
  ASSERT_EQ(mkfifo(fifo.toLocal8Bit().constData(), 0600), 0);
  for (const QStringList& args :
       {QStringList{"demo", "--out", fifo, "--force"},
        QStringList{"check", campaign_, "--trials", "20", "--out", fifo, "--force"},
        QStringList{"export", campaign_, "--out", fifo, "--force"},
        QStringList{"plan", campaign_, "--out", fifo, "--force"}}) {
    const CliRun run = run_cli_with(args, -1, 60000);
    EXPECT_EQ(run.status, 2) << args.join(' ').toStdString() << ": " << run.err;
    EXPECT_NE(run.err.find("pipe"), std::string::npos) << run.err;
    struct stat st {};
    ASSERT_EQ(stat(fifo.toLocal8Bit().constData(), &st), 0);
    EXPECT_TRUE(S_ISFIFO(st.st_mode)) << "the FIFO was replaced";
  }
  // A FIFO under a plan file's name inside the folder.
  const QString out = dir_.filePath("plan");
  ASSERT_TRUE(QDir().mkpath(out));
  ASSERT_EQ(mkfifo(QDir(out).filePath("kernel.csv").toLocal8Bit().constData(), 0600), 0);
  const CliRun run = run_cli_with({"plan", campaign_, "--out", out, "--force"}, -1, 60000);
  EXPECT_EQ(run.status, 2) << run.err;
  EXPECT_NE(run.err.find("kernel.csv"), std::string::npos) << run.err;
  EXPECT_FALSE(QFile::exists(QDir(out).filePath("steps.json")));
}

TEST_F(DataSafety, InputsThatAreNotRegularFilesAreRefusedNotRead) {
  const QString fifo = dir_.filePath("campaign-pipe");
  ASSERT_EQ(mkfifo(fifo.toLocal8Bit().constData(), 0600), 0);
  // Reading /dev/zero is harmless; it is only read from, never written.
  for (const QString& input : {fifo, QString("/dev/zero")}) {
    const CliRun run = run_cli_with({"plan", input}, -1, 60000);
    EXPECT_EQ(run.status, 2) << input.toStdString() << ": " << run.err;
    EXPECT_NE(run.err.find("not a regular file"), std::string::npos) << run.err;
  }
  const CliRun data = run_cli_with({"plan", campaign_, "--data", fifo}, -1, 60000);
  EXPECT_EQ(data.status, 2) << data.err;
  EXPECT_NE(data.err.find("not a regular file"), std::string::npos) << data.err;
}

// --- Limits ---------------------------------------------------------------------------------

TEST_F(DataSafety, TrialsBeyondTheLimitAreRefusedNamingIt) {
  const CliRun run = run_cli({"check", campaign_, "--trials", "2147483647"});
  EXPECT_EQ(run.status, 2) << run.err;
  EXPECT_NE(run.err.find(std::to_string(limits::kTrials)), std::string::npos) << run.err;
  std::string text = read_text(campaign_);
  const size_t at = text.find("\"trials\"");
  ASSERT_NE(at, std::string::npos);
  const size_t value = text.find(':', at) + 1;
  text.replace(value, text.find_first_of(",\n}", value) - value, " 50000000");
  const QString many = dir_.filePath("many.json");
  write_text(many, text);
  const CliRun from_file = run_cli({"check", many});
  EXPECT_EQ(from_file.status, 2) << from_file.err;
  EXPECT_NE(from_file.err.find("check.trials"), std::string::npos) << from_file.err;
}

TEST_F(DataSafety, MorePointsThanTheLargestCampaignAreRefusedNamingTheLimit) {
  std::string csv = "x1,x2,label\n";
  for (long i = 0; i <= limits::kPoints; ++i)
    csv += std::to_string(i % 97) + "." + std::to_string(i) + "," + std::to_string(i % 13) + "," +
           (i % 2 ? "1" : "-1") + "\n";
  const QString data = dir_.filePath("big.csv");
  write_text(data, csv);
  const CliRun run = run_cli({"plan", campaign_, "--data", data});
  EXPECT_EQ(run.status, 2) << run.err;
  EXPECT_NE(run.err.find(std::to_string(limits::kPoints)), std::string::npos) << run.err;
}

// --- Messages -------------------------------------------------------------------------------

TEST_F(DataSafety, ControlCharactersInMessagesAreEscaped) {
  const std::string name = std::string("no\x1b[31mfile\rhere.json");
  const CliRun run = run_cli({"plan", dir_.filePath(QString::fromStdString(name))});
  EXPECT_EQ(run.status, 2) << run.err;
  EXPECT_NE(run.err.find("no\\x1b[31mfile\\x0dhere.json"), std::string::npos) << run.err;
  EXPECT_EQ(run.err.find('\x1b'), std::string::npos);
  EXPECT_EQ(run.err.find('\r'), std::string::npos);
}

TEST(PrintableMessage, ANulNoLongerCutsTheMessage) {
  const std::string message = std::string("a.json: name 'x", 15) + std::string(1, '\0') + "y' bad";
  const gramline::formats::InputError e(message);
  EXPECT_EQ(std::string(e.what()), "a.json: name 'x\\x00y' bad");
}

}  // namespace
