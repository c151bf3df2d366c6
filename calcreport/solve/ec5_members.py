"""Member checks under ``settings.method = "EC5"`` (EN 1995-1-1:2004). The NDS 2018 / AISC 360-16
member checks do not run (their factors belong to another standard).

What runs, for each combination with its own k_mod (§3.1.3(2)) and for the wood parts
(solid timber, glulam, LVL) of the transformed section, with the largest sagging and hogging moment
of the combination (variable loads in their worst placement):

* bending and axial stress of each wood part (a flange or web of a built-up section carries part
  of the moment as axial force): σ_0 = n·M·y_c/I at the part's centroid and σ_m = n·M·(h/2)/I about
  its own axis, checked by §6.2.3 (6.17) σ_t,0,d/f_t,0,d + σ_m,d/f_m,d ≤ 1 in tension and §6.2.4
  (6.19) (σ_c,0,d/f_c,0,d)² + σ_m,d/f_m,d ≤ 1 in compression (a part alone, σ_0 = 0: §6.1.6 (6.11));
  f_d = k_mod·k_h·f_k/γ_M (§2.4.1 (2.14)), k_h for bending by §3.2(3) (solid, h < 150 mm) and
  §3.3(3) (glulam, h < 600 mm), 1.0 otherwise (conservative); instability (k_c, k_crit, §6.3) is
  not included and stays listed as not checked;
* shear at the neutral axis (§6.1.7): τ_d = V·Q/(I·b_ef) with b_ef = k_cr·b, k_cr = 0.67 for solid
  timber and glulam (6.13a), 1.0 for LVL, against f_v,d = k_mod·f_v,k/γ_M.

What a checker expects and did not run is listed with the EN clause (:func:`ec5_unchecked`).
"""

from __future__ import annotations

import numpy as np

from ..model import Member, Part, Settings
from ..steps import Phrase, StepLog
from ..units import Q_
from .ec5_factors import SOURCE_KMOD, combination_duration, gamma_m, k_mod, product_of
from .results import Check, SectionResult, SolveError, Unchecked
from .scope import expectations

__all__ = ["ec5_member_checks", "ec5_unchecked", "EC5_CLAUSES", "k_h"]

_EC5 = "EN 1995-1-1:2004"
#: Expectation name (its first segment) → the EN clause that governs it.
EC5_CLAUSES = {
    "bending": f"{_EC5} §6.1.6, §6.2.3, §6.2.4 (bending with axial stress)",
    "shear": f"{_EC5} §6.1.7 (shear)",
    "bearing": f"{_EC5} §6.1.5 (compression perpendicular to the grain)",
    "stability": f"{_EC5} §6.3.3 (lateral torsional stability, k_crit), §6.3.2 (k_c)",
    "panel_shear": f"{_EC5} §9.1.1 (glued thin-webbed beams: web shear)",
    "panel_stress": f"{_EC5} §9.1.1 (glued thin-webbed beams: web stresses)",
    "flange_axial": f"{_EC5} §9.1.1 (thin-webbed beams: flange stresses)",
    "deflection": f"EN 1990:2002 A1.4, {_EC5} §7.2",
}
REASON = 'not implemented under method = "EC5" in this version; check by hand'
#: Labels in EN terms where the NDS expectation's label names an NDS factor.
EC5_LABELS = {
    "bearing": "compression perpendicular to the grain at the supports",
    "stability": "lateral torsional stability (k_crit) and buckling of compressed parts (k_c)",
}
STEEL = "EN 1993-1-1 / EN 1993-1-5 (steel members)"
K_CR = {"solid": 0.67, "glulam": 0.67, "LVL": 1.0}
_WOOD = ("wood", "glulam")


def k_h(product: str, h_mm: float) -> tuple[float, str]:
    """Depth factor of bending: solid timber min((150/h)^0.2, 1.3) for h < 150 mm (§3.2(3), eq. 3.1);
    glulam min((600/h)^0.1, 1.1) for h < 600 mm (§3.3(3), eq. 3.2); 1.0 otherwise (LVL: the
    product's exponent s is not known to the tool — 1.0, conservative)."""
    if product == "solid" and h_mm < 150:
        return min((150 / h_mm) ** 0.2, 1.3), f"{_EC5} §3.2(3), eq. (3.1)"
    if product == "glulam" and h_mm < 600:
        return min((600 / h_mm) ** 0.1, 1.1), f"{_EC5} §3.3(3), eq. (3.2)"
    return 1.0, f"{_EC5} §3.2(3), §3.3(3), §3.4(3) (k_h = 1.0)"


