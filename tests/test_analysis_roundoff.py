"""Round-off snapping in calckit.analysis: values that are exactly zero in statics come out as 0.0,
and nothing else moves.

Sources of the expected values:
[S]   statics of a determinate beam (equilibrium alone): a pinned or roller end carries no moment; the
      free end of a cantilever carries no shear and no moment; a support does not deflect; a fixed
      support does not rotate. Exact zeros, no publication needed.
[BF]  two equal spans, uniform load w (beam formulas as tabulated in civil engineering handbooks;
      /work/shared/REFERENCES.md "Beam formulas", status R): reactions 0.375, 1.25, 0.375 wL, support
      moment -0.125 wL^2, span moment +0.0703 wL^2 (= 9/128 wL^2 at 3L/8, recomputed from the same
      statics); the moment is zero at 3L/4 from each end (the inflection point of that solution).
"""
from __future__ import annotations

import numpy as np
import pytest

from calckit import Beam
from calckit.analysis.piecewise import ZERO_REL, roundoff_scale

EI = "40000 kN*m**2"
#: closed-form checks: the snapping must leave them as they were, to this relative tolerance
CLOSED_FORM_REL = 1e-12
#: noise of the unsnapped polynomial evaluation at an exact zero, relative to its scale (observed ~1e-16)
NOISE_REL = 1e-13


def _raw(result, attr: str, x: np.ndarray, side: str = "right") -> np.ndarray:
    """The unsnapped value: Horner's scheme on the result's coefficients, written here independently."""
    g = result.grid.x
    c = getattr(result, attr)
    k = np.clip(np.searchsorted(g, x, side=side) - 1, 0, len(g) - 2)
    t = x - g[k]
    out = np.zeros_like(x)
    for p in range(c.shape[-1] - 1, -1, -1):
        out = out * t + c[k, p]
    return out


@pytest.fixture(scope="module")
def simple():
    """30 ft simple span, UDL in D and an off-centre point load in L, combined 1.2D + 1.6L."""
    b = Beam(["30 ft"], ["pin", "roller"], EI=EI)
    b.udl("1.2 kip/ft", "D").point("10 kip", "12 ft", "L")
    return b.solve()


def test_simple_span_end_moments_and_deflections_are_exactly_zero(simple):
    # [S]: M = 0 and deflection = 0 at a pin and a roller, in each case and in a combination
    for r in (simple["D"], simple["L"], simple.combine({"D": 1.2, "L": 1.6})):
        L = r.layout.L
        assert r.M_si(0.0) == 0.0 and r.M_si(L) == 0.0
        assert r.M_si(L, "left") == 0.0
        assert r.deflection_si(0.0) == 0.0 and r.deflection_si(L) == 0.0
        assert list(r.M_si(np.array([0.0, L]))) == [0.0, 0.0]
        assert r.V_si(0.0) != 0.0 and r.slope_si(L) != 0.0  # the real values stay


def test_the_noise_was_there_before_snapping(simple):
    # guards the tests above against passing vacuously: the raw polynomial is not exactly zero at x = L
    r = simple["D"]
    L = r.layout.L
    raw = _raw(r, "Mc", np.array([L]), "left")[0]
    assert raw != 0.0 and abs(raw) <= NOISE_REL * roundoff_scale(r.grid.x, r.Mc)


def test_cantilever_free_end_shear_and_moment_are_exactly_zero():
    # [S]: fixed at x = 0, free at x = L: V = M = 0 at the tip; deflection and slope 0 at the fixed end
    b = Beam(["3.7 m"], ["fixed", "free"], EI=EI)
    b.udl("7.3 kN/m", "D").point("4.1 kN", "1.9 m", "D").linear(0, "5.5 kN/m", "0.3 m", "3.7 m", "L")
    sol = b.solve()
    for r in (sol["D"], sol["L"], sol.combine({"D": 1.35, "L": 1.5})):
        L = r.layout.L
        assert r.V_si(L) == 0.0 and r.V_si(L, "left") == 0.0
        assert r.M_si(L) == 0.0 and r.M_si(L, "left") == 0.0
        assert r.deflection_si(0.0) == 0.0 and r.slope_si(0.0) == 0.0
        assert r.reactions[1].R == 0.0 and r.reactions[1].M == 0.0
        e = r.extrema()
        assert e.M_max.value == 0.0  # all hogging: the "largest sagging moment" is the tip's zero
        assert e.V_min.value == 0.0 and e.defl_min.value == 0.0


