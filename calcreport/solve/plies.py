"""Plies side by side (issue 14): how the plies share the load, and what the fasteners between
them must carry across.

* **Sharing by stiffness.** Plies fastened side by side deflect together; each bends about its own
  axis with the common curvature, so ply i carries share_i = E_i·I_i / Σ E·I of the moment and
  shear (mechanics of materials: M_i = E_i·I_i·κ; equal deflection of fastened plies is common
  practice, no source). The assembly's stiffness is Σ E·I (no composite action across the plies:
  their joints are vertical planes, which carry no horizontal shear flow).
* **Where a load enters.** A load on top bears on the plies whose tops are at the member's top, in
  proportion to their widths (assumption: uniform bearing pressure); a load hung from a face
  (ledger, hangers) enters that outer ply; a load may enter one named ply; self-weight enters each
  ply in proportion to its own weight.
* **Transfer across interface k** (between ply k and ply k+1, counted from the left): what entered
  the plies left of the interface less what they keep, a_k = Σ_{i≤k} (e_i − share_i), times the
  load: w·a_k per length for a distributed load; for a point load P·a_k spread over its transfer
  length ℓt (stated on the load, default the member's depth — an assumption recorded as
  ``Assumed``). Statics of the free body of the plies left of the interface.

The demand is formed per combination along x (variable cases present or absent, whichever is
worse at each x), so the fastener lines can apply each combination's load duration factor.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ..keys.loads import LIVE_TYPE
from ..model import Load, Member
from ..steps import StepLog
from ..units import Q_, Quantity
from .results import Assumed

__all__ = [
    "PlyShare",
    "TransferDemand",
    "ply_shares",
    "ply_EI",
    "entry_fractions",
    "interface_coefficients",
    "transfer_demand",
    "plies_assumed",
    "SRC_SHARE",
    "SRC_TRANSFER",
]

SRC_SHARE = "mechanics of materials (common curvature of fastened plies); equal deflection: common practice, no source"
SRC_TRANSFER = "statics: free body of the plies on one side of the interface"
_IN = "inch"


@dataclass(frozen=True)
class PlyShare:
    """One ply's stiffness and the share of the member's moment and shear it carries."""

    id: str
    family: str
    width: float  # in, across the member
    depth: float  # in
    bottom: float  # in
    top: float  # in
    E: Quantity
    I: Quantity
    EI: Quantity
    share: float


@dataclass(frozen=True)
class TransferDemand:
    """Transfer demand per unit length across each interface, per combination, along x.

    ``per_combination[k][c]`` is |t(x)| (lbf/in) at interface k (0 = between the first two plies)
    for combination c (in the order of ``names``)."""

    x: np.ndarray  # in (a position may appear twice at a jump)
    names: tuple[str, ...]
    per_combination: tuple[tuple[np.ndarray, ...], ...]


def ply_shares(member: Member, log: StepLog | None = None) -> tuple[PlyShare, ...]:
    """E_i·I_i of each ply (rectangle b·d³/12 about its own axis) and share_i = E_i·I_i / Σ E·I."""
    rows = []
    for p in member.plies:
        x0, y0, x1, y1 = p.part.shape.bbox
        b, d = x1 - x0, y1 - y0
        E = p.part.material.E.to("psi")
        Ii = Q_(b * d**3 / 12.0, "inch**4")
        if log is not None:
            log.add(f"{p.id}.I", f"Moment of inertia of ply {p.id}", "I = b·d³/12", "{b} × {d}³ / 12",
                    {"b": Q_(b, _IN), "d": Q_(d, _IN)}, Ii, source="mechanics of materials (rectangle)")  # fmt: skip
        EI = (E * Ii).to("lbf*inch**2")
        if log is not None:
            log.add(f"{p.id}.EI", f"Flexural rigidity of ply {p.id}", "E·I", "{E} × {I}", {"E": E, "I": Ii},
                    EI, source="mechanics of materials")  # fmt: skip
        rows.append((p, b, d, y0, y1, E, Ii, EI))
    total = sum(float(r[7].magnitude) for r in rows)
    if log is not None:
        log.add("EI_total", "Flexural rigidity of the plies together", "Σ E·I", " + ".join(f"{{EI{i}}}" for i in range(len(rows))),
                {f"EI{i}": r[7] for i, r in enumerate(rows)}, Q_(total, "lbf*inch**2"), source=SRC_SHARE,
                note="each ply about its own axis: no composite action across the vertical ply joints")  # fmt: skip
    out = []
    for p, b, d, y0, y1, E, Ii, EI in rows:
        s = float(EI.magnitude) / total
        if log is not None:
            log.add(f"{p.id}.share", f"Share of the load carried by ply {p.id}", "share = E·I / Σ E·I",
                    "{EI} / {total}", {"EI": EI, "total": Q_(total, "lbf*inch**2")}, s, source=SRC_SHARE,
                    note="assumption: the fastened plies deflect equally")  # fmt: skip
        out.append(PlyShare(p.id, p.part.material.family, b, d, y0, y1, E, Ii, EI, s))
    return tuple(out)


def ply_EI(member: Member) -> Quantity:
    """Σ E_i·I_i of the plies, each about its own axis (mechanics of materials)."""
    return Q_(sum(float(s.EI.magnitude) for s in ply_shares(member)), "lbf*inch**2")


def entry_fractions(member: Member, load: Load | None, shares: tuple[PlyShare, ...]) -> tuple[float, ...]:
    """Fraction of a load entering each ply (``None``: self-weight, by each ply's own weight).

    Top-loaded: plies whose tops are at the member's top, in proportion to their widths (uniform
    bearing pressure, common practice, no source)."""
    n = len(shares)
    if load is None:
        w = [
            s.width
            * s.depth
            * float((p.part.material.density or Q_(0.0, "lbf/ft**3")).to("lbf/inch**3").magnitude)
            for s, p in zip(shares, member.plies)
        ]
        tot = sum(w)
        return tuple(v / tot for v in w) if tot > 0 else tuple(1.0 / n for _ in w)
    if load.enters == "left_face":
        return tuple(1.0 if i == 0 else 0.0 for i in range(n))
    if load.enters == "right_face":
        return tuple(1.0 if i == n - 1 else 0.0 for i in range(n))
    if load.enters == "ply":
        return tuple(1.0 if s.id == load.ply else 0.0 for s in shares)
    top = max(s.top for s in shares)
    bearing = [s.width if abs(s.top - top) <= 1e-6 else 0.0 for s in shares]
    tot = sum(bearing)
    return tuple(b / tot for b in bearing)


def interface_coefficients(entry: tuple[float, ...], shares: tuple[PlyShare, ...]) -> tuple[float, ...]:
    """a_k = Σ_{i≤k} (e_i − share_i): the part of a load crossing interface k (left to right
    positive). Statics of the plies left of the interface; Σ over all plies is zero."""
    out, run = [], 0.0
    for e, s in zip(entry[:-1], shares[:-1]):
        run += e - s.share
        out.append(run)
    return tuple(out)


def _grid(L: float, loads: list[tuple[Load, float]], n: int = 480) -> tuple[np.ndarray, np.ndarray]:
    """Positions (with jumps doubled) and the evaluation points just left/right of each jump."""
    brk = {0.0, L}
    for ld, lt in loads:
        if ld.kind == "point":
            a = float(ld.at.to(_IN).magnitude) if ld.at is not None else 0.0
            brk |= {max(0.0, a - lt / 2), min(L, a + lt / 2)}
        else:
            brk |= {0.0 if ld.start is None else float(ld.start.to(_IN).magnitude),
                    L if ld.end is None else float(ld.end.to(_IN).magnitude)}  # fmt: skip
    base = set(np.linspace(0.0, L, n + 1).tolist()) - brk
    xs, ev = [], []
    eps = 1e-9 * max(L, 1.0)
    for v in sorted(base | brk):
        if v in brk and 0.0 < v < L:
            xs += [v, v]
            ev += [v - eps, v + eps]
        else:
            xs.append(v)
            ev.append(min(max(v, eps), L - eps))
    return np.array(xs), np.array(ev)


def _intensity(ld: Load, ev: np.ndarray, L: float, lt: float) -> np.ndarray:
    """Load per unit length (lbf/in) of one load at the evaluation points."""
    if ld.kind == "point":
        a = float(ld.at.to(_IN).magnitude) if ld.at is not None else 0.0
        lo, hi = max(0.0, a - lt / 2), min(L, a + lt / 2)
        P = float(ld.magnitude.to("lbf").magnitude)
        return np.where((ev > lo) & (ev < hi), P / max(hi - lo, 1e-9), 0.0)
    a = 0.0 if ld.start is None else float(ld.start.to(_IN).magnitude)
    b = L if ld.end is None else float(ld.end.to(_IN).magnitude)
    w1 = float(ld.magnitude.to("lbf/inch").magnitude)
    w2 = (
        w1
        if ld.kind == "uniform" or ld.magnitude_end is None
        else float(ld.magnitude_end.to("lbf/inch").magnitude)
    )
    w = w1 + (w2 - w1) * (ev - a) / (b - a)
    return np.where((ev > a) & (ev < b), w, 0.0)


def transfer_length(member: Member, ld: Load) -> float:
    """ℓt of a point load (in): as stated, or the member's depth (assumption)."""
    if ld.transfer_length is not None:
        return float(ld.transfer_length.to(_IN).magnitude)
    ys = [p.part.shape.bbox for p in member.plies]
    return max(b[3] for b in ys) - min(b[1] for b in ys)


