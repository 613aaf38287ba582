"""Major-axis bending resistance of I-sections: EN 1993-1-1:2005 6.2.5 and 6.2.8 (bending and shear),
with EN 1993-1-5:2006 7.1 (bending with shear buckling) for webs slender in shear.

- M_c,Rd = W f_y / gamma_M0 with W = W_pl,y (Class 1, 2), W_el,y,min (Class 3), W_eff,y,min (Class 4,
  effective widths to EN 1993-1-5 4.4, see :mod:`.effective`) (6.13, 6.14).
- 6.2.8: when V_Ed > 0.5 V_pl,Rd, rho = (2 V_Ed/V_pl,Rd - 1)^2 and the shear area works at (1 - rho) f_y.
  Doubly symmetric I (6.30): M_y,V,Rd = (W_pl,y - rho A_w^2/(4 t_w)) f_y/gamma_M0 <= M_y,c,Rd, A_w = h_w t_w.
  Mono-symmetric Class 1/2: plastic moment of the flange-web plates with the web at (1 - rho) f_y.
  Class 3/4 (calckit's reading of 6.2.8(3) with the elastic criterion): the web's extreme fibre is limited
  to (1 - rho) f_y, so M_V,Rd = min(M_c,Rd, (1 - rho) f_y I/z_w/gamma_M0), z_w = distance from the
  neutral axis to the farther end of the web.
- Webs slender in shear (h_w/t_w > 72 eps/eta or its stiffened form): EN 1993-1-5 7.1(1), with
  eta_1 = M_Ed/M_pl,Rd and eta_3 = V_Ed/V_bw,Rd > 0.5: eta_1 + (1 - M_f,Rd/M_pl,Rd)(2 eta_3 - 1)^2 <= 1,
  applied when M_Ed > M_f,Rd; written as the equivalent resistance
  M_V,Rd = M_pl,Rd [1 - (1 - M_f,Rd/M_pl,Rd)(2 eta_3 - 1)^2] (>= M_f,Rd), and never above M_c,Rd.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ...errors import NotCoveredError
from ._calc import Calc, condition, formula
from ._common import STANDARD, Material, demand, length, material, section_props
from ._result import ENResult, rated
from .classify import Classification, classify_si
from .effective import effective_section
from .factors import AnnexSet, annex_set
from .shear import ShearCalc, shear_si

__all__ = ["bending", "bending_si", "BendingCalc", "section_modulus"]

_R1 = "EN 1993-1-1:2005"
F_MC = formula("M_c_Rd", "W_y*f_y/gamma_M0", _R1 + " 6.2.5(2) Eqs. (6.13), (6.14)", "design moment resistance",
               dims={"M_c_Rd": "moment", "W_y": "modulus", "f_y": "stress"})
F_MPL = formula("M_pl_Rd", "W_pl_y*f_y/gamma_M0", _R1 + " 6.2.5(2) Eq. (6.13)", "plastic moment resistance",
                dims={"M_pl_Rd": "moment", "W_pl_y": "modulus", "f_y": "stress"})
C_VHALF = condition("V_Ed > 0.5*V_pl_Rd", _R1 + " 6.2.8(2)", then="the shear force reduces the moment resistance",
                    otherwise="no reduction for shear (V_Ed <= 0.5 V_pl,Rd)",
                    dims={"V_Ed": "force", "V_pl_Rd": "force"})
F_RHO = formula("rho", "(2*V_Ed/V_pl_Rd - 1)**2", _R1 + " 6.2.8(3)", "shear reduction factor",
                dims={"V_Ed": "force", "V_pl_Rd": "force"})
F_MV_SYM = formula("M_V_Rd", "Min((W_pl_y - rho*A_w**2/(4*t_w))*f_y/gamma_M0, M_c_Rd)", _R1 + " 6.2.8(5) Eq. (6.30)",
                   "moment resistance reduced for shear", dims={"M_V_Rd": "moment", "W_pl_y": "modulus",
                                                                "A_w": "area", "t_w": "length", "f_y": "stress",
                                                                "M_c_Rd": "moment"})
F_MV_ELASTIC = formula("M_V_Rd", "Min(M_c_Rd, (1 - rho)*f_y*I_y/(z_w*gamma_M0))", _R1 + " 6.2.8(3) (elastic)",
                       "web extreme fibre at (1 - rho) f_y", dims={"M_V_Rd": "moment", "M_c_Rd": "moment",
                                                                  "f_y": "stress", "I_y": "inertia", "z_w": "length"})
F_ETA3 = formula("eta_bar_3", "V_Ed/V_bw_Rd", "EN 1993-1-5:2006 7.1(1)", "shear utilisation of the web",
                 dims={"V_Ed": "force", "V_bw_Rd": "force"})
C_ETA3 = condition("eta_bar_3 > 0.5", "EN 1993-1-5:2006 7.1(1)", then="bending-shear interaction applies",
                   otherwise="no interaction (eta_3 <= 0.5)")
F_MV_71 = formula("M_V_Rd", "Min(Max(M_pl_Rd*(1 - (1 - M_f_Rd/M_pl_Rd)*(2*eta_bar_3 - 1)**2), M_f_Rd), M_c_Rd)",
                  "EN 1993-1-5:2006 7.1(1) Eq. (7.1)", "equivalent moment resistance with shear buckling",
                  dims={"M_V_Rd": "moment", "M_pl_Rd": "moment", "M_f_Rd": "moment", "M_c_Rd": "moment"})
F_MF = formula("M_f_Rd", "A_f*f_yf*h_f/gamma_M0", "EN 1993-1-5:2006 5.4(1)", "flanges alone (smaller flange)",
               dims={"M_f_Rd": "moment", "A_f": "area", "f_yf": "stress", "h_f": "length"})


@dataclass(frozen=True)
class BendingCalc:
    """Numbers of the bending check (SI floats)."""

    M_Rd: float  #: resistance used: M_c,Rd, or the reduced M_V,Rd
    M_c_Rd: float
    M_V_Rd: float | None
    W_y: float  #: modulus used (W_pl, W_el,min or W_eff,min)
    W_name: str
    cls: Classification
    rho: float | None
    shear: ShearCalc | None


def section_modulus(s, cl: Classification, calc: Calc) -> tuple[float, str, float]:
    """(W_y, name, I_y of the section used) for the class (EN 1993-1-1 6.2.5(2))."""
    if cl.cls <= 2:
        return calc.given("W_pl_y", s.Zx, "modulus", reference=f"{_R1} 6.2.5(2): Class {cl.cls}, plastic modulus",
                          note="section property"), "W_pl,y", s.Ix
    if cl.cls == 3:
        return calc.given("W_el_y", s.Sx, "modulus", reference=f"{_R1} 6.2.5(2): Class 3, W_el,y,min",
                          note="section property"), "W_el,y,min", s.Ix
    eff = effective_section(s, cl, calc)
    return eff.W_eff, "W_eff,y,min", eff.I_eff


def _mpl_reduced_web(s, fy: float, rho: float) -> float:
    """Plastic moment of the three plates with the web at (1 - rho) f_y (mono-symmetric welded I)."""
    At, Ab = s.bf_top * s.tf_top, s.bf_bot * s.tf_bot
    fw = (1.0 - rho) * fy
    Aw = s.hw * s.tw
    # force balance: find PNA height y (from bottom) with compression above
    total = fy * (At + Ab) + fw * Aw
    half = total / 2
    # walk from the top down
    if fy * At >= half:  # PNA in the top flange
        y = s.d - half / (fy * s.bf_top)
    elif fy * At + fw * Aw >= half:  # in the web
        y = s.d - s.tf_top - (half - fy * At) / (fw * s.tw) if fw > 0 else s.d - s.tf_top
    else:
        y = s.tf_bot - (half - fy * At - fw * Aw) / (fy * s.bf_bot)
        y = max(y, 0.0)

    def part(y0, y1, b, f):  # |moment| about y of the strength of a plate between y0 and y1
        m = 0.0
        lo, hi = y0, min(y1, y)
        if hi > lo:
            m += f * b * (hi - lo) * (y - (lo + hi) / 2)
        lo, hi = max(y0, y), y1
        if hi > lo:
            m += f * b * (hi - lo) * ((lo + hi) / 2 - y)
        return m

    return (part(s.d - s.tf_top, s.d, s.bf_top, fy) + part(0.0, s.tf_bot, s.bf_bot, fy)
            + part(s.tf_bot, s.d - s.tf_top, s.tw, fw))


def bending_si(s, mat: Material, annex: AnnexSet, *, sagging: bool = True, V_Ed: float | None = None,
               M_Ed: float | None = None, a: float | None = None, end_post: str = "non-rigid",
               calc: Calc | None = None, cl: Classification | None = None,
               sh: ShearCalc | None = None) -> BendingCalc:
    """Numeric core of :func:`bending` (SI floats)."""
    calc = calc or Calc(False)
    if cl is None:
        cl = classify_si(s, mat, sagging=sagging, calc=calc)
    g0 = annex.gamma_M0
    W, Wn, Iy = section_modulus(s, cl, calc)
    Mc = calc(F_MC, W_y=W, f_y=mat.fy, gamma_M0=g0)
    if V_Ed is None or V_Ed == 0:
        return BendingCalc(Mc, Mc, None, W, Wn, cl, None, sh)
    if sh is None:
        sh = shear_si(s, mat, annex, a=a, end_post=end_post, calc=calc)
    if sh.buckling:
        eta3 = calc(F_ETA3, V_Ed=V_Ed, V_bw_Rd=sh.V_bw_Rd)
        if not calc.branch(C_ETA3, eta3 > 0.5, eta_bar_3=eta3):
            return BendingCalc(Mc, Mc, None, W, Wn, cl, None, sh)
        Mpl = calc(F_MPL, W_pl_y=s.Zx, f_y=mat.fy, gamma_M0=g0)
        fyf = mat.fyf
        Af = min(s.bf_top * s.tf_top * mat.fyf_top, s.bf_bot * s.tf_bot * mat.fyf_bot) / fyf
        Mf = calc(F_MF, A_f=Af, f_yf=fyf, h_f=s.ho, gamma_M0=g0)
        MV = calc(F_MV_71, M_pl_Rd=Mpl, M_f_Rd=Mf, eta_bar_3=eta3, M_c_Rd=Mc)
        return BendingCalc(MV, Mc, MV, W, Wn, cl, None, sh)
    Vpl = sh.V_pl_Rd
    if not calc.branch(C_VHALF, V_Ed > 0.5 * Vpl, V_Ed=V_Ed, V_pl_Rd=Vpl):
        return BendingCalc(Mc, Mc, None, W, Wn, cl, None, sh)
    rho = calc(F_RHO, V_Ed=min(V_Ed, Vpl), V_pl_Rd=Vpl,
               note="V_Ed > V_pl,Rd: rho = 1 (the shear check fails)" if V_Ed > Vpl else "")
    if cl.cls <= 2:
        if s.symmetric:
            MV = calc(F_MV_SYM, W_pl_y=s.Zx, rho=rho, A_w=s.hw * s.tw, t_w=s.tw, f_y=mat.fy, gamma_M0=g0,
                      M_c_Rd=Mc)
        else:
            MV = calc.given("M_V_Rd", min(_mpl_reduced_web(s, mat.fy, rho) / g0, Mc), "moment",
                            reference=f"{_R1} 6.2.8(3): plastic moment with the web at (1 - rho) f_y",
                            note="mono-symmetric section: plate model, force balance for the plastic axis")
    else:
        yc = s.y_c
        zw = max(s.d - s.tf_top - yc, yc - s.tf_bot)
        MV = calc(F_MV_ELASTIC, M_c_Rd=Mc, rho=rho, f_y=mat.fy, I_y=Iy, z_w=zw, gamma_M0=g0)
    return BendingCalc(MV, Mc, MV, W, Wn, cl, rho, sh)


def _sign(M_Ed, sagging):
    if sagging is not None:
        return bool(sagging)
    if M_Ed is None:
        return True
    from ...units import to_si

    return to_si(M_Ed, "moment", "M_Ed", allow_array=False) >= 0


def bending(section, steel, M_Ed=None, *, V_Ed=None, sagging: bool | None = None, a=None,
            end_post: str = "non-rigid", N_Ed=None, annex=None, fy=None, steps: bool = True, location=None,
            combination: str = "") -> ENResult:
    """Major-axis bending resistance of an I-section, EN 1993-1-1 6.2.5 (and 6.2.8 when ``V_Ed`` is given).

    ``sagging``: top flange in compression (default: from the sign of ``M_Ed``, sagging positive).
    ``a``, ``end_post``: web stiffening, used when the web is slender in shear (EN 1993-1-5 7.1).
    ``N_Ed``: a non-zero axial force raises NotCoveredError (6.2.9 is not implemented).
    Returns an :class:`ENResult`: ``capacity`` = M_c,Rd (or M_V,Rd), ``data`` with the class, W and the
    reduction for shear.
    """
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    if demand(N_Ed, "force", "N_Ed"):
        raise NotCoveredError("N_Ed: bending with axial force (EN 1993-1-1 6.2.9, and the effective section of a "
                              "Class 4 member under axial force, 6.2.2.5(4)) is not covered by calckit.design.en1993")
    sag = _sign(M_Ed, sagging)
    M = demand(M_Ed, "moment", "M_Ed")
    V = demand(V_Ed, "force", "V_Ed")
    a_ = length(a, "a", allow_none=True)
    calc = Calc(steps)
    r = bending_si(s, mat, ann, sagging=sag, V_Ed=V, M_Ed=M, a=a_, end_post=end_post, calc=calc)
    return result(r, mat, ann, M, calc, location, combination)


def result(r: BendingCalc, mat, ann, M, calc, location=None, combination="") -> ENResult:
    data = {"class": r.cls.cls, "flange_class": r.cls.flange_class, "web_class": r.cls.web_class,
            "epsilon": r.cls.epsilon, "W_y": r.W_y, "W": r.W_name, "M_c_Rd": r.M_c_Rd, "M_V_Rd": r.M_V_Rd,
            "rho": r.rho, "fy": mat.fy, "fy_note": mat.note, "annex": ann.name, "gamma_M0": ann.gamma_M0,
            "compression_flange": r.cls.compression_flange}
    if r.M_V_Rd is not None:
        buck = r.shear is not None and r.shear.buckling
        ls, clause = ("Bending and shear (shear buckling)", "EN 1993-1-5:2006 7.1") if buck else \
            ("Bending and shear", f"{STANDARD} 6.2.8")
    else:
        ls, clause = "Bending", f"{STANDARD} 6.2.5"
    if r.cls.cls == 4:
        clause += "; EN 1993-1-5:2006 4.4"
    return rated(M, limit_state=ls, clause=clause, dim="moment", capacity=r.M_Rd,
                 nominal=r.M_Rd * ann.gamma_M0, method="EN", steps=calc.take(), data=data, location=location,
                 combination=combination, note=f"Class {r.cls.cls} ({r.W_name})")
