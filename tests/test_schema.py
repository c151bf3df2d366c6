"""The JSON Schemas: the shipped job-file schema is the one the declarations generate, every demo
and starter job validates against it, and results JSON validates against the results schema.

jsonschema (a general-purpose reference validator, test-only dependency) checks the documents.
"""

from __future__ import annotations

import json
import tomllib
from pathlib import Path

import pytest

jsonschema = pytest.importorskip("jsonschema")

from calcreport.outputs.json_out import to_dict  # noqa: E402
from calcreport.pipeline import solve_file  # noqa: E402
from calcreport.resources import templates_dir  # noqa: E402
from calcreport.schema import dumps, job_schema, results_schema  # noqa: E402

ROOT = Path(__file__).resolve().parents[1]
SHIPPED = ROOT / "calcreport" / "data" / "job.schema.json"
JOBS = sorted((ROOT / "jobs").glob("*.toml")) + sorted(
    Path(str(p)) for p in templates_dir().iterdir() if p.name.startswith("starter-")
)


def _validator(schema):
    cls = jsonschema.validators.validator_for(schema)
    cls.check_schema(schema)
    return cls(schema)


def test_shipped_schema_is_current():
    """Regenerate with: python -m calcreport schema > calcreport/data/job.schema.json"""
    assert SHIPPED.read_text(encoding="utf-8") == dumps(job_schema())


@pytest.mark.parametrize("path", JOBS, ids=lambda p: p.name)
def test_every_demo_and_starter_job_validates(path):
    doc = tomllib.loads(path.read_text(encoding="utf-8"))
    errors = sorted(_validator(json.loads(SHIPPED.read_text())).iter_errors(doc), key=str)
    assert not errors, [f"{'.'.join(map(str, e.absolute_path))}: {e.message}" for e in errors]


def test_schema_and_reader_refuse_the_same_misspelt_keys(tmp_path):
    v = _validator(job_schema())
    text = (ROOT / "jobs" / "boathouse-door-header.toml").read_text(encoding="utf-8")
    doc = tomllib.loads(text)
    assert not list(v.iter_errors(doc))
    for table, bad in (("settings", "spacing_stepp"), ("job", "projet")):
        mutated = tomllib.loads(text)
        mutated[table][bad] = "1 in"
        assert list(v.iter_errors(mutated)), bad
    connector = doc["member"][0]["joint"][0]["connector"]
    connector["diametre"] = "0.1 in"
    assert list(v.iter_errors(doc))


def test_unknown_connector_type_is_refused():
    v = _validator(job_schema())
    doc = tomllib.loads((ROOT / "jobs" / "boathouse-door-header.toml").read_text(encoding="utf-8"))
    doc["member"][0]["joint"][0]["connector"] = {"type": "rivet"}
    assert list(v.iter_errors(doc))


@pytest.mark.parametrize("path", sorted((ROOT / "jobs").glob("*.toml")), ids=lambda p: p.name)
def test_results_json_validates(path):
    data = json.loads(json.dumps(to_dict(solve_file(str(path)))))
    errors = list(_validator(results_schema()).iter_errors(data))
    assert not errors, [f"{'.'.join(map(str, e.absolute_path))}: {e.message}" for e in errors[:5]]
    assert data["schema"] == results_schema()["$defs"]["result"]["properties"]["schema"]["const"]


def test_schema_command_prints_both(capsys):
    from calcreport.cli import main

    assert main(["schema"]) == 0
    assert json.loads(capsys.readouterr().out)["$id"] == job_schema()["$id"]
    assert main(["schema", "--results"]) == 0
    assert "results" in json.loads(capsys.readouterr().out)["title"]


def test_unit_examples_in_the_schema_are_read_by_the_tool():
    """Every example a key description offers is accepted by the reader's unit parser."""
    from calcreport.schema import _DIMENSION_EXAMPLES
    from calcreport.units import parse

    for dim, examples in _DIMENSION_EXAMPLES.items():
        for example in examples.split(", "):
            assert parse(example.strip('"'), dim) is not None, (dim, example)
