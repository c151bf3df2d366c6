"""Read a TOML job file into a validated :class:`calcreport.model.Job`.

Every problem raises :class:`calcreport.errors.JobError` naming the file, the key path, the line
where known, and what was expected.
"""

from __future__ import annotations

import hashlib
import tomllib
from dataclasses import replace

from ..errors import JobError, excerpt
from ..keys import connectors
from ..keys import job as decl
from ..model import ConnectorSpec, Job, Joint, Material, Member, Part, Settings
from ..outlines import contact_segments, isolated_parts, overlapping_pairs
from .design import read_design
from .ec5_keys import (
    ec5_connector_keys,
    ec5_member_keys,
    slip_ec5,
    unused_ec5_settings,
)
from .job_tables import MAX_HISTORY, MAX_MATERIALS, read_header, read_materials, read_settings
from .lines import LineIndex
from .parts import read_part
from .reader import Source, Table
from .unused import connector_keys, is_continuous, unused_settings

__all__ = [
    "load_job",
    "load_text",
    "MAX_FILE_BYTES",
    "MAX_MEMBERS",
    "MAX_PARTS",
    "MAX_JOINTS",
    "MAX_MATERIALS",
    "MAX_HISTORY",
]

MAX_FILE_BYTES = 2_000_000
MAX_MEMBERS = 500
MAX_PARTS = 60
MAX_JOINTS = 60


def load_job(path: str) -> Job:
    """Read and validate the job file at ``path`` (a regular file of at most MAX_FILE_BYTES)."""
    from ..safeio import read_input

    data = read_input(path, MAX_FILE_BYTES, "a job file")
    return load_text(data, path)


def load_text(data: bytes, path: str = "<job>") -> Job:
    """Validate job-file bytes; ``path`` is used in messages only."""
    try:
        text = data.decode("utf-8")
    except UnicodeDecodeError as exc:
        raise JobError(path, "", f"expected UTF-8 text (bad byte at offset {exc.start})") from None
    try:
        doc = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        msg = str(exc)
        line = None
        if "(at line" in msg:
            try:
                line = int(msg.split("(at line", 1)[1].split(",")[0])
            except ValueError:
                line = None
            msg = msg.split(" (at line")[0]
        raise JobError(path, "", f"TOML syntax error: {msg}", line) from None
    except RecursionError:  # tomllib recurses once per level of [ or { nesting
        raise JobError(
            path,
            "",
            "TOML nested too deeply (arrays or inline tables inside each other hundreds of levels deep)",
        ) from None
    src = Source(path, LineIndex(text))
    root = Table(doc, src, (), "")
    root.expect(decl.names(decl.ROOT))
    header = read_header(root.table("job", required=True))
    settings_table = root.table("settings") or Table({}, src, ("settings",), "settings")
    settings = read_settings(settings_table)
    materials = read_materials(root, settings.method)
    member_tables = root.id_tables("member", MAX_MEMBERS, "member")
    if not member_tables:
        raise root.error(None, "missing required key 'member' (at least one [[member]])")
    members = [_member(mt, materials, settings) for mt, _ in member_tables]
    if settings.zones_per_span is not None and not any(_several_segments(m) for m in members):
        raise settings_table.error(
            "zones_per_span",
            "has no effect: no member has loads along it with more than one span or overhang "
            "(zones_per_half sets the zones of a simple span)",
        )
    root.done()
    unused_settings(settings_table, settings, members)
    unused_ec5_settings(settings_table, settings, members)
    from .plies import unused_ply_keys

    unused_ply_keys(root, members)
    if not any(m.design.get("slip") for m in members):  # rho_mean is read by the γ-method only
        for mt, _ in root.id_tables("material", MAX_MATERIALS, "material"):
            if mt.has("rho_mean"):
                mt.warn("rho_mean", "has no effect: no member asks for slip ([member.design] slip = true)")
    return Job(
        path,
        hashlib.sha256(data).hexdigest(),
        header,
        settings,
        tuple(materials.values()),
        tuple(members),
        written=tuple(src.written),
        warnings=tuple(src.warnings),
    )


def _several_segments(m: Member) -> bool:
    """True when the member's loads along it run over more than one span or overhang (the
    schedule is then zoned span by span, under zones_per_span)."""
    if not m.loads or m.span is None:
        return False
    span = m.span.to("inch").magnitude
    xs = sorted({round(s.x.to("inch").magnitude, 9) for s in m.supports}) or [0.0, span]
    if len(xs) == 1 and any(s.kind == "fixed" for s in m.supports):
        return False  # a cantilever: one segment
    tol = 1e-9 * max(span, 1.0)
    return (xs[0] > tol) + (len(xs) - 1) + (xs[-1] < span - tol) > 1


