"""Errors that reach the user as one line and exit code 2."""

from __future__ import annotations

__all__ = ["JobError", "one_line", "excerpt", "EXCERPT_CHARS", "EXIT_OK", "EXIT_NG", "EXIT_INVALID"]

#: Exit codes of every command: 0 all OK (diff: no result changed; verify: match), 1 some NG
#: (diff: some result changed; verify: mismatch), 2 invalid input or usage (nothing written).
EXIT_OK, EXIT_NG, EXIT_INVALID = 0, 1, 2

#: An echoed value in an error line is cut to about this many characters.
EXCERPT_CHARS = 80


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
        shown = self.key if len(self.key) <= 2 * EXCERPT_CHARS else self.key[: 2 * EXCERPT_CHARS - 1] + "…"
        key = f" {shown}:" if self.key else ""
        return one_line(f"{where}:{key} {self.message}")


def one_line(text: str) -> str:
    """``text`` with control and line-breaking characters shown as escapes, so that a message
    quoting the job file stays on one line."""
    return "".join(c if (c.isprintable() or c == " ") else repr(c)[1:-1] for c in text)


def excerpt(value: object, limit: int = EXCERPT_CHARS) -> str:
    """A value quoted in an error line: its repr, on one line, cut to about ``limit`` characters
    with "…" — so a message never carries a long text (or another file's content) whole."""
    text = one_line(repr(value))
    return text if len(text) <= limit else text[: max(8, limit - 1)] + "…"
