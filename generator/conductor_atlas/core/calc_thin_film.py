"""Calculator "thin-film": resistivity of a thin metal film from surface and grain-boundary scattering."""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import carriers as fe
from conductor_atlas.core import size_effect as sz
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (add_error, add_result, add_sources, add_warning, check_finite_results,
                                          new_outcome)
from conductor_atlas.core.calc_inputs import field_text, read_quantity, require_positive
from conductor_atlas.core.calc_common import (material_at_temperature, mean_free_path_origin, recorded_mean_free_path,
                                              recorded_mean_free_path_temperature)
from conductor_atlas.core.material_models import MODEL_FIELD_INFO

NAME = "thin-film"
TITLE = "Thin-film resistivity"
SUMMARY = ("Resistivity of a thin film from surface scattering (Fuchs–Sondheimer) and, with a reflection "
           "coefficient, grain-boundary scattering (Mayadas–Shatzkes).")
FIELDS = ["material", "thickness", "specularity", "grain_size", "reflection", "temperature", "mean_free_path",
          "model"]
DEFAULTS = {"material": "film-copper", "thickness": "20 nm", "specularity": "0", "grain_size": "",
            "reflection": "", "temperature": "20 °C", "mean_free_path": "", "model": "auto"}
FIELD_INFO = {
    "material": ["Material", "id, alias or symbol, e.g. film-copper, Cu, W, Ru"],
    "thickness": ["Film thickness", "e.g. 20 nm, 0.1 µm"],
    "specularity": ["Surface specularity p", "fraction reflected specularly, 0 to below 1, e.g. 0 (fully diffuse) "
                                             "or 0.5"],
    "grain_size": ["Grain size (optional)", "mean grain diameter, e.g. 30 nm; empty: equal to the thickness"],
    "reflection": ["Grain-boundary reflection R (optional)", "0 to below 1, e.g. 0.3; empty: no grain-boundary "
                                                             "scattering"],
    "temperature": ["Temperature", "e.g. 20 °C, 77 K"],
    "mean_free_path": ["Bulk mean free path (optional)", "e.g. 39 nm, at the film temperature; empty: from the "
                                                         "material's record"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["film_resistivity", "Film resistivity"], ["film_ratio", "Film over bulk resistivity"],
    ["sheet_resistance", "Sheet resistance"], ["resistivity", "Bulk resistivity at temperature"],
    ["mean_free_path", "Bulk mean free path used"], ["thickness_ratio", "Thickness over mean free path d/ℓ"],
    ["grain_parameter", "Grain-boundary parameter α"], ["temperature", "Temperature"],
]
CAUTION = ("Free-electron scattering models with one specularity for both surfaces and one reflection coefficient for "
           "all grain boundaries; surface roughness, liners and impurities in real films add more. Fit p and R to "
           "your own measurements before designing with them.")

# span of d/l (and of alpha) over which the integrals were checked against scipy (core.size_effect)
KAPPA_CHECKED = [1e-3, 1e3]
KAPPA_CHECKED_GRAINS = [1e-2, 1e2]
ALPHA_CHECKED = [1e-2, 10.0]
KAPPA_MIN = 1e-6  # below this d/l the graded panels no longer resolve the boundary layer
THICKNESS_MIN = 1e-10  # [m] below this the thickness is refused
ONE_LAYER = 2.0e-10  # [m] about one atomic layer: copper's (111) spacing a/√3 = 0.209 nm (a = 0.3615 nm, Kittel ch. 1)
# [m] below a few nm the film's roughness, its continuity and quantum confinement, none of which the
# models hold, set the resistivity: a caution from 5 nm down (common practice (no source))
FEW_NM = 5.0e-9


# __pragma__ ('nokwargs')
def read_fraction(outcome, inputs, field, what, default_text):
    """A ratio 0 <= x < 1 from ``field`` ("0.3" or "30 %"); None when empty and no default."""
    value = read_quantity(outcome, inputs, field, "ratio", False, default_text)
    if value is None:
        return None
    if not (value >= 0.0 and value < 1.0):
        add_error(outcome, field, what + " must be at least 0 and below 1 (e.g. 0.3 or 30 %)")
        return None
    return value


def bulk_mean_free_path(outcome, inputs, m, rho, t):
    """The bulk mean free path [m] at t [K] where the bulk ρ = rho [ohm*m]: typed, or the record's
    scaled by ρℓ = const (calc_common.recorded_mean_free_path), or the free-electron ħk_F/(n e² ρ).

    Examples
    --------
    Copper with no ℓ on record, n = 8.47e28 /m^3 (Ashcroft & Mermin Table 1.1): ħ (3π² n)^(1/3) /
    (n e² ρ) = 38.22 nm at 1.7241e-8 ohm*m with scipy.constants (Gall 2016 gives 39.9 nm); a typed
    value wins:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> copper = {"name": "copper", "mean_free_path": 0.0, "electron_density": 8.47e28,
    ...           "electron_density_sources": ["ashcroft-mermin"]}
    >>> outcome = new_outcome("example", {})
    >>> round(bulk_mean_free_path(outcome, {}, copper, 1.7241e-8, 293.15) * 1e9, 2)
    38.22
    >>> round(bulk_mean_free_path(outcome, {"mean_free_path": "40 nm"}, copper, 1.7241e-8, 293.15) * 1e9, 6)
    40.0
    """
    if len(field_text(inputs, "mean_free_path")) > 0:
        mfp = read_quantity(outcome, inputs, "mean_free_path", "length", True)
        if require_positive(outcome, "mean_free_path", mfp, "the mean free path"):
            return mfp
        return None
    found = recorded_mean_free_path(m, rho, t)
    if found[1] != "none" and len(m["mean_free_path_source"]) > 0:
        add_sources(outcome, [m["mean_free_path_source"]])
    if found[1] == "as recorded":
        return found[0]
    if found[1] != "none":
        which = ("the mean free path " + mean_free_path_origin(m) + " (" + format_si(m["mean_free_path"], "m", 3)
                 + " at " + temperature_text(recorded_mean_free_path_temperature(m)) + ")")
        if found[1] == "scaled":
            add_warning(outcome, which + " is scaled to the film temperature with ρ·ℓ held constant")
        else:
            add_warning(outcome, which + " is used unscaled: no resistivity model reaches that temperature")
        return found[0]
    if m["electron_density"] > 0:
        add_warning(outcome, "no mean free path is on record for " + m["name"] + "; using the free-electron value "
                             "ℓ = ħ k_F / (n e² ρ), which can be off by a factor of several for transition metals")
        add_sources(outcome, m["electron_density_sources"])
        return fe.mean_free_path(rho, m["electron_density"])
    add_error(outcome, "mean_free_path", "no mean free path is on record for " + m["name"]
              + "; enter the bulk mean free path (e.g. 39 nm for copper at 20 °C)")
    return None


def range_warnings(outcome, kappa, alpha, grains):
    span = KAPPA_CHECKED
    if grains:
        span = KAPPA_CHECKED_GRAINS
    if kappa < span[0] or kappa > span[1]:
        add_warning(outcome, "thickness over mean free path d/ℓ = " + format_number(kappa, 3) + " lies outside "
                    + format_number(span[0], 1) + " to " + format_number(span[1], 1)
                    + ", where the model's integral was checked")
    if grains and alpha > 0 and (alpha < ALPHA_CHECKED[0] or alpha > ALPHA_CHECKED[1]):
        add_warning(outcome, "grain-boundary parameter α = " + format_number(alpha, 3) + " lies outside "
                    + format_number(ALPHA_CHECKED[0], 1) + " to " + format_number(ALPHA_CHECKED[1], 1)
                    + ", where the model's integral was checked")


def calculate(inputs, catalogue):
    """Thin-film resistivity by Fuchs–Sondheimer, or the combined Mayadas–Shatzkes film model.

    Fields: material; thickness d; specularity p (0 <= p < 1, default 0); reflection R
    (optional, 0 <= R < 1: adds grain boundaries); grain_size D (default d); temperature;
    mean_free_path ℓ (optional; default the record's, scaled to the temperature with ρℓ
    constant, else the free-electron value); model (for the bulk ρ(T)).
    κ = d / ℓ; without R: ρ_f/ρ = fuchs_sondheimer_ratio(κ, p); with R: α = (ℓ/D) R/(1 − R),
    ρ_f/ρ = film_resistivity_ratio(κ, p, α) (core.size_effect). Sheet resistance ρ_f / d.
    """
    outcome = new_outcome(NAME, inputs)
    d = read_quantity(outcome, inputs, "thickness", "length", True)
    if require_positive(outcome, "thickness", d, "thickness") and d < THICKNESS_MIN:
        add_error(outcome, "thickness", "is thinner than one atomic layer (0.1 nm); the film models need a "
                                        "continuous film")
    if d is not None and d >= THICKNESS_MIN and d < ONE_LAYER:
        add_warning(outcome, "a film of " + format_si(d, "m", 3) + " is thinner than one atomic layer (about 0.2 nm: "
                    "the (111) layer spacing of copper is a/√3 = 0.209 nm with a = 0.3615 nm, Kittel, Introduction "
                    "to Solid State Physics, ch. 1): no continuous film and no film model holds")
    elif d is not None and d >= ONE_LAYER and d < FEW_NM:
        add_warning(outcome, "a film of " + format_si(d, "m", 3) + " is a few atomic layers thick: below about 5 nm its "
                    "roughness, whether it is continuous at all and quantum confinement set the resistivity, and the "
                    "film models hold none of them; read the result as an indication only and measure")
    p = read_fraction(outcome, inputs, "specularity", "specularity", "0")
    reflection = read_fraction(outcome, inputs, "reflection", "the reflection coefficient", "")
    grain = None
    if len(field_text(inputs, "grain_size")) > 0:
        grain = read_quantity(outcome, inputs, "grain_size", "length", True)
        if require_positive(outcome, "grain_size", grain, "grain size") and grain < ONE_LAYER:
            add_warning(outcome, "a grain of " + format_si(grain, "m", 3) + " is smaller than one atomic layer "
                        "(about 0.2 nm, as for the thickness): no crystal grain is that small; check the unit")
    opening = material_at_temperature(outcome, inputs, catalogue)
    if opening is None:
        return outcome
    m = opening[0]
    t = opening[1]
    rho = opening[2]
    mfp = bulk_mean_free_path(outcome, inputs, m, rho, t)
    if mfp is None:
        return outcome
    kappa = d / mfp
    if not (kappa > 0) or not (kappa - kappa == 0):
        add_error(outcome, "thickness", "thickness over mean free path is too extreme to compute with")
        return outcome
    if kappa < KAPPA_MIN:
        field = "thickness"
        if len(field_text(inputs, "mean_free_path")) > 0:
            field = "mean_free_path"
        add_error(outcome, field, "thickness over mean free path d/ℓ = " + format_number(kappa, 3) + " is below "
                  + format_number(KAPPA_MIN, 1) + ", beyond where the film integrals are computed reliably")
        return outcome
    alpha = 0.0
    try:
        if reflection is None:
            if grain is not None:
                add_warning(outcome, "the grain size is used only with a grain-boundary reflection coefficient R")
            ratio = sz.fuchs_sondheimer_ratio(kappa, p)
            outcome["model"] = outcome["model"] + "; Fuchs–Sondheimer surface scattering"
        else:
            if grain is None:
                grain = d
                add_warning(outcome, "grain size taken equal to the film thickness (columnar grains, a usual "
                                     "assumption for as-deposited films); enter it if known")
            alpha = sz.mayadas_shatzkes_alpha(mfp, grain, reflection)
            ratio = sz.film_resistivity_ratio(kappa, p, alpha)
            outcome["model"] = outcome["model"] + "; Mayadas–Shatzkes surface and grain-boundary scattering"
    except CoreError as problem:
        field = "thickness"
        if problem.field == "grain_size":
            field = "grain_size"
        add_error(outcome, field, problem.message)
        return outcome
    range_warnings(outcome, kappa, alpha, reflection is not None)
    rho_f = rho * ratio
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "resistivity", rho, "Ω·m", format_number(rho * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "mean_free_path", mfp, "m", format_si(mfp, "m", 4))
    add_result(outcome, "thickness_ratio", kappa, "", format_number(kappa, 4))
    if reflection is not None:
        add_result(outcome, "grain_parameter", alpha, "", format_number(alpha, 4))
    add_result(outcome, "film_ratio", ratio, "", format_number(ratio, 5, True))
    add_result(outcome, "film_resistivity", rho_f, "Ω·m", format_number(rho_f * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "sheet_resistance", rho_f / d, "Ω", format_si(rho_f / d, "Ω", 4) + " per square")
    check_finite_results(outcome, "thickness")
    return outcome
# __pragma__ ('kwargs')
