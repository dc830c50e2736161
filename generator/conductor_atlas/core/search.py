"""Site search: text matching tolerant of case, accents and small typos, plus property filters.

Runs in the browser (transpiled) on search-index.json, which ``conductor_atlas.search_index``
writes at build time with ``prepare_index``: the entries as lists (see E_*), the vocabulary with
each word's letters as bits, and per word its postings (entry, field), so the browser parses the
file and searches it with no preparation and no per-entry dicts. A query compares each query word
with the vocabulary (most words are passed over on their letters alone), walks the postings of the
words it matches, and scores only the entries those reach, fully only while they can still be
among the results shown. Pure functions, plain lists and dicts.

An index entry (the input of ``prepare_index``) is a dict:
    {"id", "kind" ("material" | "table" | "calculator" | "page"), "title", "url" (from the site root),
     "summary", "aliases": [str], "class_title", "material" (name, for tables/calculators),
     "keywords": [str], "props": {name: SI float}, "facts": {name: [label, text]}}
Every key but id, kind, title and url may be missing.

Matching (``token_match``): after ``fold_text`` (lower case, accents stripped with an explicit
table, µ/μ, Ω, ², ·, Greek letters unified) text is cut into runs of a-z and 0-9. A query word
matches an entry word exactly, as a prefix (from one character, so a first keystroke already lists
the names it starts), or within a typo budget
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
from math import floor  # a plain binding: math.floor is a property look-up in JS

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.units import parse_quantity, known_units, normalise_text, split_number, SI_UNIT
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

# the fields of an entry, in the order that wins a tie between equally good matches
FIELD_RANK = {"title": 0, "aliases": 1, "id": 2, "material": 3, "class_title": 4, "keywords": 5, "summary": 6}
FIELD_NAMES = ["title", "aliases", "id", "material", "class_title", "keywords", "summary"]
FIELD_WEIGHT = [1.0, 1.0, 0.9, 0.8, 0.5, 0.5, 0.3]  # by field rank
RANK_STEP = 8  # a posting code is (position step) × RANK_STEP + field rank
INDEX_FORMAT = 2  # of the prepared index (search-index.json)
DIGIT_BIT = 1 << 26  # in a word's letter mask (letter_mask): the word has a digit
LETTER_BITS = DIGIT_BIT - 1  # the bits of a-z

# The fields of an entry's record in the prepared index (a list, not a dict: see prepare_index)
E_ID = 0
E_KIND = 1  # its number in the index's "kinds"
E_TITLE = 2
E_URL = 3
E_SUMMARY = 4
E_CLASS = 5
E_ALIASES = 6
E_FACTS = 7  # [[property key, label number (in "labels"), text as the card shows it], ...]
E_EXACT = 8  # the lengths of the compact id, title and aliases
E_TITLE_WORDS = 9  # the title's distinct words as vocabulary numbers
E_MATERIAL = 10  # the entry's number among the materials (its place in each "values" column), or -1
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


def is_ascii(text):
    """True when every character of ``text`` is below U+0080 (as the former ``[^\\x00-\\x7f]``
    found none)."""
    for i in range(len(text)):
        if ord(text[i]) > 127:
            return False
    return True


def fold_text(text):
    """Lower case, accents stripped, look-alike symbols unified; other characters kept."""
    lowered = str(text).lower()
    if is_ascii(lowered):
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


# Functions from here to the next "kwargs" pragma run for every index word or reached entry of a
# query: Transcrypt gives them no keyword-argument prologue (a look at `arguments` on every call,
# slower than their bodies in the browser). Call them with positional arguments only (and give
# them no defaults); tests/core/test_subset.py checks that.
# __pragma__ ('nokwargs')
def osa_distance(a, b, limit):
    """Optimal-string-alignment distance of a and b, or limit + 1 once it must exceed ``limit``.

    Counts insertions, deletions, substitutions and swaps of two adjacent characters. Plain
    comparisons instead of min(): the browser runs this for every index word a query word meets.
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
        ca = a[i - 1]
        current = [i]
        row_min = i
        for j in range(1, lb + 1):
            cb = b[j - 1]
            best = previous[j - 1]
            if ca != cb:
                best += 1
            if previous[j] + 1 < best:
                best = previous[j] + 1
            if current[j - 1] + 1 < best:
                best = current[j - 1] + 1
            if i > 1 and j > 1 and ca == b[j - 2] and a[i - 2] == cb and before[j - 2] + 1 < best:
                best = before[j - 2] + 1
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
    return word_match(query_word, word, not (has_digit(query_word) or has_digit(word)))


