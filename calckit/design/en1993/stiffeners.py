"""Bearing stiffeners: a pair of flat transverse stiffeners (one each side of the web) at a support or under a
load, EN 1993-1-5:2006 section 9 with EN 1993-1-1:2005 6.2.4 and 6.3.1.

Clause numbers and equation numbers of EN 1993-1-5 are given from memory of the 2006 edition; check them
against the standard and its National Annex.

- Effective cross-section (9.1(2), Figure 9.1; used by 9.4(2)): the two stiffeners plus a strip of web of
  15 eps t_w on each side of the stiffener, eps = sqrt(235 MPa / f_yw), but not more than the web available:
  at a member end the strip on the end side is min(e, 15 eps t_w), e = length of web beyond the outer face
  of the stiffener (0 when the stiffener is flush with the end). Web strip length l_w (including the
  stiffener thickness) = t_s + 30 eps t_w (interior) or t_s + 15 eps t_w + min(e, 15 eps t_w) (end).
  A_s,eff = 2 b_s t_s + l_w t_w; I_s = t_s (2 b_s + t_w)^3/12 + (l_w - t_s) t_w^3/12 about the web mid-plane;
  i_s = sqrt(I_s / A_s,eff).
- Buckling out of the web plane (9.4(2)): EN 1993-1-1 6.3.1 with buckling curve c (alpha = 0.49, Table 6.1)
  and l = 0.75 h_w when both flanges are restrained laterally; with less restraint 9.4(2) asks for a larger
  l, and calckit takes l = h_w (a calckit choice to be reviewed). lambda_1 = pi sqrt(E/f_y) (6.50),
  lambda_bar = l/(i_s lambda_1) (6.50), chi = 1 for lambda_bar <= 0.2 (6.3.1.2(4)), else
  Phi = 0.5 [1 + alpha (lambda_bar - 0.2) + lambda_bar^2], chi = 1/(Phi + sqrt(Phi^2 - lambda_bar^2)) <= 1
  (6.49); N_b,Rd = chi A_s,eff f_y / gamma_M1 (6.47). f_y = the lower of f_yw and the stiffener's f_y.
  The whole F_Ed is carried by the effective section (the web's own resistance to EN 1993-1-5 section 6 is
  not added). The axial force from a tension field (9.3.3(3)) is not added: give it in F_Ed if it applies.
- Cross-section resistance: N_c,Rd = A_s,eff f_y / gamma_M0 (EN 1993-1-1 6.2.4 Eq. (6.10)).
- Fitted ends: 9.4(2) asks for the cross-sectional resistance at a loaded end with cut-outs; calckit checks
  the stiffener ends alone, net of the corner clips, carrying all of F_Ed (common practice, conservative:
  the web under the flange is ignored): A_s,net = 2 (b_s - c_l) t_s, F_c,Rd = A_s,net f_y,s / gamma_M0.
- Outstand: c/t <= 14 eps_s (EN 1993-1-1 Table 5.2 sheet 2, outstand in compression, Class 3 limit), with
  c = b_s measured from the web face (weld not deducted: conservative), eps_s = sqrt(235 MPa / f_y,s); then
  no effective-width reduction is needed.
- Torsional buckling (9.2.1(8), Eq. (9.3)): I_T / I_p >= 5.3 f_y,s / E for a flat with no warping
  stiffness; I_T = b_s t_s^3/3, I_p = b_s^3 t_s/3 + b_s t_s^3/12 (polar second moment of the flat about
  its edge on the web). For flats this is about b_s/t_s <= 13 eps_s.
- Rigid end post (9.3.1(3), Figure 5.1(b)), optional: each of the two double-sided stiffeners forming the
  post has A_st = 2 b_s t_s >= 4 h_w t_w^2 / e_p, e_p = distance between their centrelines, with
  e_p > 0.1 h_w (the requirement is in the text of 9.3.1(3); from memory). Both stiffeners of the post are
  taken as the plates given here; the post's action as a short beam is not checked further.

Sizing: widths in 10 mm steps up to (b_f - t_w)/2 of the narrower flange, thicknesses 8, 10, 12, 15, 20, 25,
30, 35, 40 mm (common practice); the thinnest plate for which some width passes, and the narrowest such
width. The corner clip defaults to the root radius (rolled) or the flange-to-web weld leg (welded), rounded
up to 5 mm, at least 15 mm (common practice). Welds of the stiffeners are not designed here.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ...errors import InputError
from ...materials import steel as _get_steel
from ._calc import Calc, condition, formula
from ._common import demand, length, material, section_props
from ._result import ENResult, rated
from .factors import annex_set

__all__ = ["bearing_stiffener", "size_bearing_stiffener", "StiffenerSizing", "THICKNESSES", "WIDTH_STEP",
           "default_clip"]

_R5 = "EN 1993-1-5:2006"
_R1 = "EN 1993-1-1:2005"
#: plate thicknesses (m) and width step (m) of the sizing series (common practice)
THICKNESSES = tuple(t * 1e-3 for t in (8, 10, 12, 15, 20, 25, 30, 35, 40))
WIDTH_STEP = 10e-3
ALPHA_C = 0.49  #: EN 1993-1-1 Table 6.1, buckling curve c

_D = {"b_s": "length", "t_s": "length", "t_w": "length", "h_w": "length", "l_w": "length", "e": "length",
      "e_p": "length", "c_l": "length", "l": "length", "i_s": "length", "A_s_eff": "area", "A_s_net": "area",
      "A_st": "area", "A_req": "area", "I_s": "inertia", "I_T": "inertia", "I_p": "inertia", "E": "stress",
      "f_y": "stress", "f_yw": "stress", "f_y_s": "stress", "f_y0": "stress", "N_b_Rd": "force",
      "N_c_Rd": "force", "F_c_Rd": "force"}
_CT = {"c_t": "c/t"}

F_EPS_W = formula("epsilon_w", "sqrt(f_y0/f_yw)", _R5 + " 9.1(2)", "material factor of the web (f_y0 = 235 MPa)",
                  dims=_D)
F_EPS_S = formula("epsilon_s", "sqrt(f_y0/f_y_s)", _R1 + " Table 5.2", "material factor of the stiffener", dims=_D)
F_LW_INT = formula("l_w", "t_s + 30*epsilon_w*t_w", _R5 + " 9.1(2), Figure 9.1",
                   "web strip, 15 eps t_w each side of the stiffener (interior)", dims=_D)
F_LW_END = formula("l_w", "t_s + 15*epsilon_w*t_w + Min(e, 15*epsilon_w*t_w)", _R5 + " 9.1(2), Figure 9.1",
                   "web strip at a member end: the end side limited to the web available", dims=_D)
F_A = formula("A_s_eff", "2*b_s*t_s + l_w*t_w", _R5 + " 9.1(2), 9.4(2)", "effective area (stiffeners + web strip)",
              dims=_D)
F_I = formula("I_s", "t_s*(2*b_s + t_w)**3/12 + (l_w - t_s)*t_w**3/12", _R5 + " 9.4(2)",
              "second moment of area for buckling out of the web plane", dims=_D)
F_IS = formula("i_s", "sqrt(I_s/A_s_eff)", _R1 + " 6.3.1.3", "radius of gyration", dims=_D)
F_L_R = formula("l", "0.75*h_w", _R5 + " 9.4(2)", "buckling length, both flanges restrained laterally", dims=_D)
F_L_U = formula("l", "h_w", _R5 + " 9.4(2)",
                "buckling length, flanges not both restrained (larger l required; calckit takes h_w)", dims=_D)
F_LAM1 = formula("lam_1", "pi*sqrt(E/f_y)", _R1 + " 6.3.1.3(1) Eq. (6.50)", "", dims=_D)
F_LAM = formula("lam_bar", "l/(i_s*lam_1)", _R1 + " 6.3.1.3(1) Eq. (6.50)", "non-dimensional slenderness", dims=_D)
C_LAM = condition("lam_bar <= 0.2", _R1 + " 6.3.1.2(4)", then="buckling effects may be ignored: chi = 1",
                  otherwise="flexural buckling, curve c (EN 1993-1-5 9.4(2))")
F_PHI = formula("Phi", "0.5*(1 + alpha*(lam_bar - 0.2) + lam_bar**2)", _R1 + " 6.3.1.2(1)", "")
F_CHI = formula("chi", "Min(1/(Phi + sqrt(Phi**2 - lam_bar**2)), 1)", _R1 + " 6.3.1.2(1) Eq. (6.49)",
                "reduction factor")
F_NBRD = formula("N_b_Rd", "chi*A_s_eff*f_y/gamma_M1", _R1 + " 6.3.1.1(3) Eq. (6.47)",
                 "buckling resistance out of the web plane", dims=_D)
F_NCRD = formula("N_c_Rd", "A_s_eff*f_y/gamma_M0", _R1 + " 6.2.4(2) Eq. (6.10)", "cross-section resistance",
                 dims=_D)
F_ANET = formula("A_s_net", "2*(b_s - c_l)*t_s", _R5 + " 9.4(2)", "stiffener ends net of the corner clips",
                 dims=_D, latex={"c_l": "c_{l}"})
F_FCRD = formula("F_c_Rd", "A_s_net*f_y_s/gamma_M0", _R5 + " 9.4(2) (common practice: ends alone)",
                 "resistance of the fitted ends", dims=_D)
F_CT = formula("c_t", "b_s/t_s", _R1 + " Table 5.2 sheet 2", "outstand ratio, c = b_s from the web face", dims=_D,
               latex=_CT)
F_CT_LIM = formula("c_t_lim", "14*epsilon_s", _R1 + " Table 5.2 sheet 2", "Class 3 limit, outstand in compression",
                   latex={"c_t_lim": "(c/t)_{lim}"})
F_IT = formula("I_T", "b_s*t_s**3/3", _R5 + " 9.2.1(8)", "St Venant torsion constant of the flat", dims=_D)
F_IP = formula("I_p", "b_s**3*t_s/3 + b_s*t_s**3/12", _R5 + " 9.2.1(8)",
               "polar second moment of the flat about its edge on the web", dims=_D)
F_TR = formula("rho_T", "I_T/I_p", _R5 + " 9.2.1(8) Eq. (9.3)", "provided", dims=_D,
               latex={"rho_T": "I_{T}/I_{p}"})
F_TL = formula("rho_T_req", "5.3*f_y_s/E", _R5 + " 9.2.1(8) Eq. (9.3)", "required (no warping stiffness)", dims=_D,
               latex={"rho_T_req": r"(I_{T}/I_{p})_{req}"})
F_AST = formula("A_st", "2*b_s*t_s", _R5 + " 9.3.1(3)", "area of each double-sided stiffener of the post", dims=_D)
F_AREQ = formula("A_req", "4*h_w*t_w**2/e_p", _R5 + " 9.3.1(3) (from memory)",
                 "minimum area of each stiffener of a rigid end post", dims=_D)
C_EP = condition("e_p > 0.1*h_w", _R5 + " 9.3.1(3)", then="spacing of the end-post stiffeners sufficient",
                 otherwise="e_p <= 0.1 h_w: not a rigid end post", dims={"e_p": "length", "h_w": "length"})

HEAD = "Bearing stiffener pair"
WELD_NOTE = "welds of the stiffeners to the web and flanges are not designed here"


def default_clip(s) -> float:
    """Corner clip (m): the root radius or the flange-to-web weld leg, rounded up to 5 mm, >= 15 mm
    (common practice)."""
    k = max(s.r, getattr(s, "weld", 0.0) or 0.0)
    return max(15e-3, math.ceil(k / 5e-3 - 1e-9) * 5e-3)


@dataclass(frozen=True)
class StiffenerSizing:
    """Result of :func:`size_bearing_stiffener`."""

    b_s: float  #: width of each stiffener (m)
    t_s: float  #: thickness of each stiffener (m)
    clip: float  #: corner clip (m)
    found: bool  #: True when the pair passes every check; False: the largest pair tried, failing
    checks: tuple  #: the ENResult checks of this pair (see :func:`bearing_stiffener`)
    note: str  #: how the pair was chosen

    @property
    def passed(self) -> bool:
        return all(c.passed is not False for c in self.checks)

    @property
    def governing(self):
        """The check with the largest ratio."""
        rated_ = [c for c in self.checks if c.ratio is not None]
        return max(rated_, key=lambda c: c.ratio) if rated_ else None


class _In:
    """Resolved inputs (SI floats) shared by the checks."""

    __slots__ = ("s", "ann", "fyw", "E", "bmax", "end", "e", "restrained", "post", "e_p", "grade")


def _resolve(section, steel, *, end, e, annex, restrained_flanges, rigid_end_post, e_post, stiffener_steel,
             fy) -> _In:
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    if not isinstance(end, bool):
        raise InputError(f"end: got {end!r}; expected True (stiffener at a member end) or False (interior)")
    x = _In()
    x.s, x.ann, x.fyw, x.E, x.end = s, ann, mat.fyw, mat.E, end
    try:
        x.grade = _get_steel(steel if stiffener_steel is None else stiffener_steel)
    except InputError as exc:
        raise InputError(f"stiffener_steel: {exc}") from None
    if x.grade.standard != "EN":
        raise InputError(f"stiffener_steel: got {x.grade.name} ({x.grade.standard}); expected an EN grade")
    if end:
        x.e = length(e, "e", positive=False, allow_none=True) or 0.0
    elif e is not None:
        raise InputError(f"e: got {e!r}; the web length beyond the stiffener applies to end=True only")
    else:
        x.e = math.inf
    x.restrained = bool(restrained_flanges)
    x.post = bool(rigid_end_post)
    x.e_p = length(e_post, "e_post", allow_none=True)
    if x.post and not end:
        raise InputError("rigid_end_post: got True with end=False; a rigid end post (EN 1993-1-5 9.3.1) is at a "
                         "member end")
    if x.post and x.e_p is None:
        raise InputError("e_post: no value given; rigid_end_post=True needs the distance between the centrelines "
                         "of the two stiffeners of the post (EN 1993-1-5 Figure 5.1(b))")
    x.bmax = 0.5 * (min(s.bf_top, s.bf_bot) - s.tw)
    return x


def _fy_s(x: _In, ts: float) -> float:
    try:
        return x.grade.fy_si(ts)
    except InputError as exc:
        raise InputError(f"t_s: {ts * 1e3:.4g} mm in {x.grade.name}: {exc}") from None


def _plates(x: _In, bs, ts, clip) -> tuple[float, float, float]:
    b = length(bs, "b_s")
    t = length(ts, "t_s")
    if b > x.bmax * (1 + 1e-9):
        raise InputError(f"b_s: got {b * 1e3:.4g} mm; expected at most (b_f - t_w)/2 = {x.bmax * 1e3:.4g} mm "
                         "(the stiffener may not project beyond the narrower flange)")
    c = default_clip(x.s) if clip is None else length(clip, "clip", positive=False)
    if c >= b:
        raise InputError(f"clip: got {c * 1e3:.4g} mm; expected less than b_s = {b * 1e3:.4g} mm")
    return b, t, c


def _take(calc: Calc) -> tuple:
    out = calc.take()
    calc.records = []
    return out


def _checks(x: _In, bs: float, ts: float, clip: float, F: float | None, calc: Calc, *, note: str = "",
            location=None, combination: str = "") -> tuple[ENResult, ...]:
    """Every check of the pair on SI floats (internal)."""
    s, ann = x.s, x.ann
    tw, hw, E = s.tw, s.hw, x.E
    fys = _fy_s(x, ts)
    fy = min(x.fyw, fys)
    g0, g1 = ann.gamma_M0, ann.gamma_M1
    base = {"b_s": bs, "t_s": ts, "clip": clip, "fy_s": fys, "fyw": x.fyw, "fy": fy, "end": x.end,
            "e": x.e if x.end else None, "annex": ann.name, "gamma_M0": g0, "gamma_M1": g1}
    kw = dict(method="EN", location=location, combination=combination)
    out = []
    calc.given("b_s", bs, "length", reference="width of each stiffener")
    calc.given("t_s", ts, "length", reference="thickness of each stiffener")
    calc.given("f_y_s", fys, "stress", reference=f"{_R1} Table 3.1, {x.grade.name}, t = t_s")
    # outstand (Class 3)
    eps_s = calc(F_EPS_S, f_y0=235e6, f_y_s=fys)
    ct = calc(F_CT, b_s=bs, t_s=ts)
    ctl = calc(F_CT_LIM, epsilon_s=eps_s)
    out.append(rated(ct, limit_state=f"{HEAD}: outstand c/t (Class 3)", clause=f"{_R1} 5.5, Table 5.2",
                     dim="dimensionless", capacity=ctl, steps=_take(calc), data={**base, "c_t": ct, "c_t_lim": ctl},
                     note="Class 3 or better: no effective-width reduction of the stiffeners" + _n(note), **kw))
    # torsional buckling
    calc.given("E", E, "stress", reference=f"{_R1} 3.2.6")
    IT = calc(F_IT, b_s=bs, t_s=ts)
    Ip = calc(F_IP, b_s=bs, t_s=ts)
    rho = calc(F_TR, I_T=IT, I_p=Ip)
    req = calc(F_TL, f_y_s=fys, E=E)
    out.append(rated(req, limit_state=f"{HEAD}: torsional buckling", clause=f"{_R5} 9.2.1(8) Eq. (9.3)",
                     dim="dimensionless", capacity=rho, steps=_take(calc),
                     data={**base, "I_T": IT, "I_p": Ip, "I_T_I_p": rho, "required": req},
                     note="flat stiffener, warping stiffness ignored; ratio = required / provided I_T/I_p", **kw))
    # effective section, cross-section resistance
    calc.given("t_w", tw, "length", reference="web thickness")
    calc.given("f_yw", x.fyw, "stress", reference=f"{_R1} Table 3.1, web")
    eps_w = calc(F_EPS_W, f_y0=235e6, f_yw=x.fyw)
    if x.end:
        calc.given("e", x.e, "length", reference="web beyond the outer face of the stiffener (member end)")
        lw = calc(F_LW_END, t_s=ts, epsilon_w=eps_w, t_w=tw, e=x.e)
    else:
        lw = calc(F_LW_INT, t_s=ts, epsilon_w=eps_w, t_w=tw)
    A = calc(F_A, b_s=bs, t_s=ts, l_w=lw, t_w=tw)
    calc.given("f_y", fy, "stress", reference="the lower of f_yw and f_y,s")
    Nc = calc(F_NCRD, A_s_eff=A, f_y=fy, gamma_M0=g0)
    sec = {**base, "l_w": lw, "epsilon_w": eps_w, "A_s_eff": A}
    side = "member end: web strip on the span side plus min(e, 15 eps t_w)" if x.end else "interior"
    out.append(rated(F, limit_state=f"{HEAD}: cross-section resistance", clause=f"{_R1} 6.2.4; {_R5} 9.1(2)",
                     dim="force", capacity=Nc, nominal=Nc * g0, steps=_take(calc), data={**sec, "N_c_Rd": Nc},
                     note=f"effective section: stiffeners + web strip ({side})", **kw))
    # buckling out of the web plane
    Is = calc(F_I, t_s=ts, b_s=bs, t_w=tw, l_w=lw)
    i_s = calc(F_IS, I_s=Is, A_s_eff=A)
    calc.given("h_w", hw, "length", reference="web depth between the flanges")
    l = calc(F_L_R, h_w=hw) if x.restrained else calc(F_L_U, h_w=hw)
    lam1 = calc(F_LAM1, E=E, f_y=fy)
    lam = calc(F_LAM, l=l, i_s=i_s, lam_1=lam1)
    Phi = None
    if calc.branch(C_LAM, lam <= 0.2, lam_bar=lam):
        chi = calc.given("chi", 1.0, reference=f"{_R1} 6.3.1.2(4)")
    else:
        calc.given("alpha", ALPHA_C, reference=f"{_R1} Table 6.1, curve c ({_R5} 9.4(2))")
        Phi = calc(F_PHI, alpha=ALPHA_C, lam_bar=lam)
        chi = calc(F_CHI, Phi=Phi, lam_bar=lam)
    Nb = calc(F_NBRD, chi=chi, A_s_eff=A, f_y=fy, gamma_M1=g1)
    lnote = ("l = 0.75 h_w: both flanges restrained laterally" if x.restrained else
             "l = h_w: flanges not both restrained laterally (EN 1993-1-5 9.4(2) asks for a larger l; h_w is a "
             "calckit choice, review it)")
    out.append(rated(F, limit_state=f"{HEAD}: buckling out of the web plane",
                     clause=f"{_R5} 9.4(2); {_R1} 6.3.1", dim="force", capacity=Nb, nominal=Nb * g1,
                     steps=_take(calc), data={**sec, "I_s": Is, "i_s": i_s, "l": l, "lambda_1": lam1,
                                              "lambda_bar": lam, "curve": "c", "alpha": ALPHA_C, "Phi": Phi,
                                              "chi": chi, "N_b_Rd": Nb, "N_c_Rd": Nc},
                     note=f"{lnote}; full-depth stiffeners; the whole F_Ed on the effective section; {WELD_NOTE}",
                     **kw))
    # fitted ends
    calc.given("c_l", clip, "length", reference="corner clip of each stiffener (clears the fillet or weld)")
    An = calc(F_ANET, b_s=bs, c_l=clip, t_s=ts)
    Fc = calc(F_FCRD, A_s_net=An, f_y_s=fys, gamma_M0=g0)
    out.append(rated(F, limit_state=f"{HEAD}: fitted ends under the flange", clause=f"{_R5} 9.4(2)", dim="force",
                     capacity=Fc, nominal=Fc * g0, steps=_take(calc), data={**base, "A_s_net": An, "F_c_Rd": Fc},
                     note="common practice: the stiffener ends net of the clips carry all of F_Ed (web ignored)",
                     **kw))
    if x.post:
        out.extend(_post(x, bs, ts, calc, base, kw))
    return tuple(out)


def _n(note: str) -> str:
    return f"; {note}" if note else ""


def _post(x: _In, bs, ts, calc, base, kw) -> list:
    """EN 1993-1-5 9.3.1(3): the two double-sided stiffeners of a rigid end post."""
    hw, tw, ep = x.s.hw, x.s.tw, x.e_p
    calc.given("e_p", ep, "length", reference=f"{_R5} Figure 5.1(b): distance between the stiffener centrelines")
    calc.given("h_w", hw, "length", reference="web depth between the flanges")
    ok = calc.branch(C_EP, ep > 0.1 * hw, e_p=ep, h_w=hw)
    spacing = ENResult(limit_state="Rigid end post: stiffener spacing e > 0.1 h_w", clause=f"{_R5} 9.3.1(3)",
                       dim="length", capacity=ep, demand=0.1 * hw, ratio=0.1 * hw / ep, passed=ok,
                       steps=_take(calc), data={**base, "e_post": ep}, note="", **kw)
    calc.given("t_w", tw, "length", reference="web thickness")
    Ast = calc(F_AST, b_s=bs, t_s=ts)
    Areq = calc(F_AREQ, h_w=hw, t_w=tw, e_p=ep)
    area = rated(Areq, limit_state="Rigid end post: area of each stiffener", clause=f"{_R5} 9.3.1(3)", dim="area",
                 capacity=Ast, steps=_take(calc), data={**base, "e_post": ep, "A_st": Ast, "A_req": Areq},
                 note="both stiffeners of the post taken as this pair; the post as a short beam is not checked "
                      "further; equation from memory", **kw)
    return [spacing, area]


def bearing_stiffener(section, steel, F_Ed, *, b_s, t_s, end: bool, e=None, clip=None, annex="recommended",
                      restrained_flanges: bool = True, rigid_end_post: bool = False, e_post=None,
                      stiffener_steel=None, fy=None, steps: bool = True, location=None,
                      combination: str = "") -> tuple[ENResult, ...]:
    """Check a pair of flat bearing stiffeners ``b_s`` x ``t_s`` (one each side of the web) carrying ``F_Ed``.

    EN 1993-1-5:2006 9.1(2), 9.2.1(8), 9.4(2) (and 9.3.1(3) with ``rigid_end_post``), EN 1993-1-1:2005
    Table 5.2, 6.2.4, 6.3.1; see :mod:`calckit.design.en1993.stiffeners` for the equations.

    ``end``: the stiffener is at a member end (web strip limited there); ``e``: web beyond the stiffener's
    outer face at the end (default 0; end=True only); ``clip``: corner clip (None: :func:`default_clip`);
    ``restrained_flanges``: both flanges held laterally (l = 0.75 h_w, else h_w); ``e_post``: centre distance
    of the two end-post stiffeners (needed with ``rigid_end_post``); ``stiffener_steel``: grade of the plates
    (None: the member's); ``fy``: the member's f_y override. ``F_Ed`` None gives capacities only.
    Returns ENResults in this order: outstand, torsional buckling, cross-section, buckling, fitted ends
    [, end-post spacing, end-post area]. A failing pair is a result; bad input raises InputError.
    """
    x = _resolve(section, steel, end=end, e=e, annex=annex, restrained_flanges=restrained_flanges,
                 rigid_end_post=rigid_end_post, e_post=e_post, stiffener_steel=stiffener_steel, fy=fy)
    bs, ts, c = _plates(x, b_s, t_s, clip)
    F = demand(F_Ed, "force", "F_Ed")
    return _checks(x, bs, ts, c, F, Calc(steps), note="stiffener pair as given", location=location,
                   combination=combination)


def size_bearing_stiffener(section, steel, F_Ed, *, end: bool, e=None, clip=None, annex="recommended",
                           restrained_flanges: bool = True, rigid_end_post: bool = False, e_post=None,
                           stiffener_steel=None, fy=None, thicknesses=None, steps: bool = True, location=None,
                           combination: str = "") -> StiffenerSizing:
    """The thinnest, then narrowest, pair of the plate series that passes every check of
    :func:`bearing_stiffener` (same keywords), or the largest pair tried (widest, thickest) with its failing
    checks. ``thicknesses``: plate series in m (default :data:`THICKNESSES`, common practice); widths are
    multiples of 10 mm up to (b_f - t_w)/2 of the narrower flange and wider than the clip.
    """
    x = _resolve(section, steel, end=end, e=e, annex=annex, restrained_flanges=restrained_flanges,
                 rigid_end_post=rigid_end_post, e_post=e_post, stiffener_steel=stiffener_steel, fy=fy)
    F = demand(F_Ed, "force", "F_Ed")
    if F is None:
        raise InputError("F_Ed: no value given; sizing needs the design force")
    c = default_clip(x.s) if clip is None else length(clip, "clip", positive=False)
    series = THICKNESSES if thicknesses is None else tuple(sorted(length(t, "thicknesses") for t in thicknesses))
    if not series:
        raise InputError("thicknesses: got an empty series; expected plate thicknesses")
    kmax = math.floor(x.bmax / WIDTH_STEP + 1e-9)
    widths = [k * WIDTH_STEP for k in range(1, kmax + 1) if k * WIDTH_STEP > c * (1 + 1e-9)]
    if not widths:
        raise InputError(f"clip: got {c * 1e3:.4g} mm; no stiffener width of the series (10 mm steps up to "
                         f"(b_f - t_w)/2 = {x.bmax * 1e3:.4g} mm) is wider than the clip")
    fast = Calc(False)
    for ts in series:
        lim = 14.0 * math.sqrt(235e6 / _fy_s(x, ts)) * ts
        for bs in widths:
            if bs > lim * (1 + 1e-9):
                break  # wider plates of this thickness fail the outstand limit
            if all(r.passed for r in _checks(x, bs, ts, c, F, fast)):
                chk = _checks(x, bs, ts, c, F, Calc(steps), note="pair sized", location=location,
                              combination=combination)
                return StiffenerSizing(bs, ts, c, True, chk, "pair sized: thinnest, then narrowest, plate of the "
                                       "series that passes every check (common practice series)")
    bs, ts = widths[-1], series[-1]
    chk = _checks(x, bs, ts, c, F, Calc(steps), location=location, combination=combination)
    return StiffenerSizing(bs, ts, c, False, chk, "no pair of the series passes: the widest and thickest tried is "
                           "shown with its failing checks; revise the section or the detail")
