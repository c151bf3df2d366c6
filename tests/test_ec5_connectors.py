"""EN 1995-1-1:2004 §8 connector capacities (settings.method = "EC5") against hand calculations
written out in full below with plain floats, independent of the code under test.

Sources: EN 1995-1-1:2004 §8.2.2 eq. (8.6) and (8.7) failure modes, (8.8) β, §8.2.2(2) rope effect,
§8.3.1.1 eq. (8.14)–(8.16) nails, §8.3.1.3 eq. (8.20) plywood, §8.5.1.1 eq. (8.30)–(8.33) bolts,
§2.4.3 eq. (2.17) design value, Table 3.1 k_mod, Table 2.3 γ_M. The equations are as printed in the
standard (recalled from memory and cross-read against a published design manual's restatement of
eq. 8.6/8.7 and Table 3.1); the arithmetic is done here by hand, step by step.
"""

from __future__ import annotations

import math
from dataclasses import replace

import pytest
from conn_fixtures import context, rect, run, step

from calcreport.model import Material
from calcreport.solve.connectors import ConnectorError
from calcreport.units import Q_

MM = 1 / 25.4  # inches per millimetre (the fixtures place parts in inches)


def c24(id="c24", rho=350.0, family="wood"):
    return Material(id, id, Q_(11, "GPa"), family=family, extra={"rho_k": Q_(rho, "kg/m**3")})


def ec5_ctx(held, other, service_class=1, duration="medium", gamma=None):
    ctx = context(held, other, method="EC5")
    s = replace(ctx.settings, service_class=service_class, duration=duration, gamma_M_connections=gamma)
    return replace(ctx, settings=s)


def two_plies(t1=38.0, t2=38.0, w=140.0, m1=None, m2=None):
    """Member 1 (t1 thick, on top) held, member 2 (t2) below; sizes in mm."""
    top = rect("top", 0, t2 * MM, w * MM, (t1 + t2) * MM, m1 or c24())
    bot = rect("bot", 0, 0, w * MM, t2 * MM, m2 or c24("c24b"))
    return top, bot


# --- hand calculation: 3.1 mm smooth round nail, C24 both members, t1 = t2 = 38 mm -------------
# f_h,k = 0.082·ρ_k·d^-0.3 (8.15)             = 0.082 × 350 × 3.1^-0.3
#   3.1^-0.3 = exp(−0.3 × ln 3.1) = exp(−0.3 × 1.131402) = exp(−0.339421) = 0.712197
#   f_h,k = 28.7 × 0.712197 = 20.4401 N/mm²   (β = 1: both members alike)
# M_y,Rk = 0.3·f_u·d^2.6 (8.14), f_u = 600 N/mm²
#   3.1^2.6 = exp(2.6 × 1.131402) = exp(2.941645) = 18.9483;  M_y = 180 × 18.9483 = 3410.7 N·mm
# (a) = (b) = f_h·t·d = 20.4401 × 38 × 3.1 = 2407.8 N
# (c) = f_h·t1·d/(1+β)·[√(β + 2β²(1 + t2/t1 + (t2/t1)²) + β³(t2/t1)²) − β(1 + t2/t1)]
#     = 2407.8 / 2 × (√8 − 2) = 1203.9 × 0.828427 = 997.3 N
# (d) = 1.05·f_h·t1·d/(2+β)·[√(2β(1+β) + 4β(2+β)·M_y/(f_h·d·t1²)) − β]
#     M_y/(f_h·d·t1²) = 3410.7 / (20.4401 × 3.1 × 1444) = 3410.7 / 91497 = 0.037277
#     = 1.05 × 2407.8 / 3 × (√(4 + 12 × 0.037277) − 1) = 842.7 × (2.108868 − 1) = 934.5 N
# (e) = (d) here (t1 = t2, β = 1)
# (f) = 1.15·√(2β/(1+β))·√(2·M_y·f_h·d) = 1.15 × 1 × √(2 × 3410.7 × 20.4401 × 3.1)
#     = 1.15 × √432,230 = 1.15 × 657.44 = 756.1 N   ← governs
# F_v,Rd = k_mod·F_v,Rk/γ_M = 0.8 × 756.1 / 1.3 = 465.3 N   (medium term, service class 1)
NAIL_HAND = {"a": 2407.8, "b": 2407.8, "c": 997.3, "d": 934.5, "e": 934.5, "f": 756.1}


