"""Answers with ranges: a calculator run again at the ends of the material's recorded ρ range.

A material record whose resistivity (or %IACS) has a min/max in the data carries rho_low_ratio and
rho_high_ratio (conductor_atlas.derive.calc_record: the ends as fractions of the recorded value).
``add_material_range`` runs the same calculator with the record's whole ρ(T) scaled to each end (the reference value, the sourced table, the Bloch–Grüneisen fit; a mean free path
taken from ρ·ℓ scales inversely) and gives each result that moves a "low" and a "high" beside its
"value", and its text the range. The range is taken to keep its relative width at every
temperature (the data give it at one temperature only); the outcome says so.

The runs at the ends change the catalogue's own record for their duration (``run_with``: the few
fields that move are set, then restored, also when the calculator raises) instead of copying the
record and the catalogue for each end: the copies cost about a fifth of a ranged update in node.
"""

from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.outcome import add_warning, has_keys, keys_of

RELATIVE_EPSILON = 1e-12  # a result that moves less than this between the runs has no range


# __pragma__ ('nokwargs')
def has_range(m):
    """True when the material record carries a recorded ρ range."""
    return m["rho_low_ratio"] > 0 and m["rho_high_ratio"] > 0


def rho_changes(m, ratio):
    """The changes that multiply material record m's ρ(T) by ``ratio`` everywhere and leave it no range
    of its own: [[record, key, new value], ...] (see ``run_with``)."""
    table = []
    for rho in m["table_rho"]:
        table.append(rho * ratio)
    layers = []
    for rho in m["cl_rho"]:
        layers.append(rho * ratio)
    changes = [[m, "rho_ref", m["rho_ref"] * ratio], [m, "table_rho", table], [m, "cl_rho", layers],
               [m, "bg_rho0", m["bg_rho0"] * ratio], [m, "bg_a", m["bg_a"] * ratio]]
    if m["mean_free_path_how"] == "rho-lambda":
        changes.append([m, "mean_free_path", m["mean_free_path"] / ratio])
    changes.append([m, "rho_low_ratio", 0.0])
    changes.append([m, "rho_high_ratio", 0.0])
    return changes


def scaled_record(m, ratio):
    """A copy of material record m with ρ(T) multiplied by ``ratio`` everywhere, and no range of its own."""
    out = {}
    for key in m.keys():
        out[key] = m[key]
    for change in rho_changes(m, ratio):
        out[change[1]] = change[2]
    return out


def run_with(calculate, inputs, catalogue, changes):
    """``calculate(inputs, catalogue)`` with each [record, key, value] of ``changes`` set in its record
    for the run; every changed field gets its value back afterwards, also when the run raises."""
    saved = []
    for change in changes:
        saved.append(change[0][change[1]])
        change[0][change[1]] = change[2]
    try:
        return calculate(inputs, catalogue)
    finally:
        i = len(changes) - 1
        while i >= 0:
            changes[i][0][changes[i][1]] = saved[i]
            i -= 1


def catalogue_with(catalogue, record):
    """A shallow copy of the catalogue whose record of record["id"] is ``record``."""
    materials = {}
    for key in catalogue["materials"].keys():
        materials[key] = catalogue["materials"][key]
    materials[record["id"]] = record
    out = {}
    for key in catalogue.keys():
        out[key] = catalogue[key]
    out["materials"] = materials
    return out


def differs(a, b):
    scale = abs(a)
    if abs(b) > scale:
        scale = abs(b)
    return abs(a - b) > RELATIVE_EPSILON * scale


def ranged_records(outcome, catalogue):
    """The records of the materials the outcome used (its "material" and every "used" entry, so both
    sides of a comparison) that carry a recorded ρ range."""
    ids = []
    if len(outcome["material"]) > 0:
        ids.append(outcome["material"])
    for entry in outcome["used"]:
        if not (entry[0] in ids):
            ids.append(entry[0])
    found = []
    for mid in ids:
        if mid in catalogue["materials"] and has_range(catalogue["materials"][mid]):
            found.append(catalogue["materials"][mid])
    return found


def permeability_holder(m):
    """The record whose μr range counts for m: m itself, or a clad wire's core; None without a range."""
    if m["mu_r_low"] > 0 and m["mu_r_high"] > 0:
        return m
    if m["layer_share"] > 0 and m["layer_core"]["mu_r_low"] > 0 and m["layer_core"]["mu_r_high"] > 0:
        return m["layer_core"]
    return None


def mu_changes(m, mu):
    """The changes that set μr = mu for m itself or for its core (a clad wire) and leave m no μr or ρ range
    of its own: [[record, key, new value], ...] (see ``run_with``)."""
    changes = []
    if m["mu_r_low"] > 0 and m["mu_r_high"] > 0:
        changes.append([m, "mu_r", mu])
    else:
        core = {}
        for key in m["layer_core"].keys():
            core[key] = m["layer_core"][key]
        core["mu_r"] = mu
        core["mu_r_low"] = 0.0
        core["mu_r_high"] = 0.0
        changes.append([m, "layer_core", core])
    changes.append([m, "mu_r_low", 0.0])
    changes.append([m, "mu_r_high", 0.0])
    changes.append([m, "rho_low_ratio", 0.0])
    changes.append([m, "rho_high_ratio", 0.0])
    return changes


