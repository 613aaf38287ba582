"""Rolled-section catalog: US W shapes and European IPE, HE A and HE B sections.

The data live in ``calckit/data/sections_w.csv`` (AISC Steel Construction Manual, 15th ed., Table 1-1) and
``calckit/data/sections_eu.csv`` (EN 10365:2017 dimensions with the European profile tables' static values).
Both files document every column, unit, source and edition in their ``#`` header; the values are from
memory of those tables and are checked row by row against properties computed from the rows' own
dimensions (tests/validation/test_catalog_tables.py).

Files are read on first use (stdlib ``csv``) and cached; a section is built the first time it is asked for
and the same immutable object is returned afterwards.

>>> from calckit.sections.catalog import section, catalog
>>> s = section("W 18 x 50")              # also "w18x50", "IPE 300", "HE 300 B", "HEB300"
>>> s.name, s.family                       # ('W18X50', 'W')
>>> s.tabulated["Ix"]                      # handbook value, SI float (m4)
>>> [b.name for b in catalog("IPE", depth=("300 mm", "400 mm"))]

Each section is a :class:`calckit.sections.IShape` (root fillets included) with three extra attributes:

``family``     "W", "IPE", "HEA" or "HEB"
``designation`` the name as written in drawings: "IPE 300", "HE 300 B", "W18X50"
``tabulated``  read-only mapping of the handbook's values as SI floats, in calckit's x-major naming:
               ``A`` (m2), ``Ix``, ``Iy``, ``J`` (m4), ``Sx``, ``Zx`` (m3), ``Cw`` (m6), ``mass`` (kg/m;
               for W shapes the nominal weight in lb/ft converted) and, for W shapes only, ``k_des`` (m).
               EN notation: I_y = Ix, I_z = Iy, W_el,y = Sx, W_pl,y = Zx, I_t = J, I_w = Cw.

The fillet radius of a W shape is r = k_des - tf (common practice); EU rows tabulate r directly.

A design aid only: results must be reviewed and sealed by a licensed or chartered engineer; local codes,
national annexes and project specifications govern. Check catalog values against the printed tables.
"""
from __future__ import annotations

import csv
import difflib
import hashlib
import re
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path
from types import MappingProxyType
from typing import Mapping

from ..errors import InputError

__all__ = ["section", "catalog", "names", "rows", "families", "normalize_name", "data_files", "data_hashes",
           "CatalogRow"]

_DATA = Path(__file__).resolve().parent.parent / "data"

_IN = 0.0254
_LB_PER_FT = 0.45359237 / 0.3048  # kg/m per lb/ft

# file -> (column -> (calckit field, factor to SI)); units as documented in each file's header.
_W_COLS = {
    "d": ("d", _IN), "bf": ("bf", _IN), "tw": ("tw", _IN), "tf": ("tf", _IN), "k_des": ("k_des", _IN),
    "W": ("mass", _LB_PER_FT), "A": ("A", _IN ** 2), "Ix": ("Ix", _IN ** 4), "Sx": ("Sx", _IN ** 3),
    "Zx": ("Zx", _IN ** 3), "Iy": ("Iy", _IN ** 4), "J": ("J", _IN ** 4), "Cw": ("Cw", _IN ** 6),
}
_EU_COLS = {
    "h": ("d", 1e-3), "b": ("bf", 1e-3), "tw": ("tw", 1e-3), "tf": ("tf", 1e-3), "r": ("r", 1e-3),
    "mass": ("mass", 1.0), "A": ("A", 1e-4), "Ix": ("Ix", 1e-8), "Sx": ("Sx", 1e-6), "Zx": ("Zx", 1e-6),
    "Iy": ("Iy", 1e-8), "J": ("J", 1e-8), "Cw": ("Cw", 1e-9),  # Cw column in 10^3 cm6 = 1e-9 m6
}
_FILES = (("sections_w.csv", _W_COLS, ("W",)), ("sections_eu.csv", _EU_COLS, ("IPE", "HEA", "HEB")))
_FAMILIES = ("W", "IPE", "HEA", "HEB")
_TABULATED = ("A", "Ix", "Sx", "Zx", "Iy", "J", "Cw", "mass")


@dataclass(frozen=True)
class CatalogRow:
    """One parsed catalog row: dimensions and tabulated values in SI (m, m2, m3, m4, m6, kg/m)."""

    name: str  #: normalised designation, e.g. "W18X50", "IPE300", "HEB300"
    family: str  #: "W", "IPE", "HEA" or "HEB"
    d: float  #: overall depth (EN h), m
    bf: float  #: flange width (EN b), m
    tw: float  #: web thickness, m
    tf: float  #: flange thickness, m
    r: float  #: root fillet radius, m (W shapes: k_des - tf, common practice)
    tabulated: Mapping[str, float]  #: handbook values, SI; keys as in the module docstring
    source: str  #: data file name
    line: int  #: line number in the data file
    raw: Mapping[str, str]  #: the row's cells as written in the file (file units)


