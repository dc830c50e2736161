"""A derived table: titled columns with units, rows with stable ids, and the text shown per cell.

Tables are computed by ``conductor_atlas.derive`` and rendered three ways: HTML (with a
link per row), CSV (header "label [unit]") and JSON. Row ids are built from the row's
defining value (e.g. "t-40c" for −40 °C), so they survive a rebuild and a change of data.
"""

from __future__ import annotations

import csv
import functools
import io
import json
import math
from dataclasses import dataclass

from conductor_atlas.core.numfmt import format_plain
from conductor_atlas.edition import TOKEN as EDITION_TOKEN


@dataclass(frozen=True)
class Column:
    key: str
    label: str
    unit: str = ""
    numeric: bool = True

    @property
    def header(self) -> str:
        return f"{self.label} [{self.unit}]" if self.unit else self.label


@dataclass(frozen=True)
class Row:
    id: str
    values: tuple  # one per column: float for numeric columns, str otherwise
    texts: tuple[str, ...]  # what a person reads in each cell


@dataclass(frozen=True)
class Table:
    id: str
    title: str
    model: str
    validity: str
    sources: tuple[str, ...]
    columns: tuple[Column, ...]
    rows: tuple[Row, ...]
    note: str = ""

    def to_csv(self) -> str:
        buffer = io.StringIO()
        writer = csv.writer(buffer, lineterminator="\n")
        writer.writerow(["row_id"] + [c.header for c in self.columns] + ["data_edition"])
        for row in self.rows:
            cells = [format_plain(v, 8) if c.numeric else str(v) for c, v in zip(self.columns, row.values)]
            writer.writerow([row.id] + cells + [EDITION_TOKEN])
        return buffer.getvalue()

    def to_json(self) -> str:
        payload = {
            "id": self.id,
            "title": self.title,
            "model": self.model,
            "validity": self.validity,
            "note": self.note,
            "sources": list(self.sources),
            "data_edition": EDITION_TOKEN,
            "columns": [{"key": c.key, "label": c.label, "unit": c.unit} for c in self.columns],
            "rows": [{"row_id": r.id, **{c.key: json_value(v) for c, v in zip(self.columns, r.values)}}
                     for r in self.rows],
        }
        return json.dumps(payload, ensure_ascii=False, indent=1, sort_keys=False) + "\n"


def json_value(v):
    """A cell for JSON: non-finite numbers (no value on record) become null, never NaN."""
    if isinstance(v, float) and not math.isfinite(v):
        return None
    return v


@functools.lru_cache(maxsize=None)  # the same few values for every material
def temperature_row_id(celsius: float) -> str:
    """Stable row id for a temperature in °C: -40 -> "t-m40c", 20 -> "t-20c", 2.5 -> "t-2p5c"."""
    text = format_plain(abs(celsius), 6).replace(".", "p")
    return f"t-{'m' if celsius < 0 else ''}{text}c"
