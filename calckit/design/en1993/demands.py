"""Demands along a member for the EN 1993 member check, prepared once and reused for every section.

:func:`demands` turns the member's moment and shear (arrays or analysis results), its lateral-torsional
restraints, the transverse forces and the deflections into a frozen :class:`Demands` record. None of it
depends on the section, so a section search builds it once and calls
``check_member(section, steel, demands=D, steps=False)`` for each candidate; the moment diagram of each
LTB segment, with its energy matrices (:class:`.mcr.Shape`, or the cantilever model of
:mod:`.cantilever`), is then set up only once.

Inputs (one of):

- the real moment diagram of every load arrangement (recommended): ``analysis=`` a dict or list of
  :class:`calckit.analysis.BeamResult` - e.g. ``calckit.analysis.arrangements(solution, combinations)``,
  one per combination and pattern arrangement - or ``M=`` / ``V=`` dicts {name: array on x}. Bending,
  shear and bending with shear take the worst at each station over the diagrams (the envelope); the
  lateral-torsional buckling of each segment is checked under EACH diagram with its own C1, C2 and
  M_Ed, and the governing diagram's name is reported;
- one diagram: a BeamResult, or ``M`` and ``V`` arrays;
- an envelope: a :class:`calckit.analysis.Envelope`, or ``(max, min)`` pairs of arrays. An envelope is
  not a moment diagram (its maximum and minimum at each station may come from different loadings), so
  a segment's C1 is then taken from the envelope curve with the larger peak in the segment: an
  approximation, possibly unconservative (for the propped cantilever of
  tests/test_en1993_member_diagrams.py calckit finds C1 = 5.3 from the envelope curve against 2.25 from
  the real diagram), and noted in the result.

LTB segments (EN 1993-1-1 6.3.2):

- between consecutive restraints: fork supports, C1/C2/C3 from the segment's own moment diagram;
- beyond the first or last restraint (an overhang, free end): with another restraint behind the root
  (``overhang_root="continuous"``, default) the overhang is solved together with the segment behind its
  root support (same diagram); with no other restraint, or ``overhang_root="fixed"``, the root is taken
  as built in (lateral bending and warping prevented) - unconservative for an overhang over a support
  unless the support really gives that fixity.

Section search with self-weight: ``self_weight=(M_unit, V_unit, factors)`` gives the moment and shear of
a unit self-weight (1 N/m over the member; arrays on x, or a BeamResult) and its factor in each diagram;
the diagrams given are then those of the other loads, and :meth:`Demands.with_self_weight` returns the
demands for a candidate of self-weight w without rebuilding anything (M_k = A_k + f_k w U is linear, and
so are the diagram-dependent energy matrices; see :mod:`._diagrams`).
"""
from __future__ import annotations

import copy
import math
from dataclasses import dataclass, field
from typing import Any, Iterable, Mapping

import numpy as np

from ...errors import InputError
from ._diagrams import Cut, FreeEnd, LTBSegment, SelfWeight, forks_segment, live_diagrams

__all__ = ["Force", "LTBSegment", "ForceDemand", "Demands", "demands", "from_analysis"]

#: stations per member of a sampled BeamResult (with every node of its solution grid added)
N_SAMPLE = 200


@dataclass(frozen=True)
class Force:
    """A transverse force on the web: position ``x`` (m), magnitude ``F`` (N; None = the reaction at x
    from the analysis), stiff bearing length ``ss`` (m), ``load_type`` "a"/"b"/"c", ``c`` end distance (m,
    type c), ``flange`` "top"/"bottom", ``stiffened`` (a pair of bearing stiffeners there: the web check
    of EN 1993-1-5 section 6 is replaced by the stiffener checks of section 9, the given ``stiffener``
    (b_s, t_s[, clip]) in m, or the thinnest passing pair sized when it is None)."""

    x: float
    ss: float
    F: float | None = None
    load_type: str = "a"
    c: float | None = None
    flange: str = "top"
    stiffened: bool = False
    name: str = ""
    stiffener: tuple | None = None


