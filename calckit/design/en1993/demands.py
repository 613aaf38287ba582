"""Demands along a member for the EN 1993 member check, prepared once and reused for every section.

:func:`demands` turns the member's moment and shear (arrays or analysis results), its lateral-torsional
restraints, the transverse forces and the deflections into a frozen :class:`Demands` record. None of it
depends on the section, so a section search builds it once and calls
``check_member(section, steel, demands=D, steps=False)`` for each candidate; the moment diagram of each
LTB segment, with its energy matrices (:class:`.mcr.Shape`, or the cantilever model of
:mod:`.cantilever`), is then set up only once.

LTB segments (EN 1993-1-1 6.3.2):

- between consecutive restraints: fork supports, C1/C2/C3 from the segment's own moment diagram;
- beyond the first or last restraint (an overhang, free end): with another restraint behind the root
  (``overhang_root="continuous"``, default) the overhang is solved together with the segment behind its
  root support; with no other restraint, or ``overhang_root="fixed"``, the root is taken as built in
  (lateral bending and warping prevented) - unconservative for an overhang over a support unless the
  support really gives that fixity.

With envelope inputs ((max, min) pairs) a segment uses the envelope curve with the larger peak as its
moment diagram (common practice; noted in the result).
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any, Iterable, Mapping

import numpy as np

from ...errors import InputError
from .cantilever import OverhangModel, model as cantilever_model
from .ltb import Diagram, _from_arrays

__all__ = ["Force", "LTBSegment", "ForceDemand", "Demands", "demands", "from_analysis"]


@dataclass(frozen=True)
class Force:
    """A transverse force on the web: position ``x`` (m), magnitude ``F`` (N; None = the reaction at x
    from the analysis), stiff bearing length ``ss`` (m), ``load_type`` "a"/"b"/"c", ``c`` end distance (m,
    type c), ``flange`` "top"/"bottom", ``stiffened`` (a bearing stiffener there: the web check is replaced
    by the stiffener design, which calckit does not cover)."""

    x: float
    ss: float
    F: float | None = None
    load_type: str = "a"
    c: float | None = None
    flange: str = "top"
    stiffened: bool = False
    name: str = ""


@dataclass(frozen=True)
class LTBSegment:
    """One lateral-torsional buckling segment and its moment diagram (SI floats)."""

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


@dataclass(frozen=True)
class ForceDemand:
    """A transverse force with its magnitude resolved and the coexisting moment at its position."""

    force: Force
    F: float  #: magnitude (N)
    M: float  #: largest |M| at x (N m)
    sagging: bool  #: that moment is sagging


@dataclass(frozen=True)
class Demands:
    """Section-independent demands of one member (see the module docstring); arrays are SI."""

    x: np.ndarray = field(repr=False)  #: stations (m)
    M_max: np.ndarray = field(repr=False)  #: largest M at each station (N m, sagging positive)
    M_min: np.ndarray = field(repr=False)  #: smallest M at each station
    V_abs: np.ndarray = field(repr=False)  #: largest |V| at each station (N)
    has_sag: bool  #: some sagging moment (or no moment at all)
    has_hog: bool  #: some hogging moment
    i_v: int  #: station of the largest |V|
    M_at_v: float  #: largest |M| there (N m)
    zg: float  #: load height above the shear centre (m)
    k: float  #: end restraint factors of the segments between restraints
    kw: float
    continuous: bool  #: compression flange restrained throughout: no LTB check
    segments: tuple[LTBSegment, ...]
    forces: tuple[ForceDemand, ...]
    stiffened: tuple[float, ...]  #: positions of forces taken by bearing stiffeners (not checked)
    deflections: tuple  #: (name, kind, values) per serviceability case
    span: float  #: span for the deflection limits (m)
    combination: str
    notes: tuple[str, ...]  #: assumptions made while preparing the demands
    _memo: dict = field(default_factory=dict, repr=False, compare=False)  #: section-independent results

    @property
    def length(self) -> float:
        return float(self.x[-1] - self.x[0])


def _si(v, dim: str, name: str, *, positive: bool = False, allow_none: bool = False, signed: bool = False):
    """check_member's plain-data rule: a bare number is an SI value; quantities and strings are converted."""
    if v is None:
        if allow_none:
            return None
        raise InputError(f"{name}: no value given")
    if isinstance(v, bool):
        raise InputError(f"{name}: got {v!r}; expected a number (SI) or a quantity")
    if isinstance(v, (int, float, np.floating, np.integer)):
        x = float(v)
    else:
        from ...units import to_si

        x = float(to_si(v, dim, name, allow_array=False))
    if not math.isfinite(x) or (not signed and (x < 0 or (positive and x == 0))):
        raise InputError(f"{name}: got {v!r}; expected a finite value {'> 0' if positive else '>= 0'} (SI)")
    return x


