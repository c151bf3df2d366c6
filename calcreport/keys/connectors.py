"""Keys of each connector model's ``[member.joint.connector]`` table, as data.

The job-file reader validates a connector table against these declarations and hands the model
typed values (:meth:`calcreport.jobfile.reader.Table.fields`); the JSON Schema for job files is
generated from them (:mod:`calcreport.schema`); each model in :mod:`calcreport.solve.connectors`
takes its ``FIELDS`` from here. The ``help`` texts are the schema's descriptions. This module holds
the general models (``given``, ``given_line``, ``shank``, ``glue``) and the registry; the wood dowel
fasteners' keys (NDS and EC5) are in :mod:`.connectors_wood`, the steel models' in
:mod:`.connectors_steel`; their names stay importable from here.
"""

from __future__ import annotations

from ..fields import Field
from .connectors_steel import FILLET_WELD, STEEL_BOLT, STUD
from .connectors_wood import (
    CLINCHED,
    EC5_BOLT,
    EC5_KEYS,
    EC5_NAIL,
    EC5_SCREW,
    LAG_SCREW,
    NAIL,
    NDS_COMMON,
    NDS_ONLY_KEYS,
    STAGGERED,
    WOOD_BOLT,
    WOOD_SCREW,
)

__all__ = [
    "CONNECTOR_FIELDS",
    "NDS_COMMON",
    "EC5_KEYS",
    "NDS_ONLY_KEYS",
    "STAGGERED",
    "CLINCHED",
    "kinds",
    "fields_for",
]


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
