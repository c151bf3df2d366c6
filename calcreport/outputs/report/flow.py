"""Page discipline: no table leaves one or two rows alone on a sheet, no sheet carries only a
closing line, headings stay with what follows.

* :class:`EvenTable` — a table (ours, :func:`.common.grid`) that, when it must split, never leaves
  a part of fewer than :data:`MIN_ROWS` body rows on either side unless that part is itself at
  least :data:`MIN_PART` of the frame high (two derivation rows of four lines each are a block,
  not a lone row; the orphan measure of the layout tests is 10 %): it moves whole (when it fits a
  sheet) or moves rows over so the two parts are nearer in size.
* :class:`KeepTail` — a table and the lines that close it (the member's status line): the lines
  are kept with the table's last rows, never set alone on a new sheet.
* :class:`HeadAtTop` — a table that continues the columns of the one above it without a header
  row, given its header when it starts a sheet (so no sheet opens on a bare row).
* :func:`disciplined` — one pass over the story: every table becomes an :class:`EvenTable` and
  headings are kept with the next flowable when that one is short.
"""

from __future__ import annotations

from reportlab.platypus import CondPageBreak, Flowable, KeepTogether, Paragraph, Table

from .columns import MIN_PART, Columns
from .fastcell import LineCell
from .pages import MarginMark, OutlineMark, SectionStart

__all__ = ["EvenTable", "HeadAtTop", "KeepHead", "KeepTail", "disciplined", "MIN_ROWS"]

#: body rows a split table keeps on each side of the break
MIN_ROWS = 3
#: ... unless the rows on that side are at least this share of the frame height (columns.MIN_PART)
_HEADINGS = ("h1", "h2", "h3")


class EvenTable(Table):
    """A :class:`Table` whose splits keep :data:`MIN_ROWS` body rows on each side."""

    frame_height: float = 0.0

    def _header_rows(self) -> int:
        r = self.repeatRows
        return r if isinstance(r, int) else (max(r) + 1 if r else 0)

    def split(self, availWidth, availHeight):
        self._calc(availWidth, availHeight)
        heights = list(self._rowHeights)
        head = self._header_rows()
        n = len(heights)
        body = n - head
        if body < 1 or self.splitInRow and max(heights[head:], default=0) > availHeight:
            return super().split(availWidth, availHeight)
        used, cut = 0.0, 0
        for i, h in enumerate(heights):
            if used + h > availHeight:
                break
            used += h
            cut = i + 1
        if cut >= n:
            return super().split(availWidth, availHeight)
        first, rest = cut - head, n - cut
        fresh = self.frame_height and availHeight >= 0.95 * self.frame_height
        block = MIN_PART * self.frame_height if self.frame_height else float("inf")
        if first < MIN_ROWS and sum(heights[head:cut]) < block and not fresh and body > 0:
            return []  # too little room here: the whole table (or its start) moves to the next sheet
        if rest < MIN_ROWS and sum(heights[cut:]) < block:
            if body >= 2 * MIN_ROWS:
                cut = n - MIN_ROWS  # leave MIN_ROWS for the next sheet
                return super().split(availWidth, sum(heights[:cut]) + 0.01)
            if not fresh:
                return []  # too short to split evenly: the table moves whole
        return super().split(availWidth, availHeight)


def _height(f: Flowable, aw: float, ah: float) -> float:
    _, h = f.wrap(aw, ah)
    return h + f.getSpaceBefore() + f.getSpaceAfter()


