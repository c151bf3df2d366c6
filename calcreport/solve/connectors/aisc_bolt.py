"""High-strength and common bolts joining steel parts, ANSI/AISC 360-16 §J3: ``type = "steel_bolt"``.

Design value per bolt = the least of bolt shear (J3.6), bearing at the bolt holes of each part
(J3.10) and, for a slip-critical joint, slip resistance (J3.8). Tearout (J3.10, 1.2·lc·t·Fu) depends
on the clear distance lc between holes, i.e. on the spacing this tool is finding; it is therefore
turned into a minimum spacing at which tearout does not govern (s ≥ dh + R/(φ·1.2·t·Fu)), and an
end-distance requirement for the end bolt, reported as checks. Units inside: kip, ksi, in.
"""

from __future__ import annotations

import math

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ...units import Q_
from ..results import Capacity
from . import ConnectorError
from .aisc_bolt_limits import EDGE_MIN, bolt_limits, edge_min

__all__ = ["KIND", "FIELDS", "EDGE_MIN", "edge_min", "design"]
from .shear_plane import find_contact, missing_rolled_plate, rolled_plate, thickness_normal

KIND = "steel_bolt"
SRC = "ANSI/AISC 360-16"

FIELDS = CONNECTOR_FIELDS[KIND]

#: Nominal shear stress Fnv (ksi) by group and thread condition. AISC 360-16 Table J3.2.
FNV = {
    ("A", "N"): 54.0,
    ("A", "X"): 68.0,
    ("B", "N"): 68.0,
    ("B", "X"): 84.0,
    ("C", "N"): 90.0,
    ("C", "X"): 113.0,
    ("A307", "N"): 27.0,
    ("A307", "X"): 27.0,
}

#: Minimum bolt pretension Tb (kips). AISC 360-16 Table J3.1 (from memory).
TB = {
    "A": {0.5: 12, 0.625: 19, 0.75: 28, 0.875: 39, 1.0: 51, 1.125: 64, 1.25: 81, 1.375: 97, 1.5: 118},
    "B": {0.5: 15, 0.625: 24, 0.75: 35, 0.875: 49, 1.0: 64, 1.125: 80, 1.25: 102, 1.375: 121, 1.5: 148},
}


def standard_hole(d: float) -> float:
    """Standard hole diameter (in): d + 1/16 for d ≤ 7/8 in; 1-1/8 for 1 in; d + 1/8 above.
    Source: AISC 360-16 Table J3.3."""
    if d <= 0.875 + 1e-9:
        return d + 1 / 16
    if d <= 1.0 + 1e-9:
        return 1.125
    return d + 0.125


def oversized_hole(d: float) -> float:
    """Oversized hole diameter (in): d + 3/16 for d ≤ 7/8 in; 1-1/4 for 1 in; d + 5/16 above.
    Source: AISC 360-16 Table J3.3 (from memory)."""
    if d <= 0.875 + 1e-9:
        return d + 3 / 16
    if d <= 1.0 + 1e-9:
        return 1.25
    return d + 5 / 16


def shear_nominal(Fnv: float, d: float, planes: int) -> float:
    """Rn = Fnv·Ab·ns (kips), Ab = π·d²/4. Source: AISC 360-16 §J3.6, Eq. J3-1."""
    return Fnv * math.pi * d**2 / 4 * planes


def bearing_nominal(
    d: float, t: float, Fu: float, deformation_limited: bool, long_slot_transverse: bool = False
) -> float:
    """Bearing Rn (kips): 2.4·d·t·Fu (deformation a consideration), 3.0·d·t·Fu (not), 2.0·d·t·Fu
    (long slots perpendicular to the force). Source: AISC 360-16 §J3.10, Eq. J3-6a, J3-6b, J3-6e."""
    if long_slot_transverse:
        return 2.0 * d * t * Fu
    return (2.4 if deformation_limited else 3.0) * d * t * Fu


def tearout_nominal(
    lc: float, t: float, Fu: float, deformation_limited: bool, long_slot_transverse: bool = False
) -> float:
    """Tearout Rn (kips): 1.2·lc·t·Fu (deformation a consideration), 1.5·lc·t·Fu (not), 1.0·lc·t·Fu
    (long slots perpendicular to the force). Source: AISC 360-16 §J3.10, Eq. J3-6c, J3-6d, J3-6f."""
    if long_slot_transverse:
        return 1.0 * lc * t * Fu
    return (1.2 if deformation_limited else 1.5) * lc * t * Fu


def slip_nominal(mu: float, hf: float, Tb: float, ns: int, Du: float = 1.13) -> float:
    """Slip resistance Rn = μ·Du·hf·Tb·ns (kips). Source: AISC 360-16 §J3.8, Eq. J3-4."""
    return mu * Du * hf * Tb * ns


def _resist(method: str, phi: float, omega: float) -> tuple[float, str]:
    return (phi, "φ") if method == "LRFD" else (1.0 / omega, "1/Ω")


