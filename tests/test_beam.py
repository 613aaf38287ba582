"""Tests of calckit.analysis.beam / results: model, sign conventions, evaluation API, combinations,
springs, hinges, variable EI and self-weight.

Closed-form references (each named beside its check):
[G]   J. M. Gere, B. J. Goodno, *Mechanics of Materials*, 7th ed., ch. 9-10 (deflections by integration
      and by superposition; statically indeterminate beams) — standard results, from memory.
[3M]  Clapeyron's three-moment equation (e.g. Timoshenko & Young, *Theory of Structures*, 2nd ed.,
      sec. 9.3; from memory): M_B (L1/EI1 + L2/EI2) = -(w1 L1^3 / (4 EI1) + w2 L2^3 / (4 EI2)) / 2 for
      two spans with pinned far ends and uniform loads.
[AISC-M] AISC Steel Construction Manual, 15th ed., Table 3-23 case 2 (triangular load), from memory.
"""
from __future__ import annotations

import math
import subprocess
import sys

import numpy as np
import pytest

import calckit
from calckit import Beam
from calckit.analysis import BeamResult, UnstableError
from calckit.errors import InputError

REL = 1e-10
EI = 2.0e7  # N*m**2


def approx(v, rel=REL, abs_=1e-9):
    return pytest.approx(v, rel=rel, abs=abs_)


def simple(L="6 m"):
    return Beam(L, ["pin", "roller"], EI=f"{EI} N*m**2")


def test_beam_is_exported_at_package_level():
    assert calckit.Beam is Beam


def test_import_of_analysis_loads_no_heavy_packages():
    code = ("import sys, calckit.analysis, calckit; b = calckit.Beam; "
            "print(sorted(m for m in ('sympy', 'matplotlib', 'scipy', 'pint') if m in sys.modules))")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "[]"


# -- sign conventions ---------------------------------------------------------------------------
def test_gravity_load_gives_upward_reactions_sagging_moment_and_downward_deflection():
    r = simple().udl("10 kN/m", "D").solve()["D"]
    assert all(x.R > 0 for x in r.reactions)
    assert r.M_si(3.0) > 0 and r.deflection_si(3.0) > 0
    assert r.slope_si(0.0) > 0 > r.slope_si(6.0)  # goes down from the left support


def test_uplift_is_negative_load():
    r = simple().udl("-10 kN/m", "W").solve()["W"]
    assert r.M_si(3.0) < 0 and r.deflection_si(3.0) < 0


def test_clockwise_couple_makes_moment_jump_up_left_to_right():
    r = simple().moment("12 kN*m", "2 m", "D").solve()["D"]
    assert r.M_si(2.0, "right") - r.M_si(2.0, "left") == approx(12e3)
    # statics [G]: R1 = -M/L, R2 = +M/L for a clockwise couple
    assert r.reactions[0].R == approx(-12e3 / 6) and r.reactions[1].R == approx(12e3 / 6)


def test_shear_left_and_right_of_point_load():
    r = simple().point("30 kN", "2 m", "L").solve()["L"]
    assert r.V_si(2.0, "left") == approx(20e3)
    assert r.V_si(2.0, "right") == approx(-10e3)
    e = r.extrema()
    assert e.V_max.value == approx(20e3) and e.V_min.value == approx(-10e3)
    assert e.M_max.x == approx(2.0)


def test_fixed_end_reaction_moment_sign():
    r = Beam("4 m", ["fixed", "free"], EI=f"{EI} N*m**2").point("10 kN", "4 m", "D").solve()["D"]
    rc = r.reactions[0]
    assert rc.R == approx(10e3) and rc.M == approx(-40e3)  # counterclockwise on the beam
    assert r.M_si(0.0) == approx(-40e3)  # hogging


# -- evaluation API -----------------------------------------------------------------------------
def test_array_evaluation_matches_scalar():
    b = Beam(["5 m", "7 m"], ["pin", "roller", "fixed"], EI=f"{EI} N*m**2")
    b.udl("8 kN/m", "D").point("20 kN", "3 m", "D").linear("0 kN/m", "5 kN/m", "6 m", "11 m", "D")
    r = b.solve()["D"]
    xs = np.linspace(0, 12, 37)
    for f in (r.V_si, r.M_si, r.slope_si, r.deflection_si):
        arr = f(xs)
        assert arr.shape == xs.shape
        assert np.allclose(arr, [f(float(x)) for x in xs], rtol=0, atol=1e-12 * np.max(np.abs(arr)))


