"""Tests of calckit.analysis.combinations: the Combination record, expansion of alternatives, duplicates,
leading-action rotation, 6.10 against 6.10a/6.10b, options and errors.

Published factor values are checked in tests/validation/test_combination_tables.py; the values used
here are the same ASCE/SEI 7-22 Sec. 2.3.1 / 2.4.1 and EN 1990:2002+A1:2005 Table A1.1 / A1.2(B)
values (from memory), written out by hand.
"""
from __future__ import annotations

import copy
import dataclasses
import json
import pickle

import pytest

from calckit.analysis.combinations import (
    KINDS, STANDARDS, Combination, combinations, psi_factors, user_combinations,
)
from calckit.errors import InputError

TOL = 1e-9


def names(combos):
    return [c.name for c in combos]


def factor_sets(combos):
    return [dict(c.factors) for c in combos]


# ---------------------------------------------------------------------------------------------- record


def test_combination_record_is_immutable_hashable_and_copyable():
    c = Combination("C1", {"D": 1.2, "L": 1.6}, "strength", "ref", frozenset({"L"}))
    with pytest.raises(dataclasses.FrozenInstanceError):
        c.name = "x"  # type: ignore[misc]
    with pytest.raises(TypeError):
        c.factors["D"] = 2.0  # type: ignore[index]
    with pytest.raises(TypeError):
        c.factors.update({"W": 1.0})  # type: ignore[attr-defined]
    assert isinstance(c.factors, dict) and c.factors == {"D": 1.2, "L": 1.6}
    assert c.permanent == {"D"}
    assert hash(c) == hash(Combination("C1", {"D": 1.2, "L": 1.6}, "strength", "ref", frozenset({"L"})))
    for clone in (pickle.loads(pickle.dumps(c)), copy.deepcopy(c), copy.copy(c)):
        assert clone == c
        with pytest.raises(TypeError):
            clone.factors["D"] = 0.0  # type: ignore[index]
    assert dataclasses.asdict(c)["factors"] == {"D": 1.2, "L": 1.6}
    assert json.loads(json.dumps(c.factors)) == {"D": 1.2, "L": 1.6}


def test_combination_copies_the_given_dict():
    given = {"D": 1.4}
    c = Combination("C", given)
    given["D"] = 99.0
    assert c.factors == {"D": 1.4}


def test_label_wording():
    assert Combination("a", {"D": 1.2, "L": 1.6, "S": 0.5}).label() == "1.2D + 1.6L + 0.5S"
    assert Combination("b", {"D": 1.0, "L": 1.0}).label() == "D + L"
    assert Combination("c", {"D": 0.9, "W": -1.0}).label() == "0.9D - W"
    assert Combination("d", {"G": 1.05 * 1.0, "dead load": 1.35, "W": 0.0}).label() == "1.05G + 1.35(dead load)"
    assert Combination("e", {"W": -1.5}).label() == "-1.5W"


@pytest.mark.parametrize("kwargs, word", [
    ({"name": "", "factors": {"D": 1.0}}, "name"),
    ({"name": "C", "factors": {"D": "1.2"}}, "factor on 'D'"),
    ({"name": "C", "factors": {"D": True}}, "factor on 'D'"),
    ({"name": "C", "factors": {"D": float("nan")}}, "factor on 'D'"),
    ({"name": "C", "factors": {"D": 1.0}, "kind": "ultimate"}, "kind"),
    ({"name": "C", "factors": {"D": 1.0}, "variable": frozenset({"L"})}, "variable"),
    ({"name": "C", "factors": [("D", 1.0)]}, "factors"),
])
def test_combination_rejects_bad_fields(kwargs, word):
    with pytest.raises(InputError, match=word):
        Combination(**kwargs)


# ---------------------------------------------------------------------------------------------- ASCE 7-22


def test_asce_dead_and_live_only():
    combos = combinations("ASCE 7-22", {"D", "L"})
    assert names(combos) == ["LRFD 1: 1.4D", "LRFD 2: 1.2D + 1.6L"]
    assert [c.variable for c in combos] == [frozenset(), frozenset({"L"})]
    assert all(c.kind == "strength" for c in combos)
    asd = combinations("ASCE 7-22", ["D", "L"], kind="allowable")
    assert names(asd) == ["ASD 1: D", "ASD 2: D + L"]


