"""Small, fast, deterministic SVG figures for the calc sheets (no matplotlib in the calc kernels).

A calc kernel is started fresh for every record, so importing and drawing with matplotlib (about 1 s
per calc) would dominate a batch. These figures are plain SVG text written from numpy arrays of the
engines' results: the beam diagrams (loads, shear, moment, deflection envelopes), the stress profile
through the depth, and the cross-section outline. Black on white with one grey fill; they print.
Output is byte-identical for identical input (no dates, ids or random salts).
"""
from __future__ import annotations

import html
import math
from typing import Sequence

import numpy as np

__all__ = ["SvgFigure", "beam_svg", "stress_svg", "section_svg", "nice_ticks"]

_FONT = 'font-family="DejaVu Sans, Arial, Helvetica, sans-serif"'
_FILL = "#d9d9d9"


class SvgFigure:
    """An SVG figure as a notebook display object (inline SVG in HTML, plus the SVG mime type)."""

    kind = "figure"

    def __init__(self, svg: str, caption: str = "", width: str = "100%"):
        self.svg, self.caption, self.width = svg, caption, width

    def html(self, system: str | None = None) -> str:
        cap = f"<figcaption>{html.escape(self.caption)}</figcaption>" if self.caption else ""
        return f'<figure class="ck-figure" style="max-width:{html.escape(self.width)}">{self.svg}{cap}</figure>'

    def _repr_html_(self) -> str:
        return f'<div class="ck-block ck-figure">{self.html()}</div>'

    def __repr__(self) -> str:  # no memory address: records must be byte-identical between reruns
        return f"Figure: {self.caption}" if self.caption else "Figure"


def _f(v: float) -> str:
    return f"{v:.2f}".rstrip("0").rstrip(".")


def _fmt(v: float) -> str:
    a = abs(v)
    if a == 0:
        return "0"
    if a >= 1e5 or a < 1e-2:
        return f"{v:.2e}"
    return f"{v:.4g}"


def nice_ticks(lo: float, hi: float, n: int = 5) -> list[float]:
    """About ``n`` round tick values covering [lo, hi] (steps 1, 2, 2.5 or 5 x 10^k)."""
    if not math.isfinite(lo) or not math.isfinite(hi) or hi <= lo:
        return [lo]
    raw = (hi - lo) / max(n, 1)
    mag = 10 ** math.floor(math.log10(raw))
    step = next(m * mag for m in (1, 2, 2.5, 5, 10) if m * mag >= raw)
    t0 = math.ceil(lo / step - 1e-9) * step
    out = []
    t = t0
    while t <= hi + 1e-9 * step:
        out.append(0.0 if abs(t) < 1e-12 * step else t)
        t += step
    return out


class _Panel:
    """One plot area: data box mapped to a pixel box."""

    def __init__(self, x0, y0, w, h, xlim, ylim):
        self.x0, self.y0, self.w, self.h = x0, y0, w, h
        self.xlim, self.ylim = xlim, ylim

    def X(self, x):
        a, b = self.xlim
        return self.x0 + (np.asarray(x, float) - a) / (b - a) * self.w

    def Y(self, y):
        a, b = self.ylim
        return self.y0 + self.h - (np.asarray(y, float) - a) / (b - a) * self.h


def _poly(xs, ys, **attrs) -> str:
    pts = " ".join(f"{_f(a)},{_f(b)}" for a, b in zip(xs, ys))
    att = " ".join(f'{k.replace("_", "-")}="{v}"' for k, v in attrs.items())
    return f'<polyline points="{pts}" {att}/>'


def _polygon(xs, ys, **attrs) -> str:
    pts = " ".join(f"{_f(a)},{_f(b)}" for a, b in zip(xs, ys))
    att = " ".join(f'{k.replace("_", "-")}="{v}"' for k, v in attrs.items())
    return f'<polygon points="{pts}" {att}/>'


def _text(x, y, s, size=10, anchor="start", **attrs) -> str:
    att = " ".join(f'{k.replace("_", "-")}="{v}"' for k, v in attrs.items())
    return (f'<text x="{_f(x)}" y="{_f(y)}" font-size="{size}" text-anchor="{anchor}" {_FONT} {att}>'
            f"{html.escape(s)}</text>")


