"""The γ-method's derivation steps and checks for one member (see :mod:`.slip`).

Every value is a step citing EN 1995-1-1:2004 Annex B (or §9.1.3 for the effective spacing);
numbers are plain floats in lbf and inches inside, quantities in the steps.
"""

from __future__ import annotations

from dataclasses import dataclass

from ..steps import StepLog
from ..units import Q_, Quantity
from .results import JointResult, SectionResult
from .slip_gamma import Layer, ei_effective, gammas
from .slip_layout import Group

SRC = "EN 1995-1-1:2004 Annex B"
#: Relative change of every spacing between two iterations at which the iteration stops.
TOLERANCE = 1e-3
MAX_ITERATIONS = 50


@dataclass
class State:
    """The γ-method at the provided spacing: ultimate (K_u) and serviceability (K_ser)."""

    layers: list  # SlipLayer
    g_u: list[float]
    g_ser: list[float]
    a_u: list[float]
    a_ser: list[float]
    a_rigid: list[float]
    EI_rigid: Quantity
    EI_u: Quantity
    EI_ser: Quantity
    base: list[Layer]


def _in(q: Quantity) -> float:
    return float(q.to("inch").magnitude)


def effective_length(segments, log: StepLog) -> Quantity:
    """ℓ = L for a simple span, 0.8·L for a span of a continuous beam, 2·L for a cantilever or
    overhang; the smallest over the member's segments (the least composite action).
    Source: EN 1995-1-1:2004 Annex B (effective length of the γ-method)."""
    spans = [s for s in segments if s.kind == "span"]
    best, rule = None, ""
    for s in segments:
        L = _in(s.length)
        if s.kind == "span":
            ell, r = (L, "ℓ = L (simple span)") if len(spans) == 1 else (0.8 * L, "ℓ = 0.8·L (continuous)")
        else:
            ell, r = 2.0 * L, f"ℓ = 2·L ({s.kind})"
        if best is None or ell < best:
            best, rule = ell, f"{r}, segment {s.index + 1}"
    assert best is not None
    return log.add(
        "ell", "Effective length for γ", "ℓ", "{rule}", {"rule": rule}, Q_(best, "inch"), source=SRC
    )


def joint_spacing(j: JointResult, log: StepLog) -> tuple[Quantity, Quantity]:
    """Spacing for γ at strength and at serviceability: the single provided spacing, or over a
    zoned schedule s_ef = 0.75·s_min + 0.25·s_max (EN 1995-1-1:2004 §9.1.3(3), valid for
    s_max ≤ 4·s_min); beyond that, bounds: s_min for strength (more composite action, larger
    connector forces) and s_max for deflection (less stiffness)."""
    from .slip_layout import NotApplicable

    if not float(j.capacity.to("lbf").magnitude) > 0.0:
        raise NotApplicable(f"joint {j.id}: its connectors have no design value")
    zones = j.schedule.zones if j.schedule is not None and j.schedule.feasible else ()
    if not zones:
        if j.spacing_provided is None:
            raise NotApplicable(f"joint {j.id}: no spacing could be provided")
        s = log.add("s", "Spacing of the rows", "s (provided)", "{s}", {"s": j.spacing_provided},
                    j.spacing_provided.to("inch"), source="connector spacing above")  # fmt: skip
        return s, s
    ss = [z.spacing.to("inch") for z in zones]
    s_min, s_max = min(ss), max(ss)
    if _in(s_max) - _in(s_min) < 1e-9:
        s = log.add(
            "s",
            "Spacing of the rows",
            "s (schedule)",
            "{s}",
            {"s": s_min},
            s_min,
            source="zoned schedule above",
        )
        return s, s
    if _in(s_max) <= 4.0 * _in(s_min) + 1e-9:
        s = log.add("s_ef", "Effective spacing over the schedule", "s_ef = 0.75·s_min + 0.25·s_max",
                    "0.75 × {a} + 0.25 × {b}", {"a": s_min, "b": s_max}, 0.75 * s_min + 0.25 * s_max,
                    source="EN 1995-1-1:2004 §9.1.3(3)")  # fmt: skip
        return s, s
    note = "s_max > 4·s_min: no s_ef applies; s_min bounds the connector forces, s_max the deflection"
    su = log.add("s_u", "Spacing for γ at strength", "s = s_min", "{s}", {"s": s_min}, s_min,
                 source="EN 1995-1-1:2004 §9.1.3(3)", note=note)  # fmt: skip
    ss_ = log.add("s_ser", "Spacing for γ at serviceability", "s = s_max", "{s}", {"s": s_max}, s_max,
                  source="EN 1995-1-1:2004 §9.1.3(3)", note=note)  # fmt: skip
    return su, ss_


def _base(groups: list[Group]) -> list[Layer]:
    return [Layer(g.EA(), g.EI(), g.y()) for g in groups]