def word_match(query_word, word, fuzzy):
    """``token_match`` with the digit test done by the caller (``fuzzy`` False: exact or prefix only)."""
    if query_word == word:
        return [1.0, 0]
    size = len(query_word)
    if size >= 1 and len(word) > size and word.startswith(query_word):
        return [0.7 + 0.3 * size / len(word), 0]
    if not fuzzy:
        return [0.0, 0]
    budget = typo_budget(size)
    if budget == 0:
        return [0.0, 0]
    typos = osa_distance(query_word, word, budget)
    if typos > budget and len(word) > size + 1:
        # a word still being typed, with a typo: compare with the word's start
        typos = osa_distance(query_word, word[0:size + 1], budget)
        if typos > 1:
            # the word's first ``size`` characters are not the query word (no prefix match), so
            # they are at least one typo away: only a count above one can improve
            shorter = osa_distance(query_word, word[0:size], budget)
            if shorter < typos:
                typos = shorter
    if typos <= budget:
        return [0.6 - 0.15 * typos, typos]
    return [0.0, 0]


# __pragma__ ('kwargs')


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


def add_words(words, order, cache, text, rank):
    """Add each word of ``text`` to ``words`` (word -> field rank), keeping the first field's rank.

    The fields are added in rank order and their weights never grow with the rank, so the first
    field a word appears in is also its heaviest. ``order`` lists the words in first-seen order:
    JS objects list keys that look like numbers ("65") first, so dict order is never relied on.
    """
    for word in cached_tokens(cache, text):
        if not (word in words):
            order.append(word)
            words[word] = rank


def prepare_entry(entry, cache):
    """[the entry's record (see E_*) with its kind and title words as text, its words, their field ranks]."""
    words = {}
    order = []
    title_words = []
    for word in cached_tokens(cache, field_text(entry, "title")):
        if not (word in title_words):
            title_words.append(word)
    add_words(words, order, cache, field_text(entry, "title"), FIELD_RANK["title"])
    for alias in field_list(entry, "aliases"):
        add_words(words, order, cache, alias, FIELD_RANK["aliases"])
    add_words(words, order, cache, field_text(entry, "id"), FIELD_RANK["id"])
    add_words(words, order, cache, field_text(entry, "material"), FIELD_RANK["material"])
    add_words(words, order, cache, field_text(entry, "class_title"), FIELD_RANK["class_title"])
    for text in field_list(entry, "keywords"):
        add_words(words, order, cache, text, FIELD_RANK["keywords"])
    add_words(words, order, cache, field_text(entry, "summary"), FIELD_RANK["summary"])
    # the lengths of the compact id, title and aliases: search compacts only the keys as long as the query
    exact = [len("".join(cached_tokens(cache, field_text(entry, "id")))),
             len("".join(cached_tokens(cache, field_text(entry, "title"))))]
    aliases = []
    for alias in field_list(entry, "aliases"):
        exact.append(len("".join(cached_tokens(cache, alias))))
        aliases.append(str(alias))
    facts = []
    given = field_dict(entry, "facts")
    for key in given.keys():
        facts.append([key, given[key][0], given[key][1]])
    record = [field_text(entry, "id"), field_text(entry, "kind"), field_text(entry, "title"),
              field_text(entry, "url"), field_text(entry, "summary"), field_text(entry, "class_title"), aliases,
              facts, exact, title_words, -1]
    ranks = []
    for word in order:
        ranks.append(words[word])
    return [record, order, ranks]


