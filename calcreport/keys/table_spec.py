"""The declaration of a job-file table (:class:`TableSpec`) and the small vocabularies the tables
use (shapes, placements, families, support types, load kinds and entries). Split from
:mod:`calcreport.keys.job`, which re-exports every name."""

from __future__ import annotations

from dataclasses import dataclass

from ..fields import Field

__all__ = [
    "TableSpec",
    "names",
    "SHAPES",
    "PLACEMENTS",
    "FAMILIES",
    "SUPPORT_TYPES",
    "LOAD_KINDS",
    "LOAD_ENTRIES",
]

#: Shapes of a part and the ways to place one (see docs/job-format.md).
SHAPES = ("rect", "plate", "lumber", "bar", "polygon", "rolled")
PLACEMENTS = ("on", "below", "left_of", "right_of", "at")
FAMILIES = ("wood", "plywood", "glulam", "steel", "concrete", "aluminum", "other")
SUPPORT_TYPES = ("pin", "roller", "fixed")
LOAD_KINDS = ("uniform", "point", "linear")
#: Where a load enters a member of plies side by side (issue 14).
LOAD_ENTRIES = ("top", "left_face", "right_face", "ply")


@dataclass(frozen=True)
class TableSpec:
    """A table of the job file: its keys, its sub-tables, whether it is an array (``[[name]]``).

    ``free`` names the kind of every key of a table whose keys are the user's (a load case →
    a number, for ``deflection_limits`` and ``factors``); ``connector``: the keys depend on
    ``type`` (:data:`calcreport.keys.connectors.CONNECTOR_FIELDS`).
    """

    name: str
    help: str
    fields: tuple[Field, ...] = ()
    tables: tuple[TableSpec, ...] = ()
    array: bool = False
    required: bool = False
    free: str = ""
    connector: bool = False


def names(spec: TableSpec) -> tuple[str, ...]:
    """Every key the table may hold: its fields and its sub-tables."""
    return tuple(f.name for f in spec.fields) + tuple(t.name for t in spec.tables)
