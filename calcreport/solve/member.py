"""Solver: validated model → results with derivation steps. Formats nothing.

``solve_job(job)`` runs, per member: section properties (:mod:`.section`), design shear,
then per joint: Q, shear flow, connector design value (:mod:`.connectors`) and spacing
(:mod:`.spacing`).
"""

from __future__ import annotations

from dataclasses import replace
from typing import Any

from ..model import Job, Joint, Member, Settings
from ..outlines import contact_segments
from ..steps import StepLog
from ..units import Q_, Quantity
from . import connectors
from .assumed import job_assumed, member_assumed
from .callout import joint_callout
from .results import Check, JobResult, JointResult, MemberResult, SectionResult, SolveError, worst
from .scope import checked_words, missing_stress_rows, not_checked
from .section import first_moment, section_properties
from .spacing import combine_limits, continuous_check, discrete_spacing, shear_flow

__all__ = ["solve_job", "solve_member", "SolveError"]


def solve_job(job: Job) -> JobResult:
    """Solve every member of ``job`` in order."""
    members = tuple(solve_member(m, job.settings) for m in job.members)
    return JobResult(
        job=job, members=members, status=worst(m.status for m in members), assumed=job_assumed(job)
    )


def _design_shear(member: Member, log: StepLog) -> Quantity:
    V: Any = member.shear  # the reader requires shear when no loads are given
    return log.add(
        "V", "Design shear", "V (given)", "{V}", {"V": V}, V.to("lbf"), source="stated in the job file"
    )


def solve_member(member: Member, settings: Settings) -> MemberResult:
    """Section, shear and every joint of one member."""
    log = StepLog(f"member.{member.id}")
    section = section_properties(member, log.child("section"))
    from .composite import cracked_section, has_slab

    if has_slab(member):
        section = cracked_section(member, section, log.child("section"))
    beam = None
    if member.loads or member.self_weight:
        from .member_loads import analyse_member  # loads along the member

        EI = None
        if member.plies:  # plies side by side bend about their own axes: Σ E·I
            from .plies import ply_EI

            EI = ply_EI(member)
        beam = analyse_member(member, section, settings, log.child("beam"), EI=EI)
        V = beam.V_design
    else:
        V = _design_shear(member, log.child("shear"))
    if member.plies:
        from .plies_solve import ply_joints

        joints = ply_joints(member, beam, settings, log)
    else:
        joints = tuple(solve_joint(member, section, j, V, settings, log, beam) for j in member.joints)
    checks = _keyed(beam.checks, f"member[{member.id}]") if beam is not None else ()
    if settings.method != "EC5":  # τ against Fv (allowable); EN 1995-1-1 §6.1.7 is listed instead
        checks = checks + _shear_only_checks(member, section, V, beam, log.child("checks"))
    from .member_kinds import member_checks

    more, unchecked = member_checks(member, section, beam, V, settings, log.child("member"), joints)
    checks = tuple(checks) + _keyed(more, f"member[{member.id}]")
    # slip of mechanical connectors, γ-method beside the rigid results (solve/slip.py)
    from .slip import slip_analysis, slip_assumed

    slip, slip_checks, slip_unchecked = slip_analysis(
        member, section, beam, settings, joints, checks, log.steps, log.child("slip")
    )
    checks, unchecked = checks + slip_checks, tuple(unchecked) + slip_unchecked
    if settings.method != "EC5":  # Fb / Fy rows name NDS / AISC inputs
        checks = checks + tuple(missing_stress_rows(member, beam is not None))
    status = worst([j.status for j in joints] + [c.status for c in checks])
    words, connectors_only = checked_words(member.id, checks, joints)
    return MemberResult(
        id=member.id,
        member=member,
        section=section,
        shear=V,
        joints=joints,
        checks=checks,
        steps=tuple(log.steps),
        status=status,
        beam=beam,
        not_checked=not_checked(member, checks, beam is not None, extra=unchecked),
        checked=words,
        connectors_only=connectors_only,
        assumed=_assumed(member, settings, joints, beam) + slip_assumed(member, settings, slip),
        slip=slip,
    )


def _assumed(member: Member, settings: Settings, joints: tuple, beam) -> tuple:
    if member.plies:
        from .plies_solve import ply_assumed

        return ply_assumed(member, settings, joints, beam)
    return member_assumed(member, settings, joints, beam)


def _shear_only_checks(member: Member, section: SectionResult, V: Quantity, beam, log: StepLog) -> tuple:
    """With a design shear alone (no loads), the horizontal shear stress at the neutral axis can
    still be found (τ = V·Q/(I·b), mechanics of materials) for members with wood or plywood parts;
    with loads, :mod:`.along` does it with the member checks."""
    if beam is not None or not any(p.material.family in ("wood", "plywood") for p in member.parts):
        return ()
    from .member_loads import _neutral_axis_shear

    c = _neutral_axis_shear(member, section, V, log)
    return () if c is None else _keyed((c,), f"member[{member.id}]")


