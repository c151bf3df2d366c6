"""Drawings of the fabrication sheet: the member's elevation with one joint's zones (rows drawn
where they go, spacing and count per zone above, running dimensions from the left end below) and
the QR code tying the shop copy to the calculation (reportlab's own QR encoder, :mod:`.qr_draw`).

Reads the solver's callout record (``JointResult.callout``); places and prints, never computes.
"""

from __future__ import annotations

from collections.abc import Callable

from reportlab.graphics.shapes import Drawing, Group, Line, Polygon, Rect, String
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import Flowable

from ..model import Member
from ..solve.results import JointResult
from ..units import Q_
from .qr_draw import draw_qr

__all__ = ["elevation", "ShopQR", "qr_payload", "QR_SIZE"]

INK = colors.HexColor("#222222")
ROW_INK = colors.HexColor("#b3261e")
FILL = colors.HexColor("#f3efe6")
SIZE = 7.0
QR_SIZE = 92.0


def _inches(q) -> float:
    return float(q.to("inch").magnitude)


def _rows_above(items: list[tuple[float, float, float, float]], gap: float = 4.0) -> list[int]:
    """A text row for each label (centre, width, segment start, end): row 0 when it fits inside
    its segment and clear of the others, else the first higher row where it overlaps nothing."""
    taken: dict[int, list[tuple[float, float]]] = {}
    out = []
    for c, w, a, b in items:
        lo, hi = c - w / 2, c + w / 2
        row = 0 if w + 2 <= b - a else 1
        while any(lo < h + gap and hi > low - gap for low, h in taken.get(row, [])):
            row += 1
        taken.setdefault(row, []).append((lo, hi))
        out.append(row)
    return out


def elevation(
    j: JointResult, member: Member, fmt_pos: Callable, fmt_len: Callable, font: str, bold: str, width: float
) -> Drawing | None:
    """One joint's rows along the member, zone by zone; None without zones or a length."""
    c = j.callout
    if c is None or c.length is None:
        return None
    L = _inches(c.length)
    if L <= 0:
        return None
    left, right = 30.0, 30.0
    sx = (width - left - right) / L
    zones = c.zones
    labels = []
    whole = c.staggered and c.stagger_with != "" and bool(c.offset_planes)
    midway_of = whole and c.stagger_met  # rows midway between another line's: the spacing is a limit
    for z in zones:
        a, b = left + _inches(z.start) * sx, left + _inches(z.end) * sx
        text = f"{'gaps ≤' if midway_of else '@'} {fmt_len(z.spacing)}  ·  {z.pieces}"
        labels.append(((a + b) / 2, stringWidth(text, font, SIZE), a, b, text))
    rows_up = _rows_above([(x, w, a, b) for x, w, a, b, _ in labels])
    n_up = max(rows_up, default=0) + 1
    bounds = sorted({_inches(z.start) for z in zones} | {_inches(z.end) for z in zones} | {0.0, L})
    texts = [fmt_pos(Q_(x, "inch")) for x in bounds]
    down_w = max((stringWidth(t, font, SIZE) for t in texts), default=20.0)
    y0, h = 18.0 + down_w + 14, 18.0
    height = y0 + h + 14 + n_up * (SIZE + 4) + 6
    dr = Drawing(width, height)
    dr.add(Rect(left, y0, L * sx, h, strokeColor=INK, fillColor=FILL, strokeWidth=0.8))
    for sup in member.supports:
        x = left + _inches(sup.x) * sx
        dr.add(
            Polygon(
                [x, y0, x - 4.5, y0 - 7, x + 4.5, y0 - 7], fillColor=None, strokeColor=INK, strokeWidth=0.7
            )
        )
    weld = c.kind == "fillet_weld"
    if c.continuous:  # continuous weld or glue: the whole length
        dash = [3, 1.5] if c.kind == "glue" else None
        dr.add(
            Line(
                left,
                y0 + h / 2,
                left + L * sx,
                y0 + h / 2,
                strokeColor=ROW_INK,
                strokeWidth=2.4,
                strokeDashArray=dash,
            )
        )
    # rows where the solver's callout puts them (``rows_at``; staggered: ``offset_at`` midway
    # between, dashed when they are the far face's, solid when the whole line is offset)
    seg = _inches(c.segment) * sx if weld and c.segment is not None else 0.0
    near = () if whole else c.rows_at
    far = c.offset_at if c.staggered else ()
    for x in near:
        px = left + x * sx
        if seg:
            x0, x1 = max(left, px - seg / 2), min(left + L * sx, px + seg / 2)
            dr.add(Rect(x0, y0 + h / 2 - 2, max(x1 - x0, 0.8), 4, fillColor=ROW_INK, strokeColor=None))
        else:
            dr.add(Line(px, y0 + 3, px, y0 + h - 3, strokeColor=ROW_INK, strokeWidth=0.45))
    for x in far:
        px = left + x * sx
        dr.add(
            Line(
                px,
                y0 + 3,
                px,
                y0 + h - 3,
                strokeColor=ROW_INK,
                strokeWidth=0.45,
                strokeDashArray=None if whole else [1.6, 1.2],
            )
        )
    for i, z in enumerate(zones):
        a = _inches(z.start)
        if i:
            dr.add(Line(left + a * sx, y0 - 2, left + a * sx, y0 + h + 10, strokeColor=INK, strokeWidth=0.5))
    # spacing and count per zone, above
    base = y0 + h + 10
    for (cx, _w, a, b, text), row in zip(labels, rows_up):
        ty = base + row * (SIZE + 4)
        dr.add(Line(a, base - 2, b, base - 2, strokeColor=INK, strokeWidth=0.4))
        if row:
            dr.add(Line(cx, base - 2, cx, ty - 1, strokeColor=INK, strokeWidth=0.3))
        dr.add(String(cx, ty, text, fontName=font, fontSize=SIZE, textAnchor="middle"))
    # running dimensions from the left end, below, read from the left edge of the sheet
    ty = y0 - 12
    xs_pt = [left + x * sx for x in bounds]
    placed: list[float] = []
    for x in xs_pt:  # texts at least one text height apart, moved right when they crowd
        placed.append(max(x, placed[-1] + SIZE + 2) if placed else x)
    over = placed[-1] - (left + L * sx) if placed else 0.0
    if over > 0:
        placed = [p - over * (i / max(1, len(placed) - 1)) for i, p in enumerate(placed)]
    for x, px, text in zip(xs_pt, placed, texts):
        dr.add(Line(x, y0 - 1, x, ty + 2, strokeColor=INK, strokeWidth=0.35))
        dr.add(Line(x, ty + 2, px, ty - 1, strokeColor=INK, strokeWidth=0.35))
        g = Group(String(0, 0, text, fontName=font, fontSize=SIZE, textAnchor="end"))
        g.transform = (0, 1, -1, 0, px + SIZE / 2 - 1, ty - 2)
        dr.add(g)
    dr.add(String(left - 4, y0 + h / 2 - 2.5, "0", fontName=bold, fontSize=SIZE, textAnchor="end"))
    legend = "spacing  ·  pieces per zone" if zones else ("continuous, full length" if c.continuous else "")
    if zones and c.staggered and c.offset_at:
        legend += (
            f"  ·  staggered: rows midway between those of {c.stagger_with}"
            if midway_of
            else "  ·  staggered as stated: rows midway between this line's own"
            if whole
            else "  ·  staggered: dashed rows (far face) midway between"
        )
    dr.add(String(left, height - SIZE - 1, legend, fontName=font, fontSize=SIZE, fillColor=INK))
    return dr


