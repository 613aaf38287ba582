"""calckit.design.en1993.check_member / demands with the real moment diagram of every load arrangement
(calckit.analysis.arrangements) instead of an envelope, and the self-weight term of demands().

The independent path: every diagram's lateral-torsional buckling check recomputed with the public scalar
``en1993.ltb`` (``moment_diagram=(x, M)`` sampled here from the BeamResult, ``cantilever=True`` and
``backspan`` for an overhang), and the governing diagram found by brute force (largest M_Ed / M_b,Rd,
i.e. the smallest capacity ratio M_b,Rd / M_Ed). Beams: a propped cantilever, a two-span continuous beam
with pattern live load, and a beam with an overhang; combinations EN 1990 Eq. 6.10 from
calckit.analysis.combinations. No published reference values here: these tests pin the member check
to the scalar checks, and show that an envelope curve is not a moment diagram (C1 from it differs).
"""
from __future__ import annotations

import numpy as np
import pytest

import calckit
from calckit.analysis import Beam, arrangements
from calckit.analysis.combinations import combinations
from calckit.design import en1993
from calckit.design.en1993 import cantilever as cant_mod
from calckit.design.en1993 import mcr as mcr_mod
from calckit.errors import InputError

REL_SAMPLING = 2e-3  # check_member samples a BeamResult at 200 stations + nodes, the brute force at 201 per segment
REL_FAST = 1e-9  # two exact evaluations of the same quantities (rounding only)
E, G = 210e9, 210e9 / 2.6


def en_combos(cases=("G", "Q")):
    return combinations("EN 1990", list(cases), "strength", category="B")


def propped(w_g="12 kN/m", w_q="10 kN/m"):
    b = Beam(["8 m"], ["fixed", "roller"], EI="40000 kN*m**2")
    b.udl(w_g, "G").udl(w_q, "Q")
    return b.solve()


def two_span():
    b = Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="40000 kN*m**2")
    b.udl("8 kN/m", "G").udl("20 kN/m", "Q")
    return b.solve()


def overhang_beam():
    b = Beam(["6 m", "2 m"], ["pin", "roller", "free"], EI="40000 kN*m**2")
    b.udl("10 kN/m", "G").udl("15 kN/m", "Q")
    return b.solve()


def ltb_checks(res):
    return [c for c in res.checks if c.limit_state.startswith("Lateral")]


def brute_segment(sec, steel, diagrams, a, b):
    """{name: (ratio, C1)} of the forks segment [a, b] under each diagram, by en1993.ltb directly."""
    out = {}
    xx = np.linspace(a, b, 201)
    for name, r in diagrams.items():
        M = r.M_si(xx)
        peak = float(np.max(np.abs(M)))
        if peak == 0:
            continue
        lt = en1993.ltb(sec, steel, L=f"{b - a} m", moment_diagram=(xx - a, M), M_Ed=f"{peak} N*m", steps=False)
        out[name] = (lt.ratio, lt.C1, lt.capacity / peak)
    return out


def test_propped_cantilever_envelope_is_not_a_diagram():
    sol = propped()
    combos = en_combos()
    arr = arrangements(sol, combos)
    env = sol.envelope(combos)
    sec = calckit.section("IPE 360")
    r_env = en1993.check_member(sec, "S355", analysis=env, restraints=[0, 8], steps=False)
    r_arr = en1993.check_member(sec, "S355", analysis=arr, restraints=[0, 8], steps=False)
    (le,), (la,) = ltb_checks(r_env), ltb_checks(r_arr)
    brute = brute_segment(sec, "S355", arr, 0.0, 8.0)
    name, (ratio, C1, cap) = max(brute.items(), key=lambda kv: kv[1][0])
    # the per-diagram check is the brute-force governing diagram: largest ratio = smallest M_b,Rd / M_Ed
    assert la.ratio == pytest.approx(ratio, rel=REL_SAMPLING)
    assert 1.0 / la.ratio == pytest.approx(min(v[2] for v in brute.values()), rel=REL_SAMPLING)
    assert la.combination == name
    assert la.C1 == pytest.approx(C1, rel=REL_SAMPLING)
    # the envelope curve (hogging of one loading, sagging of another) overstates C1: unconservative
    assert le.C1 > 2.0 * la.C1
    assert le.ratio < 0.75 * la.ratio
    assert any("envelope curve" in n for n in r_env.notes) and "envelope" in le.note
    assert not any("envelope curve" in n for n in r_arr.notes)


