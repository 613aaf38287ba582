"""Load effects of every candidate section from two linear analyses (the search's fast path).

The beam response is linear in the loads, and for a prismatic beam on rigid supports the shear and
moment do not depend on EI while the deflection is proportional to 1/EI. So the member is analysed once,
at a reference rigidity EI_ref, for its own load cases (each split per span for pattern loading) and
for a unit self-weight case (1 N/m over the whole member). For a candidate of self-weight w (N/m) and
rigidity EI, in combination c with factor f_c on the permanent case:

    M_c(x) = M_c,loads(x) + f_c w M_unit(x)          (same for V and the reactions)
    delta_c(x) = (delta_c,loads(x) + f_c w delta_unit(x)) EI_ref / EI

Pattern loading is that of :mod:`calckit.analysis.envelope` (the self-weight is permanent, so never
patterned, and adds linearly to each combination's pattern extremes). The values are taken at the
envelope's stations (every grid node on both sides, about ``n_per_span`` intervals per span, the brace
points and the exact extreme positions of each combination, so the peak moment is not missed between
stations). With spring supports the moments depend on EI; the search then re-analyses each candidate
(:func:`member_response` reports ``exact_scaling = False``).
"""
from __future__ import annotations

import itertools
from dataclasses import dataclass

import numpy as np

from ..errors import InputError
from .member import AISC, PERMANENT, SW_CASE, Member

__all__ = ["Response", "Demands", "DeflectionDemand", "member_response", "EI_REF"]

