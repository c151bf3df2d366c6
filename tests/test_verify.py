"""``calcreport verify``: a report PDF is proven by rebuilding it, and tampered copies are caught.

The tampered files are made with pypdf (a general-purpose PDF library, used here as an attacker
would): a bit flipped in a page content stream, the document information rewritten, another job's
report restamped with this job's hash, a one-page forgery carrying the right metadata, garbage
appended, and an incremental update (ISO 32000-1 §7.5.6, pypdf's incremental writer) that paints
over a value on sheet 1. The job-file hash is SHA-256 (FIPS 180-4), recomputed here with hashlib.
"""

from __future__ import annotations

import hashlib
import io
import json

import pypdf
import pytest
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


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    """The demo job and its report as `calcreport build` writes it."""
    d = tmp_path_factory.mktemp("verify")
    job = write(d / "job.toml", demo_text())
    pdf = d / "job.pdf"
    from calcreport.cli import main

    assert main(["build", job, "-o", str(pdf)]) in (0, 1)
    return job, pdf.read_bytes()


def _verify(tmp_path, data: bytes, job: str, capsys, *extra: str):
    p = tmp_path / "report.pdf"
    p.write_bytes(data)
    return run(["verify", str(p), job, *extra], capsys)


def _flip_in_page_stream(data: bytes) -> bytes:
    """``data`` with one bit flipped inside sheet 2's content stream (no other byte moved)."""
    r = pypdf.PdfReader(io.BytesIO(data))
    ref = r.pages[1].raw_get("/Contents")
    i = data.index(f"\n{ref.idnum} 0 obj".encode())
    j = data.index(b"stream", i) + len(b"stream\n") + 40
    return data[:j] + bytes([data[j] ^ 0x01]) + data[j + 1 :]


def test_stamp_is_readable_by_pypdf_and_reproducible(tmp_path):
    entries = job_metadata(_sha(DEMO), "calculation report")
    a, b = _pdf(tmp_path / "a.pdf", entries), _pdf(tmp_path / "b.pdf", entries)
    meta = pypdf.PdfReader(a).metadata
    assert meta["/" + KEY_JOB_SHA256] == _sha(DEMO)
    assert meta["/" + KEY_VERSION] == __version__
    assert meta["/Title"] == "test report"  # the standard entries are kept
    assert open(a, "rb").read() == open(b, "rb").read()


def test_fresh_build_is_an_exact_match(tmp_path, capsys, built):
    job, data = built
    code, out, err = _verify(tmp_path, data, job, capsys)
    assert code == 0, out + err
    assert out.startswith("match: ")
    assert "byte-identical to a rebuild" in out and f"calcreport {__version__}" in out
    assert _sha(job)[:16] in out
    assert "'engineer-seal' is empty" in out  # the reserved seal field, unsigned
    code, out, _ = _verify(tmp_path, data, job, capsys, "--json")
    doc = json.loads(out)
    assert code == 0 and doc["exact"] is True and doc["exit_code"] == 0 and doc["sheets_differ"] == []
    assert doc["job_sha256"] == _sha(job) and doc["built_with"] == __version__


def test_job_edit_is_a_mismatch_naming_the_sheets(tmp_path, capsys, built):
    job, data = built
    changed = write(tmp_path / "job.toml", edited(demo_text(), ('shear = "3.6 kip"', 'shear = "3.7 kip"')))
    code, out, _ = _verify(tmp_path, data, changed, capsys)
    assert code == 1 and out.startswith("mismatch: ")
    assert "FAIL  job file" in out and "FAIL  rebuild" in out
    assert "differs from the rebuild" in out and "sheet" in out


def test_page_content_bit_flip_fails(tmp_path, capsys, built):
    job, data = built
    code, out, _ = _verify(tmp_path, _flip_in_page_stream(data), job, capsys, "--json")
    doc = json.loads(out)
    assert code == 1 and doc["exact"] is False
    assert doc["sheets_differ"] == [2]  # only the flipped sheet is named
    assert any(f["check"] == "rebuild" and f["status"] == "FAIL" for f in doc["findings"])


