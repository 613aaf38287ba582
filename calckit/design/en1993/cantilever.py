"""Elastic critical moment of cantilevers and overhangs (a segment with a free end), by the energy method.

The second variation of the total potential of thin-walled beam theory (Timoshenko and Gere, Theory of
Elastic Stability, 2nd ed., 1961, ch. 6; Trahair, Flexural-Torsional Buckling of Structures, 1993,
ch. 3 and 7; both from memory), the same functional as :mod:`.mcr`::

    1/2 int [E I_z u''^2 + G I_t phi'^2 + E I_w phi''^2] dx
      + lambda { int M [u'' phi + z_j phi'^2 + z_g (phi'^2 + phi phi'')] dx - z_g [M phi phi']_ends }

The load-height term is -1/2 int q z_g phi^2 dx - 1/2 sum P z_g phi^2 written with M only (q = -M'',
point loads as jumps of M'): integrating by parts leaves the end terms 1/2 z_g [M' phi^2 - 2 M phi phi'];
they vanish where phi = 0 (restraints), and at a free tip M'(tip) equals the tip load, whose own term
cancels the first one, so only -z_g M phi phi' at the free end remains (zero unless a moment acts at
the tip). Every transverse load is taken to act at the height z_g.

Discretisation: cubic Hermite beam elements for u and phi (4 degrees of freedom per node: u, u', phi,
phi'), exact stiffness, geometric terms by 4-point Gauss quadrature of the given M(x) in each element.

Boundary conditions:

- built-in root ("fixed"): u = u' = phi = phi' = 0 (lateral bending and warping prevented; phi' is left
  free when I_w = 0, where warping restraint has no meaning); 12 elements graded towards the root
  (the warping boundary layer);
- overhang ("continuous"): the overhang is solved together with the adjacent segment behind its root
  (the back segment, up to the next lateral-torsional restraint): u = phi = 0 at the root support and at
  the far restraint (a fork: free to rotate on plan and to warp there), u, u', phi, phi' continuous over
  the root support; 8 + 8 uniform elements. M_cr is reported for the overhang's largest |M| under the
  buckling load of the pair, so that the restraint (or the destabilising effect) of the back segment is
  included; the back segment keeps its own check with fork supports.

The free tip has no restraint. Results are upper bounds (Ritz). Built-in case: within about 0.01 % of
the differential-equation solution (scipy solve_bvp) for L^2 G I_t / (E I_w) = 0.5 to 300 with the load
at either flange or the centroid, about 0.1 % at 1e6 (against a fine mesh); overhang model: within
about 0.1 % of a 40 + 40 element mesh (tests/validation/test_en1993_cantilever_mcr.py).

Cost: one dense eigenproblem of 48 (built-in) or 64 (overhang) unknowns per section, about 0.2-0.4 ms;
the diagram-dependent matrices are built once per diagram (:func:`model` caches them).
"""
from __future__ import annotations

import math
from functools import lru_cache

import numpy as np

from ...errors import InputError
from .mcr import eigvalsh

__all__ = ["OverhangModel", "model", "gamma_cr", "N_EL_FIXED", "N_EL_OVERHANG", "N_EL_BACK"]

N_EL_FIXED = 12  #: elements of a built-in cantilever (graded towards the root)
N_EL_OVERHANG = 8  #: elements of an overhang in the continuous model
N_EL_BACK = 8  #: elements of the back segment in the continuous model
_GRADE = 2.0  #: nodes at L (i/n)^2 from the built-in root
_G4 = np.polynomial.legendre.leggauss(4)


