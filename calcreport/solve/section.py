"""Section properties of a built-up member by transformed areas, and first moments Q.

Sources: mechanics of materials — centroid ȳ = Σ n·A·y / Σ n·A; parallel-axis theorem
I = Σ n·(I₀ + A·d²); first moment Q = Σ n·A′·ȳ′; transformed section with modular ratio
n = E / E_ref (e.g. Gere & Goodno, Mechanics of Materials, chapters on composite beams).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

from ..model import Member, Part, Shape
from ..steps import StepLog
from ..units import Q_
from .results import PartProps, SectionResult
from .tolerance import difference

__all__ = ["shape_properties", "ShapeProps", "section_properties", "first_moment", "first_moment_above"]

SOURCE_CENTROID = "mechanics of materials: centroid of a transformed section"
SOURCE_PARALLEL = "mechanics of materials: parallel-axis theorem"
SOURCE_TRANSFORM = "mechanics of materials: transformed section"
#: the table (``Step.group``) of the per-part steps: rows are part ids, columns A, n, nA, y, nAy,
#: I0, d, I (panels add A_g and f); the sums carry a column and no row, ȳ neither
GROUP = "section"


@dataclass(frozen=True)
class ShapeProps:
    """Area, centroid height and I about the shape's own horizontal centroidal axis (inch units)."""

    area: float
    cy: float
    inertia: float


def polygon_properties(vertices: tuple[tuple[float, float], ...]) -> ShapeProps:
    """Area, centroid height and I₀ of a simple polygon by the shoelace (Green's theorem) formulas.

    A = ½·Σ(xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ); ȳ = Σ(yᵢ + yᵢ₊₁)·cᵢ / (6A); Iₓ = Σ(yᵢ² + yᵢ·yᵢ₊₁ + yᵢ₊₁²)·cᵢ / 12,
    with cᵢ = xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ; then I₀ = Iₓ − A·ȳ² (parallel-axis theorem).
    Source: standard plane-geometry formulas (e.g. Roark's Formulas for Stress and Strain,
    Appendix on properties of plane areas; common practice).
    """
    n = len(vertices)
    a = sy = ix = 0.0
    y_ref = vertices[0][1]  # shift to reduce round-off for shapes far from the origin
    for i in range(n):
        x0, y0 = vertices[i]
        x1, y1 = vertices[(i + 1) % n]
        y0 -= y_ref
        y1 -= y_ref
        c = x0 * y1 - x1 * y0
        a += c
        sy += (y0 + y1) * c
        ix += (y0 * y0 + y0 * y1 + y1 * y1) * c
    a *= 0.5
    if a < 0:  # clockwise: flip signs
        a, sy, ix = -a, -sy, -ix
    cy = sy / (6 * a)
    return ShapeProps(a, cy + y_ref, ix / 12 - a * cy * cy)


def shape_properties(shape: Shape) -> ShapeProps:
    """Area, centroid height and I₀ of a placed shape (inch units).

    Circle: A = π·r², I₀ = π·r⁴/4 (mechanics of materials). Rolled shapes: as given.
    """
    if shape.kind == "polygon":
        return polygon_properties(shape.vertices)
    if shape.kind == "circle":
        r = shape.radius
        return ShapeProps(math.pi * r * r, shape.centre[1], math.pi * r**4 / 4)
    return ShapeProps(shape.area, shape.centroid[1], shape.inertia)


def _area_formula(part: Part) -> tuple[str, str, dict]:
    s = part.shape
    w, h = s.bbox[2] - s.bbox[0], s.bbox[3] - s.bbox[1]
    if s.kind == "polygon" and len(s.vertices) == 4 and _is_axis_rect(s):
        return "A = b·h", "{b} × {h}", {"b": Q_(w, "inch"), "h": Q_(h, "inch")}
    if s.kind == "circle":
        return "A = π·d²/4", "π × ({d})² / 4", {"d": Q_(2 * s.radius, "inch")}
    if s.kind == "polygon":
        return "A = ½·Σ(xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ)", "shoelace sum over {n} vertices", {"n": len(s.vertices)}
    return "A (given)", "{A}", {"A": Q_(s.area, "inch**2")}


def _is_axis_rect(s: Shape) -> bool:
    xs = {round(v[0], 9) for v in s.vertices}
    ys = {round(v[1], 9) for v in s.vertices}
    return len(xs) == 2 and len(ys) == 2


def _inertia_formula(part: Part) -> tuple[str, str, dict]:
    s = part.shape
    if s.kind == "polygon" and len(s.vertices) == 4 and _is_axis_rect(s):
        w, h = s.bbox[2] - s.bbox[0], s.bbox[3] - s.bbox[1]
        return "I₀ = b·h³/12", "{b} × ({h})³ / 12", {"b": Q_(w, "inch"), "h": Q_(h, "inch")}
    if s.kind == "circle":
        return "I₀ = π·d⁴/64", "π × ({d})⁴ / 64", {"d": Q_(2 * s.radius, "inch")}
    if s.kind == "polygon":
        return "I₀ = Iₓ − A·ȳ²", "shoelace sums over {n} vertices", {"n": len(s.vertices)}
    return "I₀ (given)", "{I}", {"I": Q_(s.inertia, "inch**4")}


