"""A small reader of the TeX that calc sheets print, with width estimates and a tidy pass.

The TeX comes from sympy's LaTeX printer (symbolic forms) and from calckit's substituted forms
(numbers with units in plain parentheses). :func:`parse` turns it into a tree of :class:`Node`
(atoms, groups, fractions, roots, scripts); :func:`join` writes it back (the MathML of the result is
identical to the original's, checked on every formula of the demo calcs); :func:`tex_width` estimates
the printed width in em of the math font; :func:`tidy` writes plain parentheses where a stretchy
fence is not needed and braces a prefix minus with its operand, so that Chromium's MathML draws
both as TeX would.

Widths are built from per-glyph advance widths of Computer Modern / Latin Modern and the MathML Core
operator spacing, and were checked against Chromium's layout of the 768 distinct formulas of the
demo calcs: the estimate is within -2 % / +7 % of the drawn width (median 0 %), see docs/rendering.md.
"""
from __future__ import annotations

import functools
import re
from dataclasses import dataclass, field

__all__ = ["Node", "parse", "join", "tidy", "tidy_width", "tex_width", "seq_width", "seq_height", "node_width", "FLAT"]

_SCRIPT = 0.71           # size of sub/superscripts (MathML Core scriptlevel 1)
FLAT = 1.35              # content lower than this (scripts, accents; no fraction) needs no tall fence

# ------------------------------------------------------------------------------------------ widths (em)
# Glyph advance widths in em: Computer Modern / Latin Modern metrics (cmr10 upright, cmmi10 math italic),
# from memory of the published font metrics, then checked glyph by glyph against Chromium's layout of
# Latin Modern Math (upper-case Greek set from that measurement; see docs/rendering.md).
_UPRIGHT = dict(zip("abcdefghijklmnopqrstuvwxyz",
                    (.500, .556, .444, .556, .444, .306, .500, .556, .278, .306, .528, .278, .833, .556, .500,
                     .556, .528, .392, .394, .389, .556, .528, .722, .528, .528, .444)))
_UPRIGHT.update(zip("ABCDEFGHIJKLMNOPQRSTUVWXYZ",
                    (.750, .708, .722, .764, .681, .653, .785, .750, .361, .514, .778, .625, .917, .750, .778,
                     .681, .778, .736, .556, .722, .750, .750, 1.028, .750, .750, .611)))
_ITALIC = dict(zip("abcdefghijklmnopqrstuvwxyz",
                   (.529, .429, .433, .520, .466, .490, .477, .576, .345, .412, .521, .298, .878, .600, .485,
                    .503, .446, .451, .469, .361, .572, .485, .716, .572, .490, .465)))
_ITALIC.update(zip("ABCDEFGHIJKLMNOPQRSTUVWXYZ",
                   (.750, .759, .715, .828, .738, .643, .786, .831, .440, .555, .849, .681, .970, .803, .763,
                    .642, .791, .759, .613, .584, .683, .583, .944, .828, .581, .683)))
_GREEK_W = {"alpha": .640, "beta": .566, "gamma": .518, "delta": .444, "epsilon": .406, "varepsilon": .466,
            "zeta": .438, "eta": .497, "theta": .469, "vartheta": .592, "iota": .354, "kappa": .576,
            "lambda": .583, "mu": .603, "nu": .494, "xi": .438, "pi": .570, "rho": .517, "sigma": .571,
            "tau": .437, "upsilon": .540, "phi": .596, "varphi": .654, "chi": .626, "psi": .651,
            "omega": .622, "Gamma": .625, "Delta": .833, "Theta": .778, "Lambda": .694, "Xi": .742,
            "Pi": .831, "Sigma": .780, "Upsilon": .584, "Phi": .667, "Psi": .613, "Omega": .772}
W_DIGIT = 0.50
W_DOT = 0.28
W_BIN = 1.22             # binary operator with its spaces (+, -, \times: 0.78 + 2 x 0.222)
W_REL = 1.33             # relation with its spaces (=, <, \le: 0.78 + 2 x 0.278)
W_PAREN = 0.39
W_STRETCH = 0.87         # a \\left( ... \\right) fence stretched around a fraction
W_UNARY = 0.85           # prefix minus
W_COMMA = 0.45           # comma and the thin space after it
W_SPACE = 0.33           # "\ " between number and unit
W_CDOT = 0.61            # {\cdot} between unit names
W_FRAC_PAD = 0.24
W_SQRT = 1.06
W_OPNAME = 0.45          # \max, \min ... (per letter, plus W_OP_SPACE)
W_OP_SPACE = 0.9

