"""Stiffener pairs at concentrated forces, AISC 360-22 J10.8 with J4.4 / Chapter E and J7 (I-shapes, channels).

When a J10 check of a concentrated force fails, a pair of transverse stiffeners (one each side of the web)
is sized or checked as follows (equations from memory of AISC 360-16/360-22):

- required stiffener force R_ust = R_u - phi R_n (LRFD) or R_a - R_n / Omega (ASD), the largest over the
  failing web limit states (J10.8: flange welds / bearing sized for the difference). For web sidesway
  buckling with the compression flange restrained against rotation (J10.4(a)) the stiffeners carry the full
  force (AISC 360-22 Commentary J10.4, from memory); J10.4(b) is remedied by lateral bracing at both
  flanges, not by stiffeners, so it adds nothing here.
- proportions, J10.8: b_s >= b_f/3 - t_w/2 (width of each stiffener plus half the web thickness at least a
  third of the loaded flange width), t_s >= t_f/2 and t_s >= b_s/16, and b_s/t_s <= 0.56 sqrt(E/F_yst)
  (Table B4.1a case 1, plates projecting from rolled I-shapes; used for welded girders too: common practice).
- column, J10.8 / J4.4: the two stiffeners with a strip of web 25 t_w long at interior stiffeners or 12 t_w
  at the member end (here: nearer the end than 12.5 t_w), effective length L_c = 0.75 h; P_n = F_y A_g
  when L_c/r <= 25 (Eq. J4-6), else Chapter E: F_e = pi^2 E / (L_c/r)^2 (E3-4),
  F_cr = 0.658^(F_y/F_e) F_y for L_c/r <= 4.71 sqrt(E/F_y) (E3-2), else 0.877 F_e (E3-3), P_n = F_cr A_g
  (E3-1); phi_c = 0.90, Omega_c = 1.67. The column carries the whole force at the location (the web strip
  is part of its cross section). The model assumes full-depth stiffeners.
- bearing of the fitted stiffener ends, J7: R_n = 1.8 F_y A_pb (Eq. J7-1) with A_pb = 2 (b_s - clip) t_s,
  the contact area net of the corner clips; phi = 0.75, Omega = 2.00; demand R_ust.
- tensile forces: J4.1 yielding of the stiffeners welded to the loaded flange, R_n = F_y A_st with
  A_st = 2 (b_s - clip) t_s; phi = 0.90, Omega = 1.67; demand R_ust.

Sizing (no pair given): b_s is the largest width that stays within the flange, (b_f - t_w)/2 rounded down
(1/4 in, or 5 mm), but not less than the J10.8 minimum; t_s is the thinnest plate of a common series (US:
1/4 in upward in 1/16-1/4 in steps; SI: 6, 8, 10, 12, 15, 20, ... mm) that satisfies every check; the clip
defaults to the larger of 3/4 in (20 mm) and the fillet or flange-to-web weld (common practice). The system
follows the section name (AISC designations such as W18X50: US), else SI. When no plate of the series
works the thickest is reported with its failing checks. Welds of the stiffeners to the web and flanges are
not designed here.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed engineer.
"""
from __future__ import annotations

import math
import re

from ...errors import InputError
from ...materials import steel as _steel
from ..results import CheckResult
from ._core import (FACTORS, STANDARD, Calc, Cond, Fm, _avail_formula, available, length_si, material,
                    parse_method, props, quantity_si, result)
from .concentrated import LS_WCB, LS_WSB, _check_kind, _flange, _k, stiffener_si

__all__ = ["stiffener_pair", "for_force", "pair_checks", "size_pair"]

_R = "AISC 360-22"
IN = 0.0254
FACTORS.setdefault("stc", (0.90, 1.67, "c", "J4.4"))
FACTORS.setdefault("stb", (0.75, 2.00, "", "J7"))
FACTORS.setdefault("stt", (0.90, 1.67, "", "J4.1"))
for _m in ("LRFD", "ASD"):
    _avail_formula(_m, "c", "P_n", "P_c", "force")
del _m

_D = {"b_s": "length", "t_s": "length", "c_l": "length", "b_s_min": "length", "t_s_min": "length",
      "l_w": "length", "A_g": "area", "A_pb": "area", "A_st": "area", "I_s": "inertia", "r_s": "length",
      "L_c": "length", "F_e": "stress", "P_n": "force", "P_c": "force", "R_ust": "force", "R_u": "force",
      "R_a": "force"}
_CLIP = {"c_l": "c_{l}"}
_IDS = re.compile(r"[A-Za-z_][A-Za-z0-9_]*")


