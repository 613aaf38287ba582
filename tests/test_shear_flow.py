"""Shear flow along the member, flange-to-web welds, fasteners and cover plates
(calckit.design.shear_flow, .flange_welds, .built_up).

Closed forms: q = V Q / I (Gere, Mechanics of Materials 7th ed., Sec. 5.11); for a doubly symmetric I the
flange-web q = V A_f (d - t_f) / 2 / I_x. Weld strengths: AISC 360-22 J2.4 (E70: 1.392 D kip/in LRFD per
sixteenth, steel manual, common practice) and EN 1993-1-8 4.5.3.3. Zoning rules are calckit's (common
practice) and are checked for the properties they promise, not for particular numbers.
"""
import io
import math

import numpy as np
import pytest

import calckit
from calckit.analysis.combinations import combinations
from calckit.design.shear_flow import (FlangeLoad, ShearEnvelope, as_envelope, design_cover_plates,
                                       design_fasteners, design_flange_welds, flange_interfaces, interface_at,
                                       shear_flow, zone_pitches)
from calckit.errors import InputError, NotCoveredError, UnitsError
from calckit.sections import SolidRect

IN = 0.0254
D16 = IN / 16
KIP = 4448.2216152605
KIP_IN = KIP / IN
REL = 1e-9
E70_LRFD = 1.392  # kip/in per sixteenth (steel manual; 0.75 x 0.60 x 70 x 0.707 / 16)


@pytest.fixture
def girder():
    return calckit.PlateGirder(d="1500 mm", tw="12 mm", bf_top="400 mm", tf_top="25 mm", name="G")


@pytest.fixture
def mono():
    return calckit.PlateGirder(d="1600 mm", tw="12 mm", bf_top="450 mm", tf_top="30 mm", bf_bot="300 mm",
                               tf_bot="20 mm", name="M")


def _ss(L=20.0, V0=900e3, n=401):
    """Simply supported beam under uniform load: V = V0 (1 - 2x/L), M = V0 x (1 - x/L)."""
    x = np.linspace(0.0, L, n)
    V = V0 * (1 - 2 * x / L)
    M = V0 * x * (1 - x / L)
    return x, V, V, M, M


def test_doubly_symmetric_closed_form(girder):
    s = girder.si
    x, V, *_ = _ss()
    sf = shear_flow(girder, (x, V, V))
    Af = s.bf_top * s.tf_top
    expected = np.abs(V) * Af * (s.d - s.tf_top) / 2 / s.Ix
    assert len(sf.interfaces) == 1 and sf.interfaces[0].flange == "both"
    np.testing.assert_allclose(sf.q[0], expected, rtol=REL)
    st = sf.steps()
    assert st[-1].symbol == "q_h" and st[-1].result == pytest.approx(expected.max(), rel=REL)


def test_mono_symmetric_top_and_bottom(mono):
    s = mono.si
    ints = flange_interfaces(mono)
    assert [f.flange for f in ints] == ["top", "bottom"]
    Qt = s.bf_top * s.tf_top * (s.d - s.tf_top / 2 - s.y_c)
    Qb = s.bf_bot * s.tf_bot * (s.y_c - s.tf_bot / 2)
    sf = shear_flow(mono, _ss()[:3])
    assert sf.q_max(0) == pytest.approx(900e3 * Qt / s.Ix, rel=REL)
    assert sf.q_max(1) == pytest.approx(900e3 * Qb / s.Ix, rel=REL)


def test_tee_and_cut_interfaces():
    t = calckit.sections.Tee("300 mm", "200 mm", "20 mm", "10 mm")
    assert [f.flange for f in flange_interfaces(t)] == ["top"]
    r = SolidRect("100 mm", "300 mm")
    f = interface_at(r, "200 mm")
    # Q of the top 100 mm of a 100 x 300 rectangle about its centroid: 0.1 * 0.1 * 0.1
    assert f.Q == pytest.approx(0.1 * 0.1 * 0.1, rel=REL)
    sf = shear_flow(r, (np.array([0.0, 1.0]), np.array([1e4, 1e4])), interfaces=[f])
    assert sf.q_max() == pytest.approx(1e4 * 1e-3 / (0.1 * 0.3 ** 3 / 12), rel=REL)


