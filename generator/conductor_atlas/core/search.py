"""Site search: text matching tolerant of case, accents and small typos, plus property filters.

Runs in the browser (transpiled) on the entries of search-index.json, which
``conductor_atlas.search_index`` writes at build time. Pure functions, plain lists and dicts.

An index entry is a dict:
    {"id", "kind" ("material" | "table" | "calculator" | "page"), "title", "url" (from the site root),
     "summary", "aliases": [str], "class_title", "material" (name, for tables/calculators),
     "keywords": [str], "props": {name: SI float}, "facts": {name: [label, text]}}
Every key but id, kind, title and url may be missing.

Matching (``token_match``): after ``fold_text`` (lower case, accents stripped with an explicit
table, µ/μ, Ω, ², ·, Greek letters unified) text is cut into runs of a-z and 0-9. A query word
matches an entry word exactly, as a prefix (two characters or more), or within a typo budget
measured by the optimal-string-alignment distance (Damerau–Levenshtein with adjacent
transpositions): 0 typos for words of up to 3 characters, 1 for 4–7, 2 for 8 or more. Words
with digits (designations such as C17200, A91350) never match fuzzily: 1350 is not 1351. When a
query word of 5 characters or fewer matches some word of the index exactly, its fuzzy matches are
dropped ("gold" does not also find "cold").

Ranking (``score_entry``): a query equal to an entry's id, alias or title (ignoring case, accents,
spaces and punctuation) first; then a query that starts the title; then the sum over query words
of the best match quality (exact 1, prefix 0.7-1, fuzzy 0.45 or 0.3) times the field's weight
(title and aliases 1, id 0.9, the material of a table 0.8, class and property names 0.5, summary
0.3), plus small bonuses for covering a short title and for materials. Entries must match every
query word; if none does, the entries matching the most words are shown, with a note.

Filters (``parse_filter``): a clause "<property words> <op> <number> [unit]" with op one of
< <= > >= = (also ≤ ≥ ≈; = means within 1 %). The number and unit are read by
``conductor_atlas.core.units.parse_quantity``; a bare number is in the unit the pages show
(µΩ·cm, %IACS, 1/K, g/cm³, nm, W/(m·K), °C, K). Clauses are separated by ";", "," (not a decimal
comma between digits) or the word "and". Words before the property words are searched as text.
Problems become messages in the outcome, never exceptions.
"""

import math
import re

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.units import parse_quantity, known_units, normalise_text, NUMBER_PATTERN, SI_UNIT
from conductor_atlas.core.numfmt import format_number

# Characters folded to ASCII (applied after lower()); combining marks U+0300-U+036F are dropped.
FOLD = {
    "à": "a", "á": "a", "â": "a", "ã": "a", "ä": "a", "å": "a", "ā": "a", "ă": "a", "ą": "a",
    "æ": "ae", "ç": "c", "ć": "c", "č": "c", "ď": "d", "đ": "d", "ð": "d",
    "è": "e", "é": "e", "ê": "e", "ë": "e", "ē": "e", "ė": "e", "ę": "e", "ě": "e",
    "ğ": "g", "ì": "i", "í": "i", "î": "i", "ï": "i", "ī": "i", "į": "i", "ı": "i",
    "ł": "l", "ľ": "l", "ĺ": "l", "ñ": "n", "ń": "n", "ň": "n",
    "ò": "o", "ó": "o", "ô": "o", "õ": "o", "ö": "o", "ø": "o", "ō": "o", "ő": "o", "œ": "oe",
    "ŕ": "r", "ř": "r", "ś": "s", "š": "s", "ş": "s", "ș": "s", "ß": "ss",
    "ť": "t", "ţ": "t", "ț": "t", "þ": "th",
    "ù": "u", "ú": "u", "û": "u", "ü": "u", "ū": "u", "ů": "u", "ű": "u", "ų": "u",
    "ý": "y", "ÿ": "y", "ź": "z", "ż": "z", "ž": "z",
    # micro sign and Greek mu both read "u" (as in the unit parser); Ω (both code points) is "ohm"
    "µ": "u", "μ": "u", "ω": "ohm", "Ω": "ohm",
    "α": "alpha", "ρ": "rho", "σ": "sigma", "δ": "delta", "λ": "lambda",
    "²": "2", "³": "3", "¹": "1", "⁰": "0", "⁴": "4",
}

