"""Parameter declarations and validation (calckit.params, calckit.batch.load_parameter_file).

No kernel is started here: every case checks the message (file, line where known, parameter, value,
what was expected) and that nothing is executed.
"""
from __future__ import annotations

import re
from pathlib import Path

import pytest

from calckit.batch import load_parameter_file
from calckit.errors import InputError
from calckit.params import CALCS, ParameterError, is_identifier, parameters_cell, spec, validate
from calckit.record import templates_dir

GOOD = """calc: steel_beam
member: B-1
standard: AISC 360-22
section: W18X50
grade: A992
spans: [30 ft]
dead_udl: 0.5 kip/ft
live_udl: 0.8 kip/ft
"""


def _write(tmp_path: Path, text: str, name: str = "m.yaml") -> Path:
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return p


def _problems(tmp_path, text):
    """Load and validate a file; return the error message (test fails if the file is accepted)."""
    p = _write(tmp_path, text)
    with pytest.raises(InputError) as ei:
        pf = load_parameter_file(p)
        validate(pf.calc, pf.values, source=str(p), lines=pf.lines)
    return str(ei.value), p


def test_good_file_validates_and_fills_defaults(tmp_path):
    pf = load_parameter_file(_write(tmp_path, GOOD))
    clean = validate(pf.calc, pf.values, source="m.yaml", lines=pf.lines)
    assert clean["spans"] == ["30 ft"] and clean["supports"] == ["pin", "roller"]
    assert set(clean) == set(spec("steel_beam").names)
    assert clean["headless"] is True and clean["revision"] == "draft"


def test_single_span_string_becomes_a_list(tmp_path):
    pf = load_parameter_file(_write(tmp_path, GOOD.replace("spans: [30 ft]", "spans: 30 ft")))
    assert validate(pf.calc, pf.values)["spans"] == ["30 ft"]


def test_units_may_be_mixed_in_one_file(tmp_path):
    text = GOOD.replace("live_udl: 0.8 kip/ft", "live_udl: 12 kN/m").replace("dead_udl: 0.5 kip/ft",
                                                                           "dead_udl: 0.4 kip/ft")
    pf = load_parameter_file(_write(tmp_path, text))
    clean = validate(pf.calc, pf.values)
    assert clean["live_udl"] == "12 kN/m" and clean["dead_udl"] == "0.4 kip/ft"


BAD_CASES = [
    # (id, file text, words that must all appear in the message)
    ("malformed-yaml", "calc: steel_beam\nmember: [B-1\nspans: 3 m\n", ["m.yaml:", "malformed YAML"]),
    ("unknown-calc", "calc: timber_joist\nmember: B-1\n", ["m.yaml", "calc", "timber_joist", "steel_beam"]),
    ("missing-calc", "member: B-1\nsection: W18X50\n", ["m.yaml", "calc: missing"]),
    ("missing-parameter", GOOD.replace("section: W18X50\n", ""), ["m.yaml", "section", "missing"]),
    ("missing-load", GOOD.replace("dead_udl: 0.5 kip/ft\n", ""), ["m.yaml", "dead_udl", "missing"]),
    ("unknown-parameter", GOOD + "spann: 30 ft\n", ["m.yaml:9", "spann", "not a parameter", "spans"]),
    ("code-as-key", GOOD + '"x = 1; import os #": 2\n', ["m.yaml:9", "x = 1; import os #", "not a parameter name"]),
    ("wrong-unit", GOOD.replace("live_udl: 0.8 kip/ft", "live_udl: 0.8 kip"), ["m.yaml:8", "live_udl", "0.8 kip",
                                                                              "load per length"]),
    ("bare-number", GOOD.replace("spans: [30 ft]", "spans: [30]"), ["m.yaml:6", "spans", "bare number"]),
    ("negative-span", GOOD.replace("spans: [30 ft]", "spans: [-3 m]"), ["spans", "-3 m", "between"]),
    ("span-too-long", GOOD.replace("spans: [30 ft]", "spans: [500 m]"), ["spans", "500 m", "60 m"]),
    ("load-out-of-range", GOOD.replace("live_udl: 0.8 kip/ft", "live_udl: -2 kN/m"), ["live_udl", "-2 kN/m"]),
    ("unknown-choice", GOOD.replace("AISC 360-22", "BS 5950"), ["standard", "BS 5950", "EN 1993-1-1"]),
    ("flag-not-bool", GOOD + "self_weight: yes please\n", ["self_weight", "true or false"]),
    ("supports-count", GOOD + "supports: [pin, roller, roller]\n", ["supports", "3 supports for 1 span"]),
    ("mechanism", GOOD.replace("spans: [30 ft]", "spans: [30 ft]\nsupports: [free, free]"), ["supports",
                                                                                            "unstable"]),
    ("point-load-off-beam", GOOD + "point_loads:\n  - {case: D, P: 10 kip, x: 40 ft}\n",
     ["point_loads", "40 ft", "beyond"]),
    ("record-unknown-key", GOOD + "point_loads:\n  - {case: D, P: 10 kip, x: 4 ft, y: 1 ft}\n",
     ["point_loads", "unknown key 'y'"]),
    ("reserved-parameter", GOOD + "revision: r9\n", ["revision", "set by the batch"]),
    ("bad-member-mark", GOOD.replace("member: B-1", "member: B 1/../x"), ["member", "archive folder"]),
    ("top-level-list", "- calc: steel_beam\n- member: B-1\n", ["m.yaml", "top level", "mapping"]),
    ("duplicate-key", GOOD + "section: W16X31\n", ["m.yaml:9", "section", "given twice"]),
    ("number-as-text", GOOD + "defl_limit_live: L/360\n", ["defl_limit_live", "plain number"]),
    ("list-expected", GOOD + "supports: pin\n", ["supports", "expected a list"]),
    ("not-a-quantity", GOOD.replace("live_udl: 0.8 kip/ft", "live_udl: lots"), ["live_udl", "lots"]),
    ("unknown-section", GOOD.replace("W18X50", "W99X999"), ["m.yaml:4", "section", "W99X999", "catalog"]),
    ("unknown-grade", GOOD.replace("A992", "S999"), ["m.yaml:5", "grade", "S999", "steel grade"]),
    ("stiffener-half-given", GOOD + "bearing_length: 4 in\nbearing_stiffener_b: 3 in\n",
     ["bearing_stiffener_t", "both the width and the thickness"]),
    ("stiffener-without-bearing", GOOD + "bearing_stiffener_b: 3 in\nbearing_stiffener_t: 0.5 in\n",
     ["bearing_length", "bearing stiffeners are"]),
    ("load-stiffener-half-given", GOOD + "point_loads:\n  - {case: D, P: 10 kip, x: 4 ft, bearing: 4 in, "
     "stiffener_b: 3 in}\n", ["point_loads", "item 1", "both stiffener_b and stiffener_t"]),
    ("load-stiffener-without-bearing", GOOD + "point_loads:\n  - {case: D, P: 10 kip, x: 4 ft, stiffener_b: 3 in, "
     "stiffener_t: 0.5 in}\n", ["point_loads", "item 1", "bearing length"]),
    ("sidesway-en", GOOD.replace("AISC 360-22", "EN 1993-1-1").replace("W18X50", "IPE 300").replace(
        "A992", "S355") + "web_sidesway: rotation free\n", ["web_sidesway", "AISC 360-22 J10.4"]),
    ("sidesway-choice", GOOD + "web_sidesway: free\n", ["web_sidesway", "free", "rotation free"]),
    ("point-load-bearing-unit", GOOD + "point_loads:\n  - {case: D, P: 10 kip, x: 4 ft, bearing: 4}\n",
     ["point_loads", "bearing", "bare number"]),
]


