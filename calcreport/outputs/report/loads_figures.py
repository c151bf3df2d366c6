"""Figures along the member: loading diagram, shear-flow demand against provided capacity, and an
elevation of the member with its connector zones and dimension strings.

They draw what the solver found (loads, supports, zones with their provided capacity n·F/s); the
only arithmetic here is scaling to the page.
"""

from __future__ import annotations

from reportlab.graphics.shapes import Drawing, Line, Path, Polygon, Rect, String
from reportlab.lib import colors

from ...model import Member
from ...solve.results import JointResult
from ...units import Q_
from ..fmt import fmt_number
from .plots import PALETTE, LineChart, Series, line_chart, positions, series_values, unchecked_shapes
from .styles import plain

__all__ = ["loading_diagram", "demand_capacity_chart", "zone_elevation"]

INK = colors.HexColor("#222222")
LOAD_INK = colors.HexColor("#1f3a93")
DIM_INK = colors.HexColor("#555555")


def _inches(q) -> float:
    return float(q.to("inch").magnitude)


_SIMPLE_UNITS = {"plf", "klf", "kN/m", "N/m", "N/mm", "lbf/ft", "kip/ft", "lbf", "kip", "kN", "N"}


def as_given(q, system: str = "US") -> str:
    """A load in the unit the job file gave it when that unit is a simple one (plf, klf, kN/m, lbf,
    kip, kN), as engineers read load diagrams; otherwise in plf/lbf (US) or kN/m/kN (SI)."""
    unit = f"{q.units:~P}"
    if unit not in _SIMPLE_UNITS:
        line = q.check("[force] / [length]")
        unit = {("US", True): "plf", ("US", False): "lbf", ("SI", True): "kN/m", ("SI", False): "kN"}[
            (system, line)
        ]
        q = q.to(unit)
    return f"{fmt_number(float(q.magnitude), 4)} {unit}"


def _support(dr: Drawing, x: float, y: float, kind: str) -> None:
    if kind == "fixed":
        dr.add(Line(x, y - 9, x, y + 9, strokeColor=INK, strokeWidth=1.4))
        for k in range(-8, 9, 4):
            dr.add(Line(x, y + k, x - 4, y + k - 4, strokeColor=INK, strokeWidth=0.5))
        return
    dr.add(
        Polygon([x, y, x - 5, y - 8, x + 5, y - 8], strokeColor=INK, fillColor=colors.white, strokeWidth=0.8)
    )
    if kind == "roller":
        dr.add(Line(x - 6, y - 10.5, x + 6, y - 10.5, strokeColor=INK, strokeWidth=0.6))


def _arrow(dr: Drawing, x: float, y_top: float, y_tip: float, colour=LOAD_INK, width: float = 0.7) -> None:
    _arrows(dr, [x], y_top, y_tip, colour, width)


def _arrows(dr: Drawing, xs: list[float], y_top: float, y_tip: float, colour, width: float) -> None:
    """Arrows at ``xs`` from ``y_top`` to their tips at ``y_tip``, all of one colour: the shafts as
    one stroked path, the heads (filled triangles, outlined 0.3 pt) as another — the same marks as
    a line and a triangle per arrow, two shapes for the drawing to render instead of two per
    arrow (a uniform load draws up to 35 arrows)."""
    d = 2.5 if y_top > y_tip else -2.5
    shafts = Path(strokeColor=colour, strokeWidth=width, fillColor=None)
    heads = Path(strokeColor=colour, fillColor=colour, strokeWidth=0.3, autoclose="pdf")
    for x in xs:
        shafts.moveTo(x, y_top)
        shafts.lineTo(x, y_tip)
        heads.moveTo(x, y_tip)
        heads.lineTo(x - 1.8, y_tip + d)
        heads.lineTo(x + 1.8, y_tip + d)
        heads.closePath()
    dr.add(shafts)
    dr.add(heads)


def _dim(dr: Drawing, x0: float, x1: float, y: float, text: str, font: str, size: float = 6.5) -> None:
    """A horizontal dimension line with end ticks and its text above."""
    dr.add(Line(x0, y, x1, y, strokeColor=DIM_INK, strokeWidth=0.5))
    for x in (x0, x1):
        dr.add(Line(x, y - 3, x, y + 3, strokeColor=DIM_INK, strokeWidth=0.5))
        dr.add(Line(x - 1.5, y - 1.5, x + 1.5, y + 1.5, strokeColor=DIM_INK, strokeWidth=0.7))
    dr.add(
        String(
            (x0 + x1) / 2,
            y + 2,
            plain(text),
            fontName=font,
            fontSize=size,
            textAnchor="middle",
            fillColor=DIM_INK,
        )
    )


