#pragma once
// Runs the gramline-cli built beside the tests and collects its exit status and output.
#include <QProcess>
#include <QString>
#include <QStringList>
#include <string>

namespace cli_test {

struct CliRun {
  int status = -1;  ///< exit status; -1 when it did not finish in time, -2 when it crashed
  std::string out;
  std::string err;
};

inline CliRun run_cli(const QStringList& arguments) {
  QProcess process;
  process.start(QString(GRAMLINE_CLI_PATH), arguments);
  CliRun run;
  if (!process.waitForFinished(300000)) {
    process.kill();
    process.waitForFinished();
    return run;
  }
  run.status = process.exitStatus() == QProcess::NormalExit ? process.exitCode() : -2;
  run.out = process.readAllStandardOutput().toStdString();
  run.err = process.readAllStandardError().toStdString();
  return run;
}

}  // namespace cli_test