def _thick(log, name, label, given, part, c, key):
    if given is not None:
        log.add(name, label, name, "{t}", {"t": given}, given.to("in"), source="job file", note="given")
        return given.to("in").magnitude
    if c is None:
        raise ConnectorError(
            f"{key}.{name.replace('t_', '')}_thickness",
            "expected held_thickness and other_thickness: the parts do not touch",
        )
    missing = missing_rolled_plate(part, c)
    if missing:
        raise ConnectorError(f"{key}.{name.replace('t_', '')}_thickness", missing)
    t = thickness_normal(part, c)
    rolled = rolled_plate(part, c) is not None
    log.add(
        name,
        label,
        name,
        "{t}",
        {"t": Q_(t, "in")},
        Q_(t, "in"),
        source=part.shape.source if rolled else "geometry of the parts",
        note=(
            f"part {part.id}: {'flange' if c.orientation == 'horizontal' else 'web'} thickness of the rolled shape"
            if rolled
            else f"part {part.id} measured perpendicular to the {c.orientation} shear plane"
        ),
    )
    return t


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Available strength of one bolt (kips): min of shear, bearing and slip (if slip-critical).

    Source: AISC 360-16 §J3.3-J3.10, Tables J3.1-J3.4.
    """
    p = spec.params
    key = f"{ctx.key}.connector"
    d = p["diameter"].to("in").magnitude
    planes = p.get("planes") or 1
    c = find_contact(ctx.held, ctx.other)
    held = c.held if c else ctx.held[0]
    other = c.other if c else ctx.other[0]
    for part in (held, other):
        if part.material.family != "steel" or part.material.Fu is None:
            raise ConnectorError(
                f"{key}.type",
                f"expected steel parts with Fu for a steel bolt; part {part.id} "
                f"is {part.material.family}" + ("" if part.material.Fu is not None else " without Fu"),
            )
    th = _thick(log, "t_held", "Thickness of the held ply", p.get("held_thickness"), held, c, key)
    to = _thick(log, "t_other", "Thickness of the other ply", p.get("other_thickness"), other, c, key)
    lrfd = ctx.method == "LRFD"
    dq = Q_(d, "in")
    Ab = log.add(
        "Ab",
        "Nominal bolt area",
        "Ab = π·d²/4",
        "π × ({d})² / 4",
        {"d": dq},
        Q_(math.pi * d * d / 4, "in**2"),
        source=f"{SRC} §J3.6",
    )
    Fnv = FNV[(p["group"], p["threads"])]
    log.add(
        "Fnv",
        "Nominal shear stress",
        "Fnv",
        "{F}",
        {"F": Q_(Fnv, "ksi")},
        Q_(Fnv, "ksi"),
        source=f"{SRC} Table J3.2",
        note=f"group {p['group']}, threads "
        + ("included in the shear plane (N)" if p["threads"] == "N" else "excluded from the shear plane (X)"),
    )
    rn_v = log.add(
        "Rn_shear",
        "Nominal shear strength of the bolt",
        "Rn = Fnv·Ab·ns",
        "{Fnv} × {Ab} × {ns}",
        {"Fnv": Q_(Fnv, "ksi"), "Ab": Ab, "ns": planes},
        Q_(shear_nominal(Fnv, d, planes), "kip"),
        source=f"{SRC} §J3.6, Eq. J3-1",
    ).magnitude
    f, fsym = _resist(ctx.method, 0.75, 2.00)
    limits: list[tuple[str, float, str]] = [("bolt shear", rn_v * f, f"{SRC} §J3.6 (φ = 0.75, Ω = 2.00)")]
    hole = p.get("hole") or "standard"
    lst = hole == "long_slot_transverse"
    defl = bool(p.get("deformation_limited", True))
    plies = [("held", th, held.material.Fu.to("ksi").magnitude, held.id)]  # type: ignore[union-attr]
    t_oth = to * (2 if planes == 2 else 1)
    plies.append(("other", t_oth, other.material.Fu.to("ksi").magnitude, other.id))  # type: ignore[union-attr]
    coef = 2.0 if lst else (2.4 if defl else 3.0)
    for which, t, Fu, pid in plies:
        rb = bearing_nominal(d, t, Fu, defl, lst)
        log.add(
            f"Rn_bearing_{which}",
            f"Nominal bearing strength at the hole in part {pid}",
            f"Rn = {coef}·d·t·Fu",
            f"{coef} × {{d}} × {{t}} × {{Fu}}",
            {"d": dq, "t": Q_(t, "in"), "Fu": Q_(Fu, "ksi")},
            Q_(rb, "kip"),
            source=f"{SRC} §J3.10",
            note=("both outer plies (2·t) in double shear; " if which == "other" and planes == 2 else "")
            + (
                "deformation at the hole at service load is a design consideration"
                if defl
                else "deformation at the hole is not a design consideration"
            ),
        )
        limits.append((f"bearing, part {pid}", rb * f, f"{SRC} §J3.10 (φ = 0.75, Ω = 2.00)"))
    if p.get("slip_critical"):
        mu = 0.30 if p["surface"] == "A" else 0.50
        hf = 1.0 if (p.get("fillers") or 0) <= 1 else 0.85
        if p.get("pretension") is not None:
            Tb, tsrc = p["pretension"].to("kip").magnitude, "given for this connector"
        else:
            tb = TB.get(p["group"], {})
            Tb = next((v for k, v in tb.items() if abs(k - d) < 1e-6), None)
            if Tb is None:
                raise ConnectorError(
                    f"{key}.pretension",
                    "expected pretension (a force): Table J3.1 has no value "
                    "for this bolt group and diameter here (groups A and B, 1/2 in to 1-1/2 in)",
                )
            tsrc = f"{SRC} Table J3.1"
        log.add(
            "Tb", "Minimum bolt pretension", "Tb", "{Tb}", {"Tb": Q_(Tb, "kip")}, Q_(Tb, "kip"), source=tsrc
        )
        rs = log.add(
            "Rn_slip",
            "Nominal slip resistance",
            "Rn = μ·Du·hf·Tb·ns",
            "{mu} × {Du} × {hf} × {Tb} × {ns}",
            {"mu": mu, "Du": 1.13, "hf": hf, "Tb": Q_(Tb, "kip"), "ns": planes},
            Q_(slip_nominal(mu, hf, Tb, planes), "kip"),
            source=f"{SRC} §J3.8, Eq. J3-4",
            note=f"class {p['surface']} surface; hf for {'at most one filler' if hf == 1.0 else 'two or more fillers'}; "
            "Du = 1.13",
        ).magnitude
        if hole in ("standard", "short_slot_transverse"):
            phi, om = 1.00, 1.50
        elif hole in ("oversized", "short_slot_parallel"):
            phi, om = 0.85, 1.76
        else:
            phi, om = 0.70, 2.14
        fs, _ = _resist(ctx.method, phi, om)
        limits.append(("slip", rs * fs, f"{SRC} §J3.8 ({hole.replace('_', ' ')} holes)"))
    gov = min(limits, key=lambda x: x[1])
    for i, (name, val, src) in enumerate(limits):
        log.add(
            f"R_{i}",
            f"Available strength, {name}",
            ("φRn" if lrfd else "Rn/Ω"),
            "{v}",
            {"v": Q_(val, "kip")},
            Q_(val, "kip"),
            source=src,
            governs=(name == gov[0]),
            note="LRFD design strength" if lrfd else "ASD allowable strength",
        )
    R = log.add(
        "R",
        "Available strength of one bolt",
        "R = min(limit states)",
        "{R}",
        {"R": Q_(gov[1], "kip")},
        Q_(gov[1], "kip"),
        source=gov[2],
        note=f"{gov[0]} governs",
    )
    # Hole size, tearout → minimum spacing, detailing.
    if p.get("hole_length") is not None:
        dh = p["hole_length"].to("in").magnitude
        hsrc = "given"
    elif hole in ("standard", "short_slot_transverse", "long_slot_transverse"):
        dh, hsrc = standard_hole(d), f"{SRC} Table J3.3, standard hole width along the force"
    elif hole == "oversized":
        dh, hsrc = oversized_hole(d), f"{SRC} Table J3.3"
    else:
        raise ConnectorError(
            f"{key}.hole_length",
            "expected hole_length (slot length along the force) for slots parallel to the force",
        )
    log.add(
        "dh", "Hole dimension along the force", "dh", "{dh}", {"dh": Q_(dh, "in")}, Q_(dh, "in"), source=hsrc
    )
    ft, _ = _resist(ctx.method, 0.75, 2.00)
    tc = 1.0 if lst else (1.2 if defl else 1.5)
    t_min, Fu_min = min(((t, Fu) for _, t, Fu, _ in plies), key=lambda x: x[0] * x[1])
    lc_req = gov[1] / (ft * tc * t_min * Fu_min)
    lcq = log.add(
        "lc_req",
        "Clear distance at which tearout does not govern",
        f"lc = R / ({fsym}·{tc}·t·Fu)",
        f"{{R}} / ({{f}} × {tc} × {{t}} × {{Fu}})",
        {"R": R, "f": ft, "t": Q_(t_min, "in"), "Fu": Q_(Fu_min, "ksi")},
        Q_(lc_req, "in"),
        source=f"{SRC} §J3.10, Eq. J3-6c",
        note="ply with the least t·Fu",
    )
    s_tear = log.add(
        "s_tearout",
        "Bolt spacing at which tearout between holes does not govern",
        "s = lc + dh",
        "{lc} + {dh}",
        {"lc": lcq, "dh": Q_(dh, "in")},
        Q_(lc_req + dh, "in"),
        source=f"{SRC} §J3.10 (lc = s − dh between holes)",
    ).magnitude
    checks, s_min, s_max, smsrc = bolt_limits(log, p, key, c, ctx, d, dh, lcq, lc_req, s_tear, min(th, to))
    return Capacity(
        value=R.to("kip"),
        continuous=False,
        description=p.get("name") or f"group {p['group']} bolt",
        source=f"{SRC} §J3",
        checks=tuple(checks),
        spacing_min=Q_(s_min, "in"),
        spacing_max=Q_(s_max, "in"),
        limits_source=f"{SRC} §J3.3 (2-2/3 d) or tearout spacing, whichever is larger; {smsrc}",
    )
