// Bindings: capillary absorption factors and the Paalman-Pings container factors
// over arrays of 2θ, as `mudepth cylinder`; the container subtraction.
#include <string>
#include <vector>

#include <pybind11/stl.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/cylinder.hpp"

namespace mudepth::python {

void bind_cylinder(py::module_& m) {
    m.attr("MAX_CYLINDER_MU_R") = kMaxCylinderMuR;
    m.def(
        "cylinder_transmission",
        [](double mu_R, const py::object& two_theta_deg) {
            const Flat tt = flatten(two_theta_deg, "two_theta_deg");
            std::vector<double> a;
            {
                py::gil_scoped_release release;
                a = cylinder_transmission(mu_R, tt.values);
            }
            return from_vector(a, tt.shape, tt.scalar);
        },
        py::arg("mu_R"), py::arg("two_theta_deg"),
        "Absorption factor A of a uniformly bathed cylinder (capillary) in the equatorial plane\n"
        "(ITC C §6.3.3): mu_R = μ × sample radius (0 < μR <= 30), 2θ in degrees (0..180). The correction\n"
        "is A* = 1/A. Long arrays go through the library's interpolant in cos 2θ (agrees with direct\n"
        "values to 1e-10).");
    m.def(
        "container_factors",
        [](double mu_R_sample, double mu_R_container, double radius_ratio, const py::object& two_theta_deg) {
            const Flat tt = flatten(two_theta_deg, "two_theta_deg");
            std::vector<ContainerFactors> f;
            {
                py::gil_scoped_release release;
                f = container_factors(mu_R_sample, mu_R_container, radius_ratio, tt.values);
            }
            std::vector<double> s_s, s_sc, c_sc, c_c;
            for (const auto& x : f) {
                s_s.push_back(x.A_s_s);
                s_sc.push_back(x.A_s_sc);
                c_sc.push_back(x.A_c_sc);
                c_c.push_back(x.A_c_c);
            }
            py::dict d;
            d["A_s_s"] = from_vector(s_s, tt.shape, tt.scalar);
            d["A_s_sc"] = from_vector(s_sc, tt.shape, tt.scalar);
            d["A_c_sc"] = from_vector(c_sc, tt.shape, tt.scalar);
            d["A_c_c"] = from_vector(c_c, tt.shape, tt.scalar);
            return d;
        },
        py::arg("mu_R_sample"), py::arg("mu_R_container"), py::arg("radius_ratio"), py::arg("two_theta_deg"),
        "Paalman & Pings (1962) factors of a sample of radius R in a tube of outer radius radius_ratio·R:\n"
        "mu_R_container is the WALL's μ times the SAMPLE radius. Dict of arrays 'A_s_s', 'A_s_sc', 'A_c_sc',\n"
        "'A_c_c' (A_i,jk: scattering in i, attenuated in j and k; s sample, c container).");
    m.def(
        "container_corrected_intensity",
        [](const py::dict& factors, const py::object& intensity_sample_in_container,
           const py::object& intensity_empty_container) {
            using P = std::pair<py::handle, const char*>;
            std::array<py::object, 4> f;
            const char* names[] = {"A_s_s", "A_s_sc", "A_c_sc", "A_c_c"};
            for (std::size_t k = 0; k < 4; ++k) {
                if (!factors.contains(names[k]))
                    throw py::key_error(std::string("factors: missing '") + names[k] + "' (pass container_factors(...))");
                f[k] = factors[names[k]];
            }
            return map_one<6>(std::array<P, 6>{{{f[0], "A_s_s"}, {f[1], "A_s_sc"}, {f[2], "A_c_sc"}, {f[3], "A_c_c"},
                                                {intensity_sample_in_container, "intensity_sample_in_container"},
                                                {intensity_empty_container, "intensity_empty_container"}}},
                              [](const std::array<double, 6>& x) {
                                  return container_corrected_intensity({x[0], x[1], x[2], x[3]}, x[4], x[5]);
                              });
        },
        py::arg("factors"), py::arg("intensity_sample_in_container"), py::arg("intensity_empty_container"),
        "Container subtraction (Paalman & Pings 1962): I_s = [I_sc − (A_c,sc/A_c,c) I_c] / A_s,sc from the\n"
        "dict container_factors() returns and the intensities of the sample in its container and of the\n"
        "empty container at the same angles (arrays broadcast).");
}

}  // namespace mudepth::python
