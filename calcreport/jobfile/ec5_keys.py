"""The EN 1995-1-1 / EN 1990 keys (``settings.method = "EC5"``): reading them, and refusing the
keys that have no effect under the method the job uses (docs/job-format.md, "Keys without effect").

* ``[settings]``: ``service_class`` (required under EC5), ``gamma_M_connections``, ``duration``, and
  ``[[settings.load_case]]`` tables (a case's duration class and ψ factors);
* ``[[material]]``: ``rho_k``, ``timber_product``, ``gamma_M``;
* connector keys of the wood dowel fasteners: the EC5 ones (``fu``, ``F_ax_Rk``, ``predrilled``,
  ``nail_shank``, ``dowel``) are refused in an ASD or LRFD job, the NDS-only ones (``CD``,
  ``G_side``, ``Fyb``, ``species``, ``wet_service`` …) in an EC5 job.
"""

from __future__ import annotations

from typing import Any

from ..keys import job as decl
from ..keys.connectors import EC5_KEYS, NDS_ONLY_KEYS
from ..keys.loads import DURATION_CLASSES, PERMANENT_CASE, TIMBER_PRODUCTS
from ..model import LoadCaseFactors, Member, Settings
from .reader import Table

__all__ = [
    "read_ec5_settings",
    "read_ec5_material",
    "ec5_connector_keys",
    "slip_ec5",
    "NDS_ONLY_KEYS",
    "EC5_REFUSED_KINDS",
    "unused_ec5_settings",
    "ec5_member_keys",
    "NDS_MATERIAL_KEYS",
]

#: Connector types with no EN 1995-1-1 / EN 1993 route in this tool: refused under EC5.
EC5_REFUSED_KINDS = {
    "lag_screw": 'use type = "wood_screw" (EN 1995-1-1 §8.7 covers screws of every diameter)',
    "steel_bolt": "bolts in steel plates are designed to EN 1993-1-8, which this tool does not implement",
    "fillet_weld": "fillet welds are designed to EN 1993-1-8, which this tool does not implement",
    "stud": "headed studs are designed to EN 1994-1-1, which this tool does not implement",
    "glue": 'the glue model takes an allowable stress; under EC5 give the design value with type = "given_line"',
}


def read_ec5_settings(t: Table, method: str) -> dict[str, Any]:
    """The EC5 settings as keyword arguments of :class:`calcreport.model.Settings`.

    Under ASD or LRFD every one of them is an error (it would have no effect); under EC5
    ``service_class`` is required, and the NDS/ASCE settings ``load_duration`` and
    ``load_standard`` are errors."""
    ec5 = method == "EC5"
    own = [f.name for f in decl.EC5_SETTINGS] + ["load_case"]
    if not ec5:
        for name in own:
            if t.has(name):
                raise t.error(name, f'{name} applies to method = "EC5" only; this job is {method}')
        return {}
    for name, why in (
        ("load_duration", "EC5 uses k_mod by load-duration class (give duration on [[settings.load_case]])"),
        ("load_standard", "EC5 uses the EN 1990 combinations (6.10), not ASCE 7"),
    ):
        if t.has(name):
            raise t.error(name, f'{name} has no effect with method = "EC5": {why}')
    sc = t.integer("service_class", None, 1, 3, True)
    gm = t.number("gamma_M_connections", None, minimum=1.0, maximum=2.0)
    duration = t.choice("duration", DURATION_CLASSES, "")
    cases: dict[str, LoadCaseFactors] = {}
    for ct in t.tables("load_case", id_key="case"):
        ct.expect(decl.names(decl.LOAD_CASE))
        case = ct.text("case", required=True)
        if case in cases:
            raise ct.error("case", f"load case {case!r} is described twice")
        dur = ct.choice("duration", DURATION_CLASSES, "", True)
        psi0 = ct.number("psi0", None, minimum=0.0, maximum=1.0)
        psi2 = ct.number("psi2", None, minimum=0.0, maximum=1.0)
        if case == PERMANENT_CASE:
            for name in ("psi0", "psi2"):
                if ct.has(name):
                    raise ct.error(name, f"{name} has no effect on the permanent case {PERMANENT_CASE}")
        cases[case] = LoadCaseFactors(case, dur, psi0, psi2)
        ct.done()
    return {"service_class": sc, "gamma_M_connections": gm, "duration": duration, "load_cases": cases}


#: Characteristic strengths of a timber material (EN 338 / EN 14080 symbols, our key names).
STRENGTHS = ("f_m_k", "f_t_0_k", "f_c_0_k", "f_v_k")


