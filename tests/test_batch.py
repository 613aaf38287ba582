"""The batch: demo project (-j 2, one run per session), archive records, manifest, verify, bad input,
injection, a batch killed mid-run.

Kernel budget: the demo batch (10 calcs, 2 workers), two verify re-executions, one mixed batch (two
calcs + bad files), one kill-and-resume run (three small calcs).
"""
from __future__ import annotations

import ast
import csv
import json
import os
import re
import shutil
import signal
import subprocess
import sys
import time
from pathlib import Path

import nbformat
import pytest

from calckit import record as R

REPO = Path(__file__).resolve().parents[1]
PARAMS = REPO / "parameters"
NETWORK_REF = re.compile(r"<(?:script|link)\b[^>]*(?:src|href)\s*=\s*[\"']?\s*(?:https?:)?//", re.I)
CSS_NETWORK = re.compile(r"(?:@import|url\()\s*[\"']?\s*(?:https?:)?//", re.I)


def _cli(*args, cwd=REPO, timeout=600, env=None):
    return subprocess.run([sys.executable, "-m", "calckit", *map(str, args)], cwd=cwd, capture_output=True,
                          text=True, timeout=timeout, env=None if env is None else dict(os.environ, **env))


@pytest.fixture(scope="module")
def demo(tmp_path_factory):
    out = tmp_path_factory.mktemp("demo_out")
    t0 = time.perf_counter()
    proc = _cli("run", PARAMS, "--out", out, "-j", "2")
    return {"out": out, "proc": proc, "seconds": time.perf_counter() - t0}


def _expected():
    import yaml

    exp = {}
    for f in sorted(PARAMS.glob("*.yaml")):
        if f.name == "project.yaml":
            continue
        d = yaml.safe_load(f.read_text())
        exp[d["member"]] = (d["calc"], d.get("expect", "pass"), f)
    return exp


def test_demo_project_has_the_members_the_brief_asks_for():
    exp = _expected()
    assert len(exp) >= 8
    calcs = [c for c, _, _ in exp.values()]
    assert "plate_girder" in calcs and "section_properties" in calcs
    assert sum(e == "fail" for _, e, _ in exp.values()) == 1


def test_demo_batch_exit_code_and_summary(demo):
    p = demo["proc"]
    assert p.returncode == 1, p.stdout + p.stderr  # one member fails on purpose
    exp = _expected()
    out = demo["out"]
    summaries = sorted(out.glob("*/batch-*-summary.csv"))
    assert len(summaries) == 1 and summaries[0].with_suffix(".html").is_file()
    rows = list(csv.DictReader(summaries[0].open()))
    assert {r["member"] for r in rows} == set(exp)
    for r in rows:
        calc, expect, _ = exp[r["member"]]
        assert r["calc"] == calc
        if calc == "section_properties":
            assert r["status"] == "info" and r["ratio"] == ""
        else:
            assert r["status"] == expect, r
            assert r["governing"] and float(r["ratio"]) > 0
            assert (float(r["ratio"]) > 1.0) == (expect == "fail")
    fail = [r for r in rows if r["status"] == "fail"]
    assert [r["member"] for r in fail] == ["B-106"]
    picked = [r for r in rows if r["member"] == "B-107"]  # section = "lightest": the choice is named
    assert picked and picked[0]["section"].startswith("IPE")
    for m in exp:  # the printed table names every member
        assert m in p.stdout
    n = len(exp)
    assert f"[{n:2d}/{n}]" in p.stderr  # progress lines


def test_summary_page_links_every_record(demo):
    """The summary page links each member's archived HTML page and notebook, and the links resolve."""
    out = demo["out"]
    page = sorted(out.glob("*/batch-*-summary.html"))[0]
    hrefs = re.findall(r'href="([^"]+)"', page.read_text(encoding="utf-8"))
    assert len(hrefs) == 2 * len(_expected())
    for h in hrefs:
        assert (page.parent / h).resolve().is_file(), h


def test_every_record_archived_with_offline_html(demo):
    out = demo["out"]
    for member, (calc, _, _) in _expected().items():
        nbs = list(out.glob(f"*/{member}/{calc}-r1.ipynb"))
        assert len(nbs) == 1, member
        html = nbs[0].with_suffix(".html").read_text(encoding="utf-8")
        assert not NETWORK_REF.search(html) and not CSS_NETWORK.search(html), member
        assert "<math" in html or calc == "section_properties"
        assert "Caution" in html
        assert "Sliders and pickers" not in html and "calckit.interactive" not in html  # tagged cell removed
        nb = nbformat.read(str(nbs[0]), as_version=4)
        for cell in nb.cells:
            for o in cell.get("outputs", []):
                assert o.get("output_type") != "error", member
                assert "application/vnd.jupyter.widget-view+json" not in o.get("data", {})


