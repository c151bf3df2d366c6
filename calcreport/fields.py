"""Field specifications: what a table of the job file may hold, as data.

Connector models (and other pluggable pieces) declare their keys with :class:`Field`; the job-file
reader validates a table against them and hands the model typed values. Neither side parses the
other's text.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

__all__ = ["Field"]


@dataclass(frozen=True)
class Field:
    """One key of a table.

    ``kind`` is a dimension name of :data:`calcreport.units.DIMENSIONS` (``"length"``,
    ``"force"``, ``"stress"`` …), or ``"text"``, ``"int"``, ``"number"`` (a plain float),
    ``"bool"``, or ``"choice"`` (with ``choices``).
    ``positive`` requires a value > 0 (dimensions and numbers).
    """

    name: str
    kind: str
    required: bool = False
    default: Any = None
    choices: tuple[str, ...] = ()
    positive: bool = True
    help: str = ""
    minimum: float | None = None
    maximum: float | None = None
