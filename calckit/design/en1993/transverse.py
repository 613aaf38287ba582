"""Resistance of the web to transverse forces (patch loading, bearing at supports), EN 1993-1-5:2006
section 6, and its interaction with bending, 7.2.

Load types (6.1(2), Figure 6.1): "a" force through one flange resisted by shear in the web (a load on the
span); "b" force through one flange transferred through the web to the other flange (opposite forces);
"c" force through one flange near an unstiffened end, resisted by shear in the web (an end support;
``c`` = distance from the end of the stiff bearing to the member end).

k_F (Figure 6.1): a: 6 + 2 (h_w/a)^2; b: 3.5 + 2 (h_w/a)^2; c: 2 + 6 (s_s + c)/h_w <= 6 (h_w/a = 0 without
transverse stiffeners). F_cr = 0.9 k_F E t_w^3/h_w (6.5). m_1 = f_yf b_f/(f_yw t_w) (6.8);
m_2 = 0.02 (h_w/t_f)^2 if lambda_F > 0.5, else 0 (6.9). l_y = s_s + 2 t_f (1 + sqrt(m_1 + m_2)) <= a
(6.10, types a and b); type c: l_e = k_F E t_w^2/(2 f_yw h_w) <= s_s + c (6.13), l_y the least of (6.10),
(6.11) l_e + t_f sqrt(m_1/2 + (l_e/t_f)^2 + m_2) and (6.12) l_e + t_f sqrt(m_1 + m_2).
lambda_F = sqrt(l_y t_w f_yw/F_cr) (6.4); chi_F = 0.5/lambda_F <= 1 (6.3); L_eff = chi_F l_y (6.2);
F_Rd = f_yw L_eff t_w/gamma_M1 (6.1). s_s is taken as at most h_w (calckit limit, noted).
Interaction (7.2(1)): eta_2 + 0.8 eta_1 <= 1.4 with eta_2 = F_Ed/F_Rd, eta_1 = M_Ed/M_c,Rd.
"""
from __future__ import annotations

import math

from ...errors import InputError
from ._calc import Calc, condition, formula
from ._common import demand, length, material, section_props
from ._result import ENResult, rated
from .factors import annex_set

__all__ = ["transverse", "transverse_si", "interaction_72"]

_R = "EN 1993-1-5:2006"
_D = {"h_w": "length", "a": "length", "s_s": "length", "c": "length", "E": "stress", "t_w": "length",
      "F_cr": "force", "f_yf": "stress", "f_yw": "stress", "b_f": "length", "t_f": "length", "l_y": "length",
      "l_e": "length", "L_eff": "length", "F_Rd": "force"}
F_KF = {"a": formula("k_F", "6 + 2*(h_w/a)**2", _R + " 6.4 Figure 6.1 (a)", "buckling factor, type a", dims=_D),
        "b": formula("k_F", "3.5 + 2*(h_w/a)**2", _R + " 6.4 Figure 6.1 (b)", "buckling factor, type b", dims=_D),
        "c": formula("k_F", "Min(2 + 6*(s_s + c)/h_w, 6)", _R + " 6.4 Figure 6.1 (c)", "buckling factor, type c",
                     dims=_D)}
F_FCR = formula("F_cr", "0.9*k_F*E*t_w**3/h_w", _R + " 6.4(1) Eq. (6.5)", "critical force", dims=_D)
F_M1 = formula("m_1", "f_yf*b_f/(f_yw*t_w)", _R + " 6.5(1) Eq. (6.8)", "", dims=_D)
F_M2 = formula("m_2", "0.02*(h_w/t_f)**2", _R + " 6.5(1) Eq. (6.9)", "for lambda_F > 0.5", dims=_D)
F_LY_AB = formula("l_y", "s_s + 2*t_f*(1 + sqrt(m_1 + m_2))", _R + " 6.5(2) Eq. (6.10)", "effective loaded length",
                  dims=_D)
