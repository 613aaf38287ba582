"""Formula and Condition: one source that both computes (on SI floats) and records (Step / Decision).

A :class:`Formula` is written once as text in sympy syntax over named symbols. Defining it costs a regex
scan; the first evaluation parses it with sympy, lambdifies it with numpy and prints its LaTeX, and the
result is kept in a module-level cache keyed by the formula text and its LaTeX names, so ``import calckit``
and importing a design module never import sympy.

Symbol LaTeX names are derived from the symbol names (``phi_b`` -> ``\\phi_{b}``, ``M_n`` -> ``M_{n}``,
``lam_bar_LT`` -> ``\\bar{\\lambda}_{LT}``, ``M_c_Rd`` -> ``M_{c,Rd}``); pass ``latex={...}`` to override.
``lambda`` is a Python keyword, so write ``lam`` (or ``lamda``) for lambda.
"""
from __future__ import annotations

import keyword
import math
import operator
import re
from typing import Any, Mapping

from ..errors import InputError, UnitsError
from .numfmt import base_dim, check_dim
from .records import Decision, Step

__all__ = ["Formula", "Condition", "symbol_latex", "clear_cache"]

GREEK = {
    "alpha", "beta", "gamma", "delta", "epsilon", "varepsilon", "zeta", "eta", "theta", "vartheta",
    "iota", "kappa", "lambda", "mu", "nu", "xi", "pi", "rho", "sigma", "tau", "upsilon", "phi",
    "varphi", "chi", "psi", "omega", "Gamma", "Delta", "Theta", "Lambda", "Xi", "Pi", "Sigma",
    "Upsilon", "Phi", "Psi", "Omega",
}
_ALIASES = {"lam": "lambda", "lamda": "lambda", "Lam": "Lambda", "eps": "varepsilon"}
_ACCENTS = {"bar", "hat", "tilde", "dot"}
# name in formula text -> sympy name (functions and constants allowed in formulas)
_FUNCS = {
    "sqrt": "sqrt", "exp": "exp", "log": "log", "ln": "log", "sin": "sin", "cos": "cos",
    "tan": "tan", "asin": "asin", "acos": "acos", "atan": "atan", "sinh": "sinh", "cosh": "cosh",
    "tanh": "tanh", "Min": "Min", "Max": "Max", "min": "Min", "max": "Max", "Abs": "Abs", "abs": "Abs",
}
_IDENT = re.compile(r"(?<![\w.])([A-Za-z_][A-Za-z0-9_]*)")
_RESERVED = {"note", "ref"}          # keywords of Formula.step()
PLACEHOLDER = "\u27e6{}\u27e7"        # ⟦name⟧ marks an input in a substituted-form template


def _greek(part: str) -> str:
    p = _ALIASES.get(part, part)
    return "\\" + p if p in GREEK else part


def symbol_latex(name: str) -> str:
    """Derive LaTeX for a symbol name: base letter (Greek spelled out), accent, comma-joined subscripts.

    ``phi_b`` -> ``\\phi_{b}``; ``M_c_Rd`` -> ``M_{c,Rd}``; ``lam_bar_LT`` -> ``\\bar{\\lambda}_{LT}``;
    ``C_v1`` -> ``C_{v1}``; ``Zx`` -> ``Zx``.
    """
    base, *subs = name.split("_")
    if not base:  # leading underscore: keep as typed
        return name.replace("_", r"\_")
    tex = _greek(base)
    if subs and subs[0] in _ACCENTS:
        tex = "\\" + subs[0] + "{" + tex + "}"
        subs = subs[1:]
    subs = [s for s in subs if s]
    if subs:
        tex += "_{" + ",".join(_greek(s) for s in subs) + "}"
    return tex


def _scan(expr: str) -> list[str]:
    """Symbol names used in ``expr`` (in order of first use), without functions and the constant pi."""
    names: list[str] = []
    for m in _IDENT.finditer(expr):
        n = m.group(1)
        after = expr[m.end():].lstrip()
        if n in _FUNCS and after.startswith("("):
            continue
        if n in ("pi", "E_const"):
            continue
        if n not in names:
            names.append(n)
    return names


# ------------------------------------------------------------------------------------------ the cache
class _Compiled:
    """Parsed formula: sympy expression, numpy function, symbolic LaTeX and substituted-form template."""

    __slots__ = ("expr", "fn", "args", "latex", "template")

    def __init__(self, expr, fn, args, latex, template):
        self.expr, self.fn, self.args, self.latex, self.template = expr, fn, args, latex, template


