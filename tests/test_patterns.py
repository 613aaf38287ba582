"""calckit.analysis.patterns: each arrangement is a real diagram, and together they bound the envelope.

Reference: the envelope with exact enumeration of all 2^n arrangements (calckit.analysis.envelope,
pattern_method="enumerate", itself checked against brute force in tests/test_envelope.py), and the
three-equal-span coefficients (REFERENCES.md, beam formulas; R).
"""
import numpy as np
import pytest

from calckit.analysis import Beam, combinations
from calckit.analysis.patterns import arrangements

REL = 1e-9


def _beam():
    b = Beam(["6 m", "7.5 m", "6 m"], ["pin", "roller", "roller", "roller"], EI="50000 kN*m**2")
    b.udl("10 kN/m", "D")
    b.udl("12 kN/m", "L")
    b.point("20 kN", "9 m", "L")
    return b


def test_arrangements_bound_the_enumerated_envelope():
    sol = _beam().solve()
    combos = combinations("ASCE 7-22", {"D", "L"})
    env = sol.envelope(combos, pattern_method="enumerate")
    arr = arrangements(sol, combos)
    M = np.array([r.M_si(env.x) for r in arr.values()])
    assert np.allclose(M.max(axis=0), env.M_max, rtol=REL, atol=1e-6)
    assert np.allclose(M.min(axis=0), env.M_min, rtol=REL, atol=1e-6)


def test_each_arrangement_is_an_equilibrium_diagram():
    sol = _beam().solve()
    combos = combinations("ASCE 7-22", {"D", "L"})
    for name, r in arrangements(sol, combos).items():
        # moment at the end supports of a pin-roller continuous beam is zero in every real diagram
        assert abs(r.M_si(0.0)) < 1e-6 and abs(r.M_si(19.5)) < 1e-6, name


def test_all_spans_loaded_matches_three_span_coefficient():
    # Three equal spans, UDL on all: support moment -0.100 w L^2 (beam formula tables, R)
    b = Beam(["5 m"] * 3, ["pin", "roller", "roller", "roller"], EI="1e5 kN*m**2")
    b.udl("10 kN/m", "L")
    arr = arrangements(b.solve(), combinations("ASCE 7-22", {"L"}, kind="allowable"))
    full = [r for k, r in arr.items() if "[" not in k][0]
    assert full.M_si(5.0) == pytest.approx(-0.100 * 10e3 * 25, rel=1e-9)
    assert len(arr) == 7  # the 2^3 on/off arrangements of L, less the empty one


def test_names_say_which_spans_are_loaded():
    arr = arrangements(_beam().solve(), combinations("ASCE 7-22", {"D", "L"}))
    assert any("[L: spans 1, 3]" in k for k in arr)
