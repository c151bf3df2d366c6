"""Change report PDF: what changed between two revisions of a job, for the reviewer.

Same content as the text diff (:mod:`.diff_text`): changed results first (with changed zoned
connector schedules, old and new zone lists side by side), then changed derivation steps, changed inputs, and added/removed tables. Every changed value is highlighted and marked with
a revision triangle carrying the new job's revision letter. The page furniture is the calculation
report's (:mod:`.report`): its template, fonts, styles, title block on every sheet ("Sheet N of M")
and footer. The file is written atomically and is byte-for-byte reproducible.
"""

from __future__ import annotations

import io
import os

from reportlab.lib import colors
from reportlab.pdfgen.canvas import Canvas
from reportlab.platypus import Spacer

from .. import __version__
from ..outputs.pdfmeta import job_metadata, stamp
from ..outputs.report.common import grid, heading, para
from ..outputs.report.pages import MarginMark, PageInfo, ReportDoc
from ..outputs.report.styles import make_styles, register_fonts
from ..outputs.report.template import Template, load_template
from ..safewrite import write_atomic
from .diff import JobDiff
from .diff_schedule import figures_text, zone_text
from .diff_text import ARROW, FIELD_SIG, check_titles, display_for, input_pair, owner_title, value_pair

__all__ = ["write_change_report", "render_change_report", "CAUTIONS"]

CAUTIONS = (
    "This change report lists differences between two revisions only; the calculation report "
    "of the new revision is the document of record. Both must be reviewed, and the calculation "
    "sealed, by a licensed professional engineer. Local codes and the authority having "
    "jurisdiction govern. calcreport checks only what the calculation report shows; see its "
    "limitations."
)
HIGHLIGHT = colors.HexColor("#fff0a0")
MAX_PASSES = 4


def _canvas_class(entries: dict[str, str], job_date: str = ""):
    from ..outputs.report.epoch import reportlab_epoch, timestamp

    stamp_time = timestamp(job_date)  # the new revision's date in UTC (see report/epoch.py)

    class _ChangeCanvas(Canvas):
        def __init__(self, *a, **kw):
            kw["invariant"] = 1
            with reportlab_epoch(int(stamp_time.t)):  # reportlab reads SOURCE_DATE_EPOCH itself
                super().__init__(*a, **kw)
            self._doc._timeStamp = stamp_time
            self.setCreator(f"calcreport {__version__}")
            stamp(self, entries)

    return _ChangeCanvas


def _page_info(diff: JobDiff, tpl: Template) -> PageInfo:
    job, h = diff.new.job, diff.new.job.header
    return PageInfo(
        firm=tpl.firm,
        address=tpl.address,
        project=h.project,
        number=h.number,
        subject=f"Change report, revision {h.revision or '—'}",
        revision=h.revision,
        prepared=h.prepared_by,
        prepared_date=h.prepared_date or h.date,
        checked=h.checked_by,
        checked_date=h.checked_date,
        job_file=os.path.basename(job.path),
        sha_short=job.sha256[:12],
        version=__version__,
    )