@lru_cache(maxsize=4)
def _reference():
    """Hermite shape functions at the Gauss points of [0, 1]: N, N', N'' in xi without the h factors."""
    x0, w0 = _G4
    t = (x0 + 1.0) / 2.0
    w = w0 / 2.0
    N = np.stack([1 - 3 * t ** 2 + 2 * t ** 3, t - 2 * t ** 2 + t ** 3, 3 * t ** 2 - 2 * t ** 3, -t ** 2 + t ** 3], 1)
    D1 = np.stack([-6 * t + 6 * t ** 2, 1 - 4 * t + 3 * t ** 2, 6 * t - 6 * t ** 2, -2 * t + 3 * t ** 2], 1)
    D2 = np.stack([-6 + 12 * t, -4 + 6 * t, 6 - 12 * t, -2 + 6 * t], 1)
    return t, w, N, D1, D2


def _element_fns(h: np.ndarray):
    """Shape functions per element e and Gauss point g in x (shape (e, g, 4)) and the weights w h."""
    t, w, N, D1, D2 = _reference()
    sc = np.stack([np.ones_like(h), h, np.ones_like(h), h], 1)[:, None, :]  # slope DOFs carry h
    Ne = N[None] * sc
    D1e = D1[None] * sc / h[:, None, None]
    D2e = D2[None] * sc / h[:, None, None] ** 2
    return Ne, D1e, D2e, w[None, :] * h[:, None]


def _assemble(nn: int, blocks: np.ndarray, rows: np.ndarray, cols: np.ndarray) -> np.ndarray:
    A = np.zeros((4 * nn, 4 * nn))
    np.add.at(A, (rows, cols), blocks)
    return A


@lru_cache(maxsize=64)
def _mesh(Lo: float, Lb: float):
    """Nodes y (from the far restraint, or from a built-in root) and Gauss points yg (elements x points)."""
    if Lb == 0.0:
        y = Lo * np.linspace(0.0, 1.0, N_EL_FIXED + 1) ** _GRADE
    else:
        y = np.concatenate([np.linspace(0.0, Lb, N_EL_BACK + 1), Lb + np.linspace(0.0, Lo, N_EL_OVERHANG + 1)[1:]])
    h = np.diff(y)
    yg = y[:-1, None] + h[:, None] * _reference()[0][None, :]
    over = yg >= Lb - 1e-12 * max(Lo, Lb) if Lb else np.ones(yg.shape, dtype=bool)
    s_o = np.concatenate([yg[over] - Lb, y[y >= Lb - 1e-12 * max(Lo, Lb)] - Lb])  # overhang points, then nodes
    return y, h, yg, over, np.clip(s_o, 0.0, Lo)


_MODELS: dict = {}
_MODELS_MAX = 32


def model(Lo: float, Mo, back=None) -> "OverhangModel":
    """The :class:`OverhangModel` of a cantilever (``back`` None) or of an overhang with its back segment
    (``back = (Lb, Mb)``), from a small cache keyed by the moment values the model uses (a section
    search meets the same diagram for every section). Arguments as for :class:`OverhangModel`."""
    Lo = float(Lo)
    if not Lo > 0:
        raise InputError(f"L: got {Lo!r}; expected the cantilever length > 0")
    Lb = 0.0
    if back is not None:
        Lb = float(back[0])
        if not Lb > 0:
            raise InputError(f"backspan: got a length {Lb!r}; expected the back segment length > 0")
    y, h, yg, over, s_o = _mesh(Lo, Lb)
    mo = np.asarray(Mo(s_o), dtype=float)
    mb = np.asarray(back[1](yg[~over]), dtype=float) if back is not None else np.empty(0)
    if mo.shape != s_o.shape or mb.shape != (int(np.count_nonzero(~over)),) or not (
            np.all(np.isfinite(mo)) and np.all(np.isfinite(mb))):
        raise InputError("moment_diagram: the cantilever's moment diagram must give finite values at the points asked")
    key = (Lo, Lb, mo.tobytes(), mb.tobytes())
    m = _MODELS.get(key)
    if m is None:
        if len(_MODELS) >= _MODELS_MAX:
            _MODELS.clear()
        m = _MODELS[key] = OverhangModel(Lo, Lb, mo, mb)
    return m


