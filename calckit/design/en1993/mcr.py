"""Elastic critical moment M_cr for lateral-torsional buckling, and the factors C1, C2, C3.

Three-factor formula (ENV 1993-1-1:1992 Annex F, Eq. (F.2); NCCI SN003 "Elastic critical moment for
lateral torsional buckling", Access Steel, Eq. (1), from memory)::

    M_cr = C1 pi^2 E I_z/(k L)^2 { sqrt[(k/k_w)^2 I_w/I_z + (k L)^2 G I_t/(pi^2 E I_z) + (C2 z_g - C3 z_j)^2]
                                   - (C2 z_g - C3 z_j) }

z_g: height of the load above the shear centre (positive: load above, destabilising for gravity load);
z_j: mono-symmetry parameter z_s - 0.5/I_y int (y^2 + z^2) z dA (positive when the flange in
compression is the larger one); k, k_w: end restraint (1.0 free to rotate / warp, 0.5 fixed).

C1, C2 and C3 from the real moment diagram: calckit computes the critical moment of the segment directly
by the Rayleigh-Ritz energy method of thin-walled beam theory (Timoshenko and Gere, Theory of Elastic
Stability, 2nd ed., 1961, section 6.3; Trahair, Flexural-Torsional Buckling of Structures, 1993, chapters
3 and 6; both from memory): lateral deflection u and twist phi as series of N = 8 sine terms (k, k_w = 1)
or of sin(pi x/L) sin(n pi x/L) terms (k, k_w = 0.5), twist prevented at both segment ends (fork
supports), the second variation

    1/2 int [E I_z u''^2 + G I_t phi'^2 + E I_w phi''^2] dx
      + lambda int M [u'' phi + z_j phi'^2 + z_g (phi'^2 + phi phi'')] dx

(the load-height term is -1/2 int q z_g phi^2 dx rewritten with q = -M'' and phi = 0 at the ends, so
it needs only M(x): every transverse load in the segment is taken to act at height z_g), integrated by
composite Gauss quadrature of the given M(x). The equivalent factors are then C1 = M_cr(z_g = z_j = 0) /
M_cr,uniform(same k, k_w); C2 and C3 are the values that make the three-factor formula reproduce the
energy solution with the load height alone and with mono-symmetry alone. The result is reported as the
three-factor formula with these factors.

Only k, k_w in {1.0, 0.5} can be derived this way; other values need C1 (and C2) given explicitly.
A segment with a free end (a cantilever or an overhang) is solved by :mod:`.cantilever` instead.

Speed (section search): the diagram-dependent parts of the energy solution are kept in a :class:`Shape`
per normalised diagram and end conditions (cached by :func:`shape`), so that for each section only the
diagonal stiffness changes; with z_g = z_j = 0 the 2N x 2N eigenproblem reduces exactly to an N x N one
(see :class:`Shape`). :func:`mcr_energy` keeps the direct dense solve as the reference; the two agree to
about 1e-12 (tests/test_en1993_fast_paths.py).
"""
from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from ...errors import InputError, NotCoveredError

__all__ = ["mcr_formula", "mcr_energy", "equivalent_factors", "Factors", "Shape", "shape", "raw_shape", "z_j",
           "standard_diagram", "SN003_TABLE"]

N_TERMS = 8  #: series terms for u and for phi
N_SUB = 32  #: quadrature sub-intervals
_GL = np.polynomial.legendre.leggauss(3)

#: Published C1, C2 for fork supports (k = k_w = 1), NCCI SN003 Tables 3.2 (transverse load), from memory;
#: used only to pick C2 when C1 is given without a moment diagram and z_g != 0.
SN003_TABLE = {"udl": (1.127, 0.454), "point": (1.348, 0.630)}


@dataclass(frozen=True)
class Factors:
    """Equivalent moment factors of a segment, with the energy solution they reproduce (SI floats)."""

    C1: float
    C2: float
    C3: float
    Mcr_energy: float  #: M_cr of the energy solution with z_g and z_j (N m), for the record
    method: str  #: how the factors were found


