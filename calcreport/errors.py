"""Errors that reach the user as one line and exit code 2."""

from __future__ import annotations

__all__ = ["JobError", "UsageError", "one_line"]


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


class UsageError(Exception):
    """Wrong command-line use (exit code 2)."""