def qr_payload(number: str, revision: str, sheet: int | str, member: str, sha256: str) -> str:
    """The QR code's text: the report's sheet reference and the job file's SHA-256."""
    return (
        f"calcreport fabrication sheet\njob {number or '-'}\nrevision {revision or '-'}\n"
        f"sheet {sheet}\nmember {member}\njob file SHA-256 {sha256}"
    )


class ShopQR(Flowable):
    """The QR code and the same text under it. The sheet is the report's: ``sheet`` when given (the
    separate fabrication PDF), else the page this is drawn on (recorded in ``record``)."""

    def __init__(
        self,
        number: str,
        revision: str,
        member: str,
        sha256: str,
        font: str,
        sheet: int | None = None,
        record: dict[str, int] | None = None,
        payloads: dict[str, str] | None = None,
    ):
        super().__init__()
        self.number, self.revision, self.member, self.sha256 = number, revision, member, sha256
        self.font, self.sheet, self.record, self.payloads = font, sheet, record, payloads
        self.width, self.height = QR_SIZE + 44, QR_SIZE + 9 * 7.6

    def wrap(self, aw, ah):
        return self.width, self.height

    def draw(self) -> None:
        sheet = self.sheet if self.sheet is not None else self.canv.getPageNumber()
        if self.record is not None:
            self.record[self.member] = sheet
        text = qr_payload(self.number, self.revision, sheet, self.member, self.sha256)
        if self.payloads is not None:
            self.payloads[self.member] = text
        draw_qr(self.canv, text, self.width - QR_SIZE, self.height - QR_SIZE, QR_SIZE, border=2, level="M")
        lines = text.split("\n")
        sha = lines.pop()  # the hash on two lines of 32 characters
        lines += [sha[: len("job file SHA-256 ")].strip(), sha[17:49], sha[49:]]
        y = self.height - QR_SIZE - 7
        self.canv.setFont(self.font, 6.5)
        for line in lines:
            self.canv.drawRightString(self.width, y, line)
            y -= 7.6
