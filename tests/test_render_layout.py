"""Tests of the layout of long formulas and of the result column (calckit.render.texparse, texbreak,
html rows) and of the engineering notation of large and small numbers (calckit.render.numfmt).

What is checked, independently of the code under test where possible:

* the TeX reader writes formulas back with identical MathML (latex2mathml);
* every rewrite of the line breaker is an identity: a TeX-to-Python evaluator written here (units
  are factors of 1, as in the substituted forms they multiply every number alike) gives the broken
  rows the value of the one-line form;
* the numbers shown in the rendered rows of a step re-evaluate to the displayed result (as
  tests/test_render.py does for the one-line form);
* no row is wider than the calculation column (width estimate) and nothing is set below 80 %;
* in headless Chromium (only where Debian's chromium is installed) no cell of a sheet holding such
  formulas overflows its column.

Formulas: elastic critical moment, three-factor formula, ENV 1993-1-1:1992 Annex F Eq. (F.2) (as
NCCI SN003 Eq. (1)); shear area of a rolled I, EN 1993-1-1:2005 6.2.6(3)(a); normal stress
sigma = -M (y - y_c)/I_x (Gere, Mechanics of Materials, 7th ed., Sec. 5.5); AISC 360-22 Eq. F1-1 (C_b)
and F2-2. Input values (a 1500 x 550 welded girder, an HE 300 A) only feed the layout here; no
engineering value is asserted.
"""
from __future__ import annotations

import html as _html
import math
import re
import shutil
import subprocess

import pytest

from calckit.render import Formula, Section, Sheet, given
from calckit.render import html as H
from calckit.render import latex as L
from calckit.render import texbreak as TB
from calckit.render import texparse as TP
from calckit.render.numfmt import format_number

REL = 1e-9              # identity rewrites: equal to rounding of floating point
HALF = 0.5

MCR = Formula("M_cr", "C_1*pi**2*E*I_z/(k*L)**2*(sqrt((k/k_w)**2*I_w/I_z + (k*L)**2*G*I_t/(pi**2*E*I_z)"
              " + (C_2*z_g - C_3*z_j)**2) - (C_2*z_g - C_3*z_j))",
              dims={"M_cr": "moment", "E": "stress", "G": "stress", "I_z": "inertia", "I_t": "inertia",
                    "I_w": "warping", "L": "span", "z_g": "length", "z_j": "length"},
              ref="ENV 1993-1-1:1992 Annex F Eq. (F.2)")
AV = Formula("A_v", "Max(A - 2*b*t_f + (t_w + 2*r)*t_f, eta*h_w*t_w)", ref="EN 1993-1-1:2005 6.2.6(3)(a)",
             dims={"A_v": "area", "A": "area", "b": "length", "t_f": "length", "t_w": "length", "r": "length",
                   "h_w": "length"})
SIGMA = Formula("sigma", "-M*(y - y_c)/I_x", ref="Gere 7th ed. Sec. 5.5",
                dims={"sigma": "stress", "M": "moment", "y": "length", "y_c": "length", "I_x": "inertia"})
CB = Formula("C_b", "12.5*M_max/(2.5*M_max + 3*M_A + 4*M_B + 3*M_C)", ref="AISC 360-22 Eq. F1-1",
             dims={"M_max": "moment", "M_A": "moment", "M_B": "moment", "M_C": "moment"})
F2_2 = Formula("M_n", "Min(C_b*(M_p - (M_p - 0.7*F_y*S_x)*((L_b - L_p)/(L_r - L_p))), M_p)",
               dims={"M_n": "moment", "M_p": "moment", "F_y": "stress", "S_x": "modulus", "L_b": "span",
                     "L_p": "span", "L_r": "span"}, ref="AISC 360-22 Eq. F2-2")
MCRD = Formula("M_c_Rd", "W_el_y*f_y/gamma_M0", ref="EN 1993-1-1:2005 Eq. (6.14)",
               dims={"M_c_Rd": "moment", "W_el_y": "modulus", "f_y": "stress"})


