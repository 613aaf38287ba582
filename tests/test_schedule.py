"""Beam schedule (calckit.schedule): cell syntax, expansion into member files, the no-overwrite rule, error
messages, and one end-to-end ``calckit run SCHEDULE.csv`` of the demo schedule."""
from __future__ import annotations

import csv
import hashlib
import json
import shutil
import subprocess
import sys
from pathlib import Path

import pytest
import yaml

from calckit import cli
from calckit.batch import load_parameter_file
from calckit.errors import InputError
from calckit.params import spec, validate
from calckit.schedule import ScheduleError, default_folder, expand, parse_cell, read_schedule

REPO = Path(__file__).resolve().parents[1]
DEMO = REPO / "schedules" / "level-3-floor.csv"

HEAD = "member,standard,section,grade,spans,supports,dead_udl,live_udl,point_loads,bracing,defl_limit_live\n"


def _write(tmp_path: Path, rows: str, head: str = "# calc: steel_beam\n" + HEAD, name="s.csv") -> Path:
    p = tmp_path / name
    p.write_text(head + rows, encoding="utf-8")
    return p


def _tree(folder: Path) -> dict:
    return {q.name: (q.read_bytes(), q.stat().st_mtime_ns) for q in sorted(folder.iterdir())}


# ---------------------------------------------------------------------------------------------------
# cell syntax
# ---------------------------------------------------------------------------------------------------
@pytest.mark.parametrize("name,text,value", [
    ("spans", "7.5 m; 7.5 m", ["7.5 m", "7.5 m"]),
    ("spans", " 24 ft ", ["24 ft"]),
    ("supports", "pin; roller;roller", ["pin", "roller", "roller"]),
    ("brace_points", "2 m;4 m", ["2 m", "4 m"]),
    ("point_loads", "D 45 kN at 1.4 m; L 38 kN at 1.4 m",
     [{"case": "D", "P": "45 kN", "x": "1.4 m"}, {"case": "L", "P": "38 kN", "x": "1.4 m"}]),
    ("point_loads", "Lr -3 kip @ 10 ft", [{"case": "Lr", "P": "-3 kip", "x": "10 ft"}]),
    ("point_loads", "S 2 kN AT 0.5 m", [{"case": "S", "P": "2 kN", "x": "0.5 m"}]),
    ("point_loads", "case=D, P=5 kN, x=2 m", [{"case": "D", "P": "5 kN", "x": "2 m"}]),
    ("defl_limit_live", "360", 360),
    ("defl_limit_total", "250.5", 250.5),
    ("self_weight", "no", False),
    ("self_weight", "True", True),
    ("dead_udl", "0", 0),
    ("dead_udl", "0.75 kip/ft", "0.75 kip/ft"),
    ("bearing_length", "none", None),
    ("standard", "EN 1993-1-1", "EN 1993-1-1"),
])
def test_cell_syntax(name, text, value):
    assert parse_cell("steel_beam", name, text) == value


def test_point_load_takes_further_keys_after_a_comma():
    fields = [f.name for f in spec("steel_beam").param("point_loads").fields]
    extra = next((f for f in fields if f not in ("case", "P", "x")), None)
    if extra is None:
        pytest.skip("point loads declare no key beyond case, P, x")
    got = parse_cell("steel_beam", "point_loads", f"D 45 kN at 1.4 m, {extra}=100 mm")
    assert got == [{"case": "D", "P": "45 kN", "x": "1.4 m", extra: "100 mm"}]


def test_records_in_key_value_form():
    got = parse_cell("section_properties", "parts",
                     "shape=plate, b=250 mm, t=15 mm, x=0, y=400 mm, name=cover; shape=IPE 400, x=35 mm, y=0")
    assert got == [{"shape": "plate", "b": "250 mm", "t": "15 mm", "x": 0, "y": "400 mm", "name": "cover"},
                   {"shape": "IPE 400", "x": "35 mm", "y": 0}]


@pytest.mark.parametrize("name,text,words", [
    ("spans", "7.5 m;; 7.5 m", ["spans", "item 2 is empty"]),
    ("point_loads", "D 45 kN 1.4 m", ["point_loads", "item 1", "at <position>"]),
    ("point_loads", "D 45 kN at 1 m, weight=3", ["point_loads", "'weight=3'"]),
    ("no_such", "1", ["no_such", "not a parameter"]),
])
def test_cell_syntax_errors_name_the_parameter(name, text, words):
    with pytest.raises(InputError) as ei:
        parse_cell("steel_beam", name, text)
    for w in words:
        assert w in str(ei.value), w


