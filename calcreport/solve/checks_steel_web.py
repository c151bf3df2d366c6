"""Webs of welded plate girders: shear (AISC 360-16 §G2.1), proportioning limits (§F13.2) and
concentrated forces at bearings (§J10.2 web local yielding, §J10.3 web local crippling).

Plain floats in kip and inch inside; every value that decides a status is a step.
"""

from __future__ import annotations

import math

from ..steps import Phrase, StepLog
from ..units import Q_
from .results import Check
from .steel_section import GirderProps

__all__ = ["web_shear", "web_proportions", "web_yielding", "web_crippling", "shear_coefficient"]

SRC = "AISC 360-16"


def _status(r: float) -> str:
    return "OK" if r <= 1.0 + 1e-9 else "NG"


def _avail(Rn: float, method: str, phi: float, omega: float) -> tuple[float, str, dict, str]:
    if method == "LRFD":
        return phi * Rn, "φ·Rn", {"f": phi}, f"φ = {phi:g}"
    return Rn / omega, "Rn / Ω", {"f": omega}, f"Ω = {omega:g}"


def shear_coefficient(h_tw: float, kv: float, E: float, Fy: float) -> float:
    """Web shear strength coefficient Cv1, AISC 360-16 Eqs. G2-3 and G2-4:
    Cv1 = 1.0 when h/tw ≤ 1.10√(kv·E/Fy), else 1.10√(kv·E/Fy)/(h/tw).

    Example:
        >>> round(shear_coefficient(90.67, 5.34, 29000, 50), 3)
        0.675
    """
    lim = 1.10 * math.sqrt(kv * E / Fy)
    return 1.0 if h_tw <= lim else lim / h_tw


def web_shear(
    key: str, Vu: float, p: GirderProps, Fy: float, E: float, a: float | None, method: str, log: StepLog
) -> Check:
    """Shear strength of the web without tension field action, AISC 360-16 §G2.1:
    Vn = 0.6·Fy·Aw·Cv1 (Eq. G2-1), Aw = d·tw; kv = 5.34 for webs without transverse stiffeners
    (or a/h > 3.0), kv = 5 + 5/(a/h)² with stiffeners at clear spacing a (Eq. G2-5);
    φv = 0.90, Ωv = 1.67 (§G1; the φv = 1.00 case of G2.1(a) is for rolled shapes only).
    Tension field action (§G2.2) is not counted: conservative."""
    h_tw = p.h / p.tw
    if a is None or a / p.h > 3.0:
        kv, why = 5.34, "no transverse stiffeners" if a is None else "a/h > 3.0"
    else:
        kv, why = 5 + 5 / (a / p.h) ** 2, "transverse stiffeners at a"
    log.add(
        "kv",
        "Web plate shear buckling coefficient",
        "kv = 5.34" if kv == 5.34 else "kv = 5 + 5/(a/h)²",
        "{why}" if kv == 5.34 else "5 + 5 / ({a} / {h})²",
        {"why": why} if kv == 5.34 else {"a": Q_(a, "in"), "h": Q_(p.h, "in")},
        kv,
        source=f"{SRC} §G2.1(b)(2), Eq. G2-5",
    )
    Cv1 = log.add(
        "Cv1",
        "Web shear strength coefficient",
        "Cv1 = 1.0 if h/tw ≤ 1.10√(kv·E/Fy), else 1.10√(kv·E/Fy)/(h/tw)",
        "h/tw = {r}, 1.10√(kv·E/Fy) = {lim}",
        {"r": round(h_tw, 2), "lim": round(1.10 * math.sqrt(kv * E / Fy), 2)},
        shear_coefficient(h_tw, kv, E, Fy),
        source=f"{SRC} Eqs. G2-3, G2-4",
    )
    Aw = p.d * p.tw
    Vn = log.add(
        "Vn",
        "Nominal shear strength of the web",
        "Vn = 0.6·Fy·Aw·Cv1, Aw = d·tw",
        "0.6 × {Fy} × {d} × {tw} × {Cv}",
        {"Fy": Q_(Fy, "ksi"), "d": Q_(p.d, "in"), "tw": Q_(p.tw, "in"), "Cv": Cv1},
        Q_(0.6 * Fy * Aw * Cv1, "kip"),
        source=f"{SRC} Eq. G2-1",
        note="tension field action (G2.2) not counted",
    )
    av, sym, vals, txt = _avail(float(Vn.magnitude), method, 0.90, 1.67)
    log.add(
        "Vc",
        "Available shear strength",
        sym.replace("Rn", "Vn"),
        "{f} × {Vn}" if method == "LRFD" else "{Vn} / {f}",
        {**vals, "Vn": Vn},
        Q_(av, "kip"),
        source=f"{SRC} §G1",
    )
    r = Vu / av
    return Check(
        key, "Web shear (no tension field)", Q_(Vu, "kip"), Q_(av, "kip"), r, _status(r), f"{SRC} §G2.1"
    )


