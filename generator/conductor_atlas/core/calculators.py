"""The calculator registry: one list of calculator modules, in the order the site lists them.

Each calculator module defines NAME (its name in URLs and the command line), TITLE, SUMMARY, FIELDS,
DEFAULTS, FIELD_INFO, RESULT_LABELS, CAUTION and ``calculate(inputs, catalogue) -> outcome`` (see
core.outcome); adding a calculator is adding its module to CALCULATOR_MODULES (and a differential
case). The same functions serve the web forms (through the transpiled JS) and ``conductor-atlas
calc``. ``inputs`` maps field names to the text a person typed; ``catalogue`` is the calculators'
material catalogue (conductor_atlas.derive.calc_catalogue), and the material is chosen by the
"material" field (id, alias or chemical symbol). Bad input never raises: messages go under
outcome["errors"][field].
"""

from conductor_atlas.core.outcome import add_error, new_outcome
from conductor_atlas.core.ranges import add_material_range, add_permeability_range
from conductor_atlas.core import calc_resistance
from conductor_atlas.core import calc_resistivity
from conductor_atlas.core import calc_skin_effect
from conductor_atlas.core import calc_carriers
from conductor_atlas.core import calc_thin_film
from conductor_atlas.core import calc_temperature_rise
from conductor_atlas.core import calc_compare
from conductor_atlas.core import calc_sizing
from conductor_atlas.core import calc_measured_check
from conductor_atlas.core import calc_short_circuit

# everyday jobs first: the order of the calculator pages and lists
CALCULATOR_MODULES = [calc_resistance, calc_sizing, calc_temperature_rise, calc_measured_check,
                      calc_short_circuit, calc_resistivity, calc_compare,
                      calc_skin_effect, calc_carriers, calc_thin_film]

# calculators that carry the material's ρ range themselves (core.ranges does it for the others)
OWN_RANGES = ["measured-check"]

# name -> module
CALCULATORS = {}
for _module in CALCULATOR_MODULES:
    CALCULATORS[_module.NAME] = _module

# name -> needs_live_solver(inputs, catalogue) of the calculators that can run the filament solver
LIVE_SOLVER_CHECKS = {}
LIVE_SOLVER_CHECKS[calc_resistance.NAME] = calc_resistance.needs_live_solver
LIVE_SOLVER_CHECKS[calc_skin_effect.NAME] = calc_skin_effect.needs_live_solver

# name -> the fields a page sets for one throwaway update soon after it opens (warm_up_inputs): the
# calculators whose defaults never take the path that a bar size takes (arrangement, bar size, the
# tabulated grid), so that the first bar a person types does not also wait for that code to be made
# ready (in a browser, a path's first run costs several times its later runs)
WARM_UP_FIELDS = {}
WARM_UP_FIELDS[calc_resistance.NAME] = {"size": "100 x 10 mm", "frequency": "50 Hz"}
WARM_UP_FIELDS[calc_skin_effect.NAME] = {"size": "100 x 10 mm", "arrangement": "single"}


# __pragma__ ('nokwargs')
def calculator_names():
    """The registered names in alphabetical order."""
    names = []
    for key in CALCULATORS.keys():
        names.append(key)
    names.sort()
    return names


def calculate(name, inputs, catalogue):
    """Run calculator ``name``; an unknown name is reported under errors["calculator"]."""
    if not (name in CALCULATORS):
        outcome = new_outcome(name, inputs)
        add_error(outcome, "calculator", "unknown calculator “" + name + "”; choose one of: "
                  + ", ".join(calculator_names()))
        return outcome
    module = CALCULATORS[name]
    outcome = module.calculate(inputs, catalogue)
    if not (name in OWN_RANGES):
        add_material_range(outcome, module.calculate, inputs, catalogue)
    add_permeability_range(outcome, module.calculate, inputs, catalogue)
    return outcome


def needs_live_solver(name, inputs, catalogue):
    """True when calculate(name, inputs, catalogue) would run the live filament solver (tens to hundreds
    of ms on a tablet), decided before solving (core.ac_layout.needs_live_solver, through the
    calculator's own needs_live_solver): the page glue then runs that update after a pause in typing.
    The runs over the material's recorded ρ range (core.ranges) are not looked at: a range end that
    alone needs the solver is left to the glue's measured fallback.

    Examples
    --------
    >>> catalogue = {"materials": {}, "aliases": {}}
    >>> needs_live_solver("sizing", {}, catalogue), needs_live_solver("skin-effect", {"size": ""}, catalogue)
    (False, False)
    """
    if name in LIVE_SOLVER_CHECKS:
        return LIVE_SOLVER_CHECKS[name](inputs, catalogue)
    return False


def warm_up_inputs(name, inputs):
    """A copy of ``inputs`` with calculator ``name``'s WARM_UP_FIELDS over them, or None when it has
    none. A page runs them once, off the keystroke path (needs_live_solver, then calculate unless it
    would solve), and drops the outcome.

    Examples
    --------
    >>> warm_up_inputs("skin-effect", {"material": "IACS", "size": "240 mm2"})["size"]
    '100 x 10 mm'
    >>> warm_up_inputs("sizing", {"material": "IACS"}) is None
    True
    """
    if not (name in WARM_UP_FIELDS):
        return None
    fields = WARM_UP_FIELDS[name]
    out = {}
    for key in inputs.keys():
        out[key] = inputs[key]
    for key in fields.keys():
        out[key] = fields[key]
    return out
# __pragma__ ('kwargs')
