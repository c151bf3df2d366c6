"""The tables inside ``[[member]]`` (parts, joints and their connector, supports, loads, load
combinations, member-check inputs, plies and their fastening), as data. Split from
:mod:`calcreport.keys.job`, which re-exports them and assembles ``MEMBER`` and ``ROOT``."""

from __future__ import annotations

from ..fields import Field
from .table_spec import LOAD_ENTRIES, LOAD_KINDS, SHAPES, SUPPORT_TYPES, TableSpec

__all__ = [
    "PART",
    "CONNECTOR",
    "JOINT",
    "SUPPORT",
    "LOAD",
    "FACTORS",
    "COMBINATION",
    "DESIGN",
    "PLY",
    "PLY_CONNECTOR",
    "PLY_FASTENING",
]


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
