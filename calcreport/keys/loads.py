"""Load case names the tool knows (ASCE 7-22 §2.3.1 / §2.4.1 symbols)."""

from __future__ import annotations

__all__ = ["STANDARD_CASES", "LIVE_TYPE"]

#: Dead, live, roof live, snow, rain, wind (ASCE 7-22 §2.3.1 / §2.4.1 symbols).
STANDARD_CASES = ("D", "L", "Lr", "S", "R", "W")
#: Variable gravity loads whose partial (span by span) application is checked.
LIVE_TYPE = ("L", "Lr", "S", "R")
