"""Validated access to one TOML table: typed getters, unknown-key detection, located errors."""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass, field
from typing import Any, Literal, overload

from ..errors import JobError, excerpt
from ..fields import Field
from ..model import JobWarning, WrittenValue
from ..units import Quantity, UnitParseError, parse, parse_value
from .lines import LineIndex

__all__ = ["Source", "Table", "MAX_TEXT", "MAX_LINES"]

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


class Table:
    """One table of the job file, with its key path for messages.

    Every getter records the key as known; :meth:`done` then rejects keys nobody asked for, with a
    did-you-mean suggestion.
    """

    def __init__(self, data: Any, src: Source, path: tuple, label: str):
        self.src = src
        self.path = path
        self.label = label
        if not isinstance(data, dict):
            raise self._error_at(path, label, f"expected a table, got {_kind(data)}")
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
            raise self.error(name, f'expected text in quotes (like {name} = "{shown}"), got {_kind(v)}')
        if not isinstance(v, str):
            raise self.error(name, f"expected text, got {_kind(v)}")
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
            raise self.error(name, f"expected a whole number, got {_kind(v)}")
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
            raise self.error(name, f"expected a plain number, got {_kind(v)}")
        if v != 0 and abs(v) < 2.2250738585072014e-308:  # subnormal: digits already lost
            raise self.error(name, f"expected a plain number, got {_kind(v)} (too small to hold exactly)")
        if (minimum is not None and v < minimum) or (maximum is not None and v > maximum):
            raise self.error(name, f"expected a number from {minimum} to {maximum}, got {v}")
        return float(v)

    def boolean(self, name: str, default: bool = False) -> bool:
        v = self.raw(name)
        if v is None:
            return default
        if not isinstance(v, bool):
            raise self.error(name, f"expected true or false, got {_kind(v)}")
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
            raise self.error(name, f"expected one of {', '.join(choices)}, got {_kind(v)}")
        for c in choices:
            if v == c or (fold_case and v.lower() == c.lower()):
                return c
        hint = _suggest(v, choices)
        raise self.error(name, f"expected one of {', '.join(choices)}, got {excerpt(v)}{hint}")

    @overload
    def table(self, name: str, required: Literal[True]) -> Table: ...
    @overload
    def table(self, name: str, required: bool = ...) -> Table | None: ...
    def table(self, name: str, required: bool = False) -> Table | None:
        v = self.raw(name, required, "a table")
        if v is None:
            return None
        return Table(v, self.src, self.path + (name,), self.key(name))

    def tables(self, name: str, id_key: str = "id") -> list[Table]:
        """An array of tables; each child's label uses its id when it has one."""
        v = self.raw(name)
        if v is None:
            return []
        if isinstance(v, dict):
            v = [v]
        if not isinstance(v, list):
            raise self.error(name, f"expected a list of tables ([[{self.key(name)}]]), got {_kind(v)}")
        out = []
        for i, item in enumerate(v):
            tag = item.get(id_key) if isinstance(item, dict) else None
            tag = tag if isinstance(tag, str) and 0 < len(tag) <= 60 else str(i + 1)
            out.append(Table(item, self.src, self.path + (name, i), f"{self.key(name)}[{tag}]"))
        return out

    def id_tables(self, name: str, limit: int, what: str) -> list[tuple[Table, str]]:
        """An array of tables that each carry a unique short ``id``: at most ``limit`` of them
        (refused before any is read), each with its id; a repeated id is an error naming it."""
        tables = self.tables(name)
        if len(tables) > limit:
            raise self.error(name, f"expected at most {limit} {what}s, got {len(tables)}")
        out: list[tuple[Table, str]] = []
        seen: set[str] = set()
        for t in tables:
            tid = t.ident("id")
            if tid in seen:
                raise t.error("id", f"duplicate {what} id {tid!r}")
            seen.add(tid)
            out.append((t, tid))
        return out

    def fields(self, fields: Iterable[Field]) -> dict[str, Any]:
        """Read the keys declared by ``fields`` (see :class:`calcreport.fields.Field`)."""
        out: dict[str, Any] = {}
        for f in fields:
            if f.kind == "text":
                out[f.name] = self.text(f.name, f.required, f.default if f.default is not None else "")
            elif f.kind == "int":
                out[f.name] = self.integer(
                    f.name,
                    f.default,
                    int(f.minimum if f.minimum is not None else 1),
                    int(f.maximum if f.maximum is not None else 10_000),
                    f.required,
                )
            elif f.kind == "number":
                v = self.number(
                    f.name,
                    f.default,
                    f.required,
                    f.minimum if f.minimum is not None else (0.0 if f.positive else None),
                    f.maximum,
                )
                if f.positive and f.minimum is None and v is not None and v <= 0:
                    raise self.error(f.name, f"expected a number greater than zero, got {v!r}")
                out[f.name] = v
            elif f.kind == "bool":
                out[f.name] = self.boolean(f.name, bool(f.default))
            elif f.kind == "choice":
                out[f.name] = self.choice(f.name, f.choices, f.default, f.required)
            else:
                default = parse(f.default, f.kind) if isinstance(f.default, str) else f.default
                out[f.name] = self.quantity(f.name, f.kind, f.required, f.positive, default)
        return out

    def expect(self, names: Iterable[str]) -> None:
        """Reject, before anything is read, keys outside ``names`` (so a misspelt key is named
        as such rather than reported as some other key missing)."""
        allowed = set(names)
        for name in self.data:
            if name not in allowed:
                hint = _suggest(name, sorted(allowed))
                raise self.error(name, f"unknown key {excerpt(name)}{hint}")

    def done(self) -> None:
        """Reject keys that no getter asked for, suggesting the closest known key."""
        for name in self.data:
            if name not in self._known:
                hint = _suggest(name, sorted(self._known))
                raise self.error(name, f"unknown key {excerpt(name)}{hint}")


def _suggest(word: str, options: Iterable[str]) -> str:
    import difflib  # only for an error message (start-up stays light)

    close = difflib.get_close_matches(str(word), list(options), n=1, cutoff=0.6)
    return f" (did you mean '{close[0]}'?)" if close else ""


def _kind(v: Any) -> str:
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
