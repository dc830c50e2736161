"""Errors a user can cause (bad data, bad options). The CLI prints them as one line each, with
no traceback, and exits non-zero."""


class AtlasError(Exception):
    """Base class of every user-facing error of the generator."""


class DataError(AtlasError, ValueError):
    """The data set failed validation. ``problems`` holds every "file: field: message" line."""

    def __init__(self, problems):
        self.problems = list(problems)
        count = len(self.problems)
        noun = "problem" if count == 1 else "problems"
        super().__init__(f"{count} {noun} in the data:\n" + "\n".join(self.problems))


class BuildError(AtlasError, RuntimeError):
    """A build stage could not finish (transpiler failed, output folder busy, ...)."""
