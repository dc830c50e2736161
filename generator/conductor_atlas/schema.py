"""What a material file may contain: its keys, each property's SI unit and plausible range.

Read by ``conductor_atlas.load``; documented for people in DEVELOPERS.md ("The material file").
"""

from __future__ import annotations

from dataclasses import dataclass

SCHEMA_VERSION = 1

CLASSES = {
    "pure-metal": "High-purity metals",
    "conductor-grade": "Conductor grades",
    "copper-alloy": "Copper alloys",
    "resistance-alloy": "Resistance and heating alloys",
    "steel": "Steels",
    "thin-film": "Thin-film metals",
    "sensor-metal": "Sensor metals",
}

TOP_LEVEL_KEYS = {"schema", "id", "name", "class", "aliases", "summary", "uses", "notes", "properties",
                  "resistivity_table", "temperature_base", "clad_layers", "layers"}
# [layers] of a clad round wire (its AC resistance): core and cladding are ids of other materials,
# cladding_share the cladding's fraction of the cross-section by area
# uses = ["busbars", ...]: what the trade makes of the material, words a user searches by (trade
# facts, common practice with no source): at most USES_MAX, each at most USE_LENGTH characters
USES_MAX = 12
USE_LENGTH = 60
LAYER_KEYS = {"core", "cladding", "cladding_share", "source", "locator", "note"}
RECORD_KEYS = {"value", "min", "max", "temperature", "valid_from", "valid_to", "source", "locator",
               "note"}
TABLE_KEYS = {"temperature_unit", "resistivity_unit", "source", "locator", "note", "points"}


@dataclass(frozen=True)
class PropertySpec:
    """A property's SI unit (as pint reads it), its label, the range a real conductor lies in, and how
    pages show it: ``shown`` = (factor from SI to the shown unit, the shown unit, significant digits).
    The property card, the search index's facts and the compare page's columns all read ``shown``."""

    unit: str
    label: str
    low: float
    high: float
    needs_temperature: bool = False
    shown: tuple = (1.0, "", 4)

    @property
    def shown_scale(self) -> float:
        return self.shown[0]

    @property
    def shown_unit(self) -> str:
        return self.shown[1]

    @property
    def digits(self) -> int:
        return self.shown[2]


# low/high are sanity limits (a typo check), not physics claims: a value outside is an error.
PROPERTIES = {
    "resistivity": PropertySpec("ohm * m", "resistivity", 1e-9, 1e-4, True,
                             shown=(1e8, "µΩ·cm", 5)),
    "conductivity_iacs": PropertySpec("percent", "conductivity (%IACS)", 0.1, 120.0, True,
                             shown=(1.0, "%IACS", 4)),
    "temperature_coefficient": PropertySpec("1 / K", "temperature coefficient of resistance",
                                            -1e-3, 1e-2, True,
                             shown=(1.0, "1/K", 4)),
    "density": PropertySpec("kg / m ** 3", "density", 100.0, 25000.0,
                             shown=(1e-3, "g/cm³", 4)),
    "molar_mass": PropertySpec("kg / mol", "molar mass", 1e-3, 0.3,
                             shown=(1e3, "g/mol", 7)),
    "valence": PropertySpec("dimensionless", "conduction electrons per atom", 0.1, 8.0,
                             shown=(1.0, "", 3)),
    "electron_density": PropertySpec("1 / m ** 3", "conduction-electron density", 1e27, 1e30,
                             shown=(1.0, "m⁻³", 3)),
    "debye_temperature": PropertySpec("K", "Debye temperature", 10.0, 2500.0,
                             shown=(1.0, "K", 4)),
    "melting_point": PropertySpec("K", "melting point", 200.0, 4000.0,
                             shown=(1.0, "K", 6)),
    "thermal_conductivity": PropertySpec("W / (m * K)", "thermal conductivity", 0.5, 5000.0, True,
                             shown=(1.0, "W/(m·K)", 4)),
    # specific heat capacity at constant pressure (the short-circuit calculator's heat balance)
    "specific_heat": PropertySpec("J / (kg * K)", "specific heat capacity", 50.0, 5000.0, True,
                             shown=(1.0, "J/(kg·K)", 4)),
    "relative_permeability": PropertySpec("dimensionless", "relative permeability", 0.9, 1e6,
                             shown=(1.0, "", 4)),
    "curie_temperature": PropertySpec("K", "Curie temperature", 100.0, 2000.0,
                             shown=(1.0, "K", 5)),
    "mean_free_path": PropertySpec("m", "electron mean free path", 1e-11, 1e-6, True,
                             shown=(1e9, "nm", 3)),
    # ρ·ℓ depends on the Fermi surface alone, not on temperature or dilute impurities: a conductor
    # grade without a mean free path of its own gets ℓ = ρ·ℓ / ρ (derive.calc_record)
    "rho_lambda": PropertySpec("ohm * m ** 2", "resistivity × mean free path (ρ·ℓ)", 1e-17, 1e-14,
                             shown=(1.0, "Ω·m²", 3)),
    "residual_resistivity_ratio": PropertySpec("dimensionless", "residual resistivity ratio",
                                               1.0, 1e6,
                             shown=(1.0, "", 4)),
    "tensile_strength": PropertySpec("Pa", "tensile strength", 1e6, 5e9,
                             shown=(1e-6, "MPa", 4)),
    "cvd_a": PropertySpec("1 / K", "Callendar–Van Dusen A", 1e-3, 1e-2,
                             shown=(1.0, "1/K", 5)),
    "cvd_b": PropertySpec("1 / K ** 2", "Callendar–Van Dusen B", -1e-5, 1e-5,
                             shown=(1.0, "1/K²", 4)),
    "cvd_c": PropertySpec("1 / K ** 4", "Callendar–Van Dusen C", -1e-10, 1e-10,
                             shown=(1.0, "1/K⁴", 4)),
}

# SI unit symbols shown on pages for each property
DISPLAY_UNITS = {
    "ohm * m": "Ω·m", "percent": "%", "1 / K": "1/K", "kg / m ** 3": "kg/m³", "kg / mol": "kg/mol",
    "dimensionless": "", "1 / m ** 3": "m⁻³", "K": "K", "W / (m * K)": "W/(m·K)", "J / (kg * K)": "J/(kg·K)", "m": "m",
    "Pa": "Pa", "1 / K ** 2": "1/K²", "1 / K ** 4": "1/K⁴",
}

MAX_FILE_BYTES = 1_000_000

# [resistivity_table] limits (typo checks, like PROPERTIES): published ρ(T) tables run from liquid
# helium (4.2 K) to beyond the melting point, and from about 1e-12 Ω·m (high-purity metals at a few
# kelvin) to 1e-4 Ω·m. A page shows every point, so a table holds at most MAX_TABLE_POINTS
# (the shipped tables have at most 18).
TABLE_TEMPERATURE_K = (1.0, 6000.0)
TABLE_RESISTIVITY_OHM_M = (1e-13, 1e-4)
MAX_TABLE_POINTS = 500

# a source's year of publication
YEARS = (1600, 2100)
