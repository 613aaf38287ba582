"""Units at the boundary, SI floats inside.

One pint registry (``ureg``, ``Q_``) serves the whole package; it is created on first use so that
``import calckit`` stays fast. Public functions accept pint quantities or strings ("17.99 in",
"0.75 kip/ft", "50 ksi"), check the dimension with :func:`to_si`, compute on SI floats, and give
quantities back with :func:`quantity`.

Dimension names used throughout calckit (``DIMS``): each maps to its SI unit (the internal unit), the
unit shown in SI calc sheets and the unit shown in US customary calc sheets.
"""
from __future__ import annotations

import math
from typing import Any

import numpy as np

from .errors import UnitsError, InputError

__all__ = ["ureg", "Q_", "to_si", "quantity", "DIMS", "display_unit", "is_quantity", "parse"]

# name: (SI unit, SI display unit, US display unit, description)
DIMS: dict[str, tuple[str, str, str, str]] = {
    "dimensionless": ("", "", "", "a plain number"),
    "length": ("m", "mm", "in", "a length (e.g. '6 m', '17.99 in')"),
    "span": ("m", "m", "ft", "a length (e.g. '6 m', '35 ft')"),
    "area": ("m**2", "mm**2", "in**2", "an area (e.g. '14.7 in**2')"),
    "modulus": ("m**3", "mm**3", "in**3", "a section modulus (e.g. '101 in**3')"),
    "inertia": ("m**4", "mm**4", "in**4", "a second moment of area (e.g. '800 in**4')"),
    "warping": ("m**6", "mm**6", "in**6", "a warping constant (e.g. '3040 in**6')"),
    "force": ("N", "kN", "kip", "a force (e.g. '10 kN', '25 kip')"),
    "line_load": ("N/m", "kN/m", "kip/ft", "a load per length (e.g. '12 kN/m', '0.75 kip/ft')"),
    "shear_flow": ("N/m", "N/mm", "kip/in", "a force per length (e.g. '1.4 kip/in')"),
    "pressure": ("Pa", "kPa", "psf", "a pressure (e.g. '2.5 kPa', '50 psf')"),
    "moment": ("N*m", "kN*m", "kip*ft", "a moment (e.g. '90 kN*m', '266 kip*ft')"),
    "stress": ("Pa", "MPa", "ksi", "a stress (e.g. '355 MPa', '50 ksi')"),
    "stiffness": ("N/m", "kN/mm", "kip/in", "a spring stiffness (e.g. '50 kN/mm')"),
    "rot_stiffness": ("N*m", "kN*m", "kip*ft", "a rotational stiffness per radian"),
    "flexural_rigidity": ("N*m**2", "kN*m**2", "kip*in**2", "a flexural rigidity EI"),
    "mass_per_length": ("kg/m", "kg/m", "lb/ft", "a mass per length (e.g. '50 lb/ft')"),
    "weight_per_length": ("N/m", "kN/m", "kip/ft", "a weight per length"),
    "density": ("kg/m**3", "kg/m**3", "lb/ft**3", "a density"),
    "angle": ("rad", "deg", "deg", "an angle (e.g. '30 deg')"),
    "rotation": ("rad", "rad", "rad", "a rotation"),
    "deflection": ("m", "mm", "in", "a deflection"),
    "time": ("s", "s", "s", "a time"),
}

_ureg = None
_dim_cache: dict[str, Any] = {}


def _registry():
    global _ureg
    if _ureg is None:
        import pint

        reg = pint.UnitRegistry(autoconvert_offset_to_baseunit=True)
        # Trade units not in pint's defaults (or spelled the way engineers write them).
        # pint already knows kip and ksi; add the trade's per-length and per-area spellings
        reg.define("klf = kip / foot")
        reg.define("plf = pound_force / foot")
        reg.define("psf = pound_force / foot ** 2")
        reg.define("ksf = kip / foot ** 2")
        reg.define("pcf = pound / foot ** 3")
        reg.formatter.default_format = "~P"
        pint.set_application_registry(reg)
        _ureg = reg
    return _ureg


class _LazyRegistry:
    """Stands in for the registry until first attribute access (keeps ``import calckit`` fast)."""

    def __getattr__(self, item):
        return getattr(_registry(), item)

    def __call__(self, *a, **k):
        return _registry()(*a, **k)

    def __repr__(self) -> str:
        return "<calckit unit registry>"


ureg = _LazyRegistry()