@pytest.mark.parametrize("restraints", [[0, 6, 12], [0, 3, 6, 9, 12]])
def test_two_span_pattern_live_load_per_segment(restraints):
    sol = two_span()
    combos = en_combos()
    arr = arrangements(sol, combos)
    assert len(arr) >= 6  # Q on both spans, on either span, off, for each combination
    sec = calckit.section("IPE 330")
    res = en1993.check_member(sec, "S355", analysis=arr, restraints=restraints, steps=False)
    env = en1993.check_member(sec, "S355", analysis=sol.envelope(combos), restraints=restraints, steps=False)
    lts = ltb_checks(res)
    assert [c.segment for c in lts] == list(zip(restraints[:-1], restraints[1:]))
    for c in lts:
        brute = brute_segment(sec, "S355", arr, *c.segment)
        name, (ratio, C1, _) = max(brute.items(), key=lambda kv: kv[1][0])
        assert c.ratio == pytest.approx(ratio, rel=REL_SAMPLING)
        assert c.combination == name and c.C1 == pytest.approx(C1, rel=REL_SAMPLING)
        assert 1 <= c.data["diagrams_evaluated"] <= c.data["diagrams"] <= len(brute)  # same-shape ones left out
    if restraints == [0, 6, 12]:  # the span's own live load governs its segment
        assert "[Q: span 1]" in lts[0].combination and "[Q: span 2]" in lts[1].combination
        assert max(c.ratio for c in ltb_checks(env)) < 0.8 * max(c.ratio for c in lts)
    # bending and shear: the worst over the diagrams at each station is the envelope
    for lim in ("Bending", "Shear"):
        a = sorted(c.ratio for c in res.checks if c.limit_state == lim)
        b = sorted(c.ratio for c in env.checks if c.limit_state == lim)
        assert a == pytest.approx(b, rel=REL_SAMPLING)
    assert all(c.combination for c in res.checks)


def test_each_single_diagram_equals_the_scalar_check():
    sol = two_span()
    arr = arrangements(sol, en_combos())
    sec = calckit.section("HEA 300")
    for name, r in arr.items():
        res = en1993.check_member(sec, "S275", analysis=r, restraints=[0, 6, 12], steps=False)
        for c in ltb_checks(res):
            ratio, C1, _ = brute_segment(sec, "S275", {name: r}, *c.segment)[name]
            assert c.C1 == pytest.approx(C1, rel=REL_SAMPLING) and c.ratio == pytest.approx(ratio, rel=REL_SAMPLING)
            assert c.combination == name


def test_dict_list_arrays_and_prepared_demands_agree():
    sol = two_span()
    arr = arrangements(sol, en_combos())
    sec = calckit.section("IPE 360")
    kw = dict(restraints=[0, 3, 6, 9, 12])
    ref = en1993.check_member(sec, "S355", analysis=arr, steps=True, **kw)
    x, M, V, _, _ = en1993.from_analysis(arr)
    assert isinstance(M, dict) and set(M) == set(arr)
    others = [en1993.check_member(sec, "S355", analysis=list(arr.values()), steps=False, **kw),
              en1993.check_member(sec, "S355", x=x, M=M, V=V, steps=False, **kw),
              en1993.check_member(sec, "S355", demands=en1993.demands(analysis=arr, **kw), steps=False)]
    for o in others:
        assert [c.limit_state for c in o.checks] == [c.limit_state for c in ref.checks]
        for c, d in zip(o.checks, ref.checks):
            assert c.ratio == pytest.approx(d.ratio, rel=REL_FAST) and c.combination == d.combination
    gov = next(c for c in ref.checks if c.limit_state.startswith("Lateral"))
    assert gov.steps and "moment diagrams" in gov.note  # the steps path re-runs the governing diagram


