"""Physical constants used by the core, in SI units.

Values are the CODATA 2018 recommended values (E. Tiesinga, P. J. Mohr, D. B. Newell,
B. N. Taylor, "CODATA recommended values of the fundamental physical constants: 2018",
Rev. Mod. Phys. 93, 025010 (2021), doi:10.1103/RevModPhys.93.025010). Since the 2019
SI redefinition e, h, k_B and N_A are exact; mu_0, epsilon_0 and m_e are measured.

This module may hold numbers only: no functions, no imports beyond ``math``.
"""

import math

# Elementary charge e, [C]. CODATA 2018, exact.
ELEMENTARY_CHARGE = 1.602176634e-19

# Planck constant h, [J*s]. CODATA 2018, exact.
PLANCK = 6.62607015e-34

# Reduced Planck constant hbar = h / (2 pi), [J*s]. CODATA 2018 (exact, since h is);
# 1.054571817...e-34 as printed.
HBAR = PLANCK / (2.0 * math.pi)

# Boltzmann constant k_B, [J/K]. CODATA 2018, exact.
BOLTZMANN = 1.380649e-23

# Avogadro constant N_A, [1/mol]. CODATA 2018, exact.
AVOGADRO = 6.02214076e23

# Electron mass m_e, [kg]. CODATA 2018 recommended value (relative uncertainty 3.0e-10).
ELECTRON_MASS = 9.1093837015e-31

# Vacuum magnetic permeability mu_0, [N/A^2] = [H/m]. CODATA 2018 recommended value
# (relative uncertainty 1.5e-10); no longer exactly 4 pi 1e-7.
MU_0 = 1.25663706212e-6

# Speed of light in vacuum c, [m/s]. CODATA 2018, exact.
SPEED_OF_LIGHT = 299792458.0

# Vacuum electric permittivity epsilon_0 = 1 / (mu_0 c^2), [F/m]. CODATA 2018
# recommended value 8.8541878128e-12 as printed; computed here from mu_0 and c,
# which is how CODATA defines it.
EPSILON_0 = 1.0 / (MU_0 * SPEED_OF_LIGHT * SPEED_OF_LIGHT)

# Electron volt, [J]. CODATA 2018, exact (equal to e in joules per volt).
ELECTRON_VOLT = 1.602176634e-19

# Bohr radius a_0, [m]. CODATA 2018 recommended value 5.29177210903e-11.
BOHR_RADIUS = 5.29177210903e-11
