"""Member check to AISC 360-22: every limit state along a member, and the governing one.

``check_member(section, steel, analysis, bracing=..., bearing=[...], deflections={...})`` runs

1. flexure (Chapter F) in every unbraced segment, each with its own Mu and its Cb from the moment
   diagram (Eq. F1-1); for singly symmetric sections both signs of moment are checked with the matching
   compression flange;
2. shear (G2.1 / G2.2) over the member, or per panel between transverse stiffeners, and the transverse
   stiffener requirement (G2.3) when stiffeners are given;
3. concentrated forces (J10.1-J10.3; J10.4 and web compression buckling where a bearing asks for
   them) at every bearing given (reactions and loads), with the stiffener pair (J10.8) sized or
   checked where a force fails;
4. deflection against L/n per serviceability case and span part (cantilevers: 2L, common practice);
5. proportioning limits of welded I-shapes (F13.2).

The demands are prepared once (:func:`calckit.design.aisc360.demands.demands`) and can be passed back with
``demands=`` to check many sections fast (``steps=False``).
"""
from __future__ import annotations

from dataclasses import replace

from ...errors import InputError
from ..results import CheckResult, MemberResult
from ._core import CAUTION, STANDARD, Calc, Fm, factor_of, material, parse_method, props, result
from .cb import F1_1, cb_value
from .concentrated import member_forces as _member_forces
from .deflection import deflection_check
from .demands import Demands, demands as _demands
from .flexure import FlexSection, build_result
from .shear import _covered, _factor_data, _stiff, shear_strength, stiffener_checks, LS_SHEAR

__all__ = ["check_member"]

F13_3 = Fm("lam_w_max", "12.0*sqrt(E/F_y)", "AISC 360-22 Eq. F13-3", "web slenderness limit, a/h <= 1.5")
F13_4 = Fm("lam_w_max", "0.40*E/F_y", "AISC 360-22 Eq. F13-4", "web slenderness limit, a/h > 1.5")


def check_member(section, steel, analysis=None, *, method: str = "LRFD", x=None, M=None, V=None,
                 supports=None, bracing="none", Lb=None, bearing=(), stiffeners=None, stiffener=None,
                 stiffener_pair: bool = True, deflections=None, member: str = "floor", deflection_limits=None,
                 Cb=None, EI=None, demands: Demands | None = None, steps: bool = True) -> MemberResult:
    """Check a beam or girder to AISC 360-22 along its length (LRFD or ASD).

    Parameters
    ----------
    section, steel : section (or SectionProps) and grade, as for :func:`flexure`.
    analysis : calckit.analysis results: a BeamResult of one combination, a list/dict of them, or an
        Envelope; or give arrays ``x``, ``M``, ``V`` instead (see :mod:`.demands`). Factored (LRFD) or
        service-level ASD combinations, matching ``method``.
    method : "LRFD" or "ASD".
    supports : support positions (default: those of the analysis, or both ends for arrays).
    bracing : ``0`` / "continuous" (Lb = 0), a list of brace positions, or "none" (braces at the supports
        only). Supports always brace the member. ``Lb`` is accepted as another name for ``bracing``.
    bearing : concentrated forces to check: ``calckit.design.aisc360.bearing(x, lb, P=None, ...)`` records
        or dicts of its arguments; P is taken from the shear diagram when not given.
    stiffeners : transverse stiffener positions, or one spacing ("1.5 m") from the left end; None for an
        unstiffened web. ``stiffener=(b_st, t_st)`` and ``stiffener_pair`` size them for G2.3.
    deflections : dict case -> deflections ("live", "total", ...); limits from ``member`` ("floor",
        "roof") or ``deflection_limits={"live": 360, ...}``. ``EI``: the EI the deflections were computed
        with; when given they are scaled to the section checked (prismatic member, rigid supports).
    Cb : one Cb for every segment instead of Eq. F1-1 from the diagrams (warned outside 1.0-3.0).
    demands : a prepared :class:`Demands` (then leave the analysis arguments out).
    steps : build calc-sheet records (False: numeric path for section searches).

    Returns a :class:`calckit.design.results.MemberResult`; ``.governing`` is the check with the largest
    ratio. A failing member is a result (``passed`` False), never an exception.
    """
    m = parse_method(method)
    if Lb is not None:
        if bracing not in ("none", None):
            raise InputError("Lb: got both Lb and bracing; expected one of them")
        bracing = Lb
    if demands is None:
        D = _demands(analysis, x=x, M=M, V=V, supports=supports, bracing=bracing, bearing=bearing,
                     stiffeners=stiffeners, deflections=deflections, member=member,
                     deflection_limits=deflection_limits, Cb=Cb, EI=EI)
    else:
        if not isinstance(demands, Demands):
            raise InputError(f"demands: got {type(demands).__name__}; expected the result of aisc360.demands(...)")
        if analysis is not None or x is not None or M is not None:
            raise InputError("demands: got prepared demands and analysis arguments; expected one or the other")
        D = demands
    p = props(section)
    mat = material(steel, p)
    return _check(p, mat, D, m, steps, stiffener=_stiff(stiffener), pair=stiffener_pair)


