"""Width estimate and line breaking of TeX formulas for the calculation column of a calc sheet.

MathML Core (the archive) and JupyterLab's MathJax do not break long formulas, so the sheet breaks them
itself, the way a hand calculation does (common practice of mathematical typesetting, e.g. the rules
for displayed formulas in the TeXbook, ch. 19: break after a relation or before a binary operator,
preferably outside parentheses; a product broken across lines continues with an explicit times sign):

* preferred break points, best first: a relation (``=``, ``\\le`` ...) at the top level; ``+`` / ``-``
  and commas at the top level; the same inside one pair of parentheses, then two, ...; between the
  factors of a product (the continuation line starts with ``\\times``);
* a parenthesised group too wide for a line is opened: its delimiters become fixed-size
  (``\\Bigl(`` ... ``\\Bigr)``) so that each line is a complete formula, and the lines inside it are
  indented by depth;
* a fraction whose numerator is a product and too wide keeps its leading factors over the
  denominator and moves the others after it (``\\frac{a b}{c} d`` is ``\\frac{a b d}{c}``);
* a square root too wide is written as a power (``\\bigl( x \\bigr)^{1/2}``) and opened;
* a fraction that is too wide only because of its denominator (or a sum over a sum) is written with a
  solidus, ``\\bigl( a \\bigr) / \\bigl( b \\bigr)``, when even scaling to ``MIN_SCALE`` would not fit;
* only a piece that cannot be broken (a long number with its unit, a short fraction with a wide
  denominator) is set smaller, never below ``MIN_SCALE`` of the math size.

Every rewrite is an identity, so the numbers shown are the numbers of the one-line form (a test
evaluates both). Widths come from :mod:`calckit.render.texparse` (em of the math font).
"""
from __future__ import annotations

import functools
import math
from dataclasses import dataclass

from .texparse import (FLAT, W_BIN, W_FRAC_PAD, W_PAREN, _ZERO, Node, _scripts_tex, _scripts_width, _tidy,
                       node_width, parse, seq_height, seq_width, tex_width, tidy)

__all__ = ["break_tex", "Line", "MIN_SCALE", "tex_width", "tidy", "clear_caches"]

MIN_SCALE = 0.8          # smallest size a piece of a formula is set at (80 % of the math size)


# ------------------------------------------------------------------------------------------ breaking
@dataclass(frozen=True)
class Line:
    """One row of a broken formula: ``rel`` (the relation starting the row, or ""), ``tex`` (the rest),
    ``indent`` (em), ``scale`` (1.0, or smaller for a piece that could not be broken) and ``width``."""

    rel: str
    tex: str
    indent: float = 0.0
    scale: float = 1.0
    width: float = 0.0


@dataclass
class _Tok:
    tex: str
    w: float
    brk: int | None = None       # priority of a break before this token (lower is better)
    depth: int = 0
    node: Node | None = None     # expandable node behind this token
    times: bool = False          # a break here is inside a product: continue with \times
    rel: bool = False            # the token is a top-level relation


_SIZES = ((1.6, r"\bigl", r"\bigr"), (1.9, r"\Bigl", r"\Bigr"), (2.7, r"\biggl", r"\biggr"),
          (99.0, r"\Biggl", r"\Biggr"))


def _delims(node: Node) -> tuple[str, str]:
    """Fixed-size delimiters for a group opened across lines (sized by its content's height)."""
    h = seq_height(node.kids)
    for lim, l_, r_ in _SIZES:
        if h <= lim:
            break
    d_l = node.left.replace(r"\left", "") or "("
    d_r = node.right.replace(r"\right", "") or ")"
    if h <= FLAT or node.plain:
        return (d_l if d_l != "." else ""), (d_r if d_r != "." else "")
    return (f"{l_}{d_l}" if d_l != "." else ""), (f"{r_}{d_r}" if d_r != "." else "")


def _is_product(nodes) -> bool:
    return not any(n.kind in ("bin", "rel", "punct") and not (i == 0 and n.tex == "-")
                   for i, n in enumerate(nodes))


def _factor_ok(prev: Node, cur: Node) -> bool:
    """A product may break between prev and cur (both real factors; not after a function name)."""
    if prev.kind in ("op", "space", "bin", "rel", "punct") or cur.kind in ("space", "bin", "rel", "punct"):
        return False
    if prev.kind == "ord" and prev.sup is None and prev.sub is None and not prev.tex[:1].isdigit() \
            and cur.kind == "ord":
        return False      # keep runs of symbols together
    return True


