"""The offline build step: classic bundles, the manifest and the service worker's cache list/version.

The bundle is checked against the real module graph in node: the same calls through the ES modules
(node's own loader) and through the classic bundle (node's vm, as a plain script) must agree exactly.
"""

from __future__ import annotations

import json
import subprocess

import pytest

from conductor_atlas.bundle import bundle, parse_module
from conductor_atlas.atlas_errors import BuildError
from conductor_atlas.offline import (ICON_SIZES, MANIFEST, WORKER, add_offline_files, cache_version,
                                     png_size, precache_list)
from tests.support.node_core import TO_PY_JS, node_available


def js(text: str) -> bytes:
    return text.encode("utf-8")


# ---- bundle.py: the linkage lines it understands, and the ones it refuses with file:line

def test_parse_reads_transcrypt_linkage_forms():
    module = parse_module("js/a.js", "\n".join([
        "import {x, y as z} from './b.js';",
        "import * as ns from '../c.js';",
        "export var v = 1;",
        "export function f () {}",
        "export class K {}",
        "export {z as w};",
    ]))
    assert module.imports == [("js/b.js", [("x", "x"), ("y", "z")]), ("c.js", "ns")]
    assert module.exports == {"v": "v", "f": "f", "K": "K", "w": "z"}
    assert module.body[2:5] == ["var v = 1;", "function f () {}", "class K {}"]


@pytest.mark.parametrize("line, words", [
    ("export default 3;", "import/export form the classic bundler does not know"),
    ("import {a,", "import/export form the classic bundler does not know"),
    ("  import x from './x.js';", "import/export form the classic bundler does not know"),
    ("const m = import('./x.js');", "dynamic import() or import.meta"),
    ("var __ca_bundle_x = 1;", "reserves"),
])
def test_parse_refuses_what_it_cannot_link(line, words):
    with pytest.raises(BuildError) as info:
        parse_module("js/odd.js", "var ok = 1;\n" + line)
    assert words in str(info.value)
    if "reserves" not in words:
        assert "js/odd.js:2" in str(info.value)


def test_missing_module_and_missing_name_are_named():
    with pytest.raises(BuildError, match=r"js/gone\.js is imported but is not a file of the site"):
        bundle({"e.js": js("import {a} from './js/gone.js';")}, "e.js")
    with pytest.raises(BuildError, match=r"imports 'b' from a\.js, which does not export it"):
        bundle({"e.js": js("import {b} from './a.js';"), "a.js": js("export var a = 1;")}, "e.js")


def test_named_import_closing_a_cycle_is_refused():
    files = {"a.js": js("import {b} from './b.js';\nexport var a = 1;"),
             "b.js": js("import {a} from './a.js';\nexport var b = 2;")}
    with pytest.raises(BuildError, match="closes an import cycle"):
        bundle(files, "a.js")


def run_classic(source: bytes) -> object:
    """Run a classic script in node's vm; the script leaves its answer in globalThis.answer."""
    program = ("const vm = require('vm'); const code = require('fs').readFileSync(0, 'utf8');"
               "vm.runInThisContext(code); process.stdout.write(JSON.stringify(globalThis.answer));")
    done = subprocess.run(["node", "-e", program], input=source, capture_output=True, check=True)
    return json.loads(done.stdout)


def run_modules(files: dict[str, bytes], entry: str, tmp_path) -> object:
    for path, data in files.items():
        (tmp_path / path).parent.mkdir(parents=True, exist_ok=True)
        (tmp_path / path).write_bytes(data)
    (tmp_path / "package.json").write_text('{"type": "module"}')
    program = f"await import('./{entry}'); process.stdout.write(JSON.stringify(globalThis.answer));"
    (tmp_path / "run.mjs").write_text(program)
    done = subprocess.run(["node", str(tmp_path / "run.mjs")], capture_output=True, check=True)
    return json.loads(done.stdout)


needs_node = pytest.mark.skipif(not node_available(), reason="node is not installed")