F_LE = formula("l_e", "Min(k_F*E*t_w**2/(2*f_yw*h_w), s_s + c)", _R + " 6.5(3) Eq. (6.13)", "", dims=_D)
F_LY_11 = formula("l_y", "l_e + t_f*sqrt(m_1/2 + (l_e/t_f)**2 + m_2)", _R + " 6.5(3) Eq. (6.11)", "", dims=_D)
F_LY_12 = formula("l_y", "l_e + t_f*sqrt(m_1 + m_2)", _R + " 6.5(3) Eq. (6.12)", "", dims=_D)
F_LAMF = formula("lam_bar_F", "sqrt(l_y*t_w*f_yw/F_cr)", _R + " 6.4(1) Eq. (6.4)", "slenderness", dims=_D)
F_CHIF = formula("chi_F", "Min(0.5/lam_bar_F, 1)", _R + " 6.4(1) Eq. (6.3)", "reduction factor")
F_LEFF = formula("L_eff", "chi_F*l_y", _R + " 6.2(1) Eq. (6.2)", "effective length", dims=_D)
F_FRD = formula("F_Rd", "f_yw*L_eff*t_w/gamma_M1", _R + " 6.2(1) Eq. (6.1)", "design resistance", dims=_D)
C_M2 = condition("lam_bar_F > 0.5", _R + " 6.5(1)", then="m_2 = 0.02 (h_w/t_f)^2", otherwise="m_2 = 0")


def transverse_si(s, mat, annex, *, ss: float, load_type: str = "a", c: float | None = None,
                  a: float | None = None, flange: str = "top", calc: Calc | None = None) -> dict:
    """Numeric core of :func:`transverse` (SI floats); returns data with ``F_Rd``."""
    calc = calc or Calc(False)
    if load_type not in ("a", "b", "c"):
        raise InputError(f"load_type: got {load_type!r}; expected 'a', 'b' or 'c' (EN 1993-1-5 Figure 6.1)")
    if load_type == "c" and c is None:
        raise InputError("c: no value given; load type 'c' needs the distance from the stiff bearing to the end")
    hw, tw, E = s.hw, s.tw, mat.E
    notes = []
    if ss > hw:
        notes.append(f"s_s = {ss * 1e3:.4g} mm taken as h_w = {hw * 1e3:.4g} mm")
        ss = hw
    bf, tf, fyf = ((s.bf_top, s.tf_top, mat.fyf_top) if flange == "top" else (s.bf_bot, s.tf_bot, mat.fyf_bot))
    fyw = mat.fyw
    aa = a if a is not None else math.inf
    if load_type == "c":
        kF = calc(F_KF["c"], s_s=ss, c=c, h_w=hw)
    else:
        kF = calc(F_KF[load_type], h_w=hw, a=aa) if a is not None else calc.given(
            "k_F", 6.0 if load_type == "a" else 3.5, reference=f"{_R} Figure 6.1 ({load_type}), no transverse "
            "stiffeners (h_w/a = 0)")
    Fcr = calc(F_FCR, k_F=kF, E=E, t_w=tw, h_w=hw)
    m1 = calc(F_M1, f_yf=fyf, b_f=bf, f_yw=fyw, t_w=tw)

    def ly_for(m2, rec: Calc):
        ly = rec(F_LY_AB, s_s=ss, t_f=tf, m_1=m1, m_2=m2)
        if a is not None and ly > a:
            ly = rec.given("l_y", a, "length", reference=f"{_R} 6.5(2): l_y <= a")
        if load_type == "c":
            le = rec(F_LE, k_F=kF, E=E, t_w=tw, f_yw=fyw, h_w=hw, s_s=ss, c=c)
            ly = min(ly, rec(F_LY_11, l_e=le, t_f=tf, m_1=m1, m_2=m2), rec(F_LY_12, l_e=le, t_f=tf, m_1=m1, m_2=m2))
        return ly

    m2 = F_M2(h_w=hw, t_f=tf)
    ly = ly_for(m2, Calc(False))
    lam = float(F_LAMF(l_y=ly, t_w=tw, f_yw=fyw, F_cr=Fcr))
    if lam <= 0.5:
        m2 = 0.0
    if calc.branch(C_M2, lam > 0.5, lam_bar_F=lam, note="with m_2 = 0.02 (h_w/t_f)^2"):
        m2 = calc(F_M2, h_w=hw, t_f=tf)
    ly = ly_for(m2, calc)
    lam = calc(F_LAMF, l_y=ly, t_w=tw, f_yw=fyw, F_cr=Fcr)
    chi = calc(F_CHIF, lam_bar_F=lam)
    Leff = calc(F_LEFF, chi_F=chi, l_y=ly)
    FRd = calc(F_FRD, f_yw=fyw, L_eff=Leff, t_w=tw, gamma_M1=annex.gamma_M1)
    return {"F_Rd": FRd, "k_F": kF, "F_cr": Fcr, "m_1": m1, "m_2": m2, "l_y": ly, "lambda_F": lam, "chi_F": chi,
            "L_eff": Leff, "s_s": ss, "load_type": load_type, "flange": flange, "annex": annex.name,
            "gamma_M1": annex.gamma_M1, "notes": tuple(notes)}


