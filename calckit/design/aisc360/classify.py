"""Width-to-thickness classification for flexure, AISC 360-22 Table B4.1b (compact / noncompact / slender).

Cases implemented (from memory of Table B4.1b; the limits have been the same since AISC 360-10):

- Case 10: flanges of rolled I-shapes and channels, b/t; lambda_p = 0.38 sqrt(E/Fy),
  lambda_r = 1.0 sqrt(E/Fy) (b = bf/2 for I-shapes, b = bf for channels).
- Case 11: flanges of doubly and singly symmetric built-up I-shapes, b/t; lambda_p = 0.38 sqrt(E/Fy),
  lambda_r = 0.95 sqrt(kc E/FL), kc = 4/sqrt(h/tw) with 0.35 <= kc <= 0.76 (note [a]) and FL per
  Eqs. F4-6a/b (0.7 Fy when Sxt/Sxc >= 0.7 or the web is slender; else Fy Sxt/Sxc >= 0.5 Fy).
- Case 13: flanges of I-shapes and channels bent about the minor axis, b/t; 0.38 and 1.0 sqrt(E/Fy).
- Case 15: webs of doubly symmetric I-shapes and channels, h/tw; 3.76 sqrt(E/Fy) and 5.70 sqrt(E/Fy).
- Case 16: webs of singly symmetric I-shapes, hc/tw;
  lambda_p = (hc/hp) sqrt(E/Fy) / (0.54 Mp/My - 0.09)^2 <= lambda_r, lambda_r = 5.70 sqrt(E/Fy).

Definitions (AISC 360-22 B4.1): h is the clear distance between flanges less the fillets for rolled shapes
(calckit's ``h_clear`` = d - 2 k) and the clear distance between flanges for welded shapes; hc is twice the
distance from the elastic centroid to the inside face of the compression flange (less the fillet for rolled
shapes); hp is twice the distance from the plastic neutral axis to the inside face of the compression
flange. My is taken as Fy Sx with Sx the smaller elastic modulus (first yield), from memory of the
Symbols list.
"""
from __future__ import annotations

from dataclasses import dataclass

from ._core import Calc, Cond, Fm, kind_word, material, not_covered, props

__all__ = ["Element", "Classification", "classify", "CLASSES"]

CLASSES = ("compact", "noncompact", "slender")
_T = "AISC 360-22 Table B4.1b"

LAM_F_I = Fm("lam_f", "b_fc/(2*t_fc)", f"{_T} Cases 10-11", "flange slenderness b/t, b = bf/2")
LAM_F_C = Fm("lam_f", "b_f/t_f", f"{_T} Case 10", "channel flange slenderness b/t, b = bf")
LAM_F_MI = Fm("lam_f", "b_f/(2*t_f)", f"{_T} Case 13", "flange slenderness b/t, b = bf/2")
LAM_PF = Fm("lam_pf", "0.38*sqrt(E/F_y)", f"{_T} Cases 10, 11, 13", "compact limit, flange")
LAM_RF = Fm("lam_rf", "1.0*sqrt(E/F_y)", f"{_T} Cases 10, 13", "noncompact limit, flange")
KC = Fm("k_c", "Min(Max(4/sqrt(h/t_w), 0.35), 0.76)", f"{_T} note [a]",
        "flange local buckling coefficient, 0.35 <= kc <= 0.76")
FL_A = Fm("F_L", "0.7*F_y", "AISC 360-22 Eq. F4-6a", "nominal compression flange stress above which "
          "inelastic buckling applies")
FL_B = Fm("F_L", "Max(F_y*S_xt/S_xc, 0.5*F_y)", "AISC 360-22 Eq. F4-6b",
          "nominal compression flange stress, Sxt/Sxc < 0.7")
FL_COND = Cond("S_xt/S_xc >= 0.7", "AISC 360-22 F4.2(c)", then="FL = 0.7 Fy (Eq. F4-6a)",
               otherwise="FL = Fy Sxt/Sxc >= 0.5 Fy (Eq. F4-6b)")
LAM_RF_B = Fm("lam_rf", "0.95*sqrt(k_c*E/F_L)", f"{_T} Case 11", "noncompact limit, built-up flange")
LAM_W = Fm("lam_w", "h/t_w", f"{_T} Case 15", "web slenderness h/tw")
LAM_PW = Fm("lam_pw", "3.76*sqrt(E/F_y)", f"{_T} Case 15", "compact limit, web")
LAM_RW = Fm("lam_rw", "5.70*sqrt(E/F_y)", f"{_T} Cases 15, 16", "noncompact limit, web")
LAM_WC = Fm("lam_w", "h_c/t_w", f"{_T} Case 16", "web slenderness hc/tw")
LAM_PW16 = Fm("lam_pw", "Min((h_c/h_p)*sqrt(E/F_y)/(0.54*M_p/M_y - 0.09)**2, lam_rw)", f"{_T} Case 16",
              "compact limit, web of a singly symmetric I-shape")
