"""JSON Schemas: one for job files, generated from the key declarations the reader validates
against (:mod:`calcreport.keys`), and one for the results JSON (``check --json``, ``build --json``),
versioned with its ``schema`` number (:data:`calcreport.outputs.json_out.SCHEMA_VERSION`).

The job-file schema is shipped as ``calcreport/data/job.schema.json`` so that an editor's TOML
language server can use it (a ``#:schema`` comment on the first line of a job file). After adding
a key, regenerate it: ``python -m calcreport schema > calcreport/data/job.schema.json``
(``tests/test_schema.py`` fails while the shipped copy is stale).
"""

from __future__ import annotations

import json
from typing import Any

from .fields import Field
from .keys.connectors import CONNECTOR_FIELDS
from .keys.job import ROOT, TableSpec

__all__ = ["job_schema", "results_schema", "dumps", "JOB_SCHEMA_ID", "RESULTS_SCHEMA_ID"]

JOB_SCHEMA_ID = "calcreport-job.schema.json"
RESULTS_SCHEMA_ID = "calcreport-results.schema.json"
DRAFT = "https://json-schema.org/draft/2020-12/schema"

_DIMENSION_EXAMPLES = {
    "length": '"3.5 in", "1-1/2 in", "89 mm"',
    "force": '"4.2 kip", "18 kN"',
    "stress": '"1600 psi", "11 MPa"',
    "line_load": '"250 plf", "3.6 kN/m"',
    "area": '"16.9 in^2"',
    "inertia": '"204 in^4"',
    "weight_density": '"35 pcf", "5.5 kN/m^3"',
    "moment": '"12 kip*ft"',
}


def _text(help_: str, extra: str = "") -> str:
    return (help_ + (f" ({extra})" if extra else "")).strip()


def _field(f: Field) -> dict[str, Any]:
    """The JSON Schema of one declared key (TOML values as JSON types)."""
    out: dict[str, Any]
    if f.kind == "text":
        out = {"type": ["string", "number"]}
    elif f.kind == "id":
        out = {"type": "string", "minLength": 1, "maxLength": 60}
    elif f.kind == "unit":
        out = {"type": "string"}
    elif f.kind == "texts":
        out = {"anyOf": [{"type": "string"}, {"type": "array", "items": {"type": "string"}}]}
    elif f.kind == "ids":
        out = {"anyOf": [{"type": "string"}, {"type": "array", "items": {"type": "string"}, "minItems": 1}]}
    elif f.kind == "point":
        out = {"type": "array", "items": {"type": "string"}, "minItems": 2, "maxItems": 2}
    elif f.kind == "points":
        point = {"type": "array", "items": {"type": "string"}, "minItems": 2, "maxItems": 2}
        out = {"type": "array", "items": point, "minItems": 3}
    elif f.kind == "int":
        out = {"type": "integer", "minimum": int(f.minimum if f.minimum is not None else 1)}
        out["maximum"] = int(f.maximum if f.maximum is not None else 10_000)
    elif f.kind == "number":
        out = {"type": "number"}
        if f.minimum is not None:
            out["minimum"] = f.minimum
        elif f.positive:
            out["exclusiveMinimum"] = 0
        if f.maximum is not None:
            out["maximum"] = f.maximum
    elif f.kind == "bool":
        out = {"type": "boolean"}
    elif f.kind == "choice":
        out = {"type": "string", "enum": list(f.choices)}
    else:  # a dimension: text with a unit
        example = _DIMENSION_EXAMPLES.get(f.kind, "")
        out = {"type": "string", "description": ""}
        f_help = _text(
            f.help, f"a {f.kind.replace('_', ' ')} with its unit, e.g. {example}" if example else ""
        )
        out["description"] = f_help
    out.setdefault("description", f.help)
    if f.default is not None and f.kind not in ("int", "number", "bool", "choice", "text"):
        out["default"] = f.default
    elif f.default is not None and f.default != "":
        out["default"] = f.default
    return {k: v for k, v in out.items() if v != ""}


