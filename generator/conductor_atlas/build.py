"""The pipeline: load -> derive -> render -> transpile -> publish.

Everything is computed in memory first; only ``publish`` touches the output folder.
"""

from __future__ import annotations

import dataclasses
import hashlib
import time
from dataclasses import dataclass
from pathlib import Path

from conductor_atlas import __version__
from conductor_atlas.build_stamp import BuildInputs
from conductor_atlas.cache import BuildCache, files_key, folder_key
from conductor_atlas.derive import derive_material
from conductor_atlas.load import load_dataset
from conductor_atlas.model import DataSet, Material
from conductor_atlas.offline import add_offline_files, classic_bundles, scripts_of
from conductor_atlas.paths import CACHE_DIR, DATA_DIR, STATIC_DIR, TEMPLATES_DIR
from conductor_atlas.publish import check_replaceable, output_lock, publish
from conductor_atlas.render import Renderer
from conductor_atlas.search_index_file import search_index_files
from conductor_atlas.transpile import PendingTranspile
from conductor_atlas.verification import read_record
from conductor_atlas.edition import Edition, current_edition, read_previous, stamp


@dataclass(frozen=True)
class BuildReport:
    out: Path
    materials: int
    files: int
    bytes: int
    seconds: float
    written: bool = True   # False: the folder already held exactly this site, nothing was written


def data_folders(extra: list[Path] | None = None) -> list[Path]:
    """The shipped data folder first, then any --data folders in the order given."""
    return [DATA_DIR] + list(extra or [])


def static_files() -> dict[str, bytes]:
    return {f"static/{p.relative_to(STATIC_DIR).as_posix()}": p.read_bytes()
            for p in sorted(STATIC_DIR.rglob("*")) if p.is_file()}


def material_key(dataset: DataSet, m: Material) -> bytes:
    """What one material's view and pages are made from: its record, the sources it cites and
    what the verification record says about it."""
    checks = dataset.verification.for_material(m.id) if dataset.verification is not None else ()
    return repr((m, [dataset.sources[k] for k in m.source_keys()], checks)).encode("utf-8")


def load_with_record(folders: list[Path]) -> DataSet:
    """The data set with the shipped folder's verification record, the data edition and the
    previous edition's values attached."""
    return dataclasses.replace(load_dataset(folders), verification=read_record(DATA_DIR),
                               edition=current_edition(folders), previous=read_previous(DATA_DIR))


def assemble(dataset: DataSet, cache: BuildCache | None = None,
             transpile: PendingTranspile | None = None) -> dict[str, bytes]:
    """Every output file of the site, in memory; parts whose inputs are unchanged come from ``cache``.

    ``transpile``: a transpile of the core already running (``build`` starts it before loading);
    without one, the core is transpiled (or read from the cache) at the end.
    """
    cache = cache or BuildCache(None)
    renderer = Renderer(TEMPLATES_DIR, __version__)
    views, files, keys, page_titles = [], {}, [], {}
    for m in dataset.materials:
        key = material_key(dataset, m)
        keys.append(key)

        def make(m=m):
            view = derive_material(m)
            return view, renderer.render_material(dataset, view)

        view, pages = cache.get(f"material:{m.id}", key, make)
        views.append(view)
        files.update(pages.files)
        page_titles.update(pages.titles)
    site_key = hashlib.sha256(b"\0".join(keys) + repr(list(dataset.sources.values())).encode()
                              + repr(dataset.limits).encode()
                              + repr((dataset.verification, dataset.previous)).encode()).digest()
    listings = cache.get("site:listings", site_key, lambda: renderer.render_listings(dataset, views))
    files.update(listings.files)
    titles = {**page_titles, **listings.titles}
    files.update(cache.get("site:search-index", site_key, lambda: search_index_files(dataset, views, titles)))
    files.update(static_files())
    if transpile is None:
        with PendingTranspile() as pending:
            files.update(pending.result())
    else:
        files.update(transpile.result())
    files.update(renderer.folder_pages(files))  # after every other file: a page for each bare folder
    scripts = scripts_of(files)
    bundles = cache.get("site:classic-bundles", files_key(scripts), lambda: classic_bundles(scripts))
    files = stamp(files, dataset.edition or Edition("undated", "unknown"))
    return add_offline_files(files, bundles)  # last: the service worker lists every other file


def build(out: Path, extra_data: list[Path] | None = None, inputs: BuildInputs | None = None) -> BuildReport:
    """Build the site into ``out``. ``inputs``: the stats of the build's inputs taken before it
    started (the command line's up-to-date check); recorded beside the folder once it is published,
    inside the output lock, so the next ``conductor-atlas build`` can tell that nothing changed."""
    start = time.perf_counter()
    # The output lock is taken first: a second build into the same folder is refused at once.
    with output_lock(out) as folder:
        check_replaceable(folder)
        with PendingTranspile() as transpile:  # runs beside loading, deriving and rendering
            cache = BuildCache(CACHE_DIR)
            folders = data_folders(extra_data)
            dataset = cache.get("site:data", folder_key(folders), lambda: load_with_record(folders))
            files = assemble(dataset, cache, transpile)
        published = publish(files, folder, lock_held=True)
        report = BuildReport(out=published.folder, materials=len(dataset.materials), files=len(files),
                             bytes=sum(len(b) for b in files.values()), seconds=time.perf_counter() - start,
                             written=published.written)
        if inputs is not None:
            inputs.remember({"materials": report.materials, "files": report.files, "bytes": report.bytes})
    cache.drop_if_code_changed()
    cache.prune()
    return report