def test_manifest_lines_and_hashes(demo):
    out = demo["out"]
    lines = (out / R.MANIFEST).read_text().splitlines()
    entries = [json.loads(x) for x in lines]
    assert len(entries) == len(_expected())
    exp = _expected()
    run_ids = set()
    for e in entries:
        run_ids.add(e["run_id"])
        assert re.fullmatch(r"\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ", e["time_utc"])
        calc, expect, f = exp[e["member"]]
        assert e["calc"] == calc and e["revision"] == "r1"
        assert e["parameter_sha256"] == R.sha256_file(f)
        assert e["template_sha256"] == R.sha256_file(REPO / "calcs" / f"{calc}.ipynb")
        for kind in ("ipynb", "html"):
            o = e["outputs"][kind]
            assert R.sha256_file(out / o["path"]) == o["sha256"]
        assert e["versions"]["calckit"] and e["versions"]["papermill"]
        assert e["status"] in ("pass", "fail", "info")
        if calc != "section_properties":
            assert isinstance(e["governing_ratio"], float) and e["governing"]
    assert len(run_ids) == len(entries)
    assert len({e["batch_id"] for e in entries}) == 1


def _record(demo, member, calc):
    return next(demo["out"].glob(f"*/{member}/{calc}-r1.ipynb"))


def test_verify_untouched_record_is_same(demo):
    rec = _record(demo, "B-104", "steel_beam")
    rep = R.verify(rec)
    assert rep.same, rep.text()
    assert rep.text().splitlines()[0].endswith(": same")
    assert any("is byte-identical to the record" in n for n in rep.notes), rep.notes


def test_verify_catches_an_edited_number(demo, tmp_path, capsys):
    from calckit.cli import main

    root = tmp_path / "copy"
    shutil.copytree(demo["out"], root)
    rec = next(root.glob("*/B-101/steel_beam-r1.ipynb"))
    nb = nbformat.read(str(rec), as_version=4)
    edited = False
    for cell in nb.cells:
        for o in cell.get("outputs", []):
            data = o.get("data", {})
            if "application/vnd.calckit.results+json" in data and not edited:
                chk = data["application/vnd.calckit.results+json"]["checks"][0]
                chk["capacity"] = chk["capacity"] * 1.05
                edited = True
    assert edited
    nbformat.write(nb, str(rec))
    code = main(["verify", str(rec)])
    text = capsys.readouterr().out
    assert code == 1
    assert "checks[0].capacity" in text and "SHA-256 differs" in text


def test_verify_catches_a_changed_template_hash(demo, tmp_path):
    root = tmp_path / "copy2"
    shutil.copytree(demo["out"], root)
    rec = next(root.glob("*/SP-302/section_properties-r1.ipynb"))
    man = root / R.MANIFEST
    lines = man.read_text().splitlines()
    fixed = []
    for ln in lines:
        e = json.loads(ln)
        if e["member"] == "SP-302":
            e["template_sha256"] = "0" * 64
        fixed.append(json.dumps(e))
    man.write_text("\n".join(fixed) + "\n")
    rep = R.verify(rec, root=root)
    assert not rep.same and any("template SHA-256" in d for d in rep.differences)


# --------------------------------------------------------------------------------------------- bad input
GOOD_SP = """calc: section_properties
member: SP-9
grade: S355
parts:
  - {shape: plate, b: 200 mm, t: 20 mm, x: 0 mm, y: 0 mm, name: plate}
"""
INJECT = '''calc: section_properties
member: SP-INJ
description: |
  He said "stop" and 'left'; """ triple
  import os; os.system("touch {marker}")
  x = 1 #
grade: S355
parts:
  - {shape: plate, b: 200 mm, t: 20 mm, x: 0 mm, y: 0 mm, name: "p'); import os; os.system('touch {marker}') #"}
'''
RUNTIME_ERROR = """calc: steel_beam
member: ERR-1
standard: EN 1993-1-1
section: IPE 300
grade: S355
spans: [3 m]
supports: [fixed, free]
dead_udl: 1 kN/m
live_udl: 5 kN/m
bracing: supports
"""
FAILING_CELL = 'calc.show("a part that does not exist")  # a cell that raises, for the test'


