"""Load combinations: code combinations generated for the load cases present, and user combinations.

:func:`combinations` expands the published combinations of a standard for a set of load cases;
:func:`user_combinations` validates combinations written in a parameter file. Both return a list of
:class:`Combination` (name, factor per case, kind, reference, the variable cases). The factor tables
are data files (``calckit/data/combinations_asce7.yaml``, ``combinations_en1990.yaml``) whose headers
document their grammar and cite source, edition and table; they are read on first use.

References
----------
[1] ASCE/SEI 7-22, Minimum Design Loads and Associated Criteria for Buildings and Other Structures,
    Sec. 2.3.1 (strength design) and Sec. 2.4.1 (allowable stress design); factors from memory.
[2] EN 1990:2002+A1:2005, Eurocode - Basis of structural design, 6.4.3.2 Eq. (6.10), (6.10a),
    (6.10b); 6.5.3 Eq. (6.14b), (6.15b), (6.16b); Annex A1 Tables A1.1, A1.2(B), A1.4; recommended
    values, from memory.
[3] Deflection cases (live only, total D + L): common practice for limits such as L/360 and L/240.

A design aid only: the combinations used must be reviewed by a licensed or chartered engineer, who
seals the calculation; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import itertools
import math
import re
from dataclasses import dataclass, field
from functools import lru_cache
from numbers import Real
from pathlib import Path
from typing import Any, Iterable, Mapping

from calckit.errors import CalckitError, InputError

__all__ = [
    "Combination", "combinations", "user_combinations", "psi_factors", "partial_factors",
    "KINDS", "STANDARDS",
]

#: Values of :attr:`Combination.kind`.
KINDS = ("strength", "allowable", "characteristic", "frequent", "quasi-permanent", "deflection", "user")

#: Standards understood by :func:`combinations` (other spellings such as "ASCE/SEI 7-22" or
#: "EN 1990:2002+A1:2005" are accepted too).
STANDARDS = ("ASCE 7-22", "EN 1990")

_DATA = Path(__file__).resolve().parent.parent / "data"
_FILES = {"ASCE 7-22": "combinations_asce7.yaml", "EN 1990": "combinations_en1990.yaml"}
_ALIASES = {
    "asce7-22": "ASCE 7-22", "asce/sei7-22": "ASCE 7-22", "asce722": "ASCE 7-22",
    "en1990": "EN 1990", "en1990:2002": "EN 1990", "en1990:2002+a1:2005": "EN 1990",
    "en1990:2002+a1": "EN 1990", "eurocode0": "EN 1990",
}
_PERMANENT_NAMES = {"D", "G"}  # user combinations: permanent unless said otherwise
_NAME_TOKEN = re.compile(r"[A-Za-z][A-Za-z0-9_]*")


class _Factors(dict):
    """A read-only dict of case -> factor (hashable, picklable, works with dataclasses.asdict and json)."""

    __slots__ = ()

    def _read_only(self, *args, **kwargs):
        raise TypeError("Combination.factors is read-only; build a new Combination instead")

    __setitem__ = __delitem__ = clear = pop = popitem = setdefault = update = __ior__ = _read_only

    def __hash__(self):  # type: ignore[override]
        return hash(frozenset(self.items()))

    def __reduce__(self):
        return (type(self), (dict(self),))

    def __copy__(self):
        return self

    def __deepcopy__(self, memo):
        return self


def _fmt(f: float) -> str:
    return f"{round(f, 6):g}"


@dataclass(frozen=True)
class Combination:
    """One load combination: sum over cases of factor x case.

    Fields:
        name: unique, readable name with the equation number, e.g. "LRFD 2: 1.2D + 1.6L + 0.5Lr".
        factors: load case name -> load factor (read-only dict; insertion order = display order).
        kind: one of :data:`KINDS` ("strength", "allowable", "characteristic", "frequent",
            "quasi-permanent", "deflection", "user").
        reference: standard, edition and section / equation / table the combination comes from.
        variable: the cases that are variable actions: a solver may omit them where favourable or
            pattern them span by span; the other cases (permanent) act everywhere with their factor.
    """

    name: str
    factors: dict[str, float]
    kind: str = "user"
    reference: str = ""
    variable: frozenset[str] = field(default_factory=frozenset)

    def __post_init__(self):
        if not isinstance(self.name, str) or not self.name.strip():
            raise InputError(f"name: got {self.name!r}; expected a non-empty string")
        where = f"combination {self.name!r}"
        if not isinstance(self.factors, Mapping):
            raise InputError(f"{where}: factors: got {self.factors!r}; expected a mapping case -> factor")
        clean = {}
        for case, f in self.factors.items():
            if not isinstance(case, str) or not case.strip():
                raise InputError(f"{where}: case name: got {case!r}; expected a non-empty string")
            if isinstance(f, bool) or not isinstance(f, Real) or not math.isfinite(f):
                raise InputError(f"{where}: factor on {case!r}: got {f!r}; expected a finite number")
            clean[case] = float(f)
        if self.kind not in KINDS:
            raise InputError(f"{where}: kind: got {self.kind!r}; expected one of {', '.join(KINDS)}")
        if not isinstance(self.reference, str):
            raise InputError(f"{where}: reference: got {self.reference!r}; expected a string")
        if isinstance(self.variable, str):
            raise InputError(f"{where}: variable: got {self.variable!r}; expected a set of case names")
        variable = frozenset(self.variable)
        extra = sorted(variable - clean.keys())
        if extra:
            raise InputError(
                f"{where}: variable: got {extra}, not cases of this combination; expected a subset of {sorted(clean)}"
            )
        object.__setattr__(self, "factors", _Factors(clean))
        object.__setattr__(self, "variable", variable)

    def __hash__(self):
        return hash((self.name, self.factors, self.kind, self.reference, self.variable))

    def __reduce__(self):
        return (type(self), (self.name, dict(self.factors), self.kind, self.reference, self.variable))

    @property
    def permanent(self) -> frozenset[str]:
        """The cases of this combination that are not variable."""
        return frozenset(self.factors) - self.variable

    def label(self) -> str:
        """The combination as text, e.g. "1.2D + 1.6L + 0.5S" (factor 1 not written, zero terms left out)."""
        parts = []
        for case, f in self.factors.items():
            if f == 0.0:
                continue
            token = case if _NAME_TOKEN.fullmatch(case) else f"({case})"
            mag = abs(f)
            text = token if mag == 1.0 else f"{_fmt(mag)}{token}"
            if not parts:
                parts.append(text if f > 0 else f"-{text}")
            else:
                parts.append(f"{'+' if f > 0 else '-'} {text}")
        return " ".join(parts) if parts else "0"


# ----------------------------------------------------------------------------------------------------
# data files


@lru_cache(maxsize=None)
def _table(standard: str) -> dict:
    """Load (once) and check the data file of a standard."""
    import yaml

    path = _DATA / _FILES[standard]
    with open(path, encoding="utf-8") as fh:
        data = yaml.safe_load(fh)
    if standard == "ASCE 7-22":
        symbols = set(data["symbols"])
        for kind, s in data["sets"].items():
            for c in s["combinations"]:
                c["terms"] = _parse_expr(c["expr"], symbols, path)
                c["requires"] = [_split_or(r, symbols, path) for r in c.get("requires", [])]
    return data


def _split_or(text: str, symbols: set, path) -> list[str]:
    out = [t.strip() for t in str(text).split(" or ")]
    for t in out:
        if t not in symbols:
            raise CalckitError(f"{path}: unknown load symbol {t!r} in {text!r}")
    return out


_TERM_GROUP = re.compile(r"(\d+(?:\.\d+)?)?\s*\((.*)\)")
_TERM_ALT = re.compile(r"(\d+(?:\.\d+)?)?\s*([A-Za-z][A-Za-z0-9_]*)")


def _parse_expr(expr: str, symbols: set, path) -> list[list[tuple[float, str]]]:
    """Parse "1.2D + 1.6(Lr or S or R) + (L or 0.5W)" into groups of (factor, symbol) alternatives."""
    groups = []
    for term in expr.split(" + "):
        term = term.strip()
        m = _TERM_GROUP.fullmatch(term)
        outer, alts = (float(m[1] or 1.0), m[2].split(" or ")) if m else (1.0, [term])
        group = []
        for alt in alts:
            a = _TERM_ALT.fullmatch(alt.strip())
            if a is None or a[2] not in symbols:
                raise CalckitError(f"{path}: cannot read term {alt!r} of {expr!r}")
            group.append((round(outer * float(a[1] or 1.0), 10), a[2]))
        groups.append(group)
    return groups


# ----------------------------------------------------------------------------------------------------
# helpers


def _standard(standard) -> str:
    key = re.sub(r"\s+", "", str(standard)).lower()
    if standard in STANDARDS:
        return standard
    if key in _ALIASES:
        return _ALIASES[key]
    raise InputError(f"standard: got {standard!r}; expected one of {', '.join(map(repr, STANDARDS))}")


def _case_list(cases) -> list[tuple[str, Any]]:
    """(name, declared symbol or None) in a stable order (sets are sorted by name)."""
    if isinstance(cases, str) or not isinstance(cases, Iterable):
        raise InputError(f"cases: got {cases!r}; expected a collection of load case names, e.g. {{'D', 'L'}}")
    if isinstance(cases, Mapping):
        items = list(cases.items())
    else:
        names = list(cases)
        if isinstance(cases, (set, frozenset)):
            names = sorted(names, key=str)
        items = [(n, None) for n in names]
    if not items:
        raise InputError("cases: got no load case; expected at least one case name such as 'D'")
    seen = set()
    for name, _ in items:
        if not isinstance(name, str) or not name.strip():
            raise InputError(f"cases: got case name {name!r}; expected a non-empty string")
        if name in seen:
            raise InputError(f"cases: case {name!r} is given twice; expected each case once")
        seen.add(name)
    return items


def _check_options(options: Mapping, known: tuple, standard: str) -> None:
    unknown = sorted(set(options) - set(known))
    if unknown:
        raise InputError(
            f"options: got {', '.join(unknown)}; not used for {standard} (known options: {', '.join(known)})"
        )


def _kind(kind, allowed: Iterable[str], standard: str) -> str:
    allowed = tuple(allowed)
    if kind not in allowed:
        raise InputError(f"kind: got {kind!r}; expected one of {', '.join(allowed)} for {standard}")
    return kind


def _dedupe(combos: list[Combination]) -> list[Combination]:
    """Drop combinations whose factors repeat an earlier one (zero factors ignored); keep the first."""
    seen, out = set(), []
    for c in combos:
        key = frozenset((k, v) for k, v in c.factors.items() if v != 0.0)
        if key not in seen:
            seen.add(key)
            out.append(c)
    return out


def combinations(standard: str, cases, kind: str = "strength", **options) -> list[Combination]:
    """The code combinations of ``standard`` for the load cases ``cases``.

    Args:
        standard: "ASCE 7-22" [1] or "EN 1990" [2] (see :data:`STANDARDS`).
        cases: the load case names, e.g. ``{"D", "L", "S", "W"}``; or a mapping case name -> load
            symbol for names that are not symbols, e.g. ``{"D": "D", "SDL": "D", "L": "L"}`` (cases
            sharing a symbol take the same factor). Symbols: ASCE 7-22 D, L, Lr, S, R, W; EN 1990
            G (permanent), Q (imposed), S (snow), W (wind), T (temperature), with D, L and Lr
            (imposed, category H roofs) accepted as names.
        kind: ASCE 7-22: "strength" (LRFD, Sec. 2.3.1), "allowable" (ASD, Sec. 2.4.1), "deflection"
            (common practice: dead, live only, total D + L, roof, roof total, at factor 1.0).
            EN 1990: "strength" (6.10 or 6.10a/6.10b), "characteristic" (6.14b), "frequent" (6.15b),
            "quasi-permanent" (6.16b).
        **options: ASCE 7-22: ``live_05=True`` uses Sec. 2.3.1 Exception 1 (factor 0.5 on L in
            combinations 3 and 4 where Lo <= 100 psf, not garages or places of public assembly).
            EN 1990: ``equation`` "6.10" (default) or "6.10ab"; ``category`` imposed-load category
            A-H for every imposed case, or ``categories={"L": "B", "L2": "E"}`` per case (Lr is H);
            ``snow`` "H<=1000m", "H>1000m" or "nordic" (Finland, Iceland, Norway, Sweden), required
            when a snow case is present; ``annex`` named set of national choices (default
            "recommended"); ``gamma={"G_sup": .., "G_inf": .., "Q": .., "xi": ..}`` and
            ``psi={case or row: (psi0, psi1, psi2)}`` override values of that set;
            ``favourable_permanent`` (default True) adds the variants with gamma_G,inf.

    Returns:
        The combinations in the order of the standard, "or" alternatives expanded for the cases
        present, combinations without their principal load left out, exact duplicates removed.

    Raises:
        InputError: unknown standard, kind, option, case symbol, category, snow site or annex.
    """
    std = _standard(standard)
    if std == "ASCE 7-22":
        return _asce(cases, kind, options)
    return _en1990(cases, kind, options)


# ----------------------------------------------------------------------------------------------------
# ASCE 7-22


def _asce(cases, kind: str, options: dict) -> list[Combination]:
    data = _table("ASCE 7-22")
    _check_options(options, ("live_05",), "ASCE 7-22")
    live_05 = options.get("live_05", False)
    if not isinstance(live_05, bool):
        raise InputError(f"live_05: got {live_05!r}; expected True or False")
    kind = _kind(kind, data["sets"], "ASCE 7-22")
    symbols = list(data["symbols"])
    by_lower = {s.lower(): s for s in symbols}
    pairs = []
    for name, sym in _case_list(cases):
        given = name if sym is None else sym
        found = by_lower.get(str(given).lower())
        if found is None:
            raise InputError(
                f"cases: case {name!r} has load symbol {given!r}; expected one of {', '.join(symbols)} "
                f"for ASCE 7-22 (give a mapping such as {{{name!r}: 'D'}} to say which load a case is)"
            )
        pairs.append((name, found))
    present = {s for _, s in pairs}
    permanent = set(data["permanent"])
    spec = data["sets"][kind]
    out = []
    for c in spec["combinations"]:
        if not all(any(s in present for s in cond) for cond in c["requires"]):
            continue
        choices = [[a for a in group if a[1] in present] for group in c["terms"]]
        exception = live_05 and c.get("live_05", False)
        for pick in itertools.product(*[g for g in choices if g]):
            by_symbol = {s: f for f, s in pick}  # in the order printed in the standard
            if exception and "L" in by_symbol:
                by_symbol["L"] = 0.5
            factors = {n: f for s, f in by_symbol.items() for n, s2 in pairs if s2 == s}
            variable = frozenset(n for n, s in pairs if s in by_symbol and s not in permanent)
            ref = spec["reference"] + spec["cite"].format(eq=c["eq"])
            if exception and "L" in by_symbol:
                ref += " with Exception 1 (0.5L)"
            label = Combination("tmp", factors).label()
            out.append(Combination(f"{spec['prefix']} {c['eq']}: {label}", factors, kind, ref, variable))
    return _dedupe(out)


# ----------------------------------------------------------------------------------------------------
# EN 1990

_EN_OPTIONS = ("equation", "category", "categories", "snow", "annex", "gamma", "psi", "favourable_permanent")
_EN_KINDS = {"strength": None, "characteristic": "6.14b", "frequent": "6.15b", "quasi-permanent": "6.16b"}
_GAMMA_KEYS = ("G_sup", "G_inf", "Q", "xi")


def _annex(data: dict, annex) -> dict:
    known = data["annexes"]
    if not isinstance(annex, str) or annex not in known:
        raise InputError(f"annex: got {annex!r}; expected one of {', '.join(map(repr, known))}")
    return known[annex]


def partial_factors(annex: str = "recommended") -> dict[str, float]:
    """gamma_G,sup, gamma_G,inf, gamma_Q and xi of a named set: EN 1990:2002+A1:2005 Table A1.2(B) [2].

    Returns a new dict with keys "G_sup", "G_inf", "Q", "xi".
    """
    return {k: float(v) for k, v in _annex(_table("EN 1990"), annex)["gamma"].items()}


def psi_factors(row: str, annex: str = "recommended") -> tuple[float, float, float]:
    """(psi_0, psi_1, psi_2) of one row of EN 1990:2002+A1:2005 Table A1.1 [2].

    ``row``: an imposed-load category "A".."H", "snow_nordic", "snow_above_1000m", "snow_up_to_1000m",
    "wind" or "temperature".
    """
    table = _annex(_table("EN 1990"), annex)["psi"]
    if row not in table:
        raise InputError(f"row: got {row!r}; expected one of {', '.join(table)}")
    return tuple(float(v) for v in table[row])  # type: ignore[return-value]


def _en_classify(data: dict, psi_rows: Mapping, cases, options: dict) -> list[tuple[str, str, str | None]]:
    """(case, action, psi row) for each case, permanent first, then in the order given."""
    items = _case_list(cases)
    names = {n for n, _ in items}
    actions, aliases = data["actions"], data["aliases"]
    categories = options.get("categories", {}) or {}
    if not isinstance(categories, Mapping):
        raise InputError(f"categories: got {categories!r}; expected a mapping case -> category, such as {{'L': 'B'}}")
    unknown = sorted(set(categories) - names)
    if unknown:
        raise InputError(f"categories: got cases {unknown}, not in cases; expected some of {sorted(names)}")
    cat_rows = [r for r in psi_rows if len(r) == 1]

    def category(name, value):
        cat = str(value).strip().upper()
        if cat not in cat_rows:
            raise InputError(
                f"category of {name!r}: got {value!r}; expected one of {', '.join(cat_rows)} "
                "(EN 1990 Table A1.1 / EN 1991-1-1 Table 6.1: A residential, B offices, C congregation, "
                "D shopping, E storage, F traffic <= 30 kN, G traffic 30-160 kN, H roofs)"
            )
        return cat

    out = []
    for name, sym in items:
        given = name if sym is None else sym
        if str(given) in actions:
            action, cat = str(given), None
        elif str(given) in aliases:
            action, cat = aliases[str(given)]
        elif name in categories and sym is None:
            action, cat = "Q", None
        else:
            raise InputError(
                f"cases: case {name!r} has action symbol {given!r}; expected one of {', '.join(actions)} "
                f"(or {', '.join(aliases)}) for EN 1990 (give a mapping such as {{{name!r}: 'Q'}}, or list an "
                "imposed case in categories=)"
            )
        how = actions[action]
        if name in categories:
            if how != "category":
                raise InputError(f"categories: case {name!r} is a {how} action; expected imposed (Q) cases")
            cat = category(name, categories[name])
        if how == "permanent":
            row = None
        elif how == "category":
            if cat is None:
                if options.get("category") is None:
                    raise InputError(
                        f"category: case {name!r} is an imposed load without a category; expected "
                        f"category='A'..'H' or categories={{{name!r}: 'B'}} (EN 1990 Table A1.1)"
                    )
                cat = category(name, options["category"])
            row = cat
        elif how == "snow":
            site = options.get("snow")
            key = re.sub(r"\s+", "", str(site)).lower()
            if key not in data["snow_sites"]:
                raise InputError(
                    f"snow: got {site!r} for snow case {name!r}; expected one of 'H<=1000m', 'H>1000m', "
                    "'nordic' (Finland, Iceland, Norway, Sweden), EN 1990 Table A1.1"
                )
            row = data["snow_sites"][key]
        else:
            row = how
        out.append((name, action, row))
    out.sort(key=lambda t: t[1] != "G")
    return out


def _number(value, what: str, lo: float, hi: float) -> float:
    if isinstance(value, bool) or not isinstance(value, Real) or not (lo <= value <= hi):
        raise InputError(f"{what}: got {value!r}; expected a number from {lo} to {hi}")
    return float(value)


def _en1990(cases, kind: str, options: dict) -> list[Combination]:
    data = _table("EN 1990")
    _check_options(options, _EN_OPTIONS, "EN 1990")
    kind = _kind(kind, _EN_KINDS, "EN 1990")
    annex_name = options.get("annex", "recommended")
    annex = _annex(data, annex_name)
    gamma = {k: float(v) for k, v in annex["gamma"].items()}
    notes = []
    g_over = options.get("gamma") or {}
    if not isinstance(g_over, Mapping):
        raise InputError(f"gamma: got {g_over!r}; expected a mapping such as {{'G_sup': 1.35}}")
    for k, v in g_over.items():
        if k not in _GAMMA_KEYS:
            raise InputError(f"gamma: got key {k!r}; expected some of {', '.join(_GAMMA_KEYS)}")
        gamma[k] = _number(v, f"gamma[{k!r}]", 0.0, 1.0 if k == "xi" else 10.0)
    if g_over:
        notes.append("gamma " + ", ".join(f"{k} = {_fmt(gamma[k])}" for k in g_over))

    psi_table = annex["psi"]
    actions = _en_classify(data, psi_table, cases, options)
    given_psi = options.get("psi") or {}
    if not isinstance(given_psi, Mapping):
        raise InputError(f"psi: got {given_psi!r}; expected a mapping such as {{'W': (0.5, 0.2, 0.0)}}")
    names, psi_over = {n for n, _, _ in actions}, {}
    for k, v in given_psi.items():
        if k not in names and k not in psi_table:
            raise InputError(f"psi: got key {k!r}; expected a case ({', '.join(sorted(names))}) or a row "
                             f"({', '.join(psi_table)})")
        vals = () if isinstance(v, (str, bytes)) or not isinstance(v, Iterable) else tuple(v)
        if len(vals) != 3:
            raise InputError(f"psi[{k!r}]: got {v!r}; expected three numbers (psi0, psi1, psi2)")
        psi_over[k] = tuple(_number(x, f"psi[{k!r}][{i}]", 0.0, 1.0) for i, x in enumerate(vals))
    if psi_over:
        notes.append("psi of " + ", ".join(map(str, psi_over)))

    def psi(name, row):
        vals = psi_over.get(name, psi_over.get(row, psi_table[row]))
        return {f"psi{i}": float(x) for i, x in enumerate(vals)}

    fav = options.get("favourable_permanent", True)
    if not isinstance(fav, bool):
        raise InputError(f"favourable_permanent: got {fav!r}; expected True or False")
    if kind == "strength":
        eq_opt = options.get("equation", "6.10")
        if eq_opt not in data["equation_sets"]:
            raise InputError(f"equation: got {eq_opt!r}; expected one of "
                             f"{', '.join(map(repr, data['equation_sets']))} (EN 1990 6.4.3.2(3), A1.3.1(4))")
        eqs = data["equation_sets"][eq_opt]
    else:
        eqs = [_EN_KINDS[kind]]

    perm = [n for n, a, _ in actions if a == "G"]
    var = [(n, r) for n, a, r in actions if a != "G"]
    tables = "Table A1.2(B) and Table A1.1" if kind == "strength" else "Table A1.4 and Table A1.1"
    source = f"{annex_name} values" + (f"; user values: {'; '.join(notes)}" if notes else "")
    out = []
    for eq in eqs:
        tpl = data["equations"][eq]
        variants = tpl["permanent"] if (fav and perm and var) else tpl["permanent"][:1]
        leads = [n for n, _ in var] if (tpl["per_leading"] and var) else [None]
        ref = f"{data['citation']} Eq. ({eq}); {tables}, {source}"
        for vi, pexpr in enumerate(variants):
            for lead in leads:
                factors = dict.fromkeys(perm, _product(pexpr, gamma, {}))
                if lead is not None:
                    factors[lead] = _product(tpl["leading"], gamma, psi(lead, dict(var)[lead]))
                for n, r in var:
                    if n != lead:
                        factors[n] = _product(tpl["accompanying"], gamma, psi(n, r))
                factors = {n: f for n, f in factors.items() if f != 0.0}
                if not factors:
                    continue
                variable = frozenset(n for n, _ in var if n in factors)
                title = tpl["prefix"] + (f", {lead} leading" if lead else "") + (", permanent favourable" * vi)
                label = Combination("tmp", factors).label()
                out.append(Combination(f"{title}: {label}", factors, tpl["kind"], ref, variable))
    return _dedupe(out)


def _product(expr: str, gamma: Mapping[str, float], psi: Mapping[str, float]) -> float:
    """Evaluate a factor template such as "Q psi0" or "xi G_sup" (see the data file header)."""
    value = 1.0
    for tok in str(expr).split():
        value *= gamma[tok] if tok in gamma else psi[tok] if tok in psi else float(tok)
    return round(value, 10)


# ----------------------------------------------------------------------------------------------------
# user combinations

_USER_KEYS = ("name", "factors", "kind", "reference", "variable")


def user_combinations(spec, cases=None) -> list[Combination]:
    """Combinations written in a parameter file, validated.

    Args:
        spec: a list of mappings ``{"name": "C1", "factors": {"D": 1.2, "L": 1.6}, "kind": "strength",
            "reference": "project spec 4.2", "variable": ["L"]}``; ``kind`` defaults to "user",
            ``reference`` to "user-defined combination", ``variable`` to every case except those
            that are permanent (named D or G, or mapped to D or G when ``cases`` is a mapping).
        cases: the load cases of the model (names, or a mapping name -> symbol as in
            :func:`combinations`); when given, every case named in a combination must be one of them.

    Raises:
        InputError: naming the combination (and case) for a missing or unknown key, an unknown
            case, a non-numeric factor, an unknown kind or a repeated name.
    """
    if isinstance(spec, (str, bytes, Mapping)) or not isinstance(spec, Iterable):
        raise InputError(f"spec: got {spec!r}; expected a list of combinations {{name: ..., factors: {{...}}}}")
    known = None
    permanent = set(_PERMANENT_NAMES)
    if cases is not None:
        items = _case_list(cases)
        known = [n for n, _ in items]
        if isinstance(cases, Mapping):
            permanent = {n for n, s in items if str(s if s is not None else n).upper() in _PERMANENT_NAMES}
    out, names = [], set()
    for i, entry in enumerate(spec):
        if not isinstance(entry, Mapping):
            raise InputError(f"spec[{i}]: got {entry!r}; expected a mapping with keys name and factors")
        name = entry.get("name")
        if not isinstance(name, str) or not name.strip():
            raise InputError(f"spec[{i}]: name: got {name!r}; expected a non-empty string")
        where = f"user combination {name!r}"
        extra = sorted(set(map(str, entry)) - set(_USER_KEYS))
        if extra:
            raise InputError(f"{where}: got keys {extra}; expected only {', '.join(_USER_KEYS)}")
        if name in names:
            raise InputError(f"{where}: the name is used twice; expected unique names")
        names.add(name)
        factors = entry.get("factors")
        if not isinstance(factors, Mapping) or not factors:
            raise InputError(f"{where}: factors: got {factors!r}; expected a mapping such as {{D: 1.2, L: 1.6}}")
        for case in factors:
            if known is not None and case not in known:
                raise InputError(f"{where}: case {case!r} is not a load case; expected one of {', '.join(known)}")
        variable = entry.get("variable")
        if variable is None:
            variable = [c for c in factors if c not in permanent]
        elif isinstance(variable, str) or not isinstance(variable, Iterable):
            raise InputError(f"{where}: variable: got {variable!r}; expected a list of case names")
        # Combination checks the factors (numbers), the kind and the reference, naming the combination
        out.append(Combination(name, dict(factors), entry.get("kind", "user"),
                               entry.get("reference", "user-defined combination"), frozenset(variable)))
    return out
