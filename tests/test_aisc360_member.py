"""calckit.design.aisc360.check_member: segments and Cb from the moment diagram, shear panels, bearings,
deflection parts, analysis adapter vs plain arrays, the numeric path, and bad input.

Cb values for a uniformly loaded simple span follow from Eq. F1-1 (AISC 360-22) on M = w x (L - x)/2:
braced at third points 1.46 / 1.01 / 1.46 and at midspan 1.30 (AISC Manual 15th ed. Table 3-1, from
memory; also AISC Design Examples F.1-2 and F.1-3). Other expected values are recomputed here from
the same equations (R) or compared with the single-segment functions.
"""
from __future__ import annotations

import math
import warnings

import numpy as np
import pytest

import calckit
from calckit.design import aisc360 as A
from calckit.errors import InputError, UnitsError

REL = 1e-9
REL_CB = 0.005
FT = 0.3048
KIP = 4448.2216152605
L35 = 35 * FT


@pytest.fixture(scope="module")
def w18():
    return calckit.section("W18X50")


@pytest.fixture(scope="module")
def simple():
    b = calckit.Beam(["35 ft"], ["pin", "roller"], EI="1 kN*m**2")
    b.udl("0.45 kip/ft", "D").udl("0.75 kip/ft", "L")
    sol = b.solve()
    return sol, sol.combine({"D": 1.2, "L": 1.6}, name="1.2D + 1.6L")


def flex(res):
    return [c for c in res.checks if c.limit_state.startswith("Flexure")]


def test_third_point_bracing_cb_and_segments(w18, simple):
    _, u = simple
    res = A.check_member(w18, "A992", u, bracing=[L35 / 3, 2 * L35 / 3])
    f = flex(res)
    assert [c.segment for c in f] == [(0.0, pytest.approx(L35 / 3)), (pytest.approx(L35 / 3), pytest.approx(2 * L35 / 3)),
                                      (pytest.approx(2 * L35 / 3), pytest.approx(L35))]
    assert [round(c.data["Cb"], 2) for c in f] == [1.46, 1.01, 1.46]
    # each segment has its own Mu: the ends carry M(L/3) = 8/9 of the midspan moment
    wu = (1.2 * 0.45 + 1.6 * 0.75) * KIP / FT
    assert f[1].demand == pytest.approx(wu * L35 ** 2 / 8, rel=1e-6)
    assert f[0].demand == pytest.approx(wu * L35 ** 2 / 9, rel=1e-6)
    # the centre segment matches the single-segment function with the same Lb and Cb
    one = A.flexure(w18, "A992", Lb=f"{L35 / 3} m", Cb=f[1].data["Cb"])
    assert f[1].capacity == pytest.approx(one.capacity, rel=REL)
    assert res.governing is max(res.checks, key=lambda c: c.ratio)
    assert res.steps and f[1].steps  # member-level and segment steps
    assert res.notes[-1].startswith("Design aid only")


def test_braces_at_supports_always(w18, simple):
    _, u = simple
    res = A.check_member(w18, "A992", u, bracing="none")
    f = flex(res)
    assert len(f) == 1 and f[0].segment == (0.0, pytest.approx(L35))
    assert f[0].data["Cb"] == pytest.approx(1.14, rel=REL_CB)  # Eq. F1-1, UDL, braced at the ends only
    assert res.passed is False and res.governing is f[0]  # failing member: a result, not an exception


def test_continuous_bracing_forms(w18, simple):
    _, u = simple
    a = A.check_member(w18, "A992", u, bracing=0)
    b = A.check_member(w18, "A992", u, bracing="continuous")
    c = A.check_member(w18, "A992", u, Lb=0)
    d = A.check_member(w18, "A992", u, bracing="0 ft")
    for r in (a, b, c, d):
        f = flex(r)
        assert len(f) == 1 and f[0].limit_state == "Flexure: yielding"
    assert not any("continuous lateral bracing" in n for n in a.notes)  # sagging only: nothing to say
    b2 = calckit.Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="1 kN*m**2")
    b2.udl("30 kN/m", "D")
    two = A.check_member(w18, "A992", b2.solve().combine({"D": 1.4}), bracing=0)
    assert any("hogging" in n for n in two.notes)


