"""Per-member description, numbered assumptions and input tables (parts, materials, connectors, shear).

Input rows carry the job-file key path of what they show (``member[H1].part[web_w]``,
``material[df2]``, ``member[H1].joint[top]``, ``member[H1].shear``, ``settings``) so that the
revision-marker hook can flag rows whose key (or a key below it) changed.
"""

from __future__ import annotations

from ...model import Member
from ...solve.results import MemberResult
from ...units import Q_, Quantity
from .common import Ctx, grid, heading, marked_cell, para

__all__ = ["description_story", "assumptions_story", "inputs_story", "ELASTIC_ASSUMPTIONS"]

ELASTIC_ASSUMPTIONS = (
    "Plane sections remain plane: strain varies linearly over the depth of the built-up section.",
    "Materials are linear-elastic; parts of different materials are combined by the transformed-section "
    "method with modular ratio n = E / E_ref.",
    "Connectors act without slip, so the parts act together as one section (full composite action).",
    "Connectors in one row share the shear flow equally; the practical spacing is rounded down, never up.",
    "Shear flow is q = V·Q / I on each fastened interface, with V the design shear given or found "
    "from the loads along the member.",
)

#: In place of the full-composite-action assumption when the γ-method ran (solve/slip.py).
SLIP_ASSUMPTION = (
    "The rigid results take the connectors as acting without slip (full composite action); the section "
    '"Connector slip" gives the results with slip beside them (γ-method, EN 1995-1-1:2004 Annex B).'
)


def _inch(v: float) -> Quantity:
    return Q_(v, "inch")


def description_story(m: MemberResult, ctx: Ctx) -> list:
    st = ctx.styles
    out: list = [*heading("Description", st.h2)]
    text = m.member.description or "(no description given in the job file)"
    out.append(para(text, st.body))
    for n in m.member.notes:
        out.append(para(n, st.small))
    return out


def assumptions_story(m: MemberResult, ctx: Ctx) -> list:
    st = ctx.styles
    out: list = [*heading("Assumptions", st.h2)]
    rows = [["No.", "Assumption"]]
    base: tuple[str, ...] = ELASTIC_ASSUMPTIONS
    if m.member.plies:
        from .plies_inputs import PLY_ASSUMPTIONS

        base = PLY_ASSUMPTIONS
    items = list(base) + list(m.member.assumptions)
    if m.slip is not None:  # the γ-method ran: the rigid results stand beside the results with slip
        items[2] = SLIP_ASSUMPTION
    for i, a in enumerate(items, 1):
        key = f"member[{m.id}].assumptions" if i > len(base) else ""
        rows.append([marked_cell(ctx, key, str(i)), a])
    out.append(grid(rows, [28, ctx.width - 28], st, zebra=False))
    return out


def _shape_text(p) -> str:
    s = p.shape
    if s.nominal and s.kind == "properties":
        return f"{s.nominal} ({s.description})"
    return s.description or s.kind


def _size_text(p, ctx: Ctx) -> str:
    s = p.shape
    x0, y0, x1, y1 = s.bbox
    if s.kind == "circle":
        return f"⌀ {ctx.q(_inch(2 * s.radius))}"
    text = f"{ctx.q(_inch(x1 - x0))} × {ctx.q(_inch(y1 - y0))}"
    if s.kind == "properties":
        text += f"; A = {ctx.q(Q_(s.area, 'inch**2'))}, I₀ = {ctx.q(Q_(s.inertia, 'inch**4'))}"
    return text


def _parts_table(member: Member, ctx: Ctx):
    w = ctx.width
    rows = [["Part", "Shape", "Width × depth", "Lower-left corner (x, y)", "Material"]]
    for p in member.parts:
        x0, y0, _, _ = p.shape.bbox
        pid = p.id + (f" — {p.label}" if p.label else "")
        rows.append(
            [
                marked_cell(ctx, f"member[{member.id}].{'ply' if member.plies else 'part'}[{p.id}]", pid),
                _shape_text(p),
                _size_text(p, ctx),
                f"({ctx.q(_inch(x0))}, {ctx.q(_inch(y0))})",
                p.material.id,
            ]
        )
    return grid(rows, [0.17 * w, 0.21 * w, 0.26 * w, 0.22 * w, 0.14 * w], ctx.styles)


def _materials_table(member: Member, ctx: Ctx):
    w = ctx.width
    used: list = []
    for mat in [p.material for p in member.parts] + [member.reference_material]:
        if mat.id not in [u.id for u in used]:
            used.append(mat)
    rows = [["Material", "Family", "E", "Design stresses", "Other"]]
    for mat in used:
        stresses = [
            f"{k} = {ctx.q(v)}"
            for k, v in (
                ("Fb", mat.Fb),
                ("Fv", mat.Fv),
                ("Fy", mat.Fy),
                ("Fu", mat.Fu),
                ("f′c", mat.fc),
                ("Fs", mat.extra.get("Fs")),
                # EC5 characteristic strengths (EN 338 symbols)
                ("f_m,k", mat.extra.get("f_m_k")),
                ("f_t,0,k", mat.extra.get("f_t_0_k")),
                ("f_c,0,k", mat.extra.get("f_c_0_k")),
                ("f_v,k", mat.extra.get("f_v_k")),
            )
            if v is not None
        ]
        other = []
        if mat.G is not None:
            other.append(f"G = {ctx.q(mat.G, 3)}")
        if mat.density is not None:
            other.append(f"γ = {ctx.q(mat.density)}")
        if mat.extra.get("grade"):
            other.append(f"grade {mat.extra['grade']}")
        if mat.extra.get("rho_k") is not None:  # EC5 characteristic density
            other.append(f"ρ_k = {ctx.q(mat.extra['rho_k'])}")
        name = f"{mat.id} — {mat.name}" + (" (reference)" if mat.id == member.reference_material.id else "")
        rows.append(
            [
                marked_cell(ctx, f"material[{mat.id}]", name),
                mat.family,
                ctx.q(mat.E),
                "; ".join(stresses) or "—",
                "; ".join(other) or "—",
            ]
        )
    return grid(rows, [0.30 * w, 0.10 * w, 0.16 * w, 0.25 * w, 0.19 * w], ctx.styles)