# ---------------------------------------------------------------------------------------------------
# expansion, round trip, defaults
# ---------------------------------------------------------------------------------------------------
def test_round_trip_of_the_demo_schedule(tmp_path):
    sch = read_schedule(DEMO)
    files = expand(DEMO, tmp_path / "l3")
    assert [f.status for f in files] == ["written"] * len(sch.rows)
    assert 5 <= len(files) <= 8
    assert {r.clean["standard"] for r in sch.rows} == {"AISC 360-22", "EN 1993-1-1"}
    assert any(r.clean["section"] == "lightest" for r in sch.rows)
    digest = hashlib.sha256(DEMO.read_bytes()).hexdigest()
    project = yaml.safe_load((DEMO.parent / "project.yaml").read_text())
    for f, r in zip(files, sch.rows):
        assert f.path == tmp_path / "l3" / f"{r.member}.yaml"
        text = f.path.read_text(encoding="utf-8")
        head = [ln for ln in text.splitlines() if ln.startswith("#")]
        assert any("level-3-floor.csv" in ln and f"row {r.row}" in ln for ln in head), head
        assert any(digest in ln for ln in head), head
        pf = load_parameter_file(f.path)  # as the batch reads it
        assert pf.calc == "steel_beam"
        assert validate(pf.calc, pf.values, source=str(f.path)) == r.clean
        assert {k: pf.values[k] for k in project} == {k: str(v) for k, v in project.items()}


def test_values_come_from_the_row_and_empty_cells_take_defaults(tmp_path):
    s = _write(tmp_path, "B-1,EN 1993-1-1,IPE 300,S355,6.5 m; 5 m,pin; roller; roller,4 kN/m,5 kN/m,"
                         "D 10 kN at 2 m; L 12 kN @ 2 m,thirds,\n"
                         "B-2,AISC 360-22,W12X26,A992,20 ft,,0.4 kip/ft,0.5 kip/ft,,,500\n")
    (f1, f2) = expand(s, tmp_path / "out")
    d1 = yaml.safe_load(f1.path.read_text())
    assert d1["spans"] == ["6.5 m", "5 m"] and d1["supports"] == ["pin", "roller", "roller"]
    assert d1["point_loads"] == [{"case": "D", "P": "10 kN", "x": "2 m"}, {"case": "L", "P": "12 kN", "x": "2 m"}]
    assert "defl_limit_live" not in d1 and "method" not in d1  # empty cells are left out ...
    c1 = validate("steel_beam", {k: v for k, v in d1.items() if k != "calc"})
    defaults = spec("steel_beam").defaults()
    assert c1["defl_limit_live"] == defaults["defl_limit_live"]  # ... so the declared default applies
    d2 = yaml.safe_load(f2.path.read_text())
    assert "supports" not in d2 and "point_loads" not in d2 and "bracing" not in d2
    assert d2["defl_limit_live"] == 500
    c2 = validate("steel_beam", {k: v for k, v in d2.items() if k != "calc"})
    for k in ("supports", "point_loads", "bracing", "units"):
        assert c2[k] == defaults[k], k


def test_calc_column_mixes_calcs_and_wins_over_the_file_calc(tmp_path):
    s = _write(tmp_path, "steel_beam,B-1,IPE 300,S355,EN 1993-1-1,6 m,4 kN/m,5 kN/m,\n"
                         "section_properties,SP-1,,S275,,,,,\"shape=plate, b=100 mm, t=10 mm, x=0, y=0\"\n",
               head="calc,member,section,grade,standard,spans,dead_udl,live_udl,parts\n")
    rows = read_schedule(s).rows
    assert [(r.member, r.calc) for r in rows] == [("B-1", "steel_beam"), ("SP-1", "section_properties")]
    assert rows[1].clean["parts"][0]["b"] == "100 mm"
    s2 = _write(tmp_path, "steel_beam,B-1,IPE 300,S355,EN 1993-1-1,6 m,4 kN/m,5 kN/m,\n",
                head="# calc: section_properties\ncalc,member,section,grade,standard,spans,dead_udl,live_udl,parts\n",
                name="s2.csv")
    assert read_schedule(s2).rows[0].calc == "steel_beam"


def test_comment_rows_blank_rows_and_a_byte_order_mark(tmp_path):
    p = tmp_path / "s.csv"
    p.write_bytes(("\ufeff# calc: steel_beam\n" + HEAD + "# level 3, bay 1\n\n"
                   "B-1,EN 1993-1-1,IPE 300,S355,6 m,,4 kN/m,5 kN/m,,,\n").encode("utf-8"))
    (row,) = read_schedule(p).rows
    assert (row.row, row.member) == (5, "B-1")


# ---------------------------------------------------------------------------------------------------
# no overwrite, no delete
# ---------------------------------------------------------------------------------------------------
GOOD = ("B-1,EN 1993-1-1,IPE 300,S355,6 m,,4 kN/m,5 kN/m,,,\n"
        "B-2,EN 1993-1-1,IPE 330,S355,7 m,,4 kN/m,5 kN/m,,,\n")


