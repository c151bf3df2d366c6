"""Cover sheet: title, seal box, job data, summary of members, revision history and contents."""

from __future__ import annotations

import os

from reportlab.platypus import Flowable, Paragraph, Spacer, Table, TableStyle

from ...solve.results import MemberResult
from ..phrases import check_label, check_note
from ..scope_text import checked_line, not_checked_line, status_words
from .common import Ctx, grid, para
from .pages import GREY, PageInfo
from .styles import esc

__all__ = ["cover_story", "governing_text", "SealBox"]


class SealBox(Flowable):
    """An empty framed box reserved for the engineer's seal and signature.

    With ``field`` it also holds an empty, unsigned signature field of that name (ISO 32000-1
    §12.7.4.5, a /Sig widget without a value or appearance): it prints blank, so the box serves a
    wet seal, and ``calcreport seal`` signs into it.
    """

    def __init__(self, width: float, height: float, font: str, field: str = ""):
        super().__init__()
        self.width, self.height, self.font, self.field = width, height, font, field

    def wrap(self, aw, ah):
        return self.width, self.height

    def draw(self):
        c = self.canv
        c.saveState()
        c.setLineWidth(0.9)
        c.rect(0, 0, self.width, self.height)
        c.setFont(self.font, 6.5)
        c.setFillColor(GREY)
        c.drawCentredString(self.width / 2, 6, "ENGINEER'S SEAL AND SIGNATURE")
        c.restoreState()
        if self.field:
            self._reserve_field(c)

    def _reserve_field(self, c) -> None:
        from reportlab.pdfbase.pdfdoc import PDFArray, PDFDictionary, PDFName, PDFString

        x0, y0 = c.absolutePosition(3, 16)  # above the caption
        x1, y1 = c.absolutePosition(self.width - 3, self.height - 3)
        widget = PDFDictionary(
            {
                "Type": PDFName("Annot"),
                "Subtype": PDFName("Widget"),
                "FT": PDFName("Sig"),
                "T": PDFString(self.field),
                "TU": PDFString("Engineer's digital seal"),
                "F": 4,  # print
                "Rect": PDFArray([round(v, 2) for v in (x0, y0, x1, y1)]),
                "P": c._doc.thisPageRef(),
            }
        )
        form = c.acroForm
        form.sigFlags = 3  # SignaturesExist (a signature field exists), AppendOnly (ISO 32000-1 Table 219)
        c._addAnnotation(widget)
        form.fields.append(form.getRef(widget))


def _cap(text: str) -> str:
    return text[:1].upper() + text[1:]


def governing_text(m: MemberResult, ctx: Ctx) -> str:
    """The member's highest utilisation (joint or check), described in words and numbers."""
    best = None  # (ratio, text)
    for j in m.joints:
        if j.continuous:
            text = (
                f"joint {j.id}: q = {ctx.q(j.shear_flow)} against {ctx.q(j.capacity_row)} (continuous); "
                f"utilisation {ctx.q(j.utilisation, 3)}"
            )
        else:
            text = (
                f"joint {j.id}: q = {ctx.q(j.shear_flow)}; s = {ctx.q(j.spacing_provided, 3)} "
                f"(required {ctx.q(j.spacing_required)}); utilisation {ctx.q(j.utilisation, 3)}"
            )
        if j.status == "NG" and j.reasons:
            text += " — " + "; ".join(j.reasons)
        key = (j.status == "NG", j.utilisation)
        if best is None or key > best[0]:
            best = (key, text)
        for c in j.checks:
            if c.ratio is not None or c.status == "NG":
                ck = (c.status == "NG", c.ratio or 0.0)
                if ck > best[0]:
                    words = check_note(c, ctx.display)
                    note = f" — {words}" if c.status == "NG" and words else ""
                    best = (
                        ck,
                        f"joint {j.id}: {check_label(c, ctx.display)}, ratio {ctx.q(c.ratio, 3)}{note}",
                    )
    for c in m.checks:
        if c.ratio is not None or c.status == "NG":
            ck = (c.status == "NG", c.ratio or 0.0)
            if best is None or ck > best[0]:
                best = (
                    ck,
                    f"{check_label(c, ctx.display)}: {ctx.q(c.demand)} against {ctx.q(c.capacity)}, "
                    f"ratio {ctx.q(c.ratio, 3)}",
                )
    return best[1] if best else "no joints or checks"


def _written_and_warnings(ctx: Ctx) -> list:
    """Values the job file gives as products or quotients, as written and as read; keys that had
    no effect (the warnings check and build printed)."""
    st, job, w = ctx.styles, ctx.result.job, ctx.width
    out: list = []
    if job.written:
        out.append(Paragraph("Values written as products or quotients", st.h2))
        rows = [["Key", "Line", "As written", "Read as"]]
        for v in job.written:
            rows.append([v.key, str(v.line or "—"), v.text, ctx.q(v.value)])
        out.append(grid(rows, [0.40 * w, 0.08 * w, 0.30 * w, 0.22 * w], st))
    if job.warnings:
        out.append(Paragraph("Job-file keys without effect (warnings)", st.h2))
        rows = [["Key", "Line", "Warning"]]
        for x in job.warnings:
            rows.append([x.key, str(x.line or "—"), x.message])
        out.append(grid(rows, [0.36 * w, 0.08 * w, 0.56 * w], st))
    return out


