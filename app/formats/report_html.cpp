#include "formats/report_html.h"

#include <algorithm>
#include <cmath>
#include <iomanip>
#include <map>
#include <sstream>

#include "formats/cautions_text.h"
#include "formats/palette.h"

namespace gramline::formats {
namespace {

std::string fixed(double value, int digits) {
  std::ostringstream o;
  o << std::fixed << std::setprecision(digits) << value;
  return o.str();
}

std::string general(double value) {
  std::ostringstream o;
  o << std::setprecision(4) << value;
  return o.str();
}

// Larger values darker, on Gramline's ramp (docs/palette.md).
std::string ramp_colour(double t) { return palette::ramp(t).hex(); }

std::string kind_colour(StepKind k) {
  switch (k) {
    case StepKind::measure:
      return palette::counting.hex();
    case StepKind::reference:
      return palette::reference.hex();
    case StepKind::dark:
      return palette::dark.hex();
    case StepKind::park:
      return palette::park.hex();
  }
  return "#000000";
}

std::string hours(double s) { return fixed(s / 3600.0, 2) + " h"; }

}  // namespace

std::string html_escape(const std::string& text) {
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    switch (c) {
      case '&':
        out += "&amp;";
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '"':
        out += "&quot;";
        break;
      case '\'':
        out += "&#39;";
        break;
      default:
        out += c;
    }
  }
  return out;
}

std::string safety_cautions_text() {
  // The one text of the cautions (cautions_text.cpp), a paragraph per line.
  std::string out;
  for (const CautionSection& section : caution_sections()) {
    if (!out.empty()) out += "\n\n";
    out += section.heading;
    for (const char* p : section.paragraphs) out += std::string("\n\n") + p;
  }
  return out;
}

std::string heatmap_svg(const Eigen::MatrixXd& values, const std::string& title, int max_cells) {
  const long rows = values.rows(), cols = values.cols();
  std::ostringstream o;
  if (rows == 0 || cols == 0) {
    o << "<p>" << html_escape(title) << ": no entries.</p>\n";
    return o.str();
  }
  max_cells = std::max(max_cells, 1);
  const long block = std::max<long>(1, (std::max(rows, cols) + max_cells - 1) / max_cells);
  const long gr = (rows + block - 1) / block, gc = (cols + block - 1) / block;
  Eigen::MatrixXd cell = Eigen::MatrixXd::Constant(gr, gc, std::nan(""));
  double lo = INFINITY, hi = -INFINITY;
  for (long i = 0; i < gr; ++i) {
    for (long j = 0; j < gc; ++j) {
      double sum = 0.0;
      long n = 0;
      for (long a = i * block; a < std::min(rows, (i + 1) * block); ++a)
        for (long b = j * block; b < std::min(cols, (j + 1) * block); ++b)
          if (std::isfinite(values(a, b))) {
            sum += values(a, b);
            ++n;
          }
      if (n > 0) {
        cell(i, j) = sum / static_cast<double>(n);
        lo = std::min(lo, cell(i, j));
        hi = std::max(hi, cell(i, j));
      }
    }
  }
  if (!std::isfinite(lo)) lo = hi = 0.0;
  const double size_px = 420.0;
  const double px = size_px / static_cast<double>(std::max(gr, gc));
  const double w = px * static_cast<double>(gc), h = px * static_cast<double>(gr);
  o << "<figure><svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << fixed(w + 90, 0)
    << "\" height=\"" << fixed(h + 10, 0) << "\" role=\"img\" aria-label=\"" << html_escape(title)
    << "\">\n";
  for (long i = 0; i < gr; ++i) {
    for (long j = 0; j < gc; ++j) {
      const double v = cell(i, j);
      const std::string colour =
          std::isfinite(v) ? ramp_colour(hi > lo ? (v - lo) / (hi - lo) : 0.0) : "#cccccc";
      o << "<rect x=\"" << fixed(static_cast<double>(j) * px, 2) << "\" y=\""
        << fixed(static_cast<double>(i) * px, 2) << "\" width=\"" << fixed(px + 0.02, 2)
        << "\" height=\"" << fixed(px + 0.02, 2) << "\" fill=\"" << colour << "\"/>\n";
    }
  }
  // Colour key: top is the largest value.
  for (int k = 0; k < 20; ++k) {
    o << "<rect x=\"" << fixed(w + 10, 1) << "\" y=\"" << fixed(h * k / 20.0, 2)
      << "\" width=\"14\" height=\"" << fixed(h / 20.0 + 0.02, 2) << "\" fill=\""
      << ramp_colour(1.0 - k / 19.0) << "\"/>\n";
  }
  o << "<text x=\"" << fixed(w + 28, 1) << "\" y=\"10\" font-size=\"10\">" << general(hi)
    << "</text>\n<text x=\"" << fixed(w + 28, 1) << "\" y=\"" << fixed(h, 1)
    << "\" font-size=\"10\">" << general(lo) << "</text>\n</svg><figcaption>" << html_escape(title)
    << " (" << rows << " x " << cols;
  if (block > 1) o << "; each cell is the mean of a " << block << " x " << block << " block";
  o << "; grey: not planned)</figcaption></figure>\n";
  return o.str();
}

