"""C1 and C2 for standard moment diagrams against published tables.

Sources (values FROM MEMORY):
[ENV]   ENV 1993-1-1:1992, Annex F, Table F.1.2 (transverse loading, fork supports): UDL: k = 1.0:
        C1 = 1.132, C2 = 0.459; k = 0.5: C1 = 0.972, C2 = 0.304. Central point load: k = 1.0: C1 = 1.365,
        C2 = 0.553; k = 0.5: C1 = 1.070, C2 = 0.432. Uniform moment: C1 = 1.000.
[SN003] Access Steel NCCI SN003, "Elastic critical moment for lateral torsional buckling", Tables for
        end moments (k = 1): psi = 0.5: C1 = 1.31; psi = 0: C1 = 1.77.

calckit derives C1/C2 from the moment diagram by a Rayleigh-Ritz energy solution (calckit.design.en1993.mcr).
The tabulated factors are fits that depend slightly on the torsion parameter of the beam; tolerances:
REL_C1 = 2 % for transverse loads and uniform moment, REL_PSI = 4 % for end-moment cases (the tables'
values vary by a few % with the torsion parameter), REL_C2 = 3 %.
The beam is the IPE 330 of SX001a (torsion parameter typical of floor beams), L = 5.7 m.
"""
from __future__ import annotations

import pytest

from calckit.design.en1993.mcr import equivalent_factors, standard_diagram

REL_C1 = 0.02
REL_C2 = 0.03
REL_PSI = 0.04
E, G = 210e9, 80770e6
EIZ, GIT, EIW = E * 788.1e-8, G * 28.15e-8, E * 199100e-12
L = 5.7
ZG = 0.165


def factors(name, k=1.0, psi=None, zg=ZG):
    return equivalent_factors(L, EIZ, GIT, EIW, standard_diagram(name, psi), zg=zg, k=k, kw=k)


def test_uniform_moment_is_one():
    assert factors("uniform", zg=0.0).C1 == pytest.approx(1.0, rel=1e-9)
    assert factors("uniform", k=0.5, zg=0.0).C1 == pytest.approx(1.0, rel=1e-9)


@pytest.mark.parametrize("name,k,c1,c2", [
    ("udl", 1.0, 1.132, 0.459), ("udl", 0.5, 0.972, 0.304),
    ("point", 1.0, 1.365, 0.553), ("point", 0.5, 1.070, 0.432),
])
def test_transverse_load_cases_ENV_F12(name, k, c1, c2):
    f = factors(name, k=k)
    assert f.C1 == pytest.approx(c1, rel=REL_C1)
    tol = REL_C2 if name == "udl" else 0.04  # point-load C2 differs between ENV (0.553) and SN003 (0.630)
    assert f.C2 == pytest.approx(c2, rel=tol)


@pytest.mark.parametrize("psi,c1", [(0.5, 1.31), (0.0, 1.77)])
def test_end_moments_SN003(psi, c1):
    assert factors("linear", psi=psi, zg=0.0).C1 == pytest.approx(c1, rel=REL_PSI)


def test_linear_C1_grows_as_psi_falls():
    vals = [factors("linear", psi=p, zg=0.0).C1 for p in (1.0, 0.5, 0.0, -0.5)]
    assert vals == sorted(vals)
