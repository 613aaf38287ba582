"""Flanges and webs with concentrated forces, AISC 360-22 J10.1-J10.3 (I-shapes and channels).

Equations (AISC 360-16/360-22 numbering, from memory):

- J10.1 flange local bending (tensile forces only): Rn = 6.25 Fyf tf^2 (J10-1), halved when the force is
  within 10 tf of the member end; not checked when the loaded width across the flange is < 0.15 bf;
  phi = 0.90, Omega = 1.67.
- J10.2 web local yielding: Rn = Fyw tw (5 k + lb) when the force is applied farther than d from the
  member end (J10-2), else Rn = Fyw tw (2.5 k + lb) (J10-3); phi = 1.00, Omega = 1.50.
- J10.3 web crippling (compressive forces): at a distance >= d/2 from the end
  Rn = 0.80 tw^2 [1 + 3 (lb/d)(tw/tf)^1.5] sqrt(E Fyw tf/tw) Qf (J10-4); nearer the end,
  Rn = 0.40 tw^2 [1 + 3 (lb/d)(tw/tf)^1.5] sqrt(E Fyw tf/tw) Qf for lb/d <= 0.2 (J10-5a) and
  Rn = 0.40 tw^2 [1 + (4 lb/d - 0.2)(tw/tf)^1.5] sqrt(E Fyw tf/tw) Qf for lb/d > 0.2 (J10-5b);
  Qf = 1.0 for wide-flange sections; phi = 0.75, Omega = 2.00.

k is the distance from the outer face of the flange to the web toe of the fillet: tf + r for rolled
shapes (k_des), tf + the flange-to-web weld leg for welded girders (tf when no weld is given). When the
required strength exceeds the available strength, bearing stiffeners (J10.8) or a longer bearing are
needed; the result says so in its note. Web sidesway buckling (J10.4) and web compression buckling
(J10.5) are not checked.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ...errors import InputError
from ..results import CheckResult
from ._core import (STANDARD, Calc, Cond, Fm, available, kind_word, length_si, material, not_covered,
                    parse_method, props, quantity_si, result)

__all__ = ["Bearing", "bearing", "concentrated", "web_local_yielding", "web_crippling",
           "flange_local_bending"]

_R = "AISC 360-22"

J10_1 = Fm("R_n", "6.25*F_yf*t_f**2", f"{_R} Eq. J10-1", "flange local bending")
J10_1H = Fm("R_n", "0.5*R_n0", f"{_R} J10.1", "flange local bending, force within 10 tf of the member end")
END10 = Cond("x_end >= 10*t_f", f"{_R} J10.1", then="no reduction", otherwise="force within 10 tf of the "
             "member end: Rn reduced by 50%")
END_D = Cond("x_end > d", f"{_R} J10.2", then="force farther than d from the member end: Eq. J10-2",
             otherwise="force within d of the member end: Eq. J10-3")
J10_2 = Fm("R_n", "F_yw*t_w*(5*k + l_b)", f"{_R} Eq. J10-2", "web local yielding")
J10_3 = Fm("R_n", "F_yw*t_w*(2.5*k + l_b)", f"{_R} Eq. J10-3", "web local yielding near the member end")
END_D2 = Cond("x_end >= d/2", f"{_R} J10.3", then="force at least d/2 from the member end: Eq. J10-4",
              otherwise="force within d/2 of the member end: Eq. J10-5")
LBD = Cond("l_b/d <= 0.2", f"{_R} J10.3(b)", then="Eq. J10-5a", otherwise="Eq. J10-5b")
J10_4 = Fm("R_n", "0.80*t_w**2*(1 + 3*(l_b/d)*(t_w/t_f)**1.5)*sqrt(E*F_yw*t_f/t_w)*Q_f", f"{_R} Eq. J10-4",
           "web crippling")
J10_5A = Fm("R_n", "0.40*t_w**2*(1 + 3*(l_b/d)*(t_w/t_f)**1.5)*sqrt(E*F_yw*t_f/t_w)*Q_f", f"{_R} Eq. J10-5a",
            "web crippling near the member end, lb/d <= 0.2")
J10_5B = Fm("R_n", "0.40*t_w**2*(1 + (4*l_b/d - 0.2)*(t_w/t_f)**1.5)*sqrt(E*F_yw*t_f/t_w)*Q_f",
            f"{_R} Eq. J10-5b", "web crippling near the member end, lb/d > 0.2")

LS_FLB = "Concentrated force: flange local bending"
LS_WLY = "Concentrated force: web local yielding"
LS_WCR = "Concentrated force: web crippling"
STIFF_NOTE = ("bearing stiffeners are required (AISC 360-22 J10.8), or increase the bearing length lb")


@dataclass(frozen=True)
class Bearing:
    """A concentrated force or reaction on the member (SI floats).

    x : position along the member (m).
    lb : bearing length along the member (m); 0 for a knife-edge load (conservative).
    P : force (N), magnitude; None to take it from the analysis (reaction or the jump of V at x).
    x_end : distance from the member end (m); None to compute it from x and the member length.
    tension : the force pulls the flange away from the web (hanger): J10.1 and J10.2 apply, J10.3 not.
    flange : "top" or "bottom": the loaded flange; None: bottom at supports, top elsewhere.
    width : loaded width across the flange (m) for J10.1; None: not limited.
    name : label for the calc ("R1", "P at midspan").
    """

    x: float
    lb: float = 0.0
    P: float | None = None
    x_end: float | None = None
    tension: bool = False
    flange: str | None = None
    width: float | None = None
    name: str = ""


def bearing(x, lb=0, P=None, *, x_end=None, tension: bool = False, flange: str | None = None, width=None,
            name: str = "") -> Bearing:
    """A :class:`Bearing` from quantities or strings, e.g. ``bearing("0 ft", lb="4 in", name="R1")``."""
    xs = length_si(x, "x", dim="span")
    lbs = length_si(lb, "lb", dim="length")
    Ps = None if P is None else abs(quantity_si(P, "force", "P"))
    xe = None if x_end is None else length_si(x_end, "x_end", dim="length")
    w = None if width is None else length_si(width, "width", allow_zero=False, dim="length")
    if flange not in (None, "top", "bottom"):
        raise InputError(f"flange: got {flange!r}; expected 'top', 'bottom' or None")
    return Bearing(xs, lbs, Ps, xe, bool(tension), flange, w, name)


def _k(p) -> float:
    return (p.r if p.kind in ("I_rolled", "channel") else p.weld)


def _check_kind(p) -> None:
    if p.kind not in ("I_rolled", "I_welded", "channel"):
        raise not_covered(f"concentrated forces on a {kind_word(p)}", "J10 (HSS: Chapter K)")


def _finish(ls, clause, Rn, cap, method, calc, data, Ru, note_extra="", location=None, label="",
            combination="") -> CheckResult:
    note = note_extra
    if Ru is not None and calc.on:
        calc.given("R_u" if method == "LRFD" else "R_a", abs(Ru), "force",
                   reference="required strength, concentrated force" + (f" ({combination})" if combination else ""))
    if Ru is not None and not abs(Ru) <= cap * (1.0 + 1e-9):
        note = "; ".join(n for n in (note_extra, STIFF_NOTE) if n)
    if label:
        ls = ls.replace("Concentrated force", f"Concentrated force ({label})")
    return result(limit_state=ls, clause=f"{STANDARD} {clause}", dim="force", capacity=cap, nominal=Rn,
                  method=method, location=location, combination=combination, steps=calc.take(), data=data,
                  note=note, demand=Ru)


def wly(p, mat, lb, x_end, tf, k, method, calc, Ru=None, location=None, **kw) -> CheckResult:
    """J10.2 on SI floats (internal)."""
    Fy, d, tw = mat.Fy, p.d, p.tw
    calc.given("F_yw", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
    calc.given("k", k, "length", reference="outer face of the flange to the web toe of the fillet (k = tf + r "
               "or tf + weld leg)")
    if calc.cond(END_D, x_end=x_end, d=d):
        Rn, cl = calc(J10_2, F_yw=Fy, t_w=tw, k=k, l_b=lb), "J10.2(a)"
    else:
        Rn, cl = calc(J10_3, F_yw=Fy, t_w=tw, k=k, l_b=lb), "J10.2(b)"
    cap = available(calc, "wly", method, Rn, "R_n", "R_c", "force")
    data = {"lb": lb, "x_end": x_end, "k": k, **({"phi": 1.00} if method == "LRFD" else {"Omega": 1.50})}
    return _finish(LS_WLY, cl, Rn, cap, method, calc, data, Ru, location=location, **kw)


def wcr(p, mat, lb, x_end, tf, method, calc, Ru=None, location=None, **kw) -> CheckResult:
    """J10.3 on SI floats (internal)."""
    Fy, E, d, tw = mat.Fy, mat.E, p.d, p.tw
    calc.given("F_yw", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
    calc.given("E", E, "stress", reference=f"{_R} modulus of elasticity")
    Qf = calc.given("Q_f", 1.0, reference=f"{_R} J10.3: Qf = 1.0 for wide-flange sections")
    args = dict(t_w=tw, l_b=lb, d=d, t_f=tf, E=E, F_yw=Fy, Q_f=Qf)
    if calc.cond(END_D2, x_end=x_end, d=d):
        Rn, cl = calc(J10_4, **args), "J10.3(a)"
    elif calc.cond(LBD, l_b=lb, d=d):
        Rn, cl = calc(J10_5A, **args), "J10.3(b)"
    else:
        Rn, cl = calc(J10_5B, **args), "J10.3(b)"
    cap = available(calc, "wcr", method, Rn, "R_n", "R_c", "force")
    data = {"lb": lb, "x_end": x_end, "lb_d": lb / d, **({"phi": 0.75} if method == "LRFD" else {"Omega": 2.00})}
    return _finish(LS_WCR, cl, Rn, cap, method, calc, data, Ru, location=location, **kw)


def flb(p, mat, x_end, tf, bf, method, calc, Ru=None, width=None, location=None, **kw) -> CheckResult | None:
    """J10.1 on SI floats (internal); None when the loaded width is < 0.15 bf (not checked)."""
    if width is not None and width < 0.15 * bf:
        return None
    Fy = mat.Fy
    calc.given("F_yf", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
    R0 = calc(J10_1, F_yf=Fy, t_f=tf)
    if calc.cond(END10, x_end=x_end, t_f=tf):
        Rn = R0
    else:
        Rn = calc(J10_1H, R_n0=R0)
    cap = available(calc, "flb", method, Rn, "R_n", "R_c", "force")
    data = {"x_end": x_end, **({"phi": 0.90} if method == "LRFD" else {"Omega": 1.67})}
    return _finish(LS_FLB, "J10.1", Rn, cap, method, calc, data, Ru, location=location, **kw)


def _flange(p, flange: str):
    if flange == "top":
        return p.tf_top, p.bf_top
    return p.tf_bot, p.bf_bot


def _common(section, steel, lb, x_end, method, flange, Ru):
    m = parse_method(method)
    p = props(section)
    _check_kind(p)
    mat = material(steel, p)
    lbs = length_si(lb, "lb", dim="length")
    xe = math.inf if x_end is None else length_si(x_end, "x_end", dim="length")
    if flange not in ("top", "bottom"):
        raise InputError(f"flange: got {flange!r}; expected 'top' or 'bottom' (the loaded flange)")
    R = None if Ru is None else abs(quantity_si(Ru, "force", "Ru"))
    return m, p, mat, lbs, xe, R


def web_local_yielding(section, steel, lb, x_end=None, method: str = "LRFD", *, flange: str = "top",
                       Ru=None, steps: bool = True) -> CheckResult:
    """Web local yielding, AISC 360-22 J10.2. ``x_end``: distance from the member end (None: far away)."""
    m, p, mat, lbs, xe, R = _common(section, steel, lb, x_end, method, flange, Ru)
    tf, _ = _flange(p, flange)
    return wly(p, mat, lbs, xe, tf, tf + _k(p), m, Calc(steps), R)


def web_crippling(section, steel, lb, x_end=None, method: str = "LRFD", *, flange: str = "top", Ru=None,
                  steps: bool = True) -> CheckResult:
    """Web crippling, AISC 360-22 J10.3 (compressive forces)."""
    m, p, mat, lbs, xe, R = _common(section, steel, lb, x_end, method, flange, Ru)
    tf, _ = _flange(p, flange)
    return wcr(p, mat, lbs, xe, tf, m, Calc(steps), R)


def flange_local_bending(section, steel, x_end=None, method: str = "LRFD", *, flange: str = "bottom",
                         Ru=None, width=None, steps: bool = True) -> CheckResult | None:
    """Flange local bending, AISC 360-22 J10.1 (tensile forces); None when width < 0.15 bf."""
    m, p, mat, _, xe, R = _common(section, steel, 0, x_end, method, flange, Ru)
    tf, bf = _flange(p, flange)
    w = None if width is None else length_si(width, "width", allow_zero=False, dim="length")
    return flb(p, mat, xe, tf, bf, m, Calc(steps), R, width=w)


def concentrated(section, steel, lb=0, x_end=None, method: str = "LRFD", *, Ru=None, tension: bool = False,
                 flange: str = "top", width=None, steps: bool = True) -> tuple[CheckResult, ...]:
    """All J10 checks that apply to one concentrated force.

    Compressive force (bearing load or reaction): web local yielding (J10.2) and web crippling (J10.3).
    Tensile force (``tension=True``): flange local bending (J10.1) and web local yielding (J10.2).
    ``x_end`` is the distance from the member end (None: farther than d); ``flange`` the loaded flange.
    A failing check carries the note that bearing stiffeners are required.
    """
    m, p, mat, lbs, xe, R = _common(section, steel, lb, x_end, method, flange, Ru)
    tf, bf = _flange(p, flange)
    w = None if width is None else length_si(width, "width", allow_zero=False, dim="length")
    return forces(p, mat, lbs, xe, tf, bf, m, Calc(steps), R, tension=tension, width=w)


def forces(p, mat, lb, x_end, tf, bf, method, calc, Ru=None, *, tension=False, width=None, location=None,
           label: str = "", combination: str = "", note_extra: str = "") -> tuple[CheckResult, ...]:
    """J10 checks for one force on SI floats (internal)."""
    k = tf + _k(p)
    kw = dict(label=label, combination=combination, note_extra=note_extra)
    out = []
    if tension:
        r = flb(p, mat, x_end, tf, bf, method, calc, Ru, width=width, location=location, **kw)
        if r is not None:
            out.append(r)
    out.append(wly(p, mat, lb, x_end, tf, k, method, calc, Ru, location=location, **kw))
    if not tension:
        out.append(wcr(p, mat, lb, x_end, tf, method, calc, Ru, location=location, **kw))
    return tuple(out)
