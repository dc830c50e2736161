"""A syntax-tree check of the Transcrypt subset the core must keep (see shared transcrypt notes).

``violations(source, filename)`` returns "file:line: message" for every construct that
Transcrypt 3.9.5 drops, mangles or rejects. It cannot see types, so two rules stay with code
review: container truthiness (write ``len(x) == 0``) and iterating a dict directly.
"""

from __future__ import annotations

import ast
import re

ALLOWED_MODULES = {"math", "re"}
CORE_PREFIX = "conductor_atlas.core"
MISSING_MATH = {"isfinite", "isinf", "isnan", "fabs", "fsum", "factorial", "gcd", "erf", "erfc", "log10",
                "log1p", "expm1", "prod", "comb", "perm", "isclose", "lgamma", "gamma"}
MISSING_STR = {"zfill", "center", "ljust", "rjust", "count", "index", "title", "partition", "rpartition",
               "format", "format_map", "expandtabs", "casefold", "swapcase"}
STRIP_METHODS = {"strip", "lstrip", "rstrip"}
JS_RESERVED = {"var", "function", "this", "delete", "typeof", "let", "const", "static", "enum", "super",
               "export", "eval", "new", "default", "switch", "case", "void", "instanceof", "with",
               "arguments", "interface", "package", "private", "protected", "public", "implements",
               "yield", "await", "debugger", "extends", "length", "caller", "name_", "undefined", "NaN",
               "Infinity"}
FORBIDDEN_CALLS = {"int": "int() wraps at 32 bits in JS: use math.trunc or math.floor",
                   "format": "format() is wrong or missing in Transcrypt",
                   "print": "the core does no I/O", "open": "the core does no I/O", "input": "the core does no I/O",
                   "eval": "not available", "exec": "not available"}


def is_container_literal(node: ast.AST) -> bool:
    return isinstance(node, (ast.List, ast.Tuple, ast.Dict, ast.ListComp, ast.DictComp))


