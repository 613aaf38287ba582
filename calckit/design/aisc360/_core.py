"""Shared machinery of the AISC 360-22 checks: one formula source, a step recorder, input parsing.

Every displayed formula is written once as text (sympy syntax). :class:`Fm` wraps it twice from that one
text: as a :class:`calckit.render.Formula` (steps: evaluation through sympy's lambdified form, with the
record of inputs and result) and as a plain Python ``lambda`` over ``math`` functions (the numeric path
used by the section search, ``steps=False``). ``tests/test_aisc360_core.py`` evaluates both forms of every
formula of the package on the same inputs and checks that they agree.

:class:`Calc` is the recorder handed through a check: ``calc(F, **values)`` evaluates ``F`` and, when
steps are kept, appends the :class:`calckit.render.Step`; ``calc.cond(C, **values)`` does the same for a
branch :class:`Cond` (a :class:`calckit.render.Condition` and a compiled Python chained comparison).

Internal module; the public API is in :mod:`calckit.design.aisc360`.
"""
from __future__ import annotations

import math
import warnings
from dataclasses import dataclass
from typing import Any

from ...errors import InputError, NotCoveredError
from ...materials import Steel
from ...materials import steel as _steel
from ...sections.base import SectionProps
from ...render.formula import Condition, Formula
from ...render.records import decide, given
from ..results import CheckResult

STANDARD = "AISC 360-22"

CAUTION = ("Design aid only: results must be reviewed, and the calculation sealed, by a licensed engineer; "
           "the governing building code and the project specification take precedence.")

#: dimension of every symbol used in the package's formulas (symbols not listed are dimensionless)
SYM_DIMS: dict[str, str] = {
    "E": "stress", "F_y": "stress", "F_yw": "stress", "F_yf": "stress", "F_yst": "stress", "F_L": "stress",
    "F_cr": "stress", "F_cr0": "stress",
    "Z_x": "modulus", "S_x": "modulus", "S_xc": "modulus", "S_xt": "modulus", "Z_y": "modulus",
    "S_y": "modulus",
    "M_p": "moment", "M_n": "moment", "M_c": "moment", "M_u": "moment", "M_a": "moment", "M_yc": "moment",
    "M_yt": "moment", "M_y": "moment", "M_r": "moment", "M_max": "moment", "M_A": "moment", "M_B": "moment",
    "M_C": "moment", "M_n1": "moment", "M_cap": "moment",
    "L_b": "span", "L_p": "span", "L_r": "span", "L": "span", "L_eff": "span",
    "r_y": "length", "r_ts": "length", "r_t": "length", "h_o": "length", "h": "length", "h_c": "length",
    "h_p": "length", "t_w": "length", "t_f": "length", "b_f": "length", "b_fc": "length", "t_fc": "length",
    "b_ft": "length", "t_ft": "length", "d": "length", "b": "length", "k": "length", "l_b": "length",
    "a": "length", "b_st": "length", "t_st": "length", "b_min": "length", "x_end": "length",
    "J": "inertia", "I_y": "inertia", "I_yc": "inertia", "C_w": "warping", "I_st": "inertia",
    "I_st1": "inertia", "I_st2": "inertia", "I_st_req": "inertia",
    "A_w": "area", "A_fc": "area", "A_ft": "area",
    "V_n": "force", "V_c": "force", "V_u": "force", "V_r": "force", "V_c1": "force", "V_c2": "force",
    "R_n": "force", "R_c": "force", "R_u": "force", "R_n0": "force",
    "delta": "deflection", "delta_lim": "deflection",
}

_FAST_NS: dict[str, Any] = {
    "sqrt": math.sqrt, "Min": min, "Max": max, "min": min, "max": max, "Abs": abs, "abs": abs,
    "exp": math.exp, "log": math.log, "pi": math.pi, "__builtins__": {},
}

#: every Fm and Cond defined in the package (for the consistency test of the two evaluation paths)
REGISTRY: list = []


