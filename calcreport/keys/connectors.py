"""Keys of each connector model's ``[member.joint.connector]`` table, as data.

The job-file reader validates a connector table against these declarations and hands the model
typed values (:meth:`calcreport.jobfile.reader.Table.fields`); the JSON Schema for job files is
generated from them (:mod:`calcreport.schema`); each model in :mod:`calcreport.solve.connectors`
takes its ``FIELDS`` from here. The ``help`` texts are the schema's descriptions.
"""

from __future__ import annotations

from ..fields import Field

__all__ = ["CONNECTOR_FIELDS", "NDS_COMMON", "EC5_KEYS", "NDS_ONLY_KEYS", "kinds", "fields_for"]

#: Keys shared by every NDS 2018 dowel-type fastener model (nail, wood screw, lag screw, wood bolt).
NDS_COMMON = (
    Field("side_thickness", "length", help="side member thickness ts (default: measured from the parts)"),
    Field("main_thickness", "length", help="main member thickness tm (default: measured from the parts)"),
    Field(
        "side_member",
        "choice",
        default="auto",
        choices=("auto", "held", "other"),
        help="which part the fastener head is in; auto = the thinner part at the plane, the held part on a tie",
    ),
    Field(
        "G_side",
        "number",
        minimum=0.2,
        maximum=1.2,
        help="specific gravity of the side member (default: its material's G)",
    ),
    Field(
        "G_main",
        "number",
        minimum=0.2,
        maximum=1.2,
        help="specific gravity of the main member (default: its material's G)",
    ),
    Field(
        "species",
        "text",
        help='species combination for G where a material gives none, e.g. "Douglas Fir-Larch"',
    ),
    Field(
        "angle_side",
        "number",
        default=0.0,
        positive=False,
        minimum=0.0,
        maximum=90.0,
        help="angle of load to grain in the side member, degrees (shear flow along a member: 0)",
    ),
    Field(
        "angle_main",
        "number",
        default=0.0,
        positive=False,
        minimum=0.0,
        maximum=90.0,
        help="angle of load to grain in the main member, degrees",
    ),
    Field(
        "planes",
        "int",
        default=1,
        minimum=1,
        maximum=2,
        help="shear planes: 1 single shear, 2 double shear (held part in the middle)",
    ),
    Field(
        "CD",
        "number",
        maximum=2.0,
        help="load duration factor (ASD); default: the job's load_duration, else 1.0",
    ),
    Field("wet_service", "bool", default=False, help="moisture content above 19 % in service (CM = 0.7)"),
    Field("CM", "number", maximum=1.0, help="wet service factor, overriding wet_service"),
    Field("Ct", "number", default=1.0, maximum=1.0, help="temperature factor (1.0 up to 100 °F sustained)"),
    Field("end_grain", "bool", default=False, help="fastener in end grain (Ceg = 0.67)"),
    Field("time_effect", "number", default=0.8, maximum=1.25, help="LRFD time effect factor λ"),
    Field(
        "row_count",
        "int",
        default=1,
        minimum=1,
        help="fasteners in a row that act together (group action, D ≥ 1/4 in)",
    ),
    Field("row_spacing", "length", help="spacing of the fasteners in that row (needed when row_count > 1)"),
    Field(
        "steel_form",
        "choice",
        default="auto",
        choices=("auto", "hot_rolled", "cold_formed"),
        help="steel side plate: hot-rolled (Fe = 1.5·Fu) or cold-formed (1.375·Fu); auto by t ≥ 1/4 in",
    ),
)

#: ``type = "given"``
GIVEN = (
    Field(
        "value",
        "force",
        required=True,
        help="design value of one connector (ASD allowable or LRFD design strength)",
    ),
    Field(
        "source", "text", required=True, help="where the value comes from: table, edition, evaluation report"
    ),
    Field("name", "text", default="connector", help='what the connector is, e.g. "10d common nail"'),
)

#: ``type = "given_line"``
GIVEN_LINE = (
    Field("value", "line_load", required=True, help="design value per unit length of the connection"),
    Field("source", "text", required=True, help="where the value comes from: table, edition, report"),
    Field("name", "text", default="continuous connection", help="what the connection is"),
)

