"""Declared parameter sets of the calc notebooks, and their validation.

Every calc notebook in ``calcs/`` has a papermill ``parameters`` cell with one ``name = value  # meaning``
line per parameter. The same set is declared here (:data:`CALCS`) with its type, dimension, range and
choices, so that a parameter file is checked *before* any kernel starts:

* every key must be a Python identifier and a declared parameter of the calc (papermill does not check
  names: an undeclared key such as ``"x = 1; import os #"`` would be executed as code);
* every value must have the declared type; quantities are strings with units ("9.0 m", "0.75 kip/ft"),
  so one file may mix unit systems; they are converted with :func:`calckit.units.to_si` only to check the
  dimension and the range, and are passed to the notebook as written;
* required parameters must be present; the others take the declared default (which the tests check is
  the notebook's default, read with ``papermill.inspect_notebook``).

A problem raises :class:`ParameterError` (an :class:`~calckit.errors.InputError`) that lists every problem
of the file, each naming the file, the line where known, the parameter, the value and what was expected.

The declarations also write the notebook parameters cells (:func:`parameters_cell`).
"""
from __future__ import annotations

import keyword
import re
from dataclasses import dataclass
from typing import Any, Mapping, Sequence

from .errors import InputError

__all__ = ["Param", "CalcSpec", "CALCS", "ParameterError", "validate", "parameters_cell", "spec",
           "is_identifier", "RESERVED", "PROJECT_KEYS"]

MEMBER_RE = re.compile(r"^[A-Za-z0-9][A-Za-z0-9._-]{0,47}$")


@dataclass(frozen=True)
class Param:
    """One declared calc parameter.

    kind : "text", "choice", "flag", "number", "integer", "quantity", "quantities" (list of quantity
        strings; a single string is accepted and made a one-item list), "list" (list of choices),
        "records" (list of mappings whose keys are declared in ``fields``), or "optional_quantity"
        (a quantity string or None).
    dim : dimension name of :data:`calckit.units.DIMS` for quantity kinds.
    lo, hi : inclusive range; strings with units for quantities ("0.5 m"), numbers otherwise.
    lo_open : the lower bound is exclusive (value must exceed ``lo``).
    choices : allowed values for "choice" and "list" kinds (compared case-sensitively).
    help : meaning and unit, written after ``#`` in the notebook parameters cell.
    required : the parameter file must give it.
    reserved : set by the batch (revision, run date, headless), not by a parameter file.
    fields : for "records", the declared keys of each item (a tuple of Param).
    min_items, max_items : list length bounds for list kinds.
    """

    name: str
    kind: str
    default: Any
    help: str
    dim: str | None = None
    lo: Any = None
    hi: Any = None
    lo_open: bool = False
    choices: tuple = ()
    required: bool = False
    reserved: bool = False
    fields: tuple["Param", ...] = ()
    min_items: int = 0
    max_items: int = 50


@dataclass(frozen=True)
class CalcSpec:
    """The declared parameters of one calc notebook (``calcs/<name>.ipynb``)."""

    name: str
    title: str
    params: tuple[Param, ...]
    check: Any = None  #: optional cross-parameter check: f(values) -> list of (name, message)

    def __post_init__(self):
        names = [p.name for p in self.params]
        if len(names) != len(set(names)):
            raise ValueError(f"calc {self.name}: duplicate parameter names")

    @property
    def names(self) -> tuple[str, ...]:
        return tuple(p.name for p in self.params)

    def param(self, name: str) -> Param:
        for p in self.params:
            if p.name == name:
                return p
        raise KeyError(name)

    def defaults(self) -> dict[str, Any]:
        return {p.name: _copy(p.default) for p in self.params}


class ParameterError(InputError):
    """Bad parameters in a file; ``problems`` lists (parameter, message) pairs, message already prefixed."""

    def __init__(self, source: str, problems: Sequence[tuple[str, str]]):
        self.source = source
        self.problems = list(problems)
        super().__init__("\n".join(m for _, m in self.problems))


