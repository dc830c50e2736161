"""Page model: what a calculator form shows (fields with label, hint and default, result labels,
caution), the calculators in the registry's order, and the material choices of the form's list.
"""

from __future__ import annotations

from conductor_atlas.core.calculators import CALCULATOR_MODULES, CALCULATORS
from conductor_atlas.core.trade_words import TRADE_WORDS
from conductor_atlas.core.material_models import MODEL_CHOICES, MODEL_LABELS, MODEL_NEEDS
from conductor_atlas.core.text_match import name_key
from conductor_atlas.derive import MaterialView


MODEL_HINT = ("auto takes the model that holds at the temperature; a model the chosen material has no data for is "
              "marked not available, with the reason")


def model_choices() -> list[tuple[str, str, str]]:
    """(key, label, why it may be missing) for each temperature model the model field offers."""
    out = [("auto", "auto: the model that holds at the temperature", "")]
    out.extend((key, f"{key}: {MODEL_LABELS[key]}", MODEL_NEEDS[key]) for key in MODEL_CHOICES if key != "auto")
    return out


def calc_spec(name: str, fixed: dict | None = None, datalist: str = "") -> dict:
    """What the calculator form macro needs: fields with label/hint/default, results, caution.

    ``fixed`` maps fields to values that become hidden inputs (the material on its own page).
    """
    module = CALCULATORS[name]
    fixed = fixed or {}
    fields = []
    for field in module.FIELDS:
        label, hint = module.FIELD_INFO[field]
        choices = model_choices() if field == "model" else []
        fields.append({"name": field, "label": label, "hint": MODEL_HINT if choices else hint, "choices": choices,
                       "value": fixed.get(field, module.DEFAULTS.get(field, "")),
                       "hidden": field in fixed,
                       "list": datalist if field in ("material", "other") and datalist else ""})
    return {"name": name, "title": module.TITLE, "summary": module.SUMMARY, "fields": fields,
            "results": [list(r) for r in module.RESULT_LABELS], "caution": module.CAUTION}


def ordered_calculators() -> list[str]:
    """The calculators' names in the registry's order (everyday jobs first)."""
    return [module.NAME for module in CALCULATOR_MODULES]


def material_choices(views: list[MaterialView]) -> list[tuple[str, str]]:
    """(value, label) for the material datalist: every id, then every alias, each with the name of the
    material it gives; a trade word ("copper") with the grade it gives (core.trade_words)."""
    names = {v.material.id: v.material.name for v in views}
    out = []
    for v in views:
        out.extend((label, names[v.material.id]) for label in [v.material.id, *v.material.aliases]
                   if name_key(label) not in TRADE_WORDS)
    out.extend((word, names[TRADE_WORDS[word][0]]) for word in TRADE_WORDS if TRADE_WORDS[word][0] in names)
    return out
