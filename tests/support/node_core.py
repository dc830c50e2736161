"""Run core functions in node, on the transpiled JavaScript, for differential tests.

``NodeCore(folder).call_many(calls)`` sends a batch of {"module", "function", "args"} calls to
one node process and returns, per call, {"ok": result} or {"error": message}. Plain JS objects
in the arguments are turned into Transcrypt dicts first (what the page glue does).
"""

from __future__ import annotations

import json
import math
import shutil
import subprocess
from pathlib import Path

# The JS both runners share (this one through node's module loader, the classic-script one of
# tests/test_offline_build.py through the bundle): arguments' plain objects become Transcrypt dicts
# (``dict`` must be in scope), and results go to JSON with non-finite numbers and undefined tagged.
TO_PY_JS = r"""
function toPy(value) {
  if (Array.isArray(value)) return value.map(toPy);
  if (value !== null && typeof value === 'object') {
    if ('__nonfinite__' in value) return Number(value.__nonfinite__);
    const out = {};
    for (const key of Object.keys(value)) out[key] = toPy(value[key]);
    return dict(out);
  }
  return value;
}
function replacer(key, value) {
  if (typeof value === 'number' && !Number.isFinite(value)) return {__nonfinite__: String(value)};
  if (value === undefined) return {__undefined__: true};
  return value;
}
"""

RUNNER = r"""
import {dict} from './org.transcrypt.__runtime__.js';
// the AC part (core.ac_part), loaded as on a page that has loaded every part (CPython's calculators
// import it themselves)
import './conductor_atlas.core.calc_resistance_ac.js';
const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const calls = JSON.parse(Buffer.concat(chunks).toString('utf8'));
const modules = {};
""" + TO_PY_JS + r"""
const results = [];
for (const call of calls) {
  if (!(call.module in modules)) modules[call.module] = await import('./' + call.module + '.js');
  const fn = modules[call.module][call.function];
  try {
    if (typeof fn !== 'function') throw new Error('no function ' + call.function + ' in ' + call.module);
    results.push({ok: fn(...call.args.map(toPy))});
  } catch (e) {
    let message;
    if (e && typeof e.__str__ === 'function') message = e.__str__();
    else if (e && e.message) message = 'JS ' + e.message;
    else message = 'JS error';
    const isCore = !!(e && e.__class__ && e.__class__.__name__ === 'CoreError');
    results.push({error: message, core: isCore});
  }
}
process.stdout.write(JSON.stringify(results, replacer));
"""


def node_available() -> bool:
    return shutil.which("node") is not None


def encode(value):
    """Python value -> JSON-safe value (non-finite floats tagged the same way as the runner)."""
    if isinstance(value, float) and not math.isfinite(value):
        return {"__nonfinite__": "NaN" if math.isnan(value) else ("Infinity" if value > 0 else "-Infinity")}
    if isinstance(value, dict):
        return {k: encode(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [encode(v) for v in value]
    return value


class NodeCore:
    def __init__(self, files: dict[str, bytes], folder: Path) -> None:
        self.folder = folder
        for rel, content in files.items():
            if rel.startswith("js/"):
                (folder / rel[3:]).write_bytes(content)
        (folder / "package.json").write_text('{"type": "module"}\n')
        (folder / "runner.mjs").write_text(RUNNER)

    def call_many(self, calls: list[dict]) -> list[dict]:
        payload = json.dumps([{**c, "args": encode(c["args"])} for c in calls])
        result = subprocess.run(["node", "runner.mjs"], input=payload, capture_output=True, text=True,
                                cwd=self.folder, timeout=300)
        if result.returncode != 0:
            raise RuntimeError("node runner failed:\n" + result.stderr[-3000:])
        return json.loads(result.stdout)
