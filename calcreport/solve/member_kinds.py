"""Member checks by member type, beyond the bending, shear and deflection checks of
:mod:`calcreport.solve.member_checks`: welded steel plate girders (:mod:`.member_girder`) and wood box and
I-beams with panel webs (:mod:`.member_box`).

:func:`member_checks` returns the checks that ran and the :class:`Unchecked` items for what a
checker would expect of this member type that the job does not give enough for. The solver adds
both to the member's result.
"""

from __future__ import annotations

from ..model import Member, Settings
from ..steps import StepLog
from ..units import Quantity
from .results import Check, SectionResult, Unchecked

__all__ = ["member_checks", "member_type"]


def member_type(member: Member) -> str:
    """ "plies" (plies side by side), "steel" (every part steel), "panel-web" (wood flanges with plywood webs) or "other"."""
    if member.plies:
        return "plies"  # plies side by side: solve/plies_solve.py
    fams = {p.material.family for p in member.parts}
    if fams == {"steel"}:
        return "steel"
    if "plywood" in fams and fams <= {"plywood", "wood", "glulam"} and len(fams) > 1:
        return "panel-web"
    if fams <= {"wood", "glulam"}:
        return "wood"
    if "concrete" in fams and "steel" in fams:
        return "composite"
    return "other"


def member_checks(
    member: Member, section: SectionResult, beam, V: Quantity, settings: Settings, log: StepLog, joints=()
) -> tuple[tuple[Check, ...], tuple[Unchecked, ...]]:
    """The member-type checks of ``member`` and what of them did not run."""
    if settings.method == "EC5":  # no NDS / AISC member check under EC5 (owner: ec5)
        from .ec5_members import ec5_member_checks

        ec5_checks, ec5_missing = ec5_member_checks(member, section, beam, settings, log.child("ec5"))
        return tuple(ec5_checks), ec5_missing
    kind = member_type(member)
    if kind == "plies":
        from .plies import ply_shares
        from .plies_checks import ply_checks

        checks, unchecked = ply_checks(member, ply_shares(member), beam, settings, log.child("plies"), joints)
    elif kind == "steel":
        from .member_girder import girder_checks

        checks, unchecked = girder_checks(member, beam, V, settings, log.child("girder"), section, joints)
    elif kind == "panel-web":
        from .member_box import box_checks

        checks, unchecked = box_checks(member, section, beam, V, settings, log.child("box"))
    elif kind == "wood":
        from .member_wood import wood_bending_checks

        checks, unchecked = wood_bending_checks(member, section, beam, settings, log.child("wood"))
    elif kind == "composite":
        from .composite import construction_checks

        checks, unchecked = construction_checks(member, section, beam, log.child("composite"))
    else:
        return (), ()
    return tuple(checks), tuple(unchecked)
