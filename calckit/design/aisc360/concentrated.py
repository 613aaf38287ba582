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
needed; the result says so in its note.

- J10.4 web sidesway buckling (compressive single forces where the relative lateral movement between the
  loaded compression flange and the tension flange is not restrained at the load), with
  lam = (h/tw)/(Lb/bf): (a) compression flange restrained against rotation, lam <= 2.3:
  Rn = Cr tw^3 tf / h^2 [1 + 0.4 lam^3] (J10-6); (b) not restrained against rotation, lam <= 1.7:
  Rn = Cr tw^3 tf / h^2 [0.4 lam^3] (J10-7); above the limits the limit state does not apply.
  Cr = 960,000 ksi (6.62e6 MPa) when Mu < My (LRFD) or 1.5 Ma < My (ASD) at the load, else 480,000 ksi
  (3.31e6 MPa); Lb is the largest laterally unbraced length along either flange at the load;
  phi = 0.85, Omega = 1.76.
- Web compression buckling (a pair of compressive single forces on both flanges at one location):
  Rn = 24 tw^3 sqrt(E Fyw) Qf / h (J10-8), halved when the pair is nearer the member end than d/2;
  phi = 0.90, Omega = 1.67. AISC 360-16 numbers this section J10.5 and the clause label here follows that
  numbering (from memory; confirm the section number against the 2022 edition).

h for J10.4/J10.5 is the clear distance between flanges less the fillets for rolled shapes (d - 2k) and
the clear distance between flanges for welded girders (``SectionProps.h_clear``). Stiffener pairs for a
failing force (J10.8, J4.4 / Chapter E, J7) are sized in :mod:`.stiffeners`.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ...errors import InputError
from ..results import CheckResult
from ._core import (FACTORS, STANDARD, Calc, Cond, Fm, available, kind_word, length_si, material,
                    not_covered, parse_method, props, quantity_si, result)

__all__ = ["Bearing", "bearing", "concentrated", "web_local_yielding", "web_crippling",
           "flange_local_bending", "web_sidesway_buckling", "web_compression_buckling"]

# resistance factors of the clauses added here (AISC 360-22 J10.4 and J10.5, from memory)
FACTORS.setdefault("wsb", (0.85, 1.76, "", "J10.4"))
FACTORS.setdefault("wcb", (0.90, 1.67, "", "J10.5"))

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

# ------------------------------------------------------------------ J10.4 web sidesway buckling
KSI = 6894757.293168361  #: Pa per ksi
CR_LOW_MOMENT = 960_000.0 * KSI  #: Cr when Mu < My (AISC 360-22 J10.4: 960,000 ksi, 6.62e6 MPa)
CR_HIGH_MOMENT = 480_000.0 * KSI  #: Cr when Mu >= My (480,000 ksi, 3.31e6 MPa)
LAM_SW = Fm("lam_sw", "(h/t_w)/(L_b/b_f)", f"{_R} J10.4",
            "(h/tw)/(Lb/bf): web slenderness over unbraced length per flange width")
SW_A = Cond("lam_sw <= 2.3", f"{_R} J10.4(a)", then="compression flange restrained against rotation: Eq. J10-6",
            otherwise="(h/tw)/(Lb/bf) > 2.3: the limit state of web sidesway buckling does not apply")
SW_B = Cond("lam_sw <= 1.7", f"{_R} J10.4(b)", then="compression flange not restrained against rotation: "
            "Eq. J10-7", otherwise="(h/tw)/(Lb/bf) > 1.7: the limit state of web sidesway buckling does not apply")
MY = Fm("M_y", "F_y*S_x", f"{_R} J10.4", "yield moment at the location of the force")
CR_LRFD = Cond("M_u < M_y", f"{_R} J10.4", then="Cr = 960,000 ksi (6.62e6 MPa)",
               otherwise="Mu >= My: Cr = 480,000 ksi (3.31e6 MPa)")
CR_ASD = Cond("1.5*M_a < M_y", f"{_R} J10.4", then="Cr = 960,000 ksi (6.62e6 MPa)",
              otherwise="1.5 Ma >= My: Cr = 480,000 ksi (3.31e6 MPa)")
J10_6 = Fm("R_n", "C_r*t_w**3*t_f/h**2*(1 + 0.4*lam_sw**3)", f"{_R} Eq. J10-6",
           "web sidesway buckling, compression flange restrained against rotation", dims={"C_r": "stress"})