def _combos(beam, settings: Settings):
    """(name, k_mod, M_max ≥ 0, M_min ≤ 0, |V|max) per combination, N·mm and N."""
    out = []
    assert settings.service_class is not None
    for diag, cb in zip(beam.analysis.combinations, beam.combinations):
        try:
            dur, _ = combination_duration(cb, settings.load_cases)
        except KeyError as exc:
            raise SolveError("settings.load_case", f"load case {exc.args[0]!r} needs a duration") from None
        km = k_mod(dur, settings.service_class)
        Mh = (diag.M_hi if diag.M_hi is not None else diag.M).to("N*mm").magnitude
        Ml = (diag.M_lo if diag.M_lo is not None else diag.M).to("N*mm").magnitude
        Vh = (diag.V_hi if diag.V_hi is not None else diag.V).to("N").magnitude
        Vl = (diag.V_lo if diag.V_lo is not None else diag.V).to("N").magnitude
        V = float(max(np.abs(Vh).max(), np.abs(Vl).max()))
        out.append((diag.name, km, dur, max(float(Mh.max()), 0.0), min(float(Ml.min()), 0.0), V))
    return out


def _bending(member: Member, part: Part, props, section: SectionResult, combos, log: StepLog, key: str):
    mat = part.material
    missing = [k for k in ("f_m_k", "f_t_0_k", "f_c_0_k") if mat.extra.get(k) is None]
    label = f"Bending and axial stress of {part.id} ({mat.id})"
    if missing:
        return Check(
            key,
            label,
            None,
            None,
            None,
            "INFO",
            EC5_CLAUSES["bending"],
            note=f"not checked: no {', '.join(missing)} given for material {mat.id}",
        )
    prod = product_of(mat.family, mat.extra.get("timber_product") or "")
    gm, gsrc = gamma_m(prod, mat.extra.get("gamma_M"))
    I = section.inertia.to("mm**4").magnitude
    yc = (props.centroid_y - section.centroid).to("mm").magnitude
    h = props.depth.to("mm").magnitude
    n = props.n
    kh, khsrc = k_h(prod, h)
    slog = log.child(f"bending.{part.id}")
    slog.add(
        "kh",
        f"Depth factor of {part.id}",
        "k_h",
        "{p}, h = {h}",
        {"p": prod, "h": Q_(h, "mm")},
        kh,
        source=khsrc,
    )
    slog.add("gM", f"Partial factor of {mat.id}", "γ_M", "{p}", {"p": prod}, gm, source=gsrc)
    worst = None
    for name, km, dur, Mpos, Mneg, _ in combos:
        for M in (Mpos, Mneg):
            if M == 0.0:
                continue
            s0 = -n * M * yc / I  # N/mm², tension positive (sagging M compresses the top)
            sm = n * abs(M) * (h / 2) / I
            fm = km * kh * mat.extra["f_m_k"].to("N/mm**2").magnitude / gm
            if s0 >= 0:
                ft = km * mat.extra["f_t_0_k"].to("N/mm**2").magnitude / gm
                u = s0 / ft + sm / fm
                form = ("σ_t,0,d/f_t,0,d + σ_m,d/f_m,d", "{s0} / {f0} + {sm} / {fm}", "(6.17)", ft)
            else:
                fc = km * mat.extra["f_c_0_k"].to("N/mm**2").magnitude / gm
                u = (-s0 / fc) ** 2 + sm / fm
                form = ("(σ_c,0,d/f_c,0,d)² + σ_m,d/f_m,d", "({s0} / {f0})² + {sm} / {fm}", "(6.19)", fc)
            if worst is None or u > worst[0]:
                worst = (u, name, km, dur, M, abs(s0), sm, fm, form)
    if worst is None:
        return Check(
            key, label, None, None, None, "INFO", EC5_CLAUSES["bending"], note="not checked: no moment"
        )
    u, name, km, dur, M, s0, sm, fm, (sym, tmpl, eq, f0) = worst
    slog.add(
        "M",
        f"Governing moment for {part.id}",
        "M_d",
        "{M} in {c}",
        {"M": Q_(M, "N*mm"), "c": name},
        Q_(M, "N*mm"),
        source="beam analysis (combinations with their own k_mod)",
    )
    slog.add("kmod", f"k_mod of {name}", "k_mod", "{d} load duration", {"d": dur}, km, source=SOURCE_KMOD)
    slog.add(
        "sigma0",
        f"Axial stress at the centroid of {part.id}",
        "σ_0,d = n·M·y_c / I",
        "{n} × {M} × {y} / {I}",
        {"n": n, "M": Q_(abs(M), "N*mm"), "y": Q_(abs(yc), "mm"), "I": section.inertia},
        Q_(s0, "N/mm**2"),
        source="mechanics of materials (transformed section)",
        note="tension" if form_is_tension(sym) else "compression",
    )
    slog.add(
        "sigmam",
        f"Bending stress of {part.id} about its own axis",
        "σ_m,d = n·M·(h/2) / I",
        "{n} × {M} × {h} / {I}",
        {"n": n, "M": Q_(abs(M), "N*mm"), "h": Q_(h / 2, "mm"), "I": section.inertia},
        Q_(sm, "N/mm**2"),
        source="mechanics of materials (transformed section)",
    )
    slog.add(
        "fmd",
        f"Design bending strength of {mat.id}",
        "f_m,d = k_mod·k_h·f_m,k / γ_M",
        "{k} × {kh} × {f} / {g}",
        {"k": km, "kh": kh, "f": mat.extra["f_m_k"], "g": gm},
        Q_(fm, "N/mm**2"),
        source=f"{_EC5} §2.4.1, eq. (2.14)",
    )
    tension = form_is_tension(sym)
    slog.add(
        "f0d",
        f"Design {'tension' if tension else 'compression'} strength parallel to grain of {mat.id}",
        "f_t,0,d = k_mod·f_t,0,k / γ_M" if tension else "f_c,0,d = k_mod·f_c,0,k / γ_M",
        "{k} × {f} / {g}",
        {"k": km, "f": mat.extra["f_t_0_k" if tension else "f_c_0_k"], "g": gm},
        Q_(f0, "N/mm**2"),
        source=f"{_EC5} §2.4.1, eq. (2.14)",
    )
    slog.add(
        "u",
        f"Combined stress ratio of {part.id}",
        sym,
        tmpl,
        {"s0": Q_(s0, "N/mm**2"), "f0": Q_(f0, "N/mm**2"), "sm": Q_(sm, "N/mm**2"), "fm": Q_(fm, "N/mm**2")},
        u,
        source=f"{_EC5} §6.2.3 {eq}" if eq == "(6.17)" else f"{_EC5} §6.2.4 {eq}",
        governs=True,
    )
    return Check(
        key,
        label,
        u,
        1.0,
        u,
        "OK" if u <= 1.0 + 1e-9 else "NG",
        f"{_EC5} §6.1.6, §6.2.3 (6.17) / §6.2.4 (6.19)",
        note="instability (§6.3) not included",
        phrase=Phrase("k_mod", {"combination": name, "k_mod": km}),
    )