@unchecked_shapes
def loading_diagram(
    member: Member, fmt_q, fmt_pos, fonts, width: float, system: str = "US"
) -> Drawing | None:
    """Member line, supports, loads by case (uniform, linear, point) and span dimension strings.

    ``fmt_q`` turns a quantity into display text (the report's ``Ctx.q``).
    """
    if member.span is None or not member.loads:
        return None
    L = _inches(member.span)
    cases = list(dict.fromkeys(ld.case for ld in member.loads))
    band = 22.0
    height = 50 + band * len(cases)
    left, right = 24.0, 24.0
    sx = (width - left - right) / L
    y_beam = 34.0
    dr = Drawing(width, height)
    dr.add(Line(left, y_beam, left + L * sx, y_beam, strokeColor=INK, strokeWidth=2.2))
    for s in member.supports:
        _support(dr, left + _inches(s.x) * sx, y_beam - 1, s.kind)
    marks = sorted({_inches(s.x) for s in member.supports}) if member.supports else [0.0, L]
    if marks[0] > 1e-9:
        marks = [0.0] + marks
    if marks[-1] < L - 1e-9:
        marks = marks + [L]
    for a, b in zip(marks, marks[1:]):
        _dim(dr, left + a * sx, left + b * sx, 10, fmt_pos(Q_(b - a, "inch")), fonts.regular)
    for i, case in enumerate(cases):
        base = y_beam + 6 + band * i
        col = colors.HexColor(PALETTE[i % len(PALETTE)])
        dr.add(String(2, base + 6, plain(case), fontName=fonts.bold, fontSize=7, fillColor=col))
        ranges_drawn: set[str] = set()
        for ld in (x for x in member.loads if x.case == case):
            if ld.moving:
                lo, hi = (0.0, L) if ld.between is None else (_inches(ld.between[0]), _inches(ld.between[1]))
                x = left + (lo + (_inches(ld.offset) if ld.offset is not None else 0.0)) * sx
                _arrow(dr, x, base + band - 6, base, col, 1.0)
                dr.add(
                    String(
                        x + 3,
                        base + band - 7,
                        plain(as_given(ld.magnitude, system)),
                        fontName=fonts.regular,
                        fontSize=6,
                        fillColor=col,
                    )
                )
                tag = ld.group or ld.key
                if tag in ranges_drawn:
                    continue
                ranges_drawn.add(tag)
                y = base + band - 2
                x0, x1 = left + lo * sx, left + hi * sx
                dr.add(Line(x0, y, x1, y, strokeColor=col, strokeWidth=0.5, strokeDashArray=[2, 2]))
                for xe in (x0, x1):
                    dr.add(Line(xe, y - 2, xe, y + 2, strokeColor=col, strokeWidth=0.5))
                words = f"moving ({ld.group})" if ld.group else "moving"
                dr.add(
                    String(
                        x1 - 2,
                        y + 1.5,
                        plain(words),
                        fontName=fonts.regular,
                        fontSize=6,
                        textAnchor="end",
                        fillColor=col,
                    )
                )
                continue
            if ld.kind == "point":
                x = left + _inches(ld.at) * sx
                _arrow(dr, x, base + band - 6, base, col, 1.0)
                dr.add(
                    String(
                        x + 3,
                        base + band - 7,
                        plain(as_given(ld.magnitude, system) + _load_label(ld.label)),
                        fontName=fonts.regular,
                        fontSize=6,
                        fillColor=col,
                    )
                )
                continue
            a = _inches(ld.start) if ld.start is not None else 0.0
            b = _inches(ld.end) if ld.end is not None else L
            x0, x1 = left + a * sx, left + b * sx
            if ld.kind == "linear" and ld.magnitude_end is not None:
                w0, w1 = (
                    abs(float(ld.magnitude.magnitude)),
                    abs(float(ld.magnitude_end.to(ld.magnitude.units).magnitude)),
                )
                top = max(w0, w1) or 1.0
                h0, h1 = 4 + (band - 12) * w0 / top, 4 + (band - 12) * w1 / top
                text = f"{as_given(ld.magnitude, system)} → {as_given(ld.magnitude_end, system)}"
            else:
                h0 = h1 = band - 8
                text = as_given(ld.magnitude, system)
            dr.add(
                Polygon(
                    [x0, base, x1, base, x1, base + h1, x0, base + h0],
                    strokeColor=col,
                    strokeWidth=0.6,
                    fillColor=colors.Color(col.red, col.green, col.blue, alpha=0.12),
                )
            )
            n = max(2, int((x1 - x0) / 14))
            _arrows(
                dr, [x0 + (x1 - x0) * k / n for k in range(n + 1)], base + min(h0, h1) * 0.6, base, col, 0.4
            )
            label = plain(text + _load_label(ld.label))
            dr.add(
                String(
                    x1 - 2,
                    base + max(h0, h1) + 1.5,
                    label,
                    fontName=fonts.regular,
                    fontSize=6,
                    textAnchor="end",
                    fillColor=col,
                )
            )
    return dr


