"""Slip of mechanical connectors by the γ-method (EN 1995-1-1:2004 Annex B), beside the rigid
V·Q/I result: effective bending stiffness, connector forces, the spacing they need, and the
deflection with (EI)_ef.

Asked for with ``[member.design] slip = true``. :func:`slip_analysis` takes the member's rigid
results (joints with their provided spacing or zoned schedule, checks) and returns a
:class:`SlipResult`, its checks (``member[ID].slip.…``, scope tag ``slip``) and, where the method
does not apply, an :class:`Unchecked` with the reason (the rigid results stand).

* Slip moduli: :mod:`.slip_moduli` (K_ser for deflection, K_u for strength).
* γ, aᵢ, (EI)_ef, stresses, fastener load: :mod:`.slip_gamma`; the layers: :mod:`.slip_layout`.
* Spacing: the provided spacing, or s_ef = 0.75·s_min + 0.25·s_max over the zoned schedule
  (§9.1.3(3)); the single spacing that slip needs is found by iterating spacing → γ → force →
  spacing (:func:`.slip_steps.iterate_spacing`).
* Deflection: the beam is analysed with one EI along its length, so Δ_slip = Δ·(EI)/(EI)_ef,ser.
"""

from __future__ import annotations

from dataclasses import dataclass

from ..model import Member, Settings
from ..steps import StepLog
from ..units import Quantity
from .results import Assumed, Check, JointResult, SectionResult, Unchecked
from .slip_layout import Group, NotApplicable, layout
from .slip_moduli import SlipInputError, route_for, slip_modulus

__all__ = [
    "SlipResult",
    "SlipLayer",
    "SlipJoint",
    "SlipDeflection",
    "slip_analysis",
    "slip_assumed",
    "SOURCE",
]

SOURCE = "EN 1995-1-1:2004 Annex B"
LABEL = "slip of mechanical connectors (partial composite action): stiffness, connector forces, deflection"


@dataclass(frozen=True)
class SlipLayer:
    """One layer of the γ-method: a joint's held parts, or the web (``joint`` None)."""

    name: str
    parts: tuple[str, ...]
    EA: Quantity
    EI: Quantity  # about its own centroid
    gamma_ser: float
    gamma_u: float
    a_ser: Quantity
    a_u: Quantity


@dataclass(frozen=True)
class SlipJoint:
    """One fastened joint, rigid beside slip."""

    joint: str
    K_ser: Quantity  # per connector and shear plane
    K_u: Quantity
    modulus_source: str
    spacing: Quantity  # the spacing γ is found with at strength (provided, or s_ef over the schedule)
    spacing_at: Quantity  # the spacing where the forces are given (largest rigid utilisation)
    force_rigid: Quantity  # per connector, where the utilisation is largest
    force_slip: Quantity
    capacity: Quantity  # per connector
    utilisation_rigid: float
    utilisation_slip: float
    spacing_required_rigid: Quantity | None
    spacing_required_slip: Quantity | None
    governs: str  # "rigid" or "slip"
    spacing_capped: bool = False  # the slip spacing is the joint's largest spacing, not a strength limit


@dataclass(frozen=True)
class SlipDeflection:
    """A deflection check, rigid beside slip."""

    label: str
    rigid: Quantity
    slip: Quantity
    allowed: Quantity
    governs: str


@dataclass(frozen=True)
class SlipResult:
    """The γ-method result of a member (``MemberResult.slip``)."""

    route: str  # "EN 1995-1-1" or "NDS 2018" (slip moduli)
    length: Quantity  # effective length ℓ
    layers: tuple[SlipLayer, ...]
    joints: tuple[SlipJoint, ...]
    EI_rigid: Quantity
    EI_ef_ser: Quantity
    EI_ef_u: Quantity
    deflections: tuple[SlipDeflection, ...]
    iterations: int
    tolerance: float
    notes: tuple[str, ...] = ()


def unchecked(member: Member, reason: str) -> Unchecked:
    return Unchecked(f"member[{member.id}].slip", LABEL, SOURCE, reason)


def slip_analysis(
    member: Member,
    section: SectionResult,
    beam,
    settings: Settings,
    joints: tuple[JointResult, ...],
    checks: tuple[Check, ...],
    steps: list,
    log: StepLog,
) -> tuple[SlipResult | None, tuple[Check, ...], tuple[Unchecked, ...]]:
    """The γ-method for ``member`` when ``[member.design] slip = true`` (else nothing).

    Returns the result, its checks and the Unchecked item (reason) when it cannot run."""
    if not member.design.get("slip"):
        return None, (), ()
    if beam is None:
        return (
            None,
            (),
            (unchecked(member, "needs the span and loads along the member (the effective length)"),),
        )
    if member.joints and all(j.connector.kind == "glue" for j in member.joints):
        info = Check(
            f"member[{member.id}].slip",
            "Connector slip",
            None,
            None,
            None,
            "INFO",
            SOURCE,
            note="glued joints are rigid (γ = 1): the rigid results are the results with slip",
        )
        return None, (info,), ()
    try:
        groups = layout(member, section)
        return _run(member, section, beam, settings, joints, checks, steps, groups, log)
    except (NotApplicable, SlipInputError) as exc:
        return None, (), (unchecked(member, f"{exc}; the rigid results (V·Q/I) stand"),)


