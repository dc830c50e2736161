"""The record every calculator returns, and the helpers that fill it.

    {"calculator": name, "material": id, "inputs": {field: text}, "results": {name: {"value": SI float,
     "unit": SI symbol, "text": what a person reads}}, "warnings": [str], "errors": {field: message},
     "sources": [source keys], "model": str, "used": [[id, name, class, note]]}

"used" names each material a result was computed for (pages and the terminal show it first);
its note says how a trade word was read ("" otherwise).

Bad input never raises out of a calculator: the message goes under errors[field] (the readers of
the fields are in core.calc_inputs).
"""


# Records read only by key (by the core, the page and JSON) are plain JS objects: the dict
# literals in this jsiter region are not Transcrypt dicts, whose eighteen hidden methods cost more
# to attach than the rest of storing a result (measured in node: dict creation was over a third of a
# thin-film update). In CPython they are ordinary dicts. Never call keys()/items() on them in the
# core: walk them with keys_of. "results" and "errors" are such records too (keyed_record).
# __pragma__ ('jsiter')
# __pragma__ ('nokwargs')
def keyed_record():
    """An empty record filled and read by key only ({} in CPython, a plain object in JS)."""
    return {}


def keys_of(record):
    """The keys of a keyed record, in the order they were stored (a list; in JS the loop is a
    plain for-in over the object's own keys, which this region gives)."""
    found = []
    for key in record:
        found.append(key)
    return found


def has_keys(record):
    """True when a keyed record holds anything (stops at the first key; builds no list)."""
    for key in record:
        return True
    return False


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
    outcome["results"] = keyed_record()
    outcome["errors"] = keyed_record()
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
    return has_keys(outcome["errors"])
# __pragma__ ('kwargs')


def check_finite_results(outcome, field, causes=None):
    """Turn any non-finite result into a message (no NaN or ∞ reaches a page), on the input that
    caused it: results are added in the order they are computed, so the first non-finite one
    names it through ``causes`` (result name -> input field; ``field`` for any result not listed).
    E.g. with a finite resistance, an infinite voltage drop comes from the current."""
    culprit = ""
    for key in keys_of(outcome["results"]):
        v = outcome["results"][key]["value"]
        if len(culprit) == 0 and not (v - v == 0):
            culprit = field
            if causes is not None and key in causes:
                culprit = causes[key]
    if len(culprit) > 0:
        outcome["results"] = keyed_record()
        add_error(outcome, culprit, "the inputs are too extreme to compute a finite result; check the values")
