"""Evaluation and exact extrema of piecewise polynomials on a beam grid.

A piecewise polynomial is a grid ``x`` (K+1 nodes) and local coefficients ``c`` of shape (K, n) in
increasing powers of ``t = x - x_k`` on segment k. At a node the value may jump (shear at a point load,
moment at a couple, slope at a hinge): ``side="left"`` takes the limit from the left, ``"right"`` from
the right; at the beam ends the value inside the beam is returned.

Extrema come from the end values of each segment and the real roots of the derivative inside it
(closed form up to degree 2, companion-matrix eigenvalues above, each polished by Newton steps), so
they are exact to rounding.

Round-off: where a result is exactly zero in statics (the moment at a pinned end or at an inflection
point that happens to be a station, the shear and moment at a free end, deflection and slope at
supports), the polynomial arithmetic leaves noise of the order of 1e-16 of the member's values.
:func:`evaluate` and :func:`extrema` return such values as exactly 0.0: a value is snapped when
``|value| <= ZERO_REL * scale``, ``scale`` being :func:`roundoff_scale` of the whole member (an upper
bound of |value| over it). No value larger than that is changed.
"""
from __future__ import annotations

from dataclasses import dataclass

import numpy as np

__all__ = ["segment_index", "evaluate", "Extreme", "extrema", "ZERO_REL", "roundoff_scale", "snap_zero",
           "load_scale"]

#: Values smaller than this fraction of the member's scale are round-off and returned as exactly 0.0.
ZERO_REL = 1e-12


def roundoff_scale(grid: np.ndarray, c: np.ndarray):
    """Scale of a piecewise polynomial for round-off: max over segments of sum_p |c_kp| h_k^p.

    It bounds |value| over the member from above, and it is the size of the terms whose cancellation
    leaves the rounding error of an evaluation (Horner's scheme), so ``ZERO_REL * scale`` is far above
    that error and far below any value that is not zero in statics. ``c`` is (K, n) (returns a float)
    or (B, K, n) for B polynomials on one grid (returns an array (B,)).
    """
    h = np.diff(np.asarray(grid, dtype=float))
    if c.size == 0:
        return 0.0 if c.ndim == 2 else np.zeros(c.shape[0])
    s = np.max(np.sum(np.abs(c) * h[:, None] ** np.arange(c.shape[-1]), axis=-1), axis=-1)
    return float(s) if np.ndim(s) == 0 else s


def snap_zero(values, scale):
    """``values`` with every entry of magnitude <= ZERO_REL * scale set to exactly 0.0 (float or array;
    ``scale`` a float or an array broadcasting against ``values``)."""
    tol = ZERO_REL * np.asarray(scale, dtype=float)
    if np.ndim(values) == 0 and tol.ndim == 0:
        v = float(values)
        return 0.0 if abs(v) <= tol else v
    v = np.asarray(values, dtype=float)
    return np.where(np.abs(v) <= tol, 0.0, v)


def load_scale(grid: np.ndarray, Vc: np.ndarray, support_node, R):
    """Total magnitude of the loads (N) from a shear polynomial and the reactions: the integral of |w|
    (bounded per segment by |w0| h + |w1| h^2 / 2, w = -dV/dx) plus every point force, which is the
    reaction minus the jump of V at its node (V is 0 outside the beam). The scale of the round-off in
    the reactions. ``Vc`` (K, 3) with ``R`` (n_supports,) gives a float; (B, K, 3) with (B, n_supports)
    gives an array (B,)."""
    x = np.asarray(grid, dtype=float)
    h = np.diff(x)
    Vb = np.asarray(Vc, dtype=float)
    Rb = np.asarray(R, dtype=float)
    single = Vb.ndim == 2
    if single:
        Vb, Rb = Vb[None], Rb[None]
    B = Vb.shape[0]
    w0, w1 = -Vb[..., 1], -2.0 * Vb[..., 2]
    dist = np.sum(np.abs(w0) * h + np.abs(w1) * (h * h / 2), axis=-1)
    zero = np.zeros((B, 1))
    after = np.concatenate((Vb[..., 0], zero), axis=1)  # V just right of each node (0 right of x = L)
    before = np.concatenate((zero, Vb[..., 0] + Vb[..., 1] * h + Vb[..., 2] * (h * h)), axis=1)
    node_R = np.zeros((B, len(x)))
    for i, j in enumerate(support_node):
        node_R[:, j] += Rb[:, i]
    out = dist + np.sum(np.abs(node_R - (after - before)), axis=-1)
    return float(out[0]) if single else out


def segment_index(grid: np.ndarray, x: np.ndarray, side: str = "right") -> np.ndarray:
    """Segment holding each x ('right': x at a node belongs to the segment starting there)."""
    if side not in ("left", "right"):
        raise ValueError(f"side: got {side!r}; expected 'left' or 'right'")
    k = np.searchsorted(grid, x, side=side) - 1
    return np.clip(k, 0, len(grid) - 2)


