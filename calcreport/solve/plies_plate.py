"""The flitch plate of a member of plies (issue 14): flexure of a rectangular bar, AISC 360-16
F11 (yielding F11-1, lateral-torsional buckling F11-2 to F11-4 with Lb = the largest bolt spacing:
the timbers brace the plate at each bolt — an assumption recorded with the member) and shear,
G2.1 (Cv1 by G2-3/G2-4, kv = 5.34; Ωv = 1.67, φv = 0.90 per G1), under the plate's share by E·I.
"""

from __future__ import annotations

import math

from ..steps import Phrase
from ..units import Q_
from .plies import PlyShare
from .results import Check, Unchecked

__all__ = ["plate_flexure", "steel_ply_checks"]

AISC = "AISC 360-16"


def _status(r: float) -> str:
    return "OK" if r <= 1 + 1e-9 else "NG"


def plate_flexure(Fy: float, E: float, d: float, t: float, Lb: float, Cb: float) -> tuple[float, str, float]:
    """Nominal flexural strength Mn (lbf·in) of a rectangular bar bent about its major axis,
    AISC 360-16 F11: Mp = Fy·Z ≤ 1.6·Fy·Sx (F11-1) when Lb·d/t² ≤ 0.08E/Fy; F11-2 up to 1.9E/Fy;
    Fcr·Sx with Fcr = 1.9E·Cb/(Lb·d/t²) beyond (F11-3, F11-4). Returns (Mn, equation, Lb·d/t²).

    Examples (1/2 × 11 in A36 plate; Lb = 1 in: F11-1; Lb = 16 in: F11-2, hand calculation
    (1.52 − 0.274·704·36/29000)·36000·0.5·11²/6 = 464,837 lbf·in):
        >>> [round(v, 1) if isinstance(v, float) else v for v in plate_flexure(36000, 29e6, 11, 0.5, 1, 1.0)]
        [544500.0, 'F11-1', 44.0]
        >>> [round(v, 1) if isinstance(v, float) else v for v in plate_flexure(36000, 29e6, 11, 0.5, 16, 1.0)]
        [464837.1, 'F11-2', 704.0]
    """
    Z, S = t * d * d / 4, t * d * d / 6
    My, Mp = Fy * S, min(Fy * Z, 1.6 * Fy * S)
    lam = Lb * d / t**2
    if lam <= 0.08 * E / Fy:
        return Mp, "F11-1", lam
    if lam <= 1.9 * E / Fy:
        return min(Mp, Cb * (1.52 - 0.274 * lam * Fy / E) * My), "F11-2", lam
    return min(Mp, 1.9 * E * Cb / lam * S), "F11-3", lam


