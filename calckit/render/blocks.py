"""Document blocks of a calc sheet: data plus renderers (HTML with TeX math, Markdown, plain text).

Display any block in a notebook cell (IPython calls ``_repr_html_`` / ``_repr_markdown_``); a
:class:`Summary` also writes the machine-readable results payload (``calckit.render.payload``).
Blocks never compute: they format Step / Decision / Check records.
"""
from __future__ import annotations

import base64
import datetime as _dt
import io
from dataclasses import dataclass, field
from typing import Any, Mapping, Sequence

from . import html as H
from . import latex as L
from . import numfmt
from .records import Check, Decision, Step

__all__ = ["Header", "Caution", "Section", "Summary", "Figure", "Text", "Table", "Sheet", "show",
           "CAUTION_TEXT", "NOTEBOOK_CSS"]

CAUTION_TEXT = (
    "This calculation was produced with a design aid. It is not a sealed design: the results must be "
    "reviewed, and the calculation sealed, by a licensed professional engineer or chartered engineer "
    "responsible for the project. Local building codes, national annexes and the project specification "
    "govern wherever they differ from what is assumed here. The user is responsible for the inputs "
    "(loads, spans, restraints, materials and section data) and for confirming that the assumptions "
    "suit the structure."
)

# Small style for JupyterLab (class-scoped; the archive export replaces it with sheet.css).
NOTEBOOK_CSS = (
    "<style data-ck-nb>.ck-block table{border-collapse:collapse;margin:0.3em 0}"
    ".ck-block th,.ck-block td{border:1px solid #999;padding:2px 6px;vertical-align:top;text-align:left}"
    ".ck-ok{font-weight:bold}.ck-ng{font-weight:bold;text-decoration:underline}"
    ".ck-gov td{font-weight:bold}.ck-govmark{font-size:80%;border:1px solid #000;padding:0 3px}"
    ".ck-note,.ck-label{font-size:90%;font-style:italic}.ck-caution{border:2px solid #000;padding:4px 8px}"
    "</style>"
)


def _system(system: str | None) -> str:
    return (system or numfmt.DEFAULT_SYSTEM).upper()


def _wrap(kind: str, inner: str) -> str:
    return f'{NOTEBOOK_CSS}<div class="ck-block ck-b-{kind}">{inner}</div>'


def _fmt_input(value: Any) -> str:
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        return f"{value:~P}"
    if isinstance(value, float):
        return f"{value:g}"
    return str(value)


def _md_cell(s: str) -> str:
    return s.replace("|", r"\|").replace("\n", " ")


class _Block:
    """Common display plumbing."""

    kind = "block"

    def html(self, system: str | None = None) -> str:  # pragma: no cover - abstract
        raise NotImplementedError

    def markdown(self, system: str | None = None) -> str:
        return self.html(system)

    def _repr_html_(self) -> str:
        return _wrap(self.kind, self.html())

    def _repr_markdown_(self) -> str:
        return self.markdown()


