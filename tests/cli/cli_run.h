#pragma once
// Runs the gramline-cli built beside the tests and collects its exit status and output.
#include <gtest/gtest.h>

#include <QFile>
#include <QJsonDocument>
#include <QJsonObject>
#include <QProcess>
#include <QProcessEnvironment>
#include <QString>
#include <QStringList>
#include <QTemporaryDir>
#include <string>

namespace cli_test {

struct CliRun {
  int status = -1;  ///< exit status; -1 when it did not finish in time, -2 when it crashed
  std::string out;
  std::string err;
};

/// gramline-cli with `arguments` in `environment`; a run longer than `timeout_ms` is killed.
inline CliRun run_cli_in(const QStringList& arguments, const QProcessEnvironment& environment,
                         int timeout_ms = 300000) {
  QProcess process;
  process.setProcessEnvironment(environment);
  process.start(QString(GRAMLINE_CLI_PATH), arguments);
  CliRun run;
  if (!process.waitForFinished(timeout_ms)) {
    process.kill();
    process.waitForFinished();
    return run;
  }
  run.status = process.exitStatus() == QProcess::NormalExit ? process.exitCode() : -2;
  run.out = process.readAllStandardOutput().toStdString();
  run.err = process.readAllStandardError().toStdString();
  return run;
}

inline CliRun run_cli(const QStringList& arguments) {
  return run_cli_in(arguments, QProcessEnvironment::systemEnvironment());
}

/// The whole file as bytes; empty when it cannot be read.
inline std::string read_text(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return f.readAll().toStdString();
}

/// Writes the file whole; false when it cannot be written.
inline bool write_text(const QString& path, const std::string& text) {
  QFile f(path);
  if (!f.open(QIODevice::WriteOnly)) return false;
  return f.write(text.data(), static_cast<qint64>(text.size())) == static_cast<qint64>(text.size());
}

/// The JSON object in a file (empty when it is not one).
inline QJsonObject read_json(const QString& path) {
  return QJsonDocument::fromJson(QByteArray::fromStdString(read_text(path))).object();
}

/// A test that starts from the demo campaign, written by `gramline-cli demo` into a temporary
/// folder.
class DemoCampaignTest : public ::testing::Test {
 protected:
  void SetUp() override {
    campaign_ = dir_.filePath("demo.json");
    ASSERT_EQ(run_cli({"demo", "--out", campaign_}).status, 0);
  }
  QTemporaryDir dir_;
  QString campaign_;
};

}  // namespace cli_test
