"""Load and support records of the beam model (immutable, SI floats inside).

Every record is a frozen dataclass holding SI floats (N, m, N/m, N*m, N/m for spring stiffness). The
:class:`calckit.analysis.Beam` methods build them from quantities; the records themselves never see a
unit. Sign conventions are those of :mod:`calckit.analysis` (downward loads positive, clockwise couples
positive).
"""
from __future__ import annotations

from dataclasses import dataclass

from ..errors import InputError, UnitsError

__all__ = ["PointLoad", "Couple", "LinearLoad", "Support", "SUPPORT_KINDS", "parse_support", "check_case"]

#: Support kinds understood by :func:`parse_support`; a quantity of dimension "stiffness" gives "spring".
SUPPORT_KINDS = ("pin", "roller", "fixed", "free")


@dataclass(frozen=True)
class PointLoad:
    """A concentrated force.

    P: force in N, downward positive (gravity); x: position in m from the left end; case: load case name.
    """

    P: float
    x: float
    case: str

    def describe(self) -> str:
        return f"point load P = {self.P / 1e3:.6g} kN at x = {self.x:.6g} m (case {self.case!r})"


@dataclass(frozen=True)
class Couple:
    """A concentrated moment (couple).

    M: moment in N*m, clockwise positive (x to the right, y up), so that the bending moment jumps by +M
    going left to right; x: position in m; case: load case name.
    """

    M: float
    x: float
    case: str

    def describe(self) -> str:
        return f"moment M = {self.M / 1e3:.6g} kN*m at x = {self.x:.6g} m (case {self.case!r})"


@dataclass(frozen=True)
class LinearLoad:
    """A distributed load varying linearly from w1 at ``start`` to w2 at ``end``.

    w1, w2: intensities in N/m, downward positive; start < end: positions in m; case: load case name.
    A uniform load has w1 == w2; a triangle has one end zero. ``kind`` records how the user gave it
    ("udl", "linear" or "self_weight") for calc-sheet wording only.
    """

    w1: float
    w2: float
    start: float
    end: float
    case: str
    kind: str = "linear"

    @property
    def total(self) -> float:
        """Resultant force in N (downward positive)."""
        return 0.5 * (self.w1 + self.w2) * (self.end - self.start)

    def first_moment(self, x0: float = 0.0) -> float:
        """Integral of w(x) (x - x0) dx over the load, in N*m (exact for the linear intensity)."""
        a, b = self.start - x0, self.end - x0
        return (b - a) / 6.0 * (self.w1 * (2 * a + b) + self.w2 * (a + 2 * b))

    def at(self, x: float) -> float:
        """Intensity at position x (m) inside [start, end]."""
        return self.w1 + (self.w2 - self.w1) * (x - self.start) / (self.end - self.start)

    def clipped(self, a: float, b: float) -> "LinearLoad | None":
        """The part of the load that lies on [a, b], or None when they do not overlap over a length."""
        s, e = max(self.start, a), min(self.end, b)
        if e <= s:
            return None
        return LinearLoad(self.at(s), self.at(e), s, e, self.case, self.kind)

    def describe(self) -> str:
        what = {"udl": "uniform load", "self_weight": "self-weight", "linear": "linear load"}.get(self.kind, "load")
        if self.w1 == self.w2:
            val = f"w = {self.w1 / 1e3:.6g} kN/m"
        else:
            val = f"w1 = {self.w1 / 1e3:.6g} kN/m to w2 = {self.w2 / 1e3:.6g} kN/m"
        return f"{what} {val} from x = {self.start:.6g} m to {self.end:.6g} m (case {self.case!r})"


@dataclass(frozen=True)
class Support:
    """A support at a span end.

    index: support number from the left (0-based); x: position in m; kind: "pin" (vertical and
    horizontal restraint), "roller" (vertical only), "fixed" (vertical, horizontal and rotation),
    "free" (none: overhang or cantilever tip, or an unsupported span joint) or "spring" (vertical spring,
    no horizontal restraint); k: spring stiffness in N/m (0 unless kind == "spring").
    """

    index: int
    x: float
    kind: str
    k: float = 0.0

    @property
    def vertical(self) -> bool:
        """True when the support gives a vertical reaction."""
        return self.kind != "free"

    @property
    def rotational(self) -> bool:
        """True when the support gives a moment reaction (fixed)."""
        return self.kind == "fixed"

    @property
    def horizontal(self) -> bool:
        """True when the support restrains movement along the beam (pin or fixed)."""
        return self.kind in ("pin", "fixed")

    def label(self) -> str:
        if self.kind == "spring":
            return f"support {self.index} (spring k = {self.k / 1e6:.6g} kN/mm at x = {self.x:.6g} m)"
        return f"support {self.index} ({self.kind} at x = {self.x:.6g} m)"


def parse_support(value, index: int, x: float) -> Support:
    """Build a :class:`Support` from "pin" / "roller" / "fixed" / "free" or a stiffness quantity."""
    from ..units import to_si

    name = f"supports[{index}]"
    if isinstance(value, Support):
        return Support(index, x, value.kind, value.k)
    if isinstance(value, str):
        key = value.strip().lower()
        aliases = {"pinned": "pin", "hinged": "pin", "fix": "fixed", "clamped": "fixed", "none": "free"}
        key = aliases.get(key, key)
        if key in SUPPORT_KINDS:
            return Support(index, x, key)
        if key == "spring":
            raise InputError(f"{name}: got 'spring'; give the spring as its stiffness, e.g. '50 kN/mm'")
    if value is None:
        return Support(index, x, "free")
    try:
        k = to_si(value, "stiffness", name, allow_array=False)
    except (UnitsError, InputError) as exc:
        raise InputError(
            f"{name}: got {value!r}; expected one of {', '.join(SUPPORT_KINDS)} or a vertical spring "
            f"stiffness such as '50 kN/mm' ({exc})"
        ) from None
    if not k > 0.0:
        raise InputError(
            f"{name}: got a spring stiffness of {value!r}; expected a stiffness > 0 (use 'free' for no support)"
        )
    return Support(index, x, "spring", float(k))


def check_case(case) -> str:
    """A load case name must be a non-empty string (e.g. 'D', 'L', 'Lr', 'S', 'W', or any name)."""
    if not isinstance(case, str) or not case.strip():
        raise InputError(f"case: got {case!r}; expected a load case name such as 'D', 'L', 'Lr', 'S' or 'W'")
    return case.strip()
