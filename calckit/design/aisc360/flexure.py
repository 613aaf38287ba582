"""Flexure, AISC 360-22 Chapter F: sections F2, F3 and F6 here; F4 and F5 in :mod:`._f4f5`.

Which section applies (AISC 360-22 Table User Note F1.1, from memory):

=====================================================  =========================================
section                                                Chapter F section
=====================================================  =========================================
doubly symmetric I or channel, compact web and flange  F2 (channel: c per Eq. F2-8b)
doubly symmetric I, compact web, noncompact/slender    F3
flange
doubly symmetric I with noncompact web; singly         F4
symmetric I with compact or noncompact web
I-shape with slender web                               F5
I-shape or channel, minor axis                         F6
=====================================================  =========================================

Equations (numbers as in AISC 360-16/360-22, from memory): Mp = Fy Zx (F2-1); Lp = 1.76 ry sqrt(E/Fy)
(F2-5); Lr (F2-6); Mn = Cb [Mp - (Mp - 0.7 Fy Sx)(Lb - Lp)/(Lr - Lp)] <= Mp (F2-2); Mn = Fcr Sx <= Mp
(F2-3) with Fcr = Cb pi^2 E/(Lb/rts)^2 sqrt(1 + 0.078 J c/(Sx ho)(Lb/rts)^2) (F2-4); c = 1 for doubly
symmetric I (F2-8a), c = (ho/2) sqrt(Iy/Cw) for channels (F2-8b). F3-1, F3-2 for flange local buckling.
F6-1 to F6-4 for the minor axis.

Internal structure: :class:`FlexSection` holds everything that does not depend on Lb and Cb (computed
once per section, steel and compression flange); :meth:`FlexSection.strength` adds lateral-torsional
buckling for one unbraced segment. :func:`flexure` is the public single-segment check.
"""
from __future__ import annotations

import math

from ...errors import InputError
from ..results import CheckResult
from ._core import (STANDARD, Calc, Cond, Fm, available, check_Cb, kind_word, length_si, material,
                    not_covered, parse_method, props, quantity_si, result)
from ._f4f5 import f4, f5, ltb_f4, ltb_f5
from .classify import Classification, _axis, classify_major, classify_minor, igeom

__all__ = ["flexure", "FlexSection", "flex_section"]

_R = "AISC 360-22"

MP = Fm("M_p", "F_y*Z_x", f"{_R} Eq. F2-1", "plastic moment")
MR = Fm("M_r", "0.7*F_y*S_x", f"{_R} F2.2", "moment at the onset of inelastic LTB, 0.7 Fy Sx")
F2_5 = Fm("L_p", "1.76*r_y*sqrt(E/F_y)", f"{_R} Eq. F2-5", "limiting unbraced length for yielding")
F2_6 = Fm("L_r", "1.95*r_ts*(E/(0.7*F_y))*sqrt(J*c/(S_x*h_o) + sqrt((J*c/(S_x*h_o))**2 "
          "+ 6.76*(0.7*F_y/E)**2))", f"{_R} Eq. F2-6", "limiting unbraced length for inelastic LTB")
F2_8B = Fm("c", "(h_o/2)*sqrt(I_y/C_w)", f"{_R} Eq. F2-8b", "channel coefficient c")
F2_2 = Fm("M_n", "Min(C_b*(M_p - (M_p - 0.7*F_y*S_x)*((L_b - L_p)/(L_r - L_p))), M_p)", f"{_R} Eq. F2-2",
          "inelastic lateral-torsional buckling")
F2_4 = Fm("F_cr", "C_b*pi**2*E/(L_b/r_ts)**2*sqrt(1 + 0.078*J*c/(S_x*h_o)*(L_b/r_ts)**2)", f"{_R} Eq. F2-4",
          "elastic lateral-torsional buckling stress")
F2_3 = Fm("M_n", "Min(F_cr*S_x, M_p)", f"{_R} Eq. F2-3", "elastic lateral-torsional buckling")
F2_NA = Cond("L_b <= L_p", f"{_R} F2.2(a)", then="the limit state of lateral-torsional buckling does not apply",
             otherwise="lateral-torsional buckling applies")
