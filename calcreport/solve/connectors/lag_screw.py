"""Lag screws, NDS 2018 chapter 12: ``type = "lag_screw"``.

Give ``size`` as the nominal diameter ("1/2") or ``diameter`` (and ``root_diameter``), and
``length``. The tapered tip length E is deducted from the penetration; without ``tip_length`` the
tool deducts E = D, which is longer than the tabulated tips (conservative, stated in a step).
"""

from __future__ import annotations

from ...fields import Field
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity
from .nds_catalog import LAG_SCREWS, fyb_lag_screw
from .nds_dowel import Fastener, design_dowel, screw_diameters
from .nds_factors import COMMON_FIELDS
from .nds_fit import STAGGERED

KIND = "lag_screw"
FIELDS = (
    Field("size", "text", help='nominal diameter, e.g. "1/2" or "3/8 in" (1/4 to 1)'),
    Field("diameter", "length", help="shank diameter D (instead of size)"),
    Field("root_diameter", "length", help="root diameter Dr (with diameter)"),
    Field("length", "length", required=True, help="lag screw length L"),
    Field("tip_length", "length", help="tapered tip length E (default: D, conservative)"),
    Field("threads_in_plane", "bool", default=False, help="threaded part in the shear plane (use Dr)"),
    Field("Fyb", "stress", help="bending yield strength (default by diameter)"),
    Field("name", "text", help="how the report names the lag screw"),
    STAGGERED,
) + COMMON_FIELDS


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Lateral design value of one lag screw. Source: NDS-2018 §12.3, Table 11.3.1, §12.5.1."""
    p = spec.params
    key = f"{ctx.key}.connector"
    size = (p.get("size") or "").strip().lower().replace("in", "").replace('"', "").strip()
    D, Dr, Dy, threads, dy_note = screw_diameters(
        p, key, LAG_SCREWS, size, '"1/2", "3/8", "5/8", "3/4"', "a lag screw diameter", threads_default=False
    )
    tip = p["tip_length"].to("in").magnitude if p.get("tip_length") is not None else D
    if p.get("Fyb") is not None:
        fyb, fsrc = p["Fyb"].to("psi").magnitude, "given for this connector"
    else:
        fyb, fsrc = fyb_lag_screw(D), "NDS-2018 Tables 12J/12K footnote, Fyb by diameter (from memory)"
    f = Fastener(
        "lag_screw",
        p.get("name") or "lag screw",
        D,
        Dy,
        p["length"].to("in").magnitude,
        fyb,
        fsrc,
        min_pen=4.0,
        tip=tip,
        reduced_rd=(D >= 0.25 and Dy < 0.25),
        dy_note=dy_note
        + ("; tip length E = D assumed (conservative)" if p.get("tip_length") is None else ""),
    )
    return design_dowel(spec, ctx, log, f)
