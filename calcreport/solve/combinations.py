"""Load combinations (ASCE 7-22 basic combinations) and span patterns for live-type loads.

The "or" alternatives of the standard are expanded into separate combinations. A combination is
kept only when the case that leads it (its principal load) is present in the job; companion cases
that are absent are dropped from it; combinations that end up with the same factors are kept once.
Cases the job names itself (not D, L, Lr, S, R, W) appear in no standard combination: a job that
uses them lists its own combinations.
"""

from __future__ import annotations

from dataclasses import dataclass
from itertools import combinations as _subsets

from ..keys.loads import LIVE_TYPE, STANDARD_CASES
from ..model import Combination

__all__ = [
    "STANDARD_CASES",
    "LIVE_TYPE",
    "standard_combinations",
    "span_patterns",
    "PATTERN_FULL_LIMIT",
    "SOURCE_LRFD",
    "SOURCE_ASD",
    "SOURCE_PATTERN",
    "Pattern",
]

SOURCE_LRFD = "ASCE 7-22 §2.3.1 (basic combinations, strength design)"
SOURCE_ASD = "ASCE 7-22 §2.4.1 (basic combinations, allowable stress design)"
SOURCE_PATTERN = "ASCE 7-22 §4.3.3 (partial loading)"
#: Full enumeration of span patterns up to this many segments (2^n − 1 patterns); beyond it the
#: reduced set of :func:`span_patterns` is used.
PATTERN_FULL_LIMIT = 6

_ROOF = ("Lr", "S", "R")

# (number, principal case, terms). A term is (factor, case-or-alternatives). Alternatives tuple
# entries are expanded; ``"ROOF"`` stands for (Lr or S or R). Factors from ASCE 7-22 §2.3.1
# equations 1-5 and §2.4.1 equations 1-7 (combinations with earthquake load E are not included;
# E is not a load case of this tool).
_Row = tuple[str, str, list[tuple[float | None, str]]]
_LRFD: list[_Row] = [
    ("1", "D", [(1.4, "D")]),
    ("2", "L", [(1.2, "D"), (1.6, "L"), (0.5, "ROOF")]),
    ("3", "ROOF", [(1.2, "D"), (1.6, "ROOF"), (None, "L|0.5W")]),
    ("4", "W", [(1.2, "D"), (1.0, "W"), (1.0, "L"), (0.5, "ROOF")]),
    ("5", "W", [(0.9, "D"), (1.0, "W")]),
]
_ASD: list[_Row] = [
    ("1", "D", [(1.0, "D")]),
    ("2", "L", [(1.0, "D"), (1.0, "L")]),
    ("3", "ROOF", [(1.0, "D"), (1.0, "ROOF")]),
    ("4", "L+ROOF", [(1.0, "D"), (0.75, "L"), (0.75, "ROOF")]),
    ("5", "W", [(1.0, "D"), (0.6, "W")]),
    ("6", "W", [(1.0, "D"), (0.75, "L"), (0.45, "W"), (0.75, "ROOF")]),  # 0.75(0.6W) = 0.45W
    ("7", "W", [(0.6, "D"), (0.6, "W")]),
]


def _expand(terms, roof: str, companion: str) -> dict[str, float]:
    out: dict[str, float] = {}
    for factor, case in terms:
        if case == "ROOF":
            case = roof
        if case == "L|0.5W":
            factor, case = (1.0, "L") if companion == "L" else (0.5, "W")
        out[case] = out.get(case, 0.0) + factor
    return out


def standard_combinations(method: str, cases: set[str] | list[str]) -> list[Combination]:
    """The basic combinations of ASCE 7-22 for ``method`` ("ASD" or "LRFD") and the cases present.

    Strength design, §2.3.1: 1.4D; 1.2D + 1.6L + 0.5(Lr or S or R);
    1.2D + 1.6(Lr or S or R) + (L or 0.5W); 1.2D + 1.0W + L + 0.5(Lr or S or R); 0.9D + 1.0W.
    Allowable stress design, §2.4.1: D; D + L; D + (Lr or S or R); D + 0.75L + 0.75(Lr or S or R);
    D + 0.6W; D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R); 0.6D + 0.6W.
    The factor 1.0 on L in §2.3.1 combinations 3 and 4 is kept (the standard's exception allowing
    0.5 for some occupancies is not applied: conservative). Names read like the standard's
    equation, e.g. ``"LRFD 3: 1.2D + 1.6S + L"``; each combination cites its equation.

    Example:
        >>> [c.name for c in standard_combinations("ASD", {"D", "L"})]
        ['ASD 1: D', 'ASD 2: D + L']
    """
    table, src, tag = (_LRFD, SOURCE_LRFD, "LRFD") if method.upper() == "LRFD" else (_ASD, SOURCE_ASD, "ASD")
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
    """A factor written as in the standard (``1.2D``, ``L``, ``0.45W``); factors are the fixed
    decimals of the tables above, so their shortest repr is exact."""
    return case if factor == 1.0 else f"{factor!r}{case}"


@dataclass(frozen=True)
class Pattern:
    """A set of loaded segments (indices into the member's segments) for live-type cases."""

    loaded: tuple[int, ...]
    name: str


def _pattern_name(loaded: tuple[int, ...]) -> str:
    """Words for a pattern: "live load on span 2 only", "live load on spans 1, 3 only"."""
    spans = ", ".join(str(i + 1) for i in loaded)
    return f"live load on span{'s' if len(loaded) > 1 else ''} {spans} only"


def span_patterns(n_segments: int) -> list[Pattern]:
    """Patterns of loaded segments for live-type loads (ASCE 7-22 §4.3.3 partial loading).

    Up to :data:`PATTERN_FULL_LIMIT` segments every non-empty subset is used (2^n − 1 patterns,
    the first being all segments loaded). Beyond that a reduced set that contains the patterns
    giving the extreme moments and shears on continuous beams (common practice, no source): all
    loaded, each segment alone, alternate segments (odd, even), and each adjacent pair together
    with the alternate segments beyond it.
    """
    full = tuple(range(n_segments))
    if n_segments <= 1:
        return [Pattern(full, "all")]
    subsets: list[tuple[int, ...]] = [full]
    if n_segments <= PATTERN_FULL_LIMIT:
        for k in range(n_segments - 1, 0, -1):
            subsets.extend(_subsets(full, k))
    else:
        subsets.extend((i,) for i in full)
        subsets.append(full[0::2])
        subsets.append(full[1::2])
        for i in range(n_segments - 1):
            left = list(range(i - 2, -1, -2))
            right = list(range(i + 3, n_segments, 2))
            subsets.append(tuple(sorted(left + [i, i + 1] + right)))
    out: list[Pattern] = []
    seen: set[tuple[int, ...]] = set()
    for s in subsets:
        if s and s not in seen:
            seen.add(s)
            out.append(Pattern(s, "all" if s == full else _pattern_name(s)))
    return out


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
