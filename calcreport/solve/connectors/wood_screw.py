"""Wood screws, NDS 2018 chapter 12: ``type = "wood_screw"``.

Give ``size`` as a gauge ("10g") and ``length``, or ``diameter`` (and ``root_diameter``) and
``length``. With threads in the shear plane (the default) the root diameter Dr is used in the yield
equations, as the NDS screw tables do (from memory).
"""

from __future__ import annotations

from ...fields import Field
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity
from .nds_catalog import WOOD_SCREWS, fyb_wood_screw
from .nds_dowel import Fastener, design_dowel, screw_diameters
from .nds_factors import COMMON_FIELDS
from .nds_fit import STAGGERED

KIND = "wood_screw"
FIELDS = (
    Field("size", "text", help='gauge, e.g. "10g" (6g-24g)'),
    Field("diameter", "length", help="shank diameter D (instead of size)"),
    Field("root_diameter", "length", help="root diameter Dr (with diameter)"),
    Field("length", "length", required=True, help="screw length L"),
    Field("threads_in_plane", "bool", default=True, help="threaded part in the shear plane (use Dr)"),
    Field("Fyb", "stress", help="bending yield strength (default by diameter)"),
    Field("name", "text", help="how the report names the screw"),
    STAGGERED,
) + COMMON_FIELDS


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Lateral design value of one wood screw. Source: NDS-2018 §12.3, Table 11.3.1."""
    p = spec.params
    key = f"{ctx.key}.connector"
    size = (p.get("size") or "").strip().lower().replace(" ", "").replace("gauge", "g").replace("#", "")
    D, Dr, Dy, threads, dy_note = screw_diameters(
        p, key, WOOD_SCREWS, size, '"10g", "8g", "12g", "14g"', "a wood screw gauge", threads_default=True
    )
    if p.get("Fyb") is not None:
        fyb, fsrc = p["Fyb"].to("psi").magnitude, "given for this connector"
    else:
        fyb, fsrc = fyb_wood_screw(D), "NDS-2018 Table 12L footnote, Fyb by diameter (from memory)"
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