def prepare_index(entries):
    """The searchable form of the index entries, built once (at build time: search-index.json is this).

    Only lists, strings, numbers, booleans and None below the top level, so the browser uses the
    parsed JSON as it is (no preparation, no dicts to make):
    {"format", "entries": [record (E_*)], "kinds": [kind], "labels": [property label],
     "label_words": [its words, per label],
     "entry_kinds", "title_first", "key_sizes": per entry, its kind number, the vocabulary number of
     its title's first word (-1: none) and the key_size_bit of each of its exact keys, or-ed
     (flat lists of numbers: the score bound reads them for every reached entry), "vocabulary": [word],
     "letters": [letter_mask of each word], "postings": [[code] per word],
     "material_positions": [entry position of each material],
     "properties": [the FILTERS keys, then any other key of the entries' props],
     "values": [[SI value or None per material] per property]}.
    A posting code is the entry's position minus that of the word's previous posting (0 before
    the first), times RANK_STEP, plus the rank of the word's heaviest field in that entry.
    """
    records = []
    kinds = []
    kind_numbers = {}
    labels = []
    label_numbers = {}
    label_words = []
    entry_kinds = []
    title_first = []
    key_sizes = []
    vocabulary = []
    numbers = {}
    postings = []
    last = []
    materials = []
    properties = []
    values = []
    for spec in FILTERS:
        properties.append(spec[0])
    for entry in entries:
        props = field_dict(entry, "props")
        for key in props.keys():
            if not (key in properties):
                properties.append(key)
    for name in properties:
        values.append([])
    cache = {}
    for position in range(len(entries)):
        entry = entries[position]
        prepared = prepare_entry(entry, cache)
        record = prepared[0]
        order = prepared[1]
        ranks = prepared[2]
        for i in range(len(order)):
            word = order[i]
            if not (word in numbers):
                numbers[word] = len(vocabulary)
                vocabulary.append(word)
                postings.append([])
                last.append(0)
            n = numbers[word]
            postings[n].append((position - last[n]) * RANK_STEP + ranks[i])
            last[n] = position
        title_numbers = []
        for word in record[E_TITLE_WORDS]:
            title_numbers.append(numbers[word])
        record[E_TITLE_WORDS] = title_numbers
        title_first.append(title_numbers[0] if len(title_numbers) > 0 else -1)
        sizes = 0
        for size in record[E_EXACT]:
            sizes = sizes | key_size_bit(size)
        key_sizes.append(sizes)
        kind = record[E_KIND]
        if not (kind in kind_numbers):
            kind_numbers[kind] = len(kinds)
            kinds.append(kind)
        record[E_KIND] = kind_numbers[kind]
        entry_kinds.append(record[E_KIND])
        for fact in record[E_FACTS]:
            if not (fact[1] in label_numbers):
                label_numbers[fact[1]] = len(labels)
                labels.append(fact[1])
                label_words.append(cached_tokens(cache, fact[1]))
            fact[1] = label_numbers[fact[1]]
        if kind == "material":
            record[E_MATERIAL] = len(materials)
            materials.append(position)
            props = field_dict(entry, "props")
            for c in range(len(properties)):
                if properties[c] in props:
                    values[c].append(props[properties[c]])
                else:
                    values[c].append(None)
        records.append(record)
    letters = []
    for word in vocabulary:
        letters.append(letter_mask(word))
    return {"format": INDEX_FORMAT, "entries": records, "kinds": kinds, "labels": labels, "label_words": label_words,
            "entry_kinds": entry_kinds,
            "title_first": title_first, "key_sizes": key_sizes, "vocabulary": vocabulary, "letters": letters,
            "postings": postings, "material_positions": materials, "properties": properties, "values": values}


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


# ---------------------------------------------------------------------------------------------
# ranking


# Functions from here to the next "kwargs" pragma run for every index word or reached entry of a
# query: Transcrypt gives them no keyword-argument prologue (a look at `arguments` on every call,
# slower than their bodies in the browser). Call them with positional arguments only (and give
# them no defaults); tests/core/test_subset.py checks that.
# __pragma__ ('nokwargs')
def letter_mask(word):
    """The letters a-z of a word as bits (a 1, b 2, c 4, ...), plus DIGIT_BIT when it has a digit."""
    mask = 0
    for ch in word:
        if "a" <= ch and ch <= "z":
            mask = mask | (1 << (ord(ch) - 97))
        elif "0" <= ch and ch <= "9":
            mask = mask | DIGIT_BIT
    return mask


