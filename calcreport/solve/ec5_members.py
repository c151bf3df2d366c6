"""Member checks under ``settings.method = "EC5"``: the NDS 2018 / AISC 360-16 member checks do not
run (their factors belong to another standard); what a checker expects of the member is listed as
not checked with the EN clause that would govern it. EN 1995-1-1 §6 stress checks are not
implemented in this version; deflection (mechanics, with EN 1990 load sets) still runs.
"""

from __future__ import annotations

from ..model import Member
from .results import Unchecked
from .scope import expectations

__all__ = ["ec5_unchecked", "EC5_CLAUSES"]

_EC5 = "EN 1995-1-1:2004"
#: Expectation name (its first segment) → the EN clause that governs it.
EC5_CLAUSES = {
    "bending": f"{_EC5} §6.1.6 (bending), §6.3.3 (lateral torsional stability)",
    "shear": f"{_EC5} §6.1.7 (shear)",
    "bearing": f"{_EC5} §6.1.5 (compression perpendicular to the grain)",
    "stability": f"{_EC5} §6.3.3 (lateral torsional stability, k_crit)",
    "panel_shear": f"{_EC5} §9.1.1 (glued thin-webbed beams: web shear)",
    "panel_stress": f"{_EC5} §9.1.1 (glued thin-webbed beams: web stresses)",
    "flange_axial": f"{_EC5} §9.1.1 (thin-webbed beams: flange stresses)",
    "deflection": f"EN 1990:2002 A1.4, {_EC5} §7.2",
}
REASON = 'not implemented under method = "EC5" in this version; check by hand'
STEEL = "EN 1993-1-1 / EN 1993-1-5 (steel members)"


def ec5_unchecked(member: Member, has_moment: bool) -> tuple[Unchecked, ...]:
    """One :class:`Unchecked` per expectation of ``member`` (same key, so it replaces the NDS /
    AISC line), with the EN clause; deflection keeps its own reason (it runs when limits apply)."""
    out = []
    for e in expectations(member, has_moment):
        head = e.name.split(".", 1)[0]
        if head == "deflection":
            out.append(Unchecked(f"member[{member.id}].{e.name}", e.label, EC5_CLAUSES[head], e.reason))
            continue
        clause = EC5_CLAUSES.get(head, STEEL if "AISC" in e.clause else f"{_EC5} §6")
        out.append(Unchecked(f"member[{member.id}].{e.name}", e.label, clause, REASON))
    return tuple(out)
