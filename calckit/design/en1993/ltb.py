"""Lateral-torsional buckling resistance, EN 1993-1-1:2005 6.3.2.

- 6.3.2.2 (general case): Phi_LT = 0.5 [1 + alpha_LT (lambda_LT - 0.2) + lambda_LT^2],
  chi_LT = 1/(Phi_LT + sqrt(Phi_LT^2 - lambda_LT^2)) <= 1 (6.56); curves Table 6.4.
- 6.3.2.3 (rolled or equivalent welded sections): Phi_LT = 0.5 [1 + alpha_LT (lambda_LT - lambda_LT,0)
  + beta lambda_LT^2], chi_LT = 1/(Phi_LT + sqrt(Phi_LT^2 - beta lambda_LT^2)) <= 1 and <= 1/lambda_LT^2
  (6.57); curves Table 6.5; optional chi_LT,mod = chi_LT/f <= 1, <= 1/lambda_LT^2 with
  f = 1 - 0.5 (1 - k_c)[1 - 2 (lambda_LT - 0.8)^2] <= 1 (6.58), k_c from Table 6.6 (or 1/sqrt(C1) where the
  annex set says so).
- Imperfection factors Table 6.3: a 0.21, b 0.34, c 0.49, d 0.76.
- lambda_LT = sqrt(W_y f_y/M_cr), M_b,Rd = chi_LT W_y f_y/gamma_M1 (6.55); W_y per the class (6.3.2.2(1)).
- 6.3.2.2(4): for lambda_LT <= lambda_LT,0 (or M_Ed/M_cr <= lambda_LT,0^2) buckling effects may be
  ignored; calckit reports it and uses chi_LT from the curve (which is 1 on the plateau of 6.3.2.3 and
  slightly below 1 between 0.2 and 0.4 for the general case, conservative).
M_cr: :mod:`.mcr` (three-factor formula with C1, C2, C3 from the moment diagram) for segments between
lateral-torsional restraints, shown in three steps (:func:`mcr_three_factor`: N_cr,z = pi^2 E I_z/(k L)^2,
the root term R_LT, then M_cr = C1 N_cr,z [R_LT - (C2 z_g - C3 z_j)]); for a cantilever or an overhang (one free end) M_cr comes directly from the
energy solution of :mod:`.cantilever` (built-in root, or the overhang solved with the segment behind its
root support), shown as M_cr = gamma_cr sqrt(E I_z G I_t)/L with gamma_cr from that solution; C1 is not
used there, and f = 1 (Table 6.6 lists no cantilever case).

Table 6.6 k_c (EN 1993-1-1:2005, from memory): uniform 1.0; linear 1/(1.33 - 0.33 psi); simply supported
UDL 0.94; UDL with both ends fixed 0.90; UDL with one end fixed 0.91; central point load 0.86; with both
ends fixed 0.77; with one end fixed 0.82. A diagram that matches none of these within 3 % of its peak
gets f = 1 (no modification, conservative).
"""
from __future__ import annotations

import math

import numpy as np

from ...errors import InputError
from ._calc import Calc, condition, formula
from ._common import STANDARD, Material, demand, length, material, section_props, value
from ._result import ENResult, rated
from .bending import section_modulus
from .classify import classify_si
from .factors import AnnexSet, annex_set
from .cantilever import OverhangModel, gamma_cr, model as _cant_model
from .mcr import SN003_TABLE, shape, standard_diagram, z_j

__all__ = ["ltb", "ltb_si", "mcr_three_factor", "chi_lt", "imperfection", "kc_table66", "ALPHA_LT", "Diagram", "diagram",
           "cantilever_diagram", "overhang_model"]

_R = "EN 1993-1-1:2005"
ALPHA_LT = {"a0": 0.13, "a": 0.21, "b": 0.34, "c": 0.49, "d": 0.76}  #: Table 6.3

_DIMS_MCR = {"M_cr": "moment", "E": "stress", "G": "stress", "I_z": "inertia", "I_t": "inertia",
             "I_w": "warping", "L": "span", "z_g": "length", "z_j": "length", "N_cr_z": "force",
             "R_LT": "length"}
_REF_MCR = "ENV 1993-1-1:1992 Annex F Eq. (F.2); NCCI SN003 Eq. (1)"
# The three-factor formula
#   M_cr = C1 pi^2 E I_z/(k L)^2 [sqrt((k/k_w)^2 I_w/I_z + (k L)^2 G I_t/(pi^2 E I_z) + (C2 z_g - C3 z_j)^2)
#          - (C2 z_g - C3 z_j)]
# written as the three steps an engineer checks by hand; the value is computed through the same three
# formulas on both paths (steps=True records them, steps=False evaluates them).
F_NCR_Z = formula("N_cr_z", "pi**2*E*I_z/(k*L)**2", _REF_MCR + ", first factor",
                  "elastic critical force, flexural buckling about the minor axis", dims=_DIMS_MCR)
