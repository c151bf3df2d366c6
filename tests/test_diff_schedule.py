"""Zoned connector schedules in ``calcreport diff`` and ``build --since`` (loads along the member).

The job is a copy of the pavilion ridge-beam demo (invented data) with its snow load raised from
175 plf to 210 plf. Facts used:
* q = V·Q/I (mechanics of materials): more load gives more shear V, so more shear flow q, so
  closer spacings and at least as many connectors N;
* N = 1 + Σ ceil(ℓᵢ/sᵢ), i.e. the zone rows add up to N (the schedule rule, common practice, no source);
* 1 ft = 12 in (NIST SP 811, 2008 ed., Appendix B.8) for positions in feet-inches;
* 1 kip = 1000 lbf, so "0.175 klf" is "175 plf" (NIST SP 811, 2008 ed., Appendix B.8 — from memory).
"""

from __future__ import annotations

import dataclasses
import json
import re
import shutil

import pypdf
import pytest
from review_helpers import ROOT, edited, git, run, write

from calcreport.review.diff import changed_keys, compute_diff
from calcreport.review.diff_schedule import diff_schedules, is_zone_step, zone_text
from calcreport.review.diff_text import check_titles, display_for
from calcreport.review.revisions import side_from_bytes

JOB = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"
SNOW = ('w = "175 plf"', 'w = "210 plf"')
JOINTS = ("top-webs", "bot-webs")


def _text() -> str:
    return JOB.read_text(encoding="utf-8")


def _side(text: str, label: str):
    return side_from_bytes(text.encode("utf-8"), label)


@pytest.fixture(scope="module")
def sides():
    return _side(_text(), "old.toml"), _side(edited(_text(), SNOW), "new.toml")


def _schedule(side, joint: str):
    return next(j for j in side.result.members[0].joints if j.id == joint).schedule


def _section(out: str, title: str) -> str:
    """The lines of one upper-case section of the diff text (up to the next blank line)."""
    if title not in out:
        return ""
    return out.split(title, 1)[1].split("\n\n", 1)[0]


def test_raised_snow_load_lists_old_and_new_schedule(tmp_path, capsys, sides):
    old_file, new_file = (
        write(tmp_path / "old.toml", _text()),
        write(tmp_path / "new.toml", edited(_text(), SNOW)),
    )
    code, out, err = run(["diff", old_file, new_file], capsys)
    assert code == 1, err
    results = _section(out, "RESULTS CHANGED")
    d = display_for(sides[1])
    for joint in JOINTS:
        a, b = _schedule(sides[0], joint), _schedule(sides[1], joint)
        assert b.count > a.count  # more load, more shear flow: more connectors (q = V·Q/I)
        assert sum(z.count for z in a.zones) == a.count and sum(z.count for z in b.zones) == b.count
        assert f"member RB1, joint {joint}: connector schedule changed (zones, N" in results
        block = results.split(f"joint {joint}: connector schedule changed", 1)[1]
        was, now = block.split("now:", 1)
        assert f"N = {a.count} rows" in was and f"N = {b.count} rows" in now.split("was:", 1)[0]
        for z in a.zones:
            assert zone_text(d, z) in was
        for z in b.zones:
            assert zone_text(d, z) in now
    # positions as drawings give them: 11'-3" is 135 in (1 ft = 12 in)
    first_end = _schedule(sides[1], "top-webs").zones[0].end.to("inch").magnitude
    feet, inches = divmod(int(first_end), 12)  # whole inches; a fraction (1/2") may follow
    shown = f"{feet}'-{inches}" if feet else f"{inches}"  # under a foot, drawings give inches only
    assert f'0" – {shown}' in results


def test_no_zone_step_is_compared_by_number_or_called_unchanged(tmp_path, capsys):
    old_file, new_file = (
        write(tmp_path / "old.toml", _text()),
        write(tmp_path / "new.toml", edited(_text(), SNOW)),
    )
    _, out, _ = run(["diff", old_file, new_file], capsys)
    assert ".schedule.zone." not in out and "Zone 2" not in out
    same = _section(out, "STEPS WITH CHANGED VALUES BUT THE SAME RESULT")
    assert "schedule" not in same and "zone" not in same.lower()
    _, out, _ = run(["diff", old_file, new_file, "--json"], capsys)
    data = json.loads(out)
    assert not any(is_zone_step(s["key"]) for s in data["steps"])
    assert not any(".schedule." in s["key"] and not s["result_changed"] for s in data["steps"])
    assert [s["owner"] for s in data["schedules"]] == [f"member.RB1.joint.{j}" for j in JOINTS]
    top = data["schedules"][0]
    assert top["new"]["count"] == sum(z["count"] for z in top["new"]["zones"])
    assert top["old"]["zones"][0]["start"] == {"unit": "in", "value": 0}