def _force(f: Any, i: int) -> Force:
    if isinstance(f, Force):
        return f
    if not isinstance(f, Mapping):
        raise InputError(f"forces[{i}]: got {f!r}; expected a Force or a dict with x, ss, F, load_type ...")
    known = {"x", "ss", "F", "load_type", "c", "flange", "stiffened", "name"}
    bad = set(f) - known
    if bad:
        raise InputError(f"forces[{i}]: got the key {sorted(bad)[0]!r}; expected keys from {sorted(known)}")
    F = f.get("F")
    return Force(x=_si(f.get("x"), "length", f"forces[{i}].x"), ss=_si(f.get("ss"), "length", f"forces[{i}].ss"),
                 F=None if F is None else abs(_si(F, "force", f"forces[{i}].F", signed=True)),
                 load_type=f.get("load_type", "a"), c=_si(f.get("c"), "length", f"forces[{i}].c", allow_none=True),
                 flange=f.get("flange", "top"), stiffened=bool(f.get("stiffened", False)), name=str(f.get("name", "")))


def from_analysis(analysis, n: int = 200):
    """(x, M, V, reactions, name) from a BeamResult, or (x, (M_max, M_min), (V_max, V_min), reactions, names)
    from an Envelope; reactions as {x: |R|} (N)."""
    if hasattr(analysis, "M_max") and hasattr(analysis, "x"):
        # an Envelope carries no support positions: give F for each force explicitly
        x = np.asarray(analysis.x, float)
        return (x, (np.asarray(analysis.M_max, float), np.asarray(analysis.M_min, float)),
                (np.asarray(analysis.V_max, float), np.asarray(analysis.V_min, float)), {}, "envelope")
    if hasattr(analysis, "M_si") and hasattr(analysis, "layout"):
        L = analysis.layout.L
        xs = np.union1d(np.linspace(0.0, L, n + 1), np.asarray(analysis.grid.x, float))
        M = np.asarray(analysis.M_si(xs), float)
        Vl = np.asarray(analysis.V_si(xs, side="left"), float)
        Vr = np.asarray(analysis.V_si(xs, side="right"), float)
        V = np.where(np.abs(Vl) > np.abs(Vr), Vl, Vr)
        reac = {r.x: abs(r.R) for r in analysis.reactions}
        return xs, M, V, reac, getattr(analysis, "name", "")
    raise InputError(f"analysis: got {type(analysis).__name__}; expected a calckit.analysis BeamResult or Envelope")