def test_quantity_evaluation_and_units():
    r = simple().udl("10 kN/m", "D").solve()["D"]
    m = r.M("3 m")
    assert m.m_as("kN*m") == approx(45.0)
    assert r.M("9.842519685 ft", system="US").units == calckit.ureg.Unit("kip*ft")
    assert r.deflection("3 m", system="SI").m_as("mm") == approx(5 * 10e3 * 6 ** 4 / (384 * EI) * 1e3)
    assert r.V(calckit.Q_(0, "m")).m_as("kN") == approx(30.0)
    assert r.reactions[0].force.m_as("kN") == approx(30.0)
    arr = r.M(calckit.Q_(np.array([0.0, 3.0, 6.0]), "m"))
    assert np.allclose(arr.m_as("kN*m"), [0, 45, 0], atol=1e-9)


def test_extrema_per_span_and_side_flag():
    b = Beam(["4 m", "6 m"], ["pin", "roller", "roller"], EI=f"{EI} N*m**2").point("50 kN", "6 m", "L")
    r = b.solve()["L"]
    e1 = r.extrema(span=1)
    assert e1.M_max.x == approx(6.0) and e1.span == 1 and e1.M_max.span == 1
    e = r.extrema()
    assert e.V_abs.side in ("left", "right")  # the extreme shear is at a jump
    assert e.M_max.side is None  # moment is continuous under a point load


def test_results_are_cached_until_a_load_is_added():
    b = simple().udl("1 kN/m", "D")
    s1 = b.solve()
    assert b.solve() is s1
    b.point("1 kN", "1 m", "L")
    s2 = b.solve()
    assert s2 is not s1 and s2.cases == ["D", "L"]


# -- combinations -------------------------------------------------------------------------------
def _two_span(factor_d=1.0, factor_l=1.0, cases=("D", "L")):
    b = Beam(["5 m", "6 m"], ["pin", "roller", "pin"], EI=f"{EI} N*m**2")
    b.udl(f"{10 * factor_d} kN/m", cases[0]).point(f"{7 * factor_d} kN", "2 m", cases[0])
    b.udl(f"{4 * factor_l} kN/m", cases[1], start="3 m", end="9 m").moment(f"{5 * factor_l} kN*m", "8 m", cases[1])
    return b


def test_combine_equals_solving_the_factored_loads():
    comb = _two_span().solve().combine({"D": 1.2, "L": 1.6})
    direct = _two_span(1.2, 1.6, cases=("X", "X")).solve()["X"]
    assert comb.name == "1.2D + 1.6L"
    xs = np.linspace(0, 11, 23)
    for f in ("V_si", "M_si", "deflection_si", "slope_si"):
        assert np.allclose(getattr(comb, f)(xs), getattr(direct, f)(xs), rtol=1e-12, atol=1e-9)
    assert np.allclose(comb.R, direct.R, rtol=1e-12)
    assert comb.extrema().M_max.value == approx(direct.extrema().M_max.value)
    assert isinstance(comb, BeamResult)


def test_combine_missing_case_policy():
    sol = _two_span().solve()
    with pytest.raises(InputError, match="'S'"):
        sol.combine({"D": 1.2, "S": 1.6})
    r = sol.combine({"D": 1.2, "S": 1.6}, missing="zero")
    assert np.allclose(r.Mc, 1.2 * sol["D"].Mc)


def test_scaled_result():
    r = _two_span().solve()["D"]
    assert np.allclose(r.scaled(2.5).Mc, 2.5 * r.Mc)


