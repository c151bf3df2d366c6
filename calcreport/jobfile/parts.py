"""Parts of a built-up section: shape keys and placement, read into placed :class:`Shape` records.

Shapes (``shape = …``):

* ``rect`` — ``width``, ``depth``;
* ``plate`` — ``thickness``, ``width``; ``upright = true`` stands it on edge (a web plate);
* ``lumber`` — ``size = "2x10"`` (dressed per PS 20); on edge unless ``flat = true``;
* ``bar`` — round bar, ``diameter``;
* ``polygon`` — ``points = [["0 in", "0 in"], …]`` in its own coordinates;
* ``rolled`` — given by properties: ``area``, ``inertia`` (about its own horizontal centroidal
  axis), ``depth``, ``width``, optional ``centroid`` (height above its bottom; default depth/2) and
  ``flange_thickness`` / ``web_thickness`` (the plates a bolt or weld bears on); or by
  ``designation = "W21X50"`` alone, every property from the AISC Shapes Database v16.0.

Placement: ``on``, ``below``, ``left_of`` or ``right_of`` another part (listed earlier), with
``align`` and ``offset``; or ``at = ["x", "y"]`` for the lower-left corner of its bounding box.
The first part sits at the origin when it has no placement.
"""

from __future__ import annotations

import math
from dataclasses import replace
from typing import Literal, overload

from ..errors import excerpt
from ..keys import job as decl
from ..model import Material, Part, Shape
from .lumber import LumberSizeError, dressed_size
from .reader import Table

__all__ = ["read_part", "SHAPES", "MAX_VERTICES"]

SHAPES = decl.SHAPES
PLACEMENTS = decl.PLACEMENTS
MAX_VERTICES = 2000
#: every key a part table may hold, whatever its shape
PART_KEYS = decl.names(decl.PART)
#: Smallest part dimension (0.001 in = 0.025 mm): thinner is a typing slip, and it would make the
#: section's area vanish (common practice, no source).
MIN_DIMENSION = 1e-3
_IN = "inch"


@overload
def _len(t: Table, name: str, required: Literal[True] = ...) -> float: ...
@overload
def _len(t: Table, name: str, required: bool) -> float | None: ...
def _len(t: Table, name: str, required: bool = True) -> float | None:
    q = t.quantity(name, "length", required=required)
    if q is None:
        return None
    v = float(q.to(_IN).magnitude)
    if v < MIN_DIMENSION:
        raise t.error(name, f"expected at least {MIN_DIMENSION:g} in (0.025 mm), got {t.data[name]!r}")
    return v


def _box(w: float, h: float, **kw) -> Shape:
    verts = ((0.0, 0.0), (w, 0.0), (w, h), (0.0, h))
    return Shape("polygon", (0.0, 0.0, w, h), vertices=verts, **kw)


def _read_polygon(t: Table) -> Shape:
    pts = t.raw("points", True, "a list of [x, y] points with units")
    if not isinstance(pts, list) or not 3 <= len(pts) <= MAX_VERTICES:
        raise t.error("points", f"expected a list of 3 to {MAX_VERTICES} [x, y] points")
    verts = []
    for i, p in enumerate(pts):
        if not isinstance(p, list) or len(p) != 2:
            raise t.error("points", f'point {i + 1}: expected [x, y] like ["0 in", "2 in"]')
        x = t.parse_quantity(("points", i, 0), p[0], "length", positive=False)
        y = t.parse_quantity(("points", i, 1), p[1], "length", positive=False)
        verts.append((float(x.to(_IN).magnitude), float(y.to(_IN).magnitude)))
    from shapely.geometry import Polygon

    poly = Polygon(verts)
    if not poly.is_valid or poly.area <= MIN_DIMENSION**2:
        raise t.error("points", "expected a simple polygon with area (edges must not cross)")
    if poly.exterior.is_ccw is False:
        verts.reverse()
    xs, ys = [v[0] for v in verts], [v[1] for v in verts]
    x0, y0 = min(xs), min(ys)
    verts = [(x - x0, y - y0) for x, y in verts]
    return Shape(
        "polygon",
        (0.0, 0.0, max(xs) - x0, max(ys) - y0),
        vertices=tuple(verts),
        description=f"polygon, {len(verts)} vertices",
    )


