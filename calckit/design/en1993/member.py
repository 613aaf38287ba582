"""Member-level check of an I-beam to EN 1993-1-1:2005 and EN 1993-1-5:2006: every check along the member,
and the governing one.

Checks (in calc order): classification (sagging and hogging), bending with coexisting shear at every
station (6.2.5, 6.2.8, or EN 1993-1-5 7.1 for webs slender in shear), shear (6.2.6, EN 1993-1-5 5),
lateral-torsional buckling of each segment between lateral-torsional restraints with its own moment
diagram and M_Ed (6.3.2), transverse forces at loads and supports (EN 1993-1-5 6) with the 7.2
interaction, and deflection per serviceability combination (7.2).

Inputs are plain arrays (SI) or analysis objects: ``x`` stations (m), ``M`` (N m, sagging positive) and
``V`` (N) arrays of one combination, or ``(max, min)`` pairs of envelope arrays; or ``analysis=`` a
:class:`calckit.analysis.BeamResult` (one combination) or :class:`calckit.analysis.Envelope`.
"""
from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Iterable, Mapping

import numpy as np

from ...errors import InputError, NotCoveredError
from ..results import MemberResult
import importlib

_bend = importlib.import_module(__package__ + ".bending")
_ltb = importlib.import_module(__package__ + ".ltb")
_tr = importlib.import_module(__package__ + ".transverse")
from ._calc import Calc
from ._common import STANDARD, length, material, section_props, value
from .classify import classify_si
from .deflection import deflection
from .factors import annex_set
from .shear import _result as _shear_result, shear_si

__all__ = ["check_member", "Force", "from_analysis"]


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
    xa = np.asarray(x, dtype=float)
    if xa.ndim != 1 or xa.size < 2 or np.any(np.diff(xa) < 0) or not np.all(np.isfinite(xa)):
        raise InputError("x: expected at least two stations in increasing order (m)")

    def env(v, name):
        if v is None:
            return np.zeros_like(xa), np.zeros_like(xa)
        if isinstance(v, tuple) and len(v) == 2:
            a, b = (np.asarray(u, dtype=float) for u in v)
        else:
            a = b = np.asarray(v, dtype=float)
        if a.shape != xa.shape or b.shape != xa.shape or not (np.all(np.isfinite(a)) and np.all(np.isfinite(b))):
            raise InputError(f"{name}: expected finite arrays of the same length as x ({xa.size})")
        return np.maximum(a, b), np.minimum(a, b)

    return xa, env(M, "M"), env(V, "V")


