"""Connector capacity by shank shear, spacing rounded down, and unit handling (US vs SI)."""

from __future__ import annotations

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from calcreport.jobfile import load_text
from calcreport.solve import solve_job
from calcreport.solve.spacing import round_down
from calcreport.units import Q_, parse
from tests.conftest import TEE_I, TEE_PARTS, TEE_Q_FLANGE, job_text

BOX = """
[[member]]
id = "M"
shear = "{V}"
[[member.part]]
id = "web"
shape = "rect"
width = "{tw}"
depth = "{h}"
material = "wood"
[[member.part]]
id = "fl"
shape = "rect"
width = "{bf}"
depth = "{tf}"
material = "wood"
on = "web"
[[member.joint]]
id = "j"
holds = ["fl"]
per_row = 2
[member.joint.connector]
type = "shank"
diameter = "{d}"
tau = "{tau}"
planes = 1
"""


def test_shank_capacity_and_rounding():
    # F = τ·π·d²/4 per shear plane (average shear stress; common practice, no source).
    # s_req = n·F/q; practical = floor(s_req / 0.25 in)·0.25 in (common practice, no source).
    body = BOX.format(V="2 kip", tw="2 in", h="10 in", bf="8 in", tf="2 in", d="0.25 in", tau="15 ksi")
    j = solve_job(load_text(job_text(body).encode())).members[0].joints[0]
    F = 15000 * math.pi * 0.25**2 / 4
    assert j.capacity.to("lbf").magnitude == pytest.approx(F)
    q = 2000 * TEE_Q_FLANGE / TEE_I
    s_req = 2 * F / q
    assert j.spacing_required.to("in").magnitude == pytest.approx(s_req)
    assert j.spacing_provided.to("in").magnitude == pytest.approx(math.floor(s_req / 0.25) * 0.25)
    assert j.spacing_provided <= j.spacing_required


@pytest.mark.parametrize(
    "s, step, expected",
    [
        ("3.37 in", "0.25 in", 3.25),
        ("3.0 in", "0.25 in", 3.0),
        ("2.999999 in", "0.25 in", 2.75),
        ("0.2 in", "0.25 in", 0.0),
        ("87 mm", "5 mm", 85.0),
    ],
)
def test_round_down_never_up(s, step, expected):
    # Rounded DOWN to the increment, never up (common practice, no source).
    got = round_down(parse(s, "length"), parse(step, "length"))
    assert got.magnitude == pytest.approx(expected)


@given(s=st.floats(0.01, 500), step=st.sampled_from([0.125, 0.25, 0.5, 1.0]))
def test_round_down_property(s, step):
    got = round_down(Q_(s, "inch"), Q_(step, "inch")).magnitude
    assert got <= s * (1 + 1e-9)
    assert s - got < step + 1e-9
    assert abs(got / step - round(got / step)) < 1e-9


def test_us_and_si_inputs_give_the_same_results():
    # The same member described in inches/kips and in millimetres/kilonewtons (exact conversions:
    # 1 in = 25.4 mm; 1 kip = 4.4482216 kN) gives the same section, Q, q and capacity.
    us = BOX.format(V="2 kip", tw="2 in", h="10 in", bf="8 in", tf="2 in", d="0.25 in", tau="15 ksi")
    si = BOX.format(
        V=f"{2 * 4.4482216152605} kN",
        tw="50.8 mm",
        h="254 mm",
        bf="203.2 mm",
        tf="50.8 mm",
        d="6.35 mm",
        tau=f"{15 * 6.894757293168361} MPa",
    )
    si_mat = '\n[[material]]\nid = "wood"\nfamily = "wood"\nE = "11031.6 MPa"\n'
    a = solve_job(load_text(job_text(us).encode())).members[0]
    b = solve_job(load_text(job_text(si, settings="", materials=si_mat).encode())).members[0]
    assert b.section.inertia.to("in**4").magnitude == pytest.approx(
        a.section.inertia.to("in**4").magnitude, rel=1e-9
    )
    ja, jb = a.joints[0], b.joints[0]
    for name in ("Q", "shear_flow", "capacity", "spacing_required", "spacing_provided"):
        qa, qb = getattr(ja, name), getattr(jb, name)
        assert qb.to(qa.units).magnitude == pytest.approx(qa.magnitude, rel=1e-9), name


def test_trade_units_parse():
    # Trade units (common practice, no source): plf = lbf/ft, klf = kip/ft, psf = lbf/ft².
    assert parse("250 plf", "line_load").to("lbf/in").magnitude == pytest.approx(250 / 12)
    assert parse("1.2 klf", "line_load").to("plf").magnitude == pytest.approx(1200)
    assert parse("40 psf", "stress").to("psi").magnitude == pytest.approx(40 / 144)
    assert parse("1600 ksi", "stress").to("psi").magnitude == pytest.approx(1.6e6)
    assert parse("1-1/2 in", "length").to("mm").magnitude == pytest.approx(38.1)
    assert parse("10 kip", "force").to("kN").magnitude == pytest.approx(44.482216, rel=1e-7)


def test_glue_line_stress_check():
    # τ = V·Q/(I·b) against the allowable shear stress (mechanics of materials, shear formula).
    body = (
        """
[[member]]
id = "T"
shear = "2.5 kip"
"""
        + TEE_PARTS
        + """
[[member.joint]]
id = "g"
holds = ["fl"]
[member.joint.connector]
type = "glue"
tau = "150 psi"
"""
    )
    j = solve_job(load_text(job_text(body).encode())).members[0].joints[0]
    tau = 2500 * TEE_Q_FLANGE / (TEE_I * 2.0)
    assert j.plane_width.to("in").magnitude == pytest.approx(2.0)
    assert j.utilisation == pytest.approx(tau / 150)
    assert j.continuous and j.status == "OK"
    assert j.spacing_provided is None  # continuous: no spacing


def test_shear_stress_on_a_fastened_plane():
    # τ = V·Q/(I·b) on the joint's plane against the smallest Fv there (mechanics of materials,
    # shear formula); the material here states Fv = 180 psi.
    body = BOX.format(V="2 kip", tw="2 in", h="10 in", bf="8 in", tf="2 in", d="0.25 in", tau="15 ksi")
    j = solve_job(load_text(job_text(body).encode())).members[0].joints[0]
    tau = 2000 * TEE_Q_FLANGE / (TEE_I * 2.0)
    (check,) = [c for c in j.checks if c.label.startswith("Horizontal shear stress at the level")]
    assert check.demand.to("psi").magnitude == pytest.approx(tau)
    assert check.ratio == pytest.approx(tau / 180)
