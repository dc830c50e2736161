"""Page model: the property card of a material page (one row per recorded property, in its display
unit from ``schema.PROPERTIES``, with condition, source, locator, note and how far it is proven),
and the citation text of a material's sources.
"""

from __future__ import annotations

from dataclasses import dataclass

from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.numfmt import format_fixed, format_number
from conductor_atlas.derive import MaterialView
from conductor_atlas.model import Value
from conductor_atlas.schema import PROPERTIES


def condition_text(t: float | None) -> str:
    if t is None:
        return ""
    return f"at {format_fixed(t - ZERO_CELSIUS, 0)} °C" if abs((t - ZERO_CELSIUS) - round(t - ZERO_CELSIUS)) < 1e-9 \
        else f"at {format_fixed(t, 2)} K"


@dataclass(frozen=True)
class CardRow:
    id: str
    label: str
    value: str
    unit: str
    condition: str
    source: str
    locator: str
    note: str
    status: str = ""        # how far the value is proven (conductor_atlas.verification)
    status_kind: str = ""


MEMORY_PHRASE = "from memory of the cited table"


def note_beside(status_kind: str, note: str) -> str:
    """A verified value's note without "from memory of the cited table" (the status says more)."""
    if status_kind != "verified" or MEMORY_PHRASE not in note:
        return note
    rest = note.replace(MEMORY_PHRASE, "").strip(" ;,")
    return rest[:1].upper() + rest[1:] if rest else ""


def card_rows(view: MaterialView, statuses: dict | None = None) -> list[CardRow]:
    statuses = statuses or {}
    rows = []
    for name in PROPERTIES:
        value: Value | None = view.material.get(name)
        if value is None:
            continue
        scale, unit, sig = PROPERTIES[name].shown_scale, PROPERTIES[name].shown_unit, PROPERTIES[name].digits
        text = format_number(value.si * scale, sig)
        if value.low is not None and value.high is not None:
            text = f"{text} ({format_number(value.low * scale, sig)} – {format_number(value.high * scale, sig)})"
        status = statuses.get(name)
        kind = status.kind if status else ""
        rows.append(CardRow(id=f"prop-{name.replace('_', '-')}", label=PROPERTIES[name].label[:1].upper() + PROPERTIES[name].label[1:], value=text,
                            unit=unit, condition=condition_text(value.temperature), source=value.source,
                            locator=value.locator, note=note_beside(kind, value.note),
                            status=status.text if status else "", status_kind=kind))
    return rows


def source_with_locators(source, m) -> str:
    """"[key] citation; locator(s) used for this material" for a table's citation text."""
    locators = sorted({v.locator for v in m.properties.values() if v.source == source.key and v.locator})
    if m.table is not None and m.table.source == source.key and m.table.locator:
        locators = sorted(set(locators) | {m.table.locator})
    text = f"[{source.key}] {source.citation()}"
    return text + (" (" + "; ".join(locators) + ")" if locators else "")
