"""Wood fastener models end to end: nails, screws, lag screws and bolts in a joint context.

Sources: ANSI/AWC NDS-2018 (Table 12N, Table 12A, Table 11.3.1, Eq. 11.3-1, Tables N1-N3); table
values from memory as noted in test_nds_yield.py. Tolerances are stated beside each check.
"""

import pytest
from conn_fixtures import context, rect, run, steel, step, wood

from calcreport.solve.connectors import ConnectorError
from calcreport.solve.connectors.nds_factors import group_action
from calcreport.units import Q_


def stacked(G=0.50, t_top=1.5, t_bot=1.5, w=3.5):
    top = rect("top", 0, t_bot, w, t_bot + t_top, wood(G))
    bot = rect("bot", 0, 0, w, t_bot, wood(G))
    return top, bot


def test_16d_common_asd_reference_value():
    # NDS-2018 Table 12N: 16d common, ts = 1-1/2 in, G = 0.50 → Z = 141 lb; all ASD factors 1.0.
    # The main member here is a 3-1/2 in member so lm = p = 2 in (table basis). Tolerance 1 %.
    top = rect("top", 0, 3.5, 3.5, 5.0, wood())
    bot = rect("bot", 0, 0, 3.5, 3.5, wood())
    cap, log = run("nail", {"size": "16d common"}, context([top], [bot]))
    assert cap.value.to("lbf").magnitude == pytest.approx(141, rel=0.01)
    assert step(log, "Z_IV").governs
    assert {s.key.rsplit(".", 1)[1] for s in log.steps} >= {
        "Z_Im",
        "Z_Is",
        "Z_II",
        "Z_IIIm",
        "Z_IIIs",
        "Z_IV",
        "CD",
        "CM",
        "Ct",
        "Cg",
        "C_delta",
        "Ceg",
        "Cdi",
        "Ctn",
    }
    assert cap.continuous is False
    assert cap.spacing_min.to("in").magnitude == pytest.approx(1.62)  # 10D, common practice


def test_lrfd_uses_kf_phi_lambda():
    # NDS-2018 Table 11.3.1 with Tables N1-N3: Z' = Z·KF·φz·λ = Z × 3.32 × 0.65 × 0.8 (λ default).
    top, bot = stacked()
    asd, _ = run("nail", {"size": "16d common"}, context([top], [bot]))
    lrfd, log = run("nail", {"size": "16d common"}, context([top], [bot], method="LRFD"))
    assert lrfd.value.magnitude == pytest.approx(asd.value.magnitude * 3.32 * 0.65 * 0.8)
    assert not any(s.key.endswith(".CD") for s in log.steps)


def test_adjustment_factors_multiply():
    # NDS-2018: CD = 1.6 (given), CM = 0.7 wet service (Table 11.3.3), Ceg = 0.67 (§12.5.2),
    # Ctn = 0.83 (§12.5.4), Cdi = 1.1 (§12.5.3). Exact product expected.
    top, bot = stacked()
    base, _ = run("nail", {"size": "16d common"}, context([top], [bot]))
    cap, log = run(
        "nail",
        {
            "size": "16d common",
            "CD": 1.6,
            "wet_service": True,
            "end_grain": True,
            "toe_nail": True,
            "diaphragm": True,
        },
        context([top], [bot]),
    )
    assert cap.value.magnitude == pytest.approx(base.value.magnitude * 1.6 * 0.7 * 0.67 * 0.83 * 1.1)
    assert step(log, "CM").note.startswith("moisture")


def test_load_duration_from_settings():
    top, bot = stacked()
    cap, log = run("nail", {"size": "10d common"}, context([top], [bot], load_duration=1.15))
    assert step(log, "CD").result == 1.15


def test_unknown_nail_size_lists_valid_ones():
    top, bot = stacked()
    with pytest.raises(ConnectorError) as e:
        run("nail", {"size": "17d common"}, context([top], [bot]))
    assert e.value.key.endswith(".connector.size")
    assert "16d common" in str(e.value)


def test_short_penetration_is_ng():
    # 6d common (L = 2 in) through 1-1/2 in: p = 0.5 in < 6D = 0.678 in → NG (NDS-2018 min. 6D).
    top, bot = stacked()
    cap, _ = run("nail", {"size": "6d common"}, context([top], [bot]))
    pen = next(c for c in cap.checks if c.key.endswith("penetration"))
    assert pen.status == "NG"


def test_nail_shorter_than_side_member_is_an_error():
    top, bot = stacked(t_top=3.5)
    with pytest.raises(ConnectorError):
        run("nail", {"size": "6d common", "side_member": "held"}, context([top], [bot]))


def test_auto_side_member_is_the_thinner_part():
    top, bot = stacked(t_top=3.5)
    _, log = run("nail", {"size": "16d common"}, context([top], [bot]))
    assert step(log, "ts").result.magnitude == pytest.approx(1.5)
    assert "other part" in step(log, "ts").note


def test_species_and_missing_g():
    top = rect("top", 0, 1.5, 3.5, 3.0, wood(G=None))
    bot = rect("bot", 0, 0, 3.5, 1.5, wood(G=None))
    with pytest.raises(ConnectorError) as e:
        run("nail", {"size": "16d common"}, context([top], [bot]))
    assert "G_side" in e.value.key
    cap, log = run("nail", {"size": "16d common", "species": "Southern Pine"}, context([top], [bot]))
    assert step(log, "G_side").result == 0.55  # NDS-2018 Table 12.3.3A (from memory)