def _line(x1, y1, x2, y2, **attrs) -> str:
    att = " ".join(f'{k.replace("_", "-")}="{v}"' for k, v in attrs.items())
    return f'<line x1="{_f(x1)}" y1="{_f(y1)}" x2="{_f(x2)}" y2="{_f(y2)}" {att}/>'


def _svg(w, h, body: Sequence[str]) -> str:
    return (f'<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 {w} {h}" width="100%" '
            f'style="max-width:{w}px;background:#fff">' + "".join(body) + "</svg>")


def _axes(p: _Panel, xt, yt, ylabel: str, xlabel: str | None, fx=lambda v: v) -> list[str]:
    out = [f'<rect x="{_f(p.x0)}" y="{_f(p.y0)}" width="{_f(p.w)}" height="{_f(p.h)}" fill="none" '
           f'stroke="#000" stroke-width="0.8"/>']
    for t in yt:
        y = float(p.Y(t))
        out.append(_line(p.x0 - 4, y, p.x0, y, stroke="#000", stroke_width="0.8"))
        out.append(_line(p.x0, y, p.x0 + p.w, y, stroke="#ccc", stroke_width="0.5"))
        out.append(_text(p.x0 - 6, y + 3.5, _fmt(t), 9, "end"))
    for t in xt:
        x = float(p.X(t))
        out.append(_line(x, p.y0 + p.h, x, p.y0 + p.h + 4, stroke="#000", stroke_width="0.8"))
        if xlabel is not None:
            out.append(_text(x, p.y0 + p.h + 15, _fmt(fx(t)), 9, "middle"))
    out.append(_text(p.x0 - 46, p.y0 + p.h / 2, ylabel, 10, "middle",
                     transform=f"rotate(-90 {_f(p.x0 - 46)} {_f(p.y0 + p.h / 2)})"))
    if xlabel:
        out.append(_text(p.x0 + p.w / 2, p.y0 + p.h + 30, xlabel, 10, "middle"))
    return out


def _envelope_panel(p: _Panel, x, hi, lo, unit_f, label, name, flip=False) -> list[str]:
    """Shaded band between lo and hi with the zero line and the extreme values marked."""
    X = p.X(x)
    out = [_polygon(np.concatenate([X, X[::-1]]), np.concatenate([p.Y(hi), p.Y(lo)[::-1]]),
                    fill=_FILL, stroke="none")]
    out.append(_poly(X, p.Y(hi), fill="none", stroke="#000", stroke_width="1.2"))
    out.append(_poly(X, p.Y(lo), fill="none", stroke="#000", stroke_width="1.2"))
    out.append(_line(p.x0, float(p.Y(0)), p.x0 + p.w, float(p.Y(0)), stroke="#000", stroke_width="0.8"))
    span = max(abs(p.ylim[1] - p.ylim[0]), 1e-300)
    for arr, top in ((hi, True), (lo, False)):
        i = int(np.argmax(arr)) if top else int(np.argmin(arr))
        v = float(arr[i])
        if abs(v) <= 1e-6 * span:
            continue
        shown = -v if flip else v
        xx, yy = float(X[i]), float(p.Y(v))
        out.append(f'<circle cx="{_f(xx)}" cy="{_f(yy)}" r="2.5" fill="#000"/>')
        anchor = "start" if xx < p.x0 + 0.7 * p.w else "end"
        dx = 5 if anchor == "start" else -5
        out.append(_text(xx + dx, yy + (-5 if top else 12), f"{name} = {_fmt(shown)} {label}", 9, anchor))
    return out


def _units(system: str) -> dict:
    from ..units import convert, display_unit

    out = {}
    for dim in ("span", "force", "moment", "deflection", "line_load", "length", "stress"):
        u = display_unit(dim, system)
        out[dim] = (u.replace("**2", "²").replace("*", "·"), convert(1.0, dim, u))
    return out