def _scope_words(ctx: Ctx) -> str:
    """ " — from the checks that ran; connectors only; 9 items not checked" (words, no computing)."""
    members = ctx.result.members
    n_out = sum(len(m.not_checked) for m in members)
    parts = []
    if members and all(m.connectors_only for m in members):
        parts.append("connectors only")
    if n_out:
        parts.append(f"{n_out} item{'s' if n_out != 1 else ''} not checked (listed per member)")
    return (" — " + "; ".join(parts)) if parts else ""


def cover_story(ctx: Ctx, info: PageInfo, sections: list[tuple[str, str]]) -> list:
    st, job = ctx.styles, ctx.result.job
    h = job.header
    story: list = []
    seal_w = 2.3 * 72
    left_w = ctx.width - seal_w - 14
    status = ctx.result.status
    colour = "#1d6b35" if status == "OK" else "#b3261e"
    intro = [
        Paragraph("Structural calculation", st.h3),
        para(h.subject or h.project, st.h1),
        para(h.project, st.body),
        Paragraph(
            f'Overall result: <font color="{colour}"><b>{esc(status)}</b></font>'
            + ("" if status == "OK" else " — see the members marked NG below")
            + esc(_scope_words(ctx)),
            st.body,
        ),
        Spacer(1, 4),
    ]
    engineer = ", ".join(
        x for x in (h.engineer, f"licence {h.licence}" if h.licence else "", h.jurisdiction) if x
    )
    facts = [
        *([("Engineer", engineer)] if engineer else []),
        ("Client", h.client or "—"),
        ("Job number", h.number or "—"),
        ("Design method", f"{job.settings.method}"),
        ("Units", f"{job.settings.units}"),
        ("Revision", f"{h.revision}   {h.date}".strip()),
        ("Job file", os.path.basename(job.path)),
        ("SHA-256", job.sha256),
    ]
    ft = Table(
        [[para(k, st.cell_bold), para(v, st.cell)] for k, v in facts],
        colWidths=[78, left_w - 78],
        hAlign="LEFT",
    )
    ft.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("LEFTPADDING", (0, 0), (-1, -1), 0),
                ("TOPPADDING", (0, 0), (-1, -1), 1),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 1.5),
            ]
        )
    )
    top = Table(
        [[intro + [ft], SealBox(seal_w, seal_w, st.fonts.regular, ctx.template.seal_field)]],
        colWidths=[left_w + 14, seal_w],
        hAlign="LEFT",
    )
    top.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("LEFTPADDING", (0, 0), (-1, -1), 0),
                ("RIGHTPADDING", (0, 0), (-1, -1), 0),
            ]
        )
    )
    story.append(top)

    story.append(Paragraph("Summary of members", st.h2))
    w = ctx.width
    rows = [["Member", "Title", "Governing result and scope", "Status"]]
    for m in ctx.result.members:
        # labels only: each member's results list every item with its clause and reason
        scope = (
            f"{governing_text(m, ctx)}. {_cap(checked_line(m))}. {_cap(not_checked_line(m, clauses=False))}."
        )
        rows.append([m.id, m.member.title, scope, status_words(m)])
    story.append(grid(rows, [0.10 * w, 0.18 * w, 0.56 * w, 0.16 * w], st))
    n_out = sum(len(m.not_checked) for m in ctx.result.members)
    if n_out:
        story.append(
            para(
                f"A status rests only on the checks that ran. {n_out} item{'s' if n_out != 1 else ''} "
                "a reviewer would expect were not checked; each member's results list them with the "
                "reason, and the values the tool assumed are tabulated under 'Assumed values'.",
                st.small,
            )
        )

    # the caution sits under the results it qualifies (at the foot of the cover it could be pushed
    # alone onto a sheet of its own)
    story.append(Spacer(1, 4))
    story.append(
        Paragraph(
            "This report is not valid unless reviewed, signed and sealed by a licensed "
            "professional engineer. Limitations and cautions are listed at the end.",
            st.small,
        )
    )

    story.append(Paragraph("Revision history", st.h2))
    hist = [["Rev.", "Date", "By", "Description"]]
    for r in h.history:
        hist.append([r.mark, r.date, r.by, r.description])
    if len(hist) == 1:
        hist.append([h.revision, h.date, h.prepared_by, "(no history given in the job file)"])
    story.append(grid(hist, [0.08 * w, 0.14 * w, 0.18 * w, 0.60 * w], st))
    if h.notes:
        story.append(Paragraph("Notes", st.h2))
        for n in h.notes:
            story.append(para(n, st.body))
    story.extend(_written_and_warnings(ctx))

    story.append(Paragraph("Contents", st.h2))
    toc = [["Section", "Sheet"]]
    for sid, title in sections:
        if info.deferred:  # one layout pass: the number is a form filled in at the end
            toc.append([title, info.sheet_ref(sid, st.cell.fontName, st.cell.fontSize)])
            continue
        sheet = info.sections.get(sid)
        toc.append([title, str(sheet) if sheet else "—"])
    if len(toc) > 5:  # two entries a row, so that the contents stay on the cover
        half = (len(toc) - 1 + 1) // 2
        left, right = toc[1 : 1 + half], toc[1 + half :]
        right += [["", ""]] * (len(left) - len(right))
        toc = [["Section", "Sheet", "Section", "Sheet"]] + [a + b for a, b in zip(left, right)]
        widths = [0.40 * w, 0.10 * w, 0.40 * w, 0.10 * w]
        align = [("ALIGN", (1, 0), (1, -1), "RIGHT"), ("ALIGN", (3, 0), (3, -1), "RIGHT")]
    else:
        widths, align = [0.85 * w, 0.15 * w], [("ALIGN", (1, 0), (1, -1), "RIGHT")]
    story.append(grid(toc, widths, st, zebra=False, extra=align))
    return story
