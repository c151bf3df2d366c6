"""Bolts in wood, NDS 2018 chapter 12: ``type = "wood_bolt"``.

A through bolt in single shear (two members) or double shear (``planes = 2``, the held part in
the middle). Fyb = 45,000 psi unless given (NDS bolt tables' basis).
"""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity
from . import ConnectorError
from .nds_catalog import bending_yield
from .nds_dowel import Fastener, design_dowel

KIND = "wood_bolt"
FIELDS = CONNECTOR_FIELDS[KIND]


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Lateral design value of one bolt in wood. Source: NDS-2018 §12.3, Table 11.3.1, §12.5.1."""
    if ctx.method == "EC5":  # EN 1995-1-1 §8 route (owner: ec5)
        from .ec5_fastener import design_ec5

        return design_ec5(spec, ctx, log, KIND)
    p = spec.params
    D = p["diameter"].to("in").magnitude
    if not 0.25 <= D <= 1.0:
        raise ConnectorError(
            f"{ctx.key}.connector.diameter",
            "expected a bolt diameter from 1/4 in to 1 in (NDS-2018 §12.3 yield equations)",
        )
    fyb, fsrc = bending_yield("wood_bolt", D, p.get("Fyb"))
    f = Fastener("bolt", p.get("name") or "bolt in wood", D, D, None, fyb, fsrc)
    return design_dowel(spec, ctx, log, f)
