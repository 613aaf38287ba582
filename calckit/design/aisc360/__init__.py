"""Steel member checks to ANSI/AISC 360-22, Specification for Structural Steel Buildings (LRFD and ASD).

Public API (SI floats inside; quantities or strings such as "11.7 ft" at the boundary):

``flexure(section, steel, Lb=..., Cb=1.0, method="LRFD")``
    Chapter F, F2-F6: classification (Table B4.1b), yielding, lateral-torsional buckling, flange local
    buckling, compression/tension flange yielding; returns a CheckResult (capacity phi_b Mn or Mn/Omega_b,
    nominal Mn, clause, steps, data with Lp, Lr, Mp, Fcr, class ...).
``shear(section, steel, a=None, method="LRFD")``
    Chapter G, G2.1, G2.2 (tension field action), G6 (minor axis).
``transverse_stiffener(...)``  G2.3 stiffener requirements (Ist, b/t).
``concentrated(...)``, ``web_local_yielding``, ``web_crippling``, ``flange_local_bending``  J10.1-J10.3;
    ``web_sidesway_buckling`` J10.4; ``web_compression_buckling`` J10.5 (Eq. J10-8);
    ``stiffener_pair(...)`` the transverse/bearing stiffener pair for a force the web cannot take (J10.7,
    J10.8, with J4.4 / Chapter E for the stiffener column and J7 for bearing on the fitted ends).
``deflection(delta, span, n=None, ...)``  L/n limits (common practice defaults, IBC Table 1604.3 from memory).
``classify(section, steel)``  Table B4.1b classification with steps.
``check_member(section, steel, analysis, bracing=..., bearing=[...], deflections={...})``
    every check along a member and the governing one (MemberResult); ``demands(...)`` prepares the
    section-independent demands once for a section search (``check_member(..., demands=D, steps=False)``).

Resistance factors (AISC 360-22 B3.1/B3.2 and the clauses): flexure phi_b 0.90 / Omega_b 1.67; shear phi_v
0.90 / Omega_v 1.67, or 1.00 / 1.50 for webs of rolled I-shapes with h/tw <= 2.24 sqrt(E/Fy); J10.1 0.90 /
1.67; J10.2 1.00 / 1.50; J10.3 0.75 / 2.00; J10.4 0.85 / 1.76; J10.5 0.90 / 1.67. Equation numbers are those of AISC 360-16, unchanged in
360-22 for these clauses (from memory).

Shapes covered: rolled and welded I-shapes (doubly or singly symmetric) and channels (compact, F2). Other
shapes raise NotCoveredError naming the section of the Specification that would apply.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed engineer; the
governing building code and the project specification take precedence.
"""
from __future__ import annotations

from .cb import cb_value as cb
from .classify import Classification, Element, classify
from .concentrated import (Bearing, bearing, concentrated, flange_local_bending, web_compression_buckling,
                           web_crippling, web_local_yielding, web_sidesway_buckling)
from .deflection import LIMITS, deflection
from .demands import Demands, demands
from .flexure import flexure
from .member import check_member
from .shear import shear, transverse_stiffener
from .stiffeners import stiffener_pair

__all__ = [
    "flexure", "shear", "transverse_stiffener", "concentrated", "web_local_yielding", "web_crippling",
    "flange_local_bending", "web_sidesway_buckling", "web_compression_buckling", "stiffener_pair", "bearing", "Bearing", "deflection", "LIMITS", "classify", "Classification",
    "Element", "check_member", "demands", "Demands", "cb",
]
