"""Assemble the PDF report of one solved job and write it atomically.

``build_pdf(result, out_path)`` lays the story out once — "Sheet N of M" and the contents' sheet
numbers are PDF forms defined when the last sheet is done (see :mod:`.pages`) — and writes the
bytes through a temporary file in the target folder and ``os.replace``. The output is
deterministic: reportlab's invariant mode, a creation date from the job (``[job] date``, else
``SOURCE_DATE_EPOCH``, else 2000-01-01) and no random ids.
"""

from __future__ import annotations

import hashlib
import io
import os
import re
import tempfile
import time
from pathlib import Path

from reportlab.lib.utils import TimeStamp
from reportlab.pdfbase.pdfdoc import PDFDate, PDFDictionary, PDFInfo, PDFName, PDFString
from reportlab.pdfgen.canvas import Canvas
from reportlab.platypus import KeepTogether, PageBreak, Paragraph

from ... import __version__
from ...solve.results import JobResult
from ..fmt import Display
from ..pdfmeta import job_metadata
from .along import member_figures
from .assumed import assumed_story
from .checks import results_story
from .common import Ctx, para
from .cover import cover_story
from .derivations import derivation_story
from .drawing import section_drawing
from .inputs import assumptions_story, description_story, inputs_story
from .pages import PageInfo, ReportDoc, SectionStart
from .signoff import limitations_story, signoff_story
from .styles import esc, make_styles, register_fonts
from .template import Template, load_template

__all__ = ["build_pdf", "render_pdf", "write_atomic", "report_sections"]


class _Info(PDFInfo):
    """Document information with our custom entries (read back by ``calcreport verify``)."""

    extra: dict[str, str] = {}

    def format(self, document):
        D = {
            "Title": PDFString(self.title),
            "Author": PDFString(self.author),
            "Subject": PDFString(self.subject),
            "Keywords": PDFString(self.keywords),
            "Creator": PDFString(self.creator),
            "Producer": PDFString(self.producer),
            "Trapped": PDFName(self.trapped),
        }
        D["ModDate"] = D["CreationDate"] = PDFDate(ts=document._timeStamp, dateFormatter=self._dateFormatter)
        for k, v in self.extra.items():
            D[k] = PDFString(v)
        return PDFDictionary(D).format(document)


def _timestamp(job_date: str) -> TimeStamp:
    """Creation date: the job's date (YYYY-MM-DD), else SOURCE_DATE_EPOCH, else 2000-01-01, in UTC."""
    ts = TimeStamp(invariant=1)
    m = re.fullmatch(r"\s*(\d{4})-(\d{2})-(\d{2})\s*", job_date or "")
    lt = None
    if m:
        try:
            t = time.strptime(m.group(0).strip(), "%Y-%m-%d")
            lt = tuple(t)
            ts.t = float(time.mktime(t) - time.timezone)
        except ValueError:
            lt = None
    if lt is None:
        epoch = os.environ.get("SOURCE_DATE_EPOCH", "").strip()
        if epoch.isdigit():
            lt = tuple(time.gmtime(int(epoch)))
            ts.t = float(epoch)
    if lt is not None:
        ts.lt = lt
        ts.YMDhms = tuple(lt)[:6]
    ts.dhh = ts.dmm = 0
    return ts


def _canvasmaker(extra: dict[str, str], stamp: TimeStamp):
    class ReportCanvas(Canvas):
        def __init__(self, *a, **kw):
            kw["invariant"] = 1
            super().__init__(*a, **kw)
            info = _Info()
            info.extra = dict(extra)
            info.invariant = 1
            self._doc.info = info
            self._doc._timeStamp = stamp
            sig = self._doc.signature = hashlib.md5(usedforsecurity=False)  # file id from our date only
            sig.update(b"a reportlab document")
            sig.update(ascii(stamp.t).encode("ascii"))
            self.setCreator(f"calcreport {__version__}")
            self.setProducer(f"calcreport {__version__} (ReportLab)")

    return ReportCanvas


def report_sections(result: JobResult) -> list[tuple[str, str]]:
    """(section id, contents title) in report order."""
    out = [("cover", "Cover: summary, revision history and contents")]
    for i, m in enumerate(result.members, 1):
        out.append((f"member:{m.id}", f"{i}  Member {m.id} — {m.member.title}"))
    out += [
        ("assumed", "Assumed values"),
        ("signoff", "Review and sign-off"),
        ("limits", "Limitations and cautions"),
    ]
    return out


