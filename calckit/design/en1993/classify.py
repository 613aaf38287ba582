"""Cross-section classification, EN 1993-1-1:2005 5.5 and Table 5.2 (I-sections in bending, with or
without axial compression).

Compression parts:
- flange outstand (Table 5.2 sheet 2, outstand in compression): c = (b - t_w - 2 r)/2 for rolled sections,
  c = (b - t_w - 2 a sqrt2)/2 for welded ones (a sqrt2 = the fillet leg, ``section.si.weld``);
  limits 9, 10, 14 epsilon.
- web (Table 5.2 sheet 1, internal part): c = h_w - 2 r (rolled) or h_w - 2 a sqrt2 (welded). Class 1/2 use
  alpha, the compressed fraction of c at the plastic neutral axis (396 eps/(13 alpha - 1) or 36 eps/alpha;
  456 eps/(13 alpha - 1) or 41.5 eps/alpha); Class 3 uses psi, the elastic stress ratio at the ends of c
  (42 eps/(0.67 + 0.33 psi) for psi > -1, 62 eps (1 - psi) sqrt(-psi) for psi <= -1). Pure bending of a
  doubly symmetric section gives alpha = 0.5, psi = -1, hence 72, 83, 124 eps.
epsilon = sqrt(235 / f_y) with f_y in MPa.

The section's class is the highest (least favourable) class of its compression parts (5.5.2(6)).
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ._calc import Calc, condition, formula
from ._common import Material, demand, material, section_props

__all__ = ["Classification", "classify", "classify_si", "web_geometry"]

_R = "EN 1993-1-1:2005 Table 5.2"
F_EPS = formula("epsilon", "sqrt(f_y0/f_y)", "EN 1993-1-1:2005 Table 5.2", "material factor (f_y0 = 235 MPa)",
                dims={"f_y": "stress", "f_y0": "stress"})
FY0 = 235e6  #: the reference yield strength of epsilon, Pa (EN 1993-1-1 Table 5.2)
F_CF_ROLLED = formula("c_f", "(b - t_w - 2*r)/2", _R + " sheet 2", "flange outstand, rolled",
                      dims={"c_f": "length", "b": "length", "t_w": "length", "r": "length"})
F_CF_WELDED = formula("c_f", "(b - t_w - 2*s_w)/2", _R + " sheet 2", "flange outstand, welded (s_w = a sqrt2)",
                      dims={"c_f": "length", "b": "length", "t_w": "length", "s_w": "length"})
F_CW_ROLLED = formula("c_w", "h_w - 2*r", _R + " sheet 1", "web depth between fillets",
                      dims={"c_w": "length", "h_w": "length", "r": "length"})
F_CW_WELDED = formula("c_w", "h_w - 2*s_w", _R + " sheet 1", "web depth between weld toes",
                      dims={"c_w": "length", "h_w": "length", "s_w": "length"})
F_RATIO_F = formula("c_f_t_f", "c_f/t_f", _R, "flange slenderness", dims={"c_f": "length", "t_f": "length"},
                    latex={"c_f_t_f": "c_{f}/t_{f}"})
F_RATIO_W = formula("c_w_t_w", "c_w/t_w", _R, "web slenderness", dims={"c_w": "length", "t_w": "length"},
                    latex={"c_w_t_w": "c_{w}/t_{w}"})
F_ALPHA = formula("alpha", "c_c/c_w", _R + " sheet 1", "compressed fraction of c at the plastic NA",
                  dims={"c_c": "length", "c_w": "length"})
F_PSI = formula("psi", "sigma_2/sigma_1", _R + " sheet 1", "stress ratio at the ends of c (elastic)",
                dims={"sigma_1": "stress", "sigma_2": "stress"})
F_L1_HI = formula("lim_1", "396*epsilon/(13*alpha - 1)", _R + " sheet 1", "Class 1 limit, alpha > 0.5")
F_L1_LO = formula("lim_1", "36*epsilon/alpha", _R + " sheet 1", "Class 1 limit, alpha <= 0.5")
F_L2_HI = formula("lim_2", "456*epsilon/(13*alpha - 1)", _R + " sheet 1", "Class 2 limit, alpha > 0.5")
F_L2_LO = formula("lim_2", "41.5*epsilon/alpha", _R + " sheet 1", "Class 2 limit, alpha <= 0.5")
F_L3_HI = formula("lim_3", "42*epsilon/(0.67 + 0.33*psi)", _R + " sheet 1", "Class 3 limit, psi > -1")
F_L3_LO = formula("lim_3", "62*epsilon*(1 - psi)*sqrt(-psi)", _R + " sheet 1", "Class 3 limit, psi <= -1")
F_FL = [formula(f"lim_{i}", f"{k}*epsilon", _R + " sheet 2", f"Class {i} limit, outstand in compression")
        for i, k in ((1, 9), (2, 10), (3, 14))]
C_FLANGE = [condition(f"c_f_t_f <= lim_{i}", _R + " sheet 2", then=f"flange Class {i} or better",
                      otherwise=f"flange worse than Class {i}", latex={"c_f_t_f": "c_{f}/t_{f}"})
            for i in (1, 2, 3)]
C_WEB = [condition(f"c_w_t_w <= lim_{i}", _R + " sheet 1", then=f"web Class {i} or better",
                   otherwise=f"web worse than Class {i}", latex={"c_w_t_w": "c_{w}/t_{w}"})
         for i in (1, 2, 3)]


@dataclass(frozen=True)
class Classification:
    """Result of EN 1993-1-1 Table 5.2 for an I-section (SI floats; slenderness ratios dimensionless)."""

    cls: int  #: section class 1..4 (worst part)
    flange_class: int  #: class of the compression flange outstand
    web_class: int  #: class of the web
    epsilon: float  #: sqrt(235/f_y)
    fy: float  #: yield strength used (Pa)
    compression_flange: str  #: "top" (sagging) or "bottom" (hogging)
    c_f: float  #: flange outstand width c (m)
    t_f: float  #: compression flange thickness (m)
    c_w: float  #: web depth c (m)
    t_w: float  #: web thickness (m)
    alpha: float  #: compressed fraction of c_w at the plastic neutral axis
    psi: float  #: elastic stress ratio at the ends of c_w (compression end = 1)
    flange_limits: tuple  #: (9, 10, 14) epsilon
    web_limits: tuple  #: Class 1, 2, 3 limits for c_w/t_w
    steps: tuple = ()  #: calc-sheet records
    note: str = ""  #: assumptions (e.g. psi taken as 1 for axial force without a moment)

    @property
    def flange_ratio(self) -> float:
        return self.c_f / self.t_f

    @property
    def web_ratio(self) -> float:
        return self.c_w / self.t_w


def web_geometry(s) -> tuple[float, float, float]:
    """(c_w, y_top_end, y_bottom_end): the web part c of Table 5.2 and its end heights from the bottom (m)."""
    off = s.r if s.kind == "I_rolled" else s.weld
    y_bot = s.tf_bot + off
    y_top = s.d - s.tf_top - off
    return y_top - y_bot, y_top, y_bot


def classify(section, steel, *, sagging: bool = True, N_Ed=None, M_Ed=None, fy=None, steps: bool = True
             ) -> Classification:
    """Classify an I-section to EN 1993-1-1 Table 5.2 (units at the boundary).

    ``sagging``: the top flange is in compression (False: hogging, bottom flange). ``N_Ed``: axial
    compression (force, >= 0; tension is not covered here); with ``M_Ed`` the web's psi comes from the
    elastic stresses under both, without it psi = 1 is taken (uniform compression, the onerous case).
    """
    s = section_props(section)
    mat = material(s, steel, fy)
    N = demand(N_Ed, "force", "N_Ed") or 0.0
    M = demand(M_Ed, "moment", "M_Ed")
    return classify_si(s, mat, sagging=sagging, N_Ed=N, M_Ed=M, calc=Calc(steps))


def classify_si(s, mat: Material, *, sagging: bool = True, N_Ed: float = 0.0, M_Ed: float | None = None,
                calc: Calc | None = None) -> Classification:
    """Numeric core of :func:`classify` (SI floats); ``calc`` collects the steps."""
    own = calc is None
    calc = calc or Calc(False)
    n0 = len(calc.records)
    fy = mat.fy
    eps = calc(F_EPS, f_y0=FY0, f_y=fy)
    top = bool(sagging)
    b = s.bf_top if top else s.bf_bot
    tf = s.tf_top if top else s.tf_bot
    if s.kind == "I_rolled":
        c_f = calc(F_CF_ROLLED, b=b, t_w=s.tw, r=s.r)
        c_w = calc(F_CW_ROLLED, h_w=s.hw, r=s.r)
    else:
        c_f = calc(F_CF_WELDED, b=b, t_w=s.tw, s_w=s.weld)
        c_w = calc(F_CW_WELDED, h_w=s.hw, s_w=s.weld)
    if c_f <= 0 or c_w <= 0:
        from ...errors import InputError

        raise InputError(f"section {s.name}: c = {min(c_f, c_w) * 1e3:.3g} mm; the flange outstand or web "
                         "between fillets/welds has no width")
    rf = calc(F_RATIO_F, c_f=c_f, t_f=tf)
    fl = [calc(F, epsilon=eps) for F in F_FL]
    fcls = 4
    for i in range(3):
        if calc.branch(C_FLANGE[i], rf <= fl[i], c_f_t_f=rf, **{f"lim_{i + 1}": fl[i]}):
            fcls = i + 1
            break
    # web: alpha from the plastic neutral axis (shifted by N_Ed within the web), psi from elastic stresses
    _, y_top, y_bot = web_geometry(s)
    y_pna = s.y_pna - (N_Ed / (2.0 * fy * s.tw) if top else -N_Ed / (2.0 * fy * s.tw))
    comp = (y_top - max(y_pna, y_bot)) if top else (min(y_pna, y_top) - y_bot)
    comp = min(max(comp, 0.0), c_w)
    alpha = calc(F_ALPHA, c_c=comp, c_w=c_w) if comp > 0 else 1e-9
    note = ""
    if N_Ed > 0 and M_Ed is None:
        s1 = s2 = N_Ed / s.A
        note = "N_Ed without M_Ed: psi = 1 taken (uniform compression, EN 1993-1-1 Table 5.2)"
    else:
        M = M_Ed if M_Ed is not None else 1.0  # pure bending: ratio independent of M
        N = N_Ed if M_Ed is not None else 0.0
        zc_top, zc_bot = y_top - s.y_c, y_bot - s.y_c
        sgn = 1.0 if top else -1.0
        sa = N / s.A + sgn * M * zc_top / s.Ix
        sb = N / s.A + sgn * M * zc_bot / s.Ix
        s1, s2 = (sa, sb) if sa >= sb else (sb, sa)
    psi = calc(F_PSI, sigma_1=s1, sigma_2=s2)
    l1 = calc(F_L1_HI, epsilon=eps, alpha=alpha) if alpha > 0.5 else calc(F_L1_LO, epsilon=eps, alpha=alpha)
    l2 = calc(F_L2_HI, epsilon=eps, alpha=alpha) if alpha > 0.5 else calc(F_L2_LO, epsilon=eps, alpha=alpha)
    l3 = calc(F_L3_HI, epsilon=eps, psi=psi) if psi > -1 else calc(F_L3_LO, epsilon=eps, psi=psi)
    rw = calc(F_RATIO_W, c_w=c_w, t_w=s.tw)
    wl = (l1, l2, l3)
    wcls = 4
    for i in range(3):
        if calc.branch(C_WEB[i], rw <= wl[i], c_w_t_w=rw, **{f"lim_{i + 1}": wl[i]}):
            wcls = i + 1
            break
    cls = max(fcls, wcls)
    if calc.steps:
        calc.say(f"Section {s.name or ''} is Class {cls} (flange Class {fcls}, web Class {wcls}); the class of a "
                 "section is that of its least favourable compression part", "EN 1993-1-1:2005 5.5.2(6)")
    recs = tuple(calc.records[n0:]) if calc.steps else ()
    return Classification(cls, fcls, wcls, eps, fy, "top" if top else "bottom", c_f, tf, c_w, s.tw, alpha,
                          psi, tuple(fl), wl, recs if own or calc.steps else (), note)
