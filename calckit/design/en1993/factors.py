"""Partial factors and nationally determined parameters (NDPs) of EN 1993-1-1 / EN 1993-1-5 as named sets.

The sets live in ``calckit/data/en1993_annex_sets.yaml`` (its header documents the fields and cites the
sources). ``annex_set("recommended")`` returns the EN recommended values; ``annex_set("UK")`` the UK
National Annex values as remembered (check them against the NA); ``annex_set({...})`` a user set from a
parameter file: a dict of the same fields, optionally with ``base`` (default "recommended") and ``name``.
Every check states in its ``data["annex"]`` which set was used.
"""
from __future__ import annotations

from dataclasses import dataclass, fields, replace
from functools import lru_cache
from pathlib import Path
from typing import Any, Mapping

from ...errors import InputError

__all__ = ["AnnexSet", "annex_set", "known_sets"]

_DATA = Path(__file__).resolve().parents[2] / "data" / "en1993_annex_sets.yaml"
_CURVES = ("a0", "a", "b", "c", "d")


@dataclass(frozen=True)
class AnnexSet:
    """One set of partial factors and national choices (fields: see the data file's header)."""

    name: str  #: set name ("recommended", "UK", or the user's)
    title: str  #: text for the calc header
    source: str  #: where the values come from
    gamma_M0: float = 1.0  #: EN 1993-1-1 6.1(1)
    gamma_M1: float = 1.0  #: EN 1993-1-1 6.1(1)
    gamma_M2: float = 1.25  #: EN 1993-1-1 6.1(1)
    gamma_M2_welds: float = 1.25  #: EN 1993-1-8 2.2 Table 2.1 (welds; a National Annex may differ from 1-1's)
    eta: float = 1.2  #: EN 1993-1-5 5.1(2), for grades up to S460
    ltb_method: str = "general"  #: "general" (6.3.2.2) or "rolled" (6.3.2.3)
    lambda_LT_0: float = 0.4  #: 6.3.2.3(1), rolled sections
    beta: float = 0.75  #: 6.3.2.3(1), rolled sections
    lambda_LT_0_welded: float = 0.4  #: 6.3.2.3(1), equivalent welded sections
    beta_welded: float = 0.75  #: 6.3.2.3(1), equivalent welded sections
    ltb_f: bool = False  #: 6.3.2.3(2): apply chi_LT,mod = chi_LT / f
    kc_rule: str = "table6.6"  #: "table6.6" or "1/sqrt(C1)"
    curves_general: tuple = ("a", "b", "c", "d")  #: Table 6.4
    curves_rolled: tuple = ("b", "c", "c", "d")  #: Table 6.5
    deflection_total: float = 250.0  #: span / limit, total deflection
    deflection_variable: float = 300.0  #: span / limit, variable actions
    deflection_source: str = ""  #: source of the deflection limits

    def describe(self) -> str:
        return (f"{self.name}: {self.title}; gamma_M0 = {self.gamma_M0:g}, gamma_M1 = {self.gamma_M1:g}, "
                f"gamma_M2 = {self.gamma_M2:g}, eta = {self.eta:g}, LTB {self.ltb_method}")


_FIELDS = {f.name: f for f in fields(AnnexSet)}