class SubsetChecker(ast.NodeVisitor):
    def __init__(self, filename: str) -> None:
        self.filename = filename
        self.found: list[str] = []

    def flag(self, node: ast.AST, message: str) -> None:
        self.found.append(f"{self.filename}:{getattr(node, 'lineno', 0)}: {message}")

    # imports -------------------------------------------------------------
    def visit_Import(self, node: ast.Import) -> None:
        for alias in node.names:
            if alias.name not in ALLOWED_MODULES and not alias.name.startswith(CORE_PREFIX):
                self.flag(node, f"import of '{alias.name}': the core may import only math, re and {CORE_PREFIX}.*")
        self.generic_visit(node)

    def visit_ImportFrom(self, node: ast.ImportFrom) -> None:
        if node.level and node.level > 0:
            self.flag(node, "relative import: Transcrypt drops or aborts on these; use an absolute import")
        elif node.module not in ALLOWED_MODULES and not (node.module or "").startswith(CORE_PREFIX):
            self.flag(node, f"import from '{node.module}': the core may import only math, re and {CORE_PREFIX}.*")
        self.generic_visit(node)

    # formatting ----------------------------------------------------------
    def visit_FormattedValue(self, node: ast.FormattedValue) -> None:
        if node.format_spec is not None:
            self.flag(node, "f-string format spec: Transcrypt drops it silently; use core.numfmt")
        if node.conversion not in (-1, None):
            self.flag(node, "f-string conversion (!r/!s/!a) is not supported")
        self.generic_visit(node)

    def visit_BinOp(self, node: ast.BinOp) -> None:
        if isinstance(node.op, ast.Mod) and isinstance(node.left, (ast.Constant, ast.JoinedStr)) \
                and isinstance(getattr(node.left, "value", ""), str):
            self.flag(node, "% string formatting gives NaN in JS; use core.numfmt")
        if isinstance(node.op, ast.Add) and (is_container_literal(node.left) or is_container_literal(node.right)):
            self.flag(node, "list + list concatenates as strings in JS; use .extend or a loop")
        if isinstance(node.op, ast.Mult) and (is_container_literal(node.left) or is_container_literal(node.right)):
            self.flag(node, "[x] * n is not a list in JS; build it with a loop")
        self.generic_visit(node)

    def visit_Compare(self, node: ast.Compare) -> None:
        operands = [node.left] + list(node.comparators)
        if len(node.ops) > 1:
            self.flag(node, "chained comparison: write 'a <= x and x <= b'")
        for op, right in zip(node.ops, node.comparators):
            if isinstance(op, (ast.Eq, ast.NotEq)) and any(is_container_literal(x) for x in operands):
                self.flag(node, "== between lists/tuples/dicts is always False in JS; compare element-wise")
        self.generic_visit(node)

    def visit_Subscript(self, node: ast.Subscript) -> None:
        index = node.slice
        if isinstance(index, ast.UnaryOp) and isinstance(index.op, ast.USub):
            self.flag(node, "negative index x[-n] is undefined in JS; use x[len(x) - n]")
        self.generic_visit(node)

    # calls ---------------------------------------------------------------
    def visit_Call(self, node: ast.Call) -> None:
        func = node.func
        if isinstance(func, ast.Name):
            if func.id in FORBIDDEN_CALLS:
                self.flag(node, f"{func.id}(): {FORBIDDEN_CALLS[func.id]}")
            if func.id == "isinstance" and len(node.args) == 2:
                kinds = node.args[1]
                names = [kinds] if not isinstance(kinds, ast.Tuple) else list(kinds.elts)
                if any(isinstance(n, ast.Name) and n.id in ("int", "float") for n in names):
                    self.flag(node, "isinstance(x, int/float) is wrong in JS (2.0 is an int there)")
        if isinstance(func, ast.Attribute):
            if isinstance(func.value, ast.Name) and func.value.id == "math" and func.attr in MISSING_MATH:
                self.flag(node, f"math.{func.attr} is missing or imprecise in Transcrypt's math")
            elif func.attr in MISSING_STR:
                self.flag(node, f".{func.attr}() is missing or wrong in Transcrypt")
            elif func.attr in STRIP_METHODS and node.args:
                self.flag(node, f".{func.attr}(chars) ignores its argument in JS")
        if any(isinstance(k, ast.keyword) and k.arg is None for k in node.keywords):
            self.flag(node, "**kwargs in a call is not supported")
        self.generic_visit(node)

    # definitions and names ------------------------------------------------
    def check_name(self, node: ast.AST, name: str) -> None:
        if name in JS_RESERVED:
            self.flag(node, f"name '{name}' is reserved or breaks in JS; rename it")

    def visit_FunctionDef(self, node: ast.FunctionDef) -> None:
        self.check_name(node, node.name)
        if node.decorator_list:
            self.flag(node, "decorators (dataclass, property, ...) are not carried reliably")
        args = node.args
        if args.kwonlyargs:
            self.flag(node, "keyword-only arguments are not supported")
        if args.vararg or args.kwarg:
            self.flag(node, "*args/**kwargs are not supported")
        for a in args.args + args.posonlyargs:
            self.check_name(a, a.arg)
        self.generic_visit(node)

    def visit_AsyncFunctionDef(self, node: ast.AsyncFunctionDef) -> None:
        self.flag(node, "async functions are not used in the core")

    def visit_ClassDef(self, node: ast.ClassDef) -> None:
        self.check_name(node, node.name)
        if node.decorator_list:
            self.flag(node, "class decorators (dataclass, ...) are not supported")
        self.generic_visit(node)

    def visit_Name(self, node: ast.Name) -> None:
        self.check_name(node, node.id)

    def visit_Attribute(self, node: ast.Attribute) -> None:
        if node.attr in ("length", "caller"):
            self.flag(node, f"attribute '{node.attr}' fails on assignment in JS; rename it")
        self.generic_visit(node)

    def visit_Starred(self, node: ast.Starred) -> None:
        self.flag(node, "star-unpacking is not supported")
        self.generic_visit(node)

    def visit_NamedExpr(self, node: ast.NamedExpr) -> None:
        self.flag(node, "the walrus operator is not supported")
        self.generic_visit(node)

    def visit_Lambda(self, node: ast.Lambda) -> None:
        if node.args.defaults or node.args.kw_defaults:
            self.flag(node, "lambda with default arguments is not supported")
        self.generic_visit(node)

    def visit_Yield(self, node: ast.Yield) -> None:
        self.flag(node, "generators are not used in the core")

    def visit_YieldFrom(self, node: ast.YieldFrom) -> None:
        self.flag(node, "generators are not used in the core")

    def visit_Global(self, node: ast.Global) -> None:
        self.flag(node, "global statements are not used in the core")

    def visit_Nonlocal(self, node: ast.Nonlocal) -> None:
        self.flag(node, "nonlocal is not supported")

    def visit_Match(self, node: ast.AST) -> None:
        self.flag(node, "match statements are not supported")

    def visit_With(self, node: ast.With) -> None:
        self.flag(node, "with statements are not used in the core")
        self.generic_visit(node)


