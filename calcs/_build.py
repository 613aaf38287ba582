"""Write the calc notebook templates of this folder from their cell lists (a developer tool).

    .venv/bin/python calcs/_build.py          # rewrite calcs/*.ipynb

The parameters cell of each notebook is generated from the declaration in ``calckit/params.py``, so the
two cannot drift apart (tests/test_notebooks.py checks it with papermill.inspect_notebook). Every other
cell only calls into calckit: the notebooks hold no engineering logic. Cell ids are fixed so that
archived records are byte-identical between reruns.
"""
from __future__ import annotations

import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE.parent))

CAUTION = ("*A design aid only: the results must be reviewed, and the calculation sealed, by a licensed or "
           "chartered engineer; local codes, national annexes and project specifications govern.*")
HOWTO = (
    "**How to use.** Edit the parameters cell (quantities are text with units, e.g. `\"9.0 m\"`, "
    "`\"0.75 kip/ft\"`; the comment after each line says what it is) and run all cells. In JupyterLab set "
    "`headless = False` to get sliders and pickers that update the diagrams and the utilisation live. "
    "For the record, run the calc from a parameter file with `calckit run FILE.yaml`: it is then filed "
    "under `outputs/<date>/<member>/` with a manifest line and can be re-verified with `calckit verify`.")

INTERACTIVE = ("# Sliders and pickers (JupyterLab only; skipped when headless and left out of the archive)\n"
               "if not headless:\n"
               "    from calckit.interactive import panel\n"
               "    panel(calc)")

NOTEBOOKS = {
    "steel_beam": {
        "title": "# Steel beam\nLoads and load combinations, shear, moment and deflection, section "
                 "properties, the stress profile through the depth, every check to the chosen standard "
                 "(AISC 360-22 LRFD/ASD or EN 1993-1-1), deflection limits and the summary.",
        "setup": "from calckit.sheets import steel_beam\ncalc = steel_beam(globals())\ncalc.show(\"header\")",
        "parts": ["loads", "analysis", "section", "stress", "checks", "deflection", "summary"],
    },
    "plate_girder": {
        "title": "# Welded plate girder\nPlate proportions, classification of the plates, bending, shear "
                 "with the transverse stiffener spacing, and the flange-to-web welds from the shear flow "
                 "VQ/I along the span.",
        "setup": "from calckit.sheets import plate_girder\ncalc = plate_girder(globals())\n"
                 "calc.show(\"header\")",
        "parts": ["loads", "analysis", "proportions", "classification", "bending", "shear", "bearing",
                  "welds", "deflection", "summary"],
    },
    "section_properties": {
        "title": "# Built-up section properties\nA section of plates and rolled shapes placed freely "
                 "(each by the lower-left corner of its bounding box), with every property for the record.",
        "setup": "from calckit.sheets import section_properties\ncalc = section_properties(globals())\n"
                 "calc.show(\"header\")",
        "parts": ["parts", "figure", "properties", "moments", "summary"],
    },
}


def build(name: str, spec: dict):
    import nbformat
    from nbformat.v4 import new_code_cell, new_markdown_cell, new_notebook

    from calckit.params import parameters_cell

    cells = [new_markdown_cell(spec["title"] + "\n\n" + CAUTION + "\n\n" + HOWTO, id="intro")]
    cells.append(new_code_cell(parameters_cell(name), id="parameters", metadata={"tags": ["parameters"]}))
    cells.append(new_code_cell(spec["setup"], id="setup"))
    cells.append(new_code_cell(INTERACTIVE, id="interactive",
                               metadata={"tags": ["interactive", "nbval-skip", "nbval-ignore-output"]}))
    for part in spec["parts"]:
        cells.append(new_code_cell(f'calc.show("{part}")', id=f"show-{part}"))
    nb = new_notebook(cells=cells, metadata={
        "kernelspec": {"name": "python3", "display_name": "Python 3 (ipykernel)", "language": "python"},
        "language_info": {"name": "python"},
        "title": name.replace("_", " "),
    })
    nbformat.validate(nb)
    path = HERE / f"{name}.ipynb"
    nbformat.write(nb, str(path))
    return path


if __name__ == "__main__":
    for n, s in NOTEBOOKS.items():
        print("wrote", build(n, s))