def transfer_demand(
    member: Member, along, shares: tuple[PlyShare, ...], log: StepLog, sw: Quantity | None
) -> TransferDemand:
    """|t_k(x)| per interface and combination: Σ over loads of factor·intensity·a_k, variable
    cases taken present or absent, whichever is worse at each x (ASCE 7 §4.3.3 for the pattern)."""
    L = float(along.analysis.length.to(_IN).magnitude)
    loads: list[tuple[Load, float]] = [
        (ld, transfer_length(member, ld) if ld.kind == "point" else 0.0) for ld in member.loads
    ]
    entries = [entry_fractions(member, ld, shares) for ld, _ in loads]
    if sw is not None:
        loads.append(
            (Load("D", "uniform", sw, label="self-weight", key=f"member[{member.id}].self_weight"), 0.0)
        )
        entries.append(entry_fractions(member, None, shares))
    xs, ev = _grid(L, loads)
    variable = set(LIVE_TYPE) | {ld.case for ld, _ in loads if ld.variable}
    nk = len(shares) - 1
    by_case: list[dict[str, np.ndarray]] = [{} for _ in range(nk)]
    for i, ((ld, lt), e) in enumerate(zip(loads, entries), 1):
        a = interface_coefficients(e, shares)
        name = ld.label or ld.key or f"load {i}"
        log.add(f"load{i}.entry", f"Fractions of {name} entering each ply", "e_i",
                ", ".join(f"{s.id}: {{e{j}}}" for j, s in enumerate(shares)),
                {f"e{j}": round(v, 4) for j, v in enumerate(e)}, ", ".join(f"{v:.4g}" for v in e),
                source="common practice, no source (top-loaded: uniform bearing on the plies' tops)"
                if ld.enters == "top" else "statics", note=f"enters: {ld.enters or 'own weight of each ply'}")  # fmt: skip
        for k in range(nk):
            log.add(f"load{i}.a{k + 1}", f"Part of {name} crossing interface {shares[k].id}|{shares[k + 1].id}",
                    "a_k = Σ (e_i − share_i) over the plies i ≤ k", "{a}", {"a": round(a[k], 4)}, a[k], source=SRC_TRANSFER)  # fmt: skip
            if ld.kind == "point":
                log.add(f"load{i}.lt", f"Transfer length of {name}", "ℓt", "{lt}", {"lt": Q_(lt, _IN)}, Q_(lt, _IN),
                        source="assumption (stated on the load, or the member's depth)", positions=("result",),
                        note="the loaded ply passes the point load on over this length, evenly")  # fmt: skip
            t = _intensity(ld, ev, L, lt) * a[k]
            by_case[k][ld.case] = by_case[k].get(ld.case, np.zeros_like(ev)) + t
    names: list[str] = []
    per: list[list[np.ndarray]] = [[] for _ in range(nk)]
    for cb in along.combinations:
        names.append(cb.name)
        for k in range(nk):
            perm = np.zeros_like(ev)
            pos = np.zeros_like(ev)
            neg = np.zeros_like(ev)
            for case, t in by_case[k].items():
                f = cb.factors.get(case, 0.0)
                if case in variable:
                    pos += np.maximum(f * t, 0.0)
                    neg += np.minimum(f * t, 0.0)
                else:
                    perm += f * t
            per[k].append(np.maximum(np.abs(perm + pos), np.abs(perm + neg)))
    return TransferDemand(xs, tuple(names), tuple(tuple(p) for p in per))


