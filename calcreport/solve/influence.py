"""Influence lines of the stiffness model and the worst placement of variable loads, in plain floats.

Every response the beam reports at a station (shear just left or right of a node, moment, deflection,
a support reaction) is a linear function of the load. For a unit point load at ξ its value is the
influence ordinate η(ξ). With Euler-Bernoulli elements and consistent load vectors the ordinate is,
inside every element, exactly a cubic in the element coordinate t = (ξ − x_e)/h:

    η(ξ) = Σ_k A[2e + k]·N_k(t)  (+ σ·N_r(t) on the element whose end force gives the response),

where A = (response row) · K⁻¹ is the response to unit nodal forces and moments and N_k are the
Hermite shape functions (matrix structural analysis; Müller-Breslau: the influence line of a force
is the deflected shape of the beam for a unit discontinuity, a cubic between nodes). K is factorised
once per member; the ordinates of every station on every element come from one matrix product.

Worst placement (ASCE 7-22 §4.3.3 partial loading, §4.4 concentrated loads):

* a distributed load of intensity w(ξ) may act on any part of its extent, so the largest effect is
  ∫ max(w·η, 0) dξ and the smallest ∫ min(w·η, 0) dξ. Each element is cut at the roots of η
  (found inside intervals where η is monotonic, between the roots of η′) and of w; on every piece
  w·η (degree 4) is integrated exactly by 3-point Gauss-Legendre quadrature;
* a point load that is not moving either acts or not: max(P·η(a), 0);
* a moving load or a set of loads at fixed offsets (a cart) is placed at the reference position that
  gives the largest (smallest) Σ P_k·η(a + d_k). Between the positions where a wheel crosses a node
  the sum is a cubic in a: its extremes are at the ends or at the roots of its derivative, all
  evaluated. The set is also taken turned round (offsets mirrored); every wheel stays in its range.

Units: whatever consistent floats the caller uses (:mod:`calcreport.solve.beam` uses inch and lbf).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from .beam_fe import Mesh, hermite, stiffness
from .influence_roots import cuts as _cuts
from .influence_roots import poly as _poly
from .influence_roots import quad_roots as _quad_roots

__all__ = [
    "Rows",
    "Influence",
    "build",
    "statics_rows",
    "deflection_rows",
    "integrate_parts",
    "integrate_whole",
    "moving_extremes",
    "loaded_parts",
]

_GAUSS_T = np.array([-np.sqrt(0.6), 0.0, np.sqrt(0.6)])
_GAUSS_W = np.array([5.0, 8.0, 5.0]) / 9.0
#: Inverse Vandermonde matrix for cubic fits through u = 0, 1/3, 2/3, 1.
_U4 = np.array([0.0, 1 / 3, 2 / 3, 1.0])
_VINV = np.linalg.inv(np.vander(_U4, 4, increasing=True))
#: Sign with which a fixed support's moment reaction (as beam_fe reports it) enters M(x) of the
#: part left of the cut (checked against the stiffness solution in the tests).
_MOMENT_SIGN = -1.0


@dataclass(frozen=True)
class Rows:
    """Responses as linear functions of the nodal load vector, plus a local term.

    response = A @ f  +  loc_sign · N_{loc_r}(t) when the unit load lies in element ``loc_e``.
    """

    A: np.ndarray  # (S, 2n)
    loc_e: np.ndarray  # (S,) element index, −1 for none
    loc_r: np.ndarray  # (S,) shape-function index 0..3
    loc_sign: np.ndarray  # (S,)


@dataclass(frozen=True)
class Influence:
    """Influence ordinates of S responses on every element, as cubics in t."""

    x: np.ndarray  # node positions (n,)
    h: np.ndarray  # element lengths (n − 1,)
    C: np.ndarray  # (S, E, 4) power coefficients t⁰..t³
    A: np.ndarray  # (S, 2n) responses to unit nodal forces/moments
    _cache: dict = field(default_factory=dict, compare=False, repr=False)

    def moments(self) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """∫₀¹ η dt, ∫₀¹ t·η dt and whether η keeps one sign, for every (response, element);
        computed once and shared by every load (they do not depend on the load)."""
        if "moments" not in self._cache:
            k = np.arange(4)
            m0 = self.C @ (1.0 / (k + 1))
            m1 = self.C @ (1.0 / (k + 2))
            one = _one_sign(self.C)
            for a in (m0, m1, one):  # shared with every member of the same geometry (placement.py)
                a.flags.writeable = False
            self._cache["moments"] = (m0, m1, one)
        return self._cache["moments"]

    def at(self, xi: float, side: int = 1) -> np.ndarray:
        """Ordinates of all responses at ξ (``side`` 0 takes the element left of a node)."""
        e = int(np.searchsorted(self.x, xi, side="right" if side else "left")) - 1
        e = min(max(e, 0), len(self.h) - 1)
        t = (xi - self.x[e]) / self.h[e]
        return self.C[:, e, :] @ np.array([1.0, t, t * t, t**3])


def _one_sign(C: np.ndarray) -> np.ndarray:
    """Whether each cubic C (…, 4) keeps one sign on [0, 1]: its values at t = 0, at the roots of
    η′ in (0, 1) and at t = 1 are all ≥ 0 or all ≤ 0 (a cubic is monotonic between those points).

    With finite coefficients η(0) = c₀ + 0·(…) has the sign tests of c₀ and η(1) = c₀ + 1·(c₁ +
    1·(c₂ + 1·c₃)) is c₀ + (c₁ + (c₂ + c₃)) to the bit, so only the two roots need a full Horner
    evaluation; a non-finite coefficient takes the plain route (every point by Horner)."""
    c0, c1, c2, c3 = np.moveaxis(C, -1, 0).copy()  # contiguous coefficient planes
    d1, d2 = _quad_roots(3 * c3, 2 * c2, c1)
    if not np.isfinite(C).all():
        T = np.stack([np.zeros_like(d1), d1, d2, np.ones_like(d1)], axis=-1)
        f = _poly(C[..., None, :], T)
        return np.all(f >= 0, axis=-1) | np.all(f <= 0, axis=-1)
    f1 = c0 + (c1 + (c2 + c3))
    fa = c0 + d1 * (c1 + d1 * (c2 + d1 * c3))
    fb = c0 + d2 * (c1 + d2 * (c2 + d2 * c3))
    pos = (c0 >= 0) & (fa >= 0) & (fb >= 0) & (f1 >= 0)
    neg = (c0 <= 0) & (fa <= 0) & (fb <= 0) & (f1 <= 0)
    return pos | neg


def _coarse_reactions(coarse: Mesh) -> tuple[np.ndarray, list[tuple[int, bool]]]:
    """Rows giving every support reaction (upward force; moment at a fixed support) from the
    consistent nodal load vector of the coarse model: R = f[dof] − K[dof]·K⁻¹·f.

    The coarse model has nodes only at the ends, supports and load points, so K is small and well
    conditioned; its nodal results are exact for any load (Hermite elements, consistent loads)."""
    K, _, free = stiffness(coarse)
    n = len(coarse.x)
    Kinv = np.zeros((2 * n, 2 * n))
    Kinv[np.ix_(free, free)] = np.linalg.solve(K[np.ix_(free, free)], np.eye(len(free)))
    rows, meta = [], []
    seen: set[int] = set()
    for k, (s, nd) in enumerate(zip(coarse.supports, coarse.support_nodes)):
        for dof, is_moment in ((2 * nd, False), (2 * nd + 1, True)):
            if is_moment and not s.fixed:
                continue
            a = np.zeros(2 * n)
            if dof not in seen:  # two supports on one node: the first takes the reaction
                a = -(K[dof] @ Kinv)
                a[dof] += 1.0
            seen.add(dof)
            rows.append(a)
            meta.append((k, is_moment))
    return np.array(rows).reshape(len(meta), 2 * n), meta


def statics_rows(
    fine: Mesh, coarse: Mesh, idx: np.ndarray, side: np.ndarray
) -> tuple[Influence, Influence, Influence, list[tuple[int, bool]]]:
    """Influence lines (on the elements of the fine mesh) of V at every output point (node ``idx``,
    ``side`` 0 = just left, 1 = just right), of M at every output point and of every reaction.

    Reactions come from the coarse stiffness model; V and M from the equilibrium of the part of the
    member left of the cut (statics): V(x) = Σ R_j − [ξ left of x], M(x) = Σ R_j·(x − x_j) + Σ M_j
    − (x − ξ)[ξ left of x]. Working from reactions keeps the ordinates accurate to rounding (shear
    taken from the end forces of many short elements loses digits to cancellation).
    """
    A_R, meta = _coarse_reactions(coarse)
    xf, hf = fine.x, np.diff(fine.x)
    Xc, Hc = coarse.x, np.diff(coarse.x)
    Ef = len(hf)
    Ec = np.clip(np.searchsorted(Xc, xf[:-1] + 0.5 * hf, side="right") - 1, 0, len(Hc) - 1)
    xi = xf[:-1, None] + hf[:, None] * _U4[None, :]  # (Ef, 4)
    tc = (xi - Xc[Ec][:, None]) / Hc[Ec][:, None]
    Hm = hermite(Hc)[Ec]  # (Ef, 4 funcs, 4 powers)
    N = np.einsum("ekp,eqp->eqk", Hm, np.stack([np.ones_like(tc), tc, tc**2, tc**3], axis=-1))
    dofs = 2 * Ec[:, None] + np.arange(4)[None, :]  # (Ef, 4)
    Rv = np.einsum("rek,eqk->req", A_R[:, dofs], N)  # (nR, Ef, 4 samples)
    Rc = Rv @ _VINV.T  # cubic in the fine element coordinate
    sup_x = np.array([coarse.supports[k].x for k, _ in meta])
    is_m = np.array([m for _, m in meta], dtype=bool)
    xs = xf[idx]
    n = len(xf)
    right = (side == 1) | (idx == 0)
    right = np.where(idx == n - 1, False, right)
    tol = 1e-9 * max(xf[-1], 1.0)
    left_of = (sup_x[None, :] < xs[:, None] - tol) | (
        (np.abs(sup_x[None, :] - xs[:, None]) <= tol) & right[:, None]
    )
    inc_v = np.where(is_m[None, :], 0.0, left_of.astype(float))
    CV = np.einsum("sj,jep->sep", inc_v, Rc)
    e_left = np.arange(Ef)[None, :] < np.asarray(idx)[:, None]  # (S, Ef): element left of the cut
    CV[..., 0] -= e_left
    right_m = idx < n - 1
    left_m = (sup_x[None, :] < xs[:, None] - tol) | (
        (np.abs(sup_x[None, :] - xs[:, None]) <= tol) & right_m[:, None]
    )
    lever = np.where(is_m[None, :], _MOMENT_SIGN, xs[:, None] - sup_x[None, :]) * left_m
    CM = np.einsum("sj,jep->sep", lever, Rc)
    CM[..., 0] -= e_left * (xs[:, None] - xf[None, :-1])
    CM[..., 1] += e_left * hf[None, :]
    CR = Rc
    zero = np.zeros((0, 2 * n))
    return Influence(xf, hf, CV, zero), Influence(xf, hf, CM, zero), Influence(xf, hf, CR, zero), meta


def _distinct(v: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Sorted distinct values of ``v`` and, for each entry of ``v``, the index of its value among
    them — what ``np.unique(v, return_inverse=True)`` gives, without importing numpy.ma (start-up)."""
    order = np.argsort(v, kind="stable")
    s = v[order]
    first = np.ones(len(s), bool)
    first[1:] = s[1:] != s[:-1]
    inverse = np.empty(len(v), np.intp)
    inverse[order] = np.cumsum(first) - 1
    return s[first], inverse