def usable(outcome):
    """True when the outcome has results to give ranges to (an error under an optional field that
    drops only its own results, SIDE_FIELDS, leaves the others standing and ranged)."""
    return len(outcome["material"]) > 0 and has_keys(outcome["results"])


def new_problems(run, outcome):
    """True when a run at a range end has a problem the outcome itself does not have."""
    for key in keys_of(run["errors"]):
        if not (key in outcome["errors"]):
            return True
    return False


def add_permeability_range(outcome, calculate, inputs, catalogue):
    """Give the results that depend on μr its recorded range: the calculator run again with μr (of the
    material, or of a clad wire's core) at each end; low/high beside the value, the range in its text."""
    if not usable(outcome):
        return
    if not (outcome["material"] in catalogue["materials"]):
        return
    m = catalogue["materials"][outcome["material"]]
    holder = permeability_holder(m)
    if holder is None:
        return
    low = run_with(calculate, inputs, catalogue, mu_changes(m, holder["mu_r_low"]))
    high = run_with(calculate, inputs, catalogue, mu_changes(m, holder["mu_r_high"]))
    if new_problems(low, outcome) or new_problems(high, outcome):
        return
    moved = False
    for key in keys_of(outcome["results"]):
        if not (key in low["results"] and key in high["results"]):
            continue
        entry = outcome["results"][key]
        lo = entry
        hi = entry
        for end in [low["results"][key], high["results"][key]]:
            if end["value"] < lo["value"]:
                lo = end
            if end["value"] > hi["value"]:
                hi = end
        if not (differs(lo["value"], entry["value"]) or differs(hi["value"], entry["value"])):
            continue
        moved = True
        if not ("low" in entry) or lo["value"] < entry["low"]:
            entry["low"] = lo["value"]
        if not ("high" in entry) or hi["value"] > entry["high"]:
            entry["high"] = hi["value"]
        entry["text"] = (entry["text"] + " (μr " + format_number(holder["mu_r_low"], 4) + " – "
                         + format_number(holder["mu_r_high"], 4) + ": " + lo["text"] + " – " + hi["text"] + ")")
    if moved:
        add_warning(outcome, "μr of " + holder["name"] + " is recorded as " + format_number(holder["mu_r"], 4)
                    + " within " + format_number(holder["mu_r_low"], 4) + " – " + format_number(holder["mu_r_high"], 4)
                    + " (it depends on the field at the surface, i.e. on the current, and saturates): each result "
                      "that depends on it shows the answers at both ends of that range")


def end_changes(records):
    """The changes (``run_with``) for every combination of the records' range ends (2 per record: 2, or
    4 for a comparison of two ranged materials), the first record's low end first. Results are
    monotonic in each ρ, so their extremes lie at these corners."""
    out = [[]]
    for m in records:
        moved = []
        for each in out:
            for ratio in [m["rho_low_ratio"], m["rho_high_ratio"]]:
                corner = []
                corner.extend(each)
                corner.extend(rho_changes(m, ratio))
                moved.append(corner)
        out = moved
    return out


def add_material_range(outcome, calculate, inputs, catalogue):
    """Give the outcome's results the low and high of the used materials' ρ ranges (see the module
    docstring). ``calculate(inputs, catalogue)`` is the calculator that made ``outcome``.
    """
    if not usable(outcome):
        return
    records = ranged_records(outcome, catalogue)
    if len(records) == 0:
        return
    runs = []
    for changes in end_changes(records):
        run = run_with(calculate, inputs, catalogue, changes)
        if new_problems(run, outcome):
            add_warning(outcome, "the recorded range of ρ could not be carried through: at one of its ends the "
                                 "calculation has no answer")
            return
        runs.append(run)
    moved = False
    for key in keys_of(outcome["results"]):
        entry = outcome["results"][key]
        lo = entry
        hi = entry
        complete = True
        for run in runs:
            if not (key in run["results"]):
                complete = False
                continue
            end = run["results"][key]
            if end["value"] < lo["value"]:
                lo = end
            if end["value"] > hi["value"]:
                hi = end
        if not complete:
            continue
        if not (differs(lo["value"], entry["value"]) or differs(hi["value"], entry["value"])):
            continue
        moved = True
        entry["low"] = lo["value"]
        entry["high"] = hi["value"]
        entry["text"] = entry["text"] + " (range " + lo["text"] + " – " + hi["text"] + ")"
    if moved:
        for m in records:
            add_warning(outcome, "ρ of " + m["name"] + " has a recorded range (" + format_number(m["rho_low_ratio"], 4)
                        + " to " + format_number(m["rho_high_ratio"], 4) + " × the nominal value): each result "
                        "that depends on it shows low – high, computed at the range's ends, which are taken to keep "
                        "their relative width at every temperature")
# __pragma__ ('kwargs')
