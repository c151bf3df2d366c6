"""End of the report: limitations and cautions with what the tool does not check, then the
reviewer's sign-off with room for comments (last: signed once everything above it has been read)."""

from __future__ import annotations

from reportlab.lib import colors
from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from .columns import Columns
from .common import Ctx, heading, para
from .dense import dense
from .pages import RULE
from .styles import esc

__all__ = [
    "signoff_story",
    "limitations_story",
    "NOT_CHECKED",
    "CAUTIONS",
    "COMMENT_LINES",
]

#: ruled lines for the checker's comments (beside the signatures, as tall as their table)
COMMENT_LINES = 4
#: height of a signature row
SIGN_ROW = 22.0
#: height of the header rows of both tables
HEAD_ROW = 15.0
#: the comment lines' spacing where the box runs across the sheet (end of the report)
END_COMMENT_LINE = 17.0

CAUTIONS = (
    "This report is a design aid. It is not valid until a licensed professional engineer has reviewed "
    "the inputs, assumptions and results, and signed and sealed it.",
    "Local building codes and the authority having jurisdiction govern. Design values, adjustment factors "
    "and detailing limits must be confirmed against the edition of the standard adopted where the work is built.",
    "Connector design values given in the job file are used as stated; their source is the engineer's responsibility.",
    "Material design stresses (Fb, Fv, Fs …) are used as entered in the job file, except in the member checks "
    "whose steps state their adjustment factors (wood bending and flange checks, panel shear: C_D or λ per "
    "combination, CP, CL; factors the job does not give are stated there as assumed). Load duration is "
    "otherwise applied only to the values of wood connectors computed to the NDS.",
    "Results assume the elastic behaviour stated in each member's assumptions; they are not valid beyond the "
    "elastic range or where connectors slip appreciably.",
)

NOT_CHECKED = (
    "bending and shear stresses in the parts themselves, unless a check above states them",
    "lateral-torsional buckling and lateral bracing of the compression flange, unless a check above "
    "states them (welded plate girders: AISC 360-16 F2-F5 with the Lb and Cb stated)",
    "local buckling, web buckling, web crippling and web yielding under concentrated loads, unless a "
    "check above states them (welded plate girders at their supports: J10.2, J10.3)",
    "bearing at supports and under point loads, unless a check above states it (members of plies with "
    "bearing lengths given: NDS 2018 §3.10); stiffeners and tension-field action",
    "ply-to-ply fastening of multi-ply and flitch beams described as parts joined by shear flow (such a "
    "joint is refused); members described by plies are designed with the sharing by E·I they state",
    "the connection of the member to its supports and to other members",
    "deflection and camber, unless a check above states them; deflections are from bending only unless a "
    "check above adds the webs' shear deformation — connector slip is not included unless a member's "
    'section "Connector slip" gives it (γ-method, EN 1995-1-1:2004 Annex B)',
    "panel (through-thickness) shear of plywood webs, unless a check above states it",
    "long-term creep and shrinkage, and load-duration effects beyond the factors stated",
    "vibration and dynamic or impact loads",
    "live load reduction; a moving set of loads with only some of its loads on the member (each set "
    "stays within its travel range, or is off the member altogether)",
    "fire resistance",
    "durability, decay, corrosion and protection of connectors (waterfront exposure in particular)",
    "connector withdrawal, head pull-through, edge and end distances and splitting of wood, "
    "unless a check above states them",
    "fatigue of welds and connectors",
    "fabrication and erection tolerances, and construction loads",
    "stability of the structure as a whole and load paths beyond this member",
)


def _signature_table(ctx: Ctx, w: float) -> Table:
    """Role, name, signature line and date of each signer, ``w`` wide."""
    st, h = ctx.styles, ctx.result.job.header
    rows = [
        [
            para("Role", st.cell_bold),
            para("Name", st.cell_bold),
            para("Signature", st.cell_bold),
            para("Date", st.cell_bold),
        ]
    ]
    for role, name, date in (
        ("Prepared by", h.prepared_by, h.prepared_date),
        ("Checked by", h.checked_by, h.checked_date),
        ("Approved by", h.approved_by, ""),
    ):
        rows.append([para(role, st.cell), para(name or "", st.cell), "", para(date or "", st.cell)])
    t = Table(
        rows,
        colWidths=[0.23 * w, 0.28 * w, 0.31 * w, 0.18 * w],
        rowHeights=[HEAD_ROW] + [SIGN_ROW] * 3,
        hAlign="LEFT",
    )
    t.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 1), (-1, -1), "BOTTOM"),
                ("BOX", (0, 0), (-1, -1), 0.7, colors.black),
                ("LINEBELOW", (0, 0), (-1, -1), 0.4, RULE),
                ("LINEBEFORE", (1, 0), (-1, -1), 0.4, RULE),
                ("BACKGROUND", (0, 0), (-1, 0), st.tint),
                ("LINEBELOW", (2, 1), (2, -1), 0.6, colors.black),
            ]
        )
    )
    return t


