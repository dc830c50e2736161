"""The AC/DC ratio a calculator shows for a size and an arrangement, with the method that gave it.

Round wire (or an area taken as round): the exact Kelvin-function solution (core.skin_effect).
Non-magnetic bars, bar groups and go-and-return bar pairs: the filament solver
(core.filament_solver); a single bar inside its grid of w/delta and t/delta reads the solver's
tabulated answers, interpolated (core.bar_ratio_lookup; 0.1 %; an answer the solver could not
settle keeps its "≈" and warning), else it is solved. A go-and-return pair of non-magnetic round
wires: the exact multipole solution (core.round_pair), with the proximity factor over the isolated
wire. Magnetic bars: the shell approximation, flagged as a lower estimate (the filament method
takes the field as in free space). Each answer adds the result "ac_method" (value: the filament
count of a solve made for this answer, 0 for a closed form or the tabulated grid; text: the method
in words). Clad wire (a core and a cladding on record, core.clad_layers): the exact two-layer
solution for round wire; bars refused.

Part of the AC part of the core (core.ac_part): the pages load it only when a calculator needs it.
``needs_live_solver`` says, before anything is solved, whether ``ac_ratio_for`` would run a live
solve (the filament solver, or the round pair's harmonic series: the answers that take longer than a
keystroke, tens to hundreds of ms on a tablet), so a page can wait for a pause in typing first.

Arrangement text (field "arrangement"): "" or "single"; "N bars, gap G" (N = 2..8 bars per
phase side by side, wide faces facing, G the clear gap); "pair, S" or "go-and-return S" (a
go-and-return pair at centre distance S: two bars with wide faces facing, or two round wires).
"""

from conductor_atlas.core.ac_part import provide
from conductor_atlas.core.bar_ratio_lookup import tabulated_bar_ratio
from conductor_atlas.core.clad_layers import clad_round_ratio
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import filament_solver as filaments
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.outcome import add_result, add_warning
from conductor_atlas.core.round_pair import round_pair_solution
from conductor_atlas.core.units import parse_quantity

ARRANGEMENT_HINT = ("single; 3 bars, gap 10 mm (bars per phase, wide faces facing); "
                    "pair, 30 mm (go-and-return bars or round wires at a centre distance)")
_DIGITS = "0123456789"
TABULATED_METHOD = ("filament solver, tabulated over w/δ and t/δ and interpolated (isolated bar; within 0.1 % of "
                    "a direct solve)")


# __pragma__ ('nokwargs')
def _after(text, word):
    # the text after the first occurrence of word, without separators
    at = text.find(word)
    rest = text[at + len(word):]
    while len(rest) > 0 and (rest[0] == "," or rest[0] == " " or rest[0] == ":" or rest[0] == "="):
        rest = rest[1:]
    return rest


def parse_arrangement(text, field):
    """["single"], ["bars", n, gap [m]] or ["pair", centre distance [m]] from the field's text.

    Raises CoreError naming ``field`` with what to type.
    """
    words = text.strip().lower()
    if len(words) == 0 or words == "single" or words == "1 bar" or words == "one bar":
        return ["single"]
    if words.find("pair") >= 0 or words.find("return") >= 0:
        rest = _after(words, "pair") if words.find("pair") >= 0 else _after(words, "return")
        if rest.find("at ") == 0:
            rest = rest[3:]
        if len(rest) == 0:
            raise CoreError("give the centre distance of the pair, e.g. pair, 30 mm", field)
        return ["pair", parse_quantity(rest, "length", field)]
    if words.find("bar") > 0:
        count_text = words[:words.find("bar")].strip()
        ok = len(count_text) > 0
        for c in count_text:
            if _DIGITS.find(c) < 0:
                ok = False
        if not ok:
            raise CoreError("start with the number of bars per phase, e.g. 3 bars, gap 10 mm", field)
        count = 0
        for c in count_text:
            count = count * 10 + _DIGITS.find(c)
        if count == 1:
            return ["single"]
        if count < 2 or count > 8:
            raise CoreError("from 2 to 8 bars per phase, e.g. 3 bars, gap 10 mm", field)
        if words.find("gap") < 0:
            raise CoreError("give the gap between the bars, e.g. " + str(count) + " bars, gap 10 mm", field)
        return ["bars", count, parse_quantity(_after(words, "gap"), "length", field)]
    raise CoreError("type single, '3 bars, gap 10 mm' or 'pair, 30 mm'", field)


def add_ratio_result(outcome, ratio):
    """The "ac_dc_ratio" result: 5 significant digits, unless a solution that did not settle to 0.1 %
    has put its own there (3 digits after "≈": _note_solution, _round_pair_ratio).

    >>> outcome = {"results": {}}
    >>> add_ratio_result(outcome, 1.198178)
    >>> outcome["results"]["ac_dc_ratio"]["text"]
    '1.1982'
    """
    if "ac_dc_ratio" in outcome["results"]:
        return
    add_result(outcome, "ac_dc_ratio", ratio, "", format_number(ratio, 5, True))


