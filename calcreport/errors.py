"""Errors that reach the user as one line and exit code 2."""

from __future__ import annotations

__all__ = ["JobError", "one_line", "EXIT_OK", "EXIT_NG", "EXIT_INVALID"]

#: Exit codes of every command: 0 all OK (diff: no result changed; verify: match), 1 some NG
#: (diff: some result changed; verify: mismatch), 2 invalid input or usage (nothing written).
EXIT_OK, EXIT_NG, EXIT_INVALID = 0, 1, 2


class JobError(Exception):
    """Invalid input: names the file, the key path, the line where known, and what was expected."""

    def __init__(self, path: str, key: str, message: str, line: int | None = None):
        super().__init__(message)
        self.path = path
        self.key = key
        self.message = message
        self.line = line

    def __str__(self) -> str:
        where = f"{self.path}:{self.line}" if self.line else self.path
        key = f" {self.key}:" if self.key else ""
        return one_line(f"{where}:{key} {self.message}")


def one_line(text: str) -> str:
    """``text`` with control and line-breaking characters shown as escapes, so that a message
    quoting the job file stays on one line."""
    return "".join(c if (c.isprintable() or c == " ") else repr(c)[1:-1] for c in text)
