"""Search, the ranking: which index words each query word matches (letter masks first), the entries
their postings reach, each entry's score and an upper bound of it, and the order of hits. Part of the
site search (see core.search)."""

import math
from math import floor  # a plain binding: math.floor is a property look-up in JS

from conductor_atlas.core.search_format import (DIGIT_BIT, E_ALIASES, E_EXACT, E_ID, E_KIND, E_TITLE, E_TITLE_WORDS,
                                                FIELD_NAMES, FIELD_WEIGHT, LETTER_BITS, letter_mask, RANK_STEP)
from conductor_atlas.core.search_text import compact, typo_budget, word_match


KIND_BONUS = {"material": 2.0, "calculator": 1.0, "page": 1.0, "table": 0.0}
KIND_ORDER = {"material": 0, "calculator": 1, "table": 2, "page": 3}


# Functions from here to the next "kwargs" pragma run for every index word or reached entry of a
# query: Transcrypt gives them no keyword-argument prologue (a look at `arguments` on every call,
# slower than their bodies in the browser). Call them with positional arguments only (and give
# them no defaults); tests/core/test_subset.py checks that.
# __pragma__ ('nokwargs')
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


def score_bound(index, position, base, size_bit, first_word, kind_bonus):
    """A cheap upper bound of ``score_entry`` from the index's flat per-entry lists: each bonus
    that is possible at all, added in full. ``size_bit``: key_size_bit of the compacted query (0:
    no exact bonus); ``first_word``: the first query word (the title bonus needs a title whose
    first word starts with it; checked for this entry only, not for the whole vocabulary).

    The same additions in the same order, each at least as large, so rounding keeps it an upper bound.
    """
    bound = base
    if size_bit != 0 and (index["key_sizes"][position] & size_bit) != 0:
        bound += 100.0
    first = index["title_first"][position]
    if first >= 0 and index["vocabulary"][first].startswith(first_word):
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


# __pragma__ ('kwargs')
