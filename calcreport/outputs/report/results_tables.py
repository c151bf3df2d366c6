"""Results of a member: per joint demand, capacity, spacing, utilisation and status; every Check."""

from __future__ import annotations

from reportlab.platypus import Paragraph

from ...solve.results import Check, MemberResult
from ..scope_text import checked_line, status_words
from .common import Ctx, cited, grid, heading, para
from .styles import esc

__all__ = ["results_story", "checks_rows", "scope_story"]


def scope_story(m: MemberResult, ctx: Ctx) -> list:
    """What was not checked for this member, with clause and reason (never silent)."""
    st, w = ctx.styles, ctx.width
    out: list = [*heading(f"Not checked ({len(m.not_checked)})", st.h3)]
    if not m.not_checked:
        out.append(para("Every check listed for this kind of member ran.", st.body))
        return out
    rows = [["Not checked", "Governing clause", "Why"]]
    for u in m.not_checked:
        rows.append([u.label[0].upper() + u.label[1:], cited(u.clause), cited(u.reason)])
    out.append(grid(rows, [0.36 * w, 0.26 * w, 0.38 * w], st))
    out.append(
        para(
            "These are not part of the status above; check them by hand or give the job what they need.",
            st.small,
        )
    )
    return out


def _joint_rows(m: MemberResult, ctx: Ctx) -> list[list]:
    rows = [
        [
            "Joint",
            "Demand q",
            "Capacity",
            "Spacing required",
            "Spacing provided",
            "Limits (min / max)",
            "Utilisation",
            "Status",
        ]
    ]
    for j in m.joints:
        if j.continuous:
            cap = f"{ctx.q(j.capacity_row)} (continuous)"
            req = prov = "continuous"
        else:
            cap = f"n·F = {j.per_row} × {ctx.q(j.capacity)} = {ctx.q(j.capacity_row)}"
            req, prov = ctx.q(j.spacing_required), ctx.q(j.spacing_provided, 3)
        limits = f"{ctx.q(j.spacing_min)} / {ctx.q(j.spacing_max)}"
        rows.append([j.id, ctx.q(j.shear_flow), cap, req, prov, limits, ctx.q(j.utilisation, 3), j.status])
    return rows


def checks_rows(checks: list[tuple[str, Check]], ctx: Ctx) -> list[list]:
    rows = [["Where", "Check", "Demand", "Capacity", "Ratio", "Status", "Source"]]
    for where, c in checks:
        label = c.label + (f" ({cited(c.note)})" if c.note else "")
        rows.append(
            [
                where,
                label,
                ctx.q(c.demand),
                ctx.q(c.capacity),
                ctx.q(c.ratio, 3),
                c.status,
                cited(c.source) or "—",
            ]
        )
    return rows


def results_story(m: MemberResult, ctx: Ctx) -> list:
    st, w = ctx.styles, ctx.width
    out: list = [*heading("Results", st.h2)]
    if m.joints:
        out.append(
            grid(
                _joint_rows(m, ctx),
                [0.11 * w, 0.12 * w, 0.20 * w, 0.11 * w, 0.11 * w, 0.14 * w, 0.12 * w, 0.09 * w],
                st,
            )
        )
        if any(j.schedule is not None for j in m.joints):
            out.append(
                para(
                    "With loads along the member, the spacings in this table are those for the largest "
                    "shear; the zoned schedules under 'Spacing and schedule' vary the spacing with the shear.",
                    st.small,
                )
            )
        for j in m.joints:
            for reason in j.reasons:
                out.append(para(f"Joint {j.id}: {reason}", st.small))
    else:
        out.append(Paragraph("This member has no fastened joints.", st.body))
    checks = [(f"joint {j.id}", c) for j in m.joints for c in j.checks] + [("member", c) for c in m.checks]
    if checks:
        out.extend(heading("Checks", st.h3))
        out.append(
            grid(
                checks_rows(checks, ctx),
                [0.11 * w, 0.27 * w, 0.12 * w, 0.12 * w, 0.08 * w, 0.08 * w, 0.22 * w],
                st,
            )
        )
    out.extend(scope_story(m, ctx))
    out.append(
        Paragraph(f"Member {esc(m.id)}: <b>{esc(status_words(m))}</b> ({esc(checked_line(m))})", st.body)
        if m.status == "OK"
        else Paragraph(
            f'<font color="#b3261e"><b>Member {esc(m.id)}: NG — the member or its connection does not '
            "satisfy the checks above as detailed.</b></font>",
            st.body,
        )
    )
    return out
