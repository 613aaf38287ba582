"""Shear resistance: EN 1993-1-1:2005 6.2.6 (plastic shear) and EN 1993-1-5:2006 section 5 (shear buckling).

- Shear area A_v (6.2.6(3)): rolled I, load parallel to the web: A - 2 b t_f + (t_w + 2 r) t_f but not
  less than eta h_w t_w; welded I: eta h_w t_w (h_w = web depth between the flanges).
- V_pl,Rd = A_v (f_y/sqrt3)/gamma_M0 (6.18).
- Shear buckling is checked when h_w/t_w > 72 eps/eta (no intermediate stiffeners, 6.2.6(6) and
  EN 1993-1-5 5.1(2)) or > 31 eps sqrt(k_tau)/eta (transverse stiffeners at spacing a), eps = sqrt(235/f_yw).
- EN 1993-1-5 5.3: lambda_w = h_w/(86.4 t_w eps) with stiffeners at the supports only (5.5), or
  h_w/(37.4 t_w eps sqrt(k_tau)) (5.6), k_tau from Annex A.3 (A.5): a/h_w >= 1: 5.34 + 4 (h_w/a)^2;
  a/h_w < 1: 4 + 5.34 (h_w/a)^2 (no longitudinal stiffeners, k_tau,st = 0).
- chi_w Table 5.1: lambda_w < 0.83/eta: eta; 0.83/eta <= lambda_w < 1.08: 0.83/lambda_w; lambda_w >= 1.08:
  rigid end post 1.37/(0.7 + lambda_w), non-rigid end post 0.83/lambda_w.
- V_bw,Rd = chi_w f_yw h_w t_w/(sqrt3 gamma_M1) (5.2); V_b,Rd = V_bw,Rd + V_bf,Rd <= eta f_yw h_w t_w/(sqrt3
  gamma_M1) (5.1).
- Flange contribution (5.4, optional): V_bf,Rd = b_f t_f^2 f_yf/(c gamma_M1) [1 - (M_Ed/M_f,Rd)^2], with
  c = a (0.25 + 1.6 b_f t_f^2 f_yf/(t_w h_w^2 f_yw)), b_f <= 15 eps t_f each side of the web, the flange
  giving the smaller value; M_f,Rd = min(A_f f_yf) h_f / gamma_M0 for the flanges alone (zero when
  M_Ed >= M_f,Rd).
eta = the annex set's value (1.2 recommended) for grades up to S460, else 1.0 (EN 1993-1-5 5.1(2) Note 2).
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ...errors import InputError
from ._calc import Calc, condition, formula
from ._common import STANDARD, Material, demand, length, material, section_props
from ._result import ENResult, rated
from .factors import AnnexSet, annex_set

__all__ = ["shear", "shear_si", "ShearCalc", "eta_for"]

_R1 = "EN 1993-1-1:2005"
_R5 = "EN 1993-1-5:2006"
F_AV_ROLLED = formula("A_v", "Max(A - 2*b*t_f + (t_w + 2*r)*t_f, eta*h_w*t_w)", _R1 + " 6.2.6(3)(a)",
                      "shear area, rolled I (not less than eta h_w t_w)",
                      dims={"A_v": "area", "A": "area", "b": "length", "t_f": "length", "t_w": "length",
                            "r": "length", "h_w": "length"})
F_AV_WELDED = formula("A_v", "eta*h_w*t_w", _R1 + " 6.2.6(3)(d)", "shear area, welded I",
                      dims={"A_v": "area", "h_w": "length", "t_w": "length"})
F_VPL = formula("V_pl_Rd", "A_v*(f_y/sqrt(3))/gamma_M0", _R1 + " 6.2.6(2) Eq. (6.18)", "plastic shear resistance",
                dims={"V_pl_Rd": "force", "A_v": "area", "f_y": "stress"})
F_EPSW = formula("epsilon_w", "sqrt(f_y0/f_yw)", _R5 + " 5.1(2)", "material factor of the web (f_y0 = 235 MPa)",
                 dims={"f_yw": "stress", "f_y0": "stress"})
F_KTAU_LONG = formula("k_tau", "5.34 + 4*(h_w/a)**2", _R5 + " Annex A.3 Eq. (A.5)", "a/h_w >= 1",
                      dims={"h_w": "length", "a": "length"})
F_KTAU_SHORT = formula("k_tau", "4 + 5.34*(h_w/a)**2", _R5 + " Annex A.3 Eq. (A.5)", "a/h_w < 1",
                       dims={"h_w": "length", "a": "length"})
C_BUCKLE_U = condition("h_w/t_w > 72*epsilon_w/eta", _R1 + " 6.2.6(6); " + _R5 + " 5.1(2)",
                       then="shear buckling to EN 1993-1-5 section 5 must be checked",
                       otherwise="no shear buckling check needed", dims={"h_w": "length", "t_w": "length"})
C_BUCKLE_S = condition("h_w/t_w > 31*epsilon_w*sqrt(k_tau)/eta", _R5 + " 5.1(2)",
                       then="shear buckling to EN 1993-1-5 section 5 must be checked",
                       otherwise="no shear buckling check needed", dims={"h_w": "length", "t_w": "length"})
F_LW_U = formula("lam_bar_w", "h_w/(86.4*t_w*epsilon_w)", _R5 + " 5.3(3) Eq. (5.5)",
                 "web slenderness, stiffeners at supports only", dims={"h_w": "length", "t_w": "length"})
F_LW_S = formula("lam_bar_w", "h_w/(37.4*t_w*epsilon_w*sqrt(k_tau))", _R5 + " 5.3(3) Eq. (5.6)",
                 "web slenderness, transverse stiffeners", dims={"h_w": "length", "t_w": "length"})
C_LW_1 = condition("lam_bar_w < 0.83/eta", _R5 + " Table 5.1", then="chi_w = eta",
                   otherwise="chi_w < eta")
C_LW_2 = condition("lam_bar_w < 1.08", _R5 + " Table 5.1", then="chi_w = 0.83/lambda_w",
                   otherwise="lambda_w >= 1.08: chi_w depends on the end post")
F_CHI_1 = formula("chi_w", "eta", _R5 + " Table 5.1", "lambda_w < 0.83/eta")
F_CHI_2 = formula("chi_w", "0.83/lam_bar_w", _R5 + " Table 5.1", "0.83/eta <= lambda_w (< 1.08 or non-rigid end post)")
F_CHI_3 = formula("chi_w", "1.37/(0.7 + lam_bar_w)", _R5 + " Table 5.1", "lambda_w >= 1.08, rigid end post")
F_VBW = formula("V_bw_Rd", "chi_w*f_yw*h_w*t_w/(sqrt(3)*gamma_M1)", _R5 + " 5.2(1) Eq. (5.2)",
                "contribution of the web", dims={"V_bw_Rd": "force", "f_yw": "stress", "h_w": "length",
                                                 "t_w": "length"})
F_VB_MAX = formula("V_b_Rd_max", "eta*f_yw*h_w*t_w/(sqrt(3)*gamma_M1)", _R5 + " 5.2(1) Eq. (5.1)",
                   "upper limit", dims={"V_b_Rd_max": "force", "f_yw": "stress", "h_w": "length", "t_w": "length"})
F_MFRD = formula("M_f_Rd", "A_f*f_yf*h_f/gamma_M0", _R5 + " 5.4(1)", "flanges alone (smaller flange)",
                 dims={"M_f_Rd": "moment", "A_f": "area", "f_yf": "stress", "h_f": "length"})
F_C = formula("c", "a*(0.25 + 1.6*b_f*t_f**2*f_yf/(t_w*h_w**2*f_yw))", _R5 + " 5.4(1)", "anchorage length",
              dims={"c": "length", "a": "length", "b_f": "length", "t_f": "length", "f_yf": "stress",
                    "t_w": "length", "h_w": "length", "f_yw": "stress"})
F_VBF = formula("V_bf_Rd", "b_f*t_f**2*f_yf/(c*gamma_M1)*(1 - (M_Ed/M_f_Rd)**2)", _R5 + " 5.4(1) Eq. (5.8)",
                "contribution of the flanges", dims={"V_bf_Rd": "force", "b_f": "length", "t_f": "length",
                                                     "f_yf": "stress", "c": "length", "M_Ed": "moment",
                                                     "M_f_Rd": "moment"})
F_VB = formula("V_b_Rd", "Min(V_bw_Rd + V_bf_Rd, V_b_Rd_max)", _R5 + " 5.2(1) Eq. (5.1)",
               "shear buckling resistance", dims={"V_b_Rd": "force", "V_bw_Rd": "force", "V_bf_Rd": "force",
                                                  "V_b_Rd_max": "force"})


def eta_for(fy: float, annex: AnnexSet) -> float:
    """EN 1993-1-5 5.1(2) Note 2: the set's eta for grades up to S460, 1.0 above."""
    return annex.eta if fy <= 460e6 * (1 + 1e-9) else 1.0


