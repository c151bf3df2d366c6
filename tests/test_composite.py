"""Composite steel–concrete sections: cracked transformed section and construction stage.

Sources: mechanics of materials (transformed section; concrete in tension ignored — the elastic
cracked-section analysis of AISC 360-16 Commentary I3, from memory), AISC Shapes Database v16.0
(W12X14: A = 4.16 in², d = 11.9 in, Ix = 88.6 in⁴, from the database file). Hand calculation below.
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
method = "LRFD"
[[material]]
id = "s"
family = "steel"
E = "29000 ksi"
Fy = "50 ksi"
Fu = "65 ksi"
[[material]]
id = "c"
family = "concrete"
E = "3600 ksi"
fc = "4 ksi"
density = "145 pcf"
[[member]]
id = "CB"
span = "30 ft"
{design}
[[member.load]]
case = "D"
kind = "uniform"
w = "0.5 klf"
[[member.load]]
case = "L"
kind = "uniform"
w = "1.0 klf"
[[member.part]]
id = "w"
shape = "rolled"
designation = "W12X14"
material = "s"
[[member.part]]
id = "slab"
shape = "rect"
width = "96 in"
depth = "5 in"
material = "c"
on = "w"
[[member.joint]]
id = "studs"
holds = ["slab"]
[member.joint.connector]
type = "stud"
diameter = "3/4 in"
"""


def solve(design=""):
    return solve_job(load_text(JOB.format(design=design).encode())).members[0]


def test_cracked_slab_neutral_axis_and_inertia():
    m = solve('[member.design]\nconstruction = "shored"')
    nb = 3600 / 29000 * 96  # transformed slab width
    # NA in the slab: nb·a²/2 = As·(ȳ − d/2), ȳ = d + t − a → nb/2·a² + As·a − As·(d + t − d/2) = 0
    As, d, t = 4.16, 11.9, 5.0
    a = (-As + math.sqrt(As**2 + 4 * nb / 2 * As * (d + t - d / 2))) / nb
    ybar = d + t - a
    assert m.section.centroid.to("in").magnitude == pytest.approx(ybar, rel=1e-6)
    I = 88.6 + As * (ybar - d / 2) ** 2 + nb * a**3 / 3
    assert m.section.inertia.to("in**4").magnitude == pytest.approx(I, rel=1e-6)
    # the stud joint's Q uses the cracked slab: Q = nb·a·a/2
    assert m.joints[0].Q.to("in**3").magnitude == pytest.approx(nb * a * a / 2, rel=1e-6)
    assert "member[CB].composite_flexure" in {u.key for u in m.not_checked}


def test_unshored_states_dead_load_on_steel_and_unstated_is_listed():
    m = solve('[member.design]\nconstruction = "unshored"')
    cam = next(c for c in m.checks if "construction.deflection_D" in c.key)
    assert cam.status == "INFO"
    # Δ_D on the steel alone = 5wL⁴/(384·E·Is)
    w, L = 500 / 12, 360.0
    assert cam.demand.to("in").magnitude == pytest.approx(5 * w * L**4 / (384 * 29e6 * 88.6), rel=2e-3)
    m = solve()
    nc = {u.key: u for u in m.not_checked}
    assert "construction not stated" in nc["member[CB].construction"].reason
    st = next(s for s in m.steps if s.key.endswith("composite.construction"))
    assert "assumed" in st.note
