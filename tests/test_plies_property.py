"""Property tests of plies side by side (issue 14).

* What each ply carries after the fasteners' transfer is its share of the load, and the shares sum
  to the applied load at every x (statics of the free bodies left of each interface; sharing by
  E·I is common practice, no source).
* Every fastener line's zoned schedule covers its transfer demand in every zone: n·F/s ≥ t(x)
  for every x of the zone (mechanics: s·t = n·F for a row).
"""

from __future__ import annotations

import numpy as np
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from ply_jobs import NAILS, load, member, ply, point

from calcreport.pipeline import solve_bytes
from calcreport.solve.plies import PlyShare, interface_coefficients
from calcreport.units import Q_


def _shares(ei: list[float]) -> tuple[PlyShare, ...]:
    tot = sum(ei)
    z = Q_(1.0, "psi")
    return tuple(PlyShare(f"p{i}", "wood", 1.5, 9.25, 0.0, 9.25, z, z, z, v / tot) for i, v in enumerate(ei))


@given(
    ei=st.lists(st.floats(0.05, 50.0), min_size=2, max_size=3),
    raw=st.lists(st.floats(0.0, 1.0), min_size=3, max_size=3),
    w=st.lists(st.floats(-2000.0, 2000.0), min_size=1, max_size=20),
)
def test_ply_loads_after_transfer_are_the_shares_and_sum_to_the_load(ei, raw, w):
    shares = _shares(ei)
    n = len(shares)
    e = raw[:n]
    if sum(e) <= 1e-9:
        e = [1.0] + [0.0] * (n - 1)
    e = [v / sum(e) for v in e]
    a = (0.0, *interface_coefficients(tuple(e), shares), 0.0)
    # a_n = Σ(e_i − share_i) over all plies must vanish (what enters equals what is carried)
    assert abs(sum(e) - sum(s.share for s in shares)) < 1e-12
    for wx in w:  # the load per length at some x
        carried = [wx * (e[i] - (a[i + 1] - a[i])) for i in range(n)]
        for c, s in zip(carried, shares):
            assert abs(c - wx * s.share) <= 1e-9 * max(1.0, abs(wx))
        assert abs(sum(carried) - wx) <= 1e-9 * max(1.0, abs(wx))


SIZES = ('size = "2x10"', 'size = "2x12"', 'width = "1.75 in"\ndepth = "11.25 in"')


@settings(max_examples=12, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(
    n=st.integers(2, 3),
    sizes=st.lists(st.sampled_from(SIZES), min_size=3, max_size=3),
    span_ft=st.integers(6, 16),
    w_d=st.integers(50, 400),
    w_l=st.integers(0, 600),
    face=st.sampled_from(["left_face", "right_face", "top"]),
    p=st.integers(0, 3000),
    at=st.floats(0.1, 0.9),
)
def test_every_line_covers_its_transfer_demand_in_every_zone(n, sizes, span_ft, w_d, w_l, face, p, at):
    mats = ["lvl" if "width" in s else "df2" for s in sizes]
    plies = "".join(ply(f"p{i + 1}", sizes[i], mats[i]) for i in range(n))
    loads = load("D", f"{w_d} plf", face) + (load("L", f"{w_l} plf", face) if w_l else "")
    if p:
        loads += point("L", f"{p} lbf", f"{at * span_ft:.3f} ft", "ply", 'ply = "p1"')
    text = member(
        "P",
        f"{span_ft} ft",
        plies,
        NAILS.format(size="10d common", extra="staggered = true" if n == 3 else ""),
        loads,
    )
    m = solve_bytes(text.encode(), "job.toml").members[0]
    assert len(m.joints) == n - 1
    for j in m.joints:
        s = j.schedule
        assert s is not None
        if not s.feasible:
            continue  # NG, stated with its reason: no spacing within the limits covers the demand
        xs = np.asarray(s.x.to("inch").magnitude)
        q = np.asarray(s.demand.to("lbf/inch").magnitude)
        nF = float(s.capacity_row.to("lbf").magnitude)
        for z in s.zones:
            a, b = float(z.start.to("inch").magnitude), float(z.end.to("inch").magnitude)
            inside = (xs >= a - 1e-9) & (xs <= b + 1e-9)
            cap = nF / float(z.spacing.to("inch").magnitude)
            # at a zone boundary the demand of the neighbouring zone may apply (a jump): use the
            # points strictly inside, plus the ends where the demand is continuous
            strict = (xs > a + 1e-9) & (xs < b - 1e-9)
            assert np.all(q[strict] <= cap * (1 + 1e-9)), (j.id, a, b, cap, q[strict].max())
            assert inside.any()
