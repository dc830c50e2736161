"""Stage 4: carry the core to JavaScript with Transcrypt (a subprocess), cached by content hash.

The subprocess runs in the background while the rest of the build works (``PendingTranspile``),
through ``conductor_atlas.transcrypt_launch`` (Transcrypt with a remembered identifier filter).

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

from conductor_atlas.atlas_errors import BuildError
from conductor_atlas.paths import CACHE_DIR, CORE_DIR, PACKAGE_DIR

FLAGS = ["-b", "-n", "-k"]
KEEP_TRANSPILED = 3  # older transpiled cores kept besides the current one (0.5 MB each)
ENTRY = CORE_DIR / "web.py"
LAUNCHER = PACKAGE_DIR / "transcrypt_launch.py"
CORE_PACKAGE = "conductor_atlas.core"
RUNTIME_FILES = ["org.transcrypt.__runtime__.js", "math.js"]
RE_FILES = ["re.js", "re.translate.js"]  # Transcrypt writes these only when a shipped module imports re
TIMESTAMP_LINE = re.compile(rb"^// Transcrypt'ed from Python, [^\n]*\n")


def imported_core_modules(module: str) -> set[str]:
    """Dotted names of the core modules that the core module ``module`` imports itself, in either form
    (``from conductor_atlas.core.x import f`` and ``from conductor_atlas.core import x``)."""
    tree = ast.parse((CORE_DIR / (module.rsplit(".", 1)[1] + ".py")).read_text(encoding="utf-8"))
    names = set()
    for node in ast.walk(tree):
        if isinstance(node, ast.ImportFrom) and node.module == CORE_PACKAGE:
            names.update(f"{CORE_PACKAGE}.{alias.name}" for alias in node.names)
        elif isinstance(node, ast.ImportFrom) and (node.module or "").startswith(CORE_PACKAGE + "."):
            names.add(node.module)
    return names


def core_modules() -> list[str]:
    """Dotted names of the core modules reached from core/web.py, directly or through other core
    modules (the ones shipped to browsers; Transcrypt writes exactly these)."""
    entry = CORE_PACKAGE + "." + ENTRY.stem
    found: set[str] = set()
    todo = [entry]
    while todo:
        for name in imported_core_modules(todo.pop()):
            if name not in found and name != entry:
                found.add(name)
                todo.append(name)
    return sorted(found)


def imports_re(module: str) -> bool:
    """True when the core module ``module`` (a dotted name) has ``import re`` or ``from re import``."""
    tree = ast.parse((CORE_DIR / (module.rsplit(".", 1)[1] + ".py")).read_text(encoding="utf-8"))
    for node in ast.walk(tree):
        if isinstance(node, ast.Import) and any(alias.name == "re" for alias in node.names):
            return True
        if isinstance(node, ast.ImportFrom) and node.module == "re":
            return True
    return False


def expected_files() -> list[str]:
    modules = core_modules()
    files = [f"{name}.js" for name in modules] + RUNTIME_FILES
    if any(imports_re(name) for name in modules + ["conductor_atlas.core.web"]):
        files.extend(RE_FILES)
    return sorted(files)


def transcrypt_version() -> str:
    try:
        return metadata.version("transcrypt")
    except metadata.PackageNotFoundError as exc:
        raise BuildError("Transcrypt is not installed; run `make site` (it installs transcrypt==3.9.5)") from exc


def core_hash() -> str:
    digest = hashlib.sha256()
    digest.update(transcrypt_version().encode())
    digest.update(" ".join(FLAGS).encode())
    digest.update(LAUNCHER.read_bytes())  # what it changes in Transcrypt's output (math without keywords)
    for path in sorted(CORE_DIR.glob("*.py")):
        digest.update(path.name.encode())
        digest.update(path.read_bytes())
    return digest.hexdigest()[:20]


def normalise(content: bytes) -> bytes:
    """Replace Transcrypt's timestamp line so repeated builds are byte-identical."""
    return TIMESTAMP_LINE.sub(b"// Transcrypt'ed from Python: conductor_atlas core\n", content, count=1)


