"""Command line: commands, documented exit codes, the demo's criterion (one small demo run)."""
from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

from calckit import cli
from calckit.batch import FAIL, INFO, INVALID, PASS, BatchResult, Row

REPO = Path(__file__).resolve().parents[1]


def test_python_m_calckit_help_lists_commands_and_exit_codes():
    p = subprocess.run([sys.executable, "-m", "calckit", "--help"], capture_output=True, text=True, cwd=REPO)
    assert p.returncode == 0
    for word in ("run", "demo", "verify", "check", "Exit codes", "0 all pass", "1 some member fails",
                 "2 some calc could not run"):
        assert word in p.stdout, word


def test_check_command(tmp_path, capsys):
    assert cli.main(["check", str(REPO / "parameters")]) == 0
    bad = tmp_path / "b.yaml"
    bad.write_text("calc: steel_beam\nmember: B-1\n")
    assert cli.main(["check", str(bad)]) == 2
    assert "section: missing" in capsys.readouterr().err
    assert cli.main(["check", str(tmp_path / "nothing_here")]) == 2


def test_run_with_no_files_is_an_error(tmp_path, capsys):
    (tmp_path / "empty").mkdir()
    assert cli.main(["run", str(tmp_path / "empty"), "--out", str(tmp_path / "o"), "-q"]) == 2
    assert "no parameter files" in capsys.readouterr().err


def test_verify_of_a_missing_file_exits_2(tmp_path, capsys):
    assert cli.main(["verify", str(tmp_path / "x.ipynb")]) == 2
    assert "could not verify" in capsys.readouterr().out


def _rows(*st):
    return [Row(f"f{i}.yaml", f"M-{i}", "steel_beam", status=s, expect=e) for i, (s, e) in enumerate(st)]


@pytest.mark.parametrize("statuses,code,intended", [
    ([(PASS, PASS), (INFO, PASS)], 0, True),
    ([(PASS, PASS), (FAIL, FAIL)], 1, True),
    ([(FAIL, PASS)], 1, False),
    ([(PASS, PASS), (INVALID, PASS)], 2, False),
    ([(FAIL, FAIL), ("error", PASS)], 2, False),
    ([(PASS, FAIL)], 0, False),
])
def test_exit_codes_and_demo_criterion(statuses, code, intended, tmp_path):
    res = BatchResult(_rows(*statuses), tmp_path, "x")
    assert res.exit_code == code
    assert res.as_intended is intended


def test_demo_command_exits_0_when_the_failure_is_expected(tmp_path, monkeypatch, capsys):
    params = tmp_path / "parameters"
    params.mkdir()
    (params / "fail.yaml").write_text(
        "calc: steel_beam\nexpect: fail\nmember: F-1\nstandard: AISC 360-22\nsection: W8X10\ngrade: A992\n"
        "spans: [30 ft]\ndead_udl: 0.2 kip/ft\nlive_udl: 2 kip/ft\nbracing: supports\n")
    (params / "ok.yaml").write_text(
        "calc: section_properties\nmember: S-1\ngrade: S275\nparts:\n"
        "  - {shape: plate, b: 100 mm, t: 10 mm, x: 0 mm, y: 0 mm, name: p}\n")
    out = tmp_path / "outputs"
    monkeypatch.setattr(cli, "_repo_dir", lambda name: params if name == "parameters" else out)
    assert cli.main(["demo", "-q"]) == 0
    text = capsys.readouterr().out
    assert "F-1 fails on purpose" in text
    assert list(out.glob("*/F-1/steel_beam-r1.html")) and list(out.glob("*/batch-01-summary.html"))


def test_pick_command_takes_a_calc_parameter_file(capsys):
    # `calckit pick FILE` accepts the steel beam calc's own file (calc/member/section keys included)
    from calckit.cli import main

    root = Path(__file__).resolve().parent.parent
    assert main(["pick", str(root / "parameters" / "B-101.yaml")]) == 0
    out = capsys.readouterr().out
    assert "chosen: W" in out and "governing" in out
    assert main(["pick", str(root / "parameters" / "TG-201.yaml")]) == 2  # a girder file: not a beam search