def _templates_with_a_failing_beam_cell(folder):
    """A copy of calcs/ whose steel_beam template raises in its fourth code cell (a valid file then
    fails while executing: the case of a calc that errors)."""
    import nbformat

    folder.mkdir()
    for f in (REPO / "calcs").glob("*.ipynb"):
        shutil.copy(f, folder / f.name)
    nb = nbformat.read(str(folder / "steel_beam.ipynb"), as_version=4)
    i = next(k for k, c in enumerate(nb.cells) if c.get("id") == "show-analysis")
    nb.cells.insert(i, nbformat.v4.new_code_cell(FAILING_CELL, id="failing"))
    nbformat.write(nb, str(folder / "steel_beam.ipynb"))
    return folder
BAD_FILES = {
    "bad01.yaml": "calc: steel_beam\nmember: [B-1\n",
    "bad02.yaml": "calc: nonsense\nmember: X-1\n",
    "bad03.yaml": "member: X-1\n",
    "bad04.yaml": GOOD_SP.replace("member: SP-9", "member: X-4").replace("grade: S355\n", "grade: S355\nspam: 1\n"),
    "bad05.yaml": GOOD_SP.replace("member: SP-9", "member: X-5") + '"x = 1; import os #": 1\n',
    "bad06.yaml": GOOD_SP.replace("member: SP-9", "member: X-6").replace("b: 200 mm", "b: 200 kg"),
    "bad07.yaml": GOOD_SP.replace("member: SP-9", "member: X-7").replace("t: 20 mm", "t: 20"),
    "bad08.yaml": GOOD_SP.replace("member: SP-9", "member: X-8").replace("b: 200 mm", "b: 99 m"),
    "bad09.yaml": GOOD_SP.replace("member: SP-9", "member: X-9").replace("S355", "S999"),
    "bad10.yaml": "calc: steel_beam\nmember: X-10\nstandard: AISC 360-22\ngrade: A992\nspans: [9 m]\ndead_udl: 0\nlive_udl: 0\n",
    "bad11.yaml": RUNTIME_ERROR.replace("ERR-1", "X-11").replace("live_udl: 5 kN/m", "live_udl: 5 kN"),
    "bad12.yaml": RUNTIME_ERROR.replace("ERR-1", "X-12").replace("[fixed, free]", "[fixed, free, pin]"),
    "bad13.yaml": RUNTIME_ERROR.replace("ERR-1", "X-13") + "revision: r99\n",
    "bad14.yaml": RUNTIME_ERROR.replace("ERR-1", "X 14/.."),
    "bad15.yaml": RUNTIME_ERROR.replace("ERR-1", "X-15").replace("EN 1993-1-1", "EN 1993-9-9"),
    "bad16.yaml": "- just\n- a list\n",
}


@pytest.fixture(scope="module")
def mixed(tmp_path_factory):
    """One batch: a good calc carrying code-like strings, a calc that raises, and 16 bad files, into an
    archive that already holds a record (which must stay untouched)."""
    base = tmp_path_factory.mktemp("mixed")
    marker = base / "PWNED"
    src = base / "params"
    src.mkdir()
    (src / "good.yaml").write_text(INJECT.replace("{marker}", str(marker)))
    (src / "err.yaml").write_text(RUNTIME_ERROR)
    for name, text in BAD_FILES.items():
        (src / name).write_text(text)
    out = base / "out"
    old = out / "2020-01-01" / "OLD-1"
    old.mkdir(parents=True)
    (old / "steel_beam-r1.ipynb").write_bytes(b'{"old": true}')
    R.append_manifest(out, {"run_id": "old", "member": "OLD-1", "status": "pass"})
    before = {p: p.read_bytes() for p in out.rglob("*") if p.is_file()}
    calcs = _templates_with_a_failing_beam_cell(base / "calcs")
    proc = _cli("run", src, "--out", out, "-j", "2", env={"CALCKIT_CALCS": str(calcs)})
    return {"proc": proc, "out": out, "marker": marker, "before": before, "src": src}


