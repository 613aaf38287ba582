"""Moment diagrams of the lateral-torsional buckling segments of a member (helper of :mod:`.demands`).

Each LTB segment gets one :class:`LTBSegment` per real moment diagram (one per load combination and
pattern arrangement), cut from the member's arrays at the segment's ends (interpolated) and stations
inside. :class:`SelfWeight` keeps the linear structure a section search needs: for a candidate of
self-weight w the diagram k is M_k = A_k + f_k w U (A_k: the other loads, U: a unit self-weight,
f_k: the permanent-action factor of the diagram), and every diagram-dependent block of the energy
solution of M_cr is linear in the diagram (:meth:`.mcr.Shape.combine`,
:meth:`.cantilever.OverhangModel.combine`), so nothing is rebuilt per candidate but a few small sums.
"""
from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from .cantilever import OverhangModel, model as cantilever_model
from .ltb import Diagram, _from_arrays
from .mcr import Shape, raw_shape

__all__ = ["LTBSegment", "Cut", "FreeEnd", "SelfWeight", "forks_segment", "live_diagrams"]


@dataclass(frozen=True)
class LTBSegment:
    """One lateral-torsional buckling segment under one moment diagram (SI floats)."""

    a: float  #: start (m); for a free-ended segment the smaller of root and tip
    b: float  #: end (m)
    kind: str  #: "forks" (between restraints), "cantilever" (built-in root) or "overhang" (with back segment)
    L: float  #: segment length (m)
    peak: float  #: largest |M| in the segment (N m), the demand of the check
    location: float  #: where it acts (m)
    sagging: bool  #: the peak is sagging (top flange in compression)
    diagram: Diagram = field(repr=False)  #: M over the segment (forks: from a to b; free end: root to tip)
    model: OverhangModel | None = field(default=None, repr=False)  #: energy model of a free-ended segment
    root: float | None = None  #: root position of a free-ended segment (m)
    back: tuple[float, float] | None = None  #: back segment (m, m) of an overhang
    combination: str = ""  #: name of the load combination (and arrangement) of this diagram
    envelope: bool = False  #: the diagram is an envelope curve, not one loading's diagram (C1 approximate)


class Cut:
    """Stations of the range [p, q] of a member (ends interpolated) and the cut of member arrays to it."""

    __slots__ = ("xa", "p", "q", "whole", "inside", "xs", "xi")

    def __init__(self, xa: np.ndarray, p: float, q: float) -> None:
        self.xa, self.p, self.q = xa, p, q
        self.whole = p == xa[0] and q == xa[-1] and xa[1] > p and xa[-2] < q
        if self.whole:
            self.inside, self.xs = None, xa
        else:
            self.inside = (xa > p) & (xa < q)
            self.xs = np.concatenate(([p], xa[self.inside], [q]))
        span = self.xs[-1] - self.xs[0]
        self.xi = (self.xs - self.xs[0]) / span if span > 0 else None

    def __call__(self, M: np.ndarray) -> np.ndarray:
        """The values of the member array ``M`` at the stations of the range."""
        if self.whole:
            return M
        return np.concatenate(([np.interp(self.p, self.xa, M)], M[self.inside], [np.interp(self.q, self.xa, M)]))


def _fork_diagram(cut: Cut, Ms: np.ndarray, label: str, cls=Diagram, *extra) -> Diagram:
    """:func:`.ltb._from_arrays` for stations already checked here (same diagram, without the checks)."""
    L = cut.q - cut.p
    span = cut.xs[-1] - cut.xs[0]
    if cut.xi is None or abs(span - L) > 0.01 * L:
        return _from_arrays(cut.xs, Ms, L, label)  # let it raise its message
    i = int(np.abs(Ms).argmax())
    xi = cut.xi
    d = cls(lambda q, xi=xi, m=Ms: np.interp(q, xi, m), float(abs(Ms[i])), float(Ms[i]), True, label, *extra)
    return d


def forks_segment(cut: Cut, Ms: np.ndarray, name: str = "", envelope: bool = False,
                  dia: Diagram | None = None) -> LTBSegment | None:
    """The segment between restraints [cut.p, cut.q] under the diagram ``Ms`` (values at cut.xs)."""
    j = int(np.abs(Ms).argmax())
    peak = float(abs(Ms[j]))
    if peak <= 0:
        return None
    p, q = cut.p, cut.q
    if dia is None:
        dia = _fork_diagram(cut, Ms, f"M(x) over {p:g}-{q:g} m" + (f", {name}" if name else ""))
    return LTBSegment(p, q, "forks", q - p, peak, float(cut.xs[j]), dia.M_peak_signed >= 0, dia,
                      combination=name, envelope=envelope)


