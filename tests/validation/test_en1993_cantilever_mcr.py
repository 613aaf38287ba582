"""Elastic critical moment of cantilevers (calckit.design.en1993.cantilever) against published and
independent solutions.

Sources
-------
[TG]  S. P. Timoshenko and J. M. Gere, Theory of Elastic Stability, 2nd ed., McGraw-Hill, 1961, chapter 6
      (lateral buckling of beams), FROM MEMORY (section, equation and table numbers not checked):
      - narrow rectangular cantilever (I_w = 0), load P at the free end at the centroid:
        P_cr = 4.013 sqrt(E I_z G I_t) / L^2;
      - the same with a uniformly distributed load q: (q L)_cr = 12.85 sqrt(E I_z G I_t) / L^2, i.e.
        M_cr = q L^2 / 2 = 6.43 sqrt(E I_z G I_t) / L = 2.05 pi sqrt(E I_z G I_t) / L;
      - I-section cantilever, built in (warping prevented) at the root, end load at the centroid:
        P_cr = gamma_1 sqrt(E I_z G I_t) / L^2 with gamma_1 tabulated against L^2 G I_t / (E I_w):
        0.1: 44.3, 1: 15.7, 4: 9.76, 10: 7.58, 16: 6.73, 32: 5.87, 64: 5.27, 128: 4.85, 400: 4.41.
[EXACT] The two I_w = 0 values follow from the differential equation G I_t phi'' + M^2/(E I_z) phi = 0
      with phi(root) = 0, phi'(tip) = 0 (the classical derivation in [TG]): for M = P s^n/... the
      solution is sqrt(s) J_{-1/(2n+2)}(k s^(n+1)/(n+1)), so P_cr L^2/sqrt(E I_z G I_t) = 2 j_{-1/4} and
      (q L)_cr L^2/sqrt(E I_z G I_t) = 6 j_{-1/6}, j_nu the first zero of the Bessel function J_nu,
      computed here with scipy.special.jv and scipy.optimize.brentq (reference library).
[BVP] With warping and load height, the torsion equation of the buckled cantilever after eliminating the
      lateral deflection (E I_z u'' = -M phi):
          E I_w phi'''' - G I_t phi'' - (M^2/(E I_z)) phi - q z_g phi = 0,
      root phi = phi' = 0, tip phi'' = 0 and G I_t phi' - E I_w phi''' = P z_g phi, solved as an
      eigenvalue problem with scipy.integrate.solve_bvp (collocation; reference library). This is an
      independent method (differential equation, loads at height z_g applied directly), not the energy
      discretisation under test.
[FE]  For an overhang solved with its back segment there is no closed form: the check is against a fine
      mesh of an independent finite-element implementation written in this file (40 + 40 elements, load
      height applied directly as -1/2 q z_g phi^2, not through M).

Tolerances: REL_TG = 2 % ([TG] values from memory, tabulated to three figures); REL_TG_CW0 = 0.1 %
(4.013 and 12.85 are quoted to four figures); REL_EXACT = 0.05 % and REL_BVP = 0.05 % (the energy
solution is an upper bound converged to about 0.01 %); REL_FE = 0.3 % (8 + 8 elements against 40 + 40).
"""
from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.integrate import solve_bvp
from scipy.optimize import brentq
from scipy.special import jv

import calckit
from calckit.design.en1993.cantilever import model

REL_TG = 0.02
REL_TG_CW0 = 1e-3
REL_EXACT = 5e-4
REL_BVP = 5e-4
REL_FE = 3e-3
REL_LIMIT = 5e-3  # warping-fixed cantilever with L^2 G I_t/(E I_w) = 1e6 against the I_w = 0 value

TIP = (lambda s: -(1.0 - np.asarray(s)))  # L = 1, P = 1: M = -P (L - s), s from the root
UDL = (lambda s: -(1.0 - np.asarray(s)) ** 2 / 2)  # q = 1: M = -q (L - s)^2 / 2; peak q L^2 / 2 = 0.5


