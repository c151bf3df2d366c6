"""Steel connectors: bolts (AISC 360-16 §J3), fillet welds (§J2) and headed studs (§I8).

Published values reproduced (AISC Steel Construction Manual, 15th ed., from memory; each also
follows from the 360-16 equations shown):
* Table 7-1: 3/4 in Group A bolt, threads included (N), single shear: φrn = 17.9 kips, rn/Ω = 11.9 kips;
* Table 7-3: 3/4 in Group A, class A, standard holes, single shear: φrn = 9.49 kips, rn/Ω = 6.33 kips;
* Table 7-5: 3/4 in bolt bearing on Fu = 58 ksi material: φrn = 78.3 kips per inch of thickness;
* Part 8: fillet weld strength per 1/16 in per inch, E70: 1.392 kips (LRFD), 0.928 kips (ASD);
* Table 3-21: 3/4 in stud, f'c = 4 ksi normal weight, no deck: Qn = 21.5 kips; deck perpendicular,
  weak position: 17.2 kips (one per rib), 14.6 kips (two per rib).
Tolerance: the Manual's printed rounding (3 significant figures), i.e. ±0.05 kip or ±0.001 kip/in.
"""

import pytest
from conn_fixtures import concrete, context, rect, run, steel, step, wood

from calcreport.solve.connectors import ConnectorError
from calcreport.solve.connectors import aisc_bolt as ab
from calcreport.solve.connectors import fillet_weld as fw
from calcreport.solve.connectors import stud as st
from calcreport.units import Q_


def plates(t1=0.75, t2=1.0, w=8.0, m1=None, m2=None):
    a = rect("cover", 0, 10, w, 10 + t1, m1 or steel(36, 58))
    b = rect("flange", 0, 10 - t2, w, 10, m2 or steel(50, 65))
    return a, b


# --- bolts -----------------------------------------------------------------------------------


@pytest.mark.parametrize("method,expected", [("LRFD", 17.9), ("ASD", 11.9)])
def test_table_7_1_group_a_n_single_shear(method, expected):
    a, b = plates()
    cap, log = run("steel_bolt", {"diameter": Q_(0.75, "in")}, context([a], [b], method=method))
    assert cap.value.to("kip").magnitude == pytest.approx(expected, abs=0.05)
    assert step(log, "R_0").governs  # bolt shear governs over bearing


def test_fnv_table_j3_2():
    # AISC 360-16 Table J3.2: Group A 54/68 ksi, Group B 68/84 ksi (N/X).
    assert ab.FNV[("A", "N")] == 54 and ab.FNV[("A", "X")] == 68
    assert ab.FNV[("B", "N")] == 68 and ab.FNV[("B", "X")] == 84


def test_double_shear_doubles_bolt_shear():
    mid = rect("mid", 0, 0, 1.0, 12, steel())
    l_ = rect("l", -0.5, 0, 0, 12, steel())
    r_ = rect("r", 1.0, 0, 1.5, 12, steel())
    cap, _ = run(
        "steel_bolt",
        {"diameter": Q_(0.75, "in"), "planes": 2},
        context([mid], [l_, r_], method="LRFD", width=24),
    )
    assert cap.value.to("kip").magnitude == pytest.approx(2 * 17.89, abs=0.05)


@pytest.mark.parametrize("method,expected", [("LRFD", 9.49), ("ASD", 6.33)])
def test_table_7_3_slip_critical(method, expected):
    a, b = plates()
    cap, log = run(
        "steel_bolt", {"diameter": Q_(0.75, "in"), "slip_critical": True}, context([a], [b], method=method)
    )
    assert cap.value.to("kip").magnitude == pytest.approx(expected, abs=0.01)
    assert step(log, "Tb").result.magnitude == 28  # Table J3.1, 3/4 in Group A


def test_bearing_per_inch_table_7_5():
    # 2.4·d·t·Fu, φ = 0.75: 0.75 × 2.4 × 0.75 × 1 × 58 = 78.3 kips per inch (AISC 360-16 Eq. J3-6a).
    assert 0.75 * ab.bearing_nominal(0.75, 1.0, 58.0, True) == pytest.approx(78.3)
    assert ab.bearing_nominal(0.75, 1.0, 58.0, False) == pytest.approx(3.0 * 0.75 * 58)
    assert ab.tearout_nominal(1.0, 0.5, 58.0, True) == pytest.approx(1.2 * 0.5 * 58)


def test_thin_plate_bearing_governs_and_tearout_spacing():
    a, b = plates(t1=0.1875)
    cap, log = run("steel_bolt", {"diameter": Q_(0.75, "in")}, context([a], [b], method="LRFD"))
    # 0.75 × 2.4 × 0.75 × 0.1875 × 58 = 14.68 kips < 17.9 kips bolt shear.
    assert cap.value.to("kip").magnitude == pytest.approx(14.68, abs=0.01)
    # Tearout does not govern at s = dh + R/(φ·1.2·t·Fu) = 0.8125 + 14.68/(0.75·1.2·0.1875·58) = 2.3125 in.
    assert step(log, "s_tearout").result.magnitude == pytest.approx(2.3125, abs=1e-3)
    assert cap.spacing_min.magnitude == pytest.approx(2.3125, abs=1e-3)