MP_CL = Fm("M_p", "F_y*Z_x", "AISC 360-22 F4.1", "plastic moment")
MY_CL = Fm("M_y", "F_y*S_x", "AISC 360-22 Table B4.1b Case 16", "yield moment (first yield)")
F_COMPACT = Cond("lam_f <= lam_pf", _T, then="flange compact", otherwise="flange not compact")
F_NONCOMP = Cond("lam_f <= lam_rf", _T, then="flange noncompact", otherwise="flange slender")
W_COMPACT = Cond("lam_w <= lam_pw", _T, then="web compact", otherwise="web not compact")
W_NONCOMP = Cond("lam_w <= lam_rw", _T, then="web noncompact", otherwise="web slender")


@dataclass(frozen=True)
class Element:
    """Classification of one element (flange or web) of a section in flexure."""

    element: str  #: "flange" or "web"
    lam: float  #: width-to-thickness ratio lambda (b/t, h/tw or hc/tw)
    lam_p: float  #: limiting ratio for a compact element, lambda_p
    lam_r: float  #: limiting ratio for a noncompact element, lambda_r
    cls: str  #: "compact", "noncompact" or "slender"
    case: int  #: case number of Table B4.1b

    def __str__(self) -> str:
        return (f"{self.cls} (lambda = {self.lam:.3g}; lambda_p = {self.lam_p:.3g}, lambda_r = {self.lam_r:.3g}, "
                f"Table B4.1b Case {self.case})")


@dataclass(frozen=True)
class Classification:
    """Flexural classification of a section (AISC 360-22 Table B4.1b)."""

    axis: str  #: "major" or "minor"
    compression: str  #: "top" or "bottom": the flange in compression (major axis)
    flange: Element  #: compression flange (major axis) or the more slender flange (minor axis)
    web: Element | None  #: web (major axis only)
    kc: float | None  #: kc for built-up flanges (note [a]), else None
    FL: float | None  #: FL used in Case 11 (Pa), else None
    steps: tuple = ()  #: calc-sheet records

    @property
    def section_class(self) -> str:
        """The most slender class of the elements."""
        els = [self.flange] + ([self.web] if self.web is not None else [])
        return max((e.cls for e in els), key=CLASSES.index)


@dataclass(frozen=True)
class IGeom:
    """Geometry of an I-shape or channel with the compression flange named (SI floats, internal)."""

    bfc: float
    tfc: float
    bft: float
    tft: float
    Sxc: float
    Sxt: float
    Iyc: float
    hc: float
    hp: float
    h: float


def igeom(p, compression: str = "top") -> IGeom:
    """Compression-side geometry of an I-shape or channel for major-axis bending (internal)."""
    top = compression == "top"
    bfc, tfc, bft, tft = ((p.bf_top, p.tf_top, p.bf_bot, p.tf_bot) if top
                          else (p.bf_bot, p.tf_bot, p.bf_top, p.tf_top))
    Sxc, Sxt = (p.Sx_top, p.Sx_bot) if top else (p.Sx_bot, p.Sx_top)
    Iyc = p.Iy_top if top else p.Iy_bot
    if top:
        hc = 2.0 * (p.d - p.tf_top - p.r - p.y_c)
        hp = 2.0 * (p.d - p.tf_top - p.r - p.y_pna)
    else:
        hc = 2.0 * (p.y_c - p.tf_bot - p.r)
        hp = 2.0 * (p.y_pna - p.tf_bot - p.r)
    return IGeom(bfc, tfc, bft, tft, Sxc, Sxt, Iyc, hc, hp, p.h_clear)


def _cls(calc: Calc, lam: float, lp: float, lr: float, kind: str) -> str:
    if kind == "f":
        if calc.cond(F_COMPACT, lam_f=lam, lam_pf=lp):
            return "compact"
        return "noncompact" if calc.cond(F_NONCOMP, lam_f=lam, lam_rf=lr) else "slender"
    if calc.cond(W_COMPACT, lam_w=lam, lam_pw=lp):
        return "compact"
    return "noncompact" if calc.cond(W_NONCOMP, lam_w=lam, lam_rw=lr) else "slender"