def mcr_formula(C1, C2, C3, L, EIz, GIt, EIw, zg=0.0, zj=0.0, k=1.0, kw=1.0) -> float:
    """Three-factor formula (ENV 1993-1-1 Annex F (F.2) / SN003 Eq. (1)), SI floats, N m."""
    kL = k * L
    ncr = math.pi ** 2 * EIz / kL ** 2
    Iw_Iz = EIw / EIz
    h = C2 * zg - C3 * zj
    B = (k / kw) ** 2 * Iw_Iz + kL ** 2 * GIt / (math.pi ** 2 * EIz)
    return C1 * ncr * (math.sqrt(B + h * h) - h)


def _eigvalsh_np(a: np.ndarray) -> np.ndarray:
    return np.linalg.eigvalsh(a)


def _fast_eigvalsh():
    """numpy's LAPACK gufunc behind eigvalsh, without the wrapper's per-call checks (a few microseconds
    per call, which count in a section search); numpy.linalg.eigvalsh where it is not available or does
    not agree on a test matrix."""
    try:
        from numpy.linalg import _umath_linalg as ul

        fn = ul.eigvalsh_lo
        t = np.array([[2.0, 1.0, 0.0], [1.0, 3.0, 1.0], [0.0, 1.0, 4.0]])
        if not np.allclose(fn(t, signature="d->d"), np.linalg.eigvalsh(t), rtol=1e-14, atol=0):
            return _eigvalsh_np

        def eig(a: np.ndarray) -> np.ndarray:
            ev = fn(a, signature="d->d")
            return ev if np.isfinite(ev[0]) else np.linalg.eigvalsh(a)  # failure: let numpy raise / retry

        return eig
    except Exception:  # pragma: no cover - depends on the numpy build
        return _eigvalsh_np


eigvalsh = _fast_eigvalsh()


def _basis_fns(fixed: bool, n: int, xi: np.ndarray):
    """f, f', f'' (derivatives in xi) of the series terms at xi; shape (len(xi), n)."""
    j = np.arange(1, n + 1)
    if not fixed:
        a = np.pi * j
        s, c = np.sin(np.outer(xi, a)), np.cos(np.outer(xi, a))
        return s, c * a, -s * a ** 2
    a, b = np.pi * (j - 1), np.pi * (j + 1)  # sin(pi x) sin(n pi x) = (cos a x - cos b x)/2
    ca, cb = np.cos(np.outer(xi, a)), np.cos(np.outer(xi, b))
    sa, sb = np.sin(np.outer(xi, a)), np.sin(np.outer(xi, b))
    return 0.5 * (ca - cb), 0.5 * (-sa * a + sb * b), 0.5 * (-ca * a ** 2 + cb * b ** 2)


@lru_cache(maxsize=8)
def _basis(fix_u: bool, fix_phi: bool):
    """Quadrature points xi, weights and the series terms at them, transformed so that the stiffness is
    diagonal: u-terms with int u_i'' u_j'' = delta_ij, phi-terms with int phi_i' phi_j' = delta_ij and
    int phi_i'' phi_j'' = mu_i delta_ij (derivatives in xi; lengths scaled per call)."""
    x0, w0 = _GL
    edges = np.linspace(0.0, 1.0, N_SUB + 1)
    h = np.diff(edges)
    xi = (edges[:-1, None] + h[:, None] * (x0[None, :] + 1) / 2).ravel()
    w = (h[:, None] * w0[None, :] / 2).ravel()
    u, u1, u2 = _basis_fns(fix_u, N_TERMS, xi)
    p, p1, p2 = _basis_fns(fix_phi, N_TERMS, xi)
    Kuu = (u2 * w[:, None]).T @ u2
    Kp1 = (p1 * w[:, None]).T @ p1
    Kp2 = (p2 * w[:, None]).T @ p2
    lam_u, Q = np.linalg.eigh(Kuu)
    Tu = Q / np.sqrt(lam_u)
    # simultaneous diagonalisation of Kp1 (-> I) and Kp2 (-> diag mu)
    l1, Q1 = np.linalg.eigh(Kp1)
    A = Q1 / np.sqrt(l1)
    mu, Q2 = np.linalg.eigh(A.T @ Kp2 @ A)
    Tp = A @ Q2
    return xi, w, u2 @ Tu, p @ Tp, p1 @ Tp, p2 @ Tp, mu