# -- springs, hinges, EI per span ---------------------------------------------------------------
def test_central_spring_superposition():
    """[G] superposition: simple span with a central spring, UDL:
    R_k = (5 w L^4 / 384 EI) / (1/k + L^3 / 48 EI)."""
    L, w, k = 8.0, 12e3, 5e6
    r = Beam(["4 m", "4 m"], ["pin", f"{k} N/m", "roller"], EI=f"{EI} N*m**2").udl(f"{w} N/m", "D").solve()["D"]
    Rk = (5 * w * L ** 4 / (384 * EI)) / (1 / k + L ** 3 / (48 * EI))
    assert r.reactions[1].R == approx(Rk)
    assert r.deflection_si(4.0) == approx(Rk / k)


def test_stiff_spring_tends_to_rigid_support():
    w = "10 kN/m"
    rig = Beam(["5 m", "5 m"], ["pin", "roller", "roller"], EI=f"{EI} N*m**2").udl(w, "D").solve()["D"]
    spr = Beam(["5 m", "5 m"], ["pin", "1e15 N/m", "roller"], EI=f"{EI} N*m**2").udl(w, "D").solve()["D"]
    assert spr.reactions[1].R == pytest.approx(rig.reactions[1].R, rel=1e-6)


def test_gerber_beam_hinge_statics():
    """Fixed at 0, hinge at a, roller at L, UDL: the part right of the hinge is simply supported
    (statics): hinge force w(L-a)/2; fixed end R = wa + w(L-a)/2, M = -(wa^2/2 + w(L-a)a/2)."""
    L, a, w = 10.0, 3.0, 6e3
    r = Beam("10 m", ["fixed", "roller"], EI=f"{EI} N*m**2", hinges=["3 m"]).udl(f"{w} N/m", "D").solve()["D"]
    assert r.M_si(a) == approx(0.0, abs_=1e-6)
    assert r.reactions[0].R == approx(w * a + w * (L - a) / 2)
    assert r.M_si(0.0) == approx(-(w * a ** 2 / 2 + w * (L - a) / 2 * a))
    assert r.reactions[1].R == approx(w * (L - a) / 2)
    assert abs(r.slope_si(a, "right") - r.slope_si(a, "left")) > 1e-6  # the hinge rotates


def test_hinge_at_interior_pin_makes_two_simple_spans():
    b = Beam(["4 m", "6 m"], ["pin", "roller", "roller"], EI=f"{EI} N*m**2", hinges=["4 m"]).udl("5 kN/m", "D")
    r = b.solve()["D"]
    assert r.M_si(4.0) == approx(0.0, abs_=1e-6)
    assert r.extrema(span=1).M_max.value == approx(5e3 * 36 / 8)


def test_two_spans_different_EI_three_moment_equation():
    """[3M]: M_B = -(w/8) (L1^3/EI1 + L2^3/EI2) / (L1/EI1 + L2/EI2)."""
    L1, L2, E1, E2, w = 5.0, 7.0, 2e7, 5e7, 9e3
    r = Beam(["5 m", "7 m"], ["pin", "roller", "roller"], EI=[f"{E1} N*m**2", f"{E2} N*m**2"]).udl(
        f"{w} N/m", "D").solve()["D"]
    MB = -(w / 8) * (L1 ** 3 / E1 + L2 ** 3 / E2) / (L1 / E1 + L2 / E2)
    assert r.M_si(5.0) == approx(MB)


def test_triangular_load_simple_span():
    """[AISC-M] case 2, load increasing to the right, total W = wL/2: R1 = W/3, R2 = 2W/3,
    M_max = 2 W L / (9 sqrt 3) at x = L / sqrt 3."""
    L, w = 9.0, 6e3
    W = w * L / 2
    r = Beam("9 m", ["pin", "roller"], EI=f"{EI} N*m**2").linear("0 kN/m", f"{w} N/m", "0 m", "9 m", "D").solve()["D"]
    assert r.reactions[0].R == approx(W / 3) and r.reactions[1].R == approx(2 * W / 3)
    e = r.extrema()
    assert e.M_max.value == approx(2 * W * L / (9 * math.sqrt(3)))
    assert e.M_max.x == approx(L / math.sqrt(3))


# -- sections and self-weight -------------------------------------------------------------------
class _Props:
    def __init__(self, Ix, mass, E=None):
        self.Ix, self.mass, self.E = Ix, mass, E


