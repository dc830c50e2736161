"""The Celsius scale in kelvin: its zero, and 20 °C (the reference temperature of IACS and of most
conductor tables).

A module of its own, apart from core.constants, so the modules that only convert temperatures
(numfmt, units: the search bundle ships them) do not carry the CODATA constants to the browser.
Numbers only: no functions, no imports.
"""

# Zero of the Celsius scale, [K]. Exact by definition of the kelvin and the degree Celsius
# (not a CODATA constant; listed in the same CODATA tables of conversion factors).
ZERO_CELSIUS = 273.15
TWENTY_CELSIUS = ZERO_CELSIUS + 20.0  # [K] the reference temperature of IACS and of most conductor tables
