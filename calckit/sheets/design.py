"""Adapter between the calc sheets and the design engines (:mod:`calckit.design.aisc360`,
:mod:`calckit.design.en1993`): bracing points from the parameters, the member-level check call, and the
conversion of design ``CheckResult`` records into calckit.render ``Check`` records for display.

The sheets hold no design logic: strengths, Cb, chi_LT, classification and every clause come from the
design modules; this module only passes the analysis results in and the records out.
"""
from __future__ import annotations

from typing import Any, Sequence

__all__ = ["brace_points", "to_render", "deflection_checks", "is_aisc", "member_checks", "girder_checks"]


def is_aisc(standard: str) -> bool:
    return str(standard).upper().startswith("AISC")


def brace_points(nodes: Sequence[float], bracing: str, extra: Sequence[float] = (),
                 kinds: Sequence[str] | None = None) -> list[float]:
    """Positions (m) where the compression flange is braced laterally, sorted and unique.

    ``nodes``: support positions (m); ``kinds``: their kinds ("free" ends are not braced).
    ``bracing``: "continuous" (returns []: continuously braced), "supports", "midspan", "thirds" or
    "quarters" (at the supports and at those points of each span). ``extra``: further positions (m).
    """
    if bracing == "continuous":
        return []
    div = {"supports": 1, "midspan": 2, "thirds": 3, "quarters": 4}[bracing]
    kinds = list(kinds) if kinds is not None else ["pin"] * len(nodes)
    pts = set()
    for i, (a, b) in enumerate(zip(nodes[:-1], nodes[1:])):
        for k in range(div + 1):
            if (k == 0 and kinds[i] == "free") or (k == div and kinds[i + 1] == "free"):
                continue
            pts.add(round(a + (b - a) * k / div, 12))
    pts.update(round(float(x), 12) for x in extra)
    return sorted(pts)


def to_render(cr, system: str = "SI") -> Any:
    """A calckit.render Check for a design CheckResult (its steps shown, demand vs capacity); positions
    in the notes are given in the display units of ``system``."""
    from ..render import Check, check

    if isinstance(cr, Check):
        return cr
    if cr.ratio is None and cr.demand is not None and cr.data.get("resisted_by_stiffeners"):
        return _resisted(cr, system)
    steps = []
    for s in cr.steps or ():
        if isinstance(s, Check):  # a record that already is a check: keep the steps that led to it
            steps += [t for t in s.steps if not any(t is u for u in steps)]
        elif hasattr(s, "kind"):
            steps.append(s)
    steps = tuple(steps)
    comb = cr.combination or ""
    show = comb and comb not in cr.limit_state and not comb.startswith("envelope")
    name = cr.limit_state
    if cr.segment is not None:  # several segments share a limit state: say which one
        from ..units import fmt

        a, b = cr.segment
        name += f", x = {fmt(a, 'span', system)} to {fmt(b, 'span', system)}"
    name += f" ({comb})" if show else ""
    demand = 0.0 if cr.demand is None else abs(float(cr.demand))
    note = cr.note
    if cr.location is not None:
        from ..units import fmt

        note = (note + "; " if note else "") + f"at x = {fmt(cr.location, 'span', system)}"
    return check(name, (demand, cr.dim), (float(cr.capacity), cr.dim), reference=cr.clause, steps=steps,
                 note=note)


def _resisted(cr, system: str):
    """A web check exceeded by the web alone where the given stiffeners take the force: a statement of the
    comparison, not a check (the stiffener pair's own checks follow it)."""
    from ..render import decide
    from ..units import fmt

    where = "" if cr.location is None else f" at x = {fmt(cr.location, 'span', system)}"
    text = (f"{cr.limit_state}{where}: required {fmt(abs(cr.demand), cr.dim, system)} > "
            f"{fmt(cr.capacity, cr.dim, system)} of the web alone; the given stiffener pair resists the force "
            "(checked below)")
    return decide(text, holds=False, reference=cr.clause, note=cr.note)


def is_rated(cr) -> bool:
    """The result is a check with a ratio (not a record kept for information only)."""
    return cr.ratio is not None or cr.demand is None