def form_is_tension(sym: str) -> bool:
    return sym.startswith("σ_t")


def _shear(member: Member, section: SectionResult, combos, log: StepLog, key: str):
    from ..outlines import is_rectangle
    from .section import first_moment_above

    label = "Shear stress at the neutral axis"
    y = section.centroid.to("inch").magnitude + section.bottom.to("inch").magnitude
    cut = [p for p in member.parts if p.shape.bbox[1] < y < p.shape.bbox[3]]
    if not cut:
        return None
    why = ""
    if any(p.material.family not in _WOOD for p in cut):
        why = "a part cut at the neutral axis is not solid timber or glulam (panel webs: §9.1.1)"
    elif any(not is_rectangle(p.shape) for p in cut):
        why = "a part cut at the neutral axis is not a rectangle"
    elif any(p.material.extra.get("f_v_k") is None for p in cut):
        why = "no f_v_k given for material " + ", ".join(
            sorted({p.material.id for p in cut if p.material.extra.get("f_v_k") is None})
        )
    if why:
        return Check(key, label, None, None, None, "INFO", EC5_CLAUSES["shear"], note=f"not checked: {why}")
    b = Q_(sum(p.shape.bbox[2] - p.shape.bbox[0] for p in cut), "inch")
    Qna = Q_(abs(first_moment_above(member, section, section.centroid.to("inch").magnitude)), "inch**3")
    slog = log.child("shear")
    prods = [product_of(p.material.family, p.material.extra.get("timber_product") or "") for p in cut]
    kcr = min(K_CR.get(pr, 1.0) for pr in prods)
    slog.add(
        "kcr",
        "Crack factor for shear",
        "k_cr",
        "{p}",
        {"p": ", ".join(sorted(set(prods)))},
        kcr,
        source=f"{_EC5} §6.1.7(2) (recommended value)",
    )
    bef = slog.add(
        "bef",
        "Effective width for shear",
        "b_ef = k_cr·b",
        "{k} × {b}",
        {"k": kcr, "b": b},
        (kcr * b).to("mm"),
        source=f"{_EC5} §6.1.7(2), eq. (6.13a)",
    )
    weak = min(
        cut,
        key=lambda p: (
            p.material.extra["f_v_k"].to("N/mm**2").magnitude
            / gamma_m(
                product_of(p.material.family, p.material.extra.get("timber_product") or ""),
                p.material.extra.get("gamma_M"),
            )[0]
        ),
    )
    gm, gsrc = gamma_m(
        product_of(weak.material.family, weak.material.extra.get("timber_product") or ""),
        weak.material.extra.get("gamma_M"),
    )
    I = section.inertia
    worst = None
    for name, km, dur, _, _, V in combos:
        tau = (Q_(V, "N") * Qna / (I * bef)).to("N/mm**2").magnitude
        fv = km * weak.material.extra["f_v_k"].to("N/mm**2").magnitude / gm
        if worst is None or tau / fv > worst[0]:
            worst = (tau / fv, name, km, dur, V, tau, fv)
    assert worst is not None
    u, name, km, dur, V, tau, fv = worst
    slog.add("kmod", f"k_mod of {name}", "k_mod", "{d} load duration", {"d": dur}, km, source=SOURCE_KMOD)
    slog.add("gM", f"Partial factor of {weak.material.id}", "γ_M", "{g}", {"g": gm}, gm, source=gsrc)
    slog.add(
        "tau",
        f"Design shear stress, {name}",
        "τ_d = V·Q / (I·b_ef)",
        "{V} × {Q} / ({I} × {b})",
        {"V": Q_(V, "N"), "Q": Qna, "I": I, "b": bef},
        Q_(tau, "N/mm**2"),
        source=f"mechanics of materials; {_EC5} §6.1.7(1)",
    )
    fvd = slog.add(
        "fvd",
        f"Design shear strength of {weak.material.id}",
        "f_v,d = k_mod·f_v,k / γ_M",
        "{k} × {f} / {g}",
        {"k": km, "f": weak.material.extra["f_v_k"], "g": gm},
        Q_(fv, "N/mm**2"),
        source=f"{_EC5} §2.4.1, eq. (2.14)",
        governs=True,
    )
    return Check(
        key,
        label,
        Q_(tau, "N/mm**2"),
        fvd,
        u,
        "OK" if u <= 1.0 + 1e-9 else "NG",
        f"{_EC5} §6.1.7, eq. (6.13)",
        phrase=Phrase("k_mod", {"combination": name, "k_mod": km}),
    )