def rigid_check(groups: list[Group], section: SectionResult, log: StepLog) -> None:
    """The layers with γ = 1 must give the rigid section's E·I (a guard on the layer split)."""
    from .slip_layout import NotApplicable

    EI, _ = ei_effective(_base(groups), [1.0] * len(groups))
    ref = float((section.E_ref * section.inertia).to("lbf*inch**2").magnitude)
    if abs(EI - ref) > 5e-3 * ref:
        raise NotApplicable(
            "the layers do not reproduce the rigid section's EI (a part is transformed or cracked)"
        )


def _layers(base: list[Layer], groups: list[Group], K: dict[str, float], s: dict[str, float]) -> list[Layer]:
    out = []
    for L, g in zip(base, groups):
        if g.joint is None:
            out.append(L)
        else:
            out.append(Layer(L.EA, L.EI, L.y, K[g.joint.id], s[g.joint.id]))
    return out


def gamma_steps(groups, moduli, spacing, joints, ell: Quantity, section, log: StepLog) -> State:
    """γ of each fastened layer, the distances aᵢ and (EI)_ef, at strength and serviceability."""
    from .slip import SlipLayer

    base = _base(groups)
    L = _in(ell)
    EI_r, a_r = ei_effective(base, [1.0] * len(base))
    states = {}
    same = all(abs(_k(m.K_u) - _k(m.K_ser)) < 1e-9 and _in(spacing[j][0]) == _in(spacing[j][1])
               for j, m in moduli.items())  # fmt: skip
    for lim in ("u",) if same else ("u", "ser"):
        K = {j: joints[j].per_row * _k(m.K_u if lim == "u" else m.K_ser) for j, m in moduli.items()}
        s = {j: _in(spacing[j][0 if lim == "u" else 1]) for j in moduli}
        lay = _layers(base, groups, K, s)
        g = gammas(lay, L)
        EI, a = ei_effective(lay, g)
        tag = "" if same else ("_u" if lim == "u" else "_ser")
        what = "" if same else (", strength (K_u)" if lim == "u" else ", serviceability (K_ser)")
        for grp, layer, gi in zip(groups, lay, g):
            sl = log.child(f"layer.{grp.name}")
            if lim == "u":
                sl.add("EA", f"Axial stiffness of {_parts(grp)}", "Eᵢ·Aᵢ = Σ E·A", "{EA}", {"EA": Q_(layer.EA, "lbf")},
                       Q_(layer.EA, "lbf"), source="mechanics of materials")  # fmt: skip
                sl.add("EI", f"Own bending stiffness of {_parts(grp)}", "Eᵢ·Iᵢ = Σ E·(I₀ + A·d²)", "{EI}",
                       {"EI": Q_(layer.EI, "lbf*inch**2")}, Q_(layer.EI, "lbf*inch**2"),
                       source="mechanics of materials: parallel-axis theorem")  # fmt: skip
            if grp.joint is not None:
                n = joints[grp.joint.id].per_row
                sl.add(f"gamma{tag}", f"γ of {_parts(grp)}{what}", "γᵢ = 1 / (1 + π²·Eᵢ·Aᵢ·sᵢ / (n·K·ℓ²))",
                       "1 / (1 + π² × {EA} × {s} / ({n} × {K} × ({l})²))",
                       {"EA": Q_(layer.EA, "lbf"), "s": Q_(layer.s, "inch"), "n": n,
                        "K": Q_((layer.K or 0.0) / n, "lbf/inch"), "l": ell}, gi, source=f"{SRC}, B.2")  # fmt: skip
        y0 = lay[0].y - a[0]
        terms = " + ".join(f"{{g{i}}} × {{EA{i}}} × {{y{i}}}" for i in range(len(lay)))
        den = " + ".join(f"{{g{i}}} × {{EA{i}}}" for i in range(len(lay)))
        vals: dict = {}
        for i, (layer, gi) in enumerate(zip(lay, g)):
            vals.update({f"g{i}": gi, f"EA{i}": Q_(layer.EA, "lbf"), f"y{i}": Q_(layer.y, "inch")})
        q_y0 = log.add(f"y0{tag}", f"Height of the neutral axis{what}", "y₀ = Σγᵢ·Eᵢ·Aᵢ·yᵢ / Σγᵢ·Eᵢ·Aᵢ",
                       f"({terms}) / ({den})", vals, Q_(y0, "inch"), source=f"{SRC}, B.2",
                       note="yᵢ: centroid of each layer above the section's lowest point")  # fmt: skip
        for grp, layer, ai in zip(groups, lay, a):
            log.child(f"layer.{grp.name}").add(
                f"a{tag}", f"Distance of {_parts(grp)} from the neutral axis{what}", "aᵢ = yᵢ − y₀",
                "{y} − {y0}", {"y": Q_(layer.y, "inch"), "y0": q_y0}, Q_(ai, "inch"), source=f"{SRC}, B.2")  # fmt: skip
        own = sum(L.EI for L in lay)
        log.add(f"EI_ef{tag}", f"Effective bending stiffness{what}", "(EI)_ef = Σ(Eᵢ·Iᵢ + γᵢ·Eᵢ·Aᵢ·aᵢ²)",
                "{own} + {comp}", {"own": Q_(own, "lbf*inch**2"), "comp": Q_(EI - own, "lbf*inch**2")},
                Q_(EI, "lbf*inch**2"), source=f"{SRC}, B.2",
                note="Σ Eᵢ·Iᵢ of the layers + Σ γᵢ·Eᵢ·Aᵢ·aᵢ²")  # fmt: skip
        states[lim] = (g, a, EI)
    g_u, a_u, EI_u = states["u"]
    g_s, a_s, EI_s = states.get("ser", states["u"])
    layers = [
        SlipLayer(
            grp.name,
            tuple(p.id for p in grp.parts),
            Q_(b.EA, "lbf"),
            Q_(b.EI, "lbf*inch**2"),
            gs,
            gu,
            Q_(as_, "inch"),
            Q_(au, "inch"),
        )  # fmt: skip
        for grp, b, gs, gu, as_, au in zip(groups, base, g_s, g_u, a_s, a_u)
    ]
    return State(layers, g_u, g_s, a_u, a_s, a_r, Q_(EI_r, "lbf*inch**2"), Q_(EI_u, "lbf*inch**2"),
                 Q_(EI_s, "lbf*inch**2"), base)  # fmt: skip