def test_envelope_adapters():
    b = calckit.Beam(["20 m", "25 m", "20 m"], ["pin", "roller", "roller", "pin"], EI="4e6 kN*m**2")
    b.udl("20 kN/m", "D").udl("30 kN/m", "L")
    sol = b.solve()
    env = sol.envelope(combinations("ASCE 7-22", {"D", "L"}), n_per_span=100)
    e = as_envelope(env)
    np.testing.assert_array_equal(e.x, env.x)
    np.testing.assert_allclose(e.V_abs, np.maximum(np.abs(env.V_max), np.abs(env.V_min)))
    assert e.names and all(isinstance(n, str) and n for n in e.names)
    one = as_envelope(sol.combine({"D": 1.2, "L": 1.6}), n=201)
    assert one.x.size >= 201 and one.x[-1] == pytest.approx(65.0)
    assert one.V_max[0] == pytest.approx(sol.combine({"D": 1.2, "L": 1.6}).V_si(0.0))
    q = as_envelope(x=calckit.Q_([0, 1, 2], "ft"), V_max=calckit.Q_([3, 2, 1], "kip"))
    assert q.x[-1] == pytest.approx(2 * 0.3048) and q.V_min[0] == pytest.approx(3 * KIP)
    assert isinstance(as_envelope({"x": [0, 1], "V_max": [1, 2]}), ShearEnvelope)
    with pytest.raises(InputError, match="V_max"):
        as_envelope(x=[0, 1, 2], V_max=[1, 2])
    with pytest.raises(InputError, match="x"):
        as_envelope(x=[0, 2, 1], V_max=[1, 2, 3])
    with pytest.raises(UnitsError, match="V_max"):
        as_envelope(x=[0, 1], V_max=calckit.Q_([1, 2], "m"))


def test_continuous_weld_smallest_size_aisc(mono):
    x, V, _, M, _ = _ss(V0=2500e3)
    d = design_flange_welds(mono, (x, V, V, M, M), steel="A572-50", standard="AISC 360-22")
    s = mono.si
    for j, Q, tf in zip(d.junctions, (s.Q_flange_top, s.Q_flange_bot), (s.tf_top, s.tf_bot)):
        q = 2500e3 * Q / s.Ix
        w_req = q / 2 / KIP_IN / E70_LRFD * D16  # two welds, 1.392 kip/in per sixteenth
        w_min = 5 * D16 if min(tf, s.tw) > 0.75 * IN else (4 if min(tf, s.tw) > 0.5 * IN else 3) * D16
        need = max(w_req, w_min)
        assert j.size >= need - 1e-12
        assert j.size - D16 < need + 1e-12  # the next smaller sixteenth would not do
        assert j.size_strength == pytest.approx(w_req, rel=1e-3)  # 1.392 is rounded
        assert j.check.passed and j.check.ratio <= 1.0
    assert d.passed and d.member_result().governing is not None


def test_continuous_weld_en(girder):
    x, V, _, M, _ = _ss(V0=3000e3)
    d = design_flange_welds(girder, (x, V, V, M, M), steel="S355", standard="EN 1993-1-8")
    j = d.junctions[0]
    s = girder.si
    fvwd = 510e6 / (math.sqrt(3) * 0.90 * 1.25)  # EN 1993-1-8 Eq. (4.4), S355 t <= 40 mm
    a_req = 3000e3 * s.Q_flange_top / s.Ix / 2 / fvwd
    assert j.size_strength == pytest.approx(a_req, rel=REL)
    assert j.size == pytest.approx(max(3e-3, math.ceil(a_req * 1e3 - 1e-9) * 1e-3))
    assert d.size_kind == "throat" and d.method == "simplified"


def test_explicit_size_fails_as_result(girder):
    x, V, *_ = _ss(V0=6000e3)
    d = design_flange_welds(girder, (x, V, V), steel="A572-50", size="5/16 in", steps=False)
    assert not d.passed and d.checks[0].ratio > 1.0
    assert d.checks[0].steps == ()


