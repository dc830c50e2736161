"""Stage 5, the only stage that writes the site: build into a temporary sibling folder, then swap
(in one atomic step on Linux: ``swap_in``).

A failed build leaves the previous site untouched; two builds into one folder at once are
refused by a lock; a folder that is not a Conductor Atlas site is never replaced.

A build whose files are exactly those of the site already there writes nothing: a record beside
the folder (".<name>.published.json", next to the lock file, so the site itself stays the same
bytes build after build) keeps a digest of every path and its bytes, and the size and modification
time of every file as written, so ``site_unchanged`` can tell (one stat per file, no reading) that
nobody has touched the folder since. Anything else, a file edited, added or removed by hand
included, is a full rewrite.
"""

from __future__ import annotations

import ctypes
import errno
import fcntl
import json
import os
import re
import shutil
import sys
from contextlib import contextmanager
from pathlib import Path
from typing import Iterator, NamedTuple

from conductor_atlas.build_stamp import MARKER, file_stamps, record_path  # noqa: F401  (MARKER: used by tests)
from conductor_atlas.cache import files_key
from conductor_atlas.atlas_errors import BuildError

MARKER_TEXT = "Built by conductor-atlas; this folder is replaced on each build.\n"


class Published(NamedTuple):
    folder: Path     # the site's folder, resolved
    written: bool    # False: it already held exactly these files, nothing was written


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
    try:
        out = out.resolve()
    except RuntimeError as exc:  # Python 3.11 reports a link loop this way
        raise BuildError(f"{out} is a symbolic link loop; choose another --out") from exc
    lock_path = out.parent / f".{out.name}.lock"
    try:
        out.parent.mkdir(parents=True, exist_ok=True)
        lock = open(lock_path, "w")
    except OSError as exc:  # a read-only or full disk, a name too long, a file where a folder should be
        raise BuildError(f"cannot write beside the output folder {out}: {exc.strerror} "
                         f"({exc.filename}); choose another --out") from exc
    with lock:
        try:
            fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
        except BlockingIOError as exc:
            raise BuildError(f"another build is writing {out} right now; wait for it to finish") from exc
        yield out


def site_unchanged(files: dict[str, bytes], out: Path, digest: str) -> bool:
    """True when ``out`` holds exactly ``files``, as the record of the last publish says."""
    try:
        record = json.loads(record_path(out).read_text(encoding="utf-8"))
    except (OSError, UnicodeDecodeError, ValueError):
        return False
    if not isinstance(record, dict) or record.get("digest") != digest:
        return False
    try:
        on_disk = file_stamps(out)
    except OSError:  # the folder was removed or is unreadable since that publish
        return False
    return record.get("files") == on_disk and len(record["files"]) == len(files)


def publish(files: dict[str, bytes], out: Path, lock_held: bool = False) -> Published:
    """Write ``files`` (relative path -> bytes) as the new site at ``out``, atomically; nothing is
    written when ``out`` already holds exactly these files (see ``site_unchanged``).

    Takes the output lock itself unless ``lock_held`` (the caller is inside ``output_lock(out)``,
    as ``build`` is from its start, so a second build is refused before it does any work)."""
    if lock_held:
        return _publish_locked(files, out.resolve())
    with output_lock(out) as folder:
        return _publish_locked(files, folder)


def _publish_locked(files: dict[str, bytes], out: Path) -> Published:
    """Stage ``files`` beside ``out`` and swap them in; the caller holds the output lock."""
    check_replaceable(out)
    digest = files_key(files).hex()
    if site_unchanged(files, out, digest):
        return Published(out, False)
    # leftovers of a build that was killed mid-publish: safe to remove while we hold the lock
    for stale in leftovers(out):
        shutil.rmtree(stale, ignore_errors=True)
    staging = out.parent / f".{out.name}.new-{os.getpid()}"
    if staging.exists():
        shutil.rmtree(staging)
    try:
        for rel in sorted(files):
            target = staging / rel
            target.parent.mkdir(parents=True, exist_ok=True)
            target.write_bytes(files[rel])
        (staging / MARKER).write_text(MARKER_TEXT)
    except OSError as exc:
        shutil.rmtree(staging, ignore_errors=True)
        raise BuildError(f"could not write the new site next to {out}: {exc.strerror}") from exc
    record_path(out).unlink(missing_ok=True)
    swap_in(staging, out)
    write_record(out, digest)
    return Published(out, True)