def _read_shape(t: Table, kind: str) -> Shape:
    if kind == "rect":
        w, h = _len(t, "width"), _len(t, "depth")
        return _box(w, h, description="rectangle")
    if kind == "plate":
        thick, w = _len(t, "thickness"), _len(t, "width")
        if t.boolean("upright"):
            return _box(thick, w, description="plate, upright")
        return _box(w, thick, description="plate")
    if kind == "lumber":
        size = t.text("size", required=True)
        try:
            thick, w = dressed_size(size)
        except LumberSizeError as exc:
            raise t.error("size", str(exc)) from None
        nominal = size.strip().lower().replace(" ", "")
        if t.boolean("flat"):
            return _box(w, thick, description=f"{nominal} lumber, flat", nominal=nominal)
        return _box(thick, w, description=f"{nominal} lumber, on edge", nominal=nominal)
    if kind == "bar":
        d = _len(t, "diameter")
        return Shape("circle", (0.0, 0.0, d, d), centre=(d / 2, d / 2), radius=d / 2, description="round bar")
    if kind == "polygon":
        return _read_polygon(t)
    if not t.has("area") and t.has("designation"):
        return _read_rolled_by_name(t)
    # rolled: given by its properties
    area = float(t.quantity("area", "area", required=True).to("inch**2").magnitude)
    inertia = float(t.quantity("inertia", "inertia", required=True).to("inch**4").magnitude)
    if area < MIN_DIMENSION**2 or inertia < MIN_DIMENSION**4:
        raise t.error(
            "area" if area < MIN_DIMENSION**2 else "inertia",
            "expected a rolled shape of at least 1e-6 in² and 1e-12 in⁴",
        )
    depth, width = _len(t, "depth"), _len(t, "width")
    cy = _len(t, "centroid", required=False)
    cy = depth / 2 if cy is None else cy
    if cy >= depth:
        raise t.error("centroid", f"expected a height below the depth ({depth:g} in)")
    if area > width * depth * (1 + 1e-9):
        raise t.error("area", "expected an area no larger than width × depth")
    tf = _len(t, "flange_thickness", required=False) or 0.0
    tw = _len(t, "web_thickness", required=False) or 0.0
    if tf and 2 * tf >= depth:
        raise t.error("flange_thickness", f"expected less than half the depth ({depth:g} in)")
    if tw and tw >= width:
        raise t.error("web_thickness", f"expected less than the width ({width:g} in)")
    name = t.text("designation")
    return Shape(
        "properties",
        (0.0, 0.0, width, depth),
        area=area,
        inertia=inertia,
        centroid=(width / 2, cy),
        description="rolled shape by properties",
        nominal=name,
        flange_thickness=tf,
        web_thickness=tw,
        source="stated in the job file",
    )


def _read_rolled_by_name(t: Table) -> Shape:
    """A rolled shape by designation, its properties from the AISC Shapes Database v16.0
    (:mod:`calcreport.shapes_db`). Properties typed beside a designation are refused: the
    database is the one source."""
    from ..shapes_db import DATABASE, ShapeNotFound, lookup

    for key in ("inertia", "depth", "width", "centroid", "flange_thickness", "web_thickness"):
        if t.has(key):
            raise t.error(
                key,
                f"a shape given by designation takes its properties from the {DATABASE}; "
                f"remove '{key}' or give every property (area, inertia, depth, width) instead",
            )
    name = t.text("designation", required=True)
    try:
        row = lookup(name)
    except ShapeNotFound as exc:
        raise t.error("designation", str(exc)) from None
    return Shape(
        "properties",
        (0.0, 0.0, row.bf, row.d),
        area=row.area,
        inertia=row.Ix,
        centroid=(row.bf / 2, row.d / 2),
        description=f"rolled shape {row.designation}",
        nominal=row.designation,
        flange_thickness=row.tf,
        web_thickness=row.tw,
        source=DATABASE,
    )


