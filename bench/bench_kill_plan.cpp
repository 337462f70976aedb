// Kill test of `gramline-cli plan --out`: a folder holding one campaign's plan files (and a file
// of the user's) is planned again for another campaign with --force, and the process is killed
// at a random moment of its write phase. Afterwards each plan file is old (as before), new or
// missing; a folder holding old and new files at once is a mixed set. Also counted: temporary
// files left behind, the user's file changed, and whether the set reader (read_plan_folder)
// refuses every mixed folder.
//
// Usage: bench_kill_plan [RUNS] [TERM|KILL]   (default 100 runs, SIGKILL)
#include <signal.h>

#include <QCoreApplication>
#include <QDir>
#include <QElapsedTimer>
#include <QFile>
#include <QFileInfo>
#include <QProcess>
#include <QTemporaryDir>
#include <QThread>
#include <cstdio>
#include <map>
#include <random>
#include <string>

#include "formats/input_error.h"
#include "formats/plan_files.h"

namespace {

const char* const kPlanFiles[] = {"steps.json", "steps.csv", "summary.json", "kernel.csv"};

std::string read_text(const QString& path) {
  QFile f(path);
  if (!f.open(QIODevice::ReadOnly)) return {};
  return f.readAll().toStdString();
}

int run(const QStringList& args) {
  QProcess p;
  p.start(GRAMLINE_CLI_PATH, args);
  p.waitForFinished(-1);
  return p.exitCode();
}

/// Names and sizes in `dir`: changes as soon as the writer creates or replaces anything.
QString listing(const QDir& dir) {
  QString out;
  for (const QFileInfo& f : dir.entryInfoList(QDir::Files | QDir::Hidden, QDir::Name))
    out += f.fileName() + ":" + QString::number(f.size()) + ":" +
           QString::number(f.lastModified().toMSecsSinceEpoch()) + ";";
  return out;
}

}  // namespace

int main(int argc, char** argv) {
  QCoreApplication app(argc, argv);
  const int runs = argc > 1 ? std::atoi(argv[1]) : 100;
  const bool term = argc > 2 && std::string(argv[2]) == "TERM";
  QTemporaryDir tmp;
  const QString old_campaign = tmp.filePath("old.json");
  const QString new_campaign = tmp.filePath("new.json");
  if (run({"demo", "--seed", "1", "--out", old_campaign}) != 0 ||
      run({"demo", "--seed", "2", "--out", new_campaign}) != 0) {
    std::fprintf(stderr, "cannot write the demo campaigns\n");
    return 1;
  }
  // The write phase: from the first change of the folder to the end of the process.
  const QString probe = tmp.filePath("probe");
  run({"plan", old_campaign, "--out", probe});
  QProcess timed;
  QElapsedTimer clock;
  const QString before = listing(QDir(probe));
  clock.start();
  timed.start(GRAMLINE_CLI_PATH, {"plan", new_campaign, "--out", probe, "--force"});
  qint64 first_change_ns = -1;
  while (!timed.waitForFinished(0)) {
    if (first_change_ns < 0 && listing(QDir(probe)) != before)
      first_change_ns = clock.nsecsElapsed();
    QThread::usleep(100);
  }
  const qint64 total_ns = clock.nsecsElapsed();
  if (first_change_ns < 0) first_change_ns = total_ns;
  const double window_ms = (total_ns - first_change_ns) / 1e6;
  std::printf("plan run %.1f ms, write phase %.2f ms; %d runs killed with SIG%s\n", total_ns / 1e6,
              window_ms, runs, term ? "TERM" : "KILL");

  std::mt19937_64 rng(20261202);
  int all_old = 0, all_new = 0, mixed = 0, with_missing = 0, temporaries = 0, user_changed = 0;
  int mixed_refused = 0, whole_refused = 0;
  for (int i = 0; i < runs; ++i) {
    const QString out = tmp.filePath("run" + QString::number(i));
    run({"plan", old_campaign, "--out", out});
    const QDir dir(out);
    QFile notes(dir.filePath("notes.txt"));
    notes.open(QIODevice::WriteOnly);
    notes.write("the user's notes\n");
    notes.close();
    std::map<std::string, std::string> old_bytes;
    for (const char* name : kPlanFiles) old_bytes[name] = read_text(dir.filePath(name));
    const QString start = listing(dir);

    QProcess p;
    p.start(GRAMLINE_CLI_PATH, {"plan", new_campaign, "--out", out, "--force"});
    p.waitForStarted();
    while (p.state() == QProcess::Running && listing(dir) == start) QThread::usleep(50);
    std::uniform_real_distribution<double> delay(0.0, window_ms);
    QThread::usleep(static_cast<unsigned long>(delay(rng) * 1000.0));
    if (p.state() == QProcess::Running)
      ::kill(static_cast<pid_t>(p.processId()), term ? SIGTERM : SIGKILL);
    p.waitForFinished(-1);

    int olds = 0, news = 0, missing = 0;
    for (const char* name : kPlanFiles) {
      const QString path = dir.filePath(name);
      if (!QFile::exists(path)) {
        ++missing;
      } else if (read_text(path) == old_bytes[name]) {
        ++olds;
      } else {
        ++news;
      }
    }
    const bool is_mixed = (olds > 0 && news > 0) || missing > 0;
    all_old += olds == 4 ? 1 : 0;
    all_new += news == 4 ? 1 : 0;
    mixed += is_mixed ? 1 : 0;
    with_missing += missing > 0 ? 1 : 0;
    temporaries += dir.entryList({".*.part-*"}, QDir::Files | QDir::Hidden).isEmpty() ? 0 : 1;
    user_changed += read_text(dir.filePath("notes.txt")) == "the user's notes\n" ? 0 : 1;
    bool refused = false;
    try {
      gramline::formats::read_plan_folder(out);
    } catch (const gramline::formats::InputError&) {
      refused = true;
    }
    if (is_mixed && refused) ++mixed_refused;
    if (!is_mixed && refused) ++whole_refused;
  }
  std::printf("all old %d, all new %d, mixed %d (with a file missing %d) of %d\n", all_old, all_new,
              mixed, with_missing, runs);
  std::printf("folders with a temporary left %d, user's file changed %d\n", temporaries,
              user_changed);
  std::printf("mixed folders refused by the set reader %d of %d; whole sets refused %d\n",
              mixed_refused, mixed, whole_refused);
  return 0;
}
