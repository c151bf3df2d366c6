"""Laterally loaded nails, screws, bolts and dowels in timber-to-timber and panel-to-timber joints,
EN 1995-1-1:2004 §8 (``settings.method = "EC5"``): the route taken by ``type = "nail"``,
``"wood_screw"`` and ``"wood_bolt"`` when the job's method is EC5.

Characteristic capacity F_v,Rk per shear plane from the failure modes of §8.2.2 (eq. 8.6 single
shear, 8.7 double shear, :mod:`.ec5_johansen`), with the fastener yield moment and the embedment
strengths of §8.3 (nails), §8.5 (bolts, dowels) and §8.7 (screws: d_ef ≤ 6 mm by the rules for
nails, larger by those for bolts); design value F_v,Rd = k_mod·F_v,Rk/γ_M (§2.4.3, eq. 2.17) with
k_mod of Table 3.1 for the load-duration class the solver gives (that of the shortest-duration load
of the member's combinations; each combination is then checked with its own k_mod) and γ_M of
connections (Table 2.3, or the national value). Steel-to-timber joints (§8.2.3) are refused.
Detailing: spacing along the grain a1 from Tables 8.2 / 8.4 becomes the joint's minimum spacing;
end and edge distances are listed. k_ef / n_ef (§8.3.1.1(8), §8.5.1.1(4)) are not applied: each
fastener carries the shear flow of its own spacing along the member (a stated simplification).
"""

from __future__ import annotations

import math

from ...model import ConnectorSpec, Part
from ...steps import StepLog
from ...units import Q_
from ..ec5_factors import SOURCE_KMOD, k_mod, k_mod_joint, product_of
from ..results import Capacity, Check
from . import ConnectorError
from .ec5_johansen import (
    ROPE_LIMIT,
    SOURCE_MODES_DOUBLE,
    SOURCE_MODES_SINGLE,
    SOURCE_ROPE,
    double_shear_modes,
    embedment_bolt,
    embedment_nail,
    embedment_plywood_bolt,
    embedment_plywood_nail,
    single_shear_modes,
    yield_moment_bolt,
    yield_moment_nail,
)
from .shear_plane import find_contact, opposite_faces, thickness_normal

__all__ = ["design_ec5", "MODE_TEXT"]

_D_SQRT = "√(2β(1+β) + 4β(2+β)·M_y,Rk/(f_h,1,k·d·t_1²))"
#: Mode → (equation as printed in EN 1995-1-1 eq. 8.6 / 8.7, template with the values).
MODE_TEXT = {
    "a": ("f_h,1,k·t_1·d", "{fh1} × {t1} × {d}"),
    "b": ("f_h,2,k·t_2·d", "{fh2} × {t2} × {d}"),
    "c": (
        "f_h,1,k·t_1·d/(1+β)·[√(β + 2β²(1 + t_2/t_1 + (t_2/t_1)²) + β³(t_2/t_1)²) − β(1 + t_2/t_1)]",
        "{fh1} × {t1} × {d} / (1 + {b}) × [√({b} + 2·{b}²·(1 + {r} + {r}²) + {b}³·{r}²) − {b}·(1 + {r})]",
    ),
    "d": (
        f"1.05·f_h,1,k·t_1·d/(2+β)·[{_D_SQRT} − β]",
        "1.05 × {fh1} × {t1} × {d} / (2 + {b}) × [√(2·{b}·(1 + {b}) + 4·{b}·(2 + {b})·{My} / "
        "({fh1} × {d} × {t1}²)) − {b}]",
    ),
    "e": (
        "1.05·f_h,1,k·t_2·d/(1+2β)·[√(2β²(1+β) + 4β(1+2β)·M_y,Rk/(f_h,1,k·d·t_2²)) − β]",
        "1.05 × {fh1} × {t2} × {d} / (1 + 2·{b}) × [√(2·{b}²·(1 + {b}) + 4·{b}·(1 + 2·{b})·{My} / "
        "({fh1} × {d} × {t2}²)) − {b}]",
    ),
    "f": (
        "1.15·√(2β/(1+β))·√(2·M_y,Rk·f_h,1,k·d)",
        "1.15 × √(2·{b} / (1 + {b})) × √(2 × {My} × {fh1} × {d})",
    ),
    "g": ("f_h,1,k·t_1·d", "{fh1} × {t1} × {d}"),
    "h": ("0.5·f_h,2,k·t_2·d", "0.5 × {fh2} × {t2} × {d}"),
    "j": (
        f"1.05·f_h,1,k·t_1·d/(2+β)·[{_D_SQRT} − β]",
        "1.05 × {fh1} × {t1} × {d} / (2 + {b}) × [√(2·{b}·(1 + {b}) + 4·{b}·(2 + {b})·{My} / "
        "({fh1} × {d} × {t1}²)) − {b}]",
    ),
    "k": (
        "1.15·√(2β/(1+β))·√(2·M_y,Rk·f_h,1,k·d)",
        "1.15 × √(2·{b} / (1 + {b})) × √(2 × {My} × {fh1} × {d})",
    ),
}

