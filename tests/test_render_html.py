"""Tests of the document blocks and the offline archive export (calckit.render.blocks / export).

Checks: no http(s) script, stylesheet or font reference in the exported page; every MathML element is
well-formed XML (xml.etree); TeX is fully converted; tagged cells are removed; the caution, header and
summary carry what the brief lists. A headless-Chromium screenshot test runs only where Debian's
chromium is installed (it is not a test dependency).

Engineering values (W18x50, AISC Design Examples v15.1 F.1-1A / F.1-2) only feed the layout here.
"""
from __future__ import annotations

import re
import shutil
import subprocess
import xml.etree.ElementTree as ET

import nbformat
import pytest

from calckit.render import (Caution, Condition, Figure, Formula, Header, Section, Sheet, Summary, Table,
                            Text, check, export_html, given)
from calckit.render.export import external_refs, mathml_html

MATHML_NS = "{http://www.w3.org/1998/Math/MathML}"

MP = Formula("M_n", "F_y*Z_x", dims={"M_n": "moment", "F_y": "stress", "Z_x": "modulus"},
             ref="AISC 360-22 Eq. F2-1", label="plastic moment")
LP = Formula("L_p", "1.76*r_y*sqrt(E/F_y)", dims={"L_p": "span", "r_y": "length", "E": "stress",
                                                   "F_y": "stress"}, ref="AISC 360-22 Eq. F2-5")
PHI = Formula("M_c", "phi_b*M_n", latex={"M_c": r"\phi_{b} M_{n}"}, dims={"M_c": "moment", "M_n": "moment"},
              ref="AISC 360-22 F1(1)")
Z2 = Condition("L_p < L_b <= L_r", dims={"L_p": "span", "L_b": "span", "L_r": "span"},
               then="inelastic lateral-torsional buckling applies", ref="AISC 360-22 F2.2(b)")


def _checks():
    mp = MP.step(F_y="50 ksi", Z_x="101 in**3")
    lp = LP.step(r_y="1.65 in", E="29000 ksi", F_y="50 ksi")
    z = Z2.step(L_p=lp, L_b="11.7 ft", L_r="16.9 ft")
    cap = PHI.step(phi_b=0.9, M_n=mp)
    c1 = check("Flexure", given("M_u", "266 kip*ft", "moment", reference="analysis"), cap,
               steps=[mp, lp, z, cap], reference="AISC 360-22 F2")
    c2 = check("Shear", given("V_u", "400 kip", "force"), given("phi_v V_n", "306 kip", "force",
                                                              latex=r"\phi_{v} V_{n}"), reference="AISC 360-22 G2.1")
    return c1, c2


HEADER = Header(project="Test project", job="J-1", member="B-1", title="Beam B-1", designer="AE",
                checker="BC", date="2025-01-15", revision="0", standard="AISC 360-22 (LRFD)",
                inputs={"Span": "35 ft", "w_L": ("0.75 kip/ft", "live load")}, system="US")


def _out(block):
    if hasattr(block, "_repr_mimebundle_"):
        data = block._repr_mimebundle_()
    else:
        data = {"text/html": block._repr_html_(), "text/plain": repr(type(block).__name__)}
    return nbformat.v4.new_output("display_data", data=data)


def make_notebook():
    c1, c2 = _checks()
    nb = nbformat.v4.new_notebook()
    nb.cells.append(nbformat.v4.new_markdown_cell("# Beam\nMath in text: $M_n = F_y Z_x$ and\n\n$$\\phi_b M_n \\ge M_u$$"))
    for block in (HEADER, Caution(), Section("Flexure", [c1], number="1", system="US"),
                  Section("Shear", [c2], system="US"), Text("A note with $\\lambda_{p}$ math.", title="Notes"),
                  Table(["Case", "$w$"], [["D", "0.45 kip/ft"], ["L", "0.75 kip/ft"]], caption="Loads"),
                  Summary([c1, c2], header=HEADER, system="US")):
        cell = nbformat.v4.new_code_cell("display(block)")
        cell.outputs = [_out(block)]
        nb.cells.append(cell)
    tagged = nbformat.v4.new_code_cell("slider()")
    tagged.metadata["tags"] = ["interactive"]
    tagged.outputs = [nbformat.v4.new_output("stream", name="stdout", text="INTERACTIVE-ONLY\n")]
    nb.cells.append(tagged)
    return nb


@pytest.fixture(scope="module")
def page(tmp_path_factory):
    nb = make_notebook()
    path = tmp_path_factory.mktemp("nb") / "beam.ipynb"
    nbformat.write(nb, str(path))
    out = path.with_suffix(".html")
    html = export_html(path, out, remove_tags=("interactive",), embed_font=False)
    assert out.read_text(encoding="utf-8") == html
    return html


