"""For the record: how an I-section compares with a solid rectangle and a square hollow section of the
same mass (the same cross-section area, steel of the same density).

Assumptions (stated in :attr:`ShapeComparison.assumptions`):

* solid rectangle: the same overall depth d as the I-section, width b = A / d;
* square hollow section: wall thickness t given (default: the I-section's flange thickness, rounded to
  the nearest mm), outer corner radius 2 t (calckit.sections.Hollow default), outer size b found so the
  area equals the I-section's (bisection on the exact area);
* same steel: the stiffness ratio is the ratio of Ix (E equal), the strength ratios are those of Sx
  (first yield) and Zx (full plastic moment), all about the horizontal (major) axis; Iy and J are listed
  because they govern lateral-torsional buckling, where the closed section is far better.

Section properties come from :mod:`calckit.sections` (exact integrals of the shapes).
"""
from __future__ import annotations

from dataclasses import dataclass

from ..errors import InputError

__all__ = ["ShapeComparison", "ShapeRow", "compare_shapes"]

_PROPS = ("A", "Ix", "Sx", "Zx", "Iy", "J")


@dataclass(frozen=True)
class ShapeRow:
    """One shape of the comparison (SI: m, m2, m3, m4, kg/m) and its ratios to the I-section."""

    shape: str  #: "I-section", "solid rectangle" or "square hollow section"
    name: str  #: designation or dimensions, e.g. "W18X50", "12.9 x 457 mm", "SHS 250 x 250 x 10"
    d: float  #: overall depth
    b: float  #: overall width
    t: float  #: wall thickness (hollow) or 0
    mass: float  #: kg/m
    props: dict  #: A, Ix, Sx, Zx, Iy, J
    ratios: dict  #: the same keys, divided by the I-section's
    section: object = None  #: the calckit section object


@dataclass(frozen=True)
class ShapeComparison:
    """I-section versus a solid rectangle and a square hollow section of the same mass."""

    rows: tuple[ShapeRow, ...]
    assumptions: tuple[str, ...]

    def summary(self) -> str:
        """One or two sentences for the calc record."""
        i, r, h = self.rows
        return (f"At the same mass ({i.mass:.1f} kg/m), a solid rectangle of the same depth ({r.name}) has "
                f"{r.ratios['Ix']:.2f} of the {i.name} stiffness Ix and {r.ratios['Zx']:.2f} of its plastic "
                f"modulus Zx; a square hollow section {h.name} has {h.ratios['Ix']:.2f} and {h.ratios['Zx']:.2f}, "
                f"but {h.ratios['Iy']:.1f} times its minor-axis Iy and {h.ratios['J']:.0f} times its torsion "
                f"constant J (same steel; assumptions: {'; '.join(self.assumptions[1:3])}).")

    def text(self) -> str:
        """A plain text table of the ratios to the I-section."""
        head = f"{'shape':<24}{'size':<24}{'mass kg/m':>10}" + "".join(f"{k:>8}" for k in _PROPS[1:])
        lines = [head, "-" * len(head)]
        for r in self.rows:
            lines.append(f"{r.shape:<24}{r.name:<24}{r.mass:>10.1f}"
                         + "".join(f"{r.ratios[k]:>8.2f}" for k in _PROPS[1:]))
        lines.append("ratios to the I-section (same steel): Ix stiffness, Sx first-yield strength, Zx plastic "
                     "strength, Iy and J for lateral-torsional buckling")
        return "\n".join(lines)


def _row(shape: str, name: str, sec, ref: dict | None, t: float = 0.0) -> ShapeRow:
    p = sec.si
    props = {k: float(getattr(p, k)) for k in _PROPS}
    ratios = {k: props[k] / ref[k] if ref else 1.0 for k in _PROPS}
    return ShapeRow(shape, name, p.d, p.bf_top, t, float(p.mass), props, ratios, sec)


def compare_shapes(section, hollow_t=None) -> ShapeComparison:
    """Compare ``section`` (an I-section object or a catalog name) with a solid rectangle of the same
    depth and a square hollow section of wall ``hollow_t`` (quantity or string; default the flange
    thickness rounded to the nearest mm), both of the same area (mass)."""
    from ..sections import Hollow, SolidRect, section as get_section
    from ..units import to_si

    sec = get_section(section) if isinstance(section, str) else section
    p = getattr(sec, "si", None)
    if p is None or p.kind not in ("I_rolled", "I_welded"):
        raise InputError(f"section: got {section!r}; expected an I-section or a catalog name such as 'W18X50'")
    A, d = p.A, p.d
    t = max(round(p.tf_top * 1e3), 1) * 1e-3 if hollow_t is None else to_si(hollow_t, "length", "hollow_t",
                                                                             allow_array=False)
    if not t > 0:
        raise InputError(f"hollow_t: got {hollow_t!r}; expected a wall thickness > 0")
    ref = _row("I-section", p.name or "I-section", sec, None)
    b_rect = A / d
    rect = SolidRect(f"{b_rect!r} m", f"{d!r} m", name="solid rectangle")
    rrow = _row("solid rectangle", f"{b_rect * 1e3:.1f} x {d * 1e3:.0f} mm", rect, ref.props)

    def area(b):
        return Hollow(f"{b!r} m", f"{b!r} m", f"{t!r} m").si.A

    lo = 2.0 * t * 1.0001 + 4 * t  # smallest sensible box (corner radius 2t must fit)
    if area(lo) > A:
        raise InputError(f"hollow_t: got {t * 1e3:.4g} mm; a square hollow section that thick has more area "
                         f"than the I-section ({A * 1e6:.0f} mm2); give a thinner wall")
    hi = max(lo * 2, A / (4 * t) + 2 * t)
    while area(hi) < A:
        hi *= 1.5
    for _ in range(60):
        mid = 0.5 * (lo + hi)
        if area(mid) < A:
            lo = mid
        else:
            hi = mid
    b = 0.5 * (lo + hi)
    box = Hollow(f"{b!r} m", f"{b!r} m", f"{t!r} m", name="square hollow section")
    hrow = _row("square hollow section", f"{b * 1e3:.0f} x {b * 1e3:.0f} x {t * 1e3:.3g} mm", box, ref.props, t)
    assumptions = (
        f"same area A = {A * 1e6:.0f} mm2 (same mass, {p.mass:.1f} kg/m) and the same steel for all three shapes",
        f"solid rectangle of the same depth d = {d * 1e3:.0f} mm, width A/d = {b_rect * 1e3:.1f} mm",
        f"square hollow section of wall t = {t * 1e3:.3g} mm "
        + ("(the I-section's flange thickness, rounded)" if hollow_t is None else "(given)")
        + f", outer corner radius 2t, outer size {b * 1e3:.0f} mm found for the same area",
        "stiffness ratio = Ix ratio; strength ratios = Sx (first yield) and Zx (plastic) ratios, major axis",
    )
    return ShapeComparison((ref, rrow, hrow), assumptions)
