"""Section shapes: rolled and welded I, channel, tee, solid rectangle, rectangular hollow, built-up.

All sections are immutable. Constructors take quantities or strings ("18 in", "300 mm"); ``from_si`` class
methods take SI floats (m) for speed (catalog loading, section search). Properties: see
:mod:`calckit.sections.base` for the field list and the axis/naming convention.

Torsion and warping constants (references):
- rolled I with fillets: J by El Darwish and Johnston (1965) as given in AISC Design Guide 9, Torsional
  Analysis of Structural Steel Members (1997), Eqs. 3.4-3.6 (from memory); Cw = Iy ho^2 / 4 for doubly
  symmetric I (Design Guide 9, Appendix C; the convention of the AISC Manual Table 1-1).
- mono-symmetric welded I: Cw = ho^2 Iy_top Iy_bot / (Iy_top + Iy_bot), shear centre at
  ho Iy_bot / (Iy_top + Iy_bot) below the top flange centroid (Design Guide 9, Appendix C; thin-walled).
- channel: J = 2 J_flange + J_web + alpha D^4 (half the I-section junction term per corner: calckit's
  approximation, within 3 % of finite elements in the tests); Cw = tf b'^3 h'^2 (3 b' tf + 2 h' tw) / (12 (6 b' tf + h' tw)), e0 = 3 tf b'^2 / (6 b' tf + h' tw)
  with b' = bf - tw/2, h' = d - tf (Design Guide 9, Appendix C, from memory).
- tee: Cw = tf^3 bf^3 / 144 + tw^3 (d - tf/2)^3 / 36 (Design Guide 9, Appendix C, from memory).
- rectangular hollow: It = t^3 h_p / 3 + 4 A_h^2 t / h_p (EN 10219-2:2006 Annex B, from memory); Cw = 0.
"""
from __future__ import annotations

import math

from . import geometry as g
from .base import Section, dim, rect_J
from .torsion import TorsionResult, solve_torsion
from ..errors import InputError, NotCoveredError

__all__ = ["IShape", "PlateGirder", "Channel", "Tee", "SolidRect", "Hollow", "Plate", "BuiltUp"]


def _alpha_D(tf: float, tw: float, R: float) -> tuple[float, float]:
    """Junction terms of El Darwish and Johnston (AISC Design Guide 9, Eqs. 3.5-3.6)."""
    alpha = (-0.042 + 0.2204 * tw / tf + 0.1355 * R / tf - 0.0865 * R * tw / tf ** 2
             - 0.0725 * (tw / tf) ** 2)
    D = ((tf + R) ** 2 + tw * (R + tw / 4.0)) / (2.0 * R + tf)
    return alpha, D


def _check_I(d, bf_top, tf_top, bf_bot, tf_bot, tw, r):
    for n, v in (("d", d), ("bf", bf_top), ("tf", tf_top), ("bf_bot", bf_bot), ("tf_bot", tf_bot),
                 ("tw", tw)):
        if not (math.isfinite(v) and v > 0):
            raise InputError(f"{n}: got {v!r} m; expected a finite length > 0")
    if not (math.isfinite(r) and r >= 0):
        raise InputError(f"r: got {r!r} m; expected a fillet radius >= 0")
    if tf_top + tf_bot >= d:
        raise InputError(f"tf: got {tf_top * 1e3:.4g} mm with d = {d * 1e3:.4g} mm; expected tf < d/2 "
                         f"(the flanges leave no web)")
    bmin = min(bf_top, bf_bot)
    if tw > bmin:
        raise InputError(f"tw: got {tw * 1e3:.4g} mm; expected tw <= bf = {bmin * 1e3:.4g} mm")
    if r > 0 and (r > (bmin - tw) / 2 * (1 + 1e-9) or d - tf_top - tf_bot - 2 * r <= 0):
        raise InputError(f"r: got {r * 1e3:.4g} mm; expected a fillet that fits: r <= (bf - tw)/2 = "
                         f"{(bmin - tw) / 2 * 1e3:.4g} mm and 2 r < d - 2 tf = "
                         f"{(d - tf_top - tf_bot) * 1e3:.4g} mm")


