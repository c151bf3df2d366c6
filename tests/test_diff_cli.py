"""``calcreport diff``: exit codes, results before inputs, new job's units, JSON, git revisions.

Checks against outside facts:
* unit-equivalent rewrites are no change: 1 ft = 12 in, 1 ksi = 1000 psi (NIST SP 811, 2008 ed.,
  Appendix B.8);
* shear flow is linear in the shear, q = V·Q/I (mechanics of materials, shear flow in built-up
  beams), so raising V from 3.6 kip to 4.2 kip scales q by 4.2/3.6 with Q and I unchanged;
* required spacing s = n·F/q (equilibrium of one connector row) and the practical spacing is rounded
  DOWN to the 1/4 in increment (common practice, no source).
"""

from __future__ import annotations

import json
import math
import shutil

import pytest
from review_helpers import DEMO, demo_text, edited, git, run, with_part, without_bottom_joint, write

EQUIVALENT = (
    ('spacing_max = "6 in"', 'spacing_max = "0.5 ft"'),  # NIST SP 811 App. B.8
    ('E = "1600 ksi"', 'E = "1.6e6 psi"'),  # NIST SP 811 App. B.8
    ('depth = "18 in"', 'depth = "1.5 ft"'),
    ('value = "118 lbf"', 'value = "0.118 kip"'),
)
MORE_SHEAR = ('shear = "3.6 kip"', 'shear = "4.2 kip"')


def test_unit_equivalent_edits_are_no_change_exit_0(tmp_path, capsys):
    new = write(
        tmp_path / "new.toml", edited(demo_text(), *EQUIVALENT, ("# Harbourside", "# Edited: Harbourside"))
    )
    code, out, err = run(["diff", str(DEMO), new], capsys)
    assert code == 0, err
    assert "RESULTS CHANGED" not in out and "INPUTS CHANGED" not in out
    assert out.rstrip().endswith("No change.")
    code, out, _ = run(["diff", str(DEMO), new, "--json"], capsys)
    data = json.loads(out)
    assert code == 0
    assert (data["results_changed"], data["inputs_changed"]) == (False, False)
    assert data["results"] == data["steps"] == data["inputs"] == data["added"] == data["removed"] == []
    assert data["old"]["sha256"] != data["new"]["sha256"]  # the bytes did change (comments, spelling)


def test_text_only_edit_is_an_input_change_exit_0(tmp_path, capsys):
    new = write(
        tmp_path / "new.toml", edited(demo_text(), ('title = "Door header H1"', 'title = "Header H1"'))
    )
    code, out, _ = run(["diff", str(DEMO), new], capsys)
    assert code == 0
    assert 'member[H1].title: "Door header H1" → "Header H1"' in out
    assert "RESULTS CHANGED" not in out


def test_more_shear_changes_results_exit_1(tmp_path, capsys):
    new = write(tmp_path / "new.toml", edited(demo_text(), MORE_SHEAR, ('revision = "B"', 'revision = "C"')))
    code, out, _ = run(["diff", str(DEMO), new], capsys)
    assert code == 1
    assert out.index("RESULTS CHANGED") < out.index("INPUTS CHANGED")
    assert "design shear V  3,600 lbf → 4,200 lbf" in out
    # s_req = 1.353 in is below spacing_min = 1.5 in: the joint is NG at the closest spacing it can
    # be placed at (1.5 in), so the practical spacing stays and the utilisation shows the overstress.
    assert "utilisation       0.95 → 1.1" in out
    assert 'member[H1].shear: "3.6 kip" → "4.2 kip"' in out
    assert out.rstrip().endswith("Results changed.")

    code, out, _ = run(["diff", str(DEMO), new, "--json"], capsys)
    data = json.loads(out)
    assert code == 1 and data["results_changed"] is True
    by = {(r["owner"], r["field"]): r for r in data["results"]}
    q = by[("member.H1.joint.top-webs", "shear_flow")]
    assert q["new"]["unit"] == "lbf/in"
    assert math.isclose(q["new"]["value"] / q["old"]["value"], 4.2 / 3.6, rel_tol=1e-5)  # q = V·Q/I
    s_req = by[("member.H1.joint.top-webs", "spacing_required")]["new"]["value"]
    assert math.isclose(s_req, 2 * 118.0 / q["new"]["value"], rel_tol=1e-5)  # s = n·F/q
    assert math.floor(s_req / 0.25) * 0.25 == 1.25 < 1.5  # rounded down to 1/4 in: below s_min
    util = by[("member.H1.joint.top-webs", "utilisation")]["new"]
    assert math.isclose(util, q["new"]["value"] * 1.5 / (2 * 118.0), rel_tol=1e-3)  # q·s_min/(n·F)
    steps = {st["key"]: st for st in data["steps"]}
    assert steps["member.H1.shear.V"]["new"]["result"] == {"unit": "lbf", "value": 4200.0}
    assert steps["member.H1.joint.top-webs.q"]["result_changed"] is True
    assert {"key": "member[H1].shear", "old": "3.6 kip", "new": "4.2 kip"} in data["inputs"]
    assert data["new"]["revision"] == "C" and data["old"]["revision"] == "B"