def test_overhang_checked_under_every_diagram():
    sol = overhang_beam()
    arr = arrangements(sol, en_combos())
    sec = calckit.section("IPE 300")
    res = en1993.check_member(sec, "S355", analysis=arr, steps=False)  # restraints: the two supports
    ov = next(c for c in ltb_checks(res) if c.data["support"] == "overhang")
    assert ov.segment == (6.0, 8.0)
    s_ = np.linspace(0.0, 2.0, 201)
    t = np.linspace(0.0, 6.0, 201)
    brute = {}
    for name, r in arr.items():
        Mo = r.M_si(6.0 + s_)
        lt = en1993.ltb(sec, "S355", L="2 m", moment_diagram=(s_, Mo), cantilever=True,
                        backspan=("6 m", (t, r.M_si(t))), M_Ed=f"{np.max(np.abs(Mo))} N*m", steps=False)
        brute[name] = lt.ratio
    name = max(brute, key=brute.get)
    assert ov.ratio == pytest.approx(brute[name], rel=REL_SAMPLING) and ov.combination == name


def test_self_weight_term_is_exact():
    """demands(M=loads, self_weight=(U, factors)).with_self_weight(w) against demands of the summed arrays."""
    b = Beam(["6 m", "2 m"], ["pin", "roller", "free"], EI="40000 kN*m**2")
    b.udl("10 kN/m", "G").udl("15 kN/m", "Q", "0 m", "6 m").udl("5 kN/m", "Q", "6 m", "8 m").udl("1 N/m", "SW")
    sol = b.solve()
    cases = {"all": {"G": 1.35, "Q": 1.5}, "span": {"G": 1.35, "Q": 0.0}, "fav": {"G": 1.0, "Q": 1.5}}
    f = {"all": 1.35, "span": 1.35, "fav": 1.0}
    x, M, V, _, _ = en1993.from_analysis({k: sol.combine(v, name=k) for k, v in cases.items()})
    _, MU, VU, _, _ = en1993.from_analysis(sol["SW"])
    kw = dict(restraints=[0, 3, 6])
    D0 = en1993.demands(x=x, M=M, V=V, self_weight=(MU, VU, f), **kw)
    for w in (0.0, 600.0, 2400.0):
        Dw = D0.with_self_weight(w)
        Dd = en1993.demands(x=x, M={k: M[k] + f[k] * w * MU for k in M}, V={k: V[k] + f[k] * w * VU for k in V}, **kw)
        for name in ("IPE 300", "HEA 260"):
            sec = calckit.section(name)
            a = en1993.check_member(sec, "S355", demands=Dw, steps=False)
            d = en1993.check_member(sec, "S355", demands=Dd, steps=False)
            assert [c.limit_state for c in a.checks] == [c.limit_state for c in d.checks]
            for ca, cd in zip(a.checks, d.checks):
                assert ca.ratio == pytest.approx(cd.ratio, rel=REL_FAST), ca.limit_state
                assert ca.combination == cd.combination
    assert {sg.kind for sg in D0.with_self_weight(100.0).segments} == {"forks", "overhang"}


def test_same_shape_diagrams_are_left_out():
    """On a simple span every UDL arrangement is a parabola: only the largest can govern."""
    x = np.linspace(0.0, 6.0, 61)
    S = x * (6.0 - x)
    M = {"a": 10e3 * S, "b": 7e3 * S, "c": 12e3 * S}
    D = en1993.demands(x=x, M=M, restraints=[0, 6])
    assert [sg.combination for sg in D.segments] == ["c"]
    D = en1993.demands(x=x, M={"a": 10e3 * S, "b": 7e3 * S}, self_weight=(S, np.zeros_like(x), {"a": 1.0, "b": 1.35}),
                       restraints=[0, 6])
    assert len(D.with_self_weight(500.0).segments) == 2  # 'b' has the larger self-weight factor: both kept
    D = en1993.demands(x=x, M={"a": 10e3 * S, "b": 7e3 * S}, self_weight=(S, np.zeros_like(x), {"a": 1.35, "b": 1.0}),
                       restraints=[0, 6])
    assert [sg.combination for sg in D.with_self_weight(500.0).segments] == ["a"]


