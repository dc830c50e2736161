"""Calculator "skin-effect": skin depth, surface resistance and, for a size, the AC/DC ratio."""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import carriers as fe
from conductor_atlas.core import resistance as dc
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (keyed_record, add_error, add_result, add_sources, add_warning, check_finite_results,
                                          new_outcome)
from conductor_atlas.core.geometry import area_text
from conductor_atlas.core.calc_inputs import field_text, read_quantity, read_size
from conductor_atlas.core.calc_common import (frequency_beyond_dc_conductivity, material_at_temperature,
                                              recorded_mean_free_path, warn_if_anomalous)
from conductor_atlas.core.clad_layers import CLAD_BAR_MESSAGE, clad_layers_at, is_clad
from conductor_atlas.core.ac_layout import (ARRANGEMENT_HINT, ac_ratio_for, add_ratio_result, needs_live_solver as layout_needs_live_solver,
                                          parse_arrangement)
from conductor_atlas.core.material_models import MODEL_FIELD_INFO

NAME = "skin-effect"
TITLE = "Skin effect"
SUMMARY = "Skin depth, surface resistance and the AC/DC resistance ratio of a conductor at a frequency."
FIELDS = ["material", "frequency", "size", "arrangement", "temperature", "model"]
DEFAULTS = {"material": "IACS", "frequency": "50 Hz", "size": "240 mm2", "arrangement": "single",
            "temperature": "20 °C", "model": "auto"}