def _fast(expr: str, names: tuple[str, ...]):
    src = "lambda " + ", ".join(names) + ": " + expr.replace("^", "**")
    return eval(src, dict(_FAST_NS))  # noqa: S307 - text written in this package, no user input


class Fm:
    """A formula written once: ``.formula`` (render.Formula, for steps) and ``.fast`` (math lambda).

    ``Fm(symbol, expr, ref, label, dims=None, latex=None)``; dimensions default to :data:`SYM_DIMS`.
    """

    __slots__ = ("formula", "fast", "symbol", "expr", "ref")

    def __init__(self, symbol: str, expr: str, ref: str, label: str = "", *, dims: dict | None = None,
                 latex: dict | None = None, check_units: bool = True) -> None:
        f0 = Formula(symbol, expr, check_units=False)
        allnames = (symbol, *f0.names)
        dd = {n: SYM_DIMS[n] for n in allnames if n in SYM_DIMS}
        dd.update(dims or {})
        self.formula = Formula(symbol, expr, dims=dd, latex=latex, ref=ref, label=label,
                               check_units=check_units)
        self.fast = _fast(expr, self.formula.names)
        self.symbol, self.expr, self.ref = symbol, expr, ref
        REGISTRY.append(self)

    def __repr__(self) -> str:
        return f"Fm({self.symbol} = {self.expr}; {self.ref})"


class Cond:
    """A branch condition written once: ``.condition`` (render.Condition) and ``.fast`` (Python chain)."""

    __slots__ = ("condition", "fast", "expr")

    def __init__(self, expr: str, ref: str, then: str = "", otherwise: str = "", *,
                 dims: dict | None = None) -> None:
        c0 = Condition(expr)
        dd = {n: SYM_DIMS[n] for n in c0.names if n in SYM_DIMS}
        dd.update(dims or {})
        self.condition = Condition(expr, dims=dd, then=then, otherwise=otherwise, ref=ref)
        self.fast = _fast(expr, self.condition.names)
        self.expr = expr
        REGISTRY.append(self)

    def __repr__(self) -> str:
        return f"Cond({self.expr})"


class Calc:
    """Evaluates formulas and conditions; keeps the records when ``steps`` is True."""

    __slots__ = ("recs",)

    def __init__(self, steps: bool = True) -> None:
        self.recs: list | None = [] if steps else None

    @property
    def on(self) -> bool:
        return self.recs is not None

    def __call__(self, F: Fm, note: str = "", **values) -> float:
        if self.recs is None:
            return F.fast(**values)
        s = F.formula.step(note=note, **values)
        self.recs.append(s)
        return s.result

    def cond(self, C: Cond, **values) -> bool:
        if self.recs is None:
            return bool(C.fast(**values))
        d = C.condition.step(**values)
        self.recs.append(d)
        return d.holds

    def given(self, symbol: str, value: float, dim: str = "dimensionless", reference: str = "",
              note: str = "", label: str = "") -> float:
        if self.recs is not None:
            self.recs.append(given(symbol, value, dim, reference=reference, note=note, label=label))
        return value

    def say(self, text: str, reference: str = "", holds: bool = True) -> None:
        if self.recs is not None:
            self.recs.append(decide(text, reference=reference, holds=holds))

    def take(self) -> tuple:
        """The records so far (and start a new list)."""
        if self.recs is None:
            return ()
        out = tuple(self.recs)
        self.recs = []
        return out


# ------------------------------------------------------------------------------------ resistance factors
#: kind -> (phi, Omega, phi/Omega subscript, clause); AISC 360-22 B3.1, B3.2 and the clauses named
FACTORS: dict[str, tuple[float, float, str, str]] = {
    "flexure": (0.90, 1.67, "b", "F1(1)"),
    "shear": (0.90, 1.67, "v", "G1"),
    "shear_rolled": (1.00, 1.50, "v", "G2.1(a)"),
    "flb": (0.90, 1.67, "", "J10.1"),
    "wly": (1.00, 1.50, "", "J10.2"),
    "wcr": (0.75, 2.00, "", "J10.3"),
}

_AVAIL: dict[tuple[str, str, str], Fm] = {}