def test_uniform_moment_gives_the_lowest_c1():
    """The rule behind one of check_member's skips: C1 >= 1 for a doubly symmetric segment between forks
    with the load at the shear centre (random diagrams; deterministic seed)."""
    rng = np.random.default_rng(7)
    for name in ("IPE 300", "HEB 300", "IPE 600"):
        si = calckit.section(name).si
        for L in (1.5, 5.0, 12.0):
            for _ in range(40):
                v = rng.normal(size=int(rng.integers(2, 7)))
                q = np.linspace(0.0, 1.0, v.size)
                c = rng.normal(size=3)
                fa = mcr_mod.equivalent_factors(L, E * si.Iy, G * si.J, E * si.Cw,
                                                lambda t, q=q, v=v, c=c: np.interp(t, q, v) + c[0] * np.sin(np.pi * t))
                assert fa.C1 >= 1.0 - 1e-9


def test_fast_paths_equal_the_reference_solves():
    si = calckit.section("IPE 300").si
    EIz, GIt, EIw = E * si.Iy, G * si.J, E * si.Cw
    # Shape.combine of raw shapes = Shape of the summed diagram
    fa, fb = (lambda t: 4 * t * (1 - t)), (lambda t: 1 - 1.7 * t)
    comb = mcr_mod.Shape.combine([(0.8, mcr_mod.raw_shape(fa)), (0.3, mcr_mod.raw_shape(fb))])
    for zg, zj in ((0.0, 0.0), (0.15, 0.0), (-0.1, 0.03)):
        ref = mcr_mod.mcr_energy(5.0, EIz, GIt, EIw, lambda t: 0.8 * fa(t) + 0.3 * fb(t), zg=zg, zj=zj, Mmax=1.0)
        assert comb.mcr(5.0, EIz, GIt, EIw, zg=zg, zj=zj) == pytest.approx(ref, rel=REL_FAST)
    # cantilever models: combine of raw models, and the u/phi split used for z_g = z_j = 0
    mo, mb = (lambda s: -1e4 * (2 - s) ** 2), (lambda u: 3e4 * u * (1 - u / 6) - 2e4 * u / 6)
    uo, ub = (lambda s: -0.5 * (2 - s) ** 2), (lambda u: 1.5 * u * (1 - u / 6) - u / 6)
    whole = cant_mod.model(2.0, lambda s: mo(s) + 300 * uo(s), (6.0, lambda u: mb(u) + 300 * ub(u)))
    parts = cant_mod.OverhangModel.combine([(1.0, cant_mod.OverhangModel.raw(2.0, mo, (6.0, mb))),
                                            (300.0, cant_mod.OverhangModel.raw(2.0, uo, (6.0, ub)))])
    for zg in (0.0, 0.15):
        assert parts.mcr(EIz, GIt, EIw, zg=zg) == pytest.approx(whole.mcr(EIz, GIt, EIw, zg=zg), rel=REL_FAST)
    for m in (whole, cant_mod.model(2.5, lambda s: -3e4 * (2.5 - s))):
        warp = True
        Ku, Kt, Kw, Gc, _, _ = m._matrices(warp)
        d, Li = cant_mod._factor_stiffness(m.Lo, m.Lb, warp, Ku, Kt, Kw, EIz, GIt, EIw)
        S = Li @ (Gc * d[:, None] * d[None, :]) @ Li.T
        full = -1.0 / np.linalg.eigvalsh(0.5 * (S + S.T))[0]
        m._last = None
        assert m.mcr(EIz, GIt, EIw) == pytest.approx(full, rel=REL_FAST)


def test_input_errors():
    sol = two_span()
    arr = arrangements(sol, en_combos())
    env = sol.envelope(en_combos())
    x = np.linspace(0.0, 6.0, 31)
    M = {"a": 1e4 * x * (6 - x)}
    with pytest.raises(InputError, match="self_weight"):
        en1993.demands(analysis=env, self_weight=(np.zeros(env.x.size), np.zeros(env.x.size), 1.0))
    with pytest.raises(InputError, match="factor"):
        en1993.demands(x=x, M=M, self_weight=(x, x, {"b": 1.0}))
    with pytest.raises(InputError, match="one per diagram"):
        en1993.demands(x=x, M=M, self_weight=(x, x, [1.0, 1.2]))
    with pytest.raises(InputError, match="with_self_weight"):
        en1993.demands(x=x, M=M).with_self_weight(100.0)
    with pytest.raises(InputError, match="w: got"):
        en1993.demands(x=x, M=M, self_weight=(x, x, 1.0)).with_self_weight(-1.0)
    with pytest.raises(InputError, match="BeamSolution"):
        en1993.check_member(calckit.section("IPE 300"), "S355", analysis=sol)
    with pytest.raises(InputError, match="same diagram names"):
        en1993.demands(x=x, M=M, V={"b": x})
    with pytest.raises(InputError, match="empty"):
        en1993.check_member(calckit.section("IPE 300"), "S355", analysis={})
    assert len(arr) > 1


