"""Tests of calckit.analysis.envelope: pattern loading and envelopes over combinations.

The reference for pattern loading is brute force: for every on/off arrangement of the patterned
case's spans, a separate beam is built with the loads on the loaded spans only and solved; the
envelope must equal the worst arrangement at every station (ACI 318-19 6.4.3 / ASCE 7-22 4.3.3 /
EN 1991-1-1 6.2.1 ask for the adverse arrangement; clause numbers from memory).
"""
from __future__ import annotations

import itertools
from dataclasses import dataclass

import numpy as np
import pytest

from calckit import Beam
from calckit.errors import InputError

TOL = 1e-9
EI = "3e4 kN*m**2"
SPANS = [1.5, 5.0, 6.0, 4.0]
SUPPORTS = ["free", "pin", "roller", "roller", "roller"]
NODES = np.concatenate(([0.0], np.cumsum(SPANS)))


@dataclass(frozen=True)
class Combo:
    name: str
    factors: dict
    pattern: frozenset = frozenset()


def live_loads():
    # (kind, value, a, b): a partial udl crossing supports, a point load, a linear load
    return [("udl", 12.0, 3.0, 14.0), ("P", 30.0, 9.5, None), ("lin", 2.0, 13.0, 16.5, 8.0), ("udl", 5.0, 0.0, 16.5)]


def make_beam(on_spans=None):
    """Beam with D everywhere and L on ``on_spans`` only (all spans when None)."""
    b = Beam([f"{s} m" for s in SPANS], SUPPORTS, EI=EI)
    b.udl("9 kN/m", "D").point("15 kN", "4 m", "D")
    spans = range(len(SPANS)) if on_spans is None else on_spans
    for ld in live_loads():
        for i in spans:
            lo, hi = NODES[i], NODES[i + 1]
            if ld[0] == "P":
                if lo <= ld[2] < hi:
                    b.point(f"{ld[1]} kN", f"{ld[2]} m", "L")
                continue
            a, e = max(ld[2], lo), min(ld[3], hi)
            if e - a <= 1e-12:
                continue
            if ld[0] == "udl":
                b.udl(f"{ld[1]} kN/m", "L", start=f"{a} m", end=f"{e} m")
            else:
                w = lambda x: ld[1] + (ld[4] - ld[1]) * (x - ld[2]) / (ld[3] - ld[2])  # noqa: E731
                b.linear(f"{w(a)} kN/m", f"{w(e)} kN/m", f"{a} m", f"{e} m", "L")
    if on_spans is not None and not b.cases.count("L"):
        b.point("0 kN", "1 m", "L")  # keeps the case present when no span is loaded
    return b


def brute_force(f_d, f_l, xs, quantity):
    """max and min over the 2^n arrangements of L (each beam solved separately) at positions xs."""
    hi = np.full(xs.shape, -np.inf)
    lo = np.full(xs.shape, np.inf)
    n = len(SPANS)
    for pat in itertools.product([0, 1], repeat=n):
        b = make_beam([i for i in range(n) if pat[i]])
        r = b.solve().combine({"D": f_d, "L": f_l})
        v = getattr(r, quantity)(xs)
        hi, lo = np.maximum(hi, v), np.minimum(lo, v)
    return hi, lo


@pytest.fixture(scope="module")
def sol():
    return make_beam().solve()


COMBOS = [Combo("1.4D", {"D": 1.4}), Combo("1.2D + 1.6L", {"D": 1.2, "L": 1.6}, frozenset({"L"}))]


@pytest.fixture(scope="module")
def env(sol):
    return sol.envelope(COMBOS)


def interior(env, sol):
    """Stations that are not grid nodes (where shear has no left/right ambiguity)."""
    g = sol.grid.x
    d = np.min(np.abs(env.x[:, None] - g[None, :]), axis=1)
    return d > 1e-9


@pytest.mark.parametrize("q, attr", [("M", "M_si"), ("defl", "deflection_si"), ("V", "V_si")])
def test_pattern_envelope_equals_brute_force(sol, q, attr):
    e1 = sol.envelope([COMBOS[1]])
    mask = interior(e1, sol)
    xs = e1.x[mask]
    hi, lo = brute_force(1.2, 1.6, xs, attr)
    scale = np.max(np.abs(hi)) + np.max(np.abs(lo))
    assert np.max(np.abs(getattr(e1, f"{q}_max")[mask] - hi)) <= TOL * scale
    assert np.max(np.abs(getattr(e1, f"{q}_min")[mask] - lo)) <= TOL * scale


def test_enumerate_method_equals_sum(sol):
    a = sol.envelope(COMBOS, pattern_method="sum")
    b = sol.envelope(COMBOS, pattern_method="enumerate")
    for q in ("V", "M", "defl"):
        for w in ("max", "min"):
            assert np.allclose(getattr(a, f"{q}_{w}"), getattr(b, f"{q}_{w}"), rtol=1e-12, atol=1e-9)
    assert np.allclose(a.R_max, b.R_max) and np.allclose(a.R_min, b.R_min)


def test_unpatterned_combination_equals_combine(sol, env):
    r = sol.combine({"D": 1.4})
    e = sol.envelope([COMBOS[0]])
    mask = interior(e, sol)
    assert np.allclose(e.M_max[mask], r.M_si(e.x[mask]), rtol=1e-12, atol=1e-6)
    assert np.allclose(e.M_min, e.M_max)
    off = sol.envelope([COMBOS[1]], pattern=False)
    r2 = sol.combine({"D": 1.2, "L": 1.6})
    assert np.allclose(off.M_max[mask], r2.M_si(off.x[mask]), rtol=1e-12, atol=1e-6)
    assert off.patterned == {"1.2D + 1.6L": frozenset()}