def _avail_formula(method: str, sub: str, nominal: str, avail: str, dim: str) -> Fm:
    key = (method, sub, nominal)
    f = _AVAIL.get(key)
    if f is None:
        phi = "phi_" + sub if sub else "phi"
        om = "Omega_" + sub if sub else "Omega"
        if method == "LRFD":
            f = Fm(avail, f"{phi}*{nominal}", "AISC 360-22 B3.1 (LRFD)", "design strength",
                   dims={avail: dim, nominal: dim})
        else:
            f = Fm(avail, f"{nominal}/{om}", "AISC 360-22 B3.2 (ASD)", "allowable strength",
                   dims={avail: dim, nominal: dim})
        _AVAIL[key] = f
    return f


def available(calc: Calc, kind: str, method: str, Rn: float, nominal: str, avail: str, dim: str) -> float:
    """phi Rn (LRFD) or Rn / Omega (ASD), recorded as a step."""
    phi, om, sub, _ = FACTORS[kind]
    f = _avail_formula(method, sub, nominal, avail, dim)
    if method == "LRFD":
        if calc.recs is None:
            return phi * Rn
        return calc(f, **{("phi_" + sub if sub else "phi"): phi, nominal: Rn})
    if calc.recs is None:
        return Rn / om
    return calc(f, **{nominal: Rn, ("Omega_" + sub if sub else "Omega"): om})


def factor_of(kind: str, method: str) -> float:
    phi, om, _, _ = FACTORS[kind]
    return phi if method == "LRFD" else 1.0 / om


# ---------------------------------------------------------------------------------------- input parsing
def parse_method(method: str) -> str:
    m = str(method).strip().upper() if isinstance(method, str) else None
    if m not in ("LRFD", "ASD"):
        raise InputError(f"method: got {method!r}; expected 'LRFD' or 'ASD'")
    return m


def props(section):
    """SectionProps from a Section object or a SectionProps (the latter lets tests use tabulated values)."""
    if isinstance(section, SectionProps):
        return section
    p = getattr(section, "si", None)
    if isinstance(p, SectionProps):
        return p
    raise InputError(f"section: got {section!r}; expected a calckit section (e.g. calckit.section('W18X50') "
                     "or calckit.PlateGirder(...)) or its SectionProps")


@dataclass(frozen=True)
class Mat:
    """Steel properties used by the checks (SI floats, Pa)."""

    name: str  #: grade name
    Fy: float  #: specified minimum yield stress for the section's thickest element
    Fu: float  #: specified minimum tensile strength, same band
    E: float  #: modulus of elasticity
    note: str = ""  #: remark on the band chosen or the grade's standard


def material(steel, p) -> Mat:
    """Fy, Fu, E of ``steel`` (grade name or Steel) for section ``p``: the band of its thickest element.

    AISC 360-22 A3.1: Fy is the specified minimum yield stress; a thicker band has the lower value, so the
    thickest element's band is used for the whole section (conservative for the thinner elements).
    """
    if steel is None:
        raise InputError("steel: got None; expected a grade name such as 'A992' or a calckit Steel")
    if not isinstance(steel, (str, Steel)):
        raise InputError(f"steel: got {steel!r}; expected a grade name such as 'A992' or a calckit Steel")
    s = _steel(steel)
    tmax = max(p.tf_top, p.tf_bot, p.tw)
    tmin = min(t for t in (p.tf_top, p.tf_bot, p.tw) if t > 0)
    try:
        Fy, Fu = s.fy_si(tmax), s.fu_si(tmax)
    except InputError as exc:
        raise InputError(f"steel: {s.name} gives no Fy for the {tmax * 1e3:.1f} mm thick element of "
                         f"{p.name or 'the section'} ({exc})") from None
    if not (Fy > 0 and math.isfinite(Fy)):
        raise InputError(f"steel: grade {s.name!r} has no usable yield stress (Fy = {Fy!r})")
    notes = []
    if s.fy_si(tmin) != Fy:
        notes.append(f"Fy = {Fy / 1e6:.0f} MPa taken for the thickest element ({tmax * 1e3:.1f} mm) of "
                     f"{s.name}, used for the whole section (conservative for thinner elements)")
    if s.standard != "ASTM":
        notes.append(f"{s.name} is an EN grade used with AISC 360-22; E = {s.E_si / 1e6:.0f} MPa from the "
                     "grade record; confirm the material is permitted by AISC 360-22 A3.1")
    return Mat(s.name, Fy, Fu, s.E_si, "; ".join(notes))


