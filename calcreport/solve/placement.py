"""Worst placement of the variable (live-type) load cases, from the influence lines of
:mod:`calcreport.solve.influence`, in plain floats (inch, lbf).

For every variable case and every station: the largest and smallest V, M, deflection (EI = 1) and
support reactions when its distributed loads act only where they make the response worse, its fixed
point loads act or not, and its moving loads (alone, or as a set at fixed offsets) stand where they
are worst. ASCE 7-22 §4.3.3 (partial loading) and §4.4 (concentrated live loads).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from . import beam_fe as fe
from . import influence as il
from .memo import ByteMemo, freeze

__all__ = ["MovingSet", "CaseExtremes", "Placement", "place", "influences"]

QUANTITIES = ("V", "M", "v", "R")

#: Influence lines by geometry (fine and coarse mesh, output stations): they depend on no load,
#: so members laid out alike share them (solve/memo.py). A 241-node member with deflection lines
#: takes about 9.5 MB, so ten layouts fit; more than that, taken in turn, evict each other (LRU).
_INFLUENCE = ByteMemo(96 * 2**20)


@dataclass(frozen=True)
class MovingSet:
    """Point loads that move together: forces P (lbf), offsets d (inch), travel range [lo, hi]."""

    case: str
    name: str
    P: tuple[float, ...]
    offsets: tuple[float, ...]
    lo: float
    hi: float


@dataclass
class CaseExtremes:
    """Largest (hi) and smallest (lo) value of each response for one case, and its value with
    every load as written (full; moving loads excluded)."""

    hi: dict[str, np.ndarray] = field(default_factory=dict)
    lo: dict[str, np.ndarray] = field(default_factory=dict)
    full: dict[str, np.ndarray] = field(default_factory=dict)
    partial_hi: dict[str, np.ndarray] = field(default_factory=dict)
    partial_lo: dict[str, np.ndarray] = field(default_factory=dict)
    moving: tuple[MovingSet, ...] = ()
    # per response, per moving set: reference position and orientation of the largest / smallest
    moving_at: dict[str, list[tuple[np.ndarray, ...]]] = field(default_factory=dict)
    wa: np.ndarray | None = None
    wb: np.ndarray | None = None
    points: int = 0  # point loads at fixed positions (each on or off)


@dataclass(frozen=True)
class Placement:
    influence: dict[str, il.Influence]
    cases: dict[str, CaseExtremes]
    reaction_meta: list[tuple[int, bool]]


def _point_ordinates(
    inf: il.Influence, a: float, at_node_left: np.ndarray | None, station_idx: np.ndarray | None = None
) -> np.ndarray:
    """η of every response for a load standing at node position a, as the stiffness model applies a
    nodal load: for a shear station at that node, just left of it the load is right of the cut
    (right-element limit), just right of it the load is left of the cut (left-element limit). At
    the member ends, where one limit does not exist, the unit step is applied by hand
    (``station_idx``: the node of each shear station; ``None`` for other responses)."""
    j = int(np.argmin(np.abs(inf.x - a)))
    last = len(inf.x) - 1
    if j == 0:
        eta = inf.C[:, 0, 0].copy()
        if station_idx is not None:
            eta = eta - (np.asarray(station_idx) == 0)  # V just right of x = 0: the load is left of the cut
        return eta
    eta_l = inf.C[:, j - 1, :].sum(axis=1)
    if j == last:
        if station_idx is not None:
            eta_l = eta_l + (np.asarray(station_idx) == last)  # V just left of x = L: load right of the cut
        return eta_l
    eta_r = inf.C[:, j, 0]
    if at_node_left is None:
        return eta_l
    return np.where(at_node_left, eta_r, eta_l)


def influences(
    fine: fe.Mesh, coarse: fe.Mesh, idx: np.ndarray, side: np.ndarray, deflection: bool
) -> tuple[dict[str, il.Influence], list[tuple[int, bool]]]:
    """Influence lines of V, M and the reactions at the stations (``idx``, ``side``), and of the
    deflection when ``deflection`` (only when something is placed); shared by members of the
    same geometry (read-only arrays)."""
    idx, side = np.asarray(idx), np.asarray(side)
    key = (
        fe.geometry_key(fine),
        fe.geometry_key(coarse),
        idx.dtype.str,
        idx.tobytes(),
        side.dtype.str,
        side.tobytes(),
        deflection,
    )
    hit = _INFLUENCE.get(key)
    if hit is not None:
        return hit
    V, M, R, meta = il.statics_rows(fine, coarse, idx, side)
    infl = {"V": V, "M": M, "R": R}
    if deflection:
        infl["v"] = il.build(fine, il.deflection_rows(fine, idx))
    size = 0
    for inf in infl.values():
        freeze(inf.x, inf.h, inf.C, inf.A)
        size += inf.C.nbytes * 3 // 2 + inf.A.nbytes  # C, and its moments (m0, m1, one sign) once used
    _INFLUENCE.put(key, (infl, meta), size)
    return infl, meta


def place(
    fine: fe.Mesh,
    coarse: fe.Mesh,
    idx: np.ndarray,
    side: np.ndarray,
    loads: dict[str, list[fe.FELoad]],
    moving: dict[str, list[MovingSet]],
    variable: set[str] | None = None,
) -> Placement:
    """Worst placement of each case of ``variable`` (default: every case in ``loads`` / ``moving``);
    the other cases get their values as written (``full``, V and M only)."""
    variable = set(loads) | set(moving) if variable is None else set(variable)
    variable &= set(loads) | set(moving)
    infl, meta = influences(fine, coarse, idx, side, bool(variable))
    n = len(fine.x)
    out: dict[str, CaseExtremes] = {}
    for case in list(dict.fromkeys(list(loads) + list(moving))):
        ex = CaseExtremes(moving=tuple(moving.get(case, ())))
        mine = loads.get(case, [])
        dist = [ld for ld in mine if ld.kind != "point"]
        _, wa, wb = fe.load_vector(fine, dist)
        ex.wa, ex.wb = wa, wb
        ex.points = sum(1 for p in mine if p.kind == "point")
        if case not in variable:  # as written only: V and M
            for q in ("V", "M"):
                inf = infl[q]
                full = il.integrate_whole(inf, wa, wb)
                for ld in (p for p in mine if p.kind == "point"):
                    j = int(np.argmin(np.abs(fine.x - ld.a)))
                    at_node_left = None
                    if q == "V":
                        at_node_left = (np.asarray(idx) == j) & (np.asarray(side) == 0) & (j < n - 1)
                    full = full + ld.w1 * _point_ordinates(inf, ld.a, at_node_left, idx if q == "V" else None)
                ex.full[q] = full
            out[case] = ex
            continue
        for q, inf in infl.items():
            S = inf.C.shape[0]
            pos, neg = il.integrate_parts(inf, wa, wb) if dist else (np.zeros(S), np.zeros(S))
            hi, lo, full = pos.copy(), neg.copy(), pos + neg
            for ld in (p for p in mine if p.kind == "point"):
                j = int(np.argmin(np.abs(fine.x - ld.a)))
                at_node_left = None
                if q == "V":
                    at_node_left = (np.asarray(idx) == j) & (np.asarray(side) == 0) & (j < n - 1)
                eta = ld.w1 * _point_ordinates(inf, ld.a, at_node_left, idx if q == "V" else None)
                hi += np.maximum(eta, 0.0)
                lo += np.minimum(eta, 0.0)
                full += eta
            scale = max(float(np.abs(hi).max(initial=0.0)), float(np.abs(lo).max(initial=0.0)), 1e-300)
            ex.partial_hi[q] = np.abs(hi - full) > 1e-9 * scale
            ex.partial_lo[q] = np.abs(lo - full) > 1e-9 * scale
            ex.moving_at[q] = []
            for ms in ex.moving:
                h, lw, ah, al, oh, ol = il.moving_extremes(
                    inf, np.array(ms.P), np.array(ms.offsets), ms.lo, ms.hi
                )
                hi += np.maximum(h, 0.0)
                lo += np.minimum(lw, 0.0)
                ex.moving_at[q].append((ah, al, oh, ol))
            ex.hi[q], ex.lo[q], ex.full[q] = hi, lo, full
        out[case] = ex
    return Placement(infl, out, meta)
