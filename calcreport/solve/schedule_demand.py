"""Shear-flow demand along the member for the schedule optimiser (plain floats; inch by convention).

q(x) ≥ 0 is given at samples and is linear between them; a position may appear twice, the left
and the right side of a jump (a support or a point load), in that order. Inside a closed zone the
larger side counts at the jump itself (conservative).

Range maxima on a zone grid are computed once per demand shape and grid and shared by every joint
of the member: each joint's demand is the member's |V(x)| (or its load-duration-weighted demand)
times the joint's Q/I, so the maxima of the shape scale with the joint's factor.
"""

from __future__ import annotations

import numpy as np

__all__ = ["Demand", "is_symmetric", "grid_maxima"]

_EPS = 1e-9


class Demand:
    """Shear-flow demand q(x) ≥ 0 given at samples; linear between samples. A position that
    appears twice (both sides of a jump) counts with its larger value."""

    def __init__(self, x: np.ndarray, q: np.ndarray, length: float):
        order = np.argsort(x, kind="stable")
        self.x = np.asarray(x, float)[order]
        self.q = np.abs(np.asarray(q, float)[order])
        self.length = float(length)
        n = len(self.x)
        starts = np.flatnonzero(np.r_[True, np.diff(self.x) > _EPS]) if n else np.zeros(0, int)
        ends = np.r_[starts[1:], n] - 1 if n else np.zeros(0, int)
        gmax = np.maximum.reduceat(self.q, starts) if n else np.zeros(0)
        self._gmax = np.repeat(gmax, np.diff(np.r_[starts, n])) if n else np.zeros(0)
        self._first = np.repeat(starts, np.diff(np.r_[starts, n])) if n else np.zeros(0, int)
        self._last = np.repeat(ends, np.diff(np.r_[starts, n])) if n else np.zeros(0, int)
        self.peak = float(self.q.max()) if n else 0.0
        self._key: tuple | None = None

    def _locate(self, b: np.ndarray):
        n = len(self.x)
        lo = np.searchsorted(self.x, b - _EPS, "left")
        hi = np.searchsorted(self.x, b + _EPS, "right")
        return n, lo, hi

    def _interp(self, b: np.ndarray, lo: np.ndarray) -> np.ndarray:
        n = len(self.x)
        out = np.empty(b.shape)
        edge = (lo == 0) | (lo >= n)
        out[edge] = self.q[np.minimum(lo[edge], n - 1)]
        mid = ~edge
        l1 = lo[mid]
        x0, x1 = self.x[l1 - 1], self.x[l1]
        t = (b[mid] - x0) / (x1 - x0)
        out[mid] = self.q[l1 - 1] + t * (self.q[l1] - self.q[l1 - 1])
        return out

    def at_many(self, b: np.ndarray) -> np.ndarray:
        """q at positions ``b`` (the larger side at a jump)."""
        b = np.asarray(b, float)
        n, lo, hi = self._locate(b)
        exact = hi > lo
        out = np.empty(b.shape)
        out[exact] = self._gmax[lo[exact]]
        out[~exact] = self._interp(b[~exact], lo[~exact])
        return out

    def sides(self, b: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """Left-side and right-side values of q at positions ``b`` (equal away from jumps)."""
        b = np.asarray(b, float)
        n, lo, hi = self._locate(b)
        exact = hi > lo
        left, right = np.empty(b.shape), np.empty(b.shape)
        left[exact] = self.q[self._first[lo[exact]]]
        right[exact] = self.q[self._last[lo[exact]]]
        v = self._interp(b[~exact], lo[~exact])
        left[~exact] = v
        right[~exact] = v
        return left, right

    def at(self, b: float) -> float:
        return float(self.at_many(np.array([b]))[0])

    def max_over(self, a: float, b: float) -> float:
        """Largest q on the closed interval [a, b]."""
        return float(self.elementary(np.array([a, b]))[0])

    def elementary(self, B: np.ndarray) -> np.ndarray:
        """Largest q on each closed [B[k], B[k+1]]."""
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
        ends = self.at_many(B) if len(B) else np.zeros(0)
        return np.maximum(inner, np.maximum(ends[:-1], ends[1:]))

    def bound(self, cap_row: float, s_max: float) -> float:
        """∫ max(q/(n·F), 1/s_max) dx, exact for the piecewise-linear q."""
        x0, x1, q0, q1 = self.x[:-1], self.x[1:], self.q[:-1], self.q[1:]
        h = x1 - x0
        keep = h > 0
        h, q0, q1 = h[keep], q0[keep], q1[keep]
        floor = 1.0 / s_max
        d0, d1 = q0 / cap_row - floor, q1 / cap_row - floor
        both = (d0 >= 0) & (d1 >= 0)
        cross = ((d0 > 0) & (d1 < 0)) | ((d0 < 0) & (d1 > 0))
        pos = np.where(d0 > 0, d0, d1)
        neg = np.where(d0 > 0, d1, d0)
        with np.errstate(divide="ignore", invalid="ignore"):
            part = np.where(cross, 0.5 * pos * h * pos / np.where(cross, pos - neg, 1.0), 0.0)
        excess = np.where(both, 0.5 * (d0 + d1) * h, part)
        return float(np.sum(floor * h + excess))

    def window(self, a: float, b: float) -> Demand:
        """The demand on [a, b], shifted to start at 0. At each end the value at the point itself
        stays the larger of the two sides (as on the whole member) and the side inside the window
        follows it, so the window is symmetric exactly when its own stretch is."""
        tol = _EPS
        keep = (self.x > a + tol) & (self.x < b - tol)
        x, q = self.x[keep] - a, self.q[keep]
        la, ra = self.sides(np.array([a]))
        lb, rb = self.sides(np.array([b]))
        xs = np.r_[0.0, 0.0, x, b - a, b - a]
        qs = np.r_[max(la[0], ra[0]), ra[0], q, lb[0], max(lb[0], rb[0])]
        return Demand(xs, qs, b - a)

    def reversed(self) -> Demand:
        return Demand(self.length - self.x[::-1], self.q[::-1], self.length)

    def key(self) -> tuple:
        """Identity of the demand's shape (scaled to its peak, to 12 decimals) for sharing range
        maxima and solutions between joints whose demands are scaled copies of one shape (the
        copies differ in the last bits only; far inside the 1e-9 tolerance of the spacing rule)."""
        if self._key is None:
            scale = self.peak if self.peak > 0 else 1.0
            self._key = (self.x.tobytes(), np.round(self.q / scale, 12).tobytes(), self.length)
        return self._key


def is_symmetric(d: Demand, rtol: float = 1e-6) -> bool:
    """q(x) = q(L − x) along the whole member, decided on the demand itself: at every sample
    position and its mirror image the left side of q at x is compared with the right side at
    L − x and the right side at x with the left side at L − x (both sides of every jump as a
    pair), each pair within ``rtol`` of the larger value (plus 1e-9 of the peak near zero)."""
    if d.peak == 0.0:
        return True
    L = d.length
    p = np.sort(np.r_[d.x, L - d.x])
    p = p[np.r_[True, np.diff(p) > _EPS * max(L, 1.0)]]
    left, right = d.sides(p)
    mleft, mright = d.sides(L - p)
    tol_l = rtol * np.maximum(left, mright) + 1e-9 * d.peak
    tol_r = rtol * np.maximum(right, mleft) + 1e-9 * d.peak
    return bool(np.all(np.abs(left - mright) <= tol_l) and np.all(np.abs(right - mleft) <= tol_r))


_GRID_CACHE: dict[tuple, np.ndarray] = {}
_GRID_MAX = 64


def grid_maxima(d: Demand, B: np.ndarray, tag: str) -> np.ndarray:
    """:meth:`Demand.elementary` on boundaries ``B``, in units of the demand's peak, remembered by
    the demand's shape so that joints whose demands are scaled copies share it. Multiply by
    ``d.peak`` for the joint's values."""
    key = (*d.key(), tag, B.tobytes())
    hit = _GRID_CACHE.get(key)
    if hit is None:
        if len(_GRID_CACHE) >= _GRID_MAX:
            _GRID_CACHE.pop(next(iter(_GRID_CACHE)))
        scale = d.peak if d.peak > 0 else 1.0
        hit = d.elementary(B) / scale if len(B) > 1 else np.zeros(0)
        _GRID_CACHE[key] = hit
    return hit