def test_asce_alternatives_expanded_only_for_cases_present():
    combos = combinations("ASCE 7-22", {"D", "L", "S"})
    assert factor_sets(combos) == [
        {"D": 1.4},
        {"D": 1.2, "L": 1.6, "S": 0.5},
        {"D": 1.2, "S": 1.6, "L": 1.0},
    ]
    assert names(combos)[2] == "LRFD 3: 1.2D + 1.6S + L"
    with_wind = combinations("ASCE 7-22", {"D", "L", "Lr", "S", "W"})
    assert len(with_wind) == 1 + 2 + 4 + 2 + 1  # combinations 1, 2 (x2 roof), 3 (x2 roof x 2), 4 (x2), 5
    assert len(set(names(with_wind))) == len(with_wind)
    assert {"D": 1.2, "Lr": 1.6, "W": 0.5} in factor_sets(with_wind)
    assert {"D": 0.9, "W": 1.0} in factor_sets(with_wind)


def test_asce_duplicates_removed():
    # without D, ASD 7 (0.6D + 0.6W) reduces to 0.6W, a copy of ASD 5 (D + 0.6W)
    combos = combinations("ASCE 7-22", {"L", "W"}, kind="allowable")
    assert factor_sets(combos) == [{"L": 1.0}, {"W": 0.6}, {"L": 0.75, "W": 0.45}]
    assert names(combos)[1].startswith("ASD 5:")
    # without D, "total" equals "live"
    defl = combinations("ASCE 7-22", {"L"}, kind="deflection")
    assert names(defl) == ["Deflection live: L"]


def test_asce_deflection_cases():
    defl = combinations("ASCE 7-22", {"D", "L"}, kind="deflection")
    assert factor_sets(defl) == [{"D": 1.0}, {"L": 1.0}, {"D": 1.0, "L": 1.0}]
    assert all(c.kind == "deflection" and "common practice" in c.reference for c in defl)
    roof = combinations("ASCE 7-22", {"D", "S"}, kind="deflection")
    assert factor_sets(roof) == [{"D": 1.0}, {"S": 1.0}, {"D": 1.0, "S": 1.0}]


def test_asce_mapping_of_case_names_to_symbols():
    combos = combinations("ASCE 7-22", {"D": "D", "SDL": "D", "L1": "L", "snow": "s"})
    assert dict(combos[1].factors) == {"D": 1.2, "SDL": 1.2, "L1": 1.6, "snow": 0.5}
    assert combos[1].variable == {"L1", "snow"}
    assert combos[0].label() == "1.4D + 1.4SDL"


def test_asce_standard_spellings():
    want = factor_sets(combinations("ASCE 7-22", {"D", "L"}))
    for spelling in ("ASCE/SEI 7-22", "asce 7-22", "ASCE7-22"):
        assert factor_sets(combinations(spelling, {"D", "L"})) == want


# ---------------------------------------------------------------------------------------------- EN 1990


EN_CASES = {"G": "G", "L": "Q", "S": "S", "W": "W"}


def test_en_leading_action_rotation():
    combos = combinations("EN 1990", EN_CASES, category="B", snow="H<=1000m", favourable_permanent=False)
    assert len(combos) == 3
    psi0 = {"L": 0.7, "S": 0.5, "W": 0.6}  # Table A1.1: category B, snow H <= 1000 m, wind
    for c, lead in zip(combos, ("L", "S", "W")):
        assert f"{lead} leading" in c.name and "6.10" in c.reference
        assert c.factors["G"] == pytest.approx(1.35, abs=TOL)
        assert c.factors[lead] == pytest.approx(1.5, abs=TOL)
        for other in set(psi0) - {lead}:
            assert c.factors[other] == pytest.approx(1.5 * psi0[other], abs=TOL)
        assert c.variable == {"L", "S", "W"}


def test_en_favourable_permanent_variants():
    combos = combinations("EN 1990", {"G", "Q"}, category="A")
    assert factor_sets(combos) == [{"G": 1.35, "Q": 1.5}, {"G": 1.0, "Q": 1.5}]
    assert "permanent favourable" in combos[1].name and combos[1].variable == {"Q"}
    # no variable action: the favourable variant would only be a smaller copy
    assert factor_sets(combinations("EN 1990", {"G"})) == [{"G": 1.35}]


