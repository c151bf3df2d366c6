"""Plies side by side and flitch beams (issue 14): load sharing by E·I, transfer demand, fastener
values, reader refusals, reports.

Sources named beside each check. Load sharing by stiffness (equal deflection of fastened plies,
share_i = E_i·I_i / Σ E·I) is common practice, no source; the bending of each ply about its own
axis and the statics of a free body are mechanics of materials.
"""

from __future__ import annotations

import math

import pytest
from ply_jobs import BOLTS, MATERIALS, NAILS, flitch, load, member, ply, point, three_ply_side, two_ply_side

from calcreport.outputs.fmt import Display
from calcreport.outputs.phrases import check_note
from calcreport.pipeline import solve_bytes


def solved(text: str):
    return solve_bytes(text.encode(), "job.toml").members[0]


def step(m, suffix: str):
    hits = [s for s in m.steps if s.key.endswith(suffix)]
    assert hits, suffix
    return hits[0]


def mag(q, unit: str) -> float:
    return float(q.to(unit).magnitude)


def _demand_at(j, x_in: float) -> float:
    """The line's transfer demand t(x) (lbf/in) at x, from its schedule's demand grid."""
    import numpy as np

    xs = np.asarray(j.schedule.x.to("inch").magnitude)
    q = np.asarray(j.schedule.demand.to("lbf/inch").magnitude)
    return float(q[int(np.abs(xs - x_in).argmin())])


# --- load sharing by E·I, hand calculations ---------------------------------------------------


def test_flitch_shares_by_EI_against_a_hand_calculation():
    # Hand calculation (mechanics of materials; sharing: common practice, no source):
    # 2x12 dressed 1.5 x 11.25 in (ASTM D245 / NDS Supplement Table 1B dressed sizes):
    I_w = 1.5 * 11.25**3 / 12  # 177.98 in^4
    I_p = 0.5 * 11.0**3 / 12  # 55.46 in^4
    EI_w, EI_p = 1.6e6 * I_w, 29e6 * I_p
    total = 2 * EI_w + EI_p
    s_w, s_p = EI_w / total, EI_p / total  # 0.1308, 0.7385
    m = solved(flitch())
    assert step(m, "plies.w1.share").result == pytest.approx(s_w, rel=1e-9)
    assert step(m, "plies.pl.share").result == pytest.approx(s_p, rel=1e-9)
    assert step(m, "plies.w1.share").result + step(m, "plies.pl.share").result + step(
        m, "plies.w2.share"
    ).result == pytest.approx(1.0)
    # the analysis uses Σ E·I, not the transformed section of plies acting compositely
    assert mag(step(m, "beam.EI").result, "lbf*inch**2") == pytest.approx(total, rel=1e-9)
    # Top-loaded: the 11 in plate set flush at the bottom stays below the 11.25 in timbers' tops,
    # so the load bears on the timbers (1/2 each); the bolts pass the plate's share to it:
    # a_1 = 0.5 − s_w across w1|pl. D + L = 700 plf = 58.33 lbf/in (ASCE 7-22 §2.4.1 combination 2).
    a1 = 0.5 - s_w
    t = 700 / 12 * a1  # 21.54 lbf/in
    (j,) = m.joints
    assert j.id == "w1-pl-w2" and j.Q is None
    assert _demand_at(j, 84.0) == pytest.approx(t, rel=1e-6)  # midspan, away from the bearings
    # Bolts at the bearings: the plate is not relied on to bear, so its part of the reaction
    # R = 700 plf × 14 ft / 2 = 4900 lbf crosses each interface as R·a_1 within d of the support
    T = step(m, "bearings.support1.T").result
    assert mag(T, "lbf") == pytest.approx(4900 * a1, rel=1e-3)
    rows = step(m, "bearings.support1.n_req").result
    assert rows == math.ceil(4900 * a1 / mag(j.capacity_row, "lbf"))
    c = next(c for c in j.checks if c.key.endswith("bearing[1].fasteners"))
    assert c.status == "OK" and c.capacity >= rows


