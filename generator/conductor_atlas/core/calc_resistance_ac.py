"""The resistance calculator's AC results: skin depth, AC/DC ratio, AC resistance and I²R loss at AC.

Part of the AC part of the core (core.ac_part): a module of its own so that a material page loads it,
with core.ac_layout and the solvers, only when a frequency is typed. It registers
``add_ac_results`` as "resistance-ac" when imported; core.calc_resistance finds it there.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import resistance as dc
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.numfmt import format_number, format_si
from conductor_atlas.core.outcome import add_error, add_result, add_sources, add_warning
from conductor_atlas.core.calc_common import recorded_mean_free_path, warn_if_anomalous
from conductor_atlas.core.clad_layers import clad_layers_at, is_clad
from conductor_atlas.core.ac_layout import ac_ratio_for, add_ratio_result, needs_live_solver
from conductor_atlas.core.ac_part import provide


# __pragma__ ('nokwargs')
def ac_ratio(outcome, size, rho, f, mu_r, layers):
    """R_ac/R_dc [-] of one isolated conductor of the size's shape at f [Hz] with resistivity rho
    [ohm*m] and relative permeability mu_r [-], with its method in the outcome (core.ac_layout; layers:
    core.clad_layers.clad_layers_at's list for a clad wire, else None).

    Examples
    --------
    A solid round copper wire, d 20 mm at 50 Hz: the Kelvin ratio Re[(z/2) I0(z)/I1(z)],
    z = (1 + j) a/δ, δ = 9.3458 mm, is 1.0267257 with scipy.special.iv; d 2 mm at 100 kHz 2.6616588:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> from conductor_atlas.core.geometry import parse_size
    >>> outcome = new_outcome("example", {})
    >>> round(ac_ratio(outcome, parse_size("d 20 mm"), 1.7241e-8, 50.0, 1.0, None), 7)
    1.0267257
    >>> round(ac_ratio(outcome, parse_size("d 2 mm"), 1.7241e-8, 1e5, 1.0, None), 7)
    2.6616588
    >>> outcome["results"]["ac_method"]["text"]
    'exact Kelvin-function solution (isolated round wire)'
    """
    return ac_ratio_for(outcome, size, ["single"], rho, f, mu_r, layers)


def add_ac_results(outcome, m, t, rho, f, size, r, current):
    """Add skin depth, AC/DC ratio, AC resistance and (with a current) the I²R loss at AC for material
    record m at t [K], rho [ohm*m], f [Hz] (> 0), the parsed size, the DC resistance r [ohm] and the
    current [A] or None. Returns False when the frequency could not be taken (its message is under
    "frequency"; the DC results stand), else True.

    Examples
    --------
    A 2.5 mm² copper run of 0.1 Ω at 50 Hz: skin depth 9.3458 mm (sqrt(ρ / (π f μ0)) with
    scipy.constants.mu_0, by hand) and the Kelvin ratio of a 1.784 mm wire, 1.0000 to 5 digits:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> from conductor_atlas.core.geometry import parse_size
    >>> copper = {"name": "copper", "mu_r": 1.0, "mu_source": "", "layer_share": 0.0, "mean_free_path": 0.0,
    ...           "mean_free_path_t": 0.0, "mean_free_path_how": ""}
    >>> outcome = new_outcome("example", {})
    >>> add_ac_results(outcome, copper, 293.15, 1.7241e-8, 50.0, parse_size("2.5 mm2"), 0.1, None)
    True
    >>> outcome["results"]["skin_depth"]["text"], outcome["results"]["ac_dc_ratio"]["text"]
    ('9.346 mm', '1.0000')
    """
    if m["mu_r"] > 1.5:
        add_warning(outcome, "relative permeability of " + m["name"] + " is taken as " + format_number(m["mu_r"], 3)
                    + "; in iron, steel and nickel it depends strongly on field strength and frequency")
    layers = clad_layers_at(outcome, m, t)
    try:
        delta = skin.skin_depth(rho, f, m["mu_r"])
        where = ""
        if layers is not None:
            delta = skin.skin_depth(layers[2], f, layers[3])
            where = " in the " + layers[6] + " cladding"
        ratio = ac_ratio(outcome, size, rho, f, m["mu_r"], layers)
    except CoreError as problem:
        add_error(outcome, "frequency", problem.message)  # the DC results stand
        return False
    add_result(outcome, "skin_depth", delta, "m", format_si(delta, "m", 4) + where)
    if len(m["mu_source"]) > 0:
        add_sources(outcome, [m["mu_source"]])
    warn_if_anomalous(outcome, recorded_mean_free_path(m, rho, t)[0], delta)
    add_ratio_result(outcome, ratio)
    add_result(outcome, "resistance_ac", r * ratio, "Ω", format_si(r * ratio, "Ω", 4))
    if current is not None:
        p_ac = dc.power_loss(r * ratio, current)
        add_result(outcome, "power_loss_ac", p_ac, "W", format_si(p_ac, "W", 4))
    return True


def live_solver_for(m, t, rho, f, size):
    """True when add_ac_results with these arguments runs the live filament solver
    (core.ac_layout.needs_live_solver for one isolated conductor of material record m at t [K]).

    Examples
    --------
    >>> from conductor_atlas.core.geometry import parse_size
    >>> copper = {"name": "copper", "mu_r": 1.0, "layer_share": 0.0}
    >>> live_solver_for(copper, 293.15, 1.7241e-8, 1e5, parse_size("10 x 10 mm"))  # 48 δ square: solved
    True
    >>> live_solver_for(copper, 293.15, 1.7241e-8, 50.0, parse_size("100 x 10 mm"))  # the tabulated grid
    False
    >>> live_solver_for(copper, 293.15, 1.7241e-8, 50.0, parse_size("d 20 mm"))
    False
    """
    return needs_live_solver(size, ["single"], rho, f, m["mu_r"], is_clad(m))
# __pragma__ ('kwargs')


provide("resistance-ac", add_ac_results)
provide("resistance-live-solver", live_solver_for)
