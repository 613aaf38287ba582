"""Flange-to-web fillet welds of welded girders along the member, by zones.

Two fillet welds per junction (one each side of the web) carry the shear flow ``q_h = V Q / I`` of
:mod:`calckit.design.shear_flow`, plus the vertical force per unit length ``q_v`` of concentrated flange
loads without bearing stiffeners, as the vector sum ``q_r = sqrt(q_h^2 + q_v^2)`` at ``theta = atan(q_v /
q_h)`` to the weld axis. The rules (strength, minimum and maximum size, segment length, spacing, end
lengths) come from :mod:`calckit.design.aisc360.welds` (AISC 360-22 J2) or
:mod:`calckit.design.en1993.welds` (EN 1993-1-8), selected with the calc's design standard.

Continuous welds: the smallest standard size meeting strength (strength is proportional to the size:
``w_req = w q_r / q_c``) and the code minimum; intermittent welds: segments L_w at pitch
``p <= L_w q_c / q_r`` (a segment every pitch carries q_r p; common practice), within the code spacing
limit, by zones (:func:`calckit.design.shear_flow.zone_pitches`); continuous where the gap would be shorter
than the segment (common practice).

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ..errors import InputError
from ..render.records import check as _check, given
from .results import CheckResult
from .shear_flow import (Q_FLOW, FlangeLoad, Interface, ShearEnvelope, _TOL, _compression, _f, _interfaces,
                         _min_zone, _size_value, _vertical, as_envelope, weld_rules, zone_owner, zone_pitches)

__all__ = ["WeldZone", "JunctionWelds", "WeldDesign", "design_flange_welds"]

Q_RES = _f("q_r", "sqrt(q_h**2 + q_v**2)", ref="vector sum", label="resultant force per unit length")
THETA = _f("theta", "atan(q_v/q_h)", ref="angle of the resultant to the weld axis")
W_REQ = _f("w_req", "w*q_r/q_c", ref="strength proportional to the leg size", label="leg size for strength")
A_REQ = _f("a_req", "a*q_r/q_c", ref="strength proportional to the throat", label="throat for strength")
Q_AVG = _f("q_a", "q_c*L_w/p", ref="segments L_w at pitch p (common practice)",
           label="average strength per unit length of the intermittent welds")
P_WELD = _f("p_s", "L_w*q_c/q_r", ref="a segment L_w every pitch p carries q_r p (common practice)",
            label="largest pitch of intermittent welds for strength")


# ------------------------------------------------------------------------------------- weld design
@dataclass(frozen=True)
class WeldZone:
    """One zone of a junction's welds (SI: m, N/m)."""

    x0: float  #: start of the zone, m
    x1: float  #: end of the zone, m
    continuous: bool  #: continuous weld (else intermittent)
    size: float  #: leg (AISC) or throat (EN) size, m
    segment: float  #: segment length L_w of intermittent welds (nan if continuous), m
    pitch: float  #: centre-to-centre pitch of segments (nan if continuous), m
    demand: float  #: largest resultant force per unit length in the zone (both welds), N/m
    capacity: float  #: strength per unit length at the governing station (averaged over the pitch), N/m
    ratio: float  #: largest demand / capacity in the zone
    label: str  #: e.g. "5/16 in continuous" or "a = 4 mm, 50 mm @ 200 mm"


@dataclass(frozen=True)
class JunctionWelds:
    """The two fillet welds of one flange-to-web junction along the member (SI: m, N/m, rad)."""

    interface: Interface  #: the junction
    q_h: np.ndarray = field(repr=False)  #: longitudinal shear flow, N/m
    q_v: np.ndarray = field(repr=False)  #: vertical force per unit length from flange loads, N/m
    q_r: np.ndarray = field(repr=False)  #: resultant per unit length, N/m
    theta: np.ndarray = field(repr=False)  #: angle of the resultant to the weld axis, rad
    size_strength: float = 0.0  #: smallest continuous size for strength, m
    size_min: float = 0.0  #: code minimum size, m
    size_max: float = 0.0  #: maximum size (code or common practice, see clause), m
    size: float = 0.0  #: size used, m
    zones: tuple = ()  #: :class:`WeldZone` s along the member
    capacity: np.ndarray = field(default=None, repr=False)  #: strength per unit length per station, N/m
    base_metal: float | None = None  #: web shear-rupture strength per unit length (AISC J4.2), N/m
    check: CheckResult | None = None  #: the governing check of this junction
    notes: tuple = ()  #: notes for the engineer


