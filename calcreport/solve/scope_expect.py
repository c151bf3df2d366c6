"""What a plan checker expects of a member (:func:`expectations`), from the member alone: its
parts' material families, its loads and its joints. Each :class:`Expectation` carries scope tags;
:func:`calcreport.solve.scope.not_checked` removes those a check that ran covers (the tag contract
is in :mod:`calcreport.solve.scope`). Split from ``scope.py``; the names are re-exported there.

Source of the list of expectations: common practice of plan review, no source; each clause names
the standard that would govern the check.
"""

from __future__ import annotations

from dataclasses import dataclass

from ..model import Member, Part

__all__ = ["Expectation", "expectations", "SLIP_KINDS", "families", "materials"]

NDS = "NDS 2018"
AISC = "AISC 360-16"
APA = "APA Panel Design Specification"


@dataclass(frozen=True)
class Expectation:
    """A check a plan checker would expect: any of ``tags`` covered by a check that ran meets it."""

    name: str  # key suffix of the Unchecked record (``member[H1].<name>``)
    tags: tuple[str, ...]
    label: str
    clause: str
    reason: str


def families(member: Member) -> dict[str, list[Part]]:
    out: dict[str, list[Part]] = {}
    for p in member.parts:
        out.setdefault(p.material.family, []).append(p)
    return out


def materials(parts: list[Part]) -> list:
    seen: dict[str, object] = {}
    for p in parts:
        seen.setdefault(p.material.id, p.material)
    return list(seen.values())


def _is_rolled(p: Part) -> bool:
    return p.shape.kind == "properties" or (p.shape.nominal or "")[:1].upper() in ("W", "S", "M", "C")


