"""calckit.design.en1993.shear, .transverse, .deflection: EN 1993-1-1:2005 6.2.6, 7.2; EN 1993-1-5:2006
sections 5 and 6 (expected values written out here from the equations)."""
from __future__ import annotations

import math

import numpy as np
import pytest

import calckit
from calckit.design import en1993
from calckit.errors import InputError

REL = 1e-9


def test_rolled_shear_area_not_less_than_eta_hw_tw():
    s = calckit.section("IPE 300").si
    r = en1993.shear(calckit.section("IPE 300"), "S235")
    assert r.A_v == pytest.approx(max(s.Av_en, 1.2 * s.hw * s.tw), rel=REL)


@pytest.mark.parametrize("tw_mm,branch", [(16, "eta"), (12, "0.83"), (8, "0.83")])
def test_chi_w_branches_non_rigid(tw_mm, branch):
    g = calckit.PlateGirder(d="1050 mm", tw=f"{tw_mm} mm", bf_top="400 mm", tf_top="25 mm")
    r = en1993.shear(g, "S235")
    hw, tw = 1.0, tw_mm * 1e-3
    if hw / tw <= 72 / 1.2:
        assert r.shear_buckling is False
        return
    lam = hw / (86.4 * tw)
    chi = 1.2 if lam < 0.83 / 1.2 else 0.83 / lam
    assert r.chi_w == pytest.approx(chi, rel=REL)


def test_eta_one_above_S460_rule_and_uk():
    g = calckit.PlateGirder(d="1050 mm", tw="8 mm", bf_top="400 mm", tf_top="25 mm")
    assert en1993.shear(g, "S355", annex="UK").eta == 1.0
    assert en1993.shear(g, "S460").eta == 1.2  # S460 is "up to and including S460"


def test_transverse_type_c_and_stiffened_a():
    s = calckit.section("IPE 400")
    si = s.si
    E, fy = 210e9, 235e6
    hw, tw, tf, bf = si.hw, si.tw, si.tf_top, si.bf_top
    ss, c = 0.1, 0.02
    kF = min(2 + 6 * (ss + c) / hw, 6)
    Fcr = 0.9 * kF * E * tw ** 3 / hw
    m1 = bf / tw
    le = min(kF * E * tw ** 2 / (2 * fy * hw), ss + c)

    def ly_of(m2):
        return min(ss + 2 * tf * (1 + math.sqrt(m1 + m2)), le + tf * math.sqrt(m1 / 2 + (le / tf) ** 2 + m2),
                   le + tf * math.sqrt(m1 + m2))

    m2 = 0.02 * (hw / tf) ** 2
    lam = math.sqrt(ly_of(m2) * tw * fy / Fcr)
    if lam <= 0.5:
        m2 = 0.0
        lam = math.sqrt(ly_of(m2) * tw * fy / Fcr)
    FRd = fy * min(0.5 / lam, 1) * ly_of(m2) * tw
    r = en1993.transverse(s, "S235", "100 kN", ss="100 mm", load_type="c", c="20 mm", flange="bottom")
    assert r.capacity == pytest.approx(FRd, rel=REL)
    rs = en1993.transverse(s, "S235", ss="100 mm", load_type="a", a="1 m")
    assert rs.k_F == pytest.approx(6 + 2 * (hw / 1.0) ** 2, rel=REL)
    with pytest.raises(InputError):
        en1993.transverse(s, "S235", ss="100 mm", load_type="c")
    with pytest.raises(InputError):
        en1993.transverse(s, "S235", ss="-1 mm")
    with pytest.raises(InputError):
        en1993.transverse(s, "S235", ss="1 mm", load_type="z")


def test_deflection_limits():
    r = en1993.deflection("20 mm", "6 m")
    assert r.capacity == pytest.approx(6 / 250) and r.passed  # common-practice default L/250
    v = en1993.deflection(np.array([0.0, 0.019, -0.021]), "6 m", kind="variable")
    assert v.capacity == pytest.approx(0.02) and v.demand == pytest.approx(0.021) and v.passed is False
    assert en1993.deflection("10 mm", "6 m", kind="variable", annex="UK").capacity == pytest.approx(6 / 360)
    assert en1993.deflection("10 mm", "6 m", limit=500).capacity == pytest.approx(0.012)
    with pytest.raises(InputError):
        en1993.deflection("10 mm", "6 m", kind="seismic")
    with pytest.raises(InputError):
        en1993.deflection("10 mm", "-6 m")
