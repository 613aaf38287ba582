"""calckit.design.en1993: lateral-torsional buckling of cantilevers and overhangs (EN 1993-1-1 6.3.2 with
M_cr from the energy solution of calckit.design.en1993.cantilever).

Behaviour and consistency checks; the M_cr values themselves are validated against published and
independent solutions in tests/validation/test_en1993_cantilever_mcr.py.
"""
from __future__ import annotations

import numpy as np
import pytest

import calckit
from calckit.design import en1993
from calckit.design.en1993.cantilever import model
from calckit.errors import InputError

REL = 1e-9
REL_LIMIT = 0.01  # overhang with a back segment 1/400 of its length vs the built-in cantilever
E, G = 210e9, 210e9 / 2.6


def overhang_member(Lb=6.0, Lo=2.0, w=20e3, n=161):
    """Simply supported back span 0..Lb with an overhang Lb..Lb+Lo, UDL w everywhere (x, M, V arrays)."""
    x = np.linspace(0.0, Lb + Lo, n)
    RA = (w * Lb ** 2 / 2 - w * Lo ** 2 / 2) / Lb
    M = np.where(x <= Lb, RA * x - w * x ** 2 / 2, -w * (Lb + Lo - x) ** 2 / 2)
    V = np.where(x <= Lb, RA - w * x, w * (Lb + Lo - x))
    return x, M, V


def ltb_checks(res):
    return [c for c in res.checks if c.limit_state.startswith("Lateral")]


def test_named_and_array_diagrams_agree():
    s = calckit.section("IPE 300")
    L = 2.5
    x = np.linspace(0.0, L, 51)
    a = en1993.ltb(s, "S355", L="2.5 m", moment_diagram="point", cantilever=True, zg="150 mm", steps=False)
    b = en1993.ltb(s, "S355", L="2.5 m", moment_diagram=(x, -40e3 * (L - x)), cantilever=True, zg="150 mm",
                   steps=False)
    assert b.Mcr == pytest.approx(a.Mcr, rel=REL)
    assert b.demand == pytest.approx(40e3 * L, rel=REL)  # the root moment
    assert a.C1 is None and a.data["support"] == "cantilever"
    assert a.gamma_cr == pytest.approx(a.Mcr * L / np.sqrt(E * s.si.Iy * G * s.si.J), rel=REL)


def test_load_height_and_load_shape_ordering():
    s = calckit.section("IPE 360")
    m = {z: en1993.ltb(s, "S275", L="3 m", moment_diagram="udl", cantilever=True, zg=z, steps=False).Mcr
         for z in ("-180 mm", "0 mm", "180 mm")}
    assert m["180 mm"] < m["0 mm"] < m["-180 mm"]  # load on the top flange destabilises
    tip = en1993.ltb(s, "S275", L="3 m", moment_diagram="point", cantilever=True, steps=False).Mcr
    assert m["0 mm"] > tip  # the same root moment from a UDL is less critical than from a tip load


def test_steps_and_numeric_paths_agree():
    s = calckit.section("IPE 300")
    kw = dict(L="2 m", moment_diagram="udl", cantilever=True, zg="150 mm", M_Ed="60 kN*m", method="rolled",
              use_f=True)
    a = en1993.ltb(s, "S355", steps=False, **kw)
    b = en1993.ltb(s, "S355", steps=True, **kw)
    assert b.capacity == pytest.approx(a.capacity, rel=REL) and b.Mcr == pytest.approx(a.Mcr, rel=REL)
    syms = [getattr(st, "symbol", None) for st in b.steps]
    assert "gamma_cr" in syms and "M_cr" in syms and "C_1" not in syms
    assert a.f is None and "f = 1" in a.note  # Table 6.6 has no cantilever case


