"""The validated data set: immutable records with every quantity as an SI float.

Produced by ``conductor_atlas.load``; read by every later stage. Nothing here parses or writes.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path
from types import MappingProxyType
from typing import Mapping


@dataclass(frozen=True)
class Source:
    """One bibliography entry of data/sources.toml."""

    key: str
    kind: str
    title: str
    authors: str = ""
    publisher: str = ""
    edition: str = ""
    year: int | None = None
    number: str = ""
    doi: str = ""
    note: str = ""

    def citation(self) -> str:
        """The entry as one line of text: authors, title, number, publisher, edition, year, DOI."""
        parts = [p for p in (self.authors, self.title, self.number, self.publisher) if p]
        if self.edition:
            parts.append(f"{self.edition} ed.")
        if self.year:
            parts.append(str(self.year))
        # a part that ends in a full stop ("10th ed.", "et al.") is not given a second one
        text = "".join(p if i == len(parts) - 1 else (p + " " if p.endswith(".") else p + ". ")
                       for i, p in enumerate(parts))
        if self.doi:
            text += f". doi:{self.doi}"
        return text


@dataclass(frozen=True)
class Value:
    """One sourced property value, converted to SI.

    ``si`` is the value in ``unit`` (the SI unit of the property); ``temperature`` is the
    condition in K (or None); ``low``/``high`` the range where the source gives one.
    """

    name: str
    si: float
    unit: str
    text: str
    source: str
    locator: str
    note: str = ""
    temperature: float | None = None
    low: float | None = None
    high: float | None = None
    valid_from: float | None = None
    valid_to: float | None = None

    @property
    def from_memory(self) -> bool:
        return "from memory" in self.note.lower()


@dataclass(frozen=True)
class ResistivityTable:
    """Sourced ρ(T) points: temperatures [K] and resistivities [Ω·m], T strictly increasing."""

    temperatures: tuple[float, ...]
    resistivities: tuple[float, ...]
    source: str
    locator: str
    note: str = ""

    @property
    def from_memory(self) -> bool:
        return "from memory" in self.note.lower()


@dataclass(frozen=True)
class Layers:
    """A clad round wire's construction: a core and a cladding, each another material of the data set,
    and the cladding's share of the cross-section by area (0 < share < 1), with its source."""

    core_id: str
    cladding_id: str
    cladding_share: float
    source: str
    locator: str
    note: str = ""
    # the two materials themselves, attached once every file is loaded
    core: "Material | None" = None
    cladding: "Material | None" = None


@dataclass(frozen=True)
class Material:
    """One conductor material, as validated from its TOML file."""

    id: str
    name: str
    klass: str
    aliases: tuple[str, ...]
    summary: str
    notes: str
    properties: Mapping[str, Value]
    table: ResistivityTable | None
    path: Path
    # a dilute alloy with no temperature model of its own takes ρ(T) − ρ(20 °C) from its base metal
    # (Matthiessen's rule): the base's id as written, and the base itself once every file is loaded
    temperature_base_id: str = ""
    temperature_base: "Material | None" = None
    # a clad wire takes ρ(T) from its layers conducting in parallel: the ids of [outer layer, core] as
    # written, and the layers themselves once every file is loaded
    clad_layer_ids: tuple[str, ...] = ()
    clad_layers: "tuple[Material, ...]" = ()
    # (alias, source key, locator) for the aliases that are designations of a standard
    alias_sources: tuple[tuple[str, str, str], ...] = ()
    # a clad wire (copper-clad steel or aluminium): its core and cladding ([layers] in the file)
    layers: Layers | None = None
    # what the trade uses it for (the file's `uses`): shown on its page and searched
    uses: tuple[str, ...] = ()

    def get(self, name: str) -> Value | None:
        return self.properties.get(name)

    def shown_uses(self) -> list[str]:
        """The uses as the page lists them: a spelling kept for search only ("bus bars" beside
        "busbars", the same letters without spaces or hyphens) is shown once."""
        seen: set[str] = set()
        shown = []
        for use in self.uses:
            key = "".join(ch for ch in use.lower() if ch.isalnum())
            if key not in seen:
                seen.add(key)
                shown.append(use)
        return shown

    def resistivity_source_keys(self) -> list[str]:
        """The sources of ρ and its temperature dependence (reference value, coefficient, table)."""
        keys = {v.source for name, v in self.properties.items()
                if name in ("resistivity", "conductivity_iacs", "temperature_coefficient")}
        if self.table is not None:
            keys.add(self.table.source)
        return sorted(keys)

    def source_keys(self) -> list[str]:
        keys = {v.source for v in self.properties.values()}
        if self.table is not None:
            keys.add(self.table.source)
        if self.temperature_base is not None:
            keys.update(self.temperature_base.source_keys())
        for layer in self.clad_layers:
            keys.update(layer.resistivity_source_keys())
        keys.update(source for _, source, _ in self.alias_sources)
        if self.layers is not None:
            keys.add(self.layers.source)
        return sorted(keys)


@dataclass(frozen=True)
class DataSet:
    """All materials (sorted by id) and the bibliography (key -> Source)."""

    materials: tuple[Material, ...]
    sources: Mapping[str, Source] = field(default_factory=lambda: MappingProxyType({}))
    # conductor-standard tables (conductor_atlas.standards.LimitTable), from each folder's standards/
    limits: tuple = ()
    # conductor_atlas.verification.Record of the shipped data folder, attached by the build
    # (None: none read; every value is then shown unverified)
    verification: object = None
    # conductor_atlas.edition.Edition of the data folders and the previous edition's values
    # (conductor_atlas.edition.Previous), attached by the build; None: not known
    edition: object = None
    previous: object = None

    def by_id(self, material_id: str) -> Material:
        for m in self.materials:
            if m.id == material_id:
                return m
        raise KeyError(material_id)
