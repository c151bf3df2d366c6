"""The fabrication sheets as a PDF of their own (``calcreport build --fabrication``): the same
sheets that close the report, each stating the report sheet it copies, with the report's title
block, dates and reproducible bytes (reportlab's invariant mode, the job's date).

``render_fabrication_pdf(result, template, sheets)`` needs the report's sheet of each member's
fabrication sheet (``render_pdf(..., fab_sheets=d)`` fills ``d``), so the QR code and the text
under it carry the calculation's sheet reference, not this file's page number.
"""

from __future__ import annotations

import io
import os

from ..solve.results import JobResult
from .fabrication import fabrication_story
from .fmt import Display
from .pdfmeta import job_metadata
from .report.build import _canvasmaker, _page_info, _timestamp
from .report.common import Ctx
from .report.pages import ReportDoc
from .report.styles import make_styles, register_fonts
from .report.template import Template, load_template

__all__ = ["render_fabrication_pdf", "fabrication_path_for", "DOCUMENT"]

DOCUMENT = "fabrication sheet"  # the stamp's document kind: `verify` compares its job hash only


def fabrication_path_for(report_path: str | os.PathLike) -> str:
    """``out/x.pdf`` → ``out/x-fabrication.pdf``."""
    base, _ = os.path.splitext(os.fspath(report_path))
    return base + "-fabrication.pdf"


def render_fabrication_pdf(
    result: JobResult,
    sheets: dict[str, int],
    template: Template | None = None,
    payloads: dict[str, str] | None = None,
) -> bytes:
    """The fabrication sheets of ``result`` as PDF bytes (see module docstring)."""
    job = result.job
    tpl = template if template is not None else load_template(job.settings.template, job.path)
    fonts = register_fonts(tpl.font, tpl.font_bold, tpl.font_mono)
    styles = make_styles(fonts, tpl.accent_color, tpl.font_size)
    display = Display(job.settings.units, job.settings.display)
    info = _page_info(result, tpl)
    h = job.header
    extra = {
        **job_metadata(job.sha256, DOCUMENT),
        "CalcreportJobFile": os.path.basename(job.path),
        "CalcreportRevision": h.revision,
    }
    maker = _canvasmaker(extra, _timestamp(h.date))
    info.deferred = True
    buf = io.BytesIO()
    doc = ReportDoc(
        buf,
        tpl,
        styles,
        info,
        maker,
        title=f"{h.project} — fabrication sheets".strip(" —"),
        author=h.prepared_by or "calcreport",
        subject=h.subject or h.project,
        keywords=", ".join(
            x for x in (h.number, f"revision {h.revision}" if h.revision else "", "fabrication") if x
        ),
        creator="calcreport",
    )
    ctx = Ctx(result, display, styles, tpl, doc.width, frozenset(), "", doc.frame_height)
    story = fabrication_story(ctx, sheets=sheets, payloads=payloads)
    if story and type(story[0]).__name__ == "PageBreak":
        story = story[1:]  # the first sheet starts the document
    doc.build(story, canvasmaker=maker)
    return buf.getvalue()