def _check(p, mat, D: Demands, method: str, steps: bool, *, stiffener=None, pair=True) -> MemberResult:
    checks: list[CheckResult] = []
    notes = list(D.notes)
    if mat.note:
        notes.append(mat.note)
    fast = Calc(False)
    fsec: dict[str, FlexSection] = {}

    def fs_for(side: str) -> FlexSection:
        fs = fsec.get(side)
        if fs is None:
            fs = fsec[side] = FlexSection(p, mat, "major", side, method, Calc(steps))
        return fs

    phi_b = factor_of("flexure", method)
    sym = p.symmetric
    # ------------------------------------------------------------------------------------ flexure
    groups: dict = {}
    for it in D.flexure:
        groups.setdefault(it.segment, []).append(it)
    continuous = D.bracing == "continuous"
    for seg, items in groups.items():
        Lb = 0.0 if continuous else seg.Lb
        best: dict[str, tuple] = {}
        for it in items:
            if D.Cb is not None:
                Cb, how = D.Cb, "given"
            elif seg.free_end or continuous:
                Cb, how = 1.0, ("free end" if seg.free_end else "continuous")
            else:
                Cb, how = cb_value(it.Mmax, it.MA, it.MB, it.MC), "F1-1"
            for side, Mu, loc in (("top", it.M_pos, it.x_pos), ("bottom", it.M_neg, it.x_neg)):
                if Mu <= 0.0:
                    continue
                key = "top" if sym else side
                fs = fs_for(key)
                Mn = fs.mn(Lb, Cb)
                ratio = Mu / (phi_b * Mn)
                if key not in best or ratio > best[key][0]:
                    best[key] = (ratio, it, side, Mu, loc, Cb, how)
        for key in sorted(best, key=lambda k: -best[k][0]):
            _, it, side, Mu, loc, Cb, how = best[key]
            calc = Calc(steps)
            if steps:
                calc.given("M_u" if method == "LRFD" else "M_a", Mu, "moment",
                           reference=f"analysis{', ' + it.combination if it.combination else ''}; "
                                     f"largest {'sagging' if side == 'top' else 'hogging'} moment in the segment")
                if how == "F1-1":
                    calc.given("M_max", it.Mmax, "moment", reference="largest |M| in the unbraced segment")
                    calc.given("M_A", it.MA, "moment", reference="|M| at the quarter point")
                    calc.given("M_B", it.MB, "moment", reference="|M| at the centre line")
                    calc.given("M_C", it.MC, "moment", reference="|M| at the three-quarter point")
                    calc(F1_1, M_max=it.Mmax, M_A=it.MA, M_B=it.MB, M_C=it.MC)
                elif how == "free end":
                    calc.say("unbraced free end (cantilever): Cb = 1.0", reference="AISC 360-22 F1 User Note")
            fs = fs_for(key)
            checks.append(build_result(fs, Lb, Cb, calc, demand=Mu, location=loc, segment=(seg.a, seg.b),
                                       combination=it.combination,
                                       suffix="" if sym else f" ({side} flange in compression)",
                                       extra={"compression_flange": side, "Cb_source": how},
                                       record_demand=False, material_note=False))
    # -------------------------------------------------------------------------------------- shear
    shear_res: dict = {}
    if D.shear:
        _covered(p, "major")
    cache: dict = {}
    for pd in D.shear:
        a = pd.a1 - pd.a0 if pd.stiffened else None
        key = (None if a is None else round(a, 9), pd.end_panel)
        calc = Calc(steps)
        if steps or key not in cache:
            Vn, Vc, cl, data, kind = shear_strength(p, mat, a, method, calc, end_panel=pd.end_panel)
            data.update(_factor_data(kind, method))
            cache[key] = (Vn, Vc, cl, data)
        Vn, Vc, cl, data = cache[key]
        if steps:
            calc.given("V_u" if method == "LRFD" else "V_a", pd.Vu, "force",
                       reference=f"analysis{', ' + pd.combination if pd.combination else ''}; largest |V| in "
                                 f"{'the panel' if pd.stiffened else 'the member'}")
        checks.append(result(limit_state=LS_SHEAR + (" (end panel)" if pd.end_panel else ""),
                             clause=f"{STANDARD} {cl}", dim="force", capacity=Vc, nominal=Vn, method=method,
                             location=pd.x, segment=(pd.a0, pd.a1) if pd.stiffened else None,
                             combination=pd.combination, steps=calc.take(), data=dict(data), demand=pd.Vu))
        shear_res[(pd.a0, pd.a1)] = (pd, Vc)
    # ------------------------------------------------------------------------- transverse stiffeners
    if D.stiffeners and D.shear and D.shear[0].stiffened:
        worst = None
        for xs in D.stiffeners:
            if xs <= D.x0 + 1e-9 or xs >= D.x1 - 1e-9:
                continue
            for (a0, a1), (pd, Vc) in shear_res.items():
                if abs(a0 - xs) > 1e-9 and abs(a1 - xs) > 1e-9:
                    continue
                rs = stiffener_checks(p, mat, mat, a1 - a0, pd.Vu, method, fast, stiffener=stiffener, pair=pair,
                                      Vc1=Vc)
                req = rs[0].demand if rs[0].demand is not None else rs[0].capacity
                if worst is None or req > worst[0]:
                    worst = (req, xs, a1 - a0, pd.Vu, Vc)
        if worst is not None:
            _, xs, a, Vu, Vc = worst
            rs = stiffener_checks(p, mat, mat, a, Vu, method, Calc(steps), stiffener=stiffener, pair=pair, Vc1=Vc)
            checks.extend(replace(r, location=xs, note="; ".join(n for n in (r.note, f"governing stiffener at "
                          f"x = {xs:.4g} m") if n)) for r in rs)
    # -------------------------------------------------------------------------- concentrated forces
    # J10.1-J10.5 per force; J10.4 / web compression buckling where the bearing asks for them, and the
    # stiffener pair (J10.8) of a failing force (concentrated.member_forces)
    checks.extend(_member_forces(p, mat, D, method, steps))
    # ---------------------------------------------------------------------------------- deflection
    scale = 1.0
    if D.deflections and D.EI_ref is not None:
        scale = D.EI_ref / (mat.E * p.Ix)
    for dd in D.deflections:
        calc = Calc(steps)
        sc = scale != 1.0
        checks.append(deflection_check(dd.delta * scale, dd.b - dd.a, dd.n, dd.case, calc, cantilever=dd.cantilever,
                                       location=dd.x, segment=(dd.a, dd.b),
                                       extra_data={"EI_scale": scale} if sc else None,
                                       extra_note=f"deflection scaled by EI_analysis / (E Ix) = {scale:.4g}"
                                       if sc else ""))
    # --------------------------------------------------------------------------------- proportions
    if p.kind == "I_welded":
        checks.extend(_proportions(p, mat, D, Calc(steps)))
    msteps: tuple = ()
    if steps:
        msteps = tuple(s for side in ("top", "bottom") if side in fsec for s in fsec[side].steps)
    notes.append(CAUTION)
    return MemberResult(standard=STANDARD, method=method, checks=tuple(checks), section=p.name, steel=mat.name,
                        notes=tuple(dict.fromkeys(n for n in notes if n)), steps=msteps)