_CACHE: dict[tuple, _Compiled] = {}


def clear_cache() -> None:
    """Forget every compiled formula (for tests and benchmarks)."""
    _CACHE.clear()


_printer_cls = None


def _printer(symbol_names: dict) -> Any:
    global _printer_cls
    if _printer_cls is None:
        from sympy import Mul, S
        from sympy.printing.latex import LatexPrinter

        class _SheetLatex(LatexPrinter):
            """LaTeX printer that keeps the author's order and drops unevaluated unit factors (1 * x)."""

            def _print_Mul(self, expr):
                args = [a for a in expr.args if a is not S.One]
                if len(args) != len(expr.args):
                    if not args:
                        return "1"
                    if len(args) == 1:
                        return self._print(args[0])
                    return super()._print_Mul(Mul(*args, evaluate=False))
                return super()._print_Mul(expr)

        _printer_cls = _SheetLatex
    return _printer_cls({"symbol_names": symbol_names, "order": "none"})


def _compile(text: str, names: tuple[str, ...], tex: tuple[tuple[str, str], ...]) -> _Compiled:
    key = (text, names, tex)
    c = _CACHE.get(key)
    if c is not None:
        return c
    import sympy
    from sympy.parsing.sympy_parser import convert_xor, parse_expr, standard_transformations

    syms = {n: sympy.Symbol(n + "_" if keyword.iskeyword(n) else n) for n in names}
    local: dict[str, Any] = {k: getattr(sympy, v) for k, v in _FUNCS.items()}
    local["pi"] = sympy.pi
    src = text
    for n in names:
        if keyword.iskeyword(n):
            src = re.sub(rf"(?<![\w.]){n}(?!\w)", n + "_", src)
        local[n + "_" if keyword.iskeyword(n) else n] = syms[n]
    try:
        expr = parse_expr(src, local_dict=local, transformations=standard_transformations + (convert_xor,),
                          evaluate=False)
    except Exception as exc:  # sympy raises SyntaxError, TokenError, TypeError...
        raise InputError(f"formula: got {text!r}; could not read it as an expression ({exc})") from None
    args = tuple(sorted(names))
    fn = sympy.lambdify([syms[a] for a in args], expr, modules="numpy")
    texmap = dict(tex)
    latex = _printer({syms[n]: texmap[n] for n in names}).doprint(expr)
    template = _printer({syms[n]: PLACEHOLDER.format(n) for n in names}).doprint(expr)
    c = _Compiled(expr, fn, args, latex, template)
    _CACHE[key] = c
    return c


# -------------------------------------------------------------------------------------- value handling
def _si_input(owner: str, name: str, value, dim: str) -> float:
    """One input of a step as an SI float; errors name the symbol."""
    if isinstance(value, Step):
        from ..units import DIMS

        if DIMS[base_dim(value.dim)][0] != DIMS[base_dim(dim)][0]:
            raise UnitsError(f"{name}: got the step {value.symbol} of dimension {value.dim!r}; "
                             f"{owner} expects {name} to be {dim!r}")
        return value.result
    if isinstance(value, bool) or value is None:
        raise InputError(f"{name}: got {value!r}; {owner} expects a number ({dim})")
    if isinstance(value, str) or (hasattr(value, "magnitude") and hasattr(value, "units")):
        from ..units import to_si

        try:
            v = to_si(value, base_dim(dim), name, allow_array=False)
        except UnitsError as exc:
            raise UnitsError(f"{exc} (in {owner})") from None
        return float(v)
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise InputError(f"{name}: got {value!r}; {owner} expects a single number ({dim}); "
                         "evaluate arrays with the formula itself, f(**values)") from None
    if math.isnan(v):
        raise InputError(f"{name}: got NaN; {owner} expects a finite number")
    return v


class _Expr:
    """Common parts of Formula and Condition: symbol names, dimensions, LaTeX names."""

    def _setup(self, names: list[str], dims: Mapping[str, str] | None, latex: Mapping[str, str] | None,
               extra: tuple[str, ...] = ()) -> None:
        dims = dict(dims or {})
        latex = dict(latex or {})
        known = set(names) | set(extra)
        for k in dims:
            if k not in known:
                raise InputError(f"dims: got a dimension for {k!r}, which {self._owner()} does not use; "
                                 f"its symbols are {sorted(known)}")
            check_dim(dims[k], k)
        for k in latex:
            if k not in known:
                raise InputError(f"latex: got a name for {k!r}, which {self._owner()} does not use")
        self.dims = {n: dims.get(n, "dimensionless") for n in (*extra, *names)}
        self.tex = {n: latex.get(n) or symbol_latex(n) for n in (*extra, *names)}

    def _owner(self) -> str:
        raise NotImplementedError


