"""Shear flow, required connector spacing and the practical spacing (rounded down).

Sources: q = V·Q/I (mechanics of materials, shear flow in built-up beams); s = n·F/q (equilibrium
of one connector row over its tributary length); practical spacing rounded DOWN to the detailing
increment, never up, and capped by the largest multiple of the increment not above the maximum
spacing — every practical spacing is a multiple of the increment (common practice, no source).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from ..steps import StepLog
from ..units import Q_, Quantity

__all__ = ["shear_flow", "round_down", "SpacingResult", "discrete_spacing", "continuous_check"]

SOURCE_Q = "mechanics of materials: shear flow q = V·Q/I"


def shear_flow(V: Quantity, Q: Quantity, I: Quantity, log: StepLog) -> Quantity:
    """q = V·Q/I — shear force per unit length on the plane (mechanics of materials)."""
    return log.add(
        "q",
        "Shear flow on the shear plane",
        "q = V·Q / I",
        "{V} × {Q} / {I}",
        {"V": V, "Q": Q, "I": I},
        (V * Q / I).to("lbf/in"),
        source=SOURCE_Q,
    )


def round_down(s: Quantity, step: Quantity) -> Quantity:
    """Largest multiple of ``step`` not above ``s`` (common practice, no source).

    A relative tolerance of 1e-9 keeps 3.0 from becoming 2.75 through round-off.

    Example:
        >>> round_down(Q_(3.37, "in"), Q_(0.25, "in"))
        <Quantity(3.25, 'inch')>
    """
    k = math.floor(float((s / step).to("")) * (1 + 1e-9))
    return (k * step).to(s.units)


@dataclass(frozen=True)
class SpacingResult:
    required: Quantity | None
    provided: Quantity | None
    s_min: Quantity | None
    s_max: Quantity | None
    utilisation: float
    status: str
    reasons: tuple[str, ...]


def discrete_spacing(
    q: Quantity,
    n: int,
    F: Quantity,
    step: Quantity,
    s_min: Quantity | None,
    s_max: Quantity | None,
    log: StepLog,
    limit_source: str = "detailing limit",
) -> SpacingResult:
    """Required spacing s = n·F/q, practical spacing rounded down, limits applied; ``limit_source``
    is cited where the maximum spacing caps the practical one.

    A practical spacing below ``s_min`` makes the joint NG (the connector cannot be placed that
    closely); the reason is stated. Source: equilibrium of a connector row (s·q = n·F); rounding
    and limits are common practice, no source.
    """
    reasons: list[str] = []
    nF = log.add(
        "nF",
        "Capacity of one row of connectors",
        "n·F",
        "{n} × {F}",
        {"n": n, "F": F},
        (n * F).to("lbf"),
        source="assumption: a row shares equally",
    )
    q_mag = float(q.to("lbf/in").magnitude)
    cap = _grid_limit(s_max, step, log)
    if s_max is not None and float(cap.to("inch").magnitude) <= 0:
        reasons.append(
            "the maximum spacing is below the spacing increment: no multiple of the increment satisfies it"
        )
    if s_max is not None and s_min is not None and cap < s_min * (1 - 1e-9):
        reasons.append(
            "no multiple of the spacing increment lies between the minimum and the maximum spacing"
        )
    if q_mag <= 0:
        req = None
        if s_max is None:
            return SpacingResult(
                None,
                None,
                s_min,
                s_max,
                0.0,
                "OK",
                ("no shear flow; spacing set by detailing (no spacing_max given)",),
            )
        prov = log.add(
            "s_prov",
            "Practical spacing",
            "s = ⌊s_max / Δ⌋·Δ (no shear flow)",
            "{s_max}",
            {"s_max": cap},
            cap,
            source="common practice, no source",
        )
        status = "NG" if reasons else "OK"
        return SpacingResult(req, prov, s_min, s_max, 0.0, status, tuple(reasons))
    req = log.add(
        "s_req",
        "Required spacing",
        "s_req = n·F / q",
        "{nF} / {q}",
        {"nF": nF, "q": q},
        (nF / q).to("inch"),
        source="equilibrium of one connector row: q·s = n·F",
    )
    rounded = log.add(
        "s_round",
        "Required spacing rounded down to the increment",
        "s = ⌊s_req / Δ⌋·Δ",
        "⌊{s_req} / {step}⌋ × {step}",
        {"s_req": req, "step": step},
        round_down(req, step),
        source="common practice, no source",
    )
    prov = rounded
    if s_max is not None and prov > cap:
        on_grid = abs(float((cap - s_max).to("inch").magnitude)) <= 1e-9 * float(s_max.to("inch").magnitude)
        prov = log.add(
            "s_cap",
            "Spacing capped by the maximum spacing",
            "s = min(s, s_max)" if on_grid else "s = min(s, s_max,Δ)",
            "min({s}, {s_max})" if on_grid else "min({s}, {s_max_grid})",
            {"s": rounded, "s_max": s_max} if on_grid else {"s": rounded, "s_max_grid": cap},
            cap,
            source=limit_source
            if on_grid
            else f"{limit_source}, on the increment (s_max,Δ = ⌊s_max / Δ⌋·Δ; common practice, no source)",
        )
    if not reasons and s_min is not None and prov < s_min * (1 - 1e-9):
        reasons.append(
            "practical spacing is below the minimum spacing; use stronger or more connectors per row"
        )
    if not reasons and float(prov.to("inch").magnitude) <= 0:
        reasons.append("required spacing is less than one increment")
    status = "NG" if reasons else "OK"
    if status == "NG":
        # The closest the connectors can be placed: the minimum spacing (or one increment). The
        # utilisation there is the real one, above 1 (never the 0 of a zero spacing).
        closest = s_min if s_min is not None and s_min > step else step
        prov = log.add(
            "s_closest",
            "Closest spacing the connectors can be placed at",
            "s = max(s_min, Δ)",
            "max({s_min}, {step})",
            {"s_min": s_min if s_min is not None else step * 0, "step": step},
            closest.to("inch"),
            source="detailing limit",
            note="the required spacing is smaller: the joint is NG at this spacing",
        )
    util = float((q * prov / nF).to(""))
    log.add(
        "util",
        "Utilisation of the connector row at the practical spacing",
        "q·s / (n·F)",
        "{q} × {s} / {nF}",
        {"q": q, "s": prov, "nF": nF},
        util,
        source="demand / capacity",
    )
    return SpacingResult(req, prov, s_min, s_max, util, status, tuple(reasons))


def continuous_check(q: Quantity, q_cap: Quantity, log: StepLog) -> SpacingResult:
    """Continuous connector (glue line, continuous weld): q ≤ q_cap (mechanics of materials)."""
    util = log.add(
        "util",
        "Utilisation of the continuous connection",
        "q / q_cap",
        "{q} / {q_cap}",
        {"q": q, "q_cap": q_cap},
        float((q / q_cap).to("")),
        source="demand / capacity",
    )
    status = "OK" if util <= 1.0 + 1e-9 else "NG"
    reasons = () if status == "OK" else ("shear flow exceeds the capacity of the continuous connection",)
    return SpacingResult(None, None, None, None, util, status, reasons)


def _grid_limit(s_max: Quantity | None, step: Quantity, log: StepLog) -> Quantity:
    """The largest multiple of the increment not above the maximum spacing (common practice, no
    source: a practical spacing is a multiple of the increment); ``step`` itself when no maximum
    is given. Logged only when the maximum is off the grid."""
    if s_max is None:
        return step.to("inch")
    cap = round_down(s_max, step).to("inch")
    if abs(float((cap - s_max).to("inch").magnitude)) > 1e-9 * float(s_max.to("inch").magnitude):
        log.add(
            "s_max_grid",
            "Maximum spacing rounded down to the increment",
            "s_max,Δ = ⌊s_max / Δ⌋·Δ",
            "⌊{s_max} / {step}⌋ × {step}",
            {"s_max": s_max, "step": step},
            cap,
            source="common practice, no source (a practical spacing is a multiple of the increment)",
        )
    return cap


def combine_limits(*limits: Quantity | None, pick=max) -> Quantity | None:
    """The governing limit among those given (``max`` for minimums, ``min`` for maximums)."""
    given = [q.to("inch") for q in limits if q is not None]
    return pick(given) if given else None


_ = Q_  # re-exported for doctest