def test_monosymmetric_cantilever_prefers_the_larger_compression_flange():
    big_bot = calckit.PlateGirder(d="700 mm", tw="10 mm", bf_top="180 mm", tf_top="15 mm", bf_bot="300 mm",
                                  tf_bot="20 mm")
    big_top = calckit.PlateGirder(d="700 mm", tw="10 mm", bf_top="300 mm", tf_top="20 mm", bf_bot="180 mm",
                                  tf_bot="15 mm")
    kw = dict(L="4 m", moment_diagram="udl", cantilever=True, steps=False)
    a = en1993.ltb(big_bot, "S355", **kw)  # hogging: the bottom flange is in compression
    b = en1993.ltb(big_top, "S355", **kw)
    assert a.compression_flange == "bottom" and a.Mcr > b.Mcr


def test_check_member_overhang_matches_ltb_with_backspan():
    s = calckit.section("IPE 300")
    x, M, V = overhang_member()
    r = en1993.check_member(s, "S355", x=x, M=M, V=V, restraints=[0.0, 6.0], zg="150 mm", steps=False)
    lt = ltb_checks(r)
    assert [c.segment for c in lt] == [(0.0, 6.0), (6.0, 8.0)]
    over = lt[1]
    assert over.data["support"] == "overhang" and over.location == pytest.approx(6.0)
    assert over.demand == pytest.approx(20e3 * 4 / 2, rel=1e-9)
    back, over_ = x <= 6.0, x >= 6.0
    direct = en1993.ltb(s, "S355", L="2 m", moment_diagram=(x[over_] - 6.0, M[over_]), cantilever=True,
                        backspan=("6 m", (x[back], M[back])), zg="150 mm", steps=False)
    assert over.Mcr == pytest.approx(direct.Mcr, rel=1e-6)  # same model, diagrams sampled alike
    assert any("overhang 6-8 m" in n for n in r.notes)


def test_left_overhang_is_the_mirror_image():
    s = calckit.section("HEA 240")
    x, M, V = overhang_member(Lb=5.0, Lo=1.5)
    right = en1993.check_member(s, "S275", x=x, M=M, V=V, restraints=[0.0, 5.0], zg=0.1, steps=False)
    xl = (x[-1] - x)[::-1]
    left = en1993.check_member(s, "S275", x=xl, M=M[::-1], V=-V[::-1], restraints=[1.5, 6.5], zg=0.1, steps=False)
    r, l_ = ltb_checks(right)[1], ltb_checks(left)[0]
    assert l_.segment == (0.0, 1.5) and l_.data["support"] == "overhang"
    assert l_.Mcr == pytest.approx(r.Mcr, rel=1e-6) and l_.capacity == pytest.approx(r.capacity, rel=1e-6)


def test_built_in_root_options_and_single_restraint():
    s = calckit.section("IPE 300")
    x, M, V = overhang_member()
    cont = ltb_checks(en1993.check_member(s, "S355", x=x, M=M, V=V, restraints=[0, 6], steps=False))[1]
    fixed = ltb_checks(en1993.check_member(s, "S355", x=x, M=M, V=V, restraints=[0, 6], overhang_root="fixed",
                                           steps=False))[1]
    assert fixed.data["support"] == "cantilever" and fixed.Mcr > cont.Mcr  # built-in root: unconservative here
    sel = x >= 6.0
    alone = en1993.ltb(s, "S355", L="2 m", moment_diagram=(x[sel] - 6.0, M[sel]), cantilever=True, steps=False)
    assert fixed.Mcr == pytest.approx(alone.Mcr, rel=1e-6)
    # a cantilever from a fixed support: one restraint at the root
    b = calckit.Beam(["3 m"], ["fixed", "free"], EI="40000 kN*m**2")
    b.point("30 kN", "3 m", "D")
    res = en1993.check_member(s, "S355", analysis=b.solve()["D"], restraints=[0.0], zg="150 mm", steps=True)
    (c,) = ltb_checks(res)
    tip = en1993.ltb(s, "S355", L="3 m", moment_diagram="point", cantilever=True, zg="150 mm", steps=False)
    assert c.data["support"] == "cantilever" and c.Mcr == pytest.approx(tip.Mcr, rel=1e-6)
    assert c.demand == pytest.approx(90e3, rel=1e-6) and len(c.steps) > 5


