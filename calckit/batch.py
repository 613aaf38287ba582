"""Headless batch: parameter files -> executed calc notebooks -> dated archive records and a summary.

``run(paths, out="outputs", jobs=1)`` (also ``calckit run PATHS...``):

1. every ``*.yaml``/``*.yml`` file under ``paths`` (``project.yaml`` excepted: it gives job, project,
   client and designer to the members of its folder) is read with ``yaml.safe_load`` and validated
   against the calc's declared parameters (:mod:`calckit.params`) and the template's parameters cell
   (``papermill.inspect_notebook``); a bad file is reported, not run, and the batch goes on;
2. each valid member gets the next revision number, and papermill executes ``calcs/<calc>.ipynb`` with
   its parameters in a new kernel of its own (``jobs`` at a time, from threads; kernels talk over ipc
   sockets in per-run folders, so parallel kernel starts cannot race for TCP ports; kernels are forked
   from a template process that has imported the libraries, see :mod:`calckit.kernels`);
3. the executed notebook is normalised and archived with a standalone HTML copy, and a manifest line is
   appended (:mod:`calckit.record`); a calc that raised is archived too, marked ``error``;
4. a summary table (member, calc, section, governing check, ratio, status) is printed and written as CSV
   and HTML beside the records.

Exit codes (:data:`EXIT_CODES`): 0 every member passes, 1 some member fails a check, 2 some calc could not
run (bad input or an error while executing); 2 wins over 1.

A parameter file looks like::

    calc: steel_beam          # which notebook (calcs/steel_beam.ipynb)
    expect: pass              # optional: pass or fail, the outcome the demo expects
    member: B-101
    standard: AISC 360-22
    section: W18X50
    spans: [30 ft]
    live_udl: 0.8 kip/ft
"""
from __future__ import annotations

import ast
import logging
import os
import sys
import tempfile
import threading
import time
import uuid
from concurrent.futures import ThreadPoolExecutor, as_completed
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Callable, Iterable, Sequence

from .errors import InputError
from .params import PROJECT_KEYS, is_identifier, spec, validate

__all__ = ["run", "BatchResult", "Row", "CalcRun", "execute_calc", "load_parameter_file", "discover",
           "EXIT_CODES", "PASS", "FAIL", "INFO", "ERROR", "INVALID", "summary_text"]

PASS, FAIL, INFO, ERROR, INVALID = "pass", "fail", "info", "error", "invalid"
EXIT_CODES = {0: "every member passes", 1: "some member fails a design check",
              2: "some calc could not run (bad input or an error while executing)"}
META_KEYS = ("calc", "expect")
PROJECT_FILE = "project.yaml"
_log = logging.getLogger("calckit.batch")


# ---------------------------------------------------------------------------------------------------
# parameter files
# ---------------------------------------------------------------------------------------------------
@dataclass
class ParamFile:
    """A parameter file as read: calc name, raw values, line of each key, expected outcome."""

    path: Path
    calc: str
    values: dict[str, Any]
    lines: dict[str, int]
    expect: str = PASS
    sha256: str = ""


def _yaml_error(path: Path, exc) -> InputError:
    mark = getattr(exc, "problem_mark", None) or getattr(exc, "context_mark", None)
    problem = getattr(exc, "problem", None) or str(exc)
    ctx = getattr(exc, "context", None)
    cmark = getattr(exc, "context_mark", None)
    where = f"{path}:{mark.line + 1}:{mark.column + 1}" if mark is not None else str(path)
    if ctx and cmark is not None and mark is not None and cmark.line != mark.line:
        ctx += f" started on line {cmark.line + 1}"
    return InputError(f"{where}: malformed YAML: {problem}" + (f" ({ctx})" if ctx else ""))


