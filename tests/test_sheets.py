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
