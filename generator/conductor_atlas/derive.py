"""Stage 2: compute everything the pages show, with the core's functions (floats in SI).

No file access here: the result is plain data for the render stage. The calculators'
catalogue record of each material (``calc_record``) is made here too, so the browser, the CLI
and the tables all start from the same numbers.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from conductor_atlas.core import resistance as dc
from conductor_atlas.core.carriers import electron_density
from conductor_atlas.core.lookup import word_order_key
from conductor_atlas.core.text_match import name_key
from conductor_atlas.core.celsius import TWENTY_CELSIUS, ZERO_CELSIUS
from conductor_atlas.core.material_models import available_models, resistivity_at, resistivity_or_none
from conductor_atlas.fits import BlochGruneisenFit, fit_bloch_gruneisen
from conductor_atlas.model import DataSet, Material
from conductor_atlas.standards import limits_record
from conductor_atlas.derived_table import Table
from conductor_atlas.material_tables import material_tables

# The span of the linear model when a file gives none: −50 °C … +200 °C is the trade's usual
# working range for conductor metals (common practice (no source)); pages say so.
DEFAULT_VALID_FROM = ZERO_CELSIUS - 50.0
DEFAULT_VALID_TO = ZERO_CELSIUS + 200.0
FIT_LIMIT = 2.0  # fit Bloch–Grüneisen to table points up to this multiple of the Debye temperature
MAGNETIC_PROPERTIES = ("relative_permeability", "curie_temperature")


@dataclass(frozen=True)
class LinearModel:
    """ρ(T) = ρ_ref [1 + α (T − T_ref)] with its validity span, all SI."""

    rho_ref: float
    alpha: float
    t_ref: float
    valid_from: float
    valid_to: float
    span_sourced: bool
    sources: tuple[str, ...]

    def rho(self, t: float) -> float:
        return dc.resistivity_linear(t, self.rho_ref, self.alpha, self.t_ref)


def reference_resistivity(m: Material) -> tuple[float, float, str]:
    """(ρ [Ω·m], temperature [K], source key) from resistivity, or from %IACS at 20 °C."""
    value = m.get("resistivity")
    if value is not None:
        return value.si, value.temperature or TWENTY_CELSIUS, value.source
    iacs = m.get("conductivity_iacs")
    return dc.resistivity_from_iacs(iacs.si), iacs.temperature or TWENTY_CELSIUS, iacs.source


def resistivity_range(m: Material) -> tuple[float, float]:
    """(lowest, highest) ρ [Ω·m] the record's min/max allow, at the reference value's temperature;
    (0, 0) when the record gives no range. A %IACS range turns over: its max is the lowest ρ."""
    value = m.get("resistivity")
    if value is not None:
        if value.low is None or value.high is None:
            return 0.0, 0.0
        return value.low, value.high
    iacs = m.get("conductivity_iacs")
    if iacs.low is None or iacs.high is None:
        return 0.0, 0.0
    return dc.resistivity_from_iacs(iacs.high), dc.resistivity_from_iacs(iacs.low)


def linear_model(m: Material) -> LinearModel | None:
    """The material's linear ρ(T) model, or None when it has no temperature coefficient.

    α is referred to its own temperature T_α (20 °C or 0 °C, as the source gives it). When ρ
    is given at another temperature it is moved to T_α with the same model:
    ρ(T_α) = ρ(T_ρ) / (1 + α (T_ρ − T_α)).
    """
    alpha = m.get("temperature_coefficient")
    if alpha is None:
        return None
    rho, t_rho, rho_source = reference_resistivity(m)
    t_ref = alpha.temperature or TWENTY_CELSIUS
    rho_ref = rho / (1.0 + alpha.si * (t_rho - t_ref))
    sourced = alpha.valid_from is not None and alpha.valid_to is not None
    return LinearModel(
        rho_ref=rho_ref, alpha=alpha.si, t_ref=t_ref,
        valid_from=alpha.valid_from if alpha.valid_from is not None else DEFAULT_VALID_FROM,
        valid_to=alpha.valid_to if alpha.valid_to is not None else DEFAULT_VALID_TO,
        span_sourced=sourced, sources=tuple(sorted({rho_source, alpha.source})))


def is_magnetic(m: Material) -> bool:
    return any(m.get(name) is not None for name in MAGNETIC_PROPERTIES)


def bloch_gruneisen(m: Material) -> BlochGruneisenFit | None:
    """A Bloch–Grüneisen fit for non-magnetic pure metals with a table and a Debye temperature."""
    if m.table is None or m.klass != "pure-metal" or is_magnetic(m):
        return None
    debye = m.get("debye_temperature")
    if debye is None:
        return None
    # Fit only up to 2 Θ_D: above that thermal expansion and vacancies bend ρ(T) away from the
    # model (core.temperature_models.bg_warnings states the same range).
    points = [(t, r) for t, r in zip(m.table.temperatures, m.table.resistivities) if t <= FIT_LIMIT * debye.si]
    if len(points) < 5:
        return None
    return fit_bloch_gruneisen([p[0] for p in points], [p[1] for p in points], debye.si)


def carrier_density(m: Material) -> tuple[float, str]:
    """Conduction-electron density [1/m³] and how it was obtained ("tabulated", "computed", "")."""
    tabulated = m.get("electron_density")
    if tabulated is not None:
        return tabulated.si, "tabulated"
    parts = [m.get(k) for k in ("density", "molar_mass", "valence")]
    if all(p is not None for p in parts):
        return electron_density(parts[0].si, parts[1].si, parts[2].si), "computed"
    return 0.0, ""


def carrier_density_sources(m: Material) -> list[str]:
    """The source keys behind carrier_density: the tabulated value's, or those of density, molar mass
    and valence when n is computed from them (each once); [] when there is no n."""
    tabulated = m.get("electron_density")
    if tabulated is not None:
        return [tabulated.source]
    parts = [m.get(k) for k in ("density", "molar_mass", "valence")]
    if all(p is not None for p in parts):
        return list(dict.fromkeys(p.source for p in parts if p.source))
    return []


def permeability_range(m: Material) -> tuple[float, float]:
    """(lowest, highest) relative permeability the record's min/max give; (0, 0) without a range."""
    value = m.get("relative_permeability")
    if value is None or value.low is None or value.high is None:
        return 0.0, 0.0
    return value.low, value.high