def _copy(v):
    if isinstance(v, list):
        return [_copy(x) for x in v]
    if isinstance(v, dict):
        return {k: _copy(x) for k, x in v.items()}
    return v


def is_identifier(name: object) -> bool:
    """A usable parameter name: a str that is a Python identifier and not a keyword."""
    return isinstance(name, str) and name.isidentifier() and not keyword.iskeyword(name) \
        and name.isascii()


# ---------------------------------------------------------------------------------------------------
# declarations
# ---------------------------------------------------------------------------------------------------
STANDARDS = ("AISC 360-22", "EN 1993-1-1")
SUPPORTS = ("pin", "roller", "fixed", "free")
BRACING = ("continuous", "supports", "midspan", "thirds", "quarters")

#: Parameters every calc has (header of the calc sheet and batch control).
COMMON = (
    Param("member", "text", "B-1", "member mark (archive folder name): letters, digits, . _ -",
          required=True),
    Param("description", "text", "", "what and where the member is"),
    Param("job", "text", "", "job number"),
    Param("project", "text", "", "project name"),
    Param("client", "text", "", "client"),
    Param("designer", "text", "", "initials of the engineer who prepared the calc"),
    Param("revision", "text", "draft", "archive revision (set by the batch)", reserved=True),
    Param("run_date", "text", "", "date the calc was filed, YYYY-MM-DD (set by the batch)", reserved=True),
    Param("headless", "flag", True, "True: static outputs only (batch); set False in JupyterLab for sliders",
          reserved=True),
)
#: Keys a folder's project.yaml may set for every member in it.
PROJECT_KEYS = ("job", "project", "client", "designer")
#: Parameters the batch sets itself; a parameter file may not.
RESERVED = tuple(p.name for p in COMMON if p.reserved)

_LOAD_FIELDS = (
    Param("case", "choice", "D", "load case", choices=("D", "L", "Lr", "S")),
    Param("P", "quantity", "0 kN", "force, downward positive", dim="force", lo="-20000 kN", hi="20000 kN"),
    Param("x", "quantity", "0 m", "position from the left end", dim="length", lo="0 m", hi="200 m"),
    Param("bearing", "optional_quantity", None, "stiff bearing length under the load, when it bears on the "
          "top flange (web bearing is checked there); none: framed in, no bearing check", dim="length",
          lo="0 mm", hi="2000 mm"),
    Param("stiffener_b", "optional_quantity", None, "width of each load-bearing stiffener of a pair under "
          "the load (with stiffener_t and bearing)", dim="length", lo="10 mm", hi="1000 mm"),
    Param("stiffener_t", "optional_quantity", None, "thickness of those stiffeners", dim="length", lo="3 mm",
          hi="100 mm"),
)

_DESIGN = (
    Param("standard", "choice", "AISC 360-22", "design standard: 'AISC 360-22' or 'EN 1993-1-1'",
          choices=STANDARDS, required=True),
    Param("method", "choice", "LRFD", "AISC 360 only: 'LRFD' or 'ASD' (EN 1993 uses partial factors)",
          choices=("LRFD", "ASD")),
    Param("units", "choice", "SI", "units shown in the calc: 'SI' or 'US'", choices=("SI", "US")),
    Param("grade", "text", "A992", "steel grade, e.g. 'A992', 'A572-50', 'S355'", required=True),
)

def _loads(dead: str, live: str) -> tuple:
    return (
        Param("dead_udl", "quantity", dead, "superimposed dead load, uniform (self-weight is added)",
              dim="line_load", lo="0 kN/m", hi="2000 kN/m", required=True),
        Param("live_udl", "quantity", live, "live load, uniform (give 0 where there is none)", dim="line_load",
              lo="0 kN/m", hi="2000 kN/m", required=True),
        Param("roof_live_udl", "quantity", "0 kN/m", "roof live load, uniform", dim="line_load", lo="0 kN/m",
              hi="2000 kN/m"),
        Param("snow_udl", "quantity", "0 kN/m", "snow load, uniform", dim="line_load", lo="0 kN/m",
              hi="2000 kN/m"),
        Param("point_loads", "records", [], "point loads: list of {case: D|L|Lr|S, P: force, x: from left end, bearing: optional}",
              fields=_LOAD_FIELDS),
        Param("self_weight", "flag", True, "add the member's self-weight to the dead load"),
        Param("live_category", "choice", "B", "EN 1990 only: imposed-load category of EN 1991-1-1 (A to H)",
              choices=tuple("ABCDEFGH")),
    )

