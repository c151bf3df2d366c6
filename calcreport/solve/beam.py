"""Analysis along the member: supports, load cases, combinations, V(x), M(x) and deflection.

Every geometry (simple span, cantilever, overhangs, continuous spans) is solved the same way, by
the stiffness method (:mod:`calcreport.solve.beam_fe`). Quantities come in and go out; inside,
everything is inch and lbf. Results are sampled on one x grid that holds both sides of every
support and point load, so the jumps in shear are exact.

Live-type cases (L, Lr, S, R) are applied segment by segment in the patterns of
:func:`calcreport.solve.combinations.span_patterns` (the same pattern for all live-type cases of a
combination); the envelope covers every combination in every pattern and records which one governs
at each x.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from ..model import Combination, Load, Support
from ..steps import StepLog
from ..units import Q_, Quantity
from . import beam_fe as fe
from .combinations import LIVE_TYPE, SOURCE_PATTERN, Pattern, span_patterns

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

SOURCE_FE = (
    "matrix structural analysis, stiffness method (Euler-Bernoulli beam elements, consistent load vectors)"
)
_IN, _LBF = "inch", "lbf"


class BeamInputError(ValueError):
    """Loads or supports that cannot be analysed; ``key`` names the offending item."""

    def __init__(self, key: str, message: str):
        super().__init__(message)
        self.key = key


@dataclass(frozen=True)
class Segment:
    """A stretch of the member between supports ("span") or beyond the last one ("overhang",
    "cantilever" when the only support is fixed)."""

    index: int
    start: Quantity
    end: Quantity
    kind: str

    @property
    def length(self) -> Quantity:
        return self.end - self.start


@dataclass(frozen=True)
class Reaction:
    x: Quantity
    kind: str
    force: Quantity  # upward on the member
    moment: Quantity | None  # counter-clockwise on the member (fixed supports only)


@dataclass(frozen=True)
class Diagram:
    """V, M and deflection along the member for one load case or one combination (one pattern)."""

    name: str
    factors: dict[str, float]
    pattern: str
    x: Quantity  # array, inch; a support or point load appears twice (left side, right side)
    V: Quantity  # array, lbf
    M: Quantity  # array, lbf·inch, positive sagging
    deflection: Quantity | None  # array, inch, positive downward (None without EI)
    reactions: tuple[Reaction, ...]
    source: str = ""


@dataclass(frozen=True)
class Envelope:
    """Extremes over all combinations and patterns, with the governing one at each x."""

    x: Quantity
    V_max: Quantity
    V_min: Quantity
    M_max: Quantity
    M_min: Quantity
    V_abs: Quantity  # max |V|
    V_max_by: tuple[str, ...]
    V_min_by: tuple[str, ...]
    M_max_by: tuple[str, ...]
    M_min_by: tuple[str, ...]
    V_abs_by: tuple[str, ...]


@dataclass(frozen=True)
class BeamResult:
    length: Quantity
    supports: tuple[Support, ...]
    segments: tuple[Segment, ...]
    cases: tuple[Diagram, ...]
    combinations: tuple[Diagram, ...]  # all live-type segments loaded
    envelope: Envelope
    patterns: tuple[str, ...]
    steps: tuple
    EI: Quantity | None = None
    _basis: dict = field(default_factory=dict, repr=False, compare=False)

    def shear_abs_weighted(self, weight: dict[str, float]) -> tuple[Quantity, tuple[str, ...]]:
        """max over combinations c and span patterns of |V_c(x)|·weight[c] at each x, and the
        combination (with pattern) that governs there. Used for load-duration-normalised demand."""
        b = self._basis
        cols, names, w = [], [], []
        for cb in b["combinations"]:
            live = any(c in LIVE_TYPE for c in cb.factors)
            for pat in b["patterns"] if live else b["patterns"][:1]:
                cols.append(_coefficients(b["keys"], cb.factors, pat))
                names.append(cb.name if pat.name == "all" else f"{cb.name} [{pat.name}]")
                w.append(weight.get(cb.name, 1.0))
        if not cols:
            return self.envelope.V_abs, self.envelope.V_abs_by
        vals = np.abs(b["V"] @ np.stack(cols, axis=1)) * np.array(w)[None, :]
        return Q_(vals.max(1), _LBF), tuple(names[k] for k in vals.argmax(1))

    def deflection_max(self, factors: dict[str, float], segment: int) -> Quantity | None:
        """Largest |deflection| within ``segment`` for ``factors`` (service loads), over all
        span patterns of the live-type cases; ``None`` without EI."""
        b = self._basis
        if self.EI is None or not b:
            return None
        mask = b["seg_mask"][segment]
        worst = 0.0
        for pat in b["patterns"]:
            coef = _coefficients(b["keys"], factors, pat)
            d = np.abs(b["v"][mask] @ coef) / b["EI"]
            worst = max(worst, float(d.max()) if d.size else 0.0)
        return Q_(worst, _IN)


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


def _fe_loads(loads: list[Load], length: float, keyfmt: str) -> list[tuple[str, fe.FELoad]]:
    out = []
    for i, ld in enumerate(loads):
        key = ld.key or keyfmt.format(i=i + 1)
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
    return out


def _clip(ld: fe.FELoad, a: float, b: float, last: bool) -> fe.FELoad | None:
    """The part of ``ld`` on segment [a, b] (a point load on a boundary goes to the left one)."""
    if ld.kind == "point":
        inside = a <= ld.a < b or (last and ld.a == b) or (a == 0 and ld.a == 0)
        return ld if inside else None
    lo, hi = max(a, ld.a), min(b, ld.b)
    if hi <= lo:
        return None
    slope = (ld.w2 - ld.w1) / (ld.b - ld.a)
    return fe.FELoad("dist", lo, ld.w1 + slope * (lo - ld.a), hi, ld.w1 + slope * (hi - ld.a))


def _coefficients(keys: list[tuple[str, int]], factors: dict[str, float], pat: Pattern) -> np.ndarray:
    return np.array([factors.get(c, 0.0) if (s < 0 or s in pat.loaded) else 0.0 for c, s in keys])


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

    Source: matrix structural analysis (stiffness method); exact at the nodes for these loads.
    """
    log = log or StepLog("beam")
    first_step = len(log.steps)
    L = length.to(_IN).magnitude
    fsup = [fe.FESupport(s.x.to(_IN).magnitude, s.kind == "fixed") for s in supports]
    fl = _fe_loads(list(loads), L, load_key)
    extra = [] if extra_x is None else list(np.atleast_1d(extra_x.to(_IN).magnitude))
    try:
        mesh = fe.build_mesh(L, fsup, [f for _, f in fl], extra, divisions)
    except fe.StructureError as exc:
        raise BeamInputError("support", str(exc)) from None
    segs = _segments(L, fsup)
    nseg = len(segs)
    cases = list(dict.fromkeys(c for c, _ in fl))
    # basis load sets: (case, segment) for patterned cases, (case, -1) otherwise
    keys: list[tuple[str, int]] = []
    sets: list[list[fe.FELoad]] = []
    for c in cases:
        mine = [f for cc, f in fl if cc == c]
        if c in LIVE_TYPE and nseg > 1:
            for j, (a, b, _) in enumerate(segs):
                keys.append((c, j))
                sets.append([p for p in (_clip(f, a, b, j == nseg - 1) for f in mine) if p])
        else:
            keys.append((c, -1))
            sets.append(mine)
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
    full = Pattern(tuple(range(nseg)), "all")
    patterns = span_patterns(nseg)

    def diagram(name, factors, pat, source=""):
        coef = _coefficients(keys, factors, pat)
        r = sol.reactions @ coef
        reacts = tuple(
            Reaction(s.x, s.kind, Q_(r[k, 0], _LBF), Q_(r[k, 1], "lbf*inch") if s.kind == "fixed" else None)
            for k, s in enumerate(supports)
        )
        return Diagram(
            name,
            dict(factors),
            pat.name,
            x_q,
            Q_(V @ coef, _LBF),
            Q_(M @ coef, "lbf*inch"),
            None if EIf is None else Q_((v @ coef) / EIf, _IN),
            reacts,
            source,
        )

    case_d = tuple(diagram(c, {c: 1.0}, full) for c in cases)
    comb_d = tuple(diagram(cb.name, cb.factors, full, cb.source) for cb in combinations)
    env = _envelope(x_q, V, M, keys, combinations, patterns)
    seg_q = tuple(Segment(j, Q_(a, _IN), Q_(b, _IN), k) for j, (a, b, k) in enumerate(segs))
    seg_mask = [(mesh.x[idx_a] >= a - 1e-9) & (mesh.x[idx_a] <= b + 1e-9) for a, b, _ in segs]
    basis = {
        "keys": keys,
        "v": v,
        "V": V,
        "M": M,
        "EI": EIf,
        "patterns": patterns,
        "seg_mask": seg_mask,
        "combinations": list(combinations),
    }
    _log(log, length, supports, seg_q, case_d, comb_d, env, patterns, EI)
    return BeamResult(
        length,
        tuple(supports),
        seg_q,
        case_d,
        comb_d,
        env,
        tuple(p.name for p in patterns),
        tuple(log.steps[first_step:]),
        EI,
        basis,
    )


