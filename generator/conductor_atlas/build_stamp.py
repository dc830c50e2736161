"""Tell, before importing anything a build needs, that ``conductor-atlas build`` has nothing to do.

A build is a function of its inputs: the data folders, the code (this package, templates/ and the
static files in it), the libraries whose output reaches a page (their installed versions), the
Python running it and the command-line options. After each build the command line records beside
the output folder (".<name>.inputs.json", next to the publish record) the size and modification
time of every input file, taken *before* the build read them, with the options, the Python and
the libraries' installed versions, and the digest of the site it published. The next
``conductor-atlas build`` stats the same files (no reading, no numpy, pint, jinja2 or markdown):
when every stat, option and version is the same and the output folder still holds exactly what
the publish record says, the site is already built and nothing is done.

Anything else is a full build: a file edited, added or removed in any input folder, another
``--data`` or ``--out``, another library version or Python, a site touched by hand, an unreadable
record, another build holding the folder's lock. A file modified less than ``RACY_NS`` before its
stat may be edited again within the same clock tick without its size or time changing (file systems
keep times in ticks of up to 2 s), so such files are also recorded by a SHA-256 of their bytes and
compared by content. Like the build cache's data key, the edition date git gives the data folders
is not an input here: committing a data file that is already built changes no file, so no rebuild.

Standard library only, and only its light modules: this runs on every ``build``.
"""

from __future__ import annotations

import fcntl
import hashlib
import json
import os
import stat
import sys
import time
from pathlib import Path

from conductor_atlas.paths import DATA_DIR, PACKAGE_DIR, TEMPLATES_DIR

FORMAT = "conductor-atlas build inputs 1"
# The libraries whose output reaches a page (the build cache keys its entries on them too).
LIBRARIES = ("jinja2", "markdown", "markupsafe", "pint", "numpy", "transcrypt")
MARKER = ".conductor-atlas-site"          # the file that marks a folder as a built site (publish.py)
RACY_NS = 2_000_000_000                    # 2 s: the coarsest common file-time tick (FAT)


def record_path(out: Path) -> Path:
    """The publish record of output folder ``out`` (written by publish.py)."""
    return out.parent / f".{out.name}.published.json"


def inputs_path(out: Path) -> Path:
    return out.parent / f".{out.name}.inputs.json"


def file_stamps(folder: Path) -> dict[str, list[int]] | None:
    """relative path -> [size, mtime_ns] of every file under ``folder`` but the marker; None if
    something there is not a plain file or folder (a link, a socket …)."""
    stamps: dict[str, list[int]] = {}
    pending = [(str(folder), "")]
    while pending:
        path, prefix = pending.pop()
        with os.scandir(path) as entries:
            for entry in entries:
                rel = prefix + entry.name
                if entry.is_dir(follow_symlinks=False):
                    pending.append((entry.path, rel + "/"))
                elif entry.is_file(follow_symlinks=False):
                    if rel != MARKER:
                        info = entry.stat(follow_symlinks=False)
                        stamps[rel] = [info.st_size, info.st_mtime_ns]
                else:
                    return None
    return stamps


def library_versions() -> list[str]:
    """The installed distributions of LIBRARIES, by their metadata folder names ("numpy-1.26.4.dist-info"):
    one directory listing per import path, instead of importing importlib.metadata."""
    wanted = {name.lower() for name in LIBRARIES}
    found = []
    for entry in sys.path:
        try:
            names = os.listdir(entry or ".")
        except OSError:
            continue
        for name in names:
            if name.endswith((".dist-info", ".egg-info")) and name.split("-")[0].lower().replace(".", "_") in wanted:
                found.append(f"{entry}/{name}")
    return sorted(found)


def _stamp_folder(folder: Path, racy_after_ns: int | None = None) -> dict[str, list]:
    """relative path -> [size, mtime_ns], plus a SHA-256 of the bytes for files modified after
    ``racy_after_ns`` (none when it is None)."""
    stamps: dict[str, list] = {}
    pending = [(str(folder), "")]
    while pending:
        path, prefix = pending.pop()
        with os.scandir(path) as entries:
            for entry in entries:
                if entry.name == "__pycache__":
                    continue
                rel = prefix + entry.name
                if entry.is_dir():
                    pending.append((entry.path, rel + "/"))
                    continue
                try:
                    info = entry.stat()
                except OSError:  # a link loop or a dangling link: the loader reports it; never "unchanged"
                    stamps[rel] = [-1, -1, "unreadable"]
                    continue
                stamp: list = [info.st_size, info.st_mtime_ns]
                if not stat.S_ISREG(info.st_mode):  # a pipe or device: reading it could block
                    stamps[rel] = stamp + ["not a regular file"]
                    continue
                if racy_after_ns is not None and info.st_mtime_ns > racy_after_ns:
                    stamp.append(hashlib.sha256(Path(entry.path).read_bytes()).hexdigest())
                stamps[rel] = stamp
    return stamps


