"""Tests of calckit.render.formula and records: Formula, Condition, Step, Decision, Check.

Engineering values: AISC Design Examples v15.1 (companion to ANSI/AISC 360-16; same equations in
360-22), Example F.1-2 (W18x50, A992, Lb = 11.7 ft, Cb = 1.01: phi_b Mn = 305 kip-ft; status M, R in
shared/REFERENCES.md) and Example F.1-1A (Mp = Fy Zx = 421 kip-ft, status P). Section properties of
W18x50 from AISC Manual Table 1-1, 15th ed. (from memory: Zx 101 in3, Sx 88.9 in3, ry 1.65 in).
"""
from __future__ import annotations

import subprocess
import sys

import numpy as np
import pytest

import calckit.render as R
from calckit.errors import InputError, UnitsError
from calckit.render import Check, Condition, Decision, Formula, Step, check, decide, given
from calckit.render.formula import _CACHE, symbol_latex

REL_BOOK = 0.005          # book values are rounded to 3 significant figures (about +-0.5 %)
KIP_FT = 1355.8179483314  # N*m per kip*ft (1 kip = 4448.2216152605 N, 1 ft = 0.3048 m, exact)
KSI = 6.894757293168361e6  # Pa per ksi
IN = 0.0254

MN = Formula("M_n", "F_y*Z_x", dims={"M_n": "moment", "F_y": "stress", "Z_x": "modulus"},
             ref="AISC 360-22 Eq. F2-1")


@pytest.mark.parametrize("name, tex", [
    ("M_u", "M_{u}"), ("phi_b", r"\phi_{b}"), ("L_b", "L_{b}"), ("M_c_Rd", "M_{c,Rd}"),
    ("chi_LT", r"\chi_{LT}"), ("lam_bar_LT", r"\bar{\lambda}_{LT}"), ("C_v1", "C_{v1}"),
    ("Delta", r"\Delta"), ("gamma_M1", r"\gamma_{M1}"), ("Zx", "Zx"), ("alpha_LT", r"\alpha_{LT}"),
])
def test_symbol_latex_derived_from_name(name, tex):
    assert symbol_latex(name) == tex


def test_explicit_latex_map_wins():
    f = Formula("M_cRd", "W_pl*f_y/gamma_M0", latex={"M_cRd": r"M_{c,\mathrm{Rd}}"},
                dims={"M_cRd": "moment", "W_pl": "modulus", "f_y": "stress"})
    assert f.latex().startswith(r"M_{c,\mathrm{Rd}} = ")
    assert r"\gamma_{M0}" in f.latex()


def test_import_and_definition_do_not_import_sympy():
    code = ("import sys, calckit, calckit.render as R\n"
            "f = R.Formula('M_n', 'F_y*Z_x', dims={'M_n': 'moment', 'F_y': 'stress', 'Z_x': 'modulus'})\n"
            "c = R.Condition('L_p < L_b', dims={'L_p': 'span', 'L_b': 'span'})\n"
            "assert 'sympy' not in sys.modules, 'sympy imported'\n"
            "assert 'pint' not in sys.modules, 'pint imported'\n"
            "f(F_y=1.0, Z_x=2.0)\n"
            "assert 'sympy' in sys.modules\n")
    r = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True)
    assert r.returncode == 0, r.stderr


def test_compiled_form_is_cached_per_formula_text():
    a = Formula("x", "a*b + c")
    b = Formula("y", "a*b + c")
    a(a=1.0, b=2.0, c=3.0)
    n = len(_CACHE)
    assert b(a=1.0, b=2.0, c=3.0) == 5.0
    assert len(_CACHE) == n
    assert a._compiled() is b._compiled()


def test_evaluates_scalars_and_arrays():
    x = np.linspace(1.0, 2.0, 300)
    y = MN(F_y=x, Z_x=2 * x)
    np.testing.assert_allclose(y, 2 * x * x)
    assert MN(F_y=2.0, Z_x=3.0) == 6.0


def test_step_records_formula_inputs_and_result():
    s = MN.step(F_y="50 ksi", Z_x="101 in**3")
    assert isinstance(s, Step)
    assert s.symbol == "M_n" and s.dim == "moment" and s.reference == "AISC 360-22 Eq. F2-1"
    assert s.inputs["F_y"] == (pytest.approx(50 * KSI), "stress")
    # AISC Design Examples F.1-1A: Mp = Fy Zx = 421 kip-ft (P)
    assert s.result / KIP_FT == pytest.approx(421, rel=REL_BOOK)
    assert s.latex == "F_{y} Z_{x}"


def test_step_accepts_earlier_steps_and_checks_their_dimension():
    mp = MN.step(F_y="50 ksi", Z_x="101 in**3")
    phi = Formula("M_c", "phi_b*M_n", dims={"M_c": "moment", "M_n": "moment"})
    assert phi.step(phi_b=0.9, M_n=mp).result == pytest.approx(0.9 * mp.result)
    area = given("A", "14.7 in**2", "area")
    with pytest.raises(UnitsError, match="M_n"):
        phi.step(phi_b=0.9, M_n=area)


# ------------------------------------------------------------------------------------ bad input
def test_missing_value_names_the_symbol():
    with pytest.raises(InputError, match="Z_x"):
        MN.step(F_y="50 ksi")
    with pytest.raises(InputError, match="Z_x"):
        MN(F_y=1.0)


def test_wrong_dimension_names_the_symbol():
    with pytest.raises(UnitsError, match="Z_x"):
        MN.step(F_y="50 ksi", Z_x="101 in**2")
    with pytest.raises(UnitsError, match="F_y"):
        MN.step(F_y="50 kip", Z_x="101 in**3")