def _envelope(x_q, V, M, keys, combinations, patterns) -> Envelope:
    cols, names = [], []
    for cb in combinations:
        live = any(c in LIVE_TYPE for c in cb.factors)
        for pat in patterns if live else patterns[:1]:
            cols.append(_coefficients(keys, cb.factors, pat))
            names.append(cb.name if pat.name == "all" else f"{cb.name} [{pat.name}]")
    if not cols:
        z = np.zeros(len(V))
        e = Q_(z, _LBF)
        return Envelope(x_q, e, e, Q_(z, "lbf*inch"), Q_(z, "lbf*inch"), e, (), (), (), (), ())
    C = np.stack(cols, axis=1)
    Vc, Mc = V @ C, M @ C
    absV = np.abs(Vc)

    def by(a):
        return tuple(names[k] for k in a)

    return Envelope(
        x_q,
        Q_(Vc.max(1), _LBF),
        Q_(Vc.min(1), _LBF),
        Q_(Mc.max(1), "lbf*inch"),
        Q_(Mc.min(1), "lbf*inch"),
        Q_(absV.max(1), _LBF),
        by(Vc.argmax(1)),
        by(Vc.argmin(1)),
        by(Mc.argmax(1)),
        by(Mc.argmin(1)),
        by(absV.argmax(1)),
    )


