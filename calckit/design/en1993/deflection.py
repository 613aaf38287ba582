"""Deflection (serviceability) checks, EN 1993-1-1:2005 7.2.1 and EN 1990 A1.4.

EN 1993-1-1 7.2.1 leaves the limits to the National Annex and the project. calckit's defaults come from the
annex set: "recommended" holds common-practice floor-beam limits (span/250 for the total deflection,
span/300 for the deflection under variable actions), not EN values; the project may override them
(``limit=`` per check, or ``deflection_total``/``deflection_variable`` in a user annex set).
"""
from __future__ import annotations

import numpy as np

from ...errors import InputError
from ._calc import Calc, formula
from ._common import length
from ._result import ENResult, rated
from .factors import annex_set

__all__ = ["deflection", "deflection_limit"]

F_LIM = formula("w_lim", "L/n_lim", "EN 1993-1-1:2005 7.2.1; limit from the annex set / project",
                "deflection limit", dims={"w_lim": "deflection", "L": "span"})


def deflection_limit(kind: str, annex) -> tuple[float, str]:
    """(span divisor, source) for ``kind`` "total" or "variable"."""
    ann = annex_set(annex)
    if kind == "total":
        return ann.deflection_total, ann.deflection_source
    if kind == "variable":
        return ann.deflection_variable, ann.deflection_source
    raise InputError(f"kind: got {kind!r}; expected 'total' or 'variable'")


def deflection(delta, span, *, kind: str = "total", limit: float | None = None, annex=None, name: str = "",
               steps: bool = True, location=None) -> ENResult:
    """Largest |deflection| of ``delta`` (a length, or an array of SI metres) against span/limit.

    ``kind``: "total" or "variable" (selects the annex set's divisor); ``limit``: a divisor overriding it
    (e.g. 360); ``name``: the serviceability combination.
    """
    from ...units import is_quantity, to_si

    if is_quantity(delta) or isinstance(delta, str):
        d = np.abs(np.atleast_1d(to_si(delta, "deflection", "delta")))
    else:
        d = np.abs(np.atleast_1d(np.asarray(delta, dtype=float)))
    if d.size == 0 or not np.all(np.isfinite(d)):
        raise InputError("delta: expected finite deflection values")
    L = length(span, "span")
    ann = annex_set(annex)
    n, src = deflection_limit(kind, ann)
    if limit is not None:
        if not (isinstance(limit, (int, float)) and limit > 0):
            raise InputError(f"limit: got {limit!r}; expected a span divisor > 0, e.g. 250")
        n, src = float(limit), "given"
    calc = Calc(steps)
    w = calc(F_LIM, L=L, n_lim=n, note=f"{kind} deflection; {src}")
    i = int(np.argmax(d))
    return rated(float(d[i]), limit_state=f"Deflection ({kind}{', ' + name if name else ''})",
                 clause="EN 1993-1-1:2005 7.2.1", dim="deflection", capacity=w, method="",
                 steps=calc.take(), data={"limit": n, "limit_source": src, "kind": kind, "span": L,
                                          "annex": ann.name, "index": i},
                 location=location, combination=name)
