"""Where the shear plane of a joint lies, and how thick each part is there.

Connector models need ply thicknesses (side and main member of a nailed or bolted joint, the
plates of a bolted or welded steel joint, the slab of a stud joint). The job may give them; when it
does not, they are measured from the placed geometry of :class:`calcreport.model.Part`:

* The shear plane is found where a held part's bounding box touches an other part's bounding box.
  Touching along a horizontal line (one's top is the other's bottom, x ranges overlapping) gives a
  **horizontal** plane — stacked flanges, a cover plate on a flange, a flange plate on a web edge.
  Touching along a vertical line gives a **vertical** plane — a web beside a flange (box beams).
* A part's thickness *perpendicular to the plane* is the run of material from the plane into the
  part along lines normal to the plane, sampled across the contact; the smallest run is used
  (for a polygon this finds a rolled shape's flange, not its full depth). Circles and
  property-only shapes use the bounding box.
* A part's extent *along the plane* is its bounding-box extent in the plane's direction.

All lengths are plain floats in inches (as in :class:`calcreport.model.Shape`).
Source: geometry of the placed section (no standard involved).
"""

from __future__ import annotations

from dataclasses import dataclass

from ...model import Part
from ...outlines import is_rectangle

__all__ = [
    "Contact",
    "Layer",
    "find_contact",
    "thickness_normal",
    "extent_along",
    "plate_thickness",
    "stack_beyond",
    "opposite_faces",
    "width_for_lines",
    "across_check",
    "rolled_plate",
    "missing_rolled_plate",
]

TOL = 1e-6


@dataclass(frozen=True)
class Contact:
    """A contact between a held part and an other part."""

    orientation: str  # "horizontal" or "vertical"
    held: Part
    other: Part
    at: float  # y of a horizontal plane or x of a vertical plane (in)
    lo: float  # contact extent along the plane (in)
    hi: float
    held_side: int  # +1 if the held part lies above (or right of) the plane, else -1


def _overlap(a0: float, a1: float, b0: float, b1: float) -> tuple[float, float]:
    return max(a0, b0), min(a1, b1)


def find_contact(held: tuple[Part, ...], other: tuple[Part, ...]) -> Contact | None:
    """The first (widest) contact between a held part and an other part, or None.

    Example:
        >>> from calcreport.model import Part, Shape, Material
        >>> from calcreport.units import Q_
        >>> m = Material("w", "wood", Q_(1.6e6, "psi"))
        >>> top = Part("t", Shape("polygon", (0, 1.5, 3.5, 3.0)), m)
        >>> bot = Part("b", Shape("polygon", (0, 0, 3.5, 1.5)), m)
        >>> c = find_contact((top,), (bot,)); (c.orientation, c.at, c.hi - c.lo)
        ('horizontal', 1.5, 3.5)
    """
    best: Contact | None = None
    scale = 1.0
    for p in (*held, *other):
        x0, y0, x1, y1 = p.shape.bbox
        scale = max(scale, abs(x1 - x0), abs(y1 - y0))
    tol = max(TOL, 1e-6 * scale)
    for h in held:
        hx0, hy0, hx1, hy1 = h.shape.bbox
        for o in other:
            ox0, oy0, ox1, oy1 = o.shape.bbox
            cands = []
            lo, hi = _overlap(hx0, hx1, ox0, ox1)
            if hi - lo > tol:
                if abs(hy0 - oy1) <= tol:
                    cands.append(Contact("horizontal", h, o, hy0, lo, hi, +1))
                if abs(hy1 - oy0) <= tol:
                    cands.append(Contact("horizontal", h, o, hy1, lo, hi, -1))
            lo, hi = _overlap(hy0, hy1, oy0, oy1)
            if hi - lo > tol:
                if abs(hx0 - ox1) <= tol:
                    cands.append(Contact("vertical", h, o, hx0, lo, hi, +1))
                if abs(hx1 - ox0) <= tol:
                    cands.append(Contact("vertical", h, o, hx1, lo, hi, -1))
            for c in cands:
                if best is None or (c.hi - c.lo) > (best.hi - best.lo):
                    best = c
    return best


def _runs_polygon(part: Part, c: Contact, side: int, samples: int = 9) -> list[float]:
    from shapely.geometry import LineString, Polygon

    poly = Polygon(part.shape.vertices)
    if not poly.is_valid or poly.area <= 0:
        return []
    x0, y0, x1, y1 = part.shape.bbox
    reach = 2.0 * max(x1 - x0, y1 - y0) + 1.0
    runs = []
    width = c.hi - c.lo
    for i in range(samples):
        t = c.lo + width * (i + 0.5) / samples
        if c.orientation == "horizontal":
            line = LineString([(t, c.at), (t, c.at + side * reach)])
        else:
            line = LineString([(c.at, t), (c.at + side * reach, t)])
        inter = line.intersection(poly)
        if inter.is_empty:
            continue
        pieces = list(getattr(inter, "geoms", [inter]))
        for piece in pieces:
            coords = list(piece.coords)
            if len(coords) < 2:
                continue
            ds = [abs((pt[1] if c.orientation == "horizontal" else pt[0]) - c.at) for pt in coords]
            if min(ds) <= 1e-6 * reach:
                runs.append(max(ds))
    return runs


