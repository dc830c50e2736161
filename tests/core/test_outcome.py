"""The outcome record (core.outcome): its shape and the copy of the inputs it keeps.

The page's form glue (templates/static/calc-form.js) refills one inputs dict per form on every
update, so an outcome must keep its own copy of the inputs, not the dict it was given.
The values here are arbitrary labels for checks of structure (common practice (no source)).
"""

from conductor_atlas.core.outcome import add_error, add_result, check_finite_results, has_errors, new_outcome


def test_new_outcome_has_every_part_empty():
    out = new_outcome("thin-film", {"thickness": "20 nm"})
    assert out == {"calculator": "thin-film", "material": "", "inputs": {"thickness": "20 nm"}, "results": {},
                   "warnings": [], "errors": {}, "sources": [], "model": "", "used": []}


def test_new_outcome_keeps_a_copy_of_the_inputs():
    inputs = {"thickness": "20 nm", "specularity": "0"}
    out = new_outcome("thin-film", inputs)
    inputs["thickness"] = "22 nm"
    inputs["reflection"] = "0.3"
    assert out["inputs"] == {"thickness": "20 nm", "specularity": "0"}


def test_two_outcomes_share_no_parts():
    first = new_outcome("a", {})
    second = new_outcome("b", {})
    add_result(first, "x", 1.0, "m", "1 m")
    add_error(first, "y", "bad")
    assert second["results"] == {} and second["errors"] == {}


def test_results_are_read_by_key():
    out = new_outcome("a", {})
    add_result(out, "length", 2.5, "m", "2.5 m")
    assert out["results"]["length"] == {"value": 2.5, "unit": "m", "text": "2.5 m"}
    assert not has_errors(out)


def test_first_error_of_a_field_is_kept():
    out = new_outcome("a", {})
    add_error(out, "length", "first")
    add_error(out, "length", "second")
    assert out["errors"] == {"length": "first"}
    assert has_errors(out)


def test_a_non_finite_result_becomes_a_message():
    out = new_outcome("a", {})
    add_result(out, "length", 2.5, "m", "2.5 m")
    add_result(out, "area", float("inf"), "m²", "inf")
    check_finite_results(out, "length")
    assert out["results"] == {}
    assert "too extreme" in out["errors"]["length"]