#: ``type = "shank"``
SHANK = (
    Field("diameter", "length", required=True, help="shank diameter d"),
    Field("tau", "stress", required=True, help="allowable (or design) average shear stress on the shank"),
    Field("planes", "int", default=1, help="number of shear planes the shank crosses"),
    Field("name", "text", default="pin", help="what the connector is"),
    Field(
        "source",
        "text",
        default="average shear stress on the shank; mechanics of materials",
        help="where the allowable stress comes from",
    ),
)

#: ``type = "glue"``
GLUE = (
    Field(
        "tau",
        "stress",
        required=True,
        help="allowable shear stress of the glue line (usually that of the wood)",
    ),
    Field(
        "source", "text", default="allowable shear stress as stated in the job", help="where tau comes from"
    ),
    Field("name", "text", default="glue line", help="what the adhesive is"),
    Field(
        "rolling_shear",
        "stress",
        help="allowable rolling shear of plywood glued on its face (default: the plywood material's Fs)",
    ),
    Field("rolling_source", "text", help="where the rolling shear value comes from"),
    Field(
        "rolling_factor",
        "number",
        default=1.0,
        maximum=1.0,
        help="reduction the panel specification requires at this glue line (1.0: none)",
    ),
)

#: Fastener fit (NDS 2018 §12.1, §12.3.5; calcreport/solve/connectors/nds_fit.py).
STAGGERED = Field(
    "staggered",
    "bool",
    default=False,
    help="fasteners driven from opposite faces are staggered along the member (their points do not meet)",
)
CLINCHED = Field(
    "clinched",
    "bool",
    default=False,
    help="nails driven through the whole assembly and clinched on the far face (needs planes = 2)",
)

#: ``type = "nail"``
NAIL = (
    Field(
        "size", "text", help='pennyweight and type, e.g. "16d common", "10d box", "16d sinker", "20d spike"'
    ),
    Field("diameter", "length", help="shank diameter D (instead of size)"),
    Field("length", "length", help="nail length L (instead of size)"),
    Field("Fyb", "stress", help="bending yield strength (default by diameter, NDS nail table footnotes)"),
    Field("toe_nail", "bool", default=False, help="toe-nailed (Ctn = 0.83)"),
    Field("diaphragm", "bool", default=False, help="diaphragm construction (Cdi = 1.1)"),
    Field("name", "text", help="how the report names the nail"),
    STAGGERED,
    CLINCHED,
) + NDS_COMMON

#: ``type = "wood_screw"``
WOOD_SCREW = (
    Field("size", "text", help='gauge, e.g. "10g" (6g-24g)'),
    Field("diameter", "length", help="shank diameter D (instead of size)"),
    Field("root_diameter", "length", help="root diameter Dr (with diameter)"),
    Field("length", "length", required=True, help="screw length L"),
    Field("threads_in_plane", "bool", default=True, help="threaded part in the shear plane (use Dr)"),
    Field("Fyb", "stress", help="bending yield strength (default by diameter)"),
    Field("name", "text", help="how the report names the screw"),
    STAGGERED,
) + NDS_COMMON

#: ``type = "lag_screw"``
LAG_SCREW = (
    Field("size", "text", help='nominal diameter, e.g. "1/2" or "3/8 in" (1/4 to 1)'),
    Field("diameter", "length", help="shank diameter D (instead of size)"),
    Field("root_diameter", "length", help="root diameter Dr (with diameter)"),
    Field("length", "length", required=True, help="lag screw length L"),
    Field("tip_length", "length", help="tapered tip length E (default: D, conservative)"),
    Field("threads_in_plane", "bool", default=False, help="threaded part in the shear plane (use Dr)"),
    Field("Fyb", "stress", help="bending yield strength (default by diameter)"),
    Field("name", "text", help="how the report names the lag screw"),
    STAGGERED,
) + NDS_COMMON

#: ``type = "wood_bolt"``
WOOD_BOLT = (
    Field("diameter", "length", required=True, help="bolt diameter D (1/4 in to 1 in)"),
    Field("Fyb", "stress", help="bending yield strength (default 45,000 psi)"),
    Field("name", "text", help="how the report names the bolt"),
) + NDS_COMMON

