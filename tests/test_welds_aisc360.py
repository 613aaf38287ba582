"""Fillet welds to AISC 360-22 J2 (calckit.design.aisc360.welds).

Sources: AISC 360-22 Section J2.4 (Eqs. J2-4, J2-5; phi 0.75, Omega 2.00), Table J2.4, J2.2b; and the steel
manual's E70 values 1.392 D kip/in (LRFD) and 0.928 D kip/in (ASD) per sixteenth of leg (steel manual,
common practice; /work/shared/REFERENCES.md "Welds", status M, R).
"""
import math

import pytest

from calckit.design.aisc360 import welds as aw
from calckit.errors import InputError

KIP_PER_IN = 4448.2216152605 / 0.0254  # N/m
IN = 0.0254
D16 = IN / 16
REL = 1e-3  # the manual's values are rounded to 4 significant figures


def test_e70_lrfd_per_sixteenth():
    # steel manual: phi Rn = 1.392 D kip/in for E70 (0.75 x 0.60 x 70 x 0.707 / 16 = 1.392)
    r = aw.FilletWelds("LRFD").capacity(D16) / KIP_PER_IN
    assert r == pytest.approx(1.392, rel=REL)


def test_e70_asd_per_sixteenth():
    # steel manual: Rn / Omega = 0.928 D kip/in for E70
    r = aw.FilletWelds("ASD").capacity(D16) / KIP_PER_IN
    assert r == pytest.approx(0.928, rel=REL)


def test_strength_proportional_to_leg_and_electrode():
    w = aw.FilletWelds("LRFD", F_EXX="E80")
    # AISC 360-22 Eq. J2-4/J2-5 with F_EXX = 80 ksi: 0.75 * 0.60 * 80 * 0.707 * (5/16) kip/in
    expected = 0.75 * 0.60 * 80 * 0.707 * 5 / 16
    assert w.capacity(5 * D16) / KIP_PER_IN == pytest.approx(expected, rel=1e-9)


def test_directional_increase_transverse():
    # AISC 360-22 Eq. J2-5: (1 + 0.5 sin^1.5 90 deg) = 1.5
    w = aw.FilletWelds("LRFD")
    assert w.capacity(D16, math.pi / 2) / w.capacity(D16, 0.0) == pytest.approx(1.5, rel=1e-12)
    at45 = 1 + 0.5 * math.sin(math.pi / 4) ** 1.5
    assert w.capacity(D16, math.pi / 4) / w.capacity(D16) == pytest.approx(at45, rel=1e-12)
    off = aw.FilletWelds("LRFD", directional=False)
    assert off.capacity(D16, math.pi / 2) == pytest.approx(off.capacity(D16), rel=1e-12)


@pytest.mark.parametrize("t_in, w16", [(0.25, 2), (0.3125, 3), (0.5, 3), (0.625, 4), (0.75, 4), (1.0, 5)])
def test_minimum_size_table_j2_4(t_in, w16):
    # AISC 360-22 Table J2.4 (thinner part joined): <=1/4: 1/8; <=1/2: 3/16; <=3/4: 1/4; >3/4: 5/16 in
    w, clause = aw.min_fillet_size(t_in * IN)
    assert w == pytest.approx(w16 * D16)
    assert "J2.4" in clause


def test_maximum_size_along_edges():
    # AISC 360-22 J2.2b(b): t < 1/4 in: w <= t; t >= 1/4 in: w <= t - 1/16 in
    assert aw.max_fillet_size(0.1875 * IN)[0] == pytest.approx(0.1875 * IN)
    assert aw.max_fillet_size(0.5 * IN)[0] == pytest.approx(7 * D16)


def test_intermittent_min_length():
    # AISC 360-22 J2.2b(e): >= 4 w and >= 1-1/2 in
    assert aw.min_intermittent_length(3 * D16)[0] == pytest.approx(1.5 * IN)
    assert aw.min_intermittent_length(8 * D16)[0] == pytest.approx(2.0 * IN)


def test_termination_lengths_f13_3():
    # AISC 360-22 F13.3: a' = w (end weld >= 3/4 t), 1.5 w (end weld < 3/4 t), 2 w (no end weld)
    b, t = 10 * IN, 0.75 * IN
    assert aw.termination_length(b, t, 10 * D16)[0] == pytest.approx(b)
    assert aw.termination_length(b, t, 5 * D16)[0] == pytest.approx(1.5 * b)
    assert aw.termination_length(b, t, None)[0] == pytest.approx(2 * b)


def test_connector_spacing():
    # AISC 360-22 E6.2: 0.75 sqrt(E/Fy) t <= 12 in; D4: 24 t <= 12 in; J3.5: 24 t <= 12 in, 14 t <= 7 in
    E, Fy = 29000.0, 50.0
    s, _ = aw.max_connector_spacing(0.5 * IN, Fy=Fy, E=E, compression=True)
    assert s / IN == pytest.approx(0.75 * math.sqrt(E / Fy) * 0.5)
    assert aw.max_connector_spacing(1.0 * IN, Fy=Fy, E=E)[0] / IN == pytest.approx(12.0)
    assert aw.max_connector_spacing(0.25 * IN, Fy=Fy, E=E, compression=False)[0] / IN == pytest.approx(6.0)
    assert aw.max_bolt_spacing(0.25 * IN, weathering=True)[0] / IN == pytest.approx(3.5)
    assert aw.min_bolt_spacing(0.75 * IN)[0] / IN == pytest.approx(2.0)


def test_base_metal_j4_2():
    # AISC 360-22 Eq. J4-4 per unit length: phi 0.60 Fu t, phi = 0.75 (A992 Fu 65 ksi, t 3/8 in)
    r = aw.FilletWelds("LRFD").base_metal(0.375 * IN, 65 * aw.KSI) / KIP_PER_IN
    assert r == pytest.approx(0.75 * 0.60 * 65 * 0.375, rel=1e-9)


def test_combined_longitudinal_transverse_j2_4c():
    # AISC 360-22 J2.4(c): Rn = max(Rnwl + Rnwt, 0.85 Rnwl + 1.5 Rnwt), no directional increase
    w = aw.FilletWelds("LRFD")
    rn = 0.60 * 70 * 0.707 * 0.25  # kip/in for a 1/4 in E70 weld
    L_l, L_t = 12.0, 6.0
    expected = 0.75 * max(rn * L_l + rn * L_t, 0.85 * rn * L_l + 1.5 * rn * L_t)
    got = w.combined(4 * D16, L_l * IN, L_t * IN) / 4448.2216152605
    assert got == pytest.approx(expected, rel=1e-9)


def test_steps_reproduce_numbers():
    w = aw.FilletWelds("ASD")
    recs = w.capacity_steps(5 * D16, 0.3, 2)
    assert recs[-1].symbol == "q_c"
    assert recs[-1].result == pytest.approx(2 * w.capacity(5 * D16, 0.3), rel=1e-12)


def test_bad_input():
    with pytest.raises(InputError, match="method"):
        aw.FilletWelds("LSD")
    with pytest.raises(InputError, match="F_EXX"):
        aw.FilletWelds("LRFD", F_EXX="E7")
