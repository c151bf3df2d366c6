"""Flexure of welded plate girders: AISC 360-16 Chapter F (F2–F5) as the section classifies by
Table B4.1b, with Lb and Cb from the job (defaults stated: Lb = span, Cb = 1.0).

Every nominal strength Mn is found in kip·in from plain floats, logged as a step citing its
equation, and compared with the required strength as φb·Mn (LRFD, φb = 0.90) or Mn/Ωb (ASD,
Ωb = 1.67) — AISC 360-16 §F1.
"""

from __future__ import annotations

import math

from ..steps import StepLog
from ..units import Q_, Quantity
from .results import Check
from .steel_section import GirderProps

__all__ = ["classify", "flexure_strength", "flexure_check", "SRC", "PHI_B", "OMEGA_B"]

SRC = "AISC 360-16"
PHI_B, OMEGA_B = 0.90, 1.67


def _kin(v: float) -> Quantity:
    return Q_(v, "kip*inch")


def classify(p: GirderProps, Fy: float, E: float, log: StepLog, rolled: bool = False) -> dict:
    """Flange and web slenderness of a built-up I-section in flexure, AISC 360-16 Table B4.1b:
    case 11 (flanges of built-up I: λp = 0.38√(E/Fy), λr = 0.95√(kc·E/FL), kc = 4/√(h/tw) within
    0.35–0.76), case 15 (webs of doubly symmetric I: λp = 3.76√(E/Fy), λr = 5.70√(E/Fy)) and
    case 16 (webs of singly symmetric I: λ = hc/tw, λp = (hc/hp)√(E/Fy)/(0.54·Mp/My − 0.09)² ≤ λr).
    FL per Table B4.1b note [a] (Eqs. F4-6a/b)."""
    root = math.sqrt(E / Fy)
    kc = min(max(4 / math.sqrt(p.h / p.tw), 0.35), 0.76)
    ratio = p.Sxt / p.Sxc
    FL = 0.7 * Fy if ratio >= 0.7 else max(Fy * ratio, 0.5 * Fy)
    lam_f = p.bfc / (2 * p.tfc)
    lpf, lrf = 0.38 * root, (1.0 * root if rolled else 0.95 * math.sqrt(kc * E / FL))
    if p.symmetric:
        lam_w, lpw, lrw = p.h / p.tw, 3.76 * root, 5.70 * root
        wcase = "case 15"
    else:
        Mp, My = Fy * p.Zx, Fy * min(p.Sxc, p.Sxt)
        lrw = 5.70 * root
        lam_w = p.hc / p.tw
        lpw = min((p.hc / p.hp) * root / (0.54 * Mp / My - 0.09) ** 2, lrw)
        wcase = "case 16"
    fl = _cls(lam_f, lpf, lrf)
    wb = _cls(lam_w, lpw, lrw)
    log.add(
        "kc",
        "Flange local buckling coefficient",
        "kc = 4/√(h/tw), 0.35 ≤ kc ≤ 0.76",
        "4 / √({h} / {tw})",
        {"h": Q_(p.h, "in"), "tw": Q_(p.tw, "in")},
        kc,
        source=f"{SRC} Table B4.1b note [a]",
    )
    log.add(
        "FL",
        "Nominal compression flange stress for the slenderness limits",
        "FL = 0.7·Fy (Sxt/Sxc ≥ 0.7), else Fy·Sxt/Sxc ≥ 0.5·Fy",
        "Sxt/Sxc = {r}, Fy = {Fy}",
        {"r": ratio, "Fy": Q_(Fy, "ksi")},
        Q_(FL, "ksi"),
        source=f"{SRC} Eqs. F4-6a, F4-6b",
    )
    log.add(
        "flange_class",
        "Compression flange slenderness (flexure)",
        "λ = bf/(2·tf) against λp = 0.38√(E/Fy), " + ("λr = 1.0√(E/Fy)" if rolled else "λr = 0.95√(kc·E/FL)"),
        "λ = {lam}, λp = {lp}, λr = {lr}",
        {"lam": round(lam_f, 2), "lp": round(lpf, 2), "lr": round(lrf, 2)},
        fl,
        source=f"{SRC} Table B4.1b case {10 if rolled else 11}",
    )
    log.add(
        "web_class",
        "Web slenderness (flexure)",
        "λ = h/tw against λp = 3.76√(E/Fy), λr = 5.70√(E/Fy)"
        if p.symmetric
        else "λ = hc/tw against λp = (hc/hp)·√(E/Fy)/(0.54·Mp/My − 0.09)², λr = 5.70√(E/Fy)",
        "λ = {lam}, λp = {lp}, λr = {lr}",
        {"lam": round(lam_w, 2), "lp": round(lpw, 2), "lr": round(lrw, 2)},
        wb,
        source=f"{SRC} Table B4.1b {wcase}",
    )
    return {
        "kc": kc, "FL": FL, "lam_f": lam_f, "lpf": lpf, "lrf": lrf, "flange": fl,
        "lam_w": lam_w, "lpw": lpw, "lrw": lrw, "web": wb,
    }  # fmt: skip


