"""Does a member fit the γ-method (EN 1995-1-1:2004 Annex B), and its layers if it does.

Annex B covers beams of two or three parts — a web (part 2) with one part on top (1) and/or one
below (3) — joined by mechanical fasteners in one shear plane per joint (T, I and box sections, the
webs counted together, Figure B.1). :func:`layout` returns the joints and parts as layers, or the
reason the method does not apply (which the solver reports as not checked, keeping the rigid
results).
"""

from __future__ import annotations

from dataclasses import dataclass

from ..model import Joint, Member, Part
from ..outlines import contact_segments
from .results import PartProps, SectionResult

__all__ = ["Group", "layout", "NotApplicable", "CONTINUOUS_TYPES", "MECHANICAL_TYPES"]

#: Connections that are continuous lines: glue is rigid (γ = 1); the others have no slip modulus.
CONTINUOUS_TYPES = ("glue", "given_line", "fillet_weld")
#: Connector types that slip (dowel-type fasteners, and given values with a tested slip modulus).
MECHANICAL_TYPES = ("nail", "wood_screw", "lag_screw", "wood_bolt", "shank", "given", "steel_bolt", "stud")
#: Families the γ-method of EN 1995-1-1 is written for.
TIMBER = ("wood", "glulam", "plywood")


class NotApplicable(ValueError):
    """The γ-method does not apply to this member; the message says why."""


@dataclass(frozen=True)
class Group:
    """One layer of the section: the parts a joint holds (``joint`` set), or the web (None)."""

    joint: Joint | None
    parts: tuple[Part, ...]
    props: tuple[PartProps, ...]
    touches: tuple[Part, ...] = ()  # the web parts across its shear planes

    @property
    def name(self) -> str:
        return self.joint.id if self.joint is not None else "web"

    def EA(self) -> float:
        """Σ E·A (lbf)."""
        return sum(_E(p) * pp.area.to("inch**2").magnitude for p, pp in zip(self.parts, self.props))

    def y(self) -> float:
        """Height of the layer's centroid (E·A-weighted), inches."""
        return (
            sum(
                _E(p) * pp.area.to("inch**2").magnitude * pp.centroid_y.to("inch").magnitude
                for p, pp in zip(self.parts, self.props)
            )
            / self.EA()
        )

    def EI(self) -> float:
        """Σ E·(I₀ + A·(yₚ − y)²) about the layer's own centroid (parallel-axis theorem), lbf·in²."""
        y = self.y()
        return sum(
            _E(p)
            * (
                pp.inertia_own.to("inch**4").magnitude
                + pp.area.to("inch**2").magnitude * (pp.centroid_y.to("inch").magnitude - y) ** 2
            )
            for p, pp in zip(self.parts, self.props)
        )

    def height(self) -> float:
        """Overall height of the layer (inches)."""
        return max(p.shape.bbox[3] for p in self.parts) - min(p.shape.bbox[1] for p in self.parts)


def _E(p: Part) -> float:
    return float(p.material.E.to("psi").magnitude)


def _props(
    member: Member, section: SectionResult, ids: set[str]
) -> tuple[tuple[Part, ...], tuple[PartProps, ...]]:
    pairs = [(p, pp) for p, pp in zip(member.parts, section.parts) if p.id in ids]
    return tuple(p for p, _ in pairs), tuple(pp for _, pp in pairs)


def layout(member: Member, section: SectionResult) -> list[Group]:
    """The layers [outer…, web] of ``member`` for the γ-method, outer layers in joint order.

    Raises :class:`NotApplicable` with the reason when the member does not fit Annex B.
    """
    if not any(p.material.family in TIMBER for p in member.parts):
        raise NotApplicable(
            "EN 1995-1-1 Annex B is written for timber members; this member has no timber part"
        )
    kinds = {j.connector.kind for j in member.joints}
    mech = [j for j in member.joints if j.connector.kind not in CONTINUOUS_TYPES]
    if "glue" in kinds and mech:
        raise NotApplicable("glued and mechanically fastened joints are mixed in one member")
    if not mech:
        raise NotApplicable("no joint with mechanical connectors (glued joints are rigid, γ = 1)")
    if any(j.connector.kind in CONTINUOUS_TYPES for j in member.joints):
        raise NotApplicable("a continuous connection without a slip modulus joins some parts")
    if len(mech) > 2:
        raise NotApplicable(
            f"{len(mech)} fastened joints: the method covers two or three layers (at most two joints)"
        )
    held = [set(j.holds) for j in mech]
    if len(held) == 2 and held[0] & held[1]:
        raise NotApplicable("the joints hold parts in common (nested joints: more than three layers)")
    web_ids = {p.id for p in member.parts} - set().union(*held)
    if not web_ids:
        raise NotApplicable("every part is held by a joint: no web (part 2) is left")
    web = Group(None, *_props(member, section, web_ids))
    groups = []
    for j in mech:
        if int(j.connector.params.get("planes") or 1) > 1:
            raise NotApplicable(f"joint {j.id}: connectors in more than one shear plane")
        parts, props = _props(member, section, set(j.holds))
        touches = tuple(w for w in web.parts if contact_segments(list(parts), [w]))
        if not touches:
            raise NotApplicable(f"joint {j.id}: its parts do not touch the web")
        groups.append(Group(j, parts, props, touches))
    if len(groups) == 2:
        g0, g1 = groups
        if contact_segments(list(g0.parts), list(g1.parts)):
            raise NotApplicable("the parts of the two joints touch each other (more than three layers)")
        yw = web.y()
        if (g0.y() - yw) * (g1.y() - yw) >= 0.0:
            raise NotApplicable(
                "both fastened parts lie on the same side of the web (more than three layers)"
            )
    return [*groups, web]