F2_IN = Cond("L_b <= L_r", f"{_R} F2.2(b)-(c)", then="inelastic lateral-torsional buckling (Eq. F2-2)",
             otherwise="elastic lateral-torsional buckling (Eqs. F2-3, F2-4)")
F3_1 = Fm("M_n", "M_p - (M_p - 0.7*F_y*S_x)*((lam_f - lam_pf)/(lam_rf - lam_pf))", f"{_R} Eq. F3-1",
          "compression flange local buckling, noncompact flange")
F3_2 = Fm("M_n", "0.9*E*k_c*S_x/lam_f**2", f"{_R} Eq. F3-2", "compression flange local buckling, slender flange")
F6_1 = Fm("M_n", "Min(F_y*Z_y, 1.6*F_y*S_y)", f"{_R} Eq. F6-1", "minor-axis yielding, Mn = Mp")
F6_2 = Fm("M_n", "M_p - (M_p - 0.7*F_y*S_y)*((lam_f - lam_pf)/(lam_rf - lam_pf))", f"{_R} Eq. F6-2",
          "flange local buckling, noncompact flange (minor axis)")
F6_4 = Fm("F_cr", "0.69*E/lam_f**2", f"{_R} Eq. F6-4", "flange local buckling stress, slender flange")
F6_3 = Fm("M_n", "F_cr*S_y", f"{_R} Eq. F6-3", "flange local buckling, slender flange (minor axis)")

_FAST = Calc(False)
LS_Y = "Flexure: yielding"
LS_LTB = "Flexure: lateral-torsional buckling"
LS_FLB = "Flexure: compression flange local buckling"
LS_CFY = "Flexure: compression flange yielding"
LS_TFY = "Flexure: tension flange yielding"
LS_MINOR_Y = "Flexure (minor axis): yielding"
LS_MINOR_FLB = "Flexure (minor axis): flange local buckling"