_REL = {"=", "<", ">", r"\le", r"\ge", r"\leq", r"\geq", r"\ne", r"\neq", r"\approx", r"\equiv", r"\lt",
        r"\gt", r"\leqslant", r"\geqslant", r"\sim", r"\simeq", r"\propto"}
_BIN = {"+", "-", r"\times", r"\cdot", r"\pm", r"\mp", r"\div", "/"}
_OPNAMES = {r"\max", r"\min", r"\sin", r"\cos", r"\tan", r"\log", r"\ln", r"\exp", r"\sinh", r"\cosh",
            r"\tanh", r"\arcsin", r"\arccos", r"\arctan", r"\operatorname", r"\sup", r"\inf", r"\lim"}
_SPACES = {r"\ ": W_SPACE, r"\,": 0.167, r"\;": 0.278, r"\:": 0.222, r"\!": -0.167, r"\quad": 1.0,
           r"\qquad": 2.0, "~": W_SPACE}
_ZERO = {r"\displaystyle", r"\textstyle", r"\left", r"\right", r"\limits", r"\nolimits"}
_TEXTCMD = {r"\text", r"\mathrm", r"\textrm", r"\mathit", r"\mathbf", r"\textbf", r"\operatorname",
            r"\mathsf", r"\mathtt"}
_ACCENT = {r"\bar", r"\hat", r"\tilde", r"\dot", r"\ddot", r"\vec", r"\overline", r"\widehat",
           r"\widetilde", r"\underline", r"\boldsymbol", r"\mathbf"}
_SIZED = {r"\left", r"\right", r"\bigl", r"\bigr", r"\Bigl", r"\Bigr", r"\biggl", r"\biggr", r"\Biggl",
          r"\Biggr", r"\big", r"\Big", r"\bigg", r"\Bigg"}
# a text command with a flat argument is one token (its spaces matter); other whitespace is dropped
_TEXT_TOK = r"\\(?:text|mathrm|textrm|operatorname|mathit|mathbf|textbf|mathsf|mathtt)\{[^{}]*\}"
_TOKEN = re.compile(_TEXT_TOK + r"|\\[A-Za-z]+|\\.|\d+(?:\.\d+)?|\s+|.", re.S)


# ------------------------------------------------------------------------------------------ the tree
@dataclass
class Node:
    """One piece of a formula. ``kind``: 'ord', 'bin', 'rel', 'punct', 'op', 'space', 'group', 'frac',
    'sqrt', 'brace'. ``tex`` is the source of an atom; composite nodes keep their parts."""

    kind: str
    tex: str = ""
    kids: list = field(default_factory=list)        # group / brace / sqrt content
    num: list = field(default_factory=list)         # frac numerator
    den: list = field(default_factory=list)         # frac denominator
    left: str = ""                                   # group delimiters as written ("\left(", "(")
    right: str = ""
    sup: list | None = None
    sub: list | None = None
    index: list | None = None                        # \sqrt[n]
    plain: bool = False                              # group written with plain ( ) (a substituted value)
    memo: dict = field(default_factory=dict, repr=False, compare=False)   # widths already estimated

    def to_tex(self) -> str:
        if self.kind == "group":
            core = f"{self.left}{join(self.kids)}{self.right}"
        elif self.kind == "brace":
            core = "{" + join(self.kids) + "}"
        elif self.kind == "frac":
            core = rf"\frac{{{join(self.num)}}}{{{join(self.den)}}}"
        elif self.kind == "sqrt":
            idx = f"[{join(self.index)}]" if self.index is not None else ""
            core = rf"\sqrt{idx}{{{join(self.kids)}}}"
        else:
            core = self.tex
        return core + _scripts_tex(self)


def _scripts_tex(n: Node) -> str:
    out = ""
    if n.sub is not None:
        out += "_{" + join(n.sub) + "}"
    if n.sup is not None:
        out += "^{" + join(n.sup) + "}"
    return out


