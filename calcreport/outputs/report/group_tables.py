"""Tables of grouped steps (``Step.group``/``row``/``column``, set by the solver).

Two layouts, chosen from the steps themselves:

* **parallel-axis table** — the rows share their formulas column by column (the section's parts):
  one row worked in full step by step, then the table of every row with the symbols once in the
  header, the column totals (Σ) and the steps of the group without a column below;
* **itemised table** — every row has its own formula (the yield modes, the adjustment factors,
  the detailing limits): one row per item with its formula and numbers in a small line and each
  column's result, a note or source column only where they differ from row to row (else stated
  once under the table).

Every number in either is one step's result or substituted formula, printed through ``Display``
— nothing is computed here. Every step stays in the results JSON one by one.
"""

from __future__ import annotations

from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import Spacer

from ...steps import Step
from ..fmt import Display
from ..phrases import step_note
from .common import GOVERNS_TINT, Ctx, cited, grid, para
from .fastcell import cell
from .flow import KeepTail
from .step_cell import GAP, StepCell
from .step_list import GOVERNS_TAG, TIGHT, dense_styles, steps_table
from .styles import esc

__all__ = ["group_table", "is_itemised", "ROW_WORDS"]

#: what a row of a table is, by the table's group id (the first dotted segment)
ROW_WORDS = {
    "section": "part",
    "zones": "zone",
    "combinations": "combination",
    "cases": "case",
    "yield": "mode",
    "factors": "factor",
    "limits": "limit",
}
#: tables whose cells give the result only (their formulas are in the worked row and the header)
_RESULT_ONLY = frozenset({"section"})


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


def _split(steps: list[Step]) -> tuple[dict[str, list[Step]], dict[str, Step], list[Step]]:
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
    return rows, totals, stated


def is_itemised(rows: dict[str, list[Step]]) -> bool:
    """True when two or more rows each use a formula of their own in every column (no two rows
    share a symbol in a column): the table lists items, it does not repeat one formula."""
    if len(rows) < 2:
        return False
    seen: set[tuple[str, str]] = set()
    for seq in rows.values():
        for s in seq:
            if (s.column, s.symbol) in seen:
                return False
            seen.add((s.column, s.symbol))
    return True


def _styles(ctx: Ctx) -> tuple[ParagraphStyle, ParagraphStyle, ParagraphStyle]:
    st = ctx.styles
    small = ParagraphStyle(
        "tcell", parent=st.cell, fontSize=st.cell.fontSize - 0.5, leading=st.cell.leading - 0.6
    )
    right = ParagraphStyle("tcellr", parent=small, alignment=2)
    head_r = ParagraphStyle("theadr", parent=st.cell_bold, fontSize=small.fontSize, alignment=2)
    return small, right, head_r


def _dense_small(ctx: Ctx) -> tuple[ParagraphStyle, ParagraphStyle]:
    return dense_styles(ctx.styles.cell, ctx.styles.caption)


def _formula_text(s: Step, ctx: Ctx) -> str:
    """``symbol = numbers`` (the symbol alone when the numbers are the result)."""
    d = ctx.display
    sub, res = d.substituted(s), d.result(s)
    return s.symbol if sub.strip() == res else f"{s.symbol} = {sub}"


def _shared_title(rows: dict[str, list[Step]]) -> str:
    """The rows' shared label with the row id taken out ("Yield mode (single shear)"), or ""."""
    titles = set()
    for rid, seq in rows.items():
        label = seq[-1].label
        titles.add(" ".join(t for t in label.split() if t.strip("()") != rid))
    return titles.pop() if len(titles) == 1 else ""


def _last_text_width(seq: list[Step], style: ParagraphStyle, notes: bool, sources: bool, d: Display) -> float:
    """Width of a row's note and source written on one line (what the last column must hold)."""
    text = "; ".join(cited(n) for n in (step_note(s, d) for s in seq) if n) if notes else ""
    src = "; ".join(dict.fromkeys(cited(s.source) for s in seq)) if sources else ""
    return stringWidth(text, style.fontName, style.fontSize) + (
        GAP + stringWidth(src, style.fontName, style.fontSize) if src else 0.0
    )