F_R_LT = formula("R_LT", "sqrt((k/k_w)**2*I_w/I_z + (k*L)**2*G*I_t/(pi**2*E*I_z) + (C_2*z_g - C_3*z_j)**2)",
                 _REF_MCR + ", root term", "root term of the three-factor formula", dims=_DIMS_MCR)
F_MCR = formula("M_cr", "C_1*N_cr_z*(R_LT - (C_2*z_g - C_3*z_j))", _REF_MCR, "elastic critical moment",
                dims=_DIMS_MCR)
F_MCR_CANT = formula("M_cr", "gamma_cr*sqrt(E*I_z*G*I_t)/L",
                     "energy solution of the cantilever (Timoshenko and Gere 1961, 6.4 form); calckit.design."
                     "en1993.cantilever", "elastic critical moment, cantilever",
                     dims={"M_cr": "moment", "E": "stress", "G": "stress", "I_z": "inertia", "I_t": "inertia",
                           "L": "span"})
F_LAM = formula("lam_bar_LT", "sqrt(W_y*f_y/M_cr)", _R + " 6.3.2.2(1)", "non-dimensional slenderness",
                dims={"W_y": "modulus", "f_y": "stress", "M_cr": "moment"})
F_PHI_G = formula("Phi_LT", "0.5*(1 + alpha_LT*(lam_bar_LT - 0.2) + lam_bar_LT**2)", _R + " 6.3.2.2(1)",
                  "general case")
F_CHI_G = formula("chi_LT", "Min(1/(Phi_LT + sqrt(Phi_LT**2 - lam_bar_LT**2)), 1)", _R + " 6.3.2.2(1) Eq. (6.56)",
                  "reduction factor, general case")
F_PHI_R = formula("Phi_LT", "0.5*(1 + alpha_LT*(lam_bar_LT - lam_bar_LT_0) + beta*lam_bar_LT**2)",
                  _R + " 6.3.2.3(1)", "rolled or equivalent welded")
F_CHI_R = formula("chi_LT", "Min(1/(Phi_LT + sqrt(Phi_LT**2 - beta*lam_bar_LT**2)), 1, 1/lam_bar_LT**2)",
                  _R + " 6.3.2.3(1) Eq. (6.57)", "reduction factor, rolled or equivalent welded")
F_F = formula("f", "Min(1 - 0.5*(1 - k_c)*(1 - 2*(lam_bar_LT - 0.8)**2), 1)", _R + " 6.3.2.3(2) Eq. (6.58)",
              "modification factor")
F_CHI_MOD = formula("chi_LT_mod", "Min(chi_LT/f, 1, 1/lam_bar_LT**2)", _R + " 6.3.2.3(2) Eq. (6.58)",
                    "modified reduction factor")
F_KC_LIN = formula("k_c", "1/(1.33 - 0.33*psi)", _R + " Table 6.6", "linear moment diagram")
F_KC_C1 = formula("k_c", "1/sqrt(C_1)", "national annex choice (annex set kc_rule)", "correction factor")
F_MB = formula("M_b_Rd", "chi_LT*W_y*f_y/gamma_M1", _R + " 6.3.2.1(3) Eq. (6.55)", "buckling resistance moment",
               dims={"M_b_Rd": "moment", "W_y": "modulus", "f_y": "stress"})
C_PLATEAU = condition("lam_bar_LT <= lam_bar_LT_0", _R + " 6.3.2.2(4)",
                      then="lateral-torsional buckling effects may be ignored", otherwise="buckling reduces the resistance")


def imperfection(curve: str) -> float:
    """alpha_LT of Table 6.3."""
    try:
        return ALPHA_LT[curve]
    except KeyError:
        raise InputError(f"curve: got {curve!r}; expected one of {', '.join(ALPHA_LT)}") from None


