"""Detailing limits of the connector models: each limit a check uses is a derivation step.

Sources:
* ANSI/AWC NDS-2018 Tables 12.5.1A (end distance: 7D tension softwoods / 4D compression parallel,
  4D perpendicular), 12.5.1B (4D in a row for the full value, 3D minimum), 12.5.1C (edge distance:
  1.5D parallel for l/D ≤ 6; 4D loaded edge and 1.5D unloaded edge perpendicular), 12.5.1D
  (between rows: 1.5D parallel; 2.5D for l/D ≤ 2, (5l + 10D)/8 for 2 < l/D < 6, 5D for l/D ≥ 6
  perpendicular) — from memory;
* nails: 10D spacing, 15D end, 5D edge — common practice, no source;
* ANSI/AISC 360-16 §J3.3 (2-2/3·d, 3·d preferred), Table J3.4 (3/4 in bolt: 1 in), §J3.5
  (24·t ≤ 12 in, 12·t ≤ 6 in), Table J2.4 (minimum fillet sizes), §J2.2b (maximum size along an
  edge t − 1/16 in, length 4w, segment max(4w, 1-1/2 in)), §I8.2d (studs 6·d, 8·t ≤ 36 in) —
  from memory.
"""

from __future__ import annotations

import dataclasses

import pytest
from conn_fixtures import concrete, context, rect, run, steel, step, wood

from calcreport.solve.connectors.nds_detailing import row_spacing_perpendicular
from calcreport.units import Q_


def _plies(angle=90.0, per_row=1, t=1.5, depth=11.25):
    a = rect("A", 0, 0, t, depth, wood())
    b = rect("B", t, 0, 2 * t, depth, wood())
    return dataclasses.replace(
        context([a], [b], width=depth), load_angle=angle, parts=(a, b), per_row=per_row
    )


def _limits_have_steps(cap, log):
    """Every check that compares lengths has its limit as the result of a step: of the two values
    it compares (the limit and the value of the design: a half contact width, a weld size, a
    fastener length), at least one is a step's result — the limit, since the design value is the
    job's input or its geometry. Returns the checks where neither is."""
    results = [
        s.result.to("in").magnitude
        for s in log.steps
        if hasattr(s.result, "to") and s.result.dimensionality == Q_(1, "in").dimensionality
    ]

    def stepped(v):
        x = v.to("in").magnitude
        return any(abs(x - r) <= 1e-9 * max(1.0, abs(x)) for r in results)

    missing = []
    for c in cap.checks:
        vals = [
            v
            for v in (c.demand, c.capacity)
            if hasattr(v, "dimensionality") and v.dimensionality == Q_(1, "in").dimensionality
        ]
        if vals and not any(stepped(v) for v in vals):
            missing.append((c.key, [v.to("in").magnitude for v in vals]))
    return missing


# --- NDS-2018 Table 12.5.1D, spacing between rows perpendicular to grain -----------------------


@pytest.mark.parametrize("ld,k", [(1.0, 2.5), (2.0, 2.5), (4.0, 3.75), (6.0, 5.0), (8.0, 5.0)])
def test_row_spacing_perpendicular_table_12_5_1d(ld, k):
    assert row_spacing_perpendicular(ld) == pytest.approx(k)


def test_bolt_parallel_limits_are_steps():
    top = rect("t", 0, 1.5, 3.5, 3.0, wood())
    bot = rect("b", 0, 0, 3.5, 1.5, wood())
    cap, log = run("wood_bolt", {"diameter": Q_(0.5, "in")}, context([top], [bot]))
    D = 0.5
    assert step(log, "e_edge").result.to("in").magnitude == pytest.approx(1.5 * D)  # Table 12.5.1C
    assert step(log, "s_rows").result.to("in").magnitude == pytest.approx(1.5 * D)  # Table 12.5.1D
    assert step(log, "e_end").result.to("in").magnitude == pytest.approx(7 * D)  # Table 12.5.1A
    assert step(log, "s_row").result.to("in").magnitude == pytest.approx(4 * D)  # Table 12.5.1B
    assert cap.spacing_min.to("in").magnitude == pytest.approx(4 * D)
    assert step(log, "l_over_D").result == pytest.approx(3.0)
    assert _limits_have_steps(cap, log) == []


def test_bolt_across_plies_needs_4d_loaded_edges():
    # Plies: load perpendicular to grain, both edges loaded (Table 12.5.1C: 4D); l/D = 1.5/0.5 = 3,
    # rows (5·3 + 10)/8 = 3.125 D (Table 12.5.1D); end distance 4D (Table 12.5.1A).
    cap, log = run("wood_bolt", {"diameter": Q_(0.5, "in")}, _plies(90.0, per_row=2))
    D = 0.5
    assert step(log, "e_edge").result.to("in").magnitude == pytest.approx(4 * D)
    assert step(log, "s_rows").result.to("in").magnitude == pytest.approx(3.125 * D)
    assert step(log, "e_end").result.to("in").magnitude == pytest.approx(4 * D)
    w = step(log, "W_across").result.to("in").magnitude
    assert w == pytest.approx(2 * 4 * D + 3.125 * D)
    edge = next(c for c in cap.checks if c.key.endswith(".edge"))
    assert edge.status == "OK" and edge.demand.to("in").magnitude == pytest.approx(w)
    assert "both edges are loaded edges" in step(log, "e_edge").note
    assert _limits_have_steps(cap, log) == []


