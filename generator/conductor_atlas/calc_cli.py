"""``conductor-atlas calc NAME --field "value" ... [--json]``: the web calculators in the terminal.

Options are made from each calculator's FIELDS (``max_drop`` becomes ``--max-drop``); the inputs
are the same text a person types into the web form, read by the same core.
"""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path



def option_name(field: str) -> str:
    return "--" + field.replace("_", "-")


def add_calc_parser(sub, with_calculators: bool = True) -> None:
    """The ``calc`` command; its per-calculator options only ``with_calculators`` (they import the
    core, which other commands, ``build`` above all, do not need)."""
    p_calc = sub.add_parser("calc", help="run a calculator in the terminal (same core as the web pages)")
    if not with_calculators:
        return
    from conductor_atlas.core.calculators import CALCULATORS
    calcs = p_calc.add_subparsers(dest="calculator", metavar="NAME")
    calcs.required = True
    for name in sorted(CALCULATORS):
        module = CALCULATORS[name]
        # argparse formats help text with % (so "%IACS" is written "%%IACS" there), not the description
        p = calcs.add_parser(name, help=module.SUMMARY.replace("%", "%%"), description=module.SUMMARY)
        for field in module.FIELDS:
            label, hint = module.FIELD_INFO[field]
            default = module.DEFAULTS.get(field, "")
            extra = f" (default: {default})" if default else ""
            p.add_argument(option_name(field), dest=f"field_{field}", metavar="TEXT", default=None,
                           help=f"{label}: {hint}{extra}".replace("%", "%%"))
        p.add_argument("--json", action="store_true", help="print one JSON object")
        p.add_argument("--data", action="append", type=Path, default=[], metavar="DIR",
                       help="an extra folder of material files (repeatable)")


def inputs_from(args: argparse.Namespace) -> dict[str, str]:
    from conductor_atlas.core.calculators import CALCULATORS
    module = CALCULATORS[args.calculator]
    inputs = {}
    for field in module.FIELDS:
        value = getattr(args, f"field_{field}")
        if value is None:
            value = module.DEFAULTS.get(field, "")
        inputs[field] = value
    return inputs


def errors_in_form_order(module, errors: dict[str, str]) -> dict[str, str]:
    """The outcome's messages in the order of the calculator's fields (the order the form shows them),
    whatever order the calculator read its fields in; any other key last."""
    place = {field: i for i, field in enumerate(module.FIELDS)}
    return dict(sorted(errors.items(), key=lambda item: place.get(item[0], len(place))))


def run_calc(args: argparse.Namespace) -> int:
    from conductor_atlas.build import data_folders
    from conductor_atlas.derive import catalogue_of
    from conductor_atlas.load import load_dataset
    from conductor_atlas.core.calculators import CALCULATORS, calculate
    catalogue = catalogue_of(load_dataset(data_folders(args.data)))
    module = CALCULATORS[args.calculator]
    outcome = calculate(args.calculator, inputs_from(args), catalogue)
    outcome["errors"] = errors_in_form_order(module, outcome["errors"])
    if args.json:
        payload = {k: outcome[k] for k in ("calculator", "inputs", "results", "warnings", "errors", "sources",
                                           "material", "model")}
        payload["materials_used"] = [{"id": i, "name": n, "class": k, "note": note}
                                     for i, n, k, note in outcome["used"]]
        print(json.dumps(payload, ensure_ascii=False, indent=1))
        return 1 if outcome["errors"] else 0
    if outcome["errors"]:
        for field, message in outcome["errors"].items():
            print(f"conductor-atlas: calc {args.calculator}: {option_name(field)}: {message}", file=sys.stderr)
        return 1
    labels = dict(module.RESULT_LABELS)
    width = max([len(labels.get(k, k)) for k in outcome["results"]] + [len("Material")])
    title = module.TITLE + (f": {outcome['material']}" if outcome["material"] else "")
    print(title + (f" ({outcome['model']})" if outcome["model"] else ""))
    for material_id, name, klass, note in outcome["used"]:
        print(f"  {'Material'.ljust(width)}  {name} ({klass}, id {material_id})")
        if note:
            print(f"  {''.ljust(width)}  {note}")
    for name, result in outcome["results"].items():
        print(f"  {labels.get(name, name).ljust(width)}  {result['text']}")
    for warning in outcome["warnings"]:
        print(f"  warning: {warning}")
    print(f"  sources: {', '.join(outcome['sources'])}")
    print(f"  {module.CAUTION}")
    return 0
