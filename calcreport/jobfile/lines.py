"""Best-effort map from TOML key paths to line numbers, for error messages.

tomllib gives no positions, so this scans the text once: it follows ``[table]`` and
``[[array.of.tables]]`` headers (counting array entries) and records the line of every
``key = value``. Keys inside inline tables or multi-line values map to the line of their parent.

Each line is read with plain string operations in time linear in its length (no regular
expression: a key pattern with overlapping repeats of spaces backtracks cubically on a long run of spaces,
which a multi-line string may hold). ``tests/test_harden_lines.py`` indexes a 2 MB adversarial
file; ``benchmarks/line_index.py`` prints the time.
"""

from __future__ import annotations

__all__ = ["LineIndex"]

#: Characters of a bare or quoted dotted key as this index understands it.
_KEY_CHARS = frozenset("ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789_-\"'. ")

Path = tuple  # of str (table/key names) and int (array index)


def _split_dotted(text: str) -> list[str]:
    return [p.strip().strip("\"'") for p in text.split(".")]


def _header(raw: str) -> tuple[str, str] | None:
    """``("[", name)`` or ``("[[", name)`` for a table header line, else None (linear time)."""
    s = raw.strip()
    if not s.startswith("["):
        return None
    opener = "[[" if s.startswith("[[") else "["
    close = s.find("]", len(opener))
    if close < 0:
        return None
    name = s[len(opener) : close].strip()
    if not name:
        return None
    rest = s[close + 1 :]
    if rest.startswith("]"):
        rest = rest[1:]
    rest = rest.lstrip()
    if rest and not rest.startswith("#"):
        return None
    return opener, name


def _key(raw: str) -> str | None:
    """The (dotted) key before the first ``=`` of a ``key = value`` line, else None (linear time)."""
    eq = raw.find("=")
    if eq < 0:
        return None
    key = raw[:eq].strip()
    if not key or not _KEY_CHARS.issuperset(key):
        return None
    return key


class LineIndex:
    """``line(path)`` → line number of the key at ``path`` (or its nearest ancestor)."""

    def __init__(self, text: str):
        self._lines: dict[Path, int] = {}
        counts: dict[Path, int] = {}
        current: Path = ()
        for number, raw in enumerate(text.splitlines(), start=1):
            m = _header(raw)
            if m:
                names = _split_dotted(m[1])
                path: list = []
                for name in names[:-1]:
                    path.append(name)
                    if tuple(path) in counts:
                        path.append(counts[tuple(path)] - 1)
                path.append(names[-1])
                if m[0] == "[[":
                    base = tuple(path)
                    counts[base] = counts.get(base, 0) + 1
                    path.append(counts[base] - 1)
                current = tuple(path)
                for k in range(1, len(current) + 1):  # a table first named by a sub-table header
                    self._lines.setdefault(current[:k], number)
                continue
            key = _key(raw)
            if key:
                self._lines.setdefault(current + tuple(_split_dotted(key)), number)

    def line(self, path: Path) -> int | None:
        """Line of ``path`` or of its nearest ancestor that has one; None if unknown."""
        path = tuple(path)
        while path:
            if path in self._lines:
                return self._lines[path]
            path = path[:-1]
        return None
