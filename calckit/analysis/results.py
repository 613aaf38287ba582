"""Results of the beam analysis: one load case or a combination (:class:`BeamResult`), and the set of
per-case results that :meth:`calckit.analysis.Beam.solve` returns (:class:`BeamSolution`).

Sign conventions are those of :mod:`calckit.analysis` (deflection downward positive, sagging moment
positive, V = sum of upward forces left of the section). Methods ending in ``_si`` take positions in m
(float or numpy array) and return SI floats; the others take and return pint quantities.

Values that are zero in statics (moment at a pinned end, shear and moment at a free end, deflection at a
support, ...) are returned as exactly 0.0, not as rounding noise: every evaluation and extreme snaps
values below :data:`~calckit.analysis.piecewise.ZERO_REL` of the quantity's scale over the beam, and
the reactions are snapped relative to the total load (:func:`~calckit.analysis.solver.solve_batch`).
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Iterable, Mapping

import numpy as np

from ..errors import InputError
from .piecewise import Extreme, evaluate, extrema, roundoff_scale
from .solver import SNAP_REL, Batch, Grid, Layout

__all__ = ["Reaction", "Extrema", "BeamResult", "BeamSolution", "combination_name"]


@dataclass(frozen=True)
class Reaction:
    """Reaction at one support (SI floats).

    support: support index from the left (0-based); x: position (m); kind: support kind;
    R: vertical reaction (N), upward positive; M: moment reaction on the beam (N*m), clockwise
    positive (0 unless the support is fixed). At a left fixed end under gravity M < 0 (counterclockwise);
    the bending moment in the beam there is M(x) (hogging, negative) in either case.
    """

    support: int
    x: float
    kind: str
    R: float
    M: float = 0.0

    @property
    def force(self):
        """R as a pint quantity (N)."""
        from ..units import quantity

        return quantity(self.R, "force")

    @property
    def moment(self):
        """M as a pint quantity (N*m)."""
        from ..units import quantity

        return quantity(self.M, "moment")


@dataclass(frozen=True)
class Extrema:
    """Exact extreme values over the beam, or over one span when ``span`` is set (SI floats in each
    :class:`~calckit.analysis.piecewise.Extreme`): shear V (N), moment M (N*m, sagging positive),
    slope (rad, d(deflection)/dx) and deflection (m, downward positive)."""

    V_max: Extreme
    V_min: Extreme
    M_max: Extreme
    M_min: Extreme
    slope_max: Extreme
    slope_min: Extreme
    defl_max: Extreme
    defl_min: Extreme
    span: int | None = None

    @property
    def V_abs(self) -> Extreme:
        """The larger in magnitude of V_max and V_min."""
        return self.V_max if abs(self.V_max.value) >= abs(self.V_min.value) else self.V_min

    @property
    def M_abs(self) -> Extreme:
        """The larger in magnitude of M_max and M_min."""
        return self.M_max if abs(self.M_max.value) >= abs(self.M_min.value) else self.M_min

    @property
    def defl_abs(self) -> Extreme:
        """The larger in magnitude of defl_max and defl_min."""
        return self.defl_max if abs(self.defl_max.value) >= abs(self.defl_min.value) else self.defl_min


def combination_name(factors: Mapping[str, float]) -> str:
    """'1.2D + 1.6L' style name for a factor set."""
    parts = []
    for case, f in factors.items():
        if f == 0:
            continue
        mag = abs(f)
        txt = case if mag == 1 else f"{mag:g}{case}"
        parts.append(("- " if f < 0 else "+ ") + txt)
    if not parts:
        return "0"
    s = " ".join(parts)
    return s[2:] if s.startswith("+ ") else "-" + s[2:]


@dataclass(frozen=True, eq=False)
class BeamResult:
    """Exact solution for one load case or a linear combination of cases.

    name: case name or combination name; factors: case -> factor that built it ({case: 1.0} for a
    case); layout, grid: beam geometry and solution nodes; Vc, Mc, phic, deltac: local polynomial
    coefficients (K, n) of V (N), M (N*m), slope (rad) and deflection (m); R, Mr: reactions per support
    (N upward positive; N*m clockwise positive).
    """

    name: str
    factors: dict
    layout: Layout
    grid: Grid
    Vc: np.ndarray = field(repr=False)
    Mc: np.ndarray = field(repr=False)
    phic: np.ndarray = field(repr=False)
    deltac: np.ndarray = field(repr=False)
    R: np.ndarray = field(repr=False)
    Mr: np.ndarray = field(repr=False)

    # -- evaluation, SI floats ---------------------------------------------------------------------
    def _x(self, x):
        xa = np.asarray(x, dtype=float)
        L = self.layout.L
        tol = SNAP_REL * L * 4
        if xa.size and (np.min(xa) < -tol or np.max(xa) > L + tol or np.isnan(xa).any()):
            bad = xa[(xa < -tol) | (xa > L + tol) | np.isnan(xa)].ravel()[0]
            raise InputError(f"x: got {bad:.6g} m; expected a position on the beam, 0 to {L:.6g} m")
        return np.clip(xa, 0.0, L)

    def _eval(self, attr: str, x, side: str):
        """Value of one polynomial at x, round-off below ZERO_REL of its scale over the beam as 0.0
        (:mod:`calckit.analysis.piecewise`; the scale is computed once per result)."""
        cache = self.__dict__.setdefault("_roundoff", {})  # frozen dataclass: cache in the instance dict
        c = getattr(self, attr)
        sc = cache.get(attr)
        if sc is None:
            sc = cache[attr] = roundoff_scale(self.grid.x, c)
        return evaluate(self.grid.x, c, self._x(x), side, scale=sc)

    def V_si(self, x, side: str = "right"):
        """Shear (N) at x (m); at a point load 'left'/'right' picks the side."""
        return self._eval("Vc", x, side)

    def M_si(self, x, side: str = "right"):
        """Bending moment (N*m, sagging positive) at x (m)."""
        return self._eval("Mc", x, side)

    def slope_si(self, x, side: str = "right"):
        """Slope d(deflection)/dx (rad) at x (m); it jumps at hinges."""
        return self._eval("phic", x, side)

    def deflection_si(self, x):
        """Deflection (m, downward positive) at x (m)."""
        return self._eval("deltac", x, "right")

    # -- evaluation, quantities --------------------------------------------------------------------
    def _q(self, fn, x, dim, system, **kw):
        from ..units import quantity, to_si

        return quantity(fn(to_si(x, "length", "x"), **kw), dim, system)

    def V(self, x, side: str = "right", system: str | None = None):
        """Shear at x (quantity or string, e.g. '3 m'); returns a quantity ('SI'/'US' display units)."""
        return self._q(self.V_si, x, "force", system, side=side)

    def M(self, x, side: str = "right", system: str | None = None):
        """Bending moment at x (sagging positive); returns a quantity."""
        return self._q(self.M_si, x, "moment", system, side=side)

    def slope(self, x, side: str = "right", system: str | None = None):
        """Slope d(deflection)/dx at x; returns a quantity in rad."""
        return self._q(self.slope_si, x, "rotation", system, side=side)

    def deflection(self, x, system: str | None = None):
        """Deflection at x (downward positive); returns a quantity."""
        return self._q(self.deflection_si, x, "deflection", system)

    # -- reactions and extrema ---------------------------------------------------------------------
    @property
    def reactions(self) -> tuple[Reaction, ...]:
        """Reaction at every support (zero at 'free' ones)."""
        return tuple(Reaction(s.index, s.x, s.kind, float(self.R[s.index]), float(self.Mr[s.index]))
                     for s in self.layout.supports)

    def span_segments(self, span: int | None = None) -> np.ndarray:
        """Grid segments of the whole beam or of one span."""
        if span is None:
            return np.arange(len(self.grid.h))
        n = self.layout.n_spans
        if not isinstance(span, (int, np.integer)) or not 0 <= span < n:
            raise InputError(f"span: got {span!r}; expected a span index 0 to {n - 1}")
        return np.nonzero(self.grid.span == span)[0]

    def extrema(self, span: int | None = None) -> Extrema:
        """Exact extreme V, M, slope and deflection with positions, over the beam or one span."""
        segs = self.span_segments(span)
        g = self.grid
        out = []
        for c in (self.Vc, self.Mc, self.phic, self.deltac):
            out.extend(extrema(g.x, c, segs, g.span))
        return Extrema(*out, span=span)

    # -- linear algebra ----------------------------------------------------------------------------
    def _lin(self, other: "BeamResult | None", a: float, b: float, name: str, factors: dict) -> "BeamResult":
        if other is None:
            arrs = [a * getattr(self, f) for f in ("Vc", "Mc", "phic", "deltac", "R", "Mr")]
        else:
            if other.grid is not self.grid and not np.array_equal(other.grid.x, self.grid.x):
                raise InputError("results: got results on different grids; combine cases of one solve()")
            arrs = [a * getattr(self, f) + b * getattr(other, f)
                    for f in ("Vc", "Mc", "phic", "deltac", "R", "Mr")]
        return BeamResult(name, factors, self.layout, self.grid, *arrs)

    def scaled(self, factor: float, name: str | None = None) -> "BeamResult":
        """This result times ``factor``."""
        f = {k: v * factor for k, v in self.factors.items()}
        return self._lin(None, float(factor), 0.0, name or combination_name(f), f)


class BeamSolution(Mapping):
    """Per-load-case exact results of one beam (a read-only mapping case name -> :class:`BeamResult`).

    ``combine({"D": 1.2, "L": 1.6})`` gives a combined :class:`BeamResult` with the same API;
    ``envelope(combinations)`` gives an :class:`~calckit.analysis.envelope.Envelope` with pattern loading.
    """

    def __init__(self, beam, layout: Layout, batch: Batch, cases: list[str], loads: tuple):
        self.beam = beam
        self.layout = layout
        self.grid = batch.grid
        self.loads = loads
        self._cases = list(cases)
        self._results = {
            c: BeamResult(c, {c: 1.0}, layout, batch.grid, batch.V[i], batch.M[i], batch.phi[i],
                          batch.delta[i], batch.R[i], batch.Mr[i])
            for i, c in enumerate(cases)
        }

    @property
    def cases(self) -> list[str]:
        """Load case names in the order they were first used."""
        return list(self._cases)

    def __getitem__(self, case: str) -> BeamResult:
        try:
            return self._results[case]
        except KeyError:
            raise InputError(f"case: got {case!r}; expected one of the beam's load cases {self._cases}") from None

    def __iter__(self):
        return iter(self._cases)

    def __len__(self) -> int:
        return len(self._cases)

    def __repr__(self) -> str:
        return f"BeamSolution(cases={self._cases})"

    def zero(self, name: str = "0") -> BeamResult:
        """A result with every value zero on this solution's grid."""
        g = self.grid
        K = len(g.h)
        ns = len(self.layout.supports)
        z = np.zeros
        return BeamResult(name, {}, self.layout, g, z((K, 3)), z((K, 4)), z((K, 5)), z((K, 6)), z(ns), z(ns))

    def combine(self, factors: Mapping[str, float], name: str | None = None,
                missing: str = "error") -> BeamResult:
        """Linear combination sum(factor * case result); exact because the response is linear.

        missing: "error" (default) raises InputError for a case the beam has no loads in; "zero"
        treats such a case as empty (useful with code combinations that list every case).
        """
        if missing not in ("error", "zero"):
            raise InputError(f"missing: got {missing!r}; expected 'error' or 'zero'")
        if not isinstance(factors, Mapping):
            raise InputError(f"factors: got {factors!r}; expected a dict of case name -> factor")
        used = {}
        for case, f in factors.items():
            try:
                f = float(f)
            except (TypeError, ValueError):
                raise InputError(f"factors[{case!r}]: got {f!r}; expected a number") from None
            if case not in self._results:
                if missing == "error":
                    raise InputError(
                        f"factors: got the case {case!r}; expected one of the beam's load cases {self._cases}")
                continue
            used[case] = f
        fac = {c: float(f) for c, f in factors.items()}
        res = self.zero(name or combination_name(fac))
        arrs = {k: getattr(res, k).copy() for k in ("Vc", "Mc", "phic", "deltac", "R", "Mr")}
        for case, f in used.items():
            r = self._results[case]
            for k in arrs:
                arrs[k] += f * getattr(r, k)
        return BeamResult(res.name, fac, self.layout, self.grid, **arrs)

    def envelope(self, combinations: Iterable, **kw):
        """Envelope over combinations with pattern loading: see :func:`calckit.analysis.envelope.envelope`."""
        from .envelope import envelope

        return envelope(self, combinations, **kw)
