"""Command line: ``calckit run``, ``calckit demo``, ``calckit verify``, ``calckit check``, ``calckit pick``,
``calckit schedule expand`` (also ``python -m calckit ...``). A thin layer over :func:`calckit.batch.run`,
:func:`calckit.record.verify`, :func:`calckit.pick` and :func:`calckit.schedule.expand`.

A ``.csv`` path given to ``run`` or ``check`` is a beam schedule (:mod:`calckit.schedule`): ``run`` expands
it into ``<schedule stem>/`` beside it (created if missing; a member file whose row changed is updated only
while it is as calckit wrote it, a hand-edited one is never overwritten) and runs those member files; ``check`` validates its rows without writing anything.

Exit codes
----------
run / demo / check:
    0  every member passes (demo: every member has the outcome its file expects, the member that fails
       on purpose included)
    1  some member fails a design check
    2  some calc could not run: bad input (file and parameter named) or an error while executing;
       the other members still run
       (run, check: also a bad schedule, or one whose member file differs from its row; no member of
       that schedule runs, the other paths still do)
pick:
    0  a section passes (the lightest is printed), 1 no catalog section passes (the closest are listed),
    2  bad input
schedule expand:
    0  every member file written, updated (its row changed, the file untouched since calckit wrote it) or
       left unchanged; 2 bad input or a hand-edited member file that differs from its row (nothing is
       written then)
verify:
    0  same: every number of the results payload agrees (relative tolerance 1e-9) and every hash matches
    1  a difference (each one is listed)
    2  the record could not be re-executed (not an archive, missing template, execution failed)

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import argparse
import sys
from pathlib import Path

__all__ = ["main", "build_parser"]


def _repo_dir(name: str) -> Path:
    """``parameters/`` or ``outputs/``: in the current folder if it has one, else beside the package."""
    here = Path.cwd() / name
    if here.exists() or name == "outputs":
        return here
    return Path(__file__).resolve().parent.parent / name


def build_parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="calckit", description="Steel beam and plate girder calcs: batch runs, archive, verify.",
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog="Exit codes:\n"
               "  run, demo, check: 0 all pass (demo: every member has its expected outcome),\n"
               "                    1 some member fails a check,\n"
               "                    2 some calc could not run (bad input or an error)\n"
               "  pick:             0 a section passes, 1 none passes, 2 bad input\n"
               "  schedule expand:  0 member files written or unchanged, 2 bad input or a conflict\n"
               "  verify:           0 same, 1 differences, 2 could not verify\n\n"
               "A design aid only: results must be reviewed, and the calculation sealed, by a licensed or\n"
               "chartered engineer; local codes, national annexes and project specifications govern.")
    sub = p.add_subparsers(dest="command", required=True)

    def batch_opts(q):
        q.add_argument("-j", "--jobs", type=int, default=1, help="calcs run in parallel (default 1)")
        q.add_argument("--out", default=None, help="archive root (default ./outputs)")
        q.add_argument("--resume", action="store_true",
                       help="skip members already archived with the same parameter file and template")
        q.add_argument("--timeout", type=float, default=600, help="seconds allowed per notebook cell")
        q.add_argument("-q", "--quiet", action="store_true", help="no progress lines")
        q.add_argument("--no-fork", action="store_true",
                       help="start every kernel as a plain python process (slower; see calckit.kernels)")

    r = sub.add_parser("run", help="run parameter files (or folders of them) and archive the records")
    r.add_argument("paths", nargs="+", help="parameter files (.yaml), folders, or beam schedules (.csv)")
    batch_opts(r)
    d = sub.add_parser("demo", help="run the demo project in parameters/ into outputs/")
    batch_opts(d)
    d.set_defaults(jobs=2)
    c = sub.add_parser("check", help="validate parameter files without running them")
    c.add_argument("paths", nargs="+")
    v = sub.add_parser("verify", help="re-execute archived records and compare them with the archive")
    v.add_argument("records", nargs="+", help="archived .ipynb files")
    v.add_argument("--root", default=None, help="archive root holding manifest.jsonl "
                                                "(default: three levels above the record)")
    s = sub.add_parser("schedule", help="beam schedules (.csv): expand into member parameter files")
    ss = s.add_subparsers(dest="action", required=True)
    e = ss.add_parser("expand", help="write one member file (<member>.yaml) per schedule row")
    e.add_argument("schedule", help="the schedule, a .csv file")
    e.add_argument("--into", default=None, help="folder for the member files (default: <schedule stem>/ "
                                                "beside the schedule)")
    k = sub.add_parser("pick", add_help=False,
                       help="lightest catalog section passing every check (calckit pick FILE --help)")
    k.add_argument("rest", nargs=argparse.REMAINDER)
    return p


def _expand(schedule, into=None, say=print, running: bool = False) -> list[Path] | None:
    """Expand one schedule; the member files, or None after reporting bad input on stderr."""
    from .errors import InputError
    from .schedule import expand

    try:
        files = expand(schedule, into)
    except InputError as exc:
        print(f"invalid  {exc}".replace("\n", "\n  "), file=sys.stderr)
        return None
    for f in files:
        say(f"{f.status:<10} {f.path}  (row {f.row})")
    paths = [f.path for f in files]
    folder = paths[0].parent if paths else None
    for q in sorted(folder.glob("*.y*ml")) if folder else ():
        if q not in paths and q.name != "project.yaml":
            say(f"note       {q}: not a row of {schedule}; left in place" + (", not run" if running else ""))
    return paths


def _split_schedules(paths) -> tuple[list, list]:
    return ([p for p in paths if str(p).lower().endswith(".csv")],
            [p for p in paths if not str(p).lower().endswith(".csv")])


def _run(args, paths, demo: bool) -> int:
    from .batch import run, summary_text

    import os

    schedules, paths = _split_schedules(paths)
    bad = 0
    for sch in schedules:
        files = _expand(sch, say=(lambda s: None) if args.quiet else (lambda s: print(s, file=sys.stderr)),
                        running=True)
        if files is None:
            bad += 1
        else:
            paths += files
    if bad and not paths:
        return 2
    if args.no_fork:
        os.environ["CALCKIT_FORK_KERNELS"] = "0"
    out = Path(args.out) if args.out else _repo_dir("outputs")
    progress = (lambda s: None) if args.quiet else None
    res = run(paths, out, jobs=args.jobs, progress=progress, resume=args.resume, timeout=args.timeout)
    if not res.rows:
        print("calckit: no parameter files found in " + ", ".join(map(str, paths)), file=sys.stderr)
        return 2
    print(summary_text(res.rows))
    for f in res.summary_files:
        print(f"summary: {f}")
    code = 2 if bad else res.exit_code
    if demo:
        odd = [r for r in res.rows if not r.as_expected]
        if not odd:
            fails = [r.member for r in res.rows if r.status == "fail"]
            print("demo: every member has its expected outcome"
                  + (f" ({', '.join(fails)} fails on purpose)" if fails else ""))
            return 0
        for r in odd:
            print(f"demo: {r.member or r.file}: expected {r.expect}, got {r.status}", file=sys.stderr)
    return code


def _check(paths) -> int:
    from .batch import discover, load_parameter_file, notebook_parameters
    from .errors import InputError
    from .params import validate

    from .schedule import read_schedule

    schedules, paths = _split_schedules(paths)
    bad = 0
    for sch in schedules:
        try:
            for r in read_schedule(sch).rows:
                print(f"ok       {sch}: row {r.row} (member {r.member})")
        except InputError as exc:
            bad += 1
            print(f"invalid  {exc}", file=sys.stderr)
    files, missing = discover(paths) if paths else ([], [])
    bad += len(missing)
    for m in missing:
        print(m, file=sys.stderr)
    for f in files:
        try:
            pf = load_parameter_file(f)
            validate(pf.calc, pf.values, source=str(f), lines=pf.lines,
                     notebook_names=notebook_parameters(pf.calc))
            print(f"ok       {f}")
        except InputError as exc:
            bad += 1
            print(f"invalid  {exc}", file=sys.stderr)
    return 2 if bad or not (files or schedules) else 0


def _verify(args) -> int:
    from .record import verify

    worst = 0
    for rec in args.records:
        rep = verify(rec, root=args.root)
        print(rep.text())
        worst = max(worst, 2 if rep.error else (0 if rep.same else 1))
    return worst


def main(argv=None) -> int:
    args = build_parser().parse_args(argv)
    if args.command == "run":
        return _run(args, args.paths, demo=False)
    if args.command == "demo":
        return _run(args, [_repo_dir("parameters")], demo=True)
    if args.command == "check":
        return _check(args.paths)
    if args.command == "schedule":
        return 0 if _expand(args.schedule, args.into) is not None else 2
    if args.command == "pick":
        from .pick.report import pick_main

        return pick_main(args.rest)
    return _verify(args)


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
