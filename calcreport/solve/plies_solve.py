"""Members of plies side by side in the solver (issue 14): the hooks :func:`.member.solve_member`
calls instead of the V·Q/I joints — load sharing, transfer demand and the fastener lines
(:func:`ply_joints`), and the values the tool chose (:func:`ply_assumed`)."""

from __future__ import annotations

from dataclasses import replace

from ..model import Member, Settings
from ..steps import StepLog
from ..units import Q_, Quantity
from .assumed import member_assumed
from .callout import stagger_line
from .plies import plies_assumed, ply_shares, transfer_demand
from .plies_checks import plate_assumed
from .plies_lines import SRC_PRACTICE, default_spacing_max, joint_record, ply_lines, solve_ply_lines
from .results import Assumed, Check, JointResult, SolveError, worst

__all__ = ["ply_joints", "ply_assumed"]


def ply_joints(member: Member, beam, settings: Settings, log: StepLog) -> tuple[JointResult, ...]:
    """Shares by E·I, transfer demand along x per combination, and every fastener line."""
    if beam is None:
        raise SolveError(f"member[{member.id}]", "a member of plies needs span and loads along it")
    plog = log.child("plies")
    shares = ply_shares(member, plog)
    demand = transfer_demand(member, beam, shares, plog.child("transfer"), beam.self_weight)
    joints = solve_ply_lines(member, beam, shares, demand, settings, log)
    return _staggered_lines(joints, member.ply_fastening is not None and member.ply_fastening.staggered)


def _staggered_lines(joints: tuple[JointResult, ...], staggered: bool) -> tuple[JointResult, ...]:
    """Three plies nailed from both faces with ``staggered = true``: the second line's rows lie
    midway between the first line's rows, no gap wider than its own schedule allows
    (:func:`.callout.stagger_line`; common practice, no source). When the first line's rows are
    too far apart for that, the second keeps rows midway between its own; where they meet the
    first line's, its check of the points from the two faces is NG, as without stagger."""
    if not staggered or len(joints) != 2 or any(j.callout is None for j in joints):
        return joints
    a, b = joints
    assert a.callout is not None and b.callout is not None
    cb = stagger_line(b.callout, a.id, ref=a.callout.rows_at)
    if cb.stagger_met:  # b's rows midway between a's
        return (replace(a, callout=stagger_line(a.callout, b.id)), replace(b, callout=cb))
    ca = stagger_line(a.callout, b.id, ref=b.callout.rows_at)
    if ca.stagger_met:  # b is the denser line: a's rows midway between b's
        return (replace(a, callout=ca), replace(b, callout=stagger_line(b.callout, a.id)))
    # neither fits midway between the other's rows under the two schedules: b keeps rows midway
    # between its own, not shown clear of a's; where they fall on a row of a, the points meet
    meet = {round(x, 6) for x in cb.offset_at} & {round(x, 6) for x in a.callout.rows_at}
    note = (
        f"staggered = true, but neither line's rows fit midway between the other's under the two schedules: "
        f"the rows of {b.id} " + ("fall at rows of " + a.id + " at some x, where the points meet" if meet
                                  else "are not shown clear of those of " + a.id) + "; place them clear of each other"
    )  # fmt: skip
    checks = tuple(_unstaggered(c, note, bool(meet)) for c in b.checks)
    b = replace(b, checks=checks, status=worst([b.status] + [c.status for c in checks]), callout=cb)
    return (replace(a, callout=replace(stagger_line(a.callout, b.id), stagger_met=False)), b)


def ply_assumed(
    member: Member, settings: Settings, joints: tuple[JointResult, ...], beam
) -> tuple[Assumed, ...]:
    """The member's assumed values, with the ply fastening's connector keys named where they are
    written ([member.ply_fastening.connector]) and the values the ply layout sets."""
    f = member.ply_fastening
    assert f is not None
    view = replace(member, joints=tuple(joint_record(line, f) for line in ply_lines(member)))
    out = []
    for a in member_assumed(view, settings, joints, beam):
        if a.key.endswith((".planes", ".staggered")):
            continue  # set by the ply layout and ply_fastening.staggered
        if a.key.startswith("material[") and a.key.endswith("].Fb"):
            continue  # the ply checks apply C_D, CF, Cr, CL: their CM, Ct record is in plies_assumed
        a = replace(a, where=a.where.replace("[member.joint.connector]", "[member.ply_fastening.connector]"))
        if a.key.endswith((".angle_side", ".angle_main")) and f.connector.kind in ("wood_bolt", "lag_screw"):
            a = replace(
                a, value=90.0, source="load between plies acts perpendicular to grain (NDS 2018 §12.3.3)"
            )
        out.append(a)
    out += plies_assumed(member)
    if f.spacing_max is None:
        out.append(Assumed(f"{f.key}.spacing_max", "Largest spacing of the ply fasteners",
                           default_spacing_max(f.connector.kind), f"spacing_max in [{f.key}]", SRC_PRACTICE))  # fmt: skip
    out += plate_assumed(member, joints)
    _ = Q_
    return tuple(out)


def _unstaggered(c: Check, note: str, meet: bool) -> Check:
    """The overlap check of a line whose stated stagger the schedules do not keep: its note says
    so; NG, as without stagger, where rows of the two lines fall at the same x (``_overlap_check``
    in :mod:`.plies_lines`; common practice, no source)."""
    over = c.demand
    if not c.key.endswith(".faces") or c.status != "INFO" or not isinstance(over, Quantity):
        return c
    x = float(over.to("inch").magnitude)
    if x <= 0:
        return c
    return replace(c, status="NG", ratio=1.0 + x, note=note) if meet else replace(c, note=note)
