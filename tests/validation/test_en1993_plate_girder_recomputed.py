"""Welded plate girder: shear buckling and transverse-force resistance, R: RECOMPUTED.

No published worked example is quoted here (none could be recalled with confidence). The expected values
are recomputed in this file from the equations of EN 1993-1-5:2006 written out independently of calckit
(status R): 5.1(2) (eta, 72 eps/eta), 5.2 Eqs. (5.1)-(5.2), 5.3 Eqs. (5.5)-(5.6) and Table 5.1, Annex A.3
Eq. (A.5), 5.4 Eq. (5.8); section 6 Eqs. (6.1)-(6.10) and Figure 6.1; EN 1993-1-1:2005 6.2.6(3)(d).

Girder: web 1500 x 10 mm, flanges 400 x 25 mm, fillet welds 6 mm leg, S355 (all plates <= 40 mm:
f_y = 355 MPa), eta = 1.2, gamma_M0 = gamma_M1 = 1.0 (recommended set). Formula arithmetic: REL = 1e-9.
"""
from __future__ import annotations

import math

import pytest

import calckit
from calckit.design import en1993

REL = 1e-9
E = 210e9
FY = 355e6
HW, TW, BF, TF = 1.5, 0.010, 0.400, 0.025
EPS = math.sqrt(235 / 355)
ETA = 1.2


@pytest.fixture(scope="module")
def girder():
    return calckit.PlateGirder(d=f"{HW + 2 * TF} m", tw=f"{TW} m", bf_top=f"{BF} m", tf_top=f"{TF} m",
                               weld="6 mm", name="PG 1550")


def test_plastic_shear_and_buckling_trigger(girder):
    r = en1993.shear(girder, "S355")
    assert r.A_v == pytest.approx(ETA * HW * TW, rel=REL)  # 6.2.6(3)(d)
    assert r.V_pl_Rd == pytest.approx(ETA * HW * TW * FY / math.sqrt(3), rel=REL)
    assert HW / TW > 72 * EPS / ETA
    assert r.shear_buckling is True


def test_unstiffened_web_non_rigid_end_post(girder):
    lam = HW / (86.4 * TW * EPS)  # (5.5)
    assert lam >= 1.08
    chi = 0.83 / lam  # Table 5.1, non-rigid end post
    vbw = chi * FY * HW * TW / math.sqrt(3)
    r = en1993.shear(girder, "S355", "500 kN")
    assert r.lambda_w == pytest.approx(lam, rel=REL)
    assert r.chi_w == pytest.approx(chi, rel=REL)
    assert r.capacity == pytest.approx(vbw, rel=REL)


@pytest.mark.parametrize("end_post", ["rigid", "non-rigid"])
def test_stiffened_web(girder, end_post):
    a = 2.0
    ktau = 5.34 + 4 * (HW / a) ** 2  # (A.5), a/h_w >= 1
    lam = HW / (37.4 * TW * EPS * math.sqrt(ktau))  # (5.6)
    chi = 1.37 / (0.7 + lam) if end_post == "rigid" else 0.83 / lam
    vbw = chi * FY * HW * TW / math.sqrt(3)
    r = en1993.shear(girder, "S355", a="2 m", end_post=end_post)
    assert r.k_tau == pytest.approx(ktau, rel=REL)
    assert r.lambda_w == pytest.approx(lam, rel=REL)
    assert r.capacity == pytest.approx(min(vbw, ETA * FY * HW * TW / math.sqrt(3)), rel=REL)


def test_short_panel_k_tau(girder):
    a = 1.0
    ktau = 4 + 5.34 * (HW / a) ** 2  # (A.5), a/h_w < 1
    r = en1993.shear(girder, "S355", a="1 m")
    assert r.k_tau == pytest.approx(ktau, rel=REL)


def test_flange_contribution(girder):
    a, MEd = 2.0, 2.0e6
    ktau = 5.34 + 4 * (HW / a) ** 2
    lam = HW / (37.4 * TW * EPS * math.sqrt(ktau))
    vbw = 1.37 / (0.7 + lam) * FY * HW * TW / math.sqrt(3)
    bf = min(BF, 30 * EPS * TF + TW)
    c = a * (0.25 + 1.6 * bf * TF ** 2 * FY / (TW * HW ** 2 * FY))
    mf = BF * TF * FY * (HW + TF)  # flanges alone, h_f between flange centroids
    vbf = bf * TF ** 2 * FY / c * (1 - (MEd / mf) ** 2)  # (5.8)
    r = en1993.shear(girder, "S355", a="2 m", end_post="rigid", flange_contribution=True, M_Ed=f"{MEd} N*m")
    assert r.V_bf_Rd == pytest.approx(vbf, rel=REL)
    assert r.capacity == pytest.approx(vbw + vbf, rel=REL)


def test_patch_load_type_a(girder):
    ss = 0.2
    kF = 6.0  # no transverse stiffeners
    Fcr = 0.9 * kF * E * TW ** 3 / HW
    m1 = FY * BF / (FY * TW)
    m2 = 0.02 * (HW / TF) ** 2
    ly = ss + 2 * TF * (1 + math.sqrt(m1 + m2))
    lam = math.sqrt(ly * TW * FY / Fcr)
    assert lam > 0.5
    chi = min(0.5 / lam, 1.0)
    FRd = FY * chi * ly * TW
    r = en1993.transverse(girder, "S355", "300 kN", ss="200 mm", load_type="a")
    assert r.capacity == pytest.approx(FRd, rel=REL)
    assert r.ratio == pytest.approx(300e3 / FRd, rel=REL)
