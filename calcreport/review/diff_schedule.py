"""Compare the zoned connector schedules of two revisions, joint by joint, each as a whole.

A joint's schedule (:class:`calcreport.solve.schedule.Schedule`, loads along the member) is
compared by its zone list — start, end, spacing and connector rows of every zone, in order — and by
its economy figures N, N_min, N/N_min and N_single (and its status). When anything of these
differs, the schedule changed: :mod:`.diff` counts it as a changed result and the renderers print
the old and the new zone list with N.

Zones are never matched by their number: zone 2 of one revision may cover quite another stretch of
the member than zone 2 of the other. So the per-zone derivation steps (``….schedule.zone.2``) are
left out of the step-by-step comparison (:func:`is_zone_step`); a zone of the new schedule counts as
unchanged only when the old schedule has a zone with the same start, end, spacing and count.

Nothing here computes an engineering value: it lines the solver's records up and compares them.
"""

from __future__ import annotations

import re
from collections.abc import Iterable
from dataclasses import dataclass
from typing import Any

from ..outputs.fmt import Display
from ..solve.results import JobResult
from .compare import same_value

__all__ = [
    "ScheduleChange",
    "diff_schedules",
    "is_zone_step",
    "same_zone",
    "schedule_keys",
    "zone_text",
    "figures_text",
    "FIGURES",
    "ZONE_FIELDS",
]

#: Economy figures of a schedule compared as a whole: (attribute, printed name).
FIGURES = (
    ("status", "status"),
    ("count", "N"),
    ("count_min", "N_min"),
    ("ratio", "N/N_min"),
    ("count_single", "N_single"),
)
#: What makes two zones the same zone.
ZONE_FIELDS = ("start", "end", "spacing", "count")

_ZONE_STEP = re.compile(r"\.schedule\.zone\.\d+$")


@dataclass(frozen=True)
class ScheduleChange:
    """A joint whose zoned schedule changed (``old`` or ``new`` is ``None`` where it has none).

    ``owner`` is the joint key ``member.RB1.joint.top-webs``; ``key`` the schedule's key
    ``member.RB1.joint.top-webs.schedule`` (the prefix of its derivation steps). ``changed`` names
    what differs: ``zones`` and/or the printed names of :data:`FIGURES`. ``new_zones`` are the
    1-based numbers of the new schedule's zones that the old schedule does not have.
    """

    owner: str
    old: Any
    new: Any
    changed: tuple[str, ...]
    new_zones: tuple[int, ...]

    @property
    def key(self) -> str:
        return f"{self.owner}.schedule"


def is_zone_step(key: str) -> bool:
    """True for a per-zone schedule step (``member.RB1.joint.top-webs.schedule.zone.2``)."""
    return bool(_ZONE_STEP.search(key))


def same_zone(a: Any, b: Any) -> bool:
    """Same start, end, spacing and connector rows."""
    return all(same_value(getattr(a, f), getattr(b, f)) for f in ZONE_FIELDS)


def _zones(s: Any) -> tuple:
    return tuple(getattr(s, "zones", ()) or ()) if s is not None else ()


def _compare(owner: str, old: Any, new: Any) -> ScheduleChange | None:
    za, zb = _zones(old), _zones(new)
    changed: list[str] = []
    if (old is None) != (new is None) or len(za) != len(zb) or not all(map(same_zone, za, zb)):
        changed.append("zones")
    for attr, name in FIGURES:
        if not same_value(getattr(old, attr, None), getattr(new, attr, None)):
            changed.append(name)
    if not changed:
        return None
    fresh = tuple(k for k, z in enumerate(zb, 1) if not any(same_zone(z, y) for y in za))
    return ScheduleChange(owner, old, new, tuple(changed), fresh)


def diff_schedules(old: JobResult, new: JobResult) -> list[ScheduleChange]:
    """Changed schedules of the joints found in both revisions, in the new revision's order.

    A member or joint on one side only is reported as added or removed by :mod:`.diff`, not here.
    """
    out: list[ScheduleChange] = []
    members = {m.id: m for m in old.members}
    for m in new.members:
        if m.id not in members:
            continue
        joints = {j.id: j for j in members[m.id].joints}
        for j in m.joints:
            if j.id in joints:
                c = _compare(f"member.{m.id}.joint.{j.id}", joints[j.id].schedule, j.schedule)
                if c is not None:
                    out.append(c)
    return out


def schedule_keys(changes: Iterable[ScheduleChange]) -> set[str]:
    """Report keys of changed schedules: each schedule's key and the step key of every new zone."""
    keys: set[str] = set()
    for c in changes:
        keys.add(c.key)
        names = {f"{c.key}.zone.{k}" for k in c.new_zones}
        keys.update(s.key for s in getattr(c.new, "steps", ()) or () if s.key in names)
    return keys


# -- text shared by the renderers (diff_text, change_report) --------------------------------------


def zone_text(d: Display, z: Any) -> str:
    """``0" – 10'-9" @ 3.500 in, 38 rows``: positions as drawings give them, spacing as a quantity."""
    return f"{d.position(z.start)} – {d.position(z.end)} @ {d.quantity(z.spacing)}, {d.value(z.count)} rows"


def figures_text(d: Display, s: Any) -> str:
    """``N = 110 rows (N_min = 80.14, N/N_min = 1.373, N_single = 169)``, or why there is none."""
    if s is None:
        return "no zoned schedule"
    if not getattr(s, "feasible", True):
        return (
            f"no schedule satisfies the rules ({s.reason})" if s.reason else "no schedule satisfies the rules"
        )

    def v(x: Any) -> str:
        return "—" if x is None else d.value(x)

    return (
        f"N = {v(s.count)} rows (N_min = {v(s.count_min)}, N/N_min = {v(s.ratio)}, "
        f"N_single = {v(s.count_single)})"
    )
