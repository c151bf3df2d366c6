"""Zoned connector schedule: exact optimality against brute force, symmetry, economy figures.

The rules being optimised are the tool's own (documented in calcreport/solve/schedule_dp.py);
the spacing rule s ≤ n·F/q is mechanics of materials (q = V·Q/I); the rest is common practice,
no source. Brute force enumerates every schedule the rules allow on small cases.
"""

import math

import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from calcreport.solve.schedule import zoned_schedule
from calcreport.solve.schedule_dp import Demand, optimise
from calcreport.units import Q_

EPS = 1e-9


def _chains(d, limit, inc, kmin, kmax, nF, max_zones, module):
    """Every chain of ≤ max_zones zones from x = 0 ending at or before ``limit``:
    list of (end, zones, count). Naive enumeration (prunes only infeasible zones)."""
    out = [(0.0, 0, 0)]
    frontier = [(0.0, 0, 0)]
    for _ in range(max_zones):
        nxt = []
        for start, z, n in frontier:
            for k in range(kmin, kmax + 1):
                s = k * inc
                step = module if module else s
                m = 1
                while start + m * step <= limit + EPS:
                    end = start + m * step
                    if s > nF / max(d.max_over(start, end), 1e-300) * (1 + 1e-9):
                        break
                    item = (end, z + 1, n + math.ceil(m * step / s - EPS))
                    nxt.append(item)
                    m += 1
        out += nxt
        frontier = nxt
    return out


def _central(d, a, b, inc, kmin, kmax, nF):
    if b - a <= EPS:
        return 0
    best = math.inf
    for k in range(kmin, kmax + 1):
        s = k * inc
        if s <= nF / max(d.max_over(a, b), 1e-300) * (1 + 1e-9):
            best = min(best, math.ceil((b - a) / s - EPS))
    return best


def brute(d, nF, inc, smin, smax, Z, module, symmetric):
    L = d.length
    kmin, kmax = max(1, math.ceil(smin / inc - EPS)), math.floor(smax / inc + EPS)
    best = math.inf
    if symmetric:
        for end, _z, n in _chains(d, L / 2, inc, kmin, kmax, nF, Z - 1, module):
            best = min(best, 1 + 2 * n + _central(d, end, L - end, inc, kmin, kmax, nF))
        return best
    left = _chains(d, L, inc, kmin, kmax, nF, 2 * Z - 2, module)
    right = _chains(d.reversed(), L, inc, kmin, kmax, nF, 2 * Z - 2, module)
    for a, za, na in left:
        for b, zb, nb in right:
            if za + zb <= 2 * Z - 2 and a + b <= L + EPS:
                best = min(best, 1 + na + nb + _central(d, a, L - b, inc, kmin, kmax, nF))
    return best


def _check_layout(d, lay, nF, inc, smin, smax, module):
    """Independent validity check of a layout: covers [0, L], spacings allowed, demand met at
    dense points, chain zones in whole modules, N = 1 + Σ ceil(ℓ/s)."""
    zones = lay.zones
    assert zones[0][0] == 0 and abs(zones[-1][1] - d.length) < 1e-9
    total = 1
    for (a, b, s, n), nxt in zip(zones, list(zones[1:]) + [None]):
        if nxt is not None:
            assert abs(b - nxt[0]) < 1e-9
        k = s / inc
        assert abs(k - round(k)) < 1e-9 and smin - 1e-9 <= s <= smax + 1e-9
        for xx in np.linspace(a, b, 50):
            assert s * d.at(xx) <= nF * (1 + 1e-9)
        assert n == math.ceil((b - a) / s - EPS)
        total += n
    assert total == lay.count


def _demand(draw_q, L, sym):
    xs = np.linspace(0, L, len(draw_q))
    q = np.array(draw_q, float)
    if sym:
        q = np.maximum(q, q[::-1])
    return Demand(xs, q, L)


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(
    L=st.integers(6, 20),
    qs=st.lists(st.floats(0, 1.0), min_size=2, max_size=7),
    smin=st.integers(1, 2),
    smax=st.integers(2, 6),
    Z=st.integers(1, 3),
    module=st.sampled_from([None, 2.0, 3.0]),
)
def test_symmetric_optimum_equals_brute_force(L, qs, smin, smax, Z, module):
    smax = max(smax, smin)
    d = _demand(qs, float(L), True)
    nF = 1.0
    lay = optimise(d, nF, 1.0, smin, smax, Z, module, symmetric=True)
    b = brute(d, nF, 1.0, smin, smax, Z, module, True)
    if lay is None:
        assert b == math.inf
    else:
        assert lay.count == b
        _check_layout(d, lay, nF, 1.0, smin, smax, module)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(
    L=st.integers(5, 13),
    qs=st.lists(st.floats(0, 1.0), min_size=2, max_size=6),
    smax=st.integers(2, 4),
    Z=st.integers(1, 2),
    module=st.sampled_from([None, 2.0]),
)
def test_general_optimum_equals_brute_force(L, qs, smax, Z, module):
    d = _demand(qs, float(L), False)
    lay = optimise(d, 1.0, 1.0, 1.0, smax, Z, module, symmetric=False)
    b = brute(d, 1.0, 1.0, 1.0, smax, Z, module, False)
    if lay is None:
        assert b == math.inf
    else:
        assert lay.count == b
        assert len(lay.zones) <= 2 * Z - 1
        _check_layout(d, lay, 1.0, 1.0, 1.0, smax, module)