def _dims(*texts: str) -> dict:
    """The entries of _D used by the texts (render.Formula rejects dimensions of unused symbols)."""
    used = {n for t in texts for n in _IDS.findall(t)}
    return {k: v for k, v in _D.items() if k in used}


def _F(symbol: str, expr: str, ref: str, label: str = "", **kw) -> Fm:
    return Fm(symbol, expr, ref, label, dims=_dims(symbol, expr), **kw)


def _C(expr: str, ref: str, then: str = "", otherwise: str = "") -> Cond:
    return Cond(expr, ref, then=then, otherwise=otherwise, dims=_dims(expr))


BS_MIN = _F("b_s_min", "b_f/3 - t_w/2", f"{_R} J10.8(1)", "minimum stiffener width")
TS_MIN = _F("t_s_min", "Max(t_f/2, b_s/16)", f"{_R} J10.8(2)", "minimum stiffener thickness")
LAM_R = _F("lam_r", "0.56*sqrt(E/F_yst)", f"{_R} Table B4.1a case 1", "width-to-thickness limit of the stiffener")
LAM_S = _F("lam_s", "b_s/t_s", f"{_R} B4.1", "stiffener width-to-thickness ratio")
AT_END = _C("x_end >= 12.5*t_w", f"{_R} J10.8", then="interior stiffener: web strip 25 tw",
              otherwise="stiffener at the member end: web strip 12 tw")
LW_INT = _F("l_w", "25*t_w", f"{_R} J10.8", "length of the web strip (interior)")
LW_END = _F("l_w", "12*t_w", f"{_R} J10.8", "length of the web strip (member end)")
A_G = _F("A_g", "2*b_s*t_s + l_w*t_w", f"{_R} J10.8", "area of the two stiffeners and the web strip")
I_S = _F("I_s", "t_s*(2*b_s + t_w)**3/12 + (l_w - t_s)*t_w**3/12", f"{_R} J10.8",
         "moment of inertia about the web mid-plane")
R_S = _F("r_s", "sqrt(I_s/A_g)", f"{_R} J10.8", "radius of gyration")
L_C = _F("L_c", "0.75*h", f"{_R} J10.8", "effective length of the stiffener column")
SLEND = _F("lam_c", "L_c/r_s", f"{_R} J4.4", "slenderness L_c/r")
SHORT = _C("lam_c <= 25", f"{_R} J4.4(a)", then="Lc/r <= 25: Pn = Fy Ag (Eq. J4-6)",
             otherwise="Lc/r > 25: Chapter E applies (J4.4(b))")
J4_6 = _F("P_n", "F_y*A_g", f"{_R} Eq. J4-6", "compressive strength, Lc/r <= 25")
E3_4 = _F("F_e", "pi**2*E/lam_c**2", f"{_R} Eq. E3-4", "elastic buckling stress")
E3_INEL = _C("lam_c <= 4.71*sqrt(E/F_y)", f"{_R} E3", then="inelastic buckling: Eq. E3-2",
               otherwise="elastic buckling: Eq. E3-3")
E3_2 = _F("F_cr", "0.658**(F_y/F_e)*F_y", f"{_R} Eq. E3-2", "critical stress, inelastic buckling")
E3_3 = _F("F_cr", "0.877*F_e", f"{_R} Eq. E3-3", "critical stress, elastic buckling")
E3_1 = _F("P_n", "F_cr*A_g", f"{_R} Eq. E3-1", "compressive strength (flexural buckling)")
A_PB = _F("A_pb", "2*(b_s - c_l)*t_s", f"{_R} J7", "bearing area of the fitted ends, net of the clips", latex=_CLIP)
J7_1 = _F("R_n", "1.8*F_yst*A_pb", f"{_R} Eq. J7-1", "bearing on the stiffener ends")
A_ST = _F("A_st", "2*(b_s - c_l)*t_s", f"{_R} J10.8", "area of the stiffeners at the flange weld, net of the clips", latex=_CLIP)
J4_1 = _F("R_n", "F_yst*A_st", f"{_R} Eq. J4-1", "tensile yielding of the stiffeners")
RUST_L = _F("R_ust", "R_u - R_c", f"{_R} J10.8", "required stiffener force")
RUST_A = _F("R_ust", "R_a - R_c", f"{_R} J10.8", "required stiffener force")