def test_side_loaded_three_ply_interfaces_carry_two_thirds_and_one_third():
    # Equal plies share 1/3 each; a face load w on ply 1 crosses p1|p2 as w·(1 − 1/3) and p2|p3
    # as w·1/3 (statics). D + L = 350 plf = 29.17 lbf/in.
    m = solved(three_ply_side())
    q = {j.id: mag(j.shear_flow, "lbf/inch") for j in m.joints}
    assert q["p1-p2"] == pytest.approx(350 / 12 * 2 / 3, rel=1e-6)
    assert q["p3-p2"] == pytest.approx(350 / 12 / 3, rel=1e-6)


def test_two_plies_of_different_stiffness_share_by_EI():
    # 2x12 DF (E = 1.6e6 psi, b = 1.5 in) beside a 1.75 x 11.25 in LVL (E = 2.0e6 psi): equal
    # depths, so share_LVL = 2.0·1.75 / (2.0·1.75 + 1.6·1.5) = 0.5932; a face load on the 2x12
    # crosses the interface as w·share_LVL (hand calculation, common practice, no source).
    text = member(
        "M1",
        "10 ft",
        ply("a", 'size = "2x12"') + ply("b", 'width = "1.75 in"\ndepth = "11.25 in"', "lvl"),
        NAILS.format(size="10d common", extra=""),
        load("D", "240 plf", "left_face"),
        "continuous_bracing = true",
    )
    m = solved(text)
    share = 2.0 * 1.75 / (2.0 * 1.75 + 1.6 * 1.5)
    assert step(m, "plies.b.share").result == pytest.approx(share, rel=1e-9)
    # D alone: C_D = 0.9 (NDS 2018 Table 2.3.2) against the nails' C_D = 1.0 → demand × 1/0.9
    (j,) = m.joints
    assert mag(j.shear_flow, "lbf/inch") == pytest.approx(240 / 12 * share / 0.9, rel=1e-6)


def test_top_loaded_equal_plies_need_only_the_practice_minimum():
    text = member(
        "H1",
        "6 ft",
        ply("a", 'size = "2x10"') + ply("b", 'size = "2x10"'),
        NAILS.format(size="10d common", extra=""),
        load("D", "300 plf", "top"),
        "continuous_bracing = true",
    )
    m = solved(text)
    (j,) = m.joints
    assert mag(j.shear_flow, "lbf/inch") == pytest.approx(0.0, abs=1e-9)
    # the spacing is the default largest spacing (12 in for nails, common practice, no source)
    assert mag(j.spacing_provided, "inch") == pytest.approx(12.0)
    info = [c for c in m.checks if c.key.endswith("ply_minimum")]
    assert info and info[0].status == "INFO" and info[0].ratio is None  # never the design result
    assert any(a.key.endswith("ply_fastening.spacing_max") for a in m.assumed)


def test_ply_bending_and_shear_use_the_share_and_the_job_factors():
    # 3-ply 2x12, D 100 + L 250 plf on 10 ft: M = 350·10²/8 = 4375 lbf·ft; each ply 1/3;
    # S = 1.5·11.25²/6 = 31.64 in³ → fb = 4375·12/3/31.64 = 553.1 psi; Fb′ = 900 psi
    # (C_D = 1.0 for D + L, NDS 2018 Table 2.3.2; CF = 1.0; CL = 1.0 braced).
    m = solved(three_ply_side())
    c = next(c for c in m.checks if c.key == "member[H3].bending.p1")
    assert mag(c.demand, "psi") == pytest.approx(4375 * 12 / 3 / (1.5 * 11.25**2 / 6), rel=1e-6)
    assert mag(c.capacity, "psi") == pytest.approx(900.0)
    v = next(c for c in m.checks if c.key == "member[H3].shear.p1")
    # V = 350·10/2 = 1750 lbf; fv = 1.5·(1750/3)/(1.5·11.25) = 51.85 psi (NDS 2018 Eq. 3.4-2)
    assert mag(v.demand, "psi") == pytest.approx(1.5 * 1750 / 3 / (1.5 * 11.25), rel=1e-6)


def test_nails_between_plies_have_their_table_value():
    # 16d common (0.162 in x 3-1/2 in) through a 1-1/2 in side member, G = 0.50: Z = 141 lbf,
    # NDS 2018 Table 12N (from memory); two rows → 282 lbf per row.
    m = solved(three_ply_side())
    j = m.joints[0]
    assert mag(j.capacity, "lbf") == pytest.approx(141, abs=1.0)
    assert mag(j.capacity_row, "lbf") == pytest.approx(2 * mag(j.capacity, "lbf"))


