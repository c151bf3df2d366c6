"""Analysis along the member: supports, load cases, combinations, V(x), M(x) and deflection.

Every geometry (simple span, cantilever, overhangs, continuous spans) is solved the same way, by
the stiffness method (:mod:`calcreport.solve.beam_fe`). Quantities come in and go out; inside,
everything is inch and lbf. Results are sampled on one x grid that holds both sides of every
support and point load, so the jumps in shear are exact.

Variable cases (L, Lr, S, R and cases of the job's own marked variable) are placed for their worst
effect at every station (:mod:`calcreport.solve.placement`, from influence lines): distributed loads
only where they make V, M, deflection or a reaction worse, point loads on or off, moving loads where
they are worst. Each combination's largest and smallest V, M and deflection come from the dead
(fixed) cases as written plus each variable case's extreme; the envelope covers every combination
and records which one governs at each x, and whether a variable case was partial or moving there.
"""

from __future__ import annotations

import numpy as np

from ..model import Combination, Load, Support
from ..steps import StepLog
from ..units import Q_, Quantity
from . import beam_fe as fe
from . import placement as pl
from .combinations import LIVE_TYPE
from .tolerance import snap, snap_together

__all__ = [
    "Segment",
    "Reaction",
    "Diagram",
    "Envelope",
    "BeamResult",
    "analyse",
    "self_weight",
    "BeamInputError",
    "SOURCE_FE",
]

from .beam_steps import SOURCE_FE  # noqa: E402  (re-exported)
from .beam_types import BeamInputError, BeamResult, Diagram, Envelope, Reaction, Segment  # noqa: E402
from .beam_types import combine as _combine  # noqa: E402  (member_box imports it from here)

_IN, _LBF = "inch", "lbf"


def self_weight(parts: list[tuple[Quantity, Quantity]], log: StepLog | None = None) -> Quantity:
    """Self-weight as a line load: w = Σ Aᵢ·γᵢ (area × weight density of each part).

    Source: statics — weight per unit length of a prismatic member.

    Example:
        >>> round(self_weight([(Q_(16.875, "in^2"), Q_(36, "pcf"))]).to("plf").magnitude, 3)
        4.219
    """
    w = Q_(0.0, "lbf/ft")
    for A, gamma in parts:
        w = w + (A * gamma).to("lbf/ft")
    if log is not None:
        slots = {}
        for i, (A, gamma) in enumerate(parts, 1):
            slots[f"A{i}"], slots[f"g{i}"] = A, gamma
        template = " + ".join(f"{{A{i}}} × {{g{i}}}" for i in range(1, len(parts) + 1)) or "0"
        log.add(
            "self_weight",
            "Self-weight of the member",
            "w_sw = Σ A·γ",
            template,
            slots,
            w,
            source="statics (weight of a prismatic member)",
        )
    return w


def _segments(length: float, supports: list[fe.FESupport]) -> list[tuple[float, float, str]]:
    xs = sorted({round(s.x, 9) for s in supports})
    if len(xs) == 1 and any(s.fixed for s in supports):
        return [(0.0, length, "cantilever")]
    out: list[tuple[float, float, str]] = []
    if xs[0] > 1e-9 * length:
        out.append((0.0, xs[0], "overhang"))
    out += [(a, b, "span") for a, b in zip(xs[:-1], xs[1:])]
    if xs[-1] < length * (1 - 1e-9):
        out.append((xs[-1], length, "overhang"))
    return out