NON_ASCII = re.compile(r"[^\x00-\x7f]")
# the fields of an entry, in the order that wins a tie between equally good matches
FIELD_RANK = {"title": 0, "aliases": 1, "id": 2, "material": 3, "class_title": 4, "keywords": 5, "summary": 6}
FIELD_NAMES = ["title", "aliases", "id", "material", "class_title", "keywords", "summary"]
DIGITS = "0123456789"
STOP_WORDS = ["the", "of", "a", "an", "for", "in", "at", "vs", "with", "to", "and", "or", "on"]

KIND_BONUS = {"material": 2.0, "calculator": 1.0, "page": 1.0, "table": 0.0}
KIND_ORDER = {"material": 0, "calculator": 1, "table": 2, "page": 3}

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


# ---------------------------------------------------------------------------------------------
# text


def fold_text(text):
    """Lower case, accents stripped, look-alike symbols unified; other characters kept."""
    lowered = str(text).lower()
    if NON_ASCII.search(lowered) is None:
        return lowered
    out = []
    for ch in lowered:
        if ch in FOLD:
            out.append(FOLD[ch])
        elif "\u0300" <= ch and ch <= "\u036f":
            continue
        else:
            out.append(ch)
    return "".join(out)


def tokens(text):
    """The runs of a-z and 0-9 in the folded text, in order.

    A plain character loop: in the browser it is about ten times faster than Transcrypt's re.sub.
    """
    folded = fold_text(text)
    words = []
    start = -1
    for i in range(len(folded)):
        ch = folded[i]
        if ("a" <= ch and ch <= "z") or ("0" <= ch and ch <= "9"):
            if start < 0:
                start = i
        elif start >= 0:
            words.append(folded[start:i])
            start = -1
    if start >= 0:
        words.append(folded[start:len(folded)])
    return words


def compact(text):
    """The folded text with everything but a-z and 0-9 removed: "CCA-10" and "cca 10" give "cca10"."""
    return "".join(tokens(text))


def has_digit(word):
    for ch in word:
        if DIGITS.find(ch) >= 0:
            return True
    return False


def typo_budget(size):
    """Typos allowed in a query word of ``size`` characters: 0 up to 3, 1 up to 7, then 2."""
    if size <= 3:
        return 0
    if size <= 7:
        return 1
    return 2


def osa_distance(a, b, limit):
    """Optimal-string-alignment distance of a and b, or limit + 1 once it must exceed ``limit``.

    Counts insertions, deletions, substitutions and swaps of two adjacent characters.
    """
    la = len(a)
    lb = len(b)
    if abs(la - lb) > limit:
        return limit + 1
    before = []
    previous = []
    for j in range(lb + 1):
        previous.append(j)
        before.append(j)
    for i in range(1, la + 1):
        current = [i]
        row_min = i
        for j in range(1, lb + 1):
            cost = 0 if a[i - 1] == b[j - 1] else 1
            best = min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + cost)
            if i > 1 and j > 1 and a[i - 1] == b[j - 2] and a[i - 2] == b[j - 1]:
                best = min(best, before[j - 2] + 1)
            current.append(best)
            if best < row_min:
                row_min = best
        if row_min > limit:
            return limit + 1
        before = previous
        previous = current
    result = previous[lb]
    if result > limit:
        return limit + 1
    return result


def token_match(query_word, word):
    """How well one query word matches one index word: [quality, typos], quality 0 for no match.

    Exact 1.0; prefix 0.7 + 0.3 × (share of the word typed); fuzzy 0.45 (1 typo) or 0.3 (2 typos).
    """
    if query_word == word:
        return [1.0, 0]
    size = len(query_word)
    if size >= 2 and len(word) > size and word.startswith(query_word):
        return [0.7 + 0.3 * size / len(word), 0]
    if has_digit(query_word) or has_digit(word):
        return [0.0, 0]
    budget = typo_budget(size)
    if budget == 0:
        return [0.0, 0]
    typos = osa_distance(query_word, word, budget)
    if typos > budget and len(word) > size + 1:
        # a word still being typed, with a typo: compare with the word's start
        typos = osa_distance(query_word, word[0:size + 1], budget)
        typos = min(typos, osa_distance(query_word, word[0:size], budget))
    if typos <= budget:
        return [0.6 - 0.15 * typos, typos]
    return [0.0, 0]