def compact_repeats(results, system: str = "SI", what: str | None = None) -> list:
    """Design results with the derivation shown once: a result whose limit state, clause and capacity
    equal an earlier one's keeps only its demand-versus-capacity line, with a note saying where its
    capacity was derived (e.g. the interior stiffener panels of a girder, all of the same width a)."""
    from dataclasses import replace

    from ..units import fmt

    seen: dict = {}
    out = []
    for r in results:
        cap = float(r.capacity)
        nom = None if r.nominal is None else float(f"{float(r.nominal):.9g}")
        key = (r.limit_state, r.clause, r.dim, float(f"{cap:.9g}"), nom)
        if key in seen and r.steps:
            first = seen[key]
            if first.segment is not None:
                a, b = first.segment
                span = f"from x = {fmt(a, 'span', system)} to {fmt(b, 'span', system)}"
                where = f" (the {what or 'segment'} {span})"
            elif first.location is not None:
                where = f" (the {what or 'check'} at x = {fmt(first.location, 'span', system)})"
            else:
                where = ""
            note = (r.note + "; " if r.note else "") + f"capacity derived above{where}"
            out.append(replace(r, steps=(), note=note))
        else:
            seen.setdefault(key, r)
            out.append(r)
    return out


def deflection_checks(sheet) -> list:
    """Span-by-span deflection checks of a beam sheet through the design engine's deflection check:
    the largest |deflection| of each service envelope in each span against span / n (the parameters'
    limits; a span ending at a free support is a cantilever: 2 x its length, common practice)."""
    import numpy as np

    from ..units import to_si

    spans = [to_si(s, "span") for s in sheet.spans]
    sup = sheet.supports
    nodes = sheet.beam.layout.nodes
    out = []
    for label, env in sheet.service_env.items():
        n = float(sheet.limits[label])
        x = np.asarray(env.x)
        for i, L in enumerate(spans):
            m = (x >= nodes[i] - 1e-9) & (x <= nodes[i + 1] + 1e-9)
            d = np.maximum(np.abs(env.defl_max[m]), np.abs(env.defl_min[m]))
            cant = sup[i] == "free" or sup[i + 1] == "free"
            if sheet.aisc:
                from ..design.aisc360.deflection import deflection

                r = deflection(f"{float(d.max())!r} m", f"{L!r} m", n, case=f"{label}, span {i + 1}",
                               cantilever=cant)
            else:
                from ..design.en1993.deflection import deflection

                Lr = 2.0 * L if cant else L
                r = deflection(d, f"{Lr!r} m", kind="variable" if label == "live" else "total", limit=n,
                               name=f"span {i + 1}")
            out.append(r)
    return out


def diagrams(sheet) -> dict:
    """The real moment diagram of every strength combination and pattern arrangement
    (:func:`calckit.analysis.arrangements`): Cb (AISC 360-22 F1-1) and C1 (EN 1993-1-1) need the shape of
    one loading's diagram, which an envelope is not. Cached on the sheet."""
    d = getattr(sheet, "_diagrams", None)
    if d is None:
        from ..analysis import arrangements

        d = arrangements(sheet.solution, sheet.strength)
        sheet._diagrams = d
    return d


def member_checks(sheet, a=None) -> list:
    """Design CheckResults of a beam or girder sheet from the design engine of its standard, on the real
    diagram of every combination and arrangement (:func:`diagrams`), with the lateral restraints, the
    stiffener spacing ``a`` and the concentrated forces where the parameters give a bearing length: at
    the supports (``bearing_length``) and under point loads that bear on the flange (their ``bearing``),
    with the bearing stiffeners given there (AISC 360-22 J10; EN 1993-1-5 sections 6 and 9)."""
    dia = diagrams(sheet)
    points = bearing_points(sheet)
    if not sheet.aisc:
        from ..design.en1993 import check_member

        restraints = "continuous" if not sheet.braces else sheet.braces
        res = check_member(sheet.section, sheet.steel, analysis=dia, restraints=restraints, a=a,
                           forces=_en_forces(points, dia))
        return list(res.checks)
    from ..design.aisc360 import bearing, check_member

    bracing = "continuous" if not sheet.braces else sheet.braces
    sway = {"rotation restrained": "restrained", "rotation free": "free"}.get(sheet.p.get("web_sidesway"))
    bearings = [bearing(f"{x!r} m", lb=f"{lb!r} m", flange="top" if kind == "load" else "bottom", name=name,
                        stiffener=pair, sidesway=sway if kind == "load" else None)
                for x, lb, kind, name, pair in points]
    res = check_member(sheet.section, sheet.steel, dia, method=sheet.method, bracing=bracing,
                       stiffeners=None if a is None else f"{a!r} m", bearing=bearings)
    return list(res.checks)


