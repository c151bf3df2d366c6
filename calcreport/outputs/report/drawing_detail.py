"""Joints on the section detail: welds drawn as fillets (continuous solid, intermittent open),
fasteners as shanks with heads, glue lines, and the callout blocks beside the section — the joint,
an AWS A2.4 fillet-weld symbol for welds, and the connector in words (``outputs/callouts.py``).

Reads the solver's callout record (``JointResult.callout``); geometry only, in points.
"""

from __future__ import annotations

import math
from collections.abc import Callable

from reportlab.graphics.shapes import Circle, Drawing, Line, Polygon, String
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from shapely.geometry import Point
from shapely.geometry import Polygon as SPolygon

from ...solve.results import JointResult
from ..callouts import joint_callout_text, shop_length
from .styles import plain

__all__ = ["PLANE", "draw_joint", "callout_block", "wrap_words", "TEXT_SIZE", "WELD_SYMBOL_H"]

PLANE = colors.HexColor("#b3261e")
TEXT_SIZE = 7.0
WELD_SYMBOL_H = 22.0
_FASTENED = ("nail", "wood_screw", "lag_screw", "wood_bolt", "steel_bolt", "shank", "given", "stud")

ToPoint = Callable[[float, float], tuple[float, float]]


def wrap_words(text: str, font: str, size: float, width: float) -> list[str]:
    """``text`` broken at spaces into lines no wider than ``width`` (a long word stands alone)."""
    lines: list[str] = []
    cur = ""
    for word in text.split():
        trial = f"{cur} {word}".strip()
        if cur and stringWidth(trial, font, size) > width:
            lines.append(cur)
            cur = word
        else:
            cur = trial
    if cur:
        lines.append(cur)
    return lines or [""]


def _occupied(polys: list[SPolygon], x: float, y: float) -> bool:
    pt = Point(x, y)
    return any(p.contains(pt) for p in polys)


def _weld_triangles(j: JointResult, P: ToPoint, k: float, polys: list[SPolygon]) -> list[list[float]]:
    """Fillet triangles (points) at the ends of each plane segment, in the free corner between the
    part that ends there and the part that runs on."""
    c = j.callout
    leg = max(
        float(c.weld_size.to("inch").magnitude) * k if c.weld_size is not None else 0.0, 4.0
    )  # drawn no smaller than 4 pt to be seen
    out = []
    lines = c.weld_lines or 2
    for pl in c.planes:
        a, b = P(*pl.segment[0]), P(*pl.segment[1])
        length = math.hypot(b[0] - a[0], b[1] - a[1])
        if length <= 0:
            continue
        ux, uy = (b[0] - a[0]) / length, (b[1] - a[1]) / length
        ends = [(a, (-ux, -uy)), (b, (ux, uy))][: max(1, min(lines, 2))]
        for (ex, ey), (ox, oy) in ends:
            nx, ny = -oy, ox
            d = 1.2
            free = [
                s
                for s in (1.0, -1.0)
                if not _occupied(polys, ex + ox * d + s * nx * d, ey + oy * d + s * ny * d)
            ]
            if not free:
                continue
            s = free[0]
            out.append([ex, ey, ex + ox * leg, ey + oy * leg, ex + s * nx * leg, ey + s * ny * leg])
    return out


def _fasteners(dr: Drawing, j: JointResult, P: ToPoint, parts_pts: dict[str, tuple]) -> None:
    """One shank per connector of a row on each plane: from the far face of the part across the
    plane, through the plane, with a head on that face. Staggered rows offset half a spacing
    (``offset_planes``) lie outside the cut: drawn dashed."""
    c = j.callout
    for n_plane, pl in enumerate(c.planes):
        dash = [1.8, 1.2] if c.staggered and n_plane in c.offset_planes else None
        a, b = P(*pl.segment[0]), P(*pl.segment[1])
        length = math.hypot(b[0] - a[0], b[1] - a[1])
        if length <= 0 or pl.rows <= 0:
            continue
        ux, uy = (b[0] - a[0]) / length, (b[1] - a[1]) / length
        nx, ny = -uy, ux
        box = parts_pts.get(pl.other)
        depth_other = 8.0
        if box is not None:  # thickness of the part across, measured along the normal
            cx, cy = (box[0] + box[2]) / 2, (box[1] + box[3]) / 2
            if (cx - a[0]) * nx + (cy - a[1]) * ny > 0:
                nx, ny = -nx, -ny  # the normal points into the held part
            depth_other = abs(box[2] - box[0]) if abs(nx) > 0.5 else abs(box[3] - box[1])
        reach = max(6.0, 1.6 * depth_other)
        for i in range(pl.rows):
            t = (i + 0.5) / pl.rows
            px, py = a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t
            hx, hy = px - nx * depth_other, py - ny * depth_other  # head on the far face
            tx, ty = px + nx * (reach - depth_other), py + ny * (reach - depth_other)
            dr.add(Line(hx, hy, tx, ty, strokeColor=PLANE, strokeWidth=1.1, strokeDashArray=dash))
            dr.add(
                Line(
                    hx - ux * 2.4,
                    hy - uy * 2.4,
                    hx + ux * 2.4,
                    hy + uy * 2.4,
                    strokeColor=PLANE,
                    strokeWidth=1.6,
                )
            )