def _lines(width: float, room: float) -> int:
    inner = max(room - 6.0, 1.0)  # padding off
    if width <= inner:
        return 1
    return max(2, -int(-(1.12 * width) // inner))  # ceil; words break before the edge


def _fill(width: float, room: float) -> float:
    """Lines a text needs, as a fraction (to tell two layouts of equal line counts apart)."""
    return 1.12 * width / max(room - 6.0, 1.0)


def _balance(
    rows: list[tuple[float, list[float], float]], free: float, item_min: float, formula_min: float, last: bool
) -> tuple[float, float]:
    """Widths of the item and formula columns (the last column takes what is left) that make the
    table shortest: rows are (item width, formula line widths, note-and-source width); the count
    of lines each row needs is the most any of its cells needs, ties go to the finer estimate.
    Widths are searched on a grid of ``free``/48 (lines per width looked up once). Layout only."""
    grid_n = 48
    unit = free / grid_n
    widths = [u * unit for u in range(grid_n + 1)]
    item_l = [[_lines(item, x) for x in widths] for item, _, _ in rows]
    item_f = [[_fill(item, x) for x in widths] for item, _, _ in rows]
    form_l = [[sum(_lines(f, x) for f in fs) for x in widths] for _, fs, _ in rows]
    form_f = [[sum(_fill(f, x) for f in fs) for x in widths] for _, fs, _ in rows]
    note_l = [[_lines(n, x) if last else 1 for x in widths] for _, _, n in rows]
    note_f = [[_fill(n, x) if last else 0.0 for x in widths] for _, _, n in rows]
    lo_item = min(grid_n, int(-(-item_min // unit)))
    hi_item = max(lo_item, int(0.34 * grid_n))
    lo_form = min(grid_n, int(-(-formula_min // unit)))
    least_last = int(-(-36.0 // unit)) if last else 0
    best: tuple[float, float, float, int, int] = (float("inf"), 0.0, 0.0, 0, 0)
    for i in range(lo_item, hi_item + 1):
        for f in range(lo_form, grid_n - i - least_last + 1):
            c = grid_n - i - f
            lines = 0
            fill = 0.0
            for r in range(len(rows)):
                lines += max(item_l[r][i], form_l[r][f], note_l[r][c])
                fill += max(item_f[r][i], form_f[r][f], note_f[r][c])
            key = (lines, round(fill, 1), -f, i, f)
            if key < best:
                best = key
    if best[0] == float("inf"):  # no room for a last column: the least widths
        return item_min, formula_min
    return best[3] * unit, best[4] * unit


def _itemised(steps: list[Step], ctx: Ctx, prefix: str, index: dict[str, int]) -> list:
    st, d, w = ctx.styles, ctx.display, ctx.width
    rows, totals, stated = _split(steps)
    group = steps[0].group
    word = ROW_WORDS.get(group.split(".", 1)[0], "item")
    small, right, head_r = _styles(ctx)
    cols = _columns(rows)
    single = all(len(seq) == 1 for seq in rows.values())
    tabled = [s for seq in rows.values() for s in seq]
    notes = {n for n in (step_note(s, d) for s in tabled) if n}
    sources = {s.source for s in tabled}
    note_col, source_col = len(notes) > 1, len(sources) > 1
    heads: dict[str, list[str]] = {c: [] for c in cols}
    for s in tabled:
        if _lhs(s.symbol) not in heads[s.column]:
            heads[s.column].append(_lhs(s.symbol))
    font, size = small.fontName, small.fontSize

    def natural(texts: list[str], bold: bool = False) -> float:
        f, k = (st.cell_bold.fontName, st.cell_bold.fontSize) if bold else (font, size)
        return max((stringWidth(t, f, k) for t in texts), default=0.0) + 9.0

    shared = _shared_title(rows)
    items = {rid: (seq[0].label if single and not shared else rid) for rid, seq in rows.items()}
    formulas = {rid: [_formula_text(s, ctx) for s in seq] for rid, seq in rows.items()}
    first = word.capitalize()
    col_heads = {c: " / ".join(heads[c]) if len(heads[c]) <= 3 else c.capitalize() for c in cols}
    w_no = 0.075 * w
    w_vals = [
        max(natural([col_heads[c]], bold=True), natural([d.result(s) for s in tabled if s.column == c], True))
        for c in cols
    ]
    last_col = note_col or source_col  # notes, with each row's source flush right (StepCell)
    _, note_style = _dense_small(ctx)
    free = w - w_no - sum(w_vals)
    w_item, w_formula = _balance(
        [
            (
                stringWidth(items[rid], st.cell_bold.fontName, size),
                [stringWidth(t, font, size) for t in formulas[rid]],
                _last_text_width(seq, note_style, note_col, source_col, d) if last_col else 0.0,
            )
            for rid, seq in rows.items()
        ],
        free,
        natural([first], bold=True),
        natural(["Formula"], bold=True),
        last_col,
    )
    w_last = free - w_item - w_formula
    _, note_style = _dense_small(ctx)
    head_src = ParagraphStyle("item_head_src", parent=st.cell_bold)
    header = [para("No.", st.cell_bold), para(first, st.cell_bold), para("Formula", st.cell_bold)]
    header += [para(col_heads[c], head_r) for c in cols]
    if last_col:
        header.append(
            StepCell(
                [para("Note", st.cell_bold)] if note_col else [], "Source" if source_col else "", head_src
            )
        )
    data: list[list] = [header]
    extra: list[tuple] = [*TIGHT]
    for rid, seq in rows.items():
        r = len(data)
        by = {s.column: s for s in seq}
        gov = any(s.governs for s in seq)
        marks = [m for s in seq for m in ctx.mark(s.key)][:1]
        line: list = [marks + [cell("<br/>".join(f"{prefix}{index[s.key]}" for s in seq), small)]]
        line.append(cell(f"<b>{esc(items[rid])}</b>", small))
        line.append(cell("<br/>".join(esc(t) for t in formulas[rid]) + (GOVERNS_TAG if gov else ""), small))
        for c in cols:
            cs = by.get(c)
            line.append(para("—", right) if cs is None else cell(f"<b>{esc(d.result(cs))}</b>", right))
        if last_col:
            note = "; ".join(cited(n) for n in (step_note(s, d) for s in seq) if n) if note_col else ""
            source = "; ".join(dict.fromkeys(cited(s.source) for s in seq)) if source_col else ""
            line.append(StepCell([para(note or "—", note_style)] if note_col else [], source, note_style))
        data.append(line)
        if gov:
            extra.append(("BACKGROUND", (0, r), (-1, r), GOVERNS_TINT))
            extra.append(("LINEBEFORE", (0, r), (0, r), 2.0, st.accent))
    widths = [w_no, w_item, w_formula, *w_vals] + ([w_last] if last_col else [])
    if not last_col:
        widths[2] += w_last
    lo, hi = min(index[s.key] for s in tabled), max(index[s.key] for s in tabled)
    said = [
        (f"{shared}: steps" if shared else "Steps")
        + f" {prefix}{lo}–{prefix}{hi}, each value a step's result"
    ]
    if len(notes) == 1:
        said.append(cited(next(iter(notes))))
    if not source_col:
        said.append(f"source: {cited(next(iter(sources))) or '—'}")
    table = grid(data, widths, st, extra=extra, zebra=False, frame_height=ctx.frame_height)
    # the caption names the table and says once what every row shares; the numbers say the rest
    out: list = [
        KeepTail(table, [para("; ".join(said) + ".", st.caption)] if len(said) > 1 or shared else [])
    ]
    if totals:  # an itemised table has no sums row: its totals are stated in full
        stated = list(totals.values()) + stated
    return out + steps_table(stated, ctx, prefix, [index[s.key] for s in stated], header=False)


def _parallel(steps: list[Step], ctx: Ctx, prefix: str, index: dict[str, int], headed: bool) -> list:
    """The parallel-axis layout (module docstring)."""
    st, d, w = ctx.styles, ctx.display, ctx.width
    group = steps[0].group
    word = ROW_WORDS.get(group.split(".", 1)[0], "item")
    rows, totals, stated = _split(steps)
    out: list = []
    cols = _columns(rows)
    worked_id = next(iter(rows))
    worked = rows[worked_id]
    seen = {(s.column, s.symbol, step_note(s, d)) for s in worked}
    differ = []
    for rid, seq in rows.items():
        for s in seq:
            if rid != worked_id and (s.column, s.symbol, step_note(s, d)) not in seen:
                differ.append(s)
                seen.add((s.column, s.symbol, step_note(s, d)))
    out.append(
        para(
            f"Worked in full for {word} {worked_id}; the table below gives every {word}, each value the "
            f"result of the step of that formula for that {word}.",
            st.small,
        )
    )
    out += steps_table(worked, ctx, prefix, [index[s.key] for s in worked], header=not headed)
    if differ:
        out += [Spacer(1, 3), para(f"Where a {word} uses another formula, that step in full:", st.small)]
        out += steps_table(differ, ctx, prefix, [index[s.key] for s in differ], header=False)
    heads: dict[str, list[str]] = {c: [] for c in cols}
    for seq in rows.values():
        for s in seq:
            if _lhs(s.symbol) not in heads[s.column]:
                heads[s.column].append(_lhs(s.symbol))
    tstyle, cell_r, head_r = _styles(ctx)
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
        f"Steps {prefix}{lo}–{prefix}{hi}, each value a step's result (one by one in the results JSON)"
        + ("; Σ: the totals, each a step." if totals else "."),
        st.caption,
    )
    table = grid(data, widths, st, extra=[*TIGHT, *extra], zebra=True, frame_height=ctx.frame_height)
    out.append(KeepTail(table, [caption]))  # the caption stays with the table's last rows
    out += steps_table(stated, ctx, prefix, [index[s.key] for s in stated], header=False)
    return out


def group_table(
    steps: list[Step], ctx: Ctx, prefix: str, index: dict[str, int], headed: bool = False
) -> list:
    """The flowables of one table of grouped steps (its steps numbered by ``index``); ``headed``:
    the step rows' column heads are already printed under this heading."""
    rows, _, _ = _split(steps)
    if not rows:  # nothing tabulated: every step in full
        return steps_table(steps, ctx, prefix, [index[s.key] for s in steps], header=not headed)
    if is_itemised(rows):
        return _itemised(steps, ctx, prefix, index)
    return _parallel(steps, ctx, prefix, index, headed)