#: reference flexural rigidity of the analysis (N*m2); deflections are scaled by EI_REF / EI
EI_REF = 1.0e8
#: most variable parts (variable cases x spans) of one combination whose arrangements are all enumerated
MAX_ENUMERATED = 4


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
    """Per-combination pattern extremes of the member's loads and the unit self-weight response."""

    def __init__(self, m: Member, *, n_per_span: int = 40, w_ref: float = 500.0, EI: float = EI_REF):
        from ..analysis.envelope import stations_for
        from ..analysis.loads import LinearLoad, Support, parse_support
        from ..analysis.solver import Layout, check_stability, make_grid, solve_batch, split_by_span

        self.member = m
        nodes = m.nodes
        sup = tuple(parse_support(s, i, nodes[i]) if isinstance(s, str) else Support(i, nodes[i], "spring", float(s))
                    for i, s in enumerate(m.supports))
        self.exact_scaling = not any(s.kind == "spring" for s in sup)
        n = len(m.spans)
        self.EI_ref = float(EI)
        layout = Layout(tuple(nodes), (self.EI_ref,) * n, sup, ())
        check_stability(layout)
        loads = list(m.loads)
        sw = LinearLoad(1.0, 1.0, 0.0, m.L, SW_CASE, "self_weight")
        cases = m.cases + ([SW_CASE] if m.self_weight else [])
        if m.self_weight:
            loads.append(sw)
        pos = []
        for ld in loads:
            pos += [ld.start, ld.end] if isinstance(ld, LinearLoad) else [ld.x]
        grid = make_grid(layout, pos)
        sets = []
        for case in cases:
            sets.extend(split_by_span(layout, [ld for ld in loads if ld.case == case]))
        batch = solve_batch(layout, grid, sets)
        self.layout, self.grid, self.batch, self.cases = layout, grid, batch, cases
        self.strength = _strength_combos(m)
        self.live, self.total = _deflection_combos(m)
        # stations: grid nodes both sides, n_per_span, brace points and exact extreme positions
        extra = list(m.brace_positions())
        extra += self._extreme_positions(self.strength, w_ref, batch.M)
        extra += self._extreme_positions(self.live + self.total, w_ref, batch.delta)
        seg, t = stations_for(grid, n_per_span, extra)
        self.x = grid.x[seg] + t
        self.span_of_station = grid.span[seg]
        horner = _horner_fn()
        self._Q = {"V": horner(batch.V, seg, t), "M": horner(batch.M, seg, t),
                   "defl": horner(batch.delta, seg, t), "R": batch.R}
        self.sw_cols = slice(cases.index(SW_CASE) * n, (cases.index(SW_CASE) + 1) * n) if m.self_weight else None
        self.S = self._per_combo(self.strength, ("M", "V", "R"))
        self.A = self.arrangements(self.strength)
        self.DL = self._per_combo(self.live, ("defl",)) if self.live else None
        self.DT = self._per_combo(self.total, ("defl",)) if self.total else None
        self.segments = m.segments()

    # -- precomputation ------------------------------------------------------------------------------
    def _extreme_positions(self, combos, w_ref: float, coefs) -> list[float]:
        """Exact positions of the extremes in each span of each combination (all variable loads on)."""
        from ..analysis.piecewise import extrema

        n = len(self.member.spans)
        out = []
        for c in combos:
            w = np.zeros(len(self.cases) * n)
            for k, f in c.factors.items():
                if k in self.cases:
                    i = self.cases.index(k)
                    w[i * n:(i + 1) * n] = f * (w_ref if k == SW_CASE else 1.0)
            coef = np.tensordot(w, coefs, axes=1)
            for sp in range(n):
                segs = np.nonzero(self.grid.span == sp)[0]
                hi, lo = extrema(self.grid.x, coef, segs, self.grid.span)
                out += [hi.x, lo.x]
        return out

    def _per_combo(self, combos, quantities):
        """{q: (hi_loads (C, S), lo_loads (C, S), unit (S,))} and the self-weight factor per combination."""
        wb, wp = _weights_fn()(combos, self.cases, len(self.member.spans))
        f_sw = np.zeros(len(combos))
        if self.sw_cols is not None:
            f_sw = wb[:, self.sw_cols][:, 0].copy()
            wb = wb.copy()
            wb[:, self.sw_cols] = 0.0
        out = {"f": f_sw, "names": tuple(c.name for c in combos)}
        n = len(self.member.spans)
        for q in quantities:
            Q = self._Q[q]
            hi, lo = _pattern(Q, wb, wp, len(self.cases), n)
            unit = Q[self.sw_cols].sum(axis=0) if self.sw_cols is not None else np.zeros(Q.shape[1])
            out[q] = (hi, lo, unit)
        return out

    def arrangements(self, combos) -> dict:
        """Genuine load arrangements of each combination, for Cb / C1 (which need a real diagram).

        Each variable case of a combination is split per span (pattern loading). With at most
        :data:`MAX_ENUMERATED` variable parts, every on/off arrangement is a diagram (exact); with more,
        the arrangements are: all on, all off, alternate spans on (each parity), and the combination's
        per-station pattern maximum and minimum curves (an approximation for the shape, conservative for
        the peak). Returns {"names", "M" (A, S), "V" (A, S), "f" (A,)}: the loads' part and the
        self-weight factor of each arrangement (duplicates removed).
        """
        wb, wp = _weights_fn()(combos, self.cases, len(self.member.spans))
        n = len(self.member.spans)
        names, weights, f_sw, curves = [], [], [], []
        seen = set()
        for ci, c in enumerate(combos):
            base = wb[ci].copy()
            f = 0.0
            if self.sw_cols is not None:
                f = float(base[self.sw_cols][0])
                base[self.sw_cols] = 0.0
            cols = np.nonzero(wp[ci])[0]
            if cols.size <= MAX_ENUMERATED:
                masks = list(itertools.product((1, 0), repeat=int(cols.size)))
            else:
                spans_of = cols % n
                masks = [tuple([1] * cols.size), tuple([0] * cols.size),
                         tuple(int(sp % 2 == 0) for sp in spans_of), tuple(int(sp % 2 == 1) for sp in spans_of)]
                curves.append((ci, c.name, f))
            for mask in masks:
                w = base.copy()
                w[cols] += wp[ci][cols] * np.asarray(mask, float)
                key = (tuple(np.round(w, 12)), round(f, 12))
                if key in seen:
                    continue
                seen.add(key)
                names.append(c.name + self._label(cols, mask, n))
                weights.append(w)
                f_sw.append(f)
        W = np.array(weights)
        Mw, Vw, fw = W @ self._Q["M"], W @ self._Q["V"], np.array(f_sw)
        keep = _undominated(Mw, Vw, fw)
        out = {"names": [names[i] for i in keep], "M": Mw[keep], "V": Vw[keep], "f": fw[keep]}
        if curves:  # per-station pattern curves of the combinations with many variable parts
            for q in ("M", "V"):
                hi, lo, _ = self.S[q]
                extra = [arr[ci] for ci, _, _ in curves for arr in (hi, lo)]
                out[q] = np.vstack([out[q], *extra])
            for ci, name, f in curves:
                out["names"] += [f"{name} (pattern maximum at each station)",
                                 f"{name} (pattern minimum at each station)"]
                out["f"] = np.concatenate([out["f"], [f, f]])
        out["names"] = tuple(out["names"])
        return out

    def _label(self, cols, mask, n: int) -> str:
        """' (L off)', ' (L on span 1)' ... for an arrangement; '' when every variable part is on."""
        if all(mask):
            return ""
        parts = {}
        for col, on in zip(cols, mask):
            case = self.cases[int(col) // n]
            parts.setdefault(case, []).append((int(col) % n + 1, on))
        words = []
        for case, items in parts.items():
            on = [sp for sp, o in items if o]
            if not on:
                words.append(f"{case} off")
            elif len(on) < len(items):
                words.append(f"{case} on span{'s' if len(on) > 1 else ''} {', '.join(map(str, on))}")
        return f" ({'; '.join(words)})" if words else ""

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
                EI=float(EI[i]), diagram_names=A["names"], diagram_M=DM[i], diagram_V=DV[i]))
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
    never govern a check, and is left out (exact duplicates keep their first copy).
    """
    n = len(f)
    drop = set()
    vec = np.hstack([M, V, f[:, None] * np.max(np.abs(M), initial=1.0)])
    norms = np.einsum("ij,ij->i", vec, vec)
    for i in range(n):
        if norms[i] == 0:
            drop.add(i)
            continue
        for j in range(n):
            if i == j or j in drop or norms[j] == 0:
                continue
            c = float(vec[i] @ vec[j]) / norms[j]
            if 0 < c <= 1 + rel and np.allclose(vec[i], c * vec[j], rtol=0, atol=rel * np.sqrt(norms[j])):
                if c < 1 - rel or j < i:
                    drop.add(i)
                    break
    return [i for i in range(n) if i not in drop]


def _horner_fn():
    try:
        from ..analysis.envelope import _horner  # same evaluation as the envelope
        return _horner
    except ImportError:  # pragma: no cover - fallback if the analysis module renames it
        def horner(c, seg, t):
            ck = c[:, seg, :]
            out = ck[..., -1]
            for p in range(c.shape[-1] - 2, -1, -1):
                out = out * t + ck[..., p]
            return out
        return horner


def _weights_fn():
    from ..analysis.envelope import _weights

    def weights(combos, cases, n_spans):
        wb, wp, _, _ = _weights(combos, cases, n_spans, True, "zero")
        return wb, wp
    return weights


def _pattern(Q, wb, wp, n_cases, n_spans):
    from ..analysis.envelope import _pattern_extremes

    return _pattern_extremes(Q, wb, wp, "sum", n_cases, n_spans)


def member_response(m: Member, **kw) -> Response:
    """The precomputed :class:`Response` of member ``m`` (raises InputError / UnstableError)."""
    if not isinstance(m, Member):
        raise InputError(f"member: got {m!r}; expected a calckit.pick.Member")
    return Response(m, **kw)