LS_PROP = "width and thickness (J10.8)"
LS_COL = "column strength"
LS_BRG = "bearing on the fitted ends"
LS_TEN = "tensile yielding"
WELD_NOTE = ("welds of the stiffeners to the web and to the loaded flange are not designed here (J10.8: flange "
             "welds for the difference Ru - phi Rn, web welds for the difference in force at the stiffener ends)")

#: plate thickness series (m) and width rounding (m) per unit system (common practice)
SERIES = {
    "US": (tuple(t * IN for t in (0.25, 0.3125, 0.375, 0.4375, 0.5, 0.5625, 0.625, 0.75, 0.875, 1.0, 1.125,
                                  1.25, 1.375, 1.5, 1.75, 2.0, 2.25, 2.5, 3.0)), 0.25 * IN, 0.75 * IN, 0.125 * IN),
    "SI": (tuple(t * 1e-3 for t in (6, 8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80)), 5e-3, 20e-3,
           5e-3),
}
_US_NAME = re.compile(r"^(W|M|S|HP|C|MC)\d", re.IGNORECASE)


def _system(p, system) -> str:
    if system is None:
        return "US" if _US_NAME.match(p.name or "") else "SI"
    s = str(system).upper()
    if s not in SERIES:
        raise InputError(f"system: got {system!r}; expected 'US', 'SI' or None (from the section name)")
    return s


def default_clip(p, system: str) -> float:
    """Corner clip: max(3/4 in or 20 mm, fillet r / weld leg), rounded up (common practice)."""
    _, _, cmin, inc = SERIES[system]
    return max(cmin, math.ceil(_k(p) / inc - 1e-9) * inc)


def _fy_st(grade, t: float, Fy_web: float) -> float:
    return Fy_web if grade is None else _steel(grade).fy_si(t)