class OverhangModel:
    """The finite-element energy model of one cantilever or overhang, built once per moment diagram
    (use :func:`model`, which caches them).

    ``Lo``: length of the free-ended segment (m); ``Lb``: length of the back segment (0 for a built-in
    root); ``mo``: M (N m, sagging positive) of the overhang at the points ``_mesh(Lo, Lb)[4]`` (distance
    from the root); ``mb``: M of the back segment at its Gauss points. The diagram-dependent matrices are
    kept; :meth:`mcr` adds the section's stiffness.
    """

    def __init__(self, Lo: float, Lb: float, mo: np.ndarray, mb: np.ndarray, scale: float | None = None) -> None:
        self.Lo, self.Lb, self.back = float(Lo), float(Lb), Lb > 0
        y, h, yg, over, s_o = _mesh(self.Lo, self.Lb)
        self.y = y
        nn = y.size
        ng = int(np.count_nonzero(over))
        Mg = np.empty(yg.shape)
        Mg[over] = mo[:ng]
        Mg[~over] = mb
        peak = float(np.max(np.abs(mo)))
        if scale is None and not peak > 0:
            raise InputError("moment_diagram: got zero moment over the cantilever; no lateral-torsional buckling")
        self.peak = peak
        self.mo = np.asarray(mo, dtype=float)  #: M at the overhang points (N m), as given
        self.norm = peak if scale is None else float(scale)  #: the geometric matrices are per norm N m
        m = Mg / self.norm
        M_tip = float(mo[-1]) / self.norm
        Ne, D1e, D2e, wh = _element_fns(h)
        # element blocks (e, 4, 4) by quadrature
        Kb = np.einsum("eg,egi,egj->eij", wh, D2e, D2e)  # int N'' N''
        K1 = np.einsum("eg,egi,egj->eij", wh, D1e, D1e)  # int N' N'
        wm = wh * m
        C = np.einsum("eg,egi,egj->eij", wm, D2e, Ne)  # int m u'' phi
        P1 = np.einsum("eg,egi,egj->eij", wm, D1e, D1e)  # int m phi' phi'
        Q = np.einsum("eg,egi,egj->eij", wm, Ne, D2e)  # int m phi phi''
        # global DOF numbers: node i -> 4i (u), 4i+1 (u'), 4i+2 (phi), 4i+3 (phi')
        e = np.arange(nn - 1)
        du = np.stack([4 * e, 4 * e + 1, 4 * e + 4, 4 * e + 5], 1)
        dp = du + 2
        ru, cu = du[:, :, None].repeat(4, 2), du[:, None, :].repeat(4, 1)
        rp, cp = dp[:, :, None].repeat(4, 2), dp[:, None, :].repeat(4, 1)
        K_u = _assemble(nn, Kb, ru, cu)  # times E I_z
        K_t = _assemble(nn, K1, rp, cp)  # times G I_t
        K_w = _assemble(nn, Kb, rp, cp)  # times E I_w
        Gc = _assemble(nn, C, du[:, :, None].repeat(4, 2), dp[:, None, :].repeat(4, 1))
        G_c = Gc + Gc.T  # 2 int m u'' phi
        G_1 = 2.0 * _assemble(nn, P1, rp, cp)  # 2 int m phi'^2 (times z_j + z_g)
        Gq = _assemble(nn, Q, rp, cp)
        Gq = Gq + Gq.T  # 2 int m phi phi'' (times z_g)
        it = 4 * (nn - 1) + 2  # phi, phi' at the free tip
        Gq[it, it + 1] -= M_tip
        Gq[it + 1, it] -= M_tip  # -2 m(tip) phi phi' (times z_g)
        full = (K_u, K_t, K_w, G_c, G_1, Gq)
        if self.back:
            ib = N_EL_BACK  # the root support node
            variants = {True: [0, 2, 4 * ib, 4 * ib + 2]}
        else:  # the root twist rate is free for I_w = 0, where warping restraint has no meaning
            variants = {True: [0, 1, 2, 3], False: [0, 1, 2]}
        self._reduced = {}
        self._split = {}
        for warp, fx in variants.items():
            keep = np.setdiff1d(np.arange(4 * nn), fx)
            ix = np.ix_(keep, keep)
            self._reduced[warp] = tuple(A[ix] for A in full)
            self._split[warp] = (np.nonzero(keep % 4 < 2)[0], np.nonzero(keep % 4 >= 2)[0])  # u and phi DOFs
        self._gup = {w: self._reduced[w][3][np.ix_(*self._split[w])] for w in self._reduced}  # u-phi block of G_c
        self._last = self._terms = self._base = None

    def _matrices(self, warp: bool):
        warp = warp if not self.back else True
        mats = self._reduced.get(warp)
        if mats is None:  # a combined model (:meth:`combine`): the geometric matrices summed now
            base = self._base._matrices(warp)
            G = [self._sum(lambda m, j=j: m._matrices(warp)[j], base[3]) for j in (3, 4, 5)]
            mats = self._reduced[warp] = (base[0], base[1], base[2], *G)
        return mats

    def _gup_of(self, warp: bool) -> np.ndarray:
        g = self._gup.get(warp)
        if g is None:
            if getattr(self, "_terms", None) is None:
                g = self._reduced[warp][3][np.ix_(*self._split[warp])]
            else:
                g = self._sum(lambda m: m._gup_of(warp), self._base._gup_of(warp))
            self._gup[warp] = g
        return g

    def _sum(self, get, like: np.ndarray) -> np.ndarray:
        out = None
        for a, m in self._terms:
            out = a * get(m) if out is None else out + a * get(m)
        return np.zeros_like(like) if out is None else out

    @classmethod
    def raw(cls, Lo: float, Mo, back=None) -> "OverhangModel":
        """A model of the diagram as given (not normalised, not cached, zero allowed): a term for
        :meth:`combine`. Arguments as for :func:`model`."""
        Lo, Lb = float(Lo), 0.0 if back is None else float(back[0])
        y, h, yg, over, s_o = _mesh(Lo, Lb)
        mo = np.asarray(Mo(s_o), dtype=float)
        mb = np.asarray(back[1](yg[~over]), dtype=float) if back is not None else np.empty(0)
        if not (np.all(np.isfinite(mo)) and np.all(np.isfinite(mb))):
            raise InputError("moment_diagram: the cantilever's moment diagram must give finite values")
        return cls(Lo, Lb, mo, mb, scale=1.0)

    @classmethod
    def combine(cls, terms) -> "OverhangModel":
        """The model of the diagram sum c_i M_i from models of the M_i on the same mesh (``terms``: pairs
        (c_i, model_i)); exact, as the geometric matrices are linear in the diagram and the stiffness does
        not depend on it. Normalised to the new peak |M| of the overhang, as :func:`model` does."""
        terms = [(float(c), m) for c, m in terms]
        m0 = terms[0][1]
        for _, m in terms[1:]:
            if (m.Lo, m.Lb) != (m0.Lo, m0.Lb):
                raise InputError("OverhangModel.combine: the models have different lengths")
        mo = sum(c * m.mo for c, m in terms)
        peak = float(np.max(np.abs(mo)))
        if not peak > 0:
            raise InputError("moment_diagram: got zero moment over the cantilever; no lateral-torsional buckling")
        new = cls.__new__(cls)
        new.Lo, new.Lb, new.back, new.y = m0.Lo, m0.Lb, m0.back, m0.y
        new.peak, new.mo, new.norm = peak, mo, peak
        new._split, new._last = m0._split, None
        new._reduced, new._gup = {}, {}
        new._terms = [(c * m.norm / peak, m) for c, m in terms if c]  # the sums are formed when first needed
        new._base = m0
        return new

    def describe(self) -> str:
        if self.back:
            return (f"overhang of {self.Lo:.4g} m solved with the {self.Lb:.4g} m segment behind its root support "
                    f"(lateral and torsional restraint at the support and at the far restraint, fork there; "
                    f"{N_EL_BACK} + {N_EL_OVERHANG} cubic elements)")
        return (f"cantilever of {self.Lo:.4g} m, built-in root (lateral bending and warping prevented), free tip "
                f"({N_EL_FIXED} cubic elements)")

    def mcr(self, EIz: float, GIt: float, EIw: float, zg: float = 0.0, zj: float = 0.0) -> float:
        """Critical value (N m) of the overhang's largest |M| (all transverse loads at height ``zg`` above
        the shear centre, positive upwards; ``zj`` positive when the top flange is the larger)."""
        key = (EIz, GIt, EIw, zg, zj)
        if self._last is not None and self._last[0] == key:  # the same section asked again (search, then check)
            return self._last[1]
        warp = bool(EIw > 0) or self.back
        if not (zg or zj):
            val = self._mcr_split(warp, EIz, GIt, EIw)
        else:
            Ku, Kt, Kw, Gc, G1, Gq = self._matrices(warp)
            G = Gc + (zj + zg) * G1
            if zg:
                G = G + zg * Gq
            d, Li = _factor_stiffness(self.Lo, self.Lb, warp, Ku, Kt, Kw, EIz, GIt, EIw)
            G = G * d[:, None] * d[None, :]
            S = Li @ G @ Li.T
            ev = eigvalsh(0.5 * (S + S.T))
            if not ev[0] < -1e-12:
                raise InputError("moment_diagram: no lateral-torsional buckling of the cantilever under this moment "
                                 "diagram")
            val = -1.0 / float(ev[0])
        self._last = (key, val)
        return val

    def _mcr_split(self, warp, EIz, GIt, EIw) -> float:
        """M_cr for z_g = z_j = 0: the stiffness is block diagonal (u | phi) and the geometric matrix only
        couples u and phi, so the eigenvalues of the scaled problem are +- the singular values of the
        scaled coupling block B and M_cr = 1 / sigma_max(B) (exactly the solution of the full problem)."""
        iu, ip = self._split[warp]
        root = self if self._base is None else self._base
        du, Lu, dp, Lp = _factor_blocks(self.Lo, self.Lb, warp, root, EIz, GIt, EIw, iu, ip)
        B = Lu @ (self._gup_of(warp) * du[:, None] * dp[None, :]) @ Lp.T
        H = B.T @ B if B.shape[1] <= B.shape[0] else B @ B.T
        smax = float(eigvalsh(0.5 * (H + H.T))[-1])
        if not smax > 1e-24:
            raise InputError("moment_diagram: no lateral-torsional buckling of the cantilever under this moment "
                             "diagram")
        return 1.0 / math.sqrt(smax)


