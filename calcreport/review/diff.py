"""Compare two revisions of a job: results (summary fields and derivation steps) and inputs.

The diff is data: lists of changes holding the old and new values as they are (quantities, steps,
raw TOML values). Renderers (:mod:`.diff_text`, :mod:`.change_report`) format them in the NEW
job's unit system. Nothing here computes an engineering value; it only lines up and compares.

* Results are compared by the stable step ``key`` of every derivation step and by the summary
  fields of the job, each member and each joint, with a relative tolerance. Zoned schedules are
  compared whole (:mod:`.diff_schedule`); their per-zone steps are not matched by number.
* Inputs are compared on the raw TOML documents. Arrays of tables are matched by their ``id``
  (``mark`` for revision history entries), not by position. A string that reads as a quantity with
  a unit is compared as a quantity, so ``"12 in"`` and ``"1 ft"`` are the same input.
* Input key paths use the same spelling as error messages: ``member[H1].joint[top].per_row``.
"""

from __future__ import annotations

import re
from collections.abc import Iterable
from dataclasses import dataclass
from typing import Any, TypeGuard

from ..model import Job
from ..solve.results import Check, JobResult, JointResult, MemberResult
from ..steps import Step
from ..units import Quantity, UnitParseError, parse
from .compare import RESULT_RTOL, same_value
from .diff_schedule import ScheduleChange, diff_schedules, is_zone_step, schedule_keys

__all__ = [
    "Side",
    "SummaryChange",
    "StepChange",
    "InputChange",
    "Entity",
    "JobDiff",
    "ScheduleChange",
    "compute_diff",
    "diff_results",
    "diff_inputs",
    "same_value",
    "same_input",
    "input_quantity",
    "changed_keys",
    "RESULT_RTOL",
    "INPUT_RTOL",
]

#: Inputs agree when they differ by less than this fraction (unit conversions are exact to ~1e-15).
INPUT_RTOL = 1e-9
#: Values of a table in an array of tables that identify it, in order of preference.
ID_KEYS = ("id", "mark")

_NUMBER = re.compile(r"^\s*[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*$")


@dataclass(frozen=True)
class Side:
    """One revision: a label for people, the validated job, its results and the raw TOML document."""

    label: str
    job: Job
    result: JobResult
    doc: dict


@dataclass(frozen=True)
class SummaryChange:
    """A changed summary field of the job, a member, a joint or a check.

    ``owner`` is ``"job"``, a member key ``member.H1``, a joint key ``member.H1.joint.top`` or a check
    key. ``kind`` is ``changed``, ``added`` (the owner exists only in the new revision) or
    ``removed``; for added/removed owners ``field`` is ``"status"``.
    """

    owner: str
    field: str
    label: str
    old: Any
    new: Any
    kind: str = "changed"


@dataclass(frozen=True)
class StepChange:
    """A derivation step whose result (or substituted values) changed, or that appeared/disappeared."""

    key: str
    old: Step | None
    new: Step | None
    result_changed: bool


@dataclass(frozen=True)
class InputChange:
    """A changed leaf of the job file: raw TOML values (``None`` when absent on that side)."""

    key: str
    old: Any
    new: Any


@dataclass(frozen=True)
class Entity:
    """A table of an array of tables (member, part, joint, load, material …) added or removed."""

    kind: str
    key: str
    id: str


@dataclass(frozen=True)
class JobDiff:
    old: Side
    new: Side
    summary: tuple[SummaryChange, ...]
    steps: tuple[StepChange, ...]
    inputs: tuple[InputChange, ...]
    added: tuple[Entity, ...]
    removed: tuple[Entity, ...]
    schedules: tuple[ScheduleChange, ...] = ()  # joints whose zoned schedule changed

    @property
    def results_changed(self) -> bool:
        """True when any result differs: the exit code 1 of ``calcreport diff``."""
        return bool(self.summary or self.schedules) or any(s.result_changed for s in self.steps)

    @property
    def inputs_changed(self) -> bool:
        return bool(self.inputs or self.added or self.removed)


# -- results --------------------------------------------------------------------------------------

_MEMBER_FIELDS = (("status", "status"), ("shear", "design shear V"))
_SECTION_FIELDS = (
    ("area", "transformed area A"),
    ("centroid", "neutral axis ȳ"),
    ("inertia", "moment of inertia I"),
    ("depth", "depth"),
)
_JOINT_FIELDS = (
    ("status", "status"),
    ("spacing_provided", "practical spacing"),
    ("spacing_required", "required spacing"),
    ("utilisation", "utilisation"),
    ("Q", "first moment Q"),
    ("shear_flow", "shear flow q"),
    ("shear", "design shear V"),
    ("capacity", "capacity per connector"),
    ("capacity_row", "capacity per row"),
    ("per_row", "connectors per row"),
    ("connector", "connector"),
    ("spacing_min", "minimum spacing"),
    ("spacing_max", "maximum spacing"),
)
_CHECK_FIELDS = (
    ("status", "status"),
    ("ratio", "utilisation"),
    ("demand", "demand"),
    ("capacity", "capacity"),
)


