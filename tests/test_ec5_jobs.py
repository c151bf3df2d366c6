"""Jobs with settings.method = "EC5": EN 1990 combinations with ψ per load case, k_mod of the
shortest-duration load in each combination, keys that have no effect under the method, refused
connector types, and the SI demo job built to a full report with its status earned.

Sources: EN 1990:2002 §6.4.3.2 expression (6.10) with Table A1.2(B) recommended γ_G = 1.35 / 1.00,
γ_Q = 1.5; (6.14b) characteristic and (6.16b) quasi-permanent combinations; EN 1995-1-1:2004
§3.1.3(2) and Table 3.1 (k_mod). Values of the factors recalled from memory, as in docs/sources.md.
"""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

from calcreport.errors import JobError
from calcreport.model import LoadCaseFactors as F
from calcreport.pipeline import solve_bytes
from calcreport.solve.ec5_combinations import (
    MissingFactor,
    characteristic_sets,
    quasi_permanent_set,
    uls_combinations,
)

DEMO = Path(__file__).resolve().parent.parent / "jobs" / "boardwalk-nailed-tee-ec5.toml"
CASES = {
    "L": F("L", "medium", 0.7, 0.6),
    "S": F("S", "short", 0.5, 0.0),
    "W": F("W", "instantaneous", 0.6, 0.0),
}


def test_uls_6_10_with_psi0_per_case():
    combos = uls_combinations(["D", "L", "S", "W"], CASES)
    got = {c.name: c.factors for c in combos}
    # 1.35G; 1.35G + 1.5Q1 + 1.5·ψ0·Qi for each leading Q1; 1.0G + 1.5W (G favourable)
    assert got == {
        "EC5 1: 1.35D": {"D": 1.35},
        "EC5 2: 1.35D + 1.5L + 0.75S + 0.9W": {"D": 1.35, "L": 1.5, "S": 0.75, "W": 0.9},
        "EC5 3: 1.35D + 1.5S + 1.05L + 0.9W": {"D": 1.35, "S": 1.5, "L": 1.05, "W": 0.9},
        "EC5 4: 1.35D + 1.5W + 1.05L + 0.75S": {"D": 1.35, "W": 1.5, "L": 1.05, "S": 0.75},
        "EC5 5: D + 1.5W": {"D": 1.0, "W": 1.5},
    }
    assert all("(6.10)" in c.source for c in combos)


def test_sls_characteristic_and_quasi_permanent():
    sets = characteristic_sets(["D", "L", "S"], CASES)
    assert [f for f, _ in sets] == [{"D": 1.0, "L": 1.0, "S": 0.5}, {"D": 1.0, "S": 1.0, "L": 0.7}]
    f, _ = quasi_permanent_set(["D", "L", "S"], CASES)
    assert f == {"D": 1.0, "L": 0.6}  # ψ2 of snow 0 drops it


def test_missing_psi_is_named():
    with pytest.raises(MissingFactor) as e:
        uls_combinations(["D", "L", "S"], {"L": F("L", "medium", None), "S": F("S", "short", 0.5)})
    assert e.value.case == "L" and e.value.key == "psi0"


JOB = """
[job]
project = "Harbourside Community Boathouse"

[settings]
units = "SI"
method = "EC5"
service_class = 1
{settings}

[[settings.load_case]]
case = "L"
duration = "medium"
psi0 = 0.7
psi2 = 0.3

[[material]]
id = "c24"
family = "wood"
E = "11 GPa"
rho_k = "350 kg/m^3"

[[member]]
id = "B1"
span = "3 m"

[[member.load]]
case = "D"
kind = "uniform"
w = "{wd}"

[[member.load]]
case = "L"
kind = "uniform"
w = "{wl}"

[[member.part]]
id = "web"
shape = "rect"
width = "75 mm"
depth = "225 mm"
material = "c24"

[[member.part]]
id = "flange"
shape = "rect"
width = "150 mm"
depth = "38 mm"
material = "c24"
on = "web"

[[member.joint]]
id = "j"
holds = ["flange"]

[member.joint.connector]
type = "nail"
diameter = "3.1 mm"
length = "76 mm"
fu = "600 MPa"
{connector}
"""


