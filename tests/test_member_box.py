"""Box beams with plywood webs: effective panel properties, flange axial checks, panel shear and
shear deflection, against hand calculations written out here.

Sources, per check:
* Effective properties of plywood parallel to the span: APA Panel Design Specification, table of
  plywood section properties per foot of width (Structural I, 23/32 in: A = 4.219 in²/ft, from
  memory — a test value; the job names its table);
* NDS 2018 §3.7.1, Eq. 3.7-1 (column stability factor CP, c = 0.8), §3.8.1 (ft ≤ Ft′), §3.9.1
  Eq. 3.9-1 (combined tension and bending), Table 2.3.2 (C_D = 1.15 for snow) — from memory;
* ASCE 7-16 §2.4.1 combination D + S (the job pins that edition; ASCE 7-22 has D + 0.7S) — from memory;
* mechanics of materials: transformed section, parallel-axis theorem, σ = M·y/I, v = V·Q/(I·n),
  shear deformation of a simple beam under uniform load Δs = w·L²/(8·G·Av).
"""

from __future__ import annotations

import math

import pytest

from calcreport.jobfile import load_text
from calcreport.solve import solve_job

JOB = """
[job]
project = "test"
[settings]
method = "ASD"
load_standard = "ASCE 7-16"
spacing_min = "1 in"
[[material]]
id = "df"
family = "wood"
E = "1600 ksi"
Fb = "900 psi"
Fv = "180 psi"
Ft = "575 psi"
Fc = "1350 psi"
Emin = "580 ksi"
G = 0.5
[[material]]
id = "ply"
family = "plywood"
E = "1800 ksi"
[material.panel]
table = "test table"
thickness = "23/32 in"
A = "4.219 in^2/ft"
Fv_tv = "250 lbf/in"
Gv_tv = "30000 lbf/in"
[[member]]
id = "B"
reference_material = "df"
{member}
[[member.part]]
id = "ww"
shape = "rect"
width = "23/32 in"
depth = "20 in"
material = "ply"
[[member.part]]
id = "bot"
shape = "lumber"
size = "2x6"
material = "df"
right_of = "ww"
align = "bottom"
[[member.part]]
id = "top"
shape = "lumber"
size = "2x6"
material = "df"
right_of = "ww"
align = "top"
[[member.part]]
id = "we"
shape = "rect"
width = "23/32 in"
depth = "20 in"
material = "ply"
right_of = "bot"
[[member.joint]]
id = "j"
holds = ["top"]
per_row = 2
[member.joint.connector]
type = "given"
value = "200 lbf"
source = "test value"
"""

SPAN = """span = "16 ft"
[member.design]
continuous_bracing = true
[[member.load]]
case = "D"
kind = "uniform"
w = "100 plf"
[[member.load]]
case = "S"
kind = "uniform"
w = "200 plf"
"""

T, H, F = 23 / 32, 20.0, 4.219 / (12 * 23 / 32)  # effective fraction of the web


def solve(member=SPAN, text=JOB):
    return solve_job(load_text(text.format(member=member).encode())).members[0]


def hand_I() -> float:
    """I about mid-depth in df units: flanges 1.5 × 5.5 at 20 − 5.5 apart; webs n·f·t·h³/12."""
    n = 1800 / 1600
    webs = 2 * n * F * T * H**3 / 12
    d = (H - 5.5) / 2
    flanges = 2 * (1.5 * 5.5**3 / 12 + 1.5 * 5.5 * d**2)
    return webs + flanges


def test_effective_panel_section_and_step():
    m = solve()
    assert m.section.inertia.to("in**4").magnitude == pytest.approx(hand_I())
    steps = {s.key: s for s in m.steps}
    f = steps["member.B.section.part.ww.f_panel"]
    assert f.result == pytest.approx(0.48916, abs=1e-5)  # 4.219 / (12 × 0.71875)
    assert "test table" in f.source
    # self-weight would use the gross area: the gross area is kept
    ww = next(p for p in m.section.parts if p.id == "ww")
    assert ww.area_gross.to("in**2").magnitude == pytest.approx(T * H)


