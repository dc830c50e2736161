"""The command line: exit codes and one-line messages, no tracebacks for user mistakes."""

from __future__ import annotations

import errno
import os
import subprocess
import sys

import pytest

from conductor_atlas.cli import main
from conductor_atlas.atlas_errors import BuildError


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


# --- file-system refusals and bad options: one line naming the file or option, exit 1, no traceback ---

LONG_NAME = "x" * 300  # longer than the 255 bytes a Linux file name may have (NAME_MAX)


def assert_one_line_error(capsys, args, words):
    """``main(args)`` in process: an exception would fail the test, as a traceback would fail a user."""
    assert main(args) == 1
    stderr = capsys.readouterr().err
    assert words in stderr, stderr
    assert all(line.startswith("conductor-atlas: ") for line in stderr.splitlines()), stderr
    return stderr


def test_data_folder_that_is_a_symlink_loop(capsys, tmp_path):
    loop = tmp_path / "loop"
    loop.symlink_to(loop)
    assert_one_line_error(capsys, ["check", "--data", str(loop)], f"{loop}: is a symbolic link loop")


def test_data_folder_name_too_long(capsys, tmp_path):
    assert_one_line_error(capsys, ["check", "--data", str(tmp_path / LONG_NAME)],
                          f"{tmp_path / LONG_NAME}: has a name too long for the file system")


def test_output_folder_that_is_a_symlink_loop(capsys, tmp_path):
    loop = tmp_path / "site"
    loop.symlink_to(loop)
    assert_one_line_error(capsys, ["build", "--out", str(loop)],
                          f"{loop} is a symbolic link loop; choose another --out")


def test_output_folder_name_too_long(capsys, tmp_path):
    out = tmp_path / ("s" * 252)  # the folder name fits; its lock file ".<name>.lock" does not
    assert_one_line_error(capsys, ["build", "--out", str(out)],
                          f"cannot write beside the output folder {out}: File name too long")


def test_output_folder_under_a_file(capsys, tmp_path):
    """The parent of --out cannot hold a lock file (here it is a file; read-only or full disks take the same path)."""
    (tmp_path / "plain-file").write_text("not a folder\n")
    out = tmp_path / "plain-file" / "site"
    assert_one_line_error(capsys, ["build", "--out", str(out)], f"cannot write beside the output folder {out}:")


@pytest.mark.skipif(os.geteuid() == 0, reason="root writes into a folder whatever its mode")
def test_output_folder_in_a_read_only_folder(capsys, tmp_path):
    parent = tmp_path / "locked"
    parent.mkdir()
    parent.chmod(0o555)
    try:
        assert_one_line_error(capsys, ["build", "--out", str(parent / "site")],
                              "cannot write beside the output folder")
    finally:
        parent.chmod(0o755)


@pytest.mark.parametrize("errno_code", [errno.EROFS, errno.ENOSPC, errno.EDQUOT])
def test_lock_file_refused_by_the_disk(tmp_path, monkeypatch, errno_code):
    """A read-only, full (no space or no inodes) or over-quota disk refuses the lock file; root
    cannot make one here, so the refusal is the OS error the open would raise."""
    from conductor_atlas import publish

    def refuse(path, *args, **kwargs):
        raise OSError(errno_code, os.strerror(errno_code), str(path))

    monkeypatch.setattr(publish, "open", refuse, raising=False)
    with pytest.raises(BuildError, match=f"cannot write beside the output folder .*: {os.strerror(errno_code)}"):
        with publish.output_lock(tmp_path / "site"):
            pass


def test_new_material_name_too_long(capsys, tmp_path):
    long_id = "x" * 300
    assert_one_line_error(capsys, ["new-material", long_id, "--dir", str(tmp_path)],
                          f"cannot write {tmp_path / (long_id + '.toml')} (File name too long)")


@pytest.mark.parametrize("port", ["-1", "70000"])
def test_serve_port_out_of_range(capsys, tmp_path, port):
    (tmp_path / "index.html").write_text("<!doctype html><title>t</title>\n")
    assert_one_line_error(capsys, ["serve", "--dir", str(tmp_path), "--port", port],
                          f"--port must be a port number from 0 to 65535 (0: any free port), found {port}")


def test_serve_folder_name_too_long(capsys, tmp_path):
    assert_one_line_error(capsys, ["serve", "--dir", str(tmp_path / LONG_NAME)],
                          "(File name too long); choose another --dir")


def test_calc_lists_messages_in_the_order_of_the_form():
    """The calculators read the material after their own fields (core.calc_common.material_at_temperature);
    the terminal still lists the messages in the order of FIELDS, as the form shows them."""
    result = run_cli("calc", "resistance", "--material", "coper", "--length", "abc", "--temperature", "-300 °C")
    assert result.returncode == 1
    lines = result.stderr.splitlines()
    assert [line.split(": ")[2] for line in lines] == ["--material", "--length", "--temperature"], result.stderr


def test_calc_overflow_is_reported_on_the_field_that_caused_it(capsys):
    """A current of 1e300 A makes the voltage drop infinite; the message was on --length."""
    assert main(["calc", "resistance", "--material", "Cu", "--size", "2.5 mm2", "--length", "10 m",
                 "--current", "1e300 A"]) == 1
    err = capsys.readouterr().err
    assert err == ("conductor-atlas: calc resistance: --current: the inputs are too extreme to compute a finite "
                   "result; check the values\n")
    # here the resistance itself overflows (ρ·L/A ≈ 2e310 Ω): the length is named, not the current
    assert main(["calc", "resistance", "--material", "Cu", "--size", "d 0.01 mm", "--length", "1e308 m",
                 "--current", "1 A"]) == 1
    assert "--length: the inputs are too extreme" in capsys.readouterr().err
