"""Property tests of the beam solver on random stable layouts.

1. Statics: reactions balance the loads (forces and moments about x = 0) to EQ_REL, computed from the
   load definitions, not from the solver's internals.
2. Independent numerical solution: scipy.integrate.solve_bvp (SciPy 1.x; 4th-order collocation) of the
   first-order system  d(delta)/dx = phi, d(phi)/dx = -M/EI, dM/dx = V, dV/dx = -w  (i.e. EI v'''' = w)
   on every segment between load, hinge and support positions, with the reactions as unknown
   parameters, continuity and jump conditions at the nodes and the support conditions. V, M and the
   deflection must agree to BVP_REL of each quantity's largest magnitude.
"""
from __future__ import annotations

import numpy as np
import pytest
from hypothesis import HealthCheck, assume, given, settings, strategies as st

from calckit import Beam
from calckit.analysis import Couple, LinearLoad, PointLoad, UnstableError

scipy_integrate = pytest.importorskip("scipy.integrate")

EQ_REL = 1e-9
BVP_REL = 1e-4
BVP_TOL = 1e-9


# -- random layouts -------------------------------------------------------------------------------
def mag(lo, hi):
    """Load magnitudes on a 0.05 grid (no denormal-size loads, which no tolerance can judge)."""
    return st.integers(int(lo * 20), int(hi * 20)).map(lambda i: i / 20)


@st.composite
def layouts(draw):
    n = draw(st.integers(1, 3))
    spans = [draw(st.sampled_from([1.0, 1.5, 2.0, 2.5, 3.0, 4.0])) for _ in range(n)]
    kinds = st.sampled_from(["pin", "roller", "fixed", "free", "spring"])
    supports = []
    for _ in range(n + 1):
        k = draw(kinds)
        supports.append(f"{draw(st.sampled_from([2.0, 20.0, 200.0]))} N/m" if k == "spring" else k)
    EI = [draw(st.sampled_from([1.0, 2.0, 5.0])) for _ in range(n)]
    L = sum(spans)
    grid = lambda: draw(st.integers(0, 40)) * L / 40  # noqa: E731  positions on a 1/40 grid
    hinges = []
    if draw(st.booleans()):
        xh = draw(st.integers(1, 39)) * L / 40
        nodes = np.concatenate(([0.0], np.cumsum(spans)))
        at_fixed = any(abs(xh - xn) < 1e-9 and k == "fixed" for xn, k in zip(nodes, supports))
        hinges = [] if at_fixed else [xh]  # a hinge at a fixed support is refused (tested elsewhere)
    loads = []
    for _ in range(draw(st.integers(1, 5))):
        kind = draw(st.sampled_from(["P", "M", "udl", "lin"]))
        if kind == "P":
            loads.append(("P", draw(mag(-2, 3)), grid()))
        elif kind == "M":
            loads.append(("M", draw(mag(-2, 2)), grid()))
        else:
            a, b = sorted((grid(), grid()))
            assume(b - a > 0)
            w1 = draw(mag(-1, 2))
            w2 = w1 if kind == "udl" else draw(mag(-1, 2))
            loads.append(("w", w1, w2, a, b))
    return spans, supports, EI, hinges, loads


def make(spans, supports, EI, hinges, loads):
    b = Beam([f"{s} m" for s in spans], supports, EI=[f"{e} N*m**2" for e in EI], hinges=[f"{h} m" for h in hinges])
    for ld in loads:
        if ld[0] == "P":
            b.point(f"{ld[1]} N", f"{ld[2]} m", "D")
        elif ld[0] == "M":
            if any(abs(ld[2] - h) < 1e-12 for h in hinges):
                continue  # a couple at a hinge is refused by design
            b.moment(f"{ld[1]} N*m", f"{ld[2]} m", "D")
        else:
            b.linear(f"{ld[1]} N/m", f"{ld[2]} N/m", f"{ld[3]} m", f"{ld[4]} m", "D")
    return b


def build_or_skip(layout):
    try:
        b = make(*layout)
    except UnstableError:
        assume(False)
    assume(len(b.loads) > 0)
    return b


