"""Results as JSON: stable for git (sorted keys, 6 significant figures, no timestamps).

Every quantity is ``{"value": number, "unit": "text"}`` in the job's unit system.
"""

from __future__ import annotations

import json
import os
from dataclasses import fields, is_dataclass
from pathlib import Path
from typing import Any

from .. import __version__
from ..safewrite import write_atomic
from ..solve.results import Assumed, Check, JobResult, JointResult, MemberResult, Unchecked
from ..steps import Step
from ..units import Quantity
from .fmt import Display
from .json_loads import along_json, schedule_json
from .phrases import check_label, check_note, phrase_json, step_note

__all__ = ["to_dict", "dumps", "write_results_json", "json_path_for", "SCHEMA_VERSION"]

SCHEMA_VERSION = 1


def _scalar(v: Any, d: Display) -> Any:
    """A step/check value as JSON; numpy scalars (np.int64, np.bool_) become plain Python first."""
    if not isinstance(v, (Quantity, str, bool, int, float)) and hasattr(v, "item"):
        v = v.item()
    return d.json_value(v)


def _step(s: Step, d: Display) -> dict[str, Any]:
    out = _step_fields(s, d)
    for name in ("group", "row", "column"):  # table placement, only when the solver set it
        value = getattr(s, name)
        if value:
            out[name] = value
    return out


def _step_fields(s: Step, d: Display) -> dict[str, Any]:
    return {
        "key": s.key,
        "label": s.label,
        "symbol": s.symbol,
        "substituted": d.substituted(s),
        "values": {k: _scalar(v, d) for k, v in s.values.items()},
        "result": _scalar(s.result, d),
        "source": s.source,
        "note": step_note(s, d),
        "governs": s.governs,
        **phrase_json(s.phrase, d),
    }


def _check(c: Check, d: Display) -> dict[str, Any]:
    out = _check_fields(c, d)
    if c.scope:
        out["scope"] = c.scope
    return out


def _check_fields(c: Check, d: Display) -> dict[str, Any]:
    return {
        "key": c.key,
        "label": check_label(c, d),
        "demand": _scalar(c.demand, d),
        "capacity": _scalar(c.capacity, d),
        "ratio": _scalar(c.ratio, d),
        "status": c.status,
        "source": c.source,
        "note": check_note(c, d),
        **({"step": c.step} if c.step else {}),
        **phrase_json(c.phrase, d),
    }


def _unchecked(u: Unchecked) -> dict[str, Any]:
    return {"key": u.key, "label": u.label, "clause": u.clause, "reason": u.reason}


def _assumed(a: Assumed, d: Display) -> dict[str, Any]:
    return {
        "key": a.key,
        "label": a.label,
        "value": _scalar(a.value, d),
        "where": a.where,
        "source": a.source,
    }


def _plain(v: Any, d: Display) -> Any:
    """Generic conversion for attached records (schedules, beam results)."""
    if isinstance(v, Quantity):
        if getattr(v.magnitude, "shape", ()):
            return [d.json_value(x) for x in v]
        return d.json_value(v)
    if isinstance(v, Step):
        return _step(v, d)
    if isinstance(v, Check):
        return _check(v, d)
    if is_dataclass(v) and not isinstance(v, type):
        if hasattr(v, "to_json"):
            return v.to_json(d)
        return {f.name: _plain(getattr(v, f.name), d) for f in fields(v) if not f.name.startswith("_")}
    if isinstance(v, dict):
        return {str(k): _plain(x, d) for k, x in v.items()}
    if isinstance(v, (list, tuple)):
        return [_plain(x, d) for x in v]
    if hasattr(v, "tolist") and not isinstance(v, (str, bool, int, float)):
        return _plain(v.tolist(), d)
    return d.json_value(v)