def evaluate(grid: np.ndarray, c: np.ndarray, x, side: str = "right", seg=None, scale: float | None = None):
    """Value at x (float or array) of the piecewise polynomial with coefficients ``c`` (K, n).

    Round-off below ``ZERO_REL * scale`` is returned as 0.0 (see the module docstring); ``scale``
    defaults to :func:`roundoff_scale` of ``c`` (pass it when evaluating one polynomial often)."""
    xa = np.asarray(x, dtype=float)
    k = segment_index(grid, xa, side) if seg is None else seg
    t = xa - grid[k]
    ck = c[k]
    out = ck[..., -1]
    for p in range(c.shape[-1] - 2, -1, -1):
        out = out * t + ck[..., p]
    out = snap_zero(out, roundoff_scale(grid, c) if scale is None else scale)
    return float(out) if np.ndim(out) == 0 else out


@dataclass(frozen=True)
class Extreme:
    """An extreme value of a result along the beam.

    value: the value (SI: N, N*m, rad or m); x: position in m; side: "left" or "right" when the value
    is the limit at a node where the quantity jumps (e.g. shear beside a point load), else None;
    span: index of the span holding x (0-based).
    """

    value: float
    x: float
    side: str | None = None
    span: int = 0


def _real_roots_unit(d: np.ndarray) -> np.ndarray:
    """Real roots in (0, 1) of the polynomial sum d_p u^p (increasing powers)."""
    scale = np.max(np.abs(d)) if d.size else 0.0
    if scale == 0.0:
        return np.empty(0)
    d = np.trim_zeros(np.where(np.abs(d) > 1e-13 * scale, d, 0.0), "b")
    deg = len(d) - 1
    if deg <= 0:
        return np.empty(0)
    if deg == 1:
        r = np.array([-d[0] / d[1]])
    elif deg == 2:
        a, b, c = d[2], d[1], d[0]
        disc = b * b - 4 * a * c
        if disc < 0:
            if disc > -1e-12 * (b * b + abs(4 * a * c)):
                disc = 0.0
            else:
                return np.empty(0)
        sq = np.sqrt(disc)
        q = -0.5 * (b + np.copysign(sq, b)) if b != 0 else -0.5 * sq
        r = np.array([q / a, c / q]) if q != 0 else np.array([0.0])
    else:
        z = np.roots(d[::-1])
        r = z.real[np.abs(z.imag) <= 1e-7 * (1 + np.abs(z.real))]
    r = r[(r > -1e-9) & (r < 1 + 1e-9)]
    if r.size and deg > 2:  # Newton polish on the derivative polynomial
        dd = np.arange(1, deg + 1) * d[1:]
        for _ in range(3):
            f = np.polyval(d[::-1], r)
            fp = np.polyval(dd[::-1], r)
            ok = fp != 0
            r = np.where(ok, r - np.where(ok, f / np.where(ok, fp, 1.0), 0.0), r)
    return np.clip(r, 0.0, 1.0)


def extrema(grid: np.ndarray, c: np.ndarray, segs, span_of_seg=None) -> tuple[Extreme, Extreme]:
    """Exact (max, min) of the piecewise polynomial over the given segment indices (round-off below
    ``ZERO_REL`` times :func:`roundoff_scale` of the whole polynomial returned as 0.0)."""
    scale = roundoff_scale(grid, c)
    best_hi = (-np.inf, 0.0, None, 0)
    best_lo = (np.inf, 0.0, None, 0)
    n = c.shape[-1]
    K = len(grid) - 1
    for k in segs:
        h = grid[k + 1] - grid[k]
        cu = c[k] * h ** np.arange(n)  # coefficients in u = t / h
        cand_u = [0.0, 1.0]
        if n > 1:
            du = np.arange(1, n) * cu[1:]
            cand_u.extend(_real_roots_unit(du).tolist())
        u = np.asarray(cand_u)
        vals = snap_zero(np.polyval(cu[::-1], u), scale)
        sp = int(span_of_seg[k]) if span_of_seg is not None else 0
        for ui, vi in zip(u, vals):
            if ui == 0.0:
                xi, side = grid[k], ("right" if k > 0 else None)
            elif ui == 1.0:
                xi, side = grid[k + 1], ("left" if k + 1 < K else None)
            else:
                xi, side = grid[k] + ui * h, None
            if vi > best_hi[0]:
                best_hi = (float(vi), float(xi), side, sp)
            if vi < best_lo[0]:
                best_lo = (float(vi), float(xi), side, sp)
    return _tidy(grid, c, best_hi, scale), _tidy(grid, c, best_lo, scale)


def _tidy(grid, c, best, rscale) -> Extreme:
    """Drop the side flag where the quantity is in fact continuous at the node."""
    val, x, side, sp = best
    if side is not None:
        other = evaluate(grid, c, x, "left" if side == "right" else "right", scale=rscale)
        scale = max(abs(val), abs(other), np.max(np.abs(c[:, 0])) if c.size else 0.0)
        if abs(other - val) <= 1e-12 * scale:
            side = None
    return Extreme(val, x, side, sp)