def read_ec5_material(t: Table, family: str, method: str = "EC5") -> dict[str, Any]:
    """``rho_k``, ``timber_product``, ``gamma_M`` and the characteristic strengths of a material
    (kept in ``Material.extra``); refused in an ASD or LRFD job, where nothing reads them."""
    for name in ("rho_k", "timber_product", "gamma_M", *STRENGTHS):
        if method != "EC5" and t.has(name):
            raise t.error(name, f'{name} applies to method = "EC5" only; this job is {method}')
    out: dict[str, Any] = {
        "rho_k": t.quantity("rho_k", "mass_density"),
        "timber_product": t.choice("timber_product", TIMBER_PRODUCTS, ""),
        "gamma_M": t.number("gamma_M", None, minimum=1.0, maximum=2.0),
        **{k: t.quantity(k, "stress") for k in STRENGTHS},
    }
    timber = family in ("wood", "glulam", "plywood")
    for name in ("rho_k", "timber_product", "gamma_M", *STRENGTHS):
        if t.has(name) and not timber:
            raise t.error(name, f"{name} applies to timber materials (family wood, glulam or plywood)")
    product = out["timber_product"]
    if product:
        fits = {"wood": ("solid", "LVL"), "glulam": ("glulam",), "plywood": ("plywood",)}[family]
        if product not in fits:
            raise t.error(
                "timber_product",
                f"expected {' or '.join(repr(f) for f in fits)} for a material of family {family!r}",
            )
    return out


def slip_ec5(design: dict, settings: Settings) -> bool:
    """The slip moduli come from EN 1995-1-1 Table 7.1 (as ``solve.slip_moduli.route_for``
    chooses them): slip = true, and slip_moduli "EN 1995-1-1", or "auto" in an SI or EC5 job."""
    if not design.get("slip"):
        return False
    choice = design.get("slip_moduli", "auto")
    return choice == "EN 1995-1-1" or (
        choice == "auto" and (settings.method == "EC5" or settings.units == "SI")
    )


def ec5_connector_keys(ct: Table, kind: str, method: str, slip_ec5: bool = False) -> None:
    """Errors for connector keys the job's method makes inert, and connector types without an
    EC5 route (refused under EC5 rather than designed to another standard). ``slip_ec5``: the
    member's slip moduli come from EN 1995-1-1 Table 7.1, which reads a nail's ``predrilled``
    under any method."""
    if method == "EC5":
        if kind in EC5_REFUSED_KINDS:
            raise ct.error("type", f'type = "{kind}" has no EC5 route: {EC5_REFUSED_KINDS[kind]}')
        if kind in EC5_KEYS:
            for name in NDS_ONLY_KEYS:
                if ct.has(name):
                    raise ct.error(
                        name,
                        f'{name} is an NDS 2018 key with no effect under method = "EC5" '
                        "(EN 1995-1-1 §8 reads rho_k, fu, k_mod and γ_M instead)",
                    )
        return
    for name in EC5_KEYS.get(kind, ()):
        if name == "predrilled" and kind == "nail" and slip_ec5:
            continue  # K_ser of EN 1995-1-1 Table 7.1 (solve/slip_moduli.py)
        if ct.has(name):
            also = (
                " (or to the slip moduli of EN 1995-1-1 Table 7.1: slip = true in [member.design])"
                if name == "predrilled" and kind == "nail"
                else ""
            )
            raise ct.error(name, f'{name} applies to method = "EC5" only{also}; this job is {method}')


def unused_ec5_settings(t: Table, settings: Settings, members: list[Member]) -> None:
    """Warnings for EC5 settings that no member of this job uses: a ``[[settings.load_case]]`` of a
    case no member has, ``psi2`` without a ``quasi_permanent`` deflection limit, ``duration`` when
    every member has loads along it (each combination then gives its own k_mod)."""
    if settings.method != "EC5":
        return
    cases = {ld.case for m in members for ld in m.loads} | (
        {"D"} if any(m.self_weight for m in members) else set()
    )
    for ct in t.tables("load_case", id_key="case"):
        case = ct.data.get("case")
        if case not in cases:
            ct.warn("case", f"no member has loads of case {case!r}, so this load case changes nothing")
        elif ct.has("psi2") and "quasi_permanent" not in settings.deflection_limits:
            ct.warn("psi2", "psi2 is read only for a quasi_permanent deflection limit, and the job sets none")
    if t.has("duration") and all(m.loads or m.self_weight for m in members):
        t.warn(
            "duration",
            "every member has loads along it: each combination uses the k_mod of its own shortest-duration load",
        )


#: Material keys read only by the NDS 2018 / AISC member checks and NDS connectors.
NDS_MATERIAL_KEYS = ("Fb", "Fv", "Ft", "Fc", "Emin", "CF", "G", "Fs")


def ec5_member_keys(t: Table, method: str) -> None:
    """Under EC5: ``[member.design]`` keys are read by no check (the EN 1995-1-1 §6.3 stability
    checks are not implemented) — an error naming the key."""
    if method != "EC5":
        return
    dt = t.table("design")
    if dt is None:
        return
    for name in dt.data:
        raise dt.error(
            name,
            f'{name} has no effect with method = "EC5": the member checks that read [member.design] '
            "(NDS 2018 / AISC 360-16) do not run under EC5",
        )


def ec5_material_warnings(t: Table, method: str) -> None:
    """Under EC5: warn for the NDS/AISC design-stress keys of a timber material (nothing reads them)."""
    if method != "EC5":
        return
    for name in NDS_MATERIAL_KEYS:
        if t.has(name):
            t.warn(
                name, f'{name} is read by the NDS 2018 checks only; under method = "EC5" give f_m_k, f_v_k …'
            )