def leftovers(out: Path) -> list[Path]:
    """The staging (".NAME.new-PID") and old (".NAME.old-PID") folders of ``out`` itself, matched
    exactly: no glob, so a name such as "x[ab]" never matches the folders of "xa" or "xb"."""
    pattern = re.compile(re.escape(f".{out.name}.") + r"(?:new|old)-[0-9]+")
    try:
        return sorted(p for p in out.parent.iterdir() if pattern.fullmatch(p.name))
    except OSError:
        return []


# renameat2(2) flag from <linux/fs.h>: swap two existing paths in one step (Linux ≥ 3.15, glibc ≥ 2.28;
# ext4, xfs, btrfs, tmpfs and others)
RENAME_EXCHANGE = 2
AT_FDCWD = -100


def _renameat2():
    if not sys.platform.startswith("linux"):
        return None
    try:
        function = ctypes.CDLL(None, use_errno=True).renameat2
    except (OSError, AttributeError):  # a C library without renameat2 (glibc before 2.28)
        return None
    function.argtypes = [ctypes.c_int, ctypes.c_char_p, ctypes.c_int, ctypes.c_char_p, ctypes.c_uint]
    function.restype = ctypes.c_int
    return function


RENAMEAT2 = _renameat2()


def exchange(first: Path, second: Path) -> bool:
    """Swap two existing paths atomically (renameat2 with RENAME_EXCHANGE); False when this system
    or file system cannot, so the caller falls back."""
    if RENAMEAT2 is None:
        return False
    if RENAMEAT2(AT_FDCWD, os.fsencode(first), AT_FDCWD, os.fsencode(second), RENAME_EXCHANGE) == 0:
        return True
    code = ctypes.get_errno()
    if code in (errno.EINVAL, errno.ENOSYS, errno.EOPNOTSUPP):  # the kernel or file system lacks it
        return False
    raise OSError(code, os.strerror(code), str(first), None, str(second))


def swap_in(staging: Path, out: Path) -> None:
    """Make the site in ``staging`` the one at ``out``, with no moment when ``out`` is missing.

    - no site yet: one rename (atomic);
    - Linux: one renameat2(RENAME_EXCHANGE) swaps the two folders (atomic: a reader sees the old
      site or the new one, and a crash at any point leaves one of them whole at ``out``); the old
      site, now at ``staging``, is then removed;
    - elsewhere (or a file system without it) the fallback is two renames, out → .NAME.old-PID then
      staging → out: between them ``out`` is missing for a moment, and a crash there leaves the
      previous site in .NAME.old-PID and the new one in .NAME.new-PID (the next build removes both).
    """
    if not os.path.lexists(out):
        os.rename(staging, out)
        return
    if exchange(staging, out):
        shutil.rmtree(staging, ignore_errors=True)
        return
    old = out.parent / f".{out.name}.old-{os.getpid()}"
    os.rename(out, old)
    os.rename(staging, out)
    shutil.rmtree(old, ignore_errors=True)


def write_record(out: Path, digest: str) -> None:
    """Remember what was published at ``out`` (see ``site_unchanged``); a record that cannot be
    written only costs the next build a full rewrite."""
    record = {"digest": digest, "files": file_stamps(out)}
    try:
        record_path(out).write_text(json.dumps(record, sort_keys=True) + "\n", encoding="utf-8")
    except OSError:
        pass
