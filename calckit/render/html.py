"""HTML fragments of records (tables with TeX math) for JupyterLab and the archive export.

Math is written as TeX between ``\\(`` ``\\)`` (inline) and ``\\[`` ``\\]`` (display), HTML-escaped.
JupyterLab typesets it with its bundled MathJax; ``calckit.render.export`` turns it into MathML for the
archived HTML. Markup uses ``ck-`` classes only; the look is set by ``sheet.css``.
"""
from __future__ import annotations

import html as _html
import re

from . import latex as L
from .records import Check, Decision, Step

__all__ = ["esc", "imath", "dmath", "step_rows", "decision_rows", "check_rows", "records_table",
           "summary_table", "status_html", "text_html", "visible_len"]

_FIT = 56           # character widths of math that fit the calculation column (A4 portrait)


def esc(text: str) -> str:
    return _html.escape(str(text), quote=True)


def imath(tex: str) -> str:
    """Inline math: ``\\(tex\\)`` (HTML-escaped)."""
    return r"\(" + _html.escape(tex, quote=False) + r"\)"


def dmath(tex: str) -> str:
    """Display math: ``\\[tex\\]`` (HTML-escaped)."""
    return r"\[" + _html.escape(tex, quote=False) + r"\]"


_ZERO = {"left", "right", "displaystyle", "mathrm", "mathit", "mathbf", "boldsymbol", "quad", "qquad"}


def _group(t: str, i: int) -> tuple[str, int]:
    """The brace group (or single token) starting at t[i]; returns (content, next index)."""
    while i < len(t) and t[i] == " ":
        i += 1
    if i >= len(t):
        return "", i
    if t[i] != "{":
        if t[i] == "\\":
            m = re.match(r"\\([A-Za-z]+|.)", t[i:])
            return m.group(0), i + len(m.group(0))
        return t[i], i + 1
    depth, j = 0, i
    while j < len(t):
        if t[j] == "{":
            depth += 1
        elif t[j] == "}":
            depth -= 1
            if depth == 0:
                return t[i + 1:j], j + 1
        j += 1
    return t[i + 1:], len(t)


def visible_len(tex: str) -> float:
    """Rough printed width of a TeX formula in character widths (fractions count their wider part)."""
    n, i = 0.0, 0
    while i < len(tex):
        ch = tex[i]
        if ch == "\\":
            m = re.match(r"\\([A-Za-z]+|.)", tex[i:])
            cmd = m.group(1)
            i += len(m.group(0))
            if cmd == "frac":
                a, i = _group(tex, i)
                b, i = _group(tex, i)
                n += max(visible_len(a), visible_len(b)) + 0.5
            elif cmd in ("text", "mathrm", "operatorname"):
                a, i = _group(tex, i)
                n += len(a) * 0.9
            elif cmd == "sqrt":
                a, i = _group(tex, i)
                n += visible_len(a) + 1
            elif cmd in _ZERO:
                continue
            elif cmd in (" ", ",", ";", "!"):
                n += 0.3
            else:
                n += 1
        elif ch in "^_":
            a, i = _group(tex, i + 1)
            n += 0.6 * visible_len(a)
        elif ch in "{}":
            i += 1
        elif ch == " ":
            i += 1
        elif ch in "=<>+-":
            n += 1.6
            i += 1
        else:
            n += 1
            i += 1
    return n


_L = ' style="text-align:left"'   # JupyterLab right-aligns table cells; its sanitizer keeps this


def status_html(passed: bool, status: str) -> str:
    cls = "ck-ok" if passed else "ck-ng"
    return f'<strong class="ck-status {cls}">{esc(status)}</strong>'


def _ref_cell(ref: str, note: str) -> str:
    out = esc(ref)
    if note:
        out += f'<div class="ck-note">{esc(note)}</div>'
    return out


def text_html(text: str) -> str:
    """Plain text with inline ``$...$`` math and blank-line paragraphs -> HTML."""
    paras = [p.strip() for p in re.split(r"\n\s*\n", str(text)) if p.strip()]
    out = []
    for p in paras:
        pieces = re.split(r"(\$[^$]+\$)", p)
        buf = "".join(imath(x[1:-1]) if x.startswith("$") and x.endswith("$") and len(x) > 1 else esc(x)
                      for x in pieces)
        out.append(f"<p>{buf}</p>")
    return "".join(out)


def step_math(step: Step, system: str) -> str:
    """The math of one step: on one line when short, else symbolic / substituted / result lines."""
    symbolic, sub, result = L.step_forms(step, system)
    lhs = step.symbol_latex or step.symbol
    one = L.step_latex(step, system)
    if visible_len(one) <= _FIT or not (symbolic and sub):
        return _eq(one)
    lines = [f"{lhs} = {symbolic}", f"= {sub}", f"= {result}"]
    if visible_len(lines[1]) + visible_len(lines[2]) <= _FIT:
        lines = [lines[0], f"= {sub} {lines[2]}"]
    return "".join(_eq(x) for x in lines)