def _nail_hand(fu=600.0, rho=350.0, d=3.1, t1=38.0, t2=38.0):
    """The same hand calculation as plain floats (eq. 8.6 as printed), for the other figures."""
    fh = 0.082 * rho * d**-0.3
    My = 0.3 * fu * d**2.6
    b = 1.0
    r = t2 / t1
    a = fh * t1 * d
    bb = fh * t2 * d
    c = fh * t1 * d / (1 + b) * (math.sqrt(b + 2 * b * b * (1 + r + r * r) + b**3 * r * r) - b * (1 + r))
    dd = (
        1.05
        * fh
        * t1
        * d
        / (2 + b)
        * (math.sqrt(2 * b * (1 + b) + 4 * b * (2 + b) * My / (fh * d * t1 * t1)) - b)
    )
    e = (
        1.05
        * fh
        * t2
        * d
        / (1 + 2 * b)
        * (math.sqrt(2 * b * b * (1 + b) + 4 * b * (1 + 2 * b) * My / (fh * d * t2 * t2)) - b)
    )
    f = 1.15 * math.sqrt(2 * b / (1 + b)) * math.sqrt(2 * My * fh * d)
    return fh, My, {"a": a, "b": bb, "c": c, "d": dd, "e": e, "f": f}


def test_hand_calculation_written_out_is_consistent():
    fh, My, modes = _nail_hand()
    assert fh == pytest.approx(20.4401, rel=1e-4)
    assert My == pytest.approx(3410.7, rel=1e-4)
    for m, v in NAIL_HAND.items():
        assert modes[m] == pytest.approx(v, rel=5e-4), m


def test_nail_single_shear_against_hand_calculation():
    top, bot = two_plies()
    ctx = ec5_ctx([top], [bot])
    cap, log = run("nail", {"diameter": Q_(3.1, "mm"), "length": Q_(76, "mm"), "fu": Q_(600, "MPa")}, ctx)
    assert step(log, "fh1").result.to("N/mm**2").magnitude == pytest.approx(20.4401, rel=1e-4)
    assert step(log, "My").result.to("N*mm").magnitude == pytest.approx(3410.7, rel=1e-4)
    for m, v in NAIL_HAND.items():
        assert step(log, f"mode.{m}").result.to("N").magnitude == pytest.approx(v, rel=5e-4), m
    assert step(log, "mode.f").governs
    assert step(log, "FvRk").result.to("N").magnitude == pytest.approx(756.1, rel=5e-4)
    assert step(log, "kmod1").result == 0.8
    assert step(log, "gM").result == 1.3
    assert cap.value.to("N").magnitude == pytest.approx(0.8 * 756.1 / 1.3, rel=5e-4)  # 465.3 N
    assert cap.duration_factor == 0.8
    # Table 8.2, ρ_k ≤ 420, d < 5 mm, not pre-drilled: a1 = (5 + 5·cos 0°)·d = 10d = 31 mm
    assert cap.spacing_min.to("mm").magnitude == pytest.approx(31.0)
    pen = next(c for c in cap.checks if c.key.endswith(".penetration"))
    assert pen.status == "OK" and pen.capacity.to("mm").magnitude == pytest.approx(38.0)  # t_pen = 76 − 38
    assert all(s.source for s in log.steps)
    assert not any("memory" in (s.source or "") for s in log.steps)  # reports cite clauses only


def test_nail_rope_effect_capped_at_15_percent_for_round_nails():
    # §8.2.2(2): F_ax,Rk/4 = 800/4 = 200 N, but at most 15 % of the Johansen part of mode (f):
    # 0.15 × 756.1 = 113.4 N → F(f) = 869.5 N; (e) = 934.5 + min(200, 0.15 × 934.5 = 140.2) = 1074.7 N;
    # mode (f) still governs at 869.5 N.
    top, bot = two_plies()
    cap, log = run(
        "nail",
        {"diameter": Q_(3.1, "mm"), "length": Q_(76, "mm"), "fu": Q_(600, "MPa"), "F_ax_Rk": Q_(800, "N")},
        ec5_ctx([top], [bot]),
    )
    assert step(log, "mode.f").result.to("N").magnitude == pytest.approx(756.1 * 1.15, rel=5e-4)
    assert step(log, "mode.e").result.to("N").magnitude == pytest.approx(934.5 * 1.15, rel=5e-4)
    assert step(log, "mode.a").result.to("N").magnitude == pytest.approx(2407.8, rel=5e-4)  # no rope
    assert step(log, "FvRk").result.to("N").magnitude == pytest.approx(869.5, rel=5e-4)