class FreeEnd:
    """An overhang from ``root`` (a restraint) to the free ``tip``; ``far``: the next restraint behind the
    root (None: built-in root). Stations ordered from the root; the back segment from the far restraint."""

    __slots__ = ("root", "tip", "far", "p", "q", "Lo", "cut", "order", "s", "bcut", "border", "tb", "Lb")

    def __init__(self, xa: np.ndarray, root: float, tip: float, far: float | None) -> None:
        self.root, self.tip, self.far = root, tip, far
        self.p, self.q = min(root, tip), max(root, tip)
        self.Lo = self.q - self.p
        self.cut = Cut(xa, self.p, self.q)
        sgn = 1.0 if tip > root else -1.0
        s = sgn * (self.cut.xs - root)  # distance from the root
        self.order = np.argsort(s, kind="stable")
        self.s = s[self.order]
        self.bcut = self.border = self.tb = None
        self.Lb = 0.0
        if far is not None:
            bp, bq = min(root, far), max(root, far)
            self.bcut = Cut(xa, bp, bq)
            t = np.abs(self.bcut.xs - far)  # distance from the far restraint
            self.border = np.argsort(t, kind="stable")
            self.tb = t[self.border]
            self.Lb = bq - bp

    @property
    def where(self) -> str:
        return f"{'cantilever' if self.far is None else 'overhang'} {self.p:g}-{self.q:g} m"

    def arrays(self, M: np.ndarray) -> tuple[np.ndarray, np.ndarray | None]:
        """(M over the overhang from the root, M over the back segment from the far restraint or None)."""
        Mo = self.cut(M)[self.order]
        Mb = None if self.bcut is None else self.bcut(M)[self.border]
        return Mo, Mb

    def _back(self, Mb):
        return None if Mb is None else (self.Lb, lambda u, t_=self.tb, m_=Mb: np.interp(u, t_, m_))

    def model(self, Mo: np.ndarray, Mb: np.ndarray | None) -> OverhangModel:
        return cantilever_model(self.Lo, lambda t, s_=self.s, m_=Mo: np.interp(t, s_, m_), self._back(Mb))

    def raw_model(self, Mo: np.ndarray, Mb: np.ndarray | None) -> OverhangModel:
        return OverhangModel.raw(self.Lo, lambda t, s_=self.s, m_=Mo: np.interp(t, s_, m_), self._back(Mb))

    def segment(self, Mo: np.ndarray, Mb: np.ndarray | None, name: str = "", envelope: bool = False,
                mdl: OverhangModel | None = None) -> LTBSegment | None:
        j = int(np.abs(Mo).argmax())
        peak = float(abs(Mo[j]))
        if peak <= 0:
            return None
        label = f"M(x) over the overhang {self.p:g}-{self.q:g} m, from the root at {self.root:g} m"
        dia = Diagram(lambda q, s_=self.s / self.Lo, m_=Mo: np.interp(q, s_, m_), peak, float(Mo[j]), True,
                      label + (f", {name}" if name else ""))
        if mdl is None:
            mdl = self.model(Mo, Mb)
        x_at = float(self.cut.xs[self.order][j])
        far = self.far
        return LTBSegment(self.p, self.q, "cantilever" if far is None else "overhang", self.Lo, peak, x_at,
                          dia.M_peak_signed >= 0, dia, mdl, self.root,
                          None if far is None else (min(self.root, far), max(self.root, far)), name, envelope)


def _proportional(a: np.ndarray, b: np.ndarray, tol: float = 1e-9):
    """alpha with a = alpha b (to ``tol`` of the norms), or None; b must not be zero."""
    bb = float(b @ b)
    alpha = float(a @ b) / bb
    r = a - alpha * b
    return alpha if float(r @ r) <= (tol * tol) * max(float(a @ a), bb) else None


