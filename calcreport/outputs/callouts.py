"""A joint's connector in the words a framer or welder reads: "2 rows 8d common @ 2-1/4 in o.c.,
each web", "5/16 in fillet weld, 3-12 intermittent, both sides", "glue line, full width".

Reads the solver's :class:`~calcreport.solve.callout.Callout` record; formats, never computes.
"""

from __future__ import annotations

import math
import re

from ..units import Quantity

__all__ = [
    "shop_length",
    "fraction_inches",
    "dim_text",
    "joint_callout_text",
    "plural_across",
    "weld_text",
    "stagger_words",
    "stagger_note",
]


def shop_length(q: Quantity | None, system: str = "US") -> str:
    """A short length as the shop reads it: ``2-1/4 in`` (nearest 1/16 in) in US units, ``57 mm``
    in SI (common practice, no source)."""
    if q is None:
        return "—"
    if system == "SI":
        return f"{dim_text(float(q.to('inch').magnitude), 'SI')} mm"
    return f"{fraction_inches(float(q.to('inch').magnitude))} in"


def fraction_inches(x: float) -> str:
    """``2.25`` → ``2-1/4``; exact 32nds stay (``23/32``, plywood), else the nearest 1/16."""
    den = 32 if abs(abs(x) * 32 - round(abs(x) * 32)) < 1e-3 else 16
    n = int(round(abs(x) * den))
    whole, frac = divmod(n, den)
    sign = "−" if x < 0 else ""
    if not frac:
        return f"{sign}{whole}"
    g = math.gcd(frac, den)
    f = f"{frac // g}/{den // g}"
    return f"{sign}{whole}-{f}" if whole else f"{sign}{f}"


def dim_text(inches: float, system: str = "US") -> str:
    """A dimension on the section detail, unit stated once in the caption: inches with fractions
    (US), whole millimetres (SI)."""
    if system == "SI":
        mm = inches * 25.4
        return f"{mm:.0f}" if abs(mm - round(mm)) < 0.05 else f"{mm:.1f}"
    return fraction_inches(inches)


def _bare(q: Quantity | None, system: str) -> str:
    """A length without its unit, for weld symbols ("3-12", "75-300")."""
    return shop_length(q, system).rsplit(" ", 1)[0]


def plural_across(callout) -> str:
    """What the rows go into, when every plane takes the same rows: "each web" when the parts across
    the planes share their first word ("web_w", "web_e"), else "each plane" ("" for one plane)."""
    planes = callout.planes
    if len(planes) < 2:
        return ""
    words = set()
    for p in planes:
        name = (p.other_label or p.other or "").strip().lower()
        first = re.split(r"[\s_\-.]+", name)[0] if name else ""
        if first in ("left", "right", "east", "west", "north", "south", "top", "bottom", "front", "back"):
            parts = re.split(r"[\s_\-.]+", name)
            first = parts[-1] if len(parts) > 1 else first
        words.add(first)
    word = words.pop() if len(words) == 1 else ""
    return f"each {word}" if word else "each plane"


def weld_text(callout, system: str = "US") -> str:
    """ "5/16 in fillet weld, 3-12 intermittent, both sides" (length-pitch as AWS A2.4 writes it)."""
    size = shop_length(callout.weld_size, system)
    sides = {1: "one side", 2: "both sides" if callout.weld_form != "lap" else "both edges"}.get(
        callout.weld_lines or 0, f"{callout.weld_lines} lines"
    )
    if callout.continuous or callout.segment is None:
        return f"{size} fillet weld, continuous, {sides}"
    pitch = f"{_bare(callout.segment, system)}-{_bare(callout.spacing, system)}"
    return f"{size} fillet weld, {pitch} intermittent, {sides}"