def test_values_shown_in_the_new_jobs_units(tmp_path, capsys):
    si = edited(
        demo_text(),
        ('units = "US"', 'units = "SI"'),
        ('spacing_step = "1/4 in"', 'spacing_step = "5 mm"'),
        MORE_SHEAR,
    )
    new = write(tmp_path / "si.toml", si)
    code, out, _ = run(["diff", str(DEMO), new], capsys)
    assert code == 1
    # 3.6 kip = 16.01 kN and 4.2 kip = 18.68 kN (1 lbf = 4.448222 N, NIST SP 811 App. B.8)
    assert "design shear V  16.01 kN → 18.68 kN" in out
    assert "lbf" not in out.split("INPUTS CHANGED")[0]


def test_added_part_and_removed_joint(tmp_path, capsys):
    added = write(tmp_path / "added.toml", with_part(demo_text()))
    code, out, _ = run(["diff", str(DEMO), added, "--json"], capsys)
    data = json.loads(out)
    assert code == 1  # a new part changes the section
    assert data["added"] == [{"id": "cap", "key": "member[H1].part[cap]", "kind": "part"}]
    assert {(r["owner"], r["field"]) for r in data["results"]} >= {("member.H1", "section.inertia")}

    fewer = write(tmp_path / "fewer.toml", without_bottom_joint(demo_text()))
    code, out, _ = run(["diff", str(DEMO), fewer], capsys)
    assert code == 1
    assert "member H1, joint bot-webs: joint removed (was OK)" in out
    assert "REMOVED\n  joint bot-webs  (member[H1].joint[bot-webs])" in out
    code, out, _ = run(["diff", fewer, str(DEMO), "--json"], capsys)
    data = json.loads(out)
    assert data["added"] == [{"id": "bot-webs", "key": "member[H1].joint[bot-webs]", "kind": "joint"}]
    assert {
        "owner": "member.H1.joint.bot-webs",
        "owner_title": "member H1, joint bot-webs",
        "field": "status",
        "label": "joint",
        "kind": "added",
        "old": None,
        "new": "OK",
    } in data["results"]


def test_invalid_input_exit_2_one_line(tmp_path, capsys):
    bad = write(tmp_path / "bad.toml", edited(demo_text(), MORE_SHEAR[:1] + ('shear = "4.2 kips per foot"',)))
    code, out, err = run(["diff", str(DEMO), bad], capsys)
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and "bad.toml" in err and "member[H1].shear" in err
    code, _, err = run(["diff", str(DEMO), str(tmp_path / "missing.toml")], capsys)
    assert code == 2 and "missing.toml" in err and err.count("\n") == 1


@pytest.mark.parametrize(
    "argv",
    [
        ["diff", "a.toml"],
        ["diff", "a.toml", "b.toml", "c.toml"],
        ["diff", "a.toml", "b.toml", "--since", "HEAD"],
    ],
)
def test_usage_errors_exit_2(argv, capsys):
    code, out, err = run(argv, capsys)
    assert code == 2 and out == "" and err.count("\n") == 1


@pytest.fixture
def repo(tmp_path):
    if shutil.which("git") is None:
        pytest.skip("git not installed")
    git(tmp_path, "init", "-q")
    (tmp_path / "jobs").mkdir()
    job = tmp_path / "jobs" / "header.toml"
    write(job, demo_text())
    git(tmp_path, "add", "jobs/header.toml")
    git(tmp_path, "commit", "-q", "-m", "issue revision B")
    return tmp_path, job


def test_since_head_in_a_git_repository(repo, capsys, monkeypatch):
    root, job = repo
    write(job, edited(demo_text(), MORE_SHEAR))
    code, out, _ = run(["diff", str(job), "--since", "HEAD"], capsys)
    assert code == 1
    assert "HEAD:jobs/header.toml → " in out
    # s_req = 1.353 in is below spacing_min = 1.5 in: the joint is NG at the closest spacing it can
    # be placed at (1.5 in), so the practical spacing stays and the utilisation shows the overstress.
    assert "utilisation       0.95 → 1.1" in out
    monkeypatch.chdir(root / "jobs")  # a relative path from a sub-folder works too
    code, out, _ = run(["diff", "header.toml", "--since", "HEAD", "--json"], capsys)
    assert code == 1 and json.loads(out)["old"]["label"] == "HEAD:jobs/header.toml"


def test_since_unchanged_file_exit_0(repo, capsys):
    _, job = repo
    code, out, _ = run(["diff", str(job), "--since", "HEAD"], capsys)
    assert code == 0 and out.rstrip().endswith("No change.")


def test_since_errors_exit_2(repo, tmp_path_factory, capsys):
    root, job = repo
    code, _, err = run(["diff", str(job), "--since", "no-such-rev"], capsys)
    assert code == 2 and "git revision 'no-such-rev' not found" in err and err.count("\n") == 1
    other = write(root / "jobs" / "new.toml", demo_text())  # never committed
    code, _, err = run(["diff", other, "--since", "HEAD"], capsys)
    assert code == 2 and "jobs/new.toml does not exist at git revision 'HEAD'" in err
    outside = tmp_path_factory.mktemp("plain")
    loose = write(outside / "job.toml", demo_text())
    code, _, err = run(["diff", loose, "--since", "HEAD"], capsys)
    assert code == 2 and "not inside a git repository" in err and err.count("\n") == 1


def test_since_old_revision_invalid_exit_2(repo, capsys):
    root, job = repo
    write(job, demo_text().replace('shear = "3.6 kip"', 'shear = "lots"'))
    git(root, "commit", "-q", "-am", "broken")
    write(job, demo_text())
    code, _, err = run(["diff", str(job), "--since", "HEAD"], capsys)
    assert code == 2 and err.startswith("HEAD:jobs/header.toml:") and "member[H1].shear" in err
