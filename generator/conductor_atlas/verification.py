"""How far each value is proven: verified against independent data, derived, from memory, estimated.

Reads ``data/verification.toml`` (written and checked by tests/support/crosscheck.py: which values
agree with which independent datasets) and classifies every value of a data set. Nothing here
writes; the record is read only from the shipped data folder, so a value in a user's own folder is
never shown as verified.

The kinds, in the order they are decided:
- ``verified``: the record lists the value (material, property) with this very number (a changed
  value no longer matches its record and falls through to the next kinds);
- ``estimated``: the note says "estimate", or the source is a demo;
- ``derived``: the note starts with "derived" (a stated rule computes it from other values);
- ``memory``: the note says "from memory" (entered from memory of the cited source, not cross-checked);
- ``cited``: none of these: taken from the cited source, not cross-checked.
"""

from __future__ import annotations

import tomllib
from dataclasses import dataclass
from pathlib import Path
from types import MappingProxyType
from typing import Mapping

from conductor_atlas.model import DataSet, Material, Value

RECORD_NAME = "verification.toml"
KINDS = ("verified", "derived", "memory", "estimated", "cited")
KIND_LABELS = {
    "verified": "verified against independent data",
    "derived": "derived by a stated rule",
    "memory": "from memory, not cross-checked",
    "estimated": "estimated",
    "cited": "from the cited source, not cross-checked",
}


@dataclass(frozen=True)
class Check:
    """One record entry: the value checked (None for a ρ(T) table), points compared, datasets."""

    value: float | None
    points: int
    against: tuple[str, ...]


@dataclass(frozen=True)
class Record:
    checks: Mapping[tuple[str, str], Check]
    datasets: Mapping[str, str]  # dataset label -> what it is and where it was read

    def for_material(self, material_id: str) -> tuple:
        return tuple(sorted((k[1], c) for k, c in self.checks.items() if k[0] == material_id))


EMPTY = Record(MappingProxyType({}), MappingProxyType({}))


@dataclass(frozen=True)
class Status:
    kind: str
    text: str  # what the page prints beside the value


def read_record(folder: Path) -> Record:
    """The record of ``folder`` (empty when it has none)."""
    path = folder / RECORD_NAME
    if not path.is_file():
        return EMPTY
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    datasets = data.pop("_datasets", {})
    checks = {}
    for material_id, props in data.items():
        for name, entry in props.items():
            checks[(material_id, name)] = Check(value=entry.get("value"), points=int(entry.get("points", 0)),
                                                against=tuple(entry["against"]))
    return Record(MappingProxyType(checks), MappingProxyType(dict(datasets)))


def same_number(a: float, b: float) -> bool:
    return abs(a - b) <= 1e-12 * max(abs(a), abs(b))


def value_status(material: Material, name: str, value: Value, record: Record, kind_of_source: str = "") -> Status:
    check = record.checks.get((material.id, name))
    if check is not None and check.value is not None and same_number(check.value, value.si):
        return Status("verified", "verified: agrees with " + ", ".join(check.against))
    note = value.note.lower()
    if "estimate" in note or kind_of_source == "demo":
        return Status("estimated", KIND_LABELS["estimated"])
    if note.startswith("derived"):
        return Status("derived", KIND_LABELS["derived"])
    if "from memory" in note:
        return Status("memory", KIND_LABELS["memory"])
    return Status("cited", KIND_LABELS["cited"])


def table_status(material: Material, record: Record) -> Status | None:
    if material.table is None:
        return None
    check = record.checks.get((material.id, "resistivity_table"))
    if check is not None and check.points > 0:
        return Status("verified", f"verified: {check.points} of {len(material.table.temperatures)} points agree "
                                  f"with " + ", ".join(check.against))
    if material.table.from_memory:
        return Status("memory", KIND_LABELS["memory"])
    return Status("cited", KIND_LABELS["cited"])


def statuses(dataset: DataSet, material: Material, record: Record) -> dict[str, Status]:
    """Every value's status (and "resistivity_table" for the table), by property name."""
    out = {}
    for name, value in material.properties.items():
        source = dataset.sources.get(value.source)
        out[name] = value_status(material, name, value, record, source.kind if source else "")
    table = table_status(material, record)
    if table is not None:
        out["resistivity_table"] = table
    return out


def summary(dataset: DataSet, record: Record) -> tuple[list[tuple[str, dict[str, int]]], dict[str, int]]:
    """Per material (id, {kind: count}) and the totals, every kind present as a key."""
    rows = []
    totals = {k: 0 for k in KINDS}
    for m in dataset.materials:
        counts = {k: 0 for k in KINDS}
        for status in statuses(dataset, m, record).values():
            counts[status.kind] += 1
            totals[status.kind] += 1
        rows.append((m.id, counts))
    return rows, totals


def summary_text(dataset: DataSet, record: Record) -> str:
    """The per-material and total table as plain text (``conductor-atlas check``)."""
    rows, totals = summary(dataset, record)
    heads = ("verified", "derived", "memory", "estimated", "cited", "total")
    width = max([len(r[0]) for r in rows] + [8])
    lines = [f"{'material':<{width}}  " + "  ".join(f"{h:>9}" for h in heads)]
    for material_id, counts in rows:
        cells = [counts[k] for k in KINDS] + [sum(counts.values())]
        lines.append(f"{material_id:<{width}}  " + "  ".join(f"{c:>9}" for c in cells))
    total = sum(totals.values())
    cells = [totals[k] for k in KINDS] + [total]
    lines.append(f"{'total':<{width}}  " + "  ".join(f"{c:>9}" for c in cells))
    share = (lambda k: f"{100.0 * totals[k] / total:.0f} %") if total else (lambda k: "0 %")
    lines.append("share: " + ", ".join(f"{KIND_LABELS[k]} {totals[k]} ({share(k)})" for k in KINDS))
    return "\n".join(lines)
