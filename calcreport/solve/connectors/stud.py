"""Steel headed stud anchors in a composite beam, ANSI/AISC 360-16 §I8: ``type = "stud"``.

Qn = 0.5·Asa·√(f'c·Ec) ≤ Rg·Rp·Asa·Fu (Eq. I8-1), Ec = wc^1.5·√f'c (ksi, wc in pcf).

Resistance factor (a stated choice): §I8.2 gives Qn as a nominal strength summed into the
composite beam's flexural strength (φb, Ωb); it gives no factor for one anchor. For an elastic
shear-flow design per anchor this tool applies φv = 0.65 (LRFD) / Ωv = 2.31 (ASD) of §I8.3a, the
factors the standard uses for a stud anchor's shear in composite components. ``phi`` and
``omega`` override them. Units inside: kip, ksi, in.
"""

from __future__ import annotations

import math

from ...keys.connectors import CONNECTOR_FIELDS
from ...model import ConnectorSpec
from ...steps import StepLog
from ...units import Q_, parse
from ..results import Capacity, Check
from . import ConnectorError
from .shear_plane import find_contact, thickness_normal

KIND = "stud"
SRC = "ANSI/AISC 360-16"

FIELDS = CONNECTOR_FIELDS[KIND]


def concrete_modulus(wc_pcf: float, fc_ksi: float) -> float:
    """Ec = wc^1.5·√f'c (ksi), wc in pcf. Source: AISC 360-16 §I2.1b / §I8.2a."""
    return wc_pcf**1.5 * math.sqrt(fc_ksi)


def rg_rp(deck: str, rib_ratio: float | None, per_rib: int, strong: bool) -> tuple[float, float, str]:
    """Rg and Rp for the deck condition. Source: AISC 360-16 §I8.2a and its User Note table."""
    if deck == "none":
        return 1.0, 0.75, "no decking: studs welded directly to the steel shape"
    if deck == "parallel":
        if rib_ratio is None or rib_ratio >= 1.5:
            return 1.0, 0.75, "deck parallel to the beam, wr/hr ≥ 1.5"
        return 0.85, 0.75, "deck parallel to the beam, wr/hr < 1.5 (single stud)"
    rg = 1.0 if per_rib == 1 else (0.85 if per_rib == 2 else 0.7)
    rp = 0.75 if strong else 0.6
    return (
        rg,
        rp,
        (
            "deck perpendicular to the beam; studs per rib as given; "
            + ("e_mid-ht ≥ 2 in" if strong else "e_mid-ht < 2 in")
        ),
    )


def qn(Asa: float, fc: float, Ec: float, Rg: float, Rp: float, Fu: float) -> tuple[float, float, float]:
    """(concrete limit 0.5·Asa·√(f'c·Ec), steel limit Rg·Rp·Asa·Fu, Qn) in kips. Source: AISC 360-16 Eq. I8-1."""
    a = 0.5 * Asa * math.sqrt(fc * Ec)
    b = Rg * Rp * Asa * Fu
    return a, b, min(a, b)


def _stress(v, default):
    if v is None:
        return parse(default, "stress") if default else None
    return parse(v, "stress") if isinstance(v, str) else v


