"""The section search: check every catalog section of the chosen families for a member, rank by mass.

Steps (timed separately in :attr:`PickResult.timings`):

1. catalog: ``calckit.sections.catalog(family, depth, mass)`` (InputError for an unknown family or an
   empty filter);
2. analysis: one linear analysis of the member's loads and one of a unit self-weight
   (:class:`calckit.pick.response.Response`);
3. demands: each candidate's own envelope of M and V and its deflections, with its self-weight added as
   a dead (permanent) load, by scaling the unit response (vectorised over all candidates);
4. checks: every check of the standard for each candidate through the design module's numeric path
   (:mod:`calckit.pick.checks`; the same functions, with ``steps=False``, that print the calc sheet);
5. rank: passing candidates by mass per length (ties: shallower first); the lightest is chosen.

A design aid only: the section chosen must be reviewed, and the calculation sealed, by a licensed or
chartered engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import time
from typing import Callable

import numpy as np

from ..errors import InputError
from .member import AISC, Member, member as make_member
from .response import Response
from .result import Candidate, PickResult, depth_band

__all__ = ["pick", "check_one", "DEFAULT_FAMILIES", "G"]

#: standard acceleration of gravity (m/s2) for self-weight, as in calckit.analysis.Beam.self_weight
G = 9.80665
#: families searched when none are given
DEFAULT_FAMILIES = {AISC: ("W",), "EN 1993-1-1": ("IPE", "HEA", "HEB")}
N_CLOSEST = 5


def _mass(sec) -> float:
    tab = getattr(sec, "tabulated", None)
    if tab and "mass" in tab:
        return float(tab["mass"])
    return float(sec.si.mass)


def _candidate(sec, res, w_self: float) -> Candidate:
    """Candidate record from a MemberResult."""
    g = res.governing
    checks = tuple((c.limit_state, float(c.ratio)) for c in res.checks if c.ratio is not None)
    key, band = depth_band(sec.name, getattr(sec, "family", ""), sec.si.d)
    del key
    notes = [n for n in res.notes if n]
    return Candidate(
        name=sec.name, family=getattr(sec, "family", ""), band=band, mass=_mass(sec), depth=sec.si.d,
        passed=bool(res.passed), ratio=float(g.ratio) if g is not None else 0.0,
        governing=g.limit_state if g is not None else "", clause=g.clause if g is not None else "",
        combination=g.combination if g is not None else "", location=g.location if g is not None else None,
        checks=checks, w_self=w_self, note="; ".join(notes[:2]))


def _families(m: Member, families) -> tuple[str, ...]:
    if families is None:
        return DEFAULT_FAMILIES[m.standard]
    from ..sections.catalog import _families as norm

    return norm(families)


def _member(member, kw) -> Member:
    if isinstance(member, Member):
        if kw:
            raise InputError(f"member: got a Member and the member keywords {sorted(kw)}; give one or the other")
        return member
    if member is not None:
        if isinstance(member, dict):
            from .member import member_from_params

            return member_from_params(member)
        raise InputError(f"member: got {member!r}; expected a calckit.pick.Member, a dict of steel beam calc "
                         "parameters, or the member keywords (spans=..., loads...)")
    if "spans" not in kw:
        raise InputError("spans: no value given; expected the span length(s), e.g. spans='35 ft'")
    return make_member(kw.pop("spans"), kw.pop("supports", None), **kw)


def pick(member=None, /, *, families=None, depth=None, mass=None, n_best: int = 10, n_per_span: int = 40,
         checker: Callable | None = None, **member_kw) -> PickResult:
    """The lightest catalog section that passes every check of the member's standard.

    ``member``: a :class:`calckit.pick.Member`, a dict of steel beam calc parameters, or nothing and the
    keywords of :func:`calckit.pick.member` (``spans``, ``supports``, ``dead_udl``, ``live_udl``,
    ``point_loads``, ``loads``, ``standard`` "AISC 360-22" / "EN 1993-1-1", ``method`` "LRFD" / "ASD",
    ``grade``, ``bracing``, ``brace_points``, ``defl_limit_live``, ``defl_limit_total``, ...).
    ``families``: catalog families (default W for AISC 360-22, IPE/HEA/HEB for EN 1993-1-1); ``depth``,
    ``mass``: (min, max) filters as for :func:`calckit.sections.catalog`; ``n_best``: how many of the
    lightest passing sections to list; ``n_per_span``: analysis stations per span; ``checker``:
    replaces the standard's checks (a callable ``(member, section, demands, steps) -> MemberResult``;
    for tests and studies).

    Each candidate is checked with its own self-weight added as a permanent (dead) load. Returns a
    :class:`calckit.pick.PickResult`; when nothing passes, ``chosen`` is None and ``closest`` lists the
    candidates nearest to passing. Raises InputError for bad input (unknown family, empty filter, ...).
    """
    t0 = time.perf_counter()
    m = _member(member, dict(member_kw))
    if not isinstance(n_best, int) or isinstance(n_best, bool) or n_best < 1:
        raise InputError(f"n_best: got {n_best!r}; expected a whole number >= 1")
    fams = _families(m, families)
    from ..materials import steel
    from ..sections import catalog

    secs = catalog(family=fams, depth=depth, mass=mass)
    st = steel(m.grade)
    secs, excluded = _available(secs, st)
    if not secs:
        raise InputError(f"grade: {st.name} covers none of the {len(excluded)} sections selected (all have a plate "
                         "thicker than the grade's largest thickness band); choose another grade or filter")
    t1 = time.perf_counter()
    from .checks import checker_for

    check = checker if checker is not None else checker_for(m)
    w = np.array([s.si.mass * G for s in secs])
    EI = np.array([st.E_si * s.si.Ix for s in secs])
    resp = Response(m, n_per_span=n_per_span, w_ref=float(np.median(w)))
    t2 = time.perf_counter()
    if resp.exact_scaling:
        dem = resp.demands(w, EI)
    else:  # spring supports: moments depend on EI, so analyse each candidate at its own EI
        dem = [Response(m, n_per_span=n_per_span, w_ref=wi, EI=ei).demands(np.array([wi]), np.array([ei]))[0]
               for wi, ei in zip(w, EI)]
    prepare = getattr(check, "prepare", None)
    if prepare is not None:  # the checker's vectorised preparation of every candidate at once
        prepare(m, dem)
    t3 = time.perf_counter()
    cands = [_candidate(s, check(m, s, d, False), float(wi)) for s, d, wi in zip(secs, dem, w)]
    t4 = time.perf_counter()
    cands.sort(key=lambda c: (c.mass, c.depth, c.name))
    passing = [c for c in cands if c.passed]
    chosen = passing[0] if passing else None
    bands: dict[str, Candidate] = {}
    keys: dict[str, float] = {}
    for c in passing:
        if c.band not in bands:
            bands[c.band] = c
            keys[c.band] = depth_band(c.name, c.family, c.depth)[0]
    by_band = tuple(sorted(bands.values(), key=lambda c: (keys[c.band], c.mass)))
    closest = () if passing else tuple(sorted(cands, key=lambda c: (c.ratio, c.mass))[:N_CLOSEST])
    notes = _notes(m, resp, fams)
    if excluded:
        notes += (f"{len(excluded)} sections not checked: a plate is thicker than the largest thickness band of "
                  f"{st.name} ({', '.join(excluded[:6])}{' ...' if len(excluded) > 6 else ''})",)
    t5 = time.perf_counter()
    return PickResult(
        chosen=chosen, lightest=tuple(passing[:n_best]), by_band=by_band, candidates=tuple(cands),
        closest=closest, member=m, standard=m.standard, method=m.method, grade=st.name, families=fams,
        depth=depth, mass=mass, n_checked=len(cands), elapsed=t5 - t0,
        timings={"catalog": t1 - t0, "analysis": t2 - t1, "demands": t3 - t2, "checks": t4 - t3,
                 "rank": t5 - t4},
        notes=notes)


def _available(secs, st):
    """(sections the grade covers, names of those with a plate thicker than its largest band)."""
    tmax = st.bands[-1][0] * (1 + 1e-12)
    ok, out = [], []
    for s in secs:
        p = s.si
        (ok if max(p.tf_top, p.tf_bot, p.tw) <= tmax else out).append(s)
    return ok, [s.name for s in out]


def _notes(m: Member, resp: Response, fams) -> tuple[str, ...]:
    out = []
    if m.self_weight:
        out.append("each candidate's self-weight (its mass x 9.80665 m/s2) is added to the permanent load "
                   "case in its own check")
    if m.bracing == "continuous":
        out.append("compression flange continuously braced (Lb = 0)")
    else:
        out.append(f"compression flange braced at {', '.join(f'{x:.3g} m' for x in m.brace_positions())}")
        out.append(f"lateral-torsional buckling of each unbraced segment ({'Cb' if m.standard == AISC else 'C1'}) "
                   f"under the real moment diagram of each of the {len(resp.A['names'])} strength load "
                   "arrangements that can govern (calckit.analysis.arrangements), never an envelope curve")
    lim = []
    if m.defl_live:
        lim.append(f"live load L/{m.defl_live:g}")
    if m.defl_total:
        lim.append(f"total load L/{m.defl_total:g}")
    out.append("deflection limits: " + (", ".join(lim) if lim else "none")
               + " (cantilever spans: 2 x length / n, common practice)")
    out.append("strength combinations (SW = the candidate's self-weight): " + "; ".join(resp.S["names"]))
    if not resp.exact_scaling:
        out.append("spring supports: each candidate analysed at its own EI")
    out.append("mass per length ranks the candidates (catalog tabulated value)")
    return tuple(out)


def check_one(m: Member, name: str, steps: bool = True, checker: Callable | None = None):
    """Full check (MemberResult) of one catalog section for member ``m``, with its self-weight."""
    from ..materials import steel
    from ..sections import section
    from .checks import checker_for

    sec = section(name)
    st = steel(m.grade)
    w, EI = sec.si.mass * G, st.E_si * sec.si.Ix
    resp = Response(m, w_ref=w, EI=EI)  # analysed at the section's own EI: exact with springs too
    d = resp.demands(np.array([w]), np.array([EI]))[0]
    return (checker or checker_for(m))(m, sec, d, steps)