def _restraint(k: float, name: str) -> bool:
    if abs(k - 1.0) < 1e-9:
        return False
    if abs(k - 0.5) < 1e-9:
        return True
    raise NotCoveredError(f"{name}: got {k:g}; calckit derives C1/C2 from the moment diagram only for "
                          f"{name} = 1.0 (free) or 0.5 (fixed); give C1 (and C2) explicitly for other values")


def _quad_m(M, xi: np.ndarray, Mmax: float | None) -> tuple[np.ndarray, float]:
    """(M at the quadrature points, the peak |M| used to normalise), as :func:`mcr_energy` reads them."""
    m = np.asarray(M(xi) if callable(M) else M, dtype=float)
    if Mmax is None:
        mmax = float(np.max(np.abs(m)))
        if callable(M):
            mmax = max(mmax, float(np.max(np.abs(M(np.linspace(0.0, 1.0, N_SUB + 1))))))
    else:
        mmax = float(Mmax)
    if not mmax > 0:
        raise InputError("moment_diagram: got zero moment over the segment; no lateral-torsional buckling")
    return m, mmax


def mcr_energy(L: float, EIz: float, GIt: float, EIw: float, M, zg: float = 0.0, zj: float = 0.0,
               k: float = 1.0, kw: float = 1.0, Mmax: float | None = None) -> float:
    """Critical moment (N m, magnitude of the largest |M| of the diagram at buckling) by Rayleigh-Ritz.

    ``M``: callable M(xi) on xi = x/L in [0, 1], or an array of M at the quadrature points; sign
    convention sagging positive (top flange in compression); zg, zj as in the module docstring, measured
    upwards (zj > 0 when the top flange is the larger). ``Mmax``: the largest |M| of the diagram (default:
    from M at the quadrature points and the sub-interval ends; give it when the peak may lie elsewhere).

    This is the reference solution (one dense 2N x 2N eigenproblem per call); the section search uses
    :class:`Shape`, which gives the same values (to rounding) with the diagram-dependent parts reused.
    """
    fu, fp = _restraint(k, "k"), _restraint(kw, "k_w")
    xi, w, u2, p, p1, p2, mu = _basis(fu, fp)
    m, mmax = _quad_m(M, xi, Mmax)
    wm = w * (m / mmax)
    n = N_TERMS
    # diagonal stiffness in the transformed terms (x = xi L: d/dx = (1/L) d/dxi, dx = L dxi)
    kd = np.empty(2 * n)
    kd[:n] = EIz / L ** 3
    kd[n:] = GIt / L + EIw / L ** 3 * mu
    # geometric terms per unit peak moment
    G = np.empty((2 * n, 2 * n))
    G[:n, :n] = 0.0
    C = (u2 * wm[:, None]).T @ p / L  # int M u'' phi dx
    G[:n, n:] = C
    G[n:, :n] = C.T
    if zj or zg:
        Gpp = (2.0 * (zj + zg) / L) * ((p1 * wm[:, None]).T @ p1)  # int M phi' phi' dx
        if zg:
            q = (p * wm[:, None]).T @ p2 / L  # int M phi phi'' dx
            Gpp += zg * (q + q.T)
        G[n:, n:] = Gpp
    else:
        G[n:, n:] = 0.0
    r = 1.0 / np.sqrt(kd)
    S = G * r[:, None] * r[None, :]
    ev = np.linalg.eigvalsh(S)
    if not ev[0] < -1e-14:
        raise InputError("moment_diagram: no lateral-torsional buckling under this moment diagram")
    lam = -1.0 / float(ev[0])
    return lam  # m is normalised to a peak of 1 N m, so lam is the critical peak moment


_SCALING: dict = {}


