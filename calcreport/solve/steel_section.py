"""The I-section of a welded plate girder, found from its placed plates, and its properties.

A member is taken as a welded I-shaped girder when all its parts are steel rectangles: one web
standing on edge (taller than wide) and one flange plate above and one below it, each flange
wider than the web (AISC 360-16 Chapter F: doubly or singly symmetric I-shaped members bent about
their major axis). Anything else (cover plates, several plates per flange, rolled shapes) is not
this section and its girder checks are listed as not checked.

Properties are found in plain floats (inches) from the plate sizes — mechanics of materials for
A, ȳ, I, S, Z; AISC 360-16 for the defined quantities (h, hc, hp, ho, rt, rts, J, Cw).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from ..model import Member, Part
from ..outlines import is_rectangle

__all__ = ["Plate", "IGirder", "find_girder", "girder_properties", "GirderProps", "rolled_properties"]


@dataclass(frozen=True)
class Plate:
    part: Part
    b: float  # horizontal width, in
    t: float  # vertical thickness (flanges) or horizontal thickness (web), in
    y0: float  # bottom, in
    y1: float  # top, in


@dataclass(frozen=True)
class IGirder:
    top: Plate
    web: Plate  # b = web thickness tw, y1 − y0 = h
    bottom: Plate
    Fy: float  # ksi (least of the plates)
    E: float  # ksi


def _plate(p: Part) -> Plate:
    x0, y0, x1, y1 = p.shape.bbox
    return Plate(p, x1 - x0, y1 - y0, y0, y1)


def find_girder(member: Member) -> tuple[IGirder | None, str]:
    """The welded I-section of ``member``, or None with the reason it is not one."""
    parts = member.parts
    if any(p.material.family != "steel" for p in parts):
        return None, "not every part is steel"
    if len(parts) != 3 or not all(p.shape.kind == "polygon" and is_rectangle(p.shape) for p in parts):
        return None, "the section is not three rectangular plates (one web, one flange plate each side)"
    plates = sorted((_plate(p) for p in parts), key=lambda q: q.y0)
    bot, web, top = plates
    tol = 1e-6
    if not (web.y1 - web.y0 > web.b and abs(bot.y1 - web.y0) < tol and abs(web.y1 - top.y0) < tol):
        return None, "the plates are not a web on edge between a bottom and a top flange"
    for f in (bot, top):
        x0, _, x1, _ = f.part.shape.bbox
        wx0, _, wx1, _ = web.part.shape.bbox
        if not (x0 - tol <= wx0 and wx1 <= x1 + tol) or f.b <= web.b:
            return None, "a flange plate does not overhang the web on both sides"
    fys = [p.material.Fy for p in parts]
    if any(f is None for f in fys):
        return None, "a plate's material has no Fy"
    Fy = min(float(f.to("ksi").magnitude) for f in fys if f is not None)
    E = min(float(p.material.E.to("ksi").magnitude) for p in parts)
    web_t = Plate(web.part, web.b, web.b, web.y0, web.y1)
    return IGirder(top, web_t, bot, Fy, E), ""


@dataclass(frozen=True)
class GirderProps:
    """Section properties of an I-girder for one sense of bending (which flange is in compression)."""

    compression: str  # "top" or "bottom"
    d: float
    h: float  # clear web depth between flanges (welded: the web plate)
    tw: float
    bfc: float
    tfc: float
    bft: float
    tft: float
    A: float
    ybar: float  # elastic NA above the bottom
    Ix: float
    Sxc: float
    Sxt: float
    Zx: float
    ypna: float  # plastic NA above the bottom
    hc: float
    hp: float
    ho: float
    Iy: float
    Iyc: float
    J: float
    Cw: float
    rt: float
    rts: float
    aw: float
    symmetric: bool


def girder_properties(g: IGirder, compression: str) -> GirderProps:
    """Properties for bending with the ``compression`` flange ("top" or "bottom") in compression.

    A, ȳ, Ix, S, Z: mechanics of materials. h, hc, hp: AISC 360-16 §B4.1b (welded: clear distance
    between flanges; hc = 2 × NA to the inside face of the compression flange; hp the same from the
    plastic NA). ho = distance between flange centroids (F2.2). Iy, Iyc: plates about the web axis.
    J ≈ Σ b·t³/3 and Cw = Iyc·Iyt·ho²/Iy (doubly symmetric: Iy·ho²/4) — AISC 360-16 Commentary
    F2 and User Note F4.2 (thin-walled open section). rt: AISC 360-16 Eq. F4-11. rts: Eq. F2-7.
    """
    top, web, bot = g.top, g.web, g.bottom
    tw, h = web.b, web.y1 - web.y0
    d = top.y1 - bot.y0
    y_base = bot.y0
    rows = [
        (bot.b * bot.t, (bot.y0 + bot.y1) / 2 - y_base, bot.b * bot.t**3 / 12),
        (tw * h, (web.y0 + web.y1) / 2 - y_base, tw * h**3 / 12),
        (top.b * top.t, (top.y0 + top.y1) / 2 - y_base, top.b * top.t**3 / 12),
    ]
    A = sum(r[0] for r in rows)
    ybar = sum(r[0] * r[1] for r in rows) / A
    Ix = sum(r[2] + r[0] * (r[1] - ybar) ** 2 for r in rows)
    # plastic NA: equal areas above and below
    half = A / 2
    bf_area = bot.b * bot.t
    if half <= bf_area:
        ypna = half / bot.b
    elif half <= bf_area + tw * h:
        ypna = bot.t + (half - bf_area) / tw
    else:
        ypna = d - half / top.b
    Zx = _first_moment_abs(rows_geom=(bot, web, top), y_base=y_base, y=ypna)
    if compression == "top":
        fc, ft = top, bot
        dist_c = (top.y0 - y_base) - ybar  # NA to the inside face of the compression flange
        dist_pc = (top.y0 - y_base) - ypna
        c_c, c_t = d - ybar, ybar
    else:
        fc, ft = bot, top
        dist_c = ybar - (bot.y1 - y_base)
        dist_pc = ypna - (bot.y1 - y_base)
        c_c, c_t = ybar, d - ybar
    Iyc = fc.t * fc.b**3 / 12
    Iyt = ft.t * ft.b**3 / 12
    Iy = Iyc + Iyt + h * tw**3 / 12
    ho = d - top.t / 2 - bot.t / 2
    J = (top.b * top.t**3 + bot.b * bot.t**3 + h * tw**3) / 3
    Cw = Iyc * Iyt * ho**2 / (Iyc + Iyt)
    hc = max(2 * dist_c, 0.0)
    hp = max(2 * dist_pc, 1e-9)
    aw = hc * tw / (fc.b * fc.t)
    rt = fc.b / math.sqrt(12 * (1 + aw / 6))
    Sxc, Sxt = Ix / c_c, Ix / c_t
    symmetric = abs(top.b - bot.b) < 1e-6 and abs(top.t - bot.t) < 1e-6
    Sx = min(Sxc, Sxt)
    rts = math.sqrt(math.sqrt(Iy * Cw) / Sx)
    return GirderProps(
        compression, d, h, tw, fc.b, fc.t, ft.b, ft.t, A, ybar, Ix, Sxc, Sxt, Zx, ypna, hc, hp, ho,
        Iy, Iyc, J, Cw, rt, rts, aw, symmetric,
    )  # fmt: skip


def _first_moment_abs(rows_geom, y_base: float, y: float) -> float:
    """Σ |A_i·(y_i − y)| of the plates split at the line y: the plastic section modulus Z about the
    plastic neutral axis (mechanics of materials)."""
    z = 0.0
    for p in rows_geom:
        lo, hi = p.y0 - y_base, p.y1 - y_base
        b = p.b
        if hi <= y:
            z += b * (hi - lo) * (y - (lo + hi) / 2)
        elif lo >= y:
            z += b * (hi - lo) * ((lo + hi) / 2 - y)
        else:
            z += b * (y - lo) ** 2 / 2 + b * (hi - y) ** 2 / 2
    return z


def rolled_properties(row) -> GirderProps:
    """Properties of a doubly symmetric rolled I-shape from its database row (AISC Shapes Database
    v16.0): h = d − 2·k (the clear web depth less the fillets, AISC 360-16 §B4.1b(b)),
    ho = d − tf, rts = √(√(Iy·Cw)/Sx) (Eq. F2-7), rt by Eq. F4-11."""
    h = row.d - 2 * row.k
    aw = h * row.tw / (row.bf * row.tf)
    return GirderProps(
        "top", row.d, h, row.tw, row.bf, row.tf, row.bf, row.tf, row.area, row.d / 2, row.Ix, row.Sx, row.Sx,
        row.Zx, row.d / 2, h, h, row.d - row.tf, row.Iy, row.Iy / 2, row.J, row.Cw,
        row.bf / math.sqrt(12 * (1 + aw / 6)), math.sqrt(math.sqrt(row.Iy * row.Cw) / row.Sx), aw, True,
    )  # fmt: skip