@dataclass(frozen=True)
class ForceDemand:
    """A transverse force with its magnitude resolved and the coexisting moment at its position."""

    force: Force
    F: float  #: magnitude (N)
    M: float  #: largest |M| at x (N m)
    sagging: bool  #: that moment is sagging
    combination: str = ""  #: diagram giving F (a reaction taken from the analysis), if known


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
    segments: tuple[LTBSegment, ...]  #: per LTB segment and diagram (one diagram per segment: envelope input)
    forces: tuple[ForceDemand, ...]
    stiffened: tuple[ForceDemand, ...]  #: forces taken by bearing stiffeners (EN 1993-1-5 section 9)
    deflections: tuple  #: (name, kind, values) per serviceability case
    span: float  #: span for the deflection limits (m)
    combination: str
    notes: tuple[str, ...]  #: assumptions made while preparing the demands
    diagram_names: tuple[str, ...] = ()  #: names of the diagrams (combinations) the by-arrays index
    M_max_by: np.ndarray | None = field(default=None, repr=False)  #: diagram giving M_max at each station
    M_min_by: np.ndarray | None = field(default=None, repr=False)  #: diagram giving M_min
    V_by: np.ndarray | None = field(default=None, repr=False)  #: diagram giving V_abs
    envelope: bool = False  #: the moments are envelope curves: LTB's C1 from an envelope curve (approximate)
    self_weight: float | None = None  #: self-weight included by :meth:`with_self_weight` (N/m)
    _sw: SelfWeight | None = field(default=None, repr=False, compare=False)  #: self-weight precomputation
    _memo: dict = field(default_factory=dict, repr=False, compare=False)  #: section-independent results

    @property
    def length(self) -> float:
        return float(self.x[-1] - self.x[0])

    def name_of(self, by: np.ndarray | None, i: int, default: str = "") -> str:
        """Name of the diagram governing station ``i`` of a by-array (``default`` when not known)."""
        if by is None or not self.diagram_names:
            return default
        return self.diagram_names[int(by[i])] or default

    def with_self_weight(self, w: float, forces: Iterable | None = None) -> "Demands":
        """The demands with a self-weight ``w`` (N/m) added to every diagram with its factor (prepared with
        ``demands(..., self_weight=...)``): the envelope, the LTB segments (their energy matrices summed,
        not rebuilt) and the transverse forces (``forces``: new Force records for this self-weight; default
        those given to :func:`demands`, forces from reactions updated). Deflections are kept as given."""
        sw = self._sw
        if sw is None:
            raise InputError("with_self_weight: these demands were prepared without self_weight=(M_unit, V_unit, "
                             "factors); pass it to calckit.design.en1993.demands(...)")
        if isinstance(w, bool) or not isinstance(w, (int, float, np.floating)) or not (math.isfinite(w) and w >= 0):
            raise InputError(f"w: got {w!r}; expected a self-weight >= 0 (N/m)")
        w = float(w)
        Mk, Vk = sw.moments(w)
        env = _envelope(Mk, Vk)
        segs = () if self.continuous else tuple(sw.segments(w, self.diagram_names))
        recs = sw.forces if forces is None else tuple(_force(f, i) for i, f in enumerate(forces))
        fds, stiff, _ = _resolve_forces(recs, self.x, env["M_max"], env["M_min"], sw.reactions(w),
                                        self.diagram_names, self.length)
        out = copy.copy(self)  # a frozen dataclass: the changed fields set directly (faster than replace())
        for k, v in env.items():
            object.__setattr__(out, k, v)
        for k, v in (("segments", segs), ("forces", fds), ("stiffened", stiff), ("self_weight", w), ("_sw", None)):
            object.__setattr__(out, k, v)
        return out


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
    known = {"x", "ss", "F", "load_type", "c", "flange", "stiffened", "name", "stiffener"}
    bad = set(f) - known
    if bad:
        raise InputError(f"forces[{i}]: got the key {sorted(bad)[0]!r}; expected keys from {sorted(known)}")
    F = f.get("F")
    st = f.get("stiffener")
    if st is not None:
        if not isinstance(st, (tuple, list)) or len(st) not in (2, 3):
            raise InputError(f"forces[{i}].stiffener: got {st!r}; expected (b_s, t_s) or (b_s, t_s, clip)")
        st = tuple(None if (j == 2 and v is None) else _si(v, "length", f"forces[{i}].stiffener[{j}]",
                                                           positive=True) for j, v in enumerate(st))
    return Force(x=_si(f.get("x"), "length", f"forces[{i}].x"), ss=_si(f.get("ss"), "length", f"forces[{i}].ss"),
                 F=None if F is None else abs(_si(F, "force", f"forces[{i}].F", signed=True)),
                 load_type=f.get("load_type", "a"), c=_si(f.get("c"), "length", f"forces[{i}].c", allow_none=True),
                 flange=f.get("flange", "top"), stiffened=bool(f.get("stiffened", False)) or st is not None,
                 name=str(f.get("name", "")), stiffener=st)


