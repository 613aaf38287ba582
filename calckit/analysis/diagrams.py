"""Printable beam diagrams: loading, shear, moment (envelope shaded, extrema labelled) and deflection
with the limit line. Black on white with one light grey fill; every function returns a
``matplotlib.figure.Figure`` made without pyplot (no global state, safe under the Agg backend and in
notebooks).

Units: ``system="SI"`` (kN, m, kN*m, mm, kN/m) or ``"US"`` (kip, ft, kip*ft, in, kip/ft), from
:func:`calckit.units.display_unit`. Moments are drawn sagging-positive upward; deflection is drawn
downward, as the beam moves, with downward-positive values in the labels.

matplotlib is imported inside the functions only.
"""
from __future__ import annotations

import numpy as np

from ..errors import InputError
from .loads import Couple, LinearLoad, PointLoad

__all__ = ["loading_diagram", "shear_diagram", "moment_diagram", "deflection_diagram", "beam_diagrams"]

_FILL = "0.87"


def _units(system: str) -> dict:
    from ..units import convert, display_unit

    if not isinstance(system, str) or system.upper() not in ("SI", "US"):
        raise InputError(f"system: got {system!r}; expected 'SI' or 'US'")
    out = {}
    for dim in ("span", "force", "moment", "deflection", "line_load"):
        unit = display_unit(dim, system)
        out[dim] = (unit.replace("**2", "²").replace("*", "·"), convert(1.0, dim, unit))
    return out


def _figure(n: int, heights=None, width: float = 8.0):
    from matplotlib.figure import Figure

    heights = heights or [1.0] * n
    fig = Figure(figsize=(width, 2.4 * sum(heights)), facecolor="white")
    axes = fig.subplots(n, 1, sharex=True, squeeze=False, gridspec_kw={"height_ratios": heights})[:, 0]
    for ax in axes:
        ax.set_facecolor("white")
        ax.tick_params(labelsize=8)
    return fig, list(axes)


def _curve(result, attr: str, n: int = 80):
    """x (m) with both sides of every grid node, and the values of a result's polynomial."""
    from .piecewise import evaluate

    g = result.grid
    xs, segs = [], []
    for k in range(len(g.h)):
        t = np.linspace(g.x[k], g.x[k + 1], max(2, int(np.ceil(n * g.h[k] / g.x[-1])) + 1))
        xs.append(t)
        segs.append(np.full(t.size, k))
    x, seg = np.concatenate(xs), np.concatenate(segs)
    return x, evaluate(g.x, getattr(result, attr), x, seg=seg)


def _mark(ax, x, y, text, above: bool):
    ax.plot([x], [y], marker="o", ms=3, color="black", zorder=6)
    ax.annotate(text, (x, y), fontsize=7, ha="center", va="bottom" if above else "top",
                xytext=(0, 4 if above else -4), textcoords="offset points")


def _label_max_min(ax, x, hi, lo, name, unit, scale_ref, flip=False):
    """Mark the top of ``hi`` and the bottom of ``lo`` (plotted values). With ``flip`` the plot shows
    -deflection, and the labels give the deflection itself (downward positive)."""
    i, j = int(np.argmax(hi)), int(np.argmin(lo))
    tol = 1e-9 * max(scale_ref, 1e-300)
    if hi[i] > tol:
        txt = (f"{name} = {-hi[i]:.3g} {unit} (up)" if flip else f"{name}max = {hi[i]:.3g} {unit}")
        _mark(ax, x[i], hi[i], f"{txt}\nat x = {x[i]:.3g}", True)
    if lo[j] < -tol:
        txt = (f"{name} = {-lo[j]:.3g} {unit} (down)" if flip else f"{name}min = {lo[j]:.3g} {unit}")
        _mark(ax, x[j], lo[j], f"{txt}\nat x = {x[j]:.3g}", False)