def join(nodes) -> str:
    """TeX of a node list (spaces between nodes are insignificant in math mode)."""
    out: list[str] = []
    prev, p = None, ""
    for n in nodes:
        t = n.to_tex()
        if prev is not None:
            tight = ((prev.kind == "ord" and n.kind == "ord" and len(p) == 1 and p.isalpha() and t[:1].isalnum())
                     or (prev.kind == "bin" and prev.tex == "-" and _unary_at(nodes, len(out) - 1)))
            if p.endswith(" ") or p == r"{\cdot}" or t == r"{\cdot}" or t == "\\ " or n.kind == "punct":
                tight = True
            if p.startswith("\\") and p[-1:].isalpha() and t[:1].isalpha():
                tight = False
            out.append(t if tight else " " + t)
        else:
            out.append(t)
        prev, p = n, t
    return "".join(out)


def _unary_at(nodes, i: int) -> bool:
    return i == 0 or nodes[i - 1].kind in ("bin", "rel", "punct", "op")


class _Parser:
    def __init__(self, tex: str):
        # whitespace is insignificant in math mode except after a control word, where it only ends
        # the word; "\\ " (a space) is its own token
        self.toks = [t for t in _TOKEN.findall(tex) if not t.isspace()]
        self.n = len(self.toks)
        self.i = 0
        # matching plain parentheses (within one brace level), found once: O(n)
        self.match: dict[int, int] = {}
        stack: list[tuple[int, int]] = []
        level = 0
        for k, t in enumerate(self.toks):
            if t == "{":
                level += 1
            elif t == "}":
                level -= 1
            elif t == "(" and (k == 0 or self.toks[k - 1] not in _SIZED):
                stack.append((k, level))
            elif t == ")" and stack and stack[-1][1] == level and (k == 0 or self.toks[k - 1] not in _SIZED):
                self.match[stack.pop()[0]] = k

    def peek(self):
        return self.toks[self.i] if self.i < self.n else None

    def take(self):
        t = self.toks[self.i] if self.i < self.n else None
        self.i += 1
        return t

    def raw_arg(self) -> str:
        """The verbatim content of a brace group (for \\text{...}), or the next token."""
        t = self.take()
        if t != "{":
            return t or ""
        depth, out = 1, []
        while self.i < len(self.toks):
            t = self.toks[self.i]
            self.i += 1
            if t == "{":
                depth += 1
            elif t == "}":
                depth -= 1
                if depth == 0:
                    break
            out.append(t)
        return "".join(out)

    def arg(self) -> list:
        """A macro argument: a brace group's content, or a single token/atom."""
        t = self.peek()
        if t is None:
            return []
        if t == "{":
            self.take()
            return self.seq("}")
        return self.seq(None, single=True)

    def seq(self, until: str | None, single: bool = False, end: int | None = None) -> list:
        out: list[Node] = []
        while True:
            t = self.peek()
            if t is None or (end is not None and self.i >= end):
                return out
            if until is not None and t == until:
                self.take()
                return out
            if until is None and not single and t in ("}", r"\right"):
                return out
            if t in ("^", "_"):
                self.take()
                a = self.arg()
                if not out:
                    out.append(Node("ord", ""))
                tgt = out[-1]
                if t == "^":
                    tgt.sup = a
                else:
                    tgt.sub = a
                continue
            n = self.atom()
            if n is not None:
                out.append(n)
            if single:
                # scripts bind to the single token
                while self.peek() in ("^", "_"):
                    s = self.take()
                    a = self.arg()
                    if s == "^":
                        out[-1].sup = a
                    else:
                        out[-1].sub = a
                return out

    def atom(self) -> Node | None:
        t = self.take()
        if t == "{":
            kids = self.seq("}")
            if len(kids) == 1 and kids[0].kind in ("bin", "rel") and kids[0].tex == r"\cdot":
                return Node("ord", r"{\cdot}")
            return Node("brace", kids=kids)
        if t == r"\left":
            d = self.take() or "."
            if d == "\\":
                d += self.take() or ""
            kids = self.seq(r"\right") if r"\right" in self.toks[self.i:] else self.seq(None)
            r = self.take() if self.i <= len(self.toks) else "."
            return Node("group", kids=kids, left=r"\left" + d, right=r"\right" + (r or "."))
        if t == "(":
            j = self.match.get(self.i - 1)
            if j is None:
                return Node("ord", "(")
            kids = self.seq(None, end=j)
            self.i = j + 1
            return Node("group", kids=kids, left="(", right=")", plain=True)
        if t in (r"\frac", r"\dfrac", r"\tfrac"):
            a = self.arg()
            b = self.arg()
            return Node("frac", num=a, den=b)
        if t == r"\sqrt":
            idx = None
            if self.peek() == "[":
                self.take()
                idx = self.seq("]")
            return Node("sqrt", kids=self.arg(), index=idx)
        if t[:1] == "\\" and "{" in t:          # \text{...} read whole by the tokenizer
            return Node("ord", t)
        if t in _TEXTCMD:
            return Node("ord", f"{t}{{{self.raw_arg()}}}")
        if t in _ACCENT:
            a = self.arg()
            return Node("ord", f"{t}{{{join(a)}}}")
        if t in _REL:
            return Node("rel", t)
        if t in _BIN:
            return Node("bin", t)
        if t == ",":
            return Node("punct", t)
        if t in _OPNAMES:
            return Node("op", t)
        if t in _SPACES:
            return Node("space", t)
        if t in _ZERO:
            return Node("space", t)
        return Node("ord", t)


