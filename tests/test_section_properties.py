"""Property-based checks of the section solver (hypothesis). Sources: mechanics of materials
(the centroid, I and Q are additive over parts; Q is largest at the neutral axis; a transformed
section with equal moduli is the plain section) — common practice, no source beyond the theory."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from calcreport.jobfile import load_text
from calcreport.solve import solve_job
from calcreport.solve.section import first_moment_above
from tests.conftest import job_text

dims = st.floats(min_value=0.25, max_value=40, allow_nan=False)


def _rect(pid, w, h, mat="wood", on=None):
    s = f'[[member.part]]\nid="{pid}"\nshape="rect"\nwidth="{w!r} in"\ndepth="{h!r} in"\nmaterial="{mat}"\n'
    return s + (f'on="{on}"\n' if on else "")


def _solve(parts: str, materials: str | None = None):
    body = '[[member]]\nid="M"\nshear="1 kip"\n' + parts
    kw = {} if materials is None else {"materials": materials}
    return solve_job(load_text(job_text(body, **kw).encode())).members[0]


@settings(max_examples=60, deadline=None)
@given(w=dims, h=dims, cuts=st.lists(st.floats(0.05, 0.95), min_size=1, max_size=4, unique=True))
def test_split_rectangle_keeps_properties(w, h, cuts):
    whole = _solve(_rect("r", w, h)).section
    fracs = sorted(cuts)
    edges = [0.0] + fracs + [1.0]
    heights = [h * (b - a) for a, b in zip(edges, edges[1:])]
    heights = [x for x in heights if x > 1e-3]
    heights[-1] = h - sum(heights[:-1])
    parts = "".join(_rect(f"p{i}", w, hh, on=(f"p{i - 1}" if i else None)) for i, hh in enumerate(heights))
    split = _solve(parts).section
    assert split.area.to("in**2").magnitude == pytest.approx(whole.area.to("in**2").magnitude, rel=1e-9)
    assert split.centroid.to("in").magnitude == pytest.approx(whole.centroid.to("in").magnitude, rel=1e-9)
    assert split.inertia.to("in**4").magnitude == pytest.approx(whole.inertia.to("in**4").magnitude, rel=1e-7)


@settings(max_examples=40, deadline=None)
@given(bw=dims, hw=dims, bf=dims, tf=dims, ys=st.lists(st.floats(0.0, 1.0), min_size=3, max_size=12))
def test_q_is_largest_at_the_neutral_axis(bw, hw, bf, tf, ys):
    m = _solve(_rect("web", bw, hw) + _rect("fl", bf, tf, on="web"))
    s = m.section
    depth = s.depth.to("in").magnitude
    ybar = s.centroid.to("in").magnitude
    q_na = abs(first_moment_above(m.member, s, ybar))
    for f in ys:
        assert abs(first_moment_above(m.member, s, f * depth)) <= q_na * (1 + 1e-9) + 1e-9


@settings(max_examples=40, deadline=None)
@given(bw=dims, hw=dims, bf=dims, tf=dims)
def test_equal_moduli_transformed_equals_plain(bw, hw, bf, tf):
    mats = '\n[[material]]\nid="wood"\nE="1600 ksi"\n\n[[material]]\nid="same"\nE="1.6e6 psi"\n'
    plain = _solve(_rect("web", bw, hw) + _rect("fl", bf, tf, on="web"), mats).section
    mixed = _solve(_rect("web", bw, hw) + _rect("fl", bf, tf, mat="same", on="web"), mats).section
    for name in ("area", "centroid", "inertia"):
        a, b = getattr(plain, name), getattr(mixed, name)
        assert b.to(a.units).magnitude == pytest.approx(a.magnitude, rel=1e-12)


@settings(max_examples=40, deadline=None)
@given(n=st.floats(0.05, 20), bw=dims, hw=dims, bf=dims, tf=dims)
def test_transformed_flange_equals_widened_flange(n, bw, hw, bf, tf):
    # A flange of modulus n·E is equivalent to the same flange n times wider (transformed section).
    mats = f'\n[[material]]\nid="wood"\nE="1000 ksi"\n\n[[material]]\nid="stiff"\nE="{1000 * n!r} ksi"\n'
    a = _solve(_rect("web", bw, hw) + _rect("fl", bf, tf, mat="stiff", on="web"), mats).section
    b = _solve(_rect("web", bw, hw) + _rect("fl", bf * n, tf, on="web"), mats).section
    assert a.inertia.to("in**4").magnitude == pytest.approx(b.inertia.to("in**4").magnitude, rel=1e-9)
    assert a.centroid.to("in").magnitude == pytest.approx(b.centroid.to("in").magnitude, rel=1e-9)
