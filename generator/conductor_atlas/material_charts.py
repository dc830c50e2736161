"""The charts of a material page: ρ(T) (sourced points and the model curve) and δ(f), as SVG.

Curves are sampled with the same core models the tables use; svg_chart.py draws them.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from conductor_atlas.svg_chart import Series, line_chart
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.celsius import TWENTY_CELSIUS
from conductor_atlas.core.material_models import resistivity_or_none, within_model
from conductor_atlas.derive import MaterialView



@dataclass(frozen=True)
class Chart:
    id: str
    caption: str
    svg: str


def model_curve(record: dict, t_lo: float, t_hi: float, samples: int = 60) -> tuple[list[float], list[float]]:
    """(T [K], ρ [µΩ·cm]) along the auto model, only where it holds (material_models.within_model)."""
    xs, ys = [], []
    for i in range(samples + 1):
        t = t_lo + (t_hi - t_lo) * i / samples
        found = resistivity_or_none(record, t)
        if found is None:
            continue
        if not within_model(found):
            xs.append(t)
            ys.append(float("nan"))  # a gap in the line where no model holds
            continue
        xs.append(t)
        ys.append(found["rho"] * 1e8)
    return xs, ys


def temperature_chart(view: MaterialView) -> Chart | None:
    record = view.calc
    m = view.material
    lows, highs = [], []
    if m.table is not None:
        lows.append(m.table.temperatures[0])
        highs.append(m.table.temperatures[-1])
    if record["alpha"]:
        lows.append(record["valid_from"])
        highs.append(record["valid_to"])
    if record["cvd_a"]:
        lows.append(73.15)
        highs.append(1123.15)
    if not lows:
        return None
    xs, ys = model_curve(record, min(lows), max(highs))
    if sum(1 for y in ys if math.isfinite(y)) < 2:
        return None
    series = []
    if m.table is not None:
        series.append(Series("Sourced points", tuple(m.table.temperatures),
                             tuple(r * 1e8 for r in m.table.resistivities), "points"))
    series.append(Series("Model used by the calculators", tuple(xs), tuple(ys), "line"))
    svg = line_chart(series, x_label="Temperature", x_unit="K", y_label="Resistivity", y_unit="µΩ·cm",
                     title=f"Resistivity of {m.name} against temperature", chart_id="chart-rho-t",
                     y_domain=(0.0, 0.0))
    what = "sourced points and the model the calculators use" if m.table is not None else \
        "the model the calculators use, over the span where it holds"
    return Chart("chart-rho-t", f"Resistivity against temperature: {what} (gaps where no model holds)", svg)


def skin_depth_chart(view: MaterialView) -> Chart | None:
    record = view.calc
    if record["layer_share"] > 0:
        record = record["layer_cladding"]  # a clad wire's surface: its cladding
    found = resistivity_or_none(record, TWENTY_CELSIUS)
    if found is None:
        return None
    rho = found["rho"]
    fs = [50.0 * (1e11 / 50.0) ** (i / 80) for i in range(81)]
    ds = [skin.skin_depth(rho, f, record["mu_r"]) for f in fs]
    svg = line_chart([Series(view.material.name, tuple(fs), tuple(ds), "line")], x_label="Frequency", x_unit="Hz",
                     y_label="Skin depth", y_unit="m", x_log=True, y_log=True,
                     title=f"Skin depth of {view.material.name} against frequency at 20 °C", chart_id="chart-skin-depth")
    return Chart("chart-skin-depth", "Skin depth against frequency at 20 °C, δ = √(ρ/(π·f·μ0·μr))", svg)


def material_charts(view: MaterialView) -> list[Chart]:
    return [c for c in (temperature_chart(view), skin_depth_chart(view)) if c is not None]
