"""Fillet welds to AISC 360-22 Section J2, and connector spacing in built-up flexural members.

:class:`FilletWelds` holds the rules one weld design needs (the same interface as
:class:`calckit.design.en1993.welds.FilletWelds`, so :mod:`calckit.design.shear_flow` drives either):

* strength per unit length, J2.4: ``R_n = F_nw A_we`` (Eq. J2-4) with ``F_nw = 0.60 F_EXX (1.0 + 0.50
  sin^1.5 theta)`` (Eq. J2-5; the directional increase applies to a linear weld group of uniform leg size
  loaded through its centre of gravity, J2.4(a)); effective throat of an equal-leg fillet 0.707 w (J2.2a,
  no credit for penetration); LRFD phi = 0.75, ASD Omega = 2.00. For E70 electrodes this is the steel
  manual's 1.392 D kip/in (LRFD) and 0.928 D kip/in (ASD) per weld, D in sixteenths of an inch;
* base metal at the web, J2.4 with J4.2(b): shear rupture ``R_n = 0.60 F_u A_nv`` (Eq. J4-4), phi 0.75,
  Omega 2.00, with A_nv = t_w per unit length (both welds of a junction load the one web);
* minimum size, Table J2.4 (thinner part joined): t <= 1/4 in: 1/8 in; 1/4 < t <= 1/2: 3/16;
  1/2 < t <= 3/4: 1/4; t > 3/4 in: 5/16 in;
* maximum size, J2.2b(b), along edges of material: t < 1/4 in: t; t >= 1/4 in: t - 1/16 in. A T-joint
  (flange-to-web) weld has no code maximum; the base-metal check then governs its useful size;
* intermittent welds, J2.2b(e): segment length >= 4 w and >= 1-1/2 in (38 mm);
* combined longitudinal and transverse welds (cover-plate ends), J2.4(c): ``R_n = max(R_nwl + R_nwt,
  0.85 R_nwl + 1.5 R_nwt)`` (Eqs. J2-10a/b in 360-22 numbering, from memory), no directional increase;
* partial-length cover plates, F13.3: termination length a' = w_p (end weld w >= 3/4 t_p), 1.5 w_p (end
  weld w < 3/4 t_p), 2 w_p (no end weld) (Eqs. F13-7 to F13-9, w_p the plate width);
* longitudinal spacing of welds or fasteners in built-up flexural members, F13.3, by reference to E6.2
  (compression: 0.75 sqrt(E/F_y) t of the thinner outside plate and 12 in; weathering steel 14 t and
  7 in) or D4 (tension: 24 t and 12 in); bolts J3.5 (24 t and 12 in painted; 14 t and 7 in weathering)
  and J3.3 (minimum 2-2/3 d).

Clause and equation numbers are from memory of AISC 360-22 (and 360-16, same rules); check them against
the standard. Spacing limits are applied to the pitch (centre-to-centre), which is conservative when the
standard's limit is read as a clear gap. Sizes are leg sizes (``size_kind = "leg"``), SI floats (m).

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
import re
from dataclasses import dataclass
from fractions import Fraction

import numpy as np

from ...errors import InputError
from ...render.formula import Formula
from ...render.records import decide, given

__all__ = ["FilletWelds", "STANDARD", "PHI_W", "OMEGA_W", "E70", "min_fillet_size", "max_fillet_size",
           "min_intermittent_length", "termination_length", "max_connector_spacing", "max_bolt_spacing",
           "min_bolt_spacing", "electrode_strength"]

STANDARD = "AISC 360-22"
PHI_W = 0.75  #: J2.4, LRFD resistance factor for welds and for base-metal shear rupture (J4.2)
OMEGA_W = 2.00  #: J2.4, ASD safety factor
INCH = 0.0254
SIXTEENTH = INCH / 16.0
KSI = 6.894757293168361e6
E70 = 70.0 * KSI  #: F_EXX of E70XX electrodes, Pa
#: Leg sizes stocked for design, 1/8 in to 1 in (common practice)
SIZES = tuple(k * SIXTEENTH for k in (2, 3, 4, 5, 6, 7, 8, 10, 12, 14, 16))
_TOL = 1e-9

_D = {"w": "length", "t_e": "length", "F_nw": "stress", "F_EXX": "stress", "theta": "angle",
      "r_n": "shear_flow", "r_a": "shear_flow", "q_c": "shear_flow", "F_u": "stress", "t_w": "length",
      "r_nbm": "shear_flow", "r_abm": "shear_flow"}


def _f(symbol: str, expr: str, table: dict | None = None, **kw) -> Formula:
    """A Formula whose dims are taken from ``table`` (default: this module's _D) for the symbols it uses."""
    table = _D if table is None else table
    used = set(re.findall(r"[A-Za-z_][A-Za-z0-9_]*", expr)) | {symbol}
    return Formula(symbol, expr, dims={k: v for k, v in table.items() if k in used}, **kw)


T_E = _f("t_e", "0.707*w", ref="AISC 360-22 J2.2a", label="effective throat, equal-leg fillet")
F_NW = _f("F_nw", "0.60*F_EXX*(1.0 + 0.50*sin(theta)**1.5)", ref="AISC 360-22 Eq. J2-5",
          label="nominal weld stress (directional increase for theta > 0)")
R_N = _f("r_n", "F_nw*t_e", ref="AISC 360-22 Eq. J2-4 (per unit length)",
         label="nominal strength per weld per unit length")
R_A_LRFD = _f("r_a", "phi_w*r_n", latex={"r_a": r"\phi r_{n}"}, ref="AISC 360-22 J2.4 (LRFD)",
              label="design strength per weld per unit length")
R_A_ASD = _f("r_a", "r_n/Omega_w", latex={"r_a": r"r_{n}/\Omega"}, ref="AISC 360-22 J2.4 (ASD)",
             label="allowable strength per weld per unit length")
Q_C_LRFD = _f("q_c", "n_w*r_a", latex={"r_a": r"\phi r_{n}"}, ref="AISC 360-22 J2.4",
              label="strength of the welds of one junction")
Q_C_ASD = _f("q_c", "n_w*r_a", latex={"r_a": r"r_{n}/\Omega"}, ref="AISC 360-22 J2.4",
             label="strength of the welds of one junction")
R_NBM = _f("r_nbm", "0.60*F_u*t_w", latex={"r_nbm": r"r_{n,bm}"}, ref="AISC 360-22 Eq. J4-4 (A_nv = t_w per unit length)",
           label="shear rupture of the web at the welds, per unit length")
R_ABM_LRFD = _f("r_abm", "phi*r_nbm", latex={"r_abm": r"\phi r_{n,bm}", "r_nbm": r"r_{n,bm}"},
                ref="AISC 360-22 J4.2 (phi = 0.75)", label="design shear rupture strength of the web")
R_ABM_ASD = _f("r_abm", "r_nbm/Omega", latex={"r_abm": r"r_{n,bm}/\Omega", "r_nbm": r"r_{n,bm}"},
               ref="AISC 360-22 J4.2 (Omega = 2.00)", label="allowable shear rupture strength of the web")
_DT = {"R_n": "force", "R_nwl": "force", "R_nwt": "force", "R_a": "force", "r_n": "shear_flow",
       "L_l": "length", "L_t": "length"}
J2_10 = _f("R_n", "Max(r_n*L_l + r_n*L_t, 0.85*r_n*L_l + 1.5*r_n*L_t)", _DT,
           ref="AISC 360-22 J2.4(c), Eqs. J2-10a/b (numbering from memory)",
           label="longitudinal plus transverse fillet welds, no directional increase")
RA_LRFD = _f("R_a", "phi*R_n", _DT, latex={"R_a": r"\phi R_{n}"}, ref="AISC 360-22 J2.4 (LRFD)",
             label="design strength of the weld group")
RA_ASD = _f("R_a", "R_n/Omega", _DT, latex={"R_a": r"R_{n}/\Omega"}, ref="AISC 360-22 J2.4 (ASD)",
            label="allowable strength of the weld group")


def electrode_strength(electrode) -> float:
    """F_EXX (Pa) from "E70" (AWS classification strength in ksi), a stress quantity/string, or an SI float."""
    m = re.fullmatch(r"E(\d+)X*", electrode.strip().upper()) if isinstance(electrode, str) else None
    if m:
        v = float(m.group(1)) * KSI  # AWS classification: the number is the tensile strength in ksi
    elif isinstance(electrode, (int, float)) and not isinstance(electrode, bool):
        v = float(electrode)
    else:
        from ...units import to_si

        v = to_si(electrode, "stress", "F_EXX", allow_array=False)
    if not (math.isfinite(v) and 40 * KSI <= v <= 130 * KSI):
        raise InputError(f"F_EXX: got {electrode!r}; expected an electrode classification such as 'E70' or a "
                         "strength between 40 and 130 ksi")
    return v


def size_text(w: float) -> str:
    """A leg size in the trade's form: '5/16 in' (sixteenths), or inches to 3 decimals."""
    k = w / SIXTEENTH
    if abs(k - round(k)) < 1e-6:
        f = Fraction(int(round(k)), 16)
        return f"{f.numerator}/{f.denominator} in" if f.denominator != 1 else f"{f.numerator} in"
    return f"{w / INCH:.3f} in"


def min_fillet_size(t_thin: float) -> tuple[float, str]:
    """Minimum leg size (m) for the thinner part joined ``t_thin`` (m), AISC 360-22 Table J2.4."""
    t = t_thin / INCH
    if t <= 0.25 + _TOL:
        k = 2
    elif t <= 0.5 + _TOL:
        k = 3
    elif t <= 0.75 + _TOL:
        k = 4
    else:
        k = 5
    return k * SIXTEENTH, "AISC 360-22 Table J2.4"


def max_fillet_size(t_edge: float) -> tuple[float, str]:
    """Maximum leg size (m) along an edge of material ``t_edge`` thick (m), AISC 360-22 J2.2b(b)."""
    if t_edge < 0.25 * INCH - _TOL:
        return t_edge, "AISC 360-22 J2.2b(b): t < 1/4 in, w <= t"
    return t_edge - SIXTEENTH, "AISC 360-22 J2.2b(b): t >= 1/4 in, w <= t - 1/16 in"


def min_intermittent_length(w: float) -> tuple[float, str]:
    """Minimum segment length (m) of an intermittent fillet weld of leg ``w``, J2.2b(e): max(4 w, 1.5 in)."""
    return max(4.0 * w, 1.5 * INCH), "AISC 360-22 J2.2b(e): >= 4 w and >= 1-1/2 in"


def termination_length(b_p: float, t_p: float, w_end: float | None) -> tuple[float, str]:
    """a' (m) for a partial-length welded cover plate of width ``b_p`` and thickness ``t_p``, F13.3.

    ``w_end``: leg of the continuous weld across the plate end (None: no end weld).
    """
    if w_end is None or w_end <= 0:
        return 2.0 * b_p, "AISC 360-22 Eq. F13-9 (no end weld): a' = 2 w"
    if w_end >= 0.75 * t_p - _TOL:
        return b_p, "AISC 360-22 Eq. F13-7 (end weld >= 3/4 t): a' = w"
    return 1.5 * b_p, "AISC 360-22 Eq. F13-8 (end weld < 3/4 t): a' = 1.5 w"


def max_connector_spacing(t: float, *, Fy: float, E: float, compression: bool = True,
                          weathering: bool = False) -> tuple[float, str]:
    """Longitudinal spacing limit (m) of intermittent welds or fasteners joining a plate ``t`` thick (the
    thinner outside plate) in a built-up flexural member, AISC 360-22 F13.3 by reference to E6.2
    (compression) or D4 (tension)."""
    if weathering:
        return min(14.0 * t, 7.0 * INCH), ("AISC 360-22 F13.3 / E6.2(b) / D4: weathering steel, 14 t and 7 in")
    if compression:
        return (min(0.75 * math.sqrt(E / Fy) * t, 12.0 * INCH),
                "AISC 360-22 F13.3 / E6.2: 0.75 sqrt(E/F_y) t and 12 in (compression)")
    return min(24.0 * t, 12.0 * INCH), "AISC 360-22 F13.3 / D4: 24 t and 12 in (tension)"


def max_bolt_spacing(t: float, *, weathering: bool = False) -> tuple[float, str]:
    """Maximum bolt spacing (m) for a thinner part ``t`` thick, AISC 360-22 J3.5."""
    if weathering:
        return min(14.0 * t, 7.0 * INCH), "AISC 360-22 J3.5(b): 14 t and 7 in (weathering steel)"
    return min(24.0 * t, 12.0 * INCH), "AISC 360-22 J3.5(a): 24 t and 12 in (painted or not corroding)"


def min_bolt_spacing(d_b: float) -> tuple[float, str]:
    """Minimum bolt spacing (m), AISC 360-22 J3.3: 2-2/3 d (3 d preferred)."""
    return 8.0 / 3.0 * d_b, "AISC 360-22 J3.3: 2-2/3 d"


@dataclass(frozen=True)
class FilletWelds:
    """AISC 360-22 fillet-weld rules for one design (LRFD or ASD, one electrode).

    method: "LRFD" or "ASD"; F_EXX: electrode classification strength, Pa; directional: use the J2.4(a)
    directional increase when the resultant is inclined to the weld axis (theta > 0).
    """

    method: str = "LRFD"
    F_EXX: float = E70
    directional: bool = True

    standard = STANDARD
    size_kind = "leg"  #: sizes are leg sizes w
    size_symbol = "w"
    pitch_step = 0.5 * INCH  #: pitches are rounded down to 1/2 in (common practice)
    length_step = 0.5 * INCH  #: segment lengths are rounded up to 1/2 in (common practice)
    min_practical_segment = 2.0 * INCH  #: shortest segment chosen by default (common practice)

    def __post_init__(self):
        m = str(self.method).upper()
        if m not in ("LRFD", "ASD"):
            raise InputError(f"method: got {self.method!r}; expected 'LRFD' or 'ASD' (AISC 360-22 B3)")
        object.__setattr__(self, "method", m)
        object.__setattr__(self, "F_EXX", electrode_strength(self.F_EXX))

    def bind(self, steel, thicknesses) -> "FilletWelds":
        """The same rules (AISC weld-metal strength does not depend on the parts joined)."""
        return self

    # -- sizes -------------------------------------------------------------------------------------
    def sizes(self) -> tuple[float, ...]:
        return SIZES

    def size_text(self, w: float) -> str:
        return size_text(w)

    def min_size(self, t_thin: float) -> tuple[float, str]:
        return min_fillet_size(t_thin)

    def max_size(self, t_thin: float, *, edge: bool = False) -> tuple[float, str, bool]:
        """(w_max, clause, hard): hard limits raise for an explicit size; soft ones only make a note."""
        if edge:
            w, c = max_fillet_size(t_thin)
            return w, c, True
        return t_thin, "no code maximum for a T-joint; w <= thinner part (common practice)", False

    def min_segment(self, w: float) -> tuple[float, str]:
        return min_intermittent_length(w)

    def max_pitch(self, *, L_w: float, t: float, b: float, t_outside: float = 0.0, fy: float = 0.0,
                  E: float = 0.0, compression: bool = True, weathering: bool = False) -> tuple[float, str]:
        """Spacing limit of F13.3 (E6.2 / D4) for the outside plate ``t_outside`` (flange or cover plate);
        ``t`` (thinner part) and ``b`` are not used by AISC."""
        return max_connector_spacing(t_outside or t, Fy=fy, E=E, compression=compression, weathering=weathering)

    def end_length(self, b: float) -> tuple[float, str]:
        return 0.0, ""

    # -- strength (fast path: the same Formulas on arrays) -------------------------------------------
    def _theta(self, theta):
        return theta if self.directional else np.zeros_like(np.asarray(theta, dtype=float))

    def capacity(self, w, theta=0.0):
        """Available strength per weld per unit length (N/m) for leg ``w`` and load angle ``theta``."""
        F_nw = F_NW(F_EXX=self.F_EXX, theta=self._theta(theta))
        r_n = R_N(F_nw=F_nw, t_e=T_E(w=w))
        return R_A_LRFD(phi_w=PHI_W, r_n=r_n) if self.method == "LRFD" else R_A_ASD(Omega_w=OMEGA_W, r_n=r_n)

    def base_metal(self, t_w: float, F_u: float) -> float:
        """Available shear-rupture strength of the web at a junction, per unit length (N/m), J4.2."""
        r = R_NBM(F_u=F_u, t_w=t_w)
        return R_ABM_LRFD(phi=PHI_W, r_nbm=r) if self.method == "LRFD" else R_ABM_ASD(Omega=OMEGA_W, r_nbm=r)

    def combined(self, w: float, L_l: float, L_t: float) -> float:
        """Available strength (N) of longitudinal (length L_l) plus transverse (L_t) welds of leg w, J2.4(c)."""
        r_n = R_N(F_nw=F_NW(F_EXX=self.F_EXX, theta=0.0), t_e=T_E(w=w))
        Rn = J2_10(r_n=r_n, L_l=L_l, L_t=L_t)
        return PHI_W * Rn if self.method == "LRFD" else Rn / OMEGA_W

    def termination(self, b_p: float, t_p: float, w_end: float | None) -> tuple[float, str]:
        return termination_length(b_p, t_p, w_end)

    # -- calc-sheet steps ------------------------------------------------------------------------------
    def capacity_steps(self, w: float, theta: float, n_w: int) -> list:
        """Steps from the weld size to the junction strength q_c (the last step)."""
        th = float(self._theta(theta))
        recs = [given("w", w, "length", note=self.size_text(w), reference="weld leg size"),
                given("F_EXX", self.F_EXX, "stress", reference="electrode classification strength")]
        if theta > 0 and not self.directional:
            recs.append(decide("directional increase not used (directional=False): theta taken as 0",
                               reference="AISC 360-22 J2.4(a)"))
        recs.append(given("theta", th, "angle", reference="angle of the resultant to the weld axis"))
        te = T_E.step(w=w); recs.append(te)
        fnw = F_NW.step(F_EXX=self.F_EXX, theta=th); recs.append(fnw)
        rn = R_N.step(F_nw=fnw, t_e=te); recs.append(rn)
        ra = (R_A_LRFD.step(phi_w=PHI_W, r_n=rn) if self.method == "LRFD"
              else R_A_ASD.step(Omega_w=OMEGA_W, r_n=rn))
        recs.append(ra)
        qc = Q_C_LRFD if self.method == "LRFD" else Q_C_ASD
        recs.append(qc.step(n_w=float(n_w), r_a=ra, note=f"{n_w} fillet welds, one each side of the web"))
        return recs

    def base_metal_steps(self, t_w: float, F_u: float) -> list:
        r = R_NBM.step(F_u=F_u, t_w=t_w)
        a = R_ABM_LRFD.step(phi=PHI_W, r_nbm=r) if self.method == "LRFD" else R_ABM_ASD.step(Omega=OMEGA_W, r_nbm=r)
        return [r, a]

    def combined_steps(self, w: float, L_l: float, L_t: float) -> list:
        rn = R_N.step(F_nw=F_NW.step(F_EXX=self.F_EXX, theta=0.0), t_e=T_E.step(w=w))
        Rn = J2_10.step(r_n=rn, L_l=L_l, L_t=L_t)
        Ra = (RA_LRFD.step(phi=PHI_W, R_n=Rn) if self.method == "LRFD"
              else RA_ASD.step(Omega=OMEGA_W, R_n=Rn))
        return [rn, Rn, Ra]