def _arrays(x, M, V):
    xa = np.array(x, dtype=float)  # copies: the demands must not change with the caller's arrays
    if xa.ndim != 1 or xa.size < 2 or not (np.diff(xa).min() >= 0 and np.isfinite(xa).all()):
        raise InputError("x: expected at least two stations in increasing order (m)")

    def env(v, name):
        if v is None:
            z = np.zeros_like(xa)
            return z, z
        if isinstance(v, tuple) and len(v) == 2:
            a, b = (np.asarray(u, dtype=float) for u in v)
            if a.shape != xa.shape or b.shape != xa.shape or not (np.isfinite(a).all() and np.isfinite(b).all()):
                raise InputError(f"{name}: expected finite arrays of the same length as x ({xa.size})")
            return np.maximum(a, b), np.minimum(a, b)
        a = np.array(v, dtype=float)
        if a.shape != xa.shape or not np.isfinite(a).all():
            raise InputError(f"{name}: expected finite arrays of the same length as x ({xa.size})")
        return a, a  # one diagram: its own max and min

    return xa, env(M, "M"), env(V, "V")


def _diagram(xs: np.ndarray, M: np.ndarray, L: float, label: str) -> Diagram:
    """:func:`.ltb._from_arrays` for stations already checked here (same diagram, without the checks)."""
    span = xs[-1] - xs[0]
    if abs(span - L) > 0.01 * L or not span > 0:
        return _from_arrays(xs, M, L, label)  # let it raise its message
    xi = (xs - xs[0]) / span
    i = int(np.abs(M).argmax())
    Mmax = float(abs(M[i]))
    if Mmax == 0:
        return _from_arrays(xs, M, L, label)
    return Diagram(lambda q: np.interp(q, xi, M), Mmax, float(M[i]), True, label)


def _cut(xa, Mmax, Mmin, p, q):
    """Stations and both envelope curves over [p, q] (ends interpolated)."""
    if p == xa[0] and q == xa[-1] and xa[1] > p and xa[-2] < q:  # the whole member: the arrays themselves
        return xa, Mmax, Mmin
    inside = (xa > p) & (xa < q)
    xs = np.concatenate(([p], xa[inside], [q]))
    hi = np.concatenate(([np.interp(p, xa, Mmax)], Mmax[inside], [np.interp(q, xa, Mmax)]))
    lo = np.concatenate(([np.interp(p, xa, Mmin)], Mmin[inside], [np.interp(q, xa, Mmin)]))
    return xs, hi, lo


def _forks(xa, Mmax, Mmin, p, q, notes) -> LTBSegment | None:
    xs, hi, lo = _cut(xa, Mmax, Mmin, p, q)
    if hi is not lo and (hi != lo).any():
        Mseg = hi if np.max(np.abs(hi)) >= np.max(np.abs(lo)) else lo
        notes.append(f"segment {p:g}-{q:g} m: LTB uses the envelope curve with the larger peak as the moment "
                     "diagram (common practice; check the governing combination's own diagram where it matters)")
    else:
        Mseg = hi
    peak = float(np.max(np.abs(Mseg)))
    if peak <= 0:
        return None
    L = q - p
    dia = _diagram(xs, Mseg, L, f"M(x) over {p:g}-{q:g} m")
    x_at = float(xs[int(np.argmax(np.abs(Mseg)))])
    return LTBSegment(p, q, "forks", L, peak, x_at, dia.M_peak_signed >= 0, dia)


