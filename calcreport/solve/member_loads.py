"""Loads along the member, wired into the solver: analysis, design shear, member checks and the
zoned connector schedule of each joint.

:func:`analyse_member` runs the stiffness analysis for the member's loads (plus self-weight) under
its combinations (the job's own, or the ASCE 7 basic combinations of the edition and method in the
settings), with the variable cases placed for their worst effect;
:func:`joint_schedule` turns the shear envelope into q(x) = |V(x)|·Q/I at a joint and optimises
its zoned schedule.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from ..model import Combination, Joint, Load, Member, Settings
from ..steps import StepLog
from ..units import Q_, Quantity
from .beam import BeamInputError, BeamResult, analyse, self_weight
from .combinations import (
    LIVE_TYPE,
    SOURCE_DURATION,
    SOURCE_TIME_EFFECT,
    duration_factor,
    source_asd,
    source_lrfd,
    standard_combinations,
    time_effect,
)
from .ec5_factors import SOURCE_KMOD_COMBINATION
from .ec5_loads import SOURCE_EC5_DEFLECTION
from .member_checks import Fibre, bending_checks, deflection_checks, shear_stress_check
from .results import Check, SectionResult, SolveError
from .schedule import Schedule, zoned_schedule
from .section import first_moment_above

__all__ = ["AlongResult", "analyse_member", "joint_schedule", "DEFAULT_DEFLECTION_LIMITS"]

#: Used when the job sets no deflection limits (IBC 2021 Table 1604.3 floor members, from memory).
DEFAULT_DEFLECTION_LIMITS = {"L": 360.0, "total": 240.0}


@dataclass(frozen=True)
class AlongResult:
    """The member's analysis along its length and what the joints and report read from it."""

    analysis: BeamResult
    V_design: Quantity  # largest |V| over all combinations, variable loads in their worst placement
    V_governing: str
    M_design: Quantity  # largest |M|
    M_governing: str
    combinations: tuple[Combination, ...]
    combinations_source: str
    self_weight: Quantity | None
    deflection_limits: dict[str, float]
    checks: tuple[Check, ...]


def _error(exc: BeamInputError):

    return SolveError(exc.key, str(exc))


def analyse_member(
    member: Member, section: SectionResult, settings: Settings, log: StepLog, EI: Quantity | None = None
) -> AlongResult:
    """Analyse the member for its loads; design shear and moment; member checks.

    Sources: matrix structural analysis (stiffness method) and its influence lines; ASCE 7 §2.3.1 /
    §2.4.1 basic combinations of ``settings.load_standard`` (unless the job lists its own), §4.3.3 /
    §4.4 worst placement of variable loads; mechanics of materials for stresses.
    """
    loads = list(member.loads)
    sw = None
    if member.self_weight:
        sw = self_weight(
            [(pp.area_gross or pp.area, p.material.density) for pp, p in zip(section.parts, member.parts)],  # type: ignore[misc]
            log,
        )
        loads.append(Load("D", "uniform", sw, label="self-weight", key=f"member[{member.id}].self_weight"))
    cases = list(dict.fromkeys(ld.case for ld in loads))
    if member.combinations:
        combos, source = tuple(member.combinations), "stated in the job file"
    elif settings.method == "EC5":
        from .ec5_loads import ec5_combinations

        combos, source = ec5_combinations(member, cases, settings)
    else:
        std = settings.load_standard
        combos = tuple(standard_combinations(settings.method, cases, std))
        source = source_lrfd(std) if settings.method == "LRFD" else source_asd(std)
    log.add(
        "combinations",
        "Load combinations",
        "n_comb",
        "{count} combinations of cases {cases}",
        {"count": len(combos), "cases": ", ".join(cases)},
        len(combos),
        source=source,
        note="only combinations whose leading case is present; or-alternatives expanded"
        if not member.combinations
        else "",
    )
    if not combos:
        raise SolveError(
            f"member[{member.id}]",
            "no load combination applies to the cases given; list [[member.combination]] tables",
        )
    if EI is not None:  # plies side by side: Σ E·I of the plies, each about its own axis
        EI = log.add(
            "EI",
            "Flexural rigidity of the plies together",
            "EI = Σ E_i·I_i",
            "{EI}",
            {"EI": EI},
            EI.to("lbf*inch**2"),
            source="mechanics of materials (plies bending about their own axes)",
        )
    else:
        EI = (section.E_ref * section.inertia).to("lbf*inch**2")
        log.add(
            "EI",
            "Flexural rigidity of the transformed section",
            "EI = E_ref · I",
            "{E} · {I}",
            {"E": section.E_ref, "I": section.inertia},
            EI,
            source="mechanics of materials: transformed section",
        )
    from ..model import Support

    span: Any = member.span  # the reader requires a span with loads along the member
    supports = list(member.supports) or [Support(Q_(0.0, "inch")), Support(span)]
    try:
        variable = set(LIVE_TYPE) | {ld.case for ld in loads if ld.variable}
        beam = analyse(
            span,
            supports,
            loads,
            list(combos),
            EI=EI,
            log=log,
            variable=variable,
            standard="EN 1990" if settings.method == "EC5" else settings.load_standard,
        )
    except BeamInputError as exc:
        raise _error(exc) from None
    env = beam.envelope
    vabs = env.V_abs.to("lbf").magnitude
    kv = int(vabs.argmax())
    mpos, mneg = env.M_max.to("lbf*inch").magnitude, env.M_min.to("lbf*inch").magnitude
    kp, kn = int(mpos.argmax()), int(mneg.argmin())
    if abs(mneg[kn]) > abs(mpos[kp]):
        M, Mby = Q_(abs(mneg[kn]), "lbf*inch"), env.M_min_by[kn]
    else:
        M, Mby = Q_(abs(mpos[kp]), "lbf*inch"), env.M_max_by[kp]
    # under EC5 the limits are the job's (EN 1995-1-1 §7.2 gives ranges, not values): none by default
    limits = dict(settings.deflection_limits) or (
        {} if settings.method == "EC5" else dict(DEFAULT_DEFLECTION_LIMITS)
    )
    checks = _member_checks(
        member, section, M, env.V_abs[kv], limits, beam, log.child("checks"), settings=settings
    )
    return AlongResult(
        beam, env.V_abs[kv], env.V_abs_by[kv], M, Mby, combos, source, sw, limits, tuple(checks)
    )


