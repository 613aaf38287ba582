"""Calc-sheet builders called by the notebooks in ``calcs/`` (the notebooks hold no engineering logic).

A notebook's first code cell after its parameters does::

    from calckit.sheets import steel_beam
    calc = steel_beam(globals())          # validate the parameters, analyse, check
    calc.show("loads")                    # later cells display one part each

Each builder takes the notebook namespace (or a mapping of parameters), picks the calc's declared
parameters (:mod:`calckit.params`), validates them exactly as the batch does, calls the engines
(:mod:`calckit.analysis`, :mod:`calckit.design`, :mod:`calckit.sections`) and returns a sheet object whose
parts are calckit.render blocks. ``calc.show("summary")`` displays the summary of checks, which writes the
machine-readable results payload read by the batch and by ``calckit verify``.

A design aid only: results must be reviewed, and the calculation sealed, by a licensed or chartered
engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

from typing import Any, Mapping

__all__ = ["steel_beam", "plate_girder", "section_properties", "collect", "section_label"]


def collect(calc: str, ns: Mapping[str, Any]) -> dict[str, Any]:
    """The declared parameters of ``calc`` taken from ``ns`` (a notebook's globals), validated."""
    from ..params import spec, validate

    names = spec(calc).names
    values = {k: ns[k] for k in names if k in ns}
    return validate(calc, values, source=f"{calc} notebook parameters", allow_reserved=True)


def section_label(calc: str, p: Mapping[str, Any]) -> str:
    """Short designation of the member's section for the batch summary."""
    if calc == "steel_beam":
        return str(p.get("section", ""))
    if calc == "plate_girder":
        bot = "" if p.get("bf_bot") in (None, p.get("bf_top")) and p.get("tf_bot") in (None, p.get("tf_top")) \
            else f" / {p.get('bf_bot') or p.get('bf_top')} x {p.get('tf_bot') or p.get('tf_top')}"
        return f"PG {p.get('d')} x {p.get('tw')} web, {p.get('bf_top')} x {p.get('tf_top')}{bot}"
    if calc == "section_properties":
        parts = p.get("parts") or []
        return "built-up: " + " + ".join(str(x.get("shape")) for x in parts)[:60]
    return ""


def steel_beam(ns: Mapping[str, Any]):
    """Steel beam calc: see :mod:`calckit.sheets.beam`."""
    from .beam import BeamSheet

    return BeamSheet(collect("steel_beam", ns))


def plate_girder(ns: Mapping[str, Any]):
    """Welded plate girder calc: see :mod:`calckit.sheets.girder`."""
    from .girder import GirderSheet

    return GirderSheet(collect("plate_girder", ns))


def section_properties(ns: Mapping[str, Any]):
    """Built-up section properties: see :mod:`calckit.sheets.builtup`."""
    from .builtup import BuiltUpSheet

    return BuiltUpSheet(collect("section_properties", ns))