def word_qualities(index, query_words):
    """For each query word, the index words it matches: [[word number, quality, typos], ...].

    Every index word is visited, but most are passed over on their letters alone: a query word
    with a letter the index word lacks needs a typo for it, so a word missing more of the query
    word's letters than the typo budget allows cannot match (not even its start, which has no
    other letters), and only the rest are compared with ``word_match``.
    """
    vocabulary = index["vocabulary"]
    masks = index["letters"]
    size = len(vocabulary)
    tables = []
    for q in query_words:
        table = []
        exact_found = False
        q_mask = letter_mask(q)
        q_letters = q_mask & LETTER_BITS
        q_fuzzy = q_mask == q_letters
        budget = typo_budget(len(q))
        for n in range(size):
            mask = masks[n]
            allowed = 0
            if q_fuzzy and (mask & DIGIT_BIT) == 0:
                allowed = budget
            # the query word's letters this word lacks, counted (a bit at a time) up to allowed + 1
            lacking = q_letters & ~mask
            missing = 0
            while lacking != 0 and missing <= allowed:
                lacking = lacking & (lacking - 1)
                missing += 1
            if missing > allowed:
                continue
            found = word_match(q, vocabulary[n], allowed > 0)
            if found[0] > 0:
                table.append([n, found[0], found[1]])
                if found[1] == 0 and found[0] >= 1.0:
                    exact_found = True
        if exact_found and len(q) <= 5:
            kept = []
            for match in table:
                if match[2] == 0:
                    kept.append(match)
            table = kept
        tables.append(table)
    return tables


def word_marks(index, tables):
    """Per index word: 2 if the first query word matches it, 1 if another one does, else 0."""
    marks = []
    size = len(index["vocabulary"])
    for n in range(size):
        marks.append(0)
    for k in range(len(tables)):
        for match in tables[k]:
            if k == 0:
                marks[match[0]] = 2
            elif marks[match[0]] == 0:
                marks[match[0]] = 1
    return marks


def gather(index, tables):
    """The entries the matched words reach: [positions, gains, ranks], in the order first reached.

    ``gains[k][c]`` is the best quality × field weight of query word k in the entry at
    ``positions[c]`` (0 when it does not match there), ``ranks[k][c]`` that field's rank.
    """
    postings = index["postings"]
    count = len(index["entries"])
    words = len(tables)
    slot = []
    for i in range(count):
        slot.append(-1)
    positions = []
    gains = []
    ranks = []
    for k in range(words):
        gains.append([])
        ranks.append([])
    for k in range(words):
        gain = gains[k]
        rank = ranks[k]
        for match in tables[k]:
            quality = match[1]
            codes = postings[match[0]]
            size = len(codes)
            at = 0
            for i in range(size):
                code = codes[i]
                step = floor(code / RANK_STEP)
                field = code - step * RANK_STEP
                at += step
                c = slot[at]
                if c < 0:
                    c = len(positions)
                    slot[at] = c
                    positions.append(at)
                    for other in range(words):
                        gains[other].append(0.0)
                        ranks[other].append(99)
                value = quality * FIELD_WEIGHT[field]
                if value > gain[c] or (value == gain[c] and field < rank[c]):
                    gain[c] = value
                    rank[c] = field
    return [positions, gains, ranks]


def words_matched(gains, words, c):
    """How many of the ``words`` query words match reached entry c."""
    matched = 0
    for k in range(words):
        if gains[k][c] > 0:
            matched += 1
    return matched


def word_score(gains, words, c):
    """The sum over query words of 10 × (quality × field weight) for reached entry c."""
    score = 0.0
    for k in range(words):
        gain = gains[k][c]
        if gain > 0:
            score += 10.0 * gain
    return score


def best_field(gains, ranks, c):
    """The field of the best-matching query word (the first of equals) in reached entry c."""
    field = ""
    best = 0.0
    for k in range(len(gains)):
        if gains[k][c] > best:
            best = gains[k][c]
            field = FIELD_NAMES[ranks[k][c]]
    return field


def exact_key(record, i):
    """Key i of an entry for the exact-match bonus: its id, its title, then its aliases."""
    if i == 0:
        return record[E_ID]
    if i == 1:
        return record[E_TITLE]
    return record[E_ALIASES][i - 2]


def title_text(vocabulary, title_words):
    """The title's distinct words joined by spaces."""
    words = []
    for n in title_words:
        words.append(vocabulary[n])
    return " ".join(words)


