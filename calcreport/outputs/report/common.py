"""Shared pieces for the report sections: the build context, paragraphs and tables in our style."""

from __future__ import annotations

import re
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any

from reportlab.lib import colors
from reportlab.platypus import CondPageBreak, Flowable, Table, TableStyle

from ...solve.results import JobResult
from ..fmt import Display
from .fastcell import cell as fast_cell
from .pages import RULE, MarginMark
from .styles import Styles, esc
from .template import Template

__all__ = [
    "Ctx",
    "para",
    "heading",
    "grid",
    "status_cell",
    "marked_cell",
    "cited",
    "OK_COLOUR",
    "NG_COLOUR",
    "GOVERNS_TINT",
]

OK_COLOUR = colors.HexColor("#1d6b35")
NG_COLOUR = colors.HexColor("#b3261e")
NG_TINT = colors.HexColor("#fbe3e1")
GOVERNS_TINT = colors.HexColor("#fff4cc")


@dataclass
class Ctx:
    """What every section builder needs; nothing here computes engineering values."""

    result: JobResult
    display: Display
    styles: Styles
    template: Template
    width: float  # frame width in points
    changed_keys: frozenset[str] = frozenset()
    revision_mark: str = ""
    frame_height: float = 600.0

    def is_changed(self, key: str) -> bool:
        """True when ``key`` or anything below it (``key.x``, ``key[x]``) is in ``changed_keys``."""
        if not self.changed_keys or not key:
            return False
        if key in self.changed_keys:
            return True
        return any(k.startswith(key + ".") or k.startswith(key + "[") for k in self.changed_keys)

    def mark(self, key: str) -> list:
        """A margin triangle for ``key`` when it changed (place it first in a cell or story)."""
        if self.is_changed(key):
            return [MarginMark(self.revision_mark or "Δ", self.template.margins[0], self.styles)]
        return []

    def q(self, v: Any, sig: int = 4) -> str:
        """Display text for a value, "—" for None."""
        return "—" if v is None else self.display.value(v, sig)


_MEMORY = (
    (re.compile(r"\(\s*from memory\s*[;,]\s*", re.I), "("),
    (re.compile(r"\s*\(\s*from memory\s*\)", re.I), ""),
    (re.compile(r"\s*[,;]\s*from memory\b", re.I), ""),
    (re.compile(r"\s*\bfrom memory\b", re.I), ""),
)


def cited(text: str) -> str:
    """A source as a report prints it: the clause only. How a value was checked ("from memory")
    belongs in docs/sources.md, never in a report (project rule)."""
    out = text or ""
    for pattern, repl in _MEMORY:
        out = pattern.sub(repl, out)
    return out.strip()


def para(text: object, style, markup: str = "") -> Flowable:
    """A paragraph of literal ``text`` (escaped); ``markup`` wraps it, e.g. ``"b"``. One line
    that fits is drawn without a paragraph parse (:func:`.fastcell.cell`)."""
    body = esc(text)
    if markup:
        body = f"<{markup}>{body}</{markup}>"
    return fast_cell(body, style)


def heading(text: str, style, need: float = 60.0) -> list:
    """A heading that starts a new sheet when less than ``need`` points remain (no orphans)."""
    return [CondPageBreak(need), para(text, style)]


def marked_cell(ctx: Ctx, key: str, cell: Any, style=None) -> Any:
    """``cell`` with the revision triangle in the margin when ``key`` changed."""
    marks = ctx.mark(key)
    if not marks:
        return cell
    if isinstance(cell, (str, int, float)):
        cell = para(cell, style or ctx.styles.cell)
    return marks + [cell]


def status_cell(status: str, st: Styles) -> Flowable:
    colour = {"OK": OK_COLOUR, "NG": NG_COLOUR}.get(status, colors.black)
    return fast_cell(f'<font color="{colour.hexval()}"><b>{esc(status)}</b></font>', st.cell)


def _may_be_tall(data, widths, limit: float) -> bool:
    """Cheap upper bound on a row's height (generous: ~0.35 em per character on 8 pt text at
    11 pt leading) — only tables that might hold a row taller than ``limit`` get a trial layout."""
    for row in data:
        for cell, w in zip(row, widths):
            items = cell if isinstance(cell, (list, tuple)) else [cell]
            for item in items:
                text = item.getPlainText() if hasattr(item, "getPlainText") else ""
                if not text:
                    continue
                lines = text.count("\n") + 1 + len(text) * 4.5 / max(w - 6, 10)
                if lines * 11 > limit:
                    return True
    return False


def grid(
    rows: Sequence[Sequence[Any]],
    widths: Sequence[float],
    st: Styles,
    header_rows: int = 1,
    extra: Sequence[tuple] = (),
    zebra: bool = True,
    frame_height: float = 560.0,
) -> Table:
    """A table in our style: thin rules, tinted header repeated on every page.

    Rows are kept whole; only a table with a row taller than half of ``frame_height`` (when given)
    may split inside rows, so that nothing is ever too tall to place.
    """
    data = []
    ng = []
    for r, row in enumerate(rows):
        cells = []
        for cell in row:
            if r >= header_rows and cell in ("OK", "NG"):
                cells.append(status_cell(cell, st))
                if cell == "NG":
                    ng.append(("BACKGROUND", (0, r), (-1, r), NG_TINT))
            elif isinstance(cell, (str, int, float)):
                cells.append(para(cell, st.cell_bold if r < header_rows else st.cell))
            else:
                cells.append(cell)
        data.append(cells)
    split = 0
    if frame_height and _may_be_tall(data, widths, 0.5 * frame_height):
        probe = Table(data, colWidths=list(widths))
        probe.wrap(sum(widths), 1e7)
        split = int(max(probe._rowHeights, default=0) > 0.5 * frame_height)
    t = Table(data, colWidths=list(widths), repeatRows=header_rows, hAlign="LEFT", splitInRow=split)
    cmds = [
        ("VALIGN", (0, 0), (-1, -1), "TOP"),
        ("LEFTPADDING", (0, 0), (-1, -1), 3),
        ("RIGHTPADDING", (0, 0), (-1, -1), 3),
        ("TOPPADDING", (0, 0), (-1, -1), 2),
        ("BOTTOMPADDING", (0, 0), (-1, -1), 2.5),
        ("LINEBELOW", (0, 0), (-1, -1), 0.3, RULE),
        ("BOX", (0, 0), (-1, -1), 0.6, colors.black),
    ]
    if header_rows:
        cmds += [
            ("BACKGROUND", (0, 0), (-1, header_rows - 1), st.tint),
            ("LINEBELOW", (0, header_rows - 1), (-1, header_rows - 1), 0.7, colors.black),
        ]
    if zebra:
        for r in range(header_rows + 1, len(data), 2):
            cmds.append(("BACKGROUND", (0, r), (-1, r), colors.HexColor("#f6f6f6")))
    t.setStyle(TableStyle(cmds + ng + list(extra)))
    return t
