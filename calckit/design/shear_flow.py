"""Shear flow between the parts of a beam along the member (the base of the connection designs).

Shear flow at an interface (flange to web, cover plate to flange, or any horizontal cut):
``q(x) = V(x) Q / I_x`` (Gere, Mechanics of Materials 7th ed., Sec. 5.11 "Built-up beams and shear flow"),
with Q the first moment about the elastic NA of the part beyond the interface (``si.Q_flange_top`` /
``si.Q_flange_bot``, or ``Q_at_si(y)`` at a cut) and V the envelope of |V|. This module holds the envelope
adapter, the interfaces, :func:`shear_flow`, concentrated flange loads and the zoning rule; the designs
built on it live in their own modules and are re-exported here:

* :func:`calckit.design.flange_welds.design_flange_welds`: the two fillet welds per flange-web junction of
  a welded girder, to AISC 360-22 J2 or EN 1993-1-8 (rules in :mod:`calckit.design.aisc360.welds` and
  :mod:`calckit.design.en1993.welds`, selected by ``standard``), continuous or intermittent by zones.
  A concentrated load on a flange without a bearing stiffener adds ``q_v = P / l_v`` over the length l_v
  over which it reaches the web (AISC: N + 5 k, the 2.5:1 dispersion of J10.2 with k = t_f; EN:
  s_s + 2 t_f, 45 degrees through the flange; both common practice for this purpose).
* :func:`calckit.design.built_up.design_fasteners`: fastener spacing ``s = n R / q`` by zones, with the
  code maximum (AISC 360-22 J3.5, F13.3 with E6.2 / D4) or a user maximum (bolts, screws, nails).
* :func:`calckit.design.built_up.design_cover_plates`: cover plates on rolled beams: plate-to-flange
  welds, theoretical cut-off points, termination lengths a' (AISC 360-22 F13.3).

Zoning (common practice, :func:`zone_pitches`): at every station the largest pitch meeting strength is
found, capped by the code maximum and rounded down to the rules' pitch step; consecutive stations with the
same pitch form a run; runs are joined left to right into zones at least ``min_zone`` long (a short zone
joins its tighter neighbour, or reaches into its looser one just far enough), each zone taking the
smallest pitch of its runs; where the strength pitch is below ``p_min`` (welds: twice the segment) the
weld is continuous. A station on a zone boundary belongs to the tighter zone (:func:`zone_owner`).

Envelope input (:func:`as_envelope`): a :class:`calckit.analysis.Envelope`, a single
:class:`calckit.analysis.BeamResult`, a :class:`ShearEnvelope`, a dict, or plain arrays
``(x, V_max, V_min[, M_max, M_min])`` (SI floats: m, N, N*m; or quantities).

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Sequence

import numpy as np

from ..errors import InputError
from ..render.formula import Formula
from ..render.records import given

__all__ = ["ShearEnvelope", "as_envelope", "Interface", "flange_interfaces", "interface_at", "ShearFlow",
           "shear_flow", "FlangeLoad", "weld_rules", "zone_pitches", "zone_owner",
           # re-exported from calckit.design.flange_welds and calckit.design.built_up:
           "WeldDesign", "design_flange_welds", "FastenerDesign", "design_fasteners", "fastener_force",
           "CoverPlateDesign", "design_cover_plates"]

_REF_Q = "shear flow (Gere, Mechanics of Materials 7th ed., Sec. 5.11)"
_D = {"q": "shear_flow", "q_h": "shear_flow", "q_v": "shear_flow", "q_r": "shear_flow", "q_c": "shear_flow",
      "V": "force", "Q": "modulus", "Q_p": "modulus", "I_x": "inertia", "P": "force", "l_v": "length",
      "N_b": "length", "k": "length", "s_s": "length", "t_f": "length", "theta": "angle", "w": "length",
      "a": "length", "w_req": "length", "a_req": "length", "L_w": "length", "p_s": "length", "s": "length",
      "R": "force", "F": "force", "F_p": "force", "M": "moment", "q_a": "shear_flow", "p": "length"}


def _f(symbol: str, expr: str, **kw) -> Formula:
    import re

    used = set(re.findall(r"[A-Za-z_][A-Za-z0-9_]*", expr)) | {symbol}
    return Formula(symbol, expr, dims={k: v for k, v in _D.items() if k in used}, **kw)


Q_FLOW = _f("q_h", "V*Q/I_x", ref=_REF_Q, label="longitudinal shear flow at the interface")
L_V_AISC = _f("l_v", "N_b + 5*k", ref="2.5:1 dispersion through k = t_f as in AISC 360-22 J10.2 (common practice)",
              label="length over which the flange load reaches the web")
L_V_EN = _f("l_v", "s_s + 2*t_f", ref="45 degree dispersion through the flange (common practice)",
            label="length over which the flange load reaches the web")
Q_V = _f("q_v", "P/l_v", ref="load spread uniformly over l_v (common practice)",
         label="vertical shear flow from the flange load")
_TOL = 1e-9


# ------------------------------------------------------------------------------------------ envelope
@dataclass(frozen=True)
class ShearEnvelope:
    """Shear (and optionally moment) envelope along a member, SI floats (m, N, N*m).

    Stations may repeat (left and right of a jump). ``names`` gives the governing combination of |V| at
    each station when known (else empty).
    """

    x: np.ndarray = field(repr=False)  #: stations, m (non-decreasing)
    V_max: np.ndarray = field(repr=False)  #: largest shear, N
    V_min: np.ndarray = field(repr=False)  #: smallest shear, N
    M_max: np.ndarray | None = field(default=None, repr=False)  #: largest (sagging) moment, N*m
    M_min: np.ndarray | None = field(default=None, repr=False)  #: smallest (hogging) moment, N*m
    names: tuple = ()  #: governing combination name of |V| per station ("" unknown)
    source: str = "given arrays"  #: where the envelope came from (for the calc sheet)

    @property
    def V_abs(self) -> np.ndarray:
        return np.maximum(np.abs(self.V_max), np.abs(self.V_min))

    @property
    def M_abs(self) -> np.ndarray:
        if self.M_max is None:
            raise InputError("envelope: has no moment; give M_max/M_min (needed for cover-plate cut-offs)")
        return np.maximum(np.abs(self.M_max), np.abs(self.M_min))

    def name_at(self, i: int) -> str:
        return self.names[i] if self.names else ""


def _arr(v, dim: str, name: str) -> np.ndarray:
    from ..units import is_quantity, to_si

    if v is None:
        return None
    a = to_si(v, dim, name) if (is_quantity(v) or isinstance(v, str)) else np.asarray(v, dtype=float)
    a = np.atleast_1d(np.asarray(a, dtype=float))
    if not np.all(np.isfinite(a)):
        raise InputError(f"{name}: got non-finite values; expected finite {dim} values")
    return a


def as_envelope(env=None, *, x=None, V_max=None, V_min=None, M_max=None, M_min=None,
                n: int = 2001) -> ShearEnvelope:
    """A :class:`ShearEnvelope` from an analysis Envelope, a BeamResult (sampled at ``n`` stations plus
    its nodes, both sides), a ShearEnvelope, a tuple ``(x, V_max[, V_min])``, or keyword arrays."""
    if isinstance(env, ShearEnvelope):
        return env
    if env is not None and hasattr(env, "V_si") and hasattr(env, "grid"):  # BeamResult: one combination
        L = float(env.grid.x[-1])
        nodes = np.asarray(env.grid.x, dtype=float)
        xs = np.sort(np.concatenate((np.linspace(0.0, L, int(n)), nodes, nodes)))
        right = np.r_[False, np.diff(xs) == 0]  # the second of a repeated station is the right side
        V = np.where(right, env.V_si(xs, side="right"), env.V_si(xs, side="left"))
        M = np.where(right, env.M_si(xs, side="right"), env.M_si(xs, side="left"))
        return ShearEnvelope(xs, V, V, M, M, (env.name,) * len(xs), f"combination {env.name}")
    if env is not None and hasattr(env, "V_max") and hasattr(env, "x"):  # analysis Envelope (duck-typed)
        xs = np.asarray(env.x, dtype=float)
        Vx, Vn = np.asarray(env.V_max, dtype=float), np.asarray(env.V_min, dtype=float)
        names: tuple = ()
        if hasattr(env, "V_max_by") and hasattr(env, "combinations"):
            c = tuple(env.combinations)
            use_max = np.abs(Vx) >= np.abs(Vn)
            idx = np.where(use_max, env.V_max_by, env.V_min_by).astype(int)
            names = tuple(c[i] for i in idx)
        return ShearEnvelope(xs, Vx, Vn, getattr(env, "M_max", None), getattr(env, "M_min", None), names,
                             getattr(env, "method", "") or "analysis envelope")
    if env is not None:
        if isinstance(env, dict):
            return as_envelope(**env, n=n)
        try:
            parts = tuple(env)
        except TypeError:
            raise InputError(f"envelope: got {type(env).__name__}; expected an analysis Envelope, a BeamResult, "
                             "a ShearEnvelope or (x, V_max, V_min) arrays") from None
        if not 2 <= len(parts) <= 5:
            raise InputError(f"envelope: got a tuple of {len(parts)} items; expected (x, V_max[, V_min[, M_max, "
                             "M_min]])")
        keys = ("x", "V_max", "V_min", "M_max", "M_min")
        return as_envelope(**dict(zip(keys, parts)), n=n)
    if x is None or V_max is None:
        raise InputError("envelope: got nothing; expected x and V_max (and V_min) arrays")
    xs = _arr(x, "span", "x")
    Vx = _arr(V_max, "force", "V_max")
    Vn = Vx if V_min is None else _arr(V_min, "force", "V_min")
    Mx, Mn = _arr(M_max, "moment", "M_max"), _arr(M_min, "moment", "M_min")
    if Mx is not None and Mn is None:
        Mn = Mx
    for nm, a in (("V_max", Vx), ("V_min", Vn), ("M_max", Mx), ("M_min", Mn)):
        if a is not None and a.shape != xs.shape:
            raise InputError(f"{nm}: got {a.size} values for {xs.size} stations; expected one per station")
    if xs.size < 2 or np.any(np.diff(xs) < 0):
        raise InputError("x: got stations that are not in increasing order (or fewer than 2); expected "
                         "non-decreasing positions along the member")
    return ShearEnvelope(xs, Vx, Vn, Mx, Mn)


# ---------------------------------------------------------------------------------------- interfaces
@dataclass(frozen=True)
class Interface:
    """A connection plane along the member carrying the shear flow V Q / I."""

    name: str  #: e.g. "top flange to web"
    flange: str  #: "top", "bottom", "both" (symmetric, one result for both) or ""
    y: float  #: height of the plane from the bottom fibre, m (nan if Q was given directly)
    Q: float  #: first moment about the elastic NA of the part beyond the plane, m3
    t_parts: tuple  #: thicknesses of the parts joined (flange or plate, web or flange), m
    b_parts: tuple  #: widths of the parts joined (for EN Fig. 4.1 and end lengths), m
    n_lines: int = 2  #: welds (or fastener lines) sharing the shear flow
    edge: bool = False  #: welds run along a plate edge (cover plates; AISC J2.2b(b) maximum applies)


def flange_interfaces(section, *, merge_symmetric: bool = True) -> tuple[Interface, ...]:
    """Flange-to-web junctions of an I, channel, tee, box or built-up section.

    Raises InputError for a section without a flange-web junction (a solid rectangle or plate).
    """
    s = section.si
    tw = s.tw / 2 if s.kind == "hollow" else s.tw
    out = []
    if s.kind != "rect" and s.tf_top > 0 and s.Q_flange_top > 0 and s.hw > 0:
        out.append(Interface("top flange to web", "top", s.d - s.tf_top, s.Q_flange_top, (s.tf_top, tw),
                             (s.bf_top, s.hw)))
    if s.kind != "rect" and s.tf_bot > 0 and s.Q_flange_bot > 0 and s.hw > 0:
        out.append(Interface("bottom flange to web", "bottom", s.tf_bot, s.Q_flange_bot, (s.tf_bot, tw),
                             (s.bf_bot, s.hw)))
    if not out:
        raise InputError(f"section: got {s.name or s.kind!r} (kind {s.kind!r}), which has no flange-web junction; "
                         "expected an I, channel, tee or box section, or give an interface height (interface_at)")
    same = len(out) == 2 and all(abs(a - b) <= 1e-9 * max(abs(a), abs(b), 1e-30) for a, b in
                                 zip((out[0].Q, *out[0].t_parts, *out[0].b_parts),
                                     (out[1].Q, *out[1].t_parts, *out[1].b_parts)))
    if merge_symmetric and same:
        o = out[0]
        out = [Interface("top and bottom flanges to web", "both", o.y, o.Q, o.t_parts, o.b_parts)]
    return tuple(out)


def interface_at(section, y, *, name: str = "", t_parts=None, b_parts=None, n_lines: int = 2,
                 edge: bool = False) -> Interface:
    """The horizontal cut at height ``y`` (quantity, string or SI float in m from the bottom fibre)."""
    from .stress import _si

    yv = _si(y, "length", "y")
    s = section.si
    if not 0 < yv < s.d:
        raise InputError(f"y: got {yv:.6g} m; expected a height inside the section, 0 < y < d = {s.d:.6g} m")
    Q = abs(section.Q_at_si(yv))
    t = section.width_at_si(yv)
    return Interface(name or f"cut at y = {yv * 1e3:.4g} mm", "", yv, Q, tuple(t_parts or (t, t)),
                     tuple(b_parts or (t, t)), int(n_lines), edge)


# ---------------------------------------------------------------------------------------- shear flow
@dataclass(frozen=True)
class ShearFlow:
    """Longitudinal shear flow q_h = |V| Q / I_x at each interface along the member (SI: m, N, N/m)."""

    section: str  #: section designation
    Ix: float  #: second moment of area, m4
    x: np.ndarray = field(repr=False)  #: stations, m
    V: np.ndarray = field(repr=False)  #: |V| envelope, N
    interfaces: tuple = ()  #: the :class:`Interface` s
    q: tuple = field(default=(), repr=False)  #: q_h per interface (arrays, N/m)
    envelope: ShearEnvelope | None = field(default=None, repr=False)  #: the envelope used

    def q_max(self, i: int = 0) -> float:
        return float(np.max(self.q[i]))

    def x_max(self, i: int = 0) -> float:
        return float(self.x[int(np.argmax(self.q[i]))])

    def steps(self, i: int = 0) -> tuple:
        """q_h = V Q / I_x at the station of the largest |V|."""
        j = int(np.argmax(self.V))
        f = self.interfaces[i]
        nm = self.envelope.name_at(j) if self.envelope is not None else ""
        return (given("V", float(self.V[j]), "force", reference="shear envelope" + (f", {nm}" if nm else ""),
                      note=f"at x = {self.x[j]:.4g} m"),
                given("Q", f.Q, "modulus", reference=f"section, {f.name}"),
                given("I_x", self.Ix, "inertia", reference="section properties"),
                Q_FLOW.step(V=float(self.V[j]), Q=f.Q, I_x=self.Ix))

    def figure(self, system: str = "SI"):
        from .figures import shear_flow_figure

        return shear_flow_figure(self, system=system)


def shear_flow(section, envelope, *, interfaces=None) -> ShearFlow:
    """Shear flow along the member at the flange-web junctions (default) or at given interfaces
    (:class:`Interface` objects or heights)."""
    env = as_envelope(envelope)
    ints = _interfaces(section, interfaces)
    V = env.V_abs
    Ix = section.si.Ix
    q = tuple(np.asarray(Q_FLOW(V=V, Q=f.Q, I_x=Ix), dtype=float) for f in ints)
    return ShearFlow(section.si.name or section.si.kind, Ix, env.x, V, ints, q, env)


def _interfaces(section, interfaces, merge=True) -> tuple:
    if interfaces is None:
        return flange_interfaces(section, merge_symmetric=merge)
    if isinstance(interfaces, Interface):
        return (interfaces,)
    out = []
    for it in (interfaces if isinstance(interfaces, (list, tuple)) else [interfaces]):
        out.append(it if isinstance(it, Interface) else interface_at(section, it))
    return tuple(out)


# -------------------------------------------------------------------------------------- flange loads
@dataclass(frozen=True)
class FlangeLoad:
    """A concentrated (factored) load on a flange where no bearing stiffener is present (SI: m, N).

    ``x`` position; ``P`` magnitude; ``N`` bearing length; ``flange`` "top" or "bottom"; ``length`` the
    length l_v over which it reaches the web (None: the standard's dispersion rule, see module docstring).
    """

    x: float
    P: float
    N: float = 0.0
    flange: str = "top"
    length: float | None = None

    @classmethod
    def make(cls, x, P, N=0, flange: str = "top", length=None) -> "FlangeLoad":
        from .stress import _si

        if flange not in ("top", "bottom"):
            raise InputError(f"flange: got {flange!r}; expected 'top' or 'bottom'")
        fl = cls(_si(x, "span", "x"), abs(_si(P, "force", "P")), _si(N, "length", "N"), flange,
                 None if length is None else _si(length, "length", "length"))
        if fl.N < 0 or (fl.length is not None and fl.length <= 0):
            raise InputError(f"N/length: got {N!r}/{length!r}; expected a bearing length >= 0 and l_v > 0")
        return fl


def _lv(rules, load: FlangeLoad, tf: float) -> float:
    if load.length is not None:
        return load.length
    if rules.size_kind == "leg":
        return float(L_V_AISC(N_b=load.N, k=tf))
    return float(L_V_EN(s_s=load.N, t_f=tf))


def _vertical(x, loads, face: str, rules, tf: float) -> np.ndarray:
    qv = np.zeros_like(x)
    for ld in loads:
        if face not in (ld.flange, "both"):
            continue
        lv = _lv(rules, ld, tf)
        qv += np.where(np.abs(x - ld.x) <= lv / 2 + _TOL, np.asarray(Q_V(P=ld.P, l_v=lv)), 0.0)
    return qv


# ------------------------------------------------------------------------------------------- zoning
def zone_pitches(x, p_allow, *, p_max: float, step: float, min_zone: float, p_min: float = 0.0,
                 boundaries: Sequence[float] | None = None) -> list[tuple[float, float, float]]:
    """Zones ``(x0, x1, pitch)`` covering the member; pitch 0 where ``p_allow`` (capped at p_max and
    rounded down to ``step``) falls below ``p_min`` (continuous weld, or no feasible fastener pitch).
    See the module docstring for the rule (common practice)."""
    x = np.asarray(x, dtype=float)
    p = np.minimum(np.asarray(p_allow, dtype=float), p_max)
    p = np.floor(p / step + 1e-9) * step
    p = np.where(p < p_min - _TOL, 0.0, p)
    if boundaries is not None:
        b = np.unique(np.clip(np.asarray(list(boundaries), dtype=float), x[0], x[-1]))
        edges = np.unique(np.concatenate(([x[0]], b, [x[-1]])))
        out = []
        for x0, x1 in zip(edges[:-1], edges[1:]):
            m = (x >= x0 - _TOL) & (x <= x1 + _TOL)
            out.append((float(x0), float(x1), float(np.min(p[m])) if m.any() else float(p_max)))
        return out
    cut = np.flatnonzero(p[1:] != p[:-1]) + 1
    i0 = np.concatenate(([0], cut))
    i1 = np.concatenate((cut, [len(x)]))
    runs = []  # [x_start, x_end, pitch] with gaps between stations given to the tighter run
    for a, b_ in zip(i0, i1):
        runs.append([x[a], x[b_ - 1], p[a]])
    for k in range(len(runs) - 1):
        if runs[k + 1][2] < runs[k][2]:
            runs[k + 1][0] = runs[k][1]
        else:
            runs[k][1] = runs[k + 1][0]
    zones: list = []
    cur = list(runs[0])
    queue = runs[1:][::-1]  # a stack: pop() takes the next run to the right
    while queue:
        r = queue.pop()
        if r[2] == cur[2]:
            cur[1] = r[1]
        elif cur[1] - cur[0] >= min_zone - _TOL:
            zones.append(cur)
            cur = list(r)
        elif r[2] < cur[2]:  # a short zone joins its tighter neighbour (cheapest)
            cur = [cur[0], r[1], r[2]]
        else:  # a short zone extends into its looser neighbour, only as far as min_zone
            need = cur[0] + min_zone
            if r[1] <= need + _TOL:
                cur[1] = r[1]
            else:
                cur[1] = need
                queue.append([need, r[1], r[2]])
    if zones and cur[1] - cur[0] < min_zone - _TOL:
        prev = zones[-1]
        need = min_zone - (cur[1] - cur[0])
        if prev[1] - prev[0] - need >= min_zone - _TOL:  # take the length from the previous zone
            prev[1] -= need
            cur = [cur[0] - need, cur[1], min(cur[2], prev[2])]
        else:
            zones.pop()
            cur = [prev[0], cur[1], min(prev[2], cur[2])]
    zones.append(cur)
    out = [zones[0]]
    for z in zones[1:]:
        if z[2] == out[-1][2]:
            out[-1][1] = z[1]
        else:
            out.append(z)
    return [(float(a), float(b_), float(c)) for a, b_, c in out]


def zone_owner(x, zones, active=None) -> np.ndarray:
    """Index of the zone each station belongs to (-1 outside every zone or where ``active`` is False).

    A station on the boundary of two zones belongs to the one with the smaller pitch (0, continuous,
    is the smallest): that zone's pitch was found with the station included.
    """
    x = np.asarray(x, dtype=float)
    owner = np.full(x.shape, -1)
    best = np.full(x.shape, np.inf)
    for k, (x0, x1, p) in enumerate(zones):
        m = (x >= x0 - _TOL) & (x <= x1 + _TOL) & (p < best)
        owner = np.where(m, k, owner)
        best = np.where(m, p, best)
    if active is not None:
        owner = np.where(active, owner, -1)
    return owner


def _min_zone(min_zone) -> float:
    from .stress import _si

    v = _si(min_zone, "span", "min_zone")
    if v < 0:
        raise InputError(f"min_zone: got {min_zone!r}; expected a zone length >= 0")
    return v


# ---------------------------------------------------------------------------------------- weld rules
def weld_rules(standard: str = "AISC 360-22", method: str | None = None, **options):
    """Fillet-weld rules of ``standard``: "AISC 360-22" (method "LRFD"/"ASD"; electrode=, directional=) or
    "EN 1993-1-8" (method "simplified"/"directional"; gamma_M2=, fu=, beta_w=)."""
    key = str(standard).upper().replace(" ", "").replace("-", "")
    if key.startswith("AISC"):
        from .aisc360.welds import FilletWelds

        if "electrode" in options:
            options["F_EXX"] = options.pop("electrode")
        return FilletWelds(method=method or "LRFD", **options)
    if key.startswith("EN") or key.startswith("EC3") or key.startswith("EUROCODE"):
        from .en1993.welds import FilletWelds

        m = method if method not in (None, "EN") else "simplified"
        return FilletWelds(method=m, **options)
    raise InputError(f"standard: got {standard!r}; expected 'AISC 360-22' or 'EN 1993-1-8'")


def _size_value(size, name: str = "size") -> float:
    from .stress import _si

    v = _si(size, "length", name)
    if v <= 0:
        raise InputError(f"{name}: got {size!r}; expected a weld size > 0")
    return v


def _compression(env: ShearEnvelope, face: str) -> bool:
    """A flange is taken in compression unless the moment envelope shows it never is."""
    if env.M_max is None:
        return True
    top = bool(np.any(env.M_max > 0)) or bool(np.any(env.M_min > 0))
    bot = bool(np.any(env.M_min < 0)) or bool(np.any(env.M_max < 0))
    return {"top": top, "bottom": bot}.get(face, top or bot)


_ELSEWHERE = {  # re-exported names -> module (imported on first use)
    **dict.fromkeys(("WeldZone", "JunctionWelds", "WeldDesign", "design_flange_welds"), "flange_welds"),
    **dict.fromkeys(("FastenerZone", "FastenerRow", "FastenerDesign", "design_fasteners", "fastener_force",
                     "CoverPlate", "CoverPlateDesign", "design_cover_plates"), "built_up"),
}


def __getattr__(name: str):  # welds, fasteners and cover plates live in their own modules
    mod = _ELSEWHERE.get(name)
    if mod is None:
        raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
    from importlib import import_module

    return getattr(import_module(f"{__package__}.{mod}"), name)