# --- EN 1995-1-1 §8 keys of the wood dowel fasteners (settings.method = "EC5"); owner: ec5 -------
EC5_FU = Field(
    "fu",
    "stress",
    help="EC5: tensile strength of the nail wire or screw f_u, of the bolt f_u,k (EN 1995-1-1 eq. 8.14, "
    "8.30); required under EC5",
)
EC5_AXIAL = Field(
    "F_ax_Rk",
    "force",
    help="EC5: characteristic axial withdrawal capacity F_ax,Rk for the rope effect (EN 1995-1-1 §8.2.2(2)); "
    "none given: no rope effect",
)
EC5_PREDRILLED = Field(
    "predrilled", "bool", default=False, help="EC5: holes pre-drilled (EN 1995-1-1 eq. 8.16 embedment)"
)
EC5_NAIL = (
    EC5_FU,
    EC5_AXIAL,
    EC5_PREDRILLED,
    Field(
        "nail_shank",
        "choice",
        default="round",
        choices=("round", "square", "other"),
        help="EC5: smooth round, square/grooved or other (threaded) nail: M_y,Rk (8.14) and rope-effect limit",
    ),
)
EC5_SCREW = (EC5_FU, EC5_AXIAL, EC5_PREDRILLED)
EC5_BOLT = (
    EC5_FU,
    EC5_AXIAL,
    Field("dowel", "bool", default=False, help="EC5: a smooth dowel, not a bolt (no rope effect, §8.2.2(2))"),
)
#: The EC5 keys of each wood dowel model (the reader refuses them in an ASD or LRFD job).
EC5_KEYS = {
    "nail": tuple(f.name for f in EC5_NAIL),
    "wood_screw": tuple(f.name for f in EC5_SCREW),
    "wood_bolt": tuple(f.name for f in EC5_BOLT),
}
#: Connector keys of the NDS wood models that the EC5 route does not read (an error under EC5).
NDS_ONLY_KEYS = (
    "G_side",
    "G_main",
    "species",
    "Fyb",
    "CD",
    "wet_service",
    "CM",
    "Ct",
    "end_grain",
    "time_effect",
    "row_count",
    "row_spacing",
    "steel_form",
    "toe_nail",
    "diaphragm",
    "clinched",
    "staggered",
)
# --- end of EC5 keys ------------------------------------------------------------------------------


#: ``type = "steel_bolt"``
STEEL_BOLT = (
    Field("diameter", "length", required=True, help="nominal bolt diameter d"),
    Field(
        "group",
        "choice",
        default="A",
        choices=("A", "B", "C", "A307"),
        help="bolt group of Table J3.2: A (e.g. F3125 A325), B (A490), C (F3043), or A307 common bolts",
    ),
    Field(
        "threads",
        "choice",
        default="N",
        choices=("N", "X"),
        help="N: threads included in the shear plane; X: excluded",
    ),
    Field(
        "planes",
        "int",
        default=1,
        minimum=1,
        maximum=2,
        help="shear planes per bolt (2: held part in the middle)",
    ),
    Field(
        "hole",
        "choice",
        default="standard",
        choices=(
            "standard",
            "oversized",
            "short_slot_transverse",
            "short_slot_parallel",
            "long_slot_transverse",
            "long_slot_parallel",
        ),
        help='hole type; "transverse"/"parallel" = slot direction relative to the force',
    ),
    Field(
        "hole_length",
        "length",
        help="hole dimension along the force (default from Table J3.3 for standard and oversized holes)",
    ),
    Field(
        "deformation_limited",
        "bool",
        default=True,
        help="deformation at the bolt hole at service load is a design consideration (2.4·d·t·Fu)",
    ),
    Field("slip_critical", "bool", default=False, help="slip-critical joint (J3.8)"),
    Field(
        "surface",
        "choice",
        default="A",
        choices=("A", "B"),
        help="faying surface class: A (μ = 0.30) or B (μ = 0.50)",
    ),
    Field(
        "fillers",
        "int",
        default=0,
        positive=False,
        minimum=0,
        help="number of fillers between the connected parts",
    ),
    Field("pretension", "force", help="minimum bolt pretension Tb (default Table J3.1)"),
    Field(
        "held_thickness",
        "length",
        help="thickness of the held ply the bolt passes through (default: measured)",
    ),
    Field("other_thickness", "length", help="thickness of the other ply (each outer ply in double shear)"),
    Field(
        "weathering",
        "bool",
        default=False,
        help="unpainted weathering steel exposed to corrosion (J3.5b limits)",
    ),
    Field("name", "text", help="how the report names the bolt"),
)

