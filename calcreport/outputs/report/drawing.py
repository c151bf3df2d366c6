"""The cross-section drawn to scale: parts by material, neutral axis, dimensions, shear planes.

Geometry comes from the placed parts (inches, section coordinates) and the solver's results
(neutral axis, depth, joint shear-plane segments). The drawing only scales and places them.
"""

from __future__ import annotations

import math

from reportlab.graphics.shapes import Circle, Drawing, Group, Line, Polygon, Rect, String
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from shapely.geometry import LineString, Point
from shapely.geometry import Polygon as SPolygon

from ...solve.results import MemberResult
from ...units import Q_
from .common import Ctx
from .styles import plain

__all__ = ["section_drawing", "FAMILY_STYLE", "nice_ratio"]

#: family → (fill, hatch colour, hatch kind, hatch spacing in points)
FAMILY_STYLE = {
    "wood": ("#f4e7c9", "#a07a3e", "diag", 6.0),
    "glulam": ("#f2e0bb", "#a07a3e", "horiz", 4.0),
    "plywood": ("#e9d7ae", "#8d6a33", "cross", 4.5),
    "steel": ("#d3dbe3", "#3e4f60", "diag", 2.6),
    "aluminum": ("#e4eaee", "#6b7c88", "back", 3.0),
    "concrete": ("#e2e2e2", "#6e6e6e", "dots", 5.0),
    "other": ("#eeeeee", "#888888", "none", 0.0),
}
PLANE = colors.HexColor("#b3261e")
NICE = (
    1,
    1.5,
    2,
    2.5,
    3,
    4,
    5,
    6,
    8,
    10,
    12,
    15,
    16,
    20,
    24,
    25,
    30,
    40,
    48,
    50,
    60,
    75,
    80,
    96,
    100,
    120,
    150,
    200,
    250,
    300,
    400,
    500,
)
MAX_H = 300.0
LEFT, RIGHT, BOTTOM, TOP = 78.0, 118.0, 62.0, 16.0


def nice_ratio(needed: float) -> float:
    """Smallest ratio from our list (1:1, 1:1.5, 1:2 …) not finer than ``needed``."""
    for r in NICE:
        if r >= needed - 1e-9:
            return r
    return math.ceil(needed / 100) * 100


def _hatch(poly: SPolygon, kind: str, spacing: float, colour: str) -> list:
    """Hatch line segments (drawing coordinates) clipped to ``poly``."""
    if kind == "none" or spacing <= 0 or poly.is_empty:
        return []
    x0, y0, x1, y1 = poly.bounds
    out = []
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


def _ticks(x0, y0, x1, y1, col) -> list:
    """Oblique tick marks at both ends of a dimension line."""
    return [
        Line(x - 2.5, y - 2.5, x + 2.5, y + 2.5, strokeColor=col, strokeWidth=0.7)
        for x, y in ((x0, y0), (x1, y1))
    ]


def _pack(
    wanted: list[float], lo: float, hi: float, gap: float = 9.0, fixed: tuple[float, ...] = ()
) -> list[float]:
    """Spread label heights so that no two are closer than ``gap`` (and avoid ``fixed`` ones)."""
    order = sorted(range(len(wanted)), key=lambda i: wanted[i])
    placed: dict[int, float] = {}
    last = lo - gap
    for i in order:
        y = max(wanted[i], last + gap)
        while any(abs(y - f) < gap for f in fixed):
            y += 2.0
        placed[i] = y
        last = y
    over = max(placed.values(), default=lo) - hi
    if over > 0:
        for i in placed:
            placed[i] = max(lo, placed[i] - over)
    return [placed[i] for i in range(len(wanted))]


def _label_fits(part, k: float, font: str) -> bool:
    """Whether the part's id fits inside its outline at scale ``k`` (else it is labelled outside)."""
    x0, y0, x1, y1 = part.shape.bbox
    tw = stringWidth(plain(part.id)[:24], font, 6.5)
    return (x1 - x0) * k > tw + 6 and (y1 - y0) * k > 10