def test_bolt_detailing_limits():
    # J3.3: 2-2/3 d minimum; J3.5(a): 24t ≤ 12 in; J3.5(b): 14t ≤ 7 in; Table J3.4 edge distances.
    a, b = plates(t1=0.375)
    cap, _ = run("steel_bolt", {"diameter": Q_(0.75, "in")}, context([a], [b]))
    assert cap.spacing_min.magnitude == pytest.approx(2.0)
    assert cap.spacing_max.magnitude == pytest.approx(9.0)
    cap, _ = run("steel_bolt", {"diameter": Q_(0.75, "in"), "weathering": True}, context([a], [b]))
    assert cap.spacing_max.magnitude == pytest.approx(5.25)
    assert ab.edge_min(0.75) == 1.0 and ab.edge_min(1.0) == 1.25 and ab.edge_min(1.5) == pytest.approx(1.875)
    assert ab.standard_hole(0.75) == pytest.approx(0.8125) and ab.standard_hole(1.0) == 1.125


def test_steel_bolt_rejects_wood_parts():
    a = rect("a", 0, 1.5, 3.5, 3.0, wood())
    b = rect("b", 0, 0, 3.5, 1.5, wood())
    with pytest.raises(ConnectorError):
        run("steel_bolt", {"diameter": Q_(0.5, "in")}, context([a], [b]))


def test_rolled_shape_flange_thickness_measured_from_polygon():
    # A W-shape-like polygon: the run from the top of the flange is the flange thickness, not the depth.
    bf, tf, d, tw = 8.0, 0.5, 12.0, 0.3
    v = [
        (0, 0),
        (bf, 0),
        (bf, tf),
        ((bf + tw) / 2, tf),
        ((bf + tw) / 2, d - tf),
        (bf, d - tf),
        (bf, d),
        (0, d),
        (0, d - tf),
        ((bf - tw) / 2, d - tf),
        ((bf - tw) / 2, tf),
        (0, tf),
    ]
    from calcreport.model import Part, Shape

    beam = Part("W", Shape("polygon", (0, 0, bf, d), vertices=tuple(v)), steel())
    cover = rect("cover", 0, d, bf, d + 0.625, steel(36, 58))
    cap, log = run("steel_bolt", {"diameter": Q_(0.75, "in")}, context([cover], [beam]))
    assert step(log, "t_other").result.magnitude == pytest.approx(tf)


# --- fillet welds ------------------------------------------------------------------------------


def test_strength_per_sixteenth_per_inch():
    te, Fnw, rn = fw.strength_per_inch(1 / 16, 70.0)
    assert 0.75 * rn == pytest.approx(1.392, abs=0.001)
    assert rn / 2.0 == pytest.approx(0.928, abs=0.001)


def girder(t_w=0.5, t_f=1.0):
    fl = rect("tf", -6, 24, 6, 24 + t_f, steel())
    web = rect("web", -t_w / 2, 0, t_w / 2, 24, steel())
    return fl, web


@pytest.mark.parametrize("method,per16", [("LRFD", 1.392), ("ASD", 0.928)])
def test_continuous_web_to_flange_weld(method, per16):
    fl, web = girder()
    cap, log = run("fillet_weld", {"size": Q_(0.25, "in")}, context([fl], [web], method=method))
    assert cap.continuous
    # two 1/4 in welds = 2 × 4 sixteenths
    assert cap.value.to("kip/in").magnitude == pytest.approx(2 * 4 * per16, abs=0.01)
    assert step(log, "t_other").result.magnitude == pytest.approx(0.5)


def test_base_metal_governs_thin_web():
    # 5/16 in welds both sides of a 1/4 in web (Fy = 50, Fu = 65 ksi), LRFD:
    # welds 2 × 5 × 1.392 = 13.92 k/in; web rupture 0.75 × 0.6 × 65 × 0.25 = 7.31 k/in (J4.2, Eq. J4-4);
    # yielding 1.0 × 0.6 × 50 × 0.25 = 7.50 k/in (Eq. J4-3).
    fl, web = girder(t_w=0.25)
    cap, log = run("fillet_weld", {"size": Q_(0.3125, "in")}, context([fl], [web], method="LRFD"))
    assert cap.value.to("kip/in").magnitude == pytest.approx(0.75 * 0.6 * 65 * 0.25)
    assert step(log, "q_2").governs