def steel_ply_checks(
    member, sh: PlyShare, part, extremes, settings, log, Lb: float, key: str
) -> tuple[list[Check], list[Unchecked]]:
    """F11 flexure and G2.1 shear of a steel ply under its share (see the module docstring)."""
    checks: list[Check] = []
    out: list[Unchecked] = []
    mat = part.material
    pid = sh.id
    if mat.Fy is None:
        out.append(
            Unchecked(
                f"{key}.plate_flexure.{pid}",
                f"flexure of the flitch plate, ply {pid}",
                f"{AISC} F11",
                f"no Fy given for material {mat.id}",
            )
        )
        return checks, out
    Fy, E = float(mat.Fy.to("psi").magnitude), float(mat.E.to("psi").magnitude)
    d, t = sh.depth, sh.width
    Cb = float(member.design.get("Cb", 1.0))
    lrfd = settings.method == "LRFD"
    slog = log.child(f"plate.{pid}")
    Mv = max(float(abs(M).max()) for _n, _c, _V, M in extremes)
    Vv = max(float(abs(V).max()) for _n, _c, V, _M in extremes)
    Mi = slog.add("M", f"Moment carried by the plate {pid}", "M_p = share·M", "{s} × {M}", {"s": round(sh.share, 4), "M": Q_(Mv, "lbf*inch")},
                  Q_(sh.share * Mv, "lbf*inch"), source="mechanics of materials (share by E·I)")  # fmt: skip
    Mn, eq, lam = plate_flexure(Fy, E, d, t, Lb, Cb)
    slog.add("slender", f"Slenderness of the plate {pid} for lateral-torsional buckling", "Lb·d / t²", "{Lb} × {d} / {t}²",
             {"Lb": Q_(Lb, "inch"), "d": Q_(d, "inch"), "t": Q_(t, "inch")}, round(lam, 1), source=f"{AISC} F11.2",
             note="Lb = the largest bolt spacing (braced by the timbers at each bolt)",
             phrase=Phrase("plate_slenderness", {"lo": 0.08 * E / Fy, "hi": 1.9 * E / Fy}))  # fmt: skip
    tpl = {"F11-1": "Mp = Fy·Z = {Fy} × {Z}", "F11-2": "Cb·[1.52 − 0.274·(Lb·d/t²)·Fy/E]·Fy·Sx ≤ Mp, Cb = {Cb}, Sx = {S}",
           "F11-3": "Fcr·Sx, Fcr = 1.9·E·Cb/(Lb·d/t²), Cb = {Cb}, Sx = {S}"}[eq]  # fmt: skip
    Mn_q = slog.add("Mn", f"Nominal flexural strength of the plate {pid}", f"Mn ({eq})", tpl,
                    {"Fy": mat.Fy, "Z": Q_(t * d * d / 4, "inch**3"), "S": Q_(t * d * d / 6, "inch**3"), "Cb": Cb},
                    Q_(Mn, "lbf*inch"), source=f"{AISC} F11.1, F11.2, Eq. {eq}")  # fmt: skip
    Mc = slog.add("Mc", f"Available flexural strength of the plate {pid}", "φb·Mn" if lrfd else "Mn / Ωb", "{Mn} × 0.90" if lrfd else "{Mn} / 1.67",
                  {"Mn": Mn_q}, (Mn_q * 0.9 if lrfd else Mn_q / 1.67).to("lbf*inch"), source=f"{AISC} F1")  # fmt: skip
    r = float((Mi / Mc).to("").magnitude)
    checks.append(
        Check(
            f"{key}.plate_flexure.{pid}",
            f"Flexure of the flitch plate, ply {pid} (F11)",
            Mi,
            Mc,
            r,
            _status(r),
            f"{AISC} F11",
            scope="stability",
        )
    )
    Vi = slog.add("V", f"Shear carried by the plate {pid}", "V_p = share·V", "{s} × {V}", {"s": round(sh.share, 4), "V": Q_(Vv, "lbf")},
                  Q_(sh.share * Vv, "lbf"), source="mechanics of materials (share by E·I)")  # fmt: skip
    h_t, lim = d / t, 1.10 * math.sqrt(5.34 * E / Fy)
    Cv1 = 1.0 if h_t <= lim else lim / h_t
    slog.add("Cv1", f"Web shear strength coefficient of the plate {pid}", "Cv1 (h/t vs 1.10·√(kv·E/Fy), kv = 5.34)", "h/t = {ht}, limit {lim}",
             {"ht": round(h_t, 2), "lim": round(lim, 2)}, round(Cv1, 4), source=f"{AISC} G2.1(b), Eq. G2-3 / G2-4")  # fmt: skip
    Vn = Q_(0.6 * Fy * d * t * Cv1, "lbf")
    Vc = slog.add("Vc", f"Available shear strength of the plate {pid}", "0.6·Fy·Aw·Cv1 " + ("× φv (0.90)" if lrfd else "/ Ωv (1.67)"),
                  "0.6 × {Fy} × {Aw} × {Cv1}", {"Fy": mat.Fy, "Aw": Q_(d * t, "inch**2"), "Cv1": round(Cv1, 4)},
                  (Vn * 0.9 if lrfd else Vn / 1.67).to("lbf"), source=f"{AISC} G2.1, Eq. G2-1; G1")  # fmt: skip
    r = float((Vi / Vc).to("").magnitude)
    checks.append(
        Check(
            f"{key}.shear.{pid}",
            f"Shear of the flitch plate, ply {pid} (G2.1)",
            Vi,
            Vc,
            r,
            _status(r),
            f"{AISC} G2.1",
        )
    )
    return checks, out
