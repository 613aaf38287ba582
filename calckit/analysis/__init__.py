"""Beam analysis: exact shear, moment, slope and deflection of continuous beams, per load case, with
combinations, pattern loading and envelopes.

Sign conventions (one table for the whole package; x runs left to right, y is up):

=====================  ==========================================================================
quantity               positive when
=====================  ==========================================================================
point load P, w        downward (gravity); an uplift load is negative
couple M (``moment``)  clockwise; the bending moment then jumps by +M going left to right
reaction R             upward
reaction moment        clockwise, acting on the beam (a left fixed end under gravity gives R_M < 0)
shear V(x)             the sum of the upward forces left of the section, so dV/dx = -w, dM/dx = V
moment M(x)            sagging (tension at the bottom); hogging moments over supports are negative
slope                  d(deflection)/dx, i.e. the beam goes down as x increases
deflection             downward
=====================  ==========================================================================

Example::

    from calckit import Beam
    b = Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="40000 kN*m**2")
    b.udl("10 kN/m", "D").udl("15 kN/m", "L")
    sol = b.solve()
    sol["D"].M("6 m")                                  # -45 kN*m over the middle support
    u = sol.combine({"D": 1.2, "L": 1.6})              # same API as a case result
    env = sol.envelope(combos)                         # pattern loading of the variable cases

Modules: :mod:`.beam` (model and loads), :mod:`.solver` (exact solution), :mod:`.results`,
:mod:`.envelope` (pattern loading, envelopes), :mod:`.formulas` (closed-form standard cases, sympy,
loaded on demand), :mod:`.diagrams` (matplotlib figures, loaded on demand).

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from ..errors import UnstableError
from .beam import Beam
from .envelope import Envelope, SpanEnvelope, EnvelopeExtreme, envelope
from .loads import Couple, LinearLoad, PointLoad, Support
from .piecewise import Extreme
from .results import BeamResult, BeamSolution, Extrema, Reaction
from .combinations import Combination, combinations, user_combinations
from .patterns import arrangements

__all__ = [
    "Combination", "combinations", "user_combinations", "arrangements",
    "Beam", "BeamSolution", "BeamResult", "Reaction", "Extrema", "Extreme",
    "Envelope", "SpanEnvelope", "EnvelopeExtreme", "envelope",
    "PointLoad", "Couple", "LinearLoad", "Support", "UnstableError",
]
