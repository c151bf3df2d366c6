"""Compact terminal table per member: joint, q, capacity per row, required and practical spacing."""

from __future__ import annotations

from ..solve.results import JobResult, MemberResult
from .fmt import Display

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
        f"{m.id} — {m.member.title}   [{m.status}]",
        f"  section: A = {d.quantity(s.area)}, ȳ = {d.quantity(s.centroid)} above bottom, "
        f"I = {d.quantity(s.inertia)} (ref. {s.reference_material}); V = {d.quantity(m.shear)}",
    ]
    rows = [["joint", "Q", "q", "capacity/row", "s req", "s used", "util", "status"]]
    for j in m.joints:
        cap = d.quantity(j.capacity_row) + (" (cont.)" if j.continuous else f" ({j.per_row}×)")
        rows.append([
            j.id, d.quantity(j.Q), d.quantity(j.shear_flow), cap,
            d.quantity(j.spacing_required) if j.spacing_required is not None else "—",
            d.quantity(j.spacing_provided, 3) if j.spacing_provided is not None else "—",
            f"{j.utilisation:.2f}", j.status,
        ])
    if m.joints:
        lines += ["  " + r for r in _cols(rows, {1, 2, 3, 4, 5, 6})]
    for j in m.joints:
        for reason in j.reasons:
            lines.append(f"  {j.id}: {reason}")
        for c in j.checks:
            if c.status == "NG":
                lines.append(f"  {j.id}: {c.label} — NG")
    for c in m.checks:
        if c.status == "NG":
            lines.append(f"  {c.label} — NG")
    return lines


def render_job(result: JobResult) -> str:
    """The text printed by ``calcreport check`` for one job."""
    job = result.job
    d = Display(job.settings.units, job.settings.display)
    head = f"{job.path}: {job.header.project} — {job.settings.method}, {job.settings.units} units   [{result.status}]"
    lines = [head]
    for m in result.members:
        lines.append("")
        lines += render_member(m, d)
    return "\n".join(lines) + "\n"
