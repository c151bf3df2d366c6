"""Catalogues for wood dowel-type fasteners (NDS 2018) as Python data.

Every table here is transcribed **from memory** of the NDS 2018 edition and its appendix L
(fastener dimensions, which follow ASTM F1667 for nails and ANSI/ASME B18.2.1 / B18.6.1 for lag
and wood screws). The values are the usual published ones; an engineer sealing a report should
check the edition the jurisdiction adopts. Dimensions are in inches, strengths in psi.
"""

from __future__ import annotations

import re
from dataclasses import dataclass

__all__ = [
    "NailSize",
    "NAILS",
    "nail",
    "nail_names",
    "ScrewSize",
    "WOOD_SCREWS",
    "LAG_SCREWS",
    "SPECIES_G",
    "species_g",
    "fyb_nail",
    "fyb_wood_screw",
    "fyb_lag_screw",
    "FYB_BOLT",
    "bending_yield",
    "CATALOG_SOURCE",
]

CATALOG_SOURCE = "NDS 2018 Appendix L (Tables L1-L4)"  # transcription: docs/sources.md


@dataclass(frozen=True)
class NailSize:
    """A nail or spike: pennyweight, type, shank diameter D and length L (in)."""

    name: str  # "16d common"
    penny: int
    kind: str  # "common", "box", "sinker", "spike"
    D: float
    L: float


# (pennyweight, D, L) by type. NDS 2018 Table L4 (ASTM F1667), from memory.
_COMMON = [
    (6, 0.113, 2.0),
    (8, 0.131, 2.5),
    (10, 0.148, 3.0),
    (12, 0.148, 3.25),
    (16, 0.162, 3.5),
    (20, 0.192, 4.0),
    (30, 0.207, 4.5),
    (40, 0.225, 5.0),
    (50, 0.244, 5.5),
    (60, 0.263, 6.0),
]
_BOX = [
    (6, 0.099, 2.0),
    (8, 0.113, 2.5),
    (10, 0.128, 3.0),
    (12, 0.128, 3.25),
    (16, 0.135, 3.5),
    (20, 0.148, 4.0),
    (30, 0.148, 4.5),
    (40, 0.162, 5.0),
]
_SINKER = [
    (6, 0.092, 1.875),
    (8, 0.113, 2.375),
    (10, 0.120, 2.875),
    (12, 0.135, 3.125),
    (16, 0.148, 3.25),
    (20, 0.177, 3.75),
    (30, 0.192, 4.25),
    (40, 0.207, 4.75),
    (60, 0.244, 5.75),
]
_SPIKE = [
    (10, 0.192, 3.0),
    (12, 0.192, 3.25),
    (16, 0.207, 3.5),
    (20, 0.225, 4.0),
    (30, 0.244, 4.5),
    (40, 0.263, 5.0),
    (50, 0.283, 5.5),
    (60, 0.283, 6.0),
]

NAILS: dict[str, NailSize] = {}
for _kind, _rows in (("common", _COMMON), ("box", _BOX), ("sinker", _SINKER), ("spike", _SPIKE)):
    for _p, _d, _l in _rows:
        _n = f"{_p}d {_kind}"
        NAILS[_n] = NailSize(_n, _p, _kind, _d, _l)

# Matched against the text with its whitespace runs folded to one space (see ``nail``): every
# optional space is one character, so the match is linear (runs of ``\s*`` side by side would
# backtrack cubically on a long run of spaces).
_NAIL_RE = re.compile(r"^(\d+) ?d ?(common|box|sinker|spike)? ?(?:nail|wire nail)?s?$", re.I)


def nail_names() -> list[str]:
    """All catalogue names, e.g. ``"16d common"``."""
    return list(NAILS)


def nail(size: str) -> NailSize | None:
    """Look up ``"16d common"`` (also ``"16d"`` = common, ``"16D Common nail"``); None if unknown."""
    m = _NAIL_RE.match(" ".join(size.split())) if len(size) <= 200 else None
    if not m:
        return None
    kind = (m.group(2) or "common").lower()
    return NAILS.get(f"{int(m.group(1))}d {kind}")


@dataclass(frozen=True)
class ScrewSize:
    """A screw: name, nominal (shank) diameter D and root diameter Dr (in)."""

    name: str
    D: float
    Dr: float


# Wood screws by gauge: D and root diameter Dr. NDS 2018 Table L3, from memory.
WOOD_SCREWS: dict[str, ScrewSize] = {
    f"{g}g": ScrewSize(f"{g}g", d, dr)
    for g, d, dr in [
        (6, 0.138, 0.113),
        (7, 0.151, 0.122),
        (8, 0.164, 0.131),
        (9, 0.177, 0.142),
        (10, 0.190, 0.152),
        (12, 0.216, 0.171),
        (14, 0.242, 0.196),
        (16, 0.268, 0.209),
        (18, 0.294, 0.232),
        (20, 0.320, 0.255),
        (24, 0.372, 0.298),
    ]
}

# Lag screws: D and root diameter Dr. NDS 2018 Table L2, from memory.
LAG_SCREWS: dict[str, ScrewSize] = {
    n: ScrewSize(n, d, dr)
    for n, d, dr in [
        ("1/4", 0.250, 0.173),
        ("5/16", 0.3125, 0.227),
        ("3/8", 0.375, 0.265),
        ("7/16", 0.4375, 0.328),
        ("1/2", 0.500, 0.371),
        ("5/8", 0.625, 0.471),
        ("3/4", 0.750, 0.579),
        ("7/8", 0.875, 0.683),
        ("1", 1.000, 0.780),
    ]
}

