#include "formats/compare_json.h"

#include <QJsonDocument>
#include <QJsonObject>
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <vector>

namespace gramline::formats {

namespace {

QJsonObject side(const std::string& name, const Plan& plan,
                 const std::vector<ComparedFigure>& figures, bool first) {
  QJsonObject o{{"name", QString::fromStdString(name)}, {"fits", plan.summary.fits}};
  for (const ComparedFigure& f : figures)
    o.insert(QString::fromStdString(f.key), first ? f.a : f.b);
  return o;
}

/// A figure as a table cell: times in hours and minutes beside the seconds, counts whole.
std::string cell(double value, const std::string& unit, bool signed_value) {
  char text[64];
  const char* sign = signed_value && value > 0 ? "+" : "";
  if (unit == "s") {
    const double magnitude = std::abs(value);
    const long minutes = std::lround(magnitude / 60.0);
    std::snprintf(text, sizeof text, "%s%s%ld h %02ld min", sign, value < 0 ? "-" : "",
                  minutes / 60, minutes % 60);
  } else if (std::abs(value) >= 100.0 || value == std::round(value)) {
    std::snprintf(text, sizeof text, "%s%.0f", sign, value);
  } else {
    std::snprintf(text, sizeof text, "%s%.4g", sign, value);
  }
  return text;
}

std::string padded(const std::string& text, std::size_t width, bool right) {
  if (text.size() >= width) return text;
  const std::string pad(width - text.size(), ' ');
  return right ? pad + text : text + pad;
}

}  // namespace

std::string format_compare_json(const std::string& name_a, const Plan& a, const std::string& name_b,
                                const Plan& b) {
  const std::vector<ComparedFigure> figures = compare_plans(a, b);
  QJsonObject difference;
  for (const ComparedFigure& f : figures)
    difference.insert(QString::fromStdString(f.key), f.difference());
  const QJsonObject root{{"format", "gramline-comparison"},
                         {"version", 1},
                         {"a", side(name_a, a, figures, true)},
                         {"b", side(name_b, b, figures, false)},
                         {"difference", difference}};
  const QByteArray bytes = QJsonDocument(root).toJson(QJsonDocument::Indented);
  return std::string(bytes.constData(), static_cast<std::size_t>(bytes.size()));
}

std::string format_compare_table(const std::string& name_a, const Plan& a,
                                 const std::string& name_b, const Plan& b) {
  const std::vector<ComparedFigure> figures = compare_plans(a, b);
  std::vector<std::vector<std::string>> rows;
  rows.push_back({"", "A", "B", "B - A"});
  for (const ComparedFigure& f : figures)
    rows.push_back({f.label, cell(f.a, f.unit, false), cell(f.b, f.unit, false),
                    cell(f.difference(), f.unit, true)});
  rows.push_back({"fits its nights", a.summary.fits ? "yes" : "no", b.summary.fits ? "yes" : "no",
                  a.summary.fits == b.summary.fits ? "same" : "changed"});
  std::vector<std::size_t> width(4, 0);
  for (const auto& r : rows)
    for (std::size_t c = 0; c < 4; ++c) width[c] = std::max(width[c], r[c].size());
  std::string out = "A: " + name_a + "\nB: " + name_b + "\n\n";
  for (const auto& r : rows) {
    out += padded(r[0], width[0], false);
    for (std::size_t c = 1; c < 4; ++c) out += "  " + padded(r[c], width[c], true);
    out += "\n";
  }
  return out;
}

}  // namespace gramline::formats
