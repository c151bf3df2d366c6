"""Plies set side by side are not given an OK from shear flow (issue: multi-ply and flitch beams).

Mechanics of materials: q = V·Q/I is the shear per length on a cut parallel to the neutral axis.
Connectors between plies standing side by side over the whole depth sit on a vertical plane; Q of
the held ply about the neutral axis is zero (equal plies) or an artefact of unequal depths (an
11 in flitch plate beside 11.25 in lumber). The two shapes below gave "16d @ 12 in OK" and
"1/2 in bolts @ 70 in OK" before; now each is refused with one line naming the joint and pointing to
the keys that describe plies ([[member.ply]], [member.ply_fastening], where loads enter). The same
two members described as plies get their real answer: the transfer demand between the plies.
"""

from __future__ import annotations

MATERIALS = """
[job]
project = "Trial"

[settings]
units = "US"

[[material]]
id = "df2"
family = "wood"
E = "1600 ksi"
Fb = "900 psi"
Fv = "180 psi"
G = 0.50

[[material]]
id = "a36"
family = "steel"
E = "29000 ksi"
Fy = "36 ksi"
Fu = "58 ksi"
"""

THREE_PLY = (
    MATERIALS
    + """
[[member]]
id = "B1"
shear = "4 kip"

[[member.part]]
id = "p1"
shape = "lumber"
size = "2x12"
material = "df2"
at = ["0 in", "0 in"]

[[member.part]]
id = "p2"
shape = "lumber"
size = "2x12"
material = "df2"
right_of = "p1"

[[member.part]]
id = "p3"
shape = "lumber"
size = "2x12"
material = "df2"
right_of = "p2"

[[member.joint]]
id = "j1"
holds = ["p1"]

[member.joint.connector]
type = "nail"
size = "16d common"
"""
)

FLITCH = (
    MATERIALS
    + """
[[member]]
id = "F1"
shear = "6 kip"

[[member.part]]
id = "w1"
shape = "lumber"
size = "2x12"
material = "df2"
at = ["0 in", "0 in"]

[[member.part]]
id = "pl"
shape = "plate"
thickness = "1/2 in"
width = "11 in"
upright = true
material = "a36"
right_of = "w1"
align = "bottom"

[[member.part]]
id = "w2"
shape = "lumber"
size = "2x12"
material = "df2"
right_of = "pl"
align = "bottom"

[[member.joint]]
id = "bolts"
holds = ["pl"]

[member.joint.connector]
type = "given"
value = "1200 lbf"
source = "stated for the test"
"""
)


def _refused(write_job, cli, text: str, key: str) -> None:
    path = write_job(text)
    code, out, err = cli("check", path)
    assert code == 2 and out == "", (code, out, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in err
    assert key in lines[0] and "side by side" in lines[0] and "V·Q/I" in lines[0]
    assert "[[member.ply]]" in lines[0] and "[member.ply_fastening]" in lines[0] and "enters" in lines[0]


def test_three_ply_header_is_not_given_an_ok_from_shear_flow(write_job, cli):
    _refused(write_job, cli, THREE_PLY, "member[B1].joint[j1]")


def test_flitch_plate_beside_lumber_is_not_given_an_ok_from_shear_flow(write_job, cli):
    _refused(write_job, cli, FLITCH, "member[F1].joint[bolts]")


PLIES_THREE = (
    MATERIALS
    + """
[[member]]
id = "B1"
span = "12 ft"

[[member.ply]]
id = "p1"
size = "2x12"
material = "df2"

[[member.ply]]
id = "p2"
size = "2x12"
material = "df2"

[[member.ply]]
id = "p3"
size = "2x12"
material = "df2"

[member.ply_fastening]
rows = 2
staggered = true

[member.ply_fastening.connector]
type = "nail"
size = "16d common"

[[member.load]]
case = "D"
kind = "uniform"
w = "480 plf"
enters = "left_face"
"""
)

PLIES_FLITCH = (
    MATERIALS
    + """
[[member]]
id = "F1"
span = "12 ft"

[[member.ply]]
id = "w1"
size = "2x12"
material = "df2"

[[member.ply]]
id = "pl"
thickness = "1/2 in"
depth = "11 in"
material = "a36"

[[member.ply]]
id = "w2"
size = "2x12"
material = "df2"

[member.ply_fastening]
rows = 2
through = true

[member.ply_fastening.connector]
type = "given"
value = "1200 lbf"
source = "stated for the test"

[[member.load]]
case = "D"
kind = "uniform"
w = "480 plf"
enters = "top"
"""
)


def test_three_ply_header_as_plies_gets_its_transfer_demand():
    # statics: a face load w on ply 1 of 3 equal plies crosses p1|p2 as w·2/3 (sharing by E·I,
    # common practice, no source); D alone scaled by C_D 1.0/0.9 (NDS 2018 Table 2.3.2)
    from calcreport.pipeline import solve_bytes

    m = solve_bytes(PLIES_THREE.encode(), "job.toml").members[0]
    q = {j.id: float(j.shear_flow.to("lbf/inch").magnitude) for j in m.joints}
    assert abs(q["p1-p2"] - 40.0 * 2 / 3 / 0.9) < 1e-6 and abs(q["p3-p2"] - 40.0 / 3 / 0.9) < 1e-6
    assert all(j.Q is None for j in m.joints)


def test_flitch_as_plies_gets_its_transfer_demand():
    from calcreport.pipeline import solve_bytes

    m = solve_bytes(PLIES_FLITCH.encode(), "job.toml").members[0]
    EI_w, EI_p = 1.6e6 * 1.5 * 11.25**3 / 12, 29e6 * 0.5 * 11**3 / 12
    a1 = 0.5 - EI_w / (2 * EI_w + EI_p)  # top load bears on the timbers (hand calculation)
    (j,) = m.joints
    import numpy as np

    xs = np.asarray(j.schedule.x.to("inch").magnitude)
    t = float(np.asarray(j.schedule.demand.to("lbf/inch").magnitude)[int(np.abs(xs - 72.0).argmin())])
    assert abs(t - 40.0 * a1) < 1e-6  # at midspan, away from the bearings; "given" has no C_D
    # two bolts per row, 600 lbf per plane (double shear value shared by the planes, assumption)
    assert abs(float(j.capacity.to("lbf").magnitude) - 600.0) < 1e-9
