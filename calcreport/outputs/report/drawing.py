"""The section detail: parts by material at a standard scale, every part dimensioned (dimension
strings across and up the section, each part's width × depth), the neutral axis located from the
bottom, and each joint called out with its connector (:mod:`.drawing_detail`).

Geometry comes from the placed parts (inches, section coordinates) and the solver's results
(neutral axis, depth, part properties, joint planes and callouts). The drawing only scales and
places them; drafting pieces are in :mod:`.drawing_dims`.
"""

from __future__ import annotations

import math

from reportlab.graphics.shapes import Circle, Drawing, Group, Line, Polygon, Rect, String
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from shapely.geometry import Polygon as SPolygon

from ...solve.results import MemberResult
from ..callouts import dim_text
from .common import Ctx
from .drawing_detail import PLANE, TEXT_SIZE, callout_block, draw_callout, draw_joint
from .drawing_dims import (
    DIM,
    DIM_SIZE,
    chain_h,
    chain_v,
    hatch,
    pack_blocks,
    scale_bar,
    scale_words,
    standard_scale,
)
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
NA_INK = colors.HexColor("#1f3a93")
NICE = (1, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10, 12, 15, 16, 20, 24, 25, 30, 40, 48, 50, 60, 75, 80, 96, 100)
MAX_H = 280.0
LEFT, GAP_R, COL_W, BOTTOM, TOP = 96.0, 30.0, 176.0, 74.0, 16.0
LINE = TEXT_SIZE + 1.6


def nice_ratio(needed: float) -> float:
    """Smallest ratio from our list (1:1, 1:1.5, 1:2 …) not finer than ``needed``."""
    for r in NICE:
        if r >= needed - 1e-9:
            return r
    return math.ceil(needed / 100) * 100


def _outline(p, P) -> list[tuple[float, float]]:
    s = p.shape
    if s.kind == "polygon":
        return [P(x, y) for x, y in s.vertices]
    if s.kind == "circle":
        cx, cy = P(*s.centre)
        r = s.radius
        return (
            [
                P(s.centre[0] + r * math.cos(a * math.pi / 32), s.centre[1] + r * math.sin(a * math.pi / 32))
                for a in range(64)
            ]
            if r
            else [(cx, cy)]
        )
    x0, y0 = P(s.bbox[0], s.bbox[1])
    x1, y1 = P(s.bbox[2], s.bbox[3])
    return [(x0, y0), (x1, y0), (x1, y1), (x0, y1)]


def _breaks(values: list[float]) -> list[float]:
    """Distinct breakpoints (inches), closer than 1/64 in merged."""
    out: list[float] = []
    for v in sorted(values):
        if not out or v - out[-1] > 1 / 64:
            out.append(v)
    return out


