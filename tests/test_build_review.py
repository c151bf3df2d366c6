"""``calcreport build`` with the review options: ``--since REV`` revision triangles, ``--json``
results beside the PDF, and ``verify`` on a freshly built report.

Facts used: SHA-256 of the job bytes (FIPS 180-4, via hashlib); q = V·Q/I (mechanics of materials),
so a new shear V marks the shear-flow steps but not the section steps.
"""

from __future__ import annotations

import hashlib
import shutil

import pypdf
import pytest
from review_helpers import demo_text, edited, git, run, write

pytest.importorskip("calcreport.outputs.report.build")


def test_verify_a_freshly_built_report_then_edit(tmp_path, capsys):
    job = write(tmp_path / "job.toml", demo_text())
    pdf = str(tmp_path / "job.pdf")
    code, out, err = run(["build", job, "-o", pdf], capsys)
    assert code in (0, 1), err
    meta = pypdf.PdfReader(pdf).metadata
    assert meta["/CalcreportJobSHA256"] == hashlib.sha256(open(job, "rb").read()).hexdigest()
    code, out, _ = run(["verify", pdf, job], capsys)
    assert code == 0 and out.startswith("match: ")
    write(tmp_path / "job.toml", demo_text() + "\n# a comment changes the bytes\n")
    code, out, _ = run(["verify", pdf, job], capsys)
    assert code == 1 and out.startswith("mismatch: ")


def test_build_json_beside_the_pdf_equals_check_json(tmp_path, capsys):
    job = write(tmp_path / "job.toml", demo_text())
    code, out, _ = run(["build", job, "-o", str(tmp_path / "r.pdf"), "--json"], capsys)
    assert code in (0, 1) and "r.json" in out
    _, expected, _ = run(["check", "--json", job], capsys)
    assert (tmp_path / "r.json").read_text(encoding="utf-8") == expected


def test_build_since_marks_changed_rows_with_the_revision_letter(tmp_path, capsys):
    if shutil.which("git") is None:
        pytest.skip("git not installed")
    git(tmp_path, "init", "-q")
    job = write(tmp_path / "job.toml", demo_text())
    git(tmp_path, "add", "job.toml")
    git(tmp_path, "commit", "-q", "-m", "B")
    plain, marked = str(tmp_path / "plain.pdf"), str(tmp_path / "marked.pdf")
    write(
        tmp_path / "job.toml",
        edited(demo_text(), ('shear = "3.6 kip"', 'shear = "4.2 kip"'), ('revision = "B"', 'revision = "Q"')),
    )
    run(["build", job, "-o", plain], capsys)
    code, _, err = run(["build", job, "-o", marked, "--since", "HEAD"], capsys)
    assert code in (0, 1), err

    def q_marks(path):  # "Q" also appears in formulas, equally in both files; the marks add to it
        return sum(p.extract_text().split().count("Q") for p in pypdf.PdfReader(path).pages)

    assert q_marks(marked) > q_marks(plain)
    code, out, _ = run(["verify", marked, job], capsys)  # the marks are recomputed from git
    assert code == 0 and "since git revision HEAD" in out, out
    code, _, err = run(["build", job, "-o", str(tmp_path / "x.pdf"), "--since", "nope"], capsys)
    assert code == 2 and "git revision 'nope' not found" in err
    assert not (tmp_path / "x.pdf").exists()