def _supports(beam, p: _Panel, ybeam: float) -> list[str]:
    out = []
    sups = beam.layout.supports
    for s in sups:
        x = float(p.X(s.x))
        if s.kind in ("pin", "roller"):
            out.append(_polygon([x, x - 6, x + 6], [ybeam, ybeam + 10, ybeam + 10], fill="#fff", stroke="#000",
                                stroke_width="1"))
            if s.kind == "roller":
                out.append(_line(x - 8, ybeam + 13, x + 8, ybeam + 13, stroke="#000", stroke_width="1"))
            else:
                out.append(_line(x - 8, ybeam + 10, x + 8, ybeam + 10, stroke="#000", stroke_width="2"))
        elif s.kind == "fixed":
            out.append(_line(x, ybeam - 12, x, ybeam + 12, stroke="#000", stroke_width="3"))
            side = -1 if s.index == 0 else 1
            for k in range(5):
                yy = ybeam - 12 + k * 6
                out.append(_line(x, yy, x + side * 6, yy + 6, stroke="#000", stroke_width="0.8"))
        elif s.kind == "spring":
            out.append(_poly([x, x - 4, x + 4, x - 4, x + 4, x], [ybeam, ybeam + 3, ybeam + 6, ybeam + 9,
                             ybeam + 12, ybeam + 14], fill="none", stroke="#000", stroke_width="1"))
    return out


def _loads_panel(beam, p: _Panel, u: dict, cases: Sequence[str]) -> list[str]:
    ybeam = p.y0 + p.h - 18
    out = [_line(p.x0, ybeam, p.x0 + p.w, ybeam, stroke="#000", stroke_width="3")]
    out += _supports(beam, p, ybeam)
    band = (p.h - 30) / max(len(cases), 1)
    for i, case in enumerate(cases):
        top = p.y0 + i * band + 4
        bot = top + band - 8
        loads = beam.loads_in(case)
        wmax = max([max(abs(ld.w1), abs(ld.w2)) for ld in loads if hasattr(ld, "w1")] or [1.0])
        out.append(_text(p.x0 - 8, (top + bot) / 2 + 4, case, 11, "end", font_weight="bold"))
        texts = []
        for ld in loads:
            if hasattr(ld, "w1"):
                xa, xb = float(p.X(ld.start)), float(p.X(ld.end))
                ha = (bot - top) * 0.65 * abs(ld.w1) / wmax
                hb = (bot - top) * 0.65 * abs(ld.w2) / wmax
                out.append(_polygon([xa, xb, xb, xa], [bot - ha, bot - hb, bot, bot], fill="#fff", stroke="#000",
                                    stroke_width="0.8"))
                n = max(2, int((xb - xa) / 40))
                for k in range(n + 1):
                    xk = xa + (xb - xa) * k / n
                    hk = ha + (hb - ha) * k / n
                    out.append(_line(xk, bot - hk, xk, bot, stroke="#000", stroke_width="0.6"))
                w = ld.w1 * u["line_load"][1]
                tag = "self-weight " if getattr(ld, "kind", "") == "self_weight" else ""
                texts.append(f"{tag}{_fmt(w)} {u['line_load'][0]}")
            elif hasattr(ld, "P"):
                xp = float(p.X(ld.x))
                out.append(_line(xp, top, xp, bot - 5, stroke="#000", stroke_width="1.5"))
                out.append(_polygon([xp, xp - 4, xp + 4], [bot, bot - 7, bot - 7], fill="#000", stroke="none"))
                out.append(_text(xp + 4, top + 9, f"{_fmt(ld.P * u['force'][1])} {u['force'][0]}", 9))
        if texts:
            out.append(_text(p.x0 + p.w + 4, (top + bot) / 2 + 4, "; ".join(dict.fromkeys(texts)), 9))
    out.append(_text(p.x0, p.y0 - 4, f"Loads by case (x in {u['span'][0]})", 10))
    return out