def test_two_equal_spans_closed_form_unchanged_and_zeros_exact():
    # [BF] two equal spans L = 6 m, w = 10 kN/m
    w, L = 10e3, 6.0
    b = Beam(["6 m", "6 m"], ["pin", "roller", "roller"], EI=EI).udl("10 kN/m", "D")
    r = b.solve()["D"]
    assert r.M_si(L) == pytest.approx(-0.125 * w * L ** 2, rel=CLOSED_FORM_REL)
    R = [x.R for x in r.reactions]
    assert R == pytest.approx([0.375 * w * L, 1.25 * w * L, 0.375 * w * L], rel=CLOSED_FORM_REL)
    e = r.extrema(span=0)
    assert e.M_max.value == pytest.approx(9 / 128 * w * L ** 2, rel=CLOSED_FORM_REL)
    assert e.M_max.x == pytest.approx(3 * L / 8, rel=1e-9)
    # [S]/[BF]: zero moment at the ends and at the inflection points 3L/4 from each end; no deflection
    # at the supports
    assert list(r.M_si(np.array([0.0, 0.75 * L, 1.25 * L, 2 * L]))) == [0.0, 0.0, 0.0, 0.0]
    assert list(r.deflection_si(np.array([0.0, L, 2 * L]))) == [0.0, 0.0, 0.0]
    assert r.slope_si(L) == 0.0  # symmetry


def test_only_round_off_is_changed(simple):
    # every evaluated value equals the raw polynomial, except values within ZERO_REL of the scale,
    # which are 0.0; so no quantity moves by more than ZERO_REL * scale
    r = simple.combine({"D": 1.2, "L": 1.6})
    x = np.linspace(0.0, r.layout.L, 997)
    x = np.concatenate((x, r.grid.x))
    for attr, fn in (("Vc", r.V_si), ("Mc", r.M_si), ("phic", r.slope_si), ("deltac", r.deflection_si)):
        for side in ("left", "right"):
            got = fn(x, side) if attr != "deltac" else fn(x)
            raw = _raw(r, attr, x, side if attr != "deltac" else "right")
            tol = ZERO_REL * roundoff_scale(r.grid.x, getattr(r, attr))
            changed = got != raw
            assert np.all(got[changed] == 0.0)
            assert np.all(np.abs(raw[changed]) <= tol)
            assert np.array_equal(got[~changed], raw[~changed])


def test_scale_is_relative_so_small_real_values_stay():
    # a beam with tiny loads is not zeroed: the threshold follows the member's own values
    b = Beam(["5 m"], ["pin", "roller"], EI=EI).udl("1e-9 N/m", "D")
    r = b.solve()["D"]
    assert r.M_si(2.5) == pytest.approx(1e-9 * 25 / 8, rel=1e-9)
    assert r.M_si(0.0) == 0.0 and r.M_si(5.0) == 0.0


def test_reactions_and_forces_that_are_zero_in_statics():
    # [S]: fixed at 0, roller at 7.3 m, hinge at 8.9 m, roller at 13.2 m, loads left of the hinge only:
    # the part beyond the hinge is unloaded, so its reaction, shear and moment are zero (raw solve:
    # R_3 ~ 5e-13 N); the loaded part is determinate (fixed end + roller over a hinge) and unchanged
    b = Beam(["7.3 m", "5.9 m"], ["fixed", "roller", "roller"], EI=EI, hinges=["8.9 m"])
    b.udl("13 kN/m", "D", start="0 m", end="8.9 m").point("5 kN", "2.2 m", "D")
    r = b.solve()["D"]
    R = [x.R for x in r.reactions]
    assert R[2] == 0.0
    assert sum(R) == pytest.approx(13e3 * 8.9 + 5e3, rel=CLOSED_FORM_REL)
    beyond = np.linspace(8.9, 13.2, 11)
    assert np.all(r.V_si(beyond) == 0.0) and np.all(r.M_si(beyond) == 0.0)
    assert r.M_si(8.9, "left") == 0.0  # the hinge


def test_envelope_zeros_are_exact():
    # two spans with pattern loading (the arrangement of the two-span demo beam): moments at the end
    # supports and deflections at every support exactly 0.0 in the envelope and its span extremes
    from calckit.analysis import combinations

    b = Beam(["22 ft", "22 ft"], ["pin", "roller", "roller"], EI=EI)
    b.udl("0.45 kip/ft", "D").udl("0.60 kip/ft", "L")
    sol = b.solve()
    env = sol.envelope(combinations("ASCE 7-22", ["D", "L"], "strength"))
    L = b.L
    for q in ("M_max", "M_min", "defl_max", "defl_min"):
        arr = getattr(env, q)
        assert arr[0] == 0.0 and arr[-1] == 0.0, q
    at_mid = np.abs(env.x - L / 2) <= 1e-9 * L
    assert np.all(env.defl_max[at_mid] == 0.0) and np.all(env.defl_min[at_mid] == 0.0)
    assert env.spans[0].M_max.value > 0 and env.spans[0].defl_min.value <= 0.0
