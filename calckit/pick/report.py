"""Reporting of a section search: plain-text table, display rows, the record paragraph, the notebook
helper for ``section = "lightest"`` and the ``calckit pick PARAMETER_FILE`` command.

:func:`pick_main` is the command's body (wired into :mod:`calckit.cli` by its owner): it reads one YAML
member file (``yaml.safe_load``) with the steel beam calc's parameter names plus the search keys below,
runs :func:`calckit.pick`, prints the table and returns the exit code:

=====  ====================================================
code   meaning
=====  ====================================================
0      a section passes (the lightest is printed first)
1      no section passes (the closest candidates are listed)
2      bad input (file missing, YAML error, bad parameter)
=====  ====================================================

Search keys in the member file (all optional): ``families`` (list or one of W, IPE, HEA, HEB),
``depth`` and ``mass`` ([min, max], either may be null, e.g. ``depth: ["300 mm", "600 mm"]``),
``n_best`` (how many to list, default 10). A ``section`` key (the calc's section) is ignored.
"""
from __future__ import annotations

import sys
from dataclasses import dataclass
from typing import Any, Mapping, NamedTuple, Sequence

from ..errors import CalckitError, InputError
from .result import Candidate, PickResult

__all__ = ["text_table", "candidates_table", "CandidateTable", "record_paragraph", "Selection",
           "select_section", "pick_main", "CAUTION", "SEARCH_KEYS"]

CAUTION = ("Design aid only: the section chosen must be reviewed, and the calculation sealed, by a licensed "
           "or chartered engineer; local codes, national annexes and project specifications govern.")
#: keys of a member file that control the search (besides the steel beam calc's parameters)
SEARCH_KEYS = ("families", "depth", "mass", "n_best")
#: keys of the steel beam calc that the search does not use (accepted and ignored)
_IGNORED = ("section", "member", "description", "job", "project", "client", "designer", "units", "headless",
            "revision", "run_date", "expect")
_LB_FT = 0.45359237 / 0.3048  # kg/m per lb/ft
_IN = 0.0254


def _mass_text(kg_m: float, system: str) -> str:
    return f"{kg_m / _LB_FT:.1f} lb/ft" if system == "US" else f"{kg_m:.1f} kg/m"


def _depth_text(d: float, system: str) -> str:
    return f"{d / _IN:.2f} in" if system == "US" else f"{d * 1e3:.0f} mm"


def _system(result: PickResult, system: str | None) -> str:
    if system is None:
        return "US" if result.standard.startswith("AISC") else "SI"
    s = str(system).upper()
    if s not in ("SI", "US"):
        raise InputError(f"system: got {system!r}; expected 'SI' or 'US'")
    return s


class CandidateTable(NamedTuple):
    """Rows for display: ``columns`` (headings) and ``rows`` (cells as text), e.g. for
    ``calckit.render.Table(*candidates_table(result))``."""

    columns: tuple[str, ...]
    rows: tuple[tuple[str, ...], ...]


_COLUMNS = ("rank", "section", "mass", "depth", "governing check", "ratio", "status")


def _row(rank: str, c: Candidate, system: str) -> tuple[str, ...]:
    return (rank, c.name, _mass_text(c.mass, system), _depth_text(c.depth, system), c.governing,
            f"{c.ratio:.2f}", c.status)


def candidates_table(result: PickResult, which: str = "lightest", system: str | None = None) -> CandidateTable:
    """Display rows of a search.

    ``which``: "lightest" (the n lightest passing; when nothing passes, the closest candidates),
    "bands" (lightest passing of each depth band), "all" (every candidate, lightest first) or "closest".
    ``system``: "SI" or "US" display units (default: US for AISC 360-22, SI for EN 1993-1-1).
    """
    s = _system(result, system)
    if which == "lightest":
        items = result.lightest or result.closest
    elif which == "bands":
        items = result.by_band
    elif which == "all":
        items = result.candidates
    elif which == "closest":
        items = result.closest or tuple(sorted(result.candidates, key=lambda c: c.ratio)[:5])
    else:
        raise InputError(f"which: got {which!r}; expected 'lightest', 'bands', 'all' or 'closest'")
    cols = _COLUMNS if which != "bands" else ("band",) + _COLUMNS[1:]
    rows = []
    for i, c in enumerate(items, start=1):
        first = c.band if which == "bands" else str(i)
        rows.append(_row(first, c, s))
    return CandidateTable(cols, tuple(rows))