def ec5_member_checks(
    member: Member, section: SectionResult, beam, settings: Settings, log: StepLog
) -> tuple[list[Check], tuple[Unchecked, ...]]:
    """The EN 1995-1-1 member checks that can run, and the Unchecked items for the rest."""
    checks: list[Check] = []
    if beam is not None:
        combos = _combos(beam, settings)
        seen: set[str] = set()
        for part in member.parts:
            if part.material.family not in _WOOD or part.material.id in seen:
                continue
            same = [
                (q, pp) for q, pp in zip(member.parts, section.parts) if q.material.id == part.material.id
            ]
            results = [
                _bending(member, q, pp, section, combos, log, f"bending.{q.material.id}.{q.id}")
                for q, pp in same
            ]
            seen.add(part.material.id)
            ran = [c for c in results if c.ratio is not None]
            gov = max(ran, key=lambda c: c.ratio or 0.0) if ran else results[0]
            checks.append(
                Check(
                    f"bending.{part.material.id}",
                    gov.label,
                    gov.demand,
                    gov.capacity,
                    gov.ratio,
                    gov.status,
                    gov.source,
                    gov.note,
                    phrase=gov.phrase,
                )
            )
        sh = _shear(member, section, combos, log, "shear.neutral_axis")
        if sh is not None:
            checks.append(sh)
    return checks, ec5_unchecked(member, beam is not None, checks)


def ec5_unchecked(
    member: Member, has_moment: bool, checks: list[Check] | tuple = ()
) -> tuple[Unchecked, ...]:
    """One :class:`Unchecked` per expectation of ``member`` that no check here ran (same key, so it
    replaces the NDS / AISC line), with the EN clause; the reason of an INFO row is kept."""
    ran = {c.key for c in checks if c.ratio is not None or c.status == "NG"}
    info = {c.key: c.note for c in checks if c.status == "INFO"}
    out = []
    for e in expectations(member, has_moment):
        if e.name in ran:
            continue
        head = e.name.split(".", 1)[0]
        clause = EC5_CLAUSES.get(head, STEEL if "AISC" in e.clause else f"{_EC5} §6")
        if head == "deflection":
            reason = e.reason
        elif e.name in info:
            reason = info[e.name].removeprefix("not checked: ")
        elif head == "bending" and not has_moment:
            reason = e.reason
        else:
            reason = REASON
        label = EC5_LABELS.get(e.name, e.label)
        out.append(Unchecked(f"member[{member.id}].{e.name}", label, clause, reason))
    if has_moment and any(p.material.family in ("wood", "glulam", "plywood") for p in member.parts):
        # the deflection checks are instantaneous: a final-deflection limit needs the creep part too
        out.append(
            Unchecked(
                f"member[{member.id}].deflection_final",
                "final deflection with creep (w_fin = w_inst·(1 + k_def) for the quasi-permanent part)",
                f"{_EC5} §2.2.3(5), Table 3.2",
                "not implemented: the deflections checked are instantaneous (no k_def)",
            )
        )
    return tuple(out)
