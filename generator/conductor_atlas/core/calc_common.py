"""Steps shared by several calculators: pick the material, read temperature and model, get ρ."""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.lookup import find_material
from conductor_atlas.core.material_models import resistivity_at
from conductor_atlas.core.outcome import add_error, add_sources, add_warning, field_text, read_quantity


def read_material(outcome, inputs, catalogue, field):
    """The material named in ``field`` (or None, with errors[field] set)."""
    try:
        m = find_material(catalogue, field_text(inputs, field), field)
    except CoreError as problem:
        add_error(outcome, field, problem.message)
        return None
    add_sources(outcome, m["sources"])
    return m


def read_temperature(outcome, inputs, field):
    """Conductor temperature [K]; 20 °C when the field is empty."""
    t = read_quantity(outcome, inputs, field, "temperature", False, "20 °C")
    if t is not None and not (t > 0):
        add_error(outcome, field, "must be above absolute zero (−273.15 °C)")
        return None
    return t


def material_resistivity(outcome, m, t, inputs):
    """ρ of m at t [K] by the model asked in inputs["model"] ("auto" by default), or None."""
    model = field_text(inputs, "model")
    if len(model) == 0:
        model = "auto"
    try:
        found = resistivity_at(m, t, model)
    except CoreError as problem:
        field = problem.field
        if len(field) == 0:
            field = "temperature"
        add_error(outcome, field, problem.message)
        return None
    for w in found["warnings"]:
        add_warning(outcome, w)
    outcome["model"] = found["label"]
    return found["rho"]
