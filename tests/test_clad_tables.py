"""Clad wire on the material pages and the compare page: the AC/DC table by the two-layer solution and
the skin depth of the cladding, never the averaged resistivity (the averaged ρ had put CCS 40 % of
1 mm at 1 MHz at 146 mΩ/m, 70 % above a copper wire, where the copper layer carries the current)."""

import math

import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.compare_page import compare_rows
from conductor_atlas.core.celsius import TWENTY_CELSIUS as T20
from conductor_atlas.core.layered_round import core_radius_for_cladding_share, layered_round_resistance_ratio
from conductor_atlas.core.material_models import resistivity_at
from conductor_atlas.core.skin_effect import round_wire_resistance_ratio, skin_depth
from conductor_atlas.derive import derive_material
from conductor_atlas.load import load_dataset


@pytest.fixture(scope="module")
def views():
    dataset = load_dataset(data_folders())
    return {m.id: derive_material(m) for m in dataset.materials}


def table(view, table_id):
    return next(t for t in view.tables if t.id == table_id)


@pytest.mark.parametrize("mid", ["copper-clad-steel-40", "copper-clad-aluminium-10"])
def test_ac_table_is_the_two_layer_solution(views, mid):
    view = views[mid]
    record = view.calc
    t = table(view, "ac-dc-ratio")
    assert "two-layer" in t.model
    row = next(r for r in t.rows if r.id == "awg-12")
    d = row.values[1] * 1e-3
    core, clad = record["layer_core"], record["layer_cladding"]
    b = core_radius_for_cladding_share(d / 2, record["layer_share"])
    expected = layered_round_resistance_ratio(b, d / 2, resistivity_at(core, T20, "auto")["rho"], core["mu_r"],
                                              resistivity_at(clad, T20, "auto")["rho"], clad["mu_r"], 1e6)
    column = [c.key for c in t.columns].index("f_1000000")
    assert row.values[column] == pytest.approx(expected, rel=1e-12)
    # and it is not what the averaged resistivity gives
    averaged = round_wire_resistance_ratio(d / 2, view.rho_20, 1e6)
    assert abs(row.values[column] / averaged - 1) > 0.1


def test_skin_depth_is_the_cladding_s(views):
    view = views["copper-clad-steel-40"]
    t = table(view, "skin-depth")
    row = next(r for r in t.rows if r.values[0] == 1e6)
    rho_clad = resistivity_at(view.calc["layer_cladding"], T20, "auto")["rho"]
    assert row.values[1] == pytest.approx(skin_depth(rho_clad, 1e6) * 1e6, rel=1e-12)
    assert "cladding" in t.note
    compare = next(r for r in compare_rows(list(views.values())) if r.id == "copper-clad-steel-40")
    assert compare.cells[-1].value * 1e-6 == pytest.approx(skin_depth(rho_clad, 1e6), rel=1e-3)
