"""Data sets for the benchmark, made in temporary folders (never in data/).

- ``copy_shipped(dest)``: the shipped data folder, copied so one file can be edited;
- ``scaled_copies(dest, factor)``: factor − 1 synthetic copies of every shipped material, each with a
  new id (``<id>-x<k>``), new aliases (``<alias> x<k>``, so aliases stay unique, as the loader
  demands) and a name that says it is a benchmark copy. Values are the shipped ones, unchanged:
  these files exist only to measure how the build scales and are never published.
"""

from __future__ import annotations

import json
import re
import shutil
import tomllib
from pathlib import Path

from conductor_atlas.paths import DATA_DIR

ID_LINE = re.compile(r'^id = "[^"\n]*"$', re.MULTILINE)
NAME_LINE = re.compile(r'^name = "[^"\n]*"$', re.MULTILINE)
ALIASES_LINE = re.compile(r"^aliases = \[[^\]]*\]$", re.MULTILINE)
SUMMARY_LINE = re.compile(r'^summary = "(?P<text>[^"\n]*)"$', re.MULTILINE)


def material_files(folder: Path = DATA_DIR) -> list[Path]:
    return sorted(p for p in (folder / "materials").glob("*.toml"))


def copy_shipped(dest: Path) -> Path:
    shutil.copytree(DATA_DIR, dest)
    return dest


def toml_string(text: str) -> str:
    return json.dumps(text, ensure_ascii=False)  # a JSON string is a valid TOML basic string


def renamed(text: str, copy: int) -> str:
    """One material file's text with id, name and aliases made unique for copy number ``copy``."""
    data = tomllib.loads(text)
    new_id = f"{data['id']}-x{copy}"
    out, count = ID_LINE.subn(f"id = {toml_string(new_id)}", text, count=1)
    if count != 1:
        raise ValueError(f"no single-line id in material {data['id']}")
    out = NAME_LINE.sub(f"name = {toml_string(data['name'] + f' (benchmark copy {copy})')}", out, count=1)
    aliases = [f"{a} x{copy}" for a in data.get("aliases", [])]
    if aliases or "aliases" in data:
        out, count = ALIASES_LINE.subn("aliases = [" + ", ".join(toml_string(a) for a in aliases) + "]", out,
                                       count=1)
        if count != 1:
            raise ValueError(f"aliases of material {data['id']} are not on one line")
    return out


def scaled_copies(dest: Path, factor: int) -> Path:
    """A --data folder holding (factor − 1) renamed copies of each shipped material."""
    folder = dest / "materials"
    folder.mkdir(parents=True)
    for path in material_files():
        text = path.read_text(encoding="utf-8")
        for copy in range(1, factor):
            (folder / f"{path.stem}-x{copy}.toml").write_text(renamed(text, copy), encoding="utf-8")
    return dest


def edit_one_material(data_folder: Path, material_id: str = "copper") -> Path:
    """Change one shipped material's summary, as a person editing that file would."""
    path = data_folder / "materials" / f"{material_id}.toml"
    text = path.read_text(encoding="utf-8")
    new, count = SUMMARY_LINE.subn(lambda m: f'summary = {toml_string(m["text"] + " (edited)")}', text, count=1)
    if count != 1:
        raise ValueError(f"{path} has no single-line summary to edit")
    path.write_text(new, encoding="utf-8")
    return path