def parse(tex: str) -> list:
    """Parse TeX (as written by sympy's printer and calckit's substituted forms) into nodes."""
    return _Parser(tex).seq(None)


# ------------------------------------------------------------------------------------------ width
def _text_width(s: str) -> float:
    w = 0.0
    for ch in s:
        if ch.isdigit():
            w += W_DIGIT
        elif ch in _UPRIGHT:
            w += _UPRIGHT[ch]
        elif ch == " ":
            w += 0.33
        else:
            w += 0.3
    return w


def _atom_width(t: str) -> float:
    if not t:
        return 0.0
    if t.startswith((r"\text", r"\mathrm", r"\operatorname", r"\textrm", r"\mathsf", r"\mathtt")):
        inner = t[t.index("{") + 1:-1]
        return _text_width(re.sub(r"\\[A-Za-z]+|[{}]", "", inner))
    if t.startswith(tuple(_ACCENT)) and "{" in t:
        return tex_width(t[t.index("{") + 1:-1])
    if t == r"{\cdot}":
        return W_CDOT
    if t[0].isdigit():
        return sum(W_DOT if c == "." else W_DIGIT for c in t)
    if t.startswith("\\"):
        if t[1:] in _GREEK_W:
            return _GREEK_W[t[1:]]
        if t in (r"\infty",):
            return 1.0
        if t in (r"\circ",):
            return 0.5
        return 0.6
    if t in "()[]|":
        return W_PAREN
    if t == "'":
        return 0.3
    if t in _ITALIC:
        return _ITALIC[t]
    return 0.5


def _scripts_width(n: Node, scale: float) -> float:
    s = max(scale * _SCRIPT, 0.5)
    w = 0.0
    if n.sup is not None:
        w = max(w, seq_width(n.sup, s, False))
    if n.sub is not None:
        w = max(w, seq_width(n.sub, s, False))
    return w + (0.05 * scale if w else 0.0)


def node_width(n: Node, scale: float = 1.0, display: bool = True, first: bool = False) -> float:
    """Estimated width (em of the math font) of one node set at ``scale`` (display or text style)."""
    key = (scale, display, first)
    w = n.memo.get(key)
    if w is None:
        w = n.memo[key] = _node_width(n, scale, display, first)
    return w


def _node_width(n: Node, scale: float, display: bool, first: bool) -> float:
    k = n.kind
    if k == "frac":
        inner = scale if display else max(scale * _SCRIPT, 0.5)
        w = max(seq_width(n.num, inner, False), seq_width(n.den, inner, False)) + W_FRAC_PAD * scale
    elif k == "sqrt":
        w = seq_width(n.kids, scale, display) + W_SQRT * scale
        if n.index is not None:
            w += 0.3 * scale
    elif k == "group":
        pw = W_PAREN if (n.plain or _flat(n)) else W_STRETCH
        if n.left.endswith("."):
            pw = pw / 2
        w = seq_width(n.kids, scale, display) + 2 * pw * scale
    elif k == "brace":
        w = seq_width(n.kids, scale, display)
    elif k == "bin":
        w = (W_UNARY if first else W_BIN) * scale
    elif k == "rel":
        w = W_REL * scale
    elif k == "punct":
        w = W_COMMA * scale
    elif k == "op":
        w = (W_OPNAME * (len(n.tex) - 1) + W_OP_SPACE) * scale
    elif k == "space":
        w = _SPACES.get(n.tex, 0.0) * scale
    else:
        w = _atom_width(n.tex) * scale
    return w + _scripts_width(n, scale)


