"""Result records shared by every design standard.

Rules for implementers of a design module (numbered so reviews can point at them):

1. A check function validates its inputs and raises ``InputError``/``UnitsError`` for bad input only.
2. It computes on SI floats; every formula that appears in the calc is evaluated through a
   ``calckit.render.Formula`` so that the displayed and computed values come from one source. When
   ``steps=False`` (the numeric path used by the section search) the same formulas are evaluated without
   building step records.
3. It returns a :class:`CheckResult`: ``capacity`` is the design/available strength (phi Rn, Rn/Omega or
   the EN design resistance), ``nominal`` the nominal strength Rn (or the characteristic resistance), and
   ``ratio``/``passed`` are set when a demand is given.
4. ``clause`` names the standard, edition and clause (e.g. "AISC 360-22 F2.2", "EN 1993-1-1 6.3.2.2").
5. Values that the engineer will want to see (Lp, Lr, Cb, Mcr, chi_LT, lambda_LT, class, ...) go in
   ``data`` as SI floats or strings, with the same names as in the standard.
6. A member-level check returns a :class:`MemberResult` whose ``governing`` is the check with the largest
   ratio.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

__all__ = ["CheckResult", "MemberResult", "status_word"]


def status_word(passed: bool | None) -> str:
    """The trade's words for a check outcome."""
    if passed is None:
        return "for information"
    return "OK" if passed else "NOT OK"


@dataclass(frozen=True)
class CheckResult:
    """One limit state at one place of a member.

    All numbers are SI floats in the unit of ``dim`` (see :data:`calckit.units.DIMS`).
    """

    limit_state: str  #: e.g. "Flexure: lateral-torsional buckling"
    clause: str  #: standard, edition, clause or equation
    dim: str  #: dimension of demand/capacity ("moment", "force", "shear_flow", "deflection", ...)
    capacity: float  #: design (LRFD / EN) or allowable (ASD) strength; for deflection the limit
    nominal: float | None = None  #: nominal strength Rn or characteristic resistance
    demand: float | None = None  #: factored (or service) load effect, if given
    ratio: float | None = None  #: demand / capacity
    passed: bool | None = None  #: ratio <= 1 (None when no demand was given)
    method: str = ""  #: "LRFD", "ASD", "EN" or "" for serviceability
    location: float | None = None  #: position along the member (m) where the demand acts
    segment: tuple[float, float] | None = None  #: unbraced segment (m, m) for LTB checks
    combination: str = ""  #: governing load combination name
    steps: tuple = ()  #: calc-sheet steps (calckit.render records), empty on the numeric path
    data: dict[str, Any] = field(default_factory=dict)  #: intermediate values (Lp, Lr, Cb, Mcr, ...)
    note: str = ""  #: a sentence for the engineer (e.g. "stiffeners required")

    @property
    def status(self) -> str:
        return status_word(self.passed)

    def with_demand(self, demand: float, **changes) -> "CheckResult":
        """The same capacity against ``demand`` (ratio and passed filled in)."""
        from dataclasses import replace

        ratio = abs(demand) / self.capacity if self.capacity > 0 else float("inf")
        return replace(self, demand=abs(demand), ratio=ratio, passed=ratio <= 1.0 + 1e-9, **changes)


@dataclass(frozen=True)
class MemberResult:
    """Every check along a member and the governing one."""

    standard: str  #: e.g. "AISC 360-22" or "EN 1993-1-1:2005"
    method: str  #: "LRFD", "ASD" or "EN"
    checks: tuple[CheckResult, ...]  #: all checks, in calc order
    section: str = ""  #: section designation
    steel: str = ""  #: grade
    notes: tuple[str, ...] = ()  #: notes for the engineer (e.g. Cb > 3 warnings, assumptions)
    steps: tuple = ()  #: member-level steps (classification etc.)

    @property
    def governing(self) -> CheckResult | None:
        rated = [c for c in self.checks if c.ratio is not None]
        return max(rated, key=lambda c: c.ratio) if rated else None

    @property
    def passed(self) -> bool:
        return all(c.passed is not False for c in self.checks)

    @property
    def max_ratio(self) -> float:
        g = self.governing
        return g.ratio if g is not None else 0.0