def transverse(section, steel, F_Ed=None, *, ss, load_type: str = "a", c=None, a=None, flange: str = "top",
               annex=None, fy=None, steps: bool = True, location=None, combination: str = "") -> ENResult:
    """Web resistance F_Rd to a transverse force over a stiff bearing length ``ss``, EN 1993-1-5 section 6.

    ``load_type`` "a", "b" or "c" (Figure 6.1); ``c``: end distance for type c; ``a``: transverse stiffener
    spacing (None: none); ``flange``: the loaded flange ("top" or "bottom").
    """
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    if flange not in ("top", "bottom"):
        raise InputError(f"flange: got {flange!r}; expected 'top' or 'bottom'")
    ss_ = length(ss, "ss", positive=False)
    c_ = length(c, "c", positive=False, allow_none=True)
    a_ = length(a, "a", allow_none=True)
    F = demand(F_Ed, "force", "F_Ed")
    calc = Calc(steps)
    d = transverse_si(s, mat, ann, ss=ss_, load_type=load_type, c=c_, a=a_, flange=flange, calc=calc)
    return result(d, calc, F, location, combination)


def result(d, calc, F, location=None, combination="") -> ENResult:
    return rated(F, limit_state=f"Transverse force on the web (type {d['load_type']})",
                 clause="EN 1993-1-5:2006 6.2-6.5", dim="force", capacity=d["F_Rd"],
                 nominal=d["F_Rd"] * d["gamma_M1"], method="EN", steps=calc.take(), data=d,
                 note="; ".join(d["notes"]), location=location, combination=combination)


F_72 = formula("eta_72", "eta_2 + 0.8*eta_1", "EN 1993-1-5:2006 7.2(1) Eq. (7.2)", "interaction")


def interaction_72(F_Ed: float, F_Rd: float, M_Ed: float, M_c_Rd: float, calc: Calc | None = None,
                   location=None) -> ENResult:
    """EN 1993-1-5 7.2(1): eta_2 + 0.8 eta_1 <= 1.4, reported as ratio (eta_2 + 0.8 eta_1)/1.4."""
    calc = calc or Calc(False)
    e2 = calc.given("eta_2", F_Ed / F_Rd, reference="EN 1993-1-5:2006 7.2(1): F_Ed/F_Rd")
    e1 = calc.given("eta_1", M_Ed / M_c_Rd, reference="EN 1993-1-5:2006 7.2(1) and 4.6: M_Ed/M_c,Rd")
    v = calc(F_72, eta_2=e2, eta_1=e1)
    return rated(v, limit_state="Transverse force and bending", clause="EN 1993-1-5:2006 7.2(1)",
                 dim="dimensionless", capacity=1.4, method="EN", steps=calc.take(), data={"eta_1": e1, "eta_2": e2},
                 location=location)
