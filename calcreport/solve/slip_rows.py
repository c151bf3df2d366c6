"""Rigid beside slip for one member: connector forces and spacing per joint, deflections.

Connector forces: Fᵢ = γᵢ·Eᵢ·Aᵢ·aᵢ·sᵢ·V / (EI)_ef per row (EN 1995-1-1:2004 Annex B, B.5), at the
zone of the schedule (or the single spacing) where the rigid utilisation is largest — the ratio of
the slip force to the rigid V·Q/I force is the same all along the member. The single spacing that
slip needs is found by iteration: spacing → γ → force → spacing.
Deflection: Δ_slip = Δ·(EI)/(EI)_ef,ser (one EI along the member, mechanics of materials).
"""

from __future__ import annotations

from dataclasses import replace

from ..steps import Phrase, StepLog
from ..units import Q_, Quantity
from .results import Check
from .slip_gamma import ei_effective, gammas, row_force
from .slip_layout import Group
from .slip_steps import MAX_ITERATIONS, SRC, TOLERANCE, State, _in, _k, _layers, _status

__all__ = ["joint_rows", "deflection_rows"]


def _zone(j) -> tuple[Quantity, Quantity, float]:
    """(q, s, rigid utilisation) where the rigid utilisation of the joint is largest."""
    nF = (j.per_row * j.capacity).to("lbf")
    zones = j.schedule.zones if j.schedule is not None and j.schedule.feasible else ()
    rows = [(z.demand_max, z.spacing) for z in zones] or [(j.shear_flow, j.spacing_provided)]
    best = max(rows, key=lambda r: float((r[0] * r[1] / nF).to("").magnitude))
    return best[0].to("lbf/inch"), best[1].to("inch"), float((best[0] * best[1] / nF).to("").magnitude)


def _iterate(groups, st: State, moduli, joints, ell: float):
    """Single spacing each fastened joint needs with slip: s = n·F / (c(s)·V), with c = γ·E·A·a /
    (EI)_ef at the spacing s itself (K_u), capped at the joint's largest spacing (or ℓ)."""
    ids = [g.joint.id for g in groups[:-1]]
    K = {i: joints[i].per_row * _k(moduli[i].K_u) for i in ids}
    s = {i: _in(joints[i].spacing_required or joints[i].spacing_provided or Q_(ell, "inch")) for i in ids}
    cap = {i: _in(joints[i].spacing_max) if joints[i].spacing_max is not None else ell for i in ids}
    k = 0
    for step in range(1, MAX_ITERATIONS + 1):
        k = step
        lay = _layers(st.base, groups, K, s)
        g = gammas(lay, ell)
        EI, a = ei_effective(lay, g)
        new = {}
        for n, i in enumerate(ids):
            j = joints[i]
            c = g[n] * lay[n].EA * abs(a[n]) / EI
            V = float(j.shear.to("lbf").magnitude)
            nF = j.per_row * float(j.capacity.to("lbf").magnitude)
            new[i] = min(nF / (c * V), cap[i]) if c * V > 0 else cap[i]
        done = all(abs(new[i] - s[i]) <= TOLERANCE * max(s[i], 1e-12) for i in ids)
        s = new
        if done:
            break
    lay = _layers(st.base, groups, K, s)
    g = gammas(lay, ell)
    EI, a = ei_effective(lay, g)
    return s, g, a, EI, k, cap