def _steps():
    return [
        MCR.step(C_1=1.835, E="210000 MPa", I_z="1.109e9 mm**4", k=1.0, k_w=1.0, I_w="5.912e14 mm**6",
                 L="4 m", G="80770 MPa", I_t="2.384e7 mm**4", C_2=0.0, z_g="0 mm", C_3=1.0, z_j="0 mm"),
        AV.step(A="11250 mm**2", b="300 mm", t_f="14 mm", t_w="8.5 mm", r="27 mm", eta=1.2, h_w="262 mm"),
        SIGMA.step(M="-197.8 kN*m", y="0 mm", y_c="145 mm", I_x="1.826e8 mm**4"),
        CB.step(M_max="65.41 kip*ft", M_A="28.17 kip*ft", M_B="18.17 kip*ft", M_C="39.97 kip*ft"),
        F2_2.step(C_b=1.396, M_p="225.7 kip*ft", F_y="50 ksi", S_x="47.31 in**3", L_b="7.333 ft",
                  L_p="4.121 ft", L_r="11.88 ft"),
        MCRD.step(W_el_y="3.573e7 mm**3", f_y="355 MPa", gamma_M0=1.0),
    ]


# ------------------------------------------------------------------------------ a TeX evaluator
_TOK = re.compile(r"\\[A-Za-z]+|\\.|\d+(?:\.\d+)?|\s+|.", re.S)
_DELIM = re.compile(r"\\(?:left|right|[bB]igg?[lr]?)\s*([()\[\].])")


def _arg(toks, i):
    """(python text of the brace group or single token at toks[i], next index)."""
    while toks[i].isspace():
        i += 1
    if toks[i] != "{":
        return _py(toks[i:i + 1]), i + 1
    depth, j = 0, i
    while True:
        depth += {"{": 1, "}": -1}.get(toks[j], 0)
        if depth == 0:
            return _py(toks[i + 1:j]), j + 1
        j += 1


def _py(toks) -> str:
    """Python expression of a list of TeX tokens (numbers, units as 1, \\frac, \\sqrt, ^, max/min)."""
    out, i = [], 0
    while i < len(toks):
        t = toks[i]
        i += 1
        if t.isspace() or t in (r"\ ", r"\displaystyle", r"\,", r"\;"):
            continue
        if t in (r"\frac",):
            a, i = _arg(toks, i)
            b, i = _arg(toks, i)
            out.append(f"(({a})/({b}))")
        elif t == r"\sqrt":
            a, i = _arg(toks, i)
            out.append(f"(({a})**0.5)")
        elif t in (r"\text", r"\mathrm"):
            _, i = _arg(toks, i)
            out.append("1")
        elif t == "^":
            a, i = _arg(toks, i)
            out.append(f"**({a})")
        elif t in (r"\times", r"\cdot"):
            out.append("*")
        elif t == r"\pi":
            out.append("pi")
        elif t in (r"\max", r"\min"):
            out.append(t[1:])
        elif t == "{":
            out.append("(")
        elif t == "}":
            out.append(")")
        else:
            out.append(t)
    # implicit products: between an operand end and an operand start
    res = []
    for a in out:
        if res and (res[-1][-1:].isalnum() or res[-1].endswith(")")) and not res[-1] in ("max", "min") \
                and (a[:1].isalnum() or a.startswith("(") or a in ("pi", "max", "min")) and not a.startswith("**"):
            res.append("*")
        res.append(a)
    return "".join(res)


def tex_value(tex: str) -> float:
    """Value of a numeric TeX expression (units count as 1)."""
    tex = tex.replace("{}", "").replace(r"{\cdot}", r"\cdot ")
    tex = re.sub(r"\{(\\[bB]igg?[lr]\s*[()\[\]])\}", r"\1", tex)     # {\Biggr)}^{1/2}
    tex = _DELIM.sub(lambda m: "" if m.group(1) == "." else m.group(1), tex)
    return float(eval(_py(_TOK.findall(tex)), {"pi": math.pi, "max": max, "min": min}))


def _unit_si(step, system):
    """Factor turning the displayed result into SI (number parsed back over the SI result)."""
    return step.result / tex_value(L.value_latex(step.result, step.dim, system, sig=12))


# ------------------------------------------------------------------------------ the TeX reader
def test_reader_writes_back_the_same_mathml():
    from latex2mathml.converter import convert

    for s in _steps():
        for tex in (L.step_latex(s, "SI"), L.step_latex(s, "US"), s.latex):
            assert convert(TP.join(TP.parse(tex))) == convert(tex), tex