def section_drawing(m: MemberResult, ctx: Ctx) -> tuple[Drawing, str]:
    """The section detail and a caption that states the scale and the units of its dimensions."""
    st, d = ctx.styles, ctx.display
    font, bold = st.fonts.regular, st.fonts.bold
    system = d.system
    parts = m.member.parts
    props = {pp.id: pp for pp in m.section.parts}
    xmin = min(p.shape.bbox[0] for p in parts)
    xmax = max(p.shape.bbox[2] for p in parts)
    ymin = min(p.shape.bbox[1] for p in parts)
    ymax = max(p.shape.bbox[3] for p in parts)
    sw, sh = max(xmax - xmin, 1e-6), max(ymax - ymin, 1e-6)
    avail_w = ctx.width - LEFT - GAP_R - COL_W
    avail_h = MAX_H - BOTTOM - TOP
    fit = min(avail_w / sw, avail_h / sh)  # points per inch of section
    ratio, words = standard_scale(72.0 / fit, system)
    k = 72.0 / ratio

    def size_text(pid: str) -> str:
        pp = props.get(pid)
        if pp is None:
            return ""
        return f"{dim_text(pp.width.to('inch').magnitude, system)} × {dim_text(pp.depth.to('inch').magnitude, system)}"

    # callout blocks (joints first, then parts labelled outside), their heights decide the height
    blocks: list[tuple[str, object, list[str], float]] = []
    for j in m.joints:
        lines, h = callout_block(j, font, bold, COL_W - 4, system)
        blocks.append(("joint", j, lines, h))
    inside = {}
    for p in parts:
        x0, y0, x1, y1 = p.shape.bbox
        label = [plain(p.id)[:24], size_text(p.id)]
        wide = max(stringWidth(t, bold, 6.5) for t in label)
        fits = (x1 - x0) * k > wide + 6 and (y1 - y0) * k > 2 * 8.5 + 4
        inside[p.id] = fits
        if not fits:
            blocks.append(("part", p, label, 2 * LINE + 3))
    need = sum(b[3] for b in blocks) + BOTTOM + TOP
    height = sh * k + BOTTOM + TOP
    lift = 0.0
    if need > height:
        new_h = min(need, max(height, ctx.frame_height - 40))
        lift = (new_h - height) / 2
        height = new_h
    dr = Drawing(ctx.width, height)
    ox = LEFT + (avail_w - sw * k) / 2 - xmin * k
    oy = BOTTOM + lift - ymin * k

    def P(x: float, y: float) -> tuple[float, float]:
        return ox + x * k, oy + y * k

    families: list[str] = []
    polys: list[SPolygon] = []
    boxes: dict[str, tuple] = {}
    anchors: dict[str, tuple[float, float]] = {}
    for p in parts:
        fam = p.material.family if p.material.family in FAMILY_STYLE else "other"
        if fam not in families:
            families.append(fam)
        fill, hcol, kind, spacing = FAMILY_STYLE[fam]
        pts = _outline(p, P)
        flat = [c for xy in pts for c in xy]
        dash = [3, 2] if p.shape.kind == "properties" else None
        dr.add(Polygon(flat, fillColor=colors.HexColor(fill), strokeColor=None))
        spoly = SPolygon(pts).buffer(0) if len(pts) >= 3 else SPolygon()
        polys.append(spoly)
        for h in hatch(spoly, kind, spacing, hcol):
            dr.add(h)
        dr.add(Polygon(flat, fillColor=None, strokeColor=colors.black, strokeWidth=0.8, strokeDashArray=dash))
        boxes[p.id] = (*P(p.shape.bbox[0], p.shape.bbox[1]), *P(p.shape.bbox[2], p.shape.bbox[3]))
        rp = spoly.representative_point() if not spoly.is_empty else None
        anchors[p.id] = (rp.x, rp.y) if rp is not None else P(*p.shape.centroid)
        if inside[p.id] and rp is not None:
            label = [plain(p.id)[:24], size_text(p.id)]
            tw = max(stringWidth(t, bold, 6.5) for t in label)
            dr.add(
                Rect(
                    rp.x - tw / 2 - 1.5,
                    rp.y - 10,
                    tw + 3,
                    18,
                    fillColor=colors.white,
                    strokeColor=None,
                    fillOpacity=0.85,
                )
            )
            dr.add(String(rp.x, rp.y + 1, label[0], fontName=bold, fontSize=6.5, textAnchor="middle"))
            dr.add(String(rp.x, rp.y - 7, label[1], fontName=font, fontSize=6.5, textAnchor="middle"))

    for j in m.joints:
        draw_joint(dr, j, P, k, polys, boxes)

    ybar = float((m.section.bottom + m.section.centroid).to("inch").magnitude)
    _, ny = P(0, ybar)
    bx0, by_bot = P(xmin, ymin)
    bx1, by_top = P(xmax, ymax)
    # dimension strings: across the bottom (every x breakpoint, then overall), up the left side
    xs_in = _breaks([v for p in parts for v in (p.shape.bbox[0], p.shape.bbox[2])])
    ys_in = _breaks([v for p in parts for v in (p.shape.bbox[1], p.shape.bbox[3])])
    xs = [P(x, 0)[0] for x in xs_in]
    ys = [P(0, y)[1] for y in ys_in]
    low = by_bot - 14
    left_used = bx0 - 14
    if len(xs) > 2:
        low = (
            chain_h(
                dr,
                xs,
                [dim_text(b - a, system) for a, b in zip(xs_in, xs_in[1:])],
                by_bot - 14,
                by_bot - 3,
                font,
            )
            - 14
        )
    chain_h(dr, [xs[0], xs[-1]], [dim_text(xmax - xmin, system)], low, by_bot - 3, font)
    if len(ys) > 2:
        left_used = chain_v(
            dr,
            ys,
            [dim_text(b - a, system) for a, b in zip(ys_in, ys_in[1:])],
            bx0 - 14,
            bx0 - 3,
            font,
            (ny,),
        )
    dim_x = bx1 + 14
    chain_v(dr, [by_bot, by_top], [dim_text(ymax - ymin, system)], dim_x, bx1 + 3, font, (ny,))

    # neutral axis (dash-dot), its label and its dimension from the bottom
    na_x = min(bx0 - 34, left_used - 12)
    dr.add(
        Line(na_x - 4, ny, bx1 + 9, ny, strokeColor=NA_INK, strokeWidth=0.8, strokeDashArray=[7, 2, 1.2, 2])
    )
    dr.add(
        String(na_x - 6, ny - 2.2, "N.A.", fontName=bold, fontSize=6.5, fillColor=NA_INK, textAnchor="end")
    )
    dr.add(Line(na_x - 3, by_bot, bx0 - 3, by_bot, strokeColor=DIM, strokeWidth=0.35))
    dr.add(Line(na_x, by_bot, na_x, ny, strokeColor=NA_INK, strokeWidth=0.6))
    for yy in (by_bot, ny):
        dr.add(Line(na_x - 2.5, yy - 2.5, na_x + 2.5, yy + 2.5, strokeColor=NA_INK, strokeWidth=0.7))
    na_text = f"ȳ = {dim_text(m.section.centroid.to('inch').magnitude, system)}"
    if stringWidth(na_text, font, DIM_SIZE) + 4 <= ny - by_bot:  # along the line
        g = Group(
            String(0, 0, na_text, fontName=font, fontSize=DIM_SIZE, textAnchor="middle", fillColor=NA_INK)
        )
        g.transform = (0, 1, -1, 0, na_x - 2, (by_bot + ny) / 2)
        dr.add(g)
    else:  # a short distance: level, left of the line and below the N.A. label
        dr.add(
            String(
                na_x - 4,
                min(ny - 11, by_bot),
                na_text,
                fontName=font,
                fontSize=DIM_SIZE,
                textAnchor="end",
                fillColor=NA_INK,
            )
        )

    # callout column on the right
    col_x = dim_x + GAP_R - 8
    wanted, sizes, targets = [], [], []
    for kind_b, obj, _lines, h in blocks:
        if kind_b == "joint":
            jj = obj
            if jj.plane:  # type: ignore[attr-defined]
                (a, b) = jj.plane[0]  # type: ignore[attr-defined]
                (x0, y0), (x1, y1) = P(*a), P(*b)
                anchor = ((x0 + x1) / 2, (y0 + y1) / 2)
            else:
                anchor = (bx1, (by_bot + by_top) / 2)
        else:
            anchor = anchors[obj.id]  # type: ignore[attr-defined]
        targets.append(anchor)
        wanted.append(anchor[1] - h / 2)
        sizes.append(h)
    placed = pack_blocks(wanted, sizes, BOTTOM - 40, height - 4)
    for (kind_b, obj, lines, _h), anchor, y in zip(blocks, targets, placed):
        if kind_b == "joint":
            draw_callout(dr, obj, anchor, col_x, y, lines, font, bold, system)  # type: ignore[arg-type]
        else:
            top = y + len(lines) * LINE
            dr.add(
                Line(
                    anchor[0],
                    anchor[1],
                    col_x - 2,
                    top - 4,
                    strokeColor=colors.HexColor("#555555"),
                    strokeWidth=0.4,
                )
            )
            dr.add(Circle(anchor[0], anchor[1], 0.9, fillColor=colors.black, strokeColor=None))
            dr.add(String(col_x, top - TEXT_SIZE, lines[0], fontName=bold, fontSize=TEXT_SIZE))
            dr.add(String(col_x, top - TEXT_SIZE - LINE, lines[1], fontName=font, fontSize=TEXT_SIZE))

    _legend(dr, ctx, families, k, font, m)
    units = "millimetres" if system == "SI" else "inches"
    caption = (
        f"Section of {m.id} to {scale_words(ratio, words)} at 100 %. Dimensions in {units}; parts "
        "tinted by material, labelled width × depth; ȳ from the bottom; joints called out with their connector."
    )
    if any(p.shape.kind == "properties" for p in parts):
        caption += " Dashed outlines are parts given by their properties (only the bounding box is known)."
    return dr, caption


