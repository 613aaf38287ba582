"""The summary table of a batch: member, calc, section, governing check, ratio, status; as text (printed),
CSV and a small offline HTML page, written beside the records (never overwriting an earlier batch's)."""
from __future__ import annotations

import csv
import html as _html
import io
from pathlib import Path
from typing import Sequence

from .batch import ERROR, EXIT_CODES, FAIL, INVALID, BatchResult, Row

__all__ = ["summary_text", "summary_csv", "summary_html", "write_summaries", "COLUMNS"]

# ---------------------------------------------------------------------------------------------------
COLUMNS = ("member", "calc", "section", "governing", "ratio", "status", "record", "message")


def _cells(r: Row) -> list[str]:
    return [r.member, r.calc, r.section, r.governing, "" if r.ratio is None else f"{r.ratio:.3f}",
            r.status, r.record, r.message.splitlines()[0] if r.message else ""]


def summary_text(rows: Sequence[Row]) -> str:
    """The summary as a plain-text table (message column cut to 60 characters)."""
    head = ["member", "calc", "section", "governing check", "ratio", "status"]
    body = [_cells(r)[:6] for r in rows]
    w = [max([len(h)] + [len(b[i]) for b in body]) for i, h in enumerate(head)]
    w[2], w[3] = min(w[2], 40), min(w[3], 64)

    def cut(text: str, n: int) -> str:  # a cut cell ends in "..." so it is not read as the whole text
        return text if len(text) <= n else text[:n - 3].rstrip() + "..."

    fmt = lambda cells: "  ".join(cut(str(c), w[i]).ljust(w[i]) if i != 4 else str(c).rjust(w[i])
                                  for i, c in enumerate(cells))
    lines = [fmt(head), "  ".join("-" * x for x in w)] + [fmt(b) for b in body]
    for r in rows:
        if r.status in (ERROR, INVALID) and r.message:
            first = r.message.splitlines()[0][:200]
            lines.append(first if first.startswith(r.file) else f"{r.file}: {first}")
    return "\n".join(lines)


def summary_csv(rows: Sequence[Row]) -> str:
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(("file",) + COLUMNS)
    for r in rows:
        w.writerow([r.file] + _cells(r)[:7] + [r.message])
    return buf.getvalue()


def _record_links(record: str) -> str:
    """Links to the archived HTML page and notebook of ``record`` (a path relative to the archive root);
    the summary page lives one folder down, in ``<out>/<date>/``."""
    if not record:
        return ""
    e = _html.escape
    nb = "../" + Path(record).as_posix()
    page = "../" + Path(record).with_suffix(".html").as_posix()
    return f'<a href="{e(page)}">{e(record)}</a> (<a href="{e(nb)}">ipynb</a>)'


def summary_html(rows: Sequence[Row], title: str) -> str:
    e = _html.escape
    head = "".join(f"<th>{e(c)}</th>" for c in ("file",) + COLUMNS)
    body = []
    for r in rows:
        cells = [e(c) for c in [r.file] + _cells(r)]
        cells[COLUMNS.index("record") + 1] = _record_links(r.record)
        cls = {FAIL: "fail", ERROR: "error", INVALID: "error"}.get(r.status, "")
        body.append(f'<tr class="{cls}">' + "".join(f"<td>{c}</td>" for c in cells) + "</tr>")
    from .render.blocks import CAUTION_TEXT

    return ("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>" + e(title) +
            "</title><style>body{font-family:sans-serif;margin:1.5em}table{border-collapse:collapse}"
            "td,th{border:1px solid #888;padding:2px 6px;text-align:left}tr.fail td{font-weight:bold}"
            "tr.error td{font-style:italic;background:#eee}.caution{border:2px solid #000;padding:4px 8px;"
            "max-width:60em}</style></head><body><h1>" + e(title) + "</h1><table><thead><tr>" + head +
            "</tr></thead><tbody>" + "".join(body) + "</tbody></table><p>Exit status meanings: " +
            "; ".join(f"{k}: {e(v)}" for k, v in EXIT_CODES.items()) + ".</p><p class=\"caution\">"
            "<strong>Caution.</strong> " + e(CAUTION_TEXT) + "</p></body></html>\n")


def write_summaries(res: BatchResult, date: str) -> list[Path]:
    """Write ``<out>/<date>/batch-<NN>-summary.csv`` and ``.html`` (next free NN, never overwritten)."""
    from .record import write_exclusive

    folder = res.out / date
    folder.mkdir(parents=True, exist_ok=True)
    n = 1
    while True:
        csv_p, html_p = folder / f"batch-{n:02d}-summary.csv", folder / f"batch-{n:02d}-summary.html"
        try:
            write_exclusive(csv_p, summary_csv(res.rows).encode("utf-8"))
        except FileExistsError:
            n += 1
            continue
        write_exclusive(html_p, summary_html(res.rows, f"Batch {n:02d} of {date} ({res.batch_id})")
                        .encode("utf-8"))
        return [csv_p, html_p]