def live_diagrams(vecs, unit: np.ndarray | None = None, f=None) -> list[int]:
    """Indices of the diagrams of one LTB range that can govern its check for every self-weight w >= 0.

    ``vecs``: the other loads' moments A_k over the range (a vector per diagram), ``unit``: the unit
    self-weight's moments U there (None: no self-weight term), ``f``: the self-weight factors. Diagram k
    is dominated by j (left out) when, for every w >= 0, A_k + f_k w U = c (A_j + f_j w U) with
    0 <= c <= 1: the same shape, so the same C1 (or cantilever M_cr) and a smaller peak, hence a smaller
    or equal ratio for every section. Two cases are recognised exactly: (A_k, f_k) = alpha (A_j, f_j)
    with 0 < alpha <= 1; or A_k, A_j and U all of one shape S, A = a S, with 0 <= a_k + f_k w u <= a_j +
    f_j w u for all w (or the mirror for negative moments). Exact duplicates keep the first."""
    K = len(vecs)
    f = np.zeros(K) if f is None else np.asarray(f, dtype=float)
    if unit is not None and not np.any(unit):
        unit = None
    coef = [None] * K  # a_k and the shape test against U
    if unit is not None:
        uu = float(unit @ unit)
        S = unit / np.sqrt(uu)
        for k, v in enumerate(vecs):
            a = _proportional(v, S) if np.any(v) else 0.0
            coef[k] = a
    zero = [not np.any(v) and (unit is None or f[k] == 0) for k, v in enumerate(vecs)]

    def dominated(k: int, j: int) -> bool:
        if zero[j]:
            return False
        vk, vj = vecs[k], vecs[j]
        if np.any(vj):  # (A_k, f_k) = alpha (A_j, f_j)
            al = _proportional(vk, vj) if np.any(vk) else 0.0
            if al is not None and 0 < al <= 1 + 1e-12 and abs(f[k] - al * f[j]) <= 1e-12 * max(abs(f[j]), 1.0):
                return al < 1 - 1e-12 or j < k or abs(f[k] - f[j]) > 0
        elif np.any(vk):
            return False
        if unit is not None and coef[k] is not None and coef[j] is not None:
            ak, aj = coef[k], coef[j]
            if ak >= 0 and f[k] >= 0 and ak <= aj and f[k] <= f[j]:
                return (ak, f[k]) != (aj, f[j]) or j < k
            if ak <= 0 and f[k] <= 0 and ak >= aj and f[k] >= f[j]:
                return (ak, f[k]) != (aj, f[j]) or j < k
        return False

    return [k for k in range(K) if not zero[k] and not any(dominated(k, j) for j in range(K) if j != k)]


class _Combined(Diagram):
    """A diagram A + c U whose energy Shape is summed from the raw Shapes of A and U when first asked
    (exact: the blocks are linear in the diagram); other end conditions fall back to a fresh Shape."""

    __slots__ = ("terms", "kk")

    def __init__(self, fn, Mmax, M_peak_signed, scaled, label, terms, kk) -> None:
        super().__init__(fn, Mmax, M_peak_signed, scaled, label)
        self.terms, self.kk = terms, kk

    def _shape(self, k, kw):
        if (k, kw) == self.kk and (k, kw) not in self.shapes:  # raw Shapes summed, then as any Diagram
            get_A, get_U, c = self.terms
            self.shapes[(k, kw)] = Shape.combine2(1.0 / self.Mmax, get_A(), c / self.Mmax, get_U())
        return super()._shape(k, kw)


