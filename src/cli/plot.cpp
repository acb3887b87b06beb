// SVG line plots for --plot.
#include "cli/plot.hpp"

#include <algorithm>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <limits>
#include <sstream>

#include "mudepth/error.hpp"

namespace mudepth::cli {

namespace {

constexpr double kWidth = 800, kHeight = 500;
constexpr double kLeft = 90, kRight = 30, kTop = 50, kBottom = 70;
const char* const kColors[] = {"#1f5fa8", "#c0392b", "#2a8a3e", "#8e44ad", "#d68910", "#17808a", "#555555"};

std::string esc(const std::string& s) {
    std::string out;
    for (char c : s) {
        switch (c) {
            case '&': out += "&amp;"; break;
            case '<': out += "&lt;"; break;
            case '>': out += "&gt;"; break;
            case '"': out += "&quot;"; break;
            default: out += c;
        }
    }
    return out;
}

std::string num(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%.2f", v);
    return b;
}

std::string tick_text(double v) {
    char b[32];
    std::snprintf(b, sizeof b, "%g", std::abs(v) < 1e-12 ? 0.0 : v);
    return b;
}

/// One axis: data range, mapping to pixels and tick positions.
struct Axis {
    double lo, hi;
    bool log;
    double pixel_lo, pixel_hi;

    double map(double v) const {
        const double t = log ? (std::log10(v) - std::log10(lo)) / (std::log10(hi) - std::log10(lo))
                             : (v - lo) / (hi - lo);
        return pixel_lo + t * (pixel_hi - pixel_lo);
    }