std::string timeline_svg(const Plan& plan, double night_length_s) {
  int nights = 1;
  for (const Step& s : plan.steps) nights = std::max(nights, s.night);
  std::map<int, double> origin;  // first start_s of each night
  for (const Step& s : plan.steps) {
    auto [it, fresh] = origin.emplace(s.night, s.start_s);
    if (!fresh) it->second = std::min(it->second, s.start_s);
  }
  double span = night_length_s > 0 ? night_length_s : 1.0;
  for (const Step& s : plan.steps)
    span = std::max(span, s.start_s + s.move_s + s.dwell_s - origin[s.night]);
  const double width = 760.0, band = 26.0, left = 70.0;
  const double scale = width / span;
  std::ostringstream o;
  o << "<figure><svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << fixed(left + width + 10, 0)
    << "\" height=\"" << fixed(band * nights + 40, 0)
    << "\" role=\"img\" aria-label=\"timeline of the nights\">\n";
  // Neighbouring steps of one kind that touch on screen are drawn as one bar.
  for (int night = 1; night <= nights; ++night) {
    const double y = 4 + band * (night - 1);
    o << "<text x=\"0\" y=\"" << fixed(y + 16, 1) << "\" font-size=\"11\">night " << night
      << "</text>\n";
    bool open = false;
    StepKind kind = StepKind::measure;
    double x0 = 0, x1 = 0;
    auto flush = [&] {
      if (!open) return;
      o << "<rect x=\"" << fixed(left + x0, 2) << "\" y=\"" << fixed(y, 1) << "\" width=\""
        << fixed(std::max(x1 - x0, 0.5), 2) << "\" height=\"20\" fill=\"" << kind_colour(kind)
        << "\"/>\n";
      open = false;
    };
    for (const Step& s : plan.steps) {
      if (s.night != night) continue;
      const double a = (s.start_s - origin[night]) * scale;
      const double b = (s.start_s + s.move_s + s.dwell_s - origin[night]) * scale;
      if (open && s.kind == kind && a <= x1 + 0.5) {
        x1 = std::max(x1, b);
        continue;
      }
      flush();
      open = true;
      kind = s.kind;
      x0 = a;
      x1 = b;
    }
    flush();
  }
  const double ky = band * nights + 20;
  double kx = left;
  for (StepKind k : {StepKind::measure, StepKind::reference, StepKind::dark, StepKind::park}) {
    o << "<rect x=\"" << fixed(kx, 1) << "\" y=\"" << fixed(ky - 9, 1)
      << "\" width=\"10\" height=\"10\" fill=\"" << kind_colour(k) << "\"/><text x=\""
      << fixed(kx + 14, 1) << "\" y=\"" << fixed(ky, 1) << "\" font-size=\"11\">" << to_string(k)
      << "</text>\n";
    kx += 100;
  }
  o << "<text x=\"" << fixed(left + width - 120, 1) << "\" y=\"" << fixed(ky, 1)
    << "\" font-size=\"11\">full width " << hours(span) << "</text>\n";
  o << "</svg><figcaption>Timeline: each band is one night from its first step; moves and "
       "counting of neighbouring steps of one kind merge into one bar.</figcaption></figure>\n";
  return o.str();
}

