"""calckit.design.en1993.classify: EN 1993-1-1:2005 Table 5.2 (limits written out here from the table)."""
from __future__ import annotations

import math

import pytest

import calckit
from calckit.design import en1993
from calckit.errors import InputError, NotCoveredError

REL = 1e-9


def test_ipe330_s235_class1_ratios():
    s = calckit.section("IPE 330")  # h 330, b 160, tw 7.5, tf 11.5, r 18 mm
    c = en1993.classify(s, "S235")
    assert c.flange_ratio == pytest.approx((160 - 7.5 - 36) / 2 / 11.5, rel=REL)
    assert c.web_ratio == pytest.approx((330 - 23 - 36) / 7.5, rel=REL)
    assert c.web_limits == pytest.approx((72, 83, 124), rel=1e-9)  # alpha 0.5, psi -1, eps 1
    assert c.cls == 1 and len(c.steps) > 5


def _girder(bf_mm, tf_mm, tw_mm=12.0, d_mm=800.0, weld_mm=6.0, **kw):
    return calckit.PlateGirder(d=f"{d_mm} mm", tw=f"{tw_mm} mm", bf_top=f"{bf_mm} mm", tf_top=f"{tf_mm} mm",
                               weld=f"{weld_mm} mm", **kw)


@pytest.mark.parametrize("ratio_eps,cls", [(8.9, 1), (9.5, 2), (13.5, 3), (14.5, 4)])
def test_welded_flange_outstand_limits(ratio_eps, cls):
    eps = math.sqrt(235 / 355)
    tf = 20.0
    c = ratio_eps * eps * tf
    bf = 2 * c + 12.0 + 2 * 6.0  # c = (b - tw - 2 a sqrt2)/2 with a sqrt2 = weld leg
    r = en1993.classify(_girder(bf, tf), "S355")
    assert r.c_f == pytest.approx(c * 1e-3, rel=1e-9)
    assert r.flange_class == cls


def test_web_c_uses_weld_leg_and_limits():
    r = en1993.classify(_girder(300, 20, tw_mm=8, d_mm=1000), "S235")
    assert r.c_w == pytest.approx((1000 - 40 - 12) * 1e-3, rel=REL)
    assert r.web_ratio == pytest.approx(948 / 8, rel=REL)  # 118.5: Class 3 (83 < 118.5 <= 124)
    assert r.web_class == 3 and r.cls == 3


def test_monosymmetric_alpha_and_psi_from_neutral_axes():
    g = calckit.PlateGirder(d="1000 mm", tw="10 mm", bf_top="400 mm", tf_top="25 mm", bf_bot="250 mm",
                            tf_bot="20 mm", weld="0 mm")
    s = g.si
    r = en1993.classify(g, "S235", sagging=True)
    y_top, y_bot = s.d - s.tf_top, s.tf_bot
    assert r.alpha == pytest.approx((y_top - s.y_pna) / (y_top - y_bot), rel=1e-9)
    assert r.psi == pytest.approx((y_bot - s.y_c) / (y_top - s.y_c), rel=1e-9)
    lim3 = 62 * (1 - r.psi) * math.sqrt(-r.psi) if r.psi <= -1 else 42 / (0.67 + 0.33 * r.psi)
    assert r.web_limits[2] == pytest.approx(lim3, rel=1e-9)
    h = en1993.classify(g, "S235", sagging=False)
    assert h.compression_flange == "bottom" and h.t_f == pytest.approx(0.020)
    assert h.alpha == pytest.approx(1 - r.alpha, rel=1e-9)


def test_axial_force_without_moment_takes_psi_one():
    r = en1993.classify(calckit.section("IPE 300"), "S235", N_Ed="100 kN")
    assert r.psi == pytest.approx(1.0) and "psi = 1" in r.note
    s = calckit.section("IPE 300").si
    c = s.h_clear
    # doubly symmetric I with the plastic axis in the web: alpha = (c/2 + N/(2 t_w f_y))/c (common practice)
    assert r.alpha == pytest.approx((c / 2 + 100e3 / (2 * s.tw * 235e6)) / c, rel=1e-6)


def test_bad_inputs():
    with pytest.raises(NotCoveredError):
        en1993.classify(calckit.sections.Channel("200 mm", "75 mm", "11 mm", "8.5 mm"), "S235")
    with pytest.raises(InputError):
        en1993.classify(calckit.section("IPE 300"), "A992")  # not an EN grade
    thick = calckit.PlateGirder(d="1000 mm", tw="12 mm", bf_top="500 mm", tf_top="100 mm")
    with pytest.raises(InputError, match="flange"):  # 100 mm is beyond EN 1993-1-1 Table 3.1 bands
        en1993.classify(thick, "S355")
