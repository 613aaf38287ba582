"""Exact solution of a straight Euler-Bernoulli beam by element-wise integration of the equilibrium
equations (transfer-matrix method with exact load terms; e.g. E. C. Pestel and F. A. Leckie,
*Matrix Methods in Elastomechanics*, 1963, and any text on deflections by integration such as Gere,
*Mechanics of Materials*, 7th ed., ch. 9).

* The beam is cut into *elements* at the supports (span ends) and hinges, and each element into
  *segments* at the point loads, couples and ends of distributed loads. Inside a segment the load
  intensity is linear, so (``t`` measured from the segment start) V is quadratic, M cubic, slope
  quartic and deflection quintic:

      dV/dx = -w,   dM/dx = V,   d(delta)/dx = phi,   d(phi)/dx = -M / EI

  (w and delta downward positive, M sagging positive, V = sum of upward forces left of the section).
* Unknowns: the state (V, M, phi, delta) at the start of every element, the vertical reaction at
  every supported node and the moment reaction at every fixed node. Each element is integrated
  exactly from its own start, once per unit start value and once per load set (vectorised with
  grouped cumulative sums over a batch of sources), which gives its end state as an exact linear
  function of the start state.
* Conditions: equilibrium at the ends (V = R + F, M = C + C_R at x = 0; V + R + F = 0 and
  M + C + C_R = 0 just right of x = L); at every inner node continuity of delta and phi (M = 0 on the
  left of a hinge instead of phi), and jumps of M and V by the couples and forces there (reactions
  included); delta = 0 at pins, rollers and fixed supports, delta = R / k at springs, phi = 0 at fixed
  supports. The square, block-banded system is solved once for all load sets. Because every element
  is integrated only over its own length, the system stays well conditioned for many spans and for
  very unequal spans (unlike integrating the whole beam from one end).

Stability is decided beforehand from the geometry alone (:func:`check_stability`): the beam is a
mechanism when a rigid-body motion, straight between hinges, satisfies every support condition.

The results are the exact piecewise polynomials (to rounding); nothing is discretised. Reactions
below :data:`~calckit.analysis.piecewise.ZERO_REL` of the load set's total load are returned as 0.0
(round-off of the solve); values along the beam are snapped the same way where they are evaluated
(:mod:`calckit.analysis.piecewise`).
"""
from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from ..errors import UnstableError
from .loads import Couple, LinearLoad, PointLoad, Support
from .piecewise import load_scale, roundoff_scale, snap_zero

__all__ = ["Layout", "Grid", "Batch", "make_grid", "solve_batch", "check_stability", "split_by_span"]

#: Two positions closer than this fraction of the beam length are the same node.
SNAP_REL = 1e-9
#: Rank tolerance of the (dimensionless) kinematic matrix in :func:`check_stability`.
RANK_REL = 1e-9


@dataclass(frozen=True)
class Layout:
    """Beam geometry in SI floats.

    nodes: support positions x_0 = 0 < x_1 < ... < x_n = L (m); EI: flexural rigidity per span (N*m2);
    supports: one :class:`Support` per node; hinges: internal hinge positions (m), sorted.
    """

    nodes: tuple[float, ...]
    EI: tuple[float, ...]
    supports: tuple[Support, ...]
    hinges: tuple[float, ...] = ()

    @property
    def L(self) -> float:
        return self.nodes[-1]

    @property
    def n_spans(self) -> int:
        return len(self.nodes) - 1


@dataclass(frozen=True, eq=False)
class Grid:
    """Nodes of the piecewise solution and what sits at each.

    x: node positions (K+1,); h: segment lengths (K,); inv_EI: 1/EI per segment (K,); span: span index
    per segment (K,); support_node: grid node of each support; hinge_node: grid node of each hinge;
    elem: element index per segment (K,); elem_start: first segment of each element (E,);
    elem_end: last segment of each element (E,); struct_node: grid node of each element boundary (E+1,).
    """

    x: np.ndarray
    h: np.ndarray
    inv_EI: np.ndarray
    span: np.ndarray
    support_node: tuple[int, ...]
    hinge_node: tuple[int, ...]
    elem: np.ndarray = field(default=None)
    elem_start: np.ndarray = field(default=None)
    elem_end: np.ndarray = field(default=None)
    struct_node: np.ndarray = field(default=None)

    def node(self, pos: float) -> int:
        """Index of the grid node at ``pos`` (which must be a node, within the snap tolerance)."""
        i = int(np.searchsorted(self.x, pos))
        tol = SNAP_REL * self.x[-1] * 4
        if i < len(self.x) and abs(self.x[i] - pos) <= tol:
            return i
        if i > 0 and abs(self.x[i - 1] - pos) <= tol:
            return i - 1
        raise AssertionError(f"position {pos} is not a grid node")  # internal: grid built from all positions