class KeepTail(Flowable):
    """A table followed by the lines that close it, kept so the lines never stand alone."""

    frame_height: float = 0.0

    def __init__(self, table: Table, tail: list[Flowable]):
        super().__init__()
        self.table, self.tail = table, list(tail)

    def wrap(self, aw, ah):
        self._aw = aw
        return aw, 0xFFFFFF  # always split into its parts (as KeepTogether does)

    def split(self, aw, ah):
        content = [self.table, *self.tail]
        tail_h = sum(_height(f, aw, ah) for f in self.tail)
        table_h = _height(self.table, aw, ah)
        if table_h + tail_h <= ah:
            return content
        if table_h <= ah:  # the table fits but its closing lines do not: carry its last rows over
            heights = list(getattr(self.table, "_rowHeights", ()))
            head = self.table.repeatRows if isinstance(self.table.repeatRows, int) else 0
            if len(heights) - head >= 2 * MIN_ROWS:
                parts = self.table.split(aw, sum(heights[: len(heights) - MIN_ROWS]) + 0.01)
                if len(parts) == 2:
                    return [parts[0], KeepTogether([parts[1], *self.tail])]
            return content if self._fresh(ah) else []  # [] moves it all to the next sheet
        parts = self.table.split(aw, ah)
        if len(parts) == 2:
            tail = KeepTail(parts[1], self.tail)
            tail.frame_height = self.frame_height
            return [parts[0], tail]
        return content if self._fresh(ah) else []

    def _fresh(self, ah: float) -> bool:
        return not self.frame_height or ah >= 0.95 * self.frame_height

    def draw(self):  # never drawn itself: always split
        pass


class KeepHead(Flowable):
    """Headings (and short lines under them) and the table that follows: they go where the
    table's first rows go."""

    def __init__(self, head: list[Flowable], table: Table, frame_height: float):
        super().__init__()
        self.head, self.table, self.frame_height = list(head), table, frame_height

    def wrap(self, aw, ah):
        return aw, 0xFFFFFF  # always split into its parts (as KeepTogether does)

    def split(self, aw, ah):
        hh = sum(_height(f, aw, ah) for f in self.head)
        if hh + _height(self.table, aw, ah) <= ah:
            return [*self.head, self.table]
        parts = self.table.split(aw, ah - hh)
        if len(parts) >= 2:
            return [*self.head, *parts]
        if ah >= 0.95 * self.frame_height:  # a fresh sheet: nothing better to wait for
            return [*self.head, self.table]
        return []

    def draw(self):  # never drawn itself: always split
        pass


class HeadAtTop(Flowable):
    """``bare`` (rows continuing the table above, no header) where it follows that table on a
    sheet; ``headed`` (the same rows under their header row) where it starts a fresh sheet."""

    def __init__(self, bare: Table, headed: Table, frame_height: float):
        super().__init__()
        self.bare, self.headed, self.frame_height = bare, headed, frame_height
        self._use: Table = bare

    def _pick(self, ah: float) -> Table:
        fresh = self.frame_height and ah >= 0.95 * self.frame_height
        self._use = self.headed if fresh else self.bare
        return self._use

    def wrap(self, aw, ah):
        w, h = self._pick(ah).wrap(aw, ah)
        self.width, self.height = w, h
        return w, h

    def split(self, aw, ah):
        use = self._pick(ah)
        parts = use.split(aw, ah)
        if use is self.headed or len(parts) != 2:
            return parts
        # the rows carried to the next sheet start there under the header: the headed table cut
        # after the same rows (its header repeats on the second part)
        kept = len(parts[0]._cellvalues)
        self.headed.wrap(aw, ah)
        heights = list(self.headed._rowHeights)
        cut = Table.split(self.headed, aw, sum(heights[: kept + 1]) + 0.01)
        if len(cut) != 2 or len(cut[1]._cellvalues) != len(self.headed._cellvalues) - kept:
            return parts
        return [parts[0], cut[1]]

    def getSpaceBefore(self):  # noqa: N802 - reportlab's name
        return self._use.getSpaceBefore()

    def getSpaceAfter(self):  # noqa: N802 - reportlab's name
        return self._use.getSpaceAfter()

    def drawOn(self, canvas, x, y, _sW=0):  # noqa: N802 - reportlab's name
        self._use.drawOn(canvas, x, y, _sW)


def _even(t: Table, frame_height: float) -> Table:
    if type(t) is Table:
        t.__class__ = EvenTable
    if isinstance(t, EvenTable):
        t.frame_height = frame_height
    return t


