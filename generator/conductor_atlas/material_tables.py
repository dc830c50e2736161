"""The derived tables of a material page, each computed with the core and labelled with its model,
validity and sources. Row ids come from the row's defining value, so links survive rebuilds.
"""

from __future__ import annotations

import dataclasses
import functools

from conductor_atlas.core import carriers as fe
from conductor_atlas.core import resistance as dc
from conductor_atlas.core.ranges import has_range, scaled_record
from conductor_atlas.core import size_effect as film
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.celsius import TWENTY_CELSIUS, ZERO_CELSIUS
from conductor_atlas.core.layered_round import core_radius_for_cladding_share, layered_round_resistance_ratio
from conductor_atlas.core.geometry import IEC60228_SIZES_MM2, awg_area, awg_name, diameter_from_area
from conductor_atlas.core.material_models import (MODEL_LABELS, layers_label, matthiessen_label, resistivity_or_none,
                                                  within_model)
from conductor_atlas.core.temperature_models import bloch_gruneisen_resistivity
from conductor_atlas.core.numfmt import format_fixed, format_number, format_plain
from conductor_atlas.model import Material
from conductor_atlas.derived_table import Column, Row, Table, temperature_row_id
from conductor_atlas.bar_table import bar_ratio_table, no_bar_table_reason

CRYO_K = [4.2, 10.0, 20.0, 40.0, 77.0, 100.0, 150.0, 200.0]
TABLE_C = [-100.0, -40.0, -20.0, 0.0, 20.0, 40.0, 60.0, 70.0, 80.0, 90.0, 105.0, 120.0, 150.0, 200.0, 250.0,
           300.0, 400.0, 500.0, 600.0, 700.0, 800.0, 1000.0]
FREQUENCIES = [50.0, 60.0, 400.0, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11]
AC_FREQUENCIES = [50.0, 60.0, 400.0, 1e3, 1e4, 1e5]
# a clad wire is chosen for RF: its table goes on to the frequencies where the cladding carries the current
CLAD_FREQUENCIES = [1e6, 1e7]
AC_SIZES_MM2 = [1.5, 2.5, 10.0, 35.0, 95.0, 240.0, 630.0]
AC_AWG = [12, 4, -3]
AWG_SIZES = [-3, -2, -1, 0, 1, 2, 4, 6, 8, 10, 12, 14, 16, 18, 20, 22, 24, 26, 28, 30]
OPERATING_C = [20.0, 70.0, 90.0]
FILM_NM = [1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0, 1000.0]
# Mayadas–Shatzkes illustration: grain size equal to film thickness (common practice (no
# source) for polycrystalline films) and R = 0.3 (illustrative, within the 0.2–0.5 range
# reported for Cu films; from memory).
MS_REFLECTION = 0.3


def quiet_rho(record: dict, t: float) -> tuple[float, str] | None:
    """ρ by the auto model when that model covers t (material_models.within_model); else None."""
    found = resistivity_or_none(record, t)
    if not within_model(found):
        return None
    return found["rho"], found["model"]


@functools.lru_cache(maxsize=None)  # the same few values for every material
def frequency_text(f: float) -> str:
    for scale, prefix in ((1e9, "G"), (1e6, "M"), (1e3, "k")):
        if f >= scale:
            return f"{format_number(f / scale, 3)} {prefix}Hz"
    return f"{format_number(f, 3)} Hz"


@functools.lru_cache(maxsize=None)  # the same few values for every material
def frequency_row_id(f: float) -> str:
    return "f-" + format_plain(f, 6).replace(".", "p").replace("-", "m")


@functools.lru_cache(maxsize=None)  # the same few values for every material
def size_row_id(mm2: float) -> str:
    return "s-" + format_plain(mm2, 6).replace(".", "p") + "mm2"


