"""Solver: validated model → results with derivation steps. Formats nothing.

``solve_job(job)`` (:mod:`.member`) runs, per member: section properties (:mod:`.section`),
design shear or the beam analysis (:mod:`.member_loads`), then per joint: Q, shear flow,
connector design value (:mod:`.connectors`) and spacing (:mod:`.spacing`).
"""

from .member import solve_job, solve_member
from .results import SolveError

__all__ = ["solve_job", "solve_member", "SolveError"]