def check_member(section, steel, *, x=None, M=None, V=None, analysis=None, restraints=None, zg=0,
                 k: float = 1.0, kw: float = 1.0, forces: Iterable = (), deflections: Mapping | None = None,
                 span=None, a=None, end_post: str = "non-rigid", flange_contribution: bool = False,
                 method: str | None = None, use_f: bool | None = None, annex=None, fy=None, steps: bool = True,
                 combination: str = "") -> MemberResult:
    """Check an I-beam along its length (see the module docstring).

    ``restraints``: positions (m) of lateral-torsional restraints, default the two ends; "continuous" for a
    fully restrained compression flange (no LTB check). ``zg``: load height above the shear centre.
    ``forces``: :class:`Force` records or dicts (x, ss, F, load_type, c, flange, stiffened).
    ``deflections``: {combination name: values or (kind, values)} with kind "total"/"variable" (values in
    m, arrays or a float); ``span``: span for the deflection limits (default the member length).
    A failing member is a result (``passed`` False); bad input raises InputError.
    """
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    reac: dict = {}
    if analysis is not None:
        x, M, V, reac, nm = from_analysis(analysis)
        combination = combination or nm
    if x is None or M is None:
        raise InputError("x, M: no values given; pass x and M arrays (SI) or analysis=")
    xa, (Mmax, Mmin), (Vmax, Vmin) = _arrays(x, M, V)
    x0, x1 = float(xa[0]), float(xa[-1])
    Lm = x1 - x0
    zg_ = _si(zg, "length", "zg", signed=True)
    a_ = _si(a, "length", "a", positive=True, allow_none=True)
    calc = Calc(steps)
    calc.say(f"National annex set: {ann.describe()}", ann.source)
    notes = [f"annex set {ann.name!r}: {ann.title}", mat.note]
    checks = []
    Vabs = np.maximum(np.abs(Vmax), np.abs(Vmin))
    # -- classification and shear --------------------------------------------------------------------
    has_sag = bool(np.max(Mmax) > 0) or not bool(np.min(Mmin) < 0)
    has_hog = bool(np.min(Mmin) < 0)
    cls = {}
    for sag, present in ((True, has_sag), (False, has_hog)):
        if present:
            cls[sag] = classify_si(s, mat, sagging=sag, calc=calc)
    iv = int(np.argmax(Vabs))
    Mv = max(abs(Mmax[iv]), abs(Mmin[iv]))
    sc = Calc(steps)
    sh = shear_si(s, mat, ann, a=a_, end_post=end_post, flange_contribution=flange_contribution, M_Ed=Mv, calc=sc)
    checks.append(_shear_result(sh, s, mat, ann, float(Vabs[iv]), sc, location=float(xa[iv]),
                                combination=combination))
    # -- bending with coexisting shear ---------------------------------------------------------------
    Mc = {}
    for sag, cl in cls.items():
        Marr = Mmax if sag else -Mmin
        base = _bend.bending_si(s, mat, ann, sagging=sag, cl=cl, sh=sh)
        Mc[sag] = base.M_c_Rd
        ratios = np.clip(Marr, 0, None) / base.M_c_Rd
        limit = sh.V_bw_Rd * 0.5 if sh.buckling else 0.5 * sh.V_pl_Rd
        for j in np.nonzero(Vabs > limit)[0]:
            r = _bend.bending_si(s, mat, ann, sagging=sag, V_Ed=float(Vabs[j]), cl=cl, sh=sh)
            ratios[j] = max(Marr[j], 0.0) / r.M_Rd
        j = int(np.argmax(ratios))
        if Marr[j] <= 0:
            continue
        bc = Calc(steps)
        Vj = float(Vabs[j]) if Vabs[j] > limit else None
        r = _bend.bending_si(s, mat, ann, sagging=sag, V_Ed=Vj, cl=cl, sh=sh if not steps else None, calc=bc)
        res = _bend.result(r, mat, ann, float(Marr[j]), bc, location=float(xa[j]), combination=combination)
        checks.append(res)
    # -- lateral-torsional buckling per segment ------------------------------------------------------
    if restraints != "continuous":
        pts = [x0, x1] if restraints is None else sorted(_si(p, "length", "restraints", signed=True) for p in restraints)
        if pts[0] > x0 + 1e-9 * max(Lm, 1) or pts[-1] < x1 - 1e-9 * max(Lm, 1):
            raise NotCoveredError("restraints: the member extends beyond the first or last restraint (an overhang "
                                  "with a free end); cantilever LTB is not covered; restrain the ends or check the "
                                  "overhang separately with a given M_cr")
        for xa_, xb_ in zip(pts[:-1], pts[1:]):
            if xb_ - xa_ <= 1e-9:
                continue
            checks.extend(_segment(s, mat, ann, xa, Mmax, Mmin, xa_, xb_, zg_, k, kw, method, use_f, steps,
                                   cls, combination, notes))
    # -- transverse forces ---------------------------------------------------------------------------
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
            continue
        tc = Calc(steps)
        d = _tr.transverse_si(s, mat, ann, ss=f.ss, load_type=f.load_type, c=f.c, a=a_, flange=f.flange, calc=tc)
        tres = _tr.result(d, tc, F, location=f.x, combination=combination)
        checks.append(tres)
        Mx = max(abs(float(np.interp(f.x, xa, Mmax))), abs(float(np.interp(f.x, xa, Mmin))))
        sag = float(np.interp(f.x, xa, Mmax)) >= -float(np.interp(f.x, xa, Mmin))
        McR = Mc.get(sag) or next(iter(Mc.values()), None)
        if McR and Mx > 0:
            checks.append(_tr.interaction_72(F, d["F_Rd"], Mx, McR, Calc(steps), location=f.x))
    # -- deflection ----------------------------------------------------------------------------------
    if deflections:
        Ls = _si(span, "span", "span", positive=True) if span is not None else Lm
        for name, v in deflections.items():
            kind = "total"
            if isinstance(v, tuple) and len(v) == 2 and isinstance(v[0], str):
                kind, v = v
            checks.append(deflection(v, f"{Ls} m", kind=kind, annex=ann, name=str(name), steps=steps))
    return MemberResult(standard=f"{STANDARD}; EN 1993-1-5:2006", method="EN", checks=tuple(checks),
                        section=s.name, steel=mat.grade, notes=tuple(notes), steps=calc.take())


def _segment(s, mat, ann, xa, Mmax, Mmin, xa_, xb_, zg, k, kw, method, use_f, steps, cls, combination, notes):
    inside = (xa > xa_) & (xa < xb_)
    xs = np.concatenate(([xa_], xa[inside], [xb_]))
    hi = np.concatenate(([np.interp(xa_, xa, Mmax)], Mmax[inside], [np.interp(xb_, xa, Mmax)]))
    lo = np.concatenate(([np.interp(xa_, xa, Mmin)], Mmin[inside], [np.interp(xb_, xa, Mmin)]))
    if np.any(hi != lo):
        Mseg = hi if np.max(np.abs(hi)) >= np.max(np.abs(lo)) else lo
        notes.append(f"segment {xa_:g}-{xb_:g} m: LTB uses the envelope curve with the larger peak as the moment "
                     "diagram (common practice; check the governing combination's own diagram where it matters)")
    else:
        Mseg = hi
    peak = float(np.max(np.abs(Mseg)))
    if peak <= 0:
        return []
    L = xb_ - xa_
    dia = _ltb._from_arrays(xs, Mseg, L, f"M(x) over {xa_:g}-{xb_:g} m")
    sag = dia.M_peak_signed >= 0
    calc = Calc(steps)
    cl = cls.get(sag) or classify_si(s, mat, sagging=sag)
    d = _ltb.ltb_si(s, mat, ann, L=L, dia=dia, zg=zg, k=k, kw=kw, method=method, use_f=use_f, sagging=sag,
                    calc=calc, cl=cl)
    x_at = float(xs[int(np.argmax(np.abs(Mseg)))])
    return [_ltb.result(d, calc, peak, segment=(xa_, xb_), location=x_at, combination=combination)]
