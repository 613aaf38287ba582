"""Every check of the member's standard for one candidate, through the design modules' own functions.

The search never restates a design equation: it hands each candidate's demands (its envelope of M and
V with its own self-weight, its unbraced segments, its deflections) to the design module's member check
with ``steps=False`` (the numeric path) and reads the :class:`calckit.design.results.MemberResult`. The
calc sheet of the chosen section is the same call with ``steps=True``
(:meth:`calckit.pick.PickResult.member_result`).

* AISC 360-22: :func:`calckit.design.aisc360.check_member` (flexure F2-F5 per unbraced segment with Cb
  from Eq. F1-1, shear G2, concentrated forces J10 when a bearing length is given) and the deflection
  check of :mod:`calckit.design.aisc360.deflection` per span.
* EN 1993-1-1: :func:`calckit.design.en1993.check_member` (classification, bending with shear, shear,
  lateral-torsional buckling per segment between restraints, transverse forces when a bearing length is
  given) and :func:`calckit.design.en1993.deflection` per span.

:func:`checker_for` returns the callable the search uses: ``check(member, section, demands, steps)``.
"""
from __future__ import annotations

from dataclasses import replace
from typing import Callable

import numpy as np

from ..errors import NotCoveredError
from ..design.results import MemberResult
from .member import AISC, EN, Member
from .response import Demands

__all__ = ["checker_for", "aisc_check", "en_check"]


def _with_combinations(checks, d: Demands):
    """Fill the governing combination of checks that have a location but no combination name."""
    out = []
    for c in checks:
        if not c.combination and c.location is not None and c.dim in ("moment", "force"):
            i = int(np.argmin(np.abs(d.x - c.location)))
            if c.dim == "moment":
                by = d.M_max_by if abs(d.M_max[i]) >= abs(d.M_min[i]) else d.M_min_by
            else:
                by = d.V_max_by if abs(d.V_max[i]) >= abs(d.V_min[i]) else d.V_min_by
            c = replace(c, combination=d.combinations[int(by[i])])
        out.append(c)
    return tuple(out)


# ------------------------------------------------------------------------------------------- EN 1993
def _en_forces(m: Member, d: Demands):
    """Transverse forces at the supports (reactions) and under point loads, when a bearing length is given."""
    if m.bearing is None:
        return ()
    from ..analysis.loads import PointLoad

    out = []
    nodes = m.nodes
    for i, (x, s) in enumerate(zip(nodes, m.supports)):
        if isinstance(s, str) and s == "free":
            continue
        end = i in (0, len(nodes) - 1)
        R = float(d.R_max[i])
        if R <= 0:
            continue
        out.append({"x": x, "ss": m.bearing, "F": R, "load_type": "c" if end else "a", "c": 0.0 if end else None,
                    "flange": "bottom", "name": f"support {i}"})
    for ld in m.loads:
        if isinstance(ld, PointLoad) and ld.P > 0:
            idx = [i for i, x in enumerate(nodes) if abs(x - ld.x) < 1e-9 * m.L]
            if idx:
                continue
            # largest factored jump of V at the load position
            j = np.nonzero(np.abs(d.x - ld.x) <= 1e-9 * max(m.L, 1.0))[0]
            if j.size >= 2:
                F = max(abs(d.V_max[j[0]] - d.V_max[j[-1]]), abs(d.V_min[j[0]] - d.V_min[j[-1]]))
                out.append({"x": ld.x, "ss": m.bearing, "F": float(F), "load_type": "a", "flange": "top",
                            "name": f"point load at {ld.x:.4g} m"})
    return tuple(out)


