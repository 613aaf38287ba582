"""Section properties against a finite-element reference.

Reference: sectionproperties (R. van Leeuwen), PyPI package ``sectionproperties``, version 3.10.2 as installed
in the project venv (read at run time below) — a general-purpose finite-element cross-section analysis
library (warping analysis for J, Cw and the shear centre; plastic analysis for Z). It is used here as an
independent reference; it is not a dependency of calckit at run time. Built-up sections are modelled as the
sum of their plates (one merged mesh: welded parts act as one solid), as calckit's BuiltUp assumes.

Tolerances as required by the foundation issue: A, Ix, Iy, Zx within 0.5 %; J and Cw within 3 % (every
shape, built-ups included); the shear centre within 1 % of the depth. Fillets are meshed with 24 segments
per quarter circle; the mesh size (maximum triangle area, mm2) of each case is a named constant below.
"""
from __future__ import annotations

from importlib.metadata import version

import pytest

sp_lib = pytest.importorskip("sectionproperties.pre.library")
from sectionproperties.analysis import Section as FESection  # noqa: E402

import calckit.sections as cs  # noqa: E402

SP_VERSION = version("sectionproperties")
TOL_BASIC = 0.005  # A, Ix, Iy, Zx
TOL_TORSION = 0.03  # J, Cw
TOL_SC = 0.01  # shear centre, fraction of depth
NR = 24  # segments per fillet in the FE geometry
MM = 1e-3
IN = 25.4  # mm per inch
# FE mesh sizes (maximum triangle area, mm2)
MESH_IPE330 = 15
MESH_W18 = 20
MESH_HEB300 = 40
MESH_WELDED_I = 60
MESH_MONO_GIRDER = 120
MESH_CHANNEL = 8
MESH_TEE = 8
MESH_BOX = 8
MESH_SOLID = 20
MESH_COVER_PLATED = 20
MESH_W18_TOP_PLATE = 50
MESH_THREE_PLATES = 50
MESH_BOX_OF_PLATES = 100


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
            lambda: lib.i_section(d=330, b=160, t_f=11.5, t_w=7.5, r=18, n_r=NR), MESH_IPE330, True),
        "W18x50 (AISC Table 1-1 dims)": (
            cs.IShape("18 in", "7.5 in", "0.57 in", "0.355 in", "0.402 in"),
            lambda: lib.i_section(d=18 * 25.4, b=7.5 * 25.4, t_f=0.57 * 25.4, t_w=0.355 * 25.4,
                                  r=0.402 * 25.4, n_r=NR), MESH_W18, True),
        "HEB 300": (
            cs.IShape("300 mm", "300 mm", "19 mm", "11 mm", "27 mm"),
            lambda: lib.i_section(d=300, b=300, t_f=19, t_w=11, r=27, n_r=NR), MESH_HEB300, True),
        "welded I doubly symmetric": (
            cs.PlateGirder("900 mm", "10 mm", "300 mm", "20 mm"),
            lambda: lib.i_section(d=900, b=300, t_f=20, t_w=10, r=0, n_r=1), MESH_WELDED_I, True),
        "mono-symmetric welded girder": (
            cs.PlateGirder(f"{pg['d']} mm", f"{pg['tw']} mm", f"{pg['bt']} mm", f"{pg['tft']} mm",
                           f"{pg['bb']} mm", f"{pg['tfb']} mm"),
            lambda: lib.mono_i_section(d=pg["d"], b_t=pg["bt"], b_b=pg["bb"], t_ft=pg["tft"],
                                       t_fb=pg["tfb"], t_w=pg["tw"], r=0, n_r=1), MESH_MONO_GIRDER, True),
        "channel 200x75": (
            cs.Channel("200 mm", "75 mm", "12 mm", "8 mm", "10 mm"),
            lambda: lib.channel_section(d=200, b=75, t_f=12, t_w=8, r=10, n_r=NR), MESH_CHANNEL, True),
        "tee 200x150": (
            cs.Tee("200 mm", "150 mm", "12 mm", "8 mm", "10 mm"),
            lambda: lib.tee_section(d=200, b=150, t_f=12, t_w=8, r=10, n_r=NR), MESH_TEE, False),
        "box 200x100x8": (
            cs.Hollow("100 mm", "200 mm", "8 mm", ro="16 mm"),
            lambda: lib.rectangular_hollow_section(d=200, b=100, t=8, r_out=16, n_r=NR), MESH_BOX, False),
        "solid rectangle 60x120": (
            cs.SolidRect("60 mm", "120 mm"),
            lambda: lib.rectangular_section(d=120, b=60), MESH_SOLID, False),
        "IPE 330 with 200x15 cover plates": (
            cs.BuiltUp.cover_plated(cs.IShape("330 mm", "160 mm", "11.5 mm", "7.5 mm", "18 mm"),
                                    top=("200 mm", "15 mm"), bottom=("200 mm", "15 mm")),
            lambda: (lib.rectangular_section(d=15, b=200)
                     + lib.i_section(d=330, b=160, t_f=11.5, t_w=7.5, r=18, n_r=NR).shift_section(20, 15)
                     + lib.rectangular_section(d=15, b=200).shift_section(0, 345)), MESH_COVER_PLATED, True),
        # mono-symmetric: a narrower plate on the top flange only
        "W18x50 with a 6 x 5/8 in top cover plate": (
            cs.BuiltUp.cover_plated(W18X50, top=("6 in", "0.625 in")),
            lambda: (lib.i_section(d=18 * IN, b=7.5 * IN, t_f=0.57 * IN, t_w=0.355 * IN, r=0.402 * IN, n_r=NR)
                     + lib.rectangular_section(d=0.625 * IN, b=6 * IN).shift_section(0.75 * IN, 18 * IN)),
            MESH_W18_TOP_PLATE, True),
        "welded I of three Plates": (
            THREE_PLATES,
            lambda: (lib.rectangular_section(d=20, b=300)
                     + lib.rectangular_section(d=860, b=10).shift_section(145, 20)
                     + lib.rectangular_section(d=20, b=300).shift_section(0, 880)), MESH_THREE_PLATES, True),
        # closed cell: two 12 mm webs between 400 x 20 flanges (one hole constant in the stress function)
        "box girder of four Plates": (
            cs.BuiltUp([(cs.Plate("400 mm", "20 mm"), "0 mm", "0 mm"), (cs.Plate("12 mm", "560 mm"), "40 mm", "20 mm"),
                        (cs.Plate("12 mm", "560 mm"), "348 mm", "20 mm"),
                        (cs.Plate("400 mm", "20 mm"), "0 mm", "580 mm")]),
            lambda: (lib.rectangular_section(d=20, b=400)
                     + lib.rectangular_section(d=560, b=12).shift_section(40, 20)
                     + lib.rectangular_section(d=560, b=12).shift_section(348, 20)
                     + lib.rectangular_section(d=20, b=400).shift_section(0, 580)), MESH_BOX_OF_PLATES, True),
    }