class _Breaker:
    def __init__(self, avail: float, first: float, step: float, rel_room: float):
        self.avail, self.first, self.step, self.rel_room = avail, first, step, rel_room
        self.expand: set[int] = set()
        self.rewritten: dict[int, list] = {}

    # stream of tokens --------------------------------------------------------------------------
    def stream(self, nodes, depth: int, out: list) -> None:
        prev = None
        for i, n in enumerate(nodes):
            unary = n.kind == "bin" and (prev is None or prev.kind in ("bin", "rel", "punct", "op"))
            brk, times, rel = None, False, False
            if prev is not None:       # priority: depth first, then relation, comma, + / -, product
                if n.kind == "rel":
                    brk, rel = 4 * depth, depth == 0
                elif prev.kind == "punct":
                    brk = 4 * depth + 1
                elif n.kind == "bin" and not unary and n.tex in ("+", "-", r"\pm", r"\mp", "/"):
                    brk = 4 * depth + 2
                elif _factor_ok(prev, n):
                    brk, times = 4 * depth + 3, True
            start = len(out)
            self.node_tokens(n, depth, out, unary)
            if start < len(out):
                t = out[start]
                t.brk, t.times, t.rel = brk, times, rel
                t.depth = depth
            prev = n

    def node_tokens(self, n: Node, depth: int, out: list, unary: bool = False) -> None:
        nid = id(n)
        if nid in self.rewritten:
            self.stream(self.rewritten[nid], depth, out)
            return
        if nid in self.expand and n.kind == "group":
            lo, ro = _delims(n)
            head = _Tok(lo, W_PAREN * 1.3 if lo else 0.0, depth=depth)
            out.append(head)
            inner: list = []
            self.stream(n.kids, depth + 1, inner)
            if inner:
                out.extend(inner)
            sc = _scripts_tex(n)
            # braces: a sized delimiter carrying a script is drawn at normal size in Chromium's MathML
            tail = ("{" + ro + "}" + sc) if (sc and ro.startswith("\\")) else (ro + sc)
            out.append(_Tok(tail, W_PAREN * 1.3 + _scripts_width(n, 1.0), depth=depth + 1))
            return
        if n.kind == "space" and n.tex in _ZERO:
            return
        out.append(_Tok(n.to_tex(), node_width(n, 1.0, True, first=unary), depth=depth, node=n))

    # rewrites ------------------------------------------------------------------------------------
    def try_expand(self, n: Node, room: float) -> bool:
        """Make ``n`` breakable (open a group, split a fraction, rewrite a root); False if it cannot be."""
        nid = id(n)
        if nid in self.expand or nid in self.rewritten:
            return False
        if n.kind == "group" and not (n.plain and not any(k.kind in ("group", "frac", "sqrt") for k in n.kids)):
            if len(n.kids) <= 1 and not any(k.kind in ("group", "frac", "sqrt") for k in n.kids):
                return False
            self.expand.add(nid)
            return True
        if n.kind == "frac":
            return self._split_frac(n, room)
        if n.kind == "sqrt" and n.index is None and n.sup is None and n.sub is None:
            g = Node("group", kids=n.kids, left=r"\left(", right=r"\right)", sup=[Node("ord", "1/2")])
            self.rewritten[nid] = [g]
            self.expand.add(id(g))
            return True
        if n.kind == "brace" and n.sup is None and n.sub is None:
            self.rewritten[nid] = n.kids
            return True
        return False

    def _split_frac(self, n: Node, room: float) -> bool:
        den_w = seq_width(n.den, 1.0, False) + W_FRAC_PAD
        num = n.num
        if n.sup is None and n.sub is None and _is_product(num) and den_w <= room:
            facs = [k for k in num if k.kind != "space" or k.tex not in _ZERO]
            lead = []
            if facs and facs[0].kind == "bin":      # unary minus stays with the first factor
                lead, facs = [facs[0]], facs[1:]
            if len(facs) >= 2:
                best = 0
                for k in range(1, len(facs)):
                    w = max(seq_width(lead + facs[:k], 1.0, False), den_w - W_FRAC_PAD) + W_FRAC_PAD
                    if w <= room:
                        best = k
                if best == 0:
                    head = Node("frac", num=lead + [Node("ord", "1")], den=n.den)
                    rest = facs
                else:
                    head = Node("frac", num=lead + facs[:best], den=n.den)
                    rest = facs[best:]
                self.rewritten[id(n)] = [head] + rest
                return True
        # solidus form only when scaling to MIN_SCALE would not make it fit
        if node_width(n) * MIN_SCALE <= room:
            return False
        gn = Node("group", kids=num, left=r"\left(", right=r"\right)")
        gd = Node("group", kids=n.den, left=r"\left(", right=r"\right)", sup=n.sup, sub=n.sub)
        _tidy([gn, gd])
        self.rewritten[id(n)] = [gn, Node("bin", "/"), gd]
        return True

    # line filling ---------------------------------------------------------------------------------
    def room(self, line_no: int, tok: _Tok) -> float:
        """Room for a row (including its leading relation, if any)."""
        if line_no == 0:
            return self.first
        if tok.rel:
            return self.rel_room + tok.w
        return self.avail - self.indent_of(tok) - (W_BIN if tok.times else 0.0)

    def indent_of(self, tok: _Tok) -> float:
        if tok.rel:
            return 0.0
        return self.step * (1 + 0.5 * tok.depth)

    def fill(self, toks: list) -> list[list]:
        lines: list[list] = []
        cur: list = []
        width = 0.0
        for t in toks:
            cur.append(t)
            width += t.w
            while len(cur) > 1:
                room = self.room(len(lines), cur[0])
                if width <= room:
                    break
                cands = [(i, cur[i]) for i in range(1, len(cur)) if cur[i].brk is not None]
                if not cands:
                    break
                acc, pos = 0.0, {}
                for i, c in enumerate(cur):
                    pos[i] = acc
                    acc += c.w
                fitting = [(i, c) for i, c in cands if pos[i] <= room]
                good = [(i, c) for i, c in fitting if pos[i] >= 0.35 * room]
                pool = good or fitting or cands[:1]
                best = min(c.brk for _, c in pool)
                i = max(j for j, c in pool if c.brk == best)
                lines.append(cur[:i])
                cur = cur[i:]
                width = sum(c.w for c in cur)
        if cur:
            lines.append(cur)
        return lines

    def run(self, nodes) -> list[list]:
        for _ in range(60):
            toks: list = []
            self.stream(nodes, 0, toks)
            lines = self.fill(toks)
            changed = False
            for ln, line in enumerate(lines):
                room = self.room(ln, line[0])
                for t in line:
                    if t.node is not None and t.w > room * 0.999 and sum(c.w for c in line) > room:
                        if self.try_expand(t.node, room if len(line) == 1 else room):
                            changed = True
                            break
                if changed:
                    break
            if not changed:
                # a line that is too wide although its pieces fit: expand the widest expandable piece
                for ln, line in enumerate(lines):
                    room = self.room(ln, line[0])
                    if sum(c.w for c in line) > room:
                        cand = sorted((t for t in line if t.node is not None), key=lambda t: -t.w)
                        for t in cand:
                            if self.try_expand(t.node, room):
                                changed = True
                                break
                    if changed:
                        break
            if not changed:
                return lines
        return lines