def _connector() -> dict[str, Any]:
    """``[member.joint.connector]``: ``type`` picks the keys (one branch per connector model)."""
    branches = []
    for kind, fields in CONNECTOR_FIELDS.items():
        props: dict[str, Any] = {"type": {"const": kind}}
        props.update({f.name: _field(f) for f in fields})
        branch: dict[str, Any] = {
            "if": {"properties": {"type": {"const": kind}}, "required": ["type"]},
            "then": {
                "properties": props,
                "required": ["type"] + [f.name for f in fields if f.required],
                "additionalProperties": False,
            },
        }
        branches.append(branch)
    return {
        "type": "object",
        "description": "the connector across the joint's shear plane; its keys depend on type",
        "properties": {"type": {"enum": list(CONNECTOR_FIELDS), "description": "connector model"}},
        "required": ["type"],
        "allOf": branches,
    }


def _table(spec: TableSpec) -> dict[str, Any]:
    if spec.connector:
        return _connector()
    props: dict[str, Any] = {f.name: _field(f) for f in spec.fields}
    for sub in spec.tables:
        props[sub.name] = _table_or_array(sub)
    out: dict[str, Any] = {"type": "object", "description": spec.help, "properties": props}
    required = [f.name for f in spec.fields if f.required] + [t.name for t in spec.tables if t.required]
    if required:
        out["required"] = required
    if spec.name == "member":  # a member is described by its parts or by its plies (issue 14)
        out["anyOf"] = [{"required": ["part"]}, {"required": ["ply"]}]
    if spec.free:
        out["additionalProperties"] = {"type": spec.free}
    else:
        out["additionalProperties"] = False
    if not spec.help:
        del out["description"]
    return out


def _table_or_array(spec: TableSpec) -> dict[str, Any]:
    table = _table(spec)
    if not spec.array:
        return table
    return {"type": "array", "description": spec.help, "items": table, "minItems": 1 if spec.required else 0}


def job_schema() -> dict[str, Any]:
    """The JSON Schema of a job file (TOML read as JSON), from :data:`calcreport.keys.job.ROOT`."""
    out = _table(ROOT)
    return {
        "$schema": DRAFT,
        "$id": JOB_SCHEMA_ID,
        "title": "calcreport job file",
        "description": "A calcreport job file (generated from the key declarations its reader "
        "validates against). The reader checks more than the schema can: units, ids that refer to "
        "each other, geometry.",
        **{k: v for k, v in out.items() if k != "description"},
    }


def _quantity() -> dict[str, Any]:
    return {
        "type": "object",
        "properties": {
            "value": {"anyOf": [{"type": "number"}, {"type": "null"}]},
            "unit": {"type": "string"},
        },
        "required": ["value", "unit"],
        "additionalProperties": False,
    }


