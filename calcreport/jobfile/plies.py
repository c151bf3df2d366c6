"""Members of plies set side by side and flitch beams (``[[member.ply]]``, ``[member.ply_fastening]``,
the ``enters`` / ``ply`` / ``transfer_length`` keys of ``[[member.load]]``) — see docs/job-format.md,
"Plies side by side".

Plies are placed left to right in the order listed, flush at the bottom (or at the top with
``align = "top"``); each becomes a part of the section so that the drawing, self-weight and the
section properties work unchanged. Ambiguous or inconsistent input is refused with one line.
"""

from __future__ import annotations

from ..errors import excerpt
from ..keys import connectors
from ..keys import job as decl
from ..model import ConnectorSpec, Material, Member, Part, Ply, PlyFastening, Shape
from .lumber import LumberSizeError, dressed_size
from .reader import Table
from .unused import connector_keys

__all__ = [
    "read_plies",
    "read_ply_fastening",
    "check_ply_loads",
    "unused_ply_keys",
    "PLY_CONNECTORS",
    "MAX_PLIES",
]

#: Most plies in one member: fasteners driven from the faces reach the two interfaces of three
#: plies; through-fastened assemblies of more plies are not designed by this version.
MAX_PLIES = 3
#: Connector models that can join plies (dowel fasteners of NDS 2018 Chapter 12, or a stated value).
PLY_CONNECTORS = ("nail", "wood_screw", "lag_screw", "wood_bolt", "given")
_IN = "inch"


def _box(w: float, h: float, description: str, nominal: str = "") -> Shape:
    verts = ((0.0, 0.0), (w, 0.0), (w, h), (0.0, h))
    return Shape("polygon", (0.0, 0.0, w, h), vertices=verts, description=description, nominal=nominal)


def _length(t: Table, name: str) -> float:
    q = t.quantity(name, "length", required=True)
    return float(q.to(_IN).magnitude)


def _ply_shape(t: Table, mat: Material) -> Shape:
    """One ply's outline from exactly one of: size (dressed lumber), width + depth, thickness + depth."""
    given = [k for k in ("size", "width", "thickness") if t.has(k)]
    if len(given) != 1:
        raise t.error(
            given[1] if len(given) > 1 else None,
            'expected exactly one of size (dressed lumber, e.g. "2x12"), width with depth '
            "(LVL, glulam) or thickness with depth (steel plate)",
        )
    if given == ["size"]:
        if t.has("depth"):
            raise t.error(
                "depth", "depth has no effect with size (dressed lumber sizes are fixed); remove it"
            )
        size = t.text("size", required=True)
        try:
            thick, w = dressed_size(size)
        except LumberSizeError as exc:
            raise t.error("size", str(exc)) from None
        nominal = size.strip().lower().replace(" ", "")
        return _box(thick, w, f"{nominal} lumber, on edge", nominal)
    if given == ["thickness"] and mat.family != "steel":
        raise t.error(
            "thickness",
            f"thickness is for a steel flitch plate; material {mat.id!r} is {mat.family} "
            "(give width and depth for LVL or glulam)",
        )
    if given == ["width"] and mat.family == "steel":
        raise t.error("width", "a steel flitch plate is given by thickness and depth")
    across = _length(t, given[0])
    depth = _length(t, "depth")
    if across > depth:
        raise t.error(given[0], "expected a ply on edge: its width across the member at most its depth")
    what = "plate" if given == ["thickness"] else "rectangle"
    return _box(across, depth, f"{what}, on edge")


def read_plies(t: Table, ply_tables: list[Table], materials: dict[str, Material]) -> tuple[Ply, ...]:
    """Read the ``[[member.ply]]`` tables and place the plies side by side, left to right."""
    if len(ply_tables) < 2 or len(ply_tables) > MAX_PLIES:
        raise t.error(
            "ply",
            f"expected 2 to {MAX_PLIES} plies side by side, got {len(ply_tables)}"
            + (" (a single piece is a [[member.part]])" if len(ply_tables) < 2 else ""),
        )
    read: list[tuple[Table, str, Shape, Material, str, str]] = []
    for pt in ply_tables:
        pt.expect(decl.names(decl.PLY))
        pid = pt.ident("id")
        if any(r[1] == pid for r in read):
            raise pt.error("id", f"duplicate ply id {pid!r}")
        mat_id = pt.text("material", required=True)
        if mat_id not in materials:
            raise pt.error(
                "material", f"expected a material id ({', '.join(materials)}), got {excerpt(mat_id)}"
            )
        mat = materials[mat_id]
        if mat.family not in ("wood", "glulam", "steel"):
            raise pt.error(
                "material", f"expected a wood, glulam or steel ply; material {mat_id!r} is {mat.family}"
            )
        shape = _ply_shape(pt, mat)
        align = pt.choice("align", ("bottom", "top"), "bottom")
        read.append((pt, pid, shape, mat, align, pt.text("label")))
    if not any(r[3].family in ("wood", "glulam") for r in read):
        raise t.error("ply", "expected at least one wood or glulam ply (steel alone is a steel member)")
    top = max(r[2].bbox[3] for r in read)
    x = 0.0
    out = []
    for pt, pid, s, mat, align, label in read:
        w, h = s.bbox[2], s.bbox[3]
        y = 0.0 if align == "bottom" else top - h
        verts = tuple((vx + x, vy + y) for vx, vy in s.vertices)
        placed = Shape(
            "polygon", (x, y, x + w, y + h), vertices=verts, description=s.description, nominal=s.nominal
        )
        out.append(Ply(pid, Part(pid, placed, mat, label), pt.label))
        x += w
        pt.done()
    return tuple(out)


