"""Bad input to the beam model: each raises a clear calckit error naming the load, support or parameter."""
from __future__ import annotations

import pytest

from calckit import Beam
from calckit.analysis import UnstableError
from calckit.errors import CalckitError, InputError, UnitsError

EI = "2e4 kN*m**2"


# -- mechanisms ---------------------------------------------------------------------------------
@pytest.mark.parametrize("spans, supports, hinges, words", [
    (["6 m"], ["roller", "roller"], [], "pin"),                              # only rollers: slides
    (["3 m", "3 m"], ["roller", "roller", "roller"], [], "pin"),
    (["6 m"], ["free", "free"], [], "free"),                                 # nothing holds it up
    (["6 m"], ["pin", "roller"], ["3 m"], "hinge"),                          # hinge in a simple span
    (["6 m"], ["fixed", "free"], ["2 m"], "hinge"),                          # hinge in a cantilever
    (["4 m", "4 m"], ["pin", "free", "roller"], ["4 m"], "hinge"),           # two simple links
    (["6 m"], ["pin", "free"], [], "reaction"),                              # one pin alone
    (["4 m", "4 m", "4 m"], ["pin", "roller", "roller", "roller"], ["2 m", "3 m"], "move"),  # link 2-3 m
])
def test_mechanism_raises_unstable_error_with_reason(spans, supports, hinges, words):
    with pytest.raises(UnstableError, match="unstable") as ei:
        Beam(spans, supports, EI=EI, hinges=hinges)
    assert words in str(ei.value)


def test_unstable_message_locates_the_moving_part():
    with pytest.raises(UnstableError, match=r"between x = 6 m and x = 12 m"):
        Beam(["4 m", "4 m", "4 m"], ["pin", "roller", "free", "roller"], EI=EI, hinges=["6 m", "10 m"])


def test_stable_gerber_layouts_are_accepted():
    Beam(["4 m", "4 m", "4 m"], ["pin", "roller", "roller", "roller"], EI=EI, hinges=["5 m"])
    Beam(["4 m", "4 m", "4 m"], ["pin", "roller", "roller", "roller"], EI=EI, hinges=["2 m", "6 m"])
    Beam(["6 m", "2 m"], ["fixed", "free", "roller"], EI=EI, hinges=["6 m"])


# -- geometry -----------------------------------------------------------------------------------
@pytest.mark.parametrize("spans", [["0 m"], ["-3 m"], ["4 m", "0 m"]])
def test_zero_or_negative_span(spans):
    with pytest.raises(InputError, match=r"spans\[\d\]"):
        Beam(spans, ["pin"] + ["roller"] * len(spans), EI=EI)


def test_empty_spans():
    with pytest.raises(InputError, match="spans"):
        Beam([], ["pin"], EI=EI)


def test_wrong_number_of_supports():
    with pytest.raises(InputError, match=r"supports: got 2 supports for 2 span\(s\); expected 3"):
        Beam(["4 m", "4 m"], ["pin", "roller"], EI=EI)


def test_negative_spring_stiffness_names_the_support():
    with pytest.raises(InputError, match=r"supports\[1\].*stiffness > 0"):
        Beam(["4 m", "4 m"], ["pin", "-5 kN/mm", "roller"], EI=EI)


def test_zero_spring_stiffness_refused():
    with pytest.raises(InputError, match=r"supports\[1\]"):
        Beam(["4 m", "4 m"], ["pin", "0 kN/mm", "roller"], EI=EI)


def test_unknown_support_word():
    with pytest.raises(InputError, match=r"supports\[0\].*pin, roller, fixed, free"):
        Beam("4 m", ["hinge-ish", "roller"], EI=EI)


def test_spring_word_without_stiffness():
    with pytest.raises(InputError, match="stiffness"):
        Beam("4 m", ["pin", "spring"], EI=EI)


def test_bad_EI():
    with pytest.raises(InputError, match="EI"):
        Beam("4 m", ["pin", "roller"], EI="-1 kN*m**2")
    with pytest.raises(InputError, match="EI"):
        Beam("4 m", ["pin", "roller"])
    with pytest.raises(UnitsError, match="EI"):
        Beam("4 m", ["pin", "roller"], EI="200 GPa")
    with pytest.raises(InputError, match="one per span"):
        Beam(["4 m", "4 m"], ["pin", "roller", "roller"], EI=[EI])


