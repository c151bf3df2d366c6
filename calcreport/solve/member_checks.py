"""Member checks from plain inputs: bending stress per material, horizontal shear, deflection.

These take moments, shears and section numbers as quantities, so they do not depend on how the
section was found. Each returns a :class:`calcreport.solve.results.Check` and appends its step.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from ..steps import StepLog
from ..units import Q_, Quantity  # noqa: F401 (Q_ is used in the examples)
from .results import Check

__all__ = [
    "Fibre",
    "bending_checks",
    "shear_stress_check",
    "deflection_check",
    "SOURCE_BENDING",
    "SOURCE_SHEAR",
    "SOURCE_DEFLECTION",
]

SOURCE_BENDING = "mechanics of materials (flexure formula on the transformed section, σ = n·M·c/I)"
SOURCE_SHEAR = "mechanics of materials (τ = V·Q/(I·b), transformed Q and I, actual width b)"
SOURCE_DEFLECTION = (
    "IBC 2021 Table 1604.3 deflection limits (span/ratio; a cantilever uses twice "
    "its length), from memory; ratios as set in the job"
)


def _status(ratio: float | None) -> str:
    if ratio is None:
        return "INFO"
    return "OK" if ratio <= 1.0 + 1e-9 else "NG"


@dataclass(frozen=True)
class Fibre:
    """An extreme fibre of one material: its distance c from the neutral axis, its modular ratio
    n = E/E_ref and its allowable (ASD) or design (LRFD) bending stress, if known."""

    name: str
    c: Quantity
    n: float
    allowable: Quantity | None = None


def bending_checks(M: Quantity, I: Quantity, fibres: list[Fibre], log: StepLog | None = None) -> list[Check]:
    """Bending stress at each extreme fibre, σ = n·M·c/I (transformed section), against its
    allowable stress.

    Example:
        >>> c = bending_checks(Q_(100, "kip*in"), Q_(100, "in^4"), [Fibre("top", Q_(5, "in"), 1.0,
        ...                    Q_(6, "ksi"))])[0]
        >>> round(c.ratio, 4)
        0.8333
    """
    log = log or StepLog("checks")
    out = []
    for f in fibres:
        sigma = (f.n * abs(M) * f.c / I).to("psi")
        log.add(
            f"bending.{f.name}",
            f"Bending stress, {f.name}",
            "σ = n·M·c / I",
            "{n} · {M} · {c} / {I}",
            {"n": f.n, "M": abs(M), "c": f.c, "I": I},
            sigma,
            source=SOURCE_BENDING,
        )
        ratio = None if f.allowable is None else float((sigma / f.allowable).to("").magnitude)
        out.append(
            Check(
                f"bending.{f.name}",
                f"Bending stress, {f.name}",
                sigma,
                None if f.allowable is None else f.allowable.to("psi"),
                ratio,
                _status(ratio),
                SOURCE_BENDING,
            )
        )
    return out


def shear_stress_check(
    name: str,
    V: Quantity,
    Q: Quantity,
    I: Quantity,
    b: Quantity,
    allowable: Quantity | None,
    log: StepLog | None = None,
    label: str | None = None,
) -> Check:
    """Horizontal shear stress at a level, τ = V·Q/(I·b) (transformed Q and I, actual width b),
    against the allowable shear stress of the material there.

    Example:
        >>> round(shear_stress_check("NA", Q_(1, "kip"), Q_(10, "in^3"), Q_(100, "in^4"),
        ...       Q_(2, "in"), Q_(100, "psi")).ratio, 3)
        0.5
    """
    log = log or StepLog("checks")
    tau = (abs(V) * Q / (I * b)).to("psi")
    label = label or f"Horizontal shear stress, {name}"
    log.add(
        f"shear.{name}",
        label,
        "τ = V·Q / (I·b)",
        "{V} · {Q} / ({I} · {b})",
        {"V": abs(V), "Q": Q, "I": I, "b": b},
        tau,
        source=SOURCE_SHEAR,
    )
    ratio = None if allowable is None else float((tau / allowable).to("").magnitude)
    return Check(
        f"shear.{name}",
        label,
        tau,
        None if allowable is None else allowable.to("psi"),
        ratio,
        _status(ratio),
        SOURCE_SHEAR,
    )


def deflection_check(
    name: str,
    delta: Quantity,
    length: Quantity,
    limit: float,
    cantilever: bool = False,
    log: StepLog | None = None,
    note: str = "",
    label: str | None = None,
    source: str = SOURCE_DEFLECTION,
) -> Check:
    """Deflection against span/limit (a cantilever or overhang uses twice its length).

    Example:
        >>> deflection_check("L", Q_(0.5, "in"), Q_(20, "ft"), 360).status
        'OK'
    """
    log = log or StepLog("checks")
    ell = 2 * length if cantilever else length
    allow = (ell / limit).to("inch")
    label = label or f"Deflection, {name}"
    log.add(
        f"deflection.{name}",
        f"Allowed {label[0].lower()}{label[1:]}",
        "Δ_allow = ℓ / ratio",
        "{l} / {r}",
        {"l": ell, "r": limit},
        allow,
        source=source,
        note=note,
        positions=("l",),  # the span: feet-inches as drawings give it
    )
    ratio = float((abs(delta) / allow).to("").magnitude)
    return Check(
        f"deflection.{name}",
        label,
        abs(delta).to("inch"),  # type: ignore[arg-type]  # pint types abs() as PlainQuantity
        allow,
        ratio,
        _status(ratio),
        source,
        note,
    )


def deflection_checks(
    beam,
    limits: dict[str, float],
    log: StepLog | None = None,
    sets: dict[str, list] | None = None,
    source: str = SOURCE_DEFLECTION,
) -> list[Check]:
    """Deflection checks of every segment (span, overhang, cantilever) for the job's limits.

    ``limits`` maps a load case name (e.g. ``{"L": 360}``) to the span/limit ratio for that
    case alone, or ``"total"`` to the ratio for dead load plus one variable gravity case at a time
    (D + L, D + Lr, D + S, D + R or D + a case the job names itself; the largest governs).
    Live-type cases are taken in every span pattern. ``beam`` is a
    :class:`calcreport.solve.beam.BeamResult` solved with EI.
    """
    log = log or StepLog("checks")
    out: list[Check] = []
    if beam.EI is None:
        return out
    names = [d.name for d in beam.cases]
    for key, ratio in limits.items():
        what = "total load" if key == "total" else f"load case {key}"
        if sets is not None and key in sets:  # load sets of the job's method (EC5: EN 1990 6.14b, 6.16b)
            what = "quasi-permanent combination" if key == "quasi_permanent" else what
            case_sets = sets[key]
        elif key == "total":
            variable = [c for c in names if c not in ("D", "W")]
            case_sets = [({"D": 1.0, c: 1.0}, f"D + {c}") for c in variable] or [({"D": 1.0}, "D")]
        elif key in names:
            case_sets = [({key: 1.0}, key)]
        else:
            continue
        for seg in beam.segments:
            worst: Any = None
            label = ""
            for factors, text in case_sets:
                dl = beam.deflection_max(factors, seg.index)
                if worst is None or dl > worst:
                    worst, label = dl, text
            out.append(
                deflection_check(
                    f"{key}.segment{seg.index + 1}",
                    worst,
                    seg.length,
                    ratio,
                    seg.kind in ("overhang", "cantilever"),
                    log,
                    note=f"governed by {label}",
                    label=f"Deflection, {what} ({seg.kind} {seg.index + 1})",
                    source=source,
                )
            )
    return out
