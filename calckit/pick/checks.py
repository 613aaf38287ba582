"""Every check of the member's standard for one candidate, through the design modules' own functions.

The search never restates a design equation: it hands each candidate's demands (the real moment and
shear diagram of every strength load arrangement with its own self-weight, its unbraced segments, its
deflections) to the design module's member check with ``steps=False`` (the numeric path) and reads the
:class:`calckit.design.results.MemberResult`. The design module's demands record is prepared once per
member and only its self-weight-dependent parts are redone per candidate. The calc sheet of the chosen
section is the same call with ``steps=True`` (:meth:`calckit.pick.PickResult.member_result`).

* AISC 360-22: :func:`calckit.design.aisc360.check_member` (flexure F2-F5 per unbraced segment with Cb
  from Eq. F1-1 of each diagram, shear G2, concentrated forces J10 when a bearing length is given) on
  :func:`calckit.design.aisc360.demands` prepared once per member, and the deflection check of
  :mod:`calckit.design.aisc360.deflection` per span.
* EN 1993-1-1: :func:`calckit.design.en1993.check_member` on demands prepared once per member with
  :func:`calckit.design.en1993.demands` (classification, bending with shear, shear, lateral-torsional
  buckling per segment between restraints and of cantilevers and overhangs under every load
  arrangement's own diagram, transverse forces when a bearing length is given) and
  :func:`calckit.design.en1993.deflection` per span.

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
    """Transverse forces at the supports (reactions, when a bearing length is given) and under the point
    loads that bear on a flange (``m.load_bearings``)."""
    if m.bearing is None and not m.load_bearings:
        return ()
    out = []
    nodes = m.nodes
    if m.bearing is not None:
        for i, (x, s) in enumerate(zip(nodes, m.supports)):
            if isinstance(s, str) and s == "free":
                continue
            end = i in (0, len(nodes) - 1)
            R = float(d.R_max[i])
            if R <= 0:
                continue
            out.append({"x": x, "ss": m.bearing, "F": R, "load_type": "c" if end else "a",
                        "c": 0.0 if end else None, "flange": "bottom", "name": f"support {i}"})
    for x, lb in m.load_bearings:
        if any(abs(x - n) < 1e-9 * m.L for n in nodes):
            continue
        # largest factored jump of V at the load position
        j = np.nonzero(np.abs(d.x - x) <= 1e-9 * max(m.L, 1.0))[0]
        if j.size >= 2:
            F = max(abs(d.V_max[j[0]] - d.V_max[j[-1]]), abs(d.V_min[j[0]] - d.V_min[j[-1]]))
            if F > 0:
                out.append({"x": x, "ss": lb, "F": float(F), "load_type": "a", "flange": "top",
                            "name": f"point load at {x:.4g} m"})
    return tuple(out)


def en_check(m: Member, section, d: Demands, steps: bool = False, **extra) -> MemberResult:
    """EN 1993-1-1 member check of ``section`` for member ``m`` with demands ``d`` (see module docstring).

    One :func:`calckit.design.en1993.demands` per member (the response's strength arrangements, the
    lateral-torsional restraints and the self-weight term), shared by every candidate:
    ``Demands.with_self_weight(w)`` adds the candidate's own self-weight to every diagram, and
    :func:`calckit.design.en1993.check_member` checks bending with shear and shear on the envelope of the
    diagrams (exact for those checks), lateral-torsional buckling of each segment between restraints -
    and of a cantilever or an overhang beyond the last restraint - under EACH real diagram (C1 of that
    diagram, never of an envelope curve), and the transverse forces when a bearing length is given.
    ``extra`` goes to ``check_member`` (e.g. ``a``, the stiffener spacing).
    """
    from ..design import en1993

    ctx = _context(m)
    resp = d.response
    if resp is None:  # demands built without a Response: this candidate's diagrams (self-weight included)
        Dw = en1993.demands(x=d.x, M=dict(zip(d.diagram_names, d.diagram_M)),
                            V=dict(zip(d.diagram_names, d.diagram_V)), restraints=ctx["restraints"],
                            forces=_en_forces(m, d))
    else:
        Dw = resp.design_demands(EN).with_self_weight(d.w_self, forces=_en_forces(m, d))
    res = en1993.check_member(section, m.grade, demands=Dw, annex=m.annex, steps=steps, **extra)
    checks = list(_with_combinations(res.checks, d))
    for dd in d.deflections:
        kind = "variable" if dd.kind == "live" else "total"
        label = f"Deflection ({kind}, span {dd.span + 1})"
        cant = dd.length > m.spans[dd.span] * 1.5
        if steps:
            c = en1993.deflection(dd.value, ctx["length_q"](dd.length), kind=kind, limit=dd.divisor, annex=m.annex,
                                  name=dd.combination, steps=True, location=dd.x)
            checks.append(replace(c, limit_state=label,
                                  note="cantilever: limit on twice its length (common practice)" if cant else c.note))
            continue
        # the limit depends on the span only: the design module's check once per span and kind, then the
        # same capacity against each candidate's deflection (CheckResult.with_demand)
        key = ("en deflection", dd.span, kind, dd.length, dd.divisor, m.annex)
        tpl = ctx.get(key)
        if tpl is None:
            tpl = ctx[key] = en1993.deflection(0.0, ctx["length_q"](dd.length), kind=kind, limit=dd.divisor,
                                               annex=m.annex, steps=False)
        checks.append(tpl.with_demand(dd.value, limit_state=label, location=dd.x, combination=dd.combination,
                                      note="cantilever: limit on twice its length (common practice)" if cant
                                      else tpl.note))
    return replace(res, checks=tuple(checks))


# ------------------------------------------------------------------------------------------ AISC 360
def aisc_check(m: Member, section, d: Demands, steps: bool = False, **extra) -> MemberResult:
    """AISC 360-22 member check of ``section`` for member ``m`` with demands ``d``.

    The moment and shear diagrams of every strength combination and pattern arrangement go to
    :func:`calckit.design.aisc360.check_member`, so that Cb (Eq. F1-1) is computed per real diagram. The
    member's :func:`calckit.design.aisc360.demands` (segments, panels, notes) is prepared once per
    response; per candidate only its segment moments (:func:`calckit.design.aisc360.cb.diagram_moments`
    of each diagram, with the candidate's self-weight) and panel shears are replaced
    (:func:`_aisc_candidate`). With bearing checks (concentrated forces from the shear jumps) the
    demands are built per candidate by ``aisc360.check_member`` itself. ``extra`` goes to
    :func:`calckit.design.aisc360.check_member` (e.g. ``stiffeners``, ``stiffener``).
    """
    from ..design import aisc360
    from ..design.aisc360._core import Calc
    from ..design.aisc360.deflection import deflection_check

    ctx = _context(m)
    resp = d.response
    if resp is None or ctx["bearing"]:
        M, V = d.diagrams()
        res = aisc360.check_member(section, m.grade, method=m.method, x=d.x, M=M, V=V, supports=ctx["supports"],
                                   bracing=ctx["bracing"], bearing=ctx["bearing"], steps=steps, **extra)
    else:
        stiff = extra.pop("stiffeners", None)
        D0, plan = resp.aisc_demands(ctx["supports"], ctx["bracing"], stiff, plan=_AiscPlan)
        res = aisc360.check_member(section, m.grade, method=m.method, demands=_aisc_candidate(D0, d, plan),
                                   steps=steps, **extra)
    checks = list(res.checks)
    for dd in d.deflections:
        cant = m.span_is_cantilever(dd.span)
        if steps:
            c = deflection_check(dd.value, m.spans[dd.span], dd.divisor, dd.kind, Calc(True), cantilever=cant,
                                 location=dd.x)
            checks.append(replace(c, limit_state=f"{c.limit_state} (span {dd.span + 1})", combination=dd.combination))
            continue
        # the limit depends on the span only: the design module's check once per span and kind, then the
        # same capacity against each candidate's deflection (CheckResult.with_demand)
        key = ("aisc deflection", dd.span, dd.kind, dd.divisor)
        tpl = ctx.get(key)
        if tpl is None:
            c = deflection_check(0.0, m.spans[dd.span], dd.divisor, dd.kind, Calc(False), cantilever=cant)
            tpl = ctx[key] = replace(c, limit_state=f"{c.limit_state} (span {dd.span + 1})")
        checks.append(tpl.with_demand(dd.value, location=dd.x, combination=dd.combination))
    return replace(res, checks=tuple(checks))


class _AiscPlan:
    """What :func:`_aisc_candidate` needs from the member once: per unbraced segment of ``D0`` the
    stations inside it and the quarter-point moments of each diagram's other loads and of the unit
    self-weight (np.interp is linear in the moments, so a candidate's are qA + f w qU), per shear panel
    its stations."""

    def __init__(self, D0, resp) -> None:
        x = resp.x
        segs = D0.segments
        n = len(segs)
        pts = np.array([(sg.a, sg.a + 0.25 * sg.Lb, sg.a + 0.5 * sg.Lb, sg.a + 0.75 * sg.Lb, sg.b) for sg in segs])
        flat = pts.ravel()
        A = resp.A
        self.qA = np.array([np.interp(flat, x, Mk) for Mk in A["M"]]).reshape(len(A["M"]), n, 5)
        self.qU = np.interp(flat, x, resp.unit["M"]).reshape(n, 5)
        self.f = A["f"]
        span = max(float(x[-1] - x[0]), 1e-9)
        self.ranges = [(int(np.searchsorted(x, sg.a - 1e-9 * span, "left")),
                        int(np.searchsorted(x, sg.b + 1e-9 * span, "right"))) for sg in segs]
        tol = 1e-9 * max(D0.x1 - D0.x0, 1.0)
        self.panels = [np.nonzero((x >= pd.a0 - tol) & (x <= pd.a1 + tol))[0] for pd in D0.shear]
        self.D0 = D0
        self.pre: dict = {}  #: id(candidate demands) -> (demands, flexure items, panels), see prepare()

    def prepare(self, dem) -> None:
        """:func:`_aisc_candidate`'s segment moments, Cb and panel shears of every candidate of ``dem`` at
        once (numpy over candidates x diagrams; the same values and rules as the per-candidate loop,
        tests/test_pick_fast_paths.py), kept for :func:`_aisc_candidate`."""
        from ..design.aisc360.cb import F1_1
        from ..design.aisc360.demands import PanelDemand, SegmentDemand

        D0 = self.D0
        if not dem:
            return
        names = dem[0].diagram_names
        K, N = len(names), len(dem)
        if K == 0:
            return
        w = np.array([d.w_self for d in dem])
        M = np.stack([d.diagram_M for d in dem])  # (N, K, S)
        V = np.stack([d.diagram_V for d in dem])
        x = dem[0].x
        q = self.qA[None] + (self.f[None, :] * w[:, None])[:, :, None, None] * self.qU[None, None]  # (N, K, n, 5)
        lim = 1e-12 * np.max(np.abs(M), axis=2, initial=0.0)  # diagram_moments' round-off snap
        q[np.abs(q) <= lim[:, :, None, None]] = 0.0
        fixed_cb = D0.Cb is not None or D0.bracing == "continuous"
        fl: list[list] = [[] for _ in range(N)]
        ks = np.arange(K)
        for i, sg in enumerate(D0.segments):
            qa, qA_, qB_, qC_, qb = (q[:, :, i, j] for j in range(5))
            up = qa >= qb
            bp, xp = np.where(up, qa, qb), np.where(up, sg.a, sg.b)
            dn = qa <= qb
            bn, xn = np.where(dn, qa, qb), np.where(dn, sg.a, sg.b)
            i0, i1 = self.ranges[i]
            if i1 > i0:
                sub = M[:, :, i0:i1]
                jp, jn = sub.argmax(axis=2), sub.argmin(axis=2)
                vp = np.take_along_axis(sub, jp[..., None], 2)[..., 0]
                vn = np.take_along_axis(sub, jn[..., None], 2)[..., 0]
                hp, hn = vp > bp, vn < bn
                bp, xp = np.where(hp, vp, bp), np.where(hp, x[i0 + jp], xp)
                bn, xn = np.where(hn, vn, bn), np.where(hn, x[i0 + jn], xn)
            Mpos, Mneg = np.maximum(bp, 0.0), np.maximum(-bn, 0.0)
            Mmax = np.maximum(Mpos, Mneg)
            MA, MB, MC = np.abs(qA_), np.abs(qB_), np.abs(qC_)
            if fixed_cb or sg.free_end:
                cb = np.ones((N, K))
            else:
                pos = Mmax > 0
                safe = np.where(pos, Mmax, 1.0)
                cb = np.where(pos, F1_1.fast(M_max=safe, M_A=MA, M_B=MB, M_C=MC), 1.0)
            # item k is left out when another item j has M_pos, M_neg >= and Cb <= (one strictly, or j first)
            Pj, Pk = Mpos[:, :, None], Mpos[:, None, :]
            Nj, Nk = Mneg[:, :, None], Mneg[:, None, :]
            Cj, Ck = cb[:, :, None], cb[:, None, :]
            dom = (Pj >= Pk) & (Nj >= Nk) & (Cj <= Ck) & ((Pj > Pk) | (Nj > Nk) | (Cj < Ck)
                                                         | (ks[:, None] < ks[None, :]))
            dom &= ks[:, None] != ks[None, :]
            keep = ~dom.any(axis=1)  # (N, K)
            cols = [a.tolist() for a in (Mmax, MA, MB, MC, Mpos, xp, Mneg, xn)]
            kl = keep.tolist()
            for n in range(N):
                row = [c[n] for c in cols]
                out = fl[n]
                for k in range(K):
                    if kl[n][k]:
                        out.append(SegmentDemand(sg, names[k], row[0][k], row[1][k], row[2][k], row[3][k], row[4][k],
                                                 row[5][k], row[6][k], row[7][k]))
        panels: list[list] = [[] for _ in range(N)]
        for ip, pd in enumerate(D0.shear):
            idx = self.panels[ip]
            if not idx.size:
                for n in range(N):
                    panels[n].append(pd)
                continue
            Va = np.abs(V[:, :, idx]).reshape(N, -1)
            a = Va.argmax(axis=1)
            k, j = np.unravel_index(a, (K, idx.size))
            vals, xs = Va[np.arange(N), a].tolist(), x[idx[j]].tolist()
            for n in range(N):
                panels[n].append(PanelDemand(pd.a0, pd.a1, pd.stiffened, pd.end_panel, vals[n], xs[n], names[int(k[n])]))
        self.pre = {id(d): (d, tuple(fl[n]), tuple(panels[n])) for n, d in enumerate(dem)}


def _aisc_prepare(m: Member, dem) -> None:
    """Section search hook (:func:`calckit.pick.search.pick`): the per-candidate moments of every candidate
    at once (:meth:`_AiscPlan.prepare`) when they share one response and no bearing check is made."""
    if not dem or dem[0].response is None:
        return
    resp = dem[0].response
    ctx = _context(m)
    if ctx["bearing"] or any(d.response is not resp for d in dem):
        return
    D0, plan = resp.aisc_demands(ctx["supports"], ctx["bracing"], None, plan=_AiscPlan)
    plan.prepare(dem)


aisc_check.prepare = _aisc_prepare  # type: ignore[attr-defined]


def _aisc_candidate(D0, d: Demands, plan: _AiscPlan | None = None):
    """The member's aisc360 Demands ``D0`` with the segment moments and panel shears of candidate ``d``.

    Per segment and diagram the values of :func:`calckit.design.aisc360.cb.diagram_moments` (Mmax, MA,
    MB, MC and the largest sagging and hogging moments, same rules), vectorised over the diagrams; an
    item is left out when another diagram of the segment has larger or equal sagging and hogging
    moments and a smaller or equal Cb (Eq. F1-1; Mn does not decrease with Cb, so it cannot govern).
    Per panel: the largest |V| over the diagrams, as ``aisc360.demands``."""
    from ..design.aisc360.cb import F1_1, diagram_moments
    from ..design.aisc360.demands import PanelDemand, SegmentDemand

    if plan is not None:
        hit = plan.pre.get(id(d))
        if hit is not None and hit[0] is d and plan.D0 is D0:
            return replace(D0, flexure=hit[1], shear=hit[2])
    names, M, V, x = d.diagram_names, d.diagram_M, d.diagram_V, d.x
    segs = D0.segments
    K = len(names)
    if plan is not None:
        qa = plan.qA + (plan.f * d.w_self)[:, None, None] * plan.qU[None]
        lim = 1e-12 * np.max(np.abs(M), axis=1, initial=0.0)  # diagram_moments' round-off snap
        qa[np.abs(qa) <= lim[:, None, None]] = 0.0
        q = qa.tolist()
    fixed_cb = D0.Cb is not None or D0.bracing == "continuous"
    fl = []
    for i, sg in enumerate(segs):
        if plan is None:
            items = [diagram_moments(x, M[k], (sg,))[0] for k in range(K)]
        else:  # diagram_moments' rules on the candidate's arrays (small: plain floats are faster than numpy)
            i0, i1 = plan.ranges[i]
            inside = i1 > i0
            if inside:
                sub = M[:, i0:i1]
                jp, jn = sub.argmax(axis=1), sub.argmin(axis=1)
                r = np.arange(K)
                vp, vn = sub[r, jp].tolist(), sub[r, jn].tolist()
                xs_p, xs_n = x[i0 + jp].tolist(), x[i0 + jn].tolist()
            items = []
            for k in range(K):
                qa, qA_, qB_, qC_, qb = q[k][i]
                bp, xp = (qa, sg.a) if qa >= qb else (qb, sg.b)
                bn, xn = (qa, sg.a) if qa <= qb else (qb, sg.b)
                if inside:
                    if vp[k] > bp:
                        bp, xp = vp[k], xs_p[k]
                    if vn[k] < bn:
                        bn, xn = vn[k], xs_n[k]
                Mpos, Mneg = max(bp, 0.0), max(-bn, 0.0)
                items.append((max(Mpos, Mneg), abs(qA_), abs(qB_), abs(qC_), Mpos, xp, Mneg, xn))
        if fixed_cb or sg.free_end:
            cbs = [1.0] * K
        else:
            cbs = [F1_1.fast(M_max=it[0], M_A=it[1], M_B=it[2], M_C=it[3]) if it[0] > 0 else 1.0 for it in items]
        for k, it in enumerate(items):
            if any(j != k and items[j][4] >= it[4] and items[j][6] >= it[6] and cbs[j] <= cbs[k]
                   and (items[j][4] > it[4] or items[j][6] > it[6] or cbs[j] < cbs[k] or j < k)
                   for j in range(K)):
                continue
            fl.append(SegmentDemand(sg, names[k], *it))
    tol = 1e-9 * max(D0.x1 - D0.x0, 1.0)
    panels = []
    for ip, pd in enumerate(D0.shear):
        idx = plan.panels[ip] if plan is not None else np.nonzero((x >= pd.a0 - tol) & (x <= pd.a1 + tol))[0]
        if not idx.size:
            panels.append(pd)
            continue
        Va = np.abs(V[:, idx])
        k, j = np.unravel_index(int(np.argmax(Va)), Va.shape)
        panels.append(PanelDemand(pd.a0, pd.a1, pd.stiffened, pd.end_panel, float(Va[k, j]), float(x[idx[j]]),
                                  names[k]))
    return replace(D0, flexure=tuple(fl), shear=tuple(panels))


def _aisc_bearing(m: Member) -> tuple:
    """Bearing records at the supports (lb = the member's bearing length) and under the point loads that
    bear on a flange (``m.load_bearings``)."""
    from ..design.aisc360 import Bearing

    out = []
    if m.bearing is not None:
        for i, (x, s) in enumerate(zip(m.nodes, m.supports)):
            if not (isinstance(s, str) and s == "free"):
                out.append(Bearing(x=x, lb=m.bearing, name=f"support {i}"))
    for x, lb in m.load_bearings:
        if all(abs(x - n) > 1e-9 * m.L for n in m.nodes):
            out.append(Bearing(x=x, lb=lb, name=f"load at {x:.4g} m"))
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
               "bearing": (_aisc_bearing(m) if ((m.bearing is not None or m.load_bearings) and m.standard == AISC)
                           else ()),
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
