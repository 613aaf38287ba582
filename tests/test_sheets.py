"""calckit.sheets: the calc sheets built from the demo parameter files (no kernel).

The closed-form check of a simple span is compared with the exact solution (two independent paths: the
tabulated formula wL^2/8, AISC Manual 15th ed. Table 3-23 case 1, and the piecewise solver)."""
from pathlib import Path

import pytest
import yaml

from calckit.params import validate
from calckit.sheets.beam import BeamSheet

ROOT = Path(__file__).resolve().parent.parent
REL = 1e-9


def _sheet(name):
    raw = yaml.safe_load((ROOT / "parameters" / name).read_text())
    calc = raw.pop("calc")
    raw.pop("expect", None)
    return BeamSheet(validate(calc, raw, source=name))


def test_closed_form_equals_exact_solution_simple_span():
    s = _sheet("B-101.yaml")
    (sec,) = s._closed_form()
    got = {st.symbol: st.result for st in sec.records}
    assert got["M_max"] == pytest.approx(s.env.spans[0].M_max.value, rel=REL)
    assert got["V_max"] == pytest.approx(abs(s.env.spans[0].V_abs.value), rel=REL)
    assert "M_{max}" in sec.records[-1].symbol_latex or sec.records[-1].symbol == "M_max"


def test_continuous_beam_has_no_closed_form():
    assert _sheet("B-103.yaml")._closed_form() == []


def test_positions_shown_in_display_units():
    s = _sheet("B-101.yaml")  # US customary calc, 28 ft span
    (sec, *_rest) = s._analysis()
    labels = " ".join(getattr(r, "label", "") for r in sec.records)
    assert "x = 14 ft" in labels and "x = 28 ft" in labels
    assert " m " not in labels + " " and " m:" not in labels


def test_ltb_uses_real_diagrams():
    # Cb needs one loading's diagram: the sheet passes every combination and arrangement, not the envelope
    from calckit.sheets.design import diagrams

    s = _sheet("B-103.yaml")
    d = diagrams(s)
    assert len(d) >= len(s.strength) and all(hasattr(r, "M_si") for r in d.values())


def test_compact_repeats_shows_each_derivation_once():
    """Girder panels of equal width have equal capacity: the derivation is shown once, later panels keep
    their own demand and ratio with a pointer to it (a calc-sheet convention, common practice)."""
    from calckit.design.results import CheckResult
    from calckit.sheets.design import compact_repeats

    step = object()
    a = CheckResult("Shear", "AISC 360-22 G2.2", "force", capacity=400e3, nominal=450e3, demand=100e3, ratio=0.25,
                    passed=True, location=1.5, steps=(step,))
    b = CheckResult("Shear", "AISC 360-22 G2.2", "force", capacity=400e3, nominal=450e3, demand=200e3, ratio=0.5,
                    passed=True, location=3.0, steps=(step,))
    c = CheckResult("Shear", "AISC 360-22 G2.2", "force", capacity=380e3, nominal=420e3, demand=200e3,
                    ratio=200 / 380, passed=True, location=4.5, steps=(step,))
    out = compact_repeats([a, b, c], "SI", what="panel")
    assert out[0] is a and out[2] is c  # first of its kind and a different capacity keep their steps
    assert out[1].steps == () and out[1].ratio == 0.5 and out[1].demand == 200e3
    assert "capacity derived above (the panel at x = 1.5" in out[1].note


def test_lintel_bearing_checks_at_padstones_and_under_the_point_load():
    """L-108 (bearing_length 100 mm): EN 1993-1-5 section 6 at both padstones (type c) and under the floor
    beam (type a), with F_Ed equal to the factored reaction / the factored point load of the diagram.
    The point load is recomputed by hand with EN 1990 Eq. (6.10), recommended gamma_G 1.35, gamma_Q 1.5."""
    s = _sheet("L-108.yaml")
    tf = [r for r in s.design_results() if r.limit_state.startswith("Transverse force on the web")]
    kinds = sorted(r.limit_state.split("(type ")[1][0] for r in tf)
    assert kinds == ["a", "c", "c"]
    (under,) = [r for r in tf if "(type a)" in r.limit_state]
    assert under.demand == pytest.approx(1.35 * 45e3 + 1.5 * 38e3, rel=1e-9)
    assert under.location == pytest.approx(1.4, rel=1e-12)
    ends = [r for r in tf if "(type c)" in r.limit_state]
    R = sorted(r.demand for r in ends)
    assert R[-1] > R[0] > 0  # the point load sits nearer the left padstone


def test_aisc_bearing_checks_only_when_a_bearing_length_is_given():
    """AISC 360-22 J10.2/J10.3 at the reactions of B-101 when it bears 4 in on a wall; framed ends (the
    default) get none."""
    raw = yaml.safe_load((ROOT / "parameters" / "B-101.yaml").read_text())
    raw.pop("calc")
    raw.pop("expect", None)
    framed = BeamSheet(validate("steel_beam", dict(raw), source="B-101"))
    assert not [r for r in framed.design_results() if "J10" in r.clause]
    raw["bearing_length"] = "4 in"
    bearing = BeamSheet(validate("steel_beam", raw, source="B-101"))
    j10 = [r for r in bearing.design_results() if "J10" in r.clause]
    assert {"J10.2", "J10.3"} <= {c for r in j10 for c in ("J10.2", "J10.3") if c in r.clause}
    assert all(r.location in (0.0, pytest.approx(28 * 0.3048)) for r in j10)


