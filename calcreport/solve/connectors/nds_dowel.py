"""Design of one wood dowel-type fastener (nail, spike, wood screw, lag screw, bolt) per NDS 2018.

Shared by the ``nail``, ``wood_screw``, ``lag_screw`` and ``wood_bolt`` models: finds the side and
main members, their thicknesses and bearing strengths, the yield modes, the adjusted value and
the detailing checks. Units inside: in, lbf, psi (floats); steps carry quantities.

Members. The *side member* is the one the fastener head (or, for a bolt, the nut side) is in; the
*main member* receives the point. By default (``side_member = "auto"``) the side member is the part
at the plane that is thinner perpendicular to the plane (the held part on a tie); with
``planes = 2`` the held part is the main (middle) member and the other parts are the two side
members. Thicknesses are measured perpendicular to the shear plane (see :mod:`.geometry`) unless
``side_thickness`` / ``main_thickness`` are given; a step states which was used.

Penetration. NDS 2018 computes lateral values of nails, spikes and screws directly with the
dowel bearing length in the main member, lm = p (penetration, less the tapered tip for lag
screws), and requires a minimum penetration (6D for nails, spikes and wood screws, 4D for lag
screws); it no longer applies a separate partial-penetration factor (older editions' p/12D
style reduction). A penetration below the minimum is reported NG.
"""

from __future__ import annotations

from dataclasses import dataclass

from ...model import ConnectorSpec, Part
from ...steps import StepLog
from ...units import Q_
from ..results import Capacity, Check
from . import ConnectorError
from .nds_bearing import bearing, member_angles, steel_case
from .nds_detailing import detailing
from .nds_factors import adjust
from .nds_fit import fastener_fit
from .nds_yield import NDS, k_theta, log_yield_modes, yield_modes
from .shear_plane import find_contact, thickness_normal

__all__ = ["Fastener", "design_dowel", "screw_diameters"]


def screw_diameters(
    p: dict, key: str, catalog: dict, size_key: str, example: str, what: str, threads_default: bool
):
    """Shank D, root Dr and the diameter Dy used in the yield equations (Dr when the threads lie
    in the shear plane) of a screw or lag screw, from its catalogue size or given diameters.

    Source: NDS-2018 §12.3.7 (dowel diameter of threaded fasteners: root diameter where threads
    are in the shear plane); sizes from the NDS screw tables via ``catalog``.
    Returns ``(D, Dr, Dy, threads, note)`` in inches.
    """
    from .nds_catalog import CATALOG_SOURCE

    if p.get("size"):
        s = catalog.get(size_key)
        if s is None:
            raise ConnectorError(f"{key}.size", f"expected {what} such as {example}")
        D, Dr, src = s.D, s.Dr, CATALOG_SOURCE
    elif p.get("diameter") is not None:
        D = p["diameter"].to("in").magnitude
        Dr = p["root_diameter"].to("in").magnitude if p.get("root_diameter") is not None else D
        src = "job file"
    else:
        raise ConnectorError(f"{key}.size", f"expected size (e.g. {example.split(',')[0]}) or diameter")
    threads = bool(p.get("threads_in_plane", threads_default))
    note = ("root diameter Dr, threads in the shear plane" if threads else "shank diameter") + f" ({src})"
    return D, Dr, (Dr if threads else D), threads, note


@dataclass(frozen=True)
class Fastener:
    """What the model tells the shared design routine about its fastener."""

    kind: str  # "nail", "wood_screw", "lag_screw", "bolt"
    description: str
    D: float  # nominal (shank) diameter, in
    Dy: float  # diameter used in the yield equations (root diameter when threads bear), in
    L: float | None  # length (None for a through bolt), in
    Fyb: float  # psi
    fyb_source: str
    min_pen: float = 6.0  # minimum penetration in diameters
    tip: float = 0.0  # tapered tip length deducted from the penetration, in
    reduced_rd: bool = False  # threaded, D ≥ 1/4 in with root < 1/4 in: Rd = KD·Kθ
    dy_note: str = ""


def _members(p: dict, ctx, key: str):
    c = find_contact(ctx.held, ctx.other)
    if c is None and (p.get("side_thickness") is None or p.get("main_thickness") is None):
        raise ConnectorError(
            f"{key}.side_thickness",
            "expected side_thickness and main_thickness (lengths): the held and other "
            "parts do not touch, so their thicknesses cannot be measured",
        )
    held = c.held if c else ctx.held[0]
    other = c.other if c else ctx.other[0]
    planes = p.get("planes") or 1
    choice = p.get("side_member") or "auto"
    if planes == 2:
        why = "double shear: the held part is the main (middle) member"
        if c is not None:
            # The thinner of the side members bounds ls (NDS-2018 Table 12.3.1A, double shear).
            for o in ctx.other:
                co = find_contact((held,), (o,))
                if co is not None and thickness_normal(o, co) < thickness_normal(other, c) - 1e-9:
                    c, other = co, o
                    why += "; the thinner of its side members"
        side, main = other, held
    elif choice == "held":
        side, main, why = held, other, "side member = held part (as given)"
    elif choice == "other":
        side, main, why = other, held, "side member = other part (as given)"
    else:
        th = thickness_normal(held, c) if c else 0.0
        to = thickness_normal(other, c) if c else 0.0
        if c and to < th - 1e-9:
            side, main, why = other, held, "side member = the thinner part at the plane (the other part)"
        else:
            side, main, why = held, other, "side member = the held part (thinner or equal at the plane)"
    return c, side, main, why


