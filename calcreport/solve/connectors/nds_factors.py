"""NDS 2018 adjustment of reference lateral design values Z → Z' (Table 11.3.1), and the job-file
keys shared by every wood dowel-type fastener model.

ASD:  Z' = Z · CD · CM · Ct · Cg · CΔ · Ceg · Cdi · Ctn
LRFD: Z' = Z · CM · Ct · Cg · CΔ · Ceg · Cdi · Ctn · KF · φz · λ   (KF = 3.32, φz = 0.65)

Every factor is written as a step with its value and, in the step's note, why it has that value.
"""

from __future__ import annotations

import math

from ...keys.connectors import NDS_COMMON
from ...model import Part
from ...steps import StepLog
from ...units import Q_
from . import ConnectorError

__all__ = ["COMMON_FIELDS", "group_action", "part_area", "adjust"]

SRC = "NDS 2018"  # ANSI/AWC NDS-2018

COMMON_FIELDS = NDS_COMMON


def part_area(part: Part) -> float:
    """Gross area of a part (in²) from its shape. Source: geometry."""
    s = part.shape
    if s.kind == "circle":
        return math.pi * s.radius**2
    if s.kind == "polygon" and len(s.vertices) >= 3:
        v = s.vertices
        return (
            abs(
                sum(
                    v[i][0] * v[(i + 1) % len(v)][1] - v[(i + 1) % len(v)][0] * v[i][1] for i in range(len(v))
                )
            )
            / 2.0
        )
    if s.area:
        return s.area
    x0, y0, x1, y1 = s.bbox
    return (x1 - x0) * (y1 - y0)


def group_action(n: int, EmAm: float, EsAs: float, s: float, gamma: float) -> dict[str, float]:
    """Group action factor Cg, NDS-2018 Eq. 11.3-1.

    Cg = [m(1 − m^2n) / (n[(1 + REA·m^n)(1 + m) − 1 + m^2n])] · [(1 + REA) / (1 − m)]
    with REA = lesser of EsAs/EmAm and EmAm/EsAs, u = 1 + γ·(s/2)·(1/EmAm + 1/EsAs),
    m = u − √(u² − 1). E in psi, A in in², s in in, γ in lbf/in. Returns all intermediates.
    """
    if n <= 1:
        return {"REA": 1.0, "u": 1.0, "m": 0.0, "Cg": 1.0}
    REA = min(EsAs / EmAm, EmAm / EsAs)
    u = 1 + gamma * (s / 2) * (1 / EmAm + 1 / EsAs)
    m = u - math.sqrt(u**2 - 1)
    Cg = (m * (1 - m ** (2 * n)) / (n * ((1 + REA * m**n) * (1 + m) - 1 + m ** (2 * n)))) * (
        (1 + REA) / (1 - m)
    )
    return {"REA": REA, "u": u, "m": m, "Cg": Cg}


_SYMBOLS = {"C_delta": "CΔ", "phi_z": "φz", "lambda": "λ"}


#: the table the adjustment factors form (``Step.group``): one row per factor, column ``value``
FACTOR_GROUP = "factors"


def _factor(log: StepLog, name: str, label: str, value: float, note: str, clause: str) -> float:
    log.table(FACTOR_GROUP, name, "value").add(
        name, label, _SYMBOLS.get(name, name), "{v}", {"v": value}, value, source=f"{SRC} {clause}", note=note
    )
    return value


