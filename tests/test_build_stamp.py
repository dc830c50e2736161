"""`conductor-atlas build` with nothing changed is told apart before the heavy imports
(conductor_atlas.build_stamp), and any change to data, templates, code, options, libraries or the
site itself still makes a full build."""

from __future__ import annotations

import fcntl
import os
import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas import build_stamp
from conductor_atlas.build_stamp import BuildInputs
from conductor_atlas.cli import main
from conductor_atlas.paths import DATA_DIR
from conductor_atlas.publish import publish

REPORT = {"materials": 1, "files": 1, "bytes": 3}


@pytest.fixture()
def project(tmp_path, monkeypatch):
    """A stand-in checkout: data/, the package's code and templates/ in a temporary folder, and one
    site published from them with its inputs recorded, as `conductor-atlas build` leaves it."""
    folders = {}
    for name, files in (("data", {"materials/a.toml": "id = 'a'\n"}),
                        ("code", {"core/units.py": "X = 1\n", "render.py": "Y = 2\n"}),
                        ("templates", {"base.html": "<p>{{ x }}</p>\n", "static/style.css": "p{}\n"})):
        folders[name] = tmp_path / name
        for rel, text in files.items():
            (folders[name] / rel).parent.mkdir(parents=True, exist_ok=True)
            (folders[name] / rel).write_text(text, encoding="utf-8")
    monkeypatch.setattr(build_stamp, "DATA_DIR", folders["data"])
    monkeypatch.setattr(build_stamp, "PACKAGE_DIR", folders["code"])
    monkeypatch.setattr(build_stamp, "TEMPLATES_DIR", folders["templates"])
    folders["out"] = tmp_path / "site"
    inputs = BuildInputs(folders["out"], [])
    publish({"index.html": b"old"}, folders["out"])
    inputs.remember(REPORT)
    return folders


def up_to_date(out: Path, extra: list[Path] | None = None) -> bool:
    return BuildInputs(out, extra or []).previous_build() == REPORT


def same_size_edit(path: Path, text: str) -> None:
    """Rewrite ``path`` with text of the same length and put its modification time back, as an edit
    within one tick of a coarse file-system clock would look."""
    info = path.stat()
    assert len(text.encode()) == info.st_size
    path.write_text(text, encoding="utf-8")
    os.utime(path, ns=(info.st_atime_ns, info.st_mtime_ns))


def test_nothing_changed_is_up_to_date(project):
    assert up_to_date(project["out"])


@pytest.mark.parametrize("folder,rel", [("data", "materials/a.toml"), ("code", "core/units.py"),
                                        ("templates", "base.html"), ("templates", "static/style.css")])
def test_an_edit_to_data_code_or_templates_rebuilds(project, folder, rel):
    (project[folder] / rel).write_text("changed = true\n", encoding="utf-8")
    assert not up_to_date(project["out"])


@pytest.mark.parametrize("folder", ["data", "code", "templates"])
def test_a_file_added_or_removed_rebuilds(project, folder):
    (project[folder] / "new.txt").write_text("x", encoding="utf-8")
    assert not up_to_date(project["out"])
    (project[folder] / "new.txt").unlink()
    assert up_to_date(project["out"])
    next(p for p in sorted(project[folder].rglob("*")) if p.is_file()).unlink()
    assert not up_to_date(project["out"])


def test_an_edit_in_the_same_clock_tick_is_caught_by_content(project):
    # the files were written under 2 s before the stamp, so their bytes were recorded too
    same_size_edit(project["data"] / "materials" / "a.toml", "id = 'b'\n")
    assert not up_to_date(project["out"])


def test_other_options_rebuild(project, tmp_path):
    extra = tmp_path / "shop"
    extra.mkdir()
    assert not up_to_date(project["out"], [extra])                 # another --data
    publish({"index.html": b"old"}, tmp_path / "other")
    assert not up_to_date(tmp_path / "other")                       # another --out, never recorded