def _snap_unique(pos: np.ndarray, L: float) -> np.ndarray:
    pos = np.sort(pos)
    keep = np.concatenate(([True], np.diff(pos) > SNAP_REL * L))
    return pos[keep]


def make_grid(layout: Layout, positions=()) -> Grid:
    """Grid through the span ends, hinges and the given load positions (m)."""
    L = layout.L
    pts = np.concatenate((np.asarray(layout.nodes, float), np.asarray(layout.hinges, float),
                          np.asarray(list(positions), float)))
    x = _snap_unique(np.clip(pts, 0.0, L), L)
    for xn in (*layout.nodes, *layout.hinges):  # supports and hinges keep their exact positions
        x[int(np.argmin(np.abs(x - xn)))] = xn
    h = np.diff(x)
    mid = 0.5 * (x[:-1] + x[1:])
    span = np.clip(np.searchsorted(np.asarray(layout.nodes), mid) - 1, 0, layout.n_spans - 1)
    inv_EI = 1.0 / np.asarray(layout.EI, float)[span]
    g = Grid(x, h, inv_EI, span, (), ())
    sup = tuple(g.node(s.x) for s in layout.supports)
    hin = tuple(g.node(xh) for xh in layout.hinges)
    struct = np.array(sorted(set(sup) | set(hin)))
    elem = np.searchsorted(struct, np.arange(len(h)), side="right") - 1
    return Grid(x, h, inv_EI, span, sup, hin, elem, struct[:-1].copy(), struct[1:] - 1, struct)


@dataclass(eq=False)
class Batch:
    """Exact piecewise solution for B load sets on one grid (all SI).

    V, M, phi, delta: local polynomial coefficients, shape (B, K, n), increasing powers of t = x - x_k;
    R: vertical reactions per support (B, n_supports), upward positive; Mr: moment reactions per
    support (B, n_supports), clockwise positive on the beam.
    """

    grid: Grid
    V: np.ndarray
    M: np.ndarray
    phi: np.ndarray
    delta: np.ndarray
    R: np.ndarray = field(default=None)
    Mr: np.ndarray = field(default=None)


def _grouped_cumsum(a: np.ndarray, gs: np.ndarray, inclusive: bool) -> np.ndarray:
    """Cumulative sum along axis 1 restarting at each group start (gs: group start index per column)."""
    cs = np.cumsum(a, axis=1)
    incl = cs - cs[:, gs] + a[:, gs]
    return incl if inclusive else incl - a


def _integrate(g: Grid, w0, w1, F, C, dphi, ddel):
    """Integrate every element from its own start. Node sources (B, K+1): at an element's first node
    they are its start state (V, M, phi, delta); at inner nodes they are jumps. Returns coefficient
    arrays (B, K, n) and the end state of every element (dict of (B, E))."""
    h, ie = g.h, g.inv_EI
    gs = g.elem_start[g.elem]
    h2, h3 = h * h, h * h * h
    h4, h5 = h2 * h2, h2 * h3
    dV = -(w0 * h + w1 * (h2 / 2))
    Vs = _grouped_cumsum(F[:, :-1], gs, True) + _grouped_cumsum(dV, gs, False)
    dM = Vs * h - w0 * (h2 / 2) - w1 * (h3 / 6)
    Ms = _grouped_cumsum(C[:, :-1], gs, True) + _grouped_cumsum(dM, gs, False)
    dP = -ie * (Ms * h + Vs * (h2 / 2) - w0 * (h3 / 6) - w1 * (h4 / 24))
    Ps = _grouped_cumsum(dphi[:, :-1], gs, True) + _grouped_cumsum(dP, gs, False)
    dD = Ps * h - ie * (Ms * (h2 / 2) + Vs * (h3 / 6) - w0 * (h4 / 24) - w1 * (h5 / 120))
    Ds = _grouped_cumsum(ddel[:, :-1], gs, True) + _grouped_cumsum(dD, gs, False)
    V = np.stack((Vs, -w0, -w1 / 2), axis=-1)
    M = np.stack((Ms, Vs, -w0 / 2, -w1 / 6), axis=-1)
    P = np.stack((Ps, -ie * Ms, -ie * Vs / 2, ie * w0 / 6, ie * w1 / 24), axis=-1)
    D = np.stack((Ds, Ps, -ie * Ms / 2, -ie * Vs / 6, ie * w0 / 24, ie * w1 / 120), axis=-1)
    k = g.elem_end
    ends = {"V": Vs[:, k] + dV[:, k], "M": Ms[:, k] + dM[:, k], "phi": Ps[:, k] + dP[:, k],
            "delta": Ds[:, k] + dD[:, k]}
    return V, M, P, D, ends


