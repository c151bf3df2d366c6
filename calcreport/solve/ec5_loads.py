"""The EC5 route wired into the member analysis (``settings.method = "EC5"``): EN 1990
combinations for the member's cases, the k_mod of each combination for wood connectors, and the
serviceability load sets of the deflection limits.

* ULS: :func:`calcreport.solve.ec5_combinations.uls_combinations` (EN 1990 (6.10)).
* k_mod: the connector value uses the k_mod of the shortest-duration load of all the member's
  combinations (:func:`shortest_duration`); each combination c is checked with its own k_mod,c by
  scaling its shear by k_mod / k_mod,c ≥ 1 (EN 1995-1-1 §3.1.3(2), §2.4.3) — the same as comparing
  V_c with k_mod,c·F_v,Rk/γ_M.
* SLS: the limit ``total`` takes the characteristic combinations G + Q1 + Σψ0·Qi (EN 1990 (6.14b));
  ``quasi_permanent`` takes G + Σψ2·Qi (6.16b); a limit named by a case takes that case alone.
  Creep (k_def, EN 1995-1-1 §2.3.2.2) is not included: the deflections are instantaneous.
"""

from __future__ import annotations

from ..keys.loads import DURATION_CLASSES
from ..model import Combination, Member, Settings
from ..steps import StepLog
from .ec5_combinations import (
    SOURCE_CHARACTERISTIC,
    SOURCE_QUASI_PERMANENT,
    SOURCE_ULS,
    MissingFactor,
    characteristic_sets,
    quasi_permanent_set,
    uls_combinations,
)
from .ec5_factors import SOURCE_KMOD, SOURCE_KMOD_COMBINATION, combination_duration, k_mod
from .results import SolveError

__all__ = [
    "ec5_combinations",
    "shortest_duration",
    "kmod_weights",
    "ec5_deflection_sets",
    "SOURCE_EC5_DEFLECTION",
]

SOURCE_EC5_DEFLECTION = (
    "EN 1995-1-1:2004 §7.2 (limiting values of deflection; span/ratio as set in the job, a cantilever "
    "twice its length), EN 1990:2002 A1.4"
)


def _missing(exc: MissingFactor) -> SolveError:
    return SolveError(
        "settings.load_case",
        f'load case {exc.case!r} needs {exc.key} under method = "EC5": add a [[settings.load_case]] '
        f'table with case = "{exc.case}", duration and psi0 (and psi2 for the quasi_permanent limit)',
    )


def ec5_combinations(
    member: Member, cases: list[str], settings: Settings
) -> tuple[tuple[Combination, ...], str]:
    """The EN 1990 (6.10) combinations of the member's cases, and their source."""
    try:
        return tuple(uls_combinations(cases, settings.load_cases)), SOURCE_ULS
    except MissingFactor as exc:
        raise _missing(exc) from None


def _duration(cb: Combination, settings: Settings) -> tuple[str, str]:
    try:
        return combination_duration(cb, settings.load_cases)
    except KeyError as exc:
        raise _missing(MissingFactor(str(exc.args[0]), "duration")) from None


def shortest_duration(combinations, settings: Settings) -> str:
    """The shortest load-duration class among the combinations (highest k_mod)."""
    best = max((DURATION_CLASSES.index(_duration(cb, settings)[0]) for cb in combinations), default=0)
    return DURATION_CLASSES[best]


def kmod_weights(combinations, k_used: float, settings: Settings | None, log: StepLog) -> dict[str, float]:
    """Weight k_mod / k_mod,c of each combination's shear, with a step per combination."""
    assert settings is not None and settings.service_class is not None
    out: dict[str, float] = {}
    for i, cb in enumerate(combinations, 1):
        dur, case = _duration(cb, settings)
        kc = k_mod(dur, settings.service_class)
        log.add(
            f"kmod.{i}",
            f"k_mod of {cb.name}",
            "k_mod,c",
            "shortest-duration load {case}: {dur}, service class {sc}",
            {"case": case or "—", "dur": dur, "sc": settings.service_class},
            kc,
            source=f"{SOURCE_KMOD_COMBINATION}; {SOURCE_KMOD}",
        )
        out[cb.name] = k_used / kc
    return out


def ec5_deflection_sets(beam, limits: dict[str, float], settings: Settings | None) -> dict[str, list]:
    """Load sets of the ``total`` and ``quasi_permanent`` deflection limits under EC5."""
    assert settings is not None
    names = [d.name for d in beam.cases]
    out: dict[str, list] = {}
    try:
        if "total" in limits:
            out["total"] = [
                (f, f"{t} ({SOURCE_CHARACTERISTIC})")
                for f, t in characteristic_sets(names, settings.load_cases)
            ]
        if "quasi_permanent" in limits:
            f, t = quasi_permanent_set(names, settings.load_cases)
            out["quasi_permanent"] = [(f, f"{t} ({SOURCE_QUASI_PERMANENT})")]
    except MissingFactor as exc:
        raise _missing(exc) from None
    return out