    std::vector<double> ticks() const {
        std::vector<double> out;
        if (log) {
            for (double d = std::floor(std::log10(lo)); d <= std::ceil(std::log10(hi)); d += 1) {
                const double v = std::pow(10.0, d);
                if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push_back(v);
            }
            if (std::log10(hi / lo) < 3)  // few decades: add 2x and 5x
                for (double d = std::floor(std::log10(lo)); d <= std::ceil(std::log10(hi)); d += 1)
                    for (double m : {2.0, 5.0}) {
                        const double v = m * std::pow(10.0, d);
                        if (v >= lo && v <= hi) out.push_back(v);
                    }
            std::sort(out.begin(), out.end());
            return out;
        }
        const double raw = (hi - lo) / 6;
        const double mag = std::pow(10.0, std::floor(std::log10(raw)));
        double step = mag;
        for (double m : {1.0, 2.0, 2.5, 5.0, 10.0})
            if (m * mag >= raw) {
                step = m * mag;
                break;
            }
        for (double v = std::ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) out.push_back(v);
        return out;
    }
};

Axis make_axis(std::vector<double> values, bool log, bool round_out, double pixel_lo, double pixel_hi) {
    if (log) values.erase(std::remove_if(values.begin(), values.end(), [](double v) { return !(v > 0); }), values.end());
    values.erase(std::remove_if(values.begin(), values.end(), [](double v) { return !std::isfinite(v); }), values.end());
    double lo = values.empty() ? 0 : *std::min_element(values.begin(), values.end());
    double hi = values.empty() ? 1 : *std::max_element(values.begin(), values.end());
    if (log) {
        if (values.empty()) lo = 1, hi = 10;
        if (round_out) {  // to quarter decades
            // A little margin so a curve or level on a round value does not sit on the frame.
            lo = std::pow(10.0, std::floor((std::log10(lo) - 0.05) * 4) / 4);
            hi = std::pow(10.0, std::ceil((std::log10(hi) + 0.05) * 4) / 4);
        }
        if (hi <= lo) hi = lo * 10;
    } else {
        if (hi <= lo) {
            const double pad = lo == 0 ? 1 : std::abs(lo) * 0.1;
            lo -= pad;
            hi += pad;
        }
    }
    return {lo, hi, log, pixel_lo, pixel_hi};
}

}  // namespace

bool spans_decades(const std::vector<double>& values, double decades) {
    double lo = std::numeric_limits<double>::infinity(), hi = 0;
    for (double v : values)
        if (v > 0 && std::isfinite(v)) lo = std::min(lo, v), hi = std::max(hi, v);
    return hi > 0 && hi / lo > std::pow(10.0, decades);
}

std::string render_svg(const Plot& plot) {
    std::vector<double> xs, ys;
    for (const auto& s : plot.series) {
        xs.insert(xs.end(), s.x.begin(), s.x.end());
        ys.insert(ys.end(), s.y.begin(), s.y.end());
    }
    for (const auto& l : plot.levels) ys.push_back(l.y);
    const Axis ax = make_axis(xs, plot.x_log, false, kLeft, kWidth - kRight);
    const Axis ay = make_axis(ys, plot.y_log, true, kHeight - kBottom, kTop);
    std::ostringstream o;
    o << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
      << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << kWidth << "\" height=\"" << kHeight
      << "\" viewBox=\"0 0 " << kWidth << ' ' << kHeight << "\" font-family=\"DejaVu Sans, Arial, sans-serif\">\n"
      << "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n"
      << "<text x=\"" << kWidth / 2 << "\" y=\"28\" text-anchor=\"middle\" font-size=\"17\">" << esc(plot.title)
      << "</text>\n";
    // Grid and ticks.
    for (double t : ax.ticks()) {
        const double px = ax.map(t);
        o << "<line x1=\"" << num(px) << "\" y1=\"" << kTop << "\" x2=\"" << num(px) << "\" y2=\"" << kHeight - kBottom
          << "\" stroke=\"#e4e4e4\"/>\n<text x=\"" << num(px) << "\" y=\"" << kHeight - kBottom + 20
          << "\" text-anchor=\"middle\" font-size=\"13\">" << tick_text(t) << "</text>\n";
    }
    for (double t : ay.ticks()) {
        const double py = ay.map(t);
        o << "<line x1=\"" << kLeft << "\" y1=\"" << num(py) << "\" x2=\"" << kWidth - kRight << "\" y2=\"" << num(py)
          << "\" stroke=\"#e4e4e4\"/>\n<text x=\"" << kLeft - 8 << "\" y=\"" << num(py + 4)
          << "\" text-anchor=\"end\" font-size=\"13\">" << tick_text(t) << "</text>\n";
    }
    o << "<rect x=\"" << kLeft << "\" y=\"" << kTop << "\" width=\"" << kWidth - kLeft - kRight << "\" height=\""
      << kHeight - kTop - kBottom << "\" fill=\"none\" stroke=\"black\"/>\n";
    o << "<text x=\"" << (kLeft + kWidth - kRight) / 2 << "\" y=\"" << kHeight - 22
      << "\" text-anchor=\"middle\" font-size=\"15\">" << esc(plot.x_label) << "</text>\n";
    o << "<text transform=\"translate(24," << (kTop + kHeight - kBottom) / 2
      << ") rotate(-90)\" text-anchor=\"middle\" font-size=\"15\">" << esc(plot.y_label) << "</text>\n";
    // Markers and levels.
    int row = 0;
    for (const auto& m : plot.markers) {
        if (m.x < ax.lo || m.x > ax.hi || (ax.log && m.x <= 0)) continue;
        const double px = ax.map(m.x);
        const double label_y = kTop + 16 + 15 * (row++ % 3);  // stagger close labels
        o << "<line x1=\"" << num(px) << "\" y1=\"" << kTop << "\" x2=\"" << num(px) << "\" y2=\"" << kHeight - kBottom
          << "\" stroke=\"#888\" stroke-dasharray=\"5,4\"/>\n<text x=\"" << num(px + 4) << "\" y=\"" << label_y
          << "\" font-size=\"12\" fill=\"#444\">" << esc(m.label) << "</text>\n";
    }
    for (const auto& l : plot.levels) {
        const double py = ay.map(l.y);
        o << "<line x1=\"" << kLeft << "\" y1=\"" << num(py) << "\" x2=\"" << kWidth - kRight << "\" y2=\"" << num(py)
          << "\" stroke=\"#888\" stroke-dasharray=\"5,4\"/>\n<text x=\"" << kWidth - kRight - 6 << "\" y=\""
          << num(py - 6) << "\" text-anchor=\"end\" font-size=\"12\" fill=\"#444\">" << esc(l.label) << "</text>\n";
    }
    // Curves: split where a point cannot be drawn (non-finite, or ≤ 0 on a log axis).
    o << "<g fill=\"none\" stroke-width=\"2\" stroke-linejoin=\"round\">\n";
    for (std::size_t i = 0; i < plot.series.size(); ++i) {
        const auto& s = plot.series[i];
        const char* color = kColors[i % std::size(kColors)];
        std::string d;
        bool pen_down = false;
        for (std::size_t k = 0; k < s.x.size() && k < s.y.size(); ++k) {
            const bool ok = std::isfinite(s.x[k]) && std::isfinite(s.y[k]) && (!ax.log || s.x[k] > 0) &&
                            (!ay.log || s.y[k] > 0);
            if (!ok) {
                pen_down = false;
                continue;
            }
            d += pen_down ? 'L' : 'M';
            d.append(num(ax.map(s.x[k]))).append(",").append(num(ay.map(s.y[k]))).append(" ");
            pen_down = true;
        }
        o << "<path stroke=\"" << color << "\" d=\"" << d << "\"/>\n";
        if (s.x.size() <= 30)  // few points: mark them
            for (std::size_t k = 0; k < s.x.size() && k < s.y.size(); ++k)
                if (std::isfinite(s.x[k]) && std::isfinite(s.y[k]) && (!ax.log || s.x[k] > 0) && (!ay.log || s.y[k] > 0))
                    o << "<circle cx=\"" << num(ax.map(s.x[k])) << "\" cy=\"" << num(ay.map(s.y[k]))
                      << "\" r=\"3\" fill=\"" << color << "\"/>\n";
    }
    o << "</g>\n";
    // Legend: in the corner (or side middle) that hides the fewest curve points.
    if (plot.series.size() > 1 || (!plot.series.empty() && !plot.series[0].label.empty())) {
        std::size_t longest = 0;
        for (const auto& series : plot.series) longest = std::max(longest, series.label.size());
        const double box_w = 44 + 7.2 * static_cast<double>(longest);
        const double box_h = 18.0 * static_cast<double>(plot.series.size()) + 8;
        const double inner_left = kLeft + 8, inner_right = kWidth - kRight - 8 - box_w;
        const double inner_top = kTop + 30, inner_bottom = kHeight - kBottom - 8 - box_h;
        const double inner_middle = (inner_top + inner_bottom) / 2;
        const std::pair<double, double> corners[] = {{inner_right, inner_top},    {inner_left, inner_top},
                                                     {inner_right, inner_bottom}, {inner_left, inner_bottom},
                                                     {inner_right, inner_middle}, {inner_left, inner_middle}};
        auto drawable = [&](double x, double y) {
            return std::isfinite(x) && std::isfinite(y) && (!ax.log || x > 0) && (!ay.log || y > 0);
        };
        // Points of the drawn curves, with 8 samples along each segment.
        auto hidden = [&](double bx, double by) {
            std::size_t n = 0;
            auto inside = [&](double px, double py) { return px >= bx && px <= bx + box_w && py >= by && py <= by + box_h; };
            for (const auto& series : plot.series)
                for (std::size_t k = 0; k + 1 < series.x.size() && k + 1 < series.y.size(); ++k) {
                    if (!drawable(series.x[k], series.y[k]) || !drawable(series.x[k + 1], series.y[k + 1])) continue;
                    const double x0 = ax.map(series.x[k]), y0 = ay.map(series.y[k]);
                    const double x1 = ax.map(series.x[k + 1]), y1 = ay.map(series.y[k + 1]);
                    for (int j = 0; j < 8; ++j) n += inside(x0 + (x1 - x0) * j / 8.0, y0 + (y1 - y0) * j / 8.0);
                }
            return n;
        };
        auto best = corners[0];
        std::size_t fewest = hidden(best.first, best.second);
        for (const auto& c : corners) {
            const std::size_t n = hidden(c.first, c.second);
            if (n < fewest) fewest = n, best = c;
        }
        const auto [bx, by] = best;
        o << "<rect x=\"" << num(bx) << "\" y=\"" << num(by) << "\" width=\"" << num(box_w) << "\" height=\""
          << num(box_h) << "\" fill=\"white\" fill-opacity=\"0.85\" stroke=\"#bbbbbb\"/>\n";
        double y = by + 17;
        for (std::size_t i = 0; i < plot.series.size(); ++i, y += 18) {
            const double x = bx + 8;
            o << "<line x1=\"" << num(x) << "\" y1=\"" << num(y - 4) << "\" x2=\"" << num(x + 24) << "\" y2=\""
              << num(y - 4) << "\" stroke=\"" << kColors[i % std::size(kColors)] << "\" stroke-width=\"3\"/>\n<text x=\""
              << num(x + 30) << "\" y=\"" << num(y) << "\" font-size=\"13\">" << esc(plot.series[i].label) << "</text>\n";
        }
    }
    o << "</svg>\n";
    return o.str();
}

void write_svg(const Plot& plot, const std::string& path) {
    namespace fs = std::filesystem;
    const std::string text = render_svg(plot);
    const fs::path target(path);
    std::error_code status_error;
    if (fs::is_directory(target, status_error))
        throw FileError("cannot write plot '" + path + "': it is a directory; give a file name such as plot.svg");
    std::string tmp_name = target.filename().string();
    tmp_name.insert(0, 1, '.');
    tmp_name.append(".tmp");
    const fs::path tmp = target.parent_path() / tmp_name;
    {
        std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
        if (!out)
            throw FileError("cannot write plot '" + path + "': " +
                            (errno ? std::strerror(errno) : "the folder cannot be written"));
        out << text;
        out.flush();
        if (!out) {
            std::error_code ignored;
            fs::remove(tmp, ignored);
            throw FileError("cannot write plot '" + path + "'");
        }
    }
    std::error_code ec;
    fs::rename(tmp, target, ec);
    if (ec) {
        fs::remove(tmp, ec);
        throw FileError("cannot write plot '" + path + "': " + ec.message());
    }
}

}  // namespace mudepth::cli
