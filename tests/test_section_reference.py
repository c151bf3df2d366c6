"""Section properties against closed-form results and published tables.

Sources (named per check):
* Rectangle I = b·h³/12 and the parallel-axis theorem I = Σ(I₀ + A·d²): Gere & Goodno,
  Mechanics of Materials, 9th ed., §12.5 and Appendix E (properties of plane areas) — from memory.
* Dressed lumber properties: NDS Supplement (2018), Table 1B "Section Properties of Standard
  Dressed (S4S) Sawn Lumber" — values from memory, compared at the table's printed precision.
"""

from __future__ import annotations

import math

import pytest

from calcreport.jobfile import load_text
from calcreport.jobfile.lumber import dressed_size
from calcreport.solve import solve_job
from tests.conftest import TEE_I, TEE_PARTS, TEE_YBAR, job_text


def solve(body: str, settings: str = "", materials: str | None = None):
    kw = {} if materials is None else {"materials": materials}
    return solve_job(load_text(job_text(body, settings, **kw).encode()))


def section_of(body: str, **kw):
    return solve(body, **kw).members[0].section


def member(parts: str, shear: str = "1 kip", joints: str = "") -> str:
    return f'[[member]]\nid = "M"\nshear = "{shear}"\n' + parts + joints


def test_rectangle_closed_form():
    # I = b·h³/12 (Gere & Goodno, Appendix E, case 2)
    s = section_of(
        member('[[member.part]]\nid="r"\nshape="rect"\nwidth="3 in"\ndepth="8 in"\nmaterial="wood"\n')
    )
    assert s.area.to("in**2").magnitude == pytest.approx(24.0)
    assert s.centroid.to("in").magnitude == pytest.approx(4.0)
    assert s.inertia.to("in**4").magnitude == pytest.approx(3 * 8**3 / 12)


I_SHAPE = """
[[member.part]]
id = "bf"
shape = "plate"
width = "10 in"
thickness = "1 in"
material = "wood"
[[member.part]]
id = "web"
shape = "plate"
thickness = "0.5 in"
width = "20 in"
upright = true
material = "wood"
on = "bf"
[[member.part]]
id = "tf"
shape = "plate"
width = "10 in"
thickness = "1 in"
material = "wood"
on = "web"
"""


def test_built_up_i_shape_parallel_axis():
    # Doubly symmetric I: I = 2·[b·t³/12 + b·t·(h/2 + t/2)²] + tw·h³/12 (parallel-axis theorem,
    # Gere & Goodno §12.5). With b=10, t=1, tw=0.5, h=20: 2·(0.8333 + 10·110.25) + 333.33.
    expected = 2 * (10 * 1 / 12 + 10 * 1 * 10.5**2) + 0.5 * 20**3 / 12
    s = section_of(member(I_SHAPE))
    assert s.inertia.to("in**4").magnitude == pytest.approx(expected, rel=1e-12)
    assert s.centroid.to("in").magnitude == pytest.approx(11.0)
    # Q of one flange about the NA: A·d = 10 × 10.5 (first moment of area)
    r = solve(
        member(
            I_SHAPE,
            joints='[[member.joint]]\nid="j"\nholds=["tf"]\n'
            '[member.joint.connector]\ntype="given"\nvalue="1 kip"\nsource="x"\n',
        )
    ).members[0]
    assert r.joints[0].Q.to("in**3").magnitude == pytest.approx(105.0)
    # q = V·Q/I
    assert r.joints[0].shear_flow.to("lbf/in").magnitude == pytest.approx(1000 * 105.0 / expected)


def test_box_section_equals_outer_minus_inner():
    # Box of outer 6 × 12 with 1-in walls: I = (B·H³ − b·h³)/12 (Gere & Goodno, Appendix E).
    parts = """
[[member.part]]
id = "wl"
shape = "rect"
width = "1 in"
depth = "12 in"
material = "wood"
[[member.part]]
id = "b"
shape = "rect"
width = "4 in"
depth = "1 in"
material = "wood"
right_of = "wl"
[[member.part]]
id = "t"
shape = "rect"
width = "4 in"
depth = "1 in"
material = "wood"
right_of = "wl"
align = "top"
[[member.part]]
id = "wr"
shape = "rect"
width = "1 in"
depth = "12 in"
material = "wood"
right_of = "b"
"""
    s = section_of(member(parts))
    assert s.inertia.to("in**4").magnitude == pytest.approx((6 * 12**3 - 4 * 10**3) / 12)


