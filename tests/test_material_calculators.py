"""The calculator links on a material page: offered exactly where the calculator answers.

Issue: the measured-check and short-circuit calculators belong on the material pages where they
fit. A link that leads to a refusal ("no specific heat on record") is a dead end for a user, and a
missing link hides a calculator that would answer; both are checked against the calculators
themselves, run on the full catalogue the calculator pages embed.
"""

from __future__ import annotations

import re

import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.core.calculators import CALCULATORS, calculate
from conductor_atlas.derive import calc_catalogue, catalogue_of
from conductor_atlas.load import load_dataset
from conductor_atlas.material_calculators import fitting_calculators, link_key


@pytest.fixture(scope="module")
def shipped():
    dataset = load_dataset(data_folders())
    full = catalogue_of(dataset)
    by_id = {m.id: m for m in dataset.materials}
    single = {mid: calc_catalogue([record], [by_id[mid]]) for mid, record in full["materials"].items()}
    return full, single


def links_of(page: str) -> list[str]:
    """The calculator names linked from a material page's 'more calculators' line."""
    line = re.search(r'<p class="more-calcs">(.*?)</p>', page, re.S)
    assert line, "no more-calcs line on the page"
    return re.findall(r'calculators/([a-z-]+)/index\.html', line.group(1))


def answers(name: str, material_id: str, catalogue: dict) -> bool:
    """Whether ``name`` with its default inputs takes the material: no problem under the material or
    the model field (a default size that the standard lacks for aluminium is the user's to change)."""
    module = CALCULATORS[name]
    inputs = {field: module.DEFAULTS.get(field, "") for field in module.FIELDS}
    inputs["material"] = link_key(material_id)  # what the page's link types into the field
    errors = calculate(name, inputs, catalogue)["errors"]
    return "material" not in errors and "model" not in errors


def test_copper_and_1350_offer_the_bench_and_fault_calculators(shipped):
    """Standard annealed copper and 1350 aluminium are what IEC 60228 and IEC 60949 are written for:
    both pages must link measured-check and short-circuit."""
    _, single = shipped
    for mid in ("copper-annealed", "aluminium-1350"):
        names = [c["name"] for c in fitting_calculators(mid, single[mid])]
        assert "measured-check" in names and "short-circuit" in names, (mid, names)
        assert "resistance" not in names, "the resistance calculator is on the page already"


def test_a_link_is_offered_exactly_where_the_calculator_answers(shipped):
    """For every shipped material and every calculator with a material field: linked (judged on the
    material page's one-material catalogue) if and only if the calculator page (the full catalogue)
    takes the material. Low-carbon steel
    has no specific heat on record, so short-circuit must not be linked and must refuse."""
    full, single = shipped
    seen_refusal = False
    for mid in sorted(full["materials"]):
        linked = {c["name"] for c in fitting_calculators(mid, single[mid])}
        for name, module in CALCULATORS.items():
            if name == "resistance" or "material" not in module.FIELDS:
                continue
            works = answers(name, mid, full)
            assert (name in linked) == works, (mid, name, "linked" if name in linked else "not linked", works)
            seen_refusal = seen_refusal or not works
    assert seen_refusal, "no material is refused by any calculator: the check above cannot tell anything"
    assert not answers("short-circuit", "steel-low-carbon", full)


def test_the_built_page_shows_the_links_with_titles(built_site):
    page = (built_site / "materials" / "copper-annealed" / "index.html").read_text(encoding="utf-8")
    names = links_of(page)
    assert "short-circuit" in names and "measured-check" in names
    assert CALCULATORS["short-circuit"].TITLE in page
    steel = (built_site / "materials" / "steel-low-carbon" / "index.html").read_text(encoding="utf-8")
    assert "short-circuit" not in links_of(steel)
