// One bind_<concept> per library concept; module.cpp calls them all.
#pragma once

#include <pybind11/pybind11.h>

namespace mudepth::python {

namespace py = pybind11;

void bind_material(py::module_& m);     // formulas, materials, mixtures, compositions, elements
void bind_radiation(py::module_& m);    // energies, wavelengths, anode lines
void bind_attenuation(py::module_& m);  // μ/ρ and parts, μ, δ, β, critical angle, edges
void bind_depth(py::module_& m);        // depth probed in every reflection geometry, inverse, shift
void bind_film(py::module_& m);         // layer shares of a film stack
void bind_plate(py::module_& m);        // flat-plate factors
void bind_cylinder(py::module_& m);     // capillary and container factors
void bind_specimen(py::module_& m);     // capillaries and plates with μR, μt, wall, windows
void bind_filter(py::module_& m);       // Kβ filter foils
void bind_plan(py::module_& m);         // sample planning
void bind_correct(py::module_& m);      // correcting arrays and pattern files

/// An element given as a symbol ('Fe') or an atomic number; ValueError "unknown element 'X'".
int atomic_number_of(const py::object& element_or_Z);

}  // namespace mudepth::python
