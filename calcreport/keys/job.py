"""Every table and key of a job file, as data: what the reader accepts (each table is checked
against its declaration before it is read, :meth:`calcreport.jobfile.reader.Table.expect`) and
what the JSON Schema for editors says (:mod:`calcreport.schema`). The connector tables come from
:mod:`.connectors`; the tables inside ``[[member]]`` are declared in :mod:`.member_tables` and
:class:`TableSpec` with the small vocabularies in :mod:`.table_spec` (all re-exported here).

To add a key: declare it in its table (name, kind, help), then read it in :mod:`calcreport.jobfile`;
regenerate the shipped schema with ``python -m calcreport schema > calcreport/data/job.schema.json``.
"""

from __future__ import annotations

from ..fields import Field
from .loads import DURATION_CLASSES, LOAD_STANDARDS, TIMBER_PRODUCTS
from .member_tables import (
    COMBINATION,
    CONNECTOR,
    DESIGN,
    FACTORS,
    JOINT,
    LOAD,
    PART,
    PLY,
    PLY_CONNECTOR,
    PLY_FASTENING,
    SUPPORT,
)
from .table_spec import (
    FAMILIES,
    LOAD_ENTRIES,
    LOAD_KINDS,
    PLACEMENTS,
    SHAPES,
    SUPPORT_TYPES,
    TableSpec,
    names,
)

__all__ = [
    "TableSpec",
    "JOB",
    "SETTINGS",
    "MATERIAL",
    "PANEL",
    "MEMBER",
    "DESIGN",
    "PART",
    "JOINT",
    "PLY",
    "PLY_FASTENING",
    "ROOT",
    "names",
    # re-exported from .table_spec and .member_tables (split)
    "SHAPES",
    "PLACEMENTS",
    "FAMILIES",
    "SUPPORT_TYPES",
    "LOAD_KINDS",
    "LOAD_ENTRIES",
    "CONNECTOR",
    "SUPPORT",
    "LOAD",
    "FACTORS",
    "COMBINATION",
    "PLY_CONNECTOR",
]

HISTORY = TableSpec(
    "history",
    "revision history, one table per revision, newest last",
    (
        Field("mark", "text", required=True, help="revision mark, e.g. A or 1"),
        Field("date", "text", help="date of the revision"),
        Field("by", "text", help="who made it"),
        Field("description", "text", help="what changed"),
    ),
    array=True,
)

JOB = TableSpec(
    "job",
    "project header: what the title block and cover show",
    (
        Field("project", "text", required=True, help="project name"),
        Field("number", "text", help="project or job number"),
        Field("client", "text", help="client"),
        Field("subject", "text", help="what this calculation is about"),
        Field("prepared_by", "text", help="engineer who prepared the calculation"),
        Field("checked_by", "text", help="engineer who checked it"),
        Field("revision", "text", default="0", help="current revision mark (drawn in revision triangles)"),
        Field("date", "text", help="date of issue"),
        Field("prepared_date", "text", help="date prepared"),
        Field("checked_date", "text", help="date checked"),
        Field("approved_by", "text", help="who approved it"),
        Field("notes", "texts", help="notes printed on the cover"),
        Field(
            "engineer", "text", help="engineer of record, shown on the cover and in a digital seal's stamp"
        ),
        Field("licence", "text", help="the engineer's licence number (shown with a digital seal)"),
        Field("jurisdiction", "text", help="state or province of the licence (shown with a digital seal)"),
    ),
    (HISTORY,),
    required=True,
)

DISPLAY = TableSpec(
    "display",
    "units the outputs print in, overriding those of settings.units",
    (
        Field("force", "unit", help='unit for forces, e.g. "kip" or "kN"'),
        Field("length", "unit", help='unit for lengths, e.g. "in" or "mm"'),
        Field("stress", "unit", help='unit for stresses, e.g. "psi" or "MPa"'),
        Field("shear_flow", "unit", help='unit for shear flow, e.g. "lbf/in" or "N/mm"'),
        Field("moment", "unit", help='unit for moments, e.g. "kip*ft" or "kN*m"'),
    ),
)

DEFLECTION_LIMITS = TableSpec(
    "deflection_limits",
    "span over deflection limit per load case or combination name, e.g. { L = 360, total = 240 }",
    free="number",
)

# --- EN 1995-1-1 / EN 1990 keys (settings.method = "EC5"); owner: ec5 ---------------------------
METHODS = ("ASD", "LRFD", "EC5")

