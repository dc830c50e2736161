"""Conductor Atlas: a sourced reference of conductor materials, built as a static site.

Pipeline (one module per stage): load -> derive -> render -> transpile -> publish.
The physics lives in ``conductor_atlas.core`` (pure Python, carried to the browser by Transcrypt).
"""

__version__ = "0.1.0"
