"""Staggered rows drawn: a joint whose fasteners are driven from opposite faces with
``staggered = true`` (the box beams' webs into a flange) and a ply fastening with
``[member.ply_fastening] staggered = true`` (three plies nailed from both faces) show the offset
rows on the fabrication elevation and the section detail, and the callout says "staggered".

External references: the row positions are recomputed here from the schedule's zones by the rule
the schedule states (one row at x = 0, then ceil(ℓᵢ/sᵢ) rows per zone at its spacing, the last at
the zone's end); staggering the rows from the two faces by half the spacing, so that the points do
not meet, is common practice, no source. The job files give which joints are staggered.
"""

from __future__ import annotations

import io
import math
import re

import pypdf
import pytest
from reportlab.graphics.shapes import Line

from calcreport.outputs.callouts import joint_callout_text, shop_length
from calcreport.outputs.fabrication import shop_position
from calcreport.outputs.fabrication_draw import ROW_INK, elevation
from calcreport.outputs.report.build import render_pdf
from calcreport.pipeline import solve_file
from tests.conftest import ROOT

RIDGE = ROOT / "jobs" / "pavilion-ridge-box-beam.toml"
HEADER = ROOT / "jobs" / "boathouse-door-header.toml"
PLIES = ROOT / "jobs" / "boathouse-mezzanine-3-ply.toml"
GIRDER = ROOT / "jobs" / "pavilion-plate-girder.toml"


def _expected_rows(zones) -> list[float]:
    """Independent of calcreport.solve.callout: N = 1 + Σ ceil(ℓ/s), row at x = 0 first."""
    xs = [0.0]
    for z in zones:
        a, b, s = (float(q.to("inch").magnitude) for q in (z.start, z.end, z.spacing))
        n = math.ceil((b - a) / s - 1e-9)
        xs += [min(a + k * s, b) for k in range(1, n + 1)]
    return xs


@pytest.fixture(scope="module")
def solved():
    return {p: solve_file(str(p)) for p in (RIDGE, HEADER, PLIES, GIRDER)}


def test_staggered_rows_follow_the_schedule(solved):
    for j in solved[RIDGE].members[0].joints:
        c = j.callout
        assert c.staggered and c.offset_planes == (1,)  # web_e: the second face
        rows = _expected_rows(j.schedule.zones)
        assert len(rows) == j.schedule.count
        assert c.rows_at == pytest.approx(rows)
        mid = [(a + b) / 2 for a, b in zip(rows, rows[1:])]
        assert c.offset_at == pytest.approx(mid)
        # every offset row sits half the local spacing from its neighbours
        for x, a, b in zip(c.offset_at, rows, rows[1:]):
            assert x - a == pytest.approx((b - a) / 2) and b - x == pytest.approx((b - a) / 2)
        # counts: 2 nails per row from web_w at every row, 2 from web_e at every offset row
        assert c.pieces_total == 2 * len(rows) + 2 * (len(rows) - 1)
        assert sum(z.rows_offset for z in c.zones) == len(rows) - 1
        assert [z.rows for z in c.zones] == [z.count for z in j.schedule.zones]


def test_a_ply_line_staggered_against_the_other(solved):
    first, second = solved[PLIES].members[0].joints
    assert first.callout.staggered and not first.callout.offset_planes
    assert first.callout.stagger_with == second.id and second.callout.stagger_with == first.id
    rows = _expected_rows(second.schedule.zones)
    assert second.callout.offset_at == pytest.approx([(a + b) / 2 for a, b in zip(rows, rows[1:])])
    assert second.callout.rows_total == len(rows) - 1  # no row at x = 0
    assert second.callout.pieces_total == 2 * (len(rows) - 1)  # rows = 2 in the job
    # the job: both lines at the same schedule, so the offset rows fall midway between the first's
    assert first.callout.rows_at == pytest.approx(rows)
    assert set(first.callout.rows_at).isdisjoint(second.callout.offset_at)


def _row_lines(dr) -> tuple[list[float], list[float]]:
    solid, dashed = [], []
    for e in dr.contents:
        if isinstance(e, Line) and e.strokeColor == ROW_INK and e.x1 == e.x2:
            (dashed if e.strokeDashArray else solid).append(e.x1)
    return sorted(solid), sorted(dashed)


def test_elevation_draws_the_rows_where_the_schedule_puts_them(solved):
    r = solved[RIDGE]
    m = r.members[0]
    j = m.joints[0]
    width = 500.0
    dr = elevation(j, m.member, lambda q: shop_position(q), lambda q: shop_length(q), "Helvetica",
                   "Helvetica-Bold", width)  # fmt: skip
    L = float(j.schedule.length.to("inch").magnitude)
    sx = (width - 60.0) / L  # 30 pt margins each side (the drawing's layout)
    rows = _expected_rows(j.schedule.zones)
    solid, dashed = _row_lines(dr)
    assert solid == pytest.approx([30.0 + x * sx for x in rows])
    assert dashed == pytest.approx([30.0 + (a + b) / 2 * sx for a, b in zip(rows, rows[1:])])
    # a joint that is not staggered draws no dashed rows
    g = solved[GIRDER].members[0]
    for gj in g.joints:
        d2 = elevation(gj, g.member, shop_position, shop_length, "Helvetica", "Helvetica-Bold", width)
        if d2 is not None:
            assert _row_lines(d2)[1] == []


