"""calckit.design.aisc360 shear (AISC 360-22 G2.1, G2.2, G2.3, G6): branches, limits and bad input.

Values are validated against the Design Examples and recomputations in
tests/validation/test_aisc_design_examples.py; here: which clause applies and the Specification's
limits (equations of AISC 360-22 Chapter G, from memory, as listed in calckit/design/aisc360/shear.py).
"""
from __future__ import annotations

import math

import pytest

import calckit
from calckit.design import aisc360 as A
from calckit.errors import InputError, NotCoveredError, UnitsError
from calckit.sections import Hollow, Tee

REL = 1e-9
E = 200e9
FY = 355e6


def girder(tw="10 mm", d="1500 mm", bf="400 mm", tf="25 mm", **kw):
    return calckit.PlateGirder(d=d, tw=tw, bf_top=bf, tf_top=tf, **kw)


def test_unstiffened_welded_web_kv_534():
    g = girder()
    r = A.shear(g, "S355")
    h_tw = (1500 - 50) / 10
    lim = 1.10 * math.sqrt(5.34 * 210e9 / FY)
    assert r.data["kv"] == 5.34 and r.clause.endswith("G2.1(b)")
    Cv1 = 1.0 if h_tw <= lim else lim / h_tw
    assert r.nominal == pytest.approx(0.6 * FY * 1.5 * 0.010 * Cv1, rel=REL)
    assert r.data["phi_v"] == 0.90


def test_rolled_I_phi_100_only_when_stocky():
    assert A.shear(calckit.section("W18X50"), "A992").data["phi_v"] == 1.00
    assert A.shear(calckit.section("W16X26"), "A992").data["phi_v"] == 0.90
    # welded sections never get phi_v = 1.00 (G2.1(a) is for rolled I-shapes)
    stocky = calckit.PlateGirder(d="400 mm", tw="12 mm", bf_top="200 mm", tf_top="15 mm")
    assert A.shear(stocky, "S355").data["phi_v"] == 0.90


def test_stiffeners_raise_kv_and_capacity():
    g = girder(tw="8 mm")
    r0 = A.shear(g, "S355")
    r1 = A.shear(g, "S355", a="1.5 m", tension_field=False)
    h = 1.45
    assert r1.data["kv"] == pytest.approx(5 + 5 / (1.5 / h) ** 2, rel=REL)
    assert r1.capacity > r0.capacity


def test_a_over_h_above_3_uses_534():
    g = girder(tw="8 mm")
    r = A.shear(g, "S355", a="5 m")
    assert r.data["kv"] == 5.34
    assert r.data["tension_field"] is False and "a/h > 3.0" in r.data["tfa_note"]


def test_tension_field_interior_panel_but_not_end_panel():
    g = girder(tw="8 mm")
    inner = A.shear(g, "S355", a="1.5 m")
    end = A.shear(g, "S355", a="1.5 m", end_panel=True)
    assert inner.data["tension_field"] is True and inner.clause.startswith("AISC 360-22 G2.2")
    assert end.data["tension_field"] is False and end.clause.endswith("G2.1(b)")
    assert inner.capacity > end.capacity


def test_G2_8_when_flanges_are_small():
    """G2.2(b)(2): h/bf > 6.0 -> Eq. G2-8 (smaller post-buckling term)."""
    g = girder(tw="8 mm", bf="200 mm", tf="40 mm")
    r = A.shear(g, "S355", a="1.5 m")
    assert r.clause.endswith("G2.2(b)(2)")
    g7 = girder(tw="8 mm", bf="400 mm", tf="20 mm")
    assert A.shear(g7, "S355", a="1.5 m").clause.endswith("G2.2(b)(1)")


def test_stocky_web_G2_6_with_stiffeners():
    g = girder(tw="20 mm", d="800 mm")
    r = A.shear(g, "S355", a="1.0 m")
    assert r.clause.endswith("G2.2(a)")
    assert r.nominal == pytest.approx(0.6 * FY * 0.8 * 0.020, rel=REL)


def test_capacity_rises_as_stiffeners_get_closer():
    g = girder(tw="8 mm")
    caps = [A.shear(g, "S355", a=f"{a} m", steps=False).capacity for a in (4.0, 3.0, 2.0, 1.5, 1.0, 0.7)]
    assert caps == sorted(caps)