def _cls(lam: float, lp: float, lr: float) -> str:
    return "compact" if lam <= lp else ("noncompact" if lam <= lr else "slender")


def flexure_strength(
    p: GirderProps, Fy: float, E: float, Lb: float, Cb: float, log: StepLog, rolled: bool = False
):
    """Nominal flexural strength Mn (kip·in) and the section of Chapter F that applies.

    F2: doubly symmetric, compact web and flanges. F3: doubly symmetric, compact web, noncompact
    or slender flanges. F4: other I-shapes with compact or noncompact webs. F5: slender webs.
    (AISC 360-16 Table User Note F1.1.)"""
    c = classify(p, Fy, E, log, rolled)
    if c["web"] == "slender":
        which = "F5"
    elif p.symmetric and c["web"] == "compact":
        which = "F2" if c["flange"] == "compact" else "F3"
    else:
        which = "F4"
    log.add(
        "section",
        "Section of Chapter F that applies",
        "by flange and web slenderness",
        "flange {f}, web {w}, {s}",
        {"f": c["flange"], "w": c["web"], "s": "doubly symmetric" if p.symmetric else "singly symmetric"},
        which,
        source=f"{SRC} §F1, Table User Note F1.1",
    )
    fn = {"F2": _f2, "F3": _f3, "F4": _f4, "F5": _f5}[which]
    limits = fn(p, Fy, E, Lb, Cb, c, log)
    name, Mn, src = min(limits, key=lambda t: t[1])
    log.add(
        "Mn",
        "Nominal flexural strength (least of the limit states)",
        "Mn = min(" + ", ".join(n for n, _, _ in limits) + ")",
        ", ".join("{m" + str(i) + "}" for i in range(len(limits))),
        {f"m{i}": _kin(m).to("kip*ft") for i, (_, m, _) in enumerate(limits)},
        _kin(Mn).to("kip*ft"),
        source=src,
        governs=True,
        note=f"governed by {name}",
    )
    return Mn, which, name


def _add(log, name, label, sym, tpl, vals, Mn, src) -> float:
    lengths = tuple(k for k in ("Lb", "Lp", "Lr") if k in vals)  # along the member: feet-inches
    log.add(name, label, sym, tpl, vals, _kin(Mn).to("kip*ft"), source=src, positions=lengths)
    return Mn


