"""Stress through the depth against the finite-element section analysis of sectionproperties.

Source: sectionproperties (PyPI, R. van Leeuwen), FE warping and shear-stress analysis after W. D. Pilkey,
Analysis and Design of Elastic Beams, Wiley, 2002. Version used is the one installed in the venv (3.x).
The FE shear stress at the NA is an area average of the exact elasticity solution across the web;
VQ/(I t) is the elementary average: they agree within a few per cent for thin webs (3 % here).
sectionproperties' positive mxx puts the top fibre in tension; calckit's positive M (sagging) puts it in
compression, so sigma_calckit(M) = sig_zz_mxx(mxx = -M).
"""
import numpy as np
import pytest

pytest.importorskip("sectionproperties")
from sectionproperties.analysis import Section  # noqa: E402
from sectionproperties.pre.library import i_section, tee_section  # noqa: E402

import calckit  # noqa: E402
from calckit.design.stress import SIGMA, stress_profile  # noqa: E402

TAU_REL = 0.03  # brief: tau at the NA in the web within 3 %
SIGMA_REL = 1e-6  # sigma is linear in both: agreement to round-off
V_N, M_NMM = 100e3, 200e6  # vy (N) and mxx (N mm) given to sectionproperties (mm units)
MESH_MM2 = 100.0  # coarse mesh: the analysis runs in well under a second


def _fe(geom):
    geom.create_mesh(mesh_sizes=[MESH_MM2])
    s = Section(geom)
    s.calculate_geometric_properties()
    s.calculate_warping_properties()
    st = s.calculate_stress(vy=V_N, mxx=M_NMM).get_stress()[0]
    return s, st, np.asarray(s.mesh["vertices"])


def _compare(geom, sec, tw_mm):
    s, st, v = _fe(geom)
    cx, cy = s.get_c()
    assert sec.si.Ix * 1e12 == pytest.approx(s.get_ic()[0], rel=1e-6)
    assert sec.si.y_c * 1e3 == pytest.approx(cy, rel=1e-6)
    prof = stress_profile(sec, M=-M_NMM * 1e-3, V=V_N)
    near = (np.abs(v[:, 0] - cx) <= tw_mm / 2 + 1e-6) & (np.abs(v[:, 1] - cy) < 15.0)
    assert near.sum() >= 3
    tau_fe = float(np.mean(st["sig_zy_vy"][near]))  # MPa
    assert prof.tau_na / 1e6 == pytest.approx(tau_fe, rel=TAU_REL)
    # sigma(y) linear through the depth: the same at every FE node
    sig = SIGMA(M=-M_NMM * 1e-3, y=v[:, 1] * 1e-3, y_c=sec.si.y_c, I_x=sec.si.Ix) / 1e6
    np.testing.assert_allclose(sig, st["sig_zz_mxx"], rtol=SIGMA_REL, atol=1e-6 * np.max(np.abs(sig)))
    assert prof.sigma_top / 1e6 == pytest.approx(np.max(st["sig_zz_mxx"]), rel=SIGMA_REL)


def test_welded_I():
    geom = i_section(d=600, b=250, t_f=20, t_w=10, r=0, n_r=1)
    sec = calckit.PlateGirder(d="600 mm", tw="10 mm", bf_top="250 mm", tf_top="20 mm")
    _compare(geom, sec, 10.0)


def test_tee():
    geom = tee_section(d=300, b=200, t_f=20, t_w=10, r=0, n_r=1)  # flange at the top
    sec = calckit.sections.Tee("300 mm", "200 mm", "20 mm", "10 mm")
    _compare(geom, sec, 10.0)