@dataclass(frozen=True)
class Header(_Block):
    """Title block: project data, design standard, versions and every input with its unit.

    ``inputs``: {name: value} where value is a string such as "35 ft", a pint quantity, a number, or a
    (value, description) pair. ``date`` defaults to today (ISO). ``version`` defaults to calckit's.
    """

    project: str = ""
    job: str = ""
    member: str = ""
    title: str = ""
    designer: str = ""
    checker: str = ""
    date: str = ""
    revision: str = ""
    standard: str = ""
    inputs: Mapping[str, Any] = field(default_factory=dict)
    version: str = ""
    system: str | None = None

    kind = "header"

    def fields(self) -> list[tuple[str, str]]:
        from .. import __version__

        return [
            ("Project", self.project), ("Job no.", self.job), ("Member", self.member),
            ("Calculation", self.title), ("Designed by", self.designer), ("Checked by", self.checker),
            ("Date", self.date or _dt.date.today().isoformat()), ("Revision", self.revision),
            ("Design standard", self.standard), ("Display units", _system(self.system)),
            ("calckit version", self.version or __version__),
        ]

    def input_rows(self) -> list[tuple[str, str, str]]:
        rows = []
        for k, v in self.inputs.items():
            desc = ""
            if isinstance(v, tuple) and len(v) == 2 and isinstance(v[1], str):
                v, desc = v
            rows.append((str(k), _fmt_input(v), desc))
        return rows

    def html(self, system: str | None = None) -> str:
        f = self.fields()
        title = H.esc(self.title or "Calculation")
        L_ = H._L
        cells = "".join(f"<tr><th{L_}>{H.esc(k)}</th><td{L_}>{H.esc(v)}</td></tr>" for k, v in f)
        out = f'<h1 class="ck-title">{title}</h1><table class="ck-fields"><tbody>{cells}</tbody></table>'
        rows = self.input_rows()
        if rows:
            body = "".join(f"<tr><td{L_}>{H.esc(n)}</td><td{L_}>{H.esc(v)}</td><td{L_}>{H.esc(d)}</td></tr>"
                           for n, v, d in rows)
            out += (f'<h2 class="ck-h">Inputs</h2><table class="ck-inputs"><thead><tr><th{L_}>Input</th>'
                    f'<th{L_}>Value</th><th{L_}>Description</th></tr></thead><tbody>{body}</tbody></table>')
        return out

    def markdown(self, system: str | None = None) -> str:
        out = [f"# {self.title or 'Calculation'}", "", "| | |", "|---|---|"]
        out += [f"| {k} | {_md_cell(v)} |" for k, v in self.fields()]
        rows = self.input_rows()
        if rows:
            out += ["", "**Inputs**", "", "| Input | Value | Description |", "|---|---|---|"]
            out += [f"| {_md_cell(n)} | {_md_cell(v)} | {_md_cell(d)} |" for n, v, d in rows]
        return "\n".join(out)

    def to_dict(self) -> dict[str, Any]:
        d = {k: v for k, v in self.fields()}
        d["Inputs"] = {n: v for n, v, _ in self.input_rows()}
        return d


@dataclass(frozen=True)
class Caution(_Block):
    """The caution block every calc sheet carries (design aid; review and seal; codes govern)."""

    text: str = CAUTION_TEXT
    kind = "caution"

    def html(self, system: str | None = None) -> str:
        return (f'<div class="ck-caution" style="border:2px solid #000;padding:4px 8px">'
                f'<strong>Caution.</strong> {H.esc(self.text)}</div>')

    def markdown(self, system: str | None = None) -> str:
        return f"> **Caution.** {self.text}"


def _expand(records) -> list:
    if isinstance(records, (Step, Decision, Check)):
        records = [records]
    out = []
    for r in records:
        if isinstance(r, Check):
            out.extend(s for s in r.steps if not any(s is o for o in out))
            out.append(r)
        else:
            out.append(r)
    return out


@dataclass(frozen=True)
class Section(_Block):
    """A titled run of steps: each row shows formula, substituted numbers, result and reference.

    ``records``: Steps, Decisions and Checks (a Check brings its own steps, then its check row).
    ``number``: prefix for row numbers ("3." gives 3.1, 3.2, ...).
    """

    title: str
    records: Sequence[Any] = ()
    intro: str = ""
    number: str = ""
    system: str | None = None

    kind = "section"

    def rows(self) -> list:
        return _expand(self.records)

    def html(self, system: str | None = None) -> str:
        s = _system(system or self.system)
        head = (f'<h2 class="ck-h">{H.esc(self.number + " " if self.number else "")}{H.esc(self.title)}</h2>'
                if self.title else "")
        intro = H.text_html(self.intro) if self.intro else ""
        pre = self.number if self.number.endswith(".") or not self.number else self.number + "."
        return head + intro + H.records_table(self.rows(), s, pre)

    def markdown(self, system: str | None = None) -> str:
        s = _system(system or self.system)
        out = [f"## {self.title}", ""] if self.title else []
        if self.intro:
            out += [self.intro, ""]
        out += ["| # | Calculation | Reference |", "|---|---|---|"]
        for i, r in enumerate(self.rows(), 1):
            if isinstance(r, Step):
                m = f"${L.step_latex(r, s)}$"
                ref = r.reference
            elif isinstance(r, Decision):
                dl = L.decision_latex(r, s)
                m = (f"${dl}$, so " if dl else "") + (r.conclusion or "")
                ref = r.reference
            else:
                m = f"**{r.name}**: ${L.check_latex(r, s)}$, ratio {L.ratio_text(r.ratio)} **{r.status}**"
                ref = r.reference
            out.append(f"| {i} | {_md_cell(m)} | {_md_cell(ref)} |")
        return "\n".join(out)