_BRACING = (
    Param("bracing", "choice", "continuous",
          "lateral bracing of the compression flange: continuous, supports, midspan, thirds, quarters",
          choices=BRACING),
    Param("brace_points", "quantities", [], "extra brace positions from the left end (list of lengths)",
          dim="length", lo="0 m", hi="200 m"),
)

_BEARING = (
    Param("bearing_length", "optional_quantity", None,
          "stiff bearing length at the supports (web bearing is checked at the reactions: AISC J10, "
          "EN 1993-1-5 section 6); none: framed end connections, no bearing check", dim="length",
          lo="0 mm", hi="2000 mm"),
    Param("web_sidesway", "choice", "braced",
          "AISC only, at point loads with a bearing: 'braced' (relative lateral movement of the flanges "
          "prevented there: J10.4 not checked), 'rotation restrained' or 'rotation free' (the loaded "
          "flange's rotation; J10.4 web sidesway buckling checked)",
          choices=("braced", "rotation restrained", "rotation free")),
    Param("bearing_stiffener_b", "optional_quantity", None,
          "width of each bearing stiffener of the pair at the supports (none: no stiffeners; AISC sizes a "
          "pair where the web needs one)", dim="length", lo="10 mm", hi="1000 mm"),
    Param("bearing_stiffener_t", "optional_quantity", None,
          "thickness of the bearing stiffeners at the supports (AISC 360-22 J10.8; EN 1993-1-5 9.4)",
          dim="length", lo="3 mm",
          hi="100 mm"),
)

_DEFL = (
    Param("defl_limit_live", "number", 360.0, "live-load deflection limit: span / this number",
          lo=60.0, hi=2000.0),
    Param("defl_limit_total", "number", 240.0, "total-load deflection limit: span / this number",
          lo=60.0, hi=2000.0),
)


def _stiffener_check(v: Mapping[str, Any]) -> list[tuple[str, str]]:
    b, t = v.get("bearing_stiffener_b"), v.get("bearing_stiffener_t")
    if b is None and t is None:
        return []
    if b is None or t is None:
        miss = "bearing_stiffener_b" if b is None else "bearing_stiffener_t"
        return [(miss, "got none; expected both the width and the thickness of the bearing stiffeners")]
    if v.get("bearing_length") is None:
        return [("bearing_length", "got none; expected the bearing length at the supports where the bearing "
                 "stiffeners are")]
    return []


def _load_stiffener_check(v: Mapping[str, Any]) -> list[tuple[str, str]]:
    out = []
    sway = v.get("web_sidesway", "braced")
    if sway != "braced" and not str(v.get("standard", "")).upper().startswith("AISC"):
        out.append(("web_sidesway", f"got {sway!r}; web sidesway buckling is an AISC 360-22 J10.4 check "
                                    "(EN 1993-1-5 has no such check here); expected 'braced'"))
    for i, pl in enumerate(v.get("point_loads") or []):
        if not isinstance(pl, Mapping):
            continue
        b, t = pl.get("stiffener_b"), pl.get("stiffener_t")
        if (b is None) != (t is None):
            out.append(("point_loads", f"item {i + 1}: give both stiffener_b and stiffener_t, or neither"))
        elif b is not None and pl.get("bearing") is None:
            out.append(("point_loads", f"item {i + 1}: stiffeners under a load need its bearing length "
                                       "(bearing)"))
    return out


def _grade_check(v: Mapping[str, Any]) -> list[tuple[str, str]]:
    from .errors import CalckitError

    out = []
    if "grade" in v:
        try:
            from .materials import steel

            steel(v["grade"])
        except CalckitError as exc:
            out.append(("grade", _strip(str(exc), "grade")))
    return out


