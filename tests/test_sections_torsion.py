"""calckit.sections.torsion: J, Cw and shear centre by finite volumes, against closed forms.

Sources (all from memory):
- Timoshenko & Goodier, Theory of Elasticity, 3rd ed., McGraw-Hill 1970, sect. 109 (torsion of a
  rectangular bar): J = beta b t^3 with beta = 1/3 - (64 / pi^5)(t/b) sum_{n odd} tanh(n pi b / 2t) / n^5;
  the book's table gives beta = 0.141, 0.229, 0.281, 0.312 for b/t = 1, 2, 4, 10 and beta -> 1/3 for a
  thin plate. Sect. 115 (thin-walled tubes, Bredt): J = 4 A_m^2 t / p_m.
- AISC Design Guide 9, Torsional Analysis of Structural Steel Members (1997), Appendix C (thin-walled):
  doubly symmetric I, Cw = If ho^2 / 2 (If of one flange); channel, e0 = 3 b'^2 tf / (6 b' tf + h' tw) and
  Cw = tf b'^3 h'^2 (3 b' tf + 2 h' tw) / (12 (6 b' tf + h' tw)); narrow rectangle (the tee's flange term),
  Cw = b^3 t^3 / 144.
The finite-element comparison of built-ups is in tests/validation/test_sectionproperties_fe.py.
"""
from __future__ import annotations

import math

import pytest

import calckit.sections as cs
from calckit.errors import NotCoveredError
from calckit.sections import geometry as g
from calckit.sections.base import rect_J
from calckit.sections.torsion import TorsionResult, solve_torsion

TOL_TABLE = 0.006  # beta table printed to 3 digits (+-0.0005 on 0.141 is 0.35 %), plus the grid error
TOL_SERIES = 0.006  # against the exact series, default grid (measured <= 0.51 %)
TOL_THIN = 0.003  # thin-walled limits that are exact as t -> 0 (measured <= 0.13 %)
TOL_BREDT = 0.02  # Bredt's formula neglects the corners of a tube (t/b = 0.025)
TOL_NARROW = 0.02  # b^3 t^3 / 144 for a 20:1 rectangle (measured 1.2 % low)
REFINE_RATIO = 2.5  # halving the cells must cut the error at least this much (second order: 4)
MM = 1e-3


def _beta_series(r: float, terms: int = 400) -> float:
    """Timoshenko & Goodier sect. 109 series for beta at b/t = r (from memory)."""
    return 1 / 3 - 64 / math.pi ** 5 / r * sum(math.tanh(n * math.pi * r / 2) / n ** 5 for n in range(1, terms, 2))


def _rect(b, t):
    return [g.Rect(0.0, b, 0.0, t)]


@pytest.mark.parametrize("ratio,beta", [(1, 0.141), (2, 0.229), (4, 0.281), (10, 0.312)])
def test_rectangle_beta_table(ratio, beta):
    t = 10 * MM
    J = solve_torsion(_rect(ratio * t, t)).J
    assert J / (ratio * t * t ** 3) == pytest.approx(beta, rel=TOL_TABLE)
    assert J / (ratio * t ** 4) == pytest.approx(_beta_series(ratio), rel=TOL_SERIES)


def test_thin_plate_tends_to_b_t3_over_3():
    b, t = 500 * MM, 5 * MM  # b/t = 100
    J = solve_torsion(_rect(b, t)).J
    assert J == pytest.approx(b * t ** 3 / 3 * (1 - 0.630 * t / b), rel=TOL_THIN)
    assert J / (b * t ** 3 / 3) > 0.99


def test_grid_refinement_converges_at_second_order():
    # b/t = 10 against the series; measured errors 0.45 %, 0.11 %, 0.024 % at refine = 1, 2, 4
    exact = _beta_series(10) * 10 * MM * (1 * MM) ** 3
    errs = [abs(solve_torsion(_rect(10 * MM, 1 * MM), refine=r).J / exact - 1) for r in (1, 2, 4)]
    assert errs[1] < errs[0] / REFINE_RATIO and errs[2] < errs[1] / REFINE_RATIO


def test_grid_refinement_of_a_cover_plated_beam():
    # IPE 330 + 200 x 15 plates: the default grid is within 0.2 % of a grid with 3 times the cells
    # (measured 0.04 % on J and 0.11 % on Cw; 0.06 % and 0.2 % against 7 times the cells)
    beam = cs.IShape("330 mm", "160 mm", "11.5 mm", "7.5 mm", "18 mm")
    bu = cs.BuiltUp.cover_plated(beam, top=("200 mm", "15 mm"), bottom=("200 mm", "15 mm"))
    fine = solve_torsion(bu._prims, refine=2)
    assert bu.si.J == pytest.approx(fine.J, rel=0.002)
    assert bu.si.Cw == pytest.approx(fine.Cw, rel=0.003)
    assert fine.cells > 3 * bu.torsion.cells


