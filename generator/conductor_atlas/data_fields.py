"""Reading one field of a data file: the TOML file itself (size, encoding, reachability), a quantity
("1.72e-8 ohm*m") or a temperature ("20 degC") with pint, a locator, invisible characters, and the
``Problems`` list every reader adds "file: field: expected …, found …" lines to.

Shared by the material loader (load.py) and the conductor-standard tables (standards.py). Reads
files only; writes nothing.
"""

from __future__ import annotations

import errno
import functools
import math
import os
import re
import tomllib
import unicodedata
from pathlib import Path

import pint

from conductor_atlas.schema import MAX_FILE_BYTES

UREG = pint.UnitRegistry()
NUMBER_UNIT = re.compile(r"^\s*([+-]?(?:[0-9]+\.?[0-9]*|\.[0-9]+)(?:[eE][+-]?[0-9]+)?)\s*(.*)$")
NON_FINITE = re.compile(r"^\s*[+-]?(?:nan|inf|infinity)\b", re.IGNORECASE)


@functools.lru_cache(maxsize=None)
def parsed_units(text: str) -> pint.Unit:
    """pint's units for a unit text; parsing is most of pint's cost and the texts repeat, so each
    distinct text is parsed once. Raises pint's own exceptions for text that is not a unit."""
    return UREG.Quantity(1.0, text).units


def convert(magnitude: float, unit_text: str, target: str) -> float:
    """``magnitude unit_text`` expressed in ``target`` by pint (offset units such as degC included);
    the same registry call ``Quantity.to`` makes, so the result is identical."""
    return float(UREG.convert(magnitude, parsed_units(unit_text), parsed_units(target)))


class Problems:
    """Collects "where: message" lines for one run."""

    def __init__(self) -> None:
        self.lines: list[str] = []

    def add(self, where: str, message: str) -> None:
        self.lines.append(one_line(f"{where}: {message}"))


def one_line(text: str) -> str:
    """``text`` with every control, format or separator character (a newline in a property name, a
    right-to-left override) written as an escape, so a problem is one line that reads as printed."""
    return "".join(f"\\u{ord(ch):04x}" if unicodedata.category(ch) in ("Cc", "Cf", "Zl", "Zp") else ch
                   for ch in text)


def display_path(path: Path) -> str:
    try:
        return str(path.resolve().relative_to(Path.cwd().resolve()))
    except (ValueError, OSError, RuntimeError):  # outside the working folder, a link loop, a name too long
        return str(path)


def unreachable(path: Path) -> str | None:
    """Why ``path`` cannot be opened at all (a link loop, a broken link, a name too long, ...), or None."""
    try:
        os.stat(path)
    except OSError as exc:
        if exc.errno == errno.ELOOP:
            return "is a symbolic link loop (a link that leads back to itself)"
        if exc.errno == errno.ENAMETOOLONG:
            return "has a name too long for the file system"
        if exc.errno == errno.ENOENT and os.path.islink(path):
            return "is a broken link"
        if exc.errno in (errno.ENOENT, errno.ENOTDIR):
            return "does not exist"
        return f"cannot be read ({exc.strerror})"
    return None


def read_toml(path: Path, problems: Problems) -> dict | None:
    """Read one TOML file; report unreadable, oversized, non-UTF-8 or malformed files."""
    where = display_path(path)
    why = unreachable(path)
    if why is not None:
        problems.add(where, why)
        return None
    if path.is_dir():
        problems.add(where, "is a directory, expected a .toml file")
        return None
    if not path.is_file():
        problems.add(where, "is not a regular file (a device, pipe or socket), expected a .toml file")
        return None
    try:
        size = path.stat().st_size
        if size > MAX_FILE_BYTES:
            problems.add(where, f"is {size} bytes; a material file may be at most {MAX_FILE_BYTES} bytes")
            return None
        raw = path.read_bytes()
    except OSError as exc:
        problems.add(where, f"cannot be read ({exc.strerror})")
        return None
    if raw.startswith(b"\xef\xbb\xbf"):
        problems.add(where, "starts with a byte-order mark (BOM); save it as UTF-8 without BOM")
        return None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        problems.add(where, f"is not UTF-8 text (byte {exc.start}); save it as UTF-8")
        return None
    try:
        return tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        problems.add(where, f"is not valid TOML: {exc}")
        return None


