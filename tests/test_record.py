"""Archive records without kernels: normaliser, exclusive files, revisions, manifest, payload comparison.

(verify against a real re-execution is tested in tests/test_batch.py, on the demo batch's records.)
"""
from __future__ import annotations

import json
import threading

import nbformat
import pytest

from calckit import record as R


def _executed_like():
    """A notebook with the volatile metadata papermill and nbclient write."""
    nb = nbformat.v4.new_notebook()
    c1 = nbformat.v4.new_code_cell("x = 1", id="parameters")
    c1.metadata = {"tags": ["parameters"], "execution": {"iopub.status.busy": "2026-01-01T00:00:00Z"},
                   "papermill": {"start_time": "t0", "end_time": "t1", "duration": 0.1, "status": "completed",
                                 "exception": False}}
    c2 = nbformat.v4.new_code_cell("x = 2", id="a1b2c3d4")
    c2.metadata = {"tags": ["injected-parameters"], "papermill": {"duration": 0.2}}
    c3 = nbformat.v4.new_code_cell("w", id="w1")
    c3.outputs = [nbformat.v4.new_output("display_data", data={
        "application/vnd.jupyter.widget-view+json": {"model_id": "abc"}, "text/plain": "W"}),
        nbformat.v4.new_output("stream", name="stdout", text="kept\n")]
    nb.cells = [c1, c2, c3]
    nb.metadata["papermill"] = {"start_time": "t0", "end_time": "t1", "duration": 3.2, "input_path": "/tmp/x/in.ipynb",
                                "output_path": "/tmp/y/out.ipynb", "environment_variables": {"A": "1"},
                                "parameters": {"x": 2}, "version": "2.7.0"}
    nb.metadata["widgets"] = {"state": {"abc": {}}}
    return nb


def test_normalise_removes_volatile_metadata():
    nb = R.normalise(_executed_like(), template_name="calc.ipynb", output_name="2026-01-01/B-1/calc-r1.ipynb")
    pm = nb.metadata.papermill
    assert pm.start_time is None and pm.end_time is None and pm.duration is None
    assert pm.input_path == "calc.ipynb" and pm.output_path == "2026-01-01/B-1/calc-r1.ipynb"
    assert pm.environment_variables == {} and pm.parameters == {"x": 2}
    assert "widgets" not in nb.metadata
    c1, c2, c3 = nb.cells
    assert "execution" not in c1.metadata and c1.metadata.papermill.duration is None
    assert c1.metadata.papermill.status == "completed"
    assert c2.id == R.INJECTED_ID
    assert [o.output_type for o in c3.outputs] == ["stream"]
    nbformat.validate(nb)


def test_normalised_runs_are_byte_identical():
    a = R.notebook_bytes(R.normalise(_executed_like()))
    other = _executed_like()
    other.metadata.papermill.start_time = "later"
    other.cells[1].id = "ffff0000"
    other.cells[0].metadata.execution = {"iopub.status.busy": "2030-05-05T00:00:00Z"}
    assert R.notebook_bytes(R.normalise(other)) == a


def test_write_exclusive_never_overwrites(tmp_path):
    p = tmp_path / "rec.ipynb"
    R.write_exclusive(p, b"first")
    with pytest.raises(FileExistsError):
        R.write_exclusive(p, b"second")
    assert p.read_bytes() == b"first"
    assert [f.name for f in tmp_path.iterdir()] == ["rec.ipynb"]  # no temporary file left


def test_revisions_count_up_across_dates(tmp_path):
    rev, folder = R.reserve_revision(tmp_path, "2026-01-01", "B-1", "steel_beam")
    assert rev == "r1"
    R.write_exclusive(folder / "steel_beam-r1.ipynb", b"{}")
    R.release(folder, "steel_beam", rev)
    rev2, folder2 = R.reserve_revision(tmp_path, "2026-01-02", "B-1", "steel_beam")
    assert rev2 == "r2" and folder2.name == "B-1" and folder2.parent.name == "2026-01-02"
    rev3, _ = R.reserve_revision(tmp_path, "2026-01-02", "B-1", "plate_girder")
    assert rev3 == "r1"  # numbered per calc