def range_ends(record: dict) -> list[dict]:
    """[record at the low end, record at the high end] of a recorded ρ range (core.ranges: the whole
    ρ(T) scaled, so the range keeps its relative width at every temperature); [] without a range."""
    if not has_range(record):
        return []
    return [scaled_record(record, record["rho_low_ratio"]), scaled_record(record, record["rho_high_ratio"])]


RANGE_NOTE = ("The low and high columns run the same model on the resistivity moved to each end of the recorded "
              "range; the range keeps its relative width at every temperature")


def resistivity_temperature(m: Material, record: dict) -> Table | None:
    temps = sorted({round(t, 6) for t in CRYO_K + [ZERO_CELSIUS + c for c in TABLE_C]})
    rho20 = quiet_rho(record, TWENTY_CELSIUS)
    # a recorded ρ range: the same models run on the record moved to each end (core.ranges)
    ranged = range_ends(record)
    rows, models = [], set()
    for t in temps:
        found = quiet_rho(record, t)
        if found is None:
            continue
        rho, model = found
        models.add(model)
        ratio = rho / rho20[0] if rho20 else float("nan")
        values = (t - ZERO_CELSIUS, t, rho * 1e8, 1e-6 / rho, dc.iacs_percent(rho), ratio, MODEL_LABELS[model])
        texts = (format_fixed(t - ZERO_CELSIUS, 1 if abs(t - ZERO_CELSIUS - round(t - ZERO_CELSIUS)) > 1e-9 else 0),
                 format_fixed(t, 2), format_number(rho * 1e8, 5, True), format_number(1e-6 / rho, 4, True),
                 format_number(dc.iacs_percent(rho), 4, True), format_number(ratio, 4, True) if rho20 else "—",
                 model)
        if ranged:
            ends = [quiet_rho(end, t)[0] * 1e8 for end in ranged]
            values = values[:3] + tuple(ends) + values[3:]
            texts = texts[:3] + tuple(format_number(e, 5, True) for e in ends) + texts[3:]
        rows.append(Row(temperature_row_id(t - ZERO_CELSIUS), values, texts))
    if not rows:
        return None
    pieces = []
    if "linear" in models:
        pieces.append(f"linear: ρ(T) = ρ_ref·[1 + α·(T − T_ref)] with ρ_ref = {format_number(record['rho_ref'] * 1e8, 5)} µΩ·cm, "
                      f"α = {format_number(record['alpha'], 4)} /K, T_ref = {format_fixed(record['t_ref'] - ZERO_CELSIUS, 0)} °C, "
                      f"for {format_fixed(record['valid_from'] - ZERO_CELSIUS, 0)} °C to {format_fixed(record['valid_to'] - ZERO_CELSIUS, 0)} °C")
    if "table" in models:
        pieces.append("table: linear interpolation between the sourced points")
    if "bloch-gruneisen" in models:
        pieces.append(f"Bloch–Grüneisen fit (Θ = {format_number(record['bg_theta'], 4)} K)")
    if "matthiessen" in models:
        pieces.append(matthiessen_label(record) + ": ρ(T) = ρ(20 °C) + ρ_base(T) − ρ_base(20 °C), an estimate; "
                      "check against the supplier's data where it matters")
    if "layers" in models:
        pieces.append(layers_label(record) + ": 1/ρ(T) = f/ρ_outer(T) + (1 − f)/ρ_core(T) with the outer layer's area "
                      "fraction f, an estimate; check against the supplier's data where it matters")
    if "callendar-van-dusen" in models:
        pieces.append("Callendar–Van Dusen (IEC 60751) ratio applied to the reference resistivity")
    return Table(
        id="resistivity-temperature", title="Resistivity vs temperature", model="; ".join(pieces) or "reference value",
        validity="Rows appear only where a model holds without a warning; the model column names the one used",
        sources=tuple(record["sources"]),
        columns=(Column("temperature_c", "Temperature", "°C"), Column("temperature_k", "Temperature", "K"),
                 Column("resistivity", "Resistivity", "µΩ·cm"))
        + ((Column("resistivity_low", "Resistivity, low end of the recorded range", "µΩ·cm"),
            Column("resistivity_high", "Resistivity, high end of the recorded range", "µΩ·cm")) if ranged else ())
        + (Column("conductivity", "Conductivity", "MS/m"),
           Column("iacs", "Conductivity", "%IACS"), Column("ratio_20", "ρ / ρ(20 °C)", ""),
           Column("model", "Model", "", numeric=False)),
        note=("The recorded range of ρ at its reference temperature is carried to every row with its relative "
              "width kept." if ranged else ""),
        rows=tuple(rows))


