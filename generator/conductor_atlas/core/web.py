"""Entry module for the transpiler: everything the browser calls is reachable from here."""

from conductor_atlas.core.calculators import calculate, CALCULATOR_FIELDS, FIELD_DEFAULTS
from conductor_atlas.core.numfmt import format_number, format_plain, format_si
from conductor_atlas.core.units import parse_quantity
from conductor_atlas.core.geometry import parse_size
