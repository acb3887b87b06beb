"""Every refusal: the module raises ValueError (mudepth.InputError) or OSError (mudepth.FileError)
with the message the command line prints after 'mudepth: error: ' (exit 2 and 3)."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import cli_error  # noqa: E402

SI = mudepth.material("Si", 2.329)
MU = ("--formula", "Si", "--density", 2.329)
CU = mudepth.radiation_from_source("Cu").energy_keV
DS = mudepth.geometric_sample(100.0)

# (id, Python call, command line arguments, exception). The messages must be equal.
SAME = [
    ("formula", lambda: mudepth.parse_formula("Fe2O3)"), ("mu", "--formula", "Fe2O3)", "--density", 5, "--energy", 8)),
    ("formula-element", lambda: mudepth.material("Xq2O3", 5), ("mu", "--formula", "Xq2O3", "--density", 5, "--energy", 8)),
    ("packing", lambda: mudepth.material("Si", 2.329, 1.5), ("mu", *MU, "--packing", 1.5, "--energy", 8)),
    ("packing-composition", lambda: mudepth.find_composition("corundum").material.with_packing(0),
     ("mu", "--material", "corundum", "--packing", 0, "--energy", 8)),
    ("cell", lambda: mudepth.density_from_cell_g_cm3("Si", mudepth.UnitCell(5, 5, 5, 90, 90, 200), 8),
     ("mu", "--formula", "Si", "--cell", "5 5 5 90 90 200", "--formula-units", 8, "--energy", 8)),
    ("mix-fraction", lambda: mudepth.mix([(SI, -1), (mudepth.material("Al2O3", 3.99), 1)]),
     ("mu", "--phase", "Si,2.329,-1", "--phase", "Al2O3,3.99,1", "--energy", 8)),
    ("unknown-material", lambda: mudepth.find_composition("corundun"),
     ("mu", "--material", "corundun", "--energy", 8)),
    ("energy-high", lambda: mudepth.mass_attenuation_cm2_g(SI, [8.0, 600.0]), ("mu", *MU, "--energy", 600)),
    ("energy-low", lambda: mudepth.radiation_from_energy(0.5), ("mu", *MU, "--energy", 0.5)),
    ("energy-refraction", lambda: mudepth.refraction(SI, 0.2), ("mu", *MU, "--energy", 0.2)),
    ("energy-depth-sample", lambda: mudepth.depth_sample(SI, 700.0), ("depth", *MU, "--energy", 700, "--two-theta", 30)),
    ("wavelength", lambda: mudepth.radiation_from_wavelength(0.01), ("mu", *MU, "--wavelength", 0.01)),
    ("anode", lambda: mudepth.radiation_from_source("Xx"), ("mu", *MU, "--source", "Xx")),
    ("line", lambda: mudepth.radiation_from_source("Cu:Kz"), ("mu", *MU, "--source", "Cu:Kz")),
    ("table", lambda: mudepth.linear_attenuation_per_cm(SI, 8.0, "henke"), ("mu", *MU, "--energy", 8, "--table", "henke")),
    ("chantler-Z", lambda: mudepth.mass_attenuation_cm2_g(mudepth.material("PuO2", 11.5), 20.0, "chantler"),
     ("scan", "--formula", "PuO2", "--density", 11.5, "--from", 20, "--to", 21, "--table", "chantler")),
    ("depth-2theta", lambda: mudepth.depth(DS, [30.0, 190.0]), ("depth", "--mu", 100, "--two-theta", "30,190")),
    ("depth-incidence", lambda: mudepth.depth(DS, 30.0, incidence_deg=35.0),
     ("depth", "--mu", 100, "--two-theta", 30, "--incidence", 35)),
    ("depth-incidence-zero", lambda: mudepth.depth(DS, 30.0, incidence_deg=0.0),
     ("depth", "--mu", 100, "--two-theta", 30, "--incidence", 0)),
    ("depth-omega", lambda: mudepth.depth(DS, 30.0, tilt_deg=20.0, tilt_mode="omega"),
     ("depth", "--mu", 100, "--two-theta", 30, "--tilt", 20, "--tilt-mode", "omega")),
    ("depth-side", lambda: mudepth.depth(DS, 30.0, tilt_deg=95.0),
     ("depth", "--mu", 100, "--two-theta", 30, "--tilt", 95)),
    ("inverse-2theta", lambda: mudepth.angle_for_depth(DS, 200.0, 1.0),
     ("depth", "--mu", 100, "--two-theta", 200, "--target-depth", "1um")),
    ("plate-mode", lambda: mudepth.plate_transmission(1.0, 30.0, "transmission"),
     ("plate", "--mu-t", 1, "--mode", "transmission", "--two-theta", 30)),
    ("plate-normal-90", lambda: mudepth.plate_transmission(1.0, [30.0, 100.0], "transmission-normal"),
     ("plate", "--mu-t", 1, "--mode", "transmission-normal", "--two-theta", "30,100")),
    ("plate-incidence", lambda: mudepth.plate_transmission(1.0, 30.0, incidence_deg=40.0),
     ("plate", "--mu-t", 1, "--incidence", 40, "--two-theta", 30)),
    ("container-ratio", lambda: mudepth.container_factors(1.0, 0.1, 25.0, 30.0),
     ("cylinder", "--mu-r", 1, "--mu-r-container", 0.1, "--radius-ratio", 25, "--two-theta", 30)),
    ("container-wall", lambda: mudepth.container_factors(1.0, 40.0, 2.0, 30.0),
     ("cylinder", "--mu-r", 1, "--mu-r-container", 40, "--radius-ratio", 2, "--two-theta", 30)),
    ("filter-anode", lambda: mudepth.filter_for_ratio("Xx", "Ni", 0.01), ("filter", "--anode", "Xx")),
    ("filter-ratio", lambda: mudepth.filter_for_ratio("Cu", "Ni", 0.9), ("filter", "--anode", "Cu", "--element", "Ni",
                                                                            "--ratio", 0.9)),
]

# The command line puts the option's name before the library's message ("--two-theta: ...").
SUFFIX = [
    ("density", lambda: mudepth.material("Si", 50), ("mu", "--formula", "Si", "--density", 50, "--energy", 8)),
    ("cylinder-2theta", lambda: mudepth.cylinder_transmission(1.0, [30.0, 200.0]),
     ("cylinder", "--mu-r", 1, "--two-theta", "30,200")),
]

FILES = [
    ("missing-file", lambda: mudepth.find_composition("/nonexistent/dir/glass.toml"),
     ("mu", "--material", "/nonexistent/dir/glass.toml", "--energy", 8)),
]


@pytest.mark.parametrize("name,call,args", SAME, ids=[c[0] for c in SAME])
def test_same_message_as_cli(name, call, args):
    status, message = cli_error(*args)
    assert status == 2
    with pytest.raises(ValueError) as e:
        call()
    assert isinstance(e.value, mudepth.InputError)
    assert str(e.value) == message


@pytest.mark.parametrize("name,call,args", SUFFIX, ids=[c[0] for c in SUFFIX])
def test_cli_adds_the_option_name(name, call, args):
    status, message = cli_error(*args)
    assert status == 2
    with pytest.raises(ValueError) as e:
        call()
    assert message.endswith(str(e.value)) and message != str(e.value), (message, str(e.value))


@pytest.mark.parametrize("name,call,args", FILES, ids=[c[0] for c in FILES])
def test_file_errors_raise_oserror(name, call, args):
    status, message = cli_error(*args)
    assert status == 3
    with pytest.raises(OSError) as e:
        call()
    assert isinstance(e.value, mudepth.FileError)
    assert str(e.value) == message


def test_malformed_composition_file(tmp_path):
    path = tmp_path / "broken.toml"
    path.write_text('title = "broken"\nformula = "SiO2)"\n')
    status, message = cli_error("mu", "--material", str(path), "--energy", 8)
    assert status == 2
    with pytest.raises(ValueError) as e:
        mudepth.load_composition_file(str(path))
    assert str(e.value) == message
    with pytest.raises(ValueError) as e:
        mudepth.find_composition(str(path))
    assert str(e.value) == message


def test_unreadable_composition_file(tmp_path):
    status, message = cli_error("mu", "--material", str(tmp_path), "--energy", 8)  # a directory
    with pytest.raises(OSError) as e:
        mudepth.load_composition_file(str(tmp_path))
    assert status == 3 and str(e.value) == message


# Refusals of the module's own argument combinations (no command-line equivalent).
OWN = [
    (lambda: mudepth.depth(DS, 30.0, incidence_deg=5.0, tilt_deg=5.0), ValueError,
     "give either incidence_deg or tilt_deg, not both"),
    (lambda: mudepth.depth(DS, 30.0, incidence_deg=5.0, goniometer_radius_cm=24.0), ValueError,
     "goniometer_radius_cm gives the transparency shift"),
    (lambda: mudepth.depth(DS, 30.0, tilt_deg=5.0, tilt_mode="chi"), ValueError, "tilt_mode: 'chi' is not side or omega"),
    (lambda: mudepth.mix([(SI, 1.0)], basis="mole"), ValueError, "phase basis 'mole' is not weight or volume"),
    (lambda: mudepth.element("Xx"), ValueError, "unknown element 'Xx'"),
    (lambda: mudepth.filter_of_thickness("Cu", "Qq", 1e-3), ValueError, "unknown element 'Qq'"),
    (lambda: mudepth.material(42, 2.0), TypeError, "formula: expected a formula text"),
    (lambda: mudepth.filter_for_ratio(29, "Ni"), TypeError, "anode: expected a symbol"),
    (lambda: mudepth.depth(DS, 30.0, fraction=1.5), ValueError, "signal fraction 1.5 is outside (0, 1)"),
    (lambda: mudepth.film_shares([(DS, -1e-4)], DS, 30.0), ValueError, "thickness"),
    (lambda: mudepth.film_shares([], DS, 30.0), ValueError, "empty"),
]


@pytest.mark.parametrize("call,exc,text", OWN)
def test_own_refusals(call, exc, text):
    with pytest.raises(exc) as e:
        call()
    assert text in str(e.value)