def test_flange_tension_and_interaction_hand_calc():
    m = solve()
    c = {x.key.split("].", 1)[1]: x for x in m.checks}
    I = hand_I()
    M = (100 + 200) * 16**2 / 8 * 12  # lbf·in, D + S governs (C_D = 1.15)
    yc = (H - 5.5) / 2
    ft = M * yc / I
    chk = c["flange[bot].tension"]
    assert chk.demand.to("psi").magnitude == pytest.approx(ft, rel=1e-3)
    assert chk.capacity.to("psi").magnitude == pytest.approx(575 * 1.15)
    fb = M * (H / 2) / I - ft
    inter = ft / (575 * 1.15) + fb / (900 * 1.15)  # NDS 2018 Eq. 3.9-1
    assert c["flange[bot].tension_combined"].ratio == pytest.approx(inter, rel=1e-3)
    # top flange braced continuously: CP = 1, Fc′ = 1350 × 1.15
    assert c["flange[top].compression"].capacity.to("psi").magnitude == pytest.approx(1350 * 1.15)
    # no Fb check on box-beam flanges (they are axial members)
    assert not any(k.startswith("bending.") for k in c)


def test_compression_flange_cp_with_unbraced_length():
    member = SPAN.replace("continuous_bracing = true", 'unbraced_length = "48 in"')
    m = solve(member)
    c = {x.key.split("].", 1)[1]: x for x in m.checks}
    d = 1.5 + 2 * T  # flange and both webs
    FcE = 0.822 * 580000 / (48 / d) ** 2
    Fcs = 1350 * 1.15
    a = FcE / Fcs
    k = (1 + a) / 1.6
    CP = k - math.sqrt(k * k - a / 0.8)  # NDS 2018 Eq. 3.7-1
    assert c["flange[top].compression"].capacity.to("psi").magnitude == pytest.approx(Fcs * CP, rel=1e-6)
    assert c["flange[top].slenderness"].demand == pytest.approx(48 / d, abs=0.01)


def test_panel_shear_and_shear_deflection():
    m = solve()
    c = {x.key.split("].", 1)[1]: x for x in m.checks}
    I = hand_I()
    V = 300 * 16 / 2
    n = 1800 / 1600
    # Q at mid-depth: flange 1.5·5.5·7.25 + two webs n·f·t·10·5
    Q = 1.5 * 5.5 * (H - 5.5) / 2 + 2 * n * F * T * (H / 2) ** 2 / 2
    v = V * Q / (I * 2)
    ps = c["web_panel_shear"]
    assert ps.demand.to("lbf/in").magnitude == pytest.approx(v, rel=1e-3)
    assert ps.capacity.to("lbf/in").magnitude == pytest.approx(250 * 1.15)
    # Δs = w·L²/(8·G·Av) for the total load, GAv = 2 × 30,000 lbf/in × 20 in
    ds = (300 / 12) * (16 * 12) ** 2 / (8 * 2 * 30000 * 20)
    step = next(s for s in m.steps if s.key.endswith("shear_deflection.total.segment1.ds"))
    assert step.result.to("in").magnitude == pytest.approx(ds, rel=0.01)


def test_shear_only_box_lists_flange_checks_as_not_checked():
    m = solve('shear = "2 kip"')
    nc = {u.key: u for u in m.not_checked}
    assert "no moment" in nc["member[B].flange_axial"].reason
    assert "member[B].splices" in nc
    ps = next(x for x in m.checks if x.key.endswith("web_panel_shear"))
    assert ps.capacity.to("lbf/in").magnitude == pytest.approx(250)  # C_D = 1.0 assumed, stated


def test_panel_thickness_must_match_the_part():
    from calcreport.solve.results import SolveError

    with pytest.raises(SolveError, match="panel"):
        solve(text=JOB.replace('thickness = "23/32 in"\nA =', 'thickness = "15/32 in"\nA ='))


def test_panel_needs_one_of_a_or_effective_thickness():
    from calcreport.errors import JobError

    with pytest.raises(JobError, match="thickness_effective or A"):
        solve(text=JOB.replace('A = "4.219 in^2/ft"\n', ""))


def test_web_in_plane_stress_against_panel_axial_capacity():
    text = JOB.replace(
        'Gv_tv = "30000 lbf/in"\n', 'Gv_tv = "30000 lbf/in"\nFt_A = "3500 lbf/ft"\nFc_A = "4000 lbf/ft"\n'
    )
    m = solve(text=text)
    c = {x.key.split("].", 1)[1]: x for x in m.checks}
    # f = n·M·c/I at the web edge (c = 10 in), n = 1800/1600; F′ = Ft·A / A × C_D (APA PDS)
    M = 300 * 16**2 / 8 * 12
    f = 1800 / 1600 * M * 10 / hand_I()
    t = c["web_axial.ply.tension"]
    assert t.demand.to("psi").magnitude == pytest.approx(f, rel=1e-3)
    assert t.capacity.to("psi").magnitude == pytest.approx(3500 / 4.219 * 1.15, rel=1e-6)
    assert c["web_axial.ply.compression"].capacity.to("psi").magnitude == pytest.approx(4000 / 4.219 * 1.15)