# Hangul fillers and the braille blank are letters or symbols to Unicode but print as nothing
INVISIBLE_LETTERS = {"\u115f", "\u1160", "\u3164", "\uffa0", "\u2800"}


def invisible_character(text: str) -> str | None:
    """The first character of ``text`` a reader cannot see or that is not text at all (controls
    such as NUL, zero-width and direction marks, line separators, unassigned or private code
    points), as "U+200B (ZERO WIDTH SPACE)"; None when there is none."""
    for ch in text:
        if unicodedata.category(ch) in ("Cc", "Cf", "Cn", "Co", "Cs", "Zl", "Zp") or ch in INVISIBLE_LETTERS:
            return f"U+{ord(ch):04X} ({unicodedata.name(ch, 'no name')})"
    return None


def read_locator(record: dict, where: str, problems: Problems) -> str | None:
    """A locator (table, page, clause) is non-empty text."""
    locator = record["locator"]
    if not isinstance(locator, str) or not locator.strip():
        problems.add(f"{where}.locator", f"expected the place in the source as text, such as \"table 3, p. 12\", "
                     f"found {locator!r}")
        return None
    return locator.strip()


def parse_quantity(text: object, unit: str, where: str, problems: Problems) -> float | None:
    """Parse "value unit" with pint and convert to ``unit``; report dimension and number problems."""
    if not isinstance(text, str):
        problems.add(where, f"expected a string such as \"1.72e-8 ohm*m\" (value and unit), found {text!r}")
        return None
    match = NUMBER_UNIT.match(text)
    if match is None:
        problems.add(where, f"expected a number then a unit, such as \"1.72e-8 ohm*m\", found \"{text}\""
                     + (" (nan and inf are not finite numbers)" if NON_FINITE.match(text) else ""))
        return None
    unit_text = match.group(2).strip() or "dimensionless"
    try:
        parsed_units(unit_text)
    except Exception as exc:  # pint raises many types for bad unit text; all are a user's typo
        problems.add(where, f"cannot read the unit \"{match.group(2).strip()}\" of \"{text}\" ({type(exc).__name__})")
        return None
    if unit_text == "dimensionless" and not parsed_units(unit).dimensionless:
        problems.add(where, f"\"{text}\" has no unit; expected a value in {unit}")
        return None
    try:
        value = convert(float(match.group(1)), unit_text, unit)
    except pint.DimensionalityError:
        problems.add(where, f"expected a value in {unit}, found \"{text}\" "
                     f"(units of {parsed_units(unit_text).dimensionality})")
        return None
    if not math.isfinite(value):
        problems.add(where, f"expected a finite number, found \"{text}\"")
        return None
    return value


def parse_temperature(text: object, where: str, problems: Problems) -> float | None:
    """A condition temperature ("20 degC", "293 K") in K; must be above absolute zero."""
    if not isinstance(text, str):
        problems.add(where, f"expected a temperature such as \"20 degC\", found {text!r}")
        return None
    match = NUMBER_UNIT.match(text)
    if match is None and NON_FINITE.match(text):
        problems.add(where, f"expected a finite temperature, found \"{text}\"")
        return None
    try:
        if match is None:
            raise ValueError(text)
        kelvin = convert(float(match.group(1)), match.group(2).strip() or "K", "K")
    except Exception:
        problems.add(where, f"expected a temperature such as \"20 degC\" or \"293.15 K\", found \"{text}\"")
        return None
    if not math.isfinite(kelvin) or kelvin <= 0:
        problems.add(where, f"expected a temperature above absolute zero, found \"{text}\"")
        return None
    return kelvin


