"""x–y line charts for the report (drawn on the canvas), with labelled axes and units.

Usage (e.g. a shear envelope along the member)::

    xs, x_unit = series_values(display, [Q_(0, "ft"), Q_(7, "ft"), Q_(14, "ft")])
    ys, y_unit = series_values(display, [Q_(3.6, "kip"), Q_(0, "kip"), Q_(-3.6, "kip")])
    chart = line_chart([Series("V, max", xs, ys)], f"x ({x_unit})", f"V ({y_unit})", ctx.width, 150, fonts)

Values are converted to display units by :func:`series_values`; the chart never computes.
"""

from __future__ import annotations

import functools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import ParamSpec, TypeVar

from reportlab import rl_config
from reportlab.lib import colors
from reportlab.platypus import Flowable

from ...units import Quantity
from ..fmt import Display, fmt_number
from .styles import Fonts, draw_text, plain, text_width

__all__ = [
    "Series",
    "LineChart",
    "line_chart",
    "unchecked_shapes",
    "series_values",
    "positions",
    "nice_ticks",
    "PALETTE",
]

P = ParamSpec("P")
R = TypeVar("R")

PALETTE = ("#1f3a93", "#b3261e", "#2e7d32", "#8d6a33", "#6a1b9a", "#00838f")


@dataclass(frozen=True)
class Series:
    """One line: a label, x values and y values (plain floats in display units)."""

    label: str
    x: Sequence[float]
    y: Sequence[float]
    colour: str = ""
    dashed: bool = False


def unchecked_shapes(build: Callable[P, R]) -> Callable[P, R]:
    """``build`` (a function that makes a reportlab Drawing of plain shapes) run without
    reportlab's per-attribute validation of every shape (``rl_config.shapeChecking``, a
    development aid by reportlab's own description): the shapes and what is drawn are the same,
    without a validator call for each attribute of each arrow, line and label."""

    @functools.wraps(build)
    def run(*args: P.args, **kwargs: P.kwargs) -> R:
        old = rl_config.shapeChecking
        rl_config.shapeChecking = 0
        try:
            return build(*args, **kwargs)
        finally:
            rl_config.shapeChecking = old

    return run


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
) -> LineChart:
    """A chart with axes, round ticks, a zero line, axis titles (give units) and a legend."""
    return LineChart(series, x_label, y_label, width, height, fonts, title)