@dataclass(frozen=True)
class ShearCalc:
    """Numbers of the shear check (SI floats)."""

    V_Rd: float  #: design shear resistance used (min of V_pl,Rd and V_b,Rd when buckling applies)
    V_pl_Rd: float
    V_b_Rd: float | None  #: None when shear buckling need not be checked
    A_v: float
    eta: float
    buckling: bool
    lam_bar_w: float | None
    chi_w: float | None
    k_tau: float | None
    V_bw_Rd: float | None
    V_bf_Rd: float | None


def shear_si(s, mat: Material, annex: AnnexSet, *, a: float | None = None, end_post: str = "non-rigid",
             flange_contribution: bool = False, M_Ed: float = 0.0, calc: Calc | None = None) -> ShearCalc:
    """Numeric core of :func:`shear` (SI floats)."""
    calc = calc or Calc(False)
    fyw = mat.fyw
    eta = calc.given("eta", eta_for(fyw, annex), reference=f"{_R5} 5.1(2), annex set {annex.name!r}")
    g0, g1 = annex.gamma_M0, annex.gamma_M1
    if s.kind == "I_rolled":
        Av = calc(F_AV_ROLLED, A=s.A, b=s.bf_top, t_f=s.tf_top, t_w=s.tw, r=s.r, eta=eta, h_w=s.hw)
        fyv = mat.fy
    else:
        Av = calc(F_AV_WELDED, eta=eta, h_w=s.hw, t_w=s.tw)
        fyv = fyw
    Vpl = calc(F_VPL, A_v=Av, f_y=fyv, gamma_M0=g0)
    epsw = calc(F_EPSW, f_y0=235e6, f_yw=fyw)
    hw, tw = s.hw, s.tw
    kt = None
    if a is not None:
        kt = (calc(F_KTAU_LONG, h_w=hw, a=a) if a / hw >= 1.0 else calc(F_KTAU_SHORT, h_w=hw, a=a))
        buck = calc.branch(C_BUCKLE_S, hw / tw > 31 * epsw * math.sqrt(kt) / eta, h_w=hw, t_w=tw,
                           epsilon_w=epsw, k_tau=kt, eta=eta)
    else:
        buck = calc.branch(C_BUCKLE_U, hw / tw > 72 * epsw / eta, h_w=hw, t_w=tw, epsilon_w=epsw, eta=eta)
    if not buck:
        return ShearCalc(Vpl, Vpl, None, Av, eta, False, None, None, kt, None, None)
    lw = (calc(F_LW_S, h_w=hw, t_w=tw, epsilon_w=epsw, k_tau=kt) if a is not None
          else calc(F_LW_U, h_w=hw, t_w=tw, epsilon_w=epsw))
    if calc.branch(C_LW_1, lw < 0.83 / eta, lam_bar_w=lw, eta=eta):
        chi = calc(F_CHI_1, eta=eta)
    elif calc.branch(C_LW_2, lw < 1.08, lam_bar_w=lw) or end_post != "rigid":
        chi = calc(F_CHI_2, lam_bar_w=lw)
    else:
        chi = calc(F_CHI_3, lam_bar_w=lw)
    Vbw = calc(F_VBW, chi_w=chi, f_yw=fyw, h_w=hw, t_w=tw, gamma_M1=g1)
    Vmax = calc(F_VB_MAX, eta=eta, f_yw=fyw, h_w=hw, t_w=tw, gamma_M1=g1)
    Vbf = 0.0
    if flange_contribution:
        if a is None:
            raise InputError("a: no value given; the flange contribution (EN 1993-1-5 5.4) needs the panel "
                             "length a between transverse stiffeners")
        cands = []
        for b, t, fyf in ((s.bf_top, s.tf_top, mat.fyf_top), (s.bf_bot, s.tf_bot, mat.fyf_bot)):
            bf = min(b, 30 * epsw * t + tw)  # 15 eps t_f each side of the web
            cands.append((bf * t * t * fyf, bf, t, fyf))
        _, bf, tf, fyf = min(cands)
        Af = min(s.bf_top * s.tf_top * mat.fyf_top, s.bf_bot * s.tf_bot * mat.fyf_bot) / fyf
        MfRd = calc(F_MFRD, A_f=Af, f_yf=fyf, h_f=s.ho, gamma_M0=g0)
        if M_Ed < MfRd:
            c = calc(F_C, a=a, b_f=bf, t_f=tf, f_yf=fyf, t_w=tw, h_w=hw, f_yw=fyw)
            Vbf = calc(F_VBF, b_f=bf, t_f=tf, f_yf=fyf, c=c, gamma_M1=g1, M_Ed=M_Ed, M_f_Rd=MfRd)
        else:
            calc.say("M_Ed >= M_f,Rd: the flanges give no shear contribution (V_bf,Rd = 0)", _R5 + " 5.4(1)")
    Vb = calc(F_VB, V_bw_Rd=Vbw, V_bf_Rd=Vbf, V_b_Rd_max=Vmax)
    return ShearCalc(min(Vpl, Vb), Vpl, Vb, Av, eta, True, lw, chi, kt, Vbw, Vbf)