def load_sources(g: Grid, load_sets) -> tuple:
    """Source arrays for B load sets (each an iterable of PointLoad / Couple / LinearLoad)."""
    B, K = len(load_sets), len(g.h)
    w0 = np.zeros((B, K))
    w1 = np.zeros((B, K))
    F = np.zeros((B, K + 1))
    C = np.zeros((B, K + 1))
    x = g.x
    for b, loads in enumerate(load_sets):
        for ld in loads:
            if isinstance(ld, PointLoad):
                F[b, g.node(ld.x)] -= ld.P
            elif isinstance(ld, Couple):
                C[b, g.node(ld.x)] += ld.M
            else:
                i0, i1 = g.node(ld.start), g.node(ld.end)
                slope = (ld.w2 - ld.w1) / (ld.end - ld.start)
                w0[b, i0:i1] += ld.w1 + slope * (x[i0:i1] - ld.start)
                w1[b, i0:i1] += slope
    return w0, w1, F, C


_Q = ("V", "M", "phi", "delta")


def _unknowns(layout: Layout, g: Grid):
    E = len(g.elem_start)
    unk = [("X", e, q) for e in range(E) for q in range(4)]
    unk += [("R", s.index) for s in layout.supports if s.vertical]
    unk += [("C", s.index) for s in layout.supports if s.rotational]
    return unk


def _unit_element_sources(g: Grid):
    """4 unit start states per element: sources (4E, ...)."""
    E, K = len(g.elem_start), len(g.h)
    n = 4 * E
    F, C, dphi, ddel = (np.zeros((n, K + 1)) for _ in range(4))
    for e in range(E):
        j = g.struct_node[e]
        F[4 * e, j] = C[4 * e + 1, j] = dphi[4 * e + 2, j] = ddel[4 * e + 3, j] = 1.0
    return np.zeros((n, K)), np.zeros((n, K)), F, C, dphi, ddel


def _system(layout: Layout, g: Grid):
    """Matrix A (n x n) of the conditions, the unit-source coefficients and the row bookkeeping."""
    unk = _unknowns(layout, g)
    col = {u: i for i, u in enumerate(unk)}
    E = len(g.elem_start)
    usrc = _unit_element_sources(g)
    V, M, P, D, ends = _integrate(g, *usrc)
    # T[e][q_end, q_start]: end state of element e per unit start state
    T = np.zeros((E, 4, 4))
    for qi, q in enumerate(_Q):
        for e in range(E):
            T[e, qi, :] = ends[q][4 * e:4 * e + 4, e]
    n = len(unk)
    A = np.zeros((n, n))
    struct_of_support = {s.index: int(np.searchsorted(g.struct_node, g.support_node[s.index]))
                         for s in layout.supports}
    hinge_struct = {int(np.searchsorted(g.struct_node, j)) for j in g.hinge_node}
    sup_at = {struct_of_support[s.index]: s for s in layout.supports}
    rows: list = []  # (kind, e, q, struct node) for the right-hand side

    def X(e, q):
        return col[("X", e, _Q.index(q))]

    def add_end(r, e, q, sign):
        A[r, 4 * e:4 * e + 4] += sign * T[e, _Q.index(q)]

    def react(r, j, what, sign):
        s = sup_at.get(j)
        if s is not None and (("R", s.index) in col if what == "R" else ("C", s.index) in col):
            A[r, col[(what, s.index)]] += sign

    r = 0
    for q, what in (("V", "R"), ("M", "C")):  # x = 0: start state = reaction + node load
        A[r, X(0, q)] = 1.0
        react(r, 0, what, -1.0)
        rows.append(("start", 0, q, 0))
        r += 1
    for j in range(1, E):
        e, e2 = j - 1, j
        A[r, X(e2, "delta")] = 1.0
        add_end(r, e, "delta", -1.0)
        rows.append(("cont", e, "delta", j))
        r += 1
        if j in hinge_struct:
            add_end(r, e, "M", 1.0)
            rows.append(("hinge", e, "M", j))
        else:
            A[r, X(e2, "phi")] = 1.0
            add_end(r, e, "phi", -1.0)
            rows.append(("cont", e, "phi", j))
        r += 1
        for q, what in (("M", "C"), ("V", "R")):
            A[r, X(e2, q)] = 1.0
            add_end(r, e, q, -1.0)
            react(r, j, what, -1.0)
            rows.append(("jump", e, q, j))
            r += 1
    for q, what in (("V", "R"), ("M", "C")):  # just right of x = L
        add_end(r, E - 1, q, 1.0)
        react(r, E, what, 1.0)
        rows.append(("end", E - 1, q, E))
        r += 1
    for s in layout.supports:
        j = struct_of_support[s.index]
        for q, active in (("delta", s.vertical), ("phi", s.rotational)):
            if not active:
                continue
            if j < E:
                A[r, X(j, q)] = 1.0
                rows.append(("kin0", j, q, j))
            else:
                add_end(r, E - 1, q, 1.0)
                rows.append(("kinL", E - 1, q, j))
            if q == "delta" and s.kind == "spring":
                A[r, col[("R", s.index)]] -= 1.0 / s.k
            r += 1
    assert r == n, (r, n)
    rs, cs = _scales(A)
    As = A * rs[:, None] * cs[None, :]
    inv = np.linalg.inv(As)
    return unk, (V, M, P, D), rows, rs, cs, inv


