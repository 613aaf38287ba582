"""calckit.design.en1993: the fast numeric paths give the values of the reference paths.

- mcr.Shape (cached diagram-dependent energy matrices; N x N reduction for z_g = z_j = 0) against the
  dense reference solve mcr.mcr_energy (one 2N x 2N eigenproblem per call): REL_FAST = 1e-9.
- check_member with demands= (prepared once) against check_member with the arrays, and against a run in
  which every segment's factors come from the reference solve (monkeypatched).
- _result.rated against CheckResult.with_demand; mcr.eigvalsh against numpy.linalg.eigvalsh.
No engineering reference values here: these tests pin the fast paths to the reference computations.
"""
from __future__ import annotations

import math

import numpy as np
import pytest

import calckit
from calckit.design import en1993
from calckit.design.en1993 import mcr as mcr_mod
from calckit.design.en1993._result import ENResult, rated
from calckit.design.en1993.ltb import Diagram
from calckit.design.en1993.mcr import equivalent_factors, standard_diagram
from calckit.errors import InputError

REL_FAST = 1e-9
ABS_C23 = 1e-9  # C2, C3 are differences of energy solutions: compared absolutely (they are O(0.1 - 1))
E, G = 210e9, 210e9 / 2.6
SECTIONS = ("IPE 200", "IPE 330", "IPE 600", "HEA 300", "HEB 500")
DIAGRAMS = ("uniform", "udl", "point", ("linear", 0.5), ("linear", -1.0))


def _fn(d):
    return standard_diagram(*d) if isinstance(d, tuple) else standard_diagram(d)


@pytest.mark.parametrize("name", SECTIONS)
@pytest.mark.parametrize("k", [1.0, 0.5])
def test_shape_factors_equal_reference_solve(name, k):
    si = calckit.section(name).si
    for d in DIAGRAMS:
        for zg, zj in ((0.0, 0.0), (0.2, 0.0), (-0.15, 0.0), (0.0, 0.04), (0.1, -0.03)):
            for L in (2.5, 7.0):
                fast = equivalent_factors(L, E * si.Iy, G * si.J, E * si.Cw, _fn(d), zg=zg, zj=zj, k=k, kw=k)
                ref = equivalent_factors(L, E * si.Iy, G * si.J, E * si.Cw, _fn(d), zg=zg, zj=zj, k=k, kw=k,
                                         fast=False)
                assert fast.C1 == pytest.approx(ref.C1, rel=REL_FAST)
                assert fast.Mcr_energy == pytest.approx(ref.Mcr_energy, rel=REL_FAST)
                assert fast.C2 == pytest.approx(ref.C2, abs=ABS_C23)
                assert fast.C3 == pytest.approx(ref.C3, abs=ABS_C23)


def test_shape_cache_reused_and_bounded():
    fn = standard_diagram("udl")
    a, _ = mcr_mod.shape(fn, 1.0, 1.0, 1.0)
    b, _ = mcr_mod.shape(fn, 1.0, 1.0, 1.0)
    assert a is b
    c, _ = mcr_mod.shape(fn, 0.5, 0.5, 1.0)
    assert c is not a  # other end conditions, other basis
    assert len(mcr_mod._SHAPES) <= mcr_mod._SHAPES_MAX


def test_eigvalsh_matches_numpy():
    rng = np.random.default_rng(7)
    for n in (3, 8, 16):
        a = rng.normal(size=(n, n))
        a = a + a.T
        assert np.allclose(mcr_mod.eigvalsh(a), np.linalg.eigvalsh(a), rtol=1e-13, atol=1e-13)


def test_rated_equals_with_demand():
    base = dict(limit_state="x", clause="c", dim="moment", capacity=2.0e5, method="EN", data={"a": 1})
    for dem in (1.0e5, -3.0e5, 2.0e5 * (1 + 5e-10), 0.0):
        assert rated(dem, **base) == ENResult(**base).with_demand(dem)
    zero = dict(base, capacity=0.0)
    assert rated(1.0, **zero) == ENResult(**zero).with_demand(1.0)
    assert rated(None, **base) == ENResult(**base)


def _members():
    L, w = 8.0, 30e3
    x = np.linspace(0.0, L, 81)
    M, V = w * x * (L - x) / 2, w * (L / 2 - x)
    yield dict(x=x, M=M, V=V, zg=0.2, restraints=[0, 2, 4, 6, 8])
    yield dict(x=x, M=M, V=V, zg=-0.1)
    # two-span envelope with hogging
    b = calckit.Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="40000 kN*m**2")
    b.udl("20 kN/m", "D")
    yield dict(analysis=b.solve()["D"], restraints=[0, 3, 6, 9, 12], zg=0.1)


def _values(res):
    return [(c.limit_state, c.capacity, c.demand, c.data.get("Mcr"), c.data.get("C1")) for c in res.checks]


def _same(a, b, rel):
    assert len(a) == len(b)
    for u, v in zip(a, b):
        assert u[0] == v[0]
        for p, q in zip(u[1:], v[1:]):
            if p is None or q is None:
                assert p is q
            else:
                assert p == pytest.approx(q, rel=rel)


@pytest.mark.parametrize("name", ["IPE 300", "HEA 300"])
def test_check_member_fast_equals_reference(name, monkeypatch):
    sec = calckit.section(name)
    runs = []
    for kw in _members():
        D = en1993.demands(**kw)
        fast = en1993.check_member(sec, "S355", demands=D, method="rolled", steps=False)
        arrays = en1993.check_member(sec, "S355", method="rolled", steps=False, **kw)
        _same(_values(fast), _values(arrays), 0.0)  # same numbers, bit for bit
        runs.append((kw, _values(fast)))

    def reference(self, L, EIz, GIt, EIw, zg=0.0, zj=0.0, k=1.0, kw=1.0):
        return equivalent_factors(L, EIz, GIt, EIw, self.fn, zg=zg, zj=zj, k=k, kw=kw, Mmax=self.Mmax, fast=False)

    monkeypatch.setattr(Diagram, "factors", reference)
    for kw, vals in runs:
        ref = en1993.check_member(sec, "S355", method="rolled", steps=False, **kw)
        _same(vals, _values(ref), REL_FAST)


def test_demands_reused_and_exclusive():
    L, w = 6.0, 20e3
    x = np.linspace(0.0, L, 61)
    M, V = w * x * (L - x) / 2, w * (L / 2 - x)
    D = en1993.demands(x=x, M=M, V=V, zg=0.15, deflections={"SLS": ("total", 0.01)})
    M[:] = 0.0  # the demands keep their own copy
    r1 = en1993.check_member(calckit.section("IPE 300"), "S275", demands=D, steps=False)
    assert r1.governing.demand > 0 and math.isclose(max(c.demand for c in r1.checks if c.limit_state == "Bending"),
                                                    w * L ** 2 / 8, rel_tol=1e-9)
    with pytest.raises(InputError, match="demands"):
        en1993.check_member(calckit.section("IPE 300"), "S275", demands=D, x=x, M=M)
    with pytest.raises(InputError, match="demands"):
        en1993.check_member(calckit.section("IPE 300"), "S275", demands=D, zg=0.1)
    with pytest.raises(InputError, match="demands"):
        en1993.check_member(calckit.section("IPE 300"), "S275", demands={"x": x})
    with pytest.raises(ValueError):
        D.x[0] = 1.0  # read-only arrays
