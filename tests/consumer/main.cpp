// Links the installed library and computes one number with it.
#include <cstdio>

#include <mudepth/attenuation.hpp>
#include <mudepth/formula.hpp>
#include <mudepth/radiation.hpp>

int main() {
    const auto cu = mudepth::radiation_from_source("Cu:Ka");
    const auto si = mudepth::material_from_formula(mudepth::parse_formula("Si"), 2.329);
    std::printf("consumer: Cu K-alpha %.4f keV, mu/rho(Si) = %.2f cm2/g\n", cu.energy_keV,
                mudepth::material_mass_attenuation(si, cu.energy_keV).total_cm2_g());
    return 0;
}