def expectations(member: Member, has_moment: bool) -> list[Expectation]:
    """What a plan checker expects of ``member``. ``has_moment``: loads along the member are given
    (a moment and deflections are known), rather than a design shear alone."""
    if member.plies:
        from .plies_checks import ply_expectations

        return ply_expectations(member, has_moment)
    fam = families(member)
    no_m = "the job gives only a design shear V, so no moment is known (give span and loads)"
    out: list[Expectation] = []
    wood = fam.get("wood", [])
    ply = fam.get("plywood", [])
    steel = fam.get("steel", [])
    concrete = fam.get("concrete", [])
    for mat in materials(wood):
        reason = no_m if not has_moment else f"no Fb given for material {mat.id}"
        out.append(
            Expectation(
                f"bending.{mat.id}",
                (f"bending:{mat.id}", "flange_axial") if ply else (f"bending:{mat.id}",),
                f"bending stress of {mat.id}",
                f"{NDS} §3.3",
                reason,
            )
        )
    if wood or ply:
        out.append(
            Expectation(
                "shear.neutral_axis",
                ("shear:neutral_axis", "panel_shear") if ply else ("shear:neutral_axis",),
                "horizontal shear stress at the neutral axis",
                f"{NDS} §3.4",
                "not computed for this member",
            )
        )
    if wood:
        out.append(
            Expectation(
                "bearing",
                ("bearing",),
                "bearing on the supports, Fc⊥",
                f"{NDS} §3.10",
                "no bearing lengths given; not implemented",
            )
        )
        out.append(
            Expectation(
                "stability",
                ("stability", "CL"),
                "lateral stability, beam stability factor CL",
                f"{NDS} §3.3.3",
                "no unbraced length given; Fb is used as stated, CL not applied",
            )
        )
    if ply:
        names = ", ".join(m.id for m in materials(ply))
        out.append(
            Expectation(
                "panel_shear",
                ("panel_shear",),
                f"shear through the thickness of the plywood webs, {names}",
                f"{APA}, Fv·tv",
                "not implemented in this version",
            )
        )
        out.append(
            Expectation(
                "panel_stress",
                ("panel_stress", "panel_axial"),
                f"tension and compression in the plywood webs, {names}",
                f"{APA}, Ft and Fc parallel to the face grain",
                "needs loads along the member and the panel's Ft_A and Fc_A ([material.panel])",
            )
        )
        if wood:
            out.append(
                Expectation(
                    "flange_axial",
                    ("flange_axial",),
                    "axial stress of the wood flanges against Ft and Fc with CP",
                    f"{NDS} §3.8, §3.6-3.7",
                    "needs loads along the member and Ft and Fc of the flange material",
                )
            )
            out.append(
                Expectation(
                    "splices",
                    ("splices",),
                    "flange and web splices",
                    "common practice, no source",
                    "splices are not designed by the tool; continuous parts are assumed",
                )
            )
            if has_moment:
                out.append(
                    Expectation(
                        "shear_deformation",
                        ("shear_deformation",),
                        "shear deformation of the plywood webs in the deflection",
                        f"{APA}, G·Av of the webs",
                        "needs the panel's Gv_tv ([material.panel]); deflection is from bending only",
                    )
                )
    if steel:
        mats = materials(steel)
        nofy = [m.id for m in mats if m.Fy is None]
        why = f"no Fy given for material {', '.join(nofy)}" if nofy else "not implemented in this version"
        why_m = no_m if not has_moment else why
        out += [
            Expectation(
                "flexure",
                ("flexure",),
                "flexure of the steel section, with lateral-torsional buckling",
                f"{AISC} Chapter F, F2-F5",
                why_m,
            ),
            Expectation(
                "local_buckling",
                ("local_buckling", "slenderness", "flexure"),
                "flange and web slenderness classification",
                f"{AISC} Table B4.1b",
                why,
            ),
            Expectation(
                "web_shear",
                ("web_shear", "shear:web"),
                "web shear strength and shear buckling",
                f"{AISC} Chapter G, G2.1",
                why,
            ),
            Expectation(
                "stiffeners",
                ("stiffeners",),
                "transverse and bearing stiffeners",
                f"{AISC} G2.3, J10.8",
                "not implemented in this version",
            ),
            Expectation(
                "web_local_yielding",
                ("web_local_yielding",),
                "web local yielding at the bearings",
                f"{AISC} J10.2",
                "no bearing lengths given; not implemented",
            ),
            Expectation(
                "web_crippling",
                ("web_crippling",),
                "web crippling at the bearings",
                f"{AISC} J10.3",
                "no bearing lengths given; not implemented",
            ),
        ]
        if len(steel) >= 2 and any(_is_rolled(p) for p in steel):
            out.append(
                Expectation(
                    "cover_plate",
                    ("cover_plate",),
                    "cover-plate termination (extension a′ and end connection)",
                    f"{AISC} F13.3",
                    "not implemented in this version",
                )
            )
    if concrete:
        out.append(
            Expectation(
                "composite",
                ("composite",),
                "composite section: cracked slab and construction stage",
                f"{AISC} Chapter I, I3.2",
                "not implemented in this version: the section is taken uncracked and fully composite",
            )
        )
    out += _slip_expectation(member, fam)
    if member.parts:
        out.append(
            Expectation(
                "deflection",
                ("deflection",),
                "deflection",
                "IBC 2021 Table 1604.3",
                "no loads given" if not has_moment else "no deflection limit applies to the load cases given",
            )
        )
    return out


#: Connector types that slip (dowel-type fasteners and given values); glue lines are rigid.
SLIP_KINDS = ("nail", "wood_screw", "lag_screw", "wood_bolt", "shank", "given")


def _slip_expectation(member: Member, fam: dict[str, list[Part]]) -> list[Expectation]:
    """Timber members joined by fasteners that slip: their partial composite action (stiffness,
    connector forces, deflection) is expected; ``[member.design] slip = true`` checks it."""
    timber = any(fam.get(f) for f in ("wood", "glulam", "plywood"))
    if not timber or not any(j.connector.kind in SLIP_KINDS for j in member.joints):
        return []
    return [
        Expectation(
            "slip",
            ("slip",),
            "slip of mechanical connectors (partial composite action): stiffness, connector forces, deflection",
            "EN 1995-1-1:2004 Annex B",
            "not asked for: the results take the connectors as rigid (set slip = true in [member.design])",
        )
    ]
