"""Two text columns that run down the left column, then the right, and on across sheets.

A :class:`Columns` flowable holds *units* — short lists of flowables set together (a heading and
its first entry, an entry and its notes) — and never splits one. On a sheet it cannot finish it
fills the left column, then the right, to the foot of the frame and carries the rest to the next
sheet, under ``cont`` (a "(continued)" heading) when one is given; on its last sheet it balances
the two columns (the shortest height that holds every unit in reading order). A ``head`` (a
heading across both columns, or a heading and its lead: flowables one above the other) is set
above the first part only, and goes where at least
:data:`MIN_UNITS` units go with it. The part carried over is never fewer than :data:`MIN_UNITS`
units nor less than :data:`MIN_PART` of the frame high (a sheet with less is an orphan). On a
fresh sheet any unit that fits goes; a unit taller than a column is set as units of its own
flowables. Heights are those the units' own ``wrap`` gives at the column width, measured once per
width (drawing reuses them); the flowable draws nothing of its own.
"""

from __future__ import annotations

from collections.abc import Sequence

from reportlab.platypus import Flowable

__all__ = ["Columns", "MIN_UNITS", "MIN_PART"]

#: units carried to the next sheet at least (as a split table carries rows: :data:`.flow.MIN_ROWS`)
MIN_UNITS = 3
#: ... and at least this share of the frame height (also the block rule of :class:`.flow.EvenTable`)
MIN_PART = 0.12
#: an available height at least this share of the frame is a fresh sheet
FRESH = 0.95


