"""The numbered list of steps: one row per step with its formula, numbers, result and source.

A row is the step's number and one cell (:class:`.step_cell.StepCell`): the label, symbol, the
formula with the numbers substituted and the result on one line (wrapping when long), its note in
a small line under it, and its source flush right on the last line (or a line of its own); steps
that govern are tinted and carry ``[governs]``. Nothing here computes: every text is the step's
own, written through ``Display``.
"""

from __future__ import annotations

from functools import lru_cache

from reportlab.lib.styles import ParagraphStyle

from ...steps import Step
from ..phrases import step_note
from .common import GOVERNS_TINT, Ctx, cited, grid, para
from .fastcell import cell
from .flow import HeadAtTop
from .step_cell import StepCell
from .styles import esc

__all__ = ["step_rows", "steps_table", "dense_styles", "STEP_WIDTHS", "GOVERNS_TAG", "TIGHT"]

#: shares of the frame width: number, step (with its source flush right)
STEP_WIDTHS = (0.065, 0.935)
GOVERNS_TAG = '  <font color="#7a5a00"><b>[governs]</b></font>'
#: the padding of derivation rows (points): rows are dense, the rules between them keep them apart
TIGHT = (
    ("TOPPADDING", (0, 1), (-1, -1), 1.2),
    ("BOTTOMPADDING", (0, 1), (-1, -1), 1.4),
    ("LEFTPADDING", (0, 0), (-1, -1), 2.5),
    ("RIGHTPADDING", (0, 0), (-1, -1), 2.5),
)


#: a source this long (characters) that repeats the row above prints as :data:`DITTO`
LONG_SOURCE = 60
DITTO = "as above"


@lru_cache(maxsize=8)
def dense_styles(
    cell_style: ParagraphStyle, caption: ParagraphStyle
) -> tuple[ParagraphStyle, ParagraphStyle]:
    """The step line and its small lines (note, source) at a tighter leading than other tables."""
    line = ParagraphStyle("step", parent=cell_style, leading=cell_style.fontSize * 1.17)
    small = ParagraphStyle("step_small", parent=caption, leading=caption.fontSize * 1.16)
    return line, small


def step_rows(
    steps: list[Step], ctx: Ctx, number_prefix: str, numbers=None, header: bool = True
) -> tuple[list[list], list[tuple]]:
    """Table rows for the steps and style commands that tint the governing ones.

    ``numbers`` (optional) gives each step's number within its heading; else 1, 2, 3…. A long
    source equal to the row above's prints as "as above". ``header``: the column heads first.
    """
    st, d = ctx.styles, ctx.display
    line_style, small = dense_styles(st.cell, st.caption)
    bold_small = ParagraphStyle("step_head_src", parent=st.cell_bold, textColor=st.cell_bold.textColor)
    rows: list[list] = (
        [["No.", StepCell([para("Step", st.cell_bold)], "Source", bold_small)]] if header else []
    )
    extra: list[tuple] = []
    above = ""
    for i, s in enumerate(steps, 1):
        r = len(rows)
        tag = GOVERNS_TAG if s.governs else ""
        sub, res = d.substituted(s), d.result(s)
        line = f"= <b>{esc(res)}</b>" if sub.strip() == res else f"= {esc(sub)}   = <b>{esc(res)}</b>"
        body = [
            cell(f"<b>{esc(s.label)}</b>{tag}&nbsp;&nbsp; {esc(s.symbol)}&nbsp;&nbsp; {line}", line_style)
        ]
        note = step_note(s, d)
        if note:
            body.append(para(cited(note), small))
        no = numbers[i - 1] if numbers is not None else i
        num = ctx.mark(s.key) + [para(f"{number_prefix}{no}", line_style)]
        source = cited(s.source) or "—"
        shown = DITTO if source == above and len(source) >= LONG_SOURCE else source
        above = source
        rows.append([num, StepCell(body, shown, small)])
        if s.governs:
            extra.append(("BACKGROUND", (0, r), (-1, r), GOVERNS_TINT))
            extra.append(("LINEBEFORE", (0, r), (0, r), 2.0, ctx.styles.accent))
    return rows, extra


def steps_table(steps: list[Step], ctx: Ctx, prefix: str, numbers: list[int], header: bool = True) -> list:
    """The steps as one table (``[]`` for none), numbered ``prefix`` + ``numbers``; without
    ``header`` it continues the columns of a table above it under the same heading."""
    if not steps:
        return []
    table = _table(steps, ctx, prefix, numbers, header)
    if header:
        return [table]
    # rows under the table above; headed again where they start a sheet (flow.HeadAtTop)
    return [HeadAtTop(table, _table(steps, ctx, prefix, numbers, True), ctx.frame_height)]


def _table(steps: list[Step], ctx: Ctx, prefix: str, numbers: list[int], header: bool):
    rows, extra = step_rows(steps, ctx, prefix, numbers, header)
    return grid(
        rows,
        [k * ctx.width for k in STEP_WIDTHS],
        ctx.styles,
        header_rows=1 if header else 0,
        extra=[*(TIGHT if header else _TIGHT_ALL), *extra],
        zebra=False,
        frame_height=ctx.frame_height,
    )


_TIGHT_ALL = tuple((c, (0, 0), b, *v) for c, _a, b, *v in TIGHT)
