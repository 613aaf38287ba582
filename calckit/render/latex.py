"""LaTeX forms of records: symbolic, substituted and result, in the SI or US display system.

Renderers only format: every number comes from a Step / Decision / Check record (SI floats) and is
converted to the display unit of its dimension (``calckit.units.display_unit``).
"""
from __future__ import annotations

import math

from . import numfmt
from .formula import PLACEHOLDER
from .numfmt import display_unit_for, format_number, si_to_display, unit_latex
from .records import Check, Decision, Step

__all__ = ["value_latex", "step_forms", "step_latex", "decision_latex", "check_latex", "ratio_text",
           "result_number"]

_OP_TEX = {"<": "<", "<=": r"\le", ">": ">", ">=": r"\ge", "==": "=", "!=": r"\ne"}
_NOT = {"<": ">=", "<=": ">", ">": "<=", ">=": "<", "==": "!=", "!=": "=="}


def _rounding(dim: str, sig: int | None, decimals: int | None) -> tuple[int | None, int | None]:
    if sig is None and decimals is None:
        if dim == numfmt.RATIO:
            return None, numfmt.RATIO_DECIMALS
        return numfmt.DEFAULT_SIG, None
    return sig, decimals


def result_number(si: float, dim: str, system: str, sig: int | None = None, decimals: int | None = None,
                  style: str = "latex") -> tuple[str, str]:
    """(number text, unit) of an SI value as displayed: converted and rounded."""
    unit = display_unit_for(dim, system)
    x = si_to_display(si, dim, unit)
    s, d = _rounding(dim, sig, decimals)
    return format_number(x, sig=s, decimals=d, style=style), unit


def value_latex(si: float, dim: str, system: str, *, sig: int | None = None, decimals: int | None = None,
                trim: bool = False) -> str:
    """``421\\ \\text{kip}{\\cdot}\\text{ft}``: an SI value in the display unit of ``dim``."""
    unit = display_unit_for(dim, system)
    x = si_to_display(si, dim, unit)
    s, d = _rounding(dim, sig, decimals)
    num = format_number(x, sig=s, decimals=d, trim=trim)
    ul = unit_latex(unit)
    if not ul:
        return num
    if unit == "deg":
        return num + ul
    return num + r"\ " + ul


def _input_latex(si: float, dim: str, system: str) -> str:
    return value_latex(si, dim, system, sig=numfmt.INPUT_SIG, trim=True)


def step_forms(step: Step, system: str = "SI") -> tuple[str, str, str]:
    """(symbolic, substituted, result) LaTeX of a step; symbolic/substituted are "" when not useful."""
    result = value_latex(step.result, step.dim, system, sig=step.sig, decimals=step.decimals)
    symbolic = step.latex if step.latex != step.symbol_latex else ""
    sub = ""
    if step.template and step.inputs:
        if step.template == PLACEHOLDER.format(next(iter(step.inputs))) and len(step.inputs) == 1:
            sub = ""   # right-hand side is a single symbol: its value is the result
        else:
            sub = step.template
            for n, (v, d) in step.inputs.items():
                sub = sub.replace(PLACEHOLDER.format(n), "(" + _input_latex(v, d, system) + ")")
    return symbolic, sub, result


def step_latex(step: Step, system: str = "SI") -> str:
    """``M_{n} = F_{y} Z_{x} = (50\\ \\text{ksi})(101\\ \\text{in}^{3}) = 421\\ \\text{kip}{\\cdot}\\text{ft}``."""
    symbolic, sub, result = step_forms(step, system)
    parts = [step.symbol_latex or step.symbol]
    if symbolic and symbolic != parts[0]:
        parts.append(symbolic)
    if sub:
        parts.append(sub)
    parts.append(result)
    return " = ".join(parts)


def _distinct(vals: list[float], dims: list[str], system: str) -> list[str]:
    """Format comparison values so that unequal neighbours never print alike (3 to 6 s.f.)."""
    for sig in range(numfmt.DEFAULT_SIG, 7):
        out = [value_latex(v, d, system, sig=sig) for v, d in zip(vals, dims)]
        clash = any(out[i] == out[i + 1] and vals[i] != vals[i + 1] for i in range(len(out) - 1))
        if not clash:
            return out
    return out


def _is_number(tex: str) -> bool:
    try:
        float(tex)
        return True
    except ValueError:
        return False


def decision_latex(dec: Decision, system: str = "SI") -> str:
    """``L_{p} = 5.83\\ ft < L_{b} = 11.7\\ ft \\le L_{r} = 16.9\\ ft`` (operators show the actual relation)."""
    if not dec.sides:
        return ""
    vals = [v for _, _, v, _ in dec.sides]
    dims = [d for _, d, _, _ in dec.sides]
    shown = _distinct(vals, dims, system)
    items = []
    for (tex, _d, _v, _single), num in zip(dec.sides, shown):
        items.append(num if _is_number(tex) else f"{tex} = {num}")
    out = items[0]
    import operator
    ops = {"<": operator.lt, "<=": operator.le, ">": operator.gt, ">=": operator.ge, "==": operator.eq,
           "!=": operator.ne}
    for i, op in enumerate(dec.ops):
        actual = op if ops[op](vals[i], vals[i + 1]) else _NOT[op]
        out += f" {_OP_TEX[actual]} {items[i + 1]}"
    return out


def ratio_text(ratio: float) -> str:
    """Utilisation ratio to 2 decimals, rounded up (so an exceedance never shows as 1.00)."""
    if not math.isfinite(ratio):
        return "∞"
    d = numfmt.RATIO_DECIMALS
    scaled = round(ratio * 10 ** d, 9)
    return f"{math.ceil(scaled) / 10 ** d:.{d}f}"


def check_latex(chk: Check, system: str = "SI") -> str:
    """``M_{u} = 266\\ ... \\le \\phi_{b} M_{n} = 379\\ ...``: demand against capacity."""
    dem = value_latex(chk.demand, chk.dim, system)
    cap = value_latex(chk.capacity, chk.dim, system)
    op = r"\le" if chk.passed else ">"
    left = f"{chk.demand_latex} = {dem}" if chk.demand_latex else dem
    right = f"{chk.capacity_latex} = {cap}" if chk.capacity_latex else cap
    return f"{left} {op} {right}"