def may_start_title(vocabulary, record, first_word):
    """False when the title cannot start with the query (it would start with the first query word)."""
    title_words = record[E_TITLE_WORDS]
    return len(title_words) > 0 and vocabulary[title_words[0]].startswith(first_word)


def key_size_bit(size):
    """A bit for a key of ``size`` characters (sizes 30 apart share one: a bound needs no more)."""
    return 1 << (size % 30)


def score_entry(index, record, base, marks, query_words, query_text, query_compact, kind_bonus):
    """The score of a reached entry whose query words give ``base`` (``word_score``).

    +100 when the query, compacted, is the entry's id, title or an alias; +20 when the title
    starts with the query; up to +3 for the share of the title's words the query matches, +1
    when the first query word matches the title's first word; the kind's bonus. ``query_words``
    is never empty (the caller scores only entries its words reached).
    """
    score = base
    size = len(query_compact)
    if size > 0:
        lengths = record[E_EXACT]
        for i in range(len(lengths)):
            if lengths[i] == size and compact(exact_key(record, i)) == query_compact:
                score += 100.0
                break
    title_words = record[E_TITLE_WORDS]
    if may_start_title(index["vocabulary"], record, query_words[0]):
        if title_text(index["vocabulary"], title_words).startswith(query_text):
            score += 20.0
    if len(title_words) > 0:
        covered = 0
        for n in title_words:
            if marks[n] > 0:
                covered += 1
        score += 3.0 * covered / len(title_words)
        if marks[title_words[0]] == 2:
            score += 1.0
    score += kind_bonus[record[E_KIND]]
    return score


def score_bound(index, position, base, size_bit, starts, kind_bonus):
    """A cheap upper bound of ``score_entry`` from the index's flat per-entry lists: each bonus
    that is possible at all, added in full. ``size_bit``: key_size_bit of the compacted query (0:
    no exact bonus); ``starts``: per vocabulary word, whether it starts with the first query word
    (empty: no title bonus).

    The same additions in the same order, each at least as large, so rounding keeps it an upper bound.
    """
    bound = base
    if size_bit != 0 and (index["key_sizes"][position] & size_bit) != 0:
        bound += 100.0
    first = index["title_first"][position]
    if first >= 0 and len(starts) > 0 and starts[first]:
        bound += 20.0
    bound += 3.0
    bound += 1.0
    bound += kind_bonus[index["entry_kinds"][position]]
    return bound


# A hit: [words matched, sort value, kind order, title, id, entry position, reached number (-1: none)]
def comes_before(a, b):
    """Result order: more words matched, higher sort value, materials first, title, id, position."""
    if a[0] != b[0]:
        return a[0] > b[0]
    if a[1] != b[1]:
        return a[1] > b[1]
    if a[2] != b[2]:
        return a[2] < b[2]
    if a[3] != b[3]:
        return a[3] < b[3]
    if a[4] != b[4]:
        return a[4] < b[4]
    return a[5] < b[5]


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


def keep_hit(top, hit, limit):
    """Add a hit to ``top``, the best ``limit`` hits so far in ``comes_before`` order (limit <= 0:
    every hit, unsorted). ``comes_before`` is a total order (positions differ), so this keeps
    exactly the head of the full sort. Returns True when ``top`` is full (holds ``limit`` hits)."""
    if limit <= 0:
        top.append(hit)
        return False
    size = len(top)
    if size < limit:
        top.append(hit)
        size += 1
    elif comes_before(hit, top[limit - 1]):
        top[limit - 1] = hit
    else:
        return True
    i = size - 1
    while i > 0 and comes_before(top[i], top[i - 1]):
        swap = top[i - 1]
        top[i - 1] = top[i]
        top[i] = swap
        i -= 1
    return size == limit



# ---------------------------------------------------------------------------------------------
# the query


def fact_text(index, record, key):
    """ "label text" of a property fact of the entry, or ""."""
    for fact in record[E_FACTS]:
        if fact[0] == key:
            return index["labels"][fact[1]] + " " + fact[2]
    return ""


