"""Conductor sizes: ASTM B258 AWG diameters, IEC 60228 nominal sizes, the size text people type."""

import math

import pytest

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import (awg_area, awg_diameter, awg_number, next_awg, next_metric_size,
                                           parse_size, size_reading_note)

INCH = 0.0254

# ASTM B258-18, Table 1: nominal diameters of solid round AWG wire [in] (printed to 0.0001 in;
# values from memory of the table). Our rounding reproduces the printed digits exactly.
ASTM_B258_DIAMETERS_IN = {
    "4/0": 0.4600, "3/0": 0.4096, "2/0": 0.3648, "1/0": 0.3249, "1": 0.2893, "2": 0.2576, "4": 0.2043,
    "6": 0.1620, "8": 0.1285, "10": 0.1019, "12": 0.0808, "14": 0.0641, "16": 0.0508, "18": 0.0403,
    "20": 0.0320, "22": 0.0253, "24": 0.0201, "26": 0.0159, "28": 0.0126, "30": 0.0100, "40": 0.0031,
}


@pytest.mark.parametrize("gauge, inches", sorted(ASTM_B258_DIAMETERS_IN.items()))
def test_awg_diameters_match_astm_b258(gauge, inches):
    # the table prints 0.0001 in; our value is the same rounding of the same series: equal to 1e-9 in
    assert awg_diameter(awg_number(gauge)) / INCH == pytest.approx(inches, abs=1e-9)


def test_awg_areas_in_circular_mils():
    # ASTM B258-18 Table 1 areas [cmil]: 4/0 = 211 600, 10 = 10 380, 30 = 100.5 (from memory);
    # the table rounds to 4 significant figures, hence rel 5e-4.
    cmil = 5.067074790974977e-10
    assert awg_area(-3) / cmil == pytest.approx(211600, rel=5e-4)
    assert awg_area(10) / cmil == pytest.approx(10380, rel=5e-4)
    assert awg_area(30) / cmil == pytest.approx(100.0, rel=5e-4)  # d = 10.0 mil exactly -> 100 cmil


def test_ten_awg_area_in_mm2():
    # common practice (no source): 10 AWG is quoted as 5.26 mm² in wire tables
    assert awg_area(10) * 1e6 == pytest.approx(5.261, abs=0.0006)


@pytest.mark.parametrize("text, shape, area_mm2", [
    ("35 mm2", "area", 35.0),
    ("35 mm²", "area", 35.0),
    ("12 AWG", "round", math.pi / 4 * (0.0808 * 25.4) ** 2),
    ("AWG 12", "round", math.pi / 4 * (0.0808 * 25.4) ** 2),
    ("#12 awg", "round", math.pi / 4 * (0.0808 * 25.4) ** 2),
    ("4/0 AWG", "round", math.pi / 4 * (0.46 * 25.4) ** 2),
    ("0000 AWG", "round", math.pi / 4 * (0.46 * 25.4) ** 2),
    ("d 2.5 mm", "round", math.pi / 4 * 2.5 ** 2),
    ("ø 1,6 mm", "round", math.pi / 4 * 1.6 ** 2),
    ("dia 2.5 mm", "round", math.pi / 4 * 2.5 ** 2),
    ("Diameter = 0.5 in", "round", math.pi / 4 * 12.7 ** 2),
    ("DIA1mm", "round", math.pi / 4),
    ("40 x 5 mm", "bar", 200.0),
    ("40x5mm", "bar", 200.0),
    ("250 kcmil", "area", 250 * 0.5067074790974977),
])
def test_parse_size(text, shape, area_mm2):
    size = parse_size(text)
    assert size["shape"] == shape
    assert size["area"] * 1e6 == pytest.approx(area_mm2, rel=1e-9)


@pytest.mark.parametrize("text, words", [
    ("", "is empty"),
    ("57 AWG", "AWG gauges run from 4/0 to 56"),
    ("5/0 AWG", "is not an AWG gauge"),
    ("d 0 mm", "greater than zero"),
    ("40 x 5", "needs a unit"),
    ("-3 mm2", "greater than zero"),
    ("3 m", "is a length"),
])
def test_bad_sizes(text, words):
    with pytest.raises(CoreError) as caught:
        parse_size(text)
    assert words in caught.value.message


def test_next_standard_sizes():
    # IEC 60228 series ... 2.5, 4, 6 ...; 3.1 mm² needs 4 mm²; exactly 2.5 stays 2.5
    assert next_metric_size(3.1e-6) == 4.0
    assert next_metric_size(2.5e-6) == 2.5
    assert next_metric_size(3000e-6) == -1.0
    # 5.0 mm² needs 10 AWG (5.26 mm²); 12 AWG (3.31 mm²) is too small
    assert next_awg(5.0e-6) == 10
    assert next_awg(100e-6) == -3   # 4/0 = 107.2 mm²
    assert next_awg(120e-6) == -99  # larger than 4/0: kcmil sizes or parallel conductors


# "ga" is read as AWG, which is what US wire catalogues mean by it; a British (SWG, BS 3737) or
# sheet-metal gauge of the same number is another diameter, so the answer says how it read the text.
@pytest.mark.parametrize("text", ["10 ga", "GA 10", "#4/0 ga"])
def test_ga_is_read_as_awg_and_says_so(text):
    note = size_reading_note(text, parse_size(text), "size")
    assert note.startswith("size: “" + text + "” is read as ")
    assert "AWG" in note and "ASTM B258" in note and "SWG" in note


def test_ga_note_gives_the_awg_diameter():
    # ASTM B258-18 Table 1: 10 AWG is 0.1019 in = 2.588 mm
    assert "ø 2.588 mm" in size_reading_note("10 ga", parse_size("10 ga"), "size")


@pytest.mark.parametrize("text", ["10 AWG", "awg 10", "#10", "4/0", "2.5 mm²", "d 1.6 mm", "40 x 5 mm",
                                  "2500 mm²", "200 x 20 mm"])
def test_plain_sizes_need_no_reading_note(text):
    # 2500 mm² is the largest IEC 60228 size (Table 1/2); 200 x 20 mm a large busbar (common practice,
    # no source): neither is beyond a real conductor
    assert size_reading_note(text, parse_size(text), "size") == ""


@pytest.mark.parametrize("text", ["1e9 mm²", "2 m²", "d 1 m", "1000 x 200 mm"])
def test_a_cross_section_beyond_any_conductor_is_questioned(text):
    # above 100 000 mm² (0.1 m²): forty times the largest IEC 60228 size (2500 mm², Table 1/2)
    note = size_reading_note(text, parse_size(text), "size")
    assert note.startswith("size: ") and "check the unit" in note and "2500 mm²" in note


def test_measured_check_says_how_it_read_ga(catalogue):
    # the measured-check calculator reads its size without read_size; it must give the same note
    from conductor_atlas.core.calc_measured_check import calculate
    outcome = calculate({"material": "IACS", "resistance": "0.53 ohm", "length": "100 m", "size": "10 ga"},
                        catalogue)
    assert any("read as 10 AWG" in w for w in outcome["warnings"])