def test_bolt_across_shallow_plies_is_ng_on_the_loaded_edges():
    # Two 3/4 in bolts across a 2x4 (3.5 in): 2·4D + 1 row spacing = 6 + 2.3 in > 3.5 in → NG.
    cap, _ = run("wood_bolt", {"diameter": Q_(0.75, "in")}, _plies(90.0, per_row=2, depth=3.5))
    edge = next(c for c in cap.checks if c.key.endswith(".edge"))
    assert edge.status == "NG"


def test_bolt_at_an_angle_takes_the_stricter_limits():
    cap, log = run("wood_bolt", {"diameter": Q_(0.5, "in")}, _plies(45.0))
    D = 0.5
    assert step(log, "e_edge").result.to("in").magnitude == pytest.approx(4 * D)
    assert step(log, "e_end").result.to("in").magnitude == pytest.approx(7 * D)
    assert step(log, "s_rows").result.to("in").magnitude == pytest.approx(3.125 * D)


def test_nail_limits_are_steps():
    top = rect("t", 0, 1.5, 3.5, 3.0, wood())
    bot = rect("b", 0, 0, 3.5, 3.0 - 1.5, wood())
    cap, log = run("nail", {"size": "16d common"}, context([top], [bot]))
    D = 0.162
    assert step(log, "s_row").result.to("in").magnitude == pytest.approx(10 * D)  # common practice
    assert step(log, "e_edge").result.to("in").magnitude == pytest.approx(5 * D)
    assert step(log, "e_end").result.to("in").magnitude == pytest.approx(15 * D)
    assert step(log, "p_min").result.to("in").magnitude == pytest.approx(6 * D)  # NDS ch. 12
    assert cap.spacing_min.to("in").magnitude == pytest.approx(10 * D)
    assert _limits_have_steps(cap, log) == []


def test_lag_screw_limits_are_steps():
    top = rect("t", 0, 3.5, 3.5, 5.0, wood())
    bot = rect("b", 0, 0, 3.5, 3.5, wood())
    cap, log = run("lag_screw", {"size": "1/2", "length": Q_(4.0, "in")}, context([top], [bot]))
    assert step(log, "p_min").result.to("in").magnitude == pytest.approx(4 * 0.5)
    assert _limits_have_steps(cap, log) == []


def test_steel_bolt_limits_are_steps():
    top = rect("t", 0, 0.5, 8.0, 1.0, steel())
    bot = rect("b", 0, 0, 8.0, 0.5, steel())
    ctx = dataclasses.replace(context([top], [bot]), per_row=2)
    cap, log = run("steel_bolt", {"diameter": Q_(0.75, "in")}, ctx)
    assert step(log, "s_min_J33").result.to("in").magnitude == pytest.approx(2.0)  # 2-2/3 × 3/4 in
    assert step(log, "s_pref").result.to("in").magnitude == pytest.approx(2.25)
    assert step(log, "s_max").result.to("in").magnitude == pytest.approx(12.0)  # 24 × 0.5 in, ≤ 12
    assert step(log, "e_min").result.to("in").magnitude == pytest.approx(1.0)  # Table J3.4, 3/4 in
    assert step(log, "e_max").result.to("in").magnitude == pytest.approx(6.0)  # 12 × 0.5 in ≤ 6 in
    assert cap.spacing_max.to("in").magnitude == pytest.approx(12.0)
    assert _limits_have_steps(cap, log) == []


def test_fillet_weld_limits_are_steps():
    flange = rect("f", 0, 0, 8.0, 0.75, steel())
    cover = rect("c", 1.0, 0.75, 7.0, 1.25, steel())
    cap, log = run(
        "fillet_weld", {"size": Q_(0.25, "in"), "segment": Q_(2.0, "in")}, context([cover], [flange])
    )
    assert step(log, "w_min").result.to("in").magnitude == pytest.approx(0.1875)  # t = 1/2 in
    assert step(log, "w_max").result.to("in").magnitude == pytest.approx(0.5 - 1 / 16)
    assert step(log, "L_seg_min").result.to("in").magnitude == pytest.approx(1.5)  # max(4w, 1.5)
    assert _limits_have_steps(cap, log) == []


def test_continuous_tee_weld_limits_are_steps():
    web = rect("w", 3.8, 0.75, 4.2, 20.0, steel())
    flange = rect("f", 0, 0, 8.0, 0.75, steel())
    cap, log = run("fillet_weld", {"size": Q_(0.25, "in")}, context([web], [flange]))
    assert step(log, "L_min").result.to("in").magnitude == pytest.approx(1.0)
    assert _limits_have_steps(cap, log) == []


def test_stud_limits_are_steps():
    slab = rect("s", 0, 10.0, 60.0, 15.0, concrete())
    flange = rect("f", 26.0, 9.5, 34.0, 10.0, steel())
    cap, log = run("stud", {"diameter": Q_(0.75, "in")}, context([slab], [flange]))
    assert step(log, "s_min").result.to("in").magnitude == pytest.approx(4.5)  # 6 × 3/4 in
    assert step(log, "s_max").result.to("in").magnitude == pytest.approx(36.0)  # min(8 × 5, 36)
    assert _limits_have_steps(cap, log) == []
