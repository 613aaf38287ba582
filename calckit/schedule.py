"""Beam schedule: one table row per member, expanded into member parameter files for the batch.

A schedule is a CSV file (UTF-8, a byte-order mark accepted, comma-separated). The header row names the
columns: parameter names exactly as declared in :mod:`calckit.params`, plus ``calc`` and optionally
``expect`` (pass or fail, as in a member file). The calc may instead be given once, by a line
``# calc: steel_beam`` before the header (a non-empty ``calc`` cell wins). Rows whose first cell starts
with ``#`` are comments; blank rows are skipped. "Row N" is line N of the file (the spreadsheet row while
no cell holds a line break).

Cell syntax:

* empty: the parameter is left out of the member file, so the calc's declared default applies;
* lists (``spans``, ``supports``, ``brace_points``): items separated by ``;``, e.g. ``7.5 m; 7.5 m``,
  ``pin; roller; roller`` (an empty item is an error);
* point loads: ``<case> <force> at <position from the left end>`` items separated by ``;``, e.g.
  ``D 45 kN at 1.4 m; L 38 kN at 1.4 m`` (``@`` for ``at`` too); further keys of an item follow as
  ``, key=value`` (``D 45 kN at 1.4 m, bearing=100 mm``);
* any list of mappings (``parts`` of a built-up section, point loads too): ``key=value, key=value`` items,
  e.g. ``shape=plate, b=250 mm, t=15 mm, x=0 mm, y=400 mm``;
* flags ``true``/``false`` (or ``yes``/``no``); numbers as written; quantities with their unit (a bare
  ``0`` is accepted); ``none`` leaves an optional quantity unset.

:func:`expand` validates every row with :func:`calckit.params.validate` *before* writing anything, then
writes ``<member>.yaml`` per row, opening with comment lines that name the schedule (path from the file's
folder), the row and the schedule's SHA-256. Bad input raises :class:`ScheduleError` listing every problem
of the file, each naming schedule, row, member and parameter; duplicate member marks (compared ignoring
case: they become file and archive folder names) are an error. An existing member file is never
overwritten: if its parameters (the file below its leading comment lines) are what the row would write it
is left untouched, otherwise nothing is written and the error names it. Nothing is ever deleted.

Project keys: the keys (job, project, client, designer) of a ``project.yaml`` beside the schedule are
copied into every member file (a cell of the row wins), so each member file is complete and its manifest
hash covers them. Without one, a ``project.yaml`` in the folder written to applies, as in any batch.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import csv
import hashlib
import io
import itertools
import os
import re
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Sequence

from .errors import InputError
from .params import CALCS, PROJECT_KEYS, RESERVED, Param, ParameterError, spec, validate

__all__ = ["ScheduleError", "ScheduleRow", "Schedule", "MemberFile", "read_schedule", "parse_cell",
           "expand", "member_text", "default_folder"]

META = ("calc", "expect")
PROJECT_FILE = "project.yaml"
_CALC_LINE = re.compile(r"^#\s*calc\s*:\s*(.*?)\s*$")
_POINT = re.compile(r"^(?P<case>\S+)\s+(?P<P>.+?)(?:\s+at\s+|\s*@\s*)(?P<x>\S.*)$", re.IGNORECASE)
_TRUE, _FALSE = ("true", "yes"), ("false", "no")


class ScheduleError(InputError):
    """Bad schedule input. ``problems`` lists (row, member, parameter, message) tuples; the message
    (already naming file, row, member and parameter) of each is one line of ``str(error)``."""

    def __init__(self, source: str, problems: Sequence[tuple[int, str, str, str]], what: str = "problem"):
        self.source = source
        self.problems = list(problems)
        n = len(self.problems)
        head = f"{source}: {n} {what}{'s' if n != 1 else ''}; no member file was written"
        super().__init__("\n".join([head] + [p[3] for p in self.problems]))


@dataclass(frozen=True)
class ScheduleRow:
    """One member row: ``row`` (line in the file), ``member`` mark, ``calc``, ``expect`` (pass/fail),
    ``values`` (what the member file writes: the non-empty cells parsed, and the project keys, in the
    calc's declaration order) and ``clean`` (``calckit.params.validate`` of values, defaults filled in)."""

    row: int
    member: str
    calc: str
    expect: str
    values: dict
    clean: dict


@dataclass(frozen=True)
class Schedule:
    """A schedule read and validated: its path, SHA-256, rows, and the project file used (or None)."""

    path: Path
    sha256: str
    rows: tuple[ScheduleRow, ...]
    project_file: Path | None = None


@dataclass(frozen=True)
class MemberFile:
    """One member file of an expansion: its path, row, member and ``status`` ('written', 'updated' or 'unchanged')."""

    path: Path
    row: int
    member: str
    status: str


class _CellError(ValueError):
    pass


def _scalar(p: Param, text: str) -> Any:
    """A single cell value for a scalar kind; left as text when it does not parse (validate says why)."""
    t = text.strip()
    if p.kind == "flag":
        low = t.lower()
        return True if low in _TRUE else False if low in _FALSE else t
    if p.kind in ("number", "integer"):
        for conv in (int, float):
            try:
                return conv(t)
            except ValueError:
                pass
        return t
    if p.kind in ("quantity", "optional_quantity", "quantities"):
        if p.kind == "optional_quantity" and t.lower() == "none":
            return None
        if re.fullmatch(r"[+-]?0+(\.0*)?", t):
            return 0  # a bare 0 is accepted for any dimension
    return t


def _items(text: str) -> list[str]:
    items = [s.strip() for s in text.split(";")]
    for i, s in enumerate(items):
        if not s:
            raise _CellError(f"item {i + 1} is empty; expected items separated by ';', e.g. '7.5 m; 7.5 m'")
    return items


def _record(p: Param, item: str, i: int) -> dict:
    fields = {f.name: f for f in p.fields}
    head, *rest = item.split(",")
    out: dict[str, Any] = {}
    if "=" in head:
        rest = [head] + rest
    else:
        m = _POINT.match(head.strip())
        if not {"case", "P", "x"} <= set(fields) or not m:
            form = "'<case> <force> at <position>', e.g. 'D 45 kN at 1.4 m'" if "case" in fields else \
                "'key=value, key=value' items"
            raise _CellError(f"item {i}: got {item!r}; expected {form}")
        out = {"case": m["case"], "P": _scalar(fields["P"], m["P"]), "x": _scalar(fields["x"], m["x"])}
    for part in rest:
        key, eq, val = part.partition("=")
        key = key.strip()
        if not eq or key not in fields:
            raise _CellError(f"item {i}: got {part.strip()!r}; expected key=value with a key among "
                             f"{', '.join(fields)}")
        out[key] = _scalar(fields[key], val)
    return out


def _parse(p: Param, text: str) -> Any:
    if p.kind in ("quantities", "list"):
        return [_scalar(p, s) for s in _items(text)]
    if p.kind == "records":
        return [_record(p, s, i + 1) for i, s in enumerate(_items(text))]
    return _scalar(p, text)


def parse_cell(calc: str, name: str, text: str) -> Any:
    """The value a schedule cell ``text`` gives parameter ``name`` of ``calc`` (see the module docstring).

    ``"7.5 m; 7.5 m"`` -> ``["7.5 m", "7.5 m"]``; ``"D 45 kN at 1.4 m"`` -> ``[{"case": "D", "P": "45 kN",
    "x": "1.4 m"}]``. Raises InputError naming the parameter for a list or point load that does not parse;
    values of the wrong type or range are returned as written and reported by ``validate``.
    """
    try:
        return _parse(spec(calc).param(name), text)
    except KeyError:
        raise InputError(f"{name}: not a parameter of calc {calc!r}") from None
    except _CellError as exc:
        raise InputError(f"{name}: {exc}") from None


def _project(path: Path) -> tuple[dict, Path | None]:
    import yaml

    proj = path.parent / PROJECT_FILE
    if not proj.is_file():
        return {}, None
    try:
        data = yaml.safe_load(proj.read_text(encoding="utf-8")) or {}
    except (yaml.YAMLError, UnicodeDecodeError) as exc:
        raise InputError(f"{proj}: not a readable YAML mapping of {', '.join(PROJECT_KEYS)} ({exc})") from None
    bad = [k for k in data if k not in PROJECT_KEYS] if isinstance(data, dict) else [data]
    if bad:
        raise InputError(f"{proj}: got {bad[0]!r}; expected a mapping of {', '.join(PROJECT_KEYS)} only")
    return {k: str(v) for k, v in data.items()}, proj


def read_schedule(path, calc: str | None = None) -> Schedule:
    """Read and validate every row of the schedule at ``path``; nothing is written.

    ``calc``: the calc of rows that have neither a ``calc`` cell nor a ``# calc:`` line in the file.
    Raises :class:`ScheduleError` listing every problem of the file (file, row, member, parameter).
    """
    path = Path(path)
    src = str(path)
    try:
        raw = path.read_bytes()
    except OSError as exc:
        raise InputError(f"{src}: cannot read the schedule ({exc.strerror or exc})") from None
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        raise InputError(f"{src}: not UTF-8 text (byte {exc.start})") from None
    project, proj_file = _project(path)
    problems: list[tuple[int, str, str, str]] = []
    rows: list[ScheduleRow] = []
    marks: list[tuple[int, str]] = []
    header: list[str] | None = None
    file_calc = calc
    params = _param_names()
    reader = csv.reader(io.StringIO(text, newline=""))
    start = 1
    for cells in reader:
        n, start = start, reader.line_num + 1
        if not any(c.strip() for c in cells):
            continue
        first = cells[0].strip()
        if first.startswith("#"):
            m = _CALC_LINE.match(first)
            if m and header is None:
                file_calc = m.group(1)
            elif m:
                problems.append((n, "", "calc", f"{src}: row {n}: calc: a '# calc:' line must come before "
                                                  "the header row"))
            continue
        if header is None:
            header = [c.strip() for c in cells]
            if len(header) == 1 and ";" in header[0]:
                problems.append((n, "", "", f"{src}: row {n} (header): one column {header[0][:40]!r}...; "
                                            "expected comma-separated columns (the file seems ';'-separated)"))
            seen: set[str] = set()
            for col in filter(None, header):  # a column with no name is ignored if it stays empty
                why = ("is set by the batch, not by a schedule" if col in RESERVED else
                       "given twice" if col in seen else
                       None if col in params or col in META else
                       f"not a parameter of any calc (expected calc, expect or a parameter of "
                       f"{', '.join(sorted(CALCS))} as declared in calckit/params.py)")
                if why:
                    problems.append((n, "", col, f"{src}: row {n} (header): column {col!r}: {why}"))
                seen.add(col)
            continue
        mark = dict(zip(header, cells)).get("member", "").strip()
        if mark:
            marks.append((n, mark))
        _row(src, n, header, cells, file_calc, project, problems, rows, params)
    if header is None:
        problems.append((1, "", "", f"{src}: no header row; expected a first row of parameter names"))
    if not rows and not problems:
        problems.append((1, "", "", f"{src}: no member rows below the header"))
    first_row: dict[str, int] = {}
    for n, mark in marks:  # every row, valid or not
        prev = first_row.setdefault(mark.lower(), n)
        if prev != n:
            problems.append((n, mark, "member", f"{src}: row {n} (member {mark}): member: {mark!r} is also "
                             f"the mark of row {prev}; expected one row per member"))
    if problems:
        raise ScheduleError(src, sorted(problems, key=lambda p: p[0]))
    return Schedule(path, hashlib.sha256(raw).hexdigest(), tuple(rows), proj_file)


def _param_names() -> set[str]:
    """Names a schedule column may have besides calc and expect: declared, not reserved."""
    return set().union(*(c.names for c in CALCS.values())) - set(RESERVED)


def _row(src: str, n: int, header: list[str], cells: list[str], file_calc: str | None, project: dict,
         problems: list, rows: list, params: set[str]) -> None:
    """Parse and validate one member row; append it to ``rows`` or its problems to ``problems``."""
    got = dict(zip(header, (c.strip() for c in cells)))
    member = got.get("member", "") or "?"
    where = f"{src}: row {n} (member {member})"

    def add(name: str, msg: str):
        problems.append((n, member, name, f"{where}: {name}: {msg}" if name else f"{where}: {msg}"))

    if len(cells) > len(header) and any(c.strip() for c in cells[len(header):]):
        add("", f"got {len(cells)} cells; the header has {len(header)} columns")
    if any(c.strip() for h, c in zip(header, cells) if not h):
        add("", "a cell is filled under a column with no name in the header")
    calc = got.get("calc") or file_calc
    if not calc:
        return add("calc", "missing; expected a calc column or a '# calc: NAME' line before the header")
    if calc not in CALCS:
        return add("calc", f"got {calc!r}; expected one of {', '.join(sorted(CALCS))}")
    expect = got.get("expect") or "pass"
    if expect not in ("pass", "fail"):
        add("expect", f"got {expect!r}; expected 'pass' or 'fail'")
    cs = spec(calc)
    given: dict[str, Any] = {}
    bad_cells: set[str] = set()
    for name, text in got.items():
        if not text or name not in params:  # calc/expect, or a bad column reported with the header
            continue
        if name not in cs.names:
            given[name] = text  # validate names it: not a parameter of this calc
            continue
        try:
            given[name] = _parse(cs.param(name), text)
        except _CellError as exc:
            bad_cells.add(name)
            add(name, str(exc))
    for k, v in project.items():
        if k in cs.names:
            given.setdefault(k, v)
    try:
        clean = validate(calc, given, source=where)
    except ParameterError as exc:
        for name, msg in exc.problems:
            if name not in bad_cells:
                problems.append((n, member, name, msg))
        return
    if bad_cells or expect not in ("pass", "fail"):
        return
    if clean["member"].lower() == Path(PROJECT_FILE).stem:
        return add("member", f"got {clean['member']!r}; expected a mark other than the project file's name")
    order = {k: i for i, k in enumerate(cs.names)}
    values = {k: given[k] for k in sorted(given, key=order.__getitem__)}
    rows.append(ScheduleRow(n, clean["member"], calc, expect, values, clean))


def default_folder(schedule) -> Path:
    """The folder ``calckit run SCHEDULE.csv`` expands into: ``<schedule stem>/`` beside the schedule."""
    p = Path(schedule)
    return p.parent / p.stem


def _rel(target: Path, folder: Path) -> str:
    """``target`` from ``folder`` when it is near (beside or one level up), else absolute."""
    try:
        rel = Path(os.path.relpath(target.resolve(), folder.resolve()))
    except ValueError:  # another drive
        rel = Path("..", "..")
    return rel.as_posix() if rel.parts.count("..") <= 1 else target.resolve().as_posix()


def member_text(schedule: Schedule, row: ScheduleRow, folder) -> str:
    """The text of ``row``'s member file in ``folder``: header comment lines, then the YAML mapping."""
    import yaml

    folder = Path(folder)
    data: dict[str, Any] = {"calc": row.calc}
    if row.expect != "pass":
        data["expect"] = row.expect
    data.update(row.values)
    body = yaml.safe_dump(data, sort_keys=False, default_flow_style=None, allow_unicode=True, width=10 ** 6)
    if yaml.safe_load(body) != data:  # a guard on the writer, not on user input
        raise InputError(f"{row.member}: the member file would not read back as written")
    head = ["# Member file written by calckit from a beam schedule: edit the schedule, then expand it again",
            "# (calckit updates this file from its row only while it is as calckit wrote it; a file edited",
            "# by hand is never overwritten).",
            f"# schedule: {_rel(schedule.path, folder)}, row {row.row}",
            f"# schedule sha256: {schedule.sha256}",
            f"# body sha256: {_sha(body)}"]
    if schedule.project_file is not None:
        head.append(f"# project keys from: {_rel(schedule.project_file, folder)}")
    return "\n".join(head) + "\n" + body


def _sha(body: str) -> str:
    import hashlib

    return hashlib.sha256(body.encode("utf-8")).hexdigest()


def _as_written(text: str) -> bool:
    """The member file is as calckit wrote it: its header's body sha256 matches its body (not edited by
    hand since), so updating it from its row loses nothing (archived records keep their own parameters)."""
    for ln in text.splitlines():
        if not ln.startswith("#"):
            break
        if ln.startswith("# body sha256: "):
            return ln.split(": ", 1)[1].strip() == _sha(_body(text))
    return False


def _body(text: str) -> str:
    """The text below the leading comment lines (what decides whether a member file has changed)."""
    return "".join(itertools.dropwhile(lambda ln: ln.startswith("#"), text.splitlines(keepends=True)))


def expand(schedule, into=None, *, calc: str | None = None) -> list[MemberFile]:
    """Write one member file per row of ``schedule`` into ``into`` (default :func:`default_folder`).

    Every row is validated and every existing file compared first; then the new files are written
    (exclusive create), the identical ones left untouched, and a file whose row has changed is updated
    when it is still as calckit wrote it (its header's body sha256 matches: the archived records of the
    member keep their own copy of the parameters, so nothing is lost; the next run files a new revision).
    Raises :class:`ScheduleError` (nothing written) on bad input or when a member file that differs from
    its row was edited by hand or was not written from a schedule.
    """
    sch = read_schedule(schedule, calc)
    folder = Path(into) if into is not None else default_folder(sch.path)
    plan: list[tuple[ScheduleRow, Path, str, str]] = []
    conflicts = []
    for r in sch.rows:
        target = folder / f"{r.member}.yaml"
        text = member_text(sch, r, folder)
        exists = target.exists()
        if exists:
            try:
                old = target.read_text(encoding="utf-8")
            except (OSError, UnicodeDecodeError):
                old = None
            if old is not None and _body(old) == _body(text):
                plan.append((r, target, text, "unchanged"))
                continue
            if old is None or not _as_written(old):
                conflicts.append((r.row, r.member, "member", f"{target}: exists, differs from row {r.row} "
                                  f"(member {r.member}) of {sch.path} and was edited by hand or not written "
                                  "from a schedule; not overwritten. Move it aside or expand into another "
                                  "folder"))
                continue
            plan.append((r, target, text, "updated"))
            continue
        plan.append((r, target, text, "written"))
    if conflicts:
        raise ScheduleError(str(sch.path), conflicts, what="conflict")
    folder.mkdir(parents=True, exist_ok=True)
    out = []
    for r, target, text, status in plan:
        if status == "written":
            with open(target, "x", encoding="utf-8", newline="\n") as fh:
                fh.write(text)
        elif status == "updated":
            tmp = target.with_name(target.name + ".new")
            with open(tmp, "x", encoding="utf-8", newline="\n") as fh:
                fh.write(text)
            os.replace(tmp, target)  # atomic: the old file or the new one, never half of either
        out.append(MemberFile(target, r.row, r.member, status))
    return out
