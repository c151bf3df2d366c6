"""Render a :class:`~calcreport.review.diff.JobDiff` as terminal text or as JSON-ready data.

Every result value is shown in the NEW job's unit system (:class:`~calcreport.outputs.fmt.Display`).
Inputs are shown as written in the job files; when a quantity was rewritten in other units, the
two values converted to the new job's units follow in parentheses.
"""

from __future__ import annotations

import datetime as _dt
from typing import Any

from .. import __version__
from ..outputs.fmt import Display
from ..steps import Step
from ..units import Quantity
from .diff import (
    Entity,
    InputChange,
    JobDiff,
    ScheduleChange,
    Side,
    StepChange,
    SummaryChange,
    input_quantity,
)
from .diff_schedule import figures_text, zone_text

__all__ = [
    "render_diff",
    "diff_to_dict",
    "display_for",
    "value_pair",
    "input_text",
    "owner_title",
    "check_titles",
    "schedule_lines",
    "input_pair",
    "FIELD_SIG",
    "DIFF_SCHEMA_VERSION",
]

DIFF_SCHEMA_VERSION = 1
ARROW = "→"
ABSENT = "(absent)"
#: significant figures per summary field (the terminal table uses 3 for the practical spacing)
FIELD_SIG = {"utilisation": 2, "ratio": 2, "spacing_provided": 3}


def display_for(side: Side) -> Display:
    s = side.job.settings
    return Display(s.units, s.display)


def _text(d: Display, v: Any, sig: int) -> str:
    if v is None:
        return "—"
    return d.value(v, sig)


def value_pair(d: Display, old: Any, new: Any, sig: int = 4) -> tuple[str, str]:
    """Both values as text; more significant figures until they read differently (up to 8)."""
    a, b = _text(d, old, sig), _text(d, new, sig)
    while a == b and sig < 8 and (isinstance(old, (Quantity, float)) or isinstance(new, (Quantity, float))):
        sig += 1
        a, b = _text(d, old, sig), _text(d, new, sig)
    return a, b


def check_titles(diff: JobDiff) -> dict[str, str]:
    """Check key → its label (the new revision's where both have it); a label that two checks of
    the job share keeps the key in parentheses: ``End distance from the member end (member[B1]…)``."""
    labels: dict[str, str] = {}
    for side in (diff.old, diff.new):
        for m in side.result.members:
            for c in (*m.checks, *(c for j in m.joints for c in j.checks)):
                labels[c.key] = c.label
    keys_of: dict[str, set[str]] = {}
    for key, label in labels.items():
        keys_of.setdefault(label, set()).add(key)
    return {k: lab if len(keys_of[lab]) == 1 else f"{lab} ({k})" for k, lab in labels.items()}


def owner_title(owner: str, titles: dict[str, str] | None = None) -> str:
    """``member.H1.joint.top`` → ``member H1, joint top``; a check key → its title from ``titles``
    (:func:`check_titles`); other keys are shown as they are."""
    if titles and owner in titles:
        return titles[owner]
    if owner == "job":
        return "job"
    parts = owner.split(".")
    if len(parts) == 2 and parts[0] == "member":
        return f"member {parts[1]}"
    if len(parts) == 4 and parts[0] == "member" and parts[2] == "joint":
        return f"member {parts[1]}, joint {parts[3]}"
    return owner


def _raw(v: Any) -> Any:
    """A raw TOML value as JSON-ready data (dates and times become ISO text)."""
    if isinstance(v, (_dt.date, _dt.time, _dt.datetime)):
        return v.isoformat()
    if isinstance(v, list):
        return [_raw(x) for x in v]
    if isinstance(v, dict):
        return {str(k): _raw(x) for k, x in v.items()}
    return v


