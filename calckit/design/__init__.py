"""Design checks, one subpackage per standard: :mod:`calckit.design.aisc360`, :mod:`calckit.design.en1993`,
stresses through the depth in :mod:`calckit.design.stress`, and the shear flow between flange and web in
:mod:`calckit.design.shear_flow` (with the flange-to-web weld design in :mod:`calckit.design.flange_welds`
and fastened and cover-plated members in :mod:`calckit.design.built_up`).

Every check returns a :class:`calckit.design.results.CheckResult`; a member-level check returns a
:class:`calckit.design.results.MemberResult`. A member that fails is a result, never an exception.
"""