def job(settings="", connector="", wd="0.5 kN/m", wl="1.5 kN/m") -> bytes:
    return JOB.format(settings=settings, connector=connector, wd=wd, wl=wl).encode()


def _joint(res):
    return res.members[0].joints[0]


def _steps(jr, suffix):
    return [s for s in jr.steps if s.key.endswith(suffix)]


def test_k_mod_of_each_combination_scales_the_demand():
    # The nail value uses k_mod = 0.8 (medium, shortest of D and L); combination 1.35D alone has
    # k_mod = 0.6 (permanent), so its shear is scaled by 0.8 / 0.6 before the envelope is taken.
    # With a heavy dead load (5 kN/m) and a light imposed load (0.2 kN/m): 1.35 × 5 × 4/3 = 9.0
    # against 1.35 × 5 + 1.5 × 0.2 = 7.05 kN/m — the permanent combination governs the spacing.
    res = solve_bytes(job(wd="5 kN/m", wl="0.2 kN/m"), "t.toml")
    jr = _joint(res)
    km = {s.label: s.result for s in jr.steps if ".duration.kmod." in s.key}
    assert km == {"k_mod of EC5 1: 1.35D": 0.6, "k_mod of EC5 2: 1.35D + 1.5L": 0.8}
    V = _steps(jr, ".duration.V")[0]
    wl = 1.35 * 5.0 * 0.8 / 0.6  # kN/m, governing, weighted
    assert V.result.to("kN").magnitude == pytest.approx(wl * 3.0 / 2, rel=1e-3)
    assert "EC5 1" in V.values["by"]
    cap = _steps(jr, ".connector.FvRd")[0].result.to("N").magnitude
    assert cap == pytest.approx(0.8 * 756.1 / 1.3, rel=5e-4)  # hand calculation, test_ec5_connectors.py


def test_member_status_rests_on_checks_that_ran():
    res = solve_bytes(job(), "t.toml")
    m = res.members[0]
    keys = {u.key for u in m.not_checked}
    assert "member[B1].shear.neutral_axis" in keys
    assert any(k.startswith("member[B1].bending") for k in keys)
    assert all("EN 1995-1-1" in u.clause for u in m.not_checked if "bending" in u.key or "shear" in u.key)
    # no NDS or AISC member check ran under EC5
    assert not any("NDS" in (c.source or "") or "AISC" in (c.source or "") for c in m.checks)


@pytest.mark.parametrize(
    "settings, connector, key, words",
    [
        ("", "CD = 1.15", "CD", "NDS 2018 key"),
        ("", "G_side = 0.42", "G_side", "NDS 2018 key"),
        ('load_standard = "ASCE 7-16"', "", "load_standard", "EN 1990"),
        ("load_duration = 1.15", "", "load_duration", "k_mod"),
    ],
)
def test_keys_without_effect_under_ec5_are_errors(settings, connector, key, words):
    with pytest.raises(JobError) as e:
        solve_bytes(job(settings, connector), "t.toml")
    assert key in str(e.value.key) + str(e.value) and words in str(e.value)


def test_ec5_keys_refused_in_an_asd_job():
    text = job(connector="").decode().replace('method = "EC5"\nservice_class = 1', 'method = "ASD"')
    with pytest.raises(JobError) as e:
        solve_bytes(text.encode(), "t.toml")
    assert "EC5" in str(e.value)


def test_missing_load_case_and_service_class_are_named():
    text = (
        job()
        .decode()
        .replace(
            'case = "L"\nduration = "medium"\npsi0 = 0.7\npsi2 = 0.3\n',
            'case = "X"\nduration = "medium"\npsi0 = 0.7\n',
        )
    )
    with pytest.raises(JobError) as e:
        solve_bytes(text.encode(), "t.toml")
    assert "'L'" in str(e.value) and "load_case" in str(e.value)
    text = job().decode().replace("service_class = 1\n", "")
    with pytest.raises(JobError) as e:
        solve_bytes(text.encode(), "t.toml")
    assert "service_class" in str(e.value) or "service_class" in str(e.value.key)


