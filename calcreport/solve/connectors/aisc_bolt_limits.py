"""Detailing limits of bolts in steel, each a step: spacing (AISC 360-16 §J3.3, §J3.5), edge
distance (Table J3.4, §J3.5) and the tearout end distance (§J3.10). Used by :mod:`.aisc_bolt`.
Units inside: in (floats); steps carry quantities."""

from __future__ import annotations

from ...steps import Phrase, StepLog
from ...units import Q_, Quantity
from ..results import Check
from .shear_plane import across_check

__all__ = ["EDGE_MIN", "edge_min", "bolt_limits"]

SRC = "ANSI/AISC 360-16"

#: Minimum edge distance (in) from the centre of a standard hole. AISC 360-16 Table J3.4 (from memory).
EDGE_MIN = {0.5: 0.75, 0.625: 0.875, 0.75: 1.0, 0.875: 1.125, 1.0: 1.25, 1.125: 1.5, 1.25: 1.625}


def edge_min(d: float) -> float:
    """Minimum edge distance (in), AISC 360-16 Table J3.4; 1.25·d over 1-1/4 in. Between tabulated
    diameters the next larger diameter's value is used (conservative)."""
    if d > 1.25 + 1e-9:
        return 1.25 * d
    for k in sorted(EDGE_MIN):
        if d <= k + 1e-9:
            return EDGE_MIN[k]
    return 1.25 * d


def bolt_limits(
    log: StepLog,
    p: dict,
    key: str,
    c,
    ctx,
    d: float,
    dh: float,
    lcq: Quantity,
    lc_req: float,
    s_tear: float,
    t_thin: float,
) -> tuple[list[Check], float, float, str]:
    """Spacing and edge-distance limits of a steel bolt as steps and checks →
    (checks, s_min, s_max, source of s_max). ``t_thin`` is the thinner connected part (in).
    Source: AISC 360-16 §J3.3 (2-2/3·d, 3·d preferred), §J3.5 (24·t ≤ 12 in, 14·t ≤ 7 in weathering,
    12·t ≤ 6 in edge), Table J3.4 (minimum edge distance), §J3.10 (tearout end distance)."""
    dq = Q_(d, "in")
    s_33 = log.add(
        "s_min_J33",
        "Minimum bolt spacing",
        "s_min = 2-2/3·d",
        "8/3 × {d}",
        {"d": dq},
        Q_(8 / 3 * d, "in"),
        source=f"{SRC} §J3.3",
    ).magnitude
    s_min = log.add(
        "s_min",
        "Minimum spacing used",
        "s_min = max(2-2/3·d, s_tearout)",
        "max({a}, {b})",
        {"a": Q_(s_33, "in"), "b": Q_(s_tear, "in")},
        Q_(max(s_33, s_tear), "in"),
        source=f"{SRC} §J3.3, §J3.10",
    ).magnitude
    s_pref = log.add(
        "s_pref",
        "Preferred bolt spacing",
        "s = 3·d",
        "3 × {d}",
        {"d": dq},
        Q_(3 * d, "in"),
        source=f"{SRC} §J3.3",
    )
    tq = Q_(t_thin, "in")
    if p.get("weathering"):
        smsrc = f"{SRC} §J3.5(b): 14·t ≤ 7 in (unpainted weathering steel)"
        s_max = log.add(
            "s_max",
            "Maximum bolt spacing (weathering steel)",
            "s_max = min(14·t, 7 in)",
            "min(14 × {t}, 7 in)",
            {"t": tq},
            Q_(min(14 * t_thin, 7.0), "in"),
            source=f"{SRC} §J3.5(b)",
            note="t = the thinner connected part",
        ).magnitude
    else:
        smsrc = f"{SRC} §J3.5(a): 24·t ≤ 12 in (painted or not subject to corrosion)"
        s_max = log.add(
            "s_max",
            "Maximum bolt spacing",
            "s_max = min(24·t, 12 in)",
            "min(24 × {t}, 12 in)",
            {"t": tq},
            Q_(min(24 * t_thin, 12.0), "in"),
            source=f"{SRC} §J3.5(a)",
            note="t = the thinner connected part",
        ).magnitude
    le = log.add(
        "le_tearout",
        "End distance of the end bolt at which tearout does not govern",
        "le = lc + dh/2",
        "{lc} + {dh} / 2",
        {"lc": lcq, "dh": Q_(dh, "in")},
        Q_(lc_req + dh / 2, "in"),
        source=f"{SRC} §J3.10 (lc = le − dh/2)",
    )
    e_max = log.add(
        "e_max",
        "Maximum edge distance",
        "e_max = min(12·t, 6 in)",
        "min(12 × {t}, 6 in)",
        {"t": tq},
        Q_(min(12 * t_thin, 6.0), "in"),
        source=f"{SRC} §J3.5",
    )
    e_min = edge_min(d)
    if c is not None:
        log.add(
            "e_min",
            "Minimum edge distance",
            "e_min",
            "{e}",
            {"e": Q_(e_min, "in")},
            Q_(e_min, "in"),
            source=f"{SRC} Table J3.4",
            phrase=Phrase("bolt_edge_row", {"d": dq}),
        )
    checks = [
        Check(
            f"{key}.spacing_pref",
            "Preferred spacing 3d (minimum 2-2/3 d)",
            s_pref,
            None,
            None,
            "INFO",
            source=f"{SRC} §J3.3",
            step=f"{log.prefix}.s_pref",
        ),
        Check(
            f"{key}.end",
            "End distance of the end bolt so tearout does not govern",
            le,
            None,
            None,
            "INFO",
            source=f"{SRC} §J3.10 (lc = le − dh/2) and Table J3.4",
            note="and not less than the Table J3.4 edge distance",
            step=f"{log.prefix}.le_tearout",
        ),
        Check(
            f"{key}.edge_max",
            "Maximum edge distance 12·t ≤ 6 in",
            None,
            e_max,
            None,
            "INFO",
            source=f"{SRC} §J3.5",
            step=f"{log.prefix}.e_max",
        ),
    ]
    if c is not None:
        checks.insert(
            0,
            across_check(
                key,
                c,
                max(getattr(ctx, "per_row", 1), 1),
                e_min,
                s_33,
                f"{SRC} Table J3.4; §J3.3",
                "Table J3.4 minimum edge distance",
                "§J3.3 minimum spacing 2-2/3 d between bolts across the force",
                log=log,
            ),
        )
    return checks, s_min, s_max, smsrc
