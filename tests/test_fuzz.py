"""Fuzzed job files: the command line never shows a traceback; every failure is exit 2 with one line
naming the file (and key). Two generators: random TOML structure built from our key vocabulary with
random values, units and unicode; and mutated copies of the demo jobs (run through `check`), and a smaller number of mutated demo
jobs run through `build` to a temporary folder, which must then hold the one report (exit 0/1) or
nothing at all (exit 2), never a temporary file. Together over 2,000 cases per run (common practice
for robustness testing, no source). The example counts keep the file within about a minute and a
half on two cores."""

from __future__ import annotations

import json
import random
import string
from pathlib import Path

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from calcreport.cli import main
from tests.conftest import run_cli

ROOT = Path(__file__).resolve().parent.parent
DEMOS = [p.read_text(encoding="utf-8") for p in sorted((ROOT / "jobs").glob("*.toml"))]

KEYS = [
    "id",
    "shape",
    "width",
    "depth",
    "thickness",
    "size",
    "flat",
    "upright",
    "diameter",
    "points",
    "area",
    "inertia",
    "centroid",
    "material",
    "on",
    "below",
    "left_of",
    "right_of",
    "at",
    "align",
    "offset",
    "holds",
    "per_row",
    "type",
    "value",
    "source",
    "name",
    "tau",
    "planes",
    "shear",
    "E",
    "Fv",
    "G",
    "density",
    "units",
    "method",
    "spacing_step",
    "spacing_max",
    "spacing_min",
    "project",
    "label",
    "title",
    "family",
    "reference_material",
    "width",
    "template",
    "revision",
    "mark",
    "span",
    "self_weight",
    "case",
    "kind",
    "w",
    "P",
    "from",
    "to",
    "w_start",
    "w_end",
    "factors",
    "zones_per_half",
    "zones_per_span",
    "zone_module",
    "size",
    "segment",
    "welds",
    "G_side",
    "group",
    "threads",
    "deck",
]
VALUES = [
    "1 in",
    "0 in",
    "-2 in",
    "2x10",
    "2x99",
    "10 kip",
    "1600 ksi",
    "rect",
    "lumber",
    "plate",
    "bar",
    "polygon",
    "rolled",
    "given",
    "shank",
    "glue",
    "given_line",
    "wood",
    "web",
    "fl",
    "top",
    "US",
    "SI",
    "ASD",
    "LRFD",
    "1e308 in",
    "nan in",
    "inf kip",
    "1/0 in",
    "in",
    "",
    "ǝʃᴉɟ",
    "<b>&</b>",
    "1-1/2 in",
    "5 plf",
    "3 psf",
    "__import__('os')",
    "1 in * 2 in",
    "9" * 400 + " in",
    "centre",
    "left",
    "top",
    "1 in ** 99",
    "uniform",
    "point",
    "linear",
    "D",
    "L",
    "S",
    "W",
    "28 ft",
    "1e9 ft",
    "16d common",
    "10d box",
    "5/16 in",
    "nail",
    "steel_bolt",
    "fillet_weld",
    "stud",
    "wood_screw",
    "300 plf",
    "-300 plf",
    "pin",
    "fixed",
    "roller",
    # hostile magnitudes and text (issue 13): subnormal, non-finite, long whitespace runs
    "5e-324 in",
    "1e-310 kip",
    "-nan in",
    "infinity psi",
    " " * 3000 + "x",
    "a" + " \t" * 1500 + "=",
]

scalar = st.one_of(
    st.sampled_from(VALUES),
    st.sampled_from([5e-324, -2.5e-310, float("inf"), float("-inf"), float("nan")]),
    st.integers(-(10**6), 10**6),
    st.floats(allow_nan=False, allow_infinity=False),
    st.booleans(),
    st.text(max_size=12),
)
value = st.recursive(scalar, lambda inner: st.lists(inner, max_size=4), max_leaves=8)
key = st.one_of(st.sampled_from(KEYS), st.text(alphabet=string.ascii_letters + "_", min_size=1, max_size=8))


def toml_value(v) -> str:
    if isinstance(v, bool):
        return "true" if v else "false"
    if isinstance(v, int):
        return str(v)
    if isinstance(v, float) and v != v:
        return "nan"
    if isinstance(v, float) and v in (float("inf"), float("-inf")):
        return "inf" if v > 0 else "-inf"
    if isinstance(v, float):
        return repr(v) if "e" in repr(v) or "." in repr(v) else repr(v) + ".0"
    if isinstance(v, list):
        return "[" + ", ".join(toml_value(x) for x in v) + "]"
    return '"' + "".join(c if c.isprintable() and c not in '"\\' else f"\\u{ord(c):04x}" for c in v) + '"'


def toml_table(header: str, d: dict) -> str:
    return header + "\n" + "".join(f'"{k}" = {toml_value(v)}\n' for k, v in d.items())