def test_en_6_10_versus_6_10ab():
    one = combinations("EN 1990", EN_CASES, category="B", snow="H<=1000m", favourable_permanent=False)
    two = combinations("EN 1990", EN_CASES, category="B", snow="H<=1000m", equation="6.10ab",
                       favourable_permanent=False)
    assert len(one) == 3 and len(two) == 1 + 3
    a, *b = two
    assert a.name.startswith("ULS 6.10a:") and "(6.10a)" in a.reference
    assert dict(a.factors) == pytest.approx({"G": 1.35, "L": 1.05, "S": 0.75, "W": 0.9}, abs=TOL)
    for cb, c610 in zip(b, one):
        assert cb.name.startswith("ULS 6.10b,")
        assert cb.factors["G"] == pytest.approx(0.85 * 1.35, abs=TOL)
        assert {k: v for k, v in cb.factors.items() if k != "G"} == pytest.approx(
            {k: v for k, v in c610.factors.items() if k != "G"}, abs=TOL)


def test_en_categories_per_case_and_roof_case():
    combos = combinations("EN 1990", ["G", "L", "L2", "Lr"], categories={"L": "B", "L2": "E"},
                          favourable_permanent=False)
    f = {c.name.split(":")[0].split(", ")[1]: dict(c.factors) for c in combos}
    assert f["L leading"] == pytest.approx({"G": 1.35, "L": 1.5, "L2": 1.5}, abs=TOL)  # psi0(E) = 1.0
    assert f["L2 leading"] == pytest.approx({"G": 1.35, "L2": 1.5, "L": 1.05}, abs=TOL)
    assert f["Lr leading"] == pytest.approx({"G": 1.35, "Lr": 1.5, "L": 1.05, "L2": 1.5}, abs=TOL)
    assert all("Lr" not in v or k == "Lr leading" for k, v in f.items())  # psi0(H) = 0


def test_en_serviceability():
    kw = {"category": "B", "snow": "H>1000m"}
    char = combinations("EN 1990", EN_CASES, kind="characteristic", **kw)
    assert [c.kind for c in char] == ["characteristic"] * 3
    assert dict(char[0].factors) == pytest.approx({"G": 1.0, "L": 1.0, "S": 0.7, "W": 0.6}, abs=TOL)
    freq = combinations("EN 1990", EN_CASES, kind="frequent", **kw)
    assert dict(freq[2].factors) == pytest.approx({"G": 1.0, "W": 0.2, "L": 0.3, "S": 0.2}, abs=TOL)
    (qp,) = combinations("EN 1990", EN_CASES, kind="quasi-permanent", **kw)
    assert dict(qp.factors) == pytest.approx({"G": 1.0, "L": 0.3, "S": 0.2}, abs=TOL)  # psi2 wind = 0
    assert qp.variable == {"L", "S"} and "(6.16b)" in qp.reference


def test_en_duplicates_removed():
    # two roof (category H) actions: frequent with either leading is G alone (psi1 = psi2 = 0)
    freq = combinations("EN 1990", {"G": "G", "R1": "Q", "R2": "Q"}, kind="frequent", category="H")
    assert factor_sets(freq) == [{"G": 1.0}]


def test_en_overrides_of_gamma_and_psi():
    combos = combinations("EN 1990", {"G", "Q", "W"}, category="B", gamma={"G_sup": 1.25},
                          psi={"W": (0.5, 0.2, 0.0)}, favourable_permanent=False)
    assert dict(combos[0].factors) == pytest.approx({"G": 1.25, "Q": 1.5, "W": 0.75}, abs=TOL)
    assert "user values" in combos[0].reference
    by_row = combinations("EN 1990", {"G", "Q", "W"}, category="B", psi={"B": [0.5, 0.5, 0.3]},
                          favourable_permanent=False)
    assert by_row[1].factors["Q"] == pytest.approx(0.75, abs=TOL)
    assert psi_factors("B") == (0.7, 0.5, 0.3)  # the table itself is unchanged


# ---------------------------------------------------------------------------------------------- errors