# ---------------------------------------------------------------------------------------------
# the index


def field_text(entry, key):
    if key in entry:
        value = entry[key]
        if value is None:
            return ""
        return str(value)
    return ""


def field_list(entry, key):
    if key in entry:
        value = entry[key]
        if value is None:
            return []
        return value
    return []


def field_dict(entry, key):
    if key in entry:
        value = entry[key]
        if value is None:
            return {}
        return value
    return {}


def cached_tokens(cache, text):
    """``tokens(text)`` remembered in ``cache``: table titles, keywords and notes repeat per material."""
    if text in cache:
        return cache[text]
    found = tokens(text)
    cache[text] = found
    return found


def add_words(words, order, cache, text, weight, field):
    """Add each word of ``text`` to ``words`` (word -> [weight, field]) keeping the highest weight.

    ``order`` lists the words in first-seen order: JS objects list keys that look like numbers
    ("65") first, so dict order is never relied on.
    """
    for word in cached_tokens(cache, text):
        if word in words:
            if words[word][0] >= weight:
                continue
        else:
            order.append(word)
        words[word] = [weight, field]


def prepare_entry(entry, cache):
    """The searchable form of one index entry: its words with field weights and its exact keys."""
    words = {}
    order = []
    title_words = []
    for word in cached_tokens(cache, field_text(entry, "title")):
        if not (word in title_words):
            title_words.append(word)
    add_words(words, order, cache, field_text(entry, "title"), 1.0, "title")
    for alias in field_list(entry, "aliases"):
        add_words(words, order, cache, alias, 1.0, "aliases")
    add_words(words, order, cache, field_text(entry, "id"), 0.9, "id")
    add_words(words, order, cache, field_text(entry, "material"), 0.8, "material")
    add_words(words, order, cache, field_text(entry, "class_title"), 0.5, "class_title")
    for text in field_list(entry, "keywords"):
        add_words(words, order, cache, text, 0.5, "keywords")
    add_words(words, order, cache, field_text(entry, "summary"), 0.3, "summary")
    exact = ["".join(cached_tokens(cache, field_text(entry, "id"))),
             "".join(cached_tokens(cache, field_text(entry, "title")))]
    for alias in field_list(entry, "aliases"):
        exact.append("".join(cached_tokens(cache, alias)))
    kind = field_text(entry, "kind")
    word_list = []
    for word in order:
        word_list.append([word, words[word][0], words[word][1]])
    return {"entry": entry, "words": word_list, "title_words": title_words,
            "title_text": " ".join(title_words), "exact": exact, "kind": kind}


def prepare_index(entries):
    """Prepare every entry once (at page load); ``search`` then runs on the result.

    ``postings`` maps each index word to [entry position, field weight, field rank] for every entry
    that contains it, so a query visits only the entries its words can match.
    """
    prepared = []
    postings = {}
    words = []
    cache = {}
    for position in range(len(entries)):
        item = prepare_entry(entries[position], cache)
        for pair in item["words"]:
            if not (pair[0] in postings):
                postings[pair[0]] = []
                words.append(pair[0])
            postings[pair[0]].append([position, pair[1], FIELD_RANK[pair[2]]])
        item["words"] = len(item["words"])
        prepared.append(item)
    return {"entries": prepared, "vocabulary": words, "postings": postings}


# ---------------------------------------------------------------------------------------------
# filters


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
    pieces = NUMBER_PATTERN.match(normalise_text(right))
    if pieces is not None:
        number_text = pieces.group(1)
        unit_text = pieces.group(2).strip()
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


# ---------------------------------------------------------------------------------------------
# ranking


def word_qualities(vocabulary, query_words):
    """For each query word, index word -> [quality, typos] for the index words it matches."""
    tables = []
    for q in query_words:
        table = {}
        exact_found = False
        for word in vocabulary:
            found = token_match(q, word)
            if found[0] > 0:
                table[word] = found
                if found[1] == 0 and found[0] >= 1.0:
                    exact_found = True
        if exact_found and len(q) <= 5:
            kept = {}
            for word in table.keys():
                if table[word][1] == 0:
                    kept[word] = table[word]
            table = kept
        tables.append(table)
    return tables