def _joint(j: JointResult, d: Display) -> dict[str, Any]:
    out = {
        "id": j.id,
        "label": j.label,
        "holds": list(j.holds),
        "connector": j.connector,
        "connector_source": j.connector_source,
        "per_row": j.per_row,
        "continuous": j.continuous,
        "Q": d.json_value(j.Q),
        "shear": d.json_value(j.shear),
        "shear_flow": d.json_value(j.shear_flow),
        "capacity": d.json_value(j.capacity),
        "capacity_row": d.json_value(j.capacity_row),
        "spacing_required": d.json_value(j.spacing_required) if j.spacing_required is not None else None,
        "spacing_provided": d.json_value(j.spacing_provided) if j.spacing_provided is not None else None,
        "spacing_min": d.json_value(j.spacing_min) if j.spacing_min is not None else None,
        "spacing_max": d.json_value(j.spacing_max) if j.spacing_max is not None else None,
        "plane_width": d.json_value(j.plane_width),
        "utilisation": d.json_value(j.utilisation),
        "status": j.status,
        "reasons": list(j.reasons),
        "checks": [_check(c, d) for c in j.checks],
        "steps": [_step(s, d) for s in j.steps],
    }
    if j.schedule is not None:
        out["schedule"] = schedule_json(j.schedule, d)
    return out


def _member(m: MemberResult, d: Display) -> dict[str, Any]:
    s = m.section
    out = {
        "id": m.id,
        "title": m.member.title,
        "status": m.status,
        "section": {
            "area": d.json_value(s.area),
            "centroid": d.json_value(s.centroid),
            "I": d.json_value(s.inertia),
            "depth": d.json_value(s.depth),
            "E_ref": d.json_value(s.E_ref),
            "reference_material": s.reference_material,
            "parts": [
                {
                    "id": p.id,
                    "area": d.json_value(p.area),
                    "n": d.json_value(p.n),
                    "centroid": d.json_value(p.centroid_y),
                    "I_own": d.json_value(p.inertia_own),
                }
                for p in s.parts
            ],
        },
        "shear": d.json_value(m.shear),
        "joints": [_joint(j, d) for j in m.joints],
        "checks": [_check(c, d) for c in m.checks],
        "steps": [_step(st, d) for st in m.steps],
        "checked": list(m.checked),
        "connectors_only": m.connectors_only,
        "not_checked": [_unchecked(u) for u in m.not_checked],
        "assumed": [_assumed(a, d) for a in m.assumed],
    }
    if m.beam is not None:
        out["along"] = along_json(m.beam, d)
    if m.slip is not None:  # γ-method beside the rigid results (solve/slip.py SlipResult)
        out["slip"] = _plain(m.slip, d)
    return out


def to_dict(result: JobResult) -> dict[str, Any]:
    """The whole result as plain JSON-ready data."""
    job = result.job
    d = Display(job.settings.units, job.settings.display)
    h = job.header
    return {
        "schema": SCHEMA_VERSION,
        "tool": {"name": "calcreport", "version": __version__},
        "job": {
            "file": os.path.basename(job.path),
            "sha256": job.sha256,
            "project": h.project,
            "number": h.number,
            "revision": h.revision,
            "units": job.settings.units,
            "method": job.settings.method,
        },
        "status": result.status,
        "assumed": [_assumed(a, d) for a in result.assumed],
        "members": [_member(m, d) for m in result.members],
        **_read_notes(job, d),
    }


def _read_notes(job, d: Display) -> dict[str, Any]:
    """Keys without effect and values written as products or quotients, only when there are any
    (so a job with neither keeps the same JSON)."""
    out: dict[str, Any] = {}
    if job.warnings:
        out["warnings"] = [{"key": w.key, "line": w.line, "message": w.message} for w in job.warnings]
    if job.written:
        out["written"] = [
            {"key": v.key, "line": v.line, "text": v.text, "value": d.json_value(v.value)}
            for v in job.written
        ]
    return out


def dumps(data: Any) -> str:
    """Stable, strict JSON text: sorted keys, two-space indent, UTF-8 kept, trailing newline; no
    NaN or Infinity (``allow_nan=False``; :func:`.fmt.json_number` writes those as null)."""
    return json.dumps(data, sort_keys=True, indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def json_path_for(pdf_path: str | os.PathLike) -> Path:
    """Where ``build --json`` writes the results: beside the PDF, same name, ``.json``."""
    return Path(pdf_path).with_suffix(".json")


def write_results_json(result: JobResult, pdf_path: str | os.PathLike) -> Path:
    """Write the stable results JSON next to ``pdf_path`` atomically; return its path.

    The text is the same as ``calcreport check --json`` for one job: sorted keys, 6 significant
    figures, no timestamps, only the job file's base name. A temporary file in the same folder is
    renamed over the target, so a reader never sees a half-written file.
    """
    return write_atomic(dumps(to_dict(result)), json_path_for(pdf_path))