def section_properties(member: Member, log: StepLog) -> SectionResult:
    """Transformed area, neutral axis and I about it, with one step per quantity.

    Each part is transformed by n = E/E_ref into the reference material (mechanics of materials,
    transformed section). Heights are measured from the section's lowest point.
    """
    E_ref = member.reference_material.E
    bottom = min(p.shape.bbox[1] for p in member.parts)
    top = max(p.shape.bbox[3] for p in member.parts)
    props: list[PartProps] = []
    sums_A, sums_Ay = [], []
    for part in member.parts:
        plog = log.child(f"part.{part.id}").table(GROUP, part.id)
        sp = shape_properties(part.shape)
        sym, tpl, vals = _area_formula(part)
        A_gross = None
        panel = part.material.extra.get("panel") if part.material.extra else None
        if panel:  # the gross area, before the panel's effective fraction
            sym = sym.replace("A = ", "A_g = ", 1)
        A = plog.add(
            "A",
            f"{'Gross area' if panel else 'Area'} of part {part.id}",
            sym,
            tpl,
            vals,
            Q_(sp.area, "inch**2"),
            source="geometry",
            column="A_g" if panel else "A",
        )
        if panel:
            from .panel import effective_panel

            A_gross = A
            A, I_eff = effective_panel(part, panel, A, Q_(sp.inertia, "inch**4"), plog)
        n = plog.add(
            "n",
            f"Modular ratio of part {part.id}",
            "n = E / E_ref",
            "{E} / {E_ref}",
            {"E": part.material.E, "E_ref": E_ref},
            float((part.material.E / E_ref).to("")),
            source=SOURCE_TRANSFORM,
            column="n",
        )
        nA = plog.add(
            "nA",
            f"Transformed area of part {part.id}",
            "n·A",
            "{n} × {A}",
            {"n": n, "A": A},
            (A * n).to("inch**2"),
            source=SOURCE_TRANSFORM,
            column="nA",
        )
        y = plog.add(
            "y",
            f"Centroid height of part {part.id}",
            "y = y_c − y_bottom",
            "{yc}",
            {"yc": Q_(sp.cy - bottom, "inch")},
            Q_(sp.cy - bottom, "inch"),
            source="geometry",
            column="y",
        )
        nAy = plog.add(
            "nAy",
            f"First moment of part {part.id} about the bottom",
            "n·A·y",
            "{nA} × {y}",
            {"nA": nA, "y": y},
            (nA * y).to("inch**3"),
            source=SOURCE_CENTROID,
            column="nAy",
        )
        sym, tpl, vals = _inertia_formula(part)
        if A_gross is None:
            I0 = plog.add(
                "I0",
                f"Own moment of inertia of part {part.id}",
                sym,
                tpl,
                vals,
                Q_(sp.inertia, "inch**4"),
                source="geometry",
                column="I0",
            )
        else:
            I0 = I_eff
        w, h = part.shape.bbox[2] - part.shape.bbox[0], part.shape.bbox[3] - part.shape.bbox[1]
        props.append(PartProps(part.id, A, n, nA, y, I0, Q_(h, "inch"), Q_(w, "inch"), A_gross))
        sums_A.append(nA)
        sums_Ay.append(nAy)
    tlog = log.table(GROUP)
    slots_A = {f"nA{i + 1}": p.area_transformed for i, p in enumerate(props)}
    A_t = tlog.add(
        "A",
        "Transformed area",
        "A = Σ n·A",
        " + ".join(f"{{{k}}}" for k in slots_A),
        slots_A,
        sum(sums_A[1:], sums_A[0]).to("inch**2"),
        source=SOURCE_TRANSFORM,
        column="nA",
    )
    slots_Ay = {f"nAy{i + 1}": v for i, v in enumerate(sums_Ay)}
    S_y = tlog.add(
        "nAy",
        "First moment of the transformed section about the bottom",
        "Σ n·A·y",
        " + ".join(f"{{{k}}}" for k in slots_Ay),
        slots_Ay,
        sum(sums_Ay[1:], sums_Ay[0]).to("inch**3"),
        source=SOURCE_CENTROID,
        column="nAy",
    )
    slots = {}
    terms = []
    for i, p in enumerate(props):
        slots[f"nA{i + 1}"] = p.area_transformed
        slots[f"y{i + 1}"] = p.centroid_y
        terms.append(f"{{nA{i + 1}}} × {{y{i + 1}}}")
    slots["A"] = A_t
    ybar = tlog.add(
        "ybar",
        "Neutral axis height above the bottom",
        "ȳ = Σ n·A·y / Σ n·A",
        "(" + " + ".join(terms) + ") / {A}",
        slots,
        (S_y / A_t).to("inch"),
        source=SOURCE_CENTROID,
    )
    contribs = []
    for p in props:
        plog = log.child(f"part.{p.id}").table(GROUP, p.id)
        d = plog.add(
            "d",
            f"Distance of part {p.id} from the neutral axis",
            "d = y − ȳ",
            "{y} − {ybar}",
            {"y": p.centroid_y, "ybar": ybar},
            Q_(
                difference(p.centroid_y.to("inch").magnitude, ybar.to("inch").magnitude), "inch"
            ),  # round-off is 0
            source=SOURCE_PARALLEL,
            column="d",
        )
        c = plog.add(
            "I",
            f"Contribution of part {p.id} to I",
            "n·(I₀ + A·d²)",
            "{n} × ({I0} + {A} × ({d})²)",
            {"n": p.n, "I0": p.inertia_own, "A": p.area, "d": d},
            (p.n * (p.inertia_own + p.area * d**2)).to("inch**4"),
            source=SOURCE_PARALLEL,
            column="I",
        )
        contribs.append(c)
    slots_I = {f"I{i + 1}": c for i, c in enumerate(contribs)}
    inertia = tlog.add(
        "I",
        "Moment of inertia about the neutral axis",
        "I = Σ n·(I₀ + A·d²)",
        " + ".join(f"{{{k}}}" for k in slots_I),
        slots_I,
        sum(contribs[1:], contribs[0]).to("inch**4"),
        source=SOURCE_PARALLEL,
        column="I",
    )
    return SectionResult(
        E_ref=E_ref,
        reference_material=member.reference_material.id,
        area=A_t,
        centroid=ybar,
        inertia=inertia,
        depth=Q_(top - bottom, "inch"),
        bottom=Q_(bottom, "inch"),
        parts=tuple(props),
        steps=tuple(log.steps),
    )


