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

from reportlab.lib.styles import ParagraphStyle
from reportlab.platypus import Paragraph, Spacer

from ...solve.results import MemberResult
from ...steps import Step
from .common import GOVERNS_TINT, Ctx, cited, grid, heading, para
from .fastcell import cell
from .flow import KeepTail
from .folding import Fold, fold_groups
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
#: what a row of a table is, by the table's group id (the first dotted segment)
_ROW_WORDS = {"section": "part", "zones": "zone", "combinations": "combination", "cases": "case"}
_LOAD_STEPS = ("self_weight", "combinations")
#: tables whose cells give the result only (their formulas are in the worked row and the header)
_RESULT_ONLY = frozenset({"section"})


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


def step_rows(
    steps: list[Step], ctx: Ctx, number_prefix: str, numbers=None
) -> tuple[list[list], list[tuple]]:
    """Table rows for the steps and style commands that tint the governing ones.

    ``numbers`` (optional) gives each step's number within its heading; else 1, 2, 3…
    """
    st, d = ctx.styles, ctx.display
    rows: list[list] = [["No.", "Step", "Source"]]
    extra: list[tuple] = []
    for i, s in enumerate(steps, 1):
        r = len(rows)
        tag = '  <font color="#7a5a00"><b>[governs]</b></font>' if s.governs else ""
        sub, res = d.substituted(s), d.result(s)
        line = f"= <b>{esc(res)}</b>" if sub.strip() == res else f"= {esc(sub)}   = <b>{esc(res)}</b>"
        body = [cell(f"<b>{esc(s.label)}</b>{tag}&nbsp;&nbsp; {esc(s.symbol)}&nbsp;&nbsp; {line}", st.cell)]
        if s.note:
            body.append(para(cited(s.note), st.caption))
        no = numbers[i - 1] if numbers is not None else i
        num = ctx.mark(s.key) + [para(f"{number_prefix}{no}", st.cell)]
        rows.append([num, body, para(cited(s.source) or "—", st.caption)])
        if s.governs:
            extra.append(("BACKGROUND", (0, r), (-1, r), GOVERNS_TINT))
            extra.append(("LINEBEFORE", (0, r), (0, r), 2.0, ctx.styles.accent))
    return rows, extra


def _steps_table(steps: list[Step], ctx: Ctx, prefix: str, numbers: list[int]) -> list:
    if not steps:
        return []
    w = ctx.width
    rows, extra = step_rows(steps, ctx, prefix, numbers)
    extra = [("TOPPADDING", (0, 1), (-1, -1), 1.5), ("BOTTOMPADDING", (0, 1), (-1, -1), 1.5), *extra]
    widths = [0.08 * w, 0.67 * w, 0.25 * w]
    return [grid(rows, widths, ctx.styles, extra=extra, zebra=False, frame_height=ctx.frame_height)]


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


def _lhs(symbol: str) -> str:
    return symbol.split(" = ", 1)[0].strip() if " = " in symbol else symbol.strip()


def _columns(rows: dict[str, list[Step]]) -> list[str]:
    """Column ids in order: rows with fewer columns first, each new column before the next one
    already placed (so a row's extra columns sit where that row computes them)."""
    cols: list[str] = []
    for seq in sorted(rows.values(), key=len):
        names = [s.column for s in seq]
        for k, c in enumerate(names):
            if c in cols:
                continue
            after = next((cols.index(x) for x in names[k + 1 :] if x in cols), len(cols))
            cols.insert(after, c)
    return cols


