"""Search, the property filters: a clause "<property words> <op> <number> [unit]" read with
units.parse_quantity (FILTERS is the vocabulary), clauses split on ";", "," or "and", and the
comparison of a value with a filter. Part of the site search (see core.search)."""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.typed_text import split_number, normalise_text
from conductor_atlas.core.units import parse_quantity, known_units, SI_UNIT
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.search_text import (cached_tokens, DIGITS, fold_text, has_digit, osa_distance, tokens,
                                              typo_budget)


# Filterable properties: [index key, label, words that name it, unit kind, unit assumed for a bare number,
#                         that unit as shown]
FILTERS = [
    ["rho_20", "resistivity at 20 °C", ["resistivity", "rho", "electrical resistivity", "specific resistance"],
     "resistivity", "uohm*cm", "µΩ·cm"],
    ["iacs_20", "conductivity at 20 °C", ["iacs", "conductivity", "electrical conductivity", "conductivity iacs"],
     "ratio", "%", "%IACS"],
    ["temperature_coefficient", "temperature coefficient α",
     ["alpha", "tcr", "tempco", "temperature coefficient", "temperature coefficient of resistance"],
     "temperature_coefficient", "1/k", "1/K"],
    ["density", "density", ["density", "mass density"], "density", "g/cm3", "g/cm³"],
    ["mean_free_path", "mean free path", ["mean free path", "free path", "mfp"], "length", "nm", "nm"],
    ["thermal_conductivity", "thermal conductivity", ["thermal conductivity", "heat conductivity"],
     "thermal_conductivity", "w/(m*k)", "W/(m·K)"],
    ["melting_point", "melting point", ["melting point", "melting temperature", "melting"], "temperature",
     "degc", "°C"],
    ["debye_temperature", "Debye temperature", ["debye temperature", "debye"], "temperature", "k", "K"],
    ["curie_temperature", "Curie temperature", ["curie temperature", "curie"], "temperature", "k", "K"],
    ["relative_permeability", "relative permeability", ["relative permeability", "permeability", "mu r"],
     "ratio", "", ""],
    ["residual_resistivity_ratio", "residual resistivity ratio", ["rrr", "residual resistivity ratio"],
     "ratio", "", ""],
]

OPERATORS = [["<=", "<="], [">=", ">="], ["=<", "<="], ["=>", ">="], ["==", "="], ["≤", "<="], ["≥", ">="],
             ["<", "<"], [">", ">"], ["≈", "="], ["=", "="]]
EQUAL_TOLERANCE = 0.01  # "=" keeps values within 1 % of the typed one
FILTER_UNIT_ALIASES = {"%iacs": "%", "% iacs": "%", "iacs": "%"}


def find_operator(text):
    """[position, operator as typed, canonical operator] of the first comparison in text, or None."""
    best = None
    for pair in OPERATORS:
        at = text.find(pair[0])
        if at >= 0:
            if best is None or at < best[0] or (at == best[0] and len(pair[0]) > len(best[1])):
                best = [at, pair[0], pair[1]]
    return best


def words_match(query_words, name_words):
    """True when the query words spell a property name (each word exact, prefix of 3+, or fuzzy)."""
    if len(query_words) != len(name_words):
        return False
    for i in range(len(name_words)):
        q = query_words[i]
        w = name_words[i]
        if q == w:
            continue
        if len(q) >= 3 and w.startswith(q):
            continue
        if has_digit(q) or typo_budget(len(q)) == 0:
            return False
        if osa_distance(q, w, typo_budget(len(q))) > typo_budget(len(q)):
            return False
    return True


FILTER_TOKENS = {}  # property name -> its words, filled on first use


def find_property(words):
    """[filter spec, number of trailing words that name it] for the longest match at the end of words."""
    count = len(words)
    while count > 0:
        tail = words[len(words) - count:len(words)]
        for spec in FILTERS:
            for name in spec[2]:
                if words_match(tail, cached_tokens(FILTER_TOKENS, name)):
                    return [spec, count]
        count -= 1
    return None


def filter_names():
    names = []
    for spec in FILTERS:
        names.append(spec[2][0])
    return ", ".join(names)


