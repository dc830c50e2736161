"""Join an ES-module graph into one classic script, so a page opened from file:// can run it.

Chromium refuses module scripts on file:// pages (their origin is "null"), and Transcrypt only
writes ES modules. The build therefore links the modules itself: every module body becomes a
generator function in one script, and the script imitates what a browser does with modules:

1. link: run every module up to its first ``yield``, which installs its exports as getters on a
   namespace object (the module's own hoisted ``var``/``function`` bindings, so the getters are
   live, as in a real module namespace);
2. evaluate: resume the modules in the order a browser evaluates them (depth first, imports in
   source order, each module after the modules it imports).

Only the linkage lines are rewritten, never the code: a line must be one of the import and export
forms Transcrypt writes (listed in ``IMPORT_*`` and ``EXPORT_*`` below), or the build stops and
names the file and line. Named imports are copied when the module starts, which is exact unless
the import closes a cycle (the exporting module has not run yet); that case is refused too, while
``import * as ns`` across a cycle is fine (the namespace is live). A named import whose name the
module's code never mentions is left out (``words_of``).

A bundle can be split in two: a base bundle that publishes its modules' namespaces
(``publishes``: ``globalThis.conductorAtlasModules``, path -> namespace, set once per page) and a
part loaded later (``linked``: the paths the base holds), which leaves those modules out and takes
their namespaces from the base, so both share one instance of every module (one runtime, one
CoreError class, one registry of the AC part: core.ac_part). A part run on a page without its base
throws an Error naming the module it missed.

Pure function: files in, bytes out; writes nothing.
"""

from __future__ import annotations

import json
import posixpath
import re
from dataclasses import dataclass, field

from conductor_atlas.atlas_errors import BuildError

NAME = r"[A-Za-z_$][A-Za-z0-9_$]*"
SPEC = r"'(?P<spec>\.{1,2}/[^'\s]+\.js)'"
IMPORT_NAMED = re.compile(rf"^import \{{(?P<names>[^}}]*)\}} from {SPEC};\s*$")
IMPORT_STAR = re.compile(rf"^import \* as (?P<local>{NAME}) from {SPEC};\s*$")
EXPORT_DECL = re.compile(rf"^export (?P<kind>var|let|const|function|class) (?P<name>{NAME})\b")
EXPORT_LIST = re.compile(r"^export \{(?P<names>[^}]*)\};\s*$")
LINKAGE_WORD = re.compile(r"^\s*(import|export)\b")
DYNAMIC = re.compile(r"\bimport\s*\(|\bimport\.meta\b")
WORD = re.compile(NAME)
PREFIX = "__ca_bundle_"  # the bundle's own names; a module using this prefix is refused


@dataclass
class Module:
    path: str
    body: list[str] = field(default_factory=list)                   # lines, linkage removed
    imports: list[tuple[str, list[tuple[str, str]] | str]] = field(default_factory=list)
    exports: dict[str, str] = field(default_factory=dict)           # exported name -> local name
    words: set[str] | None = None                                    # see words_of


def _pairs(text: str, where: str) -> list[tuple[str, str]]:
    """``a, b as c`` -> [("a", "a"), ("b", "c")] (outer name, local name)."""
    pairs = []
    for item in (part.strip() for part in text.split(",")):
        if not item:
            continue
        match = re.fullmatch(rf"({NAME})(?:\s+as\s+({NAME}))?", item)
        if match is None:
            raise BuildError(f"{where}: cannot read import/export name {item!r}")
        pairs.append((match.group(1), match.group(2) or match.group(1)))
    return pairs