def _same_folder(folder: Path, recorded: dict) -> bool:
    """True when ``folder`` holds exactly the files of ``recorded``, with the same stats (and bytes
    for the files recorded by content)."""
    on_disk = _stamp_folder(folder)
    if on_disk.keys() != recorded.keys():
        return False
    for rel, stamp in recorded.items():
        if on_disk[rel][:2] != stamp[:2]:
            return False
        if len(stamp) > 2:
            if len(on_disk[rel]) > 2:  # not a regular file now: compare the markers, never read it
                if on_disk[rel][2:] != stamp[2:]:
                    return False
            elif hashlib.sha256((folder / rel).read_bytes()).hexdigest() != stamp[2]:
                return False
    return True


class BuildInputs:
    """What one ``build`` is made from, stated before the build reads any of it."""

    def __init__(self, out: Path, extra_data: list[Path]) -> None:
        self.out = Path(os.path.abspath(out))
        self.folders = [Path(os.path.abspath(p)) for p in [DATA_DIR, *extra_data]] + [PACKAGE_DIR, TEMPLATES_DIR]
        self.head = {"format": FORMAT, "python": sys.version, "executable": sys.executable,
                     "out": str(self.out), "folders": [str(p) for p in self.folders]}
        self.stamps: list | None = None
        try:
            racy_after = time.time_ns() - RACY_NS
            self.head["libraries"] = library_versions()
            self.stamps = [_stamp_folder(folder, racy_after) for folder in self.folders]
        except OSError:
            self.stamps = None  # a missing --data folder and the like: the build says what is wrong

    def _recorded(self) -> dict | None:
        try:
            record = json.loads(inputs_path(self.out).read_text(encoding="utf-8"))
        except (OSError, UnicodeDecodeError, ValueError):
            return None
        return record if isinstance(record, dict) else None

    def previous_build(self) -> dict | None:
        """The report of the last build (materials, files, bytes) when it is still the site for
        these inputs, else None. Holds the output folder's lock while it looks: a build writing the
        folder now means "not up to date" (that build then refuses with its own message)."""
        if self.stamps is None:
            return None
        try:
            lock = open(self.out.parent / f".{self.out.name}.lock", "a")
        except OSError:
            return None
        with lock:
            try:
                fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
            except OSError:
                return None
            try:
                return self._previous_locked()
            except OSError:
                return None

    def _previous_locked(self) -> dict | None:
        record = self._recorded()
        if record is None or record.get("head") != self.head or not isinstance(record.get("stamps"), list):
            return None
        if len(record["stamps"]) != len(self.folders):
            return None
        for folder, recorded in zip(self.folders, record["stamps"]):
            if not isinstance(recorded, dict) or not _same_folder(folder, recorded):
                return None
        try:
            published = json.loads(record_path(self.out).read_text(encoding="utf-8"))
        except (UnicodeDecodeError, ValueError):
            return None
        if not isinstance(published, dict) or published.get("digest") != record.get("site_digest"):
            return None
        if file_stamps(self.out) != published.get("files"):
            return None
        return record.get("report")

    def remember(self, report: dict) -> None:
        """Record these inputs as those of the site just published (the caller holds the output lock);
        a record that cannot be written only costs the next build a full run."""
        path = inputs_path(self.out)
        try:
            path.unlink(missing_ok=True)
            if self.stamps is None:
                return
            published = json.loads(record_path(self.out).read_text(encoding="utf-8"))
            record = {"head": self.head, "stamps": self.stamps, "site_digest": published["digest"],
                      "report": report}
            path.write_text(json.dumps(record, sort_keys=True) + "\n", encoding="utf-8")
        except (OSError, ValueError, KeyError, TypeError):
            pass