def input_text(v: Any) -> str:
    """A raw job-file value as written: text in quotes, lists in brackets, absent as ``(absent)``."""
    if v is None:
        return ABSENT
    if isinstance(v, bool):
        return "true" if v else "false"
    if isinstance(v, str):
        return '"' + v.replace("\\", "\\\\").replace('"', '\\"') + '"'
    if isinstance(v, list):
        return "[" + ", ".join(input_text(x) for x in v) + "]"
    if isinstance(v, dict):
        return "{" + ", ".join(f"{k} = {input_text(x)}" for k, x in v.items()) + "}"
    if isinstance(v, float):
        return repr(v)
    return str(_raw(v))


def input_pair(d: Display, c: InputChange) -> tuple[str, str, str]:
    """Old and new as written, plus both in the new job's units when the units were rewritten."""
    old, new = input_text(c.old), input_text(c.new)
    qa, qb = input_quantity(c.old), input_quantity(c.new)
    hint = ""
    if (
        qa is not None
        and qb is not None
        and not qa.dimensionless
        and qa.dimensionality == qb.dimensionality
        and qa.units != qb.units
    ):
        a, b = value_pair(d, qa, qb)
        hint = f"{a} {ARROW} {b}"
    return old, new, hint


def _step_line(d: Display, c: StepChange) -> str:
    s = c.new or c.old
    assert s is not None
    head = f"{c.key}  {s.label}  ({s.symbol})"
    if c.old is None:
        return f"{head}: new step = {d.value(s.result)}"
    if c.new is None:
        return f"{head}: step no longer made (was {d.value(c.old.result)})"
    if not c.result_changed:
        return (
            f"{head}: result unchanged {d.result(c.new)}; values {d.substituted(c.old)} {ARROW} "
            f"{d.substituted(c.new)}"
        )
    a, b = value_pair(d, c.old.result, c.new.result)
    return f"{head}: {a} {ARROW} {b}"


def schedule_lines(d: Display, c: ScheduleChange) -> list[str]:
    """A changed schedule: what changed, then the old and the new zone list with N."""
    lines = [f"{owner_title(c.owner)}: connector schedule changed ({', '.join(c.changed)})"]
    for tag, sch, fresh in (("was", c.old, ()), ("now", c.new, c.new_zones)):
        lines.append(f"  {tag}: {figures_text(d, sch)}")
        for k, z in enumerate(getattr(sch, "zones", ()) or (), 1):
            lines.append(f"    zone {k}  {zone_text(d, z)}" + ("   (changed)" if k in fresh else ""))
    return lines


def _summary_lines(d: Display, changes: tuple[SummaryChange, ...], titles: dict[str, str]) -> list[str]:
    groups: dict[str, list[SummaryChange]] = {}
    for c in changes:
        groups.setdefault(c.owner, []).append(c)
    lines: list[str] = []
    for owner, items in groups.items():
        title = owner_title(owner, titles)
        if len(items) == 1 and items[0].kind != "changed":
            c = items[0]
            state = f"added (status {c.new})" if c.kind == "added" else f"removed (was {c.old})"
            lines.append(f"  {title}: {c.label} {state}")
            continue
        lines.append(f"  {title}:")
        width = max(len(c.label) for c in items)
        for c in items:
            a, b = value_pair(d, c.old, c.new, FIELD_SIG.get(c.field.split(".")[-1], 4))
            lines.append(f"      {c.label.ljust(width)}  {a} {ARROW} {b}")
    return lines


