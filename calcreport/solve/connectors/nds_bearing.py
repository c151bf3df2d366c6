"""Dowel bearing of the members of a wood dowel-type joint, NDS 2018: specific gravity, the angle
of load to grain in each member, and the dowel bearing strengths Fes / Fem (wood or steel).

Shared by :mod:`.nds_dowel`. Units inside: in, psi (floats); steps carry quantities.

Load angle. Each wood member has its own angle θ of load to grain: the connector's
``angle_side`` / ``angle_main`` where given, else the joint's ``JointContext.load_angle`` (plies
side by side set it to 90: the load crosses from ply to ply perpendicular to the grain). A
steel member has no grain and takes no angle. Dowels with D ≥ 1/4 in bear at Fe∥ = 11200·G,
Fe⊥ = 6100·G^1.45/√D and Hankinson's formula between (NDS-2018 Table 12.3.3 footnote 2,
§12.3.3, Appendix J); for D < 1/4 in Fe = 16600·G^1.84 at any angle, so the angle has no effect.
"""

from __future__ import annotations

from dataclasses import dataclass

from ...model import Part
from ...steps import StepLog
from ...units import Q_
from ..results import Check
from . import ConnectorError
from .nds_catalog import species_g
from .nds_yield import NDS, fe_parallel, fe_perpendicular, fe_small, fe_steel, hankinson

__all__ = ["plywood_g", "specific_gravity", "member_angles", "Angles", "bearing", "steel_case"]


def plywood_g(mat) -> tuple[float, str]:
    """Specific gravity of a wood structural panel without a G: Structural I and Marine plywood
    0.50, other plywood grades 0.42 (the lower, used when the grade is not stated).
    Source: NDS-2018 Table 12.3.3B (from memory). The grade is read from the material's ``grade``
    (or, failing that, its name)."""
    text = f"{mat.extra.get('grade') or ''} {mat.name}".lower()
    if "structural i" in text or "structural 1" in text or "marine" in text:
        return 0.50, f"material {mat.id}: Structural I / Marine plywood, {NDS} Table 12.3.3B"
    return 0.42, (
        f"material {mat.id}: plywood of other or unstated grade, {NDS} Table 12.3.3B (the lower panel value)"
    )


def specific_gravity(log: StepLog, p: dict, part: Part, which: str, key: str) -> float:
    """G of the side or main member: the connector's G_side/G_main, the material's G, plywood by
    grade (Table 12.3.3B) or the species combination (Table 12.3.3A), with its step."""
    if p.get(f"G_{which}") is not None:
        g, src = p[f"G_{which}"], "given for this connector"
    elif part.material.G is not None:
        g, src = part.material.G, f"material {part.material.id}"
    elif part.material.family == "plywood" and not p.get("species"):
        g, src = plywood_g(part.material)
    elif p.get("species"):
        g = species_g(p["species"])
        if g is None:
            raise ConnectorError(
                f"{key}.species",
                "expected a species combination of NDS Table 12.3.3A, "
                'e.g. "Douglas Fir-Larch", "Southern Pine", "Hem-Fir", "Spruce-Pine-Fir"',
            )
        src = f"species {p['species']}, {NDS} Table 12.3.3A"
    else:
        raise ConnectorError(
            f"{key}.G_{which}",
            f"expected G_{which} (specific gravity), a species, or a G on material {part.material.id}",
        )
    log.add(
        f"G_{which}", f"Specific gravity of the {which} member", f"G_{which}", "{G}", {"G": g}, g, source=src
    )
    return g


@dataclass(frozen=True)
class Angles:
    """Angle of load to grain (degrees) in the side and main member, and θ for Kθ."""

    side: float
    main: float
    theta: float  # the largest angle of any wood member (Table 12.3.1B)


