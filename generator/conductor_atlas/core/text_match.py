"""The key a material's id, alias or name is known by (``name_key``): the material look-up stores and
finds names by it, and the loader's clash check compares them by it, so what passes the check is
what the look-up finds. (Search folds words its own way, core.search_text.fold_text; both use the
one edit distance, core.search_text.osa_distance.)
"""

# Characters a name key drops: invisible format characters (zero-width space, non-joiner, joiner,
# word joiner, the direction marks, soft hyphen, Mongolian vowel separator, combining grapheme
# joiner, U+FEFF) and the controls. Typed or pasted into a name they look like nothing.
INVISIBLE = ("\u00ad\u034f\u180e\u200b\u200c\u200d\u200e\u200f\u202a\u202b\u202c\u202d\u202e"
             "\u2060\u2061\u2062\u2063\u2064\ufeff")
# Every character Python's str.isspace() accepts (typed_text.SPACE_CHARACTERS): a run of them is one space
NAME_SPACES = ("\t\n\x0b\x0c\r\x1c\x1d\x1e\x1f \x85\xa0\u1680\u2000\u2001\u2002\u2003\u2004\u2005"
               "\u2006\u2007\u2008\u2009\u200a\u2028\u2029\u202f\u205f\u3000")


# __pragma__ ('nokwargs')
def name_key(text):
    """The key a material id, alias or name is known by: lower case; full-width forms (U+FF01-U+FF5E)
    as their ASCII letters; invisible characters (INVISIBLE), controls and characters beyond U+FFFF
    (JS counts them as two units) dropped; each run of spaces one space; trimmed.

    So "IACS😀", "ＩＡＣＳ", "I\u200bACS" and " iacs " all give "iacs": a name that differs from
    another only by what a reader cannot see is the same name.
    """
    out = []
    space = False
    for ch in str(text):
        code = ord(ch)
        if code >= 0xFF01 and code <= 0xFF5E:
            ch = chr(code - 0xFEE0)
            code = ord(ch)
        if code >= 0xD800 and (code <= 0xDFFF or code > 0xFFFF):
            continue
        if NAME_SPACES.find(ch) >= 0:
            space = True
            continue
        if code < 32 or (code >= 127 and code <= 159) or INVISIBLE.find(ch) >= 0:
            continue
        if space and len(out) > 0:
            out.append(" ")
        space = False
        out.append(ch)
    return "".join(out).lower()
# __pragma__ ('kwargs')
