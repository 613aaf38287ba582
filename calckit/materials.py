"""Structural steel grades (``calckit.steel``).

Grades and thickness bands are data (``calckit/data/steel_grades.csv``, whose header documents the columns
and cites the sources). ``steel(grade)`` returns an immutable :class:`Steel`; quantities at the boundary,
SI floats in ``Steel.si``.

References: AISC 360-22 Section A3.1 and the AISC Steel Construction Manual (15th ed.) Tables 2-4/2-5;
EN 1993-1-1:2005 Section 3.2 and Table 3.1.
"""
from __future__ import annotations

import csv
import re
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path

from .errors import InputError
from .units import quantity, to_si

__all__ = ["Steel", "SteelSI", "steel", "grades"]

_DATA = Path(__file__).with_name("data") / "steel_grades.csv"
_KSI = 6.894757293168361e6  # Pa
_IN = 0.0254  # m
_MPA = 1e6


@dataclass(frozen=True)
class SteelSI:
    """Nominal (thinnest band) properties as SI floats, in Pa."""

    fy: float  #: minimum yield strength of the thinnest band
    fu: float  #: minimum tensile strength of the thinnest band
    E: float  #: modulus of elasticity
    G: float  #: shear modulus


@dataclass(frozen=True)
class Steel:
    """A structural steel grade.

    ``bands`` holds ``(t_max_m, fy_Pa, fu_Pa)`` in increasing thickness; ``fy(t)``/``fu(t)`` pick the band.
    """

    name: str
    standard: str  #: "ASTM" or "EN"
    bands: tuple[tuple[float, float, float], ...]
    E_si: float
    G_si: float
    source: str

    @property
    def si(self) -> SteelSI:
        return SteelSI(self.bands[0][1], self.bands[0][2], self.E_si, self.G_si)

    @property
    def Fy(self):
        return quantity(self.bands[0][1], "stress", self._system)

    @property
    def Fu(self):
        return quantity(self.bands[0][2], "stress", self._system)

    @property
    def E(self):
        return quantity(self.E_si, "stress", self._system)

    @property
    def G(self):
        return quantity(self.G_si, "stress", self._system)

    @property
    def _system(self) -> str:
        return "US" if self.standard == "ASTM" else "SI"

    def _band(self, t: float, param: str) -> tuple[float, float, float]:
        if not t > 0:
            raise InputError(f"{param}: got {t!r} m; expected a thickness > 0")
        for band in self.bands:
            if t <= band[0] * (1 + 1e-12):
                return band
        tmax = self.bands[-1][0]
        unit, scale = ("in", _IN) if self.standard == "ASTM" else ("mm", 1e-3)
        raise InputError(
            f"{param}: got {t / scale:.4g} {unit}; expected a thickness <= {tmax / scale:.4g} {unit}, the "
            f"largest band given for {self.name} ({self.source})"
        )

    def fy_si(self, t: float) -> float:
        """Yield strength (Pa) for material of thickness ``t`` (m)."""
        return self._band(t, "t")[1]

    def fu_si(self, t: float) -> float:
        """Tensile strength (Pa) for material of thickness ``t`` (m)."""
        return self._band(t, "t")[2]

    def fy(self, t):
        """Yield strength for thickness ``t`` (quantity or string), as a quantity."""
        return quantity(self.fy_si(to_si(t, "length", "t")), "stress", self._system)

    def fu(self, t):
        """Tensile strength for thickness ``t`` (quantity or string), as a quantity."""
        return quantity(self.fu_si(to_si(t, "length", "t")), "stress", self._system)

    def __repr__(self) -> str:
        unit, s = ("ksi", _KSI) if self.standard == "ASTM" else ("MPa", _MPA)
        return f"Steel({self.name}: fy {self.bands[0][1] / s:g} {unit}, fu {self.bands[0][2] / s:g} {unit})"


def _key(name: str) -> str:
    k = re.sub(r"[\s\-_]", "", str(name).upper())
    return k.replace("GRADE", "").replace("GR", "")


@lru_cache(maxsize=1)
def _load() -> dict[str, Steel]:
    rows: dict[str, list[dict]] = {}
    with _DATA.open(newline="") as fh:
        lines = [ln for ln in fh if not ln.startswith("#")]
    for row in csv.DictReader(lines):
        rows.setdefault(row["grade"], []).append(row)
    out: dict[str, Steel] = {}
    for grade, rs in rows.items():
        bands = []
        for r in rs:
            tl = float(r["t_max"]) * (_IN if r["t_unit"] == "in" else 1e-3)
            s = _KSI if r["stress_unit"] == "ksi" else _MPA
            bands.append((tl, float(r["fy"]) * s, float(r["fu"]) * s))
        std = rs[0]["standard"]
        if std == "ASTM":
            E, G = 29000 * _KSI, 11200 * _KSI
        else:
            E = 210000 * _MPA
            G = E / (2 * (1 + 0.3))
        out[_key(grade)] = Steel(grade, std, tuple(bands), E, G, rs[0]["source"])
    return out


def grades() -> list[str]:
    """Names of the grades calckit knows."""
    return [s.name for s in _load().values()]


def steel(grade: str | Steel) -> Steel:
    """Return the :class:`Steel` for ``grade`` ("A992", "A572 Gr 50", "S355", ...)."""
    if isinstance(grade, Steel):
        return grade
    table = _load()
    s = table.get(_key(grade))
    if s is None:
        import difflib

        close = difflib.get_close_matches(_key(grade), list(table), n=3, cutoff=0.0)
        names = ", ".join(table[c].name for c in close)
        raise InputError(f"grade: got {grade!r}; expected a known steel grade (closest: {names}; all: "
                         f"{', '.join(grades())})")
    return s