def _fe_loads(
    loads: list[Load], length: float, keyfmt: str
) -> tuple[list[tuple[str, fe.FELoad]], list[pl.MovingSet]]:
    out = []
    groups: dict[tuple[str, str], list[tuple[Load, str]]] = {}
    for i, ld in enumerate(loads):
        key = ld.key or keyfmt.format(i=i + 1)
        if ld.moving:
            groups.setdefault((ld.case, ld.group or key), []).append((ld, key))
            continue
        if ld.kind == "point":
            if ld.at is None:
                raise BeamInputError(key, "a point load needs its position 'at'")
            a = ld.at.to(_IN).magnitude
            if not 0 <= a <= length * (1 + 1e-12):
                raise BeamInputError(key, "the point load lies outside the member")
            out.append((ld.case, fe.FELoad("point", min(a, length), ld.magnitude.to(_LBF).magnitude)))
            continue
        a = 0.0 if ld.start is None else ld.start.to(_IN).magnitude
        b = length if ld.end is None else ld.end.to(_IN).magnitude
        if not (0 <= a < b <= length * (1 + 1e-12)):
            raise BeamInputError(key, "the load must start before it ends, within the member")
        w1 = ld.magnitude.to("lbf/inch").magnitude
        w2 = (
            w1
            if ld.kind == "uniform"
            else (ld.magnitude_end if ld.magnitude_end is not None else ld.magnitude).to("lbf/inch").magnitude
        )
        out.append((ld.case, fe.FELoad("dist", a, w1, min(b, length), w2)))
    sets = []
    for (case, name), members in groups.items():
        ld0, key = members[0]
        lo, hi = (0.0, length) if ld0.between is None else tuple(q.to(_IN).magnitude for q in ld0.between)
        offs = [0.0 if m.offset is None else m.offset.to(_IN).magnitude for m, _ in members]
        if max(offs) - min(offs) > hi - lo + 1e-9 * length:
            raise BeamInputError(key, "the moving loads of the group do not fit within their travel range")
        sets.append(
            pl.MovingSet(
                case, name, tuple(m.magnitude.to(_LBF).magnitude for m, _ in members), tuple(offs), lo, hi
            )
        )
    return out, sets