def _free_end(xa, Mmax, Mmin, root, tip, far, notes) -> LTBSegment | None:
    """An overhang from ``root`` (a restraint) to the free ``tip``; ``far``: the next restraint behind the
    root (None: built-in root)."""
    p, q = min(root, tip), max(root, tip)
    xs, hi, lo = _cut(xa, Mmax, Mmin, p, q)
    use_hi = np.max(np.abs(hi)) >= np.max(np.abs(lo))
    Mseg = hi if use_hi else lo
    env = bool(np.any(hi != lo))
    peak = float(np.max(np.abs(Mseg)))
    if peak <= 0:
        return None
    Lo = q - p
    sgn = 1.0 if tip > root else -1.0
    s = sgn * (xs - root)  # distance from the root
    order = np.argsort(s, kind="stable")
    s, Ms = s[order], Mseg[order]
    dia = _from_arrays(s, Ms, Lo, f"M(x) over the overhang {p:g}-{q:g} m, from the root at {root:g} m")
    x_at = float(xs[order][int(np.argmax(np.abs(Ms)))])
    Mo = (lambda t, s_=s, m_=Ms: np.interp(t, s_, m_))
    back = None
    where = f"{'cantilever' if far is None else 'overhang'} {p:g}-{q:g} m"
    if far is None:
        notes.append(f"{where}: cantilever LTB with a built-in root at {root:g} m (lateral bending and warping "
                     "prevented there); check that the support gives that fixity")
    else:
        bp, bq = min(root, far), max(root, far)
        xb, hb, lb = _cut(xa, Mmax, Mmin, bp, bq)
        Mb = hb if use_hi else lb
        t = np.abs(xb - far)  # distance from the far restraint
        ob = np.argsort(t, kind="stable")
        tb, Mbs = t[ob], Mb[ob]
        back = (bq - bp, lambda u, t_=tb, m_=Mbs: np.interp(u, t_, m_))
        notes.append(f"{where}: LTB of the overhang solved with the segment {bp:g}-{bq:g} m behind its root "
                     f"support (lateral and torsional restraint at {root:g} m and {far:g} m)")
    if env:
        notes.append(f"{where}: LTB uses the envelope curve with the larger overhang peak as the moment diagram "
                     "(common practice)")
    mdl = cantilever_model(Lo, Mo, back)
    return LTBSegment(p, q, "cantilever" if far is None else "overhang", Lo, peak, x_at, dia.M_peak_signed >= 0,
                      dia, mdl, root, None if far is None else (min(root, far), max(root, far)))


def _default_restraints(analysis, notes):
    """None (the member ends), or, for an analysis with a free end, the ends with each free end replaced by
    the nearest support that is not free (a free tip is no lateral-torsional restraint)."""
    sup = getattr(getattr(analysis, "layout", None), "supports", None)
    if not sup:
        return None
    sup = sorted(sup, key=lambda s_: s_.x)
    held = [s_.x for s_ in sup if getattr(s_, "kind", "") != "free"]
    if not held or (getattr(sup[0], "kind", "") != "free" and getattr(sup[-1], "kind", "") != "free"):
        return None
    ends = [sup[0].x if sup[0].kind != "free" else held[0], sup[-1].x if sup[-1].kind != "free" else held[-1]]
    pts = sorted(set(ends))
    notes.append(f"restraints: none given; taken at {', '.join(f'{p:g}' for p in pts)} m (the member's "
                 "restrained ends; a free end is no lateral-torsional restraint)")
    return pts


