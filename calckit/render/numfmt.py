"""Number and unit formatting for calc sheets (engineering rounding, unit labels in LaTeX and text).

Rounding rules (common practice for hand calculations):

* results: 3 significant figures by default (``sig``), trailing zeros kept (``42.0``, ``421``, ``1230``);
* ratios (dimension ``"ratio"``): 2 decimal places (``decimals``);
* inputs in a substituted form: 4 significant figures, trailing zeros dropped (``50``, ``17.99``), so
  that the numbers shown reproduce the result to its displayed precision;
* numbers of magnitude >= 1e6 or < 1e-3 are written in engineering notation, ``m x 10^n`` with ``n`` a
  multiple of 3 and 1 <= m < 1000 (``35.7 x 10^6``, ``26.8 x 10^9``, ``26.2 x 10^-6``), so the exponent
  matches the unit multiples engineers read (kilo, mega, giga) and neighbouring values compare at a
  glance; the mantissa keeps the significant figures.

Display units come from :func:`calckit.units.display_unit`; conversion factors are cached per
``(dim, unit)`` so formatting does not call pint for every number.
"""
from __future__ import annotations

import math
import re

from ..errors import InputError

__all__ = [
    "RATIO", "DEFAULT_SIG", "INPUT_SIG", "RATIO_DECIMALS", "round_sig", "format_number",
    "unit_latex", "unit_text", "unit_html", "display_unit_for", "si_to_display", "base_dim", "set_display",
    "display_settings",
]

RATIO = "ratio"            # render-only dimension: a dimensionless ratio shown to 2 decimals
DEFAULT_SIG = 3            # significant figures of results
INPUT_SIG = 4              # significant figures of inputs in substituted forms
RATIO_DECIMALS = 2         # decimal places of ratios
_SCI_HI = 1e6
_SCI_LO = 1e-3

_factor_cache: dict[tuple[str, str], float] = {}


def base_dim(dim: str) -> str:
    """The calckit.units dimension behind a render dimension (``"ratio"`` -> ``"dimensionless"``)."""
    return "dimensionless" if dim == RATIO else dim


def check_dim(dim: str, name: str) -> str:
    """Raise InputError naming ``name`` unless ``dim`` is a calckit.units dimension or ``"ratio"``."""
    from ..units import DIMS

    if dim != RATIO and dim not in DIMS:
        raise InputError(f"{name}: got dimension {dim!r}; expected 'ratio' or one of {sorted(DIMS)}")
    return dim


def display_unit_for(dim: str, system: str, override: str | None = None) -> str:
    """Unit shown for ``dim`` in ``system`` ('SI' or 'US'), unless ``override`` names one."""
    if override:
        return override
    from ..units import display_unit

    return display_unit(base_dim(dim), system)


def si_to_display(value, dim: str, unit: str):
    """Convert an SI float (or array) of dimension ``dim`` to ``unit`` (factor cached)."""
    if not unit:
        return value
    key = (base_dim(dim), unit)
    f = _factor_cache.get(key)
    if f is None:
        from ..units import convert

        f = float(convert(1.0, key[0], unit))
        _factor_cache[key] = f
    return value * f


def round_sig(x: float, sig: int) -> float:
    """Round ``x`` to ``sig`` significant figures (half away from zero as printed by ``%e``)."""
    if x == 0 or not math.isfinite(x):
        return x
    return float(f"{x:.{sig - 1}e}")


