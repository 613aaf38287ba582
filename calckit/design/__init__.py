"""Design checks, one subpackage per standard: :mod:`calckit.design.aisc360`, :mod:`calckit.design.en1993`,
and the flange-to-web shear-flow design in :mod:`calckit.design.shear_flow`.

Every check returns a :class:`calckit.design.results.CheckResult`; a member-level check returns a
:class:`calckit.design.results.MemberResult`. A member that fails is a result, never an exception.
"""
