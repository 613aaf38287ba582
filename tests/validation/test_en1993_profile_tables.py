"""Design resistances M_pl,Rd and V_pl,Rd of European rolled sections to EN 1993-1-1:2005 6.2.5 and 6.2.6.

Source: the European profile tables (EN 10365:2017 dimensions; producers' section tables with W_pl,y and
the shear area A_vz), values FROM MEMORY (W_pl,y as listed in /work/shared/REFERENCES.md, status M; A_vz from
memory of the same tables). The design resistances are RECOMPUTED (status R) from those tabulated moduli:
M_pl,Rd = W_pl,y f_y / gamma_M0 and V_pl,Rd = A_vz (f_y/sqrt3)/gamma_M0 with gamma_M0 = 1.0 (recommended),
f_y from EN 1993-1-1 Table 3.1 (t <= 40 mm: S235 235 MPa, S355 355 MPa).

calckit computes W_pl,y and A_v from the section geometry (plates plus root fillets), so the comparison
checks the geometry, the shear-area rule of 6.2.6(3)(a) and the resistance formulas. Tabulated values
carry 4 significant figures: REL_TABLE = 0.5 %.
"""
from __future__ import annotations

import math

import pytest

import calckit
from calckit.design import en1993

REL_TABLE = 5e-3

# name: (W_pl,y cm3, A_vz cm2) -- tables, from memory
TABLE = {
    "IPE 200": (220.6, 14.00),
    "IPE 300": (628.4, 25.68),
    "IPE 330": (804.3, 30.81),
    "IPE 400": (1307.0, 42.69),
    "HEA 200": (429.5, 18.08),
    "HEB 300": (1869.0, 47.43),
}
FY = {"S235": 235e6, "S355": 355e6}


@pytest.mark.parametrize("grade", ["S235", "S355"])
@pytest.mark.parametrize("name", list(TABLE))
def test_Mpl_Rd(name, grade):
    wpl, _ = TABLE[name]
    r = en1993.bending(calckit.section(name), grade)
    assert r.data["class"] <= 2, f"{name} {grade} should be Class 1 or 2 in bending"
    assert r.capacity == pytest.approx(wpl * 1e-6 * FY[grade], rel=REL_TABLE)


@pytest.mark.parametrize("grade", ["S235", "S355"])
@pytest.mark.parametrize("name", list(TABLE))
def test_Vpl_Rd(name, grade):
    _, av = TABLE[name]
    r = en1993.shear(calckit.section(name), grade)
    assert r.data["shear_buckling"] is False
    assert r.A_v == pytest.approx(av * 1e-4, rel=REL_TABLE)
    assert r.capacity == pytest.approx(av * 1e-4 * FY[grade] / math.sqrt(3), rel=REL_TABLE)