def _ltb_f2(p: GirderProps, Fy, E, Lb, Cb, log, Mp: float, Sx: float) -> float:
    """Lateral-torsional buckling, AISC 360-16 §F2.2 (Eqs. F2-2 to F2-6), c = 1 (doubly symmetric)."""
    ry = math.sqrt(p.Iy / p.A)
    Lp = 1.76 * ry * math.sqrt(E / Fy)
    jc = p.J / (Sx * p.ho)
    Lr = 1.95 * p.rts * E / (0.7 * Fy) * math.sqrt(jc + math.sqrt(jc**2 + 6.76 * (0.7 * Fy / E) ** 2))
    log.add(
        "Lp",
        "Limiting laterally unbraced length for yielding",
        "Lp = 1.76·ry·√(E/Fy)",
        "1.76 × {ry} × √({E} / {Fy})",
        {"ry": Q_(ry, "in"), "E": Q_(E, "ksi"), "Fy": Q_(Fy, "ksi")},
        Q_(Lp, "in").to("ft"),
        source=f"{SRC} Eq. F2-5",
        positions=("result",),
    )
    log.add(
        "Lr",
        "Limiting unbraced length for inelastic lateral-torsional buckling",
        "Lr = 1.95·rts·E/(0.7Fy)·√(Jc/(Sx·ho) + √((Jc/(Sx·ho))² + 6.76(0.7Fy/E)²))",
        "rts = {rts}, J = {J}, Sx = {Sx}, ho = {ho}",
        {"rts": Q_(p.rts, "in"), "J": Q_(p.J, "in**4"), "Sx": Q_(Sx, "in**3"), "ho": Q_(p.ho, "in")},
        Q_(Lr, "in").to("ft"),
        source=f"{SRC} Eq. F2-6",
        positions=("result",),
    )
    if Lb <= Lp:
        Mn, eq = Mp, "Lb ≤ Lp: the limit state does not apply (Mn = Mp)"
    elif Lb <= Lr:
        Mn = min(Cb * (Mp - (Mp - 0.7 * Fy * Sx) * (Lb - Lp) / (Lr - Lp)), Mp)
        eq = "Mn = Cb·[Mp − (Mp − 0.7Fy·Sx)(Lb − Lp)/(Lr − Lp)] ≤ Mp (Eq. F2-2)"
    else:
        x = (Lb / p.rts) ** 2
        Fcr = Cb * math.pi**2 * E / x * math.sqrt(1 + 0.078 * jc * x)
        Mn, eq = (
            min(Fcr * Sx, Mp),
            "Mn = Fcr·Sx ≤ Mp, Fcr = Cb·π²E/(Lb/rts)²·√(1 + 0.078·Jc/(Sx·ho)·(Lb/rts)²) (F2-3, F2-4)",
        )
    return _add(
        log, "ltb", "Lateral-torsional buckling", eq, "Lb = {Lb}, Cb = {Cb}",
        {"Lb": Q_(Lb, "in").to("ft"), "Cb": Cb}, Mn, f"{SRC} §F2.2",
    )  # fmt: skip


def _f2(p, Fy, E, Lb, Cb, c, log):
    """AISC 360-16 §F2: yielding Mn = Mp = Fy·Zx (F2-1) and lateral-torsional buckling (F2.2)."""
    Mp = _add(log, "Mp", "Plastic moment", "Mp = Fy·Zx", "{Fy} × {Z}",
              {"Fy": Q_(Fy, "ksi"), "Z": Q_(p.Zx, "in**3")}, Fy * p.Zx, f"{SRC} Eq. F2-1")  # fmt: skip
    Sx = min(p.Sxc, p.Sxt)
    out = [("yielding (F2.1)", Mp, f"{SRC} §F2.1")]
    out.append(("lateral-torsional buckling (F2.2)", _ltb_f2(p, Fy, E, Lb, Cb, log, Mp, Sx), f"{SRC} §F2.2"))
    return out


def _f3(p, Fy, E, Lb, Cb, c, log):
    """AISC 360-16 §F3: LTB per F2.2; compression flange local buckling F3.2 (Eqs. F3-1, F3-2)."""
    Mp = Fy * p.Zx
    Sx = min(p.Sxc, p.Sxt)
    out = [("lateral-torsional buckling (F2.2)", _ltb_f2(p, Fy, E, Lb, Cb, log, Mp, Sx), f"{SRC} §F3.1")]
    lam, lp, lr = c["lam_f"], c["lpf"], c["lrf"]
    if c["flange"] == "noncompact":
        Mn = Mp - (Mp - 0.7 * Fy * Sx) * (lam - lp) / (lr - lp)
        eq = "Mn = Mp − (Mp − 0.7Fy·Sx)(λ − λpf)/(λrf − λpf) (Eq. F3-1)"
    else:
        Mn = 0.9 * E * c["kc"] * Sx / lam**2
        eq = "Mn = 0.9·E·kc·Sx/λ² (Eq. F3-2)"
    out.append(("flange local buckling (F3.2)",
                _add(log, "flb", "Compression flange local buckling", eq, "λ = {lam}",
                     {"lam": round(lam, 2)}, Mn, f"{SRC} §F3.2"), f"{SRC} §F3.2"))  # fmt: skip
    return out


