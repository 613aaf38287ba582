"""Welded plate girder proportioning: the lightest doubly symmetric I-girder from a stock of plates.

For a member (spans, supports, loads by case, bracing, grade, standard, deflection limits; the same
:class:`calckit.pick.Member` as the section search), every combination of

* web depth h_w from ``web_depth = (min, max)`` in ``depth_step`` steps,
* web thickness t_w and flange plates b_f x t_f from a stock list (:func:`plate_stock`; defaults are
  common practice: SI thicknesses 8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 100 mm and
  widths 200-600 mm in 50 mm steps, webs 8-25 mm; US thicknesses 3/8-1 in by 1/8 in and 1-1/4 - 3 in by
  1/4 in, widths 8-24 in by 2 in, webs 5/16-1 in by 1/16-1/8 in),
* intermediate transverse stiffeners: none, or panels no longer than a = (3.0, 2.0, 1.5, 1.0) h_w
  (``stiffeners = "allow"``; the member length divided into equal panels; pairs of plates flush with the
  flange edge, b_s = (b_f - t_w)/2 rounded down to 10 mm or 1/2 in, t_s the smallest stock plate with
  b_s/t_s <= 12: common practice; their mass is added),

is checked in increasing order of steel mass per length until the ``n_best`` lightest that pass every
check are found. Before its full check each proportion is screened with the design module's own
flexural check of the critical segment and load arrangement (a lower bound of its governing ratio), so
the many light proportions that fail lateral-torsional buckling cost one check each. Checks (the design modules, numeric path): the member check of the standard (bending,
lateral-torsional buckling, shear with or without stiffeners, AISC G2.3 stiffener requirements and F13.2
proportions; EN 1993-1-5 shear buckling), the flange-to-web fillet welds from the shear flow VQ/I
(:func:`calckit.design.flange_welds.design_flange_welds`, the smallest passing size), and deflection.

Pruning (fast, vectorised over every combination; only necessary conditions, so no passing girder is
lost): each candidate's own demands with its self-weight (exact: linear in the self-weight), against
upper bounds of the resistances: M <= (phi_b or 1/gamma_M0) Fy Zx (no flexural resistance of either
standard exceeds the plastic moment), V <= 0.6 Fy d t_w (AISC G2: Cv <= 1) or eta f_y h_w t_w /
(sqrt(3) gamma) (EN 1993-1-5 5.2(1)), and the deflection itself (exact, 1/EI). Thicknesses beyond the
grade's bands are left out.

A design aid only: proportions must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math
import time
from dataclasses import dataclass, field

import numpy as np

from .errors import InputError

__all__ = ["PlateStock", "plate_stock", "GirderCandidate", "ProportionResult", "proportion", "STIFFENER_RATIOS"]

_MM, _IN = 1e-3, 0.0254
RHO = 7850.0  #: steel density (kg/m3), as calckit.sections
G = 9.80665
#: stiffener spacings searched, as multiples of the web depth (common practice)
STIFFENER_RATIOS = (3.0, 2.0, 1.5, 1.0)
#: stiffener outstand-to-thickness ratio used to size them (common practice)
STIFFENER_BT = 12.0


@dataclass(frozen=True)
class PlateStock:
    """Plate sizes available (m): flange thicknesses and widths, web thicknesses; ``source`` says where
    the list comes from ("common practice" defaults or "given")."""

    thicknesses: tuple[float, ...]
    widths: tuple[float, ...]
    web_thicknesses: tuple[float, ...]
    source: str = "common practice"
    system: str = "SI"


def _lengths(v, name: str) -> tuple[float, ...]:
    from .units import to_si

    if isinstance(v, str) or not hasattr(v, "__iter__"):
        raise InputError(f"{name}: got {v!r}; expected a list of lengths such as ['10 mm', '12 mm']")
    out = sorted({round(float(to_si(x, "length", f"{name}[{i}]", allow_array=False)), 9) for i, x in enumerate(v)})
    if not out or out[0] <= 0:
        raise InputError(f"{name}: got {v!r}; expected a non-empty list of lengths > 0")
    return tuple(out)


def plate_stock(system: str = "SI", *, thicknesses=None, widths=None, web_thicknesses=None) -> PlateStock:
    """The plate stock: defaults of common practice for ``system`` "SI" or "US", or the lists given."""
    s = str(system).upper()
    if s not in ("SI", "US"):
        raise InputError(f"system: got {system!r}; expected 'SI' or 'US'")
    if s == "SI":
        t = tuple(v * _MM for v in (8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 100))
        b = tuple(v * _MM for v in range(200, 601, 50))
        tw = tuple(v * _MM for v in (8, 10, 12, 15, 20, 25))
    else:
        t = tuple(v * _IN for v in (3 / 8, 1 / 2, 5 / 8, 3 / 4, 7 / 8, 1, 1.25, 1.5, 1.75, 2, 2.25, 2.5, 2.75, 3))
        b = tuple(v * _IN for v in range(8, 25, 2))
        tw = tuple(v * _IN for v in (5 / 16, 3 / 8, 7 / 16, 1 / 2, 9 / 16, 5 / 8, 3 / 4, 7 / 8, 1))
    given = [x is not None for x in (thicknesses, widths, web_thicknesses)]
    t = t if thicknesses is None else _lengths(thicknesses, "thicknesses")
    b = b if widths is None else _lengths(widths, "widths")
    tw = tw if web_thicknesses is None else _lengths(web_thicknesses, "web_thicknesses")
    src = "common practice" if not any(given) else ("given" if all(given) else "given, with common-practice "
                                                                              "defaults for the rest")
    return PlateStock(t, b, tw, src, s)


@dataclass(frozen=True)
class GirderCandidate:
    """One girder proportion (SI: m, kg/m) and its checks.

    hw, tw: web depth and thickness; bf, tf: flange width and thickness (both flanges); d: overall
    depth; a: stiffener spacing (None: unstiffened); stiffener: (b_s, t_s) of each plate of a pair;
    weld: flange-to-web fillet size chosen (leg for AISC, throat for EN; 0 if not designed);
    mass_girder, mass_stiffeners, mass: kg/m; passed, ratio, governing, clause: as for a section;
    checks: (limit state, ratio) of every check.
    """

    hw: float
    tw: float
    bf: float
    tf: float
    d: float
    a: float | None
    stiffener: tuple[float, float] | None
    weld: float
    mass_girder: float
    mass_stiffeners: float
    mass: float
    passed: bool
    ratio: float
    governing: str
    clause: str = ""
    checks: tuple[tuple[str, float], ...] = ()

    def name(self, system: str = "SI") -> str:
        """'web 1400 x 12, flanges 400 x 25 mm' (or inches), with the stiffener spacing."""
        if system.upper() == "US":
            f = lambda v: f"{v / _IN:.4g}"  # noqa: E731
            u = "in"
        else:
            f = lambda v: f"{v * 1e3:.0f}"  # noqa: E731
            u = "mm"
        s = f"web {f(self.hw)} x {f(self.tw)}, flanges {f(self.bf)} x {f(self.tf)} {u}"
        if self.a is not None:
            s += f", stiffeners at {self.a:.3g} m"
        return s

    def section(self):
        """The :class:`calckit.PlateGirder`."""
        from .sections import PlateGirder

        return PlateGirder.from_si(self.d, self.tw, self.bf, self.tf, weld=self.weld, name=self.name())


@dataclass(frozen=True)
class ProportionResult:
    """Outcome of :func:`proportion`.

    best: the ``n_best`` lightest passing girders, lightest first (empty if none passes);
    chosen: the lightest (or None); stock: the plate stock searched; web_depths: h_w values (m);
    stiffener_options: spacings searched as multiples of h_w (None = unstiffened); n_combinations:
    proportions enumerated; n_pruned: rejected by the bounds; n_checked: fully checked; timings (s);
    notes; member: the member.
    """

    best: tuple[GirderCandidate, ...]
    stock: PlateStock
    web_depths: tuple[float, ...]
    stiffener_options: tuple
    n_combinations: int
    n_pruned: int
    n_checked: int
    elapsed: float
    timings: dict = field(default_factory=dict)
    notes: tuple[str, ...] = ()
    member: object = None
    rejected: tuple[GirderCandidate, ...] = ()

    @property
    def chosen(self) -> GirderCandidate | None:
        return self.best[0] if self.best else None

    def text(self, system: str = "SI") -> str:
        """A plain text table of the best girders."""
        if not self.best:
            return f"no girder passes ({self.n_checked} checked after pruning {self.n_pruned} of {self.n_combinations})"
        lines = [f"{'rank':<5}{'girder':<58}{'mass kg/m':>10}  {'governing check':<40}{'ratio':>6}"]
        for i, c in enumerate(self.best, 1):
            lines.append(f"{i:<5}{c.name(system):<58}{c.mass:>10.1f}  {c.governing[:39]:<40}{c.ratio:>6.2f}")
        return "\n".join(lines)


def _stiffener_size(bf, tw, stock: PlateStock):
    """(b_s, t_s) arrays: outstand flush with the flange edge rounded down to 10 mm (1/2 in), thickness the
    smallest stock plate with b_s / t_s <= STIFFENER_BT (common practice)."""
    step = 10 * _MM if stock.system == "SI" else 0.5 * _IN
    bs = np.maximum(np.floor(((np.asarray(bf) - np.asarray(tw)) / 2) / step + 1e-9) * step, step)
    ts_all = np.array(sorted(set(stock.thicknesses + stock.web_thicknesses)))
    k = np.searchsorted(ts_all, bs / STIFFENER_BT - 1e-12)
    ts = ts_all[np.minimum(k, len(ts_all) - 1)]
    return bs, ts


def _grid(m, stock: PlateStock, web_depth, depth_step, stiffeners):
    from .materials import steel
    from .units import to_si

    L = max(m.spans)
    if web_depth is None:
        lo, hi = L / 25, L / 8  # common practice range of girder depths
    else:
        if len(web_depth) != 2:
            raise InputError(f"web_depth: got {web_depth!r}; expected (min, max) lengths")
        lo = to_si(web_depth[0], "length", "web_depth[0]", allow_array=False)
        hi = to_si(web_depth[1], "length", "web_depth[1]", allow_array=False)
    step = (50 * _MM if stock.system == "SI" else 2 * _IN) if depth_step is None else \
        to_si(depth_step, "length", "depth_step", allow_array=False)
    if not (0 < lo <= hi) or not step > 0:
        raise InputError(f"web_depth: got {web_depth!r} with step {depth_step!r}; expected 0 < min <= max, step > 0")
    first = math.ceil(lo / step - 1e-9) * step
    hws = tuple(np.round(np.arange(first, hi + 1e-9, step), 9))
    if not hws:
        raise InputError(f"web_depth: no depth between {lo:.4g} m and {hi:.4g} m in steps of {step:.4g} m")
    st = steel(m.grade)
    tmax = st.bands[-1][0] * (1 + 1e-12)
    t_ok = tuple(t for t in stock.thicknesses if t <= tmax)
    tw_ok = tuple(t for t in stock.web_thicknesses if t <= tmax)
    if not t_ok or not tw_ok:
        raise InputError(f"stock: no plate of the stock is within the thickness bands of {st.name}")
    if stiffeners in (None, "none", False):
        opts: tuple = (None,)
    elif stiffeners == "allow":
        opts = (None,) + STIFFENER_RATIOS
    else:
        try:
            opts = tuple(None if r is None else float(r) for r in stiffeners)
        except (TypeError, ValueError):
            raise InputError(f"stiffeners: got {stiffeners!r}; expected 'none', 'allow' or a list of a/h_w "
                             "ratios (None for unstiffened)") from None
        if not opts or any(r is not None and not r > 0 for r in opts):
            raise InputError(f"stiffeners: got {stiffeners!r}; expected a/h_w ratios > 0")
    return hws, tw_ok, t_ok, opts, st


def proportion(member=None, /, *, web_depth=None, depth_step=None, stock: PlateStock | None = None,
               stiffeners="none", n_best: int = 5, max_checks: int = 3000, tf_min_over_tw: float = 1.0,
               system: str | None = None, **member_kw) -> ProportionResult:
    """The ``n_best`` lightest welded plate girders from ``stock`` that pass every check (module docstring).

    ``member``: a :class:`calckit.pick.Member` or the keywords of :func:`calckit.pick.member`;
    ``web_depth``: (min, max) web depth (default span/25 to span/8, common practice); ``depth_step``
    (default 50 mm / 2 in); ``stock``: :func:`plate_stock` (default common practice for ``system``, SI
    for EN 1993-1-1, US for AISC 360-22); ``stiffeners``: "none", "allow" (spacings of
    :data:`STIFFENER_RATIOS`) or a list of a/h_w ratios (None = unstiffened); ``tf_min_over_tw``:
    flanges at least this multiple of the web thickness (common practice 1.0); ``max_checks``: stop after
    this many full checks (the result says so).
    """
    from .pick.member import AISC, Member, member as make_member
    from .pick.response import Response

    t0 = time.perf_counter()
    m = member if isinstance(member, Member) else make_member(member_kw.pop("spans"), member_kw.pop("supports", None),
                                                               **member_kw)
    if stock is None:
        stock = plate_stock(system or ("US" if m.standard == AISC else "SI"))
    if not isinstance(n_best, int) or n_best < 1:
        raise InputError(f"n_best: got {n_best!r}; expected a whole number >= 1")
    hws, tws, tfs, opts, st = _grid(m, stock, web_depth, depth_step, stiffeners)
    bfs = stock.widths
    # every combination, vectorised: axes (hw, tw, bf, tf, stiffener option)
    H, TW, BF, TF, K = np.meshgrid(np.array(hws), np.array(tws), np.array(bfs), np.array(tfs),
                                   np.arange(len(opts)), indexing="ij")
    H, TW, BF, TF, K = (a.ravel() for a in (H, TW, BF, TF, K))
    keep = (TF >= tf_min_over_tw * TW - 1e-12) & (BF > TW)
    H, TW, BF, TF, K = H[keep], TW[keep], BF[keep], TF[keep], K[keep]
    n_comb = int(keep.size)
    ratio = np.array([np.nan if r is None else r for r in opts])[K]
    a = H * ratio
    a = m.L / np.ceil(m.L / a - 1e-9)  # equal panels along the member, none longer than ratio x h_w
    stiffened = any(o is not None for o in opts)
    BS, TS = _stiffener_size(BF, TW, stock) if stiffened else (None, None)
    m_st = np.zeros_like(H)
    if stiffened:
        m_st = np.where(np.isnan(a), 0.0, 2 * BS * TS * H * RHO / np.where(np.isnan(a), 1.0, a))
    A = H * TW + 2 * BF * TF
    mass_g = A * RHO
    mass = mass_g + m_st
    D = H + 2 * TF
    Ix = TW * H ** 3 / 12 + 2 * (BF * TF ** 3 / 12 + BF * TF * ((H + TF) / 2) ** 2)
    Zx = BF * TF * (H + TF) + TW * H ** 2 / 4
    t1 = time.perf_counter()
    resp = Response(m, w_ref=float(np.median(mass) * G))
    ok = _bounds(m, resp, st, mass * G, st.E_si * Ix, Zx, D, H, TW, TF)
    n_pruned = int((~ok).sum())
    order = np.lexsort((D[ok], mass[ok]))
    idx = np.nonzero(ok)[0][order]
    t2 = time.perf_counter()
    best, rejected, n_checked, n_screened = [], [], 0, 0
    from .pick.checks import checker_for

    check = checker_for(m)
    for i in idx:
        if len(best) >= n_best or n_checked >= max_checks:
            break
        k = int(K[i])
        sz = None if opts[k] is None else (float(BS[i]), float(TS[i]))
        args = (float(H[i]), float(TW[i]), float(BF[i]), float(TF[i]), None if opts[k] is None else float(a[i]),
                sz, float(mass_g[i]), float(m_st[i]))
        worst = _screen(m, resp, st, *args)
        if worst is not None:
            n_screened += 1
            if len(rejected) < 20:
                rejected.append(worst)
            continue
        n_checked += 1
        cand = _full_check(m, resp, check, st, *args)
        (best if cand.passed else rejected).append(cand)
    t3 = time.perf_counter()
    notes = [f"plate stock: {stock.source}; web depths {hws[0]:.4g} to {hws[-1]:.4g} m",
             "doubly symmetric girders; flange-to-web welds: the smallest size meeting strength and the code "
             "minimum; weld metal not included in the mass",
             f"pruning by necessary conditions (plastic moment, unbuckled shear yield, exact deflection): "
             f"{n_pruned} of {n_comb} proportions rejected before the full checks",
             f"screening by the critical flexural check (the design module's own check of the segment and "
             f"load arrangement with the largest moment, a necessary condition): {n_screened} rejected"]
    if any(o is not None for o in opts):
        notes.append(f"stiffener pairs sized by common practice (flush with the flange edge, b_s/t_s <= "
                     f"{STIFFENER_BT:g}); their mass is included (bearing stiffeners at supports are not)")
        if m.standard != AISC:
            notes.append("EN 1993-1-5 9.3.3 requirements for the intermediate stiffeners are not checked by "
                         "calckit; check the stiffeners chosen")
    if n_checked >= max_checks and len(best) < n_best:
        notes.append(f"stopped after max_checks = {max_checks} full checks; widen the limit for more results")
    return ProportionResult(tuple(best), stock, hws, opts, n_comb, n_pruned, n_checked, t3 - t0,
                            {"enumerate": t1 - t0, "bounds": t2 - t1, "checks": t3 - t2}, tuple(notes), m,
                            tuple(rejected[:20]))


def _peak(hi, lo, f, unit, w, chunk: int = 4096):
    """max over combinations and stations of |value + f w unit| for each w (exact; chunked)."""
    out = np.empty(w.size)
    for s in range(0, w.size, chunk):
        ww = w[s:s + chunk][:, None, None] * f[None, :, None]
        H = hi[None] + ww * unit[None, None, :]
        Lo = lo[None] + ww * unit[None, None, :]
        out[s:s + chunk] = np.maximum(H.max(axis=(1, 2)), -Lo.min(axis=(1, 2)))
    return out


def _bounds(m, resp, st, w, EI, Zx, D, H, TW, TF) -> np.ndarray:
    """Necessary conditions (module docstring) for every proportion: True = worth a full check."""
    from .pick.member import AISC

    uniq, inv = np.unique(np.round(w, 6), return_inverse=True)
    S = resp.S
    M = _peak(*S["M"][:2], S["f"], S["M"][2], uniq)[inv]
    V = _peak(*S["V"][:2], S["f"], S["V"][2], uniq)[inv]
    fy_max = st.bands[0][1]
    if m.standard == AISC:
        from .design.aisc360._core import factor_of

        phi_b = factor_of("flexure", m.method)
        Vcap = 0.6 * fy_max * D * TW  # AISC G2.1: Vn = 0.6 Fy Aw Cv1 <= 0.6 Fy d tw; phi_v <= 1.0
        Mcap = phi_b * fy_max * Zx
    else:
        from .design.en1993.factors import annex_set

        ann = annex_set(m.annex)
        Mcap = fy_max * Zx / ann.gamma_M0
        Vcap = ann.eta * fy_max * H * TW / (math.sqrt(3) * min(ann.gamma_M0, ann.gamma_M1))
    ok = (M <= Mcap * (1 + 1e-9)) & (V <= Vcap * (1 + 1e-9))
    for D_, div in ((resp.DL, m.defl_live), (resp.DT, m.defl_total)):
        if D_ is None or not div:
            continue
        hi, lo, u = D_["defl"]
        for sp, Ls in enumerate(m.spans):
            cols = resp.span_of_station == sp
            peak = _peak(hi[:, cols], lo[:, cols], D_["f"], u[cols], uniq)[inv] * resp.EI_ref / EI
            length = 2 * Ls if m.span_is_cantilever(sp) else Ls
            ok &= peak <= length / div * (1 + 1e-9)
    return ok


def _critical(m, resp, w: float):
    """(diagram M on resp.x, station index of |M| max, segment (a, b) or None, diagram name) of the load
    arrangement with the largest moment, with self-weight w (N/m)."""
    A = resp.A
    Ms = A["M"] + A["f"][:, None] * w * resp.S["M"][2][None, :]
    k, j = np.unravel_index(int(np.argmax(np.abs(Ms))), Ms.shape)
    xj = float(resp.x[j])
    seg = None
    for a, b in m.segments():
        if a - 1e-9 <= xj <= b + 1e-9:
            seg = (a, b)
            break
    return Ms[k], int(j), seg, A["names"][k]


def _screen(m, resp, st, hw, tw, bf, tf, a, stiff, mass_g, mass_st) -> GirderCandidate | None:
    """The design module's flexural check of the critical segment and arrangement (a lower bound of the
    governing ratio); a candidate that fails it is returned (rejected), else None."""
    from .pick.member import AISC
    from .sections import PlateGirder
    from .units import quantity

    d = hw + 2 * tf
    pg = PlateGirder.from_si(d, tw, bf, tf, name="girder")
    M, j, seg, name = _critical(m, resp, (mass_g + mass_st) * G)
    peak = abs(float(M[j]))
    Mq = quantity(peak, "moment")
    if m.standard == AISC:
        from .design import aisc360

        if seg is None:
            r = aisc360.flexure(pg, st, Lb=0, method=m.method, Mu=Mq, compression="top" if M[j] > 0 else "bottom",
                                steps=False)
        else:
            sa, sb = seg
            q = [abs(float(np.interp(sa + f * (sb - sa), resp.x, M))) for f in (0.25, 0.5, 0.75)]
            Cb = aisc360.cb(peak, *q)
            free = _free_segment(m, seg)  # Cb = 1 for an unbraced free end only (AISC 360-22 F1 User Note)
            r = aisc360.flexure(pg, st, Lb=quantity(sb - sa, "span"), Cb=1.0 if free else Cb, method=m.method,
                                Mu=Mq, compression="top" if M[j] > 0 else "bottom", steps=False)
    else:
        from .design import en1993

        r = en1993.bending(pg, st, M_Ed=quantity(float(M[j]), "moment"), annex=m.annex, steps=False)
        if seg is not None and r.ratio <= 1.0 and not _free_segment(m, seg):  # (forks: a cantilever's M_cr is
            # not bounded by the fork model, so its LTB is left to the full check)
            sa, sb = seg
            inside = (resp.x > sa) & (resp.x < sb)
            xs = np.concatenate(([sa], resp.x[inside], [sb]))
            Ms = np.concatenate(([np.interp(sa, resp.x, M)], M[inside], [np.interp(sb, resp.x, M)]))
            r = en1993.ltb(pg, st, L=quantity(sb - sa, "span"), moment_diagram=(xs - sa, Ms), annex=m.annex,
                           steps=False)
    if r.ratio <= 1.0 + 1e-9:
        return None
    return GirderCandidate(hw, tw, bf, tf, d, a, stiff, 0.0, mass_g, mass_st, mass_g + mass_st, False,
                           float(r.ratio), r.limit_state, r.clause, ((r.limit_state + " (screening)", float(r.ratio)),))


def _free_segment(m, seg) -> bool:
    """True when the unbraced segment ends at a free member end (a cantilever or an overhang)."""
    tol = 1e-9 * m.L
    free = [isinstance(s, str) and s == "free" for s in m.supports]
    return (seg[0] <= tol and free[0]) or (seg[1] >= m.L - tol and free[-1])


def _full_check(m, resp, check, st, hw, tw, bf, tf, a, stiff, mass_g, mass_st) -> GirderCandidate:
    from .design.flange_welds import design_flange_welds
    from .pick.member import AISC
    from .sections import PlateGirder
    from .units import Q_

    d = hw + 2 * tf
    pg = PlateGirder.from_si(d, tw, bf, tf, name="girder")
    w = (mass_g + mass_st) * G
    dem = resp.demands(np.array([w]), np.array([st.E_si * pg.si.Ix]))[0]
    extra: dict = {}
    if a is not None:
        if m.standard == AISC:
            n = max(int(round(m.L / a)), 1)
            extra = {"stiffeners": [i * m.L / n for i in range(n + 1)],
                     "stiffener": (Q_(stiff[0], "m"), Q_(stiff[1], "m"))}
        else:
            extra = {"a": Q_(a, "m")}
    res = check(m, pg, dem, False, **extra)
    checks = list(res.checks)
    weld = 0.0
    if res.passed:
        std = "AISC 360-22" if m.standard == AISC else "EN 1993-1-8"
        wd = design_flange_welds(pg, (dem.x, dem.V_max, dem.V_min, dem.M_max, dem.M_min), steel=m.grade,
                                 standard=std, method=m.method if m.standard == AISC else None, steps=False)
        checks += list(wd.checks)
        weld = max(j.size for j in wd.junctions)
    rated = [c for c in checks if c.ratio is not None]
    g = max(rated, key=lambda c: c.ratio) if rated else None
    passed = all(c.passed is not False for c in checks)
    return GirderCandidate(hw, tw, bf, tf, d, a, stiff, weld, mass_g, mass_st, mass_g + mass_st, passed,
                           float(g.ratio) if g else 0.0, g.limit_state if g else "", g.clause if g else "",
                           tuple((c.limit_state, float(c.ratio)) for c in rated))
