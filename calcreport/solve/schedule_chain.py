"""Chains of zones from one end of a stretch, by running minima over the spacing index.

A chain zone from grid point i to grid point j (positions i·u, j·u) with spacing k·inc is allowed
when every elementary interval [t·u, (t+1)·u] inside it allows spacing k (``kb[t] ≥ k``); the
allowed starts i of a zone ending at j form one run back to the last interval that does not
allow k. Its cost is (j − i)/k with the zone's own module (then j − i must be a multiple of k) or
ceil((j − i)·r / k) with a fixed module of r increments. Both are separable once the chain's
count is an integer:

    N_i + ceil((j − i)·r / k) = ceil((k·N_i − i·r + j·r) / k)

so the best start for every j and k is a running minimum of k·N_i − i·r along the member
(per residue class of i mod k for the own module), restarted at every interval that does not
allow k. Time O(P·K) per chain zone, memory O(P·K) for the restart marks.

Values are encoded as integers W·N + t, where t = kmax − k of the chain's end zone (the zone at
the end of the member): smaller is better, so among equal counts the larger end spacing wins.
With the own module the encoding is exact; with a fixed module the count is exact and the end
spacing preference holds among equal running minima. Common practice, no source (rules of the
schedule); the optimisation itself is exact enumeration by dynamic programming.
"""

from __future__ import annotations

import numpy as np

__all__ = ["INF", "Grid", "chain_table", "unwind", "central_pairs"]

INF = 1 << 45
_BIG = 1 << 46
_EPS = 1e-9


class Grid:
    """Zone grid of one chain: P + 1 points at spacing u; kb[t] the largest spacing index allowed
    on elementary interval t (0: none). A plain class: a dataclass costs start-up time."""

    __slots__ = ("P", "u", "inc", "r", "own", "kmin", "kmax", "kb", "_seg")

    def __init__(self, P: int, u: float, inc: float, r: int, own: bool, kmin: int, kmax: int, kb: np.ndarray):
        self.P, self.u, self.inc, self.r, self.own = P, u, inc, r, own  # r: module in increments
        self.kmin, self.kmax, self.kb = kmin, kmax, kb
        self._seg: np.ndarray | None = None

    @property
    def ktop(self) -> int:
        """Largest spacing index worth trying (longer spacings cannot fit or cost the same)."""
        return min(self.kmax, self.P * self.r) if not self.own else min(self.kmax, self.P)

    def seg(self) -> np.ndarray:
        """seg[k − kmin, i]: number of intervals t < i that do not allow spacing k."""
        if self._seg is None:
            ks = np.arange(self.kmin, self.ktop + 1)
            bad = self.kb[None, :] < ks[:, None]
            s = np.zeros((len(ks), self.P + 1), np.int32)
            if self.P:
                np.cumsum(bad, axis=1, out=s[:, 1:])
            self._seg = s
        return self._seg


def seg_cummin(v: np.ndarray, seg: np.ndarray, axis: int = -1) -> np.ndarray:
    """Running minimum of integer ``v`` along ``axis``, restarted wherever ``seg`` (non-decreasing
    along the axis) steps up."""
    off = seg.astype(np.int64) * _BIG
    return np.minimum.accumulate(v - off, axis=axis) + off


