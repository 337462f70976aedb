// Progress of long work: drawn on standard error when that is a terminal (here a pseudo-terminal
// the test holds), never when it is a pipe or a file.
#include <gtest/gtest.h>
#include <poll.h>
#include <pty.h>
#include <sys/wait.h>
#include <unistd.h>

#include <QFile>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>
#include <cerrno>
#include <string>
#include <vector>

#include "cli_run.h"
#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "formats/text_io.h"
#include "handoff_fixtures.h"

namespace {

using cli_test::CliRun;
using cli_test::run_cli;

QString data_file(const char* name) { return QString(GRAMLINE_TEST_DATA) + "/" + name; }

/// Runs gramline-cli with standard error on a pseudo-terminal and standard output on a pipe.
CliRun run_with_terminal_stderr(const QStringList& arguments) {
  CliRun run;
  int master = -1, slave = -1;
  int out_pipe[2];
  if (openpty(&master, &slave, nullptr, nullptr, nullptr) != 0 || pipe(out_pipe) != 0) return run;
  std::vector<std::string> words{GRAMLINE_CLI_PATH};
  for (const QString& a : arguments) words.push_back(a.toStdString());
  std::vector<char*> argv;
  for (std::string& w : words) argv.push_back(w.data());
  argv.push_back(nullptr);
  const pid_t child = fork();
  if (child == 0) {
    dup2(slave, STDERR_FILENO);
    dup2(out_pipe[1], STDOUT_FILENO);
    close(master);
    close(slave);
    close(out_pipe[0]);
    close(out_pipe[1]);
    execv(argv[0], argv.data());
    _exit(127);
  }
  close(slave);
  close(out_pipe[1]);
  // Read both until they close, so that neither side waits on a full buffer.
  pollfd fds[2] = {{out_pipe[0], POLLIN, 0}, {master, POLLIN, 0}};
  std::string* sinks[2] = {&run.out, &run.err};
  int open_fds = 2;
  while (open_fds > 0) {
    if (poll(fds, 2, 300000) <= 0) break;
    for (int k = 0; k < 2; ++k) {
      if (fds[k].fd < 0 || fds[k].revents == 0) continue;
      char buffer[4096];
      const ssize_t got = read(fds[k].fd, buffer, sizeof buffer);
      if (got > 0) {
        sinks[k]->append(buffer, static_cast<size_t>(got));
      } else if (got == 0 || errno != EINTR) {  // a closed terminal reads as EIO
        close(fds[k].fd);
        fds[k].fd = -1;
        --open_fds;
      }
    }
  }
  for (const pollfd& f : fds)
    if (f.fd >= 0) close(f.fd);
  int status = 0;
  if (waitpid(child, &status, 0) == child && WIFEXITED(status)) run.status = WEXITSTATUS(status);
  return run;
}

class Progress : public cli_test::DemoCampaignTest {};

TEST_F(Progress, TheMarginCheckDrawsItsProgressOnATerminalAndClearsIt) {
  const CliRun run = run_with_terminal_stderr(
      {"check", campaign_, "--data", data_file("small_two_features.csv"), "--trials", "50"});
  ASSERT_EQ(run.status, 0) << run.err;
  const size_t first = run.err.find("\rmargin check: ");
  ASSERT_NE(first, std::string::npos) << run.err;
  EXPECT_NE(run.err.find("margin check: 100 %"), std::string::npos) << run.err;
  // The line is blanked before the report: carriage return, spaces, carriage return.
  const size_t report = run.err.find("Margin check:");
  ASSERT_NE(report, std::string::npos) << run.err;
  ASSERT_GT(report, first);
  const std::string before = run.err.substr(0, report);
  const size_t last_percent = before.rfind('%');
  ASSERT_NE(last_percent, std::string::npos);
  const std::string tail = before.substr(last_percent + 1);
  ASSERT_GE(tail.size(), 3u);
  EXPECT_EQ(tail.front(), '\r');
  EXPECT_EQ(tail.back(), '\r');
  EXPECT_EQ(tail.find_first_not_of(' ', 1), tail.size() - 1) << tail;
  // Standard output is not a terminal and holds only the JSON.
  QJsonParseError error;
  const QJsonDocument json = QJsonDocument::fromJson(QByteArray::fromStdString(run.out), &error);
  EXPECT_EQ(error.error, QJsonParseError::NoError) << run.out;
  EXPECT_TRUE(json.object().contains("verdict"));
}

TEST_F(Progress, NothingIsDrawnWhenStandardErrorIsAPipe) {
  const CliRun run = run_cli(
      {"check", campaign_, "--data", data_file("small_two_features.csv"), "--trials", "50"});
  ASSERT_EQ(run.status, 0) << run.err;
  EXPECT_NE(run.err.find("Margin check:"), std::string::npos) << run.err;
  EXPECT_EQ(run.err.find("margin check: "), std::string::npos) << run.err;
  EXPECT_EQ(run.err.find('\r'), std::string::npos) << run.err;
}

TEST_F(Progress, IngestDrawsItsProgressOnATerminal) {
  const QString bundle = dir_.filePath("night.zip");
  ASSERT_EQ(
      run_cli({"export", campaign_, "--data", data_file("small_two_features.csv"), "--out", bundle})
          .status,
      0);
  const gramline::formats::Bundle b = gramline::formats::read_bundle(bundle);
  const QString counts = dir_.filePath("counts.csv");
  QFile file(counts);
  ASSERT_TRUE(file.open(QIODevice::WriteOnly));
  file.write(QByteArray::fromStdString(gramline::formats::format_counts_csv(
      handoff_test::simulate_counts(b.campaign, b.steps.steps, 4), b.steps.steps,
      gramline::formats::counts_layout(b.campaign))));
  file.close();
  const CliRun run =
      run_with_terminal_stderr({"ingest", bundle, counts, "--out", dir_.filePath("measured")});
  ASSERT_EQ(run.status, 0) << run.err;
  EXPECT_NE(run.err.find("\ringesting: 100 %"), std::string::npos) << run.err;
  // Standard output is a pipe: the report and the list of files, no progress.
  EXPECT_EQ(run.out.find('\r'), std::string::npos) << run.out;
  EXPECT_NE(run.out.find("wrote"), std::string::npos) << run.out;
}

}  // namespace