def gamma_tip(K: float | None, zg: float = 0.0) -> float:
    """P_cr L^2/sqrt(EI GJ) for L = EI = GJ = 1 and E I_w = 1/K (None: I_w = 0)."""
    return model(1.0, TIP).mcr(1.0, 1.0, 0.0 if K is None else 1.0 / K, zg=zg)


def gamma_udl(K: float | None, zg: float = 0.0) -> float:
    """(q L)_cr L^2/sqrt(EI GJ) for L = EI = GJ = 1."""
    return model(1.0, UDL).mcr(1.0, 1.0, 0.0 if K is None else 1.0 / K, zg=zg) / 0.5


def test_narrow_rectangle_tip_load_TG():
    assert gamma_tip(None) == pytest.approx(4.013, rel=REL_TG_CW0)


def test_narrow_rectangle_uniform_load_TG():
    g = gamma_udl(None)
    assert g == pytest.approx(12.85, rel=REL_TG_CW0)
    assert g / 2 / math.pi == pytest.approx(2.05, rel=3e-3)  # M_cr / (pi sqrt(EI GJ)/L), two figures


def test_narrow_rectangle_exact_bessel():
    j4 = brentq(lambda t: jv(-0.25, t), 1.0, 3.0)
    j6 = brentq(lambda t: jv(-1.0 / 6.0, t), 1.0, 3.0)
    assert gamma_tip(None) == pytest.approx(2 * j4, rel=REL_EXACT)
    assert gamma_udl(None) == pytest.approx(6 * j6, rel=REL_EXACT)


@pytest.mark.parametrize("K,g1", [(0.1, 44.3), (1, 15.7), (4, 9.76), (10, 7.58), (16, 6.73), (32, 5.87),
                                  (64, 5.27), (128, 4.85), (400, 4.41)])
def test_I_beam_cantilever_end_load_TG_table(K, g1):
    assert gamma_tip(K) == pytest.approx(g1, rel=REL_TG)


def test_large_torsion_parameter_tends_to_the_narrow_rectangle():
    vals = [gamma_tip(K) for K in (1e2, 1e3, 1e4, 1e6)]
    assert vals == sorted(vals, reverse=True)
    assert vals[-1] == pytest.approx(gamma_tip(None), rel=REL_LIMIT) and vals[-1] > gamma_tip(None)


def _bvp(K: float, load: str, a: float, guess: float) -> float:
    """[BVP]: critical P (tip) or q (UDL) of the built-in cantilever with L = EI_z = GI_t = 1, EI_w = 1/K."""
    C, C1, B = 1.0, 1.0 / K, 1.0

    def fun(x, y, p):
        P = p[0]
        M = -P * (1 - x) if load == "tip" else -P * (1 - x) ** 2 / 2
        q = 0.0 if load == "tip" else P
        return np.vstack([y[1], y[2], y[3], (C * y[2] + M ** 2 / B * y[0] + q * a * y[0]) / C1])

    def bc(ya, yb, p):
        Pt = p[0] if load == "tip" else 0.0
        return np.array([ya[0], ya[1], yb[2], C * yb[1] - C1 * yb[3] - Pt * a * yb[0], yb[0] - 1.0])

    x = np.linspace(0.0, 1.0, 400)
    c = np.pi / 2
    y = np.vstack([1 - np.cos(c * x), c * np.sin(c * x), c ** 2 * np.cos(c * x), -c ** 3 * np.sin(c * x)])
    sol = solve_bvp(fun, bc, x, y, p=[guess], tol=1e-8, max_nodes=200000)
    assert sol.success, sol.message
    return float(sol.p[0])


@pytest.mark.parametrize("K", [0.5, 4.0, 30.0, 300.0])
@pytest.mark.parametrize("load", ["tip", "udl"])
@pytest.mark.parametrize("flange", [-1, 0, 1])
def test_warping_and_load_height_against_bvp(K, load, flange):
    a = flange / math.sqrt(K)  # an I-section flange: z_g = h/2 = sqrt(E I_w / E I_z) = 1/sqrt(K) here
    g = gamma_tip(K, a) if load == "tip" else gamma_udl(K, a)
    ref = _bvp(K, load, a, 1.03 * g)
    assert g == pytest.approx(ref, rel=REL_BVP)
    assert g >= ref * (1 - 1e-6)  # the energy solution is an upper bound