def text_table(result: PickResult, which: str = "lightest", system: str | None = None) -> str:
    """A plain text table (fixed-width columns) of :func:`candidates_table`."""
    t = candidates_table(result, which, system)
    widths = [max(len(t.columns[j]), *(len(r[j]) for r in t.rows)) if t.rows else len(t.columns[j])
              for j in range(len(t.columns))]
    line = "  ".join(h.ljust(w) for h, w in zip(t.columns, widths))
    out = [line, "  ".join("-" * w for w in widths)]
    out += ["  ".join(v.ljust(w) for v, w in zip(r, widths)) for r in t.rows]
    return "\n".join(out)


def _filters(result: PickResult) -> str:
    parts = []
    if result.depth is not None:
        parts.append(f"depth {tuple(result.depth)}")
    if result.mass is not None:
        parts.append(f"mass {tuple(result.mass)}")
    return ", ".join(parts) if parts else "no depth or mass filter"


def record_paragraph(result: PickResult, system: str | None = None) -> str:
    """One paragraph for the calc record: what was searched, what was chosen and why, the neighbours."""
    s = _system(result, system)
    fams = ", ".join(result.families)
    m = result.member
    lim = [f"{k} L/{n:g}" for k, n in (("live load", getattr(m, "defl_live", None)),
                                        ("total load", getattr(m, "defl_total", None))) if n]
    sw = getattr(m, "self_weight", True)
    head = (f"Section chosen by search: {result.n_checked} catalog sections of the {fams} "
            f"{'family' if len(result.families) == 1 else 'families'} ({_filters(result)}) were checked "
            f"to {result.standard}{' ' + result.method if result.method != 'EN' else ''} in {result.grade}: "
            f"every strength check of the member check and the deflection limits "
            f"({', '.join(lim) if lim else 'none given'})"
            + (", each section with its own self-weight added to the dead load." if sw else
               ", self-weight not added (the dead load is taken to include it)."))
    if result.chosen is None:
        close = "; ".join(f"{c.name} {c.ratio:.2f} ({c.governing})" for c in result.closest[:3])
        return f"{head} No section passes; the closest are {close}. {CAUTION}"
    c = result.chosen
    lighter, heavier = result.neighbours()
    body = (f" The lightest passing section is {c.name} ({_mass_text(c.mass, s)}, depth "
            f"{_depth_text(c.depth, s)}), governed by {c.governing} at a ratio of {c.ratio:.2f}"
            + (f" ({c.combination})" if c.combination else "") + ".")
    if lighter is not None:
        body += (f" The next lighter section, {lighter.name} ({_mass_text(lighter.mass, s)}), fails "
                 f"{lighter.governing} at {lighter.ratio:.2f}.")
    else:
        body += " No lighter section was in the search."
    if heavier is not None:
        body += (f" The next heavier passing section is {heavier.name} ({_mass_text(heavier.mass, s)}, "
                 f"ratio {heavier.ratio:.2f}, {heavier.governing}).")
    return f"{head}{body} {CAUTION}"


@dataclass(frozen=True)
class Selection:
    """The section a calc uses and how it was chosen.

    section: the catalog section (IShape); name: its designation; picked: True when chosen by search;
    record: the paragraph for the calc record; result: the :class:`PickResult` (None when the section
    was given).
    """

    section: Any
    name: str
    picked: bool
    record: str
    result: PickResult | None = None


def select_section(params: Mapping[str, Any], section: str | None = None, *, families=None, depth=None,
                   mass=None, n_best: int = 10) -> Selection:
    """The section for the steel beam calc: the catalog section named by ``section`` (default
    ``params["section"]``), or, for ``"lightest"``, the result of :func:`calckit.pick` on ``params``.

    Raises InputError when ``"lightest"`` finds no passing section (the message lists the closest), so
    a calc never continues with a section that was not found.
    """
    from ..sections import section as get_section
    from .search import pick

    name = section if section is not None else params.get("section")
    if not isinstance(name, str) or not name.strip():
        raise InputError(f"section: got {name!r}; expected a catalog designation or 'lightest'")
    if name.strip().lower() != "lightest":
        sec = get_section(name)
        return Selection(sec, sec.name, False, f"Section {sec.name} as given in the parameters.", None)
    res = pick(dict(params), families=families, depth=depth, mass=mass, n_best=n_best)
    if res.chosen is None:
        raise InputError(f"section: got 'lightest' but {res.summary()}; widen the families or filters, or "
                         "give a section")
    return Selection(res.section, res.chosen.name, True, record_paragraph(res), res)


