"""Round-off in the solver's results: values that are zero but for floating-point noise.

A stiffness analysis returns −1.2 × 10⁻¹¹ lbf·in for the moment at a pinned end, and a
parallel-axis distance of a part centred on the neutral axis comes out as 1.8 × 10⁻¹⁵ in. Such a
value is noise relative to the quantities it was computed from; it must print as 0 and must never
be the value that governs (a "largest negative moment" of −10⁻¹¹ on a simple span is not a
result). The test is relative: ``|x| ≤ REL_TOL · scale`` with ``scale`` the magnitude of the
quantities around it (the largest of the diagram, the operands of the difference). Double
precision carries about 16 digits; a stiffness solution loses a few to the conditioning of the
matrix, so 10⁻⁹ leaves a wide margin on both sides (numerical analysis, common practice, no
source).
"""

from __future__ import annotations

import numpy as np

__all__ = ["REL_TOL", "negligible", "snap", "snap_together", "difference"]

#: relative size below which a value is round-off of the quantities around it
REL_TOL = 1e-9


def negligible(x: float, scale: float, rel_tol: float = REL_TOL) -> bool:
    """True when ``x`` is round-off relative to ``scale`` (a magnitude of the quantities ``x``
    was computed from, or that it is compared with); exactly 0 is negligible at any scale."""
    return abs(x) <= rel_tol * abs(scale)


def snap_together(*arrays: np.ndarray, rel_tol: float = REL_TOL) -> tuple[np.ndarray, ...]:
    """Copies of ``arrays`` with every entry that is round-off relative to the largest magnitude
    over all of them set to exactly 0 (e.g. the upper and lower moment envelopes together: on a
    simple span the lower one is noise of the upper one)."""
    scale = max((float(np.max(np.abs(a))) for a in arrays if np.size(a)), default=0.0)
    limit = rel_tol * scale
    return tuple(np.where(np.abs(a) <= limit, 0.0, a) for a in arrays)


def snap(a: np.ndarray, rel_tol: float = REL_TOL) -> np.ndarray:
    """A copy of ``a`` with entries that are round-off relative to its largest magnitude set to 0."""
    return snap_together(a, rel_tol=rel_tol)[0]


def difference(a: float, b: float, rel_tol: float = REL_TOL) -> float:
    """``a − b``, exactly 0 when it is round-off relative to the operands (a centroid distance
    of a part centred on the neutral axis, for instance)."""
    d = a - b
    return 0.0 if negligible(d, max(abs(a), abs(b)), rel_tol) else d
