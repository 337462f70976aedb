// gramline_simulated_counts: writes a counts file for a bundle, drawn from the rig model (the
// hand-off tests' simulate_counts), so the screenshot script can show the Measured view and
// the resume dialog without a rig. A tool for reviews and tests, not part of the app.
//
// Usage: gramline_simulated_counts BUNDLE OUT.csv [--seed N] [--fraction F] [--fade F]
//   --fraction F  keep only the first F (0..1] of the counted steps (a night cut short)
//   --fade F      the pair rate falls by the share F per hour of the night: each count is
//                 thinned binomially, which keeps it Poisson with the lower mean
#include <QCoreApplication>
#include <QFile>
#include <QStringList>
#include <algorithm>
#include <cstdio>
#include <exception>
#include <random>

#include "formats/bundle.h"
#include "formats/counts_csv.h"
#include "handoff_fixtures.h"

int main(int argc, char** argv) {
  QCoreApplication app(argc, argv);
  const QStringList args = QCoreApplication::arguments().mid(1);
  if (args.size() < 2) {
    std::fprintf(stderr,
                 "usage: gramline_simulated_counts BUNDLE OUT.csv [--seed N] [--fraction F] "
                 "[--fade F]\n");
    return 2;
  }
  std::uint64_t seed = 1;
  double fraction = 1.0, fade_per_hour = 0.0;
  for (int k = 2; k + 1 < args.size(); k += 2) {
    if (args[k] == QStringLiteral("--seed")) seed = args[k + 1].toULongLong();
    if (args[k] == QStringLiteral("--fraction")) fraction = args[k + 1].toDouble();
    if (args[k] == QStringLiteral("--fade")) fade_per_hour = args[k + 1].toDouble();
  }
  try {
    const gramline::formats::Bundle bundle = gramline::formats::read_bundle(args[0]);
    auto records = handoff_test::simulate_counts(bundle.campaign, bundle.steps.steps, seed);
    const auto keep = static_cast<std::size_t>(std::clamp(fraction, 0.0, 1.0) *
                                               static_cast<double>(records.size()));
    records.resize(std::max<std::size_t>(1, keep));
    std::mt19937_64 rng(seed + 1);
    for (gramline::StepRecord& r : records) {
      const double share = std::clamp(1.0 - fade_per_hour * r.start_s / 3600.0, 0.0, 1.0);
      if (share >= 1.0) continue;
      for (double& c : r.channel_counts)
        c = static_cast<double>(std::binomial_distribution<long>(static_cast<long>(c), share)(rng));
    }
    const std::string text = gramline::formats::format_counts_csv(
        records, bundle.steps.steps, gramline::formats::counts_layout(bundle.campaign),
        bundle.manifest.bundle_id);
    QFile out(args[1]);
    if (!out.open(QIODevice::WriteOnly) ||
        out.write(text.data(), static_cast<qint64>(text.size())) !=
            static_cast<qint64>(text.size())) {
      std::fprintf(stderr, "%s: cannot write\n", qPrintable(args[1]));
      return 1;
    }
  } catch (const std::exception& e) {
    std::fprintf(stderr, "%s\n", e.what());
    return 2;
  }
  return 0;
}
