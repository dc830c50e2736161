"""Calculator "carriers": free-electron (Drude–Sommerfeld) quantities of a metal at a temperature."""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import carriers as fe
from conductor_atlas.core.constants import ELECTRON_VOLT
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (add_error, add_result, add_sources, add_warning, check_finite_results,
                                          new_outcome)
from conductor_atlas.core.calc_inputs import field_text, read_quantity, read_size
from conductor_atlas.core.calc_common import material_at_temperature, warn_if_fusing
from conductor_atlas.core.material_models import MODEL_FIELD_INFO

NAME = "carriers"
TITLE = "Conduction electrons"
SUMMARY = ("Free-electron density, relaxation time, mean free path, Fermi energy and velocity, mobility and drift "
           "velocity of a metal at its temperature.")
FIELDS = ["material", "temperature", "model", "current_density", "current", "size"]
DEFAULTS = {"material": "Cu", "temperature": "20 °C", "model": "auto", "current_density": "", "current": "",
            "size": ""}
FIELD_INFO = {
    "material": ["Material", "a metal with a tabulated conduction-electron density, e.g. Cu, Ag, Au, Al, Na"],
    "temperature": ["Temperature", "e.g. 20 °C, 77 K, 4.2 K"],
    "model": MODEL_FIELD_INFO,
    "current_density": ["Current density (optional)", "e.g. 4 A/mm²: adds the drift velocity"],
    "current": ["Current (optional)", "e.g. 16 A, with a cross-section instead of a current density"],
    "size": ["Cross-section (with a current)", "e.g. 2.5 mm², 12 AWG, d 1.6 mm"],
}
RESULT_LABELS = [
    ["electron_density", "Conduction-electron density n"], ["relaxation_time", "Relaxation time τ"],
    ["mean_free_path", "Mean free path ℓ = v_F τ"], ["fermi_velocity", "Fermi velocity v_F"],
    ["fermi_energy", "Fermi energy E_F"], ["fermi_wavenumber", "Fermi wave number k_F"],
    ["mobility", "Mobility μ = e τ / m"], ["rho_lambda", "ρ·ℓ product"],
    ["current_density", "Current density"], ["drift_velocity", "Drift velocity"],
    ["plasma_frequency", "Plasma frequency ν_p = ω_p / 2π"],
    ["thermal_conductivity_wf", "Electronic thermal conductivity (Wiedemann–Franz)"],
    ["resistivity", "Resistivity at temperature"], ["temperature", "Temperature"],
]
# optional inputs -> the results that need them (n, τ, ℓ ... do not depend on the current)
SIDE_FIELDS = {"current_density": ["current_density", "drift_velocity"], "current": ["current_density", "drift_velocity"],
               "size": ["current_density", "drift_velocity"]}
CAUTION = ("Free-electron estimates with the free-electron mass and σ = n e² τ / m: good to tens of percent for "
           "the alkali and noble metals, rough for transition metals whose Fermi surfaces are far from a sphere.")


# __pragma__ ('nokwargs')
def read_current_density(outcome, inputs):
    """J [A/m^2] from the current density field, or from current / area; None when neither is given."""
    has_j = len(field_text(inputs, "current_density")) > 0
    has_i = len(field_text(inputs, "current")) > 0
    if has_j and has_i:
        add_error(outcome, "current", "enter either a current density or a current with a cross-section, not both")
        return None
    if has_j:
        j = read_quantity(outcome, inputs, "current_density", "current_density", True)
        if j is not None and j < 0:
            add_error(outcome, "current_density", "must not be negative (enter the magnitude)")
            return None
        return j
    if not has_i:
        if len(field_text(inputs, "size")) > 0:
            add_warning(outcome, "the cross-section is used only together with a current")
        return None
    current = read_quantity(outcome, inputs, "current", "current", True)
    if len(field_text(inputs, "size")) == 0:
        add_error(outcome, "size", "is empty: a current needs a cross-section to give the current density")
        return None
    size = read_size(outcome, inputs, "size")
    if current is None or size is None:
        return None
    if current < 0:
        add_error(outcome, "current", "must not be negative (enter the magnitude)")
        return None
    warn_if_fusing(outcome, current, size["area"])
    return current / size["area"]


def check_electron_density(outcome, m):
    """The carrier quantities need the material's conduction-electron density."""
    if not (m["electron_density"] > 0):
        add_error(outcome, "material", "no conduction-electron density is on record for " + m["name"]
                  + "; choose a metal with one, e.g. Cu, Ag, Au, Al, Na")