def test_connector_without_an_ec5_route_is_refused():
    text = (
        job()
        .decode()
        .replace(
            'type = "nail"\ndiameter = "3.1 mm"\nlength = "76 mm"\nfu = "600 MPa"',
            'type = "glue"\ntau = "1 MPa"',
        )
    )
    with pytest.raises(JobError) as e:
        solve_bytes(text.encode(), "t.toml")
    assert "no EC5 route" in str(e.value)


def test_demo_builds_a_full_report(tmp_path):
    out = subprocess.run(
        [sys.executable, "-m", "calcreport", "build", str(DEMO), "-o", str(tmp_path)],
        capture_output=True,
        text=True,
    )
    assert out.returncode == 0, out.stderr
    pdf = tmp_path / "boardwalk-nailed-tee-ec5.pdf"
    assert pdf.stat().st_size > 10_000
    res = solve_bytes(DEMO.read_bytes(), DEMO.name)
    m = res.members[0]
    assert m.status == "OK"
    jr = m.joints[0]
    assert jr.status == "OK" and jr.capacity.to("N").magnitude == pytest.approx(0.9 * 756.1 / 1.3, rel=5e-4)


def test_demo_with_fewer_nails_is_ng():
    # Two nails per row instead of three: the required spacing falls below a1 = 10d (Table 8.2)
    text = DEMO.read_text().replace("per_row = 3", "per_row = 2")
    res = solve_bytes(text.encode(), DEMO.name)
    assert res.members[0].joints[0].status == "NG" and res.members[0].status == "NG"


STRENGTHS = 'f_m_k = "24 MPa"\nf_t_0_k = "14.5 MPa"\nf_c_0_k = "21 MPa"\nf_v_k = "4.0 MPa"\n'


def test_single_joist_bending_and_shear_against_hand_calculation():
    # EN 1995-1-1 §6.1.6 (6.11) and §6.1.7 (6.13), C24 (EN 338:2016 f_m,k 24, f_v,k 4.0 MPa — from
    # memory), 75 × 225 mm, 4 m simple span, g = 1 kN/m (permanent), q = 2 kN/m (medium), SC1.
    # 1.35g: w = 1.35 kN/m, M = 1.35 × 16/8 = 2.70 kN·m with k_mod 0.6 → M/k_mod = 4.50
    # 1.35g + 1.5q: w = 4.35 kN/m, M = 8.70 kN·m with k_mod 0.8 → 10.875: governs
    # W = 75 × 225²/6 = 632,812.5 mm³; σ_m,d = 8.70e6 / 632,812.5 = 13.748 N/mm²
    # f_m,d = 0.8 × 24 / 1.3 = 14.769 N/mm² (k_h = 1, h ≥ 150 mm); ratio 0.9309
    # V = 4.35 × 2 = 8.70 kN; b_ef = 0.67 × 75 = 50.25 mm; τ_d = 1.5 × 8700 / (50.25 × 225) = 1.1542
    # f_v,d = 0.8 × 4.0 / 1.3 = 2.4615 N/mm²; ratio 0.4689
    text = job(wd="1 kN/m", wl="2 kN/m").decode()
    text = text.replace('rho_k = "350 kg/m^3"\n', 'rho_k = "350 kg/m^3"\n' + STRENGTHS)
    text = text.replace('span = "3 m"', 'span = "4 m"')
    head, _, _ = text.partition('[[member.part]]\nid = "flange"')
    text = head.replace('id = "web"', 'id = "joist"')
    res = solve_bytes(text.encode(), "t.toml")
    checks = {c.key: c for c in res.members[0].checks}
    b = checks["member[B1].bending.c24"]
    assert b.ratio == pytest.approx(13.748 / 14.769, rel=2e-4) and b.status == "OK"
    s = checks["member[B1].shear.neutral_axis"]
    assert s.demand.to("N/mm**2").magnitude == pytest.approx(1.1542, rel=2e-4)
    assert s.ratio == pytest.approx(1.1542 / 2.4615, rel=2e-4)
    assert not any(
        u.key.endswith((".bending.c24", ".shear.neutral_axis")) for u in res.members[0].not_checked
    )


