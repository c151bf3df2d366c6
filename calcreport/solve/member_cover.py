"""Cover-plated rolled beams: the theoretical cut-off points of each partial-length cover plate from
the moment envelope, and the plate's termination (AISC 360-16 §F13.3): the extension a′ beyond the
cut-off (Eqs. F13-5 to F13-7) and the welds within a′ that must develop the plate's share of the
flexural strength at the cut-off point.

The rolled beam must be given by designation (its properties, J and Cw from the AISC Shapes
Database v16.0); its available strength without the plate is found by AISC 360-16 F2 (or F3).
The flexure of the cover-plated section itself is listed as not checked.
"""

from __future__ import annotations

import numpy as np

from ..model import Member, Part, Settings
from ..steps import Phrase, StepLog
from ..units import Q_
from .bracing import unbraced_length
from .checks_steel import OMEGA_B, PHI_B, flexure_strength
from .results import Check, SectionResult, Unchecked
from .steel_section import rolled_properties

__all__ = ["cover_plate_checks"]

SRC = "AISC 360-16"


def _plates(member: Member, beam_part: Part) -> list[tuple[Part, str]]:
    """Steel plates lying on the rolled shape's top or bottom face: (part, "top" | "bottom")."""
    x0, y0, x1, y1 = beam_part.shape.bbox
    out = []
    for p in member.parts:
        if p is beam_part or p.shape.kind != "polygon":
            continue
        px0, py0, px1, py1 = p.shape.bbox
        overlap = min(x1, px1) - max(x0, px0) > 1e-6
        if overlap and abs(py0 - y1) < 1e-6:
            out.append((p, "top"))
        elif overlap and abs(py1 - y0) < 1e-6:
            out.append((p, "bottom"))
    return out


def _crossings(x: np.ndarray, m: np.ndarray, cap: float) -> tuple[float, float] | None:
    """First and last x where m(x) exceeds cap, interpolated linearly between grid points."""
    over = np.nonzero(m > cap)[0]
    if over.size == 0:
        return None
    i, j = int(over[0]), int(over[-1])

    def cross(a: int, b: int) -> float:
        if m[b] == m[a]:
            return float(x[b])
        return float(x[a] + (cap - m[a]) * (x[b] - x[a]) / (m[b] - m[a]))

    x1 = float(x[0]) if i == 0 else cross(i - 1, i)
    x2 = float(x[-1]) if j == len(x) - 1 else cross(j, j + 1)
    return x1, x2