def test_bad_input_is_reported_and_the_rest_runs(mixed):
    p = mixed["proc"]
    assert p.returncode == 2, p.stdout + p.stderr
    text = p.stdout + p.stderr
    for name in BAD_FILES:
        assert name in text, name
    for words in (["bad01.yaml:3", "malformed YAML", "line 2"], ["bad02.yaml", "nonsense"], ["bad03.yaml", "calc: missing"],
                  ["bad04.yaml", "spam", "not a parameter"], ["bad05.yaml", "not a parameter name"],
                  ["bad06.yaml", "200 kg"], ["bad07.yaml", "bare number"], ["bad08.yaml", "99 m"],
                  ["bad09.yaml", "S999"], ["bad10.yaml", "section", "missing"], ["bad11.yaml", "live_udl"],
                  ["bad12.yaml", "supports"], ["bad13.yaml", "revision"], ["bad14.yaml", "member"],
                  ["bad15.yaml", "standard"], ["bad16.yaml", "mapping"]):
        line = next((ln for ln in text.splitlines() if words[0] in ln and all(w in ln for w in words[1:])), None)
        assert line, words
    out = mixed["out"]
    for m in ("X-4", "X-5", "X-6", "X-10", "X-11", "X-12", "X-13", "X-15"):
        assert not list(out.glob(f"*/{m}/*")), f"{m} must not be executed"
    assert list(out.glob("*/SP-INJ/section_properties-r1.ipynb"))


def test_archive_not_touched(mixed):
    for p, data in mixed["before"].items():
        if p.name == R.MANIFEST:
            assert p.read_bytes().startswith(data)  # append-only
        else:
            assert p.read_bytes() == data, p


def test_code_in_parameter_strings_is_data(mixed):
    assert not mixed["marker"].exists()
    rec = next(mixed["out"].glob("*/SP-INJ/section_properties-r1.ipynb"))
    nb = nbformat.read(str(rec), as_version=4)
    inj = next(c for c in nb.cells if "injected-parameters" in c.metadata.get("tags", []))
    for node in ast.parse(inj.source).body:  # only literal assignments
        assert isinstance(node, ast.Assign) and isinstance(node.targets[0], ast.Name)
        ast.literal_eval(node.value)
    params = nb.metadata.papermill.parameters
    assert 'He said "stop"' in params["description"] and "import os" in params["description"]
    from calckit.render import read_results

    assert 'He said "stop"' in read_results(nb)["header"]["Calculation"]


def test_a_calc_that_raises_is_archived_as_error(mixed):
    out = mixed["out"]
    rec = next(out.glob("*/ERR-1/steel_beam-r1.ipynb"))
    entry = next(e for e in R.read_manifest(out) if e.get("member") == "ERR-1")
    assert entry["status"] == "error" and entry["error"]
    assert R.sha256_file(rec) == entry["outputs"]["ipynb"]["sha256"]
    nb = nbformat.read(str(rec), as_version=4)
    assert any(o.get("output_type") == "error" for c in nb.cells for o in c.get("outputs", []))
    assert entry["error"].startswith("InputError: part: got 'a part that does not exist'")
    html = rec.with_suffix(".html").read_text()
    assert "InputError" in html and "a part that does not exist" in html  # the error is visible
    assert "Summary of checks" not in html  # cells after the failing one did not run


def test_invalid_files_are_in_the_manifest(mixed):
    inv = [e for e in R.read_manifest(mixed["out"]) if e.get("status") == "invalid"]
    assert len(inv) == len(BAD_FILES)
    assert all(e["error"] and e["outputs"] == {} for e in inv)


# ----------------------------------------------------------------------------------------- killed batch
def test_killed_batch_keeps_records_and_resume_continues(tmp_path):
    src = tmp_path / "params"
    src.mkdir()
    for i in range(5):
        (src / f"k{i}.yaml").write_text(GOOD_SP.replace("SP-9", f"K-{i}"))
    out = tmp_path / "out"
    proc = subprocess.Popen([sys.executable, "-m", "calckit", "run", str(src), "--out", str(out), "-j", "1"],
                            cwd=REPO, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL,
                            start_new_session=True)
    man = out / R.MANIFEST
    t0 = time.time()
    while time.time() - t0 < 120:
        if man.is_file() and man.read_text().count("\n") >= 1:
            break
        time.sleep(0.05)
    os.killpg(proc.pid, signal.SIGKILL)  # the batch and its kernel, at once
    proc.wait()
    entries = R.read_manifest(out)
    assert 1 <= len(entries) < 5
    for e in entries:  # every completed record intact
        for o in e["outputs"].values():
            assert R.sha256_file(out / o["path"]) == o["sha256"]
    rerun = _cli("run", src, "--out", out, "-j", "1", "--resume")
    assert rerun.returncode == 0, rerun.stdout + rerun.stderr
    assert "already archived" in rerun.stderr
    done = [e for e in R.read_manifest(out) if e.get("status") == "info"]
    assert sorted(e["member"] for e in done) == [f"K-{i}" for i in range(5)]  # each once: resumed, not redone
    for f in out.rglob("*.ipynb"):
        assert not f.name.startswith(".")