def _proportions(p, mat, D: Demands, calc: Calc) -> list[CheckResult]:
    """AISC 360-22 F13.2 proportioning limits of welded I-shapes (internal)."""
    out = []
    E, Fy, h, tw = mat.E, mat.Fy, p.h_clear, p.tw
    ref = f"{STANDARD} F13.2"
    stiffened = bool(D.shear) and D.shear[0].stiffened
    a_h = max(((pd.a1 - pd.a0) / h for pd in D.shear), default=None) if stiffened else None
    if stiffened and a_h is not None and a_h <= 1.5:
        lim = calc(F13_3, E=E, F_y=Fy)
        cl = "F13.2(b)(1)"
    else:
        lim = calc(F13_4, E=E, F_y=Fy)
        cl = "F13.2(b)(2)"
    note = ""
    if not stiffened and lim > 260.0:
        lim = calc.given("lam_w_max", 260.0, reference=f"{ref}: unstiffened girders, h/tw <= 260")
        note = "unstiffened girder: h/tw <= 260"
    out.append(CheckResult(limit_state="Proportions: web slenderness h/tw", clause=f"{STANDARD} {cl}",
                           dim="dimensionless", capacity=lim, method="", steps=calc.take(),
                           data={"h_tw": h / tw, "h_tw_max": lim}, note=note).with_demand(h / tw))
    if not p.symmetric:
        r = p.Iy_top / p.Iy
        worst = max(r / 0.9, 0.1 / r)
        out.append(CheckResult(limit_state="Proportions: 0.1 <= Iyc/Iy <= 0.9", clause=f"{STANDARD} Eq. F13-2",
                               dim="dimensionless", capacity=1.0, method="",
                               data={"Iyc_Iy": r, "normalised": worst},
                               note=f"Iyc/Iy = {r:.3f} (top flange); ratio shown is max((Iyc/Iy)/0.9, "
                                    "0.1/(Iyc/Iy))").with_demand(worst))
    return out
