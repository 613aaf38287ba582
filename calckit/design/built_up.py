"""Connections of built-up members: fastener spacing by zones, and cover plates on rolled beams.

* Fastened built-up members (:func:`design_fasteners`): spacing ``s = n R / q`` with ``q = V Q / I``
  (Gere, Mechanics of Materials 7th ed., Sec. 5.11), by zones along the member (the zoning rule of
  :func:`calckit.design.shear_flow.zone_pitches`), with the code maximum (AISC 360-22 J3.5; F13.3 with
  E6.2 or D4) or a user maximum; bolts, screws, or nails in timber with a given fastener capacity.
* Cover-plated rolled beams (:func:`design_cover_plates`): plate-to-flange fillet welds from q with the
  plate's first moment about the NA of the plated section; theoretical cut-off points where the bare
  beam's strength (a number or a callable of x) reaches |M|; termination length a' (AISC 360-22 F13.3,
  Eqs. F13-7 to F13-9) whose welds (both edges plus the end weld, J2.4(c)) must develop the plate force
  ``F_p = M Q_p / I`` at the cut-off. EN 1993 has no such termination rule: give ``extension``.

The names are re-exported from :mod:`calckit.design.shear_flow`.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ..errors import InputError
from ..render.records import check as _check, decide, given
from .results import CheckResult
from .flange_welds import JunctionWelds, _junction, _method_word
from .shear_flow import (Q_FLOW, Interface, _TOL, _compression, _f, _interfaces, _min_zone,
                         as_envelope, weld_rules, zone_owner, zone_pitches)

__all__ = ["FastenerZone", "FastenerRow", "FastenerDesign", "design_fasteners", "fastener_force", "CoverPlate",
           "CoverPlateDesign", "design_cover_plates"]

S_FAST = _f("s", "n*R/q", ref="fastener spacing s = n R / q (Gere, Mechanics of Materials 7th ed., Sec. 5.11)",
            label="largest fastener spacing for strength")
Q_FCAP = _f("q_a", "n*R/s", ref="n fasteners of capacity R every s (Gere 7th ed., Sec. 5.11)",
            label="strength per unit length of the fasteners")
F_FAST = _f("F", "q*s/n", ref="force per fastener F = q s / n (Gere 7th ed., Sec. 5.11)")
F_PLATE = _f("F_p", "M*Q_p/I_x", ref="plate force from the flexure formula (AISC 360-22 F13.3 development)",
             label="cover-plate force to develop")


# ----------------------------------------------------------------------------------------- fasteners
def fastener_force(q, s, n: int = 1) -> float:
    """Force per fastener F = q s / n (N) for shear flow ``q`` (N/m), spacing ``s`` (m), ``n`` per row."""
    from .stress import _si

    return float(F_FAST(q=_si(q, "shear_flow", "q"), s=_si(s, "length", "s"), n=float(_count(n))))


def _count(n) -> int:
    if isinstance(n, bool) or not isinstance(n, (int, np.integer)) or n < 1:
        raise InputError(f"n: got {n!r}; expected a whole number of fasteners per row >= 1")
    return int(n)


@dataclass(frozen=True)
class FastenerZone:
    """One zone of fasteners (SI: m, N/m)."""

    x0: float  #: start, m
    x1: float  #: end, m
    pitch: float  #: spacing used (nan where no spacing >= the minimum works), m
    demand: float  #: largest shear flow in the zone, N/m
    capacity: float  #: n R / s, N/m
    ratio: float  #: demand / capacity
    label: str  #: e.g. "2 @ 5 in"


@dataclass(frozen=True)
class FastenerRow:
    """Fasteners of one interface along the member."""

    interface: Interface  #: the interface
    q: np.ndarray = field(repr=False)  #: shear flow, N/m
    s_strength: float = 0.0  #: smallest spacing needed for strength along the member (unrounded), m
    s_max: float = math.inf  #: spacing limit used, m
    s_max_clause: str = ""  #: where the limit comes from
    zones: tuple = ()  #: :class:`FastenerZone` s
    capacity: np.ndarray = field(default=None, repr=False)  #: n R / s per station, N/m
    check: CheckResult | None = None  #: governing check


@dataclass(frozen=True)
class FastenerDesign:
    """Fastener spacing by zones for a fastened built-up member (bolts, screws, nails)."""

    section: str  #: section designation
    R: float  #: design (or allowable) shear capacity per fastener, N
    n: int  #: fasteners per row at the interface
    x: np.ndarray = field(repr=False)  #: stations, m
    rows: tuple = ()  #: :class:`FastenerRow` per interface
    notes: tuple = ()  #: notes for the engineer

    @property
    def checks(self) -> tuple:
        return tuple(r.check for r in self.rows)

    @property
    def passed(self) -> bool:
        return all(c.passed is not False for c in self.checks)

    def figure(self, system: str = "SI"):
        from .figures import fastener_figure

        return fastener_figure(self, system=system)


def design_fasteners(section, envelope, *, R, n: int = 1, interfaces=None, s_max=None, s_min=None,
                     standard: str | None = None, steel=None, t=None, bolt_diameter=None,
                     weathering: bool = False, zones=None, min_zone=1.0, step=None,
                     steps: bool = True) -> FastenerDesign:
    """Fastener spacing s = n R / q by zones along the member.

    R : shear capacity of one fastener (design strength for LRFD/EN, allowable for ASD; quantity, string
        or SI float in N); must be > 0. n : fasteners per row (e.g. 2 for a screw into each web of a box).
    interfaces : :class:`Interface` s or heights (default: the flange-web junctions).
    s_max : user maximum spacing; standard "AISC 360-22" adds J3.5 (24 t and 12 in; ``t`` the thinner
        part, default the thinner part joined) and F13.3 / E6.2 or D4 (needs ``steel``); s_min or
        ``bolt_diameter`` (J3.3, 2-2/3 d) give a minimum. step : rounding of the spacing (default 1/4 in
        with AISC, else 5 mm).
    """
    from .stress import _si

    Rv = _si(R, "force", "R")
    if not Rv > 0:
        raise InputError(f"R: got {R!r}; expected a fastener shear capacity > 0")
    nn = _count(n)
    env = as_envelope(envelope)
    ints = _interfaces(section, interfaces)
    x, Ix = env.x, section.si.Ix
    aisc = standard is not None and str(standard).upper().replace(" ", "").startswith("AISC")
    if standard is not None and not aisc:
        raise InputError(f"standard: got {standard!r}; expected 'AISC 360-22' or None (give s_max)")
    stp = _si(step, "length", "step") if step is not None else (0.25 * 0.0254 if aisc else 5e-3)
    pmin = 0.0 if s_min is None else _si(s_min, "length", "s_min")
    notes = ["Fastener spacing from the shear flow VQ/I; results must be reviewed and sealed by a licensed or "
             "chartered engineer; local codes, national annexes and project specifications govern."]
    if bolt_diameter is not None:
        from .aisc360.welds import min_bolt_spacing

        sm, c = min_bolt_spacing(_si(bolt_diameter, "length", "bolt_diameter"))
        pmin = max(pmin, sm)
        notes.append(f"minimum spacing {sm * 1e3:.0f} mm ({c})")
    bnd = None if zones is None else [_si(b, "span", "zones") for b in zones]
    rows = []
    for f in ints:
        q = np.asarray(Q_FLOW(V=env.V_abs, Q=f.Q, I_x=Ix), dtype=float)
        with np.errstate(divide="ignore"):
            s_all = np.where(q > 0, np.asarray(S_FAST(n=float(nn), R=Rv, q=np.where(q > 0, q, 1.0))), np.inf)
        limits = []
        if s_max is not None:
            limits.append((_si(s_max, "length", "s_max"), "user maximum"))
        if aisc:
            from .aisc360.welds import max_bolt_spacing, max_connector_spacing

            tt = _si(t, "length", "t") if t is not None else min(f.t_parts)
            limits.append(max_bolt_spacing(tt, weathering=weathering))
            msg = "AISC 360-22 F13.3 spacing (E6.2 / D4) not applied: give steel="
            if steel is None and msg not in notes:
                notes.append(msg)
            if steel is not None:
                from ..materials import steel as _steel

                st = _steel(steel)
                limits.append(max_connector_spacing(f.t_parts[0], Fy=st.fy_si(f.t_parts[0]), E=st.si.E,
                                                    compression=_compression(env, f.flange), weathering=weathering))
        pm, pc = min(limits) if limits else (float(x[-1] - x[0]), "no maximum given (member length)")
        zs = zone_pitches(x, s_all, p_max=pm, step=stp, min_zone=_min_zone(min_zone), p_min=max(pmin, _TOL),
                          boundaries=bnd)
        owner = zone_owner(x, zs)
        cap = np.full_like(q, np.inf)
        zones_out = []
        for k, (x0, x1, p) in enumerate(zs):
            m = owner == k
            cz = nn * Rv / p if p > 0 else 0.0
            cap = np.where(m, cz, cap)
            with np.errstate(divide="ignore", invalid="ignore"):
                r = float(np.max(np.where(m, q / cz, 0.0))) if cz > 0 else math.inf
            lab = (f"{nn} @ {_len_text_sys(stp, p)}" if p > 0 else "no spacing >= the minimum works")
            zones_out.append(FastenerZone(x0, x1, p if p > 0 else math.nan, float(np.max(np.where(m, q, 0.0))),
                                          cz, r, lab))
        with np.errstate(divide="ignore", invalid="ignore"):
            ratio = np.where(q > 0, q / cap, 0.0)
        j = int(np.argmax(ratio))
        rj = float(ratio[j])
        recs = ()
        if steps:
            recs = (given("V", float(env.V_abs[j]), "force", reference="shear envelope", note=f"at x = {x[j]:.4g} m"),
                    given("Q", f.Q, "modulus", reference=f"first moment of the part beyond the {f.name} interface"),
                    given("I_x", Ix, "inertia", reference="section properties"))
            qs = Q_FLOW.step(V=float(env.V_abs[j]), Q=f.Q, I_x=Ix)
            ss = S_FAST.step(n=float(nn), R=Rv, q=qs)
            zj = zones_out[int(owner[j])]
            Rs = given("R", Rv, "force", reference="fastener shear capacity (given)")
            recs += (qs, Rs, ss, given("s_max", pm, "length", reference=pc))
            if math.isnan(zj.pitch):
                recs += (decide(f"no spacing >= the minimum {pmin * 1e3:.0f} mm carries the shear flow here",
                                holds=False, reference=pc),)
            else:
                sp = given("s", zj.pitch, "length", reference="spacing used (rounded down)")
                qa = Q_FCAP.step(n=float(nn), R=Rs, s=sp)
                recs += (sp, qa, F_FAST.step(q=qs, s=sp, n=float(nn)),
                         _check(f"fasteners, {f.name}", qs, qa, reference=pc if aisc else "shear flow"))
        chk = CheckResult(limit_state=f"Fasteners, {f.name}", clause=pc if aisc else "shear flow, s = n R / q",
                          dim="shear_flow", capacity=float(cap[j]), demand=float(q[j]), ratio=rj,
                          passed=rj <= 1.0 + 1e-9, method="", location=float(x[j]),
                          combination=env.name_at(j), steps=recs,
                          data={"s_strength": float(np.min(s_all)), "s_max": pm, "R": Rv, "n": nn})
        rows.append(FastenerRow(f, q, float(np.min(s_all)), pm, pc, tuple(zones_out), cap, chk))
    return FastenerDesign(section.si.name or section.si.kind, Rv, nn, x, tuple(rows), tuple(notes))


def _len_text_sys(step: float, v: float) -> str:
    inch = 0.0254
    if abs(step / inch - round(step / inch * 16) / 16) < 1e-9 and step < 0.05:
        return f"{v / inch:.4g} in"
    return f"{v * 1e3:.4g} mm"


# -------------------------------------------------------------------------------------- cover plates
@dataclass(frozen=True)
class CoverPlate:
    """One partial-length cover plate (SI: m, N, N*m)."""

    face: str  #: "top" or "bottom"
    b: float  #: plate width, m
    t: float  #: plate thickness, m
    cutoff: tuple  #: theoretical cut-off points (x_a, x_b), m
    ends: tuple  #: plate ends (x_a - a', x_b + a') within the member, m
    a_prime: float  #: termination length a' (or the given extension), m
    a_prime_clause: str  #: where a' comes from
    F_end: float  #: plate force to develop at the termination, N
    R_end: float  #: strength of the welds in the length a' (and across the end), N
    welds: JunctionWelds | None = None  #: plate-to-flange welds over the plate
    termination: CheckResult | None = None  #: termination check


@dataclass(frozen=True)
class CoverPlateDesign:
    """Cover plates on a rolled beam: cut-offs, terminations and plate-to-flange welds."""

    beam: str  #: bare beam designation
    plated: object = field(repr=False)  #: the cover-plated section (calckit.sections.BuiltUp)
    x: np.ndarray = field(default=None, repr=False)  #: stations, m
    M_abs: np.ndarray = field(default=None, repr=False)  #: |M| envelope, N*m
    M_bare: np.ndarray = field(default=None, repr=False)  #: bare-beam strength per station, N*m
    plates: tuple = ()  #: :class:`CoverPlate` s (one per plate piece)
    notes: tuple = ()  #: notes for the engineer

    @property
    def checks(self) -> tuple:
        out = []
        for p in self.plates:
            out += [p.termination, p.welds.check]
        return tuple(out)

    @property
    def passed(self) -> bool:
        return all(c.passed is not False for c in self.checks)

    def figure(self, system: str = "SI"):
        from .figures import cover_plate_figure

        return cover_plate_figure(self, system=system)


def _regions(x, excess) -> list[tuple[float, float]]:
    """Intervals where ``excess`` > 0, ends interpolated linearly between stations."""
    need = excess > 0
    out = []
    i, n = 0, len(x)
    while i < n:
        if not need[i]:
            i += 1
            continue
        j = i
        while j + 1 < n and need[j + 1]:
            j += 1
        xa = x[i] if i == 0 or excess[i - 1] == excess[i] else x[i - 1] + (x[i] - x[i - 1]) * (
            -excess[i - 1] / (excess[i] - excess[i - 1]))
        xb = x[j] if j == n - 1 or excess[j + 1] == excess[j] else x[j] + (x[j + 1] - x[j]) * (
            excess[j] / (excess[j] - excess[j + 1]))
        out.append((float(xa), float(xb)))
        i = j + 1
    return out


def design_cover_plates(beam, envelope, *, M_bare, steel, top=None, bottom=None, standard: str = "AISC 360-22",
                        method: str | None = None, rules=None, size=None, end_weld: bool = True,
                        intermittent: bool = False, segment=None, min_zone=1.0, extension=None,
                        steps: bool = True, **rule_options) -> CoverPlateDesign:
    """Partial-length cover plates ``top=(b, t)`` / ``bottom=(b, t)`` on a rolled beam.

    M_bare : the bare beam's flexural strength (design/allowable, same basis as the envelope): a moment
        (quantity, string, SI float) or a callable ``f(x) -> N*m`` on an array of stations (m).
    The plates are needed where |M| > M_bare (theoretical cut-off points by linear interpolation); each is
    extended by a' (AISC 360-22 F13.3; EN: ``extension`` must be given) and its welds in the length a'
    (both edges, and across the end if ``end_weld``) must develop F_p = M Q_p / I at the cut-off.
    """
    from ..materials import steel as _steel
    from ..sections import BuiltUp
    from .stress import _si

    if top is None and bottom is None:
        raise InputError("top/bottom: got neither; expected a cover plate (b, t) on at least one flange")
    st = _steel(steel)
    rules = rules or weld_rules(standard, method, **rule_options)
    env = as_envelope(envelope)
    x = env.x
    Mabs = env.M_abs
    Mb = (np.asarray(M_bare(x), dtype=float) * np.ones_like(x) if callable(M_bare)
          else np.full_like(x, _si(M_bare, "moment", "M_bare")))
    if np.any(Mb <= 0):
        raise InputError("M_bare: got a strength <= 0; expected the bare beam's flexural strength > 0")
    pt = None if top is None else _plate(top)
    pb = None if bottom is None else _plate(bottom)
    plated = BuiltUp.cover_plated(beam, top=None if pt is None else tuple(f"{v!r} m" for v in pt),
                                  bottom=None if pb is None else tuple(f"{v!r} m" for v in pb))
    b0, p = beam.si, plated.si
    notes = ["Cover plates: cut-offs from the moment envelope and the bare beam's strength; results must be "
             "reviewed and sealed by a licensed or chartered engineer; local codes, national annexes and "
             "project specifications govern."]
    regions = _regions(x, Mabs - Mb)
    if not regions:
        notes.append("The bare beam suffices everywhere: no cover plate is needed.")
    t_b = 0.0 if pb is None else pb[1]
    faces = [(f, v) for f, v in (("top", pt), ("bottom", pb)) if v is not None]
    out = []
    mz = _min_zone(min_zone)
    ext = None if extension is None else _si(extension, "length", "extension")
    if rules.size_kind == "throat" and ext is None and regions:
        rules.termination(0.0, 0.0, None)  # raises NotCoveredError with the reason
    for face, (bp, tp) in faces:
        y = t_b + b0.d if face == "top" else t_b
        tf = b0.tf_top if face == "top" else b0.tf_bot
        bf = b0.bf_top if face == "top" else b0.bf_bot
        f = Interface(f"{face} cover plate to flange", face, y, abs(plated.Q_at_si(y)), (tp, tf), (bp, bf), 2, True)
        for xa, xb in regions:
            out.append(_plate_piece(rules, f, env, p.Ix, st, Mabs, (xa, xb), size=size, end_weld=end_weld,
                                    intermittent=intermittent, segment=segment, min_zone=mz, ext=ext,
                                    t_edge=tp if bp <= bf else tf, steps=steps, notes=notes))
    return CoverPlateDesign(b0.name or b0.kind, plated, x, Mabs, Mb, tuple(out), tuple(notes))


def _termination(rules, f: Interface, x, Mabs, Ix, w, cut, ends, a_p, a_clause, end_weld, steps, notes):
    """Worst end of a plate piece: plate force F_p at the cut-off against the welds in the length a'."""
    bp, bf = f.b_parts
    L_t = min(bp, bf) if end_weld else 0.0
    worst, Fe, Re, recs = -1.0, 0.0, 0.0, []
    for xc, xe in ((cut[0], ends[0]), (cut[1], ends[1])):
        if abs(xc - xe) < _TOL:  # the plate runs to the end of the member: no termination there
            continue
        Mc = float(np.interp(xc, x, Mabs))
        Fp = float(F_PLATE(M=Mc, Q_p=f.Q, I_x=Ix))
        L_l = 2.0 * min(a_p, abs(xc - xe))
        Rw = float(rules.combined(w, L_l, L_t))
        if Fp / Rw > worst:
            worst, Fe, Re = Fp / Rw, Fp, Rw
            if steps:
                recs = [given("M", Mc, "moment", reference="moment envelope at the theoretical cut-off",
                              note=f"x = {xc:.4g} m"),
                        given("Q_p", f.Q, "modulus", reference="first moment of the plate about the NA"),
                        given("I_x", Ix, "inertia", reference="cover-plated section"),
                        F_PLATE.step(M=Mc, Q_p=f.Q, I_x=Ix),
                        given("a_prime", a_p, "length", reference=a_clause, latex="a'"),
                        given("L_t", L_t, "length", reference="end weld across the plate" if end_weld else
                              "no end weld")]
                recs += rules.combined_steps(w, L_l, L_t)
        if notes is not None and abs(xc - xe) < a_p - _TOL:
            notes.append(f"{f.flange} plate: only {abs(xc - xe):.3g} m beyond the cut-off at x = {xc:.4g} m, less "
                         f"than a' = {a_p:.3g} m")
    return max(worst, 0.0), Fe, Re, recs


