"""Figures for stresses through the depth, shear flow along the member, welds, fasteners and cover plates.

matplotlib is imported when a figure is made (never at ``import calckit``). Figures are built on
``matplotlib.figure.Figure`` directly, without pyplot, so they work with any backend (Agg included) and do
not change it; a notebook shows a returned Figure inline. Plain black on white: line styles, not
colours, tell curves apart; fills are light grey. Values are drawn in the display units of ``system``
("SI" or "US", :func:`calckit.units.display_unit`), converted from the SI floats of the results; nothing
is computed here.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import math

import numpy as np

__all__ = ["stress_figure", "draw_section", "shear_flow_figure", "weld_figure", "fastener_figure",
           "cover_plate_figure"]

_STYLES = ("-", "--", ":", "-.")
_GREY = "0.85"


def _conv(values, dim: str, system: str):
    from ..render.numfmt import display_unit_for, si_to_display, unit_text

    unit = display_unit_for(dim, system)
    return np.asarray(si_to_display(np.asarray(values, dtype=float), dim, unit)), unit_text(unit)


def _figure(w: float, h: float):
    from matplotlib.figure import Figure

    fig = Figure(figsize=(w, h), facecolor="white")
    return fig


def _style(ax) -> None:
    ax.set_facecolor("white")
    for sp in ax.spines.values():
        sp.set_color("black")
    ax.tick_params(colors="black", labelsize=8)


def draw_section(ax, outline, scale: float = 1.0) -> None:
    """Draw ``Section.outline()`` primitives on ``ax`` (painter's order: holes and negative fillets white);
    coordinates are multiplied by ``scale`` (SI m -> display unit)."""
    from matplotlib.patches import Polygon, Rectangle

    for kind, p in outline:
        if kind == "rect":
            x0, x1, y0, y1, sign = p
            ax.add_patch(Rectangle((x0 * scale, y0 * scale), (x1 - x0) * scale, (y1 - y0) * scale,
                                   facecolor=_GREY if sign > 0 else "white", edgecolor="black", linewidth=0.6))
        else:
            xc, yc, r, sx, sy, sign = p
            t = np.linspace(0.0, math.pi / 2, 12)
            cx, cy = xc + sx * r, yc + sy * r
            arc = np.column_stack((cx - sx * r * np.sin(t), cy - sy * r * np.cos(t)))
            pts = np.vstack(([[xc, yc]], arc)) * scale
            ax.add_patch(Polygon(pts, closed=True, facecolor=_GREY if sign > 0 else "white",
                                 edgecolor=_GREY if sign > 0 else "white", linewidth=0.6))
    ax.set_aspect("equal", adjustable="datalim")
    ax.autoscale_view()


def stress_figure(profile, system: str = "SI"):
    """The section beside sigma(y) and tau(y) of a :class:`calckit.design.stress.StressProfile`."""
    y, yu = _conv(profile.y, "length", system)
    sig, su = _conv(profile.sigma, "stress", system)
    tau, tu = _conv(profile.tau, "stress", system)
    yc = float(_conv([profile.y_c], "length", system)[0][0])
    scale = float(_conv([1.0], "length", system)[0][0])
    fig = _figure(9.0, 4.2)
    axs = fig.subplots(1, 3, sharey=True, gridspec_kw={"width_ratios": [1.0, 1.3, 1.3], "wspace": 0.08})
    ax0, ax1, ax2 = axs
    for ax in axs:
        _style(ax)
        ax.axhline(yc, color="black", linestyle="--", linewidth=0.7)
    draw_section(ax0, profile.outline, scale)
    ax0.set_ylabel(f"y from the bottom fibre [{yu}]", fontsize=8)
    ax0.set_title(profile.section, fontsize=9)
    ax0.text(ax0.get_xlim()[1], yc, " NA", va="bottom", ha="right", fontsize=8)
    ax0.set_xticks([])
    for ax, v, u, title in ((ax1, sig, su, "normal stress (tension +)"), (ax2, tau, tu, "shear stress VQ/(I t)")):
        ax.plot(v, y, color="black", linewidth=1.0)
        ax.fill_betweenx(y, 0.0, v, color=_GREY, linewidth=0)
        ax.axvline(0.0, color="black", linewidth=0.6)
        ax.set_title(title, fontsize=9)
        ax.set_xlabel(f"[{u}]", fontsize=8)
    for i in (0, len(y) - 1):
        ax1.annotate(f"{sig[i]:.4g}", (sig[i], y[i]), fontsize=7, ha="center",
                     va="bottom" if i == 0 else "top")
    k = int(np.argmax(np.abs(tau)))
    ax2.annotate(f"{tau[k]:.4g}", (tau[k], y[k]), fontsize=7, ha="left", va="bottom")
    for yj in profile.junctions:
        idx = np.flatnonzero(np.abs(profile.y - yj) <= 1e-12)
        for i in idx[:2]:
            ax2.annotate(f"{tau[i]:.3g}", (tau[i], y[i]), fontsize=6, ha="left", va="center")
    fig.text(0.01, 0.01, f"M = {_conv([profile.M], 'moment', system)[0][0]:.4g} "
                         f"{_conv([1.0], 'moment', system)[1]},  V = {_conv([profile.V], 'force', system)[0][0]:.4g} "
                         f"{_conv([1.0], 'force', system)[1]}", fontsize=7)
    return fig


def _span_axes(title: str, system: str, n: int = 1, h: float = 3.4):
    fig = _figure(10.0, h * n)
    axs = np.atleast_1d(fig.subplots(n, 1, sharex=True, squeeze=False)[:, 0])
    for ax in axs:
        _style(ax)
    axs[0].set_title(title, fontsize=9)
    axs[-1].set_xlabel(f"x [{_conv([1.0], 'span', system)[1]}]", fontsize=8)
    return fig, axs


def shear_flow_figure(sf, system: str = "SI"):
    """q_h(x) at each interface of a :class:`calckit.design.shear_flow.ShearFlow`."""
    fig, (ax,) = _span_axes(f"Shear flow VQ/I, {sf.section}", system)
    x, _ = _conv(sf.x, "span", system)
    for i, (f, q) in enumerate(zip(sf.interfaces, sf.q)):
        v, u = _conv(q, "shear_flow", system)
        ax.plot(x, v, color="black", linestyle=_STYLES[i % 4], linewidth=1.0, label=f.name)
        ax.set_ylabel(f"q [{u}]", fontsize=8)
    ax.legend(fontsize=7, frameon=False)
    return fig


def _capacity_plot(ax, x_si, demand, cap, zones, system, label_demand):
    x, xu = _conv(x_si, "span", system)
    d, u = _conv(demand, "shear_flow", system)
    c, _ = _conv(np.where(np.isfinite(cap), cap, np.nan), "shear_flow", system)
    ax.plot(x, d, color="black", linewidth=1.0, label=label_demand)
    ax.plot(x, c, color="black", linewidth=0.8, linestyle="--", label="strength")
    ax.fill_between(x, 0.0, np.nan_to_num(d), color=_GREY, linewidth=0)
    ax.set_ylabel(f"[{u}]", fontsize=8)
    fin = np.concatenate((d[np.isfinite(d)], c[np.isfinite(c)]))
    top = float(np.max(fin)) if fin.size else 1.0
    ax.set_ylim(0, 1.18 * top if top > 0 else 1.0)
    lines = []
    for k, z in enumerate(zones, 1):
        x0, x1 = (float(v) for v in _conv([z.x0, z.x1], "span", system)[0])
        if k > 1:
            ax.axvline(x0, color="black", linestyle=":", linewidth=0.6)
        ax.text((x0 + x1) / 2, 1.09 * top, str(k), fontsize=6, ha="center", va="center")
        lines.append(f"{k:>2}: {x0:7.2f} to {x1:7.2f} {xu}  {z.label}")
    ax.legend(fontsize=7, frameon=False, loc="lower right")
    return "\n".join(lines)


def _zone_text(fig, axs, texts) -> None:
    """Zone lists to the right of each axis."""
    fig.subplots_adjust(right=0.62)
    for ax, t in zip(axs, texts):
        b = ax.get_position()
        fig.text(0.64, b.y1, t, va="top", ha="left", fontsize=6, family="monospace")


def weld_figure(design, system: str = "SI"):
    """Force per unit length on the welds of each junction and the weld strength line, with the zones."""
    n = len(design.junctions)
    fig, axs = _span_axes(f"Flange-to-web welds, {design.section} ({design.standard}, {design.method})", system, n)
    texts = [_capacity_plot(ax, design.x, j.q_r, j.capacity, j.zones, system, f"{j.interface.name} (both welds)")
             for ax, j in zip(axs, design.junctions)]
    _zone_text(fig, axs, texts)
    return fig


def fastener_figure(design, system: str = "SI"):
    """Shear flow and the fastener strength n R / s by zones."""
    n = len(design.rows)
    fig, axs = _span_axes(f"Fasteners, {design.section}", system, n)
    texts = [_capacity_plot(ax, design.x, r.q, r.capacity, r.zones, system, f"{r.interface.name}")
             for ax, r in zip(axs, design.rows)]
    _zone_text(fig, axs, texts)
    return fig


def cover_plate_figure(design, system: str = "SI"):
    """|M| against the bare beam's strength with cut-offs and plate ends; plate-to-flange welds below."""
    fig, axs = _span_axes(f"Cover plates on {design.beam}", system, 1 + len(design.plates), h=2.8)
    ax = axs[0]
    x, _ = _conv(design.x, "span", system)
    m, mu = _conv(design.M_abs, "moment", system)
    mb, _ = _conv(design.M_bare, "moment", system)
    ax.plot(x, m, color="black", linewidth=1.0, label="|M| envelope")
    ax.plot(x, mb, color="black", linestyle="--", linewidth=0.8, label="bare beam strength")
    ax.set_ylabel(f"[{mu}]", fontsize=8)
    for p in design.plates:
        for xc in p.cutoff:
            ax.axvline(float(_conv([xc], "span", system)[0][0]), color="black", linestyle=":", linewidth=0.6)
        e0, e1 = (float(v) for v in _conv(list(p.ends), "span", system)[0])
        yb = -0.05 * float(np.max(m)) * (1 if p.face == "top" else 2)
        ax.plot([e0, e1], [yb, yb], color="black", linewidth=3 if p.face == "top" else 2, solid_capstyle="butt")
    ax.legend(fontsize=7, frameon=False)
    texts = [""]
    for a, p in zip(axs[1:], design.plates):
        w = p.welds
        texts.append(_capacity_plot(a, design.x, np.where(np.isfinite(w.capacity), w.q_r, np.nan), w.capacity,
                                    w.zones, system, f"{p.face} plate welds"))
    for p in design.plates:
        (c0, c1, e0, e1, a), xu = _conv([*p.cutoff, *p.ends, p.a_prime], "span", system)
        texts[0] += f"{p.face}: cut-offs {c0:.4g}, {c1:.4g} {xu}; ends {e0:.4g}, {e1:.4g} {xu}; a' = {a:.3g} {xu}\n"
    _zone_text(fig, axs, texts)
    return fig
