"""Entry module for the transpiler: every core module the browser needs is reached from here.

conductor_atlas.transpile ships exactly the core modules imported below, directly or through other core
modules (the calculators through the registry, core.calculators), and checks each was written. The AC part
(core.ac_part) is imported here explicitly: the resistance calculator does not import it in JS.
"""

from conductor_atlas.core.calculators import calculate, CALCULATORS
from conductor_atlas.core.carriers import relaxation_time
from conductor_atlas.core.size_effect import film_resistivity_ratio
from conductor_atlas.core.practice import resistance_method_temperature
from conductor_atlas.core.numfmt import format_number, format_plain, format_si
from conductor_atlas.core.outcome import new_outcome
from conductor_atlas.core.calc_inputs import read_material
from conductor_atlas.core.lookup import find_material
from conductor_atlas.core.material_models import resistivity_at
from conductor_atlas.core.units import parse_quantity
from conductor_atlas.core.geometry import parse_size
from conductor_atlas.core.resistance import resistivity_linear
from conductor_atlas.core.temperature_models import interpolate_table
from conductor_atlas.core.skin_effect import skin_depth
from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.search import search, search_entries
from conductor_atlas.core.search_format import INDEX_FORMAT
from conductor_atlas.core.search_prepare import prepare_index
from conductor_atlas.core.calc_resistance_ac import add_ac_results
from conductor_atlas.core.filament_solver import bar_group_solution, bar_pair_solution, round_layers_solution
