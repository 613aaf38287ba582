"""calckit: steel beam and welded plate girder design calculations with formulas beside numbers.

The public surface is small; heavy parts (pint, sympy, matplotlib, papermill) load on first use so that
``import calckit`` stays fast. See README.md and DEVELOPERS.md.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from importlib import import_module

from .errors import CalckitError, InputError, UnitsError

__version__ = "0.1.0"

# public name -> module that defines it (imported lazily on first access)
_LAZY = {
    "ureg": "calckit.units",
    "Q_": "calckit.units",
    "steel": "calckit.materials",
    "section": "calckit.sections",
    "IShape": "calckit.sections",
    "PlateGirder": "calckit.sections",
    "BuiltUp": "calckit.sections",
    "Beam": "calckit.analysis",
    "Formula": "calckit.render",
    "pick": "calckit.pick",
    "run": "calckit.batch",
    "verify": "calckit.record",
}

__all__ = ["__version__", "CalckitError", "InputError", "UnitsError", *_LAZY]


def __getattr__(name: str):
    mod = _LAZY.get(name)
    if mod is None:
        raise AttributeError(f"module 'calckit' has no attribute {name!r}")
    value = getattr(import_module(mod), name)
    globals()[name] = value
    return value


def __dir__():
    return sorted(__all__)