def _member(t: Table, materials: dict[str, Material], settings: Settings) -> Member:
    t.expect(decl.names(decl.MEMBER))
    mid = t.ident("id")
    part_tables = t.tables("part")
    ply_tables = t.tables("ply")
    plies: tuple = ()
    if ply_tables:
        from .plies import read_plies

        if part_tables:
            raise t.error("part", "a member is described by [[member.part]] or by [[member.ply]], not both")
        if t.has("joint"):
            raise t.error(
                "joint", "plies are joined by [member.ply_fastening], not [[member.joint]]; remove the joint"
            )
        plies = read_plies(t, ply_tables, materials)
        if plies and settings.method == "EC5":
            raise t.error(
                "ply",
                'members of plies are designed by NDS 2018 (settings.method = "ASD" or "LRFD"); '
                "the EN 1995-1-1 route does not cover them yet",
            )
        part_tables = []
    elif not part_tables:
        raise t.error(None, "missing required key 'part' (at least one [[member.part]])")
    if len(part_tables) > MAX_PARTS:
        raise t.error("part", f"expected at most {MAX_PARTS} parts, got {len(part_tables)}")
    placed: dict[str, Part] = {p.id: p.part for p in plies}
    for pt in part_tables:
        p = read_part(pt, materials, placed)
        placed[p.id] = p
    parts = tuple(placed.values())
    for a, b, area in overlapping_pairs(parts):
        i = list(placed).index(b)
        raise part_tables[i].error(
            None, f"part {b!r} overlaps part {a!r} by {area:.4g} in²; parts must only touch"
        )
    for pid in isolated_parts(parts)[-1:]:  # the last one listed is the likely misplaced one
        i = list(placed).index(pid)
        raise part_tables[i].error(
            None, f"part {pid!r} touches no other part; every part must bear on another"
        )
    ref_id = t.text("reference_material", default=parts[0].material.id)
    if ref_id not in materials:
        raise t.error(
            "reference_material", f"expected a material id ({', '.join(materials)}), got {excerpt(ref_id)}"
        )
    shear = t.quantity("shear", "force", allow_zero=True)
    design = read_design(t)
    joints = tuple(_joints(t, placed, settings.method, bool(design.get("slip")), slip_ec5(design, settings)))
    ec5_member_keys(t, settings.method)
    member = Member(
        id=mid,
        title=t.text("title", default=mid),
        description=t.text("description"),
        parts=parts,
        joints=joints,
        reference_material=materials[ref_id],
        shear=shear,
        assumptions=t.texts("assumptions"),
        notes=t.texts("notes"),
        design=design,
    )
    if plies:
        from .plies import read_ply_fastening

        member = replace(member, plies=plies, ply_fastening=read_ply_fastening(t, plies, settings.method))
    member = _loads_hook(t, member, settings)
    from .plies import check_ply_loads

    check_ply_loads(t, member)
    if member.shear is not None and (member.loads or member.self_weight):
        raise t.error(
            "shear",
            "shear has no effect on a member with loads along it (the design shear comes from the "
            "shear envelope of its loads); remove shear, or remove the span and loads",
        )
    if member.shear is None and not member.loads and not member.self_weight:
        raise t.error(None, "missing required key 'shear' (the design shear V, e.g. shear = \"4.2 kip\")")
    t.done()
    return member


def _loads_hook(t: Table, member: Member, settings: Settings) -> Member:
    """Loads along the member are read by :mod:`calcreport.jobfile.loads` when present."""
    try:
        from . import loads as loads_reader
    except ImportError:
        return member
    return loads_reader.read_loads(t, member, settings)


def _joints(t: Table, parts: dict[str, Part], method: str, slip: bool = False, slip_ec5: bool = False):
    for jt, jid in t.id_tables("joint", MAX_JOINTS, "joint"):
        jt.expect(decl.names(decl.JOINT))
        holds = jt.raw("holds", True, "the list of part ids held on one side of the shear plane")
        if isinstance(holds, str):
            holds = [holds]
        if not isinstance(holds, list) or not holds or not all(isinstance(h, str) for h in holds):
            raise jt.error("holds", 'expected a list of part ids, like ["top_flange"]')
        for h in holds:
            if h not in parts:
                raise jt.error("holds", f"expected part ids ({', '.join(parts)}), got unknown {excerpt(h)}")
        if len(set(holds)) == len(parts):
            raise jt.error(
                "holds",
                "the held parts are the whole section; a joint holds the parts on ONE side of its shear plane",
            )
        held = [parts[h] for h in holds]
        rest = [p for p in parts.values() if p.id not in holds]
        if not contact_segments(held, rest):
            raise jt.error(
                "holds",
                "the held parts touch the rest of the section along no line; a joint needs a shear plane",
            )
        ct = jt.table("connector", required=True)
        kind = ct.choice("type", connectors.kinds(), required=True)
        params = ct.fields(connectors.fields_for(kind))
        given = tuple(k for k in ct.data if k != "type")
        if ct.has("slip_modulus") and not slip:
            ct.warn("slip_modulus", "has no effect without [member.design] slip = true")
        ct.done()
        ec5_connector_keys(ct, kind, method, slip_ec5)
        connector_keys(ct, kind, params, method)
        if is_continuous(kind, params):
            for key in ("per_row", "spacing_max", "spacing_min"):
                if jt.has(key):
                    raise jt.error(
                        key,
                        f"{key} has no effect on a continuous connector ({kind}"
                        + (" without segment" if kind == "fillet_weld" else "")
                        + "): it has no spacing or rows; remove it",
                    )
        joint = Joint(
            id=jid,
            holds=tuple(dict.fromkeys(holds)),
            connector=ConnectorSpec(kind, params, ct.label, given),
            per_row=jt.integer("per_row", 1, 1, 50),
            label=jt.text("label"),
            width=jt.quantity("width", "length"),
            spacing_max=jt.quantity("spacing_max", "length"),
            spacing_min=jt.quantity("spacing_min", "length"),
        )
        jt.done()
        yield joint
