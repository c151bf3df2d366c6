"""Members of plies side by side in the report (issue 14): the assumptions that replace those of a
composite section, the ply fastening as given and the load sharing read from the solver's steps
(nothing is computed here)."""

from __future__ import annotations

from ...solve.results import MemberResult
from .common import Ctx, grid, marked_cell

__all__ = ["PLY_ASSUMPTIONS", "ply_fastening_table", "ply_sharing_table"]

PLY_ASSUMPTIONS = (
    "The plies stand side by side and bend about their own axes; they are fastened so that they deflect "
    "together, and share the load in proportion to their stiffness E·I (no composite action across the "
    "vertical ply joints).",
    "A load on top bears on the plies whose tops it reaches, in proportion to their widths; a load hung from "
    "a face enters that ply; what a ply receives beyond its share passes through the fasteners to the others.",
    "A point load passes between plies evenly over its transfer length; fasteners in a row share equally; "
    "the practical spacing is rounded down, never up.",
    "Fasteners between plies are loaded perpendicular to the grain of the wood (vertical load, horizontal grain).",
)


def ply_fastening_table(m: MemberResult, ctx: Ctx):
    """The fastening as the job gives it, and the lines the tool designed from it."""
    w = ctx.width
    f = m.member.ply_fastening
    rows = [["Line", "Plies", "Connector (as given)", "Rows", "Source of its design value"]]
    if f is None:
        return grid(rows, [0.2 * w, 0.14 * w, 0.3 * w, 0.06 * w, 0.3 * w], ctx.styles)
    given = [f"type = {f.connector.kind}"]
    for k, v in f.connector.params.items():
        if k in f.connector.given and v not in (None, ""):
            given.append(f"{k} = {ctx.q(v)}")
    given.append("through every ply" if f.through else "driven from the faces")
    for k, v in (("spacing_min", f.spacing_min), ("spacing_max", f.spacing_max)):
        if v is not None:
            given.append(f"{k} = {ctx.q(v)}")
    for j in m.joints:
        rows.append(
            [
                marked_cell(
                    ctx, f"member[{m.id}].ply_fastening", j.id + (f" — {j.label}" if j.label else "")
                ),
                ", ".join(j.holds),
                "; ".join(given),
                str(j.per_row),
                j.connector_source or "see derivation",
            ]
        )
    return grid(rows, [0.24 * w, 0.1 * w, 0.3 * w, 0.06 * w, 0.3 * w], ctx.styles)


def ply_sharing_table(m: MemberResult, ctx: Ctx):
    """E·I and share of each ply, as the solver's steps give them."""
    w = ctx.width
    steps = {s.key: s for s in m.steps}
    rows = [["Ply", "Material", "E·I", "Share of the load"]]
    for p in m.member.plies:
        pre = f"member.{m.id}.plies.{p.id}"
        ei, sh = steps.get(f"{pre}.EI"), steps.get(f"{pre}.share")
        rows.append(
            [
                marked_cell(
                    ctx, f"member[{m.id}].ply[{p.id}]", p.id + (f" — {p.part.label}" if p.part.label else "")
                ),
                p.part.material.id,
                ctx.q(ei.result) if ei is not None else "—",
                ctx.q(sh.result, 4) if sh is not None else "—",
            ]
        )
    return grid(rows, [0.25 * w, 0.2 * w, 0.3 * w, 0.25 * w], ctx.styles)
