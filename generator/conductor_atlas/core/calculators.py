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
# __pragma__ ('kwargs')