def test_unknown_input_names_it():
    with pytest.raises(InputError, match="S_x"):
        MN.step(F_y="50 ksi", Z_x="101 in**3", S_x="88.9 in**3")


def test_bad_dimension_name_in_definition():
    with pytest.raises(InputError, match="F_y"):
        Formula("M", "F_y*Z_x", dims={"F_y": "stres"})
    with pytest.raises(InputError, match="Q"):
        Formula("M", "F_y*Z_x", dims={"Q": "stress"})


def test_inconsistent_dimensions_are_caught_on_first_step():
    f = Formula("M", "F_y*A", dims={"M": "moment", "F_y": "stress", "A": "area"})
    with pytest.raises(UnitsError, match="M"):
        f.step(F_y=1.0, A=1.0)
    g = Formula("R", "1.392*D*L", dims={"R": "force", "L": "length"}, check_units=False)
    assert g.step(D=5, L="1 in").result == pytest.approx(1.392 * 5 * IN)


def test_fast_path_refuses_quantities_naming_the_symbol():
    with pytest.raises(InputError, match="F_y"):
        MN(F_y="50 ksi", Z_x=1.0)


def test_array_given_to_step_is_refused():
    with pytest.raises(InputError, match="F_y"):
        MN.step(F_y=np.ones(3), Z_x=1.0)


# ------------------------------------------------------------------------------------ conditions
ZONE2 = Condition("L_p < L_b <= L_r", dims={"L_p": "span", "L_b": "span", "L_r": "span"},
                  then="inelastic lateral-torsional buckling applies", otherwise="F2-2 does not apply",
                  ref="AISC 360-22 F2.2(b)")


def test_condition_holds_and_records_numbers():
    d = ZONE2.step(L_p="5.83 ft", L_b="11.7 ft", L_r="16.9 ft")
    assert isinstance(d, Decision) and d.holds and bool(d)
    assert d.conclusion == "inelastic lateral-torsional buckling applies"
    tex = R.decision_latex(d, "US")
    assert tex == r"L_{p} = 5.83\ \text{ft} < L_{b} = 11.7\ \text{ft} \le L_{r} = 16.9\ \text{ft}"


def test_condition_false_shows_actual_relation():
    d = ZONE2.step(L_p="5.83 ft", L_b="20 ft", L_r="16.9 ft")
    assert not d.holds and d.conclusion == "F2-2 does not apply"
    assert r"L_{b} = 20.0\ \text{ft} > L_{r}" in R.decision_latex(d, "US")
    assert ZONE2(L_p=1.0, L_b=2.0, L_r=2.0) is True


def test_condition_compound_side_and_close_values_distinct():
    web = Condition("h/t_w <= 2.24*sqrt(E/F_y)", dims={"h": "length", "t_w": "length", "E": "stress",
                                                      "F_y": "stress"})
    d = web.step(h="15.4 in", t_w="0.25 in", E="29000 ksi", F_y="50 ksi")
    assert not d.holds
    assert r"\sqrt{\frac{E}{F_{y}}}" in R.decision_latex(d)
    near = Condition("a < b").step(a=9.1512, b=9.1534)
    tex = R.decision_latex(near)
    assert "9.151" in tex and "9.153" in tex


def test_condition_missing_symbol():
    with pytest.raises(InputError, match="L_r"):
        ZONE2.step(L_p="5.83 ft", L_b="11.7 ft")


# ------------------------------------------------------------------------------------ checks
def test_check_ratio_status_and_steps():
    cap = given("phi_b M_n", "305 kip*ft", "moment", latex=r"\phi_{b} M_{n}")
    dem = given("M_u", "266 kip*ft", "moment")
    c = check("Flexure", dem, cap, reference="AISC 360-22 F2")
    assert isinstance(c, Check) and c.passed and c.status == R.OK
    assert c.ratio == pytest.approx(266 / 305)
    assert c.steps == (dem, cap)
    bad = check("Flexure", given("M_u", "400 kip*ft", "moment"), cap)
    assert not bad.passed and bad.status == R.NOT_OK
    assert check("zero", (0.0, "force"), (0.0, "force")).ratio == 0.0
    assert check("inf", (1.0, "force"), (0.0, "force")).status == R.NOT_OK


def test_check_refuses_mismatched_dimensions():
    with pytest.raises(InputError, match="capacity"):
        check("x", given("M_u", "1 kip*ft", "moment"), given("V", "1 kip", "force"))


def test_decide_in_words():
    d = decide("doubly symmetric I-shape, so AISC 360-22 F2 applies", reference="AISC 360-22 Table F1.1")
    assert d.holds and d.sides == ()


def test_usage_example_in_package_docstring_runs():
    """The usage section of calckit.render is the design engineers' template: it must run and give
    AISC Design Examples F.1-2 (Lb 11.7 ft, Cb 1.01): phi_b Mn = 305 kip-ft (M, R)."""
    doc = R.__doc__
    code = doc[doc.index("    from calckit.render"):doc.index("Records (frozen")]
    code = "\n".join(line[4:] for line in code.splitlines())
    ns: dict = {}
    exec(compile(code, "usage", "exec"), ns)
    c = ns["flexure"]("50 ksi", "101 in**3", "88.9 in**3", "11.7 ft", "5.83 ft", "16.9 ft", 1.01,
                      "266 kip*ft")
    assert c.capacity / KIP_FT == pytest.approx(305, rel=REL_BOOK)
    assert c.passed
    assert [type(s).__name__ for s in c.steps] == ["Step", "Decision", "Step", "Step", "Step"]
