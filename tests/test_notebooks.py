"""Every calc notebook runs top to bottom with its default parameters in a fresh kernel (papermill),
headless, with static outputs; and opened by hand (headless = False) its slider cell builds the panel.

One execution per notebook (module-scoped fixture, two kernels at a time), plus one interactive run.
"""
from __future__ import annotations

from concurrent.futures import ThreadPoolExecutor

import pytest

from calckit.batch import execute_calc
from calckit.params import CALCS, spec

WIDGET_MIME = "application/vnd.jupyter.widget-view+json"
RESULTS_MIME = "application/vnd.calckit.results+json"


@pytest.fixture(scope="module")
def runs():
    with ThreadPoolExecutor(2) as ex:
        futs = {c: ex.submit(execute_calc, c, spec(c).defaults()) for c in sorted(CALCS)}
        return {c: f.result() for c, f in futs.items()}


@pytest.mark.parametrize("calc", sorted(CALCS))
def test_default_parameters_run_headless(runs, calc):
    run = runs[calc]
    assert run.error == "", run.error
    assert run.payload is not None and run.payload["schema"] == "calckit.results/1"
    outs = [o for c in run.nb.cells for o in c.get("outputs", [])]
    assert not any(o.get("output_type") == "error" for o in outs)
    assert not any(WIDGET_MIME in o.get("data", {}) for o in outs)
    inter = next(c for c in run.nb.cells if "interactive" in c.metadata.get("tags", []))
    assert inter.outputs == []  # guarded by headless
    assert "nbval-skip" in inter.metadata.tags


@pytest.mark.parametrize("calc", sorted(CALCS))
def test_notebook_cells_only_call_calckit(calc):
    """No engineering logic in the notebooks: code cells are the parameters, one setup call, the slider
    cell and `calc.show(...)` lines."""
    import nbformat

    from calckit.record import template_path

    nb = nbformat.read(str(template_path(calc)), as_version=4)
    for c in nb.cells:
        if c.cell_type != "code" or "parameters" in c.metadata.get("tags", []):
            continue
        for line in c.source.splitlines():
            s = line.strip()
            assert (not s or s.startswith(("#", "from calckit", "calc = ", "calc.show(", "if not headless",
                                           "panel(calc)"))), (calc, line)


def test_checks_present_in_payloads(runs):
    beam = runs["steel_beam"].payload
    names = " ".join(c["name"] for c in beam["checks"])
    assert "Flexure" in names and "Shear" in names and "Deflection" in names
    girder = runs["plate_girder"].payload
    gnames = " ".join(c["name"] for c in girder["checks"])
    assert "weld" in gnames.lower() and "shear" in gnames.lower()
    sp = runs["section_properties"].payload
    assert sp["checks"] == [] and {s["symbol"] for s in sp["steps"]} >= {"A", "I_x", "Z_x", "M_p"}


def test_opened_by_hand_the_slider_cell_builds_the_panel_and_the_archive_drops_it():
    from calckit.render import export_html

    p = spec("section_properties").defaults()
    p["headless"] = False
    run = execute_calc("section_properties", p)
    assert run.error == "", run.error
    inter = next(c for c in run.nb.cells if "interactive" in c.metadata.get("tags", []))
    assert any(WIDGET_MIME in o.get("data", {}) for o in inter.outputs)
    html = export_html(run.nb, None)
    assert WIDGET_MIME not in html and "calckit.interactive" not in html


def test_interactive_panel_redraws_on_change():
    pytest.importorskip("ipywidgets")
    from calckit.interactive import panel, split_quantity
    from calckit.sheets import steel_beam

    calc = steel_beam(spec("steel_beam").defaults())
    box = panel(calc, display_now=False)
    controls = box.children[0].children[0].children
    span = controls[0]
    assert span.description == "span 1" and span.unit == "m"
    view = box.children[1]
    before = view.value
    assert "Summary of checks" in before and "<svg" in before
    span.value = span.value * 1.2  # triggers a rebuild
    assert view.value != before and "Summary of checks" in view.value
    section = next(c for c in controls if c.description == "section")
    section.value = "W8X10"  # far too light: the view says NOT OK, it does not break
    assert "NOT OK" in view.value
    assert split_quantity("0.75 kip/ft") == (0.75, "kip/ft")
    assert split_quantity("0") == (0.0, "")
