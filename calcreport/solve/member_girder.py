"""Member checks of a welded steel plate girder (AISC 360-16): flexure (Chapter F) for each sense
of bending that occurs, web shear (G2.1), proportioning limits (F13.2), and web local yielding and
crippling at the supports (J10.2, J10.3) when the job gives the bearing length.

What the job does not give enough for is returned as :class:`Unchecked` items, never silently
skipped; the defaults taken (Lb = span, Cb = 1.0, k = tf) are stated in steps.
"""

from __future__ import annotations

from ..model import Member, Settings
from ..steps import StepLog
from ..units import Q_, Quantity
from .bracing import unbraced_length
from .checks_steel import flexure_check, flexure_strength
from .checks_steel_web import web_crippling, web_proportions, web_shear, web_yielding
from .results import Check, Unchecked
from .steel_section import IGirder, find_girder, girder_properties

__all__ = ["girder_checks"]

SRC = "AISC 360-16"


def _cb(member: Member, log: StepLog) -> float:
    cb = member.design.get("Cb")
    note = "" if cb is not None else "assumed: no Cb in [member.design]; Cb = 1.0 (conservative)"
    return log.add(
        "Cb",
        "Lateral-torsional buckling modification factor",
        "Cb",
        "{Cb}",
        {"Cb": 1.0 if cb is None else cb},
        1.0 if cb is None else cb,
        source=f"{SRC} §F1" if cb is None else "stated in the job file",
        note=note,
    )


def _k_bottom(member: Member, g: IGirder, log: StepLog) -> float:
    """k for web local yielding: flange thickness plus the flange-to-web fillet weld size (welded
    section: the distance from the outer face of the flange to the web toe of the weld)."""
    tf = g.bottom.t
    weld = None
    for j in member.joints:
        if g.bottom.part.id in j.holds and j.connector.kind == "fillet_weld":
            weld = float(j.connector.params["size"].to("in").magnitude)
    k = tf + (weld or 0.0)
    log.add(
        "k",
        "Distance from the outer face of the flange to the web toe of the weld",
        "k = tf + w" if weld else "k = tf",
        "{tf} + {w}" if weld else "{tf}",
        {"tf": Q_(tf, "in"), "w": Q_(weld or 0.0, "in")},
        Q_(k, "in"),
        source=f"{SRC} §J10.2 (definition of k)",
        note="" if weld else "no fillet weld found at the bottom flange; k = tf (conservative)",
    )
    return k


def girder_checks(
    member: Member, beam, V: Quantity, settings: Settings, log: StepLog, section=None, joints=()
) -> tuple[list[Check], list[Unchecked]]:
    """Checks and not-checked items of a member made of steel plates (see module docstring)."""
    mid = member.id
    key = f"member[{mid}]"
    g, why = find_girder(member)
    if g is None and any(p.shape.kind == "properties" for p in member.parts):
        from .member_cover import cover_plate_checks

        return cover_plate_checks(member, section, beam, joints, settings, log.child("cover"))
    if g is None:
        return [], [
            Unchecked(f"{key}.flexure", "flexure of the steel member", f"{SRC} Chapter F", why),
            Unchecked(f"{key}.web_shear", "shear of the steel web", f"{SRC} Chapter G", why),
        ]
    checks: list[Check] = []
    out: list[Unchecked] = []
    method = settings.method
    # flexure, each sense of bending that occurs
    if beam is None:
        out.append(Unchecked(f"{key}.flexure", "flexure of the plate girder", f"{SRC} Chapter F",
                             "no moment: the job gives a shear only (give span and loads along the member)"))  # fmt: skip
    else:
        env = beam.analysis.envelope
        Mpos = float(env.M_max.to("kip*inch").magnitude.max())
        Mneg = float(-env.M_min.to("kip*inch").magnitude.min())
        flog = log.child("flexure")
        Cb = _cb(member, flog)
        for sense, Mu, comp in (("positive", Mpos, "top"), ("negative", Mneg, "bottom")):
            if Mu <= 1e-9:
                continue
            slog = flog.child(sense)
            Lb = unbraced_length(member, comp, slog, "Lb", f"{SRC} §F1")
            if Lb is None:
                continue
            p = girder_properties(g, comp)
            slog.add("Mu", f"Required flexural strength, {sense} moment ({comp} flange in compression)",
                     "M_r = max over combinations", "{M}", {"M": Q_(Mu, "kip*inch").to("kip*ft")},
                     Q_(Mu, "kip*inch").to("kip*ft"), source="beam analysis (envelope)")  # fmt: skip
            Mn, which, name = flexure_strength(p, g.Fy, g.E, Lb, Cb, slog)
            checks.append(flexure_check(f"{key}.flexure.{sense}", f"Flexure, {sense} moment ({which}, {name})",
                                        Mu, Mn, method, which, slog))  # fmt: skip
    p = girder_properties(g, "top")
    a = member.design.get("stiffener_spacing")
    a_in = None if a is None else float(a.to("in").magnitude)
    wlog = log.child("web")
    checks.append(web_proportions(f"{key}.web_proportions", p, g.E, g.Fy, a_in, wlog))
    Vu = float(abs(V).to("kip").magnitude)
    checks.append(web_shear(f"{key}.web_shear", Vu, p, g.Fy, g.E, a_in, method, wlog.child("shear")))
    if a_in is not None:
        out.append(Unchecked(f"{key}.stiffeners", "transverse stiffener size and moment of inertia",
                             f"{SRC} §G2.3", "not implemented: design the stiffeners by hand"))  # fmt: skip
    checks += _bearings(member, g, p, beam, method, log.child("bearing"), out)
    out.append(Unchecked(f"{key}.splices", "flange and web plate splices", f"{SRC} Chapter J",
                         "not designed by the tool (none are given)"))  # fmt: skip
    return checks, out


