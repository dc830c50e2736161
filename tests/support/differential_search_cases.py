"""Differential cases of the search: the real index through prepare and a list of typed queries, and
the text matching, filters, size reading and ranking the search leans on (tests/support/differential_cases.py
gathers them with the rest in all_cases)."""

from __future__ import annotations


SEARCH_QUERIES = [
    "4/0", "12 AWG", "100 x 10 mm", "4/0 copper", "copper wire 2.5 mm²", "4/0 AWG wire", "cu-ni 55/45", "copper", "Copper", "COPPER", "cooper", "coper", "nickle", "aluminum", "alumínium", "ALUMINIUM", "aluminim",
    "tungsten", "wolfram", "w", "c", "n", "s", "7", "cu", "A91350", "uns a91350", "c17200", "C172", "cca 10", "CCA-10", "2.4869",
    "skin depth", "skin", "resistivity temperature", "debye", "mean free path", "calculator", "resistance calculator",
    "references", "gold film", "copper alloy", "the", "   ", "", "Ωµ²·", "crème brûlée", "zzzz qqqq",
    "resistivity < 3 µΩ·cm", "resistivity < 3 μΩ*cm", "resistivity <= 1.7241 uohm cm", "rho < 2e-8 ohm m",
    "density < 3 g/cm3", "density < 3000 kg/m³", "density > 19", "iacs > 90", "iacs >= 100 %", "iacs > 90 %IACS",
    "%IACS ≥ 97", "conductivity > 50, copper", "copper alloy, iacs > 50", "alpha > 0.004", "α ≤ 0.0001 1/K",
    "tcr > 4000 ppm/K", "mean free path > 20 nm", "mfp >= 0,02 um", "thermal conductivity > 300 W/(m·K)",
    "melting point > 1500", "melting point > 1500 °C and density < 10", "density = 8.96 g/cm3", "density ≈ 2.7",
    "resistivty < 2", "densty < 3", "<img src=x onerror=alert(1)>", "foo > 3", "iacs >", "iacs > abc",
    "iacs > 50 kg", "density < 3 ohm", "> 5", "iacs > 1e999", "iacs > 90 > 80", "rho < 2,5 µΩ·cm", "rho < −1",
]


def search_cases():
    """The real index (shipped data, no rendered pages) through prepare and a list of typed queries."""
    from conductor_atlas.build import data_folders
    from conductor_atlas.derive import derive
    from conductor_atlas.load import load_dataset
    from conductor_atlas.search_index_file import build_index
    dataset = load_dataset(data_folders())
    everything = build_index(dataset, derive(dataset), {})["entries"]
    # every material, but the tables of a few only: each case carries the whole list to node
    keep = ("copper/", "aluminium/", "nickel/", "tungsten/", "aluminium-1350/")
    entries = [e for e in everything if e["kind"] != "table" or e["id"].startswith(keep)]
    module = "conductor_atlas.core.search"
    matching = "conductor_atlas.core.search_text"
    cases = [("conductor_atlas.core.search_prepare", "prepare_index", [entries])]
    for query in SEARCH_QUERIES:
        cases.append((module, "search_entries", [entries, query, 12]))
    for text in ["Crème Brûlée", "ÆØÅ ß", "µΩ·cm²", "Ωhm", "ρ(T) α", "Cu-Ni 55/45", "e\u0301te\u0301", "CCA 10%", "",
                 "IACS\U0001F600", "ＩＡＣＳ", "I\u200bACS", " annealed \u3000 EC\taluminium "]:
        cases.append((matching, "fold_text", [text]))
        cases.append(("conductor_atlas.core.text_match", "name_key", [text]))
        cases.append((matching, "tokens", [text]))
        cases.append((matching, "compact", [text]))
    for a, b in [("cooper", "copper"), ("nickle", "nickel"), ("aluminum", "aluminium"), ("ab", "ba"), ("", "abc"),
                 ("kitten", "sitting"), ("tungsten", "tunsgten"), ("abc", "abc")]:
        for limit in (0, 1, 2, 3):
            cases.append((matching, "osa_distance", [a, b, limit]))
        cases.append((matching, "token_match", [a, b]))
    for query in ["iacs > 90; density < 3, copper", "rho < 2,5 uohm*cm and iacs > 1", "a and b", ",;,"]:
        cases.append(("conductor_atlas.core.search_filters", "split_clauses", [query]))
    for text in ["4/0", "12 AWG", "#12", "2.5 mm²", "250 kcmil", "100 x 10 mm", "d 1.6 mm", "12", "copper", "4/0 copper",
                 "1e400 mm²", "0 AWG", "50 AWG"]:
        cases.append(("conductor_atlas.core.search_size", "size_result", [text]))
        cases.append(("conductor_atlas.core.search_size", "size_split", [text]))
    for text in ["copper wire 2.5 mm²", "100 x 10 mm aluminium", "aluminium 6101", "4/0 AWG wire"]:
        cases.append(("conductor_atlas.core.search_size", "size_split", [text]))
    cases.append(("conductor_atlas.core.search_size", "size_result", ["4/0", ["copper-annealed", "Standard annealed copper"]]))
    for word in ["copper", "c17200", "", "zz9"]:
        cases.append(("conductor_atlas.core.search_format", "letter_mask", [word]))
    hits = [[2, 1.5, 0, "Copper", "copper", 0, -1], [2, 1.5, 1, "Copper", "copper-table", 3, -1],
            [1, 9.0, 0, "Cobalt", "cobalt", 1, -1], [2, 1.5, 0, "Copper", "copper", 2, 4]]
    cases.append(("conductor_atlas.core.search_rank", "merge_sort", [hits]))
    for a, b in [(hits[0], hits[1]), (hits[1], hits[0]), (hits[0], hits[3]), (hits[2], hits[0])]:
        cases.append(("conductor_atlas.core.search_rank", "comes_before", [a, b]))
    return cases
