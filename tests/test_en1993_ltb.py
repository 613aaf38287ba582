"""calckit.design.en1993.ltb and .mcr: EN 1993-1-1:2005 6.3.2.2/6.3.2.3 and the three-factor M_cr formula
(ENV 1993-1-1 Annex F / NCCI SN003, from memory). Closed-form checks written out here."""
from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import calckit
from calckit.design import en1993
from calckit.design.en1993.ltb import kc_table66
from calckit.design.en1993.mcr import mcr_energy, mcr_formula, standard_diagram
from calckit.errors import InputError, NotCoveredError

REL = 1e-9
CURVES = ["a", "b", "c", "d"]


@settings(max_examples=200, deadline=None)
@given(lam=st.floats(0.0, 4.0), dl=st.floats(1e-4, 0.5), curve=st.sampled_from(CURVES),
       method=st.sampled_from(["general", "rolled"]))
def test_chi_lt_bounded_and_non_increasing(lam, dl, curve, method):
    c1 = en1993.chi_lt(lam, curve, method)
    c2 = en1993.chi_lt(lam + dl, curve, method)
    assert 0 < c2 <= c1 + 1e-12 <= 1.0 + 1e-12
    if method == "rolled":
        assert c1 * lam ** 2 <= 1 + 1e-12  # 6.3.2.3(1): chi_LT <= 1/lambda_LT^2


@settings(max_examples=100, deadline=None)
@given(lam=st.floats(0.05, 3.0), curve=st.sampled_from(CURVES), method=st.sampled_from(["general", "rolled"]))
def test_chi_lt_continuous(lam, curve, method):
    h = 1e-7
    assert abs(en1993.chi_lt(lam + h, curve, method) - en1993.chi_lt(lam, curve, method)) < 1e-5


def test_chi_lt_closed_forms():
    lam, a = 1.0, 0.34
    phi = 0.5 * (1 + a * (lam - 0.2) + lam ** 2)  # (6.56)
    assert en1993.chi_lt(lam, "b") == pytest.approx(1 / (phi + math.sqrt(phi ** 2 - lam ** 2)), rel=REL)
    phi = 0.5 * (1 + a * (lam - 0.4) + 0.75 * lam ** 2)  # (6.57)
    assert en1993.chi_lt(lam, "b", "rolled") == pytest.approx(1 / (phi + math.sqrt(phi ** 2 - 0.75 * lam ** 2)), rel=REL)
    assert en1993.chi_lt(0.3, "c", "rolled") == 1.0  # plateau


def test_result_attributes_and_general_method():
    s = calckit.section("IPE 300")
    r = en1993.ltb(s, "S275", L="4 m", C1=1.0, method="general", M_Ed="60 kN*m")
    si = s.si
    E, G = 210e9, 210e9 / 2.6
    Mcr = math.pi ** 2 * E * si.Iy / 16 * math.sqrt(si.Cw / si.Iy + 16 * G * si.J / (math.pi ** 2 * E * si.Iy))
    assert r.Mcr == pytest.approx(Mcr, rel=REL)
    lam = math.sqrt(si.Zx * 275e6 / Mcr)
    assert r.lambda_LT == pytest.approx(lam, rel=REL)
    assert r.data["curve"] == "a"  # Table 6.4: rolled I with h/b = 300/150 = 2.0 <= 2: curve a
    assert r.chi_LT == pytest.approx(en1993.chi_lt(lam, r.data["curve"], "general"), rel=REL)
    assert r.capacity == pytest.approx(r.chi_LT * si.Zx * 275e6, rel=REL)
    assert r.ratio == pytest.approx(60e3 / r.capacity, rel=REL) and r.clause.endswith("6.3.2.2")
    assert len(r.steps) > 5


def test_mcr_shown_in_three_steps_with_one_value():
    # three-factor formula (ENV 1993-1-1 Annex F Eq. (F.2), from memory) written out here with k = 0.7,
    # k_w = 1, load 100 mm above the shear centre, C1/C2 given: N_cr,z, root term, M_cr in that order
    s = calckit.section("IPE 300")
    si = s.si
    E, G = 210e9, 210e9 / 2.6
    C1, C2, k, zg, L = 1.35, 0.55, 0.7, 0.1, 4.0
    r = en1993.ltb(s, "S275", L="4 m", C1=C1, C2=C2, k=k, zg="100 mm", method="general", M_Ed="60 kN*m")
    syms = [getattr(st_, "symbol", None) for st_ in r.steps]
    i = syms.index("N_cr_z")
    assert syms[i:i + 3] == ["N_cr_z", "R_LT", "M_cr"]
    N = math.pi ** 2 * E * si.Iy / (k * L) ** 2
    root = math.sqrt(k ** 2 * si.Cw / si.Iy + (k * L) ** 2 * G * si.J / (math.pi ** 2 * E * si.Iy) + (C2 * zg) ** 2)
    assert r.steps[i].result == pytest.approx(N, rel=REL)
    assert r.steps[i + 1].result == pytest.approx(root, rel=REL)
    assert r.Mcr == r.steps[i + 2].result == pytest.approx(C1 * N * (root - C2 * zg), rel=REL)
    fast = en1993.ltb(s, "S275", L="4 m", C1=C1, C2=C2, k=k, zg="100 mm", method="general", steps=False)
    assert fast.Mcr == r.Mcr and fast.steps == ()  # same formulas on the numeric path