def _rp(p, Fy, c, My: float, log, name: str) -> float:
    """Web plastification factor Rpc (Eqs. F4-9a/b, F4-10) or Rpt (F4-15a/b, F4-16)."""
    Mp = min(Fy * p.Zx, 1.6 * Fy * min(p.Sxc, p.Sxt))
    if p.Iyc / p.Iy <= 0.23:
        R, eq = 1.0, "Iyc/Iy ≤ 0.23: R = 1.0"
    elif c["lam_w"] <= c["lpw"]:
        R, eq = Mp / My, "hc/tw ≤ λpw: R = Mp/My"
    else:
        R = min(Mp / My - (Mp / My - 1) * (c["lam_w"] - c["lpw"]) / (c["lrw"] - c["lpw"]), Mp / My)
        eq = "R = [Mp/My − (Mp/My − 1)(λ − λpw)/(λrw − λpw)] ≤ Mp/My"
    eqs = "F4-9a, F4-9b, F4-10" if name == "Rpc" else "F4-15a, F4-15b, F4-16"
    log.add(
        name,
        "Web plastification factor, " + ("compression" if name == "Rpc" else "tension") + " flange",
        eq,
        "Mp = {Mp}, My = {My}, λ = {lam}",
        {"Mp": _kin(Mp).to("kip*ft"), "My": _kin(My).to("kip*ft"), "lam": round(c["lam_w"], 2)},
        R,
        source=f"{SRC} Eqs. {eqs}",
    )
    return R


