"""Calculator "resistivity": ρ, σ, %IACS and the local temperature coefficient at a temperature."""

from conductor_atlas.core import resistance as dc
from conductor_atlas.core.numfmt import format_number, temperature_text
from conductor_atlas.core.outcome import add_result, check_finite_results, new_outcome
from conductor_atlas.core.calc_inputs import field_text
from conductor_atlas.core.calc_common import material_at_temperature
from conductor_atlas.core.material_models import MODEL_FIELD_INFO, local_temperature_coefficient

NAME = "resistivity"
TITLE = "Resistivity at a temperature"
SUMMARY = "Resistivity, conductivity, %IACS and the local temperature coefficient by the model that fits."
FIELDS = ["material", "temperature", "model"]
DEFAULTS = {"material": "Cu", "temperature": "20 °C", "model": "auto"}
FIELD_INFO = {
    "material": ["Material", "id, alias or symbol, e.g. Cu, Ag, 1350, Pt385"],
    "temperature": ["Temperature", "e.g. 20 °C, 77 K, 600 °C"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["resistivity", "Resistivity"], ["conductivity", "Conductivity"], ["iacs_percent", "Conductivity (%IACS)"],
    ["temperature_coefficient", "Local temperature coefficient"], ["temperature", "Temperature"],
]
CAUTION = "Values follow the named model and its sources; outside a model's range the result carries a warning."

# __pragma__ ('nokwargs')
def calculate(inputs, catalogue):
    """Resistivity of a material at a temperature by the model that fits there.

    Results: resistivity [ohm*m], conductivity [S/m], iacs_percent (100·ρ_IACS/ρ, comparing at the
    given temperature against annealed copper at 20 °C), temperature_coefficient: the local
    α(T) = (dρ/dT)/ρ(T) by material_models.local_temperature_coefficient (none when only a
    reference value is on record).
    """
    outcome = new_outcome(NAME, inputs)
    opening = material_at_temperature(outcome, inputs, catalogue)
    if opening is None:
        return outcome
    m = opening[0]
    t = opening[1]
    rho = opening[2]
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "resistivity", rho, "Ω·m", format_number(rho * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "conductivity", 1.0 / rho, "S/m", format_number(1e-6 / rho, 4) + " MS/m")
    add_result(outcome, "iacs_percent", dc.iacs_percent(rho), "%", format_number(dc.iacs_percent(rho), 4) + " %IACS")
    alpha = local_temperature_coefficient(m, t, field_text(inputs, "model"))[0]
    if alpha is not None:
        add_result(outcome, "temperature_coefficient", alpha, "1/K", format_number(alpha, 4) + " /K")
    check_finite_results(outcome, "temperature")
    return outcome
# __pragma__ ('kwargs')

