"""Values the tool chose because the job did not state them, recorded as data.

:func:`job_assumed` lists the job-wide ones (settings), :func:`member_assumed` those of one member
(load combinations, deflection limits, load duration, material stresses taken as stated, and every
connector key the job left at its default). Outputs only show these records
(:class:`calcreport.solve.results.Assumed`): the report's assumed-values table and JSON ``assumed``.
"""

from __future__ import annotations

from ..keys.connectors import EC5_KEYS, NDS_ONLY_KEYS
from ..model import Job, Member, Settings
from .results import Assumed, JointResult

__all__ = ["job_assumed", "member_assumed"]

#: Connector keys without a fixed default whose value the model chooses and writes as a step of
#: the same name (the step's result and source are shown).
STEP_DEFAULTS = ("Fyb", "tip_length", "pretension", "hole")

WOOD_KINDS = ("nail", "wood_screw", "lag_screw", "wood_bolt")


def _settings_assumed(s: Settings, any_loads: bool) -> list[Assumed]:
    given = set(s.given)
    out: list[Assumed] = []

    def add(key: str, label: str, value, where: str, source: str = "", when: bool = True) -> None:
        if key not in given and when:
            out.append(Assumed(f"settings.{key}", label, value, where, source))

    add("units", "unit system", s.units, '[settings] units = "US" or "SI"')
    add("method", "design method", s.method, '[settings] method = "ASD", "LRFD" or "EC5"')
    if s.method == "EC5":
        add(
            "gamma_M_connections",
            "partial factor γ_M of connections",
            1.3,
            "[settings] gamma_M_connections (the national value)",
            "EN 1995-1-1:2004 Table 2.3",
        )
    add(
        "spacing_step",
        "step the practical spacing is rounded down to",
        s.spacing_step,
        "[settings] spacing_step",
    )
    add(
        "spacing_max",
        "job-wide maximum connector spacing",
        "none (only the connector's own limits)",
        "[settings] spacing_max",
    )
    add(
        "spacing_min",
        "job-wide minimum connector spacing",
        "none (only the connector's own limits)",
        "[settings] spacing_min",
    )
    add(
        "zones_per_half",
        "zones per half of the member in a zoned schedule",
        s.zones_per_half,
        "[settings] zones_per_half",
        when=any_loads,
    )
    add(
        "zone_module",
        "module of zone lengths in a zoned schedule",
        "each zone's own spacing",
        "[settings] zone_module",
        when=any_loads,
    )
    if not s.deflection_limits and any_loads and s.method != "EC5":
        from .member_loads import DEFAULT_DEFLECTION_LIMITS

        text = ", ".join(f"{k}: span/{v:g}" for k, v in DEFAULT_DEFLECTION_LIMITS.items())
        out.append(
            Assumed(
                "settings.deflection_limits",
                "deflection limits",
                text,
                "[settings.deflection_limits] L = 360, total = 240 …",
                "IBC 2021 Table 1604.3 (floor members)",
            )
        )
    return out


def job_assumed(job: Job) -> tuple[Assumed, ...]:
    """Job-wide values the tool chose (settings the job does not state)."""
    any_loads = any(m.loads or m.self_weight for m in job.members)
    return tuple(_settings_assumed(job.settings, any_loads))


def _loads_assumed(member: Member, settings: Settings) -> list[Assumed]:
    pre = f"member[{member.id}]"
    out: list[Assumed] = []
    if not (member.loads or member.self_weight):
        return out
    cases = {ld.case for ld in member.loads}
    if not member.combinations and settings.method == "EC5":
        out.append(
            Assumed(
                f"{pre}.combination",
                "load combinations (standard and partial factors)",
                "EN 1990 (6.10) with γ_G = 1.35 (1.00 favourable), γ_Q = 1.5",
                "[[member.combination]] name, factors",
                "EN 1990:2002 Table A1.2(B) recommended values",
            )
        )
    elif not member.combinations:
        std = (
            "ASCE 7-22 §2.3.1 (strength)"
            if settings.method == "LRFD"
            else "ASCE 7-22 §2.4.1 (allowable stress)"
        )
        out.append(
            Assumed(
                f"{pre}.combination",
                "load combinations (standard and edition)",
                f"basic combinations of {std}",
                "[[member.combination]] name, factors",
                std,
            )
        )
    live = sorted(c for c in cases if c in ("L", "Lr", "S", "R"))
    if live and len(member.supports) > 2:
        out.append(
            Assumed(
                f"{pre}.load",
                "placement of live-type loads",
                f"cases {', '.join(live)} on every pattern of loaded spans",
                "fixed rule of the tool (no key)",
                "common practice, no source (pattern loading)",
            )
        )
    if not member.self_weight:
        out.append(
            Assumed(
                f"{pre}.self_weight",
                "self-weight of the member",
                "not included",
                "[[member]] self_weight = true",
            )
        )
    if settings.method == "ASD" and any(j.connector.kind in WOOD_KINDS for j in member.joints):
        if "R" in cases:
            out.append(
                Assumed(
                    f"{pre}.load",
                    "load duration factor of rain load R",
                    1.0,
                    "[[member.combination]] or the connector's CD",
                    "no row in NDS 2018 Table 2.3.2: taken as ten years (conservative)",
                )
            )
        own = sorted(c for c in cases if c not in ("D", "L", "Lr", "S", "R", "W"))
        if own:
            out.append(
                Assumed(
                    f"{pre}.load",
                    f"load duration factor of case {', '.join(own)}",
                    0.9,
                    "the connector's CD",
                    "taken as permanent (conservative), NDS 2018 Table 2.3.2",
                )
            )
    return out


