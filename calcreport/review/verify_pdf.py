"""``calcreport verify``: prove that a report PDF is exactly what this job file builds.

Reports are byte-for-byte reproducible, so the proof is a rebuild: the job file is solved and the
report rendered in memory with the same template and tool version, and the file's original
revision (its first ``len(rebuild)`` bytes, up to the build's ``%%EOF``) must equal the rebuild
byte for byte. Everything after that is an incremental update or appended data and is reported
(:mod:`.pdf_revisions`); digital seals in those updates are checked by :mod:`.verify_seal`.

When the bytes differ, the sheets whose page content differs are named (page content streams
compared with pypdf) and differing document-information entries are listed. A report made by
another calcreport version cannot be rebuilt exactly; its page text is compared with the rebuild's
instead, and that weaker check is labelled so. Exit code: 0 only for an exact match (and, for a
sealed report, every seal intact, trusted and covering the whole file), 1 otherwise, 2 when the
PDF or the job file cannot be read.
"""

from __future__ import annotations

import io
from dataclasses import dataclass, field

from ..errors import JobError
from .verify import PdfStamp, read_stamp

__all__ = ["Finding", "Proof", "prove", "render_proof", "proof_to_dict", "compare_pages"]

OK, FAIL, WEAK, NOTE = "ok", "FAIL", "weak", "note"


@dataclass(frozen=True)
class Finding:
    status: str  # ok, FAIL, weak (a weaker check passed), note (information)
    check: str  # "job file", "rebuild", "sheets", "update 1", "seal 1" …
    text: str


@dataclass
class Proof:
    pdf: str
    job: str
    stamp: PdfStamp
    job_sha256: str
    findings: list[Finding] = field(default_factory=list)
    sheets_differ: list[int] = field(default_factory=list)
    signatures: list[dict] = field(default_factory=list)

    def add(self, status: str, check: str, text: str) -> None:
        self.findings.append(Finding(status, check, text))

    @property
    def exact(self) -> bool:
        """Every check ran and passed: the file is the rebuilt report (plus intact, trusted seals)."""
        return bool(self.findings) and all(f.status in (OK, NOTE) for f in self.findings)

    @property
    def code(self) -> int:
        return 0 if self.exact else 1


def prove(pdf_path: str, job_path: str, trust: tuple[str, ...] = ()) -> Proof:
    """Check ``pdf_path`` against ``job_path``; raises JobError when either cannot be read."""
    from .. import __version__
    from ..jobfile import load_job

    data = _read(pdf_path)
    stamp = read_stamp(pdf_path)
    job = load_job(job_path)
    if trust:
        from .verify_seal import load_trust_roots

        load_trust_roots(trust)  # a bad --trust file stops here, before the rebuild (exit 2)
    proof = Proof(pdf_path, job_path, stamp, job.sha256)
    if stamp.sha256 == job.sha256:
        proof.add(
            OK, "job file", f"the SHA-256 stamped in the PDF is that of {job_path} ({job.sha256[:16]}…)"
        )
    else:
        proof.add(
            FAIL,
            "job file",
            f"the PDF was stamped with job-file SHA-256 {stamp.sha256[:16]}…, {job_path} has "
            f"{job.sha256[:16]}… (the job file changed, or the report is another job's)",
        )
    if stamp.document and stamp.document != "calculation report":
        proof.add(
            WEAK,
            "rebuild",
            f"a {stamp.document} is not rebuilt from one job file: only the job-file hash was compared "
            "(a weaker check)",
        )
        return proof
    rebuilt = _rebuild(job_path, stamp.marked_since)
    if stamp.marked_since:
        proof.add(
            NOTE,
            "marks",
            f"the report marks what changed since git revision {stamp.marked_since}; the rebuild "
            "recomputed the marks from the repository as it is now",
        )
    from .pdf_revisions import read_revisions

    revs = read_revisions(data)
    same_version = stamp.version == __version__
    if same_version:
        n = len(rebuilt)
        if data[:n] == rebuilt:
            proof.add(
                OK,
                "rebuild",
                f"the report as built (bytes 0–{n:,}) is byte-identical to a rebuild of {job_path} "
                f"with calcreport {__version__}",
            )
        else:
            at = next((i for i, (a, b) in enumerate(zip(data, rebuilt)) if a != b), min(len(data), n))
            proof.add(
                FAIL,
                "rebuild",
                f"the report differs from a rebuild of {job_path} from byte {at:,} on "
                f"(file {len(data):,} bytes, rebuild {n:,})",
            )
    else:
        proof.add(
            WEAK,
            "version",
            f"built with calcreport {stamp.version}, this is calcreport {__version__}: an exact rebuild is "
            "not possible, so only the page text is compared (a weaker check: layout, drawings and "
            "metadata are not)",
        )
    if revs.error:
        proof.add(FAIL, "structure", revs.error)
    first_end = revs.revisions[0].end if revs.revisions else len(data)
    _pages(proof, data, rebuilt, first_end, (stamp.version, __version__))
    from .verify_seal import check_seals

    check_seals(proof, data, revs, len(rebuilt) if same_version else None, trust)
    return proof


def _read(pdf_path: str) -> bytes:
    from ..safeio import read_input
    from .verify import MAX_PDF_BYTES

    data = read_input(pdf_path, MAX_PDF_BYTES, "a PDF report")
    if not data.startswith(b"%PDF-"):
        raise JobError(pdf_path, "", "not a PDF (the file does not start with %PDF-)")
    return data