def _draw_supports(ax, supports, hinges, fx, sx, sy):
    """Support symbols below the beam line (y = 0); sx, sy: symbol size in x and y data units."""
    for sup in supports:
        x = sup.x * fx
        if sup.kind in ("pin", "roller"):
            ax.fill([x, x - sx, x + sx], [0, -1.6 * sy, -1.6 * sy], facecolor="white", edgecolor="black", lw=1,
                    zorder=4)
            y = -2.0 * sy if sup.kind == "roller" else -1.6 * sy
            ax.plot([x - 1.3 * sx, x + 1.3 * sx], [y, y], color="black", lw=1.4 if sup.kind == "pin" else 1)
        elif sup.kind == "fixed":
            end = -1 if sup.index == 0 else (1 if sup.index == len(supports) - 1 else 0)
            if end:
                ax.plot([x, x], [-2 * sy, 2 * sy], color="black", lw=2)
                for yy in np.linspace(-2 * sy, 1.4 * sy, 6):
                    ax.plot([x, x + end * 0.6 * sx], [yy, yy + 0.6 * sy], color="black", lw=0.7)
            else:
                ax.fill([x - sx, x + sx, x + sx, x - sx], [-2 * sy, -2 * sy, 2 * sy, 2 * sy], facecolor="white",
                        edgecolor="black", hatch="////", lw=1, zorder=4)
        elif sup.kind == "spring":
            zz = np.linspace(0, -2.4 * sy, 9)
            xx = x + np.array([0, -0.5, 0.5, -0.5, 0.5, -0.5, 0.5, -0.5, 0]) * sx
            ax.plot(xx, zz, color="black", lw=1)
            ax.plot([x - sx, x + sx], [-2.4 * sy] * 2, color="black", lw=1.4)
    for xh in hinges:
        ax.plot([xh * fx], [0], marker="o", ms=6, color="black", mfc="white", mec="black", zorder=6)


def _draw_loading(ax, beam, cases, u):
    lay = beam.layout
    fx, ff, fw, fm = u["span"][1], u["force"][1], u["line_load"][1], u["moment"][1]
    L = lay.L * fx
    band, gap = 1.0, 0.3
    ax.plot([0, L], [0, 0], color="black", lw=3, solid_capstyle="butt", zorder=5)
    for i, case in enumerate(cases):
        y0 = 0.3 + i * (band + gap)
        loads = beam.loads_in(case)
        wref = max([max(abs(ld.w1), abs(ld.w2)) for ld in loads if isinstance(ld, LinearLoad)] or [1.0])
        ax.text(-0.015 * L, y0 + 0.35 * band, case, ha="right", va="center", fontsize=9, fontweight="bold")
        for ld in loads:
            if isinstance(ld, LinearLoad):
                a, b = ld.start * fx, ld.end * fx
                h1, h2 = 0.55 * band * ld.w1 / wref, 0.55 * band * ld.w2 / wref
                ax.fill([a, b, b, a], [y0, y0, y0 + h2, y0 + h1], facecolor="white", edgecolor="black", lw=0.8)
                for xa in np.linspace(a, b, max(2, int(10 * (b - a) / L) + 2)):
                    ha = h1 + (h2 - h1) * (xa - a) / (b - a)
                    if abs(ha) > 1e-6:
                        ax.annotate("", xy=(xa, y0), xytext=(xa, y0 + ha),
                                    arrowprops=dict(arrowstyle="-|>", color="black", lw=0.6, shrinkA=0, shrinkB=0))
                val = f"{ld.w1 * fw:.3g}" if ld.w1 == ld.w2 else f"{ld.w1 * fw:.3g} to {ld.w2 * fw:.3g}"
                ax.text(a + 0.005 * L, y0 + max(h1, h2, 0.0) + 0.04, f"{val} {u['line_load'][0]}",
                        ha="left", va="bottom", fontsize=7)
            elif isinstance(ld, PointLoad):
                x, top = ld.x * fx, y0 + 0.75 * band
                tail, head = (top, y0) if ld.P >= 0 else (y0, top)
                ax.annotate("", xy=(x, head), xytext=(x, tail),
                            arrowprops=dict(arrowstyle="-|>", color="black", lw=1.2, shrinkA=0, shrinkB=0))
                ax.text(x, top + 0.03, f"{ld.P * ff:.3g} {u['force'][0]}", ha="center", va="bottom", fontsize=7)
            elif isinstance(ld, Couple):
                x = ld.x * fx
                ax.annotate("", xy=(x + 0.02 * L, y0 + 0.25), xytext=(x - 0.02 * L, y0 + 0.25),
                            arrowprops=dict(arrowstyle="-|>", color="black", lw=1,
                                            connectionstyle=f"arc3,rad={-0.9 if ld.M >= 0 else 0.9}"))
                ax.text(x, y0 + 0.5, f"{ld.M * fm:.3g} {u['moment'][0]}", ha="center", va="bottom", fontsize=7)
    top = 0.3 + max(1, len(cases)) * (band + gap)
    ax.set_ylim(-0.4, top)
    _draw_supports(ax, lay.supports, lay.hinges, fx, 0.012 * L, 0.09)
    ax.set_xlim(-0.06 * L, 1.04 * L)
    ax.set_yticks([])
    for side in ("left", "right", "top"):
        ax.spines[side].set_visible(False)


