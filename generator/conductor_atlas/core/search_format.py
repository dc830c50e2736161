"""Search, the prepared index's layout: the field ranks and weights, the posting code, the letter bits
of a word, and the places of an entry record's fields (E_*). Shared by core.search_prepare, which writes
the index, and the query side (core.search_rank, core.search)."""


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


# Called for every index word or reached entry of a query: positional arguments only, no defaults
# (see the nokwargs region of core.search_rank).
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


def key_size_bit(size):
    """A bit for a key of ``size`` characters (sizes 30 apart share one: a bound needs no more)."""
    return 1 << (size % 30)
# __pragma__ ('kwargs')