std::string format_summary_html(const Campaign& campaign, const Plan& plan,
                                const ResumeSummary* resume) {
  const PlanSummary& s = plan.summary;
  std::ostringstream o;
  o << "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n<title>"
    << html_escape(campaign.name) << " - Gramline plan summary</title>\n"
    << "<style>body{font-family:sans-serif;max-width:60em;margin:2em auto;color:#222}"
       "table{border-collapse:collapse}td,th{border-bottom:1px solid #ccc;padding:2px 10px;"
       "text-align:left}td.n{text-align:right}.caution{border:2px solid "
    << palette::alert.hex()
    << ";padding:0.5em 1em;background:#fbf3ec}@media print{figure{break-inside:avoid}}</style>\n"
       "</head><body>\n";
  o << "<h1>" << html_escape(campaign.name) << "</h1>\n";
  if (!campaign.notes.empty()) o << "<p>" << html_escape(campaign.notes) << "</p>\n";
  o << "<p>Gramline " << GRAMLINE_VERSION << ", seed " << campaign.seed << ". "
    << campaign.data.train_count() << " training and " << campaign.data.test_count()
    << " test points on " << campaign.encoding.photon_count() << " photon(s); detection "
    << to_string(campaign.rig.scheme) << ". First night " << html_escape(campaign.nights.first_date)
    << ".</p>\n";
  if (resume) {
    o << "<h2>Resumed campaign</h2>\n<p>This bundle resumes " << html_escape(resume->parent_file)
      << ": " << resume->measured_entries << " kernel entries were measured in "
      << resume->measured_steps << " counted steps over " << resume->nights_used
      << " night(s); this plan measures the " << resume->remaining_entries
      << " entries that remain. Gram error of the whole training matrix, measured and planned "
         "entries together (Frobenius sigma): "
      << general(resume->gram_sigma_frobenius_whole) << ".</p>\n";
  }
  o << "<h2>Summary</h2>\n<table>\n";
  auto row = [&](const std::string& name, const std::string& value) {
    o << "<tr><th>" << html_escape(name) << "</th><td class=\"n\">" << html_escape(value)
      << "</td></tr>\n";
  };
  row("measure steps (settings)", std::to_string(s.settings));
  row("steps in all", std::to_string(s.steps));
  row("pairs in all", fixed(s.pairs_total / 1e6, 3) + " million");
  row("counting (measure steps)", hours(s.integration_s));
  row("moving", hours(s.move_s));
  row("reference, dark and park steps", hours(s.reference_s));
  row("end of the last step", hours(s.total_s));
  row("nights", std::to_string(s.nights) + (s.fits ? "" : " (does not fit the nights allowed)"));
  row("measure moves / proven lower bound",
      fixed(s.measure_move_s, 1) + " s / " + fixed(s.move_lower_bound_s, 1) + " s");
  row("row-by-row order would move", fixed(s.move_naive_s, 1) + " s");
  row("worst entry half-width", general(s.epsilon_reached));
  row("plate bias, largest entry / Frobenius",
      general(s.kernel_bias_max) + " / " + general(s.kernel_bias_frobenius) +
          (s.plate_bias_exceeds_target()
               ? " (above the target precision: more pairs will not help; calibrate the plates)"
               : ""));
  row("plate spread from offsets, largest entry / Frobenius",
      general(s.kernel_spread_max) + " / " + general(s.kernel_spread_frobenius));
  row("Gram error, Frobenius sigma", general(s.gram_sigma_frobenius));
  row("Gram error, largest entry sigma", general(plan.gram_error.sigma_max));
  row("P(negative eigenvalue)", general(plan.gram_error.p_negative_eigenvalue));
  o << "</table>\n";
  if (!s.night_use.empty()) {
    o << "<h3>Nights</h3>\n<table><tr><th>night</th><th>busy</th><th>moving</th>"
         "<th>counting</th><th>references</th><th>fill</th></tr>\n";
    for (const NightUse& n : s.night_use) {
      o << "<tr><td>" << n.night << "</td><td class=\"n\">" << hours(n.busy_s)
        << "</td><td class=\"n\">" << hours(n.move_s) << "</td><td class=\"n\">"
        << hours(n.integration_s) << "</td><td class=\"n\">" << hours(n.reference_s)
        << "</td><td class=\"n\">" << fixed(100.0 * n.fill(), 1) << " %</td></tr>\n";
    }
    o << "</table>\n";
  }
  o << "<h2>Timeline</h2>\n" << timeline_svg(plan, campaign.nights.length_s());
  o << "<h2>Predicted Gram error</h2>\n<p>Standard deviation of each kernel entry's estimate "
       "at its planned pairs.</p>\n";
  o << heatmap_svg(plan.sigma_train, "training Gram matrix, predicted sigma per entry");
  o << heatmap_svg(plan.sigma_test, "test block, predicted sigma per entry");
  o << "<h2>Cautions</h2>\n<div class=\"caution\">\n";
  std::string text = safety_cautions_text();
  size_t begin = 0;
  while (begin < text.size()) {
    size_t end = text.find("\n\n", begin);
    if (end == std::string::npos) end = text.size();
    o << "<p>" << html_escape(text.substr(begin, end - begin)) << "</p>\n";
    begin = end + 2;
  }
  o << "</div>\n</body></html>\n";
  return o.str();
}

}  // namespace gramline::formats
