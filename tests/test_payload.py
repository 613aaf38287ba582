"""Tests of the results payload (calckit.render.payload): written into a notebook output under
application/vnd.calckit.results+json, read back from the .ipynb, equal; records rebuilt equal.

Values: W18x50 flexure and shear, AISC Design Examples v15.1 F.1-1A (Mp 421 kip-ft, P) and G.1A style
shear numbers (used as data only; the round trip is what is tested).
"""
from __future__ import annotations

import json

import nbformat
import pytest

from calckit.errors import InputError
from calckit.render import (RESULTS_MIME, Condition, Formula, Header, Summary, check, given,
                            read_all_results, read_results, records_from_payload, results_payload)
from calckit.render.payload import payload_output

MP = Formula("M_n", "F_y*Z_x", dims={"M_n": "moment", "F_y": "stress", "Z_x": "modulus"},
             ref="AISC 360-22 Eq. F2-1")
PHI = Formula("M_c", "phi_b*M_n", dims={"M_c": "moment", "M_n": "moment"}, ref="AISC 360-22 F1(1)")
COMPACT = Condition("lam <= lam_p", then="compact flange", ref="AISC 360-22 Table B4.1b")


def _checks():
    mp = MP.step(F_y="50 ksi", Z_x="101 in**3")
    d = COMPACT.step(lam=6.57, lam_p=9.15)
    cap = PHI.step(phi_b=0.9, M_n=mp)
    c1 = check("Flexure, yielding", given("M_u", "266 kip*ft", "moment"), cap, steps=[mp, d, cap],
               reference="AISC 360-22 F2.1")
    c2 = check("Shear", given("V_u", "400 kip", "force"), given("V_c", "306 kip", "force"),
               reference="AISC 360-22 G2.1")
    c3 = check("Bearing (no capacity)", (1.0, "force"), (0.0, "force"), reference="common practice")
    return [c1, c2, c3]


HEADER = Header(project="P", job="J", member="B-1", title="Beam", date="2025-01-15",
                inputs={"Span": "35 ft"})


def test_payload_is_json_and_complete():
    p = results_payload(_checks(), header=HEADER, system="US")
    text = json.dumps(p)
    assert json.loads(text) == p
    assert p["status"] == "NOT OK" and p["passed"] is False
    assert p["governing"] == "Bearing (no capacity)" and p["max_ratio"] == "inf"
    c = p["checks"][0]
    assert c["si_unit"] == "N*m" and c["display_unit"] == "kip*ft"
    assert c["demand_display"] == pytest.approx(266)
    assert c["status"] == "OK" and c["reference"] == "AISC 360-22 F2.1"
    assert [s["kind"] for s in c["steps"]] == ["step", "decision", "step", "step"]
    assert p["header"]["Member"] == "B-1" and p["header"]["Inputs"] == {"Span": "35 ft"}


def test_round_trip_through_ipynb(tmp_path):
    checks = _checks()
    summary = Summary(checks, header=HEADER, system="US")
    bundle = summary._repr_mimebundle_()
    nb = nbformat.v4.new_notebook()
    cell = nbformat.v4.new_code_cell("display(summary)")
    cell.outputs = [nbformat.v4.new_output("display_data", data=bundle)]
    nb.cells.append(cell)
    path = tmp_path / "calc.ipynb"
    nbformat.validate(nb)
    nbformat.write(nb, str(path))
    back = read_results(path)
    assert back == bundle[RESULTS_MIME]
    assert back == json.loads(json.dumps(summary.payload()))
    rebuilt = records_from_payload(back)
    assert rebuilt == checks            # frozen dataclasses compare field by field


def test_several_payloads_and_none(tmp_path):
    nb = nbformat.v4.new_notebook()
    p1 = results_payload(_checks()[:1])
    p2 = results_payload(_checks()[1:2])
    for p in (p1, p2):
        c = nbformat.v4.new_code_cell("")
        c.outputs = [payload_output(p)]
        nb.cells.append(c)
    assert read_all_results(nb) == [p1, p2]
    assert read_results(nb) == p2
    empty = nbformat.v4.new_notebook()
    with pytest.raises(InputError, match="no application/vnd.calckit.results"):
        read_results(empty)


def test_wrong_schema_refused():
    with pytest.raises(InputError, match="schema"):
        records_from_payload({"schema": "other/9", "checks": []})