def _log(log, length, supports, segs, cases, combs, env, patterns, EI) -> None:
    log.add(
        "length",
        "Member length",
        "L",
        "{L}",
        {"L": length},
        length,
        source="job file",
        positions=("L", "result"),
    )
    for k, s in enumerate(supports):
        log.add(
            f"support.{k + 1}",
            f"Support {k + 1} ({s.kind})",
            "x",
            "{x}",
            {"x": s.x},
            s.x,
            source="job file",
            positions=("x", "result"),
        )
    if len(segs) > 1:
        log.add(
            "patterns",
            "Span patterns for live-type loads (L, Lr, S, R)",
            "n_p",
            "{n} segments → {count} patterns",
            {"n": len(segs), "count": len(patterns)},
            len(patterns),
            source=SOURCE_PATTERN,
        )
    for d in cases:
        for k, r in enumerate(d.reactions):
            log.add(
                f"case.{d.name}.R{k + 1}",
                f"Reaction at support {k + 1}, load case {d.name}",
                f"R_{k + 1}",
                "stiffness analysis of case {case}, support at x = {x}",
                {"case": d.name, "x": r.x},
                r.force,
                source=SOURCE_FE,
                positions=("x",),
            )
    for i, d in enumerate(combs):
        for what, arr, unit in (("V", d.V, _LBF), ("M", d.M, "lbf*inch")):
            mag = arr.to(unit).magnitude
            k = int(np.argmax(np.abs(mag)))
            log.add(
                f"comb.{i + 1}.{what}",
                f"Largest |{what}| for {d.name}",
                f"{what}_max",
                "at x = {x}",
                {"x": d.x[k]},
                Q_(abs(mag[k]), unit),
                source=d.source,
                positions=("x",),
            )
    if not len(env.V_abs_by):
        return
    mags = env.V_abs.magnitude
    k = int(np.argmax(mags))
    log.add(
        "envelope.V",
        "Largest shear over all combinations and patterns",
        "V_max",
        "at x = {x}, governed by {by}",
        {"x": env.x[k], "by": env.V_abs_by[k]},
        env.V_abs[k],
        source=SOURCE_FE,
        governs=True,
        positions=("x",),
    )
    k = int(np.argmax(env.M_max.magnitude))
    log.add(
        "envelope.M_pos",
        "Largest positive moment",
        "M_max+",
        "at x = {x}, governed by {by}",
        {"x": env.x[k], "by": env.M_max_by[k]},
        env.M_max[k],
        source=SOURCE_FE,
        governs=True,
        positions=("x",),
    )
    k = int(np.argmin(env.M_min.magnitude))
    if env.M_min.magnitude[k] < 0:
        log.add(
            "envelope.M_neg",
            "Largest negative moment",
            "M_max−",
            "at x = {x}, governed by {by}",
            {"x": env.x[k], "by": env.M_min_by[k]},
            env.M_min[k],
            source=SOURCE_FE,
            governs=True,
            positions=("x",),
        )
