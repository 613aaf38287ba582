"""Shear, AISC 360-22 Chapter G: G2.1 (webs without tension field action), G2.2 (tension field action),
G2.3 (transverse stiffeners) and G6 (minor-axis shear), for I-shapes and channels.

Equations (AISC 360-16/360-22 numbering, from memory):

- G2.1: Vn = 0.6 Fy Aw Cv1 (G2-1), Aw = d tw. (a) webs of rolled I-shapes with h/tw <= 2.24 sqrt(E/Fy):
  phi_v = 1.00, Omega_v = 1.50, Cv1 = 1.0 (G2-2). (b) all other I-shapes and channels: phi_v = 0.90,
  Omega_v = 1.67; Cv1 = 1.0 when h/tw <= 1.10 sqrt(kv E/Fy) (G2-3), else 1.10 sqrt(kv E/Fy)/(h/tw) (G2-4);
  kv = 5.34 without transverse stiffeners or when a/h > 3.0, else 5 + 5/(a/h)^2 (G2-5).
- G2.2 (tension field action; not permitted for end panels or when a/h > 3.0): Vn = 0.6 Fy Aw when
  h/tw <= 1.10 sqrt(kv E/Fy) (G2-6); else Vn = 0.6 Fy Aw [Cv2 + (1 - Cv2)/(1.15 sqrt(1 + (a/h)^2))]
  (G2-7) when 2Aw/(Afc + Aft) <= 2.5, h/bfc <= 6.0 and h/bft <= 6.0, otherwise
  Vn = 0.6 Fy Aw [Cv2 + (1 - Cv2)/(1.15 (a/h + sqrt(1 + (a/h)^2)))] (G2-8). Cv2 = 1.0 (G2-9),
  1.10 sqrt(kv E/Fy)/(h/tw) (G2-10) or 1.51 kv E/((h/tw)^2 Fy) (G2-11) with limits 1.10 and
  1.37 sqrt(kv E/Fy).
- G2.3: stiffeners not required where h/tw <= 2.46 sqrt(E/Fy) or where the G2.1 strength with kv = 5.34
  suffices; (b/t)st <= 0.56 sqrt(E/Fyst); Ist >= Ist2 + (Ist1 - Ist2) rho_w with
  Ist1 = h^4 rho_st^1.3/40 (Fyw/E)^1.5, Ist2 = [2.5/(a/h)^2 - 2] b tw^3 >= 0.5 b tw^3 (b = min(a, h)),
  rho_st = max(Fyw/Fyst, 1.0), rho_w = max((Vr - Vc2)/(Vc1 - Vc2), 0).
- G6: Vn = 0.6 Fy Aw Cv2 (G6-1) for each flange, Aw = bf tf, with h/tw replaced by b/tf (b = bf/2 for
  I-shapes, bf for channels) and kv = 1.2; phi_v = 0.90, Omega_v = 1.67.

Here h is calckit's ``h_clear`` (d - 2k for rolled shapes, the clear distance between flanges for welded
girders) and ``a`` the clear distance between transverse stiffeners.
"""
from __future__ import annotations


from ...errors import InputError
from ..results import CheckResult
from ._core import (FACTORS, STANDARD, Calc, Cond, Fm, available, kind_word, length_si, material, not_covered,
                    parse_method, props, quantity_si)
from .classify import _axis

__all__ = ["shear", "transverse_stiffener"]

_R = "AISC 360-22"
_DL = {"h": "length", "t_w": "length", "a": "length"}

AW = Fm("A_w", "d*t_w", f"{_R} G2.1", "web area, overall depth times web thickness")
G2A = Cond("h/t_w <= 2.24*sqrt(E/F_y)", f"{_R} G2.1(a)",
           then="web of a rolled I-shape: Cv1 = 1.0, phi_v = 1.00, Omega_v = 1.50 (Eq. G2-2)",
           otherwise="G2.1(b) applies: phi_v = 0.90, Omega_v = 1.67")
AH3 = Cond("a/h <= 3.0", f"{_R} G2.1(b)(2)", then="kv from Eq. G2-5", otherwise="a/h > 3.0: kv = 5.34")
G2_5 = Fm("k_v", "5 + 5/(a/h)**2", f"{_R} Eq. G2-5", "web plate shear buckling coefficient")
CV1C = Cond("h/t_w <= 1.10*sqrt(k_v*E/F_y)", f"{_R} G2.1(b)(1)", then="Cv1 = 1.0 (Eq. G2-3)",
            otherwise="Cv1 from Eq. G2-4")
