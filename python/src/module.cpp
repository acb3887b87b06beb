// The Python module `mudepth`: the library's functions with NumPy arrays in and out.
// Errors: mudepth::InputError → mudepth.InputError (a ValueError), FileError →
// mudepth.FileError (an OSError), both with the message the command line prints.
#include <pybind11/pybind11.h>

#include "bindings.hpp"
#include "mudepth/error.hpp"
#include "mudepth/version.hpp"

namespace py = pybind11;

PYBIND11_MODULE(mudepth, m) {
    m.doc() =
        "X-ray attenuation, depth probed and absorption factors for powder and thin-film diffraction.\n\n"
        "The same library as the mudepth command line: same numbers, same error messages.\n"
        "Units are in the argument names: energy_keV, wavelength_A, two_theta_deg, thickness_cm,\n"
        "mu_per_cm, depth_1e_um. Vectorised functions take floats, lists or NumPy arrays and return\n"
        "float64 arrays of the broadcast shape (a float when every input is a scalar).";
    m.attr("__version__") = std::string(mudepth::kVersion);

    static py::exception<mudepth::InputError> input_error(m, "InputError", PyExc_ValueError);
    static py::exception<mudepth::FileError> file_error(m, "FileError", PyExc_OSError);
    input_error.attr("__doc__") = "Bad input (a ValueError); the message is the command line's after 'mudepth: error: '.";
    file_error.attr("__doc__") = "A file could not be read or written (an OSError); the message is the command line's.";
    py::register_exception_translator([](std::exception_ptr p) {
        try {
            if (p) std::rethrow_exception(p);
        } catch (const mudepth::InputError& e) {
            input_error(e.what());
        } catch (const mudepth::FileError& e) {
            file_error(e.what());
        } catch (const mudepth::Error& e) {
            PyErr_SetString(PyExc_RuntimeError, e.what());
        }
    });

    using namespace mudepth::python;
    bind_material(m);
    bind_radiation(m);
    bind_attenuation(m);
    bind_depth(m);
    bind_film(m);
    bind_plate(m);
    bind_cylinder(m);
    bind_specimen(m);
    bind_filter(m);
    bind_plan(m);
    bind_correct(m);
}