def sourced_points(m: Material, record: dict, fit) -> Table | None:
    if m.table is None:
        return None
    columns = [Column("temperature_k", "Temperature", "K"), Column("resistivity", "Resistivity (source)", "µΩ·cm")]
    if fit:
        columns += [Column("fit", "Bloch–Grüneisen fit", "µΩ·cm"), Column("deviation", "Fit − source", "%")]
    rows = []
    for t, rho in zip(m.table.temperatures, m.table.resistivities):
        values, texts = [t, rho * 1e8], [format_fixed(t, 2), format_number(rho * 1e8, 4, True)]
        if fit:
            model_rho = bloch_gruneisen_resistivity(t, fit.rho0, fit.a, fit.theta)
            dev = (model_rho / rho - 1.0) * 100.0
            values += [model_rho * 1e8, dev]
            texts += [format_number(model_rho * 1e8, 4, True), format_fixed(dev, 1)]
        rows.append(Row("k-" + format_plain(t, 6).replace(".", "p"), tuple(values), tuple(texts)))
    if fit:
        model = (f"Bloch–Grüneisen with Matthiessen's rule, ρ(T) = ρ0 + A·(T/Θ)⁵·J5(Θ/T), fitted to these points by "
                 f"relative least squares: ρ0 = {format_number(fit.rho0 * 1e8, 3)} µΩ·cm, A = {format_number(fit.a * 1e8, 4)} µΩ·cm, "
                 f"Θ = {format_number(fit.theta, 4)} K")
        validity = (f"Worst deviation of the fit: {format_fixed(fit.worst * 100, 1)} % at {format_fixed(fit.worst_at, 0)} K; "
                    f"fitted over {format_fixed(fit.t_min, 0)} K to {format_fixed(fit.t_max, 0)} K")
    else:
        model = "Sourced points, used by interpolation (no physical model fitted)"
        validity = "Between the first and last point only"
        if m.klass == "pure-metal":
            validity += "; magnetic metals and metals without a Debye temperature on record get no Bloch–Grüneisen fit"
    note = m.table.note
    return Table(id="sourced-points", title="Sourced ρ(T) points", model=model, validity=validity,
                 sources=(m.table.source,), columns=tuple(columns), rows=tuple(rows),
                 note=f"{m.table.locator}. {note}".strip())


def surface_layer(record: dict) -> dict:
    """The record whose ρ and μr a surface sees: a clad wire's cladding, else the material itself."""
    return record["layer_cladding"] if record["layer_share"] > 0 else record