@dataclass(frozen=True)
class WeldDesign:
    """Flange-to-web fillet welds of a welded girder along the member."""

    standard: str  #: "AISC 360-22" or "EN 1993-1-8:2005"
    method: str  #: "LRFD", "ASD", "simplified" or "directional"
    size_kind: str  #: "leg" (AISC, w) or "throat" (EN, a)
    section: str  #: section designation
    x: np.ndarray = field(repr=False)  #: stations, m
    junctions: tuple = ()  #: :class:`JunctionWelds` per junction
    notes: tuple = ()  #: notes for the engineer

    @property
    def checks(self) -> tuple:
        return tuple(j.check for j in self.junctions)

    @property
    def passed(self) -> bool:
        return all(c.passed is not False for c in self.checks)

    def member_result(self):
        from .results import MemberResult

        return MemberResult(self.standard, _method_word(self.method), self.checks, section=self.section,
                            notes=self.notes)

    def summary(self) -> str:
        lines = []
        for j in self.junctions:
            lines.append(f"{j.interface.name}: {j.check.status} (ratio {j.check.ratio:.2f})")
            lines += [f"  {z.x0:8.3f} m to {z.x1:8.3f} m  {z.label}  (ratio {z.ratio:.2f})" for z in j.zones]
        return "\n".join(lines + list(self.notes))

    def figure(self, system: str = "SI"):
        from .figures import weld_figure

        return weld_figure(self, system=system)


def _method_word(m: str) -> str:
    return m if m in ("LRFD", "ASD") else "EN"


def _angle(q_h, q_v):
    with np.errstate(divide="ignore", invalid="ignore"):
        th = np.asarray(THETA(q_v=q_v, q_h=q_h), dtype=float)
    return np.nan_to_num(th, nan=0.0)


