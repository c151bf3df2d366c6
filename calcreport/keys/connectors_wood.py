"""Keys of the wood dowel fastener models (NDS 2018 nail, wood screw, lag screw, wood bolt) and
their EN 1995-1-1 §8 keys (``settings.method = "EC5"``), as data; gathered with the other models in
:data:`calcreport.keys.connectors.CONNECTOR_FIELDS`. The ``help`` texts are the schema's descriptions.
"""

from __future__ import annotations

from ..fields import Field

__all__ = [
    "NDS_COMMON",
    "STAGGERED",
    "CLINCHED",
    "NAIL",
    "WOOD_SCREW",
    "LAG_SCREW",
    "WOOD_BOLT",
    "EC5_NAIL",
    "EC5_SCREW",
    "EC5_BOLT",
    "EC5_KEYS",
    "NDS_ONLY_KEYS",
]

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
    "predrilled",
    "bool",
    default=False,
    help="holes pre-drilled (EN 1995-1-1): EC5 embedment by eq. 8.16, Table 8.2 distances, no "
    "§8.3.1.2(6) thickness check; a nail's slip modulus K_ser by the pre-drilled row of Table 7.1",
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
