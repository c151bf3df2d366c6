"""EN 1995-1-1:2004 material factors: k_mod by service class and load-duration class (Table 3.1),
γ_M by product (Table 2.3), and the k_mod of a load combination (§3.1.3(2)).

Table values (checked against a reproduction of EN 1995-1-1 Table 3.1 in a published design manual;
Table 2.3 from memory — see docs/sources.md). Solid timber (EN 14081-1), glued laminated timber
(EN 14080), LVL (EN 14374, EN 14279) and plywood (EN 636: Part 1, 2 or 3 in service class 1; Part 2
or 3 in class 2; Part 3 in class 3) have the same k_mod values in Table 3.1; other panels (OSB,
particleboard, fibreboard) are not covered by this tool.
"""

from __future__ import annotations

import math

from ..keys.loads import DURATION_CLASSES, PERMANENT_CASE
from ..model import Combination, LoadCaseFactors

__all__ = [
    "K_MOD",
    "GAMMA_M",
    "GAMMA_M_CONNECTIONS",
    "k_mod",
    "k_mod_joint",
    "gamma_m",
    "product_of",
    "combination_duration",
    "SOURCE_KMOD",
    "SOURCE_GAMMA_M",
    "SOURCE_KMOD_COMBINATION",
]

SOURCE_KMOD = "EN 1995-1-1:2004 §3.1.3, Table 3.1"
SOURCE_KMOD_COMBINATION = "EN 1995-1-1:2004 §3.1.3(2) (k_mod of the shortest-duration action)"
SOURCE_GAMMA_M = "EN 1995-1-1:2004 §2.4.1, Table 2.3"

#: EN 1995-1-1 Table 3.1, solid timber, glulam, LVL and plywood: service class → k_mod in the
#: order of :data:`DURATION_CLASSES` (permanent, long, medium, short, instantaneous).
K_MOD: dict[int, tuple[float, ...]] = {
    1: (0.60, 0.70, 0.80, 0.90, 1.10),
    2: (0.60, 0.70, 0.80, 0.90, 1.10),
    3: (0.50, 0.55, 0.65, 0.70, 0.90),
}
#: EN 1995-1-1 Table 2.3, fundamental combinations (from memory; national annexes may differ).
GAMMA_M = {"solid": 1.3, "glulam": 1.25, "LVL": 1.2, "plywood": 1.2}
GAMMA_M_CONNECTIONS = 1.3


def k_mod(duration: str, service_class: int) -> float:
    """k_mod of EN 1995-1-1 Table 3.1 for solid timber, glulam, LVL and plywood.

    >>> k_mod("medium", 1), k_mod("short", 3)
    (0.8, 0.7)
    """
    if service_class not in K_MOD:
        raise ValueError(f"service class {service_class!r} is not 1, 2 or 3")
    return K_MOD[service_class][DURATION_CLASSES.index(duration)]


def k_mod_joint(k1: float, k2: float) -> float:
    """k_mod of a connection between two members of different k_mod: √(k_mod,1·k_mod,2).
    Source: EN 1995-1-1:2004 §2.3.2.1(4), eq. 2.6."""
    return math.sqrt(k1 * k2)


def product_of(family: str, given: str = "") -> str:
    """The Table 3.1 / 2.3 product of a material: the one given, else by family (wood: solid timber,
    glulam, plywood); "" for a material that is not timber."""
    if given:
        return given
    return {"wood": "solid", "glulam": "glulam", "plywood": "plywood"}.get(family, "")


def gamma_m(product: str, given: float | None = None) -> tuple[float, str]:
    """γ_M of a product (EN 1995-1-1 Table 2.3) or the national value given; and its source."""
    if given is not None:
        return given, "national value stated in the job file"
    return GAMMA_M[product], SOURCE_GAMMA_M


def combination_duration(combination: Combination, cases: dict[str, LoadCaseFactors]) -> tuple[str, str]:
    """Load-duration class of a combination: that of its shortest-duration action (EN 1995-1-1
    §3.1.3(2)), and that case. The permanent case ``D`` is permanent unless described otherwise; a
    case with no ``[[settings.load_case]]`` raises KeyError (the reader makes the solver refuse it)."""
    best, case = -1, ""
    for c, f in combination.factors.items():
        if f == 0:
            continue
        if c in cases:
            d = cases[c].duration
        elif c == PERMANENT_CASE:
            d = "permanent"
        else:
            raise KeyError(c)
        i = DURATION_CLASSES.index(d)
        if i > best:
            best, case = i, c
    return DURATION_CLASSES[max(best, 0)], case