J10_7 = Fm("R_n", "C_r*t_w**3*t_f/h**2*(0.4*lam_sw**3)", f"{_R} Eq. J10-7",
           "web sidesway buckling, compression flange not restrained against rotation", dims={"C_r": "stress"})
# -------------------------------------------------------------- web compression buckling (J10-8)
J10_8 = Fm("R_n", "24*t_w**3*sqrt(E*F_yw)*Q_f/h", f"{_R} Eq. J10-8", "web compression buckling")
J10_8H = Fm("R_n", "0.5*R_n0", f"{_R} J10.5", "web compression buckling, pair within d/2 of the member end")
END_WCB = Cond("x_end >= d/2", f"{_R} J10.5", then="no reduction",
               otherwise="pair of forces within d/2 of the member end: Rn reduced by 50%")

ROTATION = ("restrained", "free")

LS_WSB = "Concentrated force: web sidesway buckling"
LS_WCB = "Concentrated force: web compression buckling"
WSB_NOTE_A = ("provide local lateral bracing at the tension flange, or a pair of transverse stiffeners or a "
              "doubler plate (AISC 360-22 J10.4(a))")
WSB_NOTE_B = "provide local lateral bracing at both flanges at the load (AISC 360-22 J10.4(b))"
WCB_NOTE = ("a full-depth pair of transverse stiffeners or a doubler plate is required (AISC 360-22 J10.5, "
            "J10.8)")

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
    sidesway : None (default): the relative lateral movement between the loaded flange and the other
        flange is restrained at the force, J10.4 is not checked; "restrained": not restrained against that
        movement, loaded (compression) flange restrained against rotation (J10.4(a), Eq. J10-6); "free":
        loaded flange not restrained against rotation either (J10.4(b), Eq. J10-7).
    Lb : largest laterally unbraced length along either flange at the force (m) for J10.4; None: from the
        member's bracing.
    M : |moment| at the force (N*m) for Cr of J10.4 (Mu or Ma of the method); None: the largest |M| of the
        unbraced segment in a member check (conservative), Cr = 480,000 ksi in a single check.
    opposite : a compressive force on the other flange at the same location (J10.5 web compression
        buckling): True for an equal force, or its magnitude (N); None: none. The check uses the larger of
        the two forces (conservative).
    stiffener : a given stiffener pair (b_s, t_s) or (b_s, t_s, clip) in m to check when a J10 check fails;
        None: the pair is sized.
    """

    x: float
    lb: float = 0.0
    P: float | None = None
    x_end: float | None = None
    tension: bool = False
    flange: str | None = None
    width: float | None = None
    name: str = ""
    sidesway: str | None = None
    Lb: float | None = None
    M: float | None = None
    opposite: float | bool | None = None
    stiffener: tuple | None = None


def _rotation(v, name: str = "sidesway"):
    if v is None or v in ROTATION:
        return v
    raise InputError(f"{name}: got {v!r}; expected None (relative lateral movement of the flanges restrained), "
                     "'restrained' (loaded flange restrained against rotation) or 'free' (not restrained)")


def _opposite(v):
    if v is None or v is False:
        return None
    if v is True:
        return True
    return abs(quantity_si(v, "force", "opposite"))


def stiffener_si(v, name: str = "stiffener") -> tuple | None:
    """(b_s, t_s, clip or None) in m from a tuple of lengths; None passes through."""
    if v is None:
        return None
    if not isinstance(v, (tuple, list)) or len(v) not in (2, 3):
        raise InputError(f"{name}: got {v!r}; expected (b_s, t_s) or (b_s, t_s, clip), e.g. ('4 in', '0.5 in')")
    bs = length_si(v[0], f"{name} b_s", allow_zero=False, dim="length")
    ts = length_si(v[1], f"{name} t_s", allow_zero=False, dim="length")
    cl = length_si(v[2], f"{name} clip", dim="length") if len(v) == 3 and v[2] is not None else None
    if cl is not None and cl >= bs:
        raise InputError(f"{name} clip: got {cl:.6g} m; expected a clip smaller than the width b_s = {bs:.6g} m")
    return (bs, ts, cl)


def bearing(x, lb=0, P=None, *, x_end=None, tension: bool = False, flange: str | None = None, width=None,
            name: str = "", sidesway: str | None = None, Lb=None, M=None, opposite=None,
            stiffener=None) -> Bearing:
    """A :class:`Bearing` from quantities or strings, e.g. ``bearing("0 ft", lb="4 in", name="R1")``.

    ``sidesway``, ``Lb``, ``M``: J10.4 inputs; ``opposite``: J10.5 pair; ``stiffener``: a given pair
    (see :class:`Bearing`).
    """
    xs = length_si(x, "x", dim="span")
    lbs = length_si(lb, "lb", dim="length")
    Ps = None if P is None else abs(quantity_si(P, "force", "P"))
    xe = None if x_end is None else length_si(x_end, "x_end", dim="length")
    w = None if width is None else length_si(width, "width", allow_zero=False, dim="length")
    if flange not in (None, "top", "bottom"):
        raise InputError(f"flange: got {flange!r}; expected 'top', 'bottom' or None")
    sw = _rotation(sidesway)
    Lbs = None if Lb is None else length_si(Lb, "Lb", dim="span")
    Ms = None if M is None else abs(quantity_si(M, "moment", "M"))
    op = _opposite(opposite)
    if tension and (sw is not None or op is not None):
        raise InputError("tension: got tension=True with sidesway/opposite; J10.4 and J10.5 apply to "
                         "compressive forces only")
    return Bearing(xs, lbs, Ps, xe, bool(tension), flange, w, name, sw, Lbs, Ms, op, stiffener_si(stiffener))


def _k(p) -> float:
    return (p.r if p.kind in ("I_rolled", "channel") else p.weld)


def _check_kind(p) -> None:
    if p.kind not in ("I_rolled", "I_welded", "channel"):
        raise not_covered(f"concentrated forces on a {kind_word(p)}", "J10 (HSS: Chapter K)")


def _finish(ls, clause, Rn, cap, method, calc, data, Ru, note_extra="", location=None, label="",
            combination="", fail_note=STIFF_NOTE, ru_ref="required strength, concentrated force") -> CheckResult:
    note = note_extra
    if Ru is not None and calc.on:
        calc.given("R_u" if method == "LRFD" else "R_a", abs(Ru), "force",
                   reference=ru_ref + (f" ({combination})" if combination else ""))
    if Ru is not None and not abs(Ru) <= cap * (1.0 + 1e-9):
        note = "; ".join(n for n in (note_extra, fail_note) if n)
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


def wsb(p, mat, Lb, tf, bf, rotation, Mat_load, method, calc, Ru=None, location=None, *, m_ref="",
        **kw) -> CheckResult | None:
    """J10.4 on SI floats (internal); None when the limit state does not apply (Lb = 0 or the ratio
    (h/tw)/(Lb/bf) above 2.3 / 1.7). ``Mat_load``: |M| at the force (None: Cr = 480,000 ksi)."""
    h, tw, Fy = p.h_clear, p.tw, mat.Fy
    if not Lb > 0.0:
        return None
    restrained = rotation == "restrained"
    lim = SW_A if restrained else SW_B
    if not calc.on and not lim.fast(lam_sw=(h / tw) / (Lb / bf)):
        return None
    calc.say(("relative lateral movement between the loaded flange and the tension flange is not restrained "
              "at the force; loaded (compression) flange " + ("restrained" if restrained else "not restrained")
              + " against rotation"), reference=f"{_R} J10.4" + ("(a)" if restrained else "(b)"))
    calc.given("h", h, "length", reference="clear distance between flanges less the fillets (rolled) or "
               "between flanges (welded)")
    calc.given("t_w", tw, "length", reference="web thickness")
    calc.given("b_f", bf, "length", reference="width of the loaded flange")
    calc.given("t_f", tf, "length", reference="thickness of the loaded flange")
    calc.given("L_b", Lb, "span", reference="largest laterally unbraced length along either flange at the force")
    lam = calc(LAM_SW, h=h, t_w=tw, L_b=Lb, b_f=bf)
    if not calc.cond(lim, lam_sw=lam):
        calc.take()
        return None
    note = ""
    if Mat_load is None:
        Cr = calc.given("C_r", CR_HIGH_MOMENT, "stress", reference=f"{_R} J10.4: moment at the force not given, "
                        "Mu >= My assumed (conservative)")
        note = "moment at the force not given: Cr = 480,000 ksi (conservative)"
    else:
        My = calc(MY, F_y=Fy, S_x=p.Sx)
        if method == "LRFD":
            calc.given("M_u", Mat_load, "moment", reference=m_ref or "moment at the force")
            low = calc.cond(CR_LRFD, M_u=Mat_load, M_y=My)
        else:
            calc.given("M_a", Mat_load, "moment", reference=m_ref or "moment at the force")
            low = calc.cond(CR_ASD, M_a=Mat_load, M_y=My)
        Cr = calc.given("C_r", CR_LOW_MOMENT if low else CR_HIGH_MOMENT, "stress", reference=f"{_R} J10.4")
    F = J10_6 if restrained else J10_7
    Rn = calc(F, C_r=Cr, t_w=tw, t_f=tf, h=h, lam_sw=lam)
    cap = available(calc, "wsb", method, Rn, "R_n", "R_c", "force")
    data = {"Lb": Lb, "h": h, "lam_sw": lam, "limit": 2.3 if restrained else 1.7, "Cr": Cr,
            "rotation": rotation, **({"phi": 0.85} if method == "LRFD" else {"Omega": 1.76})}
    if Mat_load is not None:
        data["M_at_force"] = Mat_load
    kw["note_extra"] = "; ".join(n for n in (kw.get("note_extra", ""), note) if n)
    return _finish(LS_WSB, "J10.4(a)" if restrained else "J10.4(b)", Rn, cap, method, calc, data, Ru,
                   location=location, fail_note=WSB_NOTE_A if restrained else WSB_NOTE_B, **kw)


def wcb(p, mat, x_end, method, calc, Ru=None, location=None, **kw) -> CheckResult:
    """Web compression buckling (J10-8) on SI floats (internal)."""
    Fy, E, h, tw, d = mat.Fy, mat.E, p.h_clear, p.tw, p.d
    calc.say("a pair of compressive forces acts on both flanges at this location", reference=f"{_R} J10.5")
    calc.given("F_yw", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
    calc.given("E", E, "stress", reference=f"{_R} modulus of elasticity")
    calc.given("h", h, "length", reference="clear distance between flanges less the fillets (rolled) or "
               "between flanges (welded)")
    Qf = calc.given("Q_f", 1.0, reference=f"{_R} J10.5: Qf = 1.0 for wide-flange sections and channels")
    R0 = calc(J10_8, t_w=tw, E=E, F_yw=Fy, Q_f=Qf, h=h)
    Rn = R0 if calc.cond(END_WCB, x_end=x_end, d=d) else calc(J10_8H, R_n0=R0)
    cap = available(calc, "wcb", method, Rn, "R_n", "R_c", "force")
    data = {"x_end": x_end, "h": h, **({"phi": 0.90} if method == "LRFD" else {"Omega": 1.67})}
    return _finish(LS_WCB, "J10.5", Rn, cap, method, calc, data, Ru, location=location, fail_note=WCB_NOTE,
                   ru_ref="required strength, the larger of the two opposed forces", **kw)


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


def web_sidesway_buckling(section, steel, Lb, method: str = "LRFD", *, rotation: str = "restrained",
                          M=None, flange: str = "top", Ru=None, steps: bool = True) -> CheckResult | None:
    """Web sidesway buckling, AISC 360-22 J10.4 (compressive force; relative lateral movement between the
    loaded compression flange and the tension flange not restrained at the force).

    ``Lb``: largest laterally unbraced length along either flange at the force; ``rotation``: "restrained"
    (loaded flange restrained against rotation, Eq. J10-6) or "free" (Eq. J10-7); ``M``: |moment| at the
    force (Mu for LRFD, Ma for ASD) selecting Cr (None: Cr = 480,000 ksi, conservative). Returns None when
    the limit state does not apply ((h/tw)/(Lb/bf) > 2.3 or > 1.7, or Lb = 0).
    """
    m, p, mat, _, _, R = _common(section, steel, 0, None, method, flange, Ru)
    if rotation not in ROTATION:
        raise InputError(f"rotation: got {rotation!r}; expected 'restrained' or 'free' (loaded flange against "
                         "rotation)")
    Lbs = length_si(Lb, "Lb", dim="span")
    Ms = None if M is None else abs(quantity_si(M, "moment", "M"))
    tf, bf = _flange(p, flange)
    return wsb(p, mat, Lbs, tf, bf, rotation, Ms, m, Calc(steps), R)


def web_compression_buckling(section, steel, x_end=None, method: str = "LRFD", *, Ru=None,
                             steps: bool = True) -> CheckResult:
    """Web compression buckling, AISC 360-22 Eq. J10-8 (a pair of compressive forces on both flanges at
    one location); ``x_end``: distance from the member end (None: far away; < d/2 halves Rn)."""
    m, p, mat, _, xe, R = _common(section, steel, 0, x_end, method, "top", Ru)
    return wcb(p, mat, xe, m, Calc(steps), R)


def concentrated(section, steel, lb=0, x_end=None, method: str = "LRFD", *, Ru=None, tension: bool = False,
                 flange: str = "top", width=None, sidesway: str | None = None, Lb=None, M=None, opposite=None,
                 stiffeners: bool = False, stiffener=None, steps: bool = True) -> tuple[CheckResult, ...]:
    """All J10 checks that apply to one concentrated force.

    Compressive force (bearing load or reaction): web local yielding (J10.2) and web crippling (J10.3);
    web sidesway buckling (J10.4) when ``sidesway`` is "restrained" or "free" (with ``Lb`` and the moment
    ``M`` at the force, see :class:`Bearing`); web compression buckling (J10-8) when ``opposite`` gives a
    compressive force on the other flange at the same location (True: an equal force).
    Tensile force (``tension=True``): flange local bending (J10.1) and web local yielding (J10.2).
    ``x_end`` is the distance from the member end (None: farther than d); ``flange`` the loaded flange.
    A failing check carries the note that bearing stiffeners are required; with ``stiffeners=True`` (or a
    given ``stiffener=(b_s, t_s[, clip])``) the stiffener pair for a failing force is sized or checked
    (:func:`calckit.design.aisc360.stiffeners.stiffener_pair`) and its checks are appended.
    """
    m, p, mat, lbs, xe, R = _common(section, steel, lb, x_end, method, flange, Ru)
    tf, bf = _flange(p, flange)
    w = None if width is None else length_si(width, "width", allow_zero=False, dim="length")
    sw = _rotation(sidesway)
    if sw is not None and Lb is None:
        raise InputError("Lb: got None with sidesway given; expected the largest laterally unbraced length "
                         "along either flange at the force (J10.4)")
    Lbs = None if Lb is None else length_si(Lb, "Lb", dim="span")
    Ms = None if M is None else abs(quantity_si(M, "moment", "M"))
    op = _opposite(opposite)
    if tension and (sw is not None or op is not None):
        raise InputError("tension: got tension=True with sidesway/opposite; J10.4 and J10.5 apply to "
                         "compressive forces only")
    st = stiffener_si(stiffener)
    return forces(p, mat, lbs, xe, tf, bf, m, Calc(steps), R, tension=tension, width=w, sidesway=sw, Lb=Lbs,
                  M_at=Ms, opposite=op, stiffeners=stiffeners or st is not None, stiffener=st, flange=flange)


def forces(p, mat, lb, x_end, tf, bf, method, calc, Ru=None, *, tension=False, width=None, location=None,
           label: str = "", combination: str = "", note_extra: str = "", sidesway=None, Lb=None, M_at=None,
           m_ref: str = "", sw_note: str = "", opposite=None, stiffeners: bool = False, stiffener=None,
           flange: str = "top") -> tuple[CheckResult, ...]:
    """J10 checks for one force on SI floats (internal); the J10.4/J10.5 checks and the stiffener pair
    only when their inputs are given (so results without them are those of J10.1-J10.3 alone)."""
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
        if sidesway is not None and Lb is not None:
            kw2 = dict(kw, note_extra="; ".join(n for n in (note_extra, sw_note) if n))
            r = wsb(p, mat, Lb, tf, bf, sidesway, M_at, method, calc, Ru, location=location, m_ref=m_ref, **kw2)
            if r is not None:
                out.append(r)
        if opposite is not None:
            R2 = None if Ru is None else max(Ru, Ru if opposite is True else opposite)
            out.append(wcb(p, mat, x_end, method, calc, R2, location=location, **kw))
    if (stiffeners or stiffener is not None) and Ru is not None:
        st = _stiffeners.for_force(p, mat, tuple(out), Ru, x_end, tf, bf, method, calc, tension=tension,
                                   stiffener=stiffener, location=location, label=label, combination=combination,
                                   flange=flange)
        if stiffener is not None and st and all(r.passed is not False for r in st):
            out = [_resisted_by_stiffeners(r) for r in out]
        out.extend(st)
    return tuple(out)


def _resisted_by_stiffeners(r: CheckResult) -> CheckResult:
    """A web check that the web alone fails, where the given stiffener pair passes its own checks: the
    force is resisted by web and stiffeners (J10.2, J10.3, J10.4, J10.5: "a pair of transverse stiffeners
    ... shall be provided"; J10.7, J10.8), so the web check is kept for the record without a ratio
    (``ratio`` and ``passed`` None) and the stiffener checks govern."""
    from dataclasses import replace

    if r.passed is not False:
        return r
    note = ((r.note + "; ") if r.note else "") + ("the web alone is exceeded; the force is resisted with the "
                                                   "stiffener pair checked below (AISC 360-22 J10.7, J10.8)")
    return replace(r, ratio=None, passed=None, note=note, data=dict(r.data, resisted_by_stiffeners=True))


# ------------------------------------------------------------------------------------ member level
def _sidesway_Lb(D, x: float) -> tuple[float, str]:
    """Largest unbraced length along either flange at x from the member's bracing (internal)."""
    tol = 1e-9 * max(D.x1 - D.x0, 1.0)
    if D.bracing == "continuous":
        pts = sorted(set((D.x0, *D.supports, D.x1)))
        spans = [b - a for a, b in zip(pts, pts[1:]) if a - tol <= x <= b + tol and b - a > tol]
        return max(spans, default=0.0), ("one flange braced continuously: Lb = the length between supports "
                                         "(the other flange braced at the supports only)")
    segs = [s.Lb for s in D.segments if s.a - tol <= x <= s.b + tol]
    return max(segs, default=0.0), "Lb from the member's brace points (braces assumed to restrain both flanges)"


def _moment_at(D, fd, x: float) -> tuple[float | None, str]:
    b = fd.bearing
    if b.M is not None:
        return b.M, "moment at the force (given)"
    M = getattr(fd, "M", None)
    if M is not None:
        return abs(float(M)), "moment at the force (analysis)"
    tol = 1e-9 * max(D.x1 - D.x0, 1.0)
    vals = [max(it.M_pos, it.M_neg) for it in D.flexure if it.segment.a - tol <= x <= it.segment.b + tol]
    if not vals:
        return None, ""
    return max(vals), "largest |M| in the unbraced segment at the force (conservative for Cr)"


def member_forces(p, mat, D, method: str, steps: bool) -> list[CheckResult]:
    """J10 checks of every force of prepared member demands (internal; used by ``check_member``).

    J10.1-J10.3 as before; J10.4 where a bearing says ``sidesway`` (Lb and the moment at the force from the
    member unless given); J10-8 for a bearing with ``opposite``, or for two compressive bearings at the same
    position on opposite flanges (checked once, at the first, with the larger force); a stiffener pair for
    every force with a failing check (or a given ``stiffener``).
    """
    out: list[CheckResult] = []
    fds = list(D.forces)
    tol = 1e-6 * max(D.x1 - D.x0, 1.0)
    pair_of: dict[int, float] = {}
    skip: set[int] = set()
    for i, fi in enumerate(fds):
        bi = fi.bearing
        if i in skip or bi.tension or bi.opposite is not None:
            continue
        for j in range(i + 1, len(fds)):
            bj = fds[j].bearing
            if (j not in skip and not bj.tension and bj.opposite is None and abs(bj.x - bi.x) <= tol
                    and bj.flange != bi.flange):
                pair_of[i] = bj.P
                skip.add(j)
                break
    for i, fd in enumerate(fds):
        b = fd.bearing
        tf, bf = (p.tf_top, p.bf_top) if b.flange == "top" else (p.tf_bot, p.bf_bot)
        note = "k = tf: no flange-to-web weld size given" if p.kind == "I_welded" and p.weld == 0 else ""
        Lb = M_at = None
        m_ref = lb_note = ""
        if b.sidesway is not None and not b.tension:
            if b.Lb is not None:
                Lb = b.Lb
            else:
                Lb, lb_note = _sidesway_Lb(D, b.x)
            M_at, m_ref = _moment_at(D, fd, b.x)
        opp = pair_of.get(i, b.opposite) if i not in skip else None
        out.extend(forces(p, mat, b.lb, b.x_end, tf, bf, method, Calc(steps), b.P, tension=b.tension,
                          width=b.width, location=b.x, label=b.name or f"x = {b.x:.4g} m",
                          combination=fd.combination, note_extra=note, sidesway=b.sidesway, Lb=Lb, M_at=M_at,
                          m_ref=m_ref, sw_note=lb_note, opposite=opp, stiffeners=True, stiffener=b.stiffener, flange=b.flange))
    return out


# imported last (it uses the names above), so that its formulas are in the registry after import
from . import stiffeners as _stiffeners  # noqa: E402