# ---------------------------------------------------------------------------------------------- command
def _read(path: str) -> tuple[dict, dict]:
    import yaml

    try:
        with open(path, encoding="utf-8") as fh:
            data = yaml.safe_load(fh)
    except FileNotFoundError:
        raise InputError(f"PARAMETER_FILE: got {path!r}; no such file") from None
    except yaml.YAMLError as exc:
        raise InputError(f"{path}: not valid YAML ({exc})") from None
    if not isinstance(data, dict):
        raise InputError(f"{path}: got {type(data).__name__}; expected a mapping of parameter: value")
    search = {k: data.pop(k) for k in SEARCH_KEYS if k in data}
    calc = data.pop("calc", "steel_beam")  # a steel beam calc's own parameter file is accepted as it is
    if calc != "steel_beam":
        raise InputError(f"{path}: calc: got {calc!r}; expected 'steel_beam' (calckit pick searches rolled "
                         f"sections for steel beam members)")
    from .member import PARAM_KEYS

    unknown = sorted(k for k in data if k not in PARAM_KEYS and k not in _IGNORED)
    if unknown:
        raise InputError(f"{path}: unknown keys {unknown}; expected steel beam calc parameters "
                         f"({', '.join(PARAM_KEYS)}) and search keys ({', '.join(SEARCH_KEYS)})")
    return data, search


def _pair(v, name):
    if v is None:
        return None
    if not isinstance(v, (list, tuple)) or len(v) != 2:
        raise InputError(f"{name}: got {v!r}; expected [min, max], e.g. ['300 mm', '600 mm'] (null for open)")
    return tuple(v)


def pick_main(argv: Sequence[str] | None = None) -> int:
    """``calckit pick PARAMETER_FILE [--all] [--bands] [--units SI|US]``; returns the exit code."""
    import argparse

    from .search import pick

    ap = argparse.ArgumentParser(prog="calckit pick",
                                 description="Lightest catalog section passing every check for one member.")
    ap.add_argument("parameter_file", metavar="PARAMETER_FILE", help="YAML member file")
    ap.add_argument("--all", action="store_true", help="list every candidate checked")
    ap.add_argument("--bands", action="store_true", help="also list the lightest of each depth band")
    ap.add_argument("--units", choices=("SI", "US"), default=None, help="display units")
    try:
        args = ap.parse_args(list(argv) if argv is not None else None)
    except SystemExit as exc:
        return 0 if exc.code == 0 else 2
    out = sys.stdout
    try:
        data, search = _read(args.parameter_file)
        n_best = search.get("n_best", 10)
        res = pick(data, families=search.get("families"), depth=_pair(search.get("depth"), "depth"),
                   mass=_pair(search.get("mass"), "mass"), n_best=n_best)
    except (CalckitError, ValueError, TypeError) as exc:
        print(f"calckit pick: bad input: {exc}", file=sys.stderr)
        return 2
    print(f"{args.parameter_file}: {res.standard} {res.method if res.method != 'EN' else ''}".rstrip()
          + f", {res.grade}, families {', '.join(res.families)}; {res.n_checked} sections checked in "
          f"{res.elapsed * 1e3:.0f} ms", file=out)
    if res.chosen is not None:
        print(f"chosen: {res.summary()}", file=out)
        print("", file=out)
        print(text_table(res, "all" if args.all else "lightest", args.units), file=out)
    else:
        print(f"NO SECTION PASSES: {res.summary()}", file=out)
        print("", file=out)
        print(text_table(res, "all" if args.all else "closest", args.units), file=out)
    if args.bands and res.by_band:
        print("\nlightest passing section of each depth band:", file=out)
        print(text_table(res, "bands", args.units), file=out)
    print("\n" + CAUTION, file=out)
    return 0 if res.chosen is not None else 1
