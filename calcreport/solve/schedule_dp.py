"""Exact optimiser of a zoned connector schedule (plain floats; inch by convention).

Rules (the schedule these functions optimise; :mod:`calcreport.solve.schedule` documents them for
the report):

* Spacings are whole multiples of the increment ``inc`` within [s_min, s_max].
* Zones are built from the member ends inwards. A zone built from an end ("chain zone") has a
  length that is a whole multiple of the module (``module`` if given, otherwise its own spacing);
  one central zone takes what is left between the chains (any length ≥ 0).
* Symmetric demand: the left chain is mirrored on the right; at most Z − 1 chain zones per side
  plus the central zone, i.e. at most Z distinct zones per half span.
  Otherwise: the left and right chains have at most 2Z − 2 zones together, plus the central
  zone (at most 2Z − 1 zones in all).
* Every zone's spacing satisfies s ≤ n·F / q(x) at every x of the closed zone.
* Connector count: one connector at x = 0, then each zone adds ceil(ℓ / s) connectors placed
  at its spacing from its start (a chain zone's length is a multiple of s when the module is the
  spacing, so its last connector falls on its end). N = 1 + Σ ceil(ℓᵢ / sᵢ); no gap exceeds its
  zone's spacing.

The dynamic programme over zone boundaries on the module grid is exact: it minimises N over all
schedules these rules allow (tests compare it with brute-force enumeration).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

__all__ = ["Demand", "Layout", "optimise", "is_symmetric"]

_EPS = 1e-9
_INF = float("inf")


class Demand:
    """Shear-flow demand q(x) ≥ 0 given at samples; linear between samples. A position that
    appears twice (both sides of a jump) counts with its larger value."""

    def __init__(self, x: np.ndarray, q: np.ndarray, length: float):
        order = np.argsort(x, kind="stable")
        self.x = np.asarray(x, float)[order]
        self.q = np.abs(np.asarray(q, float)[order])
        self.length = float(length)
        # largest q of each group of samples at one position (both sides of a jump)
        n = len(self.x)
        starts = np.flatnonzero(np.r_[True, np.diff(self.x) > _EPS]) if n else np.zeros(0, int)
        gmax = np.maximum.reduceat(self.q, starts) if n else np.zeros(0)
        self._gmax = np.repeat(gmax, np.diff(np.r_[starts, n])) if n else np.zeros(0)

    def at_many(self, b: np.ndarray) -> np.ndarray:
        """:meth:`at` for an array of positions (vectorised, same values)."""
        b = np.asarray(b, float)
        n = len(self.x)
        lo = np.searchsorted(self.x, b - _EPS, "left")
        hi = np.searchsorted(self.x, b + _EPS, "right")
        out = np.empty(b.shape)
        exact = hi > lo
        out[exact] = self._gmax[lo[exact]]
        edge = ~exact & ((lo == 0) | (lo >= n))
        out[edge] = self.q[np.minimum(lo[edge], n - 1)]
        mid = ~exact & ~edge
        l1 = lo[mid]
        x0, x1 = self.x[l1 - 1], self.x[l1]
        t = (b[mid] - x0) / (x1 - x0)
        out[mid] = self.q[l1 - 1] + t * (self.q[l1] - self.q[l1 - 1])
        return out

    def at(self, b: float) -> float:
        lo = np.searchsorted(self.x, b - _EPS, "left")
        hi = np.searchsorted(self.x, b + _EPS, "right")
        if hi > lo:
            return float(self.q[lo:hi].max())
        if lo == 0 or lo >= len(self.x):
            return float(self.q[min(lo, len(self.x) - 1)])
        x0, x1 = self.x[lo - 1], self.x[lo]
        t = (b - x0) / (x1 - x0)
        return float(self.q[lo - 1] + t * (self.q[lo] - self.q[lo - 1]))

    def max_over(self, a: float, b: float) -> float:
        """Largest q on the closed interval [a, b]."""
        lo = np.searchsorted(self.x, a + _EPS, "right")
        hi = np.searchsorted(self.x, b - _EPS, "left")
        inner = float(self.q[lo:hi].max()) if hi > lo else 0.0
        return max(inner, self.at(a), self.at(b))

    def elementary(self, B: np.ndarray) -> np.ndarray:
        """Largest q on each [B[k], B[k+1]] (vectorised :meth:`max_over`)."""
        B = np.asarray(B, float)
        a, b = B[:-1], B[1:]
        lo = np.searchsorted(self.x, a + _EPS, "right")
        hi = np.searchsorted(self.x, b - _EPS, "left")
        inner = np.zeros(len(a))
        ok = hi > lo
        if ok.any():
            idx = np.empty(2 * int(ok.sum()), int)
            idx[0::2], idx[1::2] = lo[ok], hi[ok]
            red = np.maximum.reduceat(np.r_[self.q, 0.0], idx)  # q[lo:hi] per interval
            inner[ok] = red[0::2]
        return np.maximum(inner, np.maximum(self.at_many(a), self.at_many(b)))

    def bound(self, cap_row: float, s_max: float) -> float:
        """∫ max(q/(n·F), 1/s_max) dx, exact for the piecewise-linear q."""
        total = 0.0
        floor = 1.0 / s_max
        for x0, x1, q0, q1 in zip(self.x[:-1], self.x[1:], self.q[:-1], self.q[1:]):
            h = x1 - x0
            if h <= 0:
                continue
            d0, d1 = q0 / cap_row - floor, q1 / cap_row - floor
            if d0 >= 0 and d1 >= 0:
                excess = 0.5 * (d0 + d1) * h
            elif d0 <= 0 and d1 <= 0:
                excess = 0.0
            else:  # crosses the floor once
                pos, neg = (d0, d1) if d0 > 0 else (d1, d0)
                excess = 0.5 * pos * h * pos / (pos - neg)
            total += floor * h + excess
        return total

    def reversed(self) -> Demand:
        return Demand(self.length - self.x[::-1], self.q[::-1], self.length)


def is_symmetric(d: Demand, rtol: float = 1e-6) -> bool:
    """q(x) = q(L − x) at every sample (within ``rtol`` of the peak)."""
    peak = float(d.q.max()) if d.q.size else 0.0
    if peak == 0.0:
        return True
    tol = rtol * peak + 1e-12
    mirrored = d.at_many(d.length - d.x)
    return bool(np.all(np.abs(mirrored - d.q) <= tol) and np.all(np.abs(d.at_many(d.x) - mirrored) <= tol))


@dataclass(frozen=True)
class Layout:
    """An optimal schedule: zones as (start, end, spacing, count) from x = 0 to the length."""

    zones: tuple[tuple[float, float, float, int], ...]
    count: int
    symmetric: bool


def _range_max(d: Demand, starts: np.ndarray, ends: np.ndarray) -> np.ndarray:
    """R[i, j] = max q over [starts[i], ends[j]] (−1 where ends[j] < starts[i])."""
    B = np.unique(np.concatenate([starts, ends]))
    qe = d.elementary(B) if len(B) > 1 else np.zeros(0)
    si = np.searchsorted(B, starts)
    ej = np.searchsorted(B, ends)
    n = len(B) - 1
    E = np.where(np.arange(n)[None, :] >= si[:, None], qe[None, :], 0.0) if n else np.zeros((len(starts), 0))
    run = np.maximum.accumulate(E, axis=1) if n else E
    pt = d.at_many(starts)
    if n:
        cols = np.where(ej[None, :] > si[:, None], run[:, np.maximum(ej - 1, 0)], 0.0)
    else:
        cols = np.zeros((len(starts), len(ends)))
    return np.where(ej[None, :] >= si[:, None], np.maximum(cols, pt[:, None]), -1.0)


def _allowed(cap: np.ndarray, cap_row: float, inc: float, kmin: int, kmax: int) -> np.ndarray:
    """Largest allowed spacing index k (spacing k·inc) with k·inc ≤ n·F/q; 0 where none."""
    with np.errstate(divide="ignore", over="ignore"):
        s_req = np.where(cap > 0, cap_row / np.where(cap > 0, cap, 1.0), _INF)
    k = np.floor(np.minimum(s_req / inc, kmax) * (1 + _EPS) + _EPS)
    k = np.minimum(k, kmax)
    return np.where((k >= kmin) & (cap >= 0), k, 0).astype(int)


def _chain(
    d: Demand,
    P: int,
    u: float,
    inc: float,
    kmin: int,
    kmax: int,
    cap_row: float,
    zones: int,
    own_module: bool,
):
    """f[z, j] = fewest connectors on [0, j·u] with at most z chain zones; back pointers."""
    pos = np.arange(P + 1) * u
    R = _range_max(d, pos, pos)
    kbest = _allowed(R, cap_row, inc, kmin, kmax)
    cost = np.full((P + 1, P + 1), _INF)
    kcost = np.zeros((P + 1, P + 1), int)
    if own_module:  # zone length a multiple of its spacing k·inc (u = inc): diagonals d = m·k
        for k in range(min(kmax, P), kmin - 1, -1):
            for m in range(1, P // k + 1):
                i = np.arange(P + 1 - m * k)
                j = i + m * k
                better = (kbest[i, j] >= k) & (m < cost[i, j])
                cost[i[better], j[better]] = m
                kcost[i[better], j[better]] = k
    else:
        ii, jj = np.indices(cost.shape)
        span = jj - ii
        ok = (span > 0) & (kbest > 0)
        cost = np.where(ok, np.ceil(span * u / np.maximum(kbest, 1) / inc - _EPS), _INF)
        kcost = np.where(ok, kbest, 0)
    f = np.full((zones + 1, P + 1), _INF)
    back = np.full((zones + 1, P + 1), -1, int)
    f[0, 0] = 0.0
    for z in range(1, zones + 1):
        tot = f[z - 1][:, None] + cost
        arg = np.argmin(tot, axis=0)
        best = tot[arg, np.arange(P + 1)]
        keep = f[z - 1] <= best  # fewer zones win ties
        f[z] = np.where(keep, f[z - 1], best)
        back[z] = np.where(keep, -1, arg)
    return f, back, kcost, pos


def _unwind(f, back, kcost, pos, z, j, inc) -> list[tuple[float, float, float, int]]:
    out = []
    while j > 0:
        while back[z, j] < 0:
            z -= 1
        i = back[z, j]
        k = kcost[i, j]
        out.append((pos[i], pos[j], k * inc, int(round(f[z, j] - f[z - 1, i]))))
        j, z = i, z - 1
    return out[::-1]


def _central(length: float, a: float, b: float, qmax: float, cap_row, inc, kmin, kmax):
    if b - a <= _EPS * max(length, 1):
        return 0.0, 0
    k = int(_allowed(np.array([qmax]), cap_row, inc, kmin, kmax)[0])
    if k == 0:
        return _INF, 0
    return float(np.ceil((b - a) / (k * inc) - _EPS)), k


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
) -> Layout | None:
    """Fewest-connector schedule under the module rules, or ``None`` when none exists
    (demand needs a spacing below s_min somewhere).

    Joints with the same demand and rules (the two flanges of a symmetric box beam) share one
    solution: results are remembered by the exact inputs.
    """
    key = (
        d.x.tobytes(),
        d.q.tobytes(),
        d.length,
        cap_row,
        inc,
        s_min,
        s_max,
        zones_per_half,
        module,
        symmetric,
    )
    if key not in _MEMO:
        if len(_MEMO) >= _MEMO_MAX:
            _MEMO.pop(next(iter(_MEMO)))
        _MEMO[key] = _optimise(d, cap_row, inc, s_min, s_max, zones_per_half, module, symmetric)
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
) -> Layout | None:
    L = d.length
    kmin = max(1, int(np.ceil(s_min / inc - _EPS)))
    kmax = int(np.floor(s_max / inc + _EPS))
    if kmax < kmin:
        return None
    sym = is_symmetric(d) if symmetric is None else symmetric
    u = module if module else inc
    own = not module
    Z = max(1, int(zones_per_half))
    if sym:
        P = int(np.floor(L / 2 / u + _EPS))
        f, back, kc, pos = _chain(d, P, u, inc, kmin, kmax, cap_row, Z - 1, own)
        best, arg = _INF, None
        for i in range(P + 1):
            if not np.isfinite(f[Z - 1, i]):
                continue
            cc, k = _central(L, pos[i], L - pos[i], d.max_over(pos[i], L - pos[i]), cap_row, inc, kmin, kmax)
            tot = 1 + 2 * f[Z - 1, i] + cc
            if tot < best - _EPS:
                best, arg = tot, (i, k, cc)
        if arg is None:
            return None
        i, k, cc = arg
        left = _unwind(f, back, kc, pos, Z - 1, i, inc)
        right = [(L - e, L - s, sp, n) for s, e, sp, n in reversed(left)]
        mid = [(pos[i], L - pos[i], k * inc, int(cc))] if cc > 0 else []
        return Layout(_merge(left + mid + right), int(round(best)), True)
    P = int(np.floor(L / u + _EPS))
    K = 2 * Z - 2
    fl, bl, kl, pos = _chain(d, P, u, inc, kmin, kmax, cap_row, K, own)
    fr, br, kr, _ = _chain(d.reversed(), P, u, inc, kmin, kmax, cap_row, K, own)
    R = _range_max(d, pos, L - pos)
    kc = _allowed(R, cap_row, inc, kmin, kmax)
    gap = (L - pos)[None, :] - pos[:, None]
    with np.errstate(invalid="ignore"):
        cc = np.where(
            gap <= _EPS * max(L, 1),
            0.0,
            np.where(kc > 0, np.ceil(gap / np.maximum(kc, 1) / inc - _EPS), _INF),
        )
    cc = np.where(gap < -_EPS * max(L, 1), _INF, cc)
    best, arg = _INF, None
    for zl in range(K + 1):
        tot = 1 + fl[zl][:, None] + fr[K - zl][None, :] + cc
        j = int(np.argmin(tot))
        if tot.flat[j] < best - _EPS:
            a, b = np.unravel_index(j, tot.shape)
            best, arg = float(tot.flat[j]), (zl, int(a), int(b))
    if arg is None or not np.isfinite(best):
        return None
    zl, i, j = arg
    left = _unwind(fl, bl, kl, pos, zl, i, inc)
    rr = _unwind(fr, br, kr, pos, K - zl, j, inc)
    right = [(L - e, L - s, sp, n) for s, e, sp, n in reversed(rr)]
    mid = [(pos[i], L - pos[j], kc[i, j] * inc, int(cc[i, j]))] if cc[i, j] > 0 else []
    return Layout(_merge(left + mid + right), int(round(best)), False)


def _merge(zones):
    """Join neighbouring zones of equal spacing (one zone in the schedule)."""
    out: list[tuple[float, float, float, int]] = []
    for z in zones:
        if out and abs(out[-1][2] - z[2]) <= _EPS * z[2]:
            s, _, sp, n = out[-1]
            out[-1] = (s, z[1], sp, n + z[3])
        else:
            out.append(z)
    return tuple(out)
