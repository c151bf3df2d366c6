"""Fastener fit and detailing across the contact.

Sources:
* NDS 2018 §12.1 and §12.3.5 (dowel bearing length in the main member; a fastener's lateral value
  rests on the bearing length it has in each member), from memory;
* nails driven from both faces of one member must not meet: common practice, no source;
* nail sizes: NDS 2018 Appendix L, Table L4 (8d common 2-1/2 in × 0.131 in, 16d common
  3-1/2 in × 0.162 in), from memory;
* AISC 360-16 Table J3.4 (edge distance 1 in for a 3/4 in bolt) and §J3.3 (spacing 2-2/3 d),
  from memory;
* AISC 360-16 §D4 (24·t ≤ 12 in) and §E6.2(a) (0.75·t·√(E/Fy) ≤ 12 in) stitch limits for plates in
  contact, from memory.
Each expected number is worked by hand in the test.
"""

import re
from dataclasses import replace

import pytest
from conn_fixtures import context, rect, run, steel, step, wood

from calcreport.solve.connectors import ConnectorError
from calcreport.units import Q_

T_PLY = 23 / 32  # 0.71875 in


def box(flange_width=1.5):
    """web_w | flange | web_e side by side, 5.5 in deep (a 2x6 on edge between two plywood webs)."""
    ply = wood(G=0.50, id="ply", family="plywood")
    web_w = rect("web_w", 0, 0, T_PLY, 5.5, ply)
    flange = rect("top", T_PLY, 0, T_PLY + flange_width, 5.5, wood(G=0.50, id="df2"))
    web_e = rect("web_e", T_PLY + flange_width, 0, 2 * T_PLY + flange_width, 5.5, ply)
    ctx = replace(context([flange], [web_w, web_e]), parts=(web_w, flange, web_e), per_row=2)
    return ctx


def chk(cap, suffix):
    return next(c for c in cap.checks if c.key.endswith(suffix))


def test_16d_through_a_box_beam_flange_protrudes():
    # Assembly on the axis: 23/32 + 1-1/2 + 23/32 = 2.9375 in. A 16d common is 3-1/2 in long, so the
    # point exits the far web by 3.5 − 2.9375 = 0.5625 in → NG.
    cap, log = run("nail", {"size": "16d common", "staggered": True}, box())
    assert step(log, "t_assembly").result.magnitude == pytest.approx(2.9375)
    fit = chk(cap, ".fit")
    assert fit.status == "NG"
    assert fit.ratio == pytest.approx(3.5 / 2.9375)
    # the amount is L − t_a from the check's own demand and capacity; the note carries no number
    # (the solver never formats for display) and the check names the step of t_a
    assert (fit.demand - fit.capacity).to("in").magnitude == pytest.approx(0.5625)
    assert not re.search(r"\d", fit.note) and fit.step.endswith(".connector.t_assembly")
    # The penetration shown is the one that bears: p = min(L − ts, tm) = min(2.78, 1.5) = 1.5 in,
    # the same as the dowel bearing length lm used in the yield equations.
    assert step(log, "p").result.magnitude == pytest.approx(1.5)
    assert step(log, "lm").result.magnitude == pytest.approx(1.5)
    pen = chk(cap, ".penetration")
    assert pen.capacity.magnitude == pytest.approx(1.5)
    assert pen.demand.magnitude == pytest.approx(6 * 0.162)  # 6D


def test_8d_stays_inside_and_opposite_faces_overlap_unless_staggered():
    # 8d common, L = 2.5 in: ends 2.9375 − 2.5 = 0.4375 in inside the far face → fits.
    # From each face p = min(2.5 − 0.71875, 1.5) = 1.5 in, so at one row the two points overlap by
    # 1.5 + 1.5 − 1.5 = 1.5 in in the flange → NG unless the rows are staggered.
    cap, log = run("nail", {"size": "8d common"}, box())
    fit = chk(cap, ".fit")
    assert fit.status == "OK" and "inside the far face" in fit.note
    assert (fit.capacity - fit.demand).to("in").magnitude == pytest.approx(0.4375)
    both = chk(cap, ".opposite_faces.web_e")
    assert both.status == "NG"
    assert both.demand.magnitude == pytest.approx(3.0)
    assert both.capacity.magnitude == pytest.approx(1.5)
    assert (both.demand - both.capacity).to("in").magnitude == pytest.approx(1.5)  # the overlap
    assert both.step.endswith(".connector.p_both.web_e") and not re.search(r"\d", both.note)
    assert both.label == "Points from opposite faces do not meet"  # the parts: in step p_both
    cap, _ = run("nail", {"size": "8d common", "staggered": True}, box())
    both = chk(cap, ".opposite_faces.web_e")
    assert both.status == "INFO" and both.ratio is None and "staggered as stated" in both.note


def test_short_nails_from_both_faces_do_not_meet_in_a_wide_flange():
    # 3-1/2 in flange (a 4x on edge): assembly 0.71875 + 3.5 + 0.71875 = 4.9375 in.
    # 8d: p = min(2.5 − 0.71875, 3.5) = 1.78125 from each face; 2 × 1.78125 = 3.5625 > 3.5 → overlap
    # 0.0625 in, NG. 6d (2 in): p = 1.28125 each; 2.5625 ≤ 3.5 → OK.
    cap, _ = run("nail", {"size": "8d common"}, box(3.5))
    assert chk(cap, ".opposite_faces.web_e").status == "NG"
    cap, _ = run("nail", {"size": "6d common"}, box(3.5))
    both = chk(cap, ".opposite_faces.web_e")
    assert both.status == "OK"
    assert both.demand.magnitude == pytest.approx(2 * (2.0 - T_PLY))


