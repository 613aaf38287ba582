"""Tests of calckit.analysis.diagrams: figures are made, printable (black lines), in the right units,
with extrema labelled and the deflection limit drawn."""
from __future__ import annotations

import subprocess
import sys
from dataclasses import dataclass

import pytest

matplotlib = pytest.importorskip("matplotlib")
from matplotlib.colors import to_rgba  # noqa: E402
from matplotlib.figure import Figure  # noqa: E402

from calckit import Beam  # noqa: E402
from calckit.analysis import diagrams  # noqa: E402
from calckit.errors import InputError  # noqa: E402


@dataclass(frozen=True)
class Combo:
    name: str
    factors: dict
    pattern: frozenset = frozenset()


@pytest.fixture(scope="module")
def simple():
    b = Beam("6 m", ["pin", "roller"], EI="2e4 kN*m**2", name="B-1")
    b.udl("10 kN/m", "D").point("5 kN", "2 m", "L")
    return b


@pytest.fixture(scope="module")
def cont():
    b = Beam(["2 m", "6 m", "6 m"], ["free", "pin", "roller", "fixed"], EI="4e4 kN*m**2", hinges=["9 m"])
    b.udl("10 kN/m", "D").udl("15 kN/m", "L").linear("0 kN/m", "8 kN/m", "9 m", "14 m", "S")
    b.moment("10 kN*m", "12 m", "D").point("-4 kN", "1 m", "W")
    return b


def texts(fig):
    out = []
    for ax in fig.axes:
        out += [t.get_text() for t in ax.texts]
        out += [c.get_text() for c in ax.get_children() if type(c).__name__ == "Annotation"]
        out += [ax.get_xlabel(), ax.get_ylabel()] + [ax.get_title(loc=w) for w in ("left", "center", "right")]
    return " | ".join(out)


def test_each_function_returns_a_figure_that_saves_to_png(simple, tmp_path):
    r = simple.solve()["D"]
    figs = [diagrams.loading_diagram(simple), diagrams.shear_diagram(r), diagrams.moment_diagram(r),
            diagrams.deflection_diagram(r, limit=360), diagrams.beam_diagrams(simple, r, limit=360)]
    for i, f in enumerate(figs):
        assert isinstance(f, Figure)
        p = tmp_path / f"d{i}.png"
        f.savefig(p, dpi=50)
        assert p.stat().st_size > 1000


def test_no_pyplot_and_agg_safe():
    code = ("import matplotlib; matplotlib.use('Agg'); import sys\n"
            "from calckit import Beam\nfrom calckit.analysis import diagrams\n"
            "b = Beam('6 m', ['pin', 'roller'], EI='2e4 kN*m**2').udl('10 kN/m', 'D')\n"
            "diagrams.beam_diagrams(b, b.solve()['D'], limit=240).savefig('/dev/null', format='png')\n"
            "print('matplotlib.pyplot' in sys.modules)")
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"


def test_lines_are_black(cont):
    sol = cont.solve()
    f = diagrams.beam_diagrams(cont, sol.combine({"D": 1.2, "L": 1.6}), limit=240)
    for ax in f.axes:
        for line in ax.get_lines():
            assert to_rgba(line.get_color())[:3] == (0.0, 0.0, 0.0)


def test_si_units_and_extrema_labels(simple):
    r = simple.solve()["D"]
    t = texts(diagrams.moment_diagram(r))
    assert "kN·m" in t and "x (m)" in t
    assert "Mmax = 45 kN·m" in t  # 10 kN/m x 6^2 / 8
    t = texts(diagrams.shear_diagram(r))
    assert "Vmax = 30 kN" in t and "Vmin = -30 kN" in t


def test_us_units(simple):
    r = simple.solve()["D"]
    t = texts(diagrams.beam_diagrams(simple, r, limit=360, system="US"))
    assert "kip·ft" in t and "x (ft)" in t and "kip" in t and "in" in t and "kip/ft" in t


def test_deflection_limit_line_label(simple):
    r = simple.solve()["D"]
    t = texts(diagrams.deflection_diagram(r, limit=360))
    assert "L/360 = 16.7 mm" in t  # 6000 mm / 360
    t = texts(diagrams.deflection_diagram(r, limit="20 mm"))
    assert "limit 20 mm" in t
    # the value labelled is the deflection, downward positive: 5 w L^4 / 384 EI = 8.44 mm
    assert "8.44 mm (down)" in t


def test_cantilever_limit_uses_twice_the_length(cont):
    t = texts(diagrams.deflection_diagram(cont.solve()["D"], limit=240))
    assert "2L/240 = 16.7 mm" in t  # the 2 m overhang


def test_envelope_is_shaded_and_labelled(cont):
    sol = cont.solve()
    env = sol.envelope([Combo("1.4D", {"D": 1.4}), Combo("1.2D+1.6L+0.5S", {"D": 1.2, "L": 1.6, "S": 0.5},
                                                       frozenset({"L", "S"}))])
    f = diagrams.moment_diagram(envelope=env)
    ax = f.axes[0]
    assert len(ax.collections) >= 1  # the shaded band
    t = texts(f)
    assert "Mmax" in t and "Mmin" in t and "envelope of 2 combination(s)" in t
    f = diagrams.deflection_diagram(envelope=env, limit=240)
    assert "L/240" in texts(f)
    diagrams.beam_diagrams(cont, envelope=env, limit=240)


def test_loading_diagram_shows_each_case(cont):
    t = texts(diagrams.loading_diagram(cont))
    for case in ("D", "L", "S", "W"):
        assert case in t
    assert "0 to 8 kN/m" in t and "-4 kN" in t and "10 kN·m" in t
    t = texts(diagrams.loading_diagram(cont, cases="S", system="US"))
    assert "kip/ft" in t


def test_bad_input(simple):
    r = simple.solve()["D"]
    with pytest.raises(InputError, match="system"):
        diagrams.moment_diagram(r, system="metric")
    with pytest.raises(InputError, match="result/envelope"):
        diagrams.shear_diagram()
    with pytest.raises(InputError, match="case"):
        diagrams.loading_diagram(simple, cases=["X"])
    with pytest.raises(InputError, match="limit"):
        diagrams.deflection_diagram(r, limit=0)
