"""calckit.design.en1993.bending and .effective: EN 1993-1-1:2005 6.2.5, 6.2.8; EN 1993-1-5:2006 4.4, 7.1.

Expected values are written out here from the standard's equations (independent plate arithmetic).
"""
from __future__ import annotations

import math

import numpy as np
import pytest

import calckit
from calckit.design import en1993
from calckit.errors import InputError, NotCoveredError

REL = 1e-9
EPS355 = math.sqrt(235 / 355)


def plates_I(rects):
    """(A, y_c, I) of rectangles (b, h, y_centre)."""
    A = sum(b * h for b, h, _ in rects)
    yc = sum(b * h * y for b, h, y in rects) / A
    I = sum(b * h ** 3 / 12 + b * h * (y - yc) ** 2 for b, h, y in rects)
    return A, yc, I


def test_class3_uses_elastic_modulus():
    g = calckit.PlateGirder(d="1000 mm", tw="8 mm", bf_top="300 mm", tf_top="20 mm", weld="6 mm")
    r = en1993.bending(g, "S235")
    assert r.data["class"] == 3
    assert r.capacity == pytest.approx(g.si.Sx * 235e6, rel=REL)


def test_class4_flange_effective_width():
    # flange c/t = 238/12 = 19.8 > 14 eps: Class 4; web Class 3
    g = calckit.PlateGirder(d="1000 mm", tw="12 mm", bf_top="500 mm", tf_top="12 mm", weld="6 mm")
    r = en1993.bending(g, "S355")
    assert r.data["flange_class"] == 4 and r.data["web_class"] <= 3
    c, t = 0.238, 0.012
    lp = (c / t) / (28.4 * EPS355 * math.sqrt(0.43))  # EN 1993-1-5 4.4(2)
    rho = (lp - 0.188) / lp ** 2  # (4.3)
    d, tw, hw = 1.0, 0.012, 0.976
    rects = [(0.5, t, t / 2), (tw, hw, d / 2), (0.5, t, d - t / 2), (-2 * (1 - rho) * c, t, d - t / 2)]
    A, yc, I = plates_I(rects)
    W = I / max(d - yc, yc)
    assert r.W_y == pytest.approx(W, rel=1e-9)
    assert r.capacity == pytest.approx(W * 355e6, rel=1e-9)
    assert "4.4" in r.clause


def test_class4_web_effective_width():
    g = calckit.PlateGirder(d="1600 mm", tw="8 mm", bf_top="400 mm", tf_top="30 mm", weld="6 mm")
    r = en1993.bending(g, "S355")
    assert r.data["web_class"] == 4 and r.data["flange_class"] == 1
    cw, tw = 1.540 - 0.012, 0.008
    psi = -1.0
    ks = 23.9  # Table 4.1, psi = -1 (7.81 - 6.29 psi + 9.78 psi^2 = 23.88)
    lp = (cw / tw) / (28.4 * EPS355 * math.sqrt(7.81 + 6.29 + 9.78))
    rho = (lp - 0.055 * (3 + psi)) / lp ** 2
    bc = cw / 2
    beff = rho * bc
    be1 = 0.4 * beff
    hole = bc - beff
    y_top_end = 1.6 - 0.030 - 0.006
    rects = [(0.4, 0.03, 0.015), (tw, 1.54, 0.8), (0.4, 0.03, 1.585), (-tw, hole, y_top_end - be1 - hole / 2)]
    A, yc, I = plates_I(rects)
    assert ks == pytest.approx(23.88, abs=0.02)
    assert r.W_y == pytest.approx(I / max(1.6 - yc, yc), rel=1e-9)


def test_shear_reduction_symmetric_6_30():
    s = calckit.section("IPE 300")
    si = s.si
    Vpl = en1993.shear(s, "S235").capacity
    VEd = 0.8 * Vpl
    r = en1993.bending(s, "S235", "50 kN*m", V_Ed=f"{VEd} N")
    rho = (2 * VEd / Vpl - 1) ** 2
    Aw = si.hw * si.tw
    assert r.rho == pytest.approx(rho, rel=REL)
    assert r.capacity == pytest.approx((si.Zx - rho * Aw ** 2 / (4 * si.tw)) * 235e6, rel=REL)
    assert r.clause.endswith("6.2.8")
    low = en1993.bending(s, "S235", "50 kN*m", V_Ed=f"{0.4 * Vpl} N")
    assert low.capacity == pytest.approx(si.Zx * 235e6, rel=REL) and low.rho is None


def test_shear_reduction_monosymmetric_plastic():
    g = calckit.PlateGirder(d="600 mm", tw="12 mm", bf_top="300 mm", tf_top="20 mm", bf_bot="200 mm",
                            tf_bot="15 mm")
    Vpl = en1993.shear(g, "S235").capacity
    r = en1993.bending(g, "S235", "100 kN*m", V_Ed=f"{0.9 * Vpl} N")
    rho = (2 * 0.9 - 1) ** 2
    # brute force: plastic moment of fibres with the web at (1 - rho) f_y
    y = np.linspace(0, 0.6, 600001)
    b = np.where(y < 0.015, 0.2, np.where(y > 0.58, 0.3, 0.012))
    f = np.where((y >= 0.015) & (y <= 0.58), (1 - rho) * 235e6, 235e6)
    q = b * f
    cum = np.cumsum(q)
    ypna = y[np.searchsorted(cum, cum[-1] / 2)]
    Mp = np.trapezoid(q * np.abs(y - ypna), y)
    assert r.capacity == pytest.approx(Mp, rel=2e-4)


def test_shear_buckling_interaction_7_1():
    g = calckit.PlateGirder(d="1550 mm", tw="10 mm", bf_top="400 mm", tf_top="25 mm", weld="6 mm")
    sh = en1993.shear(g, "S355")
    V = 0.8 * sh.V_bw_Rd
    r = en1993.bending(g, "S355", "1000 kN*m", V_Ed=f"{V} N")
    Mpl = g.si.Zx * 355e6
    Mf = 0.4 * 0.025 * 355e6 * 1.525
    eta3 = 0.8
    Mv = Mpl * (1 - (1 - Mf / Mpl) * (2 * eta3 - 1) ** 2)
    assert r.capacity == pytest.approx(min(max(Mv, Mf), r.M_c_Rd), rel=1e-9)
    assert "7.1" in r.clause


def test_failing_member_is_a_result_and_bad_input():
    s = calckit.section("IPE 200")
    r = en1993.bending(s, "S235", "500 kN*m")
    assert r.passed is False and r.ratio > 1
    with pytest.raises(NotCoveredError, match="axial"):
        en1993.bending(s, "S235", "50 kN*m", N_Ed="10 kN")
    with pytest.raises(InputError):
        en1993.bending(s, "S235", "50 kN*m", annex="nowhere")
    with pytest.raises(calckit.UnitsError):
        en1993.bending(s, "S235", 50.0)
    neg = en1993.bending(s, "S235", "-20 kN*m")
    assert neg.data["compression_flange"] == "bottom" and neg.demand == pytest.approx(20e3)


def test_numeric_path_matches_steps_path():
    s = calckit.section("HEB 300")
    a = en1993.bending(s, "S355", "300 kN*m", V_Ed="700 kN", steps=False)
    b = en1993.bending(s, "S355", "300 kN*m", V_Ed="700 kN", steps=True)
    assert a.capacity == b.capacity and a.steps == () and len(b.steps) > 5