def _f4(p, Fy, E, Lb, Cb, c, log):
    """AISC 360-16 §F4: compression flange yielding (F4.1), LTB (F4.2), compression flange local
    buckling (F4.3), tension flange yielding (F4.4)."""
    Myc, Myt, FL = Fy * p.Sxc, Fy * p.Sxt, c["FL"]
    Rpc = _rp(p, Fy, c, Myc, log, "Rpc")
    out = [("compression flange yielding (F4.1)",
            _add(log, "cfy", "Compression flange yielding", "Mn = Rpc·Myc = Rpc·Fy·Sxc", "{R} × {Fy} × {S}",
                 {"R": round(Rpc, 4), "Fy": Q_(Fy, "ksi"), "S": Q_(p.Sxc, "in**3")}, Rpc * Myc,
                 f"{SRC} Eq. F4-1"), f"{SRC} §F4.1")]  # fmt: skip
    Lp = 1.1 * p.rt * math.sqrt(E / Fy)
    J = p.J if p.Iyc / p.Iy > 0.23 else 0.0
    js = J / (p.Sxc * p.ho)
    Lr = 1.95 * p.rt * E / FL * math.sqrt(js + math.sqrt(js**2 + 6.76 * (FL / E) ** 2))
    log.add("rt", "Effective radius of gyration for lateral-torsional buckling", "rt = bfc/√(12(1 + aw/6))",
            "{b} / √(12 × (1 + {aw} / 6))", {"b": Q_(p.bfc, "in"), "aw": round(p.aw, 4)},
            Q_(p.rt, "in"), source=f"{SRC} Eq. F4-11")  # fmt: skip
    log.add("Lp", "Limiting laterally unbraced length for yielding", "Lp = 1.1·rt·√(E/Fy)",
            "1.1 × {rt} × √({E} / {Fy})", {"rt": Q_(p.rt, "in"), "E": Q_(E, "ksi"), "Fy": Q_(Fy, "ksi")},
            Q_(Lp, "in").to("ft"), source=f"{SRC} Eq. F4-7", positions=("result",))  # fmt: skip
    log.add("Lr", "Limiting unbraced length for inelastic lateral-torsional buckling",
            "Lr = 1.95·rt·(E/FL)·√(J/(Sxc·ho) + √((J/(Sxc·ho))² + 6.76(FL/E)²))",
            "J = {J}, Sxc = {S}, ho = {ho}, FL = {FL}",
            {"J": Q_(J, "in**4"), "S": Q_(p.Sxc, "in**3"), "ho": Q_(p.ho, "in"), "FL": Q_(FL, "ksi")},
            Q_(Lr, "in").to("ft"), source=f"{SRC} Eq. F4-8", positions=("result",))  # fmt: skip
    if Lb <= Lp:
        Mn, eq = Rpc * Myc, "Lb ≤ Lp: the limit state does not apply"
    elif Lb <= Lr:
        Mn = min(Cb * (Rpc * Myc - (Rpc * Myc - FL * p.Sxc) * (Lb - Lp) / (Lr - Lp)), Rpc * Myc)
        eq = "Mn = Cb·[Rpc·Myc − (Rpc·Myc − FL·Sxc)(Lb − Lp)/(Lr − Lp)] ≤ Rpc·Myc (Eq. F4-2)"
    else:
        x = (Lb / p.rt) ** 2
        Fcr = Cb * math.pi**2 * E / x * math.sqrt(1 + 0.078 * js * x)
        Mn, eq = min(Fcr * p.Sxc, Rpc * Myc), "Mn = Fcr·Sxc ≤ Rpc·Myc (Eqs. F4-3, F4-5)"
    out.append(("lateral-torsional buckling (F4.2)",
                _add(log, "ltb", "Lateral-torsional buckling", eq, "Lb = {Lb}, Cb = {Cb}",
                     {"Lb": Q_(Lb, "in").to("ft"), "Cb": Cb}, Mn, f"{SRC} §F4.2"), f"{SRC} §F4.2"))  # fmt: skip
    if c["flange"] != "compact":
        lam, lp, lr = c["lam_f"], c["lpf"], c["lrf"]
        if c["flange"] == "noncompact":
            Mn = Rpc * Myc - (Rpc * Myc - FL * p.Sxc) * (lam - lp) / (lr - lp)
            eq = "Mn = Rpc·Myc − (Rpc·Myc − FL·Sxc)(λ − λpf)/(λrf − λpf) (Eq. F4-13)"
        else:
            Mn, eq = 0.9 * E * c["kc"] * p.Sxc / lam**2, "Mn = 0.9·E·kc·Sxc/λ² (Eq. F4-14)"
        out.append(("flange local buckling (F4.3)",
                    _add(log, "flb", "Compression flange local buckling", eq, "λ = {lam}", {"lam": round(lam, 2)},
                         Mn, f"{SRC} §F4.3"), f"{SRC} §F4.3"))  # fmt: skip
    if p.Sxt < p.Sxc:
        Rpt = _rp(p, Fy, c, Myt, log, "Rpt")
        out.append(("tension flange yielding (F4.4)",
                    _add(log, "tfy", "Tension flange yielding", "Mn = Rpt·Myt", "{R} × {Fy} × {S}",
                         {"R": round(Rpt, 4), "Fy": Q_(Fy, "ksi"), "S": Q_(p.Sxt, "in**3")}, Rpt * Myt,
                         f"{SRC} Eq. F4-15"), f"{SRC} §F4.4"))  # fmt: skip
    return out