def si_or(m: Material, name: str, default: float) -> float:
    value = m.get(name)
    return value.si if value is not None else default


def own_mean_free_path(m: Material, rho_ref: float, t_ref: float) -> tuple[float, float, str, str]:
    """(ℓ [m], its temperature [K] or 0, source key, how) for the calculators: the recorded mean free
    path ("recorded"), else ρ·ℓ / ρ_ref at t_ref from a recorded ρ·ℓ product (Gall 2016, eq. 1;
    "rho-lambda"), else (0, 0, "", "")."""
    mfp = m.get("mean_free_path")
    if mfp is not None:
        return mfp.si, mfp.temperature or 0.0, mfp.source, "recorded"
    product = m.get("rho_lambda")
    if product is not None and rho_ref > 0:
        return product.si / rho_ref, t_ref, product.source, "rho-lambda"
    return 0.0, 0.0, "", ""


def base_metal_increments(m: Material, t_ref: float) -> tuple[list[float], list[float], str]:
    """([T] K, [ρ_base(T) − ρ_base(t_ref)] Ω·m, base name) for an alloy with a temperature base, else
    ([], [], ""). Matthiessen's rule: the impurity part of ρ does not depend on T, so an alloy's ρ(T)
    is ρ_alloy(t_ref) + ρ_base(T) − ρ_base(t_ref) (Matthiessen & Vogt 1864; Kittel, Introduction to
    Solid State Physics, ch. 6; Ashcroft & Mermin ch. 16). The points are the base's sourced table
    points and a 10 K grid, ρ_base by the model "auto" picks for the base at each (core.material_models)."""
    base = m.temperature_base
    if base is None:
        return [], [], ""
    record = calc_record(base, linear_model(base), bloch_gruneisen(base))
    at_ref = resistivity_at(record, t_ref, "auto")["rho"]
    low, high = base.table.temperatures[0], base.table.temperatures[-1]
    # the table points and a 10 K grid between them, so that interpolating the increments follows the
    # base's own model ("auto": linear inside its span, the table outside) to well under 0.1 %
    grid = {float(t) for t in range(int(math.ceil(low / 10.0)) * 10, int(high) + 1, 10)}
    edges = {t for t in (record["valid_from"], record["valid_to"]) if low <= t <= high}  # where "auto" switches
    temperatures = sorted(grid | set(base.table.temperatures) | edges | {t_ref})
    increments = [resistivity_at(record, t, "auto")["rho"] - at_ref for t in temperatures]
    return temperatures, increments, base.name