@needs_node
def test_evaluation_order_and_live_namespace_match_es_modules(tmp_path):
    # a <-> b through `import * as` (a cycle), c imported twice, evaluation order recorded
    files = {
        "e.js": js("import {log} from './log.js';\nimport * as a from './a.js';\nimport {c} from './c.js';\n"
                   "log.push('e'); globalThis.answer = {log, late: a.late(), c, keys: Object.keys(a)};"),
        "log.js": js("export var log = [];"),
        "a.js": js("import {log} from './log.js';\nimport * as b from './b.js';\nexport var x = 1;\n"
                   "export function late () { return b.seen; }\nlog.push('a');"),
        "b.js": js("import {log} from './log.js';\nimport * as a from './a.js';\nimport {c} from './c.js';\n"
                   "export var seen = [typeof a.x, typeof a.late, Object.keys(a).join()];\nlog.push('b');"),
        "c.js": js("import {log} from './log.js';\nexport var c = 3;\nlog.push('c');"),
    }
    expected = run_modules(files, "e.js", tmp_path)
    assert expected["log"] == ["c", "b", "a", "e"]           # what node's own loader does
    assert run_classic(bundle(files, "e.js")) == expected


@needs_node
def test_unused_named_imports_are_left_out_and_used_ones_kept(tmp_path):
    # "gone" is imported but never mentioned; "kept" is used under another local name; "said" only in a string
    files = {
        "e.js": js("import {gone, kept as mine, said} from './m.js';\n"
                   "globalThis.answer = [mine, 'said'];"),
        "m.js": js("export var gone = 1;\nexport var kept = 2;\nexport var said = 3;"),
    }
    script = bundle(files, "e.js").decode("utf-8")
    linkage = [line for line in script.split("\n") if line.startswith("const {")]
    assert linkage == ["const {kept: mine, said} = __ca_bundle_ns[0];"]  # m.js runs first
    assert run_classic(script.encode("utf-8")) == run_modules(files, "e.js", tmp_path) == [2, "said"]


CLASSIC_RUNNER = r"""
const calls = globalThis.calls, modules = globalThis.coreModules, dict = modules.__runtime__.dict;
""" + TO_PY_JS + r"""
globalThis.answer = calls.map((call) => {
  try {
    const result = modules[call.module][call.function](...call.args.map(toPy));
    return {ok: JSON.parse(JSON.stringify(result, replacer))};
  } catch (e) {
    return {error: e && typeof e.__str__ === 'function' ? e.__str__() : 'JS ' + (e && e.message)};
  }
});
"""


@needs_node
def test_core_bundle_agrees_with_the_modules_on_every_differential_case(node_core, transpiled_files):
    """The shipped core, bundled, against node's own ES-module loader on the differential cases."""
    from tests.support.differential_cases import all_cases
    from tests.support.node_core import encode
    shipped = {p[len("js/"):-len(".js")] for p in transpiled_files}
    # a case for a module that is not shipped is test_differential's finding, not this test's
    calls = [{"module": m, "function": f, "args": encode(a)} for m, f, a in all_cases() if m in shipped]
    names = sorted({c["module"] for c in calls} | {"conductor_atlas.core.calc_resistance_ac"})  # the AC part
    lines = [f"import * as m{i} from './js/{name}.js';" for i, name in enumerate(names)]
    lines.append("import * as rt from './js/org.transcrypt.__runtime__.js';")
    table = ", ".join(f"{json.dumps(name)}: m{i}" for i, name in enumerate(names))
    lines.append(f"globalThis.coreModules = {{{table}, __runtime__: rt}};")
    files = dict(transpiled_files)
    files["entry.js"] = js("\n".join(lines) + "\n")
    script = b"globalThis.calls = " + json.dumps(calls).encode() + b";\n" + bundle(files, "entry.js") \
        + CLASSIC_RUNNER.encode()
    through_bundle = run_classic(script)
    through_modules = node_core.call_many(calls)
    assert len(through_bundle) == len(calls) > 1000
    assert sum("ok" in r for r in through_bundle) > 0.5 * len(calls)
    differing = [(c["module"], c["function"]) for c, a, b in zip(calls, through_bundle, through_modules)
                 if (a.get("ok"), a.get("error")) != (b.get("ok"), b.get("error"))]
    assert differing == [], f"{len(differing)} calls differ, first {differing[:5]}"


# ---- offline.py

def small_site(**changes: bytes) -> dict[str, bytes]:
    from conductor_atlas.paths import STATIC_DIR
    files = {"index.html": b"<!doctype html><title>x</title>", "static/app.js": b"export var a = 1;\n",
             "static/plain.js": b"console.log(1);\n"}
    for rel in ["icons/atlas.svg"] + [f"icons/atlas-{s}.png" for s in ICON_SIZES]:
        files[f"static/{rel}"] = (STATIC_DIR / rel).read_bytes()
    files.update(changes)
    return files


