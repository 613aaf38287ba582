"""Error types of calckit.

Every error raised for bad input names the parameter, the value received and what was expected.
A member that fails a design check is *not* an error: it is a result with ``passed = False``.

``CalckitError``   root of all calckit errors
``InputError``     bad value (also a ``ValueError``)
``UnitsError``     wrong or missing unit (also a ``TypeError``)
``UnstableError``  the structure is a mechanism (an ``InputError``)
``NotCoveredError`` the standard's clause that would apply is not implemented (also ``NotImplementedError``)
"""
from __future__ import annotations

__all__ = ["CalckitError", "InputError", "UnitsError", "UnstableError", "NotCoveredError"]


class CalckitError(Exception):
    """Root of every error calckit raises on purpose."""


class InputError(ValueError, CalckitError):
    """An input value is out of range, inconsistent or unknown."""


class UnitsError(TypeError, CalckitError):
    """An input has the wrong dimension, or a bare number was given where a unit is needed."""


class UnstableError(InputError):
    """The beam (or structure) is a mechanism: supports and hinges do not prevent rigid-body motion."""


class NotCoveredError(NotImplementedError, CalckitError):
    """The case needs a clause of the standard that calckit does not implement (the message says which)."""


def bad(name: str, got: object, expected: str) -> InputError:
    """Build the standard InputError message: ``name: got <value>; expected <what>``."""
    return InputError(f"{name}: got {got!r}; expected {expected}")