CLAD_GRID_STEP = 10.0  # [K] spacing of the precomputed parallel-layer ρ(T) points


def model_span(record: dict) -> tuple[float, float]:
    """(lowest, highest) temperature [K] where a catalogue record's own models hold: the union of its
    linear span, its table, its Bloch–Grüneisen fit and its Matthiessen estimate."""
    ends = []
    if record["alpha"] != 0:
        ends.append((record["valid_from"], record["valid_to"]))
    for key in ("table_t", "mt_t"):
        if len(record[key]) >= 2:
            ends.append((record[key][0], record[key][-1]))
    if record["bg_theta"] > 0:
        ends.append((record["bg_t_min"], record["bg_t_max"]))
    if not ends:
        return record["t_ref"], record["t_ref"]
    return min(e[0] for e in ends), max(e[1] for e in ends)


def clad_layers_table(m: Material, rho_ref: float, t_ref: float) -> tuple[list[float], list[float], float, list[str]]:
    """([T] K, [ρ(T)] Ω·m, outer layer's area fraction, [outer name, core name]) of a clad wire, else
    ([], [], 0, []).

    The layers conduct in parallel (same length, same voltage), so by area fractions f and 1 − f
    1/ρ(T) = f/ρ_outer(T) + (1 − f)/ρ_core(T) (a rule of mixtures for parallel conductance; e.g.
    Callister, Materials Science and Engineering, "composites", the isostrain case applied to σ).
    f is fitted so that ρ(t_ref) equals the grade's own value: f = (σ − σ_core)/(σ_outer − σ_core).
    Each layer's ρ(T) is its own "auto" model; the points are a 10 K grid over the span where both
    layers' models hold (model_span), so interpolating them is the parallel combination to well
    under 0.1 %."""
    if len(m.clad_layers) != 2:
        return [], [], 0.0, []
    outer, core = (calc_record(layer, linear_model(layer), bloch_gruneisen(layer)) for layer in m.clad_layers)
    spans = [model_span(outer), model_span(core)]
    low, high = max(s[0] for s in spans), min(s[1] for s in spans)
    if not low <= t_ref <= high:
        raise ValueError(f"clad_layers: the layers' temperature models do not both reach {t_ref:g} K, the "
                         f"temperature of the grade's own value")
    sigma_outer = 1.0 / resistivity_at(outer, t_ref, "auto")["rho"]
    sigma_core = 1.0 / resistivity_at(core, t_ref, "auto")["rho"]
    fraction = (1.0 / rho_ref - sigma_core) / (sigma_outer - sigma_core)
    if not 0.0 < fraction < 1.0:
        raise ValueError(f"clad_layers: the grade's conductivity is not between its layers' "
                         f"({1e-6 / rho_ref:.4g} MS/m against {1e-6 * sigma_outer:.4g} and {1e-6 * sigma_core:.4g} "
                         f"MS/m), so no area fraction gives it")
    # a 10 K grid from the span's low end, the layers' table points and the ends of their linear spans
    # (where "auto" switches model)
    grid = {low + CLAD_GRID_STEP * k for k in range(int((high - low) / CLAD_GRID_STEP) + 1)}
    edges = {t for r in (outer, core) for t in [r["valid_from"], r["valid_to"]] + r["table_t"] if low <= t <= high}
    temperatures = sorted(grid | edges | {low, high, t_ref})
    rhos = []
    for t in temperatures:
        conductance = (fraction / resistivity_at(outer, t, "auto")["rho"]
                       + (1.0 - fraction) / resistivity_at(core, t, "auto")["rho"])
        rhos.append(1.0 / conductance)
    return temperatures, rhos, fraction, [m.clad_layers[0].name, m.clad_layers[1].name]


