"""The physics core: pure functions, floats in SI in and out.

Rules (enforced by tests/core/test_subset.py):
- import only ``math``, ``re`` and absolute ``conductor_atlas.core.*`` modules;
- no I/O, no pint, no numpy: this package is transpiled to JavaScript by Transcrypt
  and must behave identically in CPython and in the browser (see DEVELOPERS.md).
"""