def Q_(value, unit=None):
    """Make a quantity with calckit's registry: ``Q_(6, "m")`` or ``Q_("6 m")``."""
    reg = _registry()
    if unit is None:
        return reg.Quantity(value)
    return reg.Quantity(value, unit)


def is_quantity(x) -> bool:
    return hasattr(x, "magnitude") and hasattr(x, "units") and hasattr(x, "to")


def parse(text: str, name: str = "value"):
    """Parse a string such as '17.99 in' into a quantity; errors name the parameter."""
    reg = _registry()
    try:
        q = reg.Quantity(text.strip())
    except Exception as exc:  # pint raises several types for bad strings
        raise UnitsError(f"{name}: got {text!r}; could not read it as a number with a unit ({exc})") from None
    return q


def _si_unit(dim: str):
    if dim not in DIMS:
        raise InputError(f"dimension: got {dim!r}; expected one of {sorted(DIMS)}")
    u = _dim_cache.get(dim)
    if u is None:
        reg = _registry()
        u = reg.Unit(DIMS[dim][0]) if DIMS[dim][0] else reg.dimensionless
        _dim_cache[dim] = u
    return u


def to_si(value, dim: str, name: str = "value", *, allow_array: bool = True):
    """Convert ``value`` (quantity, string, or for 'dimensionless' a number) to an SI float or array.

    Raises UnitsError naming ``name`` when a bare number is given for a dimensioned input or the
    dimension is wrong, and InputError for NaN.
    """
    if isinstance(value, str):
        value = parse(value, name)
    if is_quantity(value):
        u = _si_unit(dim)
        try:
            mag = value.m_as(u)
        except Exception:
            raise UnitsError(
                f"{name}: got {_fmt(value)} (dimension {value.dimensionality}); expected {DIMS[dim][3]}"
            ) from None
    else:
        if dim not in ("dimensionless", "rotation") and not _is_zero(value):
            raise UnitsError(f"{name}: got the bare number {value!r}; expected {DIMS[dim][3]}, with a unit")
        mag = value
    if isinstance(mag, (list, tuple, np.ndarray)):
        if not allow_array:
            raise InputError(f"{name}: got an array; expected a single value")
        arr = np.asarray(mag, dtype=float)
        if np.isnan(arr).any():
            raise InputError(f"{name}: got NaN; expected a finite number")
        return arr
    try:
        f = float(mag)
    except (TypeError, ValueError):
        raise InputError(f"{name}: got {value!r}; expected {DIMS[dim][3]}") from None
    if math.isnan(f):
        raise InputError(f"{name}: got NaN; expected a finite number")
    return f


def _fmt(q) -> str:
    try:
        return f"{q.magnitude:g} {q.units:~}"
    except Exception:
        return repr(q)


def _is_zero(v) -> bool:
    # A bare 0 is unambiguous in any unit (e.g. zg=0, Lb=0); everything else needs a unit.
    return isinstance(v, (int, float)) and not isinstance(v, bool) and v == 0


def quantity(si_value, dim: str, system: str | None = None):
    """Return a pint quantity for an SI value; ``system`` 'SI' or 'US' converts to the display unit."""
    reg = _registry()
    q = reg.Quantity(si_value, _si_unit(dim))
    if system is not None:
        q = q.to(display_unit(dim, system))
    return q


def display_unit(dim: str, system: str = "SI") -> str:
    """The unit calc sheets show for ``dim`` in the 'SI' or 'US' system."""
    if dim not in DIMS:
        raise InputError(f"dimension: got {dim!r}; expected one of {sorted(DIMS)}")
    s = system.upper()
    if s not in ("SI", "US"):
        raise InputError(f"units: got {system!r}; expected 'SI' or 'US'")
    return DIMS[dim][1] if s == "SI" else DIMS[dim][2]


def convert(si_value, dim: str, unit: str) -> float:
    """SI float -> float in ``unit`` (e.g. convert(1.0, 'moment', 'kip*ft'))."""
    reg = _registry()
    return reg.Quantity(si_value, _si_unit(dim)).m_as(unit)


def fmt(si_value: float, dim: str, system: str = "SI", sig: int = 4) -> str:
    """A value as text in the display unit of ``system``: fmt(4.267, "span", "US") -> '14 ft'."""
    unit = display_unit(dim, system)
    v = convert(si_value, dim, unit) if unit else si_value
    shown = unit.replace("**2", "²").replace("**3", "³").replace("**4", "⁴").replace("*", "·")
    return f"{v:.{sig}g} {shown}".rstrip()