def data_files() -> dict[str, Path]:
    """The catalog's data files (name -> path), e.g. for recording their hashes in a calc record."""
    return {fn: _DATA / fn for fn, _, _ in _FILES}


def data_hashes() -> dict[str, str]:
    """SHA-256 of each data file (name -> hex digest)."""
    return {fn: hashlib.sha256(p.read_bytes()).hexdigest() for fn, p in data_files().items()}


def _parse_file(fn: str, cols: dict, fams: tuple[str, ...]) -> list[CatalogRow]:
    path = _DATA / fn
    with path.open(newline="", encoding="utf-8") as fh:
        lines = [(i, ln) for i, ln in enumerate(fh, start=1) if ln.strip() and not ln.lstrip().startswith("#")]
    reader = csv.DictReader(ln for _, ln in lines)
    need = {"name", "family", *cols}
    missing = need - set(reader.fieldnames or ())
    if missing:
        raise InputError(f"{fn}: header lacks the columns {sorted(missing)}")
    out = []
    for (lineno, _), cells in zip(lines[1:], reader):
        where = f"{fn} line {lineno}"
        fam = cells["family"].strip().upper()
        if fam not in fams:
            raise InputError(f"{where}: family got {cells['family']!r}; expected one of {list(fams)}")
        vals = {}
        for col, (field, factor) in cols.items():
            try:
                v = float(cells[col])
            except (TypeError, ValueError):
                raise InputError(f"{where}: column {col} got {cells[col]!r}; expected a number") from None
            if not v > 0:
                raise InputError(f"{where}: column {col} got {v!r}; expected a value > 0")
            vals[field] = v * factor
        if "k_des" in vals:
            r = vals["k_des"] - vals["tf"]
            if not r > 0:
                raise InputError(f"{where}: k_des {cells['k_des']} <= tf {cells['tf']}; expected k_des > tf")
            vals["r"] = r
        tab = {k: vals[k] for k in _TABULATED}
        if "k_des" in vals:
            tab["k_des"] = vals["k_des"]
        name = normalize_name(cells["name"])
        out.append(CatalogRow(name=name, family=fam, d=vals["d"], bf=vals["bf"], tw=vals["tw"],
                              tf=vals["tf"], r=vals["r"], tabulated=MappingProxyType(tab), source=fn,
                              line=lineno, raw=MappingProxyType(dict(cells))))
    return out


@lru_cache(maxsize=1)
def _load() -> tuple[tuple[CatalogRow, ...], dict[str, CatalogRow]]:
    all_rows: list[CatalogRow] = []
    for fn, cols, fams in _FILES:
        all_rows += _parse_file(fn, cols, fams)
    index: dict[str, CatalogRow] = {}
    for row in all_rows:
        if row.name in index:
            raise InputError(f"{row.source} line {row.line}: duplicate section {row.name!r}")
        index[row.name] = row
    return tuple(all_rows), index


def rows() -> tuple[CatalogRow, ...]:
    """All parsed catalog rows (W rows first, then IPE, HE A, HE B), in file order."""
    return _load()[0]


def families() -> tuple[str, ...]:
    """The family names the catalog knows: ("W", "IPE", "HEA", "HEB")."""
    return _FAMILIES


_HE = re.compile(r"^HE(\d+)([AB])$")


def normalize_name(name: str) -> str:
    """Canonical designation: upper case, spaces removed, 'x' or '×' as 'X', "HE 300 B" as "HEB300".

    "w 18 x 50" -> "W18X50"; "IPE 300" -> "IPE300"; "HE300A" -> "HEA300"; "HE B 300" -> "HEB300".
    """
    if not isinstance(name, str):
        raise InputError(f"name: got {name!r}; expected a section designation such as 'W18X50' or 'IPE 300'")
    s = re.sub(r"\s+", "", name).upper().replace("×", "X")
    m = _HE.match(s)
    if m:
        s = f"HE{m.group(2)}{m.group(1)}"
    return s


def designation(name: str) -> str:
    """The designation as engineers write it in drawings and calcs: "IPE 300", "HE 300 A", "HE 300 B"
    (EN 10365 style); W shapes keep the AISC form "W18X50". ``name`` is a normalised catalog name."""
    m = re.fullmatch(r"HE([AB])(\d+)", name)
    if m:
        return f"HE {m.group(2)} {m.group(1)}"
    m = re.fullmatch(r"IPE(\d+)", name)
    return f"IPE {m.group(1)}" if m else name


_BUILT: dict[str, object] = {}


def _build(row: CatalogRow):
    sec = _BUILT.get(row.name)
    if sec is None:
        from .shapes import IShape

        sec = IShape.from_si(row.d, row.bf, row.tf, row.tw, row.r, name=row.name)
        # Section.__setattr__ allows setting a new attribute once; the mapping is read-only.
        sec.family = row.family
        sec.tabulated = row.tabulated
        sec.designation = designation(row.name)
        _BUILT[row.name] = sec
    return sec