def chi_lt(lam: float, curve: str = "b", method: str = "general", lambda_0: float = 0.4, beta: float = 0.75,
           f: float = 1.0) -> float:
    """chi_LT (or chi_LT,mod for f < 1) of 6.3.2.2 / 6.3.2.3 on plain floats."""
    if not (math.isfinite(lam) and lam >= 0):
        raise InputError(f"lambda_LT: got {lam!r}; expected a slenderness >= 0")
    a = imperfection(curve)
    if method == "general":
        phi = 0.5 * (1 + a * (lam - 0.2) + lam * lam)
        return min(1.0 / (phi + math.sqrt(max(phi * phi - lam * lam, 0.0))), 1.0)
    if method != "rolled":
        raise InputError(f"method: got {method!r}; expected 'general' or 'rolled'")
    phi = 0.5 * (1 + a * (lam - lambda_0) + beta * lam * lam)
    chi = 1.0 / (phi + math.sqrt(max(phi * phi - beta * lam * lam, 0.0)))
    cap = 1.0 / (lam * lam) if lam > 1e-8 else math.inf
    chi = min(chi, 1.0, cap)
    if f != 1.0:
        chi = min(chi / f, 1.0, cap)
    return chi


# ------------------------------------------------------------------------------------ moment diagrams
class Diagram:
    """A segment's moment diagram: M(xi) on xi = x/L in [0, 1] (N m, sagging positive) and its peak."""

    __slots__ = ("fn", "Mmax", "M_peak_signed", "scaled", "label", "shapes", "kc", "last")

    def __init__(self, fn, Mmax: float, M_peak_signed: float, scaled: bool, label: str) -> None:
        self.fn, self.Mmax, self.M_peak_signed, self.scaled, self.label = fn, Mmax, M_peak_signed, scaled, label
        self.shapes: dict = {}  #: (k, k_w) -> energy Shape of this diagram (kept for reuse across sections)
        self.kc = None  #: Table 6.6 match (k_c, case, psi) of this diagram, found once (:func:`kc_table66`)
        self.last = None  #: (arguments, Factors) of the last :meth:`factors` call

    def factors(self, L: float, EIz: float, GIt: float, EIw: float, zg: float = 0.0, zj: float = 0.0,
                k: float = 1.0, kw: float = 1.0):
        """C1, C2, C3 of this diagram (:func:`.mcr.equivalent_factors`, with the diagram's Shape kept; the
        last result is kept too, for a search that ranks the diagrams of a segment before checking)."""
        key = (L, EIz, GIt, EIw, zg, zj, k, kw)
        if self.last is not None and self.last[0] == key:
            return self.last[1]
        fa = self._shape(k, kw).factors(L, EIz, GIt, EIw, zg, zj, k, kw)
        self.last = (key, fa)
        return fa

    def mcr_energy(self, L: float, EIz: float, GIt: float, EIw: float, zg: float = 0.0, zj: float = 0.0,
                   k: float = 1.0, kw: float = 1.0) -> float:
        """M_cr of the energy solution alone (the Factors' ``Mcr_energy``, one eigenproblem): for ranking
        the diagrams of a segment before checking them."""
        return self._shape(k, kw).mcr(L, EIz, GIt, EIw, zg, zj)

    def _shape(self, k: float, kw: float):
        sh = self.shapes.get((k, kw))
        if sh is None:
            sh = self.shapes[(k, kw)] = shape(self.fn, k, kw, self.Mmax)[0]
        return sh


def _arr(v, dim: str, name: str) -> np.ndarray:
    from ...units import is_quantity, to_si

    if is_quantity(v) or isinstance(v, str):
        a = np.atleast_1d(np.asarray(to_si(v, dim, name), dtype=float))
    else:
        try:
            a = np.atleast_1d(np.asarray([float(u) for u in v], dtype=float)) if not isinstance(v, np.ndarray) \
                else np.asarray(v, dtype=float)
        except (TypeError, ValueError):
            raise InputError(f"{name}: got {v!r}; expected an array of numbers (SI) or a quantity array") from None
    if not np.all(np.isfinite(a)):
        raise InputError(f"{name}: got non-finite values; expected finite numbers")
    return a


