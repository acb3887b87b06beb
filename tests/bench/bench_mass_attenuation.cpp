// μ/ρ of a five-element compound at 10^6 energies between 5 and 100 keV,
// mudepth against xraylib's CS_Total_CP on the same energies, in one run.
#include <xraylib/xraylib.h>

#include <chrono>
#include <cstdio>
#include <vector>

#include "timing.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/energy_grid.hpp"
#include "mudepth/formula.hpp"

namespace {

using mudepth::bench::seconds;

}  // namespace

int main() {
    constexpr std::size_t kPoints = 1'000'000;
    const char* five = "CaMgSi2O6H2";  // Ca, Mg, Si, O, H (a hydrated pyroxene-like formula)
    const auto energies = mudepth::energy_grid_keV(5.0, 100.0, kPoints, mudepth::GridSpacing::linear);
    const auto material = mudepth::material_from_formula(mudepth::parse_formula(five), 3.0);

    double sum_ours = 0, sum_xrl = 0;
    const double t_ours = seconds([&] {
        for (double e : energies) sum_ours += mudepth::material_mass_attenuation(material, e).total_cm2_g();
    });
    const double t_xrl = seconds([&] {
        for (double e : energies) sum_xrl += CS_Total_CP(five, e, nullptr);
    });
    std::printf("mu/rho of %s at %zu energies, 5-100 keV\n", five, kPoints);
    std::printf("  mudepth (Elam splines): %.3f s  (%.1f ns per energy)\n", t_ours, t_ours / kPoints * 1e9);
    std::printf("  xraylib CS_Total_CP:    %.3f s  (%.1f ns per energy)\n", t_xrl, t_xrl / kPoints * 1e9);
    std::printf("  ratio xraylib/mudepth:  %.2f\n", t_xrl / t_ours);
    std::printf("  mean mu/rho: mudepth %.6g, xraylib %.6g cm2/g\n", sum_ours / kPoints, sum_xrl / kPoints);
    return 0;
}
