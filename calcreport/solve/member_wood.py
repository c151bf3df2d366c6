"""Bending of wood members (multi-ply, glued T-beams and other sawn-lumber sections) with the NDS 2018
adjustment factors: C_D (or λ) of each load combination, CM, Ct, CF, Cr and the beam stability
factor CL from the unbraced length (NDS 2018 §3.3.3, Table 3.3.3, Eq. 3.3-6).

Factors the job does not give are stated in the steps: CM = 1.0 (dry service), Ct = 1.0, Cr = 1.0,
CF = 1.0 for lumber 12 in wide or less (its tabulated CF is then ≥ 1.0) or the material's ``CF``.
Where the tool cannot find a factor without guessing (lumber wider than 12 in without ``CF``,
glulam's volume factor CV, CL without Emin) the check is listed as not checked.
"""

from __future__ import annotations

import math

from ..model import Member, Settings
from ..steps import StepLog
from ..units import Q_
from .bracing import unbraced_length
from .checks_wood import Adjust, adjusted
from .member_box import ASSUMED, combination_extremes
from .results import Check, SectionResult, Unchecked

__all__ = ["wood_bending_checks", "beam_stability"]

NDS = "NDS 2018"


def effective_length(lu: float, d: float) -> tuple[float, str]:
    """ℓe from ℓu for any load arrangement (the conservative row of NDS 2018 Table 3.3.3):
    ℓu/d < 7: ℓe = 2.06·ℓu; 7 ≤ ℓu/d ≤ 14.3: ℓe = 1.63·ℓu + 3d; ℓu/d > 14.3: ℓe = 1.84·ℓu."""
    r = lu / d
    if r < 7:
        return 2.06 * lu, "ℓe = 2.06·ℓu (ℓu/d < 7)"
    if r <= 14.3:
        return 1.63 * lu + 3 * d, "ℓe = 1.63·ℓu + 3d (7 ≤ ℓu/d ≤ 14.3)"
    return 1.84 * lu, "ℓe = 1.84·ℓu (ℓu/d > 14.3)"


def beam_stability(
    Fb_star: float, Emin_adj: float, le: float, d: float, b: float
) -> tuple[float, float, float]:
    """RB = √(ℓe·d/b²), FbE = 1.20·Emin′/RB², CL = (1 + FbE/Fb*)/1.9 − √([(1 + FbE/Fb*)/1.9]² −
    (FbE/Fb*)/0.95) — NDS 2018 §3.3.3, Eqs. 3.3-5, 3.3-6. Returns (RB, FbE, CL).

    Example:
        >>> [round(v, 3) for v in beam_stability(1000.0, 580000.0, 200.0, 11.25, 3.0)]
        [15.811, 2784.0, 0.974]
    """
    RB = math.sqrt(le * d / b**2)
    FbE = 1.20 * Emin_adj / RB**2
    a = FbE / Fb_star
    k = (1 + a) / 1.9
    return RB, FbE, k - math.sqrt(k * k - a / 0.95)


