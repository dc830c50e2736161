"""Search, a size typed as the query: "4/0", "12 AWG", "2.5 mm²", "100 x 10 mm" answer with the size.

A user who types a conductor size into the search box wants the size, not the materials whose names
share its digits ("4/0" matched "Copper-nickel 55/45"). When the whole query reads as a size by
``conductor_atlas.core.geometry.parse_size`` (the same reader as the calculators' size field), the
search answers first with one result of kind "size": its area and diameter (AWG: ASTM B258 nominal
diameter; a bar: width x thickness), linking to the resistance calculator with the size filled in.
Anything else (no digit, a filter, a bare number such as "12", which is a gauge to some and mm² to
others) gives no size result and the search goes on as before.

A size with a material ("4/0 copper", "copper wire 2.5 mm²", "100 x 10 mm aluminium"): ``size_split``
finds the size at the start or the end of the query; the search then looks for the rest alone (the
size's digits matched "Copper-nickel 55/45" first) and the size result names the first material found
and opens the calculator with both.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import area_text, parse_size
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.trade_words import link_text

DIGITS = "0123456789"
# characters that would end or split the query part of the calculator's address: written as %XX
# (the page's URL constructor encodes spaces and non-ASCII characters itself)
ADDRESS_ESCAPES = {"%": "%25", "#": "%23", "&": "%26", "+": "%2B", "?": "%3F", "=": "%3D"}
CALCULATOR_URL = "calculators/resistance/index.html?size="
SEARCH_FIELD = "search"


def has_digit(text):
    """True when ``text`` holds a digit 0-9 (a size always does; most material names do not).

    >>> has_digit("4/0"), has_digit("copper")
    (True, False)
    """
    for ch in text:
        if DIGITS.find(ch) >= 0:
            return True
    return False


def address_text(text):
    """``text`` with the characters that would break a query string written as %XX.

    >>> address_text("4/0 AWG")
    '4/0 AWG'
    >>> address_text("#12")
    '%2312'
    """
    out = ""
    for ch in text:
        out = out + (ADDRESS_ESCAPES[ch] if ch in ADDRESS_ESCAPES else ch)
    return out


def size_title(size, typed):
    """ "4/0 AWG: 107.2 mm², ø 11.68 mm" for a gauge, "ø 1.6 mm: 2.011 mm²" for a diameter,
    "250 kcmil: 126.7 mm², ø 12.7 mm as solid round" or "2.5 mm²: ø 1.784 mm as solid round" for an area, "100 x 10 mm: 1000 mm²" for a bar.

    Area in mm² and diameter in mm to 4 significant digits (the pages' precision for sizes).

    >>> size_title(parse_size("40 x 5 mm", "size"), "40 x 5 mm")
    '40 x 5 mm: 200 mm²'
    """
    area = format_number(size["area"] * 1e6, 4) + " mm²"
    diameter = "ø " + format_number(size["diameter"] * 1e3, 4) + " mm"
    if size["shape"] == "bar" or size["label"].startswith("ø"):
        return size["label"] + ": " + area
    if size["shape"] == "area":
        solid = diameter + " as solid round"
        return area + ": " + solid if typed == area else typed + ": " + area + ", " + solid
    return size["label"] + ": " + area + ", " + diameter


def size_split(text):
    """[size text, rest] when the query is a size, or a size followed or preceded by other words; else None.

    The whole query is tried first, then its leading words (longest first), then its trailing words.

    >>> size_split("4/0 copper")
    ['4/0', 'copper']
    >>> size_split("copper wire 2.5 mm²")
    ['2.5 mm²', 'copper wire']
    >>> size_split("12 AWG")
    ['12 AWG', '']
    >>> size_split("aluminium 6101") is None
    True
    """
    typed = str(text).strip()
    if len(typed) == 0 or not has_digit(typed):
        return None
    if _reads_as_size(typed):
        return [typed, ""]
    words = typed.split()
    for cut in range(len(words) - 1, 0, -1):
        head = " ".join(words[:cut])
        if has_digit(head) and _reads_as_size(head):
            return [head, " ".join(words[cut:])]
    for cut in range(1, len(words)):
        tail = " ".join(words[cut:])
        if has_digit(tail) and _reads_as_size(tail):
            return [tail, " ".join(words[:cut])]
    return None


def _reads_as_size(text):
    try:
        parse_size(text, SEARCH_FIELD)
    except CoreError:
        return False
    return True


def size_result(text, material=None):
    """The "size" search result for a query that reads as a conductor size, or None.

    Returns {"id", "title", "url" (from the site root), "kind": "size", "snippet", "score"}, the
    shape of the search's other results. ``material``: [id, title] of a material typed with the size
    (the calculator opens with it, named as core.trade_words.link_text writes it), or None. ASTM B258: AWG 4/0 is 0.4600 in = 11.684 mm across,
    107.2 mm²:

    >>> size_result("4/0")["title"]
    '4/0 AWG: 107.2 mm², ø 11.68 mm'
    >>> size_result("copper") is None
    True
    """
    typed = str(text).strip()
    if len(typed) == 0 or not has_digit(typed):
        return None
    try:
        size = parse_size(typed, SEARCH_FIELD)
    except CoreError:
        return None
    label = size["label"] if size["shape"] != "area" else typed
    url = CALCULATOR_URL + address_text(label)
    opens = "this size"
    if material is not None:
        url = url + "&material=" + address_text(link_text(material[0]))
        opens = "this size and " + material[1]
    return {"id": "size", "title": size_title(size, typed), "url": url, "kind": "size",
            "snippet": "Cross-section " + area_text(size, size["area"]) + ". Open the resistance calculator with "
                       + opens + "; each material page has the size tables.",
            "score": 0.0}
