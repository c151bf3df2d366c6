"""Styles of the report's closing tables (results, checks, assumed values, limitations): the note
under a table cell and the dense list, derived once per :class:`.styles.Styles`.

Kept apart from :mod:`.styles` so the existing styles stay as they are; sizes follow the report's
own (a cell note is the caption size with no space after, so a row ends with its last line)."""

from __future__ import annotations

from dataclasses import dataclass

from reportlab.lib.styles import ParagraphStyle

from .styles import Styles

__all__ = ["Dense", "dense", "TIGHT"]

#: cell padding of the closing tables (the report's grid pads 2 / 2.5 pt): rows a little closer
TIGHT: tuple[tuple, ...] = (
    ("TOPPADDING", (0, 1), (-1, -1), 1.5),
    ("BOTTOMPADDING", (0, 1), (-1, -1), 1.5),
)


@dataclass(frozen=True)
class Dense:
    note: ParagraphStyle  # a note or source under a cell's text
    item: ParagraphStyle  # an item of a list set in columns
    head: ParagraphStyle  # the heading of such a list (h3 with less space around it)


_CACHE: dict[int, tuple[Styles, Dense]] = {}


def dense(st: Styles) -> Dense:
    """The dense styles of ``st`` (made once per report styles)."""
    hit = _CACHE.get(id(st))
    if hit is not None and hit[0] is st:
        return hit[1]
    out = Dense(
        note=ParagraphStyle("cell_note", parent=st.caption, spaceAfter=0, spaceBefore=0),
        item=ParagraphStyle(
            "dense_item", parent=st.small, fontSize=7.0, leading=8.3, spaceAfter=1.0, spaceBefore=0
        ),
        head=ParagraphStyle("dense_head", parent=st.h3, spaceBefore=5, spaceAfter=2),
    )
    _CACHE.clear()  # one report at a time: keep only the latest styles
    _CACHE[id(st)] = (st, out)
    return out
