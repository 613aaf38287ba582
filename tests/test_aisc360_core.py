"""calckit.design.aisc360._core: one formula source for both evaluation paths, input parsing, errors.

Every formula and branch condition of the package is evaluated by sympy's lambdified form (the calc-sheet
path, through calckit.render) and by the plain-Python lambda of the numeric path; both come from the same
text and must agree.
"""
from __future__ import annotations

import random

import pytest

import calckit
from calckit.design import aisc360 as A
from calckit.design.aisc360 import _core
from calckit.errors import InputError

REL = 1e-12


def _inputs(names, rng):
    return {n: rng.uniform(0.5, 2.0) for n in names}


@pytest.mark.parametrize("i", range(len(_core.REGISTRY)))
def test_both_paths_agree(i):
    item = _core.REGISTRY[i]
    rng = random.Random(1000 + i)
    for _ in range(5):
        if isinstance(item, _core.Fm):
            vals = _inputs(item.formula.names, rng)
            slow = float(item.formula(**vals))
            fast = item.fast(**vals)
            assert fast == pytest.approx(slow, rel=REL), item
            # the recorded step gives the same number
            assert item.formula.step(**vals).result == pytest.approx(fast, rel=REL)
        else:
            vals = _inputs(item.condition.names, rng)
            assert bool(item.fast(**vals)) is bool(item.condition(**vals)), item


def test_registry_is_populated():
    kinds = {type(x).__name__ for x in _core.REGISTRY}
    assert kinds == {"Fm", "Cond"}
    assert len(_core.REGISTRY) > 80


def test_formula_units_are_consistent():
    """Every formula's declared result dimension matches its inputs (checked with pint on first step)."""
    rng = random.Random(7)
    for item in _core.REGISTRY:
        if isinstance(item, _core.Fm):
            item.formula.step(**_inputs(item.formula.names, rng))  # raises UnitsError on a mismatch


def test_method_parsing():
    assert _core.parse_method("lrfd") == "LRFD"
    assert _core.parse_method(" ASD ") == "ASD"
    with pytest.raises(InputError, match="method"):
        _core.parse_method("LSD")
    with pytest.raises(InputError, match="method"):
        _core.parse_method(None)


def test_section_and_steel_errors():
    w = calckit.section("W18X50")
    with pytest.raises(InputError, match="section"):
        A.flexure("W18X50", "A992", Lb=0)
    with pytest.raises(InputError, match="grade"):
        A.flexure(w, "A999", Lb=0)
    with pytest.raises(InputError, match="steel"):
        A.flexure(w, None, Lb=0)
    with pytest.raises(InputError, match="steel"):
        A.flexure(w, 50, Lb=0)


def test_thickness_outside_the_grade_bands_is_a_clear_error():
    """A572 Gr 50 bands stop at 4 in (calckit/data/steel_grades.csv): a 5 in flange has no Fy."""
    pg = calckit.PlateGirder(d="60 in", tw="1 in", bf_top="30 in", tf_top="5 in")
    with pytest.raises(InputError, match="no Fy"):
        A.flexure(pg, "A572-50", Lb=0)


def test_thickest_element_band_is_used_and_noted():
    """A588 (calckit grade data, from memory of Manual Table 2-5): 50 ksi to 4 in, 46 ksi to 5 in."""
    pg = calckit.PlateGirder(d="60 in", tw="0.5 in", bf_top="24 in", tf_top="4.5 in")
    r = A.flexure(pg, "A588", Lb=0)
    assert r.data["lambda_pf"] == pytest.approx(0.38 * (29000 / 46) ** 0.5, rel=1e-9)
    assert "thickest element" in r.note


def test_en_grade_is_noted():
    r = A.flexure(calckit.section("IPE 300"), "S355", Lb=0)
    assert "EN grade" in r.note