def _materials_assumed(member: Member) -> list[Assumed]:
    out: list[Assumed] = []
    seen: set[str] = set()
    for p in member.parts:
        m = p.material
        if m.id in seen or m.family != "wood" or (m.Fb is None and m.Fv is None):
            continue
        seen.add(m.id)
        out.append(
            Assumed(
                f"material[{m.id}].Fb",
                f"design stresses Fb, Fv of {m.id}",
                "used as stated: adjustment factors (C_D, C_M, C_t, C_F, C_r, C_L) not applied by the tool",
                "[[material]] Fb, Fv: give the adjusted values",
            )
        )
    return out


def _connector_assumed(member: Member, settings: Settings, joints: tuple[JointResult, ...]) -> list[Assumed]:
    from . import connectors

    out: list[Assumed] = []
    for joint, jr in zip(member.joints, joints):
        spec = joint.connector
        pre = f"member[{member.id}].joint[{joint.id}].connector"
        given = set(spec.given)
        try:
            fields = connectors.model_for(spec.kind).FIELDS
        except (KeyError, AttributeError):
            continue
        names = {f.name for f in fields}
        for f in fields:
            if f.name in given or f.kind == "text" or f.required:
                continue
            if f.name == "time_effect" and settings.method != "LRFD":
                continue
            if settings.method == "EC5" and f.name in NDS_ONLY_KEYS:  # refused under EC5
                continue
            if settings.method != "EC5" and f.name in EC5_KEYS.get(spec.kind, ()):
                continue
            if f.name == "steel_form" and not any(p.material.family == "steel" for p in member.parts):
                continue
            if f.default is not None:
                out.append(
                    Assumed(f"{pre}.{f.name}", f.help, f.default, f"[member.joint.connector] {f.name}")
                )
            elif f.name in STEP_DEFAULTS:
                step = next((s for s in jr.steps if s.key.endswith(f".connector.{f.name}")), None)
                if step is not None:
                    out.append(
                        Assumed(
                            f"{pre}.{f.name}",
                            f.help,
                            step.result,
                            f"[member.joint.connector] {f.name}",
                            step.source,
                        )
                    )
        if settings.method == "EC5" and spec.kind in EC5_KEYS and "F_ax_Rk" not in given:
            out.append(
                Assumed(
                    f"{pre}.F_ax_Rk",
                    "axial withdrawal capacity for the rope effect",
                    "none: the rope effect is not counted (conservative)",
                    "[member.joint.connector] F_ax_Rk",
                    "EN 1995-1-1:2004 §8.2.2(2)",
                )
            )
        size = str(spec.params.get("size") or "").lower()
        if spec.kind == "nail" and size and not any(w in size for w in ("common", "box", "sinker", "spike")):
            out.append(
                Assumed(
                    f"{pre}.size",
                    "type of nail (the size gives a pennyweight only)",
                    "common",
                    '[member.joint.connector] size = "16d common", "16d box", "16d sinker"',
                    "NDS 2018 Appendix L (common wire nail dimensions)",
                )
            )
        if "CD" in names and "CD" not in given and settings.method == "ASD":
            value = settings.load_duration if settings.load_duration is not None else 1.0
            out.append(
                Assumed(
                    f"{pre}.CD",
                    "load duration factor C_D in the connector value"
                    + (" (combinations that call for a smaller C_D are scaled)" if member.loads else ""),
                    value,
                    "[member.joint.connector] CD or [settings] load_duration",
                    "NDS 2018 §2.3.2",
                )
            )
    return out


def member_assumed(
    member: Member, settings: Settings, joints: tuple[JointResult, ...], beam=None
) -> tuple[Assumed, ...]:
    """Values the tool chose for ``member`` because the job did not state them."""
    return tuple(
        _loads_assumed(member, settings)
        + _materials_assumed(member)
        + _connector_assumed(member, settings, joints)
    )
