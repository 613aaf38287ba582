"""Figures of a section search (matplotlib, imported on first use; this module is loaded on demand only).

* :func:`mass_ratio_figure`: every candidate's mass per length against its governing ratio, passing and
  failing marked, the chosen section and the ratio 1.0 line drawn;
* :func:`shape_comparison_figure`: the I-section beside a solid rectangle and a square hollow section of
  the same mass (drawn to one scale), with their stiffness and strength ratios
  (:func:`calckit.pick.compare.compare_shapes`).

Both return a matplotlib Figure (for ``calckit.render.Figure``); nothing is shown or saved here.
"""
from __future__ import annotations

__all__ = ["mass_ratio_figure", "shape_comparison_figure"]

_LB_FT = 0.45359237 / 0.3048


def _plt():
    import matplotlib

    if matplotlib.get_backend().lower() not in ("agg", "module://matplotlib_inline.backend_inline"):
        try:
            matplotlib.use("Agg", force=False)
        except Exception:  # pragma: no cover - a GUI backend already in use is fine too
            pass
    import matplotlib.pyplot as plt

    return plt


def mass_ratio_figure(result, system: str | None = None, label_bands: bool = False):
    """Mass per length (x) against governing ratio (y) of every candidate of a :class:`PickResult`."""
    from matplotlib.figure import Figure

    us = (system or ("US" if result.standard.startswith("AISC") else "SI")).upper() == "US"
    k = 1 / _LB_FT if us else 1.0
    fig = Figure(figsize=(7.5, 4.6))
    ax = fig.add_subplot(1, 1, 1)
    ok = [c for c in result.candidates if c.passed]
    bad = [c for c in result.candidates if not c.passed]
    cap = 3.0
    if bad:
        ax.scatter([c.mass * k for c in bad], [min(c.ratio, cap) for c in bad], s=14, marker="x",
                   color="tab:red", label="fails a check")
    if ok:
        ax.scatter([c.mass * k for c in ok], [c.ratio for c in ok], s=16, marker="o", facecolors="none",
                   edgecolors="tab:blue", label="passes every check")
    if result.chosen is not None:
        c = result.chosen
        ax.scatter([c.mass * k], [c.ratio], s=90, marker="*", color="tab:green", zorder=5,
                   label=f"chosen: {c.name}")
        ax.annotate(f"{c.name}\n{c.governing}", (c.mass * k, c.ratio), textcoords="offset points",
                    xytext=(8, 8), fontsize=8, bbox=dict(boxstyle="round", fc="white", ec="0.7", alpha=0.9))
    if label_bands:
        for c in result.by_band:
            if c is not result.chosen:
                ax.annotate(c.name, (c.mass * k, c.ratio), textcoords="offset points", xytext=(3, -9),
                            fontsize=6, color="0.35")
    ax.axhline(1.0, color="0.3", lw=0.8, ls="--")
    ax.set_xscale("log")
    ax.set_ylim(0, cap * 1.02)
    ax.set_xlabel(f"mass per length ({'lb/ft' if us else 'kg/m'}), log scale")
    ax.set_ylabel(f"governing ratio (values above {cap:g} drawn at {cap:g})")
    method = "" if result.method == "EN" else f" {result.method}"
    ax.set_title(f"{result.n_checked} sections, {result.standard}{method}, {result.grade}", fontsize=10)
    ax.legend(fontsize=8, loc="upper right")
    ax.grid(True, which="both", lw=0.3, alpha=0.6)
    fig.tight_layout()
    return fig


def _draw(ax, sec, dx: float, colour: str):
    from matplotlib.patches import Polygon

    import numpy as np

    for i, (kind, data) in enumerate(sec.outline()):  # later primitives drawn over earlier ones
        if kind == "rect":
            x0, x1, y0, y1, sign = data
            pts = [(x0, y0), (x1, y0), (x1, y1), (x0, y1)]
        else:
            xc, yc, r, sx, sy, sign = data
            th = np.linspace(0, np.pi / 2, 12)
            arc = [(xc + sx * r - sx * r * np.sin(t), yc + sy * r - sy * r * np.cos(t)) for t in th]
            pts = [(xc, yc)] + arc
        face = colour if sign > 0 else "white"
        ax.add_patch(Polygon([(x * 1e3 + dx, y * 1e3) for x, y in pts], closed=True, facecolor=face,
                             edgecolor="none", zorder=2 + i))


def shape_comparison_figure(comparison):
    """The three shapes of a :class:`calckit.pick.compare.ShapeComparison` to one scale, and bars of
    their Ix, Sx, Zx, Iy and J ratios to the I-section."""
    from matplotlib.figure import Figure

    import numpy as np

    fig = Figure(figsize=(8.5, 4.2))
    ax = fig.add_subplot(1, 2, 1)
    colours = ("tab:blue", "tab:orange", "tab:green")
    x = 0.0
    for row, col in zip(comparison.rows, colours):
        _draw(ax, row.section, x, col)
        ax.text(x + row.b * 500, -25, f"{row.shape}\n{row.name}", ha="center", va="top", fontsize=7)
        x += row.b * 1e3 + 60
    ax.set_aspect("equal")
    ax.autoscale_view()
    ax.set_ylim(-90, max(r.d for r in comparison.rows) * 1e3 + 20)
    ax.axis("off")
    ax.set_title("same mass, drawn to one scale (mm)", fontsize=9)
    ax2 = fig.add_subplot(1, 2, 2)
    keys = ("Ix", "Sx", "Zx", "Iy", "J")
    w = 0.26
    pos = np.arange(len(keys))
    for i, (row, col) in enumerate(zip(comparison.rows, colours)):
        vals = [row.ratios[k] for k in keys]
        ax2.bar(pos + (i - 1) * w, vals, w, color=col, label=row.shape)
    ax2.set_yscale("log")
    ax2.axhline(1.0, color="0.3", lw=0.8)
    ax2.set_xticks(pos)
    ax2.set_xticklabels(["Ix\nstiffness", "Sx\nfirst yield", "Zx\nplastic", "Iy", "J"], fontsize=8)
    ax2.set_ylabel("ratio to the I-section (log scale)")
    ax2.legend(fontsize=7)
    ax2.grid(True, axis="y", which="both", lw=0.3, alpha=0.6)
    fig.tight_layout()
    return fig
