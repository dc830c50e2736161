"""The calculator registry: name -> function(inputs, catalogue) -> outcome (see core.outcome).

The same functions serve the web forms (through the transpiled JS) and ``conductor-atlas calc``.
``inputs`` maps field names to the text a person typed; ``catalogue`` is the calculators'
material catalogue (conductor_atlas.derive.calc_catalogue), and the material is chosen by the
"material" field (id, alias or chemical symbol). Bad input never raises: messages go under
outcome["errors"][field].
"""

from conductor_atlas.core.outcome import add_error, new_outcome
from conductor_atlas.core import calc_resistance
from conductor_atlas.core import calc_resistivity
from conductor_atlas.core import calc_skin_effect
from conductor_atlas.core import calc_carriers
from conductor_atlas.core import calc_thin_film
from conductor_atlas.core import calc_temperature_rise
from conductor_atlas.core import calc_compare
from conductor_atlas.core import calc_sizing

# name -> module; each module defines TITLE, SUMMARY, FIELDS, DEFAULTS, FIELD_INFO, RESULT_LABELS,
# CAUTION and the calculate_* function registered below.
MODULES = {
    "resistance": calc_resistance,
    "resistivity": calc_resistivity,
    "skin-effect": calc_skin_effect,
    "carriers": calc_carriers,
    "thin-film": calc_thin_film,
    "temperature-rise": calc_temperature_rise,
    "compare": calc_compare,
    "sizing": calc_sizing,
}

CALCULATORS = {
    "resistance": calc_resistance.calculate_resistance,
    "resistivity": calc_resistivity.calculate_resistivity,
    "skin-effect": calc_skin_effect.calculate_skin_effect,
    "carriers": calc_carriers.calculate_carriers,
    "thin-film": calc_thin_film.calculate_thin_film,
    "temperature-rise": calc_temperature_rise.calculate_temperature_rise,
    "compare": calc_compare.calculate_compare,
    "sizing": calc_sizing.calculate_sizing,
}

CALCULATOR_FIELDS = {}
FIELD_DEFAULTS = {}
for _name in MODULES.keys():
    CALCULATOR_FIELDS[_name] = MODULES[_name].FIELDS
    FIELD_DEFAULTS[_name] = MODULES[_name].DEFAULTS


def calculator_names():
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
    return CALCULATORS[name](inputs, catalogue)