def _k(q: Quantity) -> float:
    return float(q.to("lbf/inch").magnitude)


def _parts(g: Group) -> str:
    ids = ", ".join(p.id for p in g.parts)
    return f"the web ({ids})" if g.joint is None else f"{ids} (joint {g.joint.id})"


def stress_steps(groups: list[Group], st: State, beam, log: StepLog) -> None:
    """Normal and bending stresses of each layer under the design moment (B.3), and the largest
    shear stress in the web (B.4), with the strength stiffness."""
    from ..outlines import is_rectangle
    from .slip_gamma import bending_stress, normal_stress, web_shear_max

    M = float(beam.M_design.to("lbf*inch").magnitude)
    V = float(beam.V_design.to("lbf").magnitude)
    EI = float(st.EI_u.to("lbf*inch**2").magnitude)
    for grp, gi, ai in zip(groups, st.g_u, st.a_u):
        Es = {float(p.material.E.to("psi").magnitude) for p in grp.parts}
        if len(Es) != 1:
            continue  # a layer of mixed moduli has no single stress
        E = Es.pop()
        sl = log.child(f"layer.{grp.name}")
        sl.add("sigma", f"Normal stress at the centroid of {_parts(grp)}", "σᵢ = γᵢ·Eᵢ·aᵢ·M / (EI)_ef",
               "{g} × {E} × {a} × {M} / {EI}", {"g": gi, "E": Q_(E, "psi"), "a": Q_(ai, "inch"), "M": beam.M_design,
               "EI": st.EI_u}, Q_(normal_stress(E, gi, ai, M, EI), "psi"), source=f"{SRC}, B.3")  # fmt: skip
        h = grp.height()
        sl.add("sigma_m", f"Bending stress of {_parts(grp)} about its own axis", "σ_m,i = 0.5·Eᵢ·hᵢ·M / (EI)_ef",
               "0.5 × {E} × {h} × {M} / {EI}", {"E": Q_(E, "psi"), "h": Q_(h, "inch"), "M": beam.M_design,
               "EI": st.EI_u}, Q_(bending_stress(E, h, M, EI), "psi"), source=f"{SRC}, B.3")  # fmt: skip
    web = groups[-1]
    y0 = web.y() - st.a_u[-1]
    Es = {float(p.material.E.to("psi").magnitude) for p in web.parts}
    cut = [p for p in web.parts if p.shape.bbox[1] < y0 < p.shape.bbox[3]]
    if len(Es) != 1 or not cut or not all(is_rectangle(p.shape) for p in web.parts):
        return
    top = max(p.shape.bbox[3] for p in web.parts)
    above = [i for i in range(len(groups) - 1) if st.a_u[i] > 0]
    if not above:
        return
    i = above[0]
    b = sum(p.shape.bbox[2] - p.shape.bbox[0] for p in cut)
    h = top - y0
    E = Es.pop()
    log.add("tau_web", "Largest shear stress in the web", "τ₂,max = (γᵢ·Eᵢ·Aᵢ·aᵢ + 0.5·E₂·b₂·h²)·V / (b₂·(EI)_ef)",
            "({g} × {EA} × {a} + 0.5 × {E} × {b} × ({h})²) × {V} / ({b} × {EI})",
            {"g": st.g_u[i], "EA": Q_(st.base[i].EA, "lbf"), "a": Q_(st.a_u[i], "inch"), "E": Q_(E, "psi"),
             "b": Q_(b, "inch"), "h": Q_(h, "inch"), "V": beam.V_design, "EI": st.EI_u},
            Q_(web_shear_max(st.g_u[i], st.base[i].EA, st.a_u[i], E, b, h, V, EI), "psi"),
            source=f"{SRC}, B.4", note="h: from the neutral axis to the top of the web")  # fmt: skip


def _status(r: float) -> str:
    return "OK" if r <= 1.0 + 1e-9 else "NG"
