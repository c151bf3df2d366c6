"""Every table and key of a job file, as data: what the reader accepts (each table is checked
against its declaration before it is read, :meth:`calcreport.jobfile.reader.Table.expect`) and
what the JSON Schema for editors says (:mod:`calcreport.schema`). The connector tables come from
:mod:`.connectors`.

To add a key: declare it here (name, kind, help), then read it in :mod:`calcreport.jobfile`;
regenerate the shipped schema with ``python -m calcreport schema > calcreport/data/job.schema.json``.
"""

from __future__ import annotations

from dataclasses import dataclass

from ..fields import Field
from .loads import DURATION_CLASSES, LOAD_STANDARDS, TIMBER_PRODUCTS

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
]

#: Shapes of a part and the ways to place one (see docs/job-format.md).
SHAPES = ("rect", "plate", "lumber", "bar", "polygon", "rolled")
PLACEMENTS = ("on", "below", "left_of", "right_of", "at")
FAMILIES = ("wood", "plywood", "glulam", "steel", "concrete", "aluminum", "other")
SUPPORT_TYPES = ("pin", "roller", "fixed")
LOAD_KINDS = ("uniform", "point", "linear")
#: Where a load enters a member of plies side by side (issue 14).
LOAD_ENTRIES = ("top", "left_face", "right_face", "ply")


@dataclass(frozen=True)
class TableSpec:
    """A table of the job file: its keys, its sub-tables, whether it is an array (``[[name]]``).

    ``free`` names the kind of every key of a table whose keys are the user's (a load case →
    a number, for ``deflection_limits`` and ``factors``); ``connector``: the keys depend on
    ``type`` (:data:`calcreport.keys.connectors.CONNECTOR_FIELDS`).
    """

    name: str
    help: str
    fields: tuple[Field, ...] = ()
    tables: tuple[TableSpec, ...] = ()
    array: bool = False
    required: bool = False
    free: str = ""
    connector: bool = False


def names(spec: TableSpec) -> tuple[str, ...]:
    """Every key the table may hold: its fields and its sub-tables."""
    return tuple(f.name for f in spec.fields) + tuple(t.name for t in spec.tables)


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

PART = TableSpec(
    "part",
    "one piece of the section, placed against a part listed before it",
    (
        Field("id", "id", required=True, help="short id that joints and placements refer to"),
        Field("shape", "choice", required=True, choices=SHAPES, help="how the part's outline is given"),
        Field("material", "text", required=True, help="id of a [[material]]"),
        Field("label", "text", help="name printed in the report"),
        Field("width", "length", help="width (rect, plate, rolled)"),
        Field("depth", "length", help="depth (rect, rolled)"),
        Field("thickness", "length", help="thickness (plate)"),
        Field("upright", "bool", default=False, help="plate standing on edge (a web)"),
        Field("size", "text", help='nominal lumber size, e.g. "2x10" (lumber)'),
        Field("flat", "bool", default=False, help="lumber laid flat (default on edge)"),
        Field("diameter", "length", help="diameter (bar)"),
        Field("points", "points", help='outline as [x, y] points, e.g. [["0 in", "0 in"], ...] (polygon)'),
        Field("area", "area", help="area (rolled)"),
        Field("inertia", "inertia", help="moment of inertia about its own centroid (rolled)"),
        Field("centroid", "length", help="height of the centroid above the bottom (rolled; default depth/2)"),
        Field(
            "designation",
            "text",
            help='rolled shape designation, e.g. "W21X50": alone, its properties come from the AISC Shapes '
            "Database v16.0; beside area, inertia, depth and width, printed in the report (rolled)",
        ),
        Field(
            "flange_thickness",
            "length",
            help="flange thickness a bolt or weld bears on (rolled by properties)",
        ),
        Field("web_thickness", "length", help="web thickness a bolt or weld bears on (rolled by properties)"),
        Field("on", "text", help="id of the part this one sits on"),
        Field("below", "text", help="id of the part this one hangs below"),
        Field("left_of", "text", help="id of the part this one is left of"),
        Field("right_of", "text", help="id of the part this one is right of"),
        Field("at", "point", help='position of the lower left corner, e.g. ["0 in", "9.25 in"]'),
        Field("align", "choice", choices=("centre", "left", "right", "bottom", "top"), help="alignment"),
        Field("offset", "length", positive=False, help="shift along the face after aligning"),
    ),
    array=True,
)  # required unless the member is described by plies ([[member.ply]]); see schema.py


