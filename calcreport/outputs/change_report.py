"""Change report PDF: what changed between two revisions of a job, for the reviewer.

Same content as the text diff (:mod:`.diff_text`): changed results first, then changed derivation
steps, changed inputs, and added/removed tables. Every changed value is highlighted and marked with
a revision triangle carrying the new job's revision letter. Each page has a title block (project,
number, subject, revision, prepared/checked, sheet N of M) and a footer with both job-file hashes
and the cautions. The file is written atomically and is byte-for-byte reproducible.
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import Any
from xml.sax.saxutils import escape

from reportlab.lib import colors
from reportlab.lib.pagesizes import A4, LETTER
from reportlab.lib.styles import ParagraphStyle
from reportlab.lib.units import inch
from reportlab.pdfgen.canvas import Canvas
from reportlab.platypus import Flowable, Paragraph, SimpleDocTemplate, Spacer, Table, TableStyle

from .diff import JobDiff, Side
from .diff_text import ARROW, display_for, input_pair, owner_title, value_pair, FIELD_SIG
from .pdfmeta import job_metadata, stamp

__all__ = ["write_change_report", "CAUTIONS"]

CAUTIONS = ("This change report lists differences between two revisions only; the calculation report "
            "of the new revision is the document of record. Both must be reviewed, and the calculation "
            "sealed, by a licensed professional engineer. Local codes and the authority having "
            "jurisdiction govern. calcreport does not check member bending, bearing, stability, "
            "deflection or connector edge distances unless the calculation report shows that check.")
HIGHLIGHT = colors.Color(1.0, 0.94, 0.55)
RULE = colors.Color(0.35, 0.35, 0.35)
_FONT_DIRS = (Path(__file__).resolve().parent.parent / "data" / "fonts", Path("/usr/share/fonts/truetype/dejavu"))


def _fonts() -> tuple[str, str]:
    """Register a Unicode TrueType face (for ², ³, ⁴, Σ, ȳ, −) and its bold; return their names."""
    from reportlab.pdfbase import pdfmetrics
    from reportlab.pdfbase.ttfonts import TTFont

    if "CRChange" in pdfmetrics.getRegisteredFontNames():
        return "CRChange", "CRChange-Bold"
    candidates = [(d / "DejaVuSans.ttf", d / "DejaVuSans-Bold.ttf") for d in _FONT_DIRS]
    import reportlab

    rl = Path(reportlab.__file__).resolve().parent / "fonts"
    candidates.append((rl / "Vera.ttf", rl / "VeraBd.ttf"))  # ships with reportlab; fewer symbols
    for regular, bold in candidates:
        if regular.is_file() and bold.is_file():
            pdfmetrics.registerFont(TTFont("CRChange", str(regular)))
            pdfmetrics.registerFont(TTFont("CRChange-Bold", str(bold)))
            return "CRChange", "CRChange-Bold"
    return "Helvetica", "Helvetica-Bold"


class RevisionMark(Flowable):
    """A small triangle with the revision letter, drawn beside a changed value."""

    def __init__(self, mark: str, font: str, size: float = 11):
        super().__init__()
        self.mark, self.font, self.size = mark, font, size
        self.width = self.height = size

    def draw(self) -> None:
        c, s = self.canv, self.size
        c.setLineWidth(0.8)
        c.setStrokeColor(colors.black)
        c.setFillColor(colors.white)
        path = c.beginPath()
        path.moveTo(0, 0)
        path.lineTo(s, 0)
        path.lineTo(s / 2, s)
        path.close()
        c.drawPath(path, stroke=1, fill=1)
        c.setFillColor(colors.black)
        c.setFont(self.font, s * 0.5)
        c.drawCentredString(s / 2, s * 0.17, self.mark[:2])


def _numbered_canvas(diff: JobDiff, font: str, bold: str):
    """A canvas class that draws the title block and footer once the number of sheets is known."""
    new, old = diff.new, diff.old

    class _Sheets(Canvas):
        def __init__(self, *args, **kwargs):
            kwargs["invariant"] = 1
            super().__init__(*args, **kwargs)
            self._states: list[dict] = []

        def showPage(self):
            self._states.append(dict(self.__dict__))
            self._startPage()

        def save(self):
            total = len(self._states)
            for i, state in enumerate(self._states, 1):
                self.__dict__.update(state)
                _title_block(self, new, i, total, font, bold)
                _footer(self, new, old, font)
                super().showPage()
            h = new.job.header
            self.setTitle(f"{h.project} — change report, revision {h.revision}")
            self.setSubject(f"Changes from {old.label} to {new.label}")
            self.setAuthor(h.prepared_by or "calcreport")
            self.setCreator("calcreport")
            stamp(self, job_metadata(new.job.sha256, "change report", old.job.sha256))
            super().save()

    return _Sheets


def _title_block(c: Canvas, side: Side, sheet: int, total: int, font: str, bold: str) -> None:
    h = side.job.header
    w, hgt = c._pagesize
    x0, x1, top = 0.6 * inch, w - 0.6 * inch, hgt - 0.5 * inch
    rows = [
        (("Project", h.project), ("Job no.", h.number)),
        (("Subject", h.subject), ("Client", h.client)),
        (("Document", f"Change report for revision {h.revision}"), ("Sheet", f"{sheet} of {total}")),
        (("Prepared", f"{h.prepared_by} {h.prepared_date}".strip()), ("Checked", f"{h.checked_by} {h.checked_date}".strip())),
    ]
    row_h = 15
    c.saveState()
    c.setStrokeColor(RULE)
    c.setLineWidth(0.8)
    c.rect(x0, top - row_h * len(rows), x1 - x0, row_h * len(rows))
    split = x0 + (x1 - x0) * 0.68
    c.line(split, top, split, top - row_h * len(rows))
    for i, (left, right) in enumerate(rows):
        y = top - row_h * (i + 1)
        if i:
            c.line(x0, y + row_h, x1, y + row_h)
        for (label, text), x, limit in ((left, x0, split - x0), (right, split, x1 - split)):
            c.setFont(font, 6.5)
            c.setFillColor(RULE)
            c.drawString(x + 3, y + 8.5, label.upper())
            c.setFillColor(colors.black)
            c.setFont(bold if i == 0 else font, 8.5)
            c.drawString(x + 42, y + 4.5, _fit(c, text or "—", font, 8.5, limit - 46))
    c.restoreState()


def _fit(c: Canvas, text: str, font: str, size: float, width: float) -> str:
    if c.stringWidth(text, font, size) <= width:
        return text
    while text and c.stringWidth(text + "…", font, size) > width:
        text = text[:-1]
    return text + "…"


def _footer(c: Canvas, new: Side, old: Side, font: str) -> None:
    w, _ = c._pagesize
    x0, x1 = 0.6 * inch, w - 0.6 * inch
    c.saveState()
    c.setStrokeColor(RULE)
    c.line(x0, 0.95 * inch, x1, 0.95 * inch)
    c.setFont(font, 6.5)
    c.drawString(x0, 0.83 * inch, f"New: {_fit(c, new.label, font, 6.5, 200)}  sha256 {new.job.sha256[:16]}   "
                 f"Previous: {_fit(c, old.label, font, 6.5, 200)}  sha256 {old.job.sha256[:16]}")
    text = c.beginText(x0, 0.71 * inch)
    text.setFont(font, 6.5)
    for line in _wrap(c, CAUTIONS, font, 6.5, x1 - x0):
        text.textLine(line)
    c.drawText(text)
    c.restoreState()


def _wrap(c: Canvas, text: str, font: str, size: float, width: float) -> list[str]:
    lines, line = [], ""
    for word in text.split():
        trial = f"{line} {word}".strip()
        if c.stringWidth(trial, font, size) > width and line:
            lines.append(line)
            line = word
        else:
            line = trial
    return lines + ([line] if line else [])


class _Styles:
    def __init__(self, font: str, bold: str):
        self.body = ParagraphStyle("cr-body", fontName=font, fontSize=8.5, leading=10.5)
        self.small = ParagraphStyle("cr-small", parent=self.body, fontSize=7, leading=8.5, textColor=RULE)
        self.head = ParagraphStyle("cr-head", parent=self.body, fontName=bold, fontSize=11, leading=14,
                                   spaceBefore=8, spaceAfter=4)
        self.title = ParagraphStyle("cr-title", parent=self.body, fontName=bold, fontSize=13, leading=16,
                                    spaceAfter=4)
        self.cell_bold = ParagraphStyle("cr-cell-bold", parent=self.body, fontName=bold)


def _p(text: str, style: ParagraphStyle) -> Paragraph:
    return Paragraph(escape(text), style)


def _table(header: list[str], rows: list[list[Any]], widths: list[float], st: _Styles,
           highlight_col: int | None) -> Table:
    data = [[_p(h, st.cell_bold) for h in header]] + rows
    t = Table(data, colWidths=widths, repeatRows=1)
    cmds = [("GRID", (0, 0), (-1, -1), 0.4, RULE), ("VALIGN", (0, 0), (-1, -1), "MIDDLE"),
            ("BACKGROUND", (0, 0), (-1, 0), colors.Color(0.9, 0.9, 0.9)),
            ("LEFTPADDING", (0, 0), (-1, -1), 3), ("RIGHTPADDING", (0, 0), (-1, -1), 3)]
    if highlight_col is not None and len(data) > 1:
        cmds.append(("BACKGROUND", (highlight_col, 1), (highlight_col, -1), HIGHLIGHT))
    t.setStyle(TableStyle(cmds))
    return t


def _story(diff: JobDiff, font: str, bold: str, width: float) -> list:
    st = _Styles(font, bold)
    d = display_for(diff.new)
    h_new, h_old = diff.new.job.header, diff.old.job.header
    mark = h_new.revision or "?"
    tri = lambda: RevisionMark(mark, bold)  # noqa: E731 — one flowable per row
    story: list = [
        _p(f"Changes in revision {mark} (from revision {h_old.revision or '—'})", st.title),
        _p(f"New: {diff.new.label} — revision {h_new.revision}, {h_new.date}; SHA-256 {diff.new.job.sha256}", st.small),
        _p(f"Previous: {diff.old.label} — revision {h_old.revision}, {h_old.date}; SHA-256 {diff.old.job.sha256}",
           st.small),
        Spacer(1, 4),
        _p("Results changed." if diff.results_changed else
           "No result changed." + (" Inputs changed only." if diff.inputs_changed else ""), st.cell_bold),
        _p(f"Values in {d.system} units of the new revision. Changed values are highlighted and marked "
           f"with the revision triangle.", st.body),
    ]
    mw = 18
    if diff.summary:
        rows = []
        for c in diff.summary:
            if c.kind == "changed":
                a, b = value_pair(d, c.old, c.new, FIELD_SIG.get(c.field.split(".")[-1], 4))
            elif c.kind == "added":
                a, b = "(none)", f"added, {c.new}"
            else:
                a, b = f"{c.old}", "removed"
            rows.append([tri(), _p(owner_title(c.owner), st.body), _p(c.label, st.body), _p(a, st.body),
                         _p(b, st.body)])
        rest = width - mw
        story += [_p("Results", st.head),
                  _table(["", "Where", "Quantity", "Previous", "Now"], rows,
                         [mw, rest * 0.3, rest * 0.26, rest * 0.22, rest * 0.22], st, 4)]
    if diff.steps:
        rows = []
        for s in diff.steps:
            ref = s.new or s.old
            where = Paragraph(f"{escape(ref.label)} ({escape(ref.symbol)})<br/>"
                              f"<font size=6.5 color='#595959'>{escape(s.key)}</font>", st.body)
            if s.old is None or s.new is None:
                a = "(not made)" if s.old is None else d.value(s.old.result)
                b = "(no longer made)" if s.new is None else d.value(s.new.result)
            else:
                a, b = value_pair(d, s.old.result, s.new.result)
                if not s.result_changed:
                    a, b = f"{a}; {d.substituted(s.old)}", f"{b}; {d.substituted(s.new)}"
            rows.append([tri(), where, _p(a, st.body), _p(b, st.body)])
        rest = width - mw
        story += [_p("Derivation steps", st.head),
                  _table(["", "Step", "Previous", "Now"], rows, [mw, rest * 0.5, rest * 0.25, rest * 0.25], st, 3)]
    if diff.inputs:
        rows = []
        for c in diff.inputs:
            a, b, hint = input_pair(d, c)
            if hint:
                b = f"{b} ({hint})"
            rows.append([tri(), _p(c.key, st.body), _p(a, st.body), _p(b, st.body)])
        rest = width - mw
        story += [_p("Inputs", st.head),
                  _table(["", "Key in the job file", "Previous", "Now"], rows,
                         [mw, rest * 0.4, rest * 0.3, rest * 0.3], st, 3)]
    ents = [("added", e) for e in diff.added] + [("removed", e) for e in diff.removed]
    if ents:
        rows = [[tri(), _p(what, st.body), _p(e.kind, st.body), _p(e.id, st.body), _p(e.key, st.body)]
                for what, e in ents]
        rest = width - mw
        story += [_p("Added and removed", st.head),
                  _table(["", "Change", "Kind", "Id", "Key in the job file"], rows,
                         [mw, rest * 0.15, rest * 0.15, rest * 0.25, rest * 0.45], st, 1)]
    if not (diff.summary or diff.steps or diff.inputs or ents):
        story.append(_p(f"No difference between the two job files {ARROW} nothing to review.", st.body))
    return story


def write_change_report(diff: JobDiff, out_path: str) -> None:
    """Write the change report to ``out_path`` atomically (nothing half-written on failure)."""
    font, bold = _fonts()
    size = LETTER if diff.new.job.settings.units == "US" else A4
    out = Path(out_path)
    tmp = out.with_name(f".{out.name}.{os.getpid()}.tmp")
    margin = 0.6 * inch
    doc = SimpleDocTemplate(str(tmp), pagesize=size, leftMargin=margin, rightMargin=margin,
                            topMargin=0.5 * inch + 15 * 4 + 14, bottomMargin=1.15 * inch,
                            title="", author="", invariant=1)
    try:
        doc.build(_story(diff, font, bold, size[0] - 2 * margin),
                  canvasmaker=_numbered_canvas(diff, font, bold))
        os.replace(tmp, out)
    finally:
        if tmp.exists():
            tmp.unlink()
