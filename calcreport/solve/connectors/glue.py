"""A continuous glue line: capacity per unit length q_cap = τ_allow · b.

When one of the glued parts is plywood glued on its face (the panel lies flat against the plane,
as a plywood web glued to the side of a lumber flange), the shear crosses the panel's plies and the
governing stress is the plywood's *rolling shear*. The allowable rolling shear comes from the
``rolling_shear`` key or the plywood material's rolling-shear stress ``Fs`` (job file
``[[material]] Fs``, held in ``Material.extra["Fs"]``), e.g. from the panel design specification the job follows
(APA Panel Design Specification, rolling shear Fs of the plywood). The capacity is then the lesser
of τ_allow·b and Fs_rolling·C·b. Without a rolling-shear value the line is designed on τ_allow and
an INFO check says rolling shear was not checked.
"""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec, Part
from ...steps import StepLog
from ...units import parse
from ..results import Capacity, Check
from .shear_plane import extent_along, find_contact, thickness_normal

KIND = "glue"
FIELDS = CONNECTOR_FIELDS[KIND]


def _flat_plywood(ctx) -> Part | None:
    """The plywood part glued on its face at the contact, if any (geometry: its depth from the plane
    is less than its extent along the plane)."""
    c = find_contact(ctx.held, ctx.other)
    if c is None:
        return None
    for part in (c.held, c.other):
        if part.material.family == "plywood" and thickness_normal(part, c) < extent_along(part, c):
            return part
    return None


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Continuous glue line: τ = V·Q/(I·b) ≤ τ_allow, written per length as q ≤ τ_allow·b; and
    q ≤ Fs_rolling·C·b where plywood is glued on its face.

    Source: mechanics of materials, τ = V·Q/(I·b) (shear formula); rolling shear value from the
    panel design specification named with the value.
    """
    p = spec.params
    b = ctx.plane_width
    q_tau = log.add(
        "q_cap",
        "Shear-flow capacity of the glue line",
        "q_cap = τ_allow · b",
        "{tau} × {b}",
        {"tau": p["tau"], "b": b},
        (p["tau"] * b).to("lbf/in"),
        source=p["source"],
    )
    ply = _flat_plywood(ctx)
    if ply is None:
        return Capacity(value=q_tau, continuous=True, description=p["name"], source=p["source"])
    fs = p.get("rolling_shear")
    src = p.get("rolling_source")
    extra = ply.material.extra
    raw = extra.get("Fs") if extra.get("Fs") is not None else extra.get("rolling_shear")
    if fs is None and raw is not None:
        fs = parse(raw, "stress") if isinstance(raw, str) else raw
        src = (
            src
            or extra.get("rolling_shear_source")
            or (f"rolling shear Fs of material {ply.material.id} ({ply.material.name}) as given in the job")
        )
    if fs is None:
        chk = Check(
            f"{ctx.key}.connector.rolling_shear",
            f"Rolling shear in plywood part {ply.id} not checked",
            None,
            None,
            None,
            "INFO",
            source="panel design specification (e.g. APA PDS), value not given",
            note="give rolling_shear for the plywood glued on its face",
        )
        return Capacity(
            value=q_tau, continuous=True, description=p["name"], source=p["source"], checks=(chk,)
        )
    src = src or "allowable rolling shear of the plywood as stated in the job (panel design specification)"
    C = p.get("rolling_factor") or 1.0
    q_rs = log.add(
        "q_rolling",
        f"Rolling-shear capacity of plywood part {ply.id} at the glue line",
        "q_rs = Fs_rolling · C · b",
        "{fs} × {C} × {b}",
        {"fs": fs, "C": C, "b": b},
        (fs * C * b).to("lbf/in"),
        source=src,
        note="shear across the plies of a panel glued on its face"
        + ("; reduction C as required by the panel specification" if C != 1.0 else ""),
    )
    gov_rs = q_rs < q_tau
    q = log.add(
        "q_glue",
        "Shear-flow capacity of the glued joint",
        "q = min(q_cap, q_rs)",
        "min({a}, {b})",
        {"a": q_tau, "b": q_rs},
        min(q_tau, q_rs),
        source=src if gov_rs else p["source"],
        note="rolling shear governs" if gov_rs else "glue-line shear governs",
        governs=True,
    )
    return Capacity(value=q, continuous=True, description=p["name"], source=(src if gov_rs else p["source"]))