def results_schema() -> dict[str, Any]:
    """The JSON Schema of the results JSON, version :data:`~calcreport.outputs.json_out.SCHEMA_VERSION`."""
    from .outputs.json_out import SCHEMA_VERSION

    q = {"$ref": "#/$defs/quantity"}
    q_or_null = {"anyOf": [q, {"type": "null"}]}
    value = {"anyOf": [q, {"type": ["number", "string", "boolean", "null"]}]}
    status = {"enum": ["OK", "NG"]}
    phrase = {
        "type": "object",
        "description": "the data the label or note was worded from (a wording's kind and its values)",
        "properties": {
            "kind": {"type": "string"},
            "values": {"type": "object", "additionalProperties": value},
        },
        "required": ["kind", "values"],
        "additionalProperties": False,
    }
    step = {
        "type": "object",
        "properties": {
            "key": {"type": "string"},
            "label": {"type": "string"},
            "symbol": {"type": "string"},
            "substituted": {"type": "string"},
            "values": {"type": "object", "additionalProperties": value},
            "result": value,
            "source": {"type": "string"},
            "note": {"type": "string"},
            "governs": {"type": "boolean"},
            "group": {"type": "string", "description": "table of repeated formulas the step belongs to"},
            "row": {"type": "string", "description": "the item (part, zone, combination) of its table"},
            "column": {
                "type": "string",
                "description": "the quantity of its table; no row: the column's total",
            },
            "phrase": phrase,
        },
        "required": ["key", "label", "symbol", "substituted", "values", "result", "source"],
    }
    check = {
        "type": "object",
        "properties": {
            "key": {"type": "string"},
            "label": {"type": "string"},
            "demand": value,
            "capacity": value,
            "ratio": value,
            "status": {"type": "string"},
            "source": {"type": "string"},
            "note": {"type": "string"},
            "step": {"type": "string", "description": "key of the step stating the check's limit or working"},
            "phrase": phrase,
        },
        "required": ["key", "label", "status", "source"],
    }
    joint = {
        "type": "object",
        "properties": {
            "id": {"type": "string"},
            "label": {"type": "string"},
            "holds": {"type": "array", "items": {"type": "string"}},
            "connector": {"type": "string"},
            "connector_source": {"type": "string"},
            "per_row": {"type": "integer"},
            "continuous": {"type": "boolean"},
            "Q": q_or_null,  # null on fastener lines between plies (no shear flow V·Q/I)
            "shear": q,
            "shear_flow": q,
            "capacity": q,
            "capacity_row": q,
            "spacing_required": q_or_null,
            "spacing_provided": q_or_null,
            "spacing_min": q_or_null,
            "spacing_max": q_or_null,
            "plane_width": q,
            "utilisation": value,
            "status": status,
            "reasons": {"type": "array", "items": {"type": "string"}},
            "checks": {"type": "array", "items": {"$ref": "#/$defs/check"}},
            "steps": {"type": "array", "items": {"$ref": "#/$defs/step"}},
            "schedule": {"type": "object", "description": "zoned connector schedule along the member"},
        },
        "required": ["id", "connector", "shear_flow", "capacity", "status", "checks", "steps"],
    }
    part = {
        "type": "object",
        "properties": {"id": {"type": "string"}, "area": q, "n": value, "centroid": q, "I_own": q},
        "required": ["id", "area", "n", "centroid", "I_own"],
    }
    member = {
        "type": "object",
        "properties": {
            "id": {"type": "string"},
            "title": {"type": "string"},
            "status": status,
            "section": {
                "type": "object",
                "properties": {
                    "area": q,
                    "centroid": q,
                    "I": q,
                    "depth": q,
                    "E_ref": q,
                    "reference_material": {"type": "string"},
                    "parts": {"type": "array", "items": part},
                },
                "required": ["area", "centroid", "I", "depth", "parts"],
            },
            "shear": q,
            "joints": {"type": "array", "items": {"$ref": "#/$defs/joint"}},
            "checks": {"type": "array", "items": {"$ref": "#/$defs/check"}},
            "steps": {"type": "array", "items": {"$ref": "#/$defs/step"}},
            "along": {"type": "object", "description": "beam analysis: reactions, envelopes, combinations"},
            "slip": {
                "type": "object",
                "description": "γ-method (EN 1995-1-1 Annex B) beside the rigid results: layers, joints, "
                "(EI)_ef, deflections (with [member.design] slip = true)",
            },
        },
        "required": ["id", "status", "section", "shear", "joints", "checks", "steps"],
    }
    result = {
        "type": "object",
        "properties": {
            "schema": {"const": SCHEMA_VERSION},
            "tool": {
                "type": "object",
                "properties": {"name": {"const": "calcreport"}, "version": {"type": "string"}},
                "required": ["name", "version"],
            },
            "job": {
                "type": "object",
                "properties": {
                    "file": {"type": "string"},
                    "sha256": {"type": "string", "pattern": "^[0-9a-f]{64}$"},
                    "project": {"type": "string"},
                    "number": {"type": "string"},
                    "revision": {"type": "string"},
                    "units": {"enum": ["US", "SI"]},
                    "method": {"enum": ["ASD", "LRFD", "EC5"]},
                },
                "required": ["file", "sha256", "project", "units", "method"],
            },
            "status": status,
            "members": {"type": "array", "items": {"$ref": "#/$defs/member"}},
        },
        "required": ["schema", "tool", "job", "status", "members"],
    }
    return {
        "$schema": DRAFT,
        "$id": RESULTS_SCHEMA_ID,
        "title": f"calcreport results, schema {SCHEMA_VERSION}",
        "description": 'Results of check --json and build --json: one job, or {"jobs": [...]} for several. '
        "Quantities are {value, unit} in the job's unit system.",
        "anyOf": [
            {"$ref": "#/$defs/result"},
            {
                "type": "object",
                "properties": {"jobs": {"type": "array", "items": {"$ref": "#/$defs/result"}}},
                "required": ["jobs"],
                "additionalProperties": False,
            },
        ],
        "$defs": {
            "quantity": _quantity(),
            "step": step,
            "check": check,
            "joint": joint,
            "member": member,
            "result": result,
        },
    }


def dumps(schema: dict[str, Any]) -> str:
    """Stable text of a schema (two-space indent, UTF-8 kept, trailing newline)."""
    return json.dumps(schema, indent=2, ensure_ascii=False) + "\n"