def _strip(msg: str, name: str) -> str:
    for pre in (f"{name}: ", "steel: ", "section: ", "name: ", "grade: "):
        if msg.startswith(pre):
            return msg[len(pre):]
    return msg


def _section_check(name: str, key: str) -> list[tuple[str, str]]:
    from .errors import CalckitError

    try:
        from .sections import section

        section(name)
    except CalckitError as exc:
        return [(key, _strip(str(exc), key))]
    return []


def _beam_check(v: Mapping[str, Any]) -> list[tuple[str, str]]:
    from .units import to_si

    lightest = isinstance(v["section"], str) and v["section"].strip().lower() == "lightest"
    out: list[tuple[str, str]] = (_grade_check(v) + _stiffener_check(v) + _load_stiffener_check(v) +
                                  ([] if lightest else _section_check(v["section"], "section")))
    spans, sup = v.get("spans"), v.get("supports")
    if isinstance(spans, list) and isinstance(sup, list) and len(sup) != len(spans) + 1:
        out.append(("supports", f"got {len(sup)} supports for {len(spans)} span(s); expected "
                                f"{len(spans) + 1} (one per end and one per interior support)"))
    try:
        L = sum(to_si(s, "span") for s in spans) if isinstance(spans, list) else None
    except Exception:
        L = None
    if L is not None:
        out += _positions_within(v, L)
    if not out and isinstance(spans, list) and isinstance(sup, list):
        from .errors import CalckitError

        try:  # a mechanism is bad input: find it before a kernel starts
            from .analysis import Beam

            Beam(spans, sup, EI="1 kN*m**2")
        except CalckitError as exc:
            out.append(("supports", _strip(str(exc), "supports")))
    return out


def _girder_check(v: Mapping[str, Any]) -> list[tuple[str, str]]:
    from .units import to_si

    out = _grade_check(v) + _stiffener_check(v) + _load_stiffener_check(v)
    try:
        L = to_si(v["span"], "span")
    except Exception:
        return out
    out += _positions_within(v, L)
    try:
        d = to_si(v["d"], "length")
        tf = to_si(v["tf_top"], "length") + to_si(v["tf_bot"] or v["tf_top"], "length")
        if tf >= 0.8 * d:
            out.append(("d", f"got {v['d']!r}; expected a depth well above the two flange thicknesses"))
    except Exception:
        pass
    return out


def _positions_within(v: Mapping[str, Any], L: float) -> list[tuple[str, str]]:
    from .units import to_si

    out = []
    for i, pl in enumerate(v.get("point_loads") or []):
        try:
            if to_si(pl["x"], "length") > L * (1 + 1e-9):
                out.append(("point_loads", f"item {i + 1}: x = {pl['x']!r} is beyond the beam length "
                                           f"{L:.6g} m"))
        except Exception:
            pass
    for s in v.get("brace_points") or []:
        try:
            if to_si(s, "length") > L * (1 + 1e-9):
                out.append(("brace_points", f"{s!r} is beyond the beam length {L:.6g} m"))
        except Exception:
            pass
    return out


STEEL_BEAM = CalcSpec(
    "steel_beam",
    "Steel beam: loads, analysis, section, checks, deflection",
    COMMON + _DESIGN + (
        Param("section", "text", "W18X50", "rolled section from the catalog, e.g. 'W18X50', 'IPE 300', or "
              "'lightest' (the lightest passing section is picked and recorded)",
              required=True),
        Param("spans", "quantities", ["9.0 m"], "span lengths, left to right (more than one: continuous)",
              dim="span", lo="0.3 m", hi="60 m", min_items=1, max_items=8, required=True),
        Param("supports", "list", ["pin", "roller"],
              "support at each end and interior support: pin, roller, fixed, free",
              choices=SUPPORTS, min_items=2, max_items=9),
    ) + _loads("5 kN/m", "10 kN/m") + _BRACING + _BEARING + _DEFL,
    check=_beam_check,
)

