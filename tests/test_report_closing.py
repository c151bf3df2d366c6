"""The closing part of a member's report and of the report: results, checks, not checked, assumed
values, sign-off, limitations — compact, and nothing a plan checker needs left out.

Read back with pypdf (an independent PDF reader) and compared with the solver's records and the
results JSON. What is checked here is layout practice (one row for joints whose checks print
alike, each limit stated once in its step, every assumed key and every caution printed): common
practice, no source. Unit systems: SI reports print lengths in mm (EN 1995-1-1 states its spacings
in mm), never inches — common practice, no source.
"""

from __future__ import annotations

import re
from pathlib import Path

import pytest

pypdf = pytest.importorskip("pypdf")

from calcreport.outputs.fmt import Display  # noqa: E402
from calcreport.outputs.json_out import to_dict  # noqa: E402
from calcreport.outputs.report.assumed import assumed_groups  # noqa: E402
from calcreport.outputs.report.common import Ctx  # noqa: E402
from calcreport.outputs.report.results_tables import folded_checks, step_numbers  # noqa: E402
from calcreport.outputs.report.signoff import CAUTIONS, NOT_CHECKED  # noqa: E402
from calcreport.outputs.report.styles import make_styles, register_fonts  # noqa: E402
from calcreport.outputs.report.template import load_template  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
JOBS = sorted((ROOT / "jobs").glob("*.toml"))
DOOR = ROOT / "jobs" / "boathouse-door-header.toml"
EC5 = ROOT / "jobs" / "boardwalk-nailed-tee-ec5.toml"


def squash(text: str) -> str:
    return re.sub(r"\s+", "", text)


@pytest.fixture(scope="module")
def built(demo_reports):
    """Every demo job: (result, page texts)."""
    return {stem: (result, pages) for stem, (result, _, pages) in demo_reports.items()}


def _ctx(result) -> Ctx:
    tpl = load_template(result.job.settings.template, result.job.path)
    st = make_styles(register_fonts(tpl.font, tpl.font_bold, tpl.font_mono), tpl.accent_color, tpl.font_size)
    return Ctx(result, Display(result.job.settings.units, result.job.settings.display), st, tpl, 500.0)


def _checks_text(pages: list[str]) -> str:
    """The text of the checks tables (from their header to the not-checked table)."""
    flat = "\n".join(pages)
    out = []
    for part in flat.split("Check (note; source)")[1:]:
        out.append(part.split("Not checked (", 1)[0])
    return "\n".join(out)


def test_identical_joints_share_their_check_rows(built):
    result, pages = built[DOOR.stem]
    m = result.members[0]
    groups = folded_checks(m, _ctx(result))
    assert [where for where, _ in groups] == [
        "Joints top-webs, bot-webs — the same checks, values and status at each",
        "Member",
    ]
    rows = groups[0][1]
    assert len(rows) == len(m.joints[0].checks) == len(m.joints[1].checks)
    for k, (check, steps) in enumerate(rows):  # one row stands for both joints' records, equal as printed
        other = m.joints[1].checks[k]
        assert (check.label, check.status, check.demand, check.capacity) == (
            other.label,
            other.status,
            other.demand,
            other.capacity,
        )
        assert len(steps) == (2 if check.step else 0)  # the step of each joint named
    text = squash(_checks_text(pages))
    assert squash("Joints top-webs, bot-webs") in text
    assert text.count(squash("Fastener length within the assembly it is driven into")) == 1
    assert text.count(squash("Points from opposite faces do not meet")) == 1


def test_a_joint_with_other_checks_keeps_its_own_rows(built):
    """The plate girder's two joints are welded differently: each has its own group of rows."""
    result, _ = built["pavilion-plate-girder"]
    where = [w for w, _ in folded_checks(result.members[0], _ctx(result))]
    assert where == ["Joint tf-web", "Joint bf-web", "Member"]


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_a_check_refers_to_a_step_that_is_printed(built, stem):
    """Check.step names a step of the member; the Step column prints the number that step carries
    in the derivation (the number stands at the start of the step's row, its label after it)."""
    result, pages = built[stem]
    flat = squash("".join(pages))
    ctx = _ctx(result)
    for m in result.members:
        keys = {s.key: s for s in m.steps}
        numbers = step_numbers(m, ctx)
        for j in m.joints:
            for c in j.checks:
                if not c.step:
                    continue
                assert c.step in keys, c.key
                # the numbers are the step's, formatted by the report; a rule ("15D") may stay
                assert not re.search(r"\d\s?(in|mm|lbf|psi|kip|N|kN|MPa)\b", c.note), c.note
                no = numbers[c.step]
                label = keys[c.step].label
                if squash(f"{no}{label}") not in flat:
                    # a folded joint's step is not printed: the joint it follows prints the step of
                    # the same last number and the same key below the joint
                    tail = c.step.split(f".joint.{j.id}.", 1)[1]
                    last = no.rsplit(".", 1)[1]
                    base = [
                        k
                        for k, n in numbers.items()
                        if n.rsplit(".", 1)[1] == last and k.endswith("." + tail) and k != c.step
                    ]
                    assert any(squash(f"{numbers[k]}{keys[k].label}") in flat for k in base), (c.key, no)
        assert all(re.fullmatch(r"\d+\.\d+\.\d+", n) for n in numbers.values())


