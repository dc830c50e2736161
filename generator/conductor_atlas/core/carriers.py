"""Free-electron (Drude-Sommerfeld) carrier quantities of a metal.

From a density, molar mass and valence: the conduction-electron density; from it and a
resistivity: relaxation time, Fermi wavenumber, energy and velocity, mean free path, the
rho*lambda product that governs size effects, mobility, drift velocity, plasma frequency,
and the Wiedemann-Franz thermal conductivity.

Convention for the relaxation time: sigma = n e^2 tau / m, the Drude result in which the
time between collisions is exponentially distributed with mean tau (each electron has the
collision probability dt/tau in every interval dt). A derivation that assumes every electron
flies exactly tau between collisions gets sigma = n e^2 tau / (2 m), i.e. twice the
resistance for the same tau. The tool uses the standard form because it is what the
linearised Boltzmann equation gives in the relaxation-time approximation and what the
textbooks' tabulated tau are computed with (Ashcroft & Mermin eq. 1.6 and Table 1.3).

Pure Python in the Transcrypt subset; SI floats in and out; CoreError for impossible inputs.
"""

import math

from conductor_atlas.core.constants import (AVOGADRO, BOLTZMANN, ELECTRON_MASS,
                                            ELEMENTARY_CHARGE, EPSILON_0, HBAR)
from conductor_atlas.core.errors import check_positive

# Sommerfeld value of the Lorenz number, L0 = (pi^2 / 3) (k_B / e)^2 = 2.443e-8 [W*ohm/K^2]
# (Ashcroft & Mermin eq. 2.93; Kittel ISSP eq. 6.55).
LORENZ_SOMMERFELD = math.pi * math.pi / 3.0 * (BOLTZMANN / ELEMENTARY_CHARGE) ** 2


# __pragma__ ('nokwargs')
def electron_density(density, molar_mass, valence):
    """Conduction-electron density of a free-electron metal.

    n = Z rho_m N_A / A

    Parameters
    ----------
    density : float
        Mass density rho_m, [kg/m^3]
    molar_mass : float
        Molar mass A, [kg/mol]
    valence : float
        Conduction electrons per atom Z, [-]

    Returns
    -------
    n : float
        Electron density, [1/m^3]

    References
    ----------
    1. Ashcroft, N. W., Mermin, N. D., Solid State Physics, 1976, eq. 1.1 and Table 1.1.

    Examples
    --------
    Copper, 8960 kg/m^3, 63.546 g/mol, one electron per atom: 8.49e28 /m^3 against the 8.47e22 /cm^3
    of Ashcroft & Mermin Table 1.1 (from memory; 0.25 % apart, the book's room-temperature density):

    >>> '%.3g' % electron_density(8960.0, 63.546e-3, 1.0)
    '8.49e+28'
    """
    check_positive(density, "density", "density")
    check_positive(molar_mass, "molar_mass", "molar mass")
    check_positive(valence, "valence", "valence")
    return valence * density * AVOGADRO / molar_mass


def wigner_seitz_radius(n):
    """Radius of the sphere holding one conduction electron.

    r_s = (3 / (4 pi n))^(1/3)

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]

    Returns
    -------
    r_s : float
        Wigner-Seitz radius, [m] (Ashcroft & Mermin Table 1.1 prints r_s / a_0)

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 1.2.

    Examples
    --------
    Copper at 8.47e28 /m^3 over the Bohr radius (scipy.constants, 5.29177e-11 m): 2.67, as printed in
    Ashcroft & Mermin Table 1.1 (from memory):

    >>> round(wigner_seitz_radius(8.47e28) / 5.29177210903e-11, 2)
    2.67
    """
    check_positive(n, "n", "electron density")
    return (3.0 / (4.0 * math.pi * n)) ** (1.0 / 3.0)
# __pragma__ ('kwargs')


def relaxation_time(rho, n, m=ELECTRON_MASS):
    """Drude relaxation time from the resistivity.

    tau = m / (n e^2 rho)   (from sigma = n e^2 tau / m; see the module note on the factor 2)

    Parameters
    ----------
    rho : float
        Resistivity, [ohm*m]
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]; free-electron mass by default

    Returns
    -------
    tau : float
        Relaxation time, [s]

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 1.8 and Table 1.3.

    Examples
    --------
    Copper at 273 K (1.56e-8 ohm*m): 2.7e-14 s, as Ashcroft & Mermin Table 1.3 prints (from memory):

    >>> '%.2g' % relaxation_time(1.56e-8, 8.47e28)
    '2.7e-14'
    """
    check_positive(rho, "rho", "resistivity")
    check_positive(n, "n", "electron density")
    check_positive(m, "m", "mass")
    return m / (n * ELEMENTARY_CHARGE * ELEMENTARY_CHARGE * rho)


