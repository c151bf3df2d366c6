"""Average shear stress on the connector shank: F = τ_allow · π·d²/4 · shear planes."""

from __future__ import annotations

import math

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ..results import Capacity

KIND = "shank"
FIELDS = CONNECTOR_FIELDS[KIND]


def shank_area(d):
    """Cross-sectional area of a round shank, A = π·d²/4 (geometry)."""
    return math.pi * d**2 / 4


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """F = τ · A · m with A = π·d²/4 and m shear planes.

    Source: mechanics of materials — average (direct) shear stress τ = F / (m·A).
    """
    p = spec.params
    d, tau, m = p["diameter"], p["tau"], p["planes"]
    A = log.add(
        "A",
        "Shank area",
        "A = π·d²/4",
        "π × ({d})² / 4",
        {"d": d},
        shank_area(d).to("in**2"),
        source="geometry",
    )
    F = log.add(
        "F",
        f"Shear capacity of one {p['name']}",
        "F = τ·A·m",
        "{tau} × {A} × {m}",
        {"tau": tau, "A": A, "m": m},
        (tau * A * m).to("lbf"),
        source=p["source"],
    )
    return Capacity(value=F, continuous=False, description=f"{p['name']}, d = shank", source=p["source"])