def test_arrays_path_equals_analysis_path(w18, simple):
    sol, u = simple
    x = np.linspace(0, L35, 401)
    M, V = u.M_si(x), u.V_si(x)
    dl = sol["L"].deflection_si(x)
    kw = dict(bracing=["17.5 ft"], bearing=[A.bearing("0 ft", lb="4 in"), A.bearing("35 ft", lb="4 in")])
    ra = A.check_member(w18, "A992", u, deflections={"live": sol["L"]}, **kw)
    rb = A.check_member(w18, "A992", x=x, M=M, V=V, deflections={"live": dl}, EI="1 kN*m**2", **kw)
    assert len(ra.checks) == len(rb.checks)
    for ca, cb in zip(ra.checks, rb.checks):
        assert ca.limit_state == cb.limit_state
        assert ca.ratio == pytest.approx(cb.ratio, rel=2e-3)
    assert any("supports assumed at both ends" in n for n in rb.notes)


def test_per_combination_diagrams_pick_the_governing(w18, simple):
    sol, _ = simple
    combos = {"1.4D": sol.combine({"D": 1.4}, name="1.4D"), "1.2D+1.6L": sol.combine({"D": 1.2, "L": 1.6}, name="1.2D+1.6L")}
    res = A.check_member(w18, "A992", combos, bracing=["17.5 ft"])
    assert all(c.combination == "1.2D+1.6L" for c in res.checks)
    lst = A.check_member(w18, "A992", list(combos.values()), bracing=["17.5 ft"])
    assert [c.ratio for c in lst.checks] == pytest.approx([c.ratio for c in res.checks], rel=REL)


def test_envelope_input_is_accepted_and_noted(w18, simple):
    sol, u = simple
    combos = [type("C", (), {"name": "1.2D+1.6L", "factors": {"D": 1.2, "L": 1.6}})()]
    env = sol.envelope(combos)
    res = A.check_member(w18, "A992", env, bracing=["17.5 ft"], bearing=[A.bearing("0 ft", lb="4 in")])
    ref = A.check_member(w18, "A992", u, bracing=["17.5 ft"], bearing=[A.bearing("0 ft", lb="4 in")])
    assert max(c.ratio for c in flex(res)) == pytest.approx(max(c.ratio for c in flex(ref)), rel=1e-3)
    assert any("envelope" in n for n in res.notes)


def test_cantilever_free_end(w18):
    b = calckit.Beam(["3 m"], ["fixed", "free"], EI="1 kN*m**2")
    b.udl("20 kN/m", "D").udl("10 kN/m", "L")
    sol = b.solve()
    u = sol.combine({"D": 1.2, "L": 1.6})
    res = A.check_member(w18, "A992", u, bracing="none", deflections={"live": sol["L"]})
    f = flex(res)
    assert len(f) == 1 and f[0].data["Cb"] == 1.0 and f[0].data["Cb_source"] == "free end"
    assert f[0].demand == pytest.approx((1.2 * 20e3 + 1.6 * 10e3) * 9 / 2, rel=1e-6)
    d = [c for c in res.checks if c.limit_state.startswith("Deflection")][0]
    assert d.data["cantilever"] and d.capacity == pytest.approx(2 * 3.0 / 360, rel=REL)
    assert any("free end" in n for n in res.notes)
    # a brace at the tip removes the free-end rule
    tip = A.check_member(w18, "A992", u, bracing=["3 m"])
    assert flex(tip)[0].data["Cb_source"] == "F1-1"


def test_two_span_continuous_beam(w18):
    b = calckit.Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="1 kN*m**2")
    b.udl("30 kN/m", "D")
    u = b.solve().combine({"D": 1.4})
    res = A.check_member(w18, "A992", u, bracing="none")
    f = flex(res)
    assert len(f) == 2
    wu = 1.4 * 30e3
    assert f[0].demand == pytest.approx(wu * 36 / 8, rel=1e-6)  # support moment -0.125 w L^2 governs |M|
    assert f[0].location == pytest.approx(6.0)


