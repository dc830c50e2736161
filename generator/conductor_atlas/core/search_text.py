"""Search, the text side: folding (case, accents, µ/μ, Ω, ², Greek letters), words, and how one query
word matches one index word (exactly, as a prefix, or within a typo budget by the optimal-string-alignment
distance). Part of the site search (see core.search)."""


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


DIGITS = "0123456789"
STOP_WORDS = ["the", "of", "a", "an", "for", "in", "at", "vs", "with", "to", "and", "or", "on"]


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
    Only the band of cells within ``limit`` of the diagonal is worked out (Ukkonen): a cell farther
    off is at least its distance from the diagonal, more than ``limit``, so the band's edges are
    held at limit + 1, which changes no answer up to ``limit``.

    By hand: one letter dropped; one swap; a swap and a dropped letter; no letter in common (over the limit):

    >>> osa_distance("copper", "coper", 1), osa_distance("nickle", "nickel", 1)
    (1, 1)
    >>> osa_distance("copper", "cpoer", 2), osa_distance("chrom", "brass", 2)
    (2, 3)
    """
    la = len(a)
    lb = len(b)
    if abs(la - lb) > limit:
        return limit + 1
    over = limit + 1
    # three rows of the table, made once and reused in turn (no new list per row)
    before = []
    previous = []
    current = []
    for j in range(lb + 1):
        previous.append(j)
        before.append(j)
        current.append(j)
    for i in range(1, la + 1):
        ca = a[i - 1]
        current[0] = i
        row_min = i
        low = i - limit
        if low < 1:
            low = 1
        high = i + limit
        if high > lb:
            high = lb
        if low > 1:
            current[low - 1] = over
        for j in range(low, high + 1):
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
            current[j] = best
            if best < row_min:
                row_min = best
        if high < lb:
            current[high + 1] = over
        if row_min > limit:
            return limit + 1
        spare = before
        before = previous
        previous = current
        current = spare
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


def cached_tokens(cache, text):
    """``tokens(text)`` remembered in ``cache``: table titles, keywords and notes repeat per material."""
    if text in cache:
        return cache[text]
    found = tokens(text)
    cache[text] = found
    return found