def _read_yaml(path: Path) -> tuple[Any, dict[str, int], bytes]:
    import yaml

    raw = path.read_bytes()
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        raise InputError(f"{path}: not UTF-8 text (byte {exc.start})") from None
    try:
        data = yaml.safe_load(text)
        node = yaml.compose(text, Loader=yaml.SafeLoader)  # line numbers (safe loader, no objects built)
    except yaml.YAMLError as exc:
        raise _yaml_error(path, exc) from None
    lines: dict[str, int] = {}
    dup = []
    if isinstance(node, yaml.MappingNode):
        for k, _ in node.value:
            key = k.value
            if key in lines:
                dup.append(f"{path}:{k.start_mark.line + 1}: {key}: given twice (first on line {lines[key]})")
            else:
                lines[key] = k.start_mark.line + 1
    if dup:
        raise InputError("\n".join(dup))
    return data, lines, raw


def load_parameter_file(path) -> ParamFile:
    """Read one member file (``yaml.safe_load``); InputError naming the file (and line) on bad YAML,
    a missing or unknown ``calc``, or a top level that is not a mapping."""
    import hashlib

    path = Path(path)
    if not path.is_file():
        raise InputError(f"{path}: no such parameter file")
    data, lines, raw = _read_yaml(path)
    if not isinstance(data, dict):
        raise InputError(f"{path}: got {type(data).__name__} at the top level; expected a mapping of "
                         "parameter names to values (name: value, one a line)")
    calc = data.get("calc")
    if calc is None:
        raise InputError(f"{path}: calc: missing; expected the calc to use, e.g. 'calc: steel_beam'")
    try:
        spec(calc)
    except InputError as exc:
        raise InputError(f"{path}:{lines.get('calc', '')}: {exc}".replace(":: ", ": ")) from None
    expect = data.get("expect", PASS)
    if expect not in (PASS, FAIL):
        raise InputError(f"{path}:{lines.get('expect')}: expect: got {expect!r}; expected 'pass' or 'fail'")
    values = {k: v for k, v in data.items() if k not in META_KEYS}
    proj = path.parent / PROJECT_FILE
    if proj.is_file() and proj.resolve() != path.resolve():
        pdata, plines, _ = _read_yaml(proj)
        pdata = pdata or {}
        if not isinstance(pdata, dict):
            raise InputError(f"{proj}: expected a mapping of {', '.join(PROJECT_KEYS)}")
        for k, v in pdata.items():
            if k not in PROJECT_KEYS:
                raise InputError(f"{proj}:{plines.get(k)}: {k}: not a project key; expected "
                                 f"{', '.join(PROJECT_KEYS)}")
            values.setdefault(k, v)
    return ParamFile(path, calc, values, lines, expect, hashlib.sha256(raw).hexdigest())


def discover(paths: Iterable) -> tuple[list[Path], list[str]]:
    """Parameter files under ``paths`` (files as given; folders searched recursively, sorted), and
    messages for paths that do not exist."""
    files: list[Path] = []
    missing: list[str] = []
    for p in paths:
        p = Path(p)
        if p.is_dir():
            found = sorted(q for q in p.rglob("*") if q.suffix in (".yaml", ".yml") and q.is_file()
                           and q.name != PROJECT_FILE and not q.name.startswith((".", "_")))
            files += found
        elif p.is_file():
            files.append(p)
        else:
            missing.append(f"{p}: no such file or folder")
    seen, out = set(), []
    for f in files:
        r = f.resolve()
        if r not in seen:
            seen.add(r)
            out.append(f)
    return out, missing


_nb_param_cache: dict[tuple[str, float], tuple[str, ...]] = {}


def notebook_parameters(calc: str) -> tuple[str, ...]:
    """Parameter names of the template's parameters cell (papermill.inspect_notebook), cached."""
    from .record import template_path

    tpl = template_path(calc)
    key = (str(tpl), tpl.stat().st_mtime)
    if key not in _nb_param_cache:
        import papermill as pm

        _nb_param_cache[key] = tuple(pm.inspect_notebook(str(tpl)).keys())
    return _nb_param_cache[key]


