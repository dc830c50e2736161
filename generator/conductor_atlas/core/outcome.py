"""The record every calculator returns, and the helpers that fill it.

    {"calculator": name, "material": id, "inputs": {field: text}, "results": {name: {"value": SI float,
     "unit": SI symbol, "text": what a person reads}}, "warnings": [str], "errors": {field: message},
     "sources": [source keys], "model": str, "used": [[id, name, class, note]]}

"used" names each material a result was computed for (pages and the terminal show it first);
its note says how a trade word was read ("" otherwise).

Bad input never raises out of a calculator: the message goes under errors[field].
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.units import parse_quantity, point_reading_note, portable_text
from conductor_atlas.core.numfmt import format_fixed


# Records read only by key (by the core, the page and JSON) are plain JS objects: the dict
# literals in this jsiter region are not Transcrypt dicts, whose eighteen hidden methods cost more
# to attach than the rest of storing a result (measured in node: dict creation was over a third of a
# thin-film update). In CPython they are ordinary dicts. Never call keys()/items() on them in the
# core: "results" and "errors", which the core walks with keys(), stay Transcrypt dicts.
# __pragma__ ('jsiter')
def keyed_record():
    """An empty record filled and read by key only ({} in CPython, a plain object in JS)."""
    return {}


def outcome_record(name, inputs):
    """The outcome's own record; "results" and "errors" are set by new_outcome."""
    return {"calculator": name, "material": "", "inputs": inputs, "results": None, "warnings": [],
            "errors": None, "sources": [], "model": "", "used": []}


def result_entry(value, unit, text):
    """{"value": SI float, "unit": SI symbol, "text": what a person reads}."""
    return {"value": value, "unit": unit, "text": text}
# __pragma__ ('nojsiter')


def new_outcome(name, inputs):
    """An empty outcome for calculator ``name`` with a copy of the inputs."""
    copied = keyed_record()
    for key in inputs.keys():
        copied[key] = inputs[key]
    outcome = outcome_record(name, copied)
    outcome["results"] = {}
    outcome["errors"] = {}
    return outcome


def add_result(outcome, name, value, unit, text):
    """Store one result (SI value, SI unit symbol, text a person reads)."""
    outcome["results"][name] = result_entry(value, unit, text)


def add_material_used(outcome, m, note):
    """Name material record ``m`` among those the results use (once), with ``note`` ("" for none)."""
    for entry in outcome["used"]:
        if entry[0] == m["id"]:
            return
    outcome["used"].append([m["id"], m["name"], m["klass"].replace("-", " "), note])


def add_error(outcome, field, message):
    """Record the first problem of a field (later ones for the same field are dropped)."""
    if not (field in outcome["errors"]):
        outcome["errors"][field] = message


def add_warning(outcome, message):
    for existing in outcome["warnings"]:
        if existing == message:
            return
    outcome["warnings"].append(message)


def add_sources(outcome, keys):
    for key in keys:
        seen = False
        for existing in outcome["sources"]:
            if existing == key:
                seen = True
        if not seen:
            outcome["sources"].append(key)


def has_errors(outcome):
    return len(outcome["errors"].keys()) > 0


def field_text(inputs, field):
    """The text typed in ``field``, or "" when the field is absent or empty."""
    if field in inputs:
        value = inputs[field]
        if value is None:
            return ""
        return portable_text(str(value))
    return ""


def read_quantity(outcome, inputs, field, kind, required, default_text=""):
    """Parse one field as a quantity of ``kind``; on failure record errors[field], return None.

    An empty optional field gives None with no error; an empty field with ``default_text``
    is read as that text.
    """
    text = field_text(inputs, field)
    if len(text) == 0:
        if len(default_text) > 0:
            text = default_text
        elif not required:
            return None
    try:
        value = parse_quantity(text, kind, field)
    except CoreError as problem:
        add_error(outcome, field, problem.message)
        return None
    note_point_reading(outcome, text, field)
    return value


def note_point_reading(outcome, text, field):
    """Say so when ``text`` was read with a decimal point before three digits ("1.500 m" is 1.5 m,
    1500 m to a reader of the thousands-point convention): units.point_reading_note."""
    note = point_reading_note(text, field)
    if len(note) > 0:
        add_warning(outcome, note)


def require_positive(outcome, field, value, what):
    """Record an error when a parsed value is not > 0; return True when it is fine."""
    if value is None:
        return False
    if not (value > 0):
        add_error(outcome, field, what + " must be greater than zero")
        return False
    return True


def check_finite_results(outcome, field, causes=None):
    """Turn any non-finite result into a message (no NaN or ∞ reaches a page), on the input that
    caused it: results are added in the order they are computed, so the first non-finite one
    names it through ``causes`` (result name -> input field; ``field`` for any result not listed).
    E.g. with a finite resistance, an infinite voltage drop comes from the current."""
    culprit = ""
    for key in outcome["results"].keys():
        v = outcome["results"][key]["value"]
        if len(culprit) == 0 and not (v - v == 0):
            culprit = field
            if causes is not None and key in causes:
                culprit = causes[key]
    if len(culprit) > 0:
        outcome["results"] = {}
        add_error(outcome, culprit, "the inputs are too extreme to compute a finite result; check the values")


def kelvin_text(t):
    """A temperature in K as text a person reads: "90.0 °C (363.15 K)"."""
    return format_fixed(t - 273.15, 1) + " °C (" + format_fixed(t, 2) + " K)"
