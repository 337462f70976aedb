#include "formats/counts_csv.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>
#include <sstream>

#include "formats/input_error.h"
#include "formats/text_io.h"

namespace gramline::formats {
namespace {

// Whole counts above 2^53 no longer read back exactly as doubles.
constexpr double kCountLimit = 9007199254740992.0;

std::vector<std::string_view> split_fields(std::string_view line) {
  std::vector<std::string_view> out;
  size_t begin = 0;
  while (true) {
    const size_t comma = line.find(',', begin);
    out.push_back(trim(line.substr(
        begin, comma == std::string_view::npos ? std::string_view::npos : comma - begin)));
    if (comma == std::string_view::npos) break;
    begin = comma + 1;
  }
  return out;
}

std::string quoted(std::string_view text) {
  // Keep messages readable even when the file holds binary junk.
  std::string out = "'";
  for (char c : text.substr(0, 40)) out += (static_cast<unsigned char>(c) < 32) ? '?' : c;
  if (text.size() > 40) out += "...";
  return out + "'";
}

/// Column roles, resolved from the header.
struct Columns {
  int step = -1, kind = -1, start = -1, end = -1;
  std::vector<int> channel;  // column of ch{k}
  std::vector<int> singles;  // column of singles{p}_per_s, or -1
  std::vector<std::string> names;
};

class Parser {
 public:
  Parser(std::string source, const CountsLayout& layout)
      : source_(std::move(source)), layout_(layout) {}

  [[noreturn]] void fail_at(int line, int column, const std::string& message) const {
    std::ostringstream o;
    o << source_ << ": line " << line;
    if (column > 0) {
      o << ", column " << column;
      if (column - 1 < static_cast<int>(columns_.names.size()))
        o << " (" << columns_.names[column - 1] << ")";
    }
    o << ": " << message;
    throw InputError(o.str());
  }

  void header(std::string_view text, int line) {
    const std::vector<std::string_view> fields = split_fields(text);
    columns_.channel.assign(static_cast<size_t>(std::max(layout_.channels, 0)), -1);
    columns_.singles.assign(static_cast<size_t>(std::max(layout_.photons, 0)), -1);
    std::map<std::string, int> seen;
    int channel_columns = 0, singles_columns = 0;
    for (size_t i = 0; i < fields.size(); ++i) {
      const std::string name(fields[i]);
      const int column = static_cast<int>(i) + 1;
      columns_.names.push_back(name);
      if (name.empty()) fail_at(line, column, "empty column name");
      if (!seen.emplace(name, column).second)
        fail_at(line, column, "column " + quoted(name) + " appears twice");
      if (name == "step") {
        columns_.step = column;
      } else if (name == "kind") {
        columns_.kind = column;
      } else if (name == "start_s") {
        columns_.start = column;
      } else if (name == "end_s") {
        columns_.end = column;
      } else if (auto k = numbered(name, "ch", "")) {
        ++channel_columns;
        if (*k >= layout_.channels)
          fail_at(line, column,
                  "wrong channel count: the rig's " + layout_.scheme_text + " detection with " +
                      std::to_string(layout_.photons) + " photon(s) has " +
                      std::to_string(layout_.channels) + " channel(s), ch0..ch" +
                      std::to_string(layout_.channels - 1));
        columns_.channel[static_cast<size_t>(*k)] = column;
      } else if (auto p = numbered(name, "singles", "_per_s")) {
        ++singles_columns;
        if (*p >= layout_.photons)
          fail_at(line, column,
                  "no photon " + std::to_string(*p) + " (the campaign has " +
                      std::to_string(layout_.photons) + " photon(s))");
        columns_.singles[static_cast<size_t>(*p)] = column;
      } else {
        fail_at(line, column, "unknown column " + quoted(name));
      }
    }
    if (columns_.step < 0) fail_at(line, 0, "the header has no 'step' column");
    if (columns_.kind < 0) fail_at(line, 0, "the header has no 'kind' column");
    if (columns_.start < 0) fail_at(line, 0, "the header has no 'start_s' column");
    if (columns_.end < 0) fail_at(line, 0, "the header has no 'end_s' column");
    if (channel_columns != layout_.channels) {
      fail_at(line, 0,
              "wrong channel count: the header has " + std::to_string(channel_columns) +
                  " channel column(s), the rig's " + layout_.scheme_text + " detection with " +
                  std::to_string(layout_.photons) + " photon(s) needs " +
                  std::to_string(layout_.channels) + " (ch0..ch" +
                  std::to_string(layout_.channels - 1) + ")");
    }
    if (singles_columns != 0 && singles_columns != layout_.photons)
      fail_at(line, 0,
              "singles columns must cover every photon (singles0_per_s..singles" +
                  std::to_string(layout_.photons - 1) + "_per_s) or none");
    has_singles_ = singles_columns > 0;
  }