def seq_width(nodes, scale: float = 1.0, display: bool = True) -> float:
    w, prev = 0.0, None
    for n in nodes:
        unary = n.kind == "bin" and (prev is None or prev.kind in ("bin", "rel", "punct", "op"))
        w += node_width(n, scale, display, first=unary)
        prev = n
    return w


def seq_height(nodes, display: bool = True) -> float:
    """Rough height in lines (1 for a plain row; a fraction adds its parts)."""
    h = 1.0
    for n in nodes:
        if n.kind == "frac":
            f = 1.0 if display else 0.8
            h = max(h, f * (seq_height(n.num, False) + seq_height(n.den, False)))
        elif n.kind in ("group", "brace", "sqrt"):
            h = max(h, seq_height(n.kids, display) + (0.1 if n.kind == "sqrt" else 0.0))
        if n.sup is not None:
            h = max(h, 1.0 + 0.3 * seq_height(n.sup, False))
        if n.kind == "ord" and n.tex.startswith(tuple(_ACCENT)):
            h = max(h, 1.15)
    return h


def _flat(n: Node) -> bool:
    return seq_height(n.kids) <= FLAT


def _tidy(nodes) -> None:
    """In place: plain parentheses around flat content; a prefix minus braced with its operand."""
    i = 0
    while i < len(nodes) - 1:
        n = nodes[i]
        if n.kind == "bin" and n.tex == "-" and _unary_at(nodes, i) and n.sup is None and n.sub is None \
                and nodes[i + 1].kind not in ("bin", "rel", "punct") and len(nodes) > 2:
            # MathML infers the form of <mo> from its place in the row: braces make "-x" a row of its
            # own, so the minus is drawn as a prefix (no space after it), as TeX does
            nodes[i:i + 2] = [Node("brace", tex="neg", kids=[n, nodes[i + 1]])]
        i += 1
    for n in nodes:
        if n.kind == "brace" and n.tex == "neg":
            _tidy_parts(n.kids[1])
            continue
        _tidy_parts(n)


def _tidy_parts(n: Node) -> None:
    for part in (n.kids, n.num, n.den, n.sup, n.sub, n.index):
        if part:
            _tidy(part)
    if n.kind == "group" and not n.plain and n.left in (r"\left(", r"\left[") and _flat(n):
        n.left = n.left[-1]
        n.right = n.right.replace(r"\right", "")


def _tidy_top(nodes: list) -> list:
    """:func:`_tidy` a whole formula; a formula that is just "-x" is braced too (it may be joined
    into a longer one, e.g. a negative result after "=")."""
    _tidy(nodes)
    if len(nodes) == 2 and nodes[0].kind == "bin" and nodes[0].tex == "-" and nodes[0].sup is None:
        nodes = [Node("brace", tex="neg", kids=nodes)]
    return nodes


@functools.lru_cache(maxsize=4096)
def tidy_width(tex: str) -> tuple[str, float]:
    """(:func:`tidy` of ``tex``, its estimated display width) from one parse."""
    nodes = _tidy_top(parse(tex))
    return join(nodes), seq_width(nodes, 1.0, True)


@functools.lru_cache(maxsize=4096)
def tidy(tex: str) -> str:
    """The same formula with plain parentheses where a stretchy fence is not needed.

    Chromium draws a MathML stretchy parenthesis around one row of symbols from a large size variant
    (about 0.87 em wide instead of 0.39 em); plain parentheses keep such formulas narrow.
    """
    return join(_tidy_top(parse(tex)))


@functools.lru_cache(maxsize=8192)
def tex_width(tex: str, display: bool = True) -> float:
    """Estimated printed width of a TeX formula in em of the math font (display style by default)."""
    return seq_width(parse(tex), 1.0, display)