def member_angles(log: StepLog, p: dict, ctx, side: Part, main: Part, D: float, key: str) -> Angles:
    """The angle of load to grain in each member: ``angle_side`` / ``angle_main`` where given
    (non-zero), else the joint's ``load_angle``; none for a steel member. A given angle that
    contradicts the joint's, or an angle on a steel member, is refused. With any angle above 0 a
    step records each member's angle and where it comes from.
    Source: NDS-2018 §12.3.3 (Fe by the direction of load to grain), Table 12.3.1B (θ)."""
    joint = float(getattr(ctx, "load_angle", 0.0) or 0.0)
    if not 0.0 <= joint <= 90.0:
        raise ConnectorError(f"{key}.type", f"expected a load angle from 0 to 90 degrees, not {joint:g}")
    out: dict[str, float] = {}
    why: dict[str, str] = {}
    for which, part in (("side", side), ("main", main)):
        given = float(p.get(f"angle_{which}") or 0.0)
        if part.material.family == "steel":
            if given > 0:
                raise ConnectorError(
                    f"{key}.angle_{which}",
                    f"expected no angle_{which}: the {which} member ({part.id}) is steel and has no grain",
                )
            out[which], why[which] = 0.0, "steel member: no grain"
            continue
        if joint > 0 and given > 0 and abs(given - joint) > 1e-9:
            raise ConnectorError(
                f"{key}.angle_{which}",
                f"expected no angle_{which} (or {joint:g}): this joint carries its load at {joint:g}° "
                "to the grain of its wood members (load passed across from ply to ply)",
            )
        if given > 0:
            out[which], why[which] = given, f"given (angle_{which})"
        elif joint > 0:
            out[which], why[which] = (
                joint,
                "load passed across from ply to ply: vertical, grain along the member",
            )
        else:
            out[which], why[which] = 0.0, "load along the member, parallel to grain"
    wood = [out[w] for w, part in (("side", side), ("main", main)) if part.material.family != "steel"]
    theta = max(wood, default=0.0)
    if theta > 0:
        for which in ("side", "main"):
            log.add(
                f"theta_{which}",
                f"Angle of load to grain in the {which} member (degrees)",
                f"θ{which[0]}",
                "{th}",
                {"th": out[which]},
                out[which],
                source=f"{NDS} §12.3.3",
                note=why[which],
            )
        if D < 0.25:
            log.add(
                "theta_effect",
                "Angle of load to grain, no effect for D < 1/4 in (degrees)",
                "θ",
                "{th}",
                {"th": theta},
                theta,
                source=f"{NDS} Table 12.3.3 footnote 2, Table 12.3.1B",
                note="D < 1/4 in: neither the dowel bearing strength nor the reduction term depends on "
                "the angle of load to grain, so the value is the same as parallel to grain",
            )
    return Angles(out["side"], out["main"], theta)