def skin_depth_table(m: Material, record: dict) -> Table | None:
    clad = record["layer_share"] > 0
    record = surface_layer(record)
    found = quiet_rho(record, TWENTY_CELSIUS)
    if found is None:
        return None
    rho = found[0]
    mu_r = record["mu_r"]
    end_rhos = [quiet_rho(end, TWENTY_CELSIUS)[0] for end in range_ends(record)]
    rows = []
    for f in FREQUENCIES:
        delta = skin.skin_depth(rho, f, mu_r)
        rs = skin.surface_resistance(rho, f, mu_r)
        ends = [skin.skin_depth(r, f, mu_r) * 1e6 for r in end_rhos]
        rows.append(Row(frequency_row_id(f), (f, delta * 1e6, *ends, rs * 1e3),
                        (frequency_text(f), format_number(delta * 1e6, 4, True),
                         *[format_number(e, 4, True) for e in ends], format_number(rs * 1e3, 4, True))))
    notes = []
    if mu_r > 1.5:
        notes.append(f"μr = {format_number(mu_r, 3)} is a single small-signal figure; in iron, steel and nickel μr depends "
                     "strongly on field strength and frequency and falls towards 1 above the Curie point and at microwave "
                     "frequencies, so treat these depths as an order of magnitude")
    if end_rhos:
        notes.append(RANGE_NOTE + " (δ ∝ √ρ)")
    if clad:
        notes.append(f"A clad wire: the skin depth and surface resistance are those of its cladding ({record['name']}), "
                     "which carries the current once δ is smaller than the cladding is thick")
    range_columns = ((Column("skin_depth_low", "Skin depth, low end of the recorded range", "µm"),
                      Column("skin_depth_high", "Skin depth, high end of the recorded range", "µm")) if end_rhos else ())
    return Table(id="skin-depth", title="Skin depth and surface resistance vs frequency (20 °C)",
                 model=f"δ = √(ρ/(π·f·μ0·μr)), Rs = ρ/δ with ρ(20 °C) = {format_number(rho * 1e8, 5)} µΩ·cm, μr = {format_number(mu_r, 3)}",
                 validity="Good conductor (σ ≫ ωε), local response; at the highest frequencies surface roughness and the "
                          "anomalous skin effect (mean free path ≳ δ, at cryogenic temperatures) raise Rs",
                 sources=tuple(record["sources"]),
                 columns=(Column("frequency", "Frequency", "Hz"), Column("skin_depth", "Skin depth", "µm"))
                 + range_columns + (Column("surface_resistance", "Surface resistance", "mΩ/□"),),
                 rows=tuple(rows), note=". ".join(notes))


def clad_ac_ratio_table(record: dict) -> Table | None:
    """A clad wire's AC/DC ratios of round sizes by the exact two-layer solution (core.layered_round)."""
    core, clad, share = record["layer_core"], record["layer_cladding"], record["layer_share"]
    rho_core, rho_clad = quiet_rho(core, TWENTY_CELSIUS), quiet_rho(clad, TWENTY_CELSIUS)
    if rho_core is None or rho_clad is None:
        return None
    sizes = [(size_row_id(a), f"{format_number(a, 4)} mm²", a * 1e-6) for a in AC_SIZES_MM2]
    sizes += [(f"awg-{awg_name(n).replace('/', '-')}", f"{awg_name(n)} AWG", awg_area(n)) for n in AC_AWG]
    frequencies = AC_FREQUENCIES + CLAD_FREQUENCIES
    columns = [Column("size", "Size", "", numeric=False), Column("diameter", "Diameter", "mm")]
    columns += [Column(frequency_row_id(f).replace("-", "_"), f"R_ac/R_dc at {frequency_text(f)}", "") for f in frequencies]
    rows = []
    for row_id, label, area in sizes:
        d = diameter_from_area(area)
        b = core_radius_for_cladding_share(d / 2.0, share)
        ratios = [layered_round_resistance_ratio(b, d / 2.0, rho_core[0], core["mu_r"], rho_clad[0], clad["mu_r"], f)
                  for f in frequencies]
        rows.append(Row(row_id, (label, d * 1e3, *ratios),
                        (label, format_number(d * 1e3, 4, True), *[format_number(r, 4, True) for r in ratios])))
    return Table(id="ac-dc-ratio", title="AC/DC resistance ratio of round clad wire (20 °C)",
                 model=f"Exact two-layer solution: a {core['name']} core (μr = {format_number(core['mu_r'], 3)}) and a "
                       f"{clad['name']} cladding of {format_number(share * 100, 3)} % of the area, Bessel/Kelvin functions "
                       "in each layer with E and H matched at the interface",
                 validity="Isolated, straight, solid clad wire, linear core (μr depends on the field and saturates); "
                          "no proximity effect from nearby conductors",
                 sources=tuple(sorted(set(record["sources"]) | {record["layer_source"]})), columns=tuple(columns),
                 rows=tuple(rows), note="R_dc is the two layers in parallel; at high frequency the ratio follows the "
                                        "cladding alone")