def test_staggered_without_a_second_face_is_refused():
    top = rect("top", 0, 1.5, 3.5, 3.0, wood())
    bot = rect("bot", 0, 0, 3.5, 1.5, wood())
    with pytest.raises(ConnectorError) as e:
        run("nail", {"size": "10d common", "staggered": True}, context([top], [bot]))
    assert e.value.key.endswith(".staggered")


def test_clinched_nail_needs_double_shear_and_must_pass_through():
    # Two 1-1/2 in members, 10d common (3 in): assembly 3.0 in, the point ends at the far face,
    # so it cannot be clinched → refused. A 16d (3.5 in) passes through by 0.5 in: clinched in single
    # shear has no NDS yield equations → refused.
    top = rect("top", 0, 1.5, 3.5, 3.0, wood())
    bot = rect("bot", 0, 0, 3.5, 1.5, wood())
    with pytest.raises(ConnectorError) as e:
        run("nail", {"size": "10d common", "clinched": True}, context([top], [bot]))
    assert "cannot be clinched" in str(e.value)
    with pytest.raises(ConnectorError) as e:
        run("nail", {"size": "16d common", "clinched": True}, context([top], [bot]))
    assert "planes = 2" in str(e.value)


def test_clinched_through_nail_in_double_shear():
    # Three 1-in members, middle one held (planes = 2); 16d common 3.5 in through 3.0 in of wood:
    # passes through by 0.5 in and is clinched as stated → fit OK; double-shear equations used.
    mid = rect("mid", 0, 1.0, 3.5, 2.0, wood())
    a = rect("a", 0, 2.0, 3.5, 3.0, wood())
    b = rect("b", 0, 0.0, 3.5, 1.0, wood())
    ctx = replace(context([mid], [a, b]), parts=(a, mid, b))
    cap, log = run("nail", {"size": "16d common", "clinched": True, "planes": 2}, ctx)
    fit = chk(cap, ".fit")
    assert fit.status == "OK" and "clinched" in fit.note
    assert step(log, "t_assembly").result.magnitude == pytest.approx(3.0)


def test_nail_lines_across_the_contact():
    # 16d common D = 0.162 in; 5D = 0.81 in edge distance and spacing across (common practice).
    # Four lines across a 3.5 in face: 2 × 0.81 + 3 × 0.81 = 4.05 in > 3.5 in → NG; three lines:
    # 2 × 0.81 + 2 × 0.81 = 3.24 in ≤ 3.5 → OK.
    top = rect("top", 0, 1.5, 3.5, 3.0, wood())
    bot = rect("bot", 0, -2.0, 3.5, 1.5, wood())
    for n, status, need in ((4, "NG", 4.05), (3, "OK", 3.24)):
        ctx = replace(context([top], [bot]), per_row=n)
        cap, _ = run("nail", {"size": "16d common"}, ctx)
        edge = chk(cap, ".edge")
        assert edge.status == status
        assert edge.demand.magnitude == pytest.approx(need)
        assert edge.capacity.magnitude == pytest.approx(3.5)


def test_steel_bolts_across_an_8_in_plate():
    # 3/4 in bolts: edge 1 in (AISC 360-16 Table J3.4), spacing 2-2/3 × 0.75 = 2 in (§J3.3).
    # Two across an 8 in plate need 2 × 1 + 1 × 2 = 4 in (OK); four need 2 + 3 × 2 = 8 in (OK, just);
    # five need 2 + 4 × 2 = 10 in > 8 in → NG.
    a = rect("cover", 0, 10, 8.0, 10.75, steel(36, 58))
    b = rect("flange", 0, 9.0, 8.0, 10, steel(50, 65))
    for n, need, status in ((1, 1.0, "OK"), (2, 4.0, "OK"), (4, 8.0, "OK"), (5, 10.0, "NG")):
        ctx = replace(context([a], [b]), per_row=n)
        cap, _ = run("steel_bolt", {"diameter": Q_(0.75, "in")}, ctx)
        edge = chk(cap, ".edge")
        assert edge.demand.magnitude == pytest.approx(need)
        assert edge.status == status


def test_intermittent_weld_pitch_limit_for_a_cover_plate():
    # 1/2 in cover plate on a 1 in flange, Fy = 50 ksi: D4: min(24 × 0.5, 12) = 12 in;
    # E6.2(a): 0.75 × 0.5 × √(29000/50) = 0.375 × 24.083 = 9.031 in → the lesser, 9.03 in, becomes the
    # joint's maximum spacing.
    cover = rect("cover", 1.0, 10, 7.0, 10.5, steel(50, 65))
    flange = rect("flange", 0, 9.0, 8.0, 10, steel(50, 65))
    cap, log = run(
        "fillet_weld", {"size": Q_(0.25, "in"), "segment": Q_(2, "in")}, context([cover], [flange])
    )
    assert step(log, "pitch_D4").result.magnitude == pytest.approx(12.0)
    assert step(log, "pitch_E6").result.magnitude == pytest.approx(0.375 * (29000 / 50) ** 0.5, rel=1e-6)
    assert cap.spacing_max.to("in").magnitude == pytest.approx(9.031, abs=1e-3)
    # A web stem welded to a flange (tee joint): no AISC limit; an INFO row says so.
    fl = rect("tf", 0, 30, 12, 31, steel())
    web = rect("web", 5.8125, 0, 6.1875, 30, steel())
    cap, _ = run("fillet_weld", {"size": Q_(0.25, "in"), "segment": Q_(3, "in")}, context([fl], [web]))
    row = chk(cap, ".pitch_max")
    assert row.status == "INFO" and row.note.startswith("not checked")
    assert cap.spacing_max is None
