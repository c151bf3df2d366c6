"""Results of a member: per joint demand, capacity, spacing, utilisation and status; every Check.

Joints whose rows print alike (the folded top and bottom joints of a symmetric section) share one
row naming them all; nothing is compared but the printed text. A check that names the step
stating its limit or working (``Check.step``) refers to that step's number instead of repeating
its numbers, so each number is printed once, in the job's units, by :class:`..fmt.Display`.
"""

from __future__ import annotations

import re

from reportlab.lib import colors
from reportlab.lib.styles import ParagraphStyle
from reportlab.platypus import CondPageBreak, Paragraph, Table

from ...solve.results import Check, JointResult, MemberResult
from ..phrases import check_label, check_note
from ..scope_text import checked_line, status_words
from .columns import Columns
from .common import Ctx, cited, grid, para
from .dense import TIGHT, dense
from .derivations import member_groups
from .fastcell import cell
from .flow import KeepTail
from .styles import esc

__all__ = ["results_story", "checks_rows", "scope_story", "step_numbers", "folded_checks"]

_JOINT_KEY = re.compile(r"\.joint\[([^\]]+)\]")


def _heading(text: str, style, need: float = 60.0) -> list:
    """A heading as a real ``Paragraph`` (so page discipline keeps it with the table after it),
    on a new sheet when less than ``need`` points remain."""
    return [CondPageBreak(need), Paragraph(esc(text), style)]


def step_numbers(m: MemberResult, ctx: Ctx) -> dict[str, str]:
    """Step key → the number the derivation prints for it ("1.3.42"), numbered as the member's
    story numbers its headings (member n, heading k, step i within the heading; the steps a folded
    joint does not show keep their numbers, see :mod:`.folding`)."""
    ids = [x.id for x in ctx.result.members]
    number = ids.index(m.id) + 1 if m.id in ids else 1
    out: dict[str, str] = {}
    for k, g in enumerate(member_groups(m), 1):
        for i, s in enumerate(g.steps, 1):
            out[s.key] = f"{number}.{k}.{i}"
    return out


def scope_story(m: MemberResult, ctx: Ctx) -> list:
    """What was not checked for this member, with clause and reason (never silent)."""
    st = ctx.styles
    title = f"Not checked ({len(m.not_checked)})"
    if not m.not_checked:
        return [
            *_heading(title, st.h3),
            Paragraph("Every check listed for this kind of member ran.", st.body),
        ]
    # two columns of entries read down the left, then the right, the title kept with the first
    head = st.h3
    entry = ParagraphStyle(
        "not_checked_entry", parent=st.cell, leftIndent=9, firstLineIndent=-9, spaceAfter=2.2
    )
    units: list[list] = []
    for u in m.not_checked:
        label = esc(u.label[0].upper() + u.label[1:])
        clause = f' <font size="{st.caption.fontSize:g}" color="#333333">({esc(cited(u.clause))})</font>'
        units.append([Paragraph(f"<b>{label}</b>{clause} — {esc(cited(u.reason))}", entry)])
    note = Paragraph(
        "These are not part of the status above; check them by hand or give the job what they need.",
        st.small,
    )
    cont = Paragraph(esc(f"Not checked ({len(m.not_checked)}, continued)"), head)
    return [Columns(units, head=Paragraph(esc(title), head), cont=cont), note]


def _joint_cells(j: JointResult, ctx: Ctx) -> list[str]:
    if j.continuous:
        cap = f"{ctx.q(j.capacity_row)} (continuous)"
        req = prov = "continuous"
    else:
        cap = f"n·F = {j.per_row} × {ctx.q(j.capacity)} = {ctx.q(j.capacity_row)}"
        req, prov = ctx.q(j.spacing_required), ctx.q(j.spacing_provided, 3)
    limits = f"{ctx.q(j.spacing_min)} / {ctx.q(j.spacing_max)}"
    return [ctx.q(j.shear_flow), cap, req, prov, limits, ctx.q(j.utilisation, 3), j.status]


def _fold(items: list[tuple[str, tuple]]) -> list[tuple[list[str], tuple]]:
    """Items (name, printed signature) gathered by equal signature, in order of first appearance."""
    out: list[tuple[list[str], tuple]] = []
    for name, sig in items:
        for names, seen in out:
            if seen == sig:
                names.append(name)
                break
        else:
            out.append(([name], sig))
    return out