def web_proportions(key: str, p: GirderProps, E: float, Fy: float, a: float | None, log: StepLog) -> Check:
    """Proportioning limits of I-shaped members, AISC 360-16 §F13.2: h/tw ≤ 260 without
    stiffeners; with stiffeners, h/tw ≤ 12.0√(E/Fy) for a/h ≤ 1.5 (Eq. F13-3), else ≤ 0.40·E/Fy
    (Eq. F13-4); and 0.1 ≤ Iyc/Iy ≤ 0.9 (Eq. F13-2)."""
    h_tw = p.h / p.tw
    if a is None:
        lim, eq = 260.0, "h/tw ≤ 260 (unstiffened web)"
    elif a / p.h <= 1.5:
        lim, eq = 12.0 * math.sqrt(E / Fy), "h/tw ≤ 12.0√(E/Fy) (Eq. F13-3, a/h ≤ 1.5)"
    else:
        lim, eq = 0.40 * E / Fy, "h/tw ≤ 0.40·E/Fy (Eq. F13-4, a/h > 1.5)"
    ratio_y = p.Iyc / p.Iy
    log.add(
        "proportions",
        "Web slenderness limit and flange proportion",
        eq + "; 0.1 ≤ Iyc/Iy ≤ 0.9",
        "h/tw = {r} against {lim}; Iyc/Iy = {iy}",
        {"r": round(h_tw, 2), "lim": round(lim, 1), "iy": round(ratio_y, 3)},
        round(h_tw / lim, 4),
        source=f"{SRC} §F13.2",
    )
    r = h_tw / lim
    ok = r <= 1.0 + 1e-9 and 0.1 <= ratio_y <= 0.9
    return Check(
        key,
        "Proportioning limits of the I-section (h/tw, Iyc/Iy)",
        round(h_tw, 2),
        round(lim, 1),
        r,
        "OK" if ok else "NG",
        f"{SRC} §F13.2",
        phrase=None if 0.1 <= ratio_y <= 0.9 else Phrase("iyc_ratio", {"ratio": float(ratio_y)}),
    )


def web_yielding(
    key: str,
    Ru: float,
    lb: float,
    k: float,
    tw: float,
    Fy: float,
    at_end: bool,
    method: str,
    log: StepLog,
    where: str = "",
) -> Check:
    """Web local yielding, AISC 360-16 §J10.2: Rn = Fy·tw·(5k + lb) (Eq. J10-2) away from the
    member end, Rn = Fy·tw·(2.5k + lb) (Eq. J10-3) within d of it; φ = 1.00, Ω = 1.50."""
    kk = 2.5 if at_end else 5.0
    Rn = log.add(
        "Rn_yield",
        "Web local yielding at the bearing",
        f"Rn = Fy·tw·({kk:g}k + lb)",
        "{Fy} × {tw} × (" + f"{kk:g}" + " × {k} + {lb})",
        {"Fy": Q_(Fy, "ksi"), "tw": Q_(tw, "in"), "k": Q_(k, "in"), "lb": Q_(lb, "in")},
        Q_(Fy * tw * (kk * k + lb), "kip"),
        source=f"{SRC} Eq. {'J10-3' if at_end else 'J10-2'}",
    )
    av, sym, vals, txt = _avail(float(Rn.magnitude), method, 1.00, 1.50)
    r = Ru / av
    return Check(key, f"Web local yielding at the bearing{where}", Q_(Ru, "kip"), Q_(av, "kip"), r,
                 _status(r), f"{SRC} §J10.2", note=txt)  # fmt: skip


def web_crippling(
    key: str,
    Ru: float,
    lb: float,
    d: float,
    tw: float,
    tf: float,
    Fy: float,
    E: float,
    at_end: bool,
    method: str,
    log: StepLog,
    where: str = "",
) -> Check:
    """Web local crippling, AISC 360-16 §J10.3 (Qf = 1.0 for I-shapes):
    away from the end (≥ d/2): Rn = 0.80·tw²·[1 + 3(lb/d)(tw/tf)^1.5]·√(E·Fy·tf/tw) (Eq. J10-4);
    at the end, lb/d ≤ 0.2: 0.40·tw²·[1 + 3(lb/d)(tw/tf)^1.5]·√(…) (Eq. J10-5a);
    lb/d > 0.2: 0.40·tw²·[1 + (4lb/d − 0.2)(tw/tf)^1.5]·√(…) (Eq. J10-5b); φ = 0.75, Ω = 2.00."""
    root = math.sqrt(E * Fy * tf / tw)
    ratio = (tw / tf) ** 1.5
    if not at_end:
        Rn, eq, sym = (
            0.80 * tw**2 * (1 + 3 * (lb / d) * ratio) * root,
            "J10-4",
            "0.80·tw²·[1 + 3(lb/d)(tw/tf)^1.5]",
        )
    elif lb / d <= 0.2:
        Rn, eq, sym = (
            0.40 * tw**2 * (1 + 3 * (lb / d) * ratio) * root,
            "J10-5a",
            "0.40·tw²·[1 + 3(lb/d)(tw/tf)^1.5]",
        )
    else:
        Rn, eq = 0.40 * tw**2 * (1 + (4 * lb / d - 0.2) * ratio) * root, "J10-5b"
        sym = "0.40·tw²·[1 + (4lb/d − 0.2)(tw/tf)^1.5]"
    log.add(
        "Rn_crippling",
        "Web local crippling at the bearing",
        f"Rn = {sym}·√(E·Fy·tf/tw)·Qf, Qf = 1.0",
        "tw = {tw}, tf = {tf}, lb = {lb}, d = {d}",
        {"tw": Q_(tw, "in"), "tf": Q_(tf, "in"), "lb": Q_(lb, "in"), "d": Q_(d, "in")},
        Q_(Rn, "kip"),
        source=f"{SRC} Eq. {eq}",
    )
    av, sym2, vals, txt = _avail(Rn, method, 0.75, 2.00)
    r = Ru / av
    return Check(key, f"Web local crippling at the bearing{where}", Q_(Ru, "kip"), Q_(av, "kip"), r,
                 _status(r), f"{SRC} §J10.3", note=txt)  # fmt: skip