def test_callouts_say_staggered(solved):
    for path in (RIDGE, HEADER, PLIES):
        r = solved[path]
        pages = [p.extract_text() or "" for p in pypdf.PdfReader(io.BytesIO(render_pdf(r))).pages]
        detail = re.sub(r"\s+", "", next(t for t in pages if "to scale" in t and "Section of" in t))
        first = next(i for i, t in enumerate(pages) if i and "Fabrication sheet — member" in t)
        fab = re.sub(r"\s+", "", "\n".join(pages[first:]))  # the sheets run to the end
        for j in r.members[0].joints:
            text = joint_callout_text(j.callout, r.job.settings.units)
            assert "staggered" in text, (path.name, j.id, text)
            assert re.sub(r"\s+", "", text) in detail and re.sub(r"\s+", "", text) in fab
        assert "Staggered:" in fab
    for j in solved[GIRDER].members[0].joints:
        assert "staggered" not in joint_callout_text(j.callout)


class _Z:
    """A zone as the schedule gives it (start, end, spacing)."""

    def __init__(self, a: float, b: float, s: float):
        from calcreport.units import Q_

        self.start, self.end, self.spacing = Q_(a, "inch"), Q_(b, "inch"), Q_(s, "inch")


def test_midway_within_the_other_lines_rows_by_hand():
    from calcreport.solve.callout import midway_within

    # the other line at 12 in over 120 in, this line allowed 12 in: every midpoint, 6 … 114 in
    ref = tuple(12.0 * k for k in range(11))
    assert midway_within(ref, [_Z(0, 120, 12)]) == pytest.approx([6.0 + 12 * k for k in range(10)])
    # the other line at 7.75 in (rows 0, 7.75, …, 116.25, 120), this line allowed 12 in: by hand the
    # fewest midpoints keeping every gap ≤ 12 in are 11.625 + 7.75·k, k = 0 … 13 (120 − 112.375 ≤ 12)
    ref = tuple(7.75 * k for k in range(16)) + (120.0,)
    got = midway_within(ref, [_Z(0, 120, 12)])
    assert got == pytest.approx([11.625 + 7.75 * k for k in range(14)])
    # the other line sparser than this line needs somewhere: no placement midway between its rows
    assert midway_within(tuple(12.0 * k for k in range(11)), [_Z(0, 60, 12), _Z(60, 120, 5)]) is None


def test_the_denser_ply_line_keeps_its_rows_and_the_other_goes_midway():
    import sys

    from calcreport.pipeline import solve_bytes

    sys.path.insert(0, str(ROOT / "tests"))
    from ply_jobs import three_ply_side

    # loads entering the right face: the line from that face (p3-p2) carries more and is denser
    text = three_ply_side("150 plf", "500 plf").replace('"left_face"', '"right_face"')
    a, b = solve_bytes(text.encode(), "j.toml").members[0].joints
    sa, sb = (float(j.schedule.zones[0].spacing.to("inch").magnitude) for j in (a, b))
    assert sb < sa  # the premise: p3-p2 is the denser line
    assert b.callout.stagger_met and not b.callout.offset_planes  # keeps its rows
    rows = _expected_rows(b.schedule.zones)
    mids = {round((x + y) / 2, 6) for x, y in zip(rows, rows[1:])}
    got = a.callout.offset_at
    assert {round(x, 6) for x in got} <= mids  # every row of p1-p2 midway between two of p3-p2
    gaps = (
        [got[0]]
        + [y - x for x, y in zip(got, got[1:])]
        + [float(a.schedule.length.to("inch").magnitude) - got[-1]]
    )
    assert max(gaps) <= sa + 1e-9  # and p1-p2's own schedule still met
    assert a.callout.rows_total == len(got) and a.callout.pieces_total == 2 * len(got)
    assert "midway between the rows of p3-p2" in joint_callout_text(a.callout)


def test_lines_each_denser_somewhere_are_not_shown_clear(solved):
    # Two ply lines whose schedules cross over (one denser in each half) cannot be placed midway
    # between each other's rows; the second keeps rows midway between its own, which here fall on
    # rows of the first (6 in, 18 in … by hand): the check of the points from both faces goes NG.
    from dataclasses import replace

    from calcreport.solve.callout import ShopZone
    from calcreport.solve.plies_solve import _staggered_lines
    from calcreport.units import Q_

    def zones(s1: float, s2: float) -> tuple:
        q = lambda v: Q_(v, "inch")  # noqa: E731
        return (ShopZone(q(0), q(66), q(66), q(s1), 1, 2), ShopZone(q(66), q(132), q(66), q(s2), 1, 2))

    a, b = solved[PLIES].members[0].joints

    def plain(j, z):
        c = replace(j.callout, staggered=False, offset_planes=(), offset_at=(), zones=z)
        return replace(j, callout=replace(c, rows_at=tuple(_expected_rows(z))))

    a2, b2 = _staggered_lines((plain(a, zones(6, 12)), plain(b, zones(12, 6))), True)
    assert not a2.callout.stagger_met and not b2.callout.stagger_met
    assert 6.0 in b2.callout.offset_at and 6.0 in a2.callout.rows_at
    faces = next(c for c in b2.checks if c.key.endswith(".faces"))
    assert faces.status == "NG" and "place them clear" in faces.note and b2.status == "NG"
    assert "not shown clear" in stagger_note_of(b2)


def stagger_note_of(j) -> str:
    from calcreport.outputs.callouts import stagger_note

    return stagger_note(j.callout)