def bearing_points(sheet) -> list[tuple[float, float, str, str, tuple | None]]:
    """(x, bearing length, kind, name, stiffener pair) of the concentrated forces to check on the web:
    every support that is not free when ``bearing_length`` is given (kind "end" or "interior"; the pair
    ``bearing_stiffener_b``/``_t``), and every point-load position away from a support where a load has
    a ``bearing`` (kind "load"; the longest given there, and the ``stiffener_b``/``_t`` given there)."""
    from ..units import fmt, to_si

    nodes = list(sheet.beam.layout.nodes)
    kinds = [s.kind for s in sheet.beam.layout.supports]
    L = nodes[-1]
    out = []
    brg = sheet.p.get("bearing_length")
    if brg is not None:
        lb = to_si(brg, "length", "bearing_length")
        sb, st = sheet.p.get("bearing_stiffener_b"), sheet.p.get("bearing_stiffener_t")
        pair = None if sb is None or st is None else (sb, st)
        for i, (x, k) in enumerate(zip(nodes, kinds)):
            if k != "free":
                out.append((x, lb, "end" if i in (0, len(nodes) - 1) else "interior", f"support {i + 1}", pair))
    at: dict[float, list] = {}
    for i, pl in enumerate(sheet.p.get("point_loads") or []):
        if pl.get("bearing") is None:
            continue
        x = to_si(pl["x"], "length")
        if any(abs(x - n) <= 1e-9 * L for n in nodes):
            continue  # over a support: the reaction's bearing governs
        key = next((k for k in at if abs(k - x) <= 1e-9 * L), x)
        lb, pair = at.get(key, (0.0, None))
        lb = max(lb, to_si(pl["bearing"], "length", f"point_loads[{i}].bearing"))
        if pl.get("stiffener_b") is not None and pl.get("stiffener_t") is not None:
            pair = (pl["stiffener_b"], pl["stiffener_t"])
        at[key] = (lb, pair)
    for x in sorted(at):
        lb, pair = at[x]
        out.append((x, lb, "load", f"point load at x = {fmt(x, 'span', sheet.system)}", pair))
    return out


def _en_forces(points, dia) -> list:
    """EN 1993-1-5 transverse forces: a reaction at an end support is load type (c) with c = 0, at an
    interior support type (a); a point load on the top flange type (a) with F the largest jump of the
    shear in any diagram (EN 1993-1-5 Figure 6.1). Where a stiffener pair is given the force gets the
    bearing stiffener checks of EN 1993-1-5 section 9 instead of the web check of section 6."""
    out = []
    for x, ss, kind, name, pair in points:
        if kind == "load":
            F = max((abs(float(r.V_si(x, "left") - r.V_si(x, "right"))) for r in dia.values()),
                    default=0.0)
            if F <= 0:
                continue
            rec = {"x": x, "ss": ss, "F": F, "load_type": "a", "flange": "top", "name": name}
        else:
            rec = {"x": x, "ss": ss, "F": None, "load_type": "c" if kind == "end" else "a",
                   "c": 0.0 if kind == "end" else None, "flange": "bottom", "name": name}
        if pair is not None:
            rec["stiffener"] = pair
        out.append(rec)
    return out


def girder_checks(sheet) -> list:
    """Design CheckResults of a plate girder sheet: as :func:`member_checks` with the stiffener spacing."""
    return member_checks(sheet, a=sheet.a)


