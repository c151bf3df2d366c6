"""Load case names and load standards the tool knows (ASCE 7 §2.3.1 / §2.4.1 symbols)."""

from __future__ import annotations

__all__ = ["STANDARD_CASES", "LIVE_TYPE", "LOAD_STANDARDS", "DEFAULT_STANDARD"]

#: Dead, live, roof live, snow, rain, wind (ASCE 7 §2.3.1 / §2.4.1 symbols).
STANDARD_CASES = ("D", "L", "Lr", "S", "R", "W")
#: Variable gravity loads placed for their worst effect (partial loading, moving loads).
LIVE_TYPE = ("L", "Lr", "S", "R")
#: Editions of ASCE 7 whose basic combinations are built in (``settings.load_standard``).
LOAD_STANDARDS = ("ASCE 7-22", "ASCE 7-16")
DEFAULT_STANDARD = "ASCE 7-22"