def first_moment(section: SectionResult, held: tuple[str, ...], log: StepLog):
    """Q = Σ n·A′·|ȳ′ − ȳ| of the held parts about the neutral axis (mechanics of materials).

    The held parts lie on one side of the shear plane; the sign is dropped (Q is a magnitude).
    """
    by_id = {p.id: p for p in section.parts}
    slots: dict[str, Any] = {}
    terms: list[str] = []
    total: Any = None
    for i, pid in enumerate(held):
        p = by_id[pid]
        slots[f"nA{i + 1}"] = p.area_transformed
        slots[f"d{i + 1}"] = p.centroid_y - section.centroid
        terms.append(f"{{nA{i + 1}}} × {{d{i + 1}}}")
        term = p.area_transformed * (p.centroid_y - section.centroid)
        total = term if total is None else total + term
    Q = abs(total.to("inch**3"))
    return log.add(
        "Q",
        "First moment of the held parts about the neutral axis",
        "Q = |Σ n·A′·(y′ − ȳ)|",
        "|" + " + ".join(terms) + "|",
        slots,
        Q,
        source="mechanics of materials: first moment of area",
    )


def _fraction(p: PartProps) -> float:
    """Effective area over gross area of a layered panel part."""
    if p.area_gross is None:
        return 1.0
    return float((p.area / p.area_gross).to("").magnitude)


def first_moment_above(member: Member, section: SectionResult, y_cut: float) -> float:
    """Q (in³, transformed) of everything above the horizontal line at height ``y_cut`` (inches above
    the section's bottom), about the neutral axis. Rolled parts given by properties cannot be cut
    and raise ValueError when the line passes through them.
    """
    from ..outlines import is_rectangle, outline

    bottom = float(section.bottom.to("inch").magnitude)
    ybar = float(section.centroid.to("inch").magnitude) + bottom
    y_abs = y_cut + bottom
    total = 0.0
    panels = {p.id for p in member.parts if p.material.extra and p.material.extra.get("panel")}
    n_by_id = {p.id: p.n * (_fraction(p) if p.id in panels else 1.0) for p in section.parts}
    for part in member.parts:
        x0, y0, x1, y1 = part.shape.bbox
        if y0 >= y_abs:
            sp = shape_properties(part.shape)
            total += n_by_id[part.id] * sp.area * (sp.cy - ybar)
        elif y1 > y_abs:
            if part.shape.kind == "properties":
                raise ValueError(f"part {part.id} is given by properties and cannot be cut")
            if is_rectangle(part.shape):  # axis-aligned: no shapely needed
                total += n_by_id[part.id] * (x1 - x0) * (y1 - y_abs) * ((y_abs + y1) / 2 - ybar)
                continue
            from shapely.geometry import box

            piece = outline(part.shape).intersection(box(x0 - 1, y_abs, x1 + 1, y1 + 1))
            if piece.area > 0:
                total += n_by_id[part.id] * piece.area * (piece.centroid.y - ybar)
    return total
