"""Member-level check of an I-beam to EN 1993-1-1:2005 and EN 1993-1-5:2006: every check along the member,
and the governing one.

Checks (in calc order): classification (sagging and hogging), bending with coexisting shear at every
station (6.2.5, 6.2.8, or EN 1993-1-5 7.1 for webs slender in shear), shear (6.2.6, EN 1993-1-5 5),
lateral-torsional buckling of each segment between lateral-torsional restraints with its own moment
diagram and M_Ed (6.3.2), and of an overhang beyond the first or last restraint (M_cr by the energy
method of :mod:`.cantilever`), transverse forces at loads and supports (EN 1993-1-5 6) with the 7.2
interaction, and deflection per serviceability combination (7.2).

Inputs are plain arrays (SI) or analysis objects (see :mod:`.demands`). Recommended: ``analysis=`` the
real diagram of every combination and pattern arrangement, a dict (or list) of
:class:`calckit.analysis.BeamResult` such as ``calckit.analysis.arrangements(solution, combinations)``
(or ``M=``/``V=`` dicts of arrays): bending and shear then take the worst at each station, and each LTB
segment is checked under every diagram with its own C1 and M_Ed, the governing one reported with its
combination name. Also accepted: one BeamResult or ``x``/``M``/``V`` arrays (one loading); an
:class:`calckit.analysis.Envelope` or ``(max, min)`` array pairs, whose LTB uses an envelope curve as the
moment diagram (approximate, noted); or ``demands=`` prepared once by :func:`.demands.demands`.

Several diagrams per segment: they are taken in order of decreasing peak moment, and a diagram that
cannot give a larger ratio than one already evaluated is not evaluated in full (:func:`_governing`):
its peak over M_b,Rd of a uniform moment (C1 = 1, the lowest critical moment of a doubly symmetric
segment between forks with the load at the shear centre, used only then) does not exceed the worst
ratio, or - without the f modification of 6.3.2.3(2) - a bound from an evaluated diagram of the same
sign and its own energy M_cr shows it cannot. A segment whose diagrams are those of a segment already
checked (directly or mirrored: the halves of a symmetric span) takes that result, moved to its place.
"""
from __future__ import annotations

