"""Keys of the steel connector models (AISC 360-16 bolts, fillet welds, headed studs), as data;
gathered with the other models in :data:`calcreport.keys.connectors.CONNECTOR_FIELDS`. The ``help``
texts are the schema's descriptions.
"""

from __future__ import annotations

from ..fields import Field

__all__ = ["STEEL_BOLT", "FILLET_WELD", "STUD"]

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
