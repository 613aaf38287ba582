"""Fillet welds to EN 1993-1-8:2005 Section 4 (the same interface as
:class:`calckit.design.aisc360.welds.FilletWelds`, so :mod:`calckit.design.shear_flow` drives either).

* simplified method, 4.5.3.3: ``F_w,Rd = f_vw,d a`` (Eq. 4.3), ``f_vw,d = (f_u / sqrt 3) / (beta_w
  gamma_M2)`` (Eq. 4.4), for the resultant of all forces per unit length, whatever its direction;
* directional method, 4.5.3.2: ``sqrt(sigma_perp^2 + 3 (tau_perp^2 + tau_par^2)) <= f_u / (beta_w
  gamma_M2)`` and ``sigma_perp <= 0.9 f_u / gamma_M2`` (Eq. 4.1). For the two fillet welds of a T-joint
  (flange to web) carrying a longitudinal force f cos(theta) and a force f sin(theta) in the plane of the
  web, per weld and unit length: tau_par = f cos(theta) / a, sigma_perp = tau_perp = f sin(theta) / (sqrt 2
  a), so that f <= min(a f_u / (beta_w gamma_M2 sqrt(3 cos^2 theta + 2 sin^2 theta)), 0.9 sqrt 2 a f_u /
  (gamma_M2 sin theta)) (derived here from Eq. 4.1; at theta = 0 it equals the simplified method);
* correlation factor beta_w, Table 4.1: S235 0.80, S275 0.85, S355 0.90, S420 and S460 1.00;
  f_u of the weaker part joined (EN 1993-1-1 Table 3.1 values from :func:`calckit.steel`);
  gamma_M2 = 1.25 recommended (EN 1993-1-8 2.2 Table 2.1; the National Annex may differ);
* minimum throat 3 mm, 4.5.2(2); no code maximum: a <= 0.7 t of the thinner part is used as a soft limit
  (common practice: a full-strength double fillet weld is smaller);
* effective length: welds shorter than max(30 mm, 6 a) carry no load, 4.5.2(2); the length is taken as
  full-size over its length (4.5.2(1): no end reduction when the weld is full size at starts and ends);
* intermittent welds, 4.3.5 and Figure 4.1: gap L2 <= min(12 t, 0.25 b, 200 mm) (compression or shear),
  L1 <= min(16 t, 200 mm) (tension), t the thinner part and b the narrower part; a continuous length
  L_we >= 0.75 b at each end of the part (4.3.5(5)); not in corrosive conditions (4.3.5(1)).

Clause, table and equation numbers are from memory of EN 1993-1-8:2005 (+AC:2009); check them against the
standard and the National Annex. Sizes are throat thicknesses a (``size_kind = "throat"``), SI floats.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
import re
from dataclasses import dataclass, replace

import numpy as np

from ...errors import InputError
from ...render.formula import Formula
from ...render.records import given

__all__ = ["FilletWelds", "STANDARD", "GAMMA_M2", "BETA_W", "beta_w", "MIN_THROAT", "f_vwd"]

STANDARD = "EN 1993-1-8:2005"
GAMMA_M2 = 1.25  #: EN 1993-1-8 Table 2.1 recommended value (NDP)
MIN_THROAT = 3e-3  #: m, 4.5.2(2)
#: Table 4.1 correlation factor by grade (EN 10025 designations)
BETA_W = {"S235": 0.80, "S275": 0.85, "S355": 0.90, "S420": 1.00, "S460": 1.00}
#: Throat sizes stocked for design, mm (common practice)
SIZES = tuple(a * 1e-3 for a in (3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 14, 16))
_TOL = 1e-9

_D = {"a": "length", "f_u": "stress", "f_vw_d": "stress", "F_w_Rd": "shear_flow", "q_c": "shear_flow",
      "theta": "angle", "L_w": "length"}


def _f(symbol: str, expr: str, table: dict | None = None, **kw) -> Formula:
    """A Formula whose dims are taken from ``table`` (default: this module's _D) for the symbols it uses."""
    table = _D if table is None else table
    used = set(re.findall(r"[A-Za-z_][A-Za-z0-9_]*", expr)) | {symbol}
    return Formula(symbol, expr, dims={k: v for k, v in table.items() if k in used}, **kw)


F_VWD = _f("f_vw_d", "f_u/(sqrt(3)*beta_w*gamma_M2)", ref="EN 1993-1-8 4.5.3.3 Eq. (4.4)",
           label="design shear strength of the weld")
FW_SIMPLE = _f("F_w_Rd", "f_vw_d*a", ref="EN 1993-1-8 4.5.3.3 Eq. (4.3)",
               label="design resistance per weld per unit length (any direction)")
FW_DIRECT = _f("F_w_Rd", "Min(a*f_u/(beta_w*gamma_M2*sqrt(3*cos(theta)**2 + 2*sin(theta)**2)), "
                         "0.9*sqrt(2)*a*f_u/(gamma_M2*sin(theta)))",
               ref="EN 1993-1-8 4.5.3.2 Eq. (4.1), T-joint with two fillet welds",
               label="design resistance per weld per unit length at angle theta to the weld axis")
F_RD_GROUP = Formula("F_Rd", "F_w_Rd*(L_l + L_t)", dims={"F_Rd": "force", "F_w_Rd": "shear_flow",
                                                        "L_l": "length", "L_t": "length"},
                     ref="EN 1993-1-8 4.5.3.3", label="longitudinal plus transverse welds (simplified method)")
Q_C = _f("q_c", "n_w*F_w_Rd", ref="EN 1993-1-8 4.5.3", label="resistance of the welds of one junction")


def beta_w(grade: str) -> float:
    """Correlation factor of Table 4.1 for an EN grade name ("S355", "S355J2", "S460N" ...)."""
    g = str(grade).upper().replace(" ", "")[:4]
    if g not in BETA_W:
        raise InputError(f"steel: got {grade!r}; expected an EN 10025 grade with a Table 4.1 beta_w "
                         f"({', '.join(BETA_W)}), or give beta_w")
    return BETA_W[g]


def f_vwd(fu: float, beta: float, gamma_M2: float = GAMMA_M2) -> float:
    """f_vw,d (Pa), EN 1993-1-8 Eq. (4.4)."""
    return float(F_VWD(f_u=fu, beta_w=beta, gamma_M2=gamma_M2))


@dataclass(frozen=True)
class FilletWelds:
    """EN 1993-1-8 fillet-weld rules for one design.

    method: "simplified" (4.5.3.3) or "directional" (4.5.3.2); gamma_M2; fu (Pa) and beta_w of the weaker
    part joined — set by :meth:`bind` from the steel and the thicknesses joined, or given.
    """

    method: str = "simplified"
    gamma_M2: float = GAMMA_M2
    fu: float | None = None
    beta_w: float | None = None
    grade: str = ""

    standard = STANDARD
    size_kind = "throat"  #: sizes are throat thicknesses a
    size_symbol = "a"
    pitch_step = 10e-3  #: pitches rounded down to 10 mm (common practice)
    length_step = 10e-3  #: segment lengths rounded up to 10 mm (common practice)
    min_practical_segment = 50e-3  #: shortest segment chosen by default (common practice)

    def __post_init__(self):
        m = str(self.method).lower()
        if m not in ("simplified", "directional"):
            raise InputError(f"method: got {self.method!r}; expected 'simplified' (EN 1993-1-8 4.5.3.3) or "
                             "'directional' (4.5.3.2)")
        object.__setattr__(self, "method", m)
        g = self.gamma_M2
        if isinstance(g, bool) or not isinstance(g, (int, float)) or not 1.0 <= g <= 2.0:
            raise InputError(f"gamma_M2: got {g!r}; expected a partial factor between 1.0 and 2.0 "
                             "(recommended 1.25, EN 1993-1-8 Table 2.1)")
        if self.beta_w is not None and not 0.5 <= self.beta_w <= 1.2:
            raise InputError(f"beta_w: got {self.beta_w!r}; expected a Table 4.1 value 0.8 to 1.0")
        if self.fu is not None and not (math.isfinite(self.fu) and 200e6 <= self.fu <= 1000e6):
            raise InputError(f"fu: got {self.fu!r} Pa; expected an ultimate strength 200 to 1000 MPa")

    def bind(self, steel, thicknesses) -> "FilletWelds":
        """Rules for a joint of ``steel`` (calckit Steel or grade) parts ``thicknesses`` (m): f_u of the
        weaker part (EN 1993-1-1 Table 3.1 band by thickness) and beta_w from Table 4.1."""
        from ...materials import steel as _steel

        s = _steel(steel)
        if s.standard != "EN":
            raise InputError(f"steel: got {s.name!r} ({s.standard}); EN 1993-1-8 welds need an EN grade "
                             "(S235 ... S460), or give fu and beta_w")
        fu = self.fu if self.fu is not None else min(s.fu_si(t) for t in thicknesses if t > 0)
        bw = self.beta_w if self.beta_w is not None else beta_w(s.name)
        return replace(self, fu=fu, beta_w=bw, grade=s.name)

    def _need(self):
        if self.fu is None or self.beta_w is None:
            raise InputError("fu/beta_w: not set; call bind(steel, thicknesses) or give fu and beta_w")

    # -- sizes ---------------------------------------------------------------------------------------
    def sizes(self) -> tuple[float, ...]:
        return SIZES

    def size_text(self, a: float) -> str:
        return f"a = {a * 1e3:.3g} mm"

    def min_size(self, t_thin: float) -> tuple[float, str]:
        return MIN_THROAT, "EN 1993-1-8 4.5.2(2): a >= 3 mm"

    def max_size(self, t_thin: float, *, edge: bool = False) -> tuple[float, str, bool]:
        return 0.7 * t_thin, "no code maximum; a <= 0.7 t of the thinner part (common practice)", False

    def min_segment(self, a: float) -> tuple[float, str]:
        return max(30e-3, 6.0 * a), "EN 1993-1-8 4.5.2(2): l_eff >= 30 mm and >= 6 a"

    def max_pitch(self, *, L_w: float, t: float, b: float, t_outside: float = 0.0, fy: float = 0.0,
                  E: float = 0.0, compression: bool = True, weathering: bool = False,
                  tension_member: bool = False) -> tuple[float, str]:
        """Largest pitch (m) of chain intermittent welds: L_w plus the largest gap of Figure 4.1, with t the
        thinner part and b the narrower part. Welds carrying shear flow are 'in shear', so L2 applies
        whatever the flange stress (``compression`` is not used); L1 only for a built-up tension member."""
        if not tension_member:
            gap = min(12.0 * t, 0.25 * b, 0.200)
            c = "EN 1993-1-8 4.3.5, Fig. 4.1: L2 <= 12 t, 0.25 b and 200 mm (compression or shear)"
        else:
            gap = min(16.0 * t, 0.200)
            c = "EN 1993-1-8 4.3.5, Fig. 4.1: L1 <= 16 t and 200 mm (tension)"
        return L_w + gap, c

    def end_length(self, b: float) -> tuple[float, str]:
        return 0.75 * b, "EN 1993-1-8 4.3.5(5): continuous L_we >= 0.75 b at each end"

    # -- strength (fast path) -------------------------------------------------------------------------
    def capacity(self, a, theta=0.0):
        """Design resistance per weld per unit length (N/m) for throat ``a`` and load angle ``theta``."""
        self._need()
        if self.method == "simplified":
            fvw = F_VWD(f_u=self.fu, beta_w=self.beta_w, gamma_M2=self.gamma_M2)
            r = FW_SIMPLE(f_vw_d=fvw, a=a)
            return r * np.ones_like(np.asarray(theta, dtype=float)) if np.ndim(theta) else r
        a_arr, th = np.broadcast_arrays(np.asarray(a, dtype=float), np.asarray(theta, dtype=float))
        with np.errstate(divide="ignore", invalid="ignore"):
            r = FW_DIRECT(a=a_arr, f_u=self.fu, beta_w=self.beta_w, gamma_M2=self.gamma_M2, theta=th)
        return float(r) if np.ndim(r) == 0 else np.asarray(r)

    def base_metal(self, t_w: float, F_u: float) -> float | None:
        """EN 1993-1-8 has no separate base-metal check for fillet welds with matching electrodes (4.2)."""
        return None

    def combined(self, a: float, L_l: float, L_t: float) -> float:
        """Resistance (N) of longitudinal plus transverse welds: the simplified method sums F_w,Rd over the
        length (4.5.3.3), whatever the direction."""
        self._need()
        fvw = F_VWD(f_u=self.fu, beta_w=self.beta_w, gamma_M2=self.gamma_M2)
        return float(FW_SIMPLE(f_vw_d=fvw, a=a)) * (L_l + L_t)

    def termination(self, b_p: float, t_p: float, w_end):
        from ...errors import NotCoveredError

        raise NotCoveredError("cover-plate termination: EN 1993-1-8 gives no termination length like AISC "
                              "360-22 F13.3; give the extension beyond the theoretical cut-off (extension=)")

    # -- calc-sheet steps -----------------------------------------------------------------------------
    def capacity_steps(self, a: float, theta: float, n_w: int) -> list:
        """Steps from the throat to the junction resistance q_c (the last step)."""
        self._need()
        recs = [given("a", a, "length", reference="fillet weld throat thickness"),
                given("f_u", self.fu, "stress", reference=f"EN 1993-1-1 Table 3.1, weaker part ({self.grade})"),
                given("beta_w", self.beta_w, "dimensionless", reference="EN 1993-1-8 Table 4.1"),
                given("gamma_M2", self.gamma_M2, "dimensionless", reference="EN 1993-1-8 Table 2.1 (NDP)")]
        if self.method == "simplified":
            fvw = F_VWD.step(f_u=self.fu, beta_w=self.beta_w, gamma_M2=self.gamma_M2); recs.append(fvw)
            fw = FW_SIMPLE.step(f_vw_d=fvw, a=a)
        else:
            recs.append(given("theta", float(theta), "angle", reference="angle of the resultant to the weld axis"))
            fw = FW_DIRECT.step(a=a, f_u=self.fu, beta_w=self.beta_w, gamma_M2=self.gamma_M2, theta=float(theta))
        recs.append(fw)
        recs.append(Q_C.step(n_w=float(n_w), F_w_Rd=fw, note=f"{n_w} fillet welds, one each side of the web"))
        return recs

    def base_metal_steps(self, t_w: float, F_u: float) -> list:
        return []

    def combined_steps(self, a: float, L_l: float, L_t: float) -> list:
        fvw = F_VWD.step(f_u=self.fu, beta_w=self.beta_w, gamma_M2=self.gamma_M2)
        fw = FW_SIMPLE.step(f_vw_d=fvw, a=a)
        return [fvw, fw, F_RD_GROUP.step(F_w_Rd=fw, L_l=L_l, L_t=L_t)]
