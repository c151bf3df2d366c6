"""Member checks of plies side by side and flitch beams (issue 14): each ply under its share.

* Wood plies: bending fb = share·M / S against Fb′ = Fb·C_D·CM·Ct·CF·Cr·CL per combination
  (NDS 2018 §3.3, Table 4.3.1; CL by §3.3.3 with the width of the fastened plies together);
  shear fv = 1.5·share·V / (b·d) against Fv′ (NDS 2018 §3.4.2, Eq. 3.4-2).
* Steel flitch plate: flexure of a rectangular bar, AISC 360-16 F11 (yielding F11-1, lateral-
  torsional buckling F11-2 to F11-4 with Lb = the largest bolt spacing: the timbers brace the plate
  at each bolt — an assumption recorded with the member) and shear, G2.1 (Cv1 by G2-3/G2-4, kv = 5.34).
* The minimum fastening practice requires (two rows of 16d at 12 in for 2x plies) — an INFO row,
  never the design result; bearing is listed as not checked.
"""

from __future__ import annotations

from ..model import Member, Settings
from ..steps import Phrase, StepLog
from ..units import Q_
from .bracing import unbraced_length
from .checks_wood import Adjust, adjusted
from .member_box import combination_extremes
from .member_wood import beam_stability, effective_length
from .plies import PlyShare
from .plies_plate import plate_flexure, steel_ply_checks
from .results import Assumed, Check, Unchecked
from .scope_expect import Expectation

__all__ = ["ply_checks", "ply_expectations", "plate_flexure", "plate_assumed"]

NDS = "NDS 2018"
AISC = "AISC 360-16"


def _status(r: float) -> str:
    return "OK" if r <= 1 + 1e-9 else "NG"