#: Specific gravity G of species combinations. NDS 2018 Table 12.3.3A, from memory.
SPECIES_G: dict[str, float] = {
    "Aspen": 0.39,
    "Balsam Fir": 0.36,
    "Beech-Birch-Hickory": 0.71,
    "Coast Sitka Spruce": 0.39,
    "Cottonwood": 0.41,
    "Douglas Fir-Larch": 0.50,
    "Douglas Fir-Larch (North)": 0.49,
    "Douglas Fir-South": 0.46,
    "Eastern Hemlock-Balsam Fir": 0.36,
    "Eastern Hemlock-Tamarack": 0.41,
    "Eastern Softwoods": 0.36,
    "Eastern Spruce": 0.41,
    "Eastern White Pine": 0.36,
    "Hem-Fir": 0.43,
    "Hem-Fir (North)": 0.46,
    "Mixed Maple": 0.55,
    "Mixed Oak": 0.68,
    "Mixed Southern Pine": 0.51,
    "Northern Pine": 0.42,
    "Northern Red Oak": 0.68,
    "Northern Species": 0.35,
    "Northern White Cedar": 0.31,
    "Ponderosa Pine": 0.43,
    "Red Maple": 0.58,
    "Red Oak": 0.67,
    "Red Pine": 0.44,
    "Redwood, close grain": 0.44,
    "Redwood, open grain": 0.37,
    "Sitka Spruce": 0.43,
    "Southern Pine": 0.55,
    "Spruce-Pine-Fir": 0.42,
    "Spruce-Pine-Fir (South)": 0.36,
    "Western Cedars": 0.36,
    "Western Woods": 0.36,
    "White Oak": 0.73,
    "Yellow Poplar": 0.43,
}
_ALIASES = {
    "df-l": "Douglas Fir-Larch",
    "dfl": "Douglas Fir-Larch",
    "sp": "Southern Pine",
    "syp": "Southern Pine",
    "hf": "Hem-Fir",
    "h-f": "Hem-Fir",
    "spf": "Spruce-Pine-Fir",
    "s-p-f": "Spruce-Pine-Fir",
}


def _norm(s: str) -> str:
    return re.sub(r"[^a-z0-9()]+", " ", s.lower()).strip()


def species_g(name: str) -> float | None:
    """Specific gravity for a species combination name (case and punctuation tolerant)."""
    key = _ALIASES.get(name.strip().lower())
    if key:
        return SPECIES_G[key]
    n = _norm(name)
    for k, g in SPECIES_G.items():
        if _norm(k) == n:
            return g
    return None


def fyb_nail(D: float) -> float:
    """Bending yield strength of nails and spikes by diameter (psi).

    Source: NDS 2018 Table 12N–12R footnotes (ranges of D), from memory:
    100,000 psi for D ≤ 0.142 in; 90,000 for D ≤ 0.177; 80,000 for D ≤ 0.236;
    70,000 for D ≤ 0.273; 60,000 for D ≤ 0.344; 45,000 for D ≤ 0.375 in.
    """
    for limit, f in (
        (0.142, 100_000.0),
        (0.177, 90_000.0),
        (0.236, 80_000.0),
        (0.273, 70_000.0),
        (0.344, 60_000.0),
        (0.375, 45_000.0),
    ):
        if D <= limit + 1e-9:
            return f
    return 45_000.0


def fyb_wood_screw(D: float) -> float:
    """Bending yield strength of wood screws (psi), by nominal diameter.

    Source: NDS 2018 Table 12L footnote, from memory: 100,000 psi (6g, D=0.138), 90,000 (7g-8g,
    D ≤ 0.164), 80,000 (9g-12g, D ≤ 0.216), 70,000 (14g-16g, D ≤ 0.268), 60,000 (18g-20g),
    45,000 psi (24g).
    """
    for limit, f in (
        (0.138, 100_000.0),
        (0.164, 90_000.0),
        (0.216, 80_000.0),
        (0.268, 70_000.0),
        (0.320, 60_000.0),
    ):
        if D <= limit + 1e-9:
            return f
    return 45_000.0


def fyb_lag_screw(D: float) -> float:
    """Bending yield strength of lag screws (psi): 70,000 (D = 1/4 in), 60,000 (5/16 in),
    45,000 psi (D ≥ 3/8 in). Source: NDS 2018 Tables 12J/12K footnote, from memory."""
    if D <= 0.25 + 1e-9:
        return 70_000.0
    if D <= 0.3125 + 1e-9:
        return 60_000.0
    return 45_000.0


#: Bending yield strength assumed for bolts. Source: NDS 2018 Tables 12A-12I footnote
#: (Fyb = 45,000 psi), from memory.
FYB_BOLT = 45_000.0

#: Fastener kind → default Fyb by diameter D (in) and the clause the step cites.
_FYB_DEFAULTS = {
    "nail": (fyb_nail, "NDS 2018 Tables 12N-12R footnote"),
    "wood_screw": (fyb_wood_screw, "NDS 2018 Table 12L footnote"),
    "lag_screw": (fyb_lag_screw, "NDS 2018 Tables 12J/12K footnote"),
    "wood_bolt": (lambda D: FYB_BOLT, "NDS 2018 Tables 12A-12I footnote"),
}


def bending_yield(kind: str, D: float, given) -> tuple[float, str]:
    """Bending yield strength Fyb (psi) of a dowel fastener and where it comes from: the value the
    job gives (a quantity, or None), else the NDS 2018 default for ``kind`` by diameter ``D`` (in)."""
    if given is not None:
        return float(given.to("psi").magnitude), "given for this connector"
    look_up, source = _FYB_DEFAULTS[kind]
    return look_up(D), source