def _translate(s: Shape, dx: float, dy: float) -> Shape:
    x0, y0, x1, y1 = s.bbox
    return replace(
        s,
        bbox=(x0 + dx, y0 + dy, x1 + dx, y1 + dy),
        vertices=tuple((x + dx, y + dy) for x, y in s.vertices),
        centre=(s.centre[0] + dx, s.centre[1] + dy),
        centroid=(s.centroid[0] + dx, s.centroid[1] + dy),
    )


def _place(t: Table, s: Shape, placed: dict[str, Part], first: bool) -> Shape:
    given = [p for p in PLACEMENTS if t.has(p)]
    t.raw("align")
    if len(given) > 1:
        raise t.error(given[1], f"expected one placement, got {' and '.join(given)}")
    w = s.bbox[2] - s.bbox[0]
    h = s.bbox[3] - s.bbox[1]
    if not given:
        if first:
            return s
        raise t.error(None, "missing a placement: give one of on, below, left_of, right_of or at")
    how = given[0]
    if how == "at":
        xy = t.raw("at")
        if not isinstance(xy, list) or len(xy) != 2:
            raise t.error("at", 'expected [x, y] like ["0 in", "9.25 in"]')
        xq = t.parse_quantity(("at", 0), xy[0], "length", positive=False)
        yq = t.parse_quantity(("at", 1), xy[1], "length", positive=False)
        return _translate(s, float(xq.to(_IN).magnitude), float(yq.to(_IN).magnitude))
    ref_id = t.text(how)
    if ref_id not in placed:
        hint = f" (known so far: {', '.join(placed)})" if placed else ""
        raise t.error(how, f"expected the id of a part listed above, got {excerpt(ref_id)}{hint}")
    rx0, ry0, rx1, ry1 = placed[ref_id].shape.bbox
    off_q = t.quantity("offset", "length", positive=False)
    off = 0.0 if off_q is None else float(off_q.to(_IN).magnitude)
    if how in ("on", "below"):
        align = t.choice("align", ("centre", "left", "right"), "centre")
        x = {"centre": (rx0 + rx1 - w) / 2, "left": rx0, "right": rx1 - w}[align] + off
        y = ry1 if how == "on" else ry0 - h
    else:
        align = t.choice("align", ("bottom", "top", "centre"), "bottom")
        y = {"centre": (ry0 + ry1 - h) / 2, "bottom": ry0, "top": ry1 - h}[align] + off
        x = rx1 if how == "right_of" else rx0 - w
    return _translate(s, x - s.bbox[0], y - s.bbox[1])


def read_part(t: Table, materials: dict[str, Material], placed: dict[str, Part]) -> Part:
    """Read one ``[[member.part]]`` table and place it relative to the parts before it."""
    t.expect(PART_KEYS)
    pid = t.ident("id")
    if pid in placed:
        raise t.error("id", f"duplicate part id {pid!r}")
    kind = t.choice("shape", SHAPES, required=True)
    mat_id = t.text("material", required=True)
    if mat_id not in materials:
        raise t.error(
            "material",
            f"expected a material id ({', '.join(materials) or 'none defined'}), got {excerpt(mat_id)}",
        )
    shape = _place(t, _read_shape(t, kind), placed, first=not placed)
    if not all(math.isfinite(v) and abs(v) < 1e5 for v in shape.bbox):
        raise t.error(None, "part lies more than 100,000 in from the origin")
    label = t.text("label")
    t.done()
    return Part(pid, shape, materials[mat_id], label)
