"""Derivations: every step of a member, in order, with its formula, numbers, result and source.

Steps are grouped by their key (section, design shear, each joint, loads along the member). A step
that governs is tinted and tagged. The substituted formula is exactly ``Display.substituted(step)``.
"""

from __future__ import annotations

from reportlab.platypus import Paragraph

from ...solve.results import MemberResult
from ...steps import Step
from .common import GOVERNS_TINT, Ctx, cited, grid, heading, para
from .fastcell import cell
from .styles import esc

__all__ = ["derivation_story", "group_steps", "step_rows"]

_GROUPS = {
    "section": "Section properties (transformed section)",
    "shear": "Design shear",
    "beam": "Loads and shear along the member",
}


def group_steps(m: MemberResult) -> list[tuple[str, str, list[Step]]]:
    """Consecutive steps with the same group key, as (group key, heading, steps), in solver order."""
    prefix = f"member.{m.id}."
    joints = {j.id: j for j in m.joints}
    groups: list[tuple[str, str, list[Step]]] = []
    for s in m.steps:
        rest = s.key[len(prefix) :] if s.key.startswith(prefix) else s.key
        head = rest.split(".", 1)[0]
        gid, title = head, _GROUPS.get(head, head.replace("_", " ").capitalize())
        if head == "joint":
            jid = _joint_id(rest, joints)
            gid = f"joint.{jid}"
            label = joints[jid].label if jid in joints else ""
            title = f"Joint {jid}" + (f" — {label}" if label else "")
        if groups and groups[-1][0] == gid:
            groups[-1][2].append(s)
        else:
            groups.append((gid, title, [s]))
    return groups


def _joint_id(rest: str, joints: dict) -> str:
    body = rest[len("joint.") :]
    for jid in sorted(joints, key=len, reverse=True):  # ids may contain dots
        if body == jid or body.startswith(jid + "."):
            return jid
    return body.split(".", 1)[0]


def step_rows(steps: list[Step], ctx: Ctx, number_prefix: str) -> tuple[list[list], list[tuple]]:
    """Table rows for the steps and style commands that tint the governing ones."""
    st, d = ctx.styles, ctx.display
    rows: list[list] = [["No.", "Step", "Source"]]
    extra: list[tuple] = []
    for i, s in enumerate(steps, 1):
        r = len(rows)
        tag = '  <font color="#7a5a00"><b>[governs]</b></font>' if s.governs else ""
        sub, res = d.substituted(s), d.result(s)
        line = f"= <b>{esc(res)}</b>" if sub.strip() == res else f"= {esc(sub)}   = <b>{esc(res)}</b>"
        body = [
            cell(f"<b>{esc(s.label)}</b>{tag}", st.cell),
            para(s.symbol, st.formula),
            cell(line, st.formula),
        ]
        if s.note:
            body.append(para(cited(s.note), st.caption))
        num = ctx.mark(s.key) + [para(f"{number_prefix}{i}", st.cell)]
        rows.append([num, body, para(cited(s.source) or "—", st.caption)])
        if s.governs:
            extra.append(("BACKGROUND", (0, r), (-1, r), GOVERNS_TINT))
            extra.append(("LINEBEFORE", (0, r), (0, r), 2.0, ctx.styles.accent))
    return rows, extra


def derivation_story(m: MemberResult, ctx: Ctx, section_no: str) -> list:
    """Headings and one table per group of steps; rows split across pages with repeated headers."""
    st = ctx.styles
    out: list = [
        *heading("Derivation", st.h2),
        Paragraph(
            "Each step gives the formula, the formula with the numbers substituted, the result "
            "and its source. Steps that govern are tinted.",
            st.small,
        ),
    ]
    w = ctx.width
    for g, (_, title, steps) in enumerate(group_steps(m), 1):
        out += heading(f"{section_no}.{g}  {title}", st.h3)
        rows, extra = step_rows(steps, ctx, f"{section_no}.{g}.")
        out.append(
            grid(
                rows,
                [0.09 * w, 0.63 * w, 0.28 * w],
                st,
                extra=extra,
                zebra=False,
                frame_height=ctx.frame_height,
            )
        )
    return out
