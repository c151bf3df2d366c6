"""The job-level tables of a job file: ``[job]`` (the header), ``[settings]`` and ``[[material]]``.
Read by :func:`calcreport.jobfile.load.load_text` before the members; every problem raises a
located :class:`calcreport.errors.JobError`."""

from __future__ import annotations

from ..errors import JobError
from ..keys import job as decl
from ..keys.loads import LOAD_STANDARDS
from ..model import Header, Material, RevisionEntry, Settings
from ..units import parse
from .design import read_panel, read_wood_keys
from .ec5_keys import ec5_material_warnings, read_ec5_material, read_ec5_settings
from .reader import Table

__all__ = ["read_header", "read_settings", "read_materials", "MAX_MATERIALS", "MAX_HISTORY", "FAMILIES"]

MAX_MATERIALS = 200
MAX_HISTORY = 30
FAMILIES = decl.FAMILIES


def read_header(t: Table) -> Header:
    """``[job]``: the title block, revision history and notes."""
    t.expect(decl.names(decl.JOB))
    history = []
    entries = t.tables("history", id_key="mark")
    if len(entries) > MAX_HISTORY:  # each entry is a row of the cover's revision table
        raise t.error(
            "history", f"expected at most {MAX_HISTORY} revision history entries, got {len(entries):,}"
        )
    for r in entries:
        r.expect(decl.names(decl.HISTORY))
        history.append(
            RevisionEntry(r.text("mark", True), r.text("date"), r.text("by"), r.text("description"))
        )
        r.done()
    h = Header(
        project=t.text("project", True),
        number=t.text("number"),
        client=t.text("client"),
        subject=t.text("subject"),
        prepared_by=t.text("prepared_by"),
        checked_by=t.text("checked_by"),
        revision=t.text("revision", default="0"),
        date=t.text("date"),
        prepared_date=t.text("prepared_date"),
        checked_date=t.text("checked_date"),
        approved_by=t.text("approved_by"),
        engineer=t.text("engineer"),
        licence=t.text("licence"),
        jurisdiction=t.text("jurisdiction"),
        history=tuple(history),
        notes=t.texts("notes"),
    )
    t.done()
    return h


def read_settings(t: Table) -> Settings:
    """``[settings]``: units, method, spacing rules, deflection limits, display units, loads."""
    t.expect(decl.names(decl.SETTINGS))
    units = t.choice("units", ("US", "SI"), "US")
    method = t.choice("method", decl.METHODS, "ASD")
    step = t.quantity(
        "spacing_step", "length", default=parse("0.25 in" if units == "US" else "5 mm", "length")
    )
    if not parse("1/64 in", "length") <= step <= parse("4 ft", "length"):
        raise t.error("spacing_step", "expected a spacing step from 1/64 in (0.4 mm) to 4 ft (1.2 m)")
    smax = t.quantity("spacing_max", "length")
    smin = t.quantity("spacing_min", "length")
    if smax is not None and smin is not None and smin > smax:
        raise t.error("spacing_min", "expected spacing_min no larger than spacing_max")
    if smax is not None and step > smax:
        raise t.error("spacing_step", "expected a spacing step no larger than spacing_max")
    zones = t.integer("zones_per_half", 3, 1, 12)
    zones_span = t.integer("zones_per_span", None, 1, 12)
    module = t.quantity("zone_module", "length")
    limits = {}
    lt = t.table("deflection_limits")
    if lt is not None:
        for case in list(lt.data):
            limits[case] = lt.number(case, required=True, minimum=1, maximum=100_000)
        lt.done()
    display = {}
    dt = t.table("display")
    if dt is not None:
        dt.expect(decl.names(decl.DISPLAY))
        for kind, dim in (
            ("force", "force"),
            ("length", "length"),
            ("stress", "stress"),
            ("shear_flow", "line_load"),
            ("moment", "moment"),
        ):
            unit = dt.text(kind)
            if unit:
                dt.parse_quantity(kind, f"1 {unit}", dim)
                display[kind] = unit
        dt.done()
    cd = t.number("load_duration", None, minimum=0.5, maximum=2.0)
    standard = t.choice("load_standard", LOAD_STANDARDS, "ASCE 7-22")
    s = Settings(
        units,
        method,
        step,
        smax,
        smin,
        zones,
        module,
        limits,
        t.text("template"),
        display,
        cd,
        standard,
        zones_span,
        tuple(t.data),
        **read_ec5_settings(t, method),
    )
    t.done()
    return s


def read_materials(root: Table, method: str = "ASD") -> dict[str, Material]:
    """Every ``[[material]]`` by id (at least one)."""
    out: dict[str, Material] = {}
    for t, mid in root.id_tables("material", MAX_MATERIALS, "material"):
        t.expect(decl.names(decl.MATERIAL))
        density = None
        if t.has("density"):
            raw = t.raw("density")
            try:
                density = t.parse_quantity("density", raw, "weight_density")
            except JobError:
                dens_mass = t.parse_quantity("density", raw, "mass_density")
                density = (dens_mass * parse("1 gravity")).to("lbf/ft**3")
        out[mid] = Material(
            id=mid,
            name=t.text("name", default=mid),
            E=t.quantity("E", "stress", True),
            family=t.choice("family", FAMILIES, "other"),
            Fb=t.quantity("Fb", "stress"),
            Fv=t.quantity("Fv", "stress"),
            Fy=t.quantity("Fy", "stress"),
            Fu=t.quantity("Fu", "stress"),
            fc=t.quantity("fc", "stress"),
            G=t.number("G", None, minimum=0.2, maximum=1.2),
            density=density,
            extra={
                "Fs": t.quantity("Fs", "stress"),
                "grade": t.text("grade"),
                **read_wood_keys(t),
                "panel": read_panel(t, t.choice("family", FAMILIES, "other")),
                **read_ec5_material(t, t.choice("family", FAMILIES, "other"), method),
            },
        )
        ec5_material_warnings(t, method)
        t.done()
    if not out:
        raise root.error(None, "missing required key 'material' (at least one [[material]])")
    return out