def test_check_groups_print_their_labels(tmp_path, capsys, sides):
    old_file, new_file = (
        write(tmp_path / "old.toml", _text()),
        write(tmp_path / "new.toml", edited(_text(), SNOW)),
    )
    _, out, _ = run(["diff", old_file, new_file], capsys)
    results = _section(out, "RESULTS CHANGED")
    assert "\n  Panel shear through the web thickness:\n" in results
    assert "\n  Deflection, load case S (span 1):\n" in results
    assert not re.search(r"^  (bending|deflection|shear)\.", results, re.M)
    titles = check_titles(compute_diff(*sides))
    assert titles["member[RB1].web_panel_shear"] == "Panel shear through the web thickness"
    # both joints have an end-distance check with the same label: the key tells them apart
    key = "member[RB1].joint[top-webs].connector.end"
    assert titles[key] == f"End distance from the member end ({key})"


def test_schedule_changed_in_zones_only_still_counts_as_a_changed_result(sides):
    """Two zones' common boundary moved; N, N_min and every step stay the same."""
    old = sides[0]
    m = old.result.members[0]
    j = m.joints[0]
    z1, z2 = j.schedule.zones[:2]
    step = z1.spacing  # move the boundary by one spacing of zone 1 (rows move from zone 2 to zone 1)
    moved = (
        dataclasses.replace(z1, end=z1.end + step, count=z1.count + 1),
        dataclasses.replace(z2, start=z2.start + step, count=z2.count - 1),
        *j.schedule.zones[2:],
    )
    sch = dataclasses.replace(j.schedule, zones=moved)
    joint = dataclasses.replace(j, schedule=sch)
    member = dataclasses.replace(m, joints=(joint, *m.joints[1:]))
    new = dataclasses.replace(old, result=dataclasses.replace(old.result, members=(member,)))
    diff = compute_diff(old, new)
    assert not diff.summary and not diff.steps
    assert diff.results_changed
    (c,) = diff.schedules
    assert c.changed == ("zones",) and c.new_zones == (1, 2)  # zones 3… are where they were
    keys = changed_keys(diff)
    assert f"member.RB1.joint.{j.id}.schedule" in keys
    assert {f"member.RB1.joint.{j.id}.schedule.zone.{k}" for k in (1, 2)} <= keys
    assert f"member.RB1.joint.{j.id}.schedule.zone.3" not in keys


def test_equivalent_load_rewrite_changes_no_schedule(tmp_path, capsys, sides):
    same = _side(edited(_text(), ('w = "175 plf"', 'w = "0.175 klf"')), "same.toml")
    assert diff_schedules(sides[0].result, same.result) == []
    diff = compute_diff(sides[0], same)
    assert not diff.results_changed and not any(".schedule" in k for k in changed_keys(diff))
    code, _, _ = run(
        [
            "diff",
            str(JOB),
            write(tmp_path / "same.toml", edited(_text(), ('w = "175 plf"', 'w = "0.175 klf"'))),
        ],
        capsys,
    )
    assert code == 0


def test_changed_keys_name_the_schedule(sides):
    keys = changed_keys(compute_diff(*sides))
    for joint in JOINTS:
        assert f"member.RB1.joint.{joint}.schedule" in keys
        assert f"member.RB1.joint.{joint}.schedule.zone.1" in keys  # zone 1 is not what it was


def test_build_since_marks_the_schedule_heading(tmp_path, capsys):
    if shutil.which("git") is None:
        pytest.skip("git not installed")
    git(tmp_path, "init", "-q")
    job = write(tmp_path / "job.toml", _text())
    git(tmp_path, "add", "job.toml")
    git(tmp_path, "commit", "-q", "-m", "A")
    write(tmp_path / "job.toml", edited(_text(), SNOW, ('revision = "A"', 'revision = "R"')))
    plain, marked = str(tmp_path / "plain.pdf"), str(tmp_path / "marked.pdf")
    code, _, err = run(["build", job, "-o", plain], capsys)
    assert code in (0, 1), err
    code, _, err = run(["build", job, "-o", marked, "--since", "HEAD"], capsys)
    assert code in (0, 1), err

    def text(path: str) -> str:
        return "\n".join(p.extract_text() for p in pypdf.PdfReader(path).pages)

    for joint in JOINTS:
        heading = re.compile(r"R\s*Connector schedule — joint " + joint)
        assert heading.search(text(marked)), joint
        assert not heading.search(text(plain))
