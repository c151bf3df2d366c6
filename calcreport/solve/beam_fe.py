"""Stiffness (finite-element) analysis of a straight beam on point supports, in plain floats.

Euler-Bernoulli beam elements with Hermite cubic shape functions; two degrees of freedom per node
(deflection v, positive DOWN, and slope θ = dv/dx, positive clockwise). Nodes are placed at the
member ends, at every support, at every point load, at the ends of every distributed load and on a
fine regular mesh between them.

Exactness (matrix structural analysis, stiffness method): the Hermite cubics are the homogeneous
solutions of EI·v'''' = w, so with consistent (work-equivalent) load vectors the nodal deflections
and slopes are exact for any load; the element end forces k·d − f_eq are therefore exact too, and
shear and moment at each node follow exactly from them. Because load ends are nodes, a distributed
load is linear (trapezoidal) inside every element.

Sign conventions (as in beam tables, e.g. AISC Manual 15th ed. Table 3-23): loads w, P positive
downward; reactions positive upward; V positive when the part left of a cut is pushed up
(dV/dx = −w, so V(0+) = R_left); M positive sagging (dM/dx = V); deflection positive downward.

Everything here is float arithmetic in one consistent unit system chosen by the caller
(:mod:`calcreport.solve.beam` uses inch and lbf). No quantities, no text.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field

import numpy as np

from .memo import ByteMemo, float_key, freeze

__all__ = [
    "FESupport",
    "FELoad",
    "Mesh",
    "FESolution",
    "build_mesh",
    "load_vector",
    "solve",
    "stiffness",
    "hermite",
    "StructureError",
    "geometry_key",
]

#: Stiffness by geometry, shared by members laid out alike (solve/memo.py); a 241-node mesh
#: takes about 2 MB.
_STIFFNESS = ByteMemo(16 * 2**20)


class StructureError(ValueError):
    """The supports do not hold the beam (a mechanism) or lie off the member."""


@dataclass(frozen=True)
class FESupport:
    x: float
    fixed: bool = False  # True: deflection and slope restrained; False: deflection only


@dataclass(frozen=True)
class FELoad:
    """``kind`` "point" (``w1`` is the force at ``a``) or "dist" (w1 at ``a`` to w2 at ``b``)."""

    kind: str
    a: float
    w1: float
    b: float = 0.0
    w2: float = 0.0


@dataclass(frozen=True)
class Mesh:
    x: np.ndarray  # node positions, sorted, unique
    length: float
    supports: tuple[FESupport, ...]
    support_nodes: tuple[int, ...]
    jump_nodes: frozenset[int]  # interior nodes where V may jump (supports, point loads)
    # the stiffness of this mesh, built once (the analysis and the deflection influence lines
    # both factor the same K); filled by :func:`stiffness`, never part of equality
    _cache: dict = field(default_factory=dict, compare=False, repr=False)


def _snap(values: list[float], length: float) -> list[float]:
    tol = 1e-9 * max(length, 1.0)
    out: list[float] = []
    for v in sorted(values):
        if not out or v - out[-1] > tol:
            out.append(v)
    return out


def build_mesh(
    length: float,
    supports: list[FESupport],
    loads: list[FELoad],
    extra: Sequence[float] = (),
    divisions: int = 240,
) -> Mesh:
    """Nodes at ends, supports, load points/ends and ``extra`` points, refined so that no element
    is longer than ``length / divisions``.

    Raises:
        StructureError: if a support lies off the member or the supports form a mechanism.
    """
    if length <= 0:
        raise StructureError("the member length must be greater than zero")
    tol = 1e-9 * length
    if any(s.x < -tol or s.x > length + tol for s in supports):
        raise StructureError("a support lies outside the member")
    if not any(s.fixed for s in supports) and len({round(s.x / tol) for s in supports}) < 2:
        raise StructureError("the beam needs one fixed support or at least two supports")
    key: list[float] = [0.0, length] + [min(max(s.x, 0.0), length) for s in supports]
    jumps: list[float] = [s.x for s in supports]
    for ld in loads:
        key.append(ld.a)
        if ld.kind == "point":
            jumps.append(ld.a)
        else:
            key.append(ld.b)
    key += [float(e) for e in extra if 0.0 <= e <= length]
    key = _snap([min(max(k, 0.0), length) for k in key], length)
    hmax = length / max(divisions, 1)
    xs: list[float] = []
    for a, b in zip(key[:-1], key[1:]):
        n = max(1, int(np.ceil((b - a) / hmax - 1e-9)))
        xs.extend(a + (b - a) * np.arange(n) / n)
    xs.append(key[-1])
    x = np.asarray(xs, dtype=float)

    def node(at: float) -> int:
        return int(np.argmin(np.abs(x - at)))

    sup_nodes = tuple(node(s.x) for s in supports)
    jump = frozenset(node(j) for j in jumps) - {0, len(x) - 1}
    return Mesh(x, length, tuple(supports), sup_nodes, jump)


def _element_k(h: np.ndarray) -> np.ndarray:
    """Stiffness of Euler-Bernoulli elements of lengths h with EI = 1, array (elements, 4, 4)
    (matrix structural analysis):

        k = [[12, 6h, −12, 6h], [6h, 4h², −6h, 2h²], [−12, −6h, 12, −6h], [6h, 2h², −6h, 4h²]] / h³.

    Every entry is the same sequence of float operations per element as a one-element build
    (``6·h``, ``(4·h)·h``, then ``/ h³`` with h³ taken as a scalar power), so K is the same to
    the last bit whichever way it is assembled."""
    h = np.asarray(h, dtype=float)
    h3 = np.array([v**3 for v in h], dtype=float)  # np.float64 scalar powers, as one element at a time
    six, four, two = 6 * h, 4 * h * h, 2 * h * h
    twelve = np.full(len(h), 12.0)
    rows = [
        [twelve, six, -twelve, six],
        [six, four, -six, two],
        [-twelve, -six, twelve, -six],
        [six, two, -six, four],
    ]
    k = np.stack([np.stack(r, axis=-1) for r in rows], axis=-2)  # (E, 4, 4)
    return k / h3[:, None, None]


def hermite(h: np.ndarray) -> np.ndarray:
    """Hermite cubic shape functions of every element in its local coordinate t = (ξ − x_e)/h,
    as power-series coefficients: array (elements, 4 functions N1..N4, 4 powers t⁰..t³).

    N1 = 1 − 3t² + 2t³, N2 = h(t − 2t² + t³), N3 = 3t² − 2t³, N4 = h(t³ − t²) (matrix structural
    analysis, beam element). The consistent load vector of a unit point load at t is
    [N1, N2, N3, N4](t) — the fixed-end forces of the element, in the DOF directions.
    """
    h = np.asarray(h, dtype=float)
    out = np.zeros((len(h), 4, 4))
    out[:, 0] = [1.0, 0.0, -3.0, 2.0]
    out[:, 1] = np.stack([0 * h, h, -2 * h, h], axis=1)
    out[:, 2] = [0.0, 0.0, 3.0, -2.0]
    out[:, 3] = np.stack([0 * h, 0 * h, -h, h], axis=1)
    return out


def _dist_on_elements(mesh: Mesh, ld: FELoad) -> tuple[np.ndarray, np.ndarray]:
    """Intensity at the left (wa) and right (wb) end of every element for one distributed load."""
    x = mesh.x
    xl, xr = x[:-1], x[1:]
    span = ld.b - ld.a
    inside = (xl >= ld.a - 1e-9 * mesh.length) & (xr <= ld.b + 1e-9 * mesh.length)

    def w(at: np.ndarray) -> np.ndarray:
        return ld.w1 + (ld.w2 - ld.w1) * (at - ld.a) / span if span > 0 else np.zeros_like(at)

    return np.where(inside, w(xl), 0.0), np.where(inside, w(xr), 0.0)


def load_vector(mesh: Mesh, loads: list[FELoad]) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Consistent nodal load vector and element end intensities (wa, wb) for ``loads``.

    Consistent load vector of a linearly varying load w1→w2 on an element of length h
    (matrix structural analysis, work-equivalent loads):
    [h(21w1+9w2)/60, h²(3w1+2w2)/60, h(9w1+21w2)/60, −h²(2w1+3w2)/60].
    """
    n = len(mesh.x)
    f = np.zeros(2 * n)
    wa = np.zeros(n - 1)
    wb = np.zeros(n - 1)
    for ld in loads:
        if ld.kind == "point":
            f[2 * int(np.argmin(np.abs(mesh.x - ld.a)))] += ld.w1
        else:
            a, b = _dist_on_elements(mesh, ld)
            wa += a
            wb += b
    h = np.diff(mesh.x)
    fe = np.stack(
        [
            h * (21 * wa + 9 * wb) / 60,
            h * h * (3 * wa + 2 * wb) / 60,
            h * (9 * wa + 21 * wb) / 60,
            -h * h * (2 * wa + 3 * wb) / 60,
        ],
        axis=1,
    )
    # element by element, each node takes the element on its left, then the one on its right
    # (the order of the sums as one element at a time): all lefts, then all rights
    f[2:] += fe[:, 2:].reshape(-1)
    f[:-2] += fe[:, :2].reshape(-1)
    return f, wa, wb