@dataclass(frozen=True)
class Summary(_Block):
    """Table of all checks (limit state, demand, capacity, ratio, clause, status), governing one marked.

    Displaying it also writes the results payload (mime type ``RESULTS_MIME``) built from the checks,
    the optional ``header`` and extra ``steps`` (e.g. deflections reported without a limit).
    """

    checks: Sequence[Check]
    title: str = "Summary of checks"
    header: Header | None = None
    steps: Sequence[Step] = ()
    system: str | None = None

    kind = "summary"

    def overall(self) -> tuple[bool, str]:
        from .records import NOT_OK, OK

        ok = all(c.passed for c in self.checks)
        return ok, OK if ok else NOT_OK

    def html(self, system: str | None = None) -> str:
        s = _system(system or self.system)
        ok, status = self.overall()
        gi = H.governing_index(self.checks)
        line = ""
        if gi is not None:
            g = self.checks[gi]
            line = (f'<p class="ck-overall">Overall: {H.status_html(ok, status)}; governing: '
                    f"{H.esc(g.name)}, ratio {H.esc(L.ratio_text(g.ratio))}.</p>")
        return f'<h2 class="ck-h">{H.esc(self.title)}</h2>' + H.summary_table(self.checks, s) + line

    def markdown(self, system: str | None = None) -> str:
        s = _system(system or self.system)
        gi = H.governing_index(self.checks)
        out = [f"## {self.title}", "", "| Limit state | Demand | Capacity | Ratio | Clause | Status |",
               "|---|---|---|---|---|---|"]
        for i, c in enumerate(self.checks):
            d, u = L.result_number(c.demand, c.dim, s, style="text")
            k, _ = L.result_number(c.capacity, c.dim, s, style="text")
            ut = numfmt.unit_text(u)
            name = c.name + (" (governs)" if i == gi else "")
            out.append(f"| {_md_cell(name)} | {d} {ut} | {k} {ut} | {L.ratio_text(c.ratio)} | "
                       f"{_md_cell(c.reference)} | {c.status} |")
        return "\n".join(out)

    def payload(self) -> dict:
        from .payload import results_payload

        return results_payload(self.checks, header=self.header, steps=self.steps,
                               system=_system(self.system))

    def _repr_mimebundle_(self, include=None, exclude=None):
        from .payload import RESULTS_MIME

        return {"text/html": self._repr_html_(), "text/markdown": self.markdown(),
                "text/plain": self._plain(), RESULTS_MIME: self.payload()}

    def _plain(self) -> str:
        ok, status = self.overall()
        return f"{self.title}: {len(self.checks)} checks, overall {status}"


@dataclass(frozen=True)
class Figure(_Block):
    """A figure embedded as base64 PNG: a matplotlib Figure, PNG bytes, or a path to a PNG file."""

    image: Any
    caption: str = ""
    width: str = "100%"
    dpi: int = 150

    kind = "figure"

    def png(self) -> bytes:
        img = self.image
        if isinstance(img, (bytes, bytearray)):
            return bytes(img)
        if isinstance(img, str):
            with open(img, "rb") as fh:
                return fh.read()
        if hasattr(img, "savefig"):
            buf = io.BytesIO()
            img.savefig(buf, format="png", dpi=self.dpi, bbox_inches="tight", facecolor="white")
            return buf.getvalue()
        raise TypeError(f"image: got {type(img).__name__}; expected a matplotlib Figure, PNG bytes or a path")

    def html(self, system: str | None = None) -> str:
        b64 = base64.b64encode(self.png()).decode("ascii")
        cap = f"<figcaption>{H.esc(self.caption)}</figcaption>" if self.caption else ""
        return (f'<figure class="ck-figure"><img alt="{H.esc(self.caption or "figure")}" '
                f'style="max-width:{H.esc(self.width)}" src="data:image/png;base64,{b64}">{cap}</figure>')


