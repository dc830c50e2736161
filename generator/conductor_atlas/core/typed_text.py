"""Typed text made readable: which characters are spaces (the set CPython's ``\\s`` matches, so JS
reads text as CPython does), controls and look-alikes removed or replaced, runs of spaces found;
then the number at its start ("1 500", "0,82", "2.5e-3"): where it ends, thousands groups and
decimal commas, and a note when a decimal point stands before three digits ("1.500"). A number
that cannot be read unambiguously is a CoreError naming the field.

Plain character scans, no regular expressions (see core.units); each scan is checked against the
pattern it replaced in tests/core/test_text_scanning.py.
"""

from conductor_atlas.core.errors import CoreError

# Every character Python's regex \s matches (the same set as str.isspace()). The scans test
# membership here, so JS reads text as CPython does (JS \s and String.trim() use another set).
SPACE_CHARACTERS = ("\t\n\x0b\x0c\r\x1c\x1d\x1e\x1f \x85\xa0\u1680\u2000\u2001\u2002\u2003\u2004\u2005"
                    "\u2006\u2007\u2008\u2009\u200a\u2028\u2029\u202f\u205f\u3000")


# __pragma__ ('nokwargs')
def is_space(ch):
    """True when the one character ``ch`` is in SPACE_CHARACTERS."""
    return SPACE_CHARACTERS.find(ch) >= 0


def space_end(text, i):
    """The index after the run of SPACE_CHARACTERS that starts at ``i`` (``i`` itself for none)."""
    n = len(text)
    while i < n and is_space(text[i]):
        i += 1
    return i


def is_unportable(code):
    """True for the characters CPython's str.strip() and JS's String.trim() treat differently, and
    other controls: C0 controls but tab, LF and CR; DEL to U+009F; U+FEFF (whitespace only to JS)."""
    if code < 32:
        return not (code == 9 or code == 10 or code == 13)
    if code >= 127 and code <= 159:
        return True
    return code == 0xFEFF


def needs_cleaning(text):
    """True when ``text`` holds a character portable_text removes or replaces: a control character
    (tab included, though it is kept), DEL-U+009F, U+FEFF, or a line break (LF, CR, U+2028, U+2029).
    Most typed text holds none, and then portable_text builds no new string."""
    for ch in text:
        code = ord(ch)
        if code < 32 or code == 0xFEFF or code == 0x2028 or code == 0x2029:
            return True
        if code >= 127 and code <= 159:
            return True
    return False


def without_controls(text):
    """``text`` with the characters is_unportable names dropped and each line break (LF, CR,
    U+2028, U+2029) made a space; tabs and everything else kept."""
    out = []
    for i in range(len(text)):
        ch = text[i]
        code = ord(ch)
        if code == 10 or code == 13 or code == 0x2028 or code == 0x2029:
            out.append(" ")
        elif not is_unportable(code):
            out.append(ch)
    return "".join(out)


def portable_text(text):
    """``text`` without control characters and U+FEFF, line breaks as spaces, stripped: the same
    string in both runtimes (no character is left that only one runtime's strip removes), and one
    line, which the scans of this module and of geometry rely on."""
    if not needs_cleaning(text):
        return text.strip()
    return without_controls(text).strip()


def has_lookalikes(text):
    """True when ``text`` holds a character normalise_text may replace: anything beyond ASCII, or "^"."""
    for ch in text:
        if ord(ch) > 126 or ch == "^":
            return True
    return False


def normalise_text(text):
    """Unify the look-alike characters people type: unicode minus, micro, ohm, superscripts."""
    out = portable_text(text)
    if not has_lookalikes(out):
        return out
    out = out.replace("−", "-").replace("–", "-")
    out = out.replace("µ", "u").replace("μ", "u")
    out = out.replace("Ω", "ohm").replace("Ω", "ohm")
    out = out.replace("²", "2").replace("^2", "2").replace("³", "3").replace("^3", "3")
    out = out.replace("°", "deg").replace("·", "*").replace("⋅", "*")
    out = out.replace("\u00a0", " ").replace("\u202f", " ").replace("\u2009", " ")
    return out


def has_space(text):
    """True when ``text`` may hold a character of SPACE_CHARACTERS: anything but printable ASCII
    other than the space. (Without one, joined_spaces would change nothing.)"""
    for ch in text:
        code = ord(ch)
        if code < 33 or code > 126:
            return True
    return False


def is_digit(ch):
    return ch >= "0" and ch <= "9"