_STIFF: dict = {}
_STIFF_MAX = 16


def _factor_stiffness(Lo, Lb, warp, Ku, Kt, Kw, EIz, GIt, EIw):
    """(d, L^-1) of the stiffness E I_z K_u + G I_t K_t + E I_w K_w scaled symmetrically by d = diag^-1/2
    (the u and phi rows differ by orders of magnitude), L its Cholesky factor. It depends on the mesh and
    the section only, so it is kept for the few last (mesh, section) pairs: the diagrams of one segment
    (every load arrangement) share it."""
    key = (Lo, Lb, warp, EIz, GIt, EIw)
    hit = _STIFF.get(key)
    if hit is not None:
        return hit
    K = EIz * Ku + GIt * Kt
    if EIw:
        K = K + EIw * Kw
    d = 1.0 / np.sqrt(np.diag(K))
    K = K * d[:, None] * d[None, :]
    try:
        Lc = np.linalg.cholesky(K)
    except np.linalg.LinAlgError:  # pragma: no cover - stiffness is positive definite for E I_z, G I_t > 0
        raise InputError("section: the stiffness of the cantilever model is not positive definite "
                         "(check E I_z, G I_t > 0)") from None
    out = (d, np.linalg.inv(Lc))
    if len(_STIFF) >= _STIFF_MAX:
        _STIFF.clear()
    _STIFF[key] = out
    return out


