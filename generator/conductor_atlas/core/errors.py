"""The core's one exception type, readable from both CPython and the transpiled JS."""


class CoreError(Exception):
    """A user-facing problem with an input (bad unit, out-of-range value, unknown name).

    ``field`` names the input that caused it (e.g. "length") or "" when none applies.
    """

    def __init__(self, message, field=""):
        Exception.__init__(self, message)
        self.message = message
        self.field = field

    def __str__(self):
        return self.message

    def toString(self):  # noqa: N802 - JS reads exceptions through toString()
        return "CoreError: " + self.message