def test_minor_axis_G6():
    w = calckit.section("W18X50")
    r = A.shear(w, "A992", axis="minor")
    Fy = 50 * 6.894757293168361e6
    assert r.nominal == pytest.approx(0.6 * Fy * 2 * w.si.bf_top * w.si.tf_top, rel=REL)
    with pytest.raises(InputError, match="a: got"):
        A.shear(w, "A992", a="1 m", axis="minor")


def test_asd_and_demand():
    w = calckit.section("W24X62")
    r = A.shear(w, "A992", method="ASD", Vu="150 kip")
    assert r.capacity == pytest.approx(r.nominal / 1.50, rel=REL)
    assert r.ratio == pytest.approx(150 * 4448.2216152605 / r.capacity, rel=REL)
    with pytest.raises(UnitsError, match="Vu"):
        A.shear(w, "A992", Vu=150)


def test_steps_and_numeric_path_agree():
    g = girder(tw="8 mm")
    for kw in ({}, {"a": "1.5 m"}, {"a": "1.5 m", "end_panel": True}, {"axis": "minor"}):
        a, b = A.shear(g, "S355", **kw), A.shear(g, "S355", steps=False, **kw)
        assert a.capacity == pytest.approx(b.capacity, rel=1e-12) and a.steps and not b.steps


def test_not_covered_shapes():
    with pytest.raises(NotCoveredError, match="G3"):
        A.shear(Tee(d="200 mm", bf="200 mm", tf="15 mm", tw="10 mm"), "A36")
    with pytest.raises(NotCoveredError, match="G4"):
        A.shear(Hollow(b="200 mm", h="300 mm", t="10 mm"), "A36")


def test_bad_stiffener_spacing():
    with pytest.raises(InputError, match="a: got"):
        A.shear(girder(), "S355", a="0 m")
    with pytest.raises(UnitsError, match="a"):
        A.shear(girder(), "S355", a=1.5)


# ----------------------------------------------------------------------------------------- G2.3
def test_stiffeners_not_required_for_stocky_web():
    r, = A.transverse_stiffener(calckit.section("W18X50"), "A992", a="1 m", Vu="100 kip")
    assert r.data["required"] is False and r.passed is None and "not required" in r.note


def test_stiffener_required_and_sized():
    g = girder(tw="8 mm")
    Vu = "1800 kN"
    info, = A.transverse_stiffener(g, "S355", a="1.5 m", Vu=Vu)
    assert info.data["required"] is True and info.capacity > 0 and info.passed is None
    r1, r2 = A.transverse_stiffener(g, "S355", a="1.5 m", Vu=Vu, stiffener=("120 mm", "12 mm"))
    assert r1.demand == pytest.approx(info.capacity, rel=REL)
    assert r1.capacity == pytest.approx(0.012 * ((2 * 0.12 + 0.008) ** 3 - 0.008 ** 3) / 12, rel=REL)
    assert r2.capacity == pytest.approx(0.56 * math.sqrt(210e9 / FY), rel=REL)
    single, _ = A.transverse_stiffener(g, "S355", a="1.5 m", Vu=Vu, stiffener=("120 mm", "12 mm"), pair=False)
    assert single.capacity == pytest.approx(0.012 * 0.12 ** 3 / 3, rel=REL)
    thin = A.transverse_stiffener(g, "S355", a="1.5 m", Vu=Vu, stiffener=("200 mm", "8 mm"))
    assert thin[1].passed is False  # b/t = 25 > 0.56 sqrt(E/Fy) = 13.6


def test_stiffener_rho_w_grows_with_shear():
    g = girder(tw="8 mm")
    lo, = A.transverse_stiffener(g, "S355", a="1.5 m", Vu="1300 kN")
    hi, = A.transverse_stiffener(g, "S355", a="1.5 m", Vu="2200 kN")
    assert hi.data["rho_w"] >= lo.data["rho_w"]
    assert hi.capacity >= lo.capacity
    assert lo.data["Ist2"] <= lo.capacity <= lo.data["Ist1"] or lo.data["rho_w"] == 0.0