def test_intermittent_zones_properties(girder):
    x, V, _, M, _ = _ss(L=30.0, V0=800e3, n=1201)
    d = design_flange_welds(girder, (x, V, V, M, M), steel="A572-50", intermittent=True, min_zone="2 m")
    j = d.junctions[0]
    zones = j.zones
    assert zones[0].x0 == pytest.approx(0.0) and zones[-1].x1 == pytest.approx(30.0)
    for a, b in zip(zones[:-1], zones[1:]):
        assert a.x1 == pytest.approx(b.x0)
    assert all(z.x1 - z.x0 >= 2.0 - 1e-9 for z in zones)
    from calckit.design.aisc360.welds import max_connector_spacing, min_intermittent_length

    tf = girder.si.tf_top
    p_code = max_connector_spacing(tf, Fy=345e6, E=200e9, compression=True)[0]
    for z in zones:
        assert z.ratio <= 1.0 + 1e-9
        if not z.continuous:
            assert z.segment >= min_intermittent_length(z.size)[0] - 1e-12
            assert z.pitch <= min(p_code, 12 * IN) + 1e-12
            assert z.pitch >= 2 * z.segment - 1e-12
    assert any(not z.continuous for z in zones)
    assert j.check.passed


def test_user_zone_boundaries_and_en_end_lengths(girder):
    x, V, _, M, _ = _ss(L=20.0, V0=700e3)
    d = design_flange_welds(girder, (x, V, V, M, M), steel="S355", standard="EN", intermittent=True,
                            zones=["5 m", "15 m"])
    z = d.junctions[0].zones
    L_we = 0.75 * girder.si.bf_top  # EN 1993-1-8 4.3.5(5)
    assert z[0].continuous and z[0].x1 == pytest.approx(L_we)
    assert z[-1].continuous and z[-1].x0 == pytest.approx(20.0 - L_we)
    starts = {round(float(zz.x0), 9) for zz in z}
    assert {5.0, 15.0} <= starts  # the user's boundaries are kept
    assert all(zz.ratio <= 1 + 1e-9 for zz in z)


def test_flange_load_vertical_component(girder):
    x = np.linspace(0.0, 10.0, 1001)
    V = np.full_like(x, 500e3)
    P, N = 400e3, 0.150
    d = design_flange_welds(girder, (x, V, V), steel="A572-50",
                            flange_loads=[FlangeLoad.make("5 m", "400 kN", "150 mm", "top")])
    top, bot = d.junctions
    s = girder.si
    lv = N + 5 * s.tf_top  # N + 5k, k = t_f
    i = int(np.argmin(np.abs(x - 5.0)))
    qh = 500e3 * s.Q_flange_top / s.Ix
    assert top.q_v[i] == pytest.approx(P / lv, rel=REL)
    assert top.q_r[i] == pytest.approx(math.hypot(qh, P / lv), rel=REL)
    assert top.theta[i] == pytest.approx(math.atan2(P / lv, qh), rel=REL)
    assert np.all(bot.q_v == 0.0)
    assert top.q_v[0] == 0.0 and top.size >= bot.size


def test_en_directional_with_flange_load(girder):
    x = np.linspace(0.0, 10.0, 501)
    V = np.full_like(x, 500e3)
    d = design_flange_welds(girder, (x, V, V), steel="S355", standard="EN", method="directional",
                            flange_loads=[(5.0, 400e3, 0.15, "top")])
    assert d.method == "directional" and d.junctions[0].check.passed


def test_bad_input(girder):
    x, V, *_ = _ss()
    with pytest.raises(InputError, match="section"):
        shear_flow(SolidRect("100 mm", "300 mm"), (x, V, V))
    with pytest.raises(InputError, match="size"):
        # A 1/8 in weld on 12 mm / 25 mm plates: below Table J2.4 (3/16 in)
        design_flange_welds(girder, (x, V, V), steel="A36", size="0.125 in")
    with pytest.raises(InputError, match="size"):
        design_flange_welds(girder, (x, V, V), steel="S355", standard="EN", size="2 mm")
    with pytest.raises(InputError, match="R"):
        design_fasteners(girder, (x, V, V), R="0 kN")
    with pytest.raises(InputError, match="R"):
        design_fasteners(girder, (x, V, V), R="-5 kN")
    with pytest.raises(InputError, match="section"):
        design_flange_welds(calckit.IShape(d="18 in", bf="7.5 in", tf="0.57 in", tw="0.355 in"), (x, V, V),
                            steel="A992")
    with pytest.raises(InputError, match="standard"):
        design_flange_welds(girder, (x, V, V), steel="A36", standard="BS 5950")
    with pytest.raises(InputError, match="y"):
        interface_at(girder, "2 m")
    with pytest.raises(InputError, match="n"):
        design_fasteners(girder, (x, V, V), R="10 kN", n=0)


