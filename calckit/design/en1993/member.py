"""Member-level check of an I-beam to EN 1993-1-1:2005 and EN 1993-1-5:2006: every check along the member,
and the governing one.

Checks (in calc order): classification (sagging and hogging), bending with coexisting shear at every
station (6.2.5, 6.2.8, or EN 1993-1-5 7.1 for webs slender in shear), shear (6.2.6, EN 1993-1-5 5),
lateral-torsional buckling of each segment between lateral-torsional restraints with its own moment
diagram and M_Ed (6.3.2), and of an overhang beyond the first or last restraint (M_cr by the energy
method of :mod:`.cantilever`), transverse forces at loads and supports (EN 1993-1-5 6) with the 7.2
interaction, and deflection per serviceability combination (7.2).

Inputs are plain arrays (SI) or analysis objects: ``x`` stations (m), ``M`` (N m, sagging positive) and
``V`` (N) arrays of one combination, or ``(max, min)`` pairs of envelope arrays; or ``analysis=`` a
:class:`calckit.analysis.BeamResult` (one combination) or :class:`calckit.analysis.Envelope`; or
``demands=`` a :class:`.demands.Demands` prepared once by :func:`.demands.demands` for a section search.
"""
from __future__ import annotations

import numpy as np

from ...errors import InputError
from ..results import MemberResult
import importlib

_bend = importlib.import_module(__package__ + ".bending")
_ltb = importlib.import_module(__package__ + ".ltb")
_tr = importlib.import_module(__package__ + ".transverse")
from ._calc import Calc
from ._common import STANDARD, material, section_props
from .classify import classify_si
from .deflection import deflection
from .demands import Demands, Force, _si, demands as make_demands, from_analysis
from .factors import annex_set
from .shear import _result as _shear_result, shear_si

__all__ = ["check_member", "Force", "from_analysis"]

_LOAD_ARGS = ("x", "M", "V", "analysis", "restraints", "forces", "deflections", "span")


