"""The solver carries numbers as data; the outputs word them.

Rule under test: DEVELOPERS.md "The solver never formats; outputs never compute" — a check's label
is short and its note words only, no number formatted in the solver; a label or note that needs a
number carries a :class:`~calcreport.steps.Phrase` that the report, the JSON and the terminal table
word in the job's units. The practice minimum of fastening plies (two rows of 16d common at 12 in for
nailed plies, two rows of bolts at 24 in staggered for bolted plies) is common practice, no source;
the AISC 360-16 Table J3.4 edge distance of a 3/4 in bolt (1 in) is from memory.
"""

from __future__ import annotations

import dataclasses
import re
from pathlib import Path

import pytest
from conn_fixtures import context, rect, run, steel, step

from calcreport.outputs.fmt import Display
from calcreport.outputs.json_out import to_dict
from calcreport.outputs.phrases import KINDS, check_label, check_note, step_note
from calcreport.outputs.table import render_job
from calcreport.pipeline import solve_file
from calcreport.solve.results import Check
from calcreport.steps import Phrase, Step
from calcreport.units import Q_

JOBS = Path(__file__).resolve().parent.parent / "jobs"
#: a number as the solver's f-strings used to write it, followed by a unit ("0.75 in", "9.00 in")
FORMATTED = re.compile(r"\d\s*(in|ft|lbf|kip|psi|ksi|mm|m|kN|N|plf|klf)\b")
#: a decimal number followed by a unit: what `:g`, `:.3g` or `:.3f` leave in a text
DECIMAL = re.compile(r"\d\.\d+\s*(in|ft|lbf|kip|psi|ksi|mm|m|kN|N|plf|klf)\b")


def _records(o, seen: set[int] | None = None):
    """Every step and check reachable from a result (members, joints, capacities, schedules)."""
    seen = set() if seen is None else seen
    if id(o) in seen:
        return
    seen.add(id(o))
    if isinstance(o, (Step, Check)):
        yield o
    elif isinstance(o, (list, tuple)):
        for x in o:
            yield from _records(x, seen)
    elif isinstance(o, dict):
        for x in o.values():
            yield from _records(x, seen)
    elif dataclasses.is_dataclass(o) and not isinstance(o, type):
        for f in dataclasses.fields(o):
            yield from _records(getattr(o, f.name), seen)


@pytest.fixture(scope="module")
def solved():
    return {p.stem: solve_file(str(p)) for p in sorted(JOBS.glob("*.toml"))}


def _ply_minimum(result) -> Check:
    return next(c for m in result.members for c in m.checks if c.key.endswith(".ply_minimum"))


def test_no_decimal_number_with_a_unit_in_any_solver_label_or_note(solved):
    # every demo job: labels and notes hold words; a number with a unit lives in values or a phrase
    bad = [
        (name, r.key, text)
        for name, result in solved.items()
        for r in _records(result)
        for text in (r.label, r.note)
        if DECIMAL.search(text)
    ]
    assert bad == []


def test_phrased_fields_hold_no_number_and_every_kind_is_worded(solved):
    phrased = [r for result in solved.values() for r in _records(result) if r.phrase is not None]
    assert {r.phrase.kind for r in phrased} >= {"ply_minimum", "rows_within"}
    for r in phrased:
        assert r.phrase.kind in KINDS
        assert not FORMATTED.search(r.label) and not FORMATTED.search(r.note), r.key


def test_practice_minimum_of_bolted_plies_worded_by_the_outputs(solved):
    # boardwalk-flitch-beam: bolted plies → two rows of bolts at 24 in, staggered (common practice)
    result = solved["boardwalk-flitch-beam"]
    c = _ply_minimum(result)
    assert c.label == "Minimum fastening of plies" and c.note == ""
    assert c.phrase.values["fastener"] == "bolt"
    assert c.phrase.values["spacing_max"].to("inch").magnitude == pytest.approx(24.0)
    us = Display("US")
    assert check_label(c, us) == "Minimum fastening of plies (two rows of bolts at 24 in, staggered)"
    note = check_note(c, us)
    assert note.startswith("provided: ") and note.endswith("(a practice rule, not the design result)")
    rows, s = c.phrase.values["rows"], c.phrase.values["spacing"]
    assert f"{rows} rows, largest spacing {s.to('inch').magnitude:g} in" in note
    # SI: the same data in millimetres (24 in = 609.6 mm exactly, kept to 0.1 mm on the shop side)
    assert check_label(c, Display("SI")).endswith("(two rows of bolts at 609.6 mm, staggered)")
    # the terminal table and the JSON word it the same way
    assert "Minimum fastening of plies (two rows of bolts at 24 in, staggered)" in render_job(result)
    js = next(x for m in to_dict(result)["members"] for x in m["checks"] if x["key"] == c.key)
    assert js["label"] == check_label(c, us) and js["note"] == note
    assert js["phrase"]["kind"] == "ply_minimum"
    assert js["phrase"]["values"]["spacing_max"] == {"value": 24, "unit": "in"}


