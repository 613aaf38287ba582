"""calckit.design.aisc360 concentrated forces (AISC 360-22 J10.1-J10.3) and deflection limits.

J10 expected values are recomputed in the tests from the Specification's equations written out here
(AISC 360-22 Eqs. J10-1 to J10-5b, from memory; "R: recomputed"). Deflection defaults: common practice,
IBC Table 1604.3 (from memory).
"""
from __future__ import annotations

import math

import pytest

import calckit
from calckit.design import aisc360 as A
from calckit.errors import InputError, NotCoveredError, UnitsError
from calckit.sections import Hollow

REL = 1e-9
IN = 0.0254
KIP = 4448.2216152605
FY = 50.0
E = 29000.0


@pytest.fixture(scope="module")
def w18():
    return calckit.section("W18X50")


def _wly(tw, k, lb, near_end):
    return FY * tw * ((2.5 if near_end else 5.0) * k + lb)


def _wcr(tw, tf, d, lb, near_end):
    r = (tw / tf) ** 1.5
    root = math.sqrt(E * FY * tf / tw)
    if not near_end:
        return 0.80 * tw ** 2 * (1 + 3 * (lb / d) * r) * root
    if lb / d <= 0.2:
        return 0.40 * tw ** 2 * (1 + 3 * (lb / d) * r) * root
    return 0.40 * tw ** 2 * (1 + (4 * lb / d - 0.2) * r) * root


@pytest.mark.parametrize("lb, x_end", [(3.25, None), (3.25, 0.0), (4.0, 0.0), (6.0, 12.0), (6.0, 5.0)])
def test_web_local_yielding_and_crippling_recomputed(w18, lb, x_end):
    """R: recomputed, W18X50 (d 18.0, tw 0.355, tf 0.570, k_des 0.972 in, catalog from memory), A992."""
    d, tw, tf, k = 18.0, 0.355, 0.570, 0.972
    xe = math.inf if x_end is None else x_end
    rs = A.concentrated(w18, "A992", lb=f"{lb} in", x_end=None if x_end is None else f"{x_end} in")
    wly, wcr = rs
    assert wly.limit_state.endswith("web local yielding") and wcr.limit_state.endswith("web crippling")
    assert wly.nominal / KIP == pytest.approx(_wly(tw, k, lb, xe <= d), rel=1e-6)
    assert wcr.nominal / KIP == pytest.approx(_wcr(tw, tf, d, lb, xe < d / 2), rel=1e-6)
    assert wly.capacity == pytest.approx(1.00 * wly.nominal, rel=REL)
    assert wcr.capacity == pytest.approx(0.75 * wcr.nominal, rel=REL)
    asd = A.concentrated(w18, "A992", lb=f"{lb} in", x_end=None if x_end is None else f"{x_end} in",
                         method="ASD")
    assert asd[0].capacity == pytest.approx(wly.nominal / 1.50, rel=REL)
    assert asd[1].capacity == pytest.approx(wcr.nominal / 2.00, rel=REL)


def test_flange_local_bending_tension(w18):
    """J10-1: Rn = 6.25 Fyf tf^2, halved within 10 tf of the member end (R: recomputed)."""
    far = A.flange_local_bending(w18, "A992")
    near = A.flange_local_bending(w18, "A992", x_end="3 in")
    assert far.nominal / KIP == pytest.approx(6.25 * FY * 0.570 ** 2, rel=1e-6)
    assert near.nominal == pytest.approx(0.5 * far.nominal, rel=REL)
    assert far.capacity == pytest.approx(0.90 * far.nominal, rel=REL)
    assert A.flange_local_bending(w18, "A992", width="0.5 in") is None  # < 0.15 bf: not checked
    rs = A.concentrated(w18, "A992", lb="2 in", tension=True)
    assert [r.limit_state.split(": ")[1] for r in rs] == ["flange local bending", "web local yielding"]


def test_failing_force_says_stiffeners_required(w18):
    rs = A.concentrated(w18, "A992", lb="3 in", x_end=0, Ru="120 kip")
    bad = [r for r in rs if not r.passed]
    assert bad and all("stiffeners are required" in r.note for r in bad)
    ok = A.concentrated(w18, "A992", lb="3 in", x_end=0, Ru="10 kip")
    assert all(r.passed and r.note == "" for r in ok)


def test_welded_girder_k_uses_weld_leg():
    g = calckit.PlateGirder(d="1000 mm", tw="10 mm", bf_top="300 mm", tf_top="20 mm", weld="8 mm")
    r = A.web_local_yielding(g, "S355", lb="100 mm")
    assert r.nominal == pytest.approx(355e6 * 0.010 * (5 * 0.028 + 0.1), rel=REL)
    assert r.data["k"] == pytest.approx(0.028, rel=REL)


def test_bottom_flange_of_a_singly_symmetric_girder():
    g = calckit.PlateGirder(d="1000 mm", tw="10 mm", bf_top="300 mm", tf_top="30 mm", bf_bot="250 mm",
                            tf_bot="15 mm")
    top = A.web_crippling(g, "S355", lb="100 mm", flange="top")
    bot = A.web_crippling(g, "S355", lb="100 mm", flange="bottom")
    assert top.nominal != bot.nominal


def test_concentrated_bad_input(w18):
    with pytest.raises(InputError, match="lb"):
        A.concentrated(w18, "A992", lb="-1 in")
    with pytest.raises(UnitsError, match="lb"):
        A.concentrated(w18, "A992", lb=3)
    with pytest.raises(InputError, match="flange"):
        A.concentrated(w18, "A992", lb="3 in", flange="left")
    with pytest.raises(NotCoveredError, match="J10"):
        A.concentrated(Hollow(b="200 mm", h="300 mm", t="10 mm"), "A36", lb="3 in")


# ----------------------------------------------------------------------------------------- deflection
def test_deflection_defaults_common_practice():
    """Common practice (IBC Table 1604.3, from memory): floor L/360 live, L/240 total; roof L/240, L/180."""
    r = A.deflection("1.0 in", "35 ft")
    assert r.capacity == pytest.approx(35 * 12 / 360 * IN, rel=REL) and r.passed
    assert A.deflection("1.0 in", "35 ft", case="total").capacity == pytest.approx(35 * 12 / 240 * IN, rel=REL)
    assert A.deflection("1.0 in", "35 ft", member="roof").data["n"] == 240
    assert A.deflection("1.0 in", "35 ft", member="roof", case="total").data["n"] == 180
    assert A.deflection("2.0 in", "35 ft", n=480).passed is False


def test_cantilever_uses_twice_the_length():
    r = A.deflection("10 mm", "2 m", cantilever=True)
    assert r.capacity == pytest.approx(2 * 2.0 / 360, rel=REL)
    assert "twice" in r.note


def test_deflection_bad_input():
    with pytest.raises(InputError, match="case"):
        A.deflection("1 in", "10 ft", case="wind")
    with pytest.raises(InputError, match="member"):
        A.deflection("1 in", "10 ft", member="wall")
    with pytest.raises(InputError, match="limit"):
        A.deflection("1 in", "10 ft", n=-5)
    with pytest.raises(UnitsError, match="delta"):
        A.deflection(1.0, "10 ft")