def diagram(moment_diagram, L: float) -> Diagram | None:
    """Read ``moment_diagram``: None; a name ('uniform', 'udl', 'point') or ('linear', psi); a callable
    M(x) (x in m from the segment start, SI N m out); a pair (x, M) of arrays (SI floats or quantities;
    x spanning the segment); or one array of M (more than two values) at equally spaced stations."""
    if moment_diagram is None:
        return None
    if isinstance(moment_diagram, str):
        return Diagram(standard_diagram(moment_diagram), 1.0, 1.0, False, moment_diagram)
    if isinstance(moment_diagram, tuple) and len(moment_diagram) == 2 and isinstance(moment_diagram[0], str):
        name, psi = moment_diagram
        return Diagram(standard_diagram(name, float(psi)), 1.0, 1.0, False, f"{name} psi = {float(psi):g}")
    if callable(moment_diagram):
        g = moment_diagram
        xs = np.linspace(0.0, L, 201)
        ms = np.asarray([float(g(x)) for x in xs])
        return _from_arrays(xs, ms, L, "callable M(x)")
    from ...units import is_quantity

    flat = is_quantity(moment_diagram) or (
        not isinstance(moment_diagram, tuple) and np.ndim(np.asarray(moment_diagram, dtype=object)) == 1
        and len(moment_diagram) > 2)
    if flat:  # M at equally spaced stations over the segment
        Ma = _arr(moment_diagram, "moment", "moment_diagram")
        return _from_arrays(np.linspace(0.0, L, Ma.size), Ma, L, f"M at {Ma.size} equally spaced stations")
    try:
        x, M = moment_diagram
    except (TypeError, ValueError):
        raise InputError(f"moment_diagram: got {moment_diagram!r}; expected None, 'uniform'/'udl'/'point', "
                         "('linear', psi), a callable M(x) or (x, M) arrays") from None
    return _from_arrays(_arr(x, "length", "moment_diagram x"), _arr(M, "moment", "moment_diagram M"), L,
                        "given diagram")


def _from_arrays(x: np.ndarray, M: np.ndarray, L: float, label: str) -> Diagram:
    if x.shape != M.shape or x.size < 2:
        raise InputError(f"moment_diagram: got x of {x.size} and M of {M.size} values; expected equal lengths >= 2")
    if np.any(np.diff(x) < 0):
        raise InputError("moment_diagram x: expected stations in increasing order")
    span = x[-1] - x[0]
    if abs(span - L) > 0.01 * L:
        raise InputError(f"moment_diagram x: spans {span:.4g} m; expected the segment length L = {L:.4g} m")
    xi = (x - x[0]) / span
    i = int(np.argmax(np.abs(M)))
    Mmax = float(abs(M[i]))
    if Mmax == 0:
        raise InputError("moment_diagram M: all zero; expected a moment diagram")
    return Diagram(lambda q: np.interp(q, xi, M), Mmax, float(M[i]), True, label)


_TEMPLATES = (  # (name, k_c, normalised shape on xi)
    ("simply supported UDL", 0.94, lambda q: 4 * q * (1 - q)),
    ("UDL, both ends fixed", 0.90, lambda q: 6 * q * (1 - q) - 1),
    ("UDL, one end fixed", 0.91, lambda q: 4 * q * (1 - q) - (1 - q)),
    ("UDL, one end fixed", 0.91, lambda q: 4 * q * (1 - q) - q),
    ("central point load", 0.86, lambda q: 1 - np.abs(2 * q - 1)),
    ("central point load, both ends fixed", 0.77, lambda q: 2 * (1 - np.abs(2 * q - 1)) - 1),
    ("central point load, one end fixed", 0.82, lambda q: 4 / 3 * (1 - np.abs(2 * q - 1)) - (1 - q)),
    ("central point load, one end fixed", 0.82, lambda q: 4 / 3 * (1 - np.abs(2 * q - 1)) - q),
)
_KC_TOL = 0.03


def kc_table66(fn) -> tuple[float | None, str, float | None]:
    """(k_c, case, psi) of Table 6.6 for the diagram M(xi); k_c None when no case matches."""
    q = np.linspace(0.0, 1.0, 41)
    m = np.asarray(fn(q), dtype=float)
    peak = np.max(np.abs(m))
    m = m / peak
    lin = m[0] + (m[-1] - m[0]) * q
    if np.max(np.abs(m - lin)) <= _KC_TOL:
        big, small = (m[0], m[-1]) if abs(m[0]) >= abs(m[-1]) else (m[-1], m[0])
        psi = small / big
        return 1.0 / (1.33 - 0.33 * psi), "linear moment diagram", psi
    for name, kc, t in _TEMPLATES:
        tt = t(q)
        tt = tt / np.max(np.abs(tt))
        for sg in (1.0, -1.0):
            if np.max(np.abs(m - sg * tt)) <= _KC_TOL:
                return kc, name, None
    return None, "no Table 6.6 case matches", None