EC5 = "EN 1995-1-1:2004"
_MM = "mm"


def _fastener(kind: str, p: dict, key: str) -> tuple[float, float | None, str, str, str]:
    """(d_ef in mm, length in mm or None, description, rule "nail"|"bolt", diameter note)."""
    if kind == "nail":
        from .nds_catalog import nail

        if p.get("size"):
            n = nail(p["size"])
            if n is None:
                raise ConnectorError(
                    f"{key}.size", 'expected a nail size such as "16d common", or diameter and length'
                )
            d, L, desc = Q_(n.D, "in").to(_MM).magnitude, Q_(n.L, "in").to(_MM).magnitude, f"{n.name} nail"
        elif p.get("diameter") is not None and p.get("length") is not None:
            d, L, desc = p["diameter"].to(_MM).magnitude, p["length"].to(_MM).magnitude, "nail"
        else:
            raise ConnectorError(
                f"{key}.size", 'expected size (e.g. "16d common") or both diameter and length'
            )
        return d, L, p.get("name") or desc, ("nail" if d <= 8.0 else "bolt"), "nail diameter d"
    if kind == "wood_screw":
        from .nds_catalog import WOOD_SCREWS

        size = (p.get("size") or "").strip().lower().replace(" ", "").replace("gauge", "g").replace("#", "")
        if size:
            s = WOOD_SCREWS.get(size)
            if s is None:
                raise ConnectorError(f"{key}.size", 'expected a wood screw gauge such as "10g", or diameter')
            D = Q_(s.D, "in").to(_MM).magnitude
            Dr: float | None = Q_(s.Dr, "in").to(_MM).magnitude
        elif p.get("diameter") is not None:
            D = p["diameter"].to(_MM).magnitude
            Dr = p["root_diameter"].to(_MM).magnitude if p.get("root_diameter") is not None else None
        else:
            raise ConnectorError(f"{key}.size", 'expected size (e.g. "10g") or diameter')
        if p.get("threads_in_plane", True):
            if Dr is None:
                raise ConnectorError(
                    f"{key}.root_diameter",
                    "expected root_diameter (thread root): with threads in the shear plane EN 1995-1-1 §8.7.1 "
                    "uses d_ef = 1.1 × the root diameter",
                )
            d, note = 1.1 * Dr, "d_ef = 1.1 × thread root diameter (threads in the shear plane)"
        else:
            d, note = (
                D,
                "d_ef = smooth shank diameter (shank stated to reach ≥ 4d into the point-side member)",
            )
        L = p["length"].to(_MM).magnitude
        return d, L, p.get("name") or "wood screw", ("nail" if d <= 6.0 else "bolt"), note
    d = p["diameter"].to(_MM).magnitude
    desc = p.get("name") or ("dowel in timber" if p.get("dowel") else "bolt in timber")
    return d, None, desc, "bolt", "bolt or dowel diameter d"


def _members(p: dict, ctx, key: str):
    c = find_contact(ctx.held, ctx.other)
    if c is None and (p.get("side_thickness") is None or p.get("main_thickness") is None):
        raise ConnectorError(
            f"{key}.side_thickness",
            "expected side_thickness and main_thickness: the held and other parts do not touch",
        )
    held = c.held if c else ctx.held[0]
    other = c.other if c else ctx.other[0]
    choice = p.get("side_member") or "auto"
    if (p.get("planes") or 1) == 2:
        return c, other, held, "double shear: the held part is the central member 2"
    if choice == "held":
        return c, held, other, "member 1 (head side) = held part (as given)"
    if choice == "other":
        return c, other, held, "member 1 (head side) = other part (as given)"
    if c and thickness_normal(other, c) < thickness_normal(held, c) - 1e-9:
        return c, other, held, "member 1 (head side) = the thinner part at the plane (the other part)"
    return c, held, other, "member 1 (head side) = the held part (thinner or equal at the plane)"


