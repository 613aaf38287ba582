"""Utilisation bars of the calc sheets: HTML only (no image), cheap and printable."""
from __future__ import annotations

import html as _h
import math
from typing import Sequence

from ..render.latex import ratio_text

__all__ = ["utilisation_bars"]


class utilisation_bars:
    """Utilisation of every check as HTML bars, the limit 1.0 dashed, failing bars black."""

    kind = "util"

    def __init__(self, names: Sequence[str], ratios: Sequence[float], title: str = "Utilisation"):
        self.names, self.ratios, self.title = list(names), list(ratios), title

    def html(self, system: str | None = None) -> str:
        rows = []
        for n, r in zip(self.names, self.ratios):
            ok = r is not None and math.isfinite(r)
            v = min(float(r), 1.5) if ok else 1.5
            w = 100.0 * v / 1.5
            txt = ratio_text(float(r)) if ok else "inf"  # rounded up, as in the checks
            fill = "#000" if (not ok or r > 1.0) else "#999"
            rows.append(f'<tr><td>{_h.escape(n)}</td><td style="width:22em"><div style="position:relative;'
                        f'height:0.9em;border-left:1px solid #000"><div style="width:{w:.1f}%;height:100%;'
                        f'background:{fill}"></div><div style="position:absolute;left:66.7%;top:-2px;'
                        f'bottom:-2px;border-left:1px dashed #000"></div></div></td><td>{txt}</td></tr>')
        return (f'<h3 class="ck-h">{_h.escape(self.title)}</h3><table class="ck-table ck-util"><thead><tr>'
                '<th>Check</th><th>demand / capacity (dashed line: 1.0)</th><th>Ratio</th></tr></thead>'
                f'<tbody>{"".join(rows)}</tbody></table>')

    def _repr_html_(self) -> str:
        return f'<div class="ck-block ck-util">{self.html()}</div>'

    def __repr__(self) -> str:  # no memory address: records must be byte-identical between reruns
        return "Utilisation: " + ", ".join(f"{n} {ratio_text(float(r))}" for n, r in zip(self.names, self.ratios))
