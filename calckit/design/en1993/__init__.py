"""Steel member checks to EN 1993-1-1:2005 with EN 1993-1-5:2006 (rolled and welded I-sections).

Public API (units at the boundary: pint quantities or strings such as "5.7 m", "90 kN*m")::

    from calckit.design import en1993
    en1993.bending(section, steel, M_Ed, V_Ed=None, ...)       # 6.2.5 / 6.2.8 (EN 1993-1-5 4.4, 7.1)
    en1993.shear(section, steel, V_Ed, a=None, ...)             # 6.2.6 / EN 1993-1-5 section 5
    en1993.ltb(section, steel, L="5.7 m", C1=None, moment_diagram=None, zg=0, method="general"|"rolled")
    en1993.transverse(section, steel, F_Ed, ss=..., load_type="a")   # EN 1993-1-5 section 6
    en1993.bearing_stiffener(section, steel, F_Ed, b_s=..., t_s=..., end=True)   # EN 1993-1-5 section 9
    en1993.size_bearing_stiffener(section, steel, F_Ed, end=True)                # thinnest passing pair
    en1993.deflection(delta, span, kind="total")                # 7.2 (limits from the annex set)
    en1993.classify(section, steel)                             # Table 5.2
    en1993.check_member(section, steel, x=..., M=..., V=..., restraints=..., forces=..., deflections=...)
    arr = calckit.analysis.arrangements(solution, combinations)     # the real diagram of every arrangement:
    en1993.check_member(section, steel, analysis=arr, restraints=...)  # LTB per segment under each diagram
    D = en1993.demands(x=..., M=..., V=..., restraints=..., zg=...)   # once per member, for a search:
    en1993.check_member(section, steel, demands=D, steps=False)       # then per section
    D = en1993.demands(x=..., M={name: M_loads}, V=..., self_weight=(M_unit, V_unit, factors))
    en1993.check_member(section, steel, demands=D.with_self_weight(w), steps=False)  # w: its self-weight
    en1993.ltb(section, steel, L="2 m", moment_diagram="udl", cantilever=True)   # free-ended segment
    en1993.annex_set("recommended" | "UK" | {...})              # partial factors and national choices

Every check returns an :class:`ENResult` (a CheckResult whose data entries are attributes:
``.capacity``, ``.ratio``, ``.clause``, ``.steps``, ``.Mcr``, ``.chi_LT``, ``.lambda_LT`` ...);
``check_member`` returns a :class:`~calckit.design.results.MemberResult`. The national-annex set used is
named in each result's ``data["annex"]``.

Notation follows EN 1993 (y-y major axis, W_pl,y, M_c,Rd, chi_LT); the section objects keep calckit's x-x
major convention (I_y = si.Ix, I_z = si.Iy, W_pl,y = si.Zx, W_el,y = si.Sx, I_t = si.J, I_w = si.Cw).

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from ._result import ENResult
from .bending import bending
from .classify import Classification, classify
from .deflection import deflection
from .factors import AnnexSet, annex_set, known_sets
from .ltb import chi_lt, ltb
from .mcr import equivalent_factors, mcr_energy, mcr_formula
from .demands import Demands, demands
from .member import Force, check_member, from_analysis
from .shear import shear
from .stiffeners import StiffenerSizing, bearing_stiffener, size_bearing_stiffener
from .transverse import transverse

__all__ = ["bending", "shear", "ltb", "transverse", "deflection", "classify", "check_member", "Force",
           "from_analysis", "annex_set", "known_sets", "AnnexSet", "ENResult", "Classification", "chi_lt",
           "mcr_formula", "mcr_energy", "equivalent_factors", "demands", "Demands", "bearing_stiffener",
           "size_bearing_stiffener", "StiffenerSizing"]