def _junction(rules, f: Interface, env: ShearEnvelope, Ix: float, steel, *, q_v, size, intermittent,
              segment, boundaries, min_zone, max_pitch, weathering, steps, limit_state, t_edge=None,
              x_range=None, base_metal: bool = True, end_length=None) -> JunctionWelds:
    x = env.x
    t_thin = min(f.t_parts)
    rules = rules.bind(steel, f.t_parts)
    st = steel
    q_h = np.asarray(Q_FLOW(V=env.V_abs, Q=f.Q, I_x=Ix), dtype=float)
    q_v = np.zeros_like(q_h) + q_v
    q_r = np.asarray(Q_RES(q_h=q_h, q_v=q_v), dtype=float) if np.any(q_v) else q_h
    theta = _angle(q_h, q_v) if np.any(q_v) else np.zeros_like(q_h)
    n = f.n_lines
    cap1 = np.asarray(rules.capacity(1.0, theta), dtype=float) * np.ones_like(q_h)  # per unit size, one weld
    active = np.ones(len(x), bool) if x_range is None else (x >= x_range[0] - _TOL) & (x <= x_range[1] + _TOL)
    s_req = float(np.max(np.where(active, q_r / (n * cap1), 0.0)))
    s_min, c_min = rules.min_size(t_thin)
    s_max, c_max, hard = rules.max_size(t_edge if t_edge is not None else t_thin, edge=f.edge)
    notes = []
    if size is not None:
        w = _size_value(size)
        if w < s_min - _TOL:
            raise InputError(f"size: got {rules.size_text(w)}; expected at least {rules.size_text(s_min)}, the "
                             f"minimum for the thinner part t = {t_thin * 1e3:.4g} mm ({c_min})")
        if w > s_max + _TOL and hard:
            raise InputError(f"size: got {rules.size_text(w)}; expected at most {rules.size_text(s_max)} ({c_max})")
    else:
        need = max(s_req, s_min)
        fits = [c for c in rules.sizes() if c >= need - _TOL]
        w = fits[0] if fits else rules.sizes()[-1]
        if hard and w > s_max + _TOL:
            w = max(s_max, s_min)
    if w > s_max + _TOL:
        notes.append(f"{f.name}: size {rules.size_text(w)} exceeds {rules.size_text(s_max)} ({c_max})")
    cap_c = n * w * cap1
    fu_w = st.fu_si(f.t_parts[1])
    bm = rules.base_metal(f.t_parts[1], fu_w) if base_metal else None
    bm = None if bm is None else float(bm)
    # zones
    zones_spec = []
    L_w = math.nan
    if intermittent and active.sum() < 2:
        notes.append(f"{f.name}: too few stations in the range for zones; continuous weld")
    if intermittent and active.sum() >= 2:
        L_min, c_seg = rules.min_segment(w)
        if segment is not None:
            L_w = _size_value(segment, "segment")
            if L_w < L_min - _TOL:
                raise InputError(f"segment: got {L_w * 1e3:.4g} mm; expected at least {L_min * 1e3:.4g} mm ({c_seg})")
        else:
            L_w = math.ceil(max(L_min, rules.min_practical_segment) / rules.length_step - 1e-9) * rules.length_step
        comp = _compression(env, f.flange)
        p_code, c_p = rules.max_pitch(L_w=L_w, t=t_thin, b=min(f.b_parts), t_outside=f.t_parts[0],
                                      fy=st.fy_si(f.t_parts[0]), E=st.si.E, compression=comp,
                                      weathering=weathering)
        p_max = p_code if max_pitch is None else min(p_code, _size_value(max_pitch, "max_pitch"))
        with np.errstate(divide="ignore", invalid="ignore"):
            p_allow = np.where(q_r > 0, np.asarray(P_WELD(L_w=L_w, q_c=cap_c, q_r=np.where(q_r > 0, q_r, 1.0))),
                               np.inf)
        zones_spec = zone_pitches(x[active], p_allow[active], p_max=p_max, step=rules.pitch_step,
                                  min_zone=min_zone, p_min=2.0 * L_w, boundaries=boundaries)
        if x_range is not None:  # the zones span the plate exactly (its ends need not be stations)
            zones_spec[0] = (float(x_range[0]), *zones_spec[0][1:])
            zones_spec[-1] = (zones_spec[-1][0], float(x_range[1]), zones_spec[-1][2])
        L_end, c_end = rules.end_length(min(f.b_parts)) if end_length is None else end_length
        if L_end > 0:
            zones_spec = _end_lengths(zones_spec, L_end, x_range or (x[0], x[-1]))
            notes.append(f"{f.name}: continuous weld over {_len_text(rules, L_end)} at each end ({c_end})")
        notes.append(f"{f.name}: intermittent welds: segment {rules.min_segment(w)[1]}; pitch limit {c_p}")
    else:
        zones_spec = [(float(x[0]), float(x[-1]), 0.0)] if x_range is None else [(x_range[0], x_range[1], 0.0)]
    owner = zone_owner(x, [(a, b, p) for a, b, p in zones_spec], active)
    cap = np.full_like(q_h, np.inf)
    zones = []
    for k, (x0, x1, p) in enumerate(zones_spec):
        m = owner == k
        cz = cap_c if p == 0 else cap_c * L_w / p
        cap = np.where(m, cz, cap)
        r = np.where(m, q_r / cz, 0.0)
        i = int(np.argmax(r))
        lab = (f"{rules.size_text(w)} continuous" if p == 0 else
               f"{rules.size_text(w)}, {_len_text(rules, L_w)} @ {_len_text(rules, p)}")
        zones.append(WeldZone(x0, x1, p == 0, w, math.nan if p == 0 else L_w, math.nan if p == 0 else p,
                              float(np.max(np.where(m, q_r, 0.0))), float(cz[i]), float(r[i]), lab))
    with np.errstate(divide="ignore", invalid="ignore"):
        ratio = np.where(active & (q_r > 0), q_r / cap, 0.0)
    j = int(np.argmax(ratio))
    r_weld = float(ratio[j])
    r_bm = float(np.max(np.where(active, q_r, 0.0)) / bm) if bm else 0.0
    if r_bm > 1.0:
        notes.append(f"{f.name}: the web is too thin for the shear flow (base metal, AISC 360-22 J4.2)")
    recs = ()
    if steps:
        recs = _weld_steps(rules, f, env, Ix, j, q_h, q_v, q_r, theta, w, s_min, c_min, s_max, c_max, s_req,
                           cap[j], bm, fu_w, zones, n, x)
    ratio_all = max(r_weld, r_bm)
    clause = f"{rules.standard} " + ("J2.4" if rules.size_kind == "leg" else
                                    ("4.5.3.3" if rules.method == "simplified" else "4.5.3.2"))
    demand, capacity = float(q_r[j]), float(cap[j])
    if r_bm > r_weld:  # the web base metal governs: report that comparison
        j = int(np.argmax(np.where(active, q_r, 0.0)))
        demand, capacity, clause = float(q_r[j]), bm, "AISC 360-22 J2.4, J4.2 (web base metal)"
    chk = CheckResult(limit_state=limit_state, clause=clause, dim="shear_flow", capacity=capacity,
                      demand=demand, ratio=ratio_all, passed=ratio_all <= 1.0 + 1e-9,
                      method=_method_word(rules.method), location=float(x[j]), combination=env.name_at(j),
                      steps=recs, data={"size": w, "size_min": s_min, "size_max": s_max, "size_strength": s_req,
                                        "size_kind": rules.size_kind, "base_metal": bm, "ratio_base_metal": r_bm,
                                        "zones": len(zones), "q_h_max": float(np.max(q_h))},
                      note="; ".join(notes))
    return JunctionWelds(f, q_h, q_v, q_r, theta, s_req, s_min,
                         s_max, w, tuple(zones), cap, bm, chk, tuple(notes))