@pytest.mark.parametrize("call, words", [
    (lambda: combinations("BS 5950", {"D"}), ["standard", "ASCE 7-22", "EN 1990"]),
    (lambda: combinations("ASCE 7-22", {"D"}, kind="frequent"), ["kind", "strength", "allowable"]),
    (lambda: combinations("EN 1990", {"G"}, kind="allowable"), ["kind", "quasi-permanent"]),
    (lambda: combinations("ASCE 7-22", {"D", "X"}), ["'X'", "D, L, Lr, S, R, W"]),
    (lambda: combinations("ASCE 7-22", "DL"), ["cases"]),
    (lambda: combinations("ASCE 7-22", set()), ["cases"]),
    (lambda: combinations("ASCE 7-22", {"D"}, category="B"), ["category", "live_05"]),
    (lambda: combinations("EN 1990", {"G", "Q"}), ["category", "'Q'"]),
    (lambda: combinations("EN 1990", {"G", "Q"}, category="Z"), ["'Z'", "A, B, C, D, E, F, G, H"]),
    (lambda: combinations("EN 1990", {"G", "L"}, categories={"L": "B", "L9": "A"}), ["L9"]),
    (lambda: combinations("EN 1990", {"G", "W"}, categories={"W": "B"}), ["'W'", "imposed"]),
    (lambda: combinations("EN 1990", {"G", "S"}), ["snow", "H<=1000m"]),
    (lambda: combinations("EN 1990", {"G", "S"}, snow="coastal"), ["'coastal'", "nordic"]),
    (lambda: combinations("EN 1990", {"G", "X"}), ["'X'", "G, Q, S, W, T"]),
    (lambda: combinations("EN 1990", {"G"}, annex="UK"), ["annex", "'UK'", "'recommended'"]),
    (lambda: combinations("EN 1990", {"G"}, equation="6.10c"), ["equation", "'6.10ab'"]),
    (lambda: combinations("EN 1990", {"G"}, gamma={"G_sub": 1.2}), ["G_sub", "G_sup"]),
    (lambda: combinations("EN 1990", {"G"}, gamma={"xi": 1.5}), ["xi"]),
    (lambda: combinations("EN 1990", {"G", "W"}, psi={"W": (0.5, 0.2)}), ["psi", "three numbers"]),
    (lambda: combinations("EN 1990", {"G", "W"}, psi={"Z": (0.5, 0.2, 0)}), ["'Z'", "wind"]),
    (lambda: psi_factors("snow"), ["row", "snow_nordic"]),
])
def test_errors_name_parameter_and_expected(call, words):
    with pytest.raises(InputError) as info:
        call()
    for w in words:
        assert w in str(info.value)


# ---------------------------------------------------------------------------------------------- user


SPEC = [
    {"name": "U1", "factors": {"D": 1.2, "L": 1.6}, "kind": "strength", "reference": "project spec 3.1"},
    {"name": "U2", "factors": {"D": 1.0, "W": -1.0}},
]


def test_user_combinations_valid():
    u1, u2 = user_combinations(SPEC, cases={"D", "L", "W"})
    assert (u1.name, dict(u1.factors), u1.kind, u1.reference) == ("U1", {"D": 1.2, "L": 1.6}, "strength",
                                                                  "project spec 3.1")
    assert u1.variable == {"L"} and u2.variable == {"W"}
    assert u2.kind == "user" and u2.label() == "D - W"
    explicit = user_combinations([{"name": "U", "factors": {"SDL": 1.2, "L": 1.6}, "variable": []}])
    assert explicit[0].variable == frozenset()
    mapped = user_combinations([{"name": "U", "factors": {"SDL": 1.2, "L": 1.6}}], cases={"SDL": "D", "L": "L"})
    assert mapped[0].variable == {"L"}
    assert KINDS[-1] == "user" and "EN 1990" in STANDARDS


@pytest.mark.parametrize("spec, words", [
    ([{"name": "U1", "factors": {"D": 1.2, "X": 1.6}}], ["'U1'", "'X'", "D, L"]),
    ([{"name": "U1", "factors": {"D": "1.2"}}], ["'U1'", "'D'", "number"]),
    ([{"name": "U1", "factors": {"D": None}}], ["'U1'", "'D'"]),
    ([{"name": "U1", "factors": {}}], ["'U1'", "factors"]),
    ([{"factors": {"D": 1.0}}], ["spec[0]", "name"]),
    ([{"name": "U1", "factor": {"D": 1.0}}], ["'U1'", "factor"]),
    ([{"name": "U1", "factors": {"D": 1.0}}, {"name": "U1", "factors": {"L": 1.0}}], ["'U1'", "twice"]),
    ([{"name": "U1", "factors": {"D": 1.0}, "kind": "ultimate"}], ["'U1'", "kind"]),
    ([{"name": "U1", "factors": {"D": 1.0}, "variable": ["L"]}], ["'U1'", "variable"]),
    ({"name": "U1", "factors": {"D": 1.0}}, ["spec", "list"]),
    (["U1"], ["spec[0]"]),
])
def test_user_combinations_errors(spec, words):
    with pytest.raises(InputError) as info:
        user_combinations(spec, cases=["D", "L"])
    for w in words:
        assert w in str(info.value)
