"""The data edition: which state of the data a page, CSV or JSON was built from, and what changed.

An edition is named by the date of the newest committed change to the data folders (from git;
"undated" where the folders are not in a git work tree) and a short digest of every file in them
(SHA-256, first 10 hex digits), e.g. "2026-12-02 · 3f9a1c2e7b". Any edit changes the digest, so two
pages with the same edition were built from the same numbers.

Pages are rendered with ``TOKEN`` where the edition goes and ``stamp`` replaces it in the assembled
files, so cached pages stay valid when another material changes.

``data/previous-edition.toml`` keeps the values of the last published edition as text
(``snapshot_text``); ``changes`` compares the current values with it for the "What changed" page.
Nothing here writes files (``python -m conductor_atlas.edition --snapshot`` prints a snapshot).
"""

from __future__ import annotations

import hashlib
import subprocess
import sys
import tomllib
from dataclasses import dataclass
from pathlib import Path

from conductor_atlas.core.numfmt import format_number
from conductor_atlas.model import DataSet
from conductor_atlas.schema import DISPLAY_UNITS, PROPERTIES

TOKEN = "@@conductor-atlas-data-edition@@"
PREVIOUS_NAME = "previous-edition.toml"
STAMPED_SUFFIXES = (".html", ".csv", ".json")


@dataclass(frozen=True)
class Edition:
    date: str     # YYYY-MM-DD of the newest committed data change, or "undated"
    digest: str   # first 10 hex digits of SHA-256 over every data file

    @property
    def label(self) -> str:
        return f"{self.date} · {self.digest}"


def data_digest(folders: list[Path]) -> str:
    """SHA-256 over every file's relative path and bytes, folder by folder, in path order."""
    digest = hashlib.sha256()
    for folder in folders:
        for path in sorted(p for p in folder.rglob("*") if p.is_file()):
            digest.update(path.relative_to(folder).as_posix().encode("utf-8") + b"\0")
            digest.update(path.read_bytes() + b"\0")
    return digest.hexdigest()[:10]


def data_date(folders: list[Path]) -> str:
    """The newest committer date (YYYY-MM-DD, UTC) of a commit touching any of the folders."""
    dates = []
    for folder in folders:
        try:
            result = subprocess.run(["git", "log", "-1", "--format=%cd", "--date=format-local:%Y-%m-%d",
                                     "--", "."], cwd=folder, capture_output=True, text=True, timeout=10,
                                    env={"TZ": "UTC", "PATH": "/usr/bin:/bin:/usr/local/bin"})
        except (OSError, subprocess.SubprocessError):
            continue
        if result.returncode == 0 and len(result.stdout.strip()) == 10:
            dates.append(result.stdout.strip())
    return max(dates) if dates else "undated"


def current_edition(folders: list[Path]) -> Edition:
    return Edition(date=data_date(folders), digest=data_digest(folders))


def stamp(files: dict[str, bytes], edition: Edition) -> dict[str, bytes]:
    """Every page, CSV and JSON with the edition in place of ``TOKEN``."""
    token, label = TOKEN.encode("utf-8"), edition.label.encode("utf-8")
    return {path: (data.replace(token, label) if path.endswith(STAMPED_SUFFIXES) else data)
            for path, data in files.items()}


def value_texts(dataset: DataSet) -> dict[str, str]:
    """"material/property" -> the value as a reader cites it: number, range, SI unit, condition."""
    out = {}
    for m in dataset.materials:
        for name, v in sorted(m.properties.items()):
            unit = DISPLAY_UNITS.get(PROPERTIES[name].unit, PROPERTIES[name].unit)
            text = (format_number(v.si, 6) + " " + unit).strip()
            if v.low is not None and v.high is not None:
                text += f" ({format_number(v.low, 6)} to {format_number(v.high, 6)})"
            if v.temperature is not None:
                text += f" at {format_number(v.temperature, 6)} K"
            out[f"{m.id}/{name}"] = text
        if m.table is not None:
            points = ", ".join(f"{format_number(t, 6)} K: {format_number(r, 6)}"
                               for t, r in zip(m.table.temperatures, m.table.resistivities))
            out[f"{m.id}/resistivity_table"] = f"Ω·m at {points}"
    return out


@dataclass(frozen=True)
class Previous:
    edition: str
    values: dict[str, str]


def read_previous(folder: Path) -> Previous | None:
    path = folder / PREVIOUS_NAME
    if not path.is_file():
        return None
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    return Previous(edition=str(data.get("edition", "")), values=dict(data.get("values", {})))


def changes(previous: Previous, current: dict[str, str]) -> dict[str, list[tuple[str, str, str]]]:
    """{"added": [(key, "", new)], "changed": [(key, old, new)], "removed": [(key, old, "")]}."""
    out: dict[str, list[tuple[str, str, str]]] = {"added": [], "changed": [], "removed": []}
    for key in sorted(set(previous.values) | set(current)):
        old, new = previous.values.get(key), current.get(key)
        if old is None:
            out["added"].append((key, "", new))
        elif new is None:
            out["removed"].append((key, old, ""))
        elif old != new:
            out["changed"].append((key, old, new))
    return out


def _toml_string(text: str) -> str:
    return '"' + text.replace("\\", "\\\\").replace('"', '\\"') + '"'


def snapshot_text(edition: Edition, values: dict[str, str]) -> str:
    lines = ["# The values of the last published data edition, as text: the 'What changed' page compares",
             "# the current data with it. Made by `python -m conductor_atlas.edition --snapshot` when an",
             "# edition is published.",
             f"edition = {_toml_string(edition.label)}", "", "[values]"]
    lines.extend(f"{_toml_string(key)} = {_toml_string(text)}" for key, text in sorted(values.items()))
    return "\n".join(lines) + "\n"


if __name__ == "__main__":
    from conductor_atlas.build import data_folders
    from conductor_atlas.load import load_dataset
    if "--snapshot" in sys.argv:
        folders = data_folders()
        sys.stdout.write(snapshot_text(current_edition(folders), value_texts(load_dataset(folders))))
