"""Unbraced segments and the lateral-torsional buckling modification factor Cb (AISC 360-22 F1).

Cb = 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC)  (AISC 360-22 Eq. F1-1), with Mmax the largest absolute
moment in the unbraced segment and MA, MB, MC the absolute moments at its quarter point, centre line and
three-quarter point. For a cantilever segment whose free end is not braced, Cb = 1.0 (AISC 360-22 F1 User
Note, from memory).

Brace points: the supports are always brace points (supports of kind "free" are not supports); the
``bracing`` argument adds discrete braces (a list of positions), or declares continuous bracing
(``0`` / ``"continuous"``: Lb = 0 everywhere), or nothing more (``"none"``).
"""
from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ...errors import InputError
from ._core import Fm

__all__ = ["F1_1", "Segment", "parse_bracing", "segments", "segment_moments", "diagram_moments", "cb_value"]

F1_1 = Fm("C_b", "12.5*M_max/(2.5*M_max + 3*M_A + 4*M_B + 3*M_C)", "AISC 360-22 Eq. F1-1",
          "lateral-torsional buckling modification factor")


@dataclass(frozen=True)
class Segment:
    """An unbraced length of the member (SI floats).

    a, b : ends (m); Lb = b - a; free_end : one end is an unbraced free end (cantilever tip).
    """

    a: float
    b: float
    free_end: bool = False

    @property
    def Lb(self) -> float:
        return self.b - self.a


def parse_bracing(bracing, x0: float, x1: float) -> tuple[str, tuple[float, ...]]:
    """("continuous" | "discrete" | "none", brace positions in m) from the user's ``bracing``.

    ``0`` (bare or a zero quantity) or "continuous": continuous bracing; "none" or None: supports only;
    a list/tuple/array of positions (quantities, strings like "11.7 ft" or SI floats in m): discrete braces.
    """
    from ...units import to_si

    if bracing is None:
        return "none", ()
    if isinstance(bracing, str):
        s = bracing.strip().lower()
        if s in ("none", "supports", "supports only"):
            return "none", ()
        if s in ("continuous", "0", "full"):
            return "continuous", ()
        try:
            v = to_si(bracing, "span", "bracing", allow_array=False)
        except Exception:
            raise InputError(f"bracing: got {bracing!r}; expected 0 or 'continuous' (continuous bracing), "
                             "'none' (braces at the supports only) or a list of brace positions") from None
        if v == 0:
            return "continuous", ()
        raise InputError(f"bracing: got {bracing!r}; expected 0 / 'continuous', 'none' or a list of brace "
                         "positions (a single length is ambiguous: give the positions)")
    if isinstance(bracing, (int, float)) and not isinstance(bracing, bool):
        if bracing == 0:
            return "continuous", ()
        raise InputError(f"bracing: got {bracing!r}; expected 0 (continuous), 'none' or a list of positions")
    if hasattr(bracing, "magnitude") and np.ndim(getattr(bracing, "magnitude")) == 0:
        if to_si(bracing, "span", "bracing", allow_array=False) == 0:
            return "continuous", ()
        raise InputError(f"bracing: got {bracing!r}; expected 0 (continuous), 'none' or a list of positions")
    try:
        items = list(bracing)
    except TypeError:
        raise InputError(f"bracing: got {bracing!r}; expected 0 / 'continuous', 'none' or a list of brace "
                         "positions") from None
    pos = []
    for i, it in enumerate(items):
        if isinstance(it, (int, float, np.floating, np.integer)) and not isinstance(it, bool):
            v = float(it)  # SI metres (numeric path)
        else:
            v = float(to_si(it, "span", f"bracing[{i}]", allow_array=False))
        if not math.isfinite(v) or v < x0 - 1e-9 or v > x1 + 1e-9:
            raise InputError(f"bracing[{i}]: got {v:.6g} m; expected a position on the member, "
                             f"{x0:.6g} to {x1:.6g} m")
        pos.append(min(max(v, x0), x1))
    return "discrete", tuple(sorted(pos))


