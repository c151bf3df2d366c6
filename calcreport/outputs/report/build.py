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
from pathlib import Path

from reportlab.lib.utils import TimeStamp
from reportlab.pdfgen.canvas import Canvas
from reportlab.platypus import KeepTogether, PageBreak

from ... import __version__
from ...safewrite import write_atomic
from ...solve.results import JobResult
from ..fabrication import fabrication_sections, fabrication_story
from ..fmt import Display
from ..pdfmeta import KEY_MARKED_SINCE, job_metadata, seal_metadata
from ..pdfmeta import stamp as stamp_info
from .assumed import assumed_story
from .common import Ctx
from .cover import cover_story
from .epoch import reportlab_epoch, timestamp
from .flow import disciplined
from .member_story import member_story, member_title
from .pages import PageInfo, ReportDoc, SectionStart
from .signoff import limitations_story, signoff_story
from .styles import make_styles, register_fonts
from .template import Template, load_template

__all__ = ["build_pdf", "render_pdf", "write_atomic", "report_sections"]


def _timestamp(job_date: str) -> TimeStamp:
    """Creation date: the job's date (YYYY-MM-DD), else SOURCE_DATE_EPOCH, else 2000-01-01, in UTC
    (:mod:`.epoch`)."""
    return timestamp(job_date)


def _canvasmaker(extra: dict[str, str], stamp: TimeStamp):
    class ReportCanvas(Canvas):
        def __init__(self, *a, **kw):
            kw["invariant"] = 1
            with reportlab_epoch(int(stamp.t)):  # reportlab reads SOURCE_DATE_EPOCH itself
                super().__init__(*a, **kw)
            stamp_info(self, extra)  # our entries, read back by `calcreport verify`
            self._doc.info.invariant = 1
            self._doc._timeStamp = stamp
            sig = self._doc.signature = hashlib.md5(usedforsecurity=False)  # file id from our date only
            sig.update(b"a reportlab document")
            sig.update(ascii(stamp.t).encode("ascii"))
            self.setCreator(f"calcreport {__version__}")
            self.setProducer(f"calcreport {__version__} (ReportLab)")

    return ReportCanvas


SIGNOFF = ("signoff", "Review and sign-off")


def report_sections(result: JobResult, signoff_on_cover: bool = False) -> list[tuple[str, str]]:
    """(section id, contents title) in report order; the sign-off on the cover when it fits there
    (:func:`_signoff_fits_cover`), else last."""
    out = [("cover", "Cover: summary, revision history and contents")]
    if signoff_on_cover:
        out.append(SIGNOFF)
    for i, m in enumerate(result.members, 1):
        out.append((f"member:{m.id}", f"{i}  Member {m.id} — {m.member.title}"))
    out += [("assumed", "Assumed values"), ("limits", "Limitations and cautions")]
    if not signoff_on_cover:
        out.append(SIGNOFF)
    out += fabrication_sections(result)  # fabrication sheets close the report (outputs/fabrication.py)
    return out


def _flat(block: list) -> list:
    """A KeepTogether inside another always measures as too tall: its content, flattened."""
    out: list = []
    for f in block:
        out += f._content if isinstance(f, KeepTogether) else [f]
    return out


def _measure(flowables: list, width: float, height: float) -> float:
    total = 0.0
    for f in flowables:
        _, h = f.wrap(width, height)
        total += h + f.getSpaceBefore() + f.getSpaceAfter()
    return total


def _signoff_fits_cover(ctx: Ctx, info: PageInfo, result: JobResult) -> bool:
    """The sign-off goes on the cover, under the contents, when the cover and it fit one sheet
    (the cover's own flowables and the block measured at the frame's width, 3 pt to spare; the measure
    counts every space before and after, so it errs on the safe side);
    otherwise it closes the report."""
    sections = report_sections(result, True)  # same rows as either order: the same height
    refs = dict(info.refs)  # the trial cover asks for contents cells: forget them afterwards
    try:
        cover = _measure(cover_story(ctx, info, sections), ctx.width, ctx.frame_height)
    finally:
        info.refs.clear()
        info.refs.update(refs)
    block = _measure(_flat(signoff_story(ctx, on_cover=True)), ctx.width, ctx.frame_height)
    return cover + block + 3.0 <= ctx.frame_height


def _story(
    ctx: Ctx,
    info: PageInfo,
    sections: list[tuple[str, str]],
    fab_sheets: dict[str, int] | None = None,
    signoff_on_cover: bool = False,
) -> list:
    story: list = [SectionStart("cover", sections[0][1], "Cover and summary")]
    story += cover_story(ctx, info, sections)
    if signoff_on_cover:
        story.append(
            KeepTogether([SectionStart(*SIGNOFF, "Cover and summary"), *_flat(signoff_story(ctx, True))])
        )
    offset = 1 if signoff_on_cover else 0  # the sign-off's entry sits before the members'
    for i, m in enumerate(ctx.result.members, 1):
        story.append(PageBreak())
        subject = f"Member {m.id} — {m.member.title}"
        story.append(SectionStart(f"member:{m.id}", sections[i + offset][1], subject))
        story.append(member_title(m, i, ctx))
        story += member_story(m, ctx, i)
    # the assumed values follow the last member's results on its sheet (their title and lead go
    # where their first entries go: outputs/report/columns.py)
    story.append(SectionStart("assumed", "Assumed values", "Assumed values"))
    story += assumed_story(ctx)
    story.append(SectionStart("limits", "Limitations and cautions", "Limitations and cautions"))
    story += limitations_story(ctx)
    if not signoff_on_cover:  # set whole, last: signed once everything above it has been read
        story.append(
            KeepTogether([SectionStart(*SIGNOFF, "Review and sign-off"), *_flat(signoff_story(ctx))])
        )
    story += fabrication_story(ctx, record=fab_sheets)  # one sheet per member, each on a new page
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
    marked_since: str = "",
    fab_sheets: dict[str, int] | None = None,
) -> bytes:
    """The report of ``result`` as PDF bytes (see module docstring).

    ``marked_since``: the git revision the marks compare with (``build --since``), stamped in the
    metadata so that ``calcreport verify`` can recompute the marks and rebuild the same bytes.
    ``fab_sheets`` (optional) receives the sheet of each member's fabrication sheet.
    """
    job = result.job
    tpl = template if template is not None else load_template(job.settings.template, job.path)
    fonts = register_fonts(tpl.font, tpl.font_bold, tpl.font_mono)
    styles = make_styles(fonts, tpl.accent_color, tpl.font_size)
    display = Display(job.settings.units, job.settings.display)
    info = _page_info(result, tpl)
    h = job.header
    extra = {
        **job_metadata(job.sha256, "calculation report"),  # the keys `verify` reads (pdfmeta)
        "CalcreportJobFile": os.path.basename(job.path),
        "CalcreportRevision": h.revision,
        **{k: v for k, v in seal_metadata(h.engineer, h.licence, h.jurisdiction).items() if v},
        **({KEY_MARKED_SINCE: marked_since} if marked_since else {}),
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
    on_cover = _signoff_fits_cover(ctx, info, result)
    sections = report_sections(result, on_cover)
    story = _story(ctx, info, sections, fab_sheets, on_cover)
    doc.build(disciplined(story, ctx.frame_height), canvasmaker=maker)
    pdf = buf.getvalue()
    return pdf


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