def _member_checks(member, section, M, V, limits, beam, log, settings: Settings | None = None) -> list[Check]:
    if member.plies:  # each ply is checked under its share (solve/plies_checks.py)
        return deflection_checks(beam, limits, log)
    bottom = section.bottom.to("inch").magnitude
    ybar = section.centroid.to("inch").magnitude
    fibres: dict[str, Fibre] = {}
    from .member_kinds import member_type

    # box-beam flanges are axial members (member_box); wood members get bending with the NDS
    # adjustment factors (member_wood): neither takes the bare-Fb check here
    box = member_type(member) in ("panel-web", "wood")
    # under EC5 the stress checks are EN 1995-1-1's (solve/ec5_members.py), never bare Fb / Fv
    ec5 = settings is not None and settings.method == "EC5"
    for part, props in zip(member.parts, section.parts):
        mat = part.material
        if mat.Fb is None or (box and mat.family in ("wood", "glulam")) or ec5:
            continue
        c = max(abs(part.shape.bbox[3] - bottom - ybar), abs(part.shape.bbox[1] - bottom - ybar))
        old = fibres.get(mat.id)
        if old is None or c > old.c.magnitude:
            fibres[mat.id] = Fibre(mat.id, Q_(c, "inch"), props.n, mat.Fb)
    checks = bending_checks(M, section.inertia, list(fibres.values()), log) if fibres else []
    na = None if ec5 else _neutral_axis_shear(member, section, V, log)
    if na is not None:
        checks.append(na)
    if ec5:
        from .ec5_loads import ec5_deflection_sets

        checks += deflection_checks(
            beam, limits, log, sets=ec5_deflection_sets(beam, limits, settings), source=SOURCE_EC5_DEFLECTION
        )
    else:
        checks += deflection_checks(beam, limits, log)
    return checks


def _cut_width(geom, y: float) -> float:
    """Width of a shapely outline along the horizontal line at height y."""
    from shapely.geometry import LineString

    x0, _, x1, _ = geom.bounds
    return geom.intersection(LineString([(x0 - 1, y), (x1 + 1, y)])).length


SOURCE_NOT_CHECKED = "not checked by the tool; check by hand (e.g. panel shear of plywood webs)"


