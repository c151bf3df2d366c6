"""The values of one TOML table: typed getters (text, quantities, numbers, flags, choices), each
recording its key as known, and errors located at the key. :class:`calcreport.jobfile.reader.Table`
adds the nested tables, the declared keys and the unknown-key checks."""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass, field
from typing import Any, Literal, overload

from ..errors import JobError, excerpt
from ..model import JobWarning, WrittenValue
from ..units import Quantity, UnitParseError, parse_value
from .lines import LineIndex

__all__ = ["Source", "Values", "MAX_TEXT", "MAX_LINES", "suggest", "kind_of"]

MAX_TEXT = 2000
#: Lines in one list of text (notes, assumptions); each is printed in the report (ours, no source).
MAX_LINES = 50


@dataclass
class Source:
    """The file being read: its name for messages and its line index; the values written as
    products or quotients and the warnings collected while reading."""

    path: str
    lines: LineIndex
    written: list[WrittenValue] = field(default_factory=list)
    warnings: list[JobWarning] = field(default_factory=list)


class Values:
    """The typed getters of one table of the job file, with its key path for messages. Every
    getter records the key as known (``_known``), for :meth:`calcreport.jobfile.reader.Table.done`."""

    def __init__(self, data: Any, src: Source, path: tuple, label: str):
        self.src = src
        self.path = path
        self.label = label
        if not isinstance(data, dict):
            raise self._error_at(path, label, f"expected a table, got {kind_of(data)}")
        self.data = data
        self._known: set[str] = set()

    # -- errors ---------------------------------------------------------------------------
    def _error_at(self, path: tuple, label: str, message: str) -> JobError:
        return JobError(self.src.path, label, message, self.src.lines.line(path))

    def error(self, name: str | None, message: str) -> JobError:
        """A JobError located at key ``name`` of this table (or the table itself)."""
        if name is None:
            return self._error_at(self.path, self.label, message)
        return self._error_at(self.path + (name,), self.key(name), message)

    def key(self, name: str) -> str:
        return f"{self.label}.{name}" if self.label else name

    def warn(self, name: str, message: str) -> None:
        """Record that key ``name`` has no effect here (see :class:`calcreport.model.JobWarning`)."""
        self._known.add(name)
        self.src.warnings.append(
            JobWarning(self.key(name), self.src.lines.line(self.path + (name,)), message)
        )

    # -- getters ----------------------------------------------------------------------------
    def has(self, name: str) -> bool:
        return name in self.data

    def raw(self, name: str, required: bool = False, what: str = "a value") -> Any:
        self._known.add(name)
        if name not in self.data:
            if required:
                import difflib  # only for an error message (start-up stays light)

                typo = difflib.get_close_matches(name, [str(k) for k in self.data], n=1, cutoff=0.75)
                if typo:
                    raise self.error(typo[0], f"unknown key '{typo[0]}' (did you mean '{name}'?)")
                raise self.error(None, f"missing required key '{name}' ({what})")
            return None
        return self.data[name]

    def text(self, name: str, required: bool = False, default: str = "") -> str:
        v = self.raw(name, required, "text")
        if v is None:
            return default
        if isinstance(v, (int, float)) and not isinstance(v, bool):  # not read back as written
            shown = repr(v) if isinstance(v, int) or math.isfinite(v) else "…"
            raise self.error(name, f'expected text in quotes (like {name} = "{shown}"), got {kind_of(v)}')
        if not isinstance(v, str):
            raise self.error(name, f"expected text, got {kind_of(v)}")
        if len(v) > MAX_TEXT:
            raise self.error(name, f"expected text of at most {MAX_TEXT} characters, got {len(v)}")
        return v

    def ident(self, name: str = "id", required: bool = True) -> str:
        """A short id that other keys refer to: 1 to 60 printable characters, no line breaks or
        tabs, no leading or trailing spaces."""
        v = self.text(name, required)
        if not v and not required:
            return v
        if not (0 < len(v) <= 60) or v != v.strip() or not all(c.isprintable() for c in v):
            raise self.error(
                name, f'expected a short id (1 to 60 printable characters, like "top_flange"), got {v[:40]!r}'
            )
        return v

    def texts(self, name: str, limit: int | None = None) -> tuple[str, ...]:
        """A list of text lines (notes, assumptions): at most ``limit`` (default MAX_LINES) lines,
        refused by count before any line is looked at — each line becomes report text."""
        limit = MAX_LINES if limit is None else limit
        v = self.raw(name)
        if v is None:
            return ()
        if isinstance(v, str):
            v = [v]
        if isinstance(v, list) and len(v) > limit:
            raise self.error(name, f"expected at most {limit} lines, got {len(v):,}")
        if not isinstance(v, list) or not all(isinstance(s, str) for s in v):
            raise self.error(name, "expected a list of text lines")
        if any(len(s) > MAX_TEXT for s in v):
            raise self.error(name, f"expected lines of at most {MAX_TEXT} characters")
        return tuple(v)

    @overload
    def quantity(
        self,
        name: str,
        dim: str,
        required: Literal[True],
        positive: bool = ...,
        default: Quantity | None = ...,
        allow_zero: bool = ...,
    ) -> Quantity: ...
    @overload
    def quantity(
        self,
        name: str,
        dim: str,
        required: bool = ...,
        positive: bool = ...,
        *,
        default: Quantity,
        allow_zero: bool = ...,
    ) -> Quantity: ...
    @overload
    def quantity(
        self,
        name: str,
        dim: str,
        required: bool = ...,
        positive: bool = ...,
        default: Quantity | None = ...,
        allow_zero: bool = ...,
    ) -> Quantity | None: ...
    def quantity(
        self,
        name: str,
        dim: str,
        required: bool = False,
        positive: bool = True,
        default: Quantity | None = None,
        allow_zero: bool = False,
    ) -> Quantity | None:
        v = self.raw(name, required, f"a {dim.replace('_', ' ')} with its unit")
        if v is None:
            return default
        return self.parse_quantity(name, v, dim, positive, allow_zero)

    def parse_quantity(
        self, name: str | tuple, v: Any, dim: str, positive: bool = True, allow_zero: bool = False
    ) -> Quantity:
        """Parse ``v`` as a quantity of dimension ``dim``; ``name`` may be a sub-path tuple."""
        sub = name if isinstance(name, tuple) else (name,)
        label = self.label + "".join(f"[{s}]" if isinstance(s, int) else f".{s}" for s in sub)
        try:
            read = parse_value(v, dim)
        except UnitParseError as exc:
            raise self._error_at(self.path + sub, label.lstrip("."), str(exc)) from None
        q = read.quantity
        if read.arithmetic:
            self.src.written.append(
                WrittenValue(label.lstrip("."), self.src.lines.line(self.path + sub), str(v), q)
            )
        mag = float(q.magnitude)
        if positive and (mag < 0 or (mag == 0 and not allow_zero)):
            raise self._error_at(
                self.path + sub, label.lstrip("."), f"expected a value greater than zero, got {v!r}"
            )
        return q

    @overload
    def integer(
        self, name: str, default: int, minimum: int = ..., maximum: int = ..., required: bool = ...
    ) -> int: ...
    @overload
    def integer(
        self, name: str, default: None = ..., minimum: int = ..., maximum: int = ..., required: bool = ...
    ) -> int | None: ...
    def integer(
        self,
        name: str,
        default: int | None = None,
        minimum: int = 1,
        maximum: int = 10_000,
        required: bool = False,
    ) -> int | None:
        v = self.raw(name, required, "a whole number")
        if v is None:
            return default
        if isinstance(v, bool) or not isinstance(v, int):
            raise self.error(name, f"expected a whole number, got {kind_of(v)}")
        if not minimum <= v <= maximum:
            raise self.error(name, f"expected a whole number from {minimum} to {maximum}, got {v}")
        return v

    @overload
    def number(
        self,
        name: str,
        default: float | None = ...,
        *,
        required: Literal[True],
        minimum: float | None = ...,
        maximum: float | None = ...,
    ) -> float: ...
    @overload
    def number(
        self,
        name: str,
        default: float,
        required: bool = ...,
        minimum: float | None = ...,
        maximum: float | None = ...,
    ) -> float: ...
    @overload
    def number(
        self,
        name: str,
        default: None = ...,
        required: bool = ...,
        minimum: float | None = ...,
        maximum: float | None = ...,
    ) -> float | None: ...
    def number(
        self,
        name: str,
        default: float | None = None,
        required: bool = False,
        minimum: float | None = None,
        maximum: float | None = None,
    ) -> float | None:
        v = self.raw(name, required, "a number")
        if v is None:
            return default
        if isinstance(v, bool) or not isinstance(v, (int, float)) or not math.isfinite(v):
            raise self.error(name, f"expected a plain number, got {kind_of(v)}")
        if v != 0 and abs(v) < 2.2250738585072014e-308:  # subnormal: digits already lost
            raise self.error(name, f"expected a plain number, got {kind_of(v)} (too small to hold exactly)")
        if (minimum is not None and v < minimum) or (maximum is not None and v > maximum):
            raise self.error(name, f"expected a number from {minimum} to {maximum}, got {v}")
        return float(v)

    def boolean(self, name: str, default: bool = False) -> bool:
        v = self.raw(name)
        if v is None:
            return default
        if not isinstance(v, bool):
            raise self.error(name, f"expected true or false, got {kind_of(v)}")
        return v

    @overload
    def choice(
        self, name: str, choices: Iterable[str], default: str, required: bool = ..., fold_case: bool = ...
    ) -> str: ...
    @overload
    def choice(
        self,
        name: str,
        choices: Iterable[str],
        default: None = ...,
        *,
        required: Literal[True],
        fold_case: bool = ...,
    ) -> str: ...
    @overload
    def choice(
        self,
        name: str,
        choices: Iterable[str],
        default: None = ...,
        required: bool = ...,
        fold_case: bool = ...,
    ) -> str | None: ...
    def choice(
        self,
        name: str,
        choices: Iterable[str],
        default: str | None = None,
        required: bool = False,
        fold_case: bool = True,
    ) -> str | None:
        choices = list(choices)
        v = self.raw(name, required, "one of " + ", ".join(choices))
        if v is None:
            return default
        if not isinstance(v, str):
            raise self.error(name, f"expected one of {', '.join(choices)}, got {kind_of(v)}")
        for c in choices:
            if v == c or (fold_case and v.lower() == c.lower()):
                return c
        hint = suggest(v, choices)
        raise self.error(name, f"expected one of {', '.join(choices)}, got {excerpt(v)}{hint}")


def suggest(word: str, options: Iterable[str]) -> str:
    import difflib  # only for an error message (start-up stays light)

    close = difflib.get_close_matches(str(word), list(options), n=1, cutoff=0.6)
    return f" (did you mean '{close[0]}'?)" if close else ""


def kind_of(v: Any) -> str:
    if isinstance(v, bool):
        return f"the boolean {str(v).lower()}"
    if isinstance(v, (int, float)):
        return f"the number {v!r}"
    if isinstance(v, str):
        return f"the text {v[:40]!r}"
    if isinstance(v, list):
        return "a list"
    if isinstance(v, dict):
        return "a table"
    return type(v).__name__