def _wood(member, sh: PlyShare, part, extremes, settings, log, total_b, d_all, key):
    checks: list[Check] = []
    out: list[Unchecked] = []
    mat = part.material
    pid = sh.id
    S = sh.width * sh.depth**2 / 6
    if mat.Fb is None:
        out.append(
            Unchecked(
                f"{key}.bending.{pid}",
                f"bending of ply {pid}",
                f"{NDS} §3.3",
                f"no Fb given for material {mat.id}",
            )
        )
    elif mat.family == "glulam":
        out.append(
            Unchecked(
                f"{key}.bending.{pid}",
                f"bending of glulam ply {pid} with CV",
                f"{NDS} §5.3.6",
                "volume factor CV not implemented",
            )
        )
    elif sh.depth > 12.0 + 1e-6 and mat.extra.get("CF") is None:
        out.append(Unchecked(f"{key}.bending.{pid}", f"bending of ply {pid}", f"{NDS} Supplement Table 4A",
                             "ply deeper than 12 in: give the size factor CF on the material"))  # fmt: skip
    else:
        cf = float(mat.extra.get("CF") or 1.0)
        Cr = float(member.design.get("Cr", 1.0))
        name, cd, Mv = max(
            ((n, c, float(abs(M).max())) for n, c, _V, M in extremes), key=lambda r: r[2] / r[1]
        )
        slog = log.child(f"bending.{pid}")
        Mi = slog.add("M", f"Moment carried by ply {pid}, {name}", "M_i = share·M", "{s} × {M}",
                      {"s": round(sh.share, 4), "M": Q_(Mv, "lbf*inch")}, Q_(sh.share * Mv, "lbf*inch"),
                      source="mechanics of materials (share by E·I)")  # fmt: skip
        fb = slog.add("fb", f"Bending stress of ply {pid}", "fb = M_i / S, S = b·d²/6", "{M} / {S}",
                      {"M": Mi, "S": Q_(S, "inch**3")}, (Mi / Q_(S, "inch**3")).to("psi"), source="mechanics of materials")  # fmt: skip
        Fb_star = adjusted(
            "Fb",
            f"Fb* of ply {pid} (all factors but CL), {name}",
            mat.Fb,
            Adjust(CD=cd, CF=cf * Cr, method=settings.method),
            slog,
        )
        lu = unbraced_length(member, "top", slog, "lu", f"{NDS} §3.3.3")
        CL, scope = 1.0, ""
        if lu is not None and d_all / total_b <= 2.0:
            slog.add("CL", f"Beam stability factor of ply {pid}", "CL = 1.0 (d/b ≤ 2)", "d/b = {r}", {"r": round(d_all / total_b, 3)},
                     1.0, source=f"{NDS} §4.4.1.1", note="b = width of the fastened plies together (assumption)")  # fmt: skip
            scope = "stability"
        elif lu:
            if mat.extra.get("Emin") is None:
                out.append(
                    Unchecked(
                        f"{key}.stability.{pid}",
                        f"beam stability CL of ply {pid}",
                        f"{NDS} §3.3.3",
                        f"no Emin given for material {mat.id}",
                    )
                )
            else:
                le, eq = effective_length(lu, d_all)
                Emin = adjusted(
                    "Emin",
                    f"Emin′ of ply {pid}",
                    mat.extra["Emin"],
                    Adjust(1.0, method=settings.method),
                    slog,
                )
                RB, FbE, CL = beam_stability(
                    float(Fb_star.to("psi").magnitude), float(Emin.to("psi").magnitude), le, d_all, total_b
                )
                slog.add("CL", f"Beam stability factor of ply {pid}", "CL = (1 + FbE/Fb*)/1.9 − √(((1 + FbE/Fb*)/1.9)² − (FbE/Fb*)/0.95)",
                         eq + "; RB = {RB}, FbE = {FbE}", {"RB": round(RB, 2), "FbE": Q_(FbE, "psi")}, CL,
                         source=f"{NDS} §3.3.3, Eq. 3.3-6", note="b = width of the fastened plies together (assumption)")  # fmt: skip
                scope = "stability"
        elif lu == 0.0:
            slog.add("CL", f"Beam stability factor of ply {pid}", "CL = 1.0 (braced along its length)", "ℓu = {lu}",
                     {"lu": Q_(0.0, "inch")}, 1.0, source=f"{NDS} §3.3.3")  # fmt: skip
            scope = "stability"
        Fb_adj = slog.add("Fb_prime", f"Adjusted bending design value of ply {pid}", "Fb′ = Fb*·CL", "{F} × {CL}",
                          {"F": Fb_star, "CL": CL}, (Fb_star * CL).to("psi"), source=f"{NDS} §3.3, Table 4.3.1")  # fmt: skip
        r = float((fb / Fb_adj).to("").magnitude)
        checks.append(Check(f"{key}.bending.{pid}", f"Bending of ply {pid} under its share ({name})", fb, Fb_adj, r,
                            _status(r), f"{NDS} §3.3.1", scope=scope))  # fmt: skip
    if mat.Fv is None:
        out.append(
            Unchecked(
                f"{key}.shear.{pid}",
                f"shear of ply {pid}",
                f"{NDS} §3.4",
                f"no Fv given for material {mat.id}",
            )
        )
        return checks, out
    name, cd, Vv = max(((n, c, float(abs(V).max())) for n, c, V, _M in extremes), key=lambda r: r[2] / r[1])
    slog = log.child(f"shear.{pid}")
    Vi = slog.add("V", f"Shear carried by ply {pid}, {name}", "V_i = share·V", "{s} × {V}",
                  {"s": round(sh.share, 4), "V": Q_(Vv, "lbf")}, Q_(sh.share * Vv, "lbf"), source="mechanics of materials (share by E·I)")  # fmt: skip
    fv = slog.add("fv", f"Shear stress of ply {pid}", "fv = 1.5·V_i / (b·d)", "1.5 × {V} / ({b} × {d})",
                  {"V": Vi, "b": Q_(sh.width, "inch"), "d": Q_(sh.depth, "inch")},
                  (1.5 * Vi / Q_(sh.width * sh.depth, "inch**2")).to("psi"), source=f"{NDS} §3.4.2, Eq. 3.4-2",
                  note="largest shear taken at the support (no reduction within d of it)")  # fmt: skip
    Fv = adjusted("Fv", f"Fv′ of ply {pid}, {name}", mat.Fv, Adjust(CD=cd, method=settings.method), slog)
    r = float((fv / Fv).to("").magnitude)
    checks.append(
        Check(
            f"{key}.shear.{pid}",
            f"Shear of ply {pid} under its share ({name})",
            fv,
            Fv,
            r,
            _status(r),
            f"{NDS} §3.4.2",
        )
    )
    return checks, out


