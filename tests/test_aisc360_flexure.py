"""calckit.design.aisc360 flexure (AISC 360-22 Chapter F) and classification (Table B4.1b).

Engineering values are validated in tests/validation/test_aisc_design_examples.py and
test_aisc_manual_tables.py; this file checks behaviour: which section of Chapter F applies, continuity and
monotony of phi_b Mn in Lb (property-based), limits, units at the boundary and bad input.
"""
from __future__ import annotations

import math
import warnings

import pytest
from hypothesis import given, settings, strategies as st

import calckit
from calckit.design import aisc360 as A
from calckit.errors import InputError, NotCoveredError, UnitsError
from calckit.sections import Channel, Hollow, SolidRect, Tee

REL = 1e-9
FT = 0.3048
E = 29000.0
FY = 50.0


@pytest.fixture(scope="module")
def w18():
    return calckit.section("W18X50")


# ------------------------------------------------------------------------------------ classification
def test_classification_limits_rolled(w18):
    """Table B4.1b Cases 10 and 15: 0.38, 1.0, 3.76, 5.70 sqrt(E/Fy)."""
    c = A.classify(w18, "A992")
    r = math.sqrt(E / FY)
    assert c.flange.lam_p == pytest.approx(0.38 * r, rel=REL)
    assert c.flange.lam_r == pytest.approx(1.0 * r, rel=REL)
    assert c.web.lam_p == pytest.approx(3.76 * r, rel=REL)
    assert c.web.lam_r == pytest.approx(5.70 * r, rel=REL)
    assert c.flange.lam == pytest.approx(7.5 / (2 * 0.57), rel=REL)
    assert (c.flange.case, c.web.case) == (10, 15)
    assert c.section_class == "compact"
    assert c.steps and c.kc is None


def test_classification_built_up_flange_uses_kc():
    """Table B4.1b Case 11: lambda_r = 0.95 sqrt(kc E/FL), kc = 4/sqrt(h/tw) within 0.35..0.76."""
    pg = calckit.PlateGirder(d="1200 mm", tw="10 mm", bf_top="400 mm", tf_top="20 mm")
    c = A.classify(pg, "S355")
    h_tw = (1200 - 40) / 10
    kc = min(max(4 / math.sqrt(h_tw), 0.35), 0.76)
    assert c.kc == pytest.approx(kc, rel=REL)
    assert c.FL == pytest.approx(0.7 * 355e6, rel=REL)
    assert c.flange.lam_r == pytest.approx(0.95 * math.sqrt(kc * 210e9 / (0.7 * 355e6)), rel=REL)
    assert c.flange.case == 11
    # kc bounds
    thick = calckit.PlateGirder(d="400 mm", tw="20 mm", bf_top="300 mm", tf_top="20 mm")
    assert A.classify(thick, "S355").kc == 0.76
    thin = calckit.PlateGirder(d="3000 mm", tw="8 mm", bf_top="600 mm", tf_top="30 mm")
    assert A.classify(thin, "S355").kc == 0.35


@pytest.mark.parametrize("tf_mm, expected", [(30, "compact"), (16, "noncompact"), (8, "slender")])
def test_flange_classes(tf_mm, expected):
    pg = calckit.PlateGirder(d="1000 mm", tw="12 mm", bf_top="400 mm", tf_top=f"{tf_mm} mm")
    assert A.classify(pg, "S355").flange.cls == expected


@pytest.mark.parametrize("tw_mm, expected", [(16, "compact"), (9, "noncompact"), (6, "slender")])
def test_web_classes(tw_mm, expected):
    pg = calckit.PlateGirder(d="1000 mm", tw=f"{tw_mm} mm", bf_top="400 mm", tf_top="30 mm")
    assert A.classify(pg, "S355").web.cls == expected


