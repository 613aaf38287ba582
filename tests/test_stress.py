"""Stress through the depth (calckit.design.stress), checked against closed forms.

Sources: flexure formula sigma = -M (y - y_c) / I and shear formula tau = V Q / (I t) (Gere, Mechanics
of Materials 7th ed., Sec. 5.5 and 5.8); tau_max = 1.5 V / A for a solid rectangle (same, Sec. 5.8).
"""
import io

import numpy as np
import pytest

import calckit
from calckit.design.stress import stress_profile
from calckit.errors import InputError, UnitsError
from calckit.sections import SolidRect

REL = 1e-9  # closed forms: exact up to round-off


def test_rectangle_closed_forms():
    b, h, V, M = 0.1, 0.3, 50e3, 20e3
    p = stress_profile(SolidRect("100 mm", "300 mm"), M=M, V=V)
    A, I = b * h, b * h ** 3 / 12
    assert p.tau_max == pytest.approx(1.5 * V / A, rel=REL)
    assert p.y_tau_max == pytest.approx(h / 2, rel=REL)
    assert p.sigma_bot == pytest.approx(M * (h / 2) / I, rel=REL)  # sagging: tension at the bottom
    assert p.sigma_top == pytest.approx(-M * (h / 2) / I, rel=REL)
    i = int(np.argmin(np.abs(p.y - h / 2)))
    assert p.sigma[i] == 0.0  # zero at the NA
    # parabola: tau(y) = V / (2 I) ((h/2)^2 - (y - h/2)^2)
    expected = V / (2 * I) * ((h / 2) ** 2 - (p.y - h / 2) ** 2)
    np.testing.assert_allclose(p.tau, expected, rtol=1e-9, atol=1e-6)


def test_mono_symmetric_girder_na_off_mid_depth():
    pg = calckit.PlateGirder(d="1600 mm", tw="12 mm", bf_top="450 mm", tf_top="30 mm", bf_bot="300 mm",
                             tf_bot="20 mm")
    p = stress_profile(pg, M="2500 kN*m", V="900 kN")
    s = pg.si
    assert abs(p.y_c - s.d / 2) > 0.05  # NA well above mid-depth (bigger top flange)
    i = int(np.argmin(np.abs(p.y - s.y_c)))
    assert p.y[i] == pytest.approx(s.y_c) and p.sigma[i] == 0.0
    assert p.sigma_top < 0 < p.sigma_bot
    # linear through the depth: sigma = -M (y - y_c) / I at every height
    np.testing.assert_allclose(p.sigma, -2.5e6 * (p.y - s.y_c) / s.Ix, rtol=1e-12, atol=1e-3)
    # |sigma| at the extreme fibres = M / S (elastic moduli from the section)
    assert abs(p.sigma_top) == pytest.approx(2.5e6 / s.Sx_top, rel=REL)
    assert p.sigma_bot == pytest.approx(2.5e6 / s.Sx_bot, rel=REL)


def test_jump_at_flange_web_junction():
    pg = calckit.PlateGirder(d="62 in", tw="0.3125 in", bf_top="20 in", tf_top="1 in")
    p = stress_profile(pg, M=0, V="280 kip")
    s = pg.si
    yj = s.d - s.tf_top
    assert any(abs(y - yj) < 1e-12 for y in p.junctions)
    idx = np.flatnonzero(np.abs(p.y - yj) < 1e-12)
    assert len(idx) == 2
    below, above = p.tau[idx[0]], p.tau[idx[1]]
    assert below / above == pytest.approx(s.bf_top / s.tw, rel=REL)  # same Q, width bf vs tw
    # tau in the web at the junction: V Q_flange / (I tw)
    assert below == pytest.approx(280 * 4448.2216152605 * s.Q_flange_top / (s.Ix * s.tw), rel=REL)


def test_rolled_shape_with_fillets_and_tee():
    w = calckit.IShape(d="18 in", bf="7.5 in", tf="0.57 in", tw="0.355 in", r="0.402 in")
    p = stress_profile(w, M="100 kip*ft", V="50 kip")
    assert p.tau_na == pytest.approx(p.V * w.si.Q_na / (w.si.Ix * w.si.tw), rel=REL)
    assert np.all(np.diff(p.y) >= 0)
    t = calckit.sections.Tee("300 mm", "200 mm", "20 mm", "10 mm")
    pt = stress_profile(t, M="50 kN*m", V="100 kN")
    assert pt.y_c == pytest.approx(t.si.y_c)
    assert pt.tau_na == pytest.approx(1e5 * t.si.Q_na / (t.si.Ix * t.si.tw), rel=REL)


def test_table_units_and_steps():
    pg = calckit.PlateGirder(d="62 in", tw="0.3125 in", bf_top="20 in", tf_top="1 in")
    p = stress_profile(pg, M="1000 kip*ft", V="280 kip", n=11)
    tab = p.table("US")
    assert tab["y"][0] == "in" and tab["y"][1][-1] == pytest.approx(62.0)
    assert tab["sigma"][0] == "ksi"
    assert "sigma [ksi]" in p.text("US")
    recs = p.steps()
    assert recs[-2].symbol == "sigma" and recs[-1].symbol == "tau"
    assert recs[-1].result == pytest.approx(p.tau_na, rel=REL)


def test_figure_agg():
    pg = calckit.PlateGirder(d="800 mm", tw="10 mm", bf_top="300 mm", tf_top="20 mm")
    fig = stress_profile(pg, M="500 kN*m", V="300 kN").figure()
    assert len(fig.axes) == 3
    buf = io.BytesIO()
    fig.savefig(buf, format="png")
    assert buf.getvalue()[:4] == b"\x89PNG"


def test_bad_input():
    pg = calckit.PlateGirder(d="800 mm", tw="10 mm", bf_top="300 mm", tf_top="20 mm")
    with pytest.raises(UnitsError, match="M"):
        stress_profile(pg, M="5 m", V=0)
    with pytest.raises(InputError, match="section"):
        stress_profile("W18X50", M=0)
    with pytest.raises(InputError, match="n"):
        stress_profile(pg, n=1)
    with pytest.raises(InputError, match="y"):
        stress_profile(pg, y=[0.0, 2.0])
