// Replays the committed fuzz corpus (tests/fuzz/corpus/<target>/) through the fuzz targets'
// bodies once, as part of the normal test run: quick, and every input that once mattered keeps
// being checked without clang. The long runs are tests/fuzz/run_fuzzers.sh.
//
//   gramline_fuzz_replay CORPUS_FOLDER
#include <QDir>
#include <QFile>
#include <cstdio>
#include <map>
#include <string>

#include "fuzz_bodies.h"

int main(int argc, char** argv) {
  if (argc != 2) {
    std::fprintf(stderr, "usage: gramline_fuzz_replay CORPUS_FOLDER\n");
    return 2;
  }
  using Body = void (*)(const std::uint8_t*, std::size_t);
  const std::map<std::string, Body> targets = {{"campaign_json", gramline_fuzz::campaign_json},
                                               {"data_csv", gramline_fuzz::data_csv},
                                               {"counts_csv", gramline_fuzz::counts_csv},
                                               {"bundle", gramline_fuzz::bundle},
                                               {"bundle_entries", gramline_fuzz::bundle_entries}};
  const QDir root(QString::fromLocal8Bit(argv[1]));
  int replayed = 0;
  for (const auto& [name, body] : targets) {
    const QDir dir(root.filePath(QString::fromStdString(name)));
    int here = 0;
    for (const QString& file : dir.entryList(QDir::Files, QDir::Name)) {
      QFile f(dir.filePath(file));
      if (!f.open(QIODevice::ReadOnly)) {
        std::fprintf(stderr, "cannot read %s\n", qPrintable(f.fileName()));
        return 1;
      }
      const QByteArray bytes = f.readAll();
      // An abort inside the body (a finding) ends the program with a failure.
      body(reinterpret_cast<const std::uint8_t*>(bytes.constData()),
           static_cast<std::size_t>(bytes.size()));
      ++here;
    }
    if (here == 0) {
      std::fprintf(stderr, "no corpus for %s in %s\n", name.c_str(), argv[1]);
      return 1;
    }
    std::printf("%s: %d inputs replayed\n", name.c_str(), here);
    replayed += here;
  }
  std::printf("%d inputs replayed, no finding\n", replayed);
  return 0;
}