def section(name: str):
    """The catalog section called ``name`` (an IShape with ``family`` and ``tabulated``).

    Matching ignores case and spaces: "W18X50", "w18x50", "W 18 x 50", "IPE 300", "HEB300", "HE 300 B".
    Raises InputError naming the three closest designations when the name is not in the catalog.
    """
    key = normalize_name(name)
    index = _load()[1]
    row = index.get(key)
    if row is None:
        close = _closest(key, list(index), 3)
        raise InputError(f"name: got {name!r}; no such section in the catalog (families "
                         f"{', '.join(_FAMILIES)}). Closest: {', '.join(close)}")
    return _build(row)


_NUM = re.compile(r"\d+(?:\.\d+)?")


def _closest(key: str, candidates: list[str], n: int) -> list[str]:
    """The ``n`` candidates most like ``key``: difflib's similarity ratio first, then (among near ties)
    the closeness of the numbers in the designations (depth, weight), so "W18X51" suggests W18X50 first."""
    qnum = [float(x) for x in _NUM.findall(key)]
    qfam = _NUM.sub("#", key)

    def numdist(c: str) -> float:
        cnum = [float(x) for x in _NUM.findall(c)]
        if len(cnum) != len(qnum) or not qnum:
            return float("inf")
        return sum(abs(a - b) / max(a, b, 1e-9) for a, b in zip(qnum, cnum))

    def score(c: str):
        ratio = difflib.SequenceMatcher(None, key, c).ratio()
        return (-round(ratio, 2), _NUM.sub("#", c) != qfam, numdist(c), c)

    return sorted(candidates, key=score)[:n]


def _families(family) -> tuple[str, ...]:
    if family is None:
        return _FAMILIES
    items = [family] if isinstance(family, str) else family
    try:
        items = list(items)
    except TypeError:
        raise InputError(f"family: got {family!r}; expected one of {list(_FAMILIES)} or a list of them") from None
    out = []
    for f in items:
        key = re.sub(r"\s+", "", f).upper() if isinstance(f, str) else f
        if key not in _FAMILIES:
            raise InputError(f"family: got {f!r}; expected one of {list(_FAMILIES)} or a list of them")
        if key not in out:
            out.append(key)
    if not out:
        raise InputError(f"family: got {family!r}; expected one of {list(_FAMILIES)} or a non-empty list")
    return tuple(out)


def _bounds(value, dim: str, pname: str) -> tuple[float, float]:
    """(min, max) in SI from a 2-sequence of quantities/strings; None means unbounded on that side."""
    if value is None:
        return float("-inf"), float("inf")
    if isinstance(value, str) or not hasattr(value, "__len__") or len(value) != 2:
        raise InputError(f"{pname}: got {value!r}; expected a (min, max) pair such as ('300 mm', '600 mm'), "
                         f"either end may be None")
    from ..units import to_si

    lo = float("-inf") if value[0] is None else to_si(value[0], dim, f"{pname}[0]", allow_array=False)
    hi = float("inf") if value[1] is None else to_si(value[1], dim, f"{pname}[1]", allow_array=False)
    if lo > hi:
        raise InputError(f"{pname}: got min {value[0]!r} > max {value[1]!r}; expected min <= max")
    return lo, hi


def _select(family, depth, mass) -> list[CatalogRow]:
    fams = _families(family)
    dlo, dhi = _bounds(depth, "length", "depth")
    mlo, mhi = _bounds(mass, "mass_per_length", "mass")
    # a relative slack of 1e-9 so that bounds written in file units (e.g. "18 in") include the row itself
    eps = 1e-9
    sel = [r for r in rows() if r.family in fams
           and dlo * (1 - eps) <= r.d <= dhi * (1 + eps)
           and mlo * (1 - eps) <= r.tabulated["mass"] <= mhi * (1 + eps)]
    if not sel:
        raise InputError(f"catalog: no section matches family={family!r}, depth={depth!r}, mass={mass!r}; "
                         f"widen the bounds (families: {', '.join(_FAMILIES)})")
    return sel


def catalog(family=None, depth=None, mass=None) -> list:
    """Catalog sections filtered by family and by (min, max) bounds on depth and mass per length.

    ``family``: None (all), one of "W", "IPE", "HEA", "HEB" (case and spaces ignored), or a list of them.
    ``depth``: (min, max) overall depth, quantities or strings ("300 mm", "18 in"); either end may be None.
    ``mass``: (min, max) mass per length ("50 kg/m", "40 lb/ft"); W shapes use their nominal weight.
    Bounds are inclusive. Returns IShape objects sorted by mass, lightest first (ties: shallower first).
    Raises InputError for an unknown family, malformed bounds, or when nothing matches.
    """
    sel = _select(family, depth, mass)
    sel.sort(key=lambda r: (r.tabulated["mass"], r.d, r.name))
    return [_build(r) for r in sel]


def names(family=None) -> list[str]:
    """Designations in the catalog (file order), optionally for one family or a list of families."""
    fams = _families(family)
    return [r.name for r in rows() if r.family in fams]
