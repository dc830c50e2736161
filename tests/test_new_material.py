"""`conductor-atlas new-material` writes a template that is rejected until filled in; the shop
overlay example builds."""

from __future__ import annotations

import pytest

from conductor_atlas.build import build
from conductor_atlas.cli import main
from conductor_atlas.paths import PROJECT_ROOT


def test_template_is_rejected_until_filled(tmp_path, capsys):
    folder = tmp_path / "mine"
    assert main(["new-material", "shop-bronze-7", "--dir", str(folder)]) == 0
    path = folder / "shop-bronze-7.toml"
    assert path.is_file()
    assert main(["check", "--data", str(folder)]) == 1
    err = capsys.readouterr().err
    assert "shop-bronze-7.toml: properties.resistivity.source: unknown source key" in err
    # fill it in as a shop would (values invented for this test; not a real material)
    text = path.read_text(encoding="utf-8")
    text = (text.replace('value = "0 uohm*cm"', 'value = "9.5 uohm*cm"')
                .replace('value = "0 1/K"', 'value = "0.0012 1/K"')
                .replace('value = "0 g/cm^3"', 'value = "8.8 g/cm^3"')
                .replace('source = ""', 'source = "test-sheet"')
                .replace('locator = ""', 'locator = "invented for a test"'))
    path.write_text(text, encoding="utf-8")
    (folder / "sources.toml").write_text('[test-sheet]\nkind = "demo"\ntitle = "Invented for a test"\n',
                                         encoding="utf-8")
    assert main(["check", "--data", str(folder)]) == 0


def test_existing_file_and_bad_id_are_refused(tmp_path, capsys):
    assert main(["new-material", "alloy-a", "--dir", str(tmp_path)]) == 0
    assert main(["new-material", "alloy-a", "--dir", str(tmp_path)]) == 1
    assert "already exists" in capsys.readouterr().err
    assert main(["new-material", "Alloy A", "--dir", str(tmp_path)]) == 1
    assert "is not a valid id" in capsys.readouterr().err


def test_shop_overlay_example_builds(tmp_path):
    report = build(tmp_path / "site", [PROJECT_ROOT / "examples" / "shop-alloys"])
    page = (tmp_path / "site" / "materials" / "demo-shop-bronze" / "index.html").read_text(encoding="utf-8")
    assert "demo data" in page.lower()
    assert report.materials >= 43