def _story(ctx: Ctx, info: PageInfo, sections: list[tuple[str, str]]) -> list:
    st = ctx.styles
    story: list = [SectionStart("cover", sections[0][1], "Cover and summary")]
    story += cover_story(ctx, info, sections)
    for i, m in enumerate(ctx.result.members, 1):
        story.append(PageBreak())
        subject = f"Member {m.id} — {m.member.title}"
        story.append(SectionStart(f"member:{m.id}", sections[i][1], subject))
        status = "" if m.status == "OK" else '   <font color="#b3261e">NG</font>'
        story.append(Paragraph(f"{i}  {esc(subject)}{status}", st.h1))
        story += description_story(m, ctx)
        story += assumptions_story(m, ctx)
        story += inputs_story(m, ctx)
        drawing, caption = section_drawing(m, ctx)
        story.append(KeepTogether([Paragraph("Section", st.h2), drawing, para(caption, st.caption)]))
        story += derivation_story(m, ctx, str(i))
        story += results_story(m, ctx)
        story += member_figures(m, ctx)
    story.append(PageBreak())
    story.append(SectionStart("assumed", "Assumed values", "Assumed values"))
    story += assumed_story(ctx)
    story.append(PageBreak())
    story.append(SectionStart("signoff", "Review and sign-off", "Review and sign-off"))
    story += signoff_story(ctx)
    story.append(SectionStart("limits", "Limitations and cautions", "Limitations and cautions"))
    story += limitations_story(ctx)
    return story


def _page_info(result: JobResult, tpl: Template) -> PageInfo:
    job, h = result.job, result.job.header
    return PageInfo(
        firm=tpl.firm,
        address=tpl.address,
        project=h.project,
        number=h.number,
        subject=h.subject or h.project,
        revision=h.revision,
        prepared=h.prepared_by,
        prepared_date=h.prepared_date or h.date,
        checked=h.checked_by,
        checked_date=h.checked_date,
        job_file=os.path.basename(job.path),
        sha_short=job.sha256[:12],
        version=__version__,
    )


def render_pdf(
    result: JobResult,
    template: Template | None = None,
    changed_keys: frozenset[str] = frozenset(),
    revision_mark: str = "",
) -> bytes:
    """The report of ``result`` as PDF bytes (see module docstring)."""
    job = result.job
    tpl = template if template is not None else load_template(job.settings.template, job.path)
    fonts = register_fonts(tpl.font, tpl.font_bold, tpl.font_mono)
    styles = make_styles(fonts, tpl.accent_color, tpl.font_size)
    display = Display(job.settings.units, job.settings.display)
    info = _page_info(result, tpl)
    sections = report_sections(result)
    h = job.header
    extra = {
        **job_metadata(job.sha256, "calculation report"),  # the keys `verify` reads (pdfmeta)
        "CalcreportJobFile": os.path.basename(job.path),
        "CalcreportRevision": h.revision,
    }
    maker = _canvasmaker(extra, _timestamp(h.date))
    keywords = ", ".join(
        x
        for x in (
            h.number,
            f"revision {h.revision}" if h.revision else "",
            *(f"member {m.id}" for m in result.members),
            "shear flow",
            "connector spacing",
            "calcreport",
        )
        if x
    )
    info.deferred = True  # one layout pass (see module docstring)
    buf = io.BytesIO()
    doc = ReportDoc(
        buf,
        tpl,
        styles,
        info,
        maker,
        title=f"{h.project} — {h.subject}".strip(" —"),
        author=h.prepared_by or "calcreport",
        subject=h.subject or h.project,
        keywords=keywords,
        creator=f"calcreport {__version__}",
    )
    ctx = Ctx(
        result, display, styles, tpl, doc.width, frozenset(changed_keys), revision_mark, doc.frame_height
    )
    doc.build(_story(ctx, info, sections), canvasmaker=maker)
    pdf = buf.getvalue()
    return pdf


def _umask() -> int:
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


def build_pdf(
    result: JobResult,
    out_path: str | os.PathLike,
    template: Template | None = None,
    changed_keys: frozenset[str] = frozenset(),
    revision_mark: str = "",
) -> Path:
    """Write the report to ``out_path`` atomically; an earlier file there survives any failure.

    ``changed_keys`` (step keys or job-file key paths) get a revision triangle with
    ``revision_mark`` in the margin beside the step or input row.
    """
    pdf = render_pdf(result, template, changed_keys, revision_mark)
    return write_atomic(pdf, out_path)


def write_atomic(data: bytes, out_path: str | os.PathLike) -> Path:
    """Write ``data`` through a temporary file in the same folder and ``os.replace``."""
    out = Path(out_path)
    folder = out.parent if str(out.parent) else Path(".")
    folder.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(prefix=f".{out.name}.", suffix=".tmp", dir=folder)
    try:
        with os.fdopen(fd, "wb") as fh:
            fh.write(data)
            fh.flush()
            os.fsync(fh.fileno())
        os.chmod(tmp, 0o666 & ~_umask())
        os.replace(tmp, out)
    except BaseException:
        try:
            os.unlink(tmp)
        except OSError:
            pass
        raise
    return out
