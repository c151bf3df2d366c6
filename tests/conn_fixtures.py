"""Builders for connector tests: rectangular parts, materials and a joint context (test data only)."""

from __future__ import annotations

from calcreport.model import ConnectorSpec, Material, Part, Settings, Shape
from calcreport.solve.connectors import JointContext, model_for
from calcreport.steps import StepLog
from calcreport.units import Q_


def settings(method: str = "ASD", load_duration=None) -> Settings:
    return Settings(
        units="US",
        method=method,
        spacing_step=Q_(0.5, "in"),
        spacing_max=None,
        spacing_min=None,
        load_duration=load_duration,
    )


def wood(G=0.50, E=1.6e6, id="dfl", family="wood"):
    return Material(id, id, Q_(E, "psi"), family=family, G=G)


def steel(Fy=50.0, Fu=65.0, id="a572"):
    return Material(id, id, Q_(29000, "ksi"), family="steel", Fy=Q_(Fy, "ksi"), Fu=Q_(Fu, "ksi"))


def concrete(fc=4.0, wc=145.0, id="conc"):
    return Material(id, id, Q_(3600, "ksi"), family="concrete", fc=Q_(fc, "ksi"), density=Q_(wc, "pcf"))


def rect(id, x0, y0, x1, y1, mat) -> Part:
    v = ((x0, y0), (x1, y0), (x1, y1), (x0, y1))
    return Part(id, Shape("polygon", (x0, y0, x1, y1), vertices=v), mat)


def context(held, other, method="ASD", width=None, load_duration=None) -> JointContext:
    if width is None:
        hx = held[0].shape.bbox
        ox = other[0].shape.bbox
        width = min(hx[2], ox[2]) - max(hx[0], ox[0])
    return JointContext(
        method=method,
        held=tuple(held),
        other=tuple(other),
        plane_width=Q_(width, "in"),
        settings=settings(method, load_duration),
        key="member.B1.joint.j1",
    )


def run(kind: str, params: dict, ctx: JointContext):
    """Fill defaults the way the job-file reader does, then design. Returns (capacity, log)."""
    mod = model_for(kind)
    full = {f.name: f.default for f in mod.FIELDS}
    full.update(params)
    log = StepLog("member.B1.joint.j1.connector")
    cap = mod.design(ConnectorSpec(kind, full, "member.B1.joint.j1.connector"), ctx, log)
    return cap, log


def step(log: StepLog, suffix: str):
    for s in log.steps:
        if s.key.endswith("." + suffix):
            return s
    raise KeyError(suffix)