def analyse(
    length: Quantity,
    supports: list[Support],
    loads: list[Load],
    combinations: list[Combination],
    EI: Quantity | None = None,
    log: StepLog | None = None,
    extra_x: Quantity | None = None,
    divisions: int = 240,
    load_key: str = "load[{i}]",
    variable: set[str] | frozenset[str] | tuple[str, ...] = LIVE_TYPE,
    standard: str = "ASCE 7-22",
) -> BeamResult:
    """Analyse the member for every load case and combination.

    Args:
        length: member length (x from 0 to length).
        supports: at least one fixed support or two supports.
        loads: loads by case; a case that is in no combination is still reported.
        combinations: factors by case (see :mod:`calcreport.solve.combinations`).
        EI: flexural rigidity (composite, transformed section) for deflections, or ``None``.
        log: derivation steps are appended here.
        extra_x: positions that must be grid points (e.g. a connector zone module grid).
        divisions: the mesh is at least this fine (elements ≤ length/divisions).
        variable: cases placed for their worst effect (default L, Lr, S, R).
        standard: edition of the load standard cited for the placement.

    Source: matrix structural analysis (stiffness method), exact at the nodes for these loads;
    influence lines for the worst placement of variable loads (ASCE 7 §4.3.3, §4.4).
    """
    from .beam_steps import log_analysis

    log = log or StepLog("beam")
    first_step = len(log.steps)
    L = length.to(_IN).magnitude
    fsup = [fe.FESupport(s.x.to(_IN).magnitude, s.kind == "fixed") for s in supports]
    fl, msets = _fe_loads(list(loads), L, load_key)
    extra = [] if extra_x is None else list(np.atleast_1d(extra_x.to(_IN).magnitude))
    for ms in msets:
        extra += [ms.lo, ms.hi]
    try:
        mesh = fe.build_mesh(L, fsup, [f for _, f in fl], extra, divisions)
        coarse = fe.build_mesh(L, fsup, [f for _, f in fl], extra, 1)
    except fe.StructureError as exc:
        raise BeamInputError("support", str(exc)) from None
    segs = _segments(L, fsup)
    cases = list(dict.fromkeys([ld.case for ld in loads]))
    sets = [[f for cc, f in fl if cc == c] for c in cases]
    try:
        sol = fe.solve(mesh, sets)
    except fe.StructureError as exc:
        raise BeamInputError("support", str(exc)) from None
    # output grid: both sides of jumps
    idx, side = [], []
    last = len(mesh.x) - 1
    for i in range(len(mesh.x)):
        if i in mesh.jump_nodes:
            idx += [i, i]
            side += [0, 1]
        else:
            idx.append(i)
            side.append(0 if i == last else 1)
    idx_a, side_a = np.array(idx), np.array(side)
    V = np.where(side_a[:, None] == 0, sol.V_left[idx_a], sol.V_right[idx_a])
    M = sol.M[idx_a]
    v = sol.v[idx_a]
    EIf = None if EI is None else EI.to("lbf*inch**2").magnitude
    x_q = Q_(mesh.x[idx_a], _IN)
    live = [c for c in cases if c in set(variable)]
    placed = pl.place(
        mesh,
        coarse,
        idx_a,
        side_a,
        {c: [f for cc, f in fl if cc == c] for c in cases},
        {c: [m for m in msets if m.case == c] for c in live},
        set(live),
    )
    # V and M of every case as written, from the same influence lines (statics on the reactions of
    # the coarse model: accurate to rounding); deflection from the fine model
    V = np.stack([placed.cases[c].full["V"] for c in cases], axis=1)
    M = np.stack([placed.cases[c].full["M"] for c in cases], axis=1)
    fixed = {c: {"V": V[:, j], "M": M[:, j], "v": v[:, j]} for j, c in enumerate(cases) if c not in live}
    placed_live = {c: ex for c, ex in placed.cases.items() if c in live}
    size = {"V": len(idx_a), "M": len(idx_a), "v": len(idx_a), "R": len(supports)}
    basis: dict = {"place": placed_live, "fixed": fixed, "size": size, "EI": EIf}
    for ex in placed_live.values():  # reactions: upward forces only, one per support
        for d in (ex.hi, ex.lo, ex.full):
            d["R"] = _support_forces(d["R"], placed.reaction_meta, len(supports))

    def diagram(name, factors, source="", combination=False):
        coef = np.array([factors.get(c, 0.0) for c in cases])
        r = sol.reactions @ coef
        reacts = tuple(
            Reaction(s.x, s.kind, Q_(r[k, 0], _LBF), Q_(r[k, 1], "lbf*inch") if s.kind == "fixed" else None)
            for k, s in enumerate(supports)
        )
        extra_fields = {}
        if combination:
            hv, lv = snap_together(*_combine(basis, factors, "V"))
            hm, lm = snap_together(*_combine(basis, factors, "M"))
            extra_fields = {
                "V_hi": Q_(hv, _LBF),
                "V_lo": Q_(lv, _LBF),
                "M_hi": Q_(hm, "lbf*inch"),
                "M_lo": Q_(lm, "lbf*inch"),
            }
        return Diagram(
            name,
            dict(factors),
            "as written",
            x_q,
            Q_(snap(V @ coef), _LBF),
            Q_(snap(M @ coef), "lbf*inch"),
            None if EIf is None else Q_((v @ coef) / EIf, _IN),
            reacts,
            source,
            **extra_fields,
        )

    case_d = tuple(diagram(c, {c: 1.0}) for c in cases)
    comb_d = tuple(diagram(cb.name, cb.factors, cb.source, True) for cb in combinations)
    env, label, HV, LV = _envelope(x_q, basis, combinations)
    basis.update({"HV": HV, "LV": LV, "names": [cb.name for cb in combinations], "label": label})
    seg_q = tuple(Segment(j, Q_(a, _IN), Q_(b, _IN), k) for j, (a, b, k) in enumerate(segs))
    basis["seg_mask"] = [(mesh.x[idx_a] >= a - 1e-9) & (mesh.x[idx_a] <= b + 1e-9) for a, b, _ in segs]
    log_analysis(log, length, supports, seg_q, case_d, comb_d, env, EI, placed, x_q, live, standard)
    return BeamResult(
        length,
        tuple(supports),
        seg_q,
        case_d,
        comb_d,
        env,
        tuple(live),
        tuple(log.steps[first_step:]),
        EI,
        basis,
    )