def test_tidy_is_idempotent_and_keeps_the_value():
    for s in _steps():
        _, sub, _ = L.step_forms(s, "SI")
        t = TP.tidy(sub)
        assert TP.tidy(t) == t
        assert tex_value(t) == pytest.approx(tex_value(sub), rel=REL)
    # flat content loses its stretchy fence; a prefix minus is braced with its operand
    assert TP.tidy(r"\left(a + b\right) = -1") == "(a + b) = {-1}"
    assert r"\left(" in TP.tidy(r"\left(\frac{a}{b}\right)")


@pytest.mark.parametrize("tex, value", [
    (r"\frac{1}{2} + \sqrt{4} \times 3", 6.5), (r"2 (3\ \text{mm}) \max (1, 4)", 24.0),
    (r"\left(\frac{(1)}{(2)}\right)^{2}", 0.25), (r"{-3} (2) - -1", -5.0), (r"\pi^{2}", math.pi ** 2),
    (r"(35.7 \times 10^{6}\ \text{mm}^{3})", 35.7e6), (r"\Bigl( 1 + {} + 2 {\Bigr)}^{1/2}", 3 ** 0.5),
    (r"(2\ \text{kN}{\cdot}\text{m}) / (4)", 0.5), (r"\min \biggl( 3, 2 \biggr)", 2.0),
])
def test_evaluator(tex, value):
    assert tex_value(tex) == pytest.approx(value, rel=REL)


def test_evaluator_agrees_with_a_recorded_step():
    s = MCRD.step(W_el_y="3.573e7 mm**3", f_y="355 MPa", gamma_M0=1.0)
    _, sub, res = L.step_forms(s, "SI")
    assert tex_value(sub) * 1e-6 == pytest.approx(tex_value(res), rel=0.002)   # mm^3 MPa = 1e-6 kN m


# ------------------------------------------------------------------------------ breaking
@pytest.mark.parametrize("avail", [14.0, 20.0, 27.0])
def test_breaking_is_an_identity_and_fits(avail):
    for s in _steps():
        for system in ("SI", "US"):
            _, sub, _ = L.step_forms(s, system)
            t = TP.tidy(sub)
            rows = TB.break_tex(t, avail, step=1.0)
            joined = " ".join((r.rel + " " if r.rel else "") + r.tex for r in rows)
            assert tex_value(joined) == pytest.approx(tex_value(sub), rel=REL), (sub, joined)
            for r in rows:
                assert r.scale >= TB.MIN_SCALE
                room = avail - r.indent
                assert r.width * r.scale <= room * 1.0001 or r.scale == TB.MIN_SCALE, (r, avail)


def test_long_forms_break_without_shrinking_at_column_width():
    # Mcr, A_v, sigma, F2-2: breakable everywhere, so nothing is set smaller at the column width
    for s in _steps():
        _, sub, _ = L.step_forms(s, "SI")
        rows = TB.break_tex(TP.tidy(sub), H.FIT_EM - 3.0, step=1.0)
        if s.symbol != "C_b":
            assert all(r.scale == 1.0 for r in rows), (s.symbol, rows)
        assert len(rows) <= 8


def test_break_points_are_the_preferred_ones():
    rows = TB.break_tex(TP.tidy(L.step_forms(_steps()[1], "SI")[1]), 24.0)
    # A_v = max(eta h_w t_w, A - 2 b t_f + (t_w + 2r) t_f): first break after the comma of max
    assert rows[0].tex.rstrip().endswith(",")
    assert all(not r.rel for r in rows[1:])
    # Mcr: the fraction keeps its leading factors over (kL)^2; the product continues with a times sign
    rows = TB.break_tex(TP.tidy(L.step_forms(_steps()[0], "SI")[1]), 24.0)
    assert rows[0].tex.startswith(r"\frac{(1.835) \pi^{2}")
    assert rows[1].tex.startswith(r"\times")
    assert any("^{1/2}" in r.tex for r in rows)          # the long root written as a power


# ------------------------------------------------------------------------------ HTML rows
def _rows_of(html: str) -> list[str]:
    return [_html.unescape(m) for m in re.findall(r'<div class="ck-eq[^"]*"[^>]*>(?:<span[^>]*>)?\\[(\[](.*?)\\[)\]]',
                                                  html, re.S)]


