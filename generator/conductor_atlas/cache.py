"""The build cache: loaded data, derived views and rendered pages, reused when their inputs are unchanged.

Each entry is keyed by a SHA-256 of the *code version* (every file of this package and of
templates/, and the versions of the libraries whose output reaches a page) and of the entry's own
inputs:

- ``data``: every file under each data folder (relative path and bytes) -> the loaded DataSet;
- ``material:<id>``: the material record and the sources it cites -> its view and its pages;
- ``site:*``: the pages that list every material (home, compare, calculators, search index ...)
  -> keyed by the keys of all materials and the bibliography.

So a build with nothing changed reads everything back; editing one material file remakes that
material and the site-wide pages only. An entry is written to a temporary name and renamed into
place, so concurrent builds never read half an entry; an unreadable entry is made again. The
folder is ``paths.CACHE_DIR`` (``CONDUCTOR_ATLAS_CACHE`` moves it; delete it at will). After a
build, ``prune`` keeps the folder under ``LIMIT_BYTES`` by removing the entries read or written
longest ago, never one this build used.
Reads and writes only the cache folder; pure otherwise.
"""

from __future__ import annotations

import hashlib
import io
import os
import pickle
import platform
import tempfile
from importlib import metadata
from pathlib import Path
from types import MappingProxyType
from typing import Callable, TypeVar

from conductor_atlas.build_stamp import LIBRARIES
from conductor_atlas.paths import CACHE_DIR, PACKAGE_DIR, TEMPLATES_DIR

T = TypeVar("T")
FORMAT = b"conductor-atlas build cache 1"
# Size the entry folder may reach before the oldest entries go: about 40 builds of the shipped data
# (6 MB each). Common practice (no source): a cache bounded by size, least recently used out first.
LIMIT_BYTES = 250 * 1000 * 1000
# What the last build in this process made and reused (labels); the benchmark reads it.
LAST_STATS: dict[str, list[str]] = {"made": [], "reused": []}


def _mapping_proxy(contents: dict) -> MappingProxyType:
    return MappingProxyType(contents)


class _Pickler(pickle.Pickler):
    """Pickles the read-only mappings of the data model (MappingProxyType) as their contents."""

    def reducer_override(self, obj):
        if type(obj) is MappingProxyType:
            return _mapping_proxy, (dict(obj),)
        return NotImplemented


def dumps(value) -> bytes:
    buffer = io.BytesIO()
    _Pickler(buffer, protocol=pickle.HIGHEST_PROTOCOL).dump(value)
    return buffer.getvalue()


def _library_version(name: str) -> str:
    try:
        return metadata.version(name)
    except metadata.PackageNotFoundError:
        return "absent"


def code_version() -> bytes:
    """A digest of everything besides the data that decides the output."""
    digest = hashlib.sha256(FORMAT)
    digest.update(platform.python_version().encode())
    for name in LIBRARIES:
        digest.update(f"{name}={_library_version(name)}\0".encode())
    for root in (PACKAGE_DIR, TEMPLATES_DIR):
        for path in sorted(p for p in root.rglob("*") if p.is_file() and "__pycache__" not in p.parts):
            digest.update(path.relative_to(root).as_posix().encode() + b"\0")
            digest.update(path.read_bytes())
    return digest.digest()


def folder_key(folders: list[Path]) -> bytes:
    """Every file under each folder, in order: any edit, addition or removal changes the key."""
    digest = hashlib.sha256()
    for folder in folders:
        digest.update(str(folder.resolve()).encode() + b"\0\0")
        for path in sorted(p for p in folder.rglob("*") if p.is_file()):
            digest.update(path.relative_to(folder).as_posix().encode() + b"\0")
            digest.update(path.read_bytes())
    return digest.digest()


def files_key(files: dict[str, bytes]) -> bytes:
    """SHA-256 over every path, its length and its bytes, in path order: equal file sets, equal keys."""
    digest = hashlib.sha256()
    for path in sorted(files):
        digest.update(path.encode("utf-8") + b"\0" + str(len(files[path])).encode() + b"\0")
        digest.update(files[path])
    return digest.digest()


class BuildCache:
    """``get(label, key, make)``: the stored value for ``key``, or ``make()`` stored for next time."""

    def __init__(self, folder: Path | None = CACHE_DIR) -> None:
        self.folder = None if folder is None else folder / "build"
        self.version = code_version()
        self.made: list[str] = []
        self.reused: list[str] = []
        self.used: set[Path] = set()
        self.written: list[Path] = []
        LAST_STATS["made"], LAST_STATS["reused"] = self.made, self.reused

    def _path(self, label: str, key: bytes) -> Path:
        name = hashlib.sha256(self.version + label.encode("utf-8") + b"\0" + key).hexdigest()
        return self.folder / name[:2] / f"{name}.pickle"

    def get(self, label: str, key: bytes, make: Callable[[], T]) -> T:
        if self.folder is None:
            self.made.append(label)
            return make()
        path = self._path(label, key)
        self.used.add(path)
        try:
            value = pickle.loads(path.read_bytes())
            os.utime(path)  # recently used: pruned last
        except FileNotFoundError:
            pass
        except (pickle.UnpicklingError, EOFError, AttributeError, ImportError, TypeError, ValueError):
            pass  # written by another version or damaged: make it again
        else:
            self.reused.append(label)
            return value
        value = make()
        self.made.append(label)
        try:
            data = dumps(value)
        except (pickle.PicklingError, TypeError, AttributeError):
            return value  # not storable: correct, only not cached
        self._store(path, data)
        return value

    def _store(self, path: Path, data: bytes) -> None:
        try:
            path.parent.mkdir(parents=True, exist_ok=True)
            with tempfile.NamedTemporaryFile(dir=path.parent, prefix=".tmp-", delete=False) as handle:
                handle.write(data)
            os.replace(handle.name, path)
            self.written.append(path)
        except OSError:
            pass  # a cache that cannot be written only makes the next build slower

    def drop_if_code_changed(self) -> bool:
        """Remove what this build stored when the code changed while it ran; True if it did.

        The version is read from the files when the build starts, but the modules that render were
        imported earlier: a file edited in between (a test run or a build going while a developer
        edits) gives pages made by the old code under the new version, and every later build would
        reuse them. Comparing the version again at the end finds that window."""
        if self.folder is None or code_version() == self.version:
            return False
        for path in self.written:
            try:
                path.unlink()
            except OSError:
                pass
        self.written = []
        return True

    def prune(self, limit_bytes: int = LIMIT_BYTES) -> list[Path]:
        """Remove the least recently used entries until the folder holds at most ``limit_bytes``;
        entries this build used stay. Returns the removed paths."""
        if self.folder is None or not self.folder.is_dir():
            return []
        entries = []
        for path in self.folder.glob("*/*.pickle"):
            try:
                info = path.stat()
            except OSError:
                continue
            entries.append((info.st_mtime, path, info.st_size))
        total = sum(size for _, _, size in entries)
        removed = []
        for _, path, size in sorted(entries):
            if total <= limit_bytes:
                break
            if path in self.used:
                continue
            try:
                path.unlink()
            except OSError:
                continue
            total -= size
            removed.append(path)
        return removed