def ac_ratio_table(m: Material, record: dict) -> Table | None:
    if record["layer_share"] > 0:
        return clad_ac_ratio_table(record)
    found = quiet_rho(record, TWENTY_CELSIUS)
    if found is None:
        return None
    rho = found[0]
    mu_r = record["mu_r"]
    sizes = [(size_row_id(a), f"{format_number(a, 4)} mm²", a * 1e-6) for a in AC_SIZES_MM2]
    sizes += [(f"awg-{awg_name(n).replace('/', '-')}", f"{awg_name(n)} AWG", awg_area(n)) for n in AC_AWG]
    columns = [Column("size", "Size", "", numeric=False), Column("diameter", "Diameter", "mm")]
    columns += [Column(frequency_row_id(f).replace("-", "_"), f"R_ac/R_dc at {frequency_text(f)}", "") for f in AC_FREQUENCIES]
    end_rhos = [quiet_rho(end, TWENTY_CELSIUS)[0] for end in range_ends(record)]
    rows = []
    spread = 0.0  # the largest relative change of a ratio between the ends of the recorded ρ range
    for row_id, label, area in sizes:
        d = diameter_from_area(area)
        ratios = [skin.round_wire_resistance_ratio(d / 2.0, rho, f, mu_r) for f in AC_FREQUENCIES]
        for r_end in end_rhos:
            for f, ratio in zip(AC_FREQUENCIES, ratios):
                moved = skin.round_wire_resistance_ratio(d / 2.0, r_end, f, mu_r)
                spread = max(spread, abs(moved - ratio) / ratio)
        rows.append(Row(row_id, (label, d * 1e3, *ratios),
                        (label, format_number(d * 1e3, 4, True), *[format_number(r, 4, True) for r in ratios])))
    note = ""
    if end_rhos:
        note = (f"At the ends of the recorded resistivity range these ratios move by at most "
                f"{format_fixed(spread * 100, 2)} % (the same exact solution with ρ moved to each end)")
    return Table(id="ac-dc-ratio", title="AC/DC resistance ratio of solid round conductors (20 °C)",
                 model="Exact solution for an isolated solid round wire with Kelvin functions: R_ac/R_dc = "
                       "(x/2)·(ber x·bei′x − bei x·ber′x)/(ber′²x + bei′²x), x = √2·a/δ",
                 validity="Isolated, straight, solid wire; no proximity effect from nearby conductors; "
                          "stranded conductors of the same area show less skin effect (IEC 60287-1-1 k_s)",
                 sources=tuple(record["sources"]), columns=tuple(columns), rows=tuple(rows), note=note)