def deflection_rows(mesh: Mesh, idx: np.ndarray) -> Rows:
    """Rows giving the deflection (EI = 1) at nodes ``idx`` of the fine model: d = K⁻¹·f. K⁻¹ is
    symmetric, so the rows are the solutions for unit forces at those nodes (one per node)."""
    K, _, free = stiffness(mesh)
    n = len(mesh.x)
    nodes, where = _distinct(np.asarray(idx))
    pos = {int(d): k for k, d in enumerate(free)}
    rhs = np.zeros((len(free), len(nodes)))
    for j, nd in enumerate(nodes):
        if int(2 * nd) in pos:
            rhs[pos[int(2 * nd)], j] = 1.0
    sol = np.linalg.solve(K[np.ix_(free, free)], rhs)
    A = np.zeros((len(nodes), 2 * n))
    A[:, free] = sol.T
    A = A[where]
    m = len(idx)
    return Rows(A, np.full(m, -1), np.zeros(m, int), np.zeros(m))


def build(mesh: Mesh, rows: Rows) -> Influence:
    """Cubic coefficients of every response's influence line on every element."""
    x = mesh.x
    h = np.diff(x)
    H = hermite(h)  # (E, 4, 4)
    E = len(h)
    dofs = 2 * np.arange(E)[:, None] + np.arange(4)[None, :]
    C = np.einsum("sek,ekp->sep", rows.A[:, dofs], H)
    has = rows.loc_e >= 0
    if has.any():
        s = np.nonzero(has)[0]
        C[s, rows.loc_e[s], :] += rows.loc_sign[s, None] * H[rows.loc_e[s], rows.loc_r[s], :]
    return Influence(x, h, C, rows.A)


