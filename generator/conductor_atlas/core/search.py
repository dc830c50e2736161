"""Site search: text matching tolerant of case, accents and small typos, plus property filters.

Runs in the browser (transpiled) on search-index.json, which ``conductor_atlas.search_index_file``
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

The search is split into flat sibling modules, one job each: core.search_text (folding and word
matching), core.search_format (the prepared index's layout), core.search_prepare (prepare_index, at
build time), core.search_filters (property filters), core.search_rank (matching words, scoring and
ordering entries), core.search_size (a query that is a conductor size) and this module (the query:
``search``).
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.search_format import (E_ALIASES, E_CLASS, E_FACTS, E_ID, E_KIND, E_MATERIAL, E_SUMMARY,
                                                E_TITLE, E_URL, key_size_bit)
from conductor_atlas.core.search_text import compact, STOP_WORDS, tokens, word_match
from conductor_atlas.core.search_filters import find_operator, parse_filter, passes, split_clauses
from conductor_atlas.core.search_prepare import prepare_index
from conductor_atlas.core.search_size import size_result, size_split
from conductor_atlas.core.text_match import name_key
from conductor_atlas.core.trade_words import TRADE_WORDS
from conductor_atlas.core.search_rank import (best_field, gather, keep_hit, KIND_BONUS, KIND_ORDER, merge_sort,
                                              score_bound, score_entry, word_marks, word_qualities, word_score,
                                              words_matched)


# Functions from here to the next "kwargs" pragma run for every index word or reached entry of a
# query: Transcrypt gives them no keyword-argument prologue (a look at `arguments` on every call,
# slower than their bodies in the browser). Call them with positional arguments only (and give
# them no defaults); tests/core/test_subset.py checks that.
# __pragma__ ('nokwargs')
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


# The outcome is read by key only (by the core, the page and JSON): in JS a plain object (the jsiter
# region), not a Transcrypt dict, made afresh on every keystroke.
# __pragma__ ('jsiter')
def new_outcome(query):
    return {"query": query, "results": [], "total": 0, "filters": [], "errors": [], "note": ""}
# __pragma__ ('nojsiter')


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
    # a size typed with other words ("4/0 copper"): the rest is searched alone (core.search_size)
    sized = None
    if find_operator(text) is None:  # a size has no <, > or =; a filter query skips the size reading
        sized = size_split(text)
    if sized is not None and len(sized[1]) > 0:
        text = sized[1]
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
        # bonus a title whose first word starts with the first query word (checked per entry bounded)
        size_bit = key_size_bit(len(query_compact)) if len(query_compact) > 0 else 0
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
                if full and score_bound(index, position, base, size_bit, query_words[0], kind_bonus) < top[limit - 1][1]:
                    continue
                record = entries[position]
                sort_value = score_entry(index, record, base, marks, query_words, query_text, query_compact,
                                         kind_bonus)
            full = keep_hit(top, [wanted, sort_value, kind_orders[record[E_KIND]], record[E_TITLE], record[E_ID],
                                  position, c], limit)
    if limit <= 0:
        top = merge_sort(top)
    # a query that reads as a conductor size answers with the size first (core.search_size)
    size = None
    if sized is not None and len(filters) == 0:
        size = size_result(sized[0], sized_material(entries, kinds, top, sized[1]) if len(sized[1]) > 0 else None)
    if size is not None:
        outcome["results"].append(size)
        total += 1
        if limit > 0 and len(top) >= limit:
            top.pop()
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


def sized_material(entries, kinds, top, words):
    """[id, title] of the material typed beside a size: a trade word ("copper") is its conductor grade,
    as in the calculators (core.trade_words); other words give the best hit when it is a material."""
    key = name_key(words)
    if key in TRADE_WORDS:
        for record in entries:
            if record[E_ID] == TRADE_WORDS[key][0] and kinds[record[E_KIND]] == "material":
                return [record[E_ID], record[E_TITLE]]
    return first_material(entries, kinds, top)


def first_material(entries, kinds, top):
    """[id, title] of the best hit when it is a material, or None (the words typed beside a size named no
    material first, e.g. "wire": the calculator keeps its own default rather than a guess)."""
    if len(top) == 0:
        return None
    record = entries[top[0][5]]
    if kinds[record[E_KIND]] != "material":
        return None
    return [record[E_ID], record[E_TITLE]]


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