def thickness_normal(part: Part, c: Contact) -> float:
    """Thickness of ``part`` measured perpendicular to the contact plane, from the plane inward (in).

    The smallest run over samples across the contact is returned (polygons); bounding box
    otherwise. Source: geometry.
    """
    side = c.held_side if part is c.held else -c.held_side
    plate = rolled_plate(part, c)
    if plate is not None:
        return plate
    if part.shape.kind == "polygon" and len(part.shape.vertices) >= 3 and not is_rectangle(part.shape):
        runs = _runs_polygon(part, c, side)
        if runs:
            return min(runs)
    x0, y0, x1, y1 = part.shape.bbox
    return (y1 - y0) if c.orientation == "horizontal" else (x1 - x0)


def rolled_plate(part: Part, c: Contact) -> float | None:
    """The plate of a rolled shape (given by properties) that a connector at ``c`` bears on: its
    flange thickness at a horizontal plane (a plate on the flange), its web thickness at a vertical
    plane; None for other shapes or when the job (or the shapes database) gave none.
    Source: geometry of the rolled shape (the plane lies on a flange face or against the web)."""
    if part.shape.kind != "properties":
        return None
    t = part.shape.flange_thickness if c.orientation == "horizontal" else part.shape.web_thickness
    return t if t > 0 else None


def missing_rolled_plate(part: Part, c: Contact | None) -> str | None:
    """A message when ``part`` is a rolled shape given by properties whose connected plate is not
    known (so its full depth or width would be taken as a plate), else None."""
    if part.shape.kind != "properties" or c is None or rolled_plate(part, c) is not None:
        return None
    which = "flange_thickness" if c.orientation == "horizontal" else "web_thickness"
    return (
        f"part {part.id} is a rolled shape given by its properties without {which}: give {which} "
        f"on the part (or the shape by designation), or the plate thickness on this connector"
    )


def extent_along(part: Part, c: Contact) -> float:
    """Bounding-box extent of ``part`` in the direction of the plane (in). Source: geometry."""
    x0, y0, x1, y1 = part.shape.bbox
    return (x1 - x0) if c.orientation == "horizontal" else (y1 - y0)


def plate_thickness(part: Part, c: Contact) -> float:
    """Plate thickness of ``part`` at the contact: the lesser of its run normal to the plane and
    its extent along the plane (a web standing on edge against a flange has thickness t_w along
    the plane). A rolled shape's plate is its flange or web thickness. Source: geometry."""
    plate = rolled_plate(part, c)
    if plate is not None:
        return plate
    return min(thickness_normal(part, c), extent_along(part, c))


@dataclass(frozen=True)
class Layer:
    """A part crossed by a fastener axis: from ``start`` to ``end``, distances from the shear plane
    along the axis (in)."""

    part: Part
    start: float
    end: float


def _crossing(part: Part, c: Contact, t: float, direction: int) -> list[tuple[float, float]]:
    """Where the line normal to the plane at position ``t`` along it crosses ``part``: intervals of
    distance from the plane, measured in ``direction`` (+1 up or right, −1 down or left)."""
    x0, y0, x1, y1 = part.shape.bbox
    horizontal = c.orientation == "horizontal"
    lo, hi = (x0, x1) if horizontal else (y0, y1)
    if not lo - TOL < t < hi + TOL:
        return []
    if part.shape.kind == "polygon" and len(part.shape.vertices) >= 3 and not is_rectangle(part.shape):
        from shapely.geometry import LineString, Polygon

        reach = 4.0 * max(x1 - x0, y1 - y0) + abs(c.at) + 10.0
        a, b = (t, c.at - reach), (t, c.at + reach)
        line = LineString([a, b] if horizontal else [(a[1], a[0]), (b[1], b[0])])
        inter = line.intersection(Polygon(part.shape.vertices))
        out = []
        for piece in getattr(inter, "geoms", [inter]):
            coords = list(getattr(piece, "coords", []))
            if len(coords) >= 2:
                ds = [((p[1] if horizontal else p[0]) - c.at) * direction for p in coords]
                out.append((min(ds), max(ds)))
        return out
    if part.shape.kind == "circle":
        cx, cy = part.shape.centre
        off = (t - cx) if horizontal else (t - cy)
        if abs(off) >= part.shape.radius:
            return []
        half = (part.shape.radius**2 - off**2) ** 0.5
        mid = ((cy if horizontal else cx) - c.at) * direction
        return [(mid - half, mid + half)]
    near, far = (y0, y1) if horizontal else (x0, x1)
    da, db = (near - c.at) * direction, (far - c.at) * direction
    return [(min(da, db), max(da, db))]