def _no_minimum_spacing(joint: Joint) -> Check:
    """INFO row: no minimum spacing applies, so none was checked (never silence)."""
    return Check(
        "connector.spacing_min",
        "Minimum spacing of the connectors",
        None,
        None,
        None,
        "INFO",
        "stated in the job file",
        note=f"not checked: the {joint.connector.kind} connector gives no minimum spacing and the job "
        "sets none (spacing_min on the joint or in [settings])",
    )


def _keyed(checks, prefix: str) -> tuple:
    """Checks with keys that name their member (and joint), so keys are unique in a job."""
    from dataclasses import replace

    return tuple(c if c.key.startswith("member[") else replace(c, key=f"{prefix}.{c.key}") for c in checks)


def _plane_shear(
    joint: Joint, held, other, V: Quantity, Q: Quantity, section: SectionResult, b: Quantity, log: StepLog
) -> tuple:
    """Horizontal shear stress at the level of a horizontal joint plane, τ = V·Q/(I·b), against the
    smallest Fv of the parts that meet there (mechanics of materials, shear formula). This is the
    stress in the material just beside the plane (a web under a nailed flange). Skipped for glue
    lines (their capacity is that check), for vertical planes (a web nailed to the side of a flange:
    the stress that matters there is the web's panel shear at the neutral axis) and where no part
    at the plane states Fv."""
    segments = contact_segments(list(held), list(other))
    if joint.connector.kind == "glue" or not segments or any(abs(a[1] - b_[1]) > 1e-6 for a, b_ in segments):
        return ()
    fvs = [p.material.Fv for p in (*held, *other) if p.material.Fv is not None]
    if not fvs:
        if not any(p.material.family in ("wood", "plywood") for p in (*held, *other)):
            return ()  # steel and concrete planes: their shear is a connector or member check
        return (
            Check(
                f"shear.joint.{joint.id}",
                f"Horizontal shear stress at the level of joint {joint.id}",
                None,
                None,
                None,
                "INFO",
                "mechanics of materials (τ = V·Q/(I·b))",
                note="not checked: no Fv given for the parts that meet at the plane",
            ),
        )
    from .member_checks import shear_stress_check

    Fv = min(fvs, key=lambda q: float(q.to("psi").magnitude))
    return (
        shear_stress_check(
            f"joint.{joint.id}",
            V,
            Q,
            section.inertia,
            b,
            Fv,
            log,
            label=f"Horizontal shear stress at the level of joint {joint.id}",
        ),
    )


#: A joint on a vertical plane whose held parts reach over at least this share of the section's
#: depth joins plies side by side (common practice, no source: the threshold only tells such a
#: layout from a flange nailed to the side of a web, which covers a small share of the depth).
PLY_DEPTH_SHARE = 0.75


def _refuse_plies_side_by_side(member: Member, joint: Joint, held, segments) -> None:
    """Refuse V·Q/I for connectors between plies set side by side.

    When every shear plane of the joint is vertical and the held parts run over (nearly) the whole
    depth, Q about the neutral axis is zero (equal plies) or an artefact of unequal depths (a
    flitch plate a little shallower than its timbers): those connectors carry the load that enters
    one ply across to the others, which shear flow does not give (mechanics of materials: q = V·Q/I
    holds for a cut parallel to the neutral axis). A confident OK from it would be meaningless.
    """
    if not segments or any(abs(a[0] - b[0]) > 1e-6 for a, b in segments):
        return  # some plane is not vertical: shear flow applies
    ys = [(p.shape.bbox[1], p.shape.bbox[3]) for p in member.parts]
    depth = max(y1 for _, y1 in ys) - min(y0 for y0, _ in ys)
    reach = max(p.shape.bbox[3] for p in held) - min(p.shape.bbox[1] for p in held)
    if depth > 0 and reach >= PLY_DEPTH_SHARE * depth:
        raise SolveError(
            f"member[{member.id}].joint[{joint.id}]",
            f"joins parts set side by side over {reach / depth:.0%} of the section's depth (a vertical "
            "shear plane): V·Q/I gives these connectors no meaningful demand — they carry the load "
            "that enters one ply across to the others. Describe the member by [[member.ply]] tables "
            'with [member.ply_fastening] and say where each load enters (enters = "top", '
            '"left_face", "right_face" or "ply"); see docs/job-format.md, Plies side by side',
        )