PRAGMA = re.compile(r"^\s*#\s*__pragma__\s*\(\s*'(\w+)'\s*\)")


def pragma_lines(source: str, start: str, end: str) -> set[int]:
    """Line numbers inside ``# __pragma__ ('<start>')`` ... ``# __pragma__ ('<end>')`` regions."""
    inside = False
    lines = set()
    for number, line in enumerate(source.splitlines(), start=1):
        found = PRAGMA.match(line)
        if found and found.group(1) in (start, end):
            inside = found.group(1) == start
        elif inside:
            lines.add(number)
    return lines


def nokwargs_lines(source: str) -> set[int]:
    return pragma_lines(source, "nokwargs", "kwargs")


# The loops allowed in a jsiter region: outcome.keys_of and outcome.has_keys walk a keyed record (a
# dict in CPython, a plain object in JS), where Python's ``for key in record`` and JS's for-in give
# the same keys in the same order; differential cases check both.
KEY_WALKERS = {("core/outcome.py", "keys_of"), ("core/outcome.py", "has_keys")}


def key_walker_loops(tree: ast.AST, filename: str) -> set[int]:
    """Line numbers of the loops of the functions in KEY_WALKERS."""
    lines = set()
    for node in ast.walk(tree):
        if isinstance(node, ast.FunctionDef) and any(filename.endswith(f) and node.name == name
                                                     for f, name in KEY_WALKERS):
            lines.update(n.lineno for n in ast.walk(node) if isinstance(n, ast.For))
    return lines


def jsiter_violations(tree: ast.AST, source: str, filename: str) -> list[str]:
    """In a jsiter region a dict literal is a plain JS object and ``for``/``in`` walk JS keys (list
    indexes as text): only dict literals may be there, no loops, comprehensions or ``in`` tests
    (but the key walk of KEY_WALKERS)."""
    region = pragma_lines(source, "jsiter", "nojsiter")
    allowed = key_walker_loops(tree, filename)
    found = []
    for node in ast.walk(tree):
        if getattr(node, "lineno", 0) not in region:
            continue
        if isinstance(node, ast.For) and node.lineno in allowed:
            continue
        if isinstance(node, (ast.For, ast.ListComp, ast.DictComp, ast.SetComp, ast.GeneratorExp)):
            found.append(f"{filename}:{node.lineno}: a loop in a jsiter region walks JS keys, not Python items")
        elif isinstance(node, ast.Compare) and any(isinstance(op, (ast.In, ast.NotIn)) for op in node.ops):
            found.append(f"{filename}:{node.lineno}: 'in' in a jsiter region tests JS keys, not Python items")
    return found


