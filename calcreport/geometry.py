"""Plane geometry of placed parts (shapely): outlines, overlap, contact and shear-plane lines.

Lengths are plain floats in inches, as in :class:`calcreport.model.Shape`.
"""

from __future__ import annotations

from functools import lru_cache

from shapely.geometry import Polygon, box
from shapely.geometry.base import BaseGeometry

from .model import Part, Shape

__all__ = ["outline", "overlapping_pairs", "isolated_parts", "contact_segments", "TOUCH_TOL"]

#: Two parts closer than this (inches) touch (common practice, no source: 1/10,000 in).
TOUCH_TOL = 1e-4
CIRCLE_SEGMENTS = 64


@lru_cache(maxsize=4096)
def outline(shape: Shape) -> BaseGeometry:
    """The part's outline as a shapely geometry (a circle as a 256-gon; properties as its bbox)."""
    if shape.kind == "polygon":
        return Polygon(shape.vertices)
    if shape.kind == "circle":
        from shapely.geometry import Point

        return Point(shape.centre).buffer(shape.radius, quad_segs=CIRCLE_SEGMENTS)
    return box(*shape.bbox)


def overlapping_pairs(parts: tuple[Part, ...] | list[Part]) -> list[tuple[str, str, float]]:
    """Pairs of parts whose interiors overlap, with the overlapping area (in²)."""
    out = []
    geoms = [outline(p.shape) for p in parts]
    for i in range(len(parts)):
        for j in range(i + 1, len(parts)):
            if not _bbox_overlap(parts[i].shape.bbox, parts[j].shape.bbox):
                continue
            a = geoms[i].intersection(geoms[j]).area
            if a > 1e-6 * min(geoms[i].area, geoms[j].area):
                out.append((parts[i].id, parts[j].id, a))
    return out


def _bbox_overlap(a, b, tol: float = TOUCH_TOL) -> bool:
    return a[0] <= b[2] + tol and b[0] <= a[2] + tol and a[1] <= b[3] + tol and b[1] <= a[3] + tol


def isolated_parts(parts: tuple[Part, ...] | list[Part]) -> list[str]:
    """Ids of parts that touch no other part (empty for a single part)."""
    if len(parts) < 2:
        return []
    geoms = [outline(p.shape) for p in parts]
    lonely = []
    for i, p in enumerate(parts):
        if not any(j != i and _bbox_overlap(p.shape.bbox, parts[j].shape.bbox)
                   and geoms[i].distance(geoms[j]) <= TOUCH_TOL for j in range(len(parts))):
            lonely.append(p.id)
    return lonely


def _edges(shape: Shape) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    if shape.kind == "circle":
        return []
    pts = list(shape.vertices) if shape.kind == "polygon" else list(outline(shape).exterior.coords)[:-1]
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


def contact_segments(held: list[Part], other: list[Part]) -> list[tuple[tuple[float, float], tuple[float, float]]]:
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
    return [((round(a[0], 6) + 0.0, round(a[1], 6) + 0.0), (round(b[0], 6) + 0.0, round(b[1], 6) + 0.0))
            for a, b in sorted(tuple(sorted(s)) for s in out)]


def _dist(a, b) -> float:
    return ((a[0] - b[0]) ** 2 + (a[1] - b[1]) ** 2) ** 0.5