def _thickness(log: StepLog, name: str, label: str, given, part: Part, c, why: str) -> float:
    if given is not None:
        t = given.to(_MM).magnitude
        log.add(
            name, label, name, "{t}", {"t": given}, given.to(_MM), source="job file", note=f"given; {why}"
        )
        return t
    t = Q_(thickness_normal(part, c), "in").to(_MM).magnitude
    log.add(
        name,
        label,
        name,
        "{t}",
        {"t": Q_(t, _MM)},
        Q_(t, _MM),
        source="geometry of the parts",
        note=f"part {part.id} measured perpendicular to the {c.orientation} shear plane; {why}",
    )
    return t


def _rho_k(part: Part) -> float:
    rho = part.material.extra.get("rho_k")
    if rho is None:
        raise ConnectorError(
            f"material[{part.material.id}].rho_k",
            f'expected rho_k (characteristic density, e.g. "350 kg/m^3") on material {part.material.id}: '
            "EN 1995-1-1 §8 embedment strengths need it",
        )
    return rho.to("kg/m**3").magnitude


def _embedment(
    log: StepLog, which: str, part: Part, d: float, rule: str, predrilled: bool, angle: float
) -> float:
    fam = part.material.family
    rho = _rho_k(part)
    vals = {"rho": Q_(rho, "kg/m**3"), "d": Q_(d, _MM)}
    name, label = f"fh{which}", f"Embedment strength of member {which} ({part.id})"
    if fam == "plywood":
        if rule == "nail":
            f, sym, tmpl, src = (
                embedment_plywood_nail(rho, d),
                "f_h,k = 0.11·ρ_k·d^-0.3",
                "0.11 × {rho} × {d}^-0.3",
                "§8.3.1.3, eq. (8.20)",
            )
        else:
            f, sym, tmpl, src = (
                embedment_plywood_bolt(rho, d),
                "f_h,k = 0.11·(1 − 0.01·d)·ρ_k",
                "0.11 × (1 − 0.01 × {d}) × {rho}",
                "§8.5.1.1, eq. (8.36)",
            )
        note = "plywood, any angle to the face grain"
    elif rule == "nail":
        f = embedment_nail(rho, d, predrilled)
        if predrilled:
            sym, tmpl, src = (
                "f_h,k = 0.082·(1 − 0.01·d)·ρ_k",
                "0.082 × (1 − 0.01 × {d}) × {rho}",
                "§8.3.1.1, eq. (8.16)",
            )
        else:
            sym, tmpl, src = "f_h,k = 0.082·ρ_k·d^-0.3", "0.082 × {rho} × {d}^-0.3", "§8.3.1.1, eq. (8.15)"
        note = "pre-drilled" if predrilled else "without pre-drilling"
    else:
        f0, _ = embedment_bolt(rho, d, 0.0)
        log.add(
            f"fh0{which}",
            f"Embedment strength parallel to grain, member {which} ({part.id})",
            "f_h,0,k = 0.082·(1 − 0.01·d)·ρ_k",
            "0.082 × (1 − 0.01 × {d}) × {rho}",
            vals,
            Q_(f0, "N/mm**2"),
            source=f"{EC5} §8.5.1.1, eq. (8.32)",
        )
        if angle:
            kk = 1.30 + 0.015 * d if part.material.extra.get("timber_product") == "LVL" else 1.35 + 0.015 * d
            r = math.radians(angle)
            f = f0 / (kk * math.sin(r) ** 2 + math.cos(r) ** 2)
            return log.add(
                name,
                label + f" at {angle:g}° to the grain",
                "f_h,α,k = f_h,0,k / (k90·sin²α + cos²α)",
                "{f0} / ({k90} × sin²{a} + cos²{a})",
                {"f0": Q_(f0, "N/mm**2"), "k90": kk, "a": angle},
                Q_(f, "N/mm**2"),
                source=f"{EC5} §8.5.1.1, eq. (8.31), (8.33)",
                note="k90 = 1.35 + 0.015·d (softwoods; LVL 1.30 + 0.015·d)",
            ).magnitude
        return log.add(
            name,
            label,
            "f_h,k = f_h,0,k",
            "{f0}",
            {"f0": Q_(f0, "N/mm**2")},
            Q_(f0, "N/mm**2"),
            source=f"{EC5} §8.5.1.1, eq. (8.31)",
            note="load parallel to the grain",
        ).magnitude
    return log.add(name, label, sym, tmpl, vals, Q_(f, "N/mm**2"), source=f"{EC5} {src}", note=note).magnitude


