"""Validation of calckit.design.en1993 lateral-torsional buckling against a published worked example.

Source: Access Steel SX001a, "Example: Simply supported laterally unrestrained beam" (NCCI worked example,
EN 1993-1-1), also reproduced in "Steel Buildings in Europe, Multi-storey steel buildings, Part 4:
Detailed design", Appendix A.1. Values as collected in /work/shared/REFERENCES.md (status P: seen in the
printed source; M_b,Rd and M_c,Rd status R, recomputed there from the printed factors).

IPE 330, S235, span L = 5.70 m, fork supports, uniformly distributed load on the top flange,
gamma_M0 = gamma_M1 = 1.0; M_Ed = 90.48 kNm; C1 = 1.127, C2 z_g = 74.91 mm (z_g = h/2 = 165 mm);
M_cr = 113.9 kNm; lambda_LT = 1.288; h/b = 2.06 > 2: curve c, alpha_LT = 0.49 (6.3.2.3, lambda_LT,0 = 0.4,
beta = 0.75); Phi_LT = 1.340; chi_LT = 0.480 (the example does not apply the factor f);
M_b,Rd = 90.7 kNm; M_c,Rd = 189.0 kNm.

The book rounds to 3-4 significant figures: REL_BOOK = 0.5 % plus the rounding of the last digit.
The energy solution (calckit's C1/C2 from the moment diagram) is compared with the book's M_cr, which
itself comes from SN003's tabulated C1 and C2 (a fit to numerical results): REL_ENERGY = 1 %.
"""
from __future__ import annotations

import numpy as np
import pytest

import calckit
from calckit.design import en1993

REL_BOOK = 5e-3
REL_ENERGY = 1e-2

L = "5.70 m"
ZG = "165 mm"  # top flange: h/2 above the shear centre
M_ED = 90.48e3  # N m, printed


@pytest.fixture(scope="module")
def ipe330():
    return calckit.section("IPE 330")


def rel(v, r=REL_BOOK):
    return pytest.approx(v, rel=r)


def test_section_class_and_Mc_Rd(ipe330):
    r = en1993.bending(ipe330, "S235", f"{M_ED} N*m")
    assert r.data["class"] == 1  # SX001a: Class 1
    assert r.capacity == rel(189.0e3)  # M_c,Rd = W_pl,y f_y / gamma_M0 (R)


def test_printed_C1_C2_reproduce_Mcr_and_Mb_Rd(ipe330):
    r = en1993.ltb(ipe330, "S235", L=L, C1=1.127, C2=0.454, zg=ZG, method="rolled", M_Ed=f"{M_ED} N*m")
    assert r.Mcr == rel(113.9e3)
    assert r.lambda_LT == rel(1.288)
    assert r.data["curve"] == "c" and r.alpha_LT == 0.49
    assert r.Phi_LT == rel(1.340)
    assert r.chi_LT == rel(0.480, 0.002 / 0.48)  # printed to 3 decimals
    assert r.capacity == rel(90.7e3)
    assert r.ratio == rel(90.48 / 90.7, 0.01)
    assert r.clause.endswith("6.3.2.3")


def test_Mcr_steps_show_the_printed_intermediate(ipe330):
    # SX001a prints pi^2 E I_z / L^2 = 502.75 kN (k = 1); the sheet shows it as the first of the three M_cr
    # steps, and the last step (M_cr = C1 N_cr,z [R_LT - (C2 z_g - C3 z_j)]) reproduces the printed M_cr
    r = en1993.ltb(ipe330, "S235", L=L, C1=1.127, C2=0.454, zg=ZG, method="rolled", M_Ed=f"{M_ED} N*m")
    st = {getattr(s_, "symbol", None): s_ for s_ in r.steps}
    assert st["N_cr_z"].result == rel(502.75e3)
    assert st["M_cr"].result == r.Mcr == rel(113.9e3)
    C2zg = 0.454 * 0.165  # SX001a: C2 z_g = 74.91 mm
    assert C2zg == pytest.approx(0.07491, rel=REL_BOOK)
    assert 1.127 * st["N_cr_z"].result * (st["R_LT"].result - C2zg) == pytest.approx(r.Mcr, rel=1e-12)


def test_C1_without_C2_takes_SN003_C2(ipe330):
    r = en1993.ltb(ipe330, "S235", L=L, C1=1.127, zg=ZG, method="rolled")
    assert r.C2 == 0.454
    assert r.Mcr == rel(113.9e3)


def test_moment_diagram_energy_solution(ipe330):
    x = np.linspace(0.0, 5.7, 61)
    w = 8 * M_ED / 5.7 ** 2
    M = w * x * (5.7 - x) / 2
    r = en1993.ltb(ipe330, "S235", L=L, moment_diagram=(x, M), zg=ZG, method="rolled")
    assert r.C1 == pytest.approx(1.127, rel=REL_ENERGY)
    assert r.C2 * 0.165 == pytest.approx(0.07491, rel=0.02)  # C2 z_g = 74.91 mm (fit; see docstring)
    assert r.Mcr == pytest.approx(113.9e3, rel=REL_ENERGY)
    assert r.capacity == pytest.approx(90.7e3, rel=REL_ENERGY)
    assert r.demand == pytest.approx(M_ED, rel=1e-9)


def test_member_check_governed_by_ltb(ipe330):
    x = np.linspace(0.0, 5.7, 101)
    w = 8 * M_ED / 5.7 ** 2
    M = w * x * (5.7 - x) / 2
    V = w * (5.7 / 2 - x)
    res = en1993.check_member(ipe330, "S235", x=x, M=M, V=V, zg=0.165, method="rolled")
    g = res.governing
    assert g.limit_state == "Lateral-torsional buckling"
    assert g.ratio == pytest.approx(90.48 / 90.7, rel=REL_ENERGY)
    assert res.passed
