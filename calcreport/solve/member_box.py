"""Member checks of wood box and I-beams with panel (plywood) webs.

* Flanges are axial members: the stress from M·y/I at the flange centroid (and at its extreme
  fibre) against Ft′ (tension) and Fc′ (compression, with CP for the flange's unbraced length, or
  CP = 1 where the job states continuous bracing) — NDS 2018 §3.6–3.8 and Table 4.3.1, with C_D
  (or λ) of each load combination.
* Webs: panel shear through the thickness at the neutral axis, v = V·Q/(I·n_webs) against the
  panel's Fv·tv (APA Panel Design Specification; load duration per NDS 2018 §2.3.2).
* Deflection with the shear deformation of the webs added (G·Av = Σ Gv·tv·h of the webs).
* Flange and web splices are not designed (listed as not checked).

Factors the tool assumes (CM = Ct = 1.0, CF = 1.0 where the lumber is 12 in wide or less) are
stated in the steps; what the job does not give is returned as :class:`Unchecked`.
"""

from __future__ import annotations

import numpy as np

from ..model import Member, Part, Settings
from ..steps import StepLog
from ..units import Q_, Quantity
from .bracing import unbraced_length
from .checks_wood import Adjust, adjusted, axial_check, column_stability, combined_check, panel_shear_check
from .combinations import duration_factor, time_effect
from .results import Check, SectionResult, Unchecked
from .section import first_moment_above

__all__ = ["box_checks", "combination_extremes"]

NDS = "NDS 2018"
ASSUMED = "assumed: CM = 1.0 (dry service), Ct = 1.0 (T ≤ 100 °F) — not stated in the job"


def combination_extremes(beam, method: str) -> list[tuple[str, float, np.ndarray, np.ndarray]]:
    """For every combination: its name, C_D (ASD, NDS 2018 Table 2.3.2) or λ (LRFD, Table N3) and
    its V and M (lbf, lbf·in) with the variable cases in their worst placement, as arrays of two
    rows — the largest values along the member, then the smallest. Callers read only their
    extremes (``max``, ``min``, ``abs().max()``)."""
    out = []
    for diag, cb in zip(beam.analysis.combinations, beam.combinations):
        f = time_effect(cb)[0] if method == "LRFD" else duration_factor(cb)[0]
        V = np.stack([_mag(diag.V_hi, diag.V, "lbf"), _mag(diag.V_lo, diag.V, "lbf")])
        M = np.stack([_mag(diag.M_hi, diag.M, "lbf*inch"), _mag(diag.M_lo, diag.M, "lbf*inch")])
        out.append((diag.name, f, V, M))
    return out


def _mag(q, fallback, unit: str) -> np.ndarray:
    return np.asarray((fallback if q is None else q).to(unit).magnitude, dtype=float)


def _parts(member: Member) -> tuple[list[Part], list[Part]]:
    flanges = [p for p in member.parts if p.material.family in ("wood", "glulam")]
    webs = [p for p in member.parts if p.material.family == "plywood"]
    return flanges, webs


def _lateral_width(member: Member, y: float) -> float:
    """Width of the section along the horizontal line at height y (in): the flange and the webs
    fastened to it, which buckle laterally together."""
    return sum(
        p.shape.bbox[2] - p.shape.bbox[0] for p in member.parts if p.shape.bbox[1] < y < p.shape.bbox[3]
    )


def box_checks(
    member: Member, section: SectionResult, beam, V: Quantity, settings: Settings, log: StepLog
) -> tuple[list[Check], list[Unchecked]]:
    """Checks and not-checked items of a wood member with plywood webs (see module docstring)."""
    key = f"member[{member.id}]"
    flanges, webs = _parts(member)
    checks: list[Check] = []
    out: list[Unchecked] = []
    extremes = combination_extremes(beam, settings.method) if beam is not None else []
    if beam is None:
        out.append(Unchecked(f"{key}.flange_axial", "axial stress in the flanges (M·y/I against Ft and Fc)",
                             f"{NDS} §3.6–3.8", "no moment: the job gives a shear only (give span and loads)"))  # fmt: skip
    else:
        for fl in flanges:
            c, u = _flange(member, section, fl, extremes, settings, log.child(f"flange.{fl.id}"))
            checks += c
            out += u
    c, u = _panel_shear(member, section, webs, V, extremes, settings, log.child("web_shear"))
    checks += c
    out += u
    if beam is not None:
        c, u = _shear_deflection(member, webs, beam, log.child("shear_deflection"))
        checks += c
        out += u
    else:
        out.append(Unchecked(f"{key}.shear_deflection", "deflection with the shear deformation of the webs",
                             "mechanics of materials (G·Av of the webs)", "no loads along the member"))  # fmt: skip
    out.append(Unchecked(f"{key}.splices", "flange and web splices", f"{NDS}; APA Panel Design Specification",
                         "not designed by the tool (none are given)"))  # fmt: skip
    if beam is None:
        out.append(Unchecked(f"{key}.web_axial", "bending stress in the plywood webs (in-plane)",
                             "APA Panel Design Specification", "no moment: the job gives a shear only"))  # fmt: skip
    else:
        c, u = _web_axial(member, section, webs, extremes, settings, log.child("web_axial"))
        checks += c
        out += u
    return checks, out