def _rhs(rows, ends, Fs, Cs) -> np.ndarray:
    """Right-hand sides (n, B) from the load sets' element end states and structural-node loads."""
    out = np.empty((len(rows), Fs.shape[0]))
    nodal = {"V": Fs, "M": Cs}
    for i, (kind, e, q, j) in enumerate(rows):
        if kind == "start":
            out[i] = nodal[q][:, 0]
        elif kind == "cont":
            out[i] = ends[q][:, e]
        elif kind == "hinge":
            out[i] = -ends["M"][:, e]
        elif kind == "jump":
            out[i] = ends[q][:, e] + nodal[q][:, j]
        elif kind == "end":
            out[i] = -ends[q][:, e] - nodal[q][:, j]
        elif kind == "kin0":
            out[i] = 0.0
        else:  # kinL
            out[i] = -ends[q][:, e]
    return out


def _scales(A: np.ndarray):
    """Row and column scale factors that equilibrate A (largest entry 1 in every row and column)."""
    m = np.max(np.abs(A), axis=1)
    r = 1.0 / np.where(m > 0, m, 1.0)
    m = np.max(np.abs(A * r[:, None]), axis=0)
    c = 1.0 / np.where(m > 0, m, 1.0)
    return r, c


_SYS_CACHE: dict = {}


def _system_cached(layout: Layout, g: Grid):
    key = (layout, g.x.tobytes())
    hit = _SYS_CACHE.get(key)
    if hit is None:
        if len(_SYS_CACHE) > 64:
            _SYS_CACHE.clear()
        hit = _system(layout, g)
        _SYS_CACHE[key] = hit
    return hit


def solve_batch(layout: Layout, g: Grid, load_sets) -> Batch:
    """Exact solution on grid ``g`` for each load set in ``load_sets`` (a list of load lists)."""
    unk, ucoef, rows, rs, cs, inv = _system_cached(layout, g)
    w0, w1, F, C = load_sources(g, load_sets)
    B = len(load_sets)
    sn = g.struct_node
    Fs, Cs = F[:, sn].copy(), C[:, sn].copy()  # loads at element ends enter the conditions
    F[:, sn] = 0.0
    C[:, sn] = 0.0
    z = np.zeros_like(F)
    V, M, P, D, ends = _integrate(g, w0, w1, F, C, z, z)
    b = _rhs(rows, ends, Fs, Cs)
    u = cs[:, None] * (inv @ (rs[:, None] * b))  # (n, B)
    nX = 4 * len(g.elem_start)
    uX = u[:nX].T  # (B, 4E)
    out = [arr + np.einsum("bu,uk...->bk...", uX, uc) for arr, uc in zip((V, M, P, D), ucoef)]
    ns = len(layout.supports)
    R = np.zeros((B, ns))
    Mr = np.zeros((B, ns))
    for i, key in enumerate(unk[nX:], start=nX):
        (R if key[0] == "R" else Mr)[:, key[1]] = u[i]
    # reactions that are zero in statics come out of the solve as round-off: exactly 0.0 (relative to
    # each load set's total load, and to its moment scale for the moment reactions)
    R = snap_zero(R, load_scale(g.x, out[0], g.support_node, R)[:, None])
    Mr = snap_zero(Mr, roundoff_scale(g.x, out[1])[:, None])
    return Batch(g, *out, R, Mr)