class FlexSection:
    """Lb- and Cb-independent part of the flexural strength of one section (internal).

    Attributes: ``F`` (Chapter F section, e.g. "F2"), ``fixed`` (list of (limit state, Mn, clause) that do
    not depend on Lb), ``cap`` (upper bound of the LTB strength), ``data`` (values for CheckResult.data),
    ``steps`` (records of the section-level calculation), ``Lp``, ``Lr``.
    """

    def __init__(self, p, mat, axis: str, compression: str, method: str, calc: Calc) -> None:
        self.p, self.mat, self.axis, self.compression, self.method = p, mat, axis, compression, method
        self.fixed: list[tuple[str, float, str]] = []
        self.data: dict = {}
        self.Lp = self.Lr = math.inf
        self.ltb_kind = None  # "F2", "F4", "F5" or None
        self.notes: list[str] = [mat.note] if mat.note else []
        Fy, E = mat.Fy, mat.E
        calc.given("F_y", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
        calc.given("E", E, "stress", reference=f"{_R} modulus of elasticity")
        if axis == "minor":
            self._minor(calc)
        else:
            if p.kind not in ("I_rolled", "I_welded", "channel"):
                raise _not_covered_major(p)
            g = igeom(p, compression)
            self.g = g
            cl = classify_major(p, Fy, E, g, calc, compression)
            self.cl = cl
            self._store_class(cl)
            w, f = cl.web.cls, cl.flange.cls
            if p.kind == "channel":
                if w != "compact" or f != "compact":
                    raise not_covered(f"channel with a {f} flange and a {w} web (major axis)",
                                      "F2 covers channels with compact elements only; no Chapter F section "
                                      "written for other channels")
                self._f2(calc)
            elif w == "slender":
                f5(self, calc)
            elif not p.symmetric or w == "noncompact":
                f4(self, calc)
            elif f == "compact":
                self._f2(calc)
            else:
                self._f2(calc, flb_only=True)
        self.steps = calc.take()

    # ---------------------------------------------------------------------------------------- helpers
    def _store_class(self, cl: Classification) -> None:
        d = self.data
        d["class_flange"], d["lambda_f"] = cl.flange.cls, cl.flange.lam
        d["lambda_pf"], d["lambda_rf"] = cl.flange.lam_p, cl.flange.lam_r
        if cl.web is not None:
            d["class_web"], d["lambda_w"] = cl.web.cls, cl.web.lam
            d["lambda_pw"], d["lambda_rw"] = cl.web.lam_p, cl.web.lam_r
        if cl.kc is not None:
            d["kc"] = cl.kc
        if cl.FL is not None:
            d["FL"] = cl.FL
        d["class"] = cl.section_class

    # ------------------------------------------------------------------------------------ F2 and F3
    def _f2(self, calc: Calc, flb_only: bool = False) -> None:
        p, Fy, E = self.p, self.mat.Fy, self.mat.E
        self.F = "F3" if flb_only else "F2"
        what = ("noncompact or slender flange, compact web: AISC 360-22 F3" if flb_only
                else "compact flange and web: AISC 360-22 F2")
        calc.say(f"{kind_word(p)}, {what} applies", reference=f"{_R} Table User Note F1.1")
        Mp = calc(MP, F_y=Fy, Z_x=p.Zx)
        self.data["Mp"] = Mp
        self.data["Mr"] = calc(MR, F_y=Fy, S_x=p.Sx)
        if p.kind == "channel":
            c = calc(F2_8B, h_o=p.ho, I_y=p.Iy, C_w=p.Cw)
        else:
            c = 1.0
            calc.say("doubly symmetric I-shape: c = 1 (Eq. F2-8a)", reference=f"{_R} Eq. F2-8a")
        Lp = calc(F2_5, r_y=p.ry, E=E, F_y=Fy)
        Lr = calc(F2_6, r_ts=p.rts, E=E, F_y=Fy, J=p.J, c=c, S_x=p.Sx, h_o=p.ho)
        self.Lp, self.Lr, self.cap, self.c = Lp, Lr, Mp, c
        self.data.update(Lp=Lp, Lr=Lr, rts=p.rts, c=c, section_F=self.F)
        self.ltb_kind = "F2"
        if flb_only:
            cl = self.cl
            lf, lpf, lrf = cl.flange.lam, cl.flange.lam_p, cl.flange.lam_r
            if cl.flange.cls == "noncompact":
                Mn = calc(F3_1, M_p=Mp, F_y=Fy, S_x=p.Sx, lam_f=lf, lam_pf=lpf, lam_rf=lrf)
                cla = "F3.2(a)"
            else:
                Mn = calc(F3_2, E=E, k_c=cl.kc, S_x=p.Sx, lam_f=lf)
                cla = "F3.2(b)"
            self.fixed.append((LS_FLB, Mn, cla))
            self.data["Mn_FLB"] = Mn
        else:
            self.fixed.append((LS_Y, Mp, "F2.1"))
            self.data["Mn_Y"] = Mp

    def _ltb_f2(self, Lb: float, Cb: float, calc: Calc):
        p, Fy, E = self.p, self.mat.Fy, self.mat.E
        Lp, Lr, Mp = self.Lp, self.Lr, self.cap
        if calc.cond(F2_NA, L_b=Lb, L_p=Lp):
            return None, "F2.2(a)", "none", None
        if calc.cond(F2_IN, L_b=Lb, L_r=Lr):
            Mn = calc(F2_2, C_b=Cb, M_p=Mp, F_y=Fy, S_x=p.Sx, L_b=Lb, L_p=Lp, L_r=Lr)
            return Mn, "F2.2(b)", "inelastic", None
        Fcr = calc(F2_4, C_b=Cb, E=E, L_b=Lb, r_ts=p.rts, J=p.J, c=self.c, S_x=p.Sx, h_o=p.ho)
        Mn = calc(F2_3, F_cr=Fcr, S_x=p.Sx, M_p=Mp)
        return Mn, "F2.2(c)", "elastic", Fcr

    # ------------------------------------------------------------------------------------------ F6
    def _minor(self, calc: Calc) -> None:
        p, Fy, E = self.p, self.mat.Fy, self.mat.E
        if p.kind not in ("I_rolled", "I_welded", "channel"):
            raise not_covered(f"{kind_word(p)} bent about the minor axis", _minor_clause(p))
        self.F = "F6"
        cl = classify_minor(p, Fy, E, calc)
        self.cl = cl
        self._store_class(cl)
        calc.say("I-shape or channel bent about its minor axis: AISC 360-22 F6 applies", reference=f"{_R} F6")
        Mp = calc(F6_1, F_y=Fy, Z_y=p.Zy, S_y=p.Sy)
        self.fixed.append((LS_MINOR_Y, Mp, "F6.1"))
        self.data.update(Mp=Mp, Mn_Y=Mp, section_F="F6")
        lf, lpf, lrf = cl.flange.lam, cl.flange.lam_p, cl.flange.lam_r
        if cl.flange.cls == "compact":
            calc.say("compact flanges: flange local buckling does not apply", reference=f"{_R} F6.2(a)")
        elif cl.flange.cls == "noncompact":
            Mn = calc(F6_2, M_p=Mp, F_y=Fy, S_y=p.Sy, lam_f=lf, lam_pf=lpf, lam_rf=lrf)
            self.fixed.append((LS_MINOR_FLB, Mn, "F6.2(b)"))
            self.data["Mn_FLB"] = Mn
        else:
            Fcr = calc(F6_4, E=E, lam_f=lf)
            Mn = calc(F6_3, F_cr=Fcr, S_y=p.Sy)
            self.fixed.append((LS_MINOR_FLB, Mn, "F6.2(c)"))
            self.data.update(Mn_FLB=Mn, Fcr_FLB=Fcr)
        self.cap = Mp

    # ------------------------------------------------------------------------------------ per segment
    def ltb(self, Lb: float, Cb: float, calc: Calc):
        """(Mn or None, clause, zone, Fcr) of lateral-torsional buckling for one unbraced segment."""
        if self.ltb_kind is None:
            return None, "", "none", None
        if self.ltb_kind == "F2":
            return self._ltb_f2(Lb, Cb, calc)
        return (ltb_f4 if self.ltb_kind == "F4" else ltb_f5)(self, Lb, Cb, calc)

    def mn(self, Lb: float, Cb: float) -> float:
        """Nominal strength only (numeric path used to pick the governing demand)."""
        best = min((mn for _, mn, _ in self.fixed), default=math.inf)
        if self.ltb_kind is not None:
            mn = self.ltb(Lb, Cb, _FAST)[0]
            if mn is not None and mn < best:
                best = mn
        return best

    def strength(self, Lb: float, Cb: float, calc: Calc):
        """Nominal strength over all limit states: (Mn, limit state, clause, data)."""
        data = dict(self.data)
        best_ls, best_mn, best_cl = None, math.inf, ""
        for ls, mn, cl in self.fixed:
            if mn < best_mn:
                best_ls, best_mn, best_cl = ls, mn, cl
        if self.ltb_kind is not None:
            calc.given("L_b", Lb, "span", reference="unbraced length of the compression flange")
            calc.given("C_b", Cb, reference="lateral-torsional buckling modification factor")
            mn, cl, zone, Fcr = self.ltb(Lb, Cb, calc)
            data.update(Lb=Lb, Cb=Cb, ltb_zone=zone)
            if Fcr is not None:
                data["Fcr"] = Fcr
            if mn is not None:
                data["Mn_LTB"] = mn
                if mn < best_mn - 1e-9 * abs(best_mn):
                    best_ls, best_mn, best_cl = LS_LTB, mn, cl
        return best_mn, best_ls, best_cl, data


def _not_covered_major(p):
    clause = {"tee": "F9 (tees and double angles)", "rect": "F11 (rectangular bars and rounds)",
              "hollow": "F7 (square and rectangular HSS and box sections)",
              "builtup": "F4/F5 for cover-plated I-shapes (or F7 for box sections)"}.get(p.kind, "Chapter F")
    return not_covered(f"major-axis flexure of a {kind_word(p)}", clause)


def _minor_clause(p) -> str:
    return {"tee": "F12 (unsymmetrical and other shapes; F9 covers tees in the plane of symmetry only)",
            "rect": "F11 (rectangular bars and rounds)",
            "hollow": "F7 (square and rectangular HSS and box sections)",
            "builtup": "F6 for a built-up I (not implemented for BuiltUp sections)"}.get(p.kind, "Chapter F")


def flex_section(p, mat, axis: str, compression: str, method: str, steps: bool) -> FlexSection:
    """Build the Lb-independent part (internal helper for member checks)."""
    return FlexSection(p, mat, axis, compression, method, Calc(steps))


def flexure(section, steel, Lb=0, Cb: float = 1.0, method: str = "LRFD", *, axis: str = "major",
            compression: str = "top", Mu=None, steps: bool = True) -> CheckResult:
    """Available flexural strength of one unbraced segment, AISC 360-22 Chapter F (F2-F6).

    Parameters
    ----------
    section : calckit section (IShape, PlateGirder, Channel, catalog section) or its SectionProps.
    steel : grade name ("A992") or calckit Steel; Fy is that of the thickest element's band.
    Lb : unbraced length of the compression flange ("11.7 ft", a quantity, or a bare 0 for continuous
        bracing); ignored for the minor axis.
    Cb : lateral-torsional buckling modification factor (Eq. F1-1); values below 1.0 or above 3.0 are used
        as given with a UserWarning and a note in the result.
    method : "LRFD" (phi_b = 0.90) or "ASD" (Omega_b = 1.67), AISC 360-22 F1(1).
    axis : "major" (x-x) or "minor" (y-y).
    compression : flange in compression, "top" (sagging) or "bottom" (hogging); matters for singly
        symmetric sections.
    Mu : required strength (Mu for LRFD, Ma for ASD) as a quantity or string; fills ratio and passed.
    steps : build calc-sheet records (False: numeric path only).

    Returns a :class:`calckit.design.results.CheckResult`: ``capacity`` = phi_b Mn or Mn/Omega_b (N*m),
    ``nominal`` = Mn, ``clause`` of the governing limit state, ``data`` with Mp, Lp, Lr, Fcr, class,
    lambda values, Rpc/Rpt/Rpg where they apply and every limit state's Mn (``Mn_Y``, ``Mn_LTB``, ...).

    Raises InputError for Lb < 0 or Cb <= 0, NotCoveredError naming the Chapter F section for shapes not
    covered (tees F9, HSS/box F7, bars F11, ...).
    """
    m = parse_method(method)
    p = props(section)
    mat = material(steel, p)
    ax = _axis(axis)
    if compression not in ("top", "bottom"):
        raise InputError(f"compression: got {compression!r}; expected 'top' (sagging) or 'bottom' (hogging)")
    Lb_si = length_si(Lb, "Lb")
    Cb_v, cb_note = check_Cb(Cb)
    demand = None if Mu is None else abs(quantity_si(Mu, "moment", "Mu"))
    calc = Calc(steps)
    fs = FlexSection(p, mat, ax, compression, m, calc)
    return build_result(fs, Lb_si, Cb_v, calc, demand=demand, notes=[cb_note] if cb_note else [],
                        prefix_steps=fs.steps)


def build_result(fs: FlexSection, Lb: float, Cb: float, calc: Calc, *, demand: float | None = None,
                 notes=(), location=None, segment=None, combination: str = "", suffix: str = "",
                 extra: dict | None = None, prefix_steps: tuple = (), record_demand: bool = True,
                 material_note: bool = True) -> CheckResult:
    """CheckResult for one segment from a prepared FlexSection (internal; steps = segment records)."""
    Mn, ls, cl, data = fs.strength(Lb, Cb, calc)
    cap = available(calc, "flexure", fs.method, Mn, "M_n", "M_c", "moment")
    if demand is not None and record_demand and calc.on:
        calc.given("M_u" if fs.method == "LRFD" else "M_a", abs(demand), "moment",
                   reference="required flexural strength")
    if fs.method == "LRFD":
        data["phi_b"] = 0.90
    else:
        data["Omega_b"] = 1.67
    if extra:
        data.update(extra)
    note = "; ".join([n for n in (*(fs.notes if material_note else ()), *notes) if n])
    return result(limit_state=ls + suffix, clause=f"{STANDARD} {cl}", dim="moment", capacity=cap, nominal=Mn,
                  method=fs.method, location=location, segment=segment, combination=combination,
                  steps=prefix_steps + calc.take(), data=data, note=note, demand=demand)