def _web_axial(member, section, webs, extremes, settings, log) -> tuple[list[Check], list[Unchecked]]:
    """Stress in the plies parallel to the span at the web's top and bottom edge, f = n·M·c/I,
    against the panel's axial capacity per foot over its effective area per foot (Ft·A / A,
    Fc·A / A, APA Panel Design Specification), times C_D (ASD) — the webs bent in their plane."""
    key = f"member[{member.id}].web_axial"
    panels = [p.material.extra.get("panel") for p in webs]
    if not webs or any(pn is None or "Ft_A" not in pn or "Fc_A" not in pn for pn in panels):
        return [], [Unchecked(key, "bending stress in the plywood webs (in-plane)", "APA Panel Design Specification",
                              "no [material.panel] Ft_A and Fc_A given for the web panels")]  # fmt: skip
    if settings.method != "ASD":
        return [], [Unchecked(key, "bending stress in the plywood webs (in-plane)", "APA Panel Design Specification",
                              "LRFD conversion of panel capacities not implemented")]  # fmt: skip
    bottom = float(section.bottom.to("in").magnitude)
    ybar = float(section.centroid.to("in").magnitude)
    checks: list[Check] = []
    done: set[str] = set()
    for part, pn in zip(webs, panels):
        if part.material.id in done:
            continue
        done.add(part.material.id)
        props = next(p for p in section.parts if p.id == part.id)
        A_ft = pn["A"] if "A" in pn else (pn["thickness_effective"] * Q_(12, "in") / Q_(1, "ft"))
        c_top = part.shape.bbox[3] - bottom - ybar
        c_bot = ybar - (part.shape.bbox[1] - bottom)
        for which, cap_key in (("tension", "Ft_A"), ("compression", "Fc_A")):
            # positive moment: bottom edge in tension, top in compression
            cand = []
            for name, cd, _V, M in extremes:
                mpos, mneg = float(M.max()), float(-M.min())
                m_c = (mpos * c_bot, mneg * c_top) if which == "tension" else (mpos * c_top, mneg * c_bot)
                cand.append((name, cd, max(m_c)))
            name, cd, mc = max(cand, key=lambda t: t[2] / t[1])
            if mc <= 0:
                continue
            slog = log.child(f"{part.material.id}.{which}")
            f = slog.add("f", f"{which.capitalize()} stress in the parallel plies of web {part.id}, {name}",
                         "f = n·M·c / I", "{n} × M·c = {Mc} / {I}",
                         {"n": props.n, "Mc": Q_(mc, "lbf*inch**2"), "I": section.inertia},
                         (props.n * Q_(mc, "lbf*inch**2") / section.inertia).to("psi"),
                         source="mechanics of materials (flexure formula, effective section)")  # fmt: skip
            F = slog.add("F", f"Allowable {which} stress of the panel, {name}", f"F′ = ({cap_key} / A)·C_D",
                         "{cap} / {A} × {cd}", {"cap": pn[cap_key], "A": A_ft, "cd": cd},
                         (pn[cap_key] / A_ft * cd).to("psi"),
                         source=f"{pn['table']} (stated in the job file); {NDS} §2.3.2")  # fmt: skip
            r = float((f / F).to("").magnitude)
            checks.append(Check(f"{key}.{part.material.id}.{which}", f"Web {part.id} in-plane {which} ({name})",
                                f, F, r, "OK" if r <= 1 + 1e-9 else "NG", "APA Panel Design Specification"))  # fmt: skip
    return checks, []