LOAD_CASE = TableSpec(
    "load_case",
    "EC5: a load case's duration class and combination factors ψ (EN 1990 Annex A1, EN 1995-1-1 §2.3.1.2)",
    (
        Field(
            "case", "text", required=True, help="the load case: D, L, S, W or a case name of the job's own"
        ),
        Field(
            "duration",
            "choice",
            required=True,
            choices=DURATION_CLASSES,
            help="load-duration class (EN 1995-1-1 Table 2.1), for k_mod",
        ),
        Field(
            "psi0",
            "number",
            positive=False,
            minimum=0.0,
            maximum=1.0,
            help="combination value factor ψ0 (variable cases; EN 1990 Table A1.1 or the national annex)",
        ),
        Field(
            "psi2",
            "number",
            positive=False,
            minimum=0.0,
            maximum=1.0,
            help="quasi-permanent value factor ψ2 (variable cases; for the quasi_permanent deflection limit)",
        ),
    ),
    array=True,
)

EC5_SETTINGS = (
    Field(
        "service_class",
        "int",
        minimum=1,
        maximum=3,
        help="EC5: service class 1, 2 or 3 (EN 1995-1-1 §2.3.1.3), for k_mod",
    ),
    Field(
        "gamma_M_connections",
        "number",
        minimum=1.0,
        maximum=2.0,
        help="EC5: partial factor γ_M of connections (default 1.3, EN 1995-1-1 Table 2.3; give the national value)",
    ),
    Field(
        "duration",
        "choice",
        choices=DURATION_CLASSES,
        help="EC5: load-duration class of a member's design shear given without loads along it (for k_mod)",
    ),
)

EC5_MATERIAL = (
    Field(
        "rho_k",
        "mass_density",
        help='EC5: characteristic density ρ_k, e.g. "350 kg/m^3" (EN 338, EN 14080; embedment strength)',
    ),
    Field(
        "timber_product",
        "choice",
        choices=TIMBER_PRODUCTS,
        help="EC5: product for k_mod and γ_M (default by family: wood solid, glulam, plywood)",
    ),
    Field(
        "gamma_M",
        "number",
        minimum=1.0,
        maximum=2.0,
        help="EC5: partial factor γ_M of the material (default EN 1995-1-1 Table 2.3 by product)",
    ),
    Field("f_m_k", "stress", help="EC5: characteristic bending strength f_m,k (EN 338, EN 14080)"),
    Field("f_t_0_k", "stress", help="EC5: characteristic tension strength parallel to grain f_t,0,k"),
    Field("f_c_0_k", "stress", help="EC5: characteristic compression strength parallel to grain f_c,0,k"),
    Field("f_v_k", "stress", help="EC5: characteristic shear strength f_v,k"),
)
# --- end of EC5 keys ------------------------------------------------------------------------------


SETTINGS = TableSpec(
    "settings",
    "design method, units and spacing rules for the whole job",
    (
        Field("units", "choice", default="US", choices=("US", "SI"), help="units the outputs use"),
        Field(
            "method",
            "choice",
            default="ASD",
            choices=METHODS,
            help="design method: ASD or LRFD (NDS 2018, ASCE 7), or EC5 (EN 1995-1-1 with EN 1990)",
        ),
        Field(
            "spacing_step", "length", help="practical spacings are multiples of this (default 1/4 in, 5 mm)"
        ),
        Field("spacing_max", "length", help="largest connector spacing allowed in every joint"),
        Field("spacing_min", "length", help="smallest connector spacing allowed in every joint"),
        Field("zones_per_half", "int", default=3, minimum=1, maximum=12, help="most zones per half span"),
        Field(
            "zones_per_span",
            "int",
            minimum=1,
            maximum=12,
            help="most zones per half of each span or overhang of a continuous member (default: zones_per_half)",
        ),
        Field(
            "load_standard",
            "choice",
            default="ASCE 7-22",
            choices=LOAD_STANDARDS,
            help="edition of ASCE 7 whose basic combinations (§2.3.1, §2.4.1) are used",
        ),
        Field("zone_module", "length", help="zone boundaries fall on multiples of this length"),
        Field("template", "text", help='report template: "letter", "a4" or a path to a .toml file'),
        Field(
            "load_duration",
            "number",
            minimum=0.5,
            maximum=2.0,
            help="load duration factor CD for wood (ASD) where a connector does not state its own",
        ),
    )
    + EC5_SETTINGS,
    (DEFLECTION_LIMITS, DISPLAY, LOAD_CASE),
)