G2_4 = Fm("C_v1", "1.10*sqrt(k_v*E/F_y)/(h/t_w)", f"{_R} Eq. G2-4", "web shear strength coefficient")
G2_1 = Fm("V_n", "0.6*F_y*A_w*C_v1", f"{_R} Eq. G2-1", "nominal shear strength")
CV2A = Cond("h/t_w <= 1.10*sqrt(k_v*E/F_y)", f"{_R} G2.2", then="Cv2 = 1.0 (Eq. G2-9); Vn = 0.6 Fy Aw (Eq. G2-6)",
            otherwise="web buckles before yielding in shear")
CV2B = Cond("h/t_w <= 1.37*sqrt(k_v*E/F_y)", f"{_R} G2.2", then="Cv2 from Eq. G2-10",
            otherwise="Cv2 from Eq. G2-11")
G2_10 = Fm("C_v2", "1.10*sqrt(k_v*E/F_y)/(h/t_w)", f"{_R} Eq. G2-10", "web shear buckling coefficient")
G2_11 = Fm("C_v2", "1.51*k_v*E/((h/t_w)**2*F_y)", f"{_R} Eq. G2-11", "web shear buckling coefficient")
G2_6 = Fm("V_n", "0.6*F_y*A_w", f"{_R} Eq. G2-6", "nominal shear strength, web yielding")
RHO_A = Fm("rho_A", "2*A_w/(A_fc + A_ft)", f"{_R} G2.2(b)", "web-to-flange area ratio")
PROP_A = Cond("rho_A <= 2.5", f"{_R} G2.2(b)(1)")
PROP_C = Cond("h/b_fc <= 6.0", f"{_R} G2.2(b)(1)")
PROP_T = Cond("h/b_ft <= 6.0", f"{_R} G2.2(b)(1)")
G2_7 = Fm("V_n", "0.6*F_y*A_w*(C_v2 + (1 - C_v2)/(1.15*sqrt(1 + (a/h)**2)))", f"{_R} Eq. G2-7",
          "nominal shear strength with tension field action")
G2_8 = Fm("V_n", "0.6*F_y*A_w*(C_v2 + (1 - C_v2)/(1.15*(a/h + sqrt(1 + (a/h)**2))))", f"{_R} Eq. G2-8",
          "nominal shear strength with tension field action (flange proportions of G2.2(b)(2))")
G6C1 = Cond("b/t_f <= 1.10*sqrt(k_v*E/F_y)", f"{_R} G6 with G2.2", then="Cv2 = 1.0",
            otherwise="flange buckles before yielding in shear")
G6C2 = Cond("b/t_f <= 1.37*sqrt(k_v*E/F_y)", f"{_R} G6 with G2.2", then="Cv2 from Eq. G2-10 with b/tf",
            otherwise="Cv2 from Eq. G2-11 with b/tf")
G6_10 = Fm("C_v2", "1.10*sqrt(k_v*E/F_y)/(b/t_f)", f"{_R} G6, Eq. G2-10", "flange shear buckling coefficient")
G6_11 = Fm("C_v2", "1.51*k_v*E/((b/t_f)**2*F_y)", f"{_R} G6, Eq. G2-11", "flange shear buckling coefficient")
G6_1 = Fm("V_nf", "0.6*F_y*b_f*t_f*C_v2", f"{_R} Eq. G6-1", "nominal shear strength of one flange",
          dims={"V_nf": "force"})
G6_SUM = Fm("V_n", "V_nf_top + V_nf_bot", f"{_R} G6", "nominal minor-axis shear strength, both flanges",
            dims={"V_nf_top": "force", "V_nf_bot": "force"})
# G2.3 transverse stiffeners
NOT_REQ = Cond("h/t_w <= 2.46*sqrt(E/F_y)", f"{_R} G2.3", then="transverse stiffeners are not required",
               otherwise="transverse stiffeners may be required")
RHO_ST = Fm("rho_st", "Max(F_yw/F_yst, 1.0)", f"{_R} G2.3", "ratio of web to stiffener yield stress")
IST1 = Fm("I_st1", "h**4*rho_st**1.3/40*(F_yw/E)**1.5", f"{_R} G2.3 (Ist1)",
          "moment of inertia for the full post-buckling strength")