def shear(section, steel, V_Ed=None, *, a=None, end_post: str = "non-rigid", flange_contribution: bool = False,
          M_Ed=None, annex=None, fy=None, steps: bool = True, location=None, combination: str = "") -> ENResult:
    """Shear resistance of an I-section web (major axis), EN 1993-1-1 6.2.6 and EN 1993-1-5 section 5.

    ``a``: spacing of intermediate transverse stiffeners (None: stiffeners at the supports only);
    ``end_post``: "rigid" or "non-rigid" (Table 5.1); ``flange_contribution`` with ``M_Ed`` (5.4).
    Returns an :class:`ENResult` with ``capacity`` = V_Rd (V_pl,Rd, or V_b,Rd if smaller).
    """
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    if end_post not in ("rigid", "non-rigid"):
        raise InputError(f"end_post: got {end_post!r}; expected 'rigid' or 'non-rigid'")
    a_ = length(a, "a", allow_none=True)
    V = demand(V_Ed, "force", "V_Ed")
    M = demand(M_Ed, "moment", "M_Ed") or 0.0
    calc = Calc(steps)
    r = shear_si(s, mat, ann, a=a_, end_post=end_post, flange_contribution=flange_contribution, M_Ed=M, calc=calc)
    return _result(r, s, mat, ann, V, calc, location, combination)