def solve_joint(
    member: Member,
    section: SectionResult,
    joint: Joint,
    V: Quantity,
    settings: Settings,
    mlog: StepLog,
    beam=None,
) -> JointResult:
    """Q, shear flow, connector capacity and spacing at one joint."""
    log = mlog.child(f"joint.{joint.id}")
    held = [p for p in member.parts if p.id in joint.holds]
    rest = [p for p in member.parts if p.id not in joint.holds]
    segments = contact_segments(held, rest)
    touching = {p.id for p in rest if contact_segments(held, [p])}
    other = [p for p in rest if p.id in touching]
    contact = sum(((a[0] - b[0]) ** 2 + (a[1] - b[1]) ** 2) ** 0.5 for a, b in segments)
    _refuse_plies_side_by_side(member, joint, held, segments)
    if joint.width is not None:
        b = log.add(
            "b",
            "Width of the shear plane",
            "b (given)",
            "{b}",
            {"b": joint.width},
            joint.width.to("inch"),
            source="stated in the job file",
        )
    else:
        b = log.add(
            "b",
            "Width of the shear plane",
            "b = Σ contact lengths",
            "{b}",
            {"b": Q_(contact, "inch")},
            Q_(contact, "inch"),
            source="geometry of the placed parts",
        )
    Q = first_moment(section, joint.holds, log)
    if settings.method == "EC5" and beam is not None:  # k_mod of the shortest-duration load (ec5)
        from .ec5_loads import shortest_duration

        settings = replace(settings, duration=shortest_duration(beam.combinations, settings))
    ctx = connectors.JointContext(
        settings.method,
        tuple(held),
        tuple(other),
        b,
        settings,
        f"member[{member.id}].joint[{joint.id}]",
        tuple(member.parts),
        joint.per_row,
    )
    cap = connectors.design(joint.connector, ctx, log.child("connector"))
    demand = None
    if beam is not None and cap.duration_factor is not None:
        from .member_loads import duration_demand

        demand = duration_demand(beam, cap.duration_factor, settings.method, log.child("duration"), settings)
        if demand is not None:
            V = demand[2]
    q = shear_flow(V, Q, section.inertia, log)
    if cap.continuous:
        if joint.connector.kind == "glue":
            log.add(
                "tau",
                "Shear stress on the glue line",
                "τ = V·Q / (I·b)",
                "{V} × {Q} / ({I} × {b})",
                {"V": V, "Q": Q, "I": section.inertia, "b": b},
                (V * Q / (section.inertia * b)).to("psi"),
                source="mechanics of materials: shear formula τ = V·Q/(I·b)",
            )
        res = continuous_check(q, cap.value, log)
        cap_row = cap.value
    else:
        s_min = combine_limits(settings.spacing_min, joint.spacing_min, cap.spacing_min, pick=max)
        s_max = combine_limits(settings.spacing_max, joint.spacing_max, cap.spacing_max, pick=min)
        own = cap.spacing_max is not None and s_max is not None and s_max == cap.spacing_max.to("inch")
        src = (
            (cap.limits_source or "detailing limit of the connector model")
            if own
            else "stated in the job file"
        )
        res = discrete_spacing(q, joint.per_row, cap.value, settings.spacing_step, s_min, s_max, log, src)
        cap_row = (joint.per_row * cap.value).to("lbf")
        if s_min is None:
            cap = replace(cap, checks=tuple(cap.checks) + (_no_minimum_spacing(joint),))
    schedule = None
    if beam is not None and not cap.continuous:
        from .member_loads import joint_schedule

        schedule = joint_schedule(
            beam, Q, section, joint, cap.value, res, settings, log.child("schedule"), demand=demand
        )
    checks = _keyed(
        tuple(cap.checks) + _plane_shear(joint, held, other, V, Q, section, b, log),
        f"member[{member.id}].joint[{joint.id}]",
    )
    status = worst([res.status] + [c.status for c in checks] + ([schedule.status] if schedule else []))
    return JointResult(
        id=joint.id,
        label=joint.label,
        holds=joint.holds,
        Q=Q,
        shear=V,
        shear_flow=q,
        connector=cap.description,
        connector_source=cap.source,
        per_row=joint.per_row,
        capacity=cap.value,
        capacity_row=cap_row,
        continuous=cap.continuous,
        spacing_required=res.required,
        spacing_provided=res.provided,
        spacing_min=res.s_min,
        spacing_max=res.s_max,
        utilisation=res.utilisation,
        status=status,
        reasons=res.reasons,
        checks=checks,
        plane=tuple(segments),
        plane_width=b,
        steps=tuple(s for s in log.steps if s.key.startswith(log.prefix + ".")),
        schedule=schedule,
        callout=joint_callout(
            joint,
            member.parts,
            segments,
            cap.description,
            cap.continuous,
            res.provided,
            schedule,
            b,
            member.span,
            staggered=bool(joint.connector.params.get("staggered")),
        ),
    )