PLATE_GIRDER = CalcSpec(
    "plate_girder",
    "Welded plate girder: proportions, classification, bending, shear, stiffeners, flange-to-web welds",
    COMMON + _DESIGN + (
        Param("span", "quantity", "20 m", "simply supported span", dim="span", lo="2 m", hi="80 m",
              required=True),
        Param("d", "quantity", "1500 mm", "overall depth", dim="length", lo="200 mm", hi="6000 mm",
              required=True),
        Param("tw", "quantity", "12 mm", "web thickness", dim="length", lo="4 mm", hi="100 mm",
              required=True),
        Param("bf_top", "quantity", "450 mm", "top flange width", dim="length", lo="50 mm", hi="2000 mm",
              required=True),
        Param("tf_top", "quantity", "30 mm", "top flange thickness", dim="length", lo="5 mm", hi="150 mm",
              required=True),
        Param("bf_bot", "optional_quantity", None, "bottom flange width (None: as the top flange)",
              dim="length", lo="50 mm", hi="2000 mm"),
        Param("tf_bot", "optional_quantity", None, "bottom flange thickness (None: as the top flange)",
              dim="length", lo="5 mm", hi="150 mm"),
        Param("weld", "quantity", "8 mm", "flange-to-web fillet weld leg (each side of the web)",
              dim="length", lo="3 mm", hi="30 mm"),
        Param("stiffener_spacing", "quantity", "0 m",
              "clear spacing of intermediate transverse stiffeners (0: none)", dim="length", lo="0 m",
              hi="80 m"),
        Param("electrode", "text", "E70", "AISC only: weld electrode classification, e.g. 'E70'"),
    ) + _loads("40 kN/m", "30 kN/m") + _BRACING + _BEARING + _DEFL,
    check=_girder_check,
)

_PART_FIELDS = (
    Param("shape", "text", "plate", "'plate' or a catalog section name such as 'W18X50'"),
    Param("b", "optional_quantity", None, "plate width (plates only)", dim="length", lo="1 mm",
          hi="5000 mm"),
    Param("t", "optional_quantity", None, "plate thickness (plates only)", dim="length", lo="1 mm",
          hi="5000 mm"),
    Param("x", "quantity", "0 mm", "left edge of the part's bounding box (>= 0)", dim="length",
          lo="0 m", hi="20 m"),
    Param("y", "quantity", "0 mm", "bottom edge of the part's bounding box (>= 0)", dim="length",
          lo="0 m", hi="20 m"),
    Param("name", "text", "", "label of the part in the calc"),
)

def _builtup_check(v: Mapping[str, Any]) -> list[tuple[str, str]]:
    out = _grade_check(v)
    for i, part in enumerate(v.get("parts") or []):
        shape = str(part.get("shape", ""))
        if shape.lower() == "plate":
            if part.get("b") is None or part.get("t") is None:
                out.append(("parts", f"item {i + 1}: a plate needs b and t"))
        else:
            out += [("parts", f"item {i + 1}: shape: {m}") for _, m in _section_check(shape, "shape")]
    return out


SECTION_PROPERTIES = CalcSpec(
    "section_properties",
    "Built-up section: properties for the record",
    COMMON + (
        Param("units", "choice", "SI", "units shown in the calc: 'SI' or 'US'", choices=("SI", "US")),
        Param("grade", "text", "S355", "steel grade, for the plastic and yield values"),
        Param("parts", "records",
              [{"shape": "IPE 400", "x": "35 mm", "y": "0 mm", "name": "beam"},
               {"shape": "plate", "b": "250 mm", "t": "15 mm", "x": "0 mm", "y": "400 mm",
                "name": "cover plate"}],
              "parts: list of {shape: plate or catalog name, b, t (plates), x, y (lower-left corner), name}",
              fields=_PART_FIELDS, min_items=1, max_items=30, required=True),
    ),
    check=_builtup_check,
)

#: calc name -> declaration
CALCS: dict[str, CalcSpec] = {c.name: c for c in (STEEL_BEAM, PLATE_GIRDER, SECTION_PROPERTIES)}