def test_flitch_bolts_bear_perpendicular_to_grain_in_the_timbers():
    # Fe⊥ = 6100·G^1.45/√D (NDS 2018 Table 12.3.3 footnote 2) = 3157 psi for G = 0.50, D = 1/2 in;
    # Table 12.3.3 lists 3150 psi (from memory). Hankinson at 90° gives Fe⊥ itself.
    m = solved(flitch())
    j = m.joints[0]
    fe = [s for s in j.steps if s.key.endswith("connector.Fes")]
    assert fe and mag(fe[0].result, "psi") == pytest.approx(6100 * 0.5**1.45 / math.sqrt(0.5), rel=1e-6)
    assert any(s.key.endswith(".F_plane") for s in j.steps)  # double shear, per plane
    assert not any("V·Q/I" in (s.symbol + s.template) for s in j.steps)


def test_flitch_plate_flexure_F11_and_its_bracing_assumption():
    # AISC 360-16 F11: 1/2 x 11 in A36, Lb = largest bolt spacing; Lb·d/t² above 0.08E/Fy = 64.4,
    # so F11-2: Mn = Cb·[1.52 − 0.274·(Lb·d/t²)·Fy/E]·Fy·Sx ≤ Fy·Z.
    m = solved(flitch())
    c = next(c for c in m.checks if c.key == "member[F1].plate_flexure.pl")
    Lb = max(mag(z.spacing, "inch") for z in m.joints[0].schedule.zones)
    lam = Lb * 11 / 0.25
    My, Mp = 36000 * 0.5 * 121 / 6, 36000 * 0.5 * 121 / 4
    Mn = min(Mp, (1.52 - 0.274 * lam * 36 / 29000) * My) if lam > 0.08 * 29000 / 36 else Mp
    assert mag(c.capacity, "lbf*inch") == pytest.approx(Mn / 1.67, rel=1e-6)
    assert any("braced laterally by the timbers" in a.label for a in m.assumed)


def test_point_load_on_the_timbers_gets_bolts_within_its_transfer_length():
    m = solved(flitch(post=point("L", "2000 lbf", "7 ft", "top", 'id = "post"')))
    j = m.joints[0]
    c = next(c for c in j.checks if c.key.endswith("load[post].fasteners"))
    # T = 2000·(0.5 − s_w) = 738 lbf (D + L) → one row of two bolts (2 × 436 lbf) within ℓt
    assert c.demand == 1 and c.status == "OK"
    assert any(a.key.endswith("load[post].transfer_length") for a in m.assumed)


# --- refusals: one line, file and key, exit 2 ---------------------------------------------------