# ------------------------------------------------------------------------------------------ the check
def mcr_three_factor(calc: Calc, C1: float, C2: float, C3: float, E: float, G: float, Iz: float, It: float,
                     Iw: float, L: float, k: float = 1.0, kw: float = 1.0, zg: float = 0.0, zj: float = 0.0
                     ) -> float:
    """M_cr (N m) of the three-factor formula (ENV 1993-1-1 Annex F Eq. (F.2); NCCI SN003 Eq. (1)) in
    three steps: N_cr,z = pi^2 E I_z/(k L)^2; the root term R_LT = sqrt((k/k_w)^2 I_w/I_z + (k L)^2 G I_t/
    (pi^2 E I_z) + (C2 z_g - C3 z_j)^2); M_cr = C1 N_cr,z [R_LT - (C2 z_g - C3 z_j)]. SI floats."""
    N = calc(F_NCR_Z, E=E, I_z=Iz, k=k, L=L)
    R = calc(F_R_LT, k=k, k_w=kw, I_w=Iw, I_z=Iz, L=L, G=G, I_t=It, E=E, C_2=C2, z_g=zg, C_3=C3, z_j=zj)
    return calc(F_MCR, C_1=C1, N_cr_z=N, R_LT=R, C_2=C2, z_g=zg, C_3=C3, z_j=zj)


def _curve(s, method: str, annex: AnnexSet) -> tuple[str, float]:
    hb = s.d / min(s.bf_top, s.bf_bot)
    idx = (0 if hb <= 2 else 1) + (0 if s.kind == "I_rolled" else 2)
    table = annex.curves_general if method == "general" else annex.curves_rolled
    return table[idx], hb


