"""JSON form of the analysis along the member and of zoned connector schedules (compact: arrays
as one unit plus a list of numbers). Converts and rounds only; computes nothing."""

from __future__ import annotations

from typing import Any

from .fmt import Display
from .phrases import check_label, check_note, phrase_json

__all__ = ["along_json", "schedule_json"]


def _array(q, d: Display) -> dict[str, Any]:
    vals = [d.json_value(v) for v in q]
    return {"unit": vals[0]["unit"] if vals else "", "values": [v["value"] for v in vals]}


def _opt(v, d: Display):
    return None if v is None else d.json_value(v)


def _check(c, d: Display) -> dict[str, Any]:
    return {
        "key": c.key,
        "label": check_label(c, d),
        "demand": _opt(c.demand, d),
        "capacity": _opt(c.capacity, d),
        "ratio": _opt(c.ratio, d),
        "status": c.status,
        "source": c.source,
        "note": check_note(c, d),
        **phrase_json(c.phrase, d),
    }


def along_json(a, d: Display) -> dict[str, Any]:
    """``a`` is a :class:`calcreport.solve.member_loads.AlongResult`."""
    b = a.analysis
    env = b.envelope
    return {
        "length": d.json_value(b.length),
        "supports": [{"at": d.json_value(s.x), "type": s.kind} for s in b.supports],
        "segments": [
            {"start": d.json_value(s.start), "end": d.json_value(s.end), "kind": s.kind} for s in b.segments
        ],
        "self_weight": _opt(a.self_weight, d),
        "combinations_source": a.combinations_source,
        "combinations": [
            {
                "name": c.name,
                "factors": {k: d.json_value(v) for k, v in c.factors.items()},
                "source": c.source,
            }
            for c in a.combinations
        ],
        "live_cases": list(b.live_cases),
        "cases": [
            {
                "name": c.name,
                "reactions": [
                    {"at": d.json_value(r.x), "force": d.json_value(r.force), "moment": _opt(r.moment, d)}
                    for r in c.reactions
                ],
            }
            for c in b.cases
        ],
        "V_design": d.json_value(a.V_design),
        "V_governing": a.V_governing,
        "M_design": d.json_value(a.M_design),
        "M_governing": a.M_governing,
        "deflection_limits": {k: d.json_value(v) for k, v in a.deflection_limits.items()},
        "envelope": {
            "x": _array(env.x, d),
            "V_max": _array(env.V_max, d),
            "V_min": _array(env.V_min, d),
            "M_max": _array(env.M_max, d),
            "M_min": _array(env.M_min, d),
            "V_abs": _array(env.V_abs, d),
            "V_abs_by": list(env.V_abs_by),
            "M_max_by": list(env.M_max_by),
            "M_min_by": list(env.M_min_by),
        },
        "checks": [_check(c, d) for c in a.checks],
    }


def schedule_json(s, d: Display) -> dict[str, Any]:
    """``s`` is a :class:`calcreport.solve.schedule.Schedule`."""
    return {
        "status": s.status,
        "feasible": s.feasible,
        "reason": s.reason,
        "symmetric": s.symmetric,
        "zones": [
            {
                "start": d.json_value(z.start),
                "end": d.json_value(z.end),
                "spacing": d.json_value(z.spacing),
                "count": z.count,
                "demand_max": d.json_value(z.demand_max),
                "spacing_required": _opt(z.spacing_required, d),
                "governing": z.governing,
                "capacity": _opt(z.capacity, d),
            }
            for z in s.zones
        ],
        "count": s.count,
        "count_min": d.json_value(s.count_min),
        "ratio": _opt(s.ratio, d),
        "count_single": s.count_single,
        "spacing_single": _opt(s.spacing_single, d),
        "saving": _opt(s.saving, d),
        "zones_per_half": s.zones_per_half,
        "zones_per_span": s.zones_per_span,  # null on a simple span (zoned by zones_per_half)
        "segment_ends": [d.json_value(e) for e in s.segment_ends],
        "module": _opt(s.module, d),
        "increment": d.json_value(s.increment),
        "spacing_min": d.json_value(s.spacing_min),
        "spacing_max": d.json_value(s.spacing_max),
        "capacity_row": d.json_value(s.capacity_row),
    }
