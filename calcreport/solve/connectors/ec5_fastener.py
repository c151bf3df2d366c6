"""Laterally loaded nails, screws, bolts and dowels in timber-to-timber and panel-to-timber joints,
EN 1995-1-1:2004 §8 (``settings.method = "EC5"``): the route taken by ``type = "nail"``,
``"wood_screw"`` and ``"wood_bolt"`` when the job's method is EC5.

Characteristic capacity F_v,Rk per shear plane from the failure modes of §8.2.2 (eq. 8.6 single
shear, 8.7 double shear, :mod:`.ec5_johansen`), with the fastener yield moment and the embedment
strengths of §8.3 (nails), §8.5 (bolts, dowels) and §8.7 (screws: d_ef ≤ 6 mm by the rules for
nails, larger by those for bolts) from :mod:`.ec5_inputs`; design value F_v,Rd = k_mod·F_v,Rk/γ_M
(§2.4.3, eq. 2.17) with k_mod of Table 3.1 for the load-duration class the solver gives (that of the
shortest-duration load of the member's combinations; each combination is then checked with its own
k_mod) and γ_M of connections (Table 2.3, or the national value). Steel-to-timber joints (§8.2.3)
are refused. Detailing: spacing along the grain a1 from Tables 8.2 / 8.4 becomes the joint's
minimum spacing; end and edge distances are listed. The effective number of fasteners in a row
(n_ef, §8.3.1.1, §8.5.1.1) is not applied: each fastener carries the shear flow of its own spacing
along the member (a stated simplification).
"""

from __future__ import annotations

from ...model import ConnectorSpec
from ...steps import StepLog
from ...units import Q_
from ..results import Capacity, Check
from . import ConnectorError
from .ec5_inputs import EC5, MODE_TEXT, embedment, fastener, joint_k_mod, members, rho_k, thickness
from .ec5_johansen import (
    ROPE_LIMIT,
    SOURCE_MODES_DOUBLE,
    SOURCE_MODES_SINGLE,
    SOURCE_ROPE,
    double_shear_modes,
    single_shear_modes,
    yield_moment_bolt,
    yield_moment_nail,
)
from .shear_plane import opposite_faces

__all__ = ["design_ec5"]

_MM = "mm"


