"""Revision marks for the build report: the keys that changed between two revisions.

Facts used: 1 ft = 12 in (NIST SP 811, 2008 ed., Appendix B.8), so that rewrite marks nothing;
q = V·Q/I (mechanics of materials), so a new shear V changes q but not Q or I.
"""

from __future__ import annotations

import shutil

import pytest
from review_helpers import DEMO, demo_text, edited, git, with_part, write

from calcreport.review.diff import changed_keys, compute_diff
from calcreport.review.revisions import revision_marks, revision_marks_since, side_from_bytes, side_from_file


def _side(text: str, label: str = "new.toml"):
    return side_from_bytes(text.encode("utf-8"), label)


def test_shear_change_marks_its_steps_and_input():
    old = side_from_file(str(DEMO))
    new = _side(
        edited(demo_text(), ('shear = "3.6 kip"', 'shear = "4.2 kip"'), ('revision = "B"', 'revision = "C"'))
    )
    marks = revision_marks(old, new)
    assert marks.mark == "C"
    keys = marks.changed_keys
    assert {
        "member[H1].shear",
        "job.revision",
        "member.H1.shear.V",
        "member.H1.joint.top-webs.q",
        "member.H1.joint.top-webs.s_req",
        "member.H1.joint.top-webs",
        "member.H1",
    } <= keys
    # Q and I do not depend on V (q = V·Q/I): not marked
    assert "member.H1.joint.top-webs.Q" not in keys and "member.H1.section.I" not in keys


def test_equivalent_rewrite_marks_nothing():
    old = side_from_file(str(DEMO))
    new = _side(edited(demo_text(), ('spacing_max = "6 in"', 'spacing_max = "0.5 ft"')))
    assert changed_keys(compute_diff(old, new)) == frozenset()


def test_added_part_is_marked_with_its_steps():
    old = side_from_file(str(DEMO))
    keys = changed_keys(compute_diff(old, _side(with_part(demo_text()))))
    assert "member[H1].part[cap]" in keys and "member.H1.section.part.cap.A" in keys
    assert "member.H1.section.I" in keys


def test_revision_marks_since_git_revision(tmp_path):
    if shutil.which("git") is None:
        pytest.skip("git not installed")
    git(tmp_path, "init", "-q")
    job = tmp_path / "job.toml"
    write(job, demo_text())
    git(tmp_path, "add", "job.toml")
    git(tmp_path, "commit", "-q", "-m", "B")
    assert revision_marks_since(str(job), "HEAD").changed_keys == frozenset()
    write(job, edited(demo_text(), ("per_row = 2", "per_row = 3")))
    marks = revision_marks_since(str(job), "HEAD")
    assert "member[H1].joint[top-webs].per_row" in marks.changed_keys
    assert "member.H1.joint.top-webs.nF" in marks.changed_keys
    # the already solved result may be passed in (and must match the file's bytes)
    new = side_from_file(str(job))
    assert revision_marks_since(str(job), "HEAD", new.result) == marks