#: ``type = "fillet_weld"``
FILLET_WELD = (
    Field("size", "length", required=True, help="fillet weld leg size w"),
    Field("FEXX", "stress", default="70 ksi", help="electrode classification strength (E70: 70 ksi)"),
    Field(
        "welds",
        "int",
        default=2,
        minimum=1,
        help="weld lines at the joint (2: both sides of a web, both edges of a plate)",
    ),
    Field("segment", "length", help="length of each intermittent segment; omit for continuous welds"),
    Field(
        "joint_form",
        "choice",
        default="auto",
        choices=("auto", "tee", "lap"),
        help="tee (stem against a plate) or lap (plate lying on a plate, welded along its edges)",
    ),
    Field("held_thickness", "length", help="plate thickness of the held part (default: measured)"),
    Field("other_thickness", "length", help="plate thickness of the other part (default: measured)"),
    Field("name", "text", help="how the report names the weld"),
)

#: ``type = "stud"``
STUD = (
    Field(
        "diameter",
        "length",
        required=True,
        help="stud shank diameter dsa (3/4 in or less; up to 1 in in solid slabs)",
    ),
    Field(
        "Fu",
        "stress",
        default="65 ksi",
        help="specified minimum tensile strength of the stud (65 ksi: AWS D1.1 Type B)",
    ),
    Field("fc", "stress", help="concrete f'c (default: the concrete part's material)"),
    Field(
        "wc",
        "weight_density",
        help="concrete unit weight (default: the concrete material's density, else 145 pcf)",
    ),
    Field(
        "deck",
        "choice",
        default="none",
        choices=("none", "parallel", "perpendicular"),
        help="formed steel deck: none (solid slab), ribs parallel or perpendicular to the beam",
    ),
    Field("rib_ratio", "number", help="wr/hr, average rib width over rib height (deck parallel)"),
    Field("per_rib", "int", default=1, minimum=1, help="studs in one deck rib (deck perpendicular)"),
    Field(
        "strong_position", "bool", default=False, help="deck perpendicular with e_mid-ht ≥ 2 in (Rp = 0.75)"
    ),
    Field("slab_thickness", "length", help="total slab thickness (default: the concrete part's depth)"),
    Field("length", "length", help="stud length after installation (checked ≥ 4·dsa)"),
    Field("base_thickness", "length", help="thickness of the flange the stud is welded to (dsa ≤ 2.5·t)"),
    Field("over_web", "bool", default=False, help="studs welded over the web (lifts the 2.5·t limit)"),
    Field(
        "lightweight",
        "bool",
        default=False,
        help="lightweight concrete (edge distance 10 in instead of 8 in)",
    ),
    Field("phi", "number", default=0.65, maximum=1.0, help="LRFD resistance factor per anchor"),
    Field("omega", "number", default=2.31, help="ASD safety factor per anchor"),
    Field("name", "text", help="how the report names the stud"),
)

#: ``type`` name in the job file → its keys, in the order the report lists the models.
CONNECTOR_FIELDS: dict[str, tuple[Field, ...]] = {
    "given": GIVEN,
    "given_line": GIVEN_LINE,
    "shank": SHANK,
    "glue": GLUE,
    "nail": NAIL + EC5_NAIL,
    "wood_screw": WOOD_SCREW + EC5_SCREW,
    "lag_screw": LAG_SCREW,
    "wood_bolt": WOOD_BOLT + EC5_BOLT,
    "steel_bolt": STEEL_BOLT,
    "fillet_weld": FILLET_WELD,
    "stud": STUD,
}

# --- slip of mechanical connectors (γ-method, issue 18) ---
#: Connector types that slip: each takes ``slip_modulus``, a tested value replacing the computed one.
SLIP_TYPES = ("given", "shank", "nail", "wood_screw", "lag_screw", "wood_bolt", "steel_bolt", "stud")
SLIP_MODULUS = Field(
    "slip_modulus",
    "line_load",
    help='slip modulus of one connector per shear plane from a test report, e.g. "1200 N/mm" '
    "(replaces EN 1995-1-1 Table 7.1 / NDS 2018 §11.3.6 in the γ-method)",
)
for _kind in SLIP_TYPES:
    CONNECTOR_FIELDS[_kind] = CONNECTOR_FIELDS[_kind] + (SLIP_MODULUS,)
# --- end slip ---


def kinds() -> list[str]:
    """All connector type names, in registration order."""
    return list(CONNECTOR_FIELDS)


def fields_for(kind: str) -> tuple[Field, ...]:
    """The keys of connector type ``kind`` (KeyError if unknown)."""
    return CONNECTOR_FIELDS[kind]
