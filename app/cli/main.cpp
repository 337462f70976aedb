// gramline-cli: the command-line twin of the Gramline app (README, "Command line").
#include <algorithm>
#include <charconv>
#include <exception>
#include <iostream>
#include <map>
#include <set>
#include <string>
#include <vector>

#include "cli/commands.h"
#include "formats/input_error.h"

namespace {

using gramline::formats::InputError;

const char* const kOverview =
    "gramline-cli: plans polarization-encoded quantum-kernel measurements with photon pairs.\n"
    "\n"
    "Commands:\n"
    "  demo --out FILE [--seed N]\n"
    "      Write the bundled demo campaign (48 training and 16 test points, a two-photon rig of\n"
    "      eight motors) to FILE.\n"
    "  plan CAMPAIGN [--data CSV] [--out DIR] [--seed N]\n"
    "      Plan the campaign: settings, their order, pairs and dwell times, nights. Prints a\n"
    "      short summary; with --out writes steps.json, steps.csv, summary.json and kernel.csv\n"
    "      into DIR (created if needed).\n"
    "  check CAMPAIGN [--data CSV] [--trials N] [--seed N] --out FILE\n"
    "      Margin check of the planned precision; writes the verdict as JSON to FILE.\n"
    "  export CAMPAIGN --out FILE.zip [--data CSV] [--seed N] [--force]\n"
    "      Plan the campaign and write the hand-off bundle for the rig: steps, campaign, data,\n"
    "      summary, printable summary.html and a manifest with the SHA-256 of every file.\n"
    "  ingest BUNDLE COUNTS --out DIR [--force]\n"
    "      Check the bundle and the rig's counts file against each other, build the measured\n"
    "      Gram matrix, compare it with the prediction, track drift, train the classifier.\n"
    "  resume BUNDLE COUNTS --out FILE.zip [--force]\n"
    "      Keep what the counts file measured and plan the rest from where the motors stopped;\n"
    "      the new bundle names its parent.\n"
    "  help [COMMAND]\n"
    "      This text.\n"
    "\n"
    "Options:\n"
    "  --data CSV   replace the campaign's points: a header row, numeric feature columns, a\n"
    "               'label' column with two classes (-1/+1, or two names: the first one met is\n"
    "               +1) and an optional 'set' column (train or test; default train)\n"
    "  --seed N     seed of the random choices (default: the campaign's seed)\n"
    "  --trials N   simulated repetitions of the margin check\n"
    "  --out        output file (demo, check, export, resume) or directory (plan, ingest)\n"
    "  --force      replace existing output files (otherwise they are left untouched)\n"
    "  --version    print the version\n"
    "\n"
    "Exit status: 0 success, 2 bad input (the message names the file and line or field),\n"
    "1 internal failure.\n";

struct Arguments {
  std::vector<std::string> positional;
  std::map<std::string, std::string> options;
};

/// Splits the words after the command into positional words and `--name value` options
/// (`--name=value` also works). Only the names in `allowed` are accepted.
Arguments split_arguments(const std::string& command, const std::vector<std::string>& words,
                          const std::set<std::string>& allowed) {
  Arguments out;
  for (size_t i = 0; i < words.size(); ++i) {
    const std::string& word = words[i];
    if (word.rfind("--", 0) != 0 || word == "--") {
      out.positional.push_back(word);
      continue;
    }
    std::string name = word;
    std::string value;
    bool has_value = false;
    if (const size_t eq = word.find('='); eq != std::string::npos) {
      name = word.substr(0, eq);
      value = word.substr(eq + 1);
      has_value = true;
    }
    if (!allowed.count(name)) {
      throw InputError("gramline-cli " + command + ": unknown option '" + name +
                       "' (see gramline-cli help)");
    }
    if (!has_value) {
      if (i + 1 >= words.size()) {
        throw InputError("gramline-cli " + command + ": option " + name + " needs a value");
      }
      value = words[++i];
    }
    if (!out.options.emplace(name, value).second) {
      throw InputError("gramline-cli " + command + ": option " + name + " is given twice");
    }
  }
  return out;
}

template <class T>
T whole_number(const std::string& command, const std::string& option, const std::string& text,
               T low) {
  T value{};
  const char* end = text.data() + text.size();
  const auto result = std::from_chars(text.data(), end, value);
  if (text.empty() || result.ec != std::errc() || result.ptr != end || value < low) {
    throw InputError("gramline-cli " + command + ": option " + option + ": '" + text +
                     "' is not a whole number >= " + std::to_string(low));
  }
  return value;
}

std::optional<std::string> option(const Arguments& a, const char* name) {
  const auto it = a.options.find(name);
  if (it == a.options.end()) return std::nullopt;
  return it->second;
}

std::optional<std::uint64_t> seed_option(const std::string& command, const Arguments& a) {
  if (auto text = option(a, "--seed")) {
    return whole_number<std::uint64_t>(command, "--seed", *text, 0);
  }
  return std::nullopt;
}

/// Removes every `--name` (a flag without a value) from `words`; true when there was one.
bool take_flag(std::vector<std::string>& words, const char* name) {
  const auto end = std::remove(words.begin(), words.end(), std::string(name));
  const bool found = end != words.end();
  words.erase(end, words.end());
  return found;
}

void expect_positionals(const std::string& command, const Arguments& a, size_t count,
                        const char* what) {
  if (a.positional.size() < count) {
    throw InputError("gramline-cli " + command + ": missing " + what + " (see gramline-cli help)");
  }
  if (a.positional.size() > count) {
    throw InputError("gramline-cli " + command + ": unexpected argument '" + a.positional[count] +
                     "'");
  }
}

int dispatch(const std::vector<std::string>& argv) {
  if (argv.empty()) {
    std::cerr << kOverview;
    return 2;
  }
  const std::string& command = argv.front();
  const std::vector<std::string> rest(argv.begin() + 1, argv.end());
  if (command == "help" || command == "--help" || command == "-h") {
    std::cout << kOverview;
    return 0;
  }
  if (command == "--version") {
    std::cout << "gramline-cli " << GRAMLINE_VERSION << "\n";
    return 0;
  }
  for (const std::string& word : rest) {
    if (word == "--help" || word == "-h") {
      std::cout << kOverview;
      return 0;
    }
  }
  if (command == "demo") {
    const Arguments a = split_arguments(command, rest, {"--out", "--seed"});
    expect_positionals(command, a, 0, "");
    gramline::cli::DemoRequest request;
    const auto out = option(a, "--out");
    if (!out) throw InputError("gramline-cli demo: --out FILE is required");
    request.out_path = *out;
    request.seed = seed_option(command, a);
    return gramline::cli::run_demo(request);
  }
  if (command == "plan") {
    const Arguments a = split_arguments(command, rest, {"--data", "--out", "--seed"});
    expect_positionals(command, a, 1, "the campaign file");
    gramline::cli::PlanRequest request;
    request.campaign_path = a.positional[0];
    request.data_path = option(a, "--data");
    request.out_dir = option(a, "--out");
    request.seed = seed_option(command, a);
    return gramline::cli::run_plan(request);
  }
  if (command == "check") {
    const Arguments a = split_arguments(command, rest, {"--data", "--out", "--seed", "--trials"});
    expect_positionals(command, a, 1, "the campaign file");
    gramline::cli::CheckRequest request;
    request.campaign_path = a.positional[0];
    request.data_path = option(a, "--data");
    const auto out = option(a, "--out");
    if (!out) throw InputError("gramline-cli check: --out FILE is required");
    request.out_path = *out;
    if (auto trials = option(a, "--trials")) {
      request.trials = whole_number<int>(command, "--trials", *trials, 1);
    }
    request.seed = seed_option(command, a);
    return gramline::cli::run_check(request);
  }
  if (command == "export") {
    std::vector<std::string> words = rest;
    gramline::cli::ExportRequest request;
    request.force = take_flag(words, "--force");
    const Arguments a = split_arguments(command, words, {"--data", "--out", "--seed"});
    expect_positionals(command, a, 1, "the campaign file");
    request.campaign_path = a.positional[0];
    request.data_path = option(a, "--data");
    const auto out = option(a, "--out");
    if (!out) throw InputError("gramline-cli export: --out FILE.zip is required");
    request.out_path = *out;
    request.seed = seed_option(command, a);
    return gramline::cli::run_export(request);
  }
  if (command == "ingest" || command == "resume") {
    std::vector<std::string> words = rest;
    const bool force = take_flag(words, "--force");
    const Arguments a = split_arguments(command, words, {"--out"});
    expect_positionals(command, a, 2, "the bundle and the counts file");
    const auto out = option(a, "--out");
    if (!out) {
      throw InputError("gramline-cli " + command + ": --out " +
                       (command == "ingest" ? "DIR" : "FILE.zip") + " is required");
    }
    if (command == "ingest") {
      return gramline::cli::run_ingest({a.positional[0], a.positional[1], *out, force});
    }
    return gramline::cli::run_resume({a.positional[0], a.positional[1], *out, force});
  }
  std::cerr << "gramline-cli: unknown command '" << command << "'\n\n" << kOverview;
  return 2;
}

}  // namespace

int main(int argc, char** argv) {
  try {
    return dispatch(std::vector<std::string>(argv + 1, argv + argc));
  } catch (const InputError& e) {
    std::cerr << e.what() << "\n";
    return 2;
  } catch (const std::exception& e) {
    std::cerr << "gramline-cli: internal failure: " << e.what() << "\n";
    return 1;
  } catch (...) {
    std::cerr << "gramline-cli: internal failure\n";
    return 1;
  }
}