# __pragma__ ('nokwargs')
def fermi_wavenumber(n):
    """Fermi wavenumber of a free-electron gas, k_F = (3 pi^2 n)^(1/3), [1/m].

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 2.21 and Table 2.1.

    Examples
    --------
    Copper: 1.36e10 /m, Ashcroft & Mermin Table 2.1's 1.36e8 /cm (from memory):

    >>> '%.3g' % fermi_wavenumber(8.47e28)
    '1.36e+10'
    """
    check_positive(n, "n", "electron density")
    return (3.0 * math.pi * math.pi * n) ** (1.0 / 3.0)
# __pragma__ ('kwargs')


def fermi_energy(n, m=ELECTRON_MASS):
    """Fermi energy E_F = hbar^2 k_F^2 / (2 m), [J].

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 2.27 and Table 2.1.

    Examples
    --------
    Copper: 7.03 eV against Ashcroft & Mermin Table 2.1's 7.00 eV (from memory; the table rounds
    the constants):

    >>> round(fermi_energy(8.47e28) / 1.602176634e-19, 2)
    7.03
    """
    check_positive(m, "m", "mass")
    k = fermi_wavenumber(n)
    return HBAR * HBAR * k * k / (2.0 * m)


def fermi_temperature(n, m=ELECTRON_MASS):
    """Fermi temperature T_F = E_F / k_B, [K].

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 2.33 and Table 2.1.

    Examples
    --------
    Copper: 8.16e4 K, as Ashcroft & Mermin Table 2.1 prints (from memory):

    >>> '%.3g' % fermi_temperature(8.47e28)
    '8.16e+04'
    """
    return fermi_energy(n, m) / BOLTZMANN


def fermi_velocity(n, m=ELECTRON_MASS):
    """Fermi velocity v_F = hbar k_F / m, [m/s].

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 2.24 and Table 2.1.

    Examples
    --------
    Copper: 1.57e6 m/s, Ashcroft & Mermin Table 2.1's 1.57e8 cm/s (from memory):

    >>> '%.3g' % fermi_velocity(8.47e28)
    '1.57e+06'
    """
    check_positive(m, "m", "mass")
    return HBAR * fermi_wavenumber(n) / m


def mean_free_path(rho, n, m=ELECTRON_MASS):
    """Free-electron mean free path at the Fermi surface.

    l = v_F tau = hbar k_F / (n e^2 rho)

    Parameters
    ----------
    rho : float
        Resistivity, [ohm*m]
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]; cancels in l, kept for symmetry

    Returns
    -------
    l : float
        Mean free path, [m]

    Notes
    -----
    Free-electron estimate: for Cu at room temperature about 39 nm; Gall 2016 obtains
    39.9 nm from a first-principles Fermi surface. Real Fermi surfaces change rho*l by up to
    a factor of several for transition metals.

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 1.8 and 2.24.
    2. Gall, D., J. Appl. Phys. 119, 085101 (2016), doi:10.1063/1.4942216, Table I.

    Examples
    --------
    Copper at 20 degC (1.68e-8 ohm*m): 39 nm, as in the Notes (Gall 2016, Table I: 39.9 nm):

    >>> round(mean_free_path(1.68e-8, 8.47e28) * 1e9, 1)
    39.2
    """
    return fermi_velocity(n, m) * relaxation_time(rho, n, m)


# __pragma__ ('nokwargs')
def rho_lambda_product(n):
    """Product of resistivity and mean free path, independent of temperature and impurities.

    rho * l = hbar k_F / (n e^2) = hbar (3 pi^2)^(1/3) / (e^2 n^(2/3))

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]

    Returns
    -------
    rho_l : float
        Resistivity times mean free path, [ohm*m^2]

    Notes
    -----
    The free-electron mass cancels. This is the quantity size-effect models need: l = rho_l / rho.

    References
    ----------
    1. Gall, D., J. Appl. Phys. 119, 085101 (2016), doi:10.1063/1.4942216, eq. 1 and Table I.

    Examples
    --------
    Copper: 6.59e-16 ohm*m^2, against the 6.70e-16 that Gall 2016 (Table I) obtains from the real
    Fermi surface (from memory; 1.7 % apart):

    >>> '%.3g' % rho_lambda_product(8.47e28)
    '6.59e-16'
    """
    k = fermi_wavenumber(n)
    return HBAR * k / (n * ELEMENTARY_CHARGE * ELEMENTARY_CHARGE)
# __pragma__ ('kwargs')


