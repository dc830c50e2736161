"""Stage 5, the only stage that writes the site: build into a temporary sibling folder, then swap.

A failed build leaves the previous site untouched; two builds into one folder at once are
refused by a lock; a folder that is not a Conductor Atlas site is never replaced.
"""

from __future__ import annotations

import fcntl
import os
import shutil
from contextlib import contextmanager
from pathlib import Path
from typing import Iterator

from conductor_atlas.errors import BuildError

MARKER = ".conductor-atlas-site"


def check_replaceable(out: Path) -> None:
    if not out.exists():
        return
    if not out.is_dir():
        raise BuildError(f"{out} exists and is not a folder; choose another --out")
    if any(out.iterdir()) and not (out / MARKER).is_file():
        raise BuildError(f"refusing to replace {out}: it is not empty and was not made by conductor-atlas "
                         f"(no {MARKER} file); choose another --out")


@contextmanager
def output_lock(out: Path) -> Iterator[Path]:
    """Hold the exclusive lock of output folder ``out`` (a flock on ".<name>.lock" beside it), or
    raise BuildError at once if another build holds it. Yields the resolved folder."""
    out = out.resolve()
    out.parent.mkdir(parents=True, exist_ok=True)
    with open(out.parent / f".{out.name}.lock", "w") as lock:
        try:
            fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
        except BlockingIOError as exc:
            raise BuildError(f"another build is writing {out} right now; wait for it to finish") from exc
        yield out


def publish(files: dict[str, bytes], out: Path, lock_held: bool = False) -> Path:
    """Write ``files`` (relative path -> bytes) as the new site at ``out``, atomically.

    Takes the output lock itself unless ``lock_held`` (the caller is inside ``output_lock(out)``,
    as ``build`` is from its start, so a second build is refused before it does any work)."""
    if lock_held:
        return _publish_locked(files, out.resolve())
    with output_lock(out) as folder:
        return _publish_locked(files, folder)


def _publish_locked(files: dict[str, bytes], out: Path) -> Path:
    """Stage ``files`` beside ``out`` and swap them in; the caller holds the output lock."""
    check_replaceable(out)
    # leftovers of a build that was killed mid-publish: safe to remove while we hold the lock
    for stale in out.parent.glob(f".{out.name}.new-*"):
        shutil.rmtree(stale, ignore_errors=True)
    for stale in out.parent.glob(f".{out.name}.old-*"):
        shutil.rmtree(stale, ignore_errors=True)
    staging = out.parent / f".{out.name}.new-{os.getpid()}"
    if staging.exists():
        shutil.rmtree(staging)
    try:
        for rel in sorted(files):
            target = staging / rel
            target.parent.mkdir(parents=True, exist_ok=True)
            target.write_bytes(files[rel])
        (staging / MARKER).write_text("Built by conductor-atlas; this folder is replaced on each build.\n")
    except OSError as exc:
        shutil.rmtree(staging, ignore_errors=True)
        raise BuildError(f"could not write the new site next to {out}: {exc.strerror}") from exc
    old = out.parent / f".{out.name}.old-{os.getpid()}"
    if out.exists():
        os.rename(out, old)
    os.rename(staging, out)
    if old.exists():
        shutil.rmtree(old, ignore_errors=True)
    return out
