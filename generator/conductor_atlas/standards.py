"""Read and validate the conductor-standard tables in data/standards/*.toml.

A standards file of kind "maximum-resistance" holds a conductor standard's maximum DC resistance
per nominal size, one [[limits]] block per class and conductor column, and says which materials of
the data set each column applies to (see data/standards/iec60228.toml). Reads files only; every
problem is added to the loader's ``Problems`` as "file: field: expected …, found …".

The calculators get the tables as plain data (``limits_record``): areas in m², resistances in Ω/m.
"""

from __future__ import annotations

import math
import os
from dataclasses import dataclass
from pathlib import Path

STANDARD_KEYS = {"schema", "kind", "id", "title", "source", "temperature", "area_unit", "resistance_unit",
                 "conductors", "limits"}
LIMIT_KEYS = {"class", "conductor", "locator", "note", "rows"}
CONDUCTOR_KEYS = {"name", "materials"}
KINDS = {"maximum-resistance"}
CLASSES = {"1", "2", "5", "6"}


@dataclass(frozen=True)
class LimitTable:
    """One class and conductor column of a standard: nominal areas [m²] and maximum resistance [Ω/m]
    at ``temperature`` [K]."""

    standard: str          # the standards file's id, e.g. "iec60228"
    title: str
    source: str
    locator: str
    note: str
    klass: str
    conductor: str         # the column's key, e.g. "plain-copper"
    conductor_name: str
    materials: tuple[str, ...]
    temperature: float
    areas: tuple[float, ...]
    limits: tuple[float, ...]


def standard_files(folder: Path, problems) -> list[Path]:
    """FOLDER/standards/*.toml, sorted (none when the folder has no standards/; a standards/ that
    cannot be opened or is not a folder is reported)."""
    from conductor_atlas.data_fields import display_path, unreachable
    sub = folder / "standards"
    if not os.path.lexists(sub):
        return []
    why = unreachable(sub)
    if why is None and not sub.is_dir():
        why = "is not a folder (expected standards/*.toml)"
    if why is not None:
        problems.add(display_path(sub), why)
        return []
    try:
        return sorted(p for p in sub.iterdir() if p.name.endswith(".toml"))
    except OSError as exc:
        problems.add(display_path(sub), f"cannot be read ({exc.strerror})")
        return []


def read_standard(path: Path, sources: set[str], material_ids: set[str], problems) -> list[LimitTable]:
    """Validate one standards file into its limit tables ([] with problems reported when broken)."""
    from conductor_atlas.data_fields import convert, display_path, parse_temperature, read_toml
    data = read_toml(path, problems)
    if data is None:
        return []
    where = display_path(path)
    before = len(problems.lines)
    for key in sorted(set(data) - STANDARD_KEYS):
        problems.add(f"{where}: {key}", f"unknown key; expected one of {', '.join(sorted(STANDARD_KEYS))}")
    if data.get("schema") != 1:
        problems.add(f"{where}: schema", f"expected 1, found {data.get('schema')!r}")
    if data.get("kind") not in KINDS:
        problems.add(f"{where}: kind", f"expected one of {', '.join(sorted(KINDS))}, found {data.get('kind')!r}")
    for key in ("id", "title", "source"):
        if not isinstance(data.get(key), str) or not data.get(key, "").strip():
            problems.add(f"{where}: {key}", f"expected a non-empty string, found {data.get(key)!r}")
    source = data.get("source")
    if isinstance(source, str) and source and source not in sources:
        problems.add(f"{where}: source", f"unknown source key \"{source}\"; add it to data/sources.toml")
    temperature = parse_temperature(data.get("temperature"), f"{where}: temperature", problems)
    scales = []
    for key, target, example in (("area_unit", "m ** 2", "mm^2"), ("resistance_unit", "ohm / m", "ohm/km")):
        try:
            scales.append(convert(1.0, str(data.get(key)), target))
        except Exception:
            problems.add(f"{where}: {key}", f"expected a unit such as \"{example}\", found {data.get(key)!r}")
    conductors = read_conductors(data.get("conductors"), f"{where}: conductors", material_ids, problems)
    blocks = data.get("limits")
    if not isinstance(blocks, list) or len(blocks) == 0:
        problems.add(f"{where}: limits", "expected one or more [[limits]] blocks")
        blocks = []
    if len(problems.lines) > before:
        return []
    tables = []
    seen: set[tuple[str, str]] = set()
    for i, block in enumerate(blocks):
        here = f"{where}: limits[{i}]"
        table = read_limits(block, here, data, conductors, temperature, scales, problems)
        if table is None:
            continue
        if (table.klass, table.conductor) in seen:
            problems.add(here, f"class {table.klass} {table.conductor} is given twice")
            continue
        seen.add((table.klass, table.conductor))
        tables.append(table)
    return tables