def pair_checks(p, mat, Pu, Rust, x_end, tf, bf, method, calc, bs, ts, clip, *, tension=False, grade=None,
                location=None, label="", combination="", note="") -> tuple[CheckResult, ...]:
    """Checks of a given stiffener pair on SI floats (internal); see the module docstring."""
    E, tw, h = mat.E, p.tw, p.h_clear
    Fst = _fy_st(grade, ts, mat.Fy)
    sname = mat.name if grade is None else _steel(grade).name
    head = "Stiffener pair" if tension else "Bearing stiffener pair"
    if label:
        head += f" ({label})"
    sym_u = "R_u" if method == "LRFD" else "R_a"
    base = {"b_s": bs, "t_s": ts, "clip": clip, "R_ust": Rust, "Fy_st": Fst}
    kw = dict(method=method, location=location, combination=combination)
    out = []
    # proportions
    calc.given("b_s", bs, "length", reference="width of each stiffener")
    calc.given("t_s", ts, "length", reference="thickness of each stiffener")
    calc.given("F_yst", Fst, "stress", reference=f"specified minimum yield stress of the stiffeners, {sname}")
    bmin = calc(BS_MIN, b_f=bf, t_w=tw)
    tmin = calc(TS_MIN, t_f=tf, b_s=bs)
    lr = calc(LAM_R, E=E, F_yst=Fst)
    lam = calc(LAM_S, b_s=bs, t_s=ts)
    worst = max(bmin / bs, tmin / ts, lam / lr)
    pn = "ratio shown is max(b_s,min / b_s, t_s,min / t_s, (b_s/t_s) / lam_r)"
    out.append(result(limit_state=f"{head}: {LS_PROP}", clause=f"{STANDARD} J10.8", dim="dimensionless",
                      capacity=1.0, steps=calc.take(), data={**base, "b_s_min": bmin, "t_s_min": tmin,
                                                             "bt": lam, "bt_max": lr, "normalised": worst},
                      note="; ".join(n for n in (pn, note) if n), demand=worst, **kw))
    # stiffeners in tension: J4.1 yielding
    if tension:
        calc.given("c_l", clip, "length", reference="corner clip of each stiffener (clears the fillet or weld)")
        Ast = calc(A_ST, b_s=bs, c_l=clip, t_s=ts)
        Rn = calc(J4_1, F_yst=Fst, A_st=Ast)
        cap = available(calc, "stt", method, Rn, "R_n", "R_c", "force")
        calc.given("R_ust", Rust, "force", reference="required stiffener force (J10.8)")
        out.append(result(limit_state=f"{head}: {LS_TEN}", clause=f"{STANDARD} J10.8, J4.1(a)", dim="force",
                          capacity=cap, nominal=Rn, steps=calc.take(), data={**base, "A_st": Ast},
                          note=WELD_NOTE, demand=Rust, **kw))
        return tuple(out)
    # column
    Fy = min(mat.Fy, Fst)
    calc.given("F_y", Fy, "stress", reference="the lower of the web and stiffener yield stresses")
    calc.given("t_w", tw, "length", reference="web thickness")
    calc.given("h", h, "length", reference="clear distance between flanges less the fillets (rolled) or between "
               "flanges (welded)")
    lw = calc(LW_INT, t_w=tw) if calc.cond(AT_END, x_end=x_end, t_w=tw) else calc(LW_END, t_w=tw)
    Ag = calc(A_G, b_s=bs, t_s=ts, l_w=lw, t_w=tw)
    Is = calc(I_S, t_s=ts, b_s=bs, t_w=tw, l_w=lw)
    rs = calc(R_S, I_s=Is, A_g=Ag)
    Lc = calc(L_C, h=h)
    lc = calc(SLEND, L_c=Lc, r_s=rs)
    if calc.cond(SHORT, lam_c=lc):
        Pn, cl, Fcr = calc(J4_6, F_y=Fy, A_g=Ag), "J10.8, J4.4(a)", None
    else:
        Fe = calc(E3_4, E=E, lam_c=lc)
        if calc.cond(E3_INEL, lam_c=lc, E=E, F_y=Fy):
            Fcr = calc(E3_2, F_y=Fy, F_e=Fe)
        else:
            Fcr = calc(E3_3, F_e=Fe)
        Pn, cl = calc(E3_1, F_cr=Fcr, A_g=Ag), "J10.8, J4.4(b), E3"
    cap = available(calc, "stc", method, Pn, "P_n", "P_c", "force")
    calc.given(sym_u, Pu, "force", reference="required strength at the force (the column carries all of it)"
               + (f" ({combination})" if combination else ""))
    out.append(result(limit_state=f"{head}: {LS_COL}", clause=f"{STANDARD} {cl}", dim="force", capacity=cap,
                      nominal=Pn, steps=calc.take(),
                      data={**base, "l_w": lw, "A_g": Ag, "I_s": Is, "r_s": rs, "L_c": Lc, "Lc_r": lc,
                            "Fcr": Fcr, "full_depth": True},
                      note="full-depth stiffener pair assumed (L_c = 0.75 h); " + WELD_NOTE, demand=Pu, **kw))
    # bearing of the fitted ends
    calc.given("c_l", clip, "length", reference="corner clip of each stiffener (clears the fillet or weld)")
    Apb = calc(A_PB, b_s=bs, c_l=clip, t_s=ts)
    Rn = calc(J7_1, F_yst=Fst, A_pb=Apb)
    cap = available(calc, "stb", method, Rn, "R_n", "R_c", "force")
    calc.given("R_ust", Rust, "force", reference="required stiffener force (J10.8)")
    out.append(result(limit_state=f"{head}: {LS_BRG}", clause=f"{STANDARD} J10.8, J7", dim="force", capacity=cap,
                      nominal=Rn, steps=calc.take(), data={**base, "A_pb": Apb}, demand=Rust, **kw))
    return tuple(out)


def size_pair(p, mat, Pu, Rust, x_end, tf, bf, method, *, tension=False, grade=None, system=None,
              clip=None) -> tuple[float, float, float, bool]:
    """(b_s, t_s, clip, found) of the lightest pair of the plate series that passes every check."""
    sysname = _system(p, system)
    series, inc, _, _ = SERIES[sysname]
    tw = p.tw
    c = default_clip(p, sysname) if clip is None else clip
    bmax = 0.5 * (bf - tw)
    bmin = bf / 3.0 - 0.5 * tw
    bs = math.floor(bmax / inc + 1e-9) * inc
    if bs < bmin:
        bs = math.ceil(bmin / inc - 1e-9) * inc
    if bs <= c:
        bs = c + inc
    fast = Calc(False)
    for ts in series:
        Fst = _fy_st(grade, ts, mat.Fy)
        if ts < max(0.5 * tf, bs / 16.0) * (1 - 1e-9) or bs / ts > 0.56 * math.sqrt(mat.E / Fst) * (1 + 1e-9):
            continue  # J10.8(2) / Table B4.1a not met: cannot pass
        rs = pair_checks(p, mat, Pu, Rust, x_end, tf, bf, method, fast, bs, ts, c, tension=tension, grade=grade)
        if all(r.passed for r in rs):
            return bs, ts, c, True
    return bs, series[-1], c, False


