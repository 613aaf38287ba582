"""Section property record and the base class every section shares.

Axis and naming convention (one table, used throughout calckit):

=============  ===========================  ==================  ==================
quantity       calckit / AISC name          EN 1993 name        meaning
=============  ===========================  ==================  ==================
major axis     x-x (horizontal)             y-y                 bending in the vertical plane
minor axis     y-y (vertical)               z-z
2nd moment     Ix, Iy                       I_y, I_z
elastic mod.   Sx_top, Sx_bot, Sx = min     W_el,y              S = I / c  (elastic)
plastic mod.   Zx, Zy                       W_pl,y, W_pl,z      Z = plastic modulus
torsion        J                            I_t                 St Venant constant
warping        Cw                           I_w
=============  ===========================  ==================  ==================

Heights are measured from the bottom fibre (y = 0) and widths from the left edge, in metres.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, fields

from . import geometry as g
from ..units import quantity, to_si

__all__ = ["SectionProps", "Section", "STEEL_DENSITY"]

STEEL_DENSITY = 7850.0  # kg/m3, EN 1991-1-1 Table A.4 / AISC 490 lb/ft3 (common practice)

_DIM = {
    "d": "length", "bf_top": "length", "tf_top": "length", "bf_bot": "length", "tf_bot": "length",
    "tw": "length", "r": "length", "weld": "length", "hw": "length", "h_clear": "length",
    "A": "area", "y_c": "length", "x_c": "length", "Ix": "inertia", "Iy": "inertia", "Sx_top": "modulus",
    "Sx_bot": "modulus", "Sx": "modulus", "Sy": "modulus", "Zx": "modulus", "Zy": "modulus",
    "y_pna": "length", "rx": "length", "ry": "length", "J": "inertia", "Cw": "warping", "y_s": "length",
    "x_s": "length", "ho": "length", "rts": "length", "Iy_top": "inertia", "Iy_bot": "inertia",
    "mass": "mass_per_length", "Aw_aisc": "area", "Av_en": "area", "Q_flange_top": "modulus",
    "Q_flange_bot": "modulus", "Q_na": "modulus",
}


@dataclass(frozen=True)
class SectionProps:
    """Geometric properties of a section, SI floats (m, m2, m3, m4, m6, kg/m). See module docstring."""

    kind: str  #: "I_rolled", "I_welded", "channel", "tee", "rect", "hollow" or "builtup"
    name: str  #: designation or user label
    d: float  #: overall depth
    bf_top: float  #: top (compression under sagging) flange width; overall width for others
    tf_top: float  #: top flange thickness
    bf_bot: float  #: bottom flange width
    tf_bot: float  #: bottom flange thickness
    tw: float  #: web thickness (sum of both webs for a hollow section)
    r: float  #: root fillet radius (0 for welded)
    weld: float  #: flange-to-web fillet weld leg of a welded girder (0 if none given)
    hw: float  #: web depth between flanges, d - tf_top - tf_bot
    h_clear: float  #: clear web depth between fillets or welds (AISC h for rolled shapes: d - 2k)
    symmetric: bool  #: symmetric about the x-x axis
    A: float  #: area
    y_c: float  #: elastic centroid from the bottom fibre
    x_c: float  #: elastic centroid from the left edge
    Ix: float  #: second moment about the major (x-x) centroidal axis
    Iy: float  #: second moment about the minor (y-y) centroidal axis
    Sx_top: float  #: elastic modulus to the top fibre, Ix / (d - y_c)
    Sx_bot: float  #: elastic modulus to the bottom fibre, Ix / y_c
    Sx: float  #: the smaller of Sx_top and Sx_bot
    Sy: float  #: minor-axis elastic modulus to the extreme fibre
    Zx: float  #: major-axis plastic modulus
    Zy: float  #: minor-axis plastic modulus
    y_pna: float  #: plastic neutral axis (x-x) from the bottom fibre
    rx: float  #: radius of gyration, sqrt(Ix/A)
    ry: float  #: radius of gyration, sqrt(Iy/A)
    J: float  #: St Venant torsion constant
    Cw: float  #: warping constant
    y_s: float  #: shear centre from the bottom fibre
    x_s: float  #: shear centre from the left edge
    ho: float  #: distance between flange centroids (0 where not applicable)
    rts: float  #: AISC 360-22 Eq. F2-7, sqrt(sqrt(Iy Cw) / Sx) (0 where Cw = 0)
    Iy_top: float  #: minor-axis second moment of the top flange alone
    Iy_bot: float  #: minor-axis second moment of the bottom flange alone
    mass: float  #: mass per length at 7850 kg/m3
    Aw_aisc: float  #: AISC 360-22 G2.1 web area d * tw
    Av_en: float  #: EN 1993-1-1 6.2.6(3) shear area (eta not applied)
    Q_flange_top: float  #: first moment of the top flange plate about the elastic NA
    Q_flange_bot: float  #: first moment of the bottom flange plate about the elastic NA
    Q_na: float  #: first moment of the area above the elastic NA


class Section:
    """Base for all sections: holds the primitives and the computed :class:`SectionProps`.

    Subclasses build ``self._prims`` and call ``self._finish(...)``. Attribute access such as ``sec.Ix``
    returns a pint quantity; ``sec.si`` holds the SI floats.
    """

    si: SectionProps
    _prims: tuple

    def __getattr__(self, item):
        if item.startswith("_") or item == "si":
            raise AttributeError(item)
        si = self.__dict__.get("si")
        if si is not None and item in _DIM:
            return quantity(getattr(si, item), _DIM[item])
        raise AttributeError(f"{type(self).__name__} has no attribute {item!r}")

    def __setattr__(self, key, value):
        if key in self.__dict__:
            raise AttributeError(f"sections are immutable; cannot set {key!r}")
        object.__setattr__(self, key, value)

    @property
    def name(self) -> str:
        return self.si.name

    # --- cuts --------------------------------------------------------------------------------------
    def Q_at_si(self, y: float) -> float:
        """First moment about the elastic NA of the area above the horizontal cut at ``y`` (m)."""
        return g.first_moment_above(self._prims, 1, y, self.si.y_c)

    def width_at_si(self, y: float) -> float:
        """Material width (m) at height ``y`` from the bottom fibre."""
        return g.width_at(self._prims, 1, y)

    def Q_at(self, y):
        return quantity(self.Q_at_si(to_si(y, "length", "y")), "modulus")

    def width_at(self, y):
        return quantity(self.width_at_si(to_si(y, "length", "y")), "length")

    def outline(self) -> list[tuple[str, tuple]]:
        """Primitives for drawing: ("rect", (x0, x1, y0, y1, sign)) or ("fillet", (xc, yc, r, sx, sy, sign))."""
        out = []
        for p in self._prims:
            if isinstance(p, g.Rect):
                out.append(("rect", (p.x0, p.x1, p.y0, p.y1, p.sign)))
            else:
                out.append(("fillet", (p.xc, p.yc, p.r, p.sx, p.sy, p.sign)))
        return out

    def properties(self, system: str = "SI") -> dict:
        """All numeric properties as quantities in the display units of ``system``."""
        return {f.name: quantity(getattr(self.si, f.name), _DIM[f.name], system)
                for f in fields(self.si) if f.name in _DIM}

    def __repr__(self) -> str:
        s = self.si
        return (f"{type(self).__name__}({s.name or s.kind}: d={s.d * 1e3:.1f} mm, A={s.A * 1e6:.0f} mm2, "
                f"Ix={s.Ix * 1e12:.4g} mm4)")

    # --- construction helpers ----------------------------------------------------------------------
    def _finish(self, kind: str, name: str, geom: dict, *, J: float, Cw: float, y_s: float | None = None,
                x_s: float | None = None, ho: float = 0.0, Iy_top: float = 0.0, Iy_bot: float = 0.0,
                Av_en: float = 0.0, Aw_aisc: float = 0.0, q_flanges: tuple | None = None,
                sym_x: bool = False, sym_y: bool = True) -> None:
        prims = self._prims
        t = g.totals(prims)
        A, yc, xc, Ix, Iy = t["A"], t["y_c"], t["x_c"], t["Ix"], t["Iy"]
        d = geom["d"]
        ymin = min(p.bounds(1)[0] for p in prims)
        xmin = min(p.bounds(0)[0] for p in prims)
        xmax = max(p.bounds(0)[1] for p in prims)
        ypna = g.plastic_axis(prims, 1, A, 0.5 * d if sym_x else None)
        xpna = g.plastic_axis(prims, 0, A, xc if sym_y else None)
        Zx = g.plastic_modulus(prims, 1, ypna)
        Zy = g.plastic_modulus(prims, 0, xpna)
        Sx_top, Sx_bot = Ix / (d + ymin - yc), Ix / (yc - ymin)
        Sy = Iy / max(xmax - xc, xc - xmin)
        Sx = min(Sx_top, Sx_bot)
        rts = math.sqrt(math.sqrt(Iy * Cw) / Sx) if Cw > 0 else 0.0
        qt, qb = q_flanges if q_flanges is not None else (0.0, 0.0)
        q_na = g.first_moment_above(prims, 1, yc, yc)
        geom = dict(geom)
        geom.setdefault("weld", 0.0)
        props = SectionProps(
            kind=kind, name=name, symmetric=sym_x, A=A, y_c=yc, x_c=xc, Ix=Ix, Iy=Iy,
            Sx_top=Sx_top, Sx_bot=Sx_bot, Sx=Sx, Sy=Sy, Zx=Zx, Zy=Zy, y_pna=ypna,
            rx=math.sqrt(Ix / A), ry=math.sqrt(Iy / A), J=J, Cw=Cw,
            y_s=yc if y_s is None else y_s, x_s=xc if x_s is None else x_s, ho=ho, rts=rts,
            Iy_top=Iy_top, Iy_bot=Iy_bot, mass=A * STEEL_DENSITY, Aw_aisc=Aw_aisc, Av_en=Av_en,
            Q_flange_top=qt, Q_flange_bot=qb, Q_na=q_na, **geom,
        )
        object.__setattr__(self, "si", props)


def rect_J(b: float, t: float) -> float:
    """St Venant constant of a b x t rectangle (t <= b): b t^3 [1/3 - 0.21 (t/b)(1 - t^4/(12 b^4))].

    Roark's Formulas for Stress and Strain, 7th ed., Table 10.7 case 4 (from memory).
    """
    if t > b:
        b, t = t, b
    if t <= 0:
        return 0.0
    return b * t ** 3 * (1.0 / 3.0 - 0.21 * (t / b) * (1.0 - t ** 4 / (12.0 * b ** 4)))


def dim(value, name: str, *, allow_zero: bool = False) -> float:
    """A positive finite length from a quantity or string; errors name the parameter."""
    from ..errors import InputError

    v = to_si(value, "length", name, allow_array=False)
    if not math.isfinite(v) or v < 0 or (v == 0 and not allow_zero):
        what = "a finite length >= 0" if allow_zero else "a finite length > 0"
        raise InputError(f"{name}: got {value!r}; expected {what}")
    return v