def _table(steps: list[Step], ctx: Ctx, prefix: str, index: dict[str, int]) -> list:
    """One table of repeated formulas (see module docstring)."""
    st, d, w = ctx.styles, ctx.display, ctx.width
    group = steps[0].group
    word = _ROW_WORDS.get(group.split(".", 1)[0], "item")
    rows: dict[str, list[Step]] = {}
    totals: dict[str, Step] = {}
    stated: list[Step] = []
    for s in steps:
        if s.column and s.row:
            rows.setdefault(s.row, []).append(s)
        elif s.column:
            totals[s.column] = s
        else:
            stated.append(s)
    out: list = []
    if not rows:  # nothing tabulated: every step in full
        return _steps_table(steps, ctx, prefix, [index[s.key] for s in steps])
    cols = _columns(rows)
    worked_id = next(iter(rows))
    worked = rows[worked_id]
    seen = {(s.column, s.symbol, s.note) for s in worked}
    differ = []
    for rid, seq in rows.items():
        for s in seq:
            if rid != worked_id and (s.column, s.symbol, s.note) not in seen:
                differ.append(s)
                seen.add((s.column, s.symbol, s.note))
    out.append(
        para(
            f"Worked in full for {word} {worked_id}; the table below gives every {word}, each value the "
            f"result of the step of that formula for that {word}.",
            st.small,
        )
    )
    out += _steps_table(worked, ctx, prefix, [index[s.key] for s in worked])
    if differ:
        out += [Spacer(1, 4), para(f"Where a {word} uses another formula, that step in full:", st.small)]
        out += _steps_table(differ, ctx, prefix, [index[s.key] for s in differ])
    heads: dict[str, list[str]] = {c: [] for c in cols}
    for seq in rows.values():
        for s in seq:
            if _lhs(s.symbol) not in heads[s.column]:
                heads[s.column].append(_lhs(s.symbol))
    tstyle = ParagraphStyle(
        "tcell", parent=st.cell, fontSize=st.cell.fontSize - 0.5, leading=st.cell.leading - 0.6
    )
    cell_r = ParagraphStyle("tcellr", parent=tstyle, alignment=2)
    head_r = ParagraphStyle("theadr", parent=st.cell_bold, fontSize=tstyle.fontSize, alignment=2)
    head_style = head_r if group in _RESULT_ONLY else st.cell_bold
    data: list[list] = [
        [para(word.capitalize(), st.cell_bold)] + [para(" / ".join(heads[c]), head_style) for c in cols]
    ]
    extra: list[tuple] = []
    for rid, seq in rows.items():
        by = {s.column: s for s in seq}
        marks = [m for s in seq for m in ctx.mark(s.key)][:1]
        line: list = [marks + [para(rid, tstyle)]]
        for k, c in enumerate(cols, 1):
            cs = by.get(c)
            if cs is None:
                line.append(para("—", cell_r))
            else:
                text, sub = esc(d.result(cs)), d.substituted(cs)
                if group not in _RESULT_ONLY and sub.strip() != d.result(cs):  # how it was found
                    text += f'<br/><font size="{tstyle.fontSize - 1}" color="#444444">{esc(sub)}</font>'
                line.append(cell(text, cell_r if group in _RESULT_ONLY else tstyle))
            if cs is not None and cs.governs:
                extra.append(("BACKGROUND", (k, len(data)), (k, len(data)), GOVERNS_TINT))
        data.append(line)
    if totals:
        line = [para("Σ", st.cell_bold)]
        for c in cols:
            ts = totals.get(c)
            line.append(cell(f"<b>{esc(d.result(ts))}</b>", cell_r) if ts is not None else "")
        data.append(line)
        extra.append(("LINEABOVE", (0, len(data) - 1), (-1, len(data) - 1), 0.7, st.accent))
    first = 0.11 * w if group in _RESULT_ONLY else 0.22 * w
    widths = [first] + [(w - first) / len(cols)] * len(cols)
    lo, hi = min(index[s.key] for s in steps), max(index[s.key] for s in steps)
    caption = para(
        f"Steps {prefix}{lo}–{prefix}{hi}: each value is the result of one step, listed one by one in "
        f"the results JSON with its table, {word} and column"
        + ("; Σ: the totals, each its own step." if totals else "."),
        st.caption,
    )
    table = grid(data, widths, st, extra=extra, zebra=True, frame_height=ctx.frame_height)
    out.append(KeepTail(table, [caption]))  # the caption stays with the table's last rows
    out += _steps_table(stated, ctx, prefix, [index[s.key] for s in stated])
    return out


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
            f"{esc(subs)}: the {len(hidden)} steps not shown have the formulas, numbers and results of the "
            f"steps of {fold.base_number} with the same last number."
        )
        text += " The steps that differ:" if shown else " No step differs."
        out: list = [*marks, Paragraph(text, st.body)]
        return out + _steps_table(shown, ctx, prefix, [index[s.key] for s in shown])
    out = []
    for kind, steps in table_blocks(g.steps):
        if kind == "steps":
            out += _steps_table(steps, ctx, prefix, [index[s.key] for s in steps])
        else:
            out += _table(steps, ctx, prefix, index)
    return out


def stage_story(groups: list[Group], ctx: Ctx, folds: dict[str, Fold] | None = None) -> list:
    """The headings and step tables of some groups (already numbered)."""
    st = ctx.styles
    out: list = []
    for g in groups:
        out += heading(f"{g.number}  {g.title}", st.h3)
        out += _group_body(g, ctx, (folds or {}).get(g.gid))
    return out


def derivation_story(m: MemberResult, ctx: Ctx, section_no: str) -> list:
    """Every heading of the member's derivation in report order (one block; the report itself
    interleaves the stages with their figures, see :mod:`.member_story`)."""
    groups = member_groups(m)
    for g, grp in enumerate(groups, 1):
        grp.number = f"{section_no}.{g}"
    return stage_story(groups, ctx, fold_groups(groups, ctx.display, {p.id for p in m.member.parts}))