def _rebuild(job_path: str, since: str = "") -> bytes:
    """The report of ``job_path`` as ``calcreport build`` (``--since since``) writes it."""
    from ..outputs.report.build import render_pdf
    from ..outputs.report.template import load_template
    from ..pipeline import solve_file

    result = solve_file(job_path)
    tpl = load_template(result.job.settings.template, result.job.path)
    keys: frozenset[str] = frozenset()
    mark = ""
    if since:
        from .revisions import revision_marks_since

        marks = revision_marks_since(job_path, since, result)  # git errors: JobError, exit 2
        keys, mark = marks.changed_keys, marks.mark
    try:
        return render_pdf(result, tpl, keys, mark, marked_since=since)
    except JobError:
        raise
    except Exception as exc:  # a defect of ours: one line, exit 2
        raise JobError(
            job_path, "", f"internal error while rebuilding the report ({type(exc).__name__}: {exc})"
        ) from None


def _pypdf(data: bytes):
    import logging

    import pypdf

    logging.getLogger("pypdf").setLevel(logging.ERROR + 10)
    return pypdf.PdfReader(io.BytesIO(data), strict=False)


def compare_pages(data: bytes, rebuilt: bytes, text: bool = False, versions: tuple[str, str] = ("", "")):
    """Sheets (1-based) whose page content (or, with ``text``, extracted text) differs in the file as
    a viewer shows it (its last revision), and the two page counts."""
    a, b = _pypdf(data), _pypdf(rebuilt)
    na, nb = len(a.pages), len(b.pages)
    differ: list[int] = []
    for i in range(min(na, nb)):
        try:
            if text:
                ta = " ".join(a.pages[i].extract_text().split())
                tb = " ".join(b.pages[i].extract_text().split())
                if versions[0] and versions[1]:
                    ta = ta.replace(f"calcreport {versions[0]}", f"calcreport {versions[1]}")
                same = ta == tb
            else:
                same = _content(a.pages[i]) == _content(b.pages[i])
        except Exception:  # a damaged stream: it is not the rebuilt one
            same = False
        if not same:
            differ.append(i + 1)
    return differ, na, nb


def compare_info(data: bytes, rebuilt: bytes, text: bool = False) -> list[str]:
    """Document-information keys whose values differ (with ``text``: ignoring the tool version)."""
    a, b = _pypdf(data), _pypdf(rebuilt)
    info_a = {str(k): str(v) for k, v in (a.metadata or {}).items()}
    info_b = {str(k): str(v) for k, v in (b.metadata or {}).items()}
    if text:
        skip = {"/Creator", "/Producer", "/CalcreportVersion"}
        info_a = {k: v for k, v in info_a.items() if k not in skip}
        info_b = {k: v for k, v in info_b.items() if k not in skip}
    return sorted(k for k in set(info_a) | set(info_b) if info_a.get(k) != info_b.get(k))


def _content(page) -> bytes:
    c = page.get_contents()
    return b"" if c is None else c.get_data()


def _sheets(nums: list[int]) -> str:
    return ("sheet " if len(nums) == 1 else "sheets ") + ", ".join(str(n) for n in nums)


def _pages(proof: Proof, data: bytes, rebuilt: bytes, first_end: int, versions: tuple[str, str]) -> None:
    """Name the sheets that differ from the rebuild (as a viewer shows the file) and, when the
    build's own revision differs, its document-information entries."""
    exact_bytes = versions[0] == versions[1]
    first_exact = exact_bytes and data[: len(rebuilt)] == rebuilt
    if first_exact and len(data) == len(rebuilt):
        return  # byte-identical: nothing more to compare
    try:
        differ, na, nb = compare_pages(data, rebuilt, text=not exact_bytes, versions=versions)
        keys = [] if first_exact else compare_info(data[: first_end or len(data)], rebuilt, not exact_bytes)
    except Exception as exc:
        proof.add(FAIL, "sheets", f"the pages cannot be read for comparison ({type(exc).__name__})")
        return
    proof.sheets_differ = differ
    what = "page content" if exact_bytes else "page text"
    if na != nb:
        proof.add(FAIL, "sheets", f"the PDF has {na} sheets, the rebuild {nb}")
    if differ:
        proof.add(FAIL, "sheets", f"{what} of {_sheets(differ)} differs from the rebuild")
    elif na == nb:
        proof.add(
            OK if exact_bytes else WEAK, "sheets", f"{what} of all {na} sheets is the same as the rebuild's"
        )
    if keys:
        proof.add(FAIL, "metadata", "document information differs from the rebuild: " + ", ".join(keys))


def proof_to_dict(p: Proof) -> dict:
    from .. import __version__

    return {
        "schema": 1,
        "tool": {"name": "calcreport", "version": __version__},
        "pdf": p.pdf,
        "job": p.job,
        "document": p.stamp.document,
        "built_with": p.stamp.version,
        "job_sha256": p.job_sha256,
        "stamped_sha256": p.stamp.sha256,
        "exact": p.exact,
        "exit_code": p.code,
        "sheets_differ": p.sheets_differ,
        "signatures": p.signatures,
        "findings": [{"status": f.status, "check": f.check, "text": f.text} for f in p.findings],
    }


def render_proof(p: Proof) -> str:
    """A verdict line, then one line per finding."""
    kind = f" ({p.stamp.document})" if p.stamp.document else ""
    if p.exact:
        head = f"match: {p.pdf}{kind} is exactly the report {p.job} builds"
    else:
        head = f"mismatch: {p.pdf}{kind} is NOT proven to be the report {p.job} builds"
    width = max(len(f.check) for f in p.findings) if p.findings else 0
    lines = [head] + [f"  {f.status:<4}  {f.check:<{width}}  {f.text}" for f in p.findings]
    return "\n".join(lines) + "\n"
