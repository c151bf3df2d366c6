"""Slip moduli of mechanical connectors, per connector and per shear plane, for the γ-method.

Two routes, chosen by ``[member.design] slip_moduli`` (see :func:`route_for`):

* **EN 1995-1-1:2004 Table 7.1** — K_ser = ρ_m^1.5·d^0.8/30 for nails driven without pre-drilling,
  K_ser = ρ_m^1.5·d/23 for screws, bolts, dowels and pre-drilled nails (the connector's
  ``predrilled = true``; a job under ASD or LRFD cannot state it: nails there are taken as driven
  without pre-drilling, said in the step), in N/mm with ρ_m in kg/m³
  and d in mm; ρ_m = √(ρ_m,1·ρ_m,2) for two members of different density (§7.1(2)); doubled for
  steel-to-timber (§7.1(3), with ρ_m of the timber); K_u = 2/3·K_ser for the ultimate limit state
  (§2.2.2(2)).
* **NDS 2018 §11.3.6** — load/slip modulus γ = 180,000·D^1.5 lbf/in wood-to-wood and
  270,000·D^1.5 lbf/in wood-to-metal (D in in), used for strength and for deflection alike.

A ``slip_modulus`` on the connector (a tested value from a test report, per connector and per shear
plane) replaces the computed value for both limit states.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from ..model import ConnectorSpec, Part
from ..steps import StepLog
from ..units import Q_, Quantity

__all__ = ["SlipModulus", "SlipInputError", "route_for", "slip_modulus", "EC5", "NDS"]

EC5 = "EN 1995-1-1"
NDS = "NDS 2018"
SRC_EC5 = "EN 1995-1-1:2004 Table 7.1"
SRC_NDS = "NDS 2018 §11.3.6"
#: Connector types with a slip modulus: "nail" takes the nail row of Table 7.1, the rest the
#: screw/bolt/dowel row.
DOWEL_TYPES = ("nail", "wood_screw", "lag_screw", "wood_bolt", "shank")


class SlipInputError(ValueError):
    """The job lacks what a slip modulus needs; the message says what (an Unchecked reason)."""


@dataclass(frozen=True)
class SlipModulus:
    """Slip moduli of one connector per shear plane: K_ser (serviceability) and K_u (strength)."""

    K_ser: Quantity  # lbf/in
    K_u: Quantity
    source: str
    diameter: Quantity | None = None


def route_for(design: dict, settings) -> str:
    """EN 1995-1-1 or NDS 2018: the job's ``slip_moduli`` choice; "auto" takes EN 1995-1-1 for
    SI jobs and ``method = "EC5"``, NDS 2018 otherwise (common practice, no source)."""
    choice = design.get("slip_moduli", "auto")
    if choice == "EN 1995-1-1":
        return EC5
    if choice == "NDS 2018":
        return NDS
    return EC5 if (settings.method == "EC5" or settings.units == "SI") else NDS


def diameter_of(spec: ConnectorSpec, key: str) -> float:
    """Shank diameter D of a dowel-type connector, inches (its model's catalogue or the job)."""
    p = spec.params
    if spec.kind == "nail":
        from .connectors.nail import fastener

        return fastener(p, key).D
    if spec.kind in ("wood_screw", "lag_screw"):
        from .connectors.nds_catalog import LAG_SCREWS, WOOD_SCREWS
        from .connectors.nds_dowel import screw_diameters

        raw = (p.get("size") or "").strip().lower()
        if spec.kind == "wood_screw":  # the size as wood_screw.py and lag_screw.py read it
            cat, size = WOOD_SCREWS, raw.replace(" ", "").replace("gauge", "g").replace("#", "")
        else:
            cat, size = LAG_SCREWS, raw.replace("in", "").replace('"', "").strip()
        return screw_diameters(p, key, cat, size, '"10g" or "1/2"', "a screw size", threads_default=True)[0]
    return float(p["diameter"].to("inch").magnitude)


def ec5_k_ser(kind: str, rho_m: float, d_mm: float, predrilled: bool = False) -> float:
    """K_ser (N/mm) of one fastener per shear plane, timber-to-timber.

    EN 1995-1-1:2004 Table 7.1: nails without pre-drilling ρ_m^1.5·d^0.8/30; screws, bolts, dowels
    and pre-drilled nails ρ_m^1.5·d/23 (ρ_m in kg/m³, d in mm). ``predrilled``: the connector's
    ``predrilled`` key (nails only; the other types take the second row either way).
    """
    if kind == "nail" and not predrilled:
        return rho_m**1.5 * d_mm**0.8 / 30.0
    return rho_m**1.5 * d_mm / 23.0


def nds_load_slip(D_in: float, metal: bool) -> float:
    """Load/slip modulus γ (lbf/in) of one dowel-type fastener: 180,000·D^1.5 wood-to-wood,
    270,000·D^1.5 wood-to-metal, D in inches. Source: NDS 2018 §11.3.6."""
    return (270_000.0 if metal else 180_000.0) * D_in**1.5


def _rho_mean(part: Part) -> float:
    rho = part.material.extra.get("rho_mean")
    if rho is None:
        raise SlipInputError(
            f"no rho_mean (mean density) given for material {part.material.id}: EN 1995-1-1 Table 7.1 "
            "needs it for K_ser"
        )
    return float(rho.to("kg/m**3").magnitude)


def slip_modulus(
    spec: ConnectorSpec, held: Part, other: Part, route: str, key: str, log: StepLog
) -> SlipModulus:
    """K_ser and K_u of one connector of ``spec`` between ``held`` and ``other`` (steps logged).

    Raises :class:`SlipInputError` when the job lacks a value the route needs."""
    given = spec.params.get("slip_modulus")
    if given is not None:
        K = log.add(
            "K_ser",
            "Slip modulus of one connector per shear plane (tested)",
            "K (given)",
            "{K}",
            {"K": given},
            given.to("lbf/inch"),
            source="stated in the job file (slip_modulus, from a test report)",
            note="used for strength and for deflection",
        )
        return SlipModulus(K, K, "stated in the job file")
    if spec.kind not in DOWEL_TYPES:
        raise SlipInputError(
            f"no slip modulus for a {spec.kind} connector: give slip_modulus (a tested value) on the connector"
        )
    D = diameter_of(spec, key)
    steel = [p for p in (held, other) if p.material.family == "steel"]
    if len(steel) == 2:
        raise SlipInputError("both members at the plane are steel: the slip moduli are for timber joints")
    if route == NDS:
        c = 270_000.0 if steel else 180_000.0
        K = log.add(
            "K",
            "Load/slip modulus of one fastener",
            "γ = c·D^1.5",
            "{c} × ({D})^1.5",
            {"c": Q_(c, "lbf/inch**2.5"), "D": Q_(D, "inch")},
            Q_(nds_load_slip(D, bool(steel)), "lbf/inch"),
            source=SRC_NDS,
            note=("wood-to-metal" if steel else "wood-to-wood") + "; used for strength and for deflection",
        )
        return SlipModulus(K, K, SRC_NDS, Q_(D, "inch"))
    timber = [p for p in (held, other) if p.material.family != "steel"]
    rhos = [_rho_mean(p) for p in timber]
    rho = math.sqrt(rhos[0] * rhos[1]) if len(rhos) == 2 else rhos[0]
    if len(rhos) == 2 and abs(rhos[0] - rhos[1]) > 1e-9:
        log.add(
            "rho_m",
            "Mean density of the joint",
            "ρ_m = √(ρ_m,1·ρ_m,2)",
            "√({r1} × {r2})",
            {"r1": Q_(rhos[0], "kg/m**3"), "r2": Q_(rhos[1], "kg/m**3")},
            Q_(rho, "kg/m**3"),
            source="EN 1995-1-1:2004 §7.1(2)",
        )
    d_mm = D * 25.4
    predrilled = bool(spec.params.get("predrilled"))
    nail = spec.kind == "nail" and not predrilled  # the first row of Table 7.1
    k = ec5_k_ser(spec.kind, rho, d_mm, predrilled) * (2.0 if steel else 1.0)
    if spec.kind == "nail":
        why = (
            "pre-drilled nails (predrilled = true): the row of screws, bolts and dowels"
            if predrilled
            else "nails driven without pre-drilling (predrilled = false)"
        )
    else:
        why = "screws, bolts and dowels"
    K_ser = log.add(
        "K_ser",
        "Slip modulus of one fastener per shear plane, serviceability",
        ("K_ser = " + ("2·" if steel else "") + ("ρ_m^1.5·d^0.8 / 30" if nail else "ρ_m^1.5·d / 23")),
        ("2 × " if steel else "") + ("({rho})^1.5 × ({d})^0.8 / 30" if nail else "({rho})^1.5 × {d} / 23"),
        {"rho": Q_(rho, "kg/m**3"), "d": Q_(d_mm, "mm")},
        Q_(k, "N/mm").to("lbf/inch"),
        source=SRC_EC5 + (", doubled for steel-to-timber §7.1(3)" if steel else ""),
        note=why + "; ρ_m in kg/m³ and d in mm give N/mm",
    )
    K_u = log.add(
        "K_u",
        "Slip modulus of one fastener per shear plane, ultimate limit state",
        "K_u = 2/3·K_ser",
        "2/3 × {K}",
        {"K": K_ser},
        (2.0 / 3.0) * K_ser,
        source="EN 1995-1-1:2004 §2.2.2(2)",
    )
    return SlipModulus(K_ser, K_u, SRC_EC5, Q_(D, "inch"))