def _draw_quantity(ax, result, envelope, attr, key, dim, u, ylabel, name, flip=False):
    fx, fq = u["span"][1], u[dim][1]
    sg = -1.0 if flip else 1.0
    unit = u[dim][0]
    if result is None and envelope is None:
        raise InputError("result/envelope: got neither; expected a BeamResult or an Envelope to draw")
    if envelope is not None:
        x = envelope.x * fx
        hi, lo = getattr(envelope, f"{key}_max") * fq, getattr(envelope, f"{key}_min") * fq
        ax.fill_between(x, sg * lo, sg * hi, facecolor=_FILL, edgecolor="none", zorder=1)
        ax.plot(x, sg * hi, color="black", lw=0.9)
        ax.plot(x, sg * lo, color="black", lw=0.9)
        ref = max(np.max(np.abs(hi)), np.max(np.abs(lo)))
        _label_max_min(ax, x, np.maximum(sg * lo, sg * hi), np.minimum(sg * lo, sg * hi), name, unit, ref, flip)
    if result is not None:
        x, y = _curve(result, attr)
        x, y = x * fx, y * fq
        ax.plot(x, sg * y, color="black", lw=1.5)
        if envelope is None:
            ax.fill_between(x, 0, sg * y, facecolor=_FILL, edgecolor="none", zorder=1)
            ref = np.max(np.abs(y)) if y.size else 0.0
            _label_max_min(ax, x, sg * y, sg * y, name, unit, ref, flip)
    ax.axhline(0.0, color="black", lw=0.8)
    ax.set_ylabel(f"{ylabel} ({unit})", fontsize=8)
    ax.margins(y=0.3)
    title = (result.name if result is not None else "") + (" / " if result is not None and envelope is not None else "")
    if envelope is not None:
        title += f"envelope of {len(envelope.combinations)} combination(s)"
    ax.set_title(title, fontsize=8, loc="right")


def _nodes_kinds(result, envelope):
    if result is not None:
        return np.asarray(result.layout.nodes), tuple(s.kind for s in result.layout.supports)
    return np.asarray(envelope.nodes), tuple(envelope.support_kinds)


def _draw_limit(ax, result, envelope, limit, u):
    from ..units import to_si

    fx, fd, unit = u["span"][1], u["deflection"][1], u["deflection"][0]
    nodes, kinds = _nodes_kinds(result, envelope)
    for i in range(len(nodes) - 1):
        a, b = nodes[i], nodes[i + 1]
        if isinstance(limit, (int, float)) and not isinstance(limit, bool):
            if not limit > 0:
                raise InputError(f"limit: got {limit!r}; expected n > 0 for span/n, or a deflection such as '20 mm'")
            cant = "free" in (kinds[i], kinds[i + 1])
            lim = (2.0 if cant else 1.0) * (b - a) / limit
            txt = f"{'2' if cant else ''}L/{limit:g} = {lim * fd:.3g} {unit}"
        else:
            lim = float(to_si(limit, "deflection", "limit", allow_array=False))
            txt = f"limit {lim * fd:.3g} {unit}"
        ax.plot([a * fx, b * fx], [-lim * fd] * 2, color="black", lw=1, ls="--")
        ax.text(0.5 * (a + b) * fx, -lim * fd, txt, fontsize=7, ha="center", va="top")


