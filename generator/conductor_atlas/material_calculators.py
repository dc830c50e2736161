"""Which calculators answer for a material: the links under a material page's calculator.

A calculator fits a material when, run with its own default inputs and that material, it raises no
problem under the fields that describe the material ("material", "model"). So a link is offered
exactly where the calculator page would answer (short-circuit needs a specific heat and a temperature
model; measured-check needs a temperature model), and never sends a user to a refusal. The check
runs the same core the pages run, on the material page's own catalogue.
"""

from __future__ import annotations

from conductor_atlas.core.calculators import CALCULATOR_MODULES, calculate
from conductor_atlas.core.trade_words import link_text

# the fields whose problems mean "this material cannot be used here"
MATERIAL_FIELDS = ("material", "model")


def fitting_calculators(material_id: str, catalogue: dict, skip: tuple[str, ...] = ("resistance",)) -> list[dict]:
    """[{"name", "title"}] of the calculators (registry order, ``skip`` left out: the one already on
    the page) that answer for ``material_id`` with their default inputs."""
    found = []
    for module in CALCULATOR_MODULES:
        if module.NAME in skip:
            continue
        inputs = {field: module.DEFAULTS.get(field, "") for field in module.FIELDS}
        if "material" not in inputs:
            continue
        inputs["material"] = material_id
        errors = calculate(module.NAME, inputs, catalogue)["errors"]
        if not any(field in errors for field in MATERIAL_FIELDS):
            found.append({"name": module.NAME, "title": module.TITLE})
    return found


def link_key(material_id: str) -> str:
    """What a link to a calculator page puts in ?material= for this material: its id, except for a
    pure metal whose trade word means the conductor grade ("copper" is standard annealed copper), which
    is linked by its chemical symbol ("Cu") so the calculator page opens on the same material."""
    return link_text(material_id)