def joint_rows(member, groups: list[Group], moduli, spacing, joints, st: State, ell: Quantity, log: StepLog):
    """Per fastened joint: rigid and slip forces, utilisations, spacing required; their checks."""
    from .slip import SlipJoint

    L = _in(ell)
    s_it, g_it, a_it, EI_it, iters, cap = _iterate(groups, st, moduli, joints, L)
    EIr = float(st.EI_rigid.to("lbf*inch**2").magnitude)
    EIu = float(st.EI_u.to("lbf*inch**2").magnitude)
    rows, checks = [], []
    log.add("iterations", "Iterations of spacing → γ → force → spacing", "k", "{k} iterations, tolerance {t}",
            {"k": iters, "t": TOLERANCE}, iters, source="common practice, no source",
            note="stops when no spacing changes by more than the tolerance (relative)")  # fmt: skip
    for n, grp in enumerate(groups[:-1]):
        assert grp.joint is not None
        jid = grp.joint.id
        j = joints[jid]
        jl = log.child(f"joint.{jid}")
        EA = st.base[n].EA
        q, s, u_rigid = _zone(j)
        c_rigid = EA * abs(st.a_rigid[n]) / EIr
        V = Q_(float(q.magnitude) / c_rigid, "lbf")
        F_row = jl.add("F_row", f"Force on one row of connectors with slip, joint {jid}",
                       "Fᵢ = γᵢ·Eᵢ·Aᵢ·aᵢ·sᵢ·V / (EI)_ef", "{g} × {EA} × {a} × {s} × {V} / {EI}",
                       {"g": st.g_u[n], "EA": Q_(EA, "lbf"), "a": Q_(abs(st.a_u[n]), "inch"), "s": s, "V": V,
                        "EI": st.EI_u},
                       Q_(row_force(EA, st.g_u[n], st.a_u[n], _in(s), float(V.magnitude), EIu), "lbf"),
                       source=f"{SRC}, B.5", positions=("s",),
                       note="V: the shear where the rigid utilisation of the schedule is largest")  # fmt: skip
        F = jl.add("F", f"Force on one connector with slip, joint {jid}", "F = Fᵢ / n", "{F} / {n}",
                   {"F": F_row, "n": j.per_row}, (F_row / j.per_row).to("lbf"), source=f"{SRC}, B.5")  # fmt: skip
        F_rigid = (q * s / j.per_row).to("lbf")
        u_slip = float((F / j.capacity).to("").magnitude)
        sr = None
        if j.spacing_required is not None:
            nF = (j.per_row * j.capacity).to("lbf")
            sr = jl.add("s_req", f"Single spacing required with slip, joint {jid}",
                        "s = n·F / (γᵢ·Eᵢ·Aᵢ·aᵢ·V / (EI)_ef)", "{nF} / ({g} × {EA} × {a} × {V} / {EI})",
                        {"nF": nF, "g": g_it[n], "EA": Q_(EA, "lbf"), "a": Q_(abs(a_it[n]), "inch"), "V": j.shear,
                         "EI": Q_(EI_it, "lbf*inch**2")}, Q_(s_it[jid], "inch"), source=f"{SRC}, B.2 and B.5",
                        positions=("result",),
                        note="strength only, γ at this spacing (last iteration); a larger spacing lowers γ "
                        "and raises the deflection, which is checked at the provided spacing"
                        + ("; limited by the largest spacing" if s_it[jid] >= cap[jid] - 1e-9 else ""))  # fmt: skip
        gov = "slip" if u_slip > u_rigid + 1e-12 else "rigid"
        rows.append(SlipJoint(jid, moduli[jid].K_ser, moduli[jid].K_u, moduli[jid].source, spacing[jid][0], s, F_rigid, F,
                              j.capacity, u_rigid, u_slip, j.spacing_required, sr, gov,
                              s_it[jid] >= cap[jid] - 1e-9))  # fmt: skip
        checks.append(Check(f"member[{member.id}].slip.connector.{jid}",
                            f"Connector force with slip, joint {jid}", F, j.capacity, u_slip,
                            _status(u_slip), f"{SRC}, B.5", scope="slip",
                            phrase=Phrase("rigid_share", {"u": u_rigid, "governs": gov})))  # fmt: skip
    return rows, checks, iters, TOLERANCE


def deflection_rows(member, section, st: State, checks, steps, log: StepLog):
    """Every deflection check of the member again with (EI)_ef,ser in place of the rigid EI."""
    from .slip import SlipDeflection

    EI = (section.E_ref * section.inertia).to("lbf*inch**2")
    k = log.add("k_defl", "Deflection factor with slip", "k = (EI) / (EI)_ef,ser", "{EI} / {EIef}",
                {"EI": EI, "EIef": st.EI_ser}, float((EI / st.EI_ser).to("").magnitude),
                source="mechanics of materials: Δ ∝ 1/EI for one EI along the member; (EI)_ef EN 1995-1-1:2004 "
                "Annex B, B.2")  # fmt: skip
    pre = f"member[{member.id}]."
    by_key = {s.key: s for s in steps}
    rows, out = [], []
    for c in checks:
        name = c.key[len(pre) :] if c.key.startswith(pre) else ""
        if c.ratio is None or not (name.startswith("deflection.") or name.startswith("shear_deflection.")):
            continue
        if name.startswith("shear_deflection."):
            st_ = next((s for key, s in by_key.items() if key.endswith(f".{name}.dt")), None)
            if st_ is None:
                continue
            d = log.add(f"{name}", f"{c.label}, with connector slip", "Δ = k·Δb + Δs", "{k} × {b} + {s}",
                        {"k": k, "b": st_.values["b"], "s": st_.values["s"]},
                        (k * st_.values["b"] + st_.values["s"]).to("inch"), source="mechanics of materials")  # fmt: skip
        else:
            d = log.add(f"{name}", f"{c.label}, with connector slip", "Δ = k·Δ", "{k} × {d}",
                        {"k": k, "d": c.demand}, (k * c.demand).to("inch"), source="mechanics of materials")  # fmt: skip
        r = float((d / c.capacity).to("").magnitude)
        out.append(replace(c, key=f"{pre}slip.{name}", label=f"{c.label}, with connector slip", demand=d, ratio=r,
                           status=_status(r), source=f"{c.source}; (EI)_ef {SRC}", scope="slip deflection"))  # fmt: skip
        rows.append(SlipDeflection(c.label, c.demand, d, c.capacity, "slip" if r > c.ratio else "rigid"))
    return rows, out
