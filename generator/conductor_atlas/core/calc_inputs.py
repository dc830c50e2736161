"""Readers of a calculator's input fields: each turns the text typed in one field into SI floats (or a
material record) and, when it cannot, records errors[field] and returns None, so a calculator reads all
its fields and reports every problem at once (see core.outcome for the record they fill).
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import parse_size, size_reading_note
from conductor_atlas.core.lookup import find_material, trade_word_note
from conductor_atlas.core.outcome import add_error, add_material_used, add_warning
from conductor_atlas.core.typed_text import point_reading_note, portable_text
from conductor_atlas.core.units import parse_quantity


# __pragma__ ('nokwargs')
def field_text(inputs, field):
    """The text typed in ``field``, or "" when the field is absent or empty."""
    if field in inputs:
        value = inputs[field]
        if value is None:
            return ""
        return portable_text(str(value))
    return ""
# __pragma__ ('kwargs')


def read_quantity(outcome, inputs, field, kind, required, default_text=""):
    """Parse one field as a quantity of ``kind``; on failure record errors[field], return None.

    An empty optional field gives None with no error; an empty field with ``default_text``
    is read as that text.
    """
    text = field_text(inputs, field)
    if len(text) == 0:
        if len(default_text) > 0:
            text = default_text
        elif not required:
            return None
    try:
        value = parse_quantity(text, kind, field)
    except CoreError as problem:
        add_error(outcome, field, problem.message)
        return None
    note_point_reading(outcome, text, field)
    return value


# The last text note_point_reading read for each field and the note it gave: [text, note]. As
# units.LAST_PARSED: on a keystroke in one field the other fields' texts are the same as before, so
# their notes are not worked out again; one entry per field, so it never grows with use.
LAST_NOTE = {}


# __pragma__ ('nokwargs')
def note_point_reading(outcome, text, field):
    """Say so when ``text`` was read with a decimal point before three digits ("1.500 m" is 1.5 m,
    1500 m to a reader of the thousands-point convention): typed_text.point_reading_note."""
    if field in LAST_NOTE and LAST_NOTE[field][0] == text:
        note = LAST_NOTE[field][1]
    else:
        note = point_reading_note(text, field)
        LAST_NOTE[field] = [text, note]
    if len(note) > 0:
        add_warning(outcome, note)


def require_positive(outcome, field, value, what):
    """Record an error when a parsed value is not > 0; return True when it is fine."""
    if value is None:
        return False
    if not (value > 0):
        add_error(outcome, field, what + " must be greater than zero")
        return False
    return True


def read_temperature(outcome, inputs, field):
    """Conductor temperature [K]; 20 °C when the field is empty."""
    return read_temperature_or_empty(outcome, inputs, field, False, "20 °C")


def read_temperature_or_empty(outcome, inputs, field, required, default_text):
    """A temperature [K] above absolute zero from ``field``; an empty field as read_quantity reads it
    (``default_text``, else an error when ``required``, else None with no error)."""
    t = read_quantity(outcome, inputs, field, "temperature", required, default_text)
    if t is not None and not (t > 0):
        add_error(outcome, field, "must be above absolute zero (−273.15 °C)")
        return None
    return t


def read_size(outcome, inputs, field):
    """A conductor size (geometry.parse_size: area, gauge, diameter or bar) from ``field``, or None
    with errors[field] set."""
    text = field_text(inputs, field)
    try:
        size = parse_size(text, field)
    except CoreError as problem:
        add_error(outcome, field, problem.message)
        return None
    note_point_reading(outcome, text, field)
    note_size_reading(outcome, text, size, field)
    return size


# The last size text note_size_reading read for each field and the note it gave: [text, note] (as
# LAST_NOTE, speed only).
LAST_SIZE_NOTE = {}


def note_size_reading(outcome, text, size, field):
    """Say how a size was read when a reader could take it otherwise: geometry.size_reading_note
    ("10 ga" read as AWG, a cross-section beyond any conductor)."""
    if field in LAST_SIZE_NOTE and LAST_SIZE_NOTE[field][0] == text:
        note = LAST_SIZE_NOTE[field][1]
    else:
        note = size_reading_note(text, size, field)
        LAST_SIZE_NOTE[field] = [text, note]
    if len(note) > 0:
        add_warning(outcome, note)


def read_material(outcome, inputs, catalogue, field):
    """The material named in ``field`` (or None, with errors[field] set), named in outcome["used"]. Its
    sources are added by the steps that use its values (calc_common.material_resistivity and others)."""
    text = field_text(inputs, field)
    try:
        m = find_material(catalogue, text, field)
    except CoreError as problem:
        add_error(outcome, field, problem.message)
        return None
    add_material_used(outcome, m, trade_word_note(catalogue, text))
    return m
# __pragma__ ('kwargs')