def _largest_spacing(joints) -> float | None:
    vals = [
        float(z.spacing.to("inch").magnitude)
        for j in joints
        if j.schedule is not None
        for z in j.schedule.zones
    ]
    vals += [
        float(j.spacing_provided.to("inch").magnitude)
        for j in joints
        if j.schedule is None and j.spacing_provided is not None
    ]
    return max(vals) if vals else None


def _minimum_practice(member: Member, joints, key: str) -> Check:
    """Minimum fastening of plies whatever the load: two rows of 16d common at 12 in for nailed
    2x plies, two rows of bolts at 24 in staggered for bolted plies (common practice, no source)
    — INFO, never the design result. The rule and what was provided travel as a phrase
    (``ply_minimum``: fastener, rows, spacings, whether met) that the outputs word."""
    f = member.ply_fastening
    s = _largest_spacing(joints)
    bolts = f is not None and f.connector.kind in ("wood_bolt", "lag_screw")
    s_max = 24.0 if bolts else 12.0
    meets = f is not None and f.rows >= 2 and s is not None and s <= s_max + 1e-9
    facts = {
        "fastener": "bolt" if bolts else "nail",
        "rows_min": 2,
        "spacing_max": Q_(s_max, "inch"),
        "rows": f.rows if f is not None and s else 0,
        "spacing": Q_(s, "inch") if f is not None and s else "",
        "meets": meets,
    }
    return Check(f"{key}.ply_minimum", "Minimum fastening of plies", None, None, None, "INFO",
                 "common practice, no source", phrase=Phrase("ply_minimum", facts))  # fmt: skip


def ply_checks(
    member: Member, shares: tuple[PlyShare, ...], beam, settings: Settings, log: StepLog, joints=()
) -> tuple[list[Check], list[Unchecked]]:
    """Checks of every ply under its share, the practice minimum and what did not run."""
    key = f"member[{member.id}]"
    checks: list[Check] = []
    out: list[Unchecked] = []
    if beam is None:
        return checks, [
            Unchecked(
                f"{key}.bending",
                "bending of the plies",
                f"{NDS} §3.3",
                "members of plies need span and loads",
            )
        ]
    extremes = combination_extremes(beam, settings.method)
    total_b = sum(s.width for s in shares if s.family != "steel") or sum(s.width for s in shares)
    d_all = max(s.top for s in shares) - min(s.bottom for s in shares)
    Lb = _largest_spacing(joints)
    for sh, ply in zip(shares, member.plies):
        if sh.family == "steel":
            if Lb is None:
                out.append(
                    Unchecked(
                        f"{key}.plate_flexure.{sh.id}",
                        f"flexure of the flitch plate, ply {sh.id}",
                        f"{AISC} F11",
                        "no bolt schedule to brace the plate",
                    )
                )
                continue
            c, u = steel_ply_checks(member, sh, ply.part, extremes, settings, log, Lb, key)
        else:
            c, u = _wood(member, sh, ply.part, extremes, settings, log, total_b, d_all, key)
        checks += c
        out += u
    checks.append(_minimum_practice(member, joints, key))
    c, u = _bearing(member, shares, beam, settings, log.child("bearing"), key)
    checks += c
    out += u
    return checks, out