def demands(*, x=None, M=None, V=None, analysis=None, restraints=None, zg=0, k: float = 1.0, kw: float = 1.0,
            forces: Iterable = (), deflections: Mapping | None = None, span=None, combination: str = "",
            overhang_root: str = "continuous") -> Demands:
    """Build the section-independent :class:`Demands` of a member; arguments as for
    :func:`calckit.design.en1993.check_member` (see there and the module docstring)."""
    reac: dict = {}
    notes: list[str] = []
    if analysis is not None:
        if x is not None or M is not None or V is not None:
            raise InputError("analysis: got analysis results and x/M/V arrays; expected one or the other")
        x, M, V, reac, nm = from_analysis(analysis)
        combination = combination or nm
        if restraints is None:
            restraints = _default_restraints(analysis, notes)
    if x is None or M is None:
        raise InputError("x, M: no values given; pass x and M arrays (SI) or analysis=")
    if overhang_root not in ("continuous", "fixed"):
        raise InputError(f"overhang_root: got {overhang_root!r}; expected 'continuous' (solved with the segment "
                         "behind the root support) or 'fixed' (built-in root)")
    xa, (Mmax, Mmin), (Vmax, Vmin) = _arrays(x, M, V)
    for arr in (xa, Mmax, Mmin, Vmax, Vmin):
        arr.flags.writeable = False
    x0, x1 = float(xa[0]), float(xa[-1])
    Lm = x1 - x0
    tol = 1e-9 * max(Lm, 1)
    zg_ = _si(zg, "length", "zg", signed=True)
    Vabs = np.maximum(np.abs(Vmax), np.abs(Vmin))
    iv = int(np.argmax(Vabs))
    segs: list[LTBSegment] = []
    continuous = isinstance(restraints, str) and restraints == "continuous"
    if isinstance(restraints, str) and not continuous:
        raise InputError(f"restraints: got {restraints!r}; expected positions (m) or 'continuous'")
    if not continuous:
        pts = [x0, x1] if restraints is None else sorted(_si(p, "length", "restraints", signed=True)
                                                         for p in restraints)
        if not pts:
            raise InputError("restraints: got none; expected at least one lateral-torsional restraint position (m) "
                             "or 'continuous'")
        if pts[0] < x0 - tol or pts[-1] > x1 + tol:
            raise InputError(f"restraints: got {pts[0]:g} to {pts[-1]:g} m; expected positions within the member "
                             f"({x0:g} to {x1:g} m)")
        pts = [min(max(p, x0), x1) for p in pts]
        if pts[0] > x0 + tol:
            behind = [p for p in pts if p > pts[0] + tol]
            far = behind[0] if behind and overhang_root == "continuous" else None
            sg = _free_end(xa, Mmax, Mmin, pts[0], x0, far, notes)
            if sg is not None:
                segs.append(sg)
        for p, q in zip(pts[:-1], pts[1:]):
            if q - p <= 1e-9:
                continue
            sg = _forks(xa, Mmax, Mmin, p, q, notes)
            if sg is not None:
                segs.append(sg)
        if pts[-1] < x1 - tol:
            behind = [p for p in pts if p < pts[-1] - tol]
            far = behind[-1] if behind and overhang_root == "continuous" else None
            sg = _free_end(xa, Mmax, Mmin, pts[-1], x1, far, notes)
            if sg is not None:
                segs.append(sg)
        if any(sg.kind != "forks" for sg in segs) and (k != 1.0 or kw != 1.0):
            notes.append("k, k_w apply to the segments between restraints only (not to the overhangs)")
    fds: list[ForceDemand] = []
    stiff: list[float] = []
    for i, f in enumerate(forces):
        f = _force(f, i)
        F = f.F
        if F is None:
            near = [r for xr, r in reac.items() if abs(xr - f.x) <= 1e-6 * max(Lm, 1)]
            if not near:
                raise InputError(f"forces[{i}].F: no value given and no reaction at x = {f.x:g} m from the analysis")
            F = near[0]
        if f.stiffened:
            notes.append(f"force at x = {f.x:g} m: bearing stiffener assumed; its design is not covered by calckit")
            stiff.append(f.x)
            continue
        hi, lo = float(np.interp(f.x, xa, Mmax)), float(np.interp(f.x, xa, Mmin))
        fds.append(ForceDemand(f, float(F), max(abs(hi), abs(lo)), hi >= -lo))
    defl = []
    for name, v in (deflections or {}).items():
        kind = "total"
        if isinstance(v, tuple) and len(v) == 2 and isinstance(v[0], str):
            kind, v = v
        defl.append((str(name), kind, v))
    Ls = _si(span, "span", "span", positive=True) if span is not None else Lm
    return Demands(x=xa, M_max=Mmax, M_min=Mmin, V_abs=Vabs,
                   has_sag=bool(np.max(Mmax) > 0) or not bool(np.min(Mmin) < 0), has_hog=bool(np.min(Mmin) < 0),
                   i_v=iv, M_at_v=float(max(abs(Mmax[iv]), abs(Mmin[iv]))), zg=zg_, k=float(k), kw=float(kw),
                   continuous=continuous, segments=tuple(segs), forces=tuple(fds), stiffened=tuple(stiff),
                   deflections=tuple(defl), span=Ls, combination=combination, notes=tuple(notes))
