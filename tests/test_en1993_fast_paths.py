"""calckit.design.en1993: the fast numeric paths give the values of the reference paths.

- mcr.Shape (cached diagram-dependent energy matrices; N x N reduction for z_g = z_j = 0) against the
  dense reference solve mcr.mcr_energy (one 2N x 2N eigenproblem per call): REL_FAST = 1e-9.
- check_member with demands= (prepared once) against check_member with the arrays, and against a run in
  which every segment's factors come from the reference solve (monkeypatched).
- _result.rated against CheckResult.with_demand; mcr.eigvalsh against numpy.linalg.eigvalsh.
- the section search's paths (second half of the file), bit for bit: check_member as calckit.pick calls
  it, with and without the cantilever stiffness factorisation through LAPACK gufuncs and the kept
  scaling of mcr.Shape; the numeric path (steps=False) against the calc-sheet path (steps=True).
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


# ------------------------------------------------------------------ the section search's LTB fast paths
# cantilever._factor_blocks: numpy's LAPACK gufuncs for cholesky / inv called directly, the stiffness blocks
# sliced once per mesh; mcr._scaling: the twist-term scaling of Shape.mcr kept per (basis, L, section).
# Both give the same arithmetic as before, so the results are the same bit for bit: checked below on the
# members the section search builds (calckit.pick: simple span restrained at midspan, two and three
# continuous spans with pattern live load, a span with an overhang, a cantilever; IPE, HEA, HEB and W
# sections), against runs with those fast paths replaced by the plain numpy.linalg / recomputing code.
from calckit.design.en1993 import cantilever as cant_mod

PICK_SECTIONS = ("IPE 240", "IPE 400", "HEA 200", "HEB 300", "W10X22")
REL_MIRROR = 1e-12  # a mirror-image segment reuses its twin's result; the sheet solves it on its own (rounding)


def _pick_members():
    from calckit.pick import member

    en = dict(standard="EN 1993-1-1", grade="S355")
    return {
        "midspan": member("6 m", dead_udl="10 kN/m", live_udl="15 kN/m", bracing="midspan", **en),
        "two spans": member(["6 m", "6 m"], ["pin", "roller", "roller"], dead_udl="8 kN/m", live_udl="20 kN/m",
                            bracing="supports", **en),
        "three spans": member(["5 m", "6 m", "5 m"], ["pin", "roller", "roller", "roller"], dead_udl="8 kN/m",
                              live_udl="12 kN/m", bracing="supports", **en),
        "overhang": member(["6 m", "2 m"], ["pin", "roller", "free"], dead_udl="10 kN/m", live_udl="15 kN/m",
                           bracing="supports", **en),
        "cantilever": member("3 m", ["fixed", "free"], dead_udl="5 kN/m",
                             point_loads=[{"case": "Q", "P": "20 kN", "x": "3 m"}], bracing="supports", **en),
    }


def _pick_demands(label):
    """[(section, en1993 Demands with that section's self-weight)] as calckit.pick.checks builds them (new
    diagram objects on every call: nothing solved is kept on them yet)."""
    from calckit.pick.checks import _en_forces
    from calckit.pick.response import Response

    m = _pick_members()[label]
    secs = [calckit.section(n) for n in PICK_SECTIONS]
    w = np.array([s.si.mass * 9.80665 for s in secs])
    EI = np.array([210e9 * s.si.Ix for s in secs])
    resp = Response(m)
    D0 = resp.design_demands(m.standard)
    return [(s, D0.with_self_weight(d.w_self, forces=_en_forces(m, d))) for s, d in zip(secs, resp.demands(w, EI))]


def _record(res):
    return [(c.limit_state, c.ratio, c.capacity, c.demand, c.passed, c.combination, c.location, c.segment, c.note,
             sorted((k, repr(v)) for k, v in c.data.items())) for c in res.checks]


def _plain_paths(monkeypatch):
    """The code the fast paths replace: numpy.linalg, the blocks sliced per call, the scaling recomputed."""

    def blocks(Lo, Lb, warp, model, iu, ip):
        Ku, Kt, Kw = model._matrices(warp)[:3]
        return Ku[np.ix_(iu, iu)], Kt[np.ix_(ip, ip)], Kw[np.ix_(ip, ip)]

    def scaling(mu, L, GIt, EIw):
        r_phi = 1.0 / np.sqrt(GIt / L + EIw / L ** 3 * mu)
        return r_phi, np.outer(r_phi, r_phi)

    monkeypatch.setattr(cant_mod, "_cholesky", np.linalg.cholesky)
    monkeypatch.setattr(cant_mod, "_inv", np.linalg.inv)
    monkeypatch.setattr(cant_mod, "_stiffness_blocks", blocks)
    monkeypatch.setattr(mcr_mod, "_scaling", scaling)
    cant_mod._STIFF.clear()


@pytest.mark.parametrize("label", ["midspan", "two spans", "three spans", "overhang", "cantilever"])
def test_search_fast_paths_equal_plain_code(label, monkeypatch):
    """check_member(steps=False) as the section search calls it, every check's record bit for bit equal
    with and without the fast paths (recommended annex set, 6.3.2.2; UK set, 6.3.2.3 with f)."""
    fast = {}
    for annex in ("recommended", "UK"):
        cant_mod._STIFF.clear()
        for sec, D in _pick_demands(label):
            fast[annex, sec.name] = _record(en1993.check_member(sec, "S355", demands=D, annex=annex, steps=False))
    with monkeypatch.context() as mp:
        _plain_paths(mp)
        for annex in ("recommended", "UK"):
            for sec, D in _pick_demands(label):
                plain = _record(en1993.check_member(sec, "S355", demands=D, annex=annex, steps=False))
                assert plain == fast[annex, sec.name]
    assert any(c[0] == "Lateral-torsional buckling" for rec in fast.values() for c in rec)


@pytest.mark.parametrize("label", ["midspan", "two spans", "three spans", "overhang", "cantilever"])
def test_numeric_member_check_equals_the_calc_sheet_path(label):
    """check_member(steps=False) - ranked diagrams, mirror-image reuse, the fast paths above - reports for
    every check the limit state, combination, segment and pass/fail of check_member(steps=True), which
    checks the governing diagram of each segment with its steps, and the same numbers (a mirrored
    segment's to rounding: its twin's quadrature runs the other way)."""
    for sec, D in _pick_demands(label)[:3]:
        for annex in ("recommended", "UK"):
            fast = en1993.check_member(sec, "S355", demands=D, annex=annex, steps=False)
            sheet = en1993.check_member(sec, "S355", demands=D, annex=annex, steps=True)
            assert len(fast.checks) == len(sheet.checks)
            for a, b in zip(fast.checks, sheet.checks):
                assert (a.limit_state, a.passed, a.combination, a.segment) == \
                       (b.limit_state, b.passed, b.combination, b.segment)
                for u, v in ((a.ratio, b.ratio), (a.capacity, b.capacity), (a.demand, b.demand),
                             (a.location, b.location)):
                    assert u == pytest.approx(v, rel=REL_MIRROR, abs=1e-12)
                if a.limit_state == "Lateral-torsional buckling":
                    for k in ("Mcr", "C1", "chi_LT", "lambda_LT"):
                        if a.data[k] is None:
                            assert b.data[k] is None
                        else:
                            assert a.data[k] == pytest.approx(b.data[k], rel=REL_MIRROR)


def test_shape_scaling_kept_per_section_is_the_same():
    """Shape.mcr with the scaling taken from mcr._scaling's store equals the scaling recomputed, bit for
    bit, with sections and lengths interleaved (the store keys on basis, length and section)."""
    shapes = [mcr_mod.shape(_fn(d), 1.0, 1.0, 1.0)[0] for d in DIAGRAMS]
    cases = [(calckit.section(n).si, L) for n in SECTIONS for L in (2.5, 7.0)]
    for rnd in range(2):
        for si, L in cases:
            EIz, GIt, EIw = E * si.Iy, G * si.J, E * si.Cw
            for sh in shapes:
                r_phi = 1.0 / np.sqrt(GIt / L + EIw / L ** 3 * sh.mu)
                H = sh.CtC * np.outer(r_phi, r_phi)
                want = 1.0 / (math.sqrt(max(float(np.linalg.eigvalsh(H)[-1]), 0.0)) * math.sqrt(L ** 3 / EIz) / L)
                assert sh._mcr(L, EIz, GIt, EIw, 0.0, 0.0) == want
    assert len(mcr_mod._SCALING) <= 32


def test_cantilever_factor_blocks_equal_numpy_linalg():
    """cantilever._factor_blocks (LAPACK gufuncs called directly, blocks sliced once per mesh) gives the
    factors of numpy.linalg.cholesky / inv on the sliced stiffness, bit for bit; a matrix that is not
    positive definite still raises numpy's error."""
    from calckit.design.en1993.ltb import cantilever_diagram, diagram, overhang_model

    for name in ("IPE 300", "HEB 240"):
        si = calckit.section(name).si
        EIz, GIt, EIw = E * si.Iy, G * si.J, E * si.Cw
        xb, xo = np.linspace(0, 4.0, 9), np.linspace(0, 2.0, 5)
        for back in (None, (4.0, diagram((xb, -xb * 1e4), 4.0))):
            dia = cantilever_diagram("udl", 2.0) if back is None else diagram((xo, -4e4 * (1 - xo / 2.0) ** 2), 2.0)
            mdl = overhang_model(dia, 2.0, back)
            iu, ip = mdl._split[True]
            cant_mod._STIFF.clear()
            got = cant_mod._factor_blocks(mdl.Lo, mdl.Lb, True, mdl, EIz, GIt, EIw, iu, ip)
            Ku, Kt, Kw = mdl._matrices(True)[:3]
            want = []
            for K in (EIz * Ku[np.ix_(iu, iu)], GIt * Kt[np.ix_(ip, ip)] + EIw * Kw[np.ix_(ip, ip)]):
                d = 1.0 / np.sqrt(np.diag(K))
                want += [d, np.linalg.inv(np.linalg.cholesky(K * d[:, None] * d[None, :]))]
            for u, v in zip(got, want):
                assert np.array_equal(u, v)
    with pytest.raises(np.linalg.LinAlgError):
        cant_mod._cholesky(-np.eye(3))
