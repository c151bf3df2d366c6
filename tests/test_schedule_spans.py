"""Zoned schedules on real beam demands: point loads, continuous spans, symmetry, zones per span,
tie-breaks, shared demand maxima.

The demands come from the stiffness analysis (checked against AISC Manual 15th ed. Table 3-23 in
tests/test_beam.py); the optimiser is checked against brute-force enumeration of every schedule
the rules allow (the rules are the tool's own, common practice, no source).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from test_schedule import _check_layout, brute

from calcreport.model import Combination, Load, Support
from calcreport.solve import schedule_demand, schedule_dp
from calcreport.solve.beam import analyse
from calcreport.solve.schedule import zoned_schedule
from calcreport.solve.schedule_demand import Demand, is_symmetric
from calcreport.solve.schedule_dp import optimise
from calcreport.units import Q_

EPS = 1e-9


def _beam(length_in, supports_in, loads, combos=None):
    r = analyse(
        Q_(length_in, "inch"),
        [Support(Q_(s, "inch")) for s in supports_in],
        loads,
        combos or [Combination("D+L", {"D": 1.0, "L": 1.0})],
        EI=Q_(2.0e9, "lbf*in**2"),
    )
    return r


def _demand(r, peak=1.0):
    env = r.envelope
    x = env.x.to("inch").magnitude
    v = env.V_abs.to("lbf").magnitude
    return Demand(x, v / v.max() * peak, r.length.to("inch").magnitude)


def _spans(n, span_ft=10, w=(100, 200)):
    L = 12 * span_ft * n
    sup = [12 * span_ft * i for i in range(n + 1)]
    loads = [Load("D", "uniform", Q_(w[0], "plf")), Load("L", "uniform", Q_(w[1], "plf"))]
    return _beam(L, sup, loads), [s for s in sup[1:-1]]


# --- brute force on small grids with point loads and continuous spans -------------------------------


@pytest.mark.parametrize(
    "L, supports, points, peak, smax, Z, module",
    [
        (14, [0, 14], [(3.5, 900), (9.0, 400)], 0.9, 4, 2, None),
        (15, [0, 15], [(5.0, 600)], 1.1, 5, 2, None),
        (13, [0, 13], [(4.0, 700), (8.5, 300)], 0.8, 4, 2, 2.0),
        (12, [0, 12], [(6.0, 500)], 0.7, 4, 1, None),
    ],
)
def test_point_loads_equal_brute_force(L, supports, points, peak, smax, Z, module):
    loads = [Load("D", "uniform", Q_(100, "lbf/inch"))] + [
        Load("L", "point", Q_(P, "lbf"), at=Q_(a, "inch")) for a, P in points
    ]
    d = _demand(_beam(L, supports, loads), peak)
    sym = is_symmetric(d)
    schedule_dp._MEMO.clear()
    lay = optimise(d, 1.0, 1.0, 1.0, smax, Z, module, symmetric=sym)
    b = brute(d, 1.0, 1.0, 1.0, smax, Z, module, sym)
    assert (math.inf if lay is None else lay.count) == b
    if lay is not None:
        _check_layout(d, lay, 1.0, 1.0, 1.0, smax, module)


@pytest.mark.parametrize(
    "L, supports, points, peak, smax, Z",
    [
        (24, [0, 12, 24], [], 0.9, 4, 2),  # two equal spans
        (22, [0, 9, 22], [(15.0, 300)], 0.8, 4, 2),  # unequal spans, a point load
        (27, [0, 9, 18, 27], [], 0.9, 3, 2),  # three equal spans
        (20, [3, 17], [], 0.8, 4, 2),  # overhangs at both ends
    ],
)
def test_continuous_spans_equal_brute_force_span_by_span(L, supports, points, peak, smax, Z):
    """Zoned span by span: N = 1 + Σ (N_segment − 1), each segment by brute force."""
    loads = [Load("D", "uniform", Q_(100, "lbf/inch"))] + [
        Load("L", "point", Q_(P, "lbf"), at=Q_(a, "inch")) for a, P in points
    ]
    r = _beam(L, supports, loads)
    d = _demand(r, peak)
    edges = [sg.start.to("inch").magnitude for sg in r.segments] + [float(L)]
    inner = tuple(edges[1:-1])
    schedule_dp._MEMO.clear()
    lay = optimise(d, 1.0, 1.0, 1.0, smax, 3, None, bounds=inner, zones_per_span=Z)
    total = 1
    for a, b in zip(edges[:-1], edges[1:]):
        seg = d.window(a, b)
        total += brute(seg, 1.0, 1.0, 1.0, smax, Z, None, is_symmetric(seg)) - 1
    assert lay is not None and lay.count == total
    _check_layout(d, lay, 1.0, 1.0, 1.0, smax, None)


# --- symmetry decided on the envelope ------------------------------------------------------------------


@pytest.mark.parametrize("n", [3, 7])
def test_symmetric_multispan_beams_get_mirrored_schedules(n):
    r, inner = _spans(n)
    env = r.envelope
    L = r.length
    assert is_symmetric(_demand(r))
    s = zoned_schedule(
        env.x,
        env.V_abs * Q_(0.05, "1/in"),
        L,
        Q_(250, "lbf"),
        Q_(0.5, "in"),
        Q_(1, "in"),
        Q_(12, "in"),
        governing=env.V_abs_by,
        segment_ends=tuple(Q_(x, "inch") for x in inner),
        zones_per_span=3,
    )
    assert s.feasible and s.symmetric
    Lin = L.to("inch").magnitude
    for z, m in zip(s.zones, reversed(s.zones)):
        assert z.spacing.magnitude == pytest.approx(m.spacing.magnitude)
        assert z.start.magnitude + m.end.magnitude == pytest.approx(Lin)
    assert sum(z.count for z in s.zones) == s.count


def test_almost_symmetric_beam_is_not_treated_as_symmetric():
    """Three spans, one 1 % longer: the envelope differs from its mirror image by more than the
    tolerance, so the schedule is optimised without mirroring (and stays valid)."""
    L = 120 + 120 + 121.2
    r = _beam(
        L, [0, 120, 240, L], [Load("D", "uniform", Q_(100, "plf")), Load("L", "uniform", Q_(200, "plf"))]
    )
    d = _demand(r, 30.0)
    assert not is_symmetric(d)
    inner = (120.0, 240.0)
    schedule_dp._MEMO.clear()
    lay = optimise(d, 100.0, 0.5, 1.0, 12.0, 3, None, bounds=inner, zones_per_span=3)
    assert lay is not None and not lay.symmetric
    _check_layout(d, lay, 100.0, 0.5, 1.0, 12.0, None)


def test_symmetry_compares_both_sides_of_each_jump_as_pairs():
    """A jump whose two sides are swapped on the mirror side is symmetric; a jump whose sides are
    not is not, even when the larger side matches."""
    x = np.array([0.0, 4.0, 4.0, 6.0, 6.0, 10.0])
    q = np.array([1.0, 0.6, 0.2, 0.2, 0.6, 1.0])
    assert is_symmetric(Demand(x, q, 10.0))
    q2 = np.array([1.0, 0.6, 0.2, 0.3, 0.6, 1.0])
    assert not is_symmetric(Demand(x, q2, 10.0))


# --- zones per span ----------------------------------------------------------------------------------


def test_zones_per_span_limits_each_span():
    r, inner = _spans(3)
    d = _demand(r, 60.0)
    schedule_dp._MEMO.clear()
    for Z in (1, 2, 3):
        lay = optimise(d, 250.0, 0.5, 1.0, 12.0, 3, None, bounds=tuple(inner), zones_per_span=Z)
        assert lay is not None
        edges = [0.0, *inner, d.length]
        for a, b in zip(edges[:-1], edges[1:]):
            inside = [z for z in lay.zones if z[0] < b - EPS and z[1] > a + EPS]
            assert len(inside) <= 2 * Z - 1
        # zone ends fall on supports except where equal spacings were joined
        for z0, z1 in zip(lay.zones[:-1], lay.zones[1:]):
            assert z0[2] != z1[2]


def test_zones_per_span_improves_economy_on_three_spans():
    """Per span, Z = 3 comes within 1.45 of the continuous bound on three equal spans."""
    r, inner = _spans(3)
    env = r.envelope
    s = zoned_schedule(
        env.x,
        env.V_abs * Q_(0.05, "1/in"),
        r.length,
        Q_(300, "lbf"),
        Q_(0.5, "in"),
        Q_(1, "in"),
        Q_(12, "in"),
        segment_ends=tuple(Q_(x, "inch") for x in inner),
    )
    assert s.zones_per_span == 3
    assert s.ratio <= 1.45


# --- ties: fewer zones, then the larger end spacing -------------------------------------------------------


def _all_symmetric(d, inc, kmin, kmax, Z):
    """Every mirrored schedule (own module): list of (N, zones, end spacing)."""
    L = d.length
    out = []

    def chains(start, zones, n, first):
        yield start, zones, n, first
        if zones == Z - 1:
            return
        for k in range(kmin, kmax + 1):
            m = 1
            while start + m * k * inc <= L / 2 + EPS:
                end = start + m * k * inc
                if k * inc * d.max_over(start, end) > 1.0 + 1e-9:
                    break
                yield from chains(end, zones + 1, n + m, first if first else k * inc)
                m += 1

    for end, zones, n, first in chains(0.0, 0, 0, None):
        gap = L - 2 * end
        if gap <= EPS:
            out.append((1 + 2 * n, 2 * zones, first))
            continue
        for k in range(kmax, kmin - 1, -1):
            if k * inc * d.max_over(end, L - end) <= 1.0 + 1e-9:
                out.append((1 + 2 * n + math.ceil(gap / (k * inc) - EPS), 2 * zones + 1, first or k * inc))
                break
    return out


@pytest.mark.parametrize(
    "L, qs, smax, Z", [(12, [0.5, 0.1], 4, 3), (16, [0.4, 0.3, 0.05], 5, 3), (10, [0.3, 0.3], 3, 2)]
)
def test_ties_go_to_fewer_zones_then_larger_end_spacing(L, qs, smax, Z):
    x = np.linspace(0, L / 2, len(qs))
    d = Demand(np.r_[x, L - x[::-1]], np.r_[qs, qs[::-1]], float(L))
    schedule_dp._MEMO.clear()
    lay = optimise(d, 1.0, 1.0, 1.0, smax, Z, None, symmetric=True)
    every = _all_symmetric(d, 1.0, 1, smax, Z)
    best = min(every, key=lambda t: (t[0], t[1], -t[2]))
    assert lay.count == best[0]
    # the optimiser's zones after joining equal neighbours never exceed the brute-force count
    assert len(lay.zones) <= best[1] + 1
    assert lay.zones[0][2] == pytest.approx(best[2])


def test_no_one_connector_end_zone_when_a_longer_spacing_ties():
    """Low demand: one spacing (s_max) everywhere gives the fewest connectors; no short end zone."""
    x = np.linspace(0, 48, 5)
    d = Demand(x, np.full(5, 0.05), 48.0)
    schedule_dp._MEMO.clear()
    lay = optimise(d, 1.0, 1.0, 1.0, 6, 3, None)
    assert len(lay.zones) == 1 and lay.zones[0][2] == 6.0


# --- demand maxima shared by joints -----------------------------------------------------------------------


def test_scaled_copies_share_grid_maxima_and_solution():
    """Two joints whose demands are the same |V| times different Q/I: range maxima once, and
    one solution when n·F / q_peak is the same."""
    r, _ = _spans(1)
    env = r.envelope
    schedule_dp._MEMO.clear()
    schedule_demand._GRID_CACHE.clear()
    a = zoned_schedule(
        env.x,
        env.V_abs * Q_(0.05, "1/in"),
        r.length,
        Q_(300, "lbf"),
        Q_(0.5, "in"),
        Q_(1, "in"),
        Q_(12, "in"),
    )
    n_grid = len(schedule_demand._GRID_CACHE)
    b = zoned_schedule(
        env.x,
        env.V_abs * Q_(0.07, "1/in"),
        r.length,
        Q_(420, "lbf"),
        Q_(0.5, "in"),
        Q_(1, "in"),
        Q_(12, "in"),
    )
    assert len(schedule_demand._GRID_CACHE) == n_grid
    assert [(z.start, z.end, z.spacing, z.count) for z in a.zones] == [
        (z.start, z.end, z.spacing, z.count) for z in b.zones
    ]
    c = zoned_schedule(
        env.x,
        env.V_abs * Q_(0.07, "1/in"),
        r.length,
        Q_(300, "lbf"),
        Q_(0.5, "in"),
        Q_(1, "in"),
        Q_(12, "in"),
    )
    assert len(schedule_demand._GRID_CACHE) == n_grid  # same shape, other ratio: maxima reused
    assert c.count > a.count


def test_linear_work_on_a_long_fine_grid():
    """A 50 ft member at a 1/4 in increment (2,400 grid points) with two unequal point loads:
    the optimiser keeps no grid × grid table (memory O(grid × spacings))."""
    import tracemalloc

    loads = [
        Load("D", "uniform", Q_(60, "plf")),
        Load("D", "point", Q_(700, "lbf"), at=Q_(13, "ft")),
        Load("L", "point", Q_(350, "lbf"), at=Q_(31.5, "ft")),
    ]
    r = _beam(600, [0, 600], loads)
    d = _demand(r, 90.0)
    schedule_dp._MEMO.clear()
    schedule_demand._GRID_CACHE.clear()
    tracemalloc.start()
    lay = optimise(d, 236.0, 0.25, 1.0, 12.0, 3)
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    assert lay is not None and not lay.symmetric
    assert peak < 40e6  # a 2,401² float table alone is 46 MB
    _check_layout(d, lay, 236.0, 0.25, 1.0, 12.0, None)


# --- the job-file key ----------------------------------------------------------------------------------


def test_zones_per_span_without_a_continuous_member_is_refused(write_job, cli):
    """A key that would have no effect is an error (one line, exit 2)."""
    from tests.conftest import job_text
    from tests.test_limits import LOADED, refused

    line = refused(cli, write_job(job_text(LOADED, settings="zones_per_span = 2\n")), "zones_per_span")
    assert "no effect" in line


def test_zones_per_span_on_a_continuous_member(write_job, cli):
    import json

    from tests.conftest import job_text
    from tests.test_limits import LOADED

    two = LOADED.replace(
        'span = "16 ft"',
        'span = "16 ft"\n\n[[member.support]]\nat = "0 ft"\n\n[[member.support]]\nat = "8 ft"\n\n[[member.support]]\nat = "16 ft"\n',
    )
    results = {}
    for z in (1, 3):
        code, out, err = cli(
            "check", "--json", write_job(job_text(two, settings=f"zones_per_span = {z}\n"), f"j{z}.toml")
        )
        assert code in (0, 1), err
        joint = json.loads(out)["members"][0]["joints"][0]
        n_step = [s for s in joint["steps"] if s["key"].endswith("schedule.N")][0]
        assert f"at most {z} per half span" in json.dumps(n_step)
        results[z] = n_step["result"]
    assert results[3] <= results[1]


def test_check_with_loads_along_the_member_does_not_import_numpy_ma():
    """np.unique / np.setdiff1d import numpy.ma (about 24 ms of a cold start); the solve path
    avoids them (start-up, common practice, no source)."""
    from tests.test_lazy_imports import run_fresh

    out = run_fresh(
        ["check", "jobs/pavilion-ridge-box-beam.toml"], "'numpy.ma' in sys.modules, 'difflib' in sys.modules"
    )
    assert out == "0 False False", out