def _len_text(rules, v: float) -> str:
    if rules.size_kind == "leg":
        return f"{v / 0.0254:.3g} in"
    return f"{v * 1e3:.0f} mm"


def _end_lengths(zones, L_end: float, span) -> list:
    """Continuous zones of length L_end at both ends (EN 1993-1-8 4.3.5(5)), trimming the zones there."""
    x0, x1 = span
    out = []
    for a, b, p in zones:
        if p == 0:
            out.append((a, b, p))
            continue
        lo, hi = max(a, x0 + L_end), min(b, x1 - L_end)
        if a < x0 + L_end:
            out.append((a, min(b, x0 + L_end), 0.0))
        if hi > lo:
            out.append((lo, hi, p))
        if b > x1 - L_end:
            out.append((max(a, x1 - L_end), b, 0.0))
    merged = [list(out[0])]
    for a, b, p in out[1:]:
        if p == 0 and merged[-1][2] == 0:  # only continuous pieces join (user boundaries stay)
            merged[-1][1] = b
        else:
            merged.append([a, b, p])
    return [tuple(z) for z in merged]


def _weld_steps(rules, f, env, Ix, j, q_h, q_v, q_r, theta, w, s_min, c_min, s_max, c_max, s_req, cap_j, bm,
                fu_w, zones, n, x) -> tuple:
    nm = env.name_at(j)
    recs = [given("V", float(env.V_abs[j]), "force", reference="shear envelope" + (f", {nm}" if nm else ""),
                  note=f"at x = {x[j]:.4g} m"),
            given("Q", f.Q, "modulus", reference=f"first moment of the part beyond the {f.name} interface"),
            given("I_x", Ix, "inertia", reference="section properties")]
    qh = Q_FLOW.step(V=float(env.V_abs[j]), Q=f.Q, I_x=Ix); recs.append(qh)
    dem = qh
    if q_v[j] > 0:
        qv = given("q_v", float(q_v[j]), "shear_flow", reference="flange loads without bearing stiffeners")
        recs += [qv]
        dem = Q_RES.step(q_h=qh, q_v=qv); recs.append(dem)
        recs.append(THETA.step(q_v=qv, q_h=qh))
    sym = rules.size_symbol
    recs.append(given(f"{sym}_min", s_min, "length", reference=c_min, note=rules.size_text(s_min)))
    cap_steps = rules.capacity_steps(w, float(theta[j]), n)
    recs += cap_steps
    qc = cap_steps[-1]
    req = (W_REQ if sym == "w" else A_REQ).step(**{sym: w, "q_r": dem.result, "q_c": qc.result})
    recs.append(req)
    recs.append(given(sym, w, "length", reference="size used", note=rules.size_text(w)))
    z = [z for z in zones if z.x0 - _TOL <= x[j] <= z.x1 + _TOL]
    if z and not z[0].continuous:
        recs.append(given("L_w", z[0].segment, "length", reference=rules.min_segment(w)[1]))
        recs.append(P_WELD.step(L_w=z[0].segment, q_c=qc.result, q_r=dem.result))
        pz = given("p", z[0].pitch, "length", reference="pitch used (rounded down; within the code limit)")
        cap_step = Q_AVG.step(q_c=qc.result, L_w=z[0].segment, p=pz)
        recs += [pz, cap_step]
    else:
        cap_step = qc
    recs.append(_check(f"welds, {f.name}", dem, cap_step, reference=f"{rules.standard}"))
    if bm:
        bms = rules.base_metal_steps(f.t_parts[1], fu_w)
        recs += bms
        recs.append(_check(f"web base metal, {f.name}", dem, bms[-1], reference="AISC 360-22 J4.2"))
    return tuple(recs)