class _Obj:
    def __init__(self, **kw):
        self.si = _Props(**kw)


def test_EI_from_section_and_steel_duck_typed():
    sec, st = _Obj(Ix=3.3e-4, mass=74.4), _Obj(Ix=None, mass=None, E=2.0e11)
    b = Beam("6 m", ["pin", "roller"], section=sec, steel=st)
    assert b.EI_si == (pytest.approx(2.0e11 * 3.3e-4),)
    b.self_weight()
    (ld,) = b.loads
    assert ld.case == "D" and ld.w1 == approx(74.4 * 9.80665) and ld.kind == "self_weight"


def test_EI_and_self_weight_from_calckit_section():
    IShape = pytest.importorskip("calckit.sections").IShape
    sec = IShape(d="18 in", bf="7.5 in", tf="0.57 in", tw="0.355 in", r="0.402 in", name="W18X50")
    st = calckit.steel("A992")
    b = Beam("35 ft", ["pin", "roller"], section=sec, steel=st)
    assert b.EI_si[0] == approx(st.si.E * sec.si.Ix)
    b.self_weight(case="D")
    r = b.solve()["D"]
    w = sec.si.mass * 9.80665
    assert r.extrema().M_max.value == approx(w * b.L ** 2 / 8)


def test_self_weight_per_span_sections():
    s1, s2 = _Obj(Ix=1e-4, mass=50.0), _Obj(Ix=2e-4, mass=80.0)
    st = _Obj(Ix=None, mass=None, E=2e11)
    b = Beam(["4 m", "5 m"], ["pin", "roller", "roller"], section=[s1, s2], steel=st)
    assert b.EI_si == (pytest.approx(2e7), pytest.approx(4e7))
    b.self_weight()
    assert [ld.w1 for ld in b.loads] == [approx(50 * 9.80665), approx(80 * 9.80665)]
    with pytest.raises(InputError, match="section"):
        Beam("4 m", ["pin", "roller"], EI="1e4 kN*m**2").self_weight()


def test_unstable_error_is_an_input_error():
    assert issubclass(UnstableError, InputError)


# -- input forms and robustness -----------------------------------------------------------------
def test_spans_and_hinges_accept_quantity_arrays_and_single_values():
    b = Beam(calckit.Q_(np.array([4.0, 5.0]), "m"), ["pin", "roller", "roller"], EI="1e4 kN*m**2", hinges="2 m")
    assert b.spans_si == (4.0, 5.0) and b.hinges_si == (2.0,)


def test_many_equal_spans_interior_moment_tends_to_fixed_end_value():
    """Equal spans under uniform load far from the ends act as fixed-ended spans (symmetry):
    support moment -wL^2/12; the end effect decays by about (2 - sqrt 3) per span (from memory,
    continuous-beam theory), so 10 spans away it is below 1e-5."""
    n, w, L = 20, 10e3, 10.0
    r = Beam([f"{L} m"] * n, ["pin"] + ["roller"] * n, EI=f"{EI} N*m**2").udl(f"{w} N/m", "D").solve()["D"]
    assert r.M_si(100.0) / (w * L ** 2) == pytest.approx(-1 / 12, rel=1e-4)
    d = r.deflection_si(np.arange(n + 1) * L)
    assert np.max(np.abs(d)) <= 1e-10 * r.extrema().defl_max.value


def test_very_unequal_spans_are_stable_and_symmetric():
    b = Beam(["0.05 m", "20 m", "0.05 m"], ["fixed", "roller", "roller", "fixed"], EI="1e6 kN*m**2")
    r = b.udl("10 kN/m", "D").solve()["D"]
    R = [x.R for x in r.reactions]
    assert R[0] == pytest.approx(R[3], rel=1e-9) and R[1] == pytest.approx(R[2], rel=1e-9)
    assert sum(R) == pytest.approx(10e3 * 20.1, rel=1e-9)
    # the stubs act almost as fixed ends: mid-span moment tends to +wL^2/24 (AISC Table 3-23 case 15)
    assert r.M_si(10.05) == pytest.approx(10e3 * 20 ** 2 / 24, rel=2e-2)
