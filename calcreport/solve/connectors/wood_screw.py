"""Wood screws, NDS 2018 chapter 12: ``type = "wood_screw"``.

Give ``size`` as a gauge ("10g") and ``length``, or ``diameter`` (and ``root_diameter``) and
``length``. With threads in the shear plane (the default) the root diameter Dr is used in the yield
equations, as the NDS screw tables do (from memory).
"""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity
from .nds_catalog import WOOD_SCREWS, bending_yield
from .nds_dowel import Fastener, design_dowel, screw_diameters

KIND = "wood_screw"
FIELDS = CONNECTOR_FIELDS[KIND]


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Lateral design value of one wood screw. Source: NDS-2018 §12.3, Table 11.3.1."""
    if ctx.method == "EC5":  # EN 1995-1-1 §8 route (owner: ec5)
        from .ec5_fastener import design_ec5

        return design_ec5(spec, ctx, log, KIND)
    p = spec.params
    key = f"{ctx.key}.connector"
    size = (p.get("size") or "").strip().lower().replace(" ", "").replace("gauge", "g").replace("#", "")
    D, Dr, Dy, threads, dy_note = screw_diameters(
        p, key, WOOD_SCREWS, size, '"10g", "8g", "12g", "14g"', "a wood screw gauge", threads_default=True
    )
    fyb, fsrc = bending_yield("wood_screw", D, p.get("Fyb"))
    f = Fastener(
        "wood_screw",
        p.get("name") or "wood screw",
        D,
        Dy,
        p["length"].to("in").magnitude,
        fyb,
        fsrc,
        min_pen=6.0,
        reduced_rd=(D >= 0.25 and Dy < 0.25),
        dy_note=dy_note,
    )
    return design_dowel(spec, ctx, log, f)
