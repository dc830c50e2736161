"""Two builds into one output folder at once: one complete site or a clear refusal, never a mixture.

publish.py holds an exclusive flock on ".<out>.lock" beside the output folder while it stages and
swaps; a second publisher that finds the lock taken raises BuildError at once. These tests use
real separate processes (the lock is per open file description, so threads would not show it).
"""

from __future__ import annotations

import fcntl
import hashlib
import multiprocessing
import re
import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas.atlas_errors import BuildError
from conductor_atlas.paths import PROJECT_ROOT
from conductor_atlas.publish import MARKER, publish

FILES_PER_SITE = 1500
REFUSAL = "another build is writing"


def site_files(tag: str) -> dict[str, bytes]:
    """A synthetic site whose every file names the build it came from."""
    files = {f"pages/{i:04d}/index.html": f"<p>{tag} {i}</p>\n".encode() * 20 for i in range(FILES_PER_SITE)}
    files["index.html"] = f"<p>{tag}</p>\n".encode()
    return files


def publisher(tag: str, out: str, start, results) -> None:
    start.wait()
    try:
        publish(site_files(tag), Path(out))
        results.put((tag, "published", ""))
    except BuildError as exc:
        results.put((tag, "refused", str(exc)))
    except Exception as exc:  # anything else is a failure of the test subject
        results.put((tag, "crashed", f"{type(exc).__name__}: {exc}"))


def tags_in(out: Path) -> set[str]:
    """Which builds the files of ``out`` came from."""
    tags = set()
    for path in out.rglob("*.html"):
        tags.add(re.match(rb"<p>([a-z]+)[ <]", path.read_bytes()).group(1).decode())
    return tags


def run_race(out: Path, tags: list[str]) -> list[tuple[str, str, str]]:
    ctx = multiprocessing.get_context("spawn")
    start = ctx.Barrier(len(tags))
    results = ctx.Queue()
    procs = [ctx.Process(target=publisher, args=(tag, str(out), start, results)) for tag in tags]
    for p in procs:
        p.start()
    outcomes = [results.get(timeout=120) for _ in procs]
    for p in procs:
        p.join(timeout=60)
        assert p.exitcode == 0
    return outcomes


@pytest.mark.parametrize("round_", range(3))
def test_racing_publishers_leave_one_whole_site(tmp_path, round_):
    out = tmp_path / "site"
    if round_ == 2:
        publish(site_files("old"), out)  # also when a previous site is being replaced
    outcomes = run_race(out, ["alpha", "beta", "gamma"])
    print(f"race round {round_}: {[(tag, status) for tag, status, _ in outcomes]}")
    crashed = [o for o in outcomes if o[1] == "crashed"]
    assert crashed == []
    for tag, status, message in outcomes:
        if status == "refused":
            assert REFUSAL in message and str(out) in message, message
    published = [tag for tag, status, _ in outcomes if status == "published"]
    assert published, outcomes
    # never a mixture: every page comes from one build, and that build's site is complete
    found = tags_in(out)
    assert len(found) == 1, f"mixed site: files from {sorted(found)}"
    (winner,) = found
    assert winner in published
    assert len(list(out.rglob("*.html"))) == FILES_PER_SITE + 1
    assert (out / MARKER).is_file()
    # staging and old folders are gone; only the site, its lock file and its publish record remain
    assert sorted(p.name for p in tmp_path.iterdir()) == [".site.lock", ".site.published.json", "site"]


def test_held_lock_refuses_a_build_and_leaves_the_site(tmp_path):
    """A build started while another holds the lock exits 1 with a one-line message, no traceback."""
    out = tmp_path / "site"
    publish(site_files("old"), out)
    before = hashlib.sha256(b"".join(p.read_bytes() for p in sorted(out.rglob("*")) if p.is_file())).hexdigest()
    with open(tmp_path / ".site.lock", "w") as lock:
        fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
        result = subprocess.run([sys.executable, "-m", "conductor_atlas", "build", "--out", str(out)],
                                capture_output=True, text=True, cwd=PROJECT_ROOT, timeout=600)
    assert result.returncode == 1
    assert "Traceback" not in result.stderr
    assert result.stderr.strip() == (f"conductor-atlas: error: another build is writing {out} right now; "
                                     "wait for it to finish")
    after = hashlib.sha256(b"".join(p.read_bytes() for p in sorted(out.rglob("*")) if p.is_file())).hexdigest()
    assert after == before
    assert tags_in(out) == {"old"}


def test_two_cli_builds_at_once(tmp_path):
    """Two real `conductor-atlas build` processes into one folder: each succeeds or is refused."""
    out = tmp_path / "site"
    procs = [subprocess.Popen([sys.executable, "-m", "conductor_atlas", "build", "--out", str(out)],
                              stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True, cwd=PROJECT_ROOT)
             for _ in range(2)]
    results = [(p.wait(timeout=600), p.stdout.read(), p.stderr.read()) for p in procs]
    for p in procs:
        p.stdout.close()
        p.stderr.close()
    assert any(code == 0 for code, _, _ in results), results
    for code, _, err in results:
        assert "Traceback" not in err
        if code != 0:
            assert REFUSAL in err, err
    reference = tmp_path / "reference"
    from conductor_atlas.build import build
    build(reference)

    def hashes(folder):
        return {p.relative_to(folder).as_posix(): hashlib.sha256(p.read_bytes()).hexdigest()
                for p in sorted(folder.rglob("*")) if p.is_file()}

    # builds are reproducible, so one complete site is exactly a fresh build's tree
    assert hashes(out) == hashes(reference)


def test_a_second_build_is_refused_before_it_loads_anything(tmp_path, monkeypatch):
    from conductor_atlas import build as build_module
    from conductor_atlas.publish import output_lock

    def must_not_load(folders):
        raise AssertionError("the refused build loaded the data set")

    monkeypatch.setattr(build_module, "load_dataset", must_not_load)
    monkeypatch.setattr(build_module, "CACHE_DIR", tmp_path / "cache")
    out = tmp_path / "site"
    with output_lock(out):  # another build holds the folder (a second open file description)
        with pytest.raises(BuildError, match=REFUSAL):
            build_module.build(out)
    assert not out.exists()