def test_zone_pitches_rule():
    x = np.linspace(0.0, 10.0, 101)
    p = 0.05 + 0.02 * x  # loosening to the right
    zones = zone_pitches(x, p, p_max=0.20, step=0.01, min_zone=2.0, p_min=0.08)
    assert zones[0][2] == 0.0  # p < p_min at the left: continuous
    for x0, x1, pz in zones:
        m = (x >= x0 - 1e-9) & (x <= x1 + 1e-9)
        assert pz == 0.0 or pz <= np.min(np.minimum(p[m], 0.20)) + 1e-12
        assert x1 - x0 >= 2.0 - 1e-9
    b = zone_pitches(x, p, p_max=0.20, step=0.01, min_zone=0.0, boundaries=[5.0])
    assert [round(z[0], 9) for z in b] == [0.0, 5.0]
    assert b[1][2] == pytest.approx(0.15)


def test_fasteners_aisc_limits_and_failure():
    bu = calckit.sections.BuiltUp([(calckit.sections.Plate("10 in", "0.5 in"), "0 in", "0 in"),
                                   (calckit.sections.Plate("0.5 in", "20 in"), "4.75 in", "0.5 in"),
                                   (calckit.sections.Plate("10 in", "0.5 in"), "0 in", "20.5 in")])
    x = np.linspace(0.0, 6.0, 61)
    V = 100 * KIP * (1 - x / 3.0)
    d = design_fasteners(bu, (x, V, V), R="10 kip", n=2, standard="AISC 360-22", steel="A36")
    r = d.rows[0]
    # J3.5: min(24 t, 12 in) = 12 in; F13.3 / E6.2 (A36): 0.75 sqrt(29000/36) t = 10.6 in governs
    assert r.s_max == pytest.approx(min(12 * IN, 0.75 * math.sqrt(29000 / 36) * 0.5 * IN), rel=1e-9)
    assert all(z.ratio <= 1 + 1e-9 for z in r.zones)
    q = 100 * KIP * bu.si.Q_flange_top / bu.si.Ix
    assert r.s_strength == pytest.approx(2 * 10 * KIP / q, rel=REL)
    from calckit.render import Check

    chk = [c for c in r.check.steps if isinstance(c, Check)][0]
    assert chk.demand == pytest.approx(r.check.demand, rel=1e-12)
    assert chk.capacity == pytest.approx(r.check.capacity, rel=1e-12)
    # 3 kip bolts need s = 2 x 3 / 3.70 = 1.6 in at the supports, below 2-2/3 d = 2 in (J3.3)
    tight = design_fasteners(bu, (x, V, V), R="3 kip", n=2, standard="AISC", bolt_diameter="0.75 in")
    assert not tight.passed  # spacing below 2-2/3 d near the supports: a result, not an error
    assert any(math.isnan(z.pitch) for z in tight.rows[0].zones)


def _cover_case():
    w = calckit.IShape(d="18 in", bf="7.5 in", tf="0.57 in", tw="0.355 in", r="0.402 in", name="W18X50")
    L = 35 * 0.3048
    x = np.linspace(0.0, L, 1401)
    wu = 3.5 * KIP / 0.3048
    M = wu * x * (L - x) / 2
    V = wu * (L / 2 - x)
    return w, L, wu, (x, V, V, M, M)


def test_cover_plates_cutoffs_and_termination():
    w, L, wu, env = _cover_case()
    Mb = 379 * KIP * 0.3048
    cp = design_cover_plates(w, env, M_bare=Mb, steel="A992", top=("6 in", "0.5 in"),
                             bottom=("6 in", "0.5 in"))
    # |M| = Mb where w x (L - x) / 2 = Mb
    xa = L / 2 - math.sqrt((L / 2) ** 2 - 2 * Mb / wu)
    top = cp.plates[0]
    assert top.cutoff[0] == pytest.approx(xa, abs=1e-4)
    assert top.cutoff[1] == pytest.approx(L - xa, abs=1e-4)
    size = top.termination.data["size"]
    ap = 6 * IN * (1.0 if size >= 0.75 * 0.5 * IN else 1.5)  # F13-7 / F13-8 with the end weld
    assert top.a_prime == pytest.approx(ap)
    assert top.ends[0] == pytest.approx(top.cutoff[0] - ap)
    plated = cp.plated.si
    Qp = 6 * IN * 0.5 * IN * (plated.d - 0.25 * IN - plated.y_c)
    assert top.welds.interface.Q == pytest.approx(Qp, rel=1e-9)
    assert top.F_end == pytest.approx(Mb * Qp / plated.Ix, rel=1e-4)
    assert top.termination.passed and cp.passed
    cp2 = design_cover_plates(w, env, M_bare=lambda xx: np.full_like(xx, Mb), steel="A992",
                              top=("6 in", "0.5 in"), end_weld=False)
    assert cp2.plates[0].a_prime == pytest.approx(2 * 6 * IN)  # F13-9
    none = design_cover_plates(w, env, M_bare=2 * Mb, steel="A992", top=("6 in", "0.5 in"))
    assert none.plates == () and "no cover plate" in none.notes[-1]


