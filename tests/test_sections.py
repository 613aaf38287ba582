"""calckit.sections: closed forms, conventions and bad input.

Closed forms are the textbook results for rectangles (e.g. Gere, Mechanics of Materials, 7th ed.,
Appendix D, from memory) and the fillet-spandrel integrals stated in calckit/sections/geometry.py.
"""
import math

import pytest

import calckit
import calckit.sections as cs
from calckit.errors import InputError, UnitsError

REL = 1e-10
MM = 1e-3


def test_solid_rectangle_closed_forms():
    b, h = 60 * MM, 120 * MM
    s = cs.SolidRect("60 mm", "120 mm").si
    assert s.A == pytest.approx(b * h, rel=REL)
    assert s.Ix == pytest.approx(b * h ** 3 / 12, rel=REL)
    assert s.Iy == pytest.approx(h * b ** 3 / 12, rel=REL)
    assert s.Sx == pytest.approx(b * h ** 2 / 6, rel=REL)
    assert s.Zx == pytest.approx(b * h ** 2 / 4, rel=REL)
    assert s.Q_na == pytest.approx(b * h ** 2 / 8, rel=REL)


def test_welded_I_plates_closed_form():
    d, tw, bf, tf = 900 * MM, 10 * MM, 300 * MM, 20 * MM
    s = cs.PlateGirder("900 mm", "10 mm", "300 mm", "20 mm").si
    hw = d - 2 * tf
    Ix = bf * d ** 3 / 12 - (bf - tw) * hw ** 3 / 12
    assert s.Ix == pytest.approx(Ix, rel=REL)
    assert s.Zx == pytest.approx(bf * tf * (d - tf) + tw * hw ** 2 / 4, rel=REL)
    assert s.Q_flange_top == pytest.approx(bf * tf * (d - tf) / 2, rel=REL)
    assert s.Aw_aisc == pytest.approx(d * tw, rel=REL)
    assert s.Av_en == pytest.approx(hw * tw, rel=REL)
    assert s.kind == "I_welded" and s.symmetric


def test_fillet_area_is_exact():
    plain = cs.IShape("300 mm", "150 mm", "10 mm", "7 mm", 0).si
    fil = cs.IShape("300 mm", "150 mm", "10 mm", "7 mm", "15 mm").si
    assert fil.A - plain.A == pytest.approx(4 * (1 - math.pi / 4) * (15 * MM) ** 2, rel=REL)


def test_cut_fillet_moments_match_whole_fillet():
    # Q above a cut just inside the flange equals the closed form; a cut through the fillet is continuous.
    s = cs.IShape("300 mm", "150 mm", "10 mm", "7 mm", "15 mm")
    y_in_fillet = 0.300 - 0.010 - 0.0075
    q1 = s.Q_at_si(y_in_fillet - 1e-9)
    q2 = s.Q_at_si(y_in_fillet + 1e-9)
    assert q1 == pytest.approx(q2, rel=1e-7)
    assert s.Q_at_si(s.si.y_c) == pytest.approx(s.si.Q_na, rel=REL)
    assert s.Q_at_si(0.0) == pytest.approx(0.0, abs=1e-15)


def test_width_profile():
    s = cs.IShape("300 mm", "150 mm", "10 mm", "7 mm", "15 mm")
    assert s.width_at_si(0.005) == pytest.approx(0.150)
    assert s.width_at_si(0.150) == pytest.approx(0.007)
    assert 0.007 < s.width_at_si(0.012) < 0.007 + 2 * 0.015


def test_mono_symmetric_girder_axes():
    g = cs.PlateGirder("1200 mm", "12 mm", "400 mm", "25 mm", "300 mm", "20 mm").si
    assert not g.symmetric
    assert g.y_c > 0.6  # larger top flange pulls the NA up
    assert g.Sx == min(g.Sx_top, g.Sx_bot)
    # plastic NA splits the area in half
    top_area = 0.4 * 0.025 + 0.012 * (1.2 - 0.025 - g.y_pna)
    assert top_area == pytest.approx(g.A / 2, rel=1e-9)
    # shear centre lies towards the stiffer (top) flange
    assert g.y_s > g.y_c


def test_quantities_and_units():
    s = cs.IShape("18 in", "7.5 in", "0.57 in", "0.355 in", "0.402 in", name="W18X50")
    assert s.Ix.to("in**4").m == pytest.approx(801, rel=0.002)
    assert s.Q_at("9 in").to("in**3").m == pytest.approx(s.si.Q_na / 0.0254 ** 3, rel=1e-9)
    props = s.properties("US")
    assert props["Zx"].to("in**3").m == pytest.approx(100.9, rel=0.002)
    assert s.name == "W18X50"


def test_sections_are_immutable():
    s = cs.SolidRect("10 mm", "20 mm")
    with pytest.raises(AttributeError):
        s.si = None
    with pytest.raises(Exception):
        s.si.A = 1.0


def test_builtup_of_two_plates_equals_rectangle():
    a = cs.BuiltUp([(cs.Plate("100 mm", "20 mm"), "0 mm", "0 mm"), (cs.Plate("100 mm", "30 mm"), 0, "20 mm")])
    r = cs.SolidRect("100 mm", "50 mm")
    assert a.si.Ix == pytest.approx(r.si.Ix, rel=REL)
    assert a.si.Zx == pytest.approx(r.si.Zx, rel=1e-9)


@pytest.mark.parametrize("kwargs,param", [
    (dict(d="0 mm", bf="100 mm", tf="10 mm", tw="6 mm"), "d"),
    (dict(d="-300 mm", bf="100 mm", tf="10 mm", tw="6 mm"), "d"),
    (dict(d="300 mm", bf="nan mm", tf="10 mm", tw="6 mm"), "bf"),
    (dict(d="300 mm", bf="inf mm", tf="10 mm", tw="6 mm"), "bf"),
    (dict(d="300 mm", bf="100 mm", tf="150 mm", tw="6 mm"), "tf"),
    (dict(d="300 mm", bf="100 mm", tf="10 mm", tw="120 mm"), "tw"),
    (dict(d="300 mm", bf="100 mm", tf="10 mm", tw="6 mm", r="60 mm"), "r"),
    (dict(d="300 mm", bf="100 mm", tf="10 mm", tw="6 mm", r="-1 mm"), "r"),
])
def test_bad_dimensions_name_the_parameter(kwargs, param):
    with pytest.raises(InputError, match=rf"^{param}: got"):
        cs.IShape(**kwargs)


def test_wrong_units_raise_units_error():
    with pytest.raises(UnitsError, match="d: got the bare number 300"):
        cs.IShape(300, "100 mm", "10 mm", "6 mm")
    with pytest.raises(UnitsError, match="bf: got 100 kN"):
        cs.IShape("300 mm", "100 kN", "10 mm", "6 mm")


def test_other_shapes_bad_input():
    with pytest.raises(InputError, match="^t: got"):
        cs.Hollow("100 mm", "100 mm", "60 mm")
    with pytest.raises(InputError, match="^tf: got"):
        cs.Tee("100 mm", "100 mm", "120 mm", "6 mm")
    with pytest.raises(InputError, match="^parts"):
        cs.BuiltUp([])


def test_public_constructors_exported():
    assert calckit.IShape is cs.IShape and calckit.PlateGirder is cs.PlateGirder
