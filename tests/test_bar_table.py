"""The material pages' table of single-bar AC/DC ratios (conductor_atlas.bar_table).

Its numbers are the core's filament solver (checked against the Kelvin solution and a scikit-fem
solution in tests/core/test_filament_solver.py and against the busbar literature in
tests/core/test_bar_literature.py); here: the table is that solver and the skin-effect calculator
to the last digit, the stored solutions are current, and the materials that get it are the right ones.
"""

import json

import pytest

from conductor_atlas import bar_table
from conductor_atlas.build import data_folders
from conductor_atlas.core import filament_solver
from conductor_atlas.core.calculators import calculate
from conductor_atlas.derive import derive_material
from conductor_atlas.load import load_dataset
from tests.support.differential_cases import shipped_catalogue


@pytest.fixture(scope="module")
def views():
    dataset = load_dataset(data_folders())
    return {m.id: derive_material(m) for m in dataset.materials}


def bar_rows(view):
    found = [t for t in view.tables if t.id == "bar-ac-dc-ratio"]
    return found[0] if found else None


def test_stored_solutions_are_current():
    """The file was made by the solver as it is now and holds every cell of the shipped tables: else the
    build solves them (about 6 CPU minutes) and this says how to store them again."""
    stored = json.loads(bar_table.STORE.read_text(encoding="utf-8"))
    hint = "run: .venv/bin/python -m conductor_atlas.bar_table --write"
    assert stored["solver_digest"] == bar_table.solver_digest(), "the solver changed since bar_ratios.json; " + hint
    missing = [k for k in bar_table.shipped_keys() if bar_table.solution_key(*k) not in stored["solutions"]]
    assert not missing, f"{len(missing)} bar solutions not stored (a changed ρ?); " + hint


def test_the_digest_follows_the_code_not_its_comments_or_docstrings(tmp_path, monkeypatch):
    """A comment, a docstring or a blank line added to a solver file keeps the stored solutions; a change
    to an expression does not."""
    for name in bar_table.SOLVER_FILES:
        (tmp_path / name).write_text((bar_table.CORE_DIR / name).read_text(encoding="utf-8"), encoding="utf-8")
    monkeypatch.setattr(bar_table, "CORE_DIR", tmp_path)
    before = bar_table.solver_digest()
    solver = tmp_path / "filament_solver.py"
    source = solver.read_text(encoding="utf-8")
    lines = ('"""Another module docstring."""\n# a comment\n\n' + source.split('"""', 2)[2]).split("\n")
    first_def = next(i for i, line in enumerate(lines) if line.startswith("def ") and line.endswith("):"))
    lines[first_def:first_def + 1] = ["# a note", lines[first_def], '    """A docstring."""', ""]
    solver.write_text("\n".join(lines), encoding="utf-8")
    assert bar_table.solver_digest() == before
    constants = tmp_path / "constants.py"
    constants.write_text(constants.read_text(encoding="utf-8").replace("1.25663706212e-6", "1.25663706213e-6", 1), encoding="utf-8")
    assert bar_table.solver_digest() != before


@pytest.mark.parametrize("width, thickness", [(0.02, 0.005), (0.04, 0.005), (0.05, 0.005)])
def test_stored_solution_equals_a_fresh_solve(width, thickness):
    """Cheap cells (5 mm bars at 50 Hz, about 0.1 s each) solved again: identical to the stored ones."""
    rho = 1.7241e-8  # IEC 60028 annealed copper at 20 °C, as copper-annealed's page uses
    stored = bar_table.stored_solutions()[bar_table.solution_key(width, thickness, rho, 50.0)]
    fresh = filament_solver.bar_group_solution(width, thickness, 1, 0.0, rho, 50.0)
    assert stored == [fresh["ratio"], fresh["filaments"], fresh["level"], fresh["change"], bool(fresh["converged"])]


def test_a_stale_store_is_not_used(monkeypatch, capsys):
    """With another solver digest the stored file is ignored, the build says so on stderr with the command
    that stores them again, and the cell is solved in the build."""
    monkeypatch.setattr(bar_table, "solver_digest", lambda: "changed")
    bar_table.stored_solutions.cache_clear()
    bar_table.bar_solution.cache_clear()
    try:
        assert bar_table.stored_solutions() == {}
        assert "python -m conductor_atlas.bar_table --write" in capsys.readouterr().err
        solved = bar_table.bar_solution(0.02, 0.005, 1.7241e-8, 50.0)
        assert solved[0] == filament_solver.bar_group_solution(0.02, 0.005, 1, 0.0, 1.7241e-8, 50.0)["ratio"]
    finally:
        monkeypatch.undo()
        bar_table.stored_solutions.cache_clear()
        bar_table.bar_solution.cache_clear()


