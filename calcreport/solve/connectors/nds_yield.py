"""NDS 2018 §12.3 yield limit equations for dowel-type fasteners, as small pure functions.

Units inside this module: inches, pounds (lbf) and psi, as plain floats. :func:`log_yield_modes`
writes every intermediate to a :class:`~calcreport.steps.StepLog` as quantities.

Sources (ANSI/AWC NDS-2018, National Design Specification for Wood Construction):
* Table 12.3.1A — yield limit equations (single and double shear) and k1, k2, k3;
* Table 12.3.1B — reduction term Rd (Kθ, KD);
* Table 12.3.3 footnotes — dowel bearing strength of wood from specific gravity;
* §12.3.4 / Appendix I — dowel bearing strength of steel members (1.5·Fu hot-rolled,
  1.375·Fu cold-formed); Hankinson formula, Appendix J (Eq. J-2).
"""

from __future__ import annotations

import math
import string
from dataclasses import dataclass

from ...steps import StepLog
from ...units import Q_

__all__ = [
    "fe_small",
    "fe_parallel",
    "fe_perpendicular",
    "hankinson",
    "fe_wood",
    "fe_steel",
    "k_theta",
    "k_d",
    "rd",
    "k1",
    "k2",
    "k3",
    "ModeResult",
    "yield_modes",
    "log_yield_modes",
    "NDS",
]

NDS = "NDS 2018"  # ANSI/AWC NDS-2018, the short form the report cites throughout
#: the table the yield modes form (``Step.group``): one row per mode, columns ``k`` and ``Z``
YIELD_GROUP = "yield"


def fe_small(G: float) -> float:
    """Dowel bearing strength for D < 1/4 in: Fe = 16600·G^1.84 (psi), any angle to grain.

    Source: NDS-2018 Table 12.3.3 footnote 2.
    """
    return 16600.0 * G**1.84


def fe_parallel(G: float) -> float:
    """Dowel bearing strength parallel to grain, D ≥ 1/4 in: Fe∥ = 11200·G (psi).

    Source: NDS-2018 Table 12.3.3 footnote 2.
    """
    return 11200.0 * G


def fe_perpendicular(G: float, D: float) -> float:
    """Dowel bearing strength perpendicular to grain, D ≥ 1/4 in: Fe⊥ = 6100·G^1.45/√D (psi).

    Source: NDS-2018 Table 12.3.3 footnote 2.
    """
    return 6100.0 * G**1.45 / math.sqrt(D)


def hankinson(f_par: float, f_perp: float, theta_deg: float) -> float:
    """Bearing strength at angle θ to grain: Feθ = Fe∥·Fe⊥ / (Fe∥·sin²θ + Fe⊥·cos²θ).

    Source: NDS-2018 §12.3.3.2 and Appendix J, Eq. J-2 (Hankinson formula).
    """
    t = math.radians(theta_deg)
    return f_par * f_perp / (f_par * math.sin(t) ** 2 + f_perp * math.cos(t) ** 2)


def fe_wood(G: float, D: float, theta_deg: float = 0.0) -> float:
    """Dowel bearing strength of wood (psi) for diameter D (in) at angle θ to grain.

    D < 1/4 in: 16600·G^1.84; otherwise Hankinson of 11200·G and 6100·G^1.45/√D.
    Source: NDS-2018 Table 12.3.3 footnote 2, §12.3.3.2.
    """
    if D < 0.25:
        return fe_small(G)
    return hankinson(fe_parallel(G), fe_perpendicular(G, D), theta_deg)


def fe_steel(Fu: float, t: float, form: str = "auto") -> tuple[float, float, str]:
    """Dowel bearing strength of a steel member (psi) → (Fe, multiplier, form used).

    Hot-rolled steel (t ≥ 1/4 in): Fe = 1.5·Fu; cold-formed (t < 1/4 in): Fe = 1.375·Fu.
    Source: NDS-2018 §12.3.4 and Appendix I (Fe = 2.4·Fu/1.6 and 2.2·Fu/1.6), from memory.
    """
    if form == "auto":
        form = "hot_rolled" if t >= 0.25 - 1e-9 else "cold_formed"
    mult = 1.5 if form == "hot_rolled" else 1.375
    return mult * Fu, mult, form


def k_theta(theta_deg: float) -> float:
    """Kθ = 1 + 0.25·(θ/90), θ the largest angle of load to grain (0°–90°).

    Source: NDS-2018 Table 12.3.1B.
    """
    return 1.0 + 0.25 * (theta_deg / 90.0)


def k_d(D: float) -> float:
    """KD = 2.2 for D ≤ 0.17 in; 10·D + 0.5 for 0.17 < D < 0.25 in.

    Source: NDS-2018 Table 12.3.1B, footnote.
    """
    return 2.2 if D <= 0.17 else 10.0 * D + 0.5