def test_identical_files_are_left_untouched(tmp_path):
    s = _write(tmp_path, GOOD)
    out = tmp_path / "out"
    expand(s, out)
    before = _tree(out)
    again = expand(s, out)
    assert [f.status for f in again] == ["unchanged", "unchanged"]
    assert _tree(out) == before


def test_a_changed_row_updates_its_untouched_member_file(tmp_path):
    """The engineer changes a section in the schedule and runs it again: the member file, still as calckit
    wrote it, is updated (the archived record keeps its own parameters); the others stay untouched."""
    s = _write(tmp_path, GOOD)
    out = default_folder(s)  # where `calckit run s.csv` expands
    assert out == tmp_path / "s"
    expand(s)
    before = _tree(out)
    _write(tmp_path, GOOD.replace("IPE 330", "IPE 360"))
    got = expand(s, out)
    assert {f.member: f.status for f in got} == {"B-1": "unchanged", "B-2": "updated"}
    after = _tree(out)
    assert after["B-1.yaml"] == before["B-1.yaml"] and after["B-2.yaml"] != before["B-2.yaml"]
    assert "IPE 360" in (out / "B-2.yaml").read_text() and not list(out.glob("*.new"))


def test_a_changed_row_whose_file_was_edited_by_hand_is_refused_and_nothing_is_written(tmp_path):
    s = _write(tmp_path, GOOD)
    out = default_folder(s)
    expand(s)
    f = out / "B-2.yaml"
    f.write_text(f.read_text() + "# checked by JB\nself_weight: true\n")  # a hand edit
    before = _tree(out)
    _write(tmp_path, GOOD.replace("IPE 330", "IPE 360") + "B-3,EN 1993-1-1,IPE 300,S355,5 m,,4 kN/m,5 kN/m,,,\n")
    with pytest.raises(ScheduleError) as ei:
        expand(s, out)
    msg = str(ei.value)
    assert "B-2.yaml" in msg and "row 4" in msg and "not overwritten" in msg and "B-1.yaml" not in msg
    assert _tree(out) == before  # B-2 byte-identical, B-3 not written: all or nothing
    assert cli.main(["schedule", "expand", str(s), "--into", str(out)]) == 2
    assert cli.main(["run", str(s), "--out", str(tmp_path / "arch"), "-q"]) == 2
    assert _tree(out) == before and not (tmp_path / "arch").exists()


def test_unchanged_rows_stay_when_another_row_is_added(tmp_path):
    s = _write(tmp_path, GOOD)
    out = tmp_path / "out"
    expand(s, out)
    before = _tree(out)
    (out / "X-9.yaml").write_text("calc: steel_beam\n")  # not in the schedule: never deleted
    _write(tmp_path, GOOD + "B-3,EN 1993-1-1,IPE 300,S355,5 m,,4 kN/m,5 kN/m,,,\n")
    got = expand(s, out)
    assert [f.status for f in got] == ["unchanged", "unchanged", "written"]
    after = _tree(out)
    assert all(after[k] == v for k, v in before.items()) and "X-9.yaml" in after


def test_a_hand_edited_member_file_is_refused(tmp_path):
    s = _write(tmp_path, GOOD)
    out = tmp_path / "out"
    expand(s, out)
    f = out / "B-1.yaml"
    f.write_text(f.read_text().replace("6 m", "6.5 m"))
    edited = f.read_bytes()
    with pytest.raises(ScheduleError, match="B-1.yaml"):
        expand(s, out)
    assert f.read_bytes() == edited


# ---------------------------------------------------------------------------------------------------
# errors
# ---------------------------------------------------------------------------------------------------
def test_every_problem_of_the_file_in_one_error_naming_file_row_member_parameter(tmp_path):
    s = _write(tmp_path,
               "B-1,EN 1993-1-1,IPE 300,S355,6 kN,,4 kN/m,5 kN/m,,,\n"               # row 3: spans unit
               "B-2,EN 1993-1-1,IPE 300,S355,6 m,pin; hinge,4 kN/m,5 kN/m,,,\n"     # row 4: supports
               "B-3,EN 1993-1-1,IPE 300,S355,6 m,,4 kN/m,5 kN/m,D 4 kN 2 m,,\n"     # row 5: point load
               "B-4,EN 1993-1-1,,S355,6 m,,4 kN/m,5 kN/m,,,\n"                      # row 6: no section
               "B-5,EN 1993-1-1,IPE 300,S355,6 m,,4 kN/m,5 kN/m,,sideways,\n"       # row 7: bracing
               "B-6,EN 1993-1-1,IPE 300,S355,6 m,,4 kN/m,5 kN/m,,,ten\n")           # row 8: number
    with pytest.raises(ScheduleError) as ei:
        expand(s, tmp_path / "out")
    lines = str(ei.value).splitlines()
    expected = [(3, "B-1", "spans"), (4, "B-2", "supports"), (5, "B-3", "point_loads"), (6, "B-4", "section"),
                (7, "B-5", "bracing"), (8, "B-6", "defl_limit_live")]
    assert [(r, m, p) for r, m, p, _ in ei.value.problems] == expected
    for row, member, param in expected:
        assert any(str(s) in ln and f"row {row} " in ln and f"member {member}" in ln and f"{param}:" in ln
                   for ln in lines), (row, member, param)
    assert not (tmp_path / "out").exists()


