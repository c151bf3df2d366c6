"""Plane geometry of placed parts: outlines, overlap, contact and shear-plane lines.

Lengths are plain floats in inches, as in :class:`calcreport.model.Shape`. Axis-aligned rectangles
(plates, lumber, rolled shapes by their bounding box) — most built-up sections — are handled
directly; shapely is imported only for polygons and round bars.
"""

from __future__ import annotations

from functools import lru_cache
from typing import Any

from .model import Part, Shape

__all__ = ["outline", "overlapping_pairs", "isolated_parts", "contact_segments", "TOUCH_TOL"]

#: Two parts closer than this (inches) touch (common practice, no source: 1/10,000 in).
TOUCH_TOL = 1e-4
CIRCLE_SEGMENTS = 64


@lru_cache(maxsize=4096)
def outline(shape: Shape) -> Any:
    """The part's outline as a shapely geometry (a circle as a 256-gon; properties as its bbox)."""
    from shapely.geometry import Point, Polygon, box

    if shape.kind == "polygon":
        return Polygon(shape.vertices)
    if shape.kind == "circle":
        return Point(shape.centre).buffer(shape.radius, quad_segs=CIRCLE_SEGMENTS)
    return box(*shape.bbox)


def is_rectangle(shape: Shape) -> bool:
    """True for an axis-aligned rectangle: its bounding box is its outline."""
    if shape.kind == "properties":
        return True
    if shape.kind != "polygon" or len(shape.vertices) != 4:
        return False
    xs = {round(v[0], 9) for v in shape.vertices}
    ys = {round(v[1], 9) for v in shape.vertices}
    return len(xs) == 2 and len(ys) == 2


def _bbox_area(b) -> float:
    return max(0.0, b[2] - b[0]) * max(0.0, b[3] - b[1])


def _overlap_area(a: Shape, b: Shape) -> float:
    if is_rectangle(a) and is_rectangle(b):
        (ax0, ay0, ax1, ay1), (bx0, by0, bx1, by1) = a.bbox, b.bbox
        return _bbox_area((max(ax0, bx0), max(ay0, by0), min(ax1, bx1), min(ay1, by1)))
    return outline(a).intersection(outline(b)).area


def _area(s: Shape) -> float:
    return _bbox_area(s.bbox) if is_rectangle(s) else outline(s).area


def _distance(a: Shape, b: Shape) -> float:
    if is_rectangle(a) and is_rectangle(b):
        (ax0, ay0, ax1, ay1), (bx0, by0, bx1, by1) = a.bbox, b.bbox
        dx = max(0.0, bx0 - ax1, ax0 - bx1)
        dy = max(0.0, by0 - ay1, ay0 - by1)
        return (dx * dx + dy * dy) ** 0.5
    return outline(a).distance(outline(b))


def overlapping_pairs(parts: tuple[Part, ...] | list[Part]) -> list[tuple[str, str, float]]:
    """Pairs of parts whose interiors overlap, with the overlapping area (in²)."""
    out = []
    for i in range(len(parts)):
        for j in range(i + 1, len(parts)):
            a, b = parts[i].shape, parts[j].shape
            if not _bbox_overlap(a.bbox, b.bbox):
                continue
            area = _overlap_area(a, b)
            if area > 1e-6 * min(_area(a), _area(b)):
                out.append((parts[i].id, parts[j].id, area))
    return out


def _bbox_overlap(a, b, tol: float = TOUCH_TOL) -> bool:
    return a[0] <= b[2] + tol and b[0] <= a[2] + tol and a[1] <= b[3] + tol and b[1] <= a[3] + tol


def isolated_parts(parts: tuple[Part, ...] | list[Part]) -> list[str]:
    """Ids of parts that touch no other part (empty for a single part)."""
    if len(parts) < 2:
        return []
    lonely = []
    for i, p in enumerate(parts):
        if not any(
            j != i
            and _bbox_overlap(p.shape.bbox, parts[j].shape.bbox)
            and _distance(p.shape, parts[j].shape) <= TOUCH_TOL
            for j in range(len(parts))
        ):
            lonely.append(p.id)
    return lonely


def _edges(shape: Shape) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    if shape.kind == "circle":
        return []
    x0, y0, x1, y1 = shape.bbox
    pts = list(shape.vertices) if shape.kind == "polygon" else [(x0, y0), (x1, y0), (x1, y1), (x0, y1)]
    return [(pts[i], pts[(i + 1) % len(pts)]) for i in range(len(pts))]


def _shared(e, f, tol: float = TOUCH_TOL):
    """The stretch where edges e and f lie on one line within tol, or None."""
    (ax, ay), (bx, by) = e
    L = _dist(e[0], e[1])
    if L <= tol:
        return None
    ux, uy = (bx - ax) / L, (by - ay) / L
    # both ends of f within tol of the line through e
    for px, py in f:
        if abs((px - ax) * uy - (py - ay) * ux) > tol:
            return None
    t0 = (f[0][0] - ax) * ux + (f[0][1] - ay) * uy
    t1 = (f[1][0] - ax) * ux + (f[1][1] - ay) * uy
    lo, hi = max(0.0, min(t0, t1)), min(L, max(t0, t1))
    if hi - lo <= 10 * tol:
        return None
    return ((ax + ux * lo, ay + uy * lo), (ax + ux * hi, ay + uy * hi))


def contact_segments(
    held: list[Part], other: list[Part]
) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    """Line segments where the held parts touch the others: the shear plane(s) of a joint.

    Edges of the outlines that lie on one line (within TOUCH_TOL) and overlap give the contact;
    a round bar touches along a line only in the elevation, so it contributes none here.
    """
    out = []
    for h in held:
        for o in other:
            if not _bbox_overlap(h.shape.bbox, o.shape.bbox):
                continue
            for e in _edges(h.shape):
                for f in _edges(o.shape):
                    seg = _shared(e, f)
                    if seg:
                        out.append(seg)
    return [
        ((round(a[0], 6) + 0.0, round(a[1], 6) + 0.0), (round(b[0], 6) + 0.0, round(b[1], 6) + 0.0))
        for a, b in sorted(tuple(sorted(s)) for s in out)
    ]


def _dist(a, b) -> float:
    return ((a[0] - b[0]) ** 2 + (a[1] - b[1]) ** 2) ** 0.5
