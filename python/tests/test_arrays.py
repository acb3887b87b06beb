"""Inputs of the vectorised calls: float64, float32, integers, lists, scalars, strided and
multi-dimensional arrays, broadcasting; non-numeric input is refused with TypeError."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402

SAMPLE = mudepth.material("Fe2O3", 5.24, 0.6)
DS = mudepth.geometric_sample(120.0)

# (name, call with the varying argument x)
CALLS = [
    ("mass_attenuation_cm2_g", lambda x: mudepth.mass_attenuation_cm2_g(SAMPLE, x)),
    ("linear_attenuation_per_cm", lambda x: mudepth.linear_attenuation_per_cm(SAMPLE, x)),
    ("refraction.delta", lambda x: mudepth.refraction(SAMPLE, x)["delta"]),
    ("wavelength", lambda x: mudepth.wavelength_A_from_energy_keV(x)),
    ("depth", lambda x: mudepth.depth(DS, x)["depth_1e_um"]),
    ("angle_for_depth", lambda x: mudepth.angle_for_depth(DS, x, 5.0)["incidence_deg"]),
    ("plate", lambda x: mudepth.plate_transmission(0.5, x)),
    ("cylinder", lambda x: mudepth.cylinder_transmission(1.0, x)),
    ("container", lambda x: mudepth.container_factors(1.0, 0.1, 1.1, x)["A_s_sc"]),
]
VALUES = [10.0, 17.0, 25.0, 40.0, 60.0, 80.0]  # valid both as keV and as 2θ degrees


@pytest.mark.parametrize("name,call", CALLS)
def test_forms_of_input_agree(name, call):
    ref = np.array([call(v) for v in VALUES])
    assert all(isinstance(call(v), float) for v in VALUES[:2])  # scalars in, floats out
    f64 = np.array(VALUES)
    got = call(f64)
    assert got.dtype == np.float64 and got.shape == (6,)
    assert np.allclose(got, ref, rtol=1e-9, atol=0, equal_nan=True)
    assert np.allclose(call(VALUES), ref, rtol=1e-9, atol=0, equal_nan=True)  # list
    assert np.allclose(call(tuple(VALUES)), ref, rtol=1e-9, atol=0, equal_nan=True)  # tuple
    assert np.allclose(call(np.array(VALUES, dtype=np.int64)), ref, rtol=1e-9, atol=0, equal_nan=True)  # integers
    f32 = np.array(VALUES, dtype=np.float32)  # the values are exact in float32
    assert np.allclose(call(f32), ref, rtol=1e-9, atol=0, equal_nan=True)
    assert isinstance(call(np.float32(VALUES[0])), float)
    # non-contiguous: every other element of a longer array, a reversed view, a column of a 2-D array
    long = np.repeat(f64, 2)
    assert np.allclose(call(long[::2]), ref, rtol=1e-9, atol=0, equal_nan=True)
    assert np.allclose(call(f64[::-1])[::-1], ref, rtol=1e-9, atol=0, equal_nan=True)
    m = np.stack([f64, f64 + 1.0], axis=1)  # shape (6, 2); m[:, 0] is strided
    assert not m[:, 0].flags["C_CONTIGUOUS"]
    assert np.allclose(call(m[:, 0]), ref, rtol=1e-9, atol=0, equal_nan=True)
    # shapes are kept, C or Fortran order
    grid = f64.reshape(2, 3)
    assert np.allclose(call(grid), ref.reshape(2, 3), rtol=1e-9, atol=0, equal_nan=True)
    assert np.allclose(call(np.asfortranarray(grid)), ref.reshape(2, 3), rtol=1e-9, atol=0, equal_nan=True)
    assert np.allclose(call(grid.T), ref.reshape(2, 3).T, rtol=1e-9, atol=0, equal_nan=True)
    # 0-d array in, float out; empty in, empty out
    assert isinstance(call(np.array(VALUES[0])), float)
    assert call(np.array([], dtype=float)).shape == (0,)


@pytest.mark.parametrize("name,call", CALLS)
@pytest.mark.parametrize("bad,what", [
    ("20", "the text '20'"),
    (["a", "b"], "dtype <U1"),
    (None, "None"),
    (True, "a bool"),
    (np.array([1 + 2j]), "dtype complex128"),
    (np.array([True, False]), "dtype bool"),
    (np.array([1.0, "x"], dtype=object), "dtype object"),
    ([[1.0, 2.0], [3.0]], "list"),
])
def test_non_numeric_input_refused(name, call, bad, what):
    with pytest.raises(TypeError, match="expected numbers") as e:
        call(bad)
    assert what in str(e.value)


def test_refusal_names_the_argument():
    with pytest.raises(TypeError, match="^incidence_deg: expected numbers"):
        mudepth.depth(DS, 40.0, incidence_deg="low")
    with pytest.raises(TypeError, match="^energy_keV: "):
        mudepth.mass_attenuation_cm2_g(SAMPLE, "8 keV")


def test_broadcasting():
    d = mudepth.depth(DS, np.array([[30.0], [60.0], [90.0]]), incidence_deg=np.array([1.0, 2.0, 5.0, 10.0]))
    assert d["depth_1e_um"].shape == (3, 4)
    for i, tt in enumerate([30.0, 60.0, 90.0]):
        for k, a in enumerate([1.0, 2.0, 5.0, 10.0]):
            assert d["depth_1e_um"][i, k] == mudepth.depth(DS, tt, incidence_deg=a)["depth_1e_um"]
    t = mudepth.transmission(np.array([10.0, 100.0]), 0.01)
    assert t.shape == (2,) and t[1] == mudepth.transmission(100.0, 0.01)
    with pytest.raises(ValueError, match="do not broadcast"):
        mudepth.depth(DS, np.array([30.0, 60.0]), incidence_deg=np.array([1.0, 2.0, 3.0]))


def test_element_error_mid_array_reports_that_element():
    # one bad element anywhere refuses the call with the library's message for it
    with pytest.raises(ValueError, match=r"energy 600 keV is outside"):
        mudepth.mass_attenuation_cm2_g(SAMPLE, np.array([8.0, 9.0, 600.0, 10.0]))
    with pytest.raises(ValueError, match="energy is not a finite number"):
        mudepth.mass_attenuation_cm2_g(SAMPLE, [8.0, np.nan])