def _bearing(member: Member, shares: tuple[PlyShare, ...], beam, settings: Settings, log: StepLog, key: str):
    """Bearing of the wood plies on the supports: fc⊥ = R_i / (b_i·lb) ≤ Fc⊥′ = Fc⊥·CM·Ct·Cb
    (NDS 2018 §3.10.2, Table 4.3.1; no C_D for Fc⊥; LRFD KF = 1.67, φ = 0.90), Cb = 1.0 taken
    (§3.10.4 allows more away from the ends). R_i: all-wood members, each ply's share of the
    reaction (each ply bears with its share); flitch beams, the wood plies by width (the plate is
    not relied on to bear). R = Σ |V| beside the support over the envelope."""
    import numpy as np

    wood = [(s, p) for s, p in zip(shares, member.plies) if s.family != "steel"]
    lb_q = member.design.get("bearing_length")
    missing = [p.part.material.id for _s, p in wood if p.part.material.extra.get("Fc_perp") is None]
    if lb_q is None or missing:
        why = (
            "no bearing_length in [member.design]"
            if lb_q is None
            else f"no Fc_perp given for material {', '.join(sorted(set(missing)))}"
        )
        return [], [
            Unchecked(f"{key}.bearing", "bearing of the plies on the supports, Fc⊥", f"{NDS} §3.10", why)
        ]
    lb = float(lb_q.to("inch").magnitude)
    flitch = len(wood) < len(shares)
    bw = sum(s.width for s, _p in wood)
    env = beam.analysis.envelope
    xs = np.asarray(env.x.to("inch").magnitude)
    V = np.asarray(env.V_abs.to("lbf").magnitude)
    L = float(beam.analysis.length.to("inch").magnitude)
    lrfd = settings.method == "LRFD"
    checks: list[Check] = []
    for i, sup in enumerate(beam.analysis.supports, 1):
        x = float(sup.x.to("inch").magnitude)
        at = np.abs(xs - x) <= 1e-6 * max(L, 1.0)
        R = float(V[at].sum()) if at.any() else 0.0
        slog = log.child(f"support{i}")
        Rq = slog.add("R", f"Reaction at support {i} (largest over the combinations)", "R = Σ |V| beside the support", "{R}",
                      {"R": Q_(R, "lbf")}, Q_(R, "lbf"), source="statics")  # fmt: skip
        worst_c: Check | None = None
        for s, p in wood:
            part = Rq * (s.width / bw if flitch else s.share)
            fc = slog.add(f"{s.id}.fc", f"Bearing stress of ply {s.id} at support {i}", "fc⊥ = R_i / (b·lb)", "{R} / ({b} × {lb})",
                          {"R": part, "b": Q_(s.width, "inch"), "lb": lb_q}, (part / Q_(s.width * lb, "inch**2")).to("psi"),
                          source=f"{NDS} §3.10.2", note="plate not relied on to bear" if flitch else "each ply bears with its share")  # fmt: skip
            F = p.part.material.extra["Fc_perp"]
            Fa = slog.add(f"{s.id}.Fc_perp", f"Adjusted Fc⊥ of ply {s.id}", "Fc⊥′ = Fc⊥·KF·φ·CM·Ct·Cb" if lrfd else "Fc⊥′ = Fc⊥·CM·Ct·Cb",
                          "{F} × 1.67 × 0.90 × 1.0 × 1.0 × 1.0" if lrfd else "{F} × 1.0 × 1.0 × 1.0", {"F": F},
                          (F * (1.67 * 0.9 if lrfd else 1.0)).to("psi"), source=f"{NDS} Table 4.3.1, §3.10.4",
                          note="CM = Ct = 1.0 (dry, normal temperature) and Cb = 1.0 taken; no C_D for Fc⊥")  # fmt: skip
            r = float((fc / Fa).to("").magnitude)
            c = Check(f"{key}.bearing.support{i}", f"Bearing of the plies on support {i} (Fc⊥; ply {s.id} governs)", fc, Fa, r,
                      _status(r), f"{NDS} §3.10")  # fmt: skip
            if worst_c is None or r > (worst_c.ratio or 0.0):
                worst_c = c
        if worst_c is not None:
            checks.append(worst_c)
    return checks, []


