"""Nailed built-up beam against Beer and Johnston's worked example.

Source: F. P. Beer, E. R. Johnston Jr., J. T. DeWolf and D. F. Mazurek, Mechanics of Materials, McGraw-Hill
(edition and example number from memory): three 20 x 100 mm planks nailed into an I, nails at s = 25 mm,
V = 500 N; Q = 120e-6 m3, I = 16.20e-6 m4, q = 3,704 N/m, F = 92.6 N per nail
(/work/shared/REFERENCES.md, status M, R: recomputed from the inputs). Book rounding to 4 figures.
"""
import numpy as np
import pytest

from calckit.design.shear_flow import design_fasteners, fastener_force, shear_flow
from calckit.sections import BuiltUp, Plate

BOOK = 0.005 + 0.0005  # 0.5 % plus rounding to 4 significant figures


@pytest.fixture
def planks():
    return BuiltUp([(Plate("100 mm", "20 mm"), "0 mm", "0 mm"), (Plate("20 mm", "100 mm"), "40 mm", "20 mm"),
                    (Plate("100 mm", "20 mm"), "0 mm", "120 mm")])


def _env():
    x = np.array([0.0, 2.0])
    return x, np.full(2, 500.0), np.full(2, -500.0)


def test_section(planks):
    assert planks.si.Ix == pytest.approx(16.20e-6, rel=BOOK)
    assert planks.si.Q_flange_top == pytest.approx(120e-6, rel=BOOK)


def test_shear_flow_and_nail_force(planks):
    sf = shear_flow(planks, _env())
    assert sf.q_max() == pytest.approx(3704, rel=BOOK)  # N/m
    assert fastener_force(sf.q_max(), "25 mm", 1) == pytest.approx(92.6, rel=BOOK)  # N per nail


def test_spacing_from_nail_capacity(planks):
    # the inverse problem: a nail good for 92.6 N needs s <= 25 mm (one nail per row)
    d = design_fasteners(planks, _env(), R="92.6 N", n=1, s_max="50 mm", step="1 mm")
    assert d.rows[0].s_strength == pytest.approx(0.025, rel=BOOK)
