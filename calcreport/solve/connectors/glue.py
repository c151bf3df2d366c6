"""A continuous glue line: capacity per unit length q_cap = τ_allow · b."""

from __future__ import annotations

from ...fields import Field
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity

KIND = "glue"
FIELDS = (
    Field("tau", "stress", required=True, help="allowable shear stress of the glue line (usually that of the wood)"),
    Field("source", "text", default="allowable shear stress as stated in the job", help="where tau comes from"),
    Field("name", "text", default="glue line", help="what the adhesive is"),
)


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Continuous glue line: τ = V·Q/(I·b) ≤ τ_allow, written per length as q ≤ τ_allow·b.

    Source: mechanics of materials, τ = V·Q/(I·b) (shear formula).
    """
    p = spec.params
    b = ctx.plane_width
    q_cap = log.add("q_cap", "Shear-flow capacity of the glue line", "q_cap = τ_allow · b", "{tau} × {b}",
                    {"tau": p["tau"], "b": b}, (p["tau"] * b).to("lbf/in"), source=p["source"])
    return Capacity(value=q_cap, continuous=True, description=p["name"], source=p["source"])