def plate_assumed(member: Member, joints) -> list[Assumed]:
    """The flitch plate's bracing (an assumption the F11 check rests on)."""
    if not any(p.part.material.family == "steel" for p in member.plies):
        return []
    s = _largest_spacing(joints)
    return [Assumed(f"member[{member.id}].ply_fastening", "Flitch plate braced laterally by the timbers at every bolt (Lb = largest bolt spacing)",
                    Q_(s, "inch") if s is not None else "—", "spacing_max in [member.ply_fastening] limits Lb", f"{AISC} F11 (assumption)"),
            Assumed(f"member[{member.id}].ply_fastening.bearings", "Flitch plate not relied on to bear on the supports: its share of each reaction passes to the timbers through the bolts within d of the bearing",
                    "bolts at the bearings", "not adjustable", "common practice, no source")]  # fmt: skip


def ply_expectations(member: Member, has_moment: bool) -> list[Expectation]:
    """What a plan checker expects of a member of plies."""
    why = "the job gives no moment (give span and loads)" if not has_moment else "not checked"
    out = []
    wood = False
    for p in member.plies:
        m = p.part.material
        if m.family == "steel":
            out.append(
                Expectation(
                    f"plate_flexure.{p.id}",
                    (f"plate_flexure:{p.id}",),
                    f"flexure of the flitch plate, ply {p.id}",
                    f"{AISC} F11",
                    why,
                )
            )
        else:
            wood = True
            out.append(
                Expectation(
                    f"bending.{p.id}", (f"bending:{p.id}",), f"bending of ply {p.id}", f"{NDS} §3.3", why
                )
            )
        out.append(
            Expectation(
                f"shear.{p.id}",
                (f"shear:{p.id}",),
                f"shear of ply {p.id}",
                f"{AISC} G2.1" if m.family == "steel" else f"{NDS} §3.4",
                why,
            )
        )
    if wood:
        out.append(
            Expectation(
                "stability",
                ("stability", "CL"),
                "lateral stability, beam stability factor CL",
                f"{NDS} §3.3.3",
                "no unbraced length given",
            )
        )
        out.append(
            Expectation(
                "bearing",
                ("bearing",),
                "bearing on the supports, Fc⊥",
                f"{NDS} §3.10",
                "no bearing_length in [member.design] or no Fc_perp on the wood materials",
            )
        )
    out.append(_bracing_expectation(member, wood))
    out.append(Expectation("deflection", ("deflection",), "deflection of the plies together", "IBC 2021 Table 1604.3",
                           "no loads given" if not has_moment else "no deflection limit applies to the load cases given"))  # fmt: skip
    return out


def _bracing_expectation(member: Member, wood: bool) -> Expectation:
    """What the stability checks of a member of plies rest on and no check covers: the lateral
    bracing of the assembly. The CL of the wood plies takes the edge braced as the job states (or
    the whole span unbraced, with the ends held against rotation) and the plies acting together
    laterally (b = their width together); a flitch plate's F11 check takes it braced by the timbers
    at every bolt. The bracing members, their fastening and stiffness are never checked here: the
    item is always listed (no check carries its tag). Common practice of plan review, no source."""
    d = member.design
    steel = any(p.part.material.family == "steel" for p in member.plies)
    if d.get("continuous_bracing"):
        edge = "the top edge braced continuously (continuous_bracing)"
    elif "unbraced_length" in d:
        edge = "the top edge braced at the stated unbraced_length"
    else:
        edge = "the whole span unbraced, ends held against rotation"
    rests = [f"CL takes {edge} and the plies acting as one"] if wood else []
    if steel:
        rests.append("F11 takes the plate braced by the timbers at each bolt")
    clause = f"{NDS} §3.3.3, §4.4.1" + (f"; {AISC} Appendix 6" if steel else "")
    return Expectation(
        "bracing",
        ("bracing_of_assembly",),
        "lateral bracing of the assembly (members, fastening, stiffness)",
        clause,
        "; ".join(rests) + ": the bracing is the engineer's to confirm",
    )