def demand_capacity_chart(j: JointResult, display, fonts, width: float) -> LineChart | None:
    """q(x) from the envelope against the provided capacity n·F/s of each zone (a stepped line)."""
    sch = j.schedule
    if sch is None or not getattr(sch, "feasible", False) or not sch.zones:
        return None
    xs, xu = positions(display, sch.x)
    ys, yu = series_values(display, sch.demand)
    step_x: list[float] = []
    step_y: list[float] = []
    for z in sch.zones:
        if z.capacity is None:
            continue
        (a, b), _ = positions(display, [z.start, z.end])
        (c,), _ = series_values(display, [z.capacity])
        step_x += [a, b]
        step_y += [c, c]
    return line_chart(
        [Series("demand q(x)", xs, ys), Series("provided n·F/s", step_x, step_y, colour="#2e7d32")],
        f"x along the member ({xu})",
        f"q ({yu})",
        width,
        140,
        fonts,
        title=f"{'Shear flow' if j.Q is not None else 'Transfer demand between plies'} at joint {j.id}: "
        "demand and provided capacity",
    )


@unchecked_shapes
def zone_elevation(j: JointResult, member: Member, fmt_q, fmt_pos, fonts, width: float) -> Drawing | None:
    """Elevation of the member with a tick at every connector row and a dimension string per zone."""
    sch = j.schedule
    if sch is None or not getattr(sch, "feasible", False) or not sch.zones:
        return None
    L = _inches(sch.length)
    left, right = 10.0, 10.0
    sx = (width - left - right) / L
    dr = Drawing(width, 74)
    y0, h = 34.0, 16.0
    dr.add(Rect(left, y0, L * sx, h, strokeColor=INK, fillColor=colors.HexColor("#f3efe6"), strokeWidth=0.8))
    for sup in member.supports:
        _support(dr, left + _inches(sup.x) * sx, y0 - 1, sup.kind)
    for i, z in enumerate(sch.zones):
        a, b, s = _inches(z.start), _inches(z.end), _inches(z.spacing)
        col = colors.HexColor(PALETTE[i % 2 * 2])
        rows = [a] if i == 0 else []  # the first zone also holds the row at x = 0
        k = 1
        while a + (k - 1) * s < b - 1e-6:  # rows at a + s, a + 2s, …, the last one at the zone's end
            rows.append(min(a + k * s, b))
            k += 1
        ticks = Path(strokeColor=col, strokeWidth=0.35, fillColor=None)  # one path: a tick per row
        for x in rows:
            ticks.moveTo(left + x * sx, y0 + 3)
            ticks.lineTo(left + x * sx, y0 + h - 3)
        dr.add(ticks)
        _dim(dr, left + a * sx, left + b * sx, y0 + h + 8, f"@ {fmt_q(z.spacing, 3)}", fonts.regular, 6)
        _dim(dr, left + a * sx, left + b * sx, 12, fmt_pos(Q_(b - a, "inch")), fonts.regular, 6)
        dr.add(
            String(
                left + (a + b) / 2 * sx,
                3,
                plain(f"{z.count} rows"),
                fontName=fonts.regular,
                fontSize=5.5,
                textAnchor="middle",
                fillColor=DIM_INK,
            )
        )
    return dr


def _load_label(label: str, limit: int = 80) -> str:
    """A load's label as drawn beside its value: two spaces, then at most ``limit`` characters."""
    if not label:
        return ""
    return "  " + (label if len(label) <= limit else label[: limit - 1] + "…")
