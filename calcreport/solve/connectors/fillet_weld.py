"""Fillet welds joining steel parts, ANSI/AISC 360-16 §J2: ``type = "fillet_weld"``.

Continuous (no ``segment``): capacity per unit length of the joint. Intermittent (``segment`` =
length of each weld segment): capacity per segment group, the pitch being the spacing the tool
finds. ``welds`` is the number of weld lines at the joint (2 when both sides of a web or both edges
of a cover plate are welded); an intermittent group places one segment on each line at the same
station (chain intermittent). Units inside: kip, ksi, in.

Joint form. At the contact the narrower part (along the plane) is a *stem* standing on edge
(a web against a flange: tee joint) when it is deeper perpendicular to the plane than it is wide,
otherwise a plate lying flat (a cover plate: lap joint, welds along its edges). ``joint_form``
overrides this reading of the geometry.
"""

from __future__ import annotations

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ...units import Q_, parse
from ..results import Capacity, Check
from . import ConnectorError
from .fillet_limits import max_fillet_along_edge, min_fillet, weld_limits
from .shear_plane import (
    extent_along,
    find_contact,
    missing_rolled_plate,
    plate_thickness,
    rolled_plate,
    thickness_normal,
)

KIND = "fillet_weld"
SRC = "ANSI/AISC 360-16"

FIELDS = CONNECTOR_FIELDS[KIND]

__all__ = ["KIND", "FIELDS", "min_fillet", "max_fillet_along_edge", "strength_per_inch", "design"]


def strength_per_inch(w: float, FEXX: float) -> tuple[float, float, float]:
    """(te, Fnw, Rn per inch) for one fillet weld: te = 0.707·w, Fnw = 0.60·FEXX, Rn = Fnw·te.
    Source: AISC 360-16 §J2.2a, §J2.4 Eq. J2-3, Table J2.5."""
    te = 0.707 * w
    Fnw = 0.60 * FEXX
    return te, Fnw, Fnw * te


