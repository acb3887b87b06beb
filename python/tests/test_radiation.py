"""Radiation from energy, wavelength and anode line, against `mudepth mu --json`."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402

SAMPLE = ("--formula", "Si", "--density", 2.329)


@pytest.mark.parametrize("source", ["Cu", "Cu:Ka1", "Mo:Ka2", "Co:Kb", "Cr", "Ag", "W:Ka1", "In", "Ga"])
def test_source_equals_cli(source):
    r = mudepth.radiation_from_source(source)
    j = cli_json("mu", *SAMPLE, "--source", source)
    assert r.label == j["radiation"]
    assert_close(r.energy_keV, j["energy_keV"])
    assert_close(r.wavelength_A, j["wavelength_A"])


@pytest.mark.parametrize("wavelength", [0.7093, 1.5406, 2.29, 0.2])
def test_wavelength_equals_cli(wavelength):
    r = mudepth.radiation_from_wavelength(wavelength)
    j = cli_json("mu", *SAMPLE, "--wavelength", wavelength)
    assert r.label == j["radiation"]
    assert_close(r.energy_keV, j["energy_keV"])


@pytest.mark.parametrize("energy", [1.0, 8.04778, 17.4, 500.0])
def test_energy_equals_cli(energy):
    r = mudepth.radiation_from_energy(energy)
    j = cli_json("mu", *SAMPLE, "--energy", energy)
    assert r.label == j["radiation"]
    assert_close(r.wavelength_A, j["wavelength_A"])


def test_conversions_vectorised_equal_scalar():
    e = np.array([1.0, 8.04778, 17.479, 100.0])
    lam = mudepth.wavelength_A_from_energy_keV(e)
    assert lam.shape == e.shape
    for i in range(e.size):
        assert lam[i] == mudepth.wavelength_A_from_energy_keV(float(e[i]))
        assert lam[i] == mudepth.radiation_from_energy(float(e[i])).wavelength_A
    # E·λ = hc = 12.39841984 keV·Å (CODATA 2018)
    assert_close(e * lam, np.full(4, 12.39841984), rel=1e-14)
    assert_close(mudepth.energy_keV_from_wavelength_A(lam), e, rel=1e-14)


def test_anodes():
    symbols = [a.symbol for a in mudepth.anodes()]
    assert symbols == ["Cr", "Fe", "Co", "Cu", "Ga", "Mo", "Ag", "In", "W"]
    cu = mudepth.find_anode("Cu")
    assert_close(mudepth.radiation_from_source("Cu:Ka1").wavelength_A, cu.ka1_A)