def test_tee_centroid_and_inertia():
    # T: flange 8×2 on web 2×10 — closed form in tests/conftest.py (parallel-axis theorem).
    s = section_of(member(TEE_PARTS))
    assert s.centroid.to("in").magnitude == pytest.approx(TEE_YBAR)
    assert s.inertia.to("in**4").magnitude == pytest.approx(TEE_I)


@pytest.mark.parametrize(
    "nominal, area, ixx",
    [
        # NDS Supplement (2018) Table 1B, from memory: A (in²), Ixx (in⁴), as printed.
        ("2x4", 5.250, 5.359),
        ("2x6", 8.250, 20.80),
        ("2x8", 10.88, 47.63),
        ("2x10", 13.88, 98.93),
        ("2x12", 16.88, 178.0),
        ("4x4", 12.25, 12.51),
        ("6x8", 41.25, 193.4),
    ],
)
def test_dressed_lumber_properties(nominal, area, ixx):
    parts = f'[[member.part]]\nid="l"\nshape="lumber"\nsize="{nominal}"\nmaterial="wood"\n'
    s = section_of(member(parts))
    # the table prints 4 significant figures: compare at half a unit in the last place
    assert s.area.to("in**2").magnitude == pytest.approx(area, rel=6e-4)
    assert s.inertia.to("in**4").magnitude == pytest.approx(ixx, rel=6e-4)


def test_dressed_sizes_ps20():
    # American Softwood Lumber Standard PS 20, dry dressed sizes (from memory).
    assert dressed_size("2x10") == (1.5, 9.25)
    assert dressed_size("2x4") == (1.5, 3.5)
    assert dressed_size("1x6") == (0.75, 5.5)
    assert dressed_size("4x12") == (3.5, 11.25)
    assert dressed_size("6x6") == (5.5, 5.5)


def test_round_bar_and_polygon():
    # Circle I = π·d⁴/64 (Gere & Goodno, Appendix E); a triangle of base b, height h:
    # A = b·h/2, I_c = b·h³/36 (Appendix E, case 4).
    s = section_of(member('[[member.part]]\nid="b"\nshape="bar"\ndiameter="2 in"\nmaterial="wood"\n'))
    assert s.inertia.to("in**4").magnitude == pytest.approx(math.pi * 16 / 64)
    tri = '[[member.part]]\nid="t"\nshape="polygon"\npoints=[["0 in","0 in"],["6 in","0 in"],["0 in","9 in"]]\nmaterial="wood"\n'
    s = section_of(member(tri))
    assert s.area.to("in**2").magnitude == pytest.approx(27.0)
    assert s.centroid.to("in").magnitude == pytest.approx(3.0)
    assert s.inertia.to("in**4").magnitude == pytest.approx(6 * 9**3 / 36)


def test_rolled_shape_with_cover_plate():
    # W16x31 from the AISC Manual (15th ed.) Table 1-1, from memory: A = 9.13 in², d = 15.9 in,
    # bf = 5.53 in, Ix = 375 in⁴. A 6 × 1/2 in cover plate on the bottom flange:
    # ȳ and I by the parallel-axis theorem.
    parts = """
[[member.part]]
id = "w"
shape = "rolled"
designation = "W16x31"
area = "9.13 in^2"
inertia = "375 in^4"
depth = "15.9 in"
width = "5.53 in"
material = "wood"
[[member.part]]
id = "cp"
shape = "plate"
width = "6 in"
thickness = "0.5 in"
material = "wood"
below = "w"
"""
    s = section_of(member(parts))
    A = 9.13 + 3.0
    yb = (9.13 * (0.5 + 7.95) + 3.0 * 0.25) / A
    I = 375 + 9.13 * (8.45 - yb) ** 2 + 6 * 0.125 / 12 + 3.0 * (0.25 - yb) ** 2
    assert s.centroid.to("in").magnitude == pytest.approx(yb)
    assert s.inertia.to("in**4").magnitude == pytest.approx(I)
