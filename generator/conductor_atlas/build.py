"""The pipeline: load -> derive -> render -> transpile -> publish.

Everything is computed in memory first; only ``publish`` touches the output folder.
"""

from __future__ import annotations

import time
from dataclasses import dataclass
from pathlib import Path

from conductor_atlas import __version__
from conductor_atlas.derive import derive
from conductor_atlas.load import load_dataset
from conductor_atlas.model import DataSet
from conductor_atlas.offline import add_offline_files
from conductor_atlas.paths import DATA_DIR, STATIC_DIR, TEMPLATES_DIR
from conductor_atlas.publish import publish
from conductor_atlas.render import Renderer
from conductor_atlas.search_index import search_index_files
from conductor_atlas.transpile import transpile_core


@dataclass(frozen=True)
class BuildReport:
    out: Path
    materials: int
    files: int
    bytes: int
    seconds: float


def data_folders(extra: list[Path] | None = None) -> list[Path]:
    """The shipped data folder first, then any --data folders in the order given."""
    return [DATA_DIR] + list(extra or [])


def static_files() -> dict[str, bytes]:
    return {f"static/{p.relative_to(STATIC_DIR).as_posix()}": p.read_bytes()
            for p in sorted(STATIC_DIR.rglob("*")) if p.is_file()}


def assemble(dataset: DataSet) -> dict[str, bytes]:
    """Every output file of the site, in memory."""
    views = derive(dataset)
    files = Renderer(TEMPLATES_DIR, __version__).render_site(dataset, views)
    files.update(search_index_files(dataset, views, files))
    files.update(static_files())
    files.update(transpile_core())
    return add_offline_files(files)  # last: the service worker lists every other file


def build(out: Path, extra_data: list[Path] | None = None) -> BuildReport:
    start = time.perf_counter()
    dataset = load_dataset(data_folders(extra_data))
    files = assemble(dataset)
    published = publish(files, out)
    return BuildReport(out=published, materials=len(dataset.materials), files=len(files),
                       bytes=sum(len(b) for b in files.values()), seconds=time.perf_counter() - start)
