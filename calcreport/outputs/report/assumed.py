"""The assumed-values page: every value the tool chose because the job did not state it.

Reads the :class:`calcreport.solve.results.Assumed` records of the job and of each member; rows
that differ only by the joint they belong to are shown once with the joints named. Rows are
grouped by the table they belong to (``member[H1].joint[top, bot].connector``), written once as a
heading row; each row then names its key within that table. "To state it" is printed only where
it says more than the key and its table (``[member.joint.connector] CD or [settings]
load_duration``).
"""

from __future__ import annotations

import re

from reportlab.lib.styles import ParagraphStyle
from reportlab.platypus import Paragraph

from ...solve.results import Assumed
from .columns import Columns
from .common import Ctx, cited, para
from .dense import dense
from .styles import esc

__all__ = ["assumed_story", "assumed_rows", "assumed_groups"]

_JOINT = re.compile(r"\.joint\[([^\]]+)\]")
TOOL_DEFAULT = "tool default"
_WHERE = re.compile(r"^(\[\[?[^\]]+\]\]?)\s+(.+)$")


def _records(ctx: Ctx) -> list[Assumed]:
    records: list[Assumed] = list(ctx.result.assumed)
    for m in ctx.result.members:
        records += list(m.assumed)
    return records


def assumed_rows(ctx: Ctx) -> list[list[str]]:
    """Rows (key, what, value, how to state it, source) over the job and its members; the key
    names every joint the row stands for."""
    groups: dict[tuple, list[str]] = {}
    order: list[tuple] = []
    for a in _records(ctx):
        value = ctx.q(a.value)
        generic = _JOINT.sub(".joint[*]", a.key)
        g = (generic, a.label, value, a.where, a.source)
        found = _JOINT.search(a.key)
        if g not in groups:
            groups[g] = []
            order.append(g)
        if found:
            groups[g].append(found.group(1))
    rows = [["Key", "What", "Value used", "To state it", "Basis"]]
    for g in order:
        generic, label, value, where, source = g
        joints = groups[g]
        key = generic.replace("joint[*]", f"joint[{', '.join(joints)}]") if joints else generic
        rows.append(
            [
                key,
                label[0].upper() + label[1:] if label else "",
                value,
                where,
                cited(source) or TOOL_DEFAULT,
            ]
        )
    return rows


def _split_key(key: str) -> tuple[str, str]:
    """(owner, name): a joint's key splits at its last segment (``member[H1].joint[a, b].connector.CD``
    → ``member[H1].joint[a, b].connector``, ``CD``); any other at its first (``member[F2].load[L].enters``
    → ``member[F2]``, ``load[L].enters``; ``settings.spacing_max`` → ``settings``, ``spacing_max``).
    A key of one segment is its own owner."""
    if ".joint[" in key:
        head, dot, tail = key.rpartition(".")
        if dot and "]" not in tail:
            return head, tail
        return key, ""
    depth = 0
    for i, ch in enumerate(key):
        depth += (ch == "[") - (ch == "]")
        if ch == "." and depth == 0:
            return key[:i], key[i + 1 :]
    return key, ""


def _state(where: str, name: str) -> tuple[str, str]:
    """(table, extra): the job-file table of ``where`` and what it says beyond ``table name``."""
    found = _WHERE.match(where or "")
    if not found:
        return "", where or ""
    table, rest = found.groups()
    return table, "" if rest.strip() == name else where


def assumed_groups(ctx: Ctx) -> list[tuple[str, str, list[list]]]:
    """(owner, the job-file table most of its rows are stated in or "", rows [name, what, value,
    to state it or "", basis]); a row stated elsewhere, or with more to say, keeps its own "to
    state it"."""
    out: dict[str, list[tuple[str, list]]] = {}
    for key, what, value, where, basis in assumed_rows(ctx)[1:]:
        owner, name = _split_key(key)
        table, extra = _state(where, name.rpartition(".")[2] if name else "")
        out.setdefault(owner, []).append((table, [name or key, what, value, extra, basis, where]))
    result: list[tuple[str, str, list[list]]] = []
    for owner, rows in out.items():
        tables = [t for t, _ in rows if t]
        shared = max(sorted(set(tables)), key=tables.count) if tables else ""
        if len(rows) > 1 and tables.count(shared) < 2:  # a table of one row among several: no heading
            shared = ""
        for table, r in rows:
            if table != shared and not r[3]:
                r[3] = r[5]
        result.append((owner, shared, [r[:5] for _, r in rows]))
    return result


def _entry_styles(ctx: Ctx) -> tuple[ParagraphStyle, ParagraphStyle, ParagraphStyle]:
    """(owner heading, entry, note under an entry): an entry hangs its later lines under its key."""
    st = ctx.styles
    head = ParagraphStyle(
        "assumed_owner",
        parent=st.cell_bold,
        backColor=st.tint,
        borderPadding=(1.5, 2, 1.5, 2),
        spaceBefore=4,
        spaceAfter=2.5,
        keepWithNext=1,
    )
    entry = ParagraphStyle("assumed_entry", parent=st.cell, leftIndent=9, firstLineIndent=-9, spaceAfter=0.5)
    note = ParagraphStyle("assumed_note", parent=dense(st).note, leftIndent=9, spaceAfter=1.5)
    return head, entry, note


def _entries(ctx: Ctx, groups: list[tuple[str, str, list[list]]]) -> list[list]:
    """The groups as units of :class:`.columns.Columns`: an owner's heading with its first key, then
    each key with its notes."""
    head, entry, note = _entry_styles(ctx)
    out: list[list] = []
    for owner, table, items in groups:
        text = owner + (f" — state in {table}" if table else "")
        block: list[list] = [[Paragraph(esc(text), head)]]
        for name, what, value, state, basis in items:
            lines = [Paragraph(f"<b>{esc(name)} = {esc(value)}</b>  {esc(what)}", entry)]
            if basis != TOOL_DEFAULT:
                lines.append(Paragraph(f"Basis: {esc(basis)}", note))
            if state:
                lines.append(Paragraph(f"To state it: {esc(state)}", note))
            if len(lines) == 1:
                lines[0].style = ParagraphStyle("assumed_last", parent=entry, spaceAfter=2.0)
            block.append(lines)
        out.append(block[0] + (block[1] if len(block) > 1 else []))
        out += block[2:]
    return out


def assumed_story(ctx: Ctx) -> list:
    st = ctx.styles
    title = Paragraph("Assumed values", st.h1)
    groups = assumed_groups(ctx)
    count = sum(len(rows) for _, _, rows in groups)
    if not count:
        return [title, para("None: the job states every value the calculation uses.", st.body)]
    lead = Paragraph(
        f"<b>{count} values assumed.</b> The job file did not state the values below; the tool used "
        "them. Each is a choice the engineer of record should confirm or state in the job file with "
        "the key shown: a shaded heading names a table of keys (and where they are stated), each entry "
        "below it a key within it, the value used and what it is. An entry is a tool default unless a "
        "basis is given under it. Read down the left column, then the right.",
        ParagraphStyle("assumed_lead", parent=st.small, spaceAfter=4.0),  # 4 pt above the entries
    )
    # the title and its lead head the columns: they go where the first entries go
    cont = Paragraph("Assumed values (continued)", st.h3)
    return [Columns(_entries(ctx, groups), head=[title, lead], cont=cont)]
