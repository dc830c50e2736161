"""Shop-floor tasks at tablet size (834 × 1112), through the calculator pages, each answer checked
against the Python core (issue 13): the same inputs typed as a person types them."""

from __future__ import annotations

import pytest

from conductor_atlas.core.calculators import calculate

pytestmark = pytest.mark.browser


def open_resistance(pg, served_site):
    pg.goto(f"{served_site}/calculators/resistance/index.html")
    pg.wait_for_selector("html.calc-ready")


def type_inputs(pg, inputs):
    for name, text in inputs.items():
        pg.fill(f"#in-resistance-{name}", text)


def shown_values(pg):
    return pg.eval_on_selector_all(
        "[data-result]", "els => Object.fromEntries(els.map(e => [e.dataset.result, e.dataset.value ?? null]))")


def assert_page_matches_core(pg, catalogue, inputs):
    expected = calculate("resistance", inputs, catalogue)
    assert expected["errors"] == {}, expected["errors"]
    shown = shown_values(pg)
    for name, result in expected["results"].items():
        assert shown[name] is not None, name
        assert float(shown[name]) == pytest.approx(result["value"], rel=1e-12, abs=0)
    return expected


def test_b_fifteen_hundred_feet_written_with_a_comma_is_refused_then_computed(tablet_page, served_site, catalogue):
    pg = tablet_page
    open_resistance(pg, served_site)
    type_inputs(pg, {"material": "IACS", "length": "1,500 ft", "size": "12 AWG", "temperature": "20 °C"})
    message = pg.text_content("#in-resistance-length-error")
    assert "could be 1500" in message and "or 1.5" in message and "write 1500 or 1.5" in message
    assert pg.text_content("[data-result=resistance]") == "—"
    pg.fill("#in-resistance-length", "1500 ft")
    expected = assert_page_matches_core(pg, catalogue, {"material": "IACS", "length": "1500 ft", "size": "12 AWG",
                                                       "temperature": "20 °C"})
    # 12 AWG annealed copper: 1.588 Ω per 1000 ft at 20 °C (AWG tables on ASTM B258 and IACS, from memory)
    assert expected["results"]["resistance"]["value"] == pytest.approx(2.382, rel=5e-3)
    assert pg.text_content("#in-resistance-length-error") == ""
    assert pg.errors == []


def test_c_copper_names_standard_annealed_copper(tablet_page, served_site, catalogue):
    pg = tablet_page
    open_resistance(pg, served_site)
    type_inputs(pg, {"material": "copper", "length": "10 m", "size": "2.5 mm2"})
    line = pg.text_content("[data-material]")
    assert line.startswith("Material: Standard annealed copper (conductor grade, id copper-annealed)")
    assert "for Copper (high purity) enter Cu" in line
    # the first line of the results block (after the status line a slow solve writes into), and a link to
    # the material's page
    first = pg.eval_on_selector(
        ".calc-results", "el => [...el.children].find(c => !c.matches('[data-busy]')).dataset.material !== undefined")
    assert first
    pg.click("[data-material] a")
    pg.wait_for_load_state()
    assert pg.url.endswith("/materials/copper-annealed/index.html")
    assert pg.errors == []


def test_a_6101_busbar_at_75_degrees(tablet_page, served_site, catalogue):
    pg = tablet_page
    open_resistance(pg, served_site)
    inputs = {"material": "6101", "length": "25 m", "size": "16 mm2", "temperature": "75 °C", "current": "60 A"}
    type_inputs(pg, inputs)
    expected = assert_page_matches_core(pg, catalogue, inputs)
    # R = ρ L / A with ρ(75 °C) by Matthiessen's rule: between 1 + 0.0035·55 and 1 + 0.0039·55 times
    # 3.1348 µΩ·cm (trade coefficients of 6101, from memory): 58.6 to 60.0 mΩ for 25 m of 16 mm²
    r = expected["results"]["resistance"]["value"]
    assert 3.1348e-8 * 25 / 16e-6 * (1 + 0.0035 * 55) < r < 3.1348e-8 * 25 / 16e-6 * (1 + 0.0039 * 55)
    assert "Matthiessen" in pg.text_content("[data-model]")
    assert pg.text_content("[data-material]").startswith("Material: Aluminium alloy 6101")
    assert pg.errors == []


@pytest.mark.parametrize("typed, material_id", [("C11000", "copper-annealed"), ("A91350", "aluminium-1350")])
def test_d_designations_resolve(tablet_page, served_site, catalogue, typed, material_id):
    pg = tablet_page
    open_resistance(pg, served_site)
    inputs = {"material": typed, "length": "10 m", "size": "2.5 mm2"}
    type_inputs(pg, inputs)
    assert_page_matches_core(pg, catalogue, inputs)
    assert f"id {material_id})" in pg.text_content("[data-material]")
    assert pg.text_content("#in-resistance-material-error") == ""
    assert pg.errors == []


def test_sources_under_a_result_link_to_the_references_page(tablet_page, served_site, catalogue):
    pg = tablet_page
    open_resistance(pg, served_site)
    inputs = {"material": "IACS", "length": "10 m", "size": "2.5 mm2"}
    type_inputs(pg, inputs)
    expected = assert_page_matches_core(pg, catalogue, inputs)
    links = pg.eval_on_selector_all("[data-sources] a", "els => els.map(e => [e.textContent, e.getAttribute('href')])")
    assert [text for text, _ in links] == expected["sources"]
    for key, href in links:
        assert href.endswith(f"references/index.html#src-{key}")
    pg.click("[data-sources] a")
    pg.wait_for_load_state()
    assert pg.url.endswith(f"/references/index.html#src-{expected['sources'][0]}")
    assert pg.errors == []