def _load(ld) -> FlangeLoad:
    if isinstance(ld, FlangeLoad):
        return ld
    if isinstance(ld, dict):
        return FlangeLoad.make(**ld)
    return FlangeLoad.make(*ld)


def design_flange_welds(section, envelope, *, steel, standard: str = "AISC 360-22", method: str | None = None,
                        rules=None, size=None, intermittent: bool = False, segment=None, zones=None,
                        min_zone=1.0, flange_loads=(), interfaces=None, max_pitch=None, weathering: bool = False,
                        steps: bool = True, **rule_options) -> WeldDesign:
    """Flange-to-web fillet welds of a welded girder (two welds per junction) along the member.

    Parameters
    ----------
    section : a welded section (``PlateGirder``, welded ``Tee``, ``BuiltUp``); rolled shapes have no welds.
    envelope : shear envelope (see :func:`as_envelope`); a moment envelope, if present, tells which flange
        is ever in compression (for the AISC spacing rule); without it both are taken in compression.
    steel : grade or :class:`calckit.materials.Steel` of the plates.
    standard, method, rule_options : see :func:`weld_rules` (or pass ``rules``).
    size : weld size (leg for AISC, throat for EN); None picks the smallest standard size meeting strength
        and the code minimum. A size below the code minimum is an InputError.
    intermittent : design intermittent welds by zones (else continuous); ``segment`` the segment length
        (None: the code minimum, at least the rules' practical minimum); ``zones`` interior zone
        boundaries (m or quantities) or None for automatic zones at least ``min_zone`` long (m).
    flange_loads : :class:`FlangeLoad` s, or (x, P[, N, flange, length]) tuples, for concentrated loads
        without bearing stiffeners.
    max_pitch : a user maximum pitch (the smaller of it and the code limit governs).
    steps : build calc-sheet steps (False: numeric path only).
    """
    from ..materials import steel as _steel

    s = section.si
    if s.kind in ("I_rolled", "hollow", "rect"):
        raise InputError(f"section: got {s.name or s.kind!r} (kind {s.kind!r}); flange-to-web welds apply to "
                         "welded sections (PlateGirder, Tee, BuiltUp); use design_cover_plates for plates "
                         "welded to a rolled beam")
    rules = rules or weld_rules(standard, method, **rule_options)
    st = _steel(steel)
    env = as_envelope(envelope)
    loads = tuple(_load(ld) for ld in flange_loads)
    ints = _interfaces(section, interfaces, merge=not loads)
    bnd = None if zones is None else [_size_value(b, "zones") if not isinstance(b, (int, float)) else float(b)
                                      for b in zones]
    mz = _min_zone(min_zone)
    out = []
    for f in ints:
        qv = _vertical(env.x, loads, f.flange, rules, f.t_parts[0]) if loads else 0.0
        out.append(_junction(rules, f, env, s.Ix, st, q_v=qv, size=size, intermittent=intermittent,
                             segment=segment, boundaries=bnd, min_zone=mz, max_pitch=max_pitch,
                             weathering=weathering, steps=steps, limit_state=f"Fillet welds, {f.name}"))
    notes = ["Flange-to-web welds from the shear flow VQ/I; results must be reviewed and sealed by a licensed "
             "or chartered engineer; local codes, national annexes and project specifications govern."]
    if intermittent:
        notes.append("Intermittent welds are not suited to fatigue loading or corrosive conditions "
                     "(EN 1993-1-8 4.3.5(1); AISC 360-22 Appendix 3); use continuous welds there.")
    if loads:
        notes.append("Concentrated flange loads without bearing stiffeners are added as vertical force per "
                     "unit length over their dispersion length (common practice).")
    return WeldDesign(rules.standard, rules.method, rules.size_kind, s.name or s.kind, env.x, tuple(out),
                      tuple(notes))