PANEL = TableSpec(
    "panel",
    "a plywood panel's published properties parallel to the span, per foot of width (webs by effective section)",
    (
        Field(
            "table",
            "text",
            required=True,
            help="where the values come from, printed beside every step that uses them",
        ),
        Field(
            "thickness",
            "length",
            required=True,
            help="nominal thickness of the panel as placed in the section",
        ),
        Field("thickness_effective", "length", help="thickness giving the effective area and I (or give A)"),
        Field(
            "A",
            "length",
            help='effective area per foot of width, e.g. "3.2 in^2/ft" (or give thickness_effective)',
        ),
        Field(
            "I", "volume", help='effective moment of inertia per foot of width, flatwise, e.g. "0.3 in^4/ft"'
        ),
        Field("Fv_tv", "line_load", help='panel shear through the thickness, e.g. "190 lbf/in"'),
        Field("Gv_tv", "line_load", help='panel shear rigidity through the thickness, e.g. "25000 lbf/in"'),
        Field("Ft_A", "line_load", help='axial tension capacity per foot of width, e.g. "3100 lbf/ft"'),
        Field("Fc_A", "line_load", help='axial compression capacity per foot of width, e.g. "3500 lbf/ft"'),
    ),
)

MATERIAL = TableSpec(
    "material",
    "a material that parts refer to by id",
    (
        Field("id", "id", required=True, help="short id the parts use"),
        Field("name", "text", help="name printed in the report"),
        Field("E", "stress", required=True, help="modulus of elasticity"),
        Field("family", "choice", default="other", choices=FAMILIES, help="kind of material"),
        Field("Fb", "stress", help="allowable (ASD) or design (LRFD) bending stress"),
        Field("Fv", "stress", help="allowable or design shear stress"),
        Field("Fy", "stress", help="yield stress (steel)"),
        Field("Fu", "stress", help="tensile strength (steel)"),
        Field("fc", "stress", help="specified compressive strength f'c (concrete)"),
        Field("G", "number", minimum=0.2, maximum=1.2, help="specific gravity (wood, NDS Table 12.3.3A)"),
        Field("density", "weight_density", help='weight (or mass) density, e.g. "35 pcf" or "500 kg/m^3"'),
        Field("Fs", "stress", help="rolling shear of plywood (panel face glued to a flange)"),
        Field("grade", "text", help="grade or species text printed in the report"),
        Field("Ft", "stress", help="tension parallel to grain (wood; box-beam flanges, NDS 2018 §3.8)"),
        Field("Fc", "stress", help="compression parallel to grain (wood; box-beam flanges, NDS 2018 §3.6)"),
        Field(
            "Emin",
            "stress",
            help="modulus of elasticity for stability (wood; CL and CP, NDS 2018 §3.3.3, §3.7)",
        ),
        Field(
            "CF",
            "number",
            minimum=0.5,
            maximum=1.5,
            help="size factor of wood bending (NDS 2018 Supplement Table 4A; default 1.0 up to 12 in wide)",
        ),
        # --- plies side by side (issue 14) ---
        Field(
            "Fc_perp",
            "stress",
            help="compression perpendicular to grain Fc⊥ (wood; bearing of plies on the supports, NDS 2018 §3.10)",
        ),
        # --- slip of mechanical connectors (γ-method, issue 18) ---
        Field(
            "rho_mean",
            "mass_density",
            help='mean density ρm for the slip modulus K_ser (EN 1995-1-1 Table 7.1), e.g. "420 kg/m^3"',
        ),
        # --- end slip ---
    )
    + EC5_MATERIAL,
    (PANEL,),
    array=True,
    required=True,
)

MEMBER = TableSpec(
    "member",
    "a built-up member: its parts, joints and either a design shear or loads along it",
    (
        Field("id", "id", required=True, help="short id"),
        Field("title", "text", help="title printed in the report"),
        Field("description", "text", help="description printed in the report"),
        Field(
            "reference_material",
            "text",
            help="material the section is transformed to (default: the first part's)",
        ),
        Field("shear", "force", positive=False, help="design shear V (instead of loads along the member)"),
        Field("assumptions", "texts", help="design assumptions printed in the report"),
        Field("notes", "texts", help="notes printed in the report"),
        Field("span", "length", help="member length (with loads along it)"),
        Field("self_weight", "bool", default=False, help="add the parts' weight as dead load D"),
    ),
    (PART, JOINT, SUPPORT, LOAD, COMBINATION, DESIGN, PLY, PLY_FASTENING),
    array=True,
    required=True,
)

ROOT = TableSpec(
    "",
    "a calcreport job file",
    tables=(JOB, SETTINGS, MATERIAL, MEMBER),
)