def test_tee_beam_parts_in_bending_with_axial_stress_hand_calculation():
    # EN 1995-1-1 §6.2.3 (6.17) web in tension, §6.2.4 (6.19) flange in compression; k_h (3.1).
    # Section (mechanics of materials): web 75 × 225 (y 0–225), flange 150 × 38 on top (y 225–263)
    A1, y1, A2, y2 = 75 * 225, 112.5, 150 * 38, 244.0
    yb = (A1 * y1 + A2 * y2) / (A1 + A2)  # 145.70 mm
    inertia = 75 * 225**3 / 12 + A1 * (y1 - yb) ** 2 + 150 * 38**3 / 12 + A2 * (y2 - yb) ** 2
    M = (1.35 * 0.5 + 1.5 * 1.5) * 3.0**2 / 8 * 1e6  # N·mm, 1.35g + 1.5q governs (k_mod 0.8)
    fm, ft, fc = 0.8 * 24 / 1.3, 0.8 * 14.5 / 1.3, 0.8 * 21 / 1.3
    web = M * (yb - y1) / inertia / ft + M * 112.5 / inertia / fm
    kh = min((150 / 38) ** 0.2, 1.3)  # = 1.3 (flange 38 mm deep, solid timber)
    flange = (M * (y2 - yb) / inertia / fc) ** 2 + M * 19 / inertia / (kh * fm)
    text = (
        job(wd="0.5 kN/m", wl="1.5 kN/m")
        .decode()
        .replace('rho_k = "350 kg/m^3"\n', 'rho_k = "350 kg/m^3"\n' + STRENGTHS)
    )
    res = solve_bytes(text.encode(), "t.toml")
    b = next(c for c in res.members[0].checks if c.key == "member[B1].bending.c24")
    assert b.ratio == pytest.approx(max(web, flange), rel=2e-4)
    steps = {s.key.split(".ec5.")[-1]: s for s in res.members[0].steps if ".ec5." in s.key}
    assert steps["bending.flange.kh"].result == pytest.approx(1.3)
    assert steps["bending.web.u"].result == pytest.approx(web, rel=2e-4)
    assert steps["bending.flange.u"].result == pytest.approx(flange, rel=2e-4)


def test_ec5_settings_without_effect_warn():
    from calcreport.jobfile import load_text

    text = (
        job()
        .decode()
        .replace(
            "[[material]]",
            '[[settings.load_case]]\ncase = "S"\nduration = "short"\npsi0 = 0.5\n\n[[material]]',
            1,
        )
    )
    warned = {w.key: w.message for w in load_text(text.encode(), "t.toml").warnings}
    assert any("settings.load_case" in k and "case 'S'" in m for k, m in warned.items())
    assert any(k.endswith("psi2") for k in warned)  # psi2 of L without a quasi_permanent limit


def test_ec5_material_keys_refused_in_an_asd_job():
    text = job().decode().replace('method = "EC5"\nservice_class = 1', 'method = "ASD"')
    text = text.replace(
        '\n[[settings.load_case]]\ncase = "L"\nduration = "medium"\npsi0 = 0.7\npsi2 = 0.3\n', ""
    )
    with pytest.raises(JobError) as e:
        solve_bytes(text.encode(), "t.toml")
    assert "rho_k" in str(e.value) + str(e.value.key)


def test_nds_member_inputs_under_ec5():
    from calcreport.jobfile import load_text

    text = job().decode().replace('span = "3 m"', 'span = "3 m"\n\n[member.design]\nCr = 1.15', 1)
    with pytest.raises(JobError) as e:
        solve_bytes(text.encode(), "t.toml")
    assert "Cr" in str(e.value) + str(e.value.key) and "EC5" in str(e.value)
    text = job().decode().replace('rho_k = "350 kg/m^3"\n', 'rho_k = "350 kg/m^3"\nFb = "900 psi"\n')
    assert any(w.key.endswith("Fb") for w in load_text(text.encode(), "t.toml").warnings)
