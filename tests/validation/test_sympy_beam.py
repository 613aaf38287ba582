"""Validation of calckit.analysis against sympy's symbolic beam solver.

Reference: SymPy development team, SymPy 1.14, module ``sympy.physics.continuum_mechanics.beam``,
class ``Beam`` (singularity-function solution with exact rational arithmetic). Documented sign
convention used here: loads positive downward, so sympy's reaction forces come out negative when
upward; its bending moment is sagging positive, its shear is the sum of upward forces to the left of
the section (as calckit's), its deflection follows the loads (downward positive, as calckit's) and a
positive moment load (order -2) is counterclockwise in this convention, i.e. minus calckit's clockwise
couple; its moment reactions likewise are minus calckit's.

Each layout is built in both libraries from the same exact rational inputs; reactions, V, M and
deflection at a few stations must agree to a relative error of REL (relative to the largest magnitude
of that quantity at the stations, so that values near zero do not inflate the error).
"""
from __future__ import annotations

from fractions import Fraction

import pytest

sympy = pytest.importorskip("sympy")
from sympy.physics.continuum_mechanics.beam import Beam as SympyBeam  # noqa: E402

from calckit import Beam  # noqa: E402

REL = 1e-9
EI = 5_000_000  # N*m**2, exact integer so that sympy stays rational


def _q(v, unit):
    return f"{float(v)!r} {unit}"


def build(spans, supports, loads, hinges=()):
    """Both models from one description. loads: ('P', P, x) | ('M', M, x) | ('w', w1, w2, a, b)."""
    cb = Beam([_q(s, "m") for s in spans], supports, EI=f"{EI} N*m**2", hinges=[_q(h, "m") for h in hinges])
    L = sum(Fraction(s) for s in spans)
    sb = SympyBeam(sympy.Rational(L), EI, 1)
    unknowns = []
    x = 0
    for i, kind in enumerate(supports):
        if i:
            x += Fraction(spans[i - 1])
        if kind == "free":
            continue
        r = sb.apply_support(sympy.Rational(x), "roller" if kind == "roller" else kind)
        unknowns.extend(r if isinstance(r, tuple) else (r,))
    for h in hinges:
        sb.apply_rotation_hinge(sympy.Rational(Fraction(h)))
    R = sympy.Rational
    for ld in loads:
        if ld[0] == "P":
            _, P, xp = ld
            cb.point(_q(P, "N"), _q(xp, "m"), "D")
            sb.apply_load(R(Fraction(P)), R(Fraction(xp)), -1)
        elif ld[0] == "M":
            _, M, xm = ld
            cb.moment(_q(M, "N*m"), _q(xm, "m"), "D")
            sb.apply_load(-R(Fraction(M)), R(Fraction(xm)), -2)
        else:
            _, w1, w2, a, b = ld
            cb.linear(_q(w1, "N/m"), _q(w2, "N/m"), _q(a, "m"), _q(b, "m"), "D")
            a_, b_, w1_, w2_ = (R(Fraction(v)) for v in (a, b, w1, w2))
            sb.apply_load(w1_, a_, 0, end=b_)
            if w2_ != w1_:
                sb.apply_load((w2_ - w1_) / (b_ - a_), a_, 1, end=b_)
    sb.solve_for_reaction_loads(*unknowns)
    return cb, sb


def _close(ours, theirs, what):
    scale = max(max(abs(t) for t in theirs), 1e-300)
    for o, t in zip(ours, theirs):
        assert abs(o - t) <= REL * scale, f"{what}: calckit {o!r} vs sympy {t!r}"


def compare(cb, sb, stations):
    res = cb.solve()["D"]
    x = sb.variable
    V, M, D = sb.shear_force(), sb.bending_moment(), sb.deflection()
    # reactions: sympy names them R_<x> and M_<x>; upward sympy reaction is negative
    rl = {str(k): float(v) for k, v in sb.reaction_loads.items()}
    ours_R, theirs_R = [], []
    for r in res.reactions:
        if r.kind == "free":
            continue
        key = f"{sympy.nsimplify(r.x)}"
        ours_R.append(r.R)
        theirs_R.append(-rl[f"R_{key}"])
        if r.kind == "fixed":
            ours_R.append(r.M)
            theirs_R.append(-rl[f"M_{key}"])
    _close(ours_R, theirs_R, "reactions")
    xs = [sympy.Rational(Fraction(s)) for s in stations]
    _close([res.V_si(float(s)) for s in xs], [float(V.subs(x, s)) for s in xs], "V")
    _close([res.M_si(float(s)) for s in xs], [float(M.subs(x, s)) for s in xs], "M")
    _close([res.deflection_si(float(s)) for s in xs], [float(D.subs(x, s)) for s in xs], "deflection")


def test_overhang_left_with_partial_linear_and_tip_load():
    cb, sb = build(["2", "6"], ["free", "pin", "roller"],
                   [("w", 3000, 3000, 0, 8), ("P", 8000, 0), ("w", 1000, 4000, "3.5", "7.25"), ("M", 5000, 5)])
    compare(cb, sb, ["0.5", "1.9", "3.1", "5.3", "7.7"])


def test_propped_cantilever_partial_udl_point_and_couple():
    cb, sb = build(["7"], ["fixed", "roller"],
                   [("w", 5000, 5000, 1, 4), ("P", 12000, 5), ("M", -7000, 6)])
    compare(cb, sb, ["0.3", "2.2", "4.6", "5.5", "6.8"])


def test_fixed_fixed_triangle_and_point():
    cb, sb = build(["6"], ["fixed", "fixed"], [("w", 0, 9000, 0, 6), ("P", 15000, 2)])
    compare(cb, sb, ["0.4", "1.7", "2.9", "4.1", "5.9"])


def test_two_spans_load_across_support_and_trapezoid():
    cb, sb = build(["5", "7"], ["pin", "roller", "roller"],
                   [("w", 4000, 4000, 3, 9), ("P", 20000, 2), ("w", 2000, 6000, 6, 12)])
    compare(cb, sb, ["1.1", "2.6", "4.9", "6.3", "9.4", "11.2"])


def test_three_spans_mixed():
    cb, sb = build(["4", "5", "4"], ["pin", "roller", "roller", "roller"],
                   [("w", 2500, 2500, 0, 13), ("w", 0, 5000, "4.5", "8.5"), ("P", 9000, "2.5"),
                    ("P", 6000, 11), ("M", 4000, 7)])
    compare(cb, sb, ["0.7", "3.3", "5.6", "7.4", "9.8", "12.1"])


def test_cantilever_with_hinge_and_propping_roller():
    # Gerber-type beam: fixed at 0, internal hinge at 3 m, roller at 8 m
    cb, sb = build(["8"], ["fixed", "roller"], [("w", 2000, 2000, 0, 8), ("w", 0, 4000, 4, 8), ("P", 5000, 6)],
                   hinges=["3"])
    compare(cb, sb, ["0.5", "2.5", "3.5", "5.5", "7.5"])


def test_fixed_end_continuous_with_overhang_right():
    cb, sb = build(["5", "6", "2"], ["fixed", "roller", "pin", "free"],
                   [("w", 3000, 3000, 0, 13), ("P", 10000, 13), ("w", 6000, 1000, 2, 10)])
    compare(cb, sb, ["1.2", "4.4", "6.6", "9.9", "12.5"])