import math
from dataclasses import replace

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
from .mcr import z_j
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

    ``analysis``: recommended, the real moment diagram of every load arrangement, a dict or list of
    BeamResults (``calckit.analysis.arrangements(solution, combinations)``); each LTB segment is then
    checked under every diagram with its own C1/C2 and M_Ed, and the governing diagram's name is in the
    check's ``combination``. One BeamResult (one loading) is accepted. An Envelope still works, but its
    LTB takes C1 from an envelope curve (approximate; noted). With arrays: ``M``/``V`` one array each, a
    dict {name: array} per diagram, or (max, min) envelope pairs.
    ``restraints``: positions (m) of lateral-torsional restraints, default the two ends (for a BeamResult
    with a free end: the nearest support that is not free instead of that end); "continuous" for a fully
    restrained compression flange (no LTB check). A part of the member beyond the first or last
    restraint is an overhang with a free end: ``overhang_root="continuous"`` (default) solves its LTB with
    the segment behind its root support, ``"fixed"`` takes the root as built in (also used when no other
    restraint exists). ``zg``: load height above the shear centre (every transverse load).
    ``forces``: :class:`Force` records or dicts (x, ss, F, load_type, c, flange, stiffened, stiffener); a
    stiffened force gets the bearing stiffener checks of EN 1993-1-5 section 9 (the given ``stiffener``
    (b_s, t_s[, clip]) in m, or the thinnest passing pair sized) instead of the web check of section 6.
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
    name_of = D.name_of
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
                                combination=name_of(D.V_by, iv, combination)))
    # -- bending with coexisting shear ---------------------------------------------------------------
    Mc = {}
    for sag, cl in cls.items():
        Marr = Mmax if sag else -Mmin
        base = _bend.bending_si(s, mat, ann, sagging=sag, cl=cl, sh=sh)
        Mc[sag] = base.M_c_Rd
        limit = sh.V_bw_Rd * 0.5 if sh.buckling else 0.5 * sh.V_pl_Rd
        high = np.nonzero(Vabs > limit)[0]
        if high.size:
            j = _worst_with_shear(s, mat, ann, sag, cl, sh, base.M_c_Rd, Marr, Vabs, high)
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
        res = _bend.result(r, mat, ann, float(Marr[j]), bc, location=float(xa[j]),
                           combination=name_of(D.M_max_by if sag else D.M_min_by, j, combination))
        checks.append(res)
    # -- lateral-torsional buckling per segment ------------------------------------------------------
    if not D.continuous:
        groups: dict = {}
        for sg in D.segments:
            groups.setdefault((sg.a, sg.b, sg.kind), []).append(sg)
        done: list = []  # (segments, result) of the groups checked, for mirror images (numeric path)
        for sgs in groups.values():
            r = None if steps else _mirrored(sgs, done)
            if r is None:
                r = _governing(s, mat, ann, sgs, D, method, use_f, steps, cls, combination)
                done.append((sgs, r))
            checks.append(r)
    # -- transverse forces ---------------------------------------------------------------------------
    for fd in D.forces:
        f = fd.force
        tc = Calc(steps)
        d = _tr.transverse_si(s, mat, ann, ss=f.ss, load_type=f.load_type, c=f.c, a=a_, flange=f.flange, calc=tc)
        tres = _tr.result(d, tc, fd.F, location=f.x, combination=fd.combination or combination)
        checks.append(tres)
        McR = Mc.get(fd.sagging) or next(iter(Mc.values()), None)
        if McR and fd.M > 0:
            checks.append(_tr.interaction_72(fd.F, d["F_Rd"], fd.M, McR, Calc(steps), location=f.x))
    # -- bearing stiffeners (EN 1993-1-5 section 9) at the forces marked stiffened --------------------
    for fd in D.stiffened:
        checks.extend(_bearing_stiffener(section, steel, ann, fy, fd, D, steps, combination, notes))
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


def _bearing_stiffener(section, steel, ann, fy, fd, D, steps, combination, notes) -> tuple:
    """The stiffener checks for one stiffened force: the given pair checked, else the thinnest passing
    pair of the plate series sized (:mod:`.stiffeners`). A stiffener at a member end (or a force of load
    type (c)) is an end stiffener, with the web beyond its outer face e = (distance to the end) - t_s / 2;
    both flanges are taken as laterally restrained there (at supports, and at interior forces where a
    restraint is: l = 0.75 h_w; elsewhere l = h_w)."""
    from .stiffeners import bearing_stiffener, size_bearing_stiffener

    f = fd.force
    x0, x1 = float(D.x[0]), float(D.x[-1])
    tol = 1e-6 * max(x1 - x0, 1.0)
    dist = min(f.x - x0, x1 - f.x)
    end = dist <= tol or f.load_type == "c"  # type (c): next to a member end (EN 1993-1-5 Figure 6.1)
    bounds = {round(v, 9) for sg in D.segments for v in (sg.a, sg.b)}
    restrained = end or D.continuous or any(abs(f.x - b) <= tol for b in bounds)
    kw = dict(end=end, annex=ann, restrained_flanges=restrained, fy=fy, steps=steps, location=f.x,
              combination=fd.combination or combination)
    F = f"{fd.F!r} N"  # the public functions take quantities
    if f.stiffener is not None:
        bs, ts = f.stiffener[0], f.stiffener[1]
        clip = f.stiffener[2] if len(f.stiffener) > 2 else None
        if end:
            kw["e"] = f"{max(dist - ts / 2, 0.0)!r} m"
        return bearing_stiffener(section, steel, F, b_s=f"{bs!r} m", t_s=f"{ts!r} m",
                                 clip=None if clip is None else f"{clip!r} m", **kw)
    if end:
        kw["e"] = "0 m"  # the thickness is not known before sizing: no web beyond the stiffener (conservative)
    sized = size_bearing_stiffener(section, steel, F, **kw)
    notes.append(f"force at x = {f.x:g} m: {sized.note}")
    return tuple(sized.checks)


