// SVG line plots for the command line's --plot option: axes with units, ticks
// (linear or logarithmic), several labelled curves, and marked x positions.
#pragma once

#include <string>
#include <vector>

namespace mudepth::cli {

struct PlotSeries {
    std::string label;
    std::vector<double> x;
    std::vector<double> y;
};

/// A vertical marker line at x with a label (an absorption edge, a target).
struct PlotMarker {
    double x;
    std::string label;
};

/// A horizontal reference line at y with a label.
struct PlotLevel {
    double y;
    std::string label;
};

struct Plot {
    std::string title;
    std::string x_label;  ///< with its unit, e.g. "energy (keV)"
    std::string y_label;
    bool x_log = false;
    bool y_log = false;
    std::vector<PlotSeries> series;
    std::vector<PlotMarker> markers;
    std::vector<PlotLevel> levels;
};

/// True when positive values span more than `decades` decades (pick a log axis).
bool spans_decades(const std::vector<double>& values, double decades = 2.0);

/// The plot as a complete SVG document.
std::string render_svg(const Plot& plot);

/// Writes the SVG atomically (temporary file, then rename); throws FileError.
void write_svg(const Plot& plot, const std::string& path);

}  // namespace mudepth::cli