def _unsettled_ratio(outcome, ratio):
    # an answer not settled to 0.1 % is shown to 3 significant digits after "≈" (its warning says why)
    add_result(outcome, "ac_dc_ratio", ratio, "", "≈ " + format_number(ratio, 3))


def _note_solution(outcome, solution, what):
    n = solution["filaments"]
    add_result(outcome, "ac_method", n, "", "filament solver, " + str(n) + " filaments (" + what + ")")
    if not solution["converged"]:
        _unsettled_ratio(outcome, solution["ratio"])
    if solution["change"] >= 1.0:
        add_warning(outcome, "the filament solution could not be refined within the page's budget (" + str(n)
                    + " filaments, the conductor is many skin depths across): its accuracy is not established")
    elif not solution["converged"]:
        add_warning(outcome, "the filament solution did not settle to 0.1 % within " + str(n)
                    + " filaments (estimated change " + format_number(100.0 * solution["change"], 2)
                    + " %): the conductor is many skin depths across; read the AC/DC ratio to about that")


def _round_pair_ratio(outcome, radius, spacing, rho, f, mu_r):
    # a go-and-return pair of solid round wires: the exact multipole solution (core.round_pair)
    if mu_r > 1.5:
        raise CoreError("go-and-return pairs of magnetic wire are not computed (the pair's solution needs μr = 1); "
                        "type single for one wire alone", "arrangement")
    try:
        solution = round_pair_solution(radius, spacing, rho, f)
    except CoreError as problem:
        raise CoreError(problem.message, "arrangement")
    add_result(outcome, "ac_method", 0.0, "", "exact multipole solution (cylindrical harmonics, "
               + str(solution["harmonics"]) + " harmonics; go-and-return pair of round wires, per conductor)")
    add_result(outcome, "proximity_factor", solution["ratio"] / solution["isolated"], "",
               format_number(solution["ratio"] / solution["isolated"], 4)
               + " (the same wire alone: AC/DC " + format_number(solution["isolated"], 5, True) + ")")
    if not solution["converged"]:
        _unsettled_ratio(outcome, solution["ratio"])
        add_warning(outcome, "the pair's harmonic series did not settle within " + str(solution["harmonics"])
                    + " harmonics (the wires nearly touch): read the AC/DC ratio to about "
                    + format_number(100.0 * solution["change"], 2) + " %")
    return solution["ratio"]


def _finite_above(x, floor):
    return x - x == 0 and x > floor


def needs_live_solver(size, arrangement, rho, f, mu_r, clad):
    """True when ac_ratio_for(outcome, size, arrangement, rho, f, mu_r, layers) runs a live solve: the
    filament solver (bars, bar groups, go-and-return bar pairs) or the harmonic series of a
    go-and-return pair of round wires (core.round_pair: a dense system of up to 128 harmonics), each
    tens to hundreds of ms on a tablet; clad: a clad wire, whose layers are never meshed. False when
    it answers from a closed form or refuses the input. Reads no more than the arguments: cheap
    enough for every keystroke.

    size: core.geometry.parse_size's record; arrangement: parse_arrangement's list; rho [ohm*m];
    f [Hz]; mu_r [-]. Keep it in step with ac_ratio_for: tests/core/test_live_solver.py checks it
    against the solvers' calls over the differential cases.

    Examples
    --------
    >>> from conductor_atlas.core.geometry import parse_size
    >>> bar = parse_size("100 x 10 mm")
    >>> needs_live_solver(bar, ["single"], 1.7241e-8, 50.0, 1.0, False)  # read from the tabulated grid
    False
    >>> needs_live_solver(parse_size("10 x 10 mm"), ["single"], 1.7241e-8, 1e5, 1.0, False)  # 48 δ square
    True
    >>> needs_live_solver(bar, ["bars", 2, 0.01], 1.7241e-8, 50.0, 1.0, False)
    True
    >>> needs_live_solver(parse_size("d 20 mm"), ["single"], 1.7241e-8, 50.0, 1.0, False)
    False
    >>> needs_live_solver(parse_size("d 20 mm"), ["pair", 0.03], 1.7241e-8, 50.0, 1.0, False)
    True
    >>> needs_live_solver(bar, ["single"], 1.0e-7, 50.0, 200.0, False)  # magnetic: the shell approximation
    False
    >>> needs_live_solver(bar, ["pair", 0.005], 1.7241e-8, 50.0, 1.0, False)  # closer than the thickness: refused
    False
    """
    if clad or mu_r > 1.5 or not (_finite_above(rho, 0.0) and _finite_above(f, 0.0)):
        return False
    kind = arrangement[0]
    if size["shape"] != "bar":
        return kind == "pair" and _finite_above(size["diameter"], 0.0) and _finite_above(arrangement[1],
                                                                                       size["diameter"])
    if not (_finite_above(size["width"], 0.0) and _finite_above(size["thickness"], 0.0)):
        return False
    if kind == "bars":
        count = arrangement[1]
        return count >= 1 and count <= 8 and _finite_above(arrangement[2], 0.0)
    if kind == "pair":
        return _finite_above(arrangement[1], size["thickness"])
    return tabulated_bar_ratio(size["width"], size["thickness"], rho, f) is None


