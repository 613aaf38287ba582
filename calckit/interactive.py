"""Sliders and pickers for a calc opened in JupyterLab (ipywidgets; imported only inside slider cells).

``panel(calc)`` shows controls for the main parameters of a calc sheet (span, loads, section, bracing,
grade, standard; plate sizes and stiffener spacing for a girder) and a view (HTML with math) that is
redrawn on every change with the diagrams and the utilisation of every check. The controls start at the values of
the notebook's parameters; values are kept in the unit the parameter was written in. Nothing here
computes: each change builds a new sheet with :mod:`calckit.sheets`, i.e. the same validation and the
same engines as the batch.

The slider cell is tagged ``interactive`` (left out of the archive HTML) and ``nbval-skip``, and runs
only when the notebook parameter ``headless`` is False: widget outputs store only widget state, so a
headless run keeps static outputs instead.
"""
from __future__ import annotations

import re
from typing import Any, Callable

__all__ = ["panel", "split_quantity"]

_NUM = re.compile(r"^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*)$")


def split_quantity(text: str) -> tuple[float, str]:
    """'9.0 m' -> (9.0, 'm'); a bare '0' -> (0.0, '')."""
    m = _NUM.match(str(text))
    if not m:
        raise ValueError(f"not a number with a unit: {text!r}")
    return float(m.group(1)), m.group(2).strip()


def _qslider(widgets, label: str, text: str, lo_factor=0.25, hi_factor=2.5, step_factor=0.01, default_unit=""):
    v, unit = split_quantity(text)
    unit = unit or default_unit
    top = max(v * hi_factor, 1.0 if v == 0 else v * hi_factor)
    step = max(top * step_factor, 1e-3)
    s = widgets.FloatSlider(value=v, min=v * lo_factor if v > 0 else 0.0, max=top, step=step,
                            description=label, continuous_update=False, readout_format=".3g",
                            style={"description_width": "110px"}, layout=widgets.Layout(width="460px"))
    s.unit = unit
    return s


def _as_text(s) -> str:
    return f"{s.value:.6g} {s.unit}".strip()


def panel(calc, *, display_now: bool = True):
    """Build (and display) the interactive panel of a calc sheet; returns the ipywidgets container."""
    import ipywidgets as widgets
    from IPython.display import display

    from . import sheets

    p = dict(calc.p)
    kind = calc.calc
    controls: dict[str, Any] = {}
    if kind in ("steel_beam", "plate_girder"):
        if kind == "steel_beam":
            for i, s in enumerate(p["spans"][:4]):
                controls[f"span{i}"] = _qslider(widgets, f"span {i + 1}", s, 0.3, 2.0)
            from .sections.catalog import names

            fam = getattr(calc.section, "family", None)
            opts = names(fam) if fam else names()
            controls["section"] = widgets.Dropdown(options=opts, value=calc.section.name, description="section")
        else:
            controls["span"] = _qslider(widgets, "span", p["span"], 0.3, 2.0)
            for key in ("d", "tw", "bf_top", "tf_top"):
                controls[key] = _qslider(widgets, key, p[key], 0.4, 2.5)
            controls["stiffener_spacing"] = _qslider(widgets, "stiffeners a", p["stiffener_spacing"], 0.0, 3.0,
                                                     default_unit="m")
            if split_quantity(p["stiffener_spacing"])[0] == 0:
                controls["stiffener_spacing"].max = 2.0 * split_quantity(p["span"])[0]
                controls["stiffener_spacing"].unit = split_quantity(p["span"])[1]
        for key in ("dead_udl", "live_udl"):
            controls[key] = _qslider(widgets, key.replace("_udl", " load"), p[key], 0.0, 3.0,
                                     default_unit=split_quantity(p["dead_udl"])[1] or "kN/m")
        controls["bracing"] = widgets.Dropdown(options=["continuous", "supports", "midspan", "thirds", "quarters"],
                                               value=p["bracing"], description="bracing")
        from .materials import grades

        controls["grade"] = widgets.Dropdown(options=grades(), value=calc.steel.name, description="grade")
        controls["standard"] = widgets.ToggleButtons(options=["AISC 360-22", "EN 1993-1-1"], value=p["standard"],
                                                     description="standard")
        controls["method"] = widgets.ToggleButtons(options=["LRFD", "ASD"], value=p["method"], description="method")
    controls["units"] = widgets.ToggleButtons(options=["SI", "US"], value=p["units"], description="units")
    # The results are shown as HTML with math (an HTMLMath widget, not an Output widget: an Output widget
    # makes a headless client send state back to the kernel while a cell runs, which can lose replies).
    view = widgets.HTMLMath(value="")
    builder: Callable = getattr(sheets, kind)

    def params_now() -> dict:
        q = dict(p)
        if kind == "steel_beam":
            spans = list(q["spans"])
            for i in range(min(4, len(spans))):
                spans[i] = _as_text(controls[f"span{i}"])
            q["spans"] = spans
        for key, w in controls.items():
            if key.startswith("span") and kind == "steel_beam":
                continue
            q[key] = _as_text(w) if hasattr(w, "unit") else w.value
        q["headless"] = True
        return q

    def redraw(*_):
        import html as _h

        try:
            sheet = builder(params_now())
            view.value = "".join(_block_html(b) for part in _live_parts(sheet) for b in sheet.get(part))
        except Exception as exc:  # bad combination of slider values: say so, keep the panel
            view.value = f"<p><strong>Cannot compute:</strong> {_h.escape(type(exc).__name__)}: {_h.escape(str(exc))}</p>"

    for w in controls.values():
        w.observe(redraw, names="value")
    box = widgets.VBox([widgets.HBox([widgets.VBox(list(controls.values()))]), view])
    redraw()
    if display_now:
        display(box)
    return box


def _block_html(b) -> str:
    if hasattr(b, "_repr_html_"):
        return b._repr_html_()
    return f"<pre>{b!r}</pre>"


def _live_parts(sheet) -> list[str]:
    """The parts redrawn live: diagrams and the summary (with the utilisation bars)."""
    want = {"steel_beam": ["analysis", "summary"], "plate_girder": ["analysis", "summary"],
            "section_properties": ["figure", "properties"]}
    return [p for p in want.get(sheet.calc, ["summary"]) if p in sheet.parts]
