"""Nails and spikes in wood, NDS 2018 chapter 12: ``type = "nail"``.

Give ``size`` from the pennyweight catalogue ("16d common", "10d box", "12d sinker", "20d spike")
or ``diameter`` and ``length`` directly. Fyb follows the NDS nail table footnotes by diameter
unless given. The design value is per nail, adjusted for ASD or LRFD (see :mod:`.nds_factors`).
"""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity
from . import ConnectorError
from .nds_catalog import CATALOG_SOURCE, bending_yield, nail, nail_names
from .nds_dowel import Fastener, design_dowel

KIND = "nail"
FIELDS = CONNECTOR_FIELDS[KIND]


def fastener(p: dict, key: str) -> Fastener:
    """Resolve the nail from the catalogue or from diameter and length."""
    if p.get("size"):
        n = nail(p["size"])
        if n is None:
            some = ", ".join(
                f'"{s}"'
                for s in ("8d common", "10d common", "16d common", "16d box", "16d sinker", "20d spike")
            )
            raise ConnectorError(
                f"{key}.size",
                f"expected a nail size such as {some} "
                f"({len(nail_names())} sizes known: 6d-60d common, box, sinker, spikes)",
            )
        D, L, desc, src = n.D, n.L, p.get("name") or f"{n.name} nail", CATALOG_SOURCE
    elif p.get("diameter") is not None and p.get("length") is not None:
        D, L = p["diameter"].to("in").magnitude, p["length"].to("in").magnitude
        desc, src = p.get("name") or "nail", "job file"
    else:
        raise ConnectorError(f"{key}.size", 'expected size (e.g. "16d common") or both diameter and length')
    fyb, fsrc = bending_yield("nail", D, p.get("Fyb"))
    return Fastener("nail", desc, D, D, L, fyb, fsrc, min_pen=6.0, dy_note=f"shank diameter ({src})")


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Lateral design value of one nail or spike. Source: NDS-2018 §12.3, Table 11.3.1."""
    if ctx.method == "EC5":  # EN 1995-1-1 §8 route (owner: ec5)
        from .ec5_fastener import design_ec5

        return design_ec5(spec, ctx, log, KIND)
    key = f"{ctx.key}.connector"
    f = fastener(spec.params, key)
    return design_dowel(
        spec,
        ctx,
        log,
        f,
        toe_nail=bool(spec.params.get("toe_nail")),
        diaphragm=bool(spec.params.get("diaphragm")),
    )