def _legend(dr: Drawing, ctx: Ctx, families: list[str], k: float, font: str, m: MemberResult) -> None:
    """Material swatches, the line types used and the scale bar along the bottom."""
    x, y = 4.0, 6.0
    for fam in families:
        fill, hcol, kind, spacing = FAMILY_STYLE[fam]
        sq = SPolygon([(x, y), (x + 12, y), (x + 12, y + 8), (x, y + 8)])
        dr.add(Rect(x, y, 12, 8, fillColor=colors.HexColor(fill), strokeColor=None))
        for h in hatch(sq, kind, spacing, hcol):
            dr.add(h)
        dr.add(Rect(x, y, 12, 8, fillColor=None, strokeColor=colors.black, strokeWidth=0.5))
        dr.add(String(x + 15, y + 1.5, fam, fontName=font, fontSize=6.5))
        x += 20 + stringWidth(fam, font, 6.5) + 8
    dr.add(Line(x, y + 4, x + 16, y + 4, strokeColor=NA_INK, strokeWidth=0.8, strokeDashArray=[7, 2, 1.2, 2]))
    dr.add(String(x + 19, y + 1.5, "neutral axis", fontName=font, fontSize=6.5))
    x += 66
    kinds = {j.callout.kind for j in m.joints if j.callout is not None}
    conts = {
        j.callout.continuous for j in m.joints if j.callout is not None and j.callout.kind == "fillet_weld"
    }
    if "fillet_weld" in kinds:
        if True in conts:
            dr.add(
                Polygon(
                    [x, y, x + 7, y, x, y + 7],
                    fillColor=colors.black,
                    strokeColor=colors.black,
                    strokeWidth=0.5,
                )
            )
            dr.add(String(x + 10, y + 1.5, "continuous weld", fontName=font, fontSize=6.5))
            x += 70
        if False in conts:
            dr.add(
                Polygon(
                    [x, y, x + 7, y, x, y + 7],
                    fillColor=colors.white,
                    strokeColor=colors.black,
                    strokeWidth=0.7,
                )
            )
            dr.add(Line(x + 7, y, x, y + 3.5, strokeColor=colors.black, strokeWidth=0.5))
            dr.add(String(x + 10, y + 1.5, "intermittent weld", fontName=font, fontSize=6.5))
            x += 74
    if kinds - {"fillet_weld", "glue"}:
        dr.add(Line(x, y + 4, x + 14, y + 4, strokeColor=PLANE, strokeWidth=1.1))
        dr.add(Line(x, y + 1.5, x, y + 6.5, strokeColor=PLANE, strokeWidth=1.6))
        dr.add(String(x + 17, y + 1.5, "fastener, one per row", fontName=font, fontSize=6.5))
        x += 94
        if any(j.callout is not None and j.callout.staggered and j.callout.offset_planes for j in m.joints):
            dr.add(
                Line(x, y + 4, x + 14, y + 4, strokeColor=PLANE, strokeWidth=1.1, strokeDashArray=[1.8, 1.2])
            )
            dr.add(String(x + 17, y + 1.5, "staggered, half a spacing away", fontName=font, fontSize=6.5))
            x += 26 + stringWidth("staggered, half a spacing away", font, 6.5)
    if "glue" in kinds:
        dr.add(Line(x, y + 4, x + 14, y + 4, strokeColor=PLANE, strokeWidth=2.2, strokeDashArray=[2.5, 1.2]))
        dr.add(String(x + 17, y + 1.5, "glue line", fontName=font, fontSize=6.5))
        x += 56
    scale_bar(dr, ctx.display, x + 6, y, k, font)
