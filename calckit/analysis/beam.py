"""Beam model: spans, supports, hinges, flexural rigidity and loads by named load case.

Sign conventions (x runs left to right from the left end of the beam, y is up):

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

Solution method: exact integration of the equilibrium equations with the reactions, the end
deflection and slope, and the hinge rotations as unknowns (see :mod:`calckit.analysis.solver`).
Euler-Bernoulli beam: shear deformation and axial effects are not included.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from typing import Iterable, Sequence

import numpy as np

from ..errors import InputError, UnitsError
from .loads import Couple, LinearLoad, PointLoad, Support, check_case, parse_support
from .results import BeamSolution
from .solver import SNAP_REL, Layout, check_stability, make_grid, solve_batch

__all__ = ["Beam", "G_STANDARD"]

#: Standard acceleration of gravity (m/s2), for self-weight (ISO 80000-3; CGPM 1901).
G_STANDARD = 9.80665


def _listify(v, n: int, name: str) -> list:
    if isinstance(v, (list, tuple)):
        if len(v) != n:
            raise InputError(f"{name}: got {len(v)} values; expected one per span ({n})")
        return list(v)
    return [v] * n


class Beam:
    """A straight beam of one or more spans on supports, with loads in named load cases.

    Parameters
    ----------
    spans: span lengths, e.g. ``["6 m", "8 m"]`` or ``"35 ft"`` for one span (overhangs and
        cantilevers are spans too, ending at a 'free' support).
    supports: one per span end (len(spans) + 1): "pin", "roller", "fixed", "free" or a vertical spring
        stiffness quantity (e.g. "50 kN/mm").
    EI: flexural rigidity (quantity, e.g. "2.3e5 kN*m**2"), one value or one per span.
    hinges: internal hinge positions from the left end (quantities), optional.
    section, steel: instead of EI, section and steel objects (one or one per span);
        EI = steel.si.E * section.si.Ix. With EI given as well, ``section`` only serves self_weight().
    name: label for calc sheets.

    Geometry is fixed at construction (a mechanism raises :class:`calckit.errors.UnstableError` there);
    loads are added with :meth:`point`, :meth:`moment`, :meth:`udl`, :meth:`linear` and
    :meth:`self_weight`, each returning the beam so that calls can be chained. Load records are
    immutable; :attr:`loads` is a tuple.
    """

    def __init__(self, spans, supports: Sequence, EI=None, hinges: Iterable | None = None, *,
                 section=None, steel=None, name: str = ""):
        from ..units import is_quantity, to_si

        if is_quantity(spans) and np.ndim(spans.magnitude) == 1:
            spans = list(spans)
        elif isinstance(spans, str) or not isinstance(spans, (list, tuple)):
            spans = [spans]
        if len(spans) == 0:
            raise InputError("spans: got an empty list; expected at least one span length")
        L = []
        for i, s in enumerate(spans):
            v = to_si(s, "span", f"spans[{i}]", allow_array=False)
            if not v > 0:
                raise InputError(f"spans[{i}]: got {s!r}; expected a span length > 0")
            L.append(float(v))
        n = len(L)
        nodes = tuple(float(v) for v in np.concatenate(([0.0], np.cumsum(L))))
        if not isinstance(supports, (list, tuple)):
            raise InputError(f"supports: got {supports!r}; expected a list with one support per span end ({n + 1})")
        if len(supports) != n + 1:
            raise InputError(f"supports: got {len(supports)} supports for {n} span(s); expected {n + 1} "
                             "(one per span end, 'free' for a cantilever tip or overhang end)")
        sup = tuple(parse_support(s, i, nodes[i]) for i, s in enumerate(supports))

        self.sections = None if section is None else tuple(_listify(section, n, "section"))
        self.steel = None if steel is None else tuple(_listify(steel, n, "steel"))
        if EI is None:
            if self.sections is None or self.steel is None:
                raise InputError("EI: got nothing; expected EI (e.g. '2.3e5 kN*m**2') or both section= and steel=")
            ei = []
            for i, (sec, st) in enumerate(zip(self.sections, self.steel)):
                try:
                    ei.append(float(st.si.E) * float(sec.si.Ix))
                except AttributeError:
                    raise InputError(f"section/steel[{i}]: got {sec!r} / {st!r}; expected calckit section and "
                                     "steel objects (with .si.Ix and .si.E)") from None
        else:
            ei = [to_si(v, "flexural_rigidity", f"EI[{i}]" if n > 1 else "EI", allow_array=False)
                  for i, v in enumerate(_listify(EI, n, "EI"))]
        for i, v in enumerate(ei):
            if not v > 0:
                raise InputError(f"EI{f'[{i}]' if n > 1 else ''}: got {v!r} N*m**2; expected a flexural rigidity > 0")

        Ltot = nodes[-1]
        hin = []
        if hinges is None:
            hinges = []
        elif isinstance(hinges, str) or (is_quantity(hinges) and np.ndim(hinges.magnitude) == 0):
            hinges = [hinges]
        for i, hq in enumerate(list(hinges)):
            xh = float(to_si(hq, "length", f"hinges[{i}]", allow_array=False))
            tol = SNAP_REL * Ltot
            if not tol < xh < Ltot - tol:
                raise InputError(f"hinges[{i}]: got {hq!r}; expected a position strictly inside the beam "
                                 f"(0 to {Ltot:.6g} m); a hinge at an end does nothing")
            for s in sup:
                if s.kind == "fixed" and abs(s.x - xh) <= tol:
                    raise InputError(f"hinges[{i}]: got {hq!r}, at the fixed support {s.index}; use a 'pin' "
                                     "support there instead")
            if any(abs(xh - o) <= tol for o in hin):
                raise InputError(f"hinges[{i}]: got {hq!r}, a second hinge at the same place")
            hin.append(xh)
        self.layout = Layout(nodes, tuple(float(v) for v in ei), sup, tuple(sorted(hin)))
        self.name = name
        check_stability(self.layout)
        self._loads: list = []
        self._solution = None

    # -- geometry ----------------------------------------------------------------------------------
    @property
    def L(self) -> float:
        """Total length (m)."""
        return self.layout.L

    @property
    def spans_si(self) -> tuple[float, ...]:
        """Span lengths (m)."""
        x = self.layout.nodes
        return tuple(x[i + 1] - x[i] for i in range(len(x) - 1))

    @property
    def supports(self) -> tuple[Support, ...]:
        return self.layout.supports

    @property
    def hinges_si(self) -> tuple[float, ...]:
        return self.layout.hinges

    @property
    def EI_si(self) -> tuple[float, ...]:
        """Flexural rigidity per span (N*m2)."""
        return self.layout.EI

    def span_of(self, x: float) -> int:
        """Index of the span holding x (m); a support belongs to the span on its right."""
        nodes = np.asarray(self.layout.nodes)
        return int(np.clip(np.searchsorted(nodes, x + SNAP_REL * self.L, side="right") - 1, 0, len(nodes) - 2))

    # -- loads -------------------------------------------------------------------------------------
    @property
    def loads(self) -> tuple:
        """All load records, in the order added."""
        return tuple(self._loads)

    @property
    def cases(self) -> list[str]:
        """Load case names in the order first used."""
        seen: list[str] = []
        for ld in self._loads:
            if ld.case not in seen:
                seen.append(ld.case)
        return seen

    def loads_in(self, case: str) -> tuple:
        """Load records of one case."""
        if case not in self.cases:
            raise InputError(f"case: got {case!r}; expected one of the beam's load cases {self.cases}")
        return tuple(ld for ld in self._loads if ld.case == case)

    def _add(self, ld):
        self._loads.append(ld)
        self._solution = None
        return self

    def _pos(self, value, what: str, name: str) -> float:
        from ..units import to_si

        try:
            x = float(to_si(value, "length", name, allow_array=False))
        except UnitsError as exc:
            raise UnitsError(f"{what}: {exc}") from None
        L, tol = self.L, SNAP_REL * self.L
        if x < -tol or x > L + tol:
            raise InputError(f"{what}: {name} = {value!r} is outside the beam; expected 0 to {L:.6g} m")
        return min(max(x, 0.0), L)

    def point(self, P, x, case: str) -> "Beam":
        """Point load P (force, downward positive) at x in load case ``case``."""
        from ..units import to_si

        case = check_case(case)
        what = f"point load P = {P!r} (case {case!r})"
        p = float(to_si(P, "force", "P", allow_array=False))
        return self._add(PointLoad(p, self._pos(x, what, "x"), case))

    def moment(self, M, x, case: str) -> "Beam":
        """Concentrated couple M (clockwise positive) at x in load case ``case``."""
        from ..units import to_si

        case = check_case(case)
        what = f"moment M = {M!r} (case {case!r})"
        m = float(to_si(M, "moment", "M", allow_array=False))
        xm = self._pos(x, what, "x")
        for i, xh in enumerate(self.layout.hinges):
            if abs(xh - xm) <= SNAP_REL * self.L:
                raise InputError(f"{what}: x = {x!r} is at hinges[{i}]; a couple at a hinge is ambiguous, "
                                 "apply it just to one side")
        return self._add(Couple(m, xm, case))

    def udl(self, w, case: str, start=None, end=None) -> "Beam":
        """Uniform load w (force/length, downward positive) over the beam or from start to end."""
        from ..units import to_si

        case = check_case(case)
        what = f"udl w = {w!r} (case {case!r})"
        wv = float(to_si(w, "line_load", "w", allow_array=False))
        a = 0.0 if start is None else self._pos(start, what, "start")
        b = self.L if end is None else self._pos(end, what, "end")
        self._check_range(a, b, start, end, what)
        return self._add(LinearLoad(wv, wv, a, b, case, "udl"))

    def linear(self, w1, w2, start, end, case: str) -> "Beam":
        """Load varying linearly from w1 at ``start`` to w2 at ``end`` (triangle or trapezoid)."""
        from ..units import to_si

        case = check_case(case)
        what = f"linear load w1 = {w1!r}, w2 = {w2!r} (case {case!r})"
        a1 = float(to_si(w1, "line_load", "w1", allow_array=False))
        a2 = float(to_si(w2, "line_load", "w2", allow_array=False))
        a = self._pos(start, what, "start")
        b = self._pos(end, what, "end")
        self._check_range(a, b, start, end, what)
        return self._add(LinearLoad(a1, a2, a, b, case, "linear"))

    def _check_range(self, a, b, start, end, what):
        if not b - a > SNAP_REL * self.L:
            raise InputError(f"{what}: end = {end!r} is not after start = {start!r}; expected start < end")

    def self_weight(self, section=None, case: str = "D") -> "Beam":
        """Self-weight section.si.mass * 9.80665 N/m over the whole beam (or per span from the beam's
        sections when ``section`` is None), in case ``case`` (default 'D')."""
        case = check_case(case)
        secs = [section] * self.layout.n_spans if section is not None else self.sections
        if secs is None:
            raise InputError("section: got nothing; expected a section object (the beam was given EI, not section=)")
        nodes = self.layout.nodes
        for i, sec in enumerate(secs):
            try:
                w = float(sec.si.mass) * G_STANDARD
            except AttributeError:
                raise InputError(f"section: got {sec!r}; expected a calckit section (with .si.mass in kg/m)") from None
            if not w > 0:
                raise InputError(f"section: got mass {sec.si.mass!r} kg/m; expected a mass per length > 0")
            self._add(LinearLoad(w, w, nodes[i], nodes[i + 1], case, "self_weight"))
        return self

    # -- solving -----------------------------------------------------------------------------------
    def grid(self, loads=None):
        """Solution grid through supports, hinges and every load position."""
        pos = []
        for ld in (self._loads if loads is None else loads):
            if isinstance(ld, LinearLoad):
                pos += [ld.start, ld.end]
            else:
                pos.append(ld.x)
        return make_grid(self.layout, pos)

    def solve(self) -> BeamSolution:
        """Exact solution for every load case (cached until a load is added)."""
        if self._solution is None:
            cases = self.cases
            if not cases:
                raise InputError("loads: the beam has no loads; add some with point(), udl(), linear(), moment()")
            g = self.grid()
            sets = [[ld for ld in self._loads if ld.case == c] for c in cases]
            batch = solve_batch(self.layout, g, sets)
            self._solution = BeamSolution(self, self.layout, batch, cases, self.loads)
        return self._solution

    def envelope(self, combinations, **kw):
        """Shortcut for ``beam.solve().envelope(combinations, **kw)``."""
        return self.solve().envelope(combinations, **kw)

    def __repr__(self) -> str:
        spans = ", ".join(f"{s:.4g} m" for s in self.spans_si)
        sup = ", ".join(s.kind for s in self.supports)
        return f"Beam(spans=[{spans}], supports=[{sup}], hinges={list(self.hinges_si)}, loads={len(self._loads)})"
