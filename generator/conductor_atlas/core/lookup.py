"""Find a material in the calculators' catalogue by id, alias or chemical symbol.

The catalogue is {"materials": {id: record}, "aliases": {folded alias: id}}, built by
conductor_atlas.derive.calc_catalogue. Matching ignores case and surrounding spaces; an unknown
name gives a CoreError that lists the nearest valid choices.
"""

from conductor_atlas.core.errors import CoreError


def fold(text):
    """Lower case, trimmed, inner runs of spaces collapsed; characters beyond U+FFFF dropped.

    (No id or alias has one; JS counts them as two units, so edit distances would differ.)
    """
    out = ""
    space = False
    for ch in str(text).strip().lower():
        code = ord(ch)
        if code >= 0xD800 and (code <= 0xDFFF or code > 0xFFFF):
            continue
        if ch == " " or ch == "\t":
            space = True
        else:
            if space and len(out) > 0:
                out = out + " "
            space = False
            out = out + ch
    return out


def edit_distance_within(a, b, limit):
    """edit_distance(a, b) when that is at most ``limit``, else any number above ``limit``.

    Stops as soon as a whole row of the table exceeds ``limit`` (the distance only grows from a
    row's smallest entry) or when the lengths alone differ by more.
    """
    na = len(a)
    nb = len(b)
    if na - nb > limit or nb - na > limit:
        return limit + 1
    previous = []
    for j in range(nb + 1):
        previous.append(j)
    for i in range(1, na + 1):
        current = [i]
        smallest = i
        ca = a[i - 1]
        for j in range(1, nb + 1):
            cost = 0 if ca == b[j - 1] else 1
            best = previous[j] + 1
            if current[j - 1] + 1 < best:
                best = current[j - 1] + 1
            if previous[j - 1] + cost < best:
                best = previous[j - 1] + cost
            current.append(best)
            if best < smallest:
                smallest = best
        if smallest > limit:
            return limit + 1
        previous = current
    return previous[nb]


# A limit above any distance between an id or alias and typed text (no pruning yet)
NO_LIMIT = 1000000


def edit_distance(a, b):
    """Levenshtein distance between two short strings (insert, delete, substitute cost 1)."""
    return edit_distance_within(a, b, NO_LIMIT)


def add_at_distance(found, distance, name, needed):
    """Record ``name`` at ``distance`` in ``found`` = {"buckets": [names by distance], "best": {name:
    smallest distance}, "counts": [distinct names by best distance], "limit": int}.

    "limit" becomes the ``needed``-th smallest best distance among the distinct names seen
    (NO_LIMIT until there are that many): every name of the final answer is at most that far
    from the text, so a farther candidate can be skipped without changing the answer.
    """
    buckets = found["buckets"]
    counts = found["counts"]
    best = found["best"]
    while len(buckets) <= distance:
        buckets.append([])
        counts.append(0)
    buckets[distance].append(name)
    if name in best:
        before = best[name]
        if distance >= before:
            return
        counts[before] -= 1
    best[name] = distance
    counts[distance] += 1
    total = 0
    for d in range(len(counts)):
        total += counts[d]
        if total >= needed:
            found["limit"] = d
            return


def nearest_names(catalogue, text, count):
    """The ``count`` ids/aliases closest to ``text`` by edit distance (ties by name).

    The same order as sorting every id and alias by (distance, name), but names are grouped by
    distance, only the groups needed are sorted, and candidates too far to matter are cut short
    (edit_distance_within): an unknown name is typed on every keystroke of a material field.
    """
    wanted = fold(text)
    needed = count
    if needed < 1:
        needed = 1  # the answer holds at least one name
    found = {"buckets": [], "best": {}, "counts": [], "limit": NO_LIMIT}
    for material_id in catalogue["materials"].keys():
        d = edit_distance_within(wanted, material_id, found["limit"])
        if d <= found["limit"]:
            add_at_distance(found, d, material_id, needed)
    display = catalogue["display_aliases"]
    for alias in catalogue["aliases"].keys():
        d = edit_distance_within(wanted, alias, found["limit"])
        if d <= found["limit"]:
            add_at_distance(found, d, display[alias], needed)
    names = []
    for bucket in found["buckets"]:
        bucket.sort()
        for name in bucket:
            seen = False
            for n in names:
                if n == name:
                    seen = True
            if not seen:
                names.append(name)
            if len(names) >= count:
                return names
    return names


# The plain words a practitioner types for conductor metal mean the conductor grade that is bought
# and measured, not the high-purity element (common practice (no source)); the chemical symbol keeps
# meaning the element. word -> [grade id, the element's id, the element's symbol]
TRADE_WORDS = {
    "copper": ["copper-annealed", "copper", "Cu"],
    "aluminium": ["aluminium-1350", "aluminium", "Al"],
    "aluminum": ["aluminium-1350", "aluminium", "Al"],
}


def trade_word_grade(catalogue, wanted):
    """The grade id the folded trade word ``wanted`` stands for, "" when it is none (or the grade is
    not in the catalogue)."""
    if wanted in TRADE_WORDS:
        grade = TRADE_WORDS[wanted][0]
        if grade in catalogue["materials"]:
            return grade
    return ""


def trade_word_note(catalogue, text):
    """What a result says when ``text`` is a trade word: which grade it was read as and how to ask for
    the high-purity metal; "" otherwise."""
    wanted = fold(text)
    grade = trade_word_grade(catalogue, wanted)
    if len(grade) == 0:
        return ""
    pure = TRADE_WORDS[wanted][1]
    note = "“" + str(text).strip() + "” is read as the conductor grade " + catalogue["materials"][grade]["name"]
    if pure in catalogue["materials"]:
        note = (note + "; for " + catalogue["materials"][pure]["name"] + " enter " + TRADE_WORDS[wanted][2])
    return note


def lookup_text(catalogue, material_id):
    """Text that find_material reads as ``material_id``: the id, or for an id that is also a trade
    word ("copper") the element's symbol ("Cu"). Pages and links fill material fields with it."""
    if len(trade_word_grade(catalogue, material_id)) == 0:
        return material_id
    return TRADE_WORDS[material_id][2]


def find_material(catalogue, text, field="material"):
    """The catalogue record named by ``text`` (id, alias, name or symbol; any case). A trade word
    (TRADE_WORDS) gives its conductor grade."""
    wanted = fold(text)
    if len(wanted) == 0:
        raise CoreError("is empty: name a material by id, alias or symbol (e.g. Cu, IACS, 1350)", field)
    materials = catalogue["materials"]
    grade = trade_word_grade(catalogue, wanted)
    if len(grade) > 0:
        return materials[grade]
    if wanted in materials:
        return materials[wanted]
    aliases = catalogue["aliases"]
    if wanted in aliases:
        return materials[aliases[wanted]]
    raise CoreError("unknown material “" + str(text).strip() + "”; nearest: "
                    + ", ".join(nearest_names(catalogue, text, 5)), field)