def word_gains(index, qualities):
    """Per query word, per entry position: the best quality × field weight and that field's rank."""
    count = len(index["entries"])
    gains = []
    ranks = []
    for k in range(len(qualities)):
        gain = []
        rank = []
        for i in range(count):
            gain.append(0.0)
            rank.append(99)
        table = qualities[k]
        for word in table.keys():
            quality = table[word][0]
            for posting in index["postings"][word]:
                at = posting[0]
                value = quality * posting[1]
                if value > gain[at] or (value == gain[at] and posting[2] < rank[at]):
                    gain[at] = value
                    rank[at] = posting[2]
        gains.append(gain)
        ranks.append(rank)
    return [gains, ranks]


def score_entry(item, position, query_words, qualities, gains, query_compact):
    """[number of query words matched, score, the field of the best match] for one entry."""
    matched = 0
    score = 0.0
    best_field = ""
    best_gain = 0.0
    for k in range(len(query_words)):
        gain = gains[0][k][position]
        if gain > 0:
            matched += 1
            score += 10.0 * gain
            if gain > best_gain:
                best_gain = gain
                best_field = FIELD_NAMES[gains[1][k][position]]
    if matched == 0:
        return [0, 0.0, ""]
    if len(query_compact) > 0:
        for key in item["exact"]:
            if key == query_compact:
                score += 100.0
                break
    query_text = " ".join(query_words)
    if len(query_text) >= 2 and item["title_text"].startswith(query_text):
        score += 20.0
    title_words = item["title_words"]
    if len(title_words) > 0:
        covered = 0
        for word in title_words:
            for table in qualities:
                if word in table:
                    covered += 1
                    break
        score += 3.0 * covered / len(title_words)
        if title_words[0] in qualities[0]:
            score += 1.0
    if item["kind"] in KIND_BONUS:
        score += KIND_BONUS[item["kind"]]
    return [matched, score, best_field]


def comes_before(a, b):
    """Result order: more words matched, higher score, materials first, then title and id."""
    if a["matched"] != b["matched"]:
        return a["matched"] > b["matched"]
    if a["sort"] != b["sort"]:
        return a["sort"] > b["sort"]
    if a["order"] != b["order"]:
        return a["order"] < b["order"]
    if a["title"] != b["title"]:
        return a["title"] < b["title"]
    return a["id"] < b["id"]


def merge_sort(items):
    """A stable sort with ``comes_before`` (no key functions: they compare lists as text in JS)."""
    if len(items) <= 1:
        return items
    middle = math.floor(len(items) / 2)
    left = merge_sort(items[0:middle])
    right = merge_sort(items[middle:len(items)])
    out = []
    i = 0
    j = 0
    while i < len(left) and j < len(right):
        if comes_before(right[j], left[i]):
            out.append(right[j])
            j += 1
        else:
            out.append(left[i])
            i += 1
    while i < len(left):
        out.append(left[i])
        i += 1
    while j < len(right):
        out.append(right[j])
        j += 1
    return out


# ---------------------------------------------------------------------------------------------
# the query


def fact_text(entry, key):
    """ "label text" of a property fact of the entry, or ""."""
    facts = field_dict(entry, "facts")
    if key in facts:
        return facts[key][0] + " " + facts[key][1]
    return ""


def named_fact(entry, query_words, cache):
    """ "label value" of the first property whose label a query word spells (exactly or as a prefix)."""
    facts = field_dict(entry, "facts")
    for key in facts.keys():
        label_words = cached_tokens(cache, facts[key][0])
        for q in query_words:
            for w in label_words:
                if len(q) >= 3 and token_match(q, w)[0] >= 0.7:
                    return facts[key][0] + " " + facts[key][1]
    return ""


def snippet_for(entry, field, filters, query_words, cache):
    """The plain text shown under a result: filter values, the matched alias or property, or the summary."""
    parts = []
    for f in filters:
        text = fact_text(entry, f["property"])
        if len(text) > 0:
            parts.append(text)
    if len(parts) > 0:
        return " · ".join(parts)
    named = named_fact(entry, query_words, cache)
    if len(named) > 0:
        return named
    if field == "aliases":
        names = []
        for alias in field_list(entry, "aliases"):
            names.append(alias)
        return "Also known as " + ", ".join(names)
    if field == "class_title":
        return field_text(entry, "class_title") + " · " + field_text(entry, "summary")
    return field_text(entry, "summary")


def new_outcome(query):
    return {"query": query, "results": [], "total": 0, "filters": [], "errors": [], "note": ""}


