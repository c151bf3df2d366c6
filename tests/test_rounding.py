"""Every practical spacing is the largest multiple of the increment not above every limit.

Rule (common practice, no source): a spacing is detailed on the increment (1/4 in, 1/2 in …), so a
maximum spacing off that grid (spacing_max = "10.1 in", a bolt limit of 24·t = 8.40 in) caps the
spacing at the multiple of the increment below it; a limit below the increment, or one that
leaves no multiple of the increment at or above the minimum, makes the joint NG with the reason.
AISC 360-16 §J3.5(a): the largest bolt spacing is 24·t ≤ 12 in for painted members (from memory).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from conn_fixtures import context as joint_context
from conn_fixtures import rect, run, steel
from hypothesis import given
from hypothesis import strategies as st

from calcreport.jobfile import load_text
from calcreport.solve import solve_job
from calcreport.solve.schedule import zoned_schedule
from calcreport.solve.spacing import discrete_spacing
from calcreport.steps import StepLog
from calcreport.units import Q_
from tests.conftest import job_text
from tests.test_bad_input import GOOD


def spacing(q_lbf_in, F_lbf, step_in, s_min=None, s_max=None):
    return discrete_spacing(
        Q_(q_lbf_in, "lbf/in"),
        1,
        Q_(F_lbf, "lbf"),
        Q_(step_in, "in"),
        None if s_min is None else Q_(s_min, "in"),
        None if s_max is None else Q_(s_max, "in"),
        StepLog("t"),
    )


@pytest.mark.parametrize(
    ("s_max", "step", "expected"),
    [
        (10.1, 0.5, 10.0),
        (10.1, 1.0, 10.0),
        (10.1, 0.25, 10.0),
        (8.40, 0.25, 8.25),
        (8.40, 0.5, 8.0),
        (8.40, 1.0, 8.0),
        (9.0, 0.25, 9.0),  # on the grid: unchanged
    ],
)
def test_off_grid_maximum_rounds_down_to_the_increment(s_max, step, expected):
    # q small enough that the maximum governs: s_req = 100 / 1 = 100 in
    r = spacing(1.0, 100.0, step, s_max=s_max)
    assert r.status == "OK"
    assert r.provided.to("in").magnitude == pytest.approx(expected, abs=1e-12)
    k = r.provided.to("in").magnitude / step
    assert abs(k - round(k)) < 1e-9


def test_no_shear_flow_spacing_is_on_the_grid():
    r = spacing(0.0, 100.0, 0.5, s_max=10.1)
    assert r.status == "OK" and r.provided.to("in").magnitude == 10.0


def test_maximum_below_the_increment_is_ng_with_the_reason():
    r = spacing(1.0, 100.0, 1.0, s_max=0.75)
    assert r.status == "NG"
    assert any("below the spacing increment" in x for x in r.reasons)


def test_no_multiple_between_minimum_and_maximum_is_ng():
    # s_min 8.3 in, s_max 8.4 in, 1/4 in grid: 8.25 < 8.3 and 8.5 > 8.4
    r = spacing(1.0, 100.0, 0.25, s_min=8.3, s_max=8.4)
    assert r.status == "NG"
    assert any("between the minimum and the maximum" in x for x in r.reasons)


def test_bolt_detailing_limit_24t_off_the_grid():
    # AISC 360-16 §J3.5(a): s_max = 24·t = 24 × 0.35 in = 8.40 in (painted)
    a = rect("cover", 0, 10, 8.0, 10.35, steel(36, 58))
    b = rect("flange", 0, 9.0, 8.0, 10, steel(50, 65))
    cap, _ = run("steel_bolt", {"diameter": Q_(0.75, "in")}, joint_context([a], [b]))
    assert cap.spacing_max.to("in").magnitude == pytest.approx(8.40)
    for step, expected in ((0.25, 8.25), (1.0, 8.0)):
        r = discrete_spacing(
            Q_(100.0, "lbf/in"),
            1,
            cap.value,
            Q_(step, "in"),
            cap.spacing_min,
            cap.spacing_max,
            StepLog("t"),
        )
        assert r.provided.to("in").magnitude == pytest.approx(expected)


@given(
    q=st.floats(0.5, 5000.0),
    F=st.floats(10.0, 5000.0),
    step=st.sampled_from([1 / 16, 0.125, 0.25, 0.5, 1.0]),
    s_max=st.floats(0.5, 48.0),
)
def test_practical_spacing_is_the_largest_multiple_under_every_limit(q, F, step, s_max):
    r = spacing(q, F, step, s_max=s_max)
    best = math.floor(min(F / q, s_max) / step * (1 + 1e-9)) * step
    if r.status == "OK":
        s = r.provided.to("in").magnitude
        assert s == pytest.approx(best, abs=1e-9)
        assert s <= s_max * (1 + 1e-9) and s <= F / q * (1 + 1e-9)
    else:
        assert best <= 0 and r.reasons


def test_job_spacing_max_off_grid_gives_a_grid_spacing():
    body = GOOD.replace('value = "100 lbf"', 'value = "5000 lbf"', 1)
    text = job_text(body, settings='spacing_max = "10.1 in"\nspacing_step = "0.5 in"\n')
    j = solve_job(load_text(text.encode())).members[0].joints[0]
    assert j.spacing_provided.to("in").magnitude == 10.0
    assert j.status == "OK"


def test_zoned_schedule_spacings_respect_the_grid_and_an_off_grid_maximum():
    # a uniform simple span's shear flow |V| ∝ |1 − 2x/L| (AISC Manual Table 3-23, from memory)
    L = 240.0
    x = np.linspace(0, L, 481)
    q = np.abs(1 - 2 * x / L) * 300.0 / 3.0
    for inc in (0.25, 0.5, 1.0):
        s = zoned_schedule(
            Q_(x, "in"),
            Q_(q, "lbf/in"),
            Q_(L, "in"),
            Q_(300, "lbf"),
            Q_(inc, "in"),
            None,
            Q_(10.1, "in"),
            zones_per_half=3,
        )
        assert s.feasible
        for z in s.zones:
            sp = z.spacing.to("in").magnitude
            assert sp <= 10.0 + 1e-12
            assert abs(sp / inc - round(sp / inc)) < 1e-9


def test_zoned_schedule_with_maximum_below_the_increment_is_ng():
    x = np.linspace(0, 120.0, 241)
    s = zoned_schedule(
        Q_(x, "in"),
        Q_(np.full(241, 10.0), "lbf/in"),
        Q_(120, "in"),
        Q_(300, "lbf"),
        Q_(1.0, "in"),
        None,
        Q_(0.75, "in"),
    )
    assert not s.feasible and s.status == "NG" and s.reason
