"""Tests of calckit.analysis.formulas: recognition of the standard cases and agreement of the closed
forms (evaluated) with the general solver. The closed forms themselves are checked against the
AISC Manual table in tests/validation/test_beam_formulas.py."""
from __future__ import annotations

import subprocess
import sys

import pytest

from calckit import Beam
from calckit.analysis.formulas import STANDARD_CASE_KEYS, detect_standard_case, standard_case, standard_cases
from calckit.errors import InputError

REL = 1e-9
EI = 2.5e7


def beam(supports, L="7 m", **kw):
    return Beam(L, supports, EI=f"{EI} N*m**2", **kw)


def check_against_solver(b, case, det):
    """Every tabulated result (times its sign) equals the solver's value."""
    r = b.solve()[case]
    v = det.evaluate()
    sg = det.case.sign
    L = b.L
    e = r.extrema()
    flip = (lambda x: L - x) if det.mirrored else (lambda x: x)
    R = [rc.R for rc in r.reactions]
    if det.mirrored:
        R = R[::-1]
    if "R_1" in v:
        assert R[0] == pytest.approx(v["R_1"], rel=REL)
    if "R_2" in v:
        assert R[1] == pytest.approx(v["R_2"], rel=REL)
    if "V_max" in v:
        assert abs(e.V_abs.value) == pytest.approx(v["V_max"], rel=REL)
    if "M_max" in v:
        target = e.M_max if sg["M_max"] > 0 else e.M_min
        assert target.value == pytest.approx(sg["M_max"] * v["M_max"], rel=REL)
    for end, name in ((0.0, "M_1"), (L, "M_2")):
        if name in v:
            x = flip(end)
            assert r.M_si(x) == pytest.approx(sg[name] * v[name], rel=REL)
    if "x_M" in v:
        assert flip(e.M_max.x) == pytest.approx(v["x_M"], rel=1e-8)
    assert e.defl_max.value == pytest.approx(v["delta_max"], rel=REL)
    if "x_delta" in v:
        assert flip(e.defl_max.x) == pytest.approx(v["x_delta"], rel=1e-7)


@pytest.mark.parametrize("supports, load, key, mirrored", [
    (["pin", "roller"], ("udl",), "simple_udl", False),
    (["roller", "pin"], ("udl",), "simple_udl", False),
    (["pin", "roller"], ("P", 3.5), "simple_point_center", False),
    (["pin", "roller"], ("P", 5.0), "simple_point", False),
    (["pin", "roller"], ("P", 1.5), "simple_point", True),
    (["fixed", "free"], ("udl",), "cantilever_udl", False),
    (["free", "fixed"], ("udl",), "cantilever_udl", True),
    (["fixed", "free"], ("P", 7.0), "cantilever_point_tip", False),
    (["free", "fixed"], ("P", 0.0), "cantilever_point_tip", True),
    (["fixed", "fixed"], ("udl",), "fixed_fixed_udl", False),
    (["fixed", "fixed"], ("P", 3.5), "fixed_fixed_point_center", False),
    (["pin", "fixed"], ("udl",), "propped_udl", False),
    (["fixed", "roller"], ("udl",), "propped_udl", True),
])
def test_detect_and_agree_with_solver(supports, load, key, mirrored):
    b = beam(supports)
    if load[0] == "udl":
        b.udl("6 kN/m", "D").udl("4 kN/m", "D")  # two full-length loads are summed
    else:
        b.point("25 kN", f"{load[1]} m", "D")
    det = detect_standard_case(b, "D")
    assert det is not None and det.case.key == key and det.mirrored == mirrored
    check_against_solver(b, "D", det)


@pytest.mark.parametrize("make", [
    lambda: Beam(["4 m", "4 m"], ["pin", "roller", "roller"], EI="1e4 kN*m**2").udl("1 kN/m", "D"),
    lambda: beam(["pin", "roller"]).udl("1 kN/m", "D", start="1 m"),
    lambda: beam(["pin", "roller"]).udl("1 kN/m", "D").point("1 kN", "2 m", "D"),
    lambda: beam(["pin", "roller"]).linear("0 kN/m", "1 kN/m", "0 m", "7 m", "D"),
    lambda: beam(["pin", "roller"]).moment("1 kN*m", "2 m", "D"),
    lambda: beam(["pin", "roller"]).point("1 kN", "2 m", "D").point("1 kN", "3 m", "D"),
    lambda: beam(["pin", "5 kN/mm"]).udl("1 kN/m", "D"),
    lambda: beam(["fixed", "roller"], hinges=["2 m"]).udl("1 kN/m", "D"),
    lambda: beam(["fixed", "free"]).point("1 kN", "3 m", "D"),
    lambda: beam(["fixed", "fixed"]).point("1 kN", "3 m", "D"),
])
def test_not_a_standard_case(make):
    assert detect_standard_case(make(), "D") is None


def test_unknown_case_raises():
    with pytest.raises(InputError, match="case"):
        detect_standard_case(beam(["pin", "roller"]).udl("1 kN/m", "D"), "L")
    with pytest.raises(InputError, match="key"):
        standard_case("nope")


def test_E_and_I_given_separately_with_section_and_steel():
    class P:
        def __init__(self, **kw):
            self.__dict__.update(kw)

    class O:
        def __init__(self, **kw):
            self.si = P(**kw)

    b = Beam("6 m", ["pin", "roller"], section=O(Ix=1.5e-4, mass=40.0), steel=O(E=2.1e11))
    b.udl("5 kN/m", "D")
    det = detect_standard_case(b, "D")
    assert det.values["E"] == 2.1e11 and det.values["I"] == 1.5e-4 and "EI" not in det.values
    check_against_solver(b, "D", det)


def test_every_case_has_equations_for_its_inputs():
    cases = standard_cases()
    assert set(cases) == set(STANDARD_CASE_KEYS)
    for c in cases.values():
        assert "delta_max" in c.equations and "M_max" in c.equations
        for eq in c.equations.values():
            assert {s.name for s in eq.rhs.free_symbols} <= set(c.inputs)
        assert "AISC" in c.reference


def test_sympy_is_imported_lazily():
    code = ("import sys; import calckit.analysis.formulas as f; a = 'sympy' in sys.modules; "
            "f.standard_cases(); print(a, 'sympy' in sys.modules)")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.split() == ["False", "True"]