@pytest.mark.parametrize("name, inputs, bad_field, kept, dropped", [
    # a drop in volts does not need the supply: the size stays, only the drop in percent goes
    ("sizing", {"material": "IACS", "length": "30 m", "current": "16 A", "max_drop": "6.9 V", "supply": "230",
                "conductors": "2", "temperature": "20 °C"}, "supply", "min_area", "voltage_drop_percent"),
    # the coolant feeds only the rise: the winding temperature stays
    ("temperature-rise", {"material": "IACS", "resistance_cold": "10 ohm", "temperature_cold": "20 °C",
                          "resistance_hot": "12.5 ohm", "coolant": "25"}, "coolant", "temperature_hot",
     "temperature_rise"),
])
def test_a_bad_optional_field_drops_only_its_results(tablet_page, served_site, catalogue, name, inputs, bad_field,
                                                     kept, dropped):
    pg = tablet_page
    pg.goto(f"{served_site}/calculators/{name}/index.html")
    pg.wait_for_selector("html.calc-ready")
    for field, text in inputs.items():
        pg.fill(f"#in-{name}-{field}", text)
    pg.locator(f"#in-{name}-{bad_field}").blur()  # a field's message shows once the person leaves it
    expected = calculate(name, inputs, catalogue)
    assert pg.text_content(f"#in-{name}-{bad_field}-error") == expected["errors"][bad_field]
    value = pg.get_attribute(f"[data-result={kept}]", "data-value")
    assert float(value) == pytest.approx(expected["results"][kept]["value"], rel=1e-12, abs=0)
    assert pg.text_content(f"[data-result={dropped}]") == "—"
    assert pg.errors == []


def test_model_field_offers_the_material_s_models_and_explains_the_others(tablet_page, served_site, catalogue):
    pg = tablet_page
    open_resistance(pg, served_site)
    inputs = {"material": "CCS-30", "length": "25 m", "size": "4 mm2", "temperature": "75 °C"}
    type_inputs(pg, inputs)
    options = pg.eval_on_selector_all("#in-resistance-model option",
                                      "els => Object.fromEntries(els.map(e => [e.value, [e.disabled, e.textContent]]))")
    # copper-clad steel has only its parallel-layer model on record
    assert options["layers"][0] is False and options["auto"][0] is False
    assert options["linear"] == [True, "linear: linear temperature-coefficient model (not available: no temperature "
                                       "coefficient on record)"]
    assert options["callendar-van-dusen"][1].endswith("(not available: not a platinum sensor metal)")
    pg.focus("#in-resistance-model")  # chosen by hand: the person then leaves it for the material field
    pg.select_option("#in-resistance-model", "layers")
    assert_page_matches_core(pg, catalogue, {**inputs, "model": "layers"})
    # another material without that model: the option is marked, and the core's message is under the field
    pg.fill("#in-resistance-material", "Cu")
    expected = calculate("resistance", {**inputs, "material": "Cu", "model": "layers"}, catalogue)
    assert pg.text_content("#in-resistance-model-error") == expected["errors"]["model"]
    assert pg.eval_on_selector("#in-resistance-model option[value=layers]", "e => e.disabled") is True
    assert pg.eval_on_selector("#in-resistance-model option[value=table]", "e => e.disabled") is False
    assert pg.errors == []


def test_a_model_in_the_address_is_read_in_any_case(tablet_page, served_site, catalogue):
    pg = tablet_page
    pg.goto(f"{served_site}/calculators/resistance/index.html?material=IACS&length=10%20m&size=2.5%20mm2"
            "&temperature=90%20%C2%B0C&model=Linear")
    pg.wait_for_selector("html.calc-ready")
    assert pg.input_value("#in-resistance-model") == "linear"
    assert_page_matches_core(pg, catalogue, {"material": "IACS", "length": "10 m", "size": "2.5 mm2",
                                             "temperature": "90 °C", "model": "linear"})
    # a model no list holds is kept as typed, so the core names the problem instead of a silent "auto"
    pg.goto(f"{served_site}/calculators/resistance/index.html?material=IACS&model=cubic")
    pg.wait_for_selector("html.calc-ready")
    assert pg.input_value("#in-resistance-model") == "cubic"
    assert pg.text_content("[data-result=resistance]") == "—"
    assert pg.errors == []


def test_a_size_searched_with_copper_opens_the_calculator_on_the_conductor_grade(tablet_page, served_site, catalogue):
    """"4/0 copper" in the search listed Copper-nickel 55/45 first (the size's digits matched its name).
    Now the size answers first and opens the resistance calculator with 4/0 AWG and standard annealed
    copper (the trade word as the calculators read it), and the page computes what the core computes."""
    pg = tablet_page
    pg.goto(f"{served_site}/search/index.html?q=4%2F0%20copper")
    first = pg.locator("form[data-search=page] [role=option]").first
    assert "4/0 AWG: 107.2 mm²" in first.inner_text() and "Standard annealed copper" in first.inner_text()
    first.click()
    pg.wait_for_selector("html.calc-ready")
    assert pg.input_value("#in-resistance-size") == "4/0 AWG"
    assert pg.input_value("#in-resistance-material") == "copper-annealed"
    inputs = {name: pg.input_value(f"#in-resistance-{name}") for name in ("material", "length", "size", "temperature")}
    assert_page_matches_core(pg, catalogue, inputs)
    assert pg.errors == []