def test_nail_predrilled_and_service_class_3_short_term():
    # f_h,k = 0.082·(1 − 0.01·d)·ρ_k (8.16) = 0.082 × 0.969 × 350 = 27.8103 N/mm²;
    # k_mod (short term, service class 3) = 0.70 (Table 3.1); γ_M national 1.25 given.
    top, bot = two_plies()
    cap, log = run(
        "nail",
        {"diameter": Q_(3.1, "mm"), "length": Q_(76, "mm"), "fu": Q_(600, "MPa"), "predrilled": True},
        ec5_ctx([top], [bot], service_class=3, duration="short", gamma=1.25),
    )
    fh = 0.082 * (1 - 0.031) * 350
    assert step(log, "fh1").result.to("N/mm**2").magnitude == pytest.approx(fh, rel=1e-9)
    assert fh == pytest.approx(27.8103, rel=1e-5)
    Fk = 1.15 * math.sqrt(2 * 3410.7 * fh * 3.1)  # mode (f), β = 1
    assert step(log, "FvRk").result.to("N").magnitude == pytest.approx(Fk, rel=5e-4)
    assert cap.value.to("N").magnitude == pytest.approx(0.70 * Fk / 1.25, rel=5e-4)
    assert cap.spacing_min.to("mm").magnitude == pytest.approx(5 * 3.1)  # (4 + cos 0°)·d pre-drilled


def test_plywood_to_timber_nail_uses_eq_8_20():
    # Plywood ρ_k = 410 kg/m³, 12 mm, nailed to C24 (38 mm penetration): f_h,1,k = 0.11·ρ_k·d^-0.3
    # = 0.11 × 410 × 0.712197 = 32.1201 N/mm²; f_h,2,k = 20.4401 N/mm² (8.15); β = 0.636364.
    ply = Material("ply", "ply", Q_(9, "GPa"), family="plywood", extra={"rho_k": Q_(410, "kg/m**3")})
    top, bot = two_plies(t1=12.0, t2=38.0, m1=ply)
    cap, log = run(
        "nail",
        {"diameter": Q_(3.1, "mm"), "length": Q_(50, "mm"), "fu": Q_(600, "MPa")},
        ec5_ctx([top], [bot]),
    )
    fh1 = 0.11 * 410 * 3.1**-0.3
    fh2 = 0.082 * 350 * 3.1**-0.3
    assert step(log, "fh1").result.to("N/mm**2").magnitude == pytest.approx(32.1201, rel=1e-4)
    b = fh2 / fh1
    My, d, t1, t2 = 0.3 * 600 * 3.1**2.6, 3.1, 12.0, 38.0
    modes = {
        "a": fh1 * t1 * d,
        "b": fh2 * t2 * d,
        "d": 1.05
        * fh1
        * t1
        * d
        / (2 + b)
        * (math.sqrt(2 * b * (1 + b) + 4 * b * (2 + b) * My / (fh1 * d * t1**2)) - b),
        "f": 1.15 * math.sqrt(2 * b / (1 + b)) * math.sqrt(2 * My * fh1 * d),
    }
    for m, v in modes.items():
        assert step(log, f"mode.{m}").result.to("N").magnitude == pytest.approx(v, rel=1e-6), m
    gov = min(s.result.to("N").magnitude for s in log.steps if ".mode." in s.key)
    assert step(log, "FvRk").result.to("N").magnitude == pytest.approx(gov)


