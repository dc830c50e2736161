"""Stage 2: compute everything the pages show, with the core's functions (floats in SI).

No file access here: the result is plain data for the render stage.
"""

from __future__ import annotations

from dataclasses import dataclass

from conductor_atlas.core import resistance as dc
from conductor_atlas.core.numfmt import format_fixed, format_number
from conductor_atlas.model import DataSet, Material
from conductor_atlas.tables import Column, Row, Table, temperature_row_id

CELSIUS = 273.15
# The span of the linear model when a file gives none: −50 °C … +200 °C is the trade's usual
# working range for conductor metals (common practice (no source)); pages say so.
DEFAULT_VALID_FROM = CELSIUS - 50.0
DEFAULT_VALID_TO = CELSIUS + 200.0
TABLE_TEMPERATURES_C = [-40.0, -20.0, 0.0, 20.0, 40.0, 60.0, 70.0, 80.0, 90.0, 105.0, 120.0, 150.0, 200.0]


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
        return value.si, value.temperature or CELSIUS + 20.0, value.source
    iacs = m.get("conductivity_iacs")
    return dc.resistivity_from_iacs(iacs.si), iacs.temperature or CELSIUS + 20.0, iacs.source


def linear_model(m: Material) -> LinearModel | None:
    """The material's linear ρ(T) model, or None when it has no temperature coefficient.

    When ρ and α are given at different temperatures, ρ is moved to α's reference temperature
    with the same linear model: ρ(T_α) = ρ(T_ρ) / (1 + α (T_ρ − T_α)).
    """
    alpha = m.get("temperature_coefficient")
    if alpha is None:
        return None
    rho, t_rho, rho_source = reference_resistivity(m)
    t_ref = alpha.temperature or CELSIUS + 20.0
    rho_ref = rho / (1.0 + alpha.si * (t_rho - t_ref))
    sourced = alpha.valid_from is not None and alpha.valid_to is not None
    return LinearModel(
        rho_ref=rho_ref, alpha=alpha.si, t_ref=t_ref,
        valid_from=alpha.valid_from if alpha.valid_from is not None else DEFAULT_VALID_FROM,
        valid_to=alpha.valid_to if alpha.valid_to is not None else DEFAULT_VALID_TO,
        span_sourced=sourced, sources=tuple(sorted({rho_source, alpha.source})))


def calc_material(m: Material, model: LinearModel) -> dict:
    """The flat record the calculators read (embedded in pages as JSON; used by the CLI)."""
    density = m.get("density")
    return {
        "id": m.id,
        "name": m.name,
        "rho_ref": model.rho_ref,
        "alpha": model.alpha,
        "t_ref": model.t_ref,
        "valid_from": model.valid_from,
        "valid_to": model.valid_to,
        "density": density.si if density is not None else 0.0,
        "sources": list(model.sources),
    }


def resistivity_temperature_table(m: Material, model: LinearModel) -> Table:
    """ρ, σ and %IACS from −40 °C to +200 °C with the linear model (rows outside its span dropped)."""
    columns = (
        Column("temperature_c", "Temperature", "°C"),
        Column("temperature_k", "Temperature", "K"),
        Column("resistivity", "Resistivity", "µΩ·cm"),
        Column("conductivity", "Conductivity", "MS/m"),
        Column("iacs", "Conductivity", "%IACS"),
        Column("ratio_20", "ρ / ρ(20 °C)", ""),
    )
    rho_20 = model.rho(CELSIUS + 20.0)
    rows = []
    for celsius in TABLE_TEMPERATURES_C:
        t = CELSIUS + celsius
        if t < model.valid_from - 1e-9 or t > model.valid_to + 1e-9:
            continue
        rho = model.rho(t)
        values = (celsius, t, rho * 1e8, 1e-6 / rho, dc.iacs_percent(rho), rho / rho_20)
        texts = (format_fixed(celsius, 0), format_fixed(t, 2), format_number(rho * 1e8, 5, True),
                 format_number(1e-6 / rho, 4, True), format_number(dc.iacs_percent(rho), 4, True),
                 format_number(rho / rho_20, 4, True))
        rows.append(Row(temperature_row_id(celsius), values, texts))
    span = (f"{format_fixed(model.valid_from - CELSIUS, 0)} °C to {format_fixed(model.valid_to - CELSIUS, 0)} °C")
    validity = f"Linear model valid {span}" + ("" if model.span_sourced else " (common practice, no source)")
    return Table(
        id="resistivity-temperature",
        title="Resistivity vs temperature",
        model=(f"ρ(T) = ρ_ref·[1 + α·(T − T_ref)], ρ_ref = {format_number(model.rho_ref * 1e8, 5)} µΩ·cm, "
               f"α = {format_number(model.alpha, 4)} /K, T_ref = {format_fixed(model.t_ref - CELSIUS, 1)} °C"),
        validity=validity,
        sources=model.sources,
        columns=columns,
        rows=tuple(rows),
    )


@dataclass(frozen=True)
class MaterialView:
    """Everything a material page shows."""

    material: Material
    model: LinearModel | None
    calc: dict | None
    tables: tuple[Table, ...]
    rho_20: float
    iacs_20: float


def derive_material(m: Material) -> MaterialView:
    model = linear_model(m)
    rho, t_rho, _ = reference_resistivity(m)
    rho_20 = model.rho(CELSIUS + 20.0) if model is not None else rho
    tables: list[Table] = []
    calc = None
    if model is not None:
        tables.append(resistivity_temperature_table(m, model))
        calc = calc_material(m, model)
    return MaterialView(material=m, model=model, calc=calc, tables=tuple(tables), rho_20=rho_20,
                        iacs_20=dc.iacs_percent(rho_20))


def derive(dataset: DataSet) -> list[MaterialView]:
    """Derive the views of every material, in id order."""
    return [derive_material(m) for m in dataset.materials]