def integrate_whole(inf: Influence, wa: np.ndarray, wb: np.ndarray) -> np.ndarray:
    """∫ w·η dξ for every response: the loads where they are written (closed form per element)."""
    m0, m1, _ = inf.moments()
    return (m0 * (wa * inf.h) + m1 * ((wb - wa) * inf.h)).sum(axis=1)


def integrate_parts(inf: Influence, wa: np.ndarray, wb: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """∫ max(w·η, 0) dξ and ∫ min(w·η, 0) dξ for every response, w linear in each element from
    ``wa`` (left end) to ``wb`` (right end). Exact: see the module docstring. Elements where w·η
    keeps its sign are integrated whole (closed form); only the few where it changes sign are cut."""
    S = inf.C.shape[0]
    loaded = np.nonzero((wa != 0) | (wb != 0))[0]
    if not len(loaded):
        return np.zeros(S), np.zeros(S)
    m0, m1, one_sign = inf.moments()
    h = inf.h[loaded]
    w0, w1 = wa[loaded], wb[loaded] - wa[loaded]
    with np.errstate(divide="ignore", invalid="ignore"):
        tw = np.where(w1 != 0, -w0 / w1, 0.0)
    w_one_sign = ~((tw > 0) & (tw < 1))
    ok = one_sign[:, loaded] & w_one_sign[None, :]
    whole = np.where(ok, m0[:, loaded] * (w0 * h) + m1[:, loaded] * (w1 * h), 0.0)
    pos = np.where(whole > 0, whole, 0.0).sum(axis=1)
    neg = np.where(whole < 0, whole, 0.0).sum(axis=1)
    rs, es = np.nonzero(~ok)
    if len(rs):
        cd, a0, a1, hd = inf.C[rs, loaded[es]], w0[es], w1[es], h[es]
        T = _cuts(cd, a0, a1)  # (N, P)
        lo, hi = T[:, :-1], T[:, 1:]
        half, mid = 0.5 * (hi - lo), 0.5 * (hi + lo)
        total = np.zeros(lo.shape)
        for gt, gw in zip(_GAUSS_T, _GAUSS_W):
            t = mid + half * gt
            total += gw * half * (a0[:, None] + a1[:, None] * t) * _poly(cd[:, None, :], t)
        total *= hd[:, None]
        np.add.at(pos, rs, np.where(total > 0, total, 0.0).sum(axis=1))
        np.add.at(neg, rs, np.where(total < 0, total, 0.0).sum(axis=1))
    return pos, neg


def _breaks(x: np.ndarray, offsets: np.ndarray, lo: float, hi: float) -> np.ndarray:
    """Reference positions a in [lo − min d, hi − max d] where some wheel a + d_k is at a node."""
    a_lo, a_hi = lo - offsets.min(), hi - offsets.max()
    pts = [np.array([a_lo, a_hi])]
    for d in offsets:
        xs = x - d
        pts.append(xs[(xs > a_lo) & (xs < a_hi)])
    a = np.sort(np.concatenate(pts))  # duplicates are dropped by the tolerance below
    tol = 1e-9 * max(x[-1], 1.0)
    keep = np.concatenate([[True], np.diff(a) > tol])
    a = a[keep]
    a[-1] = a_hi
    return a


def _group_cubic(
    inf: Influence, rows: slice, P: np.ndarray, d: np.ndarray, a0: np.ndarray, a1: np.ndarray
) -> np.ndarray:
    """Power coefficients in u ∈ [0, 1] of Σ_k P_k·η(a0 + u(a1 − a0) + d_k) on every interval
    (rows, M, 4): each wheel's cubic re-expanded about its start, t = t0 + τ·u (Taylor, exact)."""
    mid = 0.5 * (a0 + a1)
    C = inf.C[rows]
    out = np.zeros((C.shape[0], len(a0), 4))
    for Pk, dk in zip(P, d):
        e = np.clip(np.searchsorted(inf.x, mid + dk, side="right") - 1, 0, len(inf.h) - 1)
        he = inf.h[e]
        t0 = (a0 + dk - inf.x[e]) / he
        tau = (a1 - a0) / he
        c = C[:, e, :]  # (s, M, 4)
        c0, c1, c2, c3 = c[..., 0], c[..., 1], c[..., 2], c[..., 3]
        v0 = c0 + t0 * (c1 + t0 * (c2 + t0 * c3))
        v1 = (c1 + t0 * (2 * c2 + 3 * t0 * c3)) * tau
        v2 = (c2 + 3 * t0 * c3) * tau * tau
        v3 = c3 * tau**3
        out += Pk * np.stack([v0, v1, v2, v3], axis=-1)
    return out


def moving_extremes(
    inf: Influence, P: np.ndarray, offsets: np.ndarray, lo: float, hi: float, chunk: int = 64
) -> tuple[np.ndarray, np.ndarray, np.ndarray, np.ndarray, np.ndarray, np.ndarray]:
    """Largest and smallest Σ P_k·η(a + d_k) over every placement of a set of loads that moves as
    one (both ways round), with every wheel within [lo, hi]; the reference positions a (where the
    load with offset 0 stands) that give them, and the orientation (+1 as written, −1 turned round:
    load k then stands at a − d_k)."""
    S = inf.C.shape[0]
    best_hi, best_lo = np.full(S, -np.inf), np.full(S, np.inf)
    at_hi, at_lo = np.zeros(S), np.zeros(S)
    or_hi, or_lo = np.ones(S), np.ones(S)
    d0 = np.asarray(offsets, dtype=float)
    orients = [d0] if len(d0) == 1 else [d0, -d0]
    for sgn, d in zip((1.0, -1.0), orients):
        a = _breaks(inf.x, d, lo, hi)
        if len(a) < 2:
            a = np.array([a[0], a[0]])
        a0, a1 = a[:-1], a[1:]
        for s0 in range(0, S, chunk):
            sl = slice(s0, min(S, s0 + chunk))
            coef = _group_cubic(inf, sl, P, d, a0, a1)  # (s, M, 4), cubic in u
            r1, r2 = _quad_roots(3 * coef[..., 3], 2 * coef[..., 2], coef[..., 1])
            U = np.stack([np.zeros_like(r1), np.ones_like(r1), r1, r2], axis=-1)
            vals = _poly(coef[..., None, :], U)  # (s, M, 4)
            pos = a0[None, :, None] + (a1 - a0)[None, :, None] * U
            flat = vals.reshape(vals.shape[0], -1)
            k_hi, k_lo = flat.argmax(1), flat.argmin(1)
            pflat = pos.reshape(pos.shape[0], -1)
            r = np.arange(flat.shape[0])
            vh, vl = flat[r, k_hi], flat[r, k_lo]
            better_h, better_l = vh > best_hi[sl], vl < best_lo[sl]
            best_hi[sl] = np.where(better_h, vh, best_hi[sl])
            at_hi[sl] = np.where(better_h, pflat[r, k_hi], at_hi[sl])
            or_hi[sl] = np.where(better_h, sgn, or_hi[sl])
            or_lo[sl] = np.where(better_l, sgn, or_lo[sl])
            best_lo[sl] = np.where(better_l, vl, best_lo[sl])
            at_lo[sl] = np.where(better_l, pflat[r, k_lo], at_lo[sl])
    return best_hi, best_lo, at_hi, at_lo, or_hi, or_lo


def loaded_parts(
    inf: Influence, row: int, wa: np.ndarray, wb: np.ndarray, sign: int
) -> list[tuple[float, float]]:
    """Stretches [ξ₀, ξ₁] where w·η of one response has the sign ``sign`` (+1 or −1): where the
    distributed load is placed for that response's largest (smallest) value. Merged across nodes."""
    loaded = np.nonzero((wa != 0) | (wb != 0))[0]
    if not len(loaded):
        return []
    c = inf.C[row, loaded, :]
    w0, w1 = wa[loaded], wb[loaded] - wa[loaded]
    T = _cuts(c, w0, w1)
    lo, hi = T[..., :-1], T[..., 1:]
    tm = 0.5 * (lo + hi)
    f = (w0[:, None] + w1[:, None] * tm) * _poly(c[:, None, :], tm)
    x0 = inf.x[loaded][:, None] + lo * inf.h[loaded][:, None]
    x1 = inf.x[loaded][:, None] + hi * inf.h[loaded][:, None]
    scale = np.abs(f).max() if f.size else 0.0
    keep = (sign * f > 1e-12 * scale) & (x1 - x0 > 0)
    out: list[tuple[float, float]] = []
    tol = 1e-9 * max(inf.x[-1], 1.0)
    for a, b in sorted(zip(x0[keep].tolist(), x1[keep].tolist())):
        if out and a - out[-1][1] <= tol:
            out[-1] = (out[-1][0], max(out[-1][1], b))
        else:
            out.append((a, b))
    return out