# ------------------------------------------------------------------------------------------- inputs
@dataclass
class _Input:
    """Moments and shears read from the inputs: diagrams (K, S), or the two envelope curves."""

    x: np.ndarray
    M: np.ndarray  #: (K, S) diagrams, or (2, S) envelope (max, min)
    V: np.ndarray
    names: tuple  #: one per diagram (diagrams), or the combinations of an Envelope's by-arrays
    envelope: bool = False
    by: tuple | None = None  #: Envelope: (M_max_by, M_min_by, V_by)
    R: tuple | None = None  #: (support x (P,), R (K, P)) from BeamResults
    name: str = ""


def _is_result(o) -> bool:
    return hasattr(o, "M_si") and hasattr(o, "layout")


def _is_envelope(o) -> bool:
    return hasattr(o, "M_max") and hasattr(o, "x") and not _is_result(o)


def _results(analysis):
    """[(name, BeamResult)] of a dict or list of BeamResults, or None for other inputs."""
    if isinstance(analysis, Mapping):
        items = [(str(k), v) for k, v in analysis.items()]
    elif isinstance(analysis, (list, tuple)):
        items = [(str(getattr(v, "name", "")) or f"diagram {i + 1}", v) for i, v in enumerate(analysis)]
    else:
        return None
    if not items:
        raise InputError("analysis: got an empty collection; expected at least one BeamResult")
    if hasattr(analysis, "cases") and hasattr(analysis, "combine"):
        raise InputError("analysis: got a BeamSolution (unfactored load cases); expected the combined results, "
                         "e.g. calckit.analysis.arrangements(solution, combinations)")
    for nm, r in items:
        if not _is_result(r):
            raise InputError(f"analysis[{nm!r}]: got {type(r).__name__}; expected a calckit.analysis BeamResult")
    seen: dict = {}
    out = []
    for nm, r in items:  # unique names
        n = seen[nm] = seen.get(nm, 0) + 1
        out.append((nm if n == 1 else f"{nm} ({n})", r))
    L = out[0][1].layout.L
    if any(abs(r.layout.L - L) > 1e-9 * max(L, 1.0) for _, r in out):
        raise InputError("analysis: the BeamResults are of members of different lengths; expected one member")
    return out


