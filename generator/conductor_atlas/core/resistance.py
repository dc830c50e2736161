"""DC resistance of a conductor and what follows from it: the linear temperature model,
R = ρL/A, voltage drop, I²R loss, %IACS.
"""

from conductor_atlas.core.errors import CoreError

# IEC 60028:1925: standard annealed copper, 1/58 Ω·mm²/m at 20 °C, defines 100 %IACS.
IACS_RESISTIVITY = 1.0 / 58.0 * 1e-6  # [Ω·m] = 1.72414e-8
IACS_REFERENCE_TEMPERATURE = 293.15  # [K]


def resistivity_linear(temperature, rho_ref, alpha_ref, t_ref):
    """Resistivity from the linear temperature model around a reference temperature.

    ρ(T) = ρ_ref · [1 + α_ref · (T − T_ref)]

    temperature : float  Conductor temperature, [K]
    rho_ref : float      Resistivity at T_ref, [Ω·m]
    alpha_ref : float    Temperature coefficient of resistance at T_ref, [1/K]
    t_ref : float        Reference temperature, [K] (usually 293.15 K = 20 °C)

    Notes: the model is the trade's working form (IEC 60028 gives α = 0.00393 /K at 20 °C for
    annealed copper); for pure metals it holds to about 1 % from roughly −50 °C to +200 °C and
    fails at cryogenic temperatures, where ρ flattens towards its residual value.
    Example: copper at 90 °C: 1.7241e-8 · (1 + 0.00393 · 70) = 2.1984e-8 Ω·m.
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
    """
    return t_ref - 1.0 / alpha_ref


def resistance(rho, length_m, area):
    """DC resistance R = ρ L / A, [Ω].  rho [Ω·m], length_m [m], area [m²]."""
    return rho * length_m / area


def voltage_drop(resistance_ohm, current):
    """Voltage drop along the conductor, U = I R, [V].  resistance_ohm [Ω], current [A]."""
    return current * resistance_ohm


def power_loss(resistance_ohm, current):
    """Joule (I²R) loss, P = I² R, [W].  resistance_ohm [Ω], current [A]."""
    return current * current * resistance_ohm


def current_density(current, area):
    """Current density J = I / A, [A/m²].  current [A], area [m²]."""
    return current / area


def iacs_percent(rho):
    """Conductivity as a percentage of standard annealed copper (IEC 60028), [%].

    %IACS = 100 · ρ_IACS / ρ with ρ_IACS = 1/58 µΩ·m; compare both at 20 °C.
    """
    return 100.0 * IACS_RESISTIVITY / rho


def resistivity_from_iacs(percent):
    """Resistivity at 20 °C from a %IACS figure, ρ = ρ_IACS · 100 / %IACS, [Ω·m]."""
    return IACS_RESISTIVITY * 100.0 / percent