def search(index, query, limit):
    """Run ``query`` on a prepared index; return at most ``limit`` results (0 or less: all).

    Returns {"query", "results": [{"id", "title", "url", "kind", "snippet", "score"}], "total",
    "filters": [{"property", "label", "op", "value" (SI), "text"}], "errors": [str], "note": str}.
    """
    outcome = new_outcome(query)
    if query is None:
        return outcome
    text = str(query).strip()
    if len(text) == 0:
        return outcome
    query_words = []
    filters = []
    for clause in split_clauses(text):
        if find_operator(clause) is None:
            query_words.extend(tokens(clause))
            continue
        try:
            parsed = parse_filter(clause)
        except CoreError as problem:
            outcome["errors"].append("“" + clause + "”: " + problem.message)
            continue
        filters.append(parsed["filter"])
        query_words.extend(parsed["words"])
    outcome["filters"] = filters
    if len(outcome["errors"]) > 0:
        return outcome
    kept_words = []
    for word in query_words:
        if not (word in STOP_WORDS):
            kept_words.append(word)
    if len(kept_words) > 0:
        query_words = kept_words
    if len(query_words) == 0 and len(filters) == 0:
        outcome["note"] = "Type a material, a designation, a table or a property filter such as iacs > 90."
        return outcome
    qualities = word_qualities(index["vocabulary"], query_words)
    gains = word_gains(index, qualities)
    query_compact = compact(text) if len(filters) == 0 else ""
    found = []
    most = 0
    for position in range(len(index["entries"])):
        item = index["entries"][position]
        entry = item["entry"]
        sort_value = 0.0
        if len(filters) > 0:
            if item["kind"] != "material":
                continue
            props = field_dict(entry, "props")
            ok = True
            for f in filters:
                if not (f["property"] in props):
                    ok = False
                    break
                if not passes(props[f["property"]], f["op"], f["value"]):
                    ok = False
                    break
            if not ok:
                continue
            first = filters[0]
            sort_value = props[first["property"]]
            if first["op"] == "<" or first["op"] == "<=":
                sort_value = -sort_value
        matched = 0
        score = 0.0
        field = ""
        if len(query_words) > 0:
            scored = score_entry(item, position, query_words, qualities, gains, query_compact)
            matched = scored[0]
            score = scored[1]
            field = scored[2]
            if matched == 0:
                continue
            if len(filters) == 0:
                sort_value = score
        if matched > most:
            most = matched
        order = 9
        if item["kind"] in KIND_ORDER:
            order = KIND_ORDER[item["kind"]]
        found.append({"item": item, "matched": matched, "score": score, "sort": sort_value, "field": field,
                      "order": order, "title": field_text(entry, "title"), "id": field_text(entry, "id")})
    if len(query_words) > 0 and len(filters) > 0:
        # with a filter, every text word must match
        strict = []
        for hit in found:
            if hit["matched"] == len(query_words):
                strict.append(hit)
        found = strict
    elif len(query_words) > 0:
        best = []
        for hit in found:
            if hit["matched"] == most:
                best.append(hit)
        if most < len(query_words) and len(best) > 0:
            outcome["note"] = "No entry matches every word; showing the closest matches."
        found = best
    ranked = merge_sort(found)
    outcome["total"] = len(ranked)
    count = len(ranked)
    if limit > 0 and limit < count:
        count = limit
    cache = {}
    for i in range(count):
        hit = ranked[i]
        entry = hit["item"]["entry"]
        outcome["results"].append({
            "id": field_text(entry, "id"), "title": field_text(entry, "title"), "url": field_text(entry, "url"),
            "kind": field_text(entry, "kind"), "snippet": snippet_for(entry, hit["field"], filters, query_words, cache),
            "score": hit["score"]})
    if len(ranked) == 0 and len(outcome["note"]) == 0:
        if len(filters) > 0:
            outcome["note"] = "No material matches " + filter_summary(filters) + "."
        else:
            outcome["note"] = "Nothing matches “" + text + "”."
    return outcome


def filter_summary(filters):
    texts = []
    for f in filters:
        texts.append(f["text"])
    return " and ".join(texts)


def search_entries(entries, query, limit):
    """``search`` on raw index entries (prepares them first): one call for tests and the command line."""
    return search(prepare_index(entries), query, limit)
