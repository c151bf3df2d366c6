"""A continuous connection with a given design value per unit length (e.g. a continuous weld
or a tested adhesive line), with the text of its source."""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity

KIND = "given_line"
FIELDS = CONNECTOR_FIELDS[KIND]


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Take the design value per length as given; the engineer owns its source.

    Used as stated for the job's design method; no adjustment applied. Source: as stated.
    """
    p = spec.params
    q_cap = log.add(
        "q_cap",
        f"Design value of the {p['name']} per unit length",
        "q_cap",
        "{q}",
        {"q": p["value"]},
        p["value"].to("lbf/in"),
        source=p["source"],
        note="given value, used as stated",
    )
    return Capacity(value=q_cap, continuous=True, description=p["name"], source=p["source"])
