"""Exact optimiser of a zoned connector schedule (plain floats; inch by convention).

Rules (the schedule these functions optimise; :mod:`calcreport.solve.schedule` documents them for
the report):

* Spacings are whole multiples of the increment ``inc`` within [s_min, s_max].
* Zones are built from the ends of a stretch inwards. A zone built from an end ("chain zone") has
  a length that is a whole multiple of the module (``module`` if given — a whole multiple of the
  increment — otherwise its own spacing); one central zone takes what is left between the chains.
* Symmetric demand: the left chain is mirrored on the right; at most Z − 1 chain zones per side
  plus the central zone, i.e. at most Z distinct zones per half. Otherwise: the left and right
  chains have at most 2Z − 2 zones together, plus the central zone (at most 2Z − 1 zones).
* A member with interior supports or overhangs is zoned span by span (segment by segment): every
  segment is a stretch of its own under the rules above with Z = ``zones_per_span``; a whole
  member symmetric about its middle gets segments mirrored about the middle.
* Every zone's spacing satisfies s ≤ n·F / q(x) at every x of the closed zone.
* Connector count: one connector at x = 0, then each zone adds ceil(ℓ / s) connectors placed
  at its spacing from its start. N = 1 + Σ ceil(ℓᵢ / sᵢ); no gap exceeds its zone's spacing.
* Among schedules with the fewest connectors: the fewest zones, then the larger end spacing.

The dynamic programme is exact: it minimises N over all schedules the rules allow (tests compare
it with brute-force enumeration). It works over the spacing index with running minima along the
member (:mod:`calcreport.solve.schedule_chain`): time O(grid points × spacings × zones), memory
O(grid points × spacings).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .schedule_chain import INF, Grid, central_pairs, chain_table, unwind
from .schedule_demand import Demand, grid_maxima, is_symmetric

__all__ = ["Demand", "Layout", "optimise", "is_symmetric"]

_EPS = 1e-9


@dataclass(frozen=True)
class Layout:
    """An optimal schedule: zones as (start, end, spacing, count) from x = 0 to the length."""

    zones: tuple[tuple[float, float, float, int], ...]
    count: int
    symmetric: bool


_MEMO: dict[tuple, Layout | None] = {}
_MEMO_MAX = 64


def optimise(
    d: Demand,
    cap_row: float,
    inc: float,
    s_min: float,
    s_max: float,
    zones_per_half: int = 3,
    module: float | None = None,
    symmetric: bool | None = None,
    bounds: tuple[float, ...] = (),
    zones_per_span: int | None = None,
) -> Layout | None:
    """Fewest-connector schedule under the module rules, or ``None`` when none exists
    (demand needs a spacing below s_min somewhere).

    ``bounds``: interior support positions (segment ends) of a member with more than one
    segment; every segment then takes at most ``zones_per_span`` (default ``zones_per_half``)
    zones per half. Joints with the same demand and rules share one solution.
    """
    ratio = float(f"{cap_row / d.peak:.12e}") if d.peak > 0 else cap_row
    key = (
        *d.key(),
        ratio,
        d.peak == 0,
        inc,
        s_min,
        s_max,
        zones_per_half,
        module,
        symmetric,
        bounds,
        zones_per_span,
    )
    if key not in _MEMO:
        if len(_MEMO) >= _MEMO_MAX:
            _MEMO.pop(next(iter(_MEMO)))
        _MEMO[key] = _optimise(
            d, cap_row, inc, s_min, s_max, zones_per_half, module, symmetric, bounds, zones_per_span
        )
    return _MEMO[key]


def _optimise(
    d: Demand,
    cap_row: float,
    inc: float,
    s_min: float,
    s_max: float,
    zones_per_half: int,
    module: float | None,
    symmetric: bool | None,
    bounds: tuple[float, ...],
    zones_per_span: int | None,
) -> Layout | None:
    L = d.length
    kmin = max(1, int(np.ceil(s_min / inc - _EPS)))
    kmax = int(np.floor(s_max / inc + _EPS))
    if kmax < kmin:
        return None
    tol = _EPS * max(L, 1.0)
    inner = sorted(b for b in bounds if tol < b < L - tol)
    sym = is_symmetric(d) if symmetric is None else symmetric
    rules = (cap_row, inc, kmin, kmax, module)
    if not inner:
        return _stretch(d, rules, max(1, int(zones_per_half)), sym)
    Z = max(1, int(zones_per_span if zones_per_span is not None else zones_per_half))
    edges = [0.0, *inner, L]
    mirrored = sym and all(abs(a + b - L) <= 1e3 * tol for a, b in zip(edges, reversed(edges)))
    n = len(edges) - 1
    parts: list[Layout | None] = [None] * n
    for s in range(n):
        if mirrored and s > (n - 1) // 2:
            m = parts[n - 1 - s]
            assert m is not None
            w = edges[s + 1] - edges[s]
            parts[s] = Layout(
                tuple((w - e, w - a, sp, c) for a, e, sp, c in reversed(m.zones)), m.count, m.symmetric
            )
            continue
        seg = d.window(edges[s], edges[s + 1])
        middle = mirrored and n % 2 == 1 and s == n // 2
        lay = _stretch(seg, rules, Z, True if middle else is_symmetric(seg))
        if lay is None:
            return None
        parts[s] = lay
    zones: list[tuple[float, float, float, int]] = []
    count = 1
    for a, lay in zip(edges, parts):
        assert lay is not None
        zones += [(a + z0, a + z1, sp, c) for z0, z1, sp, c in lay.zones]
        count += lay.count - 1
    return Layout(_merge(zones), count, mirrored)


def _stretch(d: Demand, rules, Z: int, sym: bool) -> Layout | None:
    """Optimal schedule of one stretch (a simple span, or one segment of a member)."""
    cap_row, inc, kmin, kmax, module = rules
    L = d.length
    u = module if module else inc
    ratio = u / inc
    r = int(round(ratio))
    if abs(ratio - r) > 1e-6 * max(1.0, ratio) or r < 1:
        raise ValueError("the zone module must be a whole multiple of the increment")
    own = not module
    scale = d.peak
    W = kmax + 1
    tol = _EPS * max(L, 1.0)
    if sym:
        P = int(np.floor(L / 2 / u + _EPS))
        g = _grid(d, P, u, inc, r, own, kmin, kmax, cap_row, scale, "L")
        F = chain_table(g, Z - 1)
        return _symmetric(d, g, F, Z, rules, tol)
    P = int(np.floor(L / u + _EPS))
    K = 2 * Z - 2
    gl = _grid(d, P, u, inc, r, own, kmin, kmax, cap_row, scale, "L")
    gr = _grid(d.reversed(), P, u, inc, r, own, kmin, kmax, cap_row, scale, "R")
    FL, FR = chain_table(gl, K), chain_table(gr, K)
    a = np.arange(P + 1) * u
    b = L - a
    G = np.sort(np.r_[a, b])
    G = G[np.r_[True, np.diff(G) > tol]]
    eG = grid_maxima(d, G, "C") * scale
    kbG = _allowed(eG, cap_row, inc, kmin, kmax)
    best = central_pairs(FL, FR, K, a, b, G, kbG, gl, L / inc, tol, W, kmin, kmax)
    if best is None:
        return None
    N, zl, zr, i, j, k, n_c = best
    left = unwind(gl, FL, zl, i)
    rr = unwind(gr, FR, zr, j)
    right = [(L - e, L - s, sp, n) for s, e, sp, n in reversed(rr)]
    mid = [(a[i], b[j], k * inc, n_c)] if n_c > 0 else []
    return Layout(_merge(left + mid + right), int(N), False)


def _grid(d, P, u, inc, r, own, kmin, kmax, cap_row, scale, tag) -> Grid:
    pos = np.arange(P + 1) * u
    e = grid_maxima(d, pos, tag) * scale
    kb = _allowed(e, cap_row, inc, kmin, kmax)
    return Grid(P, u, inc, r, own, kmin, kmax, kb)


def _allowed(q: np.ndarray, cap_row: float, inc: float, kmin: int, kmax: int) -> np.ndarray:
    """Largest allowed spacing index k (spacing k·inc) with k·inc ≤ n·F/q; 0 where none."""
    with np.errstate(divide="ignore", over="ignore"):
        s_req = np.where(q > 0, cap_row / np.where(q > 0, q, 1.0), np.inf)
    k = np.floor(np.minimum(s_req / inc, kmax) * (1 + _EPS) + _EPS)
    k = np.minimum(k, kmax)
    return np.where(k >= kmin, k, 0).astype(np.int64)


def _symmetric(d: Demand, g: Grid, F: np.ndarray, Z: int, rules, tol: float) -> Layout | None:
    """Mirrored schedule: chain of ≤ Z − 1 zones to a_i, central zone over [a_i, L − a_i]."""
    cap_row, inc, kmin, kmax, _ = rules
    L = d.length
    P = g.P
    a = np.arange(P + 1) * g.u
    # largest q over the nested intervals [a_i, L − a_i], from the middle outwards
    e_left = grid_maxima(d, a, "L") * d.peak if P else np.zeros(0)
    e_right = grid_maxima(d, (L - a)[::-1], "SR")[::-1] * d.peak if P else np.zeros(0)
    mx = np.empty(P + 1)
    mx[P] = d.max_over(a[P], L - a[P]) if L - 2 * a[P] > tol else d.at(a[P])
    if P:
        step = np.maximum(e_left, e_right)
        mx[:P] = np.maximum.accumulate(np.r_[step[::-1]])[::-1]
        mx[:P] = np.maximum(mx[:P], mx[P])
    kc = _allowed(mx, cap_row, inc, kmin, kmax)
    gap = L - 2 * a
    zero = gap <= tol
    with np.errstate(divide="ignore", invalid="ignore"):
        cc = np.where(zero, 0, np.where(kc > 0, np.ceil(gap / (np.maximum(kc, 1) * inc) - _EPS), INF))
    W = kmax + 1
    best, arg = None, None
    zexact = np.zeros_like(F)
    for z in range(F.shape[0]):
        zexact[z] = z if z == 0 else np.where(F[z] == F[z - 1], zexact[z - 1], z)
    for z in range(F.shape[0]):
        fin = (F[z] < INF) & (cc < INF)
        if not fin.any():
            continue
        N = 1 + 2 * (F[z] // W) + cc
        t = np.where(np.arange(P + 1) == 0, np.where(zero, 0, kmax - kc), F[z] % W)
        zones = 2 * zexact[z] + (~zero)
        key = np.where(fin, (N * (2 * Z + 2) + zones) * W + t, INF)
        i = int(np.argmin(key))
        if key[i] < INF and (best is None or key[i] < best):
            best, arg = int(key[i]), (z, i)
    if arg is None:
        return None
    z, i = arg
    left = unwind(g, F, z, i)
    right = [(L - e, L - s, sp, n) for s, e, sp, n in reversed(left)]
    n_c = int(cc[i])
    mid = [(a[i], L - a[i], int(kc[i]) * inc, n_c)] if n_c > 0 else []
    count = 1 + 2 * int(F[z, i] // W) + n_c
    return Layout(_merge(left + mid + right), count, True)


def _merge(zones: list[tuple[float, float, float, int]]) -> tuple[tuple[float, float, float, int], ...]:
    """Join neighbouring zones of equal spacing (one zone in the schedule)."""
    out: list[tuple[float, float, float, int]] = []
    for z in zones:
        if out and abs(out[-1][2] - z[2]) <= _EPS * z[2]:
            s, _, sp, n = out[-1]
            out[-1] = (s, z[1], sp, n + z[3])
        else:
            out.append(z)
    return tuple(out)