def resistance_tables(m: Material, record: dict) -> list[Table]:
    temps = [ZERO_CELSIUS + c for c in OPERATING_C]
    rhos = [quiet_rho(record, t) for t in temps]
    usable = [(t, r[0]) for t, r in zip(temps, rhos) if r is not None]
    if not usable:
        return []
    columns_tail = tuple(Column(f"r_{format_fixed(t - ZERO_CELSIUS, 0)}c", f"R′ at {format_fixed(t - ZERO_CELSIUS, 0)} °C", "Ω/km")
                         for t, _ in usable)
    ends20 = [quiet_rho(end, TWENTY_CELSIUS) for end in range_ends(record)]
    ends20 = [e[0] for e in ends20 if e is not None] if len(ends20) == 2 and None not in ends20 else []
    if ends20:
        columns_tail += (Column("r_20c_low", "R′ at 20 °C, low end of the recorded range", "Ω/km"),
                         Column("r_20c_high", "R′ at 20 °C, high end of the recorded range", "Ω/km"))
    note = (RANGE_NOTE + ": at the other temperatures R′ spans the same fraction as at 20 °C") if ends20 else ""
    caveat = ("Nominal areas. IEC 60228 specifies a maximum resistance per size and class rather than an area, "
              "and stranded, tinned or compacted conductors differ; for a real cable use its datasheet")
    model = "R′ = ρ(T)/A with ρ(T) from the resistivity table's model; A = nominal area"
    metric_rows = []
    for a in IEC60228_SIZES_MM2:
        r = [rho / (a * 1e-6) * 1000.0 for _, rho in usable] + [rho / (a * 1e-6) * 1000.0 for rho in ends20]
        metric_rows.append(Row(size_row_id(a), (a, *r), (format_number(a, 4), *[format_number(x, 4, True) for x in r])))
    awg_rows = []
    for n in AWG_SIZES:
        area = awg_area(n)
        r = [rho / area * 1000.0 for _, rho in usable] + [rho / area * 1000.0 for rho in ends20]
        awg_rows.append(Row(f"awg-{awg_name(n).replace('/', '-')}", (f"{awg_name(n)}", area * 1e6, *r),
                            (f"{awg_name(n)}", format_number(area * 1e6, 4, True), *[format_number(x, 4, True) for x in r])))
    return [
        Table(id="resistance-metric", title="Resistance per length of metric sizes", model=model, validity=caveat,
              sources=tuple(record["sources"]),
              columns=(Column("area", "Nominal area", "mm²"),) + columns_tail, rows=tuple(metric_rows), note=note),
        Table(id="resistance-awg", title="Resistance per length of AWG sizes (solid)", model=model + "; AWG areas from "
              "ASTM B258 nominal diameters", validity="Solid round wire; stranded AWG conductors have a slightly larger "
              "resistance (lay factor)", sources=tuple(record["sources"]) + ("astm-b258",),
              columns=(Column("awg", "AWG", "", numeric=False), Column("area", "Area", "mm²")) + columns_tail,
              rows=tuple(awg_rows), note=note),
    ]


def carrier_table(m: Material, record: dict) -> Table | None:
    n = record["electron_density"]
    if not n > 0:
        return None
    rows = []
    vf = fe.fermi_velocity(n)
    for t in [77.0, 200.0, ZERO_CELSIUS, TWENTY_CELSIUS, ZERO_CELSIUS + 100.0]:
        found = quiet_rho(record, t)
        if found is None:
            continue
        rho = found[0]
        tau = fe.relaxation_time(rho, n)
        ell = fe.mean_free_path(rho, n)
        mu = fe.mobility(tau)
        kappa = fe.wiedemann_franz_thermal_conductivity(rho, t)
        rows.append(Row(temperature_row_id(t - ZERO_CELSIUS), (t, rho * 1e8, tau * 1e15, ell * 1e9, mu * 1e4, kappa),
                        (format_fixed(t, 2), format_number(rho * 1e8, 4, True), format_number(tau * 1e15, 3, True),
                         format_number(ell * 1e9, 3, True), format_number(mu * 1e4, 3, True), format_number(kappa, 3, True))))
    if not rows:
        return None
    how = "tabulated" if record["electron_density_how"] == "tabulated" else "computed from density, molar mass and valence"
    return Table(
        id="carriers", title="Free-electron carrier parameters vs temperature",
        model=(f"Drude σ = n·e²·τ/m with n = {format_number(n, 4)} m⁻³ ({how}); ℓ = v_F·τ with v_F = "
               f"{format_number(vf, 4)} m/s (free-electron Fermi velocity); μ = e·τ/m; κ = L0·T/ρ (Wiedemann–Franz, "
               f"Sommerfeld L0 = 2.443×10⁻⁸ W·Ω/K²)"),
        validity="Free-electron picture: a good guide for the alkali and noble metals and Al; for transition metals "
                 "the real Fermi surface makes these order-of-magnitude figures. Uses the standard Drude result "
                 "(exponentially distributed free times); assuming every electron flies exactly τ would give σ/2",
        sources=tuple(record["sources"]),
        columns=(Column("temperature_k", "Temperature", "K"), Column("resistivity", "Resistivity", "µΩ·cm"),
                 Column("tau", "Relaxation time", "fs"), Column("mfp", "Mean free path", "nm"),
                 Column("mobility", "Mobility", "cm²/(V·s)"), Column("kappa_wf", "κ (Wiedemann–Franz)", "W/(m·K)")),
        rows=tuple(rows))


