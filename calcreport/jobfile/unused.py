"""Keys that have no effect where they are written: errors and warnings (docs/job-format.md,
"Keys without effect").

Member and joint keys that contradict their context are errors (raised by ``load.py``: ``shear``
with loads along the member, ``per_row`` / ``spacing_max`` / ``spacing_min`` on a continuous
connector). Job-wide settings that no member or joint of this job uses are warnings: a setting
kept from a starter file is harmless, but it must not look as if it had been applied.
"""

from __future__ import annotations

from typing import Any

from ..model import Member, Settings
from .reader import Table

__all__ = ["is_continuous", "unused_settings", "connector_keys", "NDS_KINDS", "CONTINUOUS_KINDS"]

#: Connector models that are continuous whatever their keys (no spacing, no rows).
CONTINUOUS_KINDS = ("glue", "given_line")
#: Connector models that read the job's load_duration (NDS 2018 dowel fasteners, ASD).
NDS_KINDS = ("nail", "wood_screw", "lag_screw", "wood_bolt")


def is_continuous(kind: str, params: dict[str, Any]) -> bool:
    """True for a connector with no spacing: a glue line, a given capacity per length, a
    continuous fillet weld (one given without ``segment``)."""
    return kind in CONTINUOUS_KINDS or (kind == "fillet_weld" and params.get("segment") is None)


def connector_keys(ct: Table, kind: str, params: dict[str, Any], method: str) -> None:
    """Errors for NDS connector keys that the job's design method or the other keys make inert
    (NDS 2018 Table 11.3.1: C_D applies to ASD only, λ to LRFD only; C_M given overrides
    wet_service; group action §11.3.6 reads row_spacing only for a row of more than one fastener)."""
    if kind not in NDS_KINDS:
        return
    if method != "ASD" and ct.has("CD"):
        raise ct.error("CD", "CD (load duration) applies to ASD only; this job is LRFD (use time_effect)")
    if method != "LRFD" and ct.has("time_effect"):
        raise ct.error("time_effect", "time_effect (λ) applies to LRFD only; this job is ASD (use CD)")
    if ct.has("CM") and ct.has("wet_service"):
        raise ct.error(
            "wet_service", "wet_service has no effect when CM is given (CM overrides it); keep one"
        )
    if ct.has("row_spacing") and int(params.get("row_count") or 1) == 1:
        raise ct.error("row_spacing", "row_spacing has no effect with row_count = 1 (no group action)")


def unused_settings(t: Table, settings: Settings, members: list[Member]) -> None:
    """Warn (``t.warn``) for each job-wide setting given in the file that has no effect on this job."""
    along = [m for m in members if m.loads or m.self_weight]
    spaced: list = [
        j for m in members for j in m.joints if not is_continuous(j.connector.kind, j.connector.params)
    ]
    spaced_along: list = [
        j for m in along for j in m.joints if not is_continuous(j.connector.kind, j.connector.params)
    ]
    plies = [m.ply_fastening for m in members if m.ply_fastening is not None]  # always spaced, zoned
    spaced += plies
    spaced_along += plies
    for key in ("spacing_step", "spacing_max", "spacing_min"):
        if t.has(key) and not spaced:
            t.warn(key, "no joint of this job has spaced connectors (every connector is continuous)")
    for key in ("zones_per_half", "zone_module"):
        if t.has(key) and not spaced_along:
            t.warn(
                key,
                "no zoned schedule is made in this job (zoned schedules need loads along the member "
                "and spaced connectors)",
            )
    if t.has("load_duration"):
        specs = [j.connector for m in members for j in m.joints]
        specs += [m.ply_fastening.connector for m in members if m.ply_fastening is not None]
        nds = [c for c in specs if c.kind in NDS_KINDS and c.params.get("CD") is None]
        # a wood member with plywood webs and a stated shear takes it for its panel shear check
        panel_web = [
            m
            for m in members
            if not (m.loads or m.self_weight)
            and any(p.material.family == "plywood" for p in m.parts)
            and any(p.material.family in ("wood", "glulam") for p in m.parts)
        ]
        if settings.method != "ASD":
            t.warn("load_duration", "the load duration factor applies to ASD only; this job is LRFD")
        elif not nds and not panel_web:
            t.warn(
                "load_duration",
                "no NDS wood connector or plywood-web panel shear check of this job uses it "
                "(none, or each connector gives its own CD)",
            )
    if settings.deflection_limits:
        if not along:
            t.warn(
                "deflection_limits",
                "no member has loads along it, so no deflection is computed",
            )
            return
        cases = {ld.case for m in along for ld in m.loads} | (
            {"D"} if any(m.self_weight for m in along) else set()
        )
        lt = t.table("deflection_limits")
        for case in settings.deflection_limits:
            ec5_set = case == "quasi_permanent" and settings.method == "EC5"  # EN 1990 (6.16b)
            if case != "total" and not ec5_set and case not in cases and lt is not None:
                lt.warn(case, f"no member has loads of case {case!r}, so this limit checks nothing")