def _scaling(mu: np.ndarray, L: float, GIt: float, EIw: float) -> tuple[np.ndarray, np.ndarray]:
    """(r_phi, outer(r_phi, r_phi)) with r_phi = 1 / sqrt(G I_t / L + E I_w / L^3 mu): the twist terms'
    diagonal scaling of :meth:`Shape.mcr`, the same for every diagram of a segment and section, so kept
    for the last few (basis, length, section)."""
    key = (id(mu), L, GIt, EIw)
    hit = _SCALING.get(key)
    if hit is not None and hit[0] is mu:
        return hit[1], hit[2]
    r_phi = 1.0 / np.sqrt(GIt / L + EIw / L ** 3 * mu)
    rr = np.outer(r_phi, r_phi)
    if len(_SCALING) >= 32:
        _SCALING.clear()
    _SCALING[key] = (mu, r_phi, rr)
    return r_phi, rr


class Shape:
    """The parts of the energy solution that depend only on the normalised moment diagram of a segment and
    its end conditions (k, k_w): computed once and reused for every section (same basis, quadrature and
    eigenproblem as :func:`mcr_energy`, so the values agree with it to rounding).

    Section and length enter only through the diagonal stiffness and the scale of the geometric terms:
    with z_g = z_j = 0 the eigenvalues of the 2N problem are +- the singular values of the N x N coupling
    block, so M_cr = 1 / sigma_max comes from an N x N symmetric eigenproblem (the Gram matrix of the
    scaled block); with z_g or z_j the 2N problem is assembled from the cached blocks.
    """

    __slots__ = ("fix_u", "fix_phi", "mu", "C0", "CtC", "P1", "Qs", "_terms", "_last")

    def __init__(self, fix_u: bool, fix_phi: bool, m_over_peak: np.ndarray) -> None:
        xi, w, u2, p, p1, p2, mu = _basis(fix_u, fix_phi)
        wm = w * m_over_peak
        self.fix_u, self.fix_phi, self.mu = fix_u, fix_phi, mu
        self.C0 = (u2 * wm[:, None]).T @ p  # int m u'' phi dxi
        self.CtC = self.C0.T @ self.C0
        self.P1 = (p1 * wm[:, None]).T @ p1  # int m phi' phi' dxi
        q = (p * wm[:, None]).T @ p2  # int m phi phi'' dxi
        self.Qs = q + q.T
        self._terms = None
        self._last = None

    def mcr(self, L: float, EIz: float, GIt: float, EIw: float, zg: float = 0.0, zj: float = 0.0) -> float:
        """Critical peak moment (N m) of the segment, as :func:`mcr_energy`. The last result is kept: a
        member check asks for the same section's value twice (to rank the diagrams, then for C1)."""
        key = (L, EIz, GIt, EIw, zg, zj)
        last = self._last
        if last is not None and last[0] == key:
            return last[1]
        val = self._mcr(L, EIz, GIt, EIw, zg, zj)
        self._last = (key, val)
        return val

    def _mcr(self, L: float, EIz: float, GIt: float, EIw: float, zg: float, zj: float) -> float:
        r_phi, rr = _scaling(self.mu, L, GIt, EIw)
        if not (zg or zj):
            H = self.CtC * rr
            smax = float(eigvalsh(H)[-1])
            sigma = math.sqrt(max(smax, 0.0)) * math.sqrt(L ** 3 / EIz) / L
            if not sigma > 1e-14:
                raise InputError("moment_diagram: no lateral-torsional buckling under this moment diagram")
            return 1.0 / sigma
        if self.P1 is None:  # a combined Shape: the load-height and mono-symmetry blocks summed when first needed
            self.P1 = sum(c * sh.P1 for c, sh in self._terms)
            self.Qs = sum(c * sh.Qs for c, sh in self._terms)
        n = N_TERMS
        r = np.empty(2 * n)
        r[:n] = math.sqrt(L ** 3 / EIz)
        r[n:] = r_phi
        G = np.zeros((2 * n, 2 * n))
        C = self.C0 / L
        G[:n, n:] = C
        G[n:, :n] = C.T
        Gpp = (2.0 * (zj + zg) / L) * self.P1
        if zg:
            Gpp = Gpp + (zg / L) * self.Qs
        G[n:, n:] = Gpp
        ev = eigvalsh(G * np.outer(r, r))
        if not ev[0] < -1e-14:
            raise InputError("moment_diagram: no lateral-torsional buckling under this moment diagram")
        return -1.0 / float(ev[0])

    def factors(self, L: float, EIz: float, GIt: float, EIw: float, zg: float = 0.0, zj: float = 0.0,
                k: float = 1.0, kw: float = 1.0) -> Factors:
        """C1, C2, C3 as :func:`equivalent_factors` (k, k_w must be those the shape was built for)."""
        return _factors(lambda g, j: self.mcr(L, EIz, GIt, EIw, g, j), L, EIz, GIt, EIw, zg, zj, k, kw)

    @classmethod
    def combine2(cls, a: float, A: "Shape", b: float, U: "Shape") -> "Shape":
        """``combine([(a, A), (b, U)])`` for two shapes of the same end conditions (the section search's
        diagram A plus the self-weight term U), with the same arithmetic."""
        if (A.fix_u, A.fix_phi) != (U.fix_u, U.fix_phi):
            raise InputError("Shape.combine: the shapes have different end conditions (k, k_w)")
        a, b = float(a), float(b)
        new = cls.__new__(cls)
        new.fix_u, new.fix_phi, new.mu = A.fix_u, A.fix_phi, A.mu
        C0 = a * A.C0
        if b:
            C0 = C0 + b * U.C0
        new.C0, new.CtC = C0, C0.T @ C0
        new.P1 = new.Qs = None
        new._terms = [(c, sh) for c, sh in ((a, A), (b, U)) if c]
        new._last = None
        return new

    @classmethod
    def combine(cls, terms) -> "Shape":
        """The Shape of the diagram sum c_i m_i from the Shapes of the m_i (same end conditions): every
        block is linear in the diagram, so this is exact (``terms``: pairs (c_i, Shape_i)). Used by the
        section search to add each candidate's self-weight to a diagram without rebuilding it."""
        terms = [(float(c), sh) for c, sh in terms]
        c0, s0 = terms[0]
        new = cls.__new__(cls)
        new.fix_u, new.fix_phi, new.mu = s0.fix_u, s0.fix_phi, s0.mu
        C0 = c0 * s0.C0
        for c, sh in terms[1:]:
            if (sh.fix_u, sh.fix_phi) != (s0.fix_u, s0.fix_phi):
                raise InputError("Shape.combine: the shapes have different end conditions (k, k_w)")
            if c:
                C0 = C0 + c * sh.C0
        new.C0, new.CtC = C0, C0.T @ C0
        new.P1 = new.Qs = None  # summed in mcr() only if z_g or z_j needs them
        new._terms = [(c, sh) for c, sh in terms if c]
        new._last = None
        return new


