"""HTML fragments of records (tables with TeX math) for JupyterLab and the archive export.

Math is written as TeX between ``\\(`` ``\\)`` (inline) and ``\\[`` ``\\]`` (display), HTML-escaped.
JupyterLab typesets it with its bundled MathJax; ``calckit.render.export`` turns it into MathML for the
archived HTML. Markup uses ``ck-`` classes only; the look is set by ``sheet.css``.

A step wider than the calculation column is set as aligned rows (symbolic form, substituted form
broken by :mod:`calckit.render.texbreak`, result), ``=`` under ``=``; the result cell holds ``lhs =``
and the value as two pieces that wrap apart. Column widths: ``FIT_EM`` / ``RESULT_EM`` below and
``sheet.css``.
"""
from __future__ import annotations

import html as _html
import re

from . import latex as L
from . import texbreak as TB
from . import texparse as TP
from .records import Check, Decision, Step

__all__ = ["esc", "imath", "dmath", "step_rows", "decision_rows", "check_rows", "records_table",
           "summary_table", "status_html", "text_html", "visible_len"]

_FIT = 56           # (kept for callers of visible_len) character widths of the calculation column


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


# Widths of the step table's columns in em of the math font (10.5 pt) on A4 portrait with the margins
# of sheet.css (text width 186 mm = 527 pt): calculation 62 % less the number column (30 pt) and the
# padding (8 pt) = 289 pt = 27.5 em; result 23 % less padding = 113 pt = 10.8 em; a decision row spans
# both. The margins (2 to 3 %) cover the error of the width estimate (texparse.py: -2 % / +7 %).
FIT_EM = 27.0
RESULT_EM = 10.5
WIDE_EM = FIT_EM + RESULT_EM + 0.7
_INDENT = 1.0          # em per level of a continuation row
_REL_EM = TP.W_REL

_MATH_EM = 1.05       # math font size / text font size (sheet.css): padding is set in text em


def _pct(scale: float) -> str:
    return "" if scale >= 0.999 else f"font-size:{int(round(scale * 100))}%"


def _row(tex: str, pad_em: float, scale: float, first: bool) -> str:
    """One row of a broken formula: inline math in display style, left-aligned, indented by
    ``pad_em`` (em of the math font). Inline math keeps rows left-aligned in JupyterLab too."""
    style = f' style="padding-left:{pad_em * _MATH_EM:.2f}em"' if pad_em > 0 else ""
    cls = "ck-eq ck-row" + ("" if first else " ck-cont") + (" ck-long" if scale < 0.999 else "")
    if tex.startswith(("+", "-", r"\times")):
        tex = "{} " + tex        # an empty group first: the operator keeps its binary spacing
    math = imath(r"\displaystyle " + tex)
    if scale < 0.999:
        math = f'<span style="{_pct(scale)}">{math}</span>'
    return f'<div class="{cls}"{style}>{math}</div>'


def _eq(tex: str, avail: float = FIT_EM) -> str:
    """One formula in the column: on one line when it fits, else broken into indented rows."""
    tex = TP.tidy(tex)
    rows = TB.break_tex(tex, avail, step=_INDENT, rel_room=avail - _INDENT - _REL_EM)
    if len(rows) == 1 and rows[0].scale >= 0.999:
        return f'<div class="ck-eq">{dmath(tex)}</div>'
    out = []
    for i, r in enumerate(rows):
        body = (r.rel + " " + r.tex) if r.rel else r.tex
        pad = 0.0 if i == 0 else (_INDENT if r.rel else r.indent)
        out.append(_row(body, pad, r.scale, i == 0))
    return "".join(out)


def _aligned(lhs: str, groups: list) -> str:
    """Rows ``lhs = ...`` aligned on the relation (``=`` under ``=``; continuation rows indented).

    ``groups``: lists of :class:`texbreak.Line` (the symbolic form; the substituted form and the
    result); each group opens with its own ``=``. Alignment uses the estimated width of ``lhs``
    (texbreak.tex_width, within a few per cent of the drawn width): a table with baseline-aligned
    cells would be exact on screen, but Chromium's print layout drops the baseline alignment of
    MathML in table cells.
    """
    lw = TP.tex_width(lhs)
    out = []
    first = True
    for rows in groups:
        for j, r in enumerate(rows):
            rel = "=" if j == 0 else r.rel
            if first:
                tex, pad = f"{lhs} = {r.tex}", 0.0
            elif rel:
                tex, pad = f"{rel} {r.tex}", lw
            else:
                tex, pad = r.tex, lw + _REL_EM + r.indent
            out.append(_row(tex, pad, r.scale, first))
            first = False
    return "".join(out)


def step_math(step: Step, system: str) -> str:
    """The math of one step: on one line when it fits the column, else aligned rows: the symbolic
    form, then the substituted form (broken where needed), then the result."""
    symbolic, sub, result = L.step_forms(step, system)
    lhs = step.symbol_latex or step.symbol
    lhs_t, w = TP.tidy_width(lhs)
    parts = [lhs_t]
    has_sym = bool(symbolic) and symbolic != lhs
    if has_sym:
        sym_t, ws = TP.tidy_width(symbolic)
        parts.append(sym_t)
        w += ws + _REL_EM
    if sub:
        sub_t, ws = TP.tidy_width(sub)
        parts.append(sub_t)
        w += ws + _REL_EM
    res_t, ws = TP.tidy_width(result)
    parts.append(res_t)
    w += ws + _REL_EM
    if w <= FIT_EM:
        return f'<div class="ck-eq">{dmath(" = ".join(parts))}</div>'
    body = FIT_EM - TP.tex_width(lhs_t) - _REL_EM
    if body < FIT_EM / 2:           # a very long left-hand side: plain rows
        return _eq(" = ".join(parts))
    groups = []
    if has_sym:
        groups.append(TB.break_tex(sym_t, body, step=_INDENT))
    chain = f"{sub_t} = {res_t}" if sub else res_t
    groups.append(TB.break_tex(chain, body, step=_INDENT))
    return _aligned(lhs_t, groups)


def _result_cell(lhs: str, res: str) -> str:
    """``lhs =`` and the value as two pieces that wrap apart in a narrow column (value set smaller
    only when it alone is wider than the column)."""
    w = TP.tex_width(res, display=False)
    if w > RESULT_EM:
        style = f' style="white-space:nowrap;font-size:{max(int(TB.MIN_SCALE * 100), int(100 * RESULT_EM / w))}%"'
    else:
        style = ' style="white-space:nowrap"'
    return (f'<span class="ck-rl" style="white-space:nowrap">{imath(lhs + " ={}")}</span><wbr>'
            f'<span class="ck-rv"{style}>{imath(res)}</span>')


def step_rows(step: Step, system: str, number: str = "") -> str:
    label = f'<div class="ck-label">{esc(step.label)}</div>' if step.label else ""
    res = L.value_latex(step.result, step.dim, system, sig=step.sig, decimals=step.decimals)
    return (f'<tr class="ck-step"><td class="ck-no">{esc(number)}</td>'
            f'<td class="ck-calc"{_L}>{label}{step_math(step, system)}</td>'
            f'<td class="ck-res"{_L}>{_result_cell(step.symbol_latex or step.symbol, res)}</td>'
            f'<td class="ck-ref"{_L}>{_ref_cell(step.reference, step.note)}</td></tr>')


def decision_rows(dec: Decision, system: str, number: str = "") -> str:
    math = L.decision_latex(dec, system)
    body = _eq(math, WIDE_EM) if math else ""
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