def test_modification_factor_f():
    s = calckit.section("IPE 330")
    r = en1993.ltb(s, "S235", L="5.7 m", moment_diagram="udl", method="rolled", use_f=True, M_Ed="90 kN*m")
    kc = 0.94  # Table 6.6, simply supported UDL (from memory)
    f = 1 - 0.5 * (1 - kc) * (1 - 2 * (r.lambda_LT - 0.8) ** 2)
    assert r.kc == kc and r.f == pytest.approx(min(f, 1.0), rel=REL)
    assert r.chi_LT_mod == pytest.approx(min(r.chi_LT / r.f, 1.0, 1 / r.lambda_LT ** 2), rel=REL)
    uk = en1993.ltb(s, "S235", L="5.7 m", moment_diagram="udl", annex="UK")
    assert uk.kc == pytest.approx(1 / math.sqrt(uk.C1), rel=REL)


def test_kc_table66_matching():
    assert kc_table66(standard_diagram("udl"))[0] == 0.94
    assert kc_table66(standard_diagram("point"))[0] == 0.86
    kc, case, psi = kc_table66(standard_diagram("linear", -0.5))
    assert psi == pytest.approx(-0.5) and kc == pytest.approx(1 / (1.33 + 0.165))
    assert kc_table66(lambda q: np.sin(3 * np.pi * q) + 0.3)[0] is None


def test_monosymmetric_Wagner_effect_and_C3():
    big_top = calckit.PlateGirder(d="800 mm", tw="10 mm", bf_top="300 mm", tf_top="20 mm", bf_bot="150 mm",
                                  tf_bot="15 mm")
    sag = en1993.ltb(big_top, "S355", L="6 m", moment_diagram="uniform", method="general")
    hog = en1993.ltb(big_top, "S355", L="6 m", moment_diagram=(np.array([0, 6.0]), -np.ones(2) * 1e5),
                     method="general")
    assert sag.zj > 0 and hog.zj < 0
    assert sag.Mcr > hog.Mcr  # larger flange in compression buckles later
    assert sag.C3 == pytest.approx(1.0, rel=1e-6)  # uniform moment: C3 = 1 (ENV Table F.1.1)
    assert hog.C3 == pytest.approx(1.0, rel=1e-6)


def test_energy_solution_uniform_moment_closed_form():
    E, G = 210e9, 80.77e9
    EIz, GIt, EIw, L = E * 1e-5, G * 5e-7, E * 2e-7, 6.0
    exact = math.pi / L * math.sqrt(EIz * GIt * (1 + math.pi ** 2 * EIw / (GIt * L ** 2)))
    assert mcr_energy(L, EIz, GIt, EIw, standard_diagram("uniform")) == pytest.approx(exact, rel=1e-9)
    assert mcr_formula(1, 0, 0, L, EIz, GIt, EIw) == pytest.approx(exact, rel=1e-12)


def test_bad_inputs():
    s = calckit.section("IPE 300")
    with pytest.raises(InputError):
        en1993.ltb(s, "S235", L="-3 m")
    with pytest.raises(InputError):
        en1993.ltb(s, "S235", L="3 m", k=0.3)
    with pytest.raises(NotCoveredError):
        en1993.ltb(s, "S235", L="3 m", moment_diagram="udl", k=0.7)
    with pytest.raises(InputError):
        en1993.ltb(s, "S235", L="3 m", C1=1.5, zg="150 mm")  # C2 unknown
    with pytest.raises(InputError):
        en1993.ltb(s, "S235", L="3 m", moment_diagram=(np.array([0, 2.0]), np.array([1e4, 2e4])))  # x != L
    with pytest.raises(InputError):
        en1993.ltb(s, "S235", L="3 m", method="fast")
    ok = en1993.ltb(s, "S235", L="3 m", C1=1.2, k=0.7)  # explicit C1 with k = 0.7 is fine
    assert ok.data["k"] == 0.7


def test_moment_diagram_forms_agree():
    s = calckit.section("IPE 330")
    L = 5.7
    x = np.linspace(0, L, 57)
    M = 90e3 * 4 * x * (L - x) / L ** 2
    a = en1993.ltb(s, "S235", L="5.7 m", moment_diagram=(x, M), steps=False)
    b = en1993.ltb(s, "S235", L="5.7 m", moment_diagram=M, steps=False)
    c = en1993.ltb(s, "S235", L="5.7 m", moment_diagram=lambda xx: 90e3 * 4 * xx * (L - xx) / L ** 2, steps=False)
    d = en1993.ltb(s, "S235", L="5.7 m", moment_diagram="udl", M_Ed="90 kN*m", steps=False)
    q = en1993.ltb(s, "S235", L="5.7 m", moment_diagram=calckit.Q_(M / 1e3, "kN*m"), steps=False)
    for r in (b, c, d, q):
        assert r.C1 == pytest.approx(a.C1, rel=1e-3)
        assert r.demand == pytest.approx(90e3, rel=1e-3)
