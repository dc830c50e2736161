"""Where the project's own folders are: templates/ and data/ at the top of the checkout.

The package is installed in editable mode by the Makefile (``pip install -e .``), so these are
found next to generator/.
"""

from pathlib import Path

PACKAGE_DIR = Path(__file__).resolve().parent
PROJECT_ROOT = PACKAGE_DIR.parent.parent
TEMPLATES_DIR = PROJECT_ROOT / "templates"
STATIC_DIR = TEMPLATES_DIR / "static"
DATA_DIR = PROJECT_ROOT / "data"
CORE_DIR = PACKAGE_DIR / "core"
CACHE_DIR = PROJECT_ROOT / ".cache"
