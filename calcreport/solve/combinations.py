"""Load combinations of ASCE 7 (editions 7-22 and 7-16): basic combinations for strength design
(§2.3.1) and allowable stress design (§2.4.1).

The "or" alternatives of the standard are expanded into separate combinations. A combination is
kept only when the case that leads it (its principal load) is present in the job; companion cases
that are absent are dropped from it; combinations that end up with the same factors are kept once.
Cases the job names itself (not D, L, Lr, S, R, W) appear in no standard combination: a job that
uses them lists its own combinations.

The editions differ in the snow load factors: ASCE 7-22 maps strength-level snow loads and uses 1.0S
(companion 0.3S) in strength design and 0.7S in allowable stress design; ASCE 7-16 uses 1.6S
(companion 0.5S) and S. Tests hold each edition's full list (tests/test_combinations.py).
"""

from __future__ import annotations

from ..keys.loads import DEFAULT_STANDARD, LIVE_TYPE, LOAD_STANDARDS, STANDARD_CASES
from ..model import Combination

__all__ = [
    "STANDARD_CASES",
    "LIVE_TYPE",
    "LOAD_STANDARDS",
    "standard_combinations",
    "source_lrfd",
    "source_asd",
    "source_placement",
    "SOURCE_LRFD",
    "SOURCE_ASD",
]


def source_lrfd(standard: str = DEFAULT_STANDARD) -> str:
    return f"{standard} §2.3.1 (basic combinations, strength design)"


def source_asd(standard: str = DEFAULT_STANDARD) -> str:
    return f"{standard} §2.4.1 (basic combinations, allowable stress design)"


def source_placement(standard: str = DEFAULT_STANDARD) -> str:
    """Clauses that ask for the worst placement of live load (same numbers in 7-16 and 7-22; under
    EC5, ``standard = "EN 1990"``: EN 1991-1-1 §6.2.1 and EN 1990 §6.4.3.2, from memory)."""
    if standard == "EN 1990":
        return (
            "EN 1991-1-1:2002 §6.2.1(1) (imposed loads at the most unfavourable part), EN 1990:2002 §6.4.3.2"
        )
    return f"{standard} §4.3.3 (partial loading), §4.4 (concentrated live loads)"


SOURCE_LRFD = source_lrfd()
SOURCE_ASD = source_asd()

# (number, principal case, terms). A term is (factor, case-or-alternatives). ``"ROOF"`` stands for
# the alternatives (Lr or S or R), each with its own factor from the dict of the term; ``"L|0.5W"``
# for the companion (L or 0.5W). Combinations with earthquake load E are not included (E is not a
# load case of this tool).
_Roof = dict[str, float]
_TABLES: dict[tuple[str, str], list[tuple[str, str, list[tuple[object, str]]]]] = {}


def _roof(lr: float, s: float, r: float) -> _Roof:
    return {"Lr": lr, "S": s, "R": r}


# ASCE 7-16 §2.3.1 eqs 1-5 and §2.4.1 eqs 1-7.
_TABLES[("ASCE 7-16", "LRFD")] = [
    ("1", "D", [(1.4, "D")]),
    ("2", "L", [(1.2, "D"), (1.6, "L"), (_roof(0.5, 0.5, 0.5), "ROOF")]),
    ("3", "ROOF", [(1.2, "D"), (_roof(1.6, 1.6, 1.6), "ROOF"), (None, "L|0.5W")]),
    ("4", "W", [(1.2, "D"), (1.0, "W"), (1.0, "L"), (_roof(0.5, 0.5, 0.5), "ROOF")]),
    ("5", "W", [(0.9, "D"), (1.0, "W")]),
]
# ASCE 7-22 §2.3.1 eqs 1-5: snow at strength level, 1.0S where 7-16 has 1.6S, 0.3S where 0.5S.
_TABLES[("ASCE 7-22", "LRFD")] = [
    ("1", "D", [(1.4, "D")]),
    ("2", "L", [(1.2, "D"), (1.6, "L"), (_roof(0.5, 0.3, 0.5), "ROOF")]),
    ("3", "ROOF", [(1.2, "D"), (_roof(1.6, 1.0, 1.6), "ROOF"), (None, "L|0.5W")]),
    ("4", "W", [(1.2, "D"), (1.0, "W"), (1.0, "L"), (_roof(0.5, 0.3, 0.5), "ROOF")]),
    ("5", "W", [(0.9, "D"), (1.0, "W")]),
]


def _asd(snow: float) -> list:
    return [
        ("1", "D", [(1.0, "D")]),
        ("2", "L", [(1.0, "D"), (1.0, "L")]),
        ("3", "ROOF", [(1.0, "D"), (_roof(1.0, snow, 1.0), "ROOF")]),
        ("4", "L+ROOF", [(1.0, "D"), (0.75, "L"), (_roof(0.75, 0.75 * snow, 0.75), "ROOF")]),
        ("5", "W", [(1.0, "D"), (0.6, "W")]),
        # 0.75(0.6W) = 0.45W
        ("6", "W", [(1.0, "D"), (0.75, "L"), (0.45, "W"), (_roof(0.75, 0.75 * snow, 0.75), "ROOF")]),
        ("7", "W", [(0.6, "D"), (0.6, "W")]),
    ]


_TABLES[("ASCE 7-16", "ASD")] = _asd(1.0)
_TABLES[("ASCE 7-22", "ASD")] = _asd(0.7)  # D + (Lr or 0.7S or R); D + 0.75L + 0.75(Lr or 0.7S or R); …