def named_fact(index, record, query_words):
    """ "label value" of the first property whose label a query word spells (exactly or as a prefix)."""
    for fact in record[E_FACTS]:
        label_words = index["label_words"][fact[1]]
        for q in query_words:
            for w in label_words:
                # exact or prefix (quality 0.7 or more; a typo gives at most 0.45): no fuzzy comparison
                if len(q) >= 3 and word_match(q, w, False)[0] >= 0.7:
                    return index["labels"][fact[1]] + " " + fact[2]
    return ""


def snippet_for(index, record, field, filters, query_words):
    """The plain text shown under a result: filter values, the matched alias or property, or the summary."""
    parts = []
    for f in filters:
        text = fact_text(index, record, f["property"])
        if len(text) > 0:
            parts.append(text)
    if len(parts) > 0:
        return " · ".join(parts)
    named = named_fact(index, record, query_words)
    if len(named) > 0:
        return named
    if field == "aliases":
        return "Also known as " + ", ".join(record[E_ALIASES])
    if field == "class_title":
        return record[E_CLASS] + " · " + record[E_SUMMARY]
    return record[E_SUMMARY]


def new_outcome(query):
    return {"query": query, "results": [], "total": 0, "filters": [], "errors": [], "note": ""}


def filter_columns(index, filters):
    """For each filter, the number of its property's column in index["values"] (-1: none)."""
    columns = []
    properties = index["properties"]
    for f in filters:
        found = -1
        for c in range(len(properties)):
            if properties[c] == f["property"]:
                found = c
                break
        columns.append(found)
    return columns


def filter_value(index, record, filters, columns):
    """The sort value of a material passing every filter (its first filter's property, negated
    for < and <=), or None when the entry is no material or fails a filter."""
    material = record[E_MATERIAL]
    if material < 0:
        return None
    for i in range(len(filters)):
        if columns[i] < 0:
            return None
        value = index["values"][columns[i]][material]
        if value is None:
            return None
        if not passes(value, filters[i]["op"], filters[i]["value"]):
            return None
    first = filters[0]
    sort_value = index["values"][columns[0]][material]
    if first["op"] == "<" or first["op"] == "<=":
        sort_value = -sort_value
    return sort_value


def lacks_value(index, record, columns):
    """True for a material with no recorded value for some filter's property (it cannot be
    compared, so the filter leaves it out: the outcome's note says so instead of dropping it silently)."""
    material = record[E_MATERIAL]
    if material < 0:
        return False
    for c in columns:
        if c < 0 or index["values"][c][material] is None:
            return True
    return False


def unknown_note(titles, filters):
    """"Not listed: 2 materials with no recorded density (A, B)." with at most four names."""
    labels = []
    for f in filters:
        if f["label"] not in labels:
            labels.append(f["label"])
    shown = []
    for i in range(len(titles)):
        if i < 4:
            shown.append(titles[i])
    names = ", ".join(shown)
    if len(titles) > 4:
        names = names + " and " + str(len(titles) - 4) + " more"
    count = str(len(titles)) + (" material" if len(titles) == 1 else " materials")
    return "Not listed: " + count + " with no recorded " + " or ".join(labels) + " (" + names + ")."


# __pragma__ ('kwargs')