def is_group_at(text, i):
    """True when text[i] is a space followed by exactly three digits and then no digit: a space
    between thousands ("1 500"; thin and no-break spaces are made spaces by normalise_text)."""
    n = len(text)
    if not (i + 3 < n and text[i] == " "):
        return False
    if not (is_digit(text[i + 1]) and is_digit(text[i + 2]) and is_digit(text[i + 3])):
        return False
    return not (i + 4 < n and is_digit(text[i + 4]))


def number_end(text):
    """Where the number at the start of ``text`` ends; 0 for none.

    Sign; digits, then any run of separated groups: "," or "." with the digits after it (none
    after the last one: "5."), or a space with exactly three digits ("1 500"); or a separator and
    at least one digit (".5"); then an exponent only when it has a digit. What the separators
    mean is decided by grouped_number_text.
    """
    n = len(text)
    i = 0
    if i < n and (text[i] == "+" or text[i] == "-"):
        i += 1
    if i < n and is_digit(text[i]):
        while i < n and is_digit(text[i]):
            i += 1
        going = True
        while going and i < n:
            if text[i] == "." or text[i] == ",":
                i += 1
                while i < n and is_digit(text[i]):
                    i += 1
                going = i < n and is_digit(text[i - 1])
            elif is_group_at(text, i):
                i += 4
            else:
                going = False
    elif i + 1 < n and (text[i] == "." or text[i] == ",") and is_digit(text[i + 1]):
        i += 2
        while i < n and is_digit(text[i]):
            i += 1
    else:
        return 0
    if i < n and (text[i] == "e" or text[i] == "E"):
        j = i + 1
        if j < n and (text[j] == "+" or text[j] == "-"):
            j += 1
        if j < n and is_digit(text[j]):
            while j < n and is_digit(text[j]):
                j += 1
            i = j
    return i


def split_number(text):
    """[number text, rest] for text that starts with a number ("2,5 mm" -> ["2,5", "mm"]); None
    when it does not. The rest starts after the spaces that follow the number.

    What the former pattern ``^(number)\\s*(.*)$`` (number as in number_end) matched, for any
    text: Python's ``.`` stops at a line feed and ``$`` also matches before a final one, so a
    rest with a line feed other than its last character is no match, and a final one is dropped.
    """
    end = number_end(text)
    if end == 0:
        return None
    rest = text[space_end(text, end):]
    line_feed = rest.find("\n")
    if line_feed >= 0:
        if line_feed != len(rest) - 1:
            return None
        rest = rest[0:line_feed]
    return [text[0:end], rest]


def number_pieces(mantissa):
    """[runs of digits, separators between them] of a mantissa such as "1,500.25" ->
    [["1", "500", "25"], [",", "."]] (a leading separator gives a first run "")."""
    runs = []
    separators = []
    current = ""
    for ch in mantissa:
        if is_digit(ch):
            current = current + ch
        else:
            runs.append(current)
            separators.append(ch)
            current = ""
    runs.append(current)
    return [runs, separators]


def leads_a_group(first):
    """True when ``first`` can open a number grouped in thousands: one to three digits, no leading 0."""
    return len(first) >= 1 and len(first) <= 3 and first[0] != "0"


def all_three_digits(runs, start, stop):
    """True when runs[start:stop] all have exactly three digits."""
    for k in range(start, stop):
        if len(runs[k]) != 3:
            return False
    return True


def without_trailing_zeros(digits):
    """"500" -> "5", "250" -> "25", "000" -> "0" (the decimal reading of a three-digit group)."""
    end = len(digits)
    while end > 1 and digits[end - 1] == "0":
        end -= 1
    return digits[0:end]


def ambiguous_group_message(number_text, whole, group, separator):
    """The refusal for "1,500": the two readings and how to write each."""
    as_thousands = whole + group
    as_decimal = whole + "." + without_trailing_zeros(group)
    if separator == ",":
        return ("“" + number_text + "” could be " + as_thousands + " (comma between thousands) or " + as_decimal
                + " (decimal comma): write " + as_thousands + " or " + as_decimal)
    return ("“" + number_text + "” could be " + as_decimal + " (decimal point) or " + as_thousands
            + " (point between thousands): write " + as_decimal + " or " + as_thousands)