class _IBase(Section):
    def _build_I(self, kind, name, d, bf_top, tf_top, bf_bot, tf_bot, tw, r, weld=0.0):
        _check_I(d, bf_top, tf_top, bf_bot, tf_bot, tw, r)
        B = max(bf_top, bf_bot)
        xm = B / 2.0
        xl, xr = xm - tw / 2.0, xm + tw / 2.0
        prims = [g.Rect(xm - bf_bot / 2, xm + bf_bot / 2, 0.0, tf_bot, tag="bot"),
                 g.Rect(xm - bf_top / 2, xm + bf_top / 2, d - tf_top, d, tag="top"),
                 g.Rect(xl, xr, tf_bot, d - tf_top, tag="web")]
        if r > 0:
            prims += [g.Fillet(xl, tf_bot, r, -1, 1), g.Fillet(xr, tf_bot, r, 1, 1),
                      g.Fillet(xl, d - tf_top, r, -1, -1), g.Fillet(xr, d - tf_top, r, 1, -1)]
        object.__setattr__(self, "_prims", tuple(prims))
        sym = abs(bf_top - bf_bot) < 1e-12 and abs(tf_top - tf_bot) < 1e-12
        hw = d - tf_top - tf_bot
        ho = d - tf_top / 2 - tf_bot / 2
        It, Ib = tf_top * bf_top ** 3 / 12.0, tf_bot * bf_bot ** 3 / 12.0
        at, Dt = _alpha_D(tf_top, tw, r)
        ab, Db = _alpha_D(tf_bot, tw, r)
        J = (rect_J(bf_top, tf_top) + rect_J(bf_bot, tf_bot) + hw * tw ** 3 / 3.0
             + at * Dt ** 4 + ab * Db ** 4 - 0.21 * (tf_top ** 4 + tf_bot ** 4) * 0)
        # Design Guide 9 Eq. 3.4 writes the flange term with bf and 2 alpha D^4 for two junctions.
        t = g.totals(prims)
        yc = t["y_c"]
        if sym:
            Cw = t["Iy"] * ho ** 2 / 4.0
            ys = yc
        else:
            Cw = ho ** 2 * It * Ib / (It + Ib)
            ys = (d - tf_top / 2) - ho * Ib / (It + Ib)
        A = t["A"]
        Av = (A - 2 * bf_top * tf_top + (tw + 2 * r) * tf_top) if kind == "I_rolled" else hw * tw
        geom = dict(d=d, bf_top=bf_top, tf_top=tf_top, bf_bot=bf_bot, tf_bot=tf_bot, tw=tw, r=r, weld=weld,
                    hw=hw, h_clear=hw - 2 * r)
        qt = bf_top * tf_top * (d - tf_top / 2 - yc)
        qb = bf_bot * tf_bot * (yc - tf_bot / 2)
        self._finish(kind, name, geom, J=J, Cw=Cw, y_s=ys, ho=ho, Iy_top=It, Iy_bot=Ib, Av_en=Av,
                     Aw_aisc=d * tw, q_flanges=(qt, qb), sym_x=sym, sym_y=True)


class IShape(_IBase):
    """Rolled doubly symmetric I-section with root fillets (W, IPE, HE ...).

    ``IShape(d, bf, tf, tw, r=0, name="")``; r is the root fillet radius (for AISC shapes r = k_des - tf,
    common practice).
    """

    def __init__(self, d, bf, tf, tw, r=0, name: str = ""):
        self._build_I("I_rolled", name, dim(d, "d"), dim(bf, "bf"), dim(tf, "tf"), dim(bf, "bf"),
                      dim(tf, "tf"), dim(tw, "tw"), dim(r, "r", allow_zero=True))

    @classmethod
    def from_si(cls, d: float, bf: float, tf: float, tw: float, r: float = 0.0, name: str = "") -> "IShape":
        obj = cls.__new__(cls)
        obj._build_I("I_rolled", name, d, bf, tf, bf, tf, tw, r)
        return obj


class PlateGirder(_IBase):
    """Welded I-girder of three plates; mono-symmetric when the bottom flange differs.

    ``PlateGirder(d, tw, bf_top, tf_top, bf_bot=None, tf_bot=None, weld=0, name="")``: d is the overall
    depth; ``weld`` is the flange-to-web fillet leg (used for clear widths only, not in the properties).
    """

    def __init__(self, d, tw, bf_top, tf_top, bf_bot=None, tf_bot=None, weld=0, name: str = ""):
        bt, tt = dim(bf_top, "bf_top"), dim(tf_top, "tf_top")
        bb = bt if bf_bot is None else dim(bf_bot, "bf_bot")
        tb = tt if tf_bot is None else dim(tf_bot, "tf_bot")
        self._build_I("I_welded", name, dim(d, "d"), bt, tt, bb, tb, dim(tw, "tw"), 0.0,
                      dim(weld, "weld", allow_zero=True))
        if self.si.h_clear != self.si.hw:  # pragma: no cover - r is 0 for welded girders
            raise AssertionError

    @classmethod
    def from_si(cls, d, tw, bf_top, tf_top, bf_bot=None, tf_bot=None, weld=0.0, name="") -> "PlateGirder":
        obj = cls.__new__(cls)
        obj._build_I("I_welded", name, d, bf_top, tf_top, bf_top if bf_bot is None else bf_bot,
                     tf_top if tf_bot is None else tf_bot, tw, 0.0, weld)
        return obj