def test_singly_symmetric_web_uses_case_16():
    pg = calckit.PlateGirder(d="1000 mm", tw="10 mm", bf_top="400 mm", tf_top="25 mm", bf_bot="250 mm",
                             tf_bot="20 mm")
    top = A.classify(pg, "S355", compression="top")
    bot = A.classify(pg, "S355", compression="bottom")
    assert top.web.case == bot.web.case == 16
    assert top.web.lam < bot.web.lam  # the larger top flange pulls the centroid up: smaller hc
    assert top.web.lam_p <= top.web.lam_r


def test_minor_axis_classification(w18):
    c = A.classify(w18, "A992", axis="minor")
    assert c.web is None and c.flange.case == 13
    with pytest.raises(InputError, match="axis"):
        A.classify(w18, "A992", axis="z")


# ----------------------------------------------------------------------------------- section choice
@pytest.mark.parametrize("kw, F", [
    (dict(d="1000 mm", tw="16 mm", bf_top="300 mm", tf_top="25 mm"), "F2"),
    (dict(d="1000 mm", tw="16 mm", bf_top="400 mm", tf_top="16 mm"), "F3"),
    (dict(d="1000 mm", tw="9 mm", bf_top="400 mm", tf_top="30 mm"), "F4"),
    (dict(d="1000 mm", tw="16 mm", bf_top="400 mm", tf_top="30 mm", bf_bot="250 mm", tf_bot="20 mm"), "F4"),
    (dict(d="1000 mm", tw="6 mm", bf_top="400 mm", tf_top="30 mm"), "F5"),
])
def test_chapter_F_section_selected(kw, F):
    r = A.flexure(calckit.PlateGirder(**kw), "S355", Lb="4 m")
    assert r.data["section_F"] == F
    assert r.clause.startswith("AISC 360-22 " + F[0:2])


def test_doubly_symmetric_same_either_flange(w18):
    a = A.flexure(w18, "A992", Lb="20 ft", compression="top")
    b = A.flexure(w18, "A992", Lb="20 ft", compression="bottom")
    assert a.capacity == pytest.approx(b.capacity, rel=REL)


def test_slender_flange_F3_uses_eq_F3_2():
    pg = calckit.PlateGirder(d="1000 mm", tw="16 mm", bf_top="500 mm", tf_top="10 mm")
    r = A.flexure(pg, "S355", Lb=0)
    assert r.clause.endswith("F3.2(b)")
    lam = 500 / 20
    kc = min(max(4 / math.sqrt((1000 - 20) / 16), 0.35), 0.76)
    assert r.nominal == pytest.approx(0.9 * 210e9 * kc * pg.si.Sx / lam ** 2, rel=REL)


def test_F5_tension_flange_yielding_when_tension_flange_is_smaller():
    pg = calckit.PlateGirder(d="2000 mm", tw="8 mm", bf_top="450 mm", tf_top="30 mm", bf_bot="300 mm",
                             tf_bot="20 mm")
    r = A.flexure(pg, "S355", Lb=0, compression="top")
    assert r.data["section_F"] == "F5"
    assert r.data["Mn_TFY"] == pytest.approx(355e6 * pg.si.Sx_bot, rel=REL)


def test_minor_axis_F6(w18):
    r = A.flexure(w18, "A992", axis="minor")
    p = w18.si
    Fy = 50 * 6.894757293168361e6
    assert r.nominal == pytest.approx(min(Fy * p.Zy, 1.6 * Fy * p.Sy), rel=REL)
    assert r.clause.endswith("F6.1")


def test_minor_axis_noncompact_flange_F6_2():
    r = A.flexure(calckit.section("W21X48"), "A992", axis="minor")
    assert r.clause.endswith("F6.2(b)") and r.nominal < r.data["Mp"]


def test_channel_F2_c_factor():
    c = Channel(d="300 mm", bf="90 mm", tf="13 mm", tw="9 mm", r="8 mm")
    r = A.flexure(c, "A36", Lb="3 m")
    p = c.si
    assert r.data["c"] == pytest.approx(p.ho / 2 * math.sqrt(p.Iy / p.Cw), rel=REL)