def _is_line(f: Flowable) -> bool:
    """A paragraph, or one line drawn without a paragraph parse (:class:`.fastcell.LineCell`)."""
    return isinstance(f, (Paragraph, LineCell))


def _is_heading(f: Flowable) -> bool:
    return _is_line(f) and getattr(f.style, "name", "") in _HEADINGS


def _is_lead(f: Flowable) -> bool:
    """A short line introducing what follows (small print, a CondPageBreak, a zero-size mark)."""
    if _is_line(f):
        return getattr(f.style, "name", "") in ("small", "caption") and len(f.getPlainText()) < 400
    return isinstance(f, (CondPageBreak, OutlineMark, SectionStart, MarginMark))


def _is_closing(f: Flowable) -> bool:
    """A short line of small print that closes what stands above it (a total, a remark)."""
    return _is_line(f) and not _is_heading(f) and getattr(f.style, "name", "") in ("small", "caption")


def _keep_closing_lines(out: list) -> list:
    """A table or a kept block followed by closing lines (that lead into no table of their own)
    keeps them: a table's last rows and its lines move together (:class:`KeepTail`)."""
    done: list = []
    i = 0
    while i < len(out):
        f = out[i]
        j = i + 1
        while j < len(out) and j - i <= 3 and _is_closing(out[j]):
            j += 1
        after = out[j] if j < len(out) else None
        leads = isinstance(after, (Table, HeadAtTop, KeepTogether))
        if j > i + 1 and not leads and (type(f) is Table or isinstance(f, EvenTable)):
            tail = KeepTail(f, out[i + 1 : j])
            done.append(tail)
            i = j
            continue
        if j > i + 1 and not leads and type(f) is KeepTogether:
            done.append(KeepTogether([*f._content, *out[i + 1 : j]]))
            i = j
            continue
        done.append(f)
        i += 1
    return done


def disciplined(story: list, frame_height: float) -> list:
    """The story with our tables made :class:`EvenTable` and headings kept with a short next
    flowable (a table of a few rows, a paragraph, a figure: whole on the sheet of its heading)."""
    out: list = []
    for f in _keep_closing_lines(story):
        if isinstance(f, Table):
            _even(f, frame_height)
        elif isinstance(f, KeepTail):
            _even(f.table, frame_height)
            f.frame_height = frame_height
        elif isinstance(f, HeadAtTop):
            _even(f.bare, frame_height)
            _even(f.headed, frame_height)
        elif isinstance(f, Columns):
            f.frame_height = frame_height
        elif isinstance(f, KeepTogether):
            for g in f._content:
                if isinstance(g, Table):
                    _even(g, frame_height)
        out.append(f)
    done: list = []
    i = 0
    while i < len(out):
        f = out[i]
        if _is_heading(f) or _is_lead(f):
            # a heading (and the short lines under it) go where the next table starts
            j = i
            while j < len(out) and (_is_heading(out[j]) or _is_lead(out[j])):
                j += 1
            if j < len(out) and isinstance(out[j], (Table, HeadAtTop, KeepTail)) and j - i <= 8:
                head = [g for g in out[i:j] if not isinstance(g, CondPageBreak)]  # KeepHead decides
                done.append(KeepHead(head, out[j], frame_height))
                i = j + 1
                continue
            if (
                j < len(out)
                and isinstance(out[j], KeepTogether)
                and j - i <= 8
                and any(_is_heading(g) for g in out[i:j])
            ):  # a heading, the lines under it and a figure kept together: one level, flattened
                head = [g for g in out[i:j] if not isinstance(g, CondPageBreak)]
                done.append(KeepTogether([*head, *out[j]._content]))
                i = j + 1
                continue
            nxt = out[i + 1] if i + 1 < len(out) else None
            if _is_heading(f) and isinstance(nxt, KeepTogether):  # one level: nested ones measure as too tall
                done.append(KeepTogether([f, *nxt._content]))
                i += 2
                continue
            if _is_heading(f) and nxt is not None and _is_line(nxt):
                f.keepWithNext = 1
        done.append(f)
        i += 1
    return done