def cover_plate_checks(
    member: Member, section: SectionResult, beam, joints, settings: Settings, log: StepLog
) -> tuple[list[Check], list[Unchecked]]:
    """Cut-off points and F13.3 termination of each cover plate (see the module docstring)."""
    from ..shapes_db import DATABASE, lookup

    key = f"member[{member.id}]"
    rolled = [p for p in member.parts if p.shape.kind == "properties"]
    out: list[Unchecked] = [
        Unchecked(f"{key}.flexure", "flexure of the cover-plated section", f"{SRC} Chapter F, §F13.1",
                  "not implemented: check the cover-plated section by hand"),
        Unchecked(f"{key}.web_shear", "shear of the rolled beam's web", f"{SRC} §G2.1", "not implemented"),
    ]  # fmt: skip
    if len(rolled) != 1 or rolled[0].shape.source != DATABASE:
        out.append(Unchecked(f"{key}.cover_plate_termination", "cover-plate termination (extension a′, end welds)",
                             f"{SRC} §F13.3", "the rolled beam is not one shape given by designation"))  # fmt: skip
        return [], out
    bp = rolled[0]
    plates = _plates(member, bp)
    if beam is None or not plates:
        why = "no moment envelope: give span and loads" if beam is None else "no cover plate on a flange"
        out.append(Unchecked(f"{key}.cover_plate_termination", "cover-plate termination (extension a′, end welds)",
                             f"{SRC} §F13.3", why))  # fmt: skip
        return [], out
    row = lookup(bp.shape.nominal)
    Fy = float(bp.material.Fy.to("ksi").magnitude) if bp.material.Fy is not None else None
    if Fy is None:
        out.append(Unchecked(f"{key}.cover_plate_termination", "cover-plate termination", f"{SRC} §F13.3",
                             f"no Fy given for material {bp.material.id}"))  # fmt: skip
        return [], out
    E = float(bp.material.E.to("ksi").magnitude)
    blog = log.child("bare")
    Lb = unbraced_length(member, "top", blog, "Lb", f"{SRC} §F1")
    Cb = member.design.get("Cb", 1.0)
    Mn, which, _ = flexure_strength(rolled_properties(row), Fy, E, Lb or 0.0, Cb, blog, rolled=True)
    lrfd = settings.method == "LRFD"
    Mc = PHI_B * Mn if lrfd else Mn / OMEGA_B
    blog.add("Mc", f"Available flexural strength of the {row.designation} alone",
             "φb·Mn" if lrfd else "Mn / Ωb", "{Mn}", {"Mn": Q_(Mn, "kip*inch").to("kip*ft")},
             Q_(Mc, "kip*inch").to("kip*ft"), source=f"{SRC} §F1, §{which}")  # fmt: skip
    env = beam.analysis.envelope
    x = env.x.to("in").magnitude
    m = np.maximum(env.M_max.to("kip*inch").magnitude, -env.M_min.to("kip*inch").magnitude)
    span = float(beam.analysis.length.to("in").magnitude)
    checks: list[Check] = []
    for plate, face in plates:
        plog = log.child(f"plate.{plate.id}")
        ckey = f"{key}.cover_plate[{plate.id}]"
        cut = _crossings(x, m, Mc)
        if cut is None:
            checks.append(Check(f"{ckey}.required", f"Cover plate {plate.id} not needed for strength (M ≤ Mc of the beam alone)",
                                Q_(float(m.max()), "kip*inch").to("kip*ft"), Q_(Mc, "kip*inch").to("kip*ft"),
                                float(m.max()) / Mc, "INFO", f"{SRC} §F13.3"))  # fmt: skip
            continue
        x1, x2 = cut
        plog.add("cutoff", f"Theoretical cut-off points of cover plate {plate.id} ({face} flange)", "M_envelope(x) = Mc of the beam alone",
                 "from {x1} to {x2}", {"x1": Q_(x1, "in"), "x2": Q_(x2, "in")}, Q_(x2 - x1, "in"),
                 source="beam analysis (moment envelope)", positions=("x1", "x2", "result"))  # fmt: skip
        w = plate.shape.bbox[2] - plate.shape.bbox[0]
        t = plate.shape.bbox[3] - plate.shape.bbox[1]
        joint = next((j for j in joints if plate.id in j.holds and j.continuous), None)
        jspec = next((j for j in member.joints if plate.id in j.holds), None)
        if joint is None or jspec is None or jspec.connector.kind != "fillet_weld":
            out.append(Unchecked(f"{ckey}.termination", f"termination welds of cover plate {plate.id}", f"{SRC} §F13.3",
                                 "not a continuous fillet-welded cover plate (bolted or intermittent: not implemented)"))  # fmt: skip
            continue
        end_weld = member.design.get("cover_plate_end_weld")
        if end_weld is None:
            out.append(Unchecked(f"{ckey}.termination", f"termination welds of cover plate {plate.id}", f"{SRC} §F13.3",
                                 "give cover_plate_end_weld = true or false in [member.design]"))  # fmt: skip
            continue
        size = float(jspec.connector.params["size"].to("in").magnitude)
        lines = int(jspec.connector.params.get("welds") or 1)
        if end_weld and size >= 0.75 * t:
            k, eq, how = 1.0, "F13-5", "continuous weld ≥ ¾·t across the end"
        elif end_weld:
            k, eq, how = 1.5, "F13-6", "continuous weld < ¾·t across the end"
        else:
            k, eq, how = 2.0, "F13-7", "no weld across the end"
        a = plog.add("a", f"Extension of cover plate {plate.id} beyond the cut-off", f"a′ = {k:g}·w", f"{k:g} × {{w}}",
                     {"w": Q_(w, "in")}, Q_(k * w, "in"), source=f"{SRC} Eq. {eq}", note=how)  # fmt: skip
        plog.add("ends", f"Cover plate {plate.id} to run at least", "x1 − a′ to x2 + a′", "{s} to {e}",
                        {"s": Q_(max(x1 - k * w, 0.0), "in"), "e": Q_(min(x2 + k * w, span), "in")},
                        Q_(min(x2 + k * w, span) - max(x1 - k * w, 0.0), "in"), source=f"{SRC} §F13.3",
                        positions=("s", "e", "result"))  # fmt: skip
        props = next(p for p in section.parts if p.id == plate.id)
        Qp = (props.area_transformed * abs(props.centroid_y - section.centroid)).to("inch**3")
        F = plog.add("F", f"Force in cover plate {plate.id} at the cut-off", "F = Mc·Q_p / I", "{M} × {Q} / {I}",
                     {"M": Q_(Mc, "kip*inch").to("kip*ft"), "Q": Qp, "I": section.inertia},
                     (Q_(Mc, "kip*inch") * Qp / section.inertia).to("kip"),
                     source=f"{SRC} §F13.3 (the plate's share of the flexural strength at the cut-off)")  # fmt: skip
        q = joint.capacity.to("kip/inch")
        length = 2 * k * w if lines >= 2 else k * w
        R = plog.add("R", f"Strength of the welds within a′ of cover plate {plate.id}",
                     "R = q_w·a′ + q_w/n·w (end weld)" if end_weld else "R = q_w·a′",
                     "{q} × {a}" + (" + {q} / {n} × {w}" if end_weld else ""),
                     {"q": q, "a": a, "n": lines, "w": Q_(w, "in")},
                     (q * a + (q / lines * Q_(w, "in") if end_weld else 0 * q * a)).to("kip"),
                     source=f"{SRC} §F13.3; weld strength from the joint's fillet weld (J2.4)",
                     phrase=Phrase("cover_plate_weld", {"lines": lines, "k": k, "length": Q_(length, "in")}))  # fmt: skip
        r = float((F / R).to("").magnitude)
        checks.append(Check(f"{ckey}.termination", f"Cover plate {plate.id}: welds within a′ develop the plate force",
                            F, R, r, "OK" if r <= 1 + 1e-9 else "NG", f"{SRC} §F13.3"))  # fmt: skip
    return checks, out
