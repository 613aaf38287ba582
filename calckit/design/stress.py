"""Normal and shear stress through the depth of a section (elastic beam theory).

For any section of :mod:`calckit.sections` under a bending moment M about the major (x-x) axis and a
vertical shear V:

* normal stress, Navier's flexure formula: ``sigma(y) = -M (y - y_c) / I_x``;
* shear stress, the shear formula (Jourawski): ``tau(y) = V Q(y) / (I_x t(y))``,

with ``y`` the height from the bottom fibre, ``y_c`` the elastic neutral axis (NA), ``Q(y)`` the first
moment about the NA of the area above the cut (:meth:`Section.Q_at_si`) and ``t(y)`` the material width at
the cut (:meth:`Section.width_at_si`). References: Gere, Mechanics of Materials, 7th ed., Sec. 5.5
(flexure formula) and Sec. 5.8-5.10 (shear formula, webs of beams with flanges) (section numbers from
memory).

Sign convention: tension positive; M positive sagging (compression at the top), as in
:mod:`calckit.analysis`; V positive as there. sigma is zero at the elastic NA, which is off mid-depth for a
mono-symmetric girder. tau takes the sign of V. The shear formula gives the average over the width t(y);
it is exact for the web of an I and approximate in wide flanges (where the stress is mostly horizontal).

Where the width jumps (flange-web junction, edges of cover plates) the height appears twice in the table:
first with the width just below, then just above, so the jump of tau shows. Public surface:
:func:`stress_profile` and :class:`StressProfile`; the figure is :func:`calckit.design.figures.stress_figure`.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ..errors import InputError
from ..render.formula import Formula
from ..render.records import given

__all__ = ["StressProfile", "stress_profile", "SIGMA", "TAU"]

_REF_SIGMA = "flexure formula (Gere, Mechanics of Materials 7th ed., Sec. 5.5)"
_REF_TAU = "shear formula (Gere, Mechanics of Materials 7th ed., Sec. 5.8)"

#: Normal stress at height y (tension positive, M sagging positive).
SIGMA = Formula("sigma", "-M*(y - y_c)/I_x", ref=_REF_SIGMA, label="normal stress at height y",
                dims={"sigma": "stress", "M": "moment", "y": "length", "y_c": "length", "I_x": "inertia"})
#: Shear stress at height y, averaged over the width t.
TAU = Formula("tau", "V*Q/(I_x*t)", ref=_REF_TAU, label="shear stress at height y",
              dims={"tau": "stress", "V": "force", "Q": "modulus", "I_x": "inertia", "t": "length"})

_COLUMNS = (  # name, dimension, description
    ("y", "length", "height from the bottom fibre"),
    ("t", "length", "material width at the cut"),
    ("Q", "modulus", "first moment about the NA of the area above the cut"),
    ("sigma", "stress", "normal stress, tension positive"),
    ("tau", "stress", "shear stress VQ/(I t)"),
)


@dataclass(frozen=True)
class StressProfile:
    """Stresses through the depth of a section, SI floats (m, m3, Pa).

    Arrays run from the bottom fibre (y = 0) to the top (y = d); where the width jumps, the height is
    repeated (below-side value first).
    """

    section: str  #: section designation
    M: float  #: bending moment, N*m (sagging positive)
    V: float  #: vertical shear, N
    y_c: float  #: elastic neutral axis from the bottom fibre, m
    Ix: float  #: major-axis second moment of area, m4
    d: float  #: overall depth, m
    y: np.ndarray = field(repr=False)  #: heights from the bottom fibre, m
    t: np.ndarray = field(repr=False)  #: material width at each height, m
    Q: np.ndarray = field(repr=False)  #: first moment about the NA of the area above each cut, m3
    sigma: np.ndarray = field(repr=False)  #: normal stress, Pa (tension positive)
    tau: np.ndarray = field(repr=False)  #: shear stress, Pa (sign of V)
    junctions: tuple = ()  #: heights (m) where the width jumps (flange-web junctions, plate edges)
    outline: tuple = field(default=(), repr=False)  #: the section's drawing primitives (Section.outline())

    @property
    def sigma_top(self) -> float:
        """Normal stress at the top fibre, Pa."""
        return float(self.sigma[-1])

    @property
    def sigma_bot(self) -> float:
        """Normal stress at the bottom fibre, Pa."""
        return float(self.sigma[0])

    @property
    def tau_max(self) -> float:
        """Largest |tau|, Pa (with the sign of V)."""
        return float(self.tau[int(np.argmax(np.abs(self.tau)))])

    @property
    def y_tau_max(self) -> float:
        """Height of the largest |tau|, m."""
        return float(self.y[int(np.argmax(np.abs(self.tau)))])

    @property
    def tau_na(self) -> float:
        """Shear stress at the elastic NA, Pa."""
        i = int(np.argmin(np.abs(self.y - self.y_c)))
        return float(self.tau[i])

    def table(self, system: str = "SI") -> dict[str, tuple[str, np.ndarray]]:
        """Columns in display units: ``{name: (unit, values)}`` for y, t, Q, sigma, tau."""
        from ..render.numfmt import display_unit_for, si_to_display

        out = {}
        for name, dim, _ in _COLUMNS:
            unit = display_unit_for(dim, system)
            out[name] = (unit, np.asarray(si_to_display(getattr(self, name), dim, unit)))
        return out

    def text(self, system: str = "SI", every: int = 1) -> str:
        """A plain-text table (every ``every``-th row, plus the junction rows and the NA)."""
        cols = self.table(system)
        keep = set(range(0, len(self.y), max(1, int(every)))) | {len(self.y) - 1}
        for yj in (*self.junctions, self.y_c):
            keep |= set(np.flatnonzero(np.abs(self.y - yj) <= 1e-12 * max(self.d, 1.0)).tolist())
        head = "  ".join(f"{n} [{u}]".rjust(14) for n, (u, _) in cols.items())
        rows = [head]
        for i in sorted(keep):
            rows.append("  ".join(f"{v[i]:14.5g}" for _, v in cols.values()))
        return "\n".join(rows)

    def steps(self, y: float | None = None) -> tuple:
        """Calc-sheet steps for sigma and tau at height ``y`` (m; default: the NA for tau and the extreme
        fibre for sigma)."""
        recs = [given("M", self.M, "moment", reference="analysis"),
                given("V", self.V, "force", reference="analysis"),
                given("I_x", self.Ix, "inertia", reference="section properties"),
                given("y_c", self.y_c, "length", reference="section properties (elastic NA)")]
        ys = self.d if abs(self.d - self.y_c) >= self.y_c else 0.0
        yt = self.y_c if y is None else float(y)
        if y is not None:
            ys = float(y)
        recs.append(SIGMA.step(M=self.M, y=ys, y_c=self.y_c, I_x=self.Ix,
                               note=f"at y = {ys * 1e3:.4g} mm from the bottom"))
        i = int(np.argmin(np.abs(self.y - yt)))
        recs.append(TAU.step(V=self.V, Q=float(self.Q[i]), I_x=self.Ix, t=float(self.t[i]),
                             note=f"at y = {float(self.y[i]) * 1e3:.4g} mm from the bottom"))
        return tuple(recs)

    def figure(self, system: str = "SI"):
        """The section beside sigma(y) and tau(y) (matplotlib Figure; see :mod:`calckit.design.figures`)."""
        from .figures import stress_figure

        return stress_figure(self, system=system)


def _si(value, dim: str, name: str) -> float:
    from ..units import to_si

    if isinstance(value, (int, float, np.floating)) and not isinstance(value, bool):
        v = float(value)  # plain numbers are SI (see module docstring of calckit.design)
    else:
        v = to_si(value, dim, name, allow_array=False)
    if not math.isfinite(v):
        raise InputError(f"{name}: got {value!r}; expected a finite {dim}")
    return v


def _breaks(sec) -> list[float]:
    """Heights where the width may jump or change law (primitive bounds), inside [0, d]."""
    d = sec.si.d
    ys = set()
    for kind, p in sec.outline():
        if kind == "rect":
            ys.update((p[2], p[3]))
        else:
            xc, yc, r, sx, sy, _ = p
            ys.update((yc, yc + sy * r))
    return sorted(y for y in ys if -1e-12 <= y <= d + 1e-12)


def stress_profile(section, M=0.0, V=0.0, *, n: int = 201, y=None) -> StressProfile:
    """Normal and shear stress through the depth of ``section``.

    Parameters
    ----------
    section : a calckit section (any kind; uses ``Q_at_si`` and ``width_at_si``).
    M : bending moment about x-x (quantity, string such as "250 kN*m", or SI float in N*m); sagging
        positive (compression at the top).
    V : vertical shear (quantity, string, or SI float in N).
    n : number of evenly spaced heights (the width breaks and the NA are always added).
    y : optional heights (m from the bottom, array of SI floats, or a length quantity) to use instead.

    Returns a :class:`StressProfile`. Reference: flexure formula and shear formula (see module docstring).
    """
    if not hasattr(section, "Q_at_si") or not hasattr(section, "si"):
        raise InputError(f"section: got {section!r}; expected a calckit section (calckit.sections)")
    Mv, Vv = _si(M, "moment", "M"), _si(V, "force", "V")
    s = section.si
    d, yc, Ix = s.d, s.y_c, s.Ix
    if isinstance(n, bool) or not isinstance(n, (int, np.integer)) or n < 2:
        raise InputError(f"n: got {n!r}; expected a whole number of heights >= 2")
    brk = _breaks(section)
    if y is None:
        base = np.linspace(0.0, d, int(n))
    else:
        from ..units import is_quantity, to_si

        base = np.atleast_1d(to_si(y, "length", "y") if is_quantity(y) or isinstance(y, str)
                             else np.asarray(y, dtype=float))
        if base.size == 0 or np.any(base < -1e-12) or np.any(base > d * (1 + 1e-12)):
            raise InputError(f"y: got heights outside 0..{d:.4g} m; expected heights within the section")
    eps = 1e-9 * d
    exact = np.unique(np.asarray([*brk, yc], dtype=float))
    near = np.min(np.abs(base[:, None] - exact[None, :]), axis=1) <= 1e3 * eps
    pts = np.unique(np.concatenate((base[~near], exact)))
    brk_set = set(brk)
    ys, ts = [], []
    junctions = []
    for yy in pts:
        if yy <= eps:
            ys.append(yy); ts.append(section.width_at_si(min(eps, d)))
        elif yy >= d - eps:
            ys.append(yy); ts.append(section.width_at_si(d - eps))
        elif yy in brk_set:
            lo = section.width_at_si(yy - eps)
            hi = section.width_at_si(yy + eps)
            if abs(hi - lo) > 1e-6 * max(abs(hi), abs(lo)):
                ys += [yy, yy]; ts += [lo, hi]
                junctions.append(float(yy))
            else:
                ys.append(yy); ts.append(0.5 * (lo + hi))
        else:
            ys.append(yy); ts.append(section.width_at_si(yy))
    ya, ta = np.asarray(ys), np.asarray(ts)
    Qa = np.array([section.Q_at_si(float(v)) for v in ya])
    Qa[ya >= d - eps] = 0.0          # nothing above the top fibre
    Qa[ya <= eps] = 0.0              # the whole area has no first moment about its centroid
    sig = np.asarray(SIGMA(M=Mv, y=ya, y_c=yc, I_x=Ix), dtype=float) + 0.0  # no -0.0 at the NA
    with np.errstate(divide="ignore", invalid="ignore"):
        tau = np.where(ta > 0, np.asarray(TAU(V=Vv, Q=Qa, I_x=Ix, t=np.where(ta > 0, ta, 1.0)), dtype=float),
                       0.0)
    return StressProfile(section=s.name or s.kind, M=Mv, V=Vv, y_c=yc, Ix=Ix, d=d, y=ya, t=ta, Q=Qa,
                         sigma=sig, tau=tau, junctions=tuple(junctions), outline=tuple(section.outline()))
