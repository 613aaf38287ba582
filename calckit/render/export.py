"""Archive export: an executed notebook -> one self-contained, offline HTML file.

nbconvert's stock HTML loads MathJax and require.js from a CDN, so formulas stay raw TeX offline. Here:

1. cells tagged e.g. "interactive" are removed (nbconvert ``TagRemovePreprocessor``);
2. the notebook is converted with calckit's own template (``templates/calckit_archive``: extends the
   lab cell markup, but its page head carries only ``sheet.css`` and pygments CSS: no script, no
   stylesheet link, no font link);
3. every TeX formula left in the page (``\\(..\\)``, ``\\[..\\]``, ``$$..$$``, ``$..$``, outside
   ``<pre>``/``<code>``/``<script>``/``<style>``) is converted to MathML with latex2mathml;
4. an OpenType math font (Latin Modern Math from Debian's fonts-lmodern, or STIX Two / Libertinus Math
   if installed) is embedded unmodified when found, else the CSS falls back to the viewer's math font;
5. the result is checked: any ``<script src=...>`` or ``<link href=...>`` to http(s) is an error.

Images stay inline base64 PNG (nbconvert embeds them).
"""
from __future__ import annotations

import base64
import functools
import html as _html
import os
import re
from importlib import resources as _res
from pathlib import Path
from typing import Iterable

from ..errors import InputError

__all__ = ["export_html", "tex_to_mathml", "mathml_html", "page", "sheet_css", "find_math_font",
           "external_refs"]

_TEMPLATE_DIR = Path(__file__).with_name("templates")
_SKIP = re.compile(r"<(pre|code|script|style|math|textarea)\b[^>]*>.*?</\1\s*>", re.S | re.I)
_MATH = re.compile(
    r"\\\[(?P<d1>.+?)\\\]"           # \[ ... \]
    r"|\$\$(?P<d2>.+?)\$\$"          # $$ ... $$
    r"|\\\((?P<i1>.+?)\\\)"          # \( ... \)
    r"|(?<![\\$\w])\$(?P<i2>[^$\s](?:[^$]*?[^$\s])?)\$(?!\w)",   # $ ... $ (not $$, no space inside edges)
    re.S,
)
_FONT_CANDIDATES = (
    "/usr/share/texmf/fonts/opentype/public/lm-math/latinmodern-math.otf",
    "/usr/share/fonts/opentype/latinmodern-math/latinmodern-math.otf",
    "/usr/share/fonts/opentype/stix-two/STIXTwoMath-Regular.otf",
    "/usr/share/fonts/opentype/libertinus/LibertinusMath-Regular.otf",
    "/usr/share/texmf/fonts/opentype/public/tex-gyre-math/texgyretermes-math.otf",
)
_FONT_NAME = "calckit math"


@functools.lru_cache(maxsize=4096)
def tex_to_mathml(tex: str, display: bool = False) -> str:
    """MathML for one TeX formula (latex2mathml); raw TeX in ``<code class="ck-tex">`` if it fails."""
    from latex2mathml.converter import convert

    try:
        out = convert(tex.strip(), display="block" if display else "inline")
    except Exception:  # latex2mathml raises many types for unsupported input
        return f'<code class="ck-tex">{_html.escape(tex)}</code>'
    return out


def _convert_text(chunk: str) -> str:
    def repl(m: re.Match) -> str:
        g = m.groupdict()
        tex = g["d1"] or g["d2"]
        display = tex is not None
        if tex is None:
            tex = g["i1"] if g["i1"] is not None else g["i2"]
        return tex_to_mathml(_html.unescape(tex), display)

    return _MATH.sub(repl, chunk)


def mathml_html(page_html: str) -> str:
    """Replace every TeX formula in an HTML string by MathML (skipping pre/code/script/style/math)."""
    out, pos = [], 0
    for m in _SKIP.finditer(page_html):
        out.append(_convert_text(page_html[pos:m.start()]))
        out.append(m.group(0))
        pos = m.end()
    out.append(_convert_text(page_html[pos:]))
    return "".join(out)


def sheet_css() -> str:
    """The archive stylesheet (plain, printable, black on white)."""
    return _res.files(__package__).joinpath("sheet.css").read_text(encoding="utf-8")


def find_math_font() -> str | None:
    """Path of an OpenType math font on this machine (env CALCKIT_MATH_FONT first), or None."""
    env = os.environ.get("CALCKIT_MATH_FONT")
    for p in ((env,) if env else ()) + _FONT_CANDIDATES:
        if p and os.path.isfile(p):
            return p
    return None


@functools.lru_cache(maxsize=4)
def _font_face(path: str) -> str:
    data = base64.b64encode(Path(path).read_bytes()).decode("ascii")
    return (f'@font-face{{font-family:"{_FONT_NAME}";src:url(data:font/otf;base64,{data}) format("opentype");}}'
            f'math{{font-family:"{_FONT_NAME}","Latin Modern Math","STIX Two Math","Cambria Math",math;}}')