def _connectors_table(m: MemberResult, ctx: Ctx):
    w = ctx.width
    rows = [["Joint", "Holds", "Connector (as given)", "Per row", "Source of its design value"]]
    sources = {jr.id: jr.connector_source for jr in m.joints}
    for j in m.member.joints:
        params = j.connector.params
        given = [f"type = {j.connector.kind}"]
        for k, v in params.items():
            if k == "source" or v is None or v == "" or (j.connector.given and k not in j.connector.given):
                continue
            given.append(f"{k} = {ctx.q(v)}")
        for k, v in (("spacing_min", j.spacing_min), ("spacing_max", j.spacing_max), ("width", j.width)):
            if v is not None:
                given.append(f"{k} = {ctx.q(v)}")
        jid = j.id + (f" — {j.label}" if j.label else "")
        rows.append(
            [
                marked_cell(ctx, f"member[{m.id}].joint[{j.id}]", jid),
                ", ".join(j.holds),
                "; ".join(given),
                str(j.per_row),
                str(params.get("source", "") or sources.get(j.id) or "see derivation"),
            ]
        )
    return grid(rows, [0.18 * w, 0.12 * w, 0.30 * w, 0.08 * w, 0.32 * w], ctx.styles)


def _shear_and_settings(m: MemberResult, ctx: Ctx):
    w = ctx.width
    s = ctx.result.job.settings
    member = m.member
    if member.shear is not None and not member.loads:
        shear = f"V = {ctx.q(member.shear)} (given in the job file)"
    else:
        shear = f"from the loads along the member: V = {ctx.q(m.shear)} (see the derivation)"
    left = [
        [marked_cell(ctx, f"member[{m.id}].shear", "Design shear"), shear],
        ["Spacing limits (job-wide)", f"min {ctx.q(s.spacing_min)}, max {ctx.q(s.spacing_max)}"],
        ["Reference material", f"{member.reference_material.id} (transformed section)"],
    ]
    right = [
        [marked_cell(ctx, "settings", "Design method"), s.method],
        ["Spacing increment", f"{ctx.q(s.spacing_step)} (round down)"],
    ]
    if member.span is not None:
        right.append([marked_cell(ctx, f"member[{m.id}].span", "Span"), ctx.display.position(member.span)])
    # two items a row: the design shear's long text gets the wide left pair
    rows = [["Item", "Value", "Item", "Value"]]
    for k, pair in enumerate(left):
        rows.append([*pair, *(right[k] if k < len(right) else ["", ""])])
    return grid(rows, [0.21 * w, 0.33 * w, 0.20 * w, 0.26 * w], ctx.styles, zebra=False)


def _written_table(m: MemberResult, ctx: Ctx) -> list:
    """This member's values that the job file gives as products or quotients, as written."""
    mine = [v for v in ctx.result.job.written if v.key.startswith(f"member[{m.id}]")]
    if not mine:
        return []
    w = ctx.width
    rows = [["Key", "As written", "Read as"]]
    rows += [[marked_cell(ctx, v.key, v.key), v.text, ctx.q(v.value)] for v in mine]
    return [
        *heading("Values written as products or quotients", ctx.styles.h3),
        grid(rows, [0.45 * w, 0.30 * w, 0.25 * w], ctx.styles),
    ]


def _connectors(m: MemberResult, ctx: Ctx) -> list:
    st = ctx.styles
    if not m.member.plies:
        return [*heading("Connectors", st.h3), _connectors_table(m, ctx)]
    from .plies_inputs import ply_fastening_table, ply_sharing_table

    return [
        *heading("Load sharing between plies", st.h3),
        ply_sharing_table(m, ctx),
        *heading("Fasteners between plies", st.h3),
        ply_fastening_table(m, ctx),
    ]


def inputs_story(m: MemberResult, ctx: Ctx, detail: list | None = None) -> list:
    """The inputs; ``detail`` (the dimensioned section detail) heads the parts it draws."""
    st = ctx.styles
    return [
        *heading("Inputs", st.h2),
        *heading("Parts of the section", st.h3),
        *(detail or []),
        _parts_table(m.member, ctx),
        *heading("Materials", st.h3),
        _materials_table(m.member, ctx),
        *_connectors(m, ctx),
        *heading("Design shear and settings", st.h3),
        _shear_and_settings(m, ctx),
        *_written_table(m, ctx),
    ]