class Channel(Section):
    """Channel with parallel flanges of thickness tf and root fillets; web on the left (x = 0)."""

    def __init__(self, d, bf, tf, tw, r=0, name: str = ""):
        d, bf, tf, tw, r = (dim(d, "d"), dim(bf, "bf"), dim(tf, "tf"), dim(tw, "tw"),
                            dim(r, "r", allow_zero=True))
        if 2 * tf >= d:
            raise InputError(f"tf: got {tf * 1e3:.4g} mm; expected tf < d/2 = {d * 500:.4g} mm")
        if tw >= bf:
            raise InputError(f"tw: got {tw * 1e3:.4g} mm; expected tw < bf = {bf * 1e3:.4g} mm")
        if r > bf - tw or 2 * (tf + r) >= d:
            raise InputError(f"r: got {r * 1e3:.4g} mm; expected a fillet that fits between web and flange tip")
        prims = [g.Rect(0, bf, 0, tf, tag="bot"), g.Rect(0, bf, d - tf, d, tag="top"),
                 g.Rect(0, tw, tf, d - tf, tag="web")]
        if r > 0:
            prims += [g.Fillet(tw, tf, r, 1, 1), g.Fillet(tw, d - tf, r, 1, -1)]
        object.__setattr__(self, "_prims", tuple(prims))
        b1, h1 = bf - tw / 2, d - tf
        Cw = tf * b1 ** 3 * h1 ** 2 * (3 * b1 * tf + 2 * h1 * tw) / (12 * (6 * b1 * tf + h1 * tw))
        e0 = 3 * tf * b1 ** 2 / (6 * b1 * tf + h1 * tw)
        a, D = _alpha_D(tf, tw, r)
        # Corner (L) junctions: half the El Darwish-Johnston T-junction term at each corner. This is
        # calckit's own approximation, checked against finite elements (tests/validation), not a code formula.
        J = 2 * rect_J(bf, tf) + rect_J(d - 2 * tf, tw) + a * D ** 4
        A = g.totals(prims)["A"]
        Iyf = tf * bf ** 3 / 12
        geom = dict(d=d, bf_top=bf, tf_top=tf, bf_bot=bf, tf_bot=tf, tw=tw, r=r, hw=d - 2 * tf,
                    h_clear=d - 2 * tf - 2 * r)
        q = bf * tf * (d / 2 - tf / 2)
        self._finish("channel", name, geom, J=J, Cw=Cw, x_s=tw / 2 - e0, ho=h1, Iy_top=Iyf, Iy_bot=Iyf,
                     Av_en=A - 2 * bf * tf + (tw + r) * tf, Aw_aisc=d * tw, q_flanges=(q, q),
                     sym_x=True, sym_y=False)