def test_parallel_reservations_are_distinct(tmp_path):
    got = []

    def take():
        got.append(R.reserve_revision(tmp_path, "2026-01-01", "B-1", "steel_beam")[0])

    ts = [threading.Thread(target=take) for _ in range(8)]
    for t in ts:
        t.start()
    for t in ts:
        t.join()
    assert sorted(got, key=lambda r: int(r[1:])) == [f"r{i}" for i in range(1, 9)]


def test_manifest_appends_and_survives_a_cut_line(tmp_path):
    R.append_manifest(tmp_path, {"run_id": "a", "status": "pass"})
    with open(tmp_path / R.MANIFEST, "ab") as fh:  # a writer killed in the middle of a line
        fh.write(b'{"run_id": "b", "sta')
    R.append_manifest(tmp_path, {"run_id": "c", "status": "fail"})
    problems = []
    entries = R.read_manifest(tmp_path, problems=problems)
    assert [e["run_id"] for e in entries] == ["a", "c"]
    assert len(problems) == 1 and "manifest.jsonl:2" in problems[0]
    lines = (tmp_path / R.MANIFEST).read_text().splitlines()
    assert json.loads(lines[0]) == {"run_id": "a", "status": "pass"} and json.loads(lines[2])["run_id"] == "c"


def test_manifest_refuses_nan(tmp_path):
    with pytest.raises(ValueError):
        R.append_manifest(tmp_path, {"ratio": float("nan")})


def test_compare_payloads():
    a = {"checks": [{"name": "Flexure", "ratio": 0.8123456789, "demand": 1.0e5}], "passed": True,
         "max_ratio": "inf"}
    assert R.compare_payloads(a, json.loads(json.dumps(a))) == []
    b = json.loads(json.dumps(a))
    b["checks"][0]["ratio"] *= 1 + 1e-11  # within the 1e-9 relative tolerance
    assert R.compare_payloads(a, b) == []
    b["checks"][0]["ratio"] = 0.8124
    d = R.compare_payloads(a, b)
    assert len(d) == 1 and d[0].startswith("checks[0].ratio: record 0.8123456789, re-execution 0.8124")
    c = json.loads(json.dumps(a))
    c["checks"][0]["name"] = "Shear"
    del c["passed"]
    c["extra"] = 1
    d = R.compare_payloads(a, c)
    assert any("checks[0].name" in x for x in d) and any(x.startswith("passed: in the record") for x in d)
    assert any(x.startswith("extra: in the re-execution") for x in d)


def test_compare_treats_bools_as_values_not_numbers():
    assert R.compare_payloads({"passed": True}, {"passed": False}) == ["passed: record True, re-execution False"]


def test_versions_name_the_key_libraries():
    v = R.versions()
    for lib in ("calckit", "python", "papermill", "nbconvert", "numpy", "sympy", "pint"):
        assert v[lib]


def test_verify_reports_a_file_that_is_not_a_record(tmp_path):
    p = tmp_path / "x.ipynb"
    nbformat.write(nbformat.v4.new_notebook(), str(p))
    rep = R.verify(p, root=tmp_path)
    assert not rep.same and "not a calckit archive record" in rep.error
    rep = R.verify(tmp_path / "missing.ipynb")
    assert rep.error == "no such file"


def test_iter_records(tmp_path):
    (tmp_path / "2026-01-02" / "B-1").mkdir(parents=True)
    (tmp_path / "2026-01-01" / "B-2").mkdir(parents=True)
    for p in ("2026-01-02/B-1/steel_beam-r2.ipynb", "2026-01-01/B-2/steel_beam-r1.ipynb"):
        (tmp_path / p).write_text("{}")
    assert [p.relative_to(tmp_path).as_posix() for p in R.iter_records(tmp_path)] == [
        "2026-01-01/B-2/steel_beam-r1.ipynb", "2026-01-02/B-1/steel_beam-r2.ipynb"]
