"""Real moment diagrams of every load arrangement, for the checks that need a diagram, not an envelope.

An envelope (:mod:`calckit.analysis.envelope`) takes the worst value at each station, possibly from
different arrangements of the variable loads; it is the right demand for strength at a cross-section but it
is *not* a moment diagram. Lateral-torsional buckling (AISC 360-22 Cb, Eq. F1-1; EN 1993-1-1 C1 for Mcr)
depends on the shape of the moment diagram of one loading, so those checks must be run on each real
arrangement. :func:`arrangements` returns, for each combination, the result with every case on all spans
and, for the cases the combination may pattern, each on/off arrangement of those cases span by span
(exact enumeration while the count stays within ``max_per_combination``; otherwise a reduced set of the
arrangements of common practice: all spans, alternate spans, and the two spans adjacent to each support
with alternate spans beyond).
"""
from __future__ import annotations

from itertools import product
from typing import Iterable

import numpy as np

from ..errors import InputError
from .envelope import _weights
from .results import BeamResult
from .solver import solve_batch, split_by_span

__all__ = ["arrangements"]

_FIELDS = ("V", "M", "phi", "delta", "R", "Mr")


def _reduced_patterns(n: int) -> list[tuple[int, ...]]:
    """All, odd, even and each support's adjacent pair with alternates beyond (common practice)."""
    pats = {tuple([1] * n), tuple(int(i % 2 == 0) for i in range(n)), tuple(int(i % 2 == 1) for i in range(n))}
    for s in range(1, n):  # interior support s lies between spans s-1 and s
        p = [0] * n
        for i in range(n):
            d = (s - 1 - i) if i < s else (i - s)
            p[i] = int(d % 2 == 0)
        pats.add(tuple(p))
    return sorted(pats, reverse=True)


def arrangements(solution, combinations: Iterable, *, pattern: bool = True, max_per_combination: int = 256,
                 missing: str = "zero") -> dict[str, BeamResult]:
    """Combination name (with the loaded spans) -> :class:`BeamResult` of that arrangement.

    solution: a :class:`~calckit.analysis.results.BeamSolution`; combinations: objects with ``.name`` and
    ``.factors`` (and ``.variable``/``.pattern``, as for the envelope). Names are the combination's name,
    followed for patterned arrangements by the loaded spans, e.g. ``"LRFD 2: 1.2D + 1.6L [L: spans 1, 3]"``
    (spans numbered from 1). Arrangements giving the same diagram as one already listed, and the empty one,
    are dropped.
    """
    combos = list(combinations)
    if not combos:
        raise InputError("combinations: got none; expected at least one combination")
    layout, grid = solution.layout, solution.grid
    n = layout.n_spans
    cases = solution.cases
    Wb, Wp, _, patterned = _weights(combos, cases, n, pattern, missing)
    sets = []
    for case in cases:
        sets.extend(split_by_span(layout, [ld for ld in solution.loads if ld.case == case]))
    batch = solve_batch(layout, grid, sets)
    arrs = {f: getattr(batch, f) for f in _FIELDS}
    out: dict[str, BeamResult] = {}
    seen: list[np.ndarray] = []
    for ci, c in enumerate(combos):
        name, factors = c.name, dict(c.factors)
        pcases = [k for k, case in enumerate(cases) if case in patterned[name] and Wp[ci, k * n:(k + 1) * n].any()]
        if n == 1 or not pcases:
            choices = [tuple([1] * n)] if not pcases else [(1,), (0,)]
            per_case = [choices] * max(len(pcases), 1) if pcases else [[tuple([1] * n)]]
        else:
            full = [tuple(int(b) for b in np.binary_repr(m, n)[::-1]) for m in range(2 ** n - 1, -1, -1)]
            count = len(full) ** len(pcases)
            per_case = [full if count <= max_per_combination else _reduced_patterns(n)] * len(pcases)
        combos_iter = product(*per_case) if pcases else [()]
        for choice in combos_iter:
            w = Wb[ci].copy()
            for k, pat in zip(pcases, choice):
                w[k * n:(k + 1) * n] += Wp[ci, k * n:(k + 1) * n] * np.asarray(pat, dtype=float)
            # unpatterned variable weight already in Wb; patterned weight only where switched on
            for k in range(len(cases)):
                if k not in pcases:
                    w[k * n:(k + 1) * n] += Wp[ci, k * n:(k + 1) * n]
            key = w.round(12)
            if not key.any():  # nothing loaded: no diagram to check
                continue
            if any(np.array_equal(key, s) for s in seen):
                continue
            seen.append(key)
            label = name
            parts = []
            for k, pat in zip(pcases, choice):
                if all(pat):
                    continue
                on = [str(i + 1) for i in range(n) if pat[i]]
                parts.append(f"{cases[k]}: " + (f"span{'s' if len(on) > 1 else ''} {', '.join(on)}" if on else "off"))
            if parts:
                label = f"{name} [{'; '.join(parts)}]"
            vals = {f: np.tensordot(w, arrs[f], axes=1) for f in _FIELDS}
            out[label] = BeamResult(label, factors, layout, grid, vals["V"], vals["M"], vals["phi"],
                                    vals["delta"], vals["R"], vals["Mr"])
    return out
