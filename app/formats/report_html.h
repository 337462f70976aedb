#pragma once
// The printable summary of a planned campaign: one self-contained HTML page with the summary
// figures, a timeline of the nights and maps of the predicted Gram error as inline SVG, and the
// safety cautions. No scripts, no external files.
#include <Eigen/Core>
#include <string>

#include "gramline/campaign.h"
#include "gramline/plan.h"

namespace gramline::formats {

/// Largest side of a heatmap in cells; bigger matrices are averaged over square blocks.
inline constexpr int kHeatmapMaxCells = 200;

/// What a resumed bundle's page says about the bundles before it (docs/plan-files.md).
struct ResumeSummary {
  std::string parent_file;    ///< the bundle it continues
  int measured_entries = 0;   ///< kernel entries measured by earlier bundles
  int remaining_entries = 0;  ///< entries this bundle plans
  int measured_steps = 0;     ///< counted steps kept
  int nights_used = 0;        ///< nights the earlier bundles used
  /// Frobenius norm of the per-entry sigma of the whole training Gram matrix: measured entries
  /// with the sigma of their counts, the rest with the sigma this plan predicts.
  double gram_sigma_frobenius_whole = 0.0;
};

/// The whole page; `resume` adds the section of a resumed bundle.
std::string format_summary_html(const Campaign& campaign, const Plan& plan,
                                const ResumeSummary* resume = nullptr);

/// The cautions shown in the page (plain text paragraphs separated by blank lines).
std::string safety_cautions_text();

/// Heatmap of `values` as an SVG element, `max_cells` cells per side at most (block means).
/// NaN entries are drawn grey and left out of the means.
std::string heatmap_svg(const Eigen::MatrixXd& values, const std::string& title,
                        int max_cells = kHeatmapMaxCells);

/// Timeline of the steps, one band per night, coloured by kind, as an SVG element.
std::string timeline_svg(const Plan& plan, double night_length_s);

/// `text` with &, <, >, " and ' escaped.
std::string html_escape(const std::string& text);

}  // namespace gramline::formats