def chain_table(g: Grid, zones: int) -> np.ndarray:
    """F[z, j]: best encoded chain (W·N + t) from the end to point j with at most z zones."""
    P, W = g.P, g.kmax + 1
    F = np.full((zones + 1, P + 1), INF, np.int64)
    F[0, 0] = 0
    if zones == 0 or P == 0 or g.ktop < g.kmin:
        return F
    segs = g.seg()
    j = np.arange(P + 1, dtype=np.int64)
    ks = np.array(_spacings(g), np.int64)
    if not ks.size:
        return F
    F[1] = np.minimum(F[0], _first_layer(g, segs, ks, j, W))
    plans = [_plan(g, segs[k - g.kmin], int(k)) for k in ks] if zones > 1 else []
    Wj = W * j
    for z in range(2, zones + 1):
        prev = F[z - 1]
        if z > 2 and np.array_equal(prev, F[z - 2]):  # one more zone helped nowhere: nor will the next
            F[z:] = prev
            break
        best = prev.copy()
        fin = prev < INF
        fin[0] = False  # a zone from the end itself is a first zone (layer 1, its end spacing counts)
        if g.own:
            for k, buf, off, ok in plans:
                H = buf[: P + 1]
                np.multiply(prev, k, out=H)
                H -= Wj
                H[~fin] = INF
                S = buf.reshape(-1, k) - off
                np.minimum.accumulate(S, axis=0, out=S)
                S += off
                Sm = S.ravel()[: P + 1 - k]
                cand = (Sm + Wj[k:]) // k
                cand[~ok | (Sm >= INF // 2)] = INF
                np.minimum(best[k:], cand, out=best[k:])
        else:
            N, t = prev // W, prev % W
            for k, _buf, off, ok in plans:
                H = (k * N - g.r * j) * W + t
                H[~fin] = INF
                S = np.minimum.accumulate(H - off) + off
                Sm = S[:-1]
                h, tt = Sm // W, Sm % W
                cand = W * (-((-(h + j[1:] * g.r)) // k)) + tt
                cand[~ok | (Sm >= INF // 2)] = INF
                np.minimum(best[1:], cand, out=best[1:])
        F[z] = best
    return F


def _first_layer(g: Grid, segs: np.ndarray, ks: np.ndarray, j: np.ndarray, W: int) -> np.ndarray:
    """Best single zone from the end to each point, over all spacings."""
    if g.own:  # zone lengths are multiples of the spacing: only every k-th point, per k
        best = np.full(len(j), INF, np.int64)
        for k in ks.tolist():
            seg = segs[k - g.kmin, k::k]
            pts = j[k::k]
            cand = np.where(seg == 0, W * (pts // k) + (g.kmax - k), INF)
            np.minimum(best[k::k], cand, out=best[k::k])
        return best
    seg = segs[ks - g.kmin]
    ok = seg == 0
    ok[:, 0] = False
    kk = ks[:, None]
    n = -((-j[None, :] * g.r) // kk)
    return np.where(ok, W * n + (g.kmax - kk), INF).min(axis=0)


def _plan(g: Grid, seg: np.ndarray, k: int):
    """Per spacing k: work buffer, restart offsets and the mask of zones that fit (no interval
    in a zone of length k·(own) or 1·(fixed) grid steps that refuses k)."""
    P = g.P
    if g.own:
        rows = -(-(P + 1) // k)
        buf = np.full(rows * k, INF, np.int64)
        sp = np.full(rows * k, seg[-1], np.int64)
        sp[: P + 1] = seg
        off = (sp * _BIG).reshape(rows, k)
        ok = seg[:-k] == seg[k:] if P >= k else np.zeros(0, bool)
        return k, buf, off, ok
    off = seg.astype(np.int64) * _BIG
    return k, None, off, seg[:-1] == seg[1:]


def _spacings(g: Grid) -> list[int]:
    """Spacing indices to try: all with the own module (a zone's length must be a multiple of
    its spacing); with a fixed module only those some interval allows as its largest, since a
    zone's best spacing is the largest its intervals allow (the count falls with the spacing)."""
    if g.own:
        return list(range(g.kmin, g.ktop + 1))
    return distinct(np.minimum(g.kb, g.ktop), g.kmin)


def distinct(v: np.ndarray, lowest: int) -> list[int]:
    """Sorted distinct integers of ``v`` from ``lowest`` up (np.unique would import numpy.ma)."""
    s = np.sort(v[v >= lowest])
    return [int(k) for k in s[np.r_[True, s[1:] != s[:-1]]]] if s.size else []


def unwind(g: Grid, F: np.ndarray, z: int, j: int) -> list[tuple[float, float, float, int]]:
    """Zones (start, end, spacing, count) of the chain behind F[z, j], from the end inwards."""
    W = g.kmax + 1
    out: list[tuple[float, float, float, int]] = []
    v = int(F[z, j])
    segs = g.seg() if g.P else None
    while j > 0:
        while z > 0 and int(F[z - 1, j]) == v:
            z -= 1
        assert z > 0 and segs is not None, "chain value without a zone"
        if z == 1:
            i, k = 0, g.kmax - v % W
        else:
            i, k = _step(g, F[z - 1], segs, j, v, W)
        n = v // W - int(F[z - 1, i]) // W
        if not g.own:  # the largest spacing the zone allows, at the same count
            kb = int(g.kb[i:j].min())
            if kb > k and -(-(j - i) * g.r // kb) == n:
                k = kb
        out.append((i * g.u, j * g.u, k * g.inc, int(n)))
        v, j, z = int(F[z - 1, i]), i, z - 1
    return out[::-1]


def _step(g: Grid, prev: np.ndarray, segs: np.ndarray, j: int, v: int, W: int) -> tuple[int, int]:
    """A (start, spacing index) whose zone ending at j gives the chain value v from ``prev``."""
    N, t = prev // W, prev % W
    for k in reversed(_spacings(g)):
        seg = segs[k - g.kmin]
        if g.own:
            i = np.arange(j - k, 0, -k)
            if not i.size:
                continue
            cost = (j - i) // k
        else:
            i = np.arange(j - 1, 0, -1)
            cost = -((-(j - i) * g.r) // k)
        ok = (seg[i] == seg[j]) & (prev[i] < INF) & (W * (N[i] + cost) + t[i] == v)
        if ok.any():
            return int(i[np.argmax(ok)]), k
    raise AssertionError("no zone reproduces the chain value")


def central_pairs(FL, FR, K, a, b, G, kbG, g: Grid, lam: float, tol: float, W: int, kmin: int, kmax: int):
    """Best left chain (to a_i), right chain (to b_j = L − j·u) and central zone [a_i, b_j].

    Returns (N, zl, zr, i, j, k, n_central) for the fewest connectors, then the fewest zones, then
    the larger end spacings; ``None`` when no schedule exists. ``lam`` is L / inc.
    """
    P = len(a) - 1
    r = g.r
    W2 = 2 * W
    idxA = np.searchsorted(G, a - tol)
    idxB = np.searchsorted(G, b - tol)
    istar = np.searchsorted(a, b - tol, "left") - 1
    has = istar >= 0
    ist = np.maximum(istar, 0)
    ii = np.arange(P + 1, dtype=np.int64)
    pairs = [(zl, zr) for zl in range(K + 1) for zr in range(K + 1 - zl)]
    # exact zone counts of the "at most" rows
    zex_l = _exact_zones(FL)
    zex_r = _exact_zones(FR)
    candidates = []  # (key tuple, detail)
    # central zone of zero length: chains meet (L a whole number of modules)
    m = lam / r
    if abs(m - round(m)) <= 1e-9 * max(1.0, m):
        n0 = int(round(m))
        i0 = np.arange(max(0, n0 - P), min(P, n0) + 1)
        if i0.size:
            j0 = n0 - i0
            for zl, zr in pairs:
                ok = (FL[zl, i0] < INF) & (FR[zr, j0] < INF)
                if not ok.any():
                    continue
                N = 1 + FL[zl, i0] // W + FR[zr, j0] // W
                zc = zex_l[zl, i0] + zex_r[zr, j0]
                tt = FL[zl, i0] % W + FR[zr, j0] % W
                key = np.where(ok, (N * (2 * K + 4) + zc) * W2 + tt, INF)
                q = int(np.argmin(key))
                if key[q] < INF:
                    candidates.append((int(key[q]), (int(N[q]), zl, zr, int(i0[q]), int(j0[q]), 0, 0)))
    # Per left chain row and right end point j: the fewest connectors of left chain + central
    # zone [a_i, b_j] over i and the central spacing k (a pair's best k is the largest its
    # interval allows, one of the values of kbG): running minima of k·N_i − i·r over i.
    finFL, NLr, tLr = FL < INF, FL // W, FL % W
    finFR, NRr, tRr = FR < INF, FR // W, FR % W
    Cb = np.full((K + 1, P + 1), INF, np.int64)  # (left count + central count)·W2 + t_left
    Kb = np.zeros((K + 1, P + 1), np.int64)
    NLW, iir = NLr * W2, ii * (r * W2)
    seg = np.zeros(len(G), np.int64)
    for k in distinct(kbG, kmin):
        np.cumsum(kbG < k, out=seg[1:])
        sA, sB = seg[idxA], seg[idxB]
        J = np.flatnonzero(has & (sA[ist] == sB))
        if not J.size:
            continue
        HL = _left_values(k, NLW, iir, tLr, finFL, kmax)
        off = sA * _BIG
        S = np.minimum.accumulate(HL - off, axis=1)
        S += off
        Sm = S[:, ist[J]]
        hl = Sm // W2
        C = np.ceil((hl - J * r + lam) / k - _EPS).astype(np.int64)
        enc = C * W2 + (Sm - hl * W2)
        enc[Sm >= INF // 2] = INF
        cur = Cb[:, J]
        better = enc < cur
        Cb[:, J] = np.where(better, enc, cur)
        Kb[:, J] = np.where(better, k, Kb[:, J])
    pl = np.array([p[0] for p in pairs])
    pr = np.array([p[1] for p in pairs])
    C_rows, K_rows = Cb[pl], Kb[pl]
    ok = (C_rows < INF) & finFR[pr]
    if ok.any():
        jidx = np.arange(P + 1)
        N = 1 + C_rows // W2 + NRr[pr]
        t_right = np.where(jidx[None, :] == 0, kmax - K_rows, tRr[pr])
        key = np.where(ok, (N * (2 * K + 4) + (pl + pr + 1)[:, None]) * W2 + C_rows % W2 + t_right, INF)
        p, jj = divmod(int(np.argmin(key)), P + 1)
        zl, zr = pairs[p]
        k = int(Kb[zl, jj])
        np.cumsum(kbG < k, out=seg[1:])
        sA, sB = seg[idxA], seg[idxB]
        HL = _left_values(k, NLW[zl : zl + 1], iir, tLr[zl : zl + 1], finFL[zl : zl + 1], kmax)[0]
        S = seg_cummin(HL, sA)
        i = int(np.flatnonzero((HL == S[ist[jj]]) & (sA == sB[jj]) & (a < b[jj] - tol))[0])
        n_c = int(np.ceil((b[jj] - a[i]) / (k * g.inc) - _EPS))
        zc = int(zex_l[zl, i] + zex_r[zr, jj]) + 1  # zones the chosen chains really use
        kk = (int(N[p, jj]) * (2 * K + 4) + zc) * W2 + int(C_rows[p, jj] % W2 + t_right[p, jj])
        candidates.append((kk, (int(N[p, jj]), zl, zr, i, jj, k, n_c)))
    if not candidates:
        return None
    return min(candidates, key=lambda c: c[0])[1]


def _left_values(k, NLW, iir, tL, fin, kmax):
    """(k·N_i − i·r)·W2 + t_i of left chain rows; a missing left chain (i = 0) takes the central
    zone's spacing as its end spacing."""
    HL = k * NLW - iir + tL
    HL[~fin] = INF
    HL[:, 0] = np.where(fin[:, 0], kmax - k, INF)
    return HL


def _exact_zones(F: np.ndarray) -> np.ndarray:
    """Zones actually used by the chain behind each "at most z" entry."""
    z = np.zeros(F.shape, np.int64)
    for q in range(1, F.shape[0]):
        z[q] = np.where(F[q] == F[q - 1], z[q - 1], q)
    return z
