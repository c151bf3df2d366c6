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

# --- EN 1990 / EN 1995-1-1 (settings.method = "EC5"); owner: ec5 -------------------------------
#: Load-duration classes of EN 1995-1-1 §2.3.1.2, Table 2.1, shortest last.
DURATION_CLASSES = ("permanent", "long", "medium", "short", "instantaneous")
#: Timber products whose k_mod (EN 1995-1-1 Table 3.1) and γ_M (Table 2.3) the tool knows.
TIMBER_PRODUCTS = ("solid", "glulam", "LVL", "plywood")
#: The permanent case of the built-in EN 1990 combinations (every other case is variable).
PERMANENT_CASE = "D"
