"""Exact area integrals of sections built from rectangles and circular root fillets.

A section is a list of signed primitives. Each primitive gives, for the part of it between two cut lines,
the area and the first and second moments about the global axis (horizontal cuts for x-x bending, vertical
cuts for y-y bending). Sums of these give A, centroid, I, the first moment Q above any cut, and the plastic
neutral axis, with root fillets included exactly (no discretisation): rectangles in closed form, fillet
spandrels in closed form when whole and by a 16-point Gauss-Legendre rule in the angle variable when cut
(the integrand is a trigonometric polynomial there, so the rule is exact to round-off).

A fillet spandrel is the region between two perpendicular legs meeting at a corner and the quarter circle
of radius r tangent to both legs: area (1 - pi/4) r^2, centroid 0.2234 r from each leg
(r (10 - 3 pi) / (12 - 3 pi)), second moment about a leg (1 - 5 pi / 16) r^4.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

__all__ = ["Rect", "Fillet", "moments", "totals"]

_GX, _GW = np.polynomial.legendre.leggauss(16)
_SPAN_A = 1.0 - math.pi / 4.0  # spandrel area / r^2
_SPAN_S = 5.0 / 6.0 - math.pi / 4.0  # first moment about a leg / r^3
_SPAN_I = 1.0 - 5.0 * math.pi / 16.0  # second moment about a leg / r^4


@dataclass(frozen=True)
class Rect:
    """Axis-aligned rectangle [x0, x1] x [y0, y1]; ``sign`` -1 for a hole."""

    x0: float
    x1: float
    y0: float
    y1: float
    sign: float = 1.0
    tag: str = ""

    def part(self, axis: int, lo: float, hi: float) -> tuple[float, float, float]:
        """(A, int s dA, int s^2 dA) of the part with coordinate s (axis 1: y, axis 0: x) in [lo, hi]."""
        if axis == 1:
            a, b, w = max(self.y0, lo), min(self.y1, hi), self.x1 - self.x0
        else:
            a, b, w = max(self.x0, lo), min(self.x1, hi), self.y1 - self.y0
        if b <= a:
            return 0.0, 0.0, 0.0
        s = self.sign * w
        return s * (b - a), s * (b * b - a * a) / 2.0, s * (b ** 3 - a ** 3) / 3.0

    def bounds(self, axis: int) -> tuple[float, float]:
        return (self.y0, self.y1) if axis == 1 else (self.x0, self.x1)

    def width_at(self, axis: int, s: float) -> float:
        lo, hi = self.bounds(axis)
        if lo <= s <= hi:
            return self.sign * ((self.x1 - self.x0) if axis == 1 else (self.y1 - self.y0))
        return 0.0


@dataclass(frozen=True)
class Fillet:
    """Root-fillet spandrel with its corner at (xc, yc); (sx, sy) = +-1 point from the corner into it."""

    xc: float
    yc: float
    r: float
    sx: float
    sy: float
    sign: float = 1.0
    tag: str = "fillet"

    def bounds(self, axis: int) -> tuple[float, float]:
        c, s = (self.yc, self.sy) if axis == 1 else (self.xc, self.sx)
        return (c, c + self.r) if s > 0 else (c - self.r, c)

    def part(self, axis: int, lo: float, hi: float) -> tuple[float, float, float]:
        c, sd = (self.yc, self.sy) if axis == 1 else (self.xc, self.sx)
        r = self.r
        b0, b1 = self.bounds(axis)
        a, b = max(b0, lo), min(b1, hi)
        if b <= a or r <= 0:
            return 0.0, 0.0, 0.0
        sg = self.sign
        if a <= b0 and b >= b1:  # whole spandrel: closed form (v measured from the leg at the corner)
            A = _SPAN_A * r * r
            Sv = _SPAN_S * r ** 3
            Iv = _SPAN_I * r ** 4
            # s = c + sd * v
            return sg * A, sg * (c * A + sd * Sv), sg * (c * c * A + 2 * c * sd * Sv + Iv)
        # v range from the corner leg
        v1, v2 = sorted(((a - c) * sd, (b - c) * sd))
        v1, v2 = max(v1, 0.0), min(v2, r)
        # v = r (1 - cos phi); width u = r (1 - sin phi); dv = r sin phi dphi
        p1 = math.acos(max(-1.0, min(1.0, 1.0 - v1 / r)))
        p2 = math.acos(max(-1.0, min(1.0, 1.0 - v2 / r)))
        half = 0.5 * (p2 - p1)
        phi = p1 + half * (_GX + 1.0)
        v = r * (1.0 - np.cos(phi))
        f = r * (1.0 - np.sin(phi)) * r * np.sin(phi) * (half * _GW)
        s = c + sd * v
        return sg * float(f.sum()), sg * float((f * s).sum()), sg * float((f * s * s).sum())

    def width_at(self, axis: int, s: float) -> float:
        c, sd = (self.yc, self.sy) if axis == 1 else (self.xc, self.sx)
        v = (s - c) * sd
        if 0 <= v <= self.r:
            r = self.r
            return self.sign * (r - math.sqrt(max(0.0, r * r - (r - v) ** 2)))
        return 0.0


Prim = "Rect | Fillet"


def moments(prims, axis: int, lo: float = -math.inf, hi: float = math.inf) -> tuple[float, float, float]:
    """Sum of (A, int s dA, int s^2 dA) over the primitives, for s in [lo, hi]."""
    A = S = I = 0.0
    for p in prims:
        a, s, i = p.part(axis, lo, hi)
        A += a
        S += s
        I += i
    return A, S, I


def totals(prims) -> dict[str, float]:
    """Area, centroid and centroidal second moments of the whole set."""
    A, Sy, Iyy = moments(prims, 1)
    _, Sx, Ixx = moments(prims, 0)
    yc, xc = Sy / A, Sx / A
    return {"A": A, "y_c": yc, "x_c": xc, "Ix": Iyy - A * yc * yc, "Iy": Ixx - A * xc * xc}


def first_moment_above(prims, axis: int, cut: float, about: float) -> float:
    """First moment about ``about`` of the area beyond the cut (s > cut)."""
    A, S, _ = moments(prims, axis, cut, math.inf)
    return S - A * about


def plastic_axis(prims, axis: int, A_total: float, symmetric_at: float | None = None) -> float:
    """Coordinate of the equal-area (plastic) axis; exact for symmetric sections, else by bisection."""
    if symmetric_at is not None:
        return symmetric_at
    lo = min(p.bounds(axis)[0] for p in prims)
    hi = max(p.bounds(axis)[1] for p in prims)
    half = 0.5 * A_total
    for _ in range(80):
        mid = 0.5 * (lo + hi)
        if moments(prims, axis, -math.inf, mid)[0] < half:
            lo = mid
        else:
            hi = mid
        if hi - lo < 1e-13 * (abs(hi) + 1e-3):
            break
    return 0.5 * (lo + hi)


def plastic_modulus(prims, axis: int, pna: float) -> float:
    """Z = sum of |first moments| of the two halves about the plastic axis."""
    A1, S1, _ = moments(prims, axis, pna, math.inf)
    A2, S2, _ = moments(prims, axis, -math.inf, pna)
    return (S1 - A1 * pna) - (S2 - A2 * pna)


def width_at(prims, axis: int, s: float) -> float:
    return sum(p.width_at(axis, s) for p in prims)