# ------------------------------------------------------------------------------- not covered shapes
@pytest.mark.parametrize("sec, clause", [
    (Tee(d="200 mm", bf="200 mm", tf="15 mm", tw="10 mm"), "F9"),
    (Hollow(b="200 mm", h="300 mm", t="10 mm"), "F7"),
    (SolidRect(b="50 mm", h="200 mm"), "F11"),
])
def test_not_covered_shapes_name_the_section(sec, clause):
    with pytest.raises(NotCoveredError, match=clause):
        A.flexure(sec, "A36", Lb=0)


def test_channel_with_noncompact_flange_not_covered():
    c = Channel(d="300 mm", bf="120 mm", tf="6 mm", tw="6 mm")
    with pytest.raises(NotCoveredError, match="F2"):
        A.flexure(c, "A36", Lb=0)


# ------------------------------------------------------------------------------------------ inputs
def test_lb_inputs(w18):
    a = A.flexure(w18, "A992", Lb="11.7 ft")
    b = A.flexure(w18, "A992", Lb=calckit.Q_(11.7, "ft"))
    c = A.flexure(w18, "A992", Lb="3.566 m")
    assert a.capacity == pytest.approx(b.capacity, rel=REL)
    assert a.capacity == pytest.approx(c.capacity, rel=1e-4)
    assert A.flexure(w18, "A992", Lb=0).limit_state == "Flexure: yielding"
    with pytest.raises(UnitsError, match="Lb"):
        A.flexure(w18, "A992", Lb=11.7)
    with pytest.raises(InputError, match="Lb: got -1 ft"):
        A.flexure(w18, "A992", Lb="-1 ft")
    with pytest.raises(UnitsError, match="Lb"):
        A.flexure(w18, "A992", Lb="5 kip")


@pytest.mark.parametrize("Cb", [0.8, 3.5])
def test_cb_outside_usual_range_warns_and_notes(w18, Cb):
    with pytest.warns(UserWarning, match="Cb"):
        r = A.flexure(w18, "A992", Lb="20 ft", Cb=Cb)
    assert "Cb" in r.note and r.data["Cb"] == Cb  # used as given, not clamped
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        base = A.flexure(w18, "A992", Lb="20 ft", Cb=1.0)
    assert (r.nominal < base.nominal) if Cb < 1 else (r.nominal >= base.nominal)


@pytest.mark.parametrize("Cb", [0, -1.0, float("nan"), "x"])
def test_bad_cb(w18, Cb):
    with pytest.raises(InputError, match="Cb"):
        A.flexure(w18, "A992", Lb="5 ft", Cb=Cb)


def test_demand_fills_ratio_and_failing_is_a_result(w18):
    r = A.flexure(w18, "A992", Lb="35 ft", Mu="500 kip*ft")
    assert r.passed is False and r.ratio > 1 and r.status == "NOT OK"
    ok = A.flexure(w18, "A992", Lb=0, Mu="266 kip*ft")
    assert ok.passed and ok.ratio == pytest.approx(266 * 1355.8179483314 / ok.capacity, rel=REL)
    with pytest.raises(UnitsError, match="Mu"):
        A.flexure(w18, "A992", Lb=0, Mu=266)


def test_asd_over_lrfd_ratio(w18):
    for Lb in ("0 ft", "10 ft", "30 ft"):
        lr = A.flexure(w18, "A992", Lb=Lb)
        asd = A.flexure(w18, "A992", Lb=Lb, method="ASD")
        assert asd.nominal == pytest.approx(lr.nominal, rel=REL)
        assert asd.capacity == pytest.approx(lr.nominal / 1.67, rel=REL)
        assert asd.data["Omega_b"] == 1.67 and lr.data["phi_b"] == 0.90


