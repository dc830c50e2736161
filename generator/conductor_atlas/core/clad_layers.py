"""Clad wire (copper-clad steel, copper-clad aluminium) in the calculators: its two layers at a temperature.

A material record with layer_share > 0 (conductor_atlas.derive.layer_fields) carries the records of
its core and its cladding and the cladding's share of the cross-section by area. Each layer's ρ at
the conductor temperature comes from its own record's "auto" model (its reference value when no
model reaches that temperature, with a warning), its μr from its record. The AC/DC ratio of a
round clad wire is then the exact two-layer solution (core.layered_round); a clad bar is refused,
since an averaged ρ would be wrong at high frequency and no two-layer bar model is built.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.layered_round import core_radius_for_cladding_share, layered_round_resistance_ratio
from conductor_atlas.core.material_models import resistivity_or_none
from conductor_atlas.core.numfmt import format_number, temperature_text
from conductor_atlas.core.outcome import add_result, add_sources, add_warning

CLAD_BAR_MESSAGE = ("the AC/DC ratio of a clad wire is computed for round wire only (type a diameter such as d 1 mm, "
                    "an AWG size or an area): in a clad bar the current divides between copper and core in a way "
                    "not modelled here, and the averaged resistivity would be wrong at high frequency")


# __pragma__ ('nokwargs')
def is_clad(m):
    """True when material record m is a clad wire with a core and a cladding on record.

    Examples
    --------
    >>> is_clad({"layer_share": 0.4}), is_clad({"layer_share": 0.0})
    (True, False)
    """
    return m["layer_share"] > 0.0


def layer_resistivity(outcome, layer, t):
    """ρ [ohm*m] of one layer's record at t [K]: its "auto" model, or its reference value with a warning.

    Examples
    --------
    Copper by its linear model at 90 degC (IEC 60028 values, 2.1984e-8 ohm*m by hand); a steel record
    with only a value at 20 degC (illustrative) keeps that value, with a warning:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> out = new_outcome("skin-effect", {})
    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15, "valid_from": 223.15,
    ...           "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0, "mu_r": 1.0}
    >>> steel = {"name": "steel", "rho_ref": 1.5e-7, "alpha": 0.0, "t_ref": 293.15, "cvd_a": 0.0, "table_t": [],
    ...          "bg_theta": 0.0, "mt_t": [], "cl_t": [], "mu_r": 100.0}
    >>> round(layer_resistivity(out, copper, 363.15) * 1e8, 4), layer_resistivity(out, steel, 363.15)
    (2.1984, 1.5e-07)
    >>> len(out["warnings"])
    1
    """
    found = resistivity_or_none(layer, t)
    if found is None:
        add_warning(outcome, "no temperature model of " + layer["name"] + " reaches " + temperature_text(t)
                    + ": its layer is taken at its reference resistivity")
        return layer["rho_ref"]
    return found["rho"]


def clad_layers_at(outcome, m, t):
    """[ρ_core, μr_core, ρ_cladding, μr_cladding, cladding share, core name, cladding name] of the clad
    record m at t [K] (ρ in Ω·m, share by area), or None when m has no layers. Adds the layers' source.

    Examples
    --------
    >>> from conductor_atlas.core.outcome import new_outcome
    >>> out = new_outcome("skin-effect", {})
    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15, "valid_from": 223.15,
    ...           "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0, "mu_r": 1.0}
    >>> steel = {"name": "steel", "rho_ref": 1.5e-7, "alpha": 0.0, "t_ref": 293.15, "cvd_a": 0.0, "table_t": [],
    ...          "bg_theta": 0.0, "mt_t": [], "cl_t": [], "mu_r": 100.0}
    >>> ccs = {"layer_share": 0.4, "layer_core": steel, "layer_cladding": copper, "layer_source": "astm-b227"}
    >>> layers = clad_layers_at(out, ccs, 293.15)
    >>> layers[0], layers[1], layers[2], layers[4], layers[5], len(out["sources"]), out["sources"][0]
    (1.5e-07, 100.0, 1.7241e-08, 0.4, 'steel', 1, 'astm-b227')
    """
    if not is_clad(m):
        return None
    core = m["layer_core"]
    clad = m["layer_cladding"]
    add_sources(outcome, [m["layer_source"]])
    return [layer_resistivity(outcome, core, t), core["mu_r"], layer_resistivity(outcome, clad, t), clad["mu_r"],
            m["layer_share"], core["name"], clad["name"]]


def clad_round_ratio(outcome, size, layers, f):
    """R_ac / R_dc of a clad round wire of the size's diameter (an area is taken as round) by the exact
    two-layer solution, with the method as the result "ac_method". Raises CoreError (field "size") for a bar.

    Examples
    --------
    A 1 mm copper-clad steel wire (40 % copper by area, illustrative layers) at 1 MHz: the same number
    as layered_round_resistance_ratio with the core radius from the share, and the method named:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> out = new_outcome("skin-effect", {})
    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15, "valid_from": 223.15,
    ...           "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0, "mu_r": 1.0}
    >>> steel = {"name": "steel", "rho_ref": 1.5e-7, "alpha": 0.0, "t_ref": 293.15, "cvd_a": 0.0, "table_t": [],
    ...          "bg_theta": 0.0, "mt_t": [], "cl_t": [], "mu_r": 100.0}
    >>> layers = [1.5e-7, 100.0, 1.7241e-8, 1.0, 0.4, "steel", "copper"]
    >>> ratio = clad_round_ratio(out, {"shape": "round", "diameter": 1e-3}, layers, 1e6)
    >>> b = core_radius_for_cladding_share(0.5e-3, 0.4)
    >>> ratio == layered_round_resistance_ratio(b, 0.5e-3, 1.5e-7, 100.0, 1.7241e-8, 1.0, 1e6)
    True
    >>> out["results"]["ac_method"]["text"]
    'exact two-layer solution (round wire: steel core, copper cladding of 40 % of the area, 113 µm thick)'
    """
    if size["shape"] == "bar":
        raise CoreError(CLAD_BAR_MESSAGE, "size")
    a = size["diameter"] / 2.0
    b = core_radius_for_cladding_share(a, layers[4])
    ratio = layered_round_resistance_ratio(b, a, layers[0], layers[1], layers[2], layers[3], f)
    add_result(outcome, "ac_method", 0.0, "", "exact two-layer solution (round wire: " + layers[5] + " core, "
               + layers[6] + " cladding of " + format_number(100.0 * layers[4], 3) + " % of the area, "
               + format_number(1e6 * (a - b), 3) + " µm thick)")
    if layers[1] > 1.5:
        add_warning(outcome, "the core's relative permeability is taken as " + format_number(layers[1], 3)
                    + " (" + layers[5] + "); it depends on the field and saturates, which moves the AC resistance "
                      "wherever the current still reaches the core")
    return ratio
# __pragma__ ('kwargs')