def _fixed(x: float, sig: int | None, decimals: int | None, trim: bool) -> tuple[str, int]:
    """Return (mantissa text, exponent) for ``x``; exponent 0 means plain notation."""
    if decimals is not None:
        s = f"{x:.{decimals}f}"
        if s.lstrip("-") == "0." + "0" * decimals or s.lstrip("-") == "0":
            s = s.lstrip("-")
        return s, 0
    sig = sig or DEFAULT_SIG
    if x == 0:
        return "0", 0
    r = round_sig(x, sig)
    a = abs(r)
    exp = math.floor(math.log10(a))
    if a >= _SCI_HI or a < _SCI_LO:
        exp3 = 3 * (exp // 3)                      # engineering notation: exponent a multiple of 3
        m = r / 10.0 ** exp3
        s = f"{m:.{max(sig - 1 - (exp - exp3), 0)}f}"
        if trim and "." in s:
            s = s.rstrip("0").rstrip(".")
        return s, exp3
    nd = sig - 1 - exp
    if nd > 0:
        s = f"{r:.{nd}f}"
        if trim and "." in s:
            s = s.rstrip("0").rstrip(".")
    else:
        s = f"{r:.0f}"
    return s, 0


def format_number(x, *, sig: int | None = None, decimals: int | None = None, trim: bool = False,
                  style: str = "latex") -> str:
    """Format one number for a calc sheet.

    ``sig`` significant figures (default 3) or ``decimals`` fixed places; ``trim`` drops trailing zeros;
    ``style`` is 'latex' (``1.66 \\times 10^{6}``), 'text' (``1.66e6``) or 'html' (``1.66×10<sup>6</sup>``).
    Non-finite values print as ``inf``/``nan`` (LaTeX ``\\infty``).
    """
    x = float(x)
    if not math.isfinite(x):
        if math.isnan(x):
            return "nan"
        neg = "-" if x < 0 else ""
        return neg + (r"\infty" if style == "latex" else "∞" if style == "html" else "inf")
    s, exp = _fixed(x, sig, decimals, trim)
    if exp == 0:
        return s
    if style == "latex":
        return rf"{s} \times 10^{{{exp}}}"
    if style == "html":
        return f"{s}×10<sup>{exp}</sup>"
    return f"{s}e{exp}"


# ---------------------------------------------------------------------------------------- unit labels
_TOK = re.compile(r"^([A-Za-z]+)(?:\*\*(-?\d+))?$")
_unit_cache: dict[tuple[str, str], str] = {}
_SUP = str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻")


def _unit_parts(unit: str) -> tuple[list[tuple[str, str]], list[tuple[str, str]]]:
    num, _, den = unit.replace(" ", "").partition("/")
    out = []
    for side in (num, den):
        toks = []
        if side:
            # split on single '*' (not '**')
            for t in re.split(r"(?<!\*)\*(?!\*)", side):
                m = _TOK.match(t)
                if not m:
                    raise InputError(f"unit: got {unit!r}; expected a product/quotient like 'kip*ft' or 'kN/m'")
                toks.append((m.group(1), m.group(2) or ""))
        out.append(toks)
    return out[0], out[1]


def unit_latex(unit: str) -> str:
    """LaTeX for a unit string: 'kip*ft' -> ``\\text{kip}{\\cdot}\\text{ft}``, 'in**3' -> ``\\text{in}^{3}``."""
    key = ("latex", unit)
    if key in _unit_cache:
        return _unit_cache[key]
    if not unit:
        return ""
    if unit == "deg":
        res = r"^{\circ}"
    else:
        num, den = _unit_parts(unit)

        def side(toks):
            parts = []
            for name, p in toks:
                parts.append(rf"\text{{{name}}}" + (f"^{{{p}}}" if p else ""))
            return r"{\cdot}".join(parts)

        res = side(num) + (("/" + side(den)) if den else "")
    _unit_cache[key] = res
    return res


def unit_text(unit: str, html: bool = False) -> str:
    """Plain-text unit label: 'kip*ft' -> 'kip·ft', 'in**3' -> 'in³' (``html``: 'in<sup>3</sup>')."""
    key = ("html" if html else "text", unit)
    if key in _unit_cache:
        return _unit_cache[key]
    if not unit:
        return ""
    if unit == "deg":
        res = "°"
    else:
        num, den = _unit_parts(unit)

        def side(toks):
            return "·".join(n + ((f"<sup>{p}</sup>" if html else p.translate(_SUP)) if p else "") for n, p in toks)

        res = side(num) + (("/" + side(den)) if den else "")
    _unit_cache[key] = res
    return res


def unit_html(unit: str) -> str:
    """HTML unit label ('in**3' -> 'in<sup>3</sup>')."""
    return unit_text(unit, html=True)


# ---------------------------------------------------------------------------------------- settings
DEFAULT_SYSTEM = "SI"      # display system used when a block is given none


def set_display(system: str | None = None, *, sig: int | None = None, ratio_decimals: int | None = None,
                input_sig: int | None = None) -> None:
    """Set calc-wide display defaults (see :func:`display_settings` to read them back).

    ``system`` 'SI' or 'US'; ``sig`` significant figures of results (3); ``ratio_decimals`` decimals of
    ratios (2); ``input_sig`` significant figures of inputs in substituted forms (4).
    """
    global DEFAULT_SYSTEM, DEFAULT_SIG, RATIO_DECIMALS, INPUT_SIG
    if system is not None:
        if str(system).upper() not in ("SI", "US"):
            raise InputError(f"system: got {system!r}; expected 'SI' or 'US'")
        DEFAULT_SYSTEM = str(system).upper()
    for name, v in (("sig", sig), ("ratio_decimals", ratio_decimals), ("input_sig", input_sig)):
        if v is not None and (not isinstance(v, int) or v < (0 if name == "ratio_decimals" else 1)):
            raise InputError(f"{name}: got {v!r}; expected a whole number")
    if sig is not None:
        DEFAULT_SIG = sig
    if ratio_decimals is not None:
        RATIO_DECIMALS = ratio_decimals
    if input_sig is not None:
        INPUT_SIG = input_sig


def display_settings() -> dict:
    """Current display defaults: {"system", "sig", "ratio_decimals", "input_sig"}."""
    return {"system": DEFAULT_SYSTEM, "sig": DEFAULT_SIG, "ratio_decimals": RATIO_DECIMALS,
            "input_sig": INPUT_SIG}