def _k_mod(log: StepLog, ctx, parts: tuple[Part, Part], key: str) -> float:
    s = ctx.settings
    if s.service_class is None:
        raise ConnectorError(
            "settings.service_class", "expected service_class = 1, 2 or 3 (EN 1995-1-1 §2.3.1.3)"
        )
    if not s.duration:
        raise ConnectorError(
            "settings.duration",
            "expected duration (the load-duration class of the design shear) for a member given a design "
            'shear without loads, e.g. duration = "medium"',
        )
    ks = []
    for i, part in enumerate(parts, 1):
        prod = product_of(part.material.family, part.material.extra.get("timber_product") or "")
        k = k_mod(s.duration, s.service_class)
        ks.append(
            log.add(
                f"kmod{i}",
                f"Modification factor k_mod of member {i} ({part.id}, {prod})",
                "k_mod",
                "service class {sc}, {dur} load duration",
                {"sc": s.service_class, "dur": s.duration},
                k,
                source=SOURCE_KMOD,
            )
        )
    if ks[0] == ks[1]:
        return float(ks[0])
    return float(
        log.add(
            "kmod",
            "k_mod of the connection",
            "k_mod = √(k_mod,1·k_mod,2)",
            "√({k1} × {k2})",
            {"k1": ks[0], "k2": ks[1]},
            k_mod_joint(ks[0], ks[1]),
            source=f"{EC5} §2.3.2.1(4), eq. (2.6)",
        )
    )


