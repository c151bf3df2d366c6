"""Dressed (surfaced, dry) sizes of softwood lumber from nominal sizes such as ``"2x10"``.

Source: American Softwood Lumber Standard, NIST PS 20 (dry dressed sizes), as tabulated in the
NDS Supplement (2018), Table 1A (from memory): thickness 1 → 3/4 in, 2 → 1-1/2, 3 → 2-1/2,
4 → 3-1/2; widths up to 6 in nominal lose 1/2 in, 8 in and wider lose 3/4 in; timbers
(5 in nominal and thicker) lose 1/2 in on each face dimension.
"""

from __future__ import annotations

import re

from ..errors import excerpt

__all__ = ["dressed_size", "LumberSizeError"]

_NOMINAL = re.compile(r"^\s*(\d{1,2})\s*[xX×]\s*(\d{1,2})\s*$")
_THICKNESS = {1: 0.75, 2: 1.5, 3: 2.5, 4: 3.5}


class LumberSizeError(ValueError):
    """Not a nominal softwood lumber size this table covers."""


def _dimension_width(nominal: int) -> float:
    """Dressed width of dimension lumber (PS 20 dry): −1/2 in to 6 in nominal, −3/4 in above."""
    if nominal < 2:
        raise LumberSizeError(f"nominal width {nominal} is below the tabulated 2 in")
    return nominal - 0.5 if nominal <= 6 else nominal - 0.75


def dressed_size(nominal: str) -> tuple[float, float]:
    """Dressed thickness and width in inches for a nominal size.

    Args:
        nominal: ``"2x10"`` (thickness × width, nominal inches).

    Returns:
        ``(thickness, width)`` in inches, e.g. ``(1.5, 9.25)``.

    Example:
        >>> dressed_size("2x10")
        (1.5, 9.25)
        >>> dressed_size("6x8")
        (5.5, 7.5)
    """
    m = _NOMINAL.match(nominal)
    if not m:
        raise LumberSizeError(f'expected a nominal size like "2x10", got {excerpt(nominal)}')
    t, w = int(m.group(1)), int(m.group(2))
    if t > w:
        t, w = w, t
    if not (1 <= t <= 16 and 2 <= w <= 16):
        raise LumberSizeError(f"nominal size {excerpt(nominal)} is outside 1x2 to 16x16")
    if t >= 5:  # timbers: 1/2 in off each dimension
        return t - 0.5, w - 0.5
    if t not in _THICKNESS:
        raise LumberSizeError(f"nominal thickness {t} is not tabulated")
    return _THICKNESS[t], _dimension_width(w)
