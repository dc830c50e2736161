"""Answers with ranges: a material's recorded ρ min/max carried through the calculators.

The ranges on record (data/materials): copper-hard-drawn 96.16-97.16 %IACS (ASTM B1),
copper-tinned 97.1-98.2 %IACS (from IEC 60228's tables), aluminium-6101 55.0-59.5 %IACS (ASTM B317),
fe-cr-al 1.37-1.44 µΩ·m (DIN 17470). Checks: each end against the physics (R ∝ ρ, δ ∝ √ρ) with
the ends read from the data file, and against the same calculator run on a record moved to the end.
"""

import math

import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.core import resistance as dc
from conductor_atlas.core.calculators import calculate
from conductor_atlas.load import load_dataset
from tests.support.differential_cases import shipped_catalogue

RANGED = ["copper-hard-drawn", "copper-tinned", "aluminium-6101", "fe-cr-al"]


@pytest.fixture(scope="module")
def data_ends():
    """(ρ_min/ρ, ρ_max/ρ) of each ranged material, straight from its file's min and max."""
    dataset = load_dataset(data_folders())
    out = {}
    for mid in RANGED:
        m = dataset.by_id(mid)
        v = m.get("resistivity")
        if v is not None:
            out[mid] = (v.low / v.si, v.high / v.si)
        else:
            iacs = m.get("conductivity_iacs")  # %IACS turns over: its max is the lowest ρ
            out[mid] = (iacs.si / iacs.high, iacs.si / iacs.low)
    return out


@pytest.mark.parametrize("mid", RANGED)
def test_resistance_scales_with_the_ends(mid, data_ends):
    # R = ρ(T) L / A with ρ(T) scaled as a whole: R_end = R · ρ_end/ρ exactly (1e-12: rounding).
    # At 20 °C: aluminium-6101 has no temperature model on record.
    out = calculate("resistance", {"material": mid, "length": "100 m", "size": "2.5 mm2", "temperature": "20 °C"},
                    shipped_catalogue())
    r = out["results"]["resistance"]
    lo, hi = data_ends[mid]
    assert r["low"] == pytest.approx(r["value"] * lo, rel=1e-12)
    assert r["high"] == pytest.approx(r["value"] * hi, rel=1e-12)
    assert "(range " in r["text"]
    g = out["results"]["conductivity"]  # σ = 1/ρ: the low end comes from the high ρ
    assert g["low"] == pytest.approx(g["value"] / hi, rel=1e-12)
    assert "area" not in out["results"] or "low" not in out["results"]["area"]
    assert any("recorded range" in w for w in out["warnings"])


@pytest.mark.parametrize("mid", ["copper-hard-drawn", "aluminium-6101"])
def test_skin_depth_scales_with_root_rho(mid, data_ends):
    # δ = √(ρ / (π f μ0 μr)) ∝ √ρ (any textbook; e.g. Ramo, Whinnery & Van Duzer eq. 4.5-8)
    out = calculate("skin-effect", {"material": mid, "frequency": "50 Hz"}, shipped_catalogue())
    d = out["results"]["skin_depth"]
    lo, hi = data_ends[mid]
    assert d["low"] == pytest.approx(d["value"] * math.sqrt(lo), rel=1e-12)
    assert d["high"] == pytest.approx(d["value"] * math.sqrt(hi), rel=1e-12)


@pytest.mark.parametrize("name, inputs", [
    ("resistance", {"length": "30 m", "size": "4/0 AWG", "temperature": "90 °C", "current": "200 A"}),
    ("short-circuit", {"current": "8 kA", "duration": "0.3 s", "size": "95 mm2", "initial": "70 °C", "final": ""}),
    ("sizing", {"length": "30 m", "current": "16 A", "max_drop": "3 %", "supply": "230 V", "conductors": "2"}),
])
def test_ends_equal_the_calculator_on_a_record_moved_to_each_end(name, inputs, data_ends):
    cat = shipped_catalogue()
    mid = "copper-hard-drawn"
    out = calculate(name, {**inputs, "material": mid}, cat)
    assert out["errors"] == {}
    rec = cat["materials"][mid]
    for end, ratio in zip(("low", "high"), data_ends[mid]):
        moved = dict(rec, rho_ref=rec["rho_ref"] * ratio, rho_low_ratio=0.0, rho_high_ratio=0.0)
        plain = calculate(name, {**inputs, "material": mid}, dict(cat, materials={**cat["materials"], mid: moved}))
        assert "low" not in str(plain["results"].get("resistance", {}))  # no range without a recorded one
        ranged = [k for k, v in out["results"].items() if "low" in v]
        assert ranged, "some result must carry the range"
        for key in ranged:
            ends = sorted([out["results"][key]["low"], out["results"][key]["high"]])
            assert any(e == pytest.approx(plain["results"][key]["value"], rel=1e-12) for e in ends), key
            print(name, key, out["results"][key]["text"])


def test_materials_without_a_range_have_no_ends():
    out = calculate("resistance", {"material": "IACS", "length": "100 m", "size": "2.5 mm2"}, shipped_catalogue())
    assert all("low" not in v and "high" not in v for v in out["results"].values())
    assert not any("recorded range" in w for w in out["warnings"])