def _eq(tex: str) -> str:
    """One displayed formula; a line wider than the column is set smaller (down to 55 %)."""
    w = visible_len(tex)
    if w <= _FIT:
        return f'<div class="ck-eq">{dmath(tex)}</div>'
    pct = max(55, int(100 * _FIT / w))
    return f'<div class="ck-eq ck-long" style="font-size:{pct}%">{dmath(tex)}</div>'


def step_rows(step: Step, system: str, number: str = "") -> str:
    label = f'<div class="ck-label">{esc(step.label)}</div>' if step.label else ""
    res = L.value_latex(step.result, step.dim, system, sig=step.sig, decimals=step.decimals)
    return (f'<tr class="ck-step"><td class="ck-no">{esc(number)}</td>'
            f'<td class="ck-calc"{_L}>{label}{step_math(step, system)}</td>'
            f'<td class="ck-res"{_L}>{imath((step.symbol_latex or step.symbol) + " = " + res)}</td>'
            f'<td class="ck-ref"{_L}>{_ref_cell(step.reference, step.note)}</td></tr>')


def decision_rows(dec: Decision, system: str, number: str = "") -> str:
    math = L.decision_latex(dec, system)
    body = _eq(math) if math else ""
    label = f'<div class="ck-label">{esc(dec.label)}</div>' if dec.label else ""
    concl = dec.conclusion or ("condition holds" if dec.holds else "condition does not hold")
    lead = "so " if math else ""
    body += f'<div class="ck-then">{esc(lead + concl)}</div>'
    return (f'<tr class="ck-decision"><td class="ck-no">{esc(number)}</td>'
            f'<td class="ck-calc" colspan="2"{_L}>{label}{body}</td>'
            f'<td class="ck-ref"{_L}>{_ref_cell(dec.reference, dec.note)}</td></tr>')


def check_rows(chk: Check, system: str, number: str = "") -> str:
    ratio = L.ratio_text(chk.ratio)
    math = L.check_latex(chk, system)
    return (f'<tr class="ck-check"><td class="ck-no">{esc(number)}</td>'
            f'<td class="ck-calc"{_L}><div class="ck-label">{esc(chk.name)}</div>'
            f'{_eq(math)}</td>'
            f'<td class="ck-res"{_L}>ratio {esc(ratio)} {status_html(chk.passed, chk.status)}</td>'
            f'<td class="ck-ref"{_L}>{_ref_cell(chk.reference, chk.note)}</td></tr>')


def record_row(rec, system: str, number: str = "") -> str:
    if isinstance(rec, Step):
        return step_rows(rec, system, number)
    if isinstance(rec, Decision):
        return decision_rows(rec, system, number)
    if isinstance(rec, Check):
        return check_rows(rec, system, number)
    raise TypeError(f"records: got {type(rec).__name__}; expected Step, Decision or Check")


def records_table(records, system: str, prefix: str = "") -> str:
    rows = []
    for i, r in enumerate(records, 1):
        rows.append(record_row(r, system, f"{prefix}{i}"))
    return ('<table class="ck-steps"><colgroup><col class="ck-c-no"><col class="ck-c-calc">'
            '<col class="ck-c-res"><col class="ck-c-ref"></colgroup>'
            f'<thead><tr><th></th><th{_L}>Calculation</th><th{_L}>Result</th><th{_L}>Reference</th></tr></thead>'
            f'<tbody>{"".join(rows)}</tbody></table>')


def governing_index(checks) -> int | None:
    """Index of the check with the highest ratio (the first one on a tie)."""
    best, idx = None, None
    for i, c in enumerate(checks):
        if best is None or c.ratio > best:
            best, idx = c.ratio, i
    return idx


def summary_table(checks, system: str) -> str:
    gov = governing_index(checks)
    rows = []
    for i, c in enumerate(checks):
        dem, unit = L.result_number(c.demand, c.dim, system, style="html")
        cap, _ = L.result_number(c.capacity, c.dim, system, style="html")
        from .numfmt import unit_html
        u = unit_html(unit)
        cls = ' class="ck-gov"' if i == gov else ""
        mark = ' <span class="ck-govmark">governs</span>' if i == gov else ""
        rows.append(f"<tr{cls}><td{_L}>{esc(c.name)}{mark}</td>"
                    f'<td class="ck-num">{dem} {u}</td><td class="ck-num">{cap} {u}</td>'
                    f'<td class="ck-num">{esc(L.ratio_text(c.ratio))}</td><td{_L}>{esc(c.reference)}</td>'
                    f"<td{_L}>{status_html(c.passed, c.status)}</td></tr>")
    return (f'<table class="ck-summary"><thead><tr><th{_L}>Limit state</th><th>Demand</th><th>Capacity</th>'
            f'<th>Ratio</th><th{_L}>Clause</th><th{_L}>Status</th></tr></thead>'
            f'<tbody>{"".join(rows)}</tbody></table>')