def stack_beyond(parts: tuple[Part, ...], c: Contact, direction: int, t: float | None = None) -> list[Layer]:
    """The parts a fastener driven across the plane of ``c`` in ``direction`` passes through, in
    order: the material continuous with the plane along the axis at ``t`` (default: middle of the
    contact), stopping at the first gap or the far face. Source: geometry of the placed parts.

    Example:
        >>> from calcreport.model import Part, Shape, Material
        >>> from calcreport.units import Q_
        >>> m = Material("w", "wood", Q_(1.6e6, "psi"))
        >>> def r(i, x0, x1): return Part(i, Shape("polygon", (x0, 0, x1, 5.5)), m)
        >>> web, fl, web2 = r("w", 0, 0.72), r("f", 0.72, 2.22), r("e", 2.22, 2.94)
        >>> c = find_contact((fl,), (web,))
        >>> [(L.part.id, round(L.end, 2)) for L in stack_beyond((web, fl, web2), c, +1)]
        [('f', 1.5), ('e', 2.22)]
    """
    t = (c.lo + c.hi) / 2.0 if t is None else t
    pieces: list[tuple[float, float, Part]] = []
    for p in parts:
        for d0, d1 in _crossing(p, c, t, direction):
            if d1 > TOL:
                pieces.append((max(d0, 0.0), d1, p))
    pieces.sort(key=lambda x: (x[0], x[1]))
    out: list[Layer] = []
    reach = 0.0
    for d0, d1, p in pieces:
        if d0 > reach + 1e-6:
            break
        if d1 > reach + 1e-9:
            out.append(Layer(p, max(d0, reach), d1))
            reach = d1
    return out


def opposite_faces(main: Part, c: Contact, others: tuple[Part, ...]) -> list[tuple[Part, Contact]]:
    """Parts among ``others`` that touch ``main`` on the face opposite the plane of ``c`` (same
    orientation, overlapping ``c`` along the plane): fasteners may be driven from both faces.
    Source: geometry."""
    out = []
    for o in others:
        if o is c.held or o is c.other:
            continue
        oc = find_contact((main,), (o,))
        if oc is None or oc.orientation != c.orientation or abs(oc.at - c.at) <= TOL:
            continue
        if min(oc.hi, c.hi) - max(oc.lo, c.lo) > TOL:
            out.append((o, oc))
    return out


def width_for_lines(n: int, edge: float, spacing: float) -> float:
    """Width a row of ``n`` fasteners across the contact needs: two edge distances and n − 1
    spacings between lines, W = 2·e + (n − 1)·s (in). Source: geometry of the layout; the limits
    e and s come from the connector's standard."""
    return 2.0 * edge + max(n - 1, 0) * spacing


def across_check(
    key: str, c, n: int, edge: float, spacing: float, source: str, note: str, across_note: str, log=None
):
    """The edge-distance check of a row of ``n`` fasteners across the contact of ``c``: with one,
    the fastener centred (half the contact ≥ e); with several, the contact width against
    W = 2·e + (n − 1)·s, written as a step when ``log`` is given. Returns a
    :class:`calcreport.solve.results.Check`. Source: geometry of the row (the limits e and s
    come from the caller's standard)."""
    from ...units import Q_
    from ..results import Check

    width = c.hi - c.lo
    step = ""
    if log is not None and n > 1:
        step = f"{log.prefix}.W_across"
        log.add(
            "W_across",
            f"Contact width needed for {n} fasteners across",
            "W = 2·e + (n − 1)·s",
            "2 × {e} + ({n} − 1) × {s}",
            {"e": Q_(edge, "in"), "n": n, "s": Q_(spacing, "in")},
            Q_(width_for_lines(n, edge, spacing), "in"),
            source=source,
            note=across_note,
        )
    if n <= 1:
        half = width / 2.0
        return Check(
            f"{key}.edge",
            "Edge distance with one row centred in the contact",
            Q_(edge, "in"),
            Q_(half, "in"),
            edge / half,
            "OK" if half >= edge - 1e-9 else "NG",
            source=source,
            note=note,
        )
    need = width_for_lines(n, edge, spacing)
    return Check(
        f"{key}.edge",
        f"Contact width for {n} fasteners across",
        Q_(need, "in"),
        Q_(width, "in"),
        need / width,
        "OK" if width >= need - 1e-9 else "NG",
        source=source,
        # e and s are values of the step W_across (formatted by the outputs); the note names the
        # rules, never their numbers (the solver does not format)
        # (callers that log W_across log e and s as steps too, each with its rule)
        note="" if step else f"W = 2·e + (n − 1)·s; e: {note}; s between lines: {across_note}",
        step=step,
    )