class _Build:
    """The story of one change report (nothing computed: values come from the diff)."""

    def __init__(self, diff: JobDiff, styles, tpl: Template, width: float, frame_height: float):
        self.diff, self.st, self.tpl, self.w, self.fh = diff, styles, tpl, width, frame_height
        self.d = display_for(diff.new)
        self.letter = diff.new.job.header.revision or "Δ"

    def mark(self, text: str) -> list:
        return [MarginMark(self.letter, self.tpl.margins[0], self.st), para(text, self.st.cell)]

    def table(self, header: list[str], rows: list[list], fractions: list[float], now_col: int):
        extra = [("BACKGROUND", (now_col, 1), (now_col, -1), HIGHLIGHT)] if rows else []
        return grid(
            [header] + rows,
            [self.w * f for f in fractions],
            self.st,
            extra=extra,
            zebra=False,
            frame_height=self.fh,
        )

    def story(self) -> list:
        diff, st, d = self.diff, self.st, self.d
        h_new, h_old = diff.new.job.header, diff.old.job.header
        out: list = [
            para(
                f"Changes in revision {h_new.revision or '—'} (from revision {h_old.revision or '—'})", st.h1
            ),
            para(
                f"New: {diff.new.label} — revision {h_new.revision}, {h_new.date}; SHA-256 {diff.new.job.sha256}",
                st.small,
            ),
            para(
                f"Previous: {diff.old.label} — revision {h_old.revision}, {h_old.date}; "
                f"SHA-256 {diff.old.job.sha256}",
                st.small,
            ),
            Spacer(1, 4),
            para(
                "Results changed."
                if diff.results_changed
                else "No result changed." + (" Inputs changed only." if diff.inputs_changed else ""),
                st.body,
                "b",
            ),
            para(
                f"Values in {d.system} units of the new revision. Changed values are highlighted and marked "
                f"with the revision triangle {self.letter}.",
                st.body,
            ),
        ]
        out += self._results() + self._schedules() + self._steps() + self._inputs() + self._entities()
        if not (diff.summary or diff.schedules or diff.steps or diff.inputs or diff.added or diff.removed):
            out.append(para(f"No difference between the two job files {ARROW} nothing to review.", st.body))
        out += [*heading("Cautions", st.h2, 60), para(CAUTIONS, st.body)]
        return out

    def _results(self) -> list:
        rows, titles = [], check_titles(self.diff)
        for c in self.diff.summary:
            if c.kind == "changed":
                a, b = value_pair(self.d, c.old, c.new, FIELD_SIG.get(c.field.split(".")[-1], 4))
            elif c.kind == "added":
                a, b = "(none)", f"added, {c.new}"
            else:
                a, b = f"{c.old}", "removed"
            rows.append([self.mark(owner_title(c.owner, titles)), c.label, a, b])
        if not rows:
            return []
        return [
            *heading("Results", self.st.h2),
            self.table(["Where", "Quantity", "Previous", "Now"], rows, [0.34, 0.26, 0.2, 0.2], 3),
        ]

    def _schedules(self) -> list:
        """Each changed schedule whole: N and the zone list before and now (zones by position)."""
        rows = []
        for c in self.diff.schedules:

            def zones(sch, fresh=()):
                return [para(figures_text(self.d, sch), self.st.cell)] + [
                    para(f"{k}: {zone_text(self.d, z)}" + (" (changed)" if k in fresh else ""), self.st.cell)
                    for k, z in enumerate(getattr(sch, "zones", ()) or (), 1)
                ]

            rows.append(
                [
                    self.mark(owner_title(c.owner)) + [para(", ".join(c.changed), self.st.small)],
                    zones(c.old),
                    zones(c.new, c.new_zones),
                ]
            )
        if not rows:
            return []
        return [
            *heading("Connector schedules", self.st.h2),
            para(
                "Zones are compared by their position along the member, not by their number.", self.st.small
            ),
            self.table(["Joint (what changed)", "Previous", "Now"], rows, [0.24, 0.38, 0.38], 2),
        ]

    def _steps(self) -> list:
        rows = []
        for s in self.diff.steps:
            ref = s.new or s.old
            if s.old is None or s.new is None:
                a = "(not made)" if s.old is None else self.d.value(s.old.result)
                b = "(no longer made)" if s.new is None else self.d.value(s.new.result)
            else:
                a, b = value_pair(self.d, s.old.result, s.new.result)
                if not s.result_changed:
                    a, b = f"{a}; {self.d.substituted(s.old)}", f"{b}; {self.d.substituted(s.new)}"
            rows.append([self.mark(f"{ref.label} ({ref.symbol})") + [para(s.key, self.st.small)], a, b])  # type: ignore[union-attr]
        if not rows:
            return []
        return [
            *heading("Derivation steps", self.st.h2),
            self.table(["Step", "Previous", "Now"], rows, [0.5, 0.25, 0.25], 2),
        ]

    def _inputs(self) -> list:
        rows = []
        for c in self.diff.inputs:
            a, b, hint = input_pair(self.d, c)
            rows.append([self.mark(c.key), a, f"{b} ({hint})" if hint else b])
        if not rows:
            return []
        return [
            *heading("Inputs", self.st.h2),
            self.table(["Key in the job file", "Previous", "Now"], rows, [0.4, 0.3, 0.3], 2),
        ]

    def _entities(self) -> list:
        rows = [
            [self.mark(what), e.kind, e.id, e.key]
            for what, items in (("added", self.diff.added), ("removed", self.diff.removed))
            for e in items
        ]
        if not rows:
            return []
        return [
            *heading("Added and removed", self.st.h2),
            self.table(["Change", "Kind", "Id", "Key in the job file"], rows, [0.15, 0.15, 0.25, 0.45], 0),
        ]


def render_change_report(diff: JobDiff, allow_outside: bool = False) -> bytes:
    """The change report as PDF bytes, laid out until the sheet count is stable."""
    job = diff.new.job
    tpl = load_template(job.settings.template, job.path, allow_outside)
    fonts = register_fonts(tpl.font, tpl.font_bold, tpl.font_mono)
    styles = make_styles(fonts, tpl.accent_color, tpl.font_size)
    info = _page_info(diff, tpl)
    info.sections = {}
    h = job.header
    maker = _canvas_class(job_metadata(job.sha256, "change report", diff.old.job.sha256), h.date)
    pdf = b""
    for _ in range(MAX_PASSES):
        buf = io.BytesIO()
        doc = ReportDoc(
            buf,
            tpl,
            styles,
            info,
            maker,
            title=f"{h.project} — change report, revision {h.revision}",
            author=h.prepared_by or "calcreport",
            subject=f"Changes from {diff.old.label} to {diff.new.label}",
            creator=f"calcreport {__version__}",
        )
        doc.current_subject = f"Changes from revision {diff.old.job.header.revision or '—'}"
        doc.build(_Build(diff, styles, tpl, doc.width, doc.frame_height).story(), canvasmaker=maker)
        pdf = buf.getvalue()
        stable = info.total == doc.page
        info.total = doc.page
        if stable:
            break
    return pdf


def write_change_report(diff: JobDiff, out_path: str, allow_outside: bool = False) -> None:
    """Write the change report to ``out_path`` atomically (nothing half-written on failure)."""
    write_atomic(render_change_report(diff, allow_outside), out_path)
