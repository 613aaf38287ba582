"""Result record of the EN 1993 checks: a :class:`~calckit.design.results.CheckResult` whose ``data``
entries are also attributes (``res.Mcr``, ``res.chi_LT``, ``res.lambda_LT``, ``res.V_pl_Rd`` ...)."""
from __future__ import annotations

from dataclasses import dataclass

from ..results import CheckResult

__all__ = ["ENResult", "rated"]


@dataclass(frozen=True)
class ENResult(CheckResult):
    """A CheckResult for EN 1993; every key of ``data`` reads as an attribute (SI floats or text).

    Common entries: ``annex`` (national-annex set used), ``gamma_M0``/``gamma_M1``, ``fy``, ``class``;
    lateral-torsional buckling adds ``Mcr``, ``C1``, ``C2``, ``C3``, ``lambda_LT``, ``chi_LT``
    (EN's chi_LT, before any modification), ``chi_LT_mod`` (used in M_b,Rd), ``f``, ``kc``, ``curve``,
    ``alpha_LT``, ``Phi_LT``.
    """

    def __getattr__(self, name: str):
        data = self.__dict__.get("data")
        if data is not None and name in data:
            return data[name]
        raise AttributeError(f"{type(self).__name__} has no attribute or data entry {name!r}")


def rated(demand: float | None = None, **fields) -> ENResult:
    """An :class:`ENResult` with ``demand``, ``ratio`` and ``passed`` filled in exactly as
    :meth:`CheckResult.with_demand` does, built in one step (no copy: this runs per section in a search)."""
    if demand is not None:
        cap = fields["capacity"]
        d = abs(demand)
        ratio = d / cap if cap > 0 else float("inf")
        fields["demand"], fields["ratio"], fields["passed"] = d, ratio, ratio <= 1.0 + 1e-9
    return ENResult(**fields)