def ltb_si(s, mat: Material, annex: AnnexSet, *, L: float, C1=None, C2=None, C3=None, dia: Diagram | None = None,
           zg: float = 0.0, k: float = 1.0, kw: float = 1.0, method: str | None = None, use_f=None,
           sagging: bool | None = None, calc: Calc | None = None, cl=None,
           cantilever: OverhangModel | None = None) -> dict:
    """Numeric core of :func:`ltb`; returns the data dict (SI floats) with ``M_b_Rd``.

    ``cantilever``: the energy model of a segment with a free end (:class:`.cantilever.OverhangModel`);
    then ``dia`` is the cantilever's own diagram (root to tip), C1, C2, C3 are not used, and k, k_w are
    ignored (the model fixes the end conditions)."""
    calc = calc or Calc(False)
    method = method or annex.ltb_method
    if method not in ("general", "rolled"):
        raise InputError(f"method: got {method!r}; expected 'general' (6.3.2.2) or 'rolled' (6.3.2.3)")
    notes = []
    if sagging is None:
        sagging = True if dia is None else dia.M_peak_signed >= 0
    if cl is None:
        cl = classify_si(s, mat, sagging=sagging, calc=calc)
    W, Wn, _ = section_modulus(s, cl, calc)
    zj_up = z_j(s)
    zj = zj_up if sagging else -zj_up
    E, G = mat.E, mat.G
    EIz, GIt, EIw = E * s.Iy, G * s.J, E * s.Cw
    Mcr_energy = None
    Mcr = None
    if cantilever is not None:
        if C1 is not None or C2 is not None or C3 is not None:
            raise InputError(f"C1: got {C1!r}; a cantilever's M_cr comes from its energy solution, leave C1, C2 "
                             "and C3 out")
        Mcr_energy = cantilever.mcr(EIz, GIt, EIw, zg=zg, zj=zj_up)
        calc.say(f"Free-ended segment: {cantilever.describe()}; M_cr by the energy method with all transverse "
                 f"loads at z_g = {zg * 1e3:.4g} mm above the shear centre",
                 "Timoshenko and Gere (1961) ch. 6; Trahair (1993); see calckit.design.en1993.cantilever")
        gam = calc.given("gamma_cr", gamma_cr(Mcr_energy, L, EIz, GIt),
                         reference="energy solution: M_cr L / sqrt(E I_z G I_t)")
        Mcr = calc(F_MCR_CANT, gamma_cr=gam, E=E, G=G, I_z=s.Iy, I_t=s.J, L=L)
        notes.append(cantilever.describe())
    elif C1 is None:
        if dia is None:
            C1, C2, C3 = 1.0, 0.0, 1.0
            notes.append("no moment diagram given: uniform moment taken (C1 = 1)")
            calc.say("No moment diagram given: uniform moment, C1 = 1.0, C3 = 1.0", "NCCI SN003 Table 3.1")
        else:
            fa = dia.factors(L, EIz, GIt, EIw, zg=zg, zj=zj_up, k=k, kw=kw)
            C1, Mcr_energy = fa.C1, fa.Mcr_energy
            C2 = fa.C2 if C2 is None else C2
            C3 = (fa.C3 if zj_up else 1.0) if C3 is None else C3
            if not sagging and zj_up and C3 is not None:
                C3 = -C3 if fa.C3 else C3  # factors were found with z_j upwards; formula uses z_j to the compression flange
            if calc.steps:
                calc.say(f"C1 = {C1:.3f}" + (f", C2 = {C2:.3f}" if zg else "") + (f", C3 = {C3:.3f}" if zj else "")
                         + f" from the moment diagram ({dia.label}) by {fa.method}",
                         "Timoshenko and Gere (1961) 6.3; Trahair (1993); see calckit.design.en1993.mcr")
    else:
        if C2 is None:
            C2 = 0.0
            if zg:
                if dia is not None:
                    fa = dia.factors(L, EIz, GIt, EIw, zg=zg, k=k, kw=kw)
                    C2 = fa.C2
                    notes.append(f"C2 = {C2:.3f} from the moment diagram (energy solution)")
                else:
                    match = [(abs(C1 - c1), name, c2) for name, (c1, c2) in SN003_TABLE.items()]
                    d, name, c2 = min(match)
                    if d > 0.02 * C1 or k != 1.0:
                        raise InputError(f"C2: no value given; with C1 = {C1:g} and z_g != 0 give C2 or a "
                                         "moment_diagram (C1 matches no tabulated transverse-load case)")
                    C2 = c2
                    notes.append(f"C2 = {c2} from NCCI SN003 for the {name} case (C1 = {C1:g} matches)")
                calc.say(notes[-1], "NCCI SN003")
        if C3 is None:
            C3 = 1.0
            if zj:
                if dia is not None:
                    fa = dia.factors(L, EIz, GIt, EIw, zj=zj_up, k=k, kw=kw)
                    C3 = fa.C3 if sagging else -fa.C3  # factors found with z_j upwards
                elif abs(C1 - 1.0) > 1e-9:
                    raise InputError("C3: no value given; a mono-symmetric section with C1 != 1 needs C3 or a "
                                     "moment_diagram")
        calc.say(f"C1 = {C1:g} given", "input")
    if Mcr is None:
        Mcr = mcr_three_factor(calc, C1, C2, C3, E, G, s.Iy, s.J, s.Cw, L, k, kw, zg, zj)
    if not Mcr > 0:
        raise InputError(f"M_cr: got {Mcr:.4g} N m from the three-factor formula; check C1, C2, z_g")
    lam = calc(F_LAM, W_y=W, f_y=mat.fy, M_cr=Mcr)
    curve, hb = _curve(s, method, annex)
    alpha = ALPHA_LT[curve]
    if calc.steps:  # the reference text is formatted only for the calc sheet
        calc.given("alpha_LT", alpha, reference=f"{_R} Table 6.3, curve {curve} (Table "
                   f"{'6.4' if method == 'general' else '6.5'}: {s.kind.replace('I_', '')} I, h/b = {hb:.2f})")
    rolled_sec = s.kind == "I_rolled"
    lam0 = 0.2 if method == "general" else (annex.lambda_LT_0 if rolled_sec else annex.lambda_LT_0_welded)
    beta = 1.0 if method == "general" else (annex.beta if rolled_sec else annex.beta_welded)
    plateau = calc.branch(C_PLATEAU, lam <= lam0, lam_bar_LT=lam, lam_bar_LT_0=lam0)
    if method == "general":
        phi = calc(F_PHI_G, alpha_LT=alpha, lam_bar_LT=lam)
        chi = calc(F_CHI_G, Phi_LT=phi, lam_bar_LT=lam)
    else:
        phi = calc(F_PHI_R, alpha_LT=alpha, lam_bar_LT=lam, lam_bar_LT_0=lam0, beta=beta)
        chi = calc(F_CHI_R, Phi_LT=phi, lam_bar_LT=lam, beta=beta)
    f = kc = None
    case = ""
    chi_used = chi
    apply_f = annex.ltb_f if use_f is None else bool(use_f)
    if apply_f and method == "rolled" and cantilever is not None:
        notes.append("cantilever: f = 1 (EN 1993-1-1 Table 6.6 gives k_c for members between restraints only)")
        calc.say(notes[-1], f"{_R} 6.3.2.3(2)")
    elif apply_f and method == "rolled":
        if annex.kc_rule == "1/sqrt(C1)":
            kc = calc(F_KC_C1, C_1=C1)
            case = "k_c = 1/sqrt(C1)"
        elif dia is not None:
            if dia.kc is None:
                dia.kc = kc_table66(dia.fn)
            kc, case, psi = dia.kc
            if psi is not None:
                kc = calc(F_KC_LIN, psi=psi)
            elif kc is not None:
                calc.given("k_c", kc, reference=f"{_R} Table 6.6: {case}")
        elif C1 == 1.0:
            kc, case = 1.0, "uniform moment"
        if kc is None:
            notes.append("moment diagram matches no Table 6.6 case: f = 1 (no modification)")
            calc.say(notes[-1], f"{_R} 6.3.2.3(2)")
        else:
            f = calc(F_F, k_c=kc, lam_bar_LT=lam)
            chi_used = calc(F_CHI_MOD, chi_LT=chi, f=f, lam_bar_LT=lam)
    Mb = calc(F_MB, chi_LT=chi_used, W_y=W, f_y=mat.fy, gamma_M1=annex.gamma_M1)
    return {"M_b_Rd": Mb, "Mcr": Mcr, "Mcr_energy": Mcr_energy, "C1": C1, "C2": C2, "C3": C3, "zg": zg,
            "zj": zj, "k": k, "kw": kw, "lambda_LT": lam, "chi_LT": chi, "chi_LT_mod": chi_used, "f": f, "kc": kc,
            "kc_case": case, "Phi_LT": phi, "alpha_LT": alpha, "curve": curve, "h_b": hb, "method": method,
            "lambda_LT_0": lam0, "beta": beta, "plateau": plateau, "W_y": W, "W": Wn, "class": cl.cls,
            "fy": mat.fy, "L": L, "annex": annex.name, "gamma_M1": annex.gamma_M1, "notes": tuple(notes),
            "compression_flange": "top" if sagging else "bottom",
            "support": "forks" if cantilever is None else ("overhang" if cantilever.back else "cantilever"),
            "gamma_cr": None if cantilever is None else gamma_cr(Mcr, L, EIz, GIt)}


