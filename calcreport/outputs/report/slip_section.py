"""The member's "Connector slip" section: the γ-method beside the rigid results.

Reads :class:`calcreport.solve.slip.SlipResult` (``MemberResult.slip``) only; the derivation
steps (``member.<ID>.slip.…``) are typeset with the member's other steps. Nothing here computes.
"""

from __future__ import annotations

from reportlab.platypus import KeepTogether

from ...solve.results import MemberResult
from .common import Ctx, cited, grid, heading, para

__all__ = ["slip_story"]


def slip_story(m: MemberResult, ctx: Ctx) -> list:
    """Rigid (V·Q/I) beside slip (γ-method): stiffness, connector forces, spacing, deflection."""
    r = m.slip
    if r is None:
        return []
    st, w = ctx.styles, ctx.width
    out: list = heading("Connector slip: rigid beside the γ-method", st.h2, need=180)
    out.append(
        para(
            f"Partial composite action by {cited('EN 1995-1-1:2004 Annex B')}, slip moduli from "
            f"{r.route} (K_ser for deflection, K_u for strength); effective length ℓ = "
            f"{ctx.display.position(r.length)}. Effective bending stiffness (EI)_ef = {ctx.q(r.EI_ef_ser)} "
            f"for deflection and {ctx.q(r.EI_ef_u)} for strength, against {ctx.q(r.EI_rigid)} rigid.",
            st.body,
        )
    )
    rows = [["Layer", "Parts", "E·A", "E·I own", "γ strength", "γ deflection", "a strength"]]
    for L in r.layers:
        rows.append(
            [
                "web" if L.name == "web" else f"joint {L.name}",
                ", ".join(L.parts),
                ctx.q(L.EA),
                ctx.q(L.EI),
                ctx.q(L.gamma_u, 3),
                ctx.q(L.gamma_ser, 3),
                ctx.q(L.a_u),
            ]
        )
    out.append(grid(rows, [0.13 * w, 0.17 * w, 0.14 * w, 0.16 * w, 0.13 * w, 0.13 * w, 0.14 * w], st))
    side = [["Joint / check", "Quantity", "Rigid (V·Q/I)", "With slip", "Governs"]]
    for j in r.joints:
        side += [
            [
                f"joint {j.joint}",
                f"force per connector at s = {ctx.display.position(j.spacing_at)}",
                ctx.q(j.force_rigid),
                ctx.q(j.force_slip),
                j.governs,
            ],
            [
                "",
                "utilisation of the connector",
                ctx.q(j.utilisation_rigid, 3),
                ctx.q(j.utilisation_slip, 3),
                j.governs,
            ],
            [
                "",
                "single spacing required (strength)",
                ctx.q(j.spacing_required_rigid),
                ctx.q(j.spacing_required_slip)
                + (" (the largest spacing: strength does not limit it)" if j.spacing_capped else ""),
                "",
            ],
            [
                "",
                "slip modulus per connector, K_ser / K_u",
                "rigid",
                f"{ctx.q(j.K_ser)} / {ctx.q(j.K_u)}",
                "",
            ],
        ]
    for d in r.deflections:
        side.append([d.label, f"allowed {ctx.q(d.allowed)}", ctx.q(d.rigid), ctx.q(d.slip), d.governs])
    out.append(
        KeepTogether(
            [
                para("Rigid beside slip", st.h3),
                grid(side, [0.26 * w, 0.30 * w, 0.15 * w, 0.17 * w, 0.12 * w], st),
            ]
        )
    )
    notes = [
        f"The spacing that slip needs was found by iteration (spacing → γ → force → spacing), "
        f"{r.iterations} iterations, relative tolerance {ctx.q(r.tolerance, 2)}; the last is in the steps.",
        *r.notes,
    ]
    for n in notes:
        out.append(para(n[0].upper() + n[1:] + ("" if n.endswith(".") else "."), st.caption))
    return out
