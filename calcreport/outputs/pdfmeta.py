"""calcreport's own entries in a PDF's document information dictionary.

Every PDF calcreport writes carries ``/CalcreportJobSHA256`` (SHA-256 of the job file bytes,
:attr:`calcreport.model.Job.sha256`) and ``/CalcreportVersion`` so ``calcreport verify`` can tell
which job file and which tool version made it.

reportlab (4.x/5.x) has setters for the standard entries only (``setTitle``, ``setSubject`` …),
no public call for extra keys. :func:`stamp` therefore swaps the canvas's document information
object for a subclass that appends our keys when the PDF is written, so the file is written once,
directly, and stays byte-for-byte reproducible with ``invariant=1``.
"""

from __future__ import annotations

from collections.abc import Mapping

__all__ = [
    "KEY_JOB_SHA256",
    "KEY_VERSION",
    "KEY_BASE_SHA256",
    "KEY_DOCUMENT",
    "KEY_ENGINEER",
    "KEY_LICENCE",
    "KEY_JURISDICTION",
    "KEY_MARKED_SINCE",
    "stamp",
    "job_metadata",
    "seal_metadata",
]

KEY_JOB_SHA256 = "CalcreportJobSHA256"
KEY_VERSION = "CalcreportVersion"
KEY_BASE_SHA256 = "CalcreportBaseJobSHA256"  # change reports: the older revision's job file
KEY_DOCUMENT = "CalcreportDocument"  # "calculation report", "change report"
# the job's engineer of record ([job] engineer, licence, jurisdiction), read by `calcreport seal`
KEY_ENGINEER = "CalcreportEngineer"
KEY_LICENCE = "CalcreportLicence"
KEY_JURISDICTION = "CalcreportJurisdiction"
KEY_MARKED_SINCE = "CalcreportMarkedSince"  # build --since REV: the revision the marks compare with


def seal_metadata(engineer: str, licence: str, jurisdiction: str) -> dict[str, str]:
    """The engineer-of-record entries (empty values are left for the caller to drop)."""
    return {KEY_ENGINEER: engineer, KEY_LICENCE: licence, KEY_JURISDICTION: jurisdiction}


def job_metadata(job_sha256: str, document: str, base_sha256: str = "") -> dict[str, str]:
    """Our entries for a document built from a job file with hash ``job_sha256``."""
    from .. import __version__

    out = {KEY_JOB_SHA256: job_sha256, KEY_VERSION: __version__, KEY_DOCUMENT: document}
    if base_sha256:
        out[KEY_BASE_SHA256] = base_sha256
    return out


def stamp(canvas, entries: Mapping[str, str]) -> None:
    """Add ``entries`` (names without the leading slash) to the info dictionary of ``canvas``.

    The one stamper of calcreport's documents (calculation report and change report). Works for a
    bare :class:`reportlab.pdfgen.canvas.Canvas` and for the canvas a platypus document template
    passes to its page callbacks; the standard entries (title, author …) set before or after are
    kept. The dictionary is written in a fixed order, so the same document gives the same bytes.
    """
    from reportlab.pdfbase.pdfdoc import PDFDate, PDFDictionary, PDFInfo, PDFName, PDFString

    for name in entries:
        if not name or not name.isalnum():
            raise ValueError(f"PDF info key must be letters and digits, got {name!r}")
    doc = canvas._doc  # reportlab keeps the document being written here (no public accessor)
    current = doc.info
    extra = dict(getattr(current, "calcreport_extra", {}))
    extra.update(entries)

    class _Info(PDFInfo):
        calcreport_extra: dict[str, str] = {}

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
            D["ModDate"] = D["CreationDate"] = PDFDate(
                ts=document._timeStamp, dateFormatter=self._dateFormatter
            )
            for k, v in self.calcreport_extra.items():
                D[k] = PDFString(v)
            return PDFDictionary(D).format(document)

    info = _Info()
    info.__dict__.update(current.__dict__)
    info.calcreport_extra = extra
    doc.info = info