def test_minimum_and_maximum_sizes():
    # Table J2.4 by thinner part: 1/8, 3/16, 1/4, 5/16 in; J2.2b: t < 1/4 → t, else t − 1/16.
    assert [fw.min_fillet(t) for t in (0.25, 0.5, 0.75, 1.0)] == [0.125, 0.1875, 0.25, 0.3125]
    assert fw.max_fillet_along_edge(0.1875) == 0.1875
    assert fw.max_fillet_along_edge(0.5) == pytest.approx(0.4375)
    fl, web = girder(t_w=1.0, t_f=1.0)
    cap, _ = run("fillet_weld", {"size": Q_(0.25, "in")}, context([fl], [web]))
    assert next(c for c in cap.checks if c.key.endswith("min_size")).status == "NG"


def test_cover_plate_lap_weld_edge_limit():
    # 3/8 in cover plate on a 1 in flange, welded along both edges: lap joint, w ≤ 3/8 − 1/16.
    cover = rect("cover", -4, 10, 4, 10.375, steel())
    flange = rect("flange", -6, 9, 6, 10, steel())
    cap, _ = run("fillet_weld", {"size": Q_(0.375, "in")}, context([cover], [flange]))
    mx = next(c for c in cap.checks if c.key.endswith("max_size"))
    assert mx.status == "NG" and mx.capacity.magnitude == pytest.approx(0.3125)


def test_intermittent_segment():
    fl, web = girder()
    cap, _ = run(
        "fillet_weld", {"size": Q_(0.25, "in"), "segment": Q_(2, "in")}, context([fl], [web], method="LRFD")
    )
    assert not cap.continuous
    assert cap.value.to("kip").magnitude == pytest.approx(2 * 2 * 4 * 1.392, abs=0.02)
    assert cap.spacing_min.magnitude == 2
    short, _ = run("fillet_weld", {"size": Q_(0.25, "in"), "segment": Q_(1.25, "in")}, context([fl], [web]))
    assert next(c for c in short.checks if c.key.endswith("segment")).status == "NG"  # < 1-1/2 in


# --- studs ---------------------------------------------------------------------------------------


def test_stud_equation_i8_1():
    # Ec = 145^1.5·√4 = 3492 ksi; 0.5·Asa·√(f'c·Ec) = 26.1 kips; Rg·Rp·Asa·Fu = 0.75·0.4418·65 = 21.5 kips.
    assert st.concrete_modulus(145, 4) == pytest.approx(3492, abs=1)
    a, b, q = st.qn(0.4418, 4.0, st.concrete_modulus(145, 4), 1.0, 0.75, 65)
    assert a == pytest.approx(26.1, abs=0.05) and b == pytest.approx(21.5, abs=0.05) and q == b


@pytest.mark.parametrize(
    "deck,per_rib,expected", [("none", 1, 21.5), ("perpendicular", 1, 17.2), ("perpendicular", 2, 14.6)]
)
def test_table_3_21_stud_strengths(deck, per_rib, expected):
    sl = rect("slab", -30, 25, 30, 31, concrete(4.0))
    fl = rect("tf", -6, 24, 6, 25, steel())
    _, log = run(
        "stud",
        {"diameter": Q_(0.75, "in"), "deck": deck, "per_rib": per_rib},
        context([sl], [fl], method="LRFD"),
    )
    assert step(log, "Qn").result.to("kip").magnitude == pytest.approx(expected, abs=0.05)


def test_stud_design_value_and_spacing():
    sl = rect("slab", -30, 25, 30, 31, concrete(4.0))
    fl = rect("tf", -6, 24, 6, 25, steel())
    cap, _ = run("stud", {"diameter": Q_(0.75, "in")}, context([sl], [fl], method="LRFD"))
    assert cap.value.to("kip").magnitude == pytest.approx(0.65 * 21.54, abs=0.02)
    asd, _ = run("stud", {"diameter": Q_(0.75, "in")}, context([sl], [fl], method="ASD"))
    assert asd.value.to("kip").magnitude == pytest.approx(21.54 / 2.31, abs=0.02)
    # I8.2d: 6·dsa along the beam; 8 × 6 in slab = 48 in → 36 in cap.
    assert cap.spacing_min.magnitude == pytest.approx(4.5)
    assert cap.spacing_max.magnitude == pytest.approx(36.0)
    thin, _ = run("stud", {"diameter": Q_(0.75, "in"), "slab_thickness": Q_(4, "in")}, context([sl], [fl]))
    assert thin.spacing_max.magnitude == pytest.approx(32.0)


def test_stud_f_c_3_ksi_concrete_limit():
    # f'c = 3 ksi, 145 pcf: 0.5 × 0.4418 × √(3 × 3024) = 21.0 kips < 21.5 → concrete governs.
    sl = rect("slab", -30, 25, 30, 31, concrete(3.0))
    fl = rect("tf", -6, 24, 6, 25, steel())
    _, log = run("stud", {"diameter": Q_(0.75, "in")}, context([sl], [fl]))
    assert step(log, "Qn").result.to("kip").magnitude == pytest.approx(21.0, abs=0.05)
    assert step(log, "Qn_concrete").governs