  CountsRow row(std::string_view text, int line) const {
    const std::vector<std::string_view> f = split_fields(text);
    const int width = static_cast<int>(columns_.names.size());
    if (static_cast<int>(f.size()) != width) {
      fail_at(line, std::min(static_cast<int>(f.size()), width) + 1,
              "the row has " + std::to_string(f.size()) + " fields, the header " +
                  std::to_string(width));
    }
    auto field = [&](int column) { return f[static_cast<size_t>(column - 1)]; };
    CountsRow r;
    r.line = line;
    double step = 0.0;
    if (!parse_number(field(columns_.step), step) || !(step >= 0) || step > 2.0e9 ||
        step != std::floor(step))
      fail_at(line, columns_.step,
              quoted(field(columns_.step)) + " is not a step index (a whole number >= 0)");
    r.record.step = static_cast<int>(step);
    if (!from_string(std::string(field(columns_.kind)), r.kind))
      fail_at(line, columns_.kind,
              quoted(field(columns_.kind)) +
                  " is not one of 'measure', 'reference', 'dark', "
                  "'park'");
    r.record.start_s = time(field(columns_.start), line, columns_.start);
    r.record.end_s = time(field(columns_.end), line, columns_.end);
    if (!(r.record.end_s > r.record.start_s))
      fail_at(line, columns_.end,
              "end before start: the counting interval must end after it starts (start_s " +
                  std::string(field(columns_.start)) + ")");
    for (int column : columns_.channel) {
      double n = 0.0;
      const std::string_view t = field(column);
      if (!parse_number(t, n) || !std::isfinite(n))
        fail_at(line, column, quoted(t) + " is not a number");
      if (n < 0) fail_at(line, column, "negative count " + quoted(t));
      if (n != std::floor(n) || n > kCountLimit)
        fail_at(line, column, quoted(t) + " is not a whole count");
      r.record.channel_counts.push_back(n);
    }
    if (has_singles_) {
      int empty = 0;
      for (int column : columns_.singles) empty += field(column).empty() ? 1 : 0;
      if (empty != 0 && empty != static_cast<int>(columns_.singles.size())) {
        for (int column : columns_.singles)
          if (field(column).empty())
            fail_at(line, column, "a singles rate is missing (give all or none on a row)");
      }
      if (empty == 0) {
        for (int column : columns_.singles) {
          double s = 0.0;
          const std::string_view t = field(column);
          if (!parse_number(t, s) || !std::isfinite(s))
            fail_at(line, column, quoted(t) + " is not a number");
          if (s < 0) fail_at(line, column, "negative singles rate " + quoted(t));
          r.record.singles_per_s.push_back(s);
        }
      }
    }
    return r;
  }

  bool has_singles() const { return has_singles_; }

 private:
  double time(std::string_view t, int line, int column) const {
    double x = 0.0;
    if (!parse_number(t, x) || !std::isfinite(x))
      fail_at(line, column, quoted(t) + " is not a time in seconds");
    return x;
  }

  /// k for `prefix k suffix` with k a plain decimal number without leading zeros.
  static std::optional<int> numbered(const std::string& name, const std::string& prefix,
                                     const std::string& suffix) {
    if (name.size() <= prefix.size() + suffix.size() || name.rfind(prefix, 0) != 0 ||
        name.compare(name.size() - suffix.size(), suffix.size(), suffix) != 0)
      return std::nullopt;
    const std::string digits =
        name.substr(prefix.size(), name.size() - prefix.size() - suffix.size());
    if (digits.size() > 6 || (digits.size() > 1 && digits[0] == '0')) return std::nullopt;
    if (!std::all_of(digits.begin(), digits.end(), [](char c) { return c >= '0' && c <= '9'; }))
      return std::nullopt;
    return std::stoi(digits);
  }