def classify_major(p, Fy: float, E: float, g: IGeom, calc: Calc, compression: str = "top") -> Classification:
    """Major-axis classification on SI floats (internal; records steps in ``calc``)."""
    if p.kind not in ("I_rolled", "I_welded", "channel"):
        raise not_covered(f"section kind {p.kind!r} ({kind_word(p)})", "Table B4.1b (other cases)")
    tw = p.tw
    # web first: the flange limit of a built-up section depends on it (FL)
    if p.symmetric:
        lw = calc(LAM_W, h=g.h, t_w=tw)
        lpw = calc(LAM_PW, E=E, F_y=Fy)
        lrw = calc(LAM_RW, E=E, F_y=Fy)
        wcase = 15
    else:
        lrw = calc(LAM_RW, E=E, F_y=Fy)
        if g.hc <= 0 or g.hp <= 0:
            calc.say("the elastic or plastic neutral axis lies in the compression flange: the web is in "
                     "tension; it is classified compact", reference=f"{_T} Case 16")
            lw, lpw = 0.0, lrw
        else:
            lw = calc(LAM_WC, h_c=g.hc, t_w=tw)
            Mp = calc(MP_CL, F_y=Fy, Z_x=p.Zx)
            My = calc(MY_CL, F_y=Fy, S_x=p.Sx)
            lpw = calc(LAM_PW16, h_c=g.hc, h_p=g.hp, E=E, F_y=Fy, M_p=Mp, M_y=My, lam_rw=lrw)
        wcase = 16
    wcls = _cls(calc, lw, lpw, lrw, "w")
    web = Element("web", lw, lpw, lrw, wcls, wcase)
    kc = FL = None
    if p.kind == "channel":
        lf = calc(LAM_F_C, b_f=g.bfc, t_f=g.tfc)
        lpf, lrf, fcase = calc(LAM_PF, E=E, F_y=Fy), calc(LAM_RF, E=E, F_y=Fy), 10
    elif p.kind == "I_rolled":
        lf = calc(LAM_F_I, b_fc=g.bfc, t_fc=g.tfc)
        lpf, lrf, fcase = calc(LAM_PF, E=E, F_y=Fy), calc(LAM_RF, E=E, F_y=Fy), 10
    else:
        lf = calc(LAM_F_I, b_fc=g.bfc, t_fc=g.tfc)
        lpf = calc(LAM_PF, E=E, F_y=Fy)
        kc = calc(KC, h=g.h, t_w=tw)
        if wcls == "slender":
            calc.say("slender web: FL = 0.7 Fy", reference=f"{_T} note [b]")
            FL = calc(FL_A, F_y=Fy)
        elif calc.cond(FL_COND, S_xt=g.Sxt, S_xc=g.Sxc):
            FL = calc(FL_A, F_y=Fy)
        else:
            FL = calc(FL_B, F_y=Fy, S_xt=g.Sxt, S_xc=g.Sxc)
        lrf = calc(LAM_RF_B, k_c=kc, E=E, F_L=FL)
        fcase = 11
    fcls = _cls(calc, lf, lpf, lrf, "f")
    if kc is None and fcls == "slender" and p.kind == "I_rolled":
        kc = calc(KC, h=g.h, t_w=tw)  # for Eq. F3-2 / F4-14 / F5-9
    fl = Element("flange", lf, lpf, lrf, fcls, fcase)
    return Classification("major", compression, fl, web, kc, FL)


def classify_minor(p, Fy: float, E: float, calc: Calc) -> Classification:
    """Minor-axis classification (Case 13): the more slender flange governs (internal)."""
    if p.kind not in ("I_rolled", "I_welded", "channel"):
        raise not_covered(f"section kind {p.kind!r} ({kind_word(p)}) about the minor axis",
                          "Table B4.1b (other cases)")
    top_slender = p.bf_top / p.tf_top >= p.bf_bot / p.tf_bot
    b, t = (p.bf_top, p.tf_top) if top_slender else (p.bf_bot, p.tf_bot)
    lf = calc(LAM_F_C, b_f=b, t_f=t) if p.kind == "channel" else calc(LAM_F_MI, b_f=b, t_f=t)
    lpf, lrf = calc(LAM_PF, E=E, F_y=Fy), calc(LAM_RF, E=E, F_y=Fy)
    fcls = _cls(calc, lf, lpf, lrf, "f")
    return Classification("minor", "top" if top_slender else "bottom", Element("flange", lf, lpf, lrf, fcls, 13),
                          None, None, None)


def classify(section, steel, axis: str = "major", compression: str = "top", *, steps: bool = True
             ) -> Classification:
    """Classify the flange and web of an I-shape or channel for flexure (AISC 360-22 Table B4.1b).

    Parameters
    ----------
    section : a calckit section (IShape, PlateGirder, Channel, catalog section) or its SectionProps.
    steel : grade name ("A992") or calckit Steel.
    axis : "major" (x-x) or "minor" (y-y).
    compression : "top" (sagging moment) or "bottom" (hogging) flange in compression (major axis).
    steps : keep the calc-sheet records.

    Raises NotCoveredError for other section kinds (naming the Table B4.1b cases that would apply).
    """
    from ...errors import InputError

    p = props(section)
    mat = material(steel, p)
    axis = _axis(axis)
    if compression not in ("top", "bottom"):
        raise InputError(f"compression: got {compression!r}; expected 'top' or 'bottom'")
    calc = Calc(steps)
    if axis == "major":
        c = classify_major(p, mat.Fy, mat.E, igeom(p, compression), calc, compression)
        c = Classification(c.axis, compression, c.flange, c.web, c.kc, c.FL, calc.take())
    else:
        c = classify_minor(p, mat.Fy, mat.E, calc)
        c = Classification(c.axis, c.compression, c.flange, None, None, None, calc.take())
    return c


def _axis(axis: str) -> str:
    from ...errors import InputError

    a = str(axis).strip().lower()
    if a in ("major", "x", "x-x", "strong"):
        return "major"
    if a in ("minor", "y", "y-y", "weak"):
        return "minor"
    raise InputError(f"axis: got {axis!r}; expected 'major' (x-x) or 'minor' (y-y)")