def _result(r: ShearCalc, s, mat, ann, V, calc, location=None, combination="") -> ENResult:
    data = {"V_pl_Rd": r.V_pl_Rd, "V_b_Rd": r.V_b_Rd, "A_v": r.A_v, "eta": r.eta, "shear_buckling": r.buckling,
            "lambda_w": r.lam_bar_w, "chi_w": r.chi_w, "k_tau": r.k_tau, "V_bw_Rd": r.V_bw_Rd,
            "V_bf_Rd": r.V_bf_Rd, "fy": mat.fy, "fyw": mat.fyw, "annex": ann.name,
            "gamma_M0": ann.gamma_M0, "gamma_M1": ann.gamma_M1}
    clause = (f"{STANDARD} 6.2.6; EN 1993-1-5:2006 5.2-5.3" if r.buckling else f"{STANDARD} 6.2.6")
    note = ("web slender in shear: V_b,Rd to EN 1993-1-5 section 5 governs"
            if r.buckling and r.V_Rd < r.V_pl_Rd else "")
    return rated(V, limit_state="Shear" + (" (shear buckling)" if r.buckling else ""), clause=clause,
                 dim="force", capacity=r.V_Rd,
                 nominal=r.V_Rd * (ann.gamma_M0 if r.V_Rd == r.V_pl_Rd else ann.gamma_M1), method="EN",
                 steps=calc.take(), data=data, note=note, location=location, combination=combination)