def render_diff(diff: JobDiff) -> str:
    """The text printed by ``calcreport diff``."""
    d = display_for(diff.new)
    lines = [f"calcreport diff: {diff.old.label} {ARROW} {diff.new.label}"]
    for tag, side in (("old", diff.old), ("new", diff.new)):
        h = side.job.header
        lines.append(f"  {tag}: {side.label}  revision {h.revision or '—'}  sha256 {side.job.sha256[:12]}")
    real_steps = [s for s in diff.steps if s.result_changed]
    value_steps = [s for s in diff.steps if not s.result_changed]
    if diff.summary or diff.schedules or real_steps:
        lines += ["", f"RESULTS CHANGED (values in {d.system} units)"]
        lines += _summary_lines(d, diff.summary, check_titles(diff))
        if diff.schedules:
            lines.append("  connector schedules (zones matched by position along the member, not by number):")
            lines += [f"      {t}" for c in diff.schedules for t in schedule_lines(d, c)]
        if real_steps:
            lines.append("  derivation steps:")
            lines += [f"      {_step_line(d, s)}" for s in real_steps]
    if value_steps:
        lines += ["", "STEPS WITH CHANGED VALUES BUT THE SAME RESULT"]
        lines += [f"  {_step_line(d, s)}" for s in value_steps]
    if diff.inputs:
        lines += ["", "INPUTS CHANGED"]
        for c in diff.inputs:
            old, new, hint = input_pair(d, c)
            lines.append(f"  {c.key}: {old} {ARROW} {new}" + (f"   ({hint})" if hint else ""))
    for title, items in (("ADDED", diff.added), ("REMOVED", diff.removed)):
        if items:
            lines += ["", title]
            lines += [f"  {e.kind} {e.id}  ({e.key})" for e in items]
    lines.append("")
    if diff.results_changed:
        lines.append("Results changed.")
    elif diff.inputs_changed or diff.steps:
        lines.append("No result changed (inputs changed only).")
    else:
        lines.append("No change.")
    return "\n".join(lines) + "\n"


# -- JSON ------------------------------------------------------------------------------------------


def _side(side: Side) -> dict[str, Any]:
    h = side.job.header
    return {
        "label": side.label,
        "revision": h.revision,
        "sha256": side.job.sha256,
        "status": side.result.status,
    }


def _step(d: Display, s: Step | None) -> dict[str, Any] | None:
    if s is None:
        return None
    return {"result": d.json_value(s.result), "substituted": d.substituted(s)}


def _entity(e: Entity) -> dict[str, str]:
    return {"kind": e.kind, "key": e.key, "id": e.id}


def _schedule(d: Display, s: Any) -> dict[str, Any] | None:
    if s is None:
        return None
    return {
        "status": s.status,
        "count": s.count,
        "count_min": d.json_value(s.count_min),
        "ratio": d.json_value(s.ratio),
        "count_single": s.count_single,
        "zones": [
            {
                "start": d.json_value(z.start),
                "end": d.json_value(z.end),
                "spacing": d.json_value(z.spacing),
                "count": z.count,
            }
            for z in s.zones
        ],
    }


def diff_to_dict(diff: JobDiff) -> dict[str, Any]:
    """The diff as JSON-ready data (schema in docs/review.md); values in the new job's units."""
    d = display_for(diff.new)
    titles = check_titles(diff)
    return {
        "schema": DIFF_SCHEMA_VERSION,
        "tool": {"name": "calcreport", "version": __version__},
        "old": _side(diff.old),
        "new": _side(diff.new),
        "units": d.system,
        "results_changed": diff.results_changed,
        "inputs_changed": diff.inputs_changed,
        "results": [
            {
                "owner": c.owner,
                "owner_title": owner_title(c.owner, titles),
                "field": c.field,
                "label": c.label,
                "kind": c.kind,
                "old": d.json_value(c.old),
                "new": d.json_value(c.new),
            }
            for c in diff.summary
        ],
        "schedules": [
            {
                "owner": c.owner,
                "key": c.key,
                "changed": list(c.changed),
                "new_zones": list(c.new_zones),
                "old": _schedule(d, c.old),
                "new": _schedule(d, c.new),
            }
            for c in diff.schedules
        ],
        "steps": [
            {
                "key": s.key,
                "label": (s.new or s.old).label,  # type: ignore[union-attr]  # one side exists
                "symbol": (s.new or s.old).symbol,  # type: ignore[union-attr]
                "result_changed": s.result_changed,
                "old": _step(d, s.old),
                "new": _step(d, s.new),
            }
            for s in diff.steps
        ],
        "inputs": [{"key": c.key, "old": _raw(c.old), "new": _raw(c.new)} for c in diff.inputs],
        "added": [_entity(e) for e in diff.added],
        "removed": [_entity(e) for e in diff.removed],
    }
