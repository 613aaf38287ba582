"""Tests of calckit.proportion: plate stock, the vectorised section properties, the pruning bounds, and
the search against an exhaustive check of every proportion of a small stock.

Section properties of a doubly symmetric welded I (three rectangles; any mechanics text, e.g. Gere,
Mechanics of Materials 7th ed., Sec. 12.5 parallel-axis theorem): Ix = tw hw^3/12 + 2 [bf tf^3/12 +
bf tf ((hw + tf)/2)^2]; plastic modulus Zx = bf tf (hw + tf) + tw hw^2 / 4. Upper bounds used for pruning:
no flexural resistance exceeds the plastic moment (AISC 360-22 F2-F5: Mn <= Mp = Fy Zx; EN 1993-1-1
6.2.5: M_c,Rd <= W_pl fy / gamma_M0) and no shear resistance exceeds 0.6 Fy d tw (AISC 360-22 G2.1,
Cv <= 1) or eta fy hw tw / (sqrt(3) gamma_M1) (EN 1993-1-5 5.2(1)).
"""
from __future__ import annotations

import itertools

import numpy as np
import pytest

from calckit.errors import InputError
from calckit.pick import member
from calckit.proportion import GirderCandidate, PlateStock, plate_stock, proportion

REL = 1e-9
MM = 1e-3


def test_default_stock_is_common_practice():
    s = plate_stock("SI")
    assert isinstance(s, PlateStock) and s.source == "common practice"
    assert [round(t / MM) for t in s.thicknesses] == [8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 100]
    assert [round(b / MM) for b in s.widths] == list(range(200, 601, 50))
    u = plate_stock("US")
    steps = np.diff(np.array(u.thicknesses) / 0.0254)
    assert set(np.round(steps, 4)) <= {0.125, 0.25}
    g = plate_stock(thicknesses=["20 mm", "10 mm", "10 mm"], widths=["300 mm"], web_thicknesses=["8 mm"])
    assert g.thicknesses == (0.01, 0.02) and g.source == "given"
    with pytest.raises(InputError):
        plate_stock("metric")
    with pytest.raises(InputError):
        plate_stock(thicknesses="10 mm")


def _small(**kw):
    base = dict(spans="16 m", dead_udl="20 kN/m", live_udl="30 kN/m", standard="EN 1993-1-1", grade="S355",
                bracing="quarters")
    base.update(kw)
    return member(**base)


SMALL = plate_stock(thicknesses=["12 mm", "15 mm", "20 mm", "25 mm"], widths=["250 mm", "300 mm", "350 mm"],
                    web_thicknesses=["8 mm", "10 mm"])


def test_result_is_sorted_and_every_best_passes():
    r = proportion(_small(), web_depth=("700 mm", "1000 mm"), depth_step="100 mm", stock=SMALL, n_best=4)
    assert 1 <= len(r.best) <= 4 and all(isinstance(c, GirderCandidate) for c in r.best)
    masses = [c.mass for c in r.best]
    assert masses == sorted(masses) and all(c.passed and c.ratio <= 1 for c in r.best)
    c = r.best[0]
    s = c.section().si
    assert s.Ix == pytest.approx(c.tw * c.hw ** 3 / 12 + 2 * (c.bf * c.tf ** 3 / 12 + c.bf * c.tf * ((c.hw + c.tf) / 2) ** 2),
                                 rel=REL)
    assert s.Zx == pytest.approx(c.bf * c.tf * (c.hw + c.tf) + c.tw * c.hw ** 2 / 4, rel=REL)
    assert c.mass == pytest.approx(s.mass, rel=REL)  # unstiffened: plates only
    assert any(n.startswith("Fillet welds") for n, _ in c.checks) and c.weld > 0
    assert r.n_combinations == 4 * 2 * 3 * 4  # depths x web thicknesses x widths x thicknesses
    assert r.text().splitlines()[1].split()[0] == "1"
    assert r.chosen is r.best[0]


def _exhaustive(m, web_depths, stock, n_best):
    """Every proportion fully checked (no pruning, no screening), lightest first."""
    from calckit.pick.checks import checker_for
    from calckit.pick.response import Response
    from calckit.materials import steel
    from calckit.proportion import G, RHO, _full_check

    st = steel(m.grade)
    rows = []
    for hw, tw, bf, tf in itertools.product(web_depths, stock.web_thicknesses, stock.widths, stock.thicknesses):
        if tf < tw or bf <= tw:
            continue
        rows.append((RHO * (hw * tw + 2 * bf * tf), hw + 2 * tf, hw, tw, bf, tf))
    rows.sort()
    resp = Response(m, w_ref=float(np.median([r[0] for r in rows]) * G))
    check = checker_for(m)
    out = []
    for mass, d, hw, tw, bf, tf in rows:
        c = _full_check(m, resp, check, st, hw, tw, bf, tf, None, None, mass, 0.0)
        if c.passed:
            out.append(c)
            if len(out) == n_best:
                break
    return out