def ltb(section, steel, L=None, C1=None, moment_diagram=None, zg=0, method: str | None = None, *, M_Ed=None,
        C2=None, C3=None, k: float = 1.0, kw: float = 1.0, use_f: bool | None = None, sagging: bool | None = None,
        annex=None, fy=None, steps: bool = True, segment=None, location=None, combination: str = "",
        cantilever: bool = False, backspan=None) -> ENResult:
    """Lateral-torsional buckling resistance M_b,Rd of an I-section segment of length ``L`` between
    lateral-torsional restraints, EN 1993-1-1 6.3.2.2 (``method="general"``) or 6.3.2.3 (``"rolled"``;
    default: the annex set's choice).

    ``C1`` (and ``C2``, ``C3``) given, or derived from ``moment_diagram`` (see :func:`diagram`); ``zg``:
    load height above the shear centre (positive above, destabilising); ``k``, ``kw``: end restraint
    factors; ``M_Ed``: design moment (default: the peak of a dimensioned ``moment_diagram``).

    ``cantilever=True``: a segment of length ``L`` with a free tip (:mod:`.cantilever`). ``moment_diagram``
    then runs from the root (x = 0) to the tip (x = L): 'point' (load at the tip, M = -P (L - x)), 'udl'
    (M = -w (L - x)^2 / 2), 'uniform' (a moment at the tip), or a dimensioned diagram as above (sagging
    positive). Without ``backspan`` the root is built in (lateral bending and warping prevented there);
    ``backspan=(L_b, moment_diagram_b)`` solves an overhang together with the segment behind its root
    support, from the next restraint (x = 0) to the root (x = L_b), with the same combination's moments
    (both diagrams dimensioned). C1, C2, C3, k and k_w do not apply.

    Returns an :class:`ENResult` with ``capacity`` = M_b,Rd and ``.Mcr``, ``.chi_LT``, ``.lambda_LT``,
    ``.C1`` ... (SI floats; ``.C1`` is None for a cantilever, ``.gamma_cr`` = M_cr L / sqrt(E I_z G I_t)).
    """
    s = section_props(section)
    ann = annex_set(annex)
    mat = material(s, steel, fy)
    L_ = length(L, "L")
    zg_ = value(zg, "length", "zg", minimum=None)
    for nm, kk in (("k", k), ("kw", kw)):
        if not (isinstance(kk, (int, float)) and 0.5 - 1e-12 <= kk <= 1.0 + 1e-12):
            raise InputError(f"{nm}: got {kk!r}; expected an end restraint factor 0.5 <= {nm} <= 1.0")
    for nm, cc in (("C1", C1), ("C2", C2), ("C3", C3)):
        if cc is not None and not (isinstance(cc, (int, float)) and math.isfinite(cc)):
            raise InputError(f"{nm}: got {cc!r}; expected a number")
    if C1 is not None and not C1 > 0:
        raise InputError(f"C1: got {C1!r}; expected C1 > 0")
    cant = None
    if cantilever:
        dia = cantilever_diagram(moment_diagram, L_)
        back = None
        if backspan is not None:
            try:
                Lb_raw, md_b = backspan
            except (TypeError, ValueError):
                raise InputError(f"backspan: got {backspan!r}; expected (L_b, moment_diagram_b)") from None
            Lb = length(Lb_raw, "backspan length")
            back = (Lb, diagram(md_b, Lb))
            if back[1] is None:
                raise InputError("backspan: no moment diagram given for the back segment")
        cant = overhang_model(dia, L_, back)
    elif backspan is not None:
        raise InputError("backspan: given for a segment between restraints; it applies with cantilever=True only")
    else:
        dia = diagram(moment_diagram, L_)
    M = demand(M_Ed, "moment", "M_Ed")
    if M is None and dia is not None and dia.scaled:
        M = dia.Mmax
    calc = Calc(steps)
    d = ltb_si(s, mat, ann, L=L_, C1=C1, C2=C2, C3=C3, dia=dia, zg=zg_, k=float(k), kw=float(kw), method=method,
               use_f=use_f, sagging=sagging, calc=calc, cantilever=cant)
    return result(d, calc, M, segment, location, combination)


