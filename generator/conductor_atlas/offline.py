"""Build step for reading the site without a network: file:// scripts, the app manifest, sw.js.

``add_offline_files(files)`` takes the finished site (path -> bytes) and returns it with:

- ``static/<name>.classic.js`` for every ES-module script in static/ (see bundle.py): one classic
  script that also runs on a page opened from a file, where browsers refuse module scripts (a part,
  ``PARTS``: the AC part of the calculators, loaded by material pages when a frequency is typed, is
  linked to its base's script instead of carrying its modules again);
- ``site.webmanifest``: name, start page and icons, so a tablet can install the site;
- ``sw.js`` (from templates/sw.js.j2): a service worker that, on the first served visit, stores
  every other file of the site (but search-index.js, which only pages opened from files use) in one
  cache and then answers from it, network or not. Its cache
  name carries a hash of every file's path and bytes, so any change to the site is a new cache
  and the old one is deleted when the new worker takes over.

All URLs are relative, so the site may live under any sub-path. Pure: computes, writes nothing.
"""

from __future__ import annotations

import json
import re
import struct

import jinja2

from conductor_atlas import __version__
from conductor_atlas.bundle import bundle, load_graph
from conductor_atlas.cache import files_key
from conductor_atlas.atlas_errors import BuildError
from conductor_atlas.paths import TEMPLATES_DIR
from conductor_atlas.search_index_file import INDEX_SCRIPT_PATH

APP_NAME = "Conductor Atlas"
SHORT_NAME = "Atlas"
ICON_SVG = "icons/atlas.svg"          # under static/
ICON_SIZES = (32, 192, 512)           # PNGs at static/icons/atlas-<size>.png, rendered from the SVG (32: the tab icon)
THEME_COLOUR = "#9a4a1c"              # the icon's background, the site's accent
BACKGROUND_COLOUR = "#fbfaf7"         # style.css --paper
WORKER = "sw.js"
MANIFEST = "site.webmanifest"
MODULE_LINE = re.compile(rb"^(import|export)\b", re.MULTILINE)


def classic_name(path: str) -> str:
    return path[: -len(".js")] + ".classic.js"


# part script -> the base script whose page loads it later: the part's twin leaves out every module
# of the base's twin and links to the base's (bundle.py), the base's twin publishes its modules
PARTS = {"static/calc-ac.js": "static/calc-resistance.js"}


def classic_bundles(files: dict[str, bytes]) -> dict[str, bytes]:
    """A classic-script twin for every module script in static/ (module = has import/export lines);
    a part (``PARTS``) is linked to its base's twin."""
    entries = [p for p in sorted(files) if p.startswith("static/") and p.endswith(".js")
               and not p.endswith(".classic.js") and MODULE_LINE.search(files[p])]
    parsed: dict = {}  # each module parsed once for all bundles
    bases = {base for part, base in PARTS.items() if part in files}
    out = {}
    for p in entries:
        if p in PARTS:
            if PARTS[p] not in files:
                raise BuildError(f"{p} is a part of {PARTS[p]}, which is not a file of the site")
            linked = frozenset(load_graph(files, PARTS[p], parsed))
            out[classic_name(p)] = bundle(files, p, parsed, linked=linked)
        else:
            out[classic_name(p)] = bundle(files, p, parsed, publishes=p in bases)
    return out


def png_size(data: bytes, path: str) -> tuple[int, int]:
    if data[:8] != b"\x89PNG\r\n\x1a\n" or data[12:16] != b"IHDR":
        raise BuildError(f"{path} is not a PNG file")
    return struct.unpack(">II", data[16:24])


def manifest(files: dict[str, bytes]) -> bytes:
    """The web app manifest; every icon it lists must be in the site at the size it claims."""
    icons = [{"src": f"static/{ICON_SVG}", "sizes": "any", "type": "image/svg+xml", "purpose": "any"}]
    for size in ICON_SIZES:
        path = f"static/icons/atlas-{size}.png"
        if path not in files:
            raise BuildError(f"{path} is missing (render it with `.venv/bin/python -m tests.support.icons`)")
        if png_size(files[path], path) != (size, size):
            raise BuildError(f"{path} is {png_size(files[path], path)} pixels, the manifest says {size}x{size}")
        icons.append({"src": path, "sizes": f"{size}x{size}", "type": "image/png", "purpose": "any"})
        # the drawing keeps inside the central 80 % circle, so the same PNG also serves icon masks
        icons.append({"src": path, "sizes": f"{size}x{size}", "type": "image/png", "purpose": "maskable"})
    if f"static/{ICON_SVG}" not in files:
        raise BuildError(f"static/{ICON_SVG} is missing")
    data = {
        "name": APP_NAME,
        "short_name": SHORT_NAME,
        "description": "A sourced reference of electrical conductor materials, with tables and calculators "
                       "that work offline.",
        "id": "./",
        "start_url": "./index.html",
        "scope": "./",
        "display": "standalone",
        "background_color": BACKGROUND_COLOUR,
        "theme_color": THEME_COLOUR,
        "icons": icons,
    }
    return (json.dumps(data, ensure_ascii=False, indent=1) + "\n").encode("utf-8")


def cache_version(files: dict[str, bytes]) -> str:
    """A hash of every path and its bytes: equal sites share it, any change gives a new one."""
    return files_key(files).hex()[:16]


def edition(version: str) -> str:
    """What the pages call this build once it is stored: the generator's version and the first eight
    characters of the cache version (equal sites, equal edition; any change, a new one)."""
    return f"{__version__}-{version[:8]}"


def precache_list(files: dict[str, bytes]) -> list[str]:
    """Every file of the site, as URLs relative to sw.js (the site root), but the worker itself and
    search-index.js (served pages fetch search-index.json; the script is for pages opened from files)."""
    return sorted(p for p in files if p != WORKER and p != INDEX_SCRIPT_PATH)


def service_worker(files: dict[str, bytes]) -> bytes:
    env = jinja2.Environment(loader=jinja2.FileSystemLoader(str(TEMPLATES_DIR)), autoescape=False,
                             undefined=jinja2.StrictUndefined, keep_trailing_newline=True)
    version = cache_version(files)
    text = env.get_template("sw.js.j2").render(version=version, edition=edition(version),
                                               files_json=json.dumps(precache_list(files), indent=0))
    return text.encode("utf-8")


def scripts_of(files: dict[str, bytes]) -> dict[str, bytes]:
    """The files classic_bundles reads: the scripts in static/ and the transpiled modules in js/
    (the bundles depend on nothing else; search-index.js, which follows the data, is not one)."""
    return {p: data for p, data in files.items() if p.endswith(".js") and (p.startswith("static/")
                                                                        or p.startswith("js/"))}


def add_offline_files(files: dict[str, bytes], bundles: dict[str, bytes] | None = None) -> dict[str, bytes]:
    """The site plus its classic scripts, manifest and service worker (the worker last: it lists all).

    ``bundles``: ``classic_bundles(scripts_of(files))`` when the caller has it already (the build
    keeps it in its cache, keyed by the scripts' bytes)."""
    for name in (WORKER, MANIFEST):
        if name in files:
            raise BuildError(f"{name} is made by the offline step; another stage also wrote it")
    out = dict(files)
    out.update(classic_bundles(scripts_of(files)) if bundles is None else bundles)
    out[MANIFEST] = manifest(out)
    out[WORKER] = service_worker(out)
    return out