FIELD_INFO = {
    "material": ["Material", "id, alias or symbol, e.g. IACS, 1350, Cu, Fe"],
    "frequency": ["Frequency", "e.g. 50 Hz, 400 Hz, 100 kHz, 1 MHz"],
    "size": ["Cross-section (optional)", "e.g. 240 mm², 4/0 AWG, d 8 mm, 100 x 10 mm: adds the AC/DC ratio"],
    "arrangement": ["Arrangement", ARRANGEMENT_HINT],
    "temperature": ["Conductor temperature", "e.g. 20 °C, 90 degC, 363 K"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["skin_depth", "Skin depth δ"], ["surface_resistance", "Surface resistance (per square)"],
    ["ac_dc_ratio", "AC/DC resistance ratio"], ["ac_method", "AC method"], ["bar_share", "Current share per bar"],
    ["proximity_factor", "Proximity factor (pair over one wire alone)"], ["resistance", "DC resistance per metre (Ω/m)"],
    ["resistance_ac", "AC resistance per metre (Ω/m)"], ["depth_ratio", "Radius or half-thickness over δ"],
    ["area", "Cross-section"], ["resistivity", "Resistivity at temperature"], ["temperature", "Temperature"],
    ["mean_free_path", "Electron mean free path ℓ (estimate)"],
    ["path_ratio", "Mean free path over skin depth ℓ/δ"],
]
# optional input -> the results that need it: a problem in that field is shown under it and drops only
# these results (skin depth and surface resistance do not depend on the size)
AC_RESULTS = ["area", "resistance", "ac_dc_ratio", "ac_method", "bar_share", "proximity_factor", "resistance_ac",
              "depth_ratio"]
SIDE_FIELDS = {"size": AC_RESULTS, "arrangement": AC_RESULTS}
CAUTION = ("Straight conductors, with proximity only between the conductors of the arrangement given (a single "
           "conductor is taken as isolated): other nearby conductors, stranding, steel enclosures and magnetic "
           "armour raise the AC resistance further. A physics estimate, not a cable or busbar rating.")


# __pragma__ ('nokwargs')
def half_thickness(size):
    """The depth the current must reach from the surface: the radius, or half a bar's thickness [m].

    Examples
    --------
    >>> from conductor_atlas.core.geometry import parse_size
    >>> half_thickness(parse_size("100 x 10 mm")), half_thickness(parse_size("d 2 mm"))
    (0.005, 0.001)
    """
    if size["shape"] == "bar":
        return size["thickness"] / 2.0
    return size["diameter"] / 2.0


def calculate(inputs, catalogue):
    """Skin depth and AC resistance of a conductor at a frequency.

    Fields: material; frequency (> 0); size (optional, geometry.parse_size); arrangement
    (core.ac_layout: single, "3 bars, gap 10 mm", "pair, 30 mm"); temperature (default 20 °C);
    model. δ = sqrt(ρ / (π f μ0 μr)); R_s = ρ / δ (per square, for a conductor much thicker than
    δ); with a size: R_dc per metre = ρ / A (ρ / (n A) for n bars per phase), R_ac/R_dc by the exact
    Kelvin solution for round wire (or an area taken as round), the filament solver for bars,
    bar groups and go-and-return bar pairs, the exact multipole solution for a go-and-return pair
    of round wires (core.ac_layout), R_ac per metre = R_dc · ratio. A clad wire
    (core.clad_layers): δ and R_s of its cladding, the ratio by the exact two-layer solution (round only).
    """
    outcome = new_outcome(NAME, inputs)
    f = read_quantity(outcome, inputs, "frequency", "frequency", True)
    if f is not None and not (f > 0):
        add_error(outcome, "frequency", "must be greater than zero (at DC there is no skin effect)")
    opening = material_at_temperature(outcome, inputs, catalogue)
    size = None
    if len(field_text(inputs, "size")) > 0:
        # read after the opening: a bad size is shown under its field and drops only the AC/DC results
        size = read_size(outcome, inputs, "size")
    arrangement = ["single"]
    try:
        arrangement = parse_arrangement(field_text(inputs, "arrangement"), "arrangement")
    except CoreError as problem:
        add_error(outcome, "arrangement", problem.message)
        size = None  # no AC/DC ratio for an arrangement that was not understood
    if arrangement[0] != "single" and len(field_text(inputs, "size")) == 0:
        add_error(outcome, "size", "give the size for this arrangement, e.g. 100 x 10 mm (bars) or d 20 mm (a round pair)")
    if opening is None:
        return outcome
    m = opening[0]
    t = opening[1]
    rho = opening[2]
    mu_r = m["mu_r"]
    layers = clad_layers_at(outcome, m, t)
    where = ""
    if layers is not None:
        # the skin depth and surface resistance a clad wire's surface sees are its cladding's
        rho = layers[2]
        mu_r = layers[3]
        where = " in the " + layers[6] + " cladding"
        if size is not None and size["shape"] == "bar":
            add_error(outcome, "size", CLAD_BAR_MESSAGE)
            size = None
    if frequency_beyond_dc_conductivity(outcome, m, rho, f, "frequency"):
        return outcome
    if mu_r > 1.5:
        add_warning(outcome, "relative permeability of " + m["name"] + " is taken as " + format_number(mu_r, 3)
                    + "; in iron, steel and nickel it depends strongly on field strength, frequency and "
                      "temperature (and falls to 1 above the Curie point), so read δ and R_ac as rough")
    try:
        delta = skin.skin_depth(rho, f, mu_r)
        if not (delta > 0):
            raise CoreError("frequency is too high to compute a skin depth", "frequency")
        rs = skin.surface_resistance(rho, f, mu_r)
    except CoreError as problem:
        add_error(outcome, "frequency", problem.message)
        outcome["results"] = keyed_record()
        return outcome
    ratio = 0.0
    if size is not None:
        try:
            ratio = ac_ratio_for(outcome, size, arrangement, rho, f, mu_r, layers)
        except CoreError as problem:
            # a size or layout the AC/DC method cannot take at this frequency: δ and R_s still stand
            field = problem.field
            if field != "arrangement":
                field = "size"
            add_error(outcome, field, problem.message)
            size = None
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "resistivity", opening[2], "Ω·m", format_number(opening[2] * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "skin_depth", delta, "m", format_si(delta, "m", 4) + where)
    if len(m["mu_source"]) > 0:
        add_sources(outcome, [m["mu_source"]])
    add_result(outcome, "surface_resistance", rs, "Ω", format_si(rs, "Ω", 4) + " per square" + where)
    if size is not None:
        area = size["area"]
        if arrangement[0] == "bars":
            area = area * arrangement[1]  # the group: n bars in parallel
        r = dc.resistance(opening[2], 1.0, area)
        shown = area_text(size, area)
        if arrangement[0] == "bars":
            shown = format_number(area * 1e6, 4) + " mm² (" + str(arrangement[1]) + " bars of " + size["label"] + ")"
        add_result(outcome, "area", area, "m²", shown)
        add_result(outcome, "resistance", r, "Ω/m", format_si(r, "Ω", 4) + " per metre")
        add_ratio_result(outcome, ratio)
        add_result(outcome, "resistance_ac", r * ratio, "Ω/m", format_si(r * ratio, "Ω", 4) + " per metre")
        depth = half_thickness(size) / delta
        add_result(outcome, "depth_ratio", depth, "", format_number(depth, 4))
        if depth < 3.0:
            add_warning(outcome, "the surface resistance assumes a conductor much thicker than δ; here the current "
                                 "reaches the middle (radius or half-thickness is " + format_number(depth, 3)
                        + " δ), so use the AC resistance instead")
    mean_free_path_check(outcome, m, opening[2], t, delta)
    check_finite_results(outcome, "frequency")
    return outcome


def needs_live_solver(inputs, catalogue):
    """True when calculate(inputs, catalogue) would run a live solve (a bar size, or a go-and-return
    pair of round wires; core.ac_layout.needs_live_solver decides), so a page can wait for a pause in
    typing before it runs.
    The fields are read in the order that leaves most keystrokes after one or two cheap checks.

    Examples
    --------
    >>> catalogue = {"materials": {}, "aliases": {}}
    >>> needs_live_solver({"material": "IACS", "frequency": "50 Hz", "size": "d 20 mm"}, catalogue)
    False
    """
    if len(field_text(inputs, "size")) == 0:
        return False
    try:
        arrangement = parse_arrangement(field_text(inputs, "arrangement"), "arrangement")
    except CoreError:
        return False
    scratch = new_outcome(NAME, inputs)
    size = read_size(scratch, inputs, "size")
    if size is None or (size["shape"] != "bar" and arrangement[0] != "pair"):
        return False  # one round wire: a closed form (core.ac_layout)
    f = read_quantity(scratch, inputs, "frequency", "frequency", True)
    if f is None or not (f > 0):
        return False
    opening = material_at_temperature(scratch, inputs, catalogue)
    if opening is None or is_clad(opening[0]):
        return False
    if frequency_beyond_dc_conductivity(scratch, opening[0], opening[2], f, "frequency"):
        return False
    return layout_needs_live_solver(size, arrangement, opening[2], f, opening[0]["mu_r"], False)


def mean_free_path_check(outcome, m, rho, t, delta):
    """ℓ at t (the record's, scaled by ρ·ℓ = const; else the free-electron ℓ = ħk_F/(n e² ρ)) and ℓ/δ,
    with calc_common.warn_if_anomalous's warning.

    Examples
    --------
    Copper with ℓ = 39 nm on record at 20 °C (Gall 2016, Table 1: 39.9 nm; rounded here) at 1 GHz:
    δ = sqrt(ρ / (π f μ0)) = 2.0898 µm with scipy.constants.mu_0, so ℓ/δ = 0.01866 by hand, far
    below the anomalous-skin-effect warning's 0.3:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0,
    ...           "mean_free_path": 39e-9, "mean_free_path_t": 293.15, "mean_free_path_source": "gall2016",
    ...           "mean_free_path_how": "", "electron_density": 8.47e28}
    >>> outcome = new_outcome("example", {})
    >>> mean_free_path_check(outcome, copper, 1.7241e-8, 293.15, 2.0898e-6)
    >>> outcome["results"]["path_ratio"]["text"], outcome["warnings"]
    ('0.0187', [])
    """
    found = recorded_mean_free_path(m, rho, t)
    mfp = found[0]
    sources = []
    if len(m["mean_free_path_source"]) > 0:
        sources = [m["mean_free_path_source"]]
    how = "as recorded"
    if found[1] == "unscaled":
        how = "recorded, unscaled (no ρ model at its temperature)"
    elif m["mean_free_path_how"] == "rho-lambda":
        how = "ρ·ℓ on record ÷ ρ"
    elif found[1] == "scaled":
        how = "recorded, scaled by ρ·ℓ = const"
    if not (mfp > 0) and m["electron_density"] > 0:
        mfp = fe.mean_free_path(rho, m["electron_density"])
        how = "free-electron ħk_F/(n e² ρ)"
        sources = m["electron_density_sources"]
    if not (mfp > 0):
        return
    add_sources(outcome, sources)
    ratio = mfp / delta
    add_result(outcome, "mean_free_path", mfp, "m", format_si(mfp, "m", 3) + ", " + how)
    add_result(outcome, "path_ratio", ratio, "", format_number(ratio, 3))
    warn_if_anomalous(outcome, mfp, delta)
# __pragma__ ('kwargs')