def bearing(
    log: StepLog, p: dict, part: Part, which: str, D: float, t: float, theta: float, key: str
) -> float:
    """Dowel bearing strength (psi) of the side or main member at angle θ to grain, with its steps.

    Wood: NDS-2018 Table 12.3.3 footnote 2 (Fe∥, Fe⊥, D < 1/4 in), §12.3.3 / Appendix J
    (Hankinson). Steel: §12.3.4 (1.5·Fu hot-rolled, 1.375·Fu cold-formed).
    """
    sym = "Fes" if which == "side" else "Fem"
    mat = part.material
    if mat.family == "steel":
        if mat.Fu is None:
            raise ConnectorError(
                f"material[{mat.id}].Fu",
                f"expected Fu (a stress) on steel material {mat.id}: the dowel bearing strength of "
                f"the steel {which} member is Fe = 1.5·Fu (NDS-2018 §12.3.4)",
            )
        Fu = mat.Fu.to("psi").magnitude
        fe, mult, form = fe_steel(Fu, t, p.get("steel_form") or "auto")
        log.add(
            sym,
            f"Dowel bearing strength of the {which} member (steel)",
            f"{sym} = k·Fu",
            "{k} × {Fu}",
            {"k": mult, "Fu": mat.Fu},
            Q_(fe, "psi"),
            source=f"{NDS} §12.3.4",
            note=f"{form.replace('_', '-')} steel"
            + (" (t ≥ 1/4 in)" if form == "hot_rolled" else " (t < 1/4 in)")
            + "; no grain, the same in every direction",
        )
        return fe
    if mat.family not in ("wood", "plywood", "other"):
        raise ConnectorError(
            f"{key}.side_member",
            f"expected wood, plywood or steel members; material {mat.id} is {mat.family}",
        )
    G = specific_gravity(log, p, part, which, key)
    src = f"{NDS} Table 12.3.3 footnote 2"
    note = "the equation unrounded (NDS tables round Fe, e.g. 4650 psi at G = 0.50 for D < 1/4 in)"
    if D < 0.25:
        return (
            log.add(
                sym,
                f"Dowel bearing strength of the {which} member",
                f"{sym} = 16600·G^1.84",
                "16600 × {G}^1.84",
                {"G": G},
                Q_(fe_small(G), "psi"),
                source=src,
                note=note,
            )
            .to("psi")
            .magnitude
        )
    fpar = fe_parallel(G)
    fpar_q = log.add(
        f"{sym}_par",
        f"Dowel bearing strength parallel to grain, {which} member",
        f"{sym}∥ = 11200·G",
        "11200 × {G}",
        {"G": G},
        Q_(fpar, "psi"),
        source=src,
    )
    if theta <= 0:
        return fpar
    fperp = fe_perpendicular(G, D)
    perp_note = f"load perpendicular to grain in the {which} member" if theta >= 90 - 1e-9 else ""
    fperp_q = log.add(
        f"{sym}_perp",
        f"Dowel bearing strength perpendicular to grain, {which} member",
        f"{sym}⊥ = 6100·G^1.45 / √D",
        "6100 × {G}^1.45 / √{D}",
        {"G": G, "D": Q_(D, "in")},
        Q_(fperp, "psi"),
        source=src,
        note=perp_note,
    )
    fe = hankinson(fpar, fperp, theta)
    log.add(
        sym,
        f"Dowel bearing strength at the load angle, {which} member",
        f"{sym}θ = Fe∥·Fe⊥ / (Fe∥·sin²θ + Fe⊥·cos²θ)",
        "{par} × {perp} / ({par} × sin²({th}°) + {perp} × cos²({th}°))",
        {"par": fpar_q, "perp": fperp_q, "th": float(theta)},
        Q_(fe, "psi"),
        source=f"{NDS} §12.3.3, Appendix J (Hankinson formula)",
    )
    return fe


def steel_case(side: Part, main: Part, planes: int, key: str) -> Check | None:
    """An INFO row naming the wood–steel case of the joint, or None for wood only.

    Steel side plate(s) on a wood main member: the case the NDS-2018 bolt tables give for steel
    side plates (1/4 in A36, Fe = 1.5·Fu); a steel main member between wood side members (a flitch
    plate, double shear): no NDS table, the Table 12.3.1A double-shear modes Im, Is, IIIs, IV with
    Fem of the steel. Source: NDS-2018 §12.3.1, §12.3.4, Table 12.3.1A.
    """
    s_steel, m_steel = side.material.family == "steel", main.material.family == "steel"
    if not (s_steel or m_steel):
        return None
    shear = "double shear, modes Im, Is, IIIs, IV" if planes == 2 else "single shear, modes Im to IV"
    if m_steel:
        what = (
            f"steel main member {main.id} between wood side members (flitch plate); {shear}; Fem of the "
            "steel; the NDS lateral value tables give no such case, the yield limit equations are used"
        )
    else:
        what = (
            f"wood main member {main.id} with steel side plate(s) {side.id}; {shear}; the case the NDS "
            "bolt tables give for steel side plates, computed here from the yield limit equations"
        )
    return Check(
        f"{key}.case",
        "Wood-steel connection case",
        None,
        None,
        None,
        "INFO",
        source=f"{NDS} §12.3.1, §12.3.4, Table 12.3.1A",
        note=what,
    )