def test_si_checks_print_no_inches(built):
    """The EC5 demo: the width across the contact rests on a4,c and a2 written as steps in mm; the
    checks table carries no inch value (the note used to print "e = 0.61 in")."""
    result, pages = built[EC5.stem]
    m = result.members[0]
    steps = {s.key.rsplit(".", 1)[1]: s for s in m.steps if ".connector.detail." in s.key}
    assert {"e_edge", "s_rows", "W_across"} <= set(steps)
    d = Display(result.job.settings.units, result.job.settings.display)
    assert "mm" in d.result(steps["W_across"]) and " in" not in d.substituted(steps["W_across"])
    # EN 1995-1-1 Table 8.2, nails d < 5 mm, ρk ≤ 420 kg/m³ without pre-drilling: a4,c = 5d, a2 = 5d
    assert steps["e_edge"].values["k"] == pytest.approx(5.0)
    assert steps["s_rows"].values["k"] == pytest.approx(5.0)
    edge = next(c for c in m.joints[0].checks if c.key.endswith(".edge"))
    assert edge.step == steps["W_across"].key and edge.note == ""
    text = _checks_text(pages)
    assert text and not re.search(r"\d\s?in\b", text)


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_every_assumed_key_is_on_the_assumed_pages(built, stem):
    """Grouped by owner, each key is its heading row and its name; the JSON keeps every record."""
    result, pages = built[stem]
    start = next(i for i, t in enumerate(pages) if "values assumed" in t or "None: the job states" in t)
    text = squash("".join(pages[start : start + 3]))
    records = list(result.assumed) + [a for m in result.members for a in m.assumed]
    listed = [row for _, _, rows in assumed_groups(_ctx(result)) for row in rows]
    # rows of several joints are one row naming the joints; every other record is one row
    joints = {re.sub(r"\.joint\[[^\]]+\]", ".joint[*]", a.key) for a in records}
    assert len(joints) <= len(listed) <= len(records)
    for owner, _table, rows in assumed_groups(_ctx(result)):
        assert squash(owner) in text, owner
        for name, *_ in rows:
            assert squash(name) in text, (owner, name)
    data = to_dict(result)
    in_json = [a["key"] for a in data["assumed"]] + [a["key"] for m in data["members"] for a in m["assumed"]]
    assert in_json == [a.key for a in records]
    for a in records:  # each key is written on the page: its owner, then its last name
        owner = re.sub(r"\.joint\[[^\]]+\]", "", a.key)
        assert squash(a.key.rsplit(".", 1)[-1]) in text, a.key
        assert squash(owner.split(".", 1)[0]) in text, a.key


def test_every_caution_and_limitation_is_printed(built):
    for stem in ("boathouse-door-header", "boardwalk-nailed-tee-ec5"):
        _, pages = built[stem]
        flat = squash("".join(pages))
        for text in (*CAUTIONS, *NOT_CHECKED):
            assert squash(text) in flat, text
        assert squash("Limitations and cautions") in flat and squash("This tool does not check:") in flat


def test_the_door_header_closing_sheets(built):
    """Results to the end of the limitations: three sheets counted from the one the results start
    on, results starting part-way down a sheet (four and a half whole sheets before this work, four
    before the closing lists were set in two columns); the sign-off is on the cover."""
    _, pages = built[DOOR.stem]
    first = next(i for i, t in enumerate(pages) if re.search(r"^Results$", t, re.M) and "Demand q" in t)
    last = max(i for i, t in enumerate(pages) if "This tool does not check:" in t or "fire resistance" in t)
    assert last - first + 1 <= 3
    assert "Checker's comments" in pages[0] and "Review and sign-off" in pages[0]


@pytest.mark.parametrize("stem", [j.stem for j in JOBS])
def test_the_signoff_is_on_the_cover_or_closes_the_calculation(built, stem):
    """Once, whole: on the cover under the contents when it fits there, else after the
    limitations, before any fabrication sheet (common practice, no source)."""
    _, pages = built[stem]
    where = [i for i, t in enumerate(pages) if "Checker's comments" in t]
    assert len(where) == 1
    (i,) = where
    assert "Review and sign-off" in pages[i] and "Prepared by" in pages[i] and "Approved by" in pages[i]
    calc = [
        k for k, t in enumerate(pages) if "Fabrication sheet — member" not in t.split("\n", 3)[0] + t[:400]
    ]
    limits = max(k for k, t in enumerate(pages) if "stability of the structure as a whole" in t)
    assert i == 0 or (i >= limits and i == max(calc)), (i, limits)