def length_si(value, name: str, *, allow_zero: bool = True, dim: str = "span") -> float:
    """A length >= 0 (or > 0) from a quantity, a string like "11.7 ft" or a bare 0."""
    from ...units import to_si

    if isinstance(value, bool):
        raise InputError(f"{name}: got {value!r}; expected a length")
    v = to_si(value, dim, name, allow_array=False)
    if not math.isfinite(v) or v < 0 or (v == 0 and not allow_zero):
        what = "a length >= 0" if allow_zero else "a length > 0"
        extra = " (0 means continuous bracing)" if name == "Lb" else ""
        shown = value if isinstance(value, str) else f"{v:.6g} m"
        raise InputError(f"{name}: got {shown}; expected {what}{extra}")
    return v


def quantity_si(value, dim: str, name: str) -> float:
    from ...units import to_si

    return float(to_si(value, dim, name, allow_array=False))


def check_Cb(Cb) -> tuple[float, str]:
    """Validate Cb: > 0 required; outside 1.0..3.0 warns (UserWarning) and returns a note (value kept)."""
    if isinstance(Cb, bool) or not isinstance(Cb, (int, float)):
        try:
            Cb = float(Cb)
        except (TypeError, ValueError):
            raise InputError(f"Cb: got {Cb!r}; expected a number (1.0 <= Cb <= 3.0 in usual practice)") from None
    Cb = float(Cb)
    if not math.isfinite(Cb) or Cb <= 0:
        raise InputError(f"Cb: got {Cb!r}; expected a positive number (1.0 <= Cb <= 3.0 in usual practice)")
    note = ""
    if Cb < 1.0:
        note = (f"Cb = {Cb:g} < 1.0 was given and used as given; AISC 360-22 Eq. F1-1 never gives less than "
                "1.0 (conservative)")
    elif Cb > 3.0:
        note = (f"Cb = {Cb:g} > 3.0 was given and used as given; values above 3.0 are unusual, check the "
                "moment diagram (AISC 360-22 F1, Commentary)")
    if note:
        warnings.warn(note, UserWarning, stacklevel=3)
    return Cb, note


def not_covered(what: str, clause: str) -> NotCoveredError:
    return NotCoveredError(f"{what}: AISC 360-22 {clause} would apply; calckit does not implement it")


def kind_word(p) -> str:
    return {"I_rolled": "rolled I-shape", "I_welded": "welded (built-up) I-shape", "channel": "channel",
            "tee": "tee", "rect": "solid rectangular bar", "hollow": "rectangular hollow section",
            "builtup": "built-up section of several parts"}.get(p.kind, p.kind)


def result(*, demand: float | None = None, **fields):
    """CheckResult built once, with ratio and passed from ``demand`` (same rule as
    :meth:`CheckResult.with_demand`); avoids dataclasses.replace on the numeric path."""
    if demand is not None:
        cap = fields["capacity"]
        d = abs(demand)
        ratio = d / cap if cap > 0 else math.inf
        fields.update(demand=d, ratio=ratio, passed=ratio <= 1.0 + 1e-9)
    return CheckResult(**fields)


# the available-strength formulas, created up front so that REGISTRY is complete after import
for _m in ("LRFD", "ASD"):
    for _sub, _nom, _av, _dim in (("b", "M_n", "M_c", "moment"), ("v", "V_n", "V_c", "force"),
                                  ("v", "V_n2", "V_c2", "force"), ("", "R_n", "R_c", "force")):
        _avail_formula(_m, _sub, _nom, _av, _dim)
del _m, _sub, _nom, _av, _dim
