"""Fastener lines between plies side by side (issue 14): the connector's design value through the
existing models (:mod:`.connectors`, load perpendicular to grain: ``load_angle = 90``), the
transfer demand of :mod:`.plies` with each combination's load duration factor, the single spacing
(:func:`.spacing.discrete_spacing`) and the zoned schedule (:func:`.schedule.zoned_schedule`).

The lines:

* two plies: one line, driven from the stated face (or through-bolted);
* three plies, driven from the faces: one line from each face into the middle ply, each carrying
  its own interface; the points from the two faces must not meet in the middle ply unless the
  lines are staggered (common practice, no source);
* three plies, through-fastened (bolts): one line in double shear (the middle ply is the main
  member); each shear plane is taken to carry half the double-shear value (assumption: the
  yield modes of NDS 2018 §12.3.1 give the value of both planes together), against the larger of
  the two interfaces' demands.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from ..keys.connectors import fields_for
from ..model import ConnectorSpec, Joint, Member, Part, PlyFastening, Settings
from ..outlines import contact_segments
from ..steps import Phrase, StepLog
from ..units import Q_, Quantity
from . import connectors
from .callout import joint_callout
from .combinations import SOURCE_DURATION, SOURCE_TIME_EFFECT, duration_factor, time_effect
from .plies import PlyShare, TransferDemand
from .results import Check, JointResult, worst
from .schedule import zoned_schedule
from .spacing import combine_limits, discrete_spacing

__all__ = ["PlyLine", "ply_lines", "solve_ply_lines", "default_spacing_max", "SRC_PRACTICE"]

SRC_PRACTICE = "common practice, no source"
#: How the schedule names its demand on a fastener line between plies.
DEMAND = (
    "transfer demand between plies",
    "max over x of |Σ a_k·w(x)|·C_D/C_D,c",
    "statics (load entering one ply passed to the others by share of E·I); spacing s = n·F/t",
)
_IN = "inch"


@dataclass(frozen=True)
class PlyLine:
    """One line of fasteners: the plies on its held side, the ply it bears into, the interfaces it
    serves (indices into the transfer demand) and its shear planes."""

    id: str
    held: tuple[Part, ...]
    other: tuple[Part, ...]
    interfaces: tuple[int, ...]
    planes: int
    label: str


def ply_lines(member: Member) -> tuple[PlyLine, ...]:
    """The fastener lines of a member of plies (see the module docstring)."""
    f = member.ply_fastening
    assert f is not None
    parts = [p.part for p in member.plies]
    if len(parts) == 2:
        held, other = (parts[0], parts[1]) if (f.through or f.face == "left") else (parts[1], parts[0])
        how = "through-bolted" if f.through else f"driven from the {f.face} face"
        return (
            PlyLine(
                f"{parts[0].id}-{parts[1].id}",
                (held,),
                (other,),
                (0,),
                1,
                f"plies {parts[0].id}|{parts[1].id}, {how}",
            ),
        )
    a, b, c = parts
    if f.through:
        return (
            PlyLine(
                f"{a.id}-{b.id}-{c.id}",
                (b,),
                (a, c),
                (0, 1),
                2,
                f"plies {a.id}|{b.id}|{c.id}, through, double shear",
            ),
        )
    return (
        PlyLine(f"{a.id}-{b.id}", (a,), (b,), (0,), 1, f"plies {a.id}|{b.id}, driven from the left face"),
        PlyLine(f"{c.id}-{b.id}", (c,), (b,), (1,), 1, f"plies {b.id}|{c.id}, driven from the right face"),
    )


def default_spacing_max(kind: str) -> Quantity:
    """Largest spacing of ply fasteners when the job sets none: 12 in for nails and screws, 24 in
    for bolts and lag screws (common practice, no source)."""
    return Q_(24.0 if kind in ("wood_bolt", "lag_screw") else 12.0, _IN)


def _spec(f: PlyFastening, line: PlyLine) -> ConnectorSpec:
    """The connector spec of one line: planes from the layout. Bolts and lag screws bear
    perpendicular to grain in wood plies (θ = 90°, NDS 2018 §12.3.3): the line's JointContext
    carries load_angle = 90, which the NDS dowel models apply to the wood members only."""
    names = {fd.name for fd in fields_for(f.connector.kind)}
    p = dict(f.connector.params)
    if "planes" in names:
        p["planes"] = line.planes
    # the angle to grain comes from the joint (JointContext.load_angle = 90 on every ply line)
    return replace(f.connector, params=p)


def _weights(along, factor_used: float | None, method: str, log: StepLog) -> list[float]:
    """Per combination: C_D,used / C_D,c when above 1, else 1 (NDS 2018 §2.3.2; Table N3 in LRFD)."""
    out = []
    lrfd = method == "LRFD"
    for i, cb in enumerate(along.combinations, 1):
        if factor_used is None:
            out.append(1.0)
            continue
        f_c, case = time_effect(cb) if lrfd else duration_factor(cb)
        log.add(f"CD.{i}", f"{'Time effect' if lrfd else 'Load duration'} factor of {cb.name}",
                "λ,c" if lrfd else "C_D,c", "governing load in the combination: {case}", {"case": case or "—"},
                f_c, source=SOURCE_TIME_EFFECT if lrfd else SOURCE_DURATION)  # fmt: skip
        out.append(max(1.0, factor_used / f_c))
    return out


def _overlap_check(
    member: Member, line: PlyLine, spec: ConnectorSpec, staggered: bool, key: str
) -> Check | None:
    """Three plies nailed or screwed from both faces: points from the two faces overlap in the
    middle ply by p_left + p_right − t_middle when positive; they may not share a line unless the
    lines are staggered (common practice, no source)."""
    if len(member.plies) != 3 or line.planes != 1 or spec.kind not in ("nail", "wood_screw", "lag_screw"):
        return None
    L = spec.params.get("length")
    if L is None and spec.kind == "nail" and spec.params.get("size"):
        from .connectors.nail import fastener

        L = Q_(fastener(spec.params, key).L, _IN)
    if L is None:
        return None
    w = [p.part.shape.bbox[2] - p.part.shape.bbox[0] for p in member.plies]
    over = 2 * float(L.to(_IN).magnitude) - w[0] - w[2] - w[1]
    if over <= 0:
        return Check(f"{key}.faces", "Points from the two faces do not meet in the middle ply", Q_(over, _IN), Q_(0.0, _IN),
                     None, "INFO", SRC_PRACTICE, note="no overlap")  # fmt: skip
    return Check(f"{key}.faces", "Points from the two faces overlap in the middle ply", Q_(over, _IN), Q_(0.0, _IN),
                 None if staggered else 1.0 + over, "INFO" if staggered else "NG", SRC_PRACTICE,
                 note="lines staggered (staggered = true)" if staggered else
                 "stagger the lines from the two faces (staggered = true in [member.ply_fastening]) or use shorter fasteners")  # fmt: skip


@dataclass(frozen=True)
class PointNeed:
    """Rows of fasteners a point load needs within its transfer length ℓt on one line (or a
    flitch beam's bearing within d of the support: the stretch ℓd)."""

    index: int
    name: str
    tag: str
    lo: float  # in, the stretch ℓt or ℓd (clipped to the member)
    hi: float
    force: Quantity  # T, the part of the load this line passes (factored, with C_D/C_D,c)
    rows: int  # n_req = ⌈T / (n·F)⌉


def _point_needs(
    member: Member, line: PlyLine, shares, along, w: list[float], nF: Quantity, log: StepLog
) -> list[PointNeed]:
    """Fasteners at each point load: the part of the load this line passes, T = max over c of
    γ_c·|P|·|a_k|·C_D/C_D,c, needs n_req = ⌈T / (n·F)⌉ rows within its transfer length ℓt
    (statics; bolts at each point load: common practice, no source)."""
    from .plies import entry_fractions, interface_coefficients, transfer_length

    out: list[PointNeed] = []
    row = float(nF.to("lbf").magnitude)
    L = float(along.analysis.length.to(_IN).magnitude)
    for i, ld in enumerate(member.loads, 1):
        if ld.kind != "point" or ld.at is None:
            continue
        a_k = interface_coefficients(entry_fractions(member, ld, shares), shares)
        a = max(abs(a_k[k]) for k in line.interfaces)
        P = abs(float(ld.magnitude.to("lbf").magnitude))
        T = max(
            (cb.factors.get(ld.case, 0.0) * P * a * wc for cb, wc in zip(along.combinations, w)), default=0.0
        )
        if T <= 1e-6 * row:
            continue
        x = float(ld.at.to(_IN).magnitude)
        lt = transfer_length(member, ld)
        name = ld.label or ld.key
        Tq = log.add(f"load{i}.T", f"Part of {name} this line passes", "T = max over c of γ_c·|P|·|a_k|·C_D/C_D,c",
                     "{P} × {a}, factored", {"P": Q_(P, "lbf"), "a": round(a, 4)}, Q_(T, "lbf"),
                     source="statics (see the transfer steps of the plies)")  # fmt: skip
        need = int(np.ceil(T / row - 1e-9))
        log.add(f"load{i}.n_req", f"Rows of fasteners needed within the transfer length of {name}", "n_req = ⌈T / (n·F)⌉",
                "⌈{T} / {nF}⌉", {"T": Tq, "nF": nF}, need, source=SRC_PRACTICE + " (bolts at each point load)",
                note="the demand within ℓt is raised to n_req·n·F/ℓt so that the schedule places them")  # fmt: skip
        tag = ld.key.rsplit("load[", 1)[-1].rstrip("]") if "load[" in ld.key else str(i)
        out.append(PointNeed(i, name, tag, max(0.0, x - lt / 2), min(L, x + lt / 2), Tq, need))
    return out


def _bearing_needs(
    member: Member, line: PlyLine, shares, along, w: list[float], nF: Quantity, log: StepLog
) -> list[PointNeed]:
    """Bolts at the bearings of a flitch beam: the plate is not relied on to bear on the supports
    (assumption, recorded); each reaction enters the wood plies by their widths and the part
    R·|a_k| crosses the line within the member's depth d of the support (both sides of an interior
    one): n_req = ⌈R·|a_k| / (n·F)⌉ rows there, R the largest reaction with C_D,used/C_D,c.
    Statics; common practice, no source."""
    from .plies import interface_coefficients

    if not any(s.family == "steel" for s in shares):
        return []
    wood = [0.0 if s.family == "steel" else s.width for s in shares]
    e = tuple(v / sum(wood) for v in wood)
    a = max(abs(interface_coefficients(e, shares)[k]) for k in line.interfaces)
    if a <= 1e-12:
        return []
    names = [cb.name for cb in along.combinations]
    V, _by = along.analysis.shear_abs_weighted(dict(zip(names, w)))
    xs = np.asarray(along.analysis.envelope.x.to(_IN).magnitude)
    Vm = np.asarray(V.to("lbf").magnitude)
    L = float(along.analysis.length.to(_IN).magnitude)
    d = max(s.top for s in shares) - min(s.bottom for s in shares)
    row = float(nF.to("lbf").magnitude)
    out: list[PointNeed] = []
    for i, sup in enumerate(along.analysis.supports, 1):
        x = float(sup.x.to(_IN).magnitude)
        at = np.abs(xs - x) <= 1e-6 * max(L, 1.0)
        R = float(Vm[at].sum()) if at.any() else 0.0  # |V| on both sides: at least the reaction
        T = R * a
        if T <= 1e-6 * row:
            continue
        Tq = log.add(f"support{i}.T", f"Plate's part of the reaction at support {i} crossing this line",
                     "T = R·|a_k|, R = Σ |V| beside the support", "{R} × {a}", {"R": Q_(R, "lbf"), "a": round(a, 4)},
                     Q_(T, "lbf"), source="statics; the plate is not relied on for bearing (assumption)")  # fmt: skip
        need = int(np.ceil(T / row - 1e-9))
        log.add(f"support{i}.n_req", f"Rows of bolts needed within d of support {i}", "n_req = ⌈T / (n·F)⌉", "⌈{T} / {nF}⌉",
                {"T": Tq, "nF": nF}, need, source=SRC_PRACTICE + " (bolts at the bearings)",
                note="the demand within d of the support (ℓd) is raised to n_req·n·F/ℓd so that the schedule places them")  # fmt: skip
        lo, hi = max(0.0, x - d), min(L, x + d)
        log.add(f"support{i}.ld", f"Stretch within d of support {i} holding these rows", "ℓd = min(x + d, L) − max(0, x − d)",
                "min({x} + {d}, {L}) − max(0, {x} − {d})", {"x": Q_(x, _IN), "d": Q_(d, _IN), "L": Q_(L, _IN)},
                Q_(hi - lo, _IN), source="geometry (d = depth of the plies)", positions=("x", "L"))  # fmt: skip
        out.append(PointNeed(i, f"support {i}", f"support{i}", lo, hi, Tq, need))
    return out


def _raise_for_points(xs: np.ndarray, q: np.ndarray, needs: list[PointNeed], nF: Quantity) -> np.ndarray:
    """q(x) within each point load's stretch at least n_req·n·F/ℓt: any spacing the schedule then
    gives there places n_req rows within it (s ≤ ℓt/n_req)."""
    row = float(nF.to("lbf").magnitude)
    out = q.copy()
    for nd in needs:
        m = (xs >= nd.lo) & (xs <= nd.hi)
        out = np.where(m, np.maximum(out, nd.rows * row / max(nd.hi - nd.lo, 1e-9)), out)
    return out


def _point_checks(needs: list[PointNeed], sched) -> list[Check]:
    """The schedule places at least ⌊ℓ / s⌋ rows within any stretch ℓ at spacing s (the largest
    zone spacing met over ℓ is used): n_req ≤ ⌊ℓ / s⌋, ℓ = ℓt at a point load, ℓd within d of a
    flitch beam's support. Common practice, no source."""
    out: list[Check] = []
    if not sched.zones:
        return out
    for nd in needs:
        s = max((float(z.spacing.to(_IN).magnitude) for z in sched.zones
                 if float(z.start.to(_IN).magnitude) < nd.hi and float(z.end.to(_IN).magnitude) > nd.lo), default=None)  # fmt: skip
        if s is None or nd.hi - nd.lo <= 0:
            continue  # a stretch of no length on the member: nothing to place
        have = int(np.floor((nd.hi - nd.lo) / s + 1e-9))
        ok = have >= nd.rows
        bearing = nd.tag.startswith("support")
        # ℓt: a point load's transfer length; ℓd: the stretch within d of a support (clipped to the member)
        sym = "ℓd" if bearing else "ℓt"
        what = (
            f"the bearing at {nd.name} (rows within d of it, ℓd)"
            if bearing
            else f"point load {nd.name} (rows within its transfer length ℓt)"
        )
        key = f"bearing[{nd.index}].fasteners" if bearing else f"load[{nd.tag}].fasteners"
        fix = (
            f"place at least {nd.rows} row(s) within d of {nd.name}: the plate's share of the reaction crosses to the timbers there"
            if bearing
            else f"place at least {nd.rows} row(s) within ℓt at the load, or state a longer transfer_length on the load if the hanger or post spreads it"
        )
        out.append(Check(key, f"Fasteners at {what}",
                         nd.rows, have, nd.rows / have if have else None, "OK" if ok else "NG", SRC_PRACTICE,
                         note="" if ok else fix, phrase=Phrase("rows_within", {"symbol": sym, "s": Q_(s, "in")}) if ok else None))  # fmt: skip
    return out


def solve_ply_lines(
    member: Member,
    along,
    shares: tuple[PlyShare, ...],
    demand: TransferDemand,
    settings: Settings,
    mlog: StepLog,
) -> tuple[JointResult, ...]:
    """Design value, demand, spacing and schedule of every fastener line."""
    f = member.ply_fastening
    assert f is not None
    out = []
    L = along.analysis.length
    for line in ply_lines(member):
        key = f"member[{member.id}].joint[{line.id}]"
        log = mlog.child(f"joint.{line.id}")
        segs = contact_segments(list(line.held), list(line.other))
        contact = sum(((a[0] - b[0]) ** 2 + (a[1] - b[1]) ** 2) ** 0.5 for a, b in segs)
        b = log.add("b", "Depth of the ply contact (fastener rows fit across it)", "b = Σ contact lengths", "{b}",
                    {"b": Q_(contact, _IN)}, Q_(contact, _IN), source="geometry of the placed plies")  # fmt: skip
        spec = _spec(f, line)
        ctx = connectors.JointContext(
            settings.method,
            line.held,
            line.other,
            b,
            settings,
            key,
            tuple(member.parts),
            f.rows,
            load_angle=90.0,
        )
        cap = connectors.design(spec, ctx, log.child("connector"))
        F = cap.value
        if line.planes == 2:
            F = log.add("F_plane", "Design value per shear plane", "F = Z′ / 2", "{Z} / 2", {"Z": cap.value},
                        (cap.value / 2).to("lbf"), source="assumption: the two shear planes share the double-shear value equally",
                        note="checked against the larger of the two interfaces' demands")  # fmt: skip
        w = _weights(along, cap.duration_factor, settings.method, log.child("duration"))
        q = np.zeros_like(demand.x)
        gov = np.full(len(demand.x), -1)
        for k in line.interfaces:
            for c, arr in enumerate(demand.per_combination[k]):
                v = arr * w[c]
                better = v > q
                q = np.where(better, v, q)
                gov = np.where(better, c, gov)
        by = tuple(demand.names[g] if g >= 0 else "—" for g in gov)
        nF = (f.rows * F).to("lbf")
        needs = _point_needs(member, line, shares, along, w, nF, log.child("points"))
        needs += _bearing_needs(member, line, shares, along, w, nF, log.child("bearings"))
        q = _raise_for_points(demand.x, q, needs, nF)
        j = int(q.argmax())
        q_peak = log.add("q", "Largest transfer demand per length along the line", "t = max over x, c of |Σ a_k·w(x)|·C_D/C_D,c",
                         "{t} in {by} at x = {x}", {"t": Q_(float(q[j]), "lbf/inch"), "by": by[j], "x": Q_(float(demand.x[j]), _IN)},
                         Q_(float(q[j]), "lbf/inch"), source="statics (see the transfer steps of the plies)", governs=True,
                         positions=("x",))  # fmt: skip
        s_min = combine_limits(settings.spacing_min, f.spacing_min, cap.spacing_min, pick=max)
        own_max = f.spacing_max if f.spacing_max is not None else default_spacing_max(spec.kind)
        s_max = combine_limits(settings.spacing_max, own_max, cap.spacing_max, pick=min)
        src = (
            "stated in the job file"
            if f.spacing_max is not None
            else f"default largest spacing of ply fasteners ({SRC_PRACTICE})"
        )
        res = discrete_spacing(q_peak, f.rows, F, settings.spacing_step, s_min, s_max, log, src)
        sched = zoned_schedule(
            Q_(demand.x, _IN), Q_(q, "lbf/inch"), L, nF, settings.spacing_step, res.s_min,
            res.s_max if res.s_max is not None else L, settings.zones_per_half, settings.zone_module,
            governing=by, log=log.child("schedule"), segment_ends=tuple(sg.start for sg in along.analysis.segments[1:]),
            zones_per_span=settings.zones_per_span, demand=DEMAND,
        )  # fmt: skip
        checks = list(cap.checks)
        ov = _overlap_check(member, line, spec, f.staggered, "connector")
        if ov is not None:
            checks.append(ov)
        checks += _point_checks(needs, sched)
        checks = [c if c.key.startswith("member[") else replace(c, key=f"{key}.{c.key}") for c in checks]
        status = worst([res.status, sched.status] + [c.status for c in checks])
        out.append(JointResult(
            id=line.id, label=line.label, holds=tuple(p.id for p in line.held), Q=None, shear=along.V_design,
            shear_flow=q_peak, connector=cap.description, connector_source=cap.source, per_row=f.rows,
            capacity=F, capacity_row=nF, continuous=False, spacing_required=res.required,
            spacing_provided=res.provided, spacing_min=res.s_min, spacing_max=res.s_max,
            utilisation=res.utilisation, status=status, reasons=res.reasons, checks=tuple(checks),
            plane=tuple(segs), plane_width=b, steps=tuple(s for s in log.steps if s.key.startswith(log.prefix + ".")),
            schedule=sched,
            callout=joint_callout(joint_record(line, f), member.parts, segs, cap.description, False,
                                  res.provided, sched, b, member.span, through=line.planes == 2),
        ))  # fmt: skip
    return tuple(out)


def joint_record(line: PlyLine, f: PlyFastening) -> Joint:
    """A :class:`Joint` view of a line (for code that lists a member's joints)."""
    return Joint(line.id, tuple(p.id for p in line.held), f.connector, f.rows, line.label,
                 spacing_max=f.spacing_max, spacing_min=f.spacing_min)  # fmt: skip
