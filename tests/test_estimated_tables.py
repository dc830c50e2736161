"""Alloys whose ρ(T) is estimated by Matthiessen's rule get their page tables, naming the estimate.

Found: 6101 (the extruded busbar alloy), C17200 and C51000 had a temperature model for the
calculators but no table at all on their pages, because every estimate carries a standing
"this is an estimate" note and the tables dropped any row with a note. The rows now appear, the
table names the model, and the values equal the resistivity calculator at the same temperature
(1e-12: the same model; CPython and the page run it alike, tests/test_differential.py).
"""

import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.core.calculators import calculate
from conductor_atlas.derive import derive_material
from conductor_atlas.load import load_dataset
from tests.support.differential_cases import shipped_catalogue

ESTIMATED = ["aluminium-6101", "beryllium-copper", "phosphor-bronze"]


@pytest.mark.parametrize("mid", ESTIMATED)
def test_estimated_alloys_have_tables_that_name_the_estimate(mid):
    view = derive_material(load_dataset(data_folders()).by_id(mid))
    tables = {t.id: t for t in view.tables}
    assert {"resistivity-temperature", "resistance-metric", "resistance-awg", "skin-depth"} <= set(tables)
    rt = tables["resistivity-temperature"]
    assert "Matthiessen" in rt.model and "estimate" in rt.model
    row = next(r for r in rt.rows if abs(r.values[0] - 70.0) < 1e-9)
    out = calculate("resistivity", {"material": mid, "temperature": "70 °C"}, shipped_catalogue())
    assert out["results"]["resistivity"]["value"] * 1e8 == pytest.approx(row.values[2], rel=1e-12)
    assert "Matthiessen" in row.values[-1]  # the model column
    metric = tables["resistance-metric"]
    keys = [c.key for c in metric.columns]
    row = next(r for r in metric.rows if abs(r.values[0] - 16.0) < 1e-9)
    out = calculate("resistance", {"material": mid, "length": "1 km", "size": "16 mm2", "temperature": "70 °C"},
                    shipped_catalogue())
    assert row.values[keys.index("r_70c")] == pytest.approx(out["results"]["resistance"]["value"], rel=1e-12)


@pytest.mark.parametrize("mid", ["copper-clad-steel-30", "copper-clad-steel-40"])
def test_clad_steel_has_tables_that_name_the_layers(mid):
    view = derive_material(load_dataset(data_folders()).by_id(mid))
    rt = next(t for t in view.tables if t.id == "resistivity-temperature")
    assert "layers in parallel" in rt.model and "estimate" in rt.model
    row = next(r for r in rt.rows if abs(r.values[0] - 70.0) < 1e-9)
    out = calculate("resistivity", {"material": mid, "temperature": "70 °C"}, shipped_catalogue())
    assert out["results"]["resistivity"]["value"] * 1e8 == pytest.approx(row.values[2], rel=1e-12)
    assert "layers in parallel" in row.values[-1]


def test_extrapolation_still_leaves_a_gap():
    """A linear model outside its span warns: such rows stay out (copper's table starts where its
    models hold; no row below the lowest sourced point carries an extrapolation note)."""
    view = derive_material(load_dataset(data_folders()).by_id("copper-annealed"))
    rt = next(t for t in view.tables if t.id == "resistivity-temperature")
    out = calculate("resistivity", {"material": "copper-annealed", "temperature": str(rt.rows[0].values[0] - 20) + " °C"},
                    shipped_catalogue())
    assert out["warnings"], "the first row should sit at the edge of the models' reach"


def test_a_computed_carrier_density_lists_the_sources_it_was_computed_from():
    """n = ρ_m N_A Z / M (Ashcroft & Mermin eq. 1.4) from density, molar mass and valence: a result that
    uses it lists those three values' sources, not a tabulated n's. Copper with its tabulated n taken
    out stands for an overlay material that records only the three (no shipped one does today)."""
    import dataclasses

    from conductor_atlas.derive import carrier_density, carrier_density_sources
    copper = load_dataset(data_folders()).by_id("copper")
    assert carrier_density_sources(copper) == [copper.get("electron_density").source]
    props = {k: v for k, v in copper.properties.items() if k != "electron_density"}
    untabulated = dataclasses.replace(copper, properties=props)
    assert carrier_density(untabulated)[1] == "computed"
    expected = list(dict.fromkeys(copper.get(k).source for k in ("density", "molar_mass", "valence")))
    assert carrier_density_sources(untabulated) == expected