def _f5(p, Fy, E, Lb, Cb, c, log):
    """AISC 360-16 §F5: slender webs — compression flange yielding (F5.1), LTB (F5.2), flange
    local buckling (F5.3), tension flange yielding (F5.4), with Rpg (Eq. F5-6)."""
    aw = min(p.aw, 10.0)
    Rpg = min(1 - aw / (1200 + 300 * aw) * (p.hc / p.tw - 5.7 * math.sqrt(E / Fy)), 1.0)
    log.add("Rpg", "Bending strength reduction factor", "Rpg = 1 − aw/(1200 + 300aw)·(hc/tw − 5.7√(E/Fy)) ≤ 1",
            "aw = {aw}, hc/tw = {r}", {"aw": round(aw, 4), "r": round(p.hc / p.tw, 2)}, Rpg,
            source=f"{SRC} Eq. F5-6")  # fmt: skip
    out = [("compression flange yielding (F5.1)",
            _add(log, "cfy", "Compression flange yielding", "Mn = Rpg·Fy·Sxc", "{R} × {Fy} × {S}",
                 {"R": round(Rpg, 4), "Fy": Q_(Fy, "ksi"), "S": Q_(p.Sxc, "in**3")}, Rpg * Fy * p.Sxc,
                 f"{SRC} Eq. F5-1"), f"{SRC} §F5.1")]  # fmt: skip
    Lp = 1.1 * p.rt * math.sqrt(E / Fy)
    Lr = math.pi * p.rt * math.sqrt(E / (0.7 * Fy))
    if Lb <= Lp:
        Fcr, eq = Fy, "Lb ≤ Lp: the limit state does not apply (Fcr = Fy)"
    elif Lb <= Lr:
        Fcr = min(Cb * (Fy - 0.3 * Fy * (Lb - Lp) / (Lr - Lp)), Fy)
        eq = "Fcr = Cb·[Fy − 0.3Fy(Lb − Lp)/(Lr − Lp)] ≤ Fy (Eq. F5-3)"
    else:
        Fcr = min(Cb * math.pi**2 * E / (Lb / p.rt) ** 2, Fy)
        eq = "Fcr = Cb·π²E/(Lb/rt)² ≤ Fy (Eq. F5-4)"
    out.append(("lateral-torsional buckling (F5.2)",
                _add(log, "ltb", "Lateral-torsional buckling", "Mn = Rpg·Fcr·Sxc; " + eq,
                     "Lb = {Lb}, Lp = {Lp}, Lr = {Lr}, Cb = {Cb}",
                     {"Lb": Q_(Lb, "in").to("ft"), "Lp": Q_(Lp, "in").to("ft"), "Lr": Q_(Lr, "in").to("ft"), "Cb": Cb},
                     Rpg * Fcr * p.Sxc, f"{SRC} §F5.2, Eqs. F5-2 to F5-5"), f"{SRC} §F5.2"))  # fmt: skip
    if c["flange"] != "compact":
        lam, lp, lr = c["lam_f"], c["lpf"], c["lrf"]
        if c["flange"] == "noncompact":
            Fcr, eq = (
                Fy - 0.3 * Fy * (lam - lp) / (lr - lp),
                "Fcr = Fy − 0.3Fy(λ − λpf)/(λrf − λpf) (Eq. F5-8)",
            )
        else:
            Fcr, eq = 0.9 * E * c["kc"] / lam**2, "Fcr = 0.9·E·kc/λ² (Eq. F5-9)"
        out.append(("flange local buckling (F5.3)",
                    _add(log, "flb", "Compression flange local buckling", "Mn = Rpg·Fcr·Sxc; " + eq,
                         "λ = {lam}", {"lam": round(lam, 2)}, Rpg * Fcr * p.Sxc, f"{SRC} §F5.3"),
                    f"{SRC} §F5.3"))  # fmt: skip
    if p.Sxt < p.Sxc:
        out.append(("tension flange yielding (F5.4)",
                    _add(log, "tfy", "Tension flange yielding", "Mn = Fy·Sxt", "{Fy} × {S}",
                         {"Fy": Q_(Fy, "ksi"), "S": Q_(p.Sxt, "in**3")}, Fy * p.Sxt, f"{SRC} Eq. F5-10"),
                    f"{SRC} §F5.4"))  # fmt: skip
    return out


def flexure_check(key: str, label: str, Mu: float, Mn: float, method: str, which: str, log: StepLog) -> Check:
    """Required flexural strength against φb·Mn (LRFD) or Mn/Ωb (ASD), AISC 360-16 §F1."""
    lrfd = method == "LRFD"
    avail = PHI_B * Mn if lrfd else Mn / OMEGA_B
    log.add(
        "Mc",
        "Available flexural strength",
        "φb·Mn (φb = 0.90)" if lrfd else "Mn / Ωb (Ωb = 1.67)",
        "{f} × {Mn}" if lrfd else "{Mn} / {f}",
        {"f": PHI_B if lrfd else OMEGA_B, "Mn": _kin(Mn).to("kip*ft")},
        _kin(avail).to("kip*ft"),
        source=f"{SRC} §F1",
    )
    ratio = Mu / avail
    return Check(
        key,
        label,
        _kin(Mu).to("kip*ft"),
        _kin(avail).to("kip*ft"),
        ratio,
        "OK" if ratio <= 1.0 + 1e-9 else "NG",
        f"{SRC} §{which}",
    )
