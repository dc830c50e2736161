"""The command line: ``conductor-atlas build | check | serve``.

User mistakes (bad data, a busy output folder, a bad option) print one clear message per
problem and exit 1, with no traceback.
"""

from __future__ import annotations

import argparse
import os
import sys
import time
from pathlib import Path

from conductor_atlas import __version__
from conductor_atlas.build_stamp import BuildInputs
from conductor_atlas.calc_cli import add_calc_parser, run_calc
from conductor_atlas.atlas_errors import AtlasError, DataError


def build_parser(command: str | None = None) -> argparse.ArgumentParser:
    """The parser; for a ``command`` other than calc, without the calculators' options (which import
    the core)."""
    parser = argparse.ArgumentParser(prog="conductor-atlas",
                                     description="Build the Conductor Atlas reference site from sourced data.")
    parser.add_argument("--version", action="version", version=f"conductor-atlas {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")
    sub.required = True

    p_build = sub.add_parser("build", help="validate the data and build the site")
    p_build.add_argument("--data", action="append", type=Path, default=[], metavar="DIR",
                         help="an extra folder of material files (repeatable)")
    p_build.add_argument("--out", type=Path, default=Path("site"), metavar="DIR",
                         help="output folder (default: site)")

    p_check = sub.add_parser("check", help="validate the data only")
    p_check.add_argument("--data", action="append", type=Path, default=[], metavar="DIR",
                         help="an extra folder of material files (repeatable)")

    p_serve = sub.add_parser("serve", help="serve the built site (http://127.0.0.1:8000 unless told otherwise)")
    p_serve.add_argument("--dir", type=Path, default=Path("site"), metavar="DIR", help="site folder (default: site)")
    p_serve.add_argument("--port", type=int, default=8000, help="port (default: 8000)")
    p_serve.add_argument("--host", default="127.0.0.1", metavar="ADDRESS",
                         help="address to listen on (default: 127.0.0.1, this machine only; "
                              "0.0.0.0: every network this machine is on)")
    p_serve.add_argument("--cert", type=Path, metavar="FILE",
                         help="serve https with this PEM certificate (offline use on other devices needs https)")
    p_serve.add_argument("--key", type=Path, metavar="FILE",
                         help="the certificate's PEM private key (unless the --cert file holds it)")
    p_new = sub.add_parser("new-material", help="write a commented template for a new material file")
    p_new.add_argument("id", help="the new material's id, e.g. shop-bronze-7")
    p_new.add_argument("--dir", type=Path, default=Path("my-materials"), metavar="DIR",
                       help="folder to write it in (default: my-materials); build with --data DIR")
    p_new.add_argument("--class", dest="klass", default="copper-alloy", help="material class (default: copper-alloy)")

    add_calc_parser(sub, with_calculators=command in (None, "calc"))
    return parser


def cmd_build(args: argparse.Namespace) -> int:
    # Decide "nothing changed" from file stats before importing what a build needs (numpy, pint,
    # jinja2, markdown: most of a no-change build's time); see build_stamp.py.
    started = time.perf_counter()
    inputs = BuildInputs(args.out, args.data)
    previous = inputs.previous_build()
    if previous is not None:
        print(f"Up to date: {previous['materials']} materials in {inputs.out} ({previous['files']} files, "
              f"{previous['bytes'] / 1024:.0f} KiB); no data, template, code or option changed since the last "
              f"build (checked in {time.perf_counter() - started:.2f} s)")
        return 0
    from conductor_atlas.build import build
    report = build(args.out, args.data, inputs)
    same = "" if report.written else "; the folder already held this site, nothing was rewritten"
    print(f"Built {report.materials} materials into {report.out} "
          f"({report.files} files, {report.bytes / 1024:.0f} KiB) in {report.seconds:.2f} s{same}")
    return 0


def cmd_check(args: argparse.Namespace) -> int:
    from conductor_atlas.build import data_folders, load_with_record
    from conductor_atlas.verification import summary_text
    dataset = load_with_record(data_folders(args.data))
    values = sum(len(m.properties) for m in dataset.materials)
    print(f"Data OK: {len(dataset.materials)} materials, {values} values, {len(dataset.sources)} sources")
    print()
    print("How far each value is proven (per material; a ρ(T) table counts as one value):")
    print(summary_text(dataset, dataset.verification))
    return 0


def cmd_serve(args: argparse.Namespace) -> int:
    from conductor_atlas.serve import serve
    serve(args.dir, args.port, args.host, args.cert, args.key)
    return 0


def cmd_new_material(args: argparse.Namespace) -> int:
    from conductor_atlas.new_material import write_template
    path = write_template(args.id, args.dir, args.klass)
    print(f"Wrote {path}. Fill in the values and sources, then: conductor-atlas check --data {args.dir}")
    return 0


COMMANDS = {"new-material": cmd_new_material, "build": cmd_build, "check": cmd_check, "serve": cmd_serve, "calc": run_calc}


def main(argv: list[str] | None = None) -> int:
    given = sys.argv[1:] if argv is None else argv
    command = next((a for a in given if not a.startswith("-")), None)
    args = build_parser(command).parse_args(argv)
    try:
        code = COMMANDS[args.command](args)
        sys.stdout.flush()  # a closed pipe shows here, inside the try, not at interpreter exit
        return code
    except BrokenPipeError:
        # the reader went away (`calc ... | head`): stop quietly, as other command-line tools do;
        # stdout goes to devnull so the interpreter's final flush cannot raise again
        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
        return 1
    except DataError as exc:
        for line in exc.problems:
            print(f"conductor-atlas: {line}", file=sys.stderr)
        print(f"conductor-atlas: {len(exc.problems)} problem(s) found; nothing was built", file=sys.stderr)
        return 1
    except AtlasError as exc:
        print(f"conductor-atlas: error: {exc}", file=sys.stderr)
        return 1
    except OSError as exc:  # last resort: a file-system refusal not met where it happens
        print(f"conductor-atlas: error: {exc.filename or ''}: {exc.strerror or exc}", file=sys.stderr)
        return 1
    except KeyboardInterrupt:
        return 130


if __name__ == "__main__":
    sys.exit(main())
