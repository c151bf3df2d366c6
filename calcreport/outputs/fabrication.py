"""The fabrication sheet of each member: what a framer or welder needs and nothing more — the
pieces, each joint's fastening in words, the elevation with its zones, positions from the stated
end, counts per zone and in total, and a QR code with the job file's SHA-256 and the report's
sheet reference (job number, revision, sheet).

``fabrication_story`` is used twice: at the end of the report, and on its own for the separate
PDF of ``calcreport build --fabrication`` (:mod:`.fabrication_pdf`), where each sheet states the
report sheet it copies. Reads results only (``JointResult.callout``); never computes.
"""

from __future__ import annotations

from dataclasses import replace

from reportlab.platypus import Flowable, KeepTogether, PageBreak, Paragraph, Table, TableStyle

from ..solve.results import JointResult, MemberResult
from ..units import Quantity
from .callouts import joint_callout_text, shop_length, stagger_note
from .fabrication_draw import QR_SIZE, ShopQR, elevation
from .report.common import Ctx, grid, para
from .report.pages import SectionStart
from .report.styles import esc

__all__ = ["fabrication_sections", "fabrication_story", "shop_position"]


def shop_position(q: Quantity, system: str = "US") -> str:
    """A position along the member as the shop measures it: feet-inches to 1/16 in (US), whole
    millimetres (SI)."""
    if system == "SI":
        return f"{float(q.to('mm').magnitude):.0f} mm"
    from .fmt import feet_inches

    return feet_inches(float(q.to("inch").magnitude))


def fabrication_sections(result) -> list[tuple[str, str]]:
    """(section id, contents title) of the fabrication sheets, one per member."""
    return [(f"fab:{m.id}", f"Fabrication sheet — member {m.id}") for m in result.members]


def _what(j: JointResult) -> str:
    return {"fillet_weld": "weld segments", "glue": "glue line"}.get(
        j.callout.kind if j.callout else "", "connectors"
    )


def _pieces_table(m: MemberResult, ctx: Ctx) -> Table:
    d, sys_ = ctx.display, ctx.display.system
    props = {p.id: p for p in m.section.parts}
    length = shop_position(m.member.span, sys_) if m.member.span is not None else "not given"
    rows: list[list] = [["Piece", "Size", "Width × depth", "Material", "Length"]]
    for p in m.member.parts:
        pp = props.get(p.id)
        wd = f"{shop_length(pp.width, sys_)} × {shop_length(pp.depth, sys_)}" if pp is not None else "—"
        rows.append(
            [p.id, p.shape.nominal or p.label or "cut to size", wd, p.material.name or p.material.id, length]
        )
    del d
    w = ctx.width - QR_SIZE - 60
    return grid(
        rows, [w * 0.12, w * 0.13, w * 0.23, w * 0.37, w * 0.15], ctx.styles, frame_height=ctx.frame_height
    )


def _rows(rows, offset: int, c) -> str:
    """Rows of a zone: "20 + 20" (the rows, then the offset rows midway between) when staggered."""
    if not c.staggered or not c.offset_planes:
        return str(rows)
    if c.stagger_with:  # the whole line is offset: only its offset rows
        return str(offset)
    return f"{rows} + {offset}"


def _zone_table(j: JointResult, ctx: Ctx) -> Table | None:
    c = j.callout
    sys_ = ctx.display.system
    if c is None or not c.zones:
        return None
    what = _what(j)
    rows: list[list] = [["Zone", "From", "To", "Length", "Fastening", "Rows", what.capitalize()]]
    for i, z in enumerate(c.zones, 1):
        rows.append(
            [
                str(i),
                shop_position(z.start, sys_),
                shop_position(z.end, sys_),
                shop_position(z.length, sys_),
                joint_callout_text(c, sys_, spacing=z.spacing, stagger=False),  # the Rows column shows it
                _rows(z.rows, z.rows_offset, c),
                str(z.pieces),
            ]
        )
    rows.append(
        [
            "Total",
            "",
            shop_position(c.length, sys_) if c.length is not None else "",
            "",
            "",
            _rows(c.rows_total, len(c.offset_at), c),
            str(c.pieces_total),
        ]
    )
    w = ctx.width
    widths = [w * 0.07, w * 0.1, w * 0.1, w * 0.1, w * 0.43, w * 0.08, w * 0.12]
    from reportlab.lib import colors

    return grid(
        rows,
        widths,
        ctx.styles,
        extra=[("LINEABOVE", (0, -1), (-1, -1), 0.8, colors.black)],
        frame_height=ctx.frame_height,
    )