def thin_film_table(m: Material, record: dict) -> Table | None:
    ell = record["mean_free_path"]
    found = quiet_rho(record, TWENTY_CELSIUS)
    if not ell > 0 or found is None:
        return None
    rho = found[0]
    rows = []
    for d_nm in FILM_NM:
        d = d_nm * 1e-9
        kappa = d / ell
        fs0 = film.fuchs_sondheimer_ratio(kappa, 0.0)
        fs5 = film.fuchs_sondheimer_ratio(kappa, 0.5)
        grains = film.mayadas_shatzkes_ratio(film.mayadas_shatzkes_alpha(ell, d, MS_REFLECTION))
        rows.append(Row("d-" + format_plain(d_nm, 6).replace(".", "p") + "nm",
                        (d_nm, fs0, fs5, grains, rho * fs0 * 1e8),
                        (format_number(d_nm, 4), format_number(fs0, 4, True), format_number(fs5, 4, True),
                         format_number(grains, 4, True), format_number(rho * fs0 * 1e8, 4, True))))
    return Table(
        id="thin-film", title="Thin-film resistivity vs thickness (20 °C)",
        model=(f"Fuchs–Sondheimer (exact integral, specularity p) and Mayadas–Shatzkes grain-boundary scattering with "
               f"bulk ρ = {format_number(rho * 1e8, 4)} µΩ·cm and mean free path ℓ = {format_number(ell * 1e9, 3)} nm"
               + (" (the recorded ρ·ℓ over ρ)" if record["mean_free_path_how"] == "rho-lambda" else "")),
        validity=("Grain column: Mayadas–Shatzkes alone, grain size equal to the film thickness (common practice, "
                  f"no source) and grain-boundary reflection R = {format_number(MS_REFLECTION, 2)} (illustrative); the "
                  "thin-film calculator combines both mechanisms in the full Mayadas–Shatzkes integral. Below a few nm, "
                  "surface roughness and quantum confinement, which these models lack, dominate"),
        sources=tuple(record["sources"]),
        columns=(Column("thickness", "Thickness", "nm"), Column("fs_p0", "ρ/ρ0, FS p = 0", ""),
                 Column("fs_p05", "ρ/ρ0, FS p = 0.5", ""), Column("ms", "ρ/ρ0, grains only (MS)", ""),
                 Column("rho_film", "ρ film, FS p = 0", "µΩ·cm")),
        rows=tuple(rows))


def material_tables(m: Material, record: dict, model, fit) -> list[Table]:
    round_ac = ac_ratio_table(m, record)
    reason = no_bar_table_reason(m, record)
    if round_ac is not None and reason:
        round_ac = dataclasses.replace(round_ac, note=". ".join(n for n in (round_ac.note, reason) if n))
    tables = [resistivity_temperature(m, record), sourced_points(m, record, fit), skin_depth_table(m, record),
              round_ac, bar_ratio_table(m, record, quiet_rho)]
    if m.klass != "thin-film":
        tables += resistance_tables(m, record)
    tables += [carrier_table(m, record), thin_film_table(m, record)]
    return [t for t in tables if t is not None]