def spec(calc: str) -> CalcSpec:
    """The declaration of ``calc``; InputError naming the known calcs otherwise."""
    try:
        return CALCS[calc]
    except (KeyError, TypeError):
        raise InputError(f"calc: got {calc!r}; expected one of {', '.join(sorted(CALCS))}") from None


# ---------------------------------------------------------------------------------------------------
# validation
# ---------------------------------------------------------------------------------------------------
_bound_cache: dict[tuple[str, str], float] = {}


def _bound(text, dim: str) -> float:
    key = (str(text), dim)
    if key not in _bound_cache:
        from .units import to_si

        _bound_cache[key] = to_si(text, dim, "bound")
    return _bound_cache[key]


def _check_range(p: Param, si: float, shown) -> str | None:
    lo = hi = None
    if p.lo is not None:
        lo = _bound(p.lo, p.dim) if p.dim else float(p.lo)
    if p.hi is not None:
        hi = _bound(p.hi, p.dim) if p.dim else float(p.hi)
    low_bad = lo is not None and (si <= lo if p.lo_open else si < lo)
    if low_bad or (hi is not None and si > hi):
        rng = f"between {p.lo} and {p.hi}" if lo is not None and hi is not None else (
            f"{'>' if p.lo_open else '>='} {p.lo}" if lo is not None else f"<= {p.hi}")
        return f"got {shown!r}; expected a value {rng}"
    return None


def _check_value(p: Param, v: Any) -> tuple[Any, str | None]:
    """(clean value, problem or None) for one value of parameter ``p``."""
    k = p.kind
    if k == "text":
        if isinstance(v, bool) or not isinstance(v, (str, int, float)):
            return v, f"got {v!r}; expected text"
        v = str(v)
        if len(v) > 500:
            return v, f"got {len(v)} characters; expected at most 500"
        if p.name == "member" and not MEMBER_RE.match(v):
            return v, (f"got {v!r}; expected a mark of letters, digits, '.', '_' or '-' (at most 48, "
                       "starting with a letter or digit), used as the archive folder name")
        return v, None
    if k == "choice":
        if v not in p.choices:
            return v, f"got {v!r}; expected one of {', '.join(map(repr, p.choices))}"
        return v, None
    if k == "flag":
        if not isinstance(v, bool):
            return v, f"got {v!r}; expected true or false"
        return v, None
    if k in ("number", "integer"):
        if isinstance(v, bool) or not isinstance(v, (int, float)):
            return v, f"got {v!r}; expected a plain number"
        if k == "integer" and not float(v).is_integer():
            return v, f"got {v!r}; expected a whole number"
        if v != v:
            return v, f"got {v!r}; expected a finite number"
        v = int(v) if k == "integer" else float(v)
        return v, _check_range(p, float(v), v)
    if k == "quantity" or (k == "optional_quantity" and v is not None):
        return _check_quantity(p, v)
    if k == "optional_quantity":
        return None, None
    if k in ("quantities", "list", "records"):
        if k == "quantities" and isinstance(v, (str, int, float)) and not isinstance(v, bool):
            v = [v]
        if not isinstance(v, list):
            return v, f"got {v!r}; expected a list"
        if not p.min_items <= len(v) <= p.max_items:
            return v, f"got {len(v)} items; expected {p.min_items} to {p.max_items}"
        out = []
        for i, item in enumerate(v):
            if k == "quantities":
                c, msg = _check_quantity(p, item)
            elif k == "list":
                c, msg = item, (None if item in p.choices else
                                f"got {item!r}; expected one of {', '.join(map(repr, p.choices))}")
            else:
                c, msg = _check_record(p, item)
            if msg:
                return v, f"item {i + 1}: {msg}"
            out.append(c)
        return out, None
    raise ValueError(f"unknown parameter kind {k!r}")  # a declaration bug, not user input