def mobility(tau, m=ELECTRON_MASS):
    """Drift mobility mu = e tau / m, [m^2/(V*s)].

    Parameters
    ----------
    tau : float
        Relaxation time, [s]
    m : float, optional
        Electron (effective) mass, [kg]

    References
    ----------
    1. Ashcroft & Mermin 1976, ch. 1 (Hall effect), mu = e tau / m.

    Examples
    --------
    tau = 2.5e-14 s (copper near 20 degC): 44 cm^2/(V*s), close to the ~43 cm^2/(V*s) quoted
    for copper (from memory, no source):

    >>> round(mobility(2.5e-14) * 1e4, 1)
    44.0
    """
    check_positive(tau, "tau", "relaxation time")
    check_positive(m, "m", "mass")
    return ELEMENTARY_CHARGE * tau / m


# __pragma__ ('nokwargs')
def drift_velocity(J, n):
    """Mean drift velocity of the electrons at current density J.

    v_d = J / (n e)

    Parameters
    ----------
    J : float
        Current density, [A/m^2]
    n : float
        Electron density, [1/m^3]

    Returns
    -------
    v_d : float
        Drift speed, [m/s] (sign follows J)

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 1.4.

    Examples
    --------
    16 A in 2.5 mm^2 of copper: by hand 6.4e6 / (8.47e28 x 1.602e-19) = 0.47 mm/s:

    >>> round(drift_velocity(16.0 / 2.5e-6, 8.47e28) * 1e3, 2)
    0.47
    """
    check_positive(n, "n", "electron density")
    return J / (n * ELEMENTARY_CHARGE)
# __pragma__ ('kwargs')


def plasma_frequency(n, m=ELECTRON_MASS):
    """Free-electron plasma (angular) frequency.

    omega_p = sqrt(n e^2 / (epsilon_0 m))

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]

    Returns
    -------
    omega_p : float
        Plasma angular frequency, [rad/s]

    Notes
    -----
    Free electrons only; interband transitions move the observed edge (Cu, Ag, Au).

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 1.38 and 1.40.

    Examples
    --------
    Copper: hbar omega_p = 10.8 eV, the free-electron value quoted for copper, whose observed
    edge lies lower because of the d bands (Ashcroft & Mermin ch. 1, from memory):

    >>> round(plasma_frequency(8.47e28) * 1.054571817e-34 / 1.602176634e-19, 1)
    10.8
    """
    check_positive(n, "n", "electron density")
    check_positive(m, "m", "mass")
    return math.sqrt(n * ELEMENTARY_CHARGE * ELEMENTARY_CHARGE / (EPSILON_0 * m))


def plasma_frequency_hz(n, m=ELECTRON_MASS):
    """Free-electron plasma frequency nu_p = omega_p / (2 pi), [Hz].

    Parameters
    ----------
    n : float
        Electron density, [1/m^3]
    m : float, optional
        Electron (effective) mass, [kg]

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 1.40.

    Examples
    --------
    Copper: 2.6e15 Hz, a wavelength c / nu_p = 115 nm in the ultraviolet:

    >>> round(299792458.0 / plasma_frequency_hz(8.47e28) * 1e9)
    115
    """
    return plasma_frequency(n, m) / (2.0 * math.pi)


def wiedemann_franz_thermal_conductivity(rho, T, L=LORENZ_SOMMERFELD):
    """Electronic thermal conductivity from the Wiedemann-Franz law.

    kappa = L T / rho,  L0 = (pi^2 / 3) (k_B / e)^2 = 2.443e-8 W*ohm/K^2

    Parameters
    ----------
    rho : float
        Resistivity, [ohm*m]
    T : float
        Temperature, [K]
    L : float, optional
        Lorenz number, [W*ohm/K^2]; Sommerfeld value by default

    Returns
    -------
    kappa : float
        Thermal conductivity, [W/(m*K)]

    Notes
    -----
    Holds where elastic scattering dominates: near and above the Debye temperature and at
    the lowest temperatures; between, inelastic scattering lowers the measured ratio (Cu at
    100 K is far below L0). Lattice conduction is excluded, so alloys conduct more heat than
    this.

    References
    ----------
    1. Ashcroft & Mermin 1976, eq. 2.93 and Table 2.2.
    2. Kittel, C., Introduction to Solid State Physics, 8th ed., 2005, eq. 6.55.

    Examples
    --------
    Copper at 20 degC (1.68e-8 ohm*m): 426 W/(m*K) against the measured 401 (CRC Handbook, from
    memory): the law holds to about 6 % near room temperature:

    >>> round(wiedemann_franz_thermal_conductivity(1.68e-8, 293.15))
    426
    """
    check_positive(rho, "rho", "resistivity")
    check_positive(T, "T", "temperature")
    return L * T / rho
