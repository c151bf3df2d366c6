"""``calcreport verify``: the job-file SHA-256 stamped in a PDF against the job file.

The hash is SHA-256 (FIPS 180-4) of the job file's bytes; here it is recomputed with hashlib,
independently of the loader, and compared with what the PDF carries.
"""

from __future__ import annotations

import hashlib

import pypdf
from reportlab.pdfgen.canvas import Canvas
from review_helpers import DEMO, demo_text, edited, run, write

from calcreport import __version__
from calcreport.outputs.pdfmeta import KEY_JOB_SHA256, KEY_VERSION, job_metadata, stamp


def _sha(path) -> str:
    return hashlib.sha256(open(path, "rb").read()).hexdigest()


def _pdf(path, entries=None) -> str:
    """A one-page PDF with calcreport's metadata, written the way the report engine stamps it."""
    c = Canvas(str(path), invariant=1)
    c.setTitle("test report")
    c.drawString(72, 720, "calculation report")
    if entries:
        stamp(c, entries)
    c.showPage()
    c.save()
    return str(path)


def test_stamp_is_readable_by_pypdf_and_reproducible(tmp_path):
    entries = job_metadata(_sha(DEMO), "calculation report")
    a, b = _pdf(tmp_path / "a.pdf", entries), _pdf(tmp_path / "b.pdf", entries)
    meta = pypdf.PdfReader(a).metadata
    assert meta["/" + KEY_JOB_SHA256] == _sha(DEMO)
    assert meta["/" + KEY_VERSION] == __version__
    assert meta["/Title"] == "test report"  # the standard entries are kept
    assert open(a, "rb").read() == open(b, "rb").read()


def test_match_then_mismatch_after_edit(tmp_path, capsys):
    job = write(tmp_path / "job.toml", demo_text())
    pdf = _pdf(tmp_path / "report.pdf", job_metadata(_sha(job), "calculation report"))
    code, out, err = run(["verify", pdf, job], capsys)
    assert code == 0, err
    assert out.startswith("match: ")
    assert _sha(job) in out and f"built with calcreport {__version__}" in out

    write(tmp_path / "job.toml", edited(demo_text(), ('shear = "3.6 kip"', 'shear = "3.7 kip"')))
    code, out, _ = run(["verify", pdf, job], capsys)
    assert code == 1
    assert out.startswith("mismatch: ")
    lines = out.splitlines()
    assert _sha(job) in lines[1] and job_metadata(_sha(DEMO), "x")[KEY_JOB_SHA256] in lines[2]


def test_change_report_verifies_against_the_new_job(tmp_path, capsys):
    new = write(tmp_path / "new.toml", edited(demo_text(), ('shear = "3.6 kip"', 'shear = "4.2 kip"')))
    pdf = str(tmp_path / "changes.pdf")
    code, _, _ = run(["diff", str(DEMO), new, "--pdf", pdf], capsys)
    assert code == 1
    code, out, _ = run(["verify", pdf, new], capsys)
    assert code == 0 and "(change report)" in out
    code, out, _ = run(["verify", pdf, str(DEMO)], capsys)
    assert code == 1


def test_unreadable_or_unstamped_pdf_exit_2(tmp_path, capsys):
    job = str(DEMO)
    plain = _pdf(tmp_path / "plain.pdf")  # no calcreport metadata
    code, out, err = run(["verify", plain, job], capsys)
    assert code == 2 and out == "" and "no calcreport job-file hash" in err and err.count("\n") == 1
    junk = write(tmp_path / "junk.pdf", "this is not a PDF")
    code, _, err = run(["verify", junk, job], capsys)
    assert code == 2 and "junk.pdf" in err and err.count("\n") == 1
    code, _, err = run(["verify", str(tmp_path / "missing.pdf"), job], capsys)
    assert code == 2 and "missing.pdf" in err


def test_invalid_job_exit_2(tmp_path, capsys):
    pdf = _pdf(tmp_path / "r.pdf", job_metadata(_sha(DEMO), "calculation report"))
    bad = write(tmp_path / "bad.toml", demo_text().replace('E = "1600 ksi"', 'E = "1600 kips"'))
    code, out, err = run(["verify", pdf, bad], capsys)
    assert code == 2 and out == "" and "bad.toml" in err and "material[df2].E" in err
