// Absorption edges near an energy, and fluorescence warnings.
#include "mudepth/edges.hpp"

#include <algorithm>

#include "format.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {

namespace {

std::vector<NearbyEdge> edges_in(const Material& material, double low_keV, double high_keV) {
    std::vector<NearbyEdge> out;
    for (const auto& share : material.elements)
        for (const auto& e : edges(share.Z))
            if (e.energy_keV >= low_keV && e.energy_keV <= high_keV)
                out.push_back({share.Z, share.label, std::string(e.level), e.energy_keV});
    std::sort(out.begin(), out.end(),
              [](const NearbyEdge& a, const NearbyEdge& b) { return a.energy_keV < b.energy_keV; });
    // D and H share their edges: keep one entry per (Z, level).
    out.erase(std::unique(out.begin(), out.end(),
                          [](const NearbyEdge& a, const NearbyEdge& b) {
                              return a.Z == b.Z && a.level == b.level;
                          }),
              out.end());
    return out;
}

/// The strongest emission line filling a hole in `level`, or nullptr.
const LineInfo* strongest_line(int Z, std::string_view level) {
    const LineInfo* best = nullptr;
    for (const auto& l : lines(Z))
        if (l.initial_level == level && (!best || l.relative_intensity > best->relative_intensity))
            best = &l;
    return best;
}

/// An edge whose fluorescence would be seen: edge below the incident energy,
/// its strongest line energetic enough to reach the detector.
struct Fluorescing {
    const EdgeInfo* edge;
    const LineInfo* line;
};

std::vector<Fluorescing> detectable_edges(int Z) {
    std::vector<Fluorescing> out;
    for (std::string_view level : {"K", "L3"}) {
        const EdgeInfo* e = find_edge(Z, level);
        const LineInfo* l = strongest_line(Z, level);
        if (e && l && l->energy_keV >= kDetectableFluorescence_keV) out.push_back({e, l});
    }
    return out;
}

/// Standard anodes whose Kα1 lies below every detectable edge of element Z.
std::vector<std::string> avoiding_sources(int Z) {
    double lowest_edge_keV = 1e300;
    for (const auto& f : detectable_edges(Z)) lowest_edge_keV = std::min(lowest_edge_keV, f.edge->energy_keV);
    std::vector<std::string> out;
    for (std::string_view symbol : standard_anode_symbols()) {
        const double ka1_keV =
            energy_keV_from_wavelength_A(line_wavelength_A(find_anode(symbol), AnodeLine::Ka1));
        if (ka1_keV < lowest_edge_keV) out.emplace_back(symbol);
    }
    return out;
}

}  // namespace

std::vector<NearbyEdge> edges_near(const Material& material, double energy_keV, double below_keV,
                                   double above_keV) {
    return edges_in(material, std::max(kMinEnergy_keV, energy_keV - below_keV), energy_keV + above_keV);
}

std::vector<NearbyEdge> edges_between(const Material& material, double from_keV, double to_keV) {
    return edges_in(material, std::min(from_keV, to_keV), std::max(from_keV, to_keV));
}

std::vector<FluorescenceWarning> fluorescence_warnings(const Material& material, double energy_keV) {
    std::vector<FluorescenceWarning> out;
    std::vector<int> seen;
    for (const auto& share : material.elements) {
        if (std::find(seen.begin(), seen.end(), share.Z) != seen.end()) continue;
        seen.push_back(share.Z);
        // One warning per element: K when it is excited, otherwise L3.
        for (const auto& f : detectable_edges(share.Z)) {
            if (f.edge->energy_keV > energy_keV) continue;  // at the edge energy it is excited
            FluorescenceWarning w{share.Z, std::string(element(share.Z).symbol), std::string(f.edge->level),
                                  f.edge->energy_keV, std::string(f.line->iupac),
                                  std::string(f.line->siegbahn), f.line->energy_keV,
                                  avoiding_sources(share.Z), {}};
            w.message = w.label + " " + w.edge_level + " edge (" + format_number(w.edge_keV, 5) +
                        " keV) lies below the incident energy (" + format_number(energy_keV, 6) +
                        " keV): " + w.label + " fluoresces, " + w.line_iupac + " (" +
                        w.line_siegbahn + ") at " + format_number(w.line_keV, 5) +
                        " keV raises the background";
            if (w.avoiding_sources.empty()) {
                w.message += "; no standard anode's Ka1 lies below this edge";
            } else {
                w.message += "; anodes whose Ka1 lies below the edge: ";
                for (std::size_t i = 0; i < w.avoiding_sources.size(); ++i)
                    w.message += (i ? ", " : "") + w.avoiding_sources[i];
            }
            out.push_back(std::move(w));
            break;
        }
    }
    return out;
}

}  // namespace mudepth