def _worst_with_shear(s, mat, ann, sag, cl, sh, Mc, Marr, Vabs, high) -> int:
    """Station of the largest M_Ed / M_Rd, the stations in ``high`` with the resistance reduced by their
    shear (6.2.8 / EN 1993-1-5 7.1), the others with M_c,Rd. M_V,Rd does not increase with V_Ed, so
    M_Ed / M_V,Rd(V_max of those stations) bounds each high-shear station's ratio from above: they are
    evaluated in order of that bound until it cannot beat the worst ratio found."""
    ratios = np.clip(Marr, 0, None) / Mc
    low = np.ones(Marr.size, dtype=bool)
    low[high] = False
    best_j = int(np.argmax(np.where(low, ratios, -1.0))) if low.any() else -1
    best = float(ratios[best_j]) if best_j >= 0 else -math.inf
    live = high[Marr[high] > 0]
    if not live.size:
        return best_j if best_j >= 0 else int(np.argmax(Marr))
    r_min = _bend.bending_si(s, mat, ann, sagging=sag, V_Ed=float(Vabs[live].max()), cl=cl, sh=sh).M_Rd
    up = Marr[live] / r_min if r_min > 0 else np.full(live.size, math.inf)
    for i in np.argsort(-up, kind="stable"):
        j = int(live[i])
        if up[i] < best:
            break
        r = _bend.bending_si(s, mat, ann, sagging=sag, V_Ed=float(Vabs[j]), cl=cl, sh=sh)
        rj = Marr[j] / r.M_Rd if r.M_Rd > 0 else math.inf
        if rj > best or (rj == best and j < best_j):
            best, best_j = rj, j
    return best_j


def _segment(s, mat, ann, sg, D, method, use_f, steps, cls, combination):
    calc = Calc(steps)
    cl = cls.get(sg.sagging) or classify_si(s, mat, sagging=sg.sagging)
    d = _ltb.ltb_si(s, mat, ann, L=sg.L, dia=sg.diagram, zg=D.zg, k=D.k, kw=D.kw, method=method, use_f=use_f,
                    sagging=sg.sagging, calc=calc, cl=cl, cantilever=sg.model)
    if sg.envelope:
        d["notes"] = d["notes"] + ("C1 from an envelope curve, not one loading's moment diagram (approximate)",)
    return _ltb.result(d, calc, sg.peak, segment=(sg.a, sg.b), location=sg.location,
                       combination=sg.combination or combination)


_Q33 = np.linspace(0.0, 1.0, 33)
_SAME = 1e-9  #: relative tolerance of "the same segment" (diagram values, peak, length)


def _signature(sg) -> np.ndarray:
    return np.asarray(sg.diagram.fn(_Q33), dtype=float) / sg.diagram.Mmax


def _mirrored(sgs, done):
    """The result of an earlier segment whose diagrams are the same as these - each diagram matched to
    one with the same peak, sign and normalised shape, directly or mirrored end to end (e.g. the two
    halves of a symmetric span, or the spans of a symmetric continuous beam under mirrored load
    arrangements) - with this segment's position and the matching diagram's name; None otherwise.
    Only between restraints (forks)."""
    if sgs[0].kind != "forks":
        return None
    mine = None
    for prev, res in done:
        if prev[0].kind != "forks" or len(prev) != len(sgs) or abs(prev[0].L - sgs[0].L) > _SAME * sgs[0].L:
            continue
        if mine is None:
            mine = [_signature(b) for b in sgs]
        theirs = [_signature(a) for a in prev]
        for flip in (False, True):
            match: dict = {}
            for i, a in enumerate(prev):
                for j, b in enumerate(sgs):
                    if j in match.values() or a.sagging != b.sagging or abs(a.peak - b.peak) > _SAME * a.peak:
                        continue
                    if np.max(np.abs(theirs[i] - (mine[j][::-1] if flip else mine[j]))) <= _SAME:
                        match[i] = j
                        break
                else:
                    break
            if len(match) != len(prev):
                continue
            gi = next((i for i, a in enumerate(prev) if a.combination == res.combination), None)
            if gi is None:
                continue
            g = sgs[0]
            loc = res.location
            if loc is not None:
                loc = g.a + (prev[0].b - loc if flip else loc - prev[0].a)
            return replace(res, segment=(g.a, g.b), location=loc, combination=sgs[match[gi]].combination)
    return None


