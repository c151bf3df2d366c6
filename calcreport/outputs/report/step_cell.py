"""A derivation row's cell: the step's lines with its source set flush right on the last line.

A step row is its label, formula, numbers and result (one line or a few), the note under it, and
the source — the clause a checker looks for at the right edge. A separate source column wastes the
width the formula needs and wraps a long clause over three or four lines; here the source sits at
the right end of the row's last line when that line leaves room for it, else on a line of its own
(flush right), else — a clause longer than the width — as a right-aligned small paragraph
under the step. The texts are the step's own; nothing is computed.
"""

from __future__ import annotations

from functools import lru_cache

from reportlab.lib.enums import TA_RIGHT
from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import Flowable, Paragraph

from .fastcell import LineCell, OnceParagraph
from .styles import esc

__all__ = ["StepCell", "GAP"]

#: the least white space between a row's text and its source on one line (points)
GAP = 12.0


def _last_width(f: Flowable, aw: float) -> float:
    """Width the last line of a wrapped paragraph (or fast line) takes, from the left."""
    if isinstance(f, LineCell):
        if f._fits:
            return f._line_width
        f = f._paragraph()
    lines = getattr(getattr(f, "blPara", None), "lines", None)
    if not lines:
        return aw
    last = lines[-1]
    extra = last[0] if isinstance(last, tuple) else getattr(last, "extraSpace", 0.0)
    return aw - float(extra or 0.0)


@lru_cache(maxsize=8)
def _right(style: ParagraphStyle) -> ParagraphStyle:
    """``style`` set flush right (one style object per style, so its parse is shared)."""
    return ParagraphStyle("src_r", parent=style, alignment=TA_RIGHT)


class StepCell(Flowable):
    """``parts`` (the step line, its note) stacked, ``source`` flush right (module docstring)."""

    def __init__(self, parts: list[Flowable], source: str, style: ParagraphStyle):
        super().__init__()
        self.parts, self.source, self.style = list(parts), source, style
        self._layout: tuple = ()
        self._size: tuple[float, float] = (0.0, 0.0)

    def getPlainText(self, identify=None) -> str:  # noqa: N802 - reportlab's name
        texts = [p.getPlainText() for p in self.parts if hasattr(p, "getPlainText")]
        return " ".join([*texts, self.source])

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:  # noqa: N803
        aw = availWidth
        if self._layout and self._layout[0] == aw:  # a table wraps each cell more than once
            return self._size
        heights = [p.wrap(aw, availHeight)[1] for p in self.parts]
        body = sum(heights)
        st = self.style
        sw = stringWidth(self.source, st.fontName, st.fontSize)
        room = [
            k for k in range(len(self.parts) - 1, -1, -1) if _last_width(self.parts[k], aw) + GAP + sw <= aw
        ]
        mode: str | int | tuple[str, Paragraph]
        if not self.source:
            mode, extra = "none", 0.0
        elif room:  # on the last line of the last part that leaves room (the note, else the step)
            mode, extra = room[0], 0.0
        elif sw <= aw:
            mode, extra = "line", st.leading
        else:
            para = OnceParagraph(esc(self.source), _right(st))
            extra = para.wrap(aw, availHeight)[1]
            mode = ("para", para)
        self._layout = (aw, heights, mode)
        self.width, self.height = aw, body + extra
        self._size = (aw, body + extra)
        return self._size

    def draw(self) -> None:
        aw, heights, mode = self._layout
        c, st = self.canv, self.style
        y = self.height
        bottoms = []
        for p, h in zip(self.parts, heights):
            y -= h
            p.drawOn(c, 0, y)
            bottoms.append(y)
        if mode == "none":
            return
        if isinstance(mode, tuple):
            mode[1].drawOn(c, 0, 0)
            return
        if isinstance(mode, int):  # the baseline of that part's last line
            ls = self.parts[mode].style
            base = bottoms[mode] + ls.leading - ls.fontSize
        else:
            base = st.leading - st.fontSize
        c.saveState()
        c.setFont(st.fontName, st.fontSize)
        c.setFillColor(st.textColor)
        c.drawRightString(aw, base, self.source)
        c.restoreState()
