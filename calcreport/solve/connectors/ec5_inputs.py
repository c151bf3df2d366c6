"""Inputs of the EN 1995-1-1 §8 route (:mod:`.ec5_fastener`): the fastener's effective diameter and
length, members 1 and 2 and their thicknesses, characteristic densities, embedment strengths
(§8.3.1, §8.5.1), k_mod of the joint (Table 3.1, eq. 2.6), and the failure-mode equations as
printed (for the steps). Each value is a derivation step citing its clause.
"""

from __future__ import annotations

import math

from ...model import Part
from ...steps import StepLog
from ...units import Q_
from ..ec5_factors import SOURCE_KMOD, k_mod, k_mod_joint, product_of
from . import ConnectorError
from .ec5_johansen import embedment_bolt, embedment_nail, embedment_plywood_bolt, embedment_plywood_nail
from .shear_plane import find_contact, thickness_normal

__all__ = ["MODE_TEXT", "fastener", "members", "thickness", "rho_k", "embedment", "joint_k_mod", "EC5", "MM"]

EC5 = "EN 1995-1-1:2004"
MM = "mm"
_MM = MM

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


def fastener(kind: str, p: dict, key: str) -> tuple[float, float | None, str, str, str]:
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


def members(p: dict, ctx, key: str):
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


def thickness(log: StepLog, name: str, label: str, given, part: Part, c, why: str) -> float:
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


def rho_k(part: Part) -> float:
    rho = part.material.extra.get("rho_k")
    if rho is None:
        raise ConnectorError(
            f"material[{part.material.id}].rho_k",
            f'expected rho_k (characteristic density, e.g. "350 kg/m^3") on material {part.material.id}: '
            "EN 1995-1-1 §8 embedment strengths need it",
        )
    return rho.to("kg/m**3").magnitude


def embedment(
    log: StepLog, which: str, part: Part, d: float, rule: str, predrilled: bool, angle: float
) -> float:
    fam = part.material.family
    rho = rho_k(part)
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


def joint_k_mod(log: StepLog, ctx, parts: tuple[Part, Part], key: str) -> float:
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
