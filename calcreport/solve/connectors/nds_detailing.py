"""Detailing limits of wood dowel-type fasteners, each limit a step: end and edge distance,
spacing in a row and between rows.

D ≥ 1/4 in (bolts, lag screws): NDS-2018 Tables 12.5.1A (end distance), 12.5.1B (spacing in a
row), 12.5.1C (edge distance), 12.5.1D (spacing between rows), for load parallel and
perpendicular to grain (values recalled, see docs/sources.md). Nails and small screws: 10D
spacing, 15D end and 5D edge distance — common practice, no source (NDS asks for spacing that
prevents splitting without numbers).

Load at an angle (0° < θ < 90°): the stricter of the parallel and perpendicular limits is used
(a stated choice). Load perpendicular to grain: the loaded edge needs 4D; where plies pass load
across (the joint's ``load_angle``) the fastener bears toward the top edge of one ply and the
bottom edge of the next, so both edges of the contact are loaded edges; with an angle given on the
connector the loaded edge is not known, so both are taken as loaded.
"""

from __future__ import annotations

from ...steps import StepLog
from ...units import Q_, Quantity
from ..results import Check
from .nds_yield import NDS
from .shear_plane import across_check

__all__ = ["row_spacing_perpendicular", "detailing"]

NAIL_SRC = "common practice, no source (NDS 2018: spacing that prevents splitting)"


def row_spacing_perpendicular(l_over_d: float) -> float:
    """Spacing between rows (in diameters) for load perpendicular to grain: 2.5 for l/D ≤ 2,
    (5·l/D + 10)/8 for 2 < l/D < 6, 5 for l/D ≥ 6. Source: NDS-2018 Table 12.5.1D."""
    if l_over_d <= 2.0:
        return 2.5
    if l_over_d < 6.0:
        return (5.0 * l_over_d + 10.0) / 8.0
    return 5.0


#: the table the detailing limits form (``Step.group``): one row per limit, column ``value``
LIMIT_GROUP = "limits"


def _limit(log: StepLog, name: str, label: str, k: float, D: float, source: str, note: str = "") -> float:
    """Write a limit k·D as a step (a row of table ``limits``) and return it (in)."""
    kk = round(k, 6)
    log.table(LIMIT_GROUP, name, "value").add(
        name,
        label,
        f"{name} = {kk:g}·D",
        "{k} × {D}",
        {"k": kk, "D": Q_(D, "in")},
        Q_(k * D, "in"),
        source=source,
        note=note,
    )
    return k * D


def detailing(
    log: StepLog,
    checks: list[Check],
    key: str,
    kind: str,
    D: float,
    c,
    l_bear: float,
    theta: float,
    lines: int = 1,
    ply: bool = False,
) -> tuple[Quantity, None, str]:
    """Spacing, end and edge distance as steps and checks → (spacing_min, spacing_max, source).

    ``l_bear`` is the bearing length l of Table 12.5.1C/D (the lesser of the wood members'),
    ``theta`` the largest angle of load to grain, ``lines`` the fasteners of one row side by side
    across the contact (from one face), ``ply`` whether the joint passes load across plies.
    Source: NDS-2018 Tables 12.5.1A-12.5.1D (D ≥ 1/4 in); common practice (nails).
    """
    if D >= 0.25 and kind != "nail":
        return _large(log, checks, key, D, c, l_bear, theta, lines, ply)
    return _small(log, checks, key, D, c, theta, lines)


