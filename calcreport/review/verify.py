"""The job-file stamp of a calcreport PDF, and the comparison of that stamp alone with a job file.

The stamp is only the first of ``calcreport verify``'s checks: the command proves the whole file
by rebuilding it (:mod:`.verify_pdf`). The PDF's information dictionary carries
``/CalcreportJobSHA256`` and ``/CalcreportVersion`` (:mod:`.pdfmeta`); the job file's hash is
:attr:`calcreport.model.Job.sha256`. pypdf is imported only when a PDF is read.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from ..errors import JobError
from ..outputs.pdfmeta import KEY_DOCUMENT, KEY_JOB_SHA256, KEY_MARKED_SINCE, KEY_VERSION

__all__ = ["PdfStamp", "Verdict", "read_stamp", "verify", "render_verdict"]

_HEX = set("0123456789abcdef")
MAX_PDF_BYTES = 200_000_000  # far above any calculation report (817 sheets ≈ 3 MB)


@dataclass(frozen=True)
class PdfStamp:
    """What a calcreport PDF says about its origin."""

    sha256: str
    version: str
    document: str
    marked_since: str = ""  # build --since REV: revision marks against git revision REV


@dataclass(frozen=True)
class Verdict:
    pdf: str
    job: str
    stamp: PdfStamp
    job_sha256: str

    @property
    def match(self) -> bool:
        return self.stamp.sha256 == self.job_sha256


def read_stamp(pdf_path: str) -> PdfStamp:
    """Read calcreport's metadata from ``pdf_path``.

    Raises:
        JobError: the file cannot be read, is not a PDF, or carries no calcreport job hash.
    """
    try:
        import pypdf
    except ModuleNotFoundError:
        raise JobError(pdf_path, "", "reading PDFs needs the pypdf package (pip install pypdf)") from None
    import logging

    logging.getLogger("pypdf").setLevel(logging.ERROR + 10)  # our one-line message says what is wrong
    import io

    from ..safeio import read_input

    data = read_input(pdf_path, MAX_PDF_BYTES, "a PDF report")
    try:
        reader = pypdf.PdfReader(io.BytesIO(data))
        info: Any = reader.metadata or {}
        sha = info.get("/" + KEY_JOB_SHA256)
        version = info.get("/" + KEY_VERSION)
        document = info.get("/" + KEY_DOCUMENT)
        since = info.get("/" + KEY_MARKED_SINCE)
    except Exception as exc:  # pypdf raises many kinds on damaged files; the message is ours
        raise JobError(pdf_path, "", f"not a readable PDF ({type(exc).__name__})") from None
    sha = str(sha).strip().lower() if sha is not None else ""
    if len(sha) != 64 or not set(sha) <= _HEX:
        raise JobError(
            pdf_path,
            KEY_JOB_SHA256,
            "the PDF carries no calcreport job-file hash (was it built by calcreport?)",
        )
    return PdfStamp(
        sha, str(version) if version is not None else "unknown", str(document or ""), str(since or "")
    )


def verify(pdf_path: str, job_path: str) -> Verdict:
    """Compare the job hash stamped in ``pdf_path`` with the (validated) job file ``job_path``."""
    from ..pipeline import load

    stamp = read_stamp(pdf_path)
    job = load(job_path)
    return Verdict(pdf_path, job_path, stamp, job.sha256)


def render_verdict(v: Verdict) -> str:
    """``match``/``mismatch`` with both hashes and the tool version the PDF was built with."""
    from .. import __version__

    kind = f" ({v.stamp.document})" if v.stamp.document else ""
    if v.match:
        head = f"match: {v.pdf}{kind} was built from {v.job} as it is now"
    else:
        head = f"mismatch: {v.pdf}{kind} was NOT built from {v.job} as it is now"
    return (
        "\n".join(
            [
                head,
                f"  job file SHA-256:      {v.job_sha256}",
                f"  stamped in the PDF:    {v.stamp.sha256}",
                f"  built with calcreport {v.stamp.version} (this is calcreport {__version__})",
            ]
        )
        + "\n"
    )