def joint_callout_text(
    callout, system: str = "US", spacing: Quantity | None = None, stagger: bool = True
) -> str:
    """The callout of a joint in words. ``spacing`` overrides the governing one (a zone's spacing
    on the shop sheet); ``stagger=False`` leaves out the words on staggered rows (a zone row of
    the shop sheet, whose joint heading states them)."""
    if callout is None:
        return ""
    if callout.kind == "fillet_weld":
        if spacing is not None and not callout.continuous:
            from dataclasses import replace

            callout = replace(callout, spacing=spacing)
        return weld_text(callout, system)
    if callout.kind == "glue" or (callout.continuous and callout.kind == "given_line"):
        what = "glue line" if callout.kind == "glue" else callout.name
        return f"{what}, full width ({shop_length(callout.plane_width, system)})"
    if callout.continuous:
        return callout.name
    s = spacing if spacing is not None else callout.spacing
    name = _short_name(callout, system)
    rows = {p.rows for p in callout.planes}
    at = f"@ {shop_length(s, system)} o.c." if s is not None else "(no spacing)"
    words = stagger_words(callout) if stagger else ""
    if _midway_line(callout) and s is not None:  # rows midway between the other line's: a limit
        at, limit = "", f"gaps ≤ {shop_length(s, system)}"
        words = f"{words}, {limit}" if words else limit
    if len(rows) == 1 and callout.planes:
        n = rows.pop()
        across = "through all plies" if getattr(callout, "through", False) else plural_across(callout)
        lead = f"{n} row{'s' if n != 1 else ''} {name} {at}".rstrip()
        return ", ".join(w for w in (lead, across, words) if w)
    return ", ".join(w for w in (f"{callout.per_row} per row {name} {at}".rstrip(), words) if w)


def _midway_line(callout) -> bool:
    """A ply line staggered as a whole against another, its rows midway between that line's."""
    return bool(
        getattr(callout, "staggered", False)
        and getattr(callout, "stagger_with", "")
        and callout.offset_planes
        and getattr(callout, "stagger_met", True)
    )


def stagger_words(callout) -> str:
    """ "staggered" (rows from opposite faces offset half a spacing), for a line of plies also
    the line it is staggered with; "" when not staggered."""
    if not getattr(callout, "staggered", False):
        return ""
    other = getattr(callout, "stagger_with", "")
    if not other:
        return "staggered"
    if callout.offset_planes:
        return f"staggered, midway between the rows of {other}"
    return f"staggered with {other}"


def stagger_note(callout, system: str = "US") -> str:
    """The shop's sentence on staggered rows: which rows lie midway between which ("" when not
    staggered)."""
    if not getattr(callout, "staggered", False):
        return ""
    other = getattr(callout, "stagger_with", "")
    if other and not getattr(callout, "stagger_met", True):
        return (
            f"Staggered as the job states, but the rows of this line and of line {other} cannot both "
            "follow their schedules midway between each other's: they are not shown clear of each other "
            "(see the check of the points from the two faces)."
        )
    if other and not callout.offset_planes:
        return (
            f"Staggered: each row of line {other}, driven from the other face, lies midway between two "
            "consecutive rows of this line."
        )
    if other:
        return (
            f"Staggered: each row lies midway between two rows of line {other}, driven from the other "
            "face, with no gap wider than this line's schedule allows; no row at x = 0."
        )
    faces = [p.other for i, p in enumerate(callout.planes) if i in callout.offset_planes]
    through = " and ".join(f for f in faces if f) or "the far face"
    end = "; none at x = 0" if callout.zones else ""
    return f"Staggered: the rows through {through} (dashed) lie midway between the others{end}."


def _short_name(callout, system: str = "US") -> str:
    """The connector's name without the word its kind already says ("8d common nail" → "8d
    common" when a size is given, as framers write it); bolts by their diameter ("1/2 in bolt")."""
    if callout.size and callout.kind in ("nail", "wood_screw", "lag_screw"):
        return callout.size
    d = getattr(callout, "diameter", None)
    if d is not None and callout.kind in ("wood_bolt", "steel_bolt", "lag_screw"):
        return f"{shop_length(d, system)} {'lag screw' if callout.kind == 'lag_screw' else 'bolt'}"
    return callout.name
