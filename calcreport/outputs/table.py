"""Compact terminal table per member: joint, q, capacity per row, required and practical spacing."""

from __future__ import annotations

from ..solve.results import JobResult, MemberResult
from .fmt import Display
from .phrases import check_label, check_note
from .scope_text import checked_line, not_checked_line, status_words

__all__ = ["render_job"]


def _cols(rows: list[list[str]], right: set[int]) -> list[str]:
    widths = [max(len(r[i]) for r in rows) for i in range(len(rows[0]))]
    out = []
    for r in rows:
        cells = [c.rjust(w) if i in right else c.ljust(w) for i, (c, w) in enumerate(zip(r, widths))]
        out.append("  ".join(cells).rstrip())
    return out


def render_member(m: MemberResult, d: Display) -> list[str]:
    s = m.section
    lines = [
        f"{m.id} — {m.member.title}   [{status_words(m)}]",
        f"  {checked_line(m)}",
        f"  {not_checked_line(m)}",
        f"  section: A = {d.quantity(s.area)}, ȳ = {d.quantity(s.centroid)} above bottom, "
        f"I = {d.quantity(s.inertia)} (ref. {s.reference_material}); V = {d.quantity(m.shear)}",
    ]
    rows = [["joint", "Q", "q", "capacity/row", "s req", "s used", "util", "status"]]
    for j in m.joints:
        cap = d.quantity(j.capacity_row) + (" (cont.)" if j.continuous else f" ({j.per_row}×)")
        rows.append(
            [
                j.id,
                d.quantity(j.Q) if j.Q is not None else "—",  # plies: no Q
                d.quantity(j.shear_flow),
                cap,
                d.quantity(j.spacing_required) if j.spacing_required is not None else "—",
                d.quantity(j.spacing_provided, 3) if j.spacing_provided is not None else "—",
                f"{j.utilisation:.2f}",
                j.status,
            ]
        )
    if m.joints:
        lines += ["  " + r for r in _cols(rows, {1, 2, 3, 4, 5, 6})]
    for j in m.joints:
        for reason in j.reasons:
            lines.append(f"  {j.id}: {reason}")
        for c in j.checks:
            if c.status == "NG":
                note = check_note(c, d)
                lines.append(f"  {j.id}: {check_label(c, d)} — NG" + (f": {note}" if note else ""))
        if j.schedule is not None:
            lines += _schedule_lines(j.id, j.schedule, d)
    if m.checks:
        rows = [["member check", "demand", "capacity", "ratio", "status"]]
        for c in m.checks:
            rows.append(
                [
                    check_label(c, d),
                    d.value(c.demand) if c.demand is not None else "—",
                    d.value(c.capacity) if c.capacity is not None else "—",
                    f"{c.ratio:.2f}" if c.ratio is not None else "—",
                    c.status,
                ]
            )
        lines += ["  " + r for r in _cols(rows, {1, 2, 3})]
        lines += [
            f"  {check_label(c, d)}: {check_note(c, d)}"
            for c in m.checks
            if c.status == "INFO" and check_note(c, d)
        ]
    return lines


def _schedule_lines(joint_id: str, sch, d: Display) -> list[str]:
    """Zones of a joint's schedule and its economy figures."""
    if not sch.feasible:
        return [f"  {joint_id} schedule: none satisfies the rules — {sch.reason}"]
    zones = ", ".join(
        f"{d.position(z.start)} to {d.position(z.end)} @ {d.quantity(z.spacing, 3)}" for z in sch.zones
    )
    ratio = f"{sch.ratio:.2f}" if sch.ratio is not None else "—"
    saving = f"{100 * sch.saving:.0f} %" if sch.saving is not None else "—"
    return [
        f"  {joint_id} schedule: {zones}",
        f"  {joint_id} connectors: N = {sch.count} rows (N_min = {sch.count_min:.1f}, N/N_min = {ratio}); "
        f"one spacing from peak: {sch.count_single} rows (saving {saving})",
    ]


def render_job(result: JobResult) -> str:
    """The text printed by ``calcreport check`` for one job."""
    job = result.job
    d = Display(job.settings.units, job.settings.display)
    n_out = sum(len(m.not_checked) for m in result.members)
    scope = f"; {n_out} item{'s' if n_out != 1 else ''} not checked" if n_out else ""
    head = (
        f"{job.path}: {job.header.project} — {job.settings.method}, {job.settings.units} units   "
        f"[{result.status}{scope}]"
    )
    lines = [head]
    for m in result.members:
        lines.append("")
        lines += render_member(m, d)
    return "\n".join(lines) + "\n"