def _moduli(g: Group, route: str, member: Member, log: StepLog):
    """K of the joint's connector against each web part it touches; one value or NotApplicable."""
    assert g.joint is not None
    spec = g.joint.connector
    key = f"member[{member.id}].joint[{g.joint.id}].connector"
    out = [
        slip_modulus(spec, g.parts[0], w, route, key, log if i == 0 else StepLog("x"))
        for i, w in enumerate(g.touches)
    ]
    first = out[0]
    for m in out[1:]:
        if (
            abs((m.K_ser - first.K_ser).to("lbf/inch").magnitude)
            > 1e-6 * first.K_ser.to("lbf/inch").magnitude
        ):
            raise NotApplicable(f"joint {g.joint.id}: its connectors lie in planes of different stiffness")
    return first


def _run(member, section, beam, settings, joints, checks, steps, groups: list[Group], log: StepLog):
    from .slip_rows import deflection_rows, joint_rows
    from .slip_steps import effective_length, gamma_steps, joint_spacing, rigid_check, stress_steps

    route = route_for(member.design, settings)
    log.add(
        "route",
        "Slip moduli of the connectors",
        "K from",
        "{route}",
        {"route": route},
        route,
        source="[member.design] slip_moduli"
        if "slip_moduli" in member.design
        else "common practice, no source",
        note=""
        if "slip_moduli" in member.design
        else "chosen by the job's units and method (SI or EC5: EN 1995-1-1)",
    )
    ell = effective_length(beam.analysis.segments, log)
    by_id = {j.id: j for j in joints}
    moduli, spacing = {}, {}
    for g in groups[:-1]:
        assert g.joint is not None
        jl = log.child(f"joint.{g.joint.id}")
        moduli[g.joint.id] = _moduli(g, route, member, jl)
        spacing[g.joint.id] = joint_spacing(by_id[g.joint.id], jl)
    rigid_check(groups, section, log)
    state = gamma_steps(groups, moduli, spacing, by_id, ell, section, log)
    stress_steps(groups, state, beam, log)
    sj, jchecks, iters, tol = joint_rows(member, groups, moduli, spacing, by_id, state, ell, log)
    defl, dchecks = deflection_rows(member, section, state, checks, steps, log)
    notes = (
        "member stresses with slip are given as steps (B.3, B.4); the member's stress checks use the rigid section",
    )
    res = SlipResult(
        route,
        ell,
        tuple(state.layers),
        tuple(sj),
        state.EI_rigid,
        state.EI_ser,
        state.EI_u,
        tuple(defl),
        iters,
        tol,
        notes,
    )
    # the member's stress checks stay on the rigid section: the stresses with slip (B.3, B.4) are
    # steps here, not checked against design values — listed, never silent
    stresses = Unchecked(
        f"member[{member.id}].slip_stresses",
        "stresses in the parts with slip (normal and bending stress per part, largest web shear stress) "
        "against their design values",
        "EN 1995-1-1:2004 Annex B.3, B.4",
        "not implemented: the member's stress checks use the rigid section; the stresses with slip "
        "are shown as derivation steps only",
    )
    return res, tuple(jchecks) + tuple(dchecks), (stresses,)


def slip_assumed(member: Member, settings: Settings, result: SlipResult | None) -> tuple[Assumed, ...]:
    """Values the γ-method took because the job did not state them (the assumed-values page)."""
    if result is None:
        return ()
    out = []
    if "slip_moduli" not in member.design:
        out.append(
            Assumed(
                f"member[{member.id}].design.slip_moduli",
                "source of the connectors' slip moduli",
                result.route,
                'slip_moduli = "EN 1995-1-1" or "NDS 2018" in [member.design]',
                "common practice, no source: EN 1995-1-1 for SI or EC5 jobs, NDS 2018 otherwise",
            )
        )
    if result.route == "EN 1995-1-1":
        for j in member.joints:
            if j.connector.kind == "nail" and j.connector.params.get("slip_modulus") is None:
                out.append(
                    Assumed(
                        f"member[{member.id}].joint[{j.id}].connector.slip_modulus",
                        "nails driven without pre-drilling (K_ser row of EN 1995-1-1 Table 7.1)",
                        "ρ_m^1.5·d^0.8/30",
                        "slip_modulus on the connector (a tested value)",
                        "EN 1995-1-1:2004 Table 7.1",
                    )
                )
    return tuple(out)
