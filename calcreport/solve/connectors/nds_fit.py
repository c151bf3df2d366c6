"""Does a wood fastener fit the assembly it is driven into? Length against the stack of parts on its
axis, and fasteners driven from opposite faces into one main member.

* **Length.** From the head at the side member's outer face, the fastener crosses the shear plane
  and passes the main member and whatever lies beyond on the same line (found from the placed
  parts, :func:`.geometry.stack_beyond`). A point beyond the far face of the assembly is NG with
  its protrusion, unless the job states ``clinched = true`` for a nail that passes through a
  three-member (double-shear, ``planes = 2``) assembly: then the double-shear yield equations
  apply (NDS 2018 §12.3.1, Table 12.3.1A with two shear planes). A clinched nail in single shear
  is refused: NDS 2018 gives no yield equations for it.
* **Penetration.** The penetration into the main member that is actually available is
  p = min(L − ts, tm): beyond the main member the point lies in another part (NDS 2018 §12.3.5,
  dowel bearing length in the main member).
* **Opposite faces.** When the held part is the main member and other parts of the joint touch it
  on both faces (a box-beam flange between two webs), fasteners are driven from both faces; at one
  row their points overlap by p₁ + p₂ − tm when that is positive, so the two cannot share a line —
  NG unless the job states ``staggered = true`` (rows from the two faces offset along the member).
  Common practice, no source.

The axis is taken normal to the plane at the middle of the contact, and the head at the side
member's outer face (parts outside the side member, such as sheathing the fastener is driven
through first, are not counted: give ``side_thickness`` for them).
"""

from __future__ import annotations

from typing import Any

from ...keys.connectors import CLINCHED, STAGGERED  # noqa: F401 (declared with the other keys)
from ...model import Part
from ...steps import StepLog
from ...units import Q_
from ..results import Check
from . import ConnectorError
from .shear_plane import Contact, opposite_faces, stack_beyond, thickness_normal

__all__ = ["STAGGERED", "CLINCHED", "fastener_fit", "NDS_FIT"]

NDS_FIT = "NDS 2018 §12.1, §12.3.5"
SRC_BOTH_FACES = "common practice, no source (fasteners driven from both faces)"


def _direction(c: Contact, main: Part) -> int:
    """+1 / −1: the way from the side member into the main member, normal to the plane."""
    return c.held_side if main is c.held else -c.held_side


def fastener_fit(
    log: StepLog,
    p: dict,
    ctx,
    c: Contact | None,
    side: Part,
    main: Part,
    ts: float,
    tm: float,
    L: float,
    planes: int,
    key: str,
    checks: list[Check],
    is_nail: bool,
) -> int:
    """Append the length and opposite-face checks (and their steps) for a fastener of length L.
    Returns the number of faces fasteners are driven from (1, or 2 into a main member between two
    other parts of the joint)."""
    clinched = bool(p.get("clinched"))
    staggered = bool(p.get("staggered"))
    if c is None:
        checks.append(
            Check(
                f"{key}.fit",
                "Fastener length against the assembly",
                None,
                None,
                None,
                "INFO",
                NDS_FIT,
                note="not checked: the parts do not touch, so the assembly on the fastener axis is unknown",
            )
        )
        return 1
    parts = tuple(ctx.parts) or (*ctx.held, *ctx.other)
    layers = stack_beyond(parts, c, _direction(c, main))
    values: dict[str, Any] = {"ts": Q_(ts, "in")}
    terms = ["{ts}"]
    for i, layer in enumerate(layers):
        values[f"t{i}"] = Q_(layer.end - layer.start, "in")
        terms.append("{" + f"t{i}" + "}")
    total = ts + (layers[-1].end if layers else 0.0)
    names = ", ".join([side.id] + [layer.part.id for layer in layers])
    log.add(
        "t_assembly",
        "Assembly on the fastener axis (head side to far face)",
        "t_a = ts + Σ t beyond the plane",
        " + ".join(terms),
        values,
        Q_(total, "in"),
        source="geometry of the placed parts",
        note=f"parts crossed in order: {names}",
    )
    out = L - total
    if clinched and out <= 1e-9:
        raise ConnectorError(
            f"{key}.clinched",
            f"clinched = true, but the nail (L = {L:.3g} in) ends {-out:.3g} in inside the "
            f"{total:.3g} in assembly and cannot be clinched; remove clinched or give a longer nail",
        )
    if clinched and planes != 2:
        raise ConnectorError(
            f"{key}.clinched",
            "a clinched nail passes through every member; NDS 2018 gives no single-shear yield "
            "equations for it: give planes = 2 (held part as the middle member) for a through nail "
            "in double shear, or a nail that stays inside the assembly",
        )
    # L against t_a is the check's demand and capacity (the outputs format them): no number in the note
    if clinched:
        status, note = "OK", "passes through and is clinched (stated); double shear"
    elif out > 1e-9:
        status = "NG"
        note = (
            f"the point exits the far face of {layers[-1].part.id if layers else main.id}: "
            "use a shorter fastener, or a through nail clinched in double shear"
        )
    else:
        status, note = "OK", "the point stays inside the far face"
    checks.append(
        Check(
            f"{key}.fit",
            "Fastener length within the assembly it is driven into",
            Q_(L, "in"),
            Q_(total, "in"),
            L / total if total > 0 else None,
            status,
            NDS_FIT,
            note=note,
            step=f"{log.prefix}.t_assembly",
        )
    )
    opposite = opposite_faces(main, c, tuple(ctx.other)) if planes == 1 and main in ctx.held else []
    if staggered and not opposite:
        raise ConnectorError(
            f"{key}.staggered",
            "staggered = true has no effect here: the fasteners of this joint are driven from one "
            "face only (no other part of the joint lies against the far face of the main member); "
            "remove it",
        )
    for o, oc in opposite:
        ts2 = thickness_normal(o, oc)
        p1, p2 = min(L - ts, tm), min(L - ts2, tm)
        overlap = p1 + p2 - tm
        log.add(
            f"p_both.{o.id}",
            f"Penetrations into {main.id} from both faces ({side.id} and {o.id})",
            "p₁ + p₂ = min(L − ts₁, tm) + min(L − ts₂, tm)",
            "min({L} − {ts1}, {tm}) + min({L} − {ts2}, {tm})",
            {"L": Q_(L, "in"), "ts1": Q_(ts, "in"), "ts2": Q_(ts2, "in"), "tm": Q_(tm, "in")},
            Q_(p1 + p2, "in"),
            source=SRC_BOTH_FACES,
        )
        if overlap <= 1e-9:
            status, note = "OK", "the points do not meet"
        elif staggered:
            status = "INFO"
            note = "staggered as stated: rows from the two faces must be offset along the member"
        else:
            status = "NG"
            note = (
                f"the points overlap in {main.id}: stagger the rows from the two "
                "faces (staggered = true) or use shorter fasteners"
            )
        checks.append(
            Check(
                f"{key}.opposite_faces.{o.id}",
                "Points from opposite faces do not meet",  # the parts: in the label of step p_both
                Q_(p1 + p2, "in"),
                Q_(tm, "in"),
                None if status == "INFO" else (p1 + p2) / tm,
                status,
                SRC_BOTH_FACES,
                note=note,
                step=f"{log.prefix}.p_both.{o.id}",
            )
        )
    return 2 if opposite else 1