CONNECTOR = TableSpec(
    "connector",
    "the connector across the joint's shear plane; its keys depend on type",
    required=True,
    connector=True,
)

JOINT = TableSpec(
    "joint",
    "a shear plane between the held parts and the rest, and the connector across it",
    (
        Field("id", "id", required=True, help="short id"),
        Field("holds", "ids", required=True, help="ids of the parts on one side of the shear plane"),
        Field("per_row", "int", default=1, minimum=1, maximum=50, help="connectors in each row"),
        Field("label", "text", help="name printed in the report"),
        Field("width", "length", help="width of the shear plane (default: measured from the parts)"),
        Field("spacing_max", "length", help="largest spacing allowed in this joint"),
        Field("spacing_min", "length", help="smallest spacing allowed in this joint"),
    ),
    (CONNECTOR,),
    array=True,
)

SUPPORT = TableSpec(
    "support",
    "a support (none given: a pin at each end)",
    (
        Field("at", "length", required=True, positive=False, help="position from the left end"),
        Field("type", "choice", default="pin", choices=SUPPORT_TYPES, help="pin, roller or fixed"),
    ),
    array=True,
)

LOAD = TableSpec(
    "load",
    "a load along the member",
    (
        Field("id", "id", help="short id that lets a revision diff follow the load"),
        Field("case", "text", required=True, help="D, L, Lr, S, R, W or a case name of the job's own"),
        Field("kind", "choice", required=True, choices=LOAD_KINDS, help="uniform, point or linear"),
        Field("label", "text", help="name printed in the report"),
        Field("P", "force", positive=False, help="point load"),
        Field("at", "length", positive=False, help="position of a point load"),
        Field("w", "line_load", positive=False, help="uniform load"),
        Field("w_start", "line_load", positive=False, help="linear load at its start"),
        Field("w_end", "line_load", positive=False, help="linear load at its end"),
        Field("from", "length", positive=False, help="start of a partial load (default: the left end)"),
        Field("to", "length", positive=False, help="end of a partial load (default: the right end)"),
        Field(
            "variable",
            "bool",
            default=False,
            help="a case of the job's own placed for its worst effect, as live load",
        ),
        Field("moving", "bool", default=False, help="a point load placed where it does the most harm"),
        Field("group", "text", help="moving point loads with the same group move together at fixed offsets"),
        Field("offset", "length", positive=False, help="position of a moving load within its group"),
        Field("between", "point", help='travel range of a moving load or group, e.g. ["0 ft", "16 ft"]'),
        # --- plies side by side (issue 14): where a load enters the plies ---
        Field(
            "enters",
            "choice",
            choices=LOAD_ENTRIES,
            help="members of plies: top (bears on the plies' tops, shared by bearing), left_face / "
            "right_face (hung from the first / last ply: ledger, hangers) or ply (one ply, see ply)",
        ),
        Field("ply", "text", help='members of plies: id of the ply the load enters (with enters = "ply")'),
        Field(
            "transfer_length",
            "length",
            help="members of plies, point loads: length along the member over which the loaded ply "
            "passes the load on to the others (default: the member's depth)",
        ),
    ),
    array=True,
)

FACTORS = TableSpec(
    "factors", "load factor per case, e.g. { D = 1.2, L = 1.6 }", required=True, free="number"
)

COMBINATION = TableSpec(
    "combination",
    "a load combination of the job's own (none given: ASCE 7-22 basic combinations)",
    (
        Field("name", "text", required=True, help="name printed in the report"),
        Field("source", "text", help="where the combination comes from"),
    ),
    (FACTORS,),
    array=True,
)

