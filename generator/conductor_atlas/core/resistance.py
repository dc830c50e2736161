"""DC resistance of a conductor and what follows from it: the linear temperature model,
R = ρL/A, voltage drop, I²R loss, %IACS.
"""

from conductor_atlas.core.celsius import TWENTY_CELSIUS
from conductor_atlas.core.errors import CoreError

# IEC 60028:1925: standard annealed copper, 1/58 Ω·mm²/m at 20 °C, defines 100 %IACS.
IACS_RESISTIVITY = 1.0 / 58.0 * 1e-6  # [ohm*m] = 1.72414e-8
IACS_REFERENCE_TEMPERATURE = TWENTY_CELSIUS  # [K]


# __pragma__ ('nokwargs')
def resistivity_linear(temperature, rho_ref, alpha_ref, t_ref):
    """Resistivity from the linear temperature model around a reference temperature.

    ρ(T) = ρ_ref · [1 + α_ref · (T − T_ref)]

    temperature : float  Conductor temperature, [K]
    rho_ref : float      Resistivity at T_ref, [ohm*m]
    alpha_ref : float    Temperature coefficient of resistance at T_ref, [1/K]
    t_ref : float        Reference temperature, [K] (usually 293.15 K = 20 °C)

    Notes: the model is the trade's working form (IEC 60028 gives α = 0.00393 /K at 20 °C for
    annealed copper); for pure metals it holds to about 1 % from roughly −50 °C to +200 °C and
    fails at cryogenic temperatures, where ρ flattens towards its residual value.
    Example: annealed copper (IEC 60028: 1.7241e-8 ohm*m, α 0.00393 /K at 20 °C) at 90 °C,
    1.7241e-8 · (1 + 0.00393 · 70) = 2.1984e-8 ohm*m:
    
    >>> round(resistivity_linear(363.15, 1.7241e-8, 0.00393, 293.15) * 1e8, 4)
    2.1984
    """
    if not (temperature > 0):
        raise CoreError("temperature must be above absolute zero (0 K)", "temperature")
    rho = rho_ref * (1.0 + alpha_ref * (temperature - t_ref))
    if not (rho > 0):
        raise CoreError("the linear model gives a non-positive resistivity at this temperature; "
                        "it does not hold this far from the reference temperature", "temperature")
    return rho


def inferred_zero_temperature(alpha_ref, t_ref):
    """Temperature at which the linear model extrapolates to zero resistance, [K].

    T0 = T_ref − 1/α_ref   (for α = 0.00393 /K at 20 °C: T0 = −234.45 °C)
    
    >>> round(inferred_zero_temperature(0.00393, 293.15) - 273.15, 2)
    -234.45
    """
    return t_ref - 1.0 / alpha_ref


def resistance(rho, length_m, area):
    """DC resistance R = ρ L / A, [ohm].  rho [ohm*m], length_m [m], area [m^2].

    >>> round(resistance(1.7241e-8, 100.0, 2.5e-6), 4)   # 100 m of 2.5 mm² copper at 20 °C
    0.6896
    """
    return rho * length_m / area


def voltage_drop(resistance_ohm, current):
    """Voltage drop along the conductor, U = I R, [V].  resistance_ohm [ohm], current [A].

    >>> voltage_drop(0.5, 16.0)
    8.0
    """
    return current * resistance_ohm


def power_loss(resistance_ohm, current):
    """Joule (I²R) loss, P = I² R, [W].  resistance_ohm [ohm], current [A].

    >>> power_loss(0.5, 16.0)
    128.0
    """
    return current * current * resistance_ohm


def current_density(current, area):
    """Current density J = I / A, [A/m^2].  current [A], area [m^2].

    >>> round(current_density(16.0, 2.5e-6) / 1e6, 3)   # 16 A in 2.5 mm²: 6.4 A/mm²
    6.4
    """
    return current / area


def iacs_percent(rho):
    """Conductivity as a percentage of standard annealed copper (IEC 60028), [percent].

    %IACS = 100 · ρ_IACS / ρ with ρ_IACS = 1/58 µΩ·m; compare both at 20 °C.
    
    >>> round(iacs_percent(1.7241e-8), 2)
    100.0
    >>> round(iacs_percent(2.8264e-8), 1)   # aluminium 1350 (ASTM B230, 61 %IACS; from memory)
    61.0
    """
    return 100.0 * IACS_RESISTIVITY / rho


def resistivity_from_iacs(percent):
    """Resistivity at 20 °C from a %IACS figure, ρ = ρ_IACS · 100 / %IACS, [ohm*m].

    
    >>> round(resistivity_from_iacs(61.0) * 1e8, 4)   # [uohm*cm]
    2.8265
    """
    return IACS_RESISTIVITY * 100.0 / percent
# __pragma__ ('kwargs')