_CANT_SHAPES = {"point": lambda q: -(1.0 - q), "udl": lambda q: -(1.0 - q) ** 2,
                "uniform": lambda q: -np.ones_like(q)}


def cantilever_diagram(moment_diagram, L: float) -> Diagram:
    """A cantilever's diagram from the root (x = 0) to the tip (x = L): 'point', 'udl', 'uniform' (gravity
    loads, hogging) or any form read by :func:`diagram`."""
    if moment_diagram is None:
        raise InputError("moment_diagram: no value given; a cantilever needs its moment diagram ('point', 'udl', "
                         "'uniform', or (x, M) from the root to the tip)")
    if isinstance(moment_diagram, str):
        fn = _CANT_SHAPES.get(moment_diagram)
        if fn is None:
            raise InputError(f"moment_diagram: got {moment_diagram!r}; expected 'point', 'udl' or 'uniform' for a "
                             "cantilever, or (x, M) arrays from the root to the tip")
        return Diagram(fn, 1.0, -1.0, False, f"cantilever, {moment_diagram}")
    return diagram(moment_diagram, L)


def overhang_model(dia: Diagram, L: float, back: "tuple[float, Diagram] | None" = None) -> OverhangModel:
    """The energy model (:func:`.cantilever.model`, cached) of a cantilever with diagram ``dia`` (root to
    tip), built in, or with the back segment ``back = (L_b, diagram from the far restraint to the root)``."""
    Mo = (lambda s_, f=dia.fn: f(np.asarray(s_) / L))
    if back is None:
        return _cant_model(L, Mo)
    Lb, db = back
    if not (dia.scaled and db.scaled):
        raise InputError("backspan: the overhang and back-segment diagrams must both be dimensioned (x, M) from "
                         "the same load combination (a named diagram has no scale)")
    Mo0, Mb1 = float(dia.fn(np.array([0.0]))[0]), float(db.fn(np.array([1.0]))[0])
    if abs(Mo0 - Mb1) > 0.02 * max(dia.Mmax, db.Mmax):
        raise InputError(f"backspan: M at the root is {Mo0:.4g} N m on the overhang and {Mb1:.4g} N m on the back "
                         "segment; expected the same combination's diagram on both sides")
    return _cant_model(L, Mo, (Lb, lambda t, f=db.fn: f(np.asarray(t) / Lb)))


def result(d: dict, calc: Calc, M, segment=None, location=None, combination="") -> ENResult:
    clause = f"{STANDARD} 6.3.2.2" if d["method"] == "general" else f"{STANDARD} 6.3.2.3"
    note = "; ".join(d["notes"])
    if d["plateau"]:
        note = (note + "; " if note else "") + "lambda_LT <= lambda_LT,0: LTB may be ignored (6.3.2.2(4))"
    return rated(M, limit_state="Lateral-torsional buckling", clause=clause, dim="moment",
                 capacity=d["M_b_Rd"], nominal=d["M_b_Rd"] * d["gamma_M1"], method="EN", steps=calc.take(),
                 data=d, note=note,
                 segment=segment, location=location, combination=combination)