@pytest.mark.parametrize("standard, grade, overhang", [("EN 1993-1-1", "S355", False), ("AISC 360-22", "A572-50", False),
                                                     ("EN 1993-1-1", "S355", True), ("AISC 360-22", "A572-50", True)])
def test_pruning_and_screening_lose_nothing(standard, grade, overhang):
    m = _small(standard=standard, grade=grade)
    if overhang:  # a 10 m span with a 2.5 m overhang, restrained at the supports (overhang LTB in both standards)
        m = _small(standard=standard, grade=grade, spans=["10 m", "2.5 m"], supports=["pin", "roller", "free"],
                   bracing="supports", dead_udl="8 kN/m", live_udl="10 kN/m")
    depths = (0.7, 0.8, 0.9, 1.0)
    want = _exhaustive(m, depths, SMALL, 3)
    assert len(want) == 3
    got = proportion(m, web_depth=("700 mm", "1000 mm"), depth_step="100 mm", stock=SMALL, n_best=3)
    key = lambda c: (round(c.hw, 6), round(c.tw, 6), round(c.bf, 6), round(c.tf, 6))  # noqa: E731
    assert [key(c) for c in got.best] == [key(c) for c in want]
    assert got.n_checked < len(list(itertools.product(depths, SMALL.web_thicknesses, SMALL.widths, SMALL.thicknesses)))


@pytest.mark.parametrize("standard, grade", [("EN 1993-1-1", "S355"), ("AISC 360-22", "A572-50")])
def test_bounds_exceed_the_design_resistances(standard, grade):
    """The pruning bounds are upper bounds of the design modules' resistances (so pruning is safe)."""
    from calckit.materials import steel
    from calckit.sections import PlateGirder

    st = steel(grade)
    fy = st.bands[0][1]
    rng = np.random.default_rng(7)
    for _ in range(12):
        hw = rng.uniform(0.5, 2.5)
        tw = rng.choice([0.008, 0.010, 0.012, 0.016])
        bf = rng.uniform(0.2, 0.6)
        tf = rng.choice([0.012, 0.02, 0.03, 0.04])
        pg = PlateGirder.from_si(hw + 2 * tf, tw, bf, tf)
        Zx = bf * tf * (hw + tf) + tw * hw ** 2 / 4
        if standard.startswith("AISC"):
            from calckit.design import aisc360

            Mc = aisc360.flexure(pg, st, Lb=0, steps=False).capacity
            Vc = aisc360.shear(pg, st, steps=False).capacity
            assert Mc <= 0.9 * fy * Zx * (1 + 1e-9)
            assert Vc <= 0.6 * fy * (hw + 2 * tf) * tw * (1 + 1e-9)
            Vs = aisc360.shear(pg, st, a=f"{hw} m", steps=False).capacity
            assert Vs <= 0.6 * fy * (hw + 2 * tf) * tw * (1 + 1e-9)
        else:
            from calckit.design import en1993

            Mc = en1993.bending(pg, st, steps=False).capacity
            Vc = en1993.shear(pg, st, steps=False).capacity
            assert Mc <= fy * Zx * (1 + 1e-9)
            assert Vc <= 1.2 * fy * hw * tw / 3 ** 0.5 * (1 + 1e-9)


def test_stiffener_options_and_mass():
    m = member("8 m", dead_udl="150 kN/m", live_udl="200 kN/m", standard="AISC 360-22", grade="A572-50")
    stock = plate_stock("US", web_thicknesses=["0.3125 in", "0.375 in", "0.5 in"])
    r = proportion(m, web_depth=("30 in", "44 in"), stiffeners="allow", stock=stock, n_best=3)
    assert r.best and r.stiffener_options[0] is None and len(r.stiffener_options) == 5
    for c in r.best:
        if c.a is not None:
            bs, ts = c.stiffener
            assert c.mass_stiffeners == pytest.approx(2 * bs * ts * c.hw * 7850 / c.a, rel=REL)
            assert bs / ts <= 12 + 1e-9 and any("Transverse stiffener" in n for n, _ in c.checks)
        assert c.mass == pytest.approx(c.mass_girder + c.mass_stiffeners, rel=REL)
    assert "stiffener" in " ".join(r.notes)


@pytest.mark.parametrize("kw, word", [
    (dict(web_depth=("2 m", "1 m")), "web_depth"),
    (dict(web_depth=("1 m",)), "web_depth"),
    (dict(stiffeners=["x"]), "stiffeners"),
    (dict(stiffeners=[0]), "stiffeners"),
    (dict(n_best=0), "n_best"),
])
def test_bad_input(kw, word):
    with pytest.raises(InputError) as e:
        proportion(_small(), stock=SMALL, **kw)
    assert word in str(e.value)
