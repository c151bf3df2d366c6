"""A design value given per connector, with the text of its source (code table, evaluation report)."""

from __future__ import annotations

from ...fields import Field
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity

KIND = "given"
FIELDS = (
    Field(
        "value",
        "force",
        required=True,
        help="design value of one connector (ASD allowable or LRFD design strength)",
    ),
    Field(
        "source", "text", required=True, help="where the value comes from: table, edition, evaluation report"
    ),
    Field("name", "text", default="connector", help='what the connector is, e.g. "10d common nail"'),
)


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Take the design value as given; the engineer owns its source.

    The value is used as stated for the job's design method (ASD allowable or LRFD design
    strength); no adjustment is applied. Source: as stated in the job file.
    """
    p = spec.params
    F = log.add(
        "F",
        f"Design value of one {p['name']}",
        "F",
        "{F}",
        {"F": p["value"]},
        p["value"],
        source=p["source"],
        note="given value, used as stated",
    )
    return Capacity(value=F, continuous=False, description=p["name"], source=p["source"])
