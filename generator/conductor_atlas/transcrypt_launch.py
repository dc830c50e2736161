"""Run Transcrypt with one speed fix: its identifier filter remembers its answers.

    python -m conductor_atlas.transcrypt_launch <transcrypt arguments>

Transcrypt 3.9.5 passes every emitted identifier through ``Generator.filterId``, which tries each
of its ~70 aliases with two ``re.sub`` calls: about 1.4 million regex substitutions for our core,
three quarters of the transpile time. The answer depends only on the identifier, the
``idFiltering`` switch and the alias list in force (``__pragma__('alias', ...)`` can change that
list), so it is remembered under exactly those three; the JavaScript written is byte-identical
to an unpatched run (``tests/test_transpile.py`` compares the two). Everything else is
Transcrypt's own ``__main__``, loaded by path so its module search is the one ``python -m
transcrypt`` sets up.
"""

from __future__ import annotations

import runpy
import sys


def _remembering(filter_id):
    answers: dict = {}

    def filterId(self, qualifiedId):  # noqa: N802, N803  (Transcrypt's names)
        key = (qualifiedId, self.idFiltering, tuple(self.aliases))
        try:
            return answers[key]
        except KeyError:
            answers[key] = result = filter_id(self, qualifiedId)
            return result

    return filterId


def _patch_on_import() -> None:
    """Wrap filterId as soon as Transcrypt's own ``__main__`` has imported its compiler."""
    import importlib.abc

    class Finder(importlib.abc.MetaPathFinder):
        def find_spec(self, name, path, target=None):
            if name != "org.transcrypt.compiler":
                return None
            sys.meta_path.remove(self)
            import importlib.util
            spec = importlib.util.find_spec(name)
            loader = spec.loader
            original_exec = loader.exec_module

            def exec_module(module):
                original_exec(module)
                module.Generator.filterId = _remembering(module.Generator.filterId)

            loader.exec_module = exec_module
            return spec

    sys.meta_path.insert(0, Finder())


def main() -> None:
    import transcrypt
    _patch_on_import()
    sys.argv[0] = "transcrypt"
    runpy.run_path(f"{transcrypt.__path__[0]}/__main__.py", run_name="__main__")


if __name__ == "__main__":
    main()