def test_default_restraints_skip_a_free_end_of_the_analysis():
    b = calckit.Beam(["6 m", "2 m"], ["pin", "roller", "free"], EI="40000 kN*m**2")
    b.udl("20 kN/m", "D")
    res = b.solve()["D"]
    s = calckit.section("IPE 300")
    dflt = en1993.check_member(s, "S355", analysis=res, zg=0.15, steps=False)
    given = en1993.check_member(s, "S355", analysis=res, restraints=[0, 6], zg=0.15, steps=False)
    assert [c.segment for c in ltb_checks(dflt)] == [(0.0, 6.0), (6.0, 8.0)]
    assert [c.Mcr for c in ltb_checks(dflt)] == [c.Mcr for c in ltb_checks(given)]
    assert any("free end is no lateral-torsional restraint" in n for n in dflt.notes)


def test_short_back_segment_tends_to_the_built_in_root():
    """u = phi = 0 at two points a short distance apart act as a built-in root (u' = phi' = 0)."""
    si = calckit.section("IPE 300").si
    Lo, q = 2.0, 10e3
    Mo = (lambda s: -q * (Lo - s) ** 2 / 2)
    fixed = model(Lo, Mo).mcr(E * si.Iy, G * si.J, E * si.Cw, zg=0.15)
    Lb, M0 = Lo / 400, -q * Lo ** 2 / 2
    near = model(Lo, Mo, (Lb, lambda t: M0 * np.asarray(t) / Lb)).mcr(E * si.Iy, G * si.J, E * si.Cw, zg=0.15)
    assert near == pytest.approx(fixed, rel=REL_LIMIT) and near < fixed


def test_model_cache_and_demands_reuse():
    Mo = (lambda s: -(2.0 - np.asarray(s)))
    assert model(2.0, Mo) is model(2.0, Mo)
    x, M, V = overhang_member()
    D = en1993.demands(x=x, M=M, V=V, restraints=[0, 6], zg=0.15)
    secs = [calckit.section(n) for n in ("IPE 270", "IPE 300")]
    a = [ltb_checks(en1993.check_member(sc, "S355", demands=D, steps=False))[1].Mcr for sc in secs]
    b = [ltb_checks(en1993.check_member(sc, "S355", x=x, M=M, V=V, restraints=[0, 6], zg=0.15,
                                        steps=False))[1].Mcr for sc in secs]
    assert a == b and a[0] < a[1]


def test_bad_inputs():
    s = calckit.section("IPE 300")
    with pytest.raises(InputError, match="C1"):
        en1993.ltb(s, "S235", L="2 m", C1=1.2, moment_diagram="udl", cantilever=True)
    with pytest.raises(InputError, match="backspan"):
        en1993.ltb(s, "S235", L="2 m", moment_diagram="udl", backspan=("6 m", "udl"))
    with pytest.raises(InputError, match="backspan"):
        en1993.ltb(s, "S235", L="2 m", moment_diagram="udl", cantilever=True, backspan=("6 m", "udl"))
    x = np.linspace(0, 2.0, 11)
    with pytest.raises(InputError, match="root"):
        en1993.ltb(s, "S235", L="2 m", moment_diagram=(x, -1e4 * (2 - x)), cantilever=True,
                   backspan=("6 m", (np.array([0, 6.0]), np.array([0.0, -5e4]))))
    with pytest.raises(InputError, match="moment_diagram"):
        en1993.ltb(s, "S235", L="2 m", cantilever=True)
    with pytest.raises(InputError, match="moment_diagram"):
        en1993.ltb(s, "S235", L="2 m", moment_diagram="linear", cantilever=True)
    with pytest.raises(InputError):
        model(0.0, lambda t: t)
