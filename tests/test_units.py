"""calckit.units: quantities and strings at the boundary, SI floats inside."""
import math

import pytest

import calckit
from calckit.errors import InputError, UnitsError
from calckit.units import Q_, convert, display_unit, quantity, to_si

REL = 1e-12


@pytest.mark.parametrize("text,dim,si", [
    ("17.99 in", "length", 17.99 * 0.0254),
    ("6 m", "span", 6.0),
    ("35 ft", "span", 35 * 0.3048),
    ("0.75 kip/ft", "line_load", 750 * 4.4482216152605 / 0.3048),
    ("50 ksi", "stress", 50e3 * 4.4482216152605 / 0.0254 ** 2),
    ("12 kN/m", "line_load", 12e3),
    ("266 kip*ft", "moment", 266e3 * 4.4482216152605 * 0.3048),
    ("800 in**4", "inertia", 800 * 0.0254 ** 4),
])
def test_strings_convert_to_si(text, dim, si):
    # 1 lbf = 4.4482216152605 N and 1 in = 0.0254 m exactly by definition (NIST SP 811, 2008, Appendix B)
    assert to_si(text, dim, "x") == pytest.approx(si, rel=1e-9)


def test_quantity_input_and_output():
    assert to_si(Q_(6, "m"), "length", "L") == 6.0
    q = quantity(1.0, "moment", "US")
    assert str(q.units) in ("kip * foot", "ft * kip", "kip * ft") or q.m == pytest.approx(1 / 1355.8179483314, rel=1e-9)
    assert q.m == pytest.approx(1 / 1355.8179483314, rel=1e-9)
    assert convert(1e6, "stress", "MPa") == pytest.approx(1.0, rel=REL)


def test_exported_registry():
    assert calckit.Q_("3 m").to("mm").m == pytest.approx(3000)
    assert calckit.ureg("1 kip").to("kN").m == pytest.approx(4.4482216152605)


def test_bare_number_for_length_names_parameter():
    with pytest.raises(UnitsError, match=r"span: got the bare number 6.*length"):
        to_si(6, "length", "span")


def test_wrong_dimension_names_parameter_and_value():
    with pytest.raises(UnitsError, match=r"Fy: got .*kN.*expected a stress"):
        to_si("50 kN", "stress", "Fy")


def test_unparseable_string():
    with pytest.raises(UnitsError, match="w: got 'twelve kN/m'"):
        to_si("twelve kN/m", "line_load", "w")


def test_nan_rejected():
    with pytest.raises(InputError, match="NaN"):
        to_si(Q_(math.nan, "m"), "length", "d")


def test_bare_zero_accepted():
    assert to_si(0, "length", "Lb") == 0.0


def test_display_units():
    assert display_unit("moment", "SI") == "kN*m"
    assert display_unit("moment", "US") == "kip*ft"
    with pytest.raises(InputError, match="units"):
        display_unit("moment", "imperial")
    with pytest.raises(InputError, match="dimension"):
        display_unit("moment per banana", "SI")
