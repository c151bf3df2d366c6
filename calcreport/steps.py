"""Derivation steps: the record every output reads.

A :class:`Step` is data, never text ready to print. It holds

* ``label`` — what is being found ("Shear flow at the top flange joint");
* ``symbol`` — the symbolic formula ("q = V·Q / I");
* ``template`` — the right-hand side with named slots ("{V} · {Q} / {I}") that an output fills
  with the formatted ``values``, giving the formula with numbers and units substituted;
* ``values`` — the named inputs, as quantities (or plain numbers / words);
* ``result`` — the value found;
* ``source`` — the standard and clause, or "mechanics of materials", or "common practice, no source";
* ``phrase`` — optional: a :class:`Phrase` (a wording's name and the quantities, counts and flags
  it needs) that the outputs word into the note in the job's units (``outputs/phrases.py``); the
  solver never writes a number into ``note`` itself;
* ``key`` — a stable dotted id (``member.B1.joint.top.q``) that the diff lines up across revisions;
* ``positions`` — names of the values (and ``"result"``) that are positions or lengths along the
  member, which outputs write the way drawings do (feet-inches in US units);
* ``group``, ``row``, ``column`` — optional: the same formula repeated over items (parts, zones,
  combinations) forms a table. ``group`` names the table (unique within the member, e.g.
  ``"section.parts"``), ``row`` the item (a part id, a zone number), ``column`` the quantity (``"A"``,
  ``"nA"``). A step of the group with a ``column`` and no ``row`` is that column's total (the sums
  row); one with neither is a result stated under the table (ȳ). The solver sets them; the report
  lays out the table from them without computing anything, the JSON carries them only when set.
  A group whose rows each use formulas of their own (``yield`` rows Im…IV, ``factors`` rows CD…,
  ``limits``) is set as an itemised table, one whose rows share them (``section``) as a
  parallel-axis table with one worked row; a group name is unique within its heading.

The solver appends steps as it computes; the PDF typesets them, the JSON serialises them and the
diff compares them.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any, TypeVar

from .units import Quantity

Value = Quantity | float | int | str
#: The type of a step's result: :meth:`StepLog.add` returns what it was given, so typed code keeps
#: a Quantity a Quantity.
R = TypeVar("R", bound=Value)

__all__ = ["Phrase", "Step", "Value", "StepLog", "step"]


@dataclass(frozen=True)
class Phrase:
    """Words an output writes from data: ``kind`` names the wording (``outputs/phrases.py`` holds
    the text of each kind), ``values`` the quantities, counts, flags and word choices it needs.
    Carried by a :class:`Step` or a :class:`~calcreport.solve.results.Check` whose note (or label)
    would otherwise hold a formatted number."""

    kind: str
    values: Mapping[str, Value]


@dataclass(frozen=True)
class Step:
    """One line of a derivation (see module docstring)."""

    key: str
    label: str
    symbol: str
    template: str
    values: dict[str, Value]
    result: Value
    source: str = ""
    note: str = ""
    governs: bool = False
    positions: tuple[str, ...] = ()
    group: str = ""
    row: str = ""
    column: str = ""
    phrase: Phrase | None = None


def step(
    key: str,
    label: str,
    symbol: str,
    template: str,
    values: Mapping[str, Any],
    result: Value,
    source: str = "",
    note: str = "",
    governs: bool = False,
    positions: tuple[str, ...] = (),
    group: str = "",
    row: str = "",
    column: str = "",
    phrase: Phrase | None = None,
) -> Step:
    """Build a :class:`Step`, checking that every slot of ``template`` has a value.

    Example:
        >>> s = step("x.q", "Shear flow", "q = V·Q / I", "{V} · {Q} / {I}",
        ...          {"V": 1, "Q": 2, "I": 4}, 0.5, "mechanics of materials")
        >>> s.result
        0.5
    """
    import string

    slots = {name for _, name, _, _ in string.Formatter().parse(template) if name}
    missing = slots - set(values)
    if missing:
        raise ValueError(f"step {key}: template slots without values: {sorted(missing)}")
    return Step(
        key,
        label,
        symbol,
        template,
        dict(values),
        result,
        source,
        note,
        governs,
        tuple(positions),
        group,
        row,
        column,
        phrase,
    )


@dataclass
class StepLog:
    """An ordered list of steps with a key prefix, passed down through the solver."""

    prefix: str
    steps: list[Step] = field(default_factory=list)
    #: the table a step joins when the call names no ``group`` (see :meth:`table`)
    group: str = ""
    row: str = ""
    column: str = ""

    def add(
        self,
        name: str,
        label: str,
        symbol: str,
        template: str,
        values: Mapping[str, Any],
        result: R,
        source: str = "",
        note: str = "",
        governs: bool = False,
        positions: tuple[str, ...] = (),
        group: str = "",
        row: str = "",
        column: str = "",
        phrase: Phrase | None = None,
    ) -> R:
        """Append a step keyed ``prefix.name`` and return its result (so code reads as math).

        ``group``/``row``/``column`` place the step in a table of repeated formulas (module
        docstring); a call naming no ``group`` joins this log's table (see :meth:`table`)."""
        if self.group and not group:
            group, row, column = self.group, row or self.row, column or self.column
        self.steps.append(
            step(
                f"{self.prefix}.{name}",
                label,
                symbol,
                template,
                values,
                result,
                source,
                note,
                governs,
                positions,
                group,
                row,
                column,
                phrase,
            )
        )
        return result

    def child(self, name: str) -> StepLog:
        """A log whose keys are nested under ``prefix.name`` and whose steps land here too."""
        return _ChildLog(f"{self.prefix}.{name}", self.steps, self.group, self.row, self.column)

    def table(self, group: str, row: str = "", column: str = "") -> StepLog:
        """The same log, whose steps go in table ``group``, row ``row`` (with the ``column`` each
        call names, else ``column``; a step without one is stated under the table)."""
        return _ChildLog(self.prefix, self.steps, group, row, column)


class _ChildLog(StepLog):
    def __init__(self, prefix: str, steps: list[Step], group: str = "", row: str = "", column: str = ""):
        super().__init__(prefix, steps, group, row, column)
