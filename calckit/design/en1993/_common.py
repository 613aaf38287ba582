"""Inputs shared by the EN 1993 checks: section and steel resolution, yield strengths, unit parsing.

Yield strength (EN 1993-1-1 3.2.1): taken from the grade's thickness band of each plate. For the
cross-section as a whole (classification, bending) calckit uses the band of the thickest plate of the
section (common practice: for rolled I sections the flange governs); the web's own band is used for
web shear and transverse-force resistance (f_yw) and the flange's for the flange contribution (f_yf).
A plate thicker than the grade's last band raises InputError (EN 1993-1-1 Table 3.1 covers t <= 80 mm).
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ...errors import InputError, NotCoveredError
from ...units import to_si

__all__ = ["Material", "section_props", "material", "length", "value", "STANDARD"]

STANDARD = "EN 1993-1-1:2005"


def section_props(section):
    """``section.si`` for an I-section; other shapes are not covered by this module."""
    si = getattr(section, "si", None)
    if si is None or not hasattr(si, "Zx"):
        raise InputError(f"section: got {section!r}; expected a calckit section (e.g. calckit.section('IPE 300'))")
    if si.kind not in ("I_rolled", "I_welded"):
        raise NotCoveredError(f"section: got a {si.kind!r} section ({si.name}); calckit.design.en1993 covers "
                              "rolled and welded I-sections only")
    return si


@dataclass(frozen=True)
class Material:
    """Yield strengths (Pa) picked for a section, and the moduli."""

    grade: str
    fy: float  #: section as a whole (thickest plate's band)
    fyw: float  #: web
    fyf_top: float  #: top flange
    fyf_bot: float  #: bottom flange
    E: float
    G: float
    note: str  #: how fy was chosen

    @property
    def fyf(self) -> float:
        return min(self.fyf_top, self.fyf_bot)

    @property
    def eps(self) -> float:
        return math.sqrt(235e6 / self.fy)


def _fy(st, t: float, what: str) -> float:
    try:
        return st.fy_si(t)
    except InputError as exc:
        raise InputError(f"{what} (t = {t * 1e3:.4g} mm), steel {st.name}: {exc}") from None


_MATERIALS: dict = {}


def material(section_si, steel, fy=None) -> Material:
    """Yield strengths for ``section_si`` in ``steel`` (a grade name or calckit Steel); ``fy`` overrides.

    For a grade name without ``fy`` the result is kept per (grade, plate thicknesses): a section search
    asks for the same few combinations many times."""
    key = None
    if fy is None and isinstance(steel, str):
        s = section_si
        key = (steel, s.tf_top, s.tf_bot, s.tw)
        m = _MATERIALS.get(key)
        if m is not None:
            return m
    m = _material(section_si, steel, fy)
    if key is not None:
        if len(_MATERIALS) > 512:
            _MATERIALS.clear()
        _MATERIALS[key] = m
    return m


def _material(section_si, steel, fy=None) -> Material:
    from ...materials import steel as get_steel

    st = get_steel(steel)
    if st.standard != "EN":
        raise InputError(f"steel: got {st.name} ({st.standard}); expected an EN grade (S235 ... S460) for "
                         "EN 1993-1-1 checks")
    s = section_si
    if fy is not None:
        f = to_si(fy, "stress", "fy")
        if not (100e6 <= f <= 700e6):
            raise InputError(f"fy: got {f / 1e6:.4g} MPa; expected 100 to 700 MPa")
        return Material(st.name, f, f, f, f, st.E_si, st.G_si, f"f_y = {f / 1e6:g} MPa given")
    ftop = _fy(st, s.tf_top, "top flange")
    fbot = _fy(st, s.tf_bot, "bottom flange")
    fw = _fy(st, s.tw, "web")
    tmax = max(s.tf_top, s.tf_bot, s.tw)
    f = min(ftop, fbot, fw)
    note = (f"f_y = {f / 1e6:g} MPa for t_max = {tmax * 1e3:.4g} mm (EN 1993-1-1 Table 3.1 band of the "
            f"thickest plate, {st.name})")
    return Material(st.name, f, fw, ftop, fbot, st.E_si, st.G_si, note)


def value(v, dim: str, name: str, *, minimum: float | None = 0.0, allow_none: bool = False,
          strict: bool = False):
    """A single SI float from a quantity/string (or None); checks the sign."""
    if v is None:
        if allow_none:
            return None
        raise InputError(f"{name}: no value given; expected {dim}")
    x = to_si(v, dim, name, allow_array=False)
    if not math.isfinite(x):
        raise InputError(f"{name}: got {v!r}; expected a finite value")
    if minimum is not None and (x < minimum or (strict and x <= minimum)):
        op = ">" if strict else ">="
        raise InputError(f"{name}: got {v!r}; expected a value {op} {minimum:g} (SI)")
    return x


def length(v, name: str, *, positive: bool = True, allow_none: bool = False):
    """A length in m; ``positive`` requires > 0, else >= 0. Negative lengths raise InputError."""
    if v is None:
        if allow_none:
            return None
        raise InputError(f"{name}: no value given; expected a length")
    x = to_si(v, "length", name, allow_array=False)
    if not math.isfinite(x) or x < 0 or (positive and x == 0):
        what = "a length > 0" if positive else "a length >= 0"
        raise InputError(f"{name}: got {v!r}; expected {what}")
    return x


def demand(v, dim: str, name: str):
    """A demand (absolute value used), or None."""
    if v is None:
        return None
    x = to_si(v, dim, name, allow_array=False)
    if not math.isfinite(x):
        raise InputError(f"{name}: got {v!r}; expected a finite value")
    return abs(x)