# --- hand calculation: M12 bolt, grade 4.6 (f_u,k = 400 N/mm²), double shear --------------------
# side members 2 × 38 mm C24, central member 75 mm C24, load parallel to the grain
# f_h,0,k = 0.082·(1 − 0.01·d)·ρ_k (8.32) = 0.082 × 0.88 × 350 = 25.256 N/mm² (β = 1)
# M_y,Rk = 0.3·f_u,k·d^2.6 (8.30): 12^2.6 = exp(2.6 × 2.484907) = exp(6.460757) = 639.56;
#   M_y = 120 × 639.56 = 76,747 N·mm
# (g) = f_h·t1·d = 25.256 × 38 × 12 = 11,516.7 N
# (h) = 0.5·f_h·t2·d = 0.5 × 25.256 × 75 × 12 = 11,365.2 N
# (j) = 1.05·f_h·t1·d/(2+β)·[√(2β(1+β) + 4β(2+β)·M_y/(f_h·d·t1²)) − β]
#     M_y/(f_h·d·t1²) = 76,747 / (25.256 × 12 × 1444) = 76,747 / 437,636 = 0.175367
#     = 1.05 × 11,516.7 / 3 × (√(4 + 2.104404) − 1) = 4030.8 × 1.470706 = 5928.2 N   ← governs
# (k) = 1.15·√(2·M_y·f_h·d) = 1.15 × √(2 × 76,747 × 25.256 × 12) = 1.15 × 6820.5 = 7843.6 N
# per bolt, two shear planes: 2 × 5928.2 = 11,856 N; F_v,Rd = 0.9 × 11,856 / 1.3 = 8208 N (short, SC2)
BOLT_HAND = {"g": 11516.7, "h": 11365.2, "j": 5928.2, "k": 7843.6}


def three_plies(t_side=38.0, t_mid=75.0, w=140.0):
    top = rect("top", 0, (t_side + t_mid) * MM, w * MM, (2 * t_side + t_mid) * MM, c24("s1"))
    mid = rect("mid", 0, t_side * MM, w * MM, (t_side + t_mid) * MM, c24("m"))
    bot = rect("bot", 0, 0, w * MM, t_side * MM, c24("s2"))
    return top, mid, bot


def test_bolt_double_shear_against_hand_calculation():
    top, mid, bot = three_plies()
    ctx = ec5_ctx([mid], [top, bot], service_class=2, duration="short")
    cap, log = run("wood_bolt", {"diameter": Q_(12, "mm"), "planes": 2, "fu": Q_(400, "MPa")}, ctx)
    assert step(log, "fh1").result.to("N/mm**2").magnitude == pytest.approx(25.256, rel=1e-6)
    assert step(log, "My").result.to("N*mm").magnitude == pytest.approx(76747, rel=1e-4)
    for m, v in BOLT_HAND.items():
        assert step(log, f"mode.{m}").result.to("N").magnitude == pytest.approx(v, rel=5e-4), m
    assert step(log, "mode.j").governs
    assert step(log, "FvRk2").result.to("N").magnitude == pytest.approx(2 * 5928.2, rel=5e-4)
    assert cap.value.to("N").magnitude == pytest.approx(0.9 * 2 * 5928.2 / 1.3, rel=5e-4)
    assert cap.spacing_min.to("mm").magnitude == pytest.approx(60.0)  # Table 8.4: (4 + cos 0°)·d


def test_bolt_rope_effect_25_percent_and_dowel_none():
    # F_ax,Rk = 4000 N: F_ax/4 = 1000 N ≤ 0.25 × 5928.2 = 1482 N → (j) = 6928.2 N (bolts, §8.2.2(2));
    # a dowel takes no rope effect (0 %).
    top, mid, bot = three_plies()
    ctx = ec5_ctx([mid], [top, bot])
    p = {"diameter": Q_(12, "mm"), "planes": 2, "fu": Q_(400, "MPa"), "F_ax_Rk": Q_(4000, "N")}
    _, log = run("wood_bolt", p, ctx)
    assert step(log, "mode.j").result.to("N").magnitude == pytest.approx(6928.2, rel=5e-4)
    _, log = run("wood_bolt", {**p, "dowel": True}, ctx)
    assert step(log, "mode.j").result.to("N").magnitude == pytest.approx(5928.2, rel=5e-4)


