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
from .nds_catalog import species_g
from .nds_factors import adjust
from .nds_fit import fastener_fit
from .nds_yield import (
    NDS,
    fe_parallel,
    fe_perpendicular,
    fe_small,
    fe_steel,
    hankinson,
    log_yield_modes,
    yield_modes,
)
from .shear_plane import across_check, find_contact, thickness_normal

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
        side, main, why = other, held, "double shear: the held part is the main (middle) member"
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


def plywood_g(mat) -> tuple[float, str]:
    """Specific gravity of a wood structural panel without a G: Structural I and Marine plywood
    0.50, other plywood grades 0.42 (the lower, used when the grade is not stated).
    Source: NDS-2018 Table 12.3.3B (from memory). The grade is read from the material's ``grade``
    (or, failing that, its name)."""
    text = f"{mat.extra.get('grade') or ''} {mat.name}".lower()
    if "structural i" in text or "structural 1" in text or "marine" in text:
        return 0.50, f"material {mat.id}: Structural I / Marine plywood, NDS-2018 Table 12.3.3B (from memory)"
    return 0.42, (
        f"material {mat.id}: plywood of other or unstated grade, NDS-2018 Table 12.3.3B "
        "(from memory; the lower panel value)"
    )


def _specific_gravity(log: StepLog, p: dict, part: Part, which: str, key: str) -> float:
    if p.get(f"G_{which}") is not None:
        g, src = p[f"G_{which}"], "given for this connector"
    elif part.material.G is not None:
        g, src = part.material.G, f"material {part.material.id}"
    elif part.material.family == "plywood" and not p.get("species"):
        g, src = plywood_g(part.material)
    elif p.get("species"):
        g = species_g(p["species"])
        if g is None:
            raise ConnectorError(
                f"{key}.species",
                "expected a species combination of NDS Table 12.3.3A, "
                'e.g. "Douglas Fir-Larch", "Southern Pine", "Hem-Fir", "Spruce-Pine-Fir"',
            )
        src = f"species {p['species']}, NDS-2018 Table 12.3.3A (from memory)"
    else:
        raise ConnectorError(
            f"{key}.G_{which}",
            f"expected G_{which} (specific gravity), a species, or a G on material {part.material.id}",
        )
    log.add(
        f"G_{which}", f"Specific gravity of the {which} member", f"G_{which}", "{G}", {"G": g}, g, source=src
    )
    return g