def parse_module(path: str, source: str) -> Module:
    """Split one module into its linkage (imports, exports) and its code."""
    module = Module(path)
    if PREFIX in source:
        raise BuildError(f"{path}: uses the name prefix {PREFIX}, which the classic bundle reserves")
    for number, line in enumerate(source.split("\n"), start=1):
        where = f"{path}:{number}"
        if DYNAMIC.search(line):
            raise BuildError(f"{where}: dynamic import() or import.meta cannot be bundled into a classic script")
        if not LINKAGE_WORD.match(line):
            module.body.append(line)
            continue
        if m := IMPORT_NAMED.match(line):
            module.imports.append((resolve(path, m["spec"]), _pairs(m["names"], where)))
            module.body.append("")
        elif m := IMPORT_STAR.match(line):
            module.imports.append((resolve(path, m["spec"]), m["local"]))
            module.body.append("")
        elif m := EXPORT_DECL.match(line):
            module.exports[m["name"]] = m["name"]
            module.body.append(line[len("export "):])
        elif m := EXPORT_LIST.match(line):
            for local, outer in _pairs(m["names"], where):
                module.exports[outer] = local
            module.body.append("")
        else:
            raise BuildError(f"{where}: an import/export form the classic bundler does not know: "
                             f"{line.strip()[:80]!r}")
    return module


def resolve(importer: str, spec: str) -> str:
    return posixpath.normpath(posixpath.join(posixpath.dirname(importer), spec))


def evaluation_order(entry: str, modules: dict[str, Module]) -> list[str]:
    """Depth-first post-order from the entry, imports in source order: a browser's order (modules
    not in ``modules``, those a base bundle has run already, are skipped)."""
    order: list[str] = []
    seen: set[str] = set()

    def visit(path: str) -> None:
        seen.add(path)
        for target, _ in modules[path].imports:
            if target not in seen and target in modules:
                visit(target)
        order.append(path)

    visit(entry)
    return order


def load_graph(files: dict[str, bytes], entry: str, parsed: dict[str, Module] | None = None,
               linked: frozenset[str] = frozenset()) -> dict[str, Module]:
    """The modules ``entry`` reaches, but not through or into ``linked`` (modules a base bundle holds);
    ``parsed`` (path -> Module) is shared between bundles of one file set so each module is read once
    (modules are not changed after parsing)."""
    parsed = {} if parsed is None else parsed
    modules: dict[str, Module] = {}
    pending = [entry]
    while pending:
        path = pending.pop()
        if path in modules or path in linked:
            continue
        modules[path] = parsed_module(files, path, entry, parsed)
        pending.extend(target for target, _ in modules[path].imports)
    return modules


def parsed_module(files: dict[str, bytes], path: str, entry: str, parsed: dict[str, Module]) -> Module:
    if path not in files:
        raise BuildError(f"classic bundle of {entry}: {path} is imported but is not a file of the site")
    if path not in parsed:
        parsed[path] = parse_module(path, files[path].decode("utf-8"))
    return parsed[path]


PUBLISHED = "conductorAtlasModules"  # the global a base bundle publishes its namespaces under