def _comments_table(ctx: Ctx, width: float, line: float) -> Table:
    """A box of :data:`COMMENT_LINES` ruled lines ``line`` apart for the checker's comments."""
    st = ctx.styles
    t = Table(
        [[para("Checker's comments", st.cell_bold)]] + [[""] for _ in range(COMMENT_LINES)],
        colWidths=[width],
        rowHeights=[HEAD_ROW] + [line] * COMMENT_LINES,
        hAlign="LEFT",
    )
    t.setStyle(
        TableStyle(
            [
                ("BOX", (0, 0), (-1, -1), 0.7, colors.black),
                ("LINEBELOW", (0, 1), (-1, -2), 0.3, RULE),
                ("BACKGROUND", (0, 0), (-1, 0), st.tint),
            ]
        )
    )
    return t


def signoff_story(ctx: Ctx, on_cover: bool = False) -> list:
    """The sign-off. On the cover (when it fits there, :mod:`.build`): the signatures and the
    checker's comments side by side under a cover heading, without the job file's hash, which the
    cover states. At the end of the report: the comments across the sheet under the signatures,
    then the hash."""
    st, w = ctx.styles, ctx.width
    if on_cover:  # side by side, the ruled lines level with the signature rows
        gap = 0.02 * w
        block: Table = Table(
            [
                [
                    _signature_table(ctx, 0.61 * w),
                    _comments_table(ctx, 0.39 * w - gap, 3 * SIGN_ROW / COMMENT_LINES),
                ]
            ],
            colWidths=[0.61 * w + gap, 0.39 * w - gap],
            hAlign="LEFT",
        )
        block.setStyle(
            TableStyle(
                [
                    ("VALIGN", (0, 0), (-1, -1), "TOP"),
                    ("LEFTPADDING", (0, 0), (-1, -1), 0),
                    ("RIGHTPADDING", (0, 0), (-1, -1), 0),
                    ("TOPPADDING", (0, 0), (-1, -1), 0),
                    ("BOTTOMPADDING", (0, 0), (-1, -1), 0),
                ]
            )
        )
        parts: list = [block]
    else:  # at the end, with room: the comments across the sheet under the signatures
        parts = [_signature_table(ctx, w), Spacer(1, 6), _comments_table(ctx, w, END_COMMENT_LINE)]
    out: list = [
        Paragraph("Review and sign-off", st.h2 if on_cover else st.h1),
        Paragraph(
            "By signing, the checker confirms that the inputs match the drawings and the brief, the "
            "assumptions are appropriate, and the results have been reviewed.",
            st.small,
        ),
        *parts,
    ]
    if not on_cover:
        out += [
            Spacer(1, 4),
            Paragraph(
                f'Job file SHA-256: <font name="{st.fonts.mono}">{esc(ctx.result.job.sha256)}</font>',
                st.small,
            ),
        ]
    return out


def _cautions(ctx: Ctx) -> Table:
    """The numbered cautions in a ruled box with an accent bar: kept prominent (bold numbers,
    table text size, the full width)."""
    st, w = ctx.styles, ctx.width
    rows = [[para(f"{i}.", st.cell_bold), para(c, st.cell)] for i, c in enumerate(CAUTIONS, 1)]
    t = Table(rows, colWidths=[20, w - 20], hAlign="LEFT")
    t.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("LEFTPADDING", (0, 0), (-1, -1), 4),
                ("RIGHTPADDING", (0, 0), (-1, -1), 4),
                ("TOPPADDING", (0, 0), (-1, -1), 1),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 1),
                ("TOPPADDING", (0, 0), (-1, 0), 3),
                ("BOTTOMPADDING", (0, -1), (-1, -1), 3),
                ("BOX", (0, 0), (-1, -1), 0.9, colors.black),
                ("LINEBEFORE", (0, 0), (0, -1), 3, st.accent),
            ]
        )
    )
    return t


def limitations_story(ctx: Ctx) -> list:
    """The numbered cautions, then what the tool does not check for any member, in two columns
    that may run on to the next sheet (each item kept whole, the heading with the first)."""
    st = ctx.styles
    items = [[Paragraph("• " + esc(item), dense(st).item)] for item in NOT_CHECKED]
    head = Paragraph("This tool does not check:", dense(st).head)
    cont = Paragraph("This tool does not check (continued):", dense(st).head)
    return [*heading("Limitations and cautions", st.h2), _cautions(ctx), Columns(items, head=head, cont=cont)]
