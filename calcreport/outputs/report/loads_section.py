"""Loads along the member: figures and schedule tables for one member, placed by
``member_story.py`` in the order of the work. Rendered generically:

* each joint's ``schedule`` (``JointResult.schedule``) as a table of zones — start, end, spacing,
  count — read from ``schedule.zones`` whose items are ``(start, end, spacing, count)`` tuples or
  objects with those attributes (quantities, or plain floats in inches);
* the beam analysis (``MemberResult.beam``): V and M envelope charts when ``beam.envelope`` (or ``beam.analysis.envelope``) has
  ``x`` with ``V_max``/``V_min`` and ``M_max``/``M_min`` as array quantities.

The loads developer replaces or extends :func:`beam_figures` and :func:`schedule_figures` (e.g. a
zone elevation); :func:`.plots.line_chart` draws x–y charts with labelled axes.
"""

from __future__ import annotations

from typing import Any

from reportlab.platypus import Flowable, KeepTogether

from ...solve.results import JointResult, MemberResult
from ...units import Q_, Quantity
from .common import Ctx, grid, para
from .plots import Series, line_chart, positions, series_values

__all__ = ["beam_figures", "schedule_figures", "schedule_key", "zone_rows"]


def _get(obj: Any, name: str, index: int) -> Any:
    if isinstance(obj, (tuple, list)):
        return obj[index] if index < len(obj) else None
    if isinstance(obj, dict):
        return obj.get(name)
    return getattr(obj, name, None)


def _pos_text(v: Any, ctx: Ctx) -> str:
    """A position along the member in the drawing convention (feet-inches in US units)."""
    if isinstance(v, Quantity):
        return ctx.display.position(v)
    return _len_text(v, ctx)


def _len_text(v: Any, ctx: Ctx) -> str:
    if v is None:
        return "—"
    if isinstance(v, Quantity):
        return ctx.q(v, 4)
    if isinstance(v, (int, float)):
        return ctx.q(Q_(float(v), "inch"), 4)
    return str(v)


def zone_rows(schedule: Any, ctx: Ctx) -> list[list]:
    """Rows (header first) of a zoned schedule: start, end, spacing, count."""
    zones = getattr(schedule, "zones", schedule)
    rows = [["Zone", "From", "To", "Spacing", "Rows", "Governing combination"]]
    for i, z in enumerate(zones or (), 1):
        count = _get(z, "count", 3)
        rows.append(
            [
                str(i),
                _pos_text(_get(z, "start", 0), ctx),
                _pos_text(_get(z, "end", 1), ctx),
                _len_text(_get(z, "spacing", 2), ctx),
                "—" if count is None else ctx.q(count),
                str(_get(z, "governing", 6) or "—"),
            ]
        )
    return rows


def combinations_table(m: MemberResult, ctx: Ctx) -> list[Flowable]:
    """Every load combination used for the envelopes, with its factors and source."""
    combos = getattr(m.beam, "combinations", None) or ()
    if not combos:
        return []
    st, w = ctx.styles, ctx.width
    rows = [["Combination", "Factors", "Source"]]
    for c in combos:
        factors = " + ".join(f"{ctx.q(f, 3)}·{case}" for case, f in c.factors.items())
        rows.append([para(c.name, st.cell), para(factors, st.cell), para(c.source or "job file", st.cell)])
    source = getattr(m.beam, "combinations_source", "") or ""
    title = para("Load combinations" + (f" — {source}" if source else ""), st.h3)
    live = getattr(getattr(m.beam, "analysis", None), "live_cases", ()) or ()
    words = "Each zone of a schedule names the combination that governs its largest shear flow."
    if live:
        words += (
            f" Variable cases ({', '.join(live)}) are placed for their worst effect at every x; "
            "“partial” after a case marks it loaded on part of the member only there, “moving” its moving "
            "loads at their worst position."
        )
    note = para(words, st.small)
    return [KeepTogether([title, grid(rows, [0.30 * w, 0.30 * w, 0.40 * w], st)]), note]


def schedule_key(member_id: str, joint_id: str) -> str:
    """The key a revision diff gives a joint's zoned schedule (prefix of its derivation steps)."""
    return f"member.{member_id}.joint.{joint_id}.schedule"


def schedule_figures(j: JointResult, ctx: Ctx, member_id: str = "") -> list[Flowable]:
    """The zone table of a joint's schedule, its heading marked with the revision triangle when the
    schedule changed (``ctx.changed_keys`` holds :func:`schedule_key`; needs ``member_id``)."""
    st, w = ctx.styles, ctx.width
    title = para(f"Connector schedule — joint {j.id}", st.h3)
    mark = ctx.mark(schedule_key(member_id, j.id)) if member_id else []
    rows = zone_rows(j.schedule, ctx)
    widths = [0.07 * w, 0.15 * w, 0.15 * w, 0.14 * w, 0.09 * w, 0.40 * w]
    block: list[Flowable] = [*mark, title, grid(rows, widths, st)]
    total = getattr(j.schedule, "count", None)
    status = getattr(j.schedule, "status", None)
    note = []
    if total is not None:
        note.append(f"total {ctx.q(total)} connector rows")
    if status:
        note.append(f"status {status}")
    if note:  # the total closes the table: kept with it
        block.append(para("; ".join(note), st.small))
    return [KeepTogether(block)]


def beam_figures(m: MemberResult, ctx: Ctx) -> list[Flowable]:
    """Shear and moment envelopes when the beam result carries them; a note otherwise."""
    st = ctx.styles
    env = getattr(m.beam, "envelope", None)
    if env is None:  # AlongResult keeps the beam analysis under .analysis
        env = getattr(getattr(m.beam, "analysis", None), "envelope", None)
    x = getattr(env, "x", None)
    out: list[Flowable] = []
    for name, lo, hi in (("Shear V", "V_min", "V_max"), ("Bending moment M", "M_min", "M_max")):
        a, b = getattr(env, lo, None), getattr(env, hi, None)
        if not (isinstance(x, Quantity) and isinstance(a, Quantity) and isinstance(b, Quantity)):
            continue
        xs, xu = positions(ctx.display, x)
        ys_hi, yu = series_values(ctx.display, b)
        ys_lo, _ = series_values(ctx.display, a)
        chart = line_chart(
            [Series("maximum", xs, ys_hi), Series("minimum", xs, ys_lo, dashed=True)],
            f"x along the member ({xu})",
            f"{name.split()[-1]} ({yu})",
            ctx.width,
            150,
            st.fonts,
            title=f"{name} envelope",
        )
        out.append(KeepTogether([chart, para(f"{name} envelope over the load combinations.", st.caption)]))
    if not out:
        out.append(para("The analysis along the member is given step by step in the derivation.", st.small))
    return out