def test_singly_symmetric_both_flanges_checked():
    g = calckit.PlateGirder(d="1000 mm", tw="10 mm", bf_top="400 mm", tf_top="25 mm", bf_bot="250 mm",
                            tf_bot="20 mm", weld="8 mm")
    b = calckit.Beam(["10 m", "10 m"], ["pin", "roller", "roller"], EI="1 kN*m**2")
    b.udl("60 kN/m", "D")
    u = b.solve().combine({"D": 1.4})
    res = A.check_member(g, "S355", u, bracing=[5.0, 15.0])
    f = flex(res)
    sides = {c.data["compression_flange"] for c in f}
    assert sides == {"top", "bottom"}
    assert any("(bottom flange in compression)" in c.limit_state for c in f)
    names = [c.limit_state for c in res.checks]
    assert "Proportions: web slenderness h/tw" in names and "Proportions: 0.1 <= Iyc/Iy <= 0.9" in names


def test_bearings_take_the_force_from_the_shear_diagram(w18, simple):
    _, u = simple
    res = A.check_member(w18, "A992", u, bracing=0,
                         bearing=[A.bearing("0 ft", lb="3.25 in", name="R1"), A.bearing(f"{L35 / 2} m", lb="0 in", P="10 kip")])
    conc = [c for c in res.checks if c.limit_state.startswith("Concentrated force")]
    R = (1.2 * 0.45 + 1.6 * 0.75) * 35 / 2  # kips
    r1 = [c for c in conc if "(R1)" in c.limit_state]
    assert len(r1) == 2 and r1[0].demand / KIP == pytest.approx(R, rel=1e-6)
    assert r1[0].data["x_end"] == 0.0
    mid = [c for c in conc if "R1" not in c.limit_state]
    assert mid[0].demand / KIP == pytest.approx(10.0, rel=1e-9)
    assert mid[0].data["x_end"] == pytest.approx(L35 / 2)


def test_stiffened_girder_panels_and_stiffener_check():
    g = calckit.PlateGirder(d="1500 mm", tw="8 mm", bf_top="400 mm", tf_top="25 mm", weld="6 mm")
    b = calckit.Beam(["15 m"], ["pin", "roller"], EI="1 kN*m**2")
    b.udl("120 kN/m", "D")
    u = b.solve().combine({"D": 1.4})
    res = A.check_member(g, "S355", u, bracing=0, stiffeners="1.5 m", stiffener=("120 mm", "12 mm"))
    sh = [c for c in res.checks if c.limit_state.startswith("Shear")]
    assert len(sh) == 10
    assert sh[0].limit_state == "Shear (end panel)" and sh[0].data["tension_field"] is False
    assert sh[1].data["tension_field"] is True
    assert sh[0].demand > sh[1].demand  # shear falls away from the support
    st = [c for c in res.checks if c.limit_state.startswith("Transverse stiffener")]
    assert len(st) == 2 and st[0].location == pytest.approx(1.5)
    hp = [c for c in res.checks if c.limit_state == "Proportions: web slenderness h/tw"][0]
    assert hp.capacity == pytest.approx(12.0 * math.sqrt(210e9 / 355e6), rel=REL)  # a/h <= 1.5: Eq. F13-3


def test_deflection_parts_and_EI_scaling(w18):
    b = calckit.Beam(["2 m", "8 m"], ["free", "pin", "roller"], EI="40000 kN*m**2")
    b.udl("10 kN/m", "L")
    sol = b.solve()
    u = sol.combine({"L": 1.6})
    r1 = A.check_member(w18, "A992", u, bracing=0, deflections={"live": sol["L"]}, EI="40000 kN*m**2")
    r2 = A.check_member(w18, "A992", u, bracing=0, deflections={"live": sol["L"]}, EI="80000 kN*m**2")
    d1 = [c for c in r1.checks if c.limit_state.startswith("Deflection")]
    d2 = [c for c in r2.checks if c.limit_state.startswith("Deflection")]
    assert [c.data["cantilever"] for c in d1] == [True, False]
    assert d1[0].capacity == pytest.approx(2 * 2.0 / 360, rel=REL)
    assert d1[1].capacity == pytest.approx(8.0 / 360, rel=REL)
    for a, b2 in zip(d1, d2):
        assert b2.demand == pytest.approx(2 * a.demand, rel=REL)
    # simple-span part: relative deflection, independent check with the beam's own extremes
    assert d1[1].demand > 0


