"""Steel–concrete composite sections: the cracked transformed section and the construction stage.

* **Cracked slab** (mechanics of materials, transformed section; AISC 360-16 Commentary I3 elastic
  analysis): concrete in tension is ignored. When the neutral axis of the uncracked section lies
  inside a concrete part, only the concrete above it is kept, and the neutral axis is found again
  with that depth — iterated to a fixed point. The cracked depth is a step; the gross area is kept
  for self-weight. Sagging moment (slab on top in compression) is assumed; a member with hogging
  moment lists that region as not checked.
* **Construction** — ``[member.design] construction = "shored" | "unshored"`` is stated in a step.
  Unshored: the dead load (case D) is carried by the steel alone; the steel-alone I is a step and
  the dead-load deflection on the steel alone an INFO row (camber), while the connectors are
  designed, conservatively, for the whole shear on the composite section. Without the key the
  construction stage is listed as not checked and shored construction is assumed, stated.
"""

from __future__ import annotations

from dataclasses import replace

from ..model import Member
from ..steps import StepLog
from ..units import Q_
from .results import Check, SectionResult, Unchecked

__all__ = ["cracked_section", "construction_checks", "has_slab"]

SRC = "mechanics of materials: transformed section, concrete in tension ignored"


def has_slab(member: Member) -> bool:
    fams = {p.material.family for p in member.parts}
    return "concrete" in fams and "steel" in fams


def _is_rect(part) -> bool:
    from ..outlines import is_rectangle

    return part.shape.kind == "polygon" and is_rectangle(part.shape)


def cracked_section(member: Member, section: SectionResult, log: StepLog) -> SectionResult:
    """The section with the concrete below the neutral axis removed (see the module docstring)."""
    ybar = float(section.centroid.to("in").magnitude)
    bottom = float(section.bottom.to("in").magnitude)
    conc = [
        (i, p)
        for i, p in enumerate(member.parts)
        if p.material.family == "concrete" and p.shape.bbox[1] - bottom < ybar < p.shape.bbox[3] - bottom
    ]
    steel_top = max((p.shape.bbox[3] for p in member.parts if p.material.family == "steel"), default=0.0)
    if not conc or not all(_is_rect(p) and p.shape.bbox[1] >= steel_top - 1e-6 for _, p in conc):
        return section  # only a slab on top of the steel is cracked (sagging moment)
    props = list(section.parts)
    cut_ids = {i for i, _ in conc}
    for _ in range(200):
        sa = say = 0.0
        for i, pp in enumerate(props):
            if i in cut_ids:
                part = member.parts[i]
                top = part.shape.bbox[3] - bottom
                b = part.shape.bbox[2] - part.shape.bbox[0]
                a = max(top - ybar, 0.0)
                sa += pp.n * b * a
                say += pp.n * b * a * (top - a / 2)
            else:
                A = float(pp.area_transformed.to("in**2").magnitude)
                sa += A
                say += A * float(pp.centroid_y.to("in").magnitude)
        new = say / sa
        if abs(new - ybar) < 1e-9:
            break
        ybar = new
    for i, part in conc:
        pp = props[i]
        top = part.shape.bbox[3] - bottom
        b = part.shape.bbox[2] - part.shape.bbox[0]
        a = max(top - ybar, 0.0)
        log.add(
            f"part.{part.id}.cracked",
            f"Depth of concrete part {part.id} in compression (cracked section)",
            "a = y_top − ȳ (iterated)",
            "{top} − {ybar}",
            {"top": Q_(top, "in"), "ybar": Q_(ybar, "in")},
            Q_(a, "in"),
            source=SRC,
            note="concrete below the neutral axis (in tension) ignored",
        )
        A_c = Q_(b * a, "in**2")
        props[i] = replace(
            pp,
            area=A_c,
            area_transformed=A_c * pp.n,
            centroid_y=Q_(top - a / 2, "in"),
            inertia_own=Q_(b * a**3 / 12, "in**4"),
            area_gross=pp.area_gross or pp.area,
        )
    yq = Q_(ybar, "in")
    contribs = {
        f"I{k + 1}": (p.n * (p.inertia_own + p.area * (p.centroid_y - yq) ** 2)).to("inch**4")
        for k, p in enumerate(props)
    }
    I = log.add(
        "I_cracked",
        "Moment of inertia of the cracked transformed section",
        "I = Σ n·(I₀ + A·d²), cracked concrete ignored",
        " + ".join("{" + k + "}" for k in contribs),
        contribs,
        sum(list(contribs.values())[1:], list(contribs.values())[0]),
        source=SRC,
    )
    log.add(
        "ybar_cracked",
        "Neutral axis of the cracked section, above the bottom",
        "ȳ: Σ n·A·(y − ȳ) = 0 with the concrete above ȳ only",
        "{y}",
        {"y": yq},
        yq,
        source=SRC,
    )
    area = sum((p.area_transformed for p in props[1:]), props[0].area_transformed).to("inch**2")
    return replace(section, area=area, centroid=yq, inertia=I, parts=tuple(props))


