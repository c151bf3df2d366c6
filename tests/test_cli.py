"""Command line: check on every demo job, the JSON fields, the starter writer, exit codes."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
DEMOS = sorted(str(p) for p in (ROOT / "jobs").glob("*.toml"))


def test_there_are_at_least_three_demo_jobs():
    assert len(DEMOS) >= 3


@pytest.mark.parametrize("path", DEMOS, ids=[Path(p).stem for p in DEMOS])
def test_check_every_demo_job(path, cli):
    code, out, err = cli("check", path)
    assert code in (0, 1), err
    assert "joint" in out and ("OK" in out or "NG" in out)


@pytest.mark.parametrize("path", DEMOS, ids=[Path(p).stem for p in DEMOS])
def test_json_fields(path, cli):
    code, out, err = cli("check", "--json", path)
    assert code in (0, 1), err
    data = json.loads(out)
    assert data["members"], "no members"
    for m in data["members"]:
        assert m["id"]
        for key in ("area", "centroid", "I"):
            q = m["section"][key]
            assert set(q) == {"value", "unit"} and isinstance(q["value"], (int, float))
        for j in m["joints"]:
            for key in (
                "id",
                "Q",
                "shear_flow",
                "capacity",
                "spacing_required",
                "spacing_provided",
                "status",
            ):
                assert key in j
            assert j["status"] in ("OK", "NG")
            # Q is null on the fastener lines of a member of plies (they carry no V·Q/I)
            assert j["Q"] is None or set(j["Q"]) == {"value", "unit"}
            assert j["steps"] and all(
                {"label", "symbol", "substituted", "result", "source"} <= set(s) for s in j["steps"]
            )


def test_json_is_stable(cli):
    a = cli("check", "--json", DEMOS[0])[1]
    b = cli("check", "--json", DEMOS[0])[1]
    assert a == b
    assert list(json.loads(a)) == sorted(json.loads(a))


def test_several_jobs_and_ng_exit_1(cli, write_job):
    from tests.conftest import job_text
    from tests.test_bad_input import GOOD

    ng = write_job(
        job_text(GOOD.replace('shear = "1 kip"', 'shear = "90 kip"')).replace(
            'method = "ASD"', 'method = "ASD"\nspacing_min = "1 in"'
        ),
        "ng.toml",
    )
    code, out, err = cli("check", DEMOS[0], ng)
    assert code == 1, err
    assert "NG" in out and "below the minimum spacing" in out


@pytest.mark.parametrize("kind", ["box", "girder", "tee", "plies", "side-loaded", "flitch"])
def test_new_writes_a_starter_that_checks(kind, cli, tmp_path):
    dest = tmp_path / f"{kind}.toml"
    code, out, err = cli("new", str(dest), "--kind", kind)
    assert code == 0 and dest.exists(), err
    code, out, err = cli("check", str(dest))
    assert code == 0, (out, err)
    # a second write without --force refuses and leaves the file alone
    before = dest.read_bytes()
    code, _, err = cli("new", str(dest), "--kind", kind)
    assert code == 2 and "already exists" in err and dest.read_bytes() == before


def test_help_on_every_command(cli):
    for args in (["--help"], ["check", "--help"], ["new", "--help"]):
        code, out, _ = cli(*args)
        assert code == 0 and "usage" in out.lower()


def test_python_dash_m_entry_point():
    import subprocess
    import sys

    r = subprocess.run(
        [sys.executable, "-m", "calcreport", "check", DEMOS[0]], cwd=ROOT, capture_output=True, text=True
    )
    assert r.returncode in (0, 1), r.stderr
    assert "Traceback" not in r.stderr
