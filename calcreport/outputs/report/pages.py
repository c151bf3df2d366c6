"""Page furniture: the title block on every sheet, the footer, section marks and revision marks.

One layout pass: what is known only at the end — "Sheet N of M" and the contents' sheet numbers —
is drawn through PDF forms (XObjects). Each sheet references the form ``crsheetN`` and each
contents row a form ``crtocK`` (:class:`SheetRef`); the document defines the forms once the last
sheet is laid out (:meth:`ReportDoc._endBuild`), before the file is saved. With
``PageInfo.deferred`` false the text is drawn directly from ``PageInfo.total`` and
``PageInfo.sections``, for callers that lay out more than once.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from reportlab.lib import colors
from reportlab.platypus import BaseDocTemplate, CondPageBreak, Flowable, Frame, PageTemplate, Spacer
from reportlab.platypus.doctemplate import ActionFlowable

from .styles import Styles, draw_text, fit_text, plain
from .template import Template

__all__ = [
    "PageInfo",
    "ReportDoc",
    "SectionStart",
    "OutlineMark",
    "SheetRef",
    "MarginMark",
    "TITLE_H",
    "FOOTER_H",
    "GREY",
    "RULE",
]

TITLE_H = 70.0
FOOTER_H = 22.0
GAP = 12.0
GREY = colors.HexColor("#5a5a5a")
RULE = colors.HexColor("#9a9a9a")


@dataclass
class PageInfo:
    """Everything the title block and footer print (text already formatted)."""

    firm: str
    address: tuple[str, ...]
    project: str
    number: str
    subject: str
    revision: str
    prepared: str
    prepared_date: str
    checked: str
    checked_date: str
    job_file: str
    sha_short: str
    version: str
    total: int | None = None  # sheets, known after the first pass
    sections: dict[str, int] = field(default_factory=dict)  # section id → first sheet
    deferred: bool = False  # one pass: sheet numbers through forms defined at the end
    refs: dict[str, tuple[str, str, float]] = field(default_factory=dict)  # form → (section, font, size)

    def sheet_ref(self, sid: str, font: str, size: float) -> SheetRef:
        """A contents cell showing the first sheet of section ``sid`` (filled in at the end)."""
        name = f"crtoc{len(self.refs) + 1}"
        self.refs[name] = (sid, font, size)
        return SheetRef(name, size)


class SheetRef(Flowable):
    """A sheet number (set like a table cell's text) drawn from the form ``name``, defined after
    the layout."""

    def __init__(self, name: str, size: float):
        super().__init__()
        self.name, self.size = name, size
        self.width, self.height = 0.0, size * 1.25

    def wrap(self, aw, ah):
        self.width = aw
        return aw, self.height

    def draw(self):
        c = self.canv
        c.saveState()
        c.translate(0, self.height - self.size)
        c.doForm(self.name)
        c.restoreState()


class SectionStart(Flowable):
    """Zero-size marker: a new section starts here (sets the title block's member line)."""

    def __init__(self, sid: str, title: str, subject: str):
        super().__init__()
        self.sid, self.title, self.subject = sid, title, subject
        self.width = self.height = 0

    def wrap(self, aw, ah):
        return 0, 0

    def draw(self):
        pass


class OutlineMark(Flowable):
    """Zero-size marker: a PDF bookmark (outline entry) at ``level`` below the last section's."""

    def __init__(self, title: str, level: int = 1):
        super().__init__()
        self.title, self.level = title, level
        self.width = self.height = 0

    def wrap(self, aw, ah):
        return 0, 0

    def draw(self):
        pass


class MarginMark(Flowable):
    """Zero-size flowable that draws a revision triangle with its letter in the left margin."""

    def __init__(self, letter: str, page_left: float, styles: Styles):
        super().__init__()
        self.letter = plain(letter)[:3] or "Δ"
        self.page_left = page_left
        self.styles = styles
        self.width = self.height = 0

    def wrap(self, aw, ah):
        return 0, 0

    def draw(self):
        c = self.canv
        ax, _ = c.absolutePosition(0, 0)
        x = self.page_left - 22 - ax  # local x of the triangle's left corner
        y = -9.0
        c.saveState()
        c.setStrokeColor(colors.black)
        c.setLineWidth(0.8)
        c.setFillColor(colors.white)
        p = c.beginPath()
        p.moveTo(x, y)
        p.lineTo(x + 14, y)
        p.lineTo(x + 7, y + 12)
        p.close()
        c.drawPath(p, stroke=1, fill=1)
        c.setFillColor(colors.black)
        c.setFont(self.styles.fonts.bold, 6.5)
        c.drawCentredString(x + 7, y + 2.2, self.letter)
        c.restoreState()


class ReportDoc(BaseDocTemplate):
    """A document whose every page carries our title block and footer."""

    def __init__(self, target, template: Template, styles: Styles, info: PageInfo, canvasmaker, **kw):
        self.tpl, self.styles, self.info = template, styles, info
        self.current_subject = info.subject
        self.seen_sections: dict[str, int] = {}
        self._level = -1  # outline level of the last bookmark
        self._pending: list = []  # section and bookmark marks waiting for the next content
        self._subject_page = 0
        self._last_subject = info.subject  # the section in effect (the last one begun)
        left, right, top, bottom = template.margins
        w, h = template.pagesize
        super().__init__(
            target,
            pagesize=(w, h),
            leftMargin=left,
            rightMargin=right,
            topMargin=top,
            bottomMargin=bottom,
            invariant=1,
            **kw,
        )
        self.frame_height = h - top - bottom - TITLE_H - GAP - FOOTER_H - 4
        frame = Frame(
            left,
            bottom + FOOTER_H + 4,
            w - left - right,
            self.frame_height,
            id="body",
            leftPadding=0,
            rightPadding=0,
            topPadding=0,
            bottomPadding=0,
        )
        self.addPageTemplates([PageTemplate("sheet", frames=[frame], onPageEnd=self._furniture)])
        self._canvasmaker = canvasmaker

    def _endBuild(self):
        """Finish the last sheet, then define the deferred forms (the totals are known) and save."""
        if not self.info.deferred:
            return super()._endBuild()
        self._doSave = 0
        super()._endBuild()
        c, total, info = self.canv, self.page, self.info
        _, _, x1, _ = self._sheet_box()
        for n in range(1, total + 1):
            c.beginForm(f"crsheet{n}", -10, -10, x1 + 10, 30)
            self._value(c, 0, 0, f"Sheet {n} of {total}", x1, 9.5, bold=True)
            c.endForm()
        for name, (sid, font, size) in info.refs.items():
            sheet = self.seen_sections.get(sid)
            c.beginForm(name, -10, -10, 200, 30)
            c.setFont(font, size)
            c.drawString(0, 0, str(sheet) if sheet else "—")
            c.endForm()
        c.save()

    def _sheet_box(self) -> tuple[float, float, float, float]:
        """Where the sheet number goes: x, y of its baseline, its width, 0."""
        left, right, top, _ = self.tpl.margins
        w, h = self.tpl.pagesize
        width = w - left - right
        cs = w - right - width * 0.17
        return cs + 5, h - top - 21, width * 0.17 - 10, 0.0

    @property
    def body_width(self) -> float:
        return self.width

    def _bookmark(self, title: str, level: int, top: float) -> None:
        """An outline entry whose view starts just above ``top`` (the PDF's bookmarks follow the
        report order)."""
        self._marks = getattr(self, "_marks", 0) + 1
        key = f"crmark{self._marks}"
        c = self.canv
        c.bookmarkHorizontal(key, 0, top + 12)
        c.addOutlineEntry(plain(title), key, level=min(level, self._level + 1), closed=level > 0)
        self._level = level

    def afterFlowable(self, flowable):
        # a section or bookmark mark takes effect where the next content is set: a mark left at the
        # foot of a sheet whose content moved on names the sheet it moved to
        if isinstance(flowable, (OutlineMark, SectionStart)):
            self._pending.append(flowable)
            return
        if isinstance(flowable, (CondPageBreak, Spacer, ActionFlowable)):
            return  # a break that fired is set on the sheet it leaves; space carries nothing
        height = float(getattr(flowable, "height", 0) or getattr(flowable, "_height", 0) or 0)
        if height <= 0:
            return
        first_here = self._subject_page != self.page
        if first_here:  # a sheet is named by the section in effect at its top
            self.current_subject = self._last_subject
            self._subject_page = self.page
        self._resolve(self.frame._y + height, first_here)

    def _resolve(self, top: float, first_here: bool) -> None:
        """Place the pending marks at ``top`` on this sheet; a section begun by the sheet's first
        content names the sheet."""
        named = False
        for mark in self._pending:
            if isinstance(mark, OutlineMark):
                self._bookmark(mark.title, mark.level, top)
                continue
            self._bookmark(mark.title, 0, top)
            self.seen_sections.setdefault(mark.sid, self.page)
            self._last_subject = mark.subject
            if first_here and not named:
                self.current_subject = mark.subject
                named = True
        self._pending = []

    def handle_documentEnd(self):  # noqa: N802 - reportlab's name
        if self._pending:  # marks after the last content: on the last sheet
            self._resolve(self.frame._y, False)
        super().handle_documentEnd()

    # -- drawing ----------------------------------------------------------------------------
    def _furniture(self, canv, doc):
        canv.saveState()
        self._title_block(canv)
        self._footer(canv)
        canv.restoreState()

    def _label(self, c, x, y, text):
        c.setFont(self.styles.fonts.regular, 5.6)
        c.setFillColor(GREY)
        c.drawString(x, y, text.upper())
        c.setFillColor(colors.black)

    def _value(self, c, x, y, text, width, size=8.0, bold=False):
        font = self.styles.fonts.bold if bold else self.styles.fonts.regular
        t, s = fit_text(text, font, size, width)
        draw_text(c, x, y, t, font, s)

    def _title_block(self, c):
        tpl, info, st = self.tpl, self.info, self.styles
        left, right, top, _ = tpl.margins
        w, h = tpl.pagesize
        x0, x1 = left, w - right
        y1 = h - top
        y0 = y1 - TITLE_H
        width = x1 - x0
        c.setStrokeColor(colors.black)
        c.setLineWidth(0.9)
        c.rect(x0, y0, width, TITLE_H)
        c.setStrokeColor(st.accent)
        c.setLineWidth(2.2)
        c.line(x0, y1, x1, y1)
        # columns: firm | project, number, subject | sheet, revision
        cf = x0 + width * 0.30
        cs = x1 - width * 0.17
        row = y0 + 16  # bottom strip with prepared / checked
        c.setStrokeColor(RULE)
        c.setLineWidth(0.5)
        c.line(cf, row, cf, y1)
        c.line(cs, row, cs, y1)
        c.line(x0, row, x1, row)
        # firm block, with the logo at its left when given
        fx = x0 + 5
        if tpl.logo is not None:
            from .image_guard import checked_image

            img = checked_image(tpl.logo)  # dimensions checked before decoding, warnings silenced
            iw, ih = img.getSize()
            box_h = TITLE_H - 16 - 8
            scale = min(box_h / ih, (width * 0.09) / iw)
            c.drawImage(img, fx, row + 4 + (box_h - ih * scale) / 2, iw * scale, ih * scale, mask="auto")
            fx += iw * scale + 5
        fw = cf - fx - 4
        self._value(c, fx, y1 - 14, info.firm, fw, 9.0, bold=True)
        c.setFillColor(GREY)
        for i, line in enumerate(info.address[:3]):
            t, s = fit_text(line, st.fonts.regular, 6.6, fw)
            c.setFont(st.fonts.regular, s)
            c.drawString(fx, y1 - 24 - i * 8.2, t)
        c.setFillColor(colors.black)
        # project column: project, subject, member / part
        px, pw = cf + 5, cs - cf - 10
        self._label(c, px, y1 - 8, "Project")
        self._value(c, px, y1 - 17.5, info.project, pw, 8.6, bold=True)
        self._label(c, px, y1 - 25.5, "Subject")
        self._value(c, px + 30, y1 - 26, info.subject, pw - 30, 7.4)
        self._label(c, px, y1 - 36, "Member / part")
        self._value(c, px, y1 - 46, self.current_subject, pw, 8.0)
        # sheet column
        sx, sw = cs + 5, x1 - cs - 10
        self._label(c, sx, y1 - 8, "Sheet")
        if info.deferred:
            bx, by, _, _ = self._sheet_box()
            c.saveState()
            c.translate(bx, by)
            c.doForm(f"crsheet{self.page}")
            c.restoreState()
        else:
            total = str(info.total) if info.total else "?"
            self._value(c, sx, y1 - 21, f"Sheet {self.page} of {total}", sw, 9.5, bold=True)
        self._label(c, sx, y1 - 33, "Revision")
        self._value(c, sx, y1 - 45, info.revision or "—", sw, 11, bold=True)
        # bottom strip: prepared, checked, job number
        third = width / 3
        for i, (lab, name, date) in enumerate(
            (("Prepared", info.prepared, info.prepared_date), ("Checked", info.checked, info.checked_date))
        ):
            bx = x0 + 5 + i * third
            self._label(c, bx, row - 10, lab)
            self._value(c, bx + 36, row - 10.5, f"{name or '—'}   {date}".strip(), third - 44, 7.4)
        self._label(c, x0 + 5 + 2 * third, row - 10, "Job no.")
        self._value(c, x0 + 5 + 2 * third + 30, row - 10.5, info.number or "—", third - 40, 7.4)

    def _footer(self, c):
        tpl, info, st = self.tpl, self.info, self.styles
        left, right, _, bottom = tpl.margins
        w, _ = tpl.pagesize
        y = bottom + FOOTER_H - 6
        c.setStrokeColor(RULE)
        c.setLineWidth(0.5)
        c.line(left, y, w - right, y)
        c.setFont(st.fonts.mono, 6.6)
        c.setFillColor(GREY)
        t, size = fit_text(
            f"{info.job_file}  SHA-256 {info.sha_short}", st.fonts.mono, 6.6, (w - left - right) * 0.42
        )
        c.setFont(st.fonts.mono, size)
        c.drawString(left, y - 9, t)
        c.setFont(st.fonts.regular, 6.6)
        c.drawRightString(
            w - right,
            y - 9,
            f"calcreport {info.version} — not valid unless reviewed, "
            "signed and sealed by a licensed engineer",
        )
        c.setFillColor(colors.black)
