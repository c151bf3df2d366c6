"""Identical joints stated once: which heading of steps follows an earlier one, step for step.

Two headings of the same kind (two joints, or two joints' schedules) are compared by their step
keys' suffixes (the part after ``joint.<id>.``) and, pair by pair, by what the report prints of each
step — label, symbol, substituted formula, result, source, note — as ``Display`` writes them. Words
that differ only by naming a part of the member (``top`` where the other says ``bot``) count as
the same when every such swap is the same one throughout; the report then says "with bot in place
of top". A joint follows an earlier one when its keys' suffixes are the same, every step of its
connector design (``connector.*``) is the same, and at least half of all its steps are; it then
shows only the steps that differ (its Q, q and what follows from them). This module compares text;
it computes no engineering value.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from typing import TYPE_CHECKING

from ...steps import Step
from ..fmt import Display
from ..phrases import step_note

if TYPE_CHECKING:
    from .derivations import Group

__all__ = ["Fold", "fold_groups", "step_texts"]

_TOKEN = re.compile(r"([\s,;:()\[\]])")


@dataclass(frozen=True)
class Fold:
    """A heading that follows ``base``: only the steps keyed in ``differ`` are shown."""

    base_gid: str
    base_title: str
    base_number: str
    differ: frozenset[str]
    substitutions: tuple[tuple[str, str], ...]  # (word of the base, word here)


def step_texts(s: Step, d: Display) -> tuple[str, ...]:
    """What the report prints of a step."""
    return (s.label, s.symbol, d.substituted(s), d.result(s), s.source, step_note(s, d))


def _suffix(gid: str, key: str) -> str:
    """The key below the joint: ``member.H1.joint.top-webs.connector.Z`` → ``connector.Z``."""
    jid = gid.split(".", 1)[1]
    marker = f".joint.{jid}."
    i = key.find(marker)
    return key[i + len(marker) :] if i >= 0 else key


def _swaps(a: str, b: str, names: set[str]) -> list[tuple[str, str]] | None:
    """The word swaps turning ``a`` into ``b`` when every differing word is a part name, else None."""
    ta, tb = _TOKEN.split(a), _TOKEN.split(b)
    if len(ta) != len(tb):
        return None
    out = []
    for x, y in zip(ta, tb):
        if x != y:
            if x not in names or y not in names:
                return None
            out.append((x, y))
    return out


def _compare(
    base: list[Step], here: list[Step], d: Display, names: set[str]
) -> tuple[set[str], dict[str, str]]:
    """Keys of ``here`` whose printed text differs from its pair in ``base``, and the part swaps."""
    differ: set[str] = set()
    swaps: dict[str, str] = {}
    pending: list[tuple[Step, list[tuple[str, str]]]] = []
    for a, b in zip(base, here):
        ta, tb = step_texts(a, d), step_texts(b, d)
        if ta == tb:
            continue
        found: list[tuple[str, str]] = []
        for x, y in zip(ta, tb):
            if x != y:
                w = _swaps(x, y, names)
                if w is None:
                    found = []
                    break
                found += w
        if not found:
            differ.add(b.key)
        else:
            pending.append((b, found))
    for b, found in pending:  # one consistent swap throughout, else the step is shown
        trial = dict(swaps)
        ok = True
        for x, y in found:
            if trial.setdefault(x, y) != y:
                ok = False
        if ok and len(set(trial.values())) == len(trial):
            swaps = trial
        else:
            differ.add(b.key)
    return differ, swaps


def _kind(gid: str) -> str:
    return gid.split(".", 1)[0]


def fold_groups(groups: list[Group], d: Display, part_ids: set[str]) -> dict[str, Fold]:
    """Headings that follow an earlier heading of the same kind (``joint.*``, ``schedule.*``)."""
    folds: dict[str, Fold] = {}
    for i, g in enumerate(groups):
        if _kind(g.gid) not in ("joint", "schedule"):
            continue
        here = [_suffix(g.gid, s.key) for s in g.steps]
        for base in groups[:i]:
            if _kind(base.gid) != _kind(g.gid) or base.gid in folds:
                continue
            if [_suffix(base.gid, s.key) for s in base.steps] != here:
                continue
            differ, swaps = _compare(base.steps, g.steps, d, part_ids)
            design = {s.key for s in g.steps if _suffix(g.gid, s.key).startswith("connector.")}
            if design & differ or 2 * len(differ) > len(g.steps):
                continue
            folds[g.gid] = Fold(
                base.gid, base.title, base.number, frozenset(differ), tuple(sorted(swaps.items()))
            )
            break
    return folds