IST2 = Fm("I_st2", "Max(2.5/(a/h)**2 - 2, 0.5)*b_min*t_w**3", f"{_R} G2.3 (Ist2)",
          "moment of inertia for the web shear buckling strength")
VN2 = Fm("V_n2", "0.6*F_y*A_w*C_v2", f"{_R} G2.3", "nominal shear buckling strength used for Vc2",
         dims={"V_n2": "force"})
RHO_W = Fm("rho_w", "Max((V_r - V_c2)/(V_c1 - V_c2), 0)", f"{_R} G2.3", "shear ratio of the adjacent panels")
IST = Fm("I_st_req", "I_st2 + (I_st1 - I_st2)*rho_w", f"{_R} G2.3", "required moment of inertia of the "
         "transverse stiffener(s)")
BT_MAX = Fm("lam_st_max", "0.56*sqrt(E/F_yst)", f"{_R} G2.3", "width-to-thickness limit of the stiffener")
BT = Fm("lam_st", "b_st/t_st", f"{_R} G2.3", "width-to-thickness ratio of the stiffener")
IST_PAIR = Fm("I_st", "t_st*((2*b_st + t_w)**3 - t_w**3)/12", f"{_R} G2.3 (about the web centre line)",
              "moment of inertia of a pair of stiffener plates")
IST_ONE = Fm("I_st", "t_st*b_st**3/3", f"{_R} G2.3 (about the face in contact with the web)",
             "moment of inertia of a single stiffener plate")

LS_SHEAR = "Shear"
LS_SHEAR_MINOR = "Shear (minor axis)"


def _covered(p, axis: str) -> None:
    if p.kind in ("I_rolled", "I_welded", "channel"):
        return
    clause = {"tee": "G3 (single angles and tees)",
              "hollow": "G4 (rectangular HSS, box sections and other singly and doubly symmetric members)",
              "rect": "G4 (rectangular HSS, box sections and other singly and doubly symmetric members)",
              "builtup": "G2 for the web of a built-up I (not implemented for BuiltUp sections)"}
    raise not_covered(f"{'minor-axis ' if axis == 'minor' else ''}shear of a {kind_word(p)}",
                      clause.get(p.kind, "Chapter G"))


