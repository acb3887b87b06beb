// Conversion of Python numbers, lists and NumPy arrays to float64 buffers and
// the C++ loops the vectorised bindings run in (no per-element Python calls).
#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <span>
#include <string>
#include <utility>
#include <vector>

#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>

namespace mudepth::python {

namespace py = pybind11;

/// A C-contiguous float64 array (pybind11 copies when the input is strided or not float64).
using Doubles = py::array_t<double, py::array::c_style | py::array::forcecast>;

/// A float, an int, a list of numbers or a NumPy array of integers or floats as a
/// contiguous float64 array. Refuses anything else with TypeError naming `name`.
Doubles to_doubles(py::handle value, const char* name);

/// Several inputs broadcast to one shape (NumPy rules), each contiguous float64.
struct Inputs {
    std::vector<Doubles> arrays;
    std::vector<py::ssize_t> shape;
    std::size_t size = 0;
    bool scalar = false;  ///< every input was a scalar: return Python floats
};

Inputs broadcast_inputs(const std::vector<std::pair<py::handle, const char*>>& values);

/// A new float64 array of that shape, or (scalar) the float it holds.
py::object wrap_output(py::array_t<double>& out, bool scalar);

/// Runs f(in, out) for every element of the broadcast inputs, in C++ with the GIL released.
/// in: std::array<double, N> of the inputs at that element; out: std::array<double, M>.
template <std::size_t M, std::size_t N, class F>
std::array<py::object, M> map_elements(const std::array<std::pair<py::handle, const char*>, N>& values, F&& f) {
    const Inputs in = broadcast_inputs(std::vector<std::pair<py::handle, const char*>>(values.begin(), values.end()));
    std::array<py::array_t<double>, M> outs;
    std::array<double*, M> out_ptr{};
    for (std::size_t k = 0; k < M; ++k) {
        outs[k] = py::array_t<double>(in.shape);
        out_ptr[k] = outs[k].mutable_data();
    }
    std::array<const double*, N> in_ptr{};
    for (std::size_t k = 0; k < N; ++k) in_ptr[k] = in.arrays[k].data();
    {
        py::gil_scoped_release release;
        std::array<double, N> x{};
        std::array<double, M> y{};
        for (std::size_t i = 0; i < in.size; ++i) {
            for (std::size_t k = 0; k < N; ++k) x[k] = in_ptr[k][i];
            f(x, y);
            for (std::size_t k = 0; k < M; ++k) out_ptr[k][i] = y[k];
        }
    }
    std::array<py::object, M> result;
    for (std::size_t k = 0; k < M; ++k) result[k] = wrap_output(outs[k], in.scalar);
    return result;
}

/// One output: f(in) returns the value.
template <std::size_t N, class F>
py::object map_one(const std::array<std::pair<py::handle, const char*>, N>& values, F&& f) {
    return map_elements<1>(values, [&](const std::array<double, N>& x, std::array<double, 1>& y) { y[0] = f(x); })[0];
}

/// A dict from names to the outputs of map_elements.
template <std::size_t M>
py::dict to_dict(const std::array<const char*, M>& names, const std::array<py::object, M>& values) {
    py::dict d;
    for (std::size_t k = 0; k < M; ++k) d[names[k]] = values[k];
    return d;
}

/// The elements of one input as a span over its float64 buffer (for the library's span
/// overloads), with its shape.
struct Flat {
    Doubles array;
    std::span<const double> values;
    std::vector<py::ssize_t> shape;
    bool scalar = false;
};
Flat flatten(py::handle value, const char* name);

/// Reshapes a vector of results to `shape` (a float when scalar).
py::object from_vector(const std::vector<double>& values, const std::vector<py::ssize_t>& shape, bool scalar);

/// Placeholder for an absent optional array argument (its value is never read).
inline py::handle or_zero(const py::object& value) {
    static const py::handle zero = py::float_(0.0).release();  // never freed: outlives the interpreter
    return value.is_none() ? zero : value;
}

}  // namespace mudepth::python