def _large(log, checks, key, D, c, l_bear, theta, lines, ply):
    par, perp = theta < 90.0 - 1e-9, theta > 0.0
    ld = log.add(
        "l_over_D",
        "Bearing length over diameter for the geometry tables",
        "l/D",
        "{l} / {D}",
        {"l": Q_(l_bear, "in"), "D": Q_(D, "in")},
        l_bear / D,
        source=f"{NDS} Table 12.5.1C footnote",
        note="l = the lesser dowel bearing length in the wood members",
    )
    direction = (
        "parallel to grain" if not perp else ("perpendicular to grain" if not par else "at an angle to grain")
    )
    # Edge distance (Table 12.5.1C).
    if perp:
        k_edge = 4.0
        why = (
            "loaded edge, load perpendicular to grain: 4D; across plies the fastener bears toward the "
            "top edge of one ply and the bottom edge of the next, so both edges are loaded edges"
            if ply
            else "loaded edge, load perpendicular to grain: 4D (both edges taken as loaded)"
        )
    else:
        k_edge = 1.5
        why = (
            "load parallel to grain, l/D ≤ 6: 1.5D"
            if ld <= 6
            else "load parallel to grain, l/D > 6: the greater of 1.5D and half the 1.5D spacing between rows"
        )
    edge = _limit(log, "e_edge", "Minimum edge distance", k_edge, D, f"{NDS} Table 12.5.1C", why)
    # Spacing between rows (Table 12.5.1D).
    k_rows = 1.5
    rows_note = "load parallel to grain: 1.5D"
    if perp:
        kp = row_spacing_perpendicular(ld)
        k_rows = max(k_rows, kp) if par else kp
        rows_note = (
            "load perpendicular to grain: 2.5D for l/D ≤ 2, (5l + 10D)/8 for 2 < l/D < 6, 5D for l/D ≥ 6"
            + ("; the greater with the parallel value (load at an angle)" if par else "")
        )
    s_rows = _limit(
        log, "s_rows", "Minimum spacing between rows", k_rows, D, f"{NDS} Table 12.5.1D", rows_note
    )
    # End distance (Table 12.5.1A).
    if par:
        k_end, end_note = (
            7.0,
            "load parallel to grain, in tension toward the end: 7D softwoods (5D hardwoods), "
            "4D in compression; minimum 3.5D / 2D with a geometry factor",
        )
    else:
        k_end, end_note = 4.0, "load perpendicular to grain: 4D (minimum 2D with a geometry factor)"
    e_end = _limit(
        log, "e_end", "End distance for the full design value", k_end, D, f"{NDS} Table 12.5.1A", end_note
    )
    # Spacing in a row (Table 12.5.1B).
    s_row = _limit(
        log,
        "s_row",
        "Spacing of fasteners in a row for the full design value",
        4.0,
        D,
        f"{NDS} Table 12.5.1B",
        "load parallel to grain: 4D (3D minimum); load perpendicular to grain: 3D minimum and the "
        "spacing the attached members need, taken as 4D",
    )
    src = f"{NDS} Tables 12.5.1A-12.5.1D"
    if c is not None:
        checks.append(
            across_check(
                key,
                c,
                lines,
                edge,
                s_rows,
                f"{NDS} Table 12.5.1C",
                why,
                f"Table 12.5.1D: {k_rows:.3g}D between rows, load {direction}",
                log=log.table(LIMIT_GROUP, "W_across", "value"),
            )
        )
    checks.append(
        Check(
            f"{key}.end",
            "End distance from the member end (full design value)",
            Q_(e_end, "in"),
            None,
            None,
            "INFO",
            source=f"{NDS} Table 12.5.1A",
            step=f"{log.prefix}.e_end",  # the step notes the rule (end_note)
        )
    )
    checks.append(
        Check(
            f"{key}.row_spacing",
            "Spacing between rows",
            Q_(s_rows, "in"),
            None,
            None,
            "INFO",
            source=f"{NDS} Table 12.5.1D",
            note=rows_note + ("" if perp else "; rows not over 5 in apart on one splice plate"),
            step=f"{log.prefix}.s_rows",
        )
    )
    return (
        Q_(s_row, "in"),
        None,
        src + f": 4D along the row for CΔ = 1.0 (3D absolute minimum), load {direction}",
    )


def _small(log, checks, key, D, c, theta, lines):
    s_min = _limit(
        log, "s_row", "Minimum spacing along the grain", 10.0, D, NAIL_SRC, "10D to avoid splitting"
    )
    edge = _limit(
        log,
        "e_edge",
        "Minimum edge distance",
        5.0,
        D,
        NAIL_SRC,
        "5D (2.5D with pre-bored holes) to avoid splitting",
    )
    e_end = _limit(
        log, "e_end", "Minimum end distance", 15.0, D, NAIL_SRC, "15D without pre-boring (10D pre-bored)"
    )
    if c is not None:
        s_across = (
            _limit(
                log,
                "s_rows",
                "Minimum spacing between lines across the grain",
                5.0,
                D,
                NAIL_SRC,
                "as the edge distance",
            )
            if lines > 1
            else 5.0 * D
        )
        checks.append(
            across_check(
                key,
                c,
                lines,
                edge,
                s_across,
                NAIL_SRC,
                "5D (2.5D with pre-bored holes) to avoid splitting",
                "5D across the grain, as for the edge distance; common practice, no source",
                log=log.table(LIMIT_GROUP, "W_across", "value"),
            )
        )
    checks.append(
        Check(
            f"{key}.end",
            "End distance from the member end",
            Q_(e_end, "in"),
            None,
            None,
            "INFO",
            source=NAIL_SRC,
            step=f"{log.prefix}.e_end",  # the step notes the rule: 15D without pre-boring (10D pre-bored)
        )
    )
    return Q_(s_min, "in"), None, NAIL_SRC + ": 10D along the grain"