def _uniform_span(L=240.0, s_end=3.0, nF=300.0):
    """Shear flow of a uniformly loaded simple span: |V| = w|L/2 − x| (AISC Manual 15th ed.
    Table 3-23), scaled so that n·F/q = s_end at the supports."""
    x = np.linspace(0, L, 481)
    return x, np.abs(1 - 2 * x / L) * nF / s_end


def test_uniform_span_schedule_is_symmetric_and_valid():
    x, q = _uniform_span()
    s = zoned_schedule(
        Q_(x, "in"),
        Q_(q, "lbf/in"),
        Q_(240, "in"),
        Q_(300, "lbf"),
        Q_(0.5, "in"),
        Q_(1, "in"),
        Q_(12, "in"),
        zones_per_half=3,
    )
    assert s.feasible and s.symmetric
    z = s.zones
    assert len(z) == 5
    for a, b in zip(z, reversed(z)):
        assert abs(a.spacing.magnitude - b.spacing.magnitude) < 1e-12
        assert abs(a.start.magnitude + b.end.magnitude - 240) < 1e-9
    assert sum(zz.count for zz in z) == s.count
    assert s.count >= s.count_min
    assert z[0].spacing.magnitude == 3.0  # n·F/q at the support, rounded down


def test_two_span_demand_is_symmetric():
    """Two equal spans, uniform load (AISC Manual 15th ed. Table 3-23): V is antisymmetric about
    the centre support, so |V| and the schedule are symmetric."""
    from calcreport.model import Combination, Load, Support
    from calcreport.solve.beam import analyse

    r = analyse(
        Q_(20, "ft"),
        [Support(Q_(0, "ft")), Support(Q_(10, "ft")), Support(Q_(20, "ft"))],
        [Load("D", "uniform", Q_(300, "plf"))],
        [Combination("D", {"D": 1.0})],
    )
    env = r.envelope
    s = zoned_schedule(
        env.x,
        env.V_abs * Q_(0.05, "1/in"),
        Q_(20, "ft"),
        Q_(120, "lbf"),
        Q_(0.5, "in"),
        None,
        Q_(12, "in"),
        governing=env.V_abs_by,
    )
    assert s.feasible and s.symmetric
    assert all(z.governing == "D" for z in s.zones)


def test_single_spacing_figures():
    """N_single: one spacing from the peak shear flow, rounded down to the increment (common
    practice, no source): q_peak = 100 lbf/in, n·F = 300 lbf → 3.0 in; 240 in → 1 + 80."""
    x, q = _uniform_span()
    s = zoned_schedule(
        Q_(x, "in"), Q_(q, "lbf/in"), Q_(240, "in"), Q_(300, "lbf"), Q_(0.5, "in"), Q_(1, "in"), Q_(12, "in")
    )
    assert s.spacing_single.magnitude == 3.0 and s.count_single == 81
    assert s.saving == 1 - s.count / 81


def test_infeasible_when_minimum_spacing_too_large():
    x, q = _uniform_span()
    s = zoned_schedule(
        Q_(x, "in"), Q_(q, "lbf/in"), Q_(240, "in"), Q_(300, "lbf"), Q_(0.5, "in"), Q_(4, "in"), Q_(12, "in")
    )
    assert not s.feasible and s.zones == () and "minimum" in s.reason
    assert s.steps[-1].result == "NG"


@settings(max_examples=40, deadline=None)
@given(qs=st.lists(st.floats(0, 50), min_size=2, max_size=8), L=st.floats(30, 200), Z=st.integers(1, 4))
def test_count_never_below_continuous_bound(qs, L, Z):
    """N ≥ N_min = ∫ max(q/(n·F), 1/s_max) dx for every schedule (every gap ≤ n·F/q, ≤ s_max)."""
    x = np.linspace(0, L, len(qs))
    s = zoned_schedule(
        Q_(x, "in"),
        Q_(np.array(qs), "lbf/in"),
        Q_(L, "in"),
        Q_(100, "lbf"),
        Q_(0.25, "in"),
        Q_(1, "in"),
        Q_(16, "in"),
        zones_per_half=Z,
    )
    if s.feasible:
        assert s.count >= s.count_min - 1e-9
        assert s.count <= s.count_single