def rd(mode: str, D: float, theta_deg: float, reduced: bool = False) -> tuple[float, str]:
    """Reduction term Rd for a yield mode → (Rd, expression used).

    0.25 ≤ D ≤ 1 in: Im, Is → 4·Kθ; II → 3.6·Kθ; IIIm, IIIs, IV → 3.2·Kθ.
    D < 0.25 in: KD for all modes. Threaded fasteners with D ≥ 1/4 in and root diameter
    < 1/4 in (``reduced``): KD·Kθ. Source: NDS-2018 Table 12.3.1B.
    """
    if D < 0.25 and not reduced:
        return k_d(D), "KD"
    if reduced:
        return k_d(D) * k_theta(theta_deg), "KD·Kθ"
    kt = k_theta(theta_deg)
    if mode in ("Im", "Is"):
        return 4.0 * kt, "4·Kθ"
    if mode == "II":
        return 3.6 * kt, "3.6·Kθ"
    return 3.2 * kt, "3.2·Kθ"


def k1(Re: float, Rt: float) -> float:
    """k1 = [√(Re + 2Re²(1+Rt+Rt²) + Rt²Re³) − Re(1+Rt)] / (1+Re). Source: NDS-2018 Table 12.3.1A."""
    return (math.sqrt(Re + 2 * Re**2 * (1 + Rt + Rt**2) + Rt**2 * Re**3) - Re * (1 + Rt)) / (1 + Re)


def k2(Re: float, Fyb: float, D: float, Fem: float, lm: float) -> float:
    """k2 = −1 + √(2(1+Re) + 2·Fyb·(1+2Re)·D²/(3·Fem·lm²)). Source: NDS-2018 Table 12.3.1A."""
    return -1 + math.sqrt(2 * (1 + Re) + 2 * Fyb * (1 + 2 * Re) * D**2 / (3 * Fem * lm**2))


def k3(Re: float, Fyb: float, D: float, Fem: float, ls: float) -> float:
    """k3 = −1 + √(2(1+Re)/Re + 2·Fyb·(2+Re)·D²/(3·Fem·ls²)). Source: NDS-2018 Table 12.3.1A."""
    return -1 + math.sqrt(2 * (1 + Re) / Re + 2 * Fyb * (2 + Re) * D**2 / (3 * Fem * ls**2))


@dataclass(frozen=True)
class ModeResult:
    """One yield mode: its value Z (lbf), reduction term and the pieces of its equation."""

    mode: str
    Z: float
    Rd: float
    rd_expr: str
    symbol: str
    template: str
    values: dict


def yield_modes(
    D: float,
    lm: float,
    ls: float,
    Fem: float,
    Fes: float,
    Fyb: float,
    theta_deg: float = 0.0,
    planes: int = 1,
    reduced: bool = False,
) -> list[ModeResult]:
    """All yield modes of NDS-2018 Table 12.3.1A.

    Single shear (``planes=1``): Im, Is, II, IIIm, IIIs, IV. Double shear (``planes=2``, ``ls``
    the thickness of *each* side member): Im, Is, IIIs, IV. D, lm, ls in inches; Fem, Fes, Fyb in
    psi; θ in degrees (for Kθ). Returns values in lbf.
    """
    Re = Fem / Fes
    Rt = lm / ls
    out: list[ModeResult] = []

    def add(mode, z_fn, symbol, template, extra):
        r, expr = rd(mode, D, theta_deg, reduced)
        out.append(
            ModeResult(
                mode,
                z_fn(r),
                r,
                expr,
                symbol,
                template,
                {"D": D, "lm": lm, "ls": ls, "Fem": Fem, "Fes": Fes, "Fyb": Fyb, "Re": Re, "Rd": r, **extra},
            )
        )

    iv = math.sqrt(2 * Fem * Fyb / (3 * (1 + Re)))
    K3 = k3(Re, Fyb, D, Fem, ls)
    if planes == 1:
        K1 = k1(Re, Rt)
        K2 = k2(Re, Fyb, D, Fem, lm)
        add("Im", lambda r: D * lm * Fem / r, "Z = D·lm·Fem / Rd", "{D} × {lm} × {Fem} / {Rd}", {})
        add("Is", lambda r: D * ls * Fes / r, "Z = D·ls·Fes / Rd", "{D} × {ls} × {Fes} / {Rd}", {})
        add(
            "II",
            lambda r: K1 * D * ls * Fes / r,
            "Z = k1·D·ls·Fes / Rd",
            "{k1} × {D} × {ls} × {Fes} / {Rd}",
            {"k1": K1},
        )
        add(
            "IIIm",
            lambda r: K2 * D * lm * Fem / ((1 + 2 * Re) * r),
            "Z = k2·D·lm·Fem / ((1 + 2Re)·Rd)",
            "{k2} × {D} × {lm} × {Fem} / ((1 + 2 × {Re}) × {Rd})",
            {"k2": K2},
        )
        add(
            "IIIs",
            lambda r: K3 * D * ls * Fem / ((2 + Re) * r),
            "Z = k3·D·ls·Fem / ((2 + Re)·Rd)",
            "{k3} × {D} × {ls} × {Fem} / ((2 + {Re}) × {Rd})",
            {"k3": K3},
        )
        add(
            "IV",
            lambda r: D**2 / r * iv,
            "Z = (D²/Rd)·√(2·Fem·Fyb / (3(1 + Re)))",
            "({D})² / {Rd} × √(2 × {Fem} × {Fyb} / (3 × (1 + {Re})))",
            {},
        )
    elif planes == 2:
        add("Im", lambda r: D * lm * Fem / r, "Z = D·lm·Fem / Rd", "{D} × {lm} × {Fem} / {Rd}", {})
        add("Is", lambda r: 2 * D * ls * Fes / r, "Z = 2·D·ls·Fes / Rd", "2 × {D} × {ls} × {Fes} / {Rd}", {})
        add(
            "IIIs",
            lambda r: 2 * K3 * D * ls * Fem / ((2 + Re) * r),
            "Z = 2·k3·D·ls·Fem / ((2 + Re)·Rd)",
            "2 × {k3} × {D} × {ls} × {Fem} / ((2 + {Re}) × {Rd})",
            {"k3": K3},
        )
        add(
            "IV",
            lambda r: 2 * D**2 / r * iv,
            "Z = (2·D²/Rd)·√(2·Fem·Fyb / (3(1 + Re)))",
            "2 × ({D})² / {Rd} × √(2 × {Fem} × {Fyb} / (3 × (1 + {Re})))",
            {},
        )
    else:
        raise ValueError("planes must be 1 or 2")
    return out


