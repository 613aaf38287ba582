"""Closed-form beam formulas for the calc sheet, as sympy data, and recognition of the standard cases.

The formulas are those tabulated in AISC *Steel Construction Manual*, 15th ed., Part 3, Table 3-23
"Shears, Moments and Deflections" (case numbers from memory), and in Roark's *Formulas for Stress and
Strain*, 7th ed., Table 8.1; each is also derived in any mechanics-of-materials text. Every equation
is a ``sympy.Eq`` whose left side is a result symbol (R_1, R_2, V_max, M_max, M_1, M_2, x_M,
delta_max, x_delta) and whose right side uses the input symbols w, P, L, a, b, E, I.

Values are **magnitudes**, as the tables print them; :attr:`StandardCase.sense` says for each result
whether it is sagging / hogging / downward, and :attr:`StandardCase.sign` converts to the sign
convention of :mod:`calckit.analysis` (hogging moments negative).

:func:`detect_standard_case` says whether a beam and one of its load cases is one of these cases (and
with which input values); when it returns None the calc sheet should state the general method
(exact integration, :mod:`calckit.analysis.solver`) and tabulate the results instead.

sympy is imported on first use of :func:`standard_cases` only.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from functools import lru_cache

from .loads import Couple, LinearLoad, PointLoad

__all__ = ["StandardCase", "Detected", "STANDARD_CASE_KEYS", "standard_cases", "standard_case",
           "detect_standard_case"]

STANDARD_CASE_KEYS = (
    "simple_udl", "simple_point_center", "simple_point", "cantilever_udl", "cantilever_point_tip",
    "fixed_fixed_udl", "fixed_fixed_point_center", "propped_udl",
)
#: Relative tolerance for "the load is at mid-span", "the load covers the whole span", "uniform".
DETECT_REL = 1e-9


@dataclass(frozen=True)
class StandardCase:
    """One tabulated beam case.

    key: identifier (one of :data:`STANDARD_CASE_KEYS`); title: plain-words description;
    reference: source of the formulas; inputs: input symbol names; equations: result name ->
    ``sympy.Eq``; sense: result name -> 'reaction', 'shear', 'sagging', 'hogging', 'downward',
    'position'; sign: result name -> +1 / -1 to convert the magnitude to calckit's sign convention;
    where: result name -> plain-words location; x_from: where x is measured from.
    """

    key: str
    title: str
    reference: str
    inputs: tuple
    equations: dict
    sense: dict
    where: dict = field(default_factory=dict)
    x_from: str = "the left support"

    @property
    def sign(self) -> dict:
        return {k: (-1 if s == "hogging" else 1) for k, s in self.sense.items()}

    def evaluate(self, values: dict) -> dict:
        """Numeric magnitudes for ``values`` (symbol name -> float, SI). 'EI' may stand for E and I."""
        import sympy as sp

        vals = dict(values)
        if "EI" in vals and ("E" not in vals or "I" not in vals):
            vals["E"], vals["I"] = vals.pop("EI"), 1.0
        subs = {sp.Symbol(k): float(v) for k, v in vals.items() if k in self.inputs}
        return {k: float(eq.rhs.subs(subs)) for k, eq in self.equations.items()}


@dataclass(frozen=True)
class Detected:
    """A beam + load case recognised as a standard case.

    case: the :class:`StandardCase`; values: input symbol -> SI float ('E' and 'I' when the beam was
    built from section and steel, else 'EI'); mirrored: True when the tabulated figure is the beam
    seen from the other end (x is then measured from the right end of the beam).
    """

    case: StandardCase
    values: dict
    mirrored: bool = False

    def evaluate(self) -> dict:
        return self.case.evaluate(self.values)


@lru_cache(maxsize=1)
def standard_cases() -> dict:
    """All standard cases, key -> :class:`StandardCase` (built once; imports sympy)."""
    import sympy as sp

    w, P, L, a, b, E, I = sp.symbols("w P L a b E I")
    S = sp.Symbol
    Eq = sp.Eq
    aisc = "AISC Steel Construction Manual, 15th ed., Table 3-23, case {} (case number from memory)"
    out = {}

    def add(key, title, ref, inputs, eqs, sense, where=None, x_from="the left support"):
        out[key] = StandardCase(key, title, ref, inputs, {k: Eq(S(k), v) for k, v in eqs.items()},
                                sense, where or {}, x_from)

    add("simple_udl", "simple span, uniform load over the span", aisc.format(1), ("w", "L", "E", "I"),
        {"R_1": w * L / 2, "R_2": w * L / 2, "V_max": w * L / 2, "M_max": w * L ** 2 / 8, "x_M": L / 2,
         "delta_max": 5 * w * L ** 4 / (384 * E * I), "x_delta": L / 2},
        {"R_1": "reaction", "R_2": "reaction", "V_max": "shear", "M_max": "sagging", "x_M": "position",
         "delta_max": "downward", "x_delta": "position"},
        {"M_max": "at mid-span", "delta_max": "at mid-span"})
    add("simple_point_center", "simple span, point load at mid-span", aisc.format(7), ("P", "L", "E", "I"),
        {"R_1": P / 2, "R_2": P / 2, "V_max": P / 2, "M_max": P * L / 4, "x_M": L / 2,
         "delta_max": P * L ** 3 / (48 * E * I), "x_delta": L / 2},
        {"R_1": "reaction", "R_2": "reaction", "V_max": "shear", "M_max": "sagging", "x_M": "position",
         "delta_max": "downward", "x_delta": "position"},
        {"M_max": "under the load", "delta_max": "at mid-span"})
    add("simple_point", "simple span, point load at a from the left support (a >= b)", aisc.format(8),
        ("P", "L", "a", "b", "E", "I"),
        {"R_1": P * b / L, "R_2": P * a / L, "V_max": P * a / L, "M_max": P * a * b / L, "x_M": a,
         "delta_max": P * a * b * (a + 2 * b) * sp.sqrt(3 * a * (a + 2 * b)) / (27 * E * I * L),
         "x_delta": sp.sqrt(a * (a + 2 * b) / 3)},
        {"R_1": "reaction", "R_2": "reaction", "V_max": "shear", "M_max": "sagging", "x_M": "position",
         "delta_max": "downward", "x_delta": "position"},
        {"M_max": "under the load", "delta_max": "at x_delta, in the longer part (valid for a >= b)"})
    add("cantilever_udl", "cantilever, uniform load", aisc.format(22), ("w", "L", "E", "I"),
        {"R_1": w * L, "V_max": w * L, "M_max": w * L ** 2 / 2, "delta_max": w * L ** 4 / (8 * E * I)},
        {"R_1": "reaction", "V_max": "shear", "M_max": "hogging", "delta_max": "downward"},
        {"M_max": "at the fixed end", "delta_max": "at the free end"}, "the fixed end")
    add("cantilever_point_tip", "cantilever, point load at the free end", aisc.format(24), ("P", "L", "E", "I"),
        {"R_1": P, "V_max": P, "M_max": P * L, "delta_max": P * L ** 3 / (3 * E * I)},
        {"R_1": "reaction", "V_max": "shear", "M_max": "hogging", "delta_max": "downward"},
        {"M_max": "at the fixed end", "delta_max": "at the free end"}, "the fixed end")
    add("fixed_fixed_udl", "both ends fixed, uniform load", aisc.format(15), ("w", "L", "E", "I"),
        {"R_1": w * L / 2, "R_2": w * L / 2, "V_max": w * L / 2, "M_1": w * L ** 2 / 12,
         "M_2": w * L ** 2 / 12, "M_max": w * L ** 2 / 24, "x_M": L / 2,
         "delta_max": w * L ** 4 / (384 * E * I), "x_delta": L / 2},
        {"R_1": "reaction", "R_2": "reaction", "V_max": "shear", "M_1": "hogging", "M_2": "hogging",
         "M_max": "sagging", "x_M": "position", "delta_max": "downward", "x_delta": "position"},
        {"M_1": "at the ends", "M_2": "at the ends", "M_max": "at mid-span", "delta_max": "at mid-span"})
    add("fixed_fixed_point_center", "both ends fixed, point load at mid-span", aisc.format(16),
        ("P", "L", "E", "I"),
        {"R_1": P / 2, "R_2": P / 2, "V_max": P / 2, "M_1": P * L / 8, "M_2": P * L / 8, "M_max": P * L / 8,
         "x_M": L / 2, "delta_max": P * L ** 3 / (192 * E * I), "x_delta": L / 2},
        {"R_1": "reaction", "R_2": "reaction", "V_max": "shear", "M_1": "hogging", "M_2": "hogging",
         "M_max": "sagging", "x_M": "position", "delta_max": "downward", "x_delta": "position"},
        {"M_1": "at the ends", "M_2": "at the ends", "M_max": "under the load", "delta_max": "at mid-span"})
    # propped cantilever: delta(x) = w x (L^3 - 3 L x^2 + 2 x^3) / (48 E I) from the pinned end
    xi = (1 + sp.sqrt(33)) / 16
    coef = sp.together(sp.radsimp(sp.expand(xi * (1 - 3 * xi ** 2 + 2 * xi ** 3) / 48)))
    add("propped_udl", "one end fixed, other end pinned, uniform load", aisc.format(12), ("w", "L", "E", "I"),
        {"R_1": 3 * w * L / 8, "R_2": 5 * w * L / 8, "V_max": 5 * w * L / 8, "M_2": w * L ** 2 / 8,
         "M_max": 9 * w * L ** 2 / 128, "x_M": 3 * L / 8,
         "delta_max": coef * w * L ** 4 / (E * I), "x_delta": xi * L},
        {"R_1": "reaction", "R_2": "reaction", "V_max": "shear", "M_2": "hogging", "M_max": "sagging",
         "x_M": "position", "delta_max": "downward", "x_delta": "position"},
        {"R_1": "at the pinned end", "R_2": "at the fixed end", "M_2": "at the fixed end",
         "M_max": "at x_M", "delta_max": "at x_delta (about w L^4 / (185 E I) at 0.4215 L)"},
        "the pinned end")
    return out


def standard_case(key: str) -> StandardCase:
    """One standard case by key."""
    from ..errors import InputError

    cases = standard_cases()
    if key not in cases:
        raise InputError(f"key: got {key!r}; expected one of {list(cases)}")
    return cases[key]


def _close(a: float, b: float, scale: float) -> bool:
    return abs(a - b) <= DETECT_REL * scale


def detect_standard_case(beam, case: str) -> Detected | None:
    """The standard case that ``beam`` under load case ``case`` is, or None.

    Recognised: one span, no hinges, one EI; supports pin/roller-pin/roller (simple), fixed-free
    (cantilever, either way round), fixed-fixed, fixed-pin/roller (propped, either way round); the
    case holds only full-length uniform loads (summed) or only point loads at one position (summed).
    """
    loads = beam.loads_in(case)
    lay = beam.layout
    if lay.n_spans != 1 or lay.hinges:
        return None
    L = lay.L
    kinds = tuple(s.kind for s in lay.supports)
    if "spring" in kinds:
        return None
    if any(isinstance(ld, Couple) for ld in loads):
        return None
    dist = [ld for ld in loads if isinstance(ld, LinearLoad)]
    pts = [ld for ld in loads if isinstance(ld, PointLoad)]
    if dist and pts:
        return None
    vals: dict = {"L": L}
    if beam.sections is not None and beam.steel is not None and len(set(map(id, beam.sections))) == 1:
        try:
            E, I = float(beam.steel[0].si.E), float(beam.sections[0].si.Ix)
            if _close(E * I, lay.EI[0], lay.EI[0]):
                vals.update(E=E, I=I)
        except AttributeError:
            pass
    if "E" not in vals:
        vals["EI"] = lay.EI[0]
    simple = {"pin", "roller"}
    if dist:
        w = 0.0
        for ld in dist:
            if not (_close(ld.start, 0.0, L) and _close(ld.end, L, L) and _close(ld.w1, ld.w2, max(abs(ld.w1), 1e-30))):
                return None
            w += ld.w1
        if w == 0.0:
            return None
        vals["w"] = w
        if kinds[0] in simple and kinds[1] in simple:
            return Detected(standard_case("simple_udl"), vals)
        if kinds == ("fixed", "free"):
            return Detected(standard_case("cantilever_udl"), vals)
        if kinds == ("free", "fixed"):
            return Detected(standard_case("cantilever_udl"), vals, mirrored=True)
        if kinds == ("fixed", "fixed"):
            return Detected(standard_case("fixed_fixed_udl"), vals)
        if kinds[0] == "fixed" and kinds[1] in simple:
            return Detected(standard_case("propped_udl"), vals, mirrored=True)
        if kinds[1] == "fixed" and kinds[0] in simple:
            return Detected(standard_case("propped_udl"), vals)
        return None
    if not pts:
        return None
    x0 = pts[0].x
    if any(not _close(p.x, x0, L) for p in pts):
        return None
    P = sum(p.P for p in pts)
    if P == 0.0:
        return None
    vals["P"] = P
    mid = _close(x0, L / 2, L)
    if kinds[0] in simple and kinds[1] in simple:
        if mid:
            return Detected(standard_case("simple_point_center"), vals)
        if _close(x0, 0.0, L) or _close(x0, L, L):
            return None
        a, b = x0, L - x0
        mirrored = a < b
        if mirrored:
            a, b = b, a
        vals.update(a=a, b=b)
        return Detected(standard_case("simple_point"), vals, mirrored=mirrored)
    if kinds == ("fixed", "free") and _close(x0, L, L):
        return Detected(standard_case("cantilever_point_tip"), vals)
    if kinds == ("free", "fixed") and _close(x0, 0.0, L):
        return Detected(standard_case("cantilever_point_tip"), vals, mirrored=True)
    if kinds == ("fixed", "fixed") and mid:
        return Detected(standard_case("fixed_fixed_point_center"), vals)
    return None