def adjust(
    log: StepLog,
    Z: float,
    p: dict,
    ctx,
    *,
    D: float,
    fastener: str,
    side: Part,
    main: Part,
    steel_side: bool,
    toe_nail: bool = False,
    diaphragm: bool = False,
) -> tuple[float, dict[str, float]]:
    """Apply the NDS-2018 Table 11.3.1 factors to Z (lbf) → (Z' in lbf, the factors used by name).

    ``fastener`` is "nail", "wood_screw", "lag_screw" or "bolt" (Ctn and Cdi apply to nails only;
    Cg to D ≥ 1/4 in). Source: NDS-2018 Table 11.3.1, §11.3, §12.5.
    """
    factors: list[tuple[str, float]] = []
    asd = ctx.method == "ASD"
    if asd:
        if p.get("CD") is not None:
            cd, why = p["CD"], "given for this connector"
        elif getattr(ctx.settings, "load_duration", None):
            cd, why = ctx.settings.load_duration, "the job's load duration setting"
        else:
            cd, why = 1.0, "normal load duration (ten years) assumed; set CD for other loads"
        factors.append(("CD", _factor(log, "CD", "Load duration factor", cd, why, "§11.3.2, Table 2.3.2")))
    if p.get("CM") is not None:
        cm, why = p["CM"], "given for this connector"
    elif p.get("wet_service"):
        cm, why = 0.7, "moisture content above 19 % in service"
    else:
        cm, why = 1.0, "dry service (moisture content ≤ 19 %)"
    factors.append(("CM", _factor(log, "CM", "Wet service factor", cm, why, "§11.3.3, Table 11.3.3")))
    ct = p.get("Ct", 1.0) or 1.0
    factors.append(
        (
            "Ct",
            _factor(
                log,
                "Ct",
                "Temperature factor",
                ct,
                "sustained temperature up to 100 °F" if ct == 1.0 else "given for this connector",
                "§11.3.4, Table 11.3.4",
            ),
        )
    )
    n = int(p.get("row_count") or 1)
    if D >= 0.25 and n > 1:
        s = p.get("row_spacing")
        if s is None:
            raise ConnectorError(
                f"{ctx.key}.connector.row_spacing", "expected row_spacing (a length) when row_count > 1"
            )
        s_in = s.to("in").magnitude
        Em = main.material.E.to("psi").magnitude
        Es = side.material.E.to("psi").magnitude
        Am, As = part_area(main), part_area(side)
        gamma = (270_000.0 if steel_side else 180_000.0) * D**1.5
        g = group_action(n, Em * Am, Es * As, s_in, gamma)
        log.add(
            "gamma",
            "Load/slip modulus of one fastener",
            "γ = c·D^1.5",
            "{c} × ({D})^1.5",
            {"c": Q_(270_000.0 if steel_side else 180_000.0, "lbf/in**2.5"), "D": Q_(D, "in")},
            Q_(gamma, "lbf/in"),
            source=f"{SRC} §11.3.6",
            note="wood-to-metal" if steel_side else "wood-to-wood",
        )
        log.add(
            "Cg_u",
            "Group action term u",
            "u = 1 + γ·(s/2)·(1/(Em·Am) + 1/(Es·As))",
            "1 + {gamma} × {s}/2 × (1/({Em} × {Am}) + 1/({Es} × {As}))",
            {
                "gamma": Q_(gamma, "lbf/in"),
                "s": s,
                "Em": Q_(Em, "psi"),
                "Am": Q_(Am, "in**2"),
                "Es": Q_(Es, "psi"),
                "As": Q_(As, "in**2"),
            },
            g["u"],
            source=f"{SRC} Eq. 11.3-1",
        )
        log.add(
            "Cg_REA",
            "Ratio of member stiffnesses",
            "REA = min(Es·As / (Em·Am), Em·Am / (Es·As))",
            "min({Es} × {As} / ({Em} × {Am}), {Em} × {Am} / ({Es} × {As}))",
            {"Em": Q_(Em, "psi"), "Am": Q_(Am, "in**2"), "Es": Q_(Es, "psi"), "As": Q_(As, "in**2")},
            g["REA"],
            source=f"{SRC} Eq. 11.3-1",
            note="gross areas of the two members",
        )
        log.add(
            "Cg_m",
            "Group action term m",
            "m = u − √(u² − 1)",
            "{u} − √({u}² − 1)",
            {"u": g["u"]},
            g["m"],
            source=f"{SRC} Eq. 11.3-1",
        )
        cg = log.add(
            "Cg",
            "Group action factor",
            "Cg = [m(1−m^2n) / (n[(1+REA·m^n)(1+m) − 1 + m^2n])]·(1+REA)/(1−m)",
            "[{m} × (1 − {m}^(2×{n})) / ({n} × [(1 + {REA} × {m}^{n}) × (1 + {m}) − 1 + {m}^(2×{n})])]"
            " × (1 + {REA}) / (1 − {m})",
            {"n": n, "REA": g["REA"], "m": g["m"]},
            g["Cg"],
            source=f"{SRC} Eq. 11.3-1",
            note="fasteners in one row acting together (row_count)",
        )
        factors.append(("Cg", cg))
    else:
        carried = (
            "its own tributary share of the load passed across the plies"
            if float(getattr(ctx, "load_angle", 0.0) or 0.0) > 0
            else "its own tributary shear flow along the member"
        )
        why = (
            f"each fastener transfers {carried}, so no row of "
            "fasteners shares one load (conservative simplification stated: set row_count for a "
            "splice-like row)"
            if D >= 0.25
            else "D < 1/4 in: group action does not apply"
        )
        factors.append(("Cg", _factor(log, "Cg", "Group action factor", 1.0, why, "§11.3.6")))
    factors.append(
        (
            "CΔ",
            _factor(
                log,
                "C_delta",
                "Geometry factor",
                1.0,
                "end distance and spacing at or above the full-value limits, checked below"
                if D >= 0.25
                else "D < 1/4 in: geometry factor does not apply",
                "§12.5.1",
            ),
        )
    )
    ceg = 0.67 if p.get("end_grain") else 1.0
    factors.append(
        (
            "Ceg",
            _factor(
                log,
                "Ceg",
                "End grain factor",
                ceg,
                "fastener in end grain" if ceg < 1 else "fastener in side grain",
                "§12.5.2",
            ),
        )
    )
    if fastener == "nail":
        cdi = 1.1 if diaphragm else 1.0
        factors.append(
            (
                "Cdi",
                _factor(
                    log,
                    "Cdi",
                    "Diaphragm factor",
                    cdi,
                    "nails in diaphragm construction" if diaphragm else "not diaphragm construction",
                    "§12.5.3",
                ),
            )
        )
        ctn = 0.83 if toe_nail else 1.0
        factors.append(
            (
                "Ctn",
                _factor(
                    log,
                    "Ctn",
                    "Toe-nail factor",
                    ctn,
                    "toe-nailed" if toe_nail else "nailed through the side member, not toe-nailed",
                    "§12.5.4",
                ),
            )
        )
    if not asd:
        factors.append(
            ("KF", _factor(log, "KF", "Format conversion factor (LRFD)", 3.32, "connections", "Table N1"))
        )
        factors.append(
            ("φz", _factor(log, "phi_z", "Resistance factor (LRFD)", 0.65, "connections", "Table N2"))
        )
        lam = p.get("time_effect") or 0.8
        factors.append(
            (
                "λ",
                _factor(
                    log,
                    "lambda",
                    "Time effect factor (LRFD)",
                    lam,
                    "given for this connector"
                    if lam != 0.8
                    else "0.8 assumed: combinations with occupancy live, snow or roof live load",
                    "Table N3",
                ),
            )
        )
    prod = 1.0
    for _, f in factors:
        prod *= f
    names = [n_ for n_, _ in factors]
    tmpl = "{Z}" + "".join(f" × {{f{i}}}" for i in range(len(factors)))
    vals = {"Z": Q_(Z, "lbf"), **{f"f{i}": f for i, (_, f) in enumerate(factors)}}
    log.add(
        "Z_adj",
        "Adjusted lateral design value" + (" (ASD)" if asd else " (LRFD)"),
        "Z' = Z · " + " · ".join(names),
        tmpl,
        vals,
        Q_(Z * prod, "lbf"),
        source=f"{SRC} Table 11.3.1",
    )
    return Z * prod, dict(factors)