def test_bolt_at_angle_to_grain_eq_8_31():
    # α = 90° in the central member: k90 = 1.35 + 0.015 × 12 = 1.53; f_h,90,k = 25.256 / 1.53 = 16.507
    top, mid, bot = three_plies()
    ctx = ec5_ctx([mid], [top, bot])
    _, log = run(
        "wood_bolt", {"diameter": Q_(12, "mm"), "planes": 2, "fu": Q_(400, "MPa"), "angle_main": 90.0}, ctx
    )
    assert step(log, "fh2").result.to("N/mm**2").magnitude == pytest.approx(25.256 / 1.53, rel=1e-6)


def test_screw_small_follows_nail_rules_with_effective_diameter():
    # §8.7.1: threads in the shear plane, d_ef = 1.1 × root; 10g root 0.152 in = 3.8608 mm → d_ef = 4.2469
    # ≤ 6 mm: nail rules, f_h,k = 0.082 × 350 × d_ef^-0.3 (8.15); rope limit 100 % (screws).
    top, bot = two_plies()
    cap, log = run(
        "wood_screw",
        {
            "diameter": Q_(0.19, "in"),
            "root_diameter": Q_(0.152, "in"),
            "length": Q_(80, "mm"),
            "fu": Q_(500, "MPa"),
        },
        ec5_ctx([top], [bot]),
    )
    d = 1.1 * 0.152 * 25.4
    assert step(log, "d").result.to("mm").magnitude == pytest.approx(d, rel=1e-9)
    assert step(log, "fh1").result.to("N/mm**2").magnitude == pytest.approx(0.082 * 350 * d**-0.3, rel=1e-9)
    assert step(log, "rope").result == 1.0


def test_k_mod_table_3_1_and_gamma_m_table_2_3():
    # EN 1995-1-1:2004 Table 3.1 (solid timber, glulam, LVL, plywood), as reproduced in the ICE Manual
    # of Structural Design (2012) Table 19.9; Table 2.3 γ_M from memory.
    from calcreport.solve.ec5_factors import GAMMA_M, GAMMA_M_CONNECTIONS, k_mod, k_mod_joint

    expect = {
        1: (0.60, 0.70, 0.80, 0.90, 1.10),
        2: (0.60, 0.70, 0.80, 0.90, 1.10),
        3: (0.50, 0.55, 0.65, 0.70, 0.90),
    }
    for sc, row in expect.items():
        got = tuple(k_mod(d, sc) for d in ("permanent", "long", "medium", "short", "instantaneous"))
        assert got == row
    assert GAMMA_M == {"solid": 1.3, "glulam": 1.25, "LVL": 1.2, "plywood": 1.2}
    assert GAMMA_M_CONNECTIONS == 1.3
    assert k_mod_joint(0.8, 0.45) == pytest.approx(0.6)  # eq. (2.6): √(0.8 × 0.45)


def test_refusals_name_the_key():
    top, bot = two_plies()
    ctx = ec5_ctx([top], [bot])
    with pytest.raises(ConnectorError) as e:
        run("nail", {"diameter": Q_(3.1, "mm"), "length": Q_(76, "mm")}, ctx)
    assert e.value.key.endswith(".fu")
    bare = Material("bare", "bare", Q_(11, "GPa"), family="wood")
    t2, b2 = two_plies(m1=bare)
    with pytest.raises(ConnectorError) as e:
        run(
            "nail",
            {"diameter": Q_(3.1, "mm"), "length": Q_(76, "mm"), "fu": Q_(600, "MPa")},
            ec5_ctx([t2], [b2]),
        )
    assert e.value.key == "material[bare].rho_k"
    st = Material("s", "s", Q_(200, "GPa"), family="steel")
    t3, b3 = two_plies(m2=st)
    with pytest.raises(ConnectorError) as e:
        run("wood_bolt", {"diameter": Q_(12, "mm"), "fu": Q_(400, "MPa")}, ec5_ctx([t3], [b3]))
    assert "§8.2.3" in str(e.value)
    with pytest.raises(ConnectorError) as e:
        run(
            "nail",
            {"diameter": Q_(3.1, "mm"), "length": Q_(76, "mm"), "fu": Q_(600, "MPa")},
            ec5_ctx([top], [bot], duration=""),
        )
    assert e.value.key == "settings.duration"