def test_girder_bearing_stiffeners_take_the_reactions():
    """TG-202 bears on 8 in plates with a given pair of 6.5 x 3/4 in bearing stiffeners at each support:
    the web crippling that the 7/16 in web alone fails (AISC 360-22 J10.3) is resisted by the pair (J10.7,
    J10.8), whose checks pass; the girder passes and the web record carries no ratio."""
    from calckit.sheets.girder import GirderSheet

    raw = yaml.safe_load((ROOT / "parameters" / "TG-202.yaml").read_text())
    raw.pop("calc")
    raw.pop("expect", None)
    s = GirderSheet(validate("plate_girder", raw, source="TG-202"))
    res = s.design_results()
    crip = [r for r in res if "crippling" in r.limit_state]
    assert len(crip) == 2 and all(r.ratio is None and r.demand > r.capacity for r in crip)
    pairs = [r for r in res if r.limit_state.startswith("Bearing stiffener pair")]
    assert len(pairs) == 6 and all(r.passed for r in pairs)  # proportions, column, bearing at each end
    assert all(r.passed is not False for r in res)
    shown = s.strength_checks()
    assert not any("crippling" in c.name for c in shown)  # the summary lists rated checks only
    (part,) = s._bearing()
    assert "bearing stiffeners" in part.title


def test_point_load_bearing_only_where_given():
    """A point load checked for web bearing only when its record gives a bearing (framed-in loads are not)."""
    from calckit.sheets.design import bearing_points

    raw = yaml.safe_load((ROOT / "parameters" / "L-108.yaml").read_text())
    raw.pop("calc")
    s = BeamSheet(validate("steel_beam", dict(raw), source="L-108"))
    kinds = [(k, round(lb, 6)) for _, lb, k, _, _ in bearing_points(s)]
    assert kinds == [("end", 0.15), ("end", 0.15), ("load", 0.1)]
    for pl in raw["point_loads"]:
        pl.pop("bearing")
    s2 = BeamSheet(validate("steel_beam", raw, source="L-108"))
    assert [k for _, _, k, _, _ in bearing_points(s2)] == ["end", "end"]


def test_en_girder_bearing_stiffeners_at_supports_and_under_the_columns():
    """TG-201 (EN 1993-1-1): the web under a column (type (a), 450 mm base plate) fails the transverse
    force and bending interaction of EN 1993-1-5 7.2 without stiffeners; with the given 250 x 25 mm pairs
    the checks of EN 1993-1-5 section 9 replace the web check at the two columns and the two supports."""
    from calckit.sheets.girder import GirderSheet

    raw = yaml.safe_load((ROOT / "parameters" / "TG-201.yaml").read_text())
    raw.pop("calc")
    s = GirderSheet(validate("plate_girder", raw, source="TG-201"))
    res = s.design_results()
    stiff = [r for r in res if r.limit_state.startswith("Bearing stiffener pair")]
    assert sorted({r.location for r in stiff}) == [0.0, 5.5, 10.5, 16.0]
    assert all(r.passed for r in stiff)
    assert not [r for r in res if r.limit_state.startswith("Transverse force")]  # replaced by the stiffeners
    for pl in raw["point_loads"]:
        pl.pop("stiffener_b", None), pl.pop("stiffener_t", None)
    bare = GirderSheet(validate("plate_girder", raw, source="TG-201")).design_results()
    web = [r for r in bare if r.limit_state.startswith("Transverse force")]
    assert {r.location for r in web} == {5.5, 10.5} and any(r.passed is False for r in web)


def test_web_sidesway_at_a_bearing_point_load():
    """AISC 360-22 J10.4 at a point load bearing on the top flange of B-101 (braces at the supports only):
    not checked when the flanges are braced there (the default), checked with Eq. J10-6 / J10-7 when the
    loaded flange's rotation is restrained / free. Free gives the smaller strength: Rn = Cr tw^3 tf / h^2
    times [1 + 0.4 r^3] in Eq. J10-6 against [0.4 r^3] in Eq. J10-7, r = (h/tw)/(Lb/bf) (from memory)."""
    raw = yaml.safe_load((ROOT / "parameters" / "B-101.yaml").read_text())
    raw.pop("calc")
    raw.pop("expect", None)
    raw["point_loads"] = [{"case": "D", "P": "8 kip", "x": "14 ft", "bearing": "4 in"}]
    raw["bracing"] = "supports"
    got = {}
    for sway in ("braced", "rotation restrained", "rotation free"):
        s = BeamSheet(validate("steel_beam", dict(raw, web_sidesway=sway), source="B-101"))
        got[sway] = [r for r in s.design_results() if "sidesway" in r.limit_state]
    assert got["braced"] == []
    (r1,), (r2,) = got["rotation restrained"], got["rotation free"]
    assert r1.location == r2.location == pytest.approx(14 * 0.3048)
    assert r2.capacity < r1.capacity and r1.demand == r2.demand