def _head_css(embed_font) -> str:
    css = sheet_css()
    if embed_font is False or embed_font is None:
        font = None
    elif embed_font is True or embed_font == "auto":
        font = find_math_font()
        if font is None and embed_font is True:
            raise InputError("embed_font: got True, but no OpenType math font was found; install Debian's "
                             "fonts-lmodern or set CALCKIT_MATH_FONT to a math font file")
    else:
        font = str(embed_font)
        if not os.path.isfile(font):
            raise InputError(f"embed_font: got {font!r}; expected 'auto', True, False or a font file path")
    if font:
        css = _font_face(font) + "\n" + css
    return css


def page(body_html: str, title: str = "Calculation", embed_font="auto") -> str:
    """A complete offline HTML page around a fragment (TeX in it becomes MathML)."""
    doc = ('<!DOCTYPE html><html lang="en"><head><meta charset="utf-8">'
           '<meta name="viewport" content="width=device-width, initial-scale=1.0">'
           f"<title>{_html.escape(title)}</title><style>{_head_css(embed_font)}</style></head>"
           f'<body class="ck-page"><main>{body_html}</main></body></html>')
    return finish(doc)


_NB_STYLE = re.compile(r"<style data-ck-nb>.*?</style>", re.S)
_EXT = re.compile(
    r"<script\b[^>]*\bsrc\s*=\s*[\"']?\s*(?:https?:)?//[^>]*>"
    r"|<link\b[^>]*\bhref\s*=\s*[\"']?\s*(?:https?:)?//[^>]*>"
    r"|@import\s+(?:url\()?\s*[\"']?(?:https?:)?//"
    r"|url\(\s*[\"']?(?:https?:)?//",
    re.I,
)


def external_refs(page_html: str) -> list[str]:
    """Every script/stylesheet/font reference to the network in a page (should be empty)."""
    return [m.group(0) for m in _EXT.finditer(page_html)]


def finish(doc: str) -> str:
    """Drop notebook-only styles, convert TeX to MathML, and refuse network references."""
    doc = _NB_STYLE.sub("", doc)
    doc = mathml_html(doc)
    bad = external_refs(doc)
    if bad:
        raise InputError(f"export: the page still refers to the network ({bad[0][:80]!r}); "
                         "an offline archive may not")
    return doc


def _load_nb(nb_or_path):
    import nbformat

    if isinstance(nb_or_path, (str, os.PathLike)):
        return nbformat.read(str(nb_or_path), as_version=4), Path(nb_or_path).stem
    if isinstance(nb_or_path, dict) and "cells" in nb_or_path:
        import copy
        return nbformat.from_dict(copy.deepcopy(dict(nb_or_path))), "calculation"
    raise InputError(f"notebook: got {type(nb_or_path).__name__}; expected a path to a .ipynb or a notebook")


def export_html(notebook_path_or_nb, out_path=None, remove_tags: Iterable[str] = ("interactive",), *,
                include_input: bool = False, hide_input_tags: Iterable[str] = ("hide-input",),
                title: str | None = None, embed_font="auto") -> str:
    """Write the archive HTML of an executed notebook and return it.

    Parameters
    ----------
    notebook_path_or_nb : path to a .ipynb, or an nbformat notebook.
    out_path : file to write (None: only return the HTML).
    remove_tags : cells carrying any of these tags are left out entirely.
    include_input : show code cells' source (default False: a calc sheet shows outputs and text).
    hide_input_tags : cells whose source is hidden even when ``include_input`` is True.
    title : page title (default: notebook metadata title, else the file name).
    embed_font : "auto" (embed a math font if one is installed), True (require one), False, or a path.
    """
    from nbconvert import HTMLExporter
    from nbconvert.preprocessors import TagRemovePreprocessor
    from traitlets.config import Config

    nb, stem = _load_nb(notebook_path_or_nb)
    if title:
        nb.metadata["title"] = title
    c = Config()
    c.TagRemovePreprocessor.remove_cell_tags = set(remove_tags)
    c.TagRemovePreprocessor.remove_input_tags = set(hide_input_tags)
    c.TagRemovePreprocessor.enabled = True
    exporter = HTMLExporter(config=c, template_name="calckit_archive",
                            extra_template_basedirs=[str(_TEMPLATE_DIR)])
    exporter.exclude_input = not include_input
    exporter.exclude_input_prompt = True
    exporter.exclude_output_prompt = True
    exporter.register_preprocessor(TagRemovePreprocessor(config=c), enabled=True)
    resources = {"metadata": {"name": nb.metadata.get("title", stem)},
                 "calckit_css": _head_css(embed_font)}
    body, _ = exporter.from_notebook_node(nb, resources=resources)
    doc = finish(body)
    if out_path is not None:
        Path(out_path).write_text(doc, encoding="utf-8")
    return doc
