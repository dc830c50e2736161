"""The core stays inside the Transcrypt subset: every forbidden construct is named with file:line."""

from pathlib import Path

import pytest

from tests.support.subset import imported_keyword_calls, violations

CORE = Path(__file__).resolve().parents[2] / "generator" / "conductor_atlas" / "core"


def test_core_uses_only_the_transcrypt_subset():
    found = []
    for path in sorted(CORE.glob("*.py")):
        found.extend(violations(path.read_text(encoding="utf-8"), f"{path.parent.name}/{path.name}"))
    assert found == [], "constructs Transcrypt cannot carry:\n" + "\n".join(found)


def test_no_keyword_call_into_another_modules_nokwargs_region():
    sources = {path.name: path.read_text(encoding="utf-8") for path in sorted(CORE.glob("*.py"))}
    found = imported_keyword_calls(sources)
    assert found == [], "\n".join(found)


def test_checker_flags_keywords_across_modules():
    fast = "# __pragma__ ('nokwargs')\ndef fast(a, b):\n    return a + b\n# __pragma__ ('kwargs')\n"
    caller = "from conductor_atlas.core.fast_words import fast\n\nx = fast(1, b=2)\n"
    found = imported_keyword_calls({"fast_words.py": fast, "caller.py": caller})
    assert found == ["caller.py:3: keyword argument to fast, defined in a nokwargs region of another module: "
                     "Transcrypt ignores it there"]


@pytest.mark.parametrize("snippet, words", [
    ("from .units import parse", "relative import"),
    ("import json", "import of 'json'"),
    ("x = f'{y:.3g}'", "format spec"),
    ("x = '%d' % 3", "% string formatting"),
    ("x = [1] + [2]", "list + list"),
    ("x = [0] * 4", "[x] * n"),
    ("ok = a == [1, 2]", "== between lists"),
    ("v = x[-1]", "negative index"),
    ("n = int(x)", "int()"),
    ("y = math.isfinite(x)", "math.isfinite"),
    ("s = t.zfill(3)", ".zfill()"),
    ("s = t.strip('x')", "ignores its argument"),
    ("length = 3", "name 'length'"),
    ("a, *b = c", "star-unpacking"),
    ("ok = 0 < x < 1", "chained comparison"),
    ("@dataclass\nclass A:\n    pass", "class decorators"),
    ("if isinstance(x, float):\n    pass", "isinstance"),
])
def test_checker_names_each_forbidden_construct(snippet, words):
    found = violations(snippet, "probe.py")
    assert found, f"not flagged: {snippet!r}"
    assert words in found[0]
    assert found[0].startswith("probe.py:")


def test_checker_flags_keywords_into_a_nokwargs_region():
    code = ("# __pragma__ ('nokwargs')\ndef fast(a, b):\n    return a + b\n# __pragma__ ('kwargs')\n"
            "def slow(a, b=1):\n    return fast(a, b=b)\n")
    found = violations(code, "probe.py")
    assert found == ["probe.py:6: keyword argument to fast, defined in a nokwargs region: Transcrypt ignores it there"]
    assert "default argument" in violations("# __pragma__ ('nokwargs')\ndef f(a=1):\n    return a\n", "p.py")[0]


@pytest.mark.parametrize("code, where", [
    ("import math\ny = math.log(x, base=2.0)\n", "2: keyword argument to math.log"),
    ("import math\n_log = math.log\ny = _log(x, base=2.0)\n", "3: keyword argument to _log"),
    ("from math import log\ny = log(x=3.0)\n", "2: keyword argument to log"),
])
def test_checker_flags_keywords_to_math(code, where):
    # Transcrypt's math is compiled without keyword arguments (transcrypt_launch): JS would ignore them
    assert violations(code, "probe.py") == [f"probe.py:{where}: Transcrypt's math is compiled without keyword "
                                            "arguments, JS ignores it"]
    assert violations("import math\n_log = math.log\ny = math.log(x, 2.0) + _log(x)\n", "probe.py") == []


def test_checker_flags_loops_in_a_jsiter_region():
    code = "# __pragma__ ('jsiter')\ndef f(xs):\n    return {'n': len(xs), 'a': 1 in xs}\n# __pragma__ ('nojsiter')\n"
    assert violations(code, "probe.py") == ["probe.py:3: 'in' in a jsiter region tests JS keys, not Python items"]
    assert "walks JS keys" in violations("# __pragma__ ('jsiter')\nfor x in y:\n    pass\n", "p.py")[0]


def test_checker_accepts_plain_core_code():
    code = ("import math\nfrom conductor_atlas.core.errors import CoreError\n"
            "def area(d):\n    return math.pi * d * d / 4.0\n")
    assert violations(code, "ok.py") == []