def test_shear_beyond_the_plastic_resistance_is_a_failing_result():
    """V_Ed > V_pl,Rd leaves no moment resistance (rho = 1 on a small section): ratio inf, not an error."""
    x = np.linspace(0.0, 6.0, 61)
    res = en1993.check_member(calckit.section("W6X8.5"), "S355", x=x, M=1e5 * x * (6 - x) / 9, V=4e5 * (3 - x),
                              restraints="continuous", steps=False)
    assert res.passed is False and res.max_ratio > 1


def test_mirror_image_segments_reuse_the_result():
    """A symmetric span: the numeric path takes a segment's result from its mirror image; the steps path
    computes every segment; both agree (ratio, C1, location mirrored)."""
    x = np.linspace(0.0, 9.0, 91)
    M = 20e3 * x * (9.0 - x) / 2
    V = 20e3 * (4.5 - x)
    sec = calckit.section("IPE 300")
    kw = dict(x=x, M=M, V=V, restraints=[0, 3, 6, 9])
    fast = ltb_checks(en1993.check_member(sec, "S355", steps=False, **kw))
    full = ltb_checks(en1993.check_member(sec, "S355", steps=True, **kw))
    assert [c.segment for c in fast] == [(0, 3), (3, 6), (6, 9)]
    for a, b in zip(fast, full):
        assert a.ratio == pytest.approx(b.ratio, rel=1e-6) and a.C1 == pytest.approx(b.C1, rel=1e-6)
        assert a.location == pytest.approx(b.location, abs=1e-9) and a.segment == b.segment
    assert fast[2].location == pytest.approx(6.0, abs=1e-9)  # the peak of the last segment is at its left end


def test_buckling_resistance_over_critical_moment_grows_with_slenderness():
    """The rule behind check_member's second skip: chi_LT lambda_LT^2 (= M_b,Rd gamma_M1 / M_cr) does not
    decrease with lambda_LT, for every curve of EN 1993-1-1 Table 6.3, 6.3.2.2 and 6.3.2.3 (f = 1)."""
    lam = np.linspace(0.0, 6.0, 3001)
    for method, l0, beta in (("general", 0.2, 1.0), ("rolled", 0.4, 0.75), ("rolled", 0.2, 1.0)):
        for curve in ("a0", "a", "b", "c", "d"):
            v = np.array([en1993.chi_lt(t, curve, method, l0, beta) * t * t for t in lam])
            assert np.all(np.diff(v) >= -1e-12), (method, curve)


@pytest.mark.parametrize("name", ["W8X24", "IPE 220", "HEA 160"])
def test_bending_with_shear_is_the_worst_station(name):
    """The bending check with coexisting shear equals the worst of the scalar checks en1993.bending(M_Ed,
    V_Ed) at every station (the member check skips stations that cannot govern)."""
    sol = two_span()
    arr = arrangements(sol, en_combos())
    sec = calckit.section(name)
    res = en1993.check_member(sec, "S355", analysis=arr, restraints="continuous", steps=False)
    x, M, V, _, _ = en1993.from_analysis(arr)
    Mk, Vk = np.array(list(M.values())), np.abs(np.array(list(V.values())))
    Mmax, Mmin, Va = Mk.max(axis=0), Mk.min(axis=0), Vk.max(axis=0)
    for sag, Marr in ((True, Mmax), (False, -Mmin)):
        want = max(en1993.bending(sec, "S355", M_Ed=f"{(1 if sag else -1) * m} N*m", V_Ed=f"{v} N", steps=False).ratio
                   for m, v in zip(Marr, Va) if m > 0)
        got = [c for c in res.checks if c.limit_state.startswith("Bending")
               and c.data["compression_flange"] == ("top" if sag else "bottom")]
        assert got and got[0].ratio == pytest.approx(want, rel=REL_FAST)
