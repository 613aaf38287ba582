"""Fillet welds to EN 1993-1-8:2005 (calckit.design.en1993.welds).

Sources: EN 1993-1-8 4.5.3.3 Eqs. (4.3)/(4.4) (P), 4.5.3.2 Eq. (4.1), Table 4.1 beta_w, gamma_M2 = 1.25
(M); f_vw,d with EN 1993-1-1 Table 3.1 fu (t <= 40 mm): S235 207.8, S275 233.7, S355 261.7 MPa
(/work/shared/REFERENCES.md "Welds", status R). Convention: EN 1993-1-1 Table 3.1 fu (S235 360, S275 430,
S355 510 MPa), not the product-standard values.
"""
import math

import pytest

from calckit.design.en1993 import welds as ew
from calckit.errors import InputError, NotCoveredError

REL = 2.5e-4  # reference values rounded to 4 significant figures (half a unit of the 4th figure)


@pytest.mark.parametrize("grade, fvwd_mpa", [("S235", 207.8), ("S275", 233.7), ("S355", 261.7)])
def test_fvwd_table_3_1_convention(grade, fvwd_mpa):
    r = ew.FilletWelds().bind(grade, (0.010, 0.020))
    assert r.capacity(1.0) / 1e6 == pytest.approx(fvwd_mpa, rel=REL)  # F_w,Rd per metre of throat


def test_product_standard_convention():
    # national practice with product-standard fu: S355 470 MPa -> 241.2 MPa (REFERENCES.md)
    r = ew.FilletWelds(fu=470e6, beta_w=0.90)
    assert r.capacity(1.0) / 1e6 == pytest.approx(241.2, rel=REL)


def test_thick_band_uses_weaker_part():
    # EN 1993-1-1 Table 3.1: S355 fu 470 MPa for 40 < t <= 80 mm; the weaker part joined governs
    r = ew.FilletWelds().bind("S355", (0.012, 0.050))
    assert r.fu == pytest.approx(470e6)


def test_directional_equals_simplified_for_longitudinal_shear():
    # Eq. (4.1) with tau_par only: sqrt(3) tau_par <= fu / (beta_w gamma_M2), i.e. Eq. (4.4)
    s = ew.FilletWelds().bind("S355", (0.01,))
    d = ew.FilletWelds(method="directional").bind("S355", (0.01,))
    assert d.capacity(0.005, 0.0) == pytest.approx(s.capacity(0.005), rel=1e-12)


def test_directional_transverse_in_web_plane():
    # T-joint, force f per weld perpendicular to the axis in the web plane: sigma_perp = tau_perp =
    # f / (sqrt 2 a); Eq. (4.1): sqrt(sigma^2 + 3 tau^2) = sqrt(2) f / a <= fu / (beta_w gamma_M2)
    d = ew.FilletWelds(method="directional").bind("S275", (0.01,))
    fu, bw, g = 430e6, 0.85, 1.25
    expected = min(fu / (bw * g) / math.sqrt(2), 0.9 * fu / g * math.sqrt(2))
    assert d.capacity(1.0, math.pi / 2) == pytest.approx(expected, rel=1e-9)


def test_rules():
    r = ew.FilletWelds().bind("S355", (0.01,))
    assert r.min_size(0.02)[0] == pytest.approx(3e-3)  # 4.5.2(2)
    assert r.min_segment(4e-3)[0] == pytest.approx(30e-3)  # max(30 mm, 6 a)
    assert r.min_segment(6e-3)[0] == pytest.approx(36e-3)
    # Fig. 4.1 L2 <= min(12 t, 0.25 b, 200 mm): t = 10 mm, b = 300 mm -> 75 mm gap
    assert r.max_pitch(L_w=50e-3, t=10e-3, b=0.300)[0] == pytest.approx(0.125)
    assert r.end_length(0.300)[0] == pytest.approx(0.225)  # 4.3.5(5): 0.75 b


def test_bad_input():
    with pytest.raises(InputError, match="method"):
        ew.FilletWelds(method="exact")
    with pytest.raises(InputError, match="gamma_M2"):
        ew.FilletWelds(gamma_M2=0.5)
    with pytest.raises(InputError, match="steel"):
        ew.FilletWelds().bind("A992", (0.01,))
    with pytest.raises(InputError, match="fu/beta_w"):
        ew.FilletWelds().capacity(0.004)
    with pytest.raises(NotCoveredError):
        ew.FilletWelds().termination(0.2, 0.02, None)