def calculate(inputs, catalogue):
    """Free-electron carrier quantities of a metal from its tabulated n and its ρ(T).

    Fields: material (must carry a conduction-electron density); temperature (default 20 °C);
    model; current_density, or current with size (optional: drift velocity v_d = J / (n e)).
    τ = m / (n e² ρ); k_F = (3 π² n)^(1/3); E_F = ħ² k_F² / 2m; v_F = ħ k_F / m; ℓ = v_F τ;
    μ = e τ / m; ν_p = sqrt(n e² / (ε0 m)) / 2π; κ_WF = L0 T / ρ (core.carriers).
    """
    outcome = new_outcome(NAME, inputs)
    opening = material_at_temperature(outcome, inputs, catalogue, check_electron_density)
    # read after the opening: a problem here is shown under its field and drops only the drift results
    j = read_current_density(outcome, inputs)
    if opening is None:
        return outcome
    m = opening[0]
    t = opening[1]
    rho = opening[2]
    n = m["electron_density"]
    try:
        tau = fe.relaxation_time(rho, n)
        k_f = fe.fermi_wavenumber(n)
        e_f = fe.fermi_energy(n)
        v_f = fe.fermi_velocity(n)
        mfp = fe.mean_free_path(rho, n)
        mu = fe.mobility(tau)
        nu_p = fe.plasma_frequency_hz(n)
        kappa = fe.wiedemann_franz_thermal_conductivity(rho, t)
        rho_l = fe.rho_lambda_product(n)
    except CoreError as problem:
        add_error(outcome, "temperature", problem.message)
        return outcome
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "resistivity", rho, "Ω·m", format_number(rho * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "electron_density", n, "1/m³", format_number(n, 4) + " m⁻³")
    add_sources(outcome, m["electron_density_sources"])
    add_result(outcome, "relaxation_time", tau, "s", format_si(tau, "s", 4))
    add_result(outcome, "mean_free_path", mfp, "m", format_si(mfp, "m", 4))
    add_result(outcome, "fermi_velocity", v_f, "m/s", format_number(v_f / 1000.0, 4) + " km/s")
    add_result(outcome, "fermi_energy", e_f, "J", format_number(e_f / ELECTRON_VOLT, 4) + " eV")
    add_result(outcome, "fermi_wavenumber", k_f, "1/m", format_number(k_f * 1e-10, 4) + " Å⁻¹")
    add_result(outcome, "mobility", mu, "m²/(V·s)", format_number(mu * 1e4, 4) + " cm²/(V·s)")
    add_result(outcome, "rho_lambda", rho_l, "Ω·m²", format_number(rho_l * 1e16, 4) + "×10⁻¹⁶ Ω·m²")
    if j is not None:
        v_d = fe.drift_velocity(j, n)
        add_result(outcome, "current_density", j, "A/m²", format_number(j / 1e6, 4) + " A/mm²")
        add_result(outcome, "drift_velocity", v_d, "m/s", format_si(v_d, "m/s", 4))
    add_result(outcome, "plasma_frequency", nu_p, "Hz", format_number(nu_p / 1e15, 4) + " PHz")
    add_result(outcome, "thermal_conductivity_wf", kappa, "W/(m·K)", format_number(kappa, 4) + " W/(m·K)")
    if m["electron_density_how"] == "computed":
        add_warning(outcome, "the electron density of " + m["name"] + " is computed from its density, molar mass "
                             "and valence (n = Z ρ_m N_A / A), not tabulated")
    if m["mean_free_path"] > 0:
        at = ""
        if m["mean_free_path_t"] > 0:
            at = " at " + temperature_text(m["mean_free_path_t"])
        if len(m["mean_free_path_source"]) > 0:
            add_sources(outcome, [m["mean_free_path_source"]])
        add_warning(outcome, "the mean free path on record for " + m["name"] + " is " + format_si(m["mean_free_path"],
                    "m", 3) + at + "; the free-electron value above assumes a spherical Fermi surface")
    if t < 150.0:
        add_warning(outcome, "Wiedemann–Franz holds near and above the Debye temperature and at the lowest "
                             "temperatures; in between (here " + temperature_text(t) + ") inelastic scattering makes the "
                             "measured thermal conductivity of pure metals differ from L0 T / ρ")
    check_finite_results(outcome, "temperature")
    return outcome
# __pragma__ ('kwargs')
