"""Where the calculators find the AC part of the core, which registers itself here when it is imported.

The AC part is the resistance calculator's frequency results (core.calc_resistance_ac) and what they
rest on: core.ac_layout, the filament solver, the round-pair and two-layer solutions and the Kelvin
functions, about 20 kB of compressed script. Most readers of a material page never type a
frequency, so the page loads that part as a second script (static/calc-ac.js) only when the
resistance calculator first needs it. Until it is loaded the calculator leaves its AC results out and
says so (``mark_pending``: outcome["pending"] names the part; the page glue shows that it is loading
it and runs the update again once it is there). Its functions are found by name (``provide``,
``part_function``), so the pages still run the core's own code: the same Python as the terminal.

CPython imports the AC part together with the calculators (calc_resistance imports
calc_resistance_ac in a region the transpiler skips), so the command line and the tables always have
it and never see "pending". Pages that carry every calculator (calculator pages, compare) import the
part in their one script.
"""

AC = "ac"  # the AC part's name in outcome["pending"] (the page loads static/calc-ac.js)

_FUNCTIONS = {}  # name -> function, filled by the AC part's modules as they are imported


# __pragma__ ('nokwargs')
def provide(name, found):
    """Register ``found`` (a function) of the AC part under ``name`` (each AC module does so when imported).

    Examples
    --------
    >>> provide("example-square", lambda x: x * x)
    >>> part_function("example-square")(3.0)
    9.0
    """
    _FUNCTIONS[name] = found


def part_function(name):
    """The AC part's function ``name``, or None while the part is not loaded (only ever in a page).

    Examples
    --------
    >>> part_function("no-such-function") is None
    True
    """
    if name in _FUNCTIONS:
        return _FUNCTIONS[name]
    return None


def mark_pending(outcome):
    """Note in ``outcome`` that results were left out until the AC part is loaded: outcome["pending"]
    is "ac" (the page glue loads the part, says so, and runs the update again). Returns the outcome.

    Examples
    --------
    >>> outcome = mark_pending({"results": {}})
    >>> outcome["pending"]
    'ac'
    """
    outcome["pending"] = AC
    return outcome
# __pragma__ ('kwargs')