def _check_quantity(p: Param, v: Any) -> tuple[Any, str | None]:
    from .errors import CalckitError
    from .units import DIMS, to_si

    if isinstance(v, bool) or not isinstance(v, (str, int, float)):
        return v, f"got {v!r}; expected {DIMS[p.dim][3]} as text with a unit"
    if isinstance(v, (int, float)) and v != 0:
        return v, f"got the bare number {v!r}; expected {DIMS[p.dim][3]}, with a unit"
    try:
        si = to_si(v, p.dim, p.name, allow_array=False)
    except (CalckitError, ValueError, TypeError) as exc:
        msg = str(exc)
        prefix = f"{p.name}: "
        return v, msg[len(prefix):] if msg.startswith(prefix) else msg
    if si != si or si in (float("inf"), float("-inf")):
        return v, f"got {v!r}; expected a finite value"
    return v, _check_range(p, si, v)


def _check_record(p: Param, item: Any) -> tuple[Any, str | None]:
    if not isinstance(item, dict):
        return item, f"got {item!r}; expected a mapping with keys {', '.join(f.name for f in p.fields)}"
    names = {f.name: f for f in p.fields}
    for key in item:
        if key not in names:
            return item, (f"unknown key {key!r}; expected keys among {', '.join(names)}")
    out = {}
    for f in p.fields:
        if f.name in item:
            c, msg = _check_value(f, item[f.name])
            if msg:
                return item, f"{f.name}: {msg}"
            out[f.name] = c
        else:
            out[f.name] = _copy(f.default)
    return out, None


def validate(calc: str, values: Mapping[str, Any], *, source: str = "<parameters>",
             lines: Mapping[str, int] | None = None, allow_reserved: bool = False,
             notebook_names: Sequence[str] | None = None) -> dict[str, Any]:
    """Check ``values`` against the declaration of ``calc``; return every declared parameter, clean.

    ``source`` names the file in messages and ``lines`` maps a key to its line number there.
    ``notebook_names``, when given, are the parameter names read from the notebook template with
    ``papermill.inspect_notebook``; a key must be declared here *and* be a parameter of the notebook.
    Raises :class:`ParameterError` listing every problem.
    """
    cs = spec(calc)
    lines = lines or {}
    problems: list[tuple[str, str]] = []

    def add(name: str, msg: str):
        ln = lines.get(name)
        where = f"{source}:{ln}" if ln else source
        problems.append((name, f"{where}: {name}: {msg}" if name else f"{where}: {msg}"))

    declared = set(cs.names)
    nb_names = set(notebook_names) if notebook_names is not None else declared
    clean = cs.defaults()
    for key, v in values.items():
        if not is_identifier(key):
            problems.append((str(key), f"{source}{':' + str(lines[key]) if key in lines else ''}: "
                             f"{key!r} is not a parameter name (names are Python identifiers such as "
                             f"span or dead_udl); the file was not run"))
            continue
        if key not in declared or key not in nb_names:
            close = [n for n in cs.names if n.lower() == key.lower() or n.startswith(key[:3])][:3]
            hint = f" (did you mean {', '.join(close)}?)" if close else ""
            add(key, f"not a parameter of calc {calc!r}{hint}")
            continue
        p = cs.param(key)
        if p.reserved and not allow_reserved:
            add(key, "is set by the batch, not by a parameter file")
            continue
        c, msg = _check_value(p, v)
        if msg:
            add(key, msg)
        else:
            clean[key] = c
    for p in cs.params:
        if p.required and p.name not in values:
            add(p.name, f"missing; expected {p.help}")
    if not problems and cs.check is not None:
        for name, msg in cs.check(clean):
            add(name, msg)
    if problems:
        raise ParameterError(source, problems)
    return clean


# ---------------------------------------------------------------------------------------------------
# notebook parameters cell
# ---------------------------------------------------------------------------------------------------
def _literal(v: Any) -> str:
    return repr(v)


def parameters_cell(calc: str) -> str:
    """Source of the notebook's papermill ``parameters`` cell: one ``name = value  # meaning`` a line."""
    cs = spec(calc)
    width = max(len(f"{p.name} = {_literal(p.default)}") for p in cs.params if len(repr(p.default)) < 60)
    out = []
    for p in cs.params:
        left = f"{p.name} = {_literal(p.default)}"
        out.append(f"{left.ljust(width)}  # {p.help}")
    return "\n".join(out)