def test_header_problems(tmp_path):
    s = _write(tmp_path, "B-1,IPE 300,6 m,x\n", head="# calc: steel_beam\nmember,section,spn,revision\n")
    with pytest.raises(ScheduleError) as ei:
        read_schedule(s)
    msg = str(ei.value)
    assert "row 2 (header): column 'spn': not a parameter" in msg
    assert "column 'revision': is set by the batch" in msg


def test_missing_calc_and_semicolon_separated_file(tmp_path):
    s = _write(tmp_path, GOOD, head=HEAD)
    with pytest.raises(ScheduleError, match=r"row 2 \(member B-1\): calc: missing"):
        read_schedule(s)
    s2 = _write(tmp_path, "B-1;IPE 300\n", head="member;section\n", name="semi.csv")
    with pytest.raises(ScheduleError, match="';'-separated"):
        read_schedule(s2, calc="steel_beam")


def test_duplicate_member_marks(tmp_path):
    s = _write(tmp_path, GOOD + GOOD.splitlines()[0].replace("B-1", "b-1") + "\n")
    with pytest.raises(ScheduleError) as ei:
        expand(s, tmp_path / "out")
    assert "row 5 (member b-1): member: 'b-1' is also the mark of row 3" in str(ei.value)
    assert not (tmp_path / "out").exists()


def test_cli_schedule_expand_and_check(tmp_path, capsys):
    s = _write(tmp_path, GOOD)
    assert cli.main(["check", str(s)]) == 0
    assert cli.main(["schedule", "expand", str(s), "--into", str(tmp_path / "o")]) == 0
    assert "written" in capsys.readouterr().out
    assert cli.main(["schedule", "expand", str(s), "--into", str(tmp_path / "o")]) == 0
    assert "unchanged" in capsys.readouterr().out
    bad = _write(tmp_path, GOOD.replace("6 m", "6 kN"), name="bad.csv")
    assert cli.main(["check", str(bad)]) == 2
    assert cli.main(["schedule", "expand", str(bad)]) == 2
    err = capsys.readouterr().err
    assert "bad.csv: row 3 (member B-1): spans:" in err
    assert not default_folder(bad).exists()


# ---------------------------------------------------------------------------------------------------
# end to end
# ---------------------------------------------------------------------------------------------------
def test_run_the_demo_schedule_end_to_end(tmp_path):
    """`calckit run SCHEDULE.csv` expands beside the schedule (a copy, so the repo is not written) and
    archives one record per row."""
    shutil.copytree(DEMO.parent, tmp_path / "schedules", ignore=shutil.ignore_patterns(DEMO.stem))
    sch = tmp_path / "schedules" / DEMO.name
    out = tmp_path / "out"
    p = subprocess.run([sys.executable, "-m", "calckit", "run", str(sch), "--out", str(out), "-j", "2"],
                       cwd=tmp_path, capture_output=True, text=True, timeout=300)
    members = [r.member for r in read_schedule(sch).rows]
    (summary,) = out.glob("*/batch-01-summary.csv")
    with open(summary, newline="") as fh:
        rows = list(csv.DictReader(fh))
    assert sorted(r["member"] for r in rows) == sorted(members), p.stderr[-2000:]
    statuses = {r["status"] for r in rows}
    rule = 2 if statuses & {"error", "invalid"} else 1 if "fail" in statuses else 0  # calckit.batch rules
    assert p.returncode == rule
    assert statuses == {"pass"}, rows  # the demo schedule is meant to pass throughout
    folder = tmp_path / "schedules" / DEMO.stem
    manifest = [json.loads(ln) for ln in (out / "manifest.jsonl").read_text().splitlines()]
    assert len(manifest) == len(members)
    for e in manifest:
        f = folder / f"{e['member']}.yaml"
        assert (out / e["outputs"]["ipynb"]["path"]).is_file()
        assert e["parameter_sha256"] == hashlib.sha256(f.read_bytes()).hexdigest()
        assert Path(e["parameter_file"]).name == f.name