def check_injection(params: dict[str, Any], declared: Sequence[str]) -> None:
    """Refuse to run unless papermill's injected cell is only literal assignments to declared names.

    Names are checked first (:func:`calckit.params.validate`); this is a second guard on the code
    papermill will inject: each statement must be ``name = <literal>`` with ``name`` declared.
    """
    from papermill.translators import PythonTranslator

    bad = [k for k in params if not is_identifier(k) or k not in declared]
    if bad:
        raise InputError(f"parameters: got {bad[0]!r}; expected a declared parameter name")
    code = PythonTranslator.codify(params)
    try:
        tree = ast.parse(code)
    except SyntaxError as exc:
        raise InputError(f"parameters: the injected cell would not parse ({exc})") from None
    for node in tree.body:
        ok = (isinstance(node, ast.Assign) and len(node.targets) == 1
              and isinstance(node.targets[0], ast.Name) and node.targets[0].id in declared)
        if ok:
            try:
                ast.literal_eval(node.value)
            except ValueError:
                ok = False
        if not ok:
            raise InputError(f"parameters: the injected cell has a statement that is not a literal "
                             f"assignment ({ast.unparse(node)[:80]!r}); not run")


# ---------------------------------------------------------------------------------------------------
# one execution
# ---------------------------------------------------------------------------------------------------
@dataclass
class CalcRun:
    """One papermill execution: the executed notebook (None if it never started), its payload, the
    error text (empty when every cell ran) and the wall time."""

    nb: Any
    payload: dict | None
    error: str = ""
    seconds: float = 0.0


def execute_calc(calc: str, params: dict[str, Any], *, timeout: float | None = 600,
                 kernel_name: str | None = None, fork: bool | None = None) -> CalcRun:
    """Execute ``calcs/<calc>.ipynb`` with ``params`` (already validated) in a new kernel.

    ``fork``: take the kernel from the batch's template process (:mod:`calckit.kernels`; default: on
    unless ``CALCKIT_FORK_KERNELS=0``), else start a plain kernel. Returns the executed notebook even
    when a cell raised (papermill writes it with an error marker); the error text is then in
    ``CalcRun.error``.
    """
    from . import kernels
    import nbformat
    import papermill as pm
    from papermill.exceptions import PapermillExecutionError

    from .record import summary_payload, template_path

    logging.getLogger("papermill").setLevel(logging.ERROR)
    tpl = template_path(calc)
    check_injection(params, spec(calc).names)
    t0 = time.perf_counter()
    error = ""
    with tempfile.TemporaryDirectory(prefix="ck-") as td:
        out = os.path.join(td, "out.ipynb")
        handles: list = []
        t = kernels.template(wait=True) if (fork if fork is not None else kernels.fork_enabled()) else None
        km_class = kernels.ipc_manager(td, handles, t.launcher if t is not None else None)
        try:
            pm.execute_notebook(
                str(tpl), out, parameters=params, progress_bar=False, log_output=False,
                request_save_on_cell_execute=False, kernel_manager_class=km_class,
                record_timing=False, execution_timeout=timeout, start_timeout=120,
                kernel_name=kernel_name)
        except PapermillExecutionError as exc:
            error = f"{exc.ename}: {exc.evalue} (cell {exc.exec_count})"
        except Exception as exc:  # kernel died, timeout, ...: reported, the batch goes on
            error = f"{type(exc).__name__}: {exc}"
            log = Path(td, "kernel.log")
            if log.is_file() and log.stat().st_size:
                error += "\nkernel log (last lines):\n" + "\n".join(
                    log.read_text(errors="replace").splitlines()[-8:])
        finally:
            for h in handles:
                h.close()
        nb = nbformat.read(out, as_version=4) if os.path.isfile(out) else None
    payload = None
    if nb is not None:
        try:
            payload = summary_payload(nb)
        except Exception as exc:
            error = error or f"results payload unreadable: {exc}"
        if payload is None and not error:
            error = "the calc ran but displayed no results payload"
    return CalcRun(nb, payload, error, time.perf_counter() - t0)


# ---------------------------------------------------------------------------------------------------
# the batch
# ---------------------------------------------------------------------------------------------------
@dataclass
class Row:
    """One line of the summary table."""

    file: str
    member: str = ""
    calc: str = ""
    section: str = ""
    governing: str = ""
    ratio: float | None = None
    status: str = ""
    revision: str = ""
    record: str = ""  #: path of the archived notebook, relative to the output root
    message: str = ""
    expect: str = PASS
    seconds: float = 0.0

    @property
    def as_expected(self) -> bool:
        return self.status == self.expect or (self.status == INFO and self.expect == PASS)


