"""The records of the analysis along the member (:mod:`calcreport.solve.beam`): segments,
reactions, diagrams, the envelope and the beam result with its combination of the placed variable
cases (:func:`combine`), and the input error of the analysis. Split from ``beam.py``; the names
are re-exported there."""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from ..model import Support
from ..units import Q_, Quantity

__all__ = ["BeamInputError", "Segment", "Reaction", "Diagram", "Envelope", "BeamResult", "combine"]

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
    V_hi: Quantity | None = None  # combinations: largest / smallest V and M with variable cases
    V_lo: Quantity | None = None  # in their worst placement
    M_hi: Quantity | None = None
    M_lo: Quantity | None = None


@dataclass(frozen=True)
class Envelope:
    """Extremes over all combinations (variable loads in their worst placement), with the governing
    one at each x."""

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
    combinations: tuple[Diagram, ...]  # V, M as written; V_hi … M_lo with worst placement
    envelope: Envelope
    live_cases: tuple[str, ...]  # variable cases placed for their worst effect
    steps: tuple
    EI: Quantity | None = None
    _basis: dict = field(default_factory=dict, repr=False, compare=False)

    def shear_abs_weighted(self, weight: dict[str, float]) -> tuple[Quantity, tuple[str, ...]]:
        """max over combinations c of |V_c(x)|·weight[c] at each x (variable cases in their worst
        placement), and the combination that governs there. Used for load-duration-normalised
        demand."""
        b = self._basis
        if not b or not b["names"]:
            return self.envelope.V_abs, self.envelope.V_abs_by
        HV, LV = b["HV"], b["LV"]
        w = np.array([weight.get(nm, 1.0) for nm in b["names"]])
        vals = np.maximum(np.abs(HV), np.abs(LV)) * w[None, :]
        k = vals.argmax(1)
        r = np.arange(len(k))
        use_hi = np.abs(HV[r, k]) >= np.abs(LV[r, k])
        return Q_(vals.max(1), _LBF), tuple(
            b["label"]("V", int(j), int(s), bool(u)) for s, (j, u) in enumerate(zip(k, use_hi))
        )

    def deflection_max(self, factors: dict[str, float], segment: int) -> Quantity | None:
        """Largest |deflection| within ``segment`` for ``factors`` (service loads), with the
        variable cases in their worst placement; ``None`` without EI."""
        b = self._basis
        if self.EI is None or not b:
            return None
        mask = b["seg_mask"][segment]
        hi, lo = combine(b, factors, "v")
        d = np.maximum(np.abs(hi[mask]), np.abs(lo[mask])) / b["EI"]
        return Q_(float(d.max()) if d.size else 0.0, _IN)


def combine(b: dict, factors: dict[str, float], q: str) -> tuple[np.ndarray, np.ndarray]:
    """Largest and smallest value of response ``q`` for ``factors``: fixed cases as written, each
    variable case at its extreme (the largest where its factor is positive, else the smallest)."""
    hi = np.zeros(b["size"][q])
    lo = np.zeros(b["size"][q])
    for c, f in factors.items():
        if f == 0:
            continue
        if c in b["place"]:
            ex = b["place"][c]
            up, dn = (ex.hi[q], ex.lo[q]) if f > 0 else (ex.lo[q], ex.hi[q])
            hi = hi + f * up
            lo = lo + f * dn
        elif c in b["fixed"]:
            hi = hi + f * b["fixed"][c][q]
            lo = lo + f * b["fixed"][c][q]
    return hi, lo
