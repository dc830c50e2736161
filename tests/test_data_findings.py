"""Findings of the data review, one test each, so none comes back.

Each test states the rule and where the numbers come from; the values are read from the shipped
data set, so a test fails when a file drifts from the rule again.
"""

from __future__ import annotations

import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.derive import linear_model
from conductor_atlas.load import load_dataset


@pytest.fixture(scope="module")
def data():
    return load_dataset(data_folders())


def test_pure_platinum_has_the_thermometry_coefficient_and_shares_its_slope_with_pt385(data):
    """Pure platinum's α is the mean 0-100 °C coefficient of thermometry platinum (about 0.003925 /K;
    ITS-90's W(Ga) ≥ 1.11807 criterion), and by Matthiessen's rule the doped Pt385 grade has the same
    slope dρ/dT = ρ0·α: 9.6 µΩ·cm (CRC, 273 K) × 0.003925 and 9.8 × 0.00385 agree to 0.2 %.
    Tolerance 2 %: the 273 K entry is rounded to 0.1 µΩ·cm (1 %)."""
    pure = data.by_id("platinum")
    alpha = pure.get("temperature_coefficient")
    assert alpha is not None and alpha.si == pytest.approx(0.003925, abs=5e-6)
    rho0_table = pure.table.resistivities[pure.table.temperatures.index(273.0)]
    sensor = linear_model(data.by_id("platinum-pt385"))
    assert sensor.rho_ref * sensor.alpha == pytest.approx(rho0_table * alpha.si, rel=0.02)


def test_coefficients_derived_from_conductivity_follow_their_stated_rule(data):
    """Files whose α note says "0.00393 /K times the conductivity as a fraction of 100 %IACS"
    (IEC 60028's rule that the constant-mass coefficient is proportional to conductivity) give
    α = 0.00393 × %IACS / 100 to the three figures they print: tolerance 0.2 % (chromium-zirconium
    copper printed 0.0029 where the rule gives 0.0029475, 1.6 % off)."""
    checked = []
    for m in data.materials:
        alpha = m.get("temperature_coefficient")
        if alpha is None or "0.00393 /K times the conductivity" not in alpha.note:
            continue
        iacs = m.get("conductivity_iacs")
        assert alpha.si == pytest.approx(0.00393 * iacs.si / 100.0, rel=2e-3), m.id
        checked.append(m.id)
    assert "chromium-zirconium-copper" in checked


@pytest.mark.parametrize("material_id, rho_range, alpha_range", [
    # supplier spread of the Cu-Mn-Ni family: 43-48 µΩ·cm; α within about ±40 ppm/K
    ("cu-mn-ni", (43e-8, 48e-8), (-40e-6, 40e-6)),
    # Cu-Ni 55/45: 49 µΩ·cm ±4 %; α about ±40 ppm/K between 20 and 105 °C
    ("cu-ni-55-45", (47e-8, 51e-8), (-40e-6, 40e-6)),
])
def test_resistance_alloys_carry_supplier_ranges(data, material_id, rho_range, alpha_range):
    """A single resistivity and a coefficient of exactly zero hid the spread between lots (common
    practice (no source), from memory): the files give ranges, and the page prints them."""
    m = data.by_id(material_id)
    rho, alpha = m.get("resistivity"), m.get("temperature_coefficient")
    assert (rho.low, rho.high) == pytest.approx(rho_range)
    assert (alpha.low, alpha.high) == pytest.approx(alpha_range)
    assert rho.low <= rho.si <= rho.high and alpha.low <= alpha.si <= alpha.high


def test_every_pure_metal_has_a_density(data):
    """K, Ru and Ta had none, so a "density < 3" search silently left potassium out. Their CRC
    values (0.89, 12.1, 16.4 g/cm³) are read from two copies of the table; the cross-check test
    compares them with the other datasets."""
    missing = [m.id for m in data.materials if m.klass == "pure-metal" and m.get("density") is None]
    assert missing == []


@pytest.mark.parametrize("material_id", ["iridium", "rhodium", "ruthenium"])
def test_resistivities_that_datasets_list_unmarked_say_they_are_at_0_c(data, material_id):
    """The CRC entries for Ir, Rh, Ru are 0 °C values, which room-temperature datasets carry
    unmarked (pymatgen-core: 4.71, 4.33, 7.1 µΩ·cm); the file says 0 °C, and the page with it."""
    rho = data.by_id(material_id).get("resistivity")
    assert rho.temperature == pytest.approx(273.15)
    assert "0 degC value, not 20 degC" in rho.note


@pytest.mark.parametrize("material_id", ["sodium", "potassium"])
def test_alkali_electron_densities_are_5_k_values(data, material_id):
    """Ashcroft & Mermin Table 1.1 gives the alkali metals at 5 K; the page shows the condition."""
    n = data.by_id(material_id).get("electron_density")
    assert n.temperature == pytest.approx(5.0)


def test_tungsten_melting_point_names_its_edition(data):
    """Editions print 3410, 3414 or 3422 °C; the value (3695 K = 3422 °C) is the 95th edition's."""
    tm = data.by_id("tungsten").get("melting_point")
    assert tm.si == pytest.approx(3422.0 + 273.15, abs=0.5)
    assert "95th edition" in tm.locator and data.sources[tm.source].edition == "95th"


def test_citations_have_no_doubled_full_stops(data):
    """"10th ed.. 1990" was printed for every entry with an edition."""
    doubled = [key for key, s in data.sources.items() if ".." in s.citation()]
    assert doubled == []
    assert data.sources["asm-hb-vol1"].citation().endswith("ASM International. 10th ed. 1990")


def test_every_bibliography_entry_is_cited_or_says_why_not(data):
    """An entry no value cites is cited by the code or templates (AWG table, demos) or its note
    says where it is used."""
    from pathlib import Path
    root = Path(__file__).resolve().parents[1]
    code = "".join(p.read_text(encoding="utf-8") for folder in ("generator", "templates", "examples")
                   for p in (root / folder).rglob("*") if p.suffix in (".py", ".html", ".toml"))
    cited = {k for m in data.materials for k in m.source_keys()}
    silent = [k for k, s in data.sources.items()
              if k not in cited and k not in code and not s.note.startswith("Cited")]
    assert silent == []


def test_smithells_locators_name_chapter_19(data):
    """A public page citing the 8th edition for these coefficients gives pp. 19-1 to 19-2."""
    for m in data.materials:
        for v in m.properties.values():
            if v.source == "smithells-8":
                assert "Chapter 19" in v.locator, m.id