@dataclass
class BatchResult:
    rows: list[Row]
    out: Path
    batch_id: str
    summary_files: list[Path] = field(default_factory=list)

    @property
    def exit_code(self) -> int:
        st = {r.status for r in self.rows}
        if st & {ERROR, INVALID}:
            return 2
        return 1 if FAIL in st else 0

    @property
    def as_intended(self) -> bool:
        """Every member ran, with the outcome its file expects (the demo's criterion)."""
        return bool(self.rows) and all(r.as_expected for r in self.rows)


def _status(run: CalcRun) -> str:
    if run.error or run.payload is None:
        return ERROR
    if not run.payload.get("checks"):
        return INFO
    return PASS if run.payload.get("passed") else FAIL


def summary_text(rows) -> str:
    """The summary as a plain-text table (see :mod:`calckit.summary`)."""
    from .summary import summary_text as _st

    return _st(rows)


def _rel(path: Path) -> str:
    try:
        return os.path.relpath(path)
    except ValueError:
        return str(path)


class _ExportHelper:
    """A helper process (``python -m calckit.batch export-helper``) that makes the archive HTML, so that
    converting one record does not hold this interpreter's lock while the other workers' kernel clients
    need it. Requests are served one at a time (length-prefixed JSON over the helper's stdin/stdout)."""

    def __init__(self):
        import subprocess

        self.proc = subprocess.Popen([sys.executable, "-m", "calckit.batch", "export-helper"],
                                     stdin=subprocess.PIPE, stdout=subprocess.PIPE, stderr=subprocess.DEVNULL)
        self.lock = threading.Lock()

    def export(self, nb, title: str) -> str:
        import json

        import nbformat

        data = json.dumps({"nb": nbformat.writes(nb), "title": title}).encode()
        with self.lock:
            self.proc.stdin.write(len(data).to_bytes(8, "big") + data)
            self.proc.stdin.flush()
            n = int.from_bytes(_read_exact(self.proc.stdout, 8), "big")
            reply = json.loads(_read_exact(self.proc.stdout, n))
        if "error" in reply:
            raise InputError(reply["error"])
        return reply["html"]

    def close(self) -> None:
        try:
            self.proc.stdin.close()
            self.proc.wait(10)
        except Exception:
            self.proc.kill()


def _read_exact(fh, n: int) -> bytes:
    buf = b""
    while len(buf) < n:
        chunk = fh.read(n - len(buf))
        if not chunk:
            raise EOFError("export helper closed")
        buf += chunk
    return buf


def _export_helper_main() -> None:
    """Serve export requests on stdin/stdout until stdin closes."""
    import json

    import nbformat

    from .render import export_html

    inp, outp = sys.stdin.buffer, sys.stdout.buffer
    while True:
        head = inp.read(8)
        if len(head) < 8:
            return
        req = json.loads(_read_exact(inp, int.from_bytes(head, "big")))
        try:
            reply = {"html": export_html(nbformat.reads(req["nb"], as_version=4), None, title=req["title"])}
        except Exception as exc:
            reply = {"error": f"{type(exc).__name__}: {exc}"}
        data = json.dumps(reply).encode()
        outp.write(len(data).to_bytes(8, "big") + data)
        outp.flush()


_exporter: _ExportHelper | None = None
_exporter_lock = threading.Lock()


def _export(nb, title: str) -> str:
    """The archive HTML of ``nb`` (calckit.render.export_html), in the helper process when :func:`run`
    started one for a parallel batch, else here."""
    ex = _exporter
    if ex is not None and ex.proc.poll() is None:
        try:
            return ex.export(nb, title)
        except (EOFError, BrokenPipeError, OSError):
            pass  # a broken helper: export here instead
    from .render import export_html

    return export_html(nb, None, title=title)


def _start_exporter(jobs: int) -> None:
    global _exporter
    with _exporter_lock:
        if jobs > 1 and _exporter is None:
            try:
                _exporter = _ExportHelper()
            except OSError:
                _exporter = None


