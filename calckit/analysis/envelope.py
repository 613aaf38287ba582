"""Pattern loading and envelopes of shear, moment, deflection and reactions over load combinations.

Pattern loading (e.g. ASCE 7-22 4.3.3 partial loading, ACI 318-19 6.4.3 arrangement of live load,
EN 1990 6.4.3.2(3) / EN 1991-1-1 6.2.1 arrangement of variable actions; clause numbers from memory):
each patterned load case of a combination is split per span (overhangs and cantilevers are spans) and
each span's part is either applied or not. Because the response is linear, at any station the worst
of the 2^n on/off arrangements of one case is the sum of its positive (for the maximum) or negative
(for the minimum) per-span contributions; the worst arrangement is picked per station and per case,
each patterned case independently (no arrangement is assumed to be shared between cases, which is the
conservative reading). ``pattern_method="enumerate"`` computes the same by enumerating all 2^n
arrangements (n <= 8) for checking.

A combination is any object with ``.name`` and ``.factors`` (dict case -> factor); the cases to pattern
are taken from ``.pattern`` if the object has it, else from ``.variable`` (the set of cases that may be
patterned or omitted when favourable), else none. A one-span beam with a patterned case simply gets
the case on or off.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Iterable

import numpy as np

from ..errors import InputError
from .piecewise import extrema as _extrema, load_scale, roundoff_scale, snap_zero
from .solver import solve_batch, split_by_span

__all__ = ["Envelope", "SpanEnvelope", "EnvelopeExtreme", "envelope", "stations_for"]

MAX_ENUMERATE_SPANS = 8
_QUANT = ("V", "M", "defl")


@dataclass(frozen=True)
class EnvelopeExtreme:
    """One extreme of the envelope.

    value: SI float (N, N*m or m); x: position (m); combination: name of the governing combination;
    loaded: patterned case -> tuple of the span indices loaded in the governing arrangement;
    side: "left"/"right" at a node where the quantity jumps, else None.
    """

    value: float
    x: float
    combination: str
    loaded: dict = field(default_factory=dict)
    side: str | None = None


@dataclass(frozen=True)
class SpanEnvelope:
    """Extremes of the envelope within one span (exact for the governing arrangement: the best
    station is refined with the polynomial roots of that combination and arrangement).

    span: span index; M_max / M_min: largest sagging / hogging moment; V_max / V_min: shear extremes;
    defl_max / defl_min: largest downward / upward deflection.
    """

    span: int
    M_max: EnvelopeExtreme
    M_min: EnvelopeExtreme
    V_max: EnvelopeExtreme
    V_min: EnvelopeExtreme
    defl_max: EnvelopeExtreme
    defl_min: EnvelopeExtreme

    @property
    def V_abs(self) -> EnvelopeExtreme:
        return self.V_max if abs(self.V_max.value) >= abs(self.V_min.value) else self.V_min


@dataclass(frozen=True, eq=False)
class Envelope:
    """Envelope of the beam's response over a set of combinations, with pattern loading.

    x: station positions (m); every grid node appears twice (left and right limit), so plotting
    ``x`` against ``V_max`` draws the jumps at point loads and supports.
    V_max, V_min, M_max, M_min, defl_max, defl_min: envelope values at the stations (N, N*m, m;
    conventions of :mod:`calckit.analysis`).
    V_max_by, ...: index into ``combinations`` of the governing combination at each station.
    combinations: combination names, in the order given.
    R_max, R_min: extreme vertical reaction per support (N, upward positive), R_max_by, R_min_by the
    governing combination indices; Mr_max, Mr_min: extreme moment reactions (N*m, clockwise positive).
    spans: per-span extremes (:class:`SpanEnvelope`).
    patterned: combination name -> the cases patterned in it.
    absent_cases: cases named in combinations that have no loads on the beam (taken as zero).
    method: text for the calc sheet saying how the envelope was obtained.
    nodes: support positions (m); support_kinds: kind of each support (for limits and diagrams).
    """

    x: np.ndarray = field(repr=False)
    V_max: np.ndarray = field(repr=False)
    V_min: np.ndarray = field(repr=False)
    M_max: np.ndarray = field(repr=False)
    M_min: np.ndarray = field(repr=False)
    defl_max: np.ndarray = field(repr=False)
    defl_min: np.ndarray = field(repr=False)
    V_max_by: np.ndarray = field(repr=False)
    V_min_by: np.ndarray = field(repr=False)
    M_max_by: np.ndarray = field(repr=False)
    M_min_by: np.ndarray = field(repr=False)
    defl_max_by: np.ndarray = field(repr=False)
    defl_min_by: np.ndarray = field(repr=False)
    combinations: tuple
    R_max: np.ndarray = field(repr=False)
    R_min: np.ndarray = field(repr=False)
    R_max_by: np.ndarray = field(repr=False)
    R_min_by: np.ndarray = field(repr=False)
    Mr_max: np.ndarray = field(repr=False)
    Mr_min: np.ndarray = field(repr=False)
    spans: tuple
    patterned: dict
    absent_cases: tuple
    method: str
    nodes: tuple = ()
    support_kinds: tuple = ()

    def governing(self, quantity: str, which: str, i: int) -> str:
        """Name of the combination governing ``quantity`` ('V', 'M', 'defl') 'max'/'min' at station i."""
        if quantity not in _QUANT or which not in ("max", "min"):
            raise InputError(f"quantity/which: got {quantity!r}/{which!r}; expected one of {_QUANT} and 'max'/'min'")
        return self.combinations[int(getattr(self, f"{quantity}_{which}_by")[i])]

    def overall(self, quantity: str, which: str) -> EnvelopeExtreme:
        """The extreme over all spans (from :attr:`spans`)."""
        pick = max if which == "max" else min
        return pick((getattr(s, f"{quantity}_{which}") for s in self.spans), key=lambda e: e.value)


def _pattern_set(c, solution_cases) -> frozenset:
    p = getattr(c, "pattern", None)
    if p is None:
        p = getattr(c, "variable", None)
    if p is None:
        return frozenset()
    if isinstance(p, str):
        p = {p}
    return frozenset(p)


def stations_for(grid, n_per_span: int = 40, extra=None):
    """Station segments and local offsets: every segment's both ends plus interior points, about
    ``n_per_span`` intervals per span; ``extra`` positions (m) are added on both sides."""
    x, h, span = grid.x, grid.h, grid.span
    span_len = np.bincount(span, weights=h)
    m = np.maximum(1, np.ceil(n_per_span * h / span_len[span]).astype(int))
    seg = np.repeat(np.arange(len(h)), m + 1)
    starts = np.concatenate(([0], np.cumsum(m + 1)[:-1]))
    idx = np.arange(seg.size) - np.repeat(starts, m + 1)
    t = idx / np.repeat(m, m + 1) * h[seg]
    if extra is not None:
        ex = np.asarray(extra, float).ravel()
        sl = np.clip(np.searchsorted(x, ex, side="left") - 1, 0, len(h) - 1)
        sr = np.clip(np.searchsorted(x, ex, side="right") - 1, 0, len(h) - 1)
        seg = np.concatenate((seg, sl, sr))
        t = np.concatenate((t, ex - x[sl], ex - x[sr]))
        order = np.lexsort((seg, x[seg] + t))
        seg, t = seg[order], t[order]
    return seg, t


def _horner(c: np.ndarray, seg: np.ndarray, t: np.ndarray) -> np.ndarray:
    """c: (B, K, n) -> values (B, n_stations)."""
    ck = c[:, seg, :]
    out = ck[..., -1]
    for p in range(c.shape[-1] - 2, -1, -1):
        out = out * t + ck[..., p]
    return out


def _weights(combos, cases, n_spans, pattern_on, missing):
    """Base and pattern weights (n_combo, n_sub); sub-case index = case_index * n_spans + span."""
    n_sub = len(cases) * n_spans
    Wb = np.zeros((len(combos), n_sub))
    Wp = np.zeros((len(combos), n_sub))
    absent, patterned = [], {}
    for ci, c in enumerate(combos):
        try:
            name, factors = c.name, dict(c.factors)
        except (AttributeError, TypeError, ValueError):
            raise InputError(f"combinations[{ci}]: got {c!r}; expected an object with .name and .factors "
                             "(dict case -> factor)") from None
        pset = _pattern_set(c, cases) if pattern_on else frozenset()
        used = set()
        for case, f in factors.items():
            try:
                f = float(f)
            except (TypeError, ValueError):
                raise InputError(f"combinations[{ci}] ({name}): factor for {case!r} is {f!r}; expected a number") from None
            if case not in cases:
                if missing == "error":
                    raise InputError(f"combinations[{ci}] ({name}): case {case!r} has no loads on the beam; "
                                     f"the beam's cases are {list(cases)}")
                if case not in absent:
                    absent.append(case)
                continue
            sl = slice(cases.index(case) * n_spans, (cases.index(case) + 1) * n_spans)
            if case in pset:
                Wp[ci, sl] += f
                used.add(case)
            else:
                Wb[ci, sl] += f
        patterned[name] = frozenset(used)
    return Wb, Wp, tuple(absent), patterned


def _pattern_extremes(Q, Wb, Wp, method, n_cases, n_spans):
    """(max, min) per combination and station: Q (n_sub, n_st) -> arrays (n_combo, n_st)."""
    base = Wb @ Q
    contrib = Wp[:, :, None] * Q[None, :, :]  # (n_combo, n_sub, n_st)
    if method == "sum":
        return base + np.maximum(contrib, 0.0).sum(axis=1), base + np.minimum(contrib, 0.0).sum(axis=1)
    # enumerate every on/off arrangement of each case's spans (2^n each), independently per case
    pats = ((np.arange(2 ** n_spans)[:, None] >> np.arange(n_spans)[None, :]) & 1).astype(float)  # (2^n, n)
    hi, lo = base.copy(), base.copy()
    for k in range(n_cases):
        ck = contrib[:, k * n_spans:(k + 1) * n_spans, :]  # (n_combo, n, n_st)
        tot = np.einsum("pn,cns->cps", pats, ck)
        hi += tot.max(axis=1)
        lo += tot.min(axis=1)
    return hi, lo


def envelope(solution, combinations: Iterable, *, n_per_span: int = 40, stations=None,
             pattern: bool = True, pattern_method: str = "sum", missing: str = "zero") -> Envelope:
    """Envelope of V, M, deflection and reactions over ``combinations`` with pattern loading.

    solution: a :class:`~calckit.analysis.results.BeamSolution`; combinations: objects with ``.name``,
    ``.factors`` and optionally ``.pattern`` / ``.variable`` (see the module docstring);
    n_per_span: station intervals per span (every grid node is a station, on both sides, in any case);
    stations: extra positions (m) to include; pattern: False to apply every case on all spans;
    pattern_method: "sum" (default, any number of spans) or "enumerate" (all 2^n arrangements, n <= 8);
    missing: "zero" (default) takes a case with no loads on the beam as zero, "error" raises.
    """
    combos = list(combinations)
    if not combos:
        raise InputError("combinations: got none; expected at least one combination")
    if pattern_method not in ("sum", "enumerate"):
        raise InputError(f"pattern_method: got {pattern_method!r}; expected 'sum' or 'enumerate'")
    if missing not in ("zero", "error"):
        raise InputError(f"missing: got {missing!r}; expected 'zero' or 'error'")
    layout, grid = solution.layout, solution.grid
    n_spans = layout.n_spans
    if pattern_method == "enumerate" and n_spans > MAX_ENUMERATE_SPANS:
        raise InputError(f"pattern_method: got 'enumerate' for {n_spans} spans; expected at most "
                         f"{MAX_ENUMERATE_SPANS} spans (use 'sum', which is exact for any number)")
    cases = solution.cases
    names = tuple(getattr(c, "name", f"combination {i}") for i, c in enumerate(combos))
    Wb, Wp, absent, patterned = _weights(combos, cases, n_spans, pattern, missing)

    sets = []
    for case in cases:
        sets.extend(split_by_span(layout, [ld for ld in solution.loads if ld.case == case]))
    batch = solve_batch(layout, grid, sets)
    seg, t = stations_for(grid, n_per_span, stations)
    xs = grid.x[seg] + t
    Q = {"V": _horner(batch.V, seg, t), "M": _horner(batch.M, seg, t), "defl": _horner(batch.delta, seg, t)}
    C = {"V": batch.V, "M": batch.M, "defl": batch.delta}
    out, per_combo = {}, {}
    Wabs = np.abs(Wb) + np.abs(Wp)  # round-off scale of a combination: the weighted sub-case scales
    for q in _QUANT:
        hi, lo = _pattern_extremes(Q[q], Wb, Wp, pattern_method, len(cases), n_spans)
        sc = (Wabs @ roundoff_scale(grid.x, C[q]))[:, None]
        hi, lo = snap_zero(hi, sc), snap_zero(lo, sc)
        per_combo[q] = (hi, lo)
        out[f"{q}_max_by"] = np.argmax(hi, axis=0)
        out[f"{q}_min_by"] = np.argmin(lo, axis=0)
        out[f"{q}_max"] = hi.max(axis=0)
        out[f"{q}_min"] = lo.min(axis=0)
    rhi, rlo = _pattern_extremes(batch.R, Wb, Wp, pattern_method, len(cases), n_spans)
    mhi, mlo = _pattern_extremes(batch.Mr, Wb, Wp, pattern_method, len(cases), n_spans)
    sc = (Wabs @ load_scale(grid.x, batch.V, grid.support_node, batch.R))[:, None]
    rhi, rlo = snap_zero(rhi, sc), snap_zero(rlo, sc)
    sc = (Wabs @ roundoff_scale(grid.x, batch.M))[:, None]
    mhi, mlo = snap_zero(mhi, sc), snap_zero(mlo, sc)

    span_env = []
    for sp in range(n_spans):
        in_sp = grid.span[seg] == sp
        idx_sp = np.nonzero(in_sp)[0]
        segs = np.nonzero(grid.span == sp)[0]
        ext = {}
        for q in _QUANT:
            for which, arr in (("max", per_combo[q][0]), ("min", per_combo[q][1])):
                sub = arr[:, idx_sp]
                flat = np.argmax(sub) if which == "max" else np.argmin(sub)
                ci, j = np.unravel_index(flat, sub.shape)
                st = idx_sp[j]
                # arrangement at the best station, then the exact extreme of that arrangement in the span
                contrib = Wp[ci] * Q[q][:, st]
                on = (contrib > 0) if which == "max" else (contrib < 0)
                w = Wb[ci] + np.where(on, Wp[ci], 0.0)
                coef = np.tensordot(w, C[q], axes=1)
                e_hi, e_lo = _extrema(grid.x, coef, segs, grid.span)
                e = e_hi if which == "max" else e_lo
                val, x_at, side = float(sub[ci, j]), float(xs[st]), None
                if (which == "max" and e.value >= val) or (which == "min" and e.value <= val):
                    val, x_at, side = e.value, e.x, e.side
                loaded = {}
                for k, case in enumerate(cases):
                    if case in patterned[names[ci]]:
                        loaded[case] = tuple(int(s) for s in range(n_spans) if on[k * n_spans + s])
                ext[f"{q}_{which}"] = EnvelopeExtreme(val, x_at, names[ci], loaded, side)
        span_env.append(SpanEnvelope(sp, ext["M_max"], ext["M_min"], ext["V_max"], ext["V_min"],
                                     ext["defl_max"], ext["defl_min"]))
    how = ("exact piecewise-polynomial solution per load case and span; "
           + ("pattern loading: each patterned case applied span by span where adverse "
              f"({'sum of adverse span contributions' if pattern_method == 'sum' else 'all 2^n arrangements enumerated'}); "
              if pattern and any(patterned.values()) else "no pattern loading; ")
           + f"{len(xs)} stations, every load and support position on both sides")
    return Envelope(
        x=xs, combinations=names,
        R_max=rhi.max(axis=0), R_min=rlo.min(axis=0), R_max_by=np.argmax(rhi, axis=0),
        R_min_by=np.argmin(rlo, axis=0), Mr_max=mhi.max(axis=0), Mr_min=mlo.min(axis=0),
        spans=tuple(span_env), patterned=patterned, absent_cases=absent, method=how,
        nodes=tuple(layout.nodes), support_kinds=tuple(s.kind for s in layout.supports), **out,
    )