def _flange(member, section, fl: Part, extremes, settings, log) -> tuple[list[Check], list[Unchecked]]:
    key = f"member[{member.id}].flange[{fl.id}]"
    mat = fl.material
    props = next(p for p in section.parts if p.id == fl.id)
    bottom = float(section.bottom.to("in").magnitude)
    ybar = float(section.centroid.to("in").magnitude)
    yc = float(props.centroid_y.to("in").magnitude) - ybar
    y0, y1 = fl.shape.bbox[1] - bottom - ybar, fl.shape.bbox[3] - bottom - ybar
    cext = y1 if yc > 0 else -y0
    above = yc > 0
    I = section.inertia
    n = props.n
    Ft, Fc, Emin = mat.extra.get("Ft"), mat.extra.get("Fc"), mat.extra.get("Emin")
    depth_lumber = max(fl.shape.bbox[2] - fl.shape.bbox[0], fl.shape.bbox[3] - fl.shape.bbox[1])
    CF = 1.0
    cf_note = "CF = 1.0 taken (not stated; the tabulated CF of lumber 12 in wide or less is ≥ 1.0)"
    checks: list[Check] = []
    out: list[Unchecked] = []
    # moments putting this flange in tension / compression, per combination
    senses = []
    for name, cd, _V, M in extremes:
        mpos, mneg = float(M.max()), float(-M.min())
        senses.append((name, cd, mpos if not above else mneg, mneg if not above else mpos))
    # (name, C_D, M giving tension, M giving compression)
    if depth_lumber > 12.0 + 1e-6:
        out.append(Unchecked(f"{key}.axial", f"axial stress in flange {fl.id}", f"{NDS} Supplement Table 4A (CF)",
                             "lumber wider than 12 in: give the size factor (not implemented)"))  # fmt: skip
        return checks, out
    log.add("factors", f"Adjustment factors assumed for flange {fl.id}", "CM, Ct, CF", "{CM}, {Ct}, {CF}",
            {"CM": 1.0, "Ct": 1.0, "CF": CF}, "1.0, 1.0, 1.0", source=f"{NDS} Table 4.3.1",
            note=ASSUMED + "; " + cf_note)  # fmt: skip
    for which, F, idx in (("tension", Ft, 2), ("compression", Fc, 3)):
        worst = max(senses, key=lambda s: s[idx] / s[1], default=None)
        if worst is None or worst[idx] <= 0:
            continue
        if F is None:
            out.append(Unchecked(f"{key}.{which}", f"{which} stress in flange {fl.id}",
                                 f"{NDS} §3.{8 if which == 'tension' else 6}",
                                 f"no {'Ft' if which == 'tension' else 'Fc'} given for material {mat.id}"))  # fmt: skip
            continue
        name, cd, M = worst[0], worst[1], Q_(worst[idx], "lbf*inch")
        slog = log.child(which)
        a = Adjust(CD=cd, CF=CF, method=settings.method)
        CP = None
        if which == "compression":
            Lu = unbraced_length(member, "top" if above else "bottom", slog, "le", f"{NDS} §3.7.1")
            if Lu is None:
                continue
            if Lu > 0:
                if Emin is None:
                    out.append(Unchecked(f"{key}.compression", f"compression stress in flange {fl.id}",
                                         f"{NDS} §3.7", f"no Emin given for material {mat.id} (for CP)"))  # fmt: skip
                    continue
                yline = (fl.shape.bbox[1] + fl.shape.bbox[3]) / 2
                d = Q_(_lateral_width(member, yline), "in")
                le = Q_(Lu, "in")
                slog.add("d", f"Lateral dimension of the compression chord at flange {fl.id}", "d",
                         "{d}", {"d": d}, d, source="geometry of the placed parts",
                         note="flange and the webs fastened to it buckle laterally together")  # fmt: skip
                slend = float((le / d).to("").magnitude)
                checks.append(Check(f"{key}.slenderness", f"Slenderness ℓe/d of flange {fl.id} (≤ 50)",
                                    round(slend, 2), 50.0, slend / 50.0, "OK" if slend <= 50 else "NG",
                                    f"{NDS} §3.7.1.4"))  # fmt: skip
                Fc_star = adjusted("Fc", f"Fc* of flange {fl.id} (before CP), {name}", F, a, slog)
                Emin_adj = adjusted(
                    "Emin", f"Emin′ of flange {fl.id}", Emin, Adjust(1.0, method=settings.method), slog
                )
                CP = column_stability(Fc_star, Emin_adj, le, d, slog)
            else:
                CP = 1.0
        Fadj = adjusted("Fc" if which == "compression" else "Ft",
                        f"Adjusted {which} design value of flange {fl.id}, {name}", F, a, slog, CP)  # fmt: skip
        stress = {}
        for where, y in (("centroid", abs(yc)), ("extreme", abs(cext))):
            stress[where] = slog.add(
                f"f_{where}", f"Stress in flange {fl.id} at its {'centroid' if where == 'centroid' else 'extreme fibre'}, {name}",
                "f = n·M·y / I", "{n} × {M} × {y} / {I}", {"n": n, "M": M, "y": Q_(y, "in"), "I": I},
                (n * M * Q_(y, "in") / I).to("psi"), source="mechanics of materials (flexure formula)")  # fmt: skip
        clause = f"{NDS} §3.8.1" if which == "tension" else f"{NDS} §3.6.3, §3.7.1"
        checks.append(axial_check(f"{key}.{which}", f"Flange {fl.id} axial {which} at its centroid ({name})",
                                  stress["centroid"], Fadj, clause,
                                  note="C_P applied" if CP not in (None, 1.0) else ""))  # fmt: skip
        if mat.Fb is None:
            out.append(Unchecked(f"{key}.{which}_combined", f"combined axial {which} and bending in flange {fl.id}",
                                 f"{NDS} §3.9", f"no Fb given for material {mat.id}"))  # fmt: skip
            continue
        fb = slog.add("fb", f"Bending part of the stress across flange {fl.id}", "fb = f_extreme − f_centroid",
                      "{e} − {c}", {"e": stress["extreme"], "c": stress["centroid"]},
                      (stress["extreme"] - stress["centroid"]).to("psi"), source="mechanics of materials")  # fmt: skip
        Fb_adj = adjusted("Fb", f"Adjusted bending design value of flange {fl.id} (CL = 1.0), {name}",
                          mat.Fb, a, slog)  # fmt: skip
        checks.append(combined_check(f"{key}.{which}_combined", fl.id, which, stress["centroid"], Fadj, fb,
                                     Fb_adj, name, slog))  # fmt: skip
    return checks, out