@pytest.mark.parametrize("mid, size, frequency", [("copper-annealed", "100 x 10 mm", "50 Hz"),
                                                  ("aluminium-1350", "200 x 10 mm", "60 Hz"),
                                                  ("cartridge-brass", "40 x 10 mm", "400 Hz")])
def test_table_equals_the_skin_effect_calculator(views, mid, size, frequency):
    """The page's table and the calculator with the same bar at 20 °C give the same ratio (same solver,
    same budget, same ρ(20 °C)): to the last digit where the calculator solves the bar, within 0.1 %
    (the solver's settling tolerance, core.bar_ratio_lookup) where it reads the solver's tabulated grid."""
    table = bar_rows(views[mid])
    w, t = (int(x) for x in size.split(" mm")[0].split(" x "))
    row = next(r for r in table.rows if r.id == f"bar-{w}x{t}mm")
    column = [c.key for c in table.columns].index(f"ratio_{frequency.split()[0]}hz")
    out = calculate("skin-effect", {"material": mid, "frequency": frequency, "size": size, "arrangement": "single",
                                    "temperature": "20 °C"}, shipped_catalogue())
    assert out["errors"] == {}
    method = out["results"]["ac_method"]
    if "tabulated" in method["text"]:
        assert method["value"] == 0.0
        assert row.values[column] == pytest.approx(out["results"]["ac_dc_ratio"]["value"], rel=1e-3)
    else:
        assert row.values[column] == pytest.approx(out["results"]["ac_dc_ratio"]["value"], rel=1e-12)
        assert str(int(row.values[column + 3])) in method["text"]


def test_copper_100_x_10_at_50_hz(views):
    """100 × 10 mm annealed copper at 50 Hz: 1.198, the value the issue's converged numerical solution
    gave (about 1.2) and the scikit-fem check of tests/core/test_filament_solver.py confirms to 1 %."""
    table = bar_rows(views["copper-annealed"])
    row = next(r for r in table.rows if r.id == "bar-100x10mm")
    assert row.texts[3] == "1.198"
    assert "filament" in table.model and "0.1 %" in table.model and "20 °C" in table.title


def test_which_materials_get_it(views):
    with_table = sorted(mid for mid, v in views.items() if bar_rows(v) is not None)
    assert with_table == ["aluminium-1350", "aluminium-1350-o", "aluminium-6101", "aluminium-6201",
                          "beryllium-copper", "cartridge-brass", "chromium-copper", "chromium-zirconium-copper",
                          "copper-annealed", "copper-hard-drawn", "copper-oxygen-free", "copper-silver-bearing",
                          "copper-tinned", "phosphor-bronze"]
    # clad (the calculator refuses a clad bar), magnetic (μr ≠ 1) and pure metals: none
    for mid in ("copper-clad-steel-40", "copper-clad-aluminium-10", "steel-low-carbon", "iron", "copper"):
        assert bar_rows(views[mid]) is None
    note = bar_rows(views["copper-annealed"]).note
    assert "conductor grades and copper alloys" in note and "magnetic" in note


def test_unsettled_cells_are_marked(views):
    """A cell whose last refinement step changed the ratio by 0.1 % or more reads '≈' and the note
    names it with its estimated change; settled cells carry no mark."""
    table = bar_rows(views["copper-annealed"])
    for row in table.rows:
        for k, f in enumerate(bar_table.BAR_FREQUENCIES):
            w, t = row.values[1] / 1000.0, row.values[2] / 1000.0
            change = bar_table.bar_solution(w, t, 1.7241e-8, f)[3]
            assert row.texts[3 + k].startswith("≈") == (change >= filament_solver.TOLERANCE)
            if change >= filament_solver.TOLERANCE:
                assert f"{row.texts[0]} at {bar_table.frequency_label(f)}" in table.note


@pytest.mark.parametrize("mid, words", [("copper", "conductor grades and copper alloys only"),
                                        ("steel-low-carbon", "needs μr = 1"),
                                        ("copper-clad-steel-40", "clad bar is not computed")])
def test_pages_without_the_table_say_why(views, mid, words):
    """The round-wire AC/DC table of a material without the bar table says why and where to go."""
    round_ac = next(t for t in views[mid].tables if t.id == "ac-dc-ratio")
    assert words in round_ac.note
    annealed = next(t for t in views["copper-annealed"].tables if t.id == "ac-dc-ratio")
    assert "flat bars" not in annealed.note.lower()
