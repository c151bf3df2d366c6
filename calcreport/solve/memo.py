"""A small memo for solver work that depends on a member's geometry only (node positions,
supports, output stations) and not on its loads: members laid out alike — a job of many equal
stringers, say — share the stiffness matrix and the influence lines instead of building them
again. The values kept are the ones a fresh computation gives (same inputs, same float
operations), and their arrays are made read-only, since every member that hits the entry shares
them.

A value is kept only when its key comes round a second time (the first sighting records the
key's hash alone), so a job whose members are all laid out differently keeps nothing and pays
nothing beyond the keys; bounded by bytes (least recently used first out), so a job of large
meshes keeps no more than the limit alive after their members are solved. Plain floats only; no
quantities, no text.
"""

from __future__ import annotations

from collections import OrderedDict
from collections.abc import Hashable
from typing import Any

import numpy as np

__all__ = ["ByteMemo", "float_key", "freeze"]


def float_key(v: float) -> str:
    """A float as an exact key (``-0.0`` and ``0.0`` apart, every bit kept)."""
    return float(v).hex()


def freeze(*arrays: np.ndarray) -> None:
    """Make shared arrays read-only: a caller that tried to change one would raise, not leak
    into another member."""
    for a in arrays:
        a.flags.writeable = False


class ByteMemo:
    """Values by key, at most ``limit`` bytes in all (as the caller sizes each entry); an entry
    larger than the limit is not kept, nor one whose key is seen for the first time."""

    SEEN = 4096  # hashes of keys seen once, remembered (a few tens of kB)

    def __init__(self, limit: int) -> None:
        self.limit = limit
        self._items: OrderedDict[Hashable, tuple[Any, int]] = OrderedDict()
        self._bytes = 0
        self._seen: OrderedDict[int, None] = OrderedDict()

    def get(self, key: Hashable) -> Any | None:
        hit = self._items.get(key)
        if hit is None:
            return None
        self._items.move_to_end(key)
        return hit[0]

    def put(self, key: Hashable, value: Any, nbytes: int) -> None:
        if nbytes > self.limit or key in self._items:
            return
        h = hash(key)
        if h not in self._seen:  # first sighting: remember the key only
            self._seen[h] = None
            if len(self._seen) > self.SEEN:
                self._seen.popitem(last=False)
            return
        self._items[key] = (value, nbytes)
        self._bytes += nbytes
        while self._bytes > self.limit:
            _, (_, size) = self._items.popitem(last=False)
            self._bytes -= size

    def clear(self) -> None:
        self._items.clear()
        self._seen.clear()
        self._bytes = 0

    def __len__(self) -> int:
        return len(self._items)