def test_box_beam_vertical_plane_plywood_side_member():
    # Plywood web (15/32 in) beside a 2x flange: vertical plane; the thinner web is the side member.
    web = rect("web", 1.5, 0, 1.5 + 15 / 32, 12, wood(G=0.50, id="ply", family="plywood"))
    fl = rect("fl", 0, 8.5, 1.5, 12, wood())
    cap, log = run("nail", {"size": "8d common"}, context([fl], [web], width=3.5))
    assert step(log, "ts").result.magnitude == pytest.approx(15 / 32)
    assert "vertical" in step(log, "ts").note
    assert step(log, "tm").result.magnitude == pytest.approx(1.5)


def test_steel_side_plate_bearing():
    # 1/4 in A36 plate (Fu = 58 ksi) nailed to wood: Fes = 1.5·Fu = 87,000 psi (NDS-2018 App. I).
    plate = rect("pl", 0, 3.5, 3.5, 3.75, steel(36, 58))
    bot = rect("bot", 0, 0, 3.5, 3.5, wood())
    cap, log = run("nail", {"size": "10d common"}, context([plate], [bot]))
    assert step(log, "Fes").result.to("psi").magnitude == pytest.approx(87_000)


def test_wood_bolt_table_12a_row_through_model():
    # NDS-2018 Table 12A: 1/2 in bolt, ts = tm = 1-1/2 in, G = 0.50, Z∥ = 480 lb (rounded to 10 lb).
    top, bot = stacked()
    cap, log = run("wood_bolt", {"diameter": Q_(0.5, "in")}, context([top], [bot]))
    assert cap.value.magnitude == pytest.approx(480, abs=5)
    assert step(log, "Z_II").governs
    assert cap.spacing_min.to("in").magnitude == pytest.approx(2.0)  # 4D, Table 12.5.1C


def test_wood_bolt_double_shear():
    # NDS-2018 Table 12F: 1/2 in bolt, tm = 3-1/2 in, ts = 1-1/2 in, G = 0.50: Z∥ = 1230 lb (±5 lb).
    mid = rect("mid", 1.5, 0, 5.0, 12, wood())
    left = rect("left", 0, 0, 1.5, 12, wood())
    right = rect("right", 5.0, 0, 6.5, 12, wood())
    cap, _ = run(
        "wood_bolt", {"diameter": Q_(0.5, "in"), "planes": 2}, context([mid], [left, right], width=24)
    )
    assert cap.value.magnitude == pytest.approx(1230, abs=5)


def test_group_action_equation_properties():
    # NDS-2018 Eq. 11.3-1: Cg = 1 for one fastener, decreases with more fasteners in a row, ≤ 1.
    g = [group_action(n, 1.6e6 * 16.9, 1.6e6 * 8.25, 4.0, 180000 * 0.5**1.5)["Cg"] for n in (1, 2, 4, 8)]
    assert g[0] == 1.0
    assert all(a > b for a, b in zip(g, g[1:]))
    assert all(0 < x <= 1.0 for x in g)
    # Equal members, very stiff members: every fastener shares equally → Cg → 1.
    assert group_action(4, 1e15, 1e15, 4.0, 180000 * 0.5**1.5)["Cg"] == pytest.approx(1.0, abs=1e-3)


def test_wood_bolt_row_uses_group_action():
    top, bot = stacked()
    one, _ = run("wood_bolt", {"diameter": Q_(0.5, "in")}, context([top], [bot]))
    row, log = run(
        "wood_bolt",
        {"diameter": Q_(0.5, "in"), "row_count": 4, "row_spacing": Q_(4, "in")},
        context([top], [bot]),
    )
    assert row.value < one.value
    assert step(log, "Cg").result < 1.0
    with pytest.raises(ConnectorError):
        run("wood_bolt", {"diameter": Q_(0.5, "in"), "row_count": 4}, context([top], [bot]))


def test_wood_screw_uses_root_diameter():
    # NDS-2018 §12.3.7: threads in the shear plane → root diameter Dr in the equations (10g: 0.152 in).
    top, bot = stacked(t_top=0.75)
    cap, log = run("wood_screw", {"size": "10g", "length": Q_(2.5, "in")}, context([top], [bot]))
    assert step(log, "D").result.magnitude == pytest.approx(0.152)
    assert cap.value.magnitude > 0


def test_lag_screw_deducts_tip_and_checks_4d():
    top, bot = stacked(t_top=1.5, t_bot=5.5)
    cap, log = run("lag_screw", {"size": "1/2", "length": Q_(5, "in")}, context([top], [bot]))
    assert step(log, "lm").result.magnitude == pytest.approx(5 - 1.5 - 0.5)  # tip E = D assumed
    assert next(c for c in cap.checks if c.key.endswith("penetration")).status == "OK"


def test_plywood_specific_gravity_by_grade():
    # NDS-2018 Table 12.3.3B (from memory): Structural I plywood G = 0.50; other grades 0.42.
    from calcreport.model import Material

    s1 = Material(
        "ply", "Structural I plywood, 15/32 in", Q_(1.8e6, "psi"), family="plywood", extra={"grade": ""}
    )
    other = Material("ply2", "Rated sheathing", Q_(1.8e6, "psi"), family="plywood", extra={"grade": "C-D"})
    fl = rect("fl", 0, 10.5, 1.5, 12, wood())
    for mat, g in ((s1, 0.50), (other, 0.42)):
        web = rect("web", 1.5, 0, 1.5 + 15 / 32, 12, mat)
        _, log = run("nail", {"size": "10d common"}, context([fl], [web], width=1.5))
        assert step(log, "G_side").result == g
