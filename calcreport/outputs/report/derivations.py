"""Derivations: every step of a member with its formula, numbers, result and source.

Steps are grouped by their key into headings (section, design shear, loads along the member, each
joint, its schedule, member checks), and each heading belongs to one stage of the work
(:data:`STAGES`) so that the report can print them in the order the work is done.

Inside a heading, steps the solver placed in a table (``Step.group``/``row``/``column``) are set
as one table: one worked row written out step by step, the table of every row with the symbols
once in the header and the column totals, and the steps of the group without a column (ȳ) below.
Every number in such a table is one step's result, printed through ``Display`` — nothing is
computed here. A joint whose steps equal an earlier joint's, step for step (see :mod:`.folding`),
shows only the steps that differ and names the joint it follows.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from reportlab.platypus import Paragraph

from ...solve.results import MemberResult
from ...steps import Step
from .common import Ctx, heading
from .folding import Fold, fold_groups
from .group_tables import group_table
from .step_list import step_rows, steps_table
from .styles import esc

__all__ = [
    "STAGES",
    "Group",
    "derivation_story",
    "group_steps",
    "member_groups",
    "stage_story",
    "step_rows",
    "table_blocks",
]

#: the stages of the work, in report order: (id, heading)
STAGES = (
    ("loads", "Loads and load combinations"),
    ("section", "Section properties"),
    ("analysis", "Analysis"),
    ("connectors", "Connector design"),
    ("schedule", "Spacing and schedule"),
    ("checks", "Member checks"),
)

_TITLES = {
    "section": "Section properties (transformed section)",
    "shear": "Design shear",
    "beam": "Beam analysis",
    "loads": "Loads and combinations",
    "checks": "Member checks",
    "member": "Member checks",
    "beam_checks": "Deflection",
}
_LOAD_STEPS = ("self_weight", "combinations")


@dataclass
class Group:
    """The steps under one heading of the derivation, in solver order."""

    gid: str
    title: str
    stage: str
    steps: list[Step] = field(default_factory=list)
    number: str = ""  # "1.4", set when the member's story is laid out


def _joint_id(rest: str, joints: dict) -> str:
    body = rest[len("joint.") :]
    for jid in sorted(joints, key=len, reverse=True):  # ids may contain dots
        if body == jid or body.startswith(jid + "."):
            return jid
    return body.split(".", 1)[0]


def _classify(rest: str, joints: dict) -> tuple[str, str, str]:
    """(group id, heading, stage) of a step from its key below ``member.ID.``."""
    head, _, tail = rest.partition(".")
    if head == "joint":
        jid = _joint_id(rest, joints)
        label = joints[jid].label if jid in joints else ""
        sub = rest[len("joint.") + len(jid) + 1 :]
        title = f"Joint {jid}" + (f" — {label}" if label else "")
        if sub.startswith("schedule"):
            return f"schedule.{jid}", f"{title}: zoned schedule", "schedule"
        return f"joint.{jid}", title, "connectors"
    if head == "section":
        return "section", _TITLES["section"], "section"
    if head == "shear":
        return "shear", _TITLES["shear"], "analysis"
    if head == "beam":
        first = tail.split(".", 1)[0]
        if first in _LOAD_STEPS:
            return "loads", _TITLES["loads"], "loads"
        if first == "checks":
            return "beam_checks", _TITLES["beam_checks"], "checks"
        return "beam", _TITLES["beam"], "analysis"
    if head in ("checks", "member"):
        return "checks", _TITLES["checks"], "checks"
    return head, head.replace("_", " ").capitalize(), "checks"


def member_groups(m: MemberResult) -> list[Group]:
    """The member's steps under their headings, each heading once, in solver order within a stage."""
    prefix = f"member.{m.id}."
    joints = {j.id: j for j in m.joints}
    groups: dict[str, Group] = {}
    for s in m.steps:
        rest = s.key[len(prefix) :] if s.key.startswith(prefix) else s.key
        gid, title, stage = _classify(rest, joints)
        if gid not in groups:
            groups[gid] = Group(gid, title, stage)
        groups[gid].steps.append(s)
    order = [sid for sid, _ in STAGES]
    return sorted(groups.values(), key=lambda g: order.index(g.stage))  # stable within a stage


def group_steps(m: MemberResult) -> list[tuple[str, str, list[Step]]]:
    """(group id, heading, steps) of the member, in report order."""
    return [(g.gid, g.title, g.steps) for g in member_groups(m)]


def table_blocks(steps: list[Step]) -> list[tuple[str, list[Step]]]:
    """The steps of one heading as blocks in order: ("steps", run) or ("table:<group>", steps).

    A table stands where its first step stands; steps without a group keep their order around it.
    """
    blocks: list[tuple[str, list[Step]]] = []
    where: dict[str, int] = {}
    for s in steps:
        if s.group:
            if s.group not in where:
                where[s.group] = len(blocks)
                blocks.append((f"table:{s.group}", []))
            blocks[where[s.group]][1].append(s)
        elif blocks and blocks[-1][0] == "steps":
            blocks[-1][1].append(s)
        else:
            blocks.append(("steps", [s]))
    return blocks


def _group_body(g: Group, ctx: Ctx, fold: Fold | None) -> list:
    prefix = f"{g.number}."
    index = {s.key: i for i, s in enumerate(g.steps, 1)}
    st = ctx.styles
    if fold is not None:
        subs = "".join(f", with {new} in place of {old}" for old, new in fold.substitutions)
        shown = [s for s in g.steps if s.key in fold.differ]
        hidden = [s for s in g.steps if s.key not in fold.differ]
        marks = [m for s in hidden for m in ctx.mark(s.key)][:1]
        text = (
            f"Same connector and derivation as {esc(fold.base_title)} ({fold.base_number}), step for step"
            f"{esc(subs)}: its {len(hidden)} other steps are those of {fold.base_number} with the same last "
            "number (formulas, numbers and results)."
        )
        text += " The steps that differ:" if shown else " No step differs."
        out: list = [*marks, Paragraph(text, st.small)]
        return out + steps_table(shown, ctx, prefix, [index[s.key] for s in shown])
    out = []
    headed = False  # the column heads of the step rows are printed once per heading
    for kind, steps in table_blocks(g.steps):
        if kind == "steps":
            out += steps_table(steps, ctx, prefix, [index[s.key] for s in steps], header=not headed)
        else:
            out += group_table(steps, ctx, prefix, index, headed)
        headed = True
    return out


def stage_story(
    groups: list[Group], ctx: Ctx, folds: dict[str, Fold] | None = None, heading_style=None
) -> list:
    """The headings and step tables of some groups (already numbered); ``heading_style`` sets
    their headings in another style (a stage of one group named as the stage: the group's
    numbered heading stands for both)."""
    st = ctx.styles
    out: list = []
    for g in groups:
        out += heading(f"{g.number}  {g.title}", heading_style or st.h3)
        out += _group_body(g, ctx, (folds or {}).get(g.gid))
    return out


def derivation_story(m: MemberResult, ctx: Ctx, section_no: str) -> list:
    """Every heading of the member's derivation in report order (one block; the report itself
    interleaves the stages with their figures, see :mod:`.member_story`)."""
    groups = member_groups(m)
    for g, grp in enumerate(groups, 1):
        grp.number = f"{section_no}.{g}"
    return stage_story(groups, ctx, fold_groups(groups, ctx.display, {p.id for p in m.member.parts}))
