"""core.calculators.needs_live_solver, the page's advance notice that an update would run the live
filament solver (calc-form.js then waits for a pause in typing), against what the update does: over
every resistance and skin-effect input of the differential cases, the predicate is true exactly when
the update (core.calculators.calculate, with its ρ and μr range runs) calls the filament solver or
the round pair's harmonic series, and then the AC method shown is one of theirs. Node agrees with CPython on the predicate through
the differential cases (tests/support/differential_cases.py: ac_part_cases)."""

from __future__ import annotations

import pytest

from conductor_atlas.core import ac_layout, ac_part, calc_resistance, calculators, filament_solver
from tests.support.differential_cases import live_solver_cases


def test_predicate_is_true_exactly_when_the_update_solves(monkeypatch):
    solves = []
    refine = filament_solver._refine

    def counted(*args):  # a solve that ran (a refused input raises before solving and is not counted)
        found = refine(*args)
        solves.append(1)
        return found

    monkeypatch.setattr(filament_solver, "_refine", counted)
    pair = ac_layout.round_pair_solution

    def counted_pair(*args):
        found = pair(*args)
        solves.append(1)
        return found

    monkeypatch.setattr(ac_layout, "round_pair_solution", counted_pair)
    cases = live_solver_cases()
    wrong = []
    live_count = 0
    for name, inputs, catalogue in cases:
        predicted = calculators.needs_live_solver(name, inputs, catalogue)
        solves.clear()
        outcome = calculators.calculate(name, inputs, catalogue)
        solved = len(solves) > 0
        live_count += solved
        if predicted != solved:
            wrong.append((name, inputs.get("material"), inputs.get("size"), inputs.get("frequency"),
                          inputs.get("arrangement"), predicted, solved))
        method = outcome["results"].get("ac_method")
        if predicted and method is not None:
            assert method["text"].startswith(("filament solver", "exact multipole solution")), (name, inputs, method)
    assert wrong == [], f"{len(wrong)} of {len(cases)} updates not predicted: {wrong[:10]}"
    # the cases hold both answers in numbers (a predicate that is always False would fail above)
    assert live_count >= 10 and len(cases) - live_count >= 100, live_count


def test_without_the_ac_part_the_resistance_update_says_it_is_pending(monkeypatch):
    """A page that has not loaded the AC part yet: the DC results stand, no AC result is shown,
    outcome["pending"] names the part, and the predicate says no solve is coming."""
    catalogue = live_solver_cases()[0][2]
    inputs = {"material": "Cu", "length": "10 m", "size": "30 x 3 mm", "frequency": "50 Hz"}
    loaded = calc_resistance.calculate(inputs, catalogue)
    assert "pending" not in loaded and "ac_dc_ratio" in loaded["results"]
    monkeypatch.setattr(ac_part, "_FUNCTIONS", {})
    waiting = calc_resistance.calculate(inputs, catalogue)
    assert waiting["pending"] == "ac"
    assert waiting["errors"] == {}
    assert {"skin_depth", "ac_dc_ratio", "resistance_ac"}.isdisjoint(waiting["results"])
    assert waiting["results"]["resistance"] == loaded["results"]["resistance"]
    assert calculators.needs_live_solver("resistance", inputs, catalogue) is False
    # no frequency: nothing is pending
    dc_only = calc_resistance.calculate({**inputs, "frequency": ""}, catalogue)
    assert "pending" not in dc_only


@pytest.mark.parametrize("name", sorted(calculators.CALCULATORS))
def test_every_calculator_that_can_solve_has_a_predicate(name):
    """A calculator whose module reaches the AC layout (ac_ratio_for) must be in LIVE_SOLVER_CHECKS."""
    import inspect
    source = inspect.getsource(calculators.CALCULATORS[name])
    if "ac_ratio_for" in source or "resistance-ac" in source:
        assert name in calculators.LIVE_SOLVER_CHECKS