def section_drawing(m: MemberResult, ctx: Ctx) -> tuple[Drawing, str]:
    """The section to scale and a caption that states the scale."""
    st, d = ctx.styles, ctx.display
    font, bold = st.fonts.regular, st.fonts.bold
    parts = m.member.parts
    xmin = min(p.shape.bbox[0] for p in parts)
    xmax = max(p.shape.bbox[2] for p in parts)
    ymin = min(p.shape.bbox[1] for p in parts)
    ymax = max(p.shape.bbox[3] for p in parts)
    sw, sh = max(xmax - xmin, 1e-6), max(ymax - ymin, 1e-6)
    avail_w = ctx.width - LEFT - RIGHT
    avail_h = MAX_H - BOTTOM - TOP
    fit = min(avail_w / sw, avail_h / sh)  # points per inch of section
    ratio = nice_ratio(72.0 / fit)
    k = 72.0 / ratio
    # labels outside the section need room: grow the drawing (scale unchanged), then tighten the gap
    mid = (xmin + xmax) / 2
    out_parts = [p for p in parts if not _label_fits(p, k, bold)]
    n_left = sum(1 for p in out_parts if (p.shape.bbox[0] + p.shape.bbox[2]) / 2 <= mid)
    outside = max(n_left, len(out_parts) - n_left + len(m.joints))
    height = sh * k + BOTTOM + TOP
    need = outside * 10.0 + BOTTOM + TOP
    cap = max(height, ctx.frame_height - 40)
    lift = 0.0
    if need > height:
        new_h = min(need, cap)
        lift = (new_h - height) / 2
        height = new_h
    gap = max(5.5, min(10.0, (height - TOP - 10) / max(outside, 1)))
    dr = Drawing(ctx.width, height)
    ox = LEFT + (avail_w - sw * k) / 2 - xmin * k
    oy = BOTTOM + lift - ymin * k

    def P(x: float, y: float) -> tuple[float, float]:
        return ox + x * k, oy + y * k

    families = []
    labels_left: list[tuple[str, float, float]] = []
    labels_right: list[tuple[str, float, float]] = []
    for p in parts:
        fam = p.material.family if p.material.family in FAMILY_STYLE else "other"
        if fam not in families:
            families.append(fam)
        fill, hcol, kind, spacing = FAMILY_STYLE[fam]
        s = p.shape
        if s.kind == "polygon":
            pts = [P(x, y) for x, y in s.vertices]
        elif s.kind == "circle":
            cx, cy = P(*s.centre)
            pts = [
                (
                    cx + s.radius * k * math.cos(a * math.pi / 32),
                    cy + s.radius * k * math.sin(a * math.pi / 32),
                )
                for a in range(64)
            ]
        else:
            x0, y0 = P(s.bbox[0], s.bbox[1])
            x1, y1 = P(s.bbox[2], s.bbox[3])
            pts = [(x0, y0), (x1, y0), (x1, y1), (x0, y1)]
        flat = [c for xy in pts for c in xy]
        dash = [3, 2] if s.kind == "properties" else None
        dr.add(Polygon(flat, fillColor=colors.HexColor(fill), strokeColor=None))
        spoly = SPolygon(pts).buffer(0)
        for h in _hatch(spoly, kind, spacing, hcol):
            dr.add(h)
        dr.add(Polygon(flat, fillColor=None, strokeColor=colors.black, strokeWidth=0.8, strokeDashArray=dash))
        rp = spoly.representative_point()
        bx0, by0, bx1, by1 = spoly.bounds
        text = plain(p.id)[:24]
        tw = stringWidth(text, bold, 6.5)
        if bx1 - bx0 > tw + 6 and by1 - by0 > 10:
            dr.add(
                Rect(
                    rp.x - tw / 2 - 1.5,
                    rp.y - 2.5,
                    tw + 3,
                    8.5,
                    fillColor=colors.white,
                    strokeColor=None,
                    fillOpacity=0.85,
                )
            )
            dr.add(String(rp.x, rp.y, text, fontName=bold, fontSize=6.5, textAnchor="middle"))
        elif rp.x <= ox + (xmin + xmax) / 2 * k:
            labels_left.append((text, rp.x, rp.y))
        else:
            labels_right.append((text, rp.x, rp.y))

    # neutral axis (dash-dot) with its label
    ybar = float((m.section.bottom + m.section.centroid).to("inch").magnitude)
    _, ny = P(0, ybar)
    lx0, lx1 = P(xmin, 0)[0] - 14, P(xmax, 0)[0] + 9
    dr.add(
        Line(
            lx0,
            ny,
            lx1,
            ny,
            strokeColor=colors.HexColor("#1f3a93"),
            strokeWidth=0.8,
            strokeDashArray=[7, 2, 1.2, 2],
        )
    )
    na_text = f"N.A.  ȳ = {d.quantity(m.section.centroid)}"
    dr.add(
        String(
            lx0 - 2,
            ny + 2,
            na_text,
            fontName=font,
            fontSize=6.5,
            textAnchor="end",
            fillColor=colors.HexColor("#1f3a93"),
        )
    )

    # part labels that did not fit inside their part: left column with leaders
    if labels_left:
        ys = _pack([y for _, _, y in labels_left], 26, height - 6, gap=gap, fixed=(ny + 4,))
        col_x = lx0 - 6
        for (text, px, py), y in zip(labels_left, ys):
            dr.add(Line(col_x + 1, y + 2, px, py, strokeColor=colors.HexColor("#555555"), strokeWidth=0.4))
            dr.add(Circle(px, py, 0.9, fillColor=colors.black, strokeColor=None))
            dr.add(String(col_x, y, text, fontName=bold, fontSize=min(6.5, gap - 1), textAnchor="end"))

    # overall depth (right) and width (below)
    bx, by_top = P(xmax, ymax)
    _, by_bot = P(xmax, ymin)
    dim_x = bx + 14
    dim = colors.HexColor("#333333")
    for y in (by_bot, by_top):
        dr.add(Line(bx + 3, y, dim_x + 4, y, strokeColor=dim, strokeWidth=0.4))
    dr.add(Line(dim_x, by_bot, dim_x, by_top, strokeColor=dim, strokeWidth=0.6))
    for t in _ticks(dim_x, by_bot, dim_x, by_top, dim):
        dr.add(t)
    wx0, wy = P(xmin, ymin)
    wx1, _ = P(xmax, ymin)
    dim_y = wy - 14
    for x in (wx0, wx1):
        dr.add(Line(x, wy - 3, x, dim_y - 4, strokeColor=dim, strokeWidth=0.4))
    dr.add(Line(wx0, dim_y, wx1, dim_y, strokeColor=dim, strokeWidth=0.6))
    for t in _ticks(wx0, dim_y, wx1, dim_y, dim):
        dr.add(t)
    dr.add(
        String(
            (wx0 + wx1) / 2,
            dim_y - 9,
            d.quantity(Q_(xmax - xmin, "inch")),
            fontName=font,
            fontSize=6.8,
            textAnchor="middle",
        )
    )

    # shear planes with connector symbols, joint ids in a right column
    wanted, anchors, ys = [], [], []
    for j in m.joints:
        cont = j.continuous
        # the row's n connectors shared out over the joint's plane segments, one symbol each
        share = [
            j.per_row // max(1, len(j.plane)) + (1 if k < j.per_row % max(1, len(j.plane)) else 0)
            for k in range(len(j.plane))
        ]
        for k_seg, (a, b) in enumerate(j.plane):
            (x0, y0), (x1, y1) = P(*a), P(*b)
            dr.add(Line(x0, y0, x1, y1, strokeColor=PLANE, strokeWidth=2.0))
            length = math.hypot(x1 - x0, y1 - y0)
            if length <= 0:
                continue
            ux, uy = (x1 - x0) / length, (y1 - y0) / length
            if cont:
                n = max(2, int(length / 3))
                for i in range(n + 1):
                    cx, cy = x0 + (x1 - x0) * i / n, y0 + (y1 - y0) * i / n
                    dr.add(
                        Line(
                            cx - uy * 2.2,
                            cy + ux * 2.2,
                            cx + uy * 2.2,
                            cy - ux * 2.2,
                            strokeColor=PLANE,
                            strokeWidth=0.5,
                        )
                    )
            else:
                n = share[k_seg]
                for i in range(n):
                    t = (i + 0.5) / n
                    dr.add(
                        Circle(
                            x0 + (x1 - x0) * t,
                            y0 + (y1 - y0) * t,
                            2.0,
                            fillColor=colors.white,
                            strokeColor=PLANE,
                            strokeWidth=0.8,
                        )
                    )
        if j.plane:
            (a, b) = j.plane[0]
            (x0, y0), (x1, y1) = P(*a), P(*b)
            anchors.append(((x0 + x1) / 2, (y0 + y1) / 2, plain(j.id)[:28], True))
            wanted.append((y0 + y1) / 2)
    for text, px, py in labels_right:
        anchors.append((px, py, text, False))
        wanted.append(py)
    if anchors:
        ys = _pack(wanted, 26, height - 6, gap=gap)
        col_x = dim_x + 16
        for (ax, ay, text, is_joint), y in zip(anchors, ys):
            col = PLANE if is_joint else colors.black
            dr.add(
                Line(
                    ax,
                    ay,
                    col_x - 2,
                    y + 2,
                    strokeColor=PLANE if is_joint else colors.HexColor("#555555"),
                    strokeWidth=0.4,
                )
            )
            if not is_joint:
                dr.add(Circle(ax, ay, 0.9, fillColor=colors.black, strokeColor=None))
            dr.add(String(col_x, y, text, fontName=bold, fontSize=min(6.5, gap - 1), fillColor=col))

    # depth text: where no leader or the neutral axis crosses the dimension line
    depth_text = d.quantity(m.section.depth)
    half = stringWidth(depth_text, font, 6.8) / 2 + 3
    busy = [ny] + [ay for ax, ay, _, _ in anchors] + list(ys if anchors else [])
    best_y, best_gap = (by_bot + by_top) / 2, -1.0
    for f in (0.5, 0.35, 0.65, 0.2, 0.8):
        yc = by_bot + (by_top - by_bot) * f
        gap = min((abs(yc - b) for b in busy), default=1e9) - half
        if gap > best_gap + 1e-9:
            best_y, best_gap = yc, gap
        if gap >= 4:
            best_y = yc
            break
    g = Group(String(0, 0, depth_text, fontName=font, fontSize=6.8, textAnchor="middle"))
    g.transform = (0, 1, -1, 0, dim_x - 3, best_y)
    dr.add(g)

    # legend and scale bar along the bottom
    x = 4.0
    y = 8.0
    for fam in families:
        fill, hcol, kind, spacing = FAMILY_STYLE[fam]
        sq = SPolygon([(x, y), (x + 12, y), (x + 12, y + 8), (x, y + 8)])
        dr.add(Rect(x, y, 12, 8, fillColor=colors.HexColor(fill), strokeColor=None))
        for h in _hatch(sq, kind, spacing, hcol):
            dr.add(h)
        dr.add(Rect(x, y, 12, 8, fillColor=None, strokeColor=colors.black, strokeWidth=0.5))
        dr.add(String(x + 15, y + 1.5, fam, fontName=font, fontSize=6.5))
        x += 20 + stringWidth(fam, font, 6.5) + 8
    dr.add(
        Line(
            x,
            y + 4,
            x + 16,
            y + 4,
            strokeColor=colors.HexColor("#1f3a93"),
            strokeWidth=0.8,
            strokeDashArray=[7, 2, 1.2, 2],
        )
    )
    dr.add(String(x + 19, y + 1.5, "neutral axis", fontName=font, fontSize=6.5))
    x += 70
    dr.add(Line(x, y + 4, x + 16, y + 4, strokeColor=PLANE, strokeWidth=2.0))
    dr.add(Circle(x + 8, y + 4, 2.0, fillColor=colors.white, strokeColor=PLANE, strokeWidth=0.8))
    dr.add(String(x + 19, y + 1.5, "shear plane, connector", fontName=font, fontSize=6.5))
    x += 100
    _scale_bar(dr, ctx, x, y, k, font)
    caption = (
        f"Section of {m.id} to scale 1:{ratio:g} when printed at 100 %. Parts are tinted by material family."
    )
    if any(p.shape.kind == "properties" for p in parts):
        caption += " Dashed outlines are parts given by their properties (only the bounding box is known)."
    return dr, caption


def _scale_bar(dr: Drawing, ctx: Ctx, x: float, y: float, k: float, font: str) -> None:
    """A scale bar of a round length in display units, about 60 points long."""
    target_in = 60.0 / k
    mag, unit, _ = ctx.display.convert(Q_(target_in, "inch"))
    if mag <= 0:
        return
    e = 10 ** math.floor(math.log10(mag))
    nice = max(v * e for v in (1, 2, 5) if v * e <= mag + 1e-12)
    length = 60.0 * nice / mag
    half = length / 2
    dr.add(Rect(x, y + 2, half, 4, fillColor=colors.black, strokeColor=colors.black, strokeWidth=0.5))
    dr.add(Rect(x + half, y + 2, half, 4, fillColor=colors.white, strokeColor=colors.black, strokeWidth=0.5))
    dr.add(String(x + length + 4, y + 1.5, f"{nice:g} {unit}", fontName=font, fontSize=6.5))