@pytest.mark.parametrize("text,words", [c[1:] for c in BAD_CASES], ids=[c[0] for c in BAD_CASES])
def test_bad_input_names_file_and_parameter(tmp_path, text, words):
    msg, _ = _problems(tmp_path, text)
    for w in words:
        assert w in msg, f"{w!r} not in message:\n{msg}"


def test_every_problem_of_a_file_is_listed(tmp_path):
    text = GOOD.replace("live_udl: 0.8 kip/ft", "live_udl: 3 kg") + "spann: 1 m\nself_weight: 2\n"
    msg, _ = _problems(tmp_path, text)
    assert "live_udl" in msg and "spann" in msg and "self_weight" in msg
    assert len(msg.splitlines()) == 3


def test_parameter_error_carries_problems(tmp_path):
    pf = load_parameter_file(_write(tmp_path, GOOD + "spann: 1 m\n"))
    with pytest.raises(ParameterError) as ei:
        validate(pf.calc, pf.values, source="m.yaml", lines=pf.lines)
    assert [n for n, _ in ei.value.problems] == ["spann"]


def test_project_file_gives_defaults_and_rejects_other_keys(tmp_path):
    _write(tmp_path, "job: '24-117'\nclient: Orrin Vale Developments\n", "project.yaml")
    pf = load_parameter_file(_write(tmp_path, GOOD))
    assert pf.values["job"] == "24-117" and pf.values["client"] == "Orrin Vale Developments"
    _write(tmp_path, "job: '1'\nspans: [9 m]\n", "project.yaml")
    with pytest.raises(InputError, match="project.yaml.*spans.*not a project key"):
        load_parameter_file(tmp_path / "m.yaml")


def test_non_utf8_file(tmp_path):
    p = tmp_path / "m.yaml"
    p.write_bytes(b"calc: steel_beam\nmember: \xff\xfe\n")
    with pytest.raises(InputError, match="m.yaml: not UTF-8"):
        load_parameter_file(p)


def test_notebook_names_are_checked_too(tmp_path):
    pf = load_parameter_file(_write(tmp_path, GOOD))
    names = [n for n in spec("steel_beam").names if n != "grade"]
    with pytest.raises(ParameterError, match="grade: not a parameter"):
        validate(pf.calc, pf.values, notebook_names=names)


@pytest.mark.parametrize("name,ok", [("span", True), ("dead_udl", True), ("x = 1", False), ("import", False),
                                     ("1x", False), ("a.b", False), ("", False), (3, False), ("sp\u00e4n", False)])
def test_is_identifier(name, ok):
    assert is_identifier(name) is ok


@pytest.mark.parametrize("calc", sorted(CALCS))
def test_template_parameters_match_declaration(calc):
    """The notebook's parameters cell is the declaration (names, defaults, one `name = value  # meaning` a
    line), read back with papermill.inspect_notebook."""
    import ast

    import nbformat
    import papermill as pm

    path = templates_dir() / f"{calc}.ipynb"
    nb = nbformat.read(str(path), as_version=4)
    cells = [c for c in nb.cells if "parameters" in c.metadata.get("tags", [])]
    assert len(cells) == 1
    assert cells[0].source == parameters_cell(calc)
    inspected = pm.inspect_notebook(str(path))
    assert list(inspected) == list(spec(calc).names)
    for name, info in inspected.items():
        assert ast.literal_eval(info["default"]) == spec(calc).param(name).default
        assert info["help"], f"{name} has no meaning/unit comment"
    for line in cells[0].source.splitlines():
        assert re.match(r"^[a-z_][a-z0-9_]* = .+  # \S", line), line


def test_declared_defaults_validate():
    for calc in CALCS:
        validate(calc, spec(calc).defaults(), allow_reserved=True)