@pytest.mark.parametrize("system", ["SI", "US"])
def test_rendered_rows_reproduce_the_result(system):
    for s in _steps():
        calc = H.step_math(s, system)
        rows = [r.replace(r"\displaystyle ", "") for r in _rows_of(calc)]
        full = " ".join(rows)
        parts = [p for p in re.split(r"(?<![\\{])=", full)]
        assert parts[0].strip().startswith(TP.tidy(s.symbol_latex).split("_")[0])
        shown = tex_value(parts[-1])
        sub = tex_value(parts[-2])
        one_line_sub = tex_value(L.step_forms(s, system)[1])
        assert sub == pytest.approx(one_line_sub, rel=REL)     # the rows hold the one-line numbers
        # displayed result: the rounded result, to half a unit in its last digit
        txt = L.value_latex(s.result, s.dim, system, sig=s.sig, decimals=s.decimals)
        assert shown == pytest.approx(tex_value(txt), rel=REL)
        assert abs(s.result / _unit_si(s, system) - shown) <= HALF * 10 ** (math.floor(math.log10(abs(shown))) - 2) * 1.0001


def test_long_steps_are_set_in_rows_that_fit():
    for s in _steps():
        calc = H.step_math(s, "SI")
        rows = _rows_of(calc)
        if TP.tex_width(TP.tidy(L.step_latex(s, "SI"))) > H.FIT_EM:
            assert len(rows) >= 2, s.symbol
        for m in re.finditer(r'<div class="(ck-eq[^"]*)"(?: style="padding-left:([\d.]+)em")?>(.*?)</div>', calc, re.S):
            pad = float(m.group(2) or 0) / H._MATH_EM
            tex = _html.unescape(re.search(r"\\\((.*?)\\\)|\\\[(.*?)\\\]", m.group(3), re.S).group(0)[2:-2])
            scale = re.search(r"font-size:(\d+)%", m.group(3))
            f = int(scale.group(1)) / 100 if scale else 1.0
            assert f >= TB.MIN_SCALE
            assert pad + TP.tex_width(tex) * f <= H.FIT_EM * 1.001, (s.symbol, tex)


def test_aligned_rows_put_equals_under_equals():
    s = _steps()[0]
    calc = H.step_math(s, "SI")
    pads = re.findall(r'<div class="ck-eq ck-row[^"]*"(?: style="padding-left:([\d.]+)em")?>', calc)
    rows = _rows_of(calc)
    lhs_pad = TP.tex_width(s.symbol_latex) * H._MATH_EM
    eq_rows = [float(p or 0) for p, r in zip(pads, rows) if r.replace(r"\displaystyle ", "").startswith("=")]
    assert len(eq_rows) >= 1
    assert all(p == pytest.approx(lhs_pad, abs=0.01) for p in eq_rows)
    assert rows[0].replace(r"\displaystyle ", "").startswith(s.symbol_latex + " =")


def test_long_decision_breaks_at_relations():
    from calckit.render import Condition

    chain = Condition("V_Ed_1 <= V_Ed_2 <= V_Ed_3 <= V_b_Rd_max <= V_pl_Rd_total",
                      dims={n: "force" for n in ("V_Ed_1", "V_Ed_2", "V_Ed_3", "V_b_Rd_max", "V_pl_Rd_total")})
    d = chain.step(V_Ed_1="1234.5 kN", V_Ed_2="2345.6 kN", V_Ed_3="3456.7 kN", V_b_Rd_max="4567.8 kN",
                   V_pl_Rd_total="5678.9 kN")
    row = H.decision_rows(d, "SI", "1")
    rows = [r.replace(r"\displaystyle ", "").strip() for r in _rows_of(row)]
    assert len(rows) >= 2
    assert all(r.startswith(r"\le") for r in rows[1:]), rows
    assert " ".join(rows).count(r"\le") == 4


def test_result_cell_wraps_between_symbol_and_value():
    s = MCRD.step(W_el_y="3.573e7 mm**3", f_y="355 MPa", gamma_M0=1.0)
    row = H.step_rows(s, "SI", "5.2")
    cell = re.search(r'<td class="ck-res"[^>]*>(.*?)</td>', row, re.S).group(1)
    assert re.search(r'<span class="ck-rl"[^>]*>\\\(M_\{c,Rd\} =\{\}\\\)</span><wbr><span class="ck-rv"', cell)
    big = given("W_el_y", "3.573e7 mm**3", "modulus")
    cell = re.search(r'<td class="ck-res"[^>]*>(.*?)</td>', H.step_rows(big, "SI"), re.S).group(1)
    assert r"35.7 \times 10^{6}" in _html.unescape(cell)


