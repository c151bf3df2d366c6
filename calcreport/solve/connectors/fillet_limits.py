"""Detailing limits of fillet welds, each limit a step: minimum size (AISC 360-16 Table J2.4),
maximum size along an edge (§J2.2b(b)), minimum length (§J2.2b(c), (e)) and the maximum pitch of
intermittent welds joining plates in contact (§D4, §E6.2(a)). Used by :mod:`.fillet_weld`.
Units inside: in (floats); steps carry quantities."""

from __future__ import annotations

from ...steps import StepLog
from ...units import Q_, Quantity
from ..results import Check

__all__ = ["min_fillet", "max_fillet_along_edge", "stitch_pitch", "weld_limits"]

SRC = "ANSI/AISC 360-16"


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


def stitch_pitch(log: StepLog, t: float, parts) -> Quantity:
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


def weld_limits(
    log: StepLog, key: str, w: float, t_thin: float, t_bm: float, form: str, seg, parts
) -> tuple[list[Check], Quantity | None]:
    """The detailing checks of a fillet weld with every limit as a step → (checks, maximum pitch or
    None). ``t_thin`` the thinner part joined, ``t_bm`` the plate along whose edge a lap weld runs,
    ``seg`` the intermittent segment length (None: continuous). Source: AISC 360-16 Table J2.4,
    §J2.2b(b), (c), (e), §D4, §E6.2(a)."""
    wq = Q_(w, "in")
    wmin = log.add(
        "w_min",
        "Minimum fillet size for the thinner part joined",
        "w_min (t thinner part)",
        "{t}",
        {"t": Q_(t_thin, "in")},
        Q_(min_fillet(t_thin), "in"),
        source=f"{SRC} Table J2.4",
        note="1/8 in up to 1/4 in, 3/16 in up to 1/2 in, 1/4 in up to 3/4 in, 5/16 in over 3/4 in",
    ).magnitude
    checks = [
        Check(
            f"{key}.min_size",
            "Minimum fillet size for the thinner part joined",
            Q_(wmin, "in"),
            wq,
            wmin / w,
            "OK" if w >= wmin - 1e-9 else "NG",
            source=f"{SRC} Table J2.4",
            step=f"{log.prefix}.w_min",
        )
    ]
    if form == "lap":
        wmax = log.add(
            "w_max",
            "Maximum fillet size along the plate edge",
            "w_max = t (t < 1/4 in); t − 1/16 in",
            "{t}",
            {"t": Q_(t_bm, "in")},
            Q_(max_fillet_along_edge(t_bm), "in"),
            source=f"{SRC} §J2.2b(b)",
        ).magnitude
        checks.append(
            Check(
                f"{key}.max_size",
                "Maximum fillet size along the plate edge",
                wq,
                Q_(wmax, "in"),
                w / wmax,
                "OK" if w <= wmax + 1e-9 else "NG",
                source=f"{SRC} §J2.2b(b)",
                step=f"{log.prefix}.w_max",
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
    if seg is None:
        l4 = log.add(
            "L_min",
            "Minimum effective weld length",
            "L_min = 4·w",
            "4 × {w}",
            {"w": wq},
            Q_(4 * w, "in"),
            source=f"{SRC} §J2.2b(c)",
        )
        checks.append(
            Check(
                f"{key}.length",
                "Continuous weld: effective length at least 4w",
                l4,
                None,
                None,
                "INFO",
                source=f"{SRC} §J2.2b(c)",
                step=f"{log.prefix}.L_min",
            )
        )
        return checks, None
    L = seg.to("in").magnitude
    lmin = log.add(
        "L_seg_min",
        "Minimum length of an intermittent segment",
        "L_min = max(4·w, 1-1/2 in)",
        "max(4 × {w}, 1.5 in)",
        {"w": wq},
        Q_(max(4 * w, 1.5), "in"),
        source=f"{SRC} §J2.2b(c), (e)",
    ).magnitude
    checks.append(
        Check(
            f"{key}.segment",
            "Intermittent segment length at least 4w and 1-1/2 in",
            Q_(lmin, "in"),
            seg.to("in"),
            lmin / L,
            "OK" if L >= lmin - 1e-9 else "NG",
            source=f"{SRC} §J2.2b(c), (e)",
            step=f"{log.prefix}.L_seg_min",
        )
    )
    pitch_max = None
    if form == "lap":
        pitch_max = stitch_pitch(log, t_thin, parts)
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
    return checks, pitch_max