W18X50 = cs.IShape("18 in", "7.5 in", "0.57 in", "0.355 in", "0.402 in")
#: the same plates as PlateGirder("900 mm", "10 mm", "300 mm", "20 mm"), assembled by BuiltUp
THREE_PLATES = cs.BuiltUp([(cs.Plate("300 mm", "20 mm"), "0 mm", "0 mm"),
                           (cs.Plate("10 mm", "860 mm"), "145 mm", "20 mm"),
                           (cs.Plate("300 mm", "20 mm"), "0 mm", "880 mm")])
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


@pytest.mark.parametrize("name", list(CASES))
def test_torsion_constant(fe_results, name):
    sec, fe = CASES[name][0], fe_results[name]
    ours = sec.si.J / MM ** 4
    assert _rel(ours, fe["J"]) <= TOL_TORSION, (f"{name} J: calckit {ours:.6g}, FE {fe['J']:.6g} "
                                               f"(sectionproperties {SP_VERSION})")


@pytest.mark.parametrize("name", [k for k, v in CASES.items() if v[3]])
def test_warping_constant(fe_results, name):
    sec, fe = CASES[name][0], fe_results[name]
    ours = sec.si.Cw / MM ** 6
    assert _rel(ours, fe["Cw"]) <= TOL_TORSION, (f"{name} Cw: calckit {ours:.6g}, FE {fe['Cw']:.6g} "
                                                f"(sectionproperties {SP_VERSION})")


@pytest.mark.parametrize("name", list(CASES))
def test_shear_centre(fe_results, name):
    sec, fe = CASES[name][0], fe_results[name]
    x0, _, y0, _ = fe["extents"]
    xs, ys = fe["sc"]
    depth = sec.si.d / MM
    assert abs(sec.si.y_s / MM - (ys - y0)) <= TOL_SC * depth, f"{name} y_s"
    assert abs(sec.si.x_s / MM - (xs - x0)) <= TOL_SC * depth, f"{name} x_s"


@pytest.mark.parametrize("name", [k for k in CASES if isinstance(CASES[k][0], cs.BuiltUp)])
def test_builtups_are_solved_as_one_solid(name):
    # the FE model is one merged solid; a BuiltUp whose parts touch must not fall back to the parts' sum
    assert CASES[name][0].torsion.cells > 0


def test_three_plates_match_the_plate_girder_closed_form():
    # PlateGirder: J from rectangles plus the El Darwish-Johnston junction terms, Cw = Iy ho^2 / 4
    # (AISC Design Guide 9, 1997, Eqs. 3.4-3.6 and Appendix C, from memory); the same plates through BuiltUp.
    pg = cs.PlateGirder("900 mm", "10 mm", "300 mm", "20 mm")
    assert _rel(THREE_PLATES.si.J, pg.si.J) <= TOL_TORSION
    assert _rel(THREE_PLATES.si.Cw, pg.si.Cw) <= TOL_TORSION
    assert abs(THREE_PLATES.si.y_s - pg.si.y_s) <= TOL_SC * pg.si.d
