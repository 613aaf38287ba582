"""calckit.pick: the search's prepared-once paths give the checks of the design modules' direct calls.

- EN 1993-1-1: ``en1993.demands`` prepared once per member with the self-weight term, then
  ``with_self_weight(w)`` per candidate (calckit.pick.checks.en_check), against ``en1993.check_member``
  called with the candidate's own diagrams (arrays, self-weight included).
- AISC 360-22: ``aisc360.demands`` prepared once, segment moments and panel shears replaced per
  candidate (calckit.pick.checks._aisc_candidate), against ``aisc360.check_member`` with the arrays;
  and the vectorised preparation of every candidate at once (_AiscPlan.prepare) against that loop.
- EN 1993-1-1 energy solution: Shape.combine2 and the memo of Shape.mcr against the general path.
No engineering reference values: these pin the fast paths to the reference calls (the brute-force
searches in tests/test_pick.py compare the outcome with independent scalar checks).
"""
from __future__ import annotations

import numpy as np
import pytest

import calckit
from calckit.design import aisc360, en1993
from calckit.materials import steel
from calckit.pick import member
from calckit.pick.checks import _context, aisc_check, en_check
from calckit.pick.response import Response

REL = 1e-9  # the same quantities evaluated two ways (rounding only)

EN = [
    member("6 m", dead_udl="10 kN/m", live_udl="15 kN/m", standard="EN 1993-1-1", bracing="midspan"),
    member(["6 m", "2 m"], ["pin", "roller", "free"], dead_udl="10 kN/m", live_udl="15 kN/m",
           standard="EN 1993-1-1", bracing="supports"),
    member(["3 m"], ["fixed", "free"], dead_udl="5 kN/m", point_loads=[{"case": "Q", "P": "20 kN", "x": "3 m"}],
           standard="EN 1993-1-1", bracing="supports"),
    member(["5 m", "6 m", "5 m"], ["pin", "roller", "roller", "roller"],
           loads=[{"case": "G", "w": "8 kN/m"}, {"case": "Q", "w": "12 kN/m"}], standard="EN 1993-1-1",
           bracing="supports", bearing_length="100 mm"),
]
AISC = [
    member("35 ft", dead_udl="0.45 kip/ft", live_udl="0.75 kip/ft", bracing="thirds"),
    member(["24 ft", "24 ft"], ["pin", "roller", "roller"], dead_udl="1 kip/ft", live_udl="1.6 kip/ft", method="ASD",
           bracing="midspan"),
    member("10 ft", ["fixed", "free"], dead_udl="0.3 kip/ft", point_loads=[{"case": "L", "P": "6 kip", "x": "10 ft"}],
           grade="A572-50", bracing="supports"),
]


def _demands(m, names):
    st = steel(m.grade)
    secs = [calckit.section(n) for n in names]
    w = np.array([s.si.mass * 9.80665 for s in secs])
    EI = np.array([st.E_si * s.si.Ix for s in secs])
    return secs, Response(m, w_ref=float(np.median(w))).demands(w, EI)


def _same(fast, ref):
    by = {}
    for c in ref.checks:
        by.setdefault(c.limit_state, []).append(c)
    for c in fast.checks:
        if c.limit_state not in by:
            continue
        r = by[c.limit_state].pop(0)
        assert c.ratio == pytest.approx(r.ratio, rel=REL), c.limit_state
        assert c.segment == r.segment and c.location == pytest.approx(r.location)
    assert not any(by.values()), "every check of the direct call has its counterpart"


@pytest.mark.parametrize("i", range(len(EN)))
def test_en_prepared_demands_equal_direct_check(i):
    m = EN[i]
    secs, dem = _demands(m, ["IPE 240", "IPE 330", "HEA 260", "HEB 300"])
    ctx = _context(m)
    for sec, d in zip(secs, dem):
        fast = en_check(m, sec, d, False)
        M, V = d.diagrams()
        from calckit.pick.checks import _en_forces

        ref = en1993.check_member(sec, m.grade, x=d.x, M=M, V=V, restraints=ctx["restraints"],
                                  forces=_en_forces(m, d), annex=m.annex, steps=False)
        _same(fast, ref)
        assert fast.max_ratio >= ref.max_ratio * (1 - REL)  # the fast result adds deflection only
        lt = [c for c in fast.checks if c.limit_state.startswith("Lateral")]
        assert lt and all(c.combination for c in lt)


@pytest.mark.parametrize("i", range(len(AISC)))
def test_aisc_prepared_demands_equal_direct_check(i):
    m = AISC[i]
    secs, dem = _demands(m, ["W12X26", "W16X40", "W18X50", "W21X62"])
    ctx = _context(m)
    for sec, d in zip(secs, dem):
        fast = aisc_check(m, sec, d, False)
        M, V = d.diagrams()
        ref = aisc360.check_member(sec, m.grade, method=m.method, x=d.x, M=M, V=V, supports=ctx["supports"],
                                   bracing=ctx["bracing"], steps=False)
        _same(fast, ref)
        flex = [c for c in fast.checks if c.limit_state.startswith("Flexure")]
        ref_flex = [c for c in ref.checks if c.limit_state.startswith("Flexure")]
        assert max(c.ratio for c in flex) == pytest.approx(max(c.ratio for c in ref_flex), rel=REL)


