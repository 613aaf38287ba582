"""Evaluation helpers shared by the EN 1993 checks: one formula source for numbers and calc-sheet steps.

Every displayed formula is a :class:`calckit.render.Formula` defined once at module level with
:func:`formula`. A :class:`Calc` evaluates it: with ``steps=True`` it records a ``Step`` (and
``Condition`` decisions) through render; with ``steps=False`` (the numeric path used by the section
search) it calls the same formula's compiled function on SI floats and records nothing.

Branch logic stays in Python; :meth:`Calc.branch` records the matching ``Condition`` on the steps path
and checks that the recorded decision agrees with the branch taken.
"""
from __future__ import annotations

import re
from typing import Any, Mapping

from ...render import Condition, Formula, decide, given

__all__ = ["formula", "condition", "Calc"]


def formula(symbol: str, expr: str, ref: str, label: str = "", dims: Mapping[str, str] | None = None,
            **kw) -> Formula:
    """Define a formula (cheap: sympy is loaded on first evaluation only); ``dims`` may be a shared table
    (entries for symbols the expression does not use are dropped)."""
    if dims:
        used = set(re.findall(r"[A-Za-z_][A-Za-z0-9_]*", expr)) | {symbol}
        dims = {k: v for k, v in dims.items() if k in used}
    return Formula(symbol, expr, dims=dims, ref=ref, label=label, **kw)


def condition(expr: str, ref: str, then: str = "", otherwise: str = "",
              dims: Mapping[str, str] | None = None, **kw) -> Condition:
    return Condition(expr, dims=dims, ref=ref, then=then, otherwise=otherwise, **kw)


class Calc:
    """Evaluates formulas and, when ``steps`` is True, keeps the records in order."""

    __slots__ = ("steps", "records")

    def __init__(self, steps: bool = False) -> None:
        self.steps = bool(steps)
        self.records: list = []

    def __call__(self, F: Formula, /, note: str = "", **values: Any) -> float:
        """Evaluate ``f`` on SI floats; record its Step when steps are on."""
        if self.steps:
            st = F.step(note=note, **values)
            self.records.append(st)
            return st.result
        return float(F(**values))

    def given(self, symbol: str, value: float, dim: str = "dimensionless", reference: str = "",
              note: str = "", label: str = "") -> float:
        """Record a value that comes from an input, a table or another check."""
        if self.steps:
            self.records.append(given(symbol, value, dim, reference=reference, note=note, label=label))
        return value

    def branch(self, cond: Condition, holds: bool, note: str = "", **values: Any) -> bool:
        """Record ``cond`` (steps path) and return ``holds``, the branch computed in Python."""
        if self.steps:
            d = cond.step(note=note, **values)
            if bool(d.holds) != bool(holds):  # pragma: no cover - would be a bug in this package
                raise AssertionError(f"condition {cond.expr} recorded {d.holds}, code took {holds}")
            self.records.append(d)
        return holds

    def say(self, text: str, reference: str = "", note: str = "") -> None:
        """Record a decision stated in words (a table look-up, a rule chosen by the input)."""
        if self.steps:
            self.records.append(decide(text, reference=reference, note=note))

    def extend(self, records) -> None:
        if self.steps:
            self.records.extend(records)

    def take(self) -> tuple:
        return tuple(self.records)