  std::string source_;
  CountsLayout layout_;
  Columns columns_;
  bool has_singles_ = false;
};

}  // namespace

CountsLayout counts_layout(const Campaign& campaign) {
  CountsLayout l;
  l.photons = campaign.encoding.photon_count();
  l.channels = channel_count(campaign.rig.scheme, l.photons);
  l.scheme_text = to_string(campaign.rig.scheme);
  return l;
}

CountsFile parse_counts_csv(const std::string& text, const std::string& source,
                            const CountsLayout& layout) {
  if (layout.channels < 1 || layout.photons < 1 || layout.channels > 4096)
    throw InputError(source + ": the campaign's detection layout is not usable for counts");
  CountsFile out;
  out.source = source;
  Parser parser(source, layout);
  bool have_header = false;
  int line = 0;
  size_t begin = 0;
  while (begin < text.size()) {
    size_t end = text.find('\n', begin);
    if (end == std::string::npos) end = text.size();
    std::string_view l(text.data() + begin, end - begin);
    begin = end + 1;
    ++line;
    if (!l.empty() && l.back() == '\r') l.remove_suffix(1);
    if (line == 1 && l.size() >= 3 && l.substr(0, 3) == "\xEF\xBB\xBF") l.remove_prefix(3);
    if (trim(l).empty()) continue;
    if (trim(l).front() == '#') {
      const std::string_view mark(kSimulatedMark);
      const std::string_view t = trim(l);
      if (!have_header && t.substr(0, mark.size()) == mark) {
        const std::string_view note = trim(t.substr(mark.size()));
        out.simulated_note = note.empty() ? std::string("no details") : std::string(note);
      }
      continue;
    }
    if (!have_header) {
      parser.header(l, line);
      have_header = true;
      continue;
    }
    out.rows.push_back(parser.row(l, line));
  }
  if (!have_header) throw InputError(source + ": no header row (the file is empty)");
  out.has_singles_columns = parser.has_singles();
  return out;
}

CountsFile read_counts_csv(const QString& path, const CountsLayout& layout) {
  return parse_counts_csv(read_whole_file(path), path_text(path), layout);
}

CountsCheck check_counts(const CountsFile& counts, const std::vector<Step>& steps) {
  CountsCheck out;
  std::map<int, int> first_line;  // step -> line of its first row
  auto where = [&](const CountsRow& r) {
    return counts.source + ": line " + std::to_string(r.line) + ", column 1 (step): step " +
           std::to_string(r.record.step);
  };
  for (const CountsRow& r : counts.rows) {
    const int s = r.record.step;
    if (s < 0 || s >= static_cast<int>(steps.size())) {
      out.extra.push_back(
          {r.line, s,
           where(r) + " is not in the plan (it has " + std::to_string(steps.size()) + " steps)"});
      continue;
    }
    const Step& planned = steps[static_cast<size_t>(s)];
    if (planned.kind != r.kind) {
      out.kind_mismatch.push_back({r.line, s,
                                   counts.source + ": line " + std::to_string(r.line) +
                                       ", column 2 (kind): step " + std::to_string(s) + " is a '" +
                                       to_string(planned.kind) + "' step in the plan, not '" +
                                       to_string(r.kind) + "'"});
      continue;
    }
    if (planned.kind == StepKind::park) {
      out.extra.push_back({r.line, s, where(r) + " is a park step, which counts nothing"});
      continue;
    }
    const auto [it, fresh] = first_line.emplace(s, r.line);
    if (!fresh) {
      out.duplicated.push_back(
          {r.line, s, where(r) + " was already counted on line " + std::to_string(it->second)});
      continue;
    }
    out.records.push_back(r.record);
  }
  for (size_t k = 0; k < steps.size(); ++k) {
    const StepKind kind = steps[k].kind;
    if ((kind == StepKind::measure || kind == StepKind::reference) &&
        !first_line.count(static_cast<int>(k)))
      out.missing.push_back(static_cast<int>(k));
  }
  return out;
}

std::string CountsCheck::report() const {
  std::ostringstream o;
  for (const auto* list : {&extra, &duplicated, &kind_mismatch})
    for (const Problem& p : *list) o << p.message << "\n";
  o << extra.size() << " extra, " << duplicated.size() << " duplicated, " << kind_mismatch.size()
    << " kind-mismatched row(s); " << missing.size() << " step(s) to count have no row";
  if (!missing.empty()) {
    o << ":";
    const size_t shown = std::min<size_t>(missing.size(), 20);
    for (size_t i = 0; i < shown; ++i) o << " " << missing[i];
    if (shown < missing.size()) o << " ...";
  }
  o << "\n";
  return o.str();
}

std::string simulated_counts_text(const std::string& simulated_note) {
  return simulated_note.empty() ? std::string() : "simulated counts (" + simulated_note + ")";
}

std::string format_counts_csv(const std::vector<StepRecord>& records,
                              const std::vector<Step>& steps, const CountsLayout& layout,
                              const std::string& simulated_note) {
  const bool singles = std::any_of(records.begin(), records.end(),
                                   [](const StepRecord& r) { return !r.singles_per_s.empty(); });
  std::string out;
  if (!simulated_note.empty()) out += std::string(kSimulatedMark) + " " + simulated_note + "\n";
  out += "step,kind,start_s,end_s";
  for (int k = 0; k < layout.channels; ++k) out += ",ch" + std::to_string(k);
  if (singles)
    for (int p = 0; p < layout.photons; ++p) out += ",singles" + std::to_string(p) + "_per_s";
  out += "\n";
  for (const StepRecord& r : records) {
    const bool known = r.step >= 0 && r.step < static_cast<int>(steps.size());
    out += std::to_string(r.step) + "," +
           (known ? to_string(steps[static_cast<size_t>(r.step)].kind) : std::string("measure")) +
           "," + exact_number_text(r.start_s) + "," + exact_number_text(r.end_s);
    for (double n : r.channel_counts) out += "," + exact_number_text(n);
    if (singles) {
      for (int p = 0; p < layout.photons; ++p) {
        out += ",";
        if (p < static_cast<int>(r.singles_per_s.size()))
          out += exact_number_text(r.singles_per_s[static_cast<size_t>(p)]);
      }
    }
    out += "\n";
  }
  return out;
}

}  // namespace gramline::formats