class Tee(Section):
    """Tee with the flange on top (e.g. cut from an I at mid-depth), root fillets at the junction."""

    def __init__(self, d, bf, tf, tw, r=0, name: str = ""):
        d, bf, tf, tw, r = (dim(d, "d"), dim(bf, "bf"), dim(tf, "tf"), dim(tw, "tw"),
                            dim(r, "r", allow_zero=True))
        if tf >= d:
            raise InputError(f"tf: got {tf * 1e3:.4g} mm; expected tf < d = {d * 1e3:.4g} mm")
        if tw > bf:
            raise InputError(f"tw: got {tw * 1e3:.4g} mm; expected tw <= bf = {bf * 1e3:.4g} mm")
        if r > (bf - tw) / 2 or tf + r >= d:
            raise InputError(f"r: got {r * 1e3:.4g} mm; expected a fillet that fits")
        xl, xr = (bf - tw) / 2, (bf + tw) / 2
        prims = [g.Rect(0, bf, d - tf, d, tag="top"), g.Rect(xl, xr, 0, d - tf, tag="web")]
        if r > 0:
            prims += [g.Fillet(xl, d - tf, r, -1, -1), g.Fillet(xr, d - tf, r, 1, -1)]
        object.__setattr__(self, "_prims", tuple(prims))
        a, D = _alpha_D(tf, tw, r)
        J = rect_J(bf, tf) + rect_J(d - tf, tw) + a * D ** 4
        Cw = tf ** 3 * bf ** 3 / 144 + tw ** 3 * (d - tf / 2) ** 3 / 36
        yc = g.totals(prims)["y_c"]
        geom = dict(d=d, bf_top=bf, tf_top=tf, bf_bot=tw, tf_bot=0.0, tw=tw, r=r, hw=d - tf,
                    h_clear=d - tf - r)
        self._finish("tee", name, geom, J=J, Cw=Cw, y_s=d - tf / 2, ho=0.0, Iy_top=tf * bf ** 3 / 12,
                     Av_en=(d - tf) * tw, Aw_aisc=d * tw, q_flanges=(bf * tf * (d - tf / 2 - yc), 0.0),
                     sym_x=False, sym_y=True)

    @classmethod
    def cut_from(cls, ishape: Section, name: str = "") -> "Tee":
        """Tee from an I-section cut at mid-depth."""
        s = ishape.si
        return cls(f"{s.d / 2} m", f"{s.bf_top} m", f"{s.tf_top} m", f"{s.tw} m", f"{s.r} m",
                   name or (s.name + " tee" if s.name else ""))


class SolidRect(Section):
    """Solid rectangular bar b wide and h deep. Cw is taken as 0."""

    def __init__(self, b, h, name: str = ""):
        b, h = dim(b, "b"), dim(h, "h")
        object.__setattr__(self, "_prims", (g.Rect(0, b, 0, h, tag="solid"),))
        geom = dict(d=h, bf_top=b, tf_top=0.0, bf_bot=b, tf_bot=0.0, tw=b, r=0.0, hw=h, h_clear=h)
        self._finish("rect", name, geom, J=rect_J(b, h), Cw=0.0, Av_en=b * h, Aw_aisc=b * h,
                     sym_x=True, sym_y=True)


class Hollow(Section):
    """Rectangular or square hollow section b x h x t with outer corner radius ro (default 2 t).

    ro = 2 t is the EN 10219-2 value for t <= 6 mm (common practice for a default); inner radius ro - t.
    """

    def __init__(self, b, h, t, ro=None, name: str = ""):
        b, h, t = dim(b, "b"), dim(h, "h"), dim(t, "t")
        ro = 2 * t if ro is None else dim(ro, "ro", allow_zero=True)
        if 2 * t >= min(b, h):
            raise InputError(f"t: got {t * 1e3:.4g} mm; expected t < min(b, h)/2 = {min(b, h) * 500:.4g} mm")
        if ro > min(b, h) / 2:
            raise InputError(f"ro: got {ro * 1e3:.4g} mm; expected ro <= min(b, h)/2")
        ri = max(ro - t, 0.0)
        prims = [g.Rect(0, b, 0, h, tag="outer"), g.Rect(t, b - t, t, h - t, sign=-1.0, tag="hole")]
        if ro > 0:
            prims += [g.Fillet(0, 0, ro, 1, 1, -1.0), g.Fillet(b, 0, ro, -1, 1, -1.0),
                      g.Fillet(0, h, ro, 1, -1, -1.0), g.Fillet(b, h, ro, -1, -1, -1.0)]
        if ri > 0:
            prims += [g.Fillet(t, t, ri, 1, 1), g.Fillet(b - t, t, ri, -1, 1),
                      g.Fillet(t, h - t, ri, 1, -1), g.Fillet(b - t, h - t, ri, -1, -1)]
        object.__setattr__(self, "_prims", tuple(prims))
        rc = (ro + ri) / 2
        hp = 2 * ((b - t) + (h - t)) - 2 * rc * (4 - math.pi)
        Ah = (b - t) * (h - t) - rc ** 2 * (4 - math.pi)
        J = t ** 3 * hp / 3 + 4 * Ah ** 2 * t / hp
        A = g.totals(prims)["A"]
        geom = dict(d=h, bf_top=b, tf_top=t, bf_bot=b, tf_bot=t, tw=2 * t, r=ro, hw=h - 2 * t,
                    h_clear=h - 3 * t)
        q = b * t * (h / 2 - t / 2)
        self._finish("hollow", name, geom, J=J, Cw=0.0, ho=h - t, Av_en=A * h / (b + h),
                     Aw_aisc=2 * (h - 3 * t) * t, q_flanges=(q, q), sym_x=True, sym_y=True)