def test_cover_plates_en_needs_extension():
    w, L, wu, env = _cover_case()
    with pytest.raises(NotCoveredError):
        design_cover_plates(w, env, M_bare="514 kN*m", steel="S355", top=("150 mm", "12 mm"), standard="EN")
    cp = design_cover_plates(w, env, M_bare="514 kN*m", steel="S355", top=("150 mm", "12 mm"), standard="EN",
                             extension="300 mm")
    assert cp.plates[0].a_prime == pytest.approx(0.3)
    with pytest.raises(InputError, match="M_bare"):
        design_cover_plates(w, env, M_bare=0.0, steel="A992", top=("6 in", "0.5 in"))


def test_figures_render(girder, mono):
    x, V, _, M, _ = _ss()
    out = []
    out.append(shear_flow(mono, (x, V, V)).figure())
    out.append(design_flange_welds(mono, (x, V, V, M, M), steel="S355", standard="EN", intermittent=True).figure())
    bu = calckit.sections.BuiltUp([(calckit.sections.Plate("100 mm", "20 mm"), "0 mm", "0 mm"),
                                   (calckit.sections.Plate("20 mm", "100 mm"), "40 mm", "20 mm"),
                                   (calckit.sections.Plate("100 mm", "20 mm"), "0 mm", "120 mm")])
    out.append(design_fasteners(bu, (x, V / 1000, V / 1000), R="1 kN", s_max="100 mm").figure("US"))
    w, L, wu, env = _cover_case()
    out.append(design_cover_plates(w, env, M_bare=379 * KIP * 0.3048, steel="A992",
                                   top=("6 in", "0.5 in")).figure("US"))
    for fig in out:
        buf = io.BytesIO()
        fig.savefig(buf, format="png")
        assert buf.getvalue()[:4] == b"\x89PNG"


@pytest.mark.parametrize("kw", [dict(), dict(intermittent=True), dict(standard="EN", steel="S355"),
                                dict(standard="EN", steel="S355", method="directional", intermittent=True),
                                dict(method="ASD", flange_loads=[(10.0, 300e3, 0.1, "top")])])
def test_steps_and_numeric_path_agree(mono, kw):
    from calckit.render import Check

    x, V, _, M, _ = _ss(V0=1500e3)
    opts = dict(steel="A572-50")
    opts.update(kw)
    fast = design_flange_welds(mono, (x, V, V, M, M), steps=False, **opts)
    full = design_flange_welds(mono, (x, V, V, M, M), steps=True, **opts)
    for a, b in zip(fast.checks, full.checks):
        assert a.ratio == pytest.approx(b.ratio, rel=1e-12) and a.steps == ()
        chk = [r for r in b.steps if isinstance(r, Check)][0]
        assert chk.demand == pytest.approx(b.demand, rel=1e-12)
        assert chk.capacity == pytest.approx(b.capacity, rel=1e-12)


def test_thin_web_base_metal_governs():
    # AISC 360-22 J4.2: phi 0.60 Fu tw per unit length; a 1/4 in web (A36, Fu 58 ksi) carries
    # 0.75 x 0.60 x 58 x 0.25 = 6.525 kip/in whatever the weld size
    g = calckit.PlateGirder(d="60 in", tw="0.25 in", bf_top="24 in", tf_top="2 in")
    s = g.si
    q_target = 8.0 * KIP_IN  # above the web's rupture strength
    V = q_target * s.Ix / s.Q_flange_top
    x = np.array([0.0, 5.0])
    d = design_flange_welds(g, (x, np.full(2, V), np.full(2, -V)), steel="A36", size="5/16 in")
    c = d.checks[0]
    assert not c.passed and "J4.2" in c.clause
    assert c.capacity == pytest.approx(0.75 * 0.60 * 58 * 0.25 * KIP_IN, rel=1e-9)
    assert c.ratio == pytest.approx(c.demand / c.capacity, rel=1e-12)
