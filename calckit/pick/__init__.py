"""Lightest passing section for a member: ``calckit.pick(...)``.

Every catalog section of the chosen families (and optional depth and mass limits) is checked against
every check of the member's standard (AISC 360-22 LRFD/ASD or EN 1993-1-1), deflection included, each
with its own self-weight added to the dead load; passing sections are ranked by mass per length::

    import calckit
    res = calckit.pick(spans="35 ft", dead_udl="0.45 kip/ft", live_udl="0.75 kip/ft",
                       standard="AISC 360-22", method="LRFD", grade="A992", families="W")
    res.chosen.name, res.chosen.governing, res.chosen.ratio
    [c.name for c in res.lightest]              # the ten lightest passing, lightest first
    [(c.band, c.name) for c in res.by_band]     # the lightest of each depth band (W8, W10, ...)
    from calckit.pick import text_table, candidates_table
    print(text_table(res))                      # candidates_table(res): rows for display

Modules: :mod:`.member` (the member's parameters), :mod:`.response` (one analysis of the loads and one
of a unit self-weight, scaled for every candidate), :mod:`.checks` (the design modules' numeric
checks), :mod:`.search` (the search), :mod:`.result` (result records), :mod:`.report` (tables, the
record paragraph, the notebook helper and the ``calckit pick`` command), :mod:`.compare` (same-mass
comparison with a solid rectangle and a square hollow section). Figures: :mod:`calckit.pick_figures`.
Welded girder proportioning: :mod:`calckit.proportion`.

``calckit.pick(...)`` is :func:`calckit.pick.search.pick`. Importing a submodule (``calckit.pick.member``)
makes the package an attribute of ``calckit`` under the same name, so the package is callable too and
``calckit.pick(...)`` works in either order of imports.

A design aid only: the section chosen must be reviewed, and the calculation sealed, by a licensed or
chartered engineer; local codes, national annexes and project specifications govern.
"""
from __future__ import annotations

import sys
import types

from .member import Member, member, member_from_params
from .report import (CandidateTable, Selection, candidates_table, pick_main, record_paragraph, select_section,
                     text_table)
from .result import Candidate, PickResult
from .search import check_one, pick

__all__ = ["pick", "PickResult", "Candidate", "Member", "member", "member_from_params", "candidates_table",
           "CandidateTable", "text_table", "record_paragraph", "select_section", "Selection", "pick_main",
           "check_one", "compare_shapes"]


def __getattr__(name: str):
    if name in ("compare_shapes", "ShapeComparison"):
        from . import compare

        return getattr(compare, name)
    raise AttributeError(f"module 'calckit.pick' has no attribute {name!r}")


class _CallablePackage(types.ModuleType):
    """Makes ``calckit.pick(...)`` work when ``calckit.pick`` is this package (after any submodule import)."""

    def __call__(self, *args, **kwargs):
        return pick(*args, **kwargs)


sys.modules[__name__].__class__ = _CallablePackage
