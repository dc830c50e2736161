"""Check what ``build`` derives from each material, so that data that passes ``check`` builds.

Run by ``load.load_dataset`` on every material that read without a problem. Two passes:
1. plausibility of the derived values the pages and calculators rest on, each reported on the
   field that causes it: the reference resistivity of the linear model (ρ moved to α's
   temperature), ρ at both ends of the model's span, the mean free path from ρ·ℓ, the
   conduction-electron density from density, molar mass and valence. Each must lie in the range
   ``schema.PROPERTIES`` gives for the quantity (a typo check, not a physics claim);
2. every derivation the build runs for a material page (``derive.derive_material``: the models,
   the fit and every table); a failure there becomes a problem line instead of a traceback.

Reads no file and writes nothing; returns "where: message" lines.
"""

from __future__ import annotations

import math

from conductor_atlas.core import resistance as dc
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.celsius import TWENTY_CELSIUS
from conductor_atlas.core.numfmt import temperature_text
from conductor_atlas.derive import (carrier_density, derive_material, linear_model, own_mean_free_path,
                                    reference_resistivity)
from conductor_atlas.model import Material
from conductor_atlas.schema import PROPERTIES

_DONE: dict[str, list[str]] = {}  # repr of a material -> its problems (the checks are pure)


def plausible(name: str, value: float) -> bool:
    spec = PROPERTIES[name]
    return math.isfinite(value) and spec.low <= value <= spec.high


def range_text(name: str) -> str:
    spec = PROPERTIES[name]
    return f"{spec.low:g} … {spec.high:g} {spec.unit}"


def linear_model_problems(m: Material, where: str) -> list[str]:
    """ρ_ref = ρ(T_ρ) / (1 + α (T_ρ − T_α)) and ρ(T) = ρ_ref [1 + α (T − T_α)] at both ends of the span."""
    alpha = m.get("temperature_coefficient")
    if alpha is None:
        return []
    rho, t_rho, _ = reference_resistivity(m)
    t_alpha = alpha.temperature or TWENTY_CELSIUS
    factor = 1.0 + alpha.si * (t_rho - t_alpha)
    field = f"{where}: properties.temperature_coefficient"
    if not factor > 0 or not plausible("resistivity", rho / factor):
        found = "not positive" if not factor > 0 else f"{rho / factor:g} ohm * m"
        return [f"{field}: with ρ given at {temperature_text(t_rho)} and α = {alpha.si:g} 1/K at {temperature_text(t_alpha)}, "
                f"1 + α·ΔT = {factor:g} and ρ at α's temperature is {found}, expected "
                f"{range_text('resistivity')}; give ρ and α at the same temperature, or check α"]
    model = linear_model(m)
    for end, t in (("valid_from", model.valid_from), ("valid_to", model.valid_to)):
        value = model.rho_ref * (1.0 + model.alpha * (t - model.t_ref))
        if not plausible("resistivity", value):
            iacs = f" ({dc.iacs_percent(value):.4g} %IACS)" if value > 0 else ""
            default = "" if model.span_sourced else " (the default span)"
            return [f"{field}.{end}: the linear model gives ρ = {value:g} ohm * m{iacs} at "
                    f"{temperature_text(t)}{default}, outside the plausible {range_text('resistivity')}; "
                    f"narrow valid_from … valid_to or check α"]
    return []


def carrier_problems(m: Material, where: str) -> list[str]:
    """ℓ = ρ·ℓ / ρ_ref and n = ρ_m N_A Z / M against the ranges of recorded values."""
    problems = []
    model = linear_model(m)
    rho, t_rho, _ = reference_resistivity(m)
    rho_ref, t_ref = (model.rho_ref, model.t_ref) if model else (rho, t_rho)
    mfp, _, _, how = own_mean_free_path(m, rho_ref, t_ref)
    if how == "rho-lambda" and not plausible("mean_free_path", mfp):
        problems.append(f"{where}: properties.rho_lambda: gives a mean free path ρ·ℓ / ρ = {mfp:g} m, outside "
                        f"the plausible {range_text('mean_free_path')}; check ρ·ℓ and the resistivity")
    n, n_how = carrier_density(m)
    if n_how == "computed" and not plausible("electron_density", n):
        problems.append(f"{where}: properties.valence: density × valence / molar mass gives {n:g} electrons "
                        f"per m³, outside the plausible {range_text('electron_density')}; check density, "
                        f"molar_mass and valence")
    return problems


def derivation_problems(m: Material, where: str) -> list[str]:
    """Run every derivation of the material's page; a failure is one problem line."""
    try:
        derive_material(m)
    except (CoreError, ArithmeticError, ValueError) as exc:
        return [f"{where}: cannot derive the page's tables from these values ({exc}); check the values "
                f"the file gives for this material"]
    return []


def material_problems(m: Material, where: str) -> list[str]:
    """Every problem of what the build would derive from ``m`` (empty when it builds)."""
    key = repr((m, where))
    if key not in _DONE:
        problems = linear_model_problems(m, where)
        problems = problems or carrier_problems(m, where)
        _DONE[key] = problems or derivation_problems(m, where)
    return list(_DONE[key])