def _governing(s, mat, ann, sgs, D, method, use_f, steps, cls, combination):
    """The LTB check of one segment under the diagram with the largest ratio (module docstring).

    Diagrams in order of decreasing peak P; one is not evaluated in full when it cannot give a larger
    ratio than the worst found: (1) P / M_b,Rd of a uniform moment does not exceed it (z_g = 0, doubly
    symmetric section, between restraints: C1 >= 1); (2) without the f modification of 6.3.2.3(2), so
    that M_b,Rd depends on M_cr alone: with an evaluated diagram j of the same sign (ratio r_j, peak P_j,
    M_cr,j), r_j (P / P_j) max(1, M_cr,j / M_cr) does not exceed it - M_b,Rd does not decrease with M_cr,
    and M_b,Rd / M_cr (chi_LT lambda_LT^2) does not decrease with lambda_LT for any curve, so M_b,Rd >=
    M_b,Rd,j M_cr / M_cr,j for M_cr < M_cr,j (tests/test_en1993_member_diagrams.py checks both rules)."""
    if len(sgs) == 1:
        return _segment(s, mat, ann, sgs[0], D, method, use_f, steps, cls, combination)
    forks = sgs[0].kind == "forks"
    uniform_ok = forks and D.zg == 0 and s.symmetric
    f_dep = forks and (method or ann.ltb_method) == "rolled" and (ann.ltb_f if use_f is None else bool(use_f))
    EIz, GIt, EIw, zj = mat.E * s.Iy, mat.G * s.J, mat.E * s.Cw, z_j(s)
    bound: dict = {}
    seen: list = []  # (sagging, peak, M_cr, ratio) of the diagrams evaluated
    worst = wsg = None
    n_eval = 0
    for sg in sorted(sgs, key=lambda g: -g.peak):
        if worst is not None:
            if uniform_ok:
                Mb1 = bound.get(sg.sagging)
                if Mb1 is None:
                    cl = cls.get(sg.sagging) or classify_si(s, mat, sagging=sg.sagging)
                    Mb1 = bound[sg.sagging] = _ltb.ltb_si(s, mat, ann, L=sg.L, C1=1.0, zg=0.0, k=D.k, kw=D.kw,
                                                           method=method, use_f=use_f, sagging=sg.sagging,
                                                           cl=cl)["M_b_Rd"]
                if sg.peak <= worst.ratio * Mb1:
                    continue
            same = [t for t in seen if t[0] == sg.sagging]
            if not f_dep and same:
                if sg.model is not None:
                    mcr = sg.model.mcr(EIz, GIt, EIw, zg=D.zg, zj=zj)
                else:
                    mcr = sg.diagram.mcr_energy(sg.L, EIz, GIt, EIw, zg=D.zg, zj=zj, k=D.k, kw=D.kw)
                lim = min(r * (sg.peak / p) * max(1.0, m / mcr) for _, p, m, r in same)
                if lim <= worst.ratio * (1.0 - 1e-9):
                    continue
        r = _segment(s, mat, ann, sg, D, method, use_f, False, cls, combination)
        n_eval += 1
        seen.append((sg.sagging, sg.peak, r.Mcr, r.ratio))
        if worst is None or r.ratio > worst.ratio:
            worst, wsg = r, sg
    if steps:  # the governing diagram again, with its calc-sheet steps
        worst = _segment(s, mat, ann, wsg, D, method, use_f, True, cls, combination)
        worst = replace(worst, note="; ".join(t for t in (worst.note, f"governing of {len(sgs)} moment diagrams "
                                                          f"(load arrangements) of this segment") if t))
    worst.data["diagrams"] = len(sgs)
    worst.data["diagrams_evaluated"] = n_eval
    return worst