def plies_assumed(member: Member) -> list[Assumed]:
    """Values the ply design takes because the job did not state them."""
    out = [
        Assumed(f"member[{member.id}].ply", "Load shared by the plies in proportion to E·I (equal deflection)",
                "share_i = E_i·I_i / Σ E·I", "describe the plies as they are built; not adjustable",
                "common practice, no source"),
    ]  # fmt: skip
    seen: set[str] = set()
    for pl in member.plies:
        m = pl.part.material
        if m.family in ("wood", "glulam") and m.id not in seen:
            seen.add(m.id)
            out.append(Assumed(f"material[{m.id}].Fb", f"Wet service and temperature factors of {m.id} in the ply checks",
                               "CM = Ct = 1.0 (dry service, moisture content ≤ 19 %; temperature ≤ 100 °F)",
                               "not a key yet: for wet service give Fb, Fv, Fc_perp and E of [[material]] already "
                               "multiplied by CM", "NDS 2018 Table 4.3.1, §4.1.4; Supplement Table 4A footnotes"))  # fmt: skip
    for ld in member.loads:
        if ld.kind == "point" and ld.transfer_length is None:
            out.append(Assumed(f"{ld.key}.transfer_length", f"Length over which {ld.label or ld.key} passes between plies",
                               Q_(transfer_length(member, ld), _IN), f"transfer_length on {ld.key}",
                               "assumption: the member's depth"))  # fmt: skip
        if ld.enters == "top":
            out.append(Assumed(f"{ld.key}.enters", f"{ld.label or ld.key} bears on the plies' tops in proportion to their widths",
                               "uniform bearing", f"enters on {ld.key}", "common practice, no source"))  # fmt: skip
    return out