def _thickness(log: StepLog, name: str, label: str, given, part: Part, c, why: str) -> float:
    if given is not None:
        t = given.to("in").magnitude
        log.add(
            name, label, name, "{t}", {"t": given}, given.to("in"), source="job file", note=f"given; {why}"
        )
    else:
        t = thickness_normal(part, c)
        log.add(
            name,
            label,
            name,
            "{t}",
            {"t": Q_(t, "in")},
            Q_(t, "in"),
            source="geometry of the parts",
            note=f"part {part.id} measured perpendicular to the {c.orientation} shear plane; {why}",
        )
    return t


def design_dowel(
    spec: ConnectorSpec, ctx, log: StepLog, f: Fastener, *, toe_nail: bool = False, diaphragm: bool = False
) -> Capacity:
    """Reference and adjusted lateral design value of one fastener, with detailing checks.

    Source: NDS-2018 §12.3 (yield limit equations), §11.3 (adjustment), §12.5 (geometry).
    """
    p = spec.params
    key = f"{ctx.key}.connector"
    planes = p.get("planes") or 1
    c, side, main, why = _members(p, ctx, key)
    ts = _thickness(log, "ts", "Side member thickness", p.get("side_thickness"), side, c, why)
    tm = _thickness(log, "tm", "Main member thickness", p.get("main_thickness"), main, c, why)
    if side.material.family == "steel" and main.material.family == "steel":
        raise ConnectorError(
            f"{key}.type",
            "expected a wood member on at least one side for an NDS "
            'fastener; for steel plates use type = "steel_bolt"',
        )
    checks: list[Check] = []
    D = f.D
    faces = 1
    if f.L is None:
        ls, lm = ts, tm
        log.add(
            "ls",
            "Bearing length in the side member",
            "ls = ts",
            "{ts}",
            {"ts": Q_(ts, "in")},
            Q_(ls, "in"),
            source=f"{NDS} §12.3.5",
            note="bolt through both members",
        )
        log.add(
            "lm",
            "Bearing length in the main member",
            "lm = tm",
            "{tm}",
            {"tm": Q_(tm, "in")},
            Q_(lm, "in"),
            source=f"{NDS} §12.3.5",
        )
    else:
        faces = fastener_fit(log, p, ctx, c, side, main, ts, tm, f.L, planes, key, checks, f.kind == "nail")
        if planes == 1:
            pen = min(f.L - ts, tm) if f.L - ts > 0 else f.L - ts
            tmpl = "min({L} − {ts}, {tm})"
            vals = {"L": Q_(f.L, "in"), "ts": Q_(ts, "in"), "tm": Q_(tm, "in")}
        else:
            pen = f.L - ts - tm
            tmpl, vals = "{L} − {ts} − {tm}", {"L": Q_(f.L, "in"), "ts": Q_(ts, "in"), "tm": Q_(tm, "in")}
        if pen <= 0:
            raise ConnectorError(
                f"{key}.size",
                "expected a fastener longer than the members it passes "
                "through before the last one (it does not reach the member it must hold)",
            )
        log.add(
            "p",
            "Penetration into the " + ("main" if planes == 1 else "far side") + " member",
            "p = min(L − ts, tm)" if planes == 1 else "p = L − ts − tm",
            tmpl,
            vals,
            Q_(pen, "in"),
            source="geometry" if planes != 1 else f"{NDS} §12.3.5 (penetration within the main member)",
            note="the point continues beyond the main member; only tm bears in it"
            if planes == 1 and f.L - ts > tm + 1e-9
            else "",
        )
        pmin = log.add(
            "p_min",
            "Minimum penetration for lateral design values",
            f"p_min = {f.min_pen:g}·D",
            "{k} × {D}",
            {"k": f.min_pen, "D": Q_(D, "in")},
            Q_(f.min_pen * D, "in"),
            source=f"{NDS} Chapter 12 minimum penetration",
            note="6D for nails, spikes and wood screws; 4D for lag screws",
        ).magnitude
        checks.append(
            Check(
                f"{key}.penetration",
                "Penetration at least the minimum",
                Q_(pmin, "in"),
                Q_(pen, "in"),
                pmin / pen,
                "OK" if pen >= pmin - 1e-9 else "NG",
                source=f"{NDS} Chapter 12 minimum penetration {'6D' if f.min_pen == 6 else '4D'}",
                note="lateral values may not be used with less penetration",
                step=f"{log.prefix}.p_min",
            )
        )
        if planes == 1:
            lm = min(f.L - ts - f.tip, tm)
            ls = ts
            log.add(
                "lm",
                "Dowel bearing length in the main member",
                "lm = min(L − ts − E, tm)",
                "min({L} − {ts} − {E}, {tm})",
                {"L": Q_(f.L, "in"), "ts": Q_(ts, "in"), "E": Q_(f.tip, "in"), "tm": Q_(tm, "in")},
                Q_(lm, "in"),
                source=f"{NDS} §12.3.5",
                note="E = tapered tip length" if f.tip else "no tip deduction for this fastener",
            )
            log.add(
                "ls",
                "Dowel bearing length in the side member",
                "ls = ts",
                "{ts}",
                {"ts": Q_(ts, "in")},
                Q_(ls, "in"),
                source=f"{NDS} §12.3.5",
            )
        else:
            lm = tm
            ls = min(ts, pen - f.tip)
            log.add(
                "lm",
                "Dowel bearing length in the main member",
                "lm = tm",
                "{tm}",
                {"tm": Q_(tm, "in")},
                Q_(lm, "in"),
                source=f"{NDS} §12.3.5",
            )
            log.add(
                "ls",
                "Dowel bearing length in each side member",
                "ls = min(ts, p − E)",
                "min({ts}, {p} − {E})",
                {"ts": Q_(ts, "in"), "p": Q_(pen, "in"), "E": Q_(f.tip, "in")},
                Q_(ls, "in"),
                source=f"{NDS} §12.3.5",
                note="the lesser bearing of the two side members",
            )
        if lm <= 0 or ls <= 0:
            raise ConnectorError(
                f"{key}.size",
                "expected a longer fastener: no bearing length remains in the main member after the tip",
            )
    ang = member_angles(log, p, ctx, side, main, D, key)
    Fes = bearing(log, p, side, "side", D, ts, ang.side, key)
    Fem = bearing(log, p, main, "main", D, tm, ang.main, key)
    log.add(
        "D",
        "Diameter used in the yield equations",
        "D",
        "{D}",
        {"D": Q_(f.Dy, "in")},
        Q_(f.Dy, "in"),
        source=f"{NDS} §12.3.7",
        note=f.dy_note or "shank diameter",
    )
    log.add(
        "Fyb",
        "Dowel bending yield strength",
        "Fyb",
        "{Fyb}",
        {"Fyb": Q_(f.Fyb, "psi")},
        Q_(f.Fyb, "psi"),
        source=f.fyb_source,
    )
    theta = ang.theta
    if theta > 0 and (D >= 0.25 or f.reduced_rd):
        log.add(
            "K_theta",
            "Load-angle term of the reduction term Rd",
            "Kθ = 1 + 0.25·(θ/90)",
            "1 + 0.25 × ({th} / 90)",
            {"th": theta},
            k_theta(theta),
            source=f"{NDS} Table 12.3.1B",
            note="θ = the largest angle of load to grain of the wood members",
        )
    modes = yield_modes(f.Dy, lm, ls, Fem, Fes, f.Fyb, theta, planes, f.reduced_rd)
    gov = log_yield_modes(log, modes, planes)
    Z = log.add(
        "Z",
        "Reference lateral design value (governing yield mode)",
        "Z = min(Z_modes)",
        "{Z}",
        {"Z": Q_(gov.Z, "lbf")},
        Q_(gov.Z, "lbf"),
        source=f"{NDS} §12.3.1",
        note=f"mode {gov.mode} governs",
    ).magnitude
    steel_side = side.material.family == "steel" or main.material.family == "steel"
    Zp, used = adjust(
        log.child("adj"),
        Z,
        p,
        ctx,
        D=D,
        fastener=f.kind,
        side=side,
        main=main,
        steel_side=steel_side,
        toe_nail=toe_nail,
        diaphragm=diaphragm,
    )
    lines = -(-max(getattr(ctx, "per_row", 1), 1) // faces)  # per face, rounded up
    case = steel_case(side, main, planes, key)
    if case is not None:
        checks.append(case)
    smin, smax, lsrc = detailing(
        log.child("detail"),
        checks,
        key,
        f.kind,
        D,
        c,
        _wood_length(side, main, ls, lm, planes),
        theta,
        lines,
        ply=float(getattr(ctx, "load_angle", 0.0) or 0.0) > 0,
    )
    return Capacity(
        value=Q_(Zp, "lbf"),
        continuous=False,
        description=f.description,
        source=f"{NDS} §12.3 yield limit equations, Table 11.3.1 adjustment",
        checks=tuple(checks),
        spacing_min=smin,
        spacing_max=smax,
        limits_source=lsrc,
        duration_factor=used.get("CD", used.get("λ")),
    )


def _wood_length(side: Part, main: Part, ls: float, lm: float, planes: int) -> float:
    """Bearing length l for the geometry tables: the lesser of the fastener length in the wood
    main member and its total length in the wood side member(s). Source: NDS-2018 Table 12.5.1C
    footnote (from memory). With no wood member (refused earlier) the lesser of lm and ls."""
    lengths = []
    if main.material.family != "steel":
        lengths.append(lm)
    if side.material.family != "steel":
        lengths.append(ls * planes)
    return min(lengths) if lengths else min(lm, ls)