def design_ec5(spec: ConnectorSpec, ctx, log: StepLog, kind: str) -> Capacity:
    """Design value F_v,Rd of one nail, screw, bolt or dowel, EN 1995-1-1:2004 §8 (see module)."""
    from .ec5_detailing import detailing

    p = spec.params
    key = f"{ctx.key}.connector"
    planes = int(p.get("planes") or 1)
    c, m1, m2, why = _members(p, ctx, key)
    for part in (m1, m2):
        if part.material.family not in ("wood", "glulam", "plywood"):
            raise ConnectorError(
                f"{key}.type",
                f"part {part.id} is {part.material.family}: EN 1995-1-1 §8.2.3 steel-to-timber (and other) "
                "joints are not implemented under EC5; only timber-to-timber and panel-to-timber",
            )
    if p.get("fu") is None:
        raise ConnectorError(
            f"{key}.fu",
            'expected fu, the tensile strength of the fastener (e.g. fu = "600 MPa"; EN 1995-1-1 gives no '
            "default): the yield moment M_y,Rk (eq. 8.14, 8.30) needs it",
        )
    d, L, desc, rule, dnote = _fastener(kind, p, key)
    if rule == "bolt" and d > 30.0:
        raise ConnectorError(
            f"{key}.diameter",
            "expected a diameter up to 30 mm: the embedment strength of EN 1995-1-1 §8.5.1.1 (eq. 8.32) "
            "covers bolts up to 30 mm",
        )
    log.add(
        "d",
        "Diameter used in the failure modes",
        "d",
        "{d}",
        {"d": Q_(d, _MM)},
        Q_(d, _MM),
        source=f"{EC5} §8.3.1.1, §8.5.1.1, §8.7.1",
        note=dnote,
    )
    t_1 = _thickness(
        log,
        "t_1s",
        "Thickness of member 1" if planes == 1 else "Thickness of each side member",
        p.get("side_thickness"),
        m1,
        c,
        why,
    )
    t_2 = _thickness(
        log,
        "t_2m",
        "Thickness of member 2" if planes == 1 else "Thickness of the central member",
        p.get("main_thickness"),
        m2,
        c,
        why,
    )
    checks: list[Check] = []
    shank = p.get("nail_shank") or "round"
    if L is not None:
        if planes == 1:
            pen, tmpl = L - t_1, "{L} − {t1}"
        else:
            pen, tmpl = L - t_1 - t_2, "{L} − {t1} − {t2}"
        if pen <= 0:
            raise ConnectorError(
                f"{key}.length", "expected a fastener long enough to reach the member it must hold"
            )
        log.add(
            "t_pen",
            "Point-side penetration",
            "t_pen = L − t_1" if planes == 1 else "t_pen = L − t_1 − t_2",
            tmpl,
            {"L": Q_(L, _MM), "t1": Q_(t_1, _MM), "t2": Q_(t_2, _MM)},
            Q_(pen, _MM),
            source="geometry",
        )
        need = 8.0 if (kind == "nail" and shank == "round") else 6.0
        checks.append(
            Check(
                f"{key}.penetration",
                f"Point-side penetration at least {need:g}d",
                Q_(need * d, _MM),
                Q_(pen, _MM),
                need * d / pen,
                "OK" if pen >= need * d - 1e-9 else "NG",
                source=f"{EC5} §8.3.1.2",
                note="smooth nails 8d, other nails 6d"
                + (
                    "; screws of d_ef ≤ 6 mm follow the rules for nails (§8.7.1)"
                    if kind == "wood_screw"
                    else ""
                ),
            )
        )
        if planes == 1 and pen > t_2 + 1e-9:
            checks.append(
                Check(
                    f"{key}.point",
                    "Point beyond member 2",
                    Q_(pen - t_2, _MM),
                    None,
                    None,
                    "INFO",
                    source="geometry",
                    note="not checked: the point leaves member 2 and bears in no member of this joint; "
                    "confirm the parts beyond take it or that it does not protrude",
                )
            )
        far = opposite_faces(m2, c, tuple(getattr(ctx, "parts", ()))) if c is not None else []
        if planes == 1 and far:
            checks.append(
                Check(
                    f"{key}.overlap",
                    "Fasteners from opposite faces overlapping in member 2",
                    Q_(4 * d, _MM),
                    None,
                    None,
                    "INFO",
                    source=f"{EC5} §8.3.1.1",
                    note="not checked: part " + ", ".join(o.id for o, _ in far) + " lies on the far face of "
                    "member 2; fasteners driven from there may overlap only where t − t_2 > 4d",
                )
            )
        if planes == 1:
            t2 = min(pen, t_2)
            t1 = t_1
            log.add(
                "t_2",
                "Bearing length t_2 in member 2",
                "t_2 = min(t_pen, t_2m)",
                "min({p}, {t})",
                {"p": Q_(pen, _MM), "t": Q_(t_2, _MM)},
                Q_(t2, _MM),
                source=f"{EC5} §8.3.1.2",
                note="the point beyond member 2 bears in no member of this joint" if pen > t_2 + 1e-9 else "",
            )
        else:
            t1 = min(t_1, pen)
            t2 = t_2
            log.add(
                "t_1",
                "Bearing length t_1 (side members)",
                "t_1 = min(t_1s, t_pen)",
                "min({t}, {p})",
                {"t": Q_(t_1, _MM), "p": Q_(pen, _MM)},
                Q_(t1, _MM),
                source=f"{EC5} §8.3.1.2",
                note="the lesser of the head-side thickness and the point-side penetration",
            )
    else:
        t1, t2 = t_1, t_2
    predrilled = bool(p.get("predrilled"))
    a1, a2 = p.get("angle_side") or 0.0, p.get("angle_main") or 0.0
    fh1 = _embedment(log, "1", m1, d, rule, predrilled, a1)
    fh2 = _embedment(log, "2", m2, d, rule, predrilled, a2)
    fu = p["fu"].to("N/mm**2").magnitude
    if rule == "nail":
        square = kind == "nail" and shank == "square"
        My = yield_moment_nail(fu, d, square)
        sym = "M_y,Rk = 0.45·f_u·d^2.6" if square else "M_y,Rk = 0.3·f_u·d^2.6"
        msrc = f"{EC5} §8.3.1.1, eq. (8.14)" + ("; §8.7.1 for screws" if kind == "wood_screw" else "")
    else:
        My = yield_moment_bolt(fu, d)
        sym, msrc = (
            "M_y,Rk = 0.3·f_u,k·d^2.6",
            f"{EC5} §8.5.1.1, eq. (8.30)" + ("; §8.7.1 for screws" if kind == "wood_screw" else ""),
        )
    log.add(
        "My",
        "Fastener yield moment",
        sym,
        ("0.45" if sym.startswith("M_y,Rk = 0.45") else "0.3") + " × {fu} × {d}^2.6",
        {"fu": Q_(fu, "N/mm**2"), "d": Q_(d, _MM)},
        Q_(My, "N*mm"),
        source=msrc,
    )
    limit_key = {
        "nail": f"{shank}_nail",
        "wood_screw": "screw",
        "wood_bolt": "dowel" if p.get("dowel") else "bolt",
    }[kind]
    limit = ROPE_LIMIT[limit_key]
    fax = p["F_ax_Rk"].to("N").magnitude if p.get("F_ax_Rk") is not None else 0.0
    log.add(
        "rope",
        "Rope effect: largest F_ax,Rk/4 as a fraction of the Johansen part",
        "F_rope = min(F_ax,Rk/4, limit × Johansen part)",
        "limit for {what}, with F_ax,Rk = {fax}",
        {"fax": Q_(fax, "N"), "what": limit_key.replace("_", " ") + "s"},
        limit,
        source=SOURCE_ROPE,
        note=(
            "no F_ax,Rk given: the rope effect is not counted"
            if fax == 0
            else "F_ax,Rk as given in the job file"
        ),
    )
    beta = log.add(
        "beta",
        "Ratio of embedment strengths",
        "β = f_h,2,k / f_h,1,k",
        "{f2} / {f1}",
        {"f2": Q_(fh2, "N/mm**2"), "f1": Q_(fh1, "N/mm**2")},
        fh2 / fh1,
        source=f"{EC5} §8.2.2, eq. (8.8)",
    )
    del beta
    if planes == 1:
        modes, src = single_shear_modes(fh1, fh2, t1, t2, d, My, fax, limit), SOURCE_MODES_SINGLE
    else:
        modes, src = double_shear_modes(fh1, fh2, t1, t2, d, My, fax, limit), SOURCE_MODES_DOUBLE
    gov = min(modes, key=lambda m: m.F)
    vals = {
        "fh1": Q_(fh1, "N/mm**2"),
        "fh2": Q_(fh2, "N/mm**2"),
        "t1": Q_(t1, _MM),
        "t2": Q_(t2, _MM),
        "d": Q_(d, _MM),
        "b": fh2 / fh1,
        "r": t2 / t1,
        "My": Q_(My, "N*mm"),
    }
    for m in modes:
        sym, tmpl = MODE_TEXT[m.mode]
        rope = m.mode not in ("a", "b", "g", "h")
        log.add(
            f"mode.{m.mode}",
            f"Failure mode ({m.mode})" + (" with the rope effect" if rope and m.rope else ""),
            f"F_{m.mode} = {sym}" + (" + F_rope" if rope else ""),
            tmpl + (" + {rope}" if rope else ""),
            {**vals, "rope": Q_(m.rope, "N")},
            Q_(m.F, "N"),
            source=f"{src} ({m.mode})",
            governs=m is gov,
            note="F_rope = min(F_ax,Rk/4, limit × Johansen part)" if rope and m.rope else "",
        )
    Fk = log.add(
        "FvRk",
        "Characteristic load-carrying capacity per shear plane",
        "F_v,Rk = min(modes)",
        "{F}",
        {"F": Q_(gov.F, "N")},
        Q_(gov.F, "N"),
        source=src,
        note=f"mode ({gov.mode}) governs",
    ).magnitude
    if planes == 2:
        Fk = log.add(
            "FvRk2",
            "Characteristic capacity of the fastener, two shear planes",
            "F_v,Rk,2 = 2·F_v,Rk",
            "2 × {F}",
            {"F": Q_(gov.F, "N")},
            Q_(2 * gov.F, "N"),
            source=f"{EC5} §8.1.3",
        ).magnitude
    km = _k_mod(log, ctx, (m1, m2), key)
    gm_given = ctx.settings.gamma_M_connections
    gm = log.add(
        "gM",
        "Partial factor for connections",
        "γ_M",
        "{g}",
        {"g": gm_given or 1.3},
        float(gm_given or 1.3),
        source="national value stated in the job file" if gm_given else f"{EC5} §2.4.1, Table 2.3",
    )
    Fd = log.add(
        "FvRd",
        "Design load-carrying capacity of one fastener",
        "F_v,Rd = k_mod·F_v,Rk / γ_M",
        "{k} × {F} / {g}",
        {"k": km, "F": Q_(Fk, "N"), "g": gm},
        Q_(km * Fk / gm, "N"),
        source=f"{EC5} §2.4.3, eq. (2.17)",
        governs=True,
    )
    smin, lsrc = detailing(
        checks, key, kind, rule, d, predrilled, (m1, m2), (t_1, t_2), c, getattr(ctx, "per_row", 1), _rho_k
    )
    return Capacity(
        value=Fd,
        continuous=False,
        description=desc,
        source=f"{EC5} §8.2.2 failure modes, §2.4.3 design value",
        checks=tuple(checks),
        spacing_min=smin,
        spacing_max=None,
        limits_source=lsrc,
        duration_factor=km,
    )