def _panel_shear(member, section, webs, V, extremes, settings, log) -> tuple[list[Check], list[Unchecked]]:
    key = f"member[{member.id}].web_panel_shear"
    y = float(section.centroid.to("in").magnitude) + float(section.bottom.to("in").magnitude)
    cut = [p for p in webs if p.shape.bbox[1] < y < p.shape.bbox[3]]
    panels = [p.material.extra.get("panel") for p in cut]
    if not cut or any(pn is None or "Fv_tv" not in pn for pn in panels):
        return [], [Unchecked(key, "panel shear through the thickness of the webs", "APA Panel Design Specification",
                              "no [material.panel] Fv_tv given for the web panels")]  # fmt: skip
    Fvtv = min((pn["Fv_tv"] for pn in panels), key=lambda q: float(q.to("lbf/in").magnitude))
    src = f"{panels[0]['table']} (stated in the job file); {NDS} §2.3.2"
    Q = Q_(abs(first_moment_above(member, section, float(section.centroid.to("in").magnitude))), "inch**3")
    if extremes:
        name, cd, Vc, _ = max(extremes, key=lambda e: float(np.abs(e[2]).max()) / e[1])
        Vd = Q_(float(np.abs(Vc).max()), "lbf")
        note = f"governed by {name}"
    else:
        lrfd = settings.method == "LRFD"
        given = None if lrfd else settings.load_duration  # load_duration is C_D (ASD only)
        cd = given or (0.8 if lrfd else 1.0)
        Vd = V
        if given:
            note = "duration factor from settings.load_duration"
        elif lrfd:
            note = "assumed: λ = 0.8 (occupancy or snow load; no time effect factor given for a stated shear)"
        else:
            note = "assumed: C_D = 1.0 (normal load duration; settings.load_duration not given)"
    log.add("V", "Design shear for the web panels", "V", "{V}", {"V": Vd}, Vd.to("lbf"), source="beam analysis"
            if extremes else "stated in the job file", note=note)  # fmt: skip
    return [panel_shear_check(key, Vd, Q, section.inertia, len(cut), Fvtv, cd, settings.method, src, log)], []