def _stop_exporter() -> None:
    global _exporter
    with _exporter_lock:
        if _exporter is not None:
            _exporter.close()
            _exporter = None


def _process(pf: ParamFile, clean: dict, out: Path, date: str, batch_id: str, timeout) -> Row:
    from . import record as R
    from .sheets import section_label

    row = Row(_rel(pf.path), clean["member"], pf.calc, section_label(pf.calc, clean), expect=pf.expect)
    rev, folder = R.reserve_revision(out, date, clean["member"], pf.calc)
    row.revision = rev
    try:
        params = dict(clean, revision=rev, run_date=date, headless=True)
        tpl = R.template_path(pf.calc)
        started = R.utc_now()
        run = execute_calc(pf.calc, params, timeout=timeout)
        row.seconds = run.seconds
        row.status = _status(run)
        row.message = run.error
        if run.payload:
            row.governing = run.payload.get("governing") or ""
            r = run.payload.get("max_ratio")
            row.ratio = float(r) if isinstance(r, (int, float, str)) and r is not None else None
            if str(row.section).strip().lower() == "lightest":  # picked in the calc: name the choice
                given = ((run.payload.get("header") or {}).get("Inputs") or {}).get("section", "")
                if "chosen" in str(given):
                    row.section = str(given).split(":", 1)[1].split(" chosen")[0].strip()
        stem = f"{pf.calc}-{rev}"
        nb_path, html_path = folder / f"{stem}.ipynb", folder / f"{stem}.html"
        outputs: dict[str, Any] = {}
        meta = {"calc": pf.calc, "member": clean["member"], "revision": rev, "date": date,
                "parameter_file": _rel(pf.path), "parameter_sha256": pf.sha256,
                "template": tpl.name, "template_sha256": R.sha256_file(tpl), "versions": R.versions(),
                "status": row.status}
        if run.nb is not None:
            R.normalise(run.nb, template_name=tpl.name, output_name=f"{date}/{clean['member']}/{stem}.ipynb")
            run.nb.metadata["calckit"] = meta
            data = R.notebook_bytes(run.nb)
            R.write_exclusive(nb_path, data)
            outputs["ipynb"] = {"path": nb_path.relative_to(out).as_posix(), "sha256": R.sha256_bytes(data)}
            row.record = outputs["ipynb"]["path"]
            try:
                title = f"{clean['member']} {pf.calc} {rev}"
                page = _export(run.nb, title).encode("utf-8")
                R.write_exclusive(html_path, page)
                outputs["html"] = {"path": html_path.relative_to(out).as_posix(),
                                   "sha256": R.sha256_bytes(page)}
            except Exception as exc:
                row.status = ERROR
                row.message = (row.message + "; " if row.message else "") + f"HTML export failed: {exc}"
        R.append_manifest(out, {
            "run_id": uuid.uuid4().hex, "batch_id": batch_id, "started_utc": started,
            "time_utc": R.utc_now(), "seconds": round(run.seconds, 3), "calc": pf.calc,
            "member": clean["member"], "revision": rev, "date": date, "section": row.section,
            "parameter_file": meta["parameter_file"], "parameter_sha256": pf.sha256,
            "template": tpl.name, "template_sha256": meta["template_sha256"], "versions": meta["versions"],
            "outputs": outputs, "status": row.status, "governing": row.governing or None,
            "governing_ratio": row.ratio, "error": row.message or None})
    finally:
        R.release(folder, pf.calc, rev)
    return row


def _done_before(out: Path) -> dict[tuple, dict]:
    """Manifest entries that completed (pass/fail/info), keyed by what makes a rerun identical."""
    from .record import read_manifest

    done = {}
    for e in read_manifest(out):
        if e.get("status") in (PASS, FAIL, INFO):
            done[(e.get("calc"), e.get("member"), e.get("parameter_sha256"), e.get("template_sha256"),
                  (e.get("versions") or {}).get("calckit"))] = e
    return done