DESIGN = TableSpec(
    "design",
    "member-check inputs (all optional: a check that needs a missing one is listed as not checked "
    "or runs with a stated default)",
    (
        Field(
            "unbraced_length",
            "length",
            help="top flange when in compression: Lb (steel, AISC 360-16 F) or ℓe (wood, NDS 2018 §3.7); default the span",
        ),
        Field(
            "continuous_bracing",
            "bool",
            default=False,
            help="the top flange is braced along its length (Lb = 0)",
        ),
        Field("bottom_unbraced_length", "length", help="the same as unbraced_length for the bottom flange"),
        Field(
            "bottom_continuous_bracing",
            "bool",
            default=False,
            help="the bottom flange is braced along its length",
        ),
        Field(
            "Cb",
            "number",
            minimum=1.0,
            maximum=3.0,
            help="lateral-torsional buckling modification factor (default 1.0)",
        ),
        Field(
            "stiffener_spacing",
            "length",
            help="clear spacing a of transverse web stiffeners (AISC 360-16 G2)",
        ),
        Field(
            "bearing_length", "length", help="length of bearing lb at each support (AISC 360-16 J10.2, J10.3)"
        ),
        Field(
            "bearing_stiffeners",
            "bool",
            default=False,
            help="bearing stiffeners at the supports (the J10 web checks then do not apply)",
        ),
        Field(
            "cover_plate_end_weld",
            "bool",
            default=False,
            help="cover plates welded across their ends (AISC 360-16 F13.3)",
        ),
        Field(
            "Cr",
            "number",
            minimum=1.0,
            maximum=1.15,
            help="repetitive member factor of wood bending (NDS 2018 §4.3.9)",
        ),
        Field(
            "construction",
            "choice",
            choices=("shored", "unshored"),
            help="composite: unshored puts the dead load on the steel alone; shored on the composite section",
        ),
        # --- slip of mechanical connectors (γ-method, issue 18) ---
        Field(
            "slip",
            "bool",
            default=False,
            help="add the γ-method (EN 1995-1-1 Annex B): connector slip beside the rigid V·Q/I results",
        ),
        Field(
            "slip_moduli",
            "choice",
            default="auto",
            choices=("auto", "EN 1995-1-1", "NDS 2018"),
            help="slip moduli from EN 1995-1-1 Table 7.1 or NDS 2018 §11.3.6; auto: EN 1995-1-1 for SI "
            "or EC5 jobs, NDS 2018 otherwise",
        ),
        # --- end slip ---
    ),
)

# --- plies side by side and flitch beams (issue 14) -------------------------------------------

PLY = TableSpec(
    "ply",
    "one ply of a member built of plies set side by side, listed in order across the width "
    "(left to right); instead of [[member.part]]",
    (
        Field("id", "id", required=True, help="short id that loads refer to"),
        Field("material", "text", required=True, help="id of a [[material]]"),
        Field("label", "text", help="name printed in the report"),
        Field("size", "text", help='nominal dressed lumber size, on edge, e.g. "2x12"'),
        Field("width", "length", help="width across the member (LVL, glulam: with depth)"),
        Field("depth", "length", help="depth (LVL, glulam: with width; steel plate: with thickness)"),
        Field("thickness", "length", help="thickness of a steel flitch plate (with depth)"),
        Field(
            "align",
            "choice",
            default="bottom",
            choices=("bottom", "top"),
            help="set flush with the other plies at the bottom (default) or at the top",
        ),
    ),
    array=True,
)

PLY_CONNECTOR = TableSpec(
    "connector",
    "the fastener between the plies (nail, wood_screw, lag_screw, wood_bolt or given)",
    required=True,
    connector=True,
)

PLY_FASTENING = TableSpec(
    "ply_fastening",
    "the fasteners that join the plies and carry the load that enters one ply across to the others",
    (
        Field("rows", "int", required=True, minimum=1, maximum=12, help="rows of fasteners across the depth"),
        Field(
            "through",
            "bool",
            default=False,
            help="each fastener passes through every ply (through-bolts; three plies: double shear); "
            "otherwise fasteners are driven from the outer faces, one line per interface",
        ),
        Field(
            "face",
            "choice",
            choices=("left", "right"),
            help="two plies fastened from one face: the face the heads are on (default left)",
        ),
        Field(
            "staggered",
            "bool",
            default=False,
            help="rows driven from opposite faces are offset along the member (their points may overlap)",
        ),
        Field(
            "spacing_max",
            "length",
            help="largest spacing (default 12 in for nails and screws, 24 in for bolts)",
        ),
        Field("spacing_min", "length", help="smallest spacing allowed"),
    ),
    (PLY_CONNECTOR,),
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