def _fields(
    owner: str, old: Any, new: Any, spec: Iterable[tuple[str, str]], out: list, prefix: str = ""
) -> None:
    for name, label in spec:
        a, b = getattr(old, name), getattr(new, name)
        if not same_value(a, b):
            out.append(SummaryChange(owner, prefix + name, label, a, b))


def _by_id(items: Iterable, attr: str = "id") -> dict:
    return {getattr(x, attr): x for x in items}


def _checks(old: Iterable[Check], new: Iterable[Check], out: list) -> None:
    a, b = _by_id(old, "key"), _by_id(new, "key")
    for key in list(a) + [k for k in b if k not in a]:
        if key in a and key in b:
            _fields(key, a[key], b[key], _CHECK_FIELDS, out)
        elif key in b:
            out.append(SummaryChange(key, "status", b[key].label, None, b[key].status, "added"))
        else:
            out.append(SummaryChange(key, "status", a[key].label, a[key].status, None, "removed"))


def _joint(owner: str, old: JointResult, new: JointResult, out: list) -> None:
    _fields(owner, old, new, _JOINT_FIELDS, out)
    _checks(old.checks, new.checks, out)


def _member(old: MemberResult, new: MemberResult, out: list) -> None:
    owner = f"member.{new.id}"
    _fields(owner, old, new, _MEMBER_FIELDS, out)
    _fields(owner, old.section, new.section, _SECTION_FIELDS, out, "section.")
    ja, jb = _by_id(old.joints), _by_id(new.joints)
    for jid in list(ja) + [j for j in jb if j not in ja]:
        jkey = f"{owner}.joint.{jid}"
        if jid in ja and jid in jb:
            _joint(jkey, ja[jid], jb[jid], out)
        elif jid in jb:
            out.append(SummaryChange(jkey, "status", "joint", None, jb[jid].status, "added"))
        else:
            out.append(SummaryChange(jkey, "status", "joint", ja[jid].status, None, "removed"))
    _checks(old.checks, new.checks, out)


def _all_steps(result: JobResult) -> dict[str, Step]:
    out: dict[str, Step] = {}
    for m in result.members:
        for s in m.steps:
            out[s.key] = s
    return out


def _under(key: str, owners: set[str]) -> bool:
    return any(key == o or key.startswith(o + ".") for o in owners)


def diff_results(old: JobResult, new: JobResult) -> tuple[list[SummaryChange], list[StepChange]]:
    """Changed summary fields and changed derivation steps, in the new revision's order."""
    summary: list[SummaryChange] = []
    if old.status != new.status:
        summary.append(SummaryChange("job", "status", "status", old.status, new.status))
    ma, mb = _by_id(old.members), _by_id(new.members)
    gone: set[str] = set()  # owners whose steps are not listed one by one
    for mid in list(mb) + [m for m in ma if m not in mb]:
        key = f"member.{mid}"
        if mid in ma and mid in mb:
            _member(ma[mid], mb[mid], summary)
        elif mid in mb:
            summary.append(SummaryChange(key, "status", "member", None, mb[mid].status, "added"))
            gone.add(key)
        else:
            summary.append(SummaryChange(key, "status", "member", ma[mid].status, None, "removed"))
            gone.add(key)
    gone |= {c.owner for c in summary if c.kind != "changed"}
    sa, sb = _all_steps(old), _all_steps(new)
    steps: list[StepChange] = []
    for key in list(sb) + [k for k in sa if k not in sb]:
        if _under(key, gone) or is_zone_step(key):  # zones: compared whole, see diff_schedule
            continue
        a, b = sa.get(key), sb.get(key)
        if a is None or b is None:
            steps.append(StepChange(key, a, b, True))
            continue
        res = not same_value(a.result, b.result)
        vals = not same_value(a.values, b.values)
        if res or vals:
            steps.append(StepChange(key, a, b, res))
    return summary, steps


# -- inputs -------------------------------------------------------------------------------------


def input_quantity(v: Any) -> Quantity | None:
    """A quantity when ``v`` is a number or a string that pint reads as a value WITH a unit.

    A dimensionless reading of a string counts only when the string is a plain number, so text
    such as a date ``"2026-11-24"`` is compared as text, not as the arithmetic 2026 − 11 − 24.
    """
    if isinstance(v, bool):
        return None
    if isinstance(v, (int, float)):
        return parse(v, None)
    if not isinstance(v, str) or not any(ch.isdigit() for ch in v):
        return None
    try:
        q = parse(v, None)
    except UnitParseError:
        return None
    if q.dimensionless and not _NUMBER.match(v):
        return None
    return q


