"""The assumed-values page: every value the tool chose because the job did not state it.

Reads the :class:`calcreport.solve.results.Assumed` records of the job and of each member; rows
that differ only by the joint they belong to are shown once with the joints named.
"""

from __future__ import annotations

import re

from reportlab.platypus import Paragraph

from ...solve.results import Assumed
from .common import Ctx, cited, grid, heading, para

__all__ = ["assumed_story", "assumed_rows"]

_JOINT = re.compile(r"\.joint\[([^\]]+)\]")


def assumed_rows(ctx: Ctx) -> list[list[str]]:
    """Rows (key, what, value, how to state it, source) over the job and its members."""
    records: list[Assumed] = list(ctx.result.assumed)
    for m in ctx.result.members:
        records += list(m.assumed)
    groups: dict[tuple, list[str]] = {}
    order: list[tuple] = []
    for a in records:
        value = ctx.q(a.value)
        generic = _JOINT.sub(".joint[*]", a.key)
        g = (generic, a.label, value, a.where, a.source)
        found = _JOINT.search(a.key)
        if g not in groups:
            groups[g] = []
            order.append(g)
        if found:
            groups[g].append(found.group(1))
    rows = [["Key", "What", "Value used", "To state it", "Basis"]]
    for g in order:
        generic, label, value, where, source = g
        joints = groups[g]
        key = generic.replace("joint[*]", f"joint[{', '.join(joints)}]") if joints else generic
        rows.append(
            [
                key,
                label[0].upper() + label[1:] if label else "",
                value,
                where,
                cited(source) or "tool default",
            ]
        )
    return rows


def assumed_story(ctx: Ctx) -> list:
    st, w = ctx.styles, ctx.width
    out: list = [Paragraph("Assumed values", st.h1)]
    out.append(
        para(
            "The job file did not state the values below; the tool used them. Each is a choice the "
            "engineer of record should confirm or state in the job file with the key shown.",
            st.body,
        )
    )
    rows = assumed_rows(ctx)
    if len(rows) == 1:
        out.append(para("None: the job states every value the calculation uses.", st.body))
        return out
    out.extend(heading(f"{len(rows) - 1} values assumed", st.h3, need=60))
    out.append(grid(rows, [0.25 * w, 0.27 * w, 0.14 * w, 0.20 * w, 0.14 * w], st))
    return out