def test_short_circuit_final_temperature_range_brackets_nominal():
    # more ρ, more heat: the high end of ρ gives the higher final temperature
    out = calculate("short-circuit", {"material": "copper-hard-drawn", "current": "12 kA", "duration": "0.5 s",
                                      "size": "95 mm2", "initial": "90 °C", "final": ""}, shipped_catalogue())
    t = out["results"]["final_temperature"]
    assert t["low"] < t["value"] < t["high"]
    iacs_high = dc.resistivity_from_iacs(96.16) / dc.resistivity_from_iacs(97.0)
    assert iacs_high == pytest.approx(97.0 / 96.16, rel=1e-12)


def test_resistivity_table_carries_the_range_like_the_calculator():
    """The material page's ρ(T) table: its low/high columns equal the resistivity calculator's ends."""
    from conductor_atlas.derive import derive_material
    dataset = load_dataset(data_folders())
    view = derive_material(dataset.by_id("copper-hard-drawn"))
    table = next(t for t in view.tables if t.id == "resistivity-temperature")
    keys = [c.key for c in table.columns]
    assert keys[2:5] == ["resistivity", "resistivity_low", "resistivity_high"]
    row = next(r for r in table.rows if abs(r.values[0] - 90.0) < 1e-9)
    out = calculate("resistivity", {"material": "copper-hard-drawn", "temperature": "90 °C"}, shipped_catalogue())
    rho = out["results"]["resistivity"]
    assert row.values[3] == pytest.approx(rho["low"] * 1e8, rel=1e-12)
    assert row.values[4] == pytest.approx(rho["high"] * 1e8, rel=1e-12)
    plain = derive_material(dataset.by_id("copper-annealed"))
    assert "resistivity_low" not in [c.key for c in next(t for t in plain.tables if t.id == "resistivity-temperature").columns]


def row_cells(table, first_value):
    """{column key: value} of the table's row whose first value is ``first_value``."""
    row = next(r for r in table.rows if abs(r.values[0] - first_value) < 1e-9)
    return {c.key: v for c, v in zip(table.columns, row.values)}


@pytest.mark.parametrize("mid", RANGED)
def test_wire_and_skin_tables_carry_the_range_like_the_calculators(mid, data_ends):
    """The resistance-per-length tables (metric and AWG) and the skin-depth table carry low/high
    columns equal to the resistance and skin-effect calculators' ends (1e-12: the same models), and
    those ends are the data file's min/max ratios times the nominal (R ∝ ρ)."""
    from conductor_atlas.derive import derive_material
    view = derive_material(load_dataset(data_folders()).by_id(mid))
    tables = {t.id: t for t in view.tables}
    cells = row_cells(tables["resistance-metric"], 16.0)
    out = calculate("resistance", {"material": mid, "length": "1 km", "size": "16 mm2", "temperature": "20 °C"},
                    shipped_catalogue())
    r = out["results"]["resistance"]
    assert cells["r_20c"] == pytest.approx(r["value"], rel=1e-12)
    assert cells["r_20c_low"] == pytest.approx(r["low"], rel=1e-12)
    assert cells["r_20c_high"] == pytest.approx(r["high"], rel=1e-12)
    low, high = data_ends[mid]
    assert cells["r_20c_low"] / cells["r_20c"] == pytest.approx(low, rel=1e-12)
    assert cells["r_20c_high"] / cells["r_20c"] == pytest.approx(high, rel=1e-12)
    assert "same fraction" in tables["resistance-metric"].note and "same fraction" in tables["resistance-awg"].note
    cells = row_cells(tables["skin-depth"], 50.0)
    out = calculate("skin-effect", {"material": mid, "frequency": "50 Hz", "temperature": "20 °C", "size": ""},
                    shipped_catalogue())
    delta = out["results"]["skin_depth"]
    assert cells["skin_depth_low"] == pytest.approx(delta["low"] * 1e6, rel=1e-12)
    assert cells["skin_depth_high"] == pytest.approx(delta["high"] * 1e6, rel=1e-12)
    assert "at most" in tables["ac-dc-ratio"].note


def test_tables_without_a_range_have_no_range_columns():
    from conductor_atlas.derive import derive_material
    view = derive_material(load_dataset(data_folders()).by_id("copper-annealed"))
    for table in view.tables:
        assert not any(c.key.endswith(("_low", "_high")) for c in table.columns), table.id
        assert "recorded range" not in table.note, table.id


