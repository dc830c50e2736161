"""The core's one exception type, readable from both CPython and the transpiled JS, and the one check
that raises it for a quantity that must be positive."""


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


# __pragma__ ('nokwargs')
def check_positive(x, field, what):
    """Raise CoreError(field) unless x is a finite number above 0 (NaN and ±∞ are refused too).

    Examples
    --------
    >>> check_positive(2.5e-3, "radius", "the radius")
    >>> try:
    ...     check_positive(float("nan"), "radius", "the radius")
    ... except CoreError as problem:
    ...     print(problem.field + ": " + problem.message)
    radius: the radius must be a finite number above 0
    """
    if not (x - x == 0) or x <= 0.0:
        raise CoreError(what + " must be a finite number above 0", field)
# __pragma__ ('kwargs')
