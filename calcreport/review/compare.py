"""Value comparison shared by the revision diff (:mod:`.diff`) and the schedule comparison
(:mod:`.diff_schedule`): the same value within a relative tolerance. Nothing is computed here
beyond lining values up and comparing them.
"""

from __future__ import annotations

import math
from typing import Any

from ..units import Quantity

__all__ = ["same_value", "RESULT_RTOL"]

#: Results agree when they differ by less than this fraction (JSON keeps 6 significant figures).
RESULT_RTOL = 1e-6


def _close(a: float, b: float, rtol: float) -> bool:
    return math.isclose(a, b, rel_tol=rtol, abs_tol=1e-12)


def same_value(a: Any, b: Any, rtol: float = RESULT_RTOL) -> bool:
    """True when ``a`` and ``b`` are the same value within ``rtol``.

    Quantities of one dimension are compared in base units (so 12 in equals 1 ft); numbers with a
    relative tolerance; everything else with ``==``.

    Example:
        >>> from calcreport.units import Q_
        >>> same_value(Q_(12, "inch"), Q_(1, "ft"))
        True
    """
    if isinstance(a, Quantity) or isinstance(b, Quantity):
        if not (isinstance(a, Quantity) and isinstance(b, Quantity)):
            return False
        if a.dimensionality != b.dimensionality:
            return False
        ma, mb = a.to_base_units().magnitude, b.to_base_units().magnitude
        if getattr(ma, "shape", ()) or getattr(mb, "shape", ()):
            import numpy as np

            ma, mb = np.asarray(ma, dtype=float), np.asarray(mb, dtype=float)
            return ma.shape == mb.shape and bool(np.allclose(ma, mb, rtol=rtol, atol=1e-12))
        return _close(float(ma), float(mb), rtol)
    if getattr(a, "shape", ()) or getattr(b, "shape", ()):  # plain numpy arrays (results along the member)
        import numpy as np

        try:
            xa, xb = np.asarray(a, dtype=float), np.asarray(b, dtype=float)
        except (TypeError, ValueError):
            return bool(np.array_equal(np.asarray(a), np.asarray(b)))
        return xa.shape == xb.shape and bool(np.allclose(xa, xb, rtol=rtol, atol=1e-12))
    if isinstance(a, bool) or isinstance(b, bool):
        return type(a) is type(b) and a == b
    if isinstance(a, (int, float)) and isinstance(b, (int, float)):
        return _close(float(a), float(b), rtol)
    if isinstance(a, (list, tuple)) and isinstance(b, (list, tuple)):
        return len(a) == len(b) and all(same_value(x, y, rtol) for x, y in zip(a, b))
    if isinstance(a, dict) and isinstance(b, dict):
        return a.keys() == b.keys() and all(same_value(a[k], b[k], rtol) for k in a)
    return a == b