def test_compare_carries_the_ranges_of_both_materials(data_ends):
    """σ2/σ1 at equal temperature is ρ1/ρ2, so its ends are the corners of both recorded ranges:
    low = ρ1,low/ρ2,high, high = ρ1,high/ρ2,low (ends from the data files: ASTM B1 96.16-97.16 %IACS
    for hard-drawn copper, ASTM B317 55.0-59.5 %IACS for 6101). Against IACS (no range) the ratio
    spans 6101's own %IACS range, 0.55 to 0.595 (1e-12: the same arithmetic)."""
    out = calculate("compare", {"material": "copper-hard-drawn", "other": "aluminium-6101", "size": "95 mm2"},
                    shipped_catalogue())
    ratio = out["results"]["conductivity_ratio"]
    lo1, hi1 = data_ends["copper-hard-drawn"]
    lo2, hi2 = data_ends["aluminium-6101"]
    assert ratio["low"] == pytest.approx(ratio["value"] * lo1 / hi2, rel=1e-12)
    assert ratio["high"] == pytest.approx(ratio["value"] * hi1 / lo2, rel=1e-12)
    assert sum("has a recorded range" in w for w in out["warnings"]) == 2
    plain = calculate("compare", {"material": "IACS", "other": "aluminium-6101", "size": "95 mm2"}, shipped_catalogue())
    ratio = plain["results"]["conductivity_ratio"]
    assert ratio["low"] == pytest.approx(0.55, rel=1e-4)
    assert ratio["high"] == pytest.approx(0.595, rel=1e-4)
    assert ratio["high"] / ratio["low"] == pytest.approx(59.5 / 55.0, rel=1e-12)

# ---- the relative permeability's recorded range (steel-low-carbon 100-2000, iron 150-5000, nickel
# 110-600, cobalt 70-250: ASM Handbook vol. 1 and the CRC soft-magnetic table, from memory, as in the
# data files), run through the calculators by core.ranges.add_permeability_range

MAGNETIC = ["steel-low-carbon", "iron", "nickel", "cobalt"]


@pytest.fixture(scope="module")
def mu_ends():
    """(μr_min, μr_max) of each magnetic material, straight from its file."""
    dataset = load_dataset(data_folders())
    return {mid: (dataset.by_id(mid).get("relative_permeability").low,
                  dataset.by_id(mid).get("relative_permeability").high) for mid in MAGNETIC}


@pytest.mark.parametrize("mid", MAGNETIC)
def test_skin_depth_ends_follow_mu(mid, mu_ends):
    # δ = sqrt(ρ / (π f μ0 μr)) with scipy's μ0 at each recorded end of μr (1e-9: scipy's μ0 is the
    # CODATA 2018 value, the core's 4π·1e-7 differs by 5.5e-10 relative)
    from scipy.constants import mu_0
    out = calculate("skin-effect", {"material": mid, "frequency": "50 Hz"}, shipped_catalogue())
    entry = out["results"]["skin_depth"]
    rho = out["results"]["resistivity"]["value"]
    low, high = mu_ends[mid]
    assert entry["low"] == pytest.approx(math.sqrt(rho / (math.pi * 50.0 * mu_0 * high)), rel=1e-9)
    assert entry["high"] == pytest.approx(math.sqrt(rho / (math.pi * 50.0 * mu_0 * low)), rel=1e-9)
    assert "μr " in entry["text"] and any("saturates" in w for w in out["warnings"])


def test_steel_rod_ac_ratio_range_is_kelvin_at_the_ends(mu_ends):
    # the 10 mm low-carbon steel rod at 50 Hz: exact Kelvin ratio at μr 100 and 2000 (Ramo et al. 1994, sec. 5.6)
    from conductor_atlas.core.skin_effect import round_wire_resistance_ratio
    out = calculate("skin-effect", {"material": "steel-low-carbon", "frequency": "50 Hz", "size": "d 10 mm"},
                    shipped_catalogue())
    rho = out["results"]["resistivity"]["value"]
    low, high = mu_ends["steel-low-carbon"]
    entry = out["results"]["ac_dc_ratio"]
    assert entry["low"] == pytest.approx(round_wire_resistance_ratio(5e-3, rho, 50.0, low), rel=1e-12)
    assert entry["high"] == pytest.approx(round_wire_resistance_ratio(5e-3, rho, 50.0, high), rel=1e-12)
    assert entry["low"] < entry["value"] < entry["high"]


def test_clad_steel_carries_its_core_range():
    # copper-clad steel's core μr range moves its AC resistance at 100 kHz, where the current still reaches
    # the core; the ends equal the two-layer solution with the core's μr at 100 and 2000
    from conductor_atlas.core.layered_round import core_radius_for_cladding_share, layered_round_resistance_ratio
    catalogue = shipped_catalogue()
    out = calculate("skin-effect", {"material": "CCS-40", "frequency": "100 kHz", "size": "d 1 mm"}, catalogue)
    m = catalogue["materials"]["copper-clad-steel-40"]
    b = core_radius_for_cladding_share(0.5e-3, m["layer_share"])
    rho_core = m["layer_core"]["rho_ref"]
    rho_clad = out["results"]["skin_depth"]["value"] ** 2 * math.pi * 1e5 * 4e-7 * math.pi
    ends = [layered_round_resistance_ratio(b, 0.5e-3, rho_core, mu, rho_clad, 1.0, 1e5) for mu in (100.0, 2000.0)]
    entry = out["results"]["ac_dc_ratio"]
    assert sorted([entry["low"], entry["high"]]) == pytest.approx(sorted(ends), rel=1e-9)


def test_no_range_without_one():
    out = calculate("skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "d 10 mm"}, shipped_catalogue())
    assert all("low" not in entry for entry in out["results"].values())
