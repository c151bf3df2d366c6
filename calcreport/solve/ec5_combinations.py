"""EN 1990:2002 combinations of actions for ``settings.method = "EC5"``.

Ultimate limit state, persistent and transient design situations, expression (6.10) with the
recommended partial factors of Table A1.2(B): γ_G,sup = 1.35, γ_G,inf = 1.00, γ_Q = 1.50
(0 where favourable). Serviceability: characteristic (6.14b) and quasi-permanent (6.16b). The ψ
factors are the job's (``[[settings.load_case]]``): EN 1990 Table A1.1 or the national annex.

The permanent case is ``D`` (G); every other case is a variable action Q. For each leading variable
action Q1 the ULS combination is 1.35·G + 1.5·Q1 + Σ 1.5·ψ0,i·Qi; 1.35·G alone is kept (its k_mod is
the permanent one, which may govern timber); and 1.0·G + 1.5·W (G favourable, wind uplift) where a
wind case W is present. The variable actions are placed for their worst effect by the beam
analysis (partial loading); a companion action is not dropped when favourable — the envelope takes
every combination, so the largest effect governs (conservative for gravity loads of one sign).
"""

from __future__ import annotations

from ..keys.loads import PERMANENT_CASE
from ..model import Combination, LoadCaseFactors

__all__ = [
    "GAMMA_G_SUP",
    "GAMMA_G_INF",
    "GAMMA_Q",
    "uls_combinations",
    "characteristic_sets",
    "quasi_permanent_set",
    "SOURCE_ULS",
    "SOURCE_CHARACTERISTIC",
    "SOURCE_QUASI_PERMANENT",
    "MissingFactor",
]

GAMMA_G_SUP = 1.35
GAMMA_G_INF = 1.00
GAMMA_Q = 1.50
SOURCE_ULS = "EN 1990:2002 §6.4.3.2, expression (6.10), Table A1.2(B)"
SOURCE_CHARACTERISTIC = "EN 1990:2002 §6.5.3, expression (6.14b) (characteristic combination)"
SOURCE_QUASI_PERMANENT = "EN 1990:2002 §6.5.3, expression (6.16b) (quasi-permanent combination)"
WIND_CASE = "W"


class MissingFactor(ValueError):
    """A variable case lacks a ψ factor or duration class the combinations need."""

    def __init__(self, case: str, key: str):
        super().__init__(f"load case {case!r} needs {key} in a [[settings.load_case]] table")
        self.case, self.key = case, key


def _psi(cases: dict[str, LoadCaseFactors], case: str, which: str) -> float:
    lc = cases.get(case)
    value = getattr(lc, which) if lc is not None else None
    if value is None:
        raise MissingFactor(case, which)
    return float(value)


def _name(number: str, factors: dict[str, float]) -> str:
    terms = [c if f == 1.0 else f"{f!r}{c}" for c, f in factors.items()]
    return f"EC5 {number}: " + " + ".join(terms)


def uls_combinations(cases_present: list[str], cases: dict[str, LoadCaseFactors]) -> list[Combination]:
    """ULS combinations by EN 1990 (6.10) for the cases present (see the module text).

    >>> from calcreport.model import LoadCaseFactors as F
    >>> [c.name for c in uls_combinations(["D", "L"], {"L": F("L", "medium", 0.7, 0.3)})]
    ['EC5 1: 1.35D', 'EC5 2: 1.35D + 1.5L']
    """
    variable = [c for c in cases_present if c != PERMANENT_CASE]
    has_g = PERMANENT_CASE in cases_present
    for c in variable:
        if c not in cases:
            raise MissingFactor(c, "duration")
    out: list[Combination] = []
    n = 0
    if has_g:
        n += 1
        out.append(
            Combination(
                _name(str(n), {PERMANENT_CASE: GAMMA_G_SUP}), {PERMANENT_CASE: GAMMA_G_SUP}, SOURCE_ULS
            )
        )
    for lead in variable:
        factors: dict[str, float] = {PERMANENT_CASE: GAMMA_G_SUP} if has_g else {}
        factors[lead] = GAMMA_Q
        for other in variable:
            if other != lead:
                f = round(GAMMA_Q * _psi(cases, other, "psi0"), 12)
                if f != 0.0:
                    factors[other] = f
        n += 1
        out.append(Combination(_name(str(n), factors), factors, f"{SOURCE_ULS}, leading action {lead}"))
    if WIND_CASE in variable and has_g:
        factors = {PERMANENT_CASE: GAMMA_G_INF, WIND_CASE: GAMMA_Q}
        n += 1
        out.append(
            Combination(
                _name(str(n), factors), factors, f"{SOURCE_ULS}, G favourable (γ_G,inf), wind leading"
            )
        )
    return out


def characteristic_sets(
    cases_present: list[str], cases: dict[str, LoadCaseFactors]
) -> list[tuple[dict[str, float], str]]:
    """Characteristic SLS combinations G + Q1 + Σ ψ0,i·Qi (EN 1990 (6.14b)), one per leading
    variable action (G alone when there is none), with their names."""
    variable = [c for c in cases_present if c != PERMANENT_CASE]
    base = {PERMANENT_CASE: 1.0} if PERMANENT_CASE in cases_present else {}
    if not variable:
        return [(base, "G")] if base else []
    out = []
    for lead in variable:
        factors = dict(base)
        factors[lead] = 1.0
        for other in variable:
            if other != lead:
                f = round(_psi(cases, other, "psi0"), 12)
                if f:
                    factors[other] = f
        out.append((factors, " + ".join(c if f == 1.0 else f"{f!r}{c}" for c, f in factors.items())))
    return out


def quasi_permanent_set(
    cases_present: list[str], cases: dict[str, LoadCaseFactors]
) -> tuple[dict[str, float], str]:
    """Quasi-permanent SLS combination G + Σ ψ2,i·Qi (EN 1990 (6.16b)) and its name."""
    factors = {PERMANENT_CASE: 1.0} if PERMANENT_CASE in cases_present else {}
    for c in cases_present:
        if c != PERMANENT_CASE:
            f = round(_psi(cases, c, "psi2"), 12)
            if f:
                factors[c] = f
    return factors, " + ".join(c if f == 1.0 else f"{f!r}{c}" for c, f in factors.items()) or "—"