def _sample(r, xs: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    M = np.asarray(r.M_si(xs), float)
    Vl = np.asarray(r.V_si(xs, side="left"), float)
    Vr = np.asarray(r.V_si(xs, side="right"), float)
    return M, np.where(np.abs(Vl) > np.abs(Vr), Vl, Vr)


def _read_analysis(analysis, n: int = N_SAMPLE) -> _Input:
    if _is_envelope(analysis):
        x = np.asarray(analysis.x, float)
        Vh, Vl = np.asarray(analysis.V_max, float), np.asarray(analysis.V_min, float)
        names = tuple(str(c) for c in getattr(analysis, "combinations", ()))
        by = None
        if names and hasattr(analysis, "M_max_by"):
            vb = np.where(np.abs(Vh) >= np.abs(Vl), analysis.V_max_by, analysis.V_min_by)
            by = (np.asarray(analysis.M_max_by), np.asarray(analysis.M_min_by), np.asarray(vb))
        return _Input(x, np.array([analysis.M_max, analysis.M_min], float), np.array([Vh, Vl]), names if by else (),
                      True, by, None, "envelope")
    items = [(str(getattr(analysis, "name", "")), analysis)] if _is_result(analysis) else _results(analysis)
    if items is None:
        raise InputError(f"analysis: got {type(analysis).__name__}; expected a calckit.analysis BeamResult, a dict "
                         "or list of them (e.g. calckit.analysis.arrangements(solution, combinations)), or an "
                         "Envelope")
    L = items[0][1].layout.L
    grids = [np.asarray(r.grid.x, float) for _, r in items]
    xs = np.unique(np.concatenate([np.linspace(0.0, L, n + 1), *grids]))
    Ms, Vs = zip(*(_sample(r, xs) for _, r in items))
    lay = items[0][1].layout
    R = None
    try:
        xr = np.array([s.x for s in lay.supports], float)
        R = (xr, np.array([np.asarray(r.R, float) for _, r in items]))
    except (AttributeError, TypeError, ValueError):  # pragma: no cover - every BeamResult has reactions
        R = None
    single = _is_result(analysis)
    return _Input(xs, np.array(Ms), np.array(Vs), tuple(nm for nm, _ in items), False, None, R,
                  items[0][0] if single else "")


def _read_arrays(x, M, V, combination: str) -> _Input:
    xa = np.array(x, dtype=float)  # copies: the demands must not change with the caller's arrays
    if xa.ndim != 1 or xa.size < 2 or not (np.diff(xa).min() >= 0 and np.isfinite(xa).all()):
        raise InputError("x: expected at least two stations in increasing order (m)")

    def one(v, name):
        a = np.array(v, dtype=float)
        if a.shape != xa.shape or not np.isfinite(a).all():
            raise InputError(f"{name}: expected finite arrays of the same length as x ({xa.size})")
        return a

    if isinstance(M, Mapping):
        if not M:
            raise InputError("M: got an empty dict; expected at least one moment diagram")
        if V is not None and not (isinstance(V, Mapping) and set(V) == set(M)):
            raise InputError("V: expected a dict with the same diagram names as M (or None)")
        names = tuple(str(k) for k in M)
        Ms = np.array([one(m, f"M[{k!r}]") for k, m in M.items()])
        Vs = np.zeros_like(Ms) if V is None else np.array([one(V[k], f"V[{k!r}]") for k in M])
        return _Input(xa, Ms, Vs, names)
    if isinstance(V, Mapping):
        raise InputError("V: got a dict but M is not one; expected M and V of the same kind")
    env = isinstance(M, tuple) and len(M) == 2
    if V is None:
        Vp = (np.zeros_like(xa), np.zeros_like(xa)) if env else np.zeros_like(xa)
    else:
        Vp = V
    if env or (isinstance(Vp, tuple) and len(Vp) == 2):
        Mp = M if env else (M, M)
        if not (isinstance(Vp, tuple) and len(Vp) == 2):
            Vp = (Vp, Vp)
        a, b = one(Mp[0], "M"), one(Mp[1], "M")
        va, vb = one(Vp[0], "V"), one(Vp[1], "V")
        return _Input(xa, np.array([np.maximum(a, b), np.minimum(a, b)]), np.array([va, vb]), (), True,
                      name=combination)
    return _Input(xa, one(M, "M")[None, :], one(Vp, "V")[None, :], (combination,), name=combination)


def from_analysis(analysis, n: int = N_SAMPLE):
    """(x, M, V, reactions, name) from a BeamResult; (x, {name: M}, {name: V}, reactions, "") from a dict
    or list of BeamResults; (x, (M_max, M_min), (V_max, V_min), {}, "envelope") from an Envelope.
    Reactions as {x: largest |R|} (N)."""
    inp = _read_analysis(analysis, n)
    reac = {} if inp.R is None else {float(xr): float(np.max(np.abs(inp.R[1][:, i])))
                                     for i, xr in enumerate(inp.R[0])}
    if inp.envelope:
        return inp.x, (inp.M[0], inp.M[1]), (inp.V[0], inp.V[1]), reac, inp.name
    if _is_result(analysis):
        return inp.x, inp.M[0], inp.V[0], reac, inp.name
    return inp.x, dict(zip(inp.names, inp.M)), dict(zip(inp.names, inp.V)), reac, ""


def _signs(Mmax: np.ndarray, Mmin: np.ndarray) -> tuple[bool, bool]:
    """(some sagging moment or none at all, some hogging moment), ignoring rounding-level values (1e-9 of
    the largest |M|: e.g. the moment at a simple support)."""
    hi, lo = float(Mmax.max()), float(Mmin.min())
    tol = 1e-9 * max(hi, -lo, 0.0)
    hog = lo < -tol
    return hi > tol or not hog, hog


def _envelope(Mk: np.ndarray, Vk: np.ndarray) -> dict:
    """The Demands fields of the envelope over the diagrams Mk, Vk (K, S)."""
    if Mk.shape[0] == 1:
        Mmax = Mmin = Mk[0]
        Vabs = np.abs(Vk[0])
        zero = np.zeros(Mk.shape[1], dtype=np.intp)
        by = (zero, zero, zero)
    else:
        Mmax, Mmin = Mk.max(axis=0), Mk.min(axis=0)
        Va = np.abs(Vk)
        Vabs = Va.max(axis=0)
        by = (Mk.argmax(axis=0), Mk.argmin(axis=0), Va.argmax(axis=0))
    iv = int(Vabs.argmax())
    sag, hog = _signs(Mmax, Mmin)
    return dict(M_max=Mmax, M_min=Mmin, V_abs=Vabs, has_sag=sag, has_hog=hog, i_v=iv,
                M_at_v=float(max(abs(Mmax[iv]), abs(Mmin[iv]))), M_max_by=by[0], M_min_by=by[1], V_by=by[2])


def _resolve_forces(recs, xa, Mmax, Mmin, R, names, Lm):
    """(ForceDemands, stiffened positions, notes) for the Force records; F = None from the reactions R."""
    fds, stiff, notes = [], [], []
    for i, f in enumerate(recs):
        F, comb = f.F, ""
        if F is None:
            j = None
            if R is not None:
                near = np.nonzero(np.abs(R[0] - f.x) <= 1e-6 * max(Lm, 1))[0]
                j = int(near[0]) if near.size else None
            if j is None:
                raise InputError(f"forces[{i}].F: no value given and no reaction at x = {f.x:g} m from the analysis")
            col = np.abs(R[1][:, j])
            kk = int(np.argmax(col))
            F = float(col[kk])
            comb = names[kk] if names and len(names) == R[1].shape[0] else ""
        hi, lo = float(np.interp(f.x, xa, Mmax)), float(np.interp(f.x, xa, Mmin))
        fd = ForceDemand(f, float(F), max(abs(hi), abs(lo)), hi >= -lo, comb)
        (stiff if f.stiffened else fds).append(fd)
    return tuple(fds), tuple(stiff), notes


def _default_restraints(analysis, notes):
    """None (the member ends), or, for an analysis with a free end, the ends with each free end replaced by
    the nearest support that is not free (a free tip is no lateral-torsional restraint)."""
    if not _is_result(analysis) and not _is_envelope(analysis):
        items = _results(analysis)
        analysis = items[0][1] if items else analysis
    sup = getattr(getattr(analysis, "layout", None), "supports", None)
    if sup is None and _is_envelope(analysis):  # an Envelope lists its support kinds
        kinds, nodes = tuple(getattr(analysis, "support_kinds", ())), tuple(getattr(analysis, "nodes", ()))
        if kinds and "free" in kinds:
            from types import SimpleNamespace

            sup = [SimpleNamespace(x=float(xn), kind=kd) for xn, kd in zip(nodes, kinds)]
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


def _ranges(xa, restraints, overhang_root, tol):
    """LTB ranges: a :class:`Cut` per segment between restraints, a :class:`FreeEnd` per overhang."""
    x0, x1 = float(xa[0]), float(xa[-1])
    pts = [x0, x1] if restraints is None else sorted(_si(p, "length", "restraints", signed=True)
                                                     for p in restraints)
    if not pts:
        raise InputError("restraints: got none; expected at least one lateral-torsional restraint position (m) "
                         "or 'continuous'")
    if pts[0] < x0 - tol or pts[-1] > x1 + tol:
        raise InputError(f"restraints: got {pts[0]:g} to {pts[-1]:g} m; expected positions within the member "
                         f"({x0:g} to {x1:g} m)")
    pts = [min(max(p, x0), x1) for p in pts]
    out: list = []
    if pts[0] > x0 + tol:
        behind = [p for p in pts if p > pts[0] + tol]
        out.append(FreeEnd(xa, pts[0], x0, behind[0] if behind and overhang_root == "continuous" else None))
    for p, q in zip(pts[:-1], pts[1:]):
        if q - p > 1e-9:
            out.append(Cut(xa, p, q))
    if pts[-1] < x1 - tol:
        behind = [p for p in pts if p < pts[-1] - tol]
        out.append(FreeEnd(xa, pts[-1], x1, behind[-1] if behind and overhang_root == "continuous" else None))
    return out


def _range_notes(rg, notes):
    if isinstance(rg, FreeEnd):
        if rg.far is None:
            notes.append(f"{rg.where}: cantilever LTB with a built-in root at {rg.root:g} m (lateral bending and "
                         "warping prevented there); check that the support gives that fixity")
        else:
            bp, bq = min(rg.root, rg.far), max(rg.root, rg.far)
            notes.append(f"{rg.where}: LTB of the overhang solved with the segment {bp:g}-{bq:g} m behind its root "
                         f"support (lateral and torsional restraint at {rg.root:g} m and {rg.far:g} m)")


_ENV_NOTE = ("C1 taken from the envelope curve with the larger peak, which is not the moment diagram of any one "
             "loading: approximate and possibly unconservative; pass the real diagrams, e.g. analysis="
             "calckit.analysis.arrangements(solution, combinations), for an exact check")


def _segments(inp: _Input, ranges, notes) -> list[LTBSegment]:
    segs: list[LTBSegment] = []
    for rg in ranges:
        _range_notes(rg, notes)
        if inp.envelope:
            hi, lo = inp.M
            if isinstance(rg, FreeEnd):
                ho, lw = rg.arrays(hi)[0], rg.arrays(lo)[0]
                use_hi = np.max(np.abs(ho)) >= np.max(np.abs(lw))
                differ = bool(np.any(ho != lw))
                Mo, Mb = rg.arrays(hi if use_hi else lo)
                sg = rg.segment(Mo, Mb, f"envelope ({'max' if use_hi else 'min'} curve)" if differ else inp.name,
                                envelope=differ)
                where = rg.where
            else:
                hs, ls = rg(hi), rg(lo)
                use_hi = np.max(np.abs(hs)) >= np.max(np.abs(ls))
                differ = bool(np.any(hs != ls))
                sg = forks_segment(rg, hs if use_hi else ls,
                                   f"envelope ({'max' if use_hi else 'min'} curve)" if differ else inp.name,
                                   envelope=differ)
                where = f"segment {rg.p:g}-{rg.q:g} m"
            if differ and sg is not None:
                notes.append(f"{where}: {_ENV_NOTE}")
            if sg is not None:
                segs.append(sg)
            continue
        if isinstance(rg, FreeEnd):
            parts = [rg.arrays(Mrow) for Mrow in inp.M]
            flat = [np.concatenate([Mo] + ([] if Mb is None else [Mb])) for Mo, Mb in parts]
        else:
            parts = flat = [rg(Mrow) for Mrow in inp.M]
        for i in live_diagrams(flat):  # diagrams of the same shape and a smaller peak left out
            name = inp.names[i]
            sg = rg.segment(*parts[i], name) if isinstance(rg, FreeEnd) else forks_segment(rg, parts[i], name)
            if sg is not None:
                segs.append(sg)
    return segs


def _self_weight(sw, inp: _Input, ranges, kk, forces) -> SelfWeight:
    """The :class:`SelfWeight` precomputation of ``self_weight=(M_unit, V_unit, factors)``."""
    if inp.envelope:
        raise InputError("self_weight: given with an envelope; expected the real diagrams (a dict of BeamResults or "
                         "of arrays), to which the self-weight adds exactly")
    if not (isinstance(sw, tuple) and len(sw) in (2, 3)):
        raise InputError(f"self_weight: got {sw!r}; expected (M_unit, V_unit, factors) or (unit BeamResult, factors)")
    RU = None
    if len(sw) == 2:
        res, factors = sw
        if not _is_result(res):
            raise InputError("self_weight: got two items; expected (unit BeamResult, factors)")
        U_M, U_V = _sample(res, inp.x)
        RU = np.asarray(res.R, float)
    else:
        U_M, U_V, factors = sw
        U_M, U_V = np.array(U_M, float), np.array(U_V, float)
    if U_M.shape != inp.x.shape or U_V.shape != inp.x.shape or not (np.isfinite(U_M).all() and np.isfinite(U_V).all()):
        raise InputError(f"self_weight: expected unit moment and shear arrays of the same length as x ({inp.x.size})")
    K = inp.M.shape[0]
    if isinstance(factors, Mapping):
        missing = [nm for nm in inp.names if nm not in factors]
        if missing:
            raise InputError(f"self_weight factors: no factor for the diagram {missing[0]!r}; expected one per diagram")
        f = np.array([float(factors[nm]) for nm in inp.names])
    elif isinstance(factors, (int, float, np.floating)) and not isinstance(factors, bool):
        f = np.full(K, float(factors))
    else:
        f = np.asarray(factors, dtype=float)
        if f.shape != (K,):
            raise InputError(f"self_weight factors: got {f.size} values; expected one per diagram ({K})")
    if not np.isfinite(f).all():
        raise InputError("self_weight factors: expected finite numbers")
    R = None
    if inp.R is not None and RU is not None and RU.shape == inp.R[1].shape[1:]:
        R = (inp.R[0], inp.R[1], RU)
    out = SelfWeight(inp.M, U_M, inp.V, U_V, f, ranges, kk, R)
    out.forces = tuple(forces)
    return out


def demands(*, x=None, M=None, V=None, analysis=None, restraints=None, zg=0, k: float = 1.0, kw: float = 1.0,
            forces: Iterable = (), deflections: Mapping | None = None, span=None, combination: str = "",
            overhang_root: str = "continuous", self_weight=None) -> Demands:
    """Build the section-independent :class:`Demands` of a member; arguments as for
    :func:`calckit.design.en1993.check_member` (see there and the module docstring); ``self_weight``:
    see the module docstring (the demands returned are then those without self-weight, w = 0)."""
    notes: list[str] = []
    if analysis is not None:
        if x is not None or M is not None or V is not None:
            raise InputError("analysis: got analysis results and x/M/V arrays; expected one or the other")
        inp = _read_analysis(analysis)
        combination = combination or inp.name
        if restraints is None:
            restraints = _default_restraints(analysis, notes)
    else:
        if x is None or M is None:
            raise InputError("x, M: no values given; pass x and M arrays (SI) or analysis=")
        inp = _read_arrays(x, M, V, combination)
    if overhang_root not in ("continuous", "fixed"):
        raise InputError(f"overhang_root: got {overhang_root!r}; expected 'continuous' (solved with the segment "
                         "behind the root support) or 'fixed' (built-in root)")
    xa = inp.x
    for arr in (xa, inp.M, inp.V):
        arr.flags.writeable = False
    Lm = float(xa[-1] - xa[0])
    tol = 1e-9 * max(Lm, 1)
    zg_ = _si(zg, "length", "zg", signed=True)
    if inp.envelope:
        hi, lo = inp.M
        Va = np.maximum(np.abs(inp.V[0]), np.abs(inp.V[1]))
        iv = int(np.argmax(Va))
        sag, hog = _signs(np.maximum(hi, lo), np.minimum(hi, lo))
        env = dict(M_max=np.maximum(hi, lo), M_min=np.minimum(hi, lo), V_abs=Va, has_sag=sag, has_hog=hog, i_v=iv,
                   M_at_v=float(max(abs(hi[iv]), abs(lo[iv]))))
        if inp.by is not None:
            env.update(M_max_by=inp.by[0], M_min_by=inp.by[1], V_by=inp.by[2])
    else:
        env = _envelope(inp.M, inp.V)
    continuous = isinstance(restraints, str) and restraints == "continuous"
    if isinstance(restraints, str) and not continuous:
        raise InputError(f"restraints: got {restraints!r}; expected positions (m) or 'continuous'")
    ranges = [] if continuous else _ranges(xa, restraints, overhang_root, tol)
    if any(isinstance(rg, FreeEnd) for rg in ranges) and (k != 1.0 or kw != 1.0):
        notes.append("k, k_w apply to the segments between restraints only (not to the overhangs)")
    recs = tuple(_force(f, i) for i, f in enumerate(forces))
    sw = None
    if self_weight is not None:
        sw = _self_weight(self_weight, inp, ranges, (float(k), float(kw)), recs)
        for rg in ranges:
            _range_notes(rg, notes)
        segs = [] if continuous else sw.segments(0.0, inp.names)
    else:
        segs = _segments(inp, ranges, notes)
    fds, stiff, fnotes = _resolve_forces(recs, xa, env["M_max"], env["M_min"], inp.R, inp.names, Lm)
    notes += fnotes
    defl = []
    for name, v in (deflections or {}).items():
        kind = "total"
        if isinstance(v, tuple) and len(v) == 2 and isinstance(v[0], str):
            kind, v = v
        defl.append((str(name), kind, v))
    Ls = _si(span, "span", "span", positive=True) if span is not None else Lm
    names = inp.names if (not inp.envelope or inp.by is not None) else ()
    return Demands(x=xa, **env, zg=zg_, k=float(k), kw=float(kw), continuous=continuous, segments=tuple(segs),
                   forces=fds, stiffened=stiff, deflections=tuple(defl), span=Ls, combination=combination,
                   notes=tuple(dict.fromkeys(notes)), diagram_names=tuple(names), envelope=inp.envelope, _sw=sw)
