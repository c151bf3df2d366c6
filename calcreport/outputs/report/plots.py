"""x–y line charts for the report (reportlab.graphics), with labelled axes and units.

Usage (e.g. a shear envelope along the member)::

    xs, x_unit = series_values(display, [Q_(0, "ft"), Q_(7, "ft"), Q_(14, "ft")])
    ys, y_unit = series_values(display, [Q_(3.6, "kip"), Q_(0, "kip"), Q_(-3.6, "kip")])
    chart = line_chart([Series("V, max", xs, ys)], f"x ({x_unit})", f"V ({y_unit})", ctx.width, 150, fonts)

Values are converted to display units by :func:`series_values`; the chart never computes.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from reportlab.graphics.charts.lineplots import LinePlot
from reportlab.graphics.shapes import Drawing, Line, String
from reportlab.lib import colors

from ...units import Quantity
from ..fmt import Display, fmt_number
from .styles import Fonts, plain

__all__ = ["Series", "line_chart", "series_values", "positions", "nice_ticks", "PALETTE"]

PALETTE = ("#1f3a93", "#b3261e", "#2e7d32", "#8d6a33", "#6a1b9a", "#00838f")


@dataclass(frozen=True)
class Series:
    """One line: a label, x values and y values (plain floats in display units)."""

    label: str
    x: Sequence[float]
    y: Sequence[float]
    colour: str = ""
    dashed: bool = False


def series_values(display: Display, values: Sequence[Quantity] | Quantity) -> tuple[list[float], str]:
    """Quantities (a sequence or an array quantity) in the job's display unit, and that unit's
    symbol; an array quantity is converted once, not element by element."""
    if isinstance(values, Quantity) and getattr(values.magnitude, "shape", None):
        return display.convert_array(values)
    items = (
        list(values)
        if not isinstance(values, Quantity) or getattr(values.magnitude, "shape", None)
        else [values]
    )
    out, unit = [], ""
    for v in items:
        mag, unit, _ = display.convert(v)
        out.append(mag)
    return out, unit


def positions(display: Display, values: Sequence[Quantity] | Quantity) -> tuple[list[float], str]:
    """Positions along the member for a chart's x axis: feet (US) or metres (SI), and the unit."""
    unit = "m" if display.system == "SI" else "ft"
    if isinstance(values, Quantity) and getattr(values.magnitude, "shape", None):
        return [float(v) for v in values.to(unit).magnitude], unit
    return [float(v.to(unit).magnitude) for v in values], unit


def nice_ticks(lo: float, hi: float, count: int = 5) -> list[float]:
    """Round tick values covering [lo, hi] (1, 2, 2.5 or 5 times a power of ten apart)."""
    if not (math.isfinite(lo) and math.isfinite(hi)):
        return [0.0, 1.0]
    if hi - lo <= 1e-12 * max(1.0, abs(hi)):
        lo, hi = lo - 1.0, hi + 1.0
    raw = (hi - lo) / max(1, count)
    e = 10 ** math.floor(math.log10(raw))
    step = next(m * e for m in (1, 2, 2.5, 5, 10) if m * e >= raw)
    start = math.floor(lo / step + 1e-9) * step
    ticks, t = [], start
    while t <= hi + step * 1e-6 + step:
        ticks.append(round(t, 12))
        if t >= hi - 1e-9 * step:
            break
        t += step
    return ticks


def _tick(v: float) -> str:
    """Axis tick text: 3 significant figures without trailing zeros (10, 2.5, −4,000)."""
    if not v:
        return "0"
    text = fmt_number(v, 3)
    if "." in text and "×" not in text:
        text = text.rstrip("0").rstrip(".")
    return text


def line_chart(
    series: Sequence[Series],
    x_label: str,
    y_label: str,
    width: float,
    height: float,
    fonts: Fonts,
    title: str = "",
) -> Drawing:
    """A chart with axes, round ticks, a zero line, axis titles (give units) and a legend."""
    dr = Drawing(width, height)
    left, right, bottom, top = 52.0, 12.0, 30.0, 18.0 if title else 8.0
    legend_h = 12.0 if len(series) > 1 or series and series[0].label else 0.0
    lp = LinePlot()
    lp.x, lp.y = left, bottom + legend_h
    lp.width, lp.height = width - left - right, height - bottom - top - legend_h
    data = [list(zip(map(float, s.x), map(float, s.y))) for s in series if len(s.x)]
    if not data:
        dr.add(
            String(width / 2, height / 2, "no data", fontName=fonts.regular, fontSize=7, textAnchor="middle")
        )
        return dr
    xs = [p[0] for d in data for p in d]
    ys = [p[1] for d in data for p in d] + [0.0]
    xt, yt = nice_ticks(min(xs), max(xs)), nice_ticks(min(ys), max(ys))
    lp.data = data
    # x spans exactly the data (the member), with round ticks inside it
    x_lo, x_hi = min(xs), max(xs)
    if x_hi > x_lo:
        xt = [t for t in xt if x_lo - 1e-9 <= t <= x_hi + 1e-9] or [x_lo, x_hi]
    lp.xValueAxis.valueMin, lp.xValueAxis.valueMax = x_lo, x_hi
    lp.yValueAxis.valueMin, lp.yValueAxis.valueMax = yt[0], yt[-1]
    lp.xValueAxis.valueSteps, lp.yValueAxis.valueSteps = xt, yt
    for axis in (lp.xValueAxis, lp.yValueAxis):
        axis.labels.fontName = fonts.regular
        axis.labels.fontSize = 6.5
        axis.labelTextFormat = _tick
        axis.strokeWidth = 0.6
    lp.yValueAxis.visibleGrid = 1
    lp.yValueAxis.gridStrokeColor = colors.HexColor("#dddddd")
    lp.yValueAxis.gridStrokeWidth = 0.3
    for i, s in enumerate([s for s in series if len(s.x)]):
        line = lp.lines[i]
        line.strokeColor = colors.HexColor(s.colour or PALETTE[i % len(PALETTE)])
        line.strokeWidth = 1.0
        if s.dashed:
            line.strokeDashArray = [3, 2]
    dr.add(lp)
    if yt[0] < 0 < yt[-1]:
        y0 = lp.y + lp.height * (0 - yt[0]) / (yt[-1] - yt[0])
        dr.add(Line(lp.x, y0, lp.x + lp.width, y0, strokeColor=colors.black, strokeWidth=0.5))
    dr.add(
        String(
            lp.x + lp.width / 2,
            lp.y - 22,
            plain(x_label),
            fontName=fonts.regular,
            fontSize=7,
            textAnchor="middle",
        )
    )
    ylab = String(0, 0, plain(y_label), fontName=fonts.regular, fontSize=7, textAnchor="middle")
    from reportlab.graphics.shapes import Group

    g = Group(ylab)
    g.transform = (0, 1, -1, 0, 12, lp.y + lp.height / 2)
    dr.add(g)
    if title:
        dr.add(String(left, height - 11, plain(title), fontName=fonts.bold, fontSize=7.5))
    if legend_h:
        x = left
        for i, s in enumerate([s for s in series if len(s.x)]):
            col = colors.HexColor(s.colour or PALETTE[i % len(PALETTE)])
            dr.add(
                Line(
                    x,
                    4,
                    x + 14,
                    4,
                    strokeColor=col,
                    strokeWidth=1.2,
                    strokeDashArray=[3, 2] if s.dashed else None,
                )
            )
            dr.add(String(x + 17, 1.5, plain(s.label), fontName=fonts.regular, fontSize=6.5))
            x += 30 + len(plain(s.label)) * 3.6
    return dr
