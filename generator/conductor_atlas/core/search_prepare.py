"""Search, the build side: ``prepare_index`` turns index entries into the prepared index the browser
searches with no preparation step (entry records as lists, vocabulary with letter bits, delta-coded
postings, property columns). Part of the site search (see core.search)."""

from conductor_atlas.core.search_format import (E_EXACT, E_FACTS, E_KIND, E_MATERIAL, E_TITLE_WORDS, FIELD_RANK,
                                                INDEX_FORMAT, key_size_bit, letter_mask, RANK_STEP)
from conductor_atlas.core.search_text import cached_tokens
from conductor_atlas.core.search_filters import FILTERS


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