def test_many_arrangements_fall_back_to_the_exact_envelope():
    """Five spans with two patterned variable cases: 32^2 arrangements per combination exceed what
    calckit.analysis.arrangements enumerates, so the extremes come from calckit.analysis.envelope (exact);
    they equal the envelope of a direct analysis with the same self-weight."""
    from calckit.analysis import Beam
    from calckit.pick.response import MAX_PER_COMBINATION, _exhaustive

    m = member(["4 m"] * 5, ["pin"] + ["roller"] * 5, loads=[{"case": "G", "w": "6 kN/m"}, {"case": "Q", "w": "8 kN/m"},
                                                           {"case": "S", "w": "3 kN/m"}],
               standard="EN 1993-1-1", bracing="supports")
    sec = calckit.section("IPE 240")
    w, EI = sec.si.mass * 9.80665, steel(m.grade).E_si * sec.si.Ix
    r = Response(m, w_ref=w)
    assert not all(_exhaustive(c, r.cases, 5) for c in r.strength) and MAX_PER_COMBINATION < 32 ** 2
    d = r.demands(np.array([w]), np.array([EI]))[0]
    b = Beam(["4 m"] * 5, ["pin"] + ["roller"] * 5, EI=f"{EI} N*m**2")
    b.udl("6 kN/m", "G").udl("8 kN/m", "Q").udl("3 kN/m", "S").udl(f"{w} N/m", "SW")
    env = b.solve().envelope(r.strength)
    for q in ("M", "V"):
        assert getattr(d, f"{q}_max").max() == pytest.approx(max(getattr(s, f"{q}_max").value for s in env.spans),
                                                            rel=2e-3)
        assert getattr(d, f"{q}_min").min() == pytest.approx(min(getattr(s, f"{q}_min").value for s in env.spans),
                                                            rel=2e-3)


# --------------------------------------------------------------------- vectorised preparation (search)
@pytest.mark.parametrize("i", range(len(AISC)))
def test_aisc_prepared_moments_equal_per_candidate_loop(i):
    """_AiscPlan.prepare (numpy over every candidate and diagram at once) gives exactly the segment
    moments, Cb-dominance selection and panel shears of the per-candidate loop of _aisc_candidate."""
    from calckit.pick.checks import _AiscPlan, _aisc_candidate

    m = AISC[i]
    secs, dem = _demands(m, ["W8X10", "W12X26", "W16X40", "W18X50", "W21X62", "W24X84"])
    ctx = _context(m)
    D0, plan = dem[0].response.aisc_demands(ctx["supports"], ctx["bracing"], None, plan=_AiscPlan)
    plan.pre = {}
    loop = [_aisc_candidate(D0, d, plan) for d in dem]
    plan.prepare(dem)
    assert len(plan.pre) == len(dem)
    for d, ref in zip(dem, loop):
        fast = _aisc_candidate(D0, d, plan)
        assert fast.flexure == ref.flexure  # the same floats, items and order
        assert fast.shear == ref.shear
    plan.pre = {}


@pytest.mark.parametrize("m", AISC, ids=["thirds", "two-spans-asd", "cantilever"])
def test_search_with_and_without_vectorised_preparation_agree(m, monkeypatch):
    """The whole search with the checker's prepare hook gives the same candidate records (every ratio,
    governing check, combination and location) as with the hook removed."""
    from calckit.pick import checks

    fast = calckit.pick(m, families=["W"], depth=("150 mm", "600 mm"))
    monkeypatch.delattr(checks.aisc_check, "prepare")
    ref = calckit.pick(m, families=["W"], depth=("150 mm", "600 mm"))
    assert fast.candidates == ref.candidates
    assert (fast.chosen and fast.chosen.name) == (ref.chosen and ref.chosen.name)


def test_shape_combine2_and_memo_equal_the_general_path():
    """mcr.Shape.combine2 (two terms) is combine([...]) with the same arithmetic; the memo of Shape.mcr
    returns the value of a fresh solve; both agree with the dense reference mcr_energy (rounding)."""
    from calckit.design.en1993 import mcr

    xi = mcr._basis(False, False)[0]
    A = mcr.raw_shape(lambda q: 3.0e5 * np.sin(np.pi * q) - 1.0e5 * q, 1.0, 1.0)
    U = mcr.raw_shape(lambda q: 2.0e3 * q * (1 - q), 1.0, 1.0)
    peak = float(np.max(np.abs(3.0e5 * np.sin(np.pi * xi) - 1.0e5 * xi + 37.0 * 2.0e3 * xi * (1 - xi))))
    a, b = 1.0 / peak, 37.0 / peak
    s2 = mcr.Shape.combine2(a, A, b, U)
    sg = mcr.Shape.combine([(a, A), (b, U)])
    assert np.array_equal(s2.C0, sg.C0) and np.array_equal(s2.CtC, sg.CtC)
    args = (5.0, 2.1e11 * 6.0e-6, 8.1e10 * 2.0e-7, 2.1e11 * 1.0e-7)
    v1 = s2.mcr(*args)
    assert s2.mcr(*args) == v1 == sg.mcr(*args)
    assert s2.mcr(*args, zg=0.1) == sg.mcr(*args, zg=0.1)  # a different key: solved, not the memo
    ref = mcr.mcr_energy(*args, M=lambda q: (3.0e5 * np.sin(np.pi * q) - 1.0e5 * q + 37.0 * 2.0e3 * q * (1 - q)),
                         Mmax=peak)
    assert v1 == pytest.approx(ref, rel=1e-10)