def _plate_piece(rules, f, env, Ix, st, Mabs, cut, *, size, end_weld, intermittent, segment, min_zone, ext,
                 t_edge, steps, notes) -> "CoverPlate":
    x = env.x
    rules = rules.bind(st, f.t_parts)
    kw = dict(q_v=0.0, intermittent=intermittent, segment=segment, boundaries=None, min_zone=min_zone,
              max_pitch=None, weathering=False, limit_state=f"Fillet welds, {f.name}", t_edge=t_edge,
              base_metal=False)
    jw = _junction(rules, f, env, Ix, st, size=size, steps=False, x_range=cut, **kw)
    sizes = [jw.size] if size is not None else [c for c in rules.sizes() if c >= jw.size - _TOL and
                                                 c <= max(jw.size_max, jw.size) + _TOL] or [jw.size]
    for w in sizes:  # the smallest size that also develops the plate at its ends (unless size is given)
        a_p, a_c = (ext, "extension given") if ext is not None else rules.termination(f.b_parts[0], f.t_parts[0],
                                                                                       w if end_weld else None)
        ends = (max(float(x[0]), cut[0] - a_p), min(float(x[-1]), cut[1] + a_p))
        ratio, Fe, Re, _ = _termination(rules, f, x, Mabs, Ix, w, cut, ends, a_p, a_c, end_weld, False, None)
        if ratio <= 1.0 + 1e-9:
            break
    ratio, Fe, Re, recs = _termination(rules, f, x, Mabs, Ix, w, cut, ends, a_p, a_c, end_weld, steps, notes)
    jw = _junction(rules, f, env, Ix, st, size=w, steps=steps, x_range=ends,
                   end_length=(a_p, "continuous welds in the length a' (AISC 360-22 F13.3)"), **kw)
    clause = a_c if ext is not None else f"{rules.standard} F13.3"
    term = CheckResult(limit_state=f"Cover-plate termination, {f.flange}", clause=clause, dim="force", capacity=Re,
                       demand=Fe, ratio=ratio, passed=ratio <= 1.0 + 1e-9, method=_method_word(rules.method),
                       steps=tuple(recs), data={"a_prime": a_p, "cutoff": cut, "ends": ends, "size": w})
    return CoverPlate(f.flange, f.b_parts[0], f.t_parts[0], cut, ends, a_p, a_c, Fe, Re, jw, term)


def _plate(v) -> tuple[float, float]:
    from .stress import _si

    try:
        b, t = v
    except (TypeError, ValueError):
        raise InputError(f"cover plate: got {v!r}; expected (b, t)") from None
    return _si(b, "length", "b"), _si(t, "length", "t")