_SHAPES: dict = {}
_SHAPES_MAX = 256


def shape(M, k: float = 1.0, kw: float = 1.0, Mmax: float | None = None) -> tuple[Shape, float]:
    """(:class:`Shape`, peak |M|) of the diagram ``M`` (callable on xi or values at the quadrature points),
    from a small cache keyed by the normalised diagram (a section search meets the same diagram for every
    section)."""
    fu, fp = _restraint(k, "k"), _restraint(kw, "k_w")
    xi = _basis(fu, fp)[0]
    m, mmax = _quad_m(M, xi, Mmax)
    mn = m / mmax
    key = (fu, fp, mn.tobytes())
    sh = _SHAPES.get(key)
    if sh is None:
        if len(_SHAPES) >= _SHAPES_MAX:
            _SHAPES.clear()
        sh = _SHAPES[key] = Shape(fu, fp, mn)
    return sh, mmax


def raw_shape(M, k: float = 1.0, kw: float = 1.0) -> Shape:
    """The :class:`Shape` of the diagram ``M`` (callable on xi = x/L, N m) as given, not normalised to
    its peak and not cached: a term for :meth:`Shape.combine` (a zero diagram is allowed)."""
    fu, fp = _restraint(k, "k"), _restraint(kw, "k_w")
    xi = _basis(fu, fp)[0]
    m = np.asarray(M(xi) if callable(M) else M, dtype=float)
    if m.shape != xi.shape or not np.all(np.isfinite(m)):
        raise InputError("moment_diagram: expected finite moments at the quadrature points")
    return Shape(fu, fp, m)