def design(spec: ConnectorSpec, ctx, log: StepLog) -> Capacity:
    """Available shear strength of one stud. Source: AISC 360-16 §I8.1, §I8.2a, §I8.2d, §I8.3a."""
    p = spec.params
    key = f"{ctx.key}.connector"
    d = p["diameter"].to("in").magnitude
    parts = (*ctx.held, *ctx.other)
    conc = next((x for x in parts if x.material.family == "concrete"), None)
    stl = next((x for x in parts if x.material.family == "steel"), None)
    if conc is None and p.get("fc") is None:
        raise ConnectorError(f"{key}.fc", "expected fc (concrete f'c) or a concrete part in the joint")
    fcq = _stress(p.get("fc"), None) or conc.material.fc  # type: ignore[union-attr]  # conc given when fc is not
    if fcq is None:
        raise ConnectorError(f"{key}.fc", f"expected fc: material {conc.material.id} has no fc")  # type: ignore[union-attr]
    fc = fcq.to("ksi").magnitude
    if p.get("wc") is not None:
        wcq, wsrc = p["wc"], "given for this connector"
    elif conc is not None and conc.material.density is not None:
        wcq, wsrc = conc.material.density, f"material {conc.material.id}"
    else:
        wcq, wsrc = Q_(145.0, "pcf"), "normal-weight concrete assumed, 145 pcf (common practice, no source)"
    wc = wcq.to("pcf").magnitude
    Fuq = _stress(p.get("Fu"), "65 ksi")
    Fu = Fuq.to("ksi").magnitude
    dq = Q_(d, "in")
    Asa = log.add(
        "Asa",
        "Stud shank area",
        "Asa = π·dsa²/4",
        "π × ({d})² / 4",
        {"d": dq},
        Q_(math.pi * d * d / 4, "in**2"),
        source="geometry",
    ).magnitude
    log.add("wc", "Concrete unit weight", "wc", "{wc}", {"wc": wcq}, wcq.to("pcf"), source=wsrc)
    Ec = log.add(
        "Ec",
        "Concrete modulus of elasticity",
        "Ec = wc^1.5·√f'c",
        "{wc}^1.5 × √{fc}",
        {"wc": wc, "fc": fc},
        Q_(concrete_modulus(wc, fc), "ksi"),
        source=f"{SRC} §I8.2a (ksi, wc in pcf)",
        note="wc in pcf and f'c in ksi as pure numbers, result in ksi",
    ).magnitude
    Rg, Rp, why = rg_rp(
        p.get("deck") or "none", p.get("rib_ratio"), p.get("per_rib") or 1, bool(p.get("strong_position"))
    )
    log.add("Rg", "Group effect factor", "Rg", "{v}", {"v": Rg}, Rg, source=f"{SRC} §I8.2a", note=why)
    log.add("Rp", "Position effect factor", "Rp", "{v}", {"v": Rp}, Rp, source=f"{SRC} §I8.2a", note=why)
    a, b, Q = qn(Asa, fc, Ec, Rg, Rp, Fu)
    log.add(
        "Qn_concrete",
        "Concrete limit",
        "0.5·Asa·√(f'c·Ec)",
        "0.5 × {A} × √({fc} × {Ec})",
        {"A": Q_(Asa, "in**2"), "fc": fcq, "Ec": Q_(Ec, "ksi")},
        Q_(a, "kip"),
        source=f"{SRC} Eq. I8-1",
        governs=a <= b,
    )
    log.add(
        "Qn_steel",
        "Stud steel limit",
        "Rg·Rp·Asa·Fu",
        "{Rg} × {Rp} × {A} × {Fu}",
        {"Rg": Rg, "Rp": Rp, "A": Q_(Asa, "in**2"), "Fu": Fuq},
        Q_(b, "kip"),
        source=f"{SRC} Eq. I8-1",
        governs=b < a,
    )
    Qq = log.add(
        "Qn",
        "Nominal shear strength of one stud",
        "Qn = min(0.5·Asa·√(f'c·Ec), Rg·Rp·Asa·Fu)",
        "min({a}, {b})",
        {"a": Q_(a, "kip"), "b": Q_(b, "kip")},
        Q_(Q, "kip"),
        source=f"{SRC} Eq. I8-1",
    )
    lrfd = ctx.method == "LRFD"
    f = (p.get("phi") or 0.65) if lrfd else 1.0 / (p.get("omega") or 2.31)
    R = log.add(
        "R",
        "Available shear strength of one stud",
        "φv·Qn" if lrfd else "Qn/Ωv",
        "{f} × {Q}",
        {"f": f, "Q": Qq},
        (Qq * f).to("kip"),
        source=f"{SRC} §I8.3a factors (φv = 0.65, Ωv = 2.31)",
        note="per-anchor factor applied to the I8.2a nominal strength; stated choice, see model notes",
    )
    # Detailing, I8.1 and I8.2d.
    c = find_contact(ctx.held, ctx.other)
    if p.get("slab_thickness") is not None:
        ts, tsrc = p["slab_thickness"].to("in").magnitude, "given"
    elif conc is not None and c is not None:
        ts, tsrc = thickness_normal(conc, c), f"depth of part {conc.id} perpendicular to the plane"
    elif conc is not None:
        x0, y0, x1, y1 = conc.shape.bbox
        ts, tsrc = y1 - y0, f"bounding-box depth of part {conc.id}"
    else:
        raise ConnectorError(f"{key}.slab_thickness", "expected slab_thickness (a length)")
    log.add(
        "t_slab",
        "Total slab thickness",
        "t",
        "{t}",
        {"t": Q_(ts, "in")},
        Q_(ts, "in"),
        source="geometry of the parts",
        note=tsrc,
    )
    perp = (p.get("deck") or "none") == "perpendicular"
    smin = log.add(
        "s_min",
        "Minimum stud spacing along the beam",
        "s_min = 4·dsa" if perp else "s_min = 6·dsa",
        ("4" if perp else "6") + " × {d}",
        {"d": dq},
        Q_(4 * d if perp else 6 * d, "in"),
        source=f"{SRC} §I8.2d(d)",
        note="deck ribs perpendicular to the beam" if perp else "along the longitudinal axis of the beam",
    ).magnitude
    smax = log.add(
        "s_max",
        "Maximum stud spacing",
        "s_max = min(8·t, 36 in)",
        "min(8 × {t}, 36 in)",
        {"t": Q_(ts, "in")},
        Q_(min(8 * ts, 36.0), "in"),
        source=f"{SRC} §I8.2d(e)",
        note="t = total slab thickness",
    ).magnitude
    checks = []
    dmax = log.add(
        "d_max",
        "Largest stud diameter",
        "dsa,max",
        "{d}",
        {"d": Q_(1.0 if (p.get("deck") or "none") == "none" else 0.75, "in")},
        Q_(1.0 if (p.get("deck") or "none") == "none" else 0.75, "in"),
        source=f"{SRC} §I8.1",
        note="3/4 in, or up to 1 in for shear transfer in solid slabs",
    ).magnitude
    checks.append(
        Check(
            f"{key}.diameter",
            "Stud diameter limit",
            dq,
            Q_(dmax, "in"),
            d / dmax,
            "OK" if d <= dmax + 1e-9 else "NG",
            source=f"{SRC} §I8.1",
            note="3/4 in, or up to 1 in for shear transfer in solid slabs",
        )
    )
    tb = p.get("base_thickness")
    if tb is None and stl is not None and c is not None:
        tb = Q_(thickness_normal(stl, c), "in")
    if p.get("over_web"):
        checks.append(
            Check(
                f"{key}.base",
                "dsa ≤ 2.5·t does not apply: studs over the web",
                None,
                None,
                None,
                "INFO",
                source=f"{SRC} §I8.1",
            )
        )
    elif tb is not None:
        lim = log.add(
            "d_base",
            "Largest stud diameter on the flange",
            "dsa ≤ 2.5·t",
            "2.5 × {t}",
            {"t": tb.to("in")},
            Q_(2.5 * tb.to("in").magnitude, "in"),
            source=f"{SRC} §I8.1",
            note="studs not over the web",
        ).magnitude
        checks.append(
            Check(
                f"{key}.base",
                "Stud diameter at most 2.5 × flange thickness",
                dq,
                Q_(lim, "in"),
                d / lim,
                "OK" if d <= lim + 1e-9 else "NG",
                source=f"{SRC} §I8.1",
            )
        )
    if p.get("length") is not None:
        L = p["length"].to("in").magnitude
        log.add(
            "L_min",
            "Minimum stud length",
            "L_min = 4·dsa",
            "4 × {d}",
            {"d": dq},
            Q_(4 * d, "in"),
            source=f"{SRC} §I8.2",
        )
        checks.append(
            Check(
                f"{key}.length",
                "Stud length after installation at least 4·dsa",
                Q_(4 * d, "in"),
                p["length"].to("in"),
                4 * d / L,
                "OK" if L >= 4 * d - 1e-9 else "NG",
                source=f"{SRC} §I8.2",
            )
        )
    s_tr = log.add(
        "s_transverse",
        "Minimum transverse spacing of studs",
        "s = 4·dsa",
        "4 × {d}",
        {"d": dq},
        Q_(4 * d, "in"),
        source=f"{SRC} §I8.2d(d)",
    )
    e_free = log.add(
        "e_free",
        "Distance to a free edge in the direction of the shear force",
        "e",
        "{e}",
        {"e": Q_(10.0 if p.get("lightweight") else 8.0, "in")},
        Q_(10.0 if p.get("lightweight") else 8.0, "in"),
        source=f"{SRC} §I8.2d(c)",
        note="lightweight concrete: 10 in" if p.get("lightweight") else "normal-weight concrete: 8 in",
    )
    checks.append(
        Check(
            f"{key}.transverse",
            "Transverse spacing of studs at least 4·dsa; 1 in lateral cover",
            s_tr,
            None,
            None,
            "INFO",
            source=f"{SRC} §I8.2d(b), (d)",
        )
    )
    checks.append(
        Check(
            f"{key}.edge",
            "Distance to a free edge in the direction of the shear force",
            e_free,
            None,
            None,
            "INFO",
            source=f"{SRC} §I8.2d(c)",
        )
    )
    return Capacity(
        value=R,
        continuous=False,
        description=p.get("name") or "headed stud anchor",
        source=f"{SRC} §I8.2a",
        checks=tuple(checks),
        spacing_min=Q_(smin, "in"),
        spacing_max=Q_(smax, "in"),
        limits_source=f"{SRC} §I8.2d(d), (e): "
        + ("4·dsa in deck ribs perpendicular to the beam" if perp else "6·dsa along the beam")
        + "; 8·t ≤ 36 in",
    )