def _shear_deflection(member, webs, beam, log) -> tuple[list[Check], list[Unchecked]]:
    """Δ = Δ_bending + Δ_shear, Δ_shear(x) = [M(x) − M_chord(x)]/(G·Av) within each span between
    supports (M_chord: the straight line between the moments at the span's supports) — the shear
    deformation of the webs, from dΔs/dx = V/(G·Av) (mechanics of materials, Timoshenko beam;
    moments from the bending analysis). Largest Δb and largest Δs are added (conservative); with
    variable loads in their worst placement Δs is bounded from the moment envelope of the
    combination (see the comment in the loop)."""
    from .beam import _combine
    from .member_checks import SOURCE_DEFLECTION

    key = f"member[{member.id}].shear_deflection"
    panels = [p.material.extra.get("panel") for p in webs]
    if not webs or any(pn is None or "Gv_tv" not in pn for pn in panels):
        return [], [Unchecked(key, "deflection with the shear deformation of the webs",
                              "mechanics of materials (G·Av of the webs)",
                              "no [material.panel] Gv_tv given for the web panels")]  # fmt: skip
    GA = sum(
        (pn["Gv_tv"] * Q_(p.shape.bbox[3] - p.shape.bbox[1], "in")).to("lbf") for p, pn in zip(webs, panels)
    )
    GA = log.add("GAv", "Shear rigidity of the webs", "G·Av = Σ Gv·tv·h", "{GA}", {"GA": GA}, GA,
                 source=f"{panels[0]['table']} (stated in the job file)")  # fmt: skip
    an = beam.analysis
    b = an._basis
    x = an.envelope.x.to("in").magnitude
    out: list[Check] = []
    names = [d.name for d in an.cases]
    for lim_key, ratio in beam.deflection_limits.items():
        if lim_key == "total":
            variable = [c for c in names if c not in ("D", "W")]
            sets = [{"D": 1.0, c: 1.0} for c in variable] or [{"D": 1.0}]
        elif lim_key in names:
            sets = [{lim_key: 1.0}]
        else:
            continue
        for seg in an.segments:
            if seg.kind != "span":
                continue
            a_, z_ = float(seg.start.to("in").magnitude), float(seg.end.to("in").magnitude)
            mask = (x >= a_ - 1e-9) & (x <= z_ + 1e-9)
            worst_b, worst_s, label = 0.0, 0.0, ""
            for factors in sets:
                db = float(an.deflection_max(factors, seg.index).to("in").magnitude)
                hi, lo = _combine(b, factors, "M")
                hi, lo, xs = hi[mask], lo[mask], x[mask]
                t = (xs - xs[0]) / max(xs[-1] - xs[0], 1e-9)
                # any placement: M ≤ hi, M ≥ lo, and its chord lies between the chords of lo
                # and hi (end moments weighted by 1 − t and t ≥ 0), so |M − chord| is bounded by
                # the larger of hi − chord(lo) and chord(hi) − lo
                chord_hi = hi[0] + (hi[-1] - hi[0]) * t
                chord_lo = lo[0] + (lo[-1] - lo[0]) * t
                dev = np.maximum(hi - chord_lo, chord_hi - lo)
                ds = float(dev.max()) / float(GA.to("lbf").magnitude) if dev.size else 0.0
                if db + ds > worst_b + worst_s:
                    worst_b, worst_s, label = db, ds, " + ".join(factors)
            slog = log.child(f"{lim_key}.segment{seg.index + 1}")
            ds_q = slog.add("ds", f"Shear deflection of the webs, {label} (span {seg.index + 1})",
                            "Δs = max |M − M_chord| / (G·Av)", "{GA}", {"GA": GA}, Q_(worst_s, "in"),
                            source="mechanics of materials (shear deformation, dΔs/dx = V/(G·Av))")  # fmt: skip
            total = slog.add("dt", f"Deflection with shear deformation, {label} (span {seg.index + 1})",
                             "Δ = Δb + Δs", "{b} + {s}", {"b": Q_(worst_b, "in"), "s": ds_q},
                             Q_(worst_b + worst_s, "in"), source="mechanics of materials")  # fmt: skip
            allow = (seg.length / ratio).to("in")
            r = float((total / allow).to("").magnitude)
            what = "total load" if lim_key == "total" else f"load case {lim_key}"
            out.append(Check(f"{key}.{lim_key}.segment{seg.index + 1}",
                             f"Deflection with web shear deformation, {what} (span {seg.index + 1})",
                             total, allow, r, "OK" if r <= 1 + 1e-9 else "NG", SOURCE_DEFLECTION))  # fmt: skip
    return out, []
