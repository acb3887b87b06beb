"""Kβ filters and sample planning, against `mudepth filter --json` and `mudepth plan --json`."""
import math

import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402


def check_filter(r, j):
    assert r.symbol == j["symbol"] and r.Z == j["Z"]
    assert_close(r.k_edge_keV, j["k_edge_keV"])
    assert_close(r.thickness_cm * 1e4, j["thickness_um"])
    assert_close(r.mass_thickness_g_cm2 * 1e3, j["mass_thickness_mg_cm2"])
    assert_close(r.ratio_filtered, j["kbeta_kalpha_ratio"])
    assert_close(r.kalpha_transmission, j["kalpha_transmission"])
    assert_close(r.kbeta_transmission, j["kbeta_transmission"])


@pytest.mark.parametrize("anode", ["Cu", "Mo", "Co", "Cr"])
def test_filter_for_ratio_equals_cli(anode):
    j = cli_json("filter", "--anode", anode, "--ratio", 0.01)
    best = mudepth.best_filter_element(anode, 0.01)
    assert best == j["filter"]["Z"]
    check_filter(mudepth.filter_for_ratio(anode, best, 0.01), j["filter"])
    assert_close(mudepth.unfiltered_kbeta_ratio(anode), j["unfiltered_kbeta_kalpha_ratio"])
    others = [z for z in mudepth.filter_candidates(anode) if z != best]
    assert others == [o["Z"] for o in j["other_candidates"]]
    for z, o in zip(others, j["other_candidates"]):
        check_filter(mudepth.filter_for_ratio(anode, z, 0.01), o)


def test_filter_of_thickness_equals_cli():
    j = cli_json("filter", "--anode", "Cu", "--element", "Ni", "--thickness", "15um", "--table", "chantler")
    check_filter(mudepth.filter_of_thickness(mudepth.find_anode("Cu"), "Ni", 15e-4, "chantler"), j["filter"])
    assert sum(line.relative_intensity > 0 for line in mudepth.anode_k_spectrum("Cu")) >= 3


@pytest.mark.parametrize("formula,density,packing,source", [("CeO2", 7.215, 0.5, "Cu"), ("SiO2", 2.65, None, "Mo"),
                                                              ("PbO", 9.53, 0.6, "Cu")])
def test_plan_equals_cli(formula, density, packing, source):
    extra = ("--packing", packing) if packing else ()
    j = cli_json("plan", "--formula", formula, "--density", density, *extra, "--source", source)
    sample = mudepth.material(formula, density, packing or 1.0)
    e = mudepth.radiation_from_source(source).energy_keV
    diluent = mudepth.find_composition("fused-silica").material
    cap = mudepth.plan_capillaries(sample, e, 1.0, diluent, 0.03)
    assert_close(cap.recommended_diameter_cm * 10, j["recommended_diameter_mm"])
    assert cap.smallest_exceeds_target == j["smallest_capillary_exceeds_target"]
    for row, jr in zip(cap.rows, j["capillaries"], strict=True):
        assert_close(row.diameter_cm * 10, jr["diameter_mm"])
        assert_close(row.mu_R, jr["mu_R"])
        assert_close(row.correction_at_10_deg, jr["correction_10deg"])
        assert_close(row.correction_at_150_deg, jr["correction_150deg"])
        assert_close(row.central_ray_transmission, jr["central_ray_transmission"])
    if cap.dilution is None:
        assert j["dilution"] is None
    else:
        assert_close(cap.dilution.sample_weight_fraction, j["dilution"]["sample_weight_fraction"])
        assert_close(cap.dilution.mixture_mu_per_cm, j["dilution"]["mixture_mu_per_cm"])
        mu_target = cap.dilution.mu_R / (cap.dilution.diameter_cm / 2)
        assert_close(mudepth.dilution_weight_fraction(sample, diluent, e, mu_target),
                     j["dilution"]["sample_weight_fraction"], rel=1e-9)
    mu = mudepth.linear_attenuation_per_cm(sample, e)
    plate = mudepth.plan_plate(sample, mu, 150.0, math.pi * 2.0 ** 2 / 4, 0.05)
    assert_close(plate.infinite_99_cm * 1e4, j["plate"]["infinite_thickness_99_um"])
    assert_close(plate.infinite_999_cm * 1e4, j["plate"]["infinite_thickness_999_um"])
    assert_close(plate.transmission_optimum_cm * 1e4, j["plate"]["transmission_optimum_um"])
    assert_close(plate.powder_mass_g * 1e3, j["plate"]["powder_mass_mg"])
    for s, js in zip(mudepth.plan_sources(sample, 1.0), j["sources"], strict=True):
        assert s.anode == js["anode"]
        assert_close(s.mu_per_cm, js["mu_per_cm"])
        assert_close(s.depth_1e_at_30_deg_um, js["depth_1e_30deg_um"])
        assert_close(s.recommended_diameter_cm * 10, js["recommended_diameter_mm"])
        assert [w.label for w in s.fluorescence] == [w["symbol"] for w in js["fluorescence"]]
