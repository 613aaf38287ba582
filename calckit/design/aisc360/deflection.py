"""Deflection limits L/n for serviceability (AISC 360-22 Chapter L leaves the limits to the engineer).

Default limits (``LIMITS``) are those of common practice, as in IBC (2021) Table 1604.3 (from memory):
floor members L/360 under live load and L/240 under total (dead + live) load; roof members supporting a
non-plaster ceiling L/240 under roof live, snow or wind load and L/180 under total load. Other cases (plaster
ceilings L/360, roofs without ceilings L/180 and L/120, brittle finishes, cladding, ponding) need limits
passed explicitly. For a cantilever, L is taken as twice the cantilever length (common practice; the same
rule is a footnote of IBC Table 1604.3, from memory). Project specifications govern.
"""
from __future__ import annotations

import math

from ...errors import InputError
from ..results import CheckResult
from ._core import Calc, Fm, length_si, quantity_si, result

__all__ = ["deflection", "LIMITS", "limit_for"]

#: member type -> load case kind -> n in L/n (common practice; IBC Table 1604.3 from memory)
LIMITS: dict[str, dict[str, float]] = {
    "floor": {"live": 360.0, "total": 240.0},
    "roof": {"live": 240.0, "total": 180.0},
}
_REF = "common practice (IBC Table 1604.3, from memory)"

LEFF_CANT = Fm("L_eff", "2*L", "common practice: L taken as twice the cantilever length",
               "span used for the limit of a cantilever")
LIM = Fm("delta_lim", "L_eff/n", _REF, "deflection limit L/n")


def limit_for(member: str, case: str, limits=None) -> float:
    """n of L/n for ``case`` ("live", "total", ...) of a ``member`` ("floor", "roof"), or from ``limits``."""
    if limits is not None:
        if case not in limits:
            raise InputError(f"deflection case {case!r}: no limit given; deflection_limits has "
                             f"{sorted(limits)} (expected n of L/n for each case)")
        n = limits[case]
    else:
        table = LIMITS.get(member)
        if table is None:
            raise InputError(f"member: got {member!r}; expected one of {sorted(LIMITS)} or pass "
                             "deflection_limits={'live': 360, ...}")
        if case not in table:
            raise InputError(f"deflection case: got {case!r}; for a {member} member expected one of "
                             f"{sorted(table)} or pass deflection_limits")
        n = table[case]
    try:
        n = float(n)
    except (TypeError, ValueError):
        raise InputError(f"deflection limit for {case!r}: got {n!r}; expected n of L/n, a number > 0") from None
    if not (math.isfinite(n) and n > 0):
        raise InputError(f"deflection limit for {case!r}: got {n!r}; expected n of L/n, a number > 0")
    return n


def deflection_check(delta: float, L: float, n: float, case: str, calc: Calc, *, cantilever: bool = False,
                     location=None, segment=None, ref: str = _REF, extra_data=None,
                     extra_note: str = "") -> CheckResult:
    """L/n check on SI floats (internal)."""
    calc.given("L", L, "span", reference="cantilever length" if cantilever else "span between supports")
    Leff = calc(LEFF_CANT, L=L) if cantilever else L
    lim = calc(LIM, L_eff=Leff, n=n)
    calc.given("delta", abs(delta), "deflection", reference=f"analysis, {case} load")
    note = "cantilever: L taken as twice its length (common practice)" if cantilever else ""
    data = {"n": n, "L": L, "L_eff": Leff, "cantilever": cantilever}
    if extra_data:
        data.update(extra_data)
    if extra_note:
        note = "; ".join(x for x in (note, extra_note) if x)
    return result(limit_state=f"Deflection: {case} load, L/{n:g}", clause=ref, dim="deflection",
                  capacity=lim, method="", location=location, segment=segment, combination=case,
                  steps=calc.take(), data=data, note=note, demand=abs(delta))


def deflection(delta, span, n=None, *, case: str = "live", member: str = "floor", cantilever: bool = False,
               steps: bool = True) -> CheckResult:
    """Deflection against L/n.

    Parameters
    ----------
    delta : computed deflection (quantity or string, e.g. "0.82 in").
    span : span between supports, or the cantilever length when ``cantilever`` is True.
    n : the limit's n (L/n); None takes the default of ``member`` and ``case`` from :data:`LIMITS`.
    case : "live" or "total" (for the defaults), or any label when ``n`` is given.
    member : "floor" or "roof" (for the defaults).
    cantilever : L is taken as twice the cantilever length (common practice).
    """
    d = abs(quantity_si(delta, "deflection", "delta"))
    L = length_si(span, "span", allow_zero=False)
    nn = limit_for(member, case) if n is None else limit_for(member, case, {case: n})
    return deflection_check(d, L, nn, case, Calc(steps), cantilever=cantilever)