def beam_svg(beam, env, system: str = "SI", title: str = "") -> str:
    """Loads, shear, moment and deflection envelopes on one x axis (SVG text).

    ``beam``: the analysis model (for loads and supports); ``env``: an analysis Envelope. Moments are
    drawn sagging-positive up; deflection downward, labelled downward-positive.
    """
    u = _units(system)
    fx = u["span"][1]
    x = np.asarray(env.x, float)
    L = float(x[-1])
    cases = list(beam.cases)
    W, left, right = 860, 70, 190
    pw = W - left - right
    hl = 34 + 30 * len(cases)
    H = 22 + hl + 3 * 150 + 40
    body = []
    if title:
        body.append(_text(left, 14, title, 11, font_weight="bold"))
    top = 26
    body += _loads_panel(beam, _Panel(left, top + 4, pw, hl - 8, (0, L), (0, 1)), u, cases)
    top += hl
    xt = nice_ticks(0, L * fx, 8)
    xt_si = [t / fx for t in xt]
    rows = [("V", env.V_max, env.V_min, "force", "shear V", "V", False),
            ("M", env.M_max, env.M_min, "moment", "moment M (sagging +)", "M", False),
            ("d", -np.asarray(env.defl_min), -np.asarray(env.defl_max), "deflection", "deflection (down +)", "δ",
             True)]
    for k, (_, hi, lo, dim, lab, name, flip) in enumerate(rows):
        f = u[dim][1]
        hi_d, lo_d = np.asarray(hi, float) * f, np.asarray(lo, float) * f
        ymin, ymax = min(float(lo_d.min()), 0.0), max(float(hi_d.max()), 0.0)
        pad = 0.12 * max(ymax - ymin, 1e-12)
        yl = (ymin - pad, ymax + pad)
        p = _Panel(left, top + 8, pw, 120, (0, L), yl)
        yt = nice_ticks(yl[0], yl[1], 4)
        last = k == len(rows) - 1
        body += _axes(p, xt_si, yt, f"{lab} ({u[dim][0]})", f"x ({u['span'][0]})" if last else None,
                      fx=lambda v: v * fx)
        if not last:
            for t in xt_si:
                body.append(_text(float(p.X(t)), p.y0 + p.h + 12, _fmt(t * fx), 8, "middle"))
        body += _envelope_panel(p, x, hi_d, lo_d, f, u[dim][0], name, flip=flip)
        top += 150
    return _svg(W, H, body)


def stress_svg(prof, section, system: str = "SI") -> str:
    """The section outline beside the normal stress sigma(y) and the shear stress tau(y) (SVG text)."""
    u = _units(system)
    fl, fs = u["length"][1], u["stress"][1]
    s = section.si
    y = np.asarray(prof.y, float)
    W, H = 860, 330
    top, h = 30, 250
    body = [_text(20, 16, "Section", 10), _text(300, 16, "normal stress σ (tension +)", 10),
            _text(590, 16, "shear stress τ", 10)]
    # section outline
    xs, ys = [], []
    for kind, g in section.outline():
        if kind == "rect":
            xs += [g[0], g[1]]
            ys += [g[2], g[3]]
    wmax = max(xs) - min(xs)
    scale = min(h / s.d, 200 / max(wmax, 1e-9))
    ox = 20 + (200 - wmax * scale) / 2 - min(xs) * scale
    oy = top + h
    for kind, g in section.outline():
        if kind == "rect":
            x0, x1, y0, y1, sign = g
            body.append(f'<rect x="{_f(ox + x0 * scale)}" y="{_f(oy - y1 * scale)}" width="{_f((x1 - x0) * scale)}" '
                        f'height="{_f((y1 - y0) * scale)}" fill="{_FILL if sign > 0 else "#fff"}" stroke="#000" '
                        f'stroke-width="0.8"/>')
    yna = oy - s.y_c * scale
    body.append(_line(10, yna, 230, yna, stroke="#000", stroke_width="0.8", stroke_dasharray="5,3"))
    body.append(_text(232, yna + 3, "NA", 9))
    for (x0, vals, dim, unit) in ((300, prof.sigma * fs, "stress", u["stress"][0]),
                                   (590, prof.tau * fs, "stress", u["stress"][0])):
        vmax = max(float(np.max(np.abs(vals))), 1e-12)
        p = _Panel(x0, top, 230, h, (-1.15 * vmax, 1.15 * vmax), (0, s.d))
        X, Y = p.X(vals), p.Y(y)
        body.append(_line(float(p.X(0)), top, float(p.X(0)), top + h, stroke="#000", stroke_width="0.8"))
        body.append(_polygon(np.concatenate([[float(p.X(0))], X, [float(p.X(0))]]),
                             np.concatenate([[float(Y[0])], Y, [float(Y[-1])]]), fill=_FILL, stroke="none"))
        body.append(_poly(X, Y, fill="none", stroke="#000", stroke_width="1.2"))
        body.append(_line(x0, float(p.Y(s.y_c)), x0 + 230, float(p.Y(s.y_c)), stroke="#000", stroke_width="0.6",
                          stroke_dasharray="5,3"))
        i, j = int(np.argmax(vals)), int(np.argmin(vals))
        for k in {i, j}:
            v = float(vals[k])
            if abs(v) > 1e-9 * vmax:
                xx, yy = float(p.X(v)), float(p.Y(y[k]))
                anchor = "start" if v >= 0 else "end"
                body.append(f'<circle cx="{_f(xx)}" cy="{_f(yy)}" r="2.5" fill="#000"/>')
                body.append(_text(xx + (4 if v >= 0 else -4), yy + (12 if yy < top + 20 else -4),
                                  f"{_fmt(v)} {unit}", 9, anchor))
        body.append(_text(x0 + 115, top + h + 16, unit, 9, "middle"))
    body.append(_text(20, top + h + 16, f"depth {_fmt(s.d * fl)} {u['length'][0]}", 9))
    return _svg(W, H, body)


