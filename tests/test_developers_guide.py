"""DEVELOPERS.md's two module tables (the package's, the core's) name every module of the package, and
only modules that exist: the guide's map of the code cannot drift from the layout."""

from __future__ import annotations

import pathlib
import re

ROOT = pathlib.Path(__file__).resolve().parents[1]
PACKAGE = ROOT / "generator" / "conductor_atlas"
NAME = re.compile(r"`([A-Za-z_0-9]+\.py)`")


def module_table_names(text: str) -> tuple[set[str], set[str]]:
    """The .py names in the first column of each table whose header starts with "| module |", in
    order: (the package's table, the core's table)."""
    tables: list[set[str]] = []
    rows = None
    for line in text.splitlines():
        if line.startswith("| module |"):
            rows = set()
            tables.append(rows)
        elif rows is not None and line.startswith("|"):
            first_cell = line.split("|")[1]
            rows.update(NAME.findall(first_cell))
        else:
            rows = None
    assert len(tables) == 2, f"expected the package's and the core's module tables, found {len(tables)}"
    return tables[0], tables[1]


def modules(folder: pathlib.Path) -> set[str]:
    return {p.name for p in folder.glob("*.py") if p.name not in ("__init__.py", "__main__.py")}


def test_the_module_tables_match_the_package():
    package_rows, core_rows = module_table_names((ROOT / "DEVELOPERS.md").read_text(encoding="utf-8"))
    package, core = modules(PACKAGE), modules(PACKAGE / "core")
    assert sorted(package - package_rows) == [], "modules missing from the package table of DEVELOPERS.md"
    assert sorted(package_rows - package) == [], "the package table of DEVELOPERS.md names modules that do not exist"
    assert sorted(core - core_rows) == [], "core modules missing from the core table of DEVELOPERS.md"
    assert sorted(core_rows - core) == [], "the core table of DEVELOPERS.md names modules that do not exist"


def test_the_table_reader_on_text_written_for_it():
    text = ("| module | job |\n|---|---|\n| `a.py`, `b.py` | uses `c.py` |\nprose `d.py`\n"
            "| module | job |\n|---|---|\n| `e.py` | x |\n")
    assert module_table_names(text) == ({"a.py", "b.py"}, {"e.py"})