def test_practice_minimum_of_nailed_plies(solved):
    c = _ply_minimum(solved["boathouse-mezzanine-3-ply"])
    assert c.phrase.values["fastener"] == "nail"
    assert (
        check_label(c, Display("US"))
        == "Minimum fastening of plies (two rows of 16d common at 12 in, or equal)"
    )


def test_practice_minimum_without_a_schedule():
    c = Check("member[X].ply_minimum", "Minimum fastening of plies", None, None, None, "INFO")
    c = dataclasses.replace(
        c,
        phrase=Phrase(
            "ply_minimum",
            {
                "fastener": "nail",
                "rows_min": 2,
                "spacing_max": Q_(12.0, "inch"),
                "rows": 0,
                "spacing": "",
                "meets": False,
            },
        ),
    )
    assert check_note(c, Display()) == (
        "provided: no schedule; below the practice minimum in rows or spacing (a practice rule, not the design result)"
    )


def test_report_words_the_practice_minimum(demo_reports):
    _result, _pdf, pages = demo_reports["boardwalk-flitch-beam"]
    text = " ".join(" ".join(pages).split())
    assert "Minimum fastening of plies (two rows of bolts at 24 in, staggered)" in text
    assert (
        "meets the rows and spacing of the practice minimum" in text or "below the practice minimum" in text
    )


def test_steel_bolt_edge_distance_note_is_worded_from_the_diameter():
    # AISC 360-16 Table J3.4: a 3/4 in bolt needs 1 in (from memory); the note names the diameter
    top = rect("t", 0, 0.5, 8.0, 1.0, steel())
    bot = rect("b", 0, 0, 8.0, 0.5, steel())
    _cap, log = run(
        "steel_bolt", {"diameter": Q_(0.75, "in")}, dataclasses.replace(context([top], [bot]), per_row=2)
    )
    s = step(log, "e_min")
    assert s.note == "" and s.phrase is not None and s.phrase.kind == "bolt_edge_row"
    assert s.phrase.values["d"].to("inch").magnitude == pytest.approx(0.75)
    assert step_note(s, Display("US")) == (
        "bolt diameter 3/4 in (the next larger tabulated diameter between rows of the table)"
    )
    assert step_note(s, Display("SI")).startswith("bolt diameter 19 mm ")  # 0.75 in = 19.05 mm


def test_rows_within_a_stretch_worded_with_the_spacing(solved):
    checks = [
        r
        for r in _records(solved["boardwalk-flitch-beam"])
        if isinstance(r, Check) and r.phrase is not None and r.phrase.kind == "rows_within"
    ]
    assert checks
    for c in checks:
        s = c.phrase.values["s"].to("inch").magnitude
        assert check_note(c, Display()) == f"⌊{c.phrase.values['symbol']} / s⌋ with s = {s:g} in"


def test_cover_plate_weld_note_worded_from_the_lengths():
    # AISC 360-16 §F13.3, Eq. F13-6 (from memory): end weld smaller than 3/4·t → a′ = 1.5·w; an
    # 8 in plate with two edge lines has 2 × 1.5 × 8 = 24 in of edge weld within a′
    from test_rolled_shapes import COVER

    from calcreport.jobfile import load_text
    from calcreport.solve import solve_job

    m = solve_job(load_text(COVER.format(end="cover_plate_end_weld = true").encode())).members[0]
    r = next(s for s in m.steps if s.key.endswith(".plate.cp.R"))
    assert r.note == "" and r.phrase is not None and r.phrase.kind == "cover_plate_weld"
    assert r.phrase.values["length"].to("inch").magnitude == pytest.approx(24.0)
    assert step_note(r, Display("US")) == "2 edge weld line(s) over a′ = 1.5·w (24 in of edge weld)"


def test_dimensionless_figures_in_notes_are_worded_by_the_outputs(solved):
    # EN 1995-1-1:2004 Table 3.1 (from memory): k_mod = 0.9 for solid timber, service class 1 or 2,
    # short-term action — the demo's governing combination; the solver's note keeps words only
    m = solved["boardwalk-nailed-tee-ec5"].members[0]
    shear = next(c for c in m.checks if c.key.endswith(".shear.neutral_axis"))
    assert shear.note == "" and "k_mod" not in shear.note
    assert check_note(shear, Display("SI")).endswith(", k_mod = 0.9")
    bending = next(c for c in m.checks if c.key.startswith(f"member[{m.id}].bending"))
    assert bending.phrase is not None and bending.note == "instability (§6.3) not included"
    assert check_note(bending, Display("SI")).endswith(", k_mod = 0.9; instability (§6.3) not included")
    # AISC 360-16 §F13.2 (from memory): 0.1 ≤ Iyc/Iy ≤ 0.9; the ratio outside it is worded here
    c = Check("member[G].girder.proportions", "Proportioning limits", 1.0, 1.0, 1.0, "NG",
              phrase=Phrase("iyc_ratio", {"ratio": 0.05}))  # fmt: skip
    assert check_note(c, Display()) == "Iyc/Iy = 0.050 outside 0.1 to 0.9"