def calc_record(m: Material, model: LinearModel | None, fit: BlochGruneisenFit | None) -> dict:
    """The flat record the calculators read (see core.material_models for the keys)."""
    rho, t_rho, rho_source = reference_resistivity(m)
    n, n_how = carrier_density(m)
    rho_ref = model.rho_ref if model else rho
    t_ref = model.t_ref if model else t_rho
    mfp_si, mfp_t, mfp_source, mfp_how = own_mean_free_path(m, rho_ref, t_ref)
    low, high = resistivity_range(m)
    matthiessen = base_metal_increments(m, t_ref)
    clad = clad_layers_table(m, rho_ref, t_ref)
    record = {
        "id": m.id,
        "name": m.name,
        "klass": m.klass,
        "rho_ref": rho_ref,
        # the recorded range as fractions of the recorded value (0, 0: no range); a calculator
        # scales ρ(T) by them, i.e. the range is taken to keep its relative width at every T
        "rho_low_ratio": low / rho if low > 0 else 0.0,
        "rho_high_ratio": high / rho if high > 0 else 0.0,
        "t_ref": t_ref,
        "alpha": model.alpha if model else 0.0,
        "valid_from": model.valid_from if model else t_rho,
        "valid_to": model.valid_to if model else t_rho,
        "density": si_or(m, "density", 0.0),
        "mu_r": si_or(m, "relative_permeability", 1.0),
        # the recorded μr range (0, 0: none), run through the calculators by core.ranges
        "mu_r_low": permeability_range(m)[0],
        "mu_r_high": permeability_range(m)[1],
        "electron_density": n,
        "electron_density_how": n_how,
        "mean_free_path": mfp_si,
        "mean_free_path_t": mfp_t,
        "mean_free_path_how": mfp_how,
        "thermal_conductivity": si_or(m, "thermal_conductivity", 0.0),
        "specific_heat": si_or(m, "specific_heat", 0.0),
        "melting_point": si_or(m, "melting_point", 0.0),
        "specific_heat_t": m.get("specific_heat").temperature if m.get("specific_heat") else 0.0,
        "specific_heat_source": m.get("specific_heat").source if m.get("specific_heat") else "",
        "table_t": list(m.table.temperatures) if m.table else [],
        "table_rho": list(m.table.resistivities) if m.table else [],
        "bg_rho0": fit.rho0 if fit else 0.0,
        "bg_a": fit.a if fit else 0.0,
        "bg_theta": fit.theta if fit else 0.0,
        "bg_t_min": fit.t_min if fit else 0.0,
        "bg_t_max": fit.t_max if fit else 0.0,
        "bg_worst": fit.worst if fit else 0.0,
        "cvd_a": si_or(m, "cvd_a", 0.0),
        "cvd_b": si_or(m, "cvd_b", 0.0),
        "cvd_c": si_or(m, "cvd_c", 0.0),
        "mt_t": matthiessen[0],
        "mt_drho": matthiessen[1],
        "mt_base": matthiessen[2],
        "cl_t": clad[0],
        "cl_rho": clad[1],
        "cl_fraction": clad[2],
        "cl_names": clad[3],
        "sources": model_sources(m),
        # what each kind of result rests on: the calculators list only the ones they use
        "rho_sources": resistivity_sources(m),
        "alpha_source": m.get("temperature_coefficient").source if m.get("temperature_coefficient") else "",
        "density_source": m.get("density").source if m.get("density") else "",
        "mu_source": m.get("relative_permeability").source if m.get("relative_permeability") else "",
        "electron_density_sources": carrier_density_sources(m),
        "mean_free_path_source": mfp_source,
        **layer_fields(m),
    }
    record["models"] = available_models(record)  # the model field's choices for this material
    return record


def resistivity_sources(m: Material) -> list[str]:
    """Source keys behind ρ(T) alone: the reference value, coefficient, table, Callendar–Van Dusen
    coefficients, and the ρ(T) sources of a Matthiessen base or of clad layers."""
    keys = set(m.resistivity_source_keys())
    keys.update(v.source for name, v in m.properties.items() if name in ("cvd_a", "cvd_b", "cvd_c"))
    for layer in m.clad_layers:
        keys.update(layer.resistivity_source_keys())
    if m.temperature_base is not None:
        keys.update(m.temperature_base.resistivity_source_keys())
    return sorted(keys)


