// gramline-cli: the command-line twin of the Gramline app (commands in README.md, "Command
// line"). Each command's words are read by a QCommandLineParser that knows only that command's
// options; the help text is written here so that its layout stays ours.
#include <QCommandLineOption>
#include <QCommandLineParser>
#include <QString>
#include <QStringList>
#include <algorithm>
#include <charconv>
#include <cmath>
#include <exception>
#include <iostream>
#include <optional>
#include <stdexcept>
#include <string>
#include <vector>

#include "cli/commands.h"
#include "formats/file_set.h"
#include "formats/input_error.h"
#include "formats/limits.h"

namespace {

using gramline::formats::InputError;
using gramline::formats::SystemError;

/// One option of a command: its name without dashes, the value it takes (empty for a flag) and
/// its lines in the help text.
struct OptionEntry {
  const char* name;
  const char* value_name;
  const char* help;
};

const OptionEntry kOptions[] = {
    {"data", "CSV",
     "  --data CSV   replace the campaign's points: a header row, numeric feature columns, a\n"
     "               'label' column with two classes (-1/+1, or two names: the first one met is\n"
     "               +1) and an optional 'set' column (train or test; default train); with\n"
     "               another number of features the rig and its photons stay and the\n"
     "               features are spread over them\n"},
    {"seed", "N", "  --seed N     seed of the random choices (default: the campaign's seed)\n"},
    {"trials", "N", "  --trials N   simulated repetitions of the margin check\n"},
    {"fade-per-hour", "F",
     "  --fade-per-hour F\n"
     "               (simulate) the pair rate falls by the fraction F (0 <= F < 1) per hour of\n"
     "               the plan's clock, as a drifting source would (default 0)\n"},
    {"stop-after-hours", "H",
     "  --stop-after-hours H\n"
     "               (simulate) the night ends H hours after the first step starts, as an\n"
     "               interruption would; later steps get no counts (default: no stop)\n"},
    {"out", "PATH",
     "  --out        output file (demo, check, export, resume, simulate,\n"
     "               compare) or directory (plan, ingest)\n"},
    {"photons", "P",
     "  --photons P  photons of the new campaign, 1 to 4 (default: the rig file's, else 2)\n"},
    {"encoding", "PRESET",
     "  --encoding PRESET\n"
     "               linear (one feature per photon), polar-azimuth (two per photon) or\n"
     "               spread (any number over the photons); default by features and photons\n"},
    {"rig", "RIG", "  --rig RIG    a rig file to build the campaign on\n"},
    {"first-night", "YYYY-MM-DD",
     "  --first-night YYYY-MM-DD\n"
     "               date of the resumed bundle's first night (default: the day after the\n"
     "               last night counted)\n"},
    {"force", "",
     "  --force      replace existing output files (otherwise they are left untouched)\n"},
    {"lab-key", "FILE",
     "  --lab-key FILE\n"
     "               a file holding the lab's secret key (at least 16 bytes): export and resume\n"
     "               sign their bundle with it; ingest and resume accept only a bundle signed\n"
     "               with it\n"},
};

const char* const kVersionHelp = "  --version    print the version\n";

const OptionEntry& option_entry(const std::string& name) {
  for (const OptionEntry& o : kOptions) {
    if (name == o.name) return o;
  }
  throw std::logic_error("gramline-cli: no option named " + name);
}

/// One command: its usage line, what it does (lines without their indent), the options it
/// accepts and what its --out names.
struct CommandEntry {
  const char* name;
  const char* usage;
  const char* about;
  std::vector<std::string> options;
  const char* out_help;
};

const std::vector<CommandEntry>& commands() {
  static const std::vector<CommandEntry> table = {
      {"demo",
       "demo --out FILE [--seed N] [--force]",
       "Write the bundled demo campaign (48 training and 16 test points, a two-photon rig of\n"
       "eight motors) to FILE.\n",
       {"out", "seed", "force"},
       "the campaign file to write"},
      {"new",
       "new --data CSV --out CAMPAIGN [--photons P] [--encoding PRESET] [--rig RIG] [--force]",
       "Write a campaign for your own data: an encoding for any number of features on 1 to 4\n"
       "photons and a rig of four motors and one detector per photon (or the rig file).\n",
       {"data", "out", "photons", "encoding", "rig", "force"},
       "the campaign file to write"},
      {"plan",
       "plan CAMPAIGN [--data CSV] [--out DIR] [--seed N] [--force]",
       "Plan the campaign: settings, their order, pairs and dwell times, nights. Prints a\n"
       "short summary; with --out writes steps.json, steps.csv, summary.json and kernel.csv\n"
       "into DIR (created if needed).\n",
       {"data", "out", "seed", "force"},
       "the folder for the four plan files (created if needed)"},
      {"check",
       "check CAMPAIGN [--data CSV] [--trials N] [--seed N] [--out FILE] [--force]",
       "Margin check of the planned precision; writes the verdict as JSON to FILE and the\n"
       "report to standard output, or without --out the JSON to standard output and the\n"
       "report to standard error.\n",
       {"data", "out", "seed", "trials", "force"},
       "the file for the check JSON (without it: standard output)"},
      {"export",
       "export CAMPAIGN --out FILE.zip [--data CSV] [--seed N] [--force] [--lab-key FILE]",
       "Plan the campaign and write the hand-off bundle for the rig: steps, campaign, data,\n"
       "summary, printable summary.html and a manifest with the SHA-256 of every file.\n",
       {"data", "out", "seed", "force", "lab-key"},
       "the bundle (a zip file) to write"},
      {"ingest",
       "ingest BUNDLE COUNTS --out DIR [--force] [--lab-key FILE]",
       "Check the bundle and the rig's counts file against each other, build the measured\n"
       "Gram matrix, compare it with the prediction, track drift, train the classifier.\n",
       {"out", "force", "lab-key"},
       "the folder for the results (created if needed)"},
      {"resume",
       "resume BUNDLE COUNTS --out FILE.zip [--first-night YYYY-MM-DD] [--force] [--lab-key FILE]",
       "Keep what the counts file measured and plan the rest from where the motors stopped;\n"
       "the new bundle names its parent.\n",
       {"out", "first-night", "force", "lab-key"},
       "the new bundle (a zip file) to write"},
      {"simulate",
       "simulate BUNDLE --out COUNTS [--seed N] [--fade-per-hour F] [--stop-after-hours H]\n"
       "           [--force]",
       "Rehearse the night without the rig: draw the counts a rig following the bundle's\n"
       "steps would record from the rig model and write them as a counts file marked as\n"
       "simulated, ready for ingest or resume. The seed defaults to the bundle's.\n",
       {"out", "seed", "fade-per-hour", "stop-after-hours", "force"},
       "the counts file to write"},
      {"compare",
       "compare A B [--out FILE] [--force]",
       "Plan two campaigns and set their figures side by side: nights, calendar span, busy,\n"
       "move and counting time, worst kernel half-width, Gram error, pairs. The table goes to\n"
       "standard output; with --out the comparison is also written as JSON (a, b, difference).\n",
       {"out", "force"},
       "the file for the comparison JSON"},
  };
  return table;
}

const CommandEntry* find_command(const std::string& name) {
  for (const CommandEntry& c : commands()) {
    if (name == c.name) return &c;
  }
  return nullptr;
}

const char* const kExitStatusHelp =
    "Exit status: 0 success, 2 bad input (the message names the file and line or field),\n"
    "1 internal failure, 3 (plan, export, resume) files written but the plan does not fit\n"
    "the nights allowed.\n";

const char* const kProgressHelp =
    "Long work (planning, the margin check, ingest) shows its progress on standard error when\n"
    "that is a terminal.\n";

/// `text` with every line indented by six spaces.
std::string indented(const std::string& text) {
  std::string out;
  bool line_start = true;
  for (char ch : text) {
    if (line_start) out += "      ";
    out += ch;
    line_start = ch == '\n';
  }
  return out;
}

/// The text of `gramline-cli help`: every command and every option.
std::string overview() {
  std::string text =
      "gramline-cli: plans polarization-encoded quantum-kernel measurements with photon pairs.\n"
      "\n"
      "Commands:\n";
  for (const CommandEntry& c : commands()) {
    text += std::string("  ") + c.usage + "\n" + indented(c.about);
  }
  text += "  help [COMMAND]\n" + indented("This text; with COMMAND, that command's help only.\n");
  text += "\nOptions:\n";
  for (const OptionEntry& o : kOptions) text += o.help;
  text += kVersionHelp;
  text += "\n";
  text += kExitStatusHelp;
  text += "\n";
  text += kProgressHelp;
  return text;
}

/// The text of `gramline-cli help COMMAND` and `gramline-cli COMMAND --help`.
std::string command_help(const CommandEntry& c) {
  std::string text = std::string("Usage: gramline-cli ") + c.usage + "\n\n" + indented(c.about);
  text += "\nOptions:\n";
  for (const std::string& name : c.options) {
    text += name == "out" ? std::string("  --out        ") + c.out_help + "\n"
                          : option_entry(name).help;
  }
  text += "  --help       print this help\n";
  text += "\n";
  text += kExitStatusHelp;
  return text;
}

/// A finite decimal number in [low, high] (high_open: below high) for a command's option.
double real_number(const std::string& command, const std::string& option, const std::string& text,
                   double low, double high, bool high_open, const char* what) {
  double value = 0.0;
  const char* end = text.data() + text.size();
  const auto result = std::from_chars(text.data(), end, value);
  if (text.empty() || result.ec != std::errc() || result.ptr != end || !std::isfinite(value) ||
      value < low || value > high || (high_open && value == high)) {
    throw InputError("gramline-cli " + command + ": option " + option + ": '" + text + "' is not " +
                     what);
  }
  return value;
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

/// whole_number no larger than `high`, the limit named in the message (docs/limits.md).
template <class T>
T bounded_number(const std::string& command, const std::string& option, const std::string& text,
                 T low, T high) {
  const T value = whole_number<T>(command, option, text, low);
  if (value > high) {
    throw InputError("gramline-cli " + command + ": option " + option + ": " + text +
                     " is more than the limit of " + std::to_string(high) + " (docs/limits.md)");
  }
  return value;
}

/// The words after a command, read against that command's options.
class CommandLine {
 public:
  /// Parses `words` for `command`. Throws InputError naming the option for an unknown option,
  /// a missing value, a value given to a flag, or a value option given twice.
  CommandLine(const CommandEntry& command, const QStringList& words) : command_(command.name) {
    parser_.addOption(QCommandLineOption({"h", "help"}, "help"));
    for (const std::string& name : command.options) {
      const OptionEntry& o = option_entry(name);
      parser_.addOption(
          QCommandLineOption(QString(o.name), QString(o.help), QString(o.value_name)));
    }
    // The parser skips the first word as the program's name.
    const bool parsed = parser_.parse(QStringList{"gramline-cli"} + words);
    help_ = parser_.isSet("help") || (!parsed && asks_for_help(words));
    if (help_) return;
    if (!parsed) throw InputError(parse_error(words));
    const QStringList given = parser_.optionNames();
    for (const std::string& name : command.options) {
      const QString q = QString::fromStdString(name);
      // A flag said twice says the same thing; a value said twice is ambiguous.
      if (*option_entry(name).value_name && given.count(q) > 1) {
        throw InputError(prefix() + "option --" + name + " is given twice");
      }
    }
  }

  bool wants_help() const { return help_; }

  std::optional<std::string> value(const char* name) const {
    if (!parser_.isSet(name)) return std::nullopt;
    return parser_.value(name).toStdString();
  }

  std::string required(const char* name, const char* value_name) const {
    auto v = value(name);
    if (!v) throw InputError(prefix() + "--" + name + " " + value_name + " is required");
    return *v;
  }

  bool flag(const char* name) const { return parser_.isSet(name); }

  std::optional<std::uint64_t> seed() const {
    if (auto text = value("seed")) return whole_number<std::uint64_t>(command_, "--seed", *text, 0);
    return std::nullopt;
  }

  /// The positional words; exactly `count` of them, else InputError saying what is missing.
  std::vector<std::string> positional(size_t count, const char* what) const {
    const QStringList words = parser_.positionalArguments();
    if (static_cast<size_t>(words.size()) < count) {
      throw InputError(prefix() + "missing " + what + " (see gramline-cli help " + command_ + ")");
    }
    if (static_cast<size_t>(words.size()) > count) {
      throw InputError(prefix() + "unexpected argument '" +
                       words[static_cast<qsizetype>(count)].toStdString() + "'");
    }
    std::vector<std::string> out;
    for (const QString& w : words) out.push_back(w.toStdString());
    return out;
  }

 private:
  std::string prefix() const { return "gramline-cli " + command_ + ": "; }

  static bool asks_for_help(const QStringList& words) {
    for (const QString& w : words) {
      if (w == "--") return false;
      if (w == "--help" || w == "-h") return true;
    }
    return false;
  }

  std::string parse_error(const QStringList& words) const {
    const QStringList unknown = parser_.unknownOptionNames();
    if (!unknown.isEmpty()) {
      const QString name = (unknown.front().size() > 1 ? "--" : "-") + unknown.front();
      return prefix() + "unknown option '" + name.toStdString() + "' (see gramline-cli help " +
             command_ + ")";
    }
    // The parser stops at a value option that ends the line, or at a flag given a value.
    const QString last = words.isEmpty() ? QString() : words.back();
    for (const OptionEntry& o : kOptions) {
      const QString option = QString("--") + o.name;
      if (*o.value_name && last == option) {
        return prefix() + "option " + option.toStdString() + " needs a value";
      }
      const bool flag_with_value =
          !*o.value_name && std::any_of(words.begin(), words.end(), [&](const QString& w) {
            return w.startsWith(option + "=");
          });
      if (flag_with_value) return prefix() + "option " + option.toStdString() + " takes no value";
    }
    return prefix() + parser_.errorText().toStdString();
  }

  std::string command_;
  QCommandLineParser parser_;
  bool help_ = false;
};

int dispatch(const QStringList& argv) {
  if (argv.isEmpty()) {
    std::cerr << overview();
    return 2;
  }
  const std::string name = argv.front().toStdString();
  const QStringList rest = argv.mid(1);
  if (name == "help" && !rest.isEmpty()) {
    if (rest.size() > 1) {
      throw InputError("gramline-cli help: unexpected argument '" + rest[1].toStdString() + "'");
    }
    const std::string topic = rest.front().toStdString();
    if (topic == "help") {
      std::cout << overview();
      return 0;
    }
    const CommandEntry* command = find_command(topic);
    if (!command) {
      std::string names;
      for (const CommandEntry& c : commands())
        names += (names.empty() ? "" : ", ") + std::string(c.name);
      throw InputError("gramline-cli help: unknown command '" + topic + "' (commands: " + names +
                       ")");
    }
    std::cout << command_help(*command);
    return 0;
  }
  if (name == "help" || name == "--help" || name == "-h") {
    std::cout << overview();
    return 0;
  }
  if (name == "--version") {
    std::cout << "gramline-cli " << GRAMLINE_VERSION << "\n";
    return 0;
  }
  const CommandEntry* command = find_command(name);
  if (!command) {
    std::cerr << "gramline-cli: unknown command '" << name << "'\n\n" << overview();
    return 2;
  }
  const CommandLine line(*command, rest);
  if (line.wants_help()) {
    std::cout << command_help(*command);
    return 0;
  }
  if (name == "demo") {
    line.positional(0, "");
    gramline::cli::DemoRequest request;
    request.out_path = line.required("out", "FILE");
    request.seed = line.seed();
    request.force = line.flag("force");
    return gramline::cli::run_demo(request);
  }
  if (name == "new") {
    line.positional(0, "");
    gramline::cli::NewRequest request;
    request.data_path = line.required("data", "CSV");
    request.out_path = line.required("out", "CAMPAIGN");
    if (auto photons = line.value("photons")) {
      request.photons = whole_number<int>(name, "--photons", *photons, 1);
      if (*request.photons > 4)
        throw InputError("gramline-cli new: option --photons: " + *photons +
                         " photons; 1 to 4 are supported");
    }
    request.preset = line.value("encoding");
    if (request.preset) gramline::cli::preset_from_word(*request.preset);
    request.rig_path = line.value("rig");
    request.force = line.flag("force");
    return gramline::cli::run_new(request);
  }
  if (name == "plan") {
    gramline::cli::PlanRequest request;
    request.campaign_path = line.positional(1, "the campaign file")[0];
    request.data_path = line.value("data");
    request.out_dir = line.value("out");
    request.seed = line.seed();
    request.force = line.flag("force");
    return gramline::cli::run_plan(request);
  }
  if (name == "check") {
    gramline::cli::CheckRequest request;
    request.campaign_path = line.positional(1, "the campaign file")[0];
    request.data_path = line.value("data");
    request.out_path = line.value("out");
    if (auto trials = line.value("trials")) {
      request.trials = bounded_number<int>(name, "--trials", *trials, 1,
                                           static_cast<int>(gramline::formats::limits::kTrials));
    }
    request.seed = line.seed();
    request.force = line.flag("force");
    return gramline::cli::run_check(request);
  }
  if (name == "export") {
    gramline::cli::ExportRequest request;
    request.force = line.flag("force");
    request.campaign_path = line.positional(1, "the campaign file")[0];
    request.data_path = line.value("data");
    request.out_path = line.required("out", "FILE.zip");
    request.seed = line.seed();
    request.lab_key_path = line.value("lab-key");
    return gramline::cli::run_export(request);
  }
  if (name == "simulate") {
    gramline::cli::SimulateRequest request;
    request.bundle_path = line.positional(1, "the bundle")[0];
    request.out_path = line.required("out", "COUNTS");
    request.seed = line.seed();
    if (auto f = line.value("fade-per-hour"))
      request.fade_per_hour = real_number(name, "--fade-per-hour", *f, 0.0, 1.0, true,
                                          "a fraction of at least 0 and below 1");
    if (auto h = line.value("stop-after-hours"))
      request.stop_after_hours =
          real_number(name, "--stop-after-hours", *h, 0.0, 1e6, false, "a number of hours >= 0");
    request.force = line.flag("force");
    return gramline::cli::run_simulate(request);
  }
  if (name == "compare") {
    const std::vector<std::string> files = line.positional(2, "the two campaign files");
    gramline::cli::CompareRequest request;
    request.path_a = files[0];
    request.path_b = files[1];
    request.out_path = line.value("out");
    request.force = line.flag("force");
    return gramline::cli::run_compare(request);
  }
  // ingest and resume: a bundle and a counts file in.
  const std::vector<std::string> inputs = line.positional(2, "the bundle and the counts file");
  const bool force = line.flag("force");
  const std::optional<std::string> lab_key = line.value("lab-key");
  if (name == "ingest") {
    return gramline::cli::run_ingest(
        {inputs[0], inputs[1], line.required("out", "DIR"), force, lab_key});
  }
  gramline::cli::ResumeRequest resume{inputs[0], inputs[1], line.required("out", "FILE.zip"), force,
                                      line.value("first-night"), lab_key};
  return gramline::cli::run_resume(resume);
}

}  // namespace

int main(int argc, char** argv) {
  // A save cut short by Ctrl-C or a kill leaves no temporary file behind.
  gramline::formats::remove_temporaries_on_signals();
  try {
    QStringList words;
    // File names pass through as UTF-8, as the formats read them.
    for (int i = 1; i < argc; ++i) words << QString::fromUtf8(argv[i]);
    return dispatch(words);
  } catch (const InputError& e) {
    std::cerr << e.what() << "\n";
    return 2;
  } catch (const SystemError& e) {
    std::cerr << "gramline-cli: " << e.what() << "\n";
    return 1;
  } catch (const std::exception& e) {
    std::cerr << "gramline-cli: internal failure: "
              << gramline::formats::printable_message(e.what()) << "\n";
    return 1;
  } catch (...) {
    std::cerr << "gramline-cli: internal failure\n";
    return 1;
  }
}