def test_numeric_path_and_prepared_demands(w18, simple):
    sol, u = simple
    kw = dict(bracing=[L35 / 3, 2 * L35 / 3], bearing=[A.bearing("0 ft", lb="4 in")],
              deflections={"live": sol["L"], "total": sol.combine({"D": 1, "L": 1})})
    full = A.check_member(w18, "A992", u, **kw)
    D = A.demands(u, **kw)
    fast = A.check_member(w18, "A992", demands=D, steps=False)
    assert len(full.checks) == len(fast.checks)
    for a, b in zip(full.checks, fast.checks):
        assert a.limit_state == b.limit_state and a.ratio == pytest.approx(b.ratio, rel=1e-12)
        assert b.steps == ()
    assert fast.steps == ()
    other = A.check_member(calckit.section("W21X44"), "A992", demands=D, steps=False)
    assert other.max_ratio != fast.max_ratio


def test_user_cb_for_all_segments(w18, simple):
    _, u = simple
    res = A.check_member(w18, "A992", u, bracing=["17.5 ft"], Cb=1.0)
    assert all(c.data["Cb"] == 1.0 and c.data["Cb_source"] == "given" for c in flex(res))
    with pytest.warns(UserWarning, match="Cb"):
        A.check_member(w18, "A992", u, bracing=["17.5 ft"], Cb=3.4)


def test_asd_method(w18, simple):
    sol, _ = simple
    a = sol.combine({"D": 1.0, "L": 1.0})
    res = A.check_member(w18, "A992", a, bracing=0, method="ASD")
    f = flex(res)[0]
    assert f.method == "ASD" and f.demand / (KIP * FT) == pytest.approx(184, rel=0.005)  # DE F.1-1B Ma (P)
    assert f.capacity / (KIP * FT) == pytest.approx(252, rel=0.01)  # DE F.1-1B (P)


def test_bad_member_input(w18, simple):
    sol, u = simple
    with pytest.raises(InputError, match="bracing\\[0\\]"):
        A.check_member(w18, "A992", u, bracing=[50.0])
    with pytest.raises(InputError, match="bracing"):
        A.check_member(w18, "A992", u, bracing="every 5 ft")
    with pytest.raises(InputError, match="BeamSolution"):
        A.check_member(w18, "A992", sol)
    with pytest.raises(InputError, match="analysis"):
        A.check_member(w18, "A992", u, x=[0, 1], M=[0, 0])
    with pytest.raises(InputError, match="x, M"):
        A.check_member(w18, "A992")
    with pytest.raises(InputError, match="M"):
        A.check_member(w18, "A992", x=[0, 1, 2], M=[0, 1])
    with pytest.raises(InputError, match="demands"):
        A.check_member(w18, "A992", u, demands=A.demands(u))
    with pytest.raises(InputError, match="Lb"):
        A.check_member(w18, "A992", u, Lb=0, bracing=[1.0])
    with pytest.raises(InputError, match="bearing"):
        A.check_member(w18, "A992", u, bearing=[A.bearing("50 ft")])
    with pytest.raises(UnitsError, match="x"):
        A.bearing(3.0)
    with pytest.raises(InputError, match="deflection case"):
        A.check_member(w18, "A992", u, deflections={"snow": sol["L"]})
    with pytest.raises(InputError, match="single value"):
        b = calckit.Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="1 kN*m**2")
        b.udl("1 kN/m", "D")
        A.check_member(w18, "A992", b.solve().combine({"D": 1}), deflections={"live": 0.01})
