"""Layered panels (plywood) in a built-up section: effective area and moment of inertia from the
panel's published properties parallel to the span.

Only the plies whose grain runs along the span carry bending stress. The job gives, in
``[material.panel]``, the panel's effective thickness or its effective area A per foot of width
(for stress parallel to the strength axis), and optionally its flatwise I per foot of width, with
the table they come from (e.g. the APA Panel Design Specification's table of effective section
properties). The section then uses:

* a panel standing on edge (a web, bent in its own plane): A_eff = A_gross·f and
  I₀,eff = I₀·f, with f = A/(12 in · t) (or t_eff/t) — the parallel plies across the depth;
* a panel laid flat (a flange, bent flatwise): A_eff = A·b/12 in and I₀,eff = I·b/12 in
  (or I₀·f when no I is given, stated).
"""

from __future__ import annotations

from ..model import Part
from ..steps import StepLog
from ..units import Q_, Quantity
from .results import SolveError

__all__ = ["effective_panel", "panel_orientation"]

TOL = 0.02  # panel thickness may differ from the part's by 2 % (rounded fractions)


def panel_orientation(part: Part, panel: dict) -> str:
    """ "edge" when the part's horizontal width is the panel thickness, "flat" when its height is."""
    t = float(panel["thickness"].to("inch").magnitude)
    x0, y0, x1, y1 = part.shape.bbox
    if abs((x1 - x0) - t) <= TOL * t and (y1 - y0) > (x1 - x0):
        return "edge"
    if abs((y1 - y0) - t) <= TOL * t:
        return "flat"
    raise SolveError(
        f"part[{part.id}]",
        f"part {part.id} is {x1 - x0:.4g} in × {y1 - y0:.4g} in but its material {part.material.id} is a "
        f"panel {t:.4g} in thick: the part's width (on edge) or depth (flat) must be the panel thickness",
    )


def effective_panel(
    part: Part, panel: dict, A: Quantity, I0: Quantity, log: StepLog
) -> tuple[Quantity, Quantity]:
    """Effective area and own moment of inertia of a panel part, each as a step citing the
    panel's table (see the module docstring)."""
    src = f"{panel['table']} (stated in the job file)"
    f = panel["fraction"]
    how = panel_orientation(part, panel)
    t = panel["thickness"]
    if "A" in panel:
        A_ft = float(panel["A"].to("inch**2/ft").magnitude)
        f_sym, f_tpl, f_vals = (
            "f = A_panel / (12 in/ft · t)",
            "{A} in²/ft / (12 in/ft × {t})",
            {"A": A_ft, "t": t},
        )
    else:
        f_sym, f_tpl, f_vals = "f = t_eff / t", "{te} / {t}", {"te": panel["thickness_effective"], "t": t}
    log.add(
        "f_panel",
        f"Fraction of panel part {part.id} effective parallel to the span",
        f_sym,
        f_tpl,
        f_vals,
        f,
        source=src,
        note="only the plies with grain along the span carry bending stress",
        column="f",
    )
    if how == "edge":
        A_eff = log.add(
            "A_eff",
            f"Effective area of panel part {part.id} (on edge)",
            "A_eff = f·A",
            "{f} × {A}",
            {"f": f, "A": A},
            (f * A).to("inch**2"),
            source=src,
            column="A",
        )
        I_eff = log.add(
            "I0",
            f"Effective own moment of inertia of panel part {part.id} (bent in its plane)",
            "I₀,eff = f·t·h³/12",
            "{f} × {I}",
            {"f": f, "I": I0},
            (f * I0).to("inch**4"),
            source=src,
            column="I0",
        )
        return A_eff, I_eff
    x0, _, x1, _ = part.shape.bbox
    b = Q_(x1 - x0, "inch")
    A_eff = log.add(
        "A_eff",
        f"Effective area of panel part {part.id} (flat)",
        "A_eff = f·A",
        "{f} × {A}",
        {"f": f, "A": A},
        (f * A).to("inch**2"),
        source=src,
        column="A",
    )
    if "I" in panel:
        I_eff = log.add(
            "I0",
            f"Effective own moment of inertia of panel part {part.id} (flatwise)",
            "I₀,eff = I_panel·b / 12 in",
            "{I} × {b}",
            {"I": panel["I"], "b": b},
            (panel["I"] * b).to("inch**4"),
            source=src,
            column="I0",
        )
    else:
        I_eff = log.add(
            "I0",
            f"Effective own moment of inertia of panel part {part.id} (flatwise)",
            "I₀,eff = f·I₀",
            "{f} × {I}",
            {"f": f, "I": I0},
            (f * I0).to("inch**4"),
            source=src,
            note="no flatwise I in [material.panel]: the area fraction is used (approximate)",
            column="I0",
        )
    return A_eff, I_eff
