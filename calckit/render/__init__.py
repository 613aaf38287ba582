"""calckit.render: formulas beside substituted numbers and results, from one formula source.

Usage (design modules)
----------------------
Write each formula once, at module level (defining it is free: sympy is loaded on first evaluation and
the parsed/lambdified form is cached). Compute *and* record through ``Formula.step`` so that what the
sheet shows is what was computed. Values are SI floats, pint quantities, strings ("50 ksi"), or earlier
Steps (their dimension is checked against the symbol's)::

    from calckit.render import Formula, Condition, given, check, decide

    F2_1 = Formula("M_n", "F_y*Z_x", ref="AISC 360-22 Eq. F2-1", label="plastic moment (yielding)",
                   dims={"M_n": "moment", "F_y": "stress", "Z_x": "modulus"})
    F2_2 = Formula("M_n", "Min(C_b*(M_p - (M_p - 0.7*F_y*S_x)*((L_b - L_p)/(L_r - L_p))), M_p)",
                   ref="AISC 360-22 Eq. F2-2", label="inelastic lateral-torsional buckling",
                   dims={"M_n": "moment", "M_p": "moment", "F_y": "stress", "S_x": "modulus",
                         "L_b": "span", "L_p": "span", "L_r": "span"})
    PHI_MN = Formula("M_c", "phi_b*M_n", latex={"M_c": r"\\phi_{b} M_{n}"},
                     dims={"M_c": "moment", "M_n": "moment"}, ref="AISC 360-22 F1(1)")
    ZONE_2 = Condition("L_p < L_b <= L_r", dims={"L_p": "span", "L_b": "span", "L_r": "span"},
                       then="inelastic lateral-torsional buckling applies (F2-2)",
                       ref="AISC 360-22 F2.2(b)")

    def flexure(Fy, Zx, Sx, Lb, Lp, Lr, Cb, Mu):           # SI floats (or quantities / strings)
        steps = []
        Mp = F2_1.step(F_y=Fy, Z_x=Zx); steps.append(Mp)
        zone = ZONE_2.step(L_p=Lp, L_b=Lb, L_r=Lr); steps.append(zone)
        if zone.holds:                                       # piecewise logic stays in Python
            Mn = F2_2.step(C_b=Cb, M_p=Mp, F_y=Fy, S_x=Sx, L_b=Lb, L_p=Lp, L_r=Lr); steps.append(Mn)
        else:
            ...                                              # other zones: their own Condition + Formula
        cap = PHI_MN.step(phi_b=0.90, M_n=Mn); steps.append(cap)
        dem = given("M_u", Mu, "moment", reference="analysis, LRFD combination 1.2D + 1.6L")
        return check("Flexure, lateral-torsional buckling", dem, cap, steps=steps,
                     reference="AISC 360-22 F2")               # Check: ratio, status "OK"/"NOT OK", passed

    F2_1(F_y=345e6, Z_x=1.655e-3)                            # fast numeric path: SI floats or numpy arrays

Records (frozen dataclasses of SI floats, ``calckit.render.records``):
``Step`` (symbol, latex, inputs {name: (si, dim)}, result, dim, reference, note, ...),
``Decision`` (condition, sides, ops, holds, conclusion, reference; ``bool(decision)`` is ``holds``),
``Check`` (name, demand, capacity, dim, ratio, status, passed, reference, steps, ...).
Makers: ``Formula.step``, ``Condition.step``, ``given(symbol, value, dim, reference=...)``,
``decide(text, reference=...)`` (a decision stated in words), ``check(name, demand, capacity, ...)``.

Dimensions are the keys of ``calckit.units.DIMS`` plus ``"ratio"`` (dimensionless, 2 decimals).
Symbols not listed in ``dims`` are dimensionless. Symbol LaTeX is derived from the name
(``phi_b`` -> ``\\phi_{b}``, ``M_c_Rd`` -> ``M_{c,Rd}``, ``lam_bar_LT`` -> ``\\bar{\\lambda}_{LT}``;
``lambda`` is a Python keyword: write ``lam``); override with ``latex={...}``. Bad input raises
``InputError`` / ``UnitsError`` naming the symbol (missing value, wrong dimension, unknown name).

Display (notebooks and archive)
-------------------------------
Blocks (``Header``, ``Caution``, ``Section``, ``Summary``, ``Figure``, ``Text``, ``Table``, ``Sheet``)
render as HTML tables with TeX math for JupyterLab; ``Summary`` also writes the machine-readable
results payload (mime type ``application/vnd.calckit.results+json``; read it back with
``read_results(path)``). ``export_html(nb, out_path)`` writes a self-contained archive HTML (TeX
converted to MathML, no CDN scripts). Display units: ``set_display(system="US")`` or per block
``system="US"``. A step too wide for the calculation column is set as aligned rows (symbolic
form, then the substituted form broken at ``=``, ``+``/``-``, commas or between factors, then the
result); numbers >= 1e6 or < 1e-3 are written in engineering notation (``35.7 x 10^6``). See
docs/rendering.md.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from importlib import import_module

from .formula import Condition, Formula, symbol_latex
from .latex import check_latex, decision_latex, step_forms, step_latex
from .numfmt import display_settings, set_display
from .records import NOT_OK, OK, Check, Decision, Step, check, decide, given

_LAZY = {
    "Header": ".blocks", "Caution": ".blocks", "Section": ".blocks", "Summary": ".blocks",
    "Figure": ".blocks", "Text": ".blocks", "Table": ".blocks", "Sheet": ".blocks",
    "Inputs": ".blocks", "show": ".blocks",
    "results_payload": ".payload", "read_results": ".payload", "read_all_results": ".payload",
    "RESULTS_MIME": ".payload", "records_from_payload": ".payload",
    "export_html": ".export",
}

__all__ = [
    "Formula", "Condition", "Step", "Decision", "Check", "given", "decide", "check", "OK", "NOT_OK",
    "step_latex", "step_forms", "decision_latex", "check_latex", "symbol_latex", "set_display", "display_settings", *_LAZY,
]


def __getattr__(name: str):
    mod = _LAZY.get(name)
    if mod is None:
        raise AttributeError(f"module 'calckit.render' has no attribute {name!r}")
    value = getattr(import_module(mod, __name__), name)
    globals()[name] = value
    return value


def __dir__():
    return sorted(__all__)