def nokwargs_violations(tree: ast.AST, source: str, filename: str) -> list[str]:
    """In a nokwargs region Transcrypt drops keyword arguments silently: its functions take no
    defaults, and no call in the file passes them a keyword."""
    region = nokwargs_lines(source)
    names = set()
    found = []
    for node in ast.walk(tree):
        if isinstance(node, ast.FunctionDef) and node.lineno in region:
            names.add(node.name)
            if node.args.defaults:
                found.append(f"{filename}:{node.lineno}: default argument in a nokwargs region (positional calls only)")
    for node in ast.walk(tree):
        if isinstance(node, ast.Call) and isinstance(node.func, ast.Name) and node.func.id in names and node.keywords:
            found.append(f"{filename}:{node.lineno}: keyword argument to {node.func.id}, defined in a nokwargs region: "
                         "Transcrypt ignores it there")
    return found


def nokwargs_names(source: str) -> set[str]:
    """The functions a module defines in its nokwargs regions."""
    region = nokwargs_lines(source)
    return {node.name for node in ast.walk(ast.parse(source))
            if isinstance(node, ast.FunctionDef) and node.lineno in region}


def imported_keyword_calls(sources: dict[str, str]) -> list[str]:
    """A function defined in one module's nokwargs region and called with a keyword from another
    module (``sources``: file name -> text of the flat core). Each module's own calls are checked by
    nokwargs_violations; this catches the calls across modules, which a split module has."""
    by_module = {name[:-3]: nokwargs_names(text) for name, text in sources.items()}
    found = []
    for filename, text in sources.items():
        tree = ast.parse(text)
        imported = set()
        for node in tree.body:
            if isinstance(node, ast.ImportFrom) and (node.module or "").startswith(CORE_PREFIX):
                fast = by_module.get(node.module.rsplit(".", 1)[1], set())
                imported |= {alias.asname or alias.name for alias in node.names if alias.name in fast}
        for node in ast.walk(tree):
            if (isinstance(node, ast.Call) and isinstance(node.func, ast.Name) and node.func.id in imported
                    and node.keywords):
                found.append(f"{filename}:{node.lineno}: keyword argument to {node.func.id}, defined in a nokwargs "
                             "region of another module: Transcrypt ignores it there")
    return found


def math_keyword_violations(tree: ast.AST, filename: str) -> list[str]:
    """Transcrypt's math module is compiled without keyword arguments (conductor_atlas.transcrypt_launch):
    no call of ``math.f``, of a name imported from math or of a module-level name bound to ``math.f``
    may pass a keyword (JS would ignore it)."""
    bound = set()
    for node in getattr(tree, "body", []):
        if isinstance(node, ast.ImportFrom) and node.module == "math":
            bound |= {alias.asname or alias.name for alias in node.names}
        elif (isinstance(node, ast.Assign) and isinstance(node.value, ast.Attribute)
              and isinstance(node.value.value, ast.Name) and node.value.value.id == "math"):
            bound |= {target.id for target in node.targets if isinstance(target, ast.Name)}
    found = []
    for node in ast.walk(tree):
        if not isinstance(node, ast.Call) or not node.keywords:
            continue
        func = node.func
        if isinstance(func, ast.Attribute) and isinstance(func.value, ast.Name) and func.value.id == "math":
            name = "math." + func.attr
        elif isinstance(func, ast.Name) and func.id in bound:
            name = func.id
        else:
            continue
        found.append(f"{filename}:{node.lineno}: keyword argument to {name}: Transcrypt's math is compiled "
                     "without keyword arguments, JS ignores it")
    return found


def violations(source: str, filename: str) -> list[str]:
    checker = SubsetChecker(filename)
    tree = ast.parse(source, filename=filename)
    checker.visit(tree)
    return (checker.found + nokwargs_violations(tree, source, filename) + jsiter_violations(tree, source, filename)
            + math_keyword_violations(tree, filename))