@dataclass(frozen=True)
class Text(_Block):
    """Free text; ``$...$`` marks inline math; blank lines separate paragraphs."""

    text: str
    title: str = ""
    kind = "text"

    def html(self, system: str | None = None) -> str:
        head = f'<h2 class="ck-h">{H.esc(self.title)}</h2>' if self.title else ""
        return head + H.text_html(self.text)

    def markdown(self, system: str | None = None) -> str:
        return (f"## {self.title}\n\n" if self.title else "") + self.text


@dataclass(frozen=True)
class Table(_Block):
    """A free table: ``columns`` (headings) and ``rows`` (cells as text; ``$...$`` marks math)."""

    columns: Sequence[str]
    rows: Sequence[Sequence[Any]]
    caption: str = ""
    kind = "table"

    def _cell(self, v) -> str:
        return H.text_html(str(v))[3:-4] if str(v).strip() else ""

    def html(self, system: str | None = None) -> str:
        cap = f"<caption>{H.esc(self.caption)}</caption>" if self.caption else ""
        head = "".join(f"<th>{self._cell(c)}</th>" for c in self.columns)
        body = "".join("<tr>" + "".join(f"<td>{self._cell(v)}</td>" for v in r) + "</tr>" for r in self.rows)
        return f'<table class="ck-table">{cap}<thead><tr>{head}</tr></thead><tbody>{body}</tbody></table>'

    def markdown(self, system: str | None = None) -> str:
        out = [("**" + self.caption + "**\n") if self.caption else "",
               "| " + " | ".join(_md_cell(str(c)) for c in self.columns) + " |",
               "|" + "---|" * len(self.columns)]
        out += ["| " + " | ".join(_md_cell(str(v)) for v in r) + " |" for r in self.rows]
        return "\n".join(out)


@dataclass
class Sheet:
    """A whole calc sheet: blocks in order, one display system. ``sheet.add(block)`` appends.

    ``html()`` gives the fragment (TeX math); ``standalone_html()`` a complete offline page with MathML
    (the same page the archive export makes for a notebook); ``payload()`` the results payload.
    """

    blocks: list = field(default_factory=list)
    system: str | None = None

    def add(self, *blocks) -> "Sheet":
        self.blocks.extend(blocks)
        return self

    def html(self) -> str:
        s = _system(self.system)
        return "".join(f'<div class="ck-block ck-b-{b.kind}">{b.html(s)}</div>' for b in self.blocks)

    def _repr_html_(self) -> str:
        return NOTEBOOK_CSS + self.html()

    def checks(self) -> list[Check]:
        out = []
        for b in self.blocks:
            if isinstance(b, Summary):
                out.extend(b.checks)
        return out

    def payload(self) -> dict:
        from .payload import results_payload

        header = next((b for b in self.blocks if isinstance(b, Header)), None)
        return results_payload(self.checks(), header=header, system=_system(self.system))

    def standalone_html(self, title: str = "") -> str:
        from .export import page

        header = next((b for b in self.blocks if isinstance(b, Header)), None)
        return page(self.html(), title or (header.title if header else "") or "Calculation")


def show(*items, system: str | None = None) -> None:
    """Display records or blocks in a notebook (records go into an untitled Section)."""
    from IPython.display import display

    recs = [x for x in items if isinstance(x, (Step, Decision, Check))]
    if recs:
        display(Section("", recs, system=system))
    for x in items:
        if not isinstance(x, (Step, Decision, Check)):
            display(x)
