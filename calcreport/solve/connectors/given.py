"""A design value given per connector, with the text of its source (code table, evaluation report)."""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity

KIND = "given"
FIELDS = CONNECTOR_FIELDS[KIND]


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
