"""Stage 4: carry the core to JavaScript with Transcrypt (a subprocess), cached by content hash.

Flags (see DEVELOPERS.md): -b build all, -n no minifier (it needs Java and is slow), -k honour
keyword arguments. -kc is NOT used: it breaks Transcrypt's own ``re`` module (KeyError inside
re.js on match.group). Returns "js/<module>.js" -> bytes; writes only into the cache folder.
"""

from __future__ import annotations

import ast
import hashlib
import re
import shutil
import subprocess
import sys
import tempfile
from importlib import metadata
from pathlib import Path

from conductor_atlas.errors import BuildError
from conductor_atlas.paths import CACHE_DIR, CORE_DIR, PACKAGE_DIR

FLAGS = ["-b", "-n", "-k"]
ENTRY = CORE_DIR / "web.py"
RUNTIME_FILES = ["org.transcrypt.__runtime__.js", "re.js", "re.translate.js", "math.js"]
TIMESTAMP_LINE = re.compile(rb"^// Transcrypt'ed from Python, [^\n]*\n")


def core_modules() -> list[str]:
    """Dotted names of the core modules that core/web.py imports (the ones shipped to browsers)."""
    tree = ast.parse(ENTRY.read_text(encoding="utf-8"))
    names = {node.module for node in ast.walk(tree) if isinstance(node, ast.ImportFrom) and node.module}
    return sorted(n for n in names if n.startswith("conductor_atlas.core."))


def expected_files() -> list[str]:
    return sorted([f"{name}.js" for name in core_modules()] + RUNTIME_FILES)


def transcrypt_version() -> str:
    try:
        return metadata.version("transcrypt")
    except metadata.PackageNotFoundError as exc:
        raise BuildError("Transcrypt is not installed; run `make site` (it installs transcrypt==3.9.5)") from exc


def core_hash() -> str:
    digest = hashlib.sha256()
    digest.update(transcrypt_version().encode())
    digest.update(" ".join(FLAGS).encode())
    for path in sorted(CORE_DIR.glob("*.py")):
        digest.update(path.name.encode())
        digest.update(path.read_bytes())
    return digest.hexdigest()[:20]


def normalise(content: bytes) -> bytes:
    """Replace Transcrypt's timestamp line so repeated builds are byte-identical."""
    return TIMESTAMP_LINE.sub(b"// Transcrypt'ed from Python: conductor_atlas core\n", content, count=1)


def run_transcrypt(out_dir: Path) -> None:
    command = [sys.executable, "-m", "transcrypt", *FLAGS, "-xp", str(PACKAGE_DIR.parent), "-od",
               str(out_dir), str(ENTRY)]
    result = subprocess.run(command, capture_output=True, text=True, cwd=str(out_dir.parent))
    if result.returncode != 0:
        tail = "\n".join((result.stdout + result.stderr).strip().splitlines()[-8:])
        raise BuildError(f"Transcrypt failed (exit {result.returncode}) on the core:\n{tail}")
    missing = [name for name in expected_files() if not (out_dir / name).is_file()]
    if missing:
        raise BuildError("Transcrypt reported success but did not write: " + ", ".join(missing)
                         + " (is every core module imported from core/web.py, with absolute imports?)")


def transpile_core(cache_dir: Path = CACHE_DIR) -> dict[str, bytes]:
    """The core as ES modules, keyed "js/<file>"; reuses the cache when the core is unchanged."""
    key = core_hash()
    cached = cache_dir / "transpile" / key
    if not (cached / "COMPLETE").is_file():
        cache_dir.joinpath("transpile").mkdir(parents=True, exist_ok=True)
        with tempfile.TemporaryDirectory(dir=cache_dir / "transpile") as scratch:
            out_dir = Path(scratch) / "js"
            out_dir.mkdir()
            run_transcrypt(out_dir)
            staged = Path(scratch) / "staged"
            staged.mkdir()
            for path in sorted(out_dir.glob("*.js")):
                if path.name == "web.js":
                    continue
                (staged / path.name).write_bytes(normalise(path.read_bytes()))
            (staged / "COMPLETE").write_text(key + "\n")
            if cached.exists():
                shutil.rmtree(cached)
            staged.rename(cached)
    return {f"js/{p.name}": p.read_bytes() for p in sorted(cached.glob("*.js"))}
