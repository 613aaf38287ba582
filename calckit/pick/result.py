"""Result records of the section search: one :class:`Candidate` per section checked and the
:class:`PickResult` of a search (every field described).

Mass per length is the ranking key: the handbook value where the catalog tabulates one (W shapes: the
nominal weight in lb/ft converted to kg/m; IPE/HE: the tabulated kg/m), else the section's computed mass.
"""
from __future__ import annotations

import re
from dataclasses import dataclass, field
from typing import Any

from ..errors import InputError

__all__ = ["Candidate", "PickResult", "depth_band"]

_W = re.compile(r"^W(\d+(?:\.\d+)?)X")
_EU = re.compile(r"^(IPE|HEA|HEB|HEM)(\d+)$")


def depth_band(name: str, family: str, d: float) -> tuple[float, str]:
    """(sort key, label) of the depth band of a catalog section.

    W shapes: the nominal depth group ("W18" for W18X50). IPE / HE: the nominal size, shared by the
    families ("size 300" holds IPE 300, HE 300 A and HE 300 B, whose heights are 300, 290 and 300 mm).
    Other sections: 50 mm bands of the overall depth.
    """
    m = _W.match(name)
    if m:
        v = float(m.group(1))
        return v * 0.0254, f"W{m.group(1)}"
    m = _EU.match(name)
    if m:
        v = int(m.group(2))
        return v * 1e-3, f"size {v}"
    lo = int(d * 1e3 // 50) * 50
    return lo * 1e-3, f"d {lo}-{lo + 50} mm"


@dataclass(frozen=True)
class Candidate:
    """One section checked for the member (numbers SI).

    name: designation ("W18X50"); family: "W", "IPE", "HEA", "HEB" or "" for other sections;
    band: depth band label (:func:`depth_band`); mass: mass per length used for ranking (kg/m);
    depth: overall depth d (m); passed: every check passed; ratio: governing (largest) demand /
    capacity ratio; governing: limit state of the governing check ("Flexure: yielding", "Deflection,
    live load", ...); clause: its clause; combination: its governing load combination; location: where
    along the member (m), if known; checks: (limit state, ratio) of every check, in calc order;
    w_self: the self-weight included in its own check (N/m); note: remark (e.g. a check not covered).
    """

    name: str
    family: str
    band: str
    mass: float
    depth: float
    passed: bool
    ratio: float
    governing: str
    clause: str = ""
    combination: str = ""
    location: float | None = None
    checks: tuple[tuple[str, float], ...] = ()
    w_self: float = 0.0
    note: str = ""

    @property
    def status(self) -> str:
        return "OK" if self.passed else "NOT OK"

    def ratio_of(self, limit_state: str) -> float:
        """The ratio of the check whose limit state starts with ``limit_state`` (largest if several)."""
        vals = [r for n, r in self.checks if n.startswith(limit_state)]
        if not vals:
            raise InputError(f"limit_state: got {limit_state!r}; expected one of {[n for n, _ in self.checks]}")
        return max(vals)


@dataclass(frozen=True)
class PickResult:
    """Outcome of :func:`calckit.pick`.

    chosen: the lightest passing candidate, or None when no section passes;
    lightest: the ``n_best`` lightest passing candidates, lightest first;
    by_band: the lightest passing candidate of each depth band, shallow band first;
    candidates: every candidate checked, lightest first (ties: shallower first);
    closest: when nothing passes, the five candidates with the smallest governing ratios (else empty);
    member: the :class:`calckit.pick.Member` searched; standard, method, grade: as used;
    families: the families searched; depth, mass: the filters as given (None: no filter);
    n_checked: number of sections checked; elapsed: wall time of the search (s), with ``timings``
    per stage (s: "catalog", "analysis", "demands", "checks", "rank"); notes: assumptions and remarks
    for the record.
    """

    chosen: Candidate | None
    lightest: tuple[Candidate, ...]
    by_band: tuple[Candidate, ...]
    candidates: tuple[Candidate, ...]
    closest: tuple[Candidate, ...]
    member: Any
    standard: str
    method: str
    grade: str
    families: tuple[str, ...]
    depth: Any = None
    mass: Any = None
    n_checked: int = 0
    elapsed: float = 0.0
    timings: dict = field(default_factory=dict)
    notes: tuple[str, ...] = ()

    @property
    def found(self) -> bool:
        """True when at least one section passes every check."""
        return self.chosen is not None

    @property
    def section(self):
        """The chosen catalog section (an IShape), or None."""
        if self.chosen is None:
            return None
        from ..sections import section

        return section(self.chosen.name)

    def candidate(self, name: str) -> Candidate:
        """The candidate called ``name`` (catalog spelling rules apply: "w18x50" finds W18X50)."""
        from ..sections.catalog import normalize_name

        key = normalize_name(name)
        for c in self.candidates:
            if c.name == key:
                return c
        raise InputError(f"name: got {name!r}; expected a section among the {len(self.candidates)} checked")

    def neighbours(self) -> tuple[Candidate | None, Candidate | None]:
        """(next lighter candidate, which fails; next heavier passing candidate) around the chosen one."""
        if self.chosen is None:
            return None, None
        cs = list(self.candidates)
        i = cs.index(self.chosen)
        lighter = cs[i - 1] if i > 0 else None
        heavier = next((c for c in cs[i + 1:] if c.passed), None)
        return lighter, heavier

    def member_result(self, name: str | None = None, steps: bool = True):
        """The full member check of candidate ``name`` (default: the chosen one), with calc-sheet steps.

        Runs the same checks as the search, for one section, through the design module's steps path.
        """
        from .search import check_one

        if name is None:
            if self.chosen is None:
                raise InputError("name: no section passed; give the name of a candidate to check")
            name = self.chosen.name
        return check_one(self.member, self.candidate(name).name, steps=steps)

    def summary(self) -> str:
        """One line: what was chosen (or that nothing passed)."""
        if self.chosen is None:
            best = self.closest[0] if self.closest else None
            tail = f"; closest {best.name} at ratio {best.ratio:.2f} ({best.governing})" if best else ""
            return f"no section passes among {self.n_checked} checked{tail}"
        c = self.chosen
        us = self.standard.startswith("AISC")
        mass = f"{c.mass / (0.45359237 / 0.3048):.1f} lb/ft" if us else f"{c.mass:.1f} kg/m"
        return (f"{c.name} ({mass}), governing {c.governing} at ratio {c.ratio:.2f}; "
                f"{len(self.lightest)} lightest passing listed, {self.n_checked} sections checked")