def _neutral_axis_shear(member, section, V, log) -> Check | None:
    """τ at the neutral axis where the parts cut there all give Fv (mechanics of materials)."""
    from ..outlines import is_rectangle, outline

    y = section.centroid.to("inch").magnitude + section.bottom.to("inch").magnitude
    cut = [p for p in member.parts if p.shape.bbox[1] < y < p.shape.bbox[3]]
    if not cut:
        return None
    missing = sorted({p.material.id for p in cut if p.material.Fv is None})
    if missing or any(p.shape.kind == "properties" for p in cut):
        why = (
            f"no Fv given for material {', '.join(missing)}"
            if missing
            else "a part given by its properties is cut there"
        )
        return Check(
            "shear.neutral_axis",
            "Horizontal shear stress at the neutral axis",
            None,
            None,
            None,
            "INFO",
            SOURCE_NOT_CHECKED,
            note=f"not checked: {why}",
        )
    b = sum(
        (p.shape.bbox[2] - p.shape.bbox[0]) if is_rectangle(p.shape) else _cut_width(outline(p.shape), y)
        for p in cut
    )
    try:
        Qna = first_moment_above(member, section, section.centroid.to("inch").magnitude)
    except ValueError:
        return None
    Fv = min((p.material.Fv for p in cut), key=lambda q: q.to("psi").magnitude)
    return shear_stress_check(
        "neutral_axis",
        V,
        Q_(abs(Qna), "inch**3"),
        section.inertia,
        Q_(b, "inch"),
        Fv,
        log,
        label="Horizontal shear stress at the neutral axis",
    )


def duration_demand(
    along: AlongResult, factor_used: float, method: str, log: StepLog, settings: Settings | None = None
):
    """Shear demand normalised for wood load duration, or ``None`` when no combination needs it.

    The connector's value holds one load duration factor C_D (ASD) or time effect factor λ (LRFD),
    ``factor_used``. A combination that calls for a smaller factor (ASD: dead load alone, C_D = 0.9;
    LRFD: 1.4D, λ = 0.6) must be checked with it: its shear is scaled by factor_used / factor_c ≥ 1
    before the envelope is taken. The tool never takes more duration credit than the engineer set
    (ratios below 1 are not applied).
    Source: NDS 2018 §2.3.2 and Table 2.3.2 (ASD); NDS 2018 Appendix N, Table N3 (LRFD).
    """
    lrfd = method == "LRFD"
    sym = "λ" if lrfd else "C_D"
    weights: dict[str, float] = {}
    if method == "EC5":
        from .ec5_loads import kmod_weights

        weights, sym = kmod_weights(along.combinations, factor_used, settings, log), "k_mod"
    for i, cb in enumerate(along.combinations if method != "EC5" else (), 1):
        f_c, case = time_effect(cb) if lrfd else duration_factor(cb)
        log.add(
            f"CD.{i}",
            f"{'Time effect' if lrfd else 'Load duration'} factor of {cb.name}",
            f"{sym},c",
            "governing load in the combination: {case}",
            {"case": case or "—"},
            f_c,
            source=SOURCE_TIME_EFFECT if lrfd else SOURCE_DURATION,
        )
        weights[cb.name] = max(1.0, factor_used / f_c)
    if all(w == 1.0 for w in weights.values()):
        return None
    Vw, by = along.analysis.shear_abs_weighted(weights)
    k = int(Vw.magnitude.argmax())
    V_eff = log.add(
        "V",
        "Design shear for these wood connectors, with load duration",
        f"V' = max over c of |V_c|·{sym} / {sym},c",
        "{V} in {by} at x = {x}, with " + sym + " = {f}",
        {"V": Vw[k], "by": by[k], "x": along.analysis.envelope.x[k], "f": factor_used},
        Vw[k],
        source=SOURCE_KMOD_COMBINATION
        if method == "EC5"
        else (SOURCE_TIME_EFFECT if lrfd else SOURCE_DURATION),
        governs=True,
        positions=("x",),
        note=f"a combination that calls for a smaller {sym} governs once that factor is used",
    )
    return Vw, by, V_eff


def joint_schedule(
    along: AlongResult,
    Q: Quantity,
    section: SectionResult,
    joint: Joint,
    F: Quantity,
    res,
    settings: Settings,
    log: StepLog,
    demand=None,
) -> Schedule:
    """Zoned schedule of one joint from q(x) = |V(x)|·Q/I over the shear envelope.

    ``res`` is the joint's single-spacing result (its s_min, s_max are the governing limits);
    ``demand`` the load-duration-normalised shear of :func:`duration_demand`, when it applies.
    Source: mechanics of materials (q = V·Q/I); zoning rules: common practice, no source.
    """
    env = along.analysis.envelope
    V_abs, by = (env.V_abs, env.V_abs_by) if demand is None else (demand[0], demand[1])
    q = (V_abs * Q / section.inertia).to("lbf/inch")
    nF = (joint.per_row * F).to("lbf")
    s_max = res.s_max if res.s_max is not None else along.analysis.length
    ends = tuple(sg.start for sg in along.analysis.segments[1:])
    return zoned_schedule(
        env.x,
        q,
        along.analysis.length,
        nF,
        settings.spacing_step,
        res.s_min,
        s_max,
        settings.zones_per_half,
        settings.zone_module,
        governing=by,
        log=log,
        segment_ends=ends,
        zones_per_span=settings.zones_per_span,
    )
