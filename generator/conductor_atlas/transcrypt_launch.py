"""Run Transcrypt with two changes: its identifier filter remembers its answers, and its own
``math`` module is compiled without keyword-argument handling.

    python -m conductor_atlas.transcrypt_launch <transcrypt arguments>

Transcrypt 3.9.5 passes every emitted identifier through ``Generator.filterId``, which tries each
of its ~70 aliases with two ``re.sub`` calls: about 1.4 million regex substitutions for our core,
three quarters of the transpile time. The answer depends only on the identifier, the
``idFiltering`` switch and the alias list in force (``__pragma__('alias', ...)`` can change that
list), so it is remembered under exactly those three; the JavaScript written for the core is
byte-identical to an unpatched run (``tests/test_transpile.py`` compares the two).

Transcrypt's ``math`` module (transcrypt/modules/math/__init__.py) is written for a run without
``-k``: it switches keyword arguments on around ``isclose`` only and off again after it. Under our
``-k`` its first functions (``log``, ``log2``, ``log10``, ``expm1``, ``log1p``, ``degrees``,
``radians``, ``copysign``) were compiled with a prologue that inspects ``arguments`` for keyword
arguments on every call: ``math.log`` cost several times ``Math.log`` (the filament solver calls it
about 140,000 times per solve). Here ``math`` is compiled as its authors meant, every other module
as the flags say; the core never passes keywords to ``math`` (tests/core/test_subset.py). Everything
else is Transcrypt's own ``__main__``, loaded by path so its module search is the one ``python -m
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


# Transcrypt's own modules compiled as they are written for a run without -k
PLAIN_ARGUMENT_MODULES = ("math",)


def _plain_arguments(generator_init, utils):
    def __init__(self, module):  # noqa: N807  (Transcrypt's Generator.__init__ generates the module)
        if module.name not in PLAIN_ARGUMENT_MODULES:
            return generator_init(self, module)
        saved = utils.commandArgs.kwargs
        utils.commandArgs.kwargs = False
        try:
            return generator_init(self, module)
        finally:
            utils.commandArgs.kwargs = saved

    return __init__


def _patch_on_import() -> None:
    """Wrap filterId and Generator.__init__ as soon as Transcrypt's own ``__main__`` has imported its
    compiler."""
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
                module.Generator.__init__ = _plain_arguments(module.Generator.__init__, module.utils)

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