def break_tex(tex: str, avail: float, first: float | None = None, step: float = 1.0,
              rel_room: float | None = None) -> list[Line]:
    """Break a formula into rows no wider than ``avail`` em (``first``: room on the first row;
    ``rel_room``: room after the relation of a row that starts with one, default ``avail``;
    ``step``: indent per level of a continuation row).

    Rows after the first start with the relation or operator at which the formula was broken; a
    product broken across rows continues with ``\\times``. Returns :class:`Line` rows; a row holding a
    piece that cannot be broken gets ``scale`` < 1 (not below ``MIN_SCALE``). Results are cached.
    """
    return list(_break(tex, avail, first, step, rel_room))


@functools.lru_cache(maxsize=2048)
def _break(tex: str, avail: float, first: float | None = None, step: float = 1.0,
           rel_room: float | None = None) -> tuple:
    """Break a formula into rows no wider than ``avail`` em (``first``: room on the first row;
    ``rel_room``: room after the relation of a row that starts with one, default ``avail``;
    ``step``: indent per level of a continuation row).

    Rows after the first start with the relation or operator at which the formula was broken; a
    product broken across rows continues with ``\\times``. Returns :class:`Line` rows; a row holding a
    piece that cannot be broken gets ``scale`` < 1 (not below ``MIN_SCALE``).
    """
    nodes = parse(tex)
    first = avail if first is None else first
    if seq_width(nodes) <= first:
        return (Line("", tex, 0.0, 1.0, seq_width(nodes)),)
    br = _Breaker(avail, first, step, avail if rel_room is None else rel_room)
    rows = br.run(nodes)
    out: list[Line] = []
    for ln, row in enumerate(rows):
        rel = ""
        toks = list(row)
        if ln > 0 and toks[0].rel:
            rel = toks[0].tex
            toks = toks[1:]
        prefix = ""
        if ln > 0 and row[0].times and not rel:
            prefix = r"\times "
        body = prefix
        for t in toks:
            if t.tex:
                body += t.tex if (not body or body.endswith(" ")) else " " + t.tex
        w = sum(t.w for t in toks) + (W_BIN if prefix else 0.0)
        indent = 0.0 if (ln == 0 or rel) else br.indent_of(row[0])
        room = first if ln == 0 else (br.rel_room if rel else avail - indent)
        scale = 1.0 if w <= room else max(MIN_SCALE, math.floor(1000 * room / w) / 1000)
        out.append(Line(rel, body, indent, scale, w))
    return tuple(out)


def clear_caches() -> None:
    """Forget cached widths, tidied forms and broken rows (for benchmarks measuring a cold render)."""
    from . import texparse

    _break.cache_clear()
    texparse.tidy.cache_clear()
    texparse.tidy_width.cache_clear()
    texparse.tex_width.cache_clear()