def test_bare_number_span_is_a_units_error():
    with pytest.raises(UnitsError, match=r"spans\[0\]"):
        Beam([6], ["pin", "roller"], EI=EI)


@pytest.mark.parametrize("hinge, words", [("0 m", "strictly inside"), ("9 m", "strictly inside"),
                                          ("0.5 m", None)])
def test_hinge_positions(hinge, words):
    if words is None:  # a hinge beside a fixed end of a propped cantilever is fine
        Beam("8 m", ["fixed", "roller"], EI=EI, hinges=[hinge])
        return
    with pytest.raises(InputError, match=words):
        Beam("8 m", ["fixed", "roller"], EI=EI, hinges=[hinge])


def test_hinge_at_fixed_support_and_duplicate_hinge():
    with pytest.raises(InputError, match="fixed support"):
        Beam(["4 m", "4 m"], ["pin", "fixed", "roller"], EI=EI, hinges=["4 m"])
    with pytest.raises(InputError, match="same place"):
        Beam(["4 m", "4 m"], ["fixed", "roller", "roller"], EI=EI, hinges=["2 m", "2 m"])


# -- loads --------------------------------------------------------------------------------------
def beam():
    return Beam(["5 m", "5 m"], ["pin", "roller", "roller"], EI=EI)


def test_point_load_outside_the_beam_names_the_load():
    with pytest.raises(InputError, match=r"point load P = '10 kN' \(case 'L'\): x = '12 m' is outside"):
        beam().point("10 kN", "12 m", "L")
    with pytest.raises(InputError, match="outside"):
        beam().point("10 kN", "-1 m", "L")


def test_moment_outside_and_at_hinge():
    with pytest.raises(InputError, match="moment"):
        beam().moment("5 kN*m", "11 m", "D")
    b = Beam("8 m", ["fixed", "roller"], EI=EI, hinges=["3 m"])
    with pytest.raises(InputError, match="hinge"):
        b.moment("5 kN*m", "3 m", "D")


def test_partial_load_end_before_start_names_the_load():
    with pytest.raises(InputError, match=r"udl w = '5 kN/m' \(case 'D'\): end = '2 m' is not after start = '4 m'"):
        beam().udl("5 kN/m", "D", start="4 m", end="2 m")
    with pytest.raises(InputError, match="linear load"):
        beam().linear("1 kN/m", "2 kN/m", "3 m", "3 m", "D")
    with pytest.raises(InputError, match="outside"):
        beam().udl("5 kN/m", "D", start="4 m", end="12 m")


def test_load_with_wrong_units_names_the_parameter():
    with pytest.raises(UnitsError, match="P"):
        beam().point("10 kN/m", "2 m", "D")
    with pytest.raises(UnitsError, match="w"):
        beam().udl(5, "D")
    with pytest.raises(UnitsError, match="x"):
        beam().point("10 kN", 2, "D")


def test_bad_case_name():
    with pytest.raises(InputError, match="case"):
        beam().point("1 kN", "1 m", "")
    with pytest.raises(InputError, match="case"):
        beam().point("1 kN", "1 m", None)


def test_unknown_case_asked_for():
    b = beam().udl("5 kN/m", "D")
    sol = b.solve()
    with pytest.raises(InputError, match=r"case: got 'L'; expected one of the beam's load cases \['D'\]"):
        sol["L"]
    with pytest.raises(InputError, match="'L'"):
        b.loads_in("L")
    with pytest.raises(InputError, match="'L'"):
        sol.combine({"D": 1.0, "L": 1.0})


def test_no_loads():
    with pytest.raises(InputError, match="no loads"):
        beam().solve()


def test_evaluation_outside_the_beam():
    r = beam().udl("5 kN/m", "D").solve()["D"]
    with pytest.raises(InputError, match="x: got 11 m"):
        r.M_si(11.0)
    with pytest.raises(InputError, match="x"):
        r.V("-1 m")
    with pytest.raises(InputError, match="span"):
        r.extrema(span=2)


def test_every_error_is_a_calckit_error():
    for exc in (UnstableError, InputError, UnitsError):
        assert issubclass(exc, CalckitError)