_BLOCKS: dict = {}


def _stiffness_blocks(Lo, Lb, warp, model, iu, ip):
    """The u and phi blocks of the section-independent stiffness matrices (K_u[u, u], K_t[phi, phi],
    K_w[phi, phi]) of a mesh: the same for every diagram and section, so sliced once per mesh."""
    key = (Lo, Lb, warp)
    hit = _BLOCKS.get(key)
    if hit is None:
        Ku, Kt, Kw = model._matrices(warp)[:3]
        uu, pp = np.ix_(iu, iu), np.ix_(ip, ip)
        hit = (Ku[uu], Kt[pp], Kw[pp])
        if len(_BLOCKS) >= _STIFF_MAX:
            _BLOCKS.clear()
        _BLOCKS[key] = hit
    return hit


def _gufuncs():
    """numpy's LAPACK gufuncs behind cholesky and inv without the wrappers' per-call checks (the same
    routines, so the same values; numpy.linalg where they are not available)."""
    try:
        from numpy.linalg import _umath_linalg as ul

        chol, inv = ul.cholesky_lo, ul.inv
        t = np.array([[4.0, 1.0], [1.0, 3.0]])
        if not (np.array_equal(chol(t, signature="d->d"), np.linalg.cholesky(t))
                and np.array_equal(inv(t, signature="d->d"), np.linalg.inv(t))):
            raise ValueError
    except Exception:  # pragma: no cover - depends on the numpy build
        return np.linalg.cholesky, np.linalg.inv

    def cholesky(a: np.ndarray) -> np.ndarray:
        with np.errstate(invalid="ignore"):
            c = chol(a, signature="d->d")
        return c if np.isfinite(c[-1, -1]) else np.linalg.cholesky(a)  # failure: let numpy raise

    return cholesky, lambda a: inv(a, signature="d->d")