def test_steps_and_numeric_path_agree(w18):
    pgs = [w18, calckit.PlateGirder(d="1000 mm", tw="9 mm", bf_top="400 mm", tf_top="16 mm"),
           calckit.PlateGirder(d="1500 mm", tw="8 mm", bf_top="450 mm", tf_top="30 mm", bf_bot="300 mm",
                               tf_bot="20 mm")]
    for s in pgs:
        for Lb in ("0 m", "3 m", "8 m", "20 m"):
            for comp in ("top", "bottom"):
                a = A.flexure(s, "A572-50", Lb=Lb, Cb=1.2, compression=comp)
                b = A.flexure(s, "A572-50", Lb=Lb, Cb=1.2, compression=comp, steps=False)
                assert b.steps == () and len(a.steps) > 5
                assert a.capacity == pytest.approx(b.capacity, rel=1e-12)
                assert a.limit_state == b.limit_state and a.clause == b.clause


# ----------------------------------------------------------------------- properties (hypothesis)
SECTIONS = {
    "W18X50": lambda: calckit.section("W18X50"),
    "W21X48": lambda: calckit.section("W21X48"),
    "F4 mono": lambda: calckit.PlateGirder(d="1000 mm", tw="10 mm", bf_top="400 mm", tf_top="25 mm",
                                           bf_bot="250 mm", tf_bot="20 mm"),
    "F5": lambda: calckit.PlateGirder(d="1600 mm", tw="8 mm", bf_top="450 mm", tf_top="25 mm"),
}
_CACHE: dict = {}


def _sec(name):
    if name not in _CACHE:
        _CACHE[name] = SECTIONS[name]()
    return _CACHE[name]


def _cap(s, Lb_m, Cb=1.0, comp="top"):
    return A.flexure(s, "A992", Lb=f"{Lb_m} m", Cb=Cb, compression=comp, steps=False)


@settings(max_examples=60, deadline=None)
@given(name=st.sampled_from(sorted(SECTIONS)), Lb=st.floats(0.0, 40.0), dL=st.floats(0.0, 5.0),
       Cb=st.floats(1.0, 3.0), comp=st.sampled_from(["top", "bottom"]))
def test_capacity_non_increasing_in_Lb_and_bounded(name, Lb, dL, Cb, comp):
    s = _sec(name)
    r1, r2 = _cap(s, Lb, Cb, comp), _cap(s, Lb + dL, Cb, comp)
    assert r2.capacity <= r1.capacity * (1 + 1e-12)
    Mp = 0.9 * 50 * 6.894757293168361e6 * s.si.Zx  # A992: Fy = 50 ksi
    assert r1.capacity <= Mp * (1 + 1e-9)


@settings(max_examples=30, deadline=None)
@given(name=st.sampled_from(sorted(SECTIONS)), which=st.sampled_from(["Lp", "Lr"]),
       comp=st.sampled_from(["top", "bottom"]))
def test_capacity_continuous_at_Lp_and_Lr(name, which, comp):
    """Continuous at Lp; at Lr within REL_LR_JUMP: Eqs. F2-6 / F4-8 carry the rounded constants 1.95 and
    6.76 of the exact inverse of Eq. F2-4 / F4-5, so Fcr(Lr) is 0.05-0.17 % below 0.7 Fy (or FL); the
    jump is always downward, so the capacity stays non-increasing (checked for every W shape below)."""
    s = _sec(name)
    L0 = _cap(s, 1.0, 1.0, comp).data[which]
    eps = 1e-9 * L0
    lo, hi = _cap(s, L0 - eps, 1.0, comp).capacity, _cap(s, L0 + eps, 1.0, comp).capacity
    assert hi <= lo * (1 + 1e-9)
    assert hi == pytest.approx(lo, rel=1e-6 if which == "Lp" else REL_LR_JUMP)


REL_LR_JUMP = 2e-3


def test_jump_at_Lr_is_small_and_downward_for_every_W_shape():
    from calckit.sections import catalog

    for s in catalog("W"):
        r = A.flexure(s, "A992", Lb=0, steps=False)
        Lr = r.data["Lr"]
        lo = _cap(s, Lr * (1 - 1e-9)).data["Mn_LTB"]
        hi = _cap(s, Lr * (1 + 1e-9)).data["Mn_LTB"]
        assert lo * (1 - REL_LR_JUMP) <= hi <= lo, s.name
