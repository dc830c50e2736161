"""Find a material in the calculators' catalogue by id, alias or chemical symbol.

The catalogue is {"materials": {id: record}, "aliases": {folded alias: id}}, built by
conductor_atlas.derive.calc_catalogue. Texts are compared by text_match.name_key (the loader's
clash check uses the same key); an unknown name gives a CoreError that lists the nearest choices
by search_text.osa_distance.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.search_text import cached_tokens, osa_distance, tokens
from conductor_atlas.core.text_match import name_key
from conductor_atlas.core.trade_words import TRADE_WORDS


# A limit above any distance between an id or alias and typed text (no pruning yet)
NO_LIMIT = 1000000


# __pragma__ ('nokwargs')
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
    (osa_distance with a limit): an unknown name is typed on every keystroke of a material field.
    """
    wanted = name_key(text)
    needed = count
    if needed < 1:
        needed = 1  # the answer holds at least one name
    found = {"buckets": [], "best": {}, "counts": [], "limit": NO_LIMIT}
    for material_id in catalogue["materials"].keys():
        d = osa_distance(wanted, material_id, found["limit"])
        if d <= found["limit"]:
            add_at_distance(found, d, material_id, needed)
    display = catalogue["display_aliases"]
    for alias in catalogue["aliases"].keys():
        d = osa_distance(wanted, alias, found["limit"])
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


# name key -> its words (search_text.tokens), for the ids and aliases names_with_words reads on every
# keystroke (speed only)
KEY_WORDS = {}


def starts_words_of(wanted_words, key):
    """True when every word of wanted_words begins some word of the name key ``key``."""
    words = cached_tokens(KEY_WORDS, key)
    for want in wanted_words:
        hit = False
        for word in words:
            if word.startswith(want):
                hit = True
        if not hit:
            return False
    return True


def comes_before(a, b):
    """Shorter first, then by text: the order names_with_words lists its names in."""
    if len(a) != len(b):
        return len(a) < len(b)
    return a < b


def names_with_words(catalogue, text, count):
    """Up to ``count`` names of materials in which every word of ``text`` begins a word of an id, alias
    or name ("steel" finds low-carbon and stainless steel and copper-clad steel; "tinned", tinned
    copper; "CCS", the clad steels), one per material, shortest first; [] when text has no words.
    A material matched only by its long name is listed by its id."""
    wanted_words = tokens(text)
    if len(wanted_words) == 0:
        return []
    best = {}
    for material_id in catalogue["materials"].keys():
        if starts_words_of(wanted_words, material_id):
            best[material_id] = material_id
    display = catalogue["display_aliases"]
    materials = catalogue["materials"]
    for key in catalogue["aliases"].keys():
        if not starts_words_of(wanted_words, key):
            continue
        material_id = catalogue["aliases"][key]
        shown = display[key]
        if key == name_key(materials[material_id]["name"]):
            shown = material_id
        if not (material_id in best) or comes_before(shown, best[material_id]):
            best[material_id] = shown
    names = []
    for material_id in best.keys():
        shown = best[material_id]
        at = len(names)
        while at > 0 and comes_before(shown, names[at - 1]):
            at -= 1
        names.insert(at, shown)
    return names[0:count]


def materials_used_for(catalogue, text, count):
    """Up to ``count`` ids of the materials the trade uses for what ``text`` names: every word of text
    begins a word of one of the material's uses ("magnet wire", "busbar" finds "busbars"), in the
    order of the catalogue's uses; [] when text has no words or the catalogue lists no uses."""
    wanted_words = tokens(text)
    found = []
    if len(wanted_words) == 0 or not ("uses" in catalogue):
        return found
    uses = catalogue["uses"]
    for key in uses.keys():
        if not starts_words_of(wanted_words, key):
            continue
        for material_id in uses[key]:
            seen = False
            for other in found:
                if other == material_id:
                    seen = True
            if not seen and len(found) < count:
                found.append(material_id)
    return found




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
    wanted = name_key(text)
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


# Words that name the class of metal around a designation ("aluminium 1350", "1350 aluminium",
# "AL 1350", "Cu ETP"): dropped at either end when the rest names a material.
CLASS_WORDS = ["copper", "aluminium", "aluminum", "alloy", "cu", "al"]


def word_order_key(key):
    """The words of a name key sorted: "copper annealed" and "annealed copper" give one key."""
    words = key.split(" ")
    words.sort()
    return " ".join(words)


def exact_match(catalogue, key):
    """The id whose id, alias or name has ``key``, "" for none."""
    if key in catalogue["materials"]:
        return key
    if key in catalogue["aliases"]:
        return catalogue["aliases"][key]
    return ""


def loose_match(catalogue, wanted):
    """The id named by ``wanted`` (a name key) once a class word at either end is dropped or the words
    are taken in any order ("aluminium 1350", "AL 1350", "copper annealed"); "" for none."""
    words = wanted.split(" ")
    if len(words) < 2:
        return ""
    first = words[0]
    last = words[len(words) - 1]
    for word in CLASS_WORDS:
        if first == word:
            found = exact_match(catalogue, " ".join(words[1:len(words)]))
            if len(found) > 0:
                return found
        if last == word:
            found = exact_match(catalogue, " ".join(words[0:len(words) - 1]))
            if len(found) > 0:
                return found
    ordered = word_order_key(wanted)
    if ordered in catalogue["word_keys"]:
        return catalogue["word_keys"][ordered]
    return ""
# __pragma__ ('kwargs')


def find_material(catalogue, text, field="material"):
    """The catalogue record named by ``text`` (id, alias, name or symbol; any case). A trade word
    (TRADE_WORDS) gives its conductor grade."""
    wanted = name_key(text)
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
    loose = loose_match(catalogue, wanted)
    if len(loose) > 0:
        return materials[loose]
    described = []
    listed = {}
    candidates = names_with_words(catalogue, text, 5)
    for name in nearest_names(catalogue, text, 5):
        candidates.append(name)  # (a list + list would join as text in the transpiled core)
    for name in candidates:
        key = name_key(name)
        found = trade_word_grade(catalogue, key)
        if len(found) == 0:
            found = exact_match(catalogue, key)
        if found in listed or len(described) >= 5:
            continue  # one name per material
        listed[found] = True
        described.append(name + " (" + materials[found]["name"] + ")")
    message = "unknown material “" + str(text).strip() + "”; "
    used = []
    for material_id in materials_used_for(catalogue, text, 4):
        used.append(lookup_text(catalogue, material_id) + " (" + materials[material_id]["name"] + ")")
    if len(used) > 0:
        message = message + "used for it: " + ", ".join(used) + "; "
    raise CoreError(message + "nearest: " + ", ".join(described), field)