class Formula(_Expr):
    """A design formula written once: evaluates on SI floats and records :class:`Step` s.

    Parameters
    ----------
    symbol : name of the result, e.g. ``"M_n"``.
    expr : right-hand side in sympy/Python syntax over symbol names, e.g. ``"F_y*Z_x"``
        (``**`` or ``^`` for powers; sqrt, exp, log, sin, cos, tan, atan, Min, Max, Abs, pi allowed).
    dims : dimension of each symbol (keys of ``calckit.units.DIMS``, or ``"ratio"``); symbols not
        listed are dimensionless. The result's dimension is checked against the inputs' on first use
        (set ``check_units=False`` for an empirical formula with unit-dependent constants).
    latex : LaTeX names overriding the derived ones, e.g. ``{"M_c_Rd": r"M_{c,\\mathrm{Rd}}"}``.
    ref : where the formula comes from: standard + edition + clause/equation, "beam formula" or
        "common practice".
    label : a few words saying what is computed ("nominal flexural strength, yielding").
    sig, decimals : rounding of the displayed result (3 significant figures by default; ratios 2 decimals).

    ``f(**si_values)`` returns the SI result (floats or numpy arrays); ``f.step(**values)`` evaluates,
    records and returns a :class:`Step` (values: SI floats, pint quantities, strings like "50 ksi",
    or earlier Steps).
    """

    __slots__ = ("symbol", "expr", "dims", "tex", "ref", "label", "sig", "decimals", "check_units",
                 "names", "_key", "_c", "_units_ok")

    def __init__(self, symbol: str, expr: str, *, dims: Mapping[str, str] | None = None,
                 latex: Mapping[str, str] | None = None, ref: str = "", label: str = "",
                 sig: int | None = None, decimals: int | None = None, check_units: bool = True) -> None:
        if not isinstance(symbol, str) or not re.fullmatch(r"[A-Za-z_]\w*", symbol):
            raise InputError(f"symbol: got {symbol!r}; expected a name such as 'M_n'")
        if not isinstance(expr, str) or not expr.strip():
            raise InputError(f"expr: got {expr!r}; expected the right-hand side as text, e.g. 'F_y*Z_x'")
        self.symbol = symbol
        self.expr = expr.strip()
        names = _scan(self.expr)
        bad = _RESERVED.intersection(names)
        if bad:
            raise InputError(f"expr: symbol name {sorted(bad)[0]!r} is reserved (keyword of step()); rename it")
        self.names = tuple(names)
        self._setup(names, dims, latex, extra=(symbol,))
        self.ref = ref
        self.label = label
        if sig is not None and (not isinstance(sig, int) or sig < 1):
            raise InputError(f"sig: got {sig!r}; expected a whole number of significant figures >= 1")
        if decimals is not None and (not isinstance(decimals, int) or decimals < 0):
            raise InputError(f"decimals: got {decimals!r}; expected a whole number of decimal places >= 0")
        self.sig, self.decimals = sig, decimals
        self.check_units = check_units
        self._key = (self.expr, tuple(sorted(names)), tuple(sorted((n, self.tex[n]) for n in names)))
        self._c: _Compiled | None = None
        self._units_ok: bool | None = None

    def _owner(self) -> str:
        return f"formula {self.symbol} = {self.expr}"

    def _compiled(self) -> _Compiled:
        c = self._c
        if c is None:
            c = self._c = _compile(*self._key)
        return c

    # -- numbers ------------------------------------------------------------------------------------
    def __call__(self, **values):
        """Evaluate on SI floats or numpy arrays (no unit handling; the fast path)."""
        c = self._c or self._compiled()
        try:
            return c.fn(*[values[a] for a in c.args])
        except KeyError:
            missing = [a for a in self.names if a not in values]
            raise InputError(f"{missing[0]}: no value given; {self._owner()} needs "
                             f"{', '.join(self.names)}") from None
        except (TypeError, ValueError, AttributeError):
            for a in c.args:
                v = values[a]
                if isinstance(v, (str, Step)) or hasattr(v, "units"):
                    raise InputError(f"{a}: got {v!r}; calling {self._owner()} directly takes SI floats or "
                                     "arrays; use .step(...) for quantities, strings and Steps") from None
            raise

    evaluate = __call__

    def _values(self, values: Mapping[str, Any]) -> dict[str, float]:
        extra = [k for k in values if k not in self.dims or k == self.symbol]
        if extra:
            raise InputError(f"{extra[0]}: got a value, but {self._owner()} has no such input; "
                             f"its inputs are {', '.join(self.names)}")
        out = {}
        for n in self.names:
            if n not in values:
                raise InputError(f"{n}: no value given; {self._owner()} needs {', '.join(self.names)}")
            out[n] = _si_input(self._owner(), n, values[n], self.dims[n])
        return out

    def step(self, *, note: str = "", ref: str | None = None, **values) -> Step:
        """Evaluate with ``values`` and return the :class:`Step` recording formula, inputs and result."""
        si = self._values(values)
        c = self._c or self._compiled()
        if self.check_units and self._units_ok is None:
            self._check_units(c)
        with _quiet():
            r = c.fn(*[si[a] for a in c.args])
        try:
            result = float(r)
        except (TypeError, ValueError):
            raise InputError(f"{self.symbol}: {self._owner()} gave {r!r}, not a number") from None
        return Step(
            symbol=self.symbol, latex=c.latex,
            inputs={n: (si[n], self.dims[n]) for n in self.names},
            result=result, dim=self.dims[self.symbol], reference=ref if ref is not None else self.ref,
            note=note, label=self.label, symbol_latex=self.tex[self.symbol], template=c.template,
            input_latex={n: self.tex[n] for n in self.names}, sig=self.sig, decimals=self.decimals,
        )

    def latex(self) -> str:
        """``M_{n} = F_{y} Z_{x}``: the symbolic form with its left-hand side."""
        return f"{self.tex[self.symbol]} = {self._compiled().latex}"

    def _check_units(self, c: _Compiled) -> None:
        """Check with pint that the expression has the dimension declared for the result."""
        from ..units import Q_, DIMS

        def q(dim):
            u = DIMS[base_dim(dim)][0]
            return Q_(1.37, u) if u else Q_(1.37, "")

        try:
            with _quiet():
                r = c.fn(*[q(self.dims[a]) for a in c.args])
            got = r.dimensionality if hasattr(r, "dimensionality") else Q_(1.0, "").dimensionality
        except Exception as exc:
            if type(exc).__name__ == "DimensionalityError":
                self._units_ok = False
                raise UnitsError(f"{self.symbol}: {self._owner()} mixes dimensions that do not combine "
                                 f"({exc}); check dims, or pass check_units=False for an empirical formula"
                                 ) from None
            self._units_ok = True  # expression not evaluable on quantities (e.g. Min/Max): not checked
            return
        u = DIMS[base_dim(self.dims[self.symbol])][0]
        want = (Q_(1.0, u) if u else Q_(1.0, "")).dimensionality
        if got != want:
            self._units_ok = False
            raise UnitsError(f"{self.symbol}: {self._owner()} gives {got or 'a plain number'}, but "
                             f"{self.symbol} is declared {self.dims[self.symbol]!r} ({want or 'a plain number'});"
                             " check dims, or pass check_units=False for an empirical formula")
        self._units_ok = True

    def __repr__(self) -> str:
        return f"Formula({self.symbol!r}, {self.expr!r}, ref={self.ref!r})"