def _bearing(
    log: StepLog, p: dict, part: Part, which: str, f: Fastener, t: float, theta: float, key: str
) -> float:
    """Dowel bearing strength (psi) of the side or main member, with its steps."""
    sym = "Fes" if which == "side" else "Fem"
    mat = part.material
    if mat.family == "steel":
        if mat.Fu is None:
            raise ConnectorError(
                f"{key}.side_member",
                f"expected an Fu on steel material {mat.id} (needed for its dowel bearing strength)",
            )
        Fu = mat.Fu.to("psi").magnitude
        fe, mult, form = fe_steel(Fu, t, p.get("steel_form") or "auto")
        log.add(
            sym,
            f"Dowel bearing strength of the {which} member (steel)",
            f"{sym} = k·Fu",
            "{k} × {Fu}",
            {"k": mult, "Fu": mat.Fu},
            Q_(fe, "psi"),
            source=f"{NDS} §12.3.4, Appendix I (from memory)",
            note=f"{form.replace('_', '-')} steel"
            + (" (t ≥ 1/4 in)" if form == "hot_rolled" else " (t < 1/4 in)"),
        )
        return fe
    if mat.family not in ("wood", "plywood", "other"):
        raise ConnectorError(
            f"{key}.side_member",
            f"expected wood, plywood or steel members; material {mat.id} is {mat.family}",
        )
    G = _specific_gravity(log, p, part, which, key)
    src = f"{NDS} Table 12.3.3 footnote 2"
    note = (
        "NDS tables tabulate Fe rounded (to 50 psi for D < 1/4 in, e.g. 4650 psi at G = 0.50); "
        "the equation is used here unrounded"
    )
    if f.D < 0.25:
        return (
            log.add(
                sym,
                f"Dowel bearing strength of the {which} member",
                f"{sym} = 16600·G^1.84",
                "16600 × {G}^1.84",
                {"G": G},
                Q_(fe_small(G), "psi"),
                source=src,
                note=note,
            )
            .to("psi")
            .magnitude
        )
    fpar = fe_parallel(G)
    fpar_q = log.add(
        f"{sym}_par",
        f"Dowel bearing strength parallel to grain, {which} member",
        f"{sym}∥ = 11200·G",
        "11200 × {G}",
        {"G": G},
        Q_(fpar, "psi"),
        source=src,
    )
    if theta <= 0:
        return fpar
    fperp = fe_perpendicular(G, f.D)
    fperp_q = log.add(
        f"{sym}_perp",
        f"Dowel bearing strength perpendicular to grain, {which} member",
        f"{sym}⊥ = 6100·G^1.45 / √D",
        "6100 × {G}^1.45 / √{D}",
        {"G": G, "D": Q_(f.D, "in")},
        Q_(fperp, "psi"),
        source=src,
    )
    fe = hankinson(fpar, fperp, theta)
    log.add(
        sym,
        f"Dowel bearing strength at the load angle, {which} member",
        f"{sym}θ = Fe∥·Fe⊥ / (Fe∥·sin²θ + Fe⊥·cos²θ)",
        "{par} × {perp} / ({par} × sin²({th}°) + {perp} × cos²({th}°))",
        {"par": fpar_q, "perp": fperp_q, "th": float(theta)},
        Q_(fe, "psi"),
        source=f"{NDS} §12.3.3.2, Appendix J (Hankinson formula)",
    )
    return fe


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
        pmin = f.min_pen * D
        checks.append(
            Check(
                f"{key}.penetration",
                "Penetration at least the minimum",
                Q_(pmin, "in"),
                Q_(pen, "in"),
                pmin / pen,
                "OK" if pen >= pmin - 1e-9 else "NG",
                source=f"{NDS} Chapter 12 minimum penetration "
                f"{'6D' if f.min_pen == 6 else '4D'} (from memory)",
                note="lateral values may not be used with less penetration",
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
    th_s, th_m = p.get("angle_side") or 0.0, p.get("angle_main") or 0.0
    Fes = _bearing(log, p, side, "side", f, ts, th_s, key)
    Fem = _bearing(log, p, main, "main", f, tm, th_m, key)
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
    theta = max(th_s, th_m)
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
    steel_side = side.material.family == "steel"
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
    smin, smax, lsrc = _detailing(checks, key, f, c, ls, lm, theta, lines)
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


def _detailing(
    checks: list[Check], key: str, f: Fastener, c, ls: float, lm: float, theta: float, lines: int = 1
):
    """Spacing, end and edge distance (NDS-2018 §12.5.1 for D ≥ 1/4 in; nails: common practice).
    ``lines``: fasteners of one row side by side across the contact (from one face)."""
    D = f.D
    half = (c.hi - c.lo) / 2.0 if c else None
    if D >= 0.25 and f.kind != "nail":
        src = f"{NDS} Tables 12.5.1A-12.5.1D (from memory)"
        l_over_d = min(lm, ls) / D
        edge = 1.5 * D
        note = (
            "load parallel to grain, l/D ≤ 6: 1.5D"
            if l_over_d <= 6
            else ("l/D > 6: the greater of 1.5D and half the spacing between rows")
        )
        if theta > 0:
            edge, note = 4.0 * D, "loaded edge with load perpendicular to grain: 4D"
        if half is not None:
            checks.append(
                across_check(
                    key, c, lines, edge, 1.5 * D, src, note, "Table 12.5.1D: 1.5D between rows, load parallel"
                )
            )
        checks.append(
            Check(
                f"{key}.end",
                "End distance from the member end (full design value)",
                Q_(7.0 * D, "in"),
                None,
                None,
                "INFO",
                source=src,
                note="parallel to grain: 7D in tension (softwoods; 5D hardwoods), 4D in compression; "
                "minimum 3.5D / 2D with CΔ reduction",
            )
        )
        checks.append(
            Check(
                f"{key}.row_spacing",
                "Spacing between rows",
                Q_(1.5 * D, "in"),
                None,
                None,
                "INFO",
                source=src,
                note="load parallel to grain: 1.5D, rows not over 5 in apart",
            )
        )
        return Q_(4.0 * D, "in"), None, src + ": 4D along the row for CΔ = 1.0 (3D absolute minimum)"
    src = "common practice, no source (NDS-2018 asks nail spacing that prevents splitting without numbers)"
    edge = 5.0 * D
    if half is not None:
        checks.append(
            across_check(
                key,
                c,
                lines,
                edge,
                5.0 * D,
                src,
                "5D (2.5D with pre-bored holes) to avoid splitting",
                "5D across the grain, as for the edge distance; common practice, no source",
            )
        )
    checks.append(
        Check(
            f"{key}.end",
            "End distance from the member end",
            Q_(15.0 * D, "in"),
            None,
            None,
            "INFO",
            source=src,
            note="15D without pre-boring (10D pre-bored)",
        )
    )
    return Q_(10.0 * D, "in"), None, src + ": 10D along the grain"
