"""EN 1995-1-1:2004 §8.2 to §8.7 equations for laterally loaded dowel-type fasteners, plain floats
in newtons, millimetres and N/mm² (densities in kg/m³): fastener yield moment M_y,Rk, embedment
strength f_h,k, the failure modes of timber-to-timber and panel-to-timber joints in single shear
(eq. 8.6 a–f) and double shear (eq. 8.7 g–k), and the rope-effect limit of §8.2.2(2).

The rope-effect part F_ax,Rk/4 is added to the modes that have it (c, d, e, f; j, k) and limited to
a fraction of the Johansen part of that mode (§8.2.2(2)): round nails 15 %, square and grooved
nails 25 %, other nails 50 %, screws 100 %, bolts 25 %, dowels 0 %.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

__all__ = [
    "ROPE_LIMIT",
    "Mode",
    "yield_moment_nail",
    "yield_moment_bolt",
    "embedment_nail",
    "embedment_bolt",
    "embedment_plywood_nail",
    "embedment_plywood_bolt",
    "k90",
    "single_shear_modes",
    "double_shear_modes",
    "SOURCE_MODES_SINGLE",
    "SOURCE_MODES_DOUBLE",
    "SOURCE_ROPE",
]

SOURCE_MODES_SINGLE = "EN 1995-1-1:2004 §8.2.2, eq. (8.6)"
SOURCE_MODES_DOUBLE = "EN 1995-1-1:2004 §8.2.2, eq. (8.7)"
SOURCE_ROPE = "EN 1995-1-1:2004 §8.2.2(2)"

#: Largest rope-effect part as a fraction of the Johansen part, EN 1995-1-1 §8.2.2(2).
ROPE_LIMIT = {
    "round_nail": 0.15,
    "square_nail": 0.25,
    "other_nail": 0.50,
    "screw": 1.00,
    "bolt": 0.25,
    "dowel": 0.0,
}


def yield_moment_nail(fu: float, d: float, square: bool = False) -> float:
    """M_y,Rk = 0.3·f_u·d^2.6 (round nails) or 0.45·f_u·d^2.6 (square and grooved nails), N·mm.
    Source: EN 1995-1-1:2004 §8.3.1.1, eq. (8.14)."""
    return (0.45 if square else 0.3) * fu * d**2.6


def yield_moment_bolt(fuk: float, d: float) -> float:
    """M_y,Rk = 0.3·f_u,k·d^2.6, N·mm. Source: EN 1995-1-1:2004 §8.5.1.1, eq. (8.30)."""
    return 0.3 * fuk * d**2.6


def embedment_nail(rho_k: float, d: float, predrilled: bool) -> float:
    """f_h,k of timber and LVL for nails up to 8 mm: 0.082·ρ_k·d^-0.3 without pre-drilling,
    0.082·(1 − 0.01·d)·ρ_k with, N/mm². Source: EN 1995-1-1:2004 §8.3.1.1, eq. (8.15), (8.16)."""
    return 0.082 * (1 - 0.01 * d) * rho_k if predrilled else 0.082 * rho_k * d**-0.3


def embedment_plywood_nail(rho_k: float, d: float) -> float:
    """f_h,k of plywood for nails up to 8 mm: 0.11·ρ_k·d^-0.3, N/mm².
    Source: EN 1995-1-1:2004 §8.3.1.3, eq. (8.20)."""
    return 0.11 * rho_k * d**-0.3


def k90(d: float) -> float:
    """k90 = 1.35 + 0.015·d for softwoods. Source: EN 1995-1-1:2004 §8.5.1.1, eq. (8.33)."""
    return 1.35 + 0.015 * d


def embedment_bolt(rho_k: float, d: float, alpha_deg: float = 0.0) -> tuple[float, float]:
    """(f_h,0,k, f_h,α,k) of timber and LVL for bolts: f_h,0,k = 0.082·(1 − 0.01·d)·ρ_k and
    f_h,α,k = f_h,0,k / (k90·sin²α + cos²α), N/mm² (softwoods).
    Source: EN 1995-1-1:2004 §8.5.1.1, eq. (8.31), (8.32), (8.33)."""
    f0 = 0.082 * (1 - 0.01 * d) * rho_k
    a = math.radians(alpha_deg)
    return f0, f0 / (k90(d) * math.sin(a) ** 2 + math.cos(a) ** 2)


def embedment_plywood_bolt(rho_k: float, d: float) -> float:
    """f_h,k of plywood for bolts, at every angle: 0.11·(1 − 0.01·d)·ρ_k, N/mm².
    Source: EN 1995-1-1:2004 §8.5.1.1, eq. (8.36)."""
    return 0.11 * (1 - 0.01 * d) * rho_k


@dataclass(frozen=True)
class Mode:
    """One failure mode: its letter, the Johansen part, the rope-effect part used, the total."""

    mode: str
    johansen: float  # N
    rope: float  # N, after the §8.2.2(2) limit
    F: float  # N, per shear plane


def _rope(johansen: float, fax: float, limit: float) -> float:
    return min(fax / 4.0, limit * johansen)


def single_shear_modes(
    fh1: float,
    fh2: float,
    t1: float,
    t2: float,
    d: float,
    My: float,
    fax: float = 0.0,
    rope_limit: float = 0.0,
) -> list[Mode]:
    """Failure modes (a)–(f) of a timber-to-timber or panel-to-timber joint in single shear, per
    shear plane, N. t1, t2: thickness or penetration in members 1 (head side) and 2 (point side).
    Source: EN 1995-1-1:2004 §8.2.2, eq. (8.6), β = f_h,2,k / f_h,1,k (8.8); rope effect §8.2.2(2).
    """
    b = fh2 / fh1
    r = t2 / t1
    a = fh1 * t1 * d
    bb = fh2 * t2 * d
    c = fh1 * t1 * d / (1 + b) * (math.sqrt(b + 2 * b**2 * (1 + r + r**2) + b**3 * r**2) - b * (1 + r))
    dd = (
        1.05
        * fh1
        * t1
        * d
        / (2 + b)
        * (math.sqrt(2 * b * (1 + b) + 4 * b * (2 + b) * My / (fh1 * d * t1**2)) - b)
    )
    e = (
        1.05
        * fh1
        * t2
        * d
        / (1 + 2 * b)
        * (math.sqrt(2 * b**2 * (1 + b) + 4 * b * (1 + 2 * b) * My / (fh1 * d * t2**2)) - b)
    )
    f = 1.15 * math.sqrt(2 * b / (1 + b)) * math.sqrt(2 * My * fh1 * d)
    out = [Mode("a", a, 0.0, a), Mode("b", bb, 0.0, bb)]
    for m, j in (("c", c), ("d", dd), ("e", e), ("f", f)):
        rp = _rope(j, fax, rope_limit)
        out.append(Mode(m, j, rp, j + rp))
    return out


def double_shear_modes(
    fh1: float,
    fh2: float,
    t1: float,
    t2: float,
    d: float,
    My: float,
    fax: float = 0.0,
    rope_limit: float = 0.0,
) -> list[Mode]:
    """Failure modes (g), (h), (j), (k) of a timber-to-timber or panel-to-timber joint in double
    shear, per shear plane, N. t1: side member thickness (or point-side penetration), t2: central
    member thickness. Source: EN 1995-1-1:2004 §8.2.2, eq. (8.7); rope effect §8.2.2(2)."""
    b = fh2 / fh1
    g = fh1 * t1 * d
    h = 0.5 * fh2 * t2 * d
    j = (
        1.05
        * fh1
        * t1
        * d
        / (2 + b)
        * (math.sqrt(2 * b * (1 + b) + 4 * b * (2 + b) * My / (fh1 * d * t1**2)) - b)
    )
    k = 1.15 * math.sqrt(2 * b / (1 + b)) * math.sqrt(2 * My * fh1 * d)
    out = [Mode("g", g, 0.0, g), Mode("h", h, 0.0, h)]
    for m, v in (("j", j), ("k", k)):
        rp = _rope(v, fax, rope_limit)
        out.append(Mode(m, v, rp, v + rp))
    return out