def check_member(section, steel, *, x=None, M=None, V=None, analysis=None, restraints=None, zg=0,
                 k: float = 1.0, kw: float = 1.0, forces=(), deflections=None,
                 span=None, a=None, end_post: str = "non-rigid", flange_contribution: bool = False,
                 method: str | None = None, use_f: bool | None = None, annex=None, fy=None, steps: bool = True,
                 combination: str = "", demands: Demands | None = None,
                 overhang_root: str = "continuous") -> MemberResult:
    """Check an I-beam along its length (see the module docstring).

    ``restraints``: positions (m) of lateral-torsional restraints, default the two ends (for a BeamResult
    with a free end: the nearest support that is not free instead of that end); "continuous" for a fully
    restrained compression flange (no LTB check). A part of the member beyond the first or last
    restraint is an overhang with a free end: ``overhang_root="continuous"`` (default) solves its LTB with
    the segment behind its root support, ``"fixed"`` takes the root as built in (also used when no other
    restraint exists). ``zg``: load height above the shear centre (every transverse load).
    ``forces``: :class:`Force` records or dicts (x, ss, F, load_type, c, flange, stiffened).
    ``deflections``: {combination name: values or (kind, values)} with kind "total"/"variable" (values in
    m, arrays or a float); ``span``: span for the deflection limits (default the member length).
    ``demands``: a :class:`.demands.Demands` from :func:`calckit.design.en1993.demands` (then leave x, M, V,
    analysis, restraints, zg, k, kw, forces, deflections and span out): the section-independent part
    prepared once for a section search.
    A failing member is a result (``passed`` False); bad input raises InputError.
    """
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    if demands is None:
        D = make_demands(x=x, M=M, V=V, analysis=analysis, restraints=restraints, zg=zg, k=k, kw=kw, forces=forces,
                         deflections=deflections, span=span, combination=combination, overhang_root=overhang_root)
    else:
        if not isinstance(demands, Demands):
            raise InputError(f"demands: got {type(demands).__name__}; expected calckit.design.en1993.demands(...)")
        given = [nm for nm, v in (("x", x), ("M", M), ("V", V), ("analysis", analysis), ("restraints", restraints),
                                  ("deflections", deflections), ("span", span)) if v is not None]
        given += [nm for nm, v, dflt in (("zg", zg, 0), ("k", k, 1.0), ("kw", kw, 1.0)) if v != dflt]
        if tuple(forces):
            given.append("forces")
        if given:
            raise InputError(f"demands: given together with {', '.join(given)}; expected the prepared demands alone "
                             "(those values are part of them)")
        D = demands
    combination = combination or D.combination
    a_ = _si(a, "length", "a", positive=True, allow_none=True)
    calc = Calc(steps)
    if steps:
        calc.say(f"National annex set: {ann.describe()}", ann.source)
    notes = [f"annex set {ann.name!r}: {ann.title}", mat.note]
    checks = []
    xa, Mmax, Mmin, Vabs = D.x, D.M_max, D.M_min, D.V_abs
    # -- classification and shear --------------------------------------------------------------------
    cls = {}
    for sag, present in ((True, D.has_sag), (False, D.has_hog)):
        if present:
            cls[sag] = classify_si(s, mat, sagging=sag, calc=calc)
    iv = D.i_v
    sc = Calc(steps)
    sh = shear_si(s, mat, ann, a=a_, end_post=end_post, flange_contribution=flange_contribution, M_Ed=D.M_at_v,
                  calc=sc)
    checks.append(_shear_result(sh, s, mat, ann, float(Vabs[iv]), sc, location=float(xa[iv]),
                                combination=combination))
    # -- bending with coexisting shear ---------------------------------------------------------------
    Mc = {}
    for sag, cl in cls.items():
        Marr = Mmax if sag else -Mmin
        base = _bend.bending_si(s, mat, ann, sagging=sag, cl=cl, sh=sh)
        Mc[sag] = base.M_c_Rd
        limit = sh.V_bw_Rd * 0.5 if sh.buckling else 0.5 * sh.V_pl_Rd
        high = np.nonzero(Vabs > limit)[0]
        if high.size:
            ratios = np.clip(Marr, 0, None) / base.M_c_Rd
            for j in high:
                r = _bend.bending_si(s, mat, ann, sagging=sag, V_Ed=float(Vabs[j]), cl=cl, sh=sh)
                ratios[j] = max(Marr[j], 0.0) / r.M_Rd
            j = int(np.argmax(ratios))
        else:  # no coexisting-shear reduction anywhere: the largest moment governs
            j = int(np.argmax(Marr))
        if Marr[j] <= 0:
            continue
        bc = Calc(steps)
        Vj = float(Vabs[j]) if Vabs[j] > limit else None
        if Vj is None and not steps:
            r = base
        else:
            r = _bend.bending_si(s, mat, ann, sagging=sag, V_Ed=Vj, cl=cl, sh=sh if not steps else None, calc=bc)
        res = _bend.result(r, mat, ann, float(Marr[j]), bc, location=float(xa[j]), combination=combination)
        checks.append(res)
    # -- lateral-torsional buckling per segment ------------------------------------------------------
    if not D.continuous:
        for sg in D.segments:
            checks.append(_segment(s, mat, ann, sg, D, method, use_f, steps, cls, combination))
    # -- transverse forces ---------------------------------------------------------------------------
    for fd in D.forces:
        f = fd.force
        tc = Calc(steps)
        d = _tr.transverse_si(s, mat, ann, ss=f.ss, load_type=f.load_type, c=f.c, a=a_, flange=f.flange, calc=tc)
        tres = _tr.result(d, tc, fd.F, location=f.x, combination=combination)
        checks.append(tres)
        McR = Mc.get(fd.sagging) or next(iter(Mc.values()), None)
        if McR and fd.M > 0:
            checks.append(_tr.interaction_72(fd.F, d["F_Rd"], fd.M, McR, Calc(steps), location=f.x))
    # -- deflection ----------------------------------------------------------------------------------
    if D.deflections:
        key = ("deflections", ann, bool(steps))
        dres = D._memo.get(key)
        if dres is None:  # independent of the section: computed once per annex set
            dres = D._memo[key] = tuple(deflection(v, f"{D.span!r} m", kind=kind, annex=ann, name=name, steps=steps)
                                        for name, kind, v in D.deflections)
        checks.extend(dres)
    return MemberResult(standard=f"{STANDARD}; EN 1993-1-5:2006", method="EN", checks=tuple(checks),
                        section=s.name, steel=mat.grade, notes=tuple(notes) + D.notes, steps=calc.take())


def _segment(s, mat, ann, sg, D, method, use_f, steps, cls, combination):
    calc = Calc(steps)
    cl = cls.get(sg.sagging) or classify_si(s, mat, sagging=sg.sagging)
    d = _ltb.ltb_si(s, mat, ann, L=sg.L, dia=sg.diagram, zg=D.zg, k=D.k, kw=D.kw, method=method, use_f=use_f,
                    sagging=sg.sagging, calc=calc, cl=cl, cantilever=sg.model)
    return _ltb.result(d, calc, sg.peak, segment=(sg.a, sg.b), location=sg.location, combination=combination)
