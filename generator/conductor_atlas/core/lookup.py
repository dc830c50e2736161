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


def edit_distance(a, b):
    """Levenshtein distance between two short strings (insert, delete, substitute cost 1)."""
    previous = []
    for j in range(len(b) + 1):
        previous.append(j)
    for i in range(1, len(a) + 1):
        current = [i]
        for j in range(1, len(b) + 1):
            cost = 0 if a[i - 1] == b[j - 1] else 1
            best = previous[j] + 1
            if current[j - 1] + 1 < best:
                best = current[j - 1] + 1
            if previous[j - 1] + cost < best:
                best = previous[j - 1] + cost
            current.append(best)
        previous = current
    return previous[len(b)]


def nearest_names(catalogue, text, count):
    """The ``count`` ids/aliases closest to ``text`` by edit distance (ties by name)."""
    wanted = fold(text)
    scored = []
    for material_id in catalogue["materials"].keys():
        scored.append([edit_distance(wanted, material_id), material_id])
    for alias in catalogue["aliases"].keys():
        scored.append([edit_distance(wanted, alias), catalogue["display_aliases"][alias]])
    scored.sort(key=lambda pair: str(1000 + pair[0]) + pair[1])
    names = []
    for pair in scored:
        seen = False
        for n in names:
            if n == pair[1]:
                seen = True
        if not seen:
            names.append(pair[1])
        if len(names) >= count:
            break
    return names


def find_material(catalogue, text, field="material"):
    """The catalogue record named by ``text`` (id, alias, symbol; any case)."""
    wanted = fold(text)
    if len(wanted) == 0:
        raise CoreError("is empty: name a material by id, alias or symbol (e.g. Cu, IACS, 1350)", field)
    materials = catalogue["materials"]
    if wanted in materials:
        return materials[wanted]
    aliases = catalogue["aliases"]
    if wanted in aliases:
        return materials[aliases[wanted]]
    raise CoreError("unknown material “" + str(text).strip() + "”; nearest: "
                    + ", ".join(nearest_names(catalogue, text, 5)), field)