def loading_diagram(beam, cases=None, system: str = "SI"):
    """The beam with supports, hinges and the loads of ``cases`` (default all), one band per case."""
    u = _units(system)
    cases = beam.cases if cases is None else ([cases] if isinstance(cases, str) else list(cases))
    for c in cases:
        beam.loads_in(c)  # raises InputError for an unknown case
    fig, (ax,) = _figure(1, [0.5 + 0.45 * max(1, len(cases))])
    _draw_loading(ax, beam, cases, u)
    ax.set_xlabel(f"x ({u['span'][0]})", fontsize=8)
    ax.set_title(beam.name or "Loads (downward positive; couples clockwise positive)", fontsize=8, loc="left")
    fig.tight_layout()
    return fig


def shear_diagram(result=None, envelope=None, system: str = "SI"):
    """Shear V(x) of a result and/or the V envelope (shaded between V_min and V_max)."""
    u = _units(system)
    fig, (ax,) = _figure(1)
    _draw_quantity(ax, result, envelope, "Vc", "V", "force", u, "shear V", "V")
    ax.set_xlabel(f"x ({u['span'][0]})", fontsize=8)
    fig.tight_layout()
    return fig


def moment_diagram(result=None, envelope=None, system: str = "SI"):
    """Bending moment M(x), sagging positive upward; an envelope is shaded between M_min and M_max."""
    u = _units(system)
    fig, (ax,) = _figure(1)
    _draw_quantity(ax, result, envelope, "Mc", "M", "moment", u, "moment M, sagging +", "M")
    ax.set_xlabel(f"x ({u['span'][0]})", fontsize=8)
    fig.tight_layout()
    return fig


def deflection_diagram(result=None, envelope=None, limit=None, system: str = "SI"):
    """Deflection, drawn downward, with the limit line(s) (dashed).

    limit: a number n for span/n in each span (e.g. 360; 2 x length / n for a span with a free end,
    common practice for cantilevers), or a deflection quantity such as "20 mm"; None for no line.
    """
    u = _units(system)
    fig, (ax,) = _figure(1)
    _draw_quantity(ax, result, envelope, "deltac", "defl", "deflection", u, "deflection, down +", "δ", flip=True)
    if limit is not None:
        _draw_limit(ax, result, envelope, limit, u)
    ax.set_xlabel(f"x ({u['span'][0]})", fontsize=8)
    fig.tight_layout()
    return fig


def beam_diagrams(beam, result=None, envelope=None, limit=None, system: str = "SI", cases=None):
    """Loading, shear, moment and deflection on one page (four panels on one x axis)."""
    u = _units(system)
    cases = beam.cases if cases is None else ([cases] if isinstance(cases, str) else list(cases))
    fig, axes = _figure(4, [0.5 + 0.45 * max(1, len(cases)), 1, 1, 1])
    _draw_loading(axes[0], beam, cases, u)
    axes[0].set_title(beam.name or "Loads (downward positive; couples clockwise positive)", fontsize=8, loc="left")
    _draw_quantity(axes[1], result, envelope, "Vc", "V", "force", u, "shear V", "V")
    _draw_quantity(axes[2], result, envelope, "Mc", "M", "moment", u, "moment M, sagging +", "M")
    _draw_quantity(axes[3], result, envelope, "deltac", "defl", "deflection", u, "deflection, down +", "δ",
                   flip=True)
    if limit is not None:
        _draw_limit(axes[3], result, envelope, limit, u)
    axes[3].set_xlabel(f"x ({u['span'][0]})", fontsize=8)
    fig.align_ylabels(axes)
    fig.tight_layout()
    return fig
