"""The rows of the compare page: one line per material with the figures people sort by.

Each cell carries the SI-derived number (for sorting, CSV) and the text shown.
"""

from __future__ import annotations

from dataclasses import dataclass

from conductor_atlas.core import resistance as dc
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.material_models import local_temperature_coefficient
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.celsius import TWENTY_CELSIUS
from conductor_atlas.derive import MaterialView, rho_at_20
from conductor_atlas.schema import CLASSES, PROPERTIES
from conductor_atlas.derived_table import Column, Row, Table

IACS_DENSITY = 8890.0  # kg/m³, IEC 60028 density of standard annealed copper


@dataclass(frozen=True)
class Cell:
    value: float | None
    text: str


@dataclass(frozen=True)
class CompareRow:
    id: str
    name: str
    klass: str
    cells: tuple[Cell, ...]


# a column of a recorded property shows it in its display unit (schema.PROPERTIES[...].shown)
RHO, IACS, ALPHA, DENSITY, MFP = (PROPERTIES[name] for name in (
    "resistivity", "conductivity_iacs", "temperature_coefficient", "density", "mean_free_path"))

COLUMNS = (
    ("rho", "ρ at 20 °C", RHO.shown_unit),
    ("iacs", "Conductivity", IACS.shown_unit),
    ("alpha", "α at 20 °C", ALPHA.shown_unit),
    ("density", "Density", DENSITY.shown_unit),
    ("mass_iacs", "Conductivity per mass", "% of copper"),
    ("mfp", "Mean free path", MFP.shown_unit),
    ("delta_50", "Skin depth at 50 Hz", "mm"),
    ("delta_1m", "Skin depth at 1 MHz", "µm"),
)


def cell(value: float | None, scale: float, sig: int) -> Cell:
    if value is None:
        return Cell(None, "—")
    return Cell(value * scale, format_number(value * scale, sig))


def local_alpha(record: dict) -> float | None:
    """α at 20 °C by the core's local coefficient; None where no model holds there without a warning."""
    alpha, warnings = local_temperature_coefficient(record, TWENTY_CELSIUS, "auto")
    return None if warnings else alpha


def surface_of(record: dict, rho: float) -> tuple[float, float]:
    """(ρ at 20 °C, μr) of what a conductor's surface is made of: a clad wire's cladding, else itself."""
    if record["layer_share"] > 0:
        clad = record["layer_cladding"]
        return rho_at_20(clad)[0], clad["mu_r"]
    return rho, record["mu_r"]


def compare_rows(views: list[MaterialView]) -> list[CompareRow]:
    rows = []
    for v in sorted(views, key=lambda v: v.rho_20):
        record = v.calc
        rho = v.rho_20
        density = record["density"] or None
        mass_iacs = dc.iacs_percent(rho) * IACS_DENSITY / density if density else None
        mfp = record["mean_free_path"] or None
        surface = surface_of(record, rho)
        cells = (
            cell(rho, RHO.shown_scale, 4),
            cell(dc.iacs_percent(rho), IACS.shown_scale, 3),
            cell(local_alpha(record), ALPHA.shown_scale, 3),
            cell(density, DENSITY.shown_scale, 4),
            cell(mass_iacs, 1.0, 3),
            cell(mfp, MFP.shown_scale, 3),
            cell(skin.skin_depth(surface[0], 50.0, surface[1]), 1e3, 3),
            cell(skin.skin_depth(surface[0], 1e6, surface[1]), 1e6, 3),
        )
        rows.append(CompareRow(v.material.id, v.material.name, CLASSES[v.material.klass], cells))
    return rows


def compare_table(rows: list[CompareRow]) -> Table:
    """The compare page's table for CSV/JSON download (same numbers, display units in headers)."""
    columns = (Column("material", "Material id", "", numeric=False), Column("name", "Material", "", numeric=False),
               Column("class", "Class", "", numeric=False)) + tuple(Column(k, label, unit) for k, label, unit in COLUMNS)
    out = []
    for r in rows:
        values = (r.id, r.name, r.klass) + tuple(c.value if c.value is not None else float("nan") for c in r.cells)
        out.append(Row(r.id, values, tuple(str(v) for v in values)))
    return Table(id="all-materials", title="All materials at 20 °C",
                 model="ρ and α at 20 °C by each material's model; %IACS = 100·ρ_IACS/ρ; conductivity per mass = "
                       "%IACS × 8.89 g/cm³ / density; δ = √(ρ/(π·f·μ0·μr))",
                 validity="20 °C; empty cells where a material has no value on record",
                 sources=("iec60028",), columns=columns, rows=tuple(out))
