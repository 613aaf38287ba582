"""calckit.materials against the grade tables they cite.

Sources: AISC Steel Construction Manual 15th ed. Table 2-4 (from memory); EN 1993-1-1:2005 Table 3.1
(from memory); E and G per AISC 360-22 and EN 1993-1-1 3.2.6.
"""
import pytest

import calckit
from calckit.errors import InputError, UnitsError

MPA = 1e6
KSI = 6.894757293168361e6


@pytest.mark.parametrize("grade,fy,fu", [("A992", 50, 65), ("A36", 36, 58), ("A572 Gr 50", 50, 65),
                                         ("A588", 50, 70)])
def test_astm_grades(grade, fy, fu):
    s = calckit.steel(grade)
    assert s.si.fy == pytest.approx(fy * KSI)
    assert s.si.fu == pytest.approx(fu * KSI)
    assert s.si.E == pytest.approx(29000 * KSI)
    assert s.si.G == pytest.approx(11200 * KSI)


@pytest.mark.parametrize("grade,t,fy,fu", [
    ("S235", "10 mm", 235, 360), ("S235", "60 mm", 215, 360),
    ("S275", "40 mm", 275, 430), ("S275", "41 mm", 255, 410),
    ("S355", "16 mm", 355, 510), ("S355", "80 mm", 335, 470),
    ("S460", "20 mm", 460, 540), ("S460", "50 mm", 430, 540),
])
def test_en_thickness_bands(grade, t, fy, fu):
    s = calckit.steel(grade)
    assert s.fy(t).m_as("MPa") == pytest.approx(fy)
    assert s.fu(t).m_as("MPa") == pytest.approx(fu)
    assert s.si.E == pytest.approx(210000 * MPA)
    assert s.si.G == pytest.approx(210000 * MPA / 2.6)


def test_names_are_forgiving():
    assert calckit.steel("s355").name == "S355"
    assert calckit.steel("A572-50").name == "A572-50"
    assert calckit.steel(" a992 ").name == "A992"


def test_unknown_grade_lists_close_names():
    with pytest.raises(InputError, match=r"grade: got 'S356'.*closest: S355"):
        calckit.steel("S356")


def test_thickness_outside_bands():
    with pytest.raises(InputError, match=r"t: got 100 mm.*<= 80 mm"):
        calckit.steel("S355").fy("100 mm")


def test_thickness_needs_unit():
    with pytest.raises(UnitsError, match="t: got the bare number"):
        calckit.steel("S355").fy(20)