class SelfWeight:
    """Diagrams M_k = A_k + f_k w U of a member whose self-weight w is not yet known (module docstring).

    ``A_M``, ``A_V`` (K, S): moment and shear of the other loads per diagram; ``U_M``, ``U_V`` (S,): of
    a unit self-weight (1 N/m); ``f`` (K,): the factor of the self-weight in each diagram; ``ranges``:
    the LTB ranges, (Cut) for a segment between restraints or (FreeEnd); ``kk``: (k, k_w) of the member;
    ``R_A`` (K, P), ``R_U`` (P,), ``R_x`` (P,): reactions (N) at the supports, or None.
    """

    def __init__(self, A_M, U_M, A_V, U_V, f, ranges, kk, R=None) -> None:
        self.A_M, self.U_M, self.A_V, self.U_V = A_M, U_M, A_V, U_V
        self.f = np.asarray(f, dtype=float)
        self.kk = kk
        self.R = R
        self.ranges = []
        for rg in ranges:
            if isinstance(rg, FreeEnd):
                parts = [rg.arrays(A) for A in A_M]
                unit = rg.arrays(U_M)
                flat = [np.concatenate([Mo] + ([] if Mb is None else [Mb])) for Mo, Mb in parts]
                uflat = np.concatenate([unit[0]] + ([] if unit[1] is None else [unit[1]]))
            else:
                parts = [rg(A) for A in A_M]
                unit = rg(U_M)
                flat, uflat = parts, unit
            live = live_diagrams(flat, uflat, self.f)
            self.ranges.append((rg, parts, unit, {}, live))

    def moments(self, w: float) -> tuple[np.ndarray, np.ndarray]:
        """(M (K, S), V (K, S)) for the self-weight w (N/m)."""
        c = (self.f * w)[:, None]
        return self.A_M + c * self.U_M[None, :], self.A_V + c * self.U_V[None, :]

    def reactions(self, w: float):
        """(x (P,), R (K, P)) for the self-weight w, or None."""
        if self.R is None:
            return None
        x, RA, RU = self.R
        return x, RA + (self.f * w)[:, None] * RU[None, :]

    def _raw(self, cache: dict, key, build):
        r = cache.get(key)
        if r is None:
            r = cache[key] = build()
        return r

    def segments(self, w: float, names) -> list[LTBSegment]:
        """Every range's segment under every diagram (zero diagrams left out), for self-weight w."""
        out = []
        k, kw = self.kk
        for rg, parts, unit, cache, live in self.ranges:
            if isinstance(rg, FreeEnd):
                Uo, Ub = unit
                rU = self._raw(cache, "U", lambda: rg.raw_model(Uo, Ub))
                for i in live:
                    Ao, Ab = parts[i]
                    c = float(self.f[i] * w)
                    Mo = Ao + c * Uo if c else Ao
                    Mb = None if Ab is None else (Ab + c * Ub if c else Ab)
                    if not np.any(Mo):
                        continue
                    rA = self._raw(cache, i, lambda Ao=Ao, Ab=Ab: rg.raw_model(Ao, Ab))
                    mdl = OverhangModel.combine([(1.0, rA), (c, rU)])
                    sg = rg.segment(Mo, Mb, names[i], mdl=mdl)
                    if sg is not None:
                        out.append(sg)
                continue
            def get_U(cache=cache, rg=rg, unit=unit):  # raw Shapes built when first needed (then kept)
                return self._raw(cache, "U", lambda: raw_shape(lambda q: np.interp(q, rg.xi, unit), k, kw))

            if not live:
                continue
            stack = self._raw(cache, "stack", lambda parts=parts, live=live: np.array([parts[i] for i in live]))
            cs = self.f[live] * w
            Ms_all = stack + cs[:, None] * unit[None, :]
            am = np.abs(Ms_all)
            jj = am.argmax(axis=1)
            rows = np.arange(len(live))
            peaks, signed, at = am[rows, jj].tolist(), Ms_all[rows, jj].tolist(), rg.xs[jj].tolist()
            p, q, xi = rg.p, rg.q, rg.xi
            fixed = cache.get(("fixed", names))  # per diagram: its label and raw-Shape getter (w-independent)
            if fixed is None:
                fixed = cache[("fixed", names)] = {}
                for i in live:
                    def get_A(cache=cache, rg=rg, i=i, A=parts[i]):
                        return self._raw(cache, i, lambda: raw_shape(lambda q: np.interp(q, rg.xi, A), k, kw))

                    fixed[i] = (f"M(x) over {p:g}-{q:g} m" + (f", {names[i]}" if names[i] else ""), get_A)
            kk = (k, kw)
            for t, i in enumerate(live):
                pk = peaks[t]
                if pk == 0:
                    continue
                label, get_A = fixed[i]
                sv = signed[t]
                dia = _Combined(lambda z, xi=xi, m=Ms_all[t]: np.interp(z, xi, m), pk, sv, True, label,
                                (get_A, get_U, float(cs[t])), kk)
                out.append(_forks(p, q, pk, at[t], sv >= 0, dia, names[i]))
        return out


_SEG_DEFAULTS = {"model": None, "root": None, "back": None, "envelope": False}


def _forks(p: float, q: float, peak: float, at: float, sagging: bool, dia, name: str) -> LTBSegment:
    """LTBSegment(p, q, "forks", q - p, peak, at, sagging, dia, combination=name), built without the frozen
    dataclass's per-field checks (a section search makes many)."""
    sg = object.__new__(LTBSegment)
    d = sg.__dict__
    d.update(a=p, b=q, kind="forks", L=q - p, peak=peak, location=at, sagging=sagging, diagram=dia,
             combination=name)
    d.update(_SEG_DEFAULTS)
    return sg