def _bearings(
    member: Member, g: IGirder, p, beam, method: str, log: StepLog, out: list[Unchecked]
) -> list[Check]:
    """J10.2 and J10.3 at each support, for the largest reaction over the combinations."""
    key = f"member[{member.id}]"
    d = member.design
    if d.get("bearing_stiffeners"):
        out.append(Unchecked(f"{key}.bearing_stiffeners", "bearing stiffeners at the supports",
                             f"{SRC} §J10.8", "not designed by the tool (stated as provided)"))  # fmt: skip
        return []
    if "bearing_length" not in d or beam is None:
        reason = "no bearing_length in [member.design]" if beam is None or "bearing_length" not in d else ""
        if beam is None:
            reason = "no reactions: the job gives a shear only (give span and loads along the member)"
        for name, clause, what in (("web_yielding", "§J10.2", "web local yielding at the supports"),
                                   ("web_crippling", "§J10.3", "web local crippling at the supports")):  # fmt: skip
            out.append(Unchecked(f"{key}.{name}", what, f"{SRC} {clause}", reason))
        return []
    lb = float(d["bearing_length"].to("in").magnitude)
    k = _k_bottom(member, g, log)
    length = float(beam.analysis.length.to("in").magnitude)
    worst = _largest_reactions(beam)
    checks = []
    for i, (x, Ru) in enumerate(sorted(worst.items()), 1):
        if Ru <= 0:
            continue
        end_dist = min(x, length - x)
        slog = log.child(f"support{i}")
        slog.add("R", f"Largest reaction at support {i}",
                 "R = max over combinations (variable loads in their worst placement)",
                 "{R} at x = {x}", {"R": Q_(Ru, "kip"), "x": Q_(x, "in").to("ft")}, Q_(Ru, "kip"),
                 source="beam analysis", positions=("x",))  # fmt: skip
        checks.append(web_yielding(f"{key}.support{i}.web_yielding", Ru, lb, k, p.tw, g.Fy,
                                   end_dist <= p.d, method, slog, f", support {i}"))  # fmt: skip
        checks.append(web_crippling(f"{key}.support{i}.web_crippling", Ru, lb, p.d, p.tw, g.bottom.t,
                                    g.Fy, g.E, end_dist < p.d / 2, method, slog, f", support {i}"))  # fmt: skip
    return checks


def _largest_reactions(beam) -> dict[float, float]:
    """Largest upward reaction (kip) at each support (by its x, in) over the combinations: fixed
    cases as written, each variable case at its largest reaction where its factor is positive
    (its smallest where negative), from the reaction's influence line (ASCE 7 §4.3.3, §4.4)."""
    an = beam.analysis
    place = an._basis.get("place", {})
    by_case = {d.name: d for d in an.cases}
    worst: dict[float, float] = {}
    for diag in an.combinations:
        for k, r in enumerate(diag.reactions):
            total = 0.0
            for c, f in diag.factors.items():
                if f == 0:
                    continue
                if c in place:
                    ex = place[c]
                    total += f * float((ex.hi if f > 0 else ex.lo)["R"][k])
                elif c in by_case:
                    total += f * float(by_case[c].reactions[k].force.to("lbf").magnitude)
            x = float(r.x.to("in").magnitude)
            worst[x] = max(worst.get(x, 0.0), total / 1000.0)
    return worst