def _check(name: str, s: AnnexSet) -> AnnexSet:
    for k in ("gamma_M0", "gamma_M1", "gamma_M2", "gamma_M2_welds"):
        v = getattr(s, k)
        if not (isinstance(v, (int, float)) and 0.5 <= v <= 2.0):
            raise InputError(f"annex {name!r} {k}: got {v!r}; expected a partial factor between 0.5 and 2.0")
    if not (isinstance(s.eta, (int, float)) and 1.0 <= s.eta <= 1.2):
        raise InputError(f"annex {name!r} eta: got {s.eta!r}; expected 1.0 <= eta <= 1.2 (EN 1993-1-5 5.1(2))")
    if s.ltb_method not in ("general", "rolled"):
        raise InputError(f"annex {name!r} ltb_method: got {s.ltb_method!r}; expected 'general' or 'rolled'")
    if s.kc_rule not in ("table6.6", "1/sqrt(C1)"):
        raise InputError(f"annex {name!r} kc_rule: got {s.kc_rule!r}; expected 'table6.6' or '1/sqrt(C1)'")
    for k in ("lambda_LT_0", "lambda_LT_0_welded"):
        v = getattr(s, k)
        if not (isinstance(v, (int, float)) and 0.0 <= v <= 0.4 + 1e-12):
            raise InputError(f"annex {name!r} {k}: got {v!r}; expected 0 <= lambda_LT,0 <= 0.4 "
                             "(EN 1993-1-1 6.3.2.3(1))")
    for k in ("beta", "beta_welded"):
        v = getattr(s, k)
        if not (isinstance(v, (int, float)) and 0.75 - 1e-12 <= v <= 1.0):
            raise InputError(f"annex {name!r} {k}: got {v!r}; expected 0.75 <= beta <= 1.0 "
                             "(EN 1993-1-1 6.3.2.3(1))")
    for k in ("curves_general", "curves_rolled"):
        v = getattr(s, k)
        if len(v) != 4 or any(c not in _CURVES for c in v):
            raise InputError(f"annex {name!r} {k}: got {v!r}; expected four curve letters from {_CURVES}")
    for k in ("deflection_total", "deflection_variable"):
        v = getattr(s, k)
        if not (isinstance(v, (int, float)) and v > 0):
            raise InputError(f"annex {name!r} {k}: got {v!r}; expected span/limit divisor > 0, e.g. 250")
    return s


def _build(name: str, raw: Mapping[str, Any], sets: Mapping[str, AnnexSet]) -> AnnexSet:
    raw = dict(raw)
    base_name = raw.pop("base", "recommended" if name != "recommended" else None)
    raw.pop("name", None)
    unknown = [k for k in raw if k not in _FIELDS]
    if unknown:
        raise InputError(f"annex {name!r}: got the field {unknown[0]!r}; expected fields from "
                         f"{', '.join(k for k in _FIELDS if k != 'name')}")
    for k in ("curves_general", "curves_rolled"):
        if k in raw:
            raw[k] = tuple(raw[k])
    if base_name is None:
        return _check(name, AnnexSet(name=name, **raw))
    if base_name not in sets:
        raise InputError(f"annex {name!r} base: got {base_name!r}; expected one of {', '.join(sets)}")
    return _check(name, replace(sets[base_name], name=name, **raw))


@lru_cache(maxsize=1)
def _load() -> dict[str, AnnexSet]:
    import yaml

    with _DATA.open() as fh:
        data = yaml.safe_load(fh)
    out: dict[str, AnnexSet] = {}
    for name in data:  # the file lists a base before the sets that use it
        out[name] = _build(name, data[name], out)
    return out


def known_sets() -> list[str]:
    """Names of the annex sets in the data file."""
    return list(_load())


def annex_set(annex: "str | Mapping[str, Any] | AnnexSet | None" = None) -> AnnexSet:
    """The :class:`AnnexSet` named ``annex`` (default "recommended"), or built from a user dict.

    Unknown names raise :class:`~calckit.errors.InputError` listing the known ones.
    """
    if annex is None:
        annex = "recommended"
    if isinstance(annex, AnnexSet):
        return annex
    sets = _load()
    if isinstance(annex, str):
        s = sets.get(annex)
        if s is None:
            low = {k.lower(): v for k, v in sets.items()}
            s = low.get(annex.strip().lower())
        if s is None:
            raise InputError(f"annex: got {annex!r}; expected a known national-annex set "
                             f"({', '.join(sets)}) or a dict of values")
        return s
    if isinstance(annex, Mapping):
        name = str(annex.get("name", "user"))
        raw = dict(annex)
        raw.setdefault("title", f"user set {name!r}")
        raw.setdefault("source", "user input (parameter file)")
        return _build(name, raw, sets)
    raise InputError(f"annex: got {annex!r}; expected a set name ({', '.join(sets)}) or a dict of values")
