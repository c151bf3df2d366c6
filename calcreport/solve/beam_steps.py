"""Derivation steps of the analysis along the member (:func:`calcreport.solve.beam.analyse`):
length, supports, reactions, the worst placement of each variable case, combination extremes and
the envelope. Records quantities only; the outputs format them."""

from __future__ import annotations

import numpy as np

from ..steps import StepLog
from ..units import Q_
from .combinations import source_placement
from .tolerance import negligible

__all__ = ["log_analysis", "SOURCE_FE"]

SOURCE_FE = (
    "matrix structural analysis, stiffness method (Euler-Bernoulli beam elements, consistent load vectors)"
)
SOURCE_IL = "influence lines of the stiffness model (Müller-Breslau principle; matrix structural analysis)"
_IN, _LBF = "inch", "lbf"


def log_analysis(
    log: StepLog, length, supports, segs, cases, combs, env, EI, placed, x_q, live, standard
) -> None:
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
    for c in live:
        _placement_step(log, c, placed, x_q, standard)
    for d in cases:
        ex = placed.cases.get(d.name) if d.name in live else None
        for k, r in enumerate(d.reactions):
            if ex is None:
                log.add(
                    f"case.{d.name}.R{k + 1}",
                    f"Reaction at support {k + 1}, load case {d.name}",
                    f"R_{k + 1}",
                    "stiffness analysis of case {case}, support at x = {x}",
                    {"case": d.name, "x": r.x},
                    r.force,
                    source=SOURCE_FE,
                    positions=("x",),
                    group="cases",
                    row=d.name,
                    column=f"R{k + 1}",
                )
                continue
            log.add(
                f"case.{d.name}.R{k + 1}",
                f"Largest reaction at support {k + 1}, load case {d.name} in its worst placement",
                f"R_{k + 1},max",
                "influence line of the reaction at x = {x}, loaded where it adds",
                {"x": r.x},
                Q_(float(ex.hi["R"][k]), _LBF),
                source=f"{SOURCE_IL}; {source_placement(standard)}",
                positions=("x",),
                group="cases",
                row=d.name,
                column=f"R{k + 1}",
            )
    for i, d in enumerate(combs):
        for what, hi, lo, unit in (("V", d.V_hi, d.V_lo, _LBF), ("M", d.M_hi, d.M_lo, "lbf*inch")):
            mag = np.maximum(np.abs(hi.to(unit).magnitude), np.abs(lo.to(unit).magnitude))
            k = int(np.argmax(mag))
            log.add(
                f"comb.{i + 1}.{what}",
                f"Largest |{what}| for {d.name}",
                f"{what}_max",
                "at x = {x}"
                + (", variable loads in their worst placement" if any(c in live for c in d.factors) else ""),
                {"x": d.x[k]},
                Q_(float(mag[k]), unit),
                source=d.source,
                positions=("x",),
                group="combinations",
                row=d.name,
                column=what,
            )
    if not len(env.V_abs_by):
        return
    mags = env.V_abs.magnitude
    k = int(np.argmax(mags))
    src = SOURCE_FE if not live else f"{SOURCE_FE}; {source_placement(standard)}"
    log.add(
        "envelope.V",
        "Largest shear over all combinations" + (" and placements of variable load" if live else ""),
        "V_max",
        "at x = {x}, governed by {by}",
        {"x": env.x[k], "by": env.V_abs_by[k]},
        env.V_abs[k],
        source=src,
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
        source=src,
        governs=True,
        positions=("x",),
    )
    k = int(np.argmin(env.M_min.magnitude))
    M_scale = max(float(np.max(np.abs(env.M_max.magnitude))), float(np.max(np.abs(env.M_min.magnitude))))
    if env.M_min.magnitude[k] < 0 and not negligible(float(env.M_min.magnitude[k]), M_scale):
        log.add(
            "envelope.M_neg",
            "Largest negative moment",
            "M_max−",
            "at x = {x}, governed by {by}",
            {"x": env.x[k], "by": env.M_min_by[k]},
            env.M_min[k],
            source=src,
            governs=True,
            positions=("x",),
        )


def _placement_step(log: StepLog, case: str, placed, x_q, standard: str) -> None:
    """One step per variable case: how it was placed, shown for its largest |V|."""
    from .influence import loaded_parts

    ex = placed.cases[case]
    hi, lo = ex.hi["V"], ex.lo["V"]
    absV = np.maximum(np.abs(hi), np.abs(lo))
    s = int(np.argmax(absV))
    sign = 1 if abs(hi[s]) >= abs(lo[s]) else -1
    values: dict = {"x": x_q[s]}
    positions = ["x"]
    parts_text = []
    what = []
    if ex.wa is not None and (np.any(ex.wa) or np.any(ex.wb)):
        what.append("distributed load only where the influence line adds to the effect")
        stretches = loaded_parts(placed.influence["V"], s, ex.wa, ex.wb, sign)
        for n, (a, b) in enumerate(stretches[:3], 1):
            values[f"a{n}"], values[f"b{n}"] = Q_(a, _IN), Q_(b, _IN)
            positions += [f"a{n}", f"b{n}"]
            parts_text.append(f"{{a{n}}} to {{b{n}}}")
        more = f" and {len(stretches) - 3} more stretches" if len(stretches) > 3 else ""
        loaded = ("loaded " + ", ".join(parts_text) + more) if parts_text else "not loaded"
    else:
        loaded = ""
    moving_text = []
    for n, (ms, (ah, al, oh, ol)) in enumerate(zip(ex.moving, ex.moving_at.get("V", [])), 1):
        ref, sgn = (ah[s], oh[s]) if sign > 0 else (al[s], ol[s])
        slots = []
        for m, d in enumerate(ms.offsets, 1):
            values[f"p{n}_{m}"] = Q_(float(ref + sgn * d), _IN)
            positions.append(f"p{n}_{m}")
            slots.append(f"{{p{n}_{m}}}")
        kind = f"{ms.name} loads at " if len(ms.P) > 1 else "moving load at "
        moving_text.append(kind + ", ".join(slots))
    if ex.moving:
        what.append("moving loads at their worst position for every x")
    if ex.points:
        what.append("point loads at their positions, each on or off")
    template = (
        "; ".join(what)
        + "; for the largest |V|, at x = {x}: "
        + "; ".join(t for t in [loaded] + moving_text if t)
    )
    log.add(
        f"placement.{case}",
        f"Worst placement of variable load {case}",
        "V_max = ∫ max(w·η_V, 0) dξ + max Σ P·η_V",
        template,
        values,
        Q_(float(absV[s]), _LBF),
        source=f"{source_placement(standard)}; {SOURCE_IL}",
        positions=tuple(positions),
        note="placed separately for every station; for M(x), deflection and reactions the same way",
    )