def for_force(p, mat, checks, Ru, x_end, tf, bf, method, calc, *, tension=False, stiffener=None, location=None,
              label="", combination="", flange="top", grade=None, system=None) -> tuple[CheckResult, ...]:
    """Stiffener pair for one force whose J10 ``checks`` are given (internal; used by ``forces``).

    Nothing when every check passes and no pair is given, or when only J10.4(b) fails (lateral bracing of
    both flanges is the remedy; its note says so).
    """
    failing = [r for r in checks if r.passed is False]
    parts = []
    for r in failing:
        if r.limit_state.endswith(LS_WSB.split(": ")[1]):
            if r.data.get("rotation") == "free":
                continue
            parts.append(r.demand)  # full force (Commentary J10.4)
        else:
            parts.append(r.demand - r.capacity)
    if not parts and stiffener is None:
        return ()
    Rust = max([0.0, *parts])
    Pu = max([abs(Ru), *(r.demand for r in checks if r.demand is not None)])
    notes = []
    if any(r.limit_state.endswith(LS_WCB.split(": ")[1]) for r in failing):
        notes.append("web compression buckling governs: the stiffeners must extend the full depth (J10.5, J10.8)")
    else:
        notes.append("stiffeners shall extend at least one-half the member depth (J10.8); full depth at unframed "
                     "member ends (J10.7)")
    if stiffener is None:
        bs, ts, clip, found = size_pair(p, mat, Pu, Rust, x_end, tf, bf, method, tension=tension, grade=grade,
                                        system=system)
        notes.insert(0, "pair sized: lightest plate of the series that passes" if found else
                     "no plate of the series passes: the thickest is shown; revise the section or the detail")
    else:
        bs, ts, clip = stiffener
        if clip is None:
            clip = default_clip(p, _system(p, system))
        notes.insert(0, "stiffener pair as given")
    return pair_checks(p, mat, Pu, Rust, x_end, tf, bf, method, calc, bs, ts, clip, tension=tension, grade=grade,
                       location=location, label=label, combination=combination, note="; ".join(notes))


def stiffener_pair(section, steel, Ru, x_end=None, method: str = "LRFD", *, Rust=None, flange: str = "top",
                   tension: bool = False, stiffener=None, stiffener_steel=None, system: str | None = None,
                   steps: bool = True) -> tuple[CheckResult, ...]:
    """Size (or check, with ``stiffener=(b_s, t_s[, clip])``) a stiffener pair at a concentrated force.

    ``Ru``: required strength at the location (the column carries all of it); ``Rust``: required stiffener
    force R_u - phi R_n of the governing web limit state (None: Ru, i.e. the web's own strength ignored);
    ``x_end``: distance from the member end (None: interior); ``flange``: the loaded flange (its b_f and t_f
    set the J10.8 minimum sizes); ``tension``: stiffeners for a tensile force (J4.1); ``stiffener_steel``:
    grade of the plates (None: the member's); ``system``: "US" / "SI" plate series (None: from the section
    name). Returns the proportion check and the column (J4.4 / E3) and bearing (J7) checks, or the tensile
    yielding check (J4.1). See :mod:`calckit.design.aisc360.stiffeners` for the equations.
    """
    m = parse_method(method)
    p = props(section)
    _check_kind(p)
    mat = material(steel, p)
    if flange not in ("top", "bottom"):
        raise InputError(f"flange: got {flange!r}; expected 'top' or 'bottom' (the loaded flange)")
    R = abs(quantity_si(Ru, "force", "Ru"))
    Rs = R if Rust is None else quantity_si(Rust, "force", "Rust")
    if Rs < 0:
        raise InputError(f"Rust: got {Rs:.6g} N; expected a required stiffener force >= 0")
    xe = math.inf if x_end is None else length_si(x_end, "x_end", dim="length")
    if stiffener_steel is not None:
        _steel(stiffener_steel)  # validates the grade name
    _system(p, system)
    tf, bf = _flange(p, flange)
    st = stiffener_si(stiffener)
    calc = Calc(steps)
    if st is None:
        bs, ts, clip, found = size_pair(p, mat, R, Rs, xe, tf, bf, m, tension=tension, grade=stiffener_steel,
                                        system=system)
        note = ("pair sized: lightest plate of the series that passes" if found else
                "no plate of the series passes: the thickest is shown; revise the section or the detail")
    else:
        bs, ts, clip = st
        clip = default_clip(p, _system(p, system)) if clip is None else clip
        note = "stiffener pair as given"
    return pair_checks(p, mat, R, Rs, xe, tf, bf, m, calc, bs, ts, clip, tension=tension, grade=stiffener_steel,
                       note=note)