class LineChart(Flowable):
    """An x–y chart drawn straight on the canvas: axes with round ticks, horizontal grid, a zero
    line, axis titles, a title and a legend. Everything is placed once, when it is made (the
    series scaled to the plot as flat lists of points); drawing is a few dozen canvas calls, not
    a tree of graphics widgets validated and expanded on every page."""

    _LEFT, _RIGHT, _BOTTOM = 52.0, 12.0, 30.0
    _TICK, _LABEL_SIZE = 5.0, 6.5

    def __init__(
        self,
        series: Sequence[Series],
        x_label: str,
        y_label: str,
        width: float,
        height: float,
        fonts: Fonts,
        title: str = "",
    ):
        super().__init__()
        self.width, self.height = width, height
        self.fonts = fonts
        self.x_label, self.y_label, self.title = plain(x_label), plain(y_label), plain(title)
        shown = [s for s in series if len(s.x)]
        self._legend = bool(len(series) > 1 or (series and series[0].label))
        top = 18.0 if title else 8.0
        legend_h = 12.0 if self._legend else 0.0
        self.px, self.py = self._LEFT, self._BOTTOM + legend_h
        self.pw, self.ph = width - self._LEFT - self._RIGHT, height - self._BOTTOM - top - legend_h
        self.lines: list[tuple[list[float], colors.Color, bool, str]] = []
        self.x_ticks: list[tuple[float, str]] = []
        self.y_ticks: list[tuple[float, str]] = []
        self.zero: float | None = None
        if not shown:
            return
        xs = [float(v) for s in shown for v in s.x]
        ys = [float(v) for s in shown for v in s.y] + [0.0]
        x_lo, x_hi = min(xs), max(xs)
        xt, yt = nice_ticks(x_lo, x_hi), nice_ticks(min(ys), max(ys))
        if x_hi > x_lo:  # x spans exactly the data (the member), with round ticks inside it
            xt = [t for t in xt if x_lo - 1e-9 <= t <= x_hi + 1e-9] or [x_lo, x_hi]
        else:
            x_lo, x_hi = xt[0], xt[-1]
        y_lo, y_hi = yt[0], yt[-1]
        sx, sy = self.pw / (x_hi - x_lo), self.ph / (y_hi - y_lo)
        self.x_ticks = [(self.px + (t - x_lo) * sx, _tick(t)) for t in xt]
        self.y_ticks = [(self.py + (t - y_lo) * sy, _tick(t)) for t in yt]
        if y_lo < 0 < y_hi:
            self.zero = self.py + (0 - y_lo) * sy
        for i, s in enumerate(shown):
            pts: list[float] = []
            for x, y in zip(s.x, s.y):
                pts += [self.px + (float(x) - x_lo) * sx, self.py + (float(y) - y_lo) * sy]
            colour = colors.HexColor(s.colour or PALETTE[i % len(PALETTE)])
            self.lines.append((pts, colour, s.dashed, plain(s.label)))

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:  # noqa: N803
        return self.width, self.height

    def _text(self, x: float, y: float, text: str, font: str, size: float, anchor: str = "start") -> None:
        if anchor != "start":
            w = text_width(text, font, size)
            x -= w / 2 if anchor == "middle" else w
        draw_text(self.canv, x, y, text, font, size)

    def draw(self) -> None:
        c = self.canv
        reg, bold = self.fonts.regular, self.fonts.bold
        c.saveState()
        c.setFillColor(colors.black)
        if not self.lines:
            self._text(self.width / 2, self.height / 2, "no data", reg, 7, "middle")
            c.restoreState()
            return
        px, py, pw, ph, tick = self.px, self.py, self.pw, self.ph, self._TICK
        c.setLineWidth(0.3)  # grid
        c.setStrokeColor(_GRID)
        for y, _ in self.y_ticks:
            c.line(px, y, px + pw, y)
        c.setStrokeColor(colors.black)  # axes, ticks and their labels
        c.setLineWidth(0.6)
        c.line(px, py, px + pw, py)
        c.line(px, py, px, py + ph)
        for x, label in self.x_ticks:
            c.line(x, py, x, py - tick)
            self._text(x, py - tick - self._LABEL_SIZE, label, reg, self._LABEL_SIZE, "middle")
        for y, label in self.y_ticks:
            c.line(px - tick, y, px, y)
            self._text(px - tick, y - 0.35 * self._LABEL_SIZE, label, reg, self._LABEL_SIZE, "end")
        c.setLineWidth(1.0)  # the series
        for pts, colour, dashed, _ in self.lines:
            c.setStrokeColor(colour)
            c.setDash([3, 2] if dashed else [])
            path = c.beginPath()
            path.moveTo(pts[0], pts[1])
            for k in range(2, len(pts), 2):
                path.lineTo(pts[k], pts[k + 1])
            c.drawPath(path, stroke=1, fill=0)
        c.setDash([])
        if self.zero is not None:
            c.setStrokeColor(colors.black)
            c.setLineWidth(0.5)
            c.line(px, self.zero, px + pw, self.zero)
        self._text(px + pw / 2, py - 22, self.x_label, reg, 7, "middle")
        c.saveState()
        c.translate(12, py + ph / 2)
        c.rotate(90)
        self._text(0, 0, self.y_label, reg, 7, "middle")
        c.restoreState()
        if self.title:
            self._text(self._LEFT, self.height - 11, self.title, bold, 7.5)
        if self._legend:
            x = self._LEFT
            c.setLineWidth(1.2)
            for _, colour, dashed, label in self.lines:
                c.setStrokeColor(colour)
                c.setDash([3, 2] if dashed else [])
                c.line(x, 4, x + 14, 4)
                self._text(x + 17, 1.5, label, reg, 6.5)
                x += 30 + len(label) * 3.6
            c.setDash([])
        c.restoreState()


_GRID = colors.HexColor("#dddddd")
