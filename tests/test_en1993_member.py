"""calckit.design.en1993.member: member-level checks along a beam (EN 1993-1-1:2005, EN 1993-1-5:2006)."""
from __future__ import annotations

import numpy as np
import pytest

import calckit
from calckit.design import en1993
from calckit.errors import InputError


def udl_arrays(w, L, n=101):
    x = np.linspace(0.0, L, n)
    return x, w * x * (L - x) / 2, w * (L / 2 - x)


def test_segments_checked_with_their_own_moment():
    s = calckit.section("IPE 400")
    x, M, V = udl_arrays(30e3, 8.0)
    r = en1993.check_member(s, "S275", x=x, M=M, V=V, restraints=[0, 2, 4, 6, 8], zg="200 mm")
    ltb = [c for c in r.checks if c.limit_state.startswith("Lateral")]
    assert len(ltb) == 4 and [c.segment for c in ltb] == [(0, 2), (2, 4), (4, 6), (6, 8)]
    assert ltb[1].demand == pytest.approx(30e3 * 64 / 8, rel=1e-6)  # peak wL^2/8 at midspan
    assert ltb[0].demand == pytest.approx(30e3 * 2 * 6 / 2, rel=1e-6)  # M(2 m)
    assert ltb[0].C1 > ltb[1].C1  # steeper gradient in the end segment
    assert r.governing is not None and r.standard.startswith("EN 1993-1-1")


def test_failing_member_is_a_result():
    s = calckit.section("IPE 200")
    x, M, V = udl_arrays(60e3, 6.0)
    r = en1993.check_member(s, "S235", x=x, M=M, V=V, deflections={"SLS": ("total", 0.05)})
    assert r.passed is False and r.max_ratio > 1


def test_continuous_restraint_skips_ltb_and_forces_from_reactions():
    b = calckit.Beam(["6 m"], ["pin", "roller"], EI="40000 kN*m**2")
    b.udl("20 kN/m", "D")
    res = b.solve()["D"]
    s = calckit.section("IPE 300")
    r = en1993.check_member(s, "S355", analysis=res, restraints="continuous",
                            forces=[{"x": 0.0, "ss": 0.1, "load_type": "c", "c": 0.0, "flange": "bottom"}])
    names = [c.limit_state for c in r.checks]
    assert not any(n.startswith("Lateral") for n in names)
    t = next(c for c in r.checks if c.limit_state.startswith("Transverse force on"))
    assert t.demand == pytest.approx(60e3, rel=1e-6)
    bend = next(c for c in r.checks if c.limit_state == "Bending")
    assert bend.demand == pytest.approx(20e3 * 36 / 8, rel=1e-4)


def test_two_span_hogging_checked():
    b = calckit.Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="40000 kN*m**2")
    b.udl("20 kN/m", "D")
    res = b.solve()["D"]
    r = en1993.check_member(calckit.section("IPE 360"), "S355", analysis=res, restraints=[0, 6, 12])
    bends = [c for c in r.checks if c.limit_state == "Bending"]
    assert {c.data["compression_flange"] for c in bends} == {"top", "bottom"}
    hog = next(c for c in bends if c.data["compression_flange"] == "bottom")
    assert hog.demand == pytest.approx(0.125 * 20e3 * 36, rel=1e-4)


def test_bad_inputs():
    s = calckit.section("IPE 300")
    x, M, V = udl_arrays(10e3, 6.0)
    with pytest.raises(InputError, match="restraints"):
        en1993.check_member(s, "S235", x=x, M=M, V=V, restraints=[])
    with pytest.raises(InputError, match="restraints"):
        en1993.check_member(s, "S235", x=x, M=M, V=V, restraints=[0.0, 7.0])  # beyond the member
    with pytest.raises(InputError, match="overhang_root"):
        en1993.check_member(s, "S235", x=x, M=M, V=V, restraints=[1.0, 6.0], overhang_root="pinned")
    with pytest.raises(InputError):
        en1993.check_member(s, "S235", x=x[::-1], M=M, V=V)
    with pytest.raises(InputError):
        en1993.check_member(s, "S235", x=x, M=M[:-1], V=V)
    with pytest.raises(InputError):
        en1993.check_member(s, "S235", x=x, M=M, V=V, forces=[{"x": 1.0, "ss": -0.1, "F": 1e3}])
    with pytest.raises(InputError):
        en1993.check_member(s, "S235", x=x, M=M, V=V, annex="nowhere")
    with pytest.raises(InputError):
        en1993.check_member(s, "S235")


def test_envelope_adapter():
    from collections import namedtuple

    Combo = namedtuple("Combo", "name factors")
    b = calckit.Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI="40000 kN*m**2")
    b.udl("10 kN/m", "D").udl("15 kN/m", "L")
    env = b.solve().envelope([Combo("1.35G + 1.5Q", {"D": 1.35, "L": 1.5})])
    r = en1993.check_member(calckit.section("IPE 400"), "S355", analysis=env, restraints=[0, 3, 6, 9, 12])
    assert any(c.limit_state.startswith("Lateral") for c in r.checks)
    bend = [c for c in r.checks if c.limit_state.startswith("Bending")]
    assert max(c.demand for c in bend) == pytest.approx(float(np.max(np.abs(env.M_min))), rel=1e-9)


def test_stiffened_forces_get_the_bearing_stiffener_checks():
    """A force marked stiffened (or with a given stiffener) is checked as a pair of bearing stiffeners to
    EN 1993-1-5 section 9 (calckit.design.en1993.stiffeners, itself recomputed by hand in
    tests/test_en1993_stiffeners.py) instead of the web check of section 6; without a given pair the
    thinnest passing pair is sized, and the same call made directly gives the same numbers."""
    import calckit
    from calckit.design import en1993

    g = calckit.PlateGirder(d="1580 mm", tw="14 mm", bf_top="550 mm", tf_top="40 mm", weld="8 mm")
    x = [0.0, 12.0, 24.0]
    M = [0.0, 8.0e6, 0.0]
    V = [1.3e6, 0.0, -1.3e6]
    forces = [{"x": 0, "ss": "200 mm", "F": "1300 kN", "load_type": "c", "c": 0, "flange": "bottom",
               "stiffened": True},
              {"x": 24, "ss": "200 mm", "F": "1300 kN", "load_type": "c", "c": 0, "flange": "bottom",
               "stiffener": ("200 mm", "20 mm")}]
    res = en1993.check_member(g, "S355", x=x, M=M, V=V, restraints="continuous", forces=forces)
    assert not [c for c in res.checks if c.limit_state.startswith("Transverse force")]
    left = [c for c in res.checks if c.limit_state.startswith("Bearing stiffener") and c.location == 0.0]
    right = [c for c in res.checks if c.limit_state.startswith("Bearing stiffener") and c.location == 24.0]
    assert len(left) == len(right) == 5 and all(c.passed for c in left)
    sized = en1993.size_bearing_stiffener(g, "S355", "1300 kN", end=True, e="0 m", steps=False)
    assert [c.ratio for c in left] == pytest.approx([c.ratio for c in sized.checks], rel=1e-12)
    direct = en1993.bearing_stiffener(g, "S355", "1300 kN", b_s="200 mm", t_s="20 mm", end=True, e="0 m",
                                      steps=False)
    assert [c.ratio for c in right] == pytest.approx([c.ratio for c in direct], rel=1e-12)
    assert any("pair sized" in n for n in res.notes)