_ROOF = ("Lr", "S", "R")


def _expand(terms, roof: str, companion: str) -> dict[str, float]:
    out: dict[str, float] = {}
    for factor, case in terms:
        if case == "ROOF":
            if not roof:
                continue
            factor, case = factor[roof], roof
        if case == "L|0.5W":
            factor, case = (1.0, "L") if companion == "L" else (0.5, "W")
        out[case] = round(out.get(case, 0.0) + factor, 12)
    return out


def standard_combinations(
    method: str, cases: set[str] | list[str], standard: str = DEFAULT_STANDARD
) -> list[Combination]:
    """The basic combinations of ``standard`` ("ASCE 7-22" or "ASCE 7-16") for ``method`` ("ASD"
    or "LRFD") and the cases present.

    ASCE 7-16 — §2.3.1: 1.4D; 1.2D + 1.6L + 0.5(Lr or S or R); 1.2D + 1.6(Lr or S or R) + (L or 0.5W);
    1.2D + 1.0W + L + 0.5(Lr or S or R); 0.9D + 1.0W. §2.4.1: D; D + L; D + (Lr or S or R);
    D + 0.75L + 0.75(Lr or S or R); D + 0.6W; D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R); 0.6D + 0.6W.
    ASCE 7-22 — the same with strength-level snow: §2.3.1 1.2D + 1.6L + 0.5(Lr or R) or + 0.3S;
    1.2D + 1.6(Lr or R) or + 1.0S, + (L or 0.5W); 1.2D + 1.0W + L + 0.5(Lr or R) or + 0.3S;
    §2.4.1 0.7S in place of S.
    The factor 1.0 on L in §2.3.1 combinations 3 and 4 is kept (the standard's exception allowing
    0.5 for some occupancies is not applied: conservative). Names read like the standard's
    equation, e.g. ``"LRFD 3: 1.2D + 1.0S + L"``; each combination cites its edition and equation.

    Example:
        >>> [c.name for c in standard_combinations("ASD", {"D", "L"})]
        ['ASD 1: D', 'ASD 2: D + L']
    """
    if standard not in LOAD_STANDARDS:
        raise ValueError(f"unknown load standard {standard!r}")
    tag = "LRFD" if method.upper() == "LRFD" else "ASD"
    table = _TABLES[(standard, tag)]
    src = source_lrfd(standard) if tag == "LRFD" else source_asd(standard)
    present = set(cases)
    roofs = [r for r in _ROOF if r in present] or [""]
    out: list[Combination] = []
    seen: set[tuple] = set()
    for number, principal, terms in table:
        for roof in roofs:
            for companion in ("L", "W") if any(t[1] == "L|0.5W" for t in terms) else ("L",):
                lead = [roof if p == "ROOF" else p for p in principal.split("+")]
                if any(p not in present for p in lead):
                    continue
                factors = {
                    c: f for c, f in _expand(terms, roof, companion).items() if c in present and f != 0.0
                }
                sig = tuple(sorted(factors.items()))
                if not factors or sig in seen:
                    continue
                seen.add(sig)
                name = f"{tag} {number}: " + " + ".join(_term(c, f) for c, f in factors.items())
                out.append(Combination(name, factors, f"{src}, combination {number}"))
    return out


def _term(case: str, factor: float) -> str:
    """A factor written as in the standard (``1.2D``, ``L``, ``0.45W``); factors are rounded to 12
    places above, so their shortest repr is the decimal of the standard."""
    return case if factor == 1.0 else f"{factor!r}{case}"


#: Load duration factor C_D by load case, NDS 2018 Table 2.3.2 (from memory): permanent (dead) 0.9,
#: ten years (occupancy live) 1.0, two months (snow) 1.15, seven days (roof live) 1.25, ten minutes
#: (wind) 1.6. Rain has no row: taken as ten years (1.0), and a case named by the job as permanent
#: (0.9) — both conservative assumptions, no source.
DURATION = {"D": 0.9, "L": 1.0, "S": 1.15, "Lr": 1.25, "W": 1.6, "R": 1.0}
SOURCE_DURATION = "NDS 2018 §2.3.2, Table 2.3.2 (C_D of the shortest-duration load in the combination)"


def duration_factor(combination: Combination) -> tuple[float, str]:
    """C_D of a combination: that of its shortest-duration load (NDS 2018 §2.3.2), and that case."""
    best, case = 0.0, ""
    for c, f in combination.factors.items():
        if f == 0:
            continue
        cd = DURATION.get(c, 0.9)
        if cd > best:
            best, case = cd, c
    return (best or 0.9), case


SOURCE_TIME_EFFECT = "NDS 2018 Appendix N, Table N3 (time effect factor λ by load combination)"


def time_effect(combination: Combination) -> tuple[float, str]:
    """Time effect factor λ of an LRFD combination (NDS 2018 Table N3, from memory): 0.6 for dead
    load alone (1.4D); 1.0 when wind (or another ten-minute load) is in it; otherwise 0.8 —
    occupancy live, snow, roof live or rain — and the 0.7 of storage live load is not assumed
    (give the connector's λ for that case). Returns λ and the load it comes from."""
    present = [c for c, f in combination.factors.items() if f != 0]
    if "W" in present:
        return 1.0, "W"
    variable = [c for c in present if c != "D"]
    if not variable:
        return 0.6, "D"
    return 0.8, variable[0]