def _same_as(j: JointResult, earlier: list[JointResult]) -> JointResult | None:
    """An earlier joint fastened exactly alike: same connector, rows on each plane, zones and
    counts (only the planes' places differ) — its sheet is stated once."""
    c = j.callout
    if c is None:
        return None
    for e in earlier:
        o = e.callout
        if o is not None and replace(o, planes=()) == replace(c, planes=()):
            if [p.rows for p in o.planes] == [p.rows for p in c.planes]:
                return e
    return None


def _joint_story(j: JointResult, m: MemberResult, ctx: Ctx, earlier: list[JointResult]) -> list[Flowable]:
    st, sys_ = ctx.styles, ctx.display.system
    c = j.callout
    title = f"Joint {j.id}" + (f" — {j.label}" if j.label else "")
    words = joint_callout_text(c, sys_) if c is not None else j.connector
    out: list[Flowable] = [para(title, st.h3), Paragraph(f"<b>{esc(words)}</b>", st.body)]
    if c is None:
        return [KeepTogether(out)]
    twin = _same_as(j, earlier)
    if twin is not None:
        total = (
            f": {c.rows_total} rows, {c.pieces_total} {_what(j)} in total"
            if c.pieces_total is not None
            else ""
        )
        out.append(para(f"Same fastening, zones and counts as joint {twin.id}{total}.", st.small))
        return [KeepTogether(out)]
    words = ""
    if c.zones:
        words = (
            f"Zoned along the member: closest spacing {shop_length(c.spacing, sys_)}, widest "
            f"{shop_length(c.spacing_widest, sys_)}; {c.pieces_per_row} {_what(j)} per row."
        )
    elif c.continuous and c.length is not None:
        words = f"Full length, {shop_position(c.length, sys_)}."
    elif not c.continuous:
        words = (
            f"One spacing over the full length; {c.pieces_per_row} {_what(j)} per row. The job gives "
            "no length along the member, so no count is stated."
        )
    words = " ".join(w for w in (words, stagger_note(c, sys_)) if w)  # one paragraph
    if words:
        out.append(para(words, st.small))
    fig = elevation(
        j,
        m.member,
        lambda q: shop_position(q, sys_),
        lambda q: shop_length(q, sys_),
        st.fonts.regular,
        st.fonts.bold,
        ctx.width,
    )
    block: list[Flowable] = out + ([fig] if fig is not None else [])
    table = _zone_table(j, ctx)
    if table is not None:
        return [KeepTogether(block + [table])]
    return [KeepTogether(block)]


def fabrication_story(
    ctx: Ctx,
    record: dict[str, int] | None = None,
    sheets: dict[str, int] | None = None,
    payloads: dict[str, str] | None = None,
) -> list[Flowable]:
    """The fabrication sheets, each starting a new page. ``record`` collects the sheet each is
    drawn on (the report); ``sheets`` gives them (the separate PDF); ``payloads`` collects the
    QR codes' text."""
    st, job = ctx.styles, ctx.result.job
    h = job.header
    out: list[Flowable] = []
    end_words = "the left end of the member (x = 0, drawn on the left)"
    units = "feet-inches" if ctx.display.system == "US" else "millimetres"
    for m in ctx.result.members:
        out.append(PageBreak())
        out.append(SectionStart(f"fab:{m.id}", f"Fabrication sheet — member {m.id}", f"Fabrication — {m.id}"))
        out.append(para(f"Fabrication sheet — member {m.id}  {m.member.title}", st.h1))
        ref = "" if sheets is None else f" Copy of report sheet {sheets.get(m.id, '?')}."
        intro = [
            para(
                f"Positions from {end_words}, in {units}. Counts are rows of connectors across the joint "
                "and the pieces they hold; the first zone also counts the row at x = 0."
                + ref
                + " Fastening from the calculation report: it does not replace the approved drawings and "
                "holds only with the reviewed and sealed report the QR code names.",
                st.small,
            ),
            _pieces_table(m, ctx),
        ]
        qr = ShopQR(
            h.number,
            h.revision,
            m.id,
            job.sha256,
            st.fonts.mono,
            sheet=None if sheets is None else sheets.get(m.id),
            record=record,
            payloads=payloads,
        )
        top = Table([[intro, qr]], colWidths=[ctx.width - qr.width - 8, qr.width + 8])
        top.setStyle(TableStyle([("VALIGN", (0, 0), (-1, -1), "TOP"), ("LEFTPADDING", (0, 0), (-1, -1), 0)]))
        out.append(top)
        if not m.joints:
            out.append(para("No joints: nothing to fasten.", st.body))
        for i, j in enumerate(m.joints):
            out += _joint_story(j, m, ctx, list(m.joints[:i]))
    return out
