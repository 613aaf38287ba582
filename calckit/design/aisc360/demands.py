"""Demands along a member, prepared once and reused for every section checked (AISC 360-22 member checks).

:func:`demands` turns analysis results (or plain arrays) into a frozen :class:`Demands` record: unbraced
segments with their Mu and Cb (per moment diagram), shear panels with Vu, concentrated forces with their
bearing data, and deflections per serviceability case and span part. None of it depends on the section,
so a section search builds it once and calls ``check_member(section, steel, demands=D, steps=False)`` for
each candidate.

Accepted inputs
---------------
- ``analysis``: a ``calckit.analysis`` BeamResult (one combination), a list or dict of BeamResults
  (several combinations: Cb is computed per combination, which is exact), or an Envelope (max and min
  curves are used as two diagrams; Cb from an envelope curve is an approximation, noted in the result).
- or arrays: ``x`` stations (m, increasing; a position may repeat for the two sides of a jump), ``M``
  (N*m, sagging positive) and ``V`` (N) as one array, a (max, min) pair of envelope arrays, or a dict
  combination name -> array (then ``V`` is a dict with the same keys). Quantities are accepted.
- ``supports``: support positions (m or quantities); with arrays, default both ends (noted).
- ``deflections``: dict case ("live", "total", ...) -> array on ``x`` (m), a BeamResult, or a single
  number for a one-span member.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ...errors import InputError
from .cb import Segment, diagram_moments, parse_bracing, segments
from .concentrated import Bearing
from .deflection import limit_for

__all__ = ["Diagram", "SegmentDemand", "PanelDemand", "ForceDemand", "DeflectionDemand", "Demands", "demands"]


@dataclass(frozen=True)
class Diagram:
    """One moment/shear diagram (a combination or one side of an envelope): SI arrays on stations x."""

    name: str
    x: np.ndarray = field(repr=False)
    M: np.ndarray = field(repr=False)
    V: np.ndarray | None = field(default=None, repr=False)


@dataclass(frozen=True)
class SegmentDemand:
    """Moments in one unbraced segment from one diagram (N*m; positions in m)."""

    segment: Segment
    combination: str
    Mmax: float  #: largest absolute moment in the segment
    MA: float  #: |M| at the quarter point
    MB: float  #: |M| at the centre line
    MC: float  #: |M| at the three-quarter point
    M_pos: float  #: largest sagging moment (top flange in compression), >= 0
    x_pos: float
    M_neg: float  #: largest hogging moment magnitude (bottom flange in compression), >= 0
    x_neg: float


@dataclass(frozen=True)
class PanelDemand:
    """Shear in one web panel: between stiffeners (a = a1 - a0) or the whole member when unstiffened."""

    a0: float
    a1: float
    stiffened: bool
    end_panel: bool
    Vu: float  #: largest |V| in the panel (N)
    x: float  #: where it acts (m)
    combination: str


@dataclass(frozen=True)
class ForceDemand:
    """A concentrated force with its bearing data resolved (P, x_end and flange known)."""

    bearing: Bearing
    combination: str


@dataclass(frozen=True)
class DeflectionDemand:
    """Largest deflection of one span part (span between supports, or an overhang) for one case."""

    case: str
    a: float
    b: float
    cantilever: bool
    delta: float  #: m, relative to the chord between supports (or to the support for an overhang)
    x: float
    n: float  #: limit L/n


@dataclass(frozen=True)
class Demands:
    """Everything a member check needs that does not depend on the section (SI floats)."""

    x0: float
    x1: float
    supports: tuple[float, ...]
    bracing: str  #: "continuous", "discrete" or "none"
    braces: tuple[float, ...]
    segments: tuple[Segment, ...]
    flexure: tuple[SegmentDemand, ...]
    shear: tuple[PanelDemand, ...]
    stiffeners: tuple[float, ...] = ()
    forces: tuple[ForceDemand, ...] = ()
    deflections: tuple[DeflectionDemand, ...] = ()
    EI_ref: float | None = None  #: EI the deflections were computed with (scaled to each section)
    Cb: float | None = None  #: Cb given by the user for every segment (None: from the diagrams)
    envelope: bool = False  #: diagrams are envelope curves (Cb approximate)
    notes: tuple[str, ...] = ()


# ------------------------------------------------------------------------------------------ helpers
def _arr(v, dim: str, name: str) -> np.ndarray:
    from ...units import is_quantity, to_si

    if is_quantity(v) or isinstance(v, str):
        a = to_si(v, dim, name)
    else:
        a = np.asarray(v, dtype=float)
    a = np.atleast_1d(np.asarray(a, dtype=float))
    if a.ndim != 1 or not np.isfinite(a).all():
        raise InputError(f"{name}: got an array of shape {a.shape} with non-finite values or more than one "
                         "dimension; expected a 1-D array of finite SI values")
    return a


def _pos_list(v, name: str) -> tuple[float, ...]:
    from ...units import to_si

    if v is None:
        return ()
    if isinstance(v, (str, int, float)) or hasattr(v, "magnitude") and np.ndim(v.magnitude) == 0:
        v = [v]
    out = []
    for i, it in enumerate(v):
        if isinstance(it, (int, float, np.floating, np.integer)) and not isinstance(it, bool):
            out.append(float(it))
        else:
            out.append(float(to_si(it, "span", f"{name}[{i}]", allow_array=False)))
    return tuple(sorted(out))


def _is_beam_result(o) -> bool:
    return hasattr(o, "M_si") and hasattr(o, "V_si") and hasattr(o, "layout")


def _is_envelope(o) -> bool:
    return hasattr(o, "M_max") and hasattr(o, "M_min") and hasattr(o, "combinations")


def _stations(L0: float, L1: float, extra) -> np.ndarray:
    s = np.concatenate((np.linspace(L0, L1, 241), np.asarray(list(extra), dtype=float)))
    s = np.clip(s, L0, L1)
    return np.unique(np.round(s, 12))


def _sample(res, s: np.ndarray) -> Diagram:
    """Diagram of a BeamResult on stations s, with both sides at jumps."""
    ML, MR = np.asarray(res.M_si(s, "left")), np.asarray(res.M_si(s, "right"))
    VL, VR = np.asarray(res.V_si(s, "left")), np.asarray(res.V_si(s, "right"))
    scale = max(np.max(np.abs(VL)), np.max(np.abs(ML)), 1.0)
    jump = (np.abs(VL - VR) > 1e-9 * scale) | (np.abs(ML - MR) > 1e-9 * scale)
    xs, Ms, Vs = [], [], []
    for i in range(len(s)):
        if jump[i]:
            xs += [s[i], s[i]]
            Ms += [ML[i], MR[i]]
            Vs += [VL[i], VR[i]]
        else:
            xs.append(s[i])
            Ms.append(MR[i])
            Vs.append(VR[i])
    return Diagram(str(res.name), np.array(xs), np.array(Ms), np.array(Vs))


def _from_analysis(analysis):
    """(kind, results or envelope, supports, x0, x1, EI) from a calckit.analysis object."""
    if _is_envelope(analysis):
        nodes = tuple(float(v) for v in analysis.nodes)
        kinds = tuple(analysis.support_kinds)
        sup = tuple(x for x, k in zip(nodes, kinds) if k != "free")
        x = np.asarray(analysis.x, dtype=float)
        return "envelope", analysis, sup, float(x[0]), float(x[-1]), None
    if _is_beam_result(analysis):
        results = [analysis]
    elif isinstance(analysis, dict):
        results = list(analysis.values())
    elif isinstance(analysis, (list, tuple)):
        results = list(analysis)
    else:
        results = None
    if not results or not all(_is_beam_result(r) for r in results):
        raise InputError(f"analysis: got {type(analysis).__name__}; expected a calckit.analysis BeamResult "
                         "(e.g. solution.combine({'D': 1.2, 'L': 1.6})), a list or dict of them, or an "
                         "Envelope")
    if hasattr(analysis, "cases") and hasattr(analysis, "combine"):
        raise InputError("analysis: got a BeamSolution (unfactored load cases); expected combined results: "
                         "solution.combine(factors) for each combination, or solution.envelope(combinations)")
    lay = results[0].layout
    sup = tuple(float(s.x) for s in lay.supports if s.kind != "free")
    EI = tuple(lay.EI)
    EI_ref = EI[0] if EI and all(abs(e - EI[0]) <= 1e-12 * abs(EI[0]) for e in EI) else None
    return "results", results, sup, 0.0, float(lay.L), EI_ref


def _jump(d: Diagram, x: float, tol: float) -> float:
    """|V(x+) - V(x-)| of a diagram at x (the concentrated force there)."""
    xs, V = d.x, d.V
    idx = np.nonzero(np.abs(xs - x) <= tol)[0]
    if idx.size == 0:
        raise InputError(f"bearing x: got {x:.6g} m, which is not a station of the shear diagram; give the "
                         "force P explicitly or include the position in x")
    i0, i1 = int(idx[0]), int(idx[-1])
    if idx.size >= 2:
        left, right = V[i0], V[i1]
    elif i0 == 0:
        left, right = 0.0, V[0]
    elif i0 == len(V) - 1:
        left, right = V[-1], 0.0
    else:  # no repeated station: the jump is bracketed by the neighbours (conservative)
        left, right = V[i0 - 1], V[i0 + 1]
    return abs(float(right) - float(left))


def _diagrams_from_arrays(xs: np.ndarray, M, V) -> tuple[list[Diagram], bool]:
    def one(v, dim, name):
        a = _arr(v, dim, name)
        if a.shape != xs.shape:
            raise InputError(f"{name}: got {a.size} values; expected one per station of x ({xs.size})")
        return a

    env = False
    if isinstance(M, dict):
        if V is not None and not (isinstance(V, dict) and set(V) == set(M)):
            raise InputError("V: expected a dict with the same combination names as M")
        ds = [Diagram(str(k), xs, one(m, "moment", f"M[{k!r}]"),
                      None if V is None else one(V[k], "force", f"V[{k!r}]")) for k, m in M.items()]
    elif isinstance(M, tuple) and len(M) == 2:
        env = True
        Vp = (None, None) if V is None else V
        if not (isinstance(Vp, tuple) and len(Vp) == 2):
            raise InputError("V: expected a (V_max, V_min) pair like M")
        ds = [Diagram("envelope (max)", xs, one(M[0], "moment", "M[0]"),
                      None if Vp[0] is None else one(Vp[0], "force", "V[0]")),
              Diagram("envelope (min)", xs, one(M[1], "moment", "M[1]"),
                      None if Vp[1] is None else one(Vp[1], "force", "V[1]"))]
    else:
        ds = [Diagram("", xs, one(M, "moment", "M"), None if V is None else one(V, "force", "V"))]
    if not ds:
        raise InputError("M: got an empty dict; expected at least one moment diagram")
    return ds, env


def _stiffener_positions(stiffeners, x0: float, x1: float) -> tuple[float, ...]:
    from ...units import to_si

    if stiffeners is None:
        return ()
    if isinstance(stiffeners, str) or (hasattr(stiffeners, "magnitude") and np.ndim(stiffeners.magnitude) == 0):
        s = float(to_si(stiffeners, "span", "stiffeners", allow_array=False))
        if not s > 0:
            raise InputError(f"stiffeners: got {stiffeners!r}; expected a spacing > 0 or a list of positions")
        n = int(math.floor((x1 - x0) / s + 1e-9))
        pos = [x0 + i * s for i in range(n + 1)]
    else:
        pos = list(_pos_list(stiffeners, "stiffeners"))
    for p in pos:
        if p < x0 - 1e-9 or p > x1 + 1e-9:
            raise InputError(f"stiffeners: got a position {p:.6g} m; expected positions within {x0:.6g} to "
                             f"{x1:.6g} m")
    return tuple(sorted(set(round(min(max(p, x0), x1), 12) for p in pos)))


def _parts(sup: tuple[float, ...], x0: float, x1: float, tol: float):
    """Span parts (a, b, cantilever, support end of a cantilever or None)."""
    out = []
    if sup[0] > x0 + tol:
        out.append((x0, sup[0], True, sup[0]))
    for a, b in zip(sup, sup[1:]):
        if b - a > tol:
            out.append((a, b, False, None))
    if sup[-1] < x1 - tol:
        out.append((sup[-1], x1, True, sup[-1]))
    return out


def _defl_curve(v, xs_default, s_results, env_like, name):
    """(x, delta) arrays of one serviceability case."""
    if _is_beam_result(v):
        s = s_results if s_results is not None else np.linspace(0.0, float(v.layout.L), 241)
        return s, np.asarray(v.deflection_si(s), dtype=float)
    if _is_envelope(v):
        hi, lo = np.asarray(v.defl_max, float), np.asarray(v.defl_min, float)
        return np.asarray(v.x, float), np.where(np.abs(hi) >= np.abs(lo), hi, lo)
    if isinstance(v, tuple) and len(v) == 2:
        xd, dd = _arr(v[0], "span", f"{name} x"), _arr(v[1], "deflection", name)
        if xd.shape != dd.shape:
            raise InputError(f"{name}: x and deflection arrays differ in length")
        return xd, dd
    a = _arr(v, "deflection", name)
    if a.size == 1:
        return None, a
    if xs_default is None or a.shape != xs_default.shape:
        raise InputError(f"{name}: got {a.size} deflections; expected one per station of x, an (x, delta) pair, "
                         "a BeamResult or a single value")
    return xs_default, a


def demands(analysis=None, *, x=None, M=None, V=None, supports=None, bracing="none", bearing=(),
            stiffeners=None, deflections=None, member: str = "floor", deflection_limits=None, Cb=None,
            EI=None) -> Demands:
    """Build the section-independent :class:`Demands` of a member (see the module docstring)."""
    from ...units import to_si
    from ._core import check_Cb

    notes: list[str] = []
    s_res = None
    if analysis is not None:
        if x is not None or M is not None or V is not None:
            raise InputError("analysis: got analysis results and x/M/V arrays; expected one or the other")
        kind, obj, sup, x0, x1, EI_ref = _from_analysis(analysis)
        if supports is not None:
            sup = _pos_list(supports, "supports")
    else:
        if x is None or M is None:
            raise InputError("x, M: got none; expected analysis results, or station positions x with the moment "
                             "diagram M (and V for shear)")
        xs = _arr(x, "span", "x")
        if xs.size < 2 or np.any(np.diff(xs) < 0):
            raise InputError("x: expected at least two stations in non-decreasing order")
        x0, x1 = float(xs[0]), float(xs[-1])
        kind, EI_ref = "arrays", None
        if supports is None:
            sup = (x0, x1)
            notes.append("supports assumed at both ends of the member (pass supports= otherwise)")
        else:
            sup = _pos_list(supports, "supports")
    tol = 1e-9 * max(x1 - x0, 1.0)
    if not sup:
        raise InputError("supports: got none; expected at least one support position")
    for p in sup:
        if p < x0 - tol or p > x1 + tol:
            raise InputError(f"supports: got {p:.6g} m; expected positions within {x0:.6g} to {x1:.6g} m")
    if EI is not None:
        EI_ref = float(to_si(EI, "flexural_rigidity", "EI", allow_array=False))
    bk, braces = parse_bracing(bracing, x0, x1)
    segs = segments(bk, braces, sup, x0, x1)
    stiff = _stiffener_positions(stiffeners, x0, x1)
    brs = []
    for i, b in enumerate(bearing or ()):
        if isinstance(b, dict):
            from .concentrated import bearing as _mk
            b = _mk(**b)
        if not isinstance(b, Bearing):
            raise InputError(f"bearing[{i}]: got {b!r}; expected calckit.design.aisc360.bearing(x, lb, ...) or a "
                             "dict of its arguments")
        if b.x < x0 - tol or b.x > x1 + tol:
            raise InputError(f"bearing[{i}].x: got {b.x:.6g} m; expected a position within {x0:.6g} to {x1:.6g} m")
        brs.append(b)
    env = False
    if kind == "results":
        extra = [*sup, *braces, *stiff, *(b.x for b in brs)]
        for sg in segs:
            extra += [sg.a + f * sg.Lb for f in (0.0, 0.25, 0.5, 0.75, 1.0)]
        s_res = _stations(x0, x1, extra)
        diags = [_sample(r, s_res) for r in obj]
    elif kind == "envelope":
        ex = np.asarray(obj.x, float)
        diags = [Diagram("envelope (max)", ex, np.asarray(obj.M_max, float), np.asarray(obj.V_max, float)),
                 Diagram("envelope (min)", ex, np.asarray(obj.M_min, float), np.asarray(obj.V_min, float))]
        env = True
    else:
        diags, env = _diagrams_from_arrays(xs, M, V)
    if env and Cb is None and bk != "continuous":
        notes.append("Cb computed from envelope curves (an approximation); pass the moment diagram of each "
                     "combination for an exact Cb")
    Cb_v = None
    if Cb is not None:
        Cb_v, cbn = check_Cb(Cb)
        notes.append(cbn or f"Cb = {Cb_v:g} given for every segment")
    if any(sg.free_end for sg in segs) and bk != "continuous":
        notes.append("segment(s) with an unbraced free end: Cb = 1.0 (AISC 360-22 F1 User Note) and Lb = the "
                     "overhang length; review the cantilever's bracing")
    # flexure
    per_diag = [diagram_moments(d.x, d.M, segs) for d in diags]
    fl = [SegmentDemand(sg, d.name, *per_diag[j][i]) for i, sg in enumerate(segs) for j, d in enumerate(diags)]
    if bk == "continuous" and any(it.M_neg > 1e-9 * max(it.Mmax, 1.0) for it in fl):
        notes.append("continuous lateral bracing (Lb = 0) assumed to restrain the compression flange under both "
                     "signs of moment; confirm that the bottom flange is braced where the moment is hogging")
    # shear
    panels = []
    vd = [d for d in diags if d.V is not None]
    if not vd:
        notes.append("no shear diagram given: shear and concentrated forces from V not checked")
    else:
        bounds = sorted(set([x0, *stiff, x1])) if stiff else [x0, x1]
        for i, (a0, a1) in enumerate(zip(bounds, bounds[1:])):
            if a1 - a0 <= tol:
                continue
            best = (-1.0, a0, "")
            for d in vd:
                m = (d.x >= a0 - tol) & (d.x <= a1 + tol)
                if not m.any():
                    continue
                j = int(np.argmax(np.abs(d.V[m])))
                v = float(abs(d.V[m][j]))
                if v > best[0]:
                    best = (v, float(d.x[m][j]), d.name)
            panels.append(PanelDemand(a0, a1, bool(stiff), bool(stiff) and (i == 0 or i == len(bounds) - 2),
                                      max(best[0], 0.0), best[1], best[2]))
    # concentrated forces
    forces = []
    for b in brs:
        at_sup = any(abs(b.x - s) <= 1e-6 * max(x1 - x0, 1.0) for s in sup)
        P, comb = b.P, ""
        if P is None:
            if kind == "envelope" and at_sup:
                k = int(np.argmin([abs(b.x - n) for n in obj.nodes]))
                P = max(abs(float(obj.R_max[k])), abs(float(obj.R_min[k])))
                comb = "envelope"
            elif vd:
                vals = [(_jump(d, b.x, 1e-9 * max(x1 - x0, 1.0)), d.name) for d in vd]
                P, comb = max(vals)
                if kind == "envelope" or env:
                    notes.append(f"force at x = {b.x:.4g} m taken from the jump of the envelope shear curves "
                                 "(approximate); give P explicitly for an exact value")
            else:
                raise InputError(f"bearing at x = {b.x:.6g} m: no force P given and no shear diagram to take it from")
        xe = b.x_end if b.x_end is not None else min(b.x - x0, x1 - b.x)
        fl_side = b.flange or ("bottom" if at_sup else "top")
        from dataclasses import replace
        forces.append(ForceDemand(replace(b, P=float(P), x_end=float(xe), flange=fl_side), comb))
    # deflections
    dd = []
    if deflections:
        if not isinstance(deflections, dict):
            raise InputError("deflections: expected a dict case -> deflections, e.g. {'live': array, 'total': ...}")
        parts = _parts(tuple(sorted(sup)), x0, x1, tol)
        for case, v in deflections.items():
            n = limit_for(member, case, deflection_limits)
            xd, dv = _defl_curve(v, xs if kind == "arrays" else None, s_res, env, f"deflections[{case!r}]")
            if xd is None:
                if len(parts) != 1:
                    raise InputError(f"deflections[{case!r}]: got a single value for a member with {len(parts)} "
                                     "span parts; give the deflection along the member")
                a, b, cant, _ = parts[0]
                dd.append(DeflectionDemand(case, a, b, cant, abs(float(dv[0])), b if cant else 0.5 * (a + b), n))
                continue
            for a, b, cant, sx in parts:
                m = (xd >= a - tol) & (xd <= b + tol)
                if not m.any():
                    continue
                xs_p, d_p = xd[m], dv[m]
                if cant:
                    ref = float(np.interp(sx, xd, dv))  # deflection at the supported end of the overhang
                    rel = d_p - ref
                else:
                    da, db = float(np.interp(a, xd, dv)), float(np.interp(b, xd, dv))
                    rel = d_p - (da + (db - da) * (xs_p - a) / (b - a))
                j = int(np.argmax(np.abs(rel)))
                dd.append(DeflectionDemand(case, a, b, cant, float(abs(rel[j])), float(xs_p[j]), n))
    return Demands(x0, x1, tuple(sup), bk, braces, segs, tuple(fl), tuple(panels), stiff, tuple(forces),
                   tuple(dd), EI_ref, Cb_v, env, tuple(dict.fromkeys(notes)))