def test_worker_lists_every_file_and_only_those():
    out = add_offline_files(small_site())
    listed = json.loads(out[WORKER].decode().split("const FILES = ", 1)[1].split(";\n", 1)[0])
    assert listed == sorted(p for p in out if p != WORKER)
    assert "static/app.classic.js" in listed and "static/plain.classic.js" not in listed
    # search-index.js serves pages opened from files only, where there is no worker
    with_index = add_offline_files(small_site(**{"search-index.json": b"{}\n", "search-index.js": b"self.x = {};\n"}))
    listed = json.loads(with_index[WORKER].decode().split("const FILES = ", 1)[1].split(";\n", 1)[0])
    assert "search-index.json" in listed and "search-index.js" not in listed
    assert MANIFEST in listed


def test_the_worker_stores_the_scripts_a_material_page_loads_later(built_site):
    """A material page fetches its calculator script only when the calculator is about to be used
    (calc-loader.js), and the AC part after that: the shipped worker stores all three, so a stored
    copy calculates offline however late they are asked for; the page's data-load names a real file."""
    listed = json.loads((built_site / WORKER).read_text(encoding="utf-8").split("const FILES = ", 1)[1]
                        .split(";\n", 1)[0])
    for path in ("static/calc-loader.js", "static/calc-resistance.classic.js", "static/calc-ac.classic.js"):
        assert path in listed and (built_site / path).is_file(), path
    for page in sorted((built_site / "materials").glob("*/index.html")):
        html = page.read_text(encoding="utf-8")
        assert '<script defer src="../../static/calc-loader.js" data-load="calc-resistance.classic.js">' in html, page
        assert html.count("calc-resistance.classic.js") == 1, page  # never also as a script of its own


def test_cache_version_follows_content():
    base = add_offline_files(small_site())
    same = add_offline_files(small_site())
    changed = add_offline_files(small_site(**{"index.html": b"<!doctype html><title>y</title>"}))
    moved = small_site()
    moved["other.html"] = moved.pop("index.html")
    assert base[WORKER] == same[WORKER]                         # repeatable builds
    versions = {cache_version(base), cache_version(changed), cache_version(add_offline_files(moved))}
    assert len(versions) == 3
    without_worker = {p: b for p, b in changed.items() if p != WORKER}
    assert f"const VERSION = '{cache_version(without_worker)}';" in changed[WORKER].decode()
    assert cache_version({"a": b"bc"}) != cache_version({"ab": b"c"})   # path/content boundary


def test_manifest_names_the_app_and_its_icons():
    out = add_offline_files(small_site())
    data = json.loads(out[MANIFEST])
    assert data["name"] == "Conductor Atlas" and data["start_url"] == "./index.html"
    for icon in data["icons"]:
        assert icon["src"] in out and not icon["src"].startswith(("/", "http"))
        if icon["type"] == "image/png":
            w, h = png_size(out[icon["src"]], icon["src"])
            assert icon["sizes"] == f"{w}x{h}"
    assert {i["purpose"] for i in data["icons"]} == {"any", "maskable"}


def test_wrong_icon_size_and_clashes_are_build_errors():
    files = small_site()
    files["static/icons/atlas-512.png"] = files["static/icons/atlas-192.png"]
    with pytest.raises(BuildError, match=r"atlas-512\.png is \(192, 192\) pixels, the manifest says 512x512"):
        add_offline_files(files)
    with pytest.raises(BuildError, match="sw.js is made by the offline step"):
        add_offline_files(small_site(**{"sw.js": b""}))


def test_precache_list_is_relative():
    assert all(not p.startswith("/") for p in precache_list(add_offline_files(small_site())))


def test_compaction_drops_indent_and_comment_lines_but_not_strings():
    from conductor_atlas.bundle import compact_lines
    # plain code: indentation and whole-line comments go, code stays in order
    assert compact_lines(["  // note", "  const a = 1;", "", "\treturn a;"]) == ["const a = 1;", "return a;"]
    # a backslash-continued string keeps its next line exactly
    assert compact_lines(["const s = 'a\\", "   b';"]) == ["const s = 'a\\", "   b';"]
    # a template literal anywhere in code: nothing is touched
    lines = ["const t = `x", "   y`;"]
    assert compact_lines(lines) == lines