def test_metadata_rewrite_fails(tmp_path, capsys, built):
    job, data = built
    w = pypdf.PdfWriter(clone_from=pypdf.PdfReader(io.BytesIO(data)))
    w.add_metadata({"/Author": "Somebody Else"})
    buf = io.BytesIO()
    w.write(buf)
    code, out, _ = _verify(tmp_path, buf.getvalue(), job, capsys)
    assert code == 1
    assert "FAIL  metadata" in out and "/Author" in out


def test_restamped_report_of_another_job_fails(tmp_path, capsys, built):
    job, _ = built
    other = write(tmp_path / "other.toml", edited(demo_text(), ('shear = "3.6 kip"', 'shear = "2.4 kip"')))
    out_pdf = tmp_path / "other.pdf"
    code, _, _ = run(["build", other, "-o", str(out_pdf)], capsys)
    assert code in (0, 1)
    forged = out_pdf.read_bytes().replace(_sha(other).encode(), _sha(job).encode())
    assert pypdf.PdfReader(io.BytesIO(forged)).metadata["/" + KEY_JOB_SHA256] == _sha(job)
    code, out, _ = _verify(tmp_path, forged, job, capsys)
    assert code == 1
    assert "ok    job file" in out  # the stamp alone would have passed
    assert "FAIL  rebuild" in out and "differs from the rebuild" in out


def test_one_page_forgery_with_the_right_metadata_fails(tmp_path, capsys, built):
    job, _ = built
    forged = _pdf(tmp_path / "forged.pdf", job_metadata(_sha(job), "calculation report"))
    code, out, _ = run(["verify", forged, job], capsys)
    assert code == 1
    assert "the PDF has 1 sheets, the rebuild" in out


def test_appended_garbage_fails(tmp_path, capsys, built):
    job, data = built
    code, out, _ = _verify(tmp_path, data + b"\nthis was added later\n", job, capsys)
    assert code == 1
    assert "ok    rebuild" in out  # the build's own revision is intact …
    assert "FAIL  appended" in out  # … and the extra bytes are reported


def test_incremental_update_after_build_is_reported(tmp_path, capsys, built):
    job, data = built
    src = tmp_path / "src.pdf"
    src.write_bytes(data)
    w = pypdf.PdfWriter(str(src), incremental=True)
    page = w.pages[0]
    c = page.get_contents()
    c.set_data(c.get_data() + b"\nq 1 g 400 300 80 12 re f Q\n")  # a white box over a value
    page.replace_contents(c)
    buf = io.BytesIO()
    w.write(buf)
    updated = buf.getvalue()
    assert updated.startswith(data) and len(updated) > len(data)  # an incremental update
    code, out, _ = _verify(tmp_path, updated, job, capsys, "--json")
    doc = json.loads(out)
    assert code == 1 and doc["sheets_differ"] == [1]
    upd = [f for f in doc["findings"] if f["check"] == "update 1"]
    assert upd and upd[0]["status"] == "FAIL"
    assert "content of sheet 1" in upd[0]["text"] and "no seal covers it" in upd[0]["text"]


def test_other_tool_version_is_said_and_compared_by_text(tmp_path, capsys, built, monkeypatch):
    job, data = built
    import calcreport
    import calcreport.outputs.report.build as build_mod

    monkeypatch.setattr(calcreport, "__version__", "0.0.9")
    monkeypatch.setattr(build_mod, "__version__", "0.0.9")
    old = tmp_path / "old.pdf"
    code, _, _ = run(["build", job, "-o", str(old)], capsys)
    monkeypatch.undo()
    code, out, _ = run(["verify", str(old), job], capsys)
    assert code == 1  # never an exact match
    assert f"built with calcreport 0.0.9, this is calcreport {__version__}" in out
    assert "weaker" in out and "weak  sheets" in out and "page text of all" in out


def test_change_report_is_only_hash_checked_and_says_so(tmp_path, capsys):
    new = write(tmp_path / "new.toml", edited(demo_text(), ('shear = "3.6 kip"', 'shear = "4.2 kip"')))
    pdf = str(tmp_path / "changes.pdf")
    code, _, _ = run(["diff", str(DEMO), new, "--pdf", pdf], capsys)
    assert code == 1
    code, out, _ = run(["verify", pdf, new], capsys)
    assert code == 1 and "(change report)" in out and "ok    job file" in out and "weaker" in out
    code, out, _ = run(["verify", pdf, str(DEMO)], capsys)
    assert code == 1 and "FAIL  job file" in out


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
