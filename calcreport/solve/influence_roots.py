"""Cubics of the influence lines (:mod:`calcreport.solve.influence`) in plain floats: evaluation,
real roots of their derivative in (0, 1), and the cut points where a cubic times a linear load
changes sign (roots of η′ in closed form, of η by bisection inside each monotonic piece, of w).
Split from ``influence.py``; used there under their former private names."""

from __future__ import annotations

import numpy as np

__all__ = ["poly", "quad_roots", "cuts"]

_BISECT = 48  # bisection steps for a root inside a monotonic piece (2⁻⁴⁸ of an element)


def poly(c: np.ndarray, t: np.ndarray) -> np.ndarray:
    return c[..., 0] + t * (c[..., 1] + t * (c[..., 2] + t * c[..., 3]))


def quad_roots(a: np.ndarray, b: np.ndarray, c: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots of a·t² + b·t + c in (0, 1); 0 where there is none (a harmless extra cut).

    Scaled by the largest coefficient; the root of smaller magnitude as c / q with
    q = −(b + sign(b)·√(b² − 4ac)) / 2 and the other as q / a, the numerically stable pair
    (Press et al., Numerical Recipes, 3rd ed., §5.6); −c / b when a is negligible.
    """
    scale = np.maximum(np.maximum(np.abs(a), np.abs(b)), np.abs(c))
    scale = np.where(scale > 0, scale, 1.0)
    a, b, c = a / scale, b / scale, c / scale
    quad = np.abs(a) > 1e-13
    disc = b * b
    disc -= 4 * a * c
    sq = np.where(disc > 0, disc, 0.0)
    np.sqrt(sq, out=sq)
    q = np.where(b >= 0, sq, -sq)
    q += b
    q *= -0.5
    with np.errstate(divide="ignore", invalid="ignore"):
        den = np.where(quad, q, -b)  # c / (−b) is (−c) / b to the bit
        r1 = c / den
        r1[den == 0] = 0.0
        r2 = q / a
    r2[~(quad & (disc > 0))] = 0.0
    # a root in (0, 1) is finite; a quadratic's first root needs a real pair
    r1[~((r1 > 0) & (r1 < 1) & (~quad | (disc >= 0)))] = 0.0
    r2[~((r2 > 0) & (r2 < 1))] = 0.0
    return r1, r2


def cuts(c: np.ndarray, w0: np.ndarray, w1: np.ndarray) -> np.ndarray:
    """Sorted cut points in [0, 1] of each cubic c (…, 4) times the line w0 + w1·t: the ends, the
    roots of η′, the root of w and the roots of η (one per monotonic piece, by bisection)."""
    d1, d2 = quad_roots(3 * c[..., 3], 2 * c[..., 2], c[..., 1])
    with np.errstate(divide="ignore", invalid="ignore"):
        tw = np.where(w1 != 0, -w0 / w1, 0.0)
    tw = np.where((tw > 0) & (tw < 1), tw, 0.0)
    tw = np.broadcast_to(tw, d1.shape)
    zero, one = np.zeros_like(d1), np.ones_like(d1)
    T = np.sort(np.stack([zero, d1, d2, one], axis=-1), axis=-1)
    lo, hi = T[..., :-1], T[..., 1:]
    cc = c[..., None, :]
    flo, fhi = poly(cc, lo), poly(cc, hi)
    change = (flo * fhi) < 0
    roots = np.zeros(lo.shape)
    if change.any():
        k = np.nonzero(change)
        cs, a, b, fa = c[k[:-1]], lo[k], hi[k], flo[k]
        for _ in range(_BISECT):
            mid = 0.5 * (a + b)
            left = (fa * poly(cs, mid)) <= 0
            b = np.where(left, mid, b)
            a = np.where(left, a, mid)
        roots[k] = 0.5 * (a + b)
    return np.sort(np.concatenate([T, roots, tw[..., None]], axis=-1), axis=-1)