def section_svg(section, system: str = "SI", title: str = "") -> str:
    """The cross-section to scale with the elastic NA (solid) and plastic NA (dashed) (SVG text)."""
    u = _units(system)
    fl = u["length"][1]
    s = section.si
    outl = section.outline()
    xs = [v for k, g in outl if k == "rect" for v in (g[0], g[1])]
    ys = [v for k, g in outl if k == "rect" for v in (g[2], g[3])]
    wd, hd = max(xs) - min(xs), max(ys) - min(ys)
    size = 280
    scale = size / max(wd, hd)
    W, H = size + 200, size + 60
    ox = 30 - min(xs) * scale
    oy = 30 + hd * scale + min(ys) * scale
    body = [_text(10, 16, title, 11, font_weight="bold")] if title else []
    for kind, g in outl:
        if kind == "rect":
            x0, x1, y0, y1, sign = g
            body.append(f'<rect x="{_f(ox + x0 * scale)}" y="{_f(oy - y1 * scale)}" width="{_f((x1 - x0) * scale)}" '
                        f'height="{_f((y1 - y0) * scale)}" fill="{_FILL if sign > 0 else "#fff"}" stroke="#000" '
                        f'stroke-width="0.8"/>')
        else:
            xc, yc, r, sx, sy, sign = g
            pts = [(xc, yc), (xc + sx * r, yc)]
            for k in range(13):
                t = k / 12 * math.pi / 2
                pts.append((xc + sx * r - sx * r * math.sin(t), yc + sy * r - sy * r * math.cos(t)))
            pts.append((xc, yc + sy * r))
            body.append(_polygon([ox + a * scale for a, _ in pts], [oy - b * scale for _, b in pts], fill=_FILL,
                                 stroke="none"))
    xr = ox + max(xs) * scale
    axes = [(s.y_c, "", "elastic NA"), (s.y_pna, "6,3", "plastic NA")]
    if abs(s.y_c - s.y_pna) * scale < 12:  # (nearly) the same line: one label
        axes = [(s.y_c, "", "elastic and plastic NA" if abs(s.y_c - s.y_pna) < 1e-9 * s.d else
                 "elastic NA (plastic NA close by, see table)")]
    for yv, dash, lab in axes:
        yy = oy - yv * scale
        body.append(_line(20, yy, xr + 15, yy, stroke="#000", stroke_width="0.9",
                          **({"stroke_dasharray": dash} if dash else {})))
        body.append(_text(xr + 18, yy + 3, f"{lab} {_fmt(yv * fl)} {u['length'][0]}", 9))
    body.append(_text(30, H - 8, f"{_fmt(wd * fl)} x {_fmt(hd * fl)} {u['length'][0]} (to scale)", 9))
    return _svg(W, H, body)
