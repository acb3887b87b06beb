// Number and array conversion for the bindings.
#include "arrays.hpp"

#include <algorithm>
#include <cstring>

namespace mudepth::python {

namespace {

py::module_ numpy() { return py::module_::import("numpy"); }

[[noreturn]] void refuse(const char* name, const std::string& what) {
    throw py::type_error(std::string(name) +
                         ": expected numbers (a float, a list of numbers or a NumPy array of integers or floats), got " +
                         what);
}

}  // namespace

Doubles to_doubles(py::handle value, const char* name) {
    if (value.is_none()) refuse(name, "None");
    if (PyBool_Check(value.ptr())) refuse(name, "a bool");
    if (py::isinstance<py::str>(value) || py::isinstance<py::bytes>(value))
        refuse(name, "the text " + py::repr(value).cast<std::string>());
    py::array array;
    if (py::isinstance<py::array>(value)) {
        array = py::reinterpret_borrow<py::array>(value);
    } else {
        try {
            array = numpy().attr("asarray")(value);
        } catch (py::error_already_set& e) {
            refuse(name, std::string(py::str(py::type::of(value).attr("__name__"))) + " (" + e.what() + ")");
        }
    }
    const char kind = array.dtype().kind();
    if (kind != 'f' && kind != 'i' && kind != 'u')
        refuse(name, "an array of dtype " + py::str(array.dtype()).cast<std::string>());
    return Doubles::ensure(array);
}

Inputs broadcast_inputs(const std::vector<std::pair<py::handle, const char*>>& values) {
    Inputs in;
    std::vector<Doubles> converted;
    converted.reserve(values.size());
    bool all_scalar = true;
    bool same_shape = true;
    for (const auto& [value, name] : values) {
        converted.push_back(to_doubles(value, name));
        all_scalar = all_scalar && converted.back().ndim() == 0;
        const auto& first = converted.front();
        const auto& last = converted.back();
        same_shape = same_shape && first.ndim() == last.ndim() &&
                     std::equal(first.shape(), first.shape() + first.ndim(), last.shape());
    }
    in.scalar = all_scalar;
    if (same_shape) {
        in.arrays = std::move(converted);
    } else {
        py::tuple args(converted.size());
        for (std::size_t k = 0; k < converted.size(); ++k) args[k] = converted[k];
        py::sequence views;
        try {
            views = numpy().attr("broadcast_arrays")(*args).cast<py::sequence>();
        } catch (py::error_already_set& e) {
            std::string names;
            for (const auto& v : values) names += (names.empty() ? "" : ", ") + std::string(v.second);
            throw py::value_error(names + ": shapes do not broadcast together (" + e.what() + ")");
        }
        for (auto v : views) in.arrays.push_back(Doubles::ensure(v));  // copies the strided views
    }
    const auto& a = in.arrays.front();
    in.shape.assign(a.shape(), a.shape() + a.ndim());
    in.size = static_cast<std::size_t>(a.size());
    return in;
}

py::object wrap_output(py::array_t<double>& out, bool scalar) {
    if (scalar) return py::float_(*out.data());
    return std::move(out);
}

Flat flatten(py::handle value, const char* name) {
    Flat f;
    f.array = to_doubles(value, name);
    f.values = std::span<const double>(f.array.data(), static_cast<std::size_t>(f.array.size()));
    f.shape.assign(f.array.shape(), f.array.shape() + f.array.ndim());
    f.scalar = f.array.ndim() == 0;
    return f;
}

py::object from_vector(const std::vector<double>& values, const std::vector<py::ssize_t>& shape, bool scalar) {
    py::array_t<double> out(shape);
    if (!values.empty()) std::memcpy(out.mutable_data(), values.data(), values.size() * sizeof(double));
    return wrap_output(out, scalar);
}

}  // namespace mudepth::python