def test_no_network_script_or_stylesheet(page):
    assert external_refs(page) == []
    for tag in re.findall(r"<(?:script|link)\b[^>]*>", page, re.I):
        assert not re.search(r"(src|href)\s*=\s*[\"']?\s*(https?:)?//", tag, re.I), tag
    assert "<script" not in page.lower()
    assert "mathjax" not in page.lower() and "require.js" not in page.lower()
    assert not re.search(r"<link\b", page, re.I)


def test_mathml_is_well_formed_and_tex_is_gone(page):
    maths = re.findall(r"<math\b.*?</math>", page, re.S)
    assert len(maths) > 10
    for m in maths:
        root = ET.fromstring(m)
        assert root.tag == MATHML_NS + "math"
    body = re.sub(r"<(pre|code|style)\b.*?</\1>", "", page, flags=re.S)
    assert "\\(" not in body and "\\[" not in body and "$$" not in body
    assert 'class="ck-tex"' not in page   # no formula fell back to raw TeX


def test_tagged_cells_removed_and_blocks_present(page):
    assert "INTERACTIVE-ONLY" not in page
    assert "slider()" not in page            # code input hidden by default
    for text in ("Test project", "J-1", "B-1", "Designed by", "Checked by", "2025-01-15", "Revision",
                 "AISC 360-22 (LRFD)", "calckit version", "35 ft", "live load", "licensed professional engineer",
                 "national annexes", "responsible for the inputs", "Summary of checks", "governs", "NOT OK"):
        assert text in page, text
    assert "break-inside: avoid" in page and "@media print" in page


def test_print_css_is_black_on_white(page):
    css = re.search(r"<style>(.*?)</style>", page, re.S).group(1)
    colours = set(re.findall(r"(?<![\w-])(?:color|background)\s*:\s*([^;}]+)", css))
    assert colours <= {"#000", "#fff", "transparent !important", "#000 !important"}, colours


def test_governing_check_marked_once():
    c1, c2 = _checks()
    html = Summary([c1, c2], system="US").html()
    assert html.count("ck-govmark") == 1
    row = re.search(r'<tr class="ck-gov">(.*?)</tr>', html).group(1)
    assert "Shear" in row                   # 400/306 = 1.31 governs over 266/305 = 0.87


def test_notebook_reprs_use_tex_delimiters():
    c1, _ = _checks()
    html = Section("Flexure", [c1], system="US")._repr_html_()
    assert "\\[" in html and "<math" not in html        # JupyterLab typesets TeX itself
    md = Section("Flexure", [c1], system="US")._repr_markdown_()
    assert "$M_{n} = F_{y} Z_{x}" in md
    assert "| 1 |" in md


def test_mathml_conversion_skips_code_and_keeps_text():
    s = mathml_html(r"<p>x \(a_{1}\) y</p><pre>\(not math\)</pre><p>costs $5 and $$b^{2}$$</p>")
    assert "<pre>\\(not math\\)</pre>" in s
    assert s.count("<math") == 2
    assert "costs $5 and" in s


def test_sheet_standalone_page_and_figure():
    import matplotlib
    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    fig, ax = plt.subplots(figsize=(3, 2))
    ax.plot([0, 1], [0, 1], "k")
    c1, c2 = _checks()
    sheet = Sheet(system="US").add(HEADER, Caution(), Section("Flexure", [c1]), Figure(fig, caption="M diagram"),
                                   Summary([c1, c2]))
    plt.close(fig)
    doc = sheet.standalone_html(title="B-1")
    assert 'src="data:image/png;base64,' in doc
    assert external_refs(doc) == []
    for m in re.findall(r"<math\b.*?</math>", doc, re.S):
        ET.fromstring(m)
    assert sheet.payload()["status"] == "NOT OK"


def test_embedded_math_font_when_available(tmp_path):
    from calckit.render.export import find_math_font

    font = find_math_font()
    if font is None:
        pytest.skip("no OpenType math font installed (Debian fonts-lmodern provides one)")
    doc = Sheet().add(Caution()).standalone_html()
    assert "@font-face" in doc and "data:font/otf;base64," in doc
    assert external_refs(doc) == []


@pytest.mark.skipif(shutil.which("chromium") is None, reason="Debian chromium not installed")
def test_chromium_renders_page(page, tmp_path):
    html = tmp_path / "page.html"
    html.write_text(page, encoding="utf-8")
    png = tmp_path / "shot.png"
    cmd = ["chromium", "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
           "--disable-component-update", "--disable-sync", "--no-first-run",
           f"--user-data-dir={tmp_path / 'profile'}", "--window-size=900,1400", f"--screenshot={png}",
           html.as_uri()]
    subprocess.run(cmd, capture_output=True, timeout=90)
    assert png.exists() and png.stat().st_size > 10_000