def same_input(a: Any, b: Any, rtol: float = INPUT_RTOL) -> bool:
    """Raw job-file values equal in meaning: quantities by value, lists element-wise, text exactly."""
    if isinstance(a, list) and isinstance(b, list):
        return len(a) == len(b) and all(same_input(x, y, rtol) for x, y in zip(a, b))
    qa, qb = input_quantity(a), input_quantity(b)
    if qa is not None and qb is not None:
        return same_value(qa, qb, rtol)
    if isinstance(a, bool) or isinstance(b, bool):
        return type(a) is type(b) and a == b
    return type(a) is type(b) and a == b


def _is_table_array(v: Any) -> TypeGuard[list[dict]]:
    return isinstance(v, list) and bool(v) and all(isinstance(x, dict) for x in v)


def _ident(t: dict) -> str | None:
    for k in ID_KEYS:
        v = t.get(k)
        if isinstance(v, str) and v:
            return v
    return None


def _keyed(items: list[dict]) -> dict[str, dict]:
    """Tables keyed by id when every one has a distinct id, else by 1-based position."""
    ids = [_ident(t) for t in items]
    if all(ids) and len(set(ids)) == len(ids):
        return dict(zip(ids, items))  # type: ignore[arg-type]
    return {str(i + 1): t for i, t in enumerate(items)}


def _join(path: str, name: str) -> str:
    return f"{path}.{name}" if path else name


class _InputWalker:
    def __init__(self, rtol: float):
        self.rtol = rtol
        self.changes: list[InputChange] = []
        self.added: list[Entity] = []
        self.removed: list[Entity] = []

    def table(self, old: dict, new: dict, path: str) -> None:
        for name in list(old) + [k for k in new if k not in old]:
            a, b = old.get(name), new.get(name)
            key = _join(path, name)
            if _is_table_array(a) or _is_table_array(b):
                self.array(name, a if _is_table_array(a) else [], b if _is_table_array(b) else [], key)
            elif isinstance(a, dict) or isinstance(b, dict):
                self.table(a if isinstance(a, dict) else {}, b if isinstance(b, dict) else {}, key)
            elif name not in new or name not in old or not same_input(a, b, self.rtol):
                self.changes.append(InputChange(key, a, b))

    def array(self, kind: str, old: list[dict], new: list[dict], path: str) -> None:
        a, b = _keyed(old), _keyed(new)
        for ident in list(b) + [i for i in a if i not in b]:
            key = f"{path}[{ident}]"
            if ident in a and ident in b:
                self.table(a[ident], b[ident], key)
            elif ident in b:
                self.added.append(Entity(kind, key, ident))
            else:
                self.removed.append(Entity(kind, key, ident))


def diff_inputs(
    old_doc: dict, new_doc: dict, rtol: float = INPUT_RTOL
) -> tuple[list[InputChange], list[Entity], list[Entity]]:
    """Changed leaves, added tables and removed tables between two raw TOML documents."""
    w = _InputWalker(rtol)
    w.table(old_doc, new_doc, "")
    return w.changes, w.added, w.removed


# -- whole diff ----------------------------------------------------------------------------------


def compute_diff(old: Side, new: Side) -> JobDiff:
    """Everything that changed from ``old`` to ``new``."""
    summary, steps = diff_results(old.result, new.result)
    schedules = diff_schedules(old.result, new.result)
    # a changed schedule is shown whole: none of its steps is listed as having the same result
    whole = {c.key for c in schedules}
    steps = [s for s in steps if s.result_changed or not _under(s.key, whole)]
    inputs, added, removed = diff_inputs(old.doc, new.doc)
    return JobDiff(
        old, new, tuple(summary), tuple(steps), tuple(inputs), tuple(added), tuple(removed), tuple(schedules)
    )


def changed_keys(diff: JobDiff) -> frozenset[str]:
    """Keys a report marks with the revision triangle.

    Contains: every step key whose result or substituted values changed (and new steps); the owner
    key of every changed summary field (``member.H1``, ``member.H1.joint.top``, check keys); the key
    of every changed zoned schedule (``member.H1.joint.top.schedule``) and the step key of each of its
    zones the old schedule does not have (``member.H1.joint.top.schedule.zone.2``); the input key path of every changed leaf (``member[H1].shear``) and of every added table
    (``member[H1].part[cover]``). A report may mark a heading when any key starts with its prefix.
    """
    keys: set[str] = set()
    keys.update(s.key for s in diff.steps if s.new is not None)
    keys.update(c.owner for c in diff.summary if c.new is not None)
    keys.update(c.key for c in diff.inputs)
    keys.update(e.key for e in diff.added)
    keys.update(schedule_keys(diff.schedules))
    return frozenset(keys)