def transcrypt_command(out_dir: Path) -> list[str]:
    """Transcrypt through our launcher (the remembered identifier filter: same output, ~2× faster)."""
    return [sys.executable, "-m", "conductor_atlas.transcrypt_launch", *FLAGS, "-xp", str(PACKAGE_DIR.parent),
            "-od", str(out_dir), str(ENTRY)]


def check_written(out_dir: Path, returncode: int, output: str) -> None:
    if returncode != 0:
        tail = "\n".join(output.strip().splitlines()[-8:])
        raise BuildError(f"Transcrypt failed (exit {returncode}) on the core:\n{tail}")
    missing = [name for name in expected_files() if not (out_dir / name).is_file()]
    if missing:
        raise BuildError("Transcrypt reported success but did not write: " + ", ".join(missing)
                         + " (is every core module imported from core/web.py, with absolute imports?)")


def run_transcrypt(out_dir: Path) -> None:
    result = subprocess.run(transcrypt_command(out_dir), capture_output=True, text=True, cwd=str(out_dir.parent))
    check_written(out_dir, result.returncode, result.stdout + result.stderr)


def prune_transpiled(folder: Path, keep: Path, newest: int = KEEP_TRANSPILED) -> None:
    """Keep ``keep`` and the ``newest`` other finished transpiles (by time); remove older ones."""
    done = [p for p in folder.iterdir() if p != keep and (p / "COMPLETE").is_file()]
    done.sort(key=lambda p: (p / "COMPLETE").stat().st_mtime, reverse=True)
    for old in done[newest:]:
        shutil.rmtree(old, ignore_errors=True)


class PendingTranspile:
    """A transpile started in the background; ``result()`` waits for it and returns its files.

    The transpiled core depends only on the core's sources, so the build starts Transcrypt (a
    subprocess) first and loads, derives and renders while it runs. When the cache already holds
    this core, nothing is started. ``close()`` (or leaving a ``with`` block) stops an unfinished
    run and removes its scratch folder, so a build that fails on bad data leaves nothing behind.
    """

    def __init__(self, cache_dir: Path = CACHE_DIR) -> None:
        self.key = core_hash()
        self.cached = cache_dir / "transpile" / self.key
        self.process: subprocess.Popen | None = None
        self.scratch: tempfile.TemporaryDirectory | None = None
        if (self.cached / "COMPLETE").is_file():
            return
        cache_dir.joinpath("transpile").mkdir(parents=True, exist_ok=True)
        self.scratch = tempfile.TemporaryDirectory(dir=cache_dir / "transpile")
        out_dir = Path(self.scratch.name) / "js"
        out_dir.mkdir()
        self.process = subprocess.Popen(transcrypt_command(out_dir), stdout=subprocess.PIPE,
                                        stderr=subprocess.STDOUT, text=True, cwd=str(out_dir.parent))

    def result(self) -> dict[str, bytes]:
        if self.process is not None:
            output, _ = self.process.communicate()
            scratch = Path(self.scratch.name)
            try:
                check_written(scratch / "js", self.process.returncode, output)
                self._stage(scratch)
            finally:
                self.process = None
                self.close()
        return {f"js/{p.name}": p.read_bytes() for p in sorted(self.cached.glob("*.js"))}

    def _stage(self, scratch: Path) -> None:
        staged = scratch / "staged"
        staged.mkdir()
        for path in sorted((scratch / "js").glob("*.js")):
            if path.name == "web.js":
                continue
            (staged / path.name).write_bytes(normalise(path.read_bytes()))
        (staged / "COMPLETE").write_text(self.key + "\n")
        if self.cached.exists():
            shutil.rmtree(self.cached)
        staged.rename(self.cached)
        prune_transpiled(self.cached.parent, keep=self.cached)


    def close(self) -> None:
        if self.process is not None:
            self.process.kill()
            self.process.communicate()
            self.process = None
        if self.scratch is not None:
            self.scratch.cleanup()
            self.scratch = None

    def __enter__(self) -> "PendingTranspile":
        return self

    def __exit__(self, *exc) -> None:
        self.close()


def transpile_core(cache_dir: Path = CACHE_DIR) -> dict[str, bytes]:
    """The core as ES modules, keyed "js/<file>"; reuses the cache when the core is unchanged."""
    with PendingTranspile(cache_dir) as pending:
        return pending.result()