@dataclass(frozen=True)
class FESolution:
    """Results at the nodes for each right-hand side (last axis = load set)."""

    v: np.ndarray  # deflection at nodes (n, m), positive down, computed with EI = 1 → divide by EI
    V_left: np.ndarray  # shear just left of each node (n, m); node 0 holds V just right
    V_right: np.ndarray  # shear just right of each node (n, m); last node holds V just left
    M: np.ndarray  # moment at nodes (n, m)
    reactions: np.ndarray  # (supports, 2, m): upward force, and moment (clockwise on the beam)


def stiffness(mesh: Mesh) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Global stiffness K (EI = 1), the element matrices (elements, 4, 4) and the free degrees of
    freedom; built once per mesh (kept on it, read-only) and shared by meshes of the same
    geometry (:func:`geometry_key`).

    Raises:
        StructureError: if the supports do not hold the beam (K of the free DOFs not positive
            definite).
    """
    if "stiffness" in mesh._cache:
        return mesh._cache["stiffness"]
    key = geometry_key(mesh)
    hit = _STIFFNESS.get(key)
    if hit is not None:
        mesh._cache["stiffness"] = hit
        return hit
    n = len(mesh.x)
    ndof = 2 * n
    h = np.diff(mesh.x)
    K = np.zeros((ndof, ndof))
    ks = _element_k(h)
    # assembly: element e adds its 4×4 block at DOFs 2e…2e+3; blocks of even elements do not
    # overlap each other, nor do those of odd ones, so two passes add every block at once. An
    # entry receives at most two terms (0 + a + b = a + b in any order): the same K to the bit.
    r = np.arange(4)
    for first in (0, 1):
        e = np.arange(first, len(h), 2)
        dof = 2 * e[:, None] + r[None, :]  # (elements, 4)
        K[dof[:, :, None], dof[:, None, :]] += ks[e]
    fixed_dofs: list[int] = []
    for s, nd in zip(mesh.supports, mesh.support_nodes):
        fixed_dofs.append(2 * nd)
        if s.fixed:
            fixed_dofs.append(2 * nd + 1)
    keep = np.ones(ndof, bool)
    keep[sorted(set(fixed_dofs))] = False
    free = np.flatnonzero(keep)  # np.setdiff1d would import numpy.ma (start-up cost)
    try:  # a held beam's stiffness is positive definite; Cholesky fails otherwise (≈20× cheaper than an SVD rank)
        np.linalg.cholesky(K[np.ix_(free, free)])
    except np.linalg.LinAlgError:
        raise StructureError("the supports do not hold the beam (it is a mechanism)") from None
    freeze(K, ks, free)  # shared by every caller of this mesh and of meshes alike
    mesh._cache["stiffness"] = (K, ks, free)
    _STIFFNESS.put(key, (K, ks, free), K.nbytes + ks.nbytes + free.nbytes)
    return K, ks, free


def geometry_key(mesh: Mesh) -> tuple:
    """What the stiffness and the influence lines of a mesh depend on, exactly: node positions
    (every bit), length, supports (position, fixity) and their nodes — never the loads."""
    supports = tuple((float_key(s.x), bool(s.fixed)) for s in mesh.supports)
    return (mesh.x.dtype.str, mesh.x.tobytes(), float_key(mesh.length), supports, mesh.support_nodes)


def solve(mesh: Mesh, loadsets: list[list[FELoad]]) -> FESolution:
    """Solve the beam for several load sets at once (one factorisation, many right-hand sides).

    Deflections are for EI = 1; divide by the actual EI. Forces do not depend on EI for a beam of
    constant EI.
    """
    n = len(mesh.x)
    ndof = 2 * n
    h = np.diff(mesh.x)
    K, ks, free = stiffness(mesh)
    m = len(loadsets)
    F = np.zeros((ndof, m))
    WA = np.zeros((n - 1, m))
    WB = np.zeros((n - 1, m))
    for j, ls in enumerate(loadsets):
        F[:, j], WA[:, j], WB[:, j] = load_vector(mesh, ls)
    D = np.zeros((ndof, m))
    D[free] = np.linalg.solve(K[np.ix_(free, free)], F[free])
    R = K @ D - F  # nodal forces the supports must supply, in the DOF directions (down, clockwise)
    # element end forces k·d − f_eq of every element (rows: element, DOF 0..3, load set); the
    # consistent load vector as in load_vector, elementwise; k·d one element at a time (the same
    # 4×4 product as ever, so the same bits)
    he = h[:, None]
    feq = np.stack(
        [
            he * (21 * WA + 9 * WB) / 60,
            he * he * (3 * WA + 2 * WB) / 60,
            he * (9 * WA + 21 * WB) / 60,
            -he * he * (2 * WA + 3 * WB) / 60,
        ],
        axis=1,
    )
    kd = np.stack([k @ D[2 * e : 2 * e + 4] for e, k in enumerate(ks)])
    Fe = kd - feq
    Vl = np.zeros((n, m))
    Vr = np.zeros((n, m))
    M = np.zeros((n, m))
    Vr[:-1] = -Fe[:, 0]
    Vl[1:] = Fe[:, 2]
    M[:-1] = Fe[:, 1]  # a node's moment from the element on its right …
    M[-1] = -Fe[-1, 3]  # … the last node's from the element on its left
    Vl[0] = Vr[0]
    Vr[-1] = Vl[-1]
    reac = np.zeros((len(mesh.supports), 2, m))
    seen: set[int] = set()
    for i, (s, nd) in enumerate(zip(mesh.supports, mesh.support_nodes)):
        if nd in seen:
            continue
        seen.add(nd)
        reac[i, 0] = -R[2 * nd]  # upward force on the beam
        if s.fixed:
            reac[i, 1] = -R[2 * nd + 1]  # moment on the beam, counter-clockwise positive
    return FESolution(D[0::2], Vl, Vr, M, reac)