def _val(v, default: str, kind: str):
    if v is None:
        return parse(default, kind)
    return parse(v, kind) if isinstance(v, str) else v


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Available strength of the fillet welds per inch (continuous) or per segment group.

    Source: AISC 360-16 §J2.2, §J2.4 (Table J2.5, φ = 0.75, Ω = 2.00), §J4.2 (base metal).
    """
    p = spec.params
    key = f"{ctx.key}.connector"
    w = p["size"].to("in").magnitude
    FEXX = _val(p.get("FEXX"), "70 ksi", "stress").to("ksi").magnitude
    n = int(p.get("welds") or 2)
    lrfd = ctx.method == "LRFD"
    c = find_contact(ctx.held, ctx.other)
    held = c.held if c else ctx.held[0]
    other = c.other if c else ctx.other[0]
    for part in (held, other):
        if part.material.family != "steel":
            raise ConnectorError(
                f"{key}.type",
                f"expected steel parts for a fillet weld; part {part.id} is {part.material.family}",
            )
    thick = {}
    for which, part in (("held", held), ("other", other)):
        given = p.get(f"{which}_thickness")
        if given is not None:
            t, note, src = given.to("in").magnitude, "given", "job file"
        elif c is not None:
            missing = missing_rolled_plate(part, c)
            if missing:
                raise ConnectorError(f"{key}.{which}_thickness", missing)
            t, src = plate_thickness(part, c), "geometry of the parts"
            note = f"part {part.id}: the lesser of its depth from the {c.orientation} plane and its width along it"
            if rolled_plate(part, c) is not None:
                src = part.shape.source
                note = f"part {part.id}: {'flange' if c.orientation == 'horizontal' else 'web'} thickness of the rolled shape"
        else:
            raise ConnectorError(
                f"{key}.{which}_thickness",
                "expected held_thickness and other_thickness: the parts do not touch",
            )
        thick[which] = log.add(
            f"t_{which}",
            f"Plate thickness of the {which} part",
            f"t_{which}",
            "{t}",
            {"t": Q_(t, "in")},
            Q_(t, "in"),
            source=src,
            note=note,
        ).magnitude
    # Joint form.
    form = p.get("joint_form") or "auto"
    narrow = held
    if c is not None and extent_along(other, c) < extent_along(held, c):
        narrow = other
    narrow_w = "held" if narrow is held else "other"
    if form == "auto":
        form = "tee" if (c is not None and thickness_normal(narrow, c) > extent_along(narrow, c)) else "lap"
    src_w = f"{SRC} §J2.4, Table J2.5"
    te, Fnw, rn = strength_per_inch(w, FEXX)
    wq = Q_(w, "in")
    teq = log.add(
        "te",
        "Effective throat",
        "te = 0.707·w",
        "0.707 × {w}",
        {"w": wq},
        Q_(te, "in"),
        source=f"{SRC} §J2.2a",
        note="equal legs, no penetration credit",
    )
    Fq = log.add(
        "Fnw",
        "Nominal weld stress",
        "Fnw = 0.60·FEXX",
        "0.60 × {F}",
        {"F": Q_(FEXX, "ksi")},
        Q_(Fnw, "ksi"),
        source=src_w,
    )
    rnq = log.add(
        "rn",
        "Nominal strength per inch of one weld",
        "rn = Fnw·te",
        "{F} × {te}",
        {"F": Fq, "te": teq},
        Q_(rn, "kip/in"),
        source=f"{SRC} Eq. J2-3",
        note="directional strength increase not used (longitudinal welds)",
    )
    f = 0.75 if lrfd else 1 / 2.00
    r1 = log.add(
        "r_weld",
        "Available strength per inch of one weld",
        "φ·rn" if lrfd else "rn/Ω",
        "{f} × {rn}",
        {"f": f, "rn": rnq},
        Q_(rn * f, "kip/in"),
        source=src_w,
        note="φ = 0.75 (LRFD)" if lrfd else "Ω = 2.00 (ASD): factor 1/Ω",
    )
    weld_total = rn * f * n
    limits = [("weld metal", weld_total, src_w)]
    log.add(
        "r_welds",
        "Available strength per inch of the weld lines",
        "n·r",
        "{n} × {r}",
        {"n": n, "r": r1},
        Q_(weld_total, "kip/in"),
        source=src_w,
    )
    # Base metal, J4.2: stem carries all welds (tee); each lap-plate edge carries one weld (lap).
    bm = narrow.material
    t_bm = thick[narrow_w]
    count = 1 if form == "tee" else n
    if bm.Fy is not None and bm.Fu is not None:
        Fy, Fu = bm.Fy.to("ksi").magnitude, bm.Fu.to("ksi").magnitude
        fy_f = 1.00 if lrfd else 1 / 1.50
        fu_f = 0.75 if lrfd else 1 / 2.00
        by = log.add(
            "r_base_yield",
            f"Base-metal shear yielding per inch, part {narrow.id}",
            "m·f·0.60·Fy·t",
            "{m} × {f} × 0.60 × {Fy} × {t}",
            {"m": count, "f": fy_f, "Fy": bm.Fy, "t": Q_(t_bm, "in")},
            Q_(count * fy_f * 0.6 * Fy * t_bm, "kip/in"),
            source=f"{SRC} §J4.2, Eq. J4-3 (φ = 1.00, Ω = 1.50)",
            note=(
                "tee joint: the stem's section carries all weld lines"
                if form == "tee"
                else "lap joint: the plate's section at each welded edge carries one weld line"
            ),
        ).magnitude
        bu = log.add(
            "r_base_rupture",
            f"Base-metal shear rupture per inch, part {narrow.id}",
            "m·f·0.60·Fu·t",
            "{m} × {f} × 0.60 × {Fu} × {t}",
            {"m": count, "f": fu_f, "Fu": bm.Fu, "t": Q_(t_bm, "in")},
            Q_(count * fu_f * 0.6 * Fu * t_bm, "kip/in"),
            source=f"{SRC} §J4.2, Eq. J4-4 (φ = 0.75, Ω = 2.00)",
        ).magnitude
        limits += [("base metal yielding", by, f"{SRC} §J4.2"), ("base metal rupture", bu, f"{SRC} §J4.2")]
    base_check = (
        None
        if (bm.Fy is not None and bm.Fu is not None)
        else Check(
            f"{key}.base_metal",
            "Base-metal shear (J4.2) not checked: material lacks Fy or Fu",
            None,
            None,
            None,
            "INFO",
            source=f"{SRC} §J4.2",
        )
    )
    gov = min(limits, key=lambda x: x[1])
    for i, (name, val, src) in enumerate(limits):
        log.add(
            f"q_{i}",
            f"Available strength per inch, {name}",
            "r",
            "{v}",
            {"v": Q_(val, "kip/in")},
            Q_(val, "kip/in"),
            source=src,
            governs=name == gov[0],
        )
    q = log.add(
        "q_cap",
        "Available strength per inch of joint",
        "r = min(limit states)",
        "{r}",
        {"r": Q_(gov[1], "kip/in")},
        Q_(gov[1], "kip/in"),
        source=gov[2],
        note=f"{gov[0]} governs",
    )
    # Detailing.
    seg = p.get("segment")
    checks, pitch_max = weld_limits(
        log, key, w, min(thick.values()), thick[narrow_w], form, seg, (held, other)
    )
    if base_check:
        checks.insert(1, base_check)
    if seg is None:
        return Capacity(
            value=q.to("kip/in"),
            continuous=True,
            description=p.get("name") or "fillet weld",
            source=f"{SRC} §J2.4",
            checks=tuple(checks),
        )
    F = log.add(
        "F_segment",
        "Available strength of one segment group (one segment on each weld line)",
        "F = r·L_seg",
        "{r} × {L}",
        {"r": q, "L": seg.to("in")},
        (q * seg).to("kip"),
        source=f"{SRC} §J2.4",
        note="effective length = segment length",
    )
    return Capacity(
        value=F,
        continuous=False,
        description=p.get("name") or "intermittent fillet weld",
        source=f"{SRC} §J2.4",
        checks=tuple(checks),
        spacing_min=seg.to("in"),
        spacing_max=pitch_max,
        limits_source="pitch not less than the segment length (geometry)"
        + ("; maximum pitch AISC 360-16 §D4, §E6.2(a)" if pitch_max is not None else ""),
    )
