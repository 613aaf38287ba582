"""Records of a calculation: Step, Decision and Check (frozen dataclasses, data only, SI floats).

Design code makes them through :meth:`Formula.step`, :meth:`Condition.step`, :func:`given` and
:func:`check`; renderers (``calckit.render.latex`` / ``html``) only format them, so what is shown can
never differ from what was computed.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field, fields
from typing import Any, Union

from ..errors import InputError

__all__ = ["Step", "Decision", "Check", "Record", "given", "decide", "check", "OK", "NOT_OK"]

OK = "OK"            # status of a check whose demand does not exceed its capacity
NOT_OK = "NOT OK"    # status of a check whose demand exceeds its capacity


@dataclass(frozen=True)
class Step:
    """One evaluated formula (or a given value) with everything needed to show it.

    Fields
    ------
    symbol : result name, e.g. "M_n".
    latex : symbolic right-hand side in LaTeX ("F_{y} Z_{x}"); "" for a given value.
    inputs : {input name: (SI value, dimension)}.
    result : SI value of the result.
    dim : dimension of the result (a key of calckit.units.DIMS, or "ratio").
    reference : standard + edition + clause/equation, "beam formula", "common practice", or the source
        of a given value.
    note : optional remark shown beside the step.
    label : a few words saying what is computed.
    symbol_latex : LaTeX of the result symbol ("M_{n}").
    template : right-hand side with each input written as ``⟦name⟧`` (filled in by the renderer).
    input_latex : {input name: LaTeX name}.
    sig, decimals : display rounding of the result (None: 3 significant figures; ratios 2 decimals).
    """

    symbol: str
    latex: str
    inputs: dict[str, tuple[float, str]]
    result: float
    dim: str
    reference: str = ""
    note: str = ""
    label: str = ""
    symbol_latex: str = ""
    template: str = ""
    input_latex: dict[str, str] = field(default_factory=dict)
    sig: int | None = None
    decimals: int | None = None

    kind = "step"

    def to_dict(self) -> dict[str, Any]:
        """JSON-ready dictionary (inputs as [value, dim] lists); inverse of :meth:`from_dict`."""
        return {
            "kind": "step", "symbol": self.symbol, "latex": self.latex,
            "inputs": {k: [_num(v), d] for k, (v, d) in self.inputs.items()},
            "result": _num(self.result), "dim": self.dim, "reference": self.reference, "note": self.note,
            "label": self.label, "symbol_latex": self.symbol_latex, "template": self.template,
            "input_latex": dict(self.input_latex), "sig": self.sig, "decimals": self.decimals,
        }

    @classmethod
    def from_dict(cls, d: dict[str, Any]) -> "Step":
        kw = _known(cls, d)
        kw["inputs"] = {k: (_unnum(v), dd) for k, (v, dd) in d["inputs"].items()}
        kw["result"] = _unnum(d["result"])
        return cls(**kw)


@dataclass(frozen=True)
class Decision:
    """The condition that selected a branch of the design logic, with its numbers.

    Fields
    ------
    condition : the condition as written ("L_p < L_b <= L_r").
    sides : per side of the chain: (LaTeX, dimension, SI value, is_single_symbol).
    ops : comparison operators between sides ("<", "<=", ...).
    holds : whether the condition is true for these values.
    inputs : {symbol: (SI value, dimension)}.
    conclusion : what follows ("inelastic lateral-torsional buckling applies"), for the actual outcome.
    reference : clause stating the condition.
    note, label : optional remark / few words.
    input_latex : {symbol: LaTeX name}.
    """

    condition: str
    sides: tuple[tuple[str, str, float, bool], ...]
    ops: tuple[str, ...]
    holds: bool
    inputs: dict[str, tuple[float, str]] = field(default_factory=dict)
    conclusion: str = ""
    reference: str = ""
    note: str = ""
    label: str = ""
    input_latex: dict[str, str] = field(default_factory=dict)

    kind = "decision"

    def __bool__(self) -> bool:
        return self.holds

    def to_dict(self) -> dict[str, Any]:
        return {
            "kind": "decision", "condition": self.condition,
            "sides": [[t, d, _num(v), s] for t, d, v, s in self.sides], "ops": list(self.ops),
            "holds": self.holds, "inputs": {k: [_num(v), d] for k, (v, d) in self.inputs.items()},
            "conclusion": self.conclusion, "reference": self.reference, "note": self.note,
            "label": self.label, "input_latex": dict(self.input_latex),
        }

    @classmethod
    def from_dict(cls, d: dict[str, Any]) -> "Decision":
        kw = _known(cls, d)
        kw["sides"] = tuple((t, dd, _unnum(v), bool(s)) for t, dd, v, s in d["sides"])
        kw["ops"] = tuple(d["ops"])
        kw["inputs"] = {k: (_unnum(v), dd) for k, (v, dd) in d["inputs"].items()}
        return cls(**kw)


Record = Union[Step, Decision]


@dataclass(frozen=True)
class Check:
    """A limit-state check: demand against capacity.

    Fields
    ------
    name : limit state ("Flexure, lateral-torsional buckling").
    demand, capacity : SI values of the same dimension ``dim``.
    dim : dimension of demand and capacity.
    ratio : demand / capacity (inf when the capacity is 0 and the demand is not).
    status : "OK" when ratio <= 1, else "NOT OK".
    passed : ratio <= 1.
    reference : clause of the standard that gives the capacity (or the limit).
    steps : the Step / Decision records that led to demand and capacity, in order.
    demand_latex, capacity_latex : LaTeX of the two sides ("M_{u}", "\\phi_{b} M_{n}").
    note : optional remark.
    """

    name: str
    demand: float
    capacity: float
    dim: str
    ratio: float
    status: str
    passed: bool
    reference: str = ""
    steps: tuple[Record, ...] = ()
    demand_latex: str = ""
    capacity_latex: str = ""
    note: str = ""

    kind = "check"

    def to_dict(self) -> dict[str, Any]:
        return {
            "kind": "check", "name": self.name, "demand": _num(self.demand), "capacity": _num(self.capacity),
            "dim": self.dim, "ratio": _num(self.ratio), "status": self.status, "passed": self.passed,
            "reference": self.reference, "steps": [s.to_dict() for s in self.steps],
            "demand_latex": self.demand_latex, "capacity_latex": self.capacity_latex, "note": self.note,
        }

    @classmethod
    def from_dict(cls, d: dict[str, Any]) -> "Check":
        kw = _known(cls, d)
        for k in ("demand", "capacity", "ratio"):
            kw[k] = _unnum(d[k])
        kw["steps"] = tuple(record_from_dict(s) for s in d["steps"])
        return cls(**kw)


def record_from_dict(d: dict[str, Any]):
    """Rebuild a Step, Decision or Check from its ``to_dict()`` form."""
    kind = d.get("kind")
    if kind == "step":
        return Step.from_dict(d)
    if kind == "decision":
        return Decision.from_dict(d)
    if kind == "check":
        return Check.from_dict(d)
    raise InputError(f"record kind: got {kind!r}; expected 'step', 'decision' or 'check'")


def _known(cls, d: dict[str, Any]) -> dict[str, Any]:
    names = {f.name for f in fields(cls)}
    return {k: v for k, v in d.items() if k in names}


def _num(v: float):
    """JSON has no inf/nan: write them as strings."""
    v = float(v)
    return v if math.isfinite(v) else repr(v)


def _unnum(v) -> float:
    return float(v)


# ---------------------------------------------------------------------------------------- makers
def given(symbol: str, value, dim: str = "dimensionless", *, reference: str = "", note: str = "",
          label: str = "", latex: str | None = None, sig: int | None = None,
          decimals: int | None = None) -> Step:
    """A Step for a value that is not computed by a formula here (from analysis, a table, an input).

    ``value``: SI float, pint quantity or string such as "266 kip*ft" (converted with calckit.units).
    """
    from .formula import _si_input, symbol_latex
    from .numfmt import check_dim

    check_dim(dim, symbol)
    v = _si_input(f"given {symbol}", symbol, value, dim)
    return Step(symbol=symbol, latex="", inputs={}, result=v, dim=dim, reference=reference, note=note,
                label=label, symbol_latex=latex or symbol_latex(symbol), sig=sig, decimals=decimals)


def decide(text: str, *, holds: bool = True, reference: str = "", note: str = "") -> Decision:
    """A Decision stated in words, for a branch chosen by something other than a comparison
    ("the section is doubly symmetric, so AISC 360-22 F2 applies")."""
    return Decision(condition=text, sides=(), ops=(), holds=holds, conclusion=text, reference=reference,
                    note=note)


def _side(x, dim: str | None, what: str) -> tuple[float, str, str]:
    if isinstance(x, Step):
        return x.result, x.dim, x.symbol_latex
    if isinstance(x, tuple) and len(x) == 2:
        v, d = x
        from .formula import _si_input
        return _si_input("check", what, v, d), d, ""
    if dim is None:
        raise InputError(f"{what}: got {x!r} without a dimension; pass a Step, a (value, dim) pair, or dim=")
    from .formula import _si_input
    return _si_input("check", what, x, dim), dim, ""


def check(name: str, demand, capacity, *, reference: str = "", steps=(), dim: str | None = None,
          note: str = "", demand_latex: str | None = None, capacity_latex: str | None = None) -> Check:
    """Compare ``demand`` with ``capacity`` and return a :class:`Check`.

    ``demand`` / ``capacity``: Steps (their symbol and dimension are used), (value, dim) pairs, or SI
    floats / quantities with ``dim=``. ``steps``: the records that led to them, in order (the demand and
    capacity Steps are appended if not already present). A failing check is a result (passed=False).
    """
    from .numfmt import check_dim

    d, dd, dl = _side(demand, dim, "demand")
    c, cd, cl = _side(capacity, dim, "capacity")
    from ..units import DIMS
    from .numfmt import base_dim

    check_dim(dd, "demand")
    check_dim(cd, "capacity")
    if DIMS[base_dim(dd)][0] != DIMS[base_dim(cd)][0]:
        raise InputError(f"capacity: got dimension {cd!r}; expected the demand's dimension {dd!r} ({name})")
    if d < 0 or c < 0:
        which = "demand" if d < 0 else "capacity"
        raise InputError(f"{which}: got {d if d < 0 else c!r}; expected a magnitude >= 0 ({name}); "
                         "pass absolute values")
    if c == 0:
        ratio = 0.0 if d == 0 else math.inf
    else:
        ratio = d / c
    passed = ratio <= 1.0
    recs = list(steps)
    for s in (demand, capacity):
        if isinstance(s, Step) and not any(r is s for r in recs):
            recs.append(s)
    for r in recs:
        if not isinstance(r, (Step, Decision)):
            raise InputError(f"steps: got {type(r).__name__}; expected Step or Decision records")
    return Check(name=name, demand=d, capacity=c, dim=dd, ratio=ratio, status=OK if passed else NOT_OK,
                 passed=passed, reference=reference, steps=tuple(recs),
                 demand_latex=demand_latex if demand_latex is not None else dl,
                 capacity_latex=capacity_latex if capacity_latex is not None else cl, note=note)
