"""Member-check inputs: the optional ``[member.design]`` table, and the wood and panel keys of a
material.

``[member.design]`` keys (all optional; a check that needs one that is missing is listed as not
checked, or runs with a stated conservative default)::

    [member.design]
    unbraced_length = "76 in"       # top flange, when in compression: Lb (steel, AISC 360-16 F) or
                                    # ℓe (wood flanges, NDS 2018 §3.7); default the span (stated)
    continuous_bracing = true       # the top flange is braced along its length (Lb = 0)
    bottom_unbraced_length = "48 in"   # the same for the bottom flange (negative moment)
    bottom_continuous_bracing = true
    Cb = 1.0                        # lateral-torsional buckling modification factor (default 1.0)
    stiffener_spacing = "60 in"     # transverse web stiffeners, clear spacing a (AISC 360-16 G2)
    bearing_length = "6 in"         # length of bearing lb at each support (AISC 360-16 J10.2/J10.3)
    bearing_stiffeners = true       # bearing stiffeners at the supports (J10 checks then do not apply)
    cover_plate_end_weld = true     # cover plates welded across their ends (AISC 360-16 F13.3)
    Cr = 1.15                       # repetitive member factor of wood bending (NDS 2018 §4.3.9)
    construction = "unshored"       # composite: dead load on the steel alone ("shored": on the composite)
    slip = true                     # γ-method (EN 1995-1-1 Annex B) beside the rigid V·Q/I results
    slip_moduli = "auto"            # "EN 1995-1-1" (Table 7.1) or "NDS 2018" (§11.3.6); auto by units

Material keys read here: ``Ft``, ``Fc`` (wood tension and compression parallel to grain),
``Emin`` (wood, for column stability), and for plywood the table ``[material.panel]`` with its
published properties parallel to the span (see :func:`read_panel`).
"""

from __future__ import annotations

from typing import Any

from ..keys import job as decl
from .reader import Table

__all__ = ["read_design", "read_wood_keys", "read_panel", "DESIGN_KEYS", "PANEL_KEYS"]

DESIGN_KEYS = decl.names(decl.DESIGN)
PANEL_KEYS = decl.names(decl.PANEL)


def read_design(t: Table) -> dict[str, Any]:
    """The member's ``design`` table as typed values (empty when absent)."""
    dt = t.table("design")
    if dt is None:
        return {}
    dt.expect(DESIGN_KEYS)
    out: dict[str, Any] = {}
    for pre in ("", "bottom_"):
        q = dt.quantity(f"{pre}unbraced_length", "length")
        if q is not None:
            out[f"{pre}unbraced_length"] = q
        if dt.has(f"{pre}continuous_bracing"):
            out[f"{pre}continuous_bracing"] = dt.boolean(f"{pre}continuous_bracing")
        if out.get(f"{pre}continuous_bracing") and f"{pre}unbraced_length" in out:
            raise dt.error(
                f"{pre}unbraced_length",
                f"give either {pre}unbraced_length or {pre}continuous_bracing = true, not both",
            )
    how = dt.choice("construction", ("shored", "unshored"))
    if how is not None:
        out["construction"] = how
    cr = dt.number("Cr", None, minimum=1.0, maximum=1.15)
    if cr is not None:
        out["Cr"] = cr
    cb = dt.number("Cb", None, minimum=1.0, maximum=3.0)
    if cb is not None:
        out["Cb"] = cb
    for key in ("stiffener_spacing", "bearing_length"):
        q = dt.quantity(key, "length")
        if q is not None:
            out[key] = q
    for flag in ("bearing_stiffeners", "cover_plate_end_weld", "slip"):
        if dt.has(flag):
            out[flag] = dt.boolean(flag)
    moduli = dt.choice("slip_moduli", ("auto", "EN 1995-1-1", "NDS 2018"))
    if moduli is not None:
        if not out.get("slip"):
            dt.warn("slip_moduli", "has no effect without slip = true")
        out["slip_moduli"] = moduli
    dt.done()
    return out


def read_wood_keys(t: Table) -> dict[str, Any]:
    """Ft, Fc and Emin of a material, when given (stresses), and its bending size factor CF."""
    out: dict[str, Any] = {k: t.quantity(k, "stress") for k in ("Ft", "Fc", "Emin", "Fc_perp")}
    out["CF"] = t.number("CF", None, minimum=0.5, maximum=1.5)
    out["rho_mean"] = t.quantity("rho_mean", "mass_density")  # γ-method: K_ser (EN 1995-1-1 Table 7.1)
    return out


def read_panel(t: Table, family: str) -> dict[str, Any] | None:
    """``[material.panel]``: a layered panel's published properties parallel to the span, per foot
    of panel width, and the table they come from.

    * ``table`` (required) — where the values come from, e.g. "APA Panel Design Specification (2012),
      Table 4" — printed beside every step that uses them;
    * ``thickness`` (required) — the panel's nominal thickness as placed in the section;
    * either ``thickness_effective`` — the thickness that gives the effective area and I, or
      ``A`` (in²/ft), and optionally ``I`` (in⁴/ft, flatwise);
    * ``Fv_tv`` — panel shear through the thickness (force per length of panel, e.g. "190 lbf/in");
    * ``Gv_tv`` — panel shear rigidity through the thickness (force per length, for shear deflection);
    * ``Ft_A``, ``Fc_A`` — axial tension and compression capacity (force per foot of width).
    """
    pt = t.table("panel")
    if pt is None:
        return None
    if family != "plywood":
        raise pt.error(None, f'a [material.panel] table needs family = "plywood", got {family!r}')
    pt.expect(PANEL_KEYS)
    out: dict[str, Any] = {
        "table": pt.text("table", required=True),
        "thickness": pt.quantity("thickness", "length", required=True),
    }
    teff = pt.quantity("thickness_effective", "length")
    A = pt.quantity("A", "length")  # in²/ft has the dimension of a length
    if (teff is None) == (A is None):
        raise pt.error(
            "A" if A is not None else None,
            "give one of thickness_effective or A (effective area per foot of width)",
        )
    if teff is not None:
        out["fraction"] = float((teff / out["thickness"]).to("").magnitude)
        out["thickness_effective"] = teff
    else:
        out["A"] = A
        out["fraction"] = float((A / out["thickness"]).to("").magnitude)
    if not 0.0 < out["fraction"] <= 1.0 + 1e-9:
        raise pt.error(
            "thickness_effective" if teff is not None else "A",
            "expected effective properties no larger than the gross panel's (fraction 0 to 1)",
        )
    for key, dim in (("I", "volume"),):  # in⁴/ft
        q = pt.quantity(key, dim)
        if q is not None:
            out[key] = q
    for key in ("Fv_tv", "Gv_tv", "Ft_A", "Fc_A"):
        q = pt.quantity(key, "line_load")
        if q is not None:
            out[key] = q
    pt.done()
    return out