def grouped_number_text(number_text, field):
    """The number as Python and JS read it ("1,500,000" -> "1500000", "12,500.5" -> "12500.5",
    "1 500" -> "1500", "0,820" -> "0.820"); a CoreError naming ``field`` when the separators can be
    read two ways or make no number.

    The rule (README, "Typing numbers"): a run of groups of exactly three digits after a first group
    of one to three digits (no leading 0) separated by one kind of mark (",", "." or a space) is
    thousands; a single "," followed by exactly three digits ("1,500", "12,250") could be either
    convention and is refused with both readings, unless the number starts with 0 or has an
    exponent (neither can be grouped); any other single "," or "." is the decimal mark (a "."
    before three digits is read as decimal and point_reading_note says so); a mark after
    thousands groups of another kind is the decimal mark.
    """
    sign = ""
    body = number_text
    if len(body) > 0 and (body[0] == "+" or body[0] == "-"):
        sign = body[0]
        body = body[1:]
    exponent = ""
    for k in range(len(body)):
        if body[k] == "e" or body[k] == "E":
            exponent = body[k:]
            body = body[0:k]
            break
    pieces = number_pieces(body)
    runs = pieces[0]
    separators = pieces[1]
    count = len(separators)
    if count == 0:
        return number_text
    malformed = ("“" + number_text + "” is not a number as written: group thousands by threes with one mark "
                 "(1,500,000, 1.500.000 or 1 500 000) and use one decimal mark (1500.5 or 1500,5)")
    last = separators[count - 1]
    grouping = separators[0]
    grouped = 0
    while grouped < count and separators[grouped] == grouping:
        grouped += 1
    if count == 1 and grouping != " ":
        # one mark: the decimal mark, unless it could be a thousands separator as well
        if grouping == "," and len(exponent) == 0 and leads_a_group(runs[0]) and len(runs[1]) == 3:
            raise CoreError(ambiguous_group_message(number_text, sign + runs[0], runs[1], grouping), field)
        return sign + runs[0] + "." + runs[1] + exponent
    if not leads_a_group(runs[0]) or grouped < count - 1:
        raise CoreError(malformed, field)
    if grouped == count:
        # every mark alike: all of them group thousands ("1,500,000", "1 500")
        if not all_three_digits(runs, 1, count + 1):
            raise CoreError(malformed, field)
        return sign + "".join(runs) + exponent
    # thousands groups, then the other mark as the decimal mark ("12,500.5", "1 500,5")
    if last == " " or not all_three_digits(runs, 1, count):
        raise CoreError(malformed, field)
    return sign + "".join(runs[0:count]) + "." + runs[count] + exponent


def parse_number(text, field):
    """Parse the leading number of ``text``; return [value, rest_of_text].

    Separators are read by grouped_number_text (thousands groups, decimal comma or point; a
    comma before exactly three digits is refused with both readings); a second separator right
    after the number and its spaces ("1. 5", "5 .5") is refused rather than guessed.
    """
    pieces = split_number(text)
    if pieces is None:
        raise CoreError("expected a number first, found “" + text + "”", field)
    number_text = pieces[0]
    rest = pieces[1]
    second = len(rest) >= 2 and (rest[0] == "." or rest[0] == ",") and is_digit(rest[1])
    if second:
        raise CoreError("“" + text + "” mixes a decimal comma and a decimal point, or has two separators; "
                        "write it as 1234.5 or 1234,5", field)
    plain = grouped_number_text(number_text, field)
    value = float(plain)
    if not (value - value == 0):
        raise CoreError("“" + number_text + "” is not a finite number", field)
    return [value, rest]


def point_reading_note(text, field):
    """A note when ``text`` starts with a number whose only mark is a "." before exactly three digits
    ("1.500 m", "9.346 mm"): read with a decimal point, which a reader of the thousands-point
    convention would read as 1500; "" otherwise. The calculators show it with the results."""
    pieces = split_number(normalise_text(text))
    if pieces is None:
        return ""
    number_text = pieces[0]
    if len(number_text) > 0 and (number_text[0] == "+" or number_text[0] == "-"):
        number_text = number_text[1:]
    if number_text.find("e") >= 0 or number_text.find("E") >= 0:
        return ""
    split = number_pieces(number_text)
    runs = split[0]
    if len(split[1]) != 1 or split[1][0] != "." or not leads_a_group(runs[0]) or len(runs[1]) != 3:
        return ""
    return (field + ": “" + number_text + "” is read with a decimal point as " + runs[0] + "."
            + without_trailing_zeros(runs[1]) + "; for " + runs[0] + runs[1] + " write " + runs[0] + runs[1])
# __pragma__ ('kwargs')