def design_ec5(spec: ConnectorSpec, ctx, log: StepLog, kind: str) -> Capacity:
    """Design value F_v,Rd of one nail, screw, bolt or dowel, EN 1995-1-1:2004 §8 (see module)."""
    from .ec5_detailing import detailing

    p = spec.params
    key = f"{ctx.key}.connector"
    planes = int(p.get("planes") or 1)
    c, m1, m2, why = members(p, ctx, key)
    for part in (m1, m2):
        if part.material.family not in ("wood", "glulam", "plywood"):
            raise ConnectorError(
                f"{key}.type",
                f"part {part.id} is {part.material.family}: EN 1995-1-1 §8.2.3 steel-to-timber (and other) "
                "joints are not implemented under EC5; only timber-to-timber and panel-to-timber",
            )
    if p.get("fu") is None:
        raise ConnectorError(
            f"{key}.fu",
            'expected fu, the tensile strength of the fastener (e.g. fu = "600 MPa"; EN 1995-1-1 gives no '
            "default): the yield moment M_y,Rk (eq. 8.14, 8.30) needs it",
        )
    d, L, desc, rule, dnote = fastener(kind, p, key)
    if rule == "bolt" and d > 30.0:
        raise ConnectorError(
            f"{key}.diameter",
            "expected a diameter up to 30 mm: the embedment strength of EN 1995-1-1 §8.5.1.1 (eq. 8.32) "
            "covers bolts up to 30 mm",
        )
    log.add(
        "d",
        "Diameter used in the failure modes",
        "d",
        "{d}",
        {"d": Q_(d, _MM)},
        Q_(d, _MM),
        source=f"{EC5} §8.3.1.1, §8.5.1.1, §8.7.1",
        note=dnote,
    )
    t_1 = thickness(
        log,
        "t_1s",
        "Thickness of member 1" if planes == 1 else "Thickness of each side member",
        p.get("side_thickness"),
        m1,
        c,
        why,
    )
    t_2 = thickness(
        log,
        "t_2m",
        "Thickness of member 2" if planes == 1 else "Thickness of the central member",
        p.get("main_thickness"),
        m2,
        c,
        why,
    )
    checks: list[Check] = []
    shank = p.get("nail_shank") or "round"
    if L is not None:
        if planes == 1:
            pen, tmpl = L - t_1, "{L} − {t1}"
        else:
            pen, tmpl = L - t_1 - t_2, "{L} − {t1} − {t2}"
        if pen <= 0:
            raise ConnectorError(
                f"{key}.length", "expected a fastener long enough to reach the member it must hold"
            )
        log.add(
            "t_pen",
            "Point-side penetration",
            "t_pen = L − t_1" if planes == 1 else "t_pen = L − t_1 − t_2",
            tmpl,
            {"L": Q_(L, _MM), "t1": Q_(t_1, _MM), "t2": Q_(t_2, _MM)},
            Q_(pen, _MM),
            source="geometry",
        )
        need = 8.0 if (kind == "nail" and shank == "round") else 6.0
        checks.append(
            Check(
                f"{key}.penetration",
                f"Point-side penetration at least {need:g}d",
                Q_(need * d, _MM),
                Q_(pen, _MM),
                need * d / pen,
                "OK" if pen >= need * d - 1e-9 else "NG",
                source=f"{EC5} §8.3.1.2",
                note="smooth nails 8d, other nails 6d"
                + (
                    "; screws of d_ef ≤ 6 mm follow the rules for nails (§8.7.1)"
                    if kind == "wood_screw"
                    else ""
                ),
            )
        )
        if planes == 1 and pen > t_2 + 1e-9:
            checks.append(
                Check(
                    f"{key}.point",
                    "Point beyond member 2",
                    Q_(pen - t_2, _MM),
                    None,
                    None,
                    "INFO",
                    source="geometry",
                    note="not checked: the point leaves member 2 and bears in no member of this joint; "
                    "confirm the parts beyond take it or that it does not protrude",
                )
            )
        far = opposite_faces(m2, c, tuple(getattr(ctx, "parts", ()))) if c is not None else []
        if planes == 1 and far:
            checks.append(
                Check(
                    f"{key}.overlap",
                    "Fasteners from opposite faces overlapping in member 2",
                    Q_(4 * d, _MM),
                    None,
                    None,
                    "INFO",
                    source=f"{EC5} §8.3.1.1",
                    note="not checked: part " + ", ".join(o.id for o, _ in far) + " lies on the far face of "
                    "member 2; fasteners driven from there may overlap only where t − t_2 > 4d",
                )
            )
        if planes == 1:
            t2 = min(pen, t_2)
            t1 = t_1
            log.add(
                "t_2",
                "Bearing length t_2 in member 2",
                "t_2 = min(t_pen, t_2m)",
                "min({p}, {t})",
                {"p": Q_(pen, _MM), "t": Q_(t_2, _MM)},
                Q_(t2, _MM),
                source=f"{EC5} §8.3.1.2",
                note="the point beyond member 2 bears in no member of this joint" if pen > t_2 + 1e-9 else "",
            )
        else:
            t1 = min(t_1, pen)
            t2 = t_2
            log.add(
                "t_1",
                "Bearing length t_1 (side members)",
                "t_1 = min(t_1s, t_pen)",
                "min({t}, {p})",
                {"t": Q_(t_1, _MM), "p": Q_(pen, _MM)},
                Q_(t1, _MM),
                source=f"{EC5} §8.3.1.2",
                note="the lesser of the head-side thickness and the point-side penetration",
            )
    else:
        t1, t2 = t_1, t_2
    predrilled = bool(p.get("predrilled"))
    # the joint's load angle (load passed across side-by-side plies: 90°) unless the job states one
    joint_angle = float(getattr(ctx, "load_angle", 0.0))
    a1 = p["angle_side"] if p.get("angle_side") is not None else joint_angle
    a2 = p["angle_main"] if p.get("angle_main") is not None else joint_angle
    fh1 = embedment(log, "1", m1, d, rule, predrilled, a1)
    fh2 = embedment(log, "2", m2, d, rule, predrilled, a2)
    fu = p["fu"].to("N/mm**2").magnitude
    if rule == "nail":
        square = kind == "nail" and shank == "square"
        My = yield_moment_nail(fu, d, square)
        sym = "M_y,Rk = 0.45·f_u·d^2.6" if square else "M_y,Rk = 0.3·f_u·d^2.6"
        msrc = f"{EC5} §8.3.1.1, eq. (8.14)" + ("; §8.7.1 for screws" if kind == "wood_screw" else "")
    else:
        My = yield_moment_bolt(fu, d)
        sym, msrc = (
            "M_y,Rk = 0.3·f_u,k·d^2.6",
            f"{EC5} §8.5.1.1, eq. (8.30)" + ("; §8.7.1 for screws" if kind == "wood_screw" else ""),
        )
    log.add(
        "My",
        "Fastener yield moment",
        sym,
        ("0.45" if sym.startswith("M_y,Rk = 0.45") else "0.3") + " × {fu} × {d}^2.6",
        {"fu": Q_(fu, "N/mm**2"), "d": Q_(d, _MM)},
        Q_(My, "N*mm"),
        source=msrc,
    )
    limit_key = {
        "nail": f"{shank}_nail",
        "wood_screw": "screw",
        "wood_bolt": "dowel" if p.get("dowel") else "bolt",
    }[kind]
    limit = ROPE_LIMIT[limit_key]
    fax = p["F_ax_Rk"].to("N").magnitude if p.get("F_ax_Rk") is not None else 0.0
    log.add(
        "rope",
        "Rope effect: largest F_ax,Rk/4 as a fraction of the Johansen part",
        "F_rope = min(F_ax,Rk/4, limit × Johansen part)",
        "limit for {what}, with F_ax,Rk = {fax}",
        {"fax": Q_(fax, "N"), "what": limit_key.replace("_", " ") + "s"},
        limit,
        source=SOURCE_ROPE,
        note=(
            "no F_ax,Rk given: the rope effect is not counted"
            if fax == 0
            else "F_ax,Rk as given in the job file"
        ),
    )
    beta = log.add(
        "beta",
        "Ratio of embedment strengths",
        "β = f_h,2,k / f_h,1,k",
        "{f2} / {f1}",
        {"f2": Q_(fh2, "N/mm**2"), "f1": Q_(fh1, "N/mm**2")},
        fh2 / fh1,
        source=f"{EC5} §8.2.2, eq. (8.8)",
    )
    del beta
    if planes == 1:
        modes, src = single_shear_modes(fh1, fh2, t1, t2, d, My, fax, limit), SOURCE_MODES_SINGLE
    else:
        modes, src = double_shear_modes(fh1, fh2, t1, t2, d, My, fax, limit), SOURCE_MODES_DOUBLE
    gov = min(modes, key=lambda m: m.F)
    vals = {
        "fh1": Q_(fh1, "N/mm**2"),
        "fh2": Q_(fh2, "N/mm**2"),
        "t1": Q_(t1, _MM),
        "t2": Q_(t2, _MM),
        "d": Q_(d, _MM),
        "b": fh2 / fh1,
        "r": t2 / t1,
        "My": Q_(My, "N*mm"),
    }
    for m in modes:
        sym, tmpl = MODE_TEXT[m.mode]
        rope = m.mode not in ("a", "b", "g", "h")
        log.table("yield", m.mode, "F").add(  # one row of table "yield" per failure mode
            f"mode.{m.mode}",
            f"Failure mode ({m.mode})" + (" with the rope effect" if rope and m.rope else ""),
            f"F_{m.mode} = {sym}" + (" + F_rope" if rope else ""),
            tmpl + (" + {rope}" if rope else ""),
            {**vals, "rope": Q_(m.rope, "N")},
            Q_(m.F, "N"),
            source=f"{src} ({m.mode})",
            governs=m is gov,
            note="F_rope = min(F_ax,Rk/4, limit × Johansen part)" if rope and m.rope else "",
        )
    Fk = log.add(
        "FvRk",
        "Characteristic load-carrying capacity per shear plane",
        "F_v,Rk = min(modes)",
        "{F}",
        {"F": Q_(gov.F, "N")},
        Q_(gov.F, "N"),
        source=src,
        note=f"mode ({gov.mode}) governs",
    ).magnitude
    if planes == 2:
        Fk = log.add(
            "FvRk2",
            "Characteristic capacity of the fastener, two shear planes",
            "F_v,Rk,2 = 2·F_v,Rk",
            "2 × {F}",
            {"F": Q_(gov.F, "N")},
            Q_(2 * gov.F, "N"),
            source=f"{EC5} §8.1.3",
        ).magnitude
    km = joint_k_mod(log, ctx, (m1, m2), key)
    gm_given = ctx.settings.gamma_M_connections
    gm = log.add(
        "gM",
        "Partial factor for connections",
        "γ_M",
        "{g}",
        {"g": gm_given or 1.3},
        float(gm_given or 1.3),
        source="national value stated in the job file" if gm_given else f"{EC5} §2.4.1, Table 2.3",
    )
    Fd = log.add(
        "FvRd",
        "Design load-carrying capacity of one fastener",
        "F_v,Rd = k_mod·F_v,Rk / γ_M",
        "{k} × {F} / {g}",
        {"k": km, "F": Q_(Fk, "N"), "g": gm},
        Q_(km * Fk / gm, "N"),
        source=f"{EC5} §2.4.3, eq. (2.17)",
        governs=True,
    )
    smin, lsrc = detailing(
        checks,
        key,
        kind,
        rule,
        d,
        predrilled,
        (m1, m2),
        (t_1, t_2),
        c,
        getattr(ctx, "per_row", 1),
        rho_k,
        log=log.child("detail"),
    )
    return Capacity(
        value=Fd,
        continuous=False,
        description=desc,
        source=f"{EC5} §8.2.2 failure modes, §2.4.3 design value",
        checks=tuple(checks),
        spacing_min=smin,
        spacing_max=None,
        limits_source=lsrc,
        duration_factor=km,
    )
