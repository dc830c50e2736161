"""Where the project's own folders are: templates/ and data/ at the top of the checkout.

The package is installed in editable mode by the Makefile (``pip install -e .``), so these are
found next to generator/.
"""

import os
from pathlib import Path

PACKAGE_DIR = Path(__file__).resolve().parent
PROJECT_ROOT = PACKAGE_DIR.parent.parent
TEMPLATES_DIR = PROJECT_ROOT / "templates"
STATIC_DIR = TEMPLATES_DIR / "static"
DATA_DIR = PROJECT_ROOT / "data"
CORE_DIR = PACKAGE_DIR / "core"
# Build caches (transpiled core, derived views, rendered pages); CONDUCTOR_ATLAS_CACHE moves them,
# e.g. to an empty folder for a cold build.
CACHE_DIR = Path(os.environ.get("CONDUCTOR_ATLAS_CACHE") or PROJECT_ROOT / ".cache")