def check_stability(layout: Layout) -> None:
    """Raise :class:`UnstableError` when the supports and hinges allow a rigid-body motion.

    Kinematics only: the motion delta(x) = d0 + p0 x + sum H_i <x - xh_i> (straight between hinges)
    must vanish at every vertical support (pin, roller, fixed, spring) and have zero slope at every
    fixed support; the beam is stable when only d0 = p0 = H_i = 0 does so. Horizontally, at least one
    pin or fixed support is required.
    """
    sup = layout.supports
    if not any(s.vertical for s in sup):
        raise UnstableError("Beam is unstable: every support is 'free', so nothing holds the beam up; "
                            "give at least two vertical supports or one fixed support")
    if not any(s.horizontal for s in sup):
        kinds = sorted({s.kind for s in sup if s.vertical})
        raise UnstableError(
            f"Beam is unstable: no support restrains movement along the beam (only {', '.join(kinds)} "
            "supports); make at least one support 'pin' or 'fixed'")
    L = layout.L
    hx = np.asarray(layout.hinges) / L
    rows = []
    for s in sup:
        xs = s.x / L
        if s.vertical:
            rows.append(np.concatenate(([1.0, xs], np.clip(xs - hx, 0.0, None))))
        if s.rotational:
            rows.append(np.concatenate(([0.0, 1.0], (hx < xs).astype(float))))
    G = np.array(rows)
    n = 2 + len(hx)
    _, sv, vt = np.linalg.svd(G, full_matrices=True)
    rank = int(np.sum(sv > RANK_REL * max(sv[0], 1.0)))
    if rank == n:
        return
    n_r = len(rows)
    why = [f"the supports give {n_r} reaction component(s) but a beam with {len(hx)} hinge(s) "
           f"needs at least {n}" if n_r < n else
           "the supports and hinges are arranged so that part of the beam can move without bending"]
    mode_c = vt[-1]
    keys = np.array(sorted({0.0, L, *layout.hinges, *(s_.x for s_ in sup)}))
    vals = np.abs(mode_c[0] + mode_c[1] * keys / L
                  + np.clip(keys[:, None] / L - hx[None, :], 0.0, None) @ mode_c[2:])
    amp = np.max(vals)
    if amp > 0:  # the motion is linear between key points
        on = vals > 1e-6 * amp
        moving = [i for i in range(len(keys) - 1) if on[i] or on[i + 1]]
        if moving:
            a, b = keys[moving[0]], keys[moving[-1] + 1]
            txt = f"the beam can move between x = {a:.4g} m and x = {b:.4g} m without bending"
            if layout.hinges:
                txt += " (hinges at x = " + ", ".join(f"{h:.4g}" for h in layout.hinges) + " m)"
            why.append(txt)
    raise UnstableError("Beam is unstable (a mechanism): " + "; ".join(why)
                        + "; add a support, fix a support or remove a hinge")


def split_by_span(layout: Layout, loads) -> list[list]:
    """The loads cut at the supports: element i holds what lies on span i.

    Point loads and couples exactly at an interior support go to the span on the right (the last
    support's to the last span); distributed loads are cut at the supports with their linear intensity.
    """
    nodes = layout.nodes
    n = layout.n_spans
    out: list[list] = [[] for _ in range(n)]
    arr = np.asarray(nodes)
    for ld in loads:
        if isinstance(ld, LinearLoad):
            for i in range(n):
                part = ld.clipped(nodes[i], nodes[i + 1])
                if part is not None:
                    out[i].append(part)
        else:
            i = int(np.clip(np.searchsorted(arr, ld.x + SNAP_REL * layout.L, side="right") - 1, 0, n - 1))
            out[i].append(ld)
    return out