def draw_joint(
    dr: Drawing, j: JointResult, P: ToPoint, k: float, polys: list[SPolygon], boxes: dict[str, tuple]
) -> None:
    """The joint's plane(s) and its connectors in the section."""
    c = j.callout
    kind = c.kind if c is not None else ""
    for a, b in j.plane:
        (x0, y0), (x1, y1) = P(*a), P(*b)
        if kind == "glue":
            dr.add(Line(x0, y0, x1, y1, strokeColor=PLANE, strokeWidth=2.2, strokeDashArray=[2.5, 1.2]))
        else:
            dr.add(Line(x0, y0, x1, y1, strokeColor=PLANE, strokeWidth=0.9))
    if c is None:
        return
    if kind == "fillet_weld":
        for tri in _weld_triangles(j, P, k, polys):
            if c.continuous:
                dr.add(Polygon(tri, fillColor=colors.black, strokeColor=colors.black, strokeWidth=0.5))
            else:
                dr.add(Polygon(tri, fillColor=colors.white, strokeColor=colors.black, strokeWidth=0.7))
                dr.add(
                    Line(
                        tri[2],
                        tri[3],
                        (tri[0] + tri[4]) / 2,
                        (tri[1] + tri[5]) / 2,
                        strokeColor=colors.black,
                        strokeWidth=0.5,
                    )
                )
    elif kind in _FASTENED and not c.continuous:
        _fasteners(dr, j, P, boxes)


def weld_symbol(dr: Drawing, j: JointResult, x: float, y: float, font: str, system: str) -> float:
    """An AWS A2.4 fillet-weld symbol with its reference line from ``x`` at height ``y`` (the
    arrow's end): size left of the fillet, length-pitch right of it, both sides drawn above and
    below the line. Returns its width."""
    c = j.callout
    ref = 64.0
    dr.add(Line(x, y, x + ref, y, strokeColor=colors.black, strokeWidth=0.7))
    tx = x + 22
    both = (c.weld_lines or 2) >= 2
    sides = (1, -1) if both else (-1,)  # below the line = arrow side
    for s in sides:
        dr.add(
            Polygon(
                [tx, y, tx + 7, y, tx, y + s * 7],
                fillColor=None,
                strokeColor=colors.black,
                strokeWidth=0.7,
            )
        )
        size = shop_length(c.weld_size, system).rsplit(" ", 1)[0]
        dr.add(
            String(tx - 2, y + (1.5 if s > 0 else -7.5), size, fontName=font, fontSize=6.5, textAnchor="end")
        )
        if not c.continuous and c.segment is not None:
            pitch = (
                shop_length(c.segment, system).rsplit(" ", 1)[0]
                + "-"
                + shop_length(c.spacing, system).rsplit(" ", 1)[0]
            )
            dr.add(String(tx + 9, y + (1.5 if s > 0 else -7.5), pitch, fontName=font, fontSize=6.5))
    return ref


def callout_block(j: JointResult, font: str, bold: str, width: float, system: str) -> tuple[list[str], float]:
    """The callout's text lines (joint id first) and the block's height in points."""
    words = joint_callout_text(j.callout, system) if j.callout is not None else j.connector
    lines = [plain(j.id)[:28]] + wrap_words(plain(words), font, TEXT_SIZE, width)
    h = len(lines) * (TEXT_SIZE + 1.6) + 3
    if j.callout is not None and j.callout.kind == "fillet_weld":
        h += WELD_SYMBOL_H
    return lines, h


def draw_callout(
    dr: Drawing,
    j: JointResult,
    anchor: tuple[float, float],
    x: float,
    y: float,
    lines: list[str],
    font: str,
    bold: str,
    system: str,
) -> None:
    """Leader from the joint to the block at (x, y) (its bottom-left), the weld symbol, the text."""
    top = y + len(lines) * (TEXT_SIZE + 1.6)
    weld = j.callout is not None and j.callout.kind == "fillet_weld"
    if weld:
        ry = top + WELD_SYMBOL_H - 9
        dr.add(Line(anchor[0], anchor[1], x, ry, strokeColor=colors.black, strokeWidth=0.5))
        dx, dy = x - anchor[0], ry - anchor[1]
        n = math.hypot(dx, dy) or 1.0
        ux, uy = dx / n, dy / n
        dr.add(
            Polygon(
                [
                    anchor[0],
                    anchor[1],
                    anchor[0] + ux * 5 - uy * 1.8,
                    anchor[1] + uy * 5 + ux * 1.8,
                    anchor[0] + ux * 5 + uy * 1.8,
                    anchor[1] + uy * 5 - ux * 1.8,
                ],
                fillColor=colors.black,
                strokeColor=None,
            )
        )
        weld_symbol(dr, j, x, ry, font, system)
    else:
        dr.add(Line(anchor[0], anchor[1], x - 2, top - 4, strokeColor=PLANE, strokeWidth=0.45))
        dr.add(Circle(anchor[0], anchor[1], 1.1, fillColor=PLANE, strokeColor=None))
    yy = top - TEXT_SIZE
    for i, line in enumerate(lines):
        dr.add(
            String(
                x,
                yy,
                line,
                fontName=bold if i == 0 else font,
                fontSize=TEXT_SIZE,
                fillColor=PLANE if i == 0 else colors.black,
            )
        )
        yy -= TEXT_SIZE + 1.6