def test_governing_combination_named_per_station(sol, env):
    a = sol.envelope([COMBOS[0]])
    b = sol.envelope([COMBOS[1]])
    for q in ("M", "V", "defl"):
        hi = np.maximum(getattr(a, f"{q}_max"), getattr(b, f"{q}_max"))
        assert np.allclose(getattr(env, f"{q}_max"), hi)
        by = getattr(env, f"{q}_max_by")
        expect = np.where(getattr(b, f"{q}_max") > getattr(a, f"{q}_max"), 1, 0)
        clear = np.abs(getattr(b, f"{q}_max") - getattr(a, f"{q}_max")) > 1e-6 * np.max(np.abs(hi))
        assert np.array_equal(by[clear], expect[clear])
    i = int(np.argmax(env.M_max))
    assert env.governing("M", "max", i) in ("1.4D", "1.2D + 1.6L")


def test_per_span_extremes_match_brute_force_exact_extrema(sol, env):
    best_hi = [-np.inf] * len(SPANS)
    best_lo = [np.inf] * len(SPANS)
    n = len(SPANS)
    for pat in itertools.product([0, 1], repeat=n):
        r = make_beam([i for i in range(n) if pat[i]]).solve().combine({"D": 1.2, "L": 1.6})
        for s in range(n):
            e = r.extrema(span=s)
            best_hi[s] = max(best_hi[s], e.M_max.value)
            best_lo[s] = min(best_lo[s], e.M_min.value)
    r14 = sol.combine({"D": 1.4})
    for s in range(n):
        e = r14.extrema(span=s)
        best_hi[s] = max(best_hi[s], e.M_max.value)
        best_lo[s] = min(best_lo[s], e.M_min.value)
        sp = env.spans[s]
        scale = max(abs(best_hi[s]), abs(best_lo[s]))
        assert sp.M_max.value == pytest.approx(best_hi[s], rel=1e-9, abs=TOL * scale)
        assert sp.M_min.value == pytest.approx(best_lo[s], rel=1e-9, abs=TOL * scale)
        assert NODES[s] - 1e-9 <= sp.M_max.x <= NODES[s + 1] + 1e-9


def test_per_span_extreme_reports_loaded_spans(env):
    # the largest sagging moment in span 2 (x 6.5-12.5 m) comes from L on spans 2 (and 4), not 1 or 3
    sp = env.spans[2]
    assert sp.M_max.combination == "1.2D + 1.6L"
    assert 2 in sp.M_max.loaded["L"] and 1 not in sp.M_max.loaded["L"] and 3 not in sp.M_max.loaded["L"]
    assert env.overall("M", "max").value == max(s.M_max.value for s in env.spans)


def test_reaction_envelope_equals_brute_force(env):
    n = len(SPANS)
    hi = np.full(n + 1, -np.inf)
    lo = np.full(n + 1, np.inf)
    for pat in itertools.product([0, 1], repeat=n):
        sol = make_beam([i for i in range(n) if pat[i]]).solve()
        for f in ({"D": 1.4}, {"D": 1.2, "L": 1.6}):
            R = sol.combine(f).R
            hi, lo = np.maximum(hi, R), np.minimum(lo, R)
    assert np.allclose(env.R_max, hi, rtol=1e-10, atol=1e-6)
    assert np.allclose(env.R_min, lo, rtol=1e-10, atol=1e-6)


def test_combination_dataclass_from_combinations_module(sol):
    comb = pytest.importorskip("calckit.analysis.combinations")
    combos = comb.combinations("ASCE 7-22", {"D", "L"}, kind="strength")
    env = sol.envelope(combos)
    assert len(env.combinations) == len(combos)
    assert any("L" in p for p in env.patterned.values())  # .variable drives the patterning
    e2 = sol.envelope([COMBOS[1]])
    assert env.spans[2].M_max.value >= e2.spans[2].M_max.value - 1e-6


def test_missing_cases(sol):
    c = Combo("1.2D + 1.6S", {"D": 1.2, "S": 1.6}, frozenset({"S"}))
    e = sol.envelope([c])
    assert e.absent_cases == ("S",)
    with pytest.raises(InputError, match="'S'"):
        sol.envelope([c], missing="error")


def test_envelope_input_errors(sol):
    with pytest.raises(InputError, match="combinations"):
        sol.envelope([])
    with pytest.raises(InputError, match=r"combinations\[0\]"):
        sol.envelope([object()])
    with pytest.raises(InputError, match="pattern_method"):
        sol.envelope(COMBOS, pattern_method="guess")
    b = Beam(["2 m"] * 9, ["pin"] + ["roller"] * 9, EI=EI).udl("1 kN/m", "L")
    with pytest.raises(InputError, match="at most 8 spans"):
        b.envelope([Combo("L", {"L": 1.0}, frozenset({"L"}))], pattern_method="enumerate")
    # any number of spans with the (exact) sum method
    e = b.envelope([Combo("L", {"L": 1.0}, frozenset({"L"}))])
    assert e.M_min.min() < 0 < e.M_max.max()


def test_stations_include_nodes_on_both_sides(env, sol):
    for xn in sol.grid.x[1:-1]:
        assert np.sum(np.abs(env.x - xn) < 1e-12) >= 2
    assert np.all(np.diff(env.x) >= 0)
    assert "pattern loading" in env.method
