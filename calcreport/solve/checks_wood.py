"""Wood member checks from plain inputs: flange axial stress against Ft′ and Fc′ (with the column
stability factor CP), panel shear through the thickness, adjusted design values.

NDS 2018: §2.3 and Table 4.3.1 (adjustment factors), §3.7.1 (column stability factor CP), §3.8
(tension parallel to grain). APA Panel Design Specification for panel shear through the thickness
(Fv·tv per length of panel, with its load-duration adjustment per NDS 2018 §2.3.2 as for wood).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from ..steps import StepLog
from ..units import Q_, Quantity  # noqa: F401 (Q_ is used in the examples)
from .results import Check

__all__ = [
    "Adjust",
    "adjusted",
    "column_stability",
    "axial_check",
    "combined_check",
    "panel_shear_check",
    "LRFD_FACTORS",
]

NDS = "NDS 2018"
#: LRFD format conversion KF and resistance factor φ, NDS 2018 Table 4.3.1 / Appendix N (from memory).
LRFD_FACTORS = {
    "Fb": (2.54, 0.85),
    "Ft": (2.70, 0.80),
    "Fc": (2.40, 0.90),
    "Fv": (2.88, 0.75),
    "Emin": (1.76, 0.85),
}


@dataclass(frozen=True)
class Adjust:
    """Adjustment factors applied to one reference value, each with where it comes from."""

    CD: float  # load duration (ASD) or time effect λ (LRFD)
    CM: float = 1.0
    Ct: float = 1.0
    CF: float = 1.0
    method: str = "ASD"


def adjusted(
    name: str, label: str, F: Quantity, a: Adjust, log: StepLog, CP: float | None = None
) -> Quantity:
    """F′ = F·CD·CM·Ct·CF(·CP) in ASD, F′ = F·KF·φ·λ·CM·Ct·CF(·CP) in LRFD (NDS 2018 Table 4.3.1)."""
    cp = 1.0 if CP is None else CP
    if a.method == "LRFD":
        KF, phi = LRFD_FACTORS[name]
        val = F * KF * phi * a.CD * a.CM * a.Ct * a.CF * cp
        sym = f"{name}′ = {name}·KF·φ·λ·CM·Ct·CF" + ("·CP" if CP is not None else "")
        tpl = "{F} × {KF} × {phi} × {CD} × {CM} × {Ct} × {CF}" + (" × {CP}" if CP is not None else "")
        vals = {
            "F": F,
            "KF": KF,
            "phi": phi,
            "CD": a.CD,
            "CM": a.CM,
            "Ct": a.Ct,
            "CF": a.CF,
            "CP": cp,
        }
    else:
        val = F * a.CD * a.CM * a.Ct * a.CF * cp
        sym = f"{name}′ = {name}·CD·CM·Ct·CF" + ("·CP" if CP is not None else "")
        tpl = "{F} × {CD} × {CM} × {Ct} × {CF}" + (" × {CP}" if CP is not None else "")
        vals = {"F": F, "CD": a.CD, "CM": a.CM, "Ct": a.Ct, "CF": a.CF, "CP": cp}
    return log.add(
        f"{name}_adj",
        label,
        sym,
        tpl,
        vals,
        val.to("psi"),
        source=f"{NDS} §2.3, Table 4.3.1",
    )


def column_stability(
    Fc_star: Quantity, Emin_adj: Quantity, le: Quantity, d: Quantity, log: StepLog, c: float = 0.8
) -> float:
    """Column stability factor CP, NDS 2018 §3.7.1 (Eq. 3.7-1): FcE = 0.822·Emin′/(ℓe/d)²,
    CP = (1 + FcE/Fc*)/(2c) − √([(1 + FcE/Fc*)/(2c)]² − (FcE/Fc*)/c), c = 0.8 for sawn lumber.

    Example:
        >>> round(column_stability(Q_(1350, "psi"), Q_(580000, "psi"), Q_(48, "in"), Q_(3.5, "in"),
        ...       StepLog("x")), 3)
        0.856
    """
    ratio = float((le / d).to("").magnitude)
    FcE = (0.822 * Emin_adj / ratio**2).to("psi")
    log.add(
        "FcE",
        "Critical buckling design value",
        "FcE = 0.822·Emin′ / (ℓe/d)²",
        "0.822 × {E} / ({le} / {d})²",
        {"E": Emin_adj, "le": le, "d": d},
        FcE,
        source=f"{NDS} §3.7.1",
    )
    a = float((FcE / Fc_star).to("").magnitude)
    k = (1 + a) / (2 * c)
    cp = k - math.sqrt(k * k - a / c)
    return log.add(
        "CP",
        "Column stability factor",
        "CP = (1 + FcE/Fc*)/(2c) − √([(1 + FcE/Fc*)/(2c)]² − (FcE/Fc*)/c)",
        "FcE/Fc* = {a}, c = {c}",
        {"a": round(a, 4), "c": c},
        cp,
        source=f"{NDS} Eq. 3.7-1",
    )


def axial_check(key: str, label: str, f: Quantity, allow: Quantity, source: str, note: str = "") -> Check:
    """Axial stress against its adjusted design value (NDS 2018 §3.6.2 / §3.8.1: f ≤ F′)."""
    r = float((f / allow).to("").magnitude)
    return Check(key, label, f.to("psi"), allow.to("psi"), r, "OK" if r <= 1 + 1e-9 else "NG", source, note)


def combined_check(
    key: str, part: str, which: str, f: Quantity, F_adj: Quantity, fb: Quantity, Fb_adj: Quantity, combo: str,
    log: StepLog,
) -> Check:  # fmt: skip
    """Combined axial and bending stress across a flange, NDS 2018 §3.9:
    tension (Eq. 3.9-1): ft/Ft′ + fb/Fb* ≤ 1.0;
    compression (Eq. 3.9-3): (fc/Fc′)² + fb/[Fb′·(1 − fc/FcE1)] ≤ 1.0, with buckling in the plane of
    bending prevented by the webs fastened along the flange (fc/FcE1 → 0, stated). Fb is adjusted
    with CL = 1.0: the flange bends within the section, held by the webs."""
    a = float((f / F_adj).to("").magnitude)
    b = float((fb / Fb_adj).to("").magnitude)
    if which == "tension":
        val, sym, eq = a + b, "ft/Ft′ + fb/Fb* ≤ 1.0", "Eq. 3.9-1"
        tpl = "{f} / {F} + {fb} / {Fb}"
    else:
        val, sym, eq = a * a + b, "(fc/Fc′)² + fb/(Fb′·(1 − fc/FcE1)) ≤ 1.0, fc/FcE1 → 0", "Eq. 3.9-3"
        tpl = "({f} / {F})² + {fb} / {Fb}"
    log.add(
        "interaction",
        f"Combined axial {which} and bending in flange {part}, {combo}",
        sym,
        tpl,
        {"f": f, "F": F_adj, "fb": fb, "Fb": Fb_adj},
        round(val, 4),
        source=f"{NDS} §3.9, {eq}",
        note="" if which == "tension" else "buckling in the plane of bending prevented by the webs",
    )
    return Check(
        key,
        f"Flange {part} combined axial {which} and bending ({combo})",
        round(val, 4),
        1.0,
        val,
        "OK" if val <= 1 + 1e-9 else "NG",
        f"{NDS} §3.9",
    )


def panel_shear_check(
    key: str, V: Quantity, Q: Quantity, I: Quantity, webs: int, Fvtv: Quantity, CD: float, method: str,
    source: str, log: StepLog,
) -> Check:  # fmt: skip
    """Panel shear through the thickness of the webs at the neutral axis: the shear flow per web
    v = V·Q/(I·n_webs) against the panel's Fv·tv adjusted for load duration (APA Panel Design
    Specification; duration per NDS 2018 §2.3.2; LRFD: KF = 2.88, φ = 0.75, λ per Table N3)."""
    v = log.add(
        "v",
        "Shear flow per web through its thickness at the neutral axis",
        "v = V·Q / (I·n_webs)",
        "{V} × {Q} / ({I} × {n})",
        {"V": abs(V), "Q": Q, "I": I, "n": webs},
        (abs(V) * Q / (I * webs)).to("lbf/inch"),
        source="mechanics of materials (shear formula per web)",
    )
    if method == "LRFD":
        KF, phi = LRFD_FACTORS["Fv"]
        cap = log.add("Fvtv_adj", "Adjusted panel shear through the thickness", "Fv·tv′ = Fv·tv·KF·φ·λ",
                      "{F} × {KF} × {phi} × {CD}", {"F": Fvtv, "KF": KF, "phi": phi, "CD": CD},
                      (Fvtv * KF * phi * CD).to("lbf/inch"), source=source)  # fmt: skip
    else:
        cap = log.add("Fvtv_adj", "Adjusted panel shear through the thickness", "Fv·tv′ = Fv·tv·CD",
                      "{F} × {CD}", {"F": Fvtv, "CD": CD}, (Fvtv * CD).to("lbf/inch"), source=source)  # fmt: skip
    r = float((v / cap).to("").magnitude)
    return Check(
        key, "Panel shear through the web thickness", v, cap, r, "OK" if r <= 1 + 1e-9 else "NG", source
    )