def ac_ratio_for(outcome, size, arrangement, rho, f, mu_r, layers):
    """R_ac / R_dc of one conductor (single, pair) or of the group (bars per phase), with its method.

    size: core.geometry.parse_size's record; arrangement: parse_arrangement's list; rho [ohm m];
    f [Hz]; mu_r [-]; layers: core.clad_layers.clad_layers_at's list for a clad wire, else None.
    Raises CoreError (field "arrangement") for a layout it cannot compute, (field "size") for a clad bar.
    """
    kind = arrangement[0]
    if layers is not None:
        if kind != "single":
            raise CoreError("groups and pairs of clad conductors are not computed: only a single round clad wire",
                            "arrangement")
        return clad_round_ratio(outcome, size, layers, f)
    if size["shape"] != "bar":
        if kind == "bars":
            raise CoreError("bars per phase are computed for bars (w x t); for round wire a single conductor "
                            "or a go-and-return pair (pair, 30 mm)", "arrangement")
        if size["shape"] == "area":
            add_warning(outcome, "a cross-section given as an area is treated as one solid round wire of that area; "
                                 "stranded and compacted conductors differ (IEC 60287-1-1 k_s)")
        if kind == "pair":
            return _round_pair_ratio(outcome, size["diameter"] / 2.0, arrangement[1], rho, f, mu_r)
        add_result(outcome, "ac_method", 0.0, "", "exact Kelvin-function solution (isolated round wire)")
        return skin.round_wire_resistance_ratio(size["diameter"] / 2.0, rho, f, mu_r)
    width = size["width"]
    thickness = size["thickness"]
    if mu_r > 1.5:
        if kind != "single":
            raise CoreError("groups and pairs of magnetic bars are not computed (the filament method needs μr = 1)",
                            "arrangement")
        add_result(outcome, "ac_method", 0.0, "", "shell approximation (magnetic bar; a lower estimate)")
        add_warning(outcome, "a magnetic bar's AC/DC ratio comes from the shell approximation, which ignores the "
                             "current crowding at edges and corners: read it as a lower estimate")
        return skin.rectangular_bar_resistance_ratio(width, thickness, rho, f, mu_r)
    if kind == "single":
        tabulated = tabulated_bar_ratio(width, thickness, rho, f)
        if tabulated is not None:
            add_result(outcome, "ac_method", 0.0, "", TABULATED_METHOD)
            if tabulated[1] >= filaments.TOLERANCE:
                _unsettled_ratio(outcome, tabulated[0])
                add_warning(outcome, "the tabulated filament solutions around this bar did not settle to 0.1 % within "
                            "the page's budget (estimated change up to " + format_number(100.0 * tabulated[1], 2)
                            + " %): the bar is many skin depths thick; read the AC/DC ratio to about that")
            return tabulated[0]
        solution = filaments.bar_group_solution(width, thickness, 1, 0.0, rho, f)
        _note_solution(outcome, solution, "isolated bar")
        return solution["ratio"]
    if kind == "bars":
        try:
            solution = filaments.bar_group_solution(width, thickness, arrangement[1], arrangement[2], rho, f)
        except CoreError as problem:
            raise CoreError(problem.message, "arrangement")
        _note_solution(outcome, solution, str(arrangement[1]) + " bars per phase")
        shares = []
        for s in solution["shares"]:
            shares.append(format_number(100.0 * s, 3) + " %")
        text = "each outer bar " + shares[0]
        if len(shares) > 1:
            text = text + ", innermost " + shares[len(shares) - 1]
        add_result(outcome, "bar_share", solution["shares"][0], "", text + " of the phase current (magnitudes)")
        return solution["ratio"]
    try:
        solution = filaments.bar_pair_solution(width, thickness, arrangement[1], rho, f)
    except CoreError as problem:
        raise CoreError(problem.message, "arrangement")
    _note_solution(outcome, solution, "go-and-return pair, per conductor")
    return solution["ratio"]


# __pragma__ ('kwargs')


provide("ac-ratio", ac_ratio_for)
provide("live-solver", needs_live_solver)