def layer_fields(m: Material) -> dict:
    """A clad wire's construction for core.clad_layers: the core's and the cladding's own records and the
    cladding's share of the area (0 and empty records for a material without layers)."""
    layers = m.layers
    if layers is None or layers.core is None or layers.cladding is None:
        return {"layer_share": 0.0, "layer_core": {}, "layer_cladding": {}, "layer_source": ""}
    return {"layer_share": layers.cladding_share,
            "layer_core": calc_record(layers.core, linear_model(layers.core), bloch_gruneisen(layers.core)),
            "layer_cladding": calc_record(layers.cladding, linear_model(layers.cladding),
                                          bloch_gruneisen(layers.cladding)),
            "layer_source": layers.source}


def model_sources(m: Material) -> list[str]:
    """Source keys behind ρ(T) and density: what a resistance result rests on."""
    keys = {v.source for name, v in m.properties.items()
            if name in ("resistivity", "conductivity_iacs", "temperature_coefficient", "density",
                        "relative_permeability", "cvd_a", "cvd_b", "cvd_c")}
    if m.table is not None:
        keys.add(m.table.source)
    for layer in m.clad_layers:
        keys.update(layer.resistivity_source_keys())
    if m.temperature_base is not None:
        keys.update(m.temperature_base.resistivity_source_keys())
    if m.layers is not None:
        keys.add(m.layers.source)
    return sorted(keys)


def calc_catalogue(records: list[dict], materials: list[Material], limits: tuple = ()) -> dict:
    """{"materials": {id: record}, "aliases": {folded alias or name: id}, "display_aliases": {...},
    "uses": {folded use: [ids]},
    "limits": [conductor-standard tables, standards.limits_record]}."""
    catalogue = {"materials": {}, "aliases": {}, "display_aliases": {}, "word_keys": {}, "uses": {},
                 "limits": limits_record(limits)}
    taken = {r["id"] for r in records}
    by_id = {m.id: m for m in materials}
    for record in records:
        catalogue["materials"][record["id"]] = record
    for record in records:
        m = by_id[record["id"]]
        for label in list(m.aliases) + [m.name]:
            key = name_key(label)
            if key in taken or key in catalogue["aliases"]:
                continue
            catalogue["aliases"][key] = m.id
            catalogue["display_aliases"][key] = label
    # what the trade uses each material for (the files' `uses`), by name key: lookup.materials_used_for
    for record in records:
        for use in by_id[record["id"]].uses:
            ids = catalogue["uses"].setdefault(name_key(use), [])
            if record["id"] not in ids:
                ids.append(record["id"])
    # every id, alias and name by its words in sorted order (lookup.loose_match): the first one wins
    for record in records:
        m = by_id[record["id"]]
        for label in [m.id] + list(m.aliases) + [m.name]:
            catalogue["word_keys"].setdefault(word_order_key(name_key(label)), m.id)
    return catalogue


@dataclass(frozen=True)
class MaterialView:
    """Everything a material page shows."""

    material: Material
    model: LinearModel | None
    fit: BlochGruneisenFit | None
    calc: dict
    tables: tuple[Table, ...]
    rho_20: float
    iacs_20: float
    rho_20_model: str


def rho_at_20(record: dict) -> tuple[float, str]:
    """ρ at 20 °C by the model "auto" picks there; the stated value when no model reaches 20 °C."""
    found = resistivity_or_none(record, TWENTY_CELSIUS)
    if found is None:
        return record["rho_ref"], "reference"
    return found["rho"], found["model"]


def derive_material(m: Material) -> MaterialView:
    model = linear_model(m)
    fit = bloch_gruneisen(m)
    record = calc_record(m, model, fit)
    rho_20, how = rho_at_20(record)
    tables = material_tables(m, record, model, fit)
    return MaterialView(material=m, model=model, fit=fit, calc=record, tables=tuple(tables), rho_20=rho_20,
                        iacs_20=dc.iacs_percent(rho_20), rho_20_model=how)


def derive(dataset: DataSet) -> list[MaterialView]:
    """Derive the views of every material, in id order."""
    return [derive_material(m) for m in dataset.materials]


def catalogue_of(dataset: DataSet) -> dict:
    """The calculators' catalogue of every material, without computing any page table."""
    records = [calc_record(m, linear_model(m), bloch_gruneisen(m)) for m in dataset.materials]
    return calc_catalogue(records, list(dataset.materials), dataset.limits)