def search(index, query, limit):
    """Run ``query`` on a prepared index; return at most ``limit`` results (0 or less: all).

    Returns {"query", "results": [{"id", "title", "url", "kind", "snippet", "score"}], "total",
    "filters": [{"property", "label", "op", "value" (SI), "text"}], "errors": [str], "note": str}.
    Only the entries the query's words reach are scored (every material when there are only filters).
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
    entries = index["entries"]
    kinds = index["kinds"]
    kind_bonus = []
    kind_orders = []
    for kind in kinds:
        kind_bonus.append(KIND_BONUS[kind] if kind in KIND_BONUS else 0.0)
        kind_orders.append(KIND_ORDER[kind] if kind in KIND_ORDER else 9)
    columns = filter_columns(index, filters)
    top = []
    total = 0
    unknown = []
    if len(query_words) == 0:
        for position in index["material_positions"]:
            record = entries[position]
            sort_value = filter_value(index, record, filters, columns)
            if sort_value is None and lacks_value(index, record, columns):
                unknown.append(record[E_TITLE])
            if sort_value is not None:
                total += 1
                keep_hit(top, [0, sort_value, kind_orders[record[E_KIND]], record[E_TITLE], record[E_ID], position, -1],
                         limit)
    else:
        tables = word_qualities(index, query_words)
        marks = word_marks(index, tables)
        reached = gather(index, tables)
        positions = reached[0]
        gains = reached[1]
        count = len(positions)
        words = len(query_words)
        # with a filter every text word must match; without, the entries matching the most words are shown
        wanted = words
        if len(filters) == 0:
            most = 1 if count > 0 else 0  # every reached entry matches a word
            if words > 1:
                for c in range(count):
                    matched = words_matched(gains, words, c)
                    if matched > most:
                        most = matched
            if most < wanted and count > 0:
                outcome["note"] = "No entry matches every word; showing the closest matches."
            wanted = most
        query_compact = compact(text) if len(filters) == 0 else ""
        query_text = " ".join(query_words)
        filtered = len(filters) > 0
        # for the score bound: the exact bonus needs a key as long as the compacted query, the title
        # bonus a title whose first word starts with the first query word
        size_bit = key_size_bit(len(query_compact)) if len(query_compact) > 0 else 0
        starts = []
        for word in index["vocabulary"]:
            starts.append(word.startswith(query_words[0]))
        full = False
        for c in range(count):
            if words > 1 and words_matched(gains, words, c) != wanted:
                continue
            position = positions[c]
            if filtered:
                # ordered by the filtered property: the score is worked out for the shown hits only
                record = entries[position]
                sort_value = filter_value(index, record, filters, columns)
                if sort_value is None:
                    if lacks_value(index, record, columns):
                        unknown.append(record[E_TITLE])
                    continue
                total += 1
            else:
                base = word_score(gains, words, c)
                total += 1
                # most entries of a large index cannot reach the shown ones: skip their full score
                if full and score_bound(index, position, base, size_bit, starts, kind_bonus) < top[limit - 1][1]:
                    continue
                record = entries[position]
                sort_value = score_entry(index, record, base, marks, query_words, query_text, query_compact,
                                         kind_bonus)
            full = keep_hit(top, [wanted, sort_value, kind_orders[record[E_KIND]], record[E_TITLE], record[E_ID],
                                  position, c], limit)
    if limit <= 0:
        top = merge_sort(top)
    outcome["total"] = total
    for hit in top:
        record = entries[hit[5]]
        score = 0.0
        field = ""
        if hit[6] >= 0:
            c = hit[6]
            field = best_field(reached[1], reached[2], c)
            score = hit[1]
            if len(filters) > 0:
                score = score_entry(index, record, word_score(reached[1], len(query_words), c), marks, query_words,
                                    query_text, "", kind_bonus)
        snippet = snippet_for(index, record, field, filters, query_words)
        outcome["results"].append(result_of(record, kinds, score, snippet))
    if total == 0 and len(outcome["note"]) == 0:
        if len(filters) > 0:
            outcome["note"] = "No material matches " + filter_summary(filters) + "."
        else:
            outcome["note"] = "Nothing matches “" + text + "”."
    if len(unknown) > 0:
        unknown.sort()
        extra = unknown_note(unknown, filters)
        outcome["note"] = extra if len(outcome["note"]) == 0 else outcome["note"] + " " + extra
    return outcome


# (positional arguments only, as above)
# __pragma__ ('nokwargs')
# A result is a leaf the page only reads: in JS a plain object (the jsiter region), not a Transcrypt
# dict, whose eighteen hidden methods cost more to attach than the rest of a result to find.
# __pragma__ ('jsiter')
def result_of(record, kinds, score, snippet):
    """One result as search returns it: {"id", "title", "url", "kind", "snippet", "score"}."""
    return {"id": record[E_ID], "title": record[E_TITLE], "url": record[E_URL], "kind": kinds[record[E_KIND]],
            "snippet": snippet, "score": score}
# __pragma__ ('nojsiter')
# __pragma__ ('kwargs')


def filter_summary(filters):
    texts = []
    for f in filters:
        texts.append(f["text"])
    return " and ".join(texts)


def search_entries(entries, query, limit):
    """``search`` on raw index entries (prepares them first): one call for tests and the command line."""
    return search(prepare_index(entries), query, limit)
