"""Validated access to one TOML table: typed getters, unknown-key detection, located errors.

The getters of single values are in :mod:`.reader_values` (``Values``); ``Table`` adds the tables
nested in it, the keys declared by :class:`~calcreport.fields.Field` records, and the unknown-key
checks with a did-you-mean suggestion."""

from __future__ import annotations

from collections.abc import Iterable
from typing import Any, Literal, overload

from ..errors import excerpt
from ..fields import Field
from ..units import parse
from .reader_values import MAX_LINES, MAX_TEXT, Source, Values, kind_of, suggest

__all__ = ["Source", "Table", "MAX_TEXT", "MAX_LINES"]


class Table(Values):
    """One table of the job file, with its key path for messages.

    Every getter records the key as known; :meth:`done` then rejects keys nobody asked for, with a
    did-you-mean suggestion.
    """

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
            raise self.error(name, f"expected a list of tables ([[{self.key(name)}]]), got {kind_of(v)}")
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
                hint = suggest(name, sorted(allowed))
                raise self.error(name, f"unknown key {excerpt(name)}{hint}")

    def done(self) -> None:
        """Reject keys that no getter asked for, suggesting the closest known key."""
        for name in self.data:
            if name not in self._known:
                hint = suggest(name, sorted(self._known))
                raise self.error(name, f"unknown key {excerpt(name)}{hint}")