class Plate(Section):
    """A flat plate b wide and t thick, for placing in a :class:`BuiltUp` section (same as SolidRect)."""

    def __init__(self, b, t, name: str = ""):
        b, t = dim(b, "b"), dim(t, "t")
        object.__setattr__(self, "_prims", (g.Rect(0, b, 0, t, tag="plate"),))
        geom = dict(d=t, bf_top=b, tf_top=t, bf_bot=b, tf_bot=t, tw=b, r=0.0, hw=0.0, h_clear=0.0)
        self._finish("rect", name, geom, J=rect_J(b, t), Cw=0.0, Av_en=b * t, Aw_aisc=b * t,
                     sym_x=True, sym_y=True)


def _shift(p, dx, dy):
    if isinstance(p, g.Rect):
        return g.Rect(p.x0 + dx, p.x1 + dx, p.y0 + dy, p.y1 + dy, p.sign, p.tag)
    return g.Fillet(p.xc + dx, p.yc + dy, p.r, p.sx, p.sy, p.sign, p.tag)


class BuiltUp(Section):
    """A section of parts placed freely: ``BuiltUp([(part, x, y), ...])``.

    Each part is any section (``Plate``, ``IShape``, ``Channel`` ...) whose bounding box's lower-left corner
    is placed at (x, y) (quantities or strings). Parts must not overlap (not checked beyond the total area);
    parts that touch along an edge are taken as welded: the section acts as one solid.

    A, I, S, Z, Q: exact integrals over the parts (:mod:`calckit.sections.geometry`).
    J, Cw and the shear centre (x_s, y_s): Saint-Venant torsion of the union of the parts, solved by
    :func:`calckit.sections.torsion.solve_torsion` (Prandtl stress function for J, with one constant per
    closed cell; warping function for the shear centre and Cw; Timoshenko & Goodier, Theory of Elasticity,
    ch. 10; Pilkey, Analysis and Design of Elastic Beams, 2002, ch. 6). Finite volumes on a graded tensor
    grid, direct solution; root fillets of rolled parts are followed by a ghost-fluid wall for J and a
    staircase for the warping function. Measured against sectionproperties 3.10.2 (finite elements,
    tests/validation/test_sectionproperties_fe.py): J within 0.2 % and Cw within 0.4 % for an IPE 330 with
    two cover plates, a W18x50 with a narrower top plate only, a welded I of three plates and a box of four
    plates; the shear centre within 0.03 mm. Doubling the cells per direction changes J and Cw of the
    cover-plated IPE 330 by 0.04 % and 0.11 % (tests/test_sections_torsion.py). For rolled shapes alone
    (not used by IShape, which keeps its published formulas) J is up to 1.2 % low (the fillets); Cw of a
    closed cell with rounded corners is less accurate (a Hollow 200x100x8 part: 6 % low, on a small Cw).
    One construction takes about 10-20 ms (benchmarks/bench_foundation.py); results are cached on the geometry.

    Where the parts do not form one connected solid (they stand apart or touch only at a corner), J is the
    sum of the parts' J (each twisting alone) and Cw and the shear centre use the thin-walled two-flange
    idealisation: the plate-like parts (wider than deep) above and below the centroid act as the two flanges
    (AISC Design Guide 9, Appendix C). Those thin-walled values are always kept in ``torsion_thin``;
    ``torsion`` holds the values used (:class:`calckit.sections.torsion.TorsionResult`, with ``method``).
    """

    def __init__(self, parts, name: str = ""):
        if not parts:
            raise InputError("parts: got an empty list; expected (section, x, y) tuples")
        prims, J = [], 0.0
        for i, item in enumerate(parts):
            try:
                part, x, y = item
            except (TypeError, ValueError):
                raise InputError(f"parts[{i}]: got {item!r}; expected a (section, x, y) tuple") from None
            if not isinstance(part, Section):
                raise InputError(f"parts[{i}]: got {part!r}; expected a calckit section")
            dx, dy = dim(x, f"parts[{i}].x", allow_zero=True), dim(y, f"parts[{i}].y", allow_zero=True)
            x0 = min(p.bounds(0)[0] for p in part._prims)
            y0 = min(p.bounds(1)[0] for p in part._prims)
            prims += [_shift(p, dx - x0, dy - y0) for p in part._prims]
            J += part.si.J
        ymin = min(p.bounds(1)[0] for p in prims)
        xmin = min(p.bounds(0)[0] for p in prims)
        prims = [_shift(p, -xmin, -ymin) for p in prims]
        object.__setattr__(self, "_prims", tuple(prims))
        t = g.totals(prims)
        yc, xc = t["y_c"], t["x_c"]
        d = max(p.bounds(1)[1] for p in prims)
        flat = [p for p in prims if isinstance(p, g.Rect) and p.sign > 0 and (p.x1 - p.x0) > (p.y1 - p.y0)]
        top = [p for p in flat if (p.y0 + p.y1) / 2 > yc]
        bot = [p for p in flat if (p.y0 + p.y1) / 2 <= yc]
        webs = [p for p in prims if isinstance(p, g.Rect) and p.sign > 0 and p.y0 <= yc <= p.y1]
        tw = min((p.x1 - p.x0) for p in webs) if webs else 0.0

        def group(ps):
            if not ps:
                return 0.0, 0.0, 0.0, 0.0
            A = sum((p.x1 - p.x0) * (p.y1 - p.y0) for p in ps)
            yg = sum((p.x1 - p.x0) * (p.y1 - p.y0) * (p.y0 + p.y1) / 2 for p in ps) / A
            Iy = sum((p.y1 - p.y0) * (p.x1 - p.x0) ** 3 / 12
                     + (p.x1 - p.x0) * (p.y1 - p.y0) * ((p.x0 + p.x1) / 2 - xc) ** 2 for p in ps)
            Q = sum((p.x1 - p.x0) * (p.y1 - p.y0) * abs((p.y0 + p.y1) / 2 - yc) for p in ps)
            return A, yg, Iy, Q

        _, yt, It, Qt = group(top)
        _, yb, Ib, Qb = group(bot)
        if It > 0 and Ib > 0:
            ho = yt - yb
            Cw = ho ** 2 * It * Ib / (It + Ib)
            ys = yt - ho * Ib / (It + Ib)
        else:
            ho, Cw, ys = 0.0, 0.0, yc
        thin = TorsionResult(J=J, Cw=Cw, x_s=xc, y_s=ys, cells=0, holes=0,
                             method="parts twisting alone (J = sum of the parts' J); thin-walled two-flange "
                                    "Cw and shear centre (AISC Design Guide 9, Appendix C)")
        try:
            used = solve_torsion(prims)
        except NotCoveredError:  # parts that do not touch: they do not act as one solid in torsion
            used = thin
        object.__setattr__(self, "torsion", used)
        object.__setattr__(self, "torsion_thin", thin)
        bt = max(((p.x1 - p.x0) for p in top), default=0.0)
        bb = max(((p.x1 - p.x0) for p in bot), default=0.0)
        tft = sum((p.y1 - p.y0) for p in top)
        tfb = sum((p.y1 - p.y0) for p in bot)
        hw = max(d - tft - tfb, 0.0)
        geom = dict(d=d, bf_top=bt, tf_top=tft, bf_bot=bb, tf_bot=tfb, tw=tw, r=0.0, hw=hw, h_clear=hw)
        self._finish("builtup", name, geom, J=used.J, Cw=used.Cw, y_s=used.y_s, x_s=used.x_s, ho=ho,
                     Iy_top=It, Iy_bot=Ib,
                     Av_en=hw * tw, Aw_aisc=d * tw, q_flanges=(Qt, Qb), sym_x=False, sym_y=False)

    @classmethod
    def cover_plated(cls, beam: Section, top=None, bottom=None, name: str = "") -> "BuiltUp":
        """A rolled beam with cover plates ``top=(b, t)`` and/or ``bottom=(b, t)`` centred on its flanges."""
        s = beam.si
        B = max(s.bf_top, s.bf_bot)
        parts, y = [], 0.0
        if bottom is not None:
            pb = Plate(*bottom)
            parts.append((pb, f"{(B - pb.si.bf_top) / 2} m" if pb.si.bf_top < B else "0 m", "0 m"))
            y = pb.si.d
        shift = 0.0
        if bottom is not None and pb.si.bf_top > B:
            shift = (pb.si.bf_top - B) / 2
        parts.append((beam, f"{shift} m", f"{y} m"))
        if top is not None:
            pt = Plate(*top)
            W = max(B, pb.si.bf_top if bottom is not None else 0.0)
            parts.append((pt, f"{(W - pt.si.bf_top) / 2} m", f"{y + s.d} m"))
        if bottom is not None and pb.si.bf_top < B:
            pass
        return cls(parts, name=name or (s.name + " + cover plates"))