# -- [FE] an independent Hermite-element model of the whole overhang-and-back-span -------------------
def _hermite(t, h):
    N = np.array([1 - 3 * t ** 2 + 2 * t ** 3, h * (t - 2 * t ** 2 + t ** 3), 3 * t ** 2 - 2 * t ** 3,
                  h * (t ** 3 - t ** 2)])
    d1 = np.array([-6 * t + 6 * t ** 2, h * (1 - 4 * t + 3 * t ** 2), 6 * t - 6 * t ** 2,
                   h * (3 * t ** 2 - 2 * t)]) / h
    d2 = np.array([-6 + 12 * t, h * (6 * t - 4), 6 - 12 * t, h * (6 * t - 2)]) / h ** 2
    return N, d1, d2


def _fe_overhang(EIz, GIt, EIw, Lb, Lo, w, zg, ne=40):
    """Critical UDL factor of a beam on supports at 0 and Lb (u = phi = 0) with an overhang to Lb + Lo,
    load w everywhere at height zg: -1/2 int q zg phi^2 applied directly."""
    L = Lb + Lo
    RA = (w * Lb ** 2 / 2 - w * Lo ** 2 / 2) / Lb
    xn = np.concatenate([np.linspace(0, Lb, ne + 1), np.linspace(Lb, L, ne + 1)[1:]])
    nd = 4 * xn.size
    K = np.zeros((nd, nd))
    Gm = np.zeros((nd, nd))
    gx, gw = np.polynomial.legendre.leggauss(5)
    for e in range(xn.size - 1):
        h = xn[e + 1] - xn[e]
        iu = [4 * e, 4 * e + 1, 4 * e + 4, 4 * e + 5]
        ip = [4 * e + 2, 4 * e + 3, 4 * e + 6, 4 * e + 7]
        for xg, wg in zip(gx, gw):
            t = (xg + 1) / 2
            x = xn[e] + t * h
            N, d1, d2 = _hermite(t, h)
            M = RA * x - w * x ** 2 / 2 if x <= Lb else -w * (L - x) ** 2 / 2
            f = wg * h / 2
            K[np.ix_(iu, iu)] += f * EIz * np.outer(d2, d2)
            K[np.ix_(ip, ip)] += f * (GIt * np.outer(d1, d1) + EIw * np.outer(d2, d2))
            Cb = f * M * np.outer(d2, N)
            Gm[np.ix_(iu, ip)] += Cb
            Gm[np.ix_(ip, iu)] += Cb.T
            Gm[np.ix_(ip, ip)] += -f * zg * w * np.outer(N, N)
    free = [i for i in range(nd) if i not in (0, 2, 4 * ne, 4 * ne + 2)]
    K, Gm = K[np.ix_(free, free)], Gm[np.ix_(free, free)]
    Li = np.linalg.inv(np.linalg.cholesky(K))
    S = Li @ Gm @ Li.T
    return -1.0 / np.linalg.eigvalsh(0.5 * (S + S.T))[0]


@pytest.mark.parametrize("name,Lb,Lo", [("IPE 300", 6.0, 2.0), ("IPE 300", 3.0, 2.0), ("HEB 300", 2.0, 4.0)])
def test_overhang_with_back_span_against_fine_fe(name, Lb, Lo):
    si = calckit.section(name).si
    E, G = 210e9, 210e9 / 2.6
    w = 1.0
    RA = (w * Lb ** 2 / 2 - w * Lo ** 2 / 2) / Lb
    Mo = (lambda s: -w * (Lo - np.asarray(s)) ** 2 / 2)
    Mb = (lambda t: RA * np.asarray(t) - w * np.asarray(t) ** 2 / 2)
    m = model(Lo, Mo, (Lb, Mb))
    for zg in (-si.d / 2, 0.0, si.d / 2):
        got = m.mcr(E * si.Iy, G * si.J, E * si.Cw, zg=zg)
        ref = _fe_overhang(E * si.Iy, G * si.J, E * si.Cw, Lb, Lo, w, zg) * w * Lo ** 2 / 2
        assert got == pytest.approx(ref, rel=REL_FE)