def wood_bending_checks(
    member: Member, section: SectionResult, beam, settings: Settings, log: StepLog
) -> tuple[list[Check], list[Unchecked]]:
    """Bending stress at each wood material's extreme fibre, σ = n·M·c/I, against Fb′ with its
    adjustment factors, for the combination that governs (see the module docstring)."""
    key = f"member[{member.id}]"
    checks: list[Check] = []
    out: list[Unchecked] = []
    if beam is None:
        return checks, [
            Unchecked(f"{key}.bending", "bending stress of the wood member", f"{NDS} §3.3",
                      "no moment: the job gives a shear only (give span and loads along the member)")
        ]  # fmt: skip
    extremes = combination_extremes(beam, settings.method)
    bottom = float(section.bottom.to("in").magnitude)
    ybar = float(section.centroid.to("in").magnitude)
    d = float(section.depth.to("in").magnitude)
    b = max(p.shape.bbox[2] for p in member.parts) - min(p.shape.bbox[0] for p in member.parts)
    seen: set[str] = set()
    for part, props in zip(member.parts, section.parts):
        mat = part.material
        if mat.id in seen:
            continue
        if mat.Fb is None:
            seen.add(mat.id)
            out.append(Unchecked(f"{key}.bending.{mat.id}", f"bending stress of {mat.id}", f"{NDS} §3.3",
                                 f"no Fb given for material {mat.id}"))  # fmt: skip
            continue
        seen.add(mat.id)
        same = [(pt, pp) for pt, pp in zip(member.parts, section.parts) if pt.material.id == mat.id]
        top_c = max(pt.shape.bbox[3] - bottom - ybar for pt, _ in same)
        bot_c = max(ybar - (pt.shape.bbox[1] - bottom) for pt, _ in same)
        mlog = log.child(f"bending.{mat.id}")
        if mat.family == "glulam":
            out.append(Unchecked(f"{key}.bending.{mat.id}", f"bending of glulam {mat.id} with CV",
                                 f"{NDS} §5.3.6", "volume factor CV not implemented"))  # fmt: skip
            continue
        width = max(
            max(pt.shape.bbox[2] - pt.shape.bbox[0], pt.shape.bbox[3] - pt.shape.bbox[1]) for pt, _ in same
        )
        CF = mat.extra.get("CF")
        if CF is None and width > 12.0 + 1e-6:
            out.append(Unchecked(f"{key}.bending.{mat.id}", f"bending stress of {mat.id}", f"{NDS} Supplement Table 4A",
                                 "lumber wider than 12 in: give the size factor CF on the material"))  # fmt: skip
            continue
        cf = 1.0 if CF is None else float(CF)
        Cr = float(member.design.get("Cr", 1.0))
        mlog.add("factors", f"Adjustment factors for bending of {mat.id}", "CM, Ct, CF, Cr", "{CM}, {Ct}, {CF}, {Cr}",
                 {"CM": 1.0, "Ct": 1.0, "CF": cf, "Cr": Cr}, f"1.0, 1.0, {cf:g}, {Cr:g}", source=f"{NDS} Table 4.3.1",
                 note=ASSUMED + ("; CF = 1.0 taken (lumber 12 in wide or less)" if CF is None else "; CF as given")
                 + ("" if "Cr" in member.design else "; Cr = 1.0 (not a repetitive member)"))  # fmt: skip
        for sense, c, idx, flange in (
            ("positive", max(top_c, bot_c), 0, "top"),
            ("negative", max(top_c, bot_c), 1, "bottom"),
        ):
            cand = [
                (name, cd, float(M.max()) if idx == 0 else float(-M.min())) for name, cd, _V, M in extremes
            ]
            name, cd, Mv = max(cand, key=lambda t: t[2] / t[1])
            if Mv <= 1e-6 * max(abs(float(e[3].max())) + abs(float(e[3].min())) for e in extremes):
                continue
            slog = mlog.child(sense)
            a = Adjust(CD=cd, CF=cf * Cr, method=settings.method)
            Fb_star = adjusted("Fb", f"Fb* of {mat.id} (all factors but CL), {name}", mat.Fb, a, slog)
            lu = unbraced_length(member, flange, slog, "lu", f"{NDS} §3.3.3")
            CL = 1.0
            if lu and d / b > 2.0:
                if mat.extra.get("Emin") is None:
                    out.append(Unchecked(f"{key}.bending.{mat.id}.{sense}", f"beam stability CL of {mat.id}",
                                         f"{NDS} §3.3.3", f"no Emin given for material {mat.id}"))  # fmt: skip
                    continue
                le, eq = effective_length(lu, d)
                Emin = adjusted(
                    "Emin", f"Emin′ of {mat.id}", mat.extra["Emin"], Adjust(1.0, method=settings.method), slog
                )
                RB, FbE, CL = beam_stability(
                    float(Fb_star.to("psi").magnitude), float(Emin.to("psi").magnitude), le, d, b
                )
                slog.add("CL", f"Beam stability factor of {mat.id}", "CL = (1 + FbE/Fb*)/1.9 − √(((1 + FbE/Fb*)/1.9)² − (FbE/Fb*)/0.95)",
                         eq + "; RB = √(ℓe·d/b²) = {RB}, FbE = 1.20·Emin′/RB² = {FbE}",
                         {"RB": round(RB, 2), "FbE": Q_(FbE, "psi")}, CL, source=f"{NDS} §3.3.3, Table 3.3.3, Eq. 3.3-6")  # fmt: skip
                if RB > 50:
                    checks.append(Check(f"{key}.bending.{mat.id}.{sense}.RB", f"Slenderness ratio RB of {mat.id} (≤ 50)",
                                        round(RB, 2), 50.0, RB / 50, "NG", f"{NDS} §3.3.3.7"))  # fmt: skip
            elif lu and d / b <= 2.0:
                slog.add("CL", f"Beam stability factor of {mat.id}", "CL = 1.0 (d/b ≤ 2)", "d/b = {r}",
                         {"r": round(d / b, 3)}, 1.0, source=f"{NDS} §4.4.1.1")  # fmt: skip
            Fb_adj = (Fb_star * CL).to("psi")
            M = Q_(Mv, "lbf*inch")
            fb = slog.add("fb", f"Bending stress of {mat.id}, {sense} moment, {name}", "fb = n·M·c / I",
                          "{n} × {M} × {c} / {I}", {"n": props.n, "M": M, "c": Q_(c, "in"), "I": section.inertia},
                          (props.n * M * Q_(c, "in") / section.inertia).to("psi"), source="mechanics of materials")  # fmt: skip
            slog.add("Fb_prime", f"Adjusted bending design value of {mat.id}", "Fb′ = Fb*·CL", "{F} × {CL}",
                     {"F": Fb_star, "CL": CL}, Fb_adj, source=f"{NDS} §3.3, Table 4.3.1")  # fmt: skip
            r = float((fb / Fb_adj).to("").magnitude)
            checks.append(Check(f"{key}.bending.{mat.id}.{sense}", f"Bending of {mat.id}, {sense} moment ({name})",
                                fb, Fb_adj, r, "OK" if r <= 1 + 1e-9 else "NG", f"{NDS} §3.3.1"))  # fmt: skip
    return checks, out
