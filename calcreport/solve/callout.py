"""What a drawing calls out at a joint, as data: the connector, its rows on each shear plane, the
spacing that governs, weld size, segment and pitch, the parts on the far side of each plane.

Gathered from the joint's connector spec, the capacity the model returned, the spacing result and
the schedule — nothing here computes an engineering value; the outputs only put it into words
(``outputs/callouts.py``).
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from ..model import Joint, Part
from ..outlines import contact_segments
from ..units import Quantity

__all__ = [
    "PlaneCallout",
    "ShopZone",
    "Callout",
    "joint_callout",
    "row_positions",
    "midway",
    "midway_within",
    "stagger_line",
]


@dataclass(frozen=True)
class PlaneCallout:
    """One shear-plane segment of a joint and the connectors a row puts on it."""

    segment: tuple[tuple[float, float], tuple[float, float]]  # inches, section coordinates
    rows: int  # connectors of one row on this segment (lines of fasteners along the member)
    other: str  # id of the part across the plane from the held parts ("" if none found)
    other_label: str = ""


@dataclass(frozen=True)
class ShopZone:
    """One zone of the schedule as the shop sheet counts it."""

    start: Quantity  # from the member's left end (x = 0)
    end: Quantity
    length: Quantity  # end − start
    spacing: Quantity
    rows: int  # connector rows in the zone (the first zone also holds the row at x = 0)
    pieces: int  # connectors in the zone: rows × per_row; welds: segments on all weld lines
    # staggered: the offset rows in the zone (midway between the rows; a line staggered as a
    # whole has only these, ``rows`` = 0); ``pieces`` counts the connectors of both
    rows_offset: int = 0


@dataclass(frozen=True)
class Callout:
    """The connector of one joint as a detail or a shop sheet states it."""

    kind: str  # connector type as in the job file (``nail``, ``fillet_weld``, ``glue`` …)
    name: str  # the connector in words (the capacity's description, e.g. "8d common nail")
    size: str  # the job's size text when the connector has one ("8d common", "5/16 in"), else ""
    continuous: bool
    per_row: int
    planes: tuple[PlaneCallout, ...]
    spacing: Quantity | None  # governing (closest) spacing: the schedule's densest zone, else s
    spacing_widest: Quantity | None  # the schedule's widest zone spacing (None without zones)
    zoned: bool  # a zoned schedule along the member gives the spacing
    weld_size: Quantity | None = None
    weld_lines: int | None = None  # fillet welds: 2 = both sides / both edges
    weld_form: str = ""  # "tee" / "lap" / "auto" as given
    segment: Quantity | None = None  # intermittent weld segment length (pitch = spacing)
    plane_width: Quantity | None = None  # glue lines: width b of the line
    zones: tuple[ShopZone, ...] = ()  # the schedule's zones, counted (empty without a schedule)
    rows_total: int | None = None  # the schedule's N
    pieces_total: int | None = None  # connectors (or weld segments) along the member
    length: Quantity | None = None  # the member length the schedule covers (or its span)
    pieces_per_row: int = 1  # connectors (or weld segments) one row puts in
    through: bool = False  # each connector passes through every plane (a through-bolt of plies)
    diameter: Quantity | None = None  # bolts and lag screws: the shank diameter as given
    # staggered rows (``staggered = true``): the rows on the planes ``offset_planes`` (or the whole
    # line, when it is staggered against the line ``stagger_with``) lie midway between the
    # schedule's rows — offset half the spacing; there is one fewer of them (none at x = 0)
    staggered: bool = False
    offset_planes: tuple[int, ...] = ()
    stagger_with: str = ""
    rows_at: tuple[float, ...] = ()  # inches from x = 0: the schedule's rows (x = 0, then each zone's)
    offset_at: tuple[float, ...] = ()  # inches: the offset rows, midway between ``rows_at``
    stagger_met: bool = True  # False: a staggered line's rows are not shown clear of the other line's


def row_positions(zones) -> tuple[float, ...]:
    """The schedule's rows along the member, in inches from x = 0: one at x = 0, then each zone's
    rows at its spacing from the zone's start, the last at the zone's end — N = 1 + Σ ceil(ℓᵢ/sᵢ)
    (:mod:`.schedule`). ``zones`` are schedule or shop zones (start, end, spacing)."""
    xs = [0.0] if zones else []
    for z in zones:
        a, b = float(z.start.to("inch").magnitude), float(z.end.to("inch").magnitude)
        s = float(z.spacing.to("inch").magnitude)
        k = 1
        while a + (k - 1) * s < b - 1e-6 and s > 0:
            xs.append(min(a + k * s, b))
            k += 1
    return tuple(xs)


def midway(xs: tuple[float, ...]) -> tuple[float, ...]:
    """Staggered rows: midway between consecutive rows (offset half the spacing), inches.
    Common practice, no source."""
    return tuple((a + b) / 2 for a, b in zip(xs, xs[1:]))


def _offset_counts(zones, offset: tuple[float, ...]) -> list[int]:
    """Offset rows in each zone's (start, end] (the first zone's start included)."""
    out = []
    for i, z in enumerate(zones):
        a, b = float(z.start.to("inch").magnitude), float(z.end.to("inch").magnitude)
        out.append(sum(1 for x in offset if (a - 1e-6 if i == 0 else a + 1e-6) < x <= b + 1e-6))
    return out


def midway_within(ref: tuple[float, ...], zones) -> tuple[float, ...] | None:
    """A line staggered against another whose rows are ``ref`` (inches): its rows taken among the
    points midway between consecutive rows of ``ref``, as few as keep every gap — from x = 0, between
    rows, to the end — within the smallest spacing of this line's zones the gap crosses (so the
    line's own schedule is met everywhere). ``None`` when some gap of ``ref`` is too wide for that.
    Common practice, no source (staggered rows midway between those of the other face)."""
    if not zones or len(ref) < 2:
        return None
    span = [(float(z.start.to("inch").magnitude), float(z.end.to("inch").magnitude),
             float(z.spacing.to("inch").magnitude)) for z in zones]  # fmt: skip
    end = span[-1][1]

    def allowed(a: float, b: float) -> float:
        return min((s for z0, z1, s in span if z0 < b + 1e-9 and z1 > a - 1e-9), default=0.0)

    mids = midway(ref)
    picks: list[float] = []
    prev, i = 0.0, 0
    while end - prev > allowed(prev, end) + 1e-6:
        best = None
        while i < len(mids) and mids[i] - prev <= allowed(prev, mids[i]) + 1e-6:
            if mids[i] > prev + 1e-9:
                best = i
            i += 1
        if best is None:
            return None
        picks.append(mids[best])
        prev, i = mids[best], best + 1
    return tuple(picks) if picks else None


def _staggered(
    c: Callout, planes: tuple[int, ...], whole: bool, off: tuple[float, ...] | None = None
) -> Callout:
    """``c`` with its offset rows: on the planes ``planes`` (or every connector of the row when
    ``whole``), midway between the schedule's rows (or at ``off``, inches); counts per zone and in
    total follow."""
    if whole:
        moved = c.per_row
    else:
        moved = sum(p.rows for i, p in enumerate(c.planes) if i in planes)
    rows = row_positions(c.zones)
    if off is None:
        off = midway(rows)
    zones = c.zones
    if zones:
        n_off = _offset_counts(zones, off)
        stay = c.per_row - moved
        zones = tuple(
            replace(
                z,
                rows=0 if whole else z.rows,
                rows_offset=k,
                pieces=(0 if whole else z.rows * stay) + k * moved,
            )
            for z, k in zip(zones, n_off)
        )
    return replace(
        c,
        staggered=True,
        offset_planes=tuple(range(len(c.planes))) if whole else planes,
        rows_at=rows,
        offset_at=off,
        zones=zones,
        rows_total=len(off) if whole and zones else c.rows_total,
        pieces_total=sum(z.pieces for z in zones) if zones else c.pieces_total,
    )


def stagger_line(c: Callout, other: str, ref: tuple[float, ...] | None = None) -> Callout:
    """A line of fasteners staggered against the line ``other`` (plies nailed from both faces).
    Without ``ref`` it keeps its rows and only names the line offset from it. With ``ref`` (the
    other line's rows, inches) its rows lie midway between those (:func:`midway_within`);
    ``rows_total`` and the counts are of those rows. When the other line's rows are too far apart
    for this line's schedule, its rows lie midway between its own and are not shown clear of the
    other's: ``stagger_met`` is then False."""
    if ref is None:
        return replace(c, staggered=True, stagger_with=other)
    off = midway_within(ref, c.zones)
    out = replace(_staggered(c, (), whole=True, off=off), stagger_with=other)
    return replace(out, stagger_met=off is not None or not c.zones)


def _share(per_row: int, n: int) -> list[int]:
    """The row's connectors shared out over ``n`` plane segments (the first get one more)."""
    n = max(1, n)
    return [per_row // n + (1 if k < per_row % n else 0) for k in range(n)]


def _across(seg, held: list[Part], rest: list[Part]) -> Part | None:
    """The part across the plane segment ``seg`` from the held parts (its edge holds the segment)."""
    for p in rest:
        for a, b in contact_segments(held, [p]):
            if _close(a, seg[0]) and _close(b, seg[1]):
                return p
    return None


def _close(a, b, tol: float = 1e-4) -> bool:
    return abs(a[0] - b[0]) <= tol and abs(a[1] - b[1]) <= tol


def joint_callout(
    joint: Joint,
    parts: tuple[Part, ...],
    segments,
    description: str,
    continuous: bool,
    spacing: Quantity | None,
    schedule,
    plane_width: Quantity | None,
    span: Quantity | None = None,
    through: bool = False,
    staggered: bool = False,
) -> Callout:
    """The callout record of one joint (see module docstring). ``through``: every connector of a
    row passes through all the planes (a through-bolted line of plies), so each plane has them all.
    ``staggered``: rows from opposite faces offset along the member (the connector's
    ``staggered = true``) — the rows on the second, fourth … plane lie midway between the rows."""
    held = [p for p in parts if p.id in joint.holds]
    rest = [p for p in parts if p.id not in joint.holds]
    shares = [joint.per_row] * max(1, len(segments)) if through else _share(joint.per_row, len(segments))
    planes = []
    for seg, rows in zip(segments, shares):
        o = _across(seg, held, rest)
        planes.append(PlaneCallout(seg, rows, o.id if o else "", (o.label if o else "") or ""))
    zones = tuple(getattr(schedule, "zones", ()) or ()) if schedule is not None else ()
    feasible = bool(zones) and bool(getattr(schedule, "feasible", False))
    s_gov, s_wide = spacing, None
    if feasible:
        s_gov = min((z.spacing for z in zones), key=lambda q: q.to("inch").magnitude)
        s_wide = max((z.spacing for z in zones), key=lambda q: q.to("inch").magnitude)
    p = joint.connector.params
    size = p.get("size")
    weld = joint.connector.kind == "fillet_weld"
    per = int(p.get("welds", 2)) if weld else joint.per_row
    shop = (
        tuple(
            ShopZone(z.start, z.end, z.end - z.start, z.spacing, int(z.count), int(z.count) * per)
            for z in zones
        )
        if feasible
        else ()
    )
    n_rows = int(schedule.count) if feasible and schedule.count is not None else None
    length = schedule.length if schedule is not None else span
    out = Callout(
        kind=joint.connector.kind,
        through=through,
        diameter=p.get("diameter") if isinstance(p.get("diameter"), Quantity) else None,
        name=description,
        size=size if isinstance(size, str) else "",
        continuous=continuous,
        per_row=joint.per_row,
        planes=tuple(planes),
        spacing=None if continuous else s_gov,
        spacing_widest=None if continuous else s_wide,
        zoned=feasible,
        weld_size=size if weld and isinstance(size, Quantity) else None,
        weld_lines=int(p.get("welds", 2)) if weld else None,
        weld_form=str(p.get("joint_form", "")) if weld else "",
        segment=p.get("segment") if weld else None,
        plane_width=plane_width,
        zones=shop,
        rows_total=n_rows,
        pieces_total=None if n_rows is None else n_rows * per,
        length=length,
        pieces_per_row=per,
        rows_at=row_positions(shop),
    )
    if staggered and not continuous and not weld and len(planes) > 1:
        return _staggered(out, tuple(range(1, len(planes), 2)), whole=False)
    return out