def run(paths: Sequence, out="outputs", jobs: int = 1, *, progress: Callable[[str], None] | None = None,
        resume: bool = False, timeout: float | None = 600, date: str | None = None,
        write_summary: bool = True) -> BatchResult:
    """Run every parameter file under ``paths`` into the archive ``out``; see the module docstring.

    ``resume``: skip a member whose record with the same parameter file hash, template hash and
    calckit version is already in the manifest (the previous outcome is reported).
    ``progress``: called with one line of text per event (default: write to stderr).
    """
    import datetime as _dt

    from . import record as R

    from . import kernels

    out = Path(out)
    out.mkdir(parents=True, exist_ok=True)
    kernels.template()  # start the kernel template now: it imports while the files are validated
    date = date or _dt.date.today().isoformat()
    batch_id = uuid.uuid4().hex[:12]
    say = progress or (lambda s: print(s, file=sys.stderr, flush=True))
    files, missing = discover(paths)
    rows: list[Row] = [Row(str(m.split(':')[0]), status=INVALID, message=m) for m in missing]
    todo: list[tuple[ParamFile, dict]] = []
    done = _done_before(out) if resume else {}
    for f in files:
        try:
            pf = load_parameter_file(f)
            clean = validate(pf.calc, pf.values, source=_rel(f), lines=pf.lines,
                             notebook_names=notebook_parameters(pf.calc))
        except InputError as exc:
            member = ""
            rows.append(Row(_rel(f), member, status=INVALID, message=str(exc)))
            say(f"invalid  {_rel(f)}:\n  " + str(exc).replace("\n", "\n  "))
            R.append_manifest(out, {"run_id": uuid.uuid4().hex, "batch_id": batch_id,
                                    "time_utc": R.utc_now(), "parameter_file": _rel(f),
                                    "parameter_sha256": R.sha256_file(f), "status": INVALID,
                                    "error": str(exc), "versions": R.versions(), "outputs": {}})
            continue
        key = (pf.calc, clean["member"], pf.sha256, R.sha256_file(R.template_path(pf.calc)),
               R.versions()["calckit"])
        if key in done:
            e = done[key]
            rows.append(Row(_rel(f), clean["member"], pf.calc, e.get("section", ""), e.get("governing") or "",
                            e.get("governing_ratio"), e["status"], e.get("revision", ""),
                            (e.get("outputs") or {}).get("ipynb", {}).get("path", ""),
                            "already archived (resume)", pf.expect))
            say(f"skip     {clean['member']} {pf.calc}: already archived as {rows[-1].record}")
            continue
        todo.append((pf, clean))
    n = len(todo)
    lock = threading.Lock()
    count = [0]

    def one(item):
        pf, clean = item
        try:
            row = _process(pf, clean, out, date, batch_id, timeout)
        except Exception as exc:  # an archive problem (disk full, permissions): report, go on
            row = Row(_rel(pf.path), clean["member"], pf.calc, status=ERROR, message=f"{type(exc).__name__}: "
                      f"{exc}", expect=pf.expect)
        with lock:
            count[0] += 1
            ratio = f"{row.ratio:.3f}" if row.ratio is not None else "-"
            say(f"[{count[0]:>{len(str(n))}}/{n}] {row.member:<12} {row.calc:<18} {row.revision:<4} "
                f"{row.status.upper():<7} {ratio:>6}  {row.seconds:5.1f} s"
                + (f"  {row.message.splitlines()[0][:100]}" if row.message else ""))
        return row

    if n:
        say(f"running {n} calc(s) with {max(1, jobs)} worker(s) into {out}")
        _start_exporter(min(jobs, n))
    try:
        with ThreadPoolExecutor(max_workers=max(1, jobs)) as ex:
            futs = [ex.submit(one, item) for item in todo]
            for f in as_completed(futs):
                rows.append(f.result())
    finally:
        _stop_exporter()
    order = {str(_rel(f)): i for i, f in enumerate(files)}
    rows.sort(key=lambda r: order.get(r.file, -1))
    res = BatchResult(rows, out, batch_id)
    if write_summary and rows:
        from .summary import write_summaries

        res.summary_files = write_summaries(res, date)
    return res


if __name__ == "__main__":  # the export helper of a parallel batch
    if sys.argv[1:] == ["export-helper"]:
        _export_helper_main()