def shear_strength(p, mat, a: float | None, method: str, calc: Calc, *, end_panel: bool = False,
                   tension_field: bool = True):
    """Major-axis shear strength: (Vn, Vc, clause, data, factor kind) (internal, SI floats)."""
    Fy, E = mat.Fy, mat.E
    h, tw = p.h_clear, p.tw
    d: dict = {"h_tw": h / tw}
    calc.given("F_y", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
    calc.given("E", E, "stress", reference=f"{_R} modulus of elasticity")
    Aw = calc(AW, d=p.d, t_w=tw)
    d["Aw"] = Aw
    if p.kind == "I_rolled" and calc.cond(G2A, h=h, t_w=tw, E=E, F_y=Fy):
        Cv1 = calc.given("C_v1", 1.0, reference=f"{_R} Eq. G2-2")
        Vn = calc(G2_1, F_y=Fy, A_w=Aw, C_v1=Cv1)
        d.update(Cv1=1.0, kv=None, tension_field=False)
        return Vn, available(calc, "shear_rolled", method, Vn, "V_n", "V_c", "force"), "G2.1(a)", d, \
            "shear_rolled"
    if a is None:
        kv = calc.given("k_v", 5.34, reference=f"{_R} G2.1(b)(2)(i): web without transverse stiffeners")
    else:
        d["a_h"] = a / h
        if calc.cond(AH3, a=a, h=h):
            kv = calc(G2_5, a=a, h=h)
        else:
            kv = calc.given("k_v", 5.34, reference=f"{_R} G2.1(b)(2)(ii): a/h > 3.0")
    d["kv"] = kv
    tfa = (tension_field and a is not None and p.kind in ("I_rolled", "I_welded") and not end_panel
           and a / h <= 3.0)
    if a is not None and tension_field and not tfa:
        why = ("end panel" if end_panel else "a/h > 3.0" if a / h > 3.0 else "channel")
        calc.say(f"tension field action not permitted ({why}): G2.1 applies", reference=f"{_R} G2.2")
        d["tfa_note"] = f"tension field action not permitted ({why})"
    if not tfa:
        if calc.cond(CV1C, h=h, t_w=tw, k_v=kv, E=E, F_y=Fy):
            Cv1 = calc.given("C_v1", 1.0, reference=f"{_R} Eq. G2-3")
        else:
            Cv1 = calc(G2_4, k_v=kv, E=E, F_y=Fy, h=h, t_w=tw)
        Vn = calc(G2_1, F_y=Fy, A_w=Aw, C_v1=Cv1)
        d.update(Cv1=Cv1, tension_field=False)
        return Vn, available(calc, "shear", method, Vn, "V_n", "V_c", "force"), "G2.1(b)", d, "shear"
    calc.say("interior panel with a/h <= 3.0: tension field action is used", reference=f"{_R} G2.2")
    d["tension_field"] = True
    if calc.cond(CV2A, h=h, t_w=tw, k_v=kv, E=E, F_y=Fy):
        Vn = calc(G2_6, F_y=Fy, A_w=Aw)
        d["Cv2"] = 1.0
        cl = "G2.2(a)"
    else:
        if calc.cond(CV2B, h=h, t_w=tw, k_v=kv, E=E, F_y=Fy):
            Cv2 = calc(G2_10, k_v=kv, E=E, F_y=Fy, h=h, t_w=tw)
        else:
            Cv2 = calc(G2_11, k_v=kv, E=E, F_y=Fy, h=h, t_w=tw)
        d["Cv2"] = Cv2
        Afc, Aft = p.bf_top * p.tf_top, p.bf_bot * p.tf_bot
        rA = calc(RHO_A, A_w=Aw, A_fc=Afc, A_ft=Aft)
        ok = [calc.cond(PROP_A, rho_A=rA), calc.cond(PROP_C, h=h, b_fc=p.bf_top),
              calc.cond(PROP_T, h=h, b_ft=p.bf_bot)]
        if all(ok):
            Vn = calc(G2_7, F_y=Fy, A_w=Aw, C_v2=Cv2, a=a, h=h)
            cl = "G2.2(b)(1)"
        else:
            Vn = calc(G2_8, F_y=Fy, A_w=Aw, C_v2=Cv2, a=a, h=h)
            cl = "G2.2(b)(2)"
    return Vn, available(calc, "shear", method, Vn, "V_n", "V_c", "force"), cl, d, "shear"


def shear_strength_minor(p, mat, method: str, calc: Calc):
    """Minor-axis (G6) shear strength: (Vn, Vc, clause, data, kind) (internal)."""
    Fy, E = mat.Fy, mat.E
    calc.given("F_y", Fy, "stress", reference=f"specified minimum yield stress, {mat.name}")
    calc.given("E", E, "stress", reference=f"{_R} modulus of elasticity")
    kv = calc.given("k_v", 1.2, reference=f"{_R} G6")
    parts, d = [], {"kv": 1.2}
    for side, bf, tf in (("top", p.bf_top, p.tf_top), ("bot", p.bf_bot, p.tf_bot)):
        b = bf if p.kind == "channel" else bf / 2
        if calc.cond(G6C1, b=b, t_f=tf, k_v=kv, E=E, F_y=Fy):
            Cv2 = calc.given("C_v2", 1.0, reference=f"{_R} G6, Eq. G2-9")
        elif calc.cond(G6C2, b=b, t_f=tf, k_v=kv, E=E, F_y=Fy):
            Cv2 = calc(G6_10, k_v=kv, E=E, F_y=Fy, b=b, t_f=tf)
        else:
            Cv2 = calc(G6_11, k_v=kv, E=E, F_y=Fy, b=b, t_f=tf)
        parts.append(calc(G6_1, F_y=Fy, b_f=bf, t_f=tf, C_v2=Cv2))
        d[f"Cv2_{side}"] = Cv2
    Vn = calc(G6_SUM, V_nf_top=parts[0], V_nf_bot=parts[1])
    d["Aw"] = p.bf_top * p.tf_top + p.bf_bot * p.tf_bot
    return Vn, available(calc, "shear", method, Vn, "V_n", "V_c", "force"), "G6", d, "shear"


def _factor_data(kind: str, method: str) -> dict:
    phi, om, _, _ = FACTORS[kind]
    return {"phi_v": phi} if method == "LRFD" else {"Omega_v": om}


def shear(section, steel, a=None, method: str = "LRFD", *, axis: str = "major", end_panel: bool = False,
          tension_field: bool = True, Vu=None, steps: bool = True) -> CheckResult:
    """Available shear strength of an I-shape or channel, AISC 360-22 G2.1, G2.2 or G6.

    Parameters
    ----------
    section, steel : as for :func:`calckit.design.aisc360.flexure`.
    a : clear distance between transverse stiffeners ("1.5 m"); None for an unstiffened web.
    method : "LRFD" or "ASD".
    axis : "major" (web shear, G2) or "minor" (flange shear, G6).
    end_panel : the panel is an end panel (tension field action not permitted, G2.2).
    tension_field : use tension field action (G2.2) where it is permitted; False forces G2.1.
    Vu : required shear strength (quantity or string) to fill ratio and passed.
    steps : build calc-sheet records.

    Returns a CheckResult with ``capacity`` phi_v Vn or Vn/Omega_v (N), ``nominal`` Vn and ``data``
    (Aw, h_tw, kv, Cv1 or Cv2, tension_field, phi_v or Omega_v).
    """
    m = parse_method(method)
    p = props(section)
    mat = material(steel, p)
    ax = _axis(axis)
    _covered(p, ax)
    a_si = None if a is None else length_si(a, "a", allow_zero=False, dim="length")
    demand = None if Vu is None else abs(quantity_si(Vu, "force", "Vu"))
    calc = Calc(steps)
    if ax == "minor":
        if a is not None:
            raise InputError("a: got a stiffener spacing for minor-axis shear; expected None (G6 has no "
                             "stiffened case)")
        Vn, Vc, cl, d, kind = shear_strength_minor(p, mat, m, calc)
        ls = LS_SHEAR_MINOR
    else:
        Vn, Vc, cl, d, kind = shear_strength(p, mat, a_si, m, calc, end_panel=end_panel,
                                             tension_field=tension_field)
        ls = LS_SHEAR
    d.update(_factor_data(kind, m))
    if demand is not None and steps:
        calc.given("V_u" if m == "LRFD" else "V_a", demand, "force", reference="required shear strength")
    r = CheckResult(limit_state=ls, clause=f"{STANDARD} {cl}", dim="force", capacity=Vc, nominal=Vn, method=m,
                    steps=calc.take(), data=d, note=mat.note)
    return r.with_demand(demand) if demand is not None else r


def transverse_stiffener(section, steel, a, Vu, method: str = "LRFD", *, stiffener=None, pair: bool = True,
                         stiffener_steel=None, Vc1=None, steps: bool = True) -> tuple[CheckResult, ...]:
    """Transverse stiffener requirements, AISC 360-22 G2.3.

    Parameters
    ----------
    a : clear distance between stiffeners in the panels next to the stiffener ("1.5 m").
    Vu : required shear strength in those panels (the larger side).
    stiffener : (b_st, t_st) plate width and thickness, or None to report the requirement only.
    pair : stiffeners on both sides of the web (True) or on one side.
    stiffener_steel : grade of the stiffener (default: ``steel``).
    Vc1 : available shear strength of the panel (default: this module's G2.1/G2.2 strength for ``a``,
        tension field action used where permitted).

    Returns one CheckResult when stiffeners are not required or no size is given (``passed`` None; the
    required Ist is ``capacity``), else two: moment of inertia (required / provided) and b/t.
    """
    m = parse_method(method)
    p = props(section)
    mat = material(steel, p)
    _covered(p, "major")
    a_si = length_si(a, "a", allow_zero=False, dim="length")
    Vr = abs(quantity_si(Vu, "force", "Vu"))
    smat = mat if stiffener_steel is None else material(stiffener_steel, p)
    calc = Calc(steps)
    return stiffener_checks(p, mat, smat, a_si, Vr, m, calc, stiffener=_stiff(stiffener), pair=pair,
                            Vc1=None if Vc1 is None else abs(quantity_si(Vc1, "force", "Vc1")))


def _stiff(stiffener):
    if stiffener is None:
        return None
    try:
        b, t = stiffener
    except (TypeError, ValueError):
        raise InputError(f"stiffener: got {stiffener!r}; expected (b_st, t_st), e.g. ('100 mm', '10 mm')") from None
    return (length_si(b, "stiffener b_st", allow_zero=False, dim="length"),
            length_si(t, "stiffener t_st", allow_zero=False, dim="length"))


def stiffener_checks(p, mat, smat, a: float, Vr: float, method: str, calc: Calc, *, stiffener=None,
                     pair: bool = True, Vc1: float | None = None) -> tuple[CheckResult, ...]:
    """G2.3 checks on SI floats (internal)."""
    Fy, E, h, tw = mat.Fy, mat.E, p.h_clear, p.tw
    ref = f"{STANDARD} G2.3"
    ls = "Transverse stiffener: moment of inertia"
    # not required?
    sub = Calc(False)
    Vn0, Vc0, *_ = shear_strength(p, mat, None, method, sub)
    if calc.cond(NOT_REQ, h=h, t_w=tw, E=E, F_y=Fy) or Vr <= Vc0:
        if Vr <= Vc0 and calc.on:
            calc.say(f"required shear {Vr / 1e3:.4g} kN <= available shear strength without stiffeners "
                     f"(kv = 5.34) {Vc0 / 1e3:.4g} kN: transverse stiffeners are not required", reference=ref)
        return (CheckResult(limit_state=ls, clause=ref, dim="inertia", capacity=0.0, method=method,
                            steps=calc.take(), data={"required": False, "Vc_unstiffened": Vc0},
                            note="transverse stiffeners are not required for shear (G2.3)"),)
    if Vc1 is None:
        _, Vc1, *_ = shear_strength(p, mat, a, method, sub)
    # Vc2: available strength 0.6 Fy Aw Cv2 for this panel
    kv = calc(G2_5, a=a, h=h) if calc.cond(AH3, a=a, h=h) else calc.given("k_v", 5.34, reference=f"{_R} G2.1")
    if calc.cond(CV2A, h=h, t_w=tw, k_v=kv, E=E, F_y=Fy):
        Cv2 = calc.given("C_v2", 1.0, reference=f"{_R} Eq. G2-9")
    elif calc.cond(CV2B, h=h, t_w=tw, k_v=kv, E=E, F_y=Fy):
        Cv2 = calc(G2_10, k_v=kv, E=E, F_y=Fy, h=h, t_w=tw)
    else:
        Cv2 = calc(G2_11, k_v=kv, E=E, F_y=Fy, h=h, t_w=tw)
    Vn2 = calc(VN2, F_y=Fy, A_w=p.d * tw, C_v2=Cv2)
    Vc2 = available(calc, "shear", method, Vn2, "V_n2", "V_c2", "force")
    calc.given("V_r", Vr, "force", reference="required shear strength in the adjacent panels")
    calc.given("V_c1", Vc1, "force", reference=f"{_R} G2.3: available shear strength of the panel (G2.1/G2.2)")
    rho_st = calc(RHO_ST, F_yw=Fy, F_yst=smat.Fy)
    I1 = calc(IST1, h=h, rho_st=rho_st, F_yw=Fy, E=E)
    I2 = calc(IST2, a=a, h=h, b_min=min(a, h), t_w=tw)
    rho_w = calc(RHO_W, V_r=Vr, V_c1=Vc1, V_c2=Vc2) if Vc1 > Vc2 else calc.given("rho_w", 0.0)
    Ireq = calc(IST, I_st2=I2, I_st1=I1, rho_w=rho_w)
    lam_max = calc(BT_MAX, E=E, F_yst=smat.Fy)
    data = {"required": True, "Ist1": I1, "Ist2": I2, "rho_w": rho_w, "rho_st": rho_st, "Ist_req": Ireq,
            "bt_max": lam_max, "Vc1": Vc1, "Vc2": Vc2}
    if stiffener is None:
        return (CheckResult(limit_state=ls, clause=ref, dim="inertia", capacity=Ireq, method=method,
                            steps=calc.take(), data=data,
                            note=f"transverse stiffeners required: Ist >= {Ireq * 1e12:.4g} mm4 and "
                                 f"b/t <= {lam_max:.3g} (G2.3); no stiffener size given"),)
    b, t = stiffener
    Ist = calc(IST_PAIR, t_st=t, b_st=b, t_w=tw) if pair else calc(IST_ONE, t_st=t, b_st=b)
    data["Ist"] = Ist
    r1 = CheckResult(limit_state=ls, clause=ref, dim="inertia", capacity=Ist, method=method, steps=calc.take(),
                     data=data).with_demand(Ireq)
    lam = calc(BT, b_st=b, t_st=t)
    r2 = CheckResult(limit_state="Transverse stiffener: width-to-thickness ratio", clause=ref,
                     dim="dimensionless", capacity=lam_max, method=method, steps=calc.take(),
                     data={"bt": lam, "bt_max": lam_max}).with_demand(lam)
    return r1, r2
