"""The command line: exit codes and one-line messages, no tracebacks for user mistakes."""

from __future__ import annotations

import subprocess
import sys

from conductor_atlas.cli import main


def run_cli(*args, cwd=None):
    return subprocess.run([sys.executable, "-m", "conductor_atlas", *args], capture_output=True, text=True, cwd=cwd)


def test_check_passes_on_shipped_data(capsys):
    assert main(["check"]) == 0
    assert "Data OK:" in capsys.readouterr().out


def test_check_reports_bad_file_without_traceback(tmp_path):
    (tmp_path / "bad.toml").write_text('schema = 1\nid = "Bad Id"\n', encoding="utf-8")
    result = run_cli("check", "--data", str(tmp_path))
    assert result.returncode == 1
    assert "Traceback" not in result.stderr
    assert "bad.toml: id: expected a lowercase slug" in result.stderr
    assert "nothing was built" in result.stderr


def test_serve_without_site_is_a_clear_error(tmp_path):
    result = run_cli("serve", "--dir", str(tmp_path / "nothing"))
    assert result.returncode == 1
    assert "holds no built site" in result.stderr
    assert "Traceback" not in result.stderr


def test_build_into_folder(tmp_path, capsys):
    assert main(["build", "--out", str(tmp_path / "out")]) == 0
    assert "Built" in capsys.readouterr().out
    assert (tmp_path / "out" / "index.html").is_file()


def test_calc_help_lists_every_calculator_and_field():
    result = run_cli("calc", "--help")
    assert result.returncode == 0, result.stderr
    for name in ("resistance", "resistivity"):
        assert name in result.stdout
    result = run_cli("calc", "resistivity", "--help")
    assert result.returncode == 0 and "--temperature" in result.stdout and "%IACS" in result.stdout


def test_calc_unknown_material_lists_nearest_and_exits_1():
    result = run_cli("calc", "resistance", "--material", "coper", "--size", "2.5 mm2")
    assert result.returncode == 1
    assert "--material: unknown material “coper”; nearest: copper" in result.stderr
    assert "Traceback" not in result.stderr