def bundle(files: dict[str, bytes], entry: str, parsed: dict[str, Module] | None = None,
           linked: frozenset[str] = frozenset(), publishes: bool = False) -> bytes:
    """One classic script that runs ``entry`` (a site path such as "static/calc.js") and its imports.

    ``parsed``: modules already parsed from the same ``files`` (see ``load_graph``). ``linked``: the
    modules of a base bundle this one is a part of (left out, taken from the base's published
    namespaces); ``publishes``: publish this bundle's namespaces for its parts."""
    parsed = {} if parsed is None else parsed
    modules = load_graph(files, entry, parsed, linked)
    order = evaluation_order(entry, modules)
    position = {path: i for i, path in enumerate(order)}
    needed = sorted({target for path in order for target, _ in modules[path].imports if target in linked})
    out = [f"// Conductor Atlas: {entry} and the modules it imports, joined by the build into one classic",
           "// script so the page also works when opened from a file. Generated; edit the modules instead.",
           "(function () {",
           "'use strict';",
           f"const {PREFIX}ns = {json.dumps(order)}.map(() => Object.create(null));"]
    if needed:
        out += [f"const {PREFIX}linked = globalThis.{PUBLISHED} || {{}};",
                f"for (const path of {json.dumps(needed)}) {{",
                f"  if (!{PREFIX}linked[path]) throw new Error({json.dumps(entry + ' needs ')} + path + "
                f"{json.dumps(' from the calculator script of the page, which has not run')});",
                "}"]
    out += [f"function {PREFIX}export(ns, getters) {{",
            "  for (const name of Object.keys(getters).sort()) {",
            "    Object.defineProperty(ns, name, {get: getters[name], enumerable: true});",
            "  }",
            "  Object.defineProperty(ns, Symbol.toStringTag, {value: 'Module'});",
            "  Object.preventExtensions(ns);",
            "}",
            f"const {PREFIX}modules = [];"]
    for path in order:
        module = modules[path]
        me = position[path]
        getters = ", ".join(f"{json.dumps(outer)}: () => {local}" for outer, local in sorted(module.exports.items()))
        out.append(f"// ---- module {path}")
        out.append(f"{PREFIX}modules.push(function* () {{")
        out.append(f"{PREFIX}export({PREFIX}ns[{me}], {{{getters}}});")
        out.append("yield;")
        for target, what in module.imports:
            if target in linked:
                namespace = f"{PREFIX}linked[{json.dumps(target)}]"
                exported = parsed_module(files, target, entry, parsed).exports
            else:
                namespace = f"{PREFIX}ns[{position[target]}]"
                exported = modules[target].exports
            if isinstance(what, str):
                out.append(f"const {what} = {namespace};")
                continue
            if target not in linked and position[target] >= me:
                raise BuildError(f"{path}: a named import from {target} closes an import cycle; "
                                 f"the classic bundle supports only `import * as` across a cycle")
            for outer, _ in what:
                if outer not in exported:
                    raise BuildError(f"{path}: imports {outer!r} from {target}, which does not export it")
            kept = [(outer, local) for outer, local in what if local in words_of(module)]
            if kept:
                names = ", ".join(outer if outer == local else f"{outer}: {local}" for outer, local in kept)
                out.append(f"const {{{names}}} = {namespace};")
        out.extend(module.body)
        out.append("});")
    out.append(f"const {PREFIX}running = {PREFIX}modules.map((make) => make());")
    out.append(f"for (const module of {PREFIX}running) module.next();")
    if publishes:
        # published after linking, before evaluating: a part is only ever loaded after the page has run
        table = ", ".join(f"{json.dumps(path)}: {PREFIX}ns[{i}]" for i, path in enumerate(order))
        out.append(f"Object.defineProperty(globalThis, {json.dumps(PUBLISHED)}, {{value: Object.freeze({{{table}}})}});")
    out.append(f"for (const module of {PREFIX}running) module.next();")
    out.append("})();")
    return ("\n".join(compact_lines(out)) + "\n").encode("utf-8")


def words_of(module: Module) -> set[str]:
    """Every identifier-like word in the module's code (strings and comments included).

    A named import whose local name is not among them is never read, so the bundle leaves it out:
    Transcrypt imports all ~130 runtime names into every module, about 1 kB gzip per calculator
    bundle. Counting words in strings and comments too can only keep an import, never drop a used one.
    """
    if module.words is None:
        module.words = set(WORD.findall("\n".join(module.body)))
    return module.words


def compact_lines(lines: list[str]) -> list[str]:
    """Drop indentation and whole-line // comments (about 3 kB gzip off a calculator bundle).

    Safe because a JS line break can sit inside a string only in a template literal or after a
    backslash: with a backtick anywhere outside a comment line nothing is changed, and the line
    after one ending in a backslash is kept as it is.
    """
    code = [line for line in lines if not line.lstrip().startswith("//")]
    if any("`" in line for line in code):
        return lines
    out: list[str] = []
    keep_next = False
    for line in lines:
        if keep_next:
            out.append(line)
        else:
            stripped = line.lstrip()
            if stripped.startswith("//") or not stripped:
                continue
            out.append(stripped)
        keep_next = line.endswith("\\")
    return out
