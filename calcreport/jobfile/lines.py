"""Best-effort map from TOML key paths to line numbers, for error messages.

tomllib gives no positions, so this scans the text once: it follows ``[table]`` and
``[[array.of.tables]]`` headers (counting array entries) and records the line of every
``key = value``. Keys inside inline tables or multi-line values map to the line of their parent.
"""

from __future__ import annotations

import re

__all__ = ["LineIndex"]

_HEADER = re.compile(r"^\s*(\[\[?)\s*([^\]]+?)\s*\]\]?\s*(#.*)?$")
_KEY = re.compile(r"^\s*([A-Za-z0-9_\-\"'. ]+?)\s*=")

Path = tuple  # of str (table/key names) and int (array index)


def _split_dotted(text: str) -> list[str]:
    return [p.strip().strip("\"'") for p in text.split(".")]


class LineIndex:
    """``line(path)`` → line number of the key at ``path`` (or its nearest ancestor)."""

    def __init__(self, text: str):
        self._lines: dict[Path, int] = {}
        counts: dict[Path, int] = {}
        current: Path = ()
        for number, raw in enumerate(text.splitlines(), start=1):
            m = _HEADER.match(raw)
            if m:
                names = _split_dotted(m.group(2))
                path: list = []
                for name in names[:-1]:
                    path.append(name)
                    if tuple(path) in counts:
                        path.append(counts[tuple(path)] - 1)
                path.append(names[-1])
                if m.group(1) == "[[":
                    base = tuple(path)
                    counts[base] = counts.get(base, 0) + 1
                    path.append(counts[base] - 1)
                current = tuple(path)
                for k in range(1, len(current) + 1):  # a table first named by a sub-table header
                    self._lines.setdefault(current[:k], number)
                continue
            km = _KEY.match(raw)
            if km:
                self._lines.setdefault(current + tuple(_split_dotted(km.group(1))), number)

    def line(self, path: Path) -> int | None:
        """Line of ``path`` or of its nearest ancestor that has one; None if unknown."""
        path = tuple(path)
        while path:
            if path in self._lines:
                return self._lines[path]
            path = path[:-1]
        return None