def segments(kind: str, braces: tuple[float, ...], supports: tuple[float, ...], x0: float, x1: float
             ) -> tuple[Segment, ...]:
    """Unbraced segments between brace points (supports always brace; free member ends do not)."""
    if kind == "continuous":
        return (Segment(x0, x1, False),)
    tol = 1e-9 * max(x1 - x0, 1.0)
    pts = sorted(set(round(p, 12) for p in (*braces, *supports)))
    merged: list[float] = []
    for p in pts:
        if not merged or p - merged[-1] > tol:
            merged.append(p)
    if not merged:
        raise InputError("supports: got none; expected at least one support (braces at the supports)")
    out = []
    if merged[0] > x0 + tol:
        out.append(Segment(x0, merged[0], True))
    for a, b in zip(merged, merged[1:]):
        out.append(Segment(a, b, False))
    if merged[-1] < x1 - tol:
        out.append(Segment(merged[-1], x1, True))
    return tuple(out)


def segment_moments(x: np.ndarray, M: np.ndarray, a: float, b: float):
    """(Mmax_abs, MA, MB, MC, M_pos, x_pos, M_neg, x_neg) for the segment [a, b] of a moment diagram.

    M_pos is the largest sagging moment (>= 0), M_neg the largest hogging magnitude (>= 0); quarter-point
    values are absolute values interpolated on the diagram's stations.
    """
    return diagram_moments(x, M, (Segment(a, b),))[0]


def diagram_moments(x: np.ndarray, M: np.ndarray, segs) -> list[tuple]:
    """:func:`segment_moments` for every segment of ``segs`` at once (one interpolation call)."""
    n = len(segs)
    pts = np.empty((n, 5))
    for i, sg in enumerate(segs):
        L = sg.b - sg.a
        pts[i] = (sg.a, sg.a + 0.25 * L, sg.a + 0.5 * L, sg.a + 0.75 * L, sg.b)
    q = np.interp(pts.ravel(), x, M).reshape(n, 5)
    # a quarter point one ulp off a station where M is exactly 0 interpolates to round-off noise
    q[np.abs(q) <= 1e-12 * float(np.max(np.abs(M), initial=0.0))] = 0.0
    span = max(float(x[-1] - x[0]), 1e-9)
    out = []
    for i, sg in enumerate(segs):
        tol = 1e-9 * span
        i0 = int(np.searchsorted(x, sg.a - tol, "left"))
        i1 = int(np.searchsorted(x, sg.b + tol, "right"))
        qa, qb = float(q[i, 0]), float(q[i, 4])
        # endpoints (interpolated) and the stations inside
        best_p, xp = (qa, sg.a) if qa >= qb else (qb, sg.b)
        best_n, xn = (qa, sg.a) if qa <= qb else (qb, sg.b)
        if i1 > i0:
            seg = M[i0:i1]
            jp, jn = int(np.argmax(seg)), int(np.argmin(seg))
            if seg[jp] > best_p:
                best_p, xp = float(seg[jp]), float(x[i0 + jp])
            if seg[jn] < best_n:
                best_n, xn = float(seg[jn]), float(x[i0 + jn])
        Mpos, Mneg = max(best_p, 0.0), max(-best_n, 0.0)
        out.append((max(Mpos, Mneg), abs(float(q[i, 1])), abs(float(q[i, 2])), abs(float(q[i, 3])), Mpos, xp,
                    Mneg, xn))
    return out


def cb_value(Mmax: float, MA: float, MB: float, MC: float) -> float:
    """Eq. F1-1 (1.0 when the segment carries no moment)."""
    if Mmax <= 0.0:
        return 1.0
    return F1_1.fast(M_max=Mmax, M_A=MA, M_B=MB, M_C=MC)
