"""Machine-readable results payload of a calc, written into notebook outputs and read back.

The payload is a JSON object stored in a display output under the mime type
``application/vnd.calckit.results+json`` (``RESULTS_MIME``); displaying a :class:`~calckit.render.Summary`
writes it. :func:`read_results` finds it in an executed ``.ipynb`` (for the batch summary and
re-verification); :func:`records_from_payload` rebuilds the Check records.

Schema ``calckit.results/1``::

    {"schema": "calckit.results/1", "calckit_version": str, "system": "SI" | "US",
     "status": "OK" | "NOT OK", "passed": bool, "governing": str | null, "max_ratio": float | null,
     "header": {field: str, ..., "Inputs": {name: str}} | null,
     "checks": [Check.to_dict() + {"si_unit", "display_unit", "demand_display", "capacity_display",
                "governing"}],
     "steps": [Step.to_dict() + {"si_unit"}]}

Values are SI floats (``si_unit`` names the unit); ``*_display`` are the converted values (unrounded)
in ``display_unit``. Non-finite numbers are written as the strings "inf" / "nan" (JSON has none).
"""
from __future__ import annotations

import json
import math
from typing import Any, Sequence

from ..errors import InputError
from .numfmt import base_dim, display_unit_for, si_to_display
from .records import Check, Step, record_from_dict

__all__ = ["RESULTS_MIME", "SCHEMA", "results_payload", "read_all_results", "read_results",
           "records_from_payload", "payload_output"]

RESULTS_MIME = "application/vnd.calckit.results+json"
SCHEMA = "calckit.results/1"


def _si_unit(dim: str) -> str:
    from ..units import DIMS

    return DIMS[base_dim(dim)][0]


def _fin(v: float):
    v = float(v)
    return v if math.isfinite(v) else repr(v)


def results_payload(checks: Sequence[Check], *, header=None, steps: Sequence[Step] = (),
                    system: str = "SI") -> dict[str, Any]:
    """Build the payload for ``checks`` (and extra ``steps``); JSON-serialisable."""
    from .. import __version__
    from .html import governing_index

    gi = governing_index(checks)
    out_checks = []
    for i, c in enumerate(checks):
        if not isinstance(c, Check):
            raise InputError(f"checks: got {type(c).__name__}; expected Check records")
        d = c.to_dict()
        unit = display_unit_for(c.dim, system)
        d.update(si_unit=_si_unit(c.dim), display_unit=unit,
                 demand_display=_fin(si_to_display(c.demand, c.dim, unit)),
                 capacity_display=_fin(si_to_display(c.capacity, c.dim, unit)), governing=i == gi)
        out_checks.append(d)
    out_steps = []
    for s in steps:
        d = s.to_dict()
        if isinstance(s, Step):
            d["si_unit"] = _si_unit(s.dim)
        out_steps.append(d)
    passed = all(c.passed for c in checks)
    hdr = header.to_dict() if hasattr(header, "to_dict") else (dict(header) if header else None)
    payload = {
        "schema": SCHEMA, "calckit_version": __version__, "system": system.upper(),
        "status": "OK" if passed else "NOT OK", "passed": passed,
        "governing": checks[gi].name if gi is not None else None,
        "max_ratio": _fin(checks[gi].ratio) if gi is not None else None,
        "header": hdr, "checks": out_checks, "steps": out_steps,
    }
    json.dumps(payload)  # fail here, not in the notebook writer, if anything is not serialisable
    return payload


def payload_output(payload: dict[str, Any]):
    """An nbformat display_data output carrying ``payload`` (for writing notebooks directly)."""
    import nbformat

    return nbformat.v4.new_output("display_data", data={RESULTS_MIME: payload, "text/plain": "calckit results"})


def _load(nb_or_path):
    if isinstance(nb_or_path, dict) and "cells" in nb_or_path:
        return nb_or_path
    import nbformat

    return nbformat.read(str(nb_or_path), as_version=4)


def read_all_results(nb_or_path) -> list[dict[str, Any]]:
    """Every results payload in an executed notebook (path or nbformat node), in cell order."""
    nb = _load(nb_or_path)
    found = []
    for cell in nb.get("cells", []):
        for out in cell.get("outputs", []) or []:
            data = out.get("data") or {}
            if RESULTS_MIME in data:
                p = data[RESULTS_MIME]
                if isinstance(p, str):  # some writers store JSON mime data as text
                    p = json.loads(p)
                found.append(_plain(p))
    return found


def read_results(nb_or_path) -> dict[str, Any]:
    """The results payload of an executed notebook (the last one if several); InputError if none."""
    found = read_all_results(nb_or_path)
    if not found:
        raise InputError(f"notebook: got {nb_or_path!r} with no {RESULTS_MIME} output; "
                         "expected an executed calc notebook that displays a Summary")
    return found[-1]


def records_from_payload(payload: dict[str, Any]) -> list[Check]:
    """Rebuild the Check records (with their steps) from a payload."""
    if payload.get("schema") != SCHEMA:
        raise InputError(f"payload schema: got {payload.get('schema')!r}; expected {SCHEMA!r}")
    return [record_from_dict(c) for c in payload["checks"]]


def _plain(x):
    """nbformat gives NotebookNode (dict subclass); return plain dicts/lists for comparison."""
    if isinstance(x, dict):
        return {k: _plain(v) for k, v in x.items()}
    if isinstance(x, list):
        return [_plain(v) for v in x]
    return x