def _thin_I(bf=300 * MM, tf=4 * MM, hw=600 * MM, tw=4 * MM):
    return [g.Rect(0, bf, 0, tf), g.Rect((bf - tw) / 2, (bf + tw) / 2, tf, tf + hw),
            g.Rect(0, bf, tf + hw, 2 * tf + hw)]


def test_thin_doubly_symmetric_I_warping_constant():
    bf, tf, hw = 300 * MM, 4 * MM, 600 * MM
    r = solve_torsion(_thin_I())
    If, ho = tf * bf ** 3 / 12, hw + tf
    assert r.Cw == pytest.approx(If * ho ** 2 / 2, rel=TOL_THIN)
    assert r.x_s == pytest.approx(bf / 2, abs=1e-9) and r.y_s == pytest.approx(tf + hw / 2, abs=1e-9)
    # J of a thin open section: sum of b t^3 / 3 less the free-end corrections (Roark's rect_J)
    assert r.J == pytest.approx(2 * rect_J(bf, tf) + rect_J(hw, 4 * MM), rel=0.03)


def test_a_plate_has_almost_no_warping_constant_next_to_an_I():
    plate = solve_torsion([g.Rect(0, 300 * MM, 0, 4 * MM)])
    assert plate.Cw < 1e-4 * solve_torsion(_thin_I()).Cw
    narrow = solve_torsion(_rect(200 * MM, 10 * MM))
    assert narrow.Cw == pytest.approx((200 * MM) ** 3 * (10 * MM) ** 3 / 144, rel=TOL_NARROW)


def test_channel_of_plates_shear_centre_and_Cw():
    bu = cs.BuiltUp([(cs.Plate("100 mm", "4 mm"), 0, 0), (cs.Plate("4 mm", "292 mm"), 0, "4 mm"),
                     (cs.Plate("100 mm", "4 mm"), 0, "296 mm")])
    t, b1, h1 = 4 * MM, 98 * MM, 296 * MM
    e0 = 3 * b1 ** 2 * t / (6 * b1 * t + h1 * t)
    Cw = t * b1 ** 3 * h1 ** 2 * (3 * b1 * t + 2 * h1 * t) / (12 * (6 * b1 * t + h1 * t))
    assert bu.si.x_s == pytest.approx(t / 2 - e0, rel=TOL_THIN)  # outside the web, away from the flanges
    assert bu.si.Cw == pytest.approx(Cw, rel=TOL_THIN)
    assert bu.si.y_s == pytest.approx(150 * MM, abs=1e-9)


def test_closed_tube_bredt():
    b, t = 200 * MM, 5 * MM
    r = solve_torsion([g.Rect(0, b, 0, b), g.Rect(t, b - t, t, b - t, sign=-1.0)])
    Am, p = (b - t) ** 2, 4 * (b - t)
    assert r.holes == 1
    assert r.J == pytest.approx(4 * Am ** 2 * t / p, rel=TOL_BREDT)
    open_J = solve_torsion([g.Rect(0, b, 0, t)]).J * 4  # the same walls, not closed: ~500 times less
    assert r.J > 100 * open_J


def test_parts_apart_fall_back_to_the_sum_of_the_parts():
    plates = [(cs.Plate("100 mm", "10 mm"), "0 mm", "0 mm"), (cs.Plate("100 mm", "10 mm"), "0 mm", "50 mm")]
    bu = cs.BuiltUp(plates)
    with pytest.raises(NotCoveredError, match="separate solids"):
        solve_torsion(bu._prims)
    assert bu.torsion is bu.torsion_thin and "alone" in bu.torsion.method
    assert bu.si.J == pytest.approx(2 * rect_J(0.1, 0.01), rel=1e-12)


def test_welded_plates_act_as_one_solid():
    two = cs.BuiltUp([(cs.Plate("100 mm", "20 mm"), "0 mm", "0 mm"), (cs.Plate("100 mm", "30 mm"), 0, "20 mm")])
    one = solve_torsion(_rect(100 * MM, 50 * MM))
    assert two.si.J == pytest.approx(one.J, rel=0.002)  # one more grid line at the joint
    assert two.si.J == pytest.approx(_beta_series(2) * 0.1 * 0.05 ** 3, rel=TOL_SERIES)
    assert two.si.J > 2 * two.torsion_thin.J
    assert isinstance(two.torsion, TorsionResult) and two.torsion.cells > 0


def test_result_does_not_depend_on_position_or_order():
    a = solve_torsion(_thin_I())
    shifted = [g.Rect(p.x0 + 1.0, p.x1 + 1.0, p.y0 - 2.0, p.y1 - 2.0) for p in reversed(_thin_I())]
    b = solve_torsion(shifted)
    assert b.J == pytest.approx(a.J, rel=1e-9) and b.Cw == pytest.approx(a.Cw, rel=1e-9)
    assert b.x_s == pytest.approx(a.x_s + 1.0, abs=1e-9) and b.y_s == pytest.approx(a.y_s - 2.0, abs=1e-9)
