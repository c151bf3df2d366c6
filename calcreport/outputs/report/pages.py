"""Page furniture: the title block on every sheet, the footer, section marks and revision marks.

The document is laid out twice (see :mod:`.build`): the first pass counts the sheets and notes on
which sheet each section starts; the second pass prints "Sheet N of M" and the contents.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from reportlab.lib import colors
from reportlab.platypus import BaseDocTemplate, Flowable, Frame, PageTemplate

from .styles import Styles, fit_text, plain
from .template import Template

__all__ = ["PageInfo", "ReportDoc", "SectionStart", "MarginMark", "TITLE_H", "FOOTER_H", "GREY", "RULE"]

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
        self._subject_page = 0
        left, right, top, bottom = template.margins
        w, h = template.pagesize
        super().__init__(target, pagesize=(w, h), leftMargin=left, rightMargin=right, topMargin=top,
                         bottomMargin=bottom, invariant=1, **kw)
        self.frame_height = h - top - bottom - TITLE_H - GAP - FOOTER_H - 4
        frame = Frame(left, bottom + FOOTER_H + 4, w - left - right, self.frame_height,
                      id="body", leftPadding=0, rightPadding=0, topPadding=0, bottomPadding=0)
        self.addPageTemplates([PageTemplate("sheet", frames=[frame], onPageEnd=self._furniture)])
        self._canvasmaker = canvasmaker

    @property
    def body_width(self) -> float:
        return self.width

    def afterFlowable(self, flowable):
        if isinstance(flowable, SectionStart):
            self.seen_sections.setdefault(flowable.sid, self.page)
            if self._subject_page != self.page:  # the first section begun on a sheet names it
                self.current_subject = flowable.subject
                self._subject_page = self.page

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
        c.setFont(font, s)
        c.drawString(x, y, t)

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
            from reportlab.lib.utils import ImageReader

            img = ImageReader(str(tpl.logo))
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
        total = str(info.total) if info.total else "?"
        self._value(c, sx, y1 - 21, f"Sheet {self.page} of {total}", sw, 9.5, bold=True)
        self._label(c, sx, y1 - 33, "Revision")
        self._value(c, sx, y1 - 45, info.revision or "—", sw, 11, bold=True)
        # bottom strip: prepared, checked, job number
        third = width / 3
        for i, (lab, name, date) in enumerate((("Prepared", info.prepared, info.prepared_date),
                                                ("Checked", info.checked, info.checked_date))):
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
        t, size = fit_text(f"{info.job_file}  SHA-256 {info.sha_short}", st.fonts.mono, 6.6, (w - left - right) * 0.42)
        c.setFont(st.fonts.mono, size)
        c.drawString(left, y - 9, t)
        c.setFont(st.fonts.regular, 6.6)
        c.drawRightString(w - right, y - 9, f"calcreport {info.version} — not valid unless reviewed, "
                          "signed and sealed by a licensed engineer")
        c.setFillColor(colors.black)
