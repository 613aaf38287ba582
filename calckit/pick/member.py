"""The member a section is picked for: spans, supports, loads by case, bracing, grade, standard, limits.

:class:`Member` is immutable and holds SI floats (m, N, N/m) and the load records of
:mod:`calckit.analysis.loads`. Build it with :func:`member` from quantities or strings, or with
:func:`member_from_params` from the parameters of the steel beam calc (``calckit.params.STEEL_BEAM``:
``spans``, ``supports``, ``dead_udl``, ``live_udl``, ``roof_live_udl``, ``snow_udl``, ``point_loads``,
``bracing``, ``brace_points``, ``defl_limit_live``, ``defl_limit_total``, ``standard``, ``method``,
``grade``, ``live_category``, ``self_weight``), so a member file of that calc can be searched as it is.

Load cases are named by their load symbol: ASCE 7-22 ``D, L, Lr, S, R, W`` for AISC 360-22; EN 1990
``G`` (or ``D``), ``Q`` (or ``L``; ``Lr`` is an imposed roof load, category H), ``S``, ``W`` for
EN 1993-1-1. The search adds each candidate's self-weight to the permanent load (``D`` / ``G``).

Bracing of the compression flange (the brace points cut the member into unbraced segments, Lb):
``continuous`` (Lb = 0), ``supports`` (braced at the supports only), ``midspan``, ``thirds``,
``quarters`` (braced at the supports and at those points of each span), plus any ``brace_points``.

Deflection limits are span / number; a span with a free end (cantilever or overhang) is checked against
2 x its length / number (common practice: the limit of the equivalent back-span). Defaults: AISC 360-22
L/360 live and L/240 total (common practice; IBC Table 1604.3 floor members, from memory); EN 1993-1-1
the annex set's limits (recommended set: L/300 variable and L/250 total, from memory of EN 1993-1-1
7.2.1 and the UK NA; they are not normative in EN 1993-1-1 itself).

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any, Mapping, Sequence

from ..errors import InputError

__all__ = ["Member", "member", "member_from_params", "STANDARDS", "BRACING", "AISC", "EN"]

AISC = "AISC 360-22"
EN = "EN 1993-1-1"
STANDARDS = (AISC, EN)
BRACING = ("continuous", "supports", "midspan", "thirds", "quarters")
_BRACE_FRACTIONS = {"continuous": (), "supports": (), "midspan": (0.5,), "thirds": (1 / 3, 2 / 3),
                    "quarters": (0.25, 0.5, 0.75)}
#: load symbols per standard (the case names a member may use)
CASE_SYMBOLS = {AISC: ("D", "L", "Lr", "S", "R", "W"), EN: ("G", "D", "Q", "L", "Lr", "S", "W", "T")}
PERMANENT = ("D", "G")
#: name of the internal unit self-weight case
SW_CASE = "SW"
#: keys of the steel beam calc that describe the member (used by member_from_params)
PARAM_KEYS = ("spans", "supports", "dead_udl", "live_udl", "roof_live_udl", "snow_udl", "point_loads",
              "bracing", "brace_points", "defl_limit_live", "defl_limit_total", "standard", "method",
              "grade", "live_category", "self_weight", "bearing_length")


@dataclass(frozen=True)
class Member:
    """A beam to pick a section for (SI floats; see the module docstring for the meaning of each field).

    spans: span lengths (m), left to right; supports: one per span end: "pin", "roller", "fixed",
    "free" or a vertical spring stiffness (N/m, float); loads: load records (PointLoad, LinearLoad,
    Couple of :mod:`calckit.analysis.loads`) with case names; standard: "AISC 360-22" or "EN 1993-1-1";
    method: "LRFD" or "ASD" (AISC) or "EN"; grade: steel grade name; bracing: one of :data:`BRACING`;
    brace_points: extra brace positions (m); defl_live, defl_total: span / number limits (None: no
    check); self_weight: add each candidate's self-weight to the permanent case; live_category:
    EN 1990 imposed-load category A-H; snow: EN 1990 snow site ("H<=1000m", "H>1000m", "nordic");
    annex: EN 1993 national-annex set name; combinations: user strength combinations (None: the code
    combinations of ASCE 7-22 Sec. 2.3.1 / 2.4.1 or EN 1990 Eq. 6.10); bearing: bearing length at
    the supports and under point loads (m; None: the web checks under concentrated forces are not
    made); load_bearings: (x, bearing length) in m of the point loads that bear on a flange (checked
    there); name: member mark; notes: remarks for the record.
    """

    spans: tuple[float, ...]
    supports: tuple
    loads: tuple
    standard: str = AISC
    method: str = "LRFD"
    grade: str = "A992"
    bracing: str = "continuous"
    brace_points: tuple[float, ...] = ()
    defl_live: float | None = 360.0
    defl_total: float | None = 240.0
    self_weight: bool = True
    live_category: str = "B"
    snow: str = "H<=1000m"
    annex: str = "recommended"
    combinations: tuple | None = None
    bearing: float | None = None
    load_bearings: tuple[tuple[float, float], ...] = ()  #: (x, bearing length) of point loads on a flange
    name: str = ""
    notes: tuple[str, ...] = field(default=(), compare=False)

    @property
    def L(self) -> float:
        """Total length (m)."""
        return float(sum(self.spans))

    @property
    def nodes(self) -> tuple[float, ...]:
        """Support positions (m)."""
        out = [0.0]
        for s in self.spans:
            out.append(out[-1] + s)
        return tuple(out)

    @property
    def cases(self) -> list[str]:
        """Load case names in the order first used."""
        seen: list[str] = []
        for ld in self.loads:
            if ld.case not in seen:
                seen.append(ld.case)
        return seen

    def brace_positions(self) -> tuple[float, ...]:
        """Every brace point (m): supports, the bracing pattern's points and ``brace_points``, sorted.

        Empty for continuous bracing. A free end is not a brace point.
        """
        if self.bracing == "continuous":
            return ()
        nodes = self.nodes
        pts = [x for x, s in zip(nodes, self.supports) if not (isinstance(s, str) and s == "free")]
        for i, L in enumerate(self.spans):
            pts += [nodes[i] + f * L for f in _BRACE_FRACTIONS[self.bracing]]
        pts += list(self.brace_points)
        tol = 1e-9 * self.L
        out: list[float] = []
        for x in sorted(pts):
            if not out or x - out[-1] > tol:
                out.append(x)
        return tuple(out)

    def segments(self) -> tuple[tuple[float, float], ...]:
        """Unbraced segments (x0, x1) in m; one segment of length 0 marks continuous bracing."""
        if self.bracing == "continuous":
            return ()
        pts = list(self.brace_positions())
        if not pts or pts[0] > 0:
            pts.insert(0, 0.0)
        if pts[-1] < self.L * (1 - 1e-12):
            pts.append(self.L)
        return tuple((a, b) for a, b in zip(pts[:-1], pts[1:]) if b - a > 1e-9 * self.L)

    def span_is_cantilever(self, i: int) -> bool:
        """True when span i ends at a free support (cantilever or overhang)."""
        a, b = self.supports[i], self.supports[i + 1]
        return any(isinstance(s, str) and s == "free" for s in (a, b))

    def describe(self) -> str:
        """One line for records: spans, supports, loads and bracing."""
        spans = " + ".join(f"{s:.4g} m" for s in self.spans)
        sup = ", ".join(s if isinstance(s, str) else f"spring {s / 1e6:.4g} kN/mm" for s in self.supports)
        loads = "; ".join(ld.describe() for ld in self.loads)
        return (f"spans {spans}; supports {sup}; loads: {loads or 'none'}; bracing {self.bracing}"
                + (f" + points at {', '.join(f'{x:.4g} m' for x in self.brace_points)}" if self.brace_points else ""))


def _standard(standard) -> str:
    key = str(standard).replace(" ", "").replace("-", "").upper()
    if key.startswith("AISC360"):
        return AISC
    if key.startswith("EN19931") or key.startswith("EN1993"):
        return EN
    raise InputError(f"standard: got {standard!r}; expected 'AISC 360-22' or 'EN 1993-1-1'")


def _method(standard: str, method) -> str:
    if standard == EN:
        if method not in (None, "EN", "LRFD", "ASD", ""):
            raise InputError(f"method: got {method!r}; expected 'EN' (EN 1993-1-1 uses partial factors)")
        return "EN"
    m = "LRFD" if method is None else str(method).strip().upper()
    if m not in ("LRFD", "ASD"):
        raise InputError(f"method: got {method!r}; expected 'LRFD' or 'ASD' for AISC 360-22")
    return m


def _limit(v, name: str) -> float | None:
    if v is None or v is False:
        return None
    if isinstance(v, bool) or not isinstance(v, (int, float)) or not 20 <= float(v) <= 5000:
        raise InputError(f"{name}: got {v!r}; expected span / number with a number from 20 to 5000 "
                         "(e.g. 360 for L/360), or None for no check")
    return float(v)


def _load_records(spans, supports, loads: Sequence[Mapping[str, Any]], udls: Mapping[str, Any],
                  point_loads: Sequence[Mapping[str, Any]]):
    """Validate loads through calckit.analysis.Beam (its messages) and return the load records."""
    from ..analysis import Beam

    b = Beam([f"{s!r} m" for s in spans], list(supports), EI="1e8 N*m**2")
    for case, w in udls.items():
        if w is None:
            continue
        from ..units import to_si

        if to_si(w, "line_load", f"{case} udl", allow_array=False) != 0:
            b.udl(w, case)
    for i, pl in enumerate(point_loads or ()):
        if not isinstance(pl, Mapping) or not {"P", "x"} <= set(pl):
            raise InputError(f"point_loads[{i}]: got {pl!r}; expected a mapping with case, P and x")
        b.point(pl["P"], pl["x"], pl.get("case", "D"))
    for i, ld in enumerate(loads or ()):
        if not isinstance(ld, Mapping):
            raise InputError(f"loads[{i}]: got {ld!r}; expected a mapping such as "
                             "{'case': 'D', 'w': '10 kN/m'} or {'case': 'L', 'P': '20 kN', 'x': '3 m'}")
        keys = set(ld)
        case = ld.get("case")
        if case is None:
            raise InputError(f"loads[{i}]: got {ld!r}; expected a 'case' key (e.g. 'D', 'L')")
        if "P" in keys:
            b.point(ld["P"], ld["x"] if "x" in ld else None, case)
        elif "M" in keys:
            b.moment(ld["M"], ld["x"] if "x" in ld else None, case)
        elif "w" in keys:
            b.udl(ld["w"], case, ld.get("start"), ld.get("end"))
        elif "w1" in keys and "w2" in keys:
            b.linear(ld["w1"], ld["w2"], ld.get("start", 0), ld.get("end", f"{b.L} m"), case)
        else:
            raise InputError(f"loads[{i}]: got keys {sorted(keys)}; expected P and x (point load), M and x "
                             "(couple), w [start, end] (uniform) or w1, w2, start, end (linear)")
    return b.loads


def member(spans, supports=None, *, loads: Sequence[Mapping[str, Any]] = (), dead_udl=None, live_udl=None,
           roof_live_udl=None, snow_udl=None, point_loads: Sequence[Mapping[str, Any]] = (),
           standard: str = AISC, method: str | None = None, grade: str | None = None,
           bracing: str = "continuous", brace_points: Sequence = (), defl_limit_live=..., defl_limit_total=...,
           self_weight: bool = True, live_category: str = "B", snow: str = "H<=1000m",
           annex: str = "recommended", combinations=None, bearing_length=None, load_bearings=None,
           name: str = "") -> Member:
    """Build a :class:`Member` from quantities or strings.

    ``spans``: "35 ft" or a list; ``supports``: one per span end (default pin + rollers); loads as
    ``dead_udl`` / ``live_udl`` / ``roof_live_udl`` / ``snow_udl`` (uniform over the whole member, cases
    D, L, Lr, S), ``point_loads`` (``[{case, P, x}]``) and/or ``loads`` (``[{case, w [, start, end]}``,
    ``{case, w1, w2, start, end}``, ``{case, P, x}``, ``{case, M, x}]``). ``defl_limit_*``: number n of
    span / n, None for no check; defaults as in the module docstring. ``combinations``: user strength
    combinations (a list of :class:`calckit.analysis.combinations.Combination` or of mappings for
    :func:`calckit.analysis.combinations.user_combinations`). ``bearing_length``: bearing length at the
    supports and under point loads (a length; enables the web checks under concentrated forces: AISC
    360-22 J10.2/J10.3, EN 1993-1-5 section 6). Raises InputError / UnitsError naming the parameter.
    """
    from ..units import to_si

    std = _standard(standard)
    meth = _method(std, method)
    if isinstance(spans, (str,)) or not isinstance(spans, (list, tuple)):
        spans = [spans]
    L = []
    for i, s in enumerate(spans):
        v = to_si(s, "span", f"spans[{i}]", allow_array=False)
        if not v > 0:
            raise InputError(f"spans[{i}]: got {s!r}; expected a span length > 0")
        L.append(float(v))
    if supports is None:
        supports = ["pin"] + ["roller"] * len(L)
    if not isinstance(supports, (list, tuple)):
        raise InputError(f"supports: got {supports!r}; expected a list with one support per span end")
    if grade is None:
        grade = "A992" if std == AISC else "S355"
    from ..materials import steel

    st = steel(grade)
    if std == EN and st.standard != "EN":
        raise InputError(f"grade: got {grade!r} ({st.standard}); expected an EN grade (S235 ... S460) for "
                         "EN 1993-1-1")
    if bracing not in BRACING:
        raise InputError(f"bracing: got {bracing!r}; expected one of {', '.join(BRACING)}")
    udls = {"D": dead_udl, "L": live_udl, "Lr": roof_live_udl, "S": snow_udl}
    records = _load_records(L, supports, loads, udls, point_loads)
    if not records and not self_weight:
        raise InputError("loads: got none and self_weight=False; expected at least one load")
    allowed = CASE_SYMBOLS[std]
    for ld in records:
        if ld.case not in allowed:
            raise InputError(f"loads: case {ld.case!r}; expected a load symbol of {std} "
                             f"({', '.join(allowed)}) as the case name")
    total = sum(L)
    bp = []
    for i, x in enumerate(brace_points or ()):
        v = to_si(x, "length", f"brace_points[{i}]", allow_array=False)
        if not 0 <= v <= total * (1 + 1e-9):
            raise InputError(f"brace_points[{i}]: got {x!r}; expected a position from 0 to {total:.6g} m")
        bp.append(min(float(v), total))
    # supports as stored: kind strings or spring stiffness floats (Beam's parsing)
    from ..analysis.loads import parse_support

    nodes = [0.0]
    for s in L:
        nodes.append(nodes[-1] + s)
    sup = []
    for i, s in enumerate(supports):
        rec = parse_support(s, i, nodes[i])
        sup.append(rec.k if rec.kind == "spring" else rec.kind)
    if defl_limit_live is ... or defl_limit_total is ...:
        if std == AISC:
            dl, dt = 360.0, 240.0
        else:
            from ..design.en1993.factors import annex_set

            a = annex_set(annex)
            dl, dt = float(a.deflection_variable), float(a.deflection_total)
        defl_limit_live = dl if defl_limit_live is ... else defl_limit_live
        defl_limit_total = dt if defl_limit_total is ... else defl_limit_total
    combos = None
    if combinations is not None:
        from ..analysis.combinations import Combination, user_combinations

        items = list(combinations)
        if items and all(isinstance(c, Combination) for c in items):
            combos = tuple(items)
        else:
            combos = tuple(user_combinations(items))
        if not combos:
            raise InputError("combinations: got an empty list; expected at least one combination, or None")
    brg = None
    if bearing_length is not None:
        brg = to_si(bearing_length, "length", "bearing_length", allow_array=False)
        if not brg >= 0:
            raise InputError(f"bearing_length: got {bearing_length!r}; expected a length >= 0")
    from ..analysis.loads import PointLoad

    if load_bearings is None:  # a bearing length alone applies under every point load too
        pts = sorted({ld.x for ld in records if isinstance(ld, PointLoad) and ld.P > 0}) if brg is not None else []
        lbs = tuple((x, brg) for x in pts)
    else:
        lbs = []
        for i, item in enumerate(load_bearings):
            try:
                xq, lq = item
            except (TypeError, ValueError):
                raise InputError(f"load_bearings[{i}]: got {item!r}; expected (x, bearing length)") from None
            xs = to_si(xq, "length", f"load_bearings[{i}].x", allow_array=False)
            ls = to_si(lq, "length", f"load_bearings[{i}].bearing", allow_array=False)
            if not (0 <= xs <= sum(L) and ls >= 0):
                raise InputError(f"load_bearings[{i}]: got {item!r}; expected a position on the beam and a "
                                 "length >= 0")
            lbs.append((xs, ls))
        merged: dict[float, float] = {}  # loads at one position (a D and an L record): the longest bearing
        for xs, ls in lbs:
            key = next((k for k in merged if abs(k - xs) <= 1e-9 * max(sum(L), 1.0)), xs)
            merged[key] = max(merged.get(key, 0.0), ls)
        lbs = tuple(sorted(merged.items()))
    return Member(spans=tuple(L), supports=tuple(sup), loads=tuple(records), standard=std, method=meth,
                  grade=st.name, bracing=bracing, brace_points=tuple(bp),
                  defl_live=_limit(defl_limit_live, "defl_limit_live"),
                  defl_total=_limit(defl_limit_total, "defl_limit_total"), self_weight=bool(self_weight),
                  live_category=str(live_category), snow=str(snow), annex=str(annex), combinations=combos,
                  bearing=brg, load_bearings=lbs, name=str(name))


def member_from_params(params: Mapping[str, Any]) -> Member:
    """A :class:`Member` from steel beam calc parameters (keys of :data:`PARAM_KEYS`; others ignored).

    Missing keys take the calc's declared defaults (``calckit.params.STEEL_BEAM``).
    """
    from ..params import STEEL_BEAM

    if not isinstance(params, Mapping):
        raise InputError(f"params: got {params!r}; expected a mapping of steel beam calc parameters")
    v = STEEL_BEAM.defaults()
    v.update({k: params[k] for k in params if k in PARAM_KEYS or k == "member"})
    std = _standard(v["standard"])
    limits = {}
    for key in ("defl_limit_live", "defl_limit_total"):
        limits[key] = params[key] if key in params else ...
    return member(
        v["spans"], v["supports"], dead_udl=v["dead_udl"], live_udl=v["live_udl"],
        roof_live_udl=v["roof_live_udl"], snow_udl=v["snow_udl"], point_loads=v["point_loads"],
        standard=std, method=v["method"] if std == AISC else "EN", grade=v["grade"], bracing=v["bracing"],
        brace_points=v["brace_points"], self_weight=v["self_weight"], live_category=v["live_category"],
        bearing_length=v.get("bearing_length"),
        load_bearings=[(pl["x"], pl["bearing"]) for pl in v["point_loads"] or ()
                       if isinstance(pl, Mapping) and pl.get("bearing") is not None],
        name=str(v.get("member", "")), **limits,
    )
