"""Spacing, edge and end distances of nails, screws and bolts, EN 1995-1-1:2004 Tables 8.2 and 8.4
(load parallel to the grain, α = 0), and the timber thickness below which nails need pre-drilling
(§8.3.1.2(6), eq. 8.18). Values from memory (docs/sources.md).

The spacing along the grain a1 becomes the joint's minimum spacing; the edge distance of the row(s)
across the contact is checked (one row centred, or 2·a4 + (n − 1)·a2 within the contact width); end
distance is listed (the tool does not know where the member ends are fastened).
"""

from __future__ import annotations

from collections.abc import Callable

from ...model import Part
from ...units import Q_, Quantity
from ..results import Check
from .shear_plane import across_check

__all__ = ["detailing", "nail_distances", "bolt_distances"]

EC5 = "EN 1995-1-1:2004"


def nail_distances(d: float, rho_k: float, predrilled: bool) -> dict[str, float] | None:
    """a1, a2, a3t, a4c (mm) of nails at α = 0 by Table 8.2; ``None`` where Table 8.2 asks for
    pre-drilling (ρ_k > 500 kg/m³ without it). Source: EN 1995-1-1:2004 §8.3.1.2, Table 8.2."""
    if predrilled:
        return {"a1": 5 * d, "a2": 3 * d, "a3t": 12 * d, "a4c": 3 * d}
    if rho_k <= 420:
        return {"a1": (10 if d < 5 else 12) * d, "a2": 5 * d, "a3t": 15 * d, "a4c": 5 * d}
    if rho_k <= 500:
        return {"a1": 15 * d, "a2": 7 * d, "a3t": 20 * d, "a4c": 7 * d}
    return None


def bolt_distances(d: float) -> dict[str, float]:
    """a1, a2, a3t, a4c (mm) of bolts at α = 0. Source: EN 1995-1-1:2004 §8.5.1.1, Table 8.4."""
    return {"a1": 5 * d, "a2": 4 * d, "a3t": max(7 * d, 80.0), "a4c": 3 * d}


def detailing(
    checks: list[Check],
    key: str,
    kind: str,
    rule: str,
    d: float,
    predrilled: bool,
    members: tuple[Part, Part],
    thicknesses: tuple[float, float],
    c,
    per_row: int,
    rho_of: Callable[[Part], float],
    log=None,
) -> tuple[Quantity, str]:
    """Detailing checks appended to ``checks``; returns (minimum spacing a1, its source). With
    ``log``, the width a row across the contact needs is a step (``W_across``)."""
    timber = [(m, t) for m, t in zip(members, thicknesses) if m.material.family != "plywood"]
    rho = max((rho_of(m) for m, _ in timber), default=0.0)
    if rule == "nail":
        src = f"{EC5} §8.3.1.2, Table 8.2" + (" (screws: §8.7.1)" if kind == "wood_screw" else "")
        dist = nail_distances(d, rho, predrilled)
        if dist is None:
            checks.append(
                Check(
                    f"{key}.predrilling",
                    "Pre-drilling required (ρ_k > 500 kg/m³)",
                    Q_(500.0, "kg/m**3"),
                    Q_(rho, "kg/m**3"),
                    rho / 500.0,
                    "NG",
                    source=src,
                    note="give predrilled = true and drill the holes",
                )
            )
            dist = nail_distances(d, rho, True)
            assert dist is not None
        if not predrilled:
            for m, t in timber:
                r = rho_of(m)
                tmin = max(7 * d, (13 * d - 30) * r / 400.0)
                checks.append(
                    Check(
                        f"{key}.thickness_{m.id}",
                        f"Thickness of {m.id} without pre-drilling, t ≥ max(7d, (13d − 30)·ρ_k/400)",
                        Q_(tmin, "mm"),
                        Q_(t, "mm"),
                        tmin / t,
                        "OK" if t >= tmin - 1e-9 else "NG",
                        source=f"{EC5} §8.3.1.2(6), eq. (8.18)",
                        note="thinner timber must be pre-drilled",
                    )
                )
    else:
        src = f"{EC5} §8.5.1.1, Table 8.4" + (" (screws: §8.7.1)" if kind == "wood_screw" else "")
        dist = bolt_distances(d)
    if c is not None:
        if log is not None:  # the limits the width across rests on, each a step (EN 1995-1-1 Tables 8.2/8.4)
            for name, label, which, rule in (
                ("e_edge", "Edge distance a4,c (unloaded edge)", "a4c", "α = 0, load parallel to the grain"),
                (
                    "s_rows",
                    "Spacing a2 between lines across the grain",
                    "a2",
                    "α = 0, load parallel to the grain",
                ),
            ):
                log.add(
                    name,
                    label,
                    f"{'a4,c' if which == 'a4c' else 'a2'} = k·d",
                    "{k} × {d}",
                    {"k": round(dist[which] / d, 6), "d": Q_(d, "mm")},
                    Q_(dist[which], "mm"),
                    source=src,
                    note=rule,
                )
        checks.append(
            across_check(
                key,
                c,
                max(per_row, 1),
                Q_(dist["a4c"], "mm").to("in").magnitude,
                Q_(dist["a2"], "mm").to("in").magnitude,
                src,
                "edge distance a4,c (unloaded edge), load parallel to the grain",
                "spacing a2 perpendicular to the grain",
                log=log,
            )
        )
    checks.append(
        Check(
            f"{key}.end",
            "End distance a3,t from a loaded end",
            Q_(dist["a3t"], "mm"),
            None,
            None,
            "INFO",
            source=src,
            note="load parallel to the grain, loaded end; not checked (the member ends are not modelled)",
        )
    )
    return Q_(dist["a1"], "mm"), src + ": spacing a1 along the grain"
