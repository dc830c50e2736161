"""Calculator "measured-check": a measured conductor resistance against the material and the standard."""

from conductor_atlas.core import conformance as cf
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.numfmt import format_fixed, format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (keyed_record, add_error, add_result, add_sources, add_warning, check_finite_results,
                                          has_errors, new_outcome)
from conductor_atlas.core.calc_inputs import field_text, read_quantity, read_size, require_positive
from conductor_atlas.core.calc_common import material_at_temperature, material_resistivity
from conductor_atlas.core.material_models import MODEL_FIELD_INFO

NAME = "measured-check"
TITLE = "Measured resistance against the material and the standard"
SUMMARY = ("Corrects a measured conductor resistance to 20 °C and judges it against the material's data and the "
           "conductor standard's maximum (IEC 60228 classes 1, 2, 5, 6; AWG sizes against the material only).")
FIELDS = ["material", "resistance", "temperature", "length", "size", "conductor_class", "model"]
DEFAULTS = {"material": "IACS", "resistance": "0.736 ohm", "temperature": "23.5 °C", "length": "100 m",
            "size": "2.5 mm2", "conductor_class": "2", "model": "auto"}
FIELD_INFO = {
    "material": ["Material", "id, alias or symbol, e.g. IACS, 1350, tinned copper"],
    "resistance": ["Measured resistance", "e.g. 0.736 Ω, 73.6 mΩ: the whole sample, four-wire"],
    "temperature": ["Conductor temperature at the measurement", "e.g. 23.5 °C: the conductor's, not just the room's"],
    "length": ["Sample length", "e.g. 100 m, 1.5 m, 328 ft"],
    "size": ["Nominal size", "e.g. 2.5 mm², 95 mm², 12 AWG (solid), d 1.6 mm"],
    "conductor_class": ["IEC 60228 class", "1 solid, 2 stranded, 5 flexible, 6 very flexible; empty: no class "
                                           "check (AWG sizes are solid wire, ASTM B258)"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["verdict", "Against the standard's maximum"], ["resistance_20", "Resistance at 20 °C"],
    ["resistance_per_km_20", "Per kilometre at 20 °C"], ["limit_per_km", "Standard's maximum at 20 °C"],
    ["expected_per_km", "What the material gives (ρ20 / A)"], ["deviation", "Against the material"],
    ["correction_factor", "Correction factor to 20 °C"], ["annex_factor", "IEC 60228 Annex B factor (check)"],
    ["resistivity_20", "Resistivity at 20 °C (material)"], ["temperature", "Measurement temperature"],
]
CAUTION = ("A check of one sample against the data shown, not a certificate: a test report follows the product "
           "standard's own method (four-wire measurement, conductor temperature, length) and its full table.")

CLASSES = ["1", "2", "5", "6"]
# Shortest sample we correct without a warning: IEC 60228 Annex A measures the conductor resistance
# on a length of at least 1 m (from memory of the annex).
MIN_SAMPLE_LENGTH = 1.0  # [m]
# Our rule for trusting the correction to 20 °C: within 20 ± 10 °C. Beyond, an α uncertain by 3 %
# (the spread between annealed and hard-drawn copper, 0.00393 and 0.00381 /K) moves R20 by more
# than 0.1 %; the warning gives that estimate for the actual temperature.
TRUSTED_SPAN = 10.0  # [K]
ALPHA_SPREAD = 0.03  # [-]


# __pragma__ ('nokwargs')
def read_class(outcome, inputs):
    """The IEC 60228 class ("1", "2", "5", "6"), "" when empty, None when wrong (errors set)."""
    text = field_text(inputs, "conductor_class").strip()
    if len(text) == 0:
        return ""
    if text.lower().find("class") == 0:
        text = text[5:].strip()
    for klass in CLASSES:
        if text == klass:
            return klass
    add_error(outcome, "conductor_class", "“" + text + "” is not an IEC 60228 class: enter 1, 2, 5 or 6, or leave "
                                          "it empty")
    return None


def metal_of(m, catalogue):
    """"copper" or "aluminium" when a standard's column lists the material, else ""."""
    for table in catalogue["limits"]:
        for mid in table["materials"]:
            if mid == m["id"]:
                if table["conductor"].find("copper") >= 0:
                    return "copper"
                if table["conductor"].find("aluminium") >= 0:
                    return "aluminium"
    return ""


def limit_table(catalogue, m, klass):
    """The limit table of class ``klass`` whose column lists material m, or None."""
    for table in catalogue["limits"]:
        if table["klass"] == klass:
            for mid in table["materials"]:
                if mid == m["id"]:
                    return table
    return None


def mm2_text(area):
    return format_number(area * 1e6, 4) + " mm²"


def per_km_text(r_per_m):
    return format_number(r_per_m * 1000.0, 4) + " Ω/km"


def standard_limit(outcome, catalogue, m, size, klass):
    """[limit [ohm/m], text naming the limit and its table] for the size, or None (with a warning why)."""
    if size["label"].find(" AWG") > 0:
        if len(klass) > 0 and klass != "1":
            add_warning(outcome, "AWG sizes are checked as solid round wire (ASTM B258); class " + klass
                        + " does not apply to them")
        add_sources(outcome, ["astm-b258"])
        # a maximum made from the nominal diameter would fail a wire 0.02 % over it, while the wire's
        # product standard allows a diameter tolerance: no verdict without that standard's own limit
        add_warning(outcome, "ASTM B258 gives the nominal diameter of " + size["label"] + ", not a resistance "
                             "limit, so there is no PASS/FAIL here: the sample is compared with the material at "
                             "that diameter; judge conformance by the wire's product standard (e.g. ASTM B3 for "
                             "soft copper wire: its resistivity limit and diameter tolerance)")
        return None
    if len(klass) == 0:
        add_warning(outcome, "no IEC 60228 class given: the sample is judged against the material only")
        return None
    if size["shape"] != "area":
        add_warning(outcome, "IEC 60228 lists conductors by nominal cross-section (e.g. 2.5 mm²); a "
                    + size["shape"] + " size has no row: the sample is judged against the material only")
        return None
    table = limit_table(catalogue, m, klass)
    if table is None:
        add_warning(outcome, "IEC 60228 class " + klass + " has no column for " + m["name"] + " (it covers "
                    "annealed plain or metal-coated copper and aluminium): the sample is judged against the "
                    "material only")
        return None
    row = cf.nominal_row(table["areas"], size["area"])
    if row < 0:
        near = cf.neighbour_rows(table["areas"], size["area"])
        words = ""
        if near[0] > 0:
            words = mm2_text(near[0])
        if near[1] > 0:
            if len(words) > 0:
                words = words + " or "
            words = words + mm2_text(near[1])
        add_error(outcome, "size", mm2_text(size["area"]) + " is not a nominal size of " + table["locator"]
                  + " in " + table["title"] + "; nearest: " + words)
        return None
    add_sources(outcome, [table["source"]])
    text = table["title"] + ", " + table["locator"]
    if len(table["note"]) > 0:
        text = text + " (" + table["note"] + ")"
    return [table["limits"][row], text]


def calculate(inputs, catalogue):
    """A measured resistance corrected to 20 °C and judged against the material and the standard.

    Fields: material; resistance (measured R_t over the sample); temperature t (conductor, at the
    measurement); length L (sample); size (nominal: mm² for IEC 60228, AWG for ASTM B258 solid
    wire, or a diameter/bar for the material check only); conductor_class (IEC 60228 1, 2, 5, 6);
    model (the material's temperature model).
    k = ρ(20 °C)/ρ(t); R20 = k R_t; R'20 = R20 / L; expected R'20 = ρ20 / A (low–high where the
    material's ρ has a range); margin = (R'max − R'20)/R'max against the standard's maximum.
    Check for copper and aluminium: k_t = (β + 20)/(β + t), IEC 60228 Annex B.
    """
    outcome = new_outcome(NAME, inputs)
    r_t = read_quantity(outcome, inputs, "resistance", "resistance", True)
    require_positive(outcome, "resistance", r_t, "the measured resistance")
    sample = read_quantity(outcome, inputs, "length", "length", True)
    require_positive(outcome, "length", sample, "the sample length")
    size = read_size(outcome, inputs, "size")
    klass = read_class(outcome, inputs)
    opening = material_at_temperature(outcome, inputs, catalogue)
    if opening is None:
        return outcome
    m = opening[0]
    t = opening[1]
    try:
        judge(outcome, inputs, catalogue, m, r_t, t, opening[2], sample, size, klass)
    except CoreError as problem:
        field = problem.field
        if not (field in FIELDS) or field == "material":
            field = "resistance"
        add_error(outcome, field, problem.message)
    if has_errors(outcome):
        outcome["results"] = keyed_record()
    return outcome


def judge(outcome, inputs, catalogue, m, r_t, t, rho_t, sample, size, klass):
    """calculate once the inputs are read (ρ_t at the measurement): fills the results (CoreError for the
    impossible)."""
    rho_20 = material_resistivity(outcome, m, cf.REFERENCE_TEMPERATURE, inputs)
    if rho_20 is None:
        return
    k = cf.correction_factor(rho_20, rho_t)
    r_20 = k * r_t
    per_m = cf.resistance_per_length(r_20, sample)
    area = size["area"]
    expected = rho_20 / area
    has_range = m["rho_low_ratio"] > 0 and m["rho_high_ratio"] > 0
    found = standard_limit(outcome, catalogue, m, size, klass)
    if has_errors(outcome):
        return
    # each number is formatted once, however many results quote it
    per_m_text = per_km_text(per_m)
    expected_per_km_text = per_km_text(expected)
    if found is not None:
        limit = found[0]
        limit_text = per_km_text(limit)
        margin = cf.margin_to_limit(per_m, limit)
        verdict = "PASS"
        how = format_fixed(margin * 100.0, 2) + " % below"
        if margin < 0:
            verdict = "FAIL"
            how = format_fixed(-margin * 100.0, 2) + " % above"
        add_result(outcome, "verdict", margin, "", verdict + ": " + per_m_text + " is " + how + " the maximum "
                   + limit_text + " of " + found[1])
        add_result(outcome, "limit_per_km", limit * 1000.0, "Ω/km", limit_text + " (" + found[1] + ")")
    add_result(outcome, "resistance_20", r_20, "Ω", format_si(r_20, "Ω", 4))
    add_result(outcome, "resistance_per_km_20", per_m * 1000.0, "Ω/km", per_m_text)
    expected_text = expected_per_km_text + " for " + m["name"] + " at " + mm2_text(area)
    deviation = cf.relative_deviation(per_m, expected)
    deviation_text = signed_percent(deviation) + " against " + expected_per_km_text
    if has_range:
        low = expected * m["rho_low_ratio"]
        high = expected * m["rho_high_ratio"]
        add_result(outcome, "expected_per_km", expected * 1000.0, "Ω/km", expected_text + " (range "
                   + per_km_text(low) + " – " + per_km_text(high) + ", from the material's recorded range)")
        outcome["results"]["expected_per_km"]["low"] = low * 1000.0
        outcome["results"]["expected_per_km"]["high"] = high * 1000.0
        if per_m > high:
            deviation_text = deviation_text + "; " + signed_percent(cf.relative_deviation(per_m, high)) \
                + " above the high end of the material's range"
        elif per_m < low:
            deviation_text = deviation_text + "; " + signed_percent(cf.relative_deviation(per_m, low)) \
                + " below the low end of the material's range"
        else:
            deviation_text = deviation_text + "; inside the material's range"
    else:
        add_result(outcome, "expected_per_km", expected * 1000.0, "Ω/km", expected_text)
    add_result(outcome, "deviation", deviation, "", deviation_text)
    if deviation > IMPLAUSIBLE_DEVIATION or deviation < -IMPLAUSIBLE_DEVIATION:
        add_warning(outcome, "the sample is " + signed_percent(deviation) + " off what " + m["name"] + " gives for this "
                    "size: check the material, the length, the size and the unit of the resistance before judging")
    add_result(outcome, "correction_factor", k, "", format_number(k, 6) + " (ρ20/ρt, " + outcome["model"] + ")")
    metal = metal_of(m, catalogue)
    if len(metal) > 0:
        beta = cf.IEC60228_BETA_COPPER
        if metal == "aluminium":
            beta = cf.IEC60228_BETA_ALUMINIUM
        try:
            kt = cf.iec60228_correction_factor(t, beta)
            add_result(outcome, "annex_factor", kt, "", format_number(kt, 6) + " for " + metal + " (β = "
                       + format_number(beta, 4) + "); the material's own model differs by "
                       + signed_small_percent(cf.relative_deviation(k, kt)))
            add_sources(outcome, ["iec60228"])
        except CoreError:
            add_warning(outcome, "IEC 60228 Annex B's factor does not reach this temperature")
    add_result(outcome, "resistivity_20", rho_20, "Ω·m", format_number(rho_20 * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    warn_about_sample(outcome, m, size, sample, t, klass)
    check_finite_results(outcome, "resistance")


def signed_percent(x):
    """+2.15 % / −0.40 % from a fraction."""
    if x < 0:
        return "−" + format_fixed(-x * 100.0, 2) + " %"
    return "+" + format_fixed(x * 100.0, 2) + " %"


def signed_small_percent(x):
    """A small relative difference as a percentage with two significant digits: +0.0025 %."""
    if x < 0:
        return "−" + format_number(-x * 100.0, 2) + " %"
    return "+" + format_number(x * 100.0, 2) + " %"


# Beyond this deviation from the material's ρ20 / A the inputs, not the conductor, are the likelier
# cause (our rule: real conductors of a listed material stay within a few per cent of it)
IMPLAUSIBLE_DEVIATION = 0.2


def warn_about_sample(outcome, m, size, sample, t, klass):
    """The rules that say when the correction or the comparison is not to be trusted."""
    if sample < MIN_SAMPLE_LENGTH:
        add_warning(outcome, "the sample is shorter than 1 m, the least length IEC 60228 Annex A measures on (from "
                             "memory): contact resistance and the length measurement weigh heavily on a short sample")
    dt = t - cf.REFERENCE_TEMPERATURE
    if dt > TRUSTED_SPAN or dt < -TRUSTED_SPAN:
        spread = ALPHA_SPREAD * m["alpha"] * abs(dt)
        add_warning(outcome, "the measurement was made " + format_fixed(abs(dt), 1) + " K from 20 °C; our rule trusts "
                    "the correction within 20 ± 10 °C. Here a 3 % uncertainty in the temperature coefficient alone "
                    "moves R20 by about " + format_fixed(spread * 100.0, 2) + " %, and the conductor's own "
                    "temperature must be known to better than 1 K (0.4 % of R for copper)")
    if klass != "1" and klass != "" and size["shape"] == "area":
        add_warning(outcome, "a stranded conductor's nominal area is a label: class " + klass + " conductors carry "
                             "less metal than the label, so the comparison with ρ20 / A is indicative; the standard's "
                             "maximum decides")
# __pragma__ ('kwargs')
