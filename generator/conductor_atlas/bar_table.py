"""The material pages' table of AC/DC ratios of single flat bars, solved by the core's filament solver.

Every cell is ``core.filament_solver.bar_group_solution(w, t, 1, 0, ρ(20 °C), f)``: the same call, the
same budget and the same 0.1 % settling rule as the skin-effect calculator with that bar size. The
calculator reads most single bars from that solver's answers tabulated over w/δ and t/δ (bar_grid.py,
core.bar_ratio_lookup), so the table and the calculator agree within 0.1 % (measured 1.3e-4 at most
over the shipped cells: tests/test_bar_grid.py), and to the last digit where the calculator solves. A solve takes CPython 0.05 s to 11 s (a wide 10 mm bar
at 400 Hz: bench/filament_speed.py), about 35 s for one material's 36 cells, so:

- the table is made only for the classes bars are made of (``BAR_CLASSES``), non-magnetic (μr = 1: the
  filament method takes the field as in free space) and not clad (a clad bar is refused by the
  calculator);
- solutions are kept in ``bar_ratios.json`` beside this module, keyed by the exact (w, t, ρ, f) and
  stamped with a digest of the solver's code (``SOLVER_FILES``; comments and docstrings do not count). A stored solution is used only
  while the digest matches; anything else (an edited ρ, your own material, a changed solver) is solved
  in the build. ``python -m conductor_atlas.bar_table --write`` solves the shipped set again and
  rewrites the file; tests/test_bar_table.py fails while the file is stale.

The ratio depends on the material only through δ = √(ρ/(π f μ0)), i.e. through f/ρ; no two shipped
grades share a ρ, so there is nothing to share between them beyond the exact key. No interpolation.
"""

from __future__ import annotations

import argparse
import functools
import hashlib
import io
import json
import sys
import tokenize
from pathlib import Path

from conductor_atlas.core import filament_solver
from conductor_atlas.core.celsius import TWENTY_CELSIUS
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.numfmt import format_fixed, format_number
from conductor_atlas.derived_table import Column, Row, Table

CORE_DIR = Path(filament_solver.__file__).parent
STORE = Path(__file__).with_name("bar_ratios.json")
# the files whose code decides a solution (driver, mesh, matrix, inductances, linear solve, skin depth, μ0)
SOLVER_FILES = ("filament_solver.py", "filament_mesh.py", "filament_matrix.py", "filament_inductance.py",
                "complex_linear.py", "skin_effect.py", "constants.py")
# Flat bar sizes, width x thickness [mm], from 20 x 5 to 200 x 10: sizes copper and aluminium busbar
# is commonly stocked in (common practice (no source)).
BAR_SIZES_MM = ((20, 5), (30, 5), (40, 5), (50, 5), (40, 10), (50, 10), (60, 10), (80, 10), (100, 10),
                (120, 10), (160, 10), (200, 10))
BAR_FREQUENCIES = (50.0, 60.0, 400.0)  # power frequencies and aircraft/ground-power 400 Hz
# the classes busbars are made of: copper and aluminium conductor grades and copper alloys
BAR_CLASSES = ("conductor-grade", "copper-alloy")


def code_tokens(source: str) -> list[tuple[int, str]]:
    """The (type, text) tokens of Python source that make its code: comments, blank lines and strings
    that stand alone as a statement (docstrings) are left out, so editing those keeps the digest."""
    tokens = [t for t in tokenize.generate_tokens(io.StringIO(source).readline)
              if t.type not in (tokenize.COMMENT, tokenize.NL)]
    kept = []
    statement_start = True
    skip_newline = False
    for i, token in enumerate(tokens):
        alone = (token.type == tokenize.STRING and statement_start and i + 1 < len(tokens)
                 and tokens[i + 1].type in (tokenize.NEWLINE, tokenize.ENDMARKER))
        if alone:
            skip_newline = True  # the statement's end goes with it
            continue
        if not (skip_newline and token.type == tokenize.NEWLINE):
            kept.append((token.type, token.string))
        skip_newline = False
        statement_start = token.type in (tokenize.NEWLINE, tokenize.INDENT, tokenize.DEDENT)
    return kept


def solver_digest() -> str:
    """SHA-256 of the code tokens of SOLVER_FILES (code_tokens: a comment or docstring edit keeps it)."""
    digest = hashlib.sha256()
    for name in SOLVER_FILES:
        source = (CORE_DIR / name).read_text(encoding="utf-8")
        digest.update(name.encode() + b"\0" + repr(code_tokens(source)).encode() + b"\0")
    return digest.hexdigest()