table = st.dictionaries(key, value, max_size=7)
document = st.tuples(
    table,
    table,
    st.lists(table, max_size=3),
    st.lists(table, max_size=3),
    st.lists(table, max_size=5),
    st.lists(table, max_size=3),
    table,
    st.lists(table, max_size=3),
    st.lists(table, max_size=2),
)


def strict_json(text: str):
    """json.loads refusing NaN and Infinity, which strict JSON (RFC 8259 §6) does not have."""

    def refuse(name):
        raise AssertionError(f"non-standard JSON constant {name}")

    return json.loads(text, parse_constant=refuse)


def _check_case(tmp_path, text: str) -> None:
    p = tmp_path / "fuzz.toml"
    p.write_text(text, encoding="utf-8")
    code, out, err = run_cli("check", "--json", str(p))
    assert code in (0, 1, 2), (code, err)
    assert "Traceback" not in err and "internal error" not in err, err
    if code in (0, 1):
        strict_json(out)
    if code == 2:
        lines = err.strip().splitlines()
        assert len(lines) == 1 and lines[0].startswith(str(p)), err
        assert out == ""


@settings(
    max_examples=900,
    deadline=None,
    suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow],
)
@given(doc=document)
def test_random_structure(tmp_path, doc):
    job, sett, mats, members, parts, joints, conn, loads, supports = doc
    job = {"project": "P", **job}
    text = toml_table("[job]", job) + toml_table("[settings]", sett)
    text += "".join(toml_table("[[material]]", m) for m in (mats or [{"id": "wood", "E": "1600 ksi"}]))
    for m in members or [{"id": "M", "shear": "1 kip"}]:
        text += toml_table("[[member]]", m)
        text += "".join(toml_table("[[member.part]]", p) for p in parts)
        for j in joints:
            text += toml_table("[[member.joint]]", j) + toml_table("[member.joint.connector]", conn)
        text += "".join(toml_table("[[member.load]]", ld) for ld in loads)
        text += "".join(toml_table("[[member.support]]", sp) for sp in supports)
    _check_case(tmp_path, text)


MUTATIONS = ("delete", "duplicate", "swap", "char", "number", "unit")


def mutate(text: str, rng: random.Random, n: int) -> str:
    lines = text.splitlines()
    for _ in range(n):
        if not lines:
            break
        i = rng.randrange(len(lines))
        kind = rng.choice(MUTATIONS)
        if kind == "delete":
            del lines[i]
        elif kind == "duplicate":
            lines.insert(i, lines[i])
        elif kind == "swap":
            j = rng.randrange(len(lines))
            lines[i], lines[j] = lines[j], lines[i]
        elif kind == "char" and lines[i]:
            k = rng.randrange(len(lines[i]))
            lines[i] = lines[i][:k] + rng.choice('="[]#x0.- \\é\x00') + lines[i][k + 1 :]
        elif kind == "number":
            lines[i] = "".join(
                rng.choice(["0", "-1", "1e9", "0.0001", "99999"]) if c.isdigit() and rng.random() < 0.3 else c
                for c in lines[i]
            )
        elif kind == "unit":
            for a, b in (("in", "kip"), ("ksi", "in"), ("kip", "ft"), ("mm", "MPa"), ("psi", "plf")):
                if a in lines[i]:
                    lines[i] = lines[i].replace(a, b, 1)
                    break
    return "\n".join(lines) + "\n"


@settings(
    max_examples=1060,
    deadline=None,
    suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow],
)
@given(rng_key=st.integers(0, 2**32 - 1), which=st.integers(0, 100), n=st.integers(1, 6))
def test_mutated_demo_jobs(tmp_path, rng_key, which, n):
    text = DEMOS[which % len(DEMOS)]
    _check_case(tmp_path, mutate(text, random.Random(rng_key), n))


@settings(
    max_examples=60,
    deadline=None,
    suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow],
)
@given(rng_key=st.integers(0, 2**32 - 1), which=st.integers(0, 100), n=st.integers(1, 4))
def test_mutated_demo_jobs_build(tmp_path_factory, rng_key, which, n):
    base = tmp_path_factory.mktemp("build")
    job = base / "fuzz.toml"
    job.write_text(mutate(DEMOS[which % len(DEMOS)], random.Random(rng_key), n), encoding="utf-8")
    out = base / "out"
    code, stdout, err = run_cli("build", str(job), "-o", str(out) + "/")
    assert code in (0, 1, 2), (code, err)
    assert "Traceback" not in err and "internal error" not in err, err
    written = sorted(p.name for p in out.iterdir()) if out.exists() else []
    if code == 2:
        lines = err.strip().splitlines()
        assert len(lines) == 1 and lines[0].startswith(str(job)), err
        assert stdout == "" and written == []
    else:
        assert written == ["fuzz.pdf"], (written, err)
        # a mutation may leave a key without effect: one warning line each, naming the file
        for line in err.strip().splitlines():
            assert line.startswith(str(job) + ":") and ": warning: " in line, err
        assert (out / "fuzz.pdf").read_bytes().startswith(b"%PDF-")


def test_entry_point_is_main():
    assert callable(main)
