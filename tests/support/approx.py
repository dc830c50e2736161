"""One tolerance helper for the reference checks."""

from __future__ import annotations

import pytest


def approx(expected, rel=None, abs=None):
    """pytest.approx without its default abs=1e-12, which would swallow SI quantities such as
    1e-8 Ω·m or 1e-31 kg and make a relative check vacuous: the absolute tolerance is 0 unless given."""
    if rel is None:
        return pytest.approx(expected, abs=0.0 if abs is None else abs)
    return pytest.approx(expected, rel=rel, abs=0.0 if abs is None else abs)