def _joint_rows(m: MemberResult, ctx: Ctx) -> list[list]:
    rows: list[list] = [
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
    for names, cells in _fold([(j.id, tuple(_joint_cells(j, ctx))) for j in m.joints]):
        rows.append([", ".join(names), *cells])
    return rows


def _check_sig(jid: str, c: Check, ctx: Ctx) -> tuple:
    """What a check row prints, with its joint written generically (so equal joints compare equal)."""

    def generic(text: str) -> str:
        return _JOINT_KEY.sub(".joint[*]", text).replace(f".joint.{jid}.", ".joint.*.")

    return (
        generic(c.key),
        check_label(c, ctx.display),
        ctx.q(c.demand),
        ctx.q(c.capacity),
        ctx.q(c.ratio, 3),
        c.status,
        cited(c.source),
        cited(check_note(c, ctx.display)),
        generic(c.step),
    )


def folded_checks(m: MemberResult, ctx: Ctx) -> list[tuple[str, list[tuple[Check, list[str]]]]]:
    """(where, [(check, the step keys it refers to in each joint named)]) — joints whose check
    rows print alike are one entry naming them all; the member's own checks come last."""
    joints = {j.id: j for j in m.joints}
    items = [(j.id, tuple(_check_sig(j.id, c, ctx) for c in j.checks)) for j in m.joints if j.checks]
    out: list[tuple[str, list[tuple[Check, list[str]]]]] = []
    for names, _sig in _fold(items):
        first = joints[names[0]]
        rows = []
        for k, c in enumerate(first.checks):
            steps = [joints[n].checks[k].step for n in names if joints[n].checks[k].step]
            rows.append((c, steps))
        where = f"Joint {names[0]}" if len(names) == 1 else f"Joints {', '.join(names)}"
        if len(names) > 1:
            where += " — the same checks, values and status at each"
        out.append((where, rows))
    if m.checks:
        out.append(("Member", [(c, [c.step] if c.step else []) for c in m.checks]))
    return out


def checks_rows(
    groups: list[tuple[str, list[tuple[Check, list[str]]]]], ctx: Ctx, numbers: dict[str, str]
) -> tuple[list[list], list[tuple]]:
    """Rows of the checks table (a spanning row per joint group) and the style commands they need."""
    st = ctx.styles
    rows: list[list] = [["Check (note; source)", "Demand", "Capacity", "Ratio", "Status", "Step"]]
    extra: list[tuple] = []
    for where, checks in groups:
        r = len(rows)
        rows.append([para(where, st.cell_bold), "", "", "", "", ""])
        extra += [("SPAN", (0, r), (-1, r)), ("BACKGROUND", (0, r), (-1, r), st.tint)]
        if checks:  # the group's heading row stays with its first check
            extra.append(("NOSPLIT", (0, r), (-1, r + 2)))
        for c, steps in checks:
            words = check_note(c, ctx.display)
            note = esc(cited(words)) + "; " if words else ""
            source = f"<i>{esc(cited(c.source) or '—')}</i>"
            refs = [numbers[s] for s in steps if s in numbers]
            r = len(rows)
            rows.append(
                [
                    para(check_label(c, ctx.display), st.cell),
                    ctx.q(c.demand),
                    ctx.q(c.capacity),
                    ctx.q(c.ratio, 3),
                    c.status,
                    ", ".join(refs) or "—",
                ]
            )
            # the note and source under the check, across the table; the two rows stay together
            rows.append([cell(note + source, dense(st).note), "", "", "", "", ""])
            extra += [
                ("SPAN", (0, r + 1), (-1, r + 1)),
                ("NOSPLIT", (0, r), (-1, r + 1)),
                ("LINEBELOW", (0, r), (-1, r), 0.45, colors.white),
                ("TOPPADDING", (0, r + 1), (-1, r + 1), 0),
                ("BOTTOMPADDING", (0, r), (-1, r), 0.5),
                ("LEFTPADDING", (0, r + 1), (0, r + 1), 9),
            ]
    return rows, extra


def results_story(m: MemberResult, ctx: Ctx) -> list:
    st, w = ctx.styles, ctx.width
    out: list = [*_heading("Results", st.h2)]
    if m.joints:
        out.append(
            grid(
                _joint_rows(m, ctx),
                [0.16 * w, 0.11 * w, 0.22 * w, 0.10 * w, 0.10 * w, 0.12 * w, 0.11 * w, 0.08 * w],
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
    groups = folded_checks(m, ctx)
    if groups:
        rows, extra = checks_rows(groups, ctx, step_numbers(m, ctx))
        out += _heading("Checks", st.h3)
        out.append(  # a lead line: kept with the table by the page discipline
            Paragraph(
                "Under each check: its note; its source in italics. Step: the derivation step stating the "
                "limit or working, one per joint named.",
                st.caption,
            )
        )
        out.append(
            grid(
                rows,
                [0.52 * w, 0.10 * w, 0.10 * w, 0.07 * w, 0.07 * w, 0.14 * w],
                st,
                extra=[*TIGHT, *extra],
                zebra=False,
                frame_height=ctx.frame_height,
            )
        )
    line = ParagraphStyle("status_line", parent=st.body, spaceBefore=3)  # clear of the rule above
    status = (
        Paragraph(f"Member {esc(m.id)}: <b>{esc(status_words(m))}</b> ({esc(checked_line(m))})", line)
        if m.status == "OK"
        else Paragraph(
            f'<font color="#b3261e"><b>Member {esc(m.id)}: NG — the member or its connection does not '
            "satisfy the checks above as detailed.</b></font>",
            line,
        )
    )
    # the status line closes the checks (kept with their last rows); what was not checked follows it
    last = max((k for k, f in enumerate(out) if isinstance(f, Table)), default=None)
    if last is not None and last == len(out) - 1:
        out[last] = KeepTail(out[last], [status])
    else:
        out.append(status)
    out.extend(scope_story(m, ctx))
    return out