def read_conductors(raw, where: str, material_ids: set[str], problems) -> dict[str, tuple[str, tuple[str, ...]]]:
    """[conductors.KEY] name and materials -> {key: (name, material ids)}; unknown ids are reported."""
    if not isinstance(raw, dict) or len(raw) == 0:
        problems.add(where, "expected [conductors.KEY] tables with name and materials")
        return {}
    out = {}
    for key in sorted(raw):
        entry = raw[key]
        if not isinstance(entry, dict):
            problems.add(f"{where}.{key}", "expected a table with name and materials")
            continue
        for extra in sorted(set(entry) - CONDUCTOR_KEYS):
            problems.add(f"{where}.{key}.{extra}", f"unknown key; expected one of {', '.join(sorted(CONDUCTOR_KEYS))}")
        name = entry.get("name")
        ids = entry.get("materials")
        if not isinstance(name, str) or not name.strip():
            problems.add(f"{where}.{key}.name", f"expected a non-empty string, found {name!r}")
            continue
        if not isinstance(ids, list) or not all(isinstance(x, str) for x in ids):
            problems.add(f"{where}.{key}.materials", f"expected a list of material ids, found {ids!r}")
            continue
        for material_id in ids:
            if material_id not in material_ids:
                problems.add(f"{where}.{key}.materials", f"no material has the id \"{material_id}\"")
        out[key] = (name.strip(), tuple(ids))
    return out


def read_limits(block, where: str, data: dict, conductors: dict, temperature: float, scales: list[float],
                problems) -> LimitTable | None:
    """One [[limits]] block: class, conductor, locator, rows of [area, maximum resistance]."""
    if not isinstance(block, dict):
        problems.add(where, "expected a table with class, conductor, locator and rows")
        return None
    before = len(problems.lines)
    for key in sorted(set(block) - LIMIT_KEYS):
        problems.add(f"{where}.{key}", f"unknown key; expected one of {', '.join(sorted(LIMIT_KEYS))}")
    if block.get("class") not in CLASSES:
        problems.add(f"{where}.class", f"expected one of {', '.join(sorted(CLASSES))} (as text), found {block.get('class')!r}")
    if block.get("conductor") not in conductors:
        problems.add(f"{where}.conductor", f"expected one of {', '.join(sorted(conductors))}, found {block.get('conductor')!r}")
    if not isinstance(block.get("locator"), str) or not block["locator"].strip():
        problems.add(f"{where}.locator", "is missing (name the table and column)")
    rows = block.get("rows")
    if not isinstance(rows, list) or len(rows) == 0:
        problems.add(f"{where}.rows", "expected a list of [nominal area, maximum resistance] pairs")
        return None
    areas: list[float] = []
    limits: list[float] = []
    for j, pair in enumerate(rows):
        here = f"{where}.rows[{j}]"
        if (not isinstance(pair, list) or len(pair) != 2
                or not all(isinstance(x, (int, float)) and not isinstance(x, bool) for x in pair)
                or not all(math.isfinite(x) and x > 0 for x in pair)):
            problems.add(here, f"expected [nominal area, maximum resistance] as two positive numbers, found {pair!r}")
            return None
        area, limit = pair[0] * scales[0], pair[1] * scales[1]
        if areas and not (area > areas[-1] and limit < limits[-1]):
            problems.add(here, f"areas must increase and resistances fall from row to row, found {pair!r} after {rows[j - 1]!r}")
            return None
        areas.append(area)
        limits.append(limit)
    if len(problems.lines) > before:
        return None
    name, ids = conductors[block["conductor"]]
    return LimitTable(standard=data["id"], title=data["title"].strip(), source=data["source"],
                      locator=block["locator"].strip(), note=str(block.get("note", "")), klass=block["class"],
                      conductor=block["conductor"], conductor_name=name, materials=ids, temperature=temperature,
                      areas=tuple(areas), limits=tuple(limits))


def limits_record(tables) -> list[dict]:
    """The tables as the calculators read them (catalogue["limits"]): plain lists and numbers, SI."""
    return [{"standard": t.standard, "title": t.title, "source": t.source, "locator": t.locator, "note": t.note,
             "klass": t.klass, "conductor": t.conductor, "conductor_name": t.conductor_name,
             "materials": list(t.materials), "temperature": t.temperature, "areas": list(t.areas),
             "limits": list(t.limits)} for t in tables]