def solution_key(width: float, thickness: float, rho: float, f: float) -> str:
    """The exact inputs as text (repr round-trips a float): no two different solves share a key."""
    return f"{width!r}|{thickness!r}|{rho!r}|{f!r}"


@functools.lru_cache(maxsize=1)
def stored_solutions() -> dict:
    """{key: [ratio, filaments, level, change, converged]} from bar_ratios.json when it was made by the
    solver as it is now; {} otherwise (missing, unreadable or stale)."""
    try:
        stored = json.loads(STORE.read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return {}
    if not isinstance(stored, dict) or stored.get("solver_digest") != solver_digest():
        # said once per process, so a build that turns slow says why (about 6 CPU minutes for the shipped set)
        print(f"conductor-atlas: note: {STORE.name} was made by another version of the filament solver, so the "
              "flat-bar tables are solved in this build (minutes); store them again with: python -m "
              "conductor_atlas.bar_table --write", file=sys.stderr)
        return {}
    return stored.get("solutions", {})


@functools.lru_cache(maxsize=None)
def bar_solution(width: float, thickness: float, rho: float, f: float) -> tuple:
    """(ratio, filaments, level, change, converged) of a single isolated bar; stored or solved now."""
    found = stored_solutions().get(solution_key(width, thickness, rho, f))
    if found is not None:
        return tuple(found)
    s = filament_solver.bar_group_solution(width, thickness, 1, 0.0, rho, f)
    return (s["ratio"], s["filaments"], s["level"], s["change"], bool(s["converged"]))


def gets_bar_table(m, record: dict) -> bool:
    """Conductor grades and copper alloys, non-magnetic and not clad."""
    return (m.klass in BAR_CLASSES and record["mu_r"] <= 1.5 and record["layer_share"] <= 0
            and len(record["cl_t"]) == 0)


def bar_cells(rho: float) -> list[tuple]:
    """[(row id, label, w [m], t [m], [solution per frequency])] for every size at ρ [Ω·m]."""
    rows = []
    for w_mm, t_mm in BAR_SIZES_MM:
        w, t = w_mm / 1000.0, t_mm / 1000.0
        rows.append((f"bar-{w_mm}x{t_mm}mm", f"{w_mm} × {t_mm} mm", w, t,
                     [bar_solution(w, t, rho, f) for f in BAR_FREQUENCIES]))
    return rows


def frequency_label(f: float) -> str:
    return f"{format_number(f, 3)} Hz"


BAR_TABLE_SCOPE = ("Only conductor grades and copper alloys (the materials bars are made of) that are non-magnetic "
                   "and not clad get this table; for a magnetic material the filament method does not hold, a clad "
                   "bar is not computed, and for any other bar use the skin-effect calculator with the size")


def no_bar_table_reason(m, record: dict) -> str:
    """Why a material gets no bar table, for the note of its round-wire AC/DC table ("" when it gets one)."""
    if gets_bar_table(m, record):
        return ""
    if record["layer_share"] > 0 or len(record["cl_t"]) > 0:
        return "No table of flat bars: a clad bar is not computed (the skin-effect calculator refuses it)"
    if record["mu_r"] > 1.5:
        return ("No table of flat bars: the filament solver needs μr = 1; the skin-effect calculator gives a magnetic "
                "bar's shell approximation, flagged as a lower estimate")
    return ("Flat bars: the table of single-bar AC/DC ratios is given for conductor grades and copper alloys only (the "
            "materials bars are made of); for a bar of this material use the skin-effect calculator with its size, "
            "e.g. 100 x 10 mm")


def bar_ratio_table(m, record: dict, rho_at) -> Table | None:
    """The table of single-bar AC/DC ratios at 20 °C, or None when the material does not get one.

    rho_at(record, T) -> (ρ, model) or None: the material's ρ at T (material_tables.quiet_rho)."""
    if not gets_bar_table(m, record):
        return None
    found = rho_at(record, TWENTY_CELSIUS)
    if found is None:
        return None
    rho = found[0]
    try:
        cells = bar_cells(rho)
    except CoreError:
        return None  # a conductor hundreds of skin depths across: the solver refuses, so no table
    columns = [Column("size", "Bar (width × thickness)", "", numeric=False), Column("width", "Width", "mm"),
               Column("thickness", "Thickness", "mm")]
    columns += [Column(f"ratio_{int(f)}hz", f"R_ac/R_dc at {frequency_label(f)}", "") for f in BAR_FREQUENCIES]
    columns += [Column(f"filaments_{int(f)}hz", f"Filaments at {frequency_label(f)}", "") for f in BAR_FREQUENCIES]
    rows, unsettled = [], []
    for row_id, label, w, t, solutions in cells:
        ratios = [s[0] for s in solutions]
        counts = [float(s[1]) for s in solutions]
        texts = []
        for f, s in zip(BAR_FREQUENCIES, solutions):
            if s[3] < filament_solver.TOLERANCE:
                texts.append(format_number(s[0], 4, True))
            else:
                texts.append("≈" + format_number(s[0], 4, True))
                unsettled.append(f"{label} at {frequency_label(f)} ({format_fixed(100.0 * s[3], 3)} %)")
        rows.append(Row(row_id, (label, w * 1e3, t * 1e3, *ratios, *counts),
                        (label, format_number(w * 1e3, 4), format_number(t * 1e3, 4), *texts,
                         *[format_number(c, 4) for c in counts])))
    notes = [BAR_TABLE_SCOPE]
    if unsettled:
        notes.append("Marked ≈: the solver's budget (the page's: at most "
                     f"{filament_solver.MAX_FILAMENTS * 4} filaments) ended before the ratio settled to 0.1 %; the "
                     "estimated change of the last step is given: " + ", ".join(unsettled))
    if record["rho_low_ratio"] > 0:
        notes.append("The recorded range of ρ is not run through this table; the skin-effect calculator with the "
                     "same bar shows the ratio at both ends of it")
    return Table(
        id="bar-ac-dc-ratio", title="AC/DC resistance ratio of single flat bars (20 °C)",
        model=("2-D filament solver: each bar cut into rectangular filaments of uniform "
               "current, graded toward the surfaces, with exact partial inductances (Grover's geometric mean "
               "distances), refined until the ratio settles to 0.1 % (Richardson extrapolation between two "
               f"levels); ρ(20 °C) = {format_number(rho * 1e8, 5)} µΩ·cm, μr = 1; R_dc = ρ/(w·t)"),
        validity=("One straight, isolated bar far from other conductors (no proximity effect; bars of a phase side by "
                  "side or a return conductor nearby raise the ratio: skin-effect calculator, arrangement field); "
                  "edges square, solid bar; at 20 °C (a hotter bar has a larger ρ and a smaller ratio)"),
        sources=tuple(record["sources"]) + ("weeks-1979",),
        columns=tuple(columns), rows=tuple(rows), note=". ".join(notes))


def shipped_keys() -> list[tuple[float, float, float, float]]:
    """Every (w, t, ρ, f) the shipped data set's bar tables solve."""
    from conductor_atlas.derive import bloch_gruneisen, calc_record, linear_model
    from conductor_atlas.load import load_dataset
    from conductor_atlas.material_tables import quiet_rho
    from conductor_atlas.paths import DATA_DIR
    keys = set()
    for m in load_dataset([DATA_DIR]).materials:
        record = calc_record(m, linear_model(m), bloch_gruneisen(m))
        found = quiet_rho(record, TWENTY_CELSIUS)
        if not gets_bar_table(m, record) or found is None:
            continue
        for w_mm, t_mm in BAR_SIZES_MM:
            for f in BAR_FREQUENCIES:
                keys.add((w_mm / 1000.0, t_mm / 1000.0, found[0], f))
    return sorted(keys)


def write_store() -> int:
    solutions = {}
    for w, t, rho, f in shipped_keys():
        s = filament_solver.bar_group_solution(w, t, 1, 0.0, rho, f)
        solutions[solution_key(w, t, rho, f)] = [s["ratio"], s["filaments"], s["level"], s["change"],
                                                 bool(s["converged"])]
    payload = {"about": "Filament-solver solutions of the material pages' bar tables (conductor_atlas.bar_table); "
                        "made by python -m conductor_atlas.bar_table --write",
               "solver_digest": solver_digest(), "solutions": dict(sorted(solutions.items()))}
    STORE.write_text(json.dumps(payload, indent=0, sort_keys=False) + "\n", encoding="utf-8")
    print(f"wrote {len(solutions)} solutions to {STORE}")
    return 0


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Solve the shipped bar tables again and store them.")
    parser.add_argument("--write", action="store_true", help="rewrite bar_ratios.json")
    args = parser.parse_args(argv)
    if not args.write:
        parser.print_help()
        return 2
    return write_store()


if __name__ == "__main__":
    sys.exit(main())