def _support_forces(r: np.ndarray, meta: list[tuple[int, bool]], n: int) -> np.ndarray:
    out = np.zeros(n)
    for val, (k, is_moment) in zip(r, meta):
        if not is_moment:
            out[k] = val
    return out


def _envelope(x_q, basis, combinations):
    """Envelope over the combinations, each with its variable cases in their worst placement, and a
    labeller naming the governing combination (with the variable cases partial or moving there)."""
    S = basis["size"]["V"]
    if not combinations:
        z = np.zeros(S)
        e = Q_(z, _LBF)
        return (
            Envelope(x_q, e, e, Q_(z, "lbf*inch"), Q_(z, "lbf*inch"), e, (), (), (), (), ()),
            None,
            np.zeros((S, 0)),
            np.zeros((S, 0)),
        )
    cols = {q: [_combine(basis, cb.factors, q) for cb in combinations] for q in ("V", "M")}
    # round-off of the stiffness solution is 0 (relative to the largest value of the quantity
    # over the whole envelope), so a value that is only noise never governs
    HV, LV = snap_together(
        np.stack([h for h, _ in cols["V"]], axis=1), np.stack([lo for _, lo in cols["V"]], axis=1)
    )
    HM, LM = snap_together(
        np.stack([h for h, _ in cols["M"]], axis=1), np.stack([lo for _, lo in cols["M"]], axis=1)
    )
    place = basis["place"]

    def label(q: str, j: int, s: int, high: bool) -> str:
        cb = combinations[j]
        tags = []
        for c, f in cb.factors.items():
            if c not in place or f == 0:
                continue
            ex = place[c]
            up = high == (f > 0)
            flag = ex.partial_hi[q][s] if up else ex.partial_lo[q][s]
            words = (["partial"] if flag else []) + (["moving"] if ex.moving else [])
            if words:
                tags.append(f"{c} {' and '.join(words)}")
        return cb.name + (f" [{', '.join(tags)}]" if tags else "")

    absV = np.maximum(np.abs(HV), np.abs(LV))
    ka = absV.argmax(1)
    r = np.arange(S)
    hi_abs = np.abs(HV[r, ka]) >= np.abs(LV[r, ka])

    def by(q, ks, high):
        """label() at every station. label() reads a station only through the partial flags of
        the placed cases of its combination, so the stations of one combination, direction and
        set of flags share one call (the first of them)."""
        ks = np.asarray(ks)
        hs = np.broadcast_to(np.asarray(high, dtype=bool), ks.shape)
        out = [""] * len(ks)
        for j in sorted(set(ks.tolist())):
            cb = combinations[j]
            for h in (True, False):
                sel = np.flatnonzero((ks == j) & (hs == h))
                if not len(sel):
                    continue
                cols = [
                    place[c].partial_hi[q] if h == (f > 0) else place[c].partial_lo[q]
                    for c, f in cb.factors.items()
                    if c in place and f != 0
                ]
                if len(cols) > 62:  # more flags than bits of a code: one call a station
                    for s in sel.tolist():
                        out[s] = label(q, j, s, h)
                    continue
                code = np.zeros(len(sel), dtype=np.int64)
                for bit, col in enumerate(cols):
                    code |= np.asarray(col, dtype=bool)[sel].astype(np.int64) << bit
                for v in set(code.tolist()):
                    alike = sel[code == v].tolist()
                    text = label(q, j, alike[0], h)
                    for s in alike:
                        out[s] = text
        return tuple(out)

    env = Envelope(
        x_q,
        Q_(HV.max(1), _LBF),
        Q_(LV.min(1), _LBF),
        Q_(HM.max(1), "lbf*inch"),
        Q_(LM.min(1), "lbf*inch"),
        Q_(absV.max(1), _LBF),
        by("V", HV.argmax(1), True),
        by("V", LV.argmin(1), False),
        by("M", HM.argmax(1), True),
        by("M", LM.argmin(1), False),
        by("V", ka, hi_abs),
    )
    return env, label, HV, LV
