"""The words of a solver's :class:`~calcreport.steps.Phrase`: the part of a check's label or of a
step's or check's note that holds a number, written here in the job's units.

The solver carries only data in a phrase (quantities, counts, flags and the choice of words); each
output — report, JSON, terminal table — reads a label or note through :func:`check_label`,
:func:`check_note` and :func:`step_note`, so all of them print the same text. Formats, never computes.
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from typing import Any

from ..solve.results import Check
from ..steps import Phrase, Step
from .callouts import shop_length
from .fmt import Display

__all__ = ["check_label", "check_note", "step_note", "phrase_json", "KINDS"]


def _length(v: Any, d: Display) -> str:
    """A fastener length or spacing as the shop reads it (``3/4 in``, ``24 in``, ``610 mm``)."""
    return shop_length(v, d.system)


def _ply_minimum_label(v: Mapping[str, Any], d: Display) -> str:
    """The practice minimum of fastening plies (common practice, no source)."""
    s = _length(v["spacing_max"], d)
    if v["fastener"] == "bolt":
        return f"two rows of bolts at {s}, staggered"
    return f"two rows of 16d common at {s}, or equal"


def _ply_minimum_note(v: Mapping[str, Any], d: Display) -> str:
    rows, s = v.get("rows"), v.get("spacing")
    given = f"{rows} rows, largest spacing {_length(s, d)}" if rows else "no schedule"
    state = (
        "meets the rows and spacing of the practice minimum"
        if v["meets"]
        else "below the practice minimum in rows or spacing"
    )
    return f"provided: {given}; {state} (a practice rule, not the design result)"


def _table_row_note(v: Mapping[str, Any], d: Display) -> str:
    return (
        f"bolt diameter {_length(v['d'], d)} (the next larger tabulated diameter between rows of the table)"
    )


def _cover_weld_note(v: Mapping[str, Any], d: Display) -> str:
    return f"{v['lines']} edge weld line(s) over a′ = {v['k']:g}·w ({_length(v['length'], d)} of edge weld)"


def _rows_within_note(v: Mapping[str, Any], d: Display) -> str:
    return f"⌊{v['symbol']} / s⌋ with s = {_length(v['s'], d)}"


def _k_mod_note(v: Mapping[str, Any], d: Display) -> str:
    return f"{v['combination']}, k_mod = {v['k_mod']:g}"


def _rigid_share_note(v: Mapping[str, Any], d: Display) -> str:
    return f"rigid V·Q/I: {v['u']:.2f} of the capacity; {v['governs']} governs"


def _plate_slenderness_note(v: Mapping[str, Any], d: Display) -> str:
    return f"limits 0.08E/Fy = {v['lo']:.1f}, 1.9E/Fy = {v['hi']:.1f}"


def _iyc_ratio_note(v: Mapping[str, Any], d: Display) -> str:
    return f"Iyc/Iy = {v['ratio']:.3f} outside 0.1 to 0.9"


#: wording of each phrase kind: (label addition, note) — either may be absent
KINDS: dict[
    str,
    tuple[
        Callable[[Mapping[str, Any], Display], str] | None, Callable[[Mapping[str, Any], Display], str] | None
    ],
] = {
    "ply_minimum": (_ply_minimum_label, _ply_minimum_note),
    "bolt_edge_row": (None, _table_row_note),
    "cover_plate_weld": (None, _cover_weld_note),
    "rows_within": (None, _rows_within_note),
    "k_mod": (None, _k_mod_note),
    "rigid_share": (None, _rigid_share_note),
    "plate_slenderness": (None, _plate_slenderness_note),
    "iyc_ratio": (None, _iyc_ratio_note),
}


def _note(phrase: Phrase | None, note: str, d: Display) -> str:
    words = KINDS[phrase.kind][1] if phrase is not None else None
    if words is None:
        return note
    text = words(phrase.values, d)  # type: ignore[union-attr]  # words is set only with a phrase
    return f"{text}; {note}" if note else text


def check_label(c: Check, d: Display) -> str:
    """A check's label with its phrase's words in brackets, when the phrase adds to the label."""
    words = KINDS[c.phrase.kind][0] if c.phrase is not None else None
    return f"{c.label} ({words(c.phrase.values, d)})" if words is not None and c.phrase else c.label


def check_note(c: Check, d: Display) -> str:
    """A check's note: its phrase worded, then the solver's own words."""
    return _note(c.phrase, c.note, d)


def step_note(s: Step, d: Display) -> str:
    """A step's note: its phrase worded, then the solver's own words."""
    return _note(s.phrase, s.note, d)


def phrase_json(phrase: Phrase | None, d: Display) -> dict[str, Any]:
    """The JSON's ``phrase`` field (the data behind the worded label or note), only when set:
    ``{"phrase": {"kind": …, "values": {…}}}`` with quantities in the job's units."""
    if phrase is None:
        return {}
    return {"phrase": {"kind": phrase.kind, "values": {k: d.json_value(v) for k, v in phrase.values.items()}}}
