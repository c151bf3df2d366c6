"""Drafting pieces of the section detail: hatching, dimension lines and strings, label packing,
the drawing scale and the scale bar. Geometry in points; nothing here knows the engineering."""

from __future__ import annotations

import math
from collections.abc import Sequence

from reportlab.graphics.shapes import Circle, Drawing, Group, Line, Rect, String
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from shapely.geometry import LineString, Point
from shapely.geometry import Polygon as SPolygon

from ...units import Q_

__all__ = [
    "DIM",
    "DIM_SIZE",
    "hatch",
    "ticks",
    "pack",
    "pack_blocks",
    "standard_scale",
    "scale_words",
    "chain_h",
    "chain_v",
    "scale_bar",
]

DIM = colors.HexColor("#333333")
DIM_SIZE = 7.0  # dimension text, points (legible at 100 %)

#: standard drawing scales (ratio, words) — US: architect's scales (in = 1 ft); SI: ISO 5455
US_SCALES = (
    (1, "full size"),
    (2, "6 in = 1 ft"),
    (4, "3 in = 1 ft"),
    (8, "1-1/2 in = 1 ft"),
    (12, "1 in = 1 ft"),
    (16, "3/4 in = 1 ft"),
    (24, "1/2 in = 1 ft"),
    (32, "3/8 in = 1 ft"),
    (48, "1/4 in = 1 ft"),
    (96, "1/8 in = 1 ft"),
)
SI_SCALES = tuple((r, "") for r in (1, 2, 5, 10, 20, 25, 50, 100, 200))


def standard_scale(needed: float, system: str = "US") -> tuple[float, str]:
    """The finest standard scale (ratio, words) not finer than ``needed`` (common practice, no
    source: architect's scales in US drawings, ISO 5455 ratios in SI)."""
    for r, words in US_SCALES if system == "US" else SI_SCALES:
        if r >= needed - 1e-9:
            return float(r), words
    r = math.ceil(needed / 100) * 100
    return float(r), ""


def scale_words(ratio: float, words: str) -> str:
    """``scale 1:8 (1-1/2 in = 1 ft)``."""
    return f"scale 1:{ratio:g}" + (f" ({words})" if words else "")


def hatch(poly: SPolygon, kind: str, spacing: float, colour: str) -> list:
    """Hatch line segments (drawing coordinates) clipped to ``poly``."""
    if kind == "none" or spacing <= 0 or poly.is_empty:
        return []
    x0, y0, x1, y1 = poly.bounds
    out: list = []
    col = colors.HexColor(colour)
    if kind == "dots":
        y = y0 + spacing / 2
        row = 0
        while y < y1:
            x = x0 + (spacing / 2 if row % 2 else spacing)
            while x < x1:
                if poly.contains(Point(x, y)):
                    out.append(Circle(x, y, 0.45, fillColor=col, strokeColor=None))
                x += spacing
            y += spacing
            row += 1
        return out
    dirs = {"diag": [(1, 1)], "back": [(1, -1)], "cross": [(1, 1), (1, -1)], "horiz": [(1, 0)]}[kind]
    span = (x1 - x0) + (y1 - y0)
    for _dx, dy in dirs:
        n = int(span / spacing) + 2
        for i in range(n):
            if dy == 0:
                yy = y0 + (i + 0.5) * spacing
                if yy >= y1:
                    break
                line = LineString([(x0 - 1, yy), (x1 + 1, yy)])
            else:
                c = (y0 - x1 if dy > 0 else y0 + x0) + i * spacing * math.sqrt(2)
                line = (
                    LineString([(x0 - 1, x0 - 1 + c), (x1 + 1, x1 + 1 + c)])
                    if dy > 0
                    else LineString([(x0 - 1, c - x0 + 1), (x1 + 1, c - x1 - 1)])
                )
            piece = poly.intersection(line)
            for seg in getattr(piece, "geoms", [piece]):
                if seg.is_empty or seg.geom_type != "LineString":
                    continue
                (ax, ay), (bx, by) = seg.coords[0], seg.coords[-1]
                out.append(Line(ax, ay, bx, by, strokeColor=col, strokeWidth=0.35))
    return out


def ticks(x0: float, y0: float, x1: float, y1: float, col=DIM) -> list:
    """Oblique tick marks at both ends of a dimension line."""
    return [
        Line(x - 2.5, y - 2.5, x + 2.5, y + 2.5, strokeColor=col, strokeWidth=0.7)
        for x, y in ((x0, y0), (x1, y1))
    ]


def pack(
    wanted: list[float], lo: float, hi: float, gap: float = 9.0, fixed: tuple[float, ...] = ()
) -> list[float]:
    """Spread label positions so that no two are closer than ``gap`` (and avoid ``fixed`` ones)."""
    return pack_blocks(wanted, [gap] * len(wanted), lo, hi, fixed)


def pack_blocks(
    wanted: list[float], sizes: Sequence[float], lo: float, hi: float, fixed: tuple[float, ...] = ()
) -> list[float]:
    """Positions near ``wanted`` for blocks of extent ``sizes`` upward from each position, none
    overlapping, kept within ``lo``–``hi`` where they fit (avoiding ``fixed`` positions)."""
    order = sorted(range(len(wanted)), key=lambda i: wanted[i])
    placed: dict[int, float] = {}
    top = lo
    for i in order:
        y = max(wanted[i], top)
        guard = 0
        while any(abs(y - f) < 4.0 for f in fixed) and guard < 20:
            y += 2.0
            guard += 1
        placed[i] = y
        top = y + sizes[i]
    over = top - hi
    if over > 0:
        room = lo
        for i in order:  # push down as far as needed, no lower than lo, order kept
            placed[i] = max(room, placed[i] - over)
            room = placed[i] + sizes[i]
    return [placed[i] for i in range(len(wanted))]