_cholesky, _inv = _gufuncs()


def _factor_blocks(Lo, Lb, warp, model, EIz, GIt, EIw, iu, ip):
    """(d_u, L_u^-1, d_phi, L_phi^-1) of the u and phi blocks of the stiffness, scaled as in
    :func:`_factor_stiffness` (kept for the last few mesh and section pairs)."""
    key = ("split", Lo, Lb, warp, EIz, GIt, EIw)
    hit = _STIFF.get(key)
    if hit is not None:
        return hit
    Kuu, Ktp, Kwp = _stiffness_blocks(Lo, Lb, warp, model, iu, ip)
    out = []
    for K in (EIz * Kuu, GIt * Ktp + (EIw * Kwp if EIw else 0.0)):
        d = 1.0 / np.sqrt(np.diag(K))
        K = K * d[:, None] * d[None, :]
        try:
            Lc = _cholesky(K)
        except np.linalg.LinAlgError:  # pragma: no cover - positive definite for E I_z, G I_t > 0
            raise InputError("section: the stiffness of the cantilever model is not positive definite "
                             "(check E I_z, G I_t > 0)") from None
        out += [d, _inv(Lc)]
    if len(_STIFF) >= _STIFF_MAX:
        _STIFF.clear()
    _STIFF[key] = tuple(out)
    return _STIFF[key]


def gamma_cr(Mcr: float, L: float, EIz: float, GIt: float) -> float:
    """Dimensionless M_cr L / sqrt(E I_z G I_t) (Timoshenko and Gere's form of the cantilever results)."""
    return Mcr * L / math.sqrt(EIz * GIt)
