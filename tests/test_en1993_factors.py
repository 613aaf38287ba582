"""calckit.design.en1993.factors: national-annex sets (EN 1993-1-1:2005 6.1, 6.3.2; EN 1993-1-5 5.1(2))."""
from __future__ import annotations

import pytest

import calckit
from calckit.design import en1993
from calckit.errors import InputError


def test_recommended_values():
    # EN 1993-1-1:2005 6.1(1) Note 2B recommended values; EN 1993-1-5 5.1(2) Note 2 (from memory)
    s = en1993.annex_set("recommended")
    assert (s.gamma_M0, s.gamma_M1, s.gamma_M2, s.eta) == (1.0, 1.0, 1.25, 1.2)
    assert (s.lambda_LT_0, s.beta) == (0.4, 0.75)  # 6.3.2.3(1) recommended
    assert en1993.annex_set(None) is s


def test_unknown_set_lists_the_known_ones():
    with pytest.raises(InputError) as e:
        en1993.annex_set("Narnia")
    msg = str(e.value)
    assert "Narnia" in msg and "recommended" in msg and "UK" in msg


def test_user_dict_overrides_base():
    s = en1993.annex_set({"name": "project", "gamma_M1": 1.1, "deflection_variable": 360})
    assert s.name == "project" and s.gamma_M1 == 1.1 and s.deflection_variable == 360
    assert s.gamma_M0 == 1.0  # from the recommended base
    u = en1993.annex_set({"base": "UK", "gamma_M0": 1.05})
    assert u.eta == en1993.annex_set("UK").eta and u.gamma_M0 == 1.05


@pytest.mark.parametrize("bad", [{"gamma_M0": 0.1}, {"eta": 1.5}, {"ltb_method": "fancy"}, {"beta": 0.5},
                                 {"curves_rolled": ["b", "c"]}, {"colour": "red"}, {"base": "nope"}])
def test_bad_user_sets(bad):
    with pytest.raises(InputError):
        en1993.annex_set(bad)


def test_results_name_the_set_used():
    ipe = calckit.section("IPE 300")
    r = en1993.bending(ipe, "S235", annex={"name": "proj", "gamma_M0": 1.1})
    assert r.data["annex"] == "proj"
    assert r.capacity == pytest.approx(ipe.si.Zx * 235e6 / 1.1, rel=1e-12)
    assert en1993.shear(ipe, "S235", annex="UK").eta == 1.0
