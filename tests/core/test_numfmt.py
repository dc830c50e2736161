"""The portable formatter, checked against Python's own format() (the outside reference)."""

import math
import random

import pytest

from conductor_atlas.core.numfmt import decimal_digits, format_fixed, format_number, format_plain, format_si


def reference_sig(x, sig):
    """Python's '%.{sig}e' rounds the binary value; we round the shortest decimal. They agree
    except on exact decimal ties, which the random sample below avoids by construction."""
    return float(f"{x:.{sig - 1}e}")


@pytest.mark.parametrize("x", [1.7241e-8, 0.00393, 58.0, 1e21, 1e-7, 123456789.0, 5e-324, 1.7976931348623157e308])
def test_decimal_digits_round_trips(x):
    sign, digits, point = decimal_digits(x)
    assert float(f"0.{digits}e{point}") * sign == x


def test_format_number_agrees_with_python_rounding():
    rng = random.Random(20261202)
    for _ in range(3000):
        x = rng.uniform(1, 10) * 10 ** rng.randint(-12, 12) * rng.choice([1, -1])
        sig = rng.randint(1, 8)
        text = format_plain(x, sig)
        assert float(text) == pytest.approx(reference_sig(x, sig), rel=1e-15), (x, sig, text)


@pytest.mark.parametrize("x, sig, text", [
    (1.7241e-8, 5, "1.7241×10⁻⁸"),
    (0.0039300, 4, "0.00393"),
    (58.0, 4, "58"),
    (99.996, 4, "100"),
    (-2.5, 3, "−2.5"),
    (0.0, 4, "0"),
    (math.inf, 4, "—"),
    (math.nan, 4, "—"),
    (1234567.0, 4, "1.235×10⁶"),
])
def test_format_number_examples(x, sig, text):
    assert format_number(x, sig) == text


def test_keep_zeros_for_table_columns():
    assert format_number(1.5, 4, True) == "1.500"


@pytest.mark.parametrize("x, unit, text", [
    (0.017241, "Ω", "17.24 mΩ"),
    (3.2768, "Ω", "3.277 Ω"),
    (32768.0, "W", "32.77 kW"),
    (4.2e-7, "m", "420 nm"),
    (999.96, "V", "1 kV"),
])
def test_format_si(x, unit, text):
    assert format_si(x, unit, 4) == text


@pytest.mark.parametrize("x, decimals, text", [(20.0, 1, "20.0"), (-40.0, 0, "−40"), (293.15, 2, "293.15"),
                                               (0.004, 2, "0.00"), (-0.004, 2, "0.00")])
def test_format_fixed(x, decimals, text):
    assert format_fixed(x, decimals) == text