class _quiet:
    """Silence numpy warnings during a single step evaluation (inf/nan show in the record)."""

    def __enter__(self):
        import numpy as np
        self._old = np.seterr(all="ignore")

    def __exit__(self, *exc):
        import numpy as np
        np.seterr(**self._old)


# ----------------------------------------------------------------------------------------- conditions
_OPS = {"<=": operator.le, ">=": operator.ge, "<": operator.lt, ">": operator.gt, "==": operator.eq,
        "!=": operator.ne}
_SPLIT = re.compile(r"(<=|>=|==|!=|<|>)")


class Condition(_Expr):
    """A (chained) comparison that selects a branch, e.g. ``"L_p < L_b <= L_r"``, and records why.

    Parameters
    ----------
    expr : comparison chain; each side is an expression over symbols ("h/t_w <= 3.76*sqrt(E/F_y)").
    dims, latex : as for :class:`Formula`. A compound side (not a single symbol) takes the dimension of
        the single-symbol sides of the chain, if any, else is dimensionless.
    then : conclusion when the condition holds ("inelastic lateral-torsional buckling applies").
    otherwise : conclusion when it does not (optional).
    ref : clause that states the condition.

    ``cond(**si_values)`` returns a bool; ``cond.step(**values)`` returns a :class:`Decision` (with
    ``.holds``) so that the branch taken in Python is recorded with its numbers.
    """

    __slots__ = ("expr", "dims", "tex", "then", "otherwise", "ref", "label", "names", "sides", "ops")

    def __init__(self, expr: str, *, dims: Mapping[str, str] | None = None,
                 latex: Mapping[str, str] | None = None, then: str = "", otherwise: str = "",
                 ref: str = "", label: str = "") -> None:
        if not isinstance(expr, str):
            raise InputError(f"condition: got {expr!r}; expected text such as 'L_p < L_b <= L_r'")
        pieces = _SPLIT.split(expr.strip())
        if len(pieces) < 3:
            raise InputError(f"condition: got {expr!r}; expected a comparison such as 'L_p < L_b <= L_r'")
        self.expr = expr.strip()
        self.sides = tuple(p.strip() for p in pieces[0::2])
        self.ops = tuple(pieces[1::2])
        if any(not s for s in self.sides):
            raise InputError(f"condition: got {expr!r}; a side of a comparison is empty")
        names: list[str] = []
        for s in self.sides:
            for n in _scan(s):
                if n not in names:
                    names.append(n)
        self.names = tuple(names)
        self._setup(names, dims, latex)
        self.then, self.otherwise, self.ref, self.label = then, otherwise, ref, label
        single = [self.dims[s] for s in self.sides if s in self.dims]
        self._side_dim = single[0] if single else "dimensionless"
        self._fs = None

    def _owner(self) -> str:
        return f"condition {self.expr}"

    def _side_formulas(self):
        if self._fs is None:
            fs = []
            for i, s in enumerate(self.sides):
                ns = _scan(s)
                dims = {n: self.dims[n] for n in ns}
                dims[f"side_{i}"] = self.dims.get(s, self._side_dim)
                fs.append(Formula(f"side_{i}", s, dims=dims, latex={n: self.tex[n] for n in ns},
                                  check_units=False))
            self._fs = fs
        return self._fs

    def _values(self, values: Mapping[str, Any]) -> dict[str, float]:
        extra = [k for k in values if k not in self.dims]
        if extra:
            raise InputError(f"{extra[0]}: got a value, but {self._owner()} has no such symbol; "
                             f"its symbols are {', '.join(self.names)}")
        out = {}
        for n in self.names:
            if n not in values:
                raise InputError(f"{n}: no value given; {self._owner()} needs {', '.join(self.names)}")
            out[n] = _si_input(self._owner(), n, values[n], self.dims[n])
        return out

    def _side_values(self, si: Mapping[str, float]) -> list[float]:
        vals = []
        for f in self._side_formulas():
            with _quiet():
                vals.append(float(f(**{n: si[n] for n in f.names})))
        return vals

    def __call__(self, **values) -> bool:
        """True when every comparison of the chain holds (values: SI floats, quantities or Steps)."""
        vals = self._side_values(self._values(values))
        return all(_OPS[o](a, b) for o, a, b in zip(self.ops, vals, vals[1:]))

    def step(self, *, note: str = "", ref: str | None = None, **values) -> Decision:
        """Evaluate and return the :class:`Decision` record (``.holds`` tells which branch applies)."""
        si = self._values(values)
        vals = self._side_values(si)
        fs = self._side_formulas()
        holds = all(_OPS[o](a, b) for o, a, b in zip(self.ops, vals, vals[1:]))
        sides = tuple(
            (f._compiled().latex, f.dims[f.symbol], v, s in self.dims)
            for f, v, s in zip(fs, vals, self.sides)
        )
        return Decision(
            condition=self.expr, sides=sides, ops=self.ops, holds=holds,
            inputs={n: (si[n], self.dims[n]) for n in self.names},
            conclusion=self.then if holds else self.otherwise, reference=ref if ref is not None else self.ref,
            note=note, label=self.label, input_latex={n: self.tex[n] for n in self.names},
        )

    def __repr__(self) -> str:
        return f"Condition({self.expr!r}, ref={self.ref!r})"
