"""Load effects of every candidate section from one linear analysis (the search's fast path).

The beam response is linear in the loads, and for a prismatic beam on rigid supports the shear and
moment do not depend on EI while the deflection is proportional to 1/EI. So the member is analysed once
(:class:`calckit.analysis.Beam`, at a reference rigidity EI_ref) for its own load cases and a unit
self-weight case, and :func:`calckit.analysis.arrangements` gives the real diagram of every combination
and pattern arrangement of its variable cases. For a candidate of self-weight w (N/m) and rigidity EI,
in arrangement k with factor f_k on the permanent case:

    M_k(x) = M_k,loads(x) + f_k w M_unit(x)          (same for V and the reactions)
    delta_k(x) = (delta_k,loads(x) + f_k w delta_unit(x)) EI_ref / EI

The envelope of a combination is the maximum (minimum) over its arrangements at each station - exact,
as ``arrangements`` enumerates every on/off arrangement up to :data:`MAX_PER_COMBINATION` per
combination (beyond that its reduced set of common practice is used for the diagrams and the exact
envelope of :func:`calckit.analysis.envelope` for the extremes); the self-weight is permanent, never
patterned, so its term is common to a combination's arrangements. The diagrams themselves (not the
envelope) go to the checks that need a real moment diagram: Cb (AISC 360-22 F1-1) and C1 (EN 1993-1-1).
The values are taken at stations of :func:`calckit.analysis.envelope.stations_for` (every grid node on
both sides, about ``n_per_span`` intervals per span, the brace points and the exact extreme positions of
every arrangement at the self-weight ``w_ref``, so the peak moment is not missed between stations). With
spring supports the moments depend on EI; the search then re-analyses each candidate
(:func:`member_response` reports ``exact_scaling = False``).
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

import numpy as np

from ..errors import InputError
from .member import AISC, PERMANENT, SW_CASE, Member

__all__ = ["Response", "Demands", "DeflectionDemand", "member_response", "EI_REF"]

#: reference flexural rigidity of the analysis (N*m2); deflections are scaled by EI_REF / EI
EI_REF = 1.0e8
#: most arrangements of one combination that calckit.analysis.arrangements enumerates (all of them)
MAX_PER_COMBINATION = 256


@dataclass(frozen=True)
class DeflectionDemand:
    """Largest deflection of one span under one kind of serviceability combination (SI).

    kind: "live" (variable loads) or "total"; span: span index; value: largest |deflection| (m);
    x: where (m); limit: allowed deflection (m); divisor: n of span / n; length: the length the limit
    is based on (m; 2 x span for a cantilever); combination: governing combination name.
    """

    kind: str
    span: int
    value: float
    x: float
    limit: float
    divisor: float
    length: float
    combination: str

    @property
    def ratio(self) -> float:
        return self.value / self.limit if self.limit > 0 else float("inf")


@dataclass(frozen=True)
class Demands:
    """Strength load effects (envelope over the strength combinations) and deflections of one candidate.

    x: stations (m; every grid node twice: left then right limit); M_max, M_min: envelope moment (N*m,
    sagging positive); V_max, V_min: envelope shear (N); *_by: index into ``combinations`` of the
    governing combination at each station; R_max: largest upward reaction per support (N), R_by its
    combination; segments: unbraced segments (m, m), empty for continuous bracing; deflections: one
    :class:`DeflectionDemand` per span and kind; w_self: the self-weight included (N/m); EI (N*m2).
    """

    x: np.ndarray
    M_max: np.ndarray
    M_min: np.ndarray
    V_max: np.ndarray
    V_min: np.ndarray
    M_max_by: np.ndarray
    M_min_by: np.ndarray
    V_max_by: np.ndarray
    V_min_by: np.ndarray
    R_max: np.ndarray
    R_by: np.ndarray
    combinations: tuple[str, ...]
    segments: tuple[tuple[float, float], ...]
    deflections: tuple[DeflectionDemand, ...]
    w_self: float
    EI: float
    diagram_names: tuple[str, ...] = ()
    diagram_M: np.ndarray | None = None
    diagram_V: np.ndarray | None = None
    response: Any = field(default=None, repr=False, compare=False)  #: the Response it was derived from

    def diagrams(self) -> tuple[dict, dict]:
        """The moment and shear diagrams of every strength combination and pattern arrangement on ``x``:
        ({name: M}, {name: V}) (SI arrays; see :meth:`Response.arrangements`)."""
        M = dict(zip(self.diagram_names, self.diagram_M))
        V = dict(zip(self.diagram_names, self.diagram_V))
        return M, V

    @property
    def M_abs(self) -> np.ndarray:
        """max(|M_max|, |M_min|) at each station."""
        return np.maximum(np.abs(self.M_max), np.abs(self.M_min))

    @property
    def V_abs(self) -> np.ndarray:
        return np.maximum(np.abs(self.V_max), np.abs(self.V_min))

    def peak_moment(self) -> tuple[float, float, str]:
        """(|M| max, x, combination name)."""
        hi, lo = np.abs(self.M_max), np.abs(self.M_min)
        i, j = int(np.argmax(hi)), int(np.argmax(lo))
        if hi[i] >= lo[j]:
            return float(hi[i]), float(self.x[i]), self.combinations[int(self.M_max_by[i])]
        return float(lo[j]), float(self.x[j]), self.combinations[int(self.M_min_by[j])]

    def peak_shear(self) -> tuple[float, float, str]:
        """(|V| max, x, combination name)."""
        hi, lo = np.abs(self.V_max), np.abs(self.V_min)
        i, j = int(np.argmax(hi)), int(np.argmax(lo))
        if hi[i] >= lo[j]:
            return float(hi[i]), float(self.x[i]), self.combinations[int(self.V_max_by[i])]
        return float(lo[j]), float(self.x[j]), self.combinations[int(self.V_min_by[j])]


def _strength_combos(m: Member):
    from ..analysis.combinations import Combination, combinations

    cases = m.cases
    if m.combinations is not None:
        out = []
        for c in m.combinations:
            f = dict(c.factors)
            perm = [k for k in PERMANENT if k in f]
            if m.self_weight and perm:  # the self-weight takes the factor of the permanent case
                f[SW_CASE] = f[perm[0]]
            out.append(Combination(c.name, f, c.kind, c.reference, c.variable))
        return out
    mapping = {c: c for c in cases}
    if m.standard == AISC:
        if m.self_weight:
            mapping[SW_CASE] = "D"
        kind = "strength" if m.method == "LRFD" else "allowable"
        return combinations("ASCE 7-22", mapping, kind)
    if m.self_weight:
        mapping[SW_CASE] = "G"
    return combinations("EN 1990", mapping, "strength", **_en_options(m, cases))


def _en_options(m: Member, cases) -> dict:
    opts: dict = {"annex": "recommended"}
    if any(c in ("Q", "L") for c in cases):
        opts["category"] = m.live_category
    if "S" in cases:
        opts["snow"] = m.snow
    return opts


def _deflection_combos(m: Member):
    """(live combinations, total combinations): service loads at factor 1.0.

    AISC: the 'deflection' set of calckit's ASCE 7-22 table (common practice: live only and roof loads
    vs the live limit, dead plus live vs the total limit). EN: EN 1990 6.14b characteristic combinations
    vs the total limit and their variable part vs the variable limit (EN 1990 A1.4.3, from memory).
    Without variable loads, the permanent loads (with the self-weight) are checked against the total limit.
    """
    from ..analysis.combinations import Combination, combinations

    cases = m.cases
    mapping = {c: c for c in cases}
    variable = [c for c in cases if c not in PERMANENT]
    perm = [c for c in cases if c in PERMANENT] + ([SW_CASE] if m.self_weight else [])
    live, total = [], []
    if m.standard == AISC:
        if m.self_weight:
            mapping[SW_CASE] = "D"
        if variable:
            for c in combinations("ASCE 7-22", mapping, "deflection"):
                has_perm = any(k in PERMANENT or k == SW_CASE for k in c.factors)
                has_var = any(k not in PERMANENT and k != SW_CASE for k in c.factors)
                if has_var and not has_perm:
                    live.append(c)
                elif has_var:
                    total.append(c)
    elif variable:
        if m.self_weight:
            mapping[SW_CASE] = "G"
        for c in combinations("EN 1990", mapping, "characteristic", **_en_options(m, cases)):
            total.append(c)
            vf = {k: f for k, f in c.factors.items() if k in variable}
            if vf:
                live.append(Combination(c.name.replace("SLS characteristic", "SLS variable part of"), vf,
                                        "user", c.reference + "; permanent actions left out", c.variable))
    if not total and perm:
        total.append(Combination("Deflection total: permanent loads", dict.fromkeys(perm, 1.0), "user",
                                 "common practice (service loads at 1.0)"))
    if not variable:
        live = []
    return live, total


class Response:
    """The member's strength and serviceability responses per load arrangement, and the unit self-weight
    response (module docstring), on the stations ``x``.

    Built on the public analysis API: :class:`calckit.analysis.Beam` (the member's loads and a self-weight
    case of ``w_ref`` N/m) and :func:`calckit.analysis.arrangements` (the real diagram of every
    combination and pattern arrangement). Attributes: ``x`` stations, ``span_of_station``; ``A`` the
    strength arrangements that can govern (:func:`_undominated`): {"names", "M", "V" (A, S) and "R"
    (A, P) of the other loads, "f" (A,) the self-weight factor}; ``S`` per strength combination
    {q: (max (C, S), min (C, S), unit (S,))} for q in M, V, R, with "f" and "names"; ``DL``, ``DT`` the
    same for the deflection of the live and total serviceability combinations (None without them).
    """

    def __init__(self, m: Member, *, n_per_span: int = 40, w_ref: float = 500.0, EI: float = EI_REF):
        from ..analysis import Beam, arrangements
        from ..analysis.envelope import stations_for
        from ..units import Q_

        self.member = m
        self.EI_ref = float(EI)
        supports = [s if isinstance(s, str) else Q_(float(s), "N/m") for s in m.supports]
        self.exact_scaling = all(isinstance(s, str) for s in m.supports)
        beam = Beam([Q_(s, "m") for s in m.spans], supports, EI=Q_(self.EI_ref, "N*m**2"))
        for ld in m.loads:
            _add_load(beam, ld, Q_)
        self.w_ref = float(w_ref) if m.self_weight else 0.0
        if m.self_weight:
            beam.udl(Q_(1.0, "N/m"), SW_CASE)
        sol = beam.solve()
        self.beam, self.solution, self.grid = beam, sol, sol.grid
        self.cases = sol.cases
        self.strength = _strength_combos(m)
        self.live, self.total = _deflection_combos(m)
        groups = {"S": self.strength, "DL": self.live, "DT": self.total}
        arr = {g: (arrangements(sol, self._at_w_ref(cs), max_per_combination=MAX_PER_COMBINATION)
                   if cs else {}) for g, cs in groups.items()}
        self._n_per_span = n_per_span
        # stations: grid nodes both sides, n_per_span, brace points and the exact extremes of every
        # arrangement (at the self-weight w_ref) in every span
        extra = list(m.brace_positions())
        for g, coef in (("S", "Mc"), ("DL", "deltac"), ("DT", "deltac")):
            extra += self._extreme_positions(arr[g], groups[g], coef)
        self._extra = extra
        seg, t = stations_for(self.grid, n_per_span, extra)
        self._seg, self._t = seg, t
        self.x = self.grid.x[seg] + t
        self.span_of_station = self.grid.span[seg]
        unit = [sol[SW_CASE]] if m.self_weight else []
        self.unit = {q: (self._values(unit, q)[0] if unit else np.zeros(self.x.size)) for q in ("M", "V", "defl")}
        self.unit["R"] = np.asarray(unit[0].R, float) if unit else np.zeros(len(m.supports))
        rows = {g: self._rows(arr[g], groups[g], ("M", "V", "R") if g == "S" else ("defl",)) for g in groups}
        self.S = self._per_combo(self.strength, rows["S"], ("M", "V", "R"))
        st = rows["S"]
        keep = _undominated(st["M"], st["V"], st["f"]) if st["names"] else []
        self.A = {"names": tuple(st["names"][i] for i in keep), "M": st["M"][keep], "V": st["V"][keep],
                  "R": st["R"][keep], "f": st["f"][keep]}
        self.DL = self._per_combo(self.live, rows["DL"], ("defl",)) if self.live else None
        self.DT = self._per_combo(self.total, rows["DT"], ("defl",)) if self.total else None
        self.segments = m.segments()
        self._design: dict = {}

    # -- precomputation ------------------------------------------------------------------------------
    def _at_w_ref(self, combos):
        """The combinations with the self-weight case at w_ref N/m (the SW case is 1 N/m)."""
        from ..analysis.combinations import Combination

        if not self.member.self_weight:
            return list(combos)
        out = []
        for c in combos:
            f = dict(c.factors)
            if SW_CASE in f:
                f[SW_CASE] = f[SW_CASE] * self.w_ref
            out.append(Combination(c.name, f, c.kind, c.reference, c.variable))
        return out

    def _extreme_positions(self, arr: dict, combos, coef: str) -> list[float]:
        """Exact positions of the extremes in each span of each combination's arrangement with every
        variable load on (:func:`calckit.analysis.piecewise.extrema` of its coefficients)."""
        from ..analysis.piecewise import extrema

        g = self.grid
        names = {c.name for c in combos}
        out = []
        for label, r in arr.items():
            if label not in names:
                continue
            for sp in range(len(self.member.spans)):
                segs = np.nonzero(g.span == sp)[0]
                hi, lo = extrema(g.x, getattr(r, coef), segs, g.span)
                out += [hi.x, lo.x]
        return out

    def _values(self, results, q: str) -> np.ndarray:
        """Values (R, S) of BeamResults at the stations, from their piecewise-polynomial coefficients
        (each station belongs to one segment: a node's left and right limits are two stations)."""
        c = np.stack([getattr(r, _COEF[q]) for r in results])[:, self._seg, :]  # (R, S, n)
        out = c[..., -1]
        for p in range(c.shape[-1] - 2, -1, -1):
            out = out * self._t + c[..., p]
        return out

    def _rows(self, arr: dict, combos, quantities) -> dict:
        """Per arrangement: the other loads' values (the self-weight part taken out) and the self-weight
        factor, with the combination each belongs to."""
        labels, res = list(arr), list(arr.values())
        f = np.array([float(r.factors.get(SW_CASE, 0.0)) / self.w_ref if self.w_ref else 0.0 for r in res])
        out = {"names": labels, "f": f, "comb": [_combination_of(lb, combos) for lb in labels]}
        for q in quantities:
            if not res:
                out[q] = np.zeros((0, len(self.member.supports) if q == "R" else self.x.size))
                continue
            v = np.array([np.asarray(r.R, float) for r in res]) if q == "R" else self._values(res, q)
            out[q] = v - (f * self.w_ref)[:, None] * self.unit[q][None, :]
        return out

    def _per_combo(self, combos, rows: dict, quantities) -> dict:
        """{q: (max (C, S), min (C, S), unit (S,))} over each combination's arrangements, "f", "names".

        Exact: the self-weight is not patterned, so its term f_c w U is common to a combination's
        arrangements. A combination whose arrangements were a reduced set (more than
        MAX_PER_COMBINATION) takes its extremes from the exact envelope instead."""
        C = len(combos)
        out = {"f": np.zeros(C), "names": tuple(c.name for c in combos)}
        comb = rows["comb"]
        for q in quantities:
            W = rows[q].shape[1]
            hi, lo = np.full((C, W), -np.inf), np.full((C, W), np.inf)
            for ci, c in enumerate(combos):
                idx = [i for i, nm in enumerate(comb) if nm == c.name]
                if idx:
                    hi[ci], lo[ci] = rows[q][idx].max(axis=0), rows[q][idx].min(axis=0)
                    out["f"][ci] = rows["f"][idx[0]]
                else:  # nothing loaded in this combination
                    hi[ci] = lo[ci] = 0.0
            out[q] = (hi, lo, self.unit[q])
        for ci, c in enumerate(combos):
            if not _exhaustive(c, self.cases, len(self.member.spans)):
                self._exact_envelope(ci, c, out, quantities)
        return out

    def _exact_envelope(self, ci: int, c, out: dict, quantities) -> None:
        """Replace combination ci's extremes by the exact envelope (public calckit.analysis.envelope) of its
        other loads (the self-weight term is added per candidate as for the others)."""
        from ..analysis.combinations import Combination
        from ..analysis.envelope import envelope

        f = {k: v for k, v in c.factors.items() if k != SW_CASE}
        env = envelope(self.solution, [Combination(c.name, f, c.kind, c.reference, c.variable)],
                       stations=self._extra, n_per_span=self._n_per_span)
        same = env.x.shape == self.x.shape and np.allclose(env.x, self.x, rtol=0, atol=1e-9 * self.member.L)
        for q in quantities:
            hi, lo, _ = out[q]
            if q == "R":
                hi[ci], lo[ci] = env.R_max, env.R_min
                continue
            a_hi, a_lo = (env.M_max, env.M_min) if q == "M" else (env.V_max, env.V_min) if q == "V" else \
                (env.defl_max, env.defl_min)
            if not same:  # pragma: no cover - the same station rule gives the same stations
                a_hi, a_lo = np.interp(self.x, env.x, a_hi), np.interp(self.x, env.x, a_lo)
            hi[ci] = np.maximum(hi[ci], a_hi)
            lo[ci] = np.minimum(lo[ci], a_lo)
        out["f"][ci] = float(c.factors.get(SW_CASE, 0.0)) if self.member.self_weight else 0.0

    def aisc_demands(self, supports, bracing, stiffeners=None, plan=None):
        """The member's :func:`calckit.design.aisc360.demands` on the loads-only diagrams (its segments,
        panels and notes are those of every candidate; the moments are replaced per candidate); with
        ``plan`` (a class taking (demands, response)) the pair (demands, plan), both kept."""
        key = ("AISC", None if stiffeners is None else tuple(np.atleast_1d(stiffeners).tolist())
               if not isinstance(stiffeners, str) else stiffeners)
        D = self._design.get(key)
        if D is None:
            from ..design import aisc360

            A = self.A
            names = A["names"]
            if len(self._design) > 32:  # a girder search meets many stiffener layouts
                self._design = {k: v for k, v in self._design.items() if not (isinstance(k, tuple) and k[0] == "AISC")}
            D = self._design[key] = aisc360.demands(x=self.x, M=dict(zip(names, A["M"])), V=dict(zip(names, A["V"])),
                                                    supports=supports, bracing=bracing, stiffeners=stiffeners)
        if plan is None:
            return D
        pk = key + ("plan",)
        P = self._design.get(pk)
        if P is None:
            P = self._design[pk] = plan(D, self)
        return D, P

    def design_demands(self, standard: str):
        """The design module's member-level demands, prepared once per response and shared by every
        candidate: for EN 1993-1-1 :func:`calckit.design.en1993.demands` of the strength arrangements with
        the self-weight term (``Demands.with_self_weight(w)`` per candidate)."""
        D = self._design.get(standard)
        if D is None:
            from ..design import en1993

            m = self.member
            A = self.A
            names = A["names"]
            restraints = "continuous" if m.bracing == "continuous" else list(m.brace_positions())
            D = self._design[standard] = en1993.demands(
                x=self.x, M=dict(zip(names, A["M"])), V=dict(zip(names, A["V"])), restraints=restraints,
                self_weight=(self.unit["M"], self.unit["V"], A["f"]))
        return D

    # -- per candidate ---------------------------------------------------------------------------------
    def demands(self, w_self: np.ndarray, EI: np.ndarray) -> list[Demands]:
        """Demands for candidates of self-weight ``w_self`` (N/m) and rigidity ``EI`` (N*m2), arrays (N,)."""
        w = np.asarray(w_self, float) if self.member.self_weight else np.zeros(len(w_self))
        EI = np.asarray(EI, float)
        S = self.S
        f = S["f"]
        fw = f[None, :, None] * w[:, None, None]  # (N, C, 1)
        env = {}
        for q in ("M", "V"):
            hi, lo, u = S[q]
            H = hi[None] + fw * u[None, None, :]
            Lo = lo[None] + fw * u[None, None, :]
            env[q] = (H.max(axis=1), Lo.min(axis=1), H.argmax(axis=1), Lo.argmin(axis=1))
        A = self.A
        faw = A["f"][None, :, None] * w[:, None, None]  # (N, A, 1)
        DM = A["M"][None] + faw * S["M"][2][None, None, :]
        DV = A["V"][None] + faw * S["V"][2][None, None, :]
        hi, lo, u = S["R"]
        RH = hi[None] + fw * u[None, None, :]
        R_max, R_by = RH.max(axis=1), RH.argmax(axis=1)
        defl = [self._deflections(w, EI, D, kind, div)
                for D, kind, div in ((self.DL, "live", self.member.defl_live),
                                     (self.DT, "total", self.member.defl_total)) if D is not None and div]
        out = []
        for i in range(len(w)):
            dd = tuple(d for kind in defl for d in kind[i])
            out.append(Demands(
                x=self.x, M_max=env["M"][0][i], M_min=env["M"][1][i], V_max=env["V"][0][i],
                V_min=env["V"][1][i], M_max_by=env["M"][2][i], M_min_by=env["M"][3][i],
                V_max_by=env["V"][2][i], V_min_by=env["V"][3][i], R_max=R_max[i], R_by=R_by[i],
                combinations=S["names"], segments=self.segments, deflections=dd, w_self=float(w[i]),
                EI=float(EI[i]), diagram_names=A["names"], diagram_M=DM[i], diagram_V=DV[i], response=self))
        return out

    def _deflections(self, w, EI, D, kind: str, divisor: float):
        hi, lo, u = D["defl"]
        fw = D["f"][None, :, None] * w[:, None, None]
        scale = (self.EI_ref / EI)[:, None, None]
        A = np.maximum(np.abs((hi[None] + fw * u) * scale), np.abs((lo[None] + fw * u) * scale))  # (N, C, S)
        m = self.member
        res = [[] for _ in range(len(w))]
        for sp, Ls in enumerate(m.spans):
            idx = np.nonzero(self.span_of_station == sp)[0]
            sub = A[:, :, idx].reshape(len(w), -1)
            j = sub.argmax(axis=1)
            c, s = np.unravel_index(j, (A.shape[1], len(idx)))
            length = 2 * Ls if m.span_is_cantilever(sp) else Ls
            lim = length / divisor
            for i in range(len(w)):
                res[i].append(DeflectionDemand(kind, sp, float(sub[i, j[i]]), float(self.x[idx[s[i]]]), lim,
                                               divisor, length, D["names"][int(c[i])]))
        return res


def _undominated(M: np.ndarray, V: np.ndarray, f: np.ndarray, rel: float = 1e-9) -> list[int]:
    """Indices of the arrangements that are not a smaller positive multiple of another one.

    An arrangement whose moment and shear diagrams and self-weight factor are c times another's, with
    0 < c <= 1, has the same shape (so the same Cb or C1) and smaller demands for every candidate: it can
    never govern a check, and is left out (exact duplicates keep their first copy). Proportionality is
    tested on the whole vector (M, V, f): residual of the projection <= 1e-6 of its norm (rows the same
    shape to rounding; the residual is found by a difference, exact to about 1e-8 of the norm).
    """
    n = len(f)
    if n == 0:
        return []
    vec = np.hstack([M, V, f[:, None] * np.max(np.abs(M), initial=1.0)])
    G = vec @ vec.T
    norms = np.diag(G).copy()
    safe = np.where(norms > 0, norms, 1.0)
    c = G / safe[None, :]  # c[i, j]: projection coefficient of row i on row j
    resid = norms[:, None] - G * c  # |v_i - c v_j|^2
    prop = (resid <= 1e-12 * norms[:, None]) & (norms[None, :] > 0) & (c > 0) & (c <= 1 + rel)
    np.fill_diagonal(prop, False)
    drop = set(int(i) for i in np.nonzero(norms == 0)[0])
    for i in range(n):
        if i in drop:
            continue
        for j in np.nonzero(prop[i])[0]:
            j = int(j)
            if j in drop:
                continue
            if c[i, j] < 1 - rel or j < i:
                drop.add(i)
                break
    return [i for i in range(n) if i not in drop]


_COEF = {"M": "Mc", "V": "Vc", "defl": "deltac"}


def _add_load(beam, ld, Q_) -> None:
    """Add a load record of :mod:`calckit.analysis.loads` to a Beam through its public methods."""
    from ..analysis.loads import Couple, LinearLoad, PointLoad

    if isinstance(ld, PointLoad):
        beam.point(Q_(ld.P, "N"), Q_(ld.x, "m"), ld.case)
    elif isinstance(ld, Couple):
        beam.moment(Q_(ld.M, "N*m"), Q_(ld.x, "m"), ld.case)
    elif isinstance(ld, LinearLoad):
        a, b = Q_(ld.start, "m"), Q_(ld.end, "m")
        if ld.w1 == ld.w2:
            beam.udl(Q_(ld.w1, "N/m"), ld.case, a, b)
        else:
            beam.linear(Q_(ld.w1, "N/m"), Q_(ld.w2, "N/m"), a, b, ld.case)
    else:  # pragma: no cover - Member only holds these records
        raise InputError(f"loads: got {ld!r}; expected PointLoad, Couple or LinearLoad records")


def _combination_of(label: str, combos) -> str:
    """The combination an arrangement label of :func:`calckit.analysis.arrangements` belongs to."""
    best = ""
    for c in combos:
        if (label == c.name or label.startswith(c.name + " [")) and len(c.name) > len(best):
            best = c.name
    return best


def _exhaustive(c, cases, n_spans: int) -> bool:
    """True when :func:`calckit.analysis.arrangements` enumerates every arrangement of combination c
    (its documented rule: at most MAX_PER_COMBINATION; the cases patterned are ``c.pattern`` or
    ``c.variable`` with a non-zero factor)."""
    if n_spans == 1:
        return True
    p = getattr(c, "pattern", None)
    if p is None:
        p = getattr(c, "variable", None) or ()
    p = {p} if isinstance(p, str) else set(p)
    k = sum(1 for case, f in c.factors.items() if case in p and case in cases and float(f) != 0.0)
    return (2 ** n_spans) ** k <= MAX_PER_COMBINATION


def member_response(m: Member, **kw) -> Response:
    """The precomputed :class:`Response` of member ``m`` (raises InputError / UnstableError)."""
    if not isinstance(m, Member):
        raise InputError(f"member: got {m!r}; expected a calckit.pick.Member")
    return Response(m, **kw)