def read_ply_fastening(t: Table, plies: tuple[Ply, ...], method: str) -> PlyFastening:
    """Read ``[member.ply_fastening]`` (required with plies)."""
    ft = t.table("ply_fastening")
    if ft is None:
        raise t.error(None, "missing required key 'ply_fastening' (the fasteners that join the plies)")
    ft.expect(decl.names(decl.PLY_FASTENING))
    ct = ft.table("connector", required=True)
    kind = ct.choice("type", PLY_CONNECTORS, required=True)
    params = ct.fields(connectors.fields_for(kind))
    given = tuple(k for k in ct.data if k != "type")
    ct.done()
    connector_keys(ct, kind, params, method)
    through = ft.boolean("through", False)
    n = len(plies)
    if ct.has("planes"):
        raise ct.error("planes", "planes follows from the plies and through (remove it)")
    if ft.has("face") and (n != 2 or through):
        raise ft.error(
            "face", "face has no effect here: it names the nailing face of two plies fastened from one face"
        )
    if not through and kind == "wood_bolt":
        raise ft.error("through", "bolts pass through every ply: set through = true")
    staggered = ft.boolean("staggered", False)
    if ft.has("staggered") and (n == 2 or through):
        ft.warn("staggered", "staggered has no effect here: no fasteners are driven from opposite faces")
    fast = PlyFastening(
        connector=ConnectorSpec(kind, params, ct.label, given),
        rows=int(ft.integer("rows", None, 1, 12, required=True) or 1),
        through=through,
        face=ft.choice("face", ("left", "right"), "left"),
        staggered=staggered,
        spacing_max=ft.quantity("spacing_max", "length"),
        spacing_min=ft.quantity("spacing_min", "length"),
        key=ft.label,
    )
    if fast.spacing_max is not None and fast.spacing_min is not None and fast.spacing_min > fast.spacing_max:
        raise ft.error("spacing_min", "expected spacing_min at most spacing_max")
    ft.done()
    return fast


def check_ply_loads(t: Table, member: Member) -> None:
    """Every load of a member of plies says where it enters; no other member uses those keys."""
    tables = t.tables("load")
    ids = [p.id for p in member.plies]
    if not member.plies:
        for lt in tables:
            for name in ("enters", "ply", "transfer_length"):
                if lt.has(name):
                    raise lt.error(name, f"{name} is for members described by [[member.ply]]; remove it")
        if t.has("ply_fastening"):
            raise t.error("ply_fastening", "ply_fastening needs plies: describe the member by [[member.ply]]")
        return
    if not member.loads:
        raise t.error(
            "shear" if t.has("shear") else "span",
            "a member of plies needs span and [[member.load]] tables: its fasteners carry the loads "
            "that enter one ply across to the others (a design shear alone gives them no demand)",
        )
    for lt, ld in zip(tables, member.loads):
        if not ld.enters:
            raise lt.error(
                "enters",
                "missing required key 'enters' on a member of plies: \"top\" (bears on the plies), "
                '"left_face" / "right_face" (hung from an outer ply) or "ply" (with ply = id)',
            )
        if ld.moving:
            raise lt.error("moving", "moving loads on members of plies are not designed by this version")
        if (ld.enters == "ply") != bool(ld.ply):
            raise lt.error(
                "ply" if ld.ply else "enters",
                'ply names the ply a load enters and goes with enters = "ply"'
                if ld.ply
                else 'enters = "ply" needs ply = the id of the ply the load enters',
            )
        if ld.ply and ld.ply not in ids:
            raise lt.error("ply", f"expected a ply id ({', '.join(ids)}), got {excerpt(ld.ply)}")
        if ld.transfer_length is not None and ld.kind != "point":
            raise lt.error(
                "transfer_length",
                "transfer_length is for point loads (a distributed load passes on where it acts)",
            )


def unused_ply_keys(root: Table, members: list[Member]) -> None:
    """Warn for ``Fc_perp`` on a material that no ply bearing check reads (a key without effect)."""
    used = {
        p.part.material.id
        for m in members
        if m.plies and m.design.get("bearing_length") is not None
        for p in m.plies
    }
    for mt in root.tables("material"):
        if mt.has("Fc_perp") and mt.data.get("id") not in used:
            mt.warn(
                "Fc_perp",
                "Fc_perp is read only for the bearing of plies ([[member.ply]] with bearing_length "
                "in [member.design]); no such ply uses this material",
            )