def en_check(m: Member, section, d: Demands, steps: bool = False, **extra) -> MemberResult:
    """EN 1993-1-1 member check of ``section`` for member ``m`` with demands ``d`` (see module docstring).

    Bending with shear, shear and transverse forces come from :func:`calckit.design.en1993.check_member`
    on the envelope (exact for those checks). Lateral-torsional buckling is checked per segment between
    restraints with :func:`calckit.design.en1993.ltb` on the moment diagram of every strength combination
    (and pattern arrangement) separately, the worst kept: C1 of a combination's own diagram, never of an
    envelope curve (which mixes combinations and can overstate C1). ``extra`` goes to ``check_member``
    (e.g. ``a``, the stiffener spacing).
    """
    from ..design import en1993
    from ..errors import NotCoveredError

    ctx = _context(m)
    res = en1993.check_member(section, m.grade, x=d.x, M=(d.M_max, d.M_min), V=(d.V_max, d.V_min),
                              restraints="continuous", forces=_en_forces(m, d), annex=m.annex, steps=steps,
                              **extra)
    checks = list(_with_combinations(res.checks, d))
    if m.bracing != "continuous":
        if any(isinstance(s, str) and s == "free" for s in m.supports):
            raise NotCoveredError("bracing: lateral-torsional buckling of a cantilever or overhang (a free end) is "
                                  "not covered by calckit.design.en1993; use bracing='continuous' or check the "
                                  "overhang separately with a given M_cr")
        M, _ = d.diagrams()
        mb_uniform: dict = {}
        for a, b in m.segments():
            worst = None
            inside = (d.x > a) & (d.x < b)
            xs = np.concatenate(([a], d.x[inside], [b]))
            Lq = ctx["length_q"](b - a)
            cands = []
            for name, Mc in M.items():
                Ms = np.concatenate(([np.interp(a, d.x, Mc)], Mc[inside], [np.interp(b, d.x, Mc)]))
                j = int(np.argmax(np.abs(Ms)))
                if Ms[j] != 0:
                    cands.append((abs(float(Ms[j])), name, Ms, j))
            cands.sort(key=lambda t: -t[0])
            for peak, name, Ms, j in cands:
                if worst is not None:
                    # M_b,Rd of any diagram >= that of a uniform moment (C1 = 1) with the same peak (load at
                    # the shear centre, zg = 0): a diagram with peak / M_b,Rd(C1 = 1) below the worst ratio
                    # so far cannot govern, so it is not evaluated
                    key = (round(b - a, 9), "uniform")
                    Mb1 = mb_uniform.get(key)
                    if Mb1 is None:
                        Mb1 = mb_uniform[key] = en1993.ltb(section, m.grade, L=Lq, C1=1.0, M_Ed=_Q(peak, "moment"),
                                                           annex=m.annex, steps=False).capacity
                    if peak / Mb1 <= worst[0].ratio:
                        continue
                r = en1993.ltb(section, m.grade, L=Lq, moment_diagram=(xs - a, Ms), annex=m.annex, steps=False,
                               segment=(a, b), location=float(xs[j]), combination=name)
                if worst is None or r.ratio > worst[0].ratio:
                    worst = (r, Ms, name, float(xs[j]))
            if worst is not None:
                r, Ms, name, xj = worst
                if steps:  # the governing diagram again, with its calc-sheet steps
                    r = en1993.ltb(section, m.grade, L=ctx["length_q"](b - a), moment_diagram=(xs - a, Ms),
                                   annex=m.annex, steps=True, segment=(a, b), location=xj, combination=name)
                checks.append(r)
    for dd in d.deflections:
        kind = "variable" if dd.kind == "live" else "total"
        c = en1993.deflection(dd.value, ctx["length_q"](dd.length), kind=kind, limit=dd.divisor, annex=m.annex,
                              name=dd.combination, steps=steps, location=dd.x)
        label = f"Deflection ({kind}, span {dd.span + 1})"
        checks.append(replace(c, limit_state=label,
                              note=("cantilever: limit on twice its length (common practice)"
                                    if dd.length > m.spans[dd.span] * 1.5 else c.note)))
    notes = tuple(n for n in res.notes if "continuous" not in n or m.bracing == "continuous")
    return replace(res, checks=tuple(checks), notes=notes)


# ------------------------------------------------------------------------------------------ AISC 360
def aisc_check(m: Member, section, d: Demands, steps: bool = False, **extra) -> MemberResult:
    """AISC 360-22 member check of ``section`` for member ``m`` with demands ``d``.

    The moment and shear diagrams are passed per strength combination (the pattern-loading maximum and
    minimum of each, when they differ), so that Cb (Eq. F1-1) is computed per combination diagram.
    ``extra`` goes to :func:`calckit.design.aisc360.check_member` (e.g. ``stiffeners``, ``stiffener``).
    """
    from ..design import aisc360
    from ..design.aisc360._core import Calc
    from ..design.aisc360.deflection import deflection_check

    M, V = d.diagrams()
    ctx = _context(m)
    res = aisc360.check_member(section, m.grade, method=m.method, x=d.x, M=M, V=V, supports=ctx["supports"],
                               bracing=ctx["bracing"], bearing=ctx["bearing"], steps=steps, **extra)
    checks = list(res.checks)
    for dd in d.deflections:
        cant = m.span_is_cantilever(dd.span)
        c = deflection_check(dd.value, m.spans[dd.span], dd.divisor, dd.kind, Calc(steps), cantilever=cant,
                             location=dd.x)
        checks.append(replace(c, limit_state=f"{c.limit_state} (span {dd.span + 1})", combination=dd.combination))
    return replace(res, checks=tuple(checks))


def _aisc_bearing(m: Member) -> tuple:
    """Bearing records at the supports and under point loads (lb = the member's bearing length)."""
    from ..analysis.loads import PointLoad
    from ..design.aisc360 import Bearing

    out = []
    for i, (x, s) in enumerate(zip(m.nodes, m.supports)):
        if not (isinstance(s, str) and s == "free"):
            out.append(Bearing(x=x, lb=m.bearing, name=f"support {i}"))
    for ld in m.loads:
        if isinstance(ld, PointLoad) and ld.P > 0 and all(abs(ld.x - x) > 1e-9 * m.L for x in m.nodes):
            out.append(Bearing(x=ld.x, lb=m.bearing, name=f"load at {ld.x:.4g} m"))
    return tuple(out)


_CTX: dict = {}


def _Q(v: float, dim: str):
    from ..units import quantity

    return quantity(v, dim)


def _context(m: Member) -> dict:
    """Values derived from the member once (supports, bracing, bearing records, cached quantities)."""
    ctx = _CTX.get(id(m))
    if ctx is None or ctx["member"] is not m:
        from ..units import Q_

        cache: dict = {}

        def length_q(L: float):
            q = cache.get(L)
            if q is None:
                q = cache[L] = Q_(L, "m")
            return q

        braces = list(m.brace_positions())
        ctx = {"member": m,
               "supports": [x for x, s in zip(m.nodes, m.supports) if not (isinstance(s, str) and s == "free")],
               "bracing": "continuous" if m.bracing == "continuous" else braces,
               "restraints": "continuous" if m.bracing == "continuous" else braces,
               "bearing": _aisc_bearing(m) if (m.bearing is not None and m.standard == AISC) else (),
               "length_q": length_q}
        if len(_CTX) > 16:
            _CTX.clear()
        _CTX[id(m)] = ctx
    return ctx


def checker_for(m: Member) -> Callable:
    """The check function for the member's standard: ``check(member, section, demands, steps)``."""
    if m.standard == AISC:
        return aisc_check
    if m.standard == EN:
        return en_check
    raise NotCoveredError(f"standard: {m.standard!r} has no member check in calckit")