def parse_filter(clause):
    """Read one filter clause. Returns {"filter": {...}, "words": [text words before it]}.

    Raises CoreError with a message a person can act on.
    """
    found = find_operator(clause)
    if found is None:
        raise CoreError("“" + clause + "” has no comparison (<, <=, >, >=, =)", "q")
    left = clause[0:found[0]]
    right = clause[found[0] + len(found[1]):len(clause)].strip()
    op = found[2]
    left_words = tokens(left)
    if len(left_words) == 0:
        raise CoreError("name a property before “" + found[1] + "”, e.g. density < 3 g/cm3; filterable: "
                        + filter_names(), "q")
    match = find_property(left_words)
    if match is None:
        raise CoreError("“" + left.strip() + "” is not a property search can filter on; use one of: "
                        + filter_names(), "q")
    spec = match[0]
    if len(right) == 0:
        raise CoreError("put a number after “" + found[1] + "”, e.g. " + spec[2][0] + " " + found[1] + " 3 "
                        + spec[5], "q")
    if find_operator(right) is not None:
        raise CoreError("one comparison per clause; separate clauses with a comma or “and”", "q")
    number_text = right
    unit_text = ""
    pieces = split_number(normalise_text(right))
    if pieces is not None:
        number_text = pieces[0]
        unit_text = pieces[1].strip()
        if right.startswith(number_text):
            unit_text = right[len(number_text):len(right)].strip()
    quantity_text = right
    folded_unit = fold_text(unit_text)
    if folded_unit in FILTER_UNIT_ALIASES:
        quantity_text = number_text + " " + FILTER_UNIT_ALIASES[folded_unit]
        unit_text = "%IACS"
    try:
        value = parse_quantity(quantity_text, spec[3], "q", spec[4])
    except CoreError as problem:
        raise CoreError(filter_unit_message(spec, number_text, unit_text, problem.message), "q")
    shown_unit = spec[5]
    if len(unit_text) > 0:
        shown_unit = unit_text
    text = spec[1] + " " + op_symbol(op) + " " + number_text
    if len(shown_unit) > 0:
        text = text + " " + shown_unit
    if spec[3] != "ratio" and SI_UNIT[spec[3]] != shown_unit:
        text = text + " (" + format_number(value, 4) + " " + SI_UNIT[spec[3]] + ")"
    if op == "=":
        text = text + " ±1 %"
    words = left_words[0:len(left_words) - match[1]]
    return {"filter": {"property": spec[0], "label": spec[1], "op": op, "value": value, "text": text},
            "words": words}


def filter_unit_message(spec, number_text, unit_text, message):
    """The unit parser's message, or, when the number alone reads, which units the property takes."""
    if len(unit_text) == 0:
        return message
    if not (message.startswith("unknown unit") or message.find("but this field needs") >= 0):
        return message
    try:
        parse_quantity(number_text, spec[3], "q", spec[4])
    except CoreError:
        return message
    units = []
    if spec[3] == "ratio":
        if len(spec[5]) > 0:
            units.append(spec[5])
    else:
        units = known_units(spec[3])
    text = "“" + unit_text + "” is not a unit of " + spec[1]
    if len(units) > 0:
        text = text + "; use " + ", ".join(units) + " or a bare number in " + spec[5]
    else:
        text = text + ", which is a plain number"
    return text


def op_symbol(op):
    if op == "<=":
        return "≤"
    if op == ">=":
        return "≥"
    return op


def passes(value, op, limit):
    """True when ``value op limit`` holds; "=" allows 1 % of the limit either way."""
    if op == "<":
        return value < limit
    if op == "<=":
        return value <= limit
    if op == ">":
        return value > limit
    if op == ">=":
        return value >= limit
    return abs(value - limit) <= EQUAL_TOLERANCE * abs(limit)


def split_clauses(query):
    """Cut the query at ";", at "," unless between two digits, and at the word "and"."""
    pieces = []
    current = []
    chars = []
    for ch in query:
        chars.append(ch)
    for i in range(len(chars)):
        ch = chars[i]
        if ch == ";" or ch == ",":
            between_digits = (ch == "," and i > 0 and i < len(chars) - 1 and DIGITS.find(chars[i - 1]) >= 0
                              and DIGITS.find(chars[i + 1]) >= 0)
            if not between_digits:
                pieces.append("".join(current))
                current = []
                continue
        current.append(ch)
    pieces.append("".join(current))
    clauses = []
    for piece in pieces:
        parts = (" " + piece + " ").split(" and ")
        for part in parts:
            if len(part.strip()) > 0:
                clauses.append(part.strip())
    return clauses