# -- independent reference: solve_bvp -------------------------------------------------------------
def bvp_reference(beam):
    from scipy.integrate import solve_bvp

    lay = beam.layout
    loads = beam.loads
    L = lay.L
    pts = set(lay.nodes) | set(lay.hinges)
    for ld in loads:
        pts |= {ld.start, ld.end} if isinstance(ld, LinearLoad) else {ld.x}
    nodes = np.array(sorted(pts))
    nodes = nodes[np.concatenate(([True], np.diff(nodes) > 1e-12 * L))]
    S = len(nodes) - 1
    h = np.diff(nodes)
    mid = 0.5 * (nodes[:-1] + nodes[1:])
    EI = np.array([lay.EI[int(np.clip(np.searchsorted(lay.nodes, m) - 1, 0, lay.n_spans - 1))] for m in mid])
    wa, wb = np.zeros(S), np.zeros(S)  # w on segment e = wa + wb * s, s in [0, 1]
    for ld in loads:
        if isinstance(ld, LinearLoad):
            for e in range(S):
                if ld.start - 1e-12 <= nodes[e] and nodes[e + 1] <= ld.end + 1e-12:
                    wa[e] += ld.at(nodes[e])
                    wb[e] += ld.at(nodes[e + 1]) - ld.at(nodes[e])

    def node_of(x):
        return int(np.argmin(np.abs(nodes - x)))

    F = np.zeros(S + 1)  # applied upward forces at nodes
    Cn = np.zeros(S + 1)  # applied clockwise couples at nodes
    for ld in loads:
        if isinstance(ld, PointLoad):
            F[node_of(ld.x)] -= ld.P
        elif isinstance(ld, Couple):
            Cn[node_of(ld.x)] += ld.M
    params = []  # (kind, support, node)
    for s in lay.supports:
        if s.vertical:
            params.append(("R", s, node_of(s.x)))
    for s in lay.supports:
        if s.rotational:
            params.append(("C", s, node_of(s.x)))
    hinge_nodes = {node_of(x) for x in lay.hinges}

    def fun(x, y, p):
        dy = np.empty_like(y)
        for e in range(S):
            d, ph, M, V = y[4 * e:4 * e + 4]
            dy[4 * e] = h[e] * ph
            dy[4 * e + 1] = -h[e] * M / EI[e]
            dy[4 * e + 2] = h[e] * V
            dy[4 * e + 3] = -h[e] * (wa[e] + wb[e] * x)
        return dy

    def bc(ya, yb, p):
        Fn, Cc = F.copy(), Cn.copy()
        for val, (kind, s, j) in zip(p, params):
            if kind == "R":
                Fn[j] += val
            else:
                Cc[j] += val
        res = [ya[3] - Fn[0], ya[2] - Cc[0]]
        for i in range(1, S):
            l, r = 4 * (i - 1), 4 * i
            res.append(ya[r] - yb[l])
            res.append(yb[l + 2] if i in hinge_nodes else ya[r + 1] - yb[l + 1])
            res.append(ya[r + 2] - yb[l + 2] - Cc[i])
            res.append(ya[r + 3] - yb[l + 3] - Fn[i])
        res.append(yb[4 * (S - 1) + 3] + Fn[S])
        res.append(yb[4 * (S - 1) + 2] + Cc[S])
        for val, (kind, s, j) in zip(p, params):
            d = ya[4 * j] if j < S else yb[4 * (S - 1)]
            ph = ya[4 * j + 1] if j < S else yb[4 * (S - 1) + 1]
            if kind == "R":
                res.append(d - (val / s.k if s.kind == "spring" else 0.0))
            else:
                res.append(ph)
        return np.array(res)

    xm = np.linspace(0, 1, 21)
    sol = solve_bvp(fun, bc, xm, np.zeros((4 * S, xm.size)), p=np.zeros(len(params)), tol=BVP_TOL,
                    max_nodes=200000)
    assert sol.success, sol.message

    def at(x):
        e = int(np.clip(np.searchsorted(nodes, x, side="right") - 1, 0, S - 1))
        return sol.sol((x - nodes[e]) / h[e])[4 * e:4 * e + 4]

    return at, nodes


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(layouts())
def test_random_layouts_satisfy_statics(layout):
    b = build_or_skip(layout)
    r = b.solve()["D"]
    Fsum, Msum, scale = 0.0, 0.0, 0.0
    for rc in r.reactions:  # moments about x = 0, counterclockwise positive
        Fsum += rc.R
        Msum += rc.R * rc.x - rc.M
        scale += abs(rc.R) * (1 + rc.x) + abs(rc.M)
    for ld in b.loads:
        if isinstance(ld, PointLoad):
            Fsum -= ld.P
            Msum -= ld.P * ld.x
            scale += abs(ld.P) * (1 + ld.x)
        elif isinstance(ld, Couple):
            Msum -= ld.M
            scale += abs(ld.M)
        else:
            a, e, w1, w2 = ld.start, ld.end, ld.w1, ld.w2
            Fsum -= 0.5 * (w1 + w2) * (e - a)
            Msum -= (e - a) / 6 * (w1 * (2 * a + e) + w2 * (a + 2 * e))  # integral of w(x) x dx
            scale += (abs(ld.w1) + abs(ld.w2)) * (ld.end - ld.start) * (1 + ld.end)
    assert abs(Fsum) <= EQ_REL * max(scale, 1e-12)
    assert abs(Msum) <= EQ_REL * max(scale, 1e-12)
    # kinematic conditions hold too
    for s in b.supports:
        if s.vertical:
            d = r.deflection_si(s.x)
            expect = r.R[s.index] / s.k if s.kind == "spring" else 0.0
            assert d == pytest.approx(expect, abs=1e-9 * max(1.0, np.max(np.abs(r.deltac[:, 0]))))
    for xh in b.hinges_si:
        assert abs(r.M_si(xh)) <= 1e-9 * max(1.0, np.max(np.abs(r.Mc[:, 0])))


@settings(max_examples=20, deadline=None, suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow])
@given(layouts())
def test_random_layouts_match_solve_bvp(layout):
    b = build_or_skip(layout)
    r = b.solve()["D"]
    at, nodes = bvp_reference(b)
    # stations: segment mid-points and quarter points (away from jumps)
    xs = np.concatenate([nodes[:-1] + f * np.diff(nodes) for f in (0.25, 0.5, 0.75)])
    ref = np.array([at(x) for x in xs])  # columns delta, phi, M, V
    ours = np.column_stack((r.deflection_si(xs), r.slope_si(xs), r.M_si(xs), r.V_si(xs)))
    # a floor for each scale, for layouts whose response is (exactly) zero, e.g. a load on a support
    F = sum(abs(ld.P) if isinstance(ld, PointLoad) else abs(ld.M) / b.L if isinstance(ld, Couple)
            else (abs(ld.w1) + abs(ld.w2)) * (ld.end - ld.start) for ld in b.loads)
    floor = {0: 1e-6 * F * b.L ** 3 / min(b.EI_si), 2: 1e-6 * F * b.L, 3: 1e-6 * F}
    for col, name in ((0, "deflection"), (2, "M"), (3, "V")):
        scale = max(np.max(np.abs(ref[:, col])), floor[col], 1e-300)
        err = np.max(np.abs(ours[:, col] - ref[:, col])) / scale
        assert err <= BVP_REL, f"{name}: relative difference {err:.2e} vs solve_bvp"
