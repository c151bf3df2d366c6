"""Numbers (issue 13, item 7): subnormal, NaN and infinite magnitudes are refused for every
quantity; a bare TOML number where text is expected is refused instead of stringified; every JSON
the tool writes is strict, checked here with a parser that rejects NaN and Infinity.

IEEE 754 binary64 facts (the standard, §3.4; Python's ``sys.float_info.min`` = 2.2250738585072014e-308
is the smallest normal double): below that, floats are subnormal and keep fewer than 53 bits, so a
value written there cannot be held as written.
"""

from __future__ import annotations

import json
import math

import pytest

from calcreport.errors import JobError
from calcreport.jobfile.lines import LineIndex
from calcreport.jobfile.reader import Source, Table
from calcreport.outputs.fmt import json_number
from calcreport.outputs.json_out import dumps
from calcreport.units import DIMENSIONS, UnitParseError, parse
from tests.conftest import job_text
from tests.test_bad_input import GOOD

UNIT = {
    "length": "in",
    "area": "in^2",
    "volume": "in^3",
    "inertia": "in^4",
    "force": "lbf",
    "stress": "psi",
    "line_load": "plf",
    "moment": "kip*ft",
    "weight_density": "pcf",
    "mass_density": "kg/m^3",
}


def strict_loads(text: str):
    """json.loads that refuses the non-standard NaN, Infinity and -Infinity (RFC 8259 §6)."""

    def refuse(name):
        raise ValueError(f"non-standard JSON constant {name}")

    return json.loads(text, parse_constant=refuse)


@pytest.mark.parametrize("dim", sorted(DIMENSIONS))
@pytest.mark.parametrize("mag", ["5e-324", "1e-310", "-4e-320", "nan", "inf", "-inf", "1e309"])
def test_every_dimension_refuses_unusable_magnitudes(dim, mag):
    with pytest.raises(UnitParseError):
        parse(f"{mag} {UNIT[dim]}", dim)


def test_overflow_in_base_units_and_tiny_normal_values():
    with pytest.raises(UnitParseError, match="finite"):
        parse("1e308 mi", "length")  # finite as written, infinite in metres
    with pytest.raises(UnitParseError, match="too small"):
        parse("2.5e-308 in", "length")  # normal as written, subnormal in metres
    assert parse("1e-300 mm", "length").magnitude == 1e-300
    assert parse("0 in", "length").magnitude == 0


def _refused(cli, path, *words):
    code, out, err = cli("check", path)
    assert code == 2 and "Traceback" not in err, err
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    for w in words:
        assert w in lines[0], (w, lines[0])


@pytest.mark.parametrize("value", ['"5e-324 in"', '"nan in"', '"-inf in"'])
def test_job_file_quantity_refused_with_key_and_line(write_job, cli, value):
    text = job_text(GOOD).replace('depth = "10 in"', f"depth = {value}", 1)
    _refused(cli, write_job(text), "member[M].part[web].depth", value.strip('"'))


@pytest.mark.parametrize(
    "key, raw", [("project", "nan"), ("project", "-inf"), ("revision", "1.10"), ("number", "1_000")]
)
def test_bare_numbers_where_text_is_expected_are_refused(write_job, cli, key, raw):
    text = job_text(GOOD)
    lines = [ln for ln in text.splitlines() if not ln.startswith(f"{key} =")]
    text = "\n".join(lines).replace("[job]", f"[job]\n{key} = {raw}", 1) + "\n"
    _refused(cli, write_job(text), f"job.{key}", "expected text in quotes")


def test_plain_number_refuses_subnormals():
    t = Table({"x": 5e-324, "y": 1e-300}, Source("f.toml", LineIndex("")), (), "")
    with pytest.raises(JobError, match="too small"):
        t.number("x")
    assert t.number("y") == 1e-300


def test_json_numbers_are_strict():
    assert json_number(float("inf")) is None and json_number(float("nan")) is None
    assert json_number(1.23456789) == 1.23457
    with pytest.raises(ValueError):
        dumps({"x": float("nan")})  # allow_nan=False: never written
    assert strict_loads(dumps({"x": json_number(-math.inf)})) == {"x": None}


def test_everything_the_tool_writes_as_json_is_strict(write_job, cli, tmp_path):
    job = write_job(job_text(GOOD))
    code, out, err = cli("check", job, "--json")
    assert code == 0, err
    strict_loads(out)
    new = write_job(job_text(GOOD).replace('value = "100 lbf"', 'value = "120 lbf"'), "new.toml")
    code, out, err = cli("diff", job, new, "--json")
    assert code in (0, 1), err
    strict_loads(out)
    code, out, err = cli("build", job, "-o", str(tmp_path / "out") + "/", "--json")
    assert code == 0, err
    strict_loads((tmp_path / "out" / "job.json").read_text(encoding="utf-8"))