def construction_checks(
    member: Member, section: SectionResult, beam, log: StepLog
) -> tuple[list[Check], list[Unchecked]]:
    """The construction stage stated, and the dead load on the steel alone when unshored."""
    key = f"member[{member.id}]"
    out: list[Unchecked] = [
        Unchecked(f"{key}.composite_flexure", "flexural strength of the composite section",
                  "AISC 360-16 §I3.2", "not implemented: check by hand"),
    ]  # fmt: skip
    if beam is not None and float(
        beam.analysis.envelope.M_min.to("lbf*inch").magnitude.min()
    ) < -1e-6 * float(beam.analysis.envelope.M_max.to("lbf*inch").magnitude.max() or 1.0):
        out.append(Unchecked(f"{key}.hogging", "composite section under hogging moment (slab in tension)",
                             "AISC 360-16 §I3.2b", "the cracked section assumes sagging moment"))  # fmt: skip
    how = member.design.get("construction")
    if how is None:
        log.add("construction", "Construction stage", "shored (assumed)", "{w}",
                {"w": "all loads on the composite section"}, "shored", source="assumed by the tool",
                note="assumed: no construction in [member.design]")  # fmt: skip
        out.append(Unchecked(f"{key}.construction", "construction stage (steel alone under wet concrete and dead load)",
                             "AISC 360-16 §I3.1b", "construction not stated: give construction = \"shored\" or \"unshored\""))  # fmt: skip
        return [], out
    log.add("construction", "Construction stage", how, "{w}",
            {"w": "all loads on the composite section" if how == "shored" else "dead load D on the steel alone"},
            how, source="stated in the job file")  # fmt: skip
    if how == "shored" or beam is None:
        return [], out
    steel = [(pt, pp) for pt, pp in zip(member.parts, section.parts) if pt.material.family == "steel"]
    A = sum((pp.area_transformed for _, pp in steel[1:]), steel[0][1].area_transformed)
    ys = (
        sum(
            (pp.area_transformed * pp.centroid_y for _, pp in steel[1:]),
            steel[0][1].area_transformed * steel[0][1].centroid_y,
        )
        / A
    )
    Is = sum(((pp.n * (pp.inertia_own + pp.area * (pp.centroid_y - ys) ** 2)) for _, pp in steel[1:]),
             steel[0][1].n * (steel[0][1].inertia_own + steel[0][1].area * (steel[0][1].centroid_y - ys) ** 2))  # fmt: skip
    Is = log.add("I_steel", "Moment of inertia of the steel alone (transformed to the reference)", "I_s = Σ n·(I₀ + A·d²)",
                 "{I}", {"I": Is.to("inch**4")}, Is.to("inch**4"), source="mechanics of materials")  # fmt: skip
    checks: list[Check] = []
    if "D" in [d.name for d in beam.analysis.cases]:
        for seg in beam.analysis.segments:
            dl = beam.analysis.deflection_max({"D": 1.0}, seg.index)
            if dl is None:
                continue
            ratio = float((section.inertia / Is).to("").magnitude)
            ds = log.add(f"deflection_D_steel.segment{seg.index + 1}",
                         f"Dead-load deflection on the steel alone ({seg.kind} {seg.index + 1})",
                         "Δ_D,s = Δ_D · I_composite / I_steel", "{d} × {Ic} / {Is}",
                         {"d": dl, "Ic": section.inertia, "Is": Is}, (dl * ratio).to("in"),
                         source="mechanics of materials (same load, stiffness of the steel alone)")  # fmt: skip
            checks.append(Check(f"{key}.construction.deflection_D.segment{seg.index + 1}",
                                f"Dead-load deflection on the steel alone, unshored ({seg.kind} {seg.index + 1}): camber",
                                ds, None, None, "INFO", "stated construction: unshored"))  # fmt: skip
    out.append(Unchecked(f"{key}.construction_strength", "strength of the steel alone under construction loads",
                         "AISC 360-16 §I3.1b", "not implemented"))  # fmt: skip
    return checks, out