def test_another_library_version_or_python_rebuilds(project, monkeypatch):
    monkeypatch.setattr(build_stamp, "library_versions", lambda: ["/x/numpy-9.9.9.dist-info"])
    assert not up_to_date(project["out"])
    monkeypatch.undo()
    monkeypatch.setattr(build_stamp, "DATA_DIR", project["data"])
    monkeypatch.setattr(build_stamp, "PACKAGE_DIR", project["code"])
    monkeypatch.setattr(build_stamp, "TEMPLATES_DIR", project["templates"])
    assert up_to_date(project["out"])
    monkeypatch.setattr(sys, "version", sys.version + " (another build)")
    assert not up_to_date(project["out"])


def test_a_site_touched_by_hand_rebuilds(project):
    (project["out"] / "index.html").write_bytes(b"new")
    assert not up_to_date(project["out"])


def test_a_site_published_by_another_build_rebuilds(project):
    publish({"index.html": b"other inputs"}, project["out"])    # e.g. bench/worker.py, without the stamp
    assert not up_to_date(project["out"])


def test_a_build_holding_the_lock_means_not_up_to_date(project):
    lock_path = project["out"].parent / f".{project['out'].name}.lock"
    with open(lock_path, "a") as lock:
        fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
        assert not up_to_date(project["out"])
    assert up_to_date(project["out"])


def test_a_damaged_record_rebuilds(project):
    build_stamp.inputs_path(project["out"]).write_text("{not json", encoding="utf-8")
    assert not up_to_date(project["out"])


def test_the_check_imports_nothing_heavy(tmp_path):
    """The no-change path of the command line must not import what a build needs."""
    script = ("import sys; from conductor_atlas.cli import build_parser; from conductor_atlas.build_stamp import "
              "BuildInputs; build_parser('build'); BuildInputs(sys.argv[1], []).previous_build(); "
              "print(sorted({m.split('.')[0] for m in sys.modules} & {'numpy', 'pint', 'jinja2', 'markdown', "
              "'pickle', 'importlib_metadata'} | {m for m in sys.modules if m.startswith('conductor_atlas.core')}))")
    result = subprocess.run([sys.executable, "-c", script, str(tmp_path / "site")], capture_output=True, text=True)
    assert result.returncode == 0, result.stderr
    assert result.stdout.strip() == "[]"


def test_cli_build_twice_then_after_an_edit(tmp_path, capsys, monkeypatch):
    """End to end through the command line: the second build does nothing (build() is not even
    called), an edited --data material makes a full build whose page shows the new name."""
    shop = tmp_path / "shop" / "materials"
    shop.mkdir(parents=True)
    text = (DATA_DIR / "materials" / "copper.toml").read_text(encoding="utf-8")
    text = text.replace('id = "copper"', 'id = "shop-copper"', 1).replace('name = "Copper (high purity)"',
                                                                      'name = "Shop copper one"', 1)
    text = "\n".join(line for line in text.splitlines() if not line.startswith("aliases = ")) + "\n"
    (shop / "shop-copper.toml").write_text(text, encoding="utf-8")
    out = tmp_path / "out"
    args = ["build", "--out", str(out), "--data", str(shop.parent)]
    assert main(args) == 0
    assert "Built" in capsys.readouterr().out

    def no_build(*a, **k):
        raise AssertionError("build() ran although nothing changed")
    with monkeypatch.context() as patch:
        patch.setattr("conductor_atlas.build.build", no_build)
        assert main(args) == 0
    assert "Up to date" in capsys.readouterr().out

    page = out / "materials" / "shop-copper" / "index.html"
    assert "Shop bronze nine" not in page.read_text(encoding="utf-8")
    edited = [('name = "Shop bronze nine"' if line.startswith("name = ") else line) for line in text.splitlines()]
    (shop / "shop-copper.toml").write_text("\n".join(edited) + "\n", encoding="utf-8")
    assert main(args) == 0
    assert "Built" in capsys.readouterr().out
    assert "Shop bronze nine" in page.read_text(encoding="utf-8")
