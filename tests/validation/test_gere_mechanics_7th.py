"""Shear flow in built-up beams against Gere's textbook problems.

Source: J. M. Gere and B. J. Goodno, Mechanics of Materials, 7th ed., Cengage Learning, 2009
(authors and publisher from memory), Section 5.11 "Built-up beams and shear flow", Problems 5.11-3 and
5.11-5 with the answers in the book (values as collected in /work/shared/REFERENCES.md, status P).
The book rounds to 3-4 significant figures: compared at 0.5 % plus the rounding.
"""
import numpy as np
import pytest

import calckit
from calckit.design.shear_flow import design_fasteners, shear_flow
from calckit.sections import BuiltUp, Plate

LBF = 4.4482216152605  # N
IN = 0.0254  # m
LB_PER_IN = LBF / IN  # N/m
BOOK = 0.005 + 0.0005  # 0.5 % plus rounding to 4 significant figures


def _flat(V_lbf):
    x = np.array([0.0, 1.0])
    V = np.full(2, V_lbf * LBF)
    return x, V, -V


@pytest.fixture
def girder_5_11_3():
    # welded plate girder: flanges 20 x 1 in, web 60 x 5/16 in, overall depth 62 in
    return calckit.PlateGirder(d="62 in", tw="0.3125 in", bf_top="20 in", tf_top="1 in")


def test_problem_5_11_3_properties(girder_5_11_3):
    s = girder_5_11_3.si
    assert s.Ix / IN ** 4 == pytest.approx(4.284e4, rel=BOOK)  # I = 4.284 x 10^4 in4
    assert s.Q_flange_top / IN ** 3 == pytest.approx(610, rel=BOOK)  # Q = 610 in3


def test_problem_5_11_3_shear_flow(girder_5_11_3):
    sf = shear_flow(girder_5_11_3, _flat(280e3))  # V = 280 kips
    f = sf.interfaces[0]
    assert f.flange == "both" and f.n_lines == 2  # symmetric: one result for both junctions, two welds each
    assert sf.q_max() / LB_PER_IN == pytest.approx(3987, rel=BOOK)  # VQ/I = 3,987 lb/in
    assert sf.q_max() / f.n_lines / LB_PER_IN == pytest.approx(1994, rel=BOOK)  # 1,994 lb/in per weld


@pytest.fixture
def box_5_11_5a():
    # (a) flanges 6 x 1 in on top of the webs 8 x 1 in: overall 6 in wide, 10 in deep
    return BuiltUp([(Plate("6 in", "1 in"), "0 in", "0 in"), (Plate("1 in", "8 in"), "0 in", "1 in"),
                    (Plate("1 in", "8 in"), "5 in", "1 in"), (Plate("6 in", "1 in"), "0 in", "9 in")])


@pytest.fixture
def box_5_11_5b():
    # (b) flanges 6 x 1 in fitted between the webs 8 x 1 in: overall 8 in wide, 8 in deep
    return BuiltUp([(Plate("1 in", "8 in"), "0 in", "0 in"), (Plate("6 in", "1 in"), "1 in", "0 in"),
                    (Plate("6 in", "1 in"), "1 in", "7 in"), (Plate("1 in", "8 in"), "7 in", "0 in")])


@pytest.mark.parametrize("case, I_in4, Q_in3, s_in", [("a", 329.3, 27, 5.08), ("b", 233.3, 21, 4.63)])
def test_problem_5_11_5_screw_spacing(case, I_in4, Q_in3, s_in, box_5_11_5a, box_5_11_5b):
    sec = box_5_11_5a if case == "a" else box_5_11_5b
    assert sec.si.Ix / IN ** 4 == pytest.approx(I_in4, rel=BOOK)
    assert sec.si.Q_flange_top / IN ** 3 == pytest.approx(Q_in3, rel=BOOK)
    # screws of 250 lb allowable shear, one into each web (n = 2), V = 1,200 lb
    d = design_fasteners(sec, _flat(1200), R="250 lbf", n=2, interfaces=None)
    row = d.rows[0]
    assert row.interface.flange == "both"
    assert row.s_strength / IN == pytest.approx(s_in, rel=BOOK)
    assert d.passed