def _refused(write_job, cli, text: str, *words: str) -> str:
    code, out, err = cli("check", write_job(text))
    assert code == 2 and out == "", (code, out, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in err, err
    for w in words:
        assert w in lines[0], (w, lines[0])
    return lines[0]


PLIES2 = ply("a", 'size = "2x10"') + ply("b", 'size = "2x10"')


@pytest.mark.parametrize(
    ("text", "words"),
    [
        (member("X", "8 ft", PLIES2, NAILS.format(size="10d common", extra=""), load("D", "1 klf", "top").replace('enters = "top"', "")), ("load[1]", "enters")),
        (member("X", "8 ft", PLIES2, NAILS.format(size="10d common", extra=""), load("D", "1 klf", "ply", 'ply = "zz"')), ("ply", "zz")),
        (member("X", "8 ft", PLIES2, NAILS.format(size="10d common", extra=""), load("D", "1 klf", "ply")), ("enters", "ply = the id")),
        (member("X", "8 ft", PLIES2, NAILS.format(size="10d common", extra=""), load("D", "1 klf", "top", 'ply = "a"')), ("ply",)),
        (member("X", "8 ft", PLIES2, NAILS.format(size="10d common", extra=""), load("D", "1 klf", "top", 'transfer_length = "1 ft"')), ("transfer_length", "point loads")),
        (member("X", "8 ft", PLIES2, "", load("D", "1 klf", "top")), ("member[X]", "ply_fastening")),
        (member("X", "8 ft", PLIES2, BOLTS.replace("through = true", ""), load("D", "1 klf", "top")), ("through",)),
        (member("X", "8 ft", PLIES2 + ply("c", 'size = "2x10"') + ply("d", 'size = "2x10"'), BOLTS, load("D", "1 klf", "top")), ("ply", "2 to 3 plies")),
        (member("X", "8 ft", ply("a", 'thickness = "1/2 in"\ndepth = "9 in"') + ply("b", 'size = "2x10"'), BOLTS, load("D", "1 klf", "top")), ("thickness", "steel flitch plate")),
        (member("X", "8 ft", ply("a", 'size = "2x10"\nwidth = "2 in"') + ply("b", 'size = "2x10"'), BOLTS, load("D", "1 klf", "top")), ("width", "exactly one")),
        (member("X", "8 ft", PLIES2 + ply("c", 'size = "2x10"'), NAILS.format(size="16d common", extra='face = "right"'), load("D", "1 klf", "top")), ("face",)),
        (member("X", "8 ft", PLIES2, NAILS.format(size="10d common", extra=""), '\n[[member.load]]\ncase = "L"\nkind = "point"\nP = "1 kip"\nmoving = true\nenters = "top"\n'), ("moving",)),
        (MATERIALS + '\n[[member]]\nid = "X"\nshear = "2 kip"\n' + PLIES2 + NAILS.format(size="10d common", extra=""), ("shear", "span")),
        (MATERIALS + '\n[[member]]\nid = "X"\nspan = "8 ft"\n[[member.part]]\nid = "p"\nshape = "lumber"\nsize = "2x10"\nmaterial = "df2"\n' + load("D", "1 klf", "top"), ("enters", "[[member.ply]]")),
        (member("X", "8 ft", PLIES2 + '\n[[member.part]]\nid = "p"\nshape = "lumber"\nsize = "2x10"\nmaterial = "df2"\n', NAILS.format(size="10d common", extra=""), load("D", "1 klf", "top")), ("part", "not both")),
    ],
)  # fmt: skip
def test_inconsistent_ply_input_is_refused_in_one_line(write_job, cli, text, words):
    _refused(write_job, cli, text, *words)


def test_a_joint_on_a_member_of_plies_is_refused(write_job, cli):
    text = (
        two_ply_side()
        + '\n[[member.joint]]\nid = "j"\nholds = ["a"]\n[member.joint.connector]\ntype = "nail"\nsize = "10d common"\n'
    )
    # TOML: the joint table follows the member's last table, so it belongs to the member
    _refused(write_job, cli, text, "joint", "ply_fastening")


# --- reports -------------------------------------------------------------------------------------


@pytest.mark.parametrize(
    "text", [two_ply_side(), three_ply_side(), flitch(post=point("L", "1500 lbf", "7 ft", "top"))]
)
def test_members_of_plies_build_complete_reports(write_job, cli, tmp_path, text):
    from pypdf import PdfReader

    path = write_job(text)
    out = tmp_path / "out"
    code, stdout, err = cli("build", path, "-o", str(out))
    assert code in (0, 1) and "Traceback" not in err, err
    pdf = out / "job.pdf"
    body = "\n".join(p.extract_text() or "" for p in PdfReader(str(pdf)).pages)
    for words in ("Load sharing between plies", "Fasteners between plies", "transfer demand", "share"):
        assert words in body, words
    assert "NDS 2018" in body and "not checked" in body.lower()


def test_bearing_of_the_plies_with_a_bearing_length_and_Fc_perp():
    # NDS 2018 §3.10.2: fc⊥ = R_i/(b·lb); 3 equal plies, R = 350 plf × 10 ft / 2 = 1750 lbf, each ply
    # its share 1/3 on lb = 3 in: 583.3/(1.5 × 3) = 129.6 psi against Fc⊥′ = 625 psi (DF-L,
    # NDS Supplement Table 4A, from memory; no C_D for Fc⊥, Table 4.3.1; Cb = 1.0 taken).
    text = three_ply_side().replace("G = 0.50\n", 'G = 0.50\nFc_perp = "625 psi"\n', 1)
    text = text.replace("continuous_bracing = true", 'continuous_bracing = true\nbearing_length = "3 in"')
    m = solved(text)
    c = next(c for c in m.checks if c.key == "member[H3].bearing.support1")
    assert mag(c.demand, "psi") == pytest.approx(1750 / 3 / (1.5 * 3), rel=1e-6)
    assert mag(c.capacity, "psi") == pytest.approx(625.0)
    assert not any(u.key.endswith(".bearing") for u in m.not_checked)
    # without a bearing length the bearing is listed as not checked, with the reason
    m2 = solved(three_ply_side())
    assert any(u.key.endswith(".bearing") and "bearing_length" in u.reason for u in m2.not_checked)


def test_Fc_perp_without_a_ply_bearing_check_warns(write_job, cli):
    text = three_ply_side().replace("G = 0.50\n", 'G = 0.50\nFc_perp = "625 psi"\n', 1)
    code, out, err = cli("check", write_job(text))
    assert code in (0, 1) and "Fc_perp" in err and "warning" in err and "bearing_length" in err


def test_plies_under_the_en_1995_route_are_refused(write_job, cli):
    """Members of plies are designed by NDS 2018 only: under method = "EC5" their fastener demand
    would be weighted by NDS load-duration factors against a k_mod value — refused in one line."""
    text = three_ply_side().replace('units = "US"\n', 'units = "US"\nmethod = "EC5"\nservice_class = 2\n', 1)
    code, out, err = cli("check", write_job(text))
    assert code == 2, (out, err)
    lines = err.strip().splitlines()
    assert "Traceback" not in err and any("NDS 2018" in ln and "ply" in ln for ln in lines), err


def test_what_stability_rests_on_is_listed_never_none():
    # Common practice of plan review, no source: a checker expects the lateral bracing the
    # stability checks take for granted to be named. The flitch plate's F11 check takes Lb = the
    # bolt spacing (braced by the timbers at each bolt); AISC 360-16 Appendix 6 covers the bracing
    # of beams (from memory).
    from calcreport.outputs.scope_text import not_checked_line
    from tests.conftest import ROOT

    for name in ("boardwalk-flitch-beam", "boathouse-mezzanine-3-ply"):
        m = solve_bytes((ROOT / "jobs" / f"{name}.toml").read_bytes(), f"{name}.toml").members[0]
        u = {u.key: u for u in m.not_checked}[f"member[{m.id}].bracing"]
        assert "continuous_bracing" in u.reason and "engineer's to confirm" in u.reason
        assert ("F11" in u.reason) == (name == "boardwalk-flitch-beam")
        assert "Appendix 6" in u.clause if name == "boardwalk-flitch-beam" else "§3.3.3" in u.clause
        assert "none listed" not in not_checked_line(m)
    # without a bracing statement the reason says the whole span is taken as unbraced
    m = solved(flitch().replace("continuous_bracing = true\n", ""))
    u = {u.key: u for u in m.not_checked}[f"member[{m.id}].bracing"]
    assert "whole span unbraced" in u.reason


def test_bearing_zone_rows_are_labelled_ld_not_lt():
    # The stretch within d of an end support clipped to the member is d itself; d = 11.25 in, the
    # dressed depth of a 2x12 (NDS Supplement Table 1B, from memory). ℓt is a point load's transfer
    # length only (common practice, no source: the two stretches have different origins).
    from tests.conftest import ROOT

    m = solve_bytes((ROOT / "jobs" / "boardwalk-flitch-beam.toml").read_bytes(), "f.toml").members[0]
    j = m.joints[0]
    bearing = [c for c in j.checks if ".bearing[" in c.key]
    points = [c for c in j.checks if ".load[" in c.key and c.key.endswith(".fasteners")]
    assert bearing and points
    d = Display()  # the note as the outputs word it (the solver carries the symbol and s as data)
    for c in bearing:
        assert "ℓt" not in c.label + check_note(c, d) and "ℓd" in check_note(c, d)
    for c in points:
        assert "ℓt" in check_note(c, d) and "ℓd" not in check_note(c, d)
    for i in (1, 2):
        assert mag(step(j, f"bearings.support{i}.ld").result, "inch") == pytest.approx(11.25)
        assert "ℓt" not in (step(j, f"bearings.support{i}.n_req").note or "")