_UNITS = {"D": "in", "lm": "in", "ls": "in", "Fem": "psi", "Fes": "psi", "Fyb": "psi"}


def _q(name: str, v):
    return Q_(v, _UNITS[name]) if name in _UNITS else v


def log_yield_modes(log: StepLog, modes: list[ModeResult], planes: int) -> ModeResult:
    """Write Re, Rt, then every mode (governing one flagged) with the coefficient k it uses, as one
    row of table ``yield`` per mode (columns ``k`` and ``Z``); return the governing mode."""
    v = modes[0].values
    src = f"{NDS} Table 12.3.1A"
    log.add(
        "Re",
        "Ratio of dowel bearing strengths",
        "Re = Fem / Fes",
        "{Fem} / {Fes}",
        {"Fem": _q("Fem", v["Fem"]), "Fes": _q("Fes", v["Fes"])},
        v["Re"],
        source=src,
    )
    log.add(
        "Rt",
        "Ratio of member bearing lengths",
        "Rt = lm / ls",
        "{lm} / {ls}",
        {"lm": _q("lm", v["lm"]), "ls": _q("ls", v["ls"])},
        v["lm"] / v["ls"],
        source=src,
    )
    syms = {
        "k1": (
            "k1 = [√(Re + 2Re²(1+Rt+Rt²) + Rt²Re³) − Re(1+Rt)] / (1+Re)",
            "[√({Re} + 2×{Re}²×(1 + {Rt} + {Rt}²) + {Rt}²×{Re}³) − {Re}×(1 + {Rt})] / (1 + {Re})",
        ),
        "k2": (
            "k2 = −1 + √(2(1+Re) + 2·Fyb·(1+2Re)·D² / (3·Fem·lm²))",
            "−1 + √(2×(1 + {Re}) + 2×{Fyb}×(1 + 2×{Re})×({D})² / (3×{Fem}×({lm})²))",
        ),
        "k3": (
            "k3 = −1 + √(2(1+Re)/Re + 2·Fyb·(2+Re)·D² / (3·Fem·ls²))",
            "−1 + √(2×(1 + {Re})/{Re} + 2×{Fyb}×(2 + {Re})×({D})² / (3×{Fem}×({ls})²))",
        ),
    }
    vals = {
        "Re": v["Re"],
        "Rt": v["lm"] / v["ls"],
        "Fyb": _q("Fyb", v["Fyb"]),
        "D": _q("D", v["D"]),
        "Fem": _q("Fem", v["Fem"]),
        "lm": _q("lm", v["lm"]),
        "ls": _q("ls", v["ls"]),
    }
    gov = min(modes, key=lambda m: m.Z)
    done: set[str] = set()
    for m in modes:  # one row of table "yield" per mode: its coefficient k (if any), then Z
        row = log.table(YIELD_GROUP, m.mode)
        for k in ("k1", "k2", "k3"):
            if k in m.values and k not in done:
                done.add(k)
                row.add(
                    k,
                    f"Yield-mode coefficient {k}",
                    syms[k][0],
                    syms[k][1],
                    vals,
                    m.values[k],
                    source=src,
                    column="k",
                )
        slots = {n for _, n, _, _ in string.Formatter().parse(m.template) if n}
        row.add(
            f"Z_{m.mode}",
            f"Yield mode {m.mode} ({'double' if planes == 2 else 'single'} shear)",
            m.symbol,
            m.template,
            {n: _q(n, m.values[n]) for n in slots},
            Q_(m.Z, "lbf"),
            source=src,
            note=f"Rd = {m.rd_expr} (NDS-2018 Table 12.3.1B)",
            governs=m is gov,
            column="Z",
        )
    return gov
