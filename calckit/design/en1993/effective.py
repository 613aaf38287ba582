"""Effective cross-section of a Class 4 I-section in bending, EN 1993-1-5:2006 4.3 and 4.4.

Procedure (EN 1993-1-5 4.3(4): the web's stress ratio may be found from the effective area of the
compression flange and the gross area of the web; one pass, no iteration):

1. compression flange outstands (Table 4.2, psi = 1): k_sigma = 0.43,
   lambda_p = (c/t) / (28.4 eps sqrt(k_sigma)); rho = 1 for lambda_p <= 0.748, else
   rho = (lambda_p - 0.188)/lambda_p^2 (4.3); the ineffective strip (1 - rho) c lies at the free edge.
2. web (internal part, Table 4.1), psi from the section with the effective flange:
   k_sigma = 4.0 (psi = 1), 8.2/(1.05 + psi) (1 > psi > 0), 7.81 - 6.29 psi + 9.78 psi^2 (0 >= psi > -1),
   5.98 (1 - psi)^2 (-1 >= psi > -3); rho = 1 for lambda_p <= 0.5 + sqrt(0.085 - 0.055 psi), else
   rho = (lambda_p - 0.055 (3 + psi))/lambda_p^2 <= 1 (4.2, as amended by EN 1993-1-5:2006/A1:2017,
   from memory); for psi < 0: b_c = c/(1 - psi), b_eff = rho b_c, b_e1 = 0.4 b_eff at the compressed edge,
   b_e2 = 0.6 b_eff towards the neutral axis; for psi >= 0: b_eff = rho c, b_e1 = 2 b_eff/(5 - psi).
3. W_eff = I_eff / z_max of the effective section (the smaller modulus), EN 1993-1-1 6.2.5(2).

Not covered (NotCoveredError): Class 4 under axial force (the shift e_N of 6.2.2.5(4)), outstands not in
uniform compression, webs with longitudinal stiffeners.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ._calc import Calc, condition, formula
from .classify import Classification, web_geometry

__all__ = ["EffectiveSection", "effective_section"]

_R5 = "EN 1993-1-5:2006"
F_LP = formula("lam_bar_p", "(b_bar/t)/(28.4*epsilon*sqrt(k_sigma))", _R5 + " 4.4(2)", "plate slenderness",
               dims={"b_bar": "length", "t": "length"})
F_RHO_OUT = formula("rho", "Min((lam_bar_p - 0.188)/lam_bar_p**2, 1)", _R5 + " 4.4(2) Eq. (4.3)",
                    "reduction factor, outstand")
F_RHO_INT = formula("rho", "Min((lam_bar_p - 0.055*(3 + psi))/lam_bar_p**2, 1)", _R5 + " 4.4(2) Eq. (4.2)",
                    "reduction factor, internal part")
F_KS_1 = formula("k_sigma", "8.2/(1.05 + psi)", _R5 + " Table 4.1", "buckling factor, 1 >= psi > 0")
F_KS_2 = formula("k_sigma", "7.81 - 6.29*psi + 9.78*psi**2", _R5 + " Table 4.1", "buckling factor, 0 >= psi >= -1")
F_KS_3 = formula("k_sigma", "5.98*(1 - psi)**2", _R5 + " Table 4.1", "buckling factor, -1 >= psi > -3")
F_BEFF_NEG = formula("b_eff", "rho*b_bar/(1 - psi)", _R5 + " Table 4.1", "effective compressed width, psi < 0",
                     dims={"b_eff": "length", "b_bar": "length"})
F_BEFF_POS = formula("b_eff", "rho*b_bar", _R5 + " Table 4.1", "effective width, psi >= 0",
                     dims={"b_eff": "length", "b_bar": "length"})
F_WEFF = formula("W_eff_y", "I_eff/z_max", "EN 1993-1-1:2005 6.2.5(2)", "effective elastic modulus",
                 dims={"W_eff_y": "modulus", "I_eff": "inertia", "z_max": "length"})
C_OUT = condition("lam_bar_p <= 0.748", _R5 + " 4.4(2)", then="rho = 1 (fully effective outstand)",
                  otherwise="the outstand is partly effective")
C_INT = condition("lam_bar_p <= 0.5 + sqrt(0.085 - 0.055*psi)", _R5 + " 4.4(2)",
                  then="rho = 1 (fully effective web)", otherwise="the web is partly effective")


@dataclass(frozen=True)
class EffectiveSection:
    """Effective properties of a Class 4 I-section in major-axis bending (SI floats)."""

    W_eff: float  #: min elastic modulus of the effective section (m3)
    I_eff: float  #: second moment of the effective section (m4)
    A_eff: float  #: effective area (m2)
    y_c: float  #: effective centroid from the bottom fibre (m)
    rho_f: float  #: reduction factor of the compression flange outstands
    rho_w: float  #: reduction factor of the web
    psi_w: float  #: web stress ratio used (effective flange, gross web)
    holes: tuple  #: removed strips (width, height, centroid y) in m
    steps: tuple = ()


def _remove(A, yc, I, strips):
    """Section properties after removing rectangular strips (b, h, y_centre)."""
    a_tot = sum(b * h for b, h, _ in strips)
    An = A - a_tot
    yn = (A * yc - sum(b * h * y for b, h, y in strips)) / An
    In = I + A * (yc - yn) ** 2 - sum(b * h ** 3 / 12 + b * h * (y - yn) ** 2 for b, h, y in strips)
    return An, yn, In


def effective_section(s, cl: Classification, calc: Calc | None = None) -> EffectiveSection:
    """Effective section for ``s`` (SectionProps) classified by ``cl`` (Class 4), bending only."""
    calc = calc or Calc(False)
    n0 = len(calc.records)
    eps = cl.epsilon
    top = cl.compression_flange == "top"
    strips = []
    rho_f = 1.0
    if cl.flange_class == 4:
        lp = calc(F_LP, b_bar=cl.c_f, t=cl.t_f, epsilon=eps, k_sigma=0.43, note="outstand, k_sigma = 0.43 (psi = 1)")
        if not calc.branch(C_OUT, lp <= 0.748, lam_bar_p=lp):
            rho_f = calc(F_RHO_OUT, lam_bar_p=lp)
        yf = s.d - cl.t_f / 2 if top else cl.t_f / 2
        w = (1.0 - rho_f) * cl.c_f
        if w > 0:
            strips += [(w, cl.t_f, yf), (w, cl.t_f, yf)]
    A1, y1, I1 = _remove(s.A, s.y_c, s.Ix, strips)
    c_w, y_top, y_bot = web_geometry(s)
    # stresses (compression positive) at the web ends for the effective-flange section
    if top:
        s1, s2 = y_top - y1, y_bot - y1
        y_edge, direction = y_top, -1.0
    else:
        s1, s2 = y1 - y_bot, y1 - y_top
        y_edge, direction = y_bot, 1.0
    psi = s2 / s1
    rho_w = 1.0
    if cl.web_class == 4:
        if psi >= 1.0 - 1e-12:
            ks = 4.0
        elif psi > 0:
            ks = calc(F_KS_1, psi=psi)
        elif psi >= -1 - 1e-9:  # psi = -1 itself: 7.81 + 6.29 + 9.78 = 23.88 (Table 4.1 prints 23.9)
            ks = calc(F_KS_2, psi=max(psi, -1.0))
        elif psi > -3:
            ks = calc(F_KS_3, psi=psi)
        else:
            from ...errors import NotCoveredError

            raise NotCoveredError(f"web stress ratio psi = {psi:.3g} < -3: outside EN 1993-1-5 Table 4.1")
        lp = calc(F_LP, b_bar=c_w, t=s.tw, epsilon=eps, k_sigma=ks, note=f"web, psi = {psi:.3f}")
        if not calc.branch(C_INT, lp <= 0.5 + math.sqrt(0.085 - 0.055 * psi), lam_bar_p=lp, psi=psi):
            rho_w = calc(F_RHO_INT, lam_bar_p=lp, psi=psi)
        if rho_w < 1.0:
            if psi < 0:
                bc = c_w / (1.0 - psi)
                beff = calc(F_BEFF_NEG, rho=rho_w, b_bar=c_w, psi=psi)
                be1 = 0.4 * beff
            else:
                bc = c_w
                beff = calc(F_BEFF_POS, rho=rho_w, b_bar=c_w)
                be1 = 2.0 * beff / (5.0 - psi)
            hole = bc - beff
            yh = y_edge + direction * (be1 + hole / 2)
            strips.append((s.tw, hole, yh))
    A, yc, I = _remove(s.A, s.y_c, s.Ix, strips)
    zmax = max(s.d - yc, yc)
    W = calc(F_WEFF, I_eff=I, z_max=zmax)
    recs = tuple(calc.records[n0:]) if calc.steps else ()
    return EffectiveSection(W, I, A, yc, rho_f, rho_w, psi, tuple(strips), recs)
