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
from ...units import Q_, Quantity, parse
from ..results import Capacity, Check
from . import ConnectorError
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


def min_fillet(t_thinner: float) -> float:
    """Minimum fillet weld size (in) for the thinner part joined: 1/8 (t ≤ 1/4), 3/16 (≤ 1/2),
    1/4 (≤ 3/4), 5/16 (over 3/4). Source: AISC 360-16 Table J2.4."""
    if t_thinner <= 0.25 + 1e-9:
        return 0.125
    if t_thinner <= 0.5 + 1e-9:
        return 0.1875
    if t_thinner <= 0.75 + 1e-9:
        return 0.25
    return 0.3125


def max_fillet_along_edge(t: float) -> float:
    """Maximum fillet size along an edge of material t thick: t (t < 1/4 in), t − 1/16 otherwise.
    Source: AISC 360-16 §J2.2b(b)."""
    return t if t < 0.25 else t - 1 / 16


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
    t_thin = min(thick.values())
    wmin = min_fillet(t_thin)
    checks = [
        Check(
            f"{key}.min_size",
            "Minimum fillet size for the thinner part joined",
            Q_(wmin, "in"),
            wq,
            wmin / w,
            "OK" if w >= wmin - 1e-9 else "NG",
            source=f"{SRC} Table J2.4",
        )
    ]
    if base_check:
        checks.append(base_check)
    if form == "lap":
        wmax = max_fillet_along_edge(t_bm)
        checks.append(
            Check(
                f"{key}.max_size",
                "Maximum fillet size along the plate edge",
                wq,
                Q_(wmax, "in"),
                w / wmax,
                "OK" if w <= wmax + 1e-9 else "NG",
                source=f"{SRC} §J2.2b(b)",
            )
        )
    else:
        checks.append(
            Check(
                f"{key}.max_size",
                "Maximum fillet size along edges does not apply (tee joint)",
                None,
                None,
                None,
                "INFO",
                source=f"{SRC} §J2.2b(b)",
            )
        )
    seg = p.get("segment")
    if seg is None:
        checks.append(
            Check(
                f"{key}.length",
                "Continuous weld: effective length at least 4w",
                Q_(4 * w, "in"),
                None,
                None,
                "INFO",
                source=f"{SRC} §J2.2b(c)",
            )
        )
        return Capacity(
            value=q.to("kip/in"),
            continuous=True,
            description=p.get("name") or "fillet weld",
            source=f"{SRC} §J2.4",
            checks=tuple(checks),
        )
    L = seg.to("in").magnitude
    lmin = max(4 * w, 1.5)
    checks.append(
        Check(
            f"{key}.segment",
            "Intermittent segment length at least 4w and 1-1/2 in",
            Q_(lmin, "in"),
            seg.to("in"),
            lmin / L,
            "OK" if L >= lmin - 1e-9 else "NG",
            source=f"{SRC} §J2.2b(c), (e)",
        )
    )
    pitch_max = None
    if form == "lap":
        pitch_max = _stitch_pitch(log, t_thin, (held, other))
        checks.append(
            Check(
                f"{key}.pitch_max",
                "Maximum pitch of intermittent welds between plates in contact",
                None,
                pitch_max,
                None,
                "INFO",
                source=f"{SRC} §D4, §E6.2(a)",
                note="applied as the joint's maximum spacing; the lesser of the tension (D4) and "
                "compression (E6.2) limits, as either face may be in compression",
            )
        )
    else:
        checks.append(
            Check(
                f"{key}.pitch_max",
                "Maximum pitch of intermittent welds",
                None,
                None,
                None,
                "INFO",
                source=f"{SRC} §D4, §E6.2",
                note="not checked: AISC 360-16 sets no maximum pitch for a stem welded to a plate in a "
                "flexural member (D4 and E6.2 apply to plates in contact); the job's spacing_max governs",
            )
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


def _stitch_pitch(log: StepLog, t: float, parts) -> Quantity:
    """Largest pitch of intermittent welds joining plates in contact: the lesser of
    24·t ≤ 12 in (AISC 360-16 §D4, built-up tension members, painted or not subject to corrosion)
    and 0.75·t·√(E/Fy) ≤ 12 in (§E6.2(a), built-up compression members, outside plate), t the
    thinner plate. Weathering steel (14·t ≤ 7 in) is not modelled."""
    tq = Q_(t, "in")
    d4 = log.add(
        "pitch_D4",
        "Maximum pitch, plates in contact in tension",
        "s_max = min(24·t, 12 in)",
        "min(24 × {t}, 12 in)",
        {"t": tq},
        Q_(min(24 * t, 12.0), "in"),
        source=f"{SRC} §D4",
    )
    fys = [p.material.Fy for p in parts if p.material.Fy is not None]
    if not fys:
        return d4
    mat = max(
        (p.material for p in parts if p.material.Fy is not None), key=lambda m: m.Fy.to("ksi").magnitude
    )
    ratio = float((mat.E / mat.Fy).to("").magnitude) ** 0.5
    e6 = log.add(
        "pitch_E6",
        "Maximum pitch, outside plate in compression",
        "s_max = min(0.75·t·√(E/Fy), 12 in)",
        "min(0.75 × {t} × √({E} / {Fy}), 12 in)",
        {"t": tq, "E": mat.E, "Fy": mat.Fy},
        Q_(min(0.75 * t * ratio, 12.0), "in"),
        source=f"{SRC} §E6.2(a)",
        note=f"Fy of {mat.id}, the higher-strength plate (the smaller limit)",
    )
    return min(d4, e6)