def test_columns_and_print_css():
    from calckit.render.export import sheet_css

    css = sheet_css()
    widths = dict(re.findall(r"col\.ck-c-(res|ref) \{ width: (\d+)%", css))
    assert int(widths["res"]) >= 22 and int(widths["ref"]) <= 16      # result column wider than before
    assert "overflow-wrap: anywhere" in re.search(r"td\.ck-ref \{[^}]*\}", css).group(0)
    pr = css[css.index("@media print"):]
    assert "overflow: visible" in pr and "auto" not in pr and "scroll" not in pr
    assert re.search(r"tr, td, th, math, figure, img, \.ck-eq", css)      # no formula cut across pages


# ------------------------------------------------------------------------------ engineering notation
@pytest.mark.parametrize("x, sig, trim, text", [
    (3.573e7, 3, False, r"35.7 \times 10^{6}"), (2.68e10, 3, False, r"26.8 \times 10^{9}"),
    (5.912e14, 4, True, r"591.2 \times 10^{12}"), (1.109e9, 4, True, r"1.109 \times 10^{9}"),
    (2.62e-5, 3, False, r"26.2 \times 10^{-6}"), (0.000123, 3, False, r"123 \times 10^{-6}"),
    (999.96e3, 4, True, r"1 \times 10^{6}"), (877600.0, 4, True, "877600"), (0.0012, 3, False, "0.00120"),
    (-3.573e7, 3, False, r"-35.7 \times 10^{6}"),
])
def test_engineering_notation(x, sig, trim, text):
    assert format_number(x, sig=sig, trim=trim) == text


def test_engineering_notation_rule_over_many_magnitudes():
    for k in range(-12, 16):
        for m in (1.0, 1.234, 9.995, 12.34, 123.4, 999.4):
            x = m * 10.0 ** k
            s = format_number(x, sig=3)
            g = re.fullmatch(r"(-?\d+(?:\.\d+)?)(?: \\times 10\^\{(-?\d+)\})?", s)
            assert g, s
            mant, exp = float(g.group(1)), int(g.group(2) or 0)
            if g.group(2):
                assert exp % 3 == 0 and 1 <= abs(mant) < 1000, s
                assert abs(x) >= 1e6 or abs(x) < 1e-3
                assert len(re.sub(r"[^0-9]", "", g.group(1))) == 3, s      # 3 significant figures
            # the shown number is x to 3 significant figures
            assert mant * 10.0 ** exp == pytest.approx(x, rel=0.5e-2 + 1e-12), (x, s)


# ------------------------------------------------------------------------------ Chromium layout
_MEASURE = r"""<script>window.addEventListener('load', function(){ var out=[];
 document.querySelectorAll('td').forEach(function(td){ var r=td.getBoundingClientRect(), worst=0;
   td.querySelectorAll('math, span, div').forEach(function(m){ var q=m.getBoundingClientRect();
     worst=Math.max(worst, q.right-(r.right-1)); });
   if (td.scrollWidth > td.clientWidth + 1) worst = Math.max(worst, td.scrollWidth - td.clientWidth);
   if (td.scrollHeight > td.clientHeight + 1) worst = Math.max(worst, td.scrollHeight - td.clientHeight);
   if (worst > 0.5) out.push(td.className + ' ' + Math.round(worst)); });
 var p=document.createElement('pre'); p.id='ovf'; p.textContent=JSON.stringify(out); document.body.appendChild(p);});
</script>"""


@pytest.mark.skipif(shutil.which("chromium") is None, reason="Debian chromium not installed")
def test_no_cell_overflows_in_chromium(tmp_path):
    import json

    doc = Sheet(system="SI").add(Section("Long formulas", _steps(), number="1"),
                                 Section("US", _steps()[3:5], number="2", system="US")).standalone_html()
    page = tmp_path / "page.html"
    page.write_text(doc.replace("</head>", _MEASURE + "</head>", 1), encoding="utf-8")
    cmd = ["chromium", "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
           "--disable-component-update", "--disable-sync", "--no-first-run",
           f"--user-data-dir={tmp_path / 'profile'}", "--window-size=1100,3000", "--virtual-time-budget=8000",
           "--dump-dom", page.as_uri()]
    r = subprocess.run(cmd, capture_output=True, text=True, timeout=120)
    m = re.search(r'<pre id="ovf">(.*?)</pre>', r.stdout, re.S)
    assert m, r.stderr[-500:]
    assert json.loads(_html.unescape(m.group(1))) == []
