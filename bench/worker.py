"""One benchmark measurement in a fresh process, so no run sees another run's warm imports or caches.

    python bench/worker.py build --shipped DIR [--data DIR]... --out DIR
    python bench/worker.py floor --shipped DIR [--data DIR]... --out DIR

The build cache is wherever CONDUCTOR_ATLAS_CACHE points (the parent sets it). Prints one JSON
line: seconds (wall clock of the timed work only, after imports), its CPU seconds in this process
(cpu_s) and in its subprocesses (children_cpu_s: the Transcrypt run of a cold build), peak resident
memory of this process, and for
``build`` which cached parts had to be made again. ``floor`` times only rendering the pages with
the site's templates over views derived beforehand, plus writing those bytes to disk.
"""

from __future__ import annotations

import argparse
import json
import resource
import sys
import time
from pathlib import Path

import conductor_atlas.build as build_module
from conductor_atlas import __version__
from conductor_atlas.derive import derive
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import TEMPLATES_DIR
from conductor_atlas.render import Renderer


def peak_rss_mb() -> float:
    return resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024.0  # Linux reports KiB


def children_cpu() -> float:
    usage = resource.getrusage(resource.RUSAGE_CHILDREN)
    return usage.ru_utime + usage.ru_stime


def run_build(args) -> dict:
    build_module.DATA_DIR = Path(args.shipped)  # data_folders() reads this name at call time
    start, cpu, child = time.perf_counter(), time.process_time(), children_cpu()
    report = build_module.build(Path(args.out), [Path(d) for d in args.data])
    seconds = time.perf_counter() - start
    result = {"seconds": seconds, "cpu_s": time.process_time() - cpu, "children_cpu_s": children_cpu() - child,
              "materials": report.materials, "files": report.files,
              "bytes": report.bytes, "peak_rss_mb": peak_rss_mb()}
    try:
        from conductor_atlas import cache
    except ImportError:  # a checkout without the build cache
        return result
    result["remade"] = sorted(cache.LAST_STATS.get("made", []))
    result["reused"] = len(cache.LAST_STATS.get("reused", []))
    return result


def run_floor(args) -> dict:
    folders = [Path(args.shipped)] + [Path(d) for d in args.data]
    dataset = load_dataset(folders)
    views = derive(dataset)
    renderer = Renderer(TEMPLATES_DIR, __version__)
    out = Path(args.out)
    start, cpu = time.perf_counter(), time.process_time()
    files = renderer.render_site(dataset, views).files
    for rel in sorted(files):
        target = out / rel
        target.parent.mkdir(parents=True, exist_ok=True)
        target.write_bytes(files[rel])
    seconds = time.perf_counter() - start
    return {"seconds": seconds, "cpu_s": time.process_time() - cpu, "children_cpu_s": 0.0,
            "files": len(files), "peak_rss_mb": peak_rss_mb()}


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser()
    parser.add_argument("mode", choices=["build", "floor"])
    parser.add_argument("--shipped", required=True)
    parser.add_argument("--data", action="append", default=[])
    parser.add_argument("--out", required=True)
    args = parser.parse_args(argv)
    result = run_build(args) if args.mode == "build" else run_floor(args)
    print(json.dumps(result))
    return 0


if __name__ == "__main__":
    sys.exit(main())