class Columns(Flowable):
    """Units set in two columns (see module docstring); ``gap`` between the columns in points."""

    def __init__(
        self,
        units: Sequence[Sequence[Flowable]],
        gap: float = 14.0,
        head: Flowable | Sequence[Flowable] | None = None,
        cont: Flowable | None = None,
    ):
        super().__init__()
        self.units = [list(u) for u in units if u]
        self.gap = gap
        self.head, self.cont = head, cont
        self._heads: list[Flowable] = [head] if isinstance(head, Flowable) else list(head or [])
        self._measured: tuple[float, list[list[float]]] | None = None  # width, flowable heights
        self._cols: tuple[list[int], list[int]] = ([], [])
        self._fixed = False  # set by split(): this part fills its sheet's columns as laid out
        self.frame_height = 0.0  # set by the page discipline (flow.disciplined)
        self.width = self.height = 0.0

    # -- measuring -------------------------------------------------------------------------
    def _col_width(self, aw: float) -> float:
        return (aw - self.gap) / 2.0

    def _sizes(self, aw: float) -> list[list[float]]:
        """The height of every flowable of every unit at the column width (wrapped once)."""
        cw = self._col_width(aw)
        if self._measured is None or self._measured[0] != cw:
            self._measured = (cw, [[f.wrap(cw, 1e9)[1] for f in unit] for unit in self.units])
        return self._measured[1]

    def _heights(self, aw: float) -> list[float]:
        """Each unit's height inside a column, its space before included (the first unit of a
        column drops it: :meth:`_lead`)."""
        return [
            sum(h + f.getSpaceBefore() + f.getSpaceAfter() for f, h in zip(unit, sizes))
            for unit, sizes in zip(self.units, self._sizes(aw))
        ]

    def _lead(self, k: int) -> float:
        """The space before the first flowable of unit ``k`` (dropped at a column's top)."""
        return float(self.units[k][0].getSpaceBefore())

    def _fill(self, heights: list[float], start: int, limit: float) -> int:
        """The index after the last unit from ``start`` that fits in ``limit`` points."""
        used, k = 0.0, start
        while k < len(heights):
            h = heights[k] - (self._lead(k) if k == start else 0.0)
            if used + h > limit + 1e-6:
                break
            used += h
            k += 1
        return k

    def _column_height(self, heights: list[float], a: int, b: int) -> float:
        return sum(heights[a:b]) - (self._lead(a) if b > a else 0.0)

    def _balanced(self, heights: list[float], a: int = 0, b: int | None = None) -> tuple[int, float]:
        """(cut, height) for units [a, b): the left column takes [a, cut); the taller column is
        the least tall it can be."""
        b = len(heights) if b is None else b
        best = (b, self._column_height(heights, a, b))
        for cut in range(a + 1, b):
            h = max(self._column_height(heights, a, cut), self._column_height(heights, cut, b))
            if h < best[1] - 1e-6:
                best = (cut, h)
        return best

    def _head_spans(self, aw: float) -> list[tuple[Flowable, float, float]]:
        """(flowable, its height, the space above it) of each head flowable, at full width."""
        heads = self._heads
        return [
            (f, f.wrap(aw, 1e9)[1], float(heads[k - 1].getSpaceAfter() + f.getSpaceBefore()) if k else 0.0)
            for k, f in enumerate(heads)
        ]

    def _head_height(self, aw: float) -> float:
        if not self._heads:
            return 0.0
        return sum(h + above for _, h, above in self._head_spans(aw)) + float(self._heads[-1].getSpaceAfter())

    def getSpaceBefore(self) -> float:  # noqa: N802 - reportlab's name
        return float(self._heads[0].getSpaceBefore()) if self._heads else 0.0

    def _fresh(self, ah: float) -> bool:
        return bool(self.frame_height) and ah >= FRESH * self.frame_height

    # -- flowable protocol -----------------------------------------------------------------
    def wrap(self, aw: float, ah: float) -> tuple[float, float]:
        if self._fixed:
            return self.width, self.height
        heights = self._heights(aw)
        top = self._head_height(aw)
        n = len(heights)
        cut, h = self._balanced(heights)
        if top + h <= ah + 1e-6:
            self._cols = (list(range(0, cut)), list(range(cut, n)))
        else:  # more than this sheet holds: split() carries the rest on
            self._cols = (list(range(n)), [])
        self.width, self.height = aw, top + h
        return self.width, self.height

    def split(self, aw: float, ah: float) -> list[Flowable]:
        heights = self._heights(aw)
        top = self._head_height(aw)
        n = len(heights)
        room = ah - top
        left = self._fill(heights, 0, room)
        right = self._fill(heights, left, room)
        fresh = self._fresh(ah)
        if right == 0 and fresh and self._heads:  # a head that leaves no room: on its own
            bare = Columns(self.units, self.gap, None, self.cont)
            bare.frame_height = self.frame_height
            return [*self._heads, bare]
        if right == 0 and fresh and n and heights[0] - self._lead(0) > room:
            return self._unbundled(aw, ah)  # a unit taller than a column: its flowables one by one
        if right < min(MIN_UNITS, n) and not (fresh and right >= 1):
            return []  # too little room here for the head and a few units: the next sheet
        if right >= n:
            return [self]
        if n - right < MIN_UNITS <= right - MIN_UNITS:
            right = n - MIN_UNITS  # never a unit or two alone on the next sheet
        # nor a sliver: the part carried over is at least MIN_PART of the frame high (balanced)
        while (
            self.frame_height
            and right > MIN_UNITS
            and self._balanced(heights, right)[1] < MIN_PART * self.frame_height
        ):
            right -= 1
        if right < len(self._fill_range(heights, room)):
            left, _ = self._balanced(heights, 0, right)  # fewer units than fill the sheet: balanced
        left = min(left, right)
        first = Columns(self.units[:right], self.gap, self.head)
        sizes = self._sizes(aw)
        first._measured = (self._col_width(aw), sizes[:right])
        first._cols = (list(range(0, left)), list(range(left, right)))
        first.width = aw
        first.height = top + max(
            self._column_height(heights, 0, left), self._column_height(heights, left, right)
        )
        first._fixed = True
        rest = Columns(self.units[right:], self.gap, self.cont, self.cont)
        rest.frame_height = self.frame_height
        return [first, rest]

    def _fill_range(self, heights: list[float], room: float) -> range:
        """The units the sheet's two columns would hold filled to the foot."""
        left = self._fill(heights, 0, room)
        return range(self._fill(heights, left, room))

    def _unbundled(self, aw: float, ah: float) -> list[Flowable]:
        units = [[f] for unit in self.units for f in unit]
        if len(units) == len(self.units):
            return []  # one flowable taller than a column: nothing to set it by (reportlab says so)
        again = Columns(units, self.gap, self.head, self.cont)
        again.frame_height = self.frame_height
        return again.split(aw, ah)

    def draw(self) -> None:
        cw = self._col_width(self.width)
        sizes = self._sizes(self.width)
        top = 0.0
        if self._heads:
            for f, h, above in self._head_spans(self.width):
                top += above + h
                f.drawOn(self.canv, 0, self.height - top)
            top += float(self._heads[-1].getSpaceAfter())
        for col, indices in enumerate(self._cols):
            x = col * (cw + self.gap)
            y = self.height - top
            for j, k in enumerate(indices):
                for i, (f, fh) in enumerate(zip(self.units[k], sizes[k])):
                    before = 0.0 if j == 0 and i == 0 else float(f.getSpaceBefore())
                    y -= before + fh
                    f.drawOn(self.canv, x, y)
                    y -= float(f.getSpaceAfter())
