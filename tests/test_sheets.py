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
