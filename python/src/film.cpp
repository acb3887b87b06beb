// Bindings: each layer's share of the diffracted signal of a film stack, and the
// substrate's attenuation, over arrays of 2θ (and incidence), as `mudepth film`.
#include <vector>

#include <pybind11/stl.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/film.hpp"

namespace mudepth::python {

void bind_film(py::module_& m) {
    m.def(
        "film_shares",
        [](const std::vector<std::pair<DepthSample, double>>& layers, const DepthSample& substrate,
           const py::object& two_theta_deg, const py::object& incidence_deg) {
            FilmStack stack;
            for (const auto& [sample, thickness_cm] : layers) stack.layers.push_back({sample, thickness_cm});
            stack.substrate = substrate;
            const bool fixed = !incidence_deg.is_none();
            const Inputs in = broadcast_inputs({{two_theta_deg, "two_theta_deg"}, {or_zero(incidence_deg), "incidence_deg"}});
            const std::size_t L = stack.layers.size();
            std::vector<py::ssize_t> layer_shape = in.shape;
            layer_shape.push_back(static_cast<py::ssize_t>(L));
            py::array_t<double> inc(in.shape), exit(in.shape), sub(in.shape), att(in.shape), shares(layer_shape);
            double *pi = inc.mutable_data(), *pe = exit.mutable_data(), *ps = sub.mutable_data(),
                   *pa = att.mutable_data(), *pl = shares.mutable_data();
            const double *tt = in.arrays[0].data(), *ai = in.arrays[1].data();
            {
                py::gil_scoped_release release;
                for (std::size_t i = 0; i < in.size; ++i) {
                    const BeamAngles b = fixed ? fixed_incidence_angles(tt[i], ai[i]) : symmetric_angles(tt[i]);
                    const FilmShares s = film_shares(stack, b);
                    pi[i] = b.incidence_deg;
                    pe[i] = b.exit_deg;
                    ps[i] = s.substrate_share;
                    pa[i] = s.substrate_attenuation;
                    for (std::size_t j = 0; j < L; ++j) pl[i * L + j] = s.layer_shares[j];
                }
            }
            py::dict d;
            d["incidence_deg"] = wrap_output(inc, in.scalar);
            d["exit_deg"] = wrap_output(exit, in.scalar);
            d["layer_shares"] = std::move(shares);
            d["substrate_share"] = wrap_output(sub, in.scalar);
            d["substrate_attenuation"] = wrap_output(att, in.scalar);
            return d;
        },
        py::arg("layers"), py::arg("substrate"), py::arg("two_theta_deg"), py::kw_only(),
        py::arg("incidence_deg") = py::none(),
        "Shares of the diffracted signal of a film stack, as `mudepth film`: layers is a list of\n"
        "(DepthSample, thickness_cm) from the top down, on an infinitely thick substrate (a DepthSample;\n"
        "see depth_sample()). Symmetric reflection, or fixed incidence with incidence_deg (degrees,\n"
        "broadcast with two_theta_deg). Dict: 'incidence_deg', 'exit_deg', 'layer_shares' (shape + (layers,)),\n"
        "'substrate_share' and 'substrate_attenuation' (exp(−Σ t_j/Λ_j), in and out).");
}

}  // namespace mudepth::python