def _dim_line(dr: Drawing, a: tuple[float, float], b: tuple[float, float]) -> None:
    dr.add(Line(a[0], a[1], b[0], b[1], strokeColor=DIM, strokeWidth=0.6))
    for t in ticks(a[0], a[1], b[0], b[1]):
        dr.add(t)


def chain_h(
    dr: Drawing, xs: Sequence[float], texts: Sequence[str], y: float, y_ext: float, font: str
) -> float:
    """A horizontal dimension string at height ``y`` over the breakpoints ``xs`` (points), each
    segment's ``texts`` above its line, or on a row below when it does not fit; extension lines
    from ``y_ext``. Returns the lowest y used."""
    for x in xs:
        dr.add(Line(x, y_ext, x, y - 3, strokeColor=DIM, strokeWidth=0.35))
    _dim_line(dr, (xs[0], y), (xs[-1], y))
    for x in xs[1:-1]:
        for t in ticks(x, y, x, y):
            dr.add(t)
    low: list[tuple[float, str, float]] = []
    for (a, b), text in zip(zip(xs, xs[1:]), texts):
        w = stringWidth(text, font, DIM_SIZE)
        if w + 3 <= b - a:
            dr.add(String((a + b) / 2, y + 2, text, fontName=font, fontSize=DIM_SIZE, textAnchor="middle"))
        else:
            low.append(((a + b) / 2, text, w))
    if not low:
        return y
    yl = y - 10
    xs_low = pack_blocks([c - w / 2 for c, _, w in low], [w + 6 for *_, w in low], -1e9, 1e9)
    for (c, text, w), x in zip(low, xs_low):
        dr.add(Line(c, y, x + w / 2, yl + 7, strokeColor=DIM, strokeWidth=0.3))
        dr.add(String(x, yl, text, fontName=font, fontSize=DIM_SIZE))
    return yl


def chain_v(
    dr: Drawing,
    ys: Sequence[float],
    texts: Sequence[str],
    x: float,
    x_ext: float,
    font: str,
    avoid: Sequence[float] = (),
) -> float:
    """A vertical dimension string at ``x`` over the breakpoints ``ys``; texts along the line
    (rotated) where they fit — moved along their segment off any height in ``avoid`` (a line
    crossing the string) — else set level to the left of the line; extension lines from
    ``x_ext``. Returns the leftmost x its texts reach."""
    for y in ys:
        dr.add(Line(x_ext, y, x - 3, y, strokeColor=DIM, strokeWidth=0.35))
    _dim_line(dr, (x, ys[0]), (x, ys[-1]))
    for y in ys[1:-1]:
        for t in ticks(x, y, x, y):
            dr.add(t)
    level: list[tuple[float, str]] = []
    for (a, b), text in zip(zip(ys, ys[1:]), texts):
        w = stringWidth(text, font, DIM_SIZE)
        if w + 3 <= abs(b - a):
            lo, hi = min(a, b) + w / 2 + 1.5, max(a, b) - w / 2 - 1.5
            yc = (a + b) / 2
            for f in avoid:
                if abs(yc - f) < w / 2 + 2:  # slide to the roomier side of the crossing line
                    yc = min(hi, f + w / 2 + 2.5) if hi - f >= f - lo else max(lo, f - w / 2 - 2.5)
            g = Group(String(0, 0, text, fontName=font, fontSize=DIM_SIZE, textAnchor="middle"))
            g.transform = (0, 1, -1, 0, x - 2, yc)
            dr.add(g)
        else:
            level.append(((a + b) / 2, text))
    leftmost = x - DIM_SIZE - 2
    if level:
        placed = pack([c - 2.5 for c, _ in level], -1e9, 1e9, gap=DIM_SIZE + 1.5)
        for (_c, text), y in zip(level, placed):
            dr.add(String(x - 4, y, text, fontName=font, fontSize=DIM_SIZE, textAnchor="end"))
            leftmost = min(leftmost, x - 4 - stringWidth(text, font, DIM_SIZE))
    return leftmost


def scale_bar(dr: Drawing, display, x: float, y: float, k: float, font: str) -> None:
    """A scale bar of a round length in display units, about 60 points long."""
    target_in = 60.0 / k
    mag, unit, _ = display.convert(Q_(target_in, "inch"))
    if mag <= 0:
        return
    e = 10 ** math.floor(math.log10(mag))
    nice = max(v * e for v in (1, 2, 5) if v * e <= mag + 1e-12)
    length = 60.0 * nice / mag
    half = length / 2
    dr.add(Rect(x, y + 2, half, 4, fillColor=colors.black, strokeColor=colors.black, strokeWidth=0.5))
    dr.add(Rect(x + half, y + 2, half, 4, fillColor=colors.white, strokeColor=colors.black, strokeWidth=0.5))
    dr.add(String(x + length + 4, y + 1.5, f"{nice:g} {unit}", fontName=font, fontSize=6.5))
