"""The change report PDF (``calcreport diff --pdf``): content, marks, metadata, reproducibility.

Values checked: 3.6 kip = 3,600 lbf and 4.2 kip = 4,200 lbf (kip = 1000 lbf, NIST SP 811, 2008 ed.,
Appendix B.8); the practical spacing 1.25 in is s = n·F/q rounded down to 1/4 in (common practice,
no source) as in tests/test_diff_cli.py.
"""

from __future__ import annotations

import pypdf
from review_helpers import DEMO, demo_text, edited, run, with_part, write

from calcreport.outputs.pdfmeta import KEY_BASE_SHA256, KEY_JOB_SHA256

MORE_SHEAR = ('shear = "3.6 kip"', 'shear = "4.2 kip"')


def _text(pdf: str) -> str:
    return "\n".join(p.extract_text() for p in pypdf.PdfReader(pdf).pages)


def test_change_pdf_contains_changed_values_and_marks(tmp_path, capsys):
    new = write(tmp_path / "new.toml", edited(demo_text(), MORE_SHEAR, ('revision = "B"', 'revision = "C"')))
    pdf = str(tmp_path / "changes.pdf")
    code, out, _ = run(["diff", str(DEMO), new, "--pdf", pdf], capsys)
    assert code == 1 and "Results changed." in out
    text = _text(pdf)
    for expected in (
        "Changes in revision C (from revision B)",
        "Results changed.",
        "3,600 lbf",
        "4,200 lbf",
        "1.578 in",  # required spacing, old → new (the practical one stays at s_min: NG)
        "1.353 in",
        "utilisation",
        "member[H1].shear",
        '"3.6 kip"',
        '"4.2 kip"',
        "member.H1.joint.top-webs.q",
        "Harbourside Community Boathouse",
        "HB-2026-014",
        "licensed professional engineer",
    ):
        assert expected in text, expected
    assert text.index("Results") < text.index("Derivation steps") < text.index("Inputs")
    # every changed row carries the revision letter in its triangle
    rows = 15 + 9 + 2  # summary rows, step rows and input rows of this edit (see the text diff)
    assert text.count("\nC\n") >= rows
    reader = pypdf.PdfReader(pdf)
    n = len(reader.pages)
    assert f"1 of {n}" in reader.pages[0].extract_text()
    meta = reader.metadata
    assert meta["/" + KEY_JOB_SHA256] != meta["/" + KEY_BASE_SHA256]


def test_change_pdf_lists_added_parts_and_is_reproducible(tmp_path, capsys):
    new = write(tmp_path / "new.toml", with_part(demo_text()))
    a, b = str(tmp_path / "a.pdf"), str(tmp_path / "b.pdf")
    run(["diff", str(DEMO), new, "--pdf", a], capsys)
    run(["diff", str(DEMO), new, "--pdf", b], capsys)
    assert open(a, "rb").read() == open(b, "rb").read()
    text = _text(a)
    assert "Added and removed" in text and "member[H1].part[cap]" in text
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.pdf", "b.pdf", "new.toml"]  # no temp files


def test_no_change_pdf_says_so(tmp_path, capsys):
    pdf = str(tmp_path / "same.pdf")
    code, _, _ = run(["diff", str(DEMO), str(DEMO), "--pdf", pdf], capsys)
    assert code == 0
    assert "No result changed." in _text(pdf)


def test_unwritable_pdf_path_exit_2_nothing_written(tmp_path, capsys):
    blocker = tmp_path / "a-file"
    blocker.write_text("not a folder", encoding="utf-8")
    target = blocker / "c.pdf"
    code, out, err = run(["diff", str(DEMO), str(DEMO), "--pdf", str(target)], capsys)
    assert code == 2 and out == "" and "cannot write the change report" in err and err.count("\n") == 1
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a-file"]