def _factors(solve, L, EIz, GIt, EIw, zg, zj, k, kw) -> Factors:
    kL = k * L
    ncr = math.pi ** 2 * EIz / kL ** 2
    B = (k / kw) ** 2 * EIw / EIz + kL ** 2 * GIt / (math.pi ** 2 * EIz)
    m0 = solve(0.0, 0.0)
    C1 = m0 / (ncr * math.sqrt(B))
    C2 = C3 = 0.0
    mfull = m0
    if zg:
        mg = solve(zg, 0.0) / (C1 * ncr)
        C2 = (B - mg * mg) / (2 * mg) / zg
        mfull = mg * C1 * ncr
    if zj:
        mj = solve(0.0, zj) / (C1 * ncr)
        C3 = -(B - mj * mj) / (2 * mj) / zj
    if zg and zj:
        mfull = solve(zg, zj)
    elif zj:
        mfull = mj * C1 * ncr
    return Factors(C1, C2, C3, mfull, f"Rayleigh-Ritz energy solution ({N_TERMS} terms) of the moment diagram")


def equivalent_factors(L: float, EIz: float, GIt: float, EIw: float, M, zg: float = 0.0, zj: float = 0.0,
                       k: float = 1.0, kw: float = 1.0, Mmax: float | None = None, fast: bool = True) -> Factors:
    """C1 (and C2, C3 where z_g, z_j are not zero) reproducing the energy solution, see module docstring.

    ``fast`` (default): through the cached :class:`Shape` of the diagram; ``fast=False``: one dense
    :func:`mcr_energy` solve per factor (the reference path; the two agree to about 1e-12).
    """
    if fast:
        sh, mmax = shape(M, k, kw, Mmax)
        return sh.factors(L, EIz, GIt, EIw, zg, zj, k, kw)
    return _factors(lambda g, j: mcr_energy(L, EIz, GIt, EIw, M, g, j, k, kw, Mmax), L, EIz, GIt, EIw, zg, zj,
                    k, kw)


def z_j(s) -> float:
    """Mono-symmetry parameter z_j (m) of an I-section, z upwards (positive when the top flange is larger).

    z_j = z_s - (1/(2 I_y)) int (y^2 + z^2) z dA over the three plates (SN003 / ENV 1993-1-1 F.1.1, from
    memory); 0 for doubly symmetric sections.
    """
    if s.symmetric:
        return 0.0
    yc = s.y_c
    plates = ((s.bf_bot, 0.0, s.tf_bot), (s.tw, s.tf_bot, s.d - s.tf_top), (s.bf_top, s.d - s.tf_top, s.d))
    total = 0.0
    for b, y0, y1 in plates:
        z0, z1 = y0 - yc, y1 - yc
        total += b * (z1 ** 4 - z0 ** 4) / 4.0 + b ** 3 / 12.0 * (z1 ** 2 - z0 ** 2) / 2.0
    zs = s.y_s - yc
    return zs - total / (2.0 * s.Ix)


def standard_diagram(name: str, psi: float | None = None):
    """Normalised moment diagram M(xi) (peak 1) of a standard case: 'uniform', 'udl', 'point' (central
    point load), 'linear' (end moments 1 and psi)."""
    if name == "uniform":
        return lambda xi: np.ones_like(xi)
    if name == "udl":
        return lambda xi: 4.0 * xi * (1.0 - xi)
    if name == "point":
        return lambda xi: 1.0 - np.abs(2.0 * xi - 1.0)
    if name == "linear":
        if psi is None or not -1.0 <= psi <= 1.0:
            raise InputError(f"psi: got {psi!r}; expected -1 <= psi <= 1 for a linear moment diagram")
        return lambda xi: 1.0 + (psi - 1.0) * xi
    raise InputError(f"moment_diagram: got {name!r}; expected 'uniform', 'udl', 'point' or 'linear'")
