"""Shared plumbing of the calc sheets: header, caution, figures, ordered parts and ``show``.

Figures are PNG images made from matplotlib figures with the ``Software`` metadata removed, so that an
archived notebook does not change when only the matplotlib version does and reruns are byte-identical.
"""
from __future__ import annotations

import io
from typing import Any, Callable, Mapping

__all__ = ["CalcSheet", "png", "figure_block", "PNG_DPI", "inputs_for_header"]

PNG_DPI = 110  #: resolution of calc-sheet figures (dots per inch)


def png(fig, dpi: int = PNG_DPI) -> bytes:
    """PNG bytes of a matplotlib figure, without the library-version metadata (deterministic)."""
    buf = io.BytesIO()
    fig.savefig(buf, format="png", dpi=dpi, facecolor="white", metadata={"Software": None})
    return buf.getvalue()


def figure_block(fig, caption: str = "", width: str = "100%"):
    """A calckit.render Figure block holding ``fig`` as deterministic PNG."""
    from ..render import Figure

    return Figure(png(fig), caption=caption, width=width)


def inputs_for_header(calc: str, p: Mapping[str, Any]) -> dict[str, tuple[str, str]]:
    """{parameter: (value as given, meaning)} for the header block (common fields left out)."""
    from ..params import COMMON, spec

    skip = {q.name for q in COMMON}
    out = {}
    for q in spec(calc).params:
        if q.name in skip:
            continue
        v = p.get(q.name)
        if q.kind == "records":
            text = "; ".join(", ".join(f"{k} {val}" for k, val in item.items() if val not in (None, ""))
                             for item in v) or "none"
        elif isinstance(v, list):
            text = ", ".join(map(str, v)) or "none"
        else:
            text = "" if v is None else str(v)
        out[q.name] = (text, q.help)
    return out


class CalcSheet:
    """Base of the calc sheets: ordered named parts, each a list of render blocks, built lazily.

    Subclasses set ``calc`` and ``title`` and register parts with ``self.part(name, builder)`` in the
    order the notebook shows them; ``show(name)`` displays one part, ``blocks()`` returns them all.
    """

    calc = ""
    title = ""

    def __init__(self, p: Mapping[str, Any]):
        self.p = dict(p)
        self.system = self.p.get("units", "SI")
        self._builders: dict[str, Callable[[], list]] = {}
        self._built: dict[str, list] = {}
        self.part("header", lambda: [self.header(), self.caution()])

    # -- parts -----------------------------------------------------------------------------------
    def part(self, name: str, builder: Callable[[], list]) -> None:
        self._builders[name] = builder

    @property
    def parts(self) -> list[str]:
        return list(self._builders)

    def get(self, name: str) -> list:
        if name not in self._builders:
            from ..errors import InputError

            raise InputError(f"part: got {name!r}; expected one of {', '.join(self._builders)}")
        if name not in self._built:
            out = self._builders[name]()
            self._built[name] = [b for b in (out if isinstance(out, (list, tuple)) else [out]) if b is not None]
        return self._built[name]

    def blocks(self) -> list:
        return [b for n in self.parts for b in self.get(n)]

    def show(self, *names: str) -> None:
        """Display the named parts (all when none is named) in the notebook."""
        from IPython.display import display

        for n in names or self.parts:
            for b in self.get(n):
                display(b)

    # -- common blocks ---------------------------------------------------------------------------
    def standard_text(self) -> str:
        return ""

    def header(self):
        from ..render import Header

        p = self.p
        title = self.title + (f": {p['description']}" if p.get("description") else "")
        return Header(project=p.get("project", ""), job=p.get("job", ""), member=p["member"], title=title,
                      designer=p.get("designer", ""), checker="", date=p.get("run_date") or "draft (not filed)",
                      revision=p.get("revision", ""), standard=self.standard_text(),
                      inputs=inputs_for_header(self.calc, p), system=self.system)

    def caution(self):
        from ..render import Caution

        return Caution()
