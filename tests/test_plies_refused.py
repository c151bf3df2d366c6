"""Plies set side by side are not given an OK from shear flow (issue: multi-ply and flitch beams).

Mechanics of materials: q = V·Q/I is the shear per length on a cut parallel to the neutral axis.
Connectors between plies standing side by side over the whole depth sit on a vertical plane; Q of
the held ply about the neutral axis is zero (equal plies) or an artefact of unequal depths (an
11 in flitch plate beside 11.25 in lumber). The two shapes below gave "16d @ 12 in OK" and
"1/2 in bolts @ 70 in OK" before; now each is refused with one line naming the joint.
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


def test_three_ply_header_is_not_given_an_ok_from_shear_flow(write_job, cli):
    _refused(write_job, cli, THREE_PLY, "member[B1].joint[j1]")


def test_flitch_plate_beside_lumber_is_not_given_an_ok_from_shear_flow(write_job, cli):
    _refused(write_job, cli, FLITCH, "member[F1].joint[bolts]")
