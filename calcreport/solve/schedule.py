"""Zoned connector schedule for one joint, with economy figures and derivation steps.

Input is the shear-flow demand q(x) = |V(x)|·Q/I along the member (the envelope over the load
combinations) and the capacity of one row of connectors n·F. The schedule has the fewest
connectors the rules of :mod:`calcreport.solve.schedule_dp` allow (exact dynamic programme):

* spacing a multiple of the increment, within [s_min, s_max], and s ≤ n·F/q(x) over each zone;
* zone lengths in multiples of the module (default: the zone's own spacing), built from the
  member ends; one central zone takes the remainder;
* at most Z distinct zones per half span; symmetric demand gives a mirrored schedule;
* a member with interior supports or overhangs is zoned span by span: each span or overhang
  follows these rules on its own with at most Z_s (``zones_per_span``) zones per half of it; a
  member symmetric about its middle gets mirrored spans;
* among schedules with the fewest connectors: the fewest zones, then the larger end spacing;
* N = 1 + Σ ceil(ℓᵢ/sᵢ): one connector at x = 0, then each zone's connectors at its spacing.

Economy figures: N_min = ∫ max(q/(n·F), 1/s_max) dx (no schedule can use fewer connectors, since
every gap is ≤ n·F/q and ≤ s_max), N/N_min, and N_single for one spacing taken from the peak
shear flow (rounded down to the increment, capped by s_max) over the whole length.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

import numpy as np

from ..steps import StepLog
from ..units import Q_, Quantity, ureg
from .schedule_demand import Demand
from .schedule_dp import optimise

__all__ = ["Zone", "Schedule", "zoned_schedule", "SOURCE_SPACING", "SOURCE_RULES"]

SOURCE_SPACING = "mechanics of materials (q = V·Q/I; spacing s = n·F/q)"
SOURCE_RULES = "common practice, no source (spacing rounded down to the increment; zoning rules)"
_IN = "inch"
#: Most module-grid points along the member (work and memory grow with its square).
MAX_GRID = 2400


@dataclass(frozen=True)
class Zone:
    start: Quantity
    end: Quantity
    spacing: Quantity
    count: int  # connector rows in (start, end]; the first zone also counts the one at x = 0
    demand_max: Quantity  # largest q in the zone
    spacing_required: Quantity | None  # n·F / q_max (None where q = 0)
    governing: str  # combination governing the largest q in the zone
    capacity: Quantity | None = None  # provided shear-flow capacity n·F / s of the zone


@dataclass(frozen=True)
class Schedule:
    """A zoned schedule (``zones`` empty when no schedule can satisfy the rules)."""

    feasible: bool
    zones: tuple[Zone, ...]
    count: int | None  # N
    count_min: float  # N_min (continuous lower bound)
    ratio: float | None  # N / N_min
    count_single: int | None  # N with one spacing from the peak shear flow
    spacing_single: Quantity | None
    saving: float | None  # 1 − N / N_single
    symmetric: bool
    zones_per_half: int
    module: Quantity | None
    increment: Quantity
    spacing_min: Quantity
    spacing_max: Quantity
    capacity_row: Quantity
    length: Quantity
    x: Quantity  # demand grid (inch) as given
    demand: Quantity  # q(x) (lbf/inch)
    reason: str = ""
    steps: tuple = ()
    status: str = "OK"  # "NG" when no schedule satisfies the rules
    zones_per_span: int | None = None  # Z_s on a member with several spans/overhangs, else None
    segment_ends: tuple[Quantity, ...] = ()  # interior supports the zoning works between


def zoned_schedule(
    x: Quantity,
    q: Quantity,
    length: Quantity,
    capacity_row: Quantity,
    increment: Quantity,
    spacing_min: Quantity | None,
    spacing_max: Quantity,
    zones_per_half: int = 3,
    module: Quantity | None = None,
    governing: tuple[str, ...] = (),
    log: StepLog | None = None,
    segment_ends: tuple[Quantity, ...] = (),
    zones_per_span: int | None = None,
    demand: tuple[str, str, str] | None = None,
) -> Schedule:
    """Fewest-connector zoned schedule for a joint (see the module docstring for the rules).

    Args:
        x, q: demand grid and shear flow q(x) (arrays; a position may appear twice at a jump).
        length: member length.
        capacity_row: n·F, design value of one row of connectors.
        increment: spacings are whole multiples of this.
        spacing_min, spacing_max: detailing limits (s_min defaults to the increment).
        zones_per_half: Z, most distinct zones per half span.
        module: zone lengths in multiples of this (``None``: each zone's own spacing).
        governing: combination name per x (from the shear envelope), for the zone records.
        segment_ends: interior supports of a member with more than one span or overhang; the
            schedule is then zoned span by span with at most ``zones_per_span`` (default Z)
            zones per half of each.
        demand: (name, formula, source) of the demand when it is not the shear flow V·Q/I
            (plies side by side: the transfer demand between plies).

    Source: mechanics of materials (s = n·F/q); rules: common practice, no source.
    """
    log = log or StepLog("schedule")
    first = len(log.steps)
    xs = np.asarray(x.to(_IN).magnitude, float)
    qs = np.abs(np.asarray(q.to("lbf/inch").magnitude, float))
    L = length.to(_IN).magnitude
    nF = capacity_row.to("lbf").magnitude
    inc = increment.to(_IN).magnitude
    smin = inc if spacing_min is None else max(spacing_min.to(_IN).magnitude, inc)
    smax = spacing_max.to(_IN).magnitude
    mod = None if module is None else module.to(_IN).magnitude
    whole = mod is None or abs(mod / inc - round(mod / inc)) <= 1e-6 * max(1.0, mod / inc)
    if not whole and max(1, int(np.ceil(mod / inc - 1e-6))) * inc * MAX_GRID >= L:
        up = max(1, int(np.ceil(mod / inc - 1e-6))) * inc
        log.add(
            "module",
            "Zone module made a whole number of increments",
            "m = ⌈m_given / Δ⌉·Δ",
            "⌈{m} / {inc}⌉ × {inc}",
            {"m": Q_(mod, _IN), "inc": increment},
            Q_(up, _IN),
            source=SOURCE_RULES,
        )
        mod, whole = up, True
        module = Q_(up, _IN)
    if (mod or inc) * MAX_GRID < L or not whole:  # (coarsened modules are whole increments)
        coarse = float(np.ceil(L / MAX_GRID / inc)) * inc
        log.add(
            "module",
            "Zone module coarsened to bound the work",
            "m = ⌈L / (N_grid·Δ)⌉·Δ",
            "⌈{L} / ({n} × {inc})⌉ × {inc}",
            {"L": length, "n": MAX_GRID, "inc": increment},
            Q_(coarse, _IN),
            source=SOURCE_RULES,
        )
        mod = coarse
        module = Q_(coarse, _IN)
    d = Demand(xs, qs, L)
    peak = float(qs.max()) if qs.size else 0.0
    kpeak = int(np.argmax(qs)) if qs.size else 0
    q_peak = Q_(peak, "lbf/inch")
    d_name, d_formula, d_source = demand or ("shear flow", "max of |V(x)|·Q/I", SOURCE_SPACING)
    log.add(
        "q_peak",
        f"Largest {d_name} along the member",
        "q_max",
        d_formula,
        {},
        q_peak,
        source=d_source,
    )
    s_req = Q_(nF / peak, _IN) if peak > 0 else None
    if s_req is not None:
        log.add(
            "s_req_peak",
            f"Spacing required at the largest {d_name}",
            "s = n·F / q_max",
            "{nF} / {q}",
            {"nF": capacity_row, "q": q_peak},
            s_req,
            source=d_source,
        )
    n_min = d.bound(nF, smax)
    log.add(
        "N_min",
        "Fewest connectors any layout could use (continuous bound)",
        "N_min = ∫ max(q/(n·F), 1/s_max) dx",
        "over L = {L}, n·F = {nF}, s_max = {smax}",
        {"L": length, "nF": capacity_row, "smax": spacing_max},
        n_min,
        source=SOURCE_RULES,
        positions=("L",),
    )
    s1 = np.floor(min(nF / peak if peak > 0 else np.inf, smax) / inc * (1 + 1e-9) + 1e-9) * inc
    n_single = int(1 + np.ceil(L / s1 - 1e-9)) if s1 >= smin - 1e-9 and s1 > 0 else None
    common: dict[str, Any] = dict(
        count_min=n_min,
        symmetric=False,
        zones_per_half=zones_per_half,
        module=module,
        increment=increment,
        spacing_min=Q_(smin, _IN),
        spacing_max=spacing_max,
        capacity_row=capacity_row,
        length=length,
        x=x,
        demand=q,
    )
    ends = tuple(float(e.to(_IN).magnitude) for e in segment_ends)
    ends = tuple(e for e in ends if 1e-9 * max(L, 1) < e < L - 1e-9 * max(L, 1))
    z_span = (zones_per_span if zones_per_span is not None else zones_per_half) if ends else None
    common["zones_per_span"] = z_span
    common["segment_ends"] = tuple(Q_(e, _IN) for e in ends)
    lay = optimise(d, nF, inc, smin, smax, zones_per_half, mod, bounds=ends, zones_per_span=z_span)
    if lay is None or n_single is None:
        why = (
            "the shear flow needs a spacing below the minimum"
            if s_req is not None and s_req.to(_IN).magnitude < smin
            else "no spacing satisfies the limits"
        )
        log.add(
            "none",
            "No schedule within the spacing limits",
            "s_req < s_min",
            "required {sreq} at x = {x}; minimum {smin}",
            {"sreq": s_req if s_req is not None else "none", "x": Q_(xs[kpeak], _IN), "smin": Q_(smin, _IN)},
            "NG",
            source=SOURCE_RULES,
        )
        return Schedule(
            False,
            (),
            None,
            ratio=None,
            count_single=None,
            spacing_single=None,
            saving=None,
            reason=why,
            steps=tuple(log.steps[first:]),
            status="NG",
            **common,
        )
    zones = []
    qmax = d.elementary(np.array([lay.zones[0][0]] + [z[1] for z in lay.zones]))
    order = np.argsort(xs, kind="stable")
    x_sorted, q_sorted = xs[order], qs[order]
    inch, flow = ureg.Unit(_IN), ureg.Unit("lbf/inch")
    for k, (a, b, s, n) in enumerate(lay.zones):
        qm = float(qmax[k])
        lo = int(np.searchsorted(x_sorted, a - 1e-9, "left"))
        hi = int(np.searchsorted(x_sorted, b + 1e-9, "right"))
        j = int(order[lo + int(np.argmax(q_sorted[lo:hi]))]) if hi > lo else kpeak
        gov = governing[j] if j < len(governing) else ""
        cnt = n + (1 if k == 0 else 0)
        z = Zone(
            Q_(a, inch),
            Q_(b, inch),
            Q_(s, inch),
            cnt,
            Q_(qm, flow),
            Q_(nF / qm, inch) if qm > 0 else None,
            gov,
            Q_(nF / s, flow),
        )
        zones.append(z)
        log.add(
            f"zone.{k + 1}",
            f"Zone {k + 1}",
            "s ≤ n·F / q_max,zone",
            "{s} ≤ {nF} / {q} = {sreq}; {n} connectors from {a} to {b}",
            {
                "s": z.spacing,
                "nF": capacity_row,
                "q": z.demand_max,
                "sreq": z.spacing_required if z.spacing_required is not None else "no limit",
                "n": cnt,
                "a": z.start,
                "b": z.end,
            },
            z.spacing,
            source=d_source,
            note=f"governed by {gov}" if gov else "",
            positions=("a", "b"),
        )
    ratio = lay.count / n_min if n_min > 0 else None
    saving = 1.0 - lay.count / n_single
    log.add(
        "N",
        "Connectors in the zoned schedule",
        "N = 1 + Σ ceil(ℓᵢ / sᵢ)",
        "{zones} zones, {sym}",
        {
            "zones": len(zones),
            "sym": ("symmetric" if lay.symmetric else "not symmetric")
            + (f", zoned span by span (at most {z_span} per half span)" if ends else ""),
        },
        lay.count,
        source=SOURCE_RULES,
        governs=True,
    )
    log.add(
        "ratio",
        "Schedule against the continuous bound",
        "N / N_min",
        "{N} / {Nmin}",
        {"N": lay.count, "Nmin": n_min},
        ratio if ratio is not None else "n/a",
        source=SOURCE_RULES,
    )
    log.add(
        "N_single",
        "Connectors with one spacing from the peak shear flow",
        "N_1 = 1 + ceil(L / s_1)",
        "s_1 = {s1} over L = {L}",
        {"s1": Q_(s1, _IN), "L": length},
        n_single,
        source=SOURCE_RULES,
    )
    log.add(
        "saving",
        "Connectors saved by zoning",
        "1 − N / N_1",
        "1 − {N} / {N1}",
        {"N": lay.count, "N1": n_single},
        saving,
        source=SOURCE_RULES,
    )
    common["symmetric"] = lay.symmetric
    return Schedule(
        True,
        tuple(zones),
        lay.count,
        ratio=ratio,
        count_single=n_single,
        spacing_single=Q_(s1, _IN),
        saving=saving,
        steps=tuple(log.steps[first:]),
        **common,
    )
